import { describe, it } from 'vitest';
import { expectSegments, type SegmentCase } from './segments.js';

const cell = (text: string, row: number, column: number, extra: { table?: number; rowSpan?: number; colSpan?: number; at?: string } = {}) => ({
  kind: 'tableCell' as const,
  text,
  table: { table: extra.table ?? 0, row, column, ...(extra.rowSpan ? { rowSpan: extra.rowSpan } : {}), ...(extra.colSpan ? { colSpan: extra.colSpan } : {}) },
  ...(extra.at ? { at: extra.at } : {}),
});

// Invented tables in the shapes PDF-to-Markdown converters emit (one line, <html><body> around).
const cases: SegmentCase[] = [
  {
    name: 'a one-line HTML table inside <html><body>: one cell segment per <th>/<td>, row 0 the header',
    source: 'Intro.\n\n<html><body><table><tr><th>Measure</th><th>t</th><th>df</th><th>p</th></tr><tr><td>Recall</td><td>2.10</td><td>28</td><td>.045</td></tr></table></body></html>\n',
    expect: [
      { kind: 'paragraph', text: 'Intro.' },
      cell('Measure', 0, 0, { at: 'Measure' }),
      cell('t', 0, 1),
      cell('df', 0, 2, { at: 'df' }),
      cell('p', 0, 3),
      cell('Recall', 1, 0, { at: 'Recall' }),
      cell('2.10', 1, 1, { at: '2.10' }),
      cell('28', 1, 2, { at: '28' }),
      cell('.045', 1, 3, { at: '.045' }),
    ],
  },
  {
    name: 'columns are counted after earlier spans; rowSpan and colSpan are given when above one',
    source: '<table><tr><td colspan="2">Invented study</td><td>Notes</td></tr><tr><td rowspan="2">Activity</td><td>P=0.0104</td><td rowspan="2">kept</td></tr><tr><td>t=3.3294</td></tr><tr><td>Row three</td><td colspan=2>wide</td></tr></table>\n',
    expect: [
      cell('Invented study', 0, 0, { colSpan: 2, at: 'Invented study' }),
      cell('Notes', 0, 2),
      cell('Activity', 1, 0, { rowSpan: 2, at: 'Activity' }),
      cell('P=0.0104', 1, 1, { at: 'P=0.0104' }),
      cell('kept', 1, 2, { rowSpan: 2, at: 'kept' }),
      cell('t=3.3294', 2, 1, { at: 't=3.3294' }),
      cell('Row three', 3, 0, { at: 'Row three' }),
      cell('wide', 3, 1, { colSpan: 2, at: 'wide' }),
    ],
  },
  {
    name: 'cell text: character references decoded, <i> dropped, <sup> an exponent mark, <br> a space, each mapped to its source',
    source: '<table><tr><td>t(28) = 2.10, <i>p</i> &lt; .05</td><td>1.1 &times; 10<sup>&minus;5</sup></td><td>first<br>second</td><td>  spread\n  out  </td></tr></table>\n',
    expect: [
      { ...cell('t(28) = 2.10, p < .05', 0, 0, { at: 't(28) = 2.10, <i>p</i> &lt; .05' }), spans: { '<': '&lt;', p: 'p' } },
      { ...cell('1.1 × 10^-5', 0, 1, { at: '1.1 &times; 10<sup>&minus;5' }), spans: { '×': '&times;', '^': '<sup>', '-': '&minus;' } },
      cell('first second', 0, 2, { at: 'first<br>second' }),
      cell('spread out', 0, 3, { at: 'spread\n  out' }),
    ],
  },
  {
    name: 'the table index is shared with Markdown tables, in document order',
    source: '| A | B |\n|---|---|\n| 1 | 2 |\n\n<table><tr><td>html</td></tr></table>\n\n| C |\n|---|\n| 3 |\n',
    expect: [cell('A', 0, 0), cell('B', 0, 1), cell('1', 1, 0), cell('2', 1, 1), cell('html', 0, 0, { table: 1 }), cell('C', 0, 0, { table: 2 }), cell('3', 1, 0, { table: 2 })],
  },
  {
    name: 'a table cut by blank lines (each piece its own HTML block) goes on as one table',
    source: '<table><tr><td>first</td></tr>\n\n<tr><td>second</td></tr></table>\n\nAfter.\n',
    expect: [cell('first', 0, 0), cell('second', 1, 0), { kind: 'paragraph', text: 'After.' }],
  },
  {
    name: 'a <caption> is a paragraph marked as the caption of its table',
    source: '<table><caption>Table 3. Invented ratings</caption><tr><td>x</td></tr></table>\n',
    expect: [{ kind: 'paragraph', text: 'Table 3. Invented ratings', legendOf: { table: 0, role: 'caption' }, at: 'Table 3. Invented ratings' }, cell('x', 0, 0)],
  },
  {
    name: 'HTML without table markup is still not prose',
    source: '<div>t(28) = 2.10, p = .045</div>\n\nText.\n',
    expect: [{ kind: 'paragraph', text: 'Text.' }],
  },
];

describe('HTML tables inside Markdown', () => {
  it.each(cases)('$name', (c) => {
    expectSegments(c);
  });
});
