import { resolve } from 'node:path';
import { StringDecoder } from 'node:string_decoder';
import type { Readable } from 'node:stream';
import type { CheckOptions } from '../engine/index.js';
import { DEFAULT_MAX_FILE_BYTES, readManuscript, type ReadOutcome } from './read.js';
import { checkAll, DEFAULT_BUDGET, type Budget, type Job } from './pool.js';
import type { Io } from './run.js';

type JobFor = (path: string, source: string | ((maxBytes: number) => ReadOutcome | Promise<ReadOutcome>), configPath: string, format?: CheckOptions['format']) => Job | Promise<Job>;

/** A document's id as its line gave it: a JSON string or number keeps its type; null when the line has none. */
type Id = string | number | null;

interface Line {
  id: Id;
  job: Job | Promise<Job>;
}

/**
 * Batch mode: each line of standard input is a path, or an NDJSON document
 * `{"id": …, "text": …, "format"?: "markdown" | "rmarkdown" | "text" | "latex"}`. Every input line, blank
 * ones included, gives exactly one NDJSON line on standard output, in input order, as soon as it
 * is done (waiting for the stream to drain): `{"id", …report}` or `{"id", "error"}`, where `id` is
 * the path, the document's id with its JSON type, or null. Output line k answers input line k
 * (lines end at LF; a CR before it is dropped, a lone CR is part of the line), and messages name
 * that line; no line number is written as a key, so chunks of the input checked apart (GNU
 * parallel --pipe) still join into the single run's output; with `firstLine` (--first-line) a chunk
 * numbers its lines as the whole input does, so its messages and the names of id-less documents
 * (`line k`) are the single run's too (scripts/dask-batch.py relies on this). An error in one line never stops
 * the stream. A summary goes to standard error. Exit 0 unless a
 * line could not be checked (2: a blank line too) or a document had an error-level finding (1).
 */
export async function runBatch(io: Io, jobFor: JobFor, threads: number | 'auto', budget: Budget = DEFAULT_BUDGET, maxBytes = DEFAULT_MAX_FILE_BYTES, firstLine = 1): Promise<number> {
  const ids: Line['id'][] = [];
  let documents = 0;
  let results = 0;
  let findings = 0;
  let errorLevel = 0;
  let failed = 0;
  async function* lines(): AsyncGenerator<Job> {
    // line numbers of the whole input when this is a chunk of it (--first-line)
    let n = firstLine - 1;
    // a line may hold a document as JSON, where escapes can double its length
    for await (const raw of physicalLines(io.stdin, 2 * maxBytes + 1024)) {
      n += 1;
      if (typeof raw !== 'string') {
        ids.push(null);
        yield { path: `line ${n}`, error: `line ${n}: skipped: longer than ${raw.over} characters; reading of it stopped there (the size limit, --max-file-bytes, is ${maxBytes} bytes)` };
        continue;
      }
      const line = parseLine(raw.trim(), n, io.cwd, jobFor);
      ids.push(line.id);
      yield await line.job;
    }
  }
  await checkAll(lines(), threads, async (o, i) => {
    documents += 1;
    const id = ids[i] ?? null;
    let out: string;
    if ('report' in o) {
      const { source: _source, ...report } = o.report;
      results += report.results.length;
      findings += report.findings.length;
      if (report.findings.some((f) => f.level === 'error')) errorLevel += 1;
      out = JSON.stringify({ id, ...report }, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v));
    } else {
      failed += 1;
      out = JSON.stringify({ id, error: o.error });
    }
    await io.stdout(`${out}\n`);
  }, budget);
  io.stderr(`plumbline batch: ${documents} lines, ${results} results, ${findings} findings, ${failed} not checked\n`);
  if (failed > 0) return 2;
  return errorLevel > 0 ? 1 : 0;
}

function parseLine(text: string, n: number, cwd: string, jobFor: JobFor): Line {
  const name = `line ${n}`;
  if (text === '') return { id: null, job: { path: name, error: `line ${n} is empty` } };
  if (text.startsWith('{')) {
    let doc: unknown;
    try {
      doc = JSON.parse(text);
    } catch (e) {
      return { id: null, job: { path: name, error: `line ${n} is not valid JSON: ${e instanceof Error ? e.message : String(e)}` } };
    }
    const d = doc as { id?: unknown; text?: unknown; format?: unknown };
    // 42 and "42" are different ids: each is written back as it came
    let id: Id = null;
    if (typeof d.id === 'string' || (typeof d.id === 'number' && Number.isFinite(d.id))) id = d.id;
    else if (d.id !== undefined && d.id !== null) return { id: null, job: { path: name, error: `line ${n}: "id" must be a string or a finite number` } };
    // the name a document goes by in messages and configuration lookup
    const path = id === null ? name : String(id);
    if (typeof d.text !== 'string') return { id, job: { path, error: `line ${n}: "text" must be a string` } };
    const format = d.format === 'markdown' || d.format === 'rmarkdown' || d.format === 'text' || d.format === 'latex' ? d.format : undefined;
    if (d.format !== undefined && !format) return { id, job: { path, error: `line ${n}: "format" must be markdown, rmarkdown, text or latex` } };
    return { id, job: jobFor(path, d.text, `${cwd}/${path}`, format) };
  }
  const path = resolve(cwd, text);
  return { id: text, job: jobFor(text, (max) => readManuscript(path, max), path) };
}

/**
 * The lines of a stream as they are in the file: split at LF only, a CR before the LF dropped,
 * a last line without LF kept, nothing after a final LF. (readline also ends a line at a lone
 * CR, which split one input line into two documents and shifted every line number after it.)
 */
async function* physicalLines(input: Readable, maxChars: number): AsyncGenerator<string | { over: number }> {
  const decoder = new StringDecoder('utf8');
  let pieces: string[] = [];
  let held = 0;
  // a line past maxChars is not kept: its rest is skipped up to its LF, and it yields { over }
  let over = false;
  const keep = (piece: string) => {
    if (over) return;
    held += piece.length;
    if (held > maxChars) {
      over = true;
      pieces = [];
    } else pieces.push(piece);
  };
  const finish = (piece: string): string | { over: number } => {
    keep(piece);
    const whole = over ? { over: maxChars } : pieces.join('');
    pieces = [];
    held = 0;
    over = false;
    return typeof whole === 'string' && whole.endsWith('\r') ? whole.slice(0, -1) : whole;
  };
  for await (const chunk of input) {
    const text = typeof chunk === 'string' ? chunk : decoder.write(chunk as Buffer);
    let from = 0;
    for (let at = text.indexOf('\n'); at >= 0; at = text.indexOf('\n', from)) {
      yield finish(text.slice(from, at));
      from = at + 1;
    }
    if (from < text.length) keep(text.slice(from));
  }
  const rest = decoder.end();
  if (rest !== '') keep(rest);
  if (pieces.length > 0 || over) yield finish('');
}
