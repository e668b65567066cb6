/**
 * A corpus summary for meta-research, from the NDJSON lines `plumbline batch` writes (one line per
 * document: a report, or `{"id", "error"}`). Counting only: the formatters in src/report lay the
 * summary out as CSV or HTML and compute nothing.
 *
 * Per document: its results, findings and findings by level. Per rule: findings by level, the
 * documents with at least one, and the rate per 100 results of the whole corpus (every result
 * of every document checked is the denominator, whichever rule could speak about it; a
 * document-level finding, such as a missing checklist item, counts as well). Gaps: the findings
 * that carry a gap in units of the last printed digit, counted in bins per rule: the distance
 * from the reported value to the nearest value recomputed (the report's `gap.lastDigitUnits`;
 * rounding alone allows about half a unit), so it compares figures of any size. Bins are fixed, so summaries of different corpora line up.
 *
 * Streaming: `add` takes one line at a time and returns that document's row, so a caller can
 * write rows as they come; the rule and gap tables grow with the number of rules, not documents.
 */

export type SummaryLevel = 'error' | 'warning' | 'note';
const LEVELS: readonly SummaryLevel[] = ['error', 'warning', 'note'];

export interface DocumentRow {
  /** The line of the results file, from 1. */
  line: number;
  id: string | number | null;
  /** `not-batch-output`: the line is neither a report nor an error line of plumbline batch. */
  status: 'checked' | 'not-checked' | 'not-batch-output';
  /** Why the document was not checked (its error line), or why the line could not be read. */
  reason?: string;
  results: number;
  findings: number;
  byLevel: Record<SummaryLevel, number>;
}

export interface RuleRow {
  ruleId: string;
  findings: number;
  byLevel: Record<SummaryLevel, number>;
  /** Checked documents with at least one finding of this rule. */
  documents: number;
  /** Findings per 100 results of the corpus; null when the corpus has no result. */
  per100Results: number | null;
}

/** A bin of gaps in last-digit units: low inclusive, high exclusive (null: no upper end). */
export interface GapBin {
  low: number;
  high: number | null;
}

export interface GapRow {
  ruleId: string;
  /** Findings in each bin of GAP_BINS, in order. */
  counts: number[];
  /** Findings of this rule that carry no gap in last-digit units (a missing item, a count). */
  withoutUnits: number;
}

/** A bin of findings per document: low and high inclusive (null: no upper end). */
export interface CountBin {
  low: number;
  high: number | null;
  documents: number;
}

export interface CorpusSummary {
  lines: number;
  checked: number;
  notChecked: number;
  /** Lines that are neither a report nor an error line (not plumbline batch output). */
  unreadable: number[];
  results: number;
  findings: number;
  byLevel: Record<SummaryLevel, number>;
  /** Checked documents with at least one finding at error or warning level. */
  documentsFlagged: number;
  rules: RuleRow[];
  gapBins: GapBin[];
  gaps: GapRow[];
  /** All rules together, bin by bin. */
  gapTotals: number[];
  findingsPerDocument: CountBin[];
}

/** Edges of the gap bins, in units of the last printed digit (common practice, no source: decades beyond 10, finer below). */
export const GAP_EDGES: readonly number[] = [0, 1, 2, 5, 10, 100, 1000];
const GAP_BINS: GapBin[] = GAP_EDGES.map((low, i) => ({ low, high: GAP_EDGES[i + 1] ?? null }));
const COUNT_BINS: ReadonlyArray<[number, number | null]> = [[0, 0], [1, 1], [2, 2], [3, 5], [6, 10], [11, 20], [21, null]];

const zeroLevels = (): Record<SummaryLevel, number> => ({ error: 0, warning: 0, note: 0 });

interface RuleTally {
  byLevel: Record<SummaryLevel, number>;
  documents: number;
  gaps: number[];
  withoutUnits: number;
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

export class CorpusTally {
  /**
   * `read`: how a batch line is read into the 1.x shape (the command passes readJsonReport of
   * src/report/json.ts: report 2.1.0 leaves out a gap's members its result gives back); by
   * default the line as it is.
   */
  constructor(private readonly read: (doc: Record<string, unknown>) => Record<string, unknown> = (doc) => doc) {}

  private lines = 0;
  private checked = 0;
  private notChecked = 0;
  private readonly unreadable: number[] = [];
  private results = 0;
  private readonly byLevel = zeroLevels();
  private flagged = 0;
  private readonly rules = new Map<string, RuleTally>();
  private readonly perDocument = COUNT_BINS.map(() => 0);

  /** One line of batch output (its text); the document's row. */
  add(text: string): DocumentRow {
    this.lines += 1;
    const line = this.lines;
    let doc: unknown;
    try {
      doc = JSON.parse(text);
    } catch {
      doc = undefined;
    }
    const id = isRecord(doc) && (typeof doc.id === 'string' || typeof doc.id === 'number') ? doc.id : null;
    const empty = { line, id, results: 0, findings: 0, byLevel: zeroLevels() };
    if (isRecord(doc) && typeof doc.error === 'string') {
      this.notChecked += 1;
      return { ...empty, status: 'not-checked', reason: doc.error };
    }
    if (!isRecord(doc) || !Array.isArray(doc.results) || !Array.isArray(doc.findings)) {
      this.unreadable.push(line);
      return { ...empty, status: 'not-batch-output', reason: text.trim() === '' ? 'an empty line, not a batch output line' : 'not a line of plumbline batch output' };
    }
    this.checked += 1;
    const byLevel = zeroLevels();
    const seen = new Set<string>();
    let findings = 0;
    // report 2.x lines leave out a gap's lastDigitUnits where it is absolute / (2 × roundingAllowance),
    // and 2.1.0 also absolute and roundingAllowance where the result gives them back (schema/report.schema.json):
    // read through `read`; a rule's id is a plain string in 1.x and 2.x alike
    const full = this.read(doc);
    const found = Array.isArray(full.findings) ? full.findings : doc.findings;
    for (const f of found) {
      if (!isRecord(f)) continue;
      const ruleId: unknown = f.ruleId;
      if (typeof ruleId !== 'string') continue;
      const level: SummaryLevel = f.level === 'error' || f.level === 'warning' ? f.level : 'note';
      findings += 1;
      byLevel[level] += 1;
      let rule = this.rules.get(ruleId);
      if (!rule) {
        rule = { byLevel: zeroLevels(), documents: 0, gaps: GAP_BINS.map(() => 0), withoutUnits: 0 };
        this.rules.set(ruleId, rule);
      }
      rule.byLevel[level] += 1;
      if (!seen.has(ruleId)) {
        seen.add(ruleId);
        rule.documents += 1;
      }
      const g = f.gap;
      const stated = isRecord(g) && typeof g.lastDigitUnits === 'number' ? g.lastDigitUnits : undefined;
      const derived = isRecord(g) && stated === undefined && typeof g.absolute === 'number' && typeof g.roundingAllowance === 'number' ? g.absolute / (2 * g.roundingAllowance) : undefined;
      const units = stated ?? derived;
      if (units === undefined || !Number.isFinite(units)) rule.withoutUnits += 1;
      else {
        const k = binOf(units);
        rule.gaps[k] = (rule.gaps[k] ?? 0) + 1;
      }
    }
    const results = doc.results.length;
    this.results += results;
    for (const l of LEVELS) this.byLevel[l] += byLevel[l];
    if (byLevel.error + byLevel.warning > 0) this.flagged += 1;
    const k = COUNT_BINS.findIndex(([lo, hi]) => findings >= lo && (hi === null || findings <= hi));
    this.perDocument[k] = (this.perDocument[k] ?? 0) + 1;
    return { line, id, status: 'checked', results, findings, byLevel };
  }

  summary(): CorpusSummary {
    const ids = [...this.rules.keys()].sort();
    const total = (r: RuleTally) => r.byLevel.error + r.byLevel.warning + r.byLevel.note;
    const rules: RuleRow[] = ids.map((ruleId) => {
      const r = this.rules.get(ruleId) as RuleTally;
      return { ruleId, findings: total(r), byLevel: { ...r.byLevel }, documents: r.documents, per100Results: this.results > 0 ? (100 * total(r)) / this.results : null };
    });
    const gaps: GapRow[] = ids.map((ruleId) => {
      const r = this.rules.get(ruleId) as RuleTally;
      return { ruleId, counts: [...r.gaps], withoutUnits: r.withoutUnits };
    });
    return {
      lines: this.lines,
      checked: this.checked,
      notChecked: this.notChecked,
      unreadable: [...this.unreadable],
      results: this.results,
      findings: this.byLevel.error + this.byLevel.warning + this.byLevel.note,
      byLevel: { ...this.byLevel },
      documentsFlagged: this.flagged,
      rules,
      gapBins: GAP_BINS.map((b) => ({ ...b })),
      gaps,
      gapTotals: GAP_BINS.map((_, i) => gaps.reduce((n, g) => n + (g.counts[i] ?? 0), 0)),
      findingsPerDocument: COUNT_BINS.map(([low, high], i) => ({ low, high, documents: this.perDocument[i] ?? 0 })),
    };
  }
}

function binOf(units: number): number {
  for (let i = GAP_EDGES.length - 1; i >= 0; i -= 1) if (units >= (GAP_EDGES[i] as number)) return i;
  return 0;
}
