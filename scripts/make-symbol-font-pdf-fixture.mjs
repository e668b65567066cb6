// Makes fixtures/pdf/symbol-fonts.pdf: results whose signs (=, −, <, ≤, ×) are set in symbol
// fonts that give pdf.js no Unicode for them, so the reader must recover them from what the font
// itself says (src/parse/pdf/glyphs.ts). Run: node scripts/make-symbol-font-pdf-fixture.mjs
// (needs the devDependency pdf-lib only). Every study and number is invented.
//
// The fonts, written as font dictionaries by hand (their programs are not embedded: what is
// tested is the reading of their encodings, which pdf.js does the same for embedded fonts):
// - F1 Times-Roman, F2 Times-Italic: the text, in WinAnsiEncoding (read by pdf.js as it is);
// - F3 `ABCDEF+Universal-GreekwithMathPi`: a /Differences array of Mathematical Pi glyph names
//   (H11005 `=`, H11002 `−`, H11021 `<`) and a ToUnicode map with no entry, the way a published
//   article set its signs;
// - F4 `MathematicalPi-One`: the same names without any ToUnicode map;
// - F5 `CMSY10`, F6 `CMMI10`: TeX's symbol and math italic fonts as bitmap (Type 3) fonts, whose
//   glyph names (`a0`, `a20`) say nothing, so only their TeX encodings (OMS, OML) say what the
//   codes are (0x00 `−`, 0x14 `≤`, 0x3C `<`);
// - F7 `Universal-NewswithCommPi`: a glyph name nothing reads (H77777, invented), on page 2,
//   which must get the note that names the page.
import { writeFileSync } from 'node:fs';
import { PDFDocument, PDFHexString, PDFName, PDFNumber, PDFOperator, PDFString } from 'pdf-lib';

const OUT = new URL('../fixtures/pdf/symbol-fonts.pdf', import.meta.url).pathname;

const doc = await PDFDocument.create();
doc.setCreationDate(new Date('2026-01-01T00:00:00Z'));
doc.setModificationDate(new Date('2026-01-01T00:00:00Z'));
doc.setProducer('plumbline fixtures');
doc.setCreator('scripts/make-symbol-font-pdf-fixture.mjs');
const ctx = doc.context;

const emptyCmap = [
  '/CIDInit /ProcSet findresource begin', '12 dict begin', 'begincmap',
  '/CIDSystemInfo << /Registry (Adobe) /Ordering (UCS) /Supplement 0 >> def',
  '/CMapName /Adobe-Identity-UCS def', '/CMapType 2 def',
  '1 begincodespacerange', '<00> <FF>', 'endcodespacerange',
  'endcmap', 'CMapName currentdict /CMap defineresource pop', 'end', 'end',
].join('\n');

const simple = (base, extra = {}) => ctx.register(ctx.obj({ Type: 'Font', Subtype: 'Type1', BaseFont: base, ...extra }));
const differences = (first, names) => ctx.obj({ Type: 'Encoding', Differences: [first, ...names.map((n) => PDFName.of(n))] });
/** A Type 3 font as TeX's bitmap fonts are written: each glyph a drawing named `a` and its code (here a plain bar), the font named by its descriptor. */
function bitmap(base, codes) {
  const procs = ctx.obj({});
  for (const c of codes) procs.set(PDFName.of(`a${c}`), ctx.register(ctx.stream('500 0 d0 60 200 380 60 re f')));
  const first = Math.min(...codes);
  const last = Math.max(...codes);
  const diffs = [];
  for (const c of codes) diffs.push(c, PDFName.of(`a${c}`));
  return ctx.register(ctx.obj({
    Type: 'Font', Subtype: 'Type3', FontBBox: [0, 0, 500, 500], FontMatrix: [0.001, 0, 0, 0.001, 0, 0],
    CharProcs: procs, Encoding: ctx.obj({ Type: 'Encoding', Differences: diffs }), Resources: ctx.obj({}),
    FirstChar: first, LastChar: last, Widths: Array.from({ length: last - first + 1 }, () => 500),
    // a Type 3 font has no BaseFont: its descriptor names it
    FontDescriptor: ctx.register(ctx.obj({ Type: 'FontDescriptor', FontName: base, Flags: 4, FontBBox: [0, 0, 500, 500], ItalicAngle: 0, Ascent: 500, Descent: 0, CapHeight: 500, StemV: 50 })),
  }));
}

const fonts = {
  F1: simple('Times-Roman', { Encoding: 'WinAnsiEncoding' }),
  F2: simple('Times-Italic', { Encoding: 'WinAnsiEncoding' }),
  F3: simple('ABCDEF+Universal-GreekwithMathPi', {
    Encoding: differences(33, ['H11005', 'H11022', 'H11002', 'H11021', 'H11003']),
    ToUnicode: ctx.register(ctx.stream(emptyCmap)),
    FirstChar: 33, LastChar: 37, Widths: [833, 833, 833, 833, 833],
  }),
  F4: simple('MathematicalPi-One', { Encoding: differences(33, ['H11005']), FirstChar: 33, LastChar: 33, Widths: [833] }),
  F5: bitmap('CMSY10', [0x00, 0x14]),
  F6: bitmap('CMMI10', [0x3c]),
  F7: simple('Universal-NewswithCommPi', { Encoding: differences(33, ['H77777']), FirstChar: 33, LastChar: 33, Widths: [600] }),
};

/** A line of runs `[font, text]`; a string text is drawn as its Latin-1 bytes, an array as the codes given. */
function line(page, y, runs) {
  const ops = [PDFOperator.of('BT'), PDFOperator.of('Td', [PDFNumber.of(72), PDFNumber.of(y)])];
  for (const [font, text] of runs) {
    ops.push(PDFOperator.of('Tf', [PDFName.of(font), PDFNumber.of(11)]));
    const codes = typeof text === 'string' ? [...text].map((c) => c.charCodeAt(0)) : text;
    const hex = codes.map((c) => c.toString(16).padStart(2, '0')).join('');
    ops.push(PDFOperator.of('Tj', [PDFHexString.of(hex)]));
  }
  ops.push(PDFOperator.of('ET'));
  page.pushOperators(...ops);
}

function newPage() {
  const page = doc.addPage([612, 792]);
  const dict = ctx.obj({});
  for (const [name, ref] of Object.entries(fonts)) dict.set(PDFName.of(name), ref);
  page.node.setFontDictionary(PDFName.of('F1'), fonts.F1);
  page.node.Resources().set(PDFName.of('Font'), dict);
  return page;
}

const p1 = newPage();
line(p1, 720, [['F1', 'Study 1. Reaction times were shorter after the cue than without it,']]);
// t(38) = −2.45, p = .019: `=` and `−` from F3 (codes 33, 35), `=` from F4 (code 33)
line(p1, 706, [['F2', 't'], ['F1', '(38) '], ['F3', [33]], ['F1', ' '], ['F3', [35]], ['F1', '2.45, '], ['F2', 'p'], ['F1', ' '], ['F4', [33]], ['F1', ' .019, in the invented sample.']]);
// t(52) = 3.12, p < .01: `<` from F3 (code 36)
line(p1, 692, [['F1', 'Study 2 found the same, '], ['F2', 't'], ['F1', '(52) '], ['F3', [33]], ['F1', ' 3.12, '], ['F2', 'p'], ['F1', ' '], ['F3', [36]], ['F1', ' .01.']]);
// t(24) = −1.20, p ≤ .25 (CMSY10 codes 0x00 minus and 0x14 ≤); t(24) < 2 (CMMI10 code 0x3C)
line(p1, 678, [['F1', 'Study 3 did not, '], ['F2', 't'], ['F1', '(24) '], ['F3', [33]], ['F1', ' '], ['F5', [0x00]], ['F1', '1.20, '], ['F2', 'p'], ['F1', ' '], ['F5', [0x14]], ['F1', ' .25.']]);
line(p1, 664, [['F1', 'The bound was met ('], ['F2', 't'], ['F1', ' '], ['F6', [0x3c]], ['F1', ' 2) in every run of the invented task.']]);

const p2 = newPage();
line(p2, 720, [['F1', 'A remark set with an unreadable sign '], ['F7', [33]], ['F1', ' closes the invented report.']]);

writeFileSync(OUT, await doc.save({ useObjectStreams: false }));
console.log(`wrote ${OUT}`);
