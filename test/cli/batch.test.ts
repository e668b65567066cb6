import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { statDense } from '../../bench/corpus.js';
import { BIN, cli as inProcess } from './harness.js';
import { readReport } from '../helpers.js';

const cli = BIN;
const lines = (s: string) => s.split('\n').filter(Boolean);

function corpus(n: number): { dir: string; paths: string[] } {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-batch-'));
  const paths: string[] = [];
  for (let i = 0; i < n; i += 1) {
    const p = join(dir, `doc${String(i).padStart(4, '0')}.md`);
    writeFileSync(p, statDense(7000 + i, 3000));
    paths.push(p);
  }
  return { dir, paths };
}

describe('batch mode (plumbline batch)', () => {
  it('writes one NDJSON line per input line, in order, errors included, and a summary on stderr', () => {
    const { paths } = corpus(3);
    const input = [paths[0], '{"id": "inline", "text": "x, t(46) = 0.84, p = .04.\\n"}', '/nope.md', '{"id": 7, "text": 5}', '{broken', paths[1]].join('\n');
    const r = spawnSync(process.execPath, [cli, 'batch'], { input, encoding: 'utf8' });
    const out = lines(r.stdout).map((l) => readReport(l));
    expect(out.map((o) => o.id)).toEqual([paths[0], 'inline', '/nope.md', 7, null, paths[1]]);
    expect(out[1].findings[0].ruleId).toBe('significance-follows-from-t');
    expect(out[2].error).toBe('cannot read: no such file or folder');
    expect(out[3].error).toContain('"text" must be a string');
    expect(out[4].error).toContain('not valid JSON');
    expect(r.stderr).toContain('plumbline batch: 6 lines');
    expect(r.status).toBe(2);
  });

  // issue 18, batch accounting: every physical input line gives one output line, numbered by its place
  it('a blank line gets an error line of its own and the line numbers in messages stay physical', async () => {
    const doc = (id: string) => JSON.stringify({ id, text: 'x, t(46) = 0.84, p = .04.' });
    const out = await inProcess(['batch', '--jobs', '1'], { stdin: `${doc('a')}\n\n   \n{broken\n${doc('b')}\n` });
    const rows = lines(out.stdout).map((l) => readReport(l) as Record<string, unknown>);
    expect(rows).toHaveLength(5);
    expect(rows.map((r) => r.id)).toEqual(['a', null, null, null, 'b']);
    // a blank line is shaped exactly as an error line: same keys, so a reader of the stream needs no third case
    expect(rows[1]).toEqual({ id: null, error: 'line 2 is empty' });
    expect(rows[2]).toEqual({ id: null, error: 'line 3 is empty' });
    expect(Object.keys(rows[1] ?? {})).toEqual(Object.keys(rows[3] ?? {}));
    expect(rows[3]?.error).toContain('line 4 is not valid JSON');
    expect(out.stderr).toContain('plumbline batch: 5 lines');
    expect(out.code).toBe(2);
  });

  it('a lone CR stays inside its line; CRLF ends a line as LF does; a last line without LF counts', async () => {
    // the CR inside the JSON is whitespace between tokens, so this is one valid document
    const stdin = `{"id": "cr",\r"text": "x, t(46) = 0.84, p = .04."}\r\n{"id": "last", "text": "no findings here"}`;
    const out = await inProcess(['batch', '--jobs', '1'], { stdin });
    const rows = lines(out.stdout).map((l) => readReport(l) as Record<string, unknown>);
    expect(rows.map((r) => r.id)).toEqual(['cr', 'last']);
    expect(rows[0]?.findings).toHaveLength(1);
    // a path line with a lone CR inside is one (missing) path, not two
    const paths = await inProcess(['batch', '--jobs', '1'], { stdin: Buffer.from('no\rsuch.md\n') });
    expect(lines(paths.stdout).map((l) => JSON.parse(l) as Record<string, unknown>)).toEqual([{ id: 'no\rsuch.md', error: 'cannot read: no such file or folder' }]);
  });

  it('--first-line: a chunk checked apart numbers its lines as the whole input does, so the chunks join into the single run', async () => {
    const doc = (id?: string) => JSON.stringify(id === undefined ? { text: 'x, t(46) = 0.84, p = .04.' } : { id, text: 'x, t(46) = 0.84, p = .04.' });
    const all = [doc('a'), doc(), '', '{broken', doc('b'), doc(), '{"id": 1, "text": 2}'];
    const single = await inProcess(['batch', '--jobs', '1'], { stdin: `${all.join('\n')}\n` });
    const first = await inProcess(['batch', '--jobs', '1'], { stdin: `${all.slice(0, 3).join('\n')}\n` });
    const second = await inProcess(['batch', '--jobs', '1', '--first-line', '4'], { stdin: `${all.slice(3).join('\n')}\n` });
    expect(first.stdout + second.stdout).toBe(single.stdout);
    // without it the second chunk would name its lines from 1: the test above would then fail
    expect(second.stdout).toContain('"path":"line 6"');
    expect(second.stdout).toContain('line 4 is not valid JSON');
    expect(second.stderr).toContain('plumbline batch: 4 lines');
    const wrong = await inProcess(['batch', '--first-line', '0'], { stdin: '' });
    expect(wrong.stderr).toContain('--first-line must be a whole number, 1 or more; got "0"');
    expect(wrong.code).toBe(2);
    const elsewhere = await inProcess(['x.md', '--first-line', '3'], { stdin: '' });
    expect(elsewhere.stderr).toContain('--first-line applies to batch only');
  });

  it('ids keep their JSON type: 42 and "42" come back as they went in', async () => {
    const text = 'x, t(46) = 0.84, p = .04.';
    const stdin = [{ id: 42, text }, { id: '42', text }, { id: 4.5, text }, { text }, { id: true, text }].map((d) => JSON.stringify(d)).join('\n');
    const out = await inProcess(['batch', '--jobs', '1'], { stdin });
    const rows = lines(out.stdout).map((l) => readReport(l) as Record<string, unknown>);
    expect(rows.map((r) => r.id)).toEqual([42, '42', 4.5, null, null]);
    expect(lines(out.stdout)[0]).toMatch(/^\{"id":42,/);
    expect(lines(out.stdout)[1]).toMatch(/^\{"id":"42",/);
    expect(rows[3]?.findings).toHaveLength(1);
    expect(rows[4]?.error).toBe('line 5: "id" must be a string or a finite number');
  });

  it('gives the same lines with worker threads as without', () => {
    const { paths } = corpus(40);
    const one = spawnSync(process.execPath, [cli, 'batch', '--jobs', '1'], { input: paths.join('\n'), encoding: 'utf8' }).stdout;
    const two = spawnSync(process.execPath, [cli, 'batch', '--jobs', '2'], { input: paths.join('\n'), encoding: 'utf8' }).stdout;
    expect(lines(one)).toHaveLength(40);
    expect(two).toBe(one);
  });

  it('the file mode output is the same with worker threads as without', () => {
    const { dir } = corpus(30);
    const one = spawnSync(process.execPath, [cli, dir, '--format', 'json', '--jobs', '1'], { encoding: 'utf8' }).stdout;
    const two = spawnSync(process.execPath, [cli, dir, '--format', 'json', '--jobs', '2'], { encoding: 'utf8' }).stdout;
    expect(JSON.parse(one).files).toHaveLength(30);
    expect(two).toBe(one);
  });

  // .ci/run installs GNU parallel and sets PLUMBLINE_REQUIRE_PARALLEL, so CI always runs this;
  // on a machine without it the test is skipped with the reason in its name.
  const hasParallel = spawnSync('parallel', ['--version'], { encoding: 'utf8' }).status === 0;
  const required = process.env.PLUMBLINE_REQUIRE_PARALLEL === '1';
  it('GNU parallel is present where it is required', () => {
    if (required) expect(hasParallel, 'GNU parallel is required (Debian: apt-get install parallel)').toBe(true);
  });
  it.skipIf(!hasParallel && !required)('under GNU parallel (Debian package parallel; skipped where it is not installed), chunks merged equal the single-process output', () => {
    const { dir, paths } = corpus(300);
    const list = join(dir, 'paths.txt');
    writeFileSync(list, `${paths.join('\n')}\n`);
    // exit status 1 (error-level findings in the corpus) is expected, so spawnSync, not execFileSync
    const single = spawnSync(process.execPath, [cli, 'batch', '--jobs', '1'], { input: paths.join('\n'), encoding: 'utf8', maxBuffer: 1 << 28 }).stdout;
    // --pipe splits standard input into chunks of lines; --keep-order merges the outputs in input order
    const merged = spawnSync('parallel', ['--pipe', '--keep-order', '-N', '50', '-j', '2', process.execPath, cli, 'batch', '--jobs', '1'], {
      input: `${paths.join('\n')}\n`,
      encoding: 'utf8',
      maxBuffer: 1 << 28,
    }).stdout;
    expect(lines(merged)).toHaveLength(300);
    expect(merged).toBe(single);
    // seven node processes on two cores: room for a machine busy with other work
  }, 120_000);
});
