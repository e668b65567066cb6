import { readFileSync } from 'node:fs';
import { loadPdfJs } from './src/parse/pdf/read.ts';
import { layoutPages } from './src/parse/pdf/layout.ts';
const pdfjs = await loadPdfJs();
const bytes = new Uint8Array(readFileSync(process.argv[2]!));
let t0 = performance.now();
const d = await pdfjs.getDocument({ data: bytes, verbosity: 0, isEvalSupported: false, disableFontFace: true, useSystemFonts: false }).promise;
const pages: any[] = [];
for (let n = 1; n <= d.numPages; n++) {
  const p = await d.getPage(n);
  const tc = await p.getTextContent();
  pages.push({ page: n, width: 600, height: 800, runs: tc.items.filter((i: any) => 'str' in i).map((i: any) => ({ str: i.str, x: i.transform[4], y: i.transform[5], width: i.width, size: Math.hypot(i.transform[2], i.transform[3]), upright: true })) });
}
console.log('pages', d.numPages, 'runs', pages.reduce((a, p) => a + p.runs.length, 0), 'pdfjs ms', Math.round(performance.now() - t0));
t0 = performance.now();
layoutPages(pages);
console.log('layout ms', Math.round(performance.now() - t0));
for (let i = 0; i < 3; i++) { const t = performance.now(); layoutPages(pages); console.log('layout again ms', Math.round(performance.now() - t)); }
