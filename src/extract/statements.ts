import type { Segment } from '../parse/types.js';
import { sentenceBounds, sentenceOf, sourceSpan } from './numbers.js';
import { comparisonsIn } from './comparisons.js';
import type { AdjustMethod, ContextStatement } from './types.js';
import { matchesOf } from './matches.js';
import { deniedAt } from './mentions.js';
import { lowerBound } from './offsets.js';

const SIDED = /(?<![\p{L}])(one|two|1|2|single)[- ]?(tailed|sided)(?![\p{L}])|(?<![\p{L}])(non-?directional|directional)(?= (?:test|hypothes|predict))/giu;
const EQUIVALENCE = /(?<![\p{L}])(equivalence test|test of equivalence|tests? for equivalence|TOST|two one-sided|non-?inferiority|equivalence bounds?|(?:test )?against the (?:lower|upper) (?:equivalence )?(?:bound|margin)|(?:lower|upper)[- ]bound test)(?![\p{L}])/giu;
const ALPHA = new RegExp(
  String.raw`(?<![\p{L}])(?:α|alpha|significance level|level of significance|significance threshold|significance criterion)(?: level)?(?: (?:of|was set at|set at|was set to|was|at|equal to))? ?(?:=|:)? ?(?:p ?[<≤=] ?)?(0?\.\d{1,4})(?![\d])`,
  'giu',
);
const ALPHA_AS_P = new RegExp(
  String.raw`(?<![\p{L}])(?:p|P)(?:[- ]values?)? ?[<≤] ?(0?\.\d{1,4}) (?:was|were) (?:considered|deemed|taken as|regarded as|accepted as) (?:statistically )?significant|significance (?:was )?(?:set|defined|accepted|established) (?:at|as) (?:p ?[<≤] ?)?(0?\.\d{1,4})`,
  'giu',
);

/**
 * What "±" stands for where it is neither an SD nor an SE: a multiple of either ("mean ± 2 SE",
 * "± 1.96 SEM"), the half-width of a CI ("means ± half-width of the 95% CI", "mean ± 95% CI"), or
 * a range.
 */
const SPREAD_OTHER = /(?<![\p{L}])(?:mean|M)s? ?(?:±|\+\/-|plus or minus) ?(?:(?:\d(?:\.\d{1,2})?|two|three) ?(?:SDs?|SEMs?|SEs?|standard (?:deviations?|errors?))|(?:the )?half[- ]widths?|(?:the )?(?:\d{2}(?:\.\d)? ?% )?(?:CI|confidence intervals?|confidence limits?)|(?:the )?range)(?![\p{L}])/giu;
const SPREAD_STATEMENT = /(?<![\p{L}])(?:mean|M)s? ?(?:±|\+\/-|plus or minus) ?(SD|SEM|SE|s\.d\.|s\.e\.m\.|s\.e\.|standard deviations?|standard errors?)(?![\p{L}])/giu;

/**
 * Words about a statistical analysis next to a tails word: "one-sided" counts only beside
 * them ("one-sided tests", "p (one-tailed)", "a one-tailed hypothesis"), never in other prose
 * ("a one-sided report of the debate").
 */
const ANALYSIS_WORD = /(?<![\p{L}])(?:tests?|t-tests?|testing|tested|p|P|p[- ]values?|hypothes\p{L}{0,4}|significan\p{L}{0,5}|alpha|α|comparisons?|contrasts?|analys[ie]s|probabilit\p{L}{0,3}|critical|rejection|null|alternative|predictions?|predicted|criterion|threshold|level)(?![\p{L}])/u;
/**
 * A statement about every test of the document, not one of them: plural or universal words
 * ("All tests were two-tailed", "p values are two-sided", "Significance was set at α = .05").
 */
/** Words of the authors' own work ("we", "our", "this study", "the present analysis"): a statement with them is about this study's tests. */
const OWN_WORK = /(?<![\p{L}])(?:we|our|us|this (?:study|trial|paper|report|analysis|work|experiment)|the present (?:study|trial|analysis|work|experiment)|here)(?![\p{L}])/iu;
const GENERAL_WORDS = /(?<![\p{L}])(?:all|every|each|throughout|unless|tests|t-tests|p[- ]values|analyses|comparisons|hypotheses|contrasts|statistical significance|significance (?:was|is|level|threshold|criterion)|level of significance|alpha (?:level|was|of|=)|α ?(?:=|was|of|level))(?![\p{L}])/iu;
/** Words that make an alpha local: a corrected or adjusted alpha, or the alpha of a power calculation. */
const LOCAL_ALPHA = /(?<![\p{L}])(?:corrected|adjusted|Bonferroni|Holm|Šidák|Sidak|per comparison|for (?:this|these|each|the (?:primary|secondary))|family-?wise|power|detect|sample size)(?![\p{L}])/iu;
/**
 * Words that limit a statement to some of the tests: a kind of outcome or analysis ("for the
 * secondary outcomes", "in the exploratory analyses", and as a plural subject "Confirmatory tests
 * were one-tailed"), a study of several ("in Study 2"), an
 * exception of tests ("except for the manipulation check", "other than the safety outcomes"),
 * "only for", "only when", or a condition on the prediction ("where a direction was predicted",
 * "hypotheses that predicted a direction"). Which results such a statement speaks of cannot be told from the
 * text, so it is tied to none beyond its own sentence. An exception or condition that is not
 * about tests ("after excluding two participants", "every participant completed it except one",
 * "as is usual when hypotheses are directional") limits nothing.
 */
const TESTS_NOUN = String.raw`(?:outcomes?|analys[ie]s|comparisons?|tests?|t-tests?|endpoints?|measures?|hypothes[ie]s|contrasts?|predictions?|effects?|variables?|checks?|scales?|subscales?)`;
/** Words naming one test ("the hypothesis was tested one-tailed", "this comparison"): a statement about it is about one result. */
const ONE_TEST = /(?<![\p{L}])(?:the|this|that|our|its|a|one) (?:[\p{L}-]+ ){0,2}(?:hypothesis|test|t-test|comparison|contrast|prediction)(?![\p{L}])/iu;
/** Kinds of test or outcome that are some of a study's, not all. */
const KINDS = String.raw`(?:secondary|exploratory|primary|additional|supplementary|supplemental|post[- ]hoc|subgroup|sensitivity|follow-?up|confirmatory|pre-?registered|planned|individual|selected|remaining|other)`;
/** A sentence whose subject is a kind of test ("Confirmatory tests were one-tailed", "All exploratory analyses used …"). */
const KIND_SUBJECT = new RegExp(String.raw`^\s*(?:the |all |our )?${KINDS} (?:[\p{L}-]+ )?(?:outcomes|analyses|comparisons|tests|t-tests|endpoints|measures|hypotheses|contrasts)(?![\p{L}])`, 'iu');
const RESTRICTED_SCOPE = new RegExp(
  String.raw`(?<![\p{L}])(?:only (?:for|in|when|where|if)|(?:for|in) (?:the |our )?${KINDS} (?:[\p{L}-]+ )?${TESTS_NOUN}|in (?:Study|Experiment|Sample|Phase|Cohort|Trial|Part) (?:\d+|[IVX]+|[A-Z])|(?:except(?: for)?|with the exception of|apart from|other than) (?:the |a |an |one |two |three |our )?(?:[\p{L}-]+ ){0,3}${TESTS_NOUN}|(?:where|when|if) (?:a |the )?direction (?:was|were|is|are|had been) (?:predicted|specified|stated|expected|hypothesi[sz]ed)|${TESTS_NOUN} (?:that|which) (?:predicted|specified|stated) a direction)(?![\p{L}])`,
  'iu',
);
/**
 * A side test named in the sentence: a check of an assumption (normality, equal variances,
 * sphericity), of heterogeneity between sites or studies, of an interaction or effect
 * modification, of goodness of fit. An alpha or tails said in such a sentence ("Normality was
 * checked with the Shapiro–Wilk test at α = .10", "Interaction terms were tested at alpha = .10")
 * is that test's, not the t-tests' (SIDE_TEST_AND_T: unless the sentence names the t-tests too).
 */
const SIDE_TEST = /(?<![\p{L}])(?:normality|Shapiro[-–‐ ]Wilk|Kolmogorov[-–‐ ]Smirnov|Lilliefors|Anderson[-–‐ ]Darling|Levene['’]?s?|Brown[-–‐ ]Forsythe|Bartlett['’]?s?|homogeneity|equality of variances?|equal variances|sphericity|Mauchly['’]?s?|heterogeneity|Cochran['’]?s Q|I²|I\^2|interaction(?:s| terms?| effects?)?|effect modification|modera(?:tion|tor|tors|ting)|goodness[- ]of[- ]fit|Hosmer[-–‐ ]Lemeshow|outliers?|Egger['’]?s?)(?![\p{L}])/iu;
/**
 * A non-inferiority or equivalence test named in the sentence: one-sided by design, so tails or an
 * alpha said there ("The primary hypothesis, non-inferiority ..., was tested one-sided at α =
 * 0.025") are that test's, whatever else the sentence names.
 */
const MARGIN_TEST = /(?<![\p{L}])(?:non-?inferiority|equivalence|TOST|two one-sided tests|superiority margin)(?![\p{L}])/iu;
/** Words naming the t-tests themselves, or every test: a side test named beside them does not take the statement. */
const SIDE_TEST_AND_T = /(?<![\p{L}])(?:t[- ]tests?|all (?:other |remaining )?(?:statistical |hypothesis |significance )?(?:tests|analyses|comparisons|hypotheses)|every (?:other )?test|all p[- ]?values|p[- ]?values (?:were|are)|analyses (?:were|was|used)|throughout|otherwise|(?:statistical )?significance (?:was|is) set|group (?:differences|comparisons)|main (?:analys[ie]s|comparisons?|effects?)|primary)(?![\p{L}])/iu;
/**
 * Words after a tails word that make it the label of a p value printed right after it ("one-tailed
 * p = .037", "one-sided p-value of .04", "a one-tailed test, as preregistered, gives p = .037").
 */
export const LABELS_P = /^[- ]?(?::? ?(?:p|P)(?:[- ]?values?)? ?(?:=|<|>|≤|≥|:|of|would be|was|is) ?0?\.\d|(?:test|tests|t-test|analysis|version),?(?: [\p{L}-]{1,20},?){0,4} (?:gives|gave|yields|yielded|returns|returned|would give) (?:a )?p ?(?:=|<|of) ?0?\.\d)/u;
/** Most characters between a result's own p and a tails word right after it that labels that p ("p = .037, one-tailed"); further off, a word after a second p is that p's. */
export const OWN_P_LABEL_GAP = 4;
/**
 * A tails word that names other tests than a result before it: "both one-sided tests", "the two
 * one-tailed tests" (the pair of an equivalence procedure), and "one-sided tests" (plural)
 * further from the result's own p than a label of it.
 */
export const OTHER_TESTS_BEFORE = /(?:^|[^\p{L}])(?:two|both|pair of) $/iu;
export const OTHER_TESTS_AFTER = /^ (?:t-)?tests\b/iu;
/** Words of an equivalence or non-inferiority procedure near a tails word (not "margin" or "bound" alone: "marginally", a CI's lower bound). */
export const EQUIVALENCE_WORD = /(?<![\p{L}])(?:(?:non-?)?equivalen\p{L}*|TOST|(?:non-?)?inferiority)(?![\p{L}])/iu;
/** A p value printed right before a tails word ("or p = .037 one-tailed", "(.037 one-tailed)"): the tails are that p's. */
export const P_BEFORE = /(?:(?<![\p{L}])(?:p|P) ?(?:=|<|>|≤|≥) ?|\( ?)0?\.\d{1,12},? ?\(?$/u;
/** A p value in the words between a result's own p and a tails word: the tails may be that second p's. */
export const A_P_VALUE = /(?<![\p{L}])(?:p|P) ?(?:=|<|>|≤|≥) ?0?\.\d/u;
/** Words of a power or sample-size calculation: its tails and alpha size the study, they do not say how its tests were run. */
const PLANNING = /(?<![\p{L}])(?:power(?:ed)?|to detect|sample size|sample-size|G\*Power|minimum (?:detectable|effect))(?![\p{L}])/iu;

/**
 * A correction said of every p: words about p values, or about all, every or each test or
 * comparison ("All p values were Bonferroni-corrected"; not "the post hoc comparisons").
 */
const EVERY_P = /(?<![\p{L}])(?:p[- ]?values?|(?:all|every|each)(?: [\p{L}-]+){0,3} (?:tests?|t-tests?|comparisons?|contrasts?|analyses|outcomes|p[- ]?values?)|(?:two|three|four|five|six|seven|eight|nine|ten|\d{1,3}) (?:[\p{L}-]+ )?(?:tests|t-tests|comparisons|contrasts|analyses|outcomes|endpoints))(?![\p{L}])/iu;
/** How far from the correction's name (characters, within its sentence) the words of EVERY_P may stand. */
const EVERY_P_REACH = 60;

/** Words saying p values were not corrected ("did not correct", "no adjustment", "were not adjusted", "uncorrected"). */
const NOT_CORRECTED = /(?<![\p{L}])(?:(?:not|no|none|never|without)(?: (?:further|formal|explicit|any|a|the|be|been|were|was|is|are|of|p|p-values?|values?)){0,5} (?:[\p{L}–-]+[- ])?(?:correct|adjust)\p{L}*|(?:did|do|does|was|were) not (?:apply|applied|use|used|perform|performed)|uncorrected|unadjusted|raw p|(?:are|were|is) raw)(?![\p{L}])/iu;
/** A correction of alpha rather than of the p values ("a Bonferroni-corrected alpha of .017", "α = .05/3"): the p values stay unadjusted. */
const CORRECTED_ALPHA = /(?<![\p{L}])(?:(?:corrected|adjusted) (?:alpha|α|significance (?:level|threshold|criterion)|threshold|level)|(?:alpha|α|significance level|threshold)(?: level)?(?: was| of)? (?:[\p{L}–-]+[- ])?(?:corrected|adjusted|divided)|0?\.0[1-5] ?\/ ?\d|(?:alpha|α|threshold|level|criterion|p ?[<≤]|below|at|to) (?:(?:of|=|was|set at|set to) ?)?0?\.0(?:[0-4]\d*|5\d+)(?!\d))/iu;

/**
 * A correction for multiple comparisons named in a sentence. Hommel's and Westfall and Young's
 * only with words of a procedure ("the Hommel procedure", "Hommel-adjusted", "Westfall–Young"),
 * not as authors cited ("Hommel et al. (2001)", "Westfall, Kenny and Judd").
 */
const CORRECTION = /(?<![\p{L}])(Bonferroni|Holm|Šidák|Sidák|Sidak|Hochberg|Hommel(?=(?:['’]s)?[- ](?:procedure|method|correction|adjust\p{L}*|correct\p{L}*|test|approach))|Benjamini|false discovery rate|FDR|Tukey|Westfall(?=[-–‐ ](?:and )?Young))(?![\p{L}])/iu;
/**
 * A correction for multiple comparisons said to have been made without naming one: the p values
 * or tests "were adjusted for multiple comparisons", "we corrected for multiple testing", "a
 * correction for multiplicity was applied", "after adjustment for multiple comparisons",
 * "multiplicity-adjusted". Read as a correction of unknown kind, which can give any p from the
 * unadjusted one up to 1. Only such words of something done: mentions of a correction not made,
 * not needed or weighed (UNDONE_CORRECTION) are none.
 */
const UNNAMED_CORRECTION = /(?<![\p{L}])(?:(?:were|was|are|is|been|we|after|following|with) (?:all |then |each |also |both )?(?:(?:the |their |all )?(?:p[- ]?values? |p |results |tests |analyses |comparisons )?)(?:adjust|correct)(?:ed|ing|ion|ment)? (?:(?:all |the |their |our )?(?:p[- ]?values?|p|results|tests|analyses|comparisons|estimates) )?for (?:the )?(?:multiple (?:comparisons?|testing|tests|hypotheses|outcomes|endpoints)|multiplicity)|multiplicity[- ](?:adjusted|corrected)|(?:multiple[- ](?:comparisons?|testing)|multiplicity) (?:adjustments?|corrections?) (?:was|were) (?:applied|made|used|performed|carried out))(?![\p{L}])/iu;
/** Words that make a correction one not made, not needed, hypothetical or still to come ("deemed unnecessary", "reported before adjustment", "would not remain significant after correcting"). */
const UNDONE_CORRECTION = /(?<![\p{L}])(?:would|could|might|should|had we|if we|unnecessary|not (?:needed|necessary|required|warranted)|deemed|before (?:any )?(?:adjustment|correction)|prior to (?:any )?(?:adjustment|correction)|unadjusted|uncorrected)(?![\p{L}])/iu;

/** Statements about tails, equivalence testing, alpha and what ± stands for, in one segment. */
export function findStatements(seg: Segment, sentenceStarts: number[]): ContextStatement[] {
  const out: ContextStatement[] = [];
  const text = seg.text;
  const base = (a: number, b: number) => ({
    span: sourceSpan(seg, a, b),
    segment: seg.id,
    block: seg.block,
    sentence: sentenceOf(sentenceStarts, a),
    printed: text.slice(a, b),
  });
  // What each sentence's words say, read once per sentence: a sentence of thousands of
  // statements would otherwise be searched again for each.
  const readings = new Map<number, { planning: boolean; own: boolean; general: boolean; local: boolean; restricted: boolean; single: boolean; sideTests: boolean }>();
  // a side test named in the clause of a tails or alpha word ("Normality was checked with the
  // Shapiro–Wilk test at α = .10"), in a sentence that names neither the t-tests nor every test:
  // the word is that test's (a clause ends at a semicolon or colon)
  // (each sentence's clauses are read once: a sentence of thousands of statements stays linear)
  const clausesOf = new Map<number, { ends: number[]; side: boolean[] }>();
  const ofSideTest = (at: number, sentence: { sideTests: boolean }): boolean => {
    if (!sentence.sideTests) return false;
    const i = sentenceOf(sentenceStarts, at);
    let c = clausesOf.get(i);
    if (!c) {
      const [from, to] = sentenceBounds(sentenceStarts, at, text.length);
      c = { ends: [], side: [] };
      let start = from;
      for (let k = from; k <= to; k += 1) {
        if (k === to || text[k] === ';' || text[k] === ':') {
          c.ends.push(k);
          c.side.push(SIDE_TEST.test(text.slice(start, k)));
          start = k + 1;
        }
      }
      clausesOf.set(i, c);
    }
    // the clause holding `at`: the first whose end is at or after it (the last one ends the sentence)
    return c.side[Math.min(lowerBound(c.ends, at), c.ends.length - 1)] === true;
  };
  const sentenceOfAt = (at: number) => {
    const i = sentenceOf(sentenceStarts, at);
    let r = readings.get(i);
    if (!r) {
      const sentence = text.slice(sentenceStarts[i] as number, sentenceStarts[i + 1] ?? text.length);
      r = { planning: PLANNING.test(sentence), own: OWN_WORK.test(sentence), general: GENERAL_WORDS.test(sentence), local: LOCAL_ALPHA.test(sentence), restricted: RESTRICTED_SCOPE.test(sentence) || KIND_SUBJECT.test(sentence) || MARGIN_TEST.test(sentence), single: ONE_TEST.test(sentence), sideTests: !SIDE_TEST_AND_T.test(sentence) };
      readings.set(i, r);
    }
    return r;
  };
  if (/tail|sided|directional/i.test(text)) for (const m of matchesOf(SIDED, text)) {
    const word = (m[1] ?? m[3] ?? '').toLowerCase();
    const one = word === 'one' || word === '1' || word === 'single' || word === 'directional';
    const near = text.slice(Math.max(0, m.index - 40), Math.min(text.length, m.index + m[0].length + 30));
    if (!ANALYSIS_WORD.test(near)) continue;
    const sentence = sentenceOfAt(m.index);
    const planning = sentence.planning;
    const end = m.index + m[0].length;
    const labelsP = LABELS_P.test(text.slice(end, end + 60)) ? ('after' as const) : P_BEFORE.test(text.slice(Math.max(0, m.index - 24), m.index)) ? ('before' as const) : undefined;
    // "both one-sided tests", "two one-sided tests" beside words of equivalence: the pair of
    // tests of that procedure (EQUIVALENCE below), not the tails of the sentence's other tests
    if (OTHER_TESTS_BEFORE.test(text.slice(Math.max(0, m.index - 12), m.index)) && EQUIVALENCE_WORD.test(text.slice(Math.max(0, m.index - 80), end + 80))) continue;
    // "We did not use one-tailed tests", "No one-tailed tests were used", "we avoided one-tailed
    // tests": no declaration of one tail
    if (deniedAt(text, m.index, end, sentenceStarts)) continue;
    const restricted = sentence.restricted || ofSideTest(m.index, sentence);
    out.push({ kind: 'sidedness', sidedness: one ? 'one' : 'two', general: !planning && sentence.general && !restricted, ...(sentence.own ? { ownWork: true as const } : {}), ...(planning ? { planning } : {}), ...(restricted ? { restricted: true as const } : {}), ...(sentence.single && !sentence.general ? { single: true as const } : {}), ...(labelsP ? { labelsP } : {}), ...base(m.index, end) });
  }
  if (/equivalen|TOST|one-sided|inferiority|bound|margin/i.test(text)) for (const m of matchesOf(EQUIVALENCE, text)) {
    out.push({ kind: 'equivalence', sidedness: 'one', ...base(m.index, m.index + m[0].length) });
  }
  if (/±|\+\/-|plus or minus/.test(text)) {
    for (const m of matchesOf(SPREAD_STATEMENT, text)) {
      const sd = /^(sd|s\.d\.|standard dev)/i.test(m[1] as string);
      out.push({ kind: 'spread', spread: sd ? 'SD' : 'SE', ...base(m.index, m.index + m[0].length) });
    }
    for (const m of matchesOf(SPREAD_OTHER, text)) out.push({ kind: 'spread', spreadOther: true, ...base(m.index, m.index + m[0].length) });
  }
  if (/Bonferroni|Holm|id[aá]k|Hochberg|Hommel|Benjamini|discovery|FDR|Tukey|Westfall|multipl/i.test(text)) {
    for (let i = 0; i < sentenceStarts.length; i += 1) {
      const a = sentenceStarts[i] as number;
      const sentence = text.slice(a, sentenceStarts[i + 1] ?? text.length);
      // a named correction first: words without a name in the same sentence speak of it
      const named = CORRECTION.exec(sentence);
      const method = named ?? (UNDONE_CORRECTION.test(sentence) ? null : UNNAMED_CORRECTION.exec(sentence));
      if (!method) continue;
      const comparisons = comparisonsIn(sentence)?.m;
      const b = a + method.index + method[0].length;
      const near = sentence.slice(Math.max(0, method.index - EVERY_P_REACH), method.index + method[0].length + EVERY_P_REACH);
      const notOfP = NOT_CORRECTED.test(sentence) || CORRECTED_ALPHA.test(sentence) || deniedAt(text, a + method.index, b, sentenceStarts);
      out.push({
        kind: 'multiplicity',
        // "Bonferroni–Holm" is Holm's procedure; Benjamini–Yekutieli's bound is not Benjamini–Hochberg's
        method: method[1] === undefined || /Yekutieli/iu.test(sentence) ? 'unspecified' : /Holm/u.test(sentence) ? 'holm' : correctionMethod(method[1]),
        ...(method[1] === undefined ? { unnamed: true as const } : {}),
        general: EVERY_P.test(near),
        ...(notOfP ? { notOfP: true as const } : {}),
        ...(comparisons !== undefined ? { comparisons } : {}),
        ...base(a + method.index, b),
      });
    }
  }
  if (/α|alpha|significan|level/i.test(text)) for (const re of [ALPHA, ALPHA_AS_P]) {
    for (const m of matchesOf(re, text)) {
      const value = Number(m[1] ?? m[2]);
      const sentence = sentenceOfAt(m.index);
      const planning = sentence.planning;
      const restricted = sentence.restricted || ofSideTest(m.index, sentence);
      if (value > 0 && value < 0.5) out.push({ kind: 'alpha', alpha: value, general: sentence.general && !sentence.local && !restricted, ...(planning ? { planning } : {}), ...(restricted ? { restricted: true as const } : {}), ...(sentence.single && !sentence.general ? { single: true as const } : {}), ...base(m.index, m.index + m[0].length) });
    }
  }
  return out;
}

/** Sentences that name a t-test: used to spot a p given without its t. */
export const NAMES_T_TEST = /(?<![\p{L}])(?:(?:paired|unpaired|independent|one-sample|two-sample|Welch(?:'s|’s)?|Student(?:'s|’s)?)[- ](?:samples? )?)?t[- ]tests?(?![\p{L}])|(?<![\p{L}])(?:Student|Welch)(?:'s|’s)? t(?![\p{L}])/giu;

function correctionMethod(word: string): AdjustMethod {
  const w = word.toLowerCase();
  if (w === 'bonferroni') return 'bonferroni';
  if (w === 'holm') return 'holm';
  if (w === 'hochberg') return 'hochberg';
  if (w === 'sidak' || w === 'šidák' || w === 'sidák') return 'sidak';
  if (w === 'tukey') return 'tukey';
  // Hommel's procedure and Westfall and Young's resampling are read as a correction of unknown
  // kind (at least the unadjusted p, at most 1), not held to a formula
  if (w === 'hommel' || w === 'westfall') return 'unspecified';
  return 'fdr';
}
