import { SaxesParser, type SaxesTagNS } from 'saxes';
import { openingWords, type Block, type BlockNote, type BlockPiece } from '../blocks.js';
import type { TablePlace } from '../types.js';
import type { DocxLimits } from './zip.js';

/** WordprocessingML's namespaces: Transitional (ECMA-376) and Strict (ISO/IEC 29500). */
const W = new Set(['http://schemas.openxmlformats.org/wordprocessingml/2006/main', 'http://purl.oclc.org/ooxml/wordprocessingml/main']);
/** Markup compatibility (ECMA-376 Part 3): `mc:Fallback` repeats `mc:Choice` for older readers. */
const MC = 'http://schemas.openxmlformats.org/markup-compatibility/2006';

/**
 * The Symbol font's codes as Unicode, for `w:sym` (Word writes them as F0xx, the font's code
 * plus F000). From the Adobe Symbol encoding as remembered (from memory): the letters and signs
 * a statistic uses. Any other code is read as U+FFFD.
 */
const SYMBOL_FONT: Record<number, string> = {
  0x20: ' ', 0x28: '(', 0x29: ')', 0x2b: '+', 0x2c: ',', 0x2d: '\u2212', 0x2e: '.', 0x2f: '/', 0x3c: '<', 0x3d: '=', 0x3e: '>',
  0x43: 'Χ', 0x44: 'Δ', 0x46: 'Φ', 0x47: 'Γ', 0x4c: 'Λ', 0x50: 'Π', 0x53: 'Σ', 0x57: 'Ω',
  0x61: 'α', 0x62: 'β', 0x63: 'χ', 0x64: 'δ', 0x65: 'ε', 0x66: 'φ', 0x67: 'γ', 0x68: 'η', 0x69: 'ι', 0x6a: 'ϕ', 0x6b: 'κ',
  0x6c: 'λ', 0x6d: 'μ', 0x6e: 'ν', 0x70: 'π', 0x71: 'θ', 0x72: 'ρ', 0x73: 'σ', 0x74: 'τ', 0x75: 'υ', 0x77: 'ω', 0x78: 'ξ',
  0x79: 'ψ', 0x7a: 'ζ', 0xa3: '≤', 0xa5: '∞', 0xb1: '±', 0xb3: '≥', 0xb4: '×', 0xb7: '•', 0xb9: '≠', 0xbb: '≈', 0xd6: '√',
};
/** Superscript forms of what an exponent is written with (`10` and a raised `−6`). */
const SUPERSCRIPTS: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
  '-': '⁻', '\u2212': '⁻', '\u2011': '⁻', '\u2013': '⁻', '+': '⁺',
};
const EXPONENT_TEXT = /^[0-9+\-\u2212\u2011\u2013]{1,6}$/;
const HEADING_STYLE = /^(?:heading [1-9]|title|subtitle)$/i;
const CHARACTER_REFERENCE = /^&#(x?)([0-9A-Fa-f]{1,8});$/;

/** A part could not be read: its message says why (damaged XML, too deep). */
export class DocxRefusal extends Error {}

/** What one story (the body, or the notes) gives: its blocks in reading order. */
interface Story {
  blocks: Block[];
  /** For notes: the id of the note each block belongs to. */
  noteOf: Array<string | undefined>;
  /** Footnote and endnote ids in the order the body refers to them (Word numbers notes so). */
  noteRefs: { footnote: string[]; endnote: string[] };
  /** Traced: where the run holding each note's first reference mark starts and ends in the XML, by `kind:id`. */
  noteRefRuns: Map<string, { start: number; end: number }>;
  tracked: boolean;
}

/** Heading styles: style ids whose name is `heading N`, `Title` or `Subtitle`, or that set an outline level. */
export function readHeadingStyles(xml: string, limits: DocxLimits): Set<string> {
  const ids = new Set<string>();
  let current: string | undefined;
  walk(xml, limits, {
    open(tag) {
      if (!W.has(tag.uri)) return;
      if (tag.local === 'style') current = attr(tag, 'styleId');
      else if (current !== undefined && ((tag.local === 'name' && HEADING_STYLE.test(attr(tag, 'val') ?? '')) || tag.local === 'outlineLvl')) ids.add(current);
    },
    close(tag) {
      if (W.has(tag.uri) && tag.local === 'style') current = undefined;
    },
  });
  return ids;
}

/**
 * The main story (document.xml's body) into blocks. Paragraphs are numbered as plumbline counts
 * them (README, "Word and PDF files"): every `w:p` of the body in document order, 1-based,
 * empty ones and those in table cells, content controls and text boxes included, the copies in
 * `mc:Fallback` not. Tracked changes are read as accepted: `w:ins` and `w:moveTo` in, `w:del`
 * and `w:moveFrom` out, and a paragraph whose mark was deleted runs on into the next.
 */
export function readBody(xml: string, headingStyles: Set<string>, limits: DocxLimits, trace?: Map<string, Array<Anchor | undefined>>): Story {
  return readStory(xml, headingStyles, limits, undefined, trace);
}

/**
 * Where a character of a paragraph's text sits in the XML (for --annotate): inside a `w:t`
 * (`before`/`after` are offsets in the part's text around the character, `open` the offsets of
 * the `w:t` start tag), or an element of its own (a tab, a symbol). `runProperties` is the
 * run's `w:rPr` as written, so a run split in two keeps its look.
 */
export interface Anchor {
  inText: boolean;
  before: number;
  after: number;
  open?: { start: number; end: number };
  runProperties: string;
}

/**
 * The notes of footnotes.xml or endnotes.xml, by id, each numbered from its own first paragraph;
 * separators and continuation notices (a `w:type` other than `normal`) are not read.
 */
export function readNotes(xml: string, kind: 'footnote' | 'endnote', headingStyles: Set<string>, limits: DocxLimits, trace?: Map<string, Array<Anchor | undefined>>): { notes: Map<string, Block[]>; tracked: boolean } {
  const story = readStory(xml, headingStyles, limits, kind, trace);
  const out = new Map<string, Block[]>();
  story.blocks.forEach((b, i) => {
    const id = story.noteOf[i];
    if (id === undefined) return;
    const list = out.get(id) ?? [];
    list.push(b);
    out.set(id, list);
  });
  return { notes: out, tracked: story.tracked };
}

/** The Relationship elements of an OPC relationships part (ECMA-376 Part 2, 9.3): type, target, whether external. */
export function readRelationships(xml: string, limits: DocxLimits): Array<{ type: string; target: string; external: boolean }> {
  const out: Array<{ type: string; target: string; external: boolean }> = [];
  if (xml === '') return out;
  walk(xml, limits, {
    open(tag) {
      if (tag.local !== 'Relationship') return;
      const target = attr(tag, 'Target');
      if (target !== undefined) out.push({ type: attr(tag, 'Type') ?? '', target, external: attr(tag, 'TargetMode') === 'External' });
    },
  });
  return out;
}

interface Handlers {
  open?: (tag: SaxesTagNS) => void;
  close?: (tag: SaxesTagNS) => void;
  text?: (text: string) => void;
  /** Set: positions are tracked, and this is given the getter of the offset just past the current event. */
  position?: (get: () => number) => void;
}

/** Parse `xml` with saxes (namespaces on, no DTD), refusing what is damaged or nests past the limit. */
function walk(xml: string, limits: DocxLimits, h: Handlers): void {
  const parser = new SaxesParser({ xmlns: true, position: h.position !== undefined });
  h.position?.(() => parser.position);
  let depth = 0;
  let failure: string | undefined;
  parser.on('error', (e) => {
    failure ??= e.message;
  });
  parser.on('doctype', () => {
    failure ??= 'a DOCTYPE, which Word never writes';
  });
  parser.on('opentag', (tag) => {
    depth += 1;
    if (depth > limits.maxDepth) failure ??= `elements nest more than ${limits.maxDepth} deep`;
    h.open?.(tag);
    if (tag.isSelfClosing) {
      depth -= 1;
      h.close?.(tag);
    }
  });
  parser.on('closetag', (tag) => {
    if (tag.isSelfClosing) return;
    depth -= 1;
    h.close?.(tag);
  });
  if (h.text) parser.on('text', h.text);
  // saxes goes on after an error; stop at the first, it is the one to report
  const CHUNK = 1 << 16;
  for (let at = 0; at < xml.length && failure === undefined; at += CHUNK) parser.write(xml.slice(at, at + CHUNK));
  if (failure === undefined) parser.close();
  if (failure !== undefined) throw new DocxRefusal(`damaged XML: ${failure}`);
}

/** The key of a paragraph's trace: its number in the body, or its note's kind and id and its number in the note. */
export function traceKey(note: 'footnote' | 'endnote' | undefined, noteId: string | undefined, paragraph: number): string {
  return note ? `${note}:${noteId ?? ''}:${paragraph}` : String(paragraph);
}

/** Code units a character reference decodes to (`&#x1F600;` is two). */
function entityLength(ref: string): number {
  const m = CHARACTER_REFERENCE.exec(ref);
  if (!m) return 1;
  const code = Number.parseInt(m[2] as string, m[1] ? 16 : 10);
  return code > 0xffff ? 2 : 1;
}

function attr(tag: SaxesTagNS, local: string): string | undefined {
  for (const k in tag.attributes) {
    const a = tag.attributes[k];
    if (a && a.local === local) return a.value;
  }
  return undefined;
}

/** Whether an on/off property (`w:b`, `w:vanish`) is on: present, and not `false`, `0` or `off`. */
function isOn(tag: SaxesTagNS): boolean {
  const v = attr(tag, 'val');
  return v === undefined || !(v === 'false' || v === '0' || v === 'off');
}

/** One story's reader: a stack machine over the XML events. */
function readStory(xml: string, headingStyles: Set<string>, limits: DocxLimits, note: 'footnote' | 'endnote' | undefined, trace?: Map<string, Array<Anchor | undefined>>): Story {
  const blocks: Block[] = [];
  const noteOf: Array<string | undefined> = [];
  let noteId: string | undefined;
  const push = (b: Block) => {
    blocks.push(b);
    noteOf.push(noteId);
  };
  const noteRefs: Story['noteRefs'] = { footnote: [], endnote: [] };
  let tracked = false;
  let paragraphs = 0;
  // elements whose content is not displayed text: deleted, moved away, field instructions, fallbacks, properties
  let skipDepth = 0;
  const skipping: string[] = [];
  // open paragraphs (a text box's paragraphs sit inside a run of another)
  const stack: Array<{ number: number; text: string; markDeleted: boolean; style?: string; outline: boolean; anchors: Array<Anchor | undefined> }> = [];
  // tracing (--annotate): the offset past the current event, the run's properties, the open w:t
  let pos = () => 0;
  let runProps = '';
  let propsStart = -1;
  let runAnchors: Array<Anchor | undefined> = [];
  let tOpen: { start: number; end: number; chars: number } | undefined;
  let runStart = -1;
  let runRef: string | undefined;
  const noteRefRuns = new Map<string, { start: number; end: number }>();
  // a paragraph whose mark was deleted: its pieces wait for the next paragraph's
  let carried: BlockPiece[] = [];
  // run state
  let inRun = false;
  let runSuper = false;
  let runHidden = false;
  let inRunProps = false;
  let inParaProps = false;
  let runText = '';
  let inT = false;
  // complex fields: per level, whether its instructions (before `separate`) or its result are being read
  const fields: Array<'instructions' | 'result'> = [];
  // tables: a stack, a table in a cell is a table of its own
  let tableCount = 0;
  const tables: Array<{ index: number; row: number; column: number; span: number; merged: boolean; pieces: BlockPiece[] | undefined }> = [];

  const inFieldInstructions = () => fields.some((f) => f === 'instructions');
  const flushRun = () => {
    if (runText === '') return;
    const p = stack[stack.length - 1];
    if (p && trace) p.anchors.push(...(runAnchors.length === runText.length ? runAnchors : new Array<undefined>(runText.length).fill(undefined)));
    runAnchors = [];
    if (p && runSuper && EXPONENT_TEXT.test(runText)) p.text += [...runText].map((c) => SUPERSCRIPTS[c] ?? c).join('');
    else if (p) p.text += runText;
    runText = '';
  };
  const closeParagraph = () => {
    const p = stack.pop();
    if (!p) return;
    if (trace) trace.set(traceKey(note, noteId, p.number), p.anchors.length === p.text.length ? p.anchors : new Array<undefined>(p.text.length).fill(undefined));
    const heading = p.outline || (p.style !== undefined && headingStyles.has(p.style));
    const piece: BlockPiece = { text: p.text, unit: { paragraph: p.number, opening: openingWords(p.text), ...(note ? { note: { kind: note, number: 0 } } : {}) } };
    if (p.markDeleted) {
      carried.push(piece);
      return;
    }
    const pieces = [...carried, piece];
    carried = [];
    const cell = tables[tables.length - 1];
    // a paragraph in a table cell is a piece of the cell's block
    if (cell?.pieces && stack.length === 0) {
      cell.pieces.push(...pieces);
      return;
    }
    push({ kind: heading ? 'heading' : 'paragraph', pieces });
  };

  walk(xml, limits, {
    ...(trace ? { position: (get: () => number) => (pos = get) } : {}),
    open(tag) {
      const w = W.has(tag.uri);
      if (tag.uri === MC && tag.local === 'Fallback') {
        skipDepth += 1;
        skipping.push('Fallback');
        return;
      }
      if (!w) return;
      if (note !== undefined && tag.local === note) {
        // each note numbers its paragraphs from 1; a separator is not read
        noteId = attr(tag, 'id');
        paragraphs = 0;
        const type = attr(tag, 'type');
        if (type !== undefined && type !== 'normal') {
          skipDepth += 1;
          skipping.push(note);
        }
        return;
      }
      switch (tag.local) {
        case 'del':
        case 'moveFrom':
          tracked = true;
          if (inParaProps || inRunProps) {
            // a deleted paragraph mark (w:pPr/w:rPr/w:del): the paragraph runs on into the next
            if (inParaProps && stack.length > 0) (stack[stack.length - 1] as { markDeleted: boolean }).markDeleted = true;
            return;
          }
          skipDepth += 1;
          skipping.push(tag.local);
          return;
        case 'ins':
        case 'moveTo':
          if (!inParaProps && !inRunProps) tracked = true;
          return;
        case 'p':
          paragraphs += 1;
          stack.push({ number: paragraphs, text: '', markDeleted: false, outline: false, anchors: [] });
          return;
        case 'pPr':
          inParaProps = true;
          return;
        case 'pStyle':
          if (inParaProps && !inRunProps && stack.length > 0) (stack[stack.length - 1] as { style?: string }).style = attr(tag, 'val');
          return;
        case 'outlineLvl':
          if (inParaProps && !inRunProps && stack.length > 0) (stack[stack.length - 1] as { outline: boolean }).outline = true;
          return;
        case 'r':
          inRun = true;
          runSuper = false;
          runHidden = false;
          runText = '';
          runProps = '';
          runAnchors = [];
          if (trace) runStart = xml.lastIndexOf('<', pos() - 1);
          runRef = undefined;
          return;
        case 'rPr':
          inRunProps = true;
          if (trace && inRun && !inParaProps) propsStart = xml.lastIndexOf('<', pos() - 1);
          if (tag.isSelfClosing) propsStart = -1;
          return;
        case 'vertAlign':
          if (inRun && inRunProps) runSuper = attr(tag, 'val') === 'superscript';
          return;
        case 'vanish':
          if (inRun && inRunProps) runHidden = isOn(tag);
          return;
        case 't':
          inT = true;
          if (trace) tOpen = { start: xml.lastIndexOf('<', pos() - 1), end: pos(), chars: runText.length };
          return;
        case 'tab':
          if (inRun && !inParaProps) addElementChar('\t');
          return;
        case 'br':
        case 'cr':
          if (inRun) addElementChar(' ');
          return;
        case 'noBreakHyphen':
          if (inRun) addElementChar('-');
          return;
        case 'softHyphen':
          if (inRun) addElementChar('\u00AD');
          return;
        case 'sym': {
          if (!inRun) return;
          const code = Number.parseInt(attr(tag, 'char') ?? '', 16);
          const low = Number.isFinite(code) ? code & 0xff : -1;
          const font = (attr(tag, 'font') ?? '').toLowerCase();
          addElementChar(font === 'symbol' ? (SYMBOL_FONT[low] ?? '\ufffd') : Number.isFinite(code) && code < 0xf000 && code > 0 ? String.fromCodePoint(code) : '\ufffd');
          return;
        }
        case 'fldChar': {
          const type = attr(tag, 'fldCharType');
          if (type === 'begin') {
            flushRunIfAny();
            fields.push('instructions');
          } else if (type === 'separate' && fields.length > 0) fields[fields.length - 1] = 'result';
          else if (type === 'end') {
            flushRunIfAny();
            fields.pop();
          }
          return;
        }
        case 'footnoteReference':
        case 'endnoteReference': {
          const id = attr(tag, 'id');
          if (id !== undefined && skipDepth === 0) {
            const kind = tag.local === 'footnoteReference' ? 'footnote' : 'endnote';
            noteRefs[kind].push(id);
            if (trace && inRun && !noteRefRuns.has(`${kind}:${id}`)) runRef = `${kind}:${id}`;
          }
          return;
        }
        case 'tbl':
          tables.push({ index: tableCount, row: -1, column: 0, span: 1, merged: false, pieces: undefined });
          tableCount += 1;
          return;
        case 'tr': {
          const t = tables[tables.length - 1];
          if (t) {
            t.row += 1;
            t.column = 0;
          }
          return;
        }
        case 'tc': {
          const t = tables[tables.length - 1];
          if (t) {
            t.pieces = [];
            t.span = 1;
            t.merged = false;
          }
          return;
        }
        case 'gridSpan': {
          const t = tables[tables.length - 1];
          if (t) t.span = Math.max(1, Number.parseInt(attr(tag, 'val') ?? '1', 10) || 1);
          return;
        }
        case 'vMerge': {
          const t = tables[tables.length - 1];
          // a continued vertical merge shows nothing of its own
          if (t) t.merged = attr(tag, 'val') !== 'restart';
          return;
        }
        default:
      }
    },
    text(s) {
      if (inT && inRun) addRunChar(s);
    },
    close(tag) {
      if (tag.uri === MC && tag.local === 'Fallback') {
        skipDepth -= 1;
        skipping.pop();
        return;
      }
      if (!W.has(tag.uri)) return;
      if (note !== undefined && tag.local === note) {
        if (carried.length > 0) push({ kind: 'paragraph', pieces: carried });
        carried = [];
        if (skipping[skipping.length - 1] === note) {
          skipDepth -= 1;
          skipping.pop();
        }
        noteId = undefined;
        return;
      }
      switch (tag.local) {
        case 'del':
        case 'moveFrom':
          if (skipping[skipping.length - 1] === tag.local) {
            skipDepth -= 1;
            skipping.pop();
          }
          return;
        case 'p':
          flushRunIfAny();
          closeParagraph();
          return;
        case 'pPr':
          inParaProps = false;
          return;
        case 'rPr':
          inRunProps = false;
          if (trace && propsStart >= 0) runProps = xml.slice(propsStart, pos());
          propsStart = -1;
          return;
        case 'r':
          flushRunIfAny();
          inRun = false;
          if (runRef !== undefined && runStart >= 0) noteRefRuns.set(runRef, { start: runStart, end: pos() });
          runRef = undefined;
          return;
        case 't':
          inT = false;
          if (trace && tOpen) traceText(tOpen, tag.isSelfClosing ? tOpen.end : xml.lastIndexOf('</', pos() - 1));
          tOpen = undefined;
          return;
        case 'tc': {
          const t = tables[tables.length - 1];
          if (t?.pieces) {
            const place: TablePlace = { table: t.index, row: t.row, column: t.column, ...(t.span > 1 ? { colSpan: t.span } : {}) };
            if (!t.merged) push({ kind: 'tableCell', table: place, pieces: t.pieces });
            t.pieces = undefined;
            t.column += t.span;
          }
          return;
        }
        case 'tbl':
          tables.pop();
          return;
        default:
      }
    },
  });
  if (carried.length > 0) push({ kind: 'paragraph', pieces: carried });
  return { blocks, noteOf, noteRefs, noteRefRuns, tracked };

  function addRunChar(s: string) {
    if (skipDepth > 0 || inFieldInstructions() || runHidden || stack.length === 0) return;
    runText += s;
  }
  /** A character an element stands for (a tab, a symbol), traced to the element. */
  function addElementChar(s: string) {
    const before = runText.length;
    addRunChar(s);
    if (trace && runText.length > before) {
      const end = pos();
      runAnchors.push({ inText: false, before: xml.lastIndexOf('<', end - 1), after: end, runProperties: runProps });
    }
  }
  /** The characters a w:t added, traced to their offsets in its raw text (character references decoded). */
  function traceText(t: { start: number; end: number; chars: number }, rawEnd: number) {
    const added = runText.length - t.chars;
    if (added === 0) return;
    const offsets: Array<[number, number]> = [];
    for (let k = t.end; k < rawEnd; ) {
      let next = k + 1;
      if (xml[k] === '&') {
        const semi = xml.indexOf(';', k);
        if (semi > k && semi - k < 12) next = semi + 1;
      }
      // a character outside the basic plane is two code units of one character reference or pair
      const decoded = xml[k] === '&' ? (entityLength(xml.slice(k, next))) : 1;
      for (let u = 0; u < decoded; u += 1) offsets.push([k, next]);
      k = next;
    }
    const anchors: Array<Anchor | undefined> = offsets.length === added ? offsets.map(([b, a]) => ({ inText: true, before: b, after: a, open: { start: t.start, end: t.end }, runProperties: runProps })) : new Array<undefined>(added).fill(undefined);
    runAnchors.push(...anchors);
  }
  function flushRunIfAny() {
    flushRun();
  }
}

export type { Story, BlockNote };
