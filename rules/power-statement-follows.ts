import { fill, numberInterval, showNumber, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { requiredN, tTestPower } from '../src/stats/index.js';

const messages = {
  'n-does-not-give-power':
    'Reported "{reported}". Recomputed with the noncentral t distribution ({design}, d = {d}, alpha {alpha}, {sides}): {required} {unit} are needed for {target} power, and {n} give power {achieved}.',
};

/** A sample-size or power statement follows from its effect size, alpha and tails. */
export const powerStatementFollows: Rule = {
  id: 'power-statement-follows',
  summary: 'A sample-size or power statement (power, d, alpha, n) follows from the noncentral t distribution, within one participant per group.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const st of document.extraction.powerStatements) {
      if (!st.n) continue;
      // groups of unequal sizes, a loss allowed for at a rate the text does not give, or another
      // model (clustering, adjustment for baseline, non-inferiority) are not what the
      // equal-groups calculation below models: nothing certain can be said
      if (st.unequalGroups || st.otherModel !== undefined || (st.allowsForLoss !== undefined && !(st.allowsForLoss > 0 && st.allowsForLoss < 1))) continue;
      const target = st.powerPercent ? st.power.value / 100 : st.power.value;
      if (!(target > 0 && target < 1)) continue;
      const alpha = st.alpha ?? 0.05;
      const sides = st.sides ?? 2;
      const [dLow, dHigh] = numberInterval(st.d);
      const d = Math.abs(st.d.value);
      const [pLow, pHigh] = numberInterval(st.power).map((x) => (st.powerPercent ? x / 100 : x)) as [number, number];
      // Per-group n for two samples; a total, or a count of unspecified scope, may be either.
      const printed = st.design !== 'two-sample' ? [st.n.value] : st.nScope === 'per-group' ? [st.n.value] : st.nScope === 'total' ? [st.n.value / 2] : [st.n.value, st.n.value / 2];
      // an n that allows for a loss of a proportion r is the needed n over (1 − r): the needed n is n(1 − r), either way rounded
      const loss = st.allowsForLoss;
      // (the printed n may be the one needed before the loss too: "64 per group give 80% power; allowing for 20% attrition we will recruit 80")
      const candidates = loss === undefined ? printed : printed.flatMap((x) => [x, Math.floor(x * (1 - loss)), Math.ceil(x * (1 - loss))]);
      const required = requiredN(st.design, target, d, alpha, sides);
      const fits = candidates.some((n) => {
        if (!Number.isInteger(n)) return false;
        if (Math.abs(n - required) <= 1) return true; // Cohen's tables and software differ by one
        // "more than 80% power": any n at or above the one needed
        if (st.powerAtLeast && n >= required - 1) return true;
        // or the stated power is what this n gives, for some d within its rounding
        const lo = tTestPower(st.design, n, Math.abs(dLow) < Math.abs(dHigh) ? Math.abs(dLow) : Math.abs(dHigh), alpha, sides);
        const hi = tTestPower(st.design, n, Math.max(Math.abs(dLow), Math.abs(dHigh)), alpha, sides);
        return hi >= pLow && lo <= pHigh;
      });
      if (fits || !Number.isFinite(required)) continue;
      // the first candidate is the printed n as read, before any loss allowed for
      const n = candidates[0] as number;
      const achieved = tTestPower(st.design, Math.floor(n), d, alpha, sides);
      out.push({
        messageId: 'n-does-not-give-power',
        span: st.span,
        message: fill(messages['n-does-not-give-power'], {
          // the statement is a whole sentence: quoted without its closing mark
          reported: withoutClosingMarks(st.printed),
          design: st.design === 'two-sample' ? 'two equal independent groups' : st.design === 'paired' ? 'paired' : 'one sample',
          d: showNumber(d),
          alpha: String(alpha),
          sides: sides === 2 ? 'two-sided' : 'one-sided',
          required,
          unit: st.design === 'two-sample' ? 'per group' : st.design === 'paired' ? 'pairs' : 'participants',
          target: `${Math.round(target * 1000) / 10}%`,
          n: `${Math.floor(n)}${st.design === 'two-sample' ? ' per group' : ''}`,
          achieved: showNumber(achieved),
        }),
        reported: st.printed,
        recomputed: { quantity: 'required n', low: required, high: required, inputs: [`d = ${st.d.printed}`, `power ${st.power.printed}${st.powerPercent ? '%' : ''}`], assumptions: [`alpha ${alpha}${st.alpha === undefined ? ' (default)' : ''}`, `${sides === 2 ? 'two' : 'one'}-sided${st.sides === undefined ? ' (default)' : ''}`, st.design, ...(loss !== undefined ? [`the printed n read both as the n needed and as recruited allowing for the ${showNumber(loss * 100)}% loss the sentence states (then ${Math.floor(n * (1 - loss))} to ${Math.ceil(n * (1 - loss))} analysed)`] : [])] },
        check: 'Check the inputs of the sample-size calculation (d, alpha, tails, design) and say which software and settings were used.',
        block: st.block,
      });
    }
    return out;
  },
};

/** The text without the full stops, semicolons and colons at its end (a loop: a trailing-run pattern is quadratic). */
function withoutClosingMarks(text: string): string {
  let end = text.length;
  while (end > 0 && '.;:'.includes(text[end - 1] as string)) end -= 1;
  return text.slice(0, end);
}
