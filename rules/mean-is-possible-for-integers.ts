import { fill, numberInterval, showNumber, type LatticeFigure, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { grimmerPossible, grimPossible } from '../src/stats/index.js';

const messages = {
  'grim-mean': 'Reported {reported} for {what}: a mean of {n} whole-number scores{items}{nSource} is a multiple of 1/{total}, and none rounds to {mean}; the nearest possible means are {below} and {above} (GRIM).',
  'grimmer-sd': 'Reported {reported} for {what}: with n = {n} whole-number scores{nSource} and this mean, no possible sum of squares gives an SD that rounds to {sd} (GRIMMER).',
};

/** Means (and SDs) of whole-number data are ones such data can have. */
export const meanIsPossibleForIntegers: Rule = {
  id: 'mean-is-possible-for-integers',
  summary: 'For whole-number data (counts, single items), each mean and SD is one that n such scores can produce (GRIM, GRIMMER).',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const x = document.extraction;
    const out: RuleFinding[] = [];
    for (const g of x.summaries) {
      const inferred = document.inferredSizes.get(g);
      if (!g.mean || (!g.n && !inferred) || g.percent || g.mean.decimals === 0) continue;
      // Only where the measure is certainly declared whole-number: configuration or front
      // matter, a declaration in the same sentence, or one that names the measure this
      // sentence names (across sections). A paragraph's other sentences are not enough: "a
      // large number of structures" says nothing of the ratio reported after it.
      const stated = document.integerDeclarations.get(g)?.statement;
      const items = stated?.items ?? document.integerMeasure?.value.items;
      if (items === undefined) continue;
      const n = g.n?.value ?? (inferred?.n as number);
      const nSource = g.n ? '' : ` (n is not printed with it: ${inferred?.because})`;
      const [lo, hi] = numberInterval(g.mean);
      const grim = grimPossible(lo, hi, n, items);
      // a mean the text says is adjusted, estimated from a model or pooled over imputations
      // need not be a multiple of 1/n: the finding is then a note saying so
      const derived = document.derivedMeans.get(g);
      const related = [...(stated ? [{ span: stated.span, message: 'where the text says the scores are whole numbers' }] : []), ...(derived ? [{ span: derived.span, message: 'the words about how the means were made' }] : [])];
      const base = {
        reported: g.printed,
        block: g.block,
        ...(related.length > 0 ? { related } : {}),
        ...(derived ? { uncertain: [`the text says means are adjusted, estimated from a model or pooled over imputations ("${derived.printed}"), and such a mean need not be a plain mean of whole-number scores`] } : {}),
      };
      const what = g.label ? `"${g.label}"` : 'this group';
      if (!grim.possible) {
        out.push({
          ...base,
          messageId: 'grim-mean',
          span: g.mean.span,
          message: fill(messages['grim-mean'], { reported: g.printed, what, n, nSource, items: items > 1 ? ` of ${items} items` : '', total: n * items, mean: g.mean.printed, below: showNumber(grim.below), above: showNumber(grim.above) }),
          check: 'Check the mean and n against the data: a typo in either, or an n that counts excluded cases, gives this.',
          figure: latticeFigure(lo, hi, n * items),
        });
        continue;
      }
      if (items === 1 && g.spread && document.spreadKinds.get(g) === 'SD' && g.spread.number.decimals > 0) {
        const [sl, sh] = numberInterval(g.spread.number);
        if (!grimmerPossible(lo, hi, sl, sh, n)) {
          out.push({
            ...base,
            messageId: 'grimmer-sd',
            span: g.spread.number.span,
            message: fill(messages['grimmer-sd'], { reported: g.printed, what, n, nSource, sd: g.spread.number.printed }),
            check: 'Check the SD, mean and n against the data.',
          });
        }
      }
    }
    return out;
  },
};


/**
 * What a picture of a GRIM finding draws: the possible means k / (n × items) from two below the
 * printed mean's rounding interval to two above it. No multiple lies inside the interval (that is
 * the finding), so the interval falls between two neighbours and the list holds four means.
 */
function latticeFigure(low: number, high: number, denominator: number): LatticeFigure {
  const first = Math.floor(low * denominator) - 1;
  const last = Math.ceil(high * denominator) + 1;
  const possible: number[] = [];
  for (let k = first; k <= last; k += 1) possible.push(k / denominator);
  return { kind: 'lattice', reported: { low, high }, denominator, possible };
}
