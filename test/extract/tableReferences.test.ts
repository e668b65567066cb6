import { describe, expect, it } from 'vitest';
import { extract } from '../../src/extract/index.js';
import { parseDocument } from '../../src/parse/index.js';

/** Tables named in prose, their captions' words, and their labels named where they are named. Invented text. */
const read = (source: string) => extract(parseDocument('x.md', source));

const table = (caption: string) => `${caption}

| Measure | Quiet (n = 5), M (SD) | Music (n = 5), M (SD) |
|---|---|---|
| Recall | 5.34 (1.12) | 7.72 (1.10) |
| Accuracy | 60.2 (5.1) | 61.0 (4.9) |
`;

describe('tables named in prose', () => {
  it('resolves "Table 2" to the table whose caption gives that number, in its sentence', () => {
    const x = read(`${table('Table 1. Scores.')}\n${table('Table 2. Scores at follow-up by room.')}\nAs before. Recall differed (see Table 2).\n`);
    expect(x.tableCaptions.map((c) => [c.name, c.words])).toEqual([
      ['Table 1', []],
      ['Table 2', ['follow-up', 'room']],
    ]);
    const second = x.tableCaptions[1]?.table;
    expect(x.tableReferences.map((r) => [r.printed, r.table, r.sentence, r.plural])).toEqual([['Table 2', second, 1, false]]);
  });
  it('leaves a plural, a number no caption gives and a number two captions give unresolved', () => {
    const x = read(`${table('Table 1. Scores.')}\n${table('Table 1. Scores again.')}\nSee Tables 1 and 2, Table 3 and Table 1.\n`);
    expect(x.tableReferences.map((r) => [r.printed, r.table, r.plural])).toEqual([
      ['Tables 1', undefined, true],
      ['Table 3', undefined, false],
      ['Table 1', undefined, false],
    ]);
  });
  it('reads "Table S1" and "Tab. 4", and not a caption or a cell naming itself', () => {
    const x = read(`${table('Table S1. Scores.')}\nSee Table S1 and Tab. 4.\n`);
    expect(x.tableReferences.map((r) => r.printed)).toEqual(['Table S1', 'Tab. 4']);
    expect(x.tableReferences[0]?.table).toBe(x.tableCaptions[0]?.table);
  });
  it('finds the labels of a named table in the sentences of the paragraph that names it, whole words only', () => {
    const x = read(`${table('Table 1. Scores.')}\nTable 1 gives the scores. Recall differed, F(1, 8) = 11.6, p = .009. Recalled accuracy did not.\n`);
    expect(x.tableLabelMentions.map((m) => [m.label, m.sentence])).toEqual([
      ['recall', 1],
      ['accuracy', 2],
    ]);
  });
});
