import { documentFromBlocks, type Block, type BlockNote } from '../blocks.js';
import { isCompoundFile, ZIP_MAGIC, type BinaryOutcome } from '../binary.js';
import { DocxRefusal, readBody, readHeadingStyles, readNotes, readRelationships } from './read.js';
import { DOCX_LIMITS, unzipParts, type DocxLimits } from './zip.js';

export { DOCX_LIMITS, type DocxLimits } from './zip.js';

/** `EncryptionInfo` in UTF-16LE: the stream an encrypted Office file's compound file holds (MS-OFFCRYPTO 2.3.4). */
const ENCRYPTION_INFO = new Uint8Array([...'EncryptionInfo'].flatMap((c) => [c.charCodeAt(0), 0]));
const REL_TYPE_END = /\/(officeDocument|styles|footnotes|endnotes)$/;

/**
 * A Word (.docx) file into a document: the body, its tables (cells with their TablePlace), then
 * the footnotes and the endnotes in the order Word numbers them; each paragraph a unit of the
 * original map (src/parse/docx/read.ts says which paragraphs are counted). Tracked changes are
 * read as accepted and said in a read note. Refused with one message each: an OLE compound file
 * (an encrypted, password-protected .docx, or a Word 97–2003 .doc), a file that is not a zip
 * archive, a damaged archive, a zip bomb or a part past the limits, an archive with no Word
 * document in it, damaged or over-deep XML.
 */
export function readDocxDocument(path: string, bytes: Uint8Array, limits: DocxLimits = DOCX_LIMITS): BinaryOutcome {
  if (isCompoundFile(bytes)) {
    return indexOf(bytes, ENCRYPTION_INFO) >= 0
      ? { ok: false, message: 'encrypted: this Word file is protected by a password to open; save a copy without the password (File › Info › Protect Document) and check that' }
      : { ok: false, message: 'not a .docx: this is an older Word (.doc) or other Office compound file; save it as .docx (Word Document) and check that' };
  }
  if (!ZIP_MAGIC.every((b, i) => bytes[i] === b)) return { ok: false, message: 'not a .docx: the file does not start as a Word document (a zip archive) does' };
  try {
    return read(path, bytes, limits);
  } catch (e) {
    if (e instanceof DocxRefusal) return { ok: false, message: e.message };
    throw e;
  }
}

function read(path: string, bytes: Uint8Array, limits: DocxLimits): BinaryOutcome {
  const top = unzipParts(bytes, (name) => name === '_rels/.rels', limits);
  if (!top.ok) return top;
  const topRels = top.parts.get('_rels/.rels');
  const mainName = relationships(topRels ? text(topRels) : '', '', limits).get('officeDocument') ?? 'word/document.xml';
  const folder = mainName.includes('/') ? mainName.slice(0, mainName.lastIndexOf('/') + 1) : '';
  const relsName = `${folder}_rels/${mainName.slice(folder.length)}.rels`;
  const first = unzipParts(bytes, (name) => name === mainName || name === relsName, limits);
  if (!first.ok) return first;
  const main = first.parts.get(mainName);
  if (!main) return { ok: false, message: `not a .docx: the archive holds no Word document part (${mainName})` };
  const rels = relationships(first.parts.has(relsName) ? text(first.parts.get(relsName) as Uint8Array) : '', folder, limits);
  const stylesName = rels.get('styles');
  const footnotesName = rels.get('footnotes');
  const endnotesName = rels.get('endnotes');
  const wanted = new Set([stylesName, footnotesName, endnotesName].filter((n): n is string => n !== undefined));
  const rest = wanted.size > 0 ? unzipParts(bytes, (name) => wanted.has(name), limits) : { ok: true as const, parts: new Map<string, Uint8Array>() };
  if (!rest.ok) return rest;

  const mainXml = text(main);
  if (!isWordDocument(mainXml)) return { ok: false, message: `not a .docx: the archive's main part (${mainName}) is not a Word document` };
  const styles = stylesName && rest.parts.has(stylesName) ? readHeadingStyles(text(rest.parts.get(stylesName) as Uint8Array), limits) : new Set<string>();
  const body = readBody(mainXml, styles, limits);
  const blocks: Block[] = [...body.blocks];
  let tracked = body.tracked;
  for (const [kind, name] of [['footnote', footnotesName], ['endnote', endnotesName]] as const) {
    const part = name ? rest.parts.get(name) : undefined;
    if (!part) continue;
    const read = readNotes(text(part), kind, styles, limits);
    tracked ||= read.tracked;
    const notes = read.notes;
    // Word numbers notes in the order the body refers to them; a note never referred to is not shown
    const order = [...new Set(body.noteRefs[kind])];
    order.forEach((id, i) => {
      for (const b of notes.get(id) ?? []) {
        blocks.push({ ...b, pieces: b.pieces.map((p) => ({ ...p, unit: { ...p.unit, note: { kind, number: i + 1 } } })) });
      }
    });
  }
  const notes: BlockNote[] = tracked
    ? [{ kind: 'tracked-changes', message: 'read as if every change were accepted (insertions in, deletions and moved-away text out)' }]
    : [];
  return { ok: true, document: documentFromBlocks(path, 'docx', blocks, { notes, ...(tracked ? { trackedChanges: true } : {}) }) };
}

/** A part's text: UTF-8 unless it starts with a UTF-16 byte-order mark (XML 1.0, 4.3.3). */
function text(bytes: Uint8Array): string {
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return new TextDecoder('utf-16le').decode(bytes.subarray(2));
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return new TextDecoder('utf-16be').decode(bytes.subarray(2));
  return new TextDecoder('utf-8').decode(bytes);
}

/** Whether the root element is WordprocessingML's `document` (Transitional or Strict). */
function isWordDocument(xml: string): boolean {
  const head = xml.slice(0, 4096);
  return /<(?:[A-Za-z_][\w.-]{0,40}:)?document[\s>]/.test(head) && /(?:schemas\.openxmlformats\.org\/wordprocessingml\/2006\/main|purl\.oclc\.org\/ooxml\/wordprocessingml\/main)/.test(head);
}

/**
 * A relationships part's internal targets by the last word of their type (`officeDocument`,
 * `styles`, `footnotes`, `endnotes`), resolved against `folder` as OPC resolves them (a leading
 * `/` from the package root).
 */
function relationships(xml: string, folder: string, limits: DocxLimits): Map<string, string> {
  const out = new Map<string, string>();
  for (const r of readRelationships(xml, limits)) {
    const type = REL_TYPE_END.exec(r.type);
    if (!type || r.external || out.has(type[1] as string)) continue;
    out.set(type[1] as string, resolvePart(folder, r.target));
  }
  return out;
}

function resolvePart(folder: string, target: string): string {
  const parts = (target.startsWith('/') ? target.slice(1) : folder + target).split('/');
  const out: string[] = [];
  for (const p of parts) {
    if (p === '..') out.pop();
    else if (p !== '.' && p !== '') out.push(p);
  }
  return out.join('/');
}

function indexOf(hay: Uint8Array, needle: Uint8Array): number {
  outer: for (let i = 0; i + needle.length <= hay.length; i += 1) {
    for (let j = 0; j < needle.length; j += 1) if (hay[i + j] !== needle[j]) continue outer;
    return i;
  }
  return -1;
}
