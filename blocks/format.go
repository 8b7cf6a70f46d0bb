package blocks

import (
	"math"
	"strconv"
	"strings"
)

// Format shows a fact as FORMAT.md section 4 says: percentages with one
// decimal and "%", counts with thousands separators, p-values as "< 0.001" or
// three decimals, points with one decimal, other values with three
// significant digits. decimals >= 0 forces that many decimals (the
// {{ID.NAME|N}} form). An undefined fact reads "undefined".
func Format(f Fact, decimals int) string {
	if !f.Defined() {
		return "undefined"
	}
	v := f.Value
	if decimals >= 0 {
		s := Thousands(strconv.FormatFloat(v, 'f', decimals, 64))
		if f.Kind == Percent {
			s += "%"
		}
		return fixNegZero(s)
	}
	switch f.Kind {
	case Count:
		return fixNegZero(Thousands(strconv.FormatFloat(math.Round(v), 'f', 0, 64)))
	case Percent:
		return fixNegZero(Thousands(strconv.FormatFloat(v, 'f', 1, 64))) + "%"
	case Points:
		return fixNegZero(Thousands(strconv.FormatFloat(v, 'f', 1, 64)))
	case PValue:
		if v < 0.001 {
			return "< 0.001"
		}
		return strconv.FormatFloat(v, 'f', 3, 64)
	}
	return Sig(v, 3)
}

// Sig formats v with n significant digits, in plain (not exponent) notation
// with thousands separators.
func Sig(v float64, n int) string {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		if v == 0 {
			return "0"
		}
		return "undefined"
	}
	mag := int(math.Floor(math.Log10(math.Abs(v))))
	// Round to n significant digits first: 9.996 becomes 10.0, not 9.996.
	r, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'e', n-1, 64), 64)
	if r != 0 {
		mag = int(math.Floor(math.Log10(math.Abs(r))))
	}
	dec := n - 1 - mag
	if dec < 0 {
		dec = 0
	}
	return fixNegZero(Thousands(strconv.FormatFloat(r, 'f', dec, 64)))
}

// Thousands inserts thousands separators into a plain decimal number.
func Thousands(s string) string {
	neg := strings.HasPrefix(s, "-")
	if neg {
		s = s[1:]
	}
	intPart, frac := s, ""
	if k := strings.IndexByte(s, '.'); k >= 0 {
		intPart, frac = s[:k], s[k:]
	}
	if len(intPart) >= 4 {
		var b strings.Builder
		pre := len(intPart) % 3
		if pre > 0 {
			b.WriteString(intPart[:pre])
		}
		for i := pre; i < len(intPart); i += 3 {
			if b.Len() > 0 {
				b.WriteByte(',')
			}
			b.WriteString(intPart[i : i+3])
		}
		intPart = b.String()
	}
	if neg {
		return "-" + intPart + frac
	}
	return intPart + frac
}

func fixNegZero(s string) string {
	if strings.Trim(s, "-0.,%") == "" && strings.HasPrefix(s, "-") {
		return s[1:]
	}
	return s
}
