/**
 * The HTML report's pictures, through the real CLI (`--format html`, in process) on invented
 * manuscripts: the geometry of the SVG it writes. The browser test (test/browser) measures the
 * same pictures with the browser's own text metrics.
 *
 * Text widths here are estimated without a browser: every character as wide as a digit of a
 * sans-serif face, 0.64 em (DejaVu Sans digits are 0.636 em; from memory), which overstates
 * points and superscripts. That every label must lie inside its picture and clear of its
 * neighbours is common practice for charts, no source.
 */
import { describe, expect, it } from 'vitest';
import { cli } from '../cli/harness.js';
import { readReport } from '../helpers.js';

const P_FILE = 'test/fixtures/pictures/p-values.md';
const OTHER_FILE = 'test/fixtures/pictures/other-quantities.md';
const DEMO = 'fixtures/demo/hand-hygiene.md';

async function html(...files: string[]): Promise<string> {
  const out = await cli(['--format', 'html', ...files]);
  expect(out.stderr).toBe('');
  return out.stdout;
}

async function json(...files: string[]): Promise<{ files: Array<{ path: string; findings: Array<Record<string, unknown> & { ruleId: string; message: string; figure?: Record<string, unknown>; gap?: { absolute: number; lastDigitUnits?: number; roundingAllowance?: number } }> }> }> {
  const out = await cli(['--format', 'json', ...files]);
  return readReport(out.stdout);
}

// ---- a small reader for the SVG the report writes (its own markup, one element per tag) ----

type Attrs = Record<string, string>;
const attrsOf = (tag: string): Attrs => Object.fromEntries([...tag.matchAll(/([a-zA-Z][a-zA-Z0-9-]*)="([^"]*)"/g)].map((m) => [m[1] as string, m[2] as string]));
const num = (a: Attrs, k: string): number => {
  const v = Number(a[k]);
  if (!Number.isFinite(v)) throw new Error(`no numeric ${k} in ${JSON.stringify(a)}`);
  return v;
};

function svgs(page: string, cls: string): string[] {
  return [...page.matchAll(new RegExp(`<svg class="${cls}"[^>]*>[\\s\\S]*?</svg>`, 'g'))].map((m) => m[0]);
}
function viewBox(svg: string): { w: number; h: number } {
  const [, , w, h] = (attrsOf(svg.slice(0, svg.indexOf('>'))).viewBox ?? '').split(/\s+/).map(Number);
  return { w: w as number, h: h as number };
}
interface Label {
  x: number;
  y: number;
  anchor: string;
  text: string;
  cls: string;
}
function labels(svg: string): Label[] {
  return [...svg.matchAll(/<text([^>]*)>([^<]*)<\/text>/g)].map((m) => {
    const a = attrsOf(m[1] as string);
    return { x: num(a, 'x'), y: num(a, 'y'), anchor: a['text-anchor'] ?? 'start', text: (m[2] as string).replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&'), cls: a.class ?? '' };
  });
}
const FONT = 11;
const textWidth = (s: string) => [...s].length * 0.64 * FONT;
function extent(l: Label): [number, number] {
  const w = textWidth(l.text);
  return l.anchor === 'middle' ? [l.x - w / 2, l.x + w / 2] : l.anchor === 'end' ? [l.x - w, l.x] : [l.x, l.x + w];
}

interface Box {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}
const overlap = (a: Box, b: Box) => a.x1 < b.x2 && b.x1 < a.x2 && a.y1 < b.y2 && b.y1 < a.y2;
function boxOf(el: string): Box {
  const a = attrsOf(el);
  if (el.startsWith('<circle')) return { x1: num(a, 'cx') - num(a, 'r'), x2: num(a, 'cx') + num(a, 'r'), y1: num(a, 'cy') - num(a, 'r'), y2: num(a, 'cy') + num(a, 'r') };
  if (el.startsWith('<rect')) return { x1: num(a, 'x'), x2: num(a, 'x') + num(a, 'width'), y1: num(a, 'y'), y2: num(a, 'y') + num(a, 'height') };
  const pts = [...(a.d ?? '').matchAll(/(-?[\d.]+),(-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])] as const);
  return { x1: Math.min(...pts.map((p) => p[0])), x2: Math.max(...pts.map((p) => p[0])), y1: Math.min(...pts.map((p) => p[1])), y2: Math.max(...pts.map((p) => p[1])) };
}
/** Elements (opening tags) whose class list holds every class given. */
function elements(svg: string, ...classes: string[]): string[] {
  return [...svg.matchAll(/<(rect|circle|path|line)\b[^>]*>/g)].map((m) => m[0]).filter((el) => {
    const cls = (attrsOf(el).class ?? '').split(/\s+/);
    return classes.every((c) => cls.includes(c));
  });
}
/** The report's cards, each with its rule id. */
function cards(page: string): Array<{ ruleId: string; body: string }> {
  return [...page.matchAll(/<details class="card[\s\S]*?<\/details>/g)].map((m) => ({ ruleId: /· ([a-z-]+) </.exec(m[0])?.[1] ?? '', body: m[0] }));
}
/** The value-to-x map of a picture with a linear axis, read off its tick labels. */
function linearScale(svg: string): (v: number) => number {
  const ticks = labels(svg).filter((l) => l.cls === 'tick').map((l) => ({ x: l.x, v: Number(l.text.replace('−', '-')) }));
  expect(ticks.length).toBeGreaterThanOrEqual(2);
  const [a, b] = [ticks[0]!, ticks[ticks.length - 1]!];
  return (v) => a.x + ((v - a.v) / (b.v - a.v)) * (b.x - a.x);
}
const centreX = (b: Box) => (b.x1 + b.x2) / 2;

describe('the p pictures', () => {
  it('show the recomputed p range with a drawn width, never under the reported marker', async () => {
    const page = await html(P_FILE, OTHER_FILE);
    const strips = svgs(page, 'pstrip');
    // 8 results, each in the list, plus the cards of findings about p (2)
    expect(strips.length).toBe(10);
    for (const s of strips) {
      const [range] = elements(s, 'range').filter((e) => e.startsWith('<rect'));
      const [marker] = elements(s, 'reported');
      expect(range, s).toBeDefined();
      expect(marker, s).toBeDefined();
      const r = boxOf(range!);
      expect(r.x2 - r.x1).toBeGreaterThanOrEqual(2);
      expect(overlap(r, boxOf(marker!)), s).toBe(false);
    }
    // the overview: the same in every row
    const [forest] = svgs(page, 'forest');
    const rows = [...forest!.matchAll(/<a href[\s\S]*?<\/a>/g)].map((m) => m[0]);
    expect(rows.length).toBe(5);
    for (const row of rows) {
      const range = boxOf(elements(row, 'range').find((e) => e.startsWith('<rect'))!);
      expect(range.x2 - range.x1).toBeGreaterThanOrEqual(2);
      expect(overlap(range, boxOf(elements(row, 'reported')[0]!)), row).toBe(false);
    }
  });

  it('keep every label inside the picture and clear of its neighbours', async () => {
    const page = await html(P_FILE, OTHER_FILE, DEMO);
    const all = [...svgs(page, 'pstrip'), ...svgs(page, 'forest'), ...svgs(page, 'figure [a-z]+')];
    expect(all.length).toBeGreaterThan(20);
    for (const s of all) {
      const { w, h } = viewBox(s);
      const ls = labels(s);
      for (const l of ls) {
        const [x1, x2] = extent(l);
        expect(x1, `${l.text} in ${s.slice(0, 80)}`).toBeGreaterThanOrEqual(0);
        expect(x2, `${l.text} in ${s.slice(0, 80)}`).toBeLessThanOrEqual(w);
        // ascent of about 0.8 em above the baseline, descent of 0.25 em below it
        expect(l.y - 0.8 * FONT).toBeGreaterThanOrEqual(0);
        expect(l.y + 0.25 * FONT).toBeLessThanOrEqual(h);
      }
      const ticks = ls.filter((l) => l.cls === 'tick').map(extent).sort((a, b) => a[0] - b[0]);
      for (let i = 1; i < ticks.length; i++) expect(ticks[i]![0], s.slice(0, 80)).toBeGreaterThan(ticks[i - 1]![1]);
    }
  });

  it('share one axis: every strip on the page, in every file, has the same ticks at the same places', async () => {
    const page = await html(P_FILE, OTHER_FILE);
    const strips = svgs(page, 'pstrip');
    const axisOf = (s: string) => labels(s).filter((l) => l.cls === 'tick').map((l) => `${l.text}@${l.x}`).join(' ');
    const first = axisOf(strips[0]!);
    for (const s of strips) expect(axisOf(s)).toBe(first);
    // the second file's own smallest p is about 1.7e-7; its strips still reach the page's bound
    const second = page.slice(page.indexOf(`<h2>${OTHER_FILE}</h2>`));
    const [ownStrip] = svgs(second, 'pstrip');
    expect(axisOf(ownStrip!)).toBe(first);
    expect(first).toContain('10⁻¹²@');
    // the overviews of both files run over the same decades, bound to 1
    const ends = svgs(page, 'forest').map((f) => {
      const ticks = labels(f).filter((l) => l.cls === 'tick').sort((a, b) => a.x - b.x);
      return `${ticks[0]!.text} … ${ticks[ticks.length - 1]!.text}`;
    });
    expect(ends).toEqual(['10⁻¹² … 1', '10⁻¹² … 1']);
  });

  it('draw p = .000 at the axis bound, marked as a bound', async () => {
    const page = await html(P_FILE);
    const [strip] = svgs(page, 'pstrip').filter((s) => s.includes('aria-label="reported p = .000 '));
    expect(strip).toBeDefined();
    const [bound] = elements(strip!, 'reported', 'bound');
    expect(bound, 'a bound mark').toBeDefined();
    const axis = attrsOf(elements(strip!, 'axis').find((e) => /x2="\d+(\.\d)?" y2="33"/.test(e))!);
    const boundTick = labels(strip!).filter((l) => l.cls === 'tick').sort((a, b) => a.x - b.x)[0]!;
    expect(boundTick.text).toBe('10⁻¹²');
    expect(boxOf(bound!).x1).toBeCloseTo(num(axis, 'x1'), 1);
    expect(boxOf(bound!).x1).toBeCloseTo(boundTick.x, 1);
    expect(strip).toMatch(/<path class="reported bound"[^>]*><title>[^<]*drawn at the axis bound[^<]*<\/title>/);
    // a p printed as a bound above the axis' end is drawn where it is, as a bound of its own
    const [lessThan] = svgs(page, 'pstrip').filter((s) => s.includes('aria-label="reported p &lt; .001 '));
    expect(elements(lessThan!, 'reported', 'bound')).toEqual([]);
    // and its recomputed range, 3e-13 (below the bound), carries an arrow at the bound
    expect(elements(lessThan!, 'range', 'off').length).toBe(1);
  });
});

describe('pictures of findings that are not about p', () => {
  it('each gets a picture of its own quantity, drawn where the report numbers say, and no p strip', async () => {
    const page = await html(OTHER_FILE);
    const data = (await json(OTHER_FILE)).files[0]!.findings;
    const byRule = new Map(cards(page).map((c) => [c.ruleId, c.body]));
    const figureOf = (ruleId: string): unknown => data.find((f) => f.ruleId === ruleId)!.figure;
    for (const [rule, cls] of [
      ['ci-agrees-with-result', 'interval'],
      ['df-follows-from-n', 'df'],
      ['mean-is-possible-for-integers', 'lattice'],
      ['paired-correlation-is-possible', 'correlation'],
    ] as const) {
      const card = byRule.get(rule);
      expect(card, rule).toBeDefined();
      expect(svgs(card!, `figure ${cls}`).length, rule).toBe(1);
      expect(svgs(card!, 'pstrip'), rule).toEqual([]);
    }

    // the CI against the estimate and the interval t implies
    {
      const g = figureOf('ci-agrees-with-result') as { fromT: { lower: { high: number }; upper: { low: number } } };
      const svg = svgs(byRule.get('ci-agrees-with-result')!, 'figure interval')[0]!;
      const x = linearScale(svg);
      const ci = boxOf(elements(svg, 'ci')[0]!);
      expect(ci.x1).toBeCloseTo(x(-8.0), 0);
      expect(ci.x2).toBeCloseTo(x(12.4), 0);
      expect(centreX(boxOf(elements(svg, 'estimate')[0]!))).toBeCloseTo(x(2.2), 0);
      const implied = boxOf(elements(svg, 'implied').find((e) => !e.includes('loose'))!);
      expect(implied.x1).toBeCloseTo(x(g.fromT.lower.high), 0);
      expect(implied.x2).toBeCloseTo(x(g.fromT.upper.low), 0);
      // the interval t implies is far narrower than the printed one: the picture shows it
      expect(implied.x2 - implied.x1).toBeLessThan((ci.x2 - ci.x1) / 3);
    }

    // the printed df (44) against the df the sizes allow (40; figure-data.test.ts checks the numbers)
    {
      const svg = svgs(byRule.get('df-follows-from-n')!, 'figure df')[0]!;
      const x = linearScale(svg);
      expect(centreX(boxOf(elements(svg, 'reported')[0]!))).toBeCloseTo(x(44), 0);
      expect(centreX(boxOf(elements(svg, 'allowed')[0]!))).toBeCloseTo(x(40), 0);
      // df ticks are whole numbers
      for (const l of labels(svg).filter((t) => t.cls === 'tick')) expect(l.text).toMatch(/^\d+$/);
    }

    // the GRIM lattice: the possible means as dots, the printed mean's rounding between two of them
    {
      const g = figureOf('mean-is-possible-for-integers') as { possible: number[] };
      const svg = svgs(byRule.get('mean-is-possible-for-integers')!, 'figure lattice')[0]!;
      const x = linearScale(svg);
      const dots = elements(svg, 'possible').map((e) => centreX(boxOf(e)));
      expect(dots.length).toBe(4);
      dots.forEach((d, i) => expect(d).toBeCloseTo(x(g.possible[i]!), 0));
      const printed = boxOf(elements(svg, 'reported-range')[0]!);
      expect(printed.x1).toBeGreaterThan(dots[1]!);
      expect(printed.x2).toBeLessThan(dots[2]!);
    }

    // the implied correlation against [−1, 1]
    {
      const g = figureOf('paired-correlation-is-possible') as { implied: { low: number; high: number } };
      const svg = svgs(byRule.get('paired-correlation-is-possible')!, 'figure correlation')[0]!;
      const x = linearScale(svg);
      const feasible = boxOf(elements(svg, 'feasible')[0]!);
      expect(feasible.x1).toBeCloseTo(x(-1), 0);
      expect(feasible.x2).toBeCloseTo(x(1), 0);
      const implied = boxOf(elements(svg, 'implied-r')[0]!);
      expect(implied.x1).toBeCloseTo(x(g.implied.low), 0);
      expect(implied.x2).toBeCloseTo(x(g.implied.high), 0);
      expect(implied.x1).toBeGreaterThan(feasible.x2);
    }
  });

  it('a finding with no quantity of its own to draw gets no picture, not the p strip of its result', async () => {
    const page = await html(DEMO);
    const design = cards(page).find((c) => c.ruleId === 'design-matches-analysis');
    expect(design).toBeDefined();
    expect(design!.body).not.toContain('<svg');
    const spread = cards(page).find((c) => c.ruleId === 'spread-kind-matches-t');
    expect(spread!.body).not.toContain('<svg');
  });
});
