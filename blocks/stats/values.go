package stats

import "math"

// Values is a numeric sample stored as Offset + D[i]. Offset is an integer
// exactly representable in a float64; D[i] is the exact decimal difference
// between the value and Offset, rounded once (see ParseValues). Keeping the
// offset apart preserves the digits that a float64 of the full value would
// lose once the mean is subtracted, which is what the hardest NIST StRD sets
// (NumAcc4, SmLs07–09) test.
//
// Lo, when not nil, holds low-order corrections: the value is then
// Offset + D[i] + Lo[i] with |Lo[i]| <= ulp(D[i])/2, a double-double.
// ParseValues and the loader leave it nil; Pow and Product fill it so that
// derived columns such as polynomial terms keep about 106 bits, and
// ParseValuesExact so that values read one by one keep every digit.
//
// A NaN in D marks a missing value. The descriptive routines and tests skip
// missing values; paired routines skip incomplete pairs; OLS rejects them.
type Values struct {
	Offset float64
	D      []float64
	Lo     []float64
}

// Plain wraps float64 values with offset 0. The slice is not copied.
func Plain(xs []float64) Values { return Values{D: xs} }

// Len is the number of values, missing ones included.
func (v Values) Len() int { return len(v.D) }

// At is the value i as a float64: Offset + D[i] (+ Lo[i]).
func (v Values) At(i int) float64 {
	if v.Lo != nil {
		return ddAddF(v.dd(i), v.Offset).float()
	}
	return v.Offset + v.D[i]
}

// Floats returns every value as a float64 (At for each index).
func (v Values) Floats() []float64 {
	out := make([]float64, v.Len())
	for i := range out {
		out[i] = v.At(i)
	}
	return out
}

// dd is D[i] + Lo[i], the value less Offset.
func (v Values) dd(i int) dd {
	if v.Lo != nil {
		return dd{v.D[i], v.Lo[i]}
	}
	return dd{v.D[i], 0}
}

// full is Offset + D[i] + Lo[i] as a double-double.
func (v Values) full(i int) dd { return ddAddF(v.dd(i), v.Offset) }

// Subset picks the values at the given indices, in that order.
func (v Values) Subset(idx []int) Values {
	out := Values{Offset: v.Offset, D: make([]float64, len(idx))}
	if v.Lo != nil {
		out.Lo = make([]float64, len(idx))
	}
	for k, i := range idx {
		out.D[k] = v.D[i]
		if v.Lo != nil {
			out.Lo[k] = v.Lo[i]
		}
	}
	return out
}

// Missing counts the NaN (missing) entries.
func (v Values) Missing() int {
	n := 0
	for _, x := range v.D {
		if math.IsNaN(x) {
			n++
		}
	}
	return n
}

// present drops missing values; it returns v itself when none is missing.
func (v Values) present() Values {
	if v.Missing() == 0 {
		return v
	}
	idx := make([]int, 0, len(v.D))
	for i, x := range v.D {
		if !math.IsNaN(x) {
			idx = append(idx, i)
		}
	}
	return v.Subset(idx)
}

// fromDD builds Values from double-double values, choosing the offset as
// ParseValues does: the integer part of the first value when it is below
// 2^53 in magnitude.
func fromDD(xs []dd) Values {
	v := Values{D: make([]float64, len(xs)), Lo: make([]float64, len(xs))}
	if len(xs) > 0 && !math.IsNaN(xs[0].hi) {
		if t := math.Trunc(xs[0].hi); math.Abs(t) < two53 {
			// trunc of hi can be off by one when lo has the other sign
			// and hi is integral; either integer is a fine offset.
			v.Offset = t + 0 // never -0
		}
	}
	for i, x := range xs {
		r := ddAddF(x, -v.Offset)
		v.D[i], v.Lo[i] = r.hi, r.lo
	}
	return v
}

// Pow is the sample of v[i]^k, computed in double-double from
// Offset + D[i] (+ Lo[i]) and stored with its own offset and the low-order
// parts in Lo, so that polynomial terms for OLS keep about 106 bits instead
// of the 53 a float64 power would keep. k must be >= 0; missing values stay
// missing.
func Pow(v Values, k int) Values {
	xs := make([]dd, v.Len())
	for i := range xs {
		if math.IsNaN(v.D[i]) || k < 0 {
			xs[i] = dd{math.NaN(), 0}
			continue
		}
		xs[i] = ddPowInt(v.full(i), k)
	}
	return fromDD(xs)
}

// Product is the sample of a[i]·b[i] (an interaction term), computed in
// double-double like Pow. Unequal lengths give an empty Values.
func Product(a, b Values) Values {
	if a.Len() != b.Len() {
		return Values{}
	}
	xs := make([]dd, a.Len())
	for i := range xs {
		if math.IsNaN(a.D[i]) || math.IsNaN(b.D[i]) {
			xs[i] = dd{math.NaN(), 0}
			continue
		}
		xs[i] = ddMul(a.full(i), b.full(i))
	}
	return fromDD(xs)
}
