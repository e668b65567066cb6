// Makes the PDFs under fixtures/pdf/ from invented content, so tests need neither this script
// nor its tools. Run: node scripts/make-pdf-fixtures.mjs (needs the devDependencies pdf-lib and
// @pdf-lib/fontkit, Debian's fonts-dejavu for DejaVu Serif, and LibreOffice's soffice for the
// password-protected file).
//
// pdf-lib draws each line at a chosen place, which gives exact control of what the reader must
// undo: two columns, running heads and page numbers, margin line numbers, raised exponents and
// footnote marks, words hyphenated at a line end, ligature glyphs, U+2212 minus signs, tables.
// DejaVu Serif is embedded (subset) because the standard PDF fonts cannot encode U+FB01 or U+2212.
// Every study, number and name below is invented.
//
// fixtures/pdf/chromium-columns.pdf, a page laid out by a browser rather than drawn line by line,
// comes from the sibling script make-chromium-pdf-fixture.mjs (Debian's chromium).
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fontkit from '@pdf-lib/fontkit';
import { PDFDocument, rgb } from 'pdf-lib';

const OUT = new URL('../fixtures/pdf/', import.meta.url).pathname;
const FONT = '/usr/share/fonts/truetype/dejavu/DejaVuSerif.ttf';
const BOLD = '/usr/share/fonts/truetype/dejavu/DejaVuSerif-Bold.ttf';
mkdirSync(OUT, { recursive: true });

async function newDoc() {
  const doc = await PDFDocument.create();
  doc.registerFontkit(fontkit);
  // fixed dates so the bytes do not change from run to run
  doc.setCreationDate(new Date('2026-01-01T00:00:00Z'));
  doc.setModificationDate(new Date('2026-01-01T00:00:00Z'));
  doc.setProducer('plumbline fixtures');
  doc.setCreator('scripts/make-pdf-fixtures.mjs');
  const regular = await doc.embedFont(readFileSync(FONT), { subset: true });
  const bold = await doc.embedFont(readFileSync(BOLD), { subset: true });
  return { doc, regular, bold };
}

/** Draws `text` at (x, y); throws when it would pass `maxX`, so a column's text never crosses its gutter. */
function draw(page, font, text, x, y, size, maxX = 558) {
  const width = font.widthOfTextAtSize(text, size);
  if (x + width > maxX + 0.01) throw new Error(`line too wide (${(x + width).toFixed(1)} > ${maxX}): ${text}`);
  page.drawText(text, { x, y, size, font });
  return x + width;
}

/** Lines of a column; `^…` after a line draws a raised smaller run glued to its end. */
function column(page, fonts, lines, x, yTop, maxX, size = 9, leading = 11.5) {
  let y = yTop;
  for (const entry of lines) {
    if (entry === '') {
      y -= leading * 0.8;
      continue;
    }
    const [text, raised, after] = Array.isArray(entry) ? entry : [entry];
    const heading = /^[0-9]\. /.test(text);
    const font = heading ? fonts.bold : fonts.regular;
    const s = heading ? size + 1.5 : size;
    let end = draw(page, font, text, x, y, s, maxX);
    if (raised) end = draw(page, fonts.regular, raised, end + 0.3, y + 0.38 * s, 0.65 * s, maxX);
    if (after) draw(page, fonts.regular, after, end + 0.3, y, s, maxX);
    y -= leading;
  }
}

function furniture(page, fonts, number) {
  draw(page, fonts.regular, 'Invented Journal of Worked Examples · Volume 3', 54, 750, 8);
  draw(page, fonts.regular, String(number), 300, 40, 8);
}

async function twoColumns() {
  const { doc, regular, bold } = await newDoc();
  const fonts = { regular, bold };
  const p1 = doc.addPage([612, 792]);
  furniture(p1, fonts, 101);
  draw(p1, bold, 'Spaced practice and recall in an invented classroom', 110, 712, 14);
  draw(p1, regular, 'Abstract. Forty pupils of an invented school practised word lists on a spaced or a massed', 54, 688, 9);
  draw(p1, regular, 'schedule. Spaced practice gave better recall. All data in this example are invented.', 54, 676.5, 9);
  const left = [
    '1. Method',
    'Forty pupils of an invented school were',
    'assigned to spaced or massed practice. Recall',
    'was scored by two raters who were blind to the',
    'condition, and the scores were recog-',
    'nised as interval data for the analysis.',
    '',
    '2. Results',
    'Pupils with spaced practice recalled more',
    'words than pupils with massed practice,',
    't(38) = 2.45, p = .019, d = 0.77. The eﬀect was',
    'signiﬁcant in both classes. A paired t-',
    'test on the two sessions gave t(19) = −2.61,',
    'p = .017, as expected.',
  ];
  const right = [
    'Error rates were compared with chance in a',
    ['one-sample test, t(39) = 6.12, p = 3.5 × 10', '−7', ','],
    'and accuracy and confidence were related,',
    ['χ', '2', '(1, N = 40) = 5.02, p = .025. Older pupils'],
    ['recalled more, t(38) = 4.10, p < .001.', '1', ''],
    '',
    'The pupils who slept longer did not recall',
    'more words in the spaced group, t(30) = 1.20,',
    'p = .02, which we did not expect.',
  ];
  column(p1, fonts, left, 54, 640, 294);
  column(p1, fonts, right, 318, 640, 558);
  const p2 = doc.addPage([612, 792]);
  furniture(p2, fonts, 102);
  column(p2, fonts, [
    '3. Discussion',
    'Spaced practice helped recall in this invented',
    'class, t(26) = 2.20, p = .037, as in the first',
    'classes. Teachers in the example found the',
    'schedule easy to keep.',
  ], 54, 700, 294);
  column(p2, fonts, [
    'The ﬂoor eﬀect in the massed group was small.',
    'Later sessions will use longer lists and a',
    'second, independent sample of pupils, so that',
    'the eﬀect can be estimated with more pupils.',
    'All pupils, schools and numbers are invented.',
  ], 318, 700, 558);
  p2.drawText('1 The footnote of an invented example.', { x: 54, y: 80, size: 7, font: regular });
  return doc.save({ useObjectStreams: false });
}

async function lineNumbers() {
  const { doc, regular, bold } = await newDoc();
  const fonts = { regular, bold };
  const lines = [
    'Thirty invented volunteers rated two made-up drinks on a sweetness scale from one to nine.',
    'Each volunteer tasted both drinks in a random order, a week apart, and nobody was told which',
    'drink was which. The sweeter recipe was rated higher than the plain one, t(29) = 3.05,',
    'p = .005, and the ratings did not depend on the order of tasting. A second, shorter',
    'tasting with a new batch of the same recipes gave t(29) = 2.10, p = .045 for the same',
    'difference. The volunteers and drinks in this example do not exist.',
  ];
  for (const pageNo of [1, 2]) {
    const page = doc.addPage([612, 792]);
    let y = 700;
    lines.forEach((text, i) => {
      draw(page, regular, String(i + 1 + (pageNo - 1) * lines.length), 30, y, 7);
      draw(page, fonts.regular, pageNo === 2 ? `On the second page: ${text.slice(0, 60)}` : text, 72, y, 9, 560);
      y -= 13;
    });
  }
  return doc.save({ useObjectStreams: false });
}

async function table() {
  const { doc, regular, bold } = await newDoc();
  const page = doc.addPage([612, 792]);
  draw(page, regular, 'Recall was compared between the two invented schedules (Table 1).', 72, 720, 10);
  draw(page, bold, 'Table 1. Recall by practice schedule (invented data)', 72, 690, 10);
  const xs = [72, 220, 320, 420, 490];
  const rows = [
    ['Measure', 'Spaced M (SD)', 'Massed M (SD)', 't(38)', 'p'],
    ['Words recalled', '14.2 (3.1)', '11.9 (2.9)', '2.42', '.020'],
    ['Errors', '3.1 (1.2)', '3.8 (1.1)', '1.87', '.069'],
    ['Confidence', '5.6 (0.9)', '4.7 (0.9)', '3.05', '.004'],
  ];
  rows.forEach((row, r) => {
    row.forEach((cell, c) => draw(page, r === 0 ? bold : regular, cell, xs[c], 670 - r * 14, 9));
  });
  draw(page, regular, 'Note. Twenty pupils per schedule; all numbers are invented.', 72, 608, 8);
  draw(page, regular, 'The schedules did not differ in errors. The rest of the text is invented too.', 72, 580, 10);
  return doc.save({ useObjectStreams: false });
}

/** Only drawings, no text: what a scan looks like to a text reader. */
async function scanned() {
  const doc = await PDFDocument.create();
  doc.setCreationDate(new Date('2026-01-01T00:00:00Z'));
  doc.setModificationDate(new Date('2026-01-01T00:00:00Z'));
  doc.setProducer('plumbline fixtures');
  for (let p = 0; p < 2; p += 1) {
    const page = doc.addPage([612, 792]);
    for (let i = 0; i < 40; i += 1) page.drawRectangle({ x: 72, y: 720 - i * 14, width: 300 + ((i * 37) % 160), height: 6, color: rgb(0.2, 0.2, 0.2) });
  }
  return doc.save({ useObjectStreams: false });
}

/** Many short pages, for the page limit (tests lower the limit rather than make a huge file). */
async function manyPages() {
  const { doc, regular } = await newDoc();
  for (let p = 1; p <= 30; p += 1) draw(doc.addPage([300, 300]), regular, `Invented page ${p}.`, 40, 200, 10);
  return doc.save({ useObjectStreams: false });
}

/** A password-protected PDF, written by LibreOffice (pdf-lib cannot encrypt). */
function encrypted() {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-pdf-'));
  try {
    writeFileSync(join(dir, 'locked.txt'), 'An invented locked report: t(20) = 2.20, p = .040.\n');
    const filter = 'pdf:writer_pdf_Export:{"EncryptFile":{"type":"boolean","value":"true"},"DocumentOpenPassword":{"type":"string","value":"invented"}}';
    execFileSync('soffice', ['--headless', `-env:UserInstallation=file://${dir}/profile`, '--convert-to', filter, '--outdir', dir, join(dir, 'locked.txt')], { stdio: 'ignore' });
    return readFileSync(join(dir, 'locked.pdf'));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

writeFileSync(join(OUT, 'two-columns.pdf'), await twoColumns());
writeFileSync(join(OUT, 'line-numbers.pdf'), await lineNumbers());
writeFileSync(join(OUT, 'table.pdf'), await table());
writeFileSync(join(OUT, 'scanned.pdf'), await scanned());
writeFileSync(join(OUT, 'many-pages.pdf'), await manyPages());
// the head of a real file's structure, then nothing: no cross-reference table, no objects
writeFileSync(join(OUT, 'damaged.pdf'), '%PDF-1.7\n%\u00e2\u00e3\u00cf\u00d3\n1 0 obj\n<< /Type /Catalog /Pages 2 0 R\n');
writeFileSync(join(OUT, 'encrypted.pdf'), encrypted());
console.log(`wrote the PDFs in ${OUT}`);
