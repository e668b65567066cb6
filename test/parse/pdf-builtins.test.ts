import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { importPdfJs, keepBuiltIns } from '../../src/parse/pdf/pdfjs.js';

/**
 * pdf.js's legacy build replaces built-in methods for the whole process when it is imported
 * (polyfills bundled with it). Reading a PDF must not leave the rest of a run on them: the
 * built-ins' own methods are put back after the import, and what the import adds stays.
 * Each test file runs in a thread of its own, so these are the thread's first built-ins.
 */
const before = { push: Array.prototype.push, parse: JSON.parse, toString: Function.prototype.toString };

describe('reading a PDF leaves the built-ins as they were', () => {
  it('pdf.js imported bare replaces Array.prototype.push, JSON.parse and Function.prototype.toString (why the guard exists)', () => {
    const probe = [
      "const p = Array.prototype.push, j = JSON.parse, t = Function.prototype.toString;",
      "await import('pdfjs-dist/legacy/build/pdf.worker.mjs');",
      "await import('pdfjs-dist/legacy/build/pdf.mjs');",
      'console.log(JSON.stringify([Array.prototype.push === p, JSON.parse === j, Function.prototype.toString === t]));',
    ].join('\n');
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', probe], { encoding: 'utf8' });
    expect(r.status).toBe(0);
    // if this fails, a new pdf.js leaves them alone, and keepBuiltIns only guards against a return
    expect(JSON.parse(r.stdout) as boolean[]).toEqual([false, false, false]);
  }, 60_000);

  it('after importPdfJs the methods are the ones from before, and what pdf.js adds for Node 20 is there', async () => {
    const { pdfjs } = await importPdfJs();
    expect(typeof pdfjs.getDocument).toBe('function');
    expect(Array.prototype.push).toBe(before.push);
    expect(JSON.parse).toBe(before.parse);
    expect(Function.prototype.toString).toBe(before.toString);
    expect(typeof (Promise as unknown as { withResolvers?: unknown }).withResolvers).toBe('function');
  }, 60_000);

  it('keepBuiltIns puts back a replaced method, keeps an added one, and passes on the load\'s value and failure', async () => {
    const at = Array.prototype.at;
    const proto = Array.prototype as unknown as Record<string, unknown>;
    try {
      const value = await keepBuiltIns(async () => {
        proto.at = () => 'replaced';
        proto.plumblineAdded = () => 'added';
        return 42;
      });
      expect(value).toBe(42);
      expect(Array.prototype.at).toBe(at);
      expect(typeof proto.plumblineAdded).toBe('function');
      await expect(
        keepBuiltIns(async () => {
          proto.at = () => 'replaced again';
          throw new Error('load failed');
        }),
      ).rejects.toThrow('load failed');
      expect(Array.prototype.at).toBe(at);
    } finally {
      Array.prototype.at = at;
      delete proto.plumblineAdded;
    }
  });
});
