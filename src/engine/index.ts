import type { Config } from '../config/types.js';
import { configProblems } from '../config/validate.js';
import { extract, ExtractionCache } from '../extract/index.js';
import type { ReportedNumber, ReportedP, Sidedness } from '../extract/types.js';
import { link } from '../link/index.js';
import type { DescriptiveLink, DocumentSettings, Linked, ResultContext, Setting } from '../link/index.js';
import { formatForPath, LineIndex, mayHoldStatistics, parseDocument, reparseDocument, unitAt, type InputFormat } from '../parse/index.js';
import type { OriginalMap, ParsedDocument, ReadNote, Span } from '../parse/types.js';
import { evaluateP } from '../rule-api/evaluate.js';
import { evaluateStatisticP } from '../rule-api/statistic.js';
import { linkDoubts } from '../rule-api/doubts.js';
import type { Guideline, Level, LevelSetting } from '../rule-api/types.js';
import { followIncludes, type IncludeReader } from './includes.js';
import { RULE_IDS, RULES } from './registry.js';
import { hash64 } from './fingerprint.js';
import type { ChecklistRecord, FileReport, Finding, LinkedRecord, NumberRecord, OriginalPlace, Place, ResultRecord, StatisticRecord } from './types.js';

export type * from './types.js';
export { RULES, RULE_IDS, ruleById } from './registry.js';
export { decodeBytes, type Decoded } from '../parse/index.js';
export { formatForPath, readLatexIncludes, type InputFormat, type LatexInclude } from '../parse/index.js';
export { annotateWordDocument, binaryKindOf, readBinaryDocument, type BinaryKind, type BinaryOutcome, type WordComment } from '../parse/index.js';
export { documentFromBlocks, type Block, type BlockNote, type BlockPiece, type BlocksOptions } from '../parse/index.js';
export type { OriginalMap, OriginalUnit, ParsedDocument } from '../parse/types.js';

/** The format a report names for an input format (R Markdown is Markdown). */
function sourceFormat(format: InputFormat): 'markdown' | 'text' | 'latex' {
  return format === 'rmarkdown' ? 'markdown' : format;
}
export type { ReadNote } from '../parse/types.js';
export { followIncludes, includeCandidates, includeNameProblem, INCLUDE_DEPTH_LIMIT, type IncludedSource, type IncludeReader } from './includes.js';

export interface CheckOptions {
  /** From configuration files (already merged and validated). */
  config?: Config;
  /** Command-line settings; they win over front matter and configuration files. */
  alpha?: number;
  sidedness?: Sidedness;
  /** Run the reporting-checklist rules (also on with `checklist: true` in configuration). */
  checklist?: boolean;
  /** Skip the Markdown parse of documents that cannot hold a statistic (default true). */
  prefilter?: boolean;
  /** Read the source as this format instead of guessing from the path. */
  format?: InputFormat;
  /** Notes from decoding the file's bytes (see `decodeBytes`), reported by input-is-readable. */
  readNotes?: ReadNote[];
  /**
   * The document already read by a binary front end (Word, PDF: `documentFromBlocks`); its
   * `source` must be the `source` given. Places then carry `original`.
   */
  document?: ParsedDocument;
}

/**
 * Check one document: parse → extract → link → every enabled rule → findings with
 * positions. Never throws for anything in the document itself.
 */
export function checkSource(path: string, source: string, options: CheckOptions = {}): FileReport {
  return checkParsed(parseFor(path, source, options), options);
}

/** checkWithIncludes's options: checkSource's, and where the manuscript's includes are read. */
export interface IncludeCheckOptions extends CheckOptions {
  /** Reads the files `\input`/`\include` name, relative to the manuscript's folder (see IncludeReader). */
  includes: IncludeReader;
}

/**
 * Check a LaTeX manuscript and the files its `\input`/`\include` commands name, as the command
 * line does: each included file is a report of its own, right after the file that includes it,
 * named as the manuscript's folder joined with the name. Files are read through
 * `options.includes` (so the browser page, with no file system, can hand over dropped files);
 * names outside the manuscript's folder (absolute, `..`) are refused before the reader is asked,
 * and every include not followed is an `include-not-read` note at its command. A source that is
 * not LaTeX gives checkSource's one report.
 */
export function checkWithIncludes(path: string, source: string, options: IncludeCheckOptions): FileReport[] {
  const { includes, ...base } = options;
  if ((base.format ?? formatForPath(path)) !== 'latex' || base.document) return [checkSource(path, source, base)];
  const { notes, files } = followIncludes(path, source, includes);
  const main = checkSource(path, source, notes.length > 0 ? { ...base, readNotes: [...(base.readNotes ?? []), ...notes] } : base);
  // the caller's notes and format are the main file's; an included file is read by its own name
  const { readNotes: _notes, format: _format, ...shared } = base;
  return [main, ...files.map((f) => checkSource(f.path, f.source, f.notes.length > 0 ? { ...shared, readNotes: f.notes } : shared))];
}

function parseFor(path: string, source: string, options: CheckOptions, prev?: ParsedDocument): ParsedDocument {
  // a document a binary front end read (Word, PDF) comes parsed
  // (read under its absolute path: the report names it as the caller does)
  if (options.document) return options.document.path === path ? options.document : { ...options.document, path };
  if (options.prefilter !== false && !mayHoldStatistics(source))
    return { path, source, format: sourceFormat(options.format ?? formatForPath(path)), segments: [], directives: [], hadBom: source.charCodeAt(0) === 0xfeff };
  // the same text reads the same: nothing downstream changes a parsed document
  if (prev?.source === source) return prev;
  return (prev && reparseDocument(prev, source, options.format ?? formatForPath(path))) || parseDocument(path, source, options.format);
}

/**
 * Checks one document again and again as it is edited (the language server's re-check after a
 * keystroke): each check gives exactly what checkSource gives for the same arguments, but reads
 * again only what an edit changed where that is certain (a paragraph re-parsed alone, the
 * records of unchanged segments kept; see reparseDocument and ExtractionCache). Linking and the
 * rules run over the whole document every time, since they look across paragraphs.
 */
export class IncrementalChecker {
  private last: { path: string; format: InputFormat | undefined; prefilter: boolean | undefined; doc: ParsedDocument } | undefined;
  private cache = new ExtractionCache();
  /** How many checks re-read only the edited part (the rest parsed the whole text). */
  rereadAlone = 0;

  check(path: string, source: string, options: CheckOptions = {}): FileReport {
    const last = this.last;
    const same = last !== undefined && last.path === path && last.format === options.format && last.prefilter === options.prefilter;
    if (!same) this.cache = new ExtractionCache();
    const doc = parseFor(path, source, options, same ? last.doc : undefined);
    if (same && doc.segments.length > 0 && doc.segments[0] === last.doc.segments[0] && doc !== last.doc) this.rereadAlone += 1;
    this.last = { path, format: options.format, prefilter: options.prefilter, doc };
    return checkParsed(doc, options, this.cache);
  }
}

function checkParsed(doc: ParsedDocument, options: CheckOptions, cache?: ExtractionCache): FileReport {
  const { path, source } = doc;
  const lines = new LineIndex(source);
  const resolved = resolveSettings(doc, options);
  const { levels, guidelines, checklistOn } = resolved;
  const readNotes = [...(options.readNotes ?? []), ...(doc.readNotes ?? [])];
  const settings = readNotes.length > 0 ? { ...resolved.settings, readNotes } : resolved.settings;
  const extraction = extract(doc, cache);
  const linked = link(extraction, doc.directives, settings);
  const original = doc.original;
  const place = original
    ? (span: Span): Place => ({ span, start: lines.position(span.start), end: lines.position(span.end), ...originalPlace(original, source, span) })
    : (span: Span): Place => ({ span, start: lines.position(span.start), end: lines.position(span.end) });

  const findings: Finding[] = [];
  const quiet = quietIndex(doc);
  let quieted = 0;
  const checklist: ChecklistRecord[] = [];
  for (const rule of RULES) {
    const level = levels[rule.id] ?? rule.defaultLevel;
    if (level === 'off') continue;
    if (rule.checklistOnly && !checklistOn) continue;
    const item = checklistOn ? rule.checklist : undefined;
    const refs = item ? Object.fromEntries(Object.entries(item.guidelines).filter(([g]) => guidelines.includes(g as Guideline))) : {};
    // no selected guideline asks for it: a pure checklist item is then skipped altogether
    if (rule.checklistOnly && Object.keys(refs).length === 0) continue;
    if (item && Object.keys(refs).length > 0) {
      checklist.push({
        ruleId: rule.id,
        item: item.item,
        guidelines: refs,
        entries: item.assess(linked).map((e) => ({
          scope: e.scope,
          ...(e.resultId ? { resultId: e.resultId } : {}),
          status: e.status,
          detail: e.detail,
          ...(e.span ? { place: place(e.span) } : {}),
        })),
      });
    }
    for (const f of rule.check({ document: linked, options: rule.defaultOptions })) {
      // a document-wide item has no block of its own: a quiet comment for its rule anywhere silences it
      if (f.scope === 'document' ? quiet.anywhere.has(rule.id) : f.block !== undefined && quiet.byBlock.get(f.block)?.has(rule.id) === true) {
        quieted += 1;
        continue;
      }
      const { block: _block, related, uncertain, ...rest } = f;
      // Certainty before speech: a finding resting on a link that is not certain is a note
      // saying what could not be checked, whatever the rule's level.
      const unsure = uncertain !== undefined && uncertain.length > 0;
      // Object.assign onto a fresh object, not a literal that opens with a spread: V8 gives each
      // object made by `{ ...x, … }` a hidden class of its own (some 300 bytes; 73,000 of them for
      // 12,000 results), while properties added in the same order share one (DEVELOPERS.md, Speed)
      findings.push(
        Object.assign(
          {},
          rest,
          unsure ? { message: `Not checked with certainty (${uncertain.join('; ')}). ${rest.message}`, uncertain } : undefined,
          { ruleId: rule.id, level: unsure ? 'note' : (level as Level) },
          place(f.span),
          related ? { related: related.map((r) => Object.assign(place(r.span), { message: r.message })) } : undefined,
          { fingerprint: '' },
        ),
      );
    }
  }
  findings.sort((a, b) => a.span.start - b.span.start || RULE_IDS.indexOf(a.ruleId) - RULE_IDS.indexOf(b.ruleId));
  addFingerprints(findings, source);

  // JSON has no Infinity: an overflowed number is written as the largest double, with its log10
  const num = (n: ReportedNumber): NumberRecord => ({
    printed: n.printed,
    value: Number.isFinite(n.value) ? n.value : Math.sign(n.value) * Number.MAX_VALUE,
    decimals: n.decimals,
    exponent: Number.isFinite(n.exponent) ? n.exponent : Math.sign(n.exponent) * Number.MAX_VALUE,
    ...(n.beyondDouble ? { log10: Number.isFinite(n.beyondDouble.log10) ? n.beyondDouble.log10 : Math.sign(n.beyondDouble.log10) * Number.MAX_VALUE } : {}),
    ...place(n.span),
  });
  const pRecord = (p: ReportedP): NonNullable<ResultRecord['p']> => ({
    kind: p.kind,
    op: p.op,
    printed: p.printed,
    ...place(p.span),
    ...(p.number ? { number: num(p.number) } : {}),
    ...(p.adjusted ? { adjusted: { method: p.adjusted.method, printed: p.adjusted.printed } } : {}),
    ...(p.stars ? { stars: { symbol: p.stars.symbol, basis: p.stars.basis } } : {}),
  });
  const results: ResultRecord[] = linked.results.map((r) => {
    const e = evaluateP(r);
    const rep = r.report;
    return {
      id: rep.id,
      printed: rep.printed,
      style: rep.style,
      inCode: rep.inCode,
      plural: rep.plural,
      ...place(rep.span),
      t: Object.assign(num(rep.t), { op: rep.tOp }),
      ...(rep.df ? { df: num(rep.df) } : {}),
      ...(rep.p ? { p: pRecord(rep.p) } : {}),
      ...(rep.adjustedP ? { adjustedP: pRecord(rep.adjustedP) } : {}),
      ...(rep.table?.name ? { table: { name: rep.table.name, ...(rep.table.rowLabel ? { row: rep.table.rowLabel } : {}) } } : {}),
      sidedness: r.sidedness,
      alpha: r.alpha,
      context: contextRecord(r.context, place),
      ...(e ? { recomputed: { twoTailed: e.check.twoSided, oneTailed: e.check.oneSidedSame, standing: e.standing } } : {}),
    };
  });
  const statistics: StatisticRecord[] = [];
  for (const ls of linked.statistics) {
    const s = ls.report;
    if (!s.value) continue;
    const e = evaluateStatisticP(ls);
    const span = s.reportSpan ?? s.span;
    statistics.push({
      id: ls.id,
      kind: s.kind === 'chi-square' ? 'chi-square' : s.kind === 'correlation' ? 'r' : s.kind,
      symbol: s.symbol ?? s.kind,
      printed: s.reportPrinted ?? s.printed,
      ...place(span),
      value: Object.assign(num(s.value), { op: s.op ?? '=' }),
      ...(s.dfs ? { dfs: s.dfs.map(num) } : {}),
      ...(s.n ? { n: num(s.n) } : {}),
      ...(s.p ? { p: pRecord(s.p) } : {}),
      alpha: ls.alpha,
      ...(ls.groups ? { groups: descriptivesRecord(ls.groups, place) } : {}),
      ...(ls.coefficient ? { coefficient: linkedRecord(ls.coefficient, place) } : {}),
      sidedness: ls.sidedness,
      ...(s.dfCorrection ? { dfCorrection: s.dfCorrection } : {}),
      ...(ls.doubts.length > 0 ? { doubt: ls.doubts.join('; ') } : {}),
      ...(e ? { recomputed: { readings: e.readings.map((r) => ({ name: r.name, low: r.range.low, high: r.range.high, fits: r.fits })), fits: e.fits } } : {}),
    });
  }
  return { path, format: doc.format, results, statistics, findings, checklist, guidelines, alpha: linked.documentAlpha, sidedness: linked.documentSidedness, hidden: { quiet: quieted, baseline: 0 }, source, ...(original ? { original: { kind: original.kind, ...(original.trackedChanges ? { trackedChanges: true } : {}), lines: original.units.map((u) => ({ at: lines.position(u.start).line, ...(u.paragraph !== undefined ? { paragraph: u.paragraph } : {}), ...(u.note ? { note: u.note } : {}), ...(u.page !== undefined ? { page: u.page } : {}), ...(u.line !== undefined ? { line: u.line } : {}) })) } } : {}) };
}

/** Characters of context on each side of a PDF place (`around`), cut back to whole words. */
const AROUND_CHARS = 32;
const SPACE = /\s/;
const SPACES = /\s+/g;

/** Where a span of a binary document's extracted text sits in the original file (empty when the map has no unit). */
function originalPlace(map: OriginalMap, source: string, span: Span): { original?: OriginalPlace } {
  const u = unitAt(map, span.start);
  if (!u) return {};
  const offset = Math.max(0, Math.min(span.start, u.end) - u.start) + (u.charOffset ?? 0);
  if (map.kind === 'docx') return { original: { kind: 'paragraph', paragraph: u.paragraph ?? 0, char: offset + 1, opening: u.opening, ...(u.note ? { note: u.note } : {}) } };
  return { original: { kind: 'page', page: u.page ?? 0, line: u.line ?? 0, around: around(source, span) } };
}

/** The words around a span, spacing collapsed, `…` where cut. */
function around(source: string, span: Span): string {
  let a = Math.max(0, span.start - AROUND_CHARS);
  let b = Math.min(source.length, span.end + AROUND_CHARS);
  if (a > 0) while (a < span.start && !SPACE.test(source[a - 1] as string)) a += 1;
  if (b < source.length) while (b > span.end && !SPACE.test(source[b] as string)) b -= 1;
  const text = source.slice(a, b).replace(SPACES, ' ').trim();
  return `${a > 0 ? '… ' : ''}${text}${b < source.length ? ' …' : ''}`;
}

/** A tie of a number to its result, as the reports show it: its place, basis, certainty and doubt. */
function linkedRecord(x: Linked<{ span: Span; printed: string }>, place: (s: Span) => Place): LinkedRecord {
  return { printed: x.item.printed, ...place(x.item.span), basis: x.basis, certain: x.certain, ...(x.certain ? {} : { doubt: linkDoubts({ linked: [x] })[0] ?? '' }) };
}

/** A set of descriptives tied to a result, as the reports show it. */
function descriptivesRecord(d: DescriptiveLink, place: (s: Span) => Place): NonNullable<ResultRecord['context']['descriptives']> {
  return {
    scope: d.scope,
    certain: d.certain,
    ...(d.certain ? {} : { doubt: linkDoubts({ descriptives: d })[0] ?? '' }),
    groups: d.groups.map((g, i) => ({ printed: g.printed, ...place(g.span), ...(g.label ? { label: g.label } : {}), spreadKind: d.spreadKinds[i] ?? 'unstated' })),
    ...(d.tableTie ? { tableTie: { name: d.tableTie.name, named: { printed: d.tableTie.named.printed, ...place(d.tableTie.named.span), basis: d.tableTie.named.basis }, outcome: { by: d.tableTie.outcome.by, words: [...d.tableTie.outcome.words] } } } : {}),
  };
}

function contextRecord(c: ResultContext, place: (s: Span) => Place): ResultRecord['context'] {
  const item = (x: { span: Span; printed: string }) => ({ printed: x.printed, ...place(x.span) });
  // An uncertain tie says why, in the words a note resting on it would use.
  const linked = (x: Linked<{ span: Span; printed: string }>) => linkedRecord(x, place);
  return {
    design: c.design,
    ...(c.descriptives ? { descriptives: descriptivesRecord(c.descriptives, place) } : {}),
    ...(c.unlinked ? { unlinked: c.unlinked.reason } : {}),
    ...(c.reference ? { reference: item(c.reference) } : {}),
    ...(c.interval ? { interval: Object.assign(linked(c.interval), { of: c.interval.of }) } : {}),
    ...(c.intervals.length > 0 ? { intervals: c.intervals.map((i) => Object.assign(linked(i), { of: i.of })) } : {}),
    ...(c.estimate ? { estimate: linked(c.estimate) } : {}),
    effectSizes: c.effectSizes.map(linked),
  };
}

/**
 * Each finding's fingerprint: its rule, the printed text it stands on (spacing collapsed) and its
 * occurrence among findings of that rule on identical text, in reading order. No line number or
 * offset goes in, so text inserted elsewhere in the file leaves it unchanged; editing the flagged
 * text itself makes a new finding.
 */
function addFingerprints(findings: Finding[], source: string): void {
  const seen = new Map<string, number>();
  for (const f of findings) {
    const key = `${f.ruleId}\u0000${source.slice(f.span.start, f.span.end).replace(/\s+/g, ' ').trim()}`;
    const n = seen.get(key) ?? 0;
    seen.set(key, n + 1);
    f.fingerprint = `${hash64(key)}:${n}`;
  }
}

/**
 * The rules each block's quiet comments silence, and those any quiet comment silences: built
 * once, so a document of many findings and many comments is not searched pairwise.
 */
function quietIndex(doc: ParsedDocument): { byBlock: Map<number, Set<string>>; anywhere: Set<string> } {
  const byBlock = new Map<number, Set<string>>();
  const anywhere = new Set<string>();
  for (const d of doc.directives) {
    if (d.verb !== 'quiet' || d.reason === '') continue;
    let set = byBlock.get(d.appliesToBlock);
    if (!set) {
      set = new Set();
      byBlock.set(d.appliesToBlock, set);
    }
    for (const id of d.ruleIds) {
      set.add(id);
      anywhere.add(id);
    }
  }
  return { byBlock, anywhere };
}

/** Settings: front matter (`plumbline:` key) over the command line, over the configuration file. */
const ALL_GUIDELINES: Guideline[] = ['sampl', 'jars-quant', 'consort'];

function resolveSettings(
  doc: ParsedDocument,
  options: CheckOptions,
): { settings: DocumentSettings; levels: Record<string, LevelSetting>; guidelines: Guideline[]; checklistOn: boolean } {
  const config = options.config ?? {};
  let front: Config = {};
  let frontMatterError: DocumentSettings['frontMatterError'];
  const fm = doc.frontMatter;
  if (fm?.error) frontMatterError = { message: fm.error, span: fm.span };
  else if (fm && isRecord(fm.data) && 'plumbline' in fm.data) {
    const problems = configProblems(fm.data.plumbline ?? {}, RULE_IDS);
    if (problems.length > 0) frontMatterError = { message: `plumbline settings: ${problems.join('; ')}`, span: fm.span };
    else front = (fm.data.plumbline ?? {}) as Config;
  }
  // The order README "Configuration" documents: the document's own front matter, then the
  // command line (or the options of a library call), then the configuration file.
  const pick = <T>(cli: T | undefined, fmValue: T | undefined, cfg: T | undefined): Setting<T> | undefined => {
    if (fmValue !== undefined) return { value: fmValue, basis: 'front-matter', ...(fm ? { span: fm.span } : {}) };
    if (cli !== undefined) return { value: cli, basis: 'command-line' };
    if (cfg !== undefined) return { value: cfg, basis: 'configuration' };
    return undefined;
  };
  const alpha = pick(options.alpha, front.alpha, config.alpha);
  const items = pick(undefined, front.integerItems, config.integerItems);
  const integerMeasure = items ? { ...items, value: { items: items.value } } : undefined;
  const sidedness = pick(options.sidedness, front.sidedness, config.sidedness);
  return {
    settings: { ...(integerMeasure ? { integerMeasure } : {}), ...(alpha ? { alpha } : {}), ...(sidedness ? { sidedness } : {}), ...(frontMatterError ? { frontMatterError } : {}) },
    levels: { ...config.rules, ...front.rules },
    guidelines: ((g) => (g === undefined || g === 'all' ? ALL_GUIDELINES : g))(front.guidelines ?? config.guidelines),
    checklistOn: options.checklist ?? front.checklist ?? config.checklist ?? false,
  };
}

function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}
