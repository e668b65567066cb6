#!/usr/bin/env node
import { quickAnswer } from './quick.js';

/**
 * Standard output that stops quietly when its reader goes away (`| head`, `| grep -m1`,
 * quitting `less`): later writes are dropped and the exit status stays what the findings
 * decide. Writes wait for 'drain' when the pipe is full, so a batch run never buffers without
 * bound.
 */
let stdoutGone = false;
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  stdoutGone = true;
  if (e.code === 'EPIPE' || e.code === 'ERR_STREAM_DESTROYED') return;
  // a full disk or a closed descriptor: said, and the run is trouble (exit 2), not findings
  process.stderr.write(`plumbline: cannot write the report to standard output: ${e.code === 'ENOSPC' ? 'no space left on the device' : e.message}\n`);
  process.exit(2);
});

process.stderr.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code !== 'EPIPE' && e.code !== 'ERR_STREAM_DESTROYED') throw e;
});

function writeStdout(s: string): void | Promise<void> {
  if (stdoutGone) return;
  if (process.stdout.write(s)) return;
  return new Promise<void>((done) => {
    const finish = () => {
      process.stdout.off('drain', finish);
      process.stdout.off('error', finish);
      process.stdout.off('close', finish);
      done();
    };
    process.stdout.once('drain', finish);
    process.stdout.once('error', finish);
    process.stdout.once('close', finish);
  });
}

const argv = process.argv.slice(2);
// --version and --help alone are answered before the checker, yargs and the formatters load
const quick = quickAnswer(argv, process.stdout.columns);
if (quick !== undefined) await writeStdout(quick);
else {
  // the rest loads now: in the bundle, run.cjs with its code cache (load.ts)
  const { loadRun } = await import('./load.js');
  const loaded = await loadRun(argv, process.env);
  process.exitCode = await loaded.run(argv, {
    stdout: writeStdout,
    stderr: (s) => {
      process.stderr.write(s);
    },
    stdin: process.stdin,
    cwd: process.cwd(),
    env: process.env,
    isTTY: process.stdout.isTTY === true,
    stderrIsTTY: process.stderr.isTTY === true,
    columns: process.stdout.columns,
  });
  loaded.save();
  // The run is over and its files are written (synchronously, output.ts). Once standard output
  // and error have taken every byte, exit at once: the natural end of the process would first
  // take the whole heap apart (some 10 ms after a 50 KB manuscript), which no one waits for.
  await Promise.all([flushed(process.stdout), flushed(process.stderr)]);
  process.exit();
}

/** Resolves once `stream` has handed on every byte written to it (at once where writes are synchronous). */
function flushed(stream: NodeJS.WriteStream): Promise<void> {
  if (stream.destroyed || stream.writableLength === 0) return Promise.resolve();
  return new Promise<void>((done) => {
    stream.write('', () => done());
  });
}
