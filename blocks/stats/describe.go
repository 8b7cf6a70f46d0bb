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
func Variance(v Values) float64 { return centralMoments(v.present()).Variance() }

// SD is the sample standard deviation, √Variance.
func SD(v Values) float64 { return math.Sqrt(Variance(v)) }

// MeanCI is the Student t confidence interval of the mean at the given
// level (e.g. 0.95): mean ± t(1-(1-level)/2, n-1)·s/√n (Student 1908).
// It is NaN for n < 2 or a level outside (0, 1).
func MeanCI(v Values, level float64) (low, high float64) {
	m := centralMoments(v.present())
	return m.meanCI(level)
}

// Skewness is the adjusted Fisher–Pearson standardised moment coefficient
// G1 = g1·√(n(n-1))/(n-2) with g1 = m3/m2^(3/2) and m_k the central moments
// with denominator n (Joanes and Gill 1998, "b1" adjusted as G1); it equals
// scipy.stats.skew(bias=False) and a spreadsheet's SKEW. NaN for n < 3 or
// equal values.
func Skewness(v Values) float64 { return centralMoments(v.present()).skewness() }

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
	return quantileAt(n, p, func(r int) float64 { return sorted[r] })
}

// quantileAt is Quantile of n values whose order statistic of 0-based rank
// r is x(r); n > 0 and p in [0, 1].
func quantileAt(n int, p float64, x func(r int) float64) float64 {
	h := float64(n-1) * p
	j := int(math.Floor(h))
	if j >= n-1 {
		return x(n - 1)
	}
	f := h - float64(j)
	a := x(j)
	if f == 0 {
		return a
	}
	b := x(j + 1)
	if a == b {
		return a
	}
	return a + f*(b-a)
}

// QuartileRanks are the 0-based ranks of the order statistics between which
// the type 7 quartiles of n values interpolate (⌊h⌋ and ⌊h⌋+1 for
// h = (n-1)p, p = 1/4, 1/2, 3/4), ascending and without repeats: what a
// sample kept elsewhere (a database) must supply to QuartilesFrom besides
// its extremes.
func QuartileRanks(n int) []int {
	if n <= 0 {
		return nil
	}
	var out []int
	for _, j := range []int{(n - 1) / 4, (n - 1) / 2, 3 * (n - 1) / 4} {
		for _, r := range []int{j, j + 1} {
			if r < n && (len(out) == 0 || r > out[len(out)-1]) {
				out = append(out, r)
			}
		}
	}
	return out
}

// Quartiles are a sample's extremes and its type 7 quartiles (Hyndman and
// Fan 1996) in the shifted form of Values: each is a value less Offset, so
// that the IQR (Q3 - Q1) keeps the digits the offset keeps. An empty
// sample's are NaN.
type Quartiles struct {
	Offset                   float64
	Min, Q1, Median, Q3, Max float64
}

// QuartilesOf gives the extremes and type 7 quartiles of the non-missing
// values of v, from the sorted shifted values.
func QuartilesOf(v Values) Quartiles { return quartilesOf(v.present()) }

func quartilesOf(p Values) Quartiles {
	sorted := sortedD(p)
	return QuartilesFrom(len(sorted), p.Offset, func(r int) float64 { return sorted[r] })
}

// QuartilesFrom gives the extremes and type 7 quartiles (Hyndman and Fan
// 1996) of n values from their order statistics: x(r) is the value of
// 0-based rank r less offset. It asks for the ranks 0, n - 1 and
// QuartileRanks(n) only, so a sample kept elsewhere needs to supply just
// those.
func QuartilesFrom(n int, offset float64, x func(rank int) float64) Quartiles {
	if n <= 0 {
		nan := math.NaN()
		return Quartiles{Offset: offset, Min: nan, Q1: nan, Median: nan, Q3: nan, Max: nan}
	}
	return Quartiles{Offset: offset, Min: x(0), Max: x(n - 1),
		Q1: quantileAt(n, 0.25, x), Median: quantileAt(n, 0.5, x), Q3: quantileAt(n, 0.75, x)}
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
// It is DescribeMoments(MomentsOf(v), QuartilesOf(v)).
func Describe(v Values) Summary {
	p := v.present()
	return DescribeMoments(centralMoments(p), quartilesOf(p))
}

// DescribeMoments is Describe for a sample known by its moments and
// quartiles: n, the mean, SD (n - 1) and standard error, the 95% Student t
// interval of the mean (Student 1908) and the adjusted Fisher–Pearson
// skewness G1 (Joanes and Gill 1998) from m; the extremes, type 7 quartiles
// (Hyndman and Fan 1996) and IQR from q. Undefined fields are NaN and named
// in Reason, as Describe names them.
func DescribeMoments(m Moments, q Quartiles) Summary {
	s := Summary{N: m.n}
	nan := math.NaN()
	if m.n == 0 {
		s.Mean, s.SD, s.SE, s.Min, s.Max, s.Q1, s.Median, s.Q3, s.IQR, s.Skewness, s.MeanLow, s.MeanHigh =
			nan, nan, nan, nan, nan, nan, nan, nan, nan, nan, nan, nan
		s.Reason.set("there are no values", "Mean", "SD", "SE", "Min", "Max", "Q1", "Median", "Q3", "IQR", "Skewness", "MeanLow", "MeanHigh")
		return s
	}
	s.Mean = m.meanValue()
	s.Min = q.Min + q.Offset
	s.Max = q.Max + q.Offset
	s.Q1, s.Median, s.Q3 = q.Q1+q.Offset, q.Median+q.Offset, q.Q3+q.Offset
	s.IQR = q.Q3 - q.Q1 // offset cancels exactly
	if m.n < 2 {
		s.SD, s.SE, s.MeanLow, s.MeanHigh = nan, nan, nan, nan
		s.Reason.set("one value has no spread", "SD", "SE", "MeanLow", "MeanHigh")
	} else {
		s.SD = math.Sqrt(m.Variance())
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
