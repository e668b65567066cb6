/**
 * False extractions on real prose that reports no statistics: every Markdown file under
 * node_modules (package READMEs, changelogs, licences). Any result found there is a false
 * extraction; each is printed with its place.
 *
 *   npx tsx scripts/measure-false-extractions.ts
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { checkSource } from '../src/engine/index.js';

const root = resolve(import.meta.dirname, '../node_modules');
const files = execFileSync('find', [root, '-name', '*.md', '-type', 'f'], { encoding: 'utf8' }).trim().split('\n').sort();
let bytes = 0;
let results = 0;
let findings = 0;
for (const f of files) {
  const source = readFileSync(f, 'utf8');
  bytes += source.length;
  const report = checkSource(f, source);
  results += report.results.length;
  findings += report.findings.length;
  for (const r of report.results) console.log(`result  ${f.slice(root.length + 1)}:${r.start.line}:${r.start.column} ${JSON.stringify(r.printed)}`);
}
console.log(`${files.length} files, ${(bytes / 1e6).toFixed(1)} MB of prose: ${results} results extracted, ${findings} findings`);
