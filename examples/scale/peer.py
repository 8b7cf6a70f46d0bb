#!/usr/bin/python3
"""The peer of the scale benchmark: the work of examples/scale/scale.md done
the way an analyst would do it with pandas, scipy and matplotlib, to time
candor against (examples/scale/harness runs both).

    /usr/bin/python3 examples/scale/peer.py DATA.csv OUTDIR

It reads the invented member data of Tern Valley Cycles, computes the same
statistics as the report's ten blocks (counts and percentages, summaries
with quartiles and t intervals, a crosstab with its chi-square test, Welch's
t-test with Cohen's d, two proportions with Wilson, Newcombe, Katz and Woolf
intervals and the z-test, an OLS fit with standard errors and Cook's
distances, and means by month and plan), writes them to OUTDIR/stats.json
and saves the same ten figures as SVG in OUTDIR/figures/. It uses Debian's
python3-pandas, python3-scipy and python3-matplotlib.
"""
import json
import math
import os
import sys

import numpy as np
import pandas as pd
import matplotlib

matplotlib.use("svg")
import matplotlib.pyplot as plt  # noqa: E402
from scipy import stats  # noqa: E402

Z95 = stats.norm.ppf(0.975)


def sturges_edges(x):
    """Sturges' width rounded up to a nice step (1, 2, 2.5 or 5 x 10^k),
    edges on multiples of the step: the binning candor's reports use."""
    x = np.asarray(x)
    lo, hi = float(x.min()), float(x.max())
    if lo == hi:
        return np.array([lo - 0.5, hi + 0.5])
    w = (hi - lo) / (math.log2(len(x)) + 1)
    e = math.floor(math.log10(w)) - 1
    while True:
        for c in (10, 20, 25, 50):
            step = c * 10.0 ** e
            if step >= w:
                k0 = math.floor(lo / step)
                k1 = math.ceil(hi / step)
                return np.arange(k0, k1 + 1) * step
        e += 1


def frequency(col):
    s = col.dropna()
    n = len(s)
    out = {"n": n, "missing": int(col.isna().sum())}
    if pd.api.types.is_numeric_dtype(s):
        whole = np.all(np.mod(s, 1) == 0)
        if whole and s.nunique() <= 12:
            counts = s.value_counts().sort_index()
            labels = [str(v) for v in counts.index]
            values = counts.to_numpy()
            edges = None
        else:
            edges = sturges_edges(s)
            values, _ = np.histogram(s, bins=edges)
            labels = ["[%g, %g)" % (a, b) for a, b in zip(edges[:-1], edges[1:])]
    else:
        counts = s.value_counts(sort=True)  # largest first
        labels, values, edges = list(counts.index), counts.to_numpy(), None
    cum = np.cumsum(values)
    out["levels"] = [
        {"level": l, "count": int(c), "pct": 100 * c / n, "cum_count": int(k), "cum_pct": 100 * k / n}
        for l, c, k in zip(labels, values, cum)
    ]
    return out, labels, values, edges


def describe(x):
    x = x.dropna().to_numpy(dtype=float)
    n = len(x)
    mean = x.mean()
    sd = x.std(ddof=1)
    se = sd / math.sqrt(n)
    t = stats.t.ppf(0.975, n - 1)
    q1, med, q3 = np.percentile(x, [25, 50, 75])
    return {
        "n": n, "mean": mean, "sd": sd, "se": se,
        "mean_low": mean - t * se, "mean_high": mean + t * se,
        "min": x.min(), "q1": q1, "median": med, "q3": q3, "max": x.max(),
        "iqr": q3 - q1, "skewness": stats.skew(x, bias=False),
    }


def summary(df, col, by=None):
    out = dict(describe(df[col]), missing=int(df[col].isna().sum()))
    if by is not None:
        out["groups"] = {}
        for g, part in df.groupby(by, sort=False)[col]:
            out["groups"][g] = dict(describe(part), missing=int(part.isna().sum()))
    return out


def wilson(x, n):
    p = x / n
    z2 = Z95 ** 2
    centre = (x + z2 / 2) / (n + z2)
    half = Z95 * math.sqrt(x * (n - x) / n + z2 / 4) / (n + z2)
    return max(0.0, centre - half) if x > 0 else 0.0, min(1.0, centre + half) if x < n else 1.0


def two_proportions(x1, n1, x2, n2):
    p1, p2 = x1 / n1, x2 / n2
    l1, u1 = wilson(x1, n1)
    l2, u2 = wilson(x2, n2)
    d = p2 - p1
    rr = p2 / p1
    se_rr = math.sqrt(1 / x2 - 1 / n2 + 1 / x1 - 1 / n1)
    odds = (x2 / (n2 - x2)) / (x1 / (n1 - x1))
    se_or = math.sqrt(1 / x1 + 1 / (n1 - x1) + 1 / x2 + 1 / (n2 - x2))
    pool = (x1 + x2) / (n1 + n2)
    z = d / math.sqrt(pool * (1 - pool) * (1 / n1 + 1 / n2))
    return {
        "diff": 100 * d,
        "diff_low": 100 * (d - math.sqrt((p2 - l2) ** 2 + (u1 - p1) ** 2)),
        "diff_high": 100 * (d + math.sqrt((u2 - p2) ** 2 + (p1 - l1) ** 2)),
        "ratio": rr, "ratio_low": rr * math.exp(-Z95 * se_rr), "ratio_high": rr * math.exp(Z95 * se_rr),
        "odds_ratio": odds, "odds_low": odds * math.exp(-Z95 * se_or), "odds_high": odds * math.exp(Z95 * se_or),
        "z": z, "p": 2 * stats.norm.sf(abs(z)),
    }


def ols(y, X):
    """OLS by QR with an intercept: coefficients, SEs, t, p, CIs, R², F,
    residual SE and Cook's distances."""
    n, k = X.shape
    A = np.column_stack([np.ones(n), X])
    q, r = np.linalg.qr(A)
    coef = np.linalg.solve(r, q.T @ y)
    fitted = A @ coef
    resid = y - fitted
    df = n - k - 1
    sigma2 = resid @ resid / df
    rinv = np.linalg.inv(r)
    se = np.sqrt(np.sum(rinv ** 2, axis=1) * sigma2)
    t = coef / se
    tc = stats.t.ppf(0.975, df)
    sst = np.sum((y - y.mean()) ** 2)
    r2 = 1 - resid @ resid / sst
    f = (r2 / k) / ((1 - r2) / df)
    lev = np.sum(q ** 2, axis=1)
    cooks = resid ** 2 / ((k + 1) * sigma2) * lev / (1 - lev) ** 2
    return {
        "n": n, "coef": coef.tolist(), "se": se.tolist(), "t": t.tolist(),
        "p": (2 * stats.t.sf(np.abs(t), df)).tolist(),
        "low": (coef - tc * se).tolist(), "high": (coef + tc * se).tolist(),
        "r2": r2, "adj_r2": 1 - (1 - r2) * (n - 1) / df, "f": f, "f_p": stats.f.sf(f, k, df),
        "sigma": math.sqrt(sigma2), "df_resid": df,
        "influential": int(np.sum(cooks > 4 / n)), "max_cooks": float(cooks.max()),
    }, fitted


def save(fig, outdir, name):
    fig.savefig(os.path.join(outdir, "figures", name + ".svg"))
    plt.close(fig)


def bars(outdir, name, title, labels, values, xlabel, ylabel="Count"):
    fig, ax = plt.subplots(figsize=(6.4, 4.0))
    ax.bar([str(l) for l in labels], values, color="#0072B2")
    ax.set_title(title, loc="left")
    ax.set_xlabel(xlabel)
    ax.set_ylabel(ylabel)
    ax.set_ylim(bottom=0)
    save(fig, outdir, name)


def histogram(outdir, name, title, edges, counts, xlabel):
    fig, ax = plt.subplots(figsize=(6.4, 4.0))
    ax.stairs(counts, edges, fill=True, color="#0072B2")
    ax.set_title(title, loc="left")
    ax.set_xlabel(xlabel)
    ax.set_ylabel("Count")
    ax.set_ylim(bottom=0)
    save(fig, outdir, name)


def main(path, outdir):
    os.makedirs(os.path.join(outdir, "figures"), exist_ok=True)
    df = pd.read_csv(path)
    out = {}

    # plans, regions: frequencies with bar charts.
    for name, col, title in (("plans", "plan", "Member-months by plan"), ("regions", "region", "Member-months by region")):
        out[name], labels, values, _ = frequency(df[col])
        bars(outdir, name, title, labels, values, col)

    # ages: a summary with its histogram.
    out["ages"] = summary(df, "age")
    age = df["age"].dropna()
    edges = sturges_edges(age)
    counts, _ = np.histogram(age, bins=edges)
    histogram(outdir, "ages", "Age of members (years)", edges, counts, "age")

    # rides: a binned frequency of a number column.
    out["rides"], labels, values, edges = frequency(df["visits"])
    histogram(outdir, "rides", "Rides in the month", edges, values, "visits")

    # spend by plan: summaries per group with Tukey box plots.
    out["spend"] = summary(df, "spend", by="plan")
    groups = [(g, part.dropna().to_numpy()) for g, part in df.groupby("plan", sort=False)["spend"]]
    fig, ax = plt.subplots(figsize=(6.4, 4.0))
    ax.boxplot([v for _, v in groups], labels=[g for g, _ in groups], whis=1.5)
    ax.set_title("Spend in the month by plan (euro)", loc="left")
    ax.set_xlabel("plan")
    ax.set_ylabel("spend")
    save(fig, outdir, "spend")

    # renewal: crosstab with chi-square and Cramér's V, 100% stacked bars.
    ct = pd.crosstab(df["plan"], df["renewed"])
    chi2, p, dof, expected = stats.chi2_contingency(ct.to_numpy(), correction=False)
    n = ct.to_numpy().sum()
    out["renewal"] = {
        "n": int(n), "chi2": chi2, "df": int(dof), "p": p,
        "v": math.sqrt(chi2 / (n * (min(ct.shape) - 1))), "min_expected": float(expected.min()),
        "counts": ct.to_dict(), "row_pct": (100 * ct.div(ct.sum(axis=1), axis=0)).to_dict(),
        "col_pct": (100 * ct.div(ct.sum(axis=0), axis=1)).to_dict(), "pct": (100 * ct / n).to_dict(),
    }
    rows = 100 * ct.div(ct.sum(axis=1), axis=0)
    fig, ax = plt.subplots(figsize=(6.4, 4.0))
    bottom = np.zeros(len(rows))
    for c in rows.columns:
        ax.bar(rows.index, rows[c], bottom=bottom, label=c)
        bottom += rows[c].to_numpy()
    ax.set_ylim(0, 100)
    ax.legend(title="renewed")
    ax.set_title("Renewal by plan", loc="left")
    save(fig, outdir, "renewal")

    # spend-renewed: two means, Welch's t-test and interval, Cohen's d.
    a = df.loc[df["renewed"] == "no", "spend"].dropna().to_numpy()
    b = df.loc[df["renewed"] == "yes", "spend"].dropna().to_numpy()
    w = stats.ttest_ind(b, a, equal_var=False)
    va, vb = a.var(ddof=1) / len(a), b.var(ddof=1) / len(b)
    dfw = (va + vb) ** 2 / (va ** 2 / (len(a) - 1) + vb ** 2 / (len(b) - 1))
    diff = b.mean() - a.mean()
    half = stats.t.ppf(0.975, dfw) * math.sqrt(va + vb)
    pooled = math.sqrt(((len(a) - 1) * a.var(ddof=1) + (len(b) - 1) * b.var(ddof=1)) / (len(a) + len(b) - 2))
    sa, sb = describe(pd.Series(a)), describe(pd.Series(b))
    out["spend-renewed"] = {
        "no": sa, "yes": sb, "diff": diff, "diff_low": diff - half, "diff_high": diff + half,
        "t": w.statistic, "df": dfw, "p": w.pvalue, "d": diff / pooled, "ratio": b.mean() / a.mean(),
    }
    fig, ax = plt.subplots(figsize=(6.4, 4.0))
    for i, s in enumerate((sa, sb)):
        ax.errorbar([s["mean"]], [i], xerr=[[s["mean"] - s["mean_low"]], [s["mean_high"] - s["mean"]]], fmt="o", capsize=5)
    ax.set_yticks([0, 1], ["no", "yes"])
    ax.set_title("Spend of members who renewed and who did not (euro)", loc="left")
    save(fig, outdir, "spend-renewed")

    # renewal-channel: two proportions among app and web members.
    sub = df[df["channel"].isin(["app", "web"])]
    x = sub.groupby("channel")["renewed"].agg(lambda s: int((s == "yes").sum()))
    ns = sub.groupby("channel")["renewed"].count()
    res = two_proportions(int(x["app"]), int(ns["app"]), int(x["web"]), int(ns["web"]))
    for g in ("app", "web"):
        lo, hi = wilson(int(x[g]), int(ns[g]))
        res[g] = {"n": int(ns[g]), "successes": int(x[g]), "pct": 100 * x[g] / ns[g], "pct_low": 100 * lo, "pct_high": 100 * hi}
    out["renewal-channel"] = res
    bars(outdir, "renewal-channel", "Renewal of members who joined through the app and the web",
         ["app", "web"], [res["app"]["pct"], res["web"]["pct"]], "channel", "% yes")

    # spend-model: OLS of spend on visits and age, observed against fitted.
    cc = df[["spend", "visits", "age"]].dropna()
    fit, fitted = ols(cc["spend"].to_numpy(dtype=float), cc[["visits", "age"]].to_numpy(dtype=float))
    fit["ranges"] = {c: [float(cc[c].min()), float(cc[c].max())] for c in ("visits", "age")}
    out["spend-model"] = fit
    fig, ax = plt.subplots(figsize=(6.4, 4.8))
    ax.scatter(fitted, cc["spend"], s=8, alpha=0.67, color="#0072B2")
    lo, hi = float(fitted.min()), float(fitted.max())
    ax.plot([lo, hi], [lo, hi], color="#D55E00")
    ax.set_xlabel("Fitted spend")
    ax.set_ylabel("spend")
    ax.set_title("Spend against the fitted spend", loc="left")
    save(fig, outdir, "spend-model")

    # satisfaction: mean score by month and plan, with t intervals.
    g = df.dropna(subset=["score"]).groupby(["plan", "month"], sort=True)["score"]
    agg = g.agg(["mean", "count", "std"])
    agg["half"] = stats.t.ppf(0.975, agg["count"] - 1) * agg["std"] / np.sqrt(agg["count"])
    trend = {}
    fig, ax = plt.subplots(figsize=(6.4, 4.0))
    for plan, part in agg.groupby(level=0, sort=False):
        part = part.droplevel(0).sort_index()
        trend[plan] = {
            "months": {m: {"mean": r["mean"], "n": int(r["count"]), "mean_low": r["mean"] - r["half"], "mean_high": r["mean"] + r["half"]}
                       for m, r in part.iterrows()},
            "change": part["mean"].iloc[-1] - part["mean"].iloc[0],
            "ratio": part["mean"].iloc[-1] / part["mean"].iloc[0],
        }
        ax.plot(part.index, part["mean"], marker="o", label=plan)
    ax.legend(title="plan")
    ax.set_title("Mean satisfaction score by month and plan", loc="left")
    ax.tick_params(axis="x", rotation=45)
    save(fig, outdir, "satisfaction")
    out["satisfaction"] = trend

    with open(os.path.join(outdir, "stats.json"), "w") as f:
        json.dump(out, f, indent=1, default=lambda v: v.item() if hasattr(v, "item") else str(v))


if __name__ == "__main__":
    if len(sys.argv) != 3:
        sys.exit("usage: peer.py DATA.csv OUTDIR")
    main(sys.argv[1], sys.argv[2])
