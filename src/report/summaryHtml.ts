/**
 * The corpus summary (src/corpus/summary.ts) as one self-contained HTML page, in the HTML report's
 * style: its CSS inline, SVG bar charts, no script, and a Content-Security-Policy that forbids every
 * network load. Layout only: bar lengths are the summary's counts and rates scaled to pixels.
 */
import type { CorpusSummary } from '../corpus/summary.js';
import { cautionsHtml, pageStart, REPORT_CSS } from './html.js';
import { escapeHtml, shortNumber } from './escape.js';
import { labelWidth } from './pictures.js';
import { binLabel } from './summaryCsv.js';

const SUMMARY_CSS = `
section.corpus { max-width: 1200px; margin: 0 auto; padding: 12px 20px; }
svg.bars { max-width: 100%; height: auto; display: block; }
svg.bars .bar { fill: #4d4d4d; } svg.bars .bar.flag { fill: var(--error); }
table.summary td.name, table.summary th.name { text-align: left; }
`;

interface Bar {
  label: string;
  value: number;
  /** The value as people read it beside the bar. */
  shown: string;
  title: string;
}

/** A horizontal bar chart: one labelled bar per entry, scaled to the largest value. */
function barChart(aria: string, bars: Bar[]): string {
  if (bars.length === 0) return '<p class="figcap">Nothing to plot.</p>';
  const labelPx = Math.min(320, Math.max(...bars.map((b) => labelWidth(b.label))) + 12);
  const plot = 360;
  const valuePx = 80;
  const rowH = 20;
  const width = labelPx + plot + valuePx;
  const height = bars.length * rowH + 8;
  let max = 0;
  for (const b of bars) if (b.value > max) max = b.value;
  const rows = bars.map((b, i) => {
    const y = 4 + i * rowH;
    const w = max > 0 ? (b.value / max) * plot : 0;
    return `<g><title>${escapeHtml(b.title)}</title><text x="${labelPx - 8}" y="${y + 14}" text-anchor="end">${escapeHtml(b.label)}</text><rect class="bar" x="${labelPx}" y="${y + 3}" width="${w.toFixed(1)}" height="${rowH - 6}"/><text x="${(labelPx + w + 6).toFixed(1)}" y="${y + 14}">${escapeHtml(b.shown)}</text></g>`;
  });
  return `<svg class="bars" role="img" aria-label="${escapeHtml(aria)}" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}">${rows.join('')}</svg>`;
}

const countBinLabel = (low: number, high: number | null) => (high === null ? `${low} or more` : low === high ? String(low) : `${low} to ${high}`);

/** The summary page. `source` names the results file(s) in the title. */
export function formatSummaryHtml(s: CorpusSummary, source: string): string {
  const title = `plumbline corpus summary: ${source}`;
  const row = (label: string, value: number | string) => `<tr><th>${escapeHtml(label)}</th><td>${escapeHtml(String(value))}</td></tr>`;
  const totals = `<table class="summary" aria-label="corpus totals">
${row('Lines read', s.lines)}
${row('Documents checked', s.checked)}
${row('Documents not checked', s.notChecked)}${s.unreadable.length > 0 ? `\n${row('Lines that are not batch output', s.unreadable.length)}` : ''}
${row('Results found', s.results)}
${row('Findings', s.findings)}
${row('Errors', s.byLevel.error)}
${row('Warnings', s.byLevel.warning)}
${row('Notes', s.byLevel.note)}
${row('Documents with an error or warning', s.documentsFlagged)}
</table>`;
  const rates = barChart(
    'findings per 100 results, by rule',
    s.rules.map((r) => ({
      label: r.ruleId,
      value: r.per100Results ?? 0,
      shown: r.per100Results === null ? 'no results' : shortNumber(r.per100Results),
      title: `${r.ruleId}: ${r.findings} findings (${r.byLevel.error} errors, ${r.byLevel.warning} warnings, ${r.byLevel.note} notes) in ${r.documents} documents`,
    })),
  );
  const ruleTable = `<table class="summary" aria-label="findings by rule">
<tr><th class="name">Rule</th><th>Findings</th><th>Errors</th><th>Warnings</th><th>Notes</th><th>Documents</th><th>Per 100 results</th></tr>
${s.rules.map((r) => `<tr><td class="name">${escapeHtml(r.ruleId)}</td><td>${r.findings}</td><td>${r.byLevel.error}</td><td>${r.byLevel.warning}</td><td>${r.byLevel.note}</td><td>${r.documents}</td><td>${r.per100Results === null ? '–' : escapeHtml(shortNumber(r.per100Results))}</td></tr>`).join('\n')}
</table>`;
  const gapChart = barChart(
    'gaps in units of the last printed digit, all rules',
    s.gapBins.map((b, i) => ({ label: binLabel(b), value: s.gapTotals[i] ?? 0, shown: String(s.gapTotals[i] ?? 0), title: `${s.gapTotals[i] ?? 0} findings with a gap of ${binLabel(b)} last-digit units` })),
  );
  const gapTable = `<table class="summary" aria-label="gaps by rule">
<tr><th class="name">Rule</th>${s.gapBins.map((b) => `<th>${escapeHtml(binLabel(b))}</th>`).join('')}<th>No gap in digit units</th></tr>
${s.gaps.map((g) => `<tr><td class="name">${escapeHtml(g.ruleId)}</td>${g.counts.map((c) => `<td>${c}</td>`).join('')}<td>${g.withoutUnits}</td></tr>`).join('\n')}
</table>`;
  const perDocument = barChart(
    'documents by number of findings',
    s.findingsPerDocument.map((b) => ({ label: `${countBinLabel(b.low, b.high)} findings`, value: b.documents, shown: String(b.documents), title: `${b.documents} documents with ${countBinLabel(b.low, b.high)} findings` })),
  );
  const body = [
    '<header class="top">',
    `<h1>${escapeHtml(title)}</h1>`,
    '<p>What plumbline found over a corpus checked with <code>plumbline batch</code>: how many results and findings each document has, how often each rule speaks per 100 results, and how far the reported numbers are from what they were recomputed to be.</p>',
    totals,
    cautionsHtml(),
    '<p class="legend">A rate counts every finding of a rule, notes included (a note is often a result that could not be checked with certainty), against every result of every document checked. Documents that could not be checked are left out of the rates.</p>',
    '</header>',
    '<section class="corpus"><h2>Findings per 100 results, by rule</h2>',
    rates,
    ruleTable,
    '</section>',
    '<section class="corpus"><h2>Gaps</h2>',
    '<p class="legend">The distance from each reported value to the nearest value recomputed from the numbers beside it, in units of the last digit printed (a gap of 3 on p = .04 is 0.03); rounding alone allows about half a unit. Findings of a missing item or of a count carry no such gap.</p>',
    gapChart,
    gapTable,
    '</section>',
    '<section class="corpus"><h2>Findings per document</h2>',
    perDocument,
    '<p class="figcap">Each document’s own counts are in the CSV: <code>plumbline summarize --table documents</code>.</p>',
    '</section>',
    `<footer>${cautionsHtml()}</footer>`,
  ].join('\n');
  return `${pageStart(title, `${REPORT_CSS}${SUMMARY_CSS}`)}${body}
</body>
</html>
`;
}
