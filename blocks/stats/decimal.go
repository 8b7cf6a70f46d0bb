package stats

import (
	"fmt"
	"math"
	"math/big"
	"math/bits"
	"strconv"
	"unicode/utf8"
)

// Decimal is a number read exactly from decimal text: sign × mantissa ×
// 10^exponent with an integer mantissa. Mantissas of up to 19 significant
// digits live in a uint64 (the fast path, no allocation); longer ones fall
// back to math/big. Trailing zeros of the mantissa are folded into the
// exponent, so "1.500" and "15e-1" are the same Decimal. The zero value is 0.
type Decimal struct {
	neg  bool
	mant uint64   // |value| = mant × 10^exp, when big == nil
	exp  int32    // base-10 exponent
	big  *big.Int // mantissa with more than 19 significant digits, else nil
}

// DecimalError says why a text is not a decimal number.
type DecimalError struct {
	Text string // the text as given
	Pos  int    // byte offset of the problem in Text
	Msg  string
}

func (e *DecimalError) Error() string {
	return fmt.Sprintf("%q is not a decimal number: %s", e.Text, e.Msg)
}

var pow10u = [20]uint64{
	1, 10, 100, 1000, 10000, 100000, 1000000, 10000000, 100000000,
	1000000000, 10000000000, 100000000000, 1000000000000,
	10000000000000, 100000000000000, 1000000000000000,
	10000000000000000, 100000000000000000, 1000000000000000000,
	10000000000000000000,
}

var pow10f = [23]float64{
	1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
	1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22,
}

const (
	maxExp   = 1 << 30 // exponents saturate here; the value is then 0 or ±Inf anyway
	two53    = 1 << 53
	maxFast  = 19 // significant digits that fit a uint64
	expLimit = 400
)

// ParseDecimal reads a decimal number: an optional sign, digits with at
// most one decimal point (at least one digit on either side), and an
// optional exponent "e" or "E" with an optional sign and at least one
// digit. It accepts "-12.5", "1e3", "1.2E-5", "+3", ".5" and "5."; it
// rejects everything else, including spaces, thousands separators,
// underscores, "inf" and "nan" (the caller strips separators and spaces).
func ParseDecimal(s string) (Decimal, error) {
	var d Decimal
	i := 0
	if s == "" {
		return d, &DecimalError{Text: s, Msg: "empty text"}
	}
	if s[0] == '+' || s[0] == '-' {
		d.neg = s[0] == '-'
		i++
	}
	var (
		mant    uint64
		ndig    int // significant digits in mant
		zeros   int // zeros seen after the last nonzero digit, not yet in mant
		exp     int
		sawDig  bool
		sawDot  bool
		slowWay bool
	)
	for ; i < len(s); i++ {
		c := s[i]
		if c >= '0' && c <= '9' {
			sawDig = true
			if sawDot {
				exp--
			}
			if c == '0' {
				if mant != 0 || slowWay {
					zeros++
				}
				continue
			}
			if slowWay || ndig+zeros+1 > maxFast {
				slowWay = true
				continue
			}
			mant = mant*pow10u[zeros+1] + uint64(c-'0')
			ndig += zeros + 1
			zeros = 0
			continue
		}
		if c == '.' {
			if sawDot {
				return Decimal{}, &DecimalError{Text: s, Pos: i, Msg: fmt.Sprintf("second decimal point at byte %d", i)}
			}
			sawDot = true
			continue
		}
		if c == 'e' || c == 'E' {
			break
		}
		return Decimal{}, unexpected(s, i, "")
	}
	if !sawDig {
		return Decimal{}, &DecimalError{Text: s, Pos: i, Msg: "no digits"}
	}
	lit := 0
	if i < len(s) { // exponent
		i++
		eneg := false
		if i < len(s) && (s[i] == '+' || s[i] == '-') {
			eneg = s[i] == '-'
			i++
		}
		if i == len(s) {
			return Decimal{}, &DecimalError{Text: s, Pos: i, Msg: "exponent has no digits"}
		}
		for ; i < len(s); i++ {
			c := s[i]
			if c < '0' || c > '9' {
				return Decimal{}, unexpected(s, i, " in the exponent")
			}
			if lit < maxExp {
				lit = lit*10 + int(c-'0')
			}
		}
		if eneg {
			lit = -lit
		}
	}
	if slowWay {
		return parseDecimalBig(s, d.neg), nil
	}
	if mant == 0 {
		return Decimal{neg: d.neg}, nil
	}
	d.mant = mant
	d.exp = int32(clampExp(exp + zeros + lit))
	return d, nil
}

func unexpected(s string, i int, where string) error {
	r, _ := utf8.DecodeRuneInString(s[i:])
	return &DecimalError{Text: s, Pos: i, Msg: fmt.Sprintf("unexpected %q at byte %d%s", r, i, where)}
}

func clampExp(e int) int {
	if e > maxExp {
		return maxExp
	}
	if e < -maxExp {
		return -maxExp
	}
	return e
}

// parseDecimalBig is the slow path of ParseDecimal for mantissas of more
// than 19 significant digits; s is already known to be well formed.
func parseDecimalBig(s string, neg bool) Decimal {
	digits := make([]byte, 0, len(s))
	exp, lit := 0, 0
	sawDot := false
	i := 0
	if s[0] == '+' || s[0] == '-' {
		i++
	}
	for ; i < len(s); i++ {
		c := s[i]
		if c == '.' {
			sawDot = true
			continue
		}
		if c == 'e' || c == 'E' {
			break
		}
		if sawDot {
			exp--
		}
		if c == '0' && len(digits) == 0 {
			continue
		}
		digits = append(digits, c)
	}
	if i < len(s) {
		i++
		eneg := false
		if s[i] == '+' || s[i] == '-' {
			eneg = s[i] == '-'
			i++
		}
		for ; i < len(s); i++ {
			if lit < maxExp {
				lit = lit*10 + int(s[i]-'0')
			}
		}
		if eneg {
			lit = -lit
		}
	}
	for len(digits) > 0 && digits[len(digits)-1] == '0' {
		digits = digits[:len(digits)-1]
		exp++
	}
	m, _ := new(big.Int).SetString(string(digits), 10)
	return Decimal{neg: neg, big: m, exp: int32(clampExp(exp + lit))}
}

// String gives the decimal in canonical scientific form, e.g. "-125e-1".
func (d Decimal) String() string {
	var b []byte
	if d.neg {
		b = append(b, '-')
	}
	if d.big != nil {
		b = d.big.Append(b, 10)
	} else {
		b = strconv.AppendUint(b, d.mant, 10)
	}
	if d.exp != 0 {
		b = append(b, 'e')
		b = strconv.AppendInt(b, int64(d.exp), 10)
	}
	return string(b)
}

// appendSci writes sign, mantissa digits and exponent to b.
func appendSci(b []byte, neg bool, mant uint64, exp int) []byte {
	if neg {
		b = append(b, '-')
	}
	b = strconv.AppendUint(b, mant, 10)
	b = append(b, 'e')
	return strconv.AppendInt(b, int64(exp), 10)
}

// Float is the float64 nearest to d, identical to strconv.ParseFloat of the
// text d was read from (±Inf beyond the float64 range, a signed zero for
// zero). Mantissas up to 2^53 with exponents within ±22 take Clinger's
// (1990) exact fast path; the rest go through strconv.ParseFloat.
func (d Decimal) Float() float64 {
	if d.big == nil {
		if d.mant == 0 {
			if d.neg {
				return math.Copysign(0, -1)
			}
			return 0
		}
		if d.mant <= two53 && d.exp >= -22 && d.exp <= 22 {
			f := float64(d.mant)
			if d.exp >= 0 {
				f *= pow10f[d.exp]
			} else {
				f /= pow10f[-d.exp]
			}
			if d.neg {
				f = -f
			}
			return f
		}
		var buf [48]byte
		f, _ := strconv.ParseFloat(string(appendSci(buf[:0], d.neg, d.mant, int(d.exp))), 64)
		return f
	}
	f, _ := strconv.ParseFloat(d.String(), 64)
	return f
}

// digits10 is the number of decimal digits of the mantissa.
func (d Decimal) digits10() int {
	if d.big != nil {
		return len(d.big.String())
	}
	n := 1
	for n < 20 && d.mant >= pow10u[n] {
		n++
	}
	return n
}

// OffsetHint is an integer offset suited to d: its integer part (truncated
// toward zero) when |d| < 2^53, else 0. It is exactly representable in a
// float64 and never negative zero.
func (d Decimal) OffsetHint() float64 {
	if d.big == nil {
		if d.mant == 0 {
			return 0
		}
		var ip uint64
		if d.exp >= 0 {
			if d.exp > 15 {
				return 0
			}
			hi, lo := bits.Mul64(d.mant, pow10u[d.exp])
			if hi != 0 {
				return 0
			}
			ip = lo
		} else {
			k := -int(d.exp)
			if k > 19 {
				return 0
			}
			ip = d.mant / pow10u[k]
		}
		if ip >= two53 || ip == 0 {
			return 0
		}
		if d.neg {
			return -float64(ip)
		}
		return float64(ip)
	}
	if mag := int(d.exp) + d.digits10(); mag > 17 || mag <= 0 {
		return 0 // |d| >= 10^17 > 2^53, or |d| < 1
	}
	r := d.rat()
	ip := new(big.Int).Quo(r.Num(), r.Denom())
	if ip.Sign() == 0 || ip.CmpAbs(big.NewInt(two53)) >= 0 {
		return 0
	}
	f, _ := new(big.Float).SetInt(ip).Float64()
	return f
}

// rat is the exact value of d. Callers keep |exp| bounded.
func (d Decimal) rat() *big.Rat {
	m := d.big
	if m == nil {
		m = new(big.Int).SetUint64(d.mant)
	}
	r := new(big.Rat).SetInt(m)
	if d.exp != 0 {
		p := new(big.Int).Exp(big.NewInt(10), big.NewInt(int64(abs(int(d.exp)))), nil)
		if d.exp > 0 {
			r.Mul(r, new(big.Rat).SetInt(p))
		} else {
			r.Quo(r, new(big.Rat).SetInt(p))
		}
	}
	if d.neg {
		r.Neg(r)
	}
	return r
}

func abs(i int) int {
	if i < 0 {
		return -i
	}
	return i
}

// Minus is the exact difference d - offset rounded once to the nearest
// float64. offset should be an integer (as OffsetHint gives); integer
// offsets below 2^63 with mantissas of up to 19 digits take an integer fast
// path without allocation, everything else is computed exactly with
// math/big.
func (d Decimal) Minus(offset float64) float64 {
	if offset == 0 {
		return d.Float()
	}
	if oneg, om, ok := intOffset(offset); d.big == nil && ok {
		if d.mant == 0 {
			return -offset
		}
		if d.exp >= 0 {
			if d.exp <= 19 {
				if hi, v := bits.Mul64(d.mant, pow10u[d.exp]); hi == 0 {
					if neg, m, ok := signedSub(d.neg, v, oneg, om); ok {
						f := float64(m) // Go rounds integer conversions to nearest even
						if neg {
							f = -f
						}
						return f
					}
				}
			}
		} else if k := -int(d.exp); k <= 19 {
			if hi, oscaled := bits.Mul64(om, pow10u[k]); hi == 0 {
				if neg, m, ok := signedSub(d.neg, d.mant, oneg, oscaled); ok {
					if m == 0 {
						return 0
					}
					var f float64
					if m <= two53 && k <= 22 {
						f = float64(m) / pow10f[k] // both exact: one correctly rounded division
					} else {
						var buf [48]byte
						f, _ = strconv.ParseFloat(string(appendSci(buf[:0], false, m, -k)), 64)
					}
					if neg {
						f = -f
					}
					return f
				}
			}
		}
	}
	return d.minusSlow(offset)
}

// intOffset is an integer offset below 2^63 in magnitude as sign and
// magnitude; ok is false for any other offset.
func intOffset(offset float64) (neg bool, m uint64, ok bool) {
	if offset != math.Trunc(offset) || !(math.Abs(offset) < 1<<63) {
		return false, 0, false
	}
	if o := int64(offset); o < 0 {
		return true, uint64(-o), true
	}
	return false, uint64(int64(offset)), true
}

// signedSub is (±a) - (±b) as sign and magnitude; ok is false on overflow.
func signedSub(negA bool, a uint64, negB bool, b uint64) (neg bool, m uint64, ok bool) {
	if negA != negB {
		s, carry := bits.Add64(a, b, 0)
		return negA, s, carry == 0
	}
	if a >= b {
		return negA, a - b, true
	}
	return !negA, b - a, true
}

func (d Decimal) minusSlow(offset float64) float64 {
	if math.IsNaN(offset) || math.IsInf(offset, 0) {
		return d.Float() - offset
	}
	if d.isZero() {
		return -offset
	}
	mag := int(d.exp) + d.digits10() // |d| < 10^mag
	if mag > 330 {
		return d.Float() // far beyond the float64 range, whatever the offset
	}
	if mag < -350 {
		return -offset // |d| is below half an ulp of any nonzero offset
	}
	r := d.rat()
	r.Sub(r, new(big.Rat).SetFloat64(offset))
	f, _ := r.Float64()
	return f
}

func (d Decimal) isZero() bool {
	if d.big != nil {
		return d.big.Sign() == 0
	}
	return d.mant == 0
}

// ParseValues reads decimal texts exactly and shifts them by the offset
// that the first value suggests (Decimal.OffsetHint), so that
// Values.D[i] is the exact difference rounded once. An empty list gives an
// empty Values. The error names the first text (1-based) that is not a
// decimal number.
func ParseValues(texts []string) (Values, error) {
	v := Values{D: make([]float64, len(texts))}
	for i, t := range texts {
		d, err := ParseDecimal(t)
		if err != nil {
			return Values{}, fmt.Errorf("value %d: %w", i+1, err)
		}
		if i == 0 {
			v.Offset = d.OffsetHint()
		}
		v.D[i] = d.Minus(v.Offset)
	}
	return v, nil
}

// dd is d as a double-double: the nearest float64 and the remainder
// rounded once, about 106 significant bits.
func (d Decimal) dd() dd {
	hi := d.Float()
	return dd{hi, d.remainder(0, hi)}
}

// remainder is d - offset - hi rounded once, for hi = d.Minus(offset): the
// low-order part of the exact difference. Integer offsets with mantissas
// of up to 19 digits take an integer path; the rest is computed exactly
// with math/big.
func (d Decimal) remainder(offset, hi float64) float64 {
	if math.IsNaN(hi) || math.IsInf(hi, 0) || math.IsNaN(offset) || math.IsInf(offset, 0) {
		return 0
	}
	if oneg, om, ok := intOffset(offset); d.big == nil && ok {
		switch {
		case d.exp >= 0 && d.exp <= 19:
			// An integer: exact in a float64 up to 2^53.
			if h, v := bits.Mul64(d.mant, pow10u[d.exp]); h == 0 {
				if _, m, ok := signedSub(d.neg, v, oneg, om); ok && m <= two53 {
					return 0
				}
			}
		case d.exp < 0 && -d.exp <= 19:
			// ±m/10^k: hi·10^k = p + e exactly (a fused multiply-add), and
			// m - p is exact, p being within an ulp of m (Sterbenz).
			k := -int(d.exp)
			if h, oscaled := bits.Mul64(om, pow10u[k]); h == 0 {
				if neg, m, ok := signedSub(d.neg, d.mant, oneg, oscaled); ok && m <= two53 {
					x := float64(m)
					if neg {
						x = -x
					}
					p, e := twoProd(hi, pow10f[k])
					return ((x - p) - e) / pow10f[k]
				}
			}
		}
	}
	if d.isZero() {
		return -offset - hi
	}
	if mag := int(d.exp) + d.digits10(); mag > 330 || mag < -350 {
		return 0
	}
	r := d.rat()
	r.Sub(r, new(big.Rat).SetFloat64(offset))
	r.Sub(r, new(big.Rat).SetFloat64(hi))
	f, _ := r.Float64()
	return f
}

// ParseValuesExact is ParseValues that keeps each value's remainder in Lo:
// D[i] is the exact difference from Offset rounded once and Lo[i] what
// that rounding left, rounded once more, so that a value keeps about 106
// significant bits and At gives the float64 nearest to it (but for values
// within 2^-106 of a tie). It suits values that are shown and compared one
// by one, such as the distinct values of a Tally read from a database.
func ParseValuesExact(texts []string) (Values, error) {
	v, err := ParseValues(texts)
	if err != nil {
		return Values{}, err
	}
	v.Lo = make([]float64, len(texts))
	for i, t := range texts {
		d, _ := ParseDecimal(t)
		v.Lo[i] = d.remainder(v.Offset, v.D[i])
		v.D[i], v.Lo[i] = quickTwoSum(v.D[i], v.Lo[i])
	}
	return v, nil
}

// FloatDecimal is the exact value of f as a Decimal (every finite float64
// is a decimal fraction of at most 767 significant digits), for a number a
// database used in binary floating point, such as the centre it subtracted
// before summing (MomentsFromSums). NaN and the infinities give 0.
func FloatDecimal(f float64) Decimal {
	if f == 0 || math.IsNaN(f) || math.IsInf(f, 0) {
		return Decimal{}
	}
	r := new(big.Rat).SetFloat64(f) // exact; the denominator is 2^k
	k := r.Denom().BitLen() - 1
	m := new(big.Int).Mul(r.Num(), new(big.Int).Exp(big.NewInt(5), big.NewInt(int64(k)), nil))
	d, _ := ParseDecimal(m.String() + "e-" + strconv.Itoa(k)) // m·5^k/10^k = m/2^k
	return d
}
