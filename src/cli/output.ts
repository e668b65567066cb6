import { closeSync, fchmodSync, fsyncSync, openSync, readdirSync, readlinkSync, realpathSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
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
}

/** `-o` names standard output or standard error: the run writes to that stream as it would without `-o`. */
export type Destination = { stream: 'stdout' | 'stderr'; target: string } | { sink: ReportSink };

/**
 * Open the report's destination.
 *
 * - A symbolic link is written through: the file it points at is written, the link stays.
 * - /dev/stdout and /dev/stderr (and /dev/fd/1, /dev/fd/2, /proc/self/fd/…) are the process's
 *   own streams: written as they are, so a shell's redirection to a file is appended to.
 * - Another descriptor (/dev/fd/63 from a shell's `>(…)`) is written as it is, when the shell
 *   handed it over; the process's own descriptors are refused.
 * - A FIFO, device or other non-regular file is written directly, never replaced.
 * - A regular file (or a new one) is written atomically: a temporary file beside the link's
 *   target, with the old file's permissions, replaces it only when the run completes, so a
 *   failed run leaves an earlier report as it was.
 */
export function openDestination(path: string, cwd: string): Destination {
  const target = followLinks(resolve(cwd, path));
  const fd = descriptorNamed(target);
  if (fd === 1) return { stream: 'stdout', target };
  if (fd === 2) return { stream: 'stderr', target };
  if (fd !== undefined) return { sink: new DescriptorOutput(target, inherited(fd)) };
  let existing;
  try {
    existing = statSync(target);
  } catch {
    existing = undefined;
  }
  if (existing?.isDirectory()) throw Object.assign(new Error('is a folder'), { code: 'EISDIR' });
  if (existing !== undefined && !existing.isFile()) return { sink: new DirectOutput(target, 'w') };
  return { sink: new AtomicOutput(target, existing?.mode) };
}

/** The same, for files that must be regular (a baseline, an annotated copy): never a FIFO, device or descriptor. */
export function openRegularFile(path: string, cwd: string): ReportSink & { writeBytes(b: Uint8Array): void } {
  const target = followLinks(resolve(cwd, path));
  let existing;
  try {
    existing = statSync(target);
  } catch {
    existing = undefined;
  }
  if (descriptorNamed(target) !== undefined || (existing !== undefined && !existing.isFile())) throw Object.assign(new Error('not a regular file'), { code: 'ENOTREG' });
  return new AtomicOutput(target, existing?.mode);
}

/**
 * The path a chain of symbolic links ends at, following each link (also one that dangles, so
 * `-o link` creates the file the link names). Descriptor links (/proc/self/fd/N) end the walk.
 */
function followLinks(path: string): string {
  let current = path;
  for (let hops = 0; hops < 40; hops++) {
    if (descriptorNamed(current) !== undefined) return current;
    let link: string;
    try {
      link = readlinkSync(current);
    } catch {
      return current; // not a link, or not there yet
    }
    current = resolve(dirname(current), link);
  }
  throw Object.assign(new Error('too many levels of symbolic links'), { code: 'ELOOP' });
}

/**
 * A descriptor the shell handed over (`-o /dev/fd/63` from `>(…)`, or `9>file`), checked before
 * it is written. The process's own descriptors are refused: Node's event loop (eventfd, epoll),
 * sockets, and its internal pipes, which are the pipes whose two ends are both open here. A
 * descriptor that is not open is refused too.
 */
function inherited(fd: number): number {
  let link: string;
  try {
    link = readlinkSync(`/proc/self/fd/${fd}`);
  } catch {
    throw Object.assign(new Error(`descriptor ${fd} is not open`), { code: 'EDESCRIPTOR' });
  }
  const own = () => Object.assign(new Error(`descriptor ${fd} is one of plumbline's own, not one handed to it`), { code: 'EDESCRIPTOR' });
  if (/^(anon_inode|socket):/.test(link)) throw own();
  if (link.startsWith('pipe:')) {
    let ends = 0;
    for (const other of readdirSync('/proc/self/fd')) {
      try {
        if (readlinkSync(`/proc/self/fd/${other}`) === link) ends += 1;
      } catch {
        // closed meanwhile (the listing itself)
      }
    }
    if (ends > 1) throw own();
  }
  return fd;
}

/** An inherited descriptor: written as it is and left open. */
class DescriptorOutput implements ReportSink {
  private closed = false;
  constructor(
    readonly target: string,
    private readonly fd: number,
  ) {}

  write(s: string): void {
    if (this.closed) return;
    try {
      writeAll(this.fd, s);
    } catch (e) {
      // the reader went away: stop writing, quietly
      if ((e as NodeJS.ErrnoException).code === 'EPIPE') this.closed = true;
      else throw e;
    }
  }

  commit(): void {}

  abort(): void {}
}

/** The descriptor a path names: /dev/stdout, /dev/stderr, /dev/fd/N, /proc/self/fd/N, /proc/<this pid>/fd/N. */
function descriptorNamed(path: string): number | undefined {
  if (path === '/dev/stdout') return 1;
  if (path === '/dev/stderr') return 2;
  const m = /^\/(?:dev|proc\/self|proc\/(\d{1,10}))\/fd\/(\d{1,6})$/.exec(path);
  if (!m || (m[1] !== undefined && Number(m[1]) !== process.pid)) return undefined;
  return Number(m[2]);
}

class AtomicOutput implements ReportSink {
  readonly target: string;
  private readonly temp: string;
  private fd: number | undefined;

  constructor(target: string, mode: number | undefined) {
    this.target = target;
    this.temp = join(dirname(target), `.${basename(target)}.${process.pid}.${Date.now()}.tmp`);
    // 'wx': never follow or reuse an existing file of that name
    this.fd = openSync(this.temp, 'wx', 0o644);
    // a report replaced keeps the permissions it had (a private report stays private)
    if (mode !== undefined) fchmodSync(this.fd, mode & 0o7777);
  }

  write(s: string): void {
    if (this.fd === undefined) throw new Error('output already closed');
    writeAll(this.fd, s);
  }

  /** Bytes as they are (an annotated copy of a Word file). */
  writeBytes(b: Uint8Array): void {
    if (this.fd === undefined) throw new Error('output already closed');
    writeAll(this.fd, b);
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

/** A FIFO, terminal, device or descriptor link: opened for writing as it is, never replaced. */
class DirectOutput implements ReportSink {
  readonly target: string;
  private closed = false;
  private fd: number | undefined;

  constructor(target: string, flags: 'w') {
    this.target = target;
    this.fd = openSync(target, flags);
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

const pause = new Int32Array(new SharedArrayBuffer(4));

function writeAll(fd: number, s: string | Uint8Array): void {
  const b = typeof s === 'string' ? Buffer.from(s, 'utf8') : s;
  let done = 0;
  while (done < b.length) {
    try {
      done += writeSync(fd, b, done, b.length - done);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'EAGAIN') throw e;
      // a non-blocking pipe that is full: wait a moment rather than spin
      Atomics.wait(pause, 0, 0, 5);
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
