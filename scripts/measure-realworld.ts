/**
 * Measures plumbline on the team's real-world set (../shared/realworld, beside the project):
 * every checkable case extracted, every `inconsistent` flagged, no `consistent` flagged.
 * The set is third-party text: it is read from there at run time and never copied here.
 *
 *   npx tsx scripts/measure-realworld.ts [--verbose]
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { checkSource, type FileReport } from '../src/engine/index.js';

interface KeyEntry {
  file: string;
  line: number;
  label: string;
  summary_label: string;
  reported: Record<string, string>;
}

export interface RealworldFigures {
  lines: string[];
  /** Per label: cases, extracted, flagged (p rules), one-tailed notes. */
  byLabel: Record<string, { n: number; extracted: number; flagged: number; oneTailedNote: number }>;
  /** Per summary label: cases, and those the descriptives, df, design or CI rules flagged. */
  bySummary: Record<string, { n: number; flagged: number }>;
}

const shared = resolve(import.meta.dirname, '../../shared/realworld');
const P_RULES = new Set(['p-follows-from-t', 'significance-follows-from-t', 'values-are-possible', 'zero-p-is-a-bound']);
const SUMMARY_RULES = new Set(['t-follows-from-descriptives', 'spread-kind-matches-t', 'df-follows-from-n', 'design-matches-analysis', 'paired-correlation-is-possible', 'ci-agrees-with-result']);

export function measureRealworld(verbose: boolean): RealworldFigures {
  const lines: string[] = [];
  const byLabel: RealworldFigures['byLabel'] = {};
  const bySummary: RealworldFigures['bySummary'] = {};
  if (!existsSync(join(shared, 'build_docs.py'))) return { lines: ['(../shared/realworld not found: skipped)'], byLabel, bySummary };
  const out = mkdtempSync(join(tmpdir(), 'plumbline-realworld-'));
  execFileSync('python3', [join(shared, 'build_docs.py'), out], { stdio: 'ignore' });
  const key = JSON.parse(readFileSync(join(out, 'answer_key.json'), 'utf8')) as Record<string, KeyEntry>;
  const reports = new Map<string, FileReport>();
  for (const f of readdirSync(out).filter((f) => f.endsWith('.md'))) reports.set(f, checkSource(f, readFileSync(join(out, f), 'utf8')));

  for (const [id, k] of Object.entries(key)) {
    const rep = reports.get(k.file) as FileReport;
    const tValue = Math.abs(Number((k.reported.t ?? 'NaN').replace('−', '-')));
    const results = rep.results.filter((r) => r.start.line === k.line && Math.abs(r.t.value) === tValue);
    const findings = rep.findings.filter((f) => f.start.line === k.line && f.level !== 'note');
    const flagged = findings.filter((f) => P_RULES.has(f.ruleId));
    const note = rep.findings.filter((f) => f.start.line === k.line && f.ruleId === 'one-tailed-p-is-declared');
    const summaryFlags = findings.filter((f) => SUMMARY_RULES.has(f.ruleId));
    const s = (bySummary[k.summary_label] ??= { n: 0, flagged: 0 });
    s.n += 1;
    if (summaryFlags.length > 0) s.flagged += 1;
    if ((k.summary_label === 'reachable' && summaryFlags.length > 0) || (k.summary_label === 'not-reachable' && summaryFlags.length === 0)) {
      lines.push(`!! ${id} summary ${k.summary_label}: ${summaryFlags.map((f) => `${f.ruleId}/${f.messageId}`).join(' ') || 'not flagged'}`);
    }
    const t = (byLabel[k.label] ??= { n: 0, extracted: 0, flagged: 0, oneTailedNote: 0 });
    t.n += 1;
    if (results.length > 0) t.extracted += 1;
    if (flagged.length > 0) t.flagged += 1;
    if (note.length > 0) t.oneTailedNote += 1;
    const surprising = (k.label === 'consistent' && flagged.length > 0) || (k.label === 'inconsistent' && flagged.length === 0) || (results.length === 0 && k.label !== 'not-checkable' && k.label !== 'ambiguous');
    if (verbose || surprising) lines.push(`${surprising ? '!!' : '  '} ${id} ${k.label} extracted=${results.length} ${findings.map((f) => `${f.ruleId}/${f.messageId}`).join(' ')}`);
  }
  lines.push('', 'label                      cases extracted flagged one-tailed-note');
  for (const [label, t] of Object.entries(byLabel)) {
    lines.push(`${label.padEnd(26)} ${String(t.n).padStart(5)} ${String(t.extracted).padStart(9)} ${String(t.flagged).padStart(7)} ${String(t.oneTailedNote).padStart(15)}`);
  }
  lines.push('', 'summary label              cases flagged (descriptives, df, design, CI rules; warnings and errors)');
  for (const [label, t] of Object.entries(bySummary)) lines.push(`${label.padEnd(26)} ${String(t.n).padStart(5)} ${String(t.flagged).padStart(7)}`);
  return { lines, byLabel, bySummary };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  console.log(measureRealworld(process.argv.includes('--verbose')).lines.join('\n'));
}
