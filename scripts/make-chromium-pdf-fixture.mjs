// Makes fixtures/pdf/chromium-columns.pdf: an invented two-column manuscript written as HTML with
// CSS columns and printed to PDF by Debian's chromium through playwright-core (never a browser
// download). Run: node scripts/make-chromium-pdf-fixture.mjs (needs /usr/bin/chromium and the
// devDependency playwright-core). Tests read the committed PDF, so they need neither.
//
// Unlike the pdf-lib fixtures of make-pdf-fixtures.mjs, where each line is drawn at a chosen
// place, here a browser's layout engine decides where lines break and how text runs are cut, so
// the reader meets what a manuscript saved from a browser really contains: balanced CSS columns,
// justified lines split into many runs, soft hyphens broken at a line end, U+2212 minus signs, and
// a running head and page number set in the page margins. Every study, number and name is invented.
import { writeFileSync } from 'node:fs';
import { chromium } from 'playwright-core';

const OUT = new URL('../fixtures/pdf/chromium-columns.pdf', import.meta.url).pathname;

// p values (scipy.stats.t.sf(|t|, df) doubled, scipy 1.x): t(28) = 2.10 gives .0449, t(34) = 2.74
// gives .0097, t(22) = 3.12 gives .0050 — printed consistently; t(30) = 1.45 gives .157, so the
// printed p = .016 cannot follow from it.
const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Invented manuscript</title>
<style>
  body { font-family: 'DejaVu Serif', serif; font-size: 10pt; line-height: 1.35; margin: 0; }
  h1 { font-size: 15pt; text-align: center; margin: 0 0 8pt; }
  .abstract { margin: 0 0 12pt; }
  .columns { columns: 2; column-gap: 24pt; text-align: justify; hyphens: auto; }
  h2 { font-size: 11.5pt; margin: 6pt 0 3pt; }
  p { margin: 0 0 6pt; }
  .later { break-before: page; }
</style></head>
<body>
<h1>Evening light and reading speed in an invented dormitory</h1>
<p class="abstract">Abstract. Sixty invented students read short passages under warm or cool evening light. Warm light went with faster reading. Every person and number in this example is invented.</p>
<div class="columns">
<h2>1. Method</h2>
<p>Sixty students of an invented college were assigned at random to a warm or a cool lamp for two weeks. Reading speed was timed by an assistant who did not know the condition.</p>
<p>The passages came from an invented anthology and were matched for length, so that any difference would reflect the lamp and not the text. Each student read ten passages.</p>
<h2>2. Results</h2>
<p>Students under the warm lamp read faster than students under the cool lamp, t(28) = 2.10, p = .045, in the first week of the study.</p>
<p>The gain in comprehension scores was also reliable, t(34) = \u22122.74, p = .010, with the cool lamp lower than the warm one on the second test.</p>
<p>The paper lanterns in the library made no over\u00adwhelm\u00ading differ\u00adence to the counter\u00adbalanced results across both sessions and all the rooms.</p>
<p>Late readers in the cool group did not read more slowly, t(30) = 1.45, p = .016, which the assistants had not predicted at the outset.</p>
</div>
<div class="later">
<h2>3. Discussion</h2>
<p>Warm light went with faster reading in this invented dormitory, t(22) = 3.12, p = .005, as in the first group of students who took part.</p>
<p>Later rounds will use other lamps and a second, independent group of invented students.</p>
</div>
</body></html>`;

const browser = await chromium.launch({
  executablePath: '/usr/bin/chromium',
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
});
try {
  const page = await browser.newPage();
  await page.setContent(html, { waitUntil: 'load' });
  const pdf = await page.pdf({
    format: 'Letter',
    margin: { top: '0.9in', bottom: '0.9in', left: '0.8in', right: '0.8in' },
    displayHeaderFooter: true,
    headerTemplate: '<div style="font-size:8pt;width:100%;text-align:center;font-family:serif">Invented Bulletin of Worked Examples \u00b7 Issue 7</div>',
    footerTemplate: '<div style="font-size:8pt;width:100%;text-align:center;font-family:serif"><span class="pageNumber"></span></div>',
  });
  writeFileSync(OUT, pdf);
  console.log(`wrote ${OUT}`);
} finally {
  await browser.close();
}
