import { closeSync, fsyncSync, openSync, readlinkSync, realpathSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';

/** Where a report goes when it is not standard output. */
export interface ReportSink {
  /** The path the report lands at (after following symbolic links). */
  readonly target: string;
  write(s: string): void;
  /** The run completed: make the report visible. */
  commit(): void;
  /** The run failed or was refused: leave any earlier file as it was. */
  abort(): void;
  /** The reader went away (a FIFO whose reader closed): later writes are dropped. */
  readonly closed: boolean;
}

/**
 * Open the report's destination.
 *
 * - A symbolic link is written through: the file it points at is written, the link stays.
 * - A FIFO, device or other non-regular file is written directly (never replaced): `-o /dev/stdout`
 *   writes to standard output, `-o pipe` feeds the pipe's reader.
 * - A regular file (or a new one) is written atomically: a temporary file beside the link's
 *   target replaces it only when the run completes, so a failed run leaves an earlier report as
 *   it was.
 */
export function openReportSink(path: string, cwd: string): ReportSink {
  const target = followLinks(resolve(cwd, path));
  // standard output, standard error or another inherited descriptor: written through the
  // descriptor itself, so a shell's redirection to a file is appended to, never replaced
  const fd = inheritedDescriptor(target);
  if (fd !== undefined) return new DescriptorOutput(target, fd);
  let existing;
  try {
    existing = statSync(target);
  } catch {
    existing = undefined;
  }
  if (existing !== undefined && !existing.isFile()) {
    if (existing.isDirectory()) throw Object.assign(new Error('is a folder'), { code: 'EISDIR' });
    return new DirectOutput(target);
  }
  return new AtomicOutput(target);
}

/**
 * The path a chain of symbolic links ends at, following each link (also one that dangles, so
 * `-o link` creates the file the link names). Kernel "magic" links such as /proc/self/fd/1 that
 * name no path (`pipe:[…]`) end the walk at the link itself, which opening follows.
 */
function followLinks(path: string): string {
  let current = path;
  for (let hops = 0; hops < 40; hops++) {
    if (inheritedDescriptor(current) !== undefined) return current;
    let link: string;
    try {
      link = readlinkSync(current);
    } catch {
      return current; // not a link, or not there yet
    }
    if (!link.startsWith('/') && /^[a-z]+:\[/.test(link)) return current;
    current = resolve(dirname(current), link);
  }
  throw Object.assign(new Error('too many levels of symbolic links'), { code: 'ELOOP' });
}

/** The descriptor a path names: /dev/stdout, /dev/stderr, /dev/fd/N, /proc/self/fd/N. */
function inheritedDescriptor(path: string): number | undefined {
  if (path === '/dev/stdout') return 1;
  if (path === '/dev/stderr') return 2;
  const m = /^\/(?:dev|proc\/self)\/fd\/(\d{1,6})$/.exec(path) ?? (process.pid > 0 ? new RegExp(`^/proc/${process.pid}/fd/(\\d{1,6})$`).exec(path) : null);
  return m ? Number(m[1]) : undefined;
}

/** An inherited descriptor, written as it is and left open. */
class DescriptorOutput implements ReportSink {
  closed = false;
  constructor(
    readonly target: string,
    private readonly fd: number,
  ) {}

  write(s: string): void {
    if (this.closed) return;
    try {
      writeAll(this.fd, s);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      // the reader went away: stop writing, quietly
      if (code === 'EPIPE') this.closed = true;
      else throw e;
    }
  }

  commit(): void {}

  abort(): void {}
}

class AtomicOutput implements ReportSink {
  readonly target: string;
  readonly closed = false;
  private readonly temp: string;
  private fd: number | undefined;

  constructor(target: string) {
    this.target = target;
    this.temp = join(dirname(target), `.${basename(target)}.${process.pid}.${Date.now()}.tmp`);
    // 'wx': never follow or reuse an existing file of that name
    this.fd = openSync(this.temp, 'wx', 0o644);
  }

  write(s: string): void {
    if (this.fd === undefined) throw new Error('output already closed');
    writeAll(this.fd, s);
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

/** A FIFO, terminal or device: opened for writing as it is, never replaced. */
class DirectOutput implements ReportSink {
  readonly target: string;
  closed = false;
  private fd: number | undefined;

  constructor(target: string) {
    this.target = target;
    this.fd = openSync(target, 'w');
  }

  write(s: string): void {
    if (this.fd === undefined || this.closed) return;
    try {
      writeAll(this.fd, s);
    } catch (e) {
      // the reader went away: stop writing, quietly
      if ((e as NodeJS.ErrnoException).code === 'EPIPE') this.closed = true;
      else throw e;
    }
  }

  commit(): void {
    this.close();
  }

  abort(): void {
    this.close();
  }

  private close(): void {
    if (this.fd !== undefined) closeSync(this.fd);
    this.fd = undefined;
  }
}

function writeAll(fd: number, s: string): void {
  const b = Buffer.from(s, 'utf8');
  let done = 0;
  while (done < b.length) {
    try {
      done += writeSync(fd, b, done, b.length - done);
    } catch (e) {
      // a non-blocking FIFO or terminal that is momentarily full
      if ((e as NodeJS.ErrnoException).code !== 'EAGAIN') throw e;
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
