import { evaluateP, fill, pPlaceholders, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'undeclared-one-tailed':
    'Reported {reported}. It matches the one-tailed p from {inputs} ({oneTailed}), not the two-tailed p ({twoTailed}), and nothing in the text says the test was one-tailed.',
  'undeclared-one-tailed-opposite':
    'Reported {reported}. It matches the one-tailed p against the direction of t from {inputs} ({oneTailedOpposite}), as an equivalence or non-inferiority test reports it, not the two-tailed p ({twoTailed}), and nothing beside it says the test was one-tailed.',
  'one-tailed-stated-elsewhere':
    'Reported {reported}. It matches the one-tailed p from {inputs} ({oneTailed}), not the two-tailed p ({twoTailed}). The text speaks of a one-tailed analysis elsewhere ("{elsewhere}"), but not in the sentence or paragraph of this result, nor of every test, so plumbline could not tie the two.',
  'one-tailed-power-calculation':
    'Reported {reported}. It matches the one-tailed p from {inputs} ({oneTailed}), not the two-tailed p ({twoTailed}). The text sizes the study with a one-tailed power calculation ("{elsewhere}"), which does not say that the test itself was one-tailed.',
  'undeclared-one-tailed-changes-significance':
    'Reported {reported}. It matches the one-tailed p from {inputs} ({oneTailed}), not the two-tailed p ({twoTailed}), and nothing in the text says the test was one-tailed; two-tailed, the result would be {recomputedSide} at alpha {alpha}.',
};

/** A p that only a one-tailed test gives is declared as one-tailed. */
export const oneTailedPIsDeclared: Rule = {
  id: 'one-tailed-p-is-declared',
  summary: 'A p value that matches only the one-tailed reading comes with a statement that the test was one-tailed.',
  kind: 'doubtful',
  defaultLevel: 'note',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const e = evaluateP(result);
      if (!e || (e.standing !== 'one-tailed-only' && e.standing !== 'one-tailed-opposite-only')) continue;
      const elsewhere = result.untiedSidedness;
      const id = e.standing === 'one-tailed-opposite-only'
        ? 'undeclared-one-tailed-opposite'
        : elsewhere?.planning ? 'one-tailed-power-calculation' : elsewhere ? 'one-tailed-stated-elsewhere' : e.decisionFlips ? 'undeclared-one-tailed-changes-significance' : 'undeclared-one-tailed';
      out.push({
        messageId: id,
        span: result.report.span,
        message: fill(messages[id], { ...pPlaceholders(result, e), elsewhere: elsewhere?.printed ?? '' }),
        ...(elsewhere ? { related: [{ span: elsewhere.span, message: elsewhere.planning ? 'the one-tailed power calculation' : 'the words about one-tailed tests' }] } : {}),
        reported: result.report.printed,
        recomputed: e.recomputed,
        gap: e.gap,
        figure: { kind: 'p' },
        check: 'If the test was one-tailed, say so (and why) where the test is described; otherwise report the two-tailed p.',
        resultId: result.report.id,
        block: result.report.block,
      });
    }
    return out;
  },
};
