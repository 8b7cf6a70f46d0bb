package stats

import (
	"math"
	"sort"
)

// Reasons maps a result field name (e.g. "SD", "RiskRatio") to the reason it
// is NaN. A nil map means every field is defined.
type Reasons map[string]string

func (r *Reasons) set(reason string, fields ...string) {
	if *r == nil {
		*r = Reasons{}
	}
	for _, f := range fields {
		if _, ok := (*r)[f]; !ok {
			(*r)[f] = reason
		}
	}
}

// Summary is the descriptive summary of one sample.
type Summary struct {
	N                 int     // non-missing values
	Mean              float64 // arithmetic mean
	SD                float64 // standard deviation, denominator n - 1
	SE                float64 // standard error of the mean, SD/√n
	Min, Max          float64
	Q1, Median, Q3    float64 // Hyndman and Fan (1996) type 7 quantiles
	IQR               float64 // Q3 - Q1
	Skewness          float64 // adjusted Fisher–Pearson G1
	MeanLow, MeanHigh float64 // 95% Student t interval of the mean
	Reason            Reasons
}

// moments holds the accurately centred sums of a sample, relative to its
// offset: mean of D as a double-double and the central sums of powers.
type moments struct {
	n          int
	offset     float64
	mean       dd // mean of D (+ Lo)
	ss, s3, s4 dd // Σ(d - mean)^2, ^3, ^4
}

// centralMoments is a two-pass computation in double-double arithmetic:
// the mean of the shifted values first, then the sums of centred powers
// (the "two-pass algorithm" of Chan, Golub and LeVeque 1983, here with
// double-double sums, so that even NIST's NumAcc4 keeps its digits).
func centralMoments(v Values) moments {
	m := moments{n: v.Len(), offset: v.Offset}
	if m.n == 0 {
		return m
	}
	var s ddSum
	for i := range v.D {
		s.addDD(v.dd(i))
	}
	m.mean = ddDivF(s.s, float64(m.n))
	var s2, s3, s4 ddSum
	for i := range v.D {
		d := ddSub(v.dd(i), m.mean)
		d2 := ddSqr(d)
		s2.addDD(d2)
		s3.addDD(ddMul(d2, d))
		s4.addDD(ddSqr(d2))
	}
	m.ss, m.s3, m.s4 = s2.s, s3.s, s4.s
	return m
}

func (m moments) meanValue() float64 { return ddAddF(m.mean, m.offset).float() }

func (m moments) variance() float64 {
	if m.n < 2 {
		return math.NaN()
	}
	return ddDivF(m.ss, float64(m.n-1)).float()
}

// Mean is the arithmetic mean of the non-missing values (NaN when there are
// none), computed from the shifted values with a double-double sum.
func Mean(v Values) float64 {
	p := v.present()
	if p.Len() == 0 {
		return math.NaN()
	}
	var s ddSum
	for i := range p.D {
		s.addDD(p.dd(i))
	}
	return ddAddF(ddDivF(s.s, float64(p.Len())), p.Offset).float()
}

// Sum is the sum of the non-missing values (0 when there are none),
// accumulated in double-double arithmetic from the shifted values.
func Sum(v Values) float64 {
	p := v.present()
	var s ddSum
	for i := range p.D {
		s.addDD(p.dd(i))
	}
	return ddAdd(s.s, ddMulF(dd{p.Offset, 0}, float64(p.Len()))).float()
}

// Proportion is x/n, the share of successes as a fraction, or NaN when n
// is not positive or x lies outside [0, n].
func Proportion(x, n int) float64 {
	if n <= 0 || x < 0 || x > n {
		return math.NaN()
	}
	return float64(x) / float64(n)
}

// Variance is the sample variance with denominator n - 1 (NaN for n < 2),
// by the two-pass algorithm in double-double arithmetic.
func Variance(v Values) float64 { return centralMoments(v.present()).variance() }

// SD is the sample standard deviation, √Variance.
func SD(v Values) float64 { return math.Sqrt(Variance(v)) }

// MeanCI is the Student t confidence interval of the mean at the given
// level (e.g. 0.95): mean ± t(1-(1-level)/2, n-1)·s/√n (Student 1908).
// It is NaN for n < 2 or a level outside (0, 1).
func MeanCI(v Values, level float64) (low, high float64) {
	m := centralMoments(v.present())
	return m.meanCI(level)
}

func (m moments) meanCI(level float64) (low, high float64) {
	if m.n < 2 {
		return math.NaN(), math.NaN()
	}
	half := tCrit(level, float64(m.n-1)) * math.Sqrt(m.variance()/float64(m.n))
	low = ddAddF(ddAddF(m.mean, -half), m.offset).float()
	high = ddAddF(ddAddF(m.mean, half), m.offset).float()
	return low, high
}

// Skewness is the adjusted Fisher–Pearson standardised moment coefficient
// G1 = g1·√(n(n-1))/(n-2) with g1 = m3/m2^(3/2) and m_k the central moments
// with denominator n (Joanes and Gill 1998, "b1" adjusted as G1); it equals
// scipy.stats.skew(bias=False) and a spreadsheet's SKEW. NaN for n < 3 or
// equal values.
func Skewness(v Values) float64 { return centralMoments(v.present()).skewness() }

func (m moments) skewness() float64 {
	if m.n < 3 || m.ss.hi == 0 {
		return math.NaN()
	}
	n := float64(m.n)
	m2 := ddDivF(m.ss, n)
	m3 := ddDivF(m.s3, n)
	g1 := m3.float() / math.Pow(m2.float(), 1.5)
	return g1 * math.Sqrt(n*(n-1)) / (n - 2)
}

// Quantile is the type 7 sample quantile of Hyndman and Fan (1996) (the
// default of R and numpy, and a spreadsheet's QUARTILE.INC / PERCENTILE.INC):
// with h = (n-1)p, it interpolates linearly between the order statistics
// x[⌊h⌋] and x[⌊h⌋+1] (0-based). sorted must be in ascending order without
// NaN. It is NaN for an empty slice or p outside [0, 1].
func Quantile(sorted []float64, p float64) float64 {
	n := len(sorted)
	if n == 0 || !(p >= 0 && p <= 1) {
		return math.NaN()
	}
	h := float64(n-1) * p
	j := int(math.Floor(h))
	if j >= n-1 {
		return sorted[n-1]
	}
	f := h - float64(j)
	a, b := sorted[j], sorted[j+1]
	if f == 0 || a == b {
		return a
	}
	return a + f*(b-a)
}

// sortedD returns the shifted values (D, plus Lo when present) in
// ascending order.
func sortedD(v Values) []float64 {
	s := make([]float64, v.Len())
	for i := range s {
		s[i] = v.dd(i).float()
	}
	sort.Float64s(s)
	return s
}

// Describe summarises the non-missing values of v: n, mean, SD (n - 1),
// standard error, extremes, Hyndman and Fan (1996) type 7 quartiles, IQR,
// adjusted Fisher–Pearson skewness G1 and the 95% Student t interval of the
// mean. Mean and SD come from the two-pass algorithm on the shifted values
// in double-double arithmetic. Undefined fields are NaN and named in Reason.
func Describe(v Values) Summary {
	p := v.present()
	m := centralMoments(p)
	s := Summary{N: m.n}
	nan := math.NaN()
	if m.n == 0 {
		s.Mean, s.SD, s.SE, s.Min, s.Max, s.Q1, s.Median, s.Q3, s.IQR, s.Skewness, s.MeanLow, s.MeanHigh =
			nan, nan, nan, nan, nan, nan, nan, nan, nan, nan, nan, nan
		s.Reason.set("there are no values", "Mean", "SD", "SE", "Min", "Max", "Q1", "Median", "Q3", "IQR", "Skewness", "MeanLow", "MeanHigh")
		return s
	}
	s.Mean = m.meanValue()
	sorted := sortedD(p)
	at := func(q float64) float64 { return Quantile(sorted, q) + p.Offset }
	s.Min = sorted[0] + p.Offset
	s.Max = sorted[len(sorted)-1] + p.Offset
	s.Q1, s.Median, s.Q3 = at(0.25), at(0.5), at(0.75)
	s.IQR = Quantile(sorted, 0.75) - Quantile(sorted, 0.25) // offset cancels exactly
	if m.n < 2 {
		s.SD, s.SE, s.MeanLow, s.MeanHigh = nan, nan, nan, nan
		s.Reason.set("one value has no spread", "SD", "SE", "MeanLow", "MeanHigh")
	} else {
		s.SD = math.Sqrt(m.variance())
		s.SE = s.SD / math.Sqrt(float64(m.n))
		s.MeanLow, s.MeanHigh = m.meanCI(0.95)
	}
	s.Skewness = m.skewness()
	if math.IsNaN(s.Skewness) {
		if m.n < 3 {
			s.Reason.set("skewness needs at least three values", "Skewness")
		} else {
			s.Reason.set("all values are equal", "Skewness")
		}
	}
	return s
}
