import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { applyFixes } from '../../src/fix/apply.js';
import { unifiedDiff } from '../../src/fix/diff.js';
import { cli } from '../cli/harness.js';
import { readReport } from '../helpers.js';

/** The text after every safe fix, with the checklist on (p-precision-is-sensible is a checklist item). */
const fixed = (markdown: string) => applyFixes(markdown, checkSource('x.md', markdown, { checklist: true }).findings).text;

// Two-tailed p of the t values below, from scipy.stats.t.sf (scipy 1.x on this machine):
// t(23) = 5.90 → 5.2e-6; t(30) = 2.5 → .0181; t(28) = 2.10 → .0449.
describe('bound-for-zero (zero-p-is-a-bound)', () => {
  it('p = .000 becomes p < .001 when t and df give a p below .0005', () => {
    expect(fixed('Scores rose, t(23) = 5.90, p = .000.\n')).toBe('Scores rose, t(23) = 5.90, p < .001.\n');
  });
  it('keeps the markup around the p and the number of decimals printed', () => {
    expect(fixed('Scores rose, *t*(23) = 5.90, *p* = 0.0000.\n')).toBe('Scores rose, *t*(23) = 5.90, *p* < 0.0001.\n');
  });
  it('a wrong p is never fixed: t(28) = 2.10 gives p near .045, not below .0005', () => {
    const text = 'Scores rose, t(28) = 2.10, p = .000.\n';
    expect(fixed(text)).toBe(text);
  });
  it('p = 0 says only p < .5: no bound of .001 is written for it', () => {
    const text = 'Scores rose, t(23) = 5.90, p = 0.\n';
    expect(fixed(text)).toBe(text);
  });
});

describe('three-decimals (p-precision-is-sensible)', () => {
  it('p = .01823 becomes p = .018', () => {
    expect(fixed('Typing improved, t(30) = 2.5, p = .01823.\n')).toBe('Typing improved, t(30) = 2.5, p = .018.\n');
  });
  it('rounds half up on the printed digits', () => {
    // no df: p cannot be recomputed, so only the thresholds decide
    expect(fixed('Typing improved, t = 2.5, p = .02350.\n')).toBe('Typing improved, t = 2.5, p = .024.\n');
  });
  it('never where the rounded p would sit on alpha (.04960 → .050 at alpha .05)', () => {
    const text = 'Typing improved, t = 2.0, p = .04960.\n';
    expect(fixed(text)).toBe(text);
  });
  it('never where a common threshold lies between the two (.00951 → .010 at .01)', () => {
    const text = 'Typing improved, t = 2.7, p = .00951.\n';
    expect(fixed(text)).toBe(text);
  });
  it('never where p does not follow from t and df', () => {
    const text = 'Typing improved, t(30) = 2.5, p = .03823.\n';
    expect(fixed(text)).toBe(text);
  });
});

describe('the applier', () => {
  it('leaves a fix out when the text at its place is not what the rule read', () => {
    const text = 'Scores rose, t(23) = 5.90, p = .000.\n';
    const findings = checkSource('x.md', text).findings;
    const edited = text.replace('.000', ',000');
    const out = applyFixes(edited, findings);
    expect(out.text).toBe(edited);
    expect(out.skipped.map((s) => s.fix.id)).toEqual(['bound-for-zero']);
  });
  it('applies each of several fixes in one pass, offsets taken from the original text', () => {
    const text = 'A, t(23) = 5.90, p = .000; B, t(30) = 2.5, p = .01823; C, t(23) = 5.90, p = .000.\n';
    expect(fixed(text)).toBe('A, t(23) = 5.90, p < .001; B, t(30) = 2.5, p = .018; C, t(23) = 5.90, p < .001.\n');
  });
});

describe('unified diff', () => {
  it('writes hunks as diff -u does, with three lines of context (format: GNU diffutils manual, "Unified Format")', () => {
    const before = ['1', '2', '3', '4', 'p = .000', '6', '7', '8', '9', '10', '11', '12', 'p = .000'].join('\n') + '\n';
    const after = before.replaceAll('p = .000', 'p < .001');
    expect(unifiedDiff('m.md', before, after)).toBe(
      ['--- a/m.md', '+++ b/m.md', '@@ -2,7 +2,7 @@', ' 2', ' 3', ' 4', '-p = .000', '+p < .001', ' 6', ' 7', ' 8', '@@ -10,4 +10,4 @@', ' 10', ' 11', ' 12', '-p = .000', '+p < .001', ''].join('\n'),
    );
  });
  it('is empty when nothing changes', () => {
    expect(unifiedDiff('m.md', 'a\n', 'a\n')).toBe('');
  });
});

describe('--fix and --fix-dry-run', () => {
  const manuscript = 'Scores rose, t(23) = 5.90, p = .000.\n';
  it('--fix-dry-run prints the diff and leaves the file as it was', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pl-fix-'));
    writeFileSync(join(dir, 'm.md'), manuscript);
    const out = await cli(['--fix-dry-run', 'm.md'], { cwd: dir });
    expect(out.stdout).toBe('--- a/m.md\n+++ b/m.md\n@@ -1,1 +1,1 @@\n-Scores rose, t(23) = 5.90, p = .000.\n+Scores rose, t(23) = 5.90, p < .001.\n');
    expect(out.code).toBe(0);
    expect(readFileSync(join(dir, 'm.md'), 'utf8')).toBe(manuscript);
  });
  it('--fix rewrites the file, says so, and reports on the fixed text', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pl-fix-'));
    writeFileSync(join(dir, 'm.md'), manuscript);
    const out = await cli(['--fix', '-f', 'json', 'm.md'], { cwd: dir });
    expect(readFileSync(join(dir, 'm.md'), 'utf8')).toBe('Scores rose, t(23) = 5.90, p < .001.\n');
    expect(out.stderr).toContain('m.md: fixed 1 (bound-for-zero)');
    const report = readReport(out.stdout) as { files: Array<{ findings: Array<{ ruleId: string }> }> };
    expect(report.files[0]?.findings.map((f) => f.ruleId)).not.toContain('zero-p-is-a-bound');
  });
  it('a UTF-8 byte-order mark is kept', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pl-fix-'));
    writeFileSync(join(dir, 'm.md'), `\ufeff${manuscript}`);
    await cli(['--fix', 'm.md'], { cwd: dir });
    expect(readFileSync(join(dir, 'm.md'), 'utf8')).toBe('\ufeffScores rose, t(23) = 5.90, p < .001.\n');
  });
  it('a UTF-16 file is not rewritten (a rewrite in UTF-8 would change its encoding)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pl-fix-'));
    const bytes = Buffer.from(`\ufeff${manuscript}`, 'utf16le');
    writeFileSync(join(dir, 'm.md'), bytes);
    const out = await cli(['--fix', 'm.md'], { cwd: dir });
    expect(readFileSync(join(dir, 'm.md')).equals(bytes)).toBe(true);
    expect(out.stderr).toContain('m.md: not fixed');
  });
  it('--fix and --fix-dry-run together are refused', async () => {
    const out = await cli(['--fix', '--fix-dry-run', 'm.md']);
    expect(out.code).toBe(2);
  });
});

describe('fixes in the JSON report', () => {
  it('a finding carries its fix as data, valid under schema/report.schema.json (ajv, JSON Schema 2020-12)', async () => {
    const { Ajv2020 } = await import('ajv/dist/2020.js');
    const validate = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
    const dir = mkdtempSync(join(tmpdir(), 'pl-fix-'));
    writeFileSync(join(dir, 'm.md'), 'Scores rose, t(23) = 5.90, p = .000.\n');
    const out = await cli(['-f', 'json', 'm.md'], { cwd: dir });
    const report = readReport(out.stdout) as { files: Array<{ findings: Array<{ fix?: { id: string } }> }> };
    expect(report.files[0]?.findings.map((f) => f.fix?.id)).toContain('bound-for-zero');
    expect(validate(JSON.parse(out.stdout)), JSON.stringify(validate.errors)).toBe(true);
  });
});

describe('every fix is declared and documented', () => {
  it('each fix a rule attaches is in its fixes list, on its page as "Fix `id`", and in the README table', async () => {
    const { RULES } = await import('../../src/engine/index.js');
    const text = 'A, t(23) = 5.90, p = .000; B, t(30) = 2.5, p = .01823.\n';
    const emitted = checkSource('x.md', text, { checklist: true }).findings.filter((f) => f.fix).map((f) => [f.ruleId, f.fix?.id]);
    expect(emitted).toEqual([['zero-p-is-a-bound', 'bound-for-zero'], ['p-precision-is-sensible', 'three-decimals']]);
    for (const [ruleId, fixId] of emitted) expect(Object.keys(RULES.find((r) => r.id === ruleId)?.fixes ?? {})).toContain(fixId);
    const readme = readFileSync('README.md', 'utf8');
    for (const r of RULES) {
      for (const id of Object.keys(r.fixes ?? {})) {
        expect(readFileSync(`rules/${r.id}.md`, 'utf8')).toContain(`Fix \`${id}\``);
        expect(readme).toContain(`| \`${id}\` | [${r.id}]`);
      }
    }
  });
  it('plumbline rules names each rule\'s fixes', async () => {
    const out = await cli(['rules']);
    expect(out.stdout.split('\n').find((l) => l.startsWith('zero-p-is-a-bound'))).toContain('Safe fix: bound-for-zero.');
  });
});

describe('minus-sign (minus-is-a-minus-sign, when turned on)', () => {
  const on = { checklist: true, config: { rules: { 'minus-is-a-minus-sign': 'note' as const } } };
  it('the hyphen before a negative t becomes the minus sign; the check of the result is unchanged', () => {
    const text = 'Recall fell, *t*(28) = -2.10, p = .045, and t(30) = 2.5, p = .018.\n';
    const before = checkSource('x.md', text, on);
    const after = applyFixes(text, before.findings).text;
    expect(after).toBe('Recall fell, *t*(28) = \u22122.10, p = .045, and t(30) = 2.5, p = .018.\n');
    const strip = (r: ReturnType<typeof checkSource>) => r.findings.filter((f) => f.ruleId !== 'minus-is-a-minus-sign').map((f) => [f.ruleId, f.message]);
    expect(strip(checkSource('x.md', after, on))).toEqual(strip(before));
  });
});
