/**
 * Measures plumbline on the invented manuscripts in fixtures/generated (written by
 * scripts/generate_manuscripts.py, which knows nothing of plumbline's code): recall per seeded
 * error type, and false alarms per house style and per report style.
 *
 * A finding belongs to a case when its span overlaps one of the case's printed parts. An erroneous
 * case is found when a finding of one of its expected rules, at error or warning level (or note,
 * when the key expects a note), overlaps it. A correct case is a false alarm when any error- or
 * warning-level finding overlaps it, unless that finding is explained by an erroneous case it also
 * overlaps (same place, expected rule). Error- and warning-level findings overlapping no case are
 * counted as unattributed, and those on the F, χ², r, z, regression and t-less p results as
 * findings on distractors.
 *
 *   npx tsx scripts/measure-generated.ts [--verbose]
 */
import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { checkSource, type Finding } from '../src/engine/index.js';

interface Part {
  role: string;
  start: number;
  end: number;
}

interface KeyCase {
  id: string;
  file: string;
  house_style: string;
  report_style: string;
  design: string;
  error: string | null;
  expect_rules: string[];
  expect_level: 'warning' | 'note';
  parts: Part[];
}

interface KeyDistractor {
  id: string;
  file: string;
  house_style: string;
  kind: string;
  /** F, χ², r and z results may carry a seeded error, with the rules expected to find it. */
  error?: string;
  expect_rules?: string[];
  parts: Part[];
}

interface Key {
  generator: string;
  seed: number;
  versions: Record<string, string>;
  cases: KeyCase[];
  distractors: KeyDistractor[];
}

export interface GeneratedFigures {
  lines: string[];
  recallByType: Record<string, { n: number; found: number }>;
  falseAlarmsByHouseStyle: Record<string, { correct: number; flagged: number }>;
  falseAlarmsByReportStyle: Record<string, { correct: number; flagged: number }>;
  unattributed: number;
  onDistractors: number;
  /** Seeded errors in F, χ², r and z results, per error type. */
  statisticRecallByType: Record<string, { n: number; found: number }>;
  /** Correct F, χ², r, z (and regression, t-less p) results with an error or warning on them, per kind. */
  statisticFalseAlarmsByKind: Record<string, { correct: number; flagged: number }>;
}

/** Goals the figures are read against. */
const RECALL_GOAL = 0.95;
const FALSE_ALARM_GOAL = 0.005;

const root = resolve(import.meta.dirname, '../fixtures/generated');

const overlaps = (f: { span: { start: number; end: number } }, parts: Part[]): boolean =>
  parts.some((p) => f.span.start < p.end && p.start < f.span.end);

const serious = (f: Finding): boolean => f.level === 'error' || f.level === 'warning';

const pct = (num: number, den: number): string => (den === 0 ? '   –  ' : `${((100 * num) / den).toFixed(1).padStart(5)}%`);

export function measureGenerated(verbose: boolean): GeneratedFigures {
  const key = JSON.parse(readFileSync(join(root, 'key.json'), 'utf8')) as Key;
  const lines: string[] = [];
  const byFile = new Map<string, { cases: KeyCase[]; distractors: KeyDistractor[] }>();
  for (const c of key.cases) {
    const e = byFile.get(c.file) ?? { cases: [], distractors: [] };
    e.cases.push(c);
    byFile.set(c.file, e);
  }
  for (const d of key.distractors) {
    const e = byFile.get(d.file) ?? { cases: [], distractors: [] };
    e.distractors.push(d);
    byFile.set(d.file, e);
  }

  const recallByType: GeneratedFigures['recallByType'] = {};
  const falseAlarmsByHouseStyle: GeneratedFigures['falseAlarmsByHouseStyle'] = {};
  const falseAlarmsByReportStyle: GeneratedFigures['falseAlarmsByReportStyle'] = {};
  let unattributed = 0;
  let onDistractors = 0;
  const statisticRecallByType: GeneratedFigures['statisticRecallByType'] = {};
  const statisticFalseAlarmsByKind: GeneratedFigures['statisticFalseAlarmsByKind'] = {};
  const misses: string[] = [];
  const alarms: string[] = [];
  const strays: string[] = [];

  for (const [file, { cases, distractors }] of [...byFile.entries()].sort(([a], [b]) => a.localeCompare(b))) {
    const path = join(root, file);
    const report = checkSource(`fixtures/generated/${file}`, readFileSync(path, 'utf8'));
    const findings = report.findings;
    const place = (f: Finding): string => `${file}:${f.start.line}:${f.start.column}`;
    const lineOf = (offset: number): number => report.source.slice(0, offset).split('\n').length;

    // which findings each erroneous case explains
    const explained = new Set<Finding>();
    for (const c of cases) {
      if (c.error === null) continue;
      const levels = c.expect_level === 'note' ? ['error', 'warning', 'note'] : ['error', 'warning'];
      const hits = findings.filter((f) => c.expect_rules.includes(f.ruleId) && levels.includes(f.level) && overlaps(f, c.parts));
      for (const f of hits) explained.add(f);
      const r = (recallByType[c.error] ??= { n: 0, found: 0 });
      r.n += 1;
      if (hits.length > 0) r.found += 1;
      else if (verbose) {
        const near = findings.filter((f) => overlaps(f, c.parts)).map((f) => `${f.ruleId}/${f.level}`);
        const first = Math.min(...c.parts.map((p) => p.start));
        misses.push(`miss  ${c.error.padEnd(36)} ${file}:${lineOf(first)} ${c.id} (${c.report_style}) ${near.length ? `found instead: ${near.join(', ')}` : 'nothing found there'}`);
      }
    }
    for (const c of cases) {
      if (c.error !== null) continue;
      const h = (falseAlarmsByHouseStyle[c.house_style] ??= { correct: 0, flagged: 0 });
      const s = (falseAlarmsByReportStyle[c.report_style] ??= { correct: 0, flagged: 0 });
      h.correct += 1;
      s.correct += 1;
      const bad = findings.filter((f) => serious(f) && !explained.has(f) && overlaps(f, c.parts));
      if (bad.length > 0) {
        h.flagged += 1;
        s.flagged += 1;
        if (verbose) for (const f of bad) alarms.push(`false alarm  ${place(f)} ${c.id} (${c.report_style}) ${f.ruleId}: ${f.message.replace(/\s+/g, ' ')}`);
      }
    }
    // the seeded errors of F, χ², r and z results, found by their expected rules
    for (const d of distractors) {
      if (!d.error) continue;
      const hits = findings.filter((f) => serious(f) && (d.expect_rules ?? []).includes(f.ruleId) && overlaps(f, d.parts));
      for (const f of hits) explained.add(f);
      const r = (statisticRecallByType[d.error] ??= { n: 0, found: 0 });
      r.n += 1;
      if (hits.length > 0) r.found += 1;
      else if (verbose) {
        const near = findings.filter((f) => overlaps(f, d.parts)).map((f) => `${f.ruleId}/${f.level}`);
        misses.push(`miss  ${d.error.padEnd(36)} ${file}:${lineOf(Math.min(...d.parts.map((p) => p.start)))} ${d.id} ${near.length ? `found instead: ${near.join(', ')}` : 'nothing found there'}`);
      }
    }
    for (const d of distractors) {
      if (d.error) continue;
      const k = (statisticFalseAlarmsByKind[d.kind] ??= { correct: 0, flagged: 0 });
      k.correct += 1;
      if (findings.some((f) => serious(f) && overlaps(f, d.parts))) k.flagged += 1;
    }
    for (const f of findings) {
      if (!serious(f) || explained.has(f)) continue;
      if (cases.some((c) => overlaps(f, c.parts))) continue;
      const d = distractors.find((x) => overlaps(f, x.parts));
      if (d) {
        onDistractors += 1;
        if (verbose) strays.push(`on distractor (${d.kind})  ${place(f)} ${f.ruleId}: ${f.message.replace(/\s+/g, ' ')}`);
      } else {
        unattributed += 1;
        if (verbose) strays.push(`unattributed  ${place(f)} ${f.ruleId}: ${f.message.replace(/\s+/g, ' ')}`);
      }
    }
  }

  lines.push(`plumbline on ${byFile.size} invented manuscripts (${key.generator}, seed ${key.seed}; Python ${key.versions.python}, numpy ${key.versions.numpy}, scipy ${key.versions.scipy})`);
  lines.push('');
  lines.push(`recall per seeded error type (goal >= ${RECALL_GOAL})`);
  lines.push(`${'error type'.padEnd(38)} ${'cases'.padStart(5)} ${'found'.padStart(5)} ${'recall'.padStart(7)}  goal`);
  let allRecall = true;
  for (const [type, r] of Object.entries(recallByType).sort(([a], [b]) => a.localeCompare(b))) {
    const rec = r.n ? r.found / r.n : 0;
    const met = rec >= RECALL_GOAL;
    allRecall &&= met;
    lines.push(`${type.padEnd(38)} ${String(r.n).padStart(5)} ${String(r.found).padStart(5)} ${rec.toFixed(3).padStart(7)}  ${met ? 'met' : 'not met'}`);
  }
  const table = (title: string, rows: Record<string, { correct: number; flagged: number }>): boolean => {
    lines.push('');
    lines.push(`false alarms per ${title} (correct cases with an error or warning on them; goal <= ${(100 * FALSE_ALARM_GOAL).toFixed(1)}%)`);
    lines.push(`${title.padEnd(38)} ${'correct'.padStart(7)} ${'flagged'.padStart(7)} ${'rate'.padStart(6)}  goal`);
    let all = true;
    for (const [name, r] of Object.entries(rows).sort(([a], [b]) => a.localeCompare(b))) {
      const met = r.flagged / Math.max(r.correct, 1) <= FALSE_ALARM_GOAL;
      all &&= met;
      lines.push(`${name.padEnd(38)} ${String(r.correct).padStart(7)} ${String(r.flagged).padStart(7)} ${pct(r.flagged, r.correct)}  ${met ? 'met' : 'not met'}`);
    }
    return all;
  };
  const allHouse = table('house style', falseAlarmsByHouseStyle);
  table('report style', falseAlarmsByReportStyle);
  const totalCorrect = Object.values(falseAlarmsByHouseStyle).reduce((a, r) => a + r.correct, 0);
  const totalFlagged = Object.values(falseAlarmsByHouseStyle).reduce((a, r) => a + r.flagged, 0);
  const totalErr = Object.values(recallByType).reduce((a, r) => a + r.n, 0);
  const totalFound = Object.values(recallByType).reduce((a, r) => a + r.found, 0);
  lines.push('');
  lines.push(`all erroneous cases: ${totalFound} of ${totalErr} found (${pct(totalFound, totalErr).trim()}); all correct cases: ${totalFlagged} of ${totalCorrect} flagged (${pct(totalFlagged, totalCorrect).trim()})`);
  lines.push(`errors and warnings on no case: ${unattributed}; on distractors (F, χ², r, z, regression, t-less p) beyond their seeded errors: ${onDistractors}`);
  lines.push('');
  lines.push(`F, χ², r and z results: recall per seeded error type (goal >= ${RECALL_GOAL})`);
  lines.push(`${'error type'.padEnd(38)} ${'cases'.padStart(5)} ${'found'.padStart(5)} ${'recall'.padStart(7)}  goal`);
  let statRecall = true;
  for (const [type, r] of Object.entries(statisticRecallByType).sort(([a], [b]) => a.localeCompare(b))) {
    const rec = r.n ? r.found / r.n : 0;
    const met = rec >= RECALL_GOAL;
    statRecall &&= met;
    lines.push(`${type.padEnd(38)} ${String(r.n).padStart(5)} ${String(r.found).padStart(5)} ${rec.toFixed(3).padStart(7)}  ${met ? 'met' : 'not met'}`);
  }
  lines.push('');
  lines.push(`F, χ², r and z results: false alarms per kind (correct results with an error or warning on them; goal <= ${(100 * FALSE_ALARM_GOAL).toFixed(1)}%)`);
  lines.push(`${'kind'.padEnd(38)} ${'correct'.padStart(7)} ${'flagged'.padStart(7)} ${'rate'.padStart(6)}  goal`);
  let statAlarms = true;
  for (const [kind, r] of Object.entries(statisticFalseAlarmsByKind).sort(([a], [b]) => a.localeCompare(b))) {
    const met = r.flagged / Math.max(r.correct, 1) <= FALSE_ALARM_GOAL;
    statAlarms &&= met;
    lines.push(`${kind.padEnd(38)} ${String(r.correct).padStart(7)} ${String(r.flagged).padStart(7)} ${pct(r.flagged, r.correct)}  ${met ? 'met' : 'not met'}`);
  }
  lines.push(`F, χ², r and z goals: recall ${statRecall ? 'met' : 'not met'} for every error type; false alarms ${statAlarms ? 'met' : 'not met'} for every kind`);
  lines.push(`goals: recall ${allRecall ? 'met' : 'not met'} for every error type; false alarms ${allHouse ? 'met' : 'not met'} in every house style`);
  if (verbose) {
    lines.push('');
    lines.push(...misses, ...alarms, ...strays);
  }
  return { lines, recallByType, falseAlarmsByHouseStyle, falseAlarmsByReportStyle, unattributed, onDistractors, statisticRecallByType, statisticFalseAlarmsByKind };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  for (const line of measureGenerated(process.argv.includes('--verbose')).lines) console.log(line);
}
