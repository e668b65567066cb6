import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { correctResult, isPRule, wrongP } from './results.js';

/**
 * Property-based tests (fast-check). Seeds are printed by fast-check on failure; runs are set per
 * property so the whole file stays within a few seconds of CI time.
 */
const RUNS = Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 10_000);

const word = fc.constantFrom('fatigue', 'the', 'ward', 'rose', 'fell', 'p', 't', 'M', 'SD', '(', ')', '=', '<', '*', '_', '$', '|', '±', '-', '.', ',', '%', '\n', '\n\n', '> ', '- ', '# ', '`', '<!--', '-->', '---', '\t', '\r\n', '\u2212', 'é', '😀', '[', ']', '^', '\\', '&lt;');
const noise = fc.array(fc.oneof(word, fc.string({ maxLength: 6 }), fc.integer({ min: -99, max: 999 }).map(String)), { maxLength: 40 }).map((ws) => ws.join(' '));
const markdownNoise = fc.oneof(noise, fc.string({ maxLength: 200, unit: 'grapheme' }), fc.string({ maxLength: 200, unit: 'binary' }));

const correct = correctResult;

describe('properties of any input', () => {
  it('never throws; every span lies in the document; every result starts with its t', () => {
    fc.assert(
      fc.property(markdownNoise, (text) => {
        const r = checkSource('p.md', text);
        for (const x of [...r.results, ...r.findings]) {
          expect(x.span.start).toBeGreaterThanOrEqual(0);
          expect(x.span.end).toBeLessThanOrEqual(text.length);
          expect(x.span.end).toBeGreaterThanOrEqual(x.span.start);
        }
        for (const res of r.results) expect(text.slice(res.t.span.start, res.t.span.end).length).toBeGreaterThan(0);
      }),
      { numRuns: RUNS },
    );
  }, 300_000);

  it('the same input gives byte-identical JSON', () => {
    fc.assert(
      fc.property(noise, correct, (text, c) => {
        const doc = `${text} t(${c.df}) = ${c.t}, ${c.printed}. ${text}`;
        expect(JSON.stringify(checkSource('p.md', doc))).toBe(JSON.stringify(checkSource('p.md', doc)));
      }),
      { numRuns: RUNS },
    );
  }, 300_000);
});

describe('properties of spliced results', () => {
  const plain = fc.array(fc.constantFrom('fatigue', 'fell', 'in', 'the', 'weeks', 'ward', 'and', 'rose'), { minLength: 1, maxLength: 12 }).map((w) => w.join(' '));

  it('a spliced correct result is extracted, at its place, and never flagged', () => {
    fc.assert(
      fc.property(plain, plain, correct, (before, after, c) => {
        const stat = `t(${c.df}) = ${c.t}, ${c.printed}`;
        const doc = `${before}, ${stat}, ${after}.\n`;
        const r = checkSource('p.md', doc);
        expect(r.results).toHaveLength(1);
        expect(doc.slice(r.results[0]!.span.start, r.results[0]!.span.end)).toBe(stat);
        expect(r.findings.filter((f) => isPRule(f.ruleId))).toEqual([]);
      }),
      { numRuns: RUNS },
    );
  }, 300_000);

  it('a spliced wrong p (outside every reading) is always flagged', () => {
    fc.assert(
      fc.property(plain, correct.filter((c) => c.p > 0.002 && c.p < 0.9), (before, c) => {
        const doc = `${before}, t(${c.df}) = ${c.t}, p = ${wrongP(c.p)}.\n`;
        const ids = checkSource('p.md', doc).findings.map((f) => f.ruleId);
        expect(ids.some((id) => id === 'p-follows-from-t' || id === 'significance-follows-from-t')).toBe(true);
      }),
      { numRuns: RUNS },
    );
  }, 300_000);

  // The same property over grammar-built Markdown, 10,000 cases: markdown-grammar.test.ts.
  it('CRLF line ends and a BOM change no finding, only positions', () => {
    fc.assert(
      fc.property(fc.array(plain, { minLength: 1, maxLength: 4 }), correct, (lines, c) => {
        const lf = `${lines.join('\n')}, t(${c.df}) = ${c.t}, p = .5.\n\n${lines.join('\n')}\n`;
        const shape = (text: string) => checkSource('p.md', text).findings.map((f) => [f.ruleId, f.messageId, f.start.line, f.start.column, f.message]);
        const base = shape(lf);
        expect(shape(lf.replace(/\n/g, '\r\n'))).toEqual(base);
        // a BOM shifts offsets by one but not lines or columns
        expect(shape(`\uFEFF${lf}`)).toEqual(base);
      }),
      { numRuns: Math.floor(RUNS / 5) },
    );
  }, 300_000);
});
