import { spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from './harness.js';

/** --watch, as a person runs it: the built command line (`npm test` builds it first), a file edited while it runs, then Ctrl-C. */
describe('--watch', { timeout: 60_000 }, () => {
  it('checks, checks again after the file changes, and stops on SIGINT', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pl-watch-'));
    writeFileSync(join(dir, 'm.md'), 'Scores rose, t(23) = 5.90, p < .001.\n');
    const child = spawn(process.execPath, [resolve('dist/src/cli/main.js'), '--watch', '-f', 'lines', 'm.md'], { cwd: dir, stdio: 'pipe' });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
    const runs = (n: number) =>
      new Promise<void>((done) => {
        const look = () => {
          if ((stderr.match(/run done/g) ?? []).length >= n) {
            child.stderr.off('data', onData);
            done();
          }
        };
        const onData = (d: Buffer) => {
          stderr += d.toString();
          look();
        };
        child.stderr.on('data', onData);
        look();
      });
    await runs(1);
    expect(stdout).not.toContain('zero-p-is-a-bound');
    const firstRun = stdout.length;
    writeFileSync(join(dir, 'm.md'), 'Scores rose, t(23) = 5.90, p = .000.\n');
    await runs(2);
    expect(stderr).toContain('checking again (m.md changed)');
    expect(stdout.slice(firstRun)).toContain('m.md:1:28: warning zero-p-is-a-bound');
    // not a terminal: the screen is not cleared
    expect(stdout).not.toContain('\u001b[2J');
    child.kill('SIGINT');
    const code = await new Promise<number | null>((done) => child.once('exit', (c) => done(c)));
    expect(code).toBe(0);
  });

  it('refuses what a loop of runs would not serve: -o, --write-baseline, --fix, standard input', async () => {
    for (const args of [['-o', 'r.txt'], ['--write-baseline', 'b.json'], ['--fix'], ['-']]) {
      const out = await cli(['--watch', ...args, 'm.md']);
      expect(out.code, args.join(' ')).toBe(2);
      expect(out.stderr).toContain('--watch does not go with');
    }
  });
});
