/**
 * Units agree within a sentence: where a finding counts a gap in units of the reported value's
 * last printed digit, what rounding allows is said in the same units (in the message and in the
 * HTML card), through the real CLI on invented manuscripts.
 */
import { describe, expect, it } from 'vitest';
import { cli } from '../cli/harness.js';
import { readReport } from '../helpers.js';

const P_FILE = 'test/fixtures/pictures/p-values.md';

type Finding = { message: string; gap?: { absolute: number; lastDigitUnits?: number; roundingAllowance?: number } };

async function json(...files: string[]): Promise<{ files: Array<{ findings: Finding[] }> }> {
  return readReport((await cli(['--format', 'json', ...files])).stdout);
}

async function html(...files: string[]): Promise<string> {
  return (await cli(['--format', 'html', ...files])).stdout;
}

describe('units agree within a sentence', () => {
  it('a gap in units of the last printed digit is set against rounding in the same units, in every message and card', async () => {
    const data = await json(P_FILE, 'fixtures/demo/standing-desks.md');
    const gapped = data.files.flatMap((f) => f.findings).filter((f) => f.gap?.lastDigitUnits !== undefined);
    const said = gapped.filter((f) => f.message.includes('units of the last'));
    expect(said.length).toBeGreaterThanOrEqual(3);
    for (const f of said) {
      const m = /Gap ([\d.]+) \(([\d.]+) units of the last printed digit; rounding allows ([\d.]+) units\)/.exec(f.message);
      expect(m, f.message).not.toBeNull();
      expect(Number(m![2])).toBeCloseTo(f.gap!.lastDigitUnits!, 1);
      // half a unit of the last digit is what rounding allows (common practice, no source)
      expect(Number(m![3])).toBe(0.5);
    }
    const page = await html(P_FILE, 'fixtures/demo/standing-desks.md');
    const differences = [...page.matchAll(/<dt>Difference<\/dt><dd>([^<]*)<\/dd>/g)].map((m) => m[1]!).filter((d) => d.includes('units'));
    expect(differences.length).toBe(gapped.length);
    for (const d of differences) {
      const m = /^([\d.e-]+) \(([\d.]+) units of the last printed digit\); rounding allows ([\d.e-]+) \(0\.5 units\)$/.exec(d);
      expect(m, d).not.toBeNull();
      // one unit of the last digit, read from either pair, is the same amount (to the shown digits)
      const fromGap = Number(m![1]) / Number(m![2]);
      const fromAllowance = Number(m![3]) / 0.5;
      expect(Math.abs(fromGap - fromAllowance) / fromAllowance).toBeLessThan(0.05);
    }
  });
});

