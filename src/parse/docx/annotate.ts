import { strToU8, zipSync, type Zippable } from 'fflate';
import { unitAt } from '../blocks.js';
import type { OriginalUnit, Span } from '../types.js';
import { readDocxDocument } from './index.js';
import { readBody, readHeadingStyles, readRelationships, traceKey, type Anchor } from './read.js';
import { DOCX_LIMITS, unzipParts, type DocxLimits } from './zip.js';

/** A comment to add: the span of the document's extracted text it is about, and its paragraphs of text. */
export interface DocxComment {
  span: Span;
  paragraphs: string[];
}

export type Annotated = { ok: true; bytes: Uint8Array; added: number; notPlaced: number } | { ok: false; message: string };

const COMMENTS_TYPE = 'http://schemas.openxmlformats.org/officeDocument/2006/relationships/comments';
const COMMENTS_CONTENT_TYPE = 'application/vnd.openxmlformats-officedocument.wordprocessingml.comments+xml';
const W_NS = 'http://schemas.openxmlformats.org/wordprocessingml/2006/main';
const ID_ATTRIBUTE = /w:id="(-?[0-9]{1,10})"/g;
const AUTHOR = 'plumbline';
const NAME_END = /[\s/>]/;
/** Characters XML 1.0 does not allow (a report's text is ours, but it quotes the manuscript). */
const NOT_XML = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;
const XML_SPECIAL = /[&<>"]/g;
const XML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' };

/**
 * A copy of a Word file with each comment as a Word comment (ECMA-376 Part 1, §17.13.4) on
 * exactly the characters its span covers: `w:commentRangeStart` before the first and
 * `w:commentRangeEnd` plus a `w:commentReference` run after the last, runs split where a span
 * starts or ends inside one (the split runs keep their properties). The comments go into
 * word/comments.xml (made, with its content type and relationship, when the file has none; added
 * to it after its own comments otherwise). A span in a footnote or endnote is commented on the
 * note's reference mark in the body, the comment saying which note and paragraph (LibreOffice
 * refuses a file with a comment reference inside a note). Every other part is copied as it is.
 * Comments whose characters cannot be traced to the XML are not placed (`notPlaced`).
 */
export function annotateDocx(bytes: Uint8Array, comments: readonly DocxComment[], limits: DocxLimits = DOCX_LIMITS): Annotated {
  const read = readDocxDocument('', bytes, limits);
  if (!read.ok) return read;
  const map = read.document.original;
  const all = unzipParts(bytes, () => true, limits);
  if (!all.ok) return all;
  const parts = all.parts;
  const rootRels = readRelationships(text(parts.get('_rels/.rels')), limits);
  const mainName = resolve('', rootRels.find((r) => r.type.endsWith('/officeDocument'))?.target ?? 'word/document.xml');
  const folder = mainName.slice(0, mainName.lastIndexOf('/') + 1);
  const relsName = `${folder}_rels/${mainName.slice(folder.length)}.rels`;
  const mainXml = text(parts.get(mainName));
  const rels = readRelationships(text(parts.get(relsName)), limits);
  const stylesRel = rels.find((r) => r.type.endsWith('/styles'));
  const styles = stylesRel ? readHeadingStyles(text(parts.get(resolve(folder, stylesRel.target))), limits) : new Set<string>();
  const trace = new Map<string, Array<Anchor | undefined>>();
  const body = readBody(mainXml, styles, limits, trace);
  // A finding in a footnote or endnote is commented on the note's reference mark in the body:
  // LibreOffice refuses to open a file with a comment reference inside a note. A note's number
  // (as Word shows it) is its place among the body's references.
  const noteIds = { footnote: [...new Set(body.noteRefs.footnote)], endnote: [...new Set(body.noteRefs.endnote)] };

  // comment ids past every id already used (comments, and any other w:id, which is harmless)
  const commentsRel = rels.find((r) => r.type === COMMENTS_TYPE && !r.external);
  const commentsName = commentsRel ? resolve(folder, commentsRel.target) : `${folder}comments.xml`;
  const existing = commentsRel ? text(parts.get(commentsName)) : '';
  let nextId = Math.max(maxId(existing), maxId(mainXml)) + 1;

  const splices: Splice[] = [];
  const added: string[] = [];
  let notPlaced = 0;
  const comment = (id: number, paragraphs: string[]) =>
    added.push(`<w:comment w:id="${id}" w:author="${AUTHOR}" w:initials="PL">${paragraphs.map((p) => `<w:p><w:r><w:t xml:space="preserve">${escapeXml(p)}</w:t></w:r></w:p>`).join('')}</w:comment>`);
  for (const c of comments) {
    const u = map ? unitAt(map, c.span.start) : undefined;
    if (u?.note) {
      const noteId = noteIds[u.note.kind][u.note.number - 1];
      const run = noteId === undefined ? undefined : body.noteRefRuns.get(`${u.note.kind}:${noteId}`);
      if (!run) {
        notPlaced += 1;
        continue;
      }
      const id = nextId++;
      splices.push({ at: run.start, order: 1, text: `<w:commentRangeStart w:id="${id}"/>` });
      splices.push({ at: run.end, order: 0, text: `<w:commentRangeEnd w:id="${id}"/><w:r><w:commentReference w:id="${id}"/></w:r>` });
      comment(id, [`In ${u.note.kind} ${u.note.number}, paragraph ${u.paragraph}:`, ...c.paragraphs]);
      continue;
    }
    const first = map ? anchorOf(map.units, trace, c.span.start) : undefined;
    const last = map ? anchorOf(map.units, trace, Math.max(c.span.start, c.span.end - 1)) : undefined;
    if (!first || !last) {
      notPlaced += 1;
      continue;
    }
    const id = nextId++;
    splices.push(split(first, 'before', `<w:commentRangeStart w:id="${id}"/>`, 1));
    splices.push(split(last, 'after', `<w:commentRangeEnd w:id="${id}"/><w:r><w:commentReference w:id="${id}"/></w:r>`, 0));
    for (const a of [first, last]) if (a.inText && a.open && !xmlSpaceSet(mainXml, a.open)) splices.push({ at: a.open.end - 1, order: -1, text: ' xml:space="preserve"', key: `space${a.open.start}` });
    comment(id, c.paragraphs);
  }

  const out: Zippable = {};
  for (const [name, data] of parts) out[name] = data;
  out[mainName] = strToU8(applySplices(mainXml, splices));
  if (added.length > 0) {
    if (commentsRel && existing !== '') {
      out[commentsName] = strToU8(appendToRoot(existing, added.join('')));
    } else {
      out[commentsName] = strToU8(`<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<w:comments xmlns:w="${W_NS}">${added.join('')}</w:comments>`);
      const relsXml = parts.has(relsName) ? text(parts.get(relsName)) : '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"></Relationships>';
      out[relsName] = strToU8(appendToRoot(relsXml, `<Relationship Id="rIdPlumblineComments" Type="${COMMENTS_TYPE}" Target="${commentsName.slice(folder.length)}"/>`));
      const types = text(parts.get('[Content_Types].xml'));
      if (!types.includes(`PartName="/${commentsName}"`)) {
        out['[Content_Types].xml'] = strToU8(appendToRoot(types, `<Override PartName="/${commentsName}" ContentType="${COMMENTS_CONTENT_TYPE}"/>`));
      }
    }
  }
  return { ok: true, bytes: zipSync(out, { level: 6 }), added: added.length, notPlaced };
}

interface Splice {
  at: number;
  /** Among splices at the same offset: lower first. */
  order: number;
  text: string;
  /** Splices with the same key are made once. */
  key?: string;
}

/** Where a character of the body's extracted text sits in its XML, if it can be traced there. */
function anchorOf(units: readonly OriginalUnit[], trace: Map<string, Array<Anchor | undefined>>, offset: number): Anchor | undefined {
  const u = unitAt({ kind: 'docx', units: units as OriginalUnit[] }, offset);
  if (!u || u.note || u.paragraph === undefined || offset < u.start || offset >= u.end) return undefined;
  return trace.get(traceKey(undefined, undefined, u.paragraph))?.[offset - u.start + (u.charOffset ?? 0)];
}

/**
 * Markup put before or after a character: its run is closed there and opened again with the
 * same properties (inside a `w:t`, the `w:t` too), and the markup goes between.
 */
function split(a: Anchor, side: 'before' | 'after', markup: string, order: number): Splice {
  const at = side === 'before' ? a.before : a.after;
  const reopen = `<w:r>${a.runProperties}${a.inText ? '<w:t xml:space="preserve">' : ''}`;
  return { at, order, text: `${a.inText ? '</w:t>' : ''}</w:r>${markup}${reopen}` };
}

function applySplices(xml: string, splices: Splice[]): string {
  const seen = new Set<string>();
  const list = splices.filter((s) => (s.key === undefined ? true : !seen.has(s.key) && seen.add(s.key) !== undefined));
  list.sort((a, b) => a.at - b.at || a.order - b.order);
  const out: string[] = [];
  let last = 0;
  for (const s of list) {
    out.push(xml.slice(last, s.at), s.text);
    last = s.at;
  }
  out.push(xml.slice(last));
  return out.join('');
}

/** `inner` as the last children of the root element, which may be written empty (`<w:comments … />`, as pandoc writes it). */
function appendToRoot(xml: string, inner: string): string {
  const close = xml.lastIndexOf('</');
  if (close >= 0 && xml.indexOf('>', close) >= 0) return xml.slice(0, close) + inner + xml.slice(close);
  const end = xml.lastIndexOf('/>');
  let start = xml.indexOf('<');
  while (start >= 0 && (xml[start + 1] === '?' || xml[start + 1] === '!')) start = xml.indexOf('<', start + 1);
  let k = start + 1;
  while (k < xml.length && !NAME_END.test(xml[k] as string)) k += 1;
  return `${xml.slice(0, end)}>${inner}</${xml.slice(start + 1, k)}>${xml.slice(end + 2)}`;
}

function xmlSpaceSet(xml: string, open: { start: number; end: number }): boolean {
  return xml.slice(open.start, open.end).includes('xml:space');
}

function maxId(xml: string): number {
  let max = 0;
  ID_ATTRIBUTE.lastIndex = 0;
  for (let m = ID_ATTRIBUTE.exec(xml); m; m = ID_ATTRIBUTE.exec(xml)) max = Math.max(max, Number(m[1]));
  return max;
}

function text(bytes: Uint8Array | undefined): string {
  return bytes ? new TextDecoder('utf-8').decode(bytes) : '';
}

function resolve(folder: string, target: string): string {
  const parts = (target.startsWith('/') ? target.slice(1) : folder + target).split('/');
  const out: string[] = [];
  for (const p of parts) {
    if (p === '..') out.pop();
    else if (p !== '.' && p !== '') out.push(p);
  }
  return out.join('/');
}

function escapeXml(s: string): string {
  return s.replace(NOT_XML, '').replace(XML_SPECIAL, (c) => XML_ESCAPES[c] ?? c);
}
