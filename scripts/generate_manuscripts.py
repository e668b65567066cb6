#!/usr/bin/env python3
"""Seeded generator of invented manuscripts with a key, for measuring plumbline from outside.

    python3 scripts/generate_manuscripts.py [--seed 20261] [--out fixtures/generated]

Every study, group, measure and number is invented: raw data are simulated with numpy (seeded),
the tests are run with scipy.stats (ttest_ind with equal_var True or False, ttest_rel,
ttest_1samp), and the results are written the way authors write them, in several house styles
(APA, a medical journal, middle-dot decimals, decimal commas, a Nature-like style, text pulled
out of a PDF, R Markdown) and many report styles. About a third of the cases carry exactly one
seeded error. Each seeded error is verified here, with interval arithmetic over every value
within the printed rounding and every common reading, to be impossible to reproduce; each correct
case is verified to be reproduced under the reading its text states. The key
(key.json) gives, per case, the UTF-16 offsets of every printed piece, so a scorer can attribute
findings to cases.

This program shares no code with plumbline: it is written from the statistics, not from the
extractor.
"""
from __future__ import annotations

import argparse
import json
import math
import os
import re
import shutil
import sys
from dataclasses import dataclass, field
from decimal import ROUND_HALF_UP, Decimal

import numpy as np
import scipy
from scipy import special, stats

GENERATOR = "scripts/generate_manuscripts.py"
DEFAULT_SEED = 20261
ALPHA = 0.05

# ---------------------------------------------------------------------------------------------
# Printed numbers
# ---------------------------------------------------------------------------------------------


def dround(x: float, dec: int) -> Decimal:
    """Round half away from zero, as most software prints."""
    q = Decimal(1).scaleb(-dec)
    d = Decimal(repr(float(x))).quantize(q, rounding=ROUND_HALF_UP)
    if d == 0:
        d = abs(d)
    return d


@dataclass
class Num:
    """A number as printed: its value, decimals (of the mantissa), power of ten and operator."""

    value: float
    dec: int
    exp: int = 0
    op: str = "="
    form: str = "plain"  # plain | sci (m × 10^e) | pow (10^e alone, a bound)
    raw: str | None = None  # a printed form that is not a number (e.g. "043")
    sig: int = 0  # R-console style: significant digits rather than fixed decimals

    def unit(self) -> float:
        return 10.0 ** (-self.dec) * 10.0**self.exp

    def iv(self, w: float = 0.5) -> tuple[float, float]:
        h = w * self.unit() * (1 + 1e-9)
        return (self.value - h, self.value + h)


def num(x: float, dec: int) -> Num:
    return Num(float(dround(x, dec)), dec)


def sci(x: float, mdec: int = 1) -> Num:
    e = math.floor(math.log10(abs(x)))
    m = x / 10.0**e
    md = dround(m, mdec)
    if md >= 10:
        e += 1
        md = dround(x / 10.0**e, mdec)
    return Num(float(md) * 10.0**e, mdec, e, "=", "sci")


def sig_num(x: float, digits: int) -> Num:
    """x to `digits` significant digits (as R prints)."""
    if x == 0:
        return Num(0.0, digits)
    e = math.floor(math.log10(abs(x)))
    dec = max(0, digits - 1 - e)
    return Num(float(dround(x, dec)), dec)


# ---------------------------------------------------------------------------------------------
# Distributions
# ---------------------------------------------------------------------------------------------


def p_two(t: float, df: float) -> float:
    return float(2 * stats.t.sf(abs(t), df))


def p_one(t: float, df: float) -> float:
    return float(stats.t.sf(abs(t), df))


def t_crit(df: float, level: float = 0.95) -> float:
    return float(stats.t.ppf(1 - (1 - level) / 2, df))


def hedges_j(df: float) -> float:
    return float(math.exp(special.gammaln(df / 2) - 0.5 * math.log(df / 2) - special.gammaln((df - 1) / 2)))


def power_two(n: int, d: float, alpha: float, sides: int, design: str) -> float:
    df = 2 * n - 2 if design == "two" else n - 1
    if df < 1:
        return 0.0
    ncp = abs(d) * (math.sqrt(n / 2) if design == "two" else math.sqrt(n))
    crit = stats.t.ppf(1 - alpha / sides, df)
    pw = stats.nct.sf(crit, df, ncp)
    if sides == 2:
        pw += stats.nct.cdf(-crit, df, ncp)
    return float(pw)


def n_for_power(d: float, alpha: float, sides: int, target: float, design: str) -> int:
    """Smallest n (per group, or pairs) whose power reaches the target; searched from the normal approximation."""
    z = stats.norm.isf(alpha / sides) + stats.norm.isf(1 - target) if 0 < target < 1 else 4.0
    approx = (2 if design == "two" else 1) * (z / max(abs(d), 1e-3)) ** 2
    n = max(2, int(approx) - 2)
    while n > 2 and power_two(n - 1, d, alpha, sides, design) >= target:
        n -= 1
    while power_two(n, d, alpha, sides, design) < target:
        n += 1
        if n > 5000:
            return n
    return n


# ---------------------------------------------------------------------------------------------
# Interval arithmetic: what a printed number allows
# ---------------------------------------------------------------------------------------------


def hit(a: tuple[float, float], b: tuple[float, float]) -> bool:
    return a[0] <= b[1] and b[0] <= a[1]


def abs_iv(iv: tuple[float, float]) -> tuple[float, float]:
    lo, hi = iv
    if lo <= 0 <= hi:
        return (0.0, max(-lo, hi))
    return (min(abs(lo), abs(hi)), max(abs(lo), abs(hi)))


def diff_iv(a: tuple[float, float], b: tuple[float, float]) -> tuple[float, float]:
    return (a[0] - b[1], a[1] - b[0])


def df_iv(c: "Case", w: float) -> tuple[float, float]:
    df = c.pr["df"]
    if c.kind == "welch" or df.dec > 0:
        return df.iv(w)
    return (df.value, df.value)


def p_range(t_iv: tuple[float, float], dfi: tuple[float, float], tails: int) -> tuple[float, float]:
    """Range of the recomputed p over |t| and df in their intervals (p falls with |t| and df)."""
    at = abs_iv(t_iv)
    dfs = sorted({max(dfi[0], 0.05), max(dfi[1], 0.05), max((dfi[0] + dfi[1]) / 2, 0.05)})
    vals = []
    for tt in at:
        for dd in dfs:
            vals.append(float(tails * stats.t.sf(tt, dd)))
    return (min(vals), min(1.0, max(vals)))


def reported_p_iv(p: Num, w: float) -> tuple[float, float]:
    if p.op == "<":
        return (0.0, p.value)
    if p.op == ">":
        return (p.value, 1.0)
    if p.form == "sci":
        return p.iv(w)
    lo, hi = p.iv(w)
    return (max(lo, 0.0), hi)


def se_of(s: tuple[float, float], n: int, kind: str) -> tuple[float, float]:
    """Standard error interval of a mean from a printed spread of the given kind."""
    if kind == "se":
        return s
    return (s[0] / math.sqrt(n), s[1] / math.sqrt(n))


def t_ind_range(m1, s1, n1, m2, s2, n2, pooled: bool, kind1: str, kind2: str) -> tuple[float, float]:
    """|t| over the box of printed means and spreads (t rises with |diff|, falls with spreads)."""
    d = abs_iv(diff_iv(m1, m2))
    se1 = se_of(s1, n1, kind1)
    se2 = se_of(s2, n2, kind2)

    def se(a, b):
        if pooled:
            v1 = a * a * n1  # variance from SE
            v2 = b * b * n2
            sp2 = ((n1 - 1) * v1 + (n2 - 1) * v2) / (n1 + n2 - 2)
            return math.sqrt(sp2 * (1 / n1 + 1 / n2))
        return math.sqrt(a * a + b * b)

    lo_se, hi_se = se(se1[0], se2[0]), se(se1[1], se2[1])
    if lo_se <= 0:
        return (d[0] / hi_se, math.inf)
    return (d[0] / hi_se, d[1] / lo_se)


def t_one_range(m, s, n, mu0: float, kind: str) -> tuple[float, float]:
    d = abs_iv((m[0] - mu0, m[1] - mu0))
    se = se_of(s, n, kind)
    if se[0] <= 0:
        return (d[0] / se[1], math.inf)
    return (d[0] / se[1], d[1] / se[0])


def welch_df_range(s1, n1, s2, n2, kind: str) -> tuple[float, float]:
    vals = []
    for a in np.linspace(s1[0], s1[1], 7):
        for b in np.linspace(s2[0], s2[1], 7):
            v1 = (a * a if kind == "se" else a * a / n1)
            v2 = (b * b if kind == "se" else b * b / n2)
            if v1 + v2 <= 0:
                continue
            vals.append((v1 + v2) ** 2 / (v1 * v1 / (n1 - 1) + v2 * v2 / (n2 - 1)))
    return (min(vals), max(vals))


def grim_ok(mean: Num, n: int, k: int) -> bool:
    lo, hi = mean.iv(0.5)
    g = n * k
    return math.floor(hi * g + 1e-9) >= math.ceil(lo * g - 1e-9)


def grimmer_ok(mean: Num, sd: Num, n: int) -> bool:
    """Some integer sum S and sum of squares Q (Q ≡ S mod 2) give the printed mean and SD."""
    lo, hi = mean.iv(0.5)
    slo, shi = sd.iv(0.5)
    for S in range(math.ceil(lo * n - 1e-9), math.floor(hi * n + 1e-9) + 1):
        qlo = (n - 1) * slo * slo + S * S / n
        qhi = (n - 1) * shi * shi + S * S / n
        q = math.ceil(qlo - 1e-9)
        if q % 2 != S % 2:
            q += 1
        if q <= qhi + 1e-9:
            return True
    return False


# ---------------------------------------------------------------------------------------------
# Cases
# ---------------------------------------------------------------------------------------------

ERROR_RULES = {
    "p-typo": ["p-follows-from-t"],
    "significance-flip": ["significance-follows-from-t"],
    "undeclared-one-tailed": ["one-tailed-p-is-declared"],
    "stated-two-tailed-but-one-tailed-p": ["p-follows-from-t", "significance-follows-from-t"],
    "impossible-value": ["values-are-possible"],
    "p-printed-as-zero": ["zero-p-is-a-bound"],
    "t-vs-descriptives": ["t-follows-from-descriptives"],
    "se-printed-as-sd": ["spread-kind-matches-t"],
    "df-vs-n": ["df-follows-from-n"],
    "paired-analysed-as-independent": ["design-matches-analysis"],
    "independent-analysed-with-paired-df": ["design-matches-analysis", "df-follows-from-n"],
    "impossible-paired-correlation": ["paired-correlation-is-possible"],
    "ci-vs-result": ["ci-agrees-with-result"],
    "d-vs-t": ["effect-size-follows"],
    "grim": ["mean-is-possible-for-integers"],
    "grimmer": ["mean-is-possible-for-integers"],
    "count-vs-percent": ["percentage-matches-count"],
    "power-statement": ["power-statement-follows"],
    "group-sizes-vs-total": ["group-sizes-sum-to-total"],
    "abstract-vs-results": ["repeated-result-agrees"],
    "total-n-vs-df": ["sample-size-agrees-with-df"],
    "adjusted-p": ["adjusted-p-follows"],
}

# What else a seeded error may disturb under the stated reading (its own check always).
ALLOWED_STATED_FAILS = {
    "p-typo": {"p"},
    "significance-flip": {"p", "sig"},
    "undeclared-one-tailed": {"p", "sig"},
    "stated-two-tailed-but-one-tailed-p": {"p", "sig"},
    "impossible-value": {"possible", "p", "sig", "df", "design"},
    "p-printed-as-zero": {"zero"},
    "t-vs-descriptives": {"tdesc"},
    "se-printed-as-sd": {"tdesc", "df"},
    "df-vs-n": {"df"},
    "paired-analysed-as-independent": {"design", "df"},
    "independent-analysed-with-paired-df": {"design", "df"},
    "impossible-paired-correlation": {"r"},
    "ci-vs-result": {"ci"},
    "d-vs-t": {"d"},
    "grim": {"grim"},
    "grimmer": {"grimmer"},
    "adjusted-p": {"adj"},
    "abstract-vs-results": {"repeat"},
}


@dataclass
class Case:
    id: str
    kind: str  # ind | welch | paired | one | percent | power | groups | total
    error: str | None = None
    style: str = ""
    measure: dict | None = None
    labels: tuple[str, str] = ("", "")
    true: dict = field(default_factory=dict)
    pr: dict = field(default_factory=dict)  # printed numbers (Num)
    f: dict = field(default_factory=dict)  # flags: how the case is written
    parts: list = field(default_factory=list)  # (role, start, end) in the logical text
    level: str = "warning"


class Unfit(Exception):
    """The drawn data cannot carry the requested case; draw again."""


def t_case_checks(c: Case, mode: str, doc_tails: str | None) -> set[str]:
    """Checks of a t-test case that the printed numbers fail.

    mode 'stated': the reading the text states, rounding half a unit of the last digit.
    mode 'any': fails only when every common reading fails, with a full unit of margin.
    """
    w = 0.5 if mode == "stated" else 1.0
    pr, f = c.pr, c.f
    fails: set[str] = set()
    t, df, p = pr["t"], pr["df"], pr.get("p")
    # values-are-possible
    bad = df.value <= 0 or (p is not None and p.op != "<" and p.raw is None and (p.value > 1 or p.value < 0))
    if p is not None and (p.raw is not None or (p.op == "<" and p.value <= 0)):
        bad = True
    if bad:
        return {"possible"}
    if p is not None and p.op == "=" and p.value == 0:
        fails.add("zero")
    tiv = t.iv(w)
    dfi = df_iv(c, w)
    stated_tails = 1 if f.get("tails") == "one" else 2
    if p is not None and "zero" not in fails:
        rp = reported_p_iv(p, w)
        tails_set = [stated_tails] if mode == "stated" else [1, 2]
        if not any(hit(rp, p_range(tiv, dfi, k)) for k in tails_set):
            fails.add("p")
        # significance: reported side against recomputed side
        rep_sig = rp[1] < ALPHA if p.op == "<" else (p.value < ALPHA)
        rep_possible_sides = {rep_sig} if mode == "stated" else ({rp[0] < ALPHA} | {rp[1] < ALPHA} if p.op == "=" else {rep_sig})
        ok = False
        for k in tails_set:
            lo, hi = p_range(tiv, dfi, k)
            rec_sides = {lo < ALPHA, hi < ALPHA}
            if rec_sides & rep_possible_sides:
                ok = True
        if not ok:
            fails.add("sig")
    if p is not None and p.op == "=" and p.value == 0:
        # p = .000 is a bound: fine only if the recomputed p is below half a unit
        if p_range(tiv, dfi, 2)[0] >= p.unit() / 2:
            fails.add("p")
    n1 = pr.get("n1")
    n2 = pr.get("n2")
    # descriptives → t
    if "m1" in pr and c.kind in ("ind", "welch", "one") and not f.get("desc_unlinked"):
        kind = f.get("spread", "sd")
        kinds = [kind] if mode == "stated" else ["sd", "se"]
        m1, s1 = pr["m1"].iv(w), pr["s1"].iv(w)
        reachable = False
        if c.kind == "one":
            nn = int(n1.value) if n1 else int(round(df.value)) + 1
            for k in kinds:
                if hit(t_one_range(m1, s1, nn, c.true["mu0"], k), abs_iv(tiv)):
                    reachable = True
        else:
            m2, s2 = pr["m2"].iv(w), pr["s2"].iv(w)
            if n1 and n2:
                splits = [(int(n1.value), int(n2.value))]
            else:
                tot = int(pr["N"].value) if "N" in pr else int(round(df.value)) + 2
                splits = [(a, tot - a) for a in range(2, tot - 1)] if mode == "any" else [(c.true["n1"], c.true["n2"])]
            pooled_set = [c.kind == "ind"] if mode == "stated" else [True, False]
            for (a, b) in splits:
                for pooled in pooled_set:
                    for k in kinds:
                        if hit(t_ind_range(m1, s1, a, m2, s2, b, pooled, k, k), abs_iv(tiv)):
                            reachable = True
        if not reachable:
            fails.add("tdesc")
    # df against n
    if n1 is not None and c.kind in ("ind", "welch", "one", "paired") and not f.get("n_total_only"):
        a = int(n1.value)
        b = int(n2.value) if n2 is not None else None
        ok = False
        if mode == "stated":
            if c.kind == "one" or c.kind == "paired":
                ok = hit(dfi, (a - 1, a - 1))
            elif c.kind == "ind":
                ok = hit(dfi, (a + b - 2, a + b - 2))
            elif "s1" in pr:
                s1, s2 = pr["s1"].iv(0.5), pr["s2"].iv(0.5)
                ok = hit(dfi, welch_df_range(s1, a, s2, b, f.get("spread", "sd")))
            else:
                ok = hit(dfi, (min(a, b) - 1, a + b - 2))
        else:
            cands = [(a - 1, a - 1)]
            if b is not None:
                cands += [(b - 1, b - 1), (a + b - 2, a + b - 2)]
                if "s1" in pr and "s2" in pr:
                    cands.append(welch_df_range(pr["s1"].iv(w), a, pr["s2"].iv(w), b, f.get("spread", "sd")))
                else:
                    cands.append((min(a, b) - 1, a + b - 2))
            ok = any(hit(dfi, (x - (w - 0.5), y + (w - 0.5))) for x, y in cands)
        if not ok:
            fails.add("df")
    # design words against the df
    if f.get("design_words") and n1 is not None:
        a = int(n1.value)
        b = int(n2.value) if n2 is not None else a
        if f["design_words"] == "paired" and a == b and hit(dfi, (2 * a - 2, 2 * a - 2)) and not hit(dfi, (a - 1, a - 1)):
            fails.add("design")
        if f["design_words"] == "independent" and a == b and hit(dfi, (a - 1, a - 1)) and not hit(dfi, (2 * a - 2, 2 * a - 2)):
            fails.add("design")
    # paired: implied correlation
    if c.kind == "paired" and "m2" in pr:
        nn = int(n1.value) if n1 else int(round(df.value)) + 1
        m1, m2 = pr["m1"].iv(w), pr["m2"].iv(w)
        dd = abs_iv(diff_iv(m1, m2))
        at = abs_iv(tiv)
        sdd = (dd[0] * math.sqrt(nn) / at[1], dd[1] * math.sqrt(nn) / at[0] if at[0] > 0 else math.inf)
        # the spreads as SDs under each reading the text allows: an SE times sqrt(n) is the SD
        kind = f.get("spread", "sd")
        possible = False
        for k in ([kind] if mode == "stated" else ["sd", "se"]):
            scale = math.sqrt(nn) if k == "se" else 1.0
            s1 = tuple(x * scale for x in pr["s1"].iv(w))
            s2 = tuple(x * scale for x in pr["s2"].iv(w))
            gap_lo = 0.0 if hit(s1, s2) else min(abs(s1[0] - s2[1]), abs(s2[0] - s1[1]))
            sum_hi = s1[1] + s2[1]
            possible = possible or (sdd[1] >= gap_lo and sdd[0] <= sum_hi)
        if not possible:
            fails.add("r")
    # CI of the difference
    if "ci_lo" in pr:
        if not ci_consistent(c, w, mode):
            fails.add("ci")
    # effect size
    if "d" in pr:
        if not d_consistent(c, w, mode):
            fails.add("d")
    # whole-number measures
    meas = c.measure or {}
    if meas and is_integer_measure(meas) and f.get("grim_checkable"):
        k = meas.get("k", 1)
        groups = [("m1", "s1", "n1"), ("m2", "s2", "n2")]
        for mk, sk, nk in groups:
            nkey = nk if nk in pr else ("n1" if c.kind == "paired" else None)
            if mk in pr and nkey is not None and nkey in pr:
                nn = int(pr[nkey].value)
                if not grim_ok(pr[mk], nn, k):
                    fails.add("grim")
                elif k == 1 and sk in pr and f.get("spread", "sd") == "sd" and not grimmer_ok(pr[mk], pr[sk], nn):
                    fails.add("grimmer")
    # adjusted p
    if "padj" in pr and f.get("adj_m") and p is not None and p.op == "=":
        m = f["adj_m"]
        rp = reported_p_iv(p, w)
        want = (min(1.0, m * rp[0]), min(1.0, m * rp[1]))
        if not hit(reported_p_iv(pr["padj"], w), want):
            fails.add("adj")
    # abstract repeat
    if "abs_t" in pr:
        same_t = hit(pr["abs_t"].iv(w), tiv)
        same_p = p is None or hit(reported_p_iv(pr["abs_p"], w), reported_p_iv(p, w)) or pr["abs_p"].op != "=" or p.op != "="
        if not (same_t and same_p):
            fails.add("repeat")
    return fails


def estimate_iv(c: Case, w: float) -> tuple[float, float] | None:
    pr = c.pr
    if "diff" in pr:
        return pr["diff"].iv(w)
    if c.kind == "one" and "m1" in pr:
        m = pr["m1"].iv(w)
        return (m[0] - c.true["mu0"], m[1] - c.true["mu0"])
    if "m1" in pr and "m2" in pr:
        return diff_iv(pr["m1"].iv(w), pr["m2"].iv(w))
    return None


def ci_consistent(c: Case, w: float, mode: str) -> bool:
    pr = c.pr
    lo, hi = pr["ci_lo"].iv(w), pr["ci_hi"].iv(w)
    mid = ((lo[0] + hi[0]) / 2, (lo[1] + hi[1]) / 2)
    half = (max(0.0, (hi[0] - lo[1]) / 2), (hi[1] - lo[0]) / 2)
    est = estimate_iv(c, w)
    if c.f.get("ci_of") == "d":
        d = pr["d"].iv(w)
        centred = hit(mid, d) or hit(mid, (-d[1], -d[0]))
        if mode == "stated":
            return centred
        return centred or (est is not None and (hit(mid, est) or hit(mid, (-est[1], -est[0]))))
    if est is None:
        return True
    centred = hit(mid, est) or hit(mid, (-est[1], -est[0]))
    if mode == "any" and "d" in pr:
        d = pr["d"].iv(w)
        centred = centred or hit(mid, d) or hit(mid, (-d[1], -d[0]))
    if not centred:
        return False
    dfi = df_iv(c, w)
    crits = [t_crit(dfi[0]), t_crit(dfi[1])]
    if mode == "any":
        crits.append(1.959963984540054)
    ae = abs_iv(est)
    at = abs_iv(pr["t"].iv(w))
    width_ok = False
    for cr in crits:
        se = (half[0] / cr, half[1] / cr)
        if se[1] <= 0:
            continue
        timp = (ae[0] / se[1], ae[1] / se[0] if se[0] > 0 else math.inf)
        if hit(timp, at):
            width_ok = True
    if not width_ok:
        return False
    p = pr.get("p")
    if p is not None and p.raw is None and mode == "stated":
        excludes = lo[0] > 0 or hi[1] < 0
        includes = lo[1] <= 0 <= hi[0]
        sig = p.value < ALPHA or p.op == "<" and p.value <= ALPHA
        if (excludes and not sig) or (includes and sig and not c.f.get("tails") == "one"):
            return False
    return True


def d_ranges(c: Case, w: float, mode: str = "any") -> dict[str, tuple[float, float]]:
    """Every common definition of d the printed numbers allow, as |d| intervals."""
    pr, f = c.pr, c.f
    out: dict[str, tuple[float, float]] = {}
    at = abs_iv(pr["t"].iv(w))
    dfi = df_iv(c, w)
    n1 = int(pr["n1"].value) if "n1" in pr else None
    n2 = int(pr["n2"].value) if "n2" in pr else None
    dfv = dfi[1]
    if dfv > 0:
        out["2t/sqrt(df)"] = (2 * at[0] / math.sqrt(dfi[1]), 2 * at[1] / math.sqrt(max(dfi[0], 0.5)))
    if not n1 and c.kind in IND and (mode == "stated" or "N" in pr or c.kind == "ind"):
        if mode == "stated":
            splits = [(c.true["n1"], c.true["n2"])]
        else:
            tot = int(pr["N"].value) if "N" in pr else int(round(dfi[1])) + 2
            splits = [(a, tot - a) for a in range(2, tot - 1)]
        ks = [math.sqrt(1 / a + 1 / b) for a, b in splits]
        out["t*sqrt(1/n1+1/n2)"] = (at[0] * min(ks), at[1] * max(ks))
    if n1 and n2:
        k = math.sqrt(1 / n1 + 1 / n2)
        out["t*sqrt(1/n1+1/n2)"] = (at[0] * k, at[1] * k)
        for n in {n1, n2}:
            out[f"t/sqrt({n})"] = (at[0] / math.sqrt(n), at[1] / math.sqrt(n))
    elif n1:
        out["t/sqrt(n)"] = (at[0] / math.sqrt(n1), at[1] / math.sqrt(n1))
    nn = int(round(dfi[1])) + 1
    out["t/sqrt(df+1)"] = (at[0] / math.sqrt(nn), at[1] / math.sqrt(max(nn - 1, 1)))
    if c.kind == "paired" and mode == "any" and not ("s1" in pr and "s2" in pr):
        # d_av and d_rm divide by the conditions' SDs, which are not printed: with the correlation
        # unknown, either lies anywhere from 0 to twice d_z (common practice, no source)
        n_low = n1 if n1 else max(int(math.floor(dfi[0])) + 1, 2)
        out["d_av or d_rm, r unknown"] = (0.0, 2 * at[1] / math.sqrt(n_low))
    if "m1" in pr:
        m1, s1 = pr["m1"].iv(w), pr["s1"].iv(w)
        kind = f.get("spread", "sd")
        if kind == "se" and n1:
            s1 = (s1[0] * math.sqrt(n1), s1[1] * math.sqrt(n1))
        if c.kind == "one":
            dd = abs_iv((m1[0] - c.true["mu0"], m1[1] - c.true["mu0"]))
            out["(M-mu0)/SD"] = (dd[0] / s1[1], dd[1] / s1[0])
        if "m2" in pr:
            m2, s2 = pr["m2"].iv(w), pr["s2"].iv(w)
            if kind == "se" and n2:
                s2 = (s2[0] * math.sqrt(n2), s2[1] * math.sqrt(n2))
            dd = abs_iv(diff_iv(m1, m2))
            a, b = n1 or 2, n2 or 2
            sp = (math.sqrt(((a - 1) * s1[0] ** 2 + (b - 1) * s2[0] ** 2) / (a + b - 2)), math.sqrt(((a - 1) * s1[1] ** 2 + (b - 1) * s2[1] ** 2) / (a + b - 2)))
            out["pooled"] = (dd[0] / sp[1], dd[1] / sp[0])
            rms = (math.sqrt((s1[0] ** 2 + s2[0] ** 2) / 2), math.sqrt((s1[1] ** 2 + s2[1] ** 2) / 2))
            out["rms"] = (dd[0] / rms[1], dd[1] / rms[0])
            av = ((s1[0] + s2[0]) / 2, (s1[1] + s2[1]) / 2)
            out["d_av"] = (dd[0] / av[1], dd[1] / av[0])
            out["glass1"] = (dd[0] / s1[1], dd[1] / s1[0])
            out["glass2"] = (dd[0] / s2[1], dd[1] / s2[0])
            if c.kind == "paired":
                nn2 = n1 or nn
                sdd = (dd[0] * math.sqrt(nn2) / at[1], dd[1] * math.sqrt(nn2) / at[0] if at[0] > 0 else math.inf)
                # r over the box, clipped to [-1, 1]
                rs = []
                for x in s1:
                    for y in s2:
                        for z in sdd:
                            if math.isfinite(z):
                                rs.append((x * x + y * y - z * z) / (2 * x * y))
                rlo, rhi = max(-1.0, min(rs)), min(1.0, max(rs))
                if rlo <= rhi:
                    dz = (at[0] / math.sqrt(nn2), at[1] / math.sqrt(nn2))
                    out["d_rm"] = (dz[0] * math.sqrt(2 * (1 - rhi)), dz[1] * math.sqrt(2 * (1 - rlo)))
    # Hedges' g of each, and d read from a g
    js = [hedges_j(max(dfi[0], 2.0)), hedges_j(max(dfi[1], 2.0)), 1 - 3 / (4 * max(dfi[0], 2.0) - 1), 1 - 3 / (4 * max(dfi[1], 2.0) - 1)]
    jlo, jhi = min(js), max(js)
    for k, (lo, hi) in list(out.items()):
        out["g:" + k] = (lo * jlo, hi * jhi)
        out["d-from-g:" + k] = (lo / jhi, hi / jlo)
    return out


D_STATED = {
    "pooled": ["pooled", "t*sqrt(1/n1+1/n2)"],
    "g": ["g:pooled", "g:t*sqrt(1/n1+1/n2)"],
    "dz": ["t/sqrt(n)", "t/sqrt(df+1)"],
    "dav": ["d_av"],
    "one": ["(M-mu0)/SD", "t/sqrt(n)", "t/sqrt(df+1)"],
    "2t": ["2t/sqrt(df)"],
}


def d_consistent(c: Case, w: float, mode: str) -> bool:
    rng = d_ranges(c, w, mode)
    d = abs_iv(c.pr["d"].iv(w))
    keys = D_STATED[c.f["d_def"]] if mode == "stated" else list(rng)
    return any(hit(d, rng[k]) for k in keys if k in rng)


# ---------------------------------------------------------------------------------------------
# Invented studies: topics, groups and measures
# ---------------------------------------------------------------------------------------------

# kind: cont (continuous, printed with `dec`), count (whole numbers), item (single integer item
# lo..hi), mean_items (mean of k integer items lo..hi), sum_items (sum of k items lo..hi)
PEOPLE_MEASURES = [
    dict(name="fatigue", kind="mean_items", k=4, lo=1, hi=5, mu=2.9, sd=0.7),
    dict(name="mood", kind="item", lo=1, hi=9, mu=5.6, sd=1.6),
    dict(name="alertness", kind="item", lo=1, hi=7, mu=4.3, sd=1.2),
    dict(name="errors per shift", kind="count", mu=4.2, sd=2.0),
    dict(name="breaks taken", kind="count", mu=3.1, sd=1.4),
    dict(name="reading speed", kind="cont", unit="words per minute", dec=1, mu=212.0, sd=31.0),
    dict(name="reaction time", kind="cont", unit="ms", dec=1, mu=356.0, sd=48.0),
    dict(name="back discomfort", kind="sum_items", k=6, lo=0, hi=3, mu=6.4, sd=3.1),
    dict(name="job satisfaction", kind="mean_items", k=5, lo=1, hi=5, mu=3.5, sd=0.6),
    dict(name="anxiety", kind="mean_items", k=4, lo=1, hi=5, mu=2.4, sd=0.6),
    dict(name="daily steps", kind="cont", unit="thousand steps", dec=2, mu=7.4, sd=1.9),
    dict(name="sleep duration", kind="cont", unit="hours", dec=2, mu=6.7, sd=0.8),
    dict(name="sick days", kind="count", mu=2.3, sd=1.5),
    dict(name="words recalled", kind="count", mu=11.2, sd=3.0),
    dict(name="perceived stress", kind="sum_items", k=10, lo=0, hi=4, mu=17.5, sd=5.2),
    dict(name="concentration", kind="item", lo=1, hi=10, mu=6.1, sd=1.8),
    dict(name="resting heart rate", kind="cont", unit="beats per minute", dec=1, mu=71.0, sd=8.5),
    dict(name="minutes standing", kind="cont", unit="minutes per day", dec=1, mu=96.0, sd=34.0),
    dict(name="typing accuracy", kind="cont", unit="percent", dec=1, mu=93.5, sd=3.2),
    dict(name="task completion time", kind="cont", unit="seconds", dec=2, mu=48.6, sd=9.3),
]
MOUSE_MEASURES = [
    dict(name="body weight", kind="cont", unit="g", dec=2, mu=24.6, sd=1.9),
    dict(name="food intake", kind="cont", unit="g per day", dec=2, mu=3.9, sd=0.5),
    dict(name="marbles buried", kind="count", mu=9.5, sd=3.0),
    dict(name="open-field crossings", kind="count", mu=62.0, sd=14.0),
    dict(name="grip strength", kind="cont", unit="g", dec=1, mu=118.0, sd=14.0),
    dict(name="time immobile", kind="cont", unit="s", dec=1, mu=104.0, sd=28.0),
    dict(name="nest score", kind="item", lo=1, hi=5, mu=3.2, sd=1.0),
    dict(name="wheel revolutions", kind="cont", unit="thousand per night", dec=2, mu=8.3, sd=2.2),
]
PLOT_MEASURES = [
    dict(name="tomato yield", kind="cont", unit="kg per plot", dec=2, mu=14.2, sd=2.6),
    dict(name="weed count", kind="count", mu=23.0, sd=7.0),
    dict(name="earthworm count", kind="count", mu=11.0, sd=4.0),
    dict(name="soil moisture", kind="cont", unit="percent by volume", dec=1, mu=27.5, sd=4.1),
    dict(name="plant height", kind="cont", unit="cm", dec=1, mu=84.0, sd=11.0),
    dict(name="leaf damage score", kind="item", lo=1, hi=5, mu=2.6, sd=0.9),
    dict(name="fruit count", kind="count", mu=38.0, sd=9.0),
    dict(name="chlorophyll index", kind="cont", unit="index units", dec=2, mu=41.3, sd=4.4),
]

TOPICS = [
    dict(slug="standing-desks", title="Standing desks in a regional office", who="employees", one="employee", domain="people",
         groups=("standing desk", "seated desk"), setting="a regional office of an invented insurer", period="eight weeks",
         times=("before", "after the eight weeks")),
    dict(slug="hand-hygiene", title="Hand-hygiene reminders on hospital wards", who="nurses", one="nurse", domain="people",
         groups=("poster reminder", "spoken reminder"), setting="two wards of an invented district hospital", period="four weeks",
         times=("before", "after the reminders")),
    dict(slug="quiet-headphones", title="Noise-cancelling headphones in an open-plan call centre", who="agents", one="agent", domain="people",
         groups=("headphone", "usual-equipment"), setting="an invented call centre", period="six weeks", times=("before", "after six weeks")),
    dict(slug="reading-buddies", title="A reading-buddy scheme in primary schools", who="pupils", one="pupil", domain="people",
         groups=("reading-buddy", "usual-lesson"), setting="four invented primary schools", period="one term", times=("before", "after one term")),
    dict(slug="cycle-depot", title="A cycle-to-work incentive at a logistics depot", who="staff", one="staff member", domain="people",
         groups=("incentive", "no-incentive"), setting="an invented logistics depot", period="ten weeks", times=("before", "after the incentive period")),
    dict(slug="shift-sleep", title="Sleep-hygiene leaflets for shift workers", who="shift workers", one="worker", domain="people",
         groups=("leaflet", "waiting-list"), setting="an invented bottling plant", period="a month", times=("before", "after a month")),
    dict(slug="picker-breaks", title="Rest-break reminders for warehouse pickers", who="pickers", one="picker", domain="people",
         groups=("reminder", "no-reminder"), setting="an invented parcel warehouse", period="six weeks", times=("before", "after six weeks")),
    dict(slug="walking-group", title="A lunchtime walking group at a council office", who="staff", one="staff member", domain="people",
         groups=("walking", "comparison"), setting="an invented council office", period="twelve weeks", times=("before", "after twelve weeks")),
    dict(slug="plain-letters", title="Plain-language letters at a utility's customer desk", who="customers", one="customer", domain="people",
         groups=("plain-letter", "standard-letter"), setting="the customer desk of an invented water utility", period="three months", times=("before", "after three months")),
    dict(slug="quiet-hour", title="A quiet-hour policy on a children's ward", who="nurses", one="nurse", domain="people",
         groups=("quiet-hour", "usual-routine"), setting="an invented children's ward", period="five weeks", times=("before", "after the policy")),
    dict(slug="amber-glasses", title="Amber-tinted glasses for night-shift drivers", who="drivers", one="driver", domain="people",
         groups=("amber-glasses", "clear-glasses"), setting="an invented bus depot", period="three weeks", times=("before", "after three weeks")),
    dict(slug="village-choir", title="A choir programme in a retirement village", who="residents", one="resident", domain="people",
         groups=("choir", "social-club"), setting="an invented retirement village", period="ten weeks", times=("before", "after ten weeks")),
    dict(slug="library-hours", title="Extended opening hours at a college library", who="students", one="student", domain="people",
         groups=("extended-hours", "usual-hours"), setting="an invented college", period="a semester", times=("before", "after the semester")),
    dict(slug="wheel-enrichment", title="Running-wheel enrichment in laboratory mice", who="mice", one="mouse", domain="mice",
         groups=("wheel", "no-wheel"), setting="an invented animal facility", period="four weeks", times=("before", "after four weeks")),
    dict(slug="fibre-chow", title="A high-fibre chow in laboratory mice", who="mice", one="mouse", domain="mice",
         groups=("high-fibre", "standard-chow"), setting="an invented animal facility", period="six weeks", times=("before", "after six weeks")),
    dict(slug="nest-material", title="Extra nest material for laboratory mice", who="mice", one="mouse", domain="mice",
         groups=("extra-nesting", "standard-nesting"), setting="an invented animal facility", period="three weeks", times=("before", "after three weeks")),
    dict(slug="straw-mulch", title="Straw and bark mulch on allotment plots", who="plots", one="plot", domain="plots",
         groups=("straw-mulch", "bark-mulch"), setting="an invented allotment site", period="one season", times=("spring", "autumn")),
    dict(slug="marigold-beds", title="Marigold companion planting in greenhouse tomato beds", who="beds", one="bed", domain="plots",
         groups=("marigold", "bare-edge"), setting="an invented market garden", period="one season", times=("spring", "autumn")),
    dict(slug="cover-crop", title="A winter cover crop between vineyard rows", who="plots", one="plot", domain="plots",
         groups=("cover-crop", "bare-soil"), setting="an invented hillside vineyard", period="one year", times=("spring", "autumn")),
]

NUMBER_WORDS = {2: "two", 3: "three", 4: "four", 5: "five", 6: "six", 8: "eight", 10: "ten"}


def measure_pool(domain: str) -> list[dict]:
    return {"people": PEOPLE_MEASURES, "mice": MOUSE_MEASURES, "plots": PLOT_MEASURES}[domain]


def is_integer_measure(m: dict) -> bool:
    return m["kind"] in ("count", "item", "mean_items", "sum_items")


def measure_dec(m: dict) -> int:
    return m.get("dec", 2)


def grain(m: dict) -> int:
    """Items per score for GRIM: a mean of n scores is a multiple of 1/(n·k)."""
    return m.get("k", 1) if m["kind"] == "mean_items" else 1


def discretize(m: dict, latent: np.ndarray, rng: np.random.Generator) -> np.ndarray:
    """Scores as the measure records them, from a latent normal value per unit."""
    kind = m["kind"]
    if kind == "cont":
        return np.round(latent, 1 if m.get("dec", 2) <= 1 else 2)
    if kind == "count":
        return np.maximum(np.round(latent), 0.0)
    if kind == "item":
        return np.clip(np.round(latent), m["lo"], m["hi"])
    k = m["k"]
    per_item = latent if kind == "mean_items" else latent / k
    items = np.clip(np.round(per_item[:, None] + rng.normal(0, 0.55, (len(latent), k))), m["lo"], m["hi"])
    return items.mean(axis=1) if kind == "mean_items" else items.sum(axis=1)


def draw(rng: np.random.Generator, m: dict, mu: float, sd: float, n: int) -> np.ndarray:
    return discretize(m, rng.normal(mu, sd, n), rng)


def sd_of(x: np.ndarray) -> float:
    return float(np.std(x, ddof=1))


# ---------------------------------------------------------------------------------------------
# House notation: how numbers and labels look
# ---------------------------------------------------------------------------------------------


@dataclass
class Notation:
    name: str
    sep: str = "."
    minus: str = "\u2212"
    lead_p: bool = False
    p: str = "p"
    t: str = "t"
    M: str = "M"
    SD: str = "SD"
    n: str = "n"
    d: str = "d"
    join: str = ", "
    ci_label: str = "95% CI"
    ci_form: str = "brackets"  # brackets | to | dash | semi
    eq: str = " = "


def notation_for(house: str, rng: np.random.Generator, variant: str = "") -> Notation:
    minus = "\u2212" if rng.random() < 0.6 else "-"
    if house == "apa" or variant == "apa":
        it = rng.random() < 0.5
        return Notation("apa", minus=minus, p="*p*" if it else "p", t="*t*" if it else "t", M="*M*" if it else "M",
                        SD="*SD*" if it else "SD", n="*n*" if it else "n", d="*d*" if it else "d")
    if house == "med" or variant == "med":
        return Notation("med", minus=minus, lead_p=True, p="P", ci_form="to", join="; " if rng.random() < 0.3 else ", ")
    if house == "middot":
        return Notation("middot", sep="\u00b7", minus="\u2212", lead_p=True, p="p", ci_form="dash", eq=" = " if rng.random() < 0.6 else "=")
    if house == "comma":
        return Notation("comma", sep=",", minus=minus, lead_p=True, p="p", join="; ", ci_form="semi",
                        ci_label="95% KI" if rng.random() < 0.4 else "95% CI")
    if house == "nature":
        return Notation("nature", minus=minus, lead_p=True, p="*P*" if rng.random() < 0.5 else "P", ci_form="to")
    raise ValueError(house)


def fmt(x: Num, nt: Notation, lead: bool = True, sci_form: str = "caret") -> str:
    if x.raw is not None:
        return x.raw
    if x.form == "pow":
        return pow10(x.exp, nt, sci_form)
    if x.form == "sci":
        mant = x.value / 10.0**x.exp
        ms = plain(mant, x.dec, nt, True)
        return f"{ms} \u00d7 {pow10(x.exp, nt, sci_form)}"
    return plain(x.value, x.dec, nt, lead)


def plain(v: float, dec: int, nt: Notation, lead: bool) -> str:
    s = str(dround(v, dec))
    neg = s.startswith("-")
    s = s.lstrip("-")
    if not lead and s.startswith("0."):
        s = s[1:]
    s = s.replace(".", nt.sep)
    return (nt.minus + s) if neg else s


SUPERSCRIPT = str.maketrans("0123456789-", "\u2070\u00b9\u00b2\u00b3\u2074\u2075\u2076\u2077\u2078\u2079\u207b")


def pow10(e: int, nt: Notation, form: str) -> str:
    if form == "unicode":
        return "10" + str(e).translate(SUPERSCRIPT)
    if form == "sup":
        return f"10<sup>{str(e).replace('-', chr(0x2212))}</sup>"
    if form == "brace":
        return "10^{" + str(e) + "}"
    return f"10^{str(e)}"


def ci_text(lo: str, hi: str, nt: Notation, neg: bool) -> str:
    form = nt.ci_form
    if form == "dash" and neg:
        form = "to"
    if form == "brackets":
        return f"[{lo}, {hi}]"
    if form == "semi":
        return f"[{lo}; {hi}]"
    if form == "dash":
        return f"{lo}\u2013{hi}"
    return f"{lo} to {hi}"


# ---------------------------------------------------------------------------------------------
# Report styles: which house writes them, which designs they carry, which pieces they can print
# ---------------------------------------------------------------------------------------------

IND = ("ind", "welch")
ALLK = ("ind", "welch", "paired", "one")
STYLES: dict[str, dict] = {}


def style(name: str, house: str, kinds: tuple, caps: set, table: bool = False, weight: float = 1.0, correct_only: bool = False) -> None:
    STYLES[name] = dict(name=name, house=house, kinds=kinds, caps=caps, table=table, weight=weight, correct_only=correct_only)


# APA journals
style("apa-desc-inline", "apa", ALLK, {"desc", "n", "d", "ci", "diff", "dci"}, weight=3)
style("apa-semicolon", "apa", ALLK, {"desc", "n", "d"})
style("apa-paren-claim", "apa", ALLK, {"d", "ci", "diff", "dci", "n"}, weight=1.5)
style("apa-desc-prev-sentence", "apa", IND + ("one",), {"desc", "n", "d"})
style("apa-n-total-only", "apa", ("ind",), {"desc", "N", "d"})
style("apa-df-only", "apa", ("ind",), {"desc", "d"})
style("apa-welch-named", "apa", ("welch",), {"desc", "n", "d", "ci"})
style("apa-paired-prepost", "apa", ("paired",), {"desc", "n", "d", "ci", "diff"}, weight=2)
style("apa-paired-named", "apa", ("paired",), {"n", "d", "ci", "diff"})
style("apa-onesample-ref", "apa", ("one",), {"desc", "n", "d", "ci", "diff"}, weight=2)
style("apa-diff-ci", "apa", ALLK, {"diff", "ci", "d", "n"})
style("apa-ci-after-d", "apa", ALLK, {"d", "dci", "desc", "n"})
style("apa-hedges-g", "apa", IND, {"desc", "n", "d"})
style("apa-one-tailed-declared", "apa", ALLK, {"desc", "n", "d"}, correct_only=True)
style("apa-p-bound", "apa", ALLK, {"desc", "n"})
style("apa-adjusted-bonferroni", "apa", ALLK, {"adj", "d"})
style("apa-adjusted-only", "apa", ALLK, {"d"}, correct_only=True)
style("apa-pless-trailing", "apa", ALLK, {"desc", "n", "d"})
style("apa-multi-test", "apa", ALLK, {"d", "dci"}, weight=1.5)
style("r-console-prose", "apa", ALLK, set())
style("apa-table-wide-md", "apa", IND, {"desc", "n", "d"}, table=True)
style("apa-table-dfheader-md", "apa", ("ind",), {"desc", "n"}, table=True)
style("apa-table-stars-t-md", "apa", ("ind",), {"desc", "n"}, table=True, correct_only=True)
style("apa-table-stars-p-md", "apa", IND, {"desc", "n", "d"}, table=True)
style("apa-table-long-prose-md", "apa", IND, {"desc", "n"}, table=True)
style("apa-table-long-testrow-md", "apa", IND, {"desc", "n"}, table=True)
# medical journals
style("med-meansd-vs", "med", ALLK, {"desc", "n", "diff", "ci"}, weight=3)
style("med-diff-ci-to", "med", ALLK, {"diff", "ci", "n"}, weight=2)
style("med-ci-colon-dash", "med", ALLK, {"diff", "ci", "n"})
style("med-sd-paren", "med", ALLK, {"desc", "n"}, weight=2)
style("med-paired-change", "med", ("paired",), {"desc", "n", "diff", "ci"}, weight=2)
style("med-adjusted", "med", ALLK, {"adj", "diff", "ci"})
style("med-table-wide-md", "med", IND, {"desc", "n", "diff", "ci"}, table=True)
# middle-dot decimals
style("middot-apa", "middot", ALLK, {"desc", "n", "d", "ci"}, weight=3)
style("middot-lancet", "middot", ALLK, {"diff", "ci", "n"}, weight=3)
style("middot-meansd", "middot", ALLK, {"desc", "n"}, weight=2)
style("middot-table-md", "middot", IND, {"desc", "n", "diff", "ci"}, table=True)
# decimal commas
style("comma-apa", "comma", ALLK, {"desc", "n", "d"}, weight=3)
style("comma-ki", "comma", ALLK, {"diff", "ci", "n", "d"}, weight=2)
style("comma-ci-semicolon", "comma", ALLK, {"desc", "n", "ci", "d"}, weight=2)
style("comma-paired", "comma", ("paired",), {"desc", "n", "d"}, weight=2)
style("comma-table-md", "comma", IND, {"desc", "n", "d"}, table=True)
# Nature-like
style("nature-t-sub", "nature", ALLK, {"desc", "n", "ci", "diff"}, weight=2)
style("nature-t-glued", "nature", ALLK, {"desc", "n", "d"}, weight=2)
style("nature-adjusted", "nature", ALLK, {"adj", "n"})
style("nature-pm-labelled", "nature", ALLK, {"desc", "n"}, weight=2)
style("nature-unpaired-paren", "nature", ("ind",), {"n"})
style("nature-pow-caret", "nature", ALLK, {"desc", "n"})
style("nature-pow-unicode", "nature", ALLK, {"desc", "n"})
style("nature-pow-sup", "nature", ALLK, {"desc", "n"})
style("nature-pow-brace", "nature", ALLK, {"desc", "n"})
style("nature-pow-bound", "nature", ALLK, {"desc", "n"}, correct_only=True)
# text pulled out of a PDF
style("pdf-apa-prose", "pdf", ALLK, {"desc", "n", "d", "ci", "diff"}, weight=4)
style("pdf-med-prose", "pdf", ALLK, {"desc", "n", "diff", "ci"}, weight=3)
style("pdf-paired-prose", "pdf", ("paired",), {"desc", "n", "d"}, weight=2)
style("pdf-table-wide-text", "pdf", IND, {"desc", "n", "d"}, table=True)
style("pdf-table-long-text", "pdf", IND, {"desc", "n"}, table=True)
style("pdf-table-stars-text", "pdf", ("ind",), {"desc", "n"}, table=True, correct_only=True)
# R Markdown
style("rmd-inline-apanum", "rmd", ALLK, {"desc", "n", "d", "ci"}, weight=3)
style("rmd-inline-literal", "rmd", ALLK, {"desc", "n", "d"}, weight=2)
style("rmd-apa-plain", "rmd", ALLK, {"desc", "n", "d", "ci", "diff"}, weight=3)
style("rmd-table-md", "rmd", IND, {"desc", "n", "d"}, table=True)

# Pieces a seeded error needs, and pieces it would disturb (so they are left out).
REQUIRES = {
    "t-vs-descriptives": {"desc"}, "se-printed-as-sd": {"desc", "n"}, "df-vs-n": {"n"},
    "paired-analysed-as-independent": {"n"}, "independent-analysed-with-paired-df": {"n", "desc"},
    "impossible-paired-correlation": {"desc"}, "ci-vs-result": {"ci"}, "d-vs-t": {"d"},
    "grim": {"desc", "n"}, "grimmer": {"desc", "n"}, "adjusted-p": {"adj"},
}
DISTURBS = {
    "significance-flip": {"ci"}, "undeclared-one-tailed": {"ci"}, "stated-two-tailed-but-one-tailed-p": {"ci"},
    "impossible-value": {"ci"}, "t-vs-descriptives": {"ci", "diff", "d", "dci"}, "se-printed-as-sd": {"ci", "diff", "d", "dci"},
    "df-vs-n": {"ci", "dci"}, "paired-analysed-as-independent": {"ci", "d", "dci", "diff"},
    "independent-analysed-with-paired-df": {"ci", "d", "dci", "diff"}, "impossible-paired-correlation": {"ci", "diff", "d", "dci"},
    "grim": {"ci", "diff", "d", "dci"}, "grimmer": {"ci", "diff", "d", "dci"}, "ci-vs-result": {"dci"}, "d-vs-t": {"dci"},
    "p-printed-as-zero": set(), "p-typo": set(), "adjusted-p": set(), "abstract-vs-results": set(),
}
ERROR_KINDS = {
    "paired-analysed-as-independent": ("paired",), "independent-analysed-with-paired-df": ("ind",),
    "impossible-paired-correlation": ("paired",), "se-printed-as-sd": ("ind", "welch", "one"),
    "t-vs-descriptives": ("ind", "welch", "one"), "df-vs-n": ("ind", "one"), "grim": ("ind", "one", "paired"),
    "grimmer": ("ind", "one", "paired"),
}


def style_fits(st: dict, kind: str, error: str | None) -> bool:
    if kind not in st["kinds"]:
        return False
    if error is not None and st["correct_only"]:
        return False
    if error is not None and not REQUIRES.get(error, set()) <= st["caps"]:
        return False
    if error in ("p-printed-as-zero", "undeclared-one-tailed", "stated-two-tailed-but-one-tailed-p", "significance-flip", "p-typo") and st["name"] in ("apa-p-bound", "apa-adjusted-only"):
        return False
    p_errors = ("p-printed-as-zero", "undeclared-one-tailed", "stated-two-tailed-but-one-tailed-p", "significance-flip", "p-typo", "impossible-value")
    if error in ("grim", "grimmer") and (st["name"].startswith("nature-pow") or st["name"] == "r-console-prose"):
        return False
    if error in p_errors and "adj" in st["caps"]:
        return False
    if error in p_errors and error != "p-typo" and st["name"].startswith("nature-pow"):
        return False
    if error in ("undeclared-one-tailed", "stated-two-tailed-but-one-tailed-p", "significance-flip", "p-typo") and st["name"] == "r-console-prose":
        return False
    # this style writes "two-tailed unpaired t-test" beside the result: a one-tailed p there is
    # a stated-two-tailed error, never an undeclared one
    if error == "undeclared-one-tailed" and st["name"] == "nature-unpaired-paren":
        return False
    if error == "t-vs-descriptives" and st["name"] in ("apa-n-total-only", "apa-df-only") and kind != "ind":
        return False
    return True


# ---------------------------------------------------------------------------------------------
# One invented manuscript's settings
# ---------------------------------------------------------------------------------------------


@dataclass
class Doc:
    idx: int
    house: str  # apa | med | middot | comma | nature | pdf | rmd
    ext: str
    slug: str
    topic: dict
    nt: Notation
    study: str  # between | within
    nA: int
    nB: int
    tails_stated: bool
    one_sided_prose: bool
    p_dec: int
    t_dec: int
    welch_dec: int
    measures: list
    n_offset: int = 0  # printed total minus analysed total (a seeded total-n error)
    spread_doc: str = "sd"  # what ± means, as the Methods say (Nature-like documents)
    cases: list = field(default_factory=list)
    distractors: list = field(default_factory=list)
    ctx_counter: int = 0

    @property
    def N(self) -> int:
        return self.nA + (self.nB if self.study == "between" else 0)


CONTEXTS = ["at week {w}", "at the {ord} visit", "in the {shift}", "on {day}s", "at follow-up {w}"]
ORDINALS = ["first", "second", "third", "fourth", "fifth", "sixth"]
SHIFTS = ["morning shift", "late shift", "night shift", "weekend rota"]
DAYS = ["Monday", "Tuesday", "Wednesday", "Thursday", "Friday"]


def next_context(doc: Doc, rng: np.random.Generator) -> str:
    doc.ctx_counter += 1
    k = doc.ctx_counter
    form = CONTEXTS[k % len(CONTEXTS)]
    return form.format(w=1 + k % 12, ord=ORDINALS[k % 6], shift=SHIFTS[k % 4], day=DAYS[k % 5])


def choose_measure(rng: np.random.Generator, doc: Doc, error: str | None, n: int) -> dict:
    ms = doc.measures
    if error in ("grim", "grimmer"):
        ok = [m for m in ms if is_integer_measure(m) and (error == "grim" and n * grain(m) <= 90 or error == "grimmer" and grain(m) == 1 and m["kind"] != "sum_items")]
        if not ok:
            raise Unfit("no whole-number measure fits")
        return ok[int(rng.integers(len(ok)))]
    return ms[int(rng.integers(len(ms)))]


def print_p(p: float, doc: Doc, st: str) -> Num:
    if st.startswith("nature-pow"):
        if st == "nature-pow-bound" and p < 1e-6:
            return Num(1e-6, 0, -6, "<", "pow")
        if p < 1e-3:
            return sci(p, 1)
    if st == "r-console-prose":
        if p < 2.2e-16:
            return Num(2.2e-16, 1, -16, "<", "sci")
        if p < 1e-4:
            return sci(p, 3)
        return sig_num(p, 4)
    if st == "apa-p-bound":
        for b in (0.001, 0.01, 0.05):
            if p < b:
                return Num(b, 3 if b == 0.001 else 2, op="<")
        return Num(0.05, 2, op=">")
    if p < 0.001:
        return Num(0.001, 3, op="<")
    dec = doc.p_dec
    if dec == 2 and (p < 0.01 or float(dround(p, 2)) in (0.05, 0.0, 1.0)):
        dec = 3
    return num(p, dec)


def target_t(rng: np.random.Generator, c: Case) -> float:
    """The t the simulation aims at (the drawn data scatter around it)."""
    e, st = c.error, c.style
    sign = 1 if rng.random() < 0.8 else -1
    if e == "p-printed-as-zero" or st.startswith("nature-pow") or (st == "r-console-prose" and rng.random() < 0.3):
        return float(rng.uniform(5.0, 9.5)) * sign
    if e == "significance-flip":
        return float(rng.uniform(0.0, 1.2)) * sign if c.f.get("flip") == "to-sig" else float(rng.uniform(2.7, 3.6)) * sign
    if e in ("undeclared-one-tailed", "stated-two-tailed-but-one-tailed-p"):
        return float(rng.uniform(1.0, 2.4)) * sign
    if e == "p-typo":
        return float(rng.uniform(0.5, 3.5)) * sign
    return float(rng.uniform(-1.5, 4.5))


def sizes_for(rng: np.random.Generator, c: Case, doc: Doc, anchor: bool) -> tuple[int, int]:
    n1, n2 = base_sizes(rng, c, doc, anchor)
    if c.error == "grimmer" and not anchor:
        # GRIMMER can only rule an SD out for small samples: a subgroup
        n1, n2 = min(n1, int(rng.integers(8, 22))), min(n2, int(rng.integers(8, 22)))
        if c.kind not in IND:
            n2 = n1
    return n1, n2


def base_sizes(rng: np.random.Generator, c: Case, doc: Doc, anchor: bool) -> tuple[int, int]:
    miss = [0, 0, 0, 0, 1, 1, 2, 3]
    if c.kind in IND:
        if anchor:
            return doc.nA, doc.nB
        if c.error in ("paired-analysed-as-independent", "independent-analysed-with-paired-df"):
            n = min(doc.nA, doc.nB) - int(rng.choice(miss))
            return n, n
        if rng.random() < 0.15:  # a subgroup
            return max(5, doc.nA // 2 - int(rng.integers(0, 3))), max(5, doc.nB // 2 - int(rng.integers(0, 3)))
        return doc.nA - int(rng.choice(miss)), doc.nB - int(rng.choice(miss))
    base = doc.nA if doc.study == "between" else doc.N
    if doc.study == "between" and rng.random() < 0.5:
        base = doc.nB
    n = base - int(rng.choice(miss))
    if c.error in ("grim", "grimmer") and c.measure is not None:
        while n * grain(c.measure) > 90 and n > 8:
            n -= 1
    return n, n


def simulate(rng: np.random.Generator, c: Case, doc: Doc, anchor: bool) -> None:
    m = c.measure
    mu, sd = m["mu"], m["sd"]
    n1, n2 = sizes_for(rng, c, doc, anchor)
    T: dict = dict(n1=n1, n2=n2)
    if c.kind in IND:
        ratio = float(rng.uniform(1.5, 2.4)) if c.kind == "welch" else float(rng.uniform(0.85, 1.2))
        if c.kind == "welch" and not anchor and rng.random() < 0.5:
            n2 = max(5, int(n2 * rng.uniform(0.55, 0.85)))
            T["n2"] = n2
        d_eff = target_t(rng, c) * math.sqrt(1 / n1 + 1 / n2) * math.sqrt((1 + ratio * ratio) / 2)
        x1 = draw(rng, m, mu + d_eff * sd, sd, n1)
        x2 = draw(rng, m, mu, sd * ratio, n2)
        if sd_of(x1) == 0 or sd_of(x2) == 0:
            raise Unfit("constant data")
        res = stats.ttest_ind(x1, x2, equal_var=(c.kind == "ind"))
        ci = res.confidence_interval(0.95)
        s1, s2 = sd_of(x1), sd_of(x2)
        sp = math.sqrt(((n1 - 1) * s1**2 + (n2 - 1) * s2**2) / (n1 + n2 - 2))
        diff = float(x1.mean() - x2.mean())
        d = diff / sp
        T.update(t=float(res.statistic), df=float(res.df), p=float(res.pvalue), m1=float(x1.mean()), s1=s1, m2=float(x2.mean()), s2=s2,
                 diff=diff, ci=(float(ci.low), float(ci.high)), d=d, g=d * hedges_j(n1 + n2 - 2))
        se_d = math.sqrt((n1 + n2) / (n1 * n2) + d * d / (2 * (n1 + n2)))
        T["dci"] = (d - 1.959963984540054 * se_d, d + 1.959963984540054 * se_d)
        T["student_t"] = float(stats.ttest_ind(x1, x2, equal_var=True).statistic)
        T["x1"], T["x2"] = x1, x2
    elif c.kind == "paired":
        n = n1
        r = float(rng.uniform(0.3, 0.85))
        base = rng.normal(0, 1, n)
        e1, e2 = rng.normal(0, 1, n), rng.normal(0, 1, n)
        pre = discretize(m, mu + sd * (r * base + math.sqrt(1 - r * r) * e1), rng)
        shift = target_t(rng, c) * sd * math.sqrt(2 * (1 - r * r)) / math.sqrt(n)
        post = discretize(m, mu + shift + sd * (r * base + math.sqrt(1 - r * r) * e2), rng)
        dd = post - pre
        if sd_of(dd) == 0 or sd_of(pre) == 0 or sd_of(post) == 0:
            raise Unfit("constant data")
        res = stats.ttest_rel(post, pre)
        ci = res.confidence_interval(0.95)
        s1, s2 = sd_of(post), sd_of(pre)
        diff = float(post.mean() - pre.mean())
        dz = diff / sd_of(dd)
        T.update(t=float(res.statistic), df=float(res.df), p=float(res.pvalue), m1=float(post.mean()), s1=s1, m2=float(pre.mean()), s2=s2,
                 diff=diff, ci=(float(ci.low), float(ci.high)), d=dz, dav=diff / ((s1 + s2) / 2), r=float(np.corrcoef(pre, post)[0, 1]))
        se_d = math.sqrt(1 / n + dz * dz / (2 * n))
        T["dci"] = (dz - 1.959963984540054 * se_d, dz + 1.959963984540054 * se_d)
        T["x1"], T["x2"] = post, pre
        ind = stats.ttest_ind(post, pre, equal_var=True)
        T["student_t"] = float(ind.statistic)
    else:
        n = n1
        mu0 = reference_value(m, rng)
        x = draw(rng, m, mu0 + target_t(rng, c) * sd / math.sqrt(n), sd, n)
        if sd_of(x) == 0:
            raise Unfit("constant data")
        res = stats.ttest_1samp(x, mu0)
        ci = res.confidence_interval(0.95)
        s1 = sd_of(x)
        diff = float(x.mean() - mu0)
        T.update(t=float(res.statistic), df=float(res.df), p=float(res.pvalue), m1=float(x.mean()), s1=s1, diff=diff, mu0=mu0,
                 ci=(float(ci.low) - mu0, float(ci.high) - mu0), d=diff / s1)
        se_d = math.sqrt(1 / n + (diff / s1) ** 2 / (2 * n))
        T["dci"] = (diff / s1 - 1.959963984540054 * se_d, diff / s1 + 1.959963984540054 * se_d)
        T["x1"] = x
    if not math.isfinite(T["t"]) or abs(T["t"]) > 60:
        raise Unfit("degenerate t")
    c.true = T


def reference_value(m: dict, rng: np.random.Generator) -> float:
    if m["kind"] == "item":
        return (m["lo"] + m["hi"]) / 2
    if m["kind"] == "mean_items":
        return 3.0
    e = math.floor(math.log10(max(m["sd"], 0.1)))
    return float(dround((m["mu"] - m["sd"] * 0.3) / 10.0**e, 0)) * 10.0**e if e >= 0 else float(dround(m["mu"] - m["sd"] * 0.3, -e))


def print_case(rng: np.random.Generator, c: Case, doc: Doc, pieces: set) -> None:
    T, m, pr, f = c.true, c.measure, c.pr, c.f
    dec = 2 if is_integer_measure(m) else measure_dec(m)
    tdec = 4 if c.style == "r-console-prose" else doc.t_dec
    if c.style == "r-console-prose":
        pr["t"] = sig_num(T["t"], 5)
        pr["df"] = sig_num(T["df"], 5) if c.kind == "welch" else Num(T["df"], 0)
        if pr["df"].dec == 0 and c.kind == "welch":
            pr["df"] = Num(pr["df"].value, 0)
    else:
        pr["t"] = num(T["t"], tdec)
        pr["df"] = num(T["df"], doc.welch_dec) if c.kind == "welch" else Num(T["df"], 0)
    pr["p"] = print_p(T["p"], doc, c.style)
    spread = "sd"
    if c.style.startswith("nature") and doc.spread_doc == "se":
        spread = "se"
    if c.error in ("se-printed-as-sd", "grimmer") and c.style.startswith("nature"):
        spread = "sd"
        f["pm_label"] = "sd"
    f["spread"] = spread
    if "desc" in pieces:
        if spread == "se":
            pr["m1"], pr["s1"] = num(T["m1"], dec), num(T["s1"] / math.sqrt(T["n1"]), dec)
        else:
            pr["m1"], pr["s1"] = num(T["m1"], dec), num(T["s1"], dec)
        if c.kind != "one":
            s2 = T["s2"] / math.sqrt(T["n2"]) if spread == "se" else T["s2"]
            pr["m2"], pr["s2"] = num(T["m2"], dec), num(s2, dec)
        if pr["s1"].value == 0 or ("s2" in pr and pr["s2"].value == 0):
            raise Unfit("spread rounds to zero")
    if "n" in pieces:
        pr["n1"] = Num(T["n1"], 0)
        if c.kind in IND:
            pr["n2"] = Num(T["n2"], 0)
    if "N" in pieces and c.kind in IND:
        pr["N"] = Num(T["n1"] + T["n2"], 0)
        f["n_total_only"] = True
    if "ci" in pieces:
        pr["ci_lo"], pr["ci_hi"] = num(T["ci"][0], dec), num(T["ci"][1], dec)
        f["ci_of"] = "diff"
        if "diff" in pieces:
            pr["diff"] = num(T["diff"], dec)
    if "d" in pieces:
        if c.kind in IND:
            if c.style == "apa-hedges-g" or rng.random() < 0.12:
                pr["d"], f["d_def"] = num(T["g"], 2), "g"
            else:
                pr["d"], f["d_def"] = num(T["d"], 2), "pooled"
        elif c.kind == "paired":
            if rng.random() < 0.3 and "desc" in pieces:
                pr["d"], f["d_def"] = num(T["dav"], 2), "dav"
            else:
                pr["d"], f["d_def"] = num(T["d"], 2), "dz"
        else:
            pr["d"], f["d_def"] = num(T["d"], 2), "one"
        if "dci" in pieces and "ci" not in pieces and f["d_def"] in ("pooled", "dz", "one"):
            pr["d_lo"], pr["d_hi"] = num(T["dci"][0], 2), num(T["dci"][1], 2)
    if "adj" in pieces:
        m_cmp = int(rng.choice([2, 3, 3, 4, 5, 6]))
        f["adj_m"] = m_cmp
        if pr["p"].op != "=":
            raise Unfit("adjusted p needs an exact p")
        pr["padj"] = num(min(1.0, m_cmp * T["p"]), 3)
        f["adj_form"] = ["for-m", "m-after", "colon"][int(rng.integers(3))]
    if c.style == "apa-adjusted-only":
        m_cmp = int(rng.choice([2, 3, 4, 6]))
        form = ["bonferroni-only", "p_adj", "p_Holm"][int(rng.integers(3))]
        f["adj_only"] = form
        f["adj_m"] = m_cmp if rng.random() < 0.5 else None
        if form == "p_Holm":
            others = rng.uniform(0.0005, 0.6, m_cmp - 1)
            ps = np.sort(np.append(others, T["p"]))
            adj = np.minimum(1.0, np.maximum.accumulate((m_cmp - np.arange(m_cmp)) * ps))
            val = float(adj[int(np.searchsorted(ps, T["p"]))])
        else:
            val = min(1.0, m_cmp * T["p"])
        pa = num(val, 3) if val >= 0.001 else Num(0.001, 3, op="<")
        pr["padj"] = pa
        del pr["p"]
    if c.style == "apa-one-tailed-declared":
        f["tails"] = "one"
        p1 = T["p"] / 2
        pr["p"] = print_p(p1, doc, c.style)
    if c.kind == "paired":
        f["design_words"] = "paired"
        f["n_both"] = bool(rng.random() < 0.35)
    if c.kind == "one":
        pr["mu0"] = Num(T["mu0"], 0 if float(T["mu0"]).is_integer() else 1)
    if is_integer_measure(m) and "desc" in pieces and "n" in pieces:
        f["grim_checkable"] = True


# ---------------------------------------------------------------------------------------------
# Seeding one error, and proving it
# ---------------------------------------------------------------------------------------------


def in_range(m: dict, v: float, key: str) -> bool:
    """A mistyped mean stays on the measure's scale (a mean of 5.28 on a 1–5 scale is another error)."""
    if key.startswith("s"):
        return v > 0
    lo, hi = 0.0, math.inf
    if m["kind"] in ("item", "mean_items"):
        lo, hi = m["lo"], m["hi"]
    elif m["kind"] == "sum_items":
        lo, hi = m["k"] * m["lo"], m["k"] * m["hi"]
    elif m["kind"] == "cont" and m.get("unit") == "percent":
        hi = 100.0
    return lo <= v <= hi


def typo_candidates(x: Num, rng: np.random.Generator) -> list[float]:
    """Plausible mistypings of a printed number: a digit changed, two digits swapped, a slip."""
    s = str(dround(x.value, x.dec))
    neg = s.startswith("-")
    s = s.lstrip("-")
    digits = [i for i, ch in enumerate(s) if ch.isdigit()]
    out = []
    for i in digits:
        for dgt in "0123456789":
            if dgt != s[i]:
                out.append(s[:i] + dgt + s[i + 1:])
    for a, b in zip(digits, digits[1:]):
        t = list(s)
        t[a], t[b] = t[b], t[a]
        out.append("".join(t))
    vals = sorted({(-1 if neg else 1) * float(v) for v in out if v != s})
    rng.shuffle(vals)
    return vals


def with_p(c: Case, p: Num) -> None:
    c.pr["p"] = p


def check_error(c: Case, doc: Doc) -> bool:
    """The seeded error is certain (every reading fails) and is the only thing wrong."""
    e = c.error
    tails = "two" if doc.tails_stated else None
    stated = t_case_checks(c, "stated", tails)
    anyf = t_case_checks(c, "any", tails)
    allowed = ALLOWED_STATED_FAILS[e]
    if not stated <= allowed:
        return False
    if e in ("undeclared-one-tailed", "stated-two-tailed-but-one-tailed-p"):
        # two-tailed fails with margin; one-tailed reproduces
        two = p_range(c.pr["t"].iv(1.0), df_iv(c, 1.0), 2)
        if hit(reported_p_iv(c.pr["p"], 1.0), two):
            return False
        one = p_range(c.pr["t"].iv(0.5), df_iv(c, 0.5), 1)
        return hit(reported_p_iv(c.pr["p"], 0.5), one) and "p" in stated
    if e == "p-printed-as-zero":
        return "zero" in stated and p_range(c.pr["t"].iv(1.0), df_iv(c, 1.0), 2)[1] < 0.0005
    if e == "se-printed-as-sd":
        if "tdesc" not in anyf_sd_only(c):
            return False
        c.f["spread"] = "se"
        ok = "tdesc" not in t_case_checks(c, "stated", tails)
        c.f["spread"] = "sd"
        return ok
    if e == "independent-analysed-with-paired-df":
        n = int(c.pr["n1"].value)
        lo, _ = welch_df_range(c.pr["s1"].iv(1.0), n, c.pr["s2"].iv(1.0), n, "sd")
        return "design" in stated and lo > n - 1 + 1.0
    if e == "paired-analysed-as-independent":
        return "design" in stated
    target = {"p-typo": "p", "significance-flip": "sig", "impossible-value": "possible", "t-vs-descriptives": "tdesc", "df-vs-n": "df",
              "impossible-paired-correlation": "r", "ci-vs-result": "ci", "d-vs-t": "d", "grim": "grim", "grimmer": "grimmer",
              "adjusted-p": "adj", "abstract-vs-results": "repeat"}[e]
    if e in ("grim", "grimmer"):
        return target in stated
    if e == "p-typo" and "sig" in anyf:
        return False
    return target in anyf


def anyf_sd_only(c: Case) -> set[str]:
    """t from descriptives with the spreads read as labelled (SD), Student and Welch, with margin."""
    pr = c.pr
    m1, s1 = pr["m1"].iv(1.0), pr["s1"].iv(1.0)
    at = abs_iv(pr["t"].iv(1.0))
    if c.kind == "one":
        reach = hit(t_one_range(m1, s1, int(pr["n1"].value), c.true["mu0"], "sd"), at)
    else:
        m2, s2 = pr["m2"].iv(1.0), pr["s2"].iv(1.0)
        a, b = int(pr["n1"].value), int(pr["n2"].value)
        reach = any(hit(t_ind_range(m1, s1, a, m2, s2, b, pooled, "sd", "sd"), at) for pooled in (True, False))
    return set() if reach else {"tdesc"}


def apply_error(rng: np.random.Generator, c: Case, doc: Doc) -> None:
    e, pr, T, f = c.error, c.pr, c.true, c.f
    if e is None:
        return
    if e == "p-typo":
        p = pr["p"]
        if p.form == "sci":
            mant = p.value / 10.0**p.exp
            for cand in typo_candidates(Num(mant, p.dec), rng)[:12] + [None]:
                if cand is None:
                    q = Num(p.value * 10, p.dec, p.exp + 1, "=", "sci")
                elif cand < 1 or cand >= 10:
                    continue
                else:
                    q = Num(cand * 10.0**p.exp, p.dec, p.exp, "=", "sci")
                with_p(c, q)
                if check_error(c, doc):
                    return
            raise Unfit("no p typo")
        if p.op != "=":
            cands = [0.002, 0.003, 0.004, 0.006, 0.008] if p.value <= 0.001 else []
            for v in cands:
                with_p(c, Num(v, 3))
                if check_error(c, doc):
                    return
            raise Unfit("no p typo")
        for v in typo_candidates(p, rng)[:30]:
            if 0 < v < 1:
                with_p(c, Num(v, p.dec))
                if check_error(c, doc):
                    return
        raise Unfit("no p typo")
    if e == "significance-flip":
        p2 = T["p"]
        if f.get("flip") == "to-sig":
            if p2 < 0.12:
                raise Unfit("p not far enough above alpha")
            if c.style == "apa-p-bound" or rng.random() < 0.2:
                with_p(c, Num(0.05, 2, op="<"))
            else:
                with_p(c, Num(float(rng.choice([0.012, 0.018, 0.021, 0.027, 0.031, 0.034, 0.038, 0.041, 0.043])), 3))
        else:
            if p2 > 0.02 or p2 < 0.0001:
                raise Unfit("p not far enough below alpha")
            if c.style == "apa-p-bound":
                with_p(c, Num(0.05, 2, op=">"))
            else:
                with_p(c, Num(float(rng.choice([0.061, 0.072, 0.083, 0.094, 0.12, 0.16, 0.21, 0.27, 0.34, 0.48])), 3 if rng.random() < 0.7 else 2))
                if pr["p"].dec == 2:
                    pr["p"] = num(pr["p"].value, 2)
        if not check_error(c, doc):
            raise Unfit("flip not certain")
        return
    if e in ("undeclared-one-tailed", "stated-two-tailed-but-one-tailed-p"):
        p1 = T["p"] / 2
        if T["p"] < 0.006:
            raise Unfit("too small for a visible one-tailed p")
        q = print_p(p1, doc, c.style)
        if q.op != "=":
            raise Unfit("bound")
        with_p(c, q)
        if not check_error(c, doc):
            raise Unfit("one-tailed p not distinct")
        return
    if e == "impossible-value":
        form = f["impossible"]
        if form == "p-above-one":
            with_p(c, Num(float(rng.choice([1.23, 1.04, 1.35, 2.10, 1.12])), 2))
        elif form == "p-no-point":
            v = pr["p"]
            digits = str(dround(max(T["p"], 0.011), 3))[2:]
            with_p(c, Num(float(int(digits)), 0, raw=digits))
        elif form == "p-below-zero-bound":
            with_p(c, Num(0.0, 3, op="<"))
        else:
            pr["df"] = Num(float(rng.choice([0, -2, -14, 0])), 0)
        if not check_error(c, doc):
            raise Unfit("impossible value not seen")
        return
    if e == "p-printed-as-zero":
        if T["p"] >= 0.0004:
            raise Unfit("p not small enough")
        with_p(c, Num(0.0, 3))
        if not check_error(c, doc):
            raise Unfit("zero p")
        return
    if e == "t-vs-descriptives":
        keys = ["m1", "m2", "s1", "s2"] if c.kind != "one" else ["m1", "s1"]
        rng.shuffle(keys)
        for k in keys:
            orig = pr[k]
            for v in typo_candidates(orig, rng)[:25]:
                if not in_range(c.measure, v, k):
                    continue
                pr[k] = Num(v, orig.dec)
                if check_error(c, doc):
                    return
            pr[k] = orig
        raise Unfit("no descriptive typo reaches certainty")
    if e == "se-printed-as-sd":
        dec = pr["s1"].dec
        pr["s1"] = num(T["s1"] / math.sqrt(T["n1"]), dec)
        if c.kind != "one":
            pr["s2"] = num(T["s2"] / math.sqrt(T["n2"]), dec)
        if pr["s1"].value == 0 or ("s2" in pr and pr["s2"].value == 0) or pr["s1"].value < 5 * pr["s1"].unit():
            pr["s1"] = num(T["s1"] / math.sqrt(T["n1"]), dec + 1)
            if c.kind != "one":
                pr["s2"] = num(T["s2"] / math.sqrt(T["n2"]), dec + 1)
        f["grim_checkable"] = False
        if not check_error(c, doc):
            raise Unfit("SE reading not distinct")
        return
    if e == "df-vs-n":
        n1 = int(pr["n1"].value)
        if c.kind == "one":
            cands = [n1 + 1, n1 + 2, n1 - 3, n1 + 9, n1 + 10]
        else:
            n2 = int(pr["n2"].value)
            cands = [n1 + n2, n1 + n2 + 2, n1 + n2 + 4, n1 + n2 + 8, n1 + n2 + 10]
        rng.shuffle(cands)
        for dfv in cands:
            if dfv <= 1:
                continue
            pr["df"] = Num(float(dfv), 0)
            pr["p"] = print_p(p_two(T["t"], dfv), doc, c.style)
            if check_error(c, doc):
                return
        raise Unfit("df")
    if e == "paired-analysed-as-independent":
        n = int(pr["n1"].value)
        t_ind = T["student_t"]
        pr["t"] = num(t_ind, pr["t"].dec)
        pr["df"] = Num(float(2 * n - 2), 0)
        pr["p"] = print_p(p_two(t_ind, 2 * n - 2), doc, c.style)
        if not check_error(c, doc):
            raise Unfit("paired as independent")
        return
    if e == "independent-analysed-with-paired-df":
        n = int(pr["n1"].value)
        pr["df"] = Num(float(n - 1), 0)
        pr["p"] = print_p(p_two(T["t"], n - 1), doc, c.style)
        f["design_words"] = "independent"
        if not check_error(c, doc):
            raise Unfit("independent with paired df")
        return
    if e == "impossible-paired-correlation":
        keys = ["s1", "s2", "m1", "m2"]
        rng.shuffle(keys)
        for k in keys:
            orig = pr[k]
            for factor in (2.5, 3.0, 0.3, 4.0, 0.2, 1.8):
                v = orig.value * factor if k.startswith("s") else orig.value + (factor - 1) * (pr["s1"].value + pr["s2"].value)
                pr[k] = num(v, orig.dec)
                if pr[k].value > 0 and in_range(c.measure, pr[k].value, k) and check_error(c, doc):
                    return
            for v in typo_candidates(orig, rng)[:20]:
                if v > 0 and in_range(c.measure, v, k):
                    pr[k] = Num(v, orig.dec)
                    if check_error(c, doc):
                        return
            pr[k] = orig
        raise Unfit("paired correlation")
    if e == "ci-vs-result":
        keys = ["ci_lo", "ci_hi"]
        rng.shuffle(keys)
        for k in keys:
            orig = pr[k]
            for v in typo_candidates(orig, rng)[:30]:
                pr[k] = Num(v, orig.dec)
                if pr["ci_lo"].value < pr["ci_hi"].value and check_error(c, doc):
                    return
            pr[k] = orig
        raise Unfit("ci")
    if e == "d-vs-t":
        orig = pr["d"]
        cands = [orig.value * fct for fct in (2.0, 0.5, 1.6, 0.6, 2.5)] + typo_candidates(orig, rng)[:20]
        for v in cands:
            pr["d"] = num(v, 2)
            if abs(pr["d"].value) > 0.04 and check_error(c, doc):
                return
        raise Unfit("d")
    if e == "grim":
        k = "m1" if rng.random() < 0.5 or "m2" not in pr else "m2"
        orig = pr[k]
        steps = [0.01, -0.01, 0.02, -0.02, 0.03, -0.03, 0.04, -0.04]
        for stp in steps:
            pr[k] = num(orig.value + stp, orig.dec)
            if in_range(c.measure, pr[k].value, k) and check_error(c, doc):
                return
        pr[k] = orig
        raise Unfit("grim")
    if e == "grimmer":
        k = "s1" if rng.random() < 0.5 or "s2" not in pr else "s2"
        orig = pr[k]
        for stp in (0.01, -0.01, 0.02, -0.02, 0.03, -0.03, 0.04, -0.04, 0.05, -0.05):
            pr[k] = num(orig.value + stp, orig.dec)
            if pr[k].value > 0 and check_error(c, doc):
                return
        pr[k] = orig
        raise Unfit("grimmer")
    if e == "adjusted-p":
        m = f["adj_m"]
        right = pr["padj"]
        p = pr["p"]
        cands = [min(0.999, (m + 1) * p.value), (m - 1) * p.value, p.value * m * 1.5] + typo_candidates(right, rng)[:10]
        for v in cands:
            if 0 < v < 1:
                pr["padj"] = num(v, 3)
                if check_error(c, doc):
                    return
        raise Unfit("adjusted p")
    raise ValueError(e)


ALWAYS_DIFF_CI = ("apa-diff-ci", "med-diff-ci-to", "med-ci-colon-dash", "middot-lancet", "comma-ki", "med-paired-change")


def pieces_for(rng: np.random.Generator, st: dict, error: str | None, kind: str) -> set:
    caps = set(st["caps"])
    pieces = set()
    for pc in sorted(caps):
        keep = {"desc": 0.95, "n": 0.9, "N": 1.0, "d": 0.6, "ci": 0.55, "diff": 0.7, "dci": 0.5, "adj": 1.0}[pc]
        if rng.random() < keep:
            pieces.add(pc)
    pieces |= REQUIRES.get(error, set()) & caps
    if st["table"]:
        pieces |= {"desc", "n"}
    if error is not None:
        pieces -= DISTURBS.get(error, set())
    if "dci" in pieces and "d" not in pieces:
        pieces.discard("dci")
    if "diff" in pieces and "ci" not in pieces:
        pieces.discard("diff")
    if st["name"] in ("apa-ci-after-d",):
        pieces |= {"d"}
        if error not in ("d-vs-t",):
            pieces.add("dci")
        pieces.discard("ci")
    if st["name"] in ALWAYS_DIFF_CI and "ci" not in DISTURBS.get(error, set()):
        pieces |= {"ci", "diff"}
    if st["name"] in ("apa-paren-claim", "apa-multi-test") and "d" in caps and "d" not in DISTURBS.get(error, set()):
        pieces.add("d")
    if st["name"] == "apa-hedges-g" and "d" not in DISTURBS.get(error, set()):
        pieces.add("d")
    if "N" in pieces:
        pieces.discard("n")
    if kind == "one" and "ci" in pieces:
        pieces.add("diff")
    return pieces


def make_t_case(rng: np.random.Generator, doc: Doc, cid: str, kind: str, error: str | None, st_name: str, anchor: bool = False, flip: str | None = None, impossible: str | None = None) -> Case:
    st = STYLES[st_name]
    for attempt in range(600):
        c = Case(cid, kind, error, st_name)
        c.f["flip"] = flip
        c.f["impossible"] = impossible
        try:
            pieces = pieces_for(rng, st, error, kind)
            if anchor:
                pieces.discard("N")
            n_guess = min(doc.nA, doc.nB) if doc.study == "between" else doc.N
            c.measure = choose_measure(rng, doc, error, n_guess - 2)
            simulate(rng, c, doc, anchor)
            print_case(rng, c, doc, pieces)
            if anchor and c.pr["p"].op != "=":
                pass
            if error is None:
                if t_case_checks(c, "stated", None):
                    raise Unfit("correct case not reproduced: " + ",".join(sorted(t_case_checks(c, "stated", None))))
            else:
                apply_error(rng, c, doc)
            c.f["pieces"] = sorted(pieces)
            return c
        except Unfit as ex:
            last = str(ex)
            continue
    raise RuntimeError(f"{cid}: could not build {kind} {error} {st_name}: {last}")


# ---------------------------------------------------------------------------------------------
# Writing a result the way authors do. A token is (text, [(owner id, role), ...]).
# ---------------------------------------------------------------------------------------------

INLINE_R_STYLES = ("rmd-inline-apanum", "rmd-inline-literal")
SCI_FORMS = {"nature-pow-caret": "caret", "nature-pow-unicode": "unicode", "nature-pow-sup": "sup", "nature-pow-brace": "brace", "nature-pow-bound": "caret"}


class W:
    """Writes the pieces of one case in its document's notation."""

    def __init__(self, doc: Doc, c: Case, rng: np.random.Generator):
        self.doc, self.c, self.nt, self.rng = doc, c, doc.nt, rng

    def tok(self, text: str, *roles: str) -> tuple:
        return (text, [(self.c.id, r) for r in roles])

    def v(self, key: str, lead: bool = True) -> str:
        c, x = self.c, self.c.pr[key]
        txt = fmt(x, self.nt, lead, SCI_FORMS.get(c.style, "caret"))
        if c.style in INLINE_R_STYLES and x.raw is None and x.form == "plain" and x.op == "=" and key in ("t", "m1", "m2", "s1", "s2", "d", "p"):
            lit = str(dround(x.value, x.dec))
            if key == "p":
                if c.style == "rmd-inline-literal" and not lit.endswith("0"):
                    return f"`r {lit}`"
                return f"`r fmt_p({lit})`" if x.dec == 3 else f"`r fmt_p({lit}, {x.dec})`"
            if c.style == "rmd-inline-literal" and not lit.endswith("0") and self.rng.random() < 0.5:
                return f"`r {lit}`"
            return f"`r apa_num({lit})`" if x.dec == 2 else f"`r apa_num({lit}, {x.dec})`"
        return txt

    def n(self, key: str) -> str:
        return str(int(self.c.pr[key].value))

    # -- the test --------------------------------------------------------------------------
    def p_tokens(self, form: str = "apa") -> list:
        c, nt = self.c, self.nt
        eq = nt.eq
        if c.f.get("adj_only"):
            fm = c.f["adj_only"]
            pv = self.v("padj", nt.lead_p)
            m = c.f.get("adj_m")
            if fm == "bonferroni-only":
                tail = f" (Bonferroni-corrected, {m} tests)" if m else " (Bonferroni-corrected)"
                return [self.tok(f"{nt.p}{eq}{pv}{tail}" if c.pr["padj"].op == "=" else f"{nt.p} < {pv}{tail}", "p", "padj")]
            lab = "p_adj" if fm == "p_adj" else "p_Holm"
            tail = f" (Holm, {m} tests)" if (m and fm == "p_Holm") else (f" ({m} tests)" if m else "")
            op = eq if c.pr["padj"].op == "=" else " < "
            return [self.tok(f"{lab}{op}{pv}{tail}", "p", "padj")]
        p = c.pr["p"]
        if form == "console":
            if p.form == "sci":
                mant = str(dround(p.value / 10.0**p.exp, p.dec))
                txt = f"{mant}e-{abs(p.exp):02d}"
            else:
                txt = str(dround(p.value, p.dec))
            return [self.tok(f"p-value {'<' if p.op == '<' else '='} {txt}", "p")]
        op = {"=": eq, "<": " < ", ">": " > "}[p.op]
        if p.op == "<" and nt.eq == "=":
            op = "<"
        toks = [self.tok(f"{nt.p}{op}{self.v('p', nt.lead_p)}", "p")]
        if "padj" in c.pr:
            m = c.f["adj_m"]
            pa = self.v("padj", nt.lead_p)
            fm = c.f.get("adj_form", "for-m")
            if fm == "for-m":
                toks += [(" ", []), self.tok(f"(Bonferroni-corrected for {m} comparisons: {nt.p}{eq}{pa})", "padj")]
            elif fm == "m-after":
                toks += [(nt.join if nt.join != ", " else "; ", []), self.tok(f"Bonferroni-adjusted {nt.p}{eq}{pa} (m = {m})", "padj")]
            else:
                toks += [(", ", []), self.tok(f"p_Bonferroni{eq}{pa} across {NUMBER_WORDS.get(m, str(m))} comparisons", "padj")]
        return toks

    def t_tokens(self, form: str = "apa") -> list:
        c, nt = self.c, self.nt
        eq = nt.eq
        t, df = self.v("t"), self.v("df")
        if form == "console":
            return [self.tok(f"t = {str(dround(c.pr['t'].value, c.pr['t'].dec))}", "t"), (", ", []),
                    self.tok(f"df = {str(dround(c.pr['df'].value, c.pr['df'].dec))}", "df"), (", ", [])] + self.p_tokens("console")
        if form == "med":
            lab = "paired t" if (c.kind == "paired" and self.rng.random() < 0.3) else "t"
            return [self.tok(f"{lab}{eq}{t}", "t"), (nt.join, []), self.tok(f"df{eq}{df}", "df"), (nt.join, [])] + self.p_tokens()
        if form in ("sub", "glued"):
            lab = f"t_{df}" if form == "sub" else f"t{df}"
            if nt.p.startswith("*"):
                lab = f"*t*_{df}" if form == "sub" else f"*t*{df}"
            return [self.tok(f"{lab}{eq}{t}", "t", "df"), (", ", [])] + self.p_tokens()
        prefix = ""
        if c.style == "apa-welch-named":
            prefix = "Welch's "
        return [self.tok(f"{prefix}{nt.t}({df}){eq}{t}", "t", "df"), (nt.join, [])] + self.p_tokens()

    # -- descriptives ------------------------------------------------------------------------
    def spread_label(self) -> str:
        if self.c.f.get("spread") == "se":
            return "SE" if self.nt.SD == "SD" else ("*SE*" if self.nt.SD.startswith("*") else "SE")
        return self.nt.SD

    def desc_apa(self, g: int, with_n: bool = True, opener: str = "") -> list:
        c, nt = self.c, self.nt
        m, s, nk = f"m{g}", f"s{g}", f"n{g}"
        if m not in c.pr:
            return []
        eq = nt.eq
        toks = [self.tok(f"{opener}{nt.M}{eq}{self.v(m)}", m), (nt.join, []), self.tok(f"{self.spread_label()}{eq}{self.v(s)}", s)]
        nkey = nk if nk in c.pr else ("n1" if c.kind in ("paired", "one") and (g == 1 or c.f.get("n_both")) else None)
        if (with_n or c.f.get("n_both")) and nkey and nkey in c.pr and (c.kind in IND or g == 1 or c.f.get("n_both")):
            toks += [(nt.join, []), self.tok(f"{nt.n}{eq}{self.n(nkey)}", nkey)]
        return toks

    def desc_med(self, g: int) -> list:
        m, s = f"m{g}", f"s{g}"
        return [self.tok(self.v(m), m), (" (", []), self.tok(self.v(s), s), (")", [])]

    def desc_pm(self, g: int) -> list:
        m, s = f"m{g}", f"s{g}"
        return [self.tok(self.v(m), m), (" \u00b1 ", []), self.tok(self.v(s), s)]

    # -- what follows the test -----------------------------------------------------------------
    def d_label(self) -> str:
        c, nt = self.c, self.nt
        dd = c.f.get("d_def")
        it = nt.d.startswith("*")
        if dd == "g":
            return "Hedges' *g*" if it and c.style == "apa-hedges-g" else ("*g*" if it else ("Hedges' g" if self.rng.random() < 0.5 else "g"))
        if dd == "dz":
            return "*d*_z" if it else ("d_z" if self.rng.random() < 0.7 else "d")
        if dd == "dav":
            return "*d*_av" if it else "d_av"
        return nt.d if self.rng.random() < 0.8 else ("Cohen's " + nt.d)

    def ci_tokens(self, key_lo: str, key_hi: str, role: str) -> list:
        c, nt = self.c, self.nt
        neg = c.pr[key_lo].value < 0 or c.pr[key_hi].value < 0
        body = ci_text(self.v(key_lo), self.v(key_hi), nt, neg)
        return [self.tok(f"{nt.ci_label} {body}", role)]

    def extras(self, ci_first: bool = True) -> list:
        c, nt = self.c, self.nt
        out = []
        eq = nt.eq
        if "ci_lo" in c.pr and ci_first:
            out.append((nt.join, []))
            if "diff" in c.pr:
                out += [self.tok(f"mean difference{eq}{self.v('diff')}", "diff"), (nt.join, [])]
            out += self.ci_tokens("ci_lo", "ci_hi", "ci")
        if "d" in c.pr:
            out += [(nt.join, []), self.tok(f"{self.d_label()}{eq}{self.v('d')}", "d")]
            if "d_lo" in c.pr:
                out += [(nt.join, [])] + self.ci_tokens("d_lo", "d_hi", "dci")
        if "ci_lo" in c.pr and not ci_first:
            out.append((nt.join, []))
            if "diff" in c.pr:
                out += [self.tok(f"mean difference{eq}{self.v('diff')}", "diff"), (nt.join, [])]
            out += self.ci_tokens("ci_lo", "ci_hi", "ci")
        return out

    def design_tokens(self) -> list:
        c, doc = self.c, self.doc
        words = c.f.get("design_phrase")
        if not words:
            return []
        return [(", ", []), self.tok(words, "design")] if c.f.get("design_pos") == "mid" else [(" (", []), self.tok(words, "design"), (")", [])]


def n_paren(w: "W", c: Case) -> list:
    nt = w.nt
    if "n1" not in c.pr:
        return []
    if "n2" in c.pr:
        return [(" (", []), w.tok(f"{nt.n}{nt.eq}{w.n('n1')}", "n1"), (" and ", []), w.tok(w.n("n2"), "n2"), (")", [])]
    return [(" (", []), w.tok(f"{nt.n}{nt.eq}{w.n('n1')}", "n1"), (")", [])]


def measure_label(c: Case) -> str:
    return c.measure["name"]


def group_names(doc: Doc, c: Case) -> tuple[str, str]:
    a, b = doc.topic["groups"]
    if c.kind == "one":
        g = a if c.f.get("order", 0) == 0 else b
        return (f"the {g} condition" if doc.study == "within" else f"the {g} group", "")
    if c.kind in IND:
        return (f"the {a} group", f"the {b} group") if c.f.get("order", 0) == 0 else (f"the {b} group", f"the {a} group")
    if doc.study == "within":
        return (f"the {a} condition", f"the {b} condition") if c.f.get("order", 0) == 0 else (f"the {b} condition", f"the {a} condition")
    return doc.topic["times"][1], doc.topic["times"][0]


def higher(c: Case) -> bool:
    return c.true["t"] >= 0 if c.error != "paired-analysed-as-independent" else c.true["student_t"] >= 0


def render_prose(doc: Doc, c: Case, rng: np.random.Generator) -> list:
    """One result in running prose, for every style that is not a table or a multi-test sentence."""
    w = W(doc, c, rng)
    st = c.style
    nt = doc.nt
    meas, ctx = measure_label(c), c.f.get("ctx", "")
    A, B = group_names(doc, c)
    up = higher(c)
    who = doc.topic["who"]
    form = "apa"
    if st.startswith("med") or st in ("middot-lancet", "middot-meansd", "pdf-med-prose"):
        form = "med"
    elif st in ("nature-t-sub", "nature-unpaired-paren") or (st.startswith("nature") and c.f.get("t_form") == "sub"):
        form = "sub"
    elif st.startswith("nature"):
        form = "glued"
    elif st == "r-console-prose":
        form = "console"
    test = w.t_tokens(form)
    if st == "apa-one-tailed-declared":
        test = test + [(", ", []), w.tok("one-tailed" if rng.random() < 0.5 else "one-tailed, as preregistered", "tails")]
    cap = lambda x: x[0].upper() + x[1:]
    toks: list = []
    if st == "r-console-prose":
        name = {"ind": "Student two-sample t test", "welch": "Welch two-sample t-test", "paired": "paired t-test", "one": "one-sample t-test"}[c.kind]
        lead = f"For {meas} {ctx}, the {name} ({A} against {B}) gave " if c.kind in IND else f"For {meas} {ctx}, the {name} gave "
        if c.kind == "paired" and doc.study == "between":
            lead = f"For {meas} {ctx} (the same {who} measured twice), the {name} gave "
            c.f["design_phrase"] = None
        return [(lead, [])] + test + [(".", [])]
    if form == "med":
        return render_med(doc, c, w, rng, test, meas, ctx, A, B, up)
    if form in ("sub", "glued"):
        return render_nature(doc, c, w, rng, test, meas, ctx, A, B, up)
    ex = w.extras(ci_first=(st != "apa-ci-after-d"))
    if st == "apa-paren-claim":
        inner = []
        if "n1" in c.pr:
            if c.kind in IND:
                inner = [w.tok(f"{nt.n}s = {w.n('n1')}", "n1"), (" and ", []), w.tok(w.n("n2"), "n2"), ("; ", [])]
            else:
                inner = [w.tok(f"{nt.n} = {w.n('n1')}", "n1"), ("; ", [])]
        if c.kind in IND:
            claim = f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} in {A} than in {B}"
        elif c.kind == "paired":
            claim = f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} {A} than {B}" if doc.study == "between" else f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} in {A} than in {B}"
        else:
            claim = f"{cap(meas)} {ctx} {'exceeded' if up else 'fell short of'} the reference value of {fmt(c.pr['mu0'], nt)}"
        return [(claim, [])] + w.design_tokens() + [(" (", [])] + inner + test + ex + [(").", [])]
    if st == "apa-desc-prev-sentence":
        if c.kind == "one":
            first = [(f"{cap(meas)} {ctx} in {A}: ", [])] + w.desc_apa(1) + [(". ", [])]
            second = [(f"Against the reference value of {fmt(c.pr['mu0'], nt)}, this difference gave ", [])] + test + ex + [(".", [])]
        else:
            first = [(f"{cap(meas)} {ctx}, {A}: ", [])] + w.desc_apa(1) + [("; ", []), (f"{B}: ", [])] + w.desc_apa(2) + [(". ", [])]
            second = [("The groups differed" if c.true["p"] < 0.05 else "The difference was small", [])] + [(", ", [])] + test + ex + [(".", [])]
        return first + second
    if st == "apa-paired-named" or (c.kind == "paired" and "desc" not in c.f.get("pieces", []) and "m1" not in c.pr):
        n_t = [(" (", []), w.tok(f"{nt.n}{nt.eq}{w.n('n1')}", "n1"), (")", [])] if "n1" in c.pr else []
        if c.kind == "paired":
            lab = "A paired-samples t test" if (rng.random() < 0.6 or c.error == "paired-analysed-as-independent") else "A repeated-measures t test"
            return [w.tok(lab, "design")] + n_t + [(f" showed that {meas} {ctx} {'rose' if up else 'fell'} from {B} to {A}", [])] + w.design_tokens() + [(", ", [])] + test + ex + [(".", [])]
        if c.kind == "one":
            return [(f"A one-sample t test against {fmt(c.pr['mu0'], nt)}", [])] + n_t + [(f" showed {meas} {ctx} {'above' if up else 'below'} the reference, ", [])] + test + ex + [(".", [])]
        return [(f"An independent-samples t test", [])] + n_t + [(f" showed {meas} {ctx} {'higher' if up else 'lower'} in {A} than in {B}", [])] + w.design_tokens() + [(", ", [])] + test + ex + [(".", [])]
    if st == "apa-n-total-only" and "N" in c.pr:
        return [(f"Across all ", []), w.tok(f"N = {w.n('N')}", "N"), (f" {who}, {meas} {ctx} was {'higher' if up else 'lower'} in {A} (", [])] + w.desc_apa(1, False) + [(f") than in {B} (", [])] + w.desc_apa(2, False) + [("), ", [])] + test + ex + [(".", [])]
    # the common inline form
    if c.kind in IND:
        verb = "scored higher on" if up else "scored lower on"
        if rng.random() < 0.3:
            verb = "differed from the other group in" if True else verb
            body = [(f"{cap(A)} (", [])] + w.desc_apa(1) + [(f") and {B} (", [])] + w.desc_apa(2) + [(f") differed in {meas} {ctx}", [])]
        else:
            body = [(f"{cap(A)} (", [])] + w.desc_apa(1) + [(f") {verb} {meas} {ctx} than {B} (", [])] + w.desc_apa(2) + [(")", [])]
        if "m1" not in c.pr:
            body = [(f"{cap(A)} {verb} {meas} {ctx} than {B}", [])] + n_paren(w, c)
        toks = body + w.design_tokens() + [(", ", [])] + test + ex
    elif c.kind == "paired":
        if doc.study == "within":
            body = [(f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} in {A} (", [])] + w.desc_apa(1) + [(f") than in {B} (", [])] + w.desc_apa(2, False) + [(")", [])]
        else:
            grp = doc.topic["groups"][c.f.get("order", 0)]
            body = [(f"In the {grp} group, {meas} {'rose' if up else 'fell'} from {B} (", [])] + w.desc_apa(2, False) + [(f") to {A} (", [])] + w.desc_apa(1) + [(")", [])]
        if "m1" not in c.pr:
            body = [(f"{cap(meas)} {ctx} {'rose' if up else 'fell'} from {B} to {A}" if doc.study == "between" else f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} in {A} than in {B}", [])] + n_paren(w, c)
        toks = body + w.design_tokens() + [(", ", [])] + test + ex
    else:
        ref = c.f.get("ref_phrase", "the reference value of")
        body = [(f"{cap(meas)} {ctx} in {A} (", [])] + w.desc_apa(1) + [(f") was {'above' if up else 'below'} {ref} ", []), (fmt(c.pr["mu0"], nt), [(c.id, "mu0")]), (", ", [])]
        if "m1" not in c.pr:
            body = [(f"{cap(meas)} {ctx} in {A}", [])] + n_paren(w, c) + [(f" was {'above' if up else 'below'} {ref} ", []), (fmt(c.pr["mu0"], nt), [(c.id, "mu0")]), (", ", [])]
        toks = body + test + ex
    if st == "apa-pless-trailing":
        toks.append((f", but not in the other group, ", []))
        toks.append(("@PLESS@", []))
    toks.append((".", []))
    return toks


def render_med(doc, c, w, rng, test, meas, ctx, A, B, up) -> list:
    nt = doc.nt
    st = c.style
    cap = lambda x: x[0].upper() + x[1:]
    toks: list = []
    diffci = []
    if "ci_lo" in c.pr:
        body = ci_text(w.v("ci_lo"), w.v("ci_hi"), nt, c.pr["ci_lo"].value < 0 or c.pr["ci_hi"].value < 0)
        if st == "med-ci-colon-dash" and nt.sep == ".":
            neg = c.pr["ci_lo"].value < 0 or c.pr["ci_hi"].value < 0
            body = f"{w.v('ci_lo')}{' to ' if neg else chr(0x2013)}{w.v('ci_hi')}"
            ci_tok = w.tok(f"({nt.ci_label}: {body})", "ci")
        else:
            ci_tok = w.tok(f"({nt.ci_label} {body})", "ci")
        lab = "mean change" if c.kind == "paired" and doc.study == "between" else "mean difference"
        if "diff" in c.pr:
            diffci = [w.tok(f"{lab} {w.v('diff')}", "diff"), (" ", []), ci_tok]
        else:
            diffci = [ci_tok]
    sep = "; " if nt.sep == "\u00b7" else nt.join
    if st == "middot-lancet" or st == "med-diff-ci-to" or st == "med-ci-colon-dash" or st == "med-adjusted" or ("m1" not in c.pr):
        if c.kind in IND:
            claim = f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} with {A[4:]} than with {B[4:]}"
        elif c.kind == "paired":
            claim = f"{cap(meas)} {ctx} {'rose' if up else 'fell'} from {B} to {A}" if doc.study == "between" else f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} in {A} than in {B}"
        else:
            claim = f"{cap(meas)} {ctx} was {'above' if up else 'below'} the target of {fmt(c.pr['mu0'], nt)}"
        ns = []
        if "n1" in c.pr:
            ns = [(" in ", []), w.tok(w.n("n1"), "n1"), (" and ", []), w.tok(w.n("n2"), "n2"), (f" {doc.topic['who']}", [])] if "n2" in c.pr else [(" (", []), w.tok(f"n = {w.n('n1')}", "n1"), (")", [])]
        inner = diffci + ([(sep, [])] if diffci else []) + test
        return [(claim, [])] + ns + w.design_tokens() + [(" (", [])] + inner + [(").", [])]
    if st in ("med-sd-paren",):
        def grp(g, name):
            nk = f"n{g}" if f"n{g}" in c.pr else ("n1" if g == 1 and "n1" in c.pr else None)
            ntok = [("; ", []), w.tok(f"n = {w.n(nk)}", nk)] if nk and (c.kind in IND or g == 1) else []
            return [w.tok(w.v(f"m{g}"), f"m{g}"), (" (SD ", []), w.tok(w.v(f"s{g}"), f"s{g}")] + ntok + [(f") {name}", [])]
        if c.kind == "one":
            toks = [(f"{cap(meas)} {ctx} averaged ", [])] + grp(1, f"in {A}") + [(f" against a target of {fmt(c.pr['mu0'], nt)}", [])]
        else:
            toks = [(f"{cap(meas)} {ctx} averaged ", [])] + grp(1, A if c.kind == "paired" and doc.study == "between" else f"in {A}") + [(" and ", [])] + grp(2, B if c.kind == "paired" and doc.study == "between" else f"in {B}")
        return toks + w.design_tokens() + [(" (", [])] + (diffci + [(sep, [])] if diffci else []) + test + [(").", [])]
    # mean (SD) x (y) vs ... ; mean difference ...; t, df, P
    if c.kind == "one":
        toks = [(f"{cap(meas)} {ctx}: mean (SD) ", [])] + w.desc_med(1)
        if "n1" in c.pr:
            toks += [(" (", []), w.tok(f"n = {w.n('n1')}", "n1"), (")", [])]
        toks += [(f" against a target of {fmt(c.pr['mu0'], nt)}", [])]
    elif c.kind == "paired" and doc.study == "between":
        toks = [(f"{cap(meas)} {ctx}: mean (SD) ", [])] + w.desc_med(2) + [(f" {B} vs ", [])] + w.desc_med(1) + [(f" {A}", [])]
        if "n1" in c.pr:
            toks += [(" (", []), w.tok(f"n = {w.n('n1')}", "n1"), (")", [])]
    else:
        toks = [(f"{cap(meas)} {ctx}: mean (SD) ", [])] + w.desc_med(1) + [(f" in {A}", [])]
        if "n1" in c.pr and c.kind in IND:
            toks += [(" (", []), w.tok(f"n = {w.n('n1')}", "n1"), (")", [])]
        toks += [(" vs ", [])] + w.desc_med(2) + [(f" in {B}", [])]
        if "n2" in c.pr:
            toks += [(" (", []), w.tok(f"n = {w.n('n2')}", "n2"), (")", [])]
        elif "n1" in c.pr:
            toks += [(" (", []), w.tok(f"n = {w.n('n1')}", "n1"), (")", [])]
    toks += w.design_tokens()
    if diffci:
        toks += [("; ", [])] + diffci
    return toks + [("; ", [])] + test + [(".", [])]


def render_nature(doc, c, w, rng, test, meas, ctx, A, B, up) -> list:
    nt = doc.nt
    st = c.style
    cap = lambda x: x[0].upper() + x[1:]
    animals = doc.topic["who"]
    pm_note = []
    if c.f.get("pm_label") == "sd":
        pm_note = [(" (mean \u00b1 s.d.)", [])]
    elif st == "nature-pm-labelled" and c.f.get("spread") == "se":
        pm_note = [(" (mean \u00b1 s.e.m.)", [])]
    elif st == "nature-pm-labelled":
        pm_note = [(" (mean \u00b1 s.d.)", [])]
    def ntok(key):
        return w.tok(f"n = {w.n(key)} {animals}", key)
    extra = []
    if "ci_lo" in c.pr:
        body = ci_text(w.v("ci_lo"), w.v("ci_hi"), nt, c.pr["ci_lo"].value < 0 or c.pr["ci_hi"].value < 0)
        extra = [("; ", [])] + ([w.tok(f"difference {w.v('diff')}", "diff"), (", ", [])] if "diff" in c.pr else []) + [w.tok(f"{nt.ci_label} {body}", "ci")]
    if "d" in c.pr:
        extra += [(", ", []), w.tok(f"Cohen's d = {w.v('d')}" if c.f.get("d_def") != "g" else f"Hedges' g = {w.v('d')}", "d")]
    if st == "nature-unpaired-paren":
        ns = []
        if "n1" in c.pr:
            if c.pr["n1"].value == c.pr["n2"].value:
                ns = [("; ", []), w.tok(f"n = {w.n('n1')} {animals} per group", "n1", "n2")]
            else:
                ns = [("; ", []), w.tok(f"n = {w.n('n1')}", "n1"), (" and ", []), w.tok(f"{w.n('n2')} {animals}", "n2")]
        return [(f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} in {A} than in {B} (two-tailed unpaired t-test, ", [])] + test + ns + extra + [(").", [])]
    if c.kind in IND:
        g1 = [(f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} in {A} (", [])]
        if "m1" in c.pr:
            g1 += w.desc_pm(1) + ([(", ", []), ntok("n1")] if "n1" in c.pr else []) + [(f") than in {B} (", [])] + w.desc_pm(2) + ([(", ", []), ntok("n2")] if "n2" in c.pr else [])
        else:
            g1 += ([ntok("n1"), (f") than in {B} (", []), ntok("n2")] if "n1" in c.pr else [(f"vs {B}", [])])
        return g1 + [(")", [])] + pm_note + w.design_tokens() + [("; ", [])] + test + extra + [(".", [])]
    if c.kind == "paired":
        if doc.study == "between":
            grp = doc.topic["groups"][c.f.get("order", 0)]
            body = [(f"In {grp} {animals}, {meas} {'rose' if up else 'fell'} from ", [])]
        else:
            body = [(f"{cap(meas)} {ctx} was {'higher' if up else 'lower'} in {A} than in {B}: ", [])]
        if "m1" in c.pr:
            body += w.desc_pm(2) + [(f" ({B}) to " if doc.study == "between" else " vs ", [])] + w.desc_pm(1) + [(f" ({A})" if doc.study == "between" else "", [])]
        else:
            body += [(f"{B} to {A}" if doc.study == "between" else "", [])]
        if "n1" in c.pr:
            body += [(" (", []), ntok("n1"), (")", [])]
        return body + pm_note + w.design_tokens() + [("; ", [])] + test + extra + [(".", [])]
    body = [(f"{cap(meas)} {ctx} in {A} ", [])]
    if "m1" in c.pr:
        body += [("(", [])] + w.desc_pm(1) + ([(", ", []), ntok("n1")] if "n1" in c.pr else []) + [(") ", [])]
    elif "n1" in c.pr:
        body += [("(", []), ntok("n1"), (") ", [])]
    return body + pm_note + [(f"{' ' if pm_note else ''}differed from the reference value of {fmt(c.pr['mu0'], nt)}; ", [])] + test + extra + [(".", [])]


# ---------------------------------------------------------------------------------------------
# Tables and sentences with several tests
# ---------------------------------------------------------------------------------------------


def cell_p(w: W) -> list:
    c, nt = w.c, w.nt
    p = c.pr["p"]
    star = ""
    if c.style in ("apa-table-stars-p-md",):
        star = stars(c)
    txt = fmt(p, nt, nt.lead_p)
    if p.op == "<":
        txt = "< " + txt
    return [w.tok(txt + star, "p")]


def stars(c: Case) -> str:
    p2 = c.true["p"]
    return "***" if p2 < 0.001 else "**" if p2 < 0.01 else "*" if p2 < 0.05 else ""


def render_table(doc: Doc, cases: list, rng: np.random.Generator, number: int) -> list:
    """Blocks for one table of results: caption, rows, legend (and prose or a test row)."""
    st = cases[0].style
    nt = doc.nt
    text = st.endswith("-text")
    long = "long" in st
    a_lab, b_lab = doc.topic["groups"]
    ws = [W(doc, c, rng) for c in cases]
    ctx = cases[0].f.get("ctx", "")
    blocks: list = []
    cap = f"Table {number}. Outcomes by group ({doc.topic['period']})." if text else f"**Table {number}.** Outcomes by group ({doc.topic['period']})."
    blocks.append(("para", [(cap, [])]))
    rows: list = []
    all_ids = [c.id for c in cases]
    med = st.startswith("med") or st.startswith("middot")
    if not long:
        nA, nB = int(cases[0].pr["n1"].value), int(cases[0].pr["n2"].value)
        hdr_a = [(f"{a_lab.capitalize()} ", []), (f"(n = {nA})", [(i, "n1") for i in all_ids]), (", mean (SD)" if med else ", M (SD)", [])]
        hdr_b = [(f"{b_lab.capitalize()} ", []), (f"(n = {nB})", [(i, "n2") for i in all_ids]), (", mean (SD)" if med else ", M (SD)", [])]
        header = [[("Measure", [])], hdr_a, hdr_b]
        dfh = st == "apa-table-dfheader-md" or st == "apa-table-stars-t-md" or st == "pdf-table-stars-text"
        if dfh:
            header.append([(f"t({int(cases[0].pr['df'].value)})", [(i, "df") for i in all_ids])])
        else:
            header.append([("t", [])])
            header.append([("df", [])])
        if not st.endswith("stars-t-md") and st != "pdf-table-stars-text":
            header.append([("P" if med else "p", [])])
        has_diff = any("ci_lo" in c.pr for c in cases) and med
        has_d = any("d" in c.pr for c in cases) and not med
        if has_diff:
            header.insert(3, [("Difference (95% CI)", [])])
        if has_d:
            header.append([("d", [])])
        rows.append(header)
        for w_, c in zip(ws, cases):
            row = [[(f"{c.measure['name'].capitalize()}", [])]]
            for g in (1, 2):
                if f"m{g}" in c.pr:
                    row.append([w_.tok(f"{w_.v(f'm{g}')} ({w_.v(f's{g}')})", f"m{g}", f"s{g}")])
                else:
                    row.append([("", [])])
            if has_diff:
                if "ci_lo" in c.pr:
                    body = ci_text(w_.v("ci_lo"), w_.v("ci_hi"), nt, c.pr["ci_lo"].value < 0 or c.pr["ci_hi"].value < 0)
                    dtxt = w_.v("diff") if "diff" in c.pr else ""
                    row.append([w_.tok(f"{dtxt} ({body})".strip(), "diff", "ci")])
                else:
                    row.append([("", [])])
            tstar = stars(c) if (st.endswith("stars-t-md") or st == "pdf-table-stars-text") else ""
            row.append([w_.tok(w_.v("t") + tstar, "t", "p")] if tstar or "stars-t" in st else [w_.tok(w_.v("t"), "t")])
            if not dfh:
                row.append([w_.tok(w_.v("df"), "df")])
            if not st.endswith("stars-t-md") and st != "pdf-table-stars-text":
                row.append(cell_p(w_))
            if has_d:
                row.append([w_.tok(w_.v("d"), "d")] if "d" in c.pr else [("", [])])
            rows.append(row)
        blocks.append(("table", rows))
        legend = "Note. " if text else "*Note.* "
        legend += "Values are mean (SD). " if med else "Values are M (SD). "
        if any(stars(c) for c in cases) and ("stars" in st):
            legend += "*p < .05, **p < .01, ***p < .001." if not text else "* p < .05, ** p < .01, *** p < .001."
            if not text:
                legend = legend.replace("*p < .05, **p < .01, ***p < .001.", "\\*p < .05, \\*\\*p < .01, \\*\\*\\*p < .001.")
        blocks.append(("para", [(legend.strip(), [])]))
        return blocks
    # long layout: a row per group
    rows.append([[("Measure", [])], [("Group", [])], [("n", [])], [("M", [])], [("SD", [])]])
    prose: list = []
    for w_, c in zip(ws, cases):
        for g, lab in ((1, a_lab), (2, b_lab)):
            row = [[(c.measure["name"].capitalize() if g == 1 else "", [])], [(lab.capitalize(), [])],
                   [w_.tok(w_.n(f"n{g}"), f"n{g}")] if f"n{g}" in c.pr else [("", [])],
                   [w_.tok(w_.v(f"m{g}"), f"m{g}")], [w_.tok(w_.v(f"s{g}"), f"s{g}")]]
            rows.append(row)
        if "testrow" in st:
            rows.append([[("", [])], w_.t_tokens("apa"), [("", [])], [("", [])], [("", [])]])
        else:
            up = higher(c)
            prose.append([(f"{c.measure['name'].capitalize()} was {'higher' if up else 'lower'} in the {a_lab} group, ", [])] + w_.t_tokens("apa") + [(".", [])])
    blocks.append(("table", rows))
    if prose:
        para: list = [(f"Table {number} gives the group means. ", [])]
        for sent in prose:
            para += sent + [(" ", [])]
        para[-1] = ("", [])
        blocks.append(("para", para))
    return blocks


def render_multi(doc: Doc, cases: list, rng: np.random.Generator) -> list:
    """Several tests in one sentence, each followed by its own d (and that d's CI)."""
    a_lab, b_lab = doc.topic["groups"]
    kind = cases[0].kind
    if kind in IND:
        toks: list = [(f"Compared with the {b_lab} group, the {a_lab} group differed in ", [])]
    elif kind == "paired":
        toks = [("Within the same " + doc.topic["who"] + ", ", [(cases[0].id, "design")]), ("", [])] if doc.study == "between" else [("Across the two conditions, ", [])]
        toks += [("scores changed in ", [])]
    else:
        toks = [("Against their reference values, scores differed in ", [])]
    for i, c in enumerate(cases):
        w = W(doc, c, rng)
        if i > 0:
            toks.append((", and in " if i == len(cases) - 1 else ", in ", []))
        toks.append((f"{c.measure['name']} {c.f.get('ctx', '')}, ", []))
        toks += w.t_tokens("apa")
        toks += w.extras(ci_first=False)
    toks.append((".", []))
    return [("para", toks)]


# ---------------------------------------------------------------------------------------------
# Cases that are not t-tests: percentages, power statements, group sizes, the total N
# ---------------------------------------------------------------------------------------------

ACTIONS = {
    "people": ["said they would keep the new arrangement", "would recommend it to a colleague", "reported no problems with it",
               "asked to continue after the study", "used it on most days", "rated it as easy to follow"],
    "mice": ["built a complete nest by day three", "gained weight in the first week", "used the new cage item daily",
             "reached the platform within the trial time"],
    "plots": ["needed no extra watering", "showed no slug damage", "were weeded only once", "produced a second flush"],
}


def fmt_pct(v: float, dec: int, nt: Notation) -> str:
    s = plain(v, dec, nt, True)
    return f"{s} %" if nt.name == "comma" else f"{s}%"


def percent_case(rng: np.random.Generator, doc: Doc, cid: str, error: str | None) -> Case:
    c = Case(cid, "percent", error, "percent-" + ["of-the", "n-equals", "count-first"][int(rng.integers(3))])
    for _ in range(200):
        top = max(6, (doc.nA if doc.study == "between" else doc.N) + 1)
        n = int(rng.integers(min(max(5, doc.N // 3), top - 1), top))
        k = int(rng.binomial(n, rng.uniform(0.2, 0.85)))
        if k == 0 or k == n:
            continue
        dec = 0 if rng.random() < 0.7 else 1
        pct = 100 * k / n
        pr = num(pct, dec)
        if error:
            shifts = [s for s in range(-15, 16) if abs(s) >= 3]
            rng.shuffle(shifts)
            found = False
            for s_ in shifts:
                cand = Num(float(dround(float(dround(pct, dec)) + s_, dec)), dec)
                if not (0 < cand.value < 100):
                    continue
                if not hit(cand.iv(1.0), (pct, pct)):
                    pr = cand
                    found = True
                    break
            if not found:
                continue
        else:
            assert hit(pr.iv(0.5), (pct, pct))
        c.true = dict(n=n, k=k, pct=pct)
        c.pr = dict(n=Num(n, 0), count=Num(k, 0), pct=pr)
        return c
    raise RuntimeError("percent")


def render_percent(doc: Doc, c: Case, rng: np.random.Generator) -> list:
    nt = doc.nt
    who = doc.topic["who"]
    a = doc.topic["groups"][int(rng.integers(2))]
    act = ACTIONS[doc.topic["domain"]][int(rng.integers(len(ACTIONS[doc.topic["domain"]])))]
    n, k = int(c.pr["n"].value), int(c.pr["count"].value)
    pct = fmt_pct(c.pr["pct"].value, c.pr["pct"].dec, nt)
    cnt = (f"{k} ({pct})", [(c.id, "count"), (c.id, "percent")])
    if c.style == "percent-of-the":
        return [("Of the ", []), (f"{n} {who}", [(c.id, "n")]), (f" in the {a} group, ", []), cnt, (f" {act}.", [])]
    if c.style == "percent-n-equals":
        return [(f"In the {a} group (", []), (f"n = {n}", [(c.id, "n")]), ("), ", []), cnt, (f" {act}.", [])]
    return [cnt, (f" of the ", []), (f"{n} {who}", [(c.id, "n")]), (f" in the {a} group {act}.", [])]


def power_ok_any(n_pr: int, scope: str, d: Num, pw: Num, alpha: float, design: str) -> bool:
    """Some reading (per group or total, one or two sides, d and power within rounding) fits."""
    readings = [n_pr, n_pr / 2]
    dlo, dhi = d.iv(1.0)
    plo, phi = pw.iv(1.0)
    for nn in readings:
        for sides in (1, 2):
            need_lo = n_for_power(dhi, alpha, sides, plo / 100, design)
            need_hi = n_for_power(dlo, alpha, sides, phi / 100, design)
            if need_lo - 2 <= nn <= need_hi + 2:
                return True
            if float(nn).is_integer():
                got = (power_two(int(nn), dlo, alpha, sides, design) * 100, power_two(int(nn), dhi, alpha, sides, design) * 100)
                if hit(got, (plo, phi)):
                    return True
    return False


def power_case(rng: np.random.Generator, doc: Doc, cid: str, error: str | None) -> Case:
    design = "paired" if doc.study == "within" else "two"
    scope = ["per-group", "each-group", "total"][int(rng.integers(3))] if design == "two" else "paired"
    c = Case(cid, "power", error, f"power-{scope}")
    big = doc.topic["domain"] == "mice"
    for _ in range(100):
        d = float(rng.choice([1.2, 1.5, 1.8, 2.0]) if big else rng.choice([0.4, 0.5, 0.6, 0.7, 0.8, 1.0]))
        target = float(rng.choice([80, 90]))
        alpha = 0.05 if rng.random() < 0.85 else 0.01
        need = n_for_power(d, alpha, 2, target / 100, design)
        n = need + (1 if rng.random() < 0.25 else 0)
        dN, pN = num(d, 2 if d * 10 % 1 else 1), Num(target, 0)
        if error:
            facs = [0.5, 0.6, 0.65, 1.6, 1.8, 2.0]
            rng.shuffle(facs)
            ok = False
            for fct in facs:
                cand = max(3, int(round(n * fct)))
                printed = cand * 2 if scope == "total" else cand
                if not power_ok_any(printed, scope, dN, pN, alpha, design):
                    n, ok = cand, True
                    break
            if not ok:
                continue
        printed = n * 2 if scope == "total" else n
        if not error:
            # stated reading: two-sided, per group (or total/2)
            per = printed / 2 if scope == "total" else printed
            dlo, dhi = dN.iv(0.5)
            if not (n_for_power(dhi, alpha, 2, (target - 0.5) / 100, design) - 1 <= per <= n_for_power(dlo, alpha, 2, (target + 0.5) / 100, design) + 1):
                continue
        c.true = dict(d=d, power=target, alpha=alpha, need=need, design=design)
        c.pr = dict(n=Num(printed, 0), d=dN, power=pN, alpha=Num(alpha, 2))
        return c
    raise RuntimeError("power")


def render_power(doc: Doc, c: Case, rng: np.random.Generator) -> list:
    nt = doc.nt
    who = doc.topic["who"]
    n = int(c.pr["n"].value)
    pw = fmt_pct(c.pr["power"].value, 0, nt)
    dtxt = plain(c.pr["d"].value, c.pr["d"].dec, nt, True)
    al = plain(c.true["alpha"], 2, nt, nt.lead_p)
    sided = "two-sided " if doc.tails_stated else ""
    tag = lambda t, r: (t, [(c.id, r), (c.id, "statement")])
    plain_t = lambda t: (t, [(c.id, "statement")])
    if c.style == "power-per-group":
        return [plain_t("We planned "), tag(f"{n} {who} per group", "n"), plain_t(", which gives "), tag(f"{pw} power", "power"),
                plain_t(" to detect "), tag(f"d = {dtxt}", "d"), plain_t(f" at a {sided}alpha of {al}.")]
    if c.style == "power-each-group":
        return [plain_t("A sample of "), tag(f"{n} in each group", "n"), plain_t(" was chosen to give "), tag(f"{pw} power", "power"),
                plain_t(" for an effect of "), tag(f"d = {dtxt}", "d"), plain_t(f" ({sided}\u03b1 = {al}).")]
    if c.style == "power-total":
        return [plain_t("With "), tag(f"a total of {n} {who}", "n"), plain_t(", the study had "), tag(f"{pw} power", "power"),
                plain_t(" to detect "), tag(f"d = {dtxt}", "d"), plain_t(f" between two equal groups ({sided}\u03b1 = {al}).")]
    return [plain_t("For the paired comparison, "), tag(f"{n} {who}", "n"), plain_t(" give "), tag(f"{pw} power", "power"),
            plain_t(" to detect "), tag(f"d_z = {dtxt}", "d"), plain_t(f" in a paired t test ({sided}\u03b1 = {al}).")]


def groups_case(rng: np.random.Generator, doc: Doc, cid: str, error: str | None, where: str) -> Case:
    c = Case(cid, "groups", error, f"groups-{where}-" + ["n-equals", "parenthesis"][int(rng.integers(2))])
    if where == "methods":
        total = doc.N + doc.n_offset
        if doc.study == "between":
            a = doc.nA + doc.n_offset // 2
            b = total - a
        else:
            a = int(rng.integers(total // 3, 2 * total // 3))
            b = total - a
    else:
        total = int(rng.integers(max(8, doc.N // 2), max(9, doc.N)))
        a = int(rng.integers(total // 3, 2 * total // 3 + 1))
        b = total - a
    if error:
        shift = int(rng.choice([-4, -3, -2, 2, 3, 4, 5, 6, 10]))
        if rng.random() < 0.5:
            a += shift
        else:
            b += shift
        if a < 2 or b < 2:
            a, b = c.true.get("a0", total // 2), total - total // 2 + abs(shift)
        assert a + b != total
    c.true = dict(total=total, a=a, b=b)
    c.pr = dict(total=Num(total, 0), n1=Num(a, 0), n2=Num(b, 0))
    return c


GROUP_SPLITS = {"people": ("women", "men"), "mice": ("males", "females"), "plots": ("clay soil", "sandy soil")}


def render_groups(doc: Doc, c: Case, rng: np.random.Generator) -> list:
    who = doc.topic["who"]
    A, B = doc.topic["groups"]
    t, a, b = (int(c.pr[k].value) for k in ("total", "n1", "n2"))
    tot = (f"N = {t}", [(c.id, "total")])
    na, nb = (f"n = {a}", [(c.id, "n1")]), (f"n = {b}", [(c.id, "n2")])
    where = c.style.split("-")[1]
    if where == "methods" and doc.study == "between":
        if c.style.endswith("n-equals"):
            return [("Of the ", []), tot, (f" {who} who took part, ", []), na, (f" were randomly assigned to the {A} group and ", []), nb, (f" to the {B} group.", [])]
        return [(f"The {who} (", []), tot, (f") were randomly assigned to the {A} group (", []), na, (f") or the {B} group (", []), nb, (").", [])]
    if where == "methods":
        sa, sb = GROUP_SPLITS[doc.topic["domain"]]
        return [(f"The sample comprised ", []), tot, (f" {who}: ", []), na, (f" {sa} and ", []), nb, (f" {sb}.", [])]
    if doc.study == "between":
        return [(f"At follow-up, ", []), tot, (f" {who} returned the questionnaire: ", []), na, (f" from the {A} group and ", []), nb, (f" from the {B} group.", [])]
    sa, sb = GROUP_SPLITS[doc.topic["domain"]]
    return [(f"A follow-up check covered ", []), tot, (f" {who} (", []), na, (f" {sa}, ", []), nb, (f" {sb}).", [])]


# ---------------------------------------------------------------------------------------------
# Correct results of other tests, to stand between the t-tests (never flagged, never t-test numbers)
# ---------------------------------------------------------------------------------------------


def stat_eq(nt: Notation) -> str:
    return nt.eq


def p_for_distractor(p: float, nt: Notation) -> str:
    if p < 0.001:
        return f"{nt.p} < {plain(0.001, 3, nt, nt.lead_p)}"
    return f"{nt.p}{nt.eq}{plain(p, 3, nt, nt.lead_p)}"


# -- seeded errors in F, chi-square, r and z results ---------------------------------------------
# Each seeded error is proved impossible under every common reading of the printed numbers: the
# statistic anywhere in its rounding interval (dfs are whole and exact), F and chi-square by their
# upper tail, r and z two-tailed or one-tailed (half), and an r's bracket read as df or as n
# (df = n - 2). Readings and the interval arithmetic are the generator's own (scipy), not plumbline's.
STAT_ERRORS = {
    "F": ["F-p-mismatch", "F-significance-flip"],
    "chi2": ["chi-square-p-mismatch", "chi-square-significance-flip"],
    "r": ["r-p-mismatch", "r-significance-flip", "r-df-vs-n"],
    "z": ["z-p-mismatch", "z-significance-flip"],
    "b": ["coefficient-t-mismatch"],
}
STAT_ERROR_RULES = {
    "F-p-mismatch": ["p-follows-from-f"],
    "chi-square-p-mismatch": ["p-follows-from-chi-square"],
    "r-p-mismatch": ["p-follows-from-r"],
    "z-p-mismatch": ["p-follows-from-z"],
    "F-significance-flip": ["significance-follows-from-statistic"],
    "chi-square-significance-flip": ["significance-follows-from-statistic"],
    "r-significance-flip": ["significance-follows-from-statistic"],
    "z-significance-flip": ["significance-follows-from-statistic"],
    "r-df-vs-n": ["r-df-follows-from-n"],
    "coefficient-t-mismatch": ["t-follows-from-coefficient"],
}


def stat_readings(kind: str, value: float, dfs: tuple) -> list[tuple[float, float]]:
    """p ranges of every common reading over the printed value's rounding box (2 decimals)."""
    lo, hi = value - 0.005, value + 0.005
    if kind == "F":
        d1, d2 = dfs
        return [(float(stats.f.sf(hi, d1, d2)), float(stats.f.sf(max(lo, 0.0), d1, d2)))]
    if kind == "chi2":
        (d,) = dfs
        return [(float(stats.chi2.sf(hi, d)), float(stats.chi2.sf(max(lo, 0.0), d)))]
    if kind == "z":
        a_lo = 0.0 if lo <= 0 <= hi else min(abs(lo), abs(hi))
        a_hi = max(abs(lo), abs(hi))
        two = (float(2 * stats.norm.sf(a_hi)), float(2 * stats.norm.sf(a_lo)))
        return [two, (two[0] / 2, two[1] / 2)]
    # r: the bracket as df, and as n
    out = []
    a_lo = 0.0 if lo <= 0 <= hi else min(abs(lo), abs(hi))
    a_hi = min(0.999999, max(abs(lo), abs(hi)))
    for df in [d for d in (dfs[0], dfs[0] - 2) if d > 0]:
        t_hi = a_hi * math.sqrt(df / (1 - a_hi**2))
        t_lo = a_lo * math.sqrt(df / (1 - a_lo**2))
        two = (float(2 * stats.t.sf(t_hi, df)), float(2 * stats.t.sf(t_lo, df)))
        out += [two, (two[0] / 2, two[1] / 2)]
    return out


def side(iv: tuple[float, float], alpha: float = ALPHA) -> str:
    if iv[1] < alpha:
        return "below"
    if iv[0] >= alpha:
        return "above"
    return "straddles"


def seeded_p(srng: np.random.Generator, kind: str, error: str, value: float, dfs: tuple, true_p: float) -> float | None:
    """A p printed to 3 decimals that no reading gives: on the true side of alpha (mismatch) or across it (flip)."""
    readings = stat_readings(kind, value, dfs)
    sides = {side(r) for r in readings}
    if len(sides) != 1 or "straddles" in sides:
        return None
    (true_side,) = sides
    for _ in range(40):
        if error.endswith("flip"):
            cand = float(srng.uniform(0.06, 0.45)) if true_side == "below" else float(srng.uniform(0.002, 0.04))
        else:
            cand = true_p * float(srng.choice([0.3, 0.5, 1.8, 2.5])) + float(srng.choice([0.0, 0.01, 0.02]))
        cand = round(cand, 3)
        if not (0.001 <= cand < 1):
            continue
        rep = (cand - 0.0005, cand + 0.0005)
        if any(hit(rep, r) for r in readings):
            continue
        if side(rep) == "straddles":
            continue
        if error.endswith("flip") and side(rep) == true_side:
            continue
        if not error.endswith("flip") and side(rep) != true_side:
            continue
        return cand
    return None


def seeded_coefficient_t(srng: np.random.Generator, b: float, se: float) -> float | None:
    """A t printed to 2 decimals that no b and SE within their rounding (2 decimals) give, at either sign."""
    bp, sp = float(dround(b, 2)), float(dround(se, 2))
    if sp - 0.005 <= 0:
        return None
    corners = [(bp + db) / (sp + ds) for db in (-0.005, 0.005) for ds in (-0.005, 0.005)]
    lo, hi = min(corners), max(corners)
    for _ in range(40):
        cand = round((b / se) * float(srng.choice([0.5, 0.6, 1.5, 1.8])), 2)
        rep = (cand - 0.005, cand + 0.005)
        if hit(rep, (lo, hi)) or hit(rep, (-hi, -lo)) or abs(cand) < 0.05:
            continue
        return cand
    return None


def make_distractor(rng: np.random.Generator, doc: Doc, did: str, kind: str, srng: np.random.Generator | None = None) -> tuple[dict, list]:
    nt = doc.nt
    # whether this result carries a seeded error (drawn from its own generator, so the text of
    # every other result stays as it was)
    error = str(srng.choice(STAT_ERRORS[kind])) if srng is not None and kind in STAT_ERRORS and srng.random() < 0.35 else None
    seeded: dict = {}

    def p_text(p: float, value: float, dfs: tuple) -> str:
        if error is not None and error != "r-df-vs-n":
            wrong = seeded_p(srng, kind, error, value, dfs, p)
            if wrong is not None:
                seeded["error"] = error
                return f"{nt.p}{nt.eq}{plain(wrong, 3, nt, nt.lead_p)}"
        return p_for_distractor(p, nt)
    eq = nt.eq
    js = nt.join
    ms = doc.measures
    m1, m2 = ms[int(rng.integers(len(ms)))], ms[int(rng.integers(len(ms)))]
    N = doc.N
    who = doc.topic["who"]
    if kind == "F":
        k = 3
        per = max(4, N // 3)
        xs = [rng.normal(0.3 * rng.standard_normal(), 1, per) for _ in range(k)]
        res = stats.f_oneway(*xs)
        df2 = k * per - k
        fv = float(dround(float(res.statistic), 2))
        txt = f"F(2, {df2}){eq}{plain(float(res.statistic), 2, nt, True)}{js}{p_text(float(res.pvalue), fv, (2, df2))}"
        lead = f"Baseline {m1['name']} did not differ clearly across the three {'sites' if doc.topic['domain'] != 'mice' else 'cage racks'}, " if res.pvalue >= 0.05 else f"Baseline {m1['name']} differed across the three {'sites' if doc.topic['domain'] != 'mice' else 'cage racks'}, "
        toks = [(lead, []), (txt, [(did, "stat")]), (".", [])]
    elif kind == "chi2":
        n = max(12, N)
        a = int(rng.binomial(n // 2, 0.55))
        b = int(rng.binomial(n - n // 2, 0.4))
        table = np.array([[a, n // 2 - a], [b, n - n // 2 - b]])
        if (table.sum(axis=0) == 0).any() or (table.sum(axis=1) == 0).any():
            table = table + 1
        chi2, p, dof, _ = stats.chi2_contingency(table, correction=False)
        nn = int(table.sum())
        cv = float(dround(float(chi2), 2))
        txt = f"\u03c7\u00b2(1, N = {nn}){eq}{plain(float(chi2), 2, nt, True)}{js}{p_text(float(p), cv, (1,))}"
        toks = [(f"The share of {who} who {ACTIONS[doc.topic['domain']][0]} {'differed' if p < 0.05 else 'did not differ'} by group, ", []), (txt, [(did, "stat")]), (".", [])]
    elif kind == "r":
        n = max(8, N)
        x = rng.normal(0, 1, n)
        y = 0.35 * x + rng.normal(0, 1, n)
        r, p = stats.pearsonr(x, y)
        rv = float(dround(float(r), 2))
        if error == "r-df-vs-n":
            # the n printed beside the df is not df + 2 (the df printed is the analysis's own)
            wrong_n = n + int(srng.choice([-6, -4, 4, 6, 10]))
            seeded["error"] = error
            txt = f"r({n - 2}){eq}{plain(float(r), 2, nt, nt.lead_p)}{js}n{eq}{wrong_n}{js}{p_for_distractor(float(p), nt)}"
        else:
            txt = f"r({n - 2}){eq}{plain(float(r), 2, nt, nt.lead_p)}{js}{p_text(float(p), rv, (n - 2,))}"
        toks = [(f"{m1['name'].capitalize()} and {m2['name']} were correlated, ", []), (txt, [(did, "stat")]), (".", [])]
    elif kind == "z":
        n = max(6, N // 2)
        x, y = rng.normal(0.5, 1, n), rng.normal(0, 1, n)
        res = stats.mannwhitneyu(x, y, method="asymptotic", use_continuity=False)
        p = float(res.pvalue)
        z = float(stats.norm.isf(p / 2)) * (1 if x.mean() > y.mean() else -1)
        zv = float(dround(z, 2))
        txt = f"z{eq}{plain(z, 2, nt, True)}{js}{p_text(p, zv, ())}"
        toks = [(f"A rank-based test on {m1['name']} agreed, ", []), (txt, [(did, "stat")]), (".", [])]
    elif kind == "b":
        n = max(10, N)
        g = np.repeat([0.0, 1.0], [n // 2, n - n // 2])
        age = rng.normal(40, 9, n)
        y = 0.5 * g + 0.02 * age + rng.normal(0, 1, n)
        X = np.column_stack([np.ones(n), g, age])
        beta, *_ = np.linalg.lstsq(X, y, rcond=None)
        resid = y - X @ beta
        dfr = n - 3
        s2 = float(resid @ resid) / dfr
        cov = s2 * np.linalg.inv(X.T @ X)
        b, se = float(beta[1]), float(math.sqrt(cov[1, 1]))
        t = b / se
        p = p_two(t, dfr)
        tc = t_crit(dfr)
        ci = ci_text(plain(b - tc * se, 2, nt, True), plain(b + tc * se, 2, nt, True), nt, True)
        wrong = seeded_coefficient_t(srng, b, se) if error == "coefficient-t-mismatch" and srng is not None else None
        if wrong is not None:
            # the t is not b/SE; its p follows from the t printed, and no CI is printed (its width would follow from SE)
            seeded["error"] = error
            txt = f"b{eq}{plain(b, 2, nt, True)}{js}SE{eq}{plain(se, 2, nt, True)}{js}t({dfr}){eq}{plain(wrong, 2, nt, True)}{js}{p_for_distractor(p_two(wrong, dfr), nt)}"
        else:
            txt = f"b{eq}{plain(b, 2, nt, True)}{js}SE{eq}{plain(se, 2, nt, True)}{js}t({dfr}){eq}{plain(t, 2, nt, True)}{js}{p_for_distractor(p, nt)}{js}{nt.ci_label} {ci}"
        toks = [(f"In a regression adjusting for age, group predicted {m1['name']} at the end of the study, ", []), (txt, [(did, "stat")]), (".", [])]
    else:  # a p with no t, after a result
        p = float(rng.uniform(0.12, 0.9))
        txt = p_for_distractor(p, nt)
        toks = [(txt, [(did, "stat")])]
    meta = dict(id=did, kind={"F": "F", "chi2": "chi-square", "r": "correlation", "z": "z", "b": "regression", "p": "p-without-t"}[kind])
    if "error" in seeded:
        meta.update(error=seeded["error"], expect_rules=STAT_ERROR_RULES[seeded["error"]])
    return meta, toks


# -- results of their own paragraph, after the Discussion: an F with its groups' summaries, an F
# said to equal a t's square, a chi-square with its table's size and association. They draw from a
# generator of their own ([seed, manuscript, 17]) and are laid out after everything else, so every
# other number and place of the manuscript stays as it was. Each seeded error is proved impossible
# under every common reading by the generator's own interval arithmetic (below).
LATE_ERRORS = {
    "Fgroups": ["F-from-group-summaries"],
    "Ft": ["F-not-t-squared"],
    "chi2table": ["chi-square-df-vs-table", "association-vs-chi-square"],
}
LATE_ERROR_RULES = {
    "F-from-group-summaries": ["f-follows-from-group-summaries"],
    "F-not-t-squared": ["f-equals-t-squared"],
    "chi-square-df-vs-table": ["chi-square-df-follows-from-table"],
    "association-vs-chi-square": ["association-follows-from-chi-square"],
}
GROUP_ORDINALS = ["first", "second", "third", "fourth"]


def max_oneway_f(means: list, sds: list, ns: list, dec: int, se: bool) -> float:
    """The largest one-way F over the printed means' and SDs' rounding (half a unit of `dec`
    decimals): the between-group sum of squares is a convex function of the means, so its
    largest value is at one of the 2^k corners; the within-group sum is smallest at the smallest
    SDs. `se`: the spreads read as SEs (SD = SE * sqrt(n))."""
    h = 0.5 * 10 ** -dec
    k, N = len(ns), sum(ns)
    best = 0.0
    for mask in range(1 << k):
        m = [means[i] + (h if mask >> i & 1 else -h) for i in range(k)]
        g = sum(n * x for n, x in zip(ns, m)) / N
        best = max(best, sum(n * (x - g) ** 2 for n, x in zip(ns, m)))
    sd_lo = [max(0.0, s - h) * (math.sqrt(n) if se else 1.0) for s, n in zip(sds, ns)]
    within = sum((n - 1) * s ** 2 for s, n in zip(sd_lo, ns))
    return math.inf if within <= 0 else (best / (k - 1)) / (within / (N - k))



def oneway_groups(rng: np.random.Generator, error):
    """k groups (3 or 4) of 8 to 40 scores, their F and p by scipy.stats.f_oneway, the means and SDs
    rounded to 2 decimals. With an error to seed, an F larger than any the printed summaries give at
    every corner of their rounding, read as SDs or as SEs; the p printed is the wrong F's own, so
    only the summaries show the error. Returns k, ns, means, sds, f, p, df2 and the error seeded."""
    seeded = None
    k = int(rng.choice([3, 4]))
    ns = [int(rng.integers(8, 41)) for _ in range(k)]
    xs = [rng.normal(5 + 0.6 * float(rng.standard_normal()), 1.2, n) for n in ns]
    res = stats.f_oneway(*xs)
    means = [float(dround(float(np.mean(x)), 2)) for x in xs]
    sds = [float(dround(float(np.std(x, ddof=1)), 2)) for x in xs]
    f, p = float(res.statistic), float(res.pvalue)
    df2 = sum(ns) - k
    if error is not None:
        reach = max(max_oneway_f(means, sds, ns, 2, False), max_oneway_f(means, sds, ns, 2, True))
        for _ in range(40):
            cand = round(f * float(rng.choice([1.6, 2.0, 2.5, 3.0])) + float(rng.choice([0.0, 0.5, 1.0])), 2)
            if cand - 0.005 > reach:
                f, p, seeded = cand, float(stats.f.sf(cand, k - 1, df2)), error
                break
    return k, ns, means, sds, f, p, df2, seeded

def make_late_distractor(arng: np.random.Generator, doc: Doc, did: str, kind: str) -> tuple[dict, list]:
    nt = doc.nt
    eq, js = nt.eq, nt.join
    ms = doc.measures
    m1 = ms[int(arng.integers(len(ms)))]
    error = str(arng.choice(LATE_ERRORS[kind])) if arng.random() < 0.4 else None
    seeded = None
    place = "sites" if doc.topic["domain"] != "mice" else "cage racks"
    if kind == "Fgroups":
        k, ns, means, sds, f, p, df2, seeded = oneway_groups(arng, error)
        groups = "; ".join(f"{GROUP_ORDINALS[i]} site: {nt.M}{eq}{plain(means[i], 2, nt, True)}{js}{nt.SD}{eq}{plain(sds[i], 2, nt, True)}{js}{nt.n}{eq}{ns[i]}" for i in range(k))
        txt = f"F({k - 1}, {df2}){eq}{plain(f, 2, nt, True)}{js}{p_for_distractor(p, nt)}"
        # a composite of continuous scores, never one of the manuscript's whole-number measures
        toks = [(f"In a one-way analysis of variance, the composite index at follow-up {'differed' if p < 0.05 else 'did not differ clearly'} across {place} ({groups}), ", [(did, "stat")]), (txt, [(did, "stat")]), (".", [])]
    elif kind == "Ft":
        # more units than the study's own tests have, so its df is no other t's (an abstract's
        # result is matched to the results by its df among other things)
        n = 2 * max(10, doc.N) + 10
        x, y = arng.normal(0.5, 1, n // 2), arng.normal(0, 1, n - n // 2)
        res = stats.ttest_ind(x, y)
        t, df = float(res.statistic), n - 2
        tv = float(dround(t, 2))
        fv = tv * tv
        if error is not None:
            lo_t, hi_t = abs(tv) - 0.005, abs(tv) + 0.005
            lo_sq, hi_sq = max(0.0, lo_t) ** 2, hi_t ** 2
            for _ in range(40):
                cand = round(fv * float(arng.choice([0.5, 0.7, 1.4, 1.8])) + float(arng.choice([0.0, 0.3])), 2)
                if cand > 0.05 and not hit((cand - 0.005, cand + 0.005), (lo_sq, hi_sq)):
                    fv, seeded = cand, error
                    break
        txt = f"{nt.t}({df}){eq}{plain(t, 2, nt, True)}{js}{p_for_distractor(p_two(tv, df), nt)} (equivalently F(1, {df}){eq}{plain(fv, 2, nt, True)})"
        toks = [(f"Taken on its own, the two-group comparison of {m1['name']} gave ", []), (txt, [(did, "stat")]), (".", [])]
    else:  # chi2table
        r, c = [(2, 3), (3, 2), (2, 4), (3, 3), (2, 2)][int(arng.integers(5))]
        n = max(40, doc.N * 2)
        table = arng.multinomial(n, arng.dirichlet(np.full(r * c, 6.0))).reshape(r, c) + 2
        chi2, p, dof, _ = stats.chi2_contingency(table, correction=False)
        nn = int(table.sum())
        kmin = min(r, c) - 1
        chi2v = float(dround(float(chi2), 2))
        v = math.sqrt(chi2 / (nn * kmin))
        df_print = int(dof)
        if error == "chi-square-df-vs-table":
            # a df that is not (r - 1)(c - 1); the p printed is that df's own
            df_print = int(dof) + int(arng.choice([1, 2])) if dof > 1 and arng.random() < 0.5 else int(dof) + 1 if dof == 1 else int(dof) - 1
            if df_print != dof and df_print >= 1:
                p, seeded = float(stats.chi2.sf(chi2v, df_print)), error
        elif error == "association-vs-chi-square":
            # every V (or |phi|) the chi-square's rounding allows, at this table's min(r, c) - 1 and at every other divisor k with k^2 <= df
            ks = {kk for kk in range(1, int(dof) + 1) if kk * kk <= dof and dof % kk == 0} | {kmin}
            ivs = [(math.sqrt(max(0.0, chi2v - 0.005) / (nn * kk)), math.sqrt((chi2v + 0.005) / (nn * kk))) for kk in ks]
            for _ in range(40):
                cand = round(v * float(arng.choice([0.5, 0.6, 1.6, 2.0])), 2)
                if 0.02 < cand < 1 and not any(hit((cand - 0.005, cand + 0.005), iv) for iv in ivs):
                    v, seeded = cand, error
                    break
        sym = "φ" if (r, c) == (2, 2) else "Cramér's V"
        txt = f"χ²({df_print}, N = {nn}){eq}{plain(chi2, 2, nt, True)}{js}{p_for_distractor(p, nt)}{js}{sym}{eq}{plain(v, 2, nt, nt.lead_p)}"
        toks = [(f"Outcome categories by arm formed a {r} × {c} contingency table, ", []), (txt, [(did, "stat")]), (".", [])]
    meta = dict(id=did, kind={"Fgroups": "F-with-groups", "Ft": "F-with-t", "chi2table": "chi-square-with-table"}[kind])
    if seeded is not None:
        meta.update(error=seeded, expect_rules=LATE_ERROR_RULES[seeded])
    return meta, toks


# -- an F whose groups' summaries are printed in a table it names ("Table A1"), after the other late
# results. It draws from a generator of its own ([seed, manuscript, 18]) and comes last, so every
# other number and place of the manuscript stays as it was. The table prints either one set of
# groups (a row per site: Site | n | M | SD, the caption naming the composite index) or two
# measures (a row per measure, a column per site with its n in the header), the F's sentence naming
# its measure. Its seeded error is the one of "Fgroups": an F larger than any the printed summaries
# give at every corner of their rounding, read as SDs or as SEs, its p the wrong F's own.
TABLE_F_ERROR = "F-from-group-summaries-in-table"
LATE_ERROR_RULES[TABLE_F_ERROR] = ["f-follows-from-group-summaries"]
TABLE_F_OTHER = "Service rating"


def make_table_f_distractor(trng: np.random.Generator, doc: Doc, did: str, pdf: bool) -> tuple[dict, list]:
    nt = doc.nt
    eq, js = nt.eq, nt.join
    error = TABLE_F_ERROR if trng.random() < 0.4 else None
    place = "sites" if doc.topic["domain"] != "mice" else "cage racks"
    unit = "site" if doc.topic["domain"] != "mice" else "rack"
    k, ns, means, sds, f, p, df2, seeded = oneway_groups(trng, error)
    wide = trng.random() < 0.5
    med = nt.name in ("med", "middot")
    mean_sd = "mean (SD)" if med else "M (SD)"
    labels = [f"{GROUP_ORDINALS[i].capitalize()} {unit}" for i in range(k)]
    num = lambda v: plain(v, 2, nt, True)
    if wide:
        other = [trng.normal(3.5, 0.8, n) for n in ns]
        header = [[("Measure", [])]] + [[(f"{labels[i]} (n = {ns[i]}), {mean_sd}", [])] for i in range(k)]
        row1 = [[("Composite index", [])]] + [[(f"{num(means[i])} ({num(sds[i])})", [])] for i in range(k)]
        row2 = [[(TABLE_F_OTHER, [])]] + [[(f"{num(float(np.mean(x)))} ({num(float(np.std(x, ddof=1)))})", [])] for x in other]
        rows = [header, row1, row2] if trng.random() < 0.5 else [header, row2, row1]
        caption = f"Scores at follow-up by {unit}"
    else:
        rows = [[[(h, [])] for h in (unit.capitalize(), "n", "M", "SD")]]
        rows += [[[(labels[i], [])], [(str(ns[i]), [])], [(num(means[i]), [])], [(num(sds[i]), [])]] for i in range(k)]
        caption = f"Composite index at follow-up by {unit}"
    cap = f"Table A1. {caption}." if pdf else f"**Table A1.** {caption}."
    txt = f"F({k - 1}, {df2}){eq}{plain(f, 2, nt, True)}{js}{p_for_distractor(p, nt)}"
    toks = [(f"The composite index at follow-up {'differed' if p < 0.05 else 'did not differ clearly'} across {place} (Table A1), ", []), (txt, [(did, "stat")]), (".", [])]
    blocks = [("para", [(cap, [])]), ("table", rows), ("para", toks)]
    meta = dict(id=did, kind="F-with-groups-in-table")
    if seeded is not None:
        meta.update(error=seeded, expect_rules=LATE_ERROR_RULES[seeded])
    return meta, blocks


# ---------------------------------------------------------------------------------------------
# A whole manuscript
# ---------------------------------------------------------------------------------------------

HOUSES = ["apa", "med", "middot", "comma", "nature", "pdf", "rmd"]
HOUSE_NAMES = {"apa": "apa", "med": "medical", "middot": "middle-dot", "comma": "decimal-comma", "nature": "nature-like", "pdf": "pdf-text", "rmd": "r-markdown"}
T_ERRORS = ["p-typo", "significance-flip", "undeclared-one-tailed", "stated-two-tailed-but-one-tailed-p", "impossible-value", "p-printed-as-zero",
            "t-vs-descriptives", "se-printed-as-sd", "df-vs-n", "paired-analysed-as-independent", "independent-analysed-with-paired-df",
            "impossible-paired-correlation", "ci-vs-result", "d-vs-t", "grim", "grimmer", "adjusted-p"]
DOC_ERRORS = ["count-vs-percent", "power-statement", "group-sizes-vs-total", "abstract-vs-results", "total-n-vs-df"]
DESIGN_NAMES = {"ind": "independent-student", "welch": "independent-welch", "paired": "paired", "one": "one-sample",
                "percent": "percentage", "power": "power", "groups": "group-sizes", "total": "total-n"}

PAIRED_PHRASES = {
    "people": ["the same {who} were measured {t0} and {t1}", "each {one} measured twice", "a within-{one} comparison",
               "the same {who} assessed {t0} and {t1}", "repeated measures on the same {who}"],
    "mice": ["the same {who} measured {t0} and {t1}", "each {one} measured twice", "repeated measures on the same {who}"],
    "plots": ["the same {who} were assessed in spring and autumn", "a within-plot comparison", "each {one} measured twice"],
}
IND_PHRASES = ["two independent groups", "independent samples", "between the randomly assigned groups"]
REF_PHRASES = ["the scale midpoint of", "a target of", "the published norm of", "a test value of", "the service benchmark of"]
WITHIN_DESIGN = {
    "people": ["Each {one} completed both conditions in random order (a crossover design).",
               "Every {one} took part in both conditions, one week apart, so the same {who} were measured twice."],
    "mice": ["Each {one} was tested under both conditions in random order (a crossover design)."],
    "plots": ["Each {one} carried both treatments in split halves, a within-plot comparison; the same {who} were assessed in spring and autumn."],
}
BETWEEN_DESIGN = ["{Who} were randomly assigned to the {A} group or the {B} group.", "Allocation to the {A} or {B} group was random (two independent groups).",
                  "The {A} and {B} groups were formed by random assignment."]


def declaration(m: dict, doc: Doc, rng: np.random.Generator) -> str:
    name, one = m["name"], doc.topic["one"]
    Name = name[0].upper() + name[1:]
    k = m.get("k")
    kw = NUMBER_WORDS.get(k, str(k)) if k else ""
    forms = {
        "count": [f"{Name} were recorded as whole-number counts for each {one}.", f"For {name}, each {one} contributed a count, so every score is a whole number.",
                  f"{Name} is the number counted per {one} (a whole number)."],
        "item": [f"{Name} was rated on a single item scored as an integer from {m.get('lo')} to {m.get('hi')}.",
                 f"{Name} was a single rating from {m.get('lo')} to {m.get('hi')} in whole points."],
        "mean_items": [f"{Name} was scored as the mean of {kw} items, each an integer from {m.get('lo')} to {m.get('hi')}.",
                       f"{Name} is the average of {kw} items answered in whole numbers from {m.get('lo')} to {m.get('hi')}."],
        "sum_items": [f"{Name} was the sum of {kw} items, each scored {m.get('lo')} to {m.get('hi')}.",
                      f"{Name} is the total of {kw} items, each an integer from {m.get('lo')} to {m.get('hi')}."],
        "cont": [f"{Name} was measured in {m.get('unit')}.", f"{Name} was recorded in {m.get('unit')} with a calibrated device.",
                 f"{Name} ({m.get('unit')}) was taken as the average of repeated readings."],
    }[m["kind"]]
    return forms[int(rng.integers(len(forms)))]


@dataclass
class Spec:
    idx: int
    house: str
    within: bool
    tails_stated: bool
    errors: list


def plan(seed: int, ndocs: int, per_type: int) -> list[Spec]:
    rng = np.random.default_rng([seed, 999])
    specs = []
    for i in range(ndocs):
        house = HOUSES[i % len(HOUSES)]
        within = bool(rng.random() < 0.22)
        specs.append(Spec(i, house, within, bool((i // len(HOUSES)) % 2 == 0), []))
    load = [0] * ndocs
    for e in T_ERRORS + DOC_ERRORS:
        # some documents have no result whose df and sign are unique, so the abstract cannot repeat one
        for k in range(per_type + (10 if e == "abstract-vs-results" else 0)):
            elig = []
            for sp in specs:
                if e == "undeclared-one-tailed" and sp.tails_stated:
                    continue
                if e == "stated-two-tailed-but-one-tailed-p" and not sp.tails_stated:
                    continue
                if e == "independent-analysed-with-paired-df" and sp.within:
                    continue
                cap = {"total-n-vs-df": 1, "abstract-vs-results": 1, "power-statement": 1, "count-vs-percent": 2, "group-sizes-vs-total": 1}.get(e, 4)
                if sp.errors.count(e) >= cap:
                    continue
                elig.append(sp)
            if not elig:
                break
            # the least-loaded document first; ties broken by a seeded shuffle of the house order
            keyed = sorted(elig, key=lambda sp: (load[sp.idx], (sp.idx * 7919 + k * 104729 + len(e)) % ndocs))
            sp = keyed[0]
            sp.errors.append(e)
            load[sp.idx] += 1
    return specs


def house_styles(house: str) -> list[dict]:
    return [s for s in STYLES.values() if s["house"] == house]


def table_fits(st: dict, error: str | None) -> bool:
    if not st["table"] or error is None:
        return True
    if error in ("paired-analysed-as-independent", "independent-analysed-with-paired-df", "abstract-vs-results"):
        return False
    if ("dfheader" in st["name"] or "stars-t" in st["name"]) and error in ("df-vs-n", "impossible-value"):
        return False
    return True


def pick(rng: np.random.Generator, items: list, weights: list | None = None):
    if weights is None:
        return items[int(rng.integers(len(items)))]
    w = np.array(weights, dtype=float)
    return items[int(rng.choice(len(items), p=w / w.sum()))]


def choose_topic(rng: np.random.Generator, house: str, idx: int) -> dict:
    if house == "nature":
        pool = [t for t in TOPICS if t["domain"] == "mice"] + [t for t in TOPICS if t["domain"] == "plots"][:1]
    else:
        pool = [t for t in TOPICS if t["domain"] == "people"] * 3 + [t for t in TOPICS if t["domain"] == "plots"]
    return pool[(idx * 5 + int(rng.integers(3))) % len(pool)]


def build_doc(seed: int, spec: Spec) -> dict:
    rng = np.random.default_rng([seed, spec.idx])
    house = spec.house
    topic = choose_topic(rng, house, spec.idx)
    ext = {"pdf": ".txt", "rmd": ".Rmd"}.get(house, ".md")
    if house == "pdf":
        base = "apa" if rng.random() < 0.6 else "med"
        nt = notation_for(base, rng)
        nt.p, nt.t, nt.M, nt.SD, nt.n, nt.d = ("p" if base == "apa" else "P"), "t", "M", "SD", "n", "d"
    elif house == "rmd":
        nt = notation_for("apa", rng)
    else:
        nt = notation_for(house, rng)
    dom = topic["domain"]
    lo, hi = {"people": (14, 45), "mice": (6, 14), "plots": (8, 20)}[dom]
    study = "within" if spec.within else "between"
    nA = int(rng.integers(lo, hi + 1))
    nB = int(rng.integers(lo, hi + 1)) if rng.random() < 0.6 else nA
    if study == "within":
        nA = int(rng.integers(max(lo, 12), hi + 10))
        nB = 0
    pool = list(measure_pool(dom))
    order = rng.permutation(len(pool))
    measures = [pool[i] for i in order[: int(rng.integers(6, min(9, len(pool)) + 1))]]
    if not any(m["kind"] in ("count", "item") for m in measures):
        measures.append(next(m for m in pool if m["kind"] in ("count", "item")))
    slug = f"m{spec.idx + 1:03d}-{topic['slug']}"
    doc = Doc(spec.idx, house, ext, slug, topic, nt, study, nA, nB, spec.tails_stated, bool(rng.random() < 0.4),
              3 if rng.random() < 0.8 else 2, 2 if rng.random() < 0.85 else 3, 2 if rng.random() < 0.6 else 1, measures)
    doc.spread_doc = "se" if (house == "nature" and rng.random() < 0.6) else "sd"
    kinds_doc = ALLK if study == "between" else ("paired", "one")
    styles = house_styles(house)
    # -- plan blocks of t-test cases ----------------------------------------------------------
    blocks: list[dict] = []
    prose_styles = [s for s in styles if not s["table"] and s["name"] != "apa-multi-test"]
    anchor_kind = "ind" if study == "between" else "paired"
    anchor_styles = [s for s in prose_styles if style_fits(s, anchor_kind, None) and not s["correct_only"] and s["name"] not in ("apa-n-total-only", "apa-adjusted-bonferroni", "med-adjusted", "nature-adjusted")]
    blocks.append(dict(type="single", style=pick(rng, anchor_styles)["name"], slots=[dict(kind=anchor_kind, error=None, anchor=True)]))
    t_errors = [e for e in spec.errors if e in T_ERRORS]
    for e in t_errors:
        kinds = [k for k in ERROR_KINDS.get(e, ALLK) if k in kinds_doc]
        kind = pick(rng, kinds)
        cands = [s for s in styles if style_fits(s, kind, e) and table_fits(s, e)]
        if not cands:
            kind = pick(rng, kinds)
            cands = [s for s in styles if style_fits(s, kind, e) and table_fits(s, e)]
        if not cands:
            fallback = {"apa": "apa-desc-inline", "med": "med-meansd-vs", "middot": "middot-apa", "comma": "comma-apa", "nature": "nature-t-sub", "pdf": "pdf-apa-prose", "rmd": "rmd-apa-plain"}[house]
            cands = [STYLES[fallback]] if style_fits(STYLES[fallback], kind, e) else [s for s in STYLES.values() if s["house"] in ("apa",) and style_fits(s, kind, e) and not s["table"]]
        st = pick(rng, cands, [s["weight"] for s in cands])
        if st["table"] or st["name"] == "apa-multi-test":
            kind = kind if kind in st["kinds"] else st["kinds"][0]
            if "dfheader" in st["name"] or "stars-t" in st["name"] or st["name"] == "apa-multi-test":
                same = [b for b in blocks if b["style"] == st["name"] and len(b["slots"]) < 4 and b["slots"][0]["kind"] == kind]
            else:
                same = [b for b in blocks if b["style"] == st["name"] and len(b["slots"]) < 5]
            if same:
                same[0]["slots"].append(dict(kind=kind, error=e))
                continue
            blocks.append(dict(type="table" if st["table"] else "multi", style=st["name"], slots=[dict(kind=kind, error=e)]))
        else:
            blocks.append(dict(type="single", style=st["name"], slots=[dict(kind=kind, error=e)]))
    n_target = max(int(rng.integers(24, 42)), len(t_errors) + 14)
    count = lambda: sum(len(b["slots"]) for b in blocks)
    while count() < n_target:
        st = pick(rng, styles, [s["weight"] * (0.6 if s["table"] else 1.0) for s in styles])
        kinds = [k for k in st["kinds"] if k in kinds_doc]
        if not kinds:
            continue
        kind = pick(rng, kinds)
        if st["table"]:
            blocks.append(dict(type="table", style=st["name"], slots=[dict(kind=kind if ("dfheader" in st["name"] or "stars-t" in st["name"]) else pick(rng, kinds), error=None) for _ in range(int(rng.integers(3, 6)))]))
        elif st["name"] == "apa-multi-test":
            blocks.append(dict(type="multi", style=st["name"], slots=[dict(kind=kind, error=None) for _ in range(int(rng.integers(2, 4)))]))
        else:
            blocks.append(dict(type="single", style=st["name"], slots=[dict(kind=kind, error=None)]))
    for b in blocks:
        need = 3 if b["type"] == "table" else 2 if b["type"] == "multi" else 1
        while len(b["slots"]) < need:
            b["slots"].append(dict(kind=b["slots"][0]["kind"], error=None))
    # -- build the t-test cases ---------------------------------------------------------------
    cid_n = [0]

    def new_id() -> str:
        cid_n[0] += 1
        return f"{slug}-c{cid_n[0]:03d}"

    flips = ["to-sig", "to-ns"]
    impossibles = ["p-above-one", "p-no-point", "p-below-zero-bound", "df"]
    for b in blocks:
        b["cases"] = []
        for sl in b["slots"]:
            e = sl["error"]
            c = make_t_case(rng, doc, new_id(), sl["kind"], e, b["style"], anchor=sl.get("anchor", False) or (b["type"] == "table" and "long" not in b["style"]),
                            flip=pick(rng, flips), impossible=pick(rng, impossibles))
            if sl.get("anchor"):
                c.f["anchor"] = True
            b["cases"].append(c)
    t_cases = [c for b in blocks for c in b["cases"]]
    # contexts, orders, design words and reference phrases
    for b in blocks:
        for c in b["cases"]:
            c.f["ctx"] = next_context(doc, rng)
            c.f["order"] = 0 if b["type"] == "table" else int(rng.integers(2))
            if c.kind == "one":
                c.f["ref_phrase"] = pick(rng, REF_PHRASES)
            if c.kind == "paired" and study == "between" and b["type"] == "single":
                ph = pick(rng, PAIRED_PHRASES[dom])
                c.f["design_phrase"] = ph.format(who=topic["who"], one=topic["one"], t0=topic["times"][0], t1=topic["times"][1])
                c.f["design_pos"] = "mid" if rng.random() < 0.4 else "paren"
            if c.kind in IND and b["type"] == "single" and (c.error == "independent-analysed-with-paired-df" or rng.random() < 0.2):
                c.f["design_phrase"] = pick(rng, IND_PHRASES)
                c.f["design_pos"] = "paren"
                if c.error is None:
                    c.f["design_words"] = "independent"
                    if t_case_checks(c, "stated", None):
                        c.f.pop("design_words")
    # -- the abstract's repeated results ------------------------------------------------------
    seen: dict = {}
    for c in t_cases:
        key = (c.pr["df"].value, c.pr["t"].value >= 0)
        seen[key] = seen.get(key, 0) + 1
    cands = [c for c in t_cases if c.error is None and seen[(c.pr["df"].value, c.pr["t"].value >= 0)] == 1 and "p" in c.pr
             and c.style not in ("r-console-prose",) and not c.f.get("anchor") and c.pr["df"].value > 0]
    rng.shuffle(cands)
    abstract_cases: list[Case] = []
    want_err = "abstract-vs-results" in spec.errors
    for c in cands:
        if want_err and not any(x.error == "abstract-vs-results" for x in abstract_cases):
            t0 = c.pr["t"]
            for delta in (0.6, -0.5, 0.9, 1.3, -0.8, 0.4, 2.1):
                tv = t0.value + delta * (1 if t0.value >= 0 else -1)
                if tv * t0.value <= 0:
                    continue
                c.pr["abs_t"] = Num(float(dround(tv, t0.dec)), t0.dec)
                dfv = c.pr["df"].value
                c.pr["abs_p"] = print_p(p_two(tv, dfv), doc, c.style)
                c.error = "abstract-vs-results"
                ok = "repeat" in t_case_checks(c, "any", None) and t_case_checks(c, "stated", None) == {"repeat"}
                # the abstract's own numbers must agree with each other
                saved_t, saved_p = c.pr["t"], c.pr["p"]
                c.pr["t"], c.pr["p"] = c.pr["abs_t"], c.pr["abs_p"]
                keep = {k: c.pr.pop(k) for k in list(c.pr) if k not in ("t", "p", "df")}
                own = t_case_checks(c, "stated", None)
                c.pr.update(keep)
                c.pr["t"], c.pr["p"] = saved_t, saved_p
                if ok and not own:
                    abstract_cases.append(c)
                    break
                c.error = None
                del c.pr["abs_t"], c.pr["abs_p"]
            continue
        if len(abstract_cases) < (2 if want_err else 1) and rng.random() < 0.7:
            c.pr["abs_t"], c.pr["abs_p"] = c.pr["t"], c.pr["p"]
            abstract_cases.append(c)
        if len(abstract_cases) >= 2:
            break
    # -- the printed total (a seeded total-n error prints more than were analysed) --------------
    if "total-n-vs-df" in spec.errors:
        used = set()
        for c in t_cases:
            if c.pr["df"].dec == 0:
                used |= {int(c.pr["df"].value) + 1, int(c.pr["df"].value) + 2}
        for off in (6, 4, 8, 10, 12, 14, 5, 7, 9):
            if doc.N + off not in used:
                doc.n_offset = off
                break
        assert doc.n_offset > 0
    # -- other cases ---------------------------------------------------------------------------
    extra: dict = {}
    pct_err = spec.errors.count("count-vs-percent")
    extra["percent"] = [percent_case(rng, doc, new_id(), "count-vs-percent" if i < pct_err else None) for i in range(max(2, pct_err + int(rng.integers(1, 3))))]
    pw_err = "power-statement" in spec.errors
    extra["power"] = [power_case(rng, doc, new_id(), "power-statement" if (pw_err and i == 0) else None) for i in range(1 if rng.random() < 0.6 else 2)]
    g_err = "group-sizes-vs-total" in spec.errors
    g_in_results = g_err and (doc.n_offset > 0 or rng.random() < 0.4)
    extra["groups_methods"] = groups_case(rng, doc, new_id(), "group-sizes-vs-total" if (g_err and not g_in_results) else None, "methods")
    extra["groups_results"] = groups_case(rng, doc, new_id(), "group-sizes-vs-total", "results") if g_in_results else (groups_case(rng, doc, new_id(), None, "results") if rng.random() < 0.5 else None)
    total = Case(new_id(), "total", "total-n-vs-df" if doc.n_offset else None, "total-" + ("abstract-n-equals" if rng.random() < 0.5 else "abstract-count"))
    total.pr = dict(total=Num(doc.N + doc.n_offset, 0))
    extra["total"] = total
    # -- distractors ---------------------------------------------------------------------------
    dn = [0]

    def new_did() -> str:
        dn[0] += 1
        return f"{slug}-x{dn[0]:02d}"

    distractors = []
    # seeded errors in F, chi-square, r and z results come from a generator of their own, so the
    # rest of the manuscript is drawn exactly as before they were added
    srng = np.random.default_rng([seed, spec.idx, 15])
    # regression coefficients draw theirs from one more generator, so the F, chi-square, r and z
    # errors drawn before they were added stay as they were
    brng = np.random.default_rng([seed, spec.idx, 16])
    for kind in [pick(rng, ["F", "chi2", "r", "z", "b"]) for _ in range(int(rng.integers(3, 7)))]:
        distractors.append(make_distractor(rng, doc, new_did(), kind, brng if kind == "b" else srng))
    arng = np.random.default_rng([seed, spec.idx, 17])
    extra["late_distractors"] = [make_late_distractor(arng, doc, new_did(), str(arng.choice(["Fgroups", "Ft", "chi2table"]))) for _ in range(int(arng.integers(2, 5)))]
    trng = np.random.default_rng([seed, spec.idx, 18])
    extra["table_distractor"] = make_table_f_distractor(trng, doc, new_did(), doc.house == "pdf")
    return compose(doc, rng, blocks, abstract_cases, extra, distractors, new_did)


# ---------------------------------------------------------------------------------------------
# Laying the manuscript out as Markdown, R Markdown or text from a PDF
# ---------------------------------------------------------------------------------------------

MD_LINE_STARTS = ("#", ">", "+ ", "- ", "* ", "=", "|", "<", "`")


def wrap_map(s: str, width: int, rng: np.random.Generator | None, hyphenate: bool, md_guard: bool) -> tuple[str, list[int]]:
    """Greedy wrap at `width`; returns the text and, for every input index, its output index."""
    out: list[str] = []
    pos = [0] * (len(s) + 1)
    words = []
    j, n = 0, len(s)
    while j < n:
        if s[j] == " ":
            j += 1
            continue
        k = j
        while k < n and s[k] != " ":
            k += 1
        words.append((j, k))
        j = k
    col = 0
    prev = 0
    for wi, (a, b) in enumerate(words):
        gap = a - prev
        wl = b - a
        word = s[a:b]
        if wi == 0:
            for q in range(prev, a):
                pos[q] = len(out)
                out.append(" ")
            col += gap
        elif col + gap + wl <= width or (md_guard and (word.startswith(MD_LINE_STARTS) or re.match(r"^\d{1,9}[.)]$", word))):
            for q in range(prev, a):
                pos[q] = len(out)
                out.append(s[q])
            col += gap
        elif hyphenate and re.fullmatch(r"[A-Za-z]{9,}[,.;:]?", word) and width - col - gap >= 5:
            core = len(word.rstrip(",.;:"))
            k = min(core - 3, width - col - gap - 1)
            if k >= 3:
                for q in range(prev, a):
                    pos[q] = len(out)
                    out.append(s[q])
                for q in range(a, a + k):
                    pos[q] = len(out)
                    out.append(s[q])
                out.append("-")
                out.append("\n")
                col = 0
                a = a + k
            else:
                for q in range(prev, a):
                    pos[q] = len(out)
                out.append("\n")
                col = 0
        else:
            for q in range(prev, a):
                pos[q] = len(out)
            out.append("\n")
            col = 0
        for q in range(a, b):
            pos[q] = len(out)
            out.append(s[q])
        col += b - a
        prev = b
    for q in range(prev, n):
        pos[q] = len(out)
        out.append(s[q])
    pos[n] = len(out)
    return "".join(out), pos


class Builder:
    def __init__(self) -> None:
        self.chunks: list[str] = []
        self.len = 0
        self.parts: list[tuple[str, str, int, int]] = []

    def add(self, text: str, tags: list | tuple = ()) -> None:
        start = self.len
        self.chunks.append(text)
        self.len += len(text)
        for owner, role in tags:
            self.parts.append((owner, role, start, self.len))

    def add_tokens(self, toks: list, width: int = 0, hyphenate: bool = False, md_guard: bool = False) -> None:
        s = "".join(t for t, _ in toks)
        local = []
        at = 0
        for t, tags in toks:
            for owner, role in tags:
                if t:
                    local.append((owner, role, at, at + len(t)))
            at += len(t)
        if width:
            s, pos = wrap_map(s, width, None, hyphenate, md_guard)
            local = [(o, r, pos[a], pos[b - 1] + 1) for o, r, a, b in local]
        base = self.len
        self.add(s)
        for o, r, a, b in local:
            self.parts.append((o, r, base + a, base + b))

    def text(self) -> str:
        return "".join(self.chunks)


def retag(toks: list, mapping: dict) -> list:
    return [(t, [(o, mapping.get(r, r)) for o, r in tags]) for t, tags in toks]


def compose(doc: Doc, rng: np.random.Generator, blocks: list, abstract_cases: list, extra: dict, distractors: list, new_did) -> dict:
    topic, nt = doc.topic, doc.nt
    who, one = topic["who"], topic["one"]
    A, B = topic["groups"]
    house = doc.house
    pdf = house == "pdf"
    rmd = house == "rmd"
    L: list = []  # logical blocks
    total: Case = extra["total"]
    all_t = [c for b in blocks for c in b["cases"]]
    dist_tokens = {d["id"]: toks for d, toks in distractors}
    dist_meta = [d for d, _ in distractors]
    # -- abstract
    L.append(("title", topic["title"] + ": an invented study"))
    L.append(("h2", "Abstract"))
    ab: list = [(f"This invented pilot study took place in {topic['setting']}. ", [])]
    Ntxt = f"N = {int(total.pr['total'].value)}" if total.style.endswith("n-equals") else f"{int(total.pr['total'].value)} {who}"
    tail = f" {who}" if total.style.endswith("n-equals") else ""
    if doc.study == "between":
        ab += [("In all, ", []), (Ntxt, [(total.id, "total")]), (f"{tail} were randomly assigned to the {A} or the {B} group for {topic['period']}. ", [])]
    else:
        ab += [("In all, ", []), (Ntxt, [(total.id, "total")]), (f"{tail} took part under both the {A} and the {B} condition. ", [])]
    for c in abstract_cases:
        w = W(doc, c, rng)
        saved = (c.pr["t"], c.pr["p"])
        c.pr["t"], c.pr["p"] = c.pr["abs_t"], c.pr["abs_p"]
        form = "med" if (c.style.startswith("med") or c.style in ("middot-lancet", "middot-meansd", "pdf-med-prose")) else ("glued" if c.style.startswith("nature") else "apa")
        style_saved = c.style
        if c.style in INLINE_R_STYLES or c.style == "r-console-prose" or c.style == "apa-welch-named":
            c.style = "rmd-apa-plain" if rmd else "apa-desc-inline"
        toks = retag(w.t_tokens(form), {"t": "abs_t", "df": "abs_df", "p": "abs_p", "padj": "abs_p"})
        c.style = style_saved
        c.pr["t"], c.pr["p"] = saved
        meas = c.measure["name"]
        ab += [(f"{meas[0].upper() + meas[1:]} {c.f['ctx']} {'differed between the groups' if c.kind in IND else ('changed over the study' if c.kind == 'paired' else 'differed from the reference value')} (", [])] + toks + [("). ", [])]
    ab += [("The pilot suggests a modest benefit that a larger trial should test.", [])]
    L.append(("para", ab))
    # -- methods
    L.append(("h2", "Methods"))
    L.append(("h3", "Participants"))
    gm: Case = extra["groups_methods"]
    gtoks = render_groups(doc, gm, rng)
    gtoks = [(t, tags + ([(total.id, "total")] if any(r == "total" for _, r in tags) else [])) for t, tags in gtoks]
    L.append(("para", gtoks + [(f" The study ran in {topic['setting']}.", [])]))
    if doc.n_offset == 0 and rng.random() < 0.35:
        L.append(("para", [("Where a questionnaire was incomplete, that measure was left out for that " + one + " only.", [])]))
    L.append(("h3", "Design"))
    if doc.study == "within":
        des = pick(rng, WITHIN_DESIGN[topic["domain"]]).format(one=one, who=who)
        owners = [(c.id, "design") for c in all_t if c.error == "paired-analysed-as-independent"]
        L.append(("para", [(des, owners), (" The order of conditions was balanced.", [])]))
    else:
        des = pick(rng, BETWEEN_DESIGN).format(Who=who.capitalize(), A=A, B=B)
        L.append(("para", [(des, [(c.id, "design") for c in all_t if c.error == "independent-analysed-with-paired-df" and not c.f.get("design_phrase")]),
                           (f" Within each group, the same {who} were also measured at two time points ({topic['times'][0]} and {topic['times'][1]}).", [])]))
    L.append(("h3", "Measures"))
    decl_toks: list = []
    for m in doc.measures:
        owners = [(c.id, "decl") for c in all_t if c.measure is m and c.error in ("grim", "grimmer")]
        decl_toks += [(declaration(m, doc, rng), owners), (" ", [])]
    L.append(("para", decl_toks[:-1]))
    L.append(("h3", "Statistical analysis"))
    sa: list = []
    if doc.study == "between":
        sa.append(("Groups were compared with Student's t test for independent samples (Welch's test where the variances differed), changes within a group with paired t tests, and means against reference values with one-sample t tests. ", []))
    else:
        sa.append(("Conditions were compared with paired t tests, and means against reference values with one-sample t tests. ", []))
    if doc.tails_stated:
        owners = [(c.id, "tails") for c in all_t if c.error == "stated-two-tailed-but-one-tailed-p"]
        sa.append((pick(rng, ["All tests were two-tailed.", "All p values are two-sided.", "Tests were two-tailed throughout."]), owners))
        sa.append((" ", []))
    if rng.random() < 0.5:
        alpha_word = "\u03b1" if rng.random() < 0.5 else "alpha"
        sa.append((f"Significance was set at {alpha_word} = {plain(0.05, 2, nt, nt.lead_p)}. ", []))
    if any("padj" in c.pr for c in all_t):
        sa.append(("Where several outcomes were compared, p values were also Bonferroni-corrected and both are reported. ", []))
    if house == "nature":
        sa.append((f"Data are mean \u00b1 {'s.e.m.' if doc.spread_doc == 'se' else 's.d.'}; n is the number of {who}. ", []))
    for i, pc in enumerate(extra["power"]):
        sa += render_power(doc, pc, rng) + [(" ", [])]
    sa.append(("Analyses were run in R 4.3.", []))
    L.append(("para", sa))
    if rmd:
        L.append(("code", "```{r load-data, include=FALSE}\npilot <- read.csv(\"data/pilot-invented.csv\")\n"
                  "# an earlier draft said t(31) = 4.02, p = .52 before the data were cleaned\n```"))
    # -- results
    L.append(("h2", "Results"))
    gr: Case | None = extra["groups_results"]
    if gr is not None:
        L.append(("para", render_groups(doc, gr, rng)))
    order = [blocks[0]] + [blocks[i] for i in rng.permutation(range(1, len(blocks)))]
    percents = list(extra["percent"])
    pending: list = []
    dist_queue = list(dist_meta)
    table_no = [1]

    def flush() -> None:
        if pending:
            toks: list = []
            for s_ in pending:
                toks += s_ + [(" ", [])]
            L.append(("para", toks[:-1]))
            pending.clear()

    for b in order:
        if b["type"] == "table":
            flush()
            for blk in render_table(doc, b["cases"], rng, table_no[0]):
                L.append(blk)
            table_no[0] += 1
            continue
        if b["type"] == "multi":
            flush()
            for blk in render_multi(doc, b["cases"], rng):
                L.append(blk)
            continue
        c = b["cases"][0]
        toks = render_prose(doc, c, rng)
        if any(t == "@PLESS@" for t, _ in toks):
            did = new_did()
            meta, ptoks = make_distractor(rng, doc, did, "p")
            dist_meta.append(meta)
            toks = [x for t_ in toks for x in (ptoks if t_[0] == "@PLESS@" else [t_])]
        if c.style == "r-console-prose" and not pdf and rng.random() < 0.4:
            flush()
            lead = [x for x in toks if not x[1]]
            body = [x for x in toks if x[1] or x[0] in (", ",)]
            L.append(("para", [(f"For {c.measure['name']} {c.f['ctx']}, R printed:", [])]))
            L.append(("codetoks", W(doc, c, rng).t_tokens("console")))
            continue
        pending.append(toks)
        if dist_queue and rng.random() < 0.3:
            d = dist_queue.pop(0)
            pending.append(dist_tokens[d["id"]])
        if percents and rng.random() < 0.15:
            pending.append(render_percent(doc, percents.pop(0), rng))
        if len(pending) >= (1 if c.style in ("apa-desc-prev-sentence",) and rng.random() < 0.7 else 2) or rng.random() < 0.55:
            flush()
    flush()
    for d in dist_queue:
        L.append(("para", dist_tokens[d["id"]]))
    if rmd:
        L.append(("code", "```{r model-check, echo=FALSE}\nfit <- t.test(score ~ group, data = pilot, var.equal = TRUE)\n"
                  "# note to self: t(40) = 1.10, p = .001 was a typo in the first draft\nfit$statistic\n```"))
    if house in ("apa", "med", "middot", "comma", "nature") and rng.random() < 0.3:
        L.append(("html", "<!-- old draft: t(12) = 3.90, p = .41; to be removed -->"))
    # -- discussion
    L.append(("h2", "Discussion"))
    disc: list = [(f"The {A} group did better on several measures, though the pilot was small. ", [])]
    for pc in percents:
        disc += render_percent(doc, pc, rng) + [(" ", [])]
    if doc.one_sided_prose:
        disc.append((pick(rng, ["Coverage of the topic in the trade press has been rather one-sided, and we hope these numbers help. ",
                                "We do not want to give a one-sided account of the debate. ",
                                "Earlier pilots offered a one-sided picture because only enthusiasts took part. ",
                                "A one-tailed reading of the earlier reports would be premature. " if rng.random() < 0.3 else "Staff views were far from one-sided. "]), []))
    disc.append(("All numbers in this manuscript are invented for testing.", []))
    L.append(("para", disc))
    late = extra.get("late_distractors") or []
    if late:
        # a results heading: a methods-like heading after the Results would read as a second study
        L.append(("h2", "Additional results"))
        for meta, toks in late:
            L.append(("para", toks))
            dist_meta.append(meta)
    table_f = extra.get("table_distractor")
    if table_f:
        if not late:
            L.append(("h2", "Additional results"))
        meta, blocks = table_f
        for blk in blocks:
            L.append(blk)
        dist_meta.append(meta)
    # -- serialise
    return serialise(doc, rng, L, all_t, extra, abstract_cases, dist_meta)


def table_lines(b: Builder, rows: list, md: bool, indent: str = "") -> None:
    texts = [["".join(t for t, _ in cell) for cell in row] for row in rows]
    ncol = max(len(r) for r in texts)
    widths = [max(len(r[i]) if i < len(r) else 0 for r in texts) for i in range(ncol)]
    for ri, row in enumerate(rows):
        if md:
            b.add("| ")
        else:
            b.add(indent)
        for ci, cell in enumerate(row):
            for t, tags in cell:
                b.add(t, tags if t else [])
            pad = widths[ci] - len(texts[ri][ci])
            if ci < len(row) - 1:
                b.add(" " * pad + (" | " if md else "   "))
            else:
                b.add(" " * pad + " |" if md else "")
        b.add("\n")
        if md and ri == 0:
            b.add("|" + "|".join("-" * (wd + 2) for wd in widths) + "|\n")
    b.add("\n")


def paginate(text: str, parts: list, header: str, rng: np.random.Generator) -> tuple[str, list]:
    """Insert a running header and a page-number line about every 45 lines, as PDF text has."""
    lines = text.split("\n")
    inserts = []  # (offset of the line start, inserted text)
    off = 0
    page = 1
    inserts.append((0, f"{header}\n\n"))
    next_break = int(rng.integers(42, 49))
    for i, line in enumerate(lines):
        if i == next_break:
            page += 1
            inserts.append((off, f"\n{' ' * 38}{page - 1}\n{header}\n\n"))
            next_break += int(rng.integers(42, 49))
        off += len(line) + 1
    starts = [x for x, _ in inserts]
    cum = []
    tot = 0
    for _, t in inserts:
        tot += len(t)
        cum.append(tot)

    import bisect

    def shift(p: int) -> int:
        k = bisect.bisect_right(starts, p)
        return p + (cum[k - 1] if k else 0)

    out = []
    prev = 0
    for x, t in inserts:
        out.append(text[prev:x])
        out.append(t)
        prev = x
    out.append(text[prev:])
    new_parts = [(o, r, shift(a), shift(b_ - 1) + 1) for o, r, a, b_ in parts]
    return "".join(out), new_parts


ROLE_OF = {"ci_lo": "ci", "ci_hi": "ci", "d_lo": "dci", "d_hi": "dci", "abs_t": "abs_t", "abs_p": "abs_p"}


def serialise(doc: Doc, rng: np.random.Generator, L: list, all_t: list, extra: dict, abstract_cases: list, dist_meta: list) -> dict:
    b = Builder()
    house = doc.house
    pdf, rmd = house == "pdf", house == "rmd"
    width = int(rng.integers(70, 91)) if pdf else (int(rng.integers(88, 110)) if rng.random() < 0.5 else 0)
    title = next(p for k, p in L if k == "title")
    if rmd:
        b.add(f'---\ntitle: "{title}"\nauthor: "Invented authors (demonstration only)"\noutput: html_document\n---\n\n')
        b.add("```{r setup, include=FALSE}\nknitr::opts_chunk$set(echo = FALSE)\n"
              "apa_num <- function(x, digits = 2) formatC(x, digits = digits, format = \"f\")\n"
              "fmt_p <- function(p, digits = 3) sub(\"^0\", \"\", formatC(p, digits = digits, format = \"f\"))\n```\n\n")
    elif not pdf and rng.random() < 0.3:
        b.add(f'---\ntitle: "{title}"\nnote: "Invented manuscript for measuring plumbline; every number is made up."\n---\n\n')
    h2n, h3n = 0, 0
    for kind, payload in L:
        if kind == "title":
            if pdf:
                b.add(payload.upper() + "\n\n")
            elif not rmd:
                b.add(f"# {payload}\n\n")
        elif kind == "h2":
            if pdf:
                if payload == "Abstract":
                    b.add("Abstract\n\n")
                else:
                    h2n += 1
                    h3n = 0
                    b.add(f"{h2n} {payload}\n\n")
            else:
                b.add(f"## {payload}\n\n")
        elif kind == "h3":
            if pdf:
                h3n += 1
                b.add(f"{h2n}.{h3n} {payload}\n\n")
            else:
                b.add(f"### {payload}\n\n")
        elif kind == "para":
            b.add_tokens(payload, width, hyphenate=pdf, md_guard=not pdf)
            b.add("\n\n")
        elif kind == "table":
            table_lines(b, payload, md=not pdf)
        elif kind == "code":
            if not pdf:
                b.add(payload + "\n\n")
        elif kind == "codetoks":
            b.add("```\n")
            b.add_tokens(payload)
            b.add("\n```\n\n")
        elif kind == "html":
            if not pdf:
                b.add(payload + "\n\n")
    text = b.text().rstrip("\n") + "\n"
    parts = [(o, r, a, e) for o, r, a, e in b.parts if e <= len(text)]
    if pdf:
        short = doc.topic["title"].upper()
        text, parts = paginate(text, parts, f"{short[:48]}   INVENTED PILOT REPORT", rng)
    # UTF-16 offsets, as JavaScript strings count them
    u16 = [0] * (len(text) + 1)
    acc = 0
    for i, ch in enumerate(text):
        u16[i] = acc
        acc += 2 if ord(ch) > 0xFFFF else 1
    u16[len(text)] = acc
    by_owner: dict = {}
    for o, r, a, e in parts:
        by_owner.setdefault(o, []).append(dict(role=r, start=u16[a], end=u16[e]))
    file = f"docs/{doc.slug}{doc.ext}"
    cases = []
    others = list(extra["percent"]) + list(extra["power"]) + [extra["groups_methods"]] + ([extra["groups_results"]] if extra["groups_results"] else []) + [extra["total"]]
    for c in all_t + others:
        ps = sorted({(p["start"], p["end"], p["role"]) for p in by_owner.get(c.id, [])})
        if not ps:
            raise RuntimeError(f"{c.id}: no printed parts")
        if c.kind in ALLK:
            roles = {r for _, _, r in ps}
            want = {ROLE_OF.get(k, k) for k in c.pr} - {"mu0"}
            if c.style == "r-console-prose" or c.f.get("adj_only"):
                want.discard("padj")
            if not want <= roles:
                raise RuntimeError(f"{c.id} ({c.style}): printed numbers missing from the text: {sorted(want - roles)}")
        cases.append(dict(
            id=c.id, file=file, house_style=HOUSE_NAMES[house], report_style=c.style, design=DESIGN_NAMES[c.kind],
            error=c.error, expect_rules=ERROR_RULES[c.error] if c.error else [],
            expect_level="note" if c.error == "undeclared-one-tailed" else "warning",
            parts=[dict(role=r, start=a, end=e) for a, e, r in ps]))
    dists = []
    for d in dist_meta:
        ps = sorted({(p["start"], p["end"], p["role"]) for p in by_owner.get(d["id"], [])})
        if ps:
            extra_key = {k: d[k] for k in ("error", "expect_rules") if k in d}
            dists.append(dict(id=d["id"], file=file, house_style=HOUSE_NAMES[house], kind=d["kind"], **extra_key, parts=[dict(role=r, start=a, end=e) for a, e, r in ps]))
    return dict(file=file, text=text, cases=cases, distractors=dists)


README = """# Generated manuscripts (invented)

This folder holds invented manuscripts and their key, written by
`scripts/generate_manuscripts.py` to measure plumbline from outside its own code: recall per
seeded error type, and false alarms per house style and per report style
(`npx tsx scripts/measure-generated.ts`).

Every study, group, measure, setting and number here is invented. The raw data are simulated
with numpy from a fixed seed, the tests are run with scipy.stats, and the results are written in
{nstyles} report styles across seven house styles (APA, medical, middle-dot decimals, decimal
commas, Nature-like, text pulled out of a PDF, R Markdown). About a quarter of the cases carry
exactly one seeded error, which the generator proves impossible under every common reading of the
printed numbers (both tails, Student and Welch, SD or SE, every split of N, every common effect
size definition), each number taken anywhere within its rounding; every correct case is checked
to be reproduced under the reading its text states.

- `docs/`: {ndocs} manuscripts (`.md`, `.Rmd`, `.txt`).
- `key.json`: per case its file, house style, report style, design, seeded error (or null), the
  plumbline rules expected to flag it, and the UTF-16 offsets of every printed piece; the F, χ²,
  r, z, regression and t-less p results that stand between the t-tests are listed as
  `distractors`.

Regenerate (byte-identical for the same seed and library versions):

```sh
python3 scripts/generate_manuscripts.py            # seed {seed}, into fixtures/generated
python3 scripts/generate_manuscripts.py --seed 7 --out /tmp/other
```

Seed {seed}; Python {python}, numpy {numpy}, scipy {scipy}.
"""


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    ap.add_argument("--seed", type=int, default=DEFAULT_SEED)
    ap.add_argument("--out", default="fixtures/generated")
    ap.add_argument("--docs", type=int, default=105)
    ap.add_argument("--per-type", type=int, default=50)
    args = ap.parse_args()
    specs = plan(args.seed, args.docs, args.per_type)
    docs_dir = os.path.join(args.out, "docs")
    if os.path.isdir(docs_dir):
        shutil.rmtree(docs_dir)
    os.makedirs(docs_dir, exist_ok=True)
    cases, dists = [], []
    for sp in specs:
        d = build_doc(args.seed, sp)
        with open(os.path.join(args.out, d["file"]), "w", encoding="utf-8", newline="\n") as fh:
            fh.write(d["text"])
        cases += d["cases"]
        dists += d["distractors"]
    versions = dict(python=".".join(map(str, sys.version_info[:3])), numpy=np.__version__, scipy=scipy.__version__)
    key = dict(generator=GENERATOR, seed=args.seed, versions=versions, cases=cases, distractors=dists)
    with open(os.path.join(args.out, "key.json"), "w", encoding="utf-8", newline="\n") as fh:
        fh.write("{\n")
        fh.write(f'  "generator": {json.dumps(GENERATOR)},\n  "seed": {args.seed},\n  "versions": {json.dumps(versions)},\n')
        fh.write('  "cases": [\n' + ",\n".join("    " + json.dumps(c, ensure_ascii=False) for c in cases) + "\n  ],\n")
        fh.write('  "distractors": [\n' + ",\n".join("    " + json.dumps(c, ensure_ascii=False) for c in dists) + "\n  ]\n}\n")
    used_styles = sorted({c["report_style"] for c in cases if c["design"] not in ("percentage", "power", "group-sizes", "total-n")})
    with open(os.path.join(args.out, "README.md"), "w", encoding="utf-8", newline="\n") as fh:
        fh.write(README.format(nstyles=len(used_styles), ndocs=len(specs), seed=args.seed, **versions))
    by_type: dict = {}
    by_house: dict = {}
    for c in cases:
        by_type[c["error"] or "(correct)"] = by_type.get(c["error"] or "(correct)", 0) + 1
        if c["error"] is None:
            by_house[c["house_style"]] = by_house.get(c["house_style"], 0) + 1
    print(f"{len(specs)} manuscripts, {len(cases)} cases, {len(dists)} distractors, {len(used_styles)} t-test report styles")
    for k in sorted(by_type):
        print(f"  {k:40s} {by_type[k]}")
    print("correct cases per house style: " + ", ".join(f"{k} {v}" for k, v in sorted(by_house.items())))


if __name__ == "__main__":
    main()
