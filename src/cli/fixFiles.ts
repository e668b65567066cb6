import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { FileReport } from '../engine/index.js';
import { applyFixes } from '../fix/apply.js';
import { unifiedDiff } from '../fix/diff.js';
import { describeError } from './files.js';
import { openRegularFile } from './output.js';

export interface FixOutcome {
  /** The unified diff of every file (`diff`), or empty. */
  diff: string;
  /** Lines for standard error: what was fixed, what was left and why. */
  said: string[];
  /** A file could not be written. */
  failed: boolean;
}

/**
 * Apply (or, for `diff`, only show) the safe fixes of each checked file. A file is written only
 * when its bytes are still exactly the UTF-8 text that was checked (not edited since, not in
 * another encoding), and atomically, as -o
 * writes a report. Standard input is never fixed.
 */
export function fixFiles(reports: readonly FileReport[], cwd: string, mode: 'apply' | 'diff', stdinName?: string): FixOutcome {
  let diff = '';
  const said: string[] = [];
  let failed = false;
  for (const report of reports) {
    if (stdinName !== undefined && report.path === stdinName) continue;
    const { text, applied, skipped } = applyFixes(report.source, report.findings);
    for (const s of skipped) said.push(`plumbline: ${report.path}: fix "${s.fix.id}" of ${s.ruleId} left out: ${s.reason}`);
    if (applied.length === 0) continue;
    const path = resolve(cwd, report.path);
    let bytes: Buffer;
    try {
      bytes = readFileSync(path);
    } catch (e) {
      said.push(`plumbline: ${report.path}: not fixed: ${describeError(e)}`);
      failed = true;
      continue;
    }
    if (!bytes.equals(Buffer.from(report.source, 'utf8'))) {
      said.push(`plumbline: ${report.path}: not fixed: the file changed since it was checked, or is not written in UTF-8 (a rewrite would change its encoding)`);
      continue;
    }
    if (mode === 'diff') {
      diff += unifiedDiff(report.path, report.source, text);
      continue;
    }
    try {
      const sink = openRegularFile(path, cwd);
      try {
        sink.write(text);
        sink.commit();
      } catch (e) {
        sink.abort();
        throw e;
      }
    } catch (e) {
      said.push(`plumbline: ${report.path}: not fixed: ${describeError(e)}`);
      failed = true;
      continue;
    }
    said.push(`plumbline: ${report.path}: fixed ${applied.length} (${applied.map((a) => a.fix.id).join(', ')})`);
  }
  return { diff, said, failed };
}
