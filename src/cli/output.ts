import { closeSync, fsyncSync, openSync, realpathSync, renameSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';

/**
 * An output file written atomically: everything goes to a temporary file beside it, which
 * replaces the target only when the run completes (`commit`). A failed run leaves any earlier
 * file of that name as it was.
 */
export class AtomicOutput {
  readonly target: string;
  private readonly temp: string;
  private fd: number | undefined;

  constructor(path: string, cwd: string) {
    this.target = resolve(cwd, path);
    this.temp = join(dirname(this.target), `.${basename(this.target)}.${process.pid}.${Date.now()}.tmp`);
    // 'wx': never follow or reuse an existing file of that name
    this.fd = openSync(this.temp, 'wx', 0o644);
  }

  write(s: string): void {
    if (this.fd === undefined) throw new Error('output already closed');
    const b = Buffer.from(s, 'utf8');
    let done = 0;
    while (done < b.length) done += writeSync(this.fd, b, done, b.length - done);
  }

  commit(): void {
    if (this.fd === undefined) return;
    fsyncSync(this.fd);
    closeSync(this.fd);
    this.fd = undefined;
    renameSync(this.temp, this.target);
  }

  abort(): void {
    if (this.fd !== undefined) {
      closeSync(this.fd);
      this.fd = undefined;
    }
    try {
      unlinkSync(this.temp);
    } catch {
      // already gone
    }
  }
}

/** The real path of a file, or its resolved path when it does not exist (yet). */
export function identity(path: string, cwd: string): string {
  const abs = resolve(cwd, path);
  try {
    return realpathSync(abs);
  } catch {
    try {
      return join(realpathSync(dirname(abs)), basename(abs));
    } catch {
      return abs;
    }
  }
}
