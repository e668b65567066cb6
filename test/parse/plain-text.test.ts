import { describe, it } from 'vitest';
import { expectSegments, type SegmentCase } from './segments.js';

const cell = (text: string, row: number, column: number, extra: { table?: number; colSpan?: number; at?: string; section?: string } = {}) => ({
  kind: 'tableCell' as const,
  text,
  table: { table: extra.table ?? 0, row, column, ...(extra.colSpan ? { colSpan: extra.colSpan } : {}) },
  ...(extra.at ? { at: extra.at } : {}),
  ...(extra.section ? { section: extra.section } : {}),
});

// All text invented, in the shapes text converted from XML, LaTeX and PDF takes.
const tables: SegmentCase[] = [
  {
    name: 'rows with " | " between cells: a table, not a paragraph; a leading bar on one row is an empty first cell',
    path: 'a.txt',
    source: 'Table 1. Invented fatigue ratings by desk.\n | Standing | Seated | Related t-value (df = 31) | p-value(2-t)\nMorning | 2.10 (0.50) | 2.30 (0.61) | \u22121.60 | 0.12\nAfternoon | 3.40 (0.72) | 3.95 (0.70) | \u22122.77 | 0.009\n',
    expect: [
      { kind: 'text', text: 'Table 1. Invented fatigue ratings by desk.', legendOf: { table: 0, role: 'caption' } },
      cell('Standing', 0, 1, { at: 'Standing' }),
      cell('Seated', 0, 2),
      cell('Related t-value (df = 31)', 0, 3, { at: 'Related t-value (df = 31)' }),
      cell('p-value(2-t)', 0, 4),
      cell('Morning', 1, 0),
      cell('2.10 (0.50)', 1, 1, { at: '2.10 (0.50)' }),
      cell('2.30 (0.61)', 1, 2),
      { ...cell('-1.60', 1, 3, { at: '\u22121.60' }) },
      cell('0.12', 1, 4, { at: '0.12' }),
      cell('Afternoon', 2, 0),
      cell('3.40 (0.72)', 2, 1),
      cell('3.95 (0.70)', 2, 2),
      cell('-2.77', 2, 3),
      cell('0.009', 2, 4, { at: '0.009' }),
    ],
  },
  {
    name: 'bars opening and closing every row are borders; a rule row is not a row; Pr(>|t|) keeps its bars',
    path: 'a.txt',
    source: '| Term | Estimate | Pr(>|t|) |\n|---|---|---|\n| Desk | 0.42 | .031 |\n| Hour | 0.10 | .440 |\n',
    expect: [
      cell('Term', 0, 0),
      cell('Estimate', 0, 1),
      cell('Pr(>|t|)', 0, 2, { at: 'Pr(>|t|)' }),
      cell('Desk', 1, 0),
      cell('0.42', 1, 1, { at: '0.42' }),
      cell('.031', 1, 2, { at: '.031' }),
      cell('Hour', 2, 0),
      cell('0.10', 2, 1),
      cell('.440', 2, 2),
    ],
  },
  {
    name: 'a short group label between " | " rows is a one-cell row of the same table',
    path: 'a.txt',
    source: 'Scale | M | SD\nStudy 1\nFatigue | 3.10 | 0.52\nStudy 2\nFatigue | 2.95 | 0.49\n',
    expect: [cell('Scale', 0, 0), cell('M', 0, 1), cell('SD', 0, 2), cell('Study 1', 1, 0), cell('Fatigue', 2, 0), cell('3.10', 2, 1), cell('0.52', 2, 2), cell('Study 2', 3, 0), cell('Fatigue', 4, 0), cell('2.95', 4, 1), cell('0.49', 4, 2)],
  },
  {
    name: 'columns aligned with spaces (header and two body lines): right-aligned numbers fall in their header’s column',
    path: 'a.txt',
    source: 'Measure        t      df     p\nRecall      2.10      28  .045\nSpeed      -1.03      41  .310\n',
    expect: [
      cell('Measure', 0, 0),
      cell('t', 0, 1),
      cell('df', 0, 2),
      cell('p', 0, 3),
      cell('Recall', 1, 0),
      cell('2.10', 1, 1, { at: '2.10' }),
      cell('28', 1, 2, { at: '28' }),
      cell('.045', 1, 3, { at: '.045' }),
      cell('Speed', 2, 0),
      cell('-1.03', 2, 1, { at: '-1.03' }),
      cell('41', 2, 2),
      cell('.310', 2, 3),
    ],
  },
  {
    name: 'an aligned header word over two columns spans them (colSpan)',
    path: 'a.txt',
    source: '              Standing desk    Seated desk\nGroup         M       SD       M       SD\nNurses        3.10    0.52     3.62    0.61\nClerks        2.95    0.49     3.40    0.58\n',
    expect: [
      cell('Standing desk', 0, 1, { colSpan: 2, at: 'Standing desk' }),
      cell('Seated desk', 0, 3, { colSpan: 2, at: 'Seated desk' }),
      cell('Group', 1, 0),
      cell('M', 1, 1),
      cell('SD', 1, 2),
      cell('M', 1, 3),
      cell('SD', 1, 4),
      cell('Nurses', 2, 0),
      cell('3.10', 2, 1),
      cell('0.52', 2, 2),
      cell('3.62', 2, 3),
      cell('0.61', 2, 4),
      cell('Clerks', 3, 0),
      cell('2.95', 3, 1),
      cell('0.49', 3, 2),
      cell('3.40', 3, 3),
      cell('0.58', 3, 4),
    ],
  },
  {
    name: 'tab-separated rows are a table',
    path: 'a.txt',
    source: 'Measure\tt\tdf\tp\nRecall\t2.10\t28\t.045\nSpeed\t-1.03\t41\t.310\n',
    expect: [cell('Measure', 0, 0), cell('t', 0, 1), cell('df', 0, 2), cell('p', 0, 3), cell('Recall', 1, 0), cell('2.10', 1, 1), cell('28', 1, 2), cell('.045', 1, 3), cell('Speed', 2, 0), cell('-1.03', 2, 1), cell('41', 2, 2), cell('.310', 2, 3)],
  },
  {
    name: 'prose typed with two spaces after each full stop is not a table, even where the gaps line up',
    path: 'a.txt',
    source: 'The ward was quiet.  Staff rated it well.\nThe desks were new.  Nurses liked them.\nThe study ran long.  It ended in May.\n',
    expect: [{ kind: 'text', text: 'The ward was quiet.  Staff rated it well. The desks were new.  Nurses liked them. The study ran long.  It ended in May.' }],
  },
  {
    name: 'a single line with " | " is prose',
    path: 'a.txt',
    source: 'Choose A | B as you like.\n',
    expect: [{ kind: 'text', text: 'Choose A | B as you like.' }],
  },
];

const L1 = 'Forty invented nurses used standing desks for four weeks and rated their afternoon fatigue on a ten-point scale; ratings fell in the second week, t(39) = 2.41, p = .021, as planned.';
const L2 = 'Seated colleagues rated their fatigue the same way over the same weeks, and their ratings did not change in any week of the invented study, t(39) = 0.52, p = .606.';
const W = 'Fatigue fell over the weeks of the invented trial and the nurses said the desks were easy to use';

const paragraphs: SegmentCase[] = [
  {
    name: 'lines longer than 160 characters are paragraphs of their own; a title line above them is a heading and their section',
    path: 'a.txt',
    source: `Results\n${L1}\n${L2}\n`,
    expect: [
      { kind: 'heading', text: 'Results', at: 'Results' },
      { kind: 'text', text: L1, section: 'Results', at: L1 },
      { kind: 'text', text: L2, section: 'Results', at: L2 },
    ],
  },
  {
    name: 'a long line cut mid-sentence goes on with the lowercase line below it',
    path: 'a.txt',
    source: `${L1.slice(0, 169)}\n${L1.slice(170)}\n`,
    expect: [{ kind: 'text', text: L1, spans: { ', as planned': ',\nas planned' } }],
  },
  {
    name: 'headings: numbered, several words, stacked; a short line inside a wrapped paragraph is not one',
    path: 'a.txt',
    source: '2. Method\n2.1 Statistical analysis\nWe compared the desks with paired tests.\n\nGeneral Discussion\n\nThe desks helped.\nThe results were clear.\nNot a heading\nbecause this goes on.\n',
    expect: [
      { kind: 'heading', text: '2. Method' },
      { kind: 'heading', text: '2.1 Statistical analysis' },
      { kind: 'text', text: 'We compared the desks with paired tests.', section: '2.1 Statistical analysis' },
      { kind: 'heading', text: 'General Discussion' },
      { kind: 'text', text: 'The desks helped. The results were clear. Not a heading because this goes on.', section: 'General Discussion' },
    ],
  },
  {
    name: 'a heading repeated once per study stays a heading (it never cuts a sentence)',
    path: 'a.txt',
    source: 'Study 1\n\nResults\nFatigue fell in the first study.\n\nStudy 2\n\nResults\nFatigue fell again in the second study.\n\nStudy 3\n\nResults\nFatigue did not fall in the third study.\n',
    expect: [
      { kind: 'heading', text: 'Study 1' },
      { kind: 'heading', text: 'Results' },
      { kind: 'text', text: 'Fatigue fell in the first study.', section: 'Results' },
      { kind: 'heading', text: 'Study 2' },
      { kind: 'heading', text: 'Results' },
      { kind: 'text', text: 'Fatigue fell again in the second study.', section: 'Results' },
      { kind: 'heading', text: 'Study 3' },
      { kind: 'heading', text: 'Results' },
      { kind: 'text', text: 'Fatigue did not fall in the third study.', section: 'Results' },
    ],
  },
  {
    name: 'running heads and a lone page number are dropped, and the paragraph they cut is joined (a hyphen across the break undone)',
    path: 'a.txt',
    source: `Invented Desks and Fatigue   3\n\n${W}, and the ward\n\n4\n\nmanager agreed that the desks stayed. The second week brought a clear change,\nInvented Desks and Fatigue   4\nt(39) = 2.41, p = .021.\n\nInvented Desks and Fatigue   5\n\nAll went well. Fatigue ratings were recorded every after-\n\nInvented Desks and Fatigue   6\n\nnoon on paper.\n`,
    expect: [
      {
        kind: 'text',
        text: `${W}, and the ward manager agreed that the desks stayed. The second week brought a clear change, t(39) = 2.41, p = .021.`,
        at: `${W}, and the ward\n\n4\n\nmanager agreed that the desks stayed. The second week brought a clear change,\nInvented Desks and Fatigue   4\nt(39) = 2.41, p = .021.`,
        spans: { 't(39) = 2.41': 't(39) = 2.41', 'ward manager': 'ward\n\n4\n\nmanager' },
      },
      { kind: 'text', text: 'All went well. Fatigue ratings were recorded every afternoon on paper.', spans: { afternoon: 'after-\n\nInvented Desks and Fatigue   6\n\nnoon' } },
    ],
  },
  {
    name: 'a running head after a lone page number is dropped, and the sentence it cut is joined',
    path: 'a.txt',
    source: 'Staff in the seated group\n\n2\nINVENTED DESK TRIAL\n\nrated fatigue daily.\n\nStaff in the standing group\n\n3\nINVENTED DESK TRIAL\n\nrated it lower.\n\nStaff in the third group\n\n4\nINVENTED DESK TRIAL\n\nrated it too.\n',
    expect: [
      { kind: 'text', text: 'Staff in the seated group rated fatigue daily.' },
      { kind: 'text', text: 'Staff in the standing group rated it lower.' },
      { kind: 'text', text: 'Staff in the third group rated it too.' },
    ],
  },
  {
    name: 'a result\'s wrapped line, repeated with only its digits changed where results are worded alike, is text and not a running head',
    path: 'a.txt',
    source: [1, 2, 3]
      .map((k) => `Fatigue in week ${k} was higher in the seated group (M = 3.${k}, SD = 0.7${k}) than in the standing group\n(M = 2.5${k}, SD = 0.71), t(52) =\n0.7${k}, p = .43${k}.`)
      .join('\n\n'),
    expect: [1, 2, 3].map((k) => ({ kind: 'text' as const, text: `Fatigue in week ${k} was higher in the seated group (M = 3.${k}, SD = 0.7${k}) than in the standing group (M = 2.5${k}, SD = 0.71), t(52) = 0.7${k}, p = .43${k}.` })),
  },
  {
    name: 'line numbers in the margin are dropped; a numbered empty line is a blank line',
    path: 'a.txt',
    source: ['Invented Desks', '', 'Method', 'Forty nurses took part in the invented', 'trial and rated fatigue daily.', '', 'Results', 'Fatigue fell, t(39) = 2.41, p = .021,', 'in the second week.', '', 'Discussion', 'The desks helped the nurses.', 'They liked them.']
      .map((l, i) => `${String(i + 1).padStart(3)}${l ? `  ${l}` : ''}`)
      .join('\n'),
    expect: [
      { kind: 'heading', text: 'Invented Desks' },
      { kind: 'heading', text: 'Method' },
      { kind: 'text', text: 'Forty nurses took part in the invented trial and rated fatigue daily.', section: 'Method', spans: { Forty: 'Forty', ' trial': '\n  5  trial' } },
      { kind: 'heading', text: 'Results' },
      { kind: 'text', text: 'Fatigue fell, t(39) = 2.41, p = .021, in the second week.', section: 'Results', at: 'Fatigue fell, t(39) = 2.41, p = .021,\n  9  in the second week.' },
      { kind: 'heading', text: 'Discussion' },
      { kind: 'text', text: 'The desks helped the nurses. They liked them.', section: 'Discussion' },
    ],
  },
  {
    name: 'hard-wrapped text still joins its lines and undoes end-of-line hyphenation (as before)',
    path: 'a.txt',
    source: 'The effect was signifi-\ncant, t(28) = 2.10,\np = .045, as expected.\n\nNext paragraph.\n',
    expect: [
      { kind: 'text', text: 'The effect was significant, t(28) = 2.10, p = .045, as expected.', spans: { significant: 'signifi-\ncant' } },
      { kind: 'text', text: 'Next paragraph.' },
    ],
  },
  {
    name: 'aligned columns with dashed rules above, under and below the header, a ligature in a row label (as wide as its letters) and a d column after p',
    path: 'a.txt',
    // laid out as the PDF page shows it: each column at a fixed display column, "ﬀ" two letters wide
    source: [
      ['', 'Serif (n = 18)', 'Sans (n = 31)', 't', 'df', 'p', 'd'],
      ['-'.repeat(78)],
      ['Speed', '189.3 (36.2)', '147.4 (13.4)', '4.72', '19.7', '< .001', '1.73'],
      ['Rated e\uFB00ort', '2.93 (1.01)', '3.57 (0.59)', '-2.48', '23.9', '.021', '-0.84'],
      ['-'.repeat(78)],
    ]
      .map((cells) => {
        const at = [2, 18, 34, 50, 58, 66, 74];
        let line = '';
        let extra = 0; // display columns the ligatures so far take beyond their one character
        cells.forEach((c, i) => {
          line = line.padEnd((at[i] as number) - extra) + c;
          if (c.includes('\uFB00')) extra += 1;
        });
        return line;
      })
      .join('\n'),
    expect: [
      cell('Serif (n = 18)', 0, 1),
      cell('Sans (n = 31)', 0, 2),
      cell('t', 0, 3),
      cell('df', 0, 4),
      cell('p', 0, 5),
      cell('d', 0, 6),
      cell('Speed', 1, 0),
      cell('189.3 (36.2)', 1, 1),
      cell('147.4 (13.4)', 1, 2),
      cell('4.72', 1, 3),
      cell('19.7', 1, 4),
      cell('< .001', 1, 5),
      cell('1.73', 1, 6),
      cell('Rated e\uFB00ort', 2, 0),
      cell('2.93 (1.01)', 2, 1),
      cell('3.57 (0.59)', 2, 2),
      cell('-2.48', 2, 3),
      cell('23.9', 2, 4),
      cell('.021', 2, 5),
      cell('-0.84', 2, 6),
    ],
  },
];

describe('plain-text tables', () => {
  it.each(tables)('$name', (c) => {
    expectSegments(c);
  });
});

describe('plain-text paragraphs, headings and page furniture', () => {
  it.each(paragraphs)('$name', (c) => {
    expectSegments(c);
  });
});
