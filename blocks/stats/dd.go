package stats

import "math"

// dd is a double-double number: the unevaluated sum hi + lo of two float64
// with |lo| <= ulp(hi)/2, good for about 106 significant bits. The
// algorithms are the error-free transformations of Dekker (1971) and Knuth
// (TAOCP vol. 2, TwoSum), with the accurate addition and the division of
// Hida, Li and Bailey (2001, "Algorithms for quad-double precision floating
// point arithmetic"). TwoProd uses a fused multiply-add.
//
// The package uses dd where cancellation would otherwise cost digits: sums,
// centring, and the whole least-squares solution.
type dd struct{ hi, lo float64 }

func twoSum(a, b float64) (s, e float64) {
	s = a + b
	bb := s - a
	e = (a - (s - bb)) + (b - bb)
	return
}

func quickTwoSum(a, b float64) (s, e float64) {
	s = a + b
	e = b - (s - a)
	return
}

func twoProd(a, b float64) (p, e float64) {
	p = a * b
	e = math.FMA(a, b, -p)
	return
}

func ddFrom(hi, lo float64) dd {
	s, e := twoSum(hi, lo)
	return dd{s, e}
}

func (a dd) float() float64 { return a.hi + a.lo }

func (a dd) neg() dd { return dd{-a.hi, -a.lo} }

func ddAdd(a, b dd) dd {
	s, e := twoSum(a.hi, b.hi)
	t, f := twoSum(a.lo, b.lo)
	e += t
	s, e = quickTwoSum(s, e)
	e += f
	s, e = quickTwoSum(s, e)
	return dd{s, e}
}

func ddSub(a, b dd) dd { return ddAdd(a, b.neg()) }

func ddAddF(a dd, b float64) dd {
	s, e := twoSum(a.hi, b)
	e += a.lo
	s, e = quickTwoSum(s, e)
	return dd{s, e}
}

func ddMul(a, b dd) dd {
	p, e := twoProd(a.hi, b.hi)
	e += a.hi*b.lo + a.lo*b.hi
	p, e = quickTwoSum(p, e)
	return dd{p, e}
}

func ddMulF(a dd, b float64) dd {
	p, e := twoProd(a.hi, b)
	e += a.lo * b
	p, e = quickTwoSum(p, e)
	return dd{p, e}
}

func ddSqr(a dd) dd {
	p, e := twoProd(a.hi, a.hi)
	e += 2 * a.hi * a.lo
	p, e = quickTwoSum(p, e)
	return dd{p, e}
}

func ddDiv(a, b dd) dd {
	q1 := a.hi / b.hi
	r := ddSub(a, ddMulF(b, q1))
	q2 := r.hi / b.hi
	r = ddSub(r, ddMulF(b, q2))
	q3 := r.hi / b.hi
	q1, q2 = quickTwoSum(q1, q2)
	return ddAddF(dd{q1, q2}, q3)
}

func ddDivF(a dd, b float64) dd { return ddDiv(a, dd{b, 0}) }

// ddSqrt is one Newton step from the float64 root (Karp and Markstein 1997).
func ddSqrt(a dd) dd {
	if a.hi <= 0 {
		if a.hi == 0 {
			return dd{}
		}
		return dd{math.NaN(), 0}
	}
	x := math.Sqrt(a.hi)
	p, e := twoProd(x, x)
	r := ddSub(a, dd{p, e})
	s, f := quickTwoSum(x, r.hi/(2*x))
	return dd{s, f}
}

// ddPowInt is x^k by binary powering, k >= 0.
func ddPowInt(x dd, k int) dd {
	r := dd{1, 0}
	for k > 0 {
		if k&1 == 1 {
			r = ddMul(r, x)
		}
		k >>= 1
		if k > 0 {
			x = ddSqr(x)
		}
	}
	return r
}

// ddSum accumulates float64 or dd terms into a dd.
type ddSum struct{ s dd }

func (a *ddSum) add(x float64) {
	s, e := twoSum(a.s.hi, x)
	e += a.s.lo
	a.s.hi, a.s.lo = quickTwoSum(s, e)
}

func (a *ddSum) addDD(x dd) { a.s = ddAdd(a.s, x) }
