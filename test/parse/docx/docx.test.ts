import { readFileSync } from 'node:fs';
import { strToU8, zipSync } from 'fflate';
import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../../src/engine/index.js';
import { readDocxDocument, DOCX_LIMITS } from '../../../src/parse/docx/index.js';
import type { ParsedDocument } from '../../../src/parse/types.js';

// fixtures/docx/ is written by scripts/make-docx-fixtures.mjs (invented scenarios): features.docx
// by hand-written WordprocessingML (ECMA-376 Part 1, §17), desk-plants.docx by pandoc from
// desk-plants.md. The expected paragraph numbers count every w:p of the body in document order
// (README, "Word and PDF files"); the expected p values come from scipy.stats.t.sf doubled:
// t(12) = 3.50 gives p ≈ .0044, so p = .40 flips significance; t(30) = 1.20 gives p ≈ .24.

const fixture = (name: string) => readFileSync(new URL(`../../../fixtures/docx/${name}`, import.meta.url));

function read(name: string): ParsedDocument {
  const o = readDocxDocument(name, fixture(name));
  if (!o.ok) throw new Error(o.message);
  return o.document;
}

function check(name: string): { doc: ParsedDocument; report: FileReport } {
  const doc = read(name);
  return { doc, report: checkSource(name, doc.source, { document: doc }) };
}

describe('Word reader: features.docx', () => {
  const { doc, report } = check('features.docx');
  const text = doc.segments.map((s) => s.text).join('\n');

  it('reads a field as its displayed result, not its instructions', () => {
    expect(text).toContain('Bench height was read from a field, t(28) = 2.10, p = .045.');
    expect(text).not.toContain('MERGEFIELD');
    expect(text).not.toContain('9.99');
  });

  it('reads tracked changes as accepted and says so', () => {
    expect(text).toContain('The revised value is t(40) = 2.50, p = .017.');
    expect(text).not.toContain('Moved away');
    // the deleted paragraph mark joins paragraphs 5 and 6 into one block
    expect(text).toContain('Watering took less time in the second week, t(22) = 2.40, p = .025.');
    expect(doc.original?.trackedChanges).toBe(true);
    expect(report.original).toMatchObject({ kind: 'docx', trackedChanges: true });
    const note = report.findings.find((f) => f.messageId === 'tracked-changes-accepted');
    expect(note?.level).toBe('note');
  });

  it('reads a superscript after 10 as an exponent and a Symbol-font χ with its superscript 2', () => {
    expect(doc.source).toContain('3.2 × 10⁻⁶ per leaf');
    expect(text).toContain('3.2 × 10^-6 per leaf');
    expect(text).toContain('χ^2(2, N = 120) = 4.20, p = .12.');
    expect(report.statistics?.map((s) => s.printed)).toContain('χ^2(2, N = 120) = 4.20, p = .12');
  });

  it('reads a tab as a space and a no-break hyphen as a minus', () => {
    expect(text).toContain('Shade lowered growth, t(18) = -2.30, p = .034.');
  });

  it('does not read comments, hidden text or markup-compatibility fallbacks', () => {
    expect(text).not.toContain('t(5) = 9.00');
    expect(text).not.toContain('Hidden');
    expect(text.split('Chosen text').length).toBe(2);
  });

  it('reads a table as cells with their places, its caption marked', () => {
    const cells = doc.segments.filter((s) => s.table).map((s) => [s.text, s.table?.row, s.table?.column]);
    expect(cells).toEqual([['Measure', 0, 0], ['t', 0, 1], ['df', 0, 2], ['p', 0, 3], ['Height', 1, 0], ['2.10', 1, 1], ['28', 1, 2], ['.045', 1, 3]]);
    expect(doc.segments.find((s) => s.text.startsWith('Table 1'))?.legendOf).toEqual({ table: 0, role: 'caption' });
  });

  it('places every result by paragraph (empty ones counted), 1-based character and opening words', () => {
    expect(report.results.map((r) => [r.printed, r.original])).toEqual([
      ['t(28) = 2.10, p = .045', { kind: 'paragraph', paragraph: 2, char: 37, opening: 'Bench height was read from a …' }],
      ['t(40) = 2.50, p = .017', { kind: 'paragraph', paragraph: 3, char: 22, opening: 'The revised value is t(40) = …' }],
      ['t(22) = 2.40, p = .025', { kind: 'paragraph', paragraph: 6, char: 21, opening: 'in the second week, t(22) = …' }],
      ['t(18) = -2.30, p = .034', { kind: 'paragraph', paragraph: 9, char: 23, opening: 'Shade lowered growth, t(18) = -2.30, …' }],
      ['t(16) = 2.20, p = .043', { kind: 'paragraph', paragraph: 12, char: 14, opening: 'Chosen text, t(16) = 2.20, p …' }],
      ['t(28) = 2.10, p = .045', { kind: 'paragraph', paragraph: 20, char: 1, opening: '2.10' }],
      ['t(30) = 1.20, p = .24', { kind: 'paragraph', paragraph: 23, char: 18, opening: 'Leaf count rose, t(30) = 1.20, …' }],
      // the footnote's leading space is where Word shows the note's number
      ['t(12) = 3.50, p = .40', { kind: 'paragraph', paragraph: 1, char: 27, opening: 'A check of the pots gave …', note: { kind: 'footnote', number: 1 } }],
    ]);
  });

  it('flags the inconsistent footnote, and only it', () => {
    const flagged = report.findings.filter((f) => f.level === 'error' || f.level === 'warning');
    expect(flagged.map((f) => [f.ruleId, f.original])).toEqual([
      ['significance-follows-from-t', { kind: 'paragraph', paragraph: 1, char: 27, opening: 'A check of the pots gave …', note: { kind: 'footnote', number: 1 } }],
    ]);
  });
});

describe('Word reader: a pandoc conversion (desk-plants.docx)', () => {
  it('reads the same results as the Markdown it was made from, each at its Word paragraph', () => {
    const { report } = check('desk-plants.docx');
    const md = checkSource('desk-plants.md', fixture('desk-plants.md').toString('utf8'));
    expect(report.results.map((r) => r.printed)).toEqual(md.results.map((r) => r.printed));
    expect(report.findings.filter((f) => f.level === 'error').map((f) => f.ruleId)).toEqual(md.findings.filter((f) => f.level === 'error').map((f) => f.ruleId));
    expect(report.results.every((r) => r.original?.kind === 'paragraph' && r.original.paragraph > 0)).toBe(true);
    const footnote = report.results.find((r) => r.printed.startsWith('t(12)'));
    expect(footnote?.original).toMatchObject({ note: { kind: 'footnote', number: 1 } });
  });
});

/** A minimal .docx around a body's XML (ECMA-376 Part 2's package parts). */
function docx(body: string, extra: Record<string, string> = {}): Uint8Array {
  const W = 'http://schemas.openxmlformats.org/wordprocessingml/2006/main';
  return zipSync({
    '_rels/.rels': strToU8('<?xml version="1.0"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="r1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="word/document.xml"/></Relationships>'),
    'word/document.xml': strToU8(`<?xml version="1.0"?><w:document xmlns:w="${W}"><w:body>${body}</w:body></w:document>`),
    ...Object.fromEntries(Object.entries(extra).map(([k, v]) => [k, strToU8(v)])),
  });
}

describe('Word reader: what it refuses, one message each', () => {
  const refused = (bytes: Uint8Array, limits = DOCX_LIMITS) => {
    const o = readDocxDocument('x.docx', bytes, limits);
    return o.ok ? 'read' : o.message;
  };
  const cfb = (withEncryption: boolean) => {
    // an OLE compound file's signature (MS-CFB 2.2), then a directory entry's name in UTF-16LE
    const head = [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1];
    const name = withEncryption ? [...'EncryptionInfo'].flatMap((c) => [c.charCodeAt(0), 0]) : [...'WordDocument'].flatMap((c) => [c.charCodeAt(0), 0]);
    return new Uint8Array([...head, ...new Array(504).fill(0), ...name]);
  };

  it('a minimal document is read', () => {
    expect(refused(docx('<w:p><w:r><w:t>Plain words.</w:t></w:r></w:p>'))).toBe('read');
  });
  it('an encrypted (password to open) Word file', () => {
    expect(refused(cfb(true))).toMatch(/^encrypted: this Word file is protected by a password/);
  });
  it('a Word 97–2003 .doc', () => {
    expect(refused(cfb(false))).toMatch(/^not a \.docx: this is an older Word \(\.doc\)/);
  });
  it('a file that is not a zip archive', () => {
    expect(refused(strToU8('Just text, t(28) = 2.10.'))).toMatch(/^not a \.docx: the file does not start/);
  });
  it('a zip archive without a Word document in it', () => {
    expect(refused(zipSync({ 'notes.txt': strToU8('hello') }))).toMatch(/^not a \.docx: the archive holds no Word document part/);
  });
  it('a zip archive whose main part is not WordprocessingML', () => {
    expect(refused(zipSync({ 'word/document.xml': strToU8('<?xml version="1.0"?><sheet/>') }))).toMatch(/^not a \.docx: the archive's main part/);
  });
  it('a damaged (cut short) archive', () => {
    const whole = docx('<w:p><w:r><w:t>Words.</w:t></w:r></w:p>');
    expect(refused(whole.subarray(0, whole.length - 30))).toMatch(/^damaged: /);
  });
  it('an entry encrypted by the zip archive itself (general purpose bit 0)', () => {
    const bytes = docx('<w:p/>');
    // set bit 0 of every central directory header's flags (APPNOTE.TXT 4.3.12, 4.4.4)
    for (let i = 0; i + 4 < bytes.length; i += 1) if (bytes[i] === 0x50 && bytes[i + 1] === 0x4b && bytes[i + 2] === 1 && bytes[i + 3] === 2) bytes[i + 8] = (bytes[i + 8] as number) | 1;
    expect(refused(bytes)).toMatch(/^encrypted: the archive's entry .* is encrypted/);
  });
  it('a zip bomb: a part that inflates past the ratio limit', () => {
    // 4 MB of empty paragraphs deflate to a few kilobytes: some 1,000 to 1
    const bomb = docx('<w:p/>'.repeat(700_000));
    expect(refused(bomb)).toMatch(/^refused: its part word\/document\.xml inflates \d+ times .* over the limit of 200 times/);
  });
  it('parts that inflate past the total limit', () => {
    expect(refused(docx('<w:p/>'.repeat(1000)), { ...DOCX_LIMITS, maxUncompressedBytes: 1000 })).toMatch(/^refused: its parts inflate to more than the limit of 1000 bytes/);
  });
  it('too many entries', () => {
    const many: Record<string, Uint8Array> = {};
    for (let i = 0; i < 10_001; i += 1) many[`media/${i}.bin`] = new Uint8Array(0);
    expect(refused(zipSync(many))).toMatch(/^the archive lists 10001 entries, over the limit of 10000/);
  });
  it('XML nested past the depth limit', () => {
    expect(refused(docx(`${'<w:sdt><w:sdtContent>'.repeat(200)}<w:p/>${'</w:sdtContent></w:sdt>'.repeat(200)}`))).toMatch(/^damaged XML: elements nest more than 256 deep/);
  });
  it('damaged XML and a DOCTYPE', () => {
    expect(refused(docx('<w:p><w:r><w:t>open'))).toMatch(/^damaged XML: /);
    const withDoctype = zipSync({ 'word/document.xml': strToU8('<?xml version="1.0"?><!DOCTYPE x [<!ENTITY a "aaaa">]><w:document xmlns:w="http://schemas.openxmlformats.org/wordprocessingml/2006/main"><w:body/></w:document>') });
    expect(refused(withDoctype)).toMatch(/^damaged XML: a DOCTYPE/);
  });
});
