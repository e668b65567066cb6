import { MappedText } from './builder.js';
import { normalize } from './normalize.js';
import type { ParsedDocument, Segment } from './types.js';

/**
 * Plain text, typically pulled out of a PDF: paragraphs are runs of non-blank lines; a hard
 * line wrap reads as a space, and a word hyphenated across a line end (`signifi-` / `cant`)
 * is joined, with every character still mapped to its original line and column.
 */
export function parsePlainText(path: string, source: string): ParsedDocument {
  const hadBom = source.charCodeAt(0) === 0xfeff;
  const segments: Segment[] = [];
  const lines = splitLines(source, hadBom ? 1 : 0);
  let para: MappedText | undefined;
  let block = 0;
  const flush = () => {
    if (para && para.text.trim() !== '') {
      const text = normalize(para);
      block += 1;
      segments.push({ id: segments.length, block, kind: 'text', text: text.text, starts: text.starts, ends: text.ends });
    }
    para = undefined;
  };
  for (const line of lines) {
    const content = source.slice(line.start, line.end);
    if (content.trim() === '') {
      flush();
      continue;
    }
    const lead = content.length - content.trimStart().length;
    if (!para) para = new MappedText();
    else if (/[A-Za-z]-$/.test(para.text) && /^[a-z]/.test(content.slice(lead))) {
      // undo end-of-line hyphenation: drop the hyphen, join without a space
      para.text = para.text.slice(0, -1);
      para.starts.pop();
      para.ends.pop();
    } else {
      para.pushSynthetic(' ', line.start - line.breakLength, line.start);
    }
    const body = content.slice(lead).trimEnd();
    para.pushVerbatim(body, line.start + lead);
  }
  flush();
  return { path, source, format: 'text', segments, directives: [], hadBom };
}

interface LineRange {
  start: number;
  end: number;
  /** Length of the line break before this line (0 for the first line). */
  breakLength: number;
}

function splitLines(text: string, from: number): LineRange[] {
  const out: LineRange[] = [];
  let start = from;
  let breakLength = 0;
  for (let i = from; i <= text.length; i += 1) {
    const c = text.charCodeAt(i);
    if (i === text.length || c === 10 || c === 13) {
      out.push({ start, end: i, breakLength });
      if (c === 13 && text.charCodeAt(i + 1) === 10) i += 1;
      breakLength = i === text.length ? 0 : (c === 13 && text.charCodeAt(i) === 10 ? 2 : 1);
      start = i + 1;
    }
  }
  return out;
}
