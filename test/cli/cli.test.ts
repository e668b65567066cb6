import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BIN, cli } from './harness.js';
import { RULES } from '../../src/engine/index.js';
import { readReport } from '../helpers.js';

function tempTree(files: Record<string, string>): string {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-cli-'));
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), text);
  }
  return dir;
}

const WRONG = 'Alertness rose, t(23) = 1.12, p = .42.\n';
const FLIPPED = 'Coffee did not differ, t(46) = 0.84, p = .04.\n';
const RIGHT = 'Fatigue fell, t(23) = 2.47, p = .021.\n';

describe('the demo manuscript', () => {
  it('gives exactly the findings its invented results were written to show', async () => {
    const out = await cli(['fixtures/demo/standing-desks.md', '--format', 'json']);
    expect(out.code).toBe(1);
    const report = readReport(out.stdout);
    const found = report.files[0].findings.map((f: { start: { line: number; column: number }; level: string; ruleId: string; messageId: string }) =>
      `${f.start.line}:${f.start.column} ${f.level} ${f.ruleId}/${f.messageId}`);
    expect(found).toEqual([
      '20:50 warning p-follows-from-t/mismatch',
      '26:53 note one-tailed-p-is-declared/undeclared-one-tailed-changes-significance',
      '28:12 error significance-follows-from-t/mismatch',
      '30:51 warning zero-p-is-a-bound/p-printed-as-zero',
      '30:88 note result-is-complete/p-missing',
      '31:81 note result-is-complete/t-missing',
      '47:24 error significance-follows-from-t/mismatch',
    ]);
    expect(report.summary).toMatchObject({ files: 1, results: 13, checked: 12, error: 2, warning: 2, note: 3 });
  });

  it('prints the human report with the statistic underlined and the cautions', async () => {
    const out = await cli(['fixtures/demo/standing-desks.md']);
    expect(out.stdout).toContain('28:12    error   significance-follows-from-t');
    expect(out.stdout).toContain('    28 | reliably, *t*(46) = 0.84, *p* = .04.\n       |            ^^^^^^^^^^^^^^^^^^^^^^^^\n');
    expect(out.stdout).toContain('A clean run does not validate a study');
  });
});

describe('the descriptives demo manuscript', () => {
  it('finds each kind of error its invented results were written to show, and nothing else', async () => {
    const out = await cli(['fixtures/demo/hand-hygiene.md', '--format', 'json']);
    const report = readReport(out.stdout);
    const found = report.files[0].findings.map((f: { start: { line: number; column: number }; ruleId: string; messageId: string }) =>
      `${f.start.line}:${f.start.column} ${f.ruleId}/${f.messageId}`);
    expect(found).toEqual([
      '21:54 spread-kind-matches-t/se-labelled-sd',
      '24:40 df-follows-from-n/student',
      '30:42 design-matches-analysis/paired-analysed-as-independent',
      '33:23 paired-correlation-is-possible/correlation-above-one',
      '35:62 ci-agrees-with-result/width-vs-t',
      '39:5 mean-is-possible-for-integers/grim-mean',
      '41:38 percentage-matches-count/percent-mismatch',
      '43:29 spread-kind-is-stated/unstated-spread',
      '51:1 effect-size-follows/mismatch',
    ]);
    // the correct results were recomputed from their descriptives, not skipped
    const results = report.files[0].results;
    expect(results.filter((r: { context: { descriptives?: unknown } }) => r.context.descriptives).length).toBe(7);
    expect(results.find((r: { start: { line: number } }) => r.start.line === 50).context.descriptives.scope).toBe('table');
  });
});

describe('exit codes', () => {
  it('0 when nothing is at error level', async () => {
    const dir = tempTree({ 'a.md': RIGHT + WRONG });
    expect((await cli([join(dir, 'a.md')])).code).toBe(0);
  });
  it('1 when a finding is at error level', async () => {
    const dir = tempTree({ 'a.md': FLIPPED });
    expect((await cli([join(dir, 'a.md')])).code).toBe(1);
  });
  it('1 when warnings exceed --max-warnings', async () => {
    const dir = tempTree({ 'a.md': WRONG });
    expect((await cli([join(dir, 'a.md'), '--max-warnings', '0'])).code).toBe(1);
    expect((await cli([join(dir, 'a.md'), '--max-warnings', '1'])).code).toBe(0);
  });
  it('2 for a missing file, naming it, while the other files are still checked', async () => {
    const dir = tempTree({ 'a.md': FLIPPED });
    const out = await cli([join(dir, 'nope.md'), join(dir, 'a.md'), '--format', 'json']);
    expect(out.code).toBe(2);
    expect(out.stderr).toContain(`${join(dir, 'nope.md')}: no such file or folder`);
    const report = readReport(out.stdout);
    expect(report.files).toHaveLength(1);
    expect(report.files[0].findings[0].ruleId).toBe('significance-follows-from-t');
    expect(report.failures).toEqual([{ path: join(dir, 'nope.md'), message: 'no such file or folder' }]);
  });
  it('2 for usage errors', async () => {
    expect((await cli([])).code).toBe(2);
    expect((await cli(['--format', 'xml', 'a.md'])).code).toBe(2);
    expect((await cli(['--alpha', '5', 'a.md'])).code).toBe(2);
    const unknown = await cli(['--bogus', 'a.md']);
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toContain('bogus');
  });
});

describe('inputs', () => {
  it('walks folders for manuscript extensions, skipping node_modules and dot-folders', async () => {
    const dir = tempTree({
      'paper.md': FLIPPED,
      'notes/draft.txt': FLIPPED,
      'notes/analysis.Rmd': FLIPPED,
      'notes/book.qmd': FLIPPED,
      'notes/other.markdown': FLIPPED,
      'notes/data.csv': FLIPPED,
      'node_modules/pkg/readme.md': FLIPPED,
      '.git/x.md': FLIPPED,
    });
    const out = await cli([dir, '--format', 'json']);
    const paths = readReport(out.stdout).files.map((f: { path: string }) => f.path.slice(dir.length + 1));
    expect(paths).toEqual(['notes/analysis.Rmd', 'notes/book.qmd', 'notes/draft.txt', 'notes/other.markdown', 'paper.md']);
  });
  it('expands a quoted glob', async () => {
    const dir = tempTree({ 'a.md': FLIPPED, 'b.md': RIGHT, 'c.txt': FLIPPED });
    const out = await cli([`${dir}/*.md`, '--format', 'json']);
    expect(readReport(out.stdout).files.map((f: { path: string }) => f.path)).toEqual([join(dir, 'a.md'), join(dir, 'b.md')]);
  });
  it('reads standard input under the given name', async () => {
    const out = await cli(['-', '--stdin-name', 'draft.txt', '--format', 'json'], { stdin: 'The effect was signifi-\ncant, t(46) = 0.84, p = .04.\n' });
    const file = readReport(out.stdout).files[0];
    expect(file.path).toBe('draft.txt');
    expect(file.format).toBe('text');
    expect(file.findings[0].start).toEqual({ line: 2, column: 7 });
  });
});

describe('settings', () => {
  it('--alpha and --tails apply where the text is silent', async () => {
    const dir = tempTree({ 'a.md': 'x, t(30) = 3.25, p = 0.0014.\n' });
    const two = readReport((await cli([join(dir, 'a.md'), '--format', 'json'])).stdout);
    expect(two.files[0].findings.map((f: { ruleId: string }) => f.ruleId)).toEqual(['one-tailed-p-is-declared']);
    const one = readReport((await cli([join(dir, 'a.md'), '--format', 'json', '--tails', 'one'])).stdout);
    expect(one.files[0].findings).toEqual([]);
  });
  it('finds configuration upward from the file and applies rule levels', async () => {
    const dir = tempTree({ '.plumbline.json': '{"rules": {"significance-follows-from-t": "warning"}}', 'sub/a.md': FLIPPED });
    const out = await cli([join(dir, 'sub/a.md'), '--format', 'json']);
    expect(out.code).toBe(0);
    expect(readReport(out.stdout).files[0].findings[0].level).toBe('warning');
  });
  it('reads YAML configuration', async () => {
    const dir = tempTree({ '.plumbline.yaml': 'rules:\n  significance-follows-from-t: "off"\n', 'a.md': FLIPPED });
    expect(readReport((await cli([join(dir, 'a.md'), '--format', 'json'])).stdout).files[0].findings).toEqual([]);
  });
  it('a JSON syntax error is reported with its line and column (exit 2)', async () => {
    const dir = tempTree({ '.plumbline.json': '{\n  "alpha": 0.05,\n  "rules": { oops }\n}\n', 'a.md': FLIPPED });
    const out = await cli([join(dir, 'a.md')]);
    expect(out.code).toBe(2);
    expect(out.stderr).toMatch(new RegExp(`${join(dir, '.plumbline.json').replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}:3:\\d+: configuration: invalid JSON`));
    expect(out.stdout).not.toContain('invalid JSON');
  });
  it('an unknown rule id is named with the nearest valid one', async () => {
    const dir = tempTree({ '.plumbline.json': '{"rules": {"p-follow-from-t": "error"}}', 'a.md': FLIPPED });
    const out = await cli([join(dir, 'a.md'), '--format', 'json']);
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('unknown rule "p-follow-from-t" in "rules" (did you mean "p-follows-from-t"?)');
  });
  it('an unknown key and a bad level are named', async () => {
    const dir = tempTree({ 'c.json': '{"alfa": 0.05, "rules": {"p-follows-from-t": "loud"}}', 'a.md': FLIPPED });
    const out = await cli([join(dir, 'a.md'), '--config', join(dir, 'c.json')]);
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('unknown key "alfa" at the top level (did you mean "alpha"?)');
    expect(out.stderr).toContain('"rules.p-follows-from-t" must be one of: off, note, warning, error');
  });
});

describe('commands', () => {
  it('explain prints a rule page', async () => {
    const out = await cli(['explain', 'p-follows-from-t']);
    expect(out.code).toBe(0);
    expect(out.stdout).toMatch(/^# p-follows-from-t\n/);
  });
  it('explain with an unknown rule exits 2', async () => {
    const out = await cli(['explain', 'nope']);
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('no rule "nope"');
  });
  it('rules lists every rule', async () => {
    const out = await cli(['rules']);
    expect(out.stdout.split('\n').filter(Boolean)).toHaveLength(RULES.length);
  });
});

describe('colour', () => {
  it('on a terminal by default, off with NO_COLOR, off when not a terminal', async () => {
    const args = ['fixtures/demo/standing-desks.md'];
    expect((await cli(args, { isTTY: true })).stdout).toMatch(/\u001b\[/);
    expect((await cli(args, { isTTY: true, env: { NO_COLOR: '1' } })).stdout).not.toMatch(/\u001b\[/);
    expect((await cli(args, { isTTY: false })).stdout).not.toMatch(/\u001b\[/);
  });
});

describe('the installed command', () => {
  it('runs from dist as `plumbline` would after npm ci', () => {
    const result = spawnSync(process.execPath, [BIN, 'fixtures/demo/standing-desks.md', '--format', 'sarif'], { encoding: 'utf8' });
    expect(result.status).toBe(1);
    expect(readReport(result.stdout).version).toBe('2.1.0');
    expect(execFileSync(process.execPath, [BIN, '--version'], { encoding: 'utf8' }).trim()).toMatch(/^\d+\.\d+\.\d+$/);
  });
});
