/**
 * The referee's report as one self-contained HTML file: inline CSS and SVG, no script, and a
 * Content-Security-Policy that forbids every network load. Every piece of manuscript text is
 * escaped (and stripped of control characters), so a manuscript holding markup runs nothing.
 * The same pieces render the browser page (src/web), which is why the file sections are exported.
 *
 * Layout only: positions on the log axis are geometry; every statistic shown comes from the report.
 */
import type { FileReport, Finding, ResultRecord } from '../engine/types.js';
import { guidelineRefs, missingWhere, summariseChecklist, type ItemSummary, type MissingPlace } from './checklistSummary.js';
import type { Level } from '../rule-api/types.js';
import { CAUTIONS, countRun, type RunReport } from './types.js';

/** Severity is told by shape and line style as well as colour (readable in print and without colour vision). */
const SEVERITY: Record<Level, { symbol: string; word: string }> = {
  error: { symbol: '▲', word: 'error' },
  warning: { symbol: '◆', word: 'warning' },
  note: { symbol: '●', word: 'note' },
};
const RANK: Record<Level, number> = { note: 1, warning: 2, error: 3 };

// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u2028\u2029]/g;

/** Text into HTML text or attribute content: control characters dropped, the five specials escaped. */
export function escapeHtml(s: string): string {
  return s.replace(CONTROL, '').replace(/[&<>"']/g, (c) => (c === '&' ? '&amp;' : c === '<' ? '&lt;' : c === '>' ? '&gt;' : c === '"' ? '&quot;' : '&#39;'));
}

/** Identifiers made only of safe characters (file indexes and counters), for id and href. */
const anchor = (file: number, kind: string, n: number | string) => `f${file}-${kind}-${String(n).replace(/[^A-Za-z0-9_-]/g, '_')}`;

export const REPORT_CSS = `
:root { --error: #b8430b; --warning: #8a6100; --note: #0b5f99; --ink: #1c1c1c; --muted: #5c5c5c; --rule: #d0d0d0; --result: #eef3f7; --paper: #fff; }
* { box-sizing: border-box; }
body { margin: 0; font: 15px/1.5 system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif; color: var(--ink); background: var(--paper); }
header.top, section.file, section.failures, footer { max-width: 1200px; margin: 0 auto; padding: 12px 20px; }
h1 { font-size: 1.5em; margin: 0.4em 0; } h2 { font-size: 1.25em; margin: 1.2em 0 0.4em; border-bottom: 2px solid var(--ink); } h3 { font-size: 1.05em; margin: 1em 0 0.3em; }
.cautions { border-left: 4px solid var(--ink); padding: 6px 12px; background: #f6f6f6; font-size: 0.92em; }
.cautions p { margin: 0.3em 0; }
table.summary { border-collapse: collapse; margin: 8px 0; }
table.summary td, table.summary th { border: 1px solid var(--rule); padding: 3px 10px; text-align: right; }
table.summary th { text-align: left; font-weight: 600; }
.lvl-error { --c: var(--error); } .lvl-warning { --c: var(--warning); } .lvl-note { --c: var(--note); }
.sym { color: var(--c); font-weight: 700; }
.layout { display: grid; grid-template-columns: minmax(0, 3fr) minmax(280px, 2fr); gap: 20px; align-items: start; }
@media (max-width: 900px) { .layout { grid-template-columns: 1fr; } }
.manuscript { font: 14px/1.6 ui-monospace, SFMono-Regular, Menlo, Consolas, monospace; border: 1px solid var(--rule); padding: 8px 0; overflow-wrap: anywhere; }
.line { display: grid; grid-template-columns: 4.5em minmax(0, 1fr); white-space: pre-wrap; }
.ln { color: var(--muted); text-align: right; padding-right: 1em; user-select: none; }
.result { background: var(--result); border-radius: 2px; }
mark.flag { background: transparent; color: inherit; text-decoration-line: underline; text-decoration-color: var(--c); text-decoration-thickness: 2px; text-underline-offset: 3px; }
mark.flag.lvl-error { text-decoration-style: double; text-decoration-thickness: 3px; background: #fbe9e1; }
mark.flag.lvl-warning { text-decoration-style: dashed; background: #fbf3dc; }
mark.flag.lvl-note { text-decoration-style: dotted; }
mark.flag a { color: inherit; text-decoration: none; }
mark.flag .tag { font-size: 0.75em; vertical-align: super; color: var(--c); }
.cards { display: flex; flex-direction: column; gap: 10px; }
details.card { border: 1px solid var(--rule); border-left: 6px solid var(--c); padding: 6px 10px; background: var(--paper); break-inside: avoid; }
details.card:target { outline: 3px solid var(--c); }
details.card summary { cursor: pointer; font-weight: 600; }
details.card dl { display: grid; grid-template-columns: 8.5em minmax(0, 1fr); gap: 2px 10px; margin: 6px 0; font-size: 0.92em; }
details.card dt { color: var(--muted); } details.card dd { margin: 0; overflow-wrap: anywhere; }
.where { font-weight: 400; color: var(--muted); }
svg text { font: 11px system-ui, sans-serif; fill: var(--ink); }
svg .axis { stroke: var(--muted); stroke-width: 1; } svg .grid { stroke: var(--rule); stroke-width: 1; }
svg .alpha { stroke: var(--ink); stroke-width: 1.5; stroke-dasharray: 5 3; }
svg .range { fill: #4d4d4d; } svg .range.fits { fill: #7da7c7; }
svg .reported { fill: var(--paper); stroke: var(--ink); stroke-width: 2; }
svg a:hover rect.row { fill: #f0f0f0; }
table.checklist { border-collapse: collapse; width: 100%; font-size: 0.92em; }
table.checklist td, table.checklist th { border: 1px solid var(--rule); padding: 3px 8px; text-align: left; vertical-align: top; }
.st-found::before { content: "✓ "; } .st-missing::before { content: "✗ "; font-weight: 700; } .st-not-applicable::before { content: "– "; }
.st-missing { color: var(--error); }
.results-list { font-size: 0.92em; }
.results-list li { margin: 4px 0; }
@media print { .layout { grid-template-columns: 1fr; } details.card { page-break-inside: avoid; } a { color: inherit; } }
`;

/** The HTML report for a whole run. */
export function formatHtml(run: RunReport, options: { title?: string } = {}): string {
  const title = options.title ?? `plumbline report: ${run.files.map((f) => f.path).join(', ') || 'no files'}`;
  const body = [
    '<header class="top">',
    `<h1>${escapeHtml(title)}</h1>`,
    `<p>${escapeHtml(run.tool.name)} ${escapeHtml(run.tool.version)} checked the t-tests these manuscripts report: each p against its t and df, and each test against the descriptives, intervals and effect sizes beside it, allowing for rounding.</p>`,
    summaryTable(run),
    cautionsHtml(),
    '</header>',
    ...run.files.map((f, i) => fileSection(f, i)),
    run.failures.length > 0
      ? `<section class="failures"><h2>Not checked</h2><ul>${run.failures.map((f) => `<li><strong>${escapeHtml(f.path)}</strong>: ${escapeHtml(f.message)}</li>`).join('')}</ul></section>`
      : '',
    `<footer>${cautionsHtml()}</footer>`,
  ].join('\n');
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'">
<meta name="referrer" content="no-referrer">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>${REPORT_CSS}</style>
</head>
<body>
${body}
</body>
</html>
`;
}

export function cautionsHtml(): string {
  return `<div class="cautions" role="note">${CAUTIONS.map((c) => `<p>${escapeHtml(c)}</p>`).join('')}</div>`;
}

function summaryTable(run: RunReport): string {
  const c = countRun(run);
  const flaggedResults = new Set<string>();
  for (const [i, f] of run.files.entries()) for (const x of f.findings) if (x.resultId && x.level !== 'note') flaggedResults.add(`${i}/${x.resultId}`);
  const consistent = run.files.reduce((n, f, i) => n + f.results.filter((r) => r.recomputed && !flaggedResults.has(`${i}/${r.id}`)).length, 0);
  const row = (label: string, value: number, cls = '') => `<tr${cls ? ` class="${cls}"` : ''}><th>${label}</th><td>${value}</td></tr>`;
  return `<table class="summary" aria-label="summary">
${row('Files checked', c.files)}${c.failures > 0 ? row('Files not checked', c.failures) : ''}
${row('Results found', c.results)}
${row('Results with p recomputed', c.checked)}
${row('Recomputed and not flagged', consistent)}
${row(`<span class="sym">${SEVERITY.error.symbol}</span> Errors`, c.error, 'lvl-error')}
${row(`<span class="sym">${SEVERITY.warning.symbol}</span> Warnings`, c.warning, 'lvl-warning')}
${row(`<span class="sym">${SEVERITY.note.symbol}</span> Notes`, c.note, 'lvl-note')}
</table>`;
}

/** One file: the overview plot, the text with its marks beside the cards, the results, the checklist. */
export function fileSection(file: FileReport, index: number): string {
  const ordered = [...file.findings].sort((a, b) => a.span.start - b.span.start);
  return [
    `<section class="file" id="${anchor(index, 'file', 0)}">`,
    `<h2>${escapeHtml(file.path)}</h2>`,
    `<p>${file.results.length} result${file.results.length === 1 ? '' : 's'} found, ${file.findings.length} finding${file.findings.length === 1 ? '' : 's'}. Alpha ${escapeHtml(String(file.alpha.value))}, ${escapeHtml(file.sidedness.value)}-tailed where the text says nothing.</p>`,
    file.results.some(plottable) ? `<h3>All tests in reading order</h3>${forestPlot(file, index)}` : '',
    '<div class="layout">',
    `<div><h3>Manuscript</h3>${manuscriptHtml(file, index, ordered)}</div>`,
    `<div><h3>Findings</h3><div class="cards">${ordered.length === 0 ? '<p>No findings.</p>' : ordered.map((f, n) => card(file, index, f, n)).join('\n')}</div></div>`,
    '</div>',
    file.results.length > 0 ? `<h3>Results</h3><ol class="results-list">${file.results.map((r, n) => resultItem(file, index, r, n)).join('')}</ol>` : '',
    file.checklist.length > 0 ? `<h3>Reporting checklist</h3>${checklistTable(file, index)}` : '',
    '</section>',
  ].join('\n');
}

/** The source, line by line, with results shaded and flagged spans marked by severity. */
function manuscriptHtml(file: FileReport, index: number, ordered: Finding[]): string {
  const src = file.source;
  const cuts = new Set<number>([0, src.length]);
  for (let i = src.indexOf('\n'); i >= 0; i = src.indexOf('\n', i + 1)) cuts.add(i + 1);
  const marks = ordered.map((f, n) => ({ start: f.span.start, end: Math.max(f.span.end, f.span.start), n, level: f.level }));
  for (const m of marks) cuts.add(m.start).add(m.end);
  for (const r of file.results) cuts.add(r.span.start).add(r.span.end);
  const points = [...cuts].filter((x) => x >= 0 && x <= src.length).sort((a, b) => a - b);
  const lines: string[] = [];
  let line = 1;
  let current = `<div class="line" id="${anchor(index, 'L', 1)}"><span class="ln">1</span><span class="tx">`;
  const emptyAt = new Map<number, typeof marks>();
  for (const m of marks) if (m.end === m.start) emptyAt.set(m.start, [...(emptyAt.get(m.start) ?? []), m]);
  const flagTag = (m: (typeof marks)[number], inner: string) =>
    `<mark class="flag lvl-${m.level}" data-finding="${m.n}"><a href="#${anchor(index, 'card', m.n)}" title="${SEVERITY[m.level].word}">${inner}<span class="tag" aria-label="${SEVERITY[m.level].word}">${SEVERITY[m.level].symbol}</span></a></mark>`;
  // a sweep over the cut points keeps the marks and results covering each piece (linear, not a scan per piece)
  const startsAt = new Map<number, typeof marks>();
  const endsAt = new Map<number, typeof marks>();
  for (const m of marks) {
    if (m.end === m.start) continue;
    startsAt.set(m.start, [...(startsAt.get(m.start) ?? []), m]);
    endsAt.set(m.end, [...(endsAt.get(m.end) ?? []), m]);
  }
  const resultDelta = new Map<number, number>();
  for (const r of file.results) {
    resultDelta.set(r.span.start, (resultDelta.get(r.span.start) ?? 0) + 1);
    resultDelta.set(r.span.end, (resultDelta.get(r.span.end) ?? 0) - 1);
  }
  const active = new Set<(typeof marks)[number]>();
  let inResults = 0;
  for (let k = 0; k < points.length; k++) {
    const a = points[k] as number;
    for (const m of endsAt.get(a) ?? []) active.delete(m);
    for (const m of startsAt.get(a) ?? []) active.add(m);
    inResults += resultDelta.get(a) ?? 0;
    for (const m of emptyAt.get(a) ?? []) current += flagTag(m, '');
    const b = points[k + 1];
    if (b === undefined) break;
    let piece = src.slice(a, b);
    const newline = piece.endsWith('\n');
    if (newline) piece = piece.slice(0, -1).replace(/\r$/, '');
    let html = escapeHtml(piece.replace(/\t/g, '    ').replace(/^\uFEFF/, ''));
    if (html !== '') {
      if (inResults > 0) html = `<span class="result">${html}</span>`;
      const covering = [...active];
      // the most severe mark outermost; each finding's first piece carries its tag
      for (const m of covering.sort((x, y) => RANK[x.level] - RANK[y.level])) {
        html = m.start === a ? flagTag(m, html) : `<mark class="flag lvl-${m.level}" data-finding="${m.n}">${html}</mark>`;
      }
    }
    current += html;
    if (newline) {
      lines.push(`${current}</span></div>`);
      line += 1;
      current = `<div class="line" id="${anchor(index, 'L', line)}"><span class="ln">${line}</span><span class="tx">`;
    }
  }
  // a final line end does not start a line of its own
  if (!(src.endsWith('\n') && current.endsWith('<span class="tx">'))) lines.push(`${current}</span></div>`);
  return `<div class="manuscript">${lines.join('\n')}</div>`;
}

function fmt(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (x !== 0 && Math.abs(x) < 1e-4) return x.toExponential(2);
  return String(Number(x.toPrecision(4)));
}

function card(file: FileReport, index: number, f: Finding, n: number): string {
  const s = SEVERITY[f.level];
  const rows: string[] = [`<dt>Reported</dt><dd>${escapeHtml(f.reported)}</dd>`];
  if (f.recomputed) {
    const r = f.recomputed;
    rows.push(`<dt>Recomputed</dt><dd>${escapeHtml(r.quantity)}: ${r.low === r.high ? fmt(r.low) : `${fmt(r.low)} to ${fmt(r.high)}`}</dd>`);
    if (r.inputs.length > 0) rows.push(`<dt>From</dt><dd>${r.inputs.map(escapeHtml).join('; ')}</dd>`);
    if (r.assumptions.length > 0) rows.push(`<dt>Assuming</dt><dd>${r.assumptions.map(escapeHtml).join('; ')}</dd>`);
  }
  if (f.gap) {
    const g = f.gap;
    rows.push(`<dt>Difference</dt><dd>${fmt(g.absolute)}${g.lastDigitUnits !== undefined ? ` (${fmt(g.lastDigitUnits)} units of the last printed digit${g.roundingAllowance !== undefined ? `; rounding allows ${fmt(g.roundingAllowance)}` : ''})` : ''}</dd>`);
  }
  rows.push(`<dt>What to check</dt><dd>${escapeHtml(f.check)}</dd>`);
  for (const r of f.related ?? []) rows.push(`<dt>See also</dt><dd><a href="#${anchor(index, 'L', r.start.line)}">line ${r.start.line}</a>: ${escapeHtml(r.message)}</dd>`);
  const result = f.resultId ? file.results.find((r) => r.id === f.resultId) : undefined;
  const strip = result && plottable(result) ? `<div class="strip">${pStrip(result)}</div>` : '';
  return `<details class="card lvl-${f.level}" id="${anchor(index, 'card', n)}" data-card="${n}" open>
<summary><span class="sym" aria-hidden="true">${s.symbol}</span> ${s.word} · ${escapeHtml(f.ruleId)} <a class="where" href="#${anchor(index, 'L', f.start.line)}">line ${f.start.line}, column ${f.start.column}</a></summary>
<p>${escapeHtml(f.message)}</p>
<dl>${rows.join('')}</dl>${strip}
</details>`;
}

function resultItem(file: FileReport, index: number, r: ResultRecord, n: number): string {
  const flagged = file.findings.filter((f) => f.resultId === r.id);
  const worst = worstLevel(flagged);
  const status = worst ? `<span class="lvl-${worst}"><span class="sym">${SEVERITY[worst].symbol}</span> ${flagged.length} finding${flagged.length === 1 ? '' : 's'}</span>` : r.recomputed ? 'no finding' : 'not recomputed';
  return `<li id="${anchor(index, 'r', n)}"><a href="#${anchor(index, 'L', r.start.line)}">line ${r.start.line}</a>: <code>${escapeHtml(r.printed)}</code> — ${status}${plottable(r) ? ` ${pStrip(r)}` : ''}</li>`;
}

function worstLevel(findings: Finding[]): Level | undefined {
  return findings.reduce<Level | undefined>((w, f) => (!w || RANK[f.level] > RANK[w] ? f.level : w), undefined);
}

/**
 * The checklist: the document's items (a missing one has no line), then one row per per-result
 * item with how many results meet it and where it is missing, each place a link to its line.
 */
function checklistTable(file: FileReport, index: number): string {
  const items = summariseChecklist(file);
  const byLine = (line: number, text: string) => `<a href="#${anchor(index, 'L', line)}">${escapeHtml(text)}</a>`;
  const guideline = (s: ItemSummary) => guidelineRefs(s.record).map((r) => `${escapeHtml(r.guideline)}: ${escapeHtml(r.ref)}`).join('; ');
  const doc = items.flatMap((s) =>
    s.scope === 'document'
      ? [`<tr><td>${escapeHtml(s.record.item)}</td><td class="st-${s.status}">${s.status.replace('-', ' ')}</td><td>${escapeHtml(s.detail)}${s.line !== undefined ? ` (${byLine(s.line, `line ${s.line}`)})` : ''}</td><td>${guideline(s)}</td></tr>`]
      : [],
  );
  const perResult = items.flatMap((s) => {
    if (s.scope !== 'result') return [];
    const status = s.applicable === 0 ? 'not-applicable' : s.missing === 0 ? 'found' : 'missing';
    const met = s.applicable === 0 ? 'not applicable' : `${s.found} of ${s.applicable}`;
    const where = s.missing === 0 ? '' : s.missing === s.applicable && s.applicable > 1 ? escapeHtml(missingWhere(s)) : placeLinks(s.places, byLine);
    return [`<tr><td>${escapeHtml(s.record.item)}</td><td class="st-${status}">${met}</td><td>${where}</td><td>${guideline(s)}</td></tr>`];
  });
  const head = (second: string, third: string) => `<thead><tr><th>Item</th><th>${second}</th><th>${third}</th><th>Guideline</th></tr></thead>`;
  return [
    `<p><strong>The document</strong></p><table class="checklist">${head('Status', 'Detail')}<tbody>${doc.join('')}</tbody></table>`,
    perResult.length > 0 && file.results.length > 0 ? `<p><strong>Each result</strong></p><table class="checklist">${head('Met', 'Missing for')}<tbody>${perResult.join('')}</tbody></table>` : '',
  ].join('');
}

/** Each place a link to its line: "line 19", "Table 1, row 'Eye strain'". */
function placeLinks(places: readonly MissingPlace[], link: (line: number, text: string) => string): string {
  const seen = new Map<string, { line: number; n: number }>();
  for (const p of places) {
    const text = p.table ? `${p.table.name}, ${p.table.row ? `row '${p.table.row}'` : `line ${p.line}`}` : `line ${p.line}${p.printed ? ` (${p.printed})` : ''}`;
    const had = seen.get(text);
    if (had) had.n += 1;
    else seen.set(text, { line: p.line, n: 1 });
  }
  return [...seen].map(([text, { line, n }]) => `${link(line, text)}${n > 1 ? ` (${n} results)` : ''}`).join(', ');
}

// ---- pictures: log-scale p axis -------------------------------------------------------------

/** A result can be drawn when its p was recomputed and a numeric p was printed. */
function plottable(r: ResultRecord): boolean {
  return r.recomputed !== undefined && r.p?.number !== undefined;
}

function rangeOf(r: ResultRecord): { low: number; high: number } {
  const rc = r.recomputed as NonNullable<ResultRecord['recomputed']>;
  return r.sidedness.value === 'one' ? rc.oneTailed : rc.twoTailed;
}

interface Axis {
  min: number; // log10 of the left edge
  x0: number;
  width: number;
}

const axisX = (a: Axis, p: number) => a.x0 + ((Math.max(Math.log10(Math.max(p, 1e-300)), a.min) - a.min) / -a.min) * a.width;

function axisFor(values: number[]): Axis {
  const finite = values.filter((v) => v > 0 && Number.isFinite(v));
  const lowest = finite.length > 0 ? Math.min(...finite) : 1e-3;
  const min = Math.max(-12, Math.min(-3, Math.floor(Math.log10(lowest)) - 0.5));
  return { min, x0: 0, width: 0 };
}

function ticks(a: Axis, y0: number, y1: number): string {
  const out: string[] = [];
  for (let e = 0; e >= Math.ceil(a.min); e--) {
    const x = axisX(a, 10 ** e);
    out.push(`<line class="grid" x1="${x.toFixed(1)}" y1="${y0}" x2="${x.toFixed(1)}" y2="${y1}"/><text x="${x.toFixed(1)}" y="${y1 + 12}" text-anchor="middle">${e === 0 ? '1' : e >= -3 ? String(10 ** e) : `1e${e}`}</text>`);
  }
  return out.join('');
}

/** The reported p as a marker: a circle for "=", a triangle pointing left for "<" (a bound). */
function marker(r: ResultRecord, x: number, y: number): string {
  const op = r.p?.op;
  const label = `reported p ${escapeHtml(op ?? '=')} ${escapeHtml(r.p?.number?.printed ?? '')}`;
  if (op === '<' || op === '<=') return `<path class="reported" d="M${(x - 7).toFixed(1)},${y} L${(x + 2).toFixed(1)},${y - 6} L${(x + 2).toFixed(1)},${y + 6} Z"><title>${label}</title></path>`;
  if (op === '>' || op === '>=') return `<path class="reported" d="M${(x + 7).toFixed(1)},${y} L${(x - 2).toFixed(1)},${y - 6} L${(x - 2).toFixed(1)},${y + 6} Z"><title>${label}</title></path>`;
  return `<circle class="reported" cx="${x.toFixed(1)}" cy="${y}" r="5"><title>${label}</title></circle>`;
}

function bar(r: ResultRecord, a: Axis, y: number, h: number): string {
  const { low, high } = rangeOf(r);
  const x1 = axisX(a, low);
  const x2 = Math.max(axisX(a, high), x1 + 4);
  const fits = r.recomputed?.standing === 'consistent';
  return `<rect class="range${fits ? ' fits' : ''}" x="${x1.toFixed(1)}" y="${y - h / 2}" width="${(x2 - x1).toFixed(1)}" height="${h}"><title>recomputed ${escapeHtml(r.sidedness.value)}-tailed p ${fmt(low)} to ${fmt(high)}</title></rect>`;
}

/** Where the reported p sits against the recomputed p range, for one test. */
export function pStrip(r: ResultRecord): string {
  const { low } = rangeOf(r);
  const reported = r.p?.number?.value ?? 1;
  const a = { ...axisFor([low, reported, r.alpha.value]), x0: 10, width: 240 };
  const alphaX = axisX(a, r.alpha.value);
  return `<svg class="pstrip" role="img" width="270" height="46" viewBox="0 0 270 46" aria-label="reported p ${escapeHtml(r.p?.number?.printed ?? '')} against recomputed range ${fmt(rangeOf(r).low)} to ${fmt(rangeOf(r).high)}">
<line class="axis" x1="${a.x0}" y1="24" x2="${a.x0 + a.width}" y2="24"/>${ticks(a, 8, 28)}
<line class="alpha" x1="${alphaX.toFixed(1)}" y1="4" x2="${alphaX.toFixed(1)}" y2="30"><title>alpha ${escapeHtml(String(r.alpha.value))}</title></line>
${bar(r, a, 16, 8)}${marker(r, axisX(a, reported), 16)}</svg>`;
}

/** Every drawable test in reading order: recomputed range as a bar, reported p as a marker, alpha across. */
function forestPlot(file: FileReport, index: number): string {
  const rows = file.results.map((r, n) => ({ r, n })).filter(({ r }) => plottable(r));
  const label = 190;
  const a: Axis = { ...axisFor(rows.flatMap(({ r }) => [rangeOf(r).low, r.p?.number?.value ?? 1, r.alpha.value])), x0: label + 10, width: 460 };
  const rowH = 22;
  const top = 18;
  const height = top + rows.length * rowH + 18;
  const alphas = [...new Set(rows.map(({ r }) => r.alpha.value))];
  const body = rows
    .map(({ r, n }, k) => {
      const y = top + k * rowH + rowH / 2;
      const flagged = worstLevel(file.findings.filter((f) => f.resultId === r.id));
      const sym = flagged ? `<text x="4" y="${y + 4}" class="lvl-${flagged}" style="fill: var(--c)">${SEVERITY[flagged].symbol}</text>` : '';
      const text = r.printed.length > 30 ? `${r.printed.slice(0, 29)}…` : r.printed;
      return `<a href="#${anchor(index, 'r', n)}"><rect class="row" x="0" y="${y - rowH / 2}" width="${a.x0 + a.width + 10}" height="${rowH}" fill="transparent"/>${sym}<text x="18" y="${y + 4}">L${r.start.line} ${escapeHtml(text)}</text>${bar(r, a, y, 9)}${marker(r, axisX(a, r.p?.number?.value ?? 1), y)}</a>`;
    })
    .join('\n');
  const alphaLines = alphas.map((al) => `<line class="alpha" x1="${axisX(a, al).toFixed(1)}" y1="${top - 6}" x2="${axisX(a, al).toFixed(1)}" y2="${top + rows.length * rowH}"><title>alpha ${al}</title></line><text x="${axisX(a, al).toFixed(1)}" y="${top - 8}" text-anchor="middle">α = ${al}</text>`).join('');
  return `<svg class="forest" role="img" width="${a.x0 + a.width + 20}" height="${height}" viewBox="0 0 ${a.x0 + a.width + 20} ${height}" aria-label="recomputed p ranges and reported p values for ${rows.length} tests">
${ticks(a, top - 4, top + rows.length * rowH)}<line class="axis" x1="${a.x0}" y1="${top + rows.length * rowH}" x2="${a.x0 + a.width}" y2="${top + rows.length * rowH}"/>
${alphaLines}
${body}
</svg>
<p class="legend">Bar: the p values t and df allow within rounding (light when the reported p lies among them). Circle: the reported p; triangle: a reported bound such as p &lt; .001. Dashed line: alpha. Each row links to its result.</p>`;
}
