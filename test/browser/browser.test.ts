/**
 * The HTML report and the browser page in a real browser: Debian's chromium driven by
 * playwright-core (never a browser download). Asserted: the expected number of highlights and
 * cards for the invented demo manuscripts, no console errors, no network request at all, and a
 * manuscript of 36 script-injection payloads runs nothing. Screenshots go to test-output/ for
 * people to look at. Skipped when chromium is absent, unless PLUMBLINE_REQUIRE_BROWSER=1
 * (set by .ci/run, which installs it).
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { Readable } from 'node:stream';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/run.js';
import { checkSource, RULES } from '../../src/engine/index.js';
import { readPdf } from '../../src/parse/pdf/index.js';
import { isChecklistFinding } from '../../src/report/checklistSummary.js';

const CHROMIUM = '/usr/bin/chromium';
const required = process.env.PLUMBLINE_REQUIRE_BROWSER === '1';
const available = existsSync(CHROMIUM);
if (required && !available) throw new Error(`PLUMBLINE_REQUIRE_BROWSER=1 but ${CHROMIUM} is missing`);
const OUT = resolve('test-output/browser');
const PAGE = resolve('dist/web/index.html');

async function report(args: string[]): Promise<string> {
  let out = '';
  await run([...args, '--format', 'html'], { stdout: (s) => void (out += s), stderr: () => {}, stdin: Readable.from(['']), cwd: process.cwd(), env: {}, isTTY: false });
  return out;
}

interface Watch {
  page: Page;
  errors: string[];
  requests: string[];
  dialogs: string[];
}

describe.skipIf(!available)('in chromium', () => {
  let browser: Browser;
  beforeAll(async () => {
    mkdirSync(OUT, { recursive: true });
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
  });

  /** A page that records console errors, page errors, dialogs and every request but the document itself. */
  async function open(url: string): Promise<Watch> {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    const w: Watch = { page, errors: [], requests: [], dialogs: [] };
    page.on('console', (m) => {
      if (m.type() === 'error') w.errors.push(m.text());
    });
    page.on('pageerror', (e) => w.errors.push(e.message));
    page.on('dialog', (d) => {
      w.dialogs.push(d.message());
      void d.dismiss();
    });
    page.on('request', (r) => {
      if (r.url() !== url) w.requests.push(r.url());
    });
    await page.goto(url);
    return w;
  }

  const counts = (page: Page) =>
    page.evaluate(() => ({
      cards: document.querySelectorAll('details.card').length,
      highlights: new Set([...document.querySelectorAll('mark.flag[data-finding]')].map((m) => m.getAttribute('data-finding'))).size,
      results: document.querySelectorAll('.results-list > li').length,
      forestRows: document.querySelectorAll('svg.forest a').length,
      strips: document.querySelectorAll('svg.pstrip').length,
      pwned: (window as unknown as { __pwned?: unknown }).__pwned ?? null,
    }));

  it('the report for the demo manuscript shows one highlight and one card per finding, and the plots', async () => {
    const file = 'fixtures/demo/standing-desks.md';
    const expected = checkSource(file, readFileSync(file, 'utf8'));
    const html = await report([file]);
    writeFileSync(resolve(OUT, 'report.html'), html);
    const url = pathToFileURL(resolve(OUT, 'report.html')).href;
    const w = await open(url);
    const c = await counts(w.page);
    expect(c.cards).toBe(expected.findings.length);
    expect(c.highlights).toBe(expected.findings.length);
    // the results list holds the t results and the F, χ², r and z results
    expect(c.results).toBe(expected.results.length + (expected.statistics?.length ?? 0));
    expect(c.forestRows).toBe(expected.results.filter((r) => r.recomputed && r.p?.number).length);
    expect(c.forestRows).toBeGreaterThan(5);
    // the cautions are in the report
    expect(await w.page.textContent('body')).toContain('not proof of error or misconduct');
    await w.page.screenshot({ path: resolve(OUT, 'report.png'), fullPage: true });
    expect(w.errors).toEqual([]);
    expect(w.requests).toEqual([]);
    await w.page.close();
  }, 60_000);

  it('the pictures, measured by the browser: labels inside their picture, the recomputed p range clear of the reported marker', async () => {
    const html = await report(['test/fixtures/pictures/p-values.md', 'test/fixtures/pictures/other-quantities.md', 'fixtures/demo/hand-hygiene.md']);
    writeFileSync(resolve(OUT, 'report-pictures.html'), html);
    const url = pathToFileURL(resolve(OUT, 'report-pictures.html')).href;
    const w = await open(url);
    const measured = await w.page.evaluate(() => {
      const out: { pictures: number; outside: string[]; covered: string[]; crowded: string[] } = { pictures: 0, outside: [], covered: [], crowded: [] };
      for (const svg of document.querySelectorAll<SVGSVGElement>('svg.pstrip, svg.forest, svg.figure')) {
        out.pictures += 1;
        const vb = svg.viewBox.baseVal;
        const ticks: DOMRect[] = [];
        for (const t of svg.querySelectorAll<SVGTextElement>('text')) {
          const b = t.getBBox();
          if (b.x < vb.x || b.y < vb.y || b.x + b.width > vb.x + vb.width || b.y + b.height > vb.y + vb.height) out.outside.push(`${t.textContent} in ${svg.getAttribute('aria-label')}`);
          if (t.classList.contains('tick')) ticks.push(b);
        }
        ticks.sort((a, b) => a.x - b.x);
        for (let i = 1; i < ticks.length; i++) if (ticks[i]!.x < ticks[i - 1]!.x + ticks[i - 1]!.width) out.crowded.push(`${svg.getAttribute('aria-label')}`);
        // each strip (and each overview row) holds one range bar and one reported marker
        const groups = svg.classList.contains('forest') ? [...svg.querySelectorAll('a')] : svg.classList.contains('pstrip') ? [svg] : [];
        for (const g of groups) {
          const range = g.querySelector<SVGGraphicsElement>('rect.range')?.getBBox();
          const marker = g.querySelector<SVGGraphicsElement>('.reported')?.getBBox();
          if (!range || !marker || range.width <= 0) out.covered.push(`missing in ${svg.getAttribute('aria-label')}`);
          else if (range.x < marker.x + marker.width && marker.x < range.x + range.width && range.y < marker.y + marker.height && marker.y < range.y + range.height) out.covered.push(`${svg.getAttribute('aria-label')}`);
        }
      }
      return out;
    });
    expect(measured.pictures).toBeGreaterThan(20);
    expect(measured.outside).toEqual([]);
    expect(measured.crowded).toEqual([]);
    expect(measured.covered).toEqual([]);
    await w.page.screenshot({ path: resolve(OUT, 'report-pictures.png'), fullPage: true });
    expect(w.errors).toEqual([]);
    expect(w.requests).toEqual([]);
    await w.page.close();
  }, 60_000);

  it('control: the detector sees a payload that does run (unescaped, without the policy)', async () => {
    const w = await open('about:blank');
    await w.page.setContent('<img src="data:," onerror="window.__pwned = 1"><p>x</p>');
    await w.page.waitForFunction(() => (window as unknown as { __pwned?: unknown }).__pwned === 1, undefined, { timeout: 5_000 });
    expect((await counts(w.page)).pwned).toBe(1);
    await w.page.close();
  }, 60_000);

  it('the report on a manuscript of script-injection payloads runs nothing and loads nothing', async () => {
    const html = await report(['test/fixtures/hostile/xss.md']);
    writeFileSync(resolve(OUT, 'report-xss.html'), html);
    const url = pathToFileURL(resolve(OUT, 'report-xss.html')).href;
    const w = await open(url);
    // give handlers a chance to fire: hover and click every mark, focus every element
    await w.page.mouse.move(300, 300);
    for (const m of await w.page.$$('mark.flag a')) await m.hover().catch(() => {});
    await w.page.waitForTimeout(300);
    const c = await counts(w.page);
    expect(c.pwned).toBeNull();
    expect(w.dialogs).toEqual([]);
    expect(w.requests).toEqual([]);
    // the payloads are shown as text, not parsed: no element the manuscript named exists
    expect(await w.page.evaluate(() => document.querySelectorAll('iframe, object, embed, img, video, audio, form, input, base, link, meta[http-equiv=refresh], marquee, template, script').length)).toBe(0);
    expect(await w.page.textContent('.manuscript')).toContain('<script>window.__pwned = 1</script>');
    await w.page.screenshot({ path: resolve(OUT, 'report-xss.png'), fullPage: false });
    expect(w.errors).toEqual([]);
    await w.page.close();
  }, 60_000);

  it('the page checks pasted text in the tab: the same findings, the options apply, no request', async () => {
    expect(existsSync(PAGE), 'dist/web/index.html is built by npm run build').toBe(true);
    const url = pathToFileURL(PAGE).href;
    const w = await open(url);
    const file = 'fixtures/demo/hand-hygiene.md';
    const text = readFileSync(file, 'utf8');
    await w.page.fill('#manuscript', text);
    const plain = checkSource('manuscript.md', text, { checklist: false, config: { guidelines: 'all' } });
    await w.page.waitForFunction((n) => document.querySelectorAll('details.card').length === n, plain.findings.length, { timeout: 10_000 });
    let c = await counts(w.page);
    expect(c.highlights).toBe(plain.findings.length);
    expect(c.results).toBe(plain.results.length + (plain.statistics?.length ?? 0));
    expect(await w.page.textContent('#status')).toContain(`${plain.results.length} results found`);

    // the checklist and alpha options change the findings as they would on the command line
    await w.page.check('#checklist');
    await w.page.fill('#alpha', '0.01');
    const withChecklist = checkSource('manuscript.md', text, { checklist: true, alpha: 0.01, config: { guidelines: 'all' } });
    expect(withChecklist.findings.length).not.toBe(plain.findings.length);
    // checklist entries are summarised in the checklist table, not one card each; a finding about
    // the whole document marks no characters
    const cardsOf = (r: typeof withChecklist) => r.findings.filter((f) => !isChecklistFinding(r, f));
    expect(cardsOf(withChecklist).length).toBeLessThan(withChecklist.findings.length);
    await w.page.waitForFunction((n) => document.querySelectorAll('details.card').length === n, cardsOf(withChecklist).length, { timeout: 10_000 });
    c = await counts(w.page);
    expect(c.highlights).toBe(cardsOf(withChecklist).filter((f) => f.scope !== 'document').length);
    expect(await w.page.$$eval('table.checklist tr', (rows) => rows.length)).toBeGreaterThan(5);
    await w.page.screenshot({ path: resolve(OUT, 'page.png'), fullPage: true });

    // a rule turned off, and one raised to error, as a configuration file's `rules` would
    const byRule = new Map<string, number>();
    for (const f of withChecklist.findings) byRule.set(f.ruleId, (byRule.get(f.ruleId) ?? 0) + 1);
    const [offRule] = [...byRule.entries()].sort((a, b) => b[1] - a[1])[0]!;
    const noteRule = withChecklist.findings.find((f) => f.level === 'note' && f.ruleId !== offRule)!.ruleId;
    await w.page.click('details.levels summary');
    await w.page.selectOption(`select[data-rule="${offRule}"]`, 'off');
    await w.page.selectOption(`select[data-rule="${noteRule}"]`, 'error');
    const leveled = checkSource('manuscript.md', text, { checklist: true, alpha: 0.01, config: { guidelines: 'all', rules: { [offRule]: 'off', [noteRule]: 'error' } } });
    expect(leveled.findings.length).toBe(withChecklist.findings.length - byRule.get(offRule)!);
    await w.page.waitForFunction((n) => document.querySelectorAll('details.card').length === n, cardsOf(leveled).length, { timeout: 10_000 });
    expect(await w.page.textContent('#status')).toContain(`${leveled.findings.filter((f) => f.level === 'error').length} error`);
    expect(await w.page.$$eval('select[data-rule]', (s) => s.length)).toBe(RULES.length);
    await w.page.screenshot({ path: resolve(OUT, 'page-levels.png'), fullPage: false });

    // nothing of the manuscript is kept in storage
    expect(await w.page.evaluate(() => [localStorage.length, sessionStorage.length])).toEqual([0, 0]);
    expect(w.errors).toEqual([]);
    expect(w.requests).toEqual([]);
    await w.page.close();
  }, 60_000);

  it('the page is safe on the script-injection manuscript, pasted or dropped as a file', async () => {
    const url = pathToFileURL(PAGE).href;
    const w = await open(url);
    const xss = readFileSync('test/fixtures/hostile/xss.md', 'utf8');
    await w.page.fill('#manuscript', xss);
    const expected = checkSource('manuscript.md', xss, { checklist: false, config: { guidelines: 'all' } });
    await w.page.waitForFunction((n) => document.querySelectorAll('details.card').length === n, expected.findings.length, { timeout: 10_000 });
    await w.page.setInputFiles('#file', { name: 'dropped.md', mimeType: 'text/markdown', buffer: Buffer.from(xss) });
    await w.page.waitForFunction(() => (document.getElementById('name') as HTMLInputElement).value === 'dropped.md');
    for (const m of await w.page.$$('mark.flag a')) await m.hover().catch(() => {});
    await w.page.waitForTimeout(300);
    const c = await counts(w.page);
    expect(c.cards).toBe(expected.findings.length);
    expect(c.pwned).toBeNull();
    expect(w.dialogs).toEqual([]);
    expect(await w.page.evaluate(() => document.querySelectorAll('#output iframe, #output img, #output script, #output object, #output embed, #output form, #output input').length)).toBe(0);
    await w.page.screenshot({ path: resolve(OUT, 'page-xss.png'), fullPage: false });
    expect(w.errors).toEqual([]);
    expect(w.requests).toEqual([]);
    await w.page.close();
  }, 60_000);

  it('the page takes a .tex file from the picker and reads it as LaTeX: a result in a comment is not read', async () => {
    const w = await open(pathToFileURL(PAGE).href);
    expect(await w.page.getAttribute('#file', 'accept')).toContain('.tex');
    // invented; t(28) = 2.10 gives p = .045 (scipy.stats.t.sf(2.10, 28) * 2 = 0.0449): neither p = .020 nor p = .90 follows
    const tex = '\\begin{document}\nNaps helped, $t(28) = 2.10$, $p = .020$. % t(28) = 2.10, p = .90\n\\end{document}\n';
    const asTex = checkSource('sleep.tex', tex, { checklist: false, config: { guidelines: 'all' } });
    const asMarkdown = checkSource('sleep.md', tex, { checklist: false, config: { guidelines: 'all' } });
    // the check can fail: read as Markdown, the comment's result is flagged
    expect(asTex.findings.map((f) => f.ruleId)).toContain('p-follows-from-t');
    expect(asMarkdown.findings.length).toBeGreaterThan(asTex.findings.length);
    await w.page.setInputFiles('#file', { name: 'sleep.tex', mimeType: 'text/x-tex', buffer: Buffer.from(tex) });
    await w.page.waitForFunction(() => (document.getElementById('name') as HTMLInputElement).value === 'sleep.tex');
    await w.page.waitForFunction((n) => document.querySelectorAll('details.card').length === n, asTex.findings.length, { timeout: 10_000 });
    expect((await counts(w.page)).cards).toBe(asTex.findings.length);
    expect(w.errors).toEqual([]);
    expect(w.requests).toEqual([]);
    await w.page.close();
  }, 60_000);

  it('the page reads a PDF from the picker in the tab (pdf.js bundled, no worker script, no request) and names page and line', async () => {
    const w = await open(pathToFileURL(PAGE).href);
    expect(await w.page.getAttribute('#file', 'accept')).toContain('.pdf');
    // fixtures/pdf/two-columns.pdf, drawn by scripts/make-pdf-fixtures.mjs from invented content:
    // t(30) = 1.20 is printed on page 1, line 23, with p = .02 (scipy.stats.t.sf(1.20, 30) * 2 = 0.2395)
    const bytes = readFileSync('fixtures/pdf/two-columns.pdf');
    const read = await readPdf('two-columns.pdf', new Uint8Array(bytes));
    if (!read.ok) throw new Error(read.message);
    const expected = checkSource('two-columns.pdf', read.document.source, { checklist: false, config: { guidelines: 'all' }, document: read.document });
    expect(expected.findings.length).toBeGreaterThan(0);
    await w.page.setInputFiles('#file', { name: 'two-columns.pdf', mimeType: 'application/pdf', buffer: bytes });
    await w.page.waitForFunction(() => (document.getElementById('name') as HTMLInputElement).value === 'two-columns.pdf', undefined, { timeout: 30_000 });
    await w.page.waitForFunction((n) => document.querySelectorAll('details.card').length === n, expected.findings.length, { timeout: 10_000 });
    expect(await w.page.textContent('#output')).toContain('p. 1 line 23');
    expect(w.errors).toEqual([]);
    expect(w.requests).toEqual([]);
    await w.page.close();
  }, 90_000);
  it('the page reads a Word file from the picker and by drop, places findings by paragraph, and sends nothing', async () => {
    const w = await open(pathToFileURL(PAGE).href);
    expect(await w.page.getAttribute('#file', 'accept')).toContain('.docx');
    // fixtures/docx/features.docx is invented (scripts/make-docx-fixtures.mjs): its footnote's
    // t(12) = 3.50, p = .40 cannot hold (scipy.stats.t.sf(3.50, 12) * 2 = 0.0044)
    const bytes = readFileSync(resolve('fixtures/docx/features.docx'));
    await w.page.setInputFiles('#file', { name: 'plants.docx', mimeType: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document', buffer: bytes });
    await w.page.waitForFunction(() => (document.getElementById('name') as HTMLInputElement).value === 'plants.docx');
    await w.page.waitForFunction(() => document.querySelectorAll('details.card').length > 0, undefined, { timeout: 10_000 });
    expect(await w.page.textContent('#output')).toContain('footnote 1 ¶1 (“A check of the pots gave …”) char 27');
    expect(await w.page.inputValue('#manuscript')).toContain('A check of the pots gave t(12) = 3.50, p = .40.');
    // dropped: the same reading
    await w.page.fill('#manuscript', '');
    const handle = await w.page.evaluateHandle((data) => {
      const dt = new DataTransfer();
      dt.items.add(new File([new Uint8Array(data)], 'dropped.docx'));
      return dt;
    }, [...bytes]);
    await w.page.dispatchEvent('#drop', 'drop', { dataTransfer: handle });
    await w.page.waitForFunction(() => (document.getElementById('name') as HTMLInputElement).value === 'dropped.docx');
    await w.page.waitForFunction(() => (document.getElementById('output')?.textContent ?? '').includes('footnote 1 ¶1'), undefined, { timeout: 10_000 });
    expect(w.errors).toEqual([]);
    expect(w.requests).toEqual([]);
    await w.page.close();
  }, 60_000);

  it('the page refuses a dropped binary file, says so, and keeps what it showed', async () => {
    const w = await open(pathToFileURL(PAGE).href);
    await w.page.fill('#manuscript', 'Errors rose, t(40) = 3.10, p = .20.');
    await w.page.waitForFunction(() => document.querySelectorAll('details.card').length > 0, undefined, { timeout: 10_000 });
    const before = await w.page.innerHTML('#output');
    await w.page.setInputFiles('#file', { name: 'figure.md', mimeType: 'application/octet-stream', buffer: Buffer.from([0x74, 0x28, 0x34, 0x30, 0x29, 0x00, 0x01, 0x02]) });
    await w.page.waitForFunction(() => (document.getElementById('status')?.textContent ?? '').includes('not read'), undefined, { timeout: 10_000 });
    expect(await w.page.textContent('#status')).toBe('figure.md: binary file (NUL byte at byte 5); not read.');
    expect(await w.page.innerHTML('#output')).toBe(before);
    expect(await w.page.inputValue('#name')).toBe('manuscript.md');
    expect(w.errors).toEqual([]);
    expect(w.requests).toEqual([]);
    await w.page.close();
  }, 60_000);

  it('the page forbids network loads by its Content-Security-Policy (a fetch from the page is refused)', async () => {
    const url = pathToFileURL(PAGE).href;
    const w = await open(url);
    const outcome = await w.page.evaluate(async () => {
      try {
        await fetch('http://127.0.0.1:9/probe');
        return 'fetched';
      } catch (e) {
        return `refused: ${(e as Error).name}`;
      }
    });
    expect(outcome).toBe('refused: TypeError');
    expect(w.requests).toEqual([]);
    await w.page.close();
  }, 60_000);
});
