import { describe, it } from 'vitest';
import { expectSegments, type SegmentCase } from './segments.js';

// Invented sentences in the shape PDF-to-Markdown converters write: every TeX token apart.
const cases: SegmentCase[] = [
  {
    name: 'spaced digits join around the decimal point; a full-width comma and brackets read as ASCII',
    source: 'Recall rose （ $t ( 8 2 ) = 3 . 0 3$ ， $p = . 0 0 3$ ）.\n',
    expect: [
      {
        kind: 'paragraph',
        text: 'Recall rose ( t (82) = 3.03 , p = .003 ).',
        at: 'Recall rose （ $t ( 8 2 ) = 3 . 0 3$ ， $p = . 0 0 3$ ）.',
        spans: { '82': '8 2', '3.03': '3 . 0 3', '.003': '. 0 0 3', ',': '，', '(': '（' },
      },
    ],
  },
  {
    name: 'a number joined from a long spaced run maps to the whole run',
    source: 'Clear days differed, $t ( 8 2 ) = 1 7 . 6 8$.\n',
    expect: [{ kind: 'paragraph', text: 'Clear days differed, t (82) = 17.68.', spans: { '17.68': '1 7 . 6 8' } }],
  },
  {
    name: '\\left and \\right are dropped; spaces before commas and inside brackets are not printed',
    source: 'Ratings varied, $F \\left( 2 , 1 2 3 \\right) = 2 1 6 . 1 8 , p$ < .001.\n',
    expect: [{ kind: 'paragraph', text: 'Ratings varied, F (2, 123) = 216.18, p < .001.', spans: { '123': '1 2 3', '216.18': '2 1 6 . 1 8' } }],
  },
  {
    name: 'font commands unwrap with their braces, nested and spaced; \\boldsymbol { \\eta } is η',
    source: 'Fog ( $\\mathbf { \\mathcal { M } } = 2 . 0 2$ ， $S D = 0 . 8 4$ ), $\\boldsymbol { \\eta } ^ { 2 } = 0 . 7 8$ , $\\mathit { M } = 5 . 8 8$ with $\\mathrm { t } ( 4 0 ) = 2 . 5 0$.\n',
    expect: [
      {
        kind: 'paragraph',
        text: 'Fog ( M = 2.02 , SD = 0.84 ), η^2 = 0.78 , M = 5.88 with t (40) = 2.50.',
        spans: { 'M = 2.02': 'M } } = 2 . 0 2', SD: 'S D', η: '\\eta', t: 't' },
      },
    ],
  },
  {
    name: 'empty subscripts and a prime without a base are conversion debris and print nothing',
    source: 'Large, $d = 3 . 5 4 _ { , }$ and $^ { \\prime } , M = 1 . 1 6$ then $S D = 1 . 0 4 _ { _ \\cdot }$.\n',
    expect: [{ kind: 'paragraph', text: 'Large, d = 3.54 and , M = 1.16 then SD = 1.04.', spans: { '3.54': '3 . 5 4' } }],
  },
  {
    name: 'a stray backslash before the closing dollar (an escaped $ the converter meant) is dropped',
    source: 'Haze ( $M = 2 . 9 8$ ， $S D = 0 . 9 2 \\$ ）and fog.\n',
    expect: [{ kind: 'paragraph', text: 'Haze ( M = 2.98 , SD = 0.92 )and fog.' }],
  },
  {
    name: 'grouping braces vanish, scripts keep theirs; letters spelled apart in \\mathrm are one word',
    source: 'Age $M _ { \\mathrm { a g e } } = 1 9 . 9 6$ , ${ S E } = 0 . 2 5 1$ , $p { = } 0 . 5 0 0$ , $d f = 2 2 6$ .\n',
    expect: [{ kind: 'paragraph', text: 'Age M_{age} = 19.96 , SE = 0.251 , p = 0.500 , df = 226 .', spans: { age: 'a g e', SE: 'S E', df: 'd f' } }],
  },
  {
    name: 'a subscript without a base holding a statement is read as the statement; style switches print nothing',
    source: 'Sap flow fell ( $_ { t = 1 . 9 5 }$ ， $\\scriptstyle P = 0 . 0 5 3$ ).\n',
    expect: [{ kind: 'paragraph', text: 'Sap flow fell ( t = 1.95 , P = 0.053 ).', spans: { '1.95': '1 . 9 5' } }],
  },
  {
    name: 'a sign joins its number; an exponent is read as today; \\chi is χ; TeX spaces (\\ ) are single spaces',
    source: 'So $t ( 4 7 ) = - 0 . 2 0$ , $1 . 2 \\times 1 0 ^ { - 3 }$ , $\\chi ^ { 2 } ( 1 ) = 4 . 2 0$ , $p \\ < \\ . 0 0 1$ .\n',
    expect: [{ kind: 'paragraph', text: 'So t (47) = -0.20 , 1.2 × 10^-3 , χ^2 (1) = 4.20 , p < .001 .', spans: { '-0.20': '- 0 . 2 0', χ: '\\chi' } }],
  },
  {
    name: 'ordinary math is left as written (no spaced-out tokens to join)',
    source: 'Plain $t(28) = 2.10, p = .045$, $t_{28} = 2.1$, $\\frac{1}{2}$, $M_{\\mathrm{age}} = 31.2$, $p < .05$.\n',
    expect: [
      {
        kind: 'paragraph',
        text: 'Plain t(28) = 2.10, p = .045, t_{28} = 2.1, \\frac{1}{2}, M_{age} = 31.2, p < .05.',
        spans: { 't(28) = 2.10, p = .045': 't(28) = 2.10, p = .045' },
      },
    ],
  },
  {
    name: 'display math is read the same way, mapped inside its fences',
    source: 'Below.\n\n$$\nt ( 2 8 ) = 2 . 1 0 , p = . 0 4 5\n$$\n',
    expect: [
      { kind: 'paragraph', text: 'Below.' },
      { kind: 'math', text: 't (28) = 2.10, p = .045', at: 't ( 2 8 ) = 2 . 1 0 , p = . 0 4 5', spans: { '2.10': '2 . 1 0' } },
    ],
  },
  {
    name: 'an accent over one letter is the letter with its combining mark (a mean x̄ stays a mean)',
    source: 'Means $\\bar { x } = 3 . 2 5$.\n',
    expect: [{ kind: 'paragraph', text: 'Means x\u0304 = 3.25.', spans: { 'x\u0304': '\\bar { x }' } }],
  },
];

describe('spaced-out TeX math from PDF converters', () => {
  it.each(cases)('$name', (c) => {
    expectSegments(c);
  });
});
