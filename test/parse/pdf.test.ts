import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { countObjects, layoutPages, PdfRefusal, readPdf, readPdfText, type PageRuns, type TextRun } from '../../src/parse/pdf/index.js';
import type { ParsedDocument } from '../../src/parse/types.js';

// The PDFs are drawn by scripts/make-pdf-fixtures.mjs from invented content; the reference for
// every expectation on their text is the text that script draws, at the places it draws it.
// p values: scipy.stats.t.sf(t, df) doubled (scipy 1.x): t(30) = 1.20 gives .2395, so the printed
// p = .02 cannot follow; t(38) = 2.42 gives .0204 (printed .020).
const fixture = (name: string) => new Uint8Array(readFileSync(resolve(import.meta.dirname, '../../fixtures/pdf', name)));

async function read(name: string): Promise<ParsedDocument> {
  const o = await readPdf(name, fixture(name));
  if (!o.ok) throw new Error(o.message);
  return o.document;
}

/** Offsets of `parts` in `text`, each searched after the previous one (-1 when missing or out of order). */
function inOrder(text: string, parts: string[]): number[] {
  let from = 0;
  return parts.map((p) => {
    const at = text.indexOf(p, from);
    if (at >= 0) from = at + p.length;
    return at;
  });
}

describe('PDF text in reading order (two columns)', async () => {
  const doc = await read('two-columns.pdf');
  const text = doc.source;

  it('reads the full-width title and abstract, then the left column, then the right', () => {
    const order = inOrder(text, ['Spaced practice and recall', 'Abstract.', '1. Method', '2. Results', 'p = .017, as expected.', 'Error rates were compared', 'which we did not expect.', '3. Discussion', 'schedule easy to keep.', 'The floor effect']);
    expect(order.every((o) => o >= 0)).toBe(true);
  });

  it('joins a word hyphenated at a line end and keeps the hyphen of t-test', () => {
    expect(text).toContain('the scores were recognised\nas interval data');
    expect(text).not.toContain('recog-');
    expect(text).toContain('A paired t-test\non the two sessions');
  });

  it('spells out ligature glyphs (ﬀ, ﬁ, ﬂ)', () => {
    expect(text).toContain('The effect was\nsignificant in both classes');
    expect(text).toContain('The floor effect');
    expect(text).not.toMatch(/[\uFB00-\uFB06]/);
  });

  it('reads a raised −7 after 10 as an exponent, a raised 2 after χ as a square, and drops a raised footnote mark', () => {
    expect(text).toContain('p = 3.5 × 10⁻⁷,');
    expect(text).toContain('χ²(1, N = 40) = 5.02');
    expect(text).toContain('t(38) = 4.10, p < .001.\n');
    const seg = doc.segments.find((s) => s.text.includes('3.5 × 10'));
    expect(seg?.text).toContain('3.5 × 10^-7');
  });

  it('removes the running head and the page numbers', () => {
    expect(text).not.toContain('Invented Journal');
    expect(text).not.toMatch(/\b10[12]\b/);
    // the first line of page 2 is the heading, not the head
    const unit = doc.original?.units.find((u) => u.page === 2 && u.line === 1);
    expect(unit?.opening).toBe('3. Discussion');
  });

  it('places each result by page and line on the page', () => {
    const report = checkSource('two-columns.pdf', doc.source, { document: doc });
    const finding = report.findings.find((f) => f.ruleId === 'significance-follows-from-t' || f.ruleId === 'p-follows-from-t');
    // t(30) = 1.20 is drawn on the right column's seventh line; page 1 has the title (1), two
    // abstract lines (2–3) and 13 left-column lines (4–16) before it
    expect(finding?.original).toMatchObject({ kind: 'page', page: 1, line: 23 });
    expect(finding?.original?.kind === 'page' && finding.original.around).toContain('t(30) = 1.20');
    const reported = report.results.map((r) => `${r.t.printed}/${r.df?.printed}`);
    // the U+2212 minus drawn in t(19) = −2.61 is read as a minus
    expect(reported).toEqual(['2.45/38', '-2.61/19', '6.12/39', '4.10/38', '1.20/30', '2.20/26']);
    // page 2's result sits on its left column's third line
    const last = report.results.at(-1);
    expect(last?.original).toMatchObject({ kind: 'page', page: 2, line: 3 });
  });
});

describe('PDF printed by chromium from HTML with CSS columns', async () => {
  // fixtures/pdf/chromium-columns.pdf is printed by scripts/make-chromium-pdf-fixture.mjs; the
  // reference for the text is that script's HTML, for the places the PDF chromium printed from it.
  // p values: scipy.stats.t.sf(|t|, df) doubled (scipy 1.x): t(28) = 2.10 gives .0449, t(34) = 2.74
  // gives .0097, t(22) = 3.12 gives .0050 (all printed consistently); t(30) = 1.45 gives .157, so
  // the printed p = .016 cannot follow.
  const doc = await read('chromium-columns.pdf');
  const text = doc.source;

  it('reads the title and abstract, the left column, the right column, then page 2', () => {
    const order = inOrder(text, [
      'Evening light and reading speed', 'Abstract. Sixty invented students',
      '1. Method', 'Each student read ten passages.', '2. Results', 'than students under the cool lamp, t(28) =',
      // chromium broke the column inside this sentence: its end opens the right column
      '2.10, p = .045, in the first week', 'The gain in comprehension scores', 'The paper lanterns',
      'Late readers in the cool group', 'had not predicted at the outset.',
      '3. Discussion', 'Later rounds will use other lamps',
    ]);
    expect(order.every((o) => o >= 0)).toBe(true);
  });

  it('joins the word broken at a soft hyphen, drops the running head and page numbers, keeps paragraphs apart', () => {
    expect(text).toContain('to the counterbalanced\nresults');
    expect(text).not.toContain('counter-');
    expect(text).not.toContain('Invented Bulletin');
    expect(text).not.toMatch(/(^|\n)[12]\n/);
    // paragraphs set with space after them and no indent: a sentence end, then a wider gap
    expect(text).toContain('in the first week of the study.\n\nThe gain');
    expect(text).toContain('not know the condition.\n\nThe passages');
  });

  it('extracts every t-test at its page and line, the U+2212 minus as a minus, and flags only the wrong p', () => {
    const report = checkSource('chromium-columns.pdf', doc.source, { document: doc });
    expect(report.results.map((r) => [r.t.printed, r.df?.printed, r.p?.printed])).toEqual([
      ['2.10', '28', 'p = .045'],
      ['-2.74', '34', 'p = .010'],
      ['1.45', '30', 'p = .016'],
      ['3.12', '22', 'p = .005'],
    ]);
    // page 1: title (1), abstract (2–3), left column (4–15: t(28) = starts on its last line),
    // right column from 16; page 2: the heading, then the Discussion's first line
    expect(report.results.map((r) => r.original)).toEqual([
      expect.objectContaining({ kind: 'page', page: 1, line: 15 }),
      expect.objectContaining({ kind: 'page', page: 1, line: 18 }),
      expect.objectContaining({ kind: 'page', page: 1, line: 26 }),
      expect.objectContaining({ kind: 'page', page: 2, line: 2 }),
    ]);
    const flagged = report.findings.filter((f) => f.level === 'error' || f.level === 'warning');
    expect(flagged.map((f) => f.ruleId)).toEqual(['significance-follows-from-t']);
    expect(flagged[0]?.original?.kind === 'page' && flagged[0].original.around).toContain('t(30) = 1.45, p = .016');
  });
});

describe('PDF line numbers and tables', () => {
  it('drops a margin column of line numbers and numbers lines per page', async () => {
    const doc = await read('line-numbers.pdf');
    expect(doc.source.startsWith('Thirty invented volunteers')).toBe(true);
    expect(doc.source).not.toMatch(/(^|\n)[0-9]{1,2} /);
    const second = doc.original?.units.find((u) => u.page === 2);
    expect(second).toMatchObject({ line: 1, opening: 'On the second page: Thirty invented …' });
    const report = checkSource('line-numbers.pdf', doc.source, { document: doc });
    expect(report.results.map((r) => r.original)).toContainEqual(expect.objectContaining({ page: 1, line: 3 }));
  });

  it('reads a table as rows of cells and its t-tests from the cells', async () => {
    const doc = await read('table.pdf');
    const cells = doc.segments.filter((s) => s.kind === 'tableCell');
    expect(cells.map((c) => [c.table?.row, c.table?.column, c.text]).slice(0, 10)).toEqual([
      [0, 0, 'Measure'], [0, 1, 'Spaced M (SD)'], [0, 2, 'Massed M (SD)'], [0, 3, 't(38)'], [0, 4, 'p'],
      [1, 0, 'Words recalled'], [1, 1, '14.2 (3.1)'], [1, 2, '11.9 (2.9)'], [1, 3, '2.42'], [1, 4, '.020'],
    ]);
    expect(doc.segments.find((s) => s.text.startsWith('Table 1.'))?.legendOf).toEqual({ table: 0, role: 'caption' });
    const report = checkSource('table.pdf', doc.source, { document: doc });
    expect(report.results.map((r) => [r.t.printed, r.df?.printed, r.p?.printed])).toEqual([
      ['2.42', '38', '.020'],
      ['1.87', '38', '.069'],
      ['3.05', '38', '.004'],
    ]);
    expect(report.findings.filter((f) => f.level === 'error' || f.level === 'warning')).toEqual([]);
    expect(report.results[0]?.original).toMatchObject({ page: 1, line: 4 });
  });
});

describe('PDF refusals', () => {
  it('refuses a PDF without a text layer, saying to run OCR first', async () => {
    const o = await readPdf('scanned.pdf', fixture('scanned.pdf'));
    expect(o).toEqual({ ok: false, message: expect.stringMatching(/^skipped: none of the PDF's 2 pages carries text.*OCR/) });
  });

  it('refuses a password-protected PDF', async () => {
    const o = await readPdf('encrypted.pdf', fixture('encrypted.pdf'));
    expect(o).toEqual({ ok: false, message: expect.stringMatching(/^skipped: the PDF is encrypted with a password/) });
  });

  it('refuses a damaged PDF', async () => {
    const o = await readPdf('damaged.pdf', fixture('damaged.pdf'));
    expect(o).toEqual({ ok: false, message: expect.stringMatching(/^cannot read: the PDF is damaged/) });
  });

  it('refuses a PDF past the page limit and past the text-run limit', async () => {
    await expect(readPdfText(fixture('many-pages.pdf'), { maxPages: 20, maxRuns: 1000 })).rejects.toThrow(/has 30 pages, more than the 20/);
    await expect(readPdfText(fixture('many-pages.pdf'), { maxPages: 100, maxRuns: 10 })).rejects.toThrow(PdfRefusal);
    const o = await readPdfText(fixture('many-pages.pdf'), { maxPages: 30, maxRuns: 1000 });
    expect(o.pages).toBe(30);
  });

  it('counts object headers in the bytes, and stops counting past the limit', () => {
    const bytes = new TextEncoder().encode('1 0 obj\n<<>>\nendobj\n2 0 obj\n<<>>\nendobj\n% not an obj here: xobj\n12 0 obj');
    expect(countObjects(bytes, 100)).toBe(3);
    expect(countObjects(bytes, 1)).toBe(2);
  });
});

describe('layout from text runs', () => {
  const run = (str: string, x: number, y: number, size = 10, width = str.length * size * 0.5): TextRun => ({ str, x, y, width, size, upright: true });
  const page = (runs: TextRun[], n = 1): PageRuns => ({ page: n, width: 612, height: 792, runs });
  const text = (pages: PageRuns[]) => layoutPages(pages).blocks.map((b) => b.pieces.map((p) => p.text).join('|'));

  it('joins runs on one baseline with a space only where there is a gap', () => {
    expect(text([page([run('t(28)', 72, 700), run('= 2.10,', 72 + 25 + 2.5, 700), run('p', 72 + 25 + 2.5 + 35 + 2.5, 700), run('= .045', 72 + 25 + 2.5 + 35 + 2.5 + 5, 700)])])).toEqual(['t(28) = 2.10, p= .045']);
  });

  it('starts a paragraph at a gap a third of a line wider than the leading after a sentence end only', () => {
    // lines 12 apart; the paragraph gap is 17 (1.42 leadings)
    const lines = (second: string) => [run('Line one of a paragraph.', 72, 700), run('Line two of it goes on and', 72, 688), run('ends here with a stop.', 72, 676), run(second, 72, 659), run('and more of it.', 72, 647)];
    expect(text([page(lines('A new paragraph begins'))])).toEqual(['Line one of a paragraph.|Line two of it goes on and|ends here with a stop.', 'A new paragraph begins|and more of it.']);
    const open = lines('a new line goes on').map((r, i) => (i === 2 ? run('ends here with no stop', 72, 676) : r));
    expect(text([page(open)])).toEqual(['Line one of a paragraph.|Line two of it goes on and|ends here with no stop|a new line goes on|and more of it.']);
  });

  it('leaves rotated runs (margin stamps) out', () => {
    expect(text([page([run('Results were clear.', 72, 700), { ...run('preprint stamp', 20, 300), upright: false }])])).toEqual(['Results were clear.']);
  });

  it('keeps a lowered subscript inline (t₂₈ printed as a lowered 28)', () => {
    expect(text([page([run('the test gave t', 72, 700), run('28', 72 + 75.2, 697.5, 7), run(' = 2.10.', 72 + 75.2 + 7.5, 700)])])).toEqual(['the test gave t28 = 2.10.']);
  });

  it('reads a table set across both columns of a two-column page as one table, its header lines as one row', () => {
    const prose = (side: string, k: number) => `${side} column line ${k} of invented prose text`.padEnd(46, '.');
    const runs: TextRun[] = [];
    let y = 740;
    for (let k = 1; k <= 6; k += 1, y -= 12) runs.push(run(prose('Left', k), 54, y), run(prose('Right', k), 318, y));
    y -= 12;
    // the table: cells at 54, 150, 250, 340, 440, 520; none crosses the gutter (284 to 318)
    const cells = (texts: string[], at: number) => texts.forEach((t, i) => t !== '' && runs.push(run(t, [54, 150, 250, 340, 440, 520][i] as number, at)));
    cells(['', 'Share', '', 'Mean', '', ''], y);
    cells(['Trait', 'χ²(1)', 'p', 'score', 't(81)', 'd'], (y -= 12));
    cells(['Warmth', '8.80', '.003', '55.10', '6.83', '0.75'], (y -= 12));
    cells(['Calm', '7.35', '.007', '54.95', '7.10', '0.78'], (y -= 12));
    y -= 24;
    for (let k = 7; k <= 10; k += 1, y -= 12) runs.push(run(prose('Left', k), 54, y), run(prose('Right', k), 318, y));
    const { blocks } = layoutPages([page(runs)]);
    const order = blocks.map((b) => (b.kind === 'tableCell' ? `[${b.table?.row},${b.table?.column}] ${b.pieces.map((p) => p.text).join(' ')}` : (b.pieces[0]?.text.slice(0, 12) ?? '')));
    expect(order).toEqual([
      'Left column ', 'Right column',
      '[0,0] Trait', '[0,1] Share χ²(1)', '[0,2] p', '[0,3] Mean score', '[0,4] t(81)', '[0,5] d',
      '[1,0] Warmth', '[1,1] 8.80', '[1,2] .003', '[1,3] 55.10', '[1,4] 6.83', '[1,5] 0.75',
      '[2,0] Calm', '[2,1] 7.35', '[2,2] .007', '[2,3] 54.95', '[2,4] 7.10', '[2,5] 0.78',
      'Left column ', 'Right column',
    ]);
    // lines are numbered in reading order: the left column's six lines are lines 1–6, the right's 7–12
    expect(blocks[0]?.pieces.map((p) => p.line)).toEqual([1, 2, 3, 4, 5, 6]);
    expect(blocks[1]?.pieces.map((p) => p.line)).toEqual([7, 8, 9, 10, 11, 12]);
  });
});

