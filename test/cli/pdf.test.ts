import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadPdfJs } from '../../src/parse/pdf/index.js';
import { cli } from './harness.js';
import { readReport } from '../helpers.js';

// The PDFs are drawn by scripts/make-pdf-fixtures.mjs from invented content (the reference for
// where each word sits: the script's coordinates). t(30) = 1.20 gives a two-tailed p of .2395
// (scipy.stats.t.sf(1.20, 30) doubled), so the printed p = .02 is flagged.
const FIXTURES = resolve(import.meta.dirname, '../../fixtures/pdf');
const dir = mkdtempSync(join(tmpdir(), 'plumbline-pdf-cli-'));
for (const name of ['two-columns.pdf', 'table.pdf', 'scanned.pdf', 'encrypted.pdf', 'damaged.pdf']) copyFileSync(join(FIXTURES, name), join(dir, name));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface Annotation {
  subtype: string;
  rect: number[];
  quadPoints?: Float32Array | number[];
  contentsObj?: { str: string };
  titleObj?: { str: string };
}

async function annotationsOf(path: string): Promise<Array<{ page: number; items: Annotation[]; words: Array<{ str: string; x: number; y: number; width: number }> }>> {
  const pdfjs = await loadPdfJs();
  const doc = await pdfjs.getDocument({ data: new Uint8Array(readFileSync(path)), verbosity: 0 }).promise;
  const out = [];
  for (let n = 1; n <= doc.numPages; n += 1) {
    const page = await doc.getPage(n);
    const items = (await page.getAnnotations()) as Annotation[];
    const content = await page.getTextContent();
    const words = content.items.flatMap((i) => ('str' in i ? [{ str: i.str, x: i.transform[4] as number, y: i.transform[5] as number, width: i.width }] : []));
    out.push({ page: n, items, words });
  }
  await doc.destroy();
  return out;
}

describe('PDF files on the command line', () => {
  it('checks the PDFs it can read and names each refused one with its reason, exit 2', async () => {
    const out = await cli(['--format', 'json', 'two-columns.pdf', 'table.pdf', 'scanned.pdf', 'encrypted.pdf', 'damaged.pdf'], { cwd: dir });
    expect(out.code).toBe(2);
    const report = readReport(out.stdout) as { files: Array<{ path: string; findings: Array<{ ruleId: string; place?: unknown; original?: unknown }> }>; failures: Array<{ path: string; message: string }> };
    expect(report.files.map((f) => f.path)).toEqual(['two-columns.pdf', 'table.pdf']);
    expect(report.failures.map((f) => f.path).sort()).toEqual(['damaged.pdf', 'encrypted.pdf', 'scanned.pdf']);
    expect(out.stderr).toMatch(/scanned\.pdf: skipped: none of the PDF's 2 pages carries text.*OCR/);
    expect(out.stderr).toMatch(/encrypted\.pdf: skipped: the PDF is encrypted with a password/);
    expect(out.stderr).toMatch(/damaged\.pdf: cannot read: the PDF is damaged/);
  });

  it('names the page and line of a finding in the human format', async () => {
    const out = await cli(['two-columns.pdf'], { cwd: dir });
    expect(out.code).toBe(1);
    expect(out.stdout).toContain('p. 1 line 23 (“');
  });
});

describe('--annotate OUT.pdf', () => {
  it('writes a copy with a highlight over the flagged characters and a note saying the finding', async () => {
    const before = readFileSync(join(dir, 'two-columns.pdf'));
    const out = await cli(['two-columns.pdf', '--annotate', 'annotated.pdf'], { cwd: dir });
    expect(out.code).toBe(1);
    expect(out.stderr).toContain('wrote annotated.pdf: two-columns.pdf with 1 finding as highlights and notes');
    // the original is unchanged
    expect(readFileSync(join(dir, 'two-columns.pdf')).equals(before)).toBe(true);
    const pages = await annotationsOf(join(dir, 'annotated.pdf'));
    const highlights = pages.flatMap((p) => p.items.filter((a) => a.subtype === 'Highlight').map((a) => ({ page: p.page, a, words: p.words })));
    expect(highlights).toHaveLength(1);
    const { page, a, words } = highlights[0] as (typeof highlights)[number];
    expect(page).toBe(1);
    expect(a.contentsObj?.str).toMatch(/^p\. 1 line 23: error significance-follows-from-t\nReported p = \.02[\s\S]*What to check: /);
    expect(a.titleObj?.str).toBe('plumbline');
    // the flagged text runs over two printed lines: `t(30) = 1.20,` ends the right column's
    // seventh line and `p = .02` starts its eighth; one quadrilateral each
    const quads = Array.from(a.quadPoints ?? []);
    expect(quads).toHaveLength(16);
    const lineOf = (start: string) => words.find((w) => w.str.startsWith(start)) as { x: number; y: number; width: number };
    const first = lineOf('more words in the spaced group');
    const second = lineOf('p = .02, which');
    // quad 1 lies on the first line's baseline, within its run, over its last 13 characters
    // (`t(30) = 1.20,` of 45); quad 2 starts at the second line's left end
    const [ulx1, uly1, urx1, , , lly1] = quads;
    expect(lly1).toBeLessThan(first.y);
    expect(uly1).toBeGreaterThan(first.y);
    expect(urx1).toBeCloseTo(first.x + first.width, 0);
    expect(ulx1).toBeGreaterThan(first.x + first.width * 0.6);
    const [ulx2, uly2, , , , lly2] = quads.slice(8);
    expect(ulx2).toBeCloseTo(second.x, 0);
    expect(lly2).toBeLessThan(second.y);
    expect(uly2).toBeGreaterThan(second.y);
    // and a popup belongs to it
    expect(pages[0]?.items.some((x) => x.subtype === 'Popup')).toBe(true);
  });

  it('refuses to write over the file checked, and needs exactly one file', async () => {
    const over = await cli(['two-columns.pdf', '--annotate', 'two-columns.pdf'], { cwd: dir });
    expect(over.code).toBe(2);
    const two = await cli(['two-columns.pdf', 'table.pdf', '--annotate', 'x.pdf'], { cwd: dir });
    expect(two.code).toBe(2);
    expect(two.stderr).toMatch(/--annotate writes one annotated copy of one Word or PDF file, and 2 such files were checked/);
    expect(existsSync(join(dir, 'x.pdf'))).toBe(false);
  });

  it('writes nothing for a file that is not a PDF', async () => {
    writeFileSync(join(dir, 'notes.md'), 'Invented: t(30) = 1.20, p = .02.\n');
    const out = await cli(['notes.md', '--annotate', 'notes-annotated.pdf'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toMatch(/no Word \(\.docx\) or PDF file was checked/);
    expect(existsSync(join(dir, 'notes-annotated.pdf'))).toBe(false);
  });
});
