package stats

import (
	"math"
	"sort"
)

// MaxBins bounds the number of bins a rule may ask for; past it BinEdges
// falls back to Sturges' rule (a long-tailed sample can make the
// Freedman–Diaconis width tiny against the range).
const MaxBins = 10000

// BinWidth is the raw bin width a rule asks for, before rounding to a nice
// step, for the non-missing values of v:
//
//   - "sturges": range/(log2 n + 1), Sturges (1926);
//   - "scott": (24√π/n)^(1/3)·σ ≈ 3.49·σ·n^(-1/3), Scott (1979), with σ the
//     standard deviation with denominator n (as numpy's histogram_bin_edges);
//   - "fd": 2·IQR·n^(-1/3), Freedman and Diaconis (1981), IQR of the type 7
//     quartiles.
//
// It is NaN for an unknown rule or fewer than two values, and 0 when the
// rule's spread measure is 0.
func BinWidth(v Values, rule string) float64 {
	p := v.present()
	n := p.Len()
	if n < 2 {
		return math.NaN()
	}
	nf := float64(n)
	switch rule {
	case "sturges":
		s := sortedD(p)
		return (s[n-1] - s[0]) / (math.Log2(nf) + 1)
	case "scott":
		m := centralMoments(p)
		sigma := math.Sqrt(ddDivF(m.ss, nf).float())
		return math.Cbrt(24*math.Sqrt(math.Pi)/nf) * sigma
	case "fd":
		s := sortedD(p)
		return 2 * (Quantile(s, 0.75) - Quantile(s, 0.25)) / math.Cbrt(nf)
	}
	return math.NaN()
}

// BinEdges gives histogram bin edges for the non-missing values of v.
//
// With rule "count" (or "") the range [min, max] is cut into count bins of
// equal width, edges min + i·(max-min)/count with the last edge exactly max
// (numpy's histogram_bin_edges with an integer bins).
//
// With rule "sturges", "scott" or "fd" the rule's width (BinWidth) is
// rounded up to the nearest nice step 1, 2, 2.5 or 5 × 10^k, and the edges
// are the multiples of that step from the largest one <= min to the
// smallest one >= max, each computed as an exact decimal rounded once, so
// the same data always give the same round edges. A zero width (equal
// quartiles for "fd", zero SD for "scott") or more than MaxBins bins falls
// back to Sturges' rule.
//
// When every value is equal the edges span value ± 0.5 (one bin, or count
// equal bins). It returns nil for no values, an unknown rule, or a count
// rule with count < 1.
func BinEdges(v Values, rule string, count int) []float64 {
	p := v.present()
	n := p.Len()
	if n == 0 {
		return nil
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for i := range p.D {
		x := p.At(i) // the values CountBins will compare with the edges
		lo, hi = math.Min(lo, x), math.Max(hi, x)
	}
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
	w := BinWidth(p, rule)
	if !(w > 0) || (hi-lo)/w > MaxBins {
		w = BinWidth(p, "sturges")
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
	if len(edges) < 2 {
		return nil
	}
	for i := 1; i < len(edges); i++ {
		if !(edges[i] > edges[i-1]) {
			return nil
		}
	}
	counts := make([]int, len(edges)-1)
	last := edges[len(edges)-1]
	for i := range v.D {
		if math.IsNaN(v.D[i]) {
			continue
		}
		x := v.At(i)
		if x < edges[0] || x > last {
			continue
		}
		if x == last {
			counts[len(counts)-1]++
			continue
		}
		j := sort.SearchFloat64s(edges, x) // first edge >= x
		if edges[j] == x {
			counts[j]++
		} else {
			counts[j-1]++
		}
	}
	return counts
}
