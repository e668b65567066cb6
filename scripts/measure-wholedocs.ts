/**
 * Measures plumbline on the whole public manuscripts in ../shared/wholedocs, each finding of
 * which was judged by hand (key.json): runs every document through the engine, writes the JSON
 * the set's own scorer reads, and prints that scorer's figures (precision of error and warning
 * findings, extraction recall). The documents are third-party text: read from there at run time,
 * never copied here.
 *
 *   npx tsx scripts/measure-wholedocs.ts [--verbose]
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { checkSource } from '../src/engine/index.js';

export interface WholedocsFigures {
  lines: string[];
  precision?: number;
  recall?: number;
  knownFalse?: number;
  trueKept?: string;
  unjudged?: number;
}

const shared = resolve(import.meta.dirname, '../../shared/wholedocs');

export function measureWholedocs(verbose: boolean): WholedocsFigures {
  if (!existsSync(join(shared, 'score.py'))) return { lines: [`(../shared/wholedocs not found: skipped)`] };
  const docs = join(shared, 'docs');
  const files = readdirSync(docs).sort().map((f) => {
    const path = join(docs, f);
    const { source: _source, ...report } = checkSource(path, readFileSync(path, 'utf8'));
    return report;
  });
  const out = join(mkdtempSync(join(tmpdir(), 'plumbline-wholedocs-')), 'run.json');
  writeFileSync(out, JSON.stringify({ files }, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v)));
  const text = execFileSync('python3', [join(shared, 'score.py'), out, ...(verbose ? ['--verbose'] : [])], { encoding: 'utf8' });
  const lines = text.trimEnd().split('\n');
  const num = (re: RegExp) => {
    const m = re.exec(text);
    return m ? Number(m[1]) : undefined;
  };
  const figures: WholedocsFigures = { lines };
  const precision = num(/precision over judged findings:\s+([\d.]+)/);
  const recall = num(/Extraction recall: ([\d.]+)/);
  const knownFalse = num(/known false alarms still raised:\s+(\d+)/);
  const unjudged = num(/not in the key \(to be judged\):\s+(\d+)/);
  const kept = /true findings kept:\s+(\d+ of \d+)/.exec(text)?.[1];
  if (precision !== undefined) figures.precision = precision;
  if (recall !== undefined) figures.recall = recall;
  if (knownFalse !== undefined) figures.knownFalse = knownFalse;
  if (unjudged !== undefined) figures.unjudged = unjudged;
  if (kept !== undefined) figures.trueKept = kept;
  return figures;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  console.log(measureWholedocs(process.argv.includes('--verbose')).lines.join('\n'));
}
