/**
 * Bad and hostile input, one class at a time: each gives a clear message naming the file, the
 * other files are still checked, and nothing is lost or written. The expectations are
 * plumbline's own contract (README, "Reliability"); the encodings are those of the Unicode
 * Standard (UTF-8, UTF-16 with byte-order mark), common practice, no source.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BIN, cli, type Outcome } from './harness.js';
import { readReport } from '../helpers.js';

function tempDir(): string {
  return mkdtempSync(join(tmpdir(), 'plumbline-hostile-'));
}

interface Json {
  summary: { files: number; results: number; failures: number };
  files: Array<{ path: string; results: Array<{ printed: string; start: { line: number; column: number } }>; findings: Array<{ ruleId: string; messageId: string; start: { line: number; column: number } }> }>;
  failures: Array<{ path: string; message: string }>;
}

const json = (o: Outcome): Json => readReport(o.stdout) as Json;
const ids = (f: Json['files'][number]) => f.findings.map((x) => `${x.start.line}:${x.start.column} ${x.ruleId}/${x.messageId}`);
const WRONG = 'Errors rose, t(40) = 3.10, p = .20.\n';
const RIGHT = 'Fatigue fell, t(23) = 2.47, p = .021.\n';

describe('bad input, each class', () => {
  it('binary file (NUL bytes): skipped and said; the other files are still checked (exit 2)', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), WRONG);
    writeFileSync(join(dir, 'b.md'), Buffer.from([0x74, 0x28, 0x34, 0x30, 0x29, 0x00, 0x01, 0x02]));
    const out = await cli(['.', '-f', 'json'], { cwd: dir });
    expect(out.code).toBe(2);
    const r = json(out);
    expect(r.files.map((f) => f.path)).toEqual(['a.md']);
    expect(ids(r.files[0]!)).toEqual(['1:14 significance-follows-from-t/mismatch']);
    expect(r.failures).toEqual([{ path: 'b.md', message: 'skipped: binary file (NUL byte at byte 5)' }]);
    expect(out.stderr).toContain('b.md: skipped: binary file');
  });

  it('invalid UTF-8: decoded with U+FFFD, a note at the first bad byte, the results still checked', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), Buffer.concat([Buffer.from('Caf'), Buffer.from([0xe9]), Buffer.from(' intake rose.\n'), Buffer.from(WRONG)]));
    const out = await cli(['a.md', '-f', 'json'], { cwd: dir });
    const f = json(out).files[0]!;
    expect(ids(f)).toEqual(['1:4 input-is-readable/bytes-replaced', '2:14 significance-follows-from-t/mismatch']);
  });

  it('UTF-16 with a byte-order mark (LE and BE): decoded, same findings and positions as UTF-8', async () => {
    const dir = tempDir();
    const text = `\ufeffIntro line.\n${WRONG}`;
    writeFileSync(join(dir, 'le.md'), Buffer.from(text, 'utf16le'));
    const be = Buffer.from(text, 'utf16le');
    be.swap16();
    writeFileSync(join(dir, 'be.md'), be);
    writeFileSync(join(dir, 'u8.md'), text);
    const r = json(await cli(['le.md', 'be.md', 'u8.md', '-f', 'json'], { cwd: dir }));
    expect(r.files.map(ids)).toEqual([['2:14 significance-follows-from-t/mismatch'], ['2:14 significance-follows-from-t/mismatch'], ['2:14 significance-follows-from-t/mismatch']]);
  });

  it('UTF-16 from standard input is decoded the same way', async () => {
    const r = json(await cli(['-', '-f', 'json'], { cwd: tempDir(), stdin: Buffer.from(`\ufeff${WRONG}`, 'utf16le') }));
    expect(ids(r.files[0]!)).toEqual(['1:14 significance-follows-from-t/mismatch']);
  });

  it('empty files: checked, nothing found, exit 0', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'empty.md'), '');
    writeFileSync(join(dir, 'empty.txt'), '');
    const out = await cli(['.', '-f', 'json'], { cwd: dir });
    expect(out.code).toBe(0);
    expect(json(out).summary).toMatchObject({ files: 2, results: 0, failures: 0 });
  });

  it('files over the size limit (configuration or option): skipped and said, others checked', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'small.md'), WRONG);
    writeFileSync(join(dir, 'big.md'), `${'Filler prose. '.repeat(200)}\n${WRONG}`);
    writeFileSync(join(dir, '.plumbline.json'), JSON.stringify({ maxFileBytes: 1000 }));
    const byConfig = await cli(['.', '-f', 'json'], { cwd: dir });
    expect(byConfig.code).toBe(2);
    expect(json(byConfig).files.map((f) => f.path)).toEqual(['small.md']);
    expect(json(byConfig).failures[0]).toEqual({ path: 'big.md', message: expect.stringMatching(/^skipped: 2837 bytes is over the limit of 1000/) as unknown as string });
    const byOption = await cli(['.', '-f', 'json', '--max-file-bytes', '100000'], { cwd: dir });
    expect(byOption.code).toBe(1);
    expect(json(byOption).files.map((f) => f.path)).toEqual(['big.md', 'small.md']);
  });

  it('missing files and paths through a file: exit 2, named, the rest still reported', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), WRONG);
    const out = await cli(['nope.md', 'a.md/inner.md', 'a.md', '-f', 'json'], { cwd: dir });
    expect(out.code).toBe(2);
    const r = json(out);
    expect(r.files.map((f) => f.path)).toEqual(['a.md']);
    expect(r.failures.map((f) => f.path)).toEqual(['nope.md', 'a.md/inner.md']);
    expect(r.failures[0]!.message).toBe('no such file or folder');
  });

  // Permissions do not bind the superuser: run as root (as CI does), the compiled CLI is started
  // through util-linux's setpriv without the two capabilities that override file permissions
  // (CAP_DAC_OVERRIDE, CAP_DAC_READ_SEARCH), so the mode 000 binds it as it binds any user.
  it('unreadable files: exit 2, named, the rest still reported', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), WRONG);
    writeFileSync(join(dir, 'locked.md'), WRONG);
    chmodSync(join(dir, 'locked.md'), 0o000);
    let out: Outcome;
    if (process.getuid?.() === 0) {
      const drop = '-dac_override,-dac_read_search';
      const r = spawnSync('setpriv', [`--inh-caps=${drop}`, `--bounding-set=${drop}`, process.execPath, BIN, 'a.md', 'locked.md', '-f', 'json'], { cwd: dir, encoding: 'utf8' });
      out = { code: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
    } else {
      out = await cli(['a.md', 'locked.md', '-f', 'json'], { cwd: dir });
    }
    expect(out.code).toBe(2);
    expect(json(out).failures).toEqual([{ path: 'locked.md', message: 'cannot read: permission denied' }]);
    expect(json(out).files.map((f) => f.path)).toEqual(['a.md']);
  });

  it('symbolic-link loops: every file once, the walk ends', async () => {
    const dir = tempDir();
    mkdirSync(join(dir, 'sub'));
    writeFileSync(join(dir, 'sub', 'a.md'), WRONG);
    symlinkSync('..', join(dir, 'sub', 'up'));
    symlinkSync('loop2', join(dir, 'loop1'));
    symlinkSync('loop1', join(dir, 'loop2'));
    const out = await cli(['.', '-f', 'json'], { cwd: dir });
    expect(json(out).files.map((f) => f.path)).toEqual(['sub/a.md']);
    // a loop named directly is a clear error, not a hang
    const direct = await cli(['loop1', '-f', 'json'], { cwd: dir });
    expect(direct.code).toBe(2);
    expect(json(direct).failures).toEqual([{ path: 'loop1', message: 'too many levels of symbolic links' }]);
  });

  it('a 10,000-file folder: every file checked, in a stable order, with worker threads', async () => {
    const dir = tempDir();
    for (let i = 0; i < 10_000; i++) writeFileSync(join(dir, `m${String(i).padStart(5, '0')}.md`), i % 1000 === 7 ? WRONG : RIGHT);
    const out = await cli(['.', '-f', 'json', '-j', '2'], { cwd: dir });
    const r = json(out);
    expect(r.summary).toMatchObject({ files: 10_000, results: 10_000, failures: 0 });
    expect(r.files.filter((f) => f.findings.length > 0).map((f) => f.path)).toEqual(Array.from({ length: 10 }, (_, k) => `m${String(k * 1000 + 7).padStart(5, '0')}.md`));
  }, 120_000);

  it('a 1 MB single line: results found at their exact columns', async () => {
    const dir = tempDir();
    const filler = 'Participants walked between the two wings of the building. '.repeat(17_500);
    const line = `${filler}${WRONG.trim()} ${filler}${RIGHT.trim()}`;
    expect(line.length).toBeGreaterThan(2_000_000);
    writeFileSync(join(dir, 'long.md'), `${line}\n`);
    const r = json(await cli(['long.md', '-f', 'json'], { cwd: dir }));
    const f = r.files[0]!;
    expect(f.results.map((x) => x.start)).toEqual([
      { line: 1, column: filler.length + 14 },
      { line: 1, column: 2 * filler.length + WRONG.trim().length + 1 + 15 },
    ]);
    expect(ids(f)).toEqual([`1:${filler.length + 14} significance-follows-from-t/mismatch`]);
  }, 60_000);

  it('10,000 levels of nested lists or block quotes: no stack overflow; read as plain text, said, results kept', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'lists.md'), `${'- '.repeat(10_000)}${WRONG}`);
    writeFileSync(join(dir, 'quotes.md'), `${'>'.repeat(10_000)} ${WRONG}`);
    writeFileSync(join(dir, 'indent.md'), `${Array.from({ length: 300 }, (_, i) => `${' '.repeat(2 * i)}- level ${i}`).join('\n')}\n\n${WRONG}`);
    // behind a byte-order mark too (found by the fuzz run: the mark hid the nesting, and the parse took minutes)
    writeFileSync(join(dir, 'bom.md'), `\ufeff${'- '.repeat(10_000)}${WRONG}`);
    const r = json(await cli(['lists.md', 'quotes.md', 'indent.md', 'bom.md', '-f', 'json'], { cwd: dir }));
    expect(r.files.map(ids)).toEqual([
      ['1:1 input-is-readable/read-as-plain-text', '1:20014 significance-follows-from-t/mismatch'],
      ['1:1 input-is-readable/read-as-plain-text', '1:10015 significance-follows-from-t/mismatch'],
      ['101:1 input-is-readable/read-as-plain-text', '302:14 significance-follows-from-t/mismatch'],
      ['1:1 input-is-readable/read-as-plain-text', '1:20014 significance-follows-from-t/mismatch'],
    ]);
  }, 60_000);

  it('10,000 levels of nested emphasis or links: read without a crash', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'emph.md'), `${'*'.repeat(10_000)}x${'*'.repeat(10_000)}\n\n${WRONG}`);
    writeFileSync(join(dir, 'links.md'), `${'['.repeat(10_000)}x${']'.repeat(10_000)}\n\n${WRONG}`);
    const r = json(await cli(['emph.md', 'links.md', '-f', 'json'], { cwd: dir }));
    for (const f of r.files) expect(ids(f).filter((x) => x.includes('significance'))).toEqual(['3:14 significance-follows-from-t/mismatch']);
  }, 60_000);

  it('malformed front matter: a note, and the defaults are used', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), `---\nplumbline: {alpha: 0.01\n---\n${WRONG}`);
    const r = json(await cli(['a.md', '-f', 'json'], { cwd: dir }));
    expect(ids(r.files[0]!)).toEqual(['1:1 front-matter-is-readable/front-matter-unreadable', '4:14 significance-follows-from-t/mismatch']);
  });

  it('front matter of 100,000 keys: not read, said with the limit, the text still checked, fast', async () => {
    // 100,000 keys took the yaml library minutes; the limits are checked before it sees the text
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), `---\n${Array.from({ length: 100_000 }, (_, i) => `key${i}: ${i}`).join('\n')}\n---\n${WRONG}`);
    const start = performance.now();
    const out = await cli(['a.md', '-f', 'json'], { cwd: dir });
    expect(performance.now() - start).toBeLessThan(20_000);
    const r = readReport(out.stdout) as { files: Array<{ findings: Array<{ ruleId: string; message: string; start: { line: number } }> }> };
    const findings = r.files[0]?.findings ?? [];
    expect(findings.map((f) => `${f.start.line} ${f.ruleId}`)).toEqual(['1 front-matter-is-readable', '100003 significance-follows-from-t']);
    expect(findings[0]?.message).toMatch(/not read: \d+ characters is over the limit of 262144/);
  }, 60_000);

  it('configuration from a stranger: duplicate JSON keys refused with the key and line; a YAML of 25,000 keys refused unread', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), WRONG);
    writeFileSync(join(dir, '.plumbline.json'), '{\n  "alpha": 0.05,\n  "alpha": 0.5\n}\n');
    const dup = await cli(['a.md'], { cwd: dir });
    expect(dup.code).toBe(2);
    expect(dup.stderr).toMatch(/\.plumbline\.json:3:3: configuration: duplicate key "alpha"/);
    rmSync(join(dir, '.plumbline.json'));
    // 25,000 keys in 200 KB, under the size limits: the yaml library alone would take many seconds
    writeFileSync(join(dir, '.plumbline.yaml'), Array.from({ length: 25_000 }, (_, i) => `k${i}: 1`).join('\n'));
    const start = performance.now();
    const many = await cli(['a.md'], { cwd: dir });
    expect(performance.now() - start).toBeLessThan(10_000);
    expect(many.code).toBe(2);
    expect(many.stderr).toContain('.plumbline.yaml: configuration: YAML not read: 25000 lines and commas is over the limit of 2000 (very many keys make the YAML reader slow)');
  });

  it('invalid configuration: JSON syntax error with line and column; schema error naming the key; unknown rule with the nearest id', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), WRONG);
    writeFileSync(join(dir, '.plumbline.json'), '{\n  "alpha": 0.05,\n  "rules": {\n}');
    expect((await cli(['a.md'], { cwd: dir })).stderr).toMatch(/\.plumbline\.json:4:2: configuration: invalid JSON.*\(not checked because of it: a\.md\)/);
    writeFileSync(join(dir, '.plumbline.json'), '{"maxFileBytes": "big"}');
    expect((await cli(['a.md'], { cwd: dir })).stderr).toContain('maxFileBytes');
    writeFileSync(join(dir, '.plumbline.json'), '{"rules": {"p-follows-from-tt": "off"}}');
    const out = await cli(['a.md'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('did you mean "p-follows-from-t"');
  });
});

describe('safety', () => {
  const sum = (dir: string) =>
    Object.fromEntries(readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => [join(e.parentPath, e.name), createHash('sha256').update(readFileSync(join(e.parentPath, e.name))).digest('hex')]));

  it('inputs are never written; --output writes atomically and never over an input file', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), WRONG);
    writeFileSync(join(dir, 'b.txt'), RIGHT);
    const before = sum(dir);
    const refused = await cli(['.', '-o', 'a.md'], { cwd: dir });
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('refusing to write over an input file: a.md');
    expect(sum(dir)).toEqual(before);
    // through another name (a symbolic link) too
    symlinkSync('a.md', join(dir, 'alias.json'));
    expect((await cli(['a.md', '-o', 'alias.json'], { cwd: dir })).code).toBe(2);
    expect(readFileSync(join(dir, 'a.md'), 'utf8')).toBe(WRONG);

    const ok = await cli(['.', '-o', 'report.json', '-f', 'json'], { cwd: dir });
    expect(ok.code).toBe(1);
    expect(ok.stdout).toBe('');
    expect(json({ ...ok, stdout: readFileSync(join(dir, 'report.json'), 'utf8') }).summary.files).toBe(2);
    // no temporary file is left beside it
    expect(readdirSync(dir).sort()).toEqual(['a.md', 'alias.json', 'b.txt', 'report.json']);
  });

  it('an output file that cannot be written leaves nothing behind and exits 2', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), WRONG);
    const out = await cli(['a.md', '-o', 'no/such/folder/report.txt'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('cannot write no/such/folder/report.txt');
  });

  it('batch mode never reads the output file as input', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.md'), WRONG);
    const out = await cli(['batch', '-o', 'out.ndjson'], { cwd: dir, stdin: 'a.md\nout.ndjson\n' });
    expect(out.code).toBe(2);
    const lines = readFileSync(join(dir, 'out.ndjson'), 'utf8').trim().split('\n').map((l) => JSON.parse(l) as { id: string; error?: string });
    expect(lines.map((l) => [l.id, l.error ?? 'checked'])).toEqual([
      ['a.md', 'checked'],
      ['out.ndjson', 'not checked: this is the output file (--output), which plumbline never reads as input'],
    ]);
  });

  it('runs no process and opens no connection over hostile fixtures (main thread and workers)', () => {
    const fixtures = resolve('test/fixtures/hostile');
    const work = tempDir();
    const copy = join(work, 'repo');
    mkdirSync(copy);
    for (const name of readdirSync(fixtures)) if (name !== 'no-escape.mjs') writeFileSync(join(copy, name), readFileSync(join(fixtures, name)));
    // enough copies that the worker pool is used
    for (let i = 0; i < 40; i++) writeFileSync(join(copy, `copy-${i}.md`), readFileSync(join(fixtures, 'manuscript.md')));
    const log = join(work, 'escape.log');
    const before = sum(copy);
    const r = spawnSync(process.execPath, ['--import', join(fixtures, 'no-escape.mjs'), BIN, '.', '-j', '2', '-f', 'json'], {
      cwd: copy,
      env: { ...process.env, NO_ESCAPE_LOG: log },
      encoding: 'utf8',
    });
    expect(r.stderr).not.toContain('blocked');
    expect(existsSync(log) ? readFileSync(log, 'utf8') : '').toBe('');
    expect(r.status).toBe(1);
    const report = readReport(r.stdout) as Json;
    expect(report.summary.files).toBe(readdirSync(fixtures).filter((n) => n.endsWith('.md')).length + 40);
    // the front matter's tags were read as plain strings, so the alpha was refused and said
    const manuscript = report.files.find((f) => f.path === 'manuscript.md')!;
    expect(ids(manuscript)).toContain('1:1 front-matter-is-readable/front-matter-unreadable');
    expect(existsSync(join(copy, 'pwned'))).toBe(false);
    expect(sum(copy)).toEqual(before);
    // the recorder itself works: a blocked call is logged
    const probe = spawnSync(process.execPath, ['--import', join(fixtures, 'no-escape.mjs'), '-e', "import('node:child_process').then(c => { try { c.execSync('true') } catch {} })"], {
      env: { ...process.env, NO_ESCAPE_LOG: log },
      encoding: 'utf8',
    });
    expect(probe.status).toBe(0);
    expect(readFileSync(log, 'utf8')).toBe('child_process.execSync\n');
    rmSync(log);
  });
});

// keep the compiled CLI current for the spawned runs above
execFileSync(process.execPath, [resolve('node_modules/typescript/bin/tsc'), '-p', 'tsconfig.json']);
