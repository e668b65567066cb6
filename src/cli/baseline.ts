import { readRegularFile } from '../config/index.js';
import { dirname, posix, relative, resolve, sep } from 'node:path';
import type { FileReport } from '../engine/index.js';

/**
 * A baseline: findings accepted for now, recorded from outside the manuscript (a referee cannot
 * edit it). Each entry is matched by its file and the finding's fingerprint (rule, flagged text,
 * occurrence), never by line, so edits elsewhere in a file keep old findings old. An entry may
 * say why it was accepted.
 */
export interface BaselineEntry {
  /** The manuscript, relative to the baseline file's folder, with "/" separators. */
  path: string;
  rule: string;
  fingerprint: string;
  /** The flagged text when the baseline was written, so a person can find it. */
  text: string;
  /** Why the finding is accepted, e.g. "p is Holm-adjusted, see Methods". */
  reason?: string;
}

export interface Baseline {
  file: string;
  entries: BaselineEntry[];
}

export const BASELINE_FORMAT = 'plumbline-baseline';
export const BASELINE_VERSION = 1;
/** A baseline larger than this is refused (it is data from a repository, perhaps a stranger's). */
const MAX_BASELINE_BYTES = 32 * 1024 * 1024;

export class BaselineError extends Error {}

/** Read and validate a baseline file (a regular file, within the size limit). */
export function readBaseline(file: string): Baseline {
  const r = readRegularFile(file, MAX_BASELINE_BYTES);
  if (!r.ok) {
    if (r.problem === 'folder') throw new BaselineError('is a folder');
    if (r.problem === 'not-regular') throw new BaselineError('not a regular file');
    if (r.problem === 'too-large') throw new BaselineError(`${r.size} bytes is over the limit of ${MAX_BASELINE_BYTES}`);
    const code = (r.error as NodeJS.ErrnoException).code;
    throw new BaselineError(code === 'ENOENT' ? 'no such file (write one with --write-baseline)' : code === 'EACCES' || code === 'EPERM' ? 'permission denied' : 'the file could not be read');
  }
  let data: unknown;
  try {
    data = JSON.parse(r.bytes.toString('utf8').replace(/^\uFEFF/, ''));
  } catch {
    throw new BaselineError('not valid JSON');
  }
  return { file, entries: validEntries(data) };
}

function validEntries(data: unknown): BaselineEntry[] {
  if (typeof data !== 'object' || data === null || Array.isArray(data)) throw new BaselineError('not a baseline: expected an object');
  const d = data as Record<string, unknown>;
  if (d.format !== BASELINE_FORMAT) throw new BaselineError(`not a baseline: "format" must be "${BASELINE_FORMAT}"`);
  if (d.version !== BASELINE_VERSION) throw new BaselineError(`baseline version ${JSON.stringify(d.version)} is not one this plumbline reads (${BASELINE_VERSION})`);
  if (!Array.isArray(d.findings)) throw new BaselineError('"findings" must be a list');
  return d.findings.map((raw, i): BaselineEntry => {
    const e = raw as Record<string, unknown>;
    const bad = (key: string) => new BaselineError(`finding ${i + 1}: "${key}" must be a string`);
    if (typeof e !== 'object' || e === null) throw new BaselineError(`finding ${i + 1}: expected an object`);
    for (const key of ['path', 'rule', 'fingerprint', 'text'] as const) if (typeof e[key] !== 'string') throw bad(key);
    if (e.reason !== undefined && typeof e.reason !== 'string') throw bad('reason');
    return { path: normalPath(e.path as string), rule: e.rule as string, fingerprint: e.fingerprint as string, text: e.text as string, ...(typeof e.reason === 'string' && e.reason !== '' ? { reason: e.reason } : {}) };
  });
}

/** "./a/../b.md" and "b.md" are the same entry. */
function normalPath(path: string): string {
  return posix.normalize(path.replace(/\\/g, '/')).replace(/^\.\//, '');
}

/** A manuscript's path as a baseline records it: relative to the baseline's folder, "/" separated. */
export function baselinePath(baselineFile: string, manuscript: string, cwd: string): string {
  return relative(dirname(resolve(cwd, baselineFile)), resolve(cwd, manuscript)).split(sep).join('/');
}

const key = (path: string, fingerprint: string) => `${path}\u0000${fingerprint}`;

/**
 * Drop the findings the baseline holds from each report (counted in `hidden.baseline`). Returns
 * the reports and how many entries for the files checked matched nothing (fixed, or their text
 * edited); entries for files not checked in this run are not counted.
 */
export function applyBaseline(reports: FileReport[], baseline: Baseline, cwd: string): { reports: FileReport[]; unmatched: number } {
  const held = new Set(baseline.entries.map((e) => key(e.path, e.fingerprint)));
  const checked = new Set(reports.map((r) => baselinePath(baseline.file, r.path, cwd)));
  const relevant = new Set(baseline.entries.filter((e) => checked.has(e.path)).map((e) => key(e.path, e.fingerprint)));
  const matched = new Set<string>();
  const out = reports.map((r) => {
    const path = baselinePath(baseline.file, r.path, cwd);
    const kept = r.findings.filter((f) => {
      const k = key(path, f.fingerprint);
      if (!held.has(k)) return true;
      matched.add(k);
      return false;
    });
    return { ...r, findings: kept, hidden: { ...r.hidden, baseline: r.hidden.baseline + r.findings.length - kept.length } };
  });
  return { reports: out, unmatched: relevant.size - matched.size };
}

/**
 * The baseline for these reports: every finding, in file and reading order. Reasons already
 * given in `previous` for the same finding are kept, so re-recording loses none, and its entries
 * for files not checked in this run are kept as they were.
 */
export function recordBaseline(reports: FileReport[], baselineFile: string, cwd: string, previous?: Baseline): Baseline {
  const reasons = new Map((previous?.entries ?? []).filter((e) => e.reason).map((e) => [key(e.path, e.fingerprint), e.reason as string]));
  const checked = new Set(reports.map((r) => baselinePath(baselineFile, r.path, cwd)));
  const findings: BaselineEntry[] = (previous?.entries ?? []).filter((e) => !checked.has(e.path));
  for (const r of reports) {
    const path = baselinePath(baselineFile, r.path, cwd);
    for (const f of r.findings) {
      const reason = reasons.get(key(path, f.fingerprint));
      findings.push({ path, rule: f.ruleId, fingerprint: f.fingerprint, text: r.source.slice(f.span.start, f.span.end).replace(/\s+/g, ' ').trim(), ...(reason ? { reason } : {}) });
    }
  }
  findings.sort((a, b) => (a.path < b.path ? -1 : a.path > b.path ? 1 : 0));
  return { file: resolve(cwd, baselineFile), entries: findings };
}

/** A baseline as its file holds it (schema/baseline.schema.json). */
export function baselineText(baseline: Baseline): string {
  return `${JSON.stringify({ format: BASELINE_FORMAT, version: BASELINE_VERSION, findings: baseline.entries }, null, 2)}\n`;
}
