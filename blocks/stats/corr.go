package stats

import (
	"math"
	"sort"
)

// Correlation is Pearson's product-moment correlation with its inference.
type Correlation struct {
	N         int     // complete pairs
	R         float64 // Pearson's r
	Low, High float64 // Fisher z interval at the requested level
	T         float64 // r√((n-2)/(1-r²))
	P         float64 // two-sided, Student t with n - 2 degrees of freedom
	Reason    Reasons
}

// pairs keeps the indices where both x and y are present.
func pairs(x, y Values) (Values, Values) {
	if x.Missing() == 0 && y.Missing() == 0 {
		return x, y
	}
	idx := make([]int, 0, x.Len())
	for i := range x.D {
		if !math.IsNaN(x.D[i]) && !math.IsNaN(y.D[i]) {
			idx = append(idx, i)
		}
	}
	return x.Subset(idx), y.Subset(idx)
}

// crossMoments returns Σ(x-x̄)², Σ(y-ȳ)², Σ(x-x̄)(y-ȳ) by the two-pass
// algorithm in double-double arithmetic on the shifted values.
func crossMoments(x, y Values) (sxx, syy, sxy dd) {
	mx, my := centralMoments(x), centralMoments(y)
	var s ddSum
	for i := range x.D {
		s.addDD(ddMul(ddSub(x.dd(i), mx.mean), ddSub(y.dd(i), my.mean)))
	}
	return mx.ss, my.ss, s.s
}

// Pearson is Pearson's (1896) correlation coefficient r of the complete
// pairs of x and y, the two-sided p-value of t = r√((n-2)/(1-r²)) with n - 2
// degrees of freedom (scipy.stats.pearsonr), and Fisher's (1915) z
// interval tanh(atanh r ± z_crit/√(n-3)) at level. r is NaN when x or y
// is constant or n < 2; the p-value needs n >= 3 and the interval n >= 4.
func Pearson(x, y Values, level float64) Correlation {
	nan := math.NaN()
	c := Correlation{R: nan, Low: nan, High: nan, T: nan, P: nan}
	if x.Len() != y.Len() {
		c.Reason.set("x and y have different lengths", "R", "Low", "High", "T", "P")
		return c
	}
	x, y = pairs(x, y)
	c.N = x.Len()
	if c.N < 2 {
		c.Reason.set("a correlation needs at least two complete pairs", "R", "Low", "High", "T", "P")
		return c
	}
	sxx, syy, sxy := crossMoments(x, y)
	if sxx.hi == 0 || syy.hi == 0 {
		why := "x is constant"
		if syy.hi == 0 {
			why = "y is constant"
		}
		c.Reason.set(why, "R", "Low", "High", "T", "P")
		return c
	}
	r := ddDiv(sxy, ddSqrt(ddMul(sxx, syy))).float()
	r = math.Max(-1, math.Min(1, r))
	c.R = r
	n := float64(c.N)
	if c.N < 3 {
		c.Reason.set("the test needs at least three pairs", "T", "P")
	} else {
		if math.Abs(r) == 1 {
			c.T = math.Copysign(math.Inf(1), r)
			c.P = 0
		} else {
			c.T = r * math.Sqrt((n-2)/((1-r)*(1+r)))
			c.P = tTwoSided(c.T, n-2)
		}
	}
	if c.N < 4 {
		c.Reason.set("the Fisher z interval needs at least four pairs", "Low", "High")
	} else if z := zCrit(level); math.IsNaN(z) {
		c.Reason.set("the confidence level must lie between 0 and 1", "Low", "High")
	} else {
		zr := math.Atanh(r)
		h := z / math.Sqrt(n-3)
		c.Low, c.High = math.Tanh(zr-h), math.Tanh(zr+h)
	}
	return c
}

// Ranks gives the ranks 1..n of the non-missing values, ties receiving
// the average of the ranks they span (the "fractional ranking" used by
// Spearman's rho); missing values get NaN.
func Ranks(v Values) []float64 {
	n := v.Len()
	idx := make([]int, 0, n)
	for i := range v.D {
		if !math.IsNaN(v.D[i]) {
			idx = append(idx, i)
		}
	}
	key := func(i int) dd { return v.dd(i) }
	less := func(a, b dd) bool { return a.hi < b.hi || (a.hi == b.hi && a.lo < b.lo) }
	sort.SliceStable(idx, func(a, b int) bool { return less(key(idx[a]), key(idx[b])) })
	ranks := make([]float64, n)
	for i := range ranks {
		ranks[i] = math.NaN()
	}
	for i := 0; i < len(idx); {
		j := i + 1
		for j < len(idx) && key(idx[j]) == key(idx[i]) {
			j++
		}
		avg := float64(i+j+1) / 2 // mean of the ranks i+1 .. j
		for k := i; k < j; k++ {
			ranks[idx[k]] = avg
		}
		i = j
	}
	return ranks
}

// Spearman is Spearman's (1904) rank correlation rho of the complete pairs:
// Pearson's r of the average ranks, so ties are handled as
// scipy.stats.spearmanr does. NaN when either variable is constant or
// fewer than two pairs remain.
func Spearman(x, y Values) float64 {
	if x.Len() != y.Len() {
		return math.NaN()
	}
	x, y = pairs(x, y)
	if x.Len() < 2 {
		return math.NaN()
	}
	return Pearson(Plain(Ranks(x)), Plain(Ranks(y)), 0.95).R
}
