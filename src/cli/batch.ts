import { dirname, resolve } from 'node:path';
import { formatForPath } from '../engine/index.js';
import { IncludeFollower, realOrUndefined } from './includes.js';
import { StringDecoder } from 'node:string_decoder';
import type { Readable } from 'node:stream';
import type { CheckOptions } from '../engine/index.js';
import { DEFAULT_MAX_FILE_BYTES, readManuscript, type ReadOutcome } from './read.js';
import { checkAll, DEFAULT_BUDGET, type Budget, type Job } from './pool.js';
import type { Io } from './run.js';
import { wholeText } from '../report/chunks.js';
import { fileChunks, JSON_REPORT_VERSION } from '../report/json.js';

type JobFor = (path: string, source: string | ((maxBytes: number) => ReadOutcome | Promise<ReadOutcome>), configPath: string, format?: CheckOptions['format']) => Job | Promise<Job>;

/** A document's id as its line gave it: a JSON string or number keeps its type; null when the line has none. */
type Id = string | number | null;

interface Line {
  id: Id;
  job: Job | Promise<Job>;
  /** A LaTeX manuscript's absolute path, when the line named one: its includes are followed. */
  latex?: string;
}

/**
 * The files a LaTeX manuscript given by path includes, within its folder, as the command line
 * follows them (src/cli/includes.ts), each as a job of its own after it; refusals become read
 * notes of the file whose command was refused. Each line is a run of its own: a file is read
 * once per line.
 */
async function withIncludes(job: Job, absolute: string, jobFor: JobFor): Promise<Job[]> {
  if (!('source' in job)) return [job];
  const real = realOrUndefined(absolute) ?? absolute;
  const follower = new IncludeFollower(dirname(absolute), dirname(job.path), new Set([real]));
  const expand = async (j: Job, chain: string[]): Promise<Job[]> => {
    if (!('source' in j)) return [j];
    const { files, notes } = follower.follow(j.source, chain);
    if (notes.length > 0) j.options = { ...j.options, readNotes: [...(j.options.readNotes ?? []), ...notes] };
    const out: Job[] = [j];
    for (const f of files) out.push(...(await expand(await jobFor(f.path, (max) => readManuscript(f.absolute, max), f.absolute), [...chain, f.real])));
    return out;
  };
  return expand(job, [real]);
}

/**
 * Batch mode: each line of standard input is a path, or an NDJSON document
 * `{"id": …, "text": …, "format"?: "markdown" | "rmarkdown" | "text" | "latex"}`. Every input line, blank
 * ones included, gives exactly one NDJSON line on standard output, in input order, as soon as it
 * is done (waiting for the stream to drain): `{"id", …report}` or `{"id", "error"}`, where `id` is
 * the path, the document's id with its JSON type, or null. A LaTeX manuscript's path has the
 * files its `\input`/`\include` lead to (within its folder) checked too, listed in its line as
 * `included` (each a report with its path, or `{"path", "error"}`). Output line k answers input line k
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
  /** Per job: how many jobs its line has (on the line's first job; included files follow it). */
  const lineJobs: number[] = [];
  const jobPaths: string[] = [];
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
        lineJobs.push(1);
        jobPaths.push(`line ${n}`);
        yield { path: `line ${n}`, error: `line ${n}: skipped: longer than ${raw.over} characters; reading of it stopped there (the size limit, --max-file-bytes, is ${maxBytes} bytes)` };
        continue;
      }
      const line = parseLine(raw.trim(), n, io.cwd, jobFor);
      const first = await line.job;
      const jobs = line.latex ? await withIncludes(first, line.latex, jobFor) : [first];
      for (const [k, job] of jobs.entries()) {
        ids.push(line.id);
        lineJobs.push(k === 0 ? jobs.length : 0);
        jobPaths.push(job.path);
        yield job;
      }
    }
  }
  // a line's outcomes: its document first, then the files it includes (held until the last is done),
  // each as the members of a JSON object: a file of the JSON report (its 2.x shape), or an error
  let held: { id: Id; main: string; included: string[]; left: number } | undefined;
  await checkAll(lines(), threads, async (o, i) => {
    let members: string;
    const count = lineJobs[i] ?? 0;
    if ('report' in o) {
      const report = o.report;
      results += report.results.length;
      findings += report.findings.length;
      if (report.findings.some((f) => f.level === 'error')) errorLevel += 1;
      members = wholeText(fileChunks(report)).slice(1, -1);
    } else {
      failed += 1;
      // an included file: named by its path, as the command line names it
      members = `${count > 0 ? '' : `"path":${JSON.stringify(jobPaths[i])},`}"error":${JSON.stringify(o.error)}`;
    }
    if (count > 0) {
      documents += 1;
      held = { id: ids[i] ?? null, main: members, included: [], left: count - 1 };
    } else if (held) {
      held.included.push(`{${members}}`);
      held.left -= 1;
    }
    if (!held || held.left > 0) return;
    const { id, main, included } = held;
    held = undefined;
    // the version tells a reader the shape of the line's files (readJsonReport reads either)
    const version = main.startsWith('"error"') ? '' : `"reportVersion":${JSON.stringify(JSON_REPORT_VERSION)},`;
    await io.stdout(`{"id":${JSON.stringify(id)},${version}${main}${included.length > 0 ? `,"included":[${included.join(',')}]` : ''}}\n`);
  }, budget, { here: threads === 'auto' });
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
  return { id: text, job: jobFor(text, (max) => readManuscript(path, max), path), ...(formatForPath(path) === 'latex' ? { latex: path } : {}) };
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
