/**
 * Figure 16's measurement in a process of its own (bench/run.ts starts it three times and takes
 * the median): the PDF at argv[2] read and checked, and the text it gives checked as plain text,
 * each the best of ten after two to warm up. Prints one line of JSON.
 *
 * Both sides need that much. Checking the text is what varies: with one warm-up and three timed
 * checks its best was 70 to 160 ms from one run to the next, so the figure went from 3.4 to 6.7
 * on the same code, in the bench's own process as in fresh ones. With two and ten, six fresh
 * processes gave 66 to 71 ms for the text, 392 to 427 ms for the PDF, and 5.5 to 6.2 (Dec 4).
 */
import { readFileSync } from 'node:fs';
import { checkSource } from '../src/engine/index.js';
import { readPdf } from '../src/parse/pdf/index.js';

const WARM = 2;
const TIMED = 10;

const path = process.argv[2];
if (path === undefined) throw new Error('usage: pdfChild.js FILE.pdf');
const bytes = new Uint8Array(readFileSync(path));
const read = async () => {
  const o = await readPdf('bench.pdf', bytes);
  if (!o.ok) throw new Error(o.message);
  return o.document;
};
const doc = await read();
for (let i = 1; i < WARM; i += 1) await read();
let readMs = Infinity;
let pdfMs = Infinity;
for (let i = 0; i < TIMED; i += 1) {
  const start = performance.now();
  const d = await read();
  const mid = performance.now();
  checkSource('bench.pdf', d.source, { document: d });
  readMs = Math.min(readMs, mid - start);
  pdfMs = Math.min(pdfMs, performance.now() - start);
}
for (let i = 0; i < WARM; i += 1) checkSource('bench.txt', doc.source);
let textMs = Infinity;
for (let i = 0; i < TIMED; i += 1) {
  const start = performance.now();
  checkSource('bench.txt', doc.source);
  textMs = Math.min(textMs, performance.now() - start);
}
const results = checkSource('bench.pdf', doc.source, { document: doc }).results.length;
console.log(JSON.stringify({ readMs, pdfMs, textMs, results, textChars: doc.source.length }));
