import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';

/**
 * The server's checker runs each document on a worker thread of the compiled command line
 * (`npm test` builds dist/ first), so it is loaded from there: from the sources it would check in
 * this thread and there would be no budget to test.
 */
const { Checker } = (await import(pathToFileURL(resolve('dist/src/lsp/checker.js')).href)) as typeof import('../../src/lsp/checker.js');

describe('the language server\'s checker', { timeout: 60_000 }, () => {
  it('drops a check over its time budget with a logged message, and checks the next document', async () => {
    const logged: string[] = [];
    // a budget of a millisecond: no check of a whole manuscript fits in it
    const tight = new Checker({ memoryMb: 256, seconds: 0.001 }, 1, (m) => logged.push(m));
    const text = 'Scores rose, t(23) = 5.90, p = .000.\n'.repeat(2000);
    const outcome = await tight.check({ key: 'a', path: 'a.md', source: text, options: {} });
    expect(outcome).toMatchObject({ dropped: true });
    expect(logged.join('\n')).toContain('dropped the check of a.md');
    await tight.close();

    const roomy = new Checker({ memoryMb: 256, seconds: 30 }, 2, (m) => logged.push(m));
    const [a, b] = await Promise.all([roomy.check({ key: 'a', path: 'a.md', source: text, options: {} }), roomy.check({ key: 'b', path: 'b.md', source: 'x, t(23) = 5.90, p = .000.', options: {} })]);
    expect('report' in a && a.report.findings.length).toBeGreaterThan(0);
    expect('report' in b && b.report.findings.map((f) => f.ruleId)).toContain('zero-p-is-a-bound');
    await roomy.close();
  });

  it('re-checks a document edit after edit on the worker that keeps its last parse, as a whole check reads it', async () => {
    const { checkSource } = (await import(pathToFileURL(resolve('dist/src/engine/index.js')).href)) as typeof import('../../src/engine/index.js');
    const checker = new Checker({ memoryMb: 256, seconds: 30 }, 2, () => undefined);
    const base = 'Scores rose, t(23) = 2.90, p = .008.\n\nRecall fell, t(40) = 1.10, p = .28.\n';
    // each text one edit from the one before: a digit changed, one added, a paragraph split, the document closed and opened again
    const texts = [base, base.replace('2.90', '2.99'), base.replace('2.90', '2.991'), base.replace('fell, ', 'fell,\n\n'), base];
    for (const [i, text] of texts.entries()) {
      if (i === 4) checker.forget('doc');
      const outcome = await checker.check({ key: 'doc', path: 'a.md', source: text, options: {} });
      // the checker's report carries the text it checked, as a whole check's does
      expect('report' in outcome && outcome.report, `text ${i}`).toStrictEqual(checkSource('a.md', text));
    }
    await checker.close();
  });
});

/**
 * A worker script that ends its thread without an error: the compiled worker, preceded by a
 * listener that calls process.exit on a document holding `EXIT-NOW`, or, with `atLoad`, one that
 * exits before the worker loads.
 */
function exitingWorker(atLoad = false): string {
  const file = join(mkdtempSync(join(tmpdir(), 'plumbline-lsp-exit-')), 'worker.mjs');
  const real = pathToFileURL(resolve('dist/src/cli/worker.js')).href;
  writeFileSync(
    file,
    atLoad
      ? 'process.exit(3);\n'
      : `import { parentPort } from 'node:worker_threads';\nparentPort.on('message', (job) => { if (typeof job.source === 'string' && job.source.includes('EXIT-NOW')) process.exit(3); });\nawait import(${JSON.stringify(real)});\n`,
  );
  return file;
}

describe('the language server\'s checker when a worker thread exits without an error', { timeout: 60_000 }, () => {
  it('drops only the check it was running, with the exit code, and checks the next document on a new worker', async () => {
    const checker = new Checker({ memoryMb: 256, seconds: 30 }, 1, () => undefined, exitingWorker());
    const dropped = await checker.check({ key: 'a', path: 'a.md', source: 'EXIT-NOW, t(23) = 2.90, p = .008.', options: {} });
    expect(dropped).toEqual({ error: 'not checked: the check stopped: its worker thread exited (exit code 3)', dropped: true });
    const next = await checker.check({ key: 'b', path: 'b.md', source: 'x, t(23) = 5.90, p = .000.', options: {} });
    expect('report' in next && next.report.findings.map((f) => f.ruleId)).toContain('zero-p-is-a-bound');
    await checker.close();
  });

  it('a replacement that fails while loading, in a slot whose worker loaded before, is tried again: the checks stay on workers', async () => {
    // the first worker exits on a document; the second exits while loading; the third loads. The
    // worker script logs each start and each job, so the test sees where the next check ran
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-lsp-retry-'));
    const log = join(dir, 'log.txt');
    const file = join(dir, 'worker.mjs');
    const real = pathToFileURL(resolve('dist/src/cli/worker.js')).href;
    writeFileSync(
      file,
      [
        "import { parentPort } from 'node:worker_threads';",
        "import { appendFileSync, readFileSync } from 'node:fs';",
        `const log = ${JSON.stringify(log)};`,
        "appendFileSync(log, 'start\\n');",
        "const starts = readFileSync(log, 'utf8').split('\\n').filter((l) => l === 'start').length;",
        'if (starts === 2) process.exit(4);',
        "parentPort.on('message', (job) => { if (job.path !== undefined) appendFileSync(log, `job ${job.path}\\n`); if (String(job.source).includes('EXIT-NOW')) process.exit(3); });",
        `await import(${JSON.stringify(real)});`,
        '',
      ].join('\n'),
    );
    const logged: string[] = [];
    const checker = new Checker({ memoryMb: 256, seconds: 30 }, 1, (m) => logged.push(m), file);
    const dropped = await checker.check({ key: 'a', path: 'a.md', source: 'EXIT-NOW, t(23) = 2.90, p = .008.', options: {} });
    expect(dropped).toMatchObject({ dropped: true });
    const next = await checker.check({ key: 'b', path: 'b.md', source: 'x, t(23) = 5.90, p = .000.', options: {} });
    expect('report' in next && next.report.findings.map((f) => f.ruleId)).toContain('zero-p-is-a-bound');
    await checker.close();
    expect(readFileSync(log, 'utf8').split('\n').filter(Boolean)).toEqual(['start', 'job a.md', 'start', 'start', 'job b.md']);
    expect(logged).toEqual([]);
  });

  it('one that cannot load is given up with a logged message, and the checks run in this thread', async () => {
    const logged: string[] = [];
    const checker = new Checker({ memoryMb: 256, seconds: 30 }, 2, (m) => logged.push(m), exitingWorker(true));
    const outcome = await checker.check({ key: 'b', path: 'b.md', source: 'x, t(23) = 5.90, p = .000.', options: {} });
    expect('report' in outcome && outcome.report.findings.map((f) => f.ruleId)).toContain('zero-p-is-a-bound');
    expect(logged).toEqual([
      'plumbline: a worker thread could not start: it exited with code 3',
      'plumbline: a worker thread could not start: it exited with code 3; checks run in this thread',
    ]);
    await checker.close();
  });
});
