import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { ruleTable } from './table.js';

// Groups printed in a table, tied to an F that names the table. Invented manuscripts.
// The recall numbers are the three groups of five of the NIST/SEMATECH e-Handbook one-way ANOVA
// example (section 7.4.3, from memory; F(2, 12) = 9.59, confirmed by scipy.stats.f_oneway in
// test/stats/oneWayAnova.test.ts): with means and SDs to two decimals the F lies in 9.436–9.723,
// so 12.59 cannot be given by them. The accuracy row is invented: its F is 0.0717 (by hand in
// python3), p = .93 (scipy.stats.f.sf).

/** A long layout, one group per row: Room | n | M | SD. */
const longTable = (caption = 'Table 2. Recall by room.') => `${caption}

| Room | n | M | SD |
|---|---|---|---|
| Quiet | 5 | 5.34 | 1.12 |
| Music | 5 | 7.72 | 1.10 |
| Noise | 5 | 8.56 | 1.38 |
`;

/** A long layout printing mean and SD in one cell: Room | n | M (SD). */
const longCellTable = `Table 4. Recall by room.

| Room | n | M (SD) |
|---|---|---|
| Quiet | 5 | 5.34 (1.12) |
| Music | 5 | 7.72 (1.10) |
| Noise | 5 | 8.56 (1.38) |
`;

/** A wide layout, one measure per row, a column per group with its n in the header. */
const wideTable = `Table 1. Means and standard deviations by room.

| Measure | Quiet (n = 5), M (SD) | Music (n = 5), M (SD) | Noise (n = 5), M (SD) |
|---|---|---|---|
| Recall | 5.34 (1.12) | 7.72 (1.10) | 8.56 (1.38) |
| Accuracy | 60.2 (5.1) | 61.0 (4.9) | 59.8 (5.3) |
`;

/** A long layout with two measures, each a block of rows: Measure | Room | n | M | SD. */
const blockTable = `Table 3. Scores by room.

| Measure | Room | n | M | SD |
|---|---|---|---|---|
| Recall | Quiet | 5 | 5.34 | 1.12 |
| | Music | 5 | 7.72 | 1.10 |
| | Noise | 5 | 8.56 | 1.38 |
| Accuracy | Quiet | 5 | 60.2 | 5.1 |
| | Music | 5 | 61.0 | 4.9 |
| | Noise | 5 | 59.8 | 5.3 |
`;

const doc = (...blocks: string[]) => `# Results\n\n${blocks.join('\n\n')}\n`;

ruleTable('f-follows-from-group-summaries', [
  { name: 'a long table named in the F\'s sentence, one set of groups, the caption\'s outcome named: tied', markdown: doc(longTable(), 'Recall differed by room (Table 2), F(2, 12) = 12.59, p = .001.'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: 'the same with the F the table gives: accepted', markdown: doc(longTable(), 'Recall differed by room (Table 2), F(2, 12) = 9.59, p = .003.'), expect: [] },
  { name: 'the table named in another sentence of the F\'s paragraph', markdown: doc(longTable(), 'Table 2 gives the recall of each room. Recall differed by room, F(2, 12) = 12.59, p = .001.'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: 'a wide table: the row whose label the F\'s sentence names (recall) is tied', markdown: doc(wideTable, 'Recall differed by room (see Table 1), F(2, 12) = 12.59, p = .001.'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: 'a wide table: the accuracy row gives the accuracy F', markdown: doc(wideTable, 'Accuracy did not differ by room (see Table 1), F(2, 12) = 0.07, p = .93.'), expect: [] },
  { name: 'a wide table: the recall row cannot give that F', markdown: doc(wideTable, 'Recall did not differ by room (see Table 1), F(2, 12) = 0.07, p = .93.'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: 'a table of blocks: the block the F names is tied', markdown: doc(blockTable, 'Recall differed by room (Table 3), F(2, 12) = 12.59, p = .001.'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: 'a long table printing M (SD) in one cell, its n in a column of its own: tied', markdown: doc(longCellTable, 'Recall differed by room (Table 4), F(2, 12) = 12.59, p = .001.'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: 'the same with the F the table gives: accepted', markdown: doc(longCellTable, 'Recall differed by room (Table 4), F(2, 12) = 9.59, p = .003.'), expect: [] },
  { name: 'refused: two outcome sets and the F names neither', markdown: doc(wideTable, 'The rooms differed (see Table 1), F(2, 12) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: two outcome sets and the F\'s sentence names both', markdown: doc(blockTable, 'Recall, unlike accuracy, differed by room (Table 3), F(2, 12) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: the dfs are not (k − 1, N − k) of the table\'s groups', markdown: doc(longTable(), 'Recall differed by room (Table 2), F(2, 15) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: df1 counts other groups', markdown: doc(longTable(), 'Recall differed by room (Table 2), F(3, 12) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: no dfs printed', markdown: doc(longTable(), 'Recall differed by room (Table 2), F = 12.59, p = .001.'), expect: [] },
  { name: 'refused: an ANCOVA named in the F\'s sentence', markdown: doc(longTable(), 'An ANCOVA showed that recall differed by room (Table 2), F(2, 12) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: ANCOVAs named earlier in the paragraph', markdown: doc(longTable(), 'We computed analyses of covariance (ANCOVAs) with age as covariate. Recall differed by room (Table 2), F(2, 12) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: a repeated-measures analysis', markdown: doc(longTable(), 'In a repeated-measures ANOVA recall differed by room (Table 2), F(2, 12) = 12.59, p = .001.'), expect: [] },
  { name: "refused: Welch's ANOVA", markdown: doc(longTable(), "Welch's ANOVA showed that recall differed by room (Table 2), F(2, 12) = 12.59, p = .001."), expect: [] },
  { name: 'refused: the table is not named', markdown: doc(longTable(), 'Recall differed by room, F(2, 12) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: a table no caption numbers so', markdown: doc(longTable(), 'Recall differed by room (Table 4), F(2, 12) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: several tables named at once', markdown: doc(longTable(), 'Recall differed by room (Tables 2 and 3), F(2, 12) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: the paragraph names two tables', markdown: doc(longTable(), wideTable, 'Table 1 and Table 2 give the scores. Recall differed by room, F(2, 12) = 12.59, p = .001.'), expect: [] },
  { name: 'refused: a second test of means in the F\'s sentence', markdown: doc(longTable(), 'Recall differed by room (Table 2), F(2, 12) = 12.59, p = .001, and so did accuracy, F(2, 12) = 3.10, p = .08.'), expect: [] },
  { name: 'refused: named by the paragraph, which reports another F', markdown: doc(longTable(), 'Table 2 gives the recall of each room. Recall differed by room, F(2, 12) = 12.59, p = .001. Accuracy did not, F(2, 12) = 0.07, p = .93.'), expect: [] },
  { name: 'refused: groups printed in the paragraph\'s prose come first (here without their n, so nothing is recomputed)', markdown: doc(longTable(), 'Recall was 5.3 (SD = 1.1) in the quiet room and 7.7 (SD = 1.1) with music. In all, recall differed by room (Table 2), F(2, 12) = 12.59, p = .001.'), expect: [] },
]);

describe('a table tie without certainty speaks as a note, and its basis is recorded', () => {
  const check = (markdown: string) => checkSource('case.md', markdown, {});
  it('notes an F whose sentence shares no word with the caption of the one set it names', () => {
    const r = check(doc(longTable('Table 2. Descriptive statistics.'), 'The rooms differed (Table 2), F(2, 12) = 12.59, p = .001.'));
    const found = r.findings.filter((f) => f.ruleId === 'f-follows-from-group-summaries');
    expect(found.map((f) => `${f.level} ${f.messageId}`)).toEqual(['note mismatch']);
    expect(found[0]?.message).toContain('shares no word with the caption of Table 2');
  });
  it('notes an F whose table\'s caption names what its sentence does not (a time)', () => {
    const r = check(doc(wideTable.replace('by room.', 'by room at baseline.'), 'Recall differed by room (see Table 1), F(2, 12) = 12.59, p = .001.'));
    const found = r.findings.filter((f) => f.ruleId === 'f-follows-from-group-summaries');
    expect(found.map((f) => `${f.level} ${f.messageId}`)).toEqual(['note mismatch']);
    expect(found[0]?.message).toContain('names "baseline", which the F\'s sentence does not');
    const one = check(doc(longTable('Table 2. Recall by room at baseline.'), 'At follow-up recall differed by room (Table 2), F(2, 12) = 12.59, p = .001.'));
    expect(one.findings.filter((f) => f.ruleId === 'f-follows-from-group-summaries').map((f) => `${f.level} ${f.messageId}`)).toEqual(['note mismatch']);
  });
  it('keeps the caption words a one-set table\'s tie rests on', () => {
    const r = check(doc(longTable(), 'Recall differed by room (Table 2), F(2, 12) = 12.59, p = .001.'));
    expect(r.statistics?.find((s) => s.kind === 'F')?.groups?.tableTie?.outcome).toEqual({ by: 'caption', words: ['recall', 'room'] });
  });
  it('records the table, the words naming it and the outcome named, in the F\'s record', () => {
    const r = check(doc(wideTable, 'Recall differed by room (see Table 1), F(2, 12) = 12.59, p = .001.'));
    const groups = r.statistics?.find((s) => s.kind === 'F')?.groups;
    expect(groups?.scope).toBe('table');
    expect(groups?.certain).toBe(true);
    expect(groups?.tableTie?.name).toBe('Table 1');
    expect(groups?.tableTie?.named).toMatchObject({ printed: 'Table 1', basis: 'sentence' });
    expect(groups?.tableTie?.outcome).toEqual({ by: 'label', words: ['Recall'] });
    expect(groups?.groups.map((g) => g.printed)).toEqual(['Quiet: 5.34 (1.12)', 'Music: 7.72 (1.10)', 'Noise: 8.56 (1.38)']);
  });
  it('names the table in the finding and points to the words that named it', () => {
    const r = check(doc(longTable(), 'Recall differed by room (Table 2), F(2, 12) = 12.59, p = .001.'));
    const f = r.findings.find((x) => x.ruleId === 'f-follows-from-group-summaries');
    expect(f?.level).toBe('warning');
    expect(f?.message).toContain('3 groups printed in Table 2');
    expect(f?.related?.[0]?.message).toBe('the table named: Table 2');
  });
});
