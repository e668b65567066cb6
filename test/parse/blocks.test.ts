import { describe, expect, it } from 'vitest';
import { checkSource, documentFromBlocks, type Block } from '../../src/engine/index.js';
import { openingWords, unitAt } from '../../src/parse/index.js';
import { formatHuman } from '../../src/report/human.js';
import { formatLines } from '../../src/report/lines.js';

// Invented blocks, as a Word front end hands them over (one piece per paragraph), about a
// made-up study of desk plants. t(28) = 2.10 gives a two-tailed p of about .045 (scipy.stats.t.sf
// at 2.10 on 28 df, doubled, 0.0449), so a printed p = .45 cannot follow from it.
const para = (paragraph: number, text: string): Block => ({ kind: 'paragraph', pieces: [{ text, unit: { paragraph, opening: openingWords(text) } }] });

describe('documentFromBlocks', () => {
  const blocks: Block[] = [
    { kind: 'heading', pieces: [{ text: 'Results', unit: { paragraph: 1, opening: 'Results' } }] },
    para(2, 'Plants on desks were watered daily.'),
    // an empty paragraph counts in Word's navigation but gives no text
    para(3, ''),
    para(4, 'Growth was higher with light, t(28) = 2.10, p = .45.'),
  ];
  const doc = documentFromBlocks('plants.docx', 'docx', blocks);

  it('joins blocks by a blank line and maps each unit to its stretch of the text', () => {
    expect(doc.source).toBe('Results\n\nPlants on desks were watered daily.\n\nGrowth was higher with light, t(28) = 2.10, p = .45.');
    expect(doc.original?.units.map((u) => [u.paragraph, doc.source.slice(u.start, u.end)])).toEqual([
      [1, 'Results'],
      [2, 'Plants on desks were watered daily.'],
      [4, 'Growth was higher with light, t(28) = 2.10, p = .45.'],
    ]);
    expect(doc.segments.map((s) => [s.kind, s.section])).toEqual([['heading', undefined], ['paragraph', 'Results'], ['paragraph', 'Results']]);
  });

  it('finds the unit of an offset, and the next unit for an offset in the blank line between two', () => {
    const map = doc.original;
    if (!map) throw new Error('no map');
    expect(unitAt(map, 0)?.paragraph).toBe(1);
    expect(unitAt(map, 7)?.paragraph).toBe(1); // the end of "Results" (exclusive) still belongs to it
    expect(unitAt(map, 8)?.paragraph).toBe(2);
    expect(unitAt(map, doc.source.indexOf('Growth'))?.paragraph).toBe(4);
  });

  it('places a finding by paragraph, 1-based character and opening words, and the formats print it', () => {
    const report = checkSource('plants.docx', doc.source, { document: doc });
    const f = report.findings.find((x) => x.level === 'error');
    expect(f?.level).toBe('error');
    const char = 'Growth was higher with light, '.length + 1;
    expect(f?.original).toEqual({ kind: 'paragraph', paragraph: 4, char, opening: 'Growth was higher with light, t(28) …' });
    expect(report.original).toEqual({ kind: 'docx', lines: [{ at: 1, paragraph: 1 }, { at: 3, paragraph: 2 }, { at: 5, paragraph: 4 }] });
    const run = { tool: { name: 'plumbline', version: '0' }, files: [report], failures: [], rules: [] };
    expect(formatHuman(run, { color: false })).toContain(`¶4 (“Growth was higher with light, t(28) …”) char ${char}`);
    expect(formatLines(run)).toContain(`plants.docx ¶4 (“Growth was higher with light, t(28) …”) char ${char}: error significance-follows-from-t`);
  });

  it('places a PDF line by page and line with the words around it', () => {
    const pdf = documentFromBlocks('plants.pdf', 'pdf', [
      { kind: 'paragraph', pieces: [
        { text: 'Growth was higher with light,', unit: { page: 3, line: 11, opening: 'Growth was higher' } },
        { text: 't(28) = 2.10, p = .45, than without.', unit: { page: 3, line: 12, opening: 't(28) = 2.10' } },
      ] },
    ]);
    const f = checkSource('plants.pdf', pdf.source, { document: pdf }).findings.find((x) => x.level === 'error');
    expect(f?.original).toMatchObject({ kind: 'page', page: 3, line: 12 });
    expect(f?.original?.kind === 'page' ? f.original.around : '').toContain('t(28) = 2.10');
  });

  it('cuts an opening after six words or 48 characters', () => {
    expect(openingWords('One two three four five six seven')).toBe('One two three four five six …');
    expect(openingWords('Short one.')).toBe('Short one.');
  });
});
