import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { readPdf, readPdfText } from '../../src/parse/pdf/index.js';
import { GLYPH_NAMES, repairOf, repairText, texEncodingOf } from '../../src/parse/pdf/glyphs.js';

// fixtures/pdf/symbol-fonts.pdf is written by scripts/make-symbol-font-pdf-fixture.mjs: invented
// results whose signs are set in symbol fonts that give pdf.js no Unicode (see that script for
// each font). The reference for the text is what the script draws.
// p values: scipy.stats.t.sf(t, df) doubled (scipy 1.x): t(38) = 2.45 gives .0190, t(52) = 3.12
// gives .0029, t(24) = 1.20 gives .2419.
const bytes = () => new Uint8Array(readFileSync(resolve(import.meta.dirname, '../../fixtures/pdf/symbol-fonts.pdf')));

describe('characters a font gives no Unicode, read from what the font says', () => {
  it('reads Mathematical Pi glyph names and the TeX encodings of CMSY and CMMI', async () => {
    const text = await readPdfText(bytes());
    const lines = text.lines.map((l) => l.text);
    // H11005 `=` and H11002 `−` under an empty ToUnicode map, H11005 again with no map at all
    expect(lines).toContain('t(38) = −2.45, p = .019, in the invented sample.');
    // H11021 `<`
    expect(lines).toContain('Study 2 found the same, t(52) = 3.12, p < .01.');
    // CMSY10 (OMS) 0x00 `−` and 0x14 `≤`, in a Type 3 font whose glyph names say nothing
    expect(lines).toContain('Study 3 did not, t(24) = −1.20, p ≤ .25.');
    // CMMI10 (OML) 0x3C `<`
    expect(lines).toContain('The bound was met (t < 2) in every run of the invented task.');
  });

  it('names the page whose characters stay unread, with its font, in a note', async () => {
    const text = await readPdfText(bytes());
    expect(text.unreadable).toEqual([{ page: 2, fonts: ['Universal-NewswithCommPi'] }]);
    const o = await readPdf('symbol-fonts.pdf', bytes());
    expect(o.ok).toBe(true);
    if (!o.ok) return;
    const report = checkSource('symbol-fonts.pdf', o.document.source, { document: o.document });
    const note = report.findings.find((f) => f.messageId === 'glyphs-not-read');
    expect(note?.level).toBe('note');
    expect(note?.message).toContain('page 2 (counted in the file) holds characters set in the font Universal-NewswithCommPi');
    expect(note?.original).toMatchObject({ kind: 'page', page: 2 });
  });

  it('checks the results read so, and finds them consistent', async () => {
    const o = await readPdf('symbol-fonts.pdf', bytes());
    if (!o.ok) throw new Error(o.message);
    const report = checkSource('symbol-fonts.pdf', o.document.source, { document: o.document });
    expect(report.results.map((r) => `${r.t.printed}/${r.df?.printed}/${r.p?.op}${r.p?.number?.printed}`)).toEqual(['-2.45/38/=.019', '3.12/52/<.01', '-1.20/24/<=.25']);
    expect(report.findings.filter((f) => f.level !== 'note')).toEqual([]);
    expect(report.results.map((r) => r.original)).toMatchObject([{ page: 1, line: 2 }, { page: 1, line: 3 }, { page: 1, line: 4 }]);
  });
});

describe('repairOf', () => {
  const names = (entries: Record<number, string>) => entries;
  it('reads an unmapped code by its glyph name, and leaves a mapped one to pdf.js', () => {
    const r = repairOf({ name: 'ABCDEF+MathematicalPi-One', differences: names({ 33: 'H11005', 65: 'A' }), toUnicode: { _map: Object.assign([], { 65: 'A' }) } });
    expect(r?.name).toBe('MathematicalPi-One');
    expect([...(r?.recovered ?? [])]).toEqual([['!', '=']]);
    expect(repairText('x ! A', r!)).toEqual({ text: 'x = A', unreadable: 0 });
  });

  it('recovers nothing when another code of the font shows the same character (which code printed it is not known)', () => {
    const r = repairOf({ name: 'Pi', differences: names({ 33: 'H11005', 34: 'quotedbl' }), toUnicode: { _map: Object.assign([], { 34: '!' }) } });
    expect(r).toBeUndefined();
  });

  it('counts a named code nothing reads as unreadable', () => {
    const r = repairOf({ name: 'Pi', differences: names({ 33: 'H11999' }), toUnicode: { _map: [] } });
    expect(repairText('a ! b', r!)).toEqual({ text: 'a ! b', unreadable: 1 });
  });

  it('never reads a space as a glyph (pdf.js puts spaces of its own between words, in the font around them)', () => {
    // OML (cmmi10.afm) puts psi at code 32; a TeX font whose code 32 has no Unicode keeps its spaces
    const r = repairOf({ name: 'ABCDEF+CMMI10', toUnicode: { _map: Object.assign([], { 116: 't' }) } });
    expect(r?.recovered.has(' ')).toBe(false);
    expect(repairText('t < 2', r!).text).toBe('t < 2');
    expect(repairText('\u000b', r!).text).toBe('α');
  });

  it('leaves composite fonts and identity maps to pdf.js', () => {
    expect(repairOf({ name: 'X', composite: true, differences: names({ 33: 'H11005' }) })).toBeUndefined();
    expect(repairOf({ name: 'X', differences: names({ 33: 'H11005' }), toUnicode: { firstChar: 0, lastChar: 255 } })).toBeUndefined();
  });

  it('knows the TeX fonts by name, subset prefix or not', () => {
    // cmsy10.afm: C 20 lessequal, C 0 minus; cmmi10.afm: C 11 alpha, C 31 chi; cmr10.afm: C 61 equal, C 60 exclamdown
    expect(texEncodingOf('ABCDEF+CMSY10')?.[20]).toBe('≤');
    expect(texEncodingOf('CMSY7')?.[0]).toBe('\u2212');
    expect(texEncodingOf('CMMI10')?.[11]).toBe('α');
    expect(texEncodingOf('CMMI12')?.[31]).toBe('χ');
    expect(texEncodingOf('CMR10')?.[61]).toBe('=');
    expect(texEncodingOf('CMR10')?.[60]).toBe('¡');
    expect(texEncodingOf('CMTT10')).toBeUndefined();
    expect(texEncodingOf('Times-Roman')).toBeUndefined();
  });

  it('keeps only operators in the table of Mathematical Pi names', () => {
    expect(Object.values(GLYPH_NAMES).sort()).toEqual(['+', '<', '=', '>', '±', '×', '−'].sort());
  });
});
