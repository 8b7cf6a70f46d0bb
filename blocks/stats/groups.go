package stats

import "math"

// WelchResult is Welch's unequal-variance t-test of two groups, with the
// difference taken as B minus A (the other group minus the reference).
type WelchResult struct {
	NA, NB       int
	MeanA, MeanB float64
	SDA, SDB     float64
	Diff         float64 // MeanB - MeanA
	SE           float64 // √(s²A/nA + s²B/nB)
	Low, High    float64 // confidence interval of Diff at the requested level
	T            float64 // Diff/SE: positive when B is larger
	DF           float64 // Welch–Satterthwaite degrees of freedom
	P            float64 // two-sided
	Reason       Reasons
}

// offsetGap is Ob - Oa as an exact double-double.
func offsetGap(ob, oa float64) dd { return ddFrom(ob, -oa) }

// meanDiff is mean(b) - mean(a) from their moments, keeping the offsets
// apart until the end.
func meanDiff(a, b Moments) dd {
	return ddAdd(ddSub(b.mean, a.mean), offsetGap(b.offset, a.offset))
}

// Welch is Welch's (1947) t-test for two independent samples with unequal
// variances: t = (x̄B - x̄A)/√(s²A/nA + s²B/nB) with the Welch–Satterthwaite
// degrees of freedom (Satterthwaite 1946), its two-sided p-value and the
// confidence interval of the difference at level (e.g. 0.95); it equals
// scipy.stats.ttest_ind(b, a, equal_var=False). Missing values are skipped.
// Groups of fewer than two values, or two groups without any spread, leave
// the test undefined (NaN, with the reason). It is
// WelchMoments(MomentsOf(a), MomentsOf(b), level).
func Welch(a, b Values, level float64) WelchResult {
	return WelchMoments(MomentsOf(a), MomentsOf(b), level)
}

// WelchMoments is Welch's (1947) t-test, as Welch computes it, for two
// samples known by their moments.
func WelchMoments(ma, mb Moments, level float64) WelchResult {
	nan := math.NaN()
	r := WelchResult{NA: ma.n, NB: mb.n, MeanA: nan, MeanB: nan, SDA: nan, SDB: nan,
		Diff: nan, SE: nan, Low: nan, High: nan, T: nan, DF: nan, P: nan}
	if ma.n > 0 {
		r.MeanA = ma.meanValue()
	}
	if mb.n > 0 {
		r.MeanB = mb.meanValue()
	}
	if ma.n == 0 || mb.n == 0 {
		r.Reason.set("a group has no values", "MeanA", "MeanB", "SDA", "SDB", "Diff", "SE", "Low", "High", "T", "DF", "P")
		if ma.n > 0 {
			delete(r.Reason, "MeanA")
		}
		if mb.n > 0 {
			delete(r.Reason, "MeanB")
		}
		return r
	}
	diff := meanDiff(ma, mb)
	r.Diff = diff.float()
	va, vb := ma.Variance(), mb.Variance()
	r.SDA, r.SDB = math.Sqrt(va), math.Sqrt(vb)
	if ma.n < 2 || mb.n < 2 {
		r.Reason.set("a group has fewer than two values, so its variance is unknown", "SE", "Low", "High", "T", "DF", "P")
		if ma.n < 2 {
			r.Reason.set("one value has no spread", "SDA")
		}
		if mb.n < 2 {
			r.Reason.set("one value has no spread", "SDB")
		}
		return r
	}
	ua, ub := va/float64(ma.n), vb/float64(mb.n)
	se2 := ua + ub
	if se2 == 0 {
		r.SE = 0
		r.Reason.set("both groups have zero variance", "Low", "High", "T", "DF", "P")
		return r
	}
	r.SE = math.Sqrt(se2)
	r.DF = se2 * se2 / (ua*ua/float64(ma.n-1) + ub*ub/float64(mb.n-1))
	r.T = r.Diff / r.SE
	r.P = tTwoSided(r.T, r.DF)
	half := tCrit(level, r.DF) * r.SE
	r.Low = ddAddF(diff, -half).float()
	r.High = ddAddF(diff, half).float()
	if math.IsNaN(half) {
		r.Reason.set("the confidence level must lie between 0 and 1", "Low", "High")
	}
	return r
}

// CohenD is Cohen's (1988) d for two independent samples, (x̄B - x̄A)/s_p,
// with the pooled standard deviation
// s_p = √(((nA-1)s²A + (nB-1)s²B)/(nA + nB - 2)). Positive when B is
// larger. NaN when nA + nB < 3 or the pooled SD is 0. It is
// CohenDMoments(MomentsOf(a), MomentsOf(b)).
func CohenD(a, b Values) float64 { return CohenDMoments(MomentsOf(a), MomentsOf(b)) }

// CohenDMoments is Cohen's (1988) d, as CohenD computes it, for two
// samples known by their moments.
func CohenDMoments(ma, mb Moments) float64 {
	if ma.n == 0 || mb.n == 0 || ma.n+mb.n < 3 {
		return math.NaN()
	}
	ss := ddAdd(ma.ss, mb.ss)
	sp := math.Sqrt(ddDivF(ss, float64(ma.n+mb.n-2)).float())
	if sp == 0 {
		return math.NaN()
	}
	return meanDiff(ma, mb).float() / sp
}

// ANOVA is the one-way analysis of variance table.
type ANOVA struct {
	Groups              int // non-empty groups
	N                   int
	SSBetween, SSWithin float64
	DFBetween, DFWithin int
	MSBetween, MSWithin float64
	F, P                float64
	R2                  float64 // SSBetween/(SSBetween + SSWithin)
	Sigma               float64 // residual SD, √MSWithin
	Means               []float64
	Ns                  []int
	GrandMean           float64
	Reason              Reasons
}

// OneWayANOVA is Fisher's one-way analysis of variance (Fisher 1925) for k
// independent groups: between- and within-group sums of squares, mean
// squares, F = MSB/MSW with (k-1, N-k) degrees of freedom and its upper
// tail p-value (scipy.stats.f_oneway), R² = SSB/SST, and the residual SD.
// Every group mean and sum of squares comes from the shifted values by the
// two-pass algorithm in double-double arithmetic; groups with different
// offsets are brought to the first group's offset exactly. Missing values
// are skipped and empty groups are left out (Means and Ns keep one entry
// per input group, NaN and 0 for an empty one). It is OneWayANOVAMoments
// of each group's MomentsOf.
func OneWayANOVA(groups []Values) ANOVA {
	ms := make([]Moments, len(groups))
	for g, v := range groups {
		ms[g] = MomentsOf(v)
	}
	return OneWayANOVAMoments(ms)
}

// OneWayANOVAMoments is Fisher's (1925) one-way analysis of variance, as
// OneWayANOVA computes it, for groups known by their moments.
func OneWayANOVAMoments(ms []Moments) ANOVA {
	nan := math.NaN()
	res := ANOVA{SSBetween: nan, SSWithin: nan, MSBetween: nan, MSWithin: nan, F: nan, P: nan, R2: nan, Sigma: nan, GrandMean: nan}
	res.Means = make([]float64, len(ms))
	res.Ns = make([]int, len(ms))
	base, haveBase := 0.0, false
	for g, m := range ms {
		res.Ns[g] = m.n
		res.Means[g] = nan
		if m.n > 0 {
			res.Means[g] = m.meanValue()
			res.Groups++
			res.N += m.n
			if !haveBase {
				base, haveBase = m.offset, true
			}
		}
	}
	all := []string{"SSBetween", "SSWithin", "MSBetween", "MSWithin", "F", "P", "R2", "Sigma", "GrandMean"}
	if res.N == 0 {
		res.Reason.set("there are no values", all...)
		return res
	}
	// group means relative to the common base offset, and the grand mean
	rel := make([]dd, len(ms))
	var tot, ssw ddSum
	for g, m := range ms {
		if m.n == 0 {
			continue
		}
		rel[g] = ddAdd(m.mean, offsetGap(m.offset, base))
		tot.addDD(ddMulF(rel[g], float64(m.n)))
		ssw.addDD(m.ss)
	}
	grand := ddDivF(tot.s, float64(res.N))
	var ssb ddSum
	for g, m := range ms {
		if m.n == 0 {
			continue
		}
		d := ddSub(rel[g], grand)
		ssb.addDD(ddMulF(ddSqr(d), float64(m.n)))
	}
	res.GrandMean = ddAddF(grand, base).float()
	res.SSBetween = ssb.s.float()
	res.SSWithin = ssw.s.float()
	res.DFBetween = res.Groups - 1
	res.DFWithin = res.N - res.Groups
	sst := ddAdd(ssb.s, ssw.s)
	if sst.hi > 0 {
		res.R2 = ddDiv(ssb.s, sst).float()
	} else {
		res.Reason.set("all values are equal", "R2")
	}
	if res.DFBetween > 0 {
		res.MSBetween = ddDivF(ssb.s, float64(res.DFBetween)).float()
	} else {
		res.Reason.set("there is only one group", "MSBetween", "F", "P")
	}
	if res.DFWithin > 0 {
		msw := ddDivF(ssw.s, float64(res.DFWithin))
		res.MSWithin = msw.float()
		res.Sigma = ddSqrt(msw).float()
	} else {
		res.Reason.set("no group has more than one value", "MSWithin", "Sigma", "F", "P")
	}
	if res.DFBetween > 0 && res.DFWithin > 0 {
		if res.MSWithin > 0 {
			res.F = ddDiv(ddDivF(ssb.s, float64(res.DFBetween)), ddDivF(ssw.s, float64(res.DFWithin))).float()
			res.P = fSurvival(res.F, float64(res.DFBetween), float64(res.DFWithin))
		} else {
			res.Reason.set("there is no variation within the groups", "F", "P")
		}
	}
	return res
}
