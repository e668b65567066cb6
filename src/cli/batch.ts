import { resolve } from 'node:path';
import { createInterface } from 'node:readline';
import type { CheckOptions } from '../engine/index.js';
import { readManuscript, type ReadOutcome } from './read.js';
import { checkAll, DEFAULT_BUDGET, type Budget, type Job } from './pool.js';
import type { Io } from './run.js';

type JobFor = (path: string, source: string | ((maxBytes: number) => ReadOutcome), configPath: string, format?: CheckOptions['format']) => Job;

interface Line {
  id: string;
  job: Job;
}

/**
 * Batch mode: each line of standard input is a path, or an NDJSON document
 * `{"id": …, "text": …, "format"?: "markdown" | "rmarkdown" | "text"}`. One NDJSON line per
 * document goes to standard output, in input order, as soon as it is done (waiting for the
 * stream to drain), with its results, findings or error; an error in one document never stops
 * the stream. A summary goes to standard error. Exit 0 unless a document failed (2) or had an
 * error-level finding (1).
 */
export async function runBatch(io: Io, jobFor: JobFor, threads: number, budget: Budget = DEFAULT_BUDGET): Promise<number> {
  const ids: string[] = [];
  let documents = 0;
  let results = 0;
  let findings = 0;
  let errorLevel = 0;
  let failed = 0;
  async function* lines(): AsyncGenerator<Job> {
    const rl = createInterface({ input: io.stdin, crlfDelay: Infinity });
    let n = 0;
    for await (const raw of rl) {
      const text = raw.trim();
      if (text === '') continue;
      n += 1;
      const line = parseLine(text, n, io.cwd, jobFor);
      ids.push(line.id);
      yield line.job;
    }
  }
  await checkAll(lines(), threads, async (o, i) => {
    documents += 1;
    const id = ids[i] ?? String(i + 1);
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
  io.stderr(`plumbline batch: ${documents} documents, ${results} results, ${findings} findings, ${failed} not checked\n`);
  if (failed > 0) return 2;
  return errorLevel > 0 ? 1 : 0;
}

function parseLine(text: string, n: number, cwd: string, jobFor: JobFor): Line {
  if (text.startsWith('{')) {
    let doc: unknown;
    try {
      doc = JSON.parse(text);
    } catch (e) {
      return { id: `line ${n}`, job: { path: `line ${n}`, error: `line ${n} is not valid JSON: ${e instanceof Error ? e.message : String(e)}` } };
    }
    const d = doc as { id?: unknown; text?: unknown; format?: unknown };
    const id = typeof d.id === 'string' || typeof d.id === 'number' ? String(d.id) : `line ${n}`;
    if (typeof d.text !== 'string') return { id, job: { path: id, error: `line ${n}: "text" must be a string` } };
    const format = d.format === 'markdown' || d.format === 'rmarkdown' || d.format === 'text' ? d.format : undefined;
    if (d.format !== undefined && !format) return { id, job: { path: id, error: `line ${n}: "format" must be markdown, rmarkdown or text` } };
    return { id, job: jobFor(id, d.text, `${cwd}/${id}`, format) };
  }
  const path = resolve(cwd, text);
  return { id: text, job: jobFor(text, (max) => readManuscript(path, max), path) };
}
