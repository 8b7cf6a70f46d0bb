package stats

import (
	"math"
	"sort"
)

// MaxBins bounds the number of bins a rule may ask for; past it BinEdges
// falls back to Sturges' rule (a long-tailed sample can make the
// Freedman–Diaconis width tiny against the range).
const MaxBins = 10000

// BinSample is what the binning rules need to know of a sample: its size
// and extremes, and the spread each rule measures. A sample whose values
// stay elsewhere (a database) gives these instead of its values.
type BinSample struct {
	N        int
	Min, Max float64 // the extremes, as CountBins compares values with edges
	Range    float64 // Max - Min, from the shifted values (Sturges)
	SD       float64 // standard deviation with denominator n (Scott)
	IQR      float64 // type 7 interquartile range (Freedman–Diaconis)
}

// BinSampleOf describes the non-missing values of v for rule: the extremes
// and the range of the shifted values always, the SD (from the moments in
// double-double arithmetic) only for "scott" and the IQR (from the sorted
// shifted values) only for "fd"; what the rule does not need is NaN.
func BinSampleOf(v Values, rule string) BinSample {
	p := v.present()
	b := BinSample{N: p.Len(), Min: math.Inf(1), Max: math.Inf(-1), SD: math.NaN(), IQR: math.NaN()}
	dlo, dhi := math.Inf(1), math.Inf(-1)
	for i := range p.D {
		x := p.At(i) // the values CountBins will compare with the edges
		b.Min, b.Max = math.Min(b.Min, x), math.Max(b.Max, x)
		d := p.dd(i).float()
		dlo, dhi = math.Min(dlo, d), math.Max(dhi, d)
	}
	b.Range = dhi - dlo
	switch rule {
	case "scott":
		b.SD = centralMoments(p).PopulationSD()
	case "fd":
		q := quartilesOf(p)
		b.IQR = q.Q3 - q.Q1
	}
	return b
}

// BinWidth is the raw bin width a rule asks for, before rounding to a nice
// step, for the non-missing values of v (BinSample.Width of BinSampleOf).
func BinWidth(v Values, rule string) float64 { return BinSampleOf(v, rule).Width(rule) }

// Width is the raw bin width a rule asks for, before rounding to a nice
// step:
//
//   - "sturges": range/(log2 n + 1), Sturges (1926);
//   - "scott": (24√π/n)^(1/3)·σ ≈ 3.49·σ·n^(-1/3), Scott (1979), with σ the
//     standard deviation with denominator n (as numpy's histogram_bin_edges);
//   - "fd": 2·IQR·n^(-1/3), Freedman and Diaconis (1981), IQR of the type 7
//     quartiles.
//
// It is NaN for an unknown rule or fewer than two values, and 0 when the
// rule's spread measure is 0.
func (b BinSample) Width(rule string) float64 {
	if b.N < 2 {
		return math.NaN()
	}
	nf := float64(b.N)
	switch rule {
	case "sturges":
		return b.Range / (math.Log2(nf) + 1)
	case "scott":
		return math.Cbrt(24*math.Sqrt(math.Pi)/nf) * b.SD
	case "fd":
		return 2 * b.IQR / math.Cbrt(nf)
	}
	return math.NaN()
}

// BinEdges gives histogram bin edges for the non-missing values of v; it
// is BinEdgesFor(BinSampleOf(v, rule), rule, count).
func BinEdges(v Values, rule string, count int) []float64 {
	p := v.present()
	if p.Len() == 0 {
		return nil
	}
	return BinEdgesFor(BinSampleOf(p, rule), rule, count)
}

// BinEdgesFor gives histogram bin edges for a sample described by b.
//
// With rule "count" (or "") the range [min, max] is cut into count bins of
// equal width, edges min + i·(max-min)/count with the last edge exactly max
// (numpy's histogram_bin_edges with an integer bins).
//
// With rule "sturges", "scott" or "fd" the rule's width (BinSample.Width)
// is rounded up to the nearest nice step 1, 2, 2.5 or 5 × 10^k, and the
// edges are the multiples of that step from the largest one <= min to the
// smallest one >= max, each computed as an exact decimal rounded once, so
// the same data always give the same round edges. A zero width (equal
// quartiles for "fd", zero SD for "scott") or more than MaxBins bins falls
// back to Sturges' rule.
//
// When every value is equal the edges span value ± 0.5 (one bin, or count
// equal bins). It returns nil for no values, an unknown rule, or a count
// rule with count < 1.
func BinEdgesFor(b BinSample, rule string, count int) []float64 {
	if b.N == 0 {
		return nil
	}
	lo, hi := b.Min, b.Max
	switch rule {
	case "", "count":
		if count < 1 {
			return nil
		}
		if lo == hi {
			lo, hi = lo-0.5, hi+0.5
		}
		return equalEdges(lo, hi, count)
	case "sturges", "scott", "fd":
	default:
		return nil
	}
	if lo == hi {
		return []float64{lo - 0.5, hi + 0.5}
	}
	w := b.Width(rule)
	if !(w > 0) || (hi-lo)/w > MaxBins {
		w = b.Width("sturges")
	}
	return niceEdges(lo, hi, w)
}

func equalEdges(lo, hi float64, count int) []float64 {
	e := make([]float64, count+1)
	step := (hi - lo) / float64(count)
	for i := range e {
		e[i] = lo + float64(i)*step
	}
	e[count] = hi
	return e
}

// niceStep is c·10^e with c in {10, 20, 25, 50}: the smallest such step >= w.
type niceStep struct {
	c int64
	e int
}

func chooseStep(w float64) niceStep {
	e := int(math.Floor(math.Log10(w))) - 1
	for {
		for _, c := range []int64{10, 20, 25, 50} {
			st := niceStep{c, e}
			if st.edge(1) >= w {
				return st
			}
		}
		e++
	}
}

// edge is k·c·10^e, the exact decimal rounded once to a float64.
func (s niceStep) edge(k int64) float64 {
	m := float64(k * s.c) // |k·c| stays far below 2^53 for at most MaxBins bins
	if s.e >= 0 {
		if s.e <= 22 {
			return m * pow10f[s.e]
		}
		return m * math.Pow(10, float64(s.e))
	}
	if -s.e <= 22 {
		return m / pow10f[-s.e]
	}
	return m / math.Pow(10, float64(-s.e))
}

func niceEdges(lo, hi, w float64) []float64 {
	st := chooseStep(w)
	step := st.edge(1)
	k0 := int64(math.Floor(lo / step))
	for st.edge(k0) > lo {
		k0--
	}
	for st.edge(k0+1) <= lo {
		k0++
	}
	k1 := int64(math.Ceil(hi / step))
	for st.edge(k1) < hi {
		k1++
	}
	for st.edge(k1-1) >= hi {
		k1--
	}
	e := make([]float64, 0, k1-k0+1)
	for k := k0; k <= k1; k++ {
		e = append(e, st.edge(k))
	}
	return e
}

// CountBins counts the non-missing values of v in the bins between
// consecutive edges. Each bin is closed on the left and open on the right,
// [e_i, e_i+1), except the last, which is closed on both ends, so a value
// equal to the last edge is counted in the last bin (numpy.histogram's
// convention). Values outside [e_0, e_last] are not counted. It returns nil
// for fewer than two edges or edges that are not strictly increasing.
func CountBins(v Values, edges []float64) []int {
	if !increasing(edges) {
		return nil
	}
	counts := make([]int, len(edges)-1)
	for i := range v.D {
		if math.IsNaN(v.D[i]) {
			continue
		}
		if j := binOf(edges, v.At(i)); j >= 0 {
			counts[j]++
		}
	}
	return counts
}

// increasing reports whether there are at least two edges, each above the
// one before.
func increasing(edges []float64) bool {
	if len(edges) < 2 {
		return false
	}
	for i := 1; i < len(edges); i++ {
		if !(edges[i] > edges[i-1]) {
			return false
		}
	}
	return true
}

// binOf is the bin of x between edges as CountBins counts it, or -1 when x
// lies outside them.
func binOf(edges []float64, x float64) int {
	last := edges[len(edges)-1]
	if x < edges[0] || x > last {
		return -1
	}
	if x == last {
		return len(edges) - 2
	}
	j := sort.SearchFloat64s(edges, x) // first edge >= x
	if edges[j] == x {
		return j
	}
	return j - 1
}
