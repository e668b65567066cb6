#!/usr/bin/env node
import { once } from 'node:events';
import { run } from './run.js';

process.exitCode = await run(process.argv.slice(2), {
  // wait for 'drain' when the pipe is full, so a batch run never buffers without bound
  stdout: async (s) => {
    if (!process.stdout.write(s)) await once(process.stdout, 'drain');
  },
  stderr: (s) => process.stderr.write(s),
  stdin: process.stdin,
  cwd: process.cwd(),
  env: process.env,
  isTTY: process.stdout.isTTY === true,
  stderrIsTTY: process.stderr.isTTY === true,
  columns: process.stdout.columns,
});
