import type { Segment } from '../parse/types.js';
import { sentenceOf, sourceSpan } from './numbers.js';
import type { Mention } from './types.js';

const SOFTWARE = /(?<![\p{L}])(R|RStudio|SPSS|IBM SPSS Statistics|Stata|SAS|JASP|jamovi|Python|SciPy|statsmodels|GraphPad Prism|Prism|Minitab|MATLAB|Excel|G\*Power|Statistica|JMP)(?![\p{L}])(?:[^.;\n]{0,40}?(?:version |v\.? ?|\()?(\d{1,4}(?:\.\d{1,4}){1,3}))?/gu;
const SOFTWARE_CONTEXT = /(?<![\p{L}])(software|package|statistical|analy[sz]ed|analyses|using|version|computed|performed)(?![\p{L}])/iu;
const ASSUMPTION = /(?<![\p{L}])(normality|normally distributed|Shapiro[-–]Wilk|Kolmogorov[-–]Smirnov|Q[-–]Q plots?|Levene['’]?s?(?: test)?|equal(?:ity of)? variances?|homogeneity of variances?|homoscedastic\p{L}*|heteroscedastic\p{L}*|distribution of the differences)(?![\p{L}])/giu;
const MULTIPLICITY = /(?<![\p{L}])(Bonferroni|Holm|Šidák|Sidak|Hochberg|Benjamini|false discovery rate|FDR|family-?wise|multiple (?:comparisons|testing|tests)|multiplicity|adjusted p(?:[- ]values?)?|corrected for multiple|Tukey['’]?s?(?: HSD)?)(?![\p{L}])/giu;
const TREND = /(?<![\p{L}])(trend(?:ed)? (?:towards?|to) (?:significance|be significant)|a trend|marginal(?:ly)? (?:significant|significance)|approach(?:ed|ing) (?:statistical )?significance|borderline significan\p{L}*|nearly significant|almost significant|tended to)(?![\p{L}])/giu;
const EXCLUSION = /(?<![\p{L}])(exclu\p{L}+|dropped out|drop-?outs?|withdr[ae]w\p{L}*|lost to follow-?up|missing data|incomplete data|did not complete|attrition|removed from (?:the )?analys[ie]s)(?![\p{L}])/giu;
const TEST_NAME = /(?<![\p{L}])((?:paired|unpaired|independent|one-sample|two-sample|dependent|related)(?:[- ]samples?)? t[- ]tests?|Welch['’]?s?(?: t)?(?:[- ]tests?)?|Student['’]?s?(?: t)?(?:[- ]tests?)?|t[- ]tests? for (?:paired|independent|dependent) samples)(?![\p{L}])/giu;

// Cheap literal pre-checks, so a segment runs only the patterns that can match in it.
const MAY: Record<Mention['kind'], RegExp> = {
  software: /SPSS|Stata|SAS|JASP|jamovi|Python|SciPy|statsmodels|Prism|Minitab|MATLAB|Excel|G\*Power|Statistica|JMP|R\b/,
  assumption: /normal|Shapiro|Kolmogorov|Q[-–]Q|Levene|varianc|scedastic|differences/i,
  multiplicity: /Bonferroni|Holm|id[aá]k|Hochberg|Benjamini|discovery|FDR|family|multipl|adjusted|corrected|Tukey/i,
  trend: /trend|marginal|approach|borderline|nearly|almost|tended/i,
  exclusion: /exclu|drop|withdr|lost to|missing|incomplete|did not complete|attrition|removed/i,
  'test-name': /t[- ]test|Welch|Student/i,
};

/** Guideline-relevant words in one prose segment. */
export function findMentions(seg: Segment, starts: number[]): Mention[] {
  const out: Mention[] = [];
  const text = seg.text;
  const add = (kind: Mention['kind'], m: RegExpMatchArray, version?: string) => {
    out.push({ kind, segment: seg.id, block: seg.block, sentence: sentenceOf(starts, m.index ?? 0), span: sourceSpan(seg, m.index ?? 0, (m.index ?? 0) + m[0].length), printed: m[0], ...(version ? { version } : {}) });
  };
  if (MAY.software.test(text)) for (const m of text.matchAll(SOFTWARE)) {
    // "R" alone is a software name only beside words about analysis, or with a version
    const sentence = starts[sentenceOf(starts, m.index)] as number;
    const context = text.slice(sentence, starts[sentenceOf(starts, m.index) + 1] ?? text.length);
    if ((m[1] === 'R' || m[1] === 'Python' || m[1] === 'Excel' || m[1] === 'Prism') && !m[2] && !SOFTWARE_CONTEXT.test(context)) continue;
    if (m[1] === 'R' && !m[2] && !/(?<![\p{L}])R (?:software|package|version|Core|\(R Core|statistical|environment)|in R(?![\p{L}])|using R(?![\p{L}])|R \d/u.test(context)) continue;
    add('software', m, m[2]);
  }
  for (const [re, kind] of [[ASSUMPTION, 'assumption'], [MULTIPLICITY, 'multiplicity'], [TREND, 'trend'], [EXCLUSION, 'exclusion'], [TEST_NAME, 'test-name']] as const) {
    if (MAY[kind].test(text)) for (const m of text.matchAll(re)) add(kind, m);
  }
  return out;
}
