import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cli } from '../cli/harness.js';
import { readReport } from '../helpers.js';

/**
 * A fuzz run over the command line (fast-check): a good manuscript beside a hostile one built
 * from every class of bad input plumbline is documented to handle (README "Reliability"): control
 * and bidi characters, invisible characters inside statistics, numbers at the edges of the
 * double range, deep nesting, long runs of one construct, many distinct link and footnote labels
 * each defined and used, unclosed front matter, NUL bytes,
 * byte-order marks, lone CRs. For every input the run ends well inside the time budget, the good
 * manuscript is still checked and reported with exactly its one finding, and the output is valid:
 * JSON against schema/report.schema.json, SARIF and the line format by their shape.
 * fast-check prints the seed and the shrunk input on failure.
 */
const RUNS = Number(process.env.PLUMBLINE_FUZZ_RUNS ?? 60);
/** Far below the CLI's default time budget (120 s), so a slow case shows as a failure here. */
const MAX_SECONDS = 20;

const root = resolve(import.meta.dirname, '../..');
const validate = new Ajv2020({ strict: false, allErrors: true }).compile(JSON.parse(readFileSync(join(root, 'schema/report.schema.json'), 'utf8')));
/** p = .20 cannot follow from t(40) = 3.10 (two-tailed p ≈ .0035): one error (common practice, no source). */
const GOOD = 'Errors rose after the redesign, t(40) = 3.10, p = .20.\n';

const statistic = fc.constantFrom(
  't(28) = 2.10, p = .045',
  't(10) = 1.5e1, p < .001',
  't = 3.4e+01, df = 12, p-value = 2.1e-13',
  'p = 1e-400',
  't(30) = 2.10, p = 1e-400',
  't(12) = 40.1, p < 2.2e-400',
  't(5) = 99999999999999999999999999999999999999999, p < .001',
  'p = −.05',
  'p = -0',
  't(28) = 2.1\u200b0, p = .04\u200e5',
  't\u0301(28) = 2.10, p = .045',
);
const piece = fc.oneof(
  fc.string({ unit: 'binary', maxLength: 40 }),
  statistic,
  fc.constantFrom('\u001b[2J\u001b]0;title\u0007', '\u202e\u2066reversed\u2069\u202c', '\r', '\r\n', '\n\n', '\u0000', '\ufeff', '\ufffe', '](javascript:alert(1))', '![x](http://tracker.invalid/p.png)', '<script>x</script>'),
  fc.tuple(fc.constantFrom('> ', '- ', '* ', '1. ', '#', '*', '_', '[', '`', '$', '|', '='), fc.integer({ min: 1, max: 3000 })).map(([s, n]) => s.repeat(n)),
  fc.tuple(fc.constantFrom('Title\n===\n', 'Lazy quote line\n', '> quoted\nlazy\n', '[r]: http://x.invalid\n', '[^n]: note\n', 'pre-test ', 'randomly assigned to '), fc.integer({ min: 1, max: 400 })).map(([s, n]) => s.repeat(n)),
  fc.constantFrom('---\nplumbline:\n  alpha: 0.01\n', '---\n', '<!-- plumbline quiet p-follows-from-t -->\n'),
  // many distinct labels, each defined and then used: links or footnotes
  fc.tuple(fc.constantFrom('', '^'), fc.integer({ min: 1, max: 3000 })).map(([caret, n]) => {
    const labels = Array.from({ length: n }, (_, i) => `${caret}l${i}`);
    return `${labels.map((l) => `[${l}]: ${caret ? 'note' : 'http://x.invalid/'} ${l}\n`).join('')}\n${labels.map((l) => `[${l}]`).join(' ')}\n`;
  }),
);
const hostile = fc.tuple(fc.array(piece, { maxLength: 12 }), fc.constantFrom('', '\ufeff', 'utf16le', 'utf32le', 'nul')).map(([parts, encoding]) => {
  const text = parts.join(' ');
  if (encoding === 'utf16le') return Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]);
  if (encoding === 'utf32le') return Buffer.concat([Buffer.from([0xff, 0xfe, 0, 0]), Buffer.from(text, 'utf16le')]);
  if (encoding === 'nul') return Buffer.from(`${text}\u0000`, 'utf8');
  return Buffer.from(`${encoding}${text}`, 'utf8');
});
const format = fc.constantFrom('json', 'sarif', 'lines', 'human', 'checklist', 'html');

describe('fuzz: the command line on hostile input', () => {
  it(`ends in time, still reports the good manuscript, and writes valid output (${RUNS} runs)`, async () => {
    await fc.assert(
      fc.asyncProperty(hostile, format, async (bytes, fmt) => {
        const dir = mkdtempSync(join(tmpdir(), 'plumbline-fuzz-'));
        writeFileSync(join(dir, 'good.md'), GOOD);
        writeFileSync(join(dir, 'hostile.md'), bytes);
        const started = performance.now();
        const out = await cli(['good.md', 'hostile.md', '-f', fmt], { cwd: dir });
        expect((performance.now() - started) / 1000).toBeLessThan(MAX_SECONDS);
        // 1: the good manuscript's error; 2: the hostile file could not be checked (binary, …)
        expect([1, 2]).toContain(out.code);
        expect(out.stderr).not.toMatch(/\n\s+at \S+ \(/);
        if (fmt === 'json') {
          const report = readReport(out.stdout) as { files: Array<{ path: string; findings: Array<{ ruleId: string }> }> };
          expect(validate(JSON.parse(out.stdout)), JSON.stringify(validate.errors?.slice(0, 3))).toBe(true);
          expect(report.files.find((f) => f.path === 'good.md')?.findings.map((f) => f.ruleId)).toEqual(['significance-follows-from-t']);
        } else if (fmt === 'sarif') {
          const log = readReport(out.stdout) as { version: string; runs: Array<{ results: Array<{ ruleId: string; locations: Array<{ physicalLocation: { artifactLocation: { uri: string } } }> }> }> };
          expect(log.version).toBe('2.1.0');
          const good = log.runs[0]!.results.filter((r) => r.locations[0]!.physicalLocation.artifactLocation.uri === 'good.md');
          expect(good.map((r) => r.ruleId)).toEqual(['significance-follows-from-t']);
        } else if (fmt === 'lines') {
          const lines = out.stdout.split('\n').filter(Boolean);
          for (const l of lines) expect(l).toMatch(/^(good|hostile)\.md(:\d+:\d+)?: (error|warning|note) [a-z-]+ /);
          expect(lines.filter((l) => l.startsWith('good.md'))).toHaveLength(1);
        } else {
          expect(out.stdout).toContain('good.md');
          // nothing from the manuscript reaches a terminal as a control sequence
          if (fmt === 'human') expect(out.stdout).not.toMatch(/\u001b\[2J|\u001b\]0;/);
        }
      }),
      { numRuns: RUNS },
    );
  }, 600_000);
});
