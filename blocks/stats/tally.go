package stats

import (
	"math"
	"sort"
)

// Tally is a sample given as its distinct values and how often each
// occurs, as a database returns it (GROUP BY value, COUNT(*)). Its moments,
// quartiles, bin counts and box plot whiskers equal those of the sample
// written out value by value.
type Tally struct {
	v      Values // distinct values, ascending, none missing
	counts []int
	cum    []int // cum[i] = counts[0] + … + counts[i]
}

// NewTally makes the Tally of values v, value i occurring counts[i] times.
// The values may come in any order and repeat (their counts add up);
// missing values and counts below 1 are left out.
func NewTally(v Values, counts []int) Tally {
	idx := make([]int, 0, v.Len())
	for i := range v.D {
		if i < len(counts) && counts[i] > 0 && !math.IsNaN(v.D[i]) {
			idx = append(idx, i)
		}
	}
	less := func(a, b dd) bool { return a.hi < b.hi || (a.hi == b.hi && a.lo < b.lo) }
	sort.SliceStable(idx, func(a, b int) bool { return less(v.dd(idx[a]), v.dd(idx[b])) })
	var keep []int
	var cs []int
	for _, i := range idx {
		if k := len(keep); k > 0 && v.dd(keep[k-1]) == v.dd(i) {
			cs[k-1] += counts[i]
			continue
		}
		keep = append(keep, i)
		cs = append(cs, counts[i])
	}
	t := Tally{v: v.Subset(keep), counts: cs, cum: make([]int, len(cs))}
	n := 0
	for i, c := range cs {
		n += c
		t.cum[i] = n
	}
	return t
}

// N is the number of values, each as often as it occurs.
func (t Tally) N() int {
	if len(t.cum) == 0 {
		return 0
	}
	return t.cum[len(t.cum)-1]
}

// Moments are the tally's moments by the two-pass algorithm of MomentsOf,
// each distinct value weighted by its count.
func (t Tally) Moments() Moments {
	m := Moments{n: t.N(), offset: t.v.Offset}
	if m.n == 0 {
		return m
	}
	var s ddSum
	for i, c := range t.counts {
		s.addDD(ddMulF(t.v.dd(i), float64(c)))
	}
	m.mean = ddDivF(s.s, float64(m.n))
	var s2, s3 ddSum
	for i, c := range t.counts {
		d := ddSub(t.v.dd(i), m.mean)
		d2 := ddSqr(d)
		w := float64(c)
		s2.addDD(ddMulF(d2, w))
		s3.addDD(ddMulF(ddMul(d2, d), w))
	}
	m.ss, m.s3 = s2.s, s3.s
	return m
}

// Quartiles are the tally's extremes and type 7 quartiles (QuartilesFrom),
// its order statistics read off the cumulative counts.
func (t Tally) Quartiles() Quartiles {
	return QuartilesFrom(t.N(), t.v.Offset, func(r int) float64 {
		i := sort.Search(len(t.cum), func(i int) bool { return t.cum[i] > r })
		return t.v.dd(i).float()
	})
}

// CountBins counts the tally's values in the bins between edges as
// CountBins counts a sample's.
func (t Tally) CountBins(edges []float64) []int {
	if !increasing(edges) {
		return nil
	}
	counts := make([]int, len(edges)-1)
	for i, c := range t.counts {
		if j := binOf(edges, t.v.At(i)); j >= 0 {
			counts[j] += c
		}
	}
	return counts
}

// Whiskers are a box plot's whiskers and outliers by Tukey's (1977) rule:
// the whiskers reach the most extreme values within the fences (Fences),
// and the values beyond them are outliers.
type Whiskers struct {
	Low, High float64   // whisker ends; +Inf and -Inf when no value lies within the fences
	Outliers  []float64 // values beyond the fences, ascending
	Hidden    int       // outliers counted but not listed, past a limit
}

// Fences are Tukey's (1977) fences of a summary: Q1 - 1.5·IQR and
// Q3 + 1.5·IQR.
func (s Summary) Fences() (lo, hi float64) {
	return s.Q1 - 1.5*s.IQR, s.Q3 + 1.5*s.IQR
}

// BoxWhiskers are the whiskers and outliers of the non-missing values of v
// for the fences lo and hi (Summary.Fences): every outlier is listed.
func BoxWhiskers(v Values, lo, hi float64) Whiskers {
	w := Whiskers{Low: math.Inf(1), High: math.Inf(-1)}
	for i := range v.D {
		if !math.IsNaN(v.D[i]) {
			w.add(v.At(i), 1, lo, hi, -1)
		}
	}
	sort.Float64s(w.Outliers)
	return w
}

// Whiskers are the tally's whiskers and outliers for the fences lo and hi,
// as BoxWhiskers finds them. With limit >= 0 at most limit outliers are
// listed, the lowest first; the rest are counted in Hidden.
func (t Tally) Whiskers(lo, hi float64, limit int) Whiskers {
	w := Whiskers{Low: math.Inf(1), High: math.Inf(-1)}
	for i, c := range t.counts {
		w.add(t.v.At(i), c, lo, hi, limit)
	}
	return w
}

// add takes in value x, occurring count times.
func (w *Whiskers) add(x float64, count int, lo, hi float64, limit int) {
	if x >= lo && x <= hi {
		w.Low = math.Min(w.Low, x)
		w.High = math.Max(w.High, x)
		return
	}
	for c := 0; c < count; c++ {
		if limit >= 0 && len(w.Outliers) >= limit {
			w.Hidden += count - c
			return
		}
		w.Outliers = append(w.Outliers, x)
	}
}
