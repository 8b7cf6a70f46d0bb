package stats

import "math"

// Proportions compares the share of successes in two groups: group 1 is
// the reference, group 2 the other, and every contrast is 2 against 1.
type Proportions struct {
	X1, N1, X2, N2 int
	P1, P2         float64 // shares as fractions (0.425, not 42.5)
	Diff           float64 // P2 - P1
	DiffLow        float64 // Newcombe (1998) hybrid score interval of Diff
	DiffHigh       float64
	RiskRatio      float64 // P2/P1
	RiskLow        float64 // Katz et al. (1978) log interval
	RiskHigh       float64
	OddsRatio      float64 // (x2/(n2-x2)) / (x1/(n1-x1))
	OddsLow        float64 // Woolf (1955) logit interval
	OddsHigh       float64
	Z              float64 // pooled two-proportion z statistic, positive when P2 > P1
	P              float64 // two-sided p-value of Z
	Reason         Reasons
}

// Wilson is the Wilson (1927) score interval for a binomial proportion x/n
// at the given level, without continuity correction:
// (x + z²/2 ± z√(x(n-x)/n + z²/4)) / (n + z²). NaN for n < 1, x outside
// [0, n] or a level outside (0, 1).
func Wilson(x, n int, level float64) (low, high float64) {
	z := zCrit(level)
	if n < 1 || x < 0 || x > n || math.IsNaN(z) {
		return math.NaN(), math.NaN()
	}
	nf, xf := float64(n), float64(x)
	z2 := z * z
	centre := (xf + z2/2) / (nf + z2)
	half := z * math.Sqrt(xf*(nf-xf)/nf+z2/4) / (nf + z2)
	low, high = centre-half, centre+half
	// the exact ends at x = 0 and x = n
	if x == 0 {
		low = 0
	}
	if x == n {
		high = 1
	}
	return math.Max(low, 0), math.Min(high, 1)
}

// TwoProportions compares x2/n2 with the reference x1/n1 at the given
// level (e.g. 0.95):
//
//   - Diff = p2 - p1 with Newcombe's (1998) hybrid score interval, his
//     method 10, built from the Wilson intervals (l1, u1) and (l2, u2):
//     Diff - √((p2-l2)² + (u1-p1)²) to Diff + √((u2-p2)² + (p1-l1)²);
//   - RiskRatio = p2/p1 with the Katz et al. (1978) interval
//     exp(ln RR ± z√(1/x2 - 1/n2 + 1/x1 - 1/n1));
//   - OddsRatio with Woolf's (1955) interval
//     exp(ln OR ± z√(1/x1 + 1/(n1-x1) + 1/x2 + 1/(n2-x2)));
//   - Z, the pooled two-proportion z-test, (p2 - p1)/√(p̄(1-p̄)(1/n1+1/n2)),
//     and its two-sided normal p-value (equal to Pearson's chi-square
//     without continuity correction on the 2×2 table).
//
// No 0.5 correction is added to empty cells: a ratio or interval that an
// empty cell leaves undefined is NaN and Reason says why (for example "no
// successes in the reference group").
func TwoProportions(x1, n1, x2, n2 int, level float64) Proportions {
	nan := math.NaN()
	r := Proportions{X1: x1, N1: n1, X2: x2, N2: n2,
		P1: nan, P2: nan, Diff: nan, DiffLow: nan, DiffHigh: nan,
		RiskRatio: nan, RiskLow: nan, RiskHigh: nan,
		OddsRatio: nan, OddsLow: nan, OddsHigh: nan, Z: nan, P: nan}
	all := []string{"P1", "P2", "Diff", "DiffLow", "DiffHigh", "RiskRatio", "RiskLow", "RiskHigh", "OddsRatio", "OddsLow", "OddsHigh", "Z", "P"}
	if x1 < 0 || x2 < 0 || x1 > n1 || x2 > n2 {
		r.Reason.set("a success count is negative or larger than its group", all...)
		return r
	}
	if n1 == 0 || n2 == 0 {
		if n1 > 0 {
			r.P1 = float64(x1) / float64(n1)
		}
		if n2 > 0 {
			r.P2 = float64(x2) / float64(n2)
		}
		why := "the reference group has no observations"
		if n2 == 0 {
			why = "the comparison group has no observations"
		}
		if n1 == 0 && n2 == 0 {
			why = "neither group has observations"
		}
		r.Reason.set(why, all...)
		if n1 > 0 {
			delete(r.Reason, "P1")
		}
		if n2 > 0 {
			delete(r.Reason, "P2")
		}
		return r
	}
	f1, g1, f2, g2 := float64(x1), float64(n1), float64(x2), float64(n2)
	p1, p2 := f1/g1, f2/g2
	r.P1, r.P2 = p1, p2
	r.Diff = p2 - p1
	z := zCrit(level)
	badLevel := math.IsNaN(z)
	if badLevel {
		r.Reason.set("the confidence level must lie between 0 and 1", "DiffLow", "DiffHigh", "RiskLow", "RiskHigh", "OddsLow", "OddsHigh")
	} else {
		l1, u1 := Wilson(x1, n1, level)
		l2, u2 := Wilson(x2, n2, level)
		r.DiffLow = r.Diff - math.Sqrt((p2-l2)*(p2-l2)+(u1-p1)*(u1-p1))
		r.DiffHigh = r.Diff + math.Sqrt((u2-p2)*(u2-p2)+(p1-l1)*(p1-l1))
	}

	// risk ratio
	switch {
	case x1 == 0 && x2 == 0:
		r.Reason.set("neither group has successes", "RiskRatio", "RiskLow", "RiskHigh")
	case x1 == 0:
		r.Reason.set("no successes in the reference group", "RiskRatio", "RiskLow", "RiskHigh")
	default:
		r.RiskRatio = p2 / p1
		if x2 == 0 {
			r.Reason.set("no successes in the comparison group", "RiskLow", "RiskHigh")
		} else if !badLevel {
			se := math.Sqrt(1/f2 - 1/g2 + 1/f1 - 1/g1)
			lr := math.Log(r.RiskRatio)
			r.RiskLow, r.RiskHigh = math.Exp(lr-z*se), math.Exp(lr+z*se)
		}
	}

	// odds ratio
	a, b, c, d := f2, g2-f2, f1, g1-f1 // other: successes, failures; reference: successes, failures
	switch {
	case c == 0 && a == 0:
		r.Reason.set("neither group has successes", "OddsRatio", "OddsLow", "OddsHigh")
	case d == 0 && b == 0:
		r.Reason.set("every member of both groups is a success", "OddsRatio", "OddsLow", "OddsHigh")
	case c == 0:
		r.Reason.set("no successes in the reference group", "OddsRatio", "OddsLow", "OddsHigh")
	case b == 0:
		r.Reason.set("every member of the comparison group is a success", "OddsRatio", "OddsLow", "OddsHigh")
	default:
		r.OddsRatio = (a * d) / (b * c)
		switch {
		case a == 0:
			r.Reason.set("no successes in the comparison group", "OddsLow", "OddsHigh")
		case d == 0:
			r.Reason.set("every member of the reference group is a success", "OddsLow", "OddsHigh")
		case !badLevel:
			se := math.Sqrt(1/a + 1/b + 1/c + 1/d)
			lo := math.Log(r.OddsRatio)
			r.OddsLow, r.OddsHigh = math.Exp(lo-z*se), math.Exp(lo+z*se)
		}
	}

	// pooled z-test
	pp := (f1 + f2) / (g1 + g2)
	if pp == 0 || pp == 1 {
		why := "neither group has successes"
		if pp == 1 {
			why = "every member of both groups is a success"
		}
		r.Reason.set(why, "Z", "P")
	} else {
		r.Z = r.Diff / math.Sqrt(pp*(1-pp)*(1/g1+1/g2))
		r.P = normTwoSided(r.Z)
	}
	return r
}
