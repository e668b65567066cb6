/**
 * The shape of a file in the JSON report 2.x (schema/report.schema.json), and the way back.
 *
 * A 1.x report repeated per number what is the same for all of them: three objects for every
 * place (`span`, `start`, `end`), the same advice and assumption texts in every finding, and
 * default values. A 60,000-result document gave 228 MB of JSON (bench figure 14). In 2.x:
 * - a place is `at: [start, end]` (offsets); its lines and columns follow from the file's
 *   `lineStarts` (where each line starts, written as differences), as the engine computes them.
 *   A place whose line or column does not follow so keeps its `start`/`end`;
 * - texts that repeat are stored once per file in `texts` and referred to by index: whole
 *   (`TEXT_KEYS`), or, for messages and the inputs of a recomputation, as pieces (`PIECE_KEYS`:
 *   an array of strings, written as they are, and indices, joined in order);
 * - a printed number leaves out `exponent` when 0, and `value` and `decimals` when its printed
 *   text is a plain decimal (`PLAIN_DECIMAL`) that gives them; a result leaves out
 *   `inCode: false`, `plural: false` and an empty `context.effectSizes`.
 * `expandFile` gives back every fact of the 1.x file. Serialisation only: nothing is computed.
 */
import type { FileReport } from '../engine/types.js';
import { LineIndex } from '../parse/lines.js';

/** Keys whose strings (or arrays of strings) are stored once per file, as an index into `texts`. */
const TEXT_KEYS = new Set(['messageId', 'check', 'quantity', 'assumptions', 'uncertain', 'doubt', 'unlinked', 'standing', 'basis', 'style', 'spreadKind', 'label', 'estimateSource']);
/** Keys whose strings are written as pieces: the runs of digits inline, the words between them as indices into `texts`. */
const PIECE_KEYS = new Set(['message', 'inputs']);
/**
 * A run of digits with its decimal points, as messages and inputs are cut into pieces: the
 * longest stretch of characters that are each a digit, or a `.` followed by a digit.
 */
const DIGIT_RUN = /(?:[0-9]|\.(?=[0-9]))+/g;
/** Keys that hold printed numbers (t, df, p's number, a statistic's value, dfs and n). */
const NUMBER_KEYS = new Set(['t', 'df', 'number', 'value', 'dfs', 'n']);

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
type JsonObject = { [key: string]: Json };

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const isDigit = (c: number) => c >= 48 && c <= 57;

/** The printed text of a number whose value and decimals JSON readers get from the text alone: `2.47`, `.021`, `-3`, `12`. */
function plainDecimal(printed: string): { value: number; decimals: number } | undefined {
  let i = printed.charCodeAt(0) === 45 ? 1 : 0;
  let digits = 0;
  let point = -1;
  for (; i < printed.length; i += 1) {
    const c = printed.charCodeAt(i);
    if (isDigit(c)) digits += 1;
    else if (c === 46 && point < 0) point = i;
    else return undefined;
  }
  if (digits === 0 || point === printed.length - 1) return undefined;
  return { value: Number(printed), decimals: point < 0 ? 0 : printed.length - point - 1 };
}

const samePosition = (a: unknown, b: { line: number; column: number }) => isObject(a) && a.line === b.line && a.column === b.column && Object.keys(a).length === 2;

/** A place as the engine writes it: a span and both ends' positions. */
function isPlace(v: Record<string, unknown>): boolean {
  const { span, start, end } = v;
  return isObject(span) && typeof span.start === 'number' && typeof span.end === 'number' && Object.keys(span).length === 2 && isObject(start) && isObject(end);
}

/** Writes one file of a report in the 2.x shape: the file's members, then its `texts`. */
export class FileEncoder {
  readonly texts: string[] = [];
  private readonly ids = new Map<string, number>();
  private readonly lines: LineIndex;

  constructor(source: string) {
    this.lines = new LineIndex(source);
  }

  /** `lineStarts` as written: the first line's start, then each line's start less the one before. */
  lineSteps(): number[] {
    const starts = this.lines.starts;
    return starts.map((s, i) => (i === 0 ? s : s - (starts[i - 1] as number)));
  }

  private text(s: string): number {
    let id = this.ids.get(s);
    if (id === undefined) {
      id = this.texts.length;
      this.texts.push(s);
      this.ids.set(s, id);
    }
    return id;
  }

  /**
   * A message or input: `[template, runs]`, the template (a shared text) being the string with
   * each run of digits (with its decimal points) written as `#`, and `runs` those runs in order,
   * separated by spaces. A string without digits is a shared text (its index); one holding `#`
   * itself is written as it is.
   */
  private pieces(s: string): Json {
    if (s.includes('#')) return s;
    // one regular expression rather than a loop over the characters: messages are most of a
    // report's text, and a command-line run encodes them once, while its code is still cold
    const runs = s.match(DIGIT_RUN);
    if (runs === null) return this.text(s);
    return [this.text(s.replace(DIGIT_RUN, '#')), runs.join(' ')];
  }

  /** The `check`, `recomputed.quantity` and `assumptions` last written for each rule and message (`sameAsBefore`). */
  readonly lastOfKind = new Map<string, { check?: string; quantity?: string; assumptions?: string }>();

  /** Each result and statistic as in memory, by id: what a finding's left-out members repeat (its `printed`, place, recomputed p and p's last digit). */
  readonly itemOf = new Map<string, Record<string, unknown>>();

  /** The encoded file setting (`alpha`, `sidedness`) a result leaves out when its own is the same. */
  fileSettings: { alpha?: string; sidedness?: string } = {};

  /**
   * A value of the in-memory report (as JSON.stringify would see it) in the 2.x shape. `host`:
   * the result or statistic the value is part of (its `printed` and where that starts), for the
   * omissions of 2.1.0 inside it: a place's `printed` that is the slice of the host's `printed`
   * at the place's offsets, a p's `kind` "value", and an `op` "=" of a p, t or statistic value.
   */
  encode(v: unknown, key = '', host?: Host, own?: Host): Json | undefined {
    if (v === undefined || typeof v === 'function' || typeof v === 'symbol') return undefined;
    if (v === null || typeof v === 'boolean') return v;
    if (typeof v === 'number') return Number.isFinite(v) ? v : null;
    if (typeof v === 'string') {
      if (TEXT_KEYS.has(key)) return this.text(v);
      if (PIECE_KEYS.has(key)) return this.pieces(v);
      return v;
    }
    if (Array.isArray(v)) return v.map((x) => this.encode(x, key, host) ?? null);
    const o = v as Record<string, unknown>;
    const out: JsonObject = {};
    const place = isPlace(o);
    const sliced = host !== undefined && place && typeof o.printed === 'string' && sliceOf(host, (o.span as { start: number }).start, (o.span as { end: number }).end) === o.printed;
    // a result's or statistic's own places and numbers are read inside it
    const inner = own ?? host;
    const plain = NUMBER_KEYS.has(key) && typeof o.printed === 'string' && typeof o.value === 'number' && typeof o.decimals === 'number' ? plainDecimal(o.printed) : undefined;
    for (const k of Object.keys(o)) {
      const x = o[k];
      if (place && k === 'span') {
        const span = x as { start: number; end: number };
        out.at = [span.start, span.end];
        continue;
      }
      if (place && k === 'start' && samePosition(x, this.lines.position((o.span as { start: number }).start))) continue;
      if (place && k === 'end' && samePosition(x, this.lines.position((o.span as { end: number }).end))) continue;
      if (NUMBER_KEYS.has(key) && typeof o.printed === 'string' && typeof o.decimals === 'number') {
        if (k === 'exponent' && x === 0) continue;
        if (plain && k === 'value' && Object.is(x, plain.value)) continue;
        if (plain && k === 'decimals' && x === plain.decimals) continue;
      }
      if (sliced && k === 'printed') continue;
      if (host !== undefined && place && k === 'kind' && x === 'value' && P_KEYS.has(key)) continue;
      if (host !== undefined && place && k === 'op' && x === '=' && OP_KEYS.has(key)) continue;
      const e = this.encode(x, k, inner);
      if (e !== undefined) out[k] = e;
    }
    return out;
  }
}

/** A result or statistic as the host of the places inside it: its printed text and the offset where that starts. */
type Host = { printed: string; start: number };

/** The text of the host's `printed` between two offsets of the file, or undefined when they are not inside it. */
function sliceOf(host: Host, start: number, end: number): string | undefined {
  const from = start - host.start;
  const to = end - host.start;
  return from >= 0 && to >= from && to <= host.printed.length ? host.printed.slice(from, to) : undefined;
}

/** Keys of a host's reported p (2.1.0: `kind` "value" and `op` "=" left out). */
const P_KEYS = new Set(['p', 'adjustedP']);
/** Keys of a host's values with a comparison (2.1.0: `op` "=" left out). */
const OP_KEYS = new Set(['p', 'adjustedP', 't', 'value']);

const sameJson = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
const isRange = (v: unknown): v is { low: number; high: number } => isObject(v) && typeof v.low === 'number' && typeof v.high === 'number';

/**
 * A result's members left out when they hold their default or repeat another: `inCode` and
 * `plural` when false, `context.effectSizes` when empty, `context.design` when unknown by default,
 * `alpha` and `sidedness` when the file's, `context.interval` when it is one of
 * `context.intervals` (then its index there), `recomputed.oneTailed` when it is exactly half of
 * `twoTailed`.
 */
function resultDefaults(encoder: FileEncoder, r: JsonObject): JsonObject {
  if (r.inCode === false) delete r.inCode;
  if (r.plural === false) delete r.plural;
  for (const k of ['alpha', 'sidedness'] as const) if (encoder.fileSettings[k] !== undefined && JSON.stringify(r[k]) === encoder.fileSettings[k]) delete r[k];
  const c = r.context;
  if (isObject(c)) {
    const context = c as JsonObject;
    if (Array.isArray(context.effectSizes) && context.effectSizes.length === 0) delete context.effectSizes;
    if (sameJson(context.design, encoder.encode(UNKNOWN_DESIGN, 'design'))) delete context.design;
    if (context.interval !== undefined && Array.isArray(context.intervals)) {
      const i = context.intervals.findIndex((x) => sameJson(x, context.interval));
      if (i >= 0) context.interval = i;
    }
  }
  const rec = r.recomputed;
  if (isObject(rec) && isRange(rec.twoTailed) && isRange(rec.oneTailed) && rec.oneTailed.low === rec.twoTailed.low / 2 && rec.oneTailed.high === rec.twoTailed.high / 2) delete (rec as JsonObject).oneTailed;
  return r;
}

/** The design a result has when nothing says what it is. */
const UNKNOWN_DESIGN = { value: 'unknown', basis: 'default' };

/**
 * A finding's members left out when they repeat another: `gap.lastDigitUnits` when it is exactly
 * `absolute / (2 × roundingAllowance)`; `reported` when it is the `printed` of the result or
 * statistic its `resultId` names; an interval figure's `midpoint` when it is exactly the mean of
 * `lower` and `upper` (low with low, high with high), and its `estimate` when it is the midpoint.
 * 2.1.0, each only where the writer finds the derivation gives back the same value: `at` when it
 * is that result's (and no `start`/`end` of its own is kept); `recomputed.low` and `high` when
 * they are the result's `recomputed.twoTailed`; `gap.roundingAllowance` when it is half a unit of
 * the last printed digit of the result's p (`10^-decimals × 10^exponent / 2`); `gap.absolute`
 * when it is the distance from that p's value to `[recomputed.low, recomputed.high]` (a gap
 * without a rounding allowance, where the result has a printed p, then says
 * `"roundingAllowance": null`); `figure`
 * when it is `{"kind": "p"}` and the rule is one of `P_FIGURE_RULES` (a finding of those rules
 * without a figure then says `"figure": null`).
 */
function findingDefaults(encoder: FileEncoder, f: JsonObject, raw: Record<string, unknown>): JsonObject {
  const g = f.gap;
  const host = typeof raw.resultId === 'string' ? encoder.itemOf.get(raw.resultId) : undefined;
  const left = new Set<string>();
  if (isObject(g) && typeof g.absolute === 'number' && typeof g.roundingAllowance === 'number' && typeof g.lastDigitUnits === 'number' && g.lastDigitUnits === g.absolute / (2 * g.roundingAllowance)) left.add('lastDigitUnits');
  if (host !== undefined) {
    if (typeof host.printed === 'string' && raw.reported === host.printed) delete f.reported;
    const span = host.span as { start: number; end: number };
    if (Array.isArray(f.at) && f.at[0] === span.start && f.at[1] === span.end && !('start' in f) && !('end' in f)) delete f.at;
    const rec = raw.recomputed;
    const two = isObject(host.recomputed) ? host.recomputed.twoTailed : undefined;
    if (isObject(rec) && isRange(two) && Object.is(rec.low, two.low) && Object.is(rec.high, two.high)) {
      delete (f.recomputed as JsonObject).low;
      delete (f.recomputed as JsonObject).high;
    }
    const gap = raw.gap;
    const p = lastDigitOf(host);
    if (isObject(gap) && p !== undefined) {
      if (typeof gap.roundingAllowance === 'number' && Object.is(gap.roundingAllowance, p.unit / 2)) left.add('roundingAllowance');
      // a gap without one (a p printed with < or >) says so, or the reader would give it one
      else if (gap.roundingAllowance === undefined) (g as JsonObject).roundingAllowance = null;
      if (isRange(rec) && typeof gap.absolute === 'number' && Object.is(gap.absolute, pointDistance(rec, p.value))) left.add('absolute');
    }
  }
  if (isObject(g)) for (const k of left) delete (g as JsonObject)[k];
  sameAsBefore(encoder.lastOfKind, f);
  if (typeof raw.ruleId === 'string' && P_FIGURE_RULES.has(raw.ruleId)) {
    if (f.figure === undefined) f.figure = null;
    else if (sameJson(f.figure, P_FIGURE)) delete f.figure;
  }
  const fig = f.figure;
  if (isObject(fig) && fig.kind === 'interval') {
    const figure = fig as JsonObject;
    if (isRange(figure.midpoint) && isRange(figure.estimate) && figure.estimate.low === figure.midpoint.low && figure.estimate.high === figure.midpoint.high && Object.keys(figure.estimate).length === 2) delete figure.estimate;
    const mid = midpointOf(figure.lower, figure.upper);
    if (mid && isRange(figure.midpoint) && figure.midpoint.low === mid.low && figure.midpoint.high === mid.high && Object.keys(figure.midpoint).length === 2) delete figure.midpoint;
  }
  return f;
}

/** What a finding of each rule and message repeats from the one before it: the key of that pair. */
const kindOf = (f: Record<string, unknown>) => `${String(f.ruleId)}\u0000${JSON.stringify(f.messageId)}`;

/**
 * 2.1.0: a finding's `check`, `recomputed.quantity` and `recomputed.assumptions` are left out
 * when they are (as written) those of the last finding before it in the file with the same
 * `ruleId` and `messageId` that has them. `last` holds those, by the pair; it is updated with
 * this finding's own.
 */
function sameAsBefore(last: Map<string, { check?: string; quantity?: string; assumptions?: string }>, f: JsonObject): void {
  const key = kindOf(f);
  let before = last.get(key);
  if (before === undefined) {
    before = {};
    last.set(key, before);
  }
  if (f.check !== undefined) {
    const own = JSON.stringify(f.check);
    if (before.check === own) delete f.check;
    before.check = own;
  }
  const rec = f.recomputed;
  if (isObject(rec)) {
    for (const k of ['quantity', 'assumptions'] as const) {
      if (rec[k] === undefined) continue;
      const own = JSON.stringify(rec[k]);
      if (before[k] === own) delete (rec as JsonObject)[k];
      before[k] = own;
    }
  }
}

/**
 * The rules whose every finding with a picture draws the reported p against the recomputed one
 * (`figure` `{"kind": "p"}`): the default table of 2.1.0, also in docs/output-formats.md and the
 * schema. A finding of these rules leaves that figure out, and says `"figure": null` when it has none.
 */
export const P_FIGURE_RULES: ReadonlySet<string> = new Set([
  'p-follows-from-t',
  'significance-follows-from-t',
  'one-tailed-p-is-declared',
  'zero-p-is-a-bound',
  'p-follows-from-f',
  'p-follows-from-chi-square',
  'p-follows-from-r',
  'p-follows-from-z',
  'significance-follows-from-statistic',
]);
const P_FIGURE = { kind: 'p' };

/** The value of a result's or statistic's printed p and the unit of its last digit, as the rules take it (`lastDigitUnit(decimals) × 10^exponent`). */
function lastDigitOf(item: Record<string, unknown>): { value: number; unit: number } | undefined {
  const p = item.p;
  const n = isObject(p) ? p.number : undefined;
  if (!isObject(n) || typeof n.value !== 'number' || typeof n.decimals !== 'number' || typeof n.exponent !== 'number') return undefined;
  return { value: n.value, unit: 10 ** -n.decimals * 10 ** n.exponent };
}

/** How far a value lies outside a range (0 inside), as the rules measure a gap. */
function pointDistance(range: { low: number; high: number }, v: number): number {
  if (range.high < v) return v - range.high;
  if (range.low > v) return range.low - v;
  return 0;
}

/** The mean of two ranges, low with low and high with high, as the interval figure's midpoint is made. */
function midpointOf(lower: unknown, upper: unknown): { low: number; high: number } | undefined {
  return isRange(lower) && isRange(upper) ? { low: (lower.low + upper.low) / 2, high: (lower.high + upper.high) / 2 } : undefined;
}

/** One result, statistic, finding or checklist item of a file, encoded. */
export function encodeItem(encoder: FileEncoder, member: string, item: unknown): Json {
  const hosting = (member === 'results' || member === 'statistics') && isObject(item) && typeof item.id === 'string' && typeof item.printed === 'string' && isPlace(item);
  const e = hosting ? encoder.encode(item, '', undefined, { printed: item.printed as string, start: (item.span as { start: number }).start }) : encoder.encode(item);
  if (hosting) encoder.itemOf.set(item.id as string, item);
  if (member === 'results') return resultDefaults(encoder, e as JsonObject);
  if (member === 'findings' && isObject(item)) return findingDefaults(encoder, e as JsonObject, item);
  return e ?? null;
}

/** The in-memory file members, in the order 2.x writes them; `results`, `statistics`, `findings` and `checklist` are written item by item. */
export const STREAMED_MEMBERS = ['results', 'statistics', 'findings', 'checklist'] as const;

/**
 * Reads a file of a 2.x report back into the 1.x shape: every place with its span and positions,
 * every text in full, every default in place. `minor` is the report's minor version: what 2.1.0
 * began to leave out (places' printed slices and defaults, a finding's place, range, gap members
 * and p figure taken from its result, check and assumptions written once) is filled in only from
 * 2.1 on, so a 2.0.0 report that never had such a member does not gain one.
 */
export function expandFile(file: Record<string, unknown>, minor = Number.POSITIVE_INFINITY): Record<string, unknown> {
  const since21 = minor >= 1;
  const texts = Array.isArray(file.texts) ? (file.texts as string[]) : [];
  const steps = Array.isArray(file.lineStarts) ? (file.lineStarts as number[]) : [0];
  const starts: number[] = [];
  for (const s of steps) starts.push(starts.length === 0 ? s : (starts[starts.length - 1] as number) + s);
  const lines = new LineIndex(starts);
  const text = (i: unknown) => (typeof i === 'number' ? (texts[i] as string) : i);
  const joined = (p: unknown) => {
    if (typeof p === 'number') return texts[p];
    if (!Array.isArray(p) || typeof p[0] !== 'number' || typeof p[1] !== 'string') return p;
    const runs = p[1].split(' ');
    const parts = (texts[p[0]] as string).split('#');
    const out: string[] = [parts[0] as string];
    for (let k = 1; k < parts.length; k += 1) out.push(runs[k - 1] as string, parts[k] as string);
    return out.join('');
  };
  const isAt = (x: unknown): x is [number, number] => Array.isArray(x) && x.length === 2 && typeof x[0] === 'number' && typeof x[1] === 'number';
  // host: the result or statistic being read, for the places inside it (2.1.0)
  const decode = (v: unknown, key: string, host?: Host, own?: Host): unknown => {
    if (TEXT_KEYS.has(key)) return Array.isArray(v) ? v.map(text) : text(v);
    if (key === 'message') return joined(v);
    if (key === 'inputs' && Array.isArray(v)) return v.map(joined);
    if (Array.isArray(v)) return v.map((x) => decode(x, key, host));
    if (!isObject(v)) return v;
    const out: Record<string, unknown> = {};
    const at = v.at;
    const place = isAt(at);
    if (host !== undefined && place && !('printed' in v)) out.printed = sliceOf(host, at[0], at[1]);
    if (host !== undefined && place && P_KEYS.has(key) && !('kind' in v)) out.kind = 'value';
    if (host !== undefined && place && OP_KEYS.has(key) && !('op' in v)) out.op = '=';
    for (const k of Object.keys(v)) {
      const x = v[k];
      if (k === 'at' && isAt(x)) {
        out.span = { start: x[0], end: x[1] };
        if (!('start' in v)) out.start = lines.position(x[0]);
        if (!('end' in v)) out.end = lines.position(x[1]);
        continue;
      }
      out[k] = decode(x, k, own ?? host);
    }
    if (NUMBER_KEYS.has(key) && typeof out.printed === 'string') {
      const plain = plainDecimal(out.printed);
      if (!('value' in v) && plain) out.value = plain.value;
      if (!('decimals' in v) && plain) out.decimals = plain.decimals;
      if (!('exponent' in v)) out.exponent = 0;
    }
    return out;
  };
  const out: Record<string, unknown> = {};
  for (const k of Object.keys(file)) {
    if (k === 'texts' || k === 'lineStarts') continue;
    const v = file[k];
    // each result and statistic is the host of the places inside it
    if (since21 && (k === 'results' || k === 'statistics') && Array.isArray(v)) out[k] = v.map((x) => (isObject(x) && typeof x.printed === 'string' && isAt(x.at) ? decode(x, '', undefined, { printed: x.printed, start: x.at[0] }) : decode(x, k)));
    else out[k] = decode(v, k);
  }
  if (Array.isArray(out.results)) {
    for (const r of out.results as Array<Record<string, unknown>>) {
      if (!('inCode' in r)) r.inCode = false;
      if (!('plural' in r)) r.plural = false;
      if (!('alpha' in r) && out.alpha !== undefined) r.alpha = structuredClone(out.alpha);
      if (!('sidedness' in r) && out.sidedness !== undefined) r.sidedness = structuredClone(out.sidedness);
      if (isObject(r.context)) {
        const c = r.context;
        if (!('effectSizes' in c)) c.effectSizes = [];
        if (!('design' in c)) c.design = { ...UNKNOWN_DESIGN };
        if (typeof c.interval === 'number' && Array.isArray(c.intervals)) c.interval = structuredClone(c.intervals[c.interval]);
      }
      const rec = r.recomputed;
      if (isObject(rec) && isRange(rec.twoTailed) && !('oneTailed' in rec)) rec.oneTailed = { low: rec.twoTailed.low / 2, high: rec.twoTailed.high / 2 };
    }
  }
  if (Array.isArray(out.findings)) {
    const itemOf = new Map<unknown, Record<string, unknown>>();
    for (const list of [out.results, out.statistics]) if (Array.isArray(list)) for (const x of list as Array<Record<string, unknown>>) itemOf.set(x.id, x);
    const last = new Map<string, { check?: unknown; quantity?: unknown; assumptions?: unknown }>();
    /** What 2.1.0 leaves out of a finding, from its result (`host`) and the finding before of the same rule and message. */
    const fill21 = (f: Record<string, unknown>, host: Record<string, unknown> | undefined) => {
      // check, quantity and assumptions left out when the last finding of the same rule and message had them
      const key = kindOf(f);
      const before = last.get(key) ?? {};
      last.set(key, before);
      if (!('check' in f) && 'check' in before) f.check = before.check;
      if ('check' in f) before.check = f.check;
      const r = f.recomputed;
      if (isObject(r)) {
        for (const k of ['quantity', 'assumptions'] as const) {
          if (!(k in r) && k in before) r[k] = structuredClone(before[k]);
          if (k in r) before[k] = r[k];
        }
      }
      // in the order they were derived: the place, the recomputed range, then the gap's members from it
      if (host !== undefined) {
        if (!('reported' in f)) f.reported = host.printed;
        const span = host.span as { start: number; end: number } | undefined;
        if (!('span' in f) && span !== undefined) {
          f.span = { start: span.start, end: span.end };
          f.start = lines.position(span.start);
          f.end = lines.position(span.end);
        }
        const rec = f.recomputed;
        const two = isObject(host.recomputed) ? host.recomputed.twoTailed : undefined;
        if (isObject(rec) && !('low' in rec) && !('high' in rec) && isRange(two)) {
          rec.low = two.low;
          rec.high = two.high;
        }
        const g = f.gap;
        const p = lastDigitOf(host);
        if (isObject(g) && p !== undefined) {
          if (!('absolute' in g) && isRange(rec)) g.absolute = pointDistance(rec, p.value);
          if (!('roundingAllowance' in g)) g.roundingAllowance = p.unit / 2;
          else if (g.roundingAllowance === null) delete g.roundingAllowance;
        }
      }
      if (typeof f.ruleId === 'string' && P_FIGURE_RULES.has(f.ruleId)) {
        if (f.figure === null) delete f.figure;
        else if (!('figure' in f)) f.figure = { ...P_FIGURE };
      }
    };
    for (const f of out.findings as Array<Record<string, unknown>>) {
      const host = itemOf.get(f.resultId);
      if (!since21) {
        // 2.0.0 left out only the printed result
        if (!('reported' in f) && host !== undefined) f.reported = host.printed;
      } else fill21(f, host);
      const fig = f.figure;
      if (isObject(fig) && fig.kind === 'interval') {
        if (!('midpoint' in fig)) fig.midpoint = midpointOf(fig.lower, fig.upper);
        if (!('estimate' in fig) && isRange(fig.midpoint)) fig.estimate = { low: fig.midpoint.low, high: fig.midpoint.high };
      }
      const g = f.gap;
      if (isObject(g) && typeof g.absolute === 'number' && typeof g.roundingAllowance === 'number' && !('lastDigitUnits' in g)) g.lastDigitUnits = g.absolute / (2 * g.roundingAllowance);
    }
  }
  return out;
}

/** The file members of a FileReport, as the JSON report writes them (the source text is not repeated). */
export type FileMembers = Omit<FileReport, 'source'>;
