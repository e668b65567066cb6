import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { extract } from '../../src/extract/index.js';
import { link } from '../../src/link/index.js';
import { parseDocument } from '../../src/parse/index.js';
import { evaluateDescriptives, evaluateP, evaluateStatisticP } from '../../src/rule-api/index.js';
import { oncePer } from '../../src/rule-api/once.js';

// Invented results whose printed p is far from what t and F give (about .045 and .047; values
// from memory, used only as "far from .20 and .30": the numerics themselves are checked against
// scipy and mpmath in test/stats). What is tested here is that each evaluation is made once.
const TEXT = 'Fatigue fell after the session, t(28) = 2.10, p = .20. Groups differed, F(2, 40) = 3.30, p = .30.\n';

function linked() {
  const doc = parseDocument('once.md', TEXT);
  return link(extract(doc), doc.directives);
}

describe('oncePer', () => {
  it('computes once per item and gives every caller the same value', () => {
    let calls = 0;
    const f = oncePer((item: { n: number }) => {
      calls += 1;
      return item.n > 0 ? { twice: [item.n * 2] } : undefined;
    });
    const a = { n: 2 };
    const first = f(a);
    expect(f(a)).toBe(first);
    expect(first).toEqual({ twice: [4] });
    // nothing to compute is remembered too
    const none = { n: 0 };
    expect(f(none)).toBeUndefined();
    expect(f(none)).toBeUndefined();
    expect(calls).toBe(2);
    // another item with the same content is computed afresh
    expect(f({ n: 2 })).not.toBe(first);
    expect(calls).toBe(3);
  });
});

describe('evaluateP and evaluateStatisticP, made once per linked item', () => {
  it('give the same evaluation to every caller, equal to one made afresh from another linking of the text', () => {
    const one = linked();
    const other = linked();
    const r = one.results[0];
    const s = one.statistics.find((x) => x.report.kind === 'F');
    expect(r).toBeDefined();
    expect(s).toBeDefined();
    if (!r || !s) return;
    const e = evaluateP(r);
    expect(e?.standing).toBe('mismatch');
    expect(evaluateP(r)).toBe(e);
    // a separate linking makes separate items: evaluated afresh, to the same values
    expect(evaluateP(other.results[0] as typeof r)).not.toBe(e);
    expect(evaluateP(other.results[0] as typeof r)).toEqual(e);
    const se = evaluateStatisticP(s);
    expect(se?.fits).toBe(false);
    expect(evaluateStatisticP(s)).toBe(se);
    expect(evaluateStatisticP(other.statistics.find((x) => x.report.kind === 'F') as typeof s)).toEqual(se);
  });
});

describe('evaluateDescriptives, made once per linked result', () => {
  it('gives the same evaluation to every caller, equal to one made afresh from another linking of the text', () => {
    // invented descriptives; t from them is some 2.3 (Student), not the printed 3.90 (value from
    // memory, used only as "far from it": the numerics are checked against scipy in test/stats)
    const text = 'Desk users (M = 5.1, SD = 1.2, n = 20) and chair users (M = 4.2, SD = 1.3, n = 20) differed, t(38) = 3.90, p = .001.\n';
    const linkedText = () => {
      const doc = parseDocument('desc.md', text);
      return link(extract(doc), doc.directives);
    };
    const one = linkedText().results[0];
    const other = linkedText().results[0];
    expect(one).toBeDefined();
    if (!one || !other) return;
    const e = evaluateDescriptives(one);
    expect(e?.attempts.length).toBeGreaterThan(0);
    expect(e?.fitsAsLabelled).toBe(false);
    expect(evaluateDescriptives(one)).toBe(e);
    expect(evaluateDescriptives(other)).not.toBe(e);
    expect(evaluateDescriptives(other)).toEqual(e);
  });
});

describe('the report built from shared evaluations', () => {
  /** Every object and array in `value`, itself included. */
  function objectsIn(value: unknown, into: Set<object> = new Set()): Set<object> {
    if (typeof value !== 'object' || value === null || into.has(value)) return into;
    into.add(value);
    for (const v of Object.values(value)) objectsIn(v, into);
    return into;
  }

  /** The fixtures' texts and a text whose results each rule that holds an evaluation speaks of. */
  function documents(): Array<[string, string]> {
    const out: Array<[string, string]> = [['owned.md', `${TEXT}Scores rose, t(28) = 1.80, p = .041. Errors fell, t(28) = 2.10, p = .032.\n`]];
    const walk = (dir: string) => {
      for (const name of readdirSync(dir)) {
        const path = join(dir, name);
        if (statSync(path).isDirectory()) walk(path);
        else if (/\.(md|txt|tex|Rmd|qmd)$/.test(name)) out.push([path, readFileSync(path, 'utf8')]);
      }
    };
    walk('fixtures');
    return out;
  }

  it('gives no two records of a report the same recomputed range or gap', () => {
    let held = 0;
    for (const [path, text] of documents()) {
      const report = checkSource(path, text);
      const owner = new Map<object, string>();
      const records: Array<[string, unknown]> = [
        ...report.findings.flatMap((f, i): Array<[string, unknown]> => [[`finding ${i} (${f.ruleId})`, f.recomputed], [`finding ${i} (${f.ruleId})`, f.gap]]),
        ...report.results.map((r): [string, unknown] => [`result ${r.id}`, r.recomputed]),
        ...(report.statistics ?? []).map((s): [string, unknown] => [`statistic ${s.id}`, s.recomputed]),
      ];
      for (const [name, value] of records) {
        if (value !== undefined) held += 1;
        for (const o of objectsIn(value)) {
          const first = owner.get(o);
          expect(first === undefined || first === name, `${path}: ${name} holds an object of ${first}`).toBe(true);
          owner.set(o, name);
        }
      }
    }
    expect(held).toBeGreaterThan(100);
  });
});
