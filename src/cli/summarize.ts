import { createReadStream } from 'node:fs';
import { resolve } from 'node:path';
import type { Readable } from 'node:stream';
import { StringDecoder } from 'node:string_decoder';
import { CorpusTally } from '../corpus/summary.js';
import { DOCUMENTS_CSV_HEADER, documentCsvRow, gapsCsv, rulesCsv } from '../report/summaryCsv.js';
import { readJsonReport } from '../report/json.js';
import { formatSummaryHtml } from '../report/summaryHtml.js';
import type { CliOptions } from './args.js';
import { describeError } from './files.js';
import { identity } from './output.js';
import type { Io } from './run.js';

/** Lines that are not batch output named one by one on standard error, at most. */
const NAMED = 10;

/**
 * `plumbline summarize results.ndjson…`: the corpus summary of what `plumbline batch` wrote
 * (files read in order, as one stream; "-" is standard input). CSV by default (`--table rules`,
 * `gaps` or `documents`, the last written as it is read), or the HTML page. Exit 0, or 2 when a
 * file cannot be read or a line is not batch output (each named; the rest is still summarised).
 * Returns -1 (refused) when the output file is one of the inputs.
 */
export async function runSummarize(options: CliOptions, io: Io, writes: string[]): Promise<number> {
  const sources = [...options.files, ...(options.stdin ? ['-'] : [])];
  if (sources.length === 0) {
    io.stderr('plumbline: summarize needs the results file(s) that plumbline batch wrote ("-" for standard input)\n');
    return 2;
  }
  for (const f of sources) {
    if (f !== '-' && writes.includes(identity(resolve(io.cwd, f), io.cwd))) {
      io.stderr(`plumbline: refusing to write over an input file: ${f}\n`);
      return -1;
    }
  }
  const csv = options.summaryFormat !== 'html';
  const documents = csv && options.table === 'documents';
  const tally = new CorpusTally(readJsonReport);
  let trouble = false;
  let unreadable = 0;
  if (documents) await io.stdout(DOCUMENTS_CSV_HEADER);
  for (const f of sources) {
    const stream: Readable = f === '-' ? io.stdin : createReadStream(resolve(io.cwd, f));
    let line = 0;
    try {
      for await (const text of ndjsonLines(stream)) {
        line += 1;
        const row = tally.add(text);
        if (row.status === 'not-batch-output') {
          unreadable += 1;
          if (unreadable <= NAMED) io.stderr(`plumbline: ${f === '-' ? 'standard input' : f}:${line}: ${row.reason}\n`);
        }
        if (documents) await io.stdout(documentCsvRow(row));
      }
    } catch (e) {
      trouble = true;
      io.stderr(`plumbline: cannot read ${f}: ${describeError(e)}\n`);
    }
  }
  if (unreadable > NAMED) io.stderr(`plumbline: and ${unreadable - NAMED} more lines that are not plumbline batch output\n`);
  const summary = tally.summary();
  if (!documents) {
    if (!csv) await io.stdout(formatSummaryHtml(summary, sources.map((s) => (s === '-' ? 'standard input' : s)).join(', ')));
    else await io.stdout(options.table === 'gaps' ? gapsCsv(summary) : rulesCsv(summary));
  }
  return trouble || unreadable > 0 ? 2 : 0;
}

/**
 * The lines of a stream, split at LF (a CR before it dropped); nothing after a final LF. A long
 * line's pieces are joined once, at its end, so a report of many megabytes costs linear time.
 */
async function* ndjsonLines(input: Readable): AsyncGenerator<string> {
  const decoder = new StringDecoder('utf8');
  let pieces: string[] = [];
  const finish = (last: string) => {
    pieces.push(last);
    const line = pieces.join('');
    pieces = [];
    return line.endsWith('\r') ? line.slice(0, -1) : line;
  };
  for await (const chunk of input) {
    const text = typeof chunk === 'string' ? chunk : decoder.write(chunk as Buffer);
    let from = 0;
    for (let at = text.indexOf('\n'); at >= 0; at = text.indexOf('\n', from)) {
      yield finish(text.slice(from, at));
      from = at + 1;
    }
    if (from < text.length) pieces.push(text.slice(from));
  }
  const rest = decoder.end();
  if (rest !== '') pieces.push(rest);
  if (pieces.length > 0) yield finish('');
}
