import { evaluateDescriptives, fill, type Rule, type RuleFinding, NO_OPTIONS, descriptiveDoubts } from '../src/rule-api/index.js';

const messages = {
  'paired-analysed-as-independent': 'Reported {reported} for a design the text describes as paired ("{words}"), but df = {df} is n1 + n2 − 2 for {n1} + {n2}: the df of two independent groups.',
  'paired-t-equals-independent': 'Reported {reported} for a design the text describes as paired ("{words}"), but the t is what two independent groups with these descriptives give ({attempt}).',
  'independent-analysed-as-paired': 'Reported {reported} for groups the text describes as independent ("{words}"), but df = {df} is n − 1 for n = {n}: the df of a paired or one-sample test.',
};

/** The analysis fits the design: paired data analysed as paired, independent groups as independent. */
export const designMatchesAnalysis: Rule = {
  id: 'design-matches-analysis',
  summary: 'The analysis fits the design the text describes: paired data as paired, independent groups as independent.',
  kind: 'doubtful',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const r = result.report;
      const design = result.context.design;
      const link = result.context.descriptives;
      if (!r.df || !link || link.groups.length !== 2 || design.basis === 'default' || design.basis === 'structure') continue;
      const perGroup = result.context.sampleSizes.find((s) => s.scope === 'per-group')?.n.value;
      const [n1, n2] = link.groups.map((g) => g.n?.value ?? perGroup);
      const words = design.printed ?? (r.namedVariant ?? design.value);
            const base = { span: r.span, reported: r.printed, resultId: r.id, block: r.block, ...(design.span ? { related: [{ span: design.span, message: 'the words that describe the design' }] } : {}), ...descriptiveDoubts(result) };
      if (design.value === 'paired') {
        if (n1 !== undefined && n2 !== undefined && n1 === n2 && r.df.value === n1 + n2 - 2) {
          out.push({ ...base, messageId: 'paired-analysed-as-independent', message: fill(messages['paired-analysed-as-independent'], { reported: r.printed, words, df: r.df.printed, n1, n2 }), check: 'Check whether a paired test was run; with paired data it has n − 1 df and usually a larger t.' });
          continue;
        }
        // the independent-groups t reproduces the printed t: the pairing was probably ignored
        const asIndependent = evaluateDescriptives({ ...result, context: { ...result.context, design: { value: 'independent', basis: 'default' } } });
        const fit = asIndependent?.attempts.find((a) => a.fits && a.reading === 'as labelled' && a.variant === 'student' && a.nSource.startsWith('n ='));
        if (fit) {
          out.push({ ...base, messageId: 'paired-t-equals-independent', message: fill(messages['paired-t-equals-independent'], { reported: r.printed, words, attempt: `Student's t with n = ${fit.ns.join(' and ')}` }), check: 'Check whether a paired test was run on the paired data.' });
        }
      } else if (design.value === 'independent') {
        if (n1 !== undefined && n2 !== undefined && n1 === n2 && r.df.value === n1 - 1) {
          out.push({ ...base, messageId: 'independent-analysed-as-paired', message: fill(messages['independent-analysed-as-paired'], { reported: r.printed, words, df: r.df.printed, n: n1 }), check: 'Check whether an independent-samples test was run; two groups of n have 2n − 2 df.' });
        }
      }
    }
    return out;
  },
};
