/**
 * Issue 18: formats crashed on results counts well inside real corpora (the checklist at 20,000
 * results, HTML at 45,000 through Math.min(...array), JSON at 200,000 through one string longer
 * than V8 allows). Every format must finish, stay valid and grow linearly with the results.
 * Sources: the JSON report's own schema (schema/report.schema.json, validated with ajv from npm);
 * the OASIS SARIF 2.1.0 schema (test/fixtures/standards/sarif-2.1.0-rtm.5.json); the longest
 * string V8 makes, 2^29 − 24 characters on 64-bit builds (V8's String::kMaxLength, from memory).
 * Linear time is judged as a ratio (time at 2N over time at N below 3.5; 2 for linear, 4 for
 * quadratic), never an absolute time: common practice, no source. The manuscripts are invented.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import AjvDraft04Module from 'ajv-draft-04';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { formatChecklist, formatChecklistChunks, formatHtml, formatHtmlChunks, formatHuman, formatHumanChunks, formatJsonChunks, formatLines, formatLinesChunks, formatSarifChunks, inChunks, type RunReport } from '../../src/report/index.js';
import { CHUNK } from '../../src/report/jsonChunks.js';
import { pAxisFor, resultRow } from '../../src/report/pictures.js';
import { cli } from './harness.js';
import { readReport } from '../helpers.js';

const AjvDraft04 = AjvDraft04Module as unknown as typeof AjvDraft04Module.default;

/** An invented manuscript of n results, each one inconsistent (p = .20 cannot follow t(40) = 3.10). */
const manuscript = (n: number) => `# Results\n\n${Array.from({ length: n }, (_, k) => `Item ${k + 1} changed, t(40) = 3.10, p = .20.`).join('\n\n')}\n`;

const FORMATS = ['human', 'lines', 'json', 'sarif', 'checklist', 'html'] as const;
const N = 1000;

describe('every format on a manuscript of many results', () => {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-many-'));
  writeFileSync(join(dir, 'many.md'), manuscript(N));
  const reportSchema = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
  const sarifSchema = new AjvDraft04({ allErrors: true, strict: false, validateFormats: false, unicodeRegExp: false }).compile(JSON.parse(readFileSync('test/fixtures/standards/sarif-2.1.0-rtm.5.json', 'utf8')));

  it.each(FORMATS)('%s: completes through the command line, with every result', async (format) => {
    const out = await cli(['many.md', '--format', format, ...(format === 'checklist' ? [] : ['--checklist'])], { cwd: dir });
    expect(out.stderr).toBe('');
    // every result is an error-level inconsistency: exit 1, not a crash (which the harness would throw)
    expect(out.code).toBe(1);
    if (format === 'json') {
      const data = readReport(out.stdout) as { files: Array<{ results: unknown[] }> };
      expect(reportSchema(JSON.parse(out.stdout)), JSON.stringify(reportSchema.errors?.slice(0, 3))).toBe(true);
      expect(data.files[0]?.results).toHaveLength(N);
    }
    if (format === 'sarif') {
      const log = readReport(out.stdout) as { runs: Array<{ results: Array<{ ruleId: string }> }> };
      expect(sarifSchema(log), JSON.stringify(sarifSchema.errors?.slice(0, 3))).toBe(true);
      expect(log.runs[0]?.results.filter((r) => r.ruleId === 'significance-follows-from-t')).toHaveLength(N);
    }
    // every format written in chunks: no one string grows with the report (JSON, SARIF and HTML
    // are several megabytes here, so the bound is met with many writes)
    if (format === 'json' || format === 'sarif' || format === 'html') expect(out.stdout.length).toBeGreaterThan(20 * CHUNK);
    expect(out.largestWrite).toBeLessThanOrEqual(CHUNK);
    if (format === 'html') expect(out.stdout.trimEnd().endsWith('</html>')).toBe(true);
    if (format === 'lines') expect(out.stdout.split('\n').filter((l) => l.includes('significance-follows-from-t'))).toHaveLength(N);
    // the last result sits on line 2N + 1 (a heading, then a blank line before each result)
    if (format === 'human') expect(out.stdout.split('significance-follows-from-t').length - 1).toBe(N);
    if (format === 'checklist') expect(out.stdout).toContain(`line ${2 * N + 1} (error, significance-follows-from-t)`);
  }, 120_000);

  it('each formatter takes at most 3.5 times as long on twice the results (linear, not quadratic)', () => {
    const runOf = (n: number): RunReport => ({ tool: { name: 'plumbline', version: '0.0.0-test' }, files: [checkSource('many.md', manuscript(n), { checklist: true })], failures: [], rules: [] });
    const small = runOf(N);
    const large = runOf(2 * N);
    const formatters: Record<(typeof FORMATS)[number] | 'htmlChunks', (run: RunReport) => unknown> = {
      human: (run) => formatHuman(run, { color: false, width: 100, cautions: true }),
      // the command line's path: the pieces regrouped into 64 KiB chunks
      htmlChunks: (run) => [...inChunks(formatHtmlChunks(run))].length,
      lines: formatLines,
      json: (run) => [...formatJsonChunks(run)].length,
      sarif: (run) => [...formatSarifChunks(run, dir)].length,
      checklist: formatChecklist,
      html: formatHtml,
    };
    // the least of five runs, N and 2N taken in turn after a warm-up: the noise of a machine
    // shared with other work (a collection, another process) only ever adds time
    const ratioOf = (f: (run: RunReport) => unknown) => {
      f(small);
      let bestSmall = Infinity;
      let bestLarge = Infinity;
      for (let i = 0; i < 5; i += 1) {
        let start = performance.now();
        f(small);
        bestSmall = Math.min(bestSmall, performance.now() - start);
        start = performance.now();
        f(large);
        bestLarge = Math.min(bestLarge, performance.now() - start);
      }
      return Number((bestLarge / bestSmall).toFixed(2));
    };
    const ratios = Object.fromEntries(Object.entries(formatters).map(([name, f]) => [name, ratioOf(f)]));
    for (const [name, ratio] of Object.entries(ratios)) expect(ratio, `${name}: ${JSON.stringify(ratios)}`).toBeLessThan(3.5);
  }, 120_000);

  it('the text formats given piece by piece: chunks within their bound, no surrogate pair parted, the same text as the string functions', () => {
    // astral characters (two UTF-16 units each) throughout, so cuts fall beside surrogate pairs;
    // a pair parted across two writes would reach the file as two U+FFFD
    const astral = `# Results \u{1F4CA}\n\n${Array.from({ length: 400 }, (_, k) => `\u{1D4AF}${'\u{1F9EA}'.repeat(k % 7)} item ${k + 1}, t(40) = 3.10, p = .20.`).join('\n\n')}\n`;
    const run: RunReport = { tool: { name: 'plumbline', version: '0.0.0-test' }, files: [checkSource('astral\u{1F4C4}.md', astral, { checklist: true })], failures: [{ path: 'gone.md', message: 'cannot read' }], rules: [] };
    const pairs: Array<[string, string, Iterable<string>]> = [
      ['human', formatHuman(run, { color: true, width: 80, cautions: true, listFailures: true }), formatHumanChunks(run, { color: true, width: 80, cautions: true, listFailures: true })],
      ['lines', formatLines(run), formatLinesChunks(run)],
      ['checklist', formatChecklist(run), formatChecklistChunks(run)],
      ['html', formatHtml(run), formatHtmlChunks(run)],
    ];
    for (const [name, whole, pieces] of pairs) {
      // a small chunk (1,000 characters) so that every format is cut many times
      const chunks = [...inChunks(pieces, 1000)];
      expect(chunks.join(''), name).toBe(whole);
      expect(chunks.reduce((m, c) => Math.max(m, c.length), 0), name).toBeLessThanOrEqual(1000);
      expect(chunks.length, name).toBeGreaterThan(whole.length / 1000);
      // each chunk is whole UTF-8 on its own: written one by one, the bytes are the whole text's
      expect(Buffer.concat(chunks.map((c) => Buffer.from(c, 'utf8'))).equals(Buffer.from(whole, 'utf8')), name).toBe(true);
    }
  });

  it('one piece far longer than a chunk is cut, not written whole; an empty report writes nothing', () => {
    const long = `${'\u{1F9EA}'.repeat(300_000)}x`;
    const chunks = [...inChunks(['a', long, 'b'], CHUNK)];
    expect(chunks.join('')).toBe(`a${long}b`);
    // every chunk but the last full (one short where a pair would be parted), none ending in half a pair
    expect(chunks.length).toBeGreaterThanOrEqual(Math.ceil((long.length + 2) / CHUNK));
    expect(chunks.slice(0, -1).every((c) => c.length >= CHUNK - 1 && c.length <= CHUNK)).toBe(true);
    expect(chunks.every((c) => !/[\uD800-\uDBFF]$/.test(c))).toBe(true);
    expect([...inChunks([], CHUNK)]).toEqual([]);
    expect([...inChunks(['', ''], CHUNK)]).toEqual([]);
  });

  it("the HTML report's p axis over 200,000 results: no spread of the list into Math.min (it overflowed the stack)", () => {
    const one = resultRow(checkSource('one.md', manuscript(1)).results[0]!)!;
    const rows = Array.from({ length: 200_000 }, () => one);
    expect(pAxisFor(rows)).toEqual(pAxisFor([one]));
  });
});
