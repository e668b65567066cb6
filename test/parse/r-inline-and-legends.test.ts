import { describe, it } from 'vitest';
import { expectSegments, type SegmentCase } from './segments.js';

const rInline: SegmentCase[] = [
  {
    name: 'an inline R call with a literal number reads as that number at its source place',
    path: 'a.Rmd',
    source: 'Fatigue fell, t(28) = `r apa_num(1.98)`, p = `r printnum(0.032)`.\n',
    expect: [{ kind: 'paragraph', text: 'Fatigue fell, t(28) = 1.98, p = 0.032.', spans: { '1.98': '1.98', '0.032': '0.032', '= 1.98,': '= `r apa_num(1.98)`,' } }],
  },
  {
    name: 'named literal arguments are allowed; a bare literal, a Quarto {r} call and a namespace are read too',
    path: 'a.qmd',
    source: 'Means were `r format(12.50, nsmall = 2)`, `r 1.98`, `{r} 3.5` and `r papaja::apa_num(-2.5, gt1 = FALSE)`.\n',
    expect: [{ kind: 'paragraph', text: 'Means were 12.50, 1.98, 3.5 and -2.5.', spans: { '12.50': '12.50', '-2.5': '-2.5' } }],
  },
  {
    name: 'an inline R call wrapped to the next line is read too',
    path: 'a.Rmd',
    source: 'Mood (SD = `r\napa_num(1.27)`) fell, p = `r\nfmt_p(0.009)`.\n',
    expect: [{ kind: 'paragraph', text: 'Mood (SD = 1.27) fell, p = 0.009.', spans: { '1.27': '1.27', '0.009': '0.009' } }],
  },
  {
    name: 'a call that reads a variable or nests a call stays code, as inline code always was',
    path: 'a.Rmd',
    source: 'So t(28) = `r apa_num(tval)` and `r round(mean(x), 2)`.\n',
    expect: [
      { kind: 'paragraph', text: 'So t(28) =   and  .' },
      { kind: 'code', text: 'r apa_num(tval)' },
      { kind: 'code', text: 'r round(mean(x), 2)' },
    ],
  },
  {
    name: 'in plain Markdown (nothing knits it) inline R stays code',
    path: 'a.md',
    source: 'So t(28) = `r 1.98`.\n',
    expect: [
      { kind: 'paragraph', text: 'So t(28) =  .' },
      { kind: 'code', text: 'r 1.98' },
    ],
  },
];

const legends: SegmentCase[] = [
  {
    name: 'Markdown: "Table N" paragraph before is the caption; Note, a star legend and a superscript mark after are notes; prose after them is not',
    source: 'Table 1. Invented fatigue by desk.\n\n| Desk | t |\n|---|---|\n| Standing | 2.41 |\n\nNote. Paired tests.\n\n*p < .05, **p < .01\n\n<sup>a</sup> Two nurses left.\n\nThe desks helped.\n',
    expect: [
      { kind: 'paragraph', text: 'Table 1. Invented fatigue by desk.', legendOf: { table: 0, role: 'caption' } },
      { kind: 'tableCell', text: 'Desk', table: { table: 0, row: 0, column: 0 } },
      { kind: 'tableCell', text: 't', table: { table: 0, row: 0, column: 1 } },
      { kind: 'tableCell', text: 'Standing', table: { table: 0, row: 1, column: 0 } },
      { kind: 'tableCell', text: '2.41', table: { table: 0, row: 1, column: 1 } },
      { kind: 'paragraph', text: 'Note. Paired tests.', legendOf: { table: 0, role: 'note' } },
      { kind: 'paragraph', text: '*p < .05, **p < .01', legendOf: { table: 0, role: 'note' } },
      { kind: 'paragraph', text: '^a Two nurses left.', legendOf: { table: 0, role: 'note' }, at: '<sup>a</sup> Two nurses left.' },
      { kind: 'paragraph', text: 'The desks helped.' },
    ],
  },
  {
    name: 'a paragraph before a table that does not start with "Table N" is no caption; emphasis is no footnote mark',
    source: 'We used these:\n\n| A |\n|---|\n| 1 |\n\n*Results* came after.\n',
    expect: [
      { kind: 'paragraph', text: 'We used these:' },
      { kind: 'tableCell', text: 'A', table: { table: 0, row: 0, column: 0 } },
      { kind: 'tableCell', text: '1', table: { table: 0, row: 1, column: 0 } },
      { kind: 'paragraph', text: 'Results came after.' },
    ],
  },
  {
    name: 'a Note line GFM read as the last row of its table is the table’s note',
    source: '| A |\n|---|\n| 1 |\nNote. Invented.\n',
    expect: [
      { kind: 'tableCell', text: 'A', table: { table: 0, row: 0, column: 0 } },
      { kind: 'tableCell', text: '1', table: { table: 0, row: 1, column: 0 } },
      { kind: 'tableCell', text: 'Note. Invented.', table: { table: 0, row: 2, column: 0 }, legendOf: { table: 0, role: 'note' } },
    ],
  },
  {
    name: 'HTML table: the caption above and the note below are marked with its (shared) index',
    source: '| A |\n|---|\n| 1 |\n\nTable 2 Invented results of t-tests (df = 5)\n\n<html><body><table><tr><td>t=3.31</td></tr></table></body></html>\n\nNote: two-tailed.\n',
    expect: [
      { kind: 'tableCell', text: 'A', table: { table: 0, row: 0, column: 0 } },
      { kind: 'tableCell', text: '1', table: { table: 0, row: 1, column: 0 } },
      { kind: 'paragraph', text: 'Table 2 Invented results of t-tests (df = 5)', legendOf: { table: 1, role: 'caption' } },
      { kind: 'tableCell', text: 't=3.31', table: { table: 1, row: 0, column: 0 } },
      { kind: 'paragraph', text: 'Note: two-tailed.', legendOf: { table: 1, role: 'note' } },
    ],
  },
  {
    name: 'plain text: a bare "Note:" line takes the paragraph below it along; a footnote mark starts a note; a glued "Table1" caption counts',
    path: 'a.txt',
    source: `Table1Invented ratings\nGroup | M\nNurses | 3.10\nClerks | 2.95\nNote:\n${'Ratings were given on an invented ten-point scale by every nurse and clerk at the end of each afternoon shift, and two ratings were missing from the first week of the study.'}\n* Two clerks left.\n\nThe study ended.\n`,
    expect: [
      { kind: 'text', text: 'Table1Invented ratings', legendOf: { table: 0, role: 'caption' } },
      { kind: 'tableCell', text: 'Group', table: { table: 0, row: 0, column: 0 } },
      { kind: 'tableCell', text: 'M', table: { table: 0, row: 0, column: 1 } },
      { kind: 'tableCell', text: 'Nurses', table: { table: 0, row: 1, column: 0 } },
      { kind: 'tableCell', text: '3.10', table: { table: 0, row: 1, column: 1 } },
      { kind: 'tableCell', text: 'Clerks', table: { table: 0, row: 2, column: 0 } },
      { kind: 'tableCell', text: '2.95', table: { table: 0, row: 2, column: 1 } },
      { kind: 'text', text: 'Note:', legendOf: { table: 0, role: 'note' } },
      {
        kind: 'text',
        text: 'Ratings were given on an invented ten-point scale by every nurse and clerk at the end of each afternoon shift, and two ratings were missing from the first week of the study.',
        legendOf: { table: 0, role: 'note' },
      },
      { kind: 'text', text: '* Two clerks left.', legendOf: { table: 0, role: 'note' } },
      { kind: 'text', text: 'The study ended.' },
    ],
  },
];

describe('inline R with literal numbers (R Markdown, Quarto)', () => {
  it.each(rInline)('$name', (c) => {
    expectSegments(c);
  });
});

describe('table captions and notes', () => {
  it.each(legends)('$name', (c) => {
    expectSegments(c);
  });
});
