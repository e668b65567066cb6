import { closeSync, fstatSync, openSync, readSync, statSync } from 'node:fs';

/** Why a file was not read. `error` carries the system's error (ENOENT, EACCES, …). */
export type RegularFileProblem = { problem: 'folder' } | { problem: 'not-regular' } | { problem: 'too-large'; size: number } | { problem: 'error'; error: unknown };

/**
 * The one way plumbline reads a file from a repository (a manuscript, a configuration, a
 * baseline, a .gitignore): stat before opening, since opening a FIFO or a device could block or
 * never end; only a regular file, checked again on what was opened (the path may have been
 * replaced since); and only within `maxBytes`, checked before anything is read.
 */
export function readRegularFile(path: string, maxBytes: number): ({ ok: true; bytes: Buffer } | ({ ok: false } & RegularFileProblem)) {
  let fd: number | undefined;
  try {
    const s = statSync(path);
    if (s.isDirectory()) return { ok: false, problem: 'folder' };
    if (!s.isFile()) return { ok: false, problem: 'not-regular' };
    fd = openSync(path, 'r');
    const stat = fstatSync(fd);
    if (!stat.isFile()) return { ok: false, problem: 'not-regular' };
    if (stat.size > maxBytes) return { ok: false, problem: 'too-large', size: stat.size };
    const bytes = Buffer.allocUnsafe(stat.size);
    let read = 0;
    while (read < stat.size) {
      const n = readSync(fd, bytes, read, stat.size - read, read);
      if (n === 0) break;
      read += n;
    }
    return { ok: true, bytes: bytes.subarray(0, read) };
  } catch (error) {
    return { ok: false, problem: 'error', error };
  } finally {
    if (fd !== undefined) closeSync(fd);
  }
}
