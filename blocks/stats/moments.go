package stats

import "math"

// Moments are the sufficient statistics of a sample for its mean, variance
// and skewness: the number of values n and, about an integer offset (as in
// Values), their mean as a double-double and the sums of the squared and
// cubed deviations from that mean, M2 = Σ(x - x̄)² and M3 = Σ(x - x̄)³.
// Describe, Welch, CohenD and OneWayANOVA compute them from the values
// (MomentsOf); a sample whose values stay elsewhere gives them from its
// sums (MomentsFromSums), from its value counts (Tally.Moments) or from two
// parts (CombineMoments), and DescribeMoments, WelchMoments, CohenDMoments
// and OneWayANOVAMoments take them instead of the values. The zero value is
// the empty sample.
type Moments struct {
	n      int
	offset float64
	mean   dd // mean of the values less offset
	ss, s3 dd // Σ(x - x̄)², Σ(x - x̄)³
}

// MomentsOf gives the moments of the non-missing values of v by the
// two-pass algorithm (Chan, Golub and LeVeque 1983) on the shifted values,
// in double-double arithmetic.
func MomentsOf(v Values) Moments { return centralMoments(v.present()) }

// centralMoments is a two-pass computation in double-double arithmetic:
// the mean of the shifted values first, then the sums of centred powers
// (the "two-pass algorithm" of Chan, Golub and LeVeque 1983, here with
// double-double sums, so that even NIST's NumAcc4 keeps its digits). v must
// have no missing values.
func centralMoments(v Values) Moments {
	m := Moments{n: v.Len(), offset: v.Offset}
	if m.n == 0 {
		return m
	}
	var s ddSum
	for i := range v.D {
		s.addDD(v.dd(i))
	}
	m.mean = ddDivF(s.s, float64(m.n))
	var s2, s3 ddSum
	for i := range v.D {
		d := ddSub(v.dd(i), m.mean)
		d2 := ddSqr(d)
		s2.addDD(d2)
		s3.addDD(ddMul(d2, d))
	}
	m.ss, m.s3 = s2.s, s3.s
	return m
}

// MomentsFromSums gives the moments of n values from their sums about a
// centre c, as a database computes them in one pass over the rows:
// s1 = Σ(x - c), s2 = Σ(x - c)², s3 = Σ(x - c)³. With c near the mean (a
// first pass's mean), s1 is small and the re-centring
// x̄ = c + s1/n, M2 = s2 - s1²/n, M3 = s3 - 3·s1·s2/n + 2·s1³/n²
// cancels few digits (the two-pass idea of Chan, Golub and LeVeque 1983);
// it runs in double-double arithmetic from the exact decimals. For a
// centre the database subtracted in binary floating point, pass its exact
// value (FloatDecimal). A negative M2 (rounding in the sums) becomes 0.
func MomentsFromSums(n int, c, s1, s2, s3 Decimal) Moments {
	if n <= 0 {
		return Moments{}
	}
	cd := c.dd()
	m := Moments{n: n}
	if t := math.Trunc(cd.hi); math.Abs(t) < two53 {
		m.offset = t + 0 // never -0
	}
	nf := float64(n)
	a1, a2, a3 := s1.dd(), s2.dd(), s3.dd()
	q := ddDivF(a1, nf)
	m.mean = ddAdd(ddAddF(cd, -m.offset), q)
	m.ss = ddSub(a2, ddMul(a1, q))
	if m.ss.hi < 0 {
		m.ss = dd{}
	}
	m.s3 = ddAdd(ddSub(a3, ddMulF(ddMul(q, a2), 3)), ddMulF(ddMul(a1, ddSqr(q)), 2))
	return m
}

// CombineMoments gives the moments of two samples taken together by the
// pairwise update of Chan, Golub and LeVeque (1979): with n = na + nb and
// δ = x̄b - x̄a, x̄ = x̄a + δ·nb/n, M2 = M2a + M2b + δ²·na·nb/n and
// M3 = M3a + M3b + δ³·na·nb·(na - nb)/n² + 3δ·(na·M2b - nb·M2a)/n,
// in double-double arithmetic, the offsets kept apart.
func CombineMoments(a, b Moments) Moments {
	if b.n == 0 {
		return a
	}
	if a.n == 0 {
		return b
	}
	na, nb := float64(a.n), float64(b.n)
	n := na + nb
	d := meanDiff(a, b)
	d2 := ddSqr(d)
	out := Moments{n: a.n + b.n, offset: a.offset}
	out.mean = ddAdd(a.mean, ddDivF(ddMulF(d, nb), n))
	out.ss = ddAdd(ddAdd(a.ss, b.ss), ddDivF(ddMulF(ddMulF(d2, na), nb), n))
	t := ddDivF(ddDivF(ddMulF(ddMulF(ddMulF(ddMul(d2, d), na), nb), na-nb), n), n)
	u := ddDivF(ddMulF(ddMul(d, ddSub(ddMulF(b.ss, na), ddMulF(a.ss, nb))), 3), n)
	out.s3 = ddAdd(ddAdd(ddAdd(a.s3, b.s3), t), u)
	return out
}

// N is the number of values.
func (m Moments) N() int { return m.n }

// Mean is the arithmetic mean, NaN for no values.
func (m Moments) Mean() float64 {
	if m.n == 0 {
		return math.NaN()
	}
	return m.meanValue()
}

func (m Moments) meanValue() float64 { return ddAddF(m.mean, m.offset).float() }

// Variance is the sample variance M2/(n - 1), NaN for n < 2.
func (m Moments) Variance() float64 {
	if m.n < 2 {
		return math.NaN()
	}
	return ddDivF(m.ss, float64(m.n-1)).float()
}

// PopulationSD is the standard deviation with denominator n, √(M2/n), the
// spread Scott's bin width uses; NaN for no values.
func (m Moments) PopulationSD() float64 {
	if m.n == 0 {
		return math.NaN()
	}
	return math.Sqrt(ddDivF(m.ss, float64(m.n)).float())
}

func (m Moments) meanCI(level float64) (low, high float64) {
	if m.n < 2 {
		return math.NaN(), math.NaN()
	}
	half := tCrit(level, float64(m.n-1)) * math.Sqrt(m.Variance()/float64(m.n))
	low = ddAddF(ddAddF(m.mean, -half), m.offset).float()
	high = ddAddF(ddAddF(m.mean, half), m.offset).float()
	return low, high
}

func (m Moments) skewness() float64 {
	if m.n < 3 || m.ss.hi == 0 {
		return math.NaN()
	}
	n := float64(m.n)
	m2 := ddDivF(m.ss, n)
	m3 := ddDivF(m.s3, n)
	g1 := m3.float() / math.Pow(m2.float(), 1.5)
	return g1 * math.Sqrt(n*(n-1)) / (n - 2)
}
