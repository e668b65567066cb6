import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { ruleTable } from './table.js';

// z = b / SE (the Wald statistic; common practice, no source). b = 0.42 and SE = 0.15 read as
// 0.415 to 0.425 and 0.145 to 0.155 give z from 0.415/0.155 = 2.677 to 0.425/0.145 = 2.931
// (by hand in python3); 2·scipy.stats.norm.sf(2.80) = .0051 (Debian python3-scipy).
ruleTable('z-follows-from-coefficient', [
  { name: 'a z that b / SE gives', markdown: 'Dosage predicted relapse, b = 0.42, SE = 0.15, z = 2.80, p = .005.', expect: [] },
  { name: 'a z that no b and SE within their rounding give', markdown: 'Dosage predicted relapse, b = 0.42, SE = 0.15, z = 3.80, p < .001.', expect: [{ at: 'z = 3.80', id: 'mismatch' }] },
  { name: 'the upper end of the rounding: z = 2.93 (0.425 / 0.145 = 2.931)', markdown: 'Dosage predicted relapse, b = 0.42, SE = 0.15, z = 2.93, p = .003.', expect: [] },
  { name: 'just past it: z = 2.94', markdown: 'Dosage predicted relapse, b = 0.42, SE = 0.15, z = 2.94, p = .003.', expect: [{ at: 'z = 2.94', id: 'mismatch' }] },
  { name: 'a negative coefficient with |z| printed', markdown: 'Dosage predicted relapse, B = -0.42 (SE = 0.15), z = 2.80, p = .005.', expect: [] },
  { name: 'another test between the coefficient and the z unties them', markdown: 'Dosage predicted relapse (b = 0.42, SE = 0.15), and age did too, χ²(1) = 9.1, p = .003, z = 3.80, p < .001.', expect: [] },
  { name: 'a coefficient in an earlier sentence is not the z\'s', markdown: 'The coefficient was b = 0.42 (SE = 0.15). The rank test agreed, z = 3.80, p < .001.', expect: [] },
  { name: 'a coefficient without its SE is not checked', markdown: 'Dosage predicted relapse, b = 0.42, z = 3.80, p < .001.', expect: [] },
  { name: 'a t after the coefficient is t-follows-from-coefficient\'s', markdown: 'Dosage predicted relapse, b = 0.42, SE = 0.15, t(96) = 3.80, p < .001.', expect: [] },
]);

describe('z-follows-from-coefficient speaks as a note where the SE may be another coefficient\'s', () => {
  it('a second coefficient in the stretch before the z', () => {
    const f = checkSource('case.md', 'The odds rose with dosage, b = 0.42, β = 0.30, SE = 0.15, z = 3.80, p < .001.', {}).findings.filter((x) => x.ruleId === 'z-follows-from-coefficient');
    expect(f.map((x) => `${x.level} ${x.messageId}`)).toEqual(['note mismatch']);
    expect(checkSource('case.md', 'Dosage predicted relapse, b = 0.42, SE = 0.15, z = 3.80, p < .001.', {}).findings.filter((x) => x.ruleId === 'z-follows-from-coefficient').map((x) => x.level)).toEqual(['warning']);
  });
});

