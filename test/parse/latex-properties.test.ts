import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { parseDocument } from '../../src/parse/index.js';
import { correctResult } from '../properties/results.js';

/**
 * Property tests of the LaTeX reader (fast-check). Generated manuscripts are invented sentences
 * around correct results (p from src/stats, itself checked against scipy and mpmath in test/stats).
 */
const RUNS = Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 300);

type Wrap = (df: number, t: string, op: string, p: string) => { pre: string; post: string };
/** The same result in the spellings LaTeX authors use; `pre` ends right before t's value. */
const WRAPS: Wrap[] = [
  (df, _t, op, p) => ({ pre: `t(${df}) = `, post: `, p ${op} ${p}` }),
  (df, _t, op, p) => ({ pre: `\\textit{t}(${df}) = `, post: `, \\textit{p} ${op} ${p}` }),
  (df, _t, op, p) => ({ pre: `$t(${df}) = `, post: `$, $p ${op} ${p}$` }),
  (df, _t, op, p) => ({ pre: `\\(t(${df}) = `, post: `, p ${op} ${p}\\)` }),
  (df, _t, op, p) => ({ pre: `\\emph{t}(${df})~=~`, post: `, \\emph{p}\\,${op}\\,${p}` }),
];
const SEPARATORS = [' ', '\n', '\n\n', ' % a remark, t(5) = 9.99\n', '\n\\par\n', '\n\\section{More}\n'];

const sentence = fc.record({
  result: correctResult,
  wrap: fc.integer({ min: 0, max: WRAPS.length - 1 }),
  commented: fc.boolean(),
  separator: fc.constantFrom(...SEPARATORS),
});

describe('LaTeX reader properties', () => {
  it('every result outside comments is read, its t at its offset in the .tex source; none inside comments', () => {
    fc.assert(
      fc.property(fc.array(sentence, { minLength: 1, maxLength: 8 }), fc.boolean(), (sentences, preamble) => {
        let doc = preamble ? '\\documentclass{article}\n\\newcommand{\\x}{t(3) = 1.00}\n\\begin{document}\n' : '';
        const expected: Array<{ t: string; at: number }> = [];
        sentences.forEach((s, k) => {
          const op = s.result.printed.includes('<') ? '<' : '=';
          const p = s.result.printed.replace(/^p [=<] /, '');
          const { pre, post } = (WRAPS[s.wrap] as Wrap)(s.result.df, s.result.t, op, p);
          const lead = s.commented ? `% Group ${k + 1} changed, ` : `Group ${k + 1} changed, `;
          if (!s.commented) expected.push({ t: s.result.t, at: doc.length + lead.length + pre.length });
          doc += `${lead}${pre}${s.result.t}${post}.${s.commented ? '\n' : ''}${s.separator}`;
        });
        if (preamble) doc += '\\end{document}\n';
        const report = checkSource('g.tex', doc);
        expect(report.results.map((r) => ({ t: r.t.printed, at: r.t.span.start }))).toEqual(expected);
      }),
      { numRuns: RUNS },
    );
  });

  it('never throws on LaTeX-like noise; every segment character maps into the source, in order', () => {
    const token = fc.constantFrom('\\', '{', '}', '$', '$$', '%', '\\%', '&', '\\\\', '~', '--', '\n', '\n\n', '\\begin{tabular}{ll}', '\\end{tabular}', '\\begin{table}', '\\end{table}', '\\begin{document}', '\\end{document}', '\\section{', '\\caption{', '\\footnote{', '\\textit{', '\\(', '\\)', '\\[', '\\]', '\\input{a}', '\\multicolumn{2}{c}{', '\\hline', 't(28) = 2.10', 'p = .045', '\\begin{equation}', '\\end{equation}', '\\verb|x', "\\'e", '``', 'x');
    fc.assert(
      fc.property(fc.array(fc.oneof(token, fc.string({ maxLength: 4 })), { maxLength: 60 }), (tokens) => {
        const src = tokens.join('');
        const doc = parseDocument('n.tex', src);
        for (const seg of doc.segments) {
          expect(seg.starts).toHaveLength(seg.text.length);
          expect(seg.ends).toHaveLength(seg.text.length);
          for (let i = 0; i < seg.text.length; i += 1) {
            const a = seg.starts[i] as number;
            const b = seg.ends[i] as number;
            expect(a).toBeGreaterThanOrEqual(i > 0 ? (seg.starts[i - 1] as number) : 0);
            expect(b).toBeGreaterThanOrEqual(a);
            expect(b).toBeLessThanOrEqual(src.length);
          }
        }
        checkSource('n.tex', src);
      }),
      { numRuns: RUNS },
    );
  });
});

/**
 * Seconds to read each of two sources as LaTeX, best of five readings each, the two read in turn
 * (a, b, a, b, …): at tens of milliseconds a single collection can double one reading, and a busy
 * spell of the machine (other test files run beside this one) then slows both, not one of them.
 */
function readTimes(a: string, b: string): [number, number] {
  const once = (source: string) => {
    const t0 = performance.now();
    parseDocument('x.tex', source);
    return (performance.now() - t0) / 1000;
  };
  let best: [number, number] = [Infinity, Infinity];
  for (let i = 0; i < 5; i += 1) best = [Math.min(best[0], once(a)), Math.min(best[1], once(b))];
  return best;
}

describe('LaTeX reader cost', () => {
  // Shapes that would make a naive reader rescan the text: openings that never close, deep
  // groups, a long table. Reading twice the text must take less than 3× as long (about 2 when
  // linear, about 4 when quadratic), in one of three measurements: a linear reader reads 2.3–2.5×
  // here, as past V8's young generation each line of a larger text costs more (many comments:
  // 0.33 µs a line at 10,000 lines, 0.55 at 160,000; flat with a 64 MB young generation), and
  // one loaded full run measured 3.29 once. A quadratic reader is over 3 in every measurement.
  const shapes: Array<[string, (n: number) => string]> = [
    ['unclosed \\( in one paragraph', (n) => 'a \\( t(28) = 2.10 '.repeat(n)],
    ['unclosed \\[ across paragraphs', (n) => 'a \\[ t(28) = 2.10\n\n'.repeat(n)],
    ['unclosed $ in one paragraph', (n) => `${'word '.repeat(n)}$ t(28) = 2.10 ${'x '.repeat(n)}`],
    ['unclosed \\begin{ names', (n) => '\\begin{x '.repeat(n)],
    ['deep braces', (n) => `${'{\\textit{'.repeat(n)}t(28) = 2.10${'}}'.repeat(n)}`],
    ['a long tabular', (n) => `\\begin{tabular}{lll}\n${'Nap & 4.20 & 1.10 \\\\\n'.repeat(n)}\\end{tabular}\n`],
    ['many comments', (n) => 'Naps % t(28) = 2.10\n'.repeat(n)],
    ['many definitions and uses of one command', (n) => `${'\\renewcommand{\\tval}{2.10}'.repeat(n)}\n\n${'Naps \\tval '.repeat(n)}`],
    ['a command with arguments used many times in math', (n) => `\\newcommand{\\s}[1]{#1}\n${'$\\s{2}$ '.repeat(n)}`],
  ];
  for (const [name, make] of shapes) {
    it(name, () => {
      parseDocument('warm.tex', make(500));
      const n = 40_000;
      let [small, large] = readTimes(make(n), make(2 * n));
      for (let attempt = 1; attempt < 3 && large / small >= 3; attempt += 1) [small, large] = readTimes(make(n), make(2 * n));
      expect(large / small, `${name}: ${small.toFixed(3)} s at ${n}, ${large.toFixed(3)} s at ${2 * n}`).toBeLessThan(3);
    });
  }
});
