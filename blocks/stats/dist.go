package stats

import (
	"math"

	"gonum.org/v1/gonum/mathext"
	"gonum.org/v1/gonum/stat/distuv"
)

// The distribution functions below wrap gonum. gonum's distuv.F.Survival
// and distuv.Normal.Survival are computed as 1 - CDF, which loses every
// digit of a small p-value, so the upper tails of F and the normal are taken
// directly from the regularised incomplete beta function and erfc (Abramowitz
// and Stegun 26.6.2 and 26.2.29); Student's t and chi-square use distuv.

// tSurvival is P(T > t) for Student's t with df degrees of freedom.
func tSurvival(t, df float64) float64 {
	if math.IsNaN(t) || !(df > 0) {
		return math.NaN()
	}
	return distuv.StudentsT{Mu: 0, Sigma: 1, Nu: df}.Survival(t)
}

// tTwoSided is the two-sided p-value P(|T| >= |t|).
func tTwoSided(t, df float64) float64 {
	if math.IsNaN(t) || !(df > 0) {
		return math.NaN()
	}
	if math.IsInf(t, 0) {
		return 0
	}
	// 2·P(T > |t|) = I_{df/(df+t²)}(df/2, 1/2), Abramowitz and Stegun 26.7.1.
	return mathext.RegIncBeta(df/2, 0.5, df/(df+t*t))
}

// tCrit is the two-sided critical value t such that P(|T| <= t) = level.
// distuv's quantile (an inverse incomplete beta function) is good to only
// about 1e-8 relative, so it is polished by Newton's method on the upper
// tail, whose incomplete beta evaluation is accurate to near machine
// precision.
func tCrit(level, df float64) float64 {
	if !(level > 0 && level < 1) || !(df > 0) {
		return math.NaN()
	}
	d := distuv.StudentsT{Mu: 0, Sigma: 1, Nu: df}
	q := (1 - level) / 2
	x := d.Quantile(1 - q)
	for i := 0; i < 6; i++ {
		pdf := d.Prob(x)
		if !(pdf > 0) || math.IsInf(x, 0) {
			break
		}
		dx := (tSurvival(x, df) - q) / pdf
		x += dx
		if math.Abs(dx) <= 1e-15*math.Abs(x) {
			break
		}
	}
	return x
}

// zCrit is the two-sided standard normal critical value for level.
func zCrit(level float64) float64 {
	if !(level > 0 && level < 1) {
		return math.NaN()
	}
	return distuv.UnitNormal.Quantile(1 - (1-level)/2)
}

// normTwoSided is P(|Z| >= |z|) for a standard normal Z.
func normTwoSided(z float64) float64 {
	if math.IsNaN(z) {
		return math.NaN()
	}
	return math.Erfc(math.Abs(z) / math.Sqrt2)
}

// fSurvival is P(F > f) for Fisher's F with d1 and d2 degrees of freedom:
// I_{d2/(d2+d1 f)}(d2/2, d1/2).
func fSurvival(f, d1, d2 float64) float64 {
	if math.IsNaN(f) || !(d1 > 0) || !(d2 > 0) {
		return math.NaN()
	}
	if f <= 0 {
		return 1
	}
	if math.IsInf(f, 1) {
		return 0
	}
	return mathext.RegIncBeta(d2/2, d1/2, d2/(d2+d1*f))
}

// chi2Survival is P(X > x) for chi-square with k degrees of freedom.
func chi2Survival(x, k float64) float64 {
	if math.IsNaN(x) || !(k > 0) {
		return math.NaN()
	}
	if math.IsInf(x, 1) {
		return 0
	}
	return distuv.ChiSquared{K: k}.Survival(x)
}
