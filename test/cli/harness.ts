import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { Readable } from 'node:stream';
import { run } from '../../src/cli/run.js';

/** The command as installed: package.json's `bin`, the bundle `npm run build` writes (scripts/build-cli.mjs). */
export const BIN = resolve(import.meta.dirname, '../..', (JSON.parse(readFileSync(resolve(import.meta.dirname, '../../package.json'), 'utf8')) as { bin: { plumbline: string } }).bin.plumbline);

/** What one in-process run of the CLI gave. */
export interface Outcome {
  code: number;
  stdout: string;
  stderr: string;
  /** The longest single write to standard output, in characters (the CLI streams large reports). */
  largestWrite?: number;
}

export interface RunOptions {
  stdin?: string | Buffer;
  cwd?: string;
  env?: NodeJS.ProcessEnv;
  isTTY?: boolean;
  stderrIsTTY?: boolean;
  columns?: number;
}

/** Run the CLI in this process with its streams captured (no terminal, 100 columns, empty environment unless given). */
export async function cli(args: string[], options: RunOptions = {}): Promise<Outcome> {
  let stdout = '';
  let stderr = '';
  let largestWrite = 0;
  const code = await run(args, {
    stdout: (s) => {
      stdout += s;
      largestWrite = Math.max(largestWrite, s.length);
    },
    stderr: (s) => {
      stderr += s;
    },
    stdin: Readable.from([options.stdin ?? '']),
    cwd: options.cwd ?? process.cwd(),
    env: options.env ?? {},
    isTTY: options.isTTY ?? false,
    stderrIsTTY: options.stderrIsTTY ?? false,
    columns: options.columns ?? 100,
  });
  return { code, stdout, stderr, largestWrite };
}
