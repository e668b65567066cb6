/**
 * The JSON and SARIF the command line writes in chunks are byte for byte what JSON.stringify
 * (ECMA-262's JSON.stringify, as V8 implements it, with the same replacer and the same indent:
 * none for the JSON report, 2 for SARIF) writes in one string: the reference here is the engine's own JSON.stringify, not our code.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkSource, RULES } from '../../src/engine/index.js';
import { formatJson, formatJsonChunks, formatSarif, formatSarifChunks, type RunReport } from '../../src/report/index.js';
import { CHUNK, jsonChunks } from '../../src/report/jsonChunks.js';

const demoPath = 'fixtures/demo/standing-desks.md';
const runOf = (texts: Array<[string, string]>, failures: RunReport['failures'] = []): RunReport => ({
  tool: { name: 'plumbline', version: '0.0.0-test' },
  files: texts.map(([path, text]) => checkSource(path, text, { checklist: true })),
  failures,
  rules: RULES.map((r) => ({ id: r.id, summary: r.summary, kind: r.kind, defaultLevel: r.defaultLevel, doc: readFileSync(`rules/${r.id}.md`, 'utf8') })),
});
const finite = (_k: string, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v);

describe('JSON and SARIF in chunks', () => {
  const runs: Array<[string, RunReport]> = [
    ['no files', runOf([])],
    ['the demo manuscript and a failure', runOf([[demoPath, readFileSync(demoPath, 'utf8')]], [{ path: 'gone.md', message: 'no such file or folder', line: 3, column: 1 }])],
    // an unbounded p (Infinity in the data, null in JSON), control characters and markup in the text
    ['hostile text and unbounded ends', runOf([['h.md', 'Bad \u001b[31mred\u2028 "q" \\ <b>, t(23) = 1.12, p = .42; ts(22) > 4.72, ps ≤ .0001.\n']])],
    ['many results across files', runOf(Array.from({ length: 3 }, (_, f) => [`f${f}.md`, Array.from({ length: 300 }, (_, k) => `Item ${k} changed, t(40) = 3.10, p = .20.`).join('\n\n')]))],
  ];
  it.each(runs)('%s: the chunks join to formatJson and formatSarif exactly', (_name, run) => {
    expect([...formatJsonChunks(run)].join('')).toBe(formatJson(run));
    expect([...formatSarifChunks(run, '/work')].join('')).toBe(formatSarif(run, '/work'));
  });

  it('no chunk is much longer than the chunk size, even for a large report', () => {
    const run = runs[3]![1];
    const chunks = [...formatJsonChunks(run)];
    expect(chunks.length).toBeGreaterThan(10);
    // a chunk is cut once it reaches CHUNK; it passes it by at most one piece no longer than CHUNK
    for (const c of chunks) expect(c.length).toBeLessThanOrEqual(2 * CHUNK);
  });

  it('the JSON report is JSON.stringify without indentation: one line, then a line break', () => {
    const run = runs[1]![1];
    const text = formatJson(run);
    expect(text).toBe(`${JSON.stringify(JSON.parse(text))}\n`);
    expect(text.indexOf('\n')).toBe(text.length - 1);
    expect([...formatJsonChunks(runs[3]![1])].join('')).toBe(`${JSON.stringify(JSON.parse(formatJson(runs[3]![1])))}\n`);
  });

  it.each([0, 2, 4])('any JSON-like value: the same text as JSON.stringify(value, replacer, %i) (fast-check, 2,000 cases)', (space) => {
    // values JSON leaves out or changes: undefined and functions (left out of objects, null in
    // arrays), non-finite numbers (null through the replacer), -0 (0), toJSON
    const leaf = fc.oneof(fc.string(), fc.double(), fc.integer(), fc.boolean(), fc.constant(null), fc.constant(undefined), fc.constant(() => 1), fc.constant({ toJSON: () => 'dated' }));
    const value = fc.letrec((tie) => ({
      node: fc.oneof({ depthSize: 'small' }, leaf, fc.array(tie('node'), { maxLength: 5 }), fc.dictionary(fc.string({ maxLength: 4 }), tie('node'), { maxKeys: 5 })),
    })).node;
    fc.assert(
      fc.property(value, fc.integer({ min: 1, max: 64 }), (v, size) => {
        const whole = JSON.stringify(v, finite, space) as string | undefined;
        const joined = [...jsonChunks(v, finite, size, space)].join('');
        // JSON.stringify of undefined or a function at the top is undefined; the chunks are then "undefined\n"-free: only the newline
        return whole === undefined ? joined === '\n' : joined === `${whole}\n`;
      }),
      { numRuns: 2000 },
    );
  });
});
