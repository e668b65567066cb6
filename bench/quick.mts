import { statDense } from './corpus.js';
import { checkSource } from '../src/engine/index.js';
import { parseDocument } from '../src/parse/index.js';
import { extract } from '../src/extract/index.js';
import { unified } from 'unified';
import remarkParse from 'remark-parse';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkFrontmatter from 'remark-frontmatter';
const docs = Array.from({ length: 20 }, (_, i) => statDense(i + 1));
const bare = unified().use(remarkParse).use(remarkGfm);
const full = unified().use(remarkParse).use(remarkGfm).use(remarkFrontmatter, ['yaml']).use(remarkMath);
function time(f: () => void, reps = 3) { let best = Infinity; for (let r = 0; r < reps; r++) { const t = performance.now(); f(); best = Math.min(best, performance.now() - t); } return best; }
for (const f of [() => docs.forEach((d) => bare.parse(d)), () => docs.forEach((d) => checkSource('x.md', d))]) time(f, 1);
const parsed = docs.map((d) => parseDocument('x.md', d));
console.log({
  bare: time(() => docs.forEach((d) => bare.parse(d))),
  fullParse: time(() => docs.forEach((d) => full.parse(d))),
  parseDocument: time(() => docs.forEach((d) => parseDocument('x.md', d))),
  extract: time(() => parsed.forEach((d) => extract(d))),
  all: time(() => docs.forEach((d) => checkSource('x.md', d))),
  results: checkSource('x.md', docs[0]!).results.length, kb: docs[0]!.length / 1000,
});
