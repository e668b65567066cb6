/**
 * Estimates other than a t-test's mean difference that are printed with a CI of their own: an
 * agreement or reliability coefficient (ICC, κ, Lin's concordance, Cronbach's α, McDonald's ω), a
 * measure of discrimination (AUC, C statistic, PPV, NPV, Youden's J), a rank correlation, a rate
 * or risk ratio, and a standardised effect size under a name the effect-size reader does not take
 * (SMD, ES, Glass's Δ). Not words that may name the tested difference itself ("the difference in
 * sensitivity", "proportion correct", a slope, "effect size"): their CI may be the t's. A
 * CI printed right after one is that estimate's: many are not symmetric, and none is the interval
 * of the difference the t tests (common practice, no source).
 */
const LABEL = String.raw`(?:ICCs?|intra-?class correlation(?: coefficients?)?|κ|kappa|Cohen['’]?s? (?:κ|kappa)|AUCs?|AUROC|area under the (?:ROC |receiver operating characteristic )?curve|C[- ]statistics?|c[- ]index|PPV|NPV|positive predictive value|negative predictive value|Youden['’]?s?(?: index| J)?|Spearman['’]?s?(?: rho| ρ| correlation)?|rho|Kendall['’]?s?(?: tau| τ)?|Lin['’]?s?(?: concordance(?: correlation)?(?: coefficient)?)?|concordance correlation(?: coefficient)?|CCC|Cronbach['’]?s? (?:α|alpha)|McDonald['’]?s? (?:ω|omega)|(?:incidence |hazard |odds |risk )?rate ratio|risk ratio|IRR|RR|reliability coefficient|SMD|ES|standardi[sz]ed mean difference|Glass['’]?s? (?:Δ|delta))`;

/** Such a label with its value right before a CI ("ICC = 0.86 (", "SMD −0.46, ", "sensitivity was 0.82 ["). */
export const OTHER_ESTIMATE_BEFORE = new RegExp(String.raw`(?<![\p{L}])(${LABEL})(?: (?:was|of|were))? ?(?:=|:)? ?[-−–+]?\d{0,6}\.?\d{1,6} ?%? ?[(\[,;]? ?$`, 'iu');

/** A table column header naming such an estimate with its CI ("ICC (95% CI)", "AUC [95% CI]"). */
export const OTHER_ESTIMATE_HEADER = new RegExp(String.raw`^(${LABEL})(?![\p{L}])`, 'iu');
