#!/usr/bin/python3
"""Reference values for candor's numerics package (blocks/stats).

Run with Debian's Python and its packages (python3-scipy,
python3-statsmodels, python3-numpy):

    /usr/bin/python3 testdata/reference/make_reference.py

It writes stats.json beside this file. Every input below is invented for
the tests. Every value comes from a named scipy, statsmodels or numpy
function; where neither library has one (Cohen's d), the value comes from
the published formula, computed here with numpy, and the source is named.
Newcombe's, Katz's and Woolf's intervals come from statsmodels'
confint_proportions_2indep and are also checked here against their
published formulas. Two adjustments keep the references accurate to the
1e-9 the Go tests ask for, each explained where it is made: inputs near
10^6 are handed to the libraries exactly shifted (shift), and Student t
quantiles are scipy's t.ppf polished on scipy's t.sf (t_crit).
"""

import json
import math
import os
import random
import sys
from decimal import Decimal

import numpy as np
import pandas as pd
import scipy
import scipy.stats as st
import statsmodels
import statsmodels.api as sm
from statsmodels.stats.proportion import (
    confint_proportions_2indep,
    proportion_confint,
    proportions_ztest,
)
from statsmodels.formula.api import ols as smf_ols
from statsmodels.stats.weightstats import CompareMeans, DescrStatsW

OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "stats.json")


def rounded(xs, decimals):
    return [float(round(v, decimals)) for v in xs]


class Invented:
    """Invented inputs from Python's own generator, whose sequence for a
    seed is stable across Python versions, so the inputs do not change
    when numpy does."""

    def __init__(self, seed):
        self.r = random.Random(seed)

    def normal(self, mean, sd, k):
        return [self.r.gauss(mean, sd) for _ in range(k)]

    def uniform(self, lo, hi, k):
        return [self.r.uniform(lo, hi) for _ in range(k)]

    def integers(self, lo, hi, size):
        rows, cols = size
        return [[self.r.randrange(lo, hi) for _ in range(cols)] for _ in range(rows)]


rng = Invented(20260101)

# ---------------------------------------------------------------- inputs

SAMPLES = {
    "delivery_minutes": [23.5, 31.2, 27.8, 45.1, 22.0, 38.4, 29.9, 33.3, 27.8, 51.6, 24.7, 30.0],
    "three": [4.0, 7.0, 13.0],
    "skewed": [1.2, 1.5, 1.1, 2.8, 1.3, 9.7, 1.4, 1.9, 3.3, 1.2, 1.6],
    "shifted": [1000000.31, 1000000.27, 1000000.45, 1000000.12, 1000000.38, 1000000.29],
    "negative": [-3.5, -1.25, -7.0, -2.5, -4.75, -0.5, -6.25],
    "generated40": rounded(rng.normal(50, 10, 40), 2),
}

QUANTILE_P = [0.0, 0.1, 0.25, 0.33, 0.5, 0.6, 0.75, 0.9, 0.99, 1.0]

WELCH = [
    ("basket_sizes", [12.1, 14.3, 11.8, 13.9, 15.2, 12.7, 13.3],
     [15.8, 17.2, 14.9, 19.3, 16.1, 18.4, 15.5, 17.9, 16.6], 0.95),
    ("unequal_spread", rounded(rng.normal(20, 2, 25), 1), rounded(rng.normal(21.5, 6, 12), 1), 0.95),
    ("level90", [3.1, 2.7, 3.8, 3.3], [2.2, 2.9, 2.4, 2.0, 2.6, 3.0], 0.90),
    ("tiny", [10.0, 12.0], [11.0, 15.0, 14.0], 0.95),
    ("shifted", [1000000.2, 1000000.4, 1000000.1, 1000000.3], [1000000.6, 1000000.5, 1000000.9], 0.95),
]

ANOVA = [
    ("three_stores", [[21.4, 23.1, 19.8, 22.6, 20.9],
                      [24.3, 25.8, 23.9, 26.1],
                      [20.2, 19.5, 21.7, 18.9, 20.4, 19.9]]),
    ("four_generated", [rounded(rng.normal(m, 3, k), 1) for m, k in [(10, 8), (11, 12), (12.5, 6), (10.5, 9)]]),
    ("weak", [[5.0, 6.0, 7.0], [5.5, 6.5, 6.0, 7.5], [6.0, 5.0, 6.5]]),
]

CHI2 = [
    ("two_by_three", [[12, 5, 9], [7, 14, 6]]),
    ("two_by_two", [[20, 15], [30, 35]]),
    ("zero_cell", [[3, 0, 8], [5, 6, 2], [1, 4, 9]]),
    ("four_by_three", [[int(v) for v in row] for row in rng.integers(2, 40, size=(4, 3))]),
]

PROPORTIONS = [
    (18, 60, 27, 55, 0.95),
    (45, 120, 45, 120, 0.95),
    (3, 40, 11, 38, 0.95),
    (1, 25, 2, 30, 0.95),
    (98, 100, 90, 100, 0.95),
    (200, 1000, 260, 1000, 0.90),
]

# empty cells: the ratios are undefined, Newcombe's interval is not
NEWCOMBE_ZERO = [(0, 25, 4, 30, 0.95), (5, 20, 0, 18, 0.95), (0, 10, 0, 12, 0.95), (12, 12, 9, 10, 0.95)]

WILSON = [(0, 30, 0.95), (30, 30, 0.95), (7, 19, 0.95), (1, 1, 0.95), (450, 1000, 0.99)]

_x30 = rounded(rng.normal(0, 1, 30), 2)
CORRELATION = [
    ("visits_spend", [3.0, 5.0, 2.0, 8.0, 6.0, 9.0, 4.0, 7.0, 1.0, 10.0, 5.0, 6.0],
     [21.5, 30.2, 18.9, 44.0, 33.1, 49.8, 25.7, 37.2, 12.4, 52.3, 28.8, 35.0], 0.95),
    ("generated30", _x30, [round(0.4 * a + float(e), 2) for a, e in zip(_x30, rng.normal(0, 1, 30))], 0.90),
    ("ties", [1, 2, 2, 3, 4, 4, 4, 5, 6, 7], [2, 1, 3, 3, 5, 4, 6, 6, 8, 7], 0.95),
    ("negative", [1.0, 2.0, 3.0, 4.0, 5.0], [9.5, 7.1, 7.3, 4.0, 2.2], 0.95),
]

_x1 = rounded(rng.uniform(0, 10, 20), 1)
_x2 = rounded(rng.uniform(20, 40, 20), 1)
_y2 = [round(3 + 1.5 * a - 0.4 * b + float(e), 2) for a, b, e in zip(_x1, _x2, rng.normal(0, 1.5, 20))]
_z1 = rounded(rng.normal(5, 2, 30), 2)
_z2 = rounded(rng.normal(100, 15, 30), 1)
_z3 = rounded(rng.uniform(0, 1, 30), 3)
_y3 = [round(10 + 0.8 * a + 0.05 * b - 4 * c + float(e), 2) for a, b, c, e in zip(_z1, _z2, _z3, rng.normal(0, 1, 30))]
OLS = [
    ("simple", [21.5, 30.2, 18.9, 44.0, 33.1, 49.8, 25.7, 37.2, 12.4, 52.3, 28.8, 35.0],
     [[3.0, 5.0, 2.0, 8.0, 6.0, 9.0, 4.0, 7.0, 1.0, 10.0, 5.0, 6.0]], True, 0.95,
     [[5.5], [12.0], [0.0]]),
    ("two_predictors", _y2, [_x1, _x2], True, 0.95, [[5.0, 30.0], [9.5, 21.0]]),
    ("through_origin", [2.1, 3.9, 6.2, 7.8, 10.1, 12.2, 13.8, 16.1, 18.0, 19.9],
     [[1.0, 2.0, 3.0, 4.0, 5.0, 6.0, 7.0, 8.0, 9.0, 10.0]], False, 0.95, [[4.5], [15.0]]),
    ("three_predictors", _y3, [_z1, _z2, _z3], True, 0.90, [[5.0, 100.0, 0.5]]),
    ("shifted_x", [5.1, 6.3, 6.8, 8.2, 9.1, 9.9, 11.4],
     [[1000000.1, 1000000.2, 1000000.3, 1000000.4, 1000000.5, 1000000.6, 1000000.7]], True, 0.95,
     [[1000000.35]]),
]

BINS = [
    ("delivery_minutes", SAMPLES["delivery_minutes"], [3, 5, 7]),
    ("generated40", SAMPLES["generated40"], [4, 10]),
    ("integers", [1.0, 2.0, 2.0, 3.0, 4.0, 4.0, 5.0, 6.0, 6.0, 6.0, 7.0, 8.0, 9.0, 10.0, 10.0, 3.0, 5.0], [3, 9]),
    ("skewed", SAMPLES["skewed"], [4]),
]

# ---------------------------------------------------------------- helpers


def shift(xs, c):
    """xs less c in exact decimal arithmetic, rounded once (as candor's loader
    shifts a column). scipy and statsmodels compute in plain float64, which
    on values near 10^6 keeps only about ten digits once the data are
    centred; the inputs listed in SHIFTED are handed to them shifted this
    way and location results are shifted back. Every other result is
    invariant under the shift."""
    return [float(Decimal(repr(float(x))) - Decimal(c)) for x in xs]


SHIFTED = {"shifted": 1000000, "shifted_x": 1000000}


def t_crit(p, df):
    """The p quantile of Student's t. scipy.stats.t.ppf (1.10) is good to
    only about 5e-9 relative (t.ppf(0.95, 30) = 1.6972608943617378, where a
    40-digit computation gives 1.6972608865939578), so its value is polished
    by Newton steps on scipy.stats.t.sf, which is accurate to near machine
    precision. Intervals that the libraries build from t.ppf carry the same
    error; the Go tests compare them at 1e-8 of the interval's width."""
    x = st.t.ppf(p, df)
    q = 1 - p
    for _ in range(4):
        x += (st.t.sf(x, df) - q) / st.t.pdf(x, df)
    return x


def f(x):
    x = float(x)
    if not math.isfinite(x):
        raise ValueError("reference value is not finite: %r" % x)
    return x


def fl(xs):
    return [f(x) for x in xs]


def close(a, b, tol=1e-12):
    return abs(a - b) <= tol * max(1.0, abs(a), abs(b))


# ---------------------------------------------------------------- values

out = {
    "generator": "testdata/reference/make_reference.py",
    "versions": {"python": sys.version.split()[0], "numpy": np.__version__,
                 "scipy": scipy.__version__, "statsmodels": statsmodels.__version__},
}

# Descriptive summary: numpy mean/std(ddof=1)/percentile(linear = Hyndman
# and Fan type 7), scipy.stats.sem, scipy.stats.iqr, scipy.stats.skew
# (bias=False: adjusted Fisher-Pearson G1), scipy.stats.t.interval.
desc = []
for name, x in SAMPLES.items():
    c = SHIFTED.get(name, 0)
    a = np.array(shift(x, c))
    n = len(a)
    mean = a.mean()
    sem = st.sem(a)
    lo, hi = st.t.interval(0.95, n - 1, loc=mean, scale=sem)
    desc.append({
        "name": name, "x": x, "n": n, "mean": f(mean + c), "sd": f(a.std(ddof=1)), "se": f(sem),
        "min": f(a.min() + c), "max": f(a.max() + c),
        "q1": f(np.percentile(a, 25, method="linear") + c),
        "median": f(np.median(a) + c),
        "q3": f(np.percentile(a, 75, method="linear") + c),
        "iqr": f(st.iqr(a)),
        "skewness": f(st.skew(a, bias=False)),
        "mean_low": f(lo + c), "mean_high": f(hi + c),
    })
out["describe"] = desc

# Quantiles: numpy.quantile(method="linear"), Hyndman and Fan (1996) type 7.
out["quantile"] = [{"name": name, "x": sorted(x), "p": QUANTILE_P,
                    "q": fl(np.quantile(np.array(shift(x, SHIFTED.get(name, 0))), QUANTILE_P, method="linear")
                            + SHIFTED.get(name, 0))}
                   for name, x in SAMPLES.items()]

# Welch: t and p from scipy.stats.ttest_ind(b, a, equal_var=False); degrees
# of freedom and the interval of mean(b) - mean(a) from statsmodels'
# CompareMeans.ttest_ind / tconfint_diff(usevar="unequal"). Cohen's d with
# the pooled SD from its published formula (Cohen 1988, eq. 2.5.2).
welch = []
for name, a0, b0, level in WELCH:
    a, b = shift(a0, SHIFTED.get(name, 0)), shift(b0, SHIFTED.get(name, 0))
    r = st.ttest_ind(b, a, equal_var=False)
    cm = CompareMeans(DescrStatsW(np.array(b)), DescrStatsW(np.array(a)))
    t2, p2, df = cm.ttest_ind(usevar="unequal")
    lo, hi = cm.tconfint_diff(alpha=1 - level, usevar="unequal")
    assert close(t2, r.statistic) and close(p2, r.pvalue, 1e-10)
    na, nb = len(a), len(b)
    sp = math.sqrt(((na - 1) * np.var(a, ddof=1) + (nb - 1) * np.var(b, ddof=1)) / (na + nb - 2))
    welch.append({"name": name, "a": a0, "b": b0, "level": level,
                  "diff": f(np.mean(b) - np.mean(a)), "t": f(r.statistic), "p": f(r.pvalue),
                  "df": f(df), "low": f(lo), "high": f(hi),
                  "cohen_d": f((np.mean(b) - np.mean(a)) / sp)})
out["welch"] = welch

# One-way ANOVA: F and p from scipy.stats.f_oneway; sums of squares, df and
# mean squares from statsmodels' anova_lm on ols("y ~ C(g)").

anova = []
for name, groups in ANOVA:
    r = st.f_oneway(*[np.array(g) for g in groups])
    df_ = pd.DataFrame({"y": [v for g in groups for v in g],
                        "g": [str(i) for i, g in enumerate(groups) for _ in g]})
    tab = sm.stats.anova_lm(smf_ols("y ~ C(g)", data=df_).fit(), typ=1)
    ssb, ssw = tab["sum_sq"].iloc[0], tab["sum_sq"].iloc[1]
    assert close(tab["F"].iloc[0], r.statistic, 1e-10)
    anova.append({"name": name, "groups": groups, "f": f(r.statistic), "p": f(r.pvalue),
                  "ss_between": f(ssb), "ss_within": f(ssw),
                  "df_between": int(tab["df"].iloc[0]), "df_within": int(tab["df"].iloc[1]),
                  "ms_between": f(tab["mean_sq"].iloc[0]), "ms_within": f(tab["mean_sq"].iloc[1]),
                  "r2": f(ssb / (ssb + ssw)), "sigma": f(math.sqrt(tab["mean_sq"].iloc[1]))})
out["anova"] = anova

# Chi-square test of independence: scipy.stats.chi2_contingency(correction=
# False); Cramér's V: scipy.stats.contingency.association(method="cramer").
chi = []
for name, table in CHI2:
    chi2, p, dof, exp = st.chi2_contingency(np.array(table), correction=False)
    v = st.contingency.association(np.array(table), method="cramer")
    chi.append({"name": name, "counts": table, "chi2": f(chi2), "p": f(p), "df": int(dof),
                "expected": [fl(row) for row in exp], "min_expected": f(exp.min()), "v": f(v),
                "n": int(np.sum(table))})
out["chi2"] = chi

# Two proportions, group 2 against reference group 1:
#  - Wilson (1927) intervals: statsmodels proportion_confint(method="wilson");
#  - Newcombe (1998) method 10: confint_proportions_2indep(method="newcomb",
#    compare="diff"), checked against Newcombe's formula below;
#  - Katz et al. (1978) log interval of the risk ratio: compare="ratio",
#    method="log"; Woolf (1955) logit interval of the odds ratio:
#    compare="odds-ratio", method="logit" (no 0.5 added), both checked
#    against the published formulas with scipy.stats.norm;
#  - pooled z-test: statsmodels proportions_ztest([x2, x1], [n2, n1]).
props = []
for x1, n1, x2, n2, level in PROPORTIONS:
    alpha = 1 - level
    z = st.norm.isf(alpha / 2)
    l1, u1 = proportion_confint(x1, n1, alpha=alpha, method="wilson")
    l2, u2 = proportion_confint(x2, n2, alpha=alpha, method="wilson")
    p1, p2 = x1 / n1, x2 / n2
    dlo, dhi = confint_proportions_2indep(x2, n2, x1, n1, method="newcomb", compare="diff", alpha=alpha)
    # Newcombe (1998), Statistics in Medicine 17:873-890, method 10
    assert close(dlo, (p2 - p1) - math.sqrt((p2 - l2) ** 2 + (u1 - p1) ** 2))
    assert close(dhi, (p2 - p1) + math.sqrt((u2 - p2) ** 2 + (p1 - l1) ** 2))
    rlo, rhi = confint_proportions_2indep(x2, n2, x1, n1, method="log", compare="ratio", alpha=alpha)
    # Katz, Baptista, Azen and Pike (1978), Biometrics 34:469-474
    se = math.sqrt(1 / x2 - 1 / n2 + 1 / x1 - 1 / n1)
    assert close(rlo, (p2 / p1) * math.exp(-z * se)) and close(rhi, (p2 / p1) * math.exp(z * se))
    olo, ohi = confint_proportions_2indep(x2, n2, x1, n1, method="logit", compare="odds-ratio", alpha=alpha)
    # Woolf (1955), Annals of Human Genetics 19:251-253
    orr = (x2 / (n2 - x2)) / (x1 / (n1 - x1))
    se = math.sqrt(1 / x1 + 1 / (n1 - x1) + 1 / x2 + 1 / (n2 - x2))
    assert close(olo, orr * math.exp(-z * se)) and close(ohi, orr * math.exp(z * se))
    zs, pz = proportions_ztest([x2, x1], [n2, n1])
    props.append({"x1": x1, "n1": n1, "x2": x2, "n2": n2, "level": level,
                  "wilson1": fl([l1, u1]), "wilson2": fl([l2, u2]),
                  "diff": f(p2 - p1), "diff_low": f(dlo), "diff_high": f(dhi),
                  "risk_ratio": f(p2 / p1), "risk_low": f(rlo), "risk_high": f(rhi),
                  "odds_ratio": f(orr), "odds_low": f(olo), "odds_high": f(ohi),
                  "z": f(zs), "p": f(pz)})
out["proportions"] = props
out["newcombe_zero"] = [
    {"x1": x1, "n1": n1, "x2": x2, "n2": n2, "level": lv, "diff": f(x2 / n2 - x1 / n1),
     "ci": fl(confint_proportions_2indep(x2, n2, x1, n1, method="newcomb", compare="diff", alpha=1 - lv))}
    for x1, n1, x2, n2, lv in NEWCOMBE_ZERO]
out["wilson"] = [{"x": x, "n": n, "level": lv,
                  "ci": fl(proportion_confint(x, n, alpha=1 - lv, method="wilson"))}
                 for x, n, lv in WILSON]

# Correlation: scipy.stats.pearsonr (r, p, and its Fisher z
# confidence_interval) and scipy.stats.spearmanr (average ranks for ties).
corr = []
for name, x, y, level in CORRELATION:
    r = st.pearsonr(x, y)
    ci = r.confidence_interval(confidence_level=level)
    corr.append({"name": name, "x": fl(x), "y": fl(y), "level": level, "r": f(r.statistic),
                 "p": f(r.pvalue), "low": f(ci.low), "high": f(ci.high),
                 "rho": f(st.spearmanr(x, y).correlation)})
out["correlation"] = corr

# OLS: statsmodels OLS (params, bse, tvalues, pvalues, conf_int, rsquared,
# rsquared_adj, fvalue, f_pvalue, mse_resid), OLSInfluence (cooks_distance,
# hat_matrix_diag) and get_prediction().summary_frame (obs_ci_*, mean_ci_*).
fits = []
for name, y, xs, intercept, level, newx in OLS:
    c = SHIFTED.get(name, 0)
    X = np.column_stack([shift(x, c) for x in xs])
    if intercept:
        X = sm.add_constant(X, has_constant="add")
    res = sm.OLS(np.array(y), X).fit()
    infl = res.get_influence()
    params, cov = np.array(res.params), np.array(res.cov_params())
    if c:
        # back to the unshifted predictors: b0 = b0' - c·Σb_j, Cov = T Cov' Tᵀ
        T = np.eye(len(params))
        T[0, 1:] = -c
        params, cov = T @ params, T @ cov @ T.T
    se = np.sqrt(np.diag(cov))
    tv = params / se
    pv = 2 * st.t.sf(np.abs(tv), res.df_resid)
    crit = st.t.ppf(1 - (1 - level) / 2, res.df_resid)
    if not c:
        # unshifted: the library's own values
        se, tv, pv = np.array(res.bse), np.array(res.tvalues), np.array(res.pvalues)
        ci = res.conf_int(alpha=1 - level)
    else:
        ci = np.column_stack([params - crit * se, params + crit * se])
    N = np.array([shift(nx, c) for nx in newx])
    if intercept:
        N = sm.add_constant(N, has_constant="add")
    frame = res.get_prediction(N).summary_frame(alpha=0.05)
    fits.append({
        "name": name, "y": y, "xs": xs, "intercept": intercept, "level": level,
        "coef": fl(params), "se": fl(se), "t": fl(tv), "p": fl(pv),
        "low": fl(ci[:, 0]), "high": fl(ci[:, 1]),
        "r2": f(res.rsquared), "adj_r2": f(res.rsquared_adj), "f": f(res.fvalue), "f_p": f(res.f_pvalue),
        "sigma": f(math.sqrt(res.mse_resid)), "df_resid": int(res.df_resid),
        "cooks": fl(infl.cooks_distance[0]), "leverage": fl(infl.hat_matrix_diag),
        "predict": [{"x": nx, "fit": f(frame["mean"].iloc[i]),
                     "obs_low": f(frame["obs_ci_lower"].iloc[i]), "obs_high": f(frame["obs_ci_upper"].iloc[i]),
                     "mean_low": f(frame["mean_ci_lower"].iloc[i]), "mean_high": f(frame["mean_ci_upper"].iloc[i])}
                    for i, nx in enumerate(newx)],
    })
out["ols"] = fits

# Distributions: scipy.stats t, f, chi2 and norm.
T_VALUES = [0.1, 1.0, 2.5, 5.0, 12.0, 40.0]
DFS = [1.0, 2.5, 7.0, 30.0, 1000.0, 100000.0]
out["dist"] = {
    "t_two_sided": [[t, df, f(2 * st.t.sf(t, df))] for t in T_VALUES for df in DFS],
    "t_sf": [[t, df, f(st.t.sf(t, df))] for t in [-2.0, -0.5, 0.3, 3.0] for df in [3.0, 17.5]],
    "t_ppf": [[p, df, f(t_crit(p, df))] for p in [0.95, 0.975, 0.995] for df in DFS],
    "f_sf": [[x, d1, d2, f(st.f.sf(x, d1, d2))] for x in [0.2, 1.0, 3.7, 25.0, 2000.0]
             for d1, d2 in [(1, 10), (3, 20), (8, 180), (10, 71), (2.5, 7.5)]],
    "chi2_sf": [[x, k, f(st.chi2.sf(x, k))] for x in [0.05, 1.0, 4.0, 15.0, 80.0] for k in [1.0, 2.0, 6.0, 12.0]],
    "norm_two_sided": [[z, f(2 * st.norm.sf(z))] for z in [0.0, 0.5, 1.96, 3.0, 6.0, 10.0]],
    "norm_ppf": [[p, f(st.norm.ppf(p))] for p in [0.5, 0.9, 0.95, 0.975, 0.995, 0.9995]],
}

# Bins: numpy.histogram_bin_edges for the rules (its number of bins) and for
# equal-width counts (its edges), numpy.histogram for the counts (the same
# left-closed, last-closed convention).
bins = []
for name, x, counts in BINS:
    a = np.array(x)
    rules = {}
    n, ptp = len(a), np.ptp(a)
    widths = {"sturges": ptp / (np.log2(n) + 1),  # numpy's documented rule widths
              "scott": (24 * np.pi ** 0.5 / n) ** (1 / 3) * np.std(a),
              "fd": 2 * st.iqr(a) / n ** (1 / 3)}
    for rule in ["sturges", "scott", "fd"]:
        rules[rule] = len(np.histogram_bin_edges(a, bins=rule)) - 1
        ratio = ptp / widths[rule]
        # the count is ceil(range/width): keep the inputs away from ties
        assert rules[rule] == math.ceil(ratio) and abs(ratio - round(ratio)) > 1e-6, (name, rule, ratio)
    eq = []
    for k in counts:
        e = np.histogram_bin_edges(a, bins=k)
        eq.append({"count": k, "edges": fl(e), "counts": [int(c) for c in np.histogram(a, bins=e)[0]]})
    bins.append({"name": name, "x": x, "rule_bins": rules, "equal": eq})
out["bins"] = bins

with open(OUT, "w") as fh:
    json.dump(out, fh, indent=1, sort_keys=True)
    fh.write("\n")
print("wrote", OUT)
