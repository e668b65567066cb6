import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { annotateWordDocument, type FileReport, type WordComment } from '../engine/index.js';
import type { RunReport } from '../report/index.js';
import { describeError } from './files.js';
import { openRegularFile } from './output.js';

/** What one comment says: the finding as the human format says it, its rule, and what to check. */
export function commentParagraphs(f: FileReport['findings'][number]): string[] {
  return [`plumbline ${f.level} (${f.ruleId}): ${f.message}`, `What to check: ${f.check}`, 'An inconsistency is a question, not proof of an error; check it against the analysis output.'];
}

/**
 * --annotate OUT: a copy of the one Word or PDF file checked, each finding of the report (as
 * shown: quiet comments, the baseline and --quiet applied) on its characters: in a Word file a
 * comment, in a PDF a highlight with a note (src/report/annotatePdf.ts). The copy is written
 * atomically, as -o writes a report; the original is only read. With no Word or PDF file among
 * the files checked, or more than one, nothing is written: one output names one file.
 */
export async function annotate(out: string, report: RunReport, cwd: string, stdin: { name: string; bytes: Uint8Array } | undefined): Promise<{ ok: boolean; message: string }> {
  const binary = report.files.filter((f) => f.format === 'docx' || f.format === 'pdf');
  if (binary.length !== 1) {
    return { ok: false, message: `--annotate writes one annotated copy of one Word or PDF file, and ${binary.length === 0 ? 'no Word (.docx) or PDF file was checked' : `${binary.length} such files were checked (${binary.map((f) => f.path).join(', ')}); check them one at a time`}` };
  }
  const file = binary[0] as FileReport;
  let bytes: Uint8Array;
  try {
    bytes = stdin && stdin.name === file.path ? stdin.bytes : readFileSync(resolve(cwd, file.path));
  } catch (e) {
    return { ok: false, message: `--annotate: cannot read ${file.path} again: ${describeError(e)}` };
  }
  if (file.format === 'pdf') return annotatePdfCopy(out, file, new Uint8Array(bytes), cwd);
  const comments: WordComment[] = file.findings.filter((f) => f.scope !== 'document').map((f) => ({ span: f.span, paragraphs: commentParagraphs(f) }));
  const made = await annotateWordDocument(bytes, comments);
  if (!made.ok) return { ok: false, message: `--annotate: ${file.path}: ${made.message}` };
  try {
    const sink = openRegularFile(out, cwd);
    try {
      sink.writeBytes(made.bytes);
      sink.commit();
    } catch (e) {
      sink.abort();
      throw e;
    }
  } catch (e) {
    return { ok: false, message: `cannot write ${out}: ${describeError(e)}` };
  }
  const left = made.notPlaced > 0 ? `; ${made.notPlaced} in text that could not be traced to the file were not added (they are in the report)` : '';
  return { ok: true, message: `wrote ${out}: ${file.path} with ${made.added} finding${made.added === 1 ? '' : 's'} as Word comments${left}` };
}


/** The PDF side: highlights and notes by pdf-lib, loaded only when asked for. */
async function annotatePdfCopy(out: string, file: FileReport, bytes: Uint8Array, cwd: string): Promise<{ ok: boolean; message: string }> {
  let made: Awaited<ReturnType<typeof import('../report/annotatePdf.js').annotatePdf>>;
  try {
    const { annotatePdf } = await import('../report/annotatePdf.js');
    made = await annotatePdf(bytes, file);
  } catch (e) {
    return { ok: false, message: `--annotate: ${file.path}: ${describeError(e)}` };
  }
  try {
    const sink = openRegularFile(out, cwd);
    try {
      sink.writeBytes(made.bytes);
      sink.commit();
    } catch (e) {
      sink.abort();
      throw e;
    }
  } catch (e) {
    return { ok: false, message: `cannot write ${out}: ${describeError(e)}` };
  }
  const notes = made.placed + made.unplaced;
  const left = made.unplaced > 0 ? ` (${made.unplaced} said of the whole document, as notes on page 1)` : '';
  return { ok: true, message: `wrote ${out}: ${file.path} with ${notes} finding${notes === 1 ? '' : 's'} as highlights and notes${left}` };
}
