/**
 * Measures plumbline on the team's real-world set (../shared/realworld, beside the project):
 * every checkable case extracted, every `inconsistent` flagged, no `consistent` flagged.
 * The set is third-party text: it is read from there at run time and never copied here.
 *
 *   npx tsx scripts/measure-realworld.ts [--verbose]
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { checkSource, type FileReport } from '../src/engine/index.js';

interface KeyEntry {
  file: string;
  line: number;
  label: string;
  reported: Record<string, string>;
}

const shared = resolve(import.meta.dirname, '../../shared/realworld');
const out = mkdtempSync(join(tmpdir(), 'plumbline-realworld-'));
execFileSync('python3', [join(shared, 'build_docs.py'), out], { stdio: 'ignore' });
const key = JSON.parse(readFileSync(join(out, 'answer_key.json'), 'utf8')) as Record<string, KeyEntry>;
const reports = new Map<string, FileReport>();
for (const f of readdirSync(out).filter((f) => f.endsWith('.md'))) reports.set(f, checkSource(f, readFileSync(join(out, f), 'utf8')));

const verbose = process.argv.includes('--verbose');
const NUMBER_RULES = new Set(['p-follows-from-t', 'significance-follows-from-t', 'values-are-possible', 'zero-p-is-a-bound']);
const tally: Record<string, { n: number; extracted: number; flagged: number; oneTailedNote: number }> = {};
const summaryTally: Record<string, { n: number; flagged: number }> = {};
for (const [id, k] of Object.entries(key)) {
  const rep = reports.get(k.file) as FileReport;
  const tValue = Math.abs(Number((k.reported.t ?? 'NaN').replace('−', '-')));
  const results = rep.results.filter((r) => r.start.line === k.line && Math.abs(r.t.value) === tValue);
  const findings = rep.findings.filter((f) => f.start.line === k.line);
  const flagged = findings.filter((f) => NUMBER_RULES.has(f.ruleId));
  const note = findings.filter((f) => f.ruleId === 'one-tailed-p-is-declared');
  const SUMMARY_RULES = new Set(['t-follows-from-descriptives', 'spread-kind-matches-t', 'df-follows-from-n', 'design-matches-analysis', 'paired-correlation-is-possible', 'ci-agrees-with-result']);
  const summaryFlags = findings.filter((f) => SUMMARY_RULES.has(f.ruleId));
  const s = (summaryTally[(k as KeyEntry & { summary_label: string }).summary_label] ??= { n: 0, flagged: 0 });
  s.n += 1;
  if (summaryFlags.length > 0) s.flagged += 1;
  const summarySurprise = ((k as KeyEntry & { summary_label: string }).summary_label === 'reachable' && summaryFlags.length > 0) || ((k as KeyEntry & { summary_label: string }).summary_label === 'not-reachable' && summaryFlags.length === 0);
  if (summarySurprise) console.log(`!! ${id} summary ${(k as KeyEntry & { summary_label: string }).summary_label}: ${summaryFlags.map((f) => `${f.ruleId}/${f.messageId}`).join(' ') || 'not flagged'}`);
  const t = (tally[k.label] ??= { n: 0, extracted: 0, flagged: 0, oneTailedNote: 0 });
  t.n += 1;
  if (results.length > 0) t.extracted += 1;
  if (flagged.length > 0) t.flagged += 1;
  if (note.length > 0) t.oneTailedNote += 1;
  const surprising = (k.label === 'consistent' && flagged.length > 0) || (k.label === 'inconsistent' && flagged.length === 0) || (results.length === 0 && k.label !== 'not-checkable' && k.label !== 'ambiguous');
  if (verbose || surprising) {
    console.log(`${surprising ? '!!' : '  '} ${id} ${k.label} extracted=${results.length} ${findings.map((f) => `${f.ruleId}/${f.messageId}`).join(' ')}`);
  }
}
console.log('\nlabel                      cases extracted flagged one-tailed-note');
for (const [label, t] of Object.entries(tally)) {
  console.log(`${label.padEnd(26)} ${String(t.n).padStart(5)} ${String(t.extracted).padStart(9)} ${String(t.flagged).padStart(7)} ${String(t.oneTailedNote).padStart(15)}`);
}
console.log('\nsummary label              cases flagged (descriptives, df, design, CI rules)');
for (const [label, t] of Object.entries(summaryTally)) console.log(`${label.padEnd(26)} ${String(t.n).padStart(5)} ${String(t.flagged).padStart(7)}`);
