package check

import (
	"math"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
)

type tokKind uint8

const (
	tWord tokKind = iota
	tNum
	tPunct
)

// token is a word, a number or a punctuation mark of a sentence, with its
// offsets in the unit text.
type token struct {
	kind       tokKind
	text       string // as written
	low        string // lower case
	stem       string
	start, end int
	space      bool // white space (or the start of the sentence) before it

	// Numbers.
	val    float64
	dec    int     // decimals written
	half   float64 // half a unit of the last significant digit written
	suffix string  // lower-case letters written right after the digits
	comma  bool    // written with thousands separators
	cur    string  // a currency sign right before it
	pct    bool    // a "%" right after it
	ident  string  // why it is part of a name or code ("version", "time", "slash")
	ref    string  // the fact of the inline value it stands in
}

func isWordRune(r rune) bool {
	return unicode.IsLetter(r) || unicode.IsDigit(r) || r == '²' || r == '³'
}

// tokenize splits text[a:b] into tokens. refAt gives the fact of an inline
// value at an offset (nil when there is none).
func tokenize(text string, a, b int, refAt func(int) string) []token {
	var out []token
	space := true
	i := a
	for i < b {
		r, n := utf8.DecodeRuneInString(text[i:b])
		if unicode.IsSpace(r) || r == '*' || r == '_' || r == '`' {
			if unicode.IsSpace(r) {
				space = true
			}
			i += n
			continue
		}
		start := i
		switch {
		case (r < utf8.RuneSelf && isDigit(byte(r))) || (r == '.' && i+1 < b && isDigit(text[i+1]) && !prevDigit(text, a, i)) ||
			((r == '-' || r == '−' || r == '+') && i+n < b && isDigit(text[i+n]) && signContext(text, a, i, out)):
			t := scanNumber(text, i, b)
			t.space = space
			if refAt != nil {
				t.ref = refAt(start)
			}
			// A currency sign right before.
			if k := len(out); k > 0 && out[k-1].kind == tPunct && out[k-1].end == start && strings.Contains("$£€¥", out[k-1].text) {
				t.cur = out[k-1].text
				t.space = out[k-1].space
			}
			out = append(out, t)
			if t.end <= i {
				t.end = i + n // never stand still
			}
			i = t.end
		case unicode.IsLetter(r) || unicode.IsDigit(r):
			j := i
			for j < b {
				r2, n2 := utf8.DecodeRuneInString(text[j:b])
				if isWordRune(r2) {
					j += n2
					continue
				}
				// Inner apostrophes ("Cohen's", "didn't") and dots of dotted
				// abbreviations ("e.g.", "a.m.").
				if (r2 == '\'' || r2 == '’' || r2 == '.') && j+n2 < b {
					r3, _ := utf8.DecodeRuneInString(text[j+n2 : b])
					if unicode.IsLetter(r3) && (r2 != '.' || dottedWord(text, i, j+n2, b)) {
						j += n2
						continue
					}
				}
				break
			}
			word := text[i:j]
			low := strings.ToLower(word)
			// A dot that ends a dotted abbreviation or a known short form.
			if j < b && text[j] == '.' && (strings.Contains(low, ".") || abbreviations[low] || months[low+"."] || low == "p" || low == "no") {
				if low != "p" || nextIsDigitAfterSpace(text, j+1, b) {
					j++
					word = text[i:j]
					low = strings.ToLower(word)
				}
			}
			t := token{kind: tWord, text: word, low: low, stem: stem(low), start: i, end: j, space: space}
			if refAt != nil {
				t.ref = refAt(i)
			}
			out = append(out, t)
			i = j
		default:
			t := token{kind: tPunct, text: string(r), low: string(r), start: i, end: i + n, space: space}
			if refAt != nil {
				t.ref = refAt(i)
			}
			out = append(out, t)
			i += n
		}
		space = false
	}
	return out
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

func prevDigit(text string, a, i int) bool {
	if i <= a {
		return false
	}
	r, _ := utf8.DecodeLastRuneInString(text[a:i])
	return unicode.IsDigit(r) || unicode.IsLetter(r)
}

// signContext reports whether a minus or plus at i is a sign: it follows
// white space, an opening bracket, "=" or the start, not a number or word
// (where it is a range or a hyphen).
func signContext(text string, a, i int, out []token) bool {
	if i == a {
		return true
	}
	r, _ := utf8.DecodeLastRuneInString(text[a:i])
	return unicode.IsSpace(r) || r == '(' || r == '[' || r == '=' || r == ':' || r == '$' || r == '£' || r == '€'
}

func dottedWord(text string, start, next, b int) bool {
	// "e.g", "i.e", "a.m", "p.m", "u.s": single letters between dots.
	seg := text[start:next]
	parts := strings.Split(strings.TrimSuffix(seg, "."), ".")
	for _, p := range parts {
		if utf8.RuneCountInString(p) != 1 {
			return false
		}
	}
	r, n := utf8.DecodeRuneInString(text[next:b])
	if !unicode.IsLetter(r) {
		return false
	}
	// The letter after the dot must itself be a single letter.
	if next+n < b {
		r2, _ := utf8.DecodeRuneInString(text[next+n : b])
		if unicode.IsLetter(r2) {
			return false
		}
	}
	return true
}

func nextIsDigitAfterSpace(text string, i, b int) bool {
	for i < b && (text[i] == ' ' || text[i] == '\t') {
		i++
	}
	return i < b && isDigit(text[i])
}

// scanNumber reads a number at text[i:]: an optional sign, digits with
// thousands separators, decimals, then letters written right after (a
// suffix) and a "%" (right after or after one space).
func scanNumber(text string, i, b int) token {
	t := token{kind: tNum, start: i}
	j := i
	neg := false
	if r, n := utf8.DecodeRuneInString(text[j:b]); r == '-' || r == '−' || r == '+' {
		neg = r != '+'
		j += n
	}
	var digits strings.Builder
	intDigits := 0
	for j < b {
		c := text[j]
		switch {
		case isDigit(c):
			digits.WriteByte(c)
			intDigits++
			j++
			continue
		case c == ',' && intDigits > 0 && j+4 <= b && allDigits(text[j+1:j+4]) && (j+4 >= b || !isDigit(text[j+4])):
			t.comma = true
			j++
			continue
		}
		break
	}
	decimals := ""
	if j+1 < b && text[j] == '.' && isDigit(text[j+1]) {
		k := j + 1
		for k < b && isDigit(text[k]) {
			k++
		}
		decimals = text[j+1 : k]
		j = k
		// A second dot and digits: a version or a date, not a number.
		if j+1 < b && text[j] == '.' && isDigit(text[j+1]) {
			for j < b && (isDigit(text[j]) || text[j] == '.') {
				j++
			}
			t.ident = "version"
		}
	}
	// Times of day and ratios "9:30", dates "6/10".
	if t.ident == "" && j+1 < b && (text[j] == ':' || text[j] == '/') && isDigit(text[j+1]) {
		if text[j] == ':' {
			t.ident = "time"
		} else {
			t.ident = "slash"
		}
		for j < b && (isDigit(text[j]) || text[j] == ':' || text[j] == '/' || text[j] == '.') {
			if text[j] == '.' && (j+1 >= b || !isDigit(text[j+1])) {
				break
			}
			j++
		}
	}
	s := digits.String()
	if decimals != "" {
		s += "." + decimals
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		v = math.NaN()
	}
	if neg {
		v = -v
	}
	t.val = v
	t.dec = len(decimals)
	sig := strings.TrimRight(decimals, "0")
	switch {
	case len(sig) > 0:
		t.half = 0.5 * math.Pow(10, -float64(len(sig)))
	case math.Abs(v) >= 1000 && decimals == "":
		z := 0
		for k := len(digits.String()) - 1; k > 0 && digits.String()[k] == '0'; k-- {
			z++
		}
		t.half = 0.5 * math.Pow(10, float64(z))
	default:
		t.half = 0.5
	}
	// Letters written right after the digits.
	k := j
	for k < b {
		r, n := utf8.DecodeRuneInString(text[k:b])
		if unicode.IsLetter(r) {
			k += n
			continue
		}
		break
	}
	if k > j {
		t.suffix = strings.ToLower(text[j:k])
		j = k
	}
	if j < b && text[j] == '%' {
		t.pct = true
		j++
	} else if j+1 < b && text[j] == ' ' && text[j+1] == '%' {
		t.pct = true
		j += 2
	}
	if j < b {
		if r, n := utf8.DecodeRuneInString(text[j:b]); r == '×' {
			t.suffix = "x"
			j += n
		}
	}
	t.end = j
	t.text = text[i:j]
	t.low = strings.ToLower(t.text)
	return t
}

func allDigits(s string) bool {
	if s == "" {
		return false
	}
	for i := 0; i < len(s); i++ {
		if !isDigit(s[i]) {
			return false
		}
	}
	return true
}
