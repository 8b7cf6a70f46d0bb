package check

import (
	"math"
	"strings"
	"unicode"
	"unicode/utf8"
)

// unitKind is what a stated number counts in.
type unitKind uint8

const (
	uNone     unitKind = iota
	uPercent           // "42%", "42 percent", "one in four", "half of"
	uPoints            // "5 points", "5 percentage points", "5 pp"
	uTimes             // "1.5 times", "1.5x", "twice", "doubled", "three-fold"
	uCurrency          // "$1.2M", "£4.20"
)

func (u unitKind) String() string {
	return [...]string{"", "%", "points", "times", "currency"}[u]
}

// quantity is one number stated in a sentence, read as a claim: its value,
// how precisely it was written, its unit, the hedge that qualifies it and
// the words that tie it to a statistic. Offsets are in the unit text.
type quantity struct {
	val, lo, hi float64 // lo and hi bound a stated range; both equal val otherwise
	half        float64 // honest rounding: half a unit of the last digit written
	unit        unitKind
	pp          bool   // "percentage points" or "pp": points for certain
	share       bool   // a share said as a fraction ("one in four", "half of")
	word        bool   // said in words ("twice", "a third", "twelve")
	multiple    string // the one-word multiple ("twice", "doubled", "halved")
	change      bool   // a change or difference ("rose 5%", "5 points higher")
	hedge       hedge
	hedgeText   string
	stat        string // the statistic named right before it ("p", "r", "n", ...)
	ref         string // the inline value it stands in
	skip        string // why it is not a claim ("year", "date", "id", ...)
	role        string // "from" or "to" in "from 38% to 45%"
	noun        string // the first word after it
	cur         string // currency sign
	start, end  int    // the claim: hedge, number and unit
	numStart    int    // the number itself
	tok, tokEnd int    // token range of the number and its unit
	first       int    // token of the claim's start (its hedge or label)
}

// text returns what the sentence says, for messages.
func (q *quantity) text(t string) string {
	if q.start < 0 || q.end > len(t) || q.start >= q.end {
		return ""
	}
	return strings.Join(strings.Fields(t[q.start:q.end]), " ")
}

// claim reports whether the quantity is a claim at all.
func (q *quantity) claim() bool { return q.skip == "" && !math.IsNaN(q.val) }

// statLabels name a statistic right before a number ("p = 0.03").
// Single letters need a symbol ("=", "<") between them and the number.
var statLabels = map[string]string{
	"p": "p", "p-value": "p", "p value": "p", "r": "r", "r²": "r2", "r2": "r2", "r-squared": "r2", "r squared": "r2",
	"adjusted r²": "adj_r2", "adjusted r2": "adj_r2", "adj. r²": "adj_r2", "rho": "rho", "ρ": "rho", "spearman's rho": "rho",
	"n": "n", "d": "d", "cohen's d": "d", "v": "v", "cramér's v": "v", "cramer's v": "v", "t": "t", "f": "f",
	"χ²": "chi2", "χ2": "chi2", "chi2": "chi2", "chi-square": "chi2", "chi-squared": "chi2", "chi square": "chi2",
	"df": "df", "m": "mean", "sd": "sd", "se": "se", "odds ratio": "odds_ratio", "risk ratio": "ratio",
	"relative risk": "ratio", "rr": "ratio", "or": "odds_ratio", "correlation": "r", "correlation coefficient": "r",
	"pearson's r": "r", "b": "estimate", "β": "estimate", "r-value": "r", "coefficient": "estimate",
}

// wordOps may stand between a label of more than one letter and its number.
var wordOps = set("of is was at = stood equals equalled reached came")

// extract finds the quantities of one sentence's tokens. first says whether
// the sentence starts its unit (for list markers).
func extract(toks []token, first bool) []*quantity {
	var out []*quantity
	used := make([]bool, len(toks))
	for i := 0; i < len(toks); i++ {
		if used[i] {
			continue
		}
		var q *quantity
		switch toks[i].kind {
		case tNum:
			q = numberQuantity(toks, i, used, first)
		case tWord:
			q = wordQuantity(toks, i, used)
			if q != nil {
				if h, k := hedgeBefore(toks, i); k < i {
					q.hedge, q.hedgeText, q.start = h, joinLow(toks, k, i), toks[k].start
				}
			}
		}
		if q == nil {
			continue
		}
		for k := q.tok; k < q.tokEnd && k < len(used); k++ {
			used[k] = true
		}
		finish(toks, q)
		out = append(out, q)
	}
	// "daytime swimmers 6.5 times." ends a sentence that compares nothing: a
	// frequency, not a multiple.
	for _, q := range out {
		if q.unit != uTimes || q.multiple != "" || q.tokEnd < 1 || q.tokEnd > len(toks) || toks[q.tokEnd-1].low != "times" {
			continue
		}
		if w := low(toks, q.tokEnd); w != "" && w != "." && w != "," && w != ";" && w != ")" {
			continue
		}
		compares := false
		for _, t := range toks {
			switch t.low {
			case "as", "than", "more", "higher", "larger", "bigger", "greater", "likely", "ratio", "rose", "grew",
				"increased", "multiplied", "over", "up", "less", "lower", "fewer", "smaller":
				compares = true
			}
		}
		if !compares {
			q.unit, q.noun = uNone, "times"
		}
	}
	return out
}

func low(toks []token, k int) string {
	if k < 0 || k >= len(toks) {
		return ""
	}
	return toks[k].low
}

func isWordTok(toks []token, k int, words ...string) bool {
	if k < 0 || k >= len(toks) || toks[k].kind != tWord {
		return false
	}
	for _, w := range words {
		if toks[k].low == w {
			return true
		}
	}
	return false
}

// attached reports whether toks[k] follows toks[k-1] with no space.
func attached(toks []token, k int) bool {
	return k > 0 && k < len(toks) && !toks[k].space
}

func numberQuantity(toks []token, i int, used []bool, first bool) *quantity {
	t := toks[i]
	if math.IsNaN(t.val) {
		return nil
	}
	q := &quantity{val: t.val, lo: t.val, hi: t.val, half: t.half, ref: t.ref, cur: t.cur,
		start: t.start, end: t.end, numStart: t.start, tok: i, tokEnd: i + 1}
	if t.cur != "" {
		q.unit = uCurrency
		if i > 0 {
			q.start = toks[i-1].start
			q.numStart = q.start
		}
	}
	if t.ident != "" {
		q.skip = t.ident
	}
	scale := 1.0
	switch t.suffix {
	case "":
	case "x":
		q.unit = uTimes
	case "k":
		scale = 1e3
	case "m", "mn", "mm":
		if t.cur != "" {
			scale = 1e6
		} else {
			q.noun = t.suffix
		}
	case "bn", "b":
		if t.cur != "" || t.suffix == "bn" {
			scale = 1e9
		} else {
			q.skip = "code"
		}
	case "st", "nd", "rd", "th":
		q.skip = "ordinal"
	case "am", "pm":
		q.skip = "time"
	case "pp", "pt", "pts", "ppt", "ppts":
		q.unit, q.pp = uPoints, true
	case "s":
		q.skip = "decade"
	case "fold":
		q.unit = uTimes
	case "h", "hr", "hrs", "min", "mins", "d", "wk", "wks", "yr", "yrs", "mo", "mos", "kg", "km", "g", "ml", "l", "kwh", "cm", "mm2", "sec", "secs", "s2":
		q.noun = t.suffix
	default:
		q.skip = "code"
	}
	if t.pct {
		q.unit = uPercent
	}
	j := i + 1
	// ISO dates and quarter names: 2026-10-06, 2026-Q3.
	if j+1 < len(toks) && toks[j].text == "-" && attached(toks, j) && attached(toks, j+1) {
		if toks[j+1].kind == tNum && !t.pct {
			if j+3 < len(toks) && toks[j+2].text == "-" && toks[j+3].kind == tNum && attached(toks, j+2) && attached(toks, j+3) {
				q.skip = "date"
				q.tokEnd = j + 4
				q.end = toks[j+3].end
				return q
			}
		}
		if toks[j+1].kind == tWord {
			w := toks[j+1].low
			switch {
			case w == "point" || w == "points" || w == "percentage":
				q.unit = uPoints
				if w == "percentage" {
					q.pp = true
				}
				j += 2
				q.tokEnd = j
				q.end = toks[j-1].end
			case w == "fold" || w == "times":
				q.unit = uTimes
				j += 2
				q.tokEnd = j
				q.end = toks[j-1].end
			case w == "percent" || w == "per":
				q.unit = uPercent
				j += 2
				q.tokEnd = j
				q.end = toks[j-1].end
			default:
				// "a 12-week pilot", "2026-Q3", "COVID-19": a descriptor or a
				// name.
				if q.skip == "" {
					q.skip = "compound"
				}
				q.tokEnd = j + 2
				q.end = toks[j+1].end
				return q
			}
		}
	}
	// A number glued to a word before it by a hyphen: "Route-7", "COVID-19".
	if i >= 2 && toks[i-1].text == "-" && attached(toks, i) && attached(toks, i-1) && toks[i-2].kind == tWord {
		q.skip = "compound"
	}
	// Scale words.
	if j < len(toks) && toks[j].kind == tWord {
		switch toks[j].low {
		case "thousand":
			scale *= 1e3
			j++
		case "million", "mn", "m":
			if toks[j].low != "m" || t.cur != "" {
				scale *= 1e6
				j++
			}
		case "billion", "bn":
			scale *= 1e9
			j++
		}
	}
	if scale != 1 {
		q.val *= scale
		q.lo, q.hi = q.val, q.val
		q.half *= scale
		if t.half == 0.5 && t.dec == 0 && scale >= 1e3 {
			// "12k": the 12 is exact in thousands.
			q.half = 0.5 * scale
		}
	}
	// "three and a half times", "2 and a half hours".
	if isWordTok(toks, j, "and") && isWordTok(toks, j+1, "a") && isWordTok(toks, j+2, "half") {
		q.val += 0.5 * scale
		q.lo, q.hi = q.val, q.val
		j += 3
	}
	// Unit words.
	if q.unit == uNone || q.unit == uCurrency {
		if u, n, pp := unitWords(toks, j); n > 0 {
			if u != uCurrency {
				q.unit, q.pp = u, pp
			}
			j += n
		}
	} else if t.pct && j < len(toks) && isWordTok(toks, j, "percent") {
		j++
	}
	q.tokEnd = j
	if j > i {
		q.end = toks[j-1].end
	}
	// A range: "40–45%", "0.92–1.51", "between 40% and 45%".
	if j+1 < len(toks) && (toks[j].text == "–" || toks[j].text == "—" || (toks[j].text == "-" && attached(toks, j)) ||
		(toks[j].low == "to" && ciBefore(toks, i))) &&
		toks[j+1].kind == tNum && q.skip == "" {
		hi := numberQuantity(toks, j+1, used, false)
		if hi != nil && hi.skip == "" {
			q.lo, q.hi = q.val, hi.val
			if q.unit == uNone {
				q.unit, q.pp = hi.unit, hi.pp
			}
			if hi.half > q.half {
				q.half = hi.half
			}
			q.hedge = hRange
			q.tokEnd = hi.tokEnd
			q.end = hi.end
		}
	}
	if q.hedge != hRange && (isWordTok(toks, i-1, "between") || (t.cur != "" && isWordTok(toks, i-2, "between"))) {
		k := q.tokEnd
		if isWordTok(toks, k, "and") && k+2 < len(toks) && toks[k+1].kind == tPunct && toks[k+2].cur != "" {
			k++ // "between €10 and €20"
		}
		if isWordTok(toks, k, "and") && k+1 < len(toks) && toks[k+1].kind == tNum {
			hi := numberQuantity(toks, k+1, used, false)
			if hi != nil && hi.skip == "" {
				q.lo, q.hi = q.val, hi.val
				if q.unit == uNone {
					q.unit, q.pp = hi.unit, hi.pp
				}
				q.hedge = hRange
				q.tokEnd = hi.tokEnd
				q.end = hi.end
			}
		}
	}
	if q.lo > q.hi {
		q.lo, q.hi = q.hi, q.lo
	}
	// "1 in 4", "3 out of 10".
	if q.unit == uNone && q.hedge != hRange {
		if b, n := ofEvery(toks, q.tokEnd); n > 0 && b > q.val && q.val > 0 && b <= 1000 {
			q.val = 100 * q.val / b
			q.lo, q.hi = q.val, q.val
			q.unit, q.share = uPercent, true
			q.half = 100 * 0.5 / b
			q.tokEnd += n
			q.end = toks[q.tokEnd-1].end
		}
	}
	// "1.5 times" only with a comparison after it; "3 times a week" is a
	// frequency.
	if q.unit == uTimes && isWordTok(toks, q.tokEnd-1, "times") && !timesCompare(toks, q.tokEnd) {
		q.unit = uNone
		q.noun = "times"
	}
	classify(toks, i, q, first)
	return q
}

// unitWords reads the unit written after a number at toks[j:].
func unitWords(toks []token, j int) (unitKind, int, bool) {
	w := low(toks, j)
	switch w {
	case "%":
		return uPercent, 1, false
	case "percent", "pc":
		return uPercent, 1, false
	case "per":
		if low(toks, j+1) == "cent" {
			return uPercent, 2, false
		}
	case "percentage":
		if l := low(toks, j+1); l == "point" || l == "points" || l == "pts" {
			return uPoints, 2, true
		}
	case "pp", "p.p.", "ppt", "ppts":
		return uPoints, 1, true
	case "point", "points", "pts", "pt":
		return uPoints, 1, false
	case "times", "x", "×":
		return uTimes, 1, false
	case "fold":
		return uTimes, 1, false
	case "-":
		if l := low(toks, j+1); attached(toks, j) && (l == "fold") {
			return uTimes, 2, false
		}
	}
	return uNone, 0, false
}

// timesCompare reports whether the words after "N times" make a comparison
// ("1.5 times as likely", "three times the rate", "twice more").
func timesCompare(toks []token, j int) bool {
	w := low(toks, j)
	switch w {
	case "as", "more", "less", "higher", "lower", "larger", "bigger", "greater", "smaller", "the", "that", "those",
		"what", "faster", "slower", "longer", "likelier", "over", "their", "its", "our":
		return true
	}
	return w == "" || w == "." || w == "," || w == ")" || w == ";"
}

// ofEvery reads "in 4", "out of 10", "in every 4", "of every 4" after a
// number and returns the denominator and the tokens read.
func ofEvery(toks []token, j int) (float64, int) {
	n := 0
	switch {
	case isWordTok(toks, j, "in"):
		n = 1
	case isWordTok(toks, j, "out") && isWordTok(toks, j+1, "of"):
		n = 2
	case isWordTok(toks, j, "of") && isWordTok(toks, j+1, "every"):
		n = 2
	default:
		return 0, 0
	}
	if isWordTok(toks, j+n, "every") {
		n++
	}
	k := j + n
	if k >= len(toks) {
		return 0, 0
	}
	switch toks[k].kind {
	case tNum:
		if toks[k].pct || toks[k].ident != "" || toks[k].dec > 0 || toks[k].val >= 1800 {
			return 0, 0
		}
		return toks[k].val, n + 1
	case tWord:
		if v, ok := numberWords[toks[k].low]; ok && v > 1 {
			return v, n + 1
		}
	}
	return 0, 0
}

func wordQuantity(toks []token, i int, used []bool) *quantity {
	t := toks[i]
	w := t.low
	mk := func(v float64, u unitKind, end int) *quantity {
		return &quantity{val: v, lo: v, hi: v, unit: u, word: true, start: t.start, end: toks[end-1].end,
			numStart: t.start, tok: i, tokEnd: end, ref: t.ref}
	}
	next := low(toks, i+1)
	prev := low(toks, i-1)
	// One-word multiples.
	if v, ok := multipleWords[w]; ok {
		switch w {
		case "twice", "thrice":
			switch next {
			case "a", "an", "per", "weekly", "monthly", "daily", "yearly", "annually", "each", "every", "in", "over",
				"during", "since", "before", "after", "this", "last", "that", "already", "so":
				return nil
			}
		case "double", "triple", "quadruple", "treble":
			if next == "-" || !(next == "the" || next == "that" || next == "what" || next == "its" || next == "their" ||
				prev == "to" || prev == "will" || prev == "would" || prev == "could" || prev == "nearly" || prev == "almost") {
				return nil
			}
		case "halves":
			return nil
		}
		q := mk(v, uTimes, i+1)
		q.multiple = w
		if strings.HasSuffix(w, "ed") || strings.HasSuffix(w, "ing") || strings.HasSuffix(w, "les") || strings.HasSuffix(w, "bles") {
			q.change = true
		}
		q.half = 0
		return q
	}
	// "three times as many", "three-fold", "three and a half times".
	if v, ok := numberWords[w]; ok {
		if next == "and" && low(toks, i+2) == "a" && low(toks, i+3) == "half" {
			k := i + 4
			if low(toks, k) == "times" && timesCompare(toks, k+1) {
				return mk(v+0.5, uTimes, k+1)
			}
			q := mk(v+0.5, uNone, k)
			q.half = 0.25
			return q
		}
		if next == "times" && timesCompare(toks, i+2) {
			q := mk(v, uTimes, i+2)
			return q
		}
		if (next == "-" && attached(toks, i+1) && low(toks, i+2) == "fold") || next == "fold" {
			end := i + 2
			if next == "-" {
				end = i + 3
			}
			return mk(v, uTimes, end)
		}
		// "one in four", "three out of ten".
		if b, n := ofEvery(toks, i+1); n > 0 && b > v && v > 0 {
			q := mk(100*v/b, uPercent, i+1+n)
			q.share = true
			return q
		}
		// Fractions: "two thirds of", "one third of", "three quarters of".
		if den, ok := fractionWords[next]; ok && v >= 1 && v < den && (v > 1 || den != 2) {
			after := low(toks, i+2)
			if after == "of" || after == "as" || (v > 1 && after != "-" && den != 4) {
				u := uPercent
				val := 100 * v / den
				if after == "as" {
					u, val = uTimes, v/den
				}
				q := mk(val, u, i+2)
				q.share = u == uPercent
				return q
			}
		}
		if next == "-" && attached(toks, i+1) {
			if den, ok := fractionWords[low(toks, i+2)]; ok && v >= 1 && v < den {
				q := mk(100*v/den, uPercent, i+3)
				q.share = true
				return q
			}
		}
		if w == "one" || w == "zero" || w == "hundred" {
			return nil
		}
		// "twenty-five", "twenty five".
		end := i + 1
		if v >= 20 && int(v)%10 == 0 {
			k := i + 1
			if low(toks, k) == "-" && attached(toks, k) {
				k++
			}
			if u, ok := numberWords[low(toks, k)]; ok && u < 10 && u > 0 {
				v += u
				end = k + 1
			}
		}
		// "a three-year pilot": a descriptor.
		if low(toks, end) == "-" && attached(toks, end) {
			return nil
		}
		if idNouns[prev] && prev != "" && toks[i-1].kind == tWord {
			return nil
		}
		q := mk(v, uNone, end)
		q.half = 0.5
		return q
	}
	// "half", "a half", "half as", "half the rate".
	if w == "half" {
		switch prev {
		case "first", "second", "last", "latter", "former", "other", "in", "by", "and":
			if prev != "by" || next != "as" {
				return nil
			}
		}
		if next == "-" || next == "an" || next == "hour" || next == "year" || next == "day" || next == "term" || next == "time" {
			return nil
		}
		if next == "as" {
			q := mk(0.5, uTimes, i+1)
			q.multiple = "half"
			return q
		}
		if next == "the" && rateNouns[low(toks, i+2)] {
			q := mk(0.5, uTimes, i+1)
			q.multiple = "half"
			return q
		}
		q := mk(50, uPercent, i+1)
		q.share = true
		if prev == "a" || prev == "one" {
			q.start = toks[i-1].start
		}
		return q
	}
	// "a third of", "a quarter of", "a fifth of".
	if w == "a" {
		if den, ok := fractionWords[next]; ok && den > 2 {
			after := low(toks, i+2)
			if after == "of" {
				q := mk(100/den, uPercent, i+2)
				q.share = true
				return q
			}
			if after == "as" {
				q := mk(1/den, uTimes, i+2)
				return q
			}
		}
	}
	return nil
}

// rateNouns after "half the" make it a ratio ("half the rate"), not a share.
var rateNouns = set("rate level number amount price cost time speed risk chance odds size average mean value spend share " +
	"figure volume count wait length score")

// classify marks the quantity as a non-claim (a year, date, time, name,
// list marker, confidence level) and reads the statistic label and the
// hedge before it.
func classify(toks []token, i int, q *quantity, first bool) {
	t := toks[i]
	p := q.tok // first token of the claim
	if t.cur != "" && p > 0 {
		p--
	}
	prev := low(toks, p-1)
	next := low(toks, q.tokEnd)
	bare := q.unit == uNone && t.cur == "" && t.suffix == "" && !t.pct && q.hedge != hRange

	// Interval ends: "95% CI 0.92–1.51", "(CI: 0.92 to 1.51)".
	if q.hedge == hRange {
		k := p - 1
		if k >= 0 && (toks[k].text == ":" || toks[k].low == "of" || toks[k].low == "from" || toks[k].low == "is" || toks[k].low == "was") {
			k--
		}
		if w := low(toks, k); w == "ci" || w == "interval" || w == "intervals" || w == "cis" {
			q.stat = "ci"
			return
		}
	}
	// Statistic labels.
	if stat, op, k := statLabel(toks, p); stat != "" {
		q.stat = stat
		switch op {
		case "<":
			q.hedge = hUnder
		case ">":
			q.hedge = hOver
		case "≤", "<=":
			q.hedge = hAtMost
		case "≥", ">=":
			q.hedge = hAtLeast
		case "≈", "~":
			q.hedge = hAbout
		}
		if q.hedge != hNone {
			q.hedgeText = op
		}
		q.start = toks[k].start
		if stat == "df" || stat == "t" {
			q.skip = "statistic"
		}
		return
	}
	if inDF(toks, p) {
		q.skip = "df"
		return
	}
	if q.skip != "" {
		return
	}
	// Dates, years, times.
	if months[prev] || months[next] || (next == "of" && months[low(toks, q.tokEnd+1)]) {
		if bare || q.skip == "" && t.dec == 0 && !t.pct {
			q.skip = "date"
			return
		}
	}
	if bare && t.dec == 0 && !t.comma && t.val >= 1800 && t.val <= 2199 {
		q.skip = "year"
		return
	}
	switch next {
	case "am", "pm", "a.m.", "p.m.", "a.m", "p.m", "o'clock", "o’clock":
		q.skip = "time"
		return
	}
	// Names and codes: "Store 12", "week 3", "#4", "Route 7".
	if p > 0 && toks[p-1].kind == tWord && !t.pct && q.unit == uNone && t.cur == "" {
		pw := toks[p-1]
		if idNouns[pw.low] {
			q.skip = "id"
			return
		}
		if p-1 > 0 && startsUpper(pw.text) && !months[pw.low] && !isStatWord(pw.low) && len(pw.text) > 1 && t.dec == 0 && spacedBefore(toks, p) {
			q.skip = "id"
			return
		}
	}
	if prev == "#" || prev == "no." || prev == "nos." || prev == "№" {
		q.skip = "id"
		return
	}
	// "per 100 visits", "out of 5": a denominator.
	if prev == "per" || (prev == "of" && low(toks, p-2) == "out") {
		q.skip = "denominator"
		return
	}
	// "[1]", "(2)": a reference or list mark.
	if (prev == "[" && next == "]") || (prev == "(" && next == ")" && bare && t.val < 100 && t.dec == 0) {
		q.skip = "mark"
		return
	}
	// A list marker at the start of a unit: "1. ...", "2) ...".
	if first && p == 0 && bare && (next == "." || next == ")") {
		q.skip = "list"
		return
	}
	// Confidence and significance levels: "95% CI", "at the 5% level".
	if q.unit == uPercent {
		switch next {
		case "ci", "cis", "confidence", "credible", "interval", "intervals", "prediction", "cl", "level", "significance", "bootstrap":
			q.skip = "level"
			return
		}
	}
	if prev == "alpha" || prev == "α" || (prev == "=" && (low(toks, p-2) == "alpha" || low(toks, p-2) == "α")) {
		q.skip = "level"
		return
	}
	// Hedges.
	if h, k := hedgeBefore(toks, p); k < p && (q.hedge == hNone || h == hAbout) {
		q.hedge = h
		q.hedgeText = joinLow(toks, k, p)
		q.start = toks[k].start
	}
	if h, n := hedgeAfterAt(toks, q.tokEnd); n > 0 && q.hedge == hNone {
		q.hedge = h
		q.hedgeText = joinLow(toks, q.tokEnd, q.tokEnd+n)
		q.end = toks[q.tokEnd+n-1].end
	}
	switch prev {
	case "from":
		q.role = "from"
	case "to":
		q.role = "to"
	}
}

func spacedBefore(toks []token, p int) bool { return p < len(toks) && toks[p].space }

func startsUpper(s string) bool {
	r, _ := utf8.DecodeRuneInString(s)
	return unicode.IsUpper(r)
}

func isStatWord(w string) bool {
	_, ok := statLabels[w]
	return ok
}

func joinLow(toks []token, a, b int) string {
	var parts []string
	for k := a; k < b && k < len(toks); k++ {
		parts = append(parts, toks[k].text)
	}
	return strings.Join(parts, " ")
}

// statLabel reads "LABEL [ (df) ] OP" before toks[p]; it returns the
// statistic, the operator and the index of the label's first token.
func statLabel(toks []token, p int) (string, string, int) {
	k := p - 1
	if k < 0 {
		return "", "", 0
	}
	op := ""
	symbol := false
	switch toks[k].text {
	case "=", "<", ">", "≤", "≥", "≈", "~", ":":
		op = toks[k].text
		symbol = op != ":"
		k--
		if k >= 0 && (toks[k].text == "<" || toks[k].text == ">") && op == "=" {
			op = toks[k].text + "="
			k--
		}
	default:
		if toks[k].kind == tWord && wordOps[toks[k].low] {
			op = toks[k].low
			k--
		}
	}
	if op == "" {
		// "r 0.42" is too loose; "odds ratio 1.8" is common.
		if k >= 1 && (toks[k].low == "ratio" || toks[k].low == "coefficient") {
			if l, ok := statLabels[toks[k-1].low+" "+toks[k].low]; ok {
				return l, "", k - 1
			}
		}
		return "", "", 0
	}
	// Skip a bracket of degrees of freedom: t(46), F(2, 45), χ²(2, N = 212).
	if k >= 0 && toks[k].text == ")" {
		depth := 0
		for m := k; m >= 0 && m > k-12; m-- {
			if toks[m].text == ")" {
				depth++
			}
			if toks[m].text == "(" {
				depth--
				if depth == 0 {
					k = m - 1
					break
				}
			}
		}
	}
	if k < 0 {
		return "", "", 0
	}
	// Two-word labels first.
	if k >= 1 {
		two := toks[k-1].low + " " + toks[k].low
		if toks[k].text == "value" && toks[k-1].low == "-" && k >= 2 {
			two = toks[k-2].low + "-value"
			if l, ok := statLabels[two]; ok {
				return l, op, k - 2
			}
		}
		if k >= 2 && toks[k-1].text == "-" {
			if l, ok := statLabels[toks[k-2].low+"-"+toks[k].low]; ok {
				return l, op, k - 2
			}
		}
		if l, ok := statLabels[two]; ok {
			return l, op, k - 1
		}
	}
	if toks[k].kind != tWord {
		return "", "", 0
	}
	w := toks[k].low
	l, ok := statLabels[w]
	if !ok {
		return "", "", 0
	}
	single := utf8.RuneCountInString(w) == 1 || w == "or" || w == "rr" || w == "sd" || w == "se" || w == "df"
	if single && !symbol {
		return "", "", 0
	}
	switch w {
	case "m", "or", "rr":
		if toks[k].text != strings.ToUpper(toks[k].text) {
			return "", "", 0
		}
	}
	return l, op, k
}

// inDF reports whether the number at toks[p] stands inside the degrees of
// freedom of a test: "t(46)", "F(2, 45)".
func inDF(toks []token, p int) bool {
	for k := p - 1; k >= 0 && k > p-6; k-- {
		switch {
		case toks[k].text == "(":
			if k > 0 {
				switch toks[k-1].low {
				case "t", "f", "χ²", "χ2", "chi2", "df":
					return true
				}
			}
			return false
		case toks[k].kind == tNum || toks[k].text == ",":
			continue
		default:
			return false
		}
	}
	return false
}

// movers before "up to" make it a level after a change ("went up to 45%"),
// not a hedge.
var movers = set("went go goes gone going moved move shot came come crept edged climbed rose jumped")

// hedgeBefore finds the longest hedge phrase that ends right before
// toks[p]; it returns the hedge and the index of its first token (p when
// there is none).
func hedgeBefore(toks []token, p int) (hedge, int) {
	for n := 4; n >= 1; n-- {
		k := p - n
		if k < 0 {
			continue
		}
		var parts []string
		ok := true
		for m := k; m < p; m++ {
			if toks[m].kind == tNum {
				ok = false
				break
			}
			parts = append(parts, toks[m].low)
		}
		if !ok {
			continue
		}
		phrase := strings.Join(parts, " ")
		h, found := hedgePhrases[phrase]
		if !found {
			continue
		}
		if phrase == "up to" && movers[low(toks, k-1)] {
			continue
		}
		return h, k
	}
	return hNone, p
}

func hedgeAfterAt(toks []token, j int) (hedge, int) {
	for n := 2; n >= 1; n-- {
		if j+n > len(toks) {
			continue
		}
		var parts []string
		for m := j; m < j+n; m++ {
			parts = append(parts, toks[m].low)
		}
		if h, ok := hedgeAfter[strings.Join(parts, " ")]; ok {
			return h, n
		}
	}
	if j < len(toks) && toks[j].text == "+" && attached(toks, j) {
		return hAtLeast, 1
	}
	return hNone, 0
}

// finish reads what surrounds a quantity: whether a change word governs it
// and the noun after it.
func finish(toks []token, q *quantity) {
	// The noun after.
	for k := q.tokEnd; k < len(toks) && k < q.tokEnd+3; k++ {
		if toks[k].kind == tWord {
			if q.noun == "" {
				q.noun = toks[k].low
			}
			break
		}
		if toks[k].kind == tNum {
			break
		}
	}
	if q.change || q.skip != "" {
		return
	}
	// The first token of the claim (its hedge, label or currency sign).
	p := q.tok
	for p > 0 && toks[p-1].start >= q.start {
		p--
	}
	q.first = p
	// Before: "rose 5%", "up by 5 points", "a difference of 5".
	k := p - 1
	by := false
	for steps := 0; k >= 0 && steps < 3; steps++ {
		w := toks[k].low
		if w == "by" || w == "a" || w == "an" || w == "another" || w == "further" || w == "some" || w == "just" ||
			(toks[k].kind == tWord && strings.HasSuffix(w, "ly") && len(w) > 4) {
			by = by || w == "by"
			k--
			continue
		}
		break
	}
	// "raised uptake by 21%", "cut waiting times by 4 minutes": the verb
	// stands before its object.
	if by && k >= 0 && !changeLead[toks[k].low] {
		for m := k - 1; m >= 0 && m >= k-4 && (toks[m].kind == tWord || toks[m].text == "-"); m-- {
			if changeLead[toks[m].low] {
				k = m
				break
			}
		}
	}
	if k >= 0 {
		w := toks[k].low
		switch {
		case w == "of" && k > 0 && changeNouns[toks[k-1].low]:
			q.change = true
		case w == "of" && k > 1 && changeNouns[toks[k-2].low] && toks[k-1].kind == tWord:
			// "a difference in renewal of 5 points" is rare; "a gap of" is common.
			q.change = changeNouns[toks[k-1].low]
		case w == "up" && k > 0 && (toks[k-1].low == "made" || toks[k-1].low == "make" || toks[k-1].low == "makes" || toks[k-1].low == "making" || toks[k-1].low == "take" || toks[k-1].low == "took" || toks[k-1].low == "takes"):
			// "made up 22% of loans": a share.
		case changeLead[w] && !(w == "more" || w == "less" || w == "fewer") && q.role == "":
			q.change = true
		case (w == "more" || w == "less" || w == "fewer") && q.role == "" && low(toks, k+1) == "by":
			q.change = true
		}
	}
	// After: "5% higher", "a 5-point rise", "5 points more likely".
	if !q.change {
		m := q.tokEnd
		// "1.2 kg more", "5 minutes longer": a unit between.
		if m+1 < len(toks) && toks[m].kind == tWord && unitNouns[toks[m].low] && changeNouns[toks[m+1].low] {
			m++
		}
		if m < len(toks) && toks[m].kind == tWord && changeNouns[toks[m].low] {
			// "5% more members" or "5% higher": a change; "40% or more" was a
			// hedge and is consumed.
			q.change = true
		}
		if m+1 < len(toks) && (toks[m].low == "percentage" || toks[m].low == "-") && changeNouns[toks[m+1].low] {
			q.change = true
		}
	}
}

// ciBefore reports whether the number at toks[i] follows "CI" or
// "interval" (and perhaps ":" or "of"): the start of an interval.
func ciBefore(toks []token, i int) bool {
	k := i - 1
	if k >= 0 && toks[k].cur != "" {
		k--
	}
	if k >= 0 && (toks[k].text == ":" || toks[k].low == "of" || toks[k].low == "from") {
		k--
	}
	w := low(toks, k)
	return w == "ci" || w == "interval" || w == "cis" || w == "intervals"
}

// unitNouns are measurement units written after a number.
var unitNouns = set("minutes minute mins min hours hour hrs hr days day weeks week months month years year seconds second " +
	"secs km kilometres kilometers miles mile metres meters kg kilos grams litres liters euros pounds dollars pence cents " +
	"degrees visits trips loans items books sessions calls tickets steps")
