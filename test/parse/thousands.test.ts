import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { parseDocument } from '../../src/parse/index.js';

/**
 * A thin (U+2009), narrow no-break (U+202F) or no-break (U+00A0) space between digit groups is a
 * thousands separator, as SI and several journals print large counts ("2 391"): the number is
 * read whole, its place in the source kept. An ordinary space is not read so (it may part two
 * numbers). Invented numbers: 1 204 + 1 187 = 2 391 (arithmetic); t(2389) = 2.52 gives p = .012
 * (scipy 1.17.1, scipy.stats.t.sf).
 */
const text = (t: string) => parseDocument('x.md', `${t}\n`).segments.map((s) => s.text).join(' ');

describe('spaces between digit groups', () => {
  for (const [name, space] of [['thin', '\u2009'], ['narrow no-break', '\u202F'], ['no-break', '\u00A0']] as const) {
    it(`a ${name} space joins "2${space}391" and "1${space}204${space}567"`, () => {
      expect(text(`Among the 2${space}391 respondents and 1${space}204${space}567 records`)).toContain('Among the 2391 respondents and 1204567 records');
    });
  }
  it('not a decimal\'s digits, not four digits, not an ordinary space', () => {
    expect(text('0.123\u2009456 and 12\u20091234 and 2 391')).toBe('0.123 456 and 12 1234 and 2 391');
  });
  it('the sizes add up, and a df so printed is read', () => {
    const r = checkSource('x.md', '## Results\n\nAmong the 2\u2009391 respondents, night workers (n = 1\u2009204) slept less than day workers (n = 1\u2009187), t(2\u2009389) = 2.52, p = .012.\n');
    expect(r.results.map((x) => x.df?.printed)).toEqual(['2389']);
    expect(r.findings.filter((f) => f.level !== 'note')).toEqual([]);
  });
});
