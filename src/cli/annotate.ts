import { resolve } from 'node:path';
import { readRegularFile } from '../config/index.js';
import type { RunReport } from '../report/index.js';
import { identity, openRegularFile } from './output.js';
import { describeError } from './files.js';

/**
 * `--annotate OUT`: a copy of the one file checked, with its findings on it, written atomically
 * to OUT (never over the file checked). By the kind of file the check read: a PDF gets a
 * highlight and a note per finding (src/report/annotatePdf.ts). Undefined when written, else why not.
 */
export async function writeAnnotated(out: string, report: RunReport, cwd: string, maxBytes: number): Promise<string | undefined> {
  const file = report.files[0];
  if (!file) return `no annotated copy written: the file was not checked`;
  if (identity(out, cwd) === identity(file.path, cwd)) return 'no annotated copy written: --annotate names the file checked, which plumbline never changes';
  if (file.original?.kind !== 'pdf') return `no annotated copy written: --annotate writes copies of PDF files, and ${file.path} was not read as one`;
  const read = readRegularFile(resolve(cwd, file.path), maxBytes);
  if (!read.ok) return `no annotated copy written: ${file.path} could not be read again`;
  let bytes: Uint8Array;
  try {
    const { annotatePdf } = await import('../report/annotatePdf.js');
    bytes = (await annotatePdf(new Uint8Array(read.bytes), file)).bytes;
  } catch (e) {
    return `no annotated copy written: ${describeError(e)}`;
  }
  try {
    const sink = openRegularFile(out, cwd);
    try {
      sink.write(bytes);
      sink.commit();
    } catch (e) {
      sink.abort();
      throw e;
    }
  } catch (e) {
    return `cannot write ${out}: ${describeError(e)}`;
  }
  return undefined;
}
