import type { Segment } from '../parse/types.js';
import { sentenceBounds, sentenceOf, sourceSpan } from './numbers.js';
import type { Mention, TestNameWords } from './types.js';
import { matchesOf } from './matches.js';
import { stem, topicWords } from './topic.js';

const SOFTWARE = /(?<![\p{L}])(R|RStudio|SPSS|IBM SPSS Statistics|Stata|SAS|JASP|jamovi|Python|SciPy|statsmodels|GraphPad Prism|Prism|Minitab|MATLAB|Excel|G\*Power|Statistica|JMP)(?![\p{L}])(?:[^.;\n]{0,40}?(?:version |v\.? ?|\()?(\d{1,4}(?:\.\d{1,4}){1,3}))?/gu;
const SOFTWARE_CONTEXT = /(?<![\p{L}])(software|package|statistical|analy[sz]ed|analyses|using|version|computed|performed)(?![\p{L}])/iu;
/** A named check of an assumption: a test of normality or of equal variances, or a diagnostic plot. */
const ASSUMPTION_CHECK = /(?<![\p{L}])(Shapiro[-–‐ ]Wilk|Kolmogorov[-–‐ ]Smirnov|Lilliefors|Anderson[-–‐ ]Darling|D['’]Agostino(?:[-–‐ ]Pearson)?|Levene['’]?s?(?: tests?)?|Brown[-–‐ ]Forsythe|Bartlett['’]?s tests?|Q[-–‐ ]?Q[- ]plots?|P[-–‐ ]?P[- ]plots?|normal probability plots?|quantile[-–‐ ]quantile plots?)(?![\p{L}])/giu;
/** What an assumption check is about: it needs a verb of checking in its sentence. */
const ASSUMPTION_TOPIC = /(?<![\p{L}])(normality|normally distributed|normal distributions?|approximately normal|non-?normality|equal(?:ity of)? variances?|homogeneity of variances?|variances were equal|homoscedastic\p{L}{0,6}|heteroscedastic\p{L}{0,6}|distributions? of the (?:differences|residuals|difference scores|scores|data)|assumptions? of (?:the |each |these |all )?(?:t[- ]?tests?|tests?|analys[ie]s)|(?:the |these |its |their )assumptions|histograms?|skew(?:ness|ed)?)(?![\p{L}])/giu;
/** Verbs that say a check was run. */
const CHECK_DONE = /(?<![\p{L}])(check(?:ed|ing|s)?|test(?:ed|ing)|assess(?:ed|ing|ment)?|examin(?:ed|ing|ation)|inspect(?:ed|ing|ion)|evaluat(?:ed|ing|ion)|verif(?:ied|y|ying|ication)|explor(?:ed|ing)|screen(?:ed|ing)|plotted|visuali[sz](?:ed|ing))(?![\p{L}])/giu;
/** Verbs that report what a check found: a negation there is still a check ("normality was not violated"). */
const CHECK_FOUND = /(?<![\p{L}])(met|satisfied|held|violat(?:ed|ion|ions)|confirmed|indicated|suggested|showed|revealed|looked|appeared|departures? from|deviat(?:ed|ion|ions))(?![\p{L}])/giu;
/** A negation right before a verb of checking: "was not checked", "did not formally test", "without checking", "no check". */
const NEGATED_BEFORE = /(?:(?<![\p{L}])(?:not|never|no|without|nor|neither)|n['’]t)(?: \p{L}{1,15}){0,2} $/iu;
/** Words about what a test assumes, not about a check: "does not assume equal variances", "equal variances not assumed". */
const ASSUMING_BEFORE = /(?<![\p{L}])assum(?:e|es|ed|ing)(?: \p{L}{1,12}){0,2} $/iu;
const ASSUMED_AFTER = /^ (?:(?:was|were|is|are|not|be) ){0,2}assumed(?![\p{L}])/iu;
/** A named check said not to have been run: "No Shapiro–Wilk test was performed", "Levene's test was not used". */
const CHECK_NOT_RUN = /^[\p{L}'’ ]{0,20} (?:was|were) not (?:run|performed|conducted|used|done|applied|carried out|reported)(?![\p{L}])/iu;
/** How far (characters) a verb of checking may stand from what it checks, within the sentence. */
const CHECK_REACH = 80;
const MULTIPLICITY = /(?<![\p{L}])(Bonferroni|Holm|Šidák|Sidak|Hochberg|Hommel(?=(?:['’]s)?[- ](?:procedure|method|correction|adjust\p{L}*|correct\p{L}*|test|approach))|Westfall(?=[-–‐ ](?:and )?Young)|Benjamini|false discovery rate|FDR|family-?wise|multiple (?:comparisons|testing|tests)|multiplicity|adjusted p(?:[- ]values?)?|corrected for multiple|Tukey['’]?s?(?: HSD)?)(?![\p{L}])/giu;
const TREND = /(?<![\p{L}])(trend(?:ed)? (?:towards?|to) (?:significance|be significant)|a trend|marginal(?:ly)? (?:significant|significance)|approach(?:ed|ing) (?:statistical )?significance|borderline significan\p{L}*|nearly significant|almost significant|tended to)(?![\p{L}])/giu;
const EXCLUSION = /(?<![\p{L}])(exclu\p{L}+|dropped out|drop-?outs?|withdr[ae]w\p{L}*|lost to follow-?up|missing data|incomplete data|did not complete|attrition|removed from (?:the )?analys[ie]s|(?:were|was) (?:in)?eligible|(?:which|who|that) \d{1,6} (?:\p{L}{2,20} )?(?:attended|returned|completed|responded))(?![\p{L}])/giu;
const TEST_NAME = /(?<![\p{L}])((?:paired|unpaired|independent|one[- ]sample|single[- ]sample|two[- ]sample|dependent|related|repeated[- ]measures|within[- ]subjects?|between[- ]subjects?)(?:[- ]samples?)? t[- ]tests?|Welch['’]?s?(?: t)?(?:[- ]tests?)?|(?:paired )?Student(?:['’]s)? t(?:[- ]?tests?)?|t[- ]tests? for (?:paired|independent|dependent|related) samples|unequal[- ]variances? t[- ]tests?|t[- ]tests? (?:assuming|with) unequal variances|t[- ]tests? (?:(?:that|which) (?:did|does|do) not assume|not assuming|without assuming) equal variances|equal variances not assumed|pooled[- ]variances? t[- ]tests?|t[- ]tests? (?:(?:that|which) )?(?:assumed|assuming|assume|assumes|with) equal variances|equal variances assumed)(?![\p{L}])/giu;
/**
 * Words naming an analysis of variance with repeated measures, or the sphericity correction that
 * goes with one: an F of such an analysis may carry a corrected p beside its uncorrected dfs.
 * A "mixed model" is not one of them (its F has dfs of its own); nor is "sphericity" alone (a
 * shape), only its assumption, test, correction or violation.
 */
const REPEATED_MEASURES = /(?<![\p{L}])(repeated[- ]measures?(?: (?:analys[ie]s of variance|ANOVAs?|MANOVAs?))|(?:ANOVAs?|analys[ie]s of variance) (?:with|for|on) repeated measures|RM[- ]?ANOVAs?|within[- ]subjects?(?: (?:analys[ie]s of variance|ANOVAs?|factors?))|mixed(?:[- ]design)? ANOVAs?|split[- ]plot ANOVAs?|sphericity (?:assumptions?|corrections?|(?:was|were|is|are) (?:violated|not assumed|not met))|(?:assumptions?|violations?|tests?|corrections?|corrected) (?:of|for) (?:the )?(?:assumption of )?sphericity|Greenhouse[-–‐ ]Geisser|Huynh[-–‐ ]Feldt|Mauchly['’]?s?(?: test)?)(?![\p{L}])/giu;
/** A correction's name that says one was applied (not an analysis's name, which says nothing of a correction). */
const CORRECTION_WORD = /^(?:sphericity|assumptions?|violations?|tests?|corrections?|corrected|Greenhouse|Huynh|Mauchly)/iu;
/** Words saying sphericity held, so that no correction was due ("Mauchly's test showed that sphericity held"). */
const SPHERICITY_HELD = /(?<![\p{L}])(?:sphericity|(?:assumption of|the) sphericity(?: assumption)?) (?:held|was met|could be assumed|was assumed|was not violated|had not been violated)(?![\p{L}])/iu;
/** Words naming an analysis between groups only: an F said with them is not one of repeated measures. */
const BETWEEN_SUBJECTS = /(?<![\p{L}])(?:between[- ](?:subjects?|groups?|participants?) (?:analys[ie]s of variance|ANOVAs?|designs?|factors?)|independent[- ]groups? (?:analys[ie]s of variance|ANOVAs?)|(?:two|three|four|five|six|\d{1,2}) independent (?:groups|samples))(?![\p{L}])/giu;
/** A sentence saying no sphericity correction was applied: sphericity held, or the dfs are uncorrected. */
const NO_SPHERICITY_CORRECTION = /(?<![\p{L}])(?:(?:sphericity|Mauchly)[^.;]{0,80}?(?:held|was met|could be assumed|was assumed|not violated|no correction|uncorrected)|uncorrected (?:dfs|degrees of freedom))(?![\p{L}])/iu;
/**
 * Words saying p values came from resampling rather than from a distribution ("p values were
 * obtained from 10,000 permutations", "permutation-based p values"): such a p need not follow
 * from its statistic.
 */
const RESAMPLED_P = /(?<![\p{L}])(?:p[- ]?values?|significance(?: levels?)?)(?: (?:were|was|are|is))? (?:obtained|computed|calculated|derived|estimated|determined|assessed|based|come|comes|came)(?: [\p{L}-]{2,20}ly,?)?(?: (?:by|with|using|from|through|via|on))(?: (?:a|an|the))?(?: \d{1,3}(?:[, \u00A0\u2009\u202F]\d{3}){1,4}| \d{1,12})?(?: (?:random|Monte Carlo))? (?:permutations?|permutation tests?|permuting|bootstrap(?:ping|ped)?|resampling|Monte Carlo|randomi[sz]ations?|randomi[sz]ation tests?|(?:randomly )?(?:re)?shuffl(?:ing|ed|es?))(?![\p{L}])|(?<![\p{L}])(?:permutation|permuted|bootstrap(?:ped)?|resampling|Monte Carlo|randomi[sz]ation)[- ](?:based )?p(?:[- ]?values?)?(?![\p{L}])|(?<![\p{L}])p_?perm(?![\p{L}])/giu;
/**
 * A df approximated rather than counted (mixed models' Satterthwaite or Kenward–Roger dfs): such
 * a df is a real number, and one printed whole may have been rounded. Only with words of a df or
 * a method after the name ("Satterthwaite's approximation", "Kenward–Roger degrees of freedom",
 * "the Satterthwaite method"), or words of a df before it ("degrees of freedom … with
 * Satterthwaite's"), never a cited author ("Satterthwaite, F. E. (1946)"). "Welch–Satterthwaite"
 * (any dash, a slash) is Welch's test's own df, read with Welch's test (TEST_NAME), not here.
 */
const APPROXIMATE_DF = /(?<![\p{L}])(?<!Welch ?[-–—‐‑/] ?)(?<!Welch )(?:Satterthwaite|Kenward[-–—‐‑ ]Roger)(?:['’]s)?(?![\p{L}])/giu;
/** Words of a method or a df right after the name ("approximation", "degrees of freedom", "-adjusted"). */
const APPROXIMATE_DF_AFTER = /^(?: (?:approximation|method|correction|adjustment|df|dfs|d\.f\.|degrees? of freedom|denominator)|[-–—‐‑](?:approximated|adjusted|corrected))(?![\p{L}])/iu;
/** Words of a df before the name, within its sentence ("degrees of freedom were computed with Satterthwaite's"). */
const APPROXIMATE_DF_BEFORE = /(?<![\p{L}])(?:degrees of freedom|dfs?|d\.f\.)(?![\p{L}])/iu;
/** How far before the name (characters, within its sentence) the words of a df may stand. */
const APPROXIMATE_DF_REACH = 60;
/**
 * Words of comparisons made within a larger analysis of variance, whose t may take the whole
 * analysis's pooled error term and its df (N − k): planned or post hoc contrasts, pairwise or
 * follow-up comparisons, simple effects, and the named procedures (Tukey's HSD, Fisher's LSD,
 * Scheffé, Dunnett). Not "in contrast" or "by contrast" (a connective), nor a contrast of
 * colours or stimuli: "contrast" only in the plural after nothing, or after a kind of contrast;
 * not "Tukey" alone (Tukey's fences for outliers, a citation), only with HSD, a test or comparisons.
 */
const CONTRAST = /(?<![\p{L}])(?:(?:planned|a[- ]priori|orthogonal|polynomial|linear|quadratic|Helmert|post[- ]hoc|custom|pairwise|interaction) contrasts?|contrasts (?:showed|revealed|indicated|confirmed|were|was)|post[- ]?hoc (?:tests?|t[- ]tests?|comparisons?|analys[ie]s|pairwise)|pairwise (?:comparisons?|t[- ]tests?)|follow[- ]up (?:comparisons?|contrasts?|pairwise)|simple (?:main )?effects?(?: analys[ie]s| tests?)?|Tukey['’]?s?(?: HSD| honest(?:ly)? significant difference| (?:post[- ]?hoc|tests?|comparisons?|procedure|correction|method|adjustment))|Fisher['’]?s (?:protected )?LSD|LSD(?= (?:tests?|post|comparisons?|procedure))|Scheff[eé]['’]?s?|Dunnett['’]?s?)(?![\p{L}])/giu;
/**
 * Words saying the means printed are not plain means of the scores: adjusted for covariates,
 * estimated from a model (estimated marginal, least-squares, model-based, predicted), pooled over
 * multiply imputed data sets, or back-transformed. Such a mean of whole-number scores need not be
 * a multiple of 1/n.
 */
const DERIVED_MEANS = /(?<![\p{L}])(?:(?:covariate[- ]|baseline[- ])?adjusted (?:group )?means?|estimated marginal means?|EMMs?|least[- ]squares? means?|LS[- ]?means?|model[- ](?:estimated|based|predicted|derived|adjusted) (?:group )?(?:means?|estimates?|values?)|predicted (?:group )?means?|back[- ]transformed (?:group )?means?|(?:means?|estimates?) (?:were|are|was|is) (?:pooled|combined) (?:over|across) (?:the )?(?:imputations|imputed)|multiple imputation|multiply imputed)(?![\p{L}])/giu;
/**
 * Words saying a document reports several studies or experiments ("Across two studies (total N =
 * 146)", "Experiments 1 and 2", "Study 2"): a total stated for them need not be the sample of any
 * one test.
 */
const SEVERAL_STUDIES = /(?<![\p{L}])(?:(?:two|three|four|five|six|2|3|4|5|6) (?:separate |independent |online |preregistered |pre-registered )?(?:studies|experiments)|(?:Studies|Experiments) \d{1,2}(?: ?(?:and|,|&|–|-) ?\d{1,2})+|(?:across|in both|in all|over) (?:the |our |these )?(?:studies|experiments)|(?:Study|Experiment) (?:2|3|4|II|III|IV|two|three|four)(?! (?:of|in) (?:an?|the|their|our|a previous|an earlier) ?(?:earlier|previous|prior|related|original|published)?))(?![\p{L}\p{N}])/giu;
/**
 * Words saying the analyses use a part of the sample stated ("this analysis concerns the women",
 * "a subgroup analysis", "in a subsample of", "restricted to the 90 women"): the total is then not
 * the number the tests analyse.
 */
const PART_OF_SAMPLE = /(?<![\p{L}])(?:sub-?group analys[ie]s|sub-?groups? of|sub-?samples?|(?:this|the present|these|our|the) (?:analys[ie]s|report|paper|study) (?:concerns?|concerned|includes?|included|(?:is|was|are|were) restricted to|(?:is|was|are|were) limited to|focus(?:es|ed)? on)|(?:restricted|limited) to (?:the )?(?:\d{1,6} )?(?:women|men|girls|boys|participants|patients|those|children|adults|completers))(?![\p{L}])/giu;
/**
 * Words of three or more groups or arms ("randomised to one of three groups", "a three-arm trial",
 * "randomised to strength training, walking or advice"): a t compares two of them, so it uses part
 * of the sample.
 */
const MANY_ARMS = /(?<![\p{L}])(?:(?:three|four|five|six|3|4|5|6)[- ](?:arm(?:ed)?|groups?|conditions?|arms|treatment groups|intervention groups)|(?:three|four|five|six|3|4|5|6) (?:parallel |randomi[sz]ed |study |treatment |intervention |experimental )?(?:groups|arms|conditions)|(?:randomi[sz]ed|allocated|assigned)(?: (?:equally|evenly|at random|randomly|in a 1:1:1 ratio))? to (?:(?! or | and )[\p{L}\p{N}' -]){2,40}, (?:(?! or | and )[\p{L}\p{N}' -]){2,40},? (?:or|and) [\p{L}\p{N}'-]{2,20})(?![\p{L}])/giu;
/**
 * Words saying values were transformed for the analysis ("log-transformed for the t-tests", "a
 * t-test on log-transformed values", "analysed on the log scale", "geometric means"): a t of the
 * transformed values does not follow from the untransformed means and SDs printed beside it.
 */
const TRANSFORMED = /(?<![\p{L}])(?:(?:natural[- ])?log(?:arithm(?:ic(?:ally)?)?)?(?:[- ]?(?:10|e|2))?[- ]?transform(?:ed|ation|ing)?|ln[- ]transform(?:ed|ation)?|(?:square[- ]root|cube[- ]root|reciprocal|inverse|Box[- ]Cox|arcsine|logit|rank(?:-based)? inverse[- ]normal)[- ]?transform(?:ed|ation|ing)?|(?:on|of|using) (?:the )?(?:log(?:arithms?)?|logged|natural log|ln)(?: |-)(?:values|scores|data|scale|concentrations|counts|times)|(?:analy[sz]ed|tested|compared) on (?:a|the) log(?:arithmic)? scale|geometric means?)(?![\p{L}])/giu;
/**
 * Words naming an exact test or a corrected χ² (Fisher's exact test, Freeman–Halton, mid-p, Yates's
 * continuity correction, Monte Carlo p): a p printed beside a χ² with them may be that test's, not
 * the upper tail of the χ² printed. Not "exact p values" (a p printed in full), nor an exact
 * binomial test (of a proportion, not of a table).
 */
const EXACT_TEST = /(?<![\p{L}])(?:Fisher['’]?s?(?:[-–‐ ](?:Freeman[-–‐ ]Halton|Irwin))?(?: exact)?(?: tests?| p| probability| method)|Fisher['’]?s? exact|exact tests?|Freeman[-–‐ ]Halton|mid[- ]p|Yates['’]?s?(?: continuity)? correct(?:ion|ed)|continuity[- ]correct(?:ion|ed)|Monte Carlo p|Barnard['’]?s? (?:exact )?test|Boschloo['’]?s? test)(?![\p{L}])/giu;
/**
 * Words saying comparisons were estimated from a model rather than by a t-test of two groups'
 * scores: a mixed, multilevel or random-effects model, generalised estimating equations,
 * regression, analysis of covariance, adjustment for covariates ("adjusted for age, sex and
 * body-mass index", "controlling for"). Such a t need not follow from the groups' means and SDs,
 * and its df need not be n1 + n2 − 2.
 */
const MODEL_BASED = /(?<![\p{L}])(?:(?:linear |generali[sz]ed linear |generali[sz]ed )?mixed[- ](?:effects? )?models?|multilevel models?|hierarchical (?:linear )?models?|random[- ](?:intercepts?|effects?)(?: models?)?|generali[sz]ed estimating equations?|GEE|(?:linear|multiple|multivariable|multivariate) regression|regression models?|regression|ANCOVA|analys[ie]s of covariance|adjust(?:ed|ing|ment)? for (?!multiple|multiplicity)\p{L}+|controlling for \p{L}+|(?:covariate|baseline)[- ]adjusted|adjusted (?:difference|mean difference|analys[ie]s|models?|estimates?))(?![\p{L}])/giu;
/**
 * Words saying an effect size is standardised by another SD than the groups' own: the pooled
 * baseline or pre-test SD, a reference or population SD ("Effect sizes were standardised by the
 * pooled baseline SD", "d = difference in change ÷ pooled baseline SD"). Such a d does not follow
 * from the t or the SDs printed beside it. (The control group's SD, Glass's Δ, is computed.)
 */
const D_STANDARDISER = /(?<![\p{L}])(?:(?:standardi[sz]ed|divided|scaled) by|(?:computed|calculated|estimated|derived|expressed) (?:using|with|from|relative to)|÷|\/) ?(?:the )?(?:pooled )?(?:(?:baseline|pre-?test|pre-?treatment|pre-?intervention|pre-?randomi[sz]ation|reference|population|normative) (?:SDs?|standard deviations?)|(?:SDs?|standard deviations?)(?: of(?: \p{L}{1,20}){1,4})? at (?:baseline|pre-?test|pre-?treatment))(?![\p{L}])/giu;
/** Words of an effect size in the sentence of D_STANDARDISER: "effect size", "SMD", "Cohen's d", "d =", "d is" (not a bare "d", nor "14 d was", which are days). */
const EFFECT_SIZE_WORDS = /(?<![\p{L}])(?:effect sizes?|standardi[sz]ed (?:mean )?differences?|SMDs?|Cohen['’]?s d|Hedges['’]? g|(?<!\d ?)[dg] ?(?:=|is|was)(?![\p{L}]))(?![\p{L}])/iu;
/** Words of other studies than the report's own ("an earlier trial", "the pilot study", "et al."). */
const OTHER_STUDY = /(?<![\p{L}])(?:(?:earlier|previous|prior|pilot|other|published) (?:trials?|stud(?:y|ies)|work|research|reports?|meta-analys[ie]s)|et al)(?![\p{L}])/iu;
/** A sentence that plans the study (power, sample size) or speaks of other studies: its words define no effect size of this report. */
const NOT_THIS_REPORTS = new RegExp(String.raw`(?<![\p{L}])(?:power(?:ed)?|sample size|to detect)(?![\p{L}])|${OTHER_STUDY.source}`, 'iu');
/**
 * Words saying a test compares cluster means without their number, in words that govern the test
 * ("on school means", "comparing school-level means", "analysed at the school level"; not "school
 * means varied", "randomised at the school level"): its df counts the clusters, not the people the
 * group sizes beside it count. (With a number, "the 12 school means", it is a unit count,
 * src/extract/summaries.ts.)
 */
const CLUSTER_MEANS_WORDS = /(?<![\p{L}\p{N}])(?:(?:on|comparing|compared|using|across|between) (?:the )?(?:school|ward|class|classroom|clinic|practice|site|cluster|village|team|hospital|home|district|community|household|farm|plot)(?:[- ]level)? (?:means|averages)|(?:means|averages) of (?:the )?(?:schools|wards|classes|classrooms|clinics|practices|sites|clusters|villages|teams|hospitals|homes|districts|communities|households|farms|plots)|(?:analy[sz]ed|analys[ie]s|compared|tested|tests?) at the (?:school|ward|class|classroom|clinic|practice|site|cluster|village|team|hospital|district|community|household)[- ]level|cluster[- ]level (?:analys[ie]s|t[- ]tests?|comparisons?))(?![\p{L}])/giu;
/** The verb that ends a sentence's subject: "Fatigue was rated …", "CRP values were log-transformed". */
const SUBJECT_END = /(?<![\p{L}])(?:was|were|is|are|has|have|had|been)(?![\p{L}])/iu;
/** Words of a subject that name no measure by themselves ("Baseline scores", "All outcomes", "Secondary measures"). */
const NO_MEASURE = new Set(['baseline', 'secondary', 'primary', 'total', 'mean', 'means', 'all', 'values', 'value', 'scores', 'score', 'data', 'outcome', 'outcomes', 'measure', 'measures', 'variable', 'variables', 'covariate', 'covariates', 'each', 'both']);
/**
 * The measure a sentence opens with, as the stems of its subject's content words up to its verb
 * ("Blood glucose values were log-transformed": blood, gluco), less words that name no measure
 * ("Baseline", "values"); undefined when the subject names none, or the sentence speaks of covariates (a statement about adjustment, not about the measure's
 * own comparison).
 */
function measureOf(sentence: string): string[] | undefined {
  if (/covariate/i.test(sentence)) return undefined;
  const end = SUBJECT_END.exec(sentence);
  if (!end) return undefined;
  const words = topicWords(sentence.slice(0, end.index));
  const measure = measureStems(words);
  return measure.length > 0 && words.length <= 5 ? measure : undefined;
}

/** The stems of the words that name a measure, in order: less the words that name none ("Baseline", "scores"). */
export function measureStems(words: readonly string[]): string[] {
  return words.filter((w) => !NO_MEASURE.has(w.toLowerCase())).map(stem);
}

/** Words naming the tests or comparisons themselves ("All group comparisons", "t-tests were", "differences between the groups"). */
const NAMES_TESTS = /(?<![\p{L}])(?:t[- ]tests?|(?:all|the|group|between-group|pairwise) (?:[\p{L}-]+ )?(?:comparisons|analyses|tests)|group (?:comparisons|differences)|differences between|comparisons between|(?:were|was) (?:compared|analy[sz]ed|tested))(?![\p{L}])/iu;
/** Words saying the printed descriptives are themselves of the transformed values ("means and SDs of the log values are reported"). */
const DESCRIPTIVES_TRANSFORMED = /(?<![\p{L}])(?:means?|SDs?|descriptives?|summary statistics)(?: and (?:SDs?|standard deviations?))? (?:of|on) the (?:log|logged|transformed)/iu;
/** Words of small counts or a χ² beside an exact test: a statement of when the exact test was used. */
const FOR_COUNTS = /(?<![\p{L}])(?:expected (?:cell )?(?:counts?|frequenc\p{L}+)|cell (?:counts?|sizes?|frequenc\p{L}+)|small (?:cells?|counts?|samples?|numbers)|fewer than \d|below \d|chi[- ]?squared?|χ)(?![\p{L}])/iu;
/** The heading of a list of references. */
const REFERENCE_LIST = /^(?:references?|reference list|bibliography|works cited|literature cited|sources)$/iu;
/** A permutation or randomization test named: a p reported with it in its sentence came from resampling. */
const RESAMPLING_TEST = /(?<![\p{L}])(?:permutation|randomi[sz]ation) (?:t[- ])?tests?(?![\p{L}])/giu;
/** The header R prints above a t-test's output. */
const R_HEADER = /(?<![\p{L}-])(Welch Two Sample t-test|Two Sample t-test|Paired t-test|One Sample t-test)(?![\p{L}-])/gu;

// Cheap literal pre-checks, so a segment runs only the patterns that can match in it.
const MAY: Record<Mention['kind'], RegExp> = {
  software: /SPSS|Stata|SAS|JASP|jamovi|Python|SciPy|statsmodels|Prism|Minitab|MATLAB|Excel|G\*Power|Statistica|JMP|R\b/,
  assumption: /normal|Shapiro|Kolmogorov|Lilliefors|Darling|Agostino|Q[-–‐ ]?Q|P[-–‐ ]?P|Levene|Forsythe|Bartlett|quantile|varianc|scedastic|distribution|assumption|histogram|skew/i,
  multiplicity: /Bonferroni|Holm|id[aá]k|Hochberg|Hommel|Westfall|Benjamini|discovery|FDR|family|multipl|adjusted|corrected|Tukey/i,
  trend: /trend|marginal|approach|borderline|nearly|almost|tended/i,
  exclusion: /exclu|drop|withdr|lost to|missing|incomplete|did not complete|attrition|removed|eligible|attended|returned|completed|responded/i,
  'test-name': /t[- ]test|Welch|Student t|Student['’]s t|equal variances/i,
  'repeated-measures': /ANOVA|analys[ie]s of variance|subjects? factor|spheric|Greenhouse|Huynh|Mauchly/i,
  'between-subjects': /between[- ](?:subj|group|partic)|independent[- ]group|independent (?:groups|samples)/i,
  'no-sphericity-correction': /spheric|Mauchly|uncorrected/i,
  'resampled-p': /permut|bootstrap|resampl|Monte Carlo|randomi[sz]ation|shuffl|p_?perm/i,
  'resampling-test': /(?:permutation|randomi[sz]ation) (?:t[- ])?test/i,
  'approximate-df': /Satterthwaite|Kenward/i,
  contrast: /contrast|post[- ]?hoc|pairwise|follow[- ]up comp|simple (?:main )?effect|Tukey|LSD|Scheff|Dunnett/i,
  'derived-means': /adjusted|marginal|EMM|squares|LS|model|predicted|transformed|pooled|combined|imput/i,
  'several-studies': /stud|experiment/i,
  'part-of-sample': /sub-?group|sub-?sample|restricted|limited|concern|includ|focus/i,
  'many-arms': /three|four|five|six|[3-6][- ]|randomi|allocated|assigned/i,
  transformed: /transform|log|ln[- ]|geometric/i,
  'exact-test': /Fisher|exact|Freeman|mid[- ]p|Yates|continuity|Monte Carlo|Barnard|Boschloo/i,
  'model-based': /model|random|estimating|GEE|regression|ANCOVA|covariance|adjust|controlling/i,
  'cluster-means': /means|averages|level/i,
  'd-standardiser': /baseline|pre-?test|pre-?treatment|pre-?intervention|pre-?randomi|reference|population|normative/i,
};

/** Guideline-relevant words in one prose segment. */
export function findMentions(seg: Segment, starts: number[]): Mention[] {
  const out: Mention[] = [];
  const text = seg.text;
  const add = (kind: Mention['kind'], m: RegExpMatchArray, version?: string) => {
    out.push({ kind, segment: seg.id, block: seg.block, sentence: sentenceOf(starts, m.index ?? 0), span: sourceSpan(seg, m.index ?? 0, (m.index ?? 0) + m[0].length), printed: m[0], ...(version ? { version } : {}) });
  };
  if (MAY.software.test(text)) for (const m of matchesOf(SOFTWARE, text)) {
    // "R" alone is a software name only beside words about analysis, or with a version
    const context = text.slice(...sentenceBounds(starts, m.index, text.length));
    if ((m[1] === 'R' || m[1] === 'Python' || m[1] === 'Excel' || m[1] === 'Prism') && !m[2] && !SOFTWARE_CONTEXT.test(context)) continue;
    if (m[1] === 'R' && !m[2] && !/(?<![\p{L}])R (?:software|package|version|Core|\(R Core|statistical|environment)|in R(?![\p{L}])|using R(?![\p{L}])|R \d/u.test(context)) continue;
    add('software', m, m[2]);
  }
  for (const [re, kind] of [[MULTIPLICITY, 'multiplicity'], [TREND, 'trend'], [EXCLUSION, 'exclusion'], [BETWEEN_SUBJECTS, 'between-subjects']] as const) {
    if (MAY[kind].test(text)) for (const m of matchesOf(re, text)) add(kind, m);
  }
  // words that only make a finding less certain: not in a list of references (a cited title,
  // "Multiple imputation for nonresponse in surveys"), nor where they are denied ("Multiple
  // imputation was not used", "raw means rather than adjusted means")
  if (!REFERENCE_LIST.test(seg.section ?? '')) {
    for (const [re, kind] of [[CONTRAST, 'contrast'], [DERIVED_MEANS, 'derived-means'], [SEVERAL_STUDIES, 'several-studies'], [PART_OF_SAMPLE, 'part-of-sample'], [MANY_ARMS, 'many-arms'], [TRANSFORMED, 'transformed'], [EXACT_TEST, 'exact-test'], [MODEL_BASED, 'model-based']] as const) {
      // what each sentence is about, read once per sentence and kind (a sentence of thousands of
      // matches would otherwise be read again for each)
      const readings = new Map<number, { about: boolean; measure: string[] | undefined }>();
      if (MAY[kind].test(text)) for (const m of matchesOf(re, text)) {
        if (deniedAt(text, m.index, m.index + m[0].length, starts)) continue;
        const i = sentenceOf(starts, m.index);
        let reading = readings.get(i);
        if (!reading) {
          // whether its sentence says what it is about: the tests or comparisons themselves ("All
          // group comparisons were estimated by regression", "t-tests were performed on
          // log-transformed values"), or, for an exact test, small counts or χ²
          const [from, to] = sentenceBounds(starts, m.index, text.length);
          const sentence = text.slice(from, to);
          // (not a sentence about another study: "… in the pilot study that preceded this trial")
          const other = OTHER_STUDY.test(sentence);
          const about = kind === 'exact-test' ? FOR_COUNTS.test(sentence) : !other && NAMES_TESTS.test(sentence) && !(kind === 'transformed' && DESCRIPTIVES_TRANSFORMED.test(sentence));
          // the measure its sentence opens with ("Fatigue was rated weekly and analysed with a
          // linear mixed model"): a result whose own words open with it is that measure's
          reading = { about, measure: (kind === 'transformed' || kind === 'model-based') && !about && !other ? measureOf(sentence) : undefined };
          readings.set(i, reading);
        }
        out.push({ kind, segment: seg.id, block: seg.block, sentence: i, span: sourceSpan(seg, m.index, m.index + m[0].length), printed: m[0], ...(reading.about ? { aboutTests: true as const } : {}), ...(reading.measure !== undefined ? { measure: reading.measure } : {}) });
      }
    }
  }
  if (MAY['cluster-means'].test(text)) for (const m of matchesOf(CLUSTER_MEANS_WORDS, text)) if (!deniedAt(text, m.index, m.index + m[0].length, starts)) add('cluster-means', m);
  // another SD than the groups' as d's standardiser, said in a sentence about an effect size that
  // neither plans the study nor speaks of other studies (each sentence judged once)
  if (MAY['d-standardiser'].test(text) && !REFERENCE_LIST.test(seg.section ?? '')) {
    const about = new Map<number, boolean>();
    for (const m of matchesOf(D_STANDARDISER, text)) {
      if (deniedAt(text, m.index, m.index + m[0].length, starts)) continue;
      const i = sentenceOf(starts, m.index);
      let ok = about.get(i);
      if (ok === undefined) {
        const [from, to] = sentenceBounds(starts, m.index, text.length);
        const sentence = text.slice(from, to);
        ok = EFFECT_SIZE_WORDS.test(sentence) && !NOT_THIS_REPORTS.test(sentence);
        about.set(i, ok);
      }
      if (ok) add('d-standardiser', m);
    }
  }
  // resampling or an approximated df denied at its words ("Permutation-based p values were not
  // computed", "no Kenward–Roger correction") says nothing of a p
  for (const [re, kind] of [[RESAMPLED_P, 'resampled-p'], [RESAMPLING_TEST, 'resampling-test'], [APPROXIMATE_DF, 'approximate-df']] as const) {
    if (MAY[kind].test(text)) for (const m of matchesOf(re, text)) {
      const end = m.index + m[0].length;
      // an approximated df only with words of a df or a method beside the name, not a cited author
      if (kind === 'approximate-df' && !APPROXIMATE_DF_AFTER.test(text.slice(end, end + 30))) {
        const [sentenceStart] = sentenceBounds(starts, m.index, text.length);
        if (!APPROXIMATE_DF_BEFORE.test(text.slice(Math.max(sentenceStart, m.index - APPROXIMATE_DF_REACH), m.index))) continue;
      }
      if (!deniedAt(text, m.index, end, starts)) add(kind, m);
    }
  }
  if (MAY['no-sphericity-correction'].test(text)) {
    for (let i = 0; i < starts.length; i += 1) {
      const from = starts[i] as number;
      const m = NO_SPHERICITY_CORRECTION.exec(text.slice(from, starts[i + 1] ?? text.length));
      if (m) out.push({ kind: 'no-sphericity-correction', segment: seg.id, block: seg.block, sentence: i, span: sourceSpan(seg, from + m.index, from + m.index + m[0].length), printed: m[0] });
    }
  }
  if (MAY['repeated-measures'].test(text)) for (const m of matchesOf(REPEATED_MEASURES, text)) {
    // a correction's name denied at its words ("no Greenhouse–Geisser correction"), or in a
    // sentence saying sphericity held, is no sign of a correction
    if (CORRECTION_WORD.test(m[0])) {
      const [from, to] = sentenceBounds(starts, m.index, text.length);
      // (a correction's own name is not denied by sphericity holding elsewhere: "applied unless sphericity was met")
      const named = /^(?:Greenhouse|Huynh)/iu.test(m[0]);
      if (deniedAt(text, m.index, m.index + m[0].length, starts) || (!named && SPHERICITY_HELD.test(text.slice(from, to)))) continue;
      if (named) {
        out.push({ ...placeOf(seg, starts, m), kind: 'repeated-measures', namesCorrection: true });
        continue;
      }
    }
    add('repeated-measures', m);
  }
  if (MAY.assumption.test(text)) for (const m of assumptionChecks(text, starts)) add('assumption', m);
  if (MAY['test-name'].test(text)) for (const m of matchesOf(TEST_NAME, text)) {
    // "Student's t distribution" names a distribution, not the test that was run
    if (STUDENT_DISTRIBUTION.test(text.slice(m.index + m[0].length, m.index + m[0].length + 14)) && /^student/iu.test(m[0])) continue;
    const named = testNameWords(m[0]);
    if (!named) continue;
    // "Welch's correction", "Welch-corrected", "Welch–Satterthwaite", "t-tests with Welch's …": a test's df
    const test = named.variant === 'welch' && !named.namesTest && (WELCH_AFTER.test(text.slice(m.index + m[0].length, m.index + m[0].length + 40)) || WELCH_BEFORE.test(text.slice(Math.max(0, m.index - 30), m.index))) ? { ...named, namesTest: true as const } : named;
    const negated = deniedAt(text, m.index, m.index + m[0].length, starts);
    out.push({ ...placeOf(seg, starts, m), kind: 'test-name', test, ...(negated ? { negated: true as const } : {}) });
  }
  const where = seg.table ? { table: { table: seg.table.table, row: seg.table.row } } : seg.legendOf ? { legendOf: seg.legendOf.table } : {};
  return out.map((x) => ({ ...x, ...where }));
}

function placeOf(seg: Segment, starts: number[], m: RegExpMatchArray): Omit<Mention, 'kind'> {
  const at = m.index ?? 0;
  return { segment: seg.id, block: seg.block, sentence: sentenceOf(starts, at), span: sourceSpan(seg, at, at + m[0].length), printed: m[0] };
}

/** The word after "Student's t" that makes it the distribution. */
const STUDENT_DISTRIBUTION = /^[- ]?distributions?(?![\p{L}])/iu;
/** Words after "Welch" that make it a t-test or its correction ("Welch's correction", "Welch-corrected", "Welch–Satterthwaite", "Welch's two-sample t-tests", "Welch-type t"). */
const WELCH_AFTER = /^[-–—‐‑/ ](?:correct\p{L}*|adjust\p{L}*|Satterthwaite|approximation|type t|(?:two|independent)[- ]samples? t(?![\p{L}])|(?:two|independent)[- ]samples? t[- ]tests?)/iu;
/** A t-test named right before "Welch" ("t-tests with Welch's correction"). */
const WELCH_BEFORE = /(?<![\p{L}])t[- ]tests? (?:with|using|under) (?:a |the )?$/iu;
/** Words that make a name one of a test: a t or "test" ("Welch's t", "Welch test"; not "Welch's" alone, as in "Welch's method"). */
const NAMES_A_TEST = /(?<![\p{L}])t(?![\p{L}])|test/u;
/**
 * A negation or "instead of" right before some words, with at most a verb of using or an article
 * between ("no Greenhouse–Geisser", "did not use Welch's", "would not survive a Bonferroni"; not
 * "did not differ after Bonferroni", where the negation is about something else).
 */
const DENIED_BEFORE = /(?:(?<![\p{L}])(?:not|never|no|none|without|nor|neither|unlike|instead of|rather than|avoid|avoided|avoiding)|n['’]t)(?: (?:use|used|using|apply|applied|applying|survive|need|needed|require|required|perform|performed|run|a|an|the|any|further|with|of|by|p|p-values?|values?|were|was|estimated|computed|calculated|obtained|approximated)){0,4} $/iu;
/** Some words said not to be so right after them ("… was not needed", "… were not applied", "… were not computed"). */
const DENIED_AFTER = /^(?: [\p{L}'’‐–-]{1,15}){0,2} (?:(?:was|were|is|are|has been|have been) (?:not|never)(?![\p{L}])|(?:wasn|weren|isn|aren)['’]t(?![\p{L}])|(?:was|were) (?:considered but )?(?:rejected|dropped|abandoned|discarded)(?![\p{L}]))/iu;

/**
 * Whether the words at [from, to) of `text` are denied: a negation or "instead of" right before
 * them ("without Welch's correction", "would not survive a Bonferroni correction"), or said not
 * to be so right after them ("Welch's test was not needed"). A negation elsewhere in the sentence
 * ("Because the variances were not equal, Welch's t-tests were used") does not deny them.
 * `sentenceStarts`: where the text's sentences start, as for sentenceOf.
 */
export function deniedAt(text: string, from: number, to: number, sentenceStarts: number[]): boolean {
  const [sentenceStart, sentenceEnd] = sentenceBounds(sentenceStarts, from, text.length);
  return DENIED_BEFORE.test(text.slice(Math.max(sentenceStart, from - 40), from)) || DENIED_AFTER.test(text.slice(to, Math.min(sentenceEnd, to + 50)));
}

/**
 * What a test's name says: paired words, one sample, independent groups, Welch's (independent
 * groups with unequal variances) or Student's (independent groups, unless said to be paired).
 */
export function testNameWords(words: string, source: TestNameWords['source'] = 'prose'): TestNameWords | undefined {
  const w = words.toLowerCase();
  const plural = /tests$/u.test(w);
  if (source === 'software-output') {
    // R: t.test prints "Welch Two Sample t-test" by default and "Two Sample t-test" with var.equal = TRUE
    if (w.startsWith('welch')) return { design: 'independent', variant: 'welch', plural, source, namesTest: true };
    if (w.startsWith('two sample')) return { design: 'independent', variant: 'student', plural, source };
    if (w.startsWith('paired')) return { design: 'paired', plural, source };
    return { design: 'one-sample', plural, source };
  }
  if (w.startsWith('welch') || w.includes('unequal') || w.includes('not assum') || w.includes('without assum') || w.includes('variances not')) return { design: 'independent', variant: 'welch', plural, source, ...(NAMES_A_TEST.test(w) ? { namesTest: true as const } : {}) };
  if (w.startsWith('paired student')) return { design: 'paired', plural, source };
  // Student's test by its name or by what it assumes ("pooled-variance t-tests", "t-tests assuming equal variances")
  if (w.startsWith('student') || w.startsWith('pooled') || w.includes(' equal variances') || w.startsWith('equal variances')) return { design: 'independent', variant: 'student', plural, source };
  if (/^(?:paired|dependent|related|repeated|within)|for (?:paired|dependent|related)/u.test(w)) return { design: 'paired', plural, source };
  if (/^(?:one|single)/u.test(w)) return { design: 'one-sample', plural, source };
  if (/^(?:unpaired|independent|two|between)|for independent/u.test(w)) return { design: 'independent', plural, source };
  return undefined;
}

/** The header R prints above each t-test's output, in a block of code: it names the test of the output below it. */
export function findSoftwareHeaders(seg: Segment, starts: number[]): Mention[] {
  if (!seg.text.includes('t-test')) return [];
  const out: Mention[] = [];
  for (const m of matchesOf(R_HEADER, seg.text)) {
    const test = testNameWords(m[0], 'software-output');
    if (test) out.push({ ...placeOf(seg, starts, m), kind: 'test-name', test });
  }
  return out;
}

/**
 * Statements that an assumption was checked: a named check (Shapiro–Wilk, Levene's test, Q–Q
 * plots) not said to be skipped, or what a check is about (normality, equal variances, the
 * distribution of the differences) with a verb of checking within reach in its sentence. A
 * verb of doing the check ("checked", "tested") must not be negated; a verb of what the check
 * found ("met", "violated") may be. Words about what a test assumes are no check.
 */
function assumptionChecks(text: string, starts: number[]): RegExpMatchArray[] {
  const out: RegExpMatchArray[] = [];
  const sentenceBounds = (at: number) => {
    const i = sentenceOf(starts, at);
    return [starts[i] as number, starts[i + 1] ?? text.length] as const;
  };
  for (const m of matchesOf(ASSUMPTION_CHECK, text)) {
    const at = m.index;
    const [from] = sentenceBounds(at);
    const before = text.slice(Math.max(from, at - 20), at);
    const after = text.slice(at + m[0].length, at + m[0].length + 50);
    if (/(?<![\p{L}])(?:no|without|nor|neither)(?: \p{L}{1,12})? $/iu.test(before) || CHECK_NOT_RUN.test(after)) continue;
    out.push(m);
  }
  const withCheck = new Set(out.map((m) => sentenceOf(starts, m.index ?? 0)));
  for (const m of matchesOf(ASSUMPTION_TOPIC, text)) {
    const at = m.index;
    // a sentence with a named check is credited once, at the check
    if (withCheck.has(sentenceOf(starts, at))) continue;
    const [from, to] = sentenceBounds(at);
    const end = at + m[0].length;
    if (ASSUMING_BEFORE.test(text.slice(Math.max(from, at - 40), at)) || ASSUMED_AFTER.test(text.slice(end, end + 30))) continue;
    const lo = Math.max(from, at - CHECK_REACH);
    const hi = Math.min(to, end + CHECK_REACH);
    const window = text.slice(lo, hi);
    let checked = false;
    for (const v of matchesOf(CHECK_DONE, window)) {
      const vAt = lo + v.index;
      if (vAt >= at && vAt < end) continue;
      if (!NEGATED_BEFORE.test(text.slice(Math.max(from, vAt - 30), vAt))) checked = true;
    }
    for (const v of matchesOf(CHECK_FOUND, window)) if (lo + v.index < at || lo + v.index >= end) checked = true;
    if (checked) out.push(m);
  }
  return out;
}
