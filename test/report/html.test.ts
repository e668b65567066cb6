/**
 * The HTML report without a browser: self-contained, escaped, one card and one highlight per
 * finding. (The same report is opened in chromium by test/browser.) The escaping rules are
 * those of the HTML standard for text and attribute values, common practice, no source.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { escapeHtml, formatHtml } from '../../src/report/index.js';
import { CAUTIONS, type RunReport } from '../../src/report/types.js';
import { isChecklistFinding } from '../../src/report/checklistSummary.js';

const runOf = (path: string, text = readFileSync(path, 'utf8'), checklist = true): RunReport => ({
  tool: { name: 'plumbline', version: '0.0.0' },
  files: [checkSource(path, text, { checklist })],
  failures: [{ path: 'gone.md', message: 'no such <file>' }],
  rules: [],
});

const OWN_TAGS = new Set(['body', 'header', 'h1', 'h2', 'h3', 'p', 'table', 'tr', 'th', 'td', 'thead', 'tbody', 'span', 'div', 'section', 'footer', 'ul', 'ol', 'li', 'strong', 'code', 'a', 'mark', 'details', 'summary', 'dl', 'dt', 'dd', 'svg', 'line', 'text', 'rect', 'circle', 'path', 'title']);

describe('the HTML report', () => {
  it('escapes the five special characters and drops control characters', () => {
    expect(escapeHtml(`<a href="x" title='y'>&</a>\u0007\u001b[31m`)).toBe('&lt;a href=&quot;x&quot; title=&#39;y&#39;&gt;&amp;&lt;/a&gt;[31m');
  });

  it('is one file that loads nothing: a policy forbidding network loads, no script, no external reference', () => {
    const html = formatHtml(runOf('fixtures/demo/standing-desks.md'));
    expect(html).toContain(`<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'`);
    expect(html).not.toMatch(/<script|<link|<img|<iframe|\bsrc=|url\(/i);
    expect(html).not.toMatch(/https?:\/\//);
  });

  it('has one card and one highlight per finding (checklist entries summarised in the checklist table instead), the summary, the cautions and the failures', () => {
    const run = runOf('fixtures/demo/standing-desks.md');
    const html = formatHtml(run);
    const file = run.files[0]!;
    const findings = file.findings.filter((f) => !isChecklistFinding(file, f)).length;
    expect(findings).toBeGreaterThan(3);
    expect(findings).toBeLessThan(file.findings.length);
    expect(html.match(/<details class="card /g)?.length).toBe(findings);
    expect(new Set([...html.matchAll(/data-finding="(\d+)"/g)].map((m) => m[1])).size).toBe(findings);
    for (const c of CAUTIONS) expect(html).toContain(escapeHtml(c));
    expect(html).toContain('no such &lt;file&gt;');
    expect(html).toMatch(/<svg class="forest"/);
    expect(html).toContain('<table class="checklist">');
  });

  it('shows manuscript markup as text: no payload of the hostile manuscript survives as a tag or attribute', () => {
    const html = formatHtml(runOf('test/fixtures/hostile/xss.md'));
    const body = html.slice(html.indexOf('<body>'));
    expect(body).not.toMatch(/<(script|img|svg on|iframe|object|embed|form|input|base|link|meta|video|audio|marquee|template|noscript|details open ontoggle|math)[\s>/]/i);
    // every tag in the body is one the report writes itself
    const tags = new Set([...body.matchAll(/<([a-zA-Z][a-zA-Z0-9]*)/g)].map((m) => m[1]!.toLowerCase()));
    expect([...tags].filter((t) => !OWN_TAGS.has(t))).toEqual([]);
    expect(body).not.toMatch(/href="javascript:/i);
    expect(body).toContain('&lt;script&gt;window.__pwned = 1&lt;/script&gt;');
    expect(body).not.toContain('\u001b');
  });

  it('keeps every line of the manuscript, numbered, with CRLF line ends and a BOM handled', () => {
    const text = '\uFEFFFirst line.\r\nFatigue fell, t(23) = 2.47, p = .21.\r\n';
    const html = formatHtml(runOf('crlf.md', text, false));
    expect(html).not.toContain('<span class="ln">3</span>');
    expect(html).toContain('<span class="ln">2</span>');
    expect(html).not.toContain('\r');
    expect(html).not.toContain('\uFEFF');
    expect(html).toMatch(/<mark class="flag lvl-error" data-finding="\d+"><a href="#f0-card-\d+"[^>]*><span class="result">t\(23\) = 2\.47, p = \.21/);
  });
});

describe('the overview draws every p in reading order, whatever its test', () => {
  it('t, F, χ², r and z rows in the order they are printed, each with its reported p and recomputed range', () => {
    // invented text; each p follows from its statistic (scipy.stats t.sf, f.sf, chi2.sf, norm.sf)
    const text = 'Groups differed, F(1, 38) = 4.21, p = .047. Recall improved, t(28) = 2.10, p = .045. The scores correlated, r(48) = .32, p = .02, and the indirect effect held, z = 2.31, p = .021; choices differed, χ²(2, N = 120) = 6.1, p = .047.\n';
    const html = formatHtml(runOf('o.md', text, false));
    const overview = /<svg class="forest"[\s\S]*?<\/svg>/.exec(html)?.[0] ?? '';
    const labels = [...overview.matchAll(/<text class="rowlabel"[^>]*>([^<]*)<\/text>/g)].map((m) => (m[1] as string).replace(/^L\d+ /, '').slice(0, 1));
    expect(labels).toEqual(['F', 't', 'r', 'z', 'χ']);
    expect(overview.match(/class="reported"/g)?.length).toBe(5);
    expect(overview).toContain('recomputed p (upper tail of F)');
  });
});

describe('the results list holds every result, whatever its test, in reading order', () => {
  // invented text; the p of F(1, 38) = 4.21 is .0470 to .0472 (scipy.stats.f.sf), of t(28) = 2.10 .0444 to .0453
  // (scipy.stats.t.sf), of χ²(2) = 6.1 .0462 to .0486 (scipy.stats.chi2.sf), of r(48) = .32 .0213 to .0259 two-tailed
  // (scipy.stats.t.sf with t = r√(df/(1 − r²))); z = 3.10 gives two-tailed .0019 (scipy.stats.norm.sf), so p = .02 is flagged
  const text = 'Groups differed, F(1, 38) = 4.21, p = .047. Recall improved, t(28) = 2.10, p = .045. The scores correlated, r(48) = .32, p = .02, and the indirect effect held, z = 3.10, p = .02; choices differed, χ²(2, N = 120) = 6.1, p = .047.\n';
  const html = formatHtml(runOf('o.md', text, false));
  const list = /<ol class="results-list">([\s\S]*?)<\/ol>/.exec(html)?.[1] ?? '';
  const items = [...list.matchAll(/<li id="([^"]+)">([\s\S]*?)<\/li>/g)];

  it('one entry per result, t, F, χ², r and z, in the order they are printed, each with its status and p strip', () => {
    const printed = items.map((m) => /<code>([^<]*)<\/code>/.exec(m[2] as string)?.[1]?.slice(0, 1));
    expect(printed).toEqual(['F', 't', 'r', 'z', 'χ']);
    expect(items.map((m) => m[1])).toEqual(['f0-s-0', 'f0-r-0', 'f0-s-1', 'f0-s-2', 'f0-s-3']);
    for (const m of items) expect(m[2]).toMatch(/<svg class="pstrip"/);
    // the z's p is flagged (p-follows-from-z); its entry counts its finding, the others have none
    items.forEach((m, i) => {
      if (i === 3) expect(m[2]).toMatch(/ — <span class="lvl-(?:error|warning)"><span class="sym">[^<]*<\/span> 1 finding<\/span>/);
      else expect(m[2]).toContain(' — no finding');
    });
    expect(html).toContain('1 t-test result and 4 F, χ², r or z results found');
  });

  it('the manuscript shades every result, F, χ², r and z as well as t', () => {
    const manuscript = /<div class="manuscript">[\s\S]*?<\/div>\n?<\/div>/.exec(html)?.[0] ?? html;
    const shaded = [...manuscript.matchAll(/<span class="result">([^<]*)/g)].map((m) => (m[1] as string).slice(0, 1));
    expect(shaded).toEqual(['F', 't', 'r', 'z', 'χ']);
  });

  it('the overview links each row to its entry in the list, and every link lands on an element of the page', () => {
    const overview = /<svg class="forest"[\s\S]*?<\/svg>/.exec(html)?.[0] ?? '';
    const targets = [...overview.matchAll(/href="#([^"]+)"/g)].map((m) => m[1]);
    expect(targets).toEqual(['f0-s-0', 'f0-r-0', 'f0-s-1', 'f0-s-2', 'f0-s-3']);
    for (const t of targets) expect(html).toContain(`id="${t}"`);
    expect(html).not.toMatch(/<script/i);
  });
});
