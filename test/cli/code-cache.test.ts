import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, statSync, symlinkSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cacheFile, cacheFolder, cacheIdentity, cacheKind, decodeCache, encodeCache, outgrown, readCache, writeCache, type CacheIdentity } from '../../src/cli/codeCache.js';
import { growHeapSlowly, hasOwnHeapGrowing } from '../../src/cli/heap.js';
import { compileRegexpsAtOnce, hasOwnRegexpTier } from '../../src/cli/regexps.js';
import { BIN, cli } from './harness.js';

/**
 * The code cache of the command's start-up bundle (src/cli/codeCache.ts, src/cli/load.ts): used
 * only when it was made for this very bundle, Node and run, ignored safely otherwise, and never
 * a cause of different output. Every manuscript here is invented.
 */
const id: CacheIdentity = { bundle: 'a'.repeat(64), node: 'v20.0.0', v8: '11.3', arch: 'x64', flags: '|', kind: 'check:json' };
const payload = Buffer.from(Array.from({ length: 5000 }, (_, i) => (i * 7) % 256));

describe('cache files', () => {
  it('give back their payload for the identity they were made for', () => {
    expect(decodeCache(encodeCache(id, payload), id)?.payload.equals(payload)).toBe(true);
  });

  it('record the results the run that made them checked in its thread, read as 0 where absent or not a count', () => {
    expect(decodeCache(encodeCache(id, payload, 37), id)?.checked).toBe(37);
    expect(decodeCache(encodeCache(id, payload), id)?.checked).toBe(0);
    // a file written before the count was recorded, or with a header no writer of ours makes
    for (const checked of [undefined, -1, '900', null, 1e400]) {
      const good = encodeCache(id, payload, 5);
      const start = good.indexOf(0x0a) + 1;
      const end = good.indexOf(0x0a, start);
      const header = JSON.parse(good.toString('utf8', start, end)) as Record<string, unknown>;
      if (checked === undefined) delete header.checked;
      else header.checked = checked;
      const bytes = Buffer.concat([good.subarray(0, start), Buffer.from(JSON.stringify(header)), good.subarray(end)]);
      expect(decodeCache(bytes, id)?.checked, String(checked)).toBe(0);
    }
  });

  it('are outgrown by a run that checked results in a higher band: none, 1-9, 10-99, 100 or more', () => {
    const cases: Array<[number, number, boolean]> = [
      [0, 0, false],
      [0, 1, true],
      [1, 9, false],
      [9, 10, true],
      [10, 99, false],
      [99, 100, true],
      [100, 100_000, false],
      // a run that checked less never replaces a fuller cache
      [100, 3, false],
      [5, 0, false],
    ];
    for (const [made, now, replaced] of cases) expect(outgrown(made, now), `${made} then ${now}`).toBe(replaced);
  });

  it('are ignored when made for another bundle, Node, V8, architecture, flags or kind of run', () => {
    const bytes = encodeCache(id, payload);
    for (const key of ['bundle', 'node', 'v8', 'arch', 'flags', 'kind'] as const) {
      expect(decodeCache(bytes, { ...id, [key]: `${id[key]}x` }), key).toBeUndefined();
    }
  });

  it('are ignored when cut short, lengthened, altered, empty or not ours', () => {
    const bytes = encodeCache(id, payload);
    const altered = Buffer.from(bytes);
    altered[altered.length - 100] = (altered[altered.length - 100] as number) ^ 1;
    const header = Buffer.from(bytes);
    // the header's JSON made unreadable
    header[header.indexOf(0x7b)] = 0x5b;
    for (const [name, b] of [
      ['cut short', bytes.subarray(0, bytes.length - 1)],
      ['cut in the header', bytes.subarray(0, 40)],
      ['lengthened', Buffer.concat([bytes, Buffer.from([0])])],
      ['a payload byte changed', altered],
      ['a broken header', header],
      ['empty', Buffer.alloc(0)],
      ['random bytes', Buffer.from(Array.from({ length: 3000 }, (_, i) => (i * 131 + 17) % 256))],
    ] as const) {
      expect(decodeCache(b, id), name).toBeUndefined();
    }
  });

  it('are written whole, under a name of their identity, and old ones are removed', () => {
    const folder = mkdtempSync(join(tmpdir(), 'plumbline-cache-test-'));
    const old = join(folder, 'check-json-old.bin');
    writeFileSync(old, 'x');
    const long = Date.now() - 40 * 24 * 3600 * 1000;
    utimesSync(old, long / 1000, long / 1000);
    const recent = join(folder, 'check-human-recent.bin');
    writeFileSync(recent, 'y');
    writeCache(folder, id, payload);
    expect(readCache(folder, id)?.payload.equals(payload)).toBe(true);
    expect(cacheFile(folder, id)).not.toBe(cacheFile(folder, { ...id, kind: 'rules:human' }));
    expect(existsSync(old)).toBe(false);
    expect(existsSync(recent)).toBe(true);
    // no temporary file is left behind
    expect(readdirSync(folder).filter((f) => f.endsWith('.tmp'))).toEqual([]);
    // a folder that went away: nothing written, nothing thrown
    expect(() => writeCache(join(folder, 'gone', 'deeper'), id, payload)).not.toThrow();
  });

  it('are kept only in a folder of this user that no one else can write to, or nowhere when turned off', () => {
    const base = mkdtempSync(join(tmpdir(), 'plumbline-cache-test-'));
    expect(cacheFolder({ PLUMBLINE_CODE_CACHE: 'off' })).toBeUndefined();
    expect(cacheFolder({ PLUMBLINE_CODE_CACHE: join(base, 'made') })).toBe(join(base, 'made'));
    if (process.platform !== 'win32') {
      const shared = join(base, 'shared');
      mkdirSync(shared);
      chmodSync(shared, 0o777);
      expect(cacheFolder({ PLUMBLINE_CODE_CACHE: shared })).toBeUndefined();
      symlinkSync(join(base, 'made'), join(base, 'link'));
      expect(cacheFolder({ PLUMBLINE_CODE_CACHE: join(base, 'link') })).toBeUndefined();
    }
    writeFileSync(join(base, 'file'), '');
    expect(cacheFolder({ PLUMBLINE_CODE_CACHE: join(base, 'file') })).toBeUndefined();
  });

  it('are kept per kind of run, read from the raw arguments', () => {
    expect(cacheKind(['paper.md', '-f', 'json'])).toBe('check:json');
    expect(cacheKind(['--format=sarif', 'paper.md'])).toBe('check:sarif');
    expect(cacheKind(['paper.md'])).toBe('check:human');
    expect(cacheKind(['rules'])).toBe('rules:human');
    expect(cacheKind(['batch', '--format', 'json'])).toBe('batch:json');
    // a file named like a command after the first word is a file
    expect(cacheKind(['paper.md', 'rules'])).toBe('check:human');
    expect(cacheKind(['-f', '../x', 'a.md'])).toBe('check:other');
    expect(cacheKind(['paper.md', '--watch'])).toBeUndefined();
    // the identity names the kind and the script's every byte
    expect(cacheIdentity(['a', Buffer.from('b')], 'check:json').bundle).not.toBe(cacheIdentity(['a', Buffer.from('c')], 'check:json').bundle);
  });
});

const manuscript = [
  '# Spacing and recall',
  '',
  'Recall improved with spacing, t(23) = 2.47, p = .021. Older readers gained less, t(40) = 1.10, p = .03.',
  '',
  'The practice group (M = 5.10, SD = 1.20, n = 20) outscored the reading group (M = 4.20, SD = 1.10, n = 20), t(38) = 2.47, p = .018.',
  '',
].join('\n');

/** The one cache file in `folder` whose name starts with `prefix`: its path, inode, bytes, header, identity and payload. */
function cacheOnDisk(folder: string, prefix = '') {
  const [name] = readdirSync(folder).filter((f) => f.startsWith(prefix) && f.endsWith('.bin'));
  const file = join(folder, name as string);
  const bytes = readFileSync(file);
  const start = bytes.indexOf(0x0a) + 1;
  const end = bytes.indexOf(0x0a, start);
  const header = JSON.parse(bytes.toString('utf8', start, end)) as CacheIdentity & { bytes: number; sha256: string; checked: number };
  const made: CacheIdentity = { bundle: header.bundle, node: header.node, v8: header.v8, arch: header.arch, flags: header.flags, kind: header.kind };
  return { file, ino: statSync(file).ino, bytes, header, made, payload: bytes.subarray(end + 1) };
}

/** A run of the bundled command with the cache in `folder` (or turned off). */
function bundled(args: string[], cwd: string, folder: string) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8', env: { ...process.env, PLUMBLINE_CODE_CACHE: folder } });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('the bundled command with its code cache', () => {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-cache-run-'));
  writeFileSync(join(dir, 'paper.md'), manuscript);

  it('writes the same report in every format without a cache, making one, and using it, as the sources do', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'plumbline-cache-'));
    for (const format of ['json', 'sarif', 'html', 'checklist', 'human', 'lines']) {
      const args = ['paper.md', '-f', format];
      const sources = await cli(args, { cwd: dir });
      const off = bundled(args, dir, 'off');
      const making = bundled(args, dir, folder);
      const files = readdirSync(folder).filter((f) => f.startsWith(`check-${format}-`));
      expect(files, format).toHaveLength(1);
      const made = statSync(join(folder, files[0] as string)).ino;
      const using = bundled(args, dir, folder);
      // V8 took the cache: a run that could not use it would have written another in its place
      expect(statSync(join(folder, files[0] as string)).ino, format).toBe(made);
      for (const [name, r] of [['cache off', off], ['making the cache', making], ['using the cache', using]] as const) {
        expect([r.code, r.stdout, r.stderr], `${format}, ${name}`).toEqual([sources.code, sources.stdout, sources.stderr]);
      }
    }
  }, 120_000);

  /** A cache made by a run of `args` in a folder of its own, with the report the same run gives without a cache. */
  const madeCache = (args: string[]) => {
    const folder = mkdtempSync(join(tmpdir(), 'plumbline-cache-'));
    const expected = bundled(args, dir, 'off');
    bundled(args, dir, folder);
    return { folder, expected, ...cacheOnDisk(folder) };
  };

  it('ignores a damaged, altered or stale cache file, reports as always, and writes a good one in its place', () => {
    const args = ['paper.md', '-f', 'json'];
    const { folder, expected, file, bytes: good, made, payload } = madeCache(args);
    const altered = Buffer.from(good);
    altered[altered.length - 1000] = (altered[altered.length - 1000] as number) ^ 0xff;
    const cases: Array<[string, Buffer]> = [
      ['cut short', good.subarray(0, good.length >> 1)],
      ['a payload byte changed', altered],
      ['made for another build', encodeCache({ ...made, bundle: 'b'.repeat(64) }, payload)],
      // whole and of the right identity, but not V8's data: V8 itself rejects it
      ['not code at all', encodeCache(made, Buffer.from(Array.from({ length: 4096 }, (_, i) => (i * 31 + 7) % 256)))],
      ['empty', Buffer.alloc(0)],
    ];
    for (const [what, bytes] of cases) {
      writeFileSync(file, bytes);
      const r = bundled(args, dir, folder);
      expect([r.code, r.stdout, r.stderr], what).toEqual([expected.code, expected.stdout, expected.stderr]);
      // replaced by a cache this build can use
      const now = readFileSync(file);
      expect(now.equals(bytes), what).toBe(false);
      expect(decodeCache(now, made), what).toBeDefined();
    }
  }, 120_000);

  it('a cache outgrown by a later run is replaced by that run, once; a run that checked less keeps it', () => {
    const folder = mkdtempSync(join(tmpdir(), 'plumbline-cache-'));
    writeFileSync(join(dir, 'notes.md'), '# Reading list\n\nNo statistics here, only words.\n');
    const header = () => {
      const { ino, header: h } = cacheOnDisk(folder, 'check-json-');
      return { ino, checked: h.checked };
    };
    const expected = { notes: bundled(['notes.md', '-f', 'json'], dir, 'off'), paper: bundled(['paper.md', '-f', 'json'], dir, 'off') };
    // the first run of its kind checks a text without statistics: it compiles little
    const runs = [bundled(['notes.md', '-f', 'json'], dir, folder)];
    const small = header();
    expect(small.checked).toBe(0);
    // a manuscript runs the check: its run replaces that cache with its own
    runs.push(bundled(['paper.md', '-f', 'json'], dir, folder));
    const full = header();
    expect(full.ino).not.toBe(small.ino);
    // its three t-tests
    expect(full.checked).toBe(3);
    // and then keeps it, as does a run of the text without statistics
    runs.push(bundled(['paper.md', '-f', 'json'], dir, folder), bundled(['notes.md', '-f', 'json'], dir, folder));
    expect(header()).toEqual(full);
    const want = [expected.notes, expected.paper, expected.paper, expected.notes];
    for (const [i, r] of runs.entries()) expect([r.code, r.stdout, r.stderr], `run ${i + 1}`).toEqual([want[i]?.code, want[i]?.stdout, want[i]?.stderr]);
  }, 120_000);

  it('a cache another run wrote meanwhile stays when that run checked as much or more', async () => {
    // the fuller cache, made in a folder of its own by a run on the manuscript
    const elsewhere = mkdtempSync(join(tmpdir(), 'plumbline-cache-'));
    bundled(['paper.md', '-f', 'json'], dir, elsewhere);
    const full = cacheOnDisk(elsewhere);
    expect(full.header.checked).toBe(3);
    // a run on standard input finds no cache as it loads, then waits for its text
    const folder = mkdtempSync(join(tmpdir(), 'plumbline-cache-'));
    const child = spawn(process.execPath, [BIN, '-', '-f', 'json'], { cwd: dir, env: { ...process.env, PLUMBLINE_CODE_CACHE: folder } });
    let stdout = '';
    child.stdout.setEncoding('utf8').on('data', (d: string) => (stdout += d));
    const ended = new Promise<number | null>((done) => child.on('close', done));
    // loaded long since (some 0.1 s here): the other run's cache is written now, under the same name
    await new Promise((done) => setTimeout(done, 2000));
    const target = join(folder, full.file.slice(elsewhere.length + 1));
    writeFileSync(target, full.bytes);
    child.stdin.end('No statistics here, only words.\n');
    expect(await ended).toBe(0);
    expect(JSON.parse(stdout).summary.results).toBe(0);
    // this run checked nothing here: it leaves the fuller cache as written
    expect(readFileSync(target).equals(full.bytes)).toBe(true);
    expect(readdirSync(folder).filter((f) => f.endsWith('.bin'))).toHaveLength(1);
  }, 120_000);

  it('a cache file made by a run that checked less than this one is replaced; one that checked more is kept', () => {
    const args = ['paper.md', '-f', 'json'];
    const { folder, expected, file, header, made, payload } = madeCache(args);
    expect(header.checked).toBe(3);
    for (const [recorded, replaced] of [
      [0, true],
      [500, false],
    ] as const) {
      writeFileSync(file, encodeCache(made, payload, recorded));
      const before = statSync(file).ino;
      const r = bundled(args, dir, folder);
      expect([r.code, r.stdout, r.stderr], String(recorded)).toEqual([expected.code, expected.stdout, expected.stderr]);
      expect(statSync(file).ino !== before, String(recorded)).toBe(replaced);
      expect(decodeCache(readFileSync(file), made)?.checked, String(recorded)).toBe(replaced ? 3 : recorded);
    }
  }, 120_000);

  it('a batch run, which sets its heap policy (src/cli/heap.ts) before the bundle is compiled, uses the cache it made', () => {
    // V8 rejects a cache made under other flags: set after compiling, the policy would make every batch run reject and rewrite its cache
    const folder = mkdtempSync(join(tmpdir(), 'plumbline-cache-'));
    const input = `${JSON.stringify({ id: 1, text: manuscript })}\n`;
    const batch = (cache: string) => spawnSync(process.execPath, [BIN, 'batch'], { cwd: dir, input, encoding: 'utf8', env: { ...process.env, PLUMBLINE_CODE_CACHE: cache } });
    const off = batch('off');
    const making = batch(folder);
    const files = readdirSync(folder).filter((f) => f.startsWith('batch-'));
    expect(files).toHaveLength(1);
    const made = statSync(join(folder, files[0] as string)).ino;
    const using = batch(folder);
    expect(statSync(join(folder, files[0] as string)).ino).toBe(made);
    for (const r of [making, using]) expect([r.status, r.stdout, r.stderr]).toEqual([off.status, off.stdout, off.stderr]);
  }, 120_000);

  it('runs without a cache where none can be kept', () => {
    const expected = bundled(['paper.md', '-f', 'json'], dir, 'off');
    const notAFolder = resolve(dir, 'paper.md');
    const r = bundled(['paper.md', '-f', 'json'], dir, notAFolder);
    expect([r.code, r.stdout, r.stderr]).toEqual([expected.code, expected.stdout, expected.stderr]);
  });
});

describe('the batch heap policy', () => {
  it('gives way to a heap-growing setting the process was started with, in its arguments or NODE_OPTIONS', () => {
    expect(hasOwnHeapGrowing([], undefined)).toBe(false);
    expect(hasOwnHeapGrowing(['--max-old-space-size=4096'], '--trace-warnings')).toBe(false);
    expect(hasOwnHeapGrowing(['--heap-growing-percent=20'], undefined)).toBe(true);
    expect(hasOwnHeapGrowing([], '--heap_growing_percent=80')).toBe(true);
    // and then sets nothing
    expect(growHeapSlowly(['--heap-growing-percent=20'], undefined)).toBe(false);
  });
});

describe('regular expressions compiled on first use', () => {
  it('gives way to a regexp tier-up setting the process was started with, in its arguments or NODE_OPTIONS', () => {
    expect(hasOwnRegexpTier([], undefined)).toBe(false);
    expect(hasOwnRegexpTier(['--max-old-space-size=4096'], '--trace-warnings')).toBe(false);
    expect(hasOwnRegexpTier(['--regexp-tier-up'], undefined)).toBe(true);
    expect(hasOwnRegexpTier([], '--regexp_tier_up_ticks=5')).toBe(true);
    // and then sets nothing
    expect(compileRegexpsAtOnce(['--regexp-tier-up-ticks=3'], undefined)).toBe(false);
  });
});
