import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { extract } from '../../src/extract/index.js';
import { parseDocument } from '../../src/parse/index.js';

/**
 * Two groups' values printed in pairs under one label ("12.0/10.2 (SD 3.0/3.3; n = 30/30)", "M =
 * 6.8 vs 5.6; SD = 2.2 vs 2.4; n = 30 vs 29") are not read as one group's descriptives, which
 * would make a two-group df look like a one-sample test's. Invented numbers; by scipy 1.17.1
 * (scipy.stats.ttest_ind_from_stats): (12.0, 3.0, 30) against (10.2, 3.3, 30) give t(58) = 2.21,
 * p = .031; (6.8, 2.2, 30) against (5.6, 2.4, 29) give t(57) = 2.00, p = .050.
 */
const summaries = (text: string) => extract(parseDocument('x.md', `${text}\n`)).summaries.map((g) => g.printed);
const spoken = (text: string) => checkSource('x.md', `${text}\n`).findings.filter((f) => f.level !== 'note').map((f) => f.ruleId);

describe('values printed in pairs', () => {
  it('"a/b" and "a vs b;" under one label are no group', () => {
    const slash = 'Knowledge (intervention/control) was 12.0/10.2 (SD 3.0/3.3; n = 30/30), t(58) = 2.21, p = .031.';
    const vs = 'Perceived control (coaching vs usual care: M = 6.8 vs 5.6; SD = 2.2 vs 2.4; n = 30 vs 29) differed between arms, t(57) = 2.00, p = .050.';
    expect(summaries(slash)).toEqual([]);
    expect(summaries(vs)).toEqual([]);
    expect(spoken(slash)).toEqual([]);
    expect(spoken(vs)).toEqual([]);
  });
  it('one number so printed is not a pair: "M = 4.1/5" is a rating out of 5 (second review)', () => {
    expect(summaries('Satisfaction was higher with the app (M = 4.1/5, SD = 0.6, n = 30) than with the leaflet (M = 3.6/5, SD = 0.7, n = 30), t(58) = 5.10, p < .001.')).toHaveLength(2);
  });
  it('two whole groups joined by "vs" are still two groups', () => {
    expect(summaries('Earthworm count was higher with bark: 10.96 ± 0.99 vs 12.48 ± 0.69 (n = 23 plots); t22 = 1.51, P = 0.145.')).toHaveLength(2);
  });
});
