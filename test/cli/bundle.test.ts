import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { quickAnswer } from '../../src/cli/quick.js';
import { BIN, cli } from './harness.js';

/**
 * The command ships as an esbuild bundle (scripts/build-cli.mjs, package.json's bin). These
 * check that it answers as the sources do, and that --version and --help load only a small part
 * of it. Every manuscript here is invented.
 */
const binDir = dirname(BIN);
const recorder = resolve(import.meta.dirname, '../fixtures/bundle/record-loads.mjs');

/** The bytes of the bundle's files a run of `args` loaded (recorded by Node's module hooks), and of the whole bundle. */
function loadedBytes(args: string[]): { loaded: number; total: number; files: string[] } {
  const log = join(mkdtempSync(join(tmpdir(), 'plumbline-loads-')), 'loads.txt');
  writeFileSync(log, '');
  const r = spawnSync(process.execPath, ['--import', recorder, BIN, ...args], { encoding: 'utf8', env: { ...process.env, PLUMBLINE_LOADS: log } });
  expect(r.status, r.stderr).toBe(0);
  const files = [...new Set(readFileSync(log, 'utf8').split('\n').filter((u) => u.startsWith('file:')).map((u) => fileURLToPath(u)))].filter((f) => dirname(f) === binDir);
  const total = readdirSync(binDir).filter((f) => f.endsWith('.js') || f.endsWith('.cjs')).reduce((n, f) => n + statSync(join(binDir, f)).size, 0);
  return { loaded: files.reduce((n, f) => n + statSync(f).size, 0), total, files };
}

describe('the bundled command', () => {
  it('answers --version and --help as the full command line does, in the bundle too', async () => {
    for (const args of [['--version'], ['-v'], ['--help'], ['-h']]) {
      const full = await cli(args, { columns: 100 });
      expect(quickAnswer(args, 100), args.join(' ')).toBe(full.stdout);
      // the bundle on a pipe: no columns, so the help is wrapped at 100 as in the harness
      const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8' });
      expect([r.status, r.stdout], args.join(' ')).toEqual([0, full.stdout]);
    }
    expect(quickAnswer(['--version', 'x.md'], 100)).toBeUndefined();
    expect(quickAnswer(['rules'], 100)).toBeUndefined();
  });

  it('loads under a tenth of itself for --version and --help, the start-up bundle for a check, and pdf.js only for a PDF', () => {
    for (const args of [['--version'], ['--help']]) {
      const { loaded, total, files } = loadedBytes(args);
      expect(loaded, args.join(' ')).toBeGreaterThan(0);
      expect(loaded / total, args.join(' ')).toBeLessThan(0.1);
      expect(files, args.join(' ')).not.toContain(join(binDir, 'run.cjs'));
    }
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-bundle-'));
    writeFileSync(join(dir, 'a.md'), 'Recall improved with spacing, t(23) = 2.47, p = .021.\n');
    const check = loadedBytes([join(dir, 'a.md'), '-f', 'json']);
    // the checker is the start-up bundle, compiled with its code cache (src/cli/load.ts)
    expect(check.files).toContain(join(binDir, 'run.cjs'));
    // the PDF readers (pdf.js, pdf-lib) are modules beside it, loaded only for such a file
    const pdf = loadedBytes([resolve(import.meta.dirname, '../../fixtures/pdf/table.pdf'), '-f', 'json']);
    const binaryOnly = pdf.files.filter((f) => !check.files.includes(f));
    expect(binaryOnly).toContain(join(binDir, 'pdfjs.js'));
    const binaryBytes = binaryOnly.reduce((n, f) => n + statSync(f).size, 0);
    expect(binaryBytes).toBeGreaterThan(statSync(join(binDir, 'run.cjs')).size / 2);
  }, 60_000);

  it('reports a configuration that breaks the schema as the sources do (its validator is generated ahead of time)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-bundle-'));
    writeFileSync(join(dir, 'a.md'), 'Recall improved with spacing, t(23) = 2.47, p = .021.\n');
    writeFileSync(join(dir, '.plumbline.json'), '{"alpha": 2, "rules": {"no-such-rule": "off"}}');
    const full = await cli(['a.md', '-f', 'json'], { cwd: dir });
    const r = spawnSync(process.execPath, [BIN, 'a.md', '-f', 'json'], { cwd: dir, encoding: 'utf8' });
    expect(full.code).toBe(2);
    expect(full.stderr).toMatch(/configuration/);
    expect([r.status, r.stderr, r.stdout]).toEqual([full.code, full.stderr, full.stdout]);
  });
});
