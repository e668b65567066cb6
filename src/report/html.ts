/**
 * The referee's report as one self-contained HTML file: inline CSS and SVG, no script, and a
 * Content-Security-Policy that forbids every network load. Every piece of manuscript text is
 * escaped (and stripped of control characters), so a manuscript holding markup runs nothing.
 * The same pieces render the browser page (src/web), which is why the file sections are exported.
 *
 * Layout only: the pictures (pictures.ts) turn numbers the report carries into positions; every
 * statistic shown comes from the report.
 */
import type { FileReport, Finding } from '../engine/types.js';
import { guidelineRefs, isChecklistFinding, missingWhere, summariseChecklist, type ItemSummary, type MissingPlace } from './checklistSummary.js';
import type { Level } from '../rule-api/types.js';
import { showLastDigitUnits } from '../rule-api/format.js';
import { escapeHtml, shortNumber as fmt } from './escape.js';
import { findingPicture, pAxisFor, pOverviewChunks, pRowsOf, pStrip, resultRow, statisticRow, STRIP_WIDTH, type PAxis } from './pictures.js';
import { resultCount, resultsInReadingOrder, type AnyResult } from './readingOrder.js';
import { CAUTIONS, countRun, type RunReport } from './types.js';
import { joined, wholeText } from './chunks.js';
import { lineLabel, originalName, shortPlace } from './places.js';

export { escapeHtml };

/** Severity is told by shape and line style as well as colour (readable in print and without colour vision). */
const SEVERITY: Record<Level, { symbol: string; word: string }> = {
  error: { symbol: '▲', word: 'error' },
  warning: { symbol: '◆', word: 'warning' },
  note: { symbol: '●', word: 'note' },
};
const RANK: Record<Level, number> = { note: 1, warning: 2, error: 3 };

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
.manuscript.places .line { grid-template-columns: 7em minmax(0, 1fr); }
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
svg .refline { stroke: var(--ink); stroke-width: 1.5; }
svg .range { fill: #4d4d4d; } svg .range.fits { fill: #7da7c7; }
svg .reported { fill: var(--paper); stroke: var(--ink); stroke-width: 2; }
svg .reported.bound { fill: var(--ink); stroke-linejoin: round; }
svg .ci { fill: #c9d6e0; } svg .mid { fill: var(--ink); }
svg .estimate, svg .allowed { fill: var(--ink); } svg rect.allowed { fill: #7da7c7; }
svg .implied { fill: #4d4d4d; } svg .implied.loose { fill: #a6a6a6; }
svg .possible { fill: var(--ink); } svg .reported-range { fill: #e3a37f; stroke: var(--error); stroke-width: 1; }
svg .feasible { fill: #c9d6e0; } svg .implied-r { fill: #4d4d4d; }
svg a:hover rect.row { fill: #f0f0f0; }
svg.pstrip, svg.figure { max-width: 100%; height: auto; display: block; }
.picture { margin: 6px 0 2px; }
.figcap, .legend { font-size: 0.85em; color: var(--muted); margin: 2px 0 6px; max-width: 60em; }
table.checklist { border-collapse: collapse; width: 100%; font-size: 0.92em; }
table.checklist td, table.checklist th { border: 1px solid var(--rule); padding: 3px 8px; text-align: left; vertical-align: top; }
.st-found::before { content: "✓ "; } .st-missing::before { content: "✗ "; font-weight: 700; } .st-not-applicable::before { content: "– "; }
.st-missing { color: var(--error); }
.results-list { font-size: 0.92em; }
.results-list li { margin: 4px 0; }
.results-list .rrow { display: grid; grid-template-columns: minmax(0, 1fr) ${STRIP_WIDTH}px; gap: 12px; align-items: center; }
@media (max-width: 700px) { .results-list .rrow { grid-template-columns: 1fr; } }
@media print { .layout { grid-template-columns: 1fr; } details.card { page-break-inside: avoid; } a { color: inherit; } }
`;

/**
 * The start of a self-contained page, up to <body>: a policy that forbids every load (no script,
 * no request; styles inline, images as data), no referrer. The report and the corpus summary
 * share it, so the policy is written once.
 */
export function pageStart(title: string, css: string): string {
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'">
<meta name="referrer" content="no-referrer">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>${css}</style>
</head>
<body>
`;
}

/** The HTML report for a whole run. */
export function formatHtml(run: RunReport, options: { title?: string } = {}): string {
  return wholeText(formatHtmlChunks(run, options));
}

/**
 * The same text as formatHtml, piece by piece in order: the command line writes these, since the
 * report of some 110,000 results is longer than any one string can be.
 */
export function* formatHtmlChunks(run: RunReport, options: { title?: string } = {}): Generator<string> {
  const title = options.title ?? `plumbline report: ${run.files.map((f) => f.path).join(', ') || 'no files'}`;
  // every p picture of the report on one axis, so they can be compared across files too
  const pAxis = pAxisFor(run.files.flatMap((f) => pRowsOf(f.results, f.statistics).map((x) => x.row)));
  yield pageStart(title, REPORT_CSS);
  yield* joined([
    '<header class="top">',
    `<h1>${escapeHtml(title)}</h1>`,
    `<p>${escapeHtml(run.tool.name)} ${escapeHtml(run.tool.version)} checked the tests these manuscripts report: each p against its t and df (or its F, χ², r or z), and each test against the descriptives, intervals and effect sizes beside it, allowing for rounding.</p>`,
    summaryTable(run),
    cautionsHtml(),
    '</header>',
    ...run.files.map((f, i) => fileSectionChunks(f, i, pAxis)),
    failuresHtml(run),
    // only when a walk skipped some, so a report without them is as it was
    ...(run.skippedLinks !== undefined && run.skippedLinks.length > 0 ? [skippedLinksHtml(run.skippedLinks)] : []),
    `<footer>${cautionsHtml()}</footer>`,
  ], '\n');
  yield `
</body>
</html>
`;
}

/** The symbolic links a folder walk did not follow, each named (escaped), the reason said once. */
function* skippedLinksHtml(links: readonly string[]): Generator<string> {
  yield `<section class="failures"><h2>Links not followed</h2><p>These symbolic links lead outside the folder walked and were not read (<code>--follow-links-outside</code> follows them):</p><ul>`;
  for (const link of links) yield `<li><strong>${escapeHtml(link)}</strong></li>`;
  yield '</ul></section>';
}

/** The files not checked, one item each; nothing when every file was checked. */
function* failuresHtml(run: RunReport): Generator<string> {
  if (run.failures.length === 0) return;
  yield '<section class="failures"><h2>Not checked</h2><ul>';
  for (const f of run.failures) yield `<li><strong>${escapeHtml(f.path)}${f.line !== undefined ? `:${f.line}${f.column !== undefined ? `:${f.column}` : ''}` : ''}</strong>: ${escapeHtml(f.message)}</li>`;
  yield '</ul></section>';
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
${row('Results with p recomputed', c.checked)}${c.statistics > 0 ? `\n${row('F, χ², r and z results found', c.statistics)}\n${row('F, χ², r and z results with p recomputed', c.statisticsChecked)}` : ''}
${row('Recomputed and not flagged', consistent)}
${row(`<span class="sym">${SEVERITY.error.symbol}</span> Errors`, c.error, 'lvl-error')}
${row(`<span class="sym">${SEVERITY.warning.symbol}</span> Warnings`, c.warning, 'lvl-warning')}
${row(`<span class="sym">${SEVERITY.note.symbol}</span> Notes`, c.note, 'lvl-note')}${c.hiddenByQuiet > 0 ? `\n${row('Hidden by quiet comments', c.hiddenByQuiet)}` : ''}${c.hiddenByBaseline > 0 ? `\n${row('Hidden by the baseline', c.hiddenByBaseline)}` : ''}
</table>`;
}

/**
 * One file: the overview plot, the text with its marks beside the cards, the results, the
 * checklist. Its p pictures use `pAxis` (the whole report's), or the file's own when alone.
 */
export function fileSection(file: FileReport, index: number, pAxis: PAxis = pAxisFor(pRowsOf(file.results, file.statistics).map((x) => x.row))): string {
  return wholeText(fileSectionChunks(file, index, pAxis));
}

/** The same text as fileSection, piece by piece in order. */
export function* fileSectionChunks(file: FileReport, index: number, pAxis: PAxis = pAxisFor(pRowsOf(file.results, file.statistics).map((x) => x.row))): Generator<string> {
  // the checklist's missing entries are summarised in its table, once per item, not as cards
  const ordered = file.findings.filter((f) => !isChecklistFinding(file, f)).sort((a, b) => a.span.start - b.span.start);
  const byResult = new Map<string, Finding[]>();
  for (const f of ordered) {
    if (f.resultId === undefined) continue;
    const list = byResult.get(f.resultId);
    if (list) list.push(f);
    else byResult.set(f.resultId, [f]);
  }
  const summarised = file.findings.length - ordered.length;
  yield* joined([
    `<section class="file" id="${anchor(index, 'file', 0)}">`,
    `<h2>${escapeHtml(file.path)}</h2>`,
    `<p>${foundText(file)}, ${ordered.length} finding${ordered.length === 1 ? '' : 's'}${summarised > 0 ? ` (and ${summarised} checklist entr${summarised === 1 ? 'y' : 'ies'}, summarised in the checklist below)` : ''}. Alpha ${escapeHtml(String(file.alpha.value))}, ${escapeHtml(file.sidedness.value)}-tailed where the text says nothing.</p>`,
    pRowsOf(file.results, file.statistics).length > 0 ? joined(['<h3>All tests in reading order</h3>', forestPlot(file, index, pAxis, byResult)], '') : '',
    '<div class="layout">',
    joined(['<div><h3>Manuscript</h3>', manuscriptHtml(file, index, ordered), '</div>'], ''),
    joined(['<div><h3>Findings</h3><div class="cards">', ordered.length === 0 ? '<p>No findings.</p>' : joined(mapped(ordered, (f, n) => card(file, index, f, n, pAxis)), '\n'), '</div></div>'], ''),
    '</div>',
    resultCount(file) > 0 ? joined(['<h3>Results</h3><ol class="results-list">', mapped(resultsInReadingOrder(file), (r) => resultItem(index, r, pAxis, byResult.get(r.record.id) ?? [])), '</ol>'], '') : '',
    file.checklist.length > 0 ? `<h3>Reporting checklist</h3>${checklistTable(file, index)}` : '',
    '</section>',
  ], '\n');
}

/** "3 results found", or, with F, χ², r or z results, "2 t-test results and 1 F, χ², r or z result found". */
function foundText(file: FileReport): string {
  const t = file.results.length;
  const others = file.statistics?.length ?? 0;
  if (others === 0) return `${t} result${t === 1 ? '' : 's'} found`;
  return `${t} t-test result${t === 1 ? '' : 's'} and ${others} F, χ², r or z result${others === 1 ? '' : 's'} found`;
}

/** Each item made into its text when it is reached, not all at once. */
function* mapped<T>(items: readonly T[], make: (item: T, n: number) => string): Generator<string> {
  for (let n = 0; n < items.length; n++) yield make(items[n] as T, n);
}

/** The source, line by line, with results (t, F, χ², r and z) shaded and flagged spans marked by severity. */
function* manuscriptHtml(file: FileReport, index: number, ordered: Finding[]): Generator<string> {
  const src = file.source;
  const cuts = new Set<number>([0, src.length]);
  for (let i = src.indexOf('\n'); i >= 0; i = src.indexOf('\n', i + 1)) cuts.add(i + 1);
  // a finding said of the whole document marks no characters
  const marks = ordered.flatMap((f, n) => (f.scope === 'document' ? [] : [{ start: f.span.start, end: Math.max(f.span.end, f.span.start), n, level: f.level }]));
  for (const m of marks) cuts.add(m.start).add(m.end);
  // every result is shaded, t-tests and F, χ², r and z alike
  const shaded = [...file.results, ...(file.statistics ?? [])];
  for (const r of shaded) cuts.add(r.span.start).add(r.span.end);
  const points = [...cuts].filter((x) => x >= 0 && x <= src.length).sort((a, b) => a - b);
  yield file.original ? '<div class="manuscript places">' : '<div class="manuscript">';
  // a Word or PDF file's lines of extracted text are labelled by the paragraph or printed line they start
  const labels = new Map<number, string>();
  for (const u of file.original?.lines ?? []) if (!labels.has(u.at)) labels.set(u.at, lineLabel(u));
  const gutter = (n: number) => (file.original ? escapeHtml(labels.get(n) ?? '') : String(n));
  let line = 1;
  let current = `<div class="line" id="${anchor(index, 'L', 1)}"><span class="ln">${gutter(1)}</span><span class="tx">`;
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
  for (const r of shaded) {
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
      yield `${line > 1 ? '\n' : ''}${current}</span></div>`;
      line += 1;
      current = `<div class="line" id="${anchor(index, 'L', line)}"><span class="ln">${gutter(line)}</span><span class="tx">`;
    }
  }
  // a final line end does not start a line of its own
  if (!(src.endsWith('\n') && current.endsWith('<span class="tx">'))) yield `${line > 1 ? '\n' : ''}${current}</span></div>`;
  yield '</div>';
}

function card(file: FileReport, index: number, f: Finding, n: number, pAxis: PAxis): string {
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
    // each amount in the same unit as the one it is set against: the value's own, then the last
    // printed digit's (rounding allows half a unit, roundingAllowance)
    const digits = g.lastDigitUnits !== undefined ? ` (${showLastDigitUnits(g.lastDigitUnits)} units of the last printed digit)` : '';
    const allowance = g.roundingAllowance !== undefined ? `; rounding allows ${fmt(g.roundingAllowance)}${g.lastDigitUnits !== undefined ? ' (0.5 units)' : ''}` : '';
    rows.push(`<dt>Difference</dt><dd>${fmt(g.absolute)}${digits}${allowance}</dd>`);
  }
  rows.push(`<dt>What to check</dt><dd>${escapeHtml(f.check)}</dd>`);
  for (const r of f.related ?? []) rows.push(`<dt>See also</dt><dd><a href="#${anchor(index, 'L', r.start.line)}">${escapeHtml(shortPlace(r))}</a>: ${escapeHtml(r.message)}</dd>`);
  const result = f.resultId ? (file.results.find((r) => r.id === f.resultId) ?? file.statistics?.find((s) => s.id === f.resultId)) : undefined;
  const picture = findingPicture(f, result, pAxis);
  return `<details class="card lvl-${f.level}" id="${anchor(index, 'card', n)}" data-card="${n}" open>
<summary><span class="sym" aria-hidden="true">${s.symbol}</span> ${s.word} · ${escapeHtml(f.ruleId)} ${f.scope === 'document' ? '<span class="where">the whole document</span>' : `<a class="where" href="#${anchor(index, 'L', f.start.line)}">${f.original ? escapeHtml(originalName(f.original)) : `line ${f.start.line}, column ${f.start.column}`}</a>`}</summary>
<p>${escapeHtml(f.message)}</p>
<dl>${rows.join('')}</dl>${picture}
</details>`;
}

/** A results-list entry's anchor: `r` and the place in the t results, `s` and the place in the F, χ², r and z results. */
const resultAnchor = (index: number, source: 'result' | 'statistic', n: number) => anchor(index, source === 'result' ? 'r' : 's', n);

/** One entry of the results list, a t-test or an F, χ², r or z: its line, its text, its status and its p strip. */
function resultItem(index: number, item: AnyResult, pAxis: PAxis, flagged: Finding[]): string {
  const r = item.record;
  const worst = worstLevel(flagged);
  const status = worst ? `<span class="lvl-${worst}"><span class="sym">${SEVERITY[worst].symbol}</span> ${flagged.length} finding${flagged.length === 1 ? '' : 's'}</span>` : r.recomputed ? 'no finding' : 'not recomputed';
  const row = item.kind === 't' ? resultRow(item.record) : statisticRow(item.record);
  // the strip in a column of its own, so strips line up down the list on the shared axis
  return `<li id="${resultAnchor(index, item.kind === 't' ? 'result' : 'statistic', item.n)}"><div class="rrow"><span><a href="#${anchor(index, 'L', r.start.line)}">${escapeHtml(shortPlace(r))}</a>: <code>${escapeHtml(r.printed)}</code> — ${status}</span><span class="pic">${row ? pStrip(row, pAxis) : ''}</span></div></li>`;
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
      ? [`<tr><td>${escapeHtml(s.record.item)}</td><td class="st-${s.status}">${s.status.replace('-', ' ')}</td><td>${escapeHtml(s.detail)}${s.line !== undefined ? ` (${byLine(s.line, s.where ?? `line ${s.line}`)})` : ''}</td><td>${guideline(s)}</td></tr>`]
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
    perResult.length > 0 && resultCount(file) > 0 ? `<p><strong>Each result</strong></p><table class="checklist">${head('Met', 'Missing for')}<tbody>${perResult.join('')}</tbody></table>` : '',
  ].join('');
}

/** Each place a link to its line: "line 19", "Table 1, row 'Eye strain'". */
function placeLinks(places: readonly MissingPlace[], link: (line: number, text: string) => string): string {
  const seen = new Map<string, { line: number; n: number }>();
  for (const p of places) {
    const at = p.where ?? `line ${p.line}`;
    const text = p.table ? `${p.table.name}, ${p.table.row ? `row '${p.table.row}'` : at}` : `${at}${p.printed ? ` (${p.printed})` : ''}`;
    const had = seen.get(text);
    if (had) had.n += 1;
    else seen.set(text, { line: p.line, n: 1 });
  }
  return [...seen].map(([text, { line, n }]) => `${link(line, text)}${n > 1 ? ` (${n} results)` : ''}`).join(', ');
}

/** The overview of every drawable p in the file (t, F, χ², r and z), in reading order, on the report's p axis. */
function forestPlot(file: FileReport, index: number, pAxis: PAxis, byResult: Map<string, Finding[]>): Iterable<string> {
  const statistics = file.statistics ?? [];
  return pOverviewChunks(
    pRowsOf(file.results, statistics),
    pAxis,
    // each row links to its entry in the results list
    (item) => resultAnchor(index, item.source, item.n),
    (item) => {
      const id = item.source === 'result' ? file.results[item.n]?.id : statistics[item.n]?.id;
      const worst = worstLevel(id === undefined ? [] : byResult.get(id) ?? []);
      return worst ? { symbol: SEVERITY[worst].symbol, level: worst } : undefined;
    },
  );
}

