package blocks

import (
	"math"
	"math/big"
	"sort"

	"gonum.org/v1/gonum/mathext"
	"gonum.org/v1/gonum/stat/distuv"

	"candor/blocks/stats"
)

// The push-down (pushdown.go) gets sums from the database instead of
// values, so it needs the statistics of blocks/stats in their moment form:
// the same formulas, from n, the mean and the centred sums of squares and
// cubes. Each routine below names its method and the stats routine whose
// values it must equal (to 1e-9 relative; pushdown_test.go checks both
// paths on the same data). The distribution functions are those of
// blocks/stats/dist.go, on gonum.

// pdPrec is the precision of the sums' arithmetic: a NUMERIC column's sums
// arrive exact, and re-centring them must not lose that.
const pdPrec = 512

func bf() *big.Float { return new(big.Float).SetPrec(pdPrec) }

func bfText(s string) *big.Float {
	f, _, err := big.ParseFloat(s, 10, pdPrec, big.ToNearestEven)
	if err != nil || f == nil {
		return bf()
	}
	return f
}

func bfInt(n int64) *big.Float { return bf().SetInt64(n) }

func f64(x *big.Float) float64 {
	v, _ := x.Float64()
	return v
}

// pdMoments are the sums of one sample about a centre c, as the database
// computed them: n, Σ(x-c), Σ(x-c)², Σ(x-c)³. Centring at a first-pass mean
// keeps the sums small, so that Σ(x-c)² - (Σ(x-c))²/n cancels nothing that
// matters (the two-pass idea of Chan, Golub and LeVeque 1983).
type pdMoments struct {
	n              int64
	c, s1, s2, s3  *big.Float
	min, max       string // the extremes as the database wrote them
	rows, rowsMiss int64  // the sample's rows, and those with the value missing
	hits, other    int64  // values equal to firstPass's hit, and values other than 0 and 1
}

func zeroMoments() pdMoments {
	return pdMoments{c: bf(), s1: bf(), s2: bf(), s3: bf()}
}

// shift re-centres the sums at c2: with e = c - c2,
// Σ(d+e) = S1 + ne, Σ(d+e)² = S2 + 2eS1 + ne², Σ(d+e)³ = S3 + 3eS2 + 3e²S1 + ne³.
func (m pdMoments) shift(c2 *big.Float) pdMoments {
	e := bf().Sub(m.c, c2)
	n := bfInt(m.n)
	e2 := bf().Mul(e, e)
	e3 := bf().Mul(e2, e)
	out := m
	out.c = bf().Set(c2)
	out.s1 = bf().Add(m.s1, bf().Mul(n, e))
	t := bf().Add(m.s2, bf().Mul(bf().Mul(bfInt(2), e), m.s1))
	out.s2 = t.Add(t, bf().Mul(n, e2))
	u := bf().Add(m.s3, bf().Mul(bf().Mul(bfInt(3), e), m.s2))
	u.Add(u, bf().Mul(bf().Mul(bfInt(3), e2), m.s1))
	out.s3 = u.Add(u, bf().Mul(n, e3))
	return out
}

// combine adds samples (their rows and sums) into one, re-centred at the
// first non-empty sample's centre.
func combine(ms []pdMoments) pdMoments {
	out := zeroMoments()
	first := true
	for _, m := range ms {
		out.rows += m.rows
		out.rowsMiss += m.rowsMiss
		if m.n == 0 {
			continue
		}
		if first {
			out.c = bf().Set(m.c)
			out.min, out.max = m.min, m.max
			first = false
		} else {
			if cmpText(m.min, out.min) < 0 {
				out.min = m.min
			}
			if cmpText(m.max, out.max) > 0 {
				out.max = m.max
			}
		}
		sm := m.shift(out.c)
		out.n += m.n
		out.s1.Add(out.s1, sm.s1)
		out.s2.Add(out.s2, sm.s2)
		out.s3.Add(out.s3, sm.s3)
	}
	return out
}

func cmpText(a, b string) int { return bfText(a).Cmp(bfText(b)) }

// central returns the mean and the sums of squared and cubed deviations
// from it: M2 = S2 - S1²/n, M3 = S3 - 3·S1·S2/n + 2·S1³/n².
func (m pdMoments) central() (mean, m2, m3 *big.Float) {
	if m.n == 0 {
		return bf(), bf(), bf()
	}
	n := bfInt(m.n)
	q := bf().Quo(m.s1, n)
	mean = bf().Add(m.c, q)
	m2 = bf().Sub(m.s2, bf().Mul(m.s1, q))
	m3 = bf().Sub(m.s3, bf().Mul(bfInt(3), bf().Mul(q, m.s2)))
	m3.Add(m3, bf().Mul(bfInt(2), bf().Mul(m.s1, bf().Mul(q, q))))
	if m2.Sign() < 0 {
		m2 = bf()
	}
	return mean, m2, m3
}

// pdQuartiles are a sample's type 7 quartiles (Hyndman and Fan 1996) and
// extremes from its order statistics, in the shifted form the stats
// package uses (offset + D), with the decimals the values were written
// with for Column.Snap.
type pdQuartiles struct {
	min, max, q1, med, q3, iqr float64
	dec                        int
}

// quartiles computes the type 7 quartiles from the order statistics at the
// ranks h = (n-1)p (0-based) and the one after, as stats.Quantile does on
// the sorted sample.
func quartiles(n int64, minText, maxText string, os map[int64]string) pdQuartiles {
	texts := []string{minText, maxText}
	idx := map[int64]int{}
	ranks := make([]int64, 0, len(os))
	for r := range os {
		ranks = append(ranks, r)
	}
	sort.Slice(ranks, func(i, j int) bool { return ranks[i] < ranks[j] })
	for _, r := range ranks {
		idx[r] = len(texts)
		texts = append(texts, os[r])
	}
	v, dec, _ := parseNumbers(texts)
	at := func(p float64) float64 {
		h := float64(n-1) * p
		j := int64(math.Floor(h))
		if j >= n-1 {
			return v.D[1] // the maximum
		}
		a, b := v.D[idx[j]], v.D[idx[j+1]]
		f := h - float64(j)
		if f == 0 || a == b {
			return a
		}
		return a + f*(b-a)
	}
	q := pdQuartiles{dec: dec}
	if n == 0 {
		nan := math.NaN()
		return pdQuartiles{nan, nan, nan, nan, nan, nan, dec}
	}
	q.min, q.max = v.D[0]+v.Offset, v.D[1]+v.Offset
	d1, dm, d3 := at(0.25), at(0.5), at(0.75)
	q.q1, q.med, q.q3 = d1+v.Offset, dm+v.Offset, d3+v.Offset
	q.iqr = d3 - d1
	return q
}

// quartileRanks are the 0-based ranks whose order statistics the type 7
// quartiles of n values need.
func quartileRanks(n int64) []int64 {
	if n <= 0 {
		return nil
	}
	seen := map[int64]bool{}
	var out []int64
	for _, j := range []int64{(n - 1) / 4, (n - 1) / 2, 3 * (n - 1) / 4} {
		for _, r := range []int64{j, j + 1} {
			if r < n && !seen[r] {
				seen[r] = true
				out = append(out, r)
			}
		}
	}
	sort.Slice(out, func(i, j int) bool { return out[i] < out[j] })
	return out
}

// pdDescribe is stats.Describe from moments and quartiles: n, mean, SD
// (n - 1), SE, the 95% Student t interval of the mean, the adjusted
// Fisher–Pearson skewness G1 (Joanes and Gill 1998) and the type 7
// quartiles, with the same reasons for undefined values.
func pdDescribe(m pdMoments, q pdQuartiles) stats.Summary {
	s := stats.Summary{N: int(m.n)}
	nan := math.NaN()
	set := func(reason string, fields ...string) {
		if s.Reason == nil {
			s.Reason = stats.Reasons{}
		}
		for _, f := range fields {
			if _, ok := s.Reason[f]; !ok {
				s.Reason[f] = reason
			}
		}
	}
	if m.n == 0 {
		s.Mean, s.SD, s.SE, s.Min, s.Max, s.Q1, s.Median, s.Q3, s.IQR, s.Skewness, s.MeanLow, s.MeanHigh =
			nan, nan, nan, nan, nan, nan, nan, nan, nan, nan, nan, nan
		set("there are no values", "Mean", "SD", "SE", "Min", "Max", "Q1", "Median", "Q3", "IQR", "Skewness", "MeanLow", "MeanHigh")
		return s
	}
	mean, m2, m3 := m.central()
	s.Mean = f64(mean)
	s.Min, s.Max, s.Q1, s.Median, s.Q3, s.IQR = q.min, q.max, q.q1, q.med, q.q3, q.iqr
	n := float64(m.n)
	if m.n < 2 {
		s.SD, s.SE, s.MeanLow, s.MeanHigh = nan, nan, nan, nan
		set("one value has no spread", "SD", "SE", "MeanLow", "MeanHigh")
	} else {
		variance := f64(bf().Quo(m2, bfInt(m.n-1)))
		s.SD = math.Sqrt(variance)
		s.SE = s.SD / math.Sqrt(n)
		half := tCrit(0.95, n-1) * math.Sqrt(variance/n)
		s.MeanLow = f64(bf().Sub(mean, bf().SetFloat64(half)))
		s.MeanHigh = f64(bf().Add(mean, bf().SetFloat64(half)))
	}
	s.Skewness = nan
	if m.n >= 3 && m2.Sign() > 0 {
		m2n := f64(bf().Quo(m2, bfInt(m.n)))
		m3n := f64(bf().Quo(m3, bfInt(m.n)))
		g1 := m3n / math.Pow(m2n, 1.5)
		s.Skewness = g1 * math.Sqrt(n*(n-1)) / (n - 2)
	}
	if math.IsNaN(s.Skewness) {
		if m.n < 3 {
			set("skewness needs at least three values", "Skewness")
		} else {
			set("all values are equal", "Skewness")
		}
	}
	return s
}

// pdGroup is one group's n, mean and sum of squared deviations.
type pdGroup struct {
	n        int64
	mean, ss *big.Float
}

func groupOf(m pdMoments) pdGroup {
	mean, m2, _ := m.central()
	return pdGroup{n: m.n, mean: mean, ss: m2}
}

func (g pdGroup) variance() float64 {
	if g.n < 2 {
		return math.NaN()
	}
	return f64(bf().Quo(g.ss, bfInt(g.n-1)))
}

// pdWelch is stats.Welch from group moments: Welch's (1947) t-test with the
// Welch–Satterthwaite degrees of freedom (Satterthwaite 1946), B minus A.
func pdWelch(a, b pdGroup, level float64) stats.WelchResult {
	nan := math.NaN()
	r := stats.WelchResult{NA: int(a.n), NB: int(b.n), MeanA: nan, MeanB: nan, SDA: nan, SDB: nan,
		Diff: nan, SE: nan, Low: nan, High: nan, T: nan, DF: nan, P: nan}
	set := func(reason string, fields ...string) {
		if r.Reason == nil {
			r.Reason = stats.Reasons{}
		}
		for _, f := range fields {
			if _, ok := r.Reason[f]; !ok {
				r.Reason[f] = reason
			}
		}
	}
	if a.n > 0 {
		r.MeanA = f64(a.mean)
	}
	if b.n > 0 {
		r.MeanB = f64(b.mean)
	}
	if a.n == 0 || b.n == 0 {
		set("a group has no values", "MeanA", "MeanB", "SDA", "SDB", "Diff", "SE", "Low", "High", "T", "DF", "P")
		if a.n > 0 {
			delete(r.Reason, "MeanA")
		}
		if b.n > 0 {
			delete(r.Reason, "MeanB")
		}
		return r
	}
	diff := bf().Sub(b.mean, a.mean)
	r.Diff = f64(diff)
	va, vb := a.variance(), b.variance()
	r.SDA, r.SDB = math.Sqrt(va), math.Sqrt(vb)
	if a.n < 2 || b.n < 2 {
		set("a group has fewer than two values, so its variance is unknown", "SE", "Low", "High", "T", "DF", "P")
		if a.n < 2 {
			set("one value has no spread", "SDA")
		}
		if b.n < 2 {
			set("one value has no spread", "SDB")
		}
		return r
	}
	ua, ub := va/float64(a.n), vb/float64(b.n)
	se2 := ua + ub
	if se2 == 0 {
		r.SE = 0
		set("both groups have zero variance", "Low", "High", "T", "DF", "P")
		return r
	}
	r.SE = math.Sqrt(se2)
	r.DF = se2 * se2 / (ua*ua/float64(a.n-1) + ub*ub/float64(b.n-1))
	r.T = r.Diff / r.SE
	r.P = tTwoSided(r.T, r.DF)
	half := tCrit(level, r.DF) * r.SE
	r.Low = f64(bf().Sub(diff, bf().SetFloat64(half)))
	r.High = f64(bf().Add(diff, bf().SetFloat64(half)))
	return r
}

// pdCohenD is stats.CohenD from group moments: Cohen's (1988) d with the
// pooled SD, B minus A.
func pdCohenD(a, b pdGroup) float64 {
	if a.n == 0 || b.n == 0 || a.n+b.n < 3 {
		return math.NaN()
	}
	ss := bf().Add(a.ss, b.ss)
	sp := math.Sqrt(f64(bf().Quo(ss, bfInt(a.n+b.n-2))))
	if sp == 0 {
		return math.NaN()
	}
	return f64(bf().Sub(b.mean, a.mean)) / sp
}

// pdANOVA is stats.OneWayANOVA from group moments: Fisher's (1925) one-way
// analysis of variance.
func pdANOVA(gs []pdGroup) stats.ANOVA {
	nan := math.NaN()
	res := stats.ANOVA{SSBetween: nan, SSWithin: nan, MSBetween: nan, MSWithin: nan, F: nan, P: nan, R2: nan, Sigma: nan, GrandMean: nan}
	set := func(reason string, fields ...string) {
		if res.Reason == nil {
			res.Reason = stats.Reasons{}
		}
		for _, f := range fields {
			if _, ok := res.Reason[f]; !ok {
				res.Reason[f] = reason
			}
		}
	}
	res.Means = make([]float64, len(gs))
	res.Ns = make([]int, len(gs))
	tot, ssw := bf(), bf()
	for i, g := range gs {
		res.Ns[i] = int(g.n)
		res.Means[i] = nan
		if g.n > 0 {
			res.Means[i] = f64(g.mean)
			res.Groups++
			res.N += int(g.n)
			tot.Add(tot, bf().Mul(g.mean, bfInt(g.n)))
			ssw.Add(ssw, g.ss)
		}
	}
	all := []string{"SSBetween", "SSWithin", "MSBetween", "MSWithin", "F", "P", "R2", "Sigma", "GrandMean"}
	if res.N == 0 {
		set("there are no values", all...)
		return res
	}
	grand := bf().Quo(tot, bfInt(int64(res.N)))
	ssb := bf()
	for _, g := range gs {
		if g.n == 0 {
			continue
		}
		d := bf().Sub(g.mean, grand)
		ssb.Add(ssb, bf().Mul(bf().Mul(d, d), bfInt(g.n)))
	}
	res.GrandMean = f64(grand)
	res.SSBetween = f64(ssb)
	res.SSWithin = f64(ssw)
	res.DFBetween = res.Groups - 1
	res.DFWithin = res.N - res.Groups
	sst := bf().Add(ssb, ssw)
	if sst.Sign() > 0 {
		res.R2 = f64(bf().Quo(ssb, sst))
	} else {
		set("all values are equal", "R2")
	}
	if res.DFBetween > 0 {
		res.MSBetween = f64(bf().Quo(ssb, bfInt(int64(res.DFBetween))))
	} else {
		set("there is only one group", "MSBetween", "F", "P")
	}
	if res.DFWithin > 0 {
		msw := bf().Quo(ssw, bfInt(int64(res.DFWithin)))
		res.MSWithin = f64(msw)
		res.Sigma = f64(bf().Sqrt(msw))
	} else {
		set("no group has more than one value", "MSWithin", "Sigma", "F", "P")
	}
	if res.DFBetween > 0 && res.DFWithin > 0 {
		if res.MSWithin > 0 {
			msb := bf().Quo(ssb, bfInt(int64(res.DFBetween)))
			res.F = f64(bf().Quo(msb, bf().Quo(ssw, bfInt(int64(res.DFWithin)))))
			res.P = fSurvival(res.F, float64(res.DFBetween), float64(res.DFWithin))
		} else {
			set("there is no variation within the groups", "F", "P")
		}
	}
	return res
}

// tTwoSided is P(|T| >= |t|) = I_{df/(df+t²)}(df/2, 1/2) (Abramowitz and
// Stegun 26.7.1), as in blocks/stats.
func tTwoSided(t, df float64) float64 {
	if math.IsNaN(t) || !(df > 0) {
		return math.NaN()
	}
	if math.IsInf(t, 0) {
		return 0
	}
	return mathext.RegIncBeta(df/2, 0.5, df/(df+t*t))
}

// tCrit is the two-sided critical value of Student's t: gonum's quantile
// polished by Newton's method on the upper tail, as in blocks/stats.
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
		dx := (d.Survival(x) - q) / pdf
		x += dx
		if math.Abs(dx) <= 1e-15*math.Abs(x) {
			break
		}
	}
	return x
}

// fSurvival is P(F > f) = I_{d2/(d2+d1 f)}(d2/2, d1/2), as in blocks/stats.
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

// pdBinEdges is stats.BinEdges from a sample's n, extremes and spread: the
// rule's width (Sturges 1926, Scott 1979, Freedman and Diaconis 1981)
// rounded up to a nice step, or count equal bins. sd is the SD with
// denominator n, iqr the type 7 IQR.
func pdBinEdges(n int64, lo, hi, sd, iqr float64, rule string, count int) []float64 {
	if n == 0 {
		return nil
	}
	switch rule {
	case "", "count":
		if count < 1 {
			return nil
		}
		if lo == hi {
			lo, hi = lo-0.5, hi+0.5
		}
		return pdEqualEdges(lo, hi, count)
	case "sturges", "scott", "fd":
	default:
		return nil
	}
	if lo == hi {
		return []float64{lo - 0.5, hi + 0.5}
	}
	width := func(rule string) float64 {
		if n < 2 {
			return math.NaN()
		}
		nf := float64(n)
		switch rule {
		case "sturges":
			return (hi - lo) / (math.Log2(nf) + 1)
		case "scott":
			return math.Cbrt(24*math.Sqrt(math.Pi)/nf) * sd
		case "fd":
			return 2 * iqr / math.Cbrt(nf)
		}
		return math.NaN()
	}
	w := width(rule)
	if !(w > 0) || (hi-lo)/w > stats.MaxBins {
		w = width("sturges")
	}
	return pdNiceEdges(lo, hi, w)
}

func pdEqualEdges(lo, hi float64, count int) []float64 {
	e := make([]float64, count+1)
	step := (hi - lo) / float64(count)
	for i := range e {
		e[i] = lo + float64(i)*step
	}
	e[count] = hi
	return e
}

var pdPow10 = [23]float64{
	1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
	1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22,
}

type pdStep struct {
	c int64
	e int
}

func (s pdStep) edge(k int64) float64 {
	m := float64(k * s.c)
	if s.e >= 0 {
		if s.e <= 22 {
			return m * pdPow10[s.e]
		}
		return m * math.Pow(10, float64(s.e))
	}
	if -s.e <= 22 {
		return m / pdPow10[-s.e]
	}
	return m / math.Pow(10, float64(-s.e))
}

func pdNiceEdges(lo, hi, w float64) []float64 {
	e0 := int(math.Floor(math.Log10(w))) - 1
	var st pdStep
search:
	for {
		for _, c := range []int64{10, 20, 25, 50} {
			st = pdStep{c, e0}
			if st.edge(1) >= w {
				break search
			}
		}
		e0++
	}
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
