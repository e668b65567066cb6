/**
 * A computation of one linked item made once per item and given to every caller: the report's
 * record and several rules ask for the same item's evaluation, and each evaluation computes a
 * distribution's tails at the corners of the printed values' rounding box (on 20,000 results in
 * one paragraph the evaluations and their numerics were a tenth of the check, made four to six
 * times over). A linked item is not changed after linking, and what is computed from it depends on
 * nothing else, so each caller gets exactly what it would have computed itself.
 *
 * The value is shared, not copied: a caller must not change it (copy what is to be changed, as
 * one-tailed-p-is-declared does with a recomputed range). It is not frozen: freezing every object
 * in it cost as much time as the repeated numerics it saves (measured in a profile of that
 * paragraph). A finding may hold parts of it (its recomputed range, its gap): the rules that do
 * so each speak of a different standing of the result, so no two findings of a report hold the
 * same parts (test/rule-api/once.test.ts checks every fixture's report for shared objects).
 */
export function oncePer<K extends object, V extends object>(compute: (item: K) => V | undefined): (item: K) => V | undefined {
  const made = new WeakMap<K, V | null>();
  return (item) => {
    const known = made.get(item);
    if (known !== undefined) return known ?? undefined;
    const value = compute(item);
    made.set(item, value ?? null);
    return value;
  };
}
