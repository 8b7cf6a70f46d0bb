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
	pp          bool    // "percentage points" or "pp": points for certain
	share       bool    // a share said as a fraction ("one in four", "half of")
	den         float64 // the denominator of "one in four" (4), 0 otherwise
	word        bool    // said in words ("twice", "a third", "twelve")
	multiple    string  // the one-word multiple ("twice", "doubled", "halved")
	change      bool    // a change or difference ("rose 5%", "5 points higher")
	hedge       hedge
	hedgeText   string
	stat        string  // the statistic named right before it ("p", "r", "n", ...)
	ref         string  // the inline value it stands in
	skip        string  // why it is not a claim ("year", "date", "id", ...)
	role        string  // "from" or "to" in "from 38% to 45%"
	noun        string  // the first word after it
	cur         string  // currency sign
	scale       float64 // the multiplier of a suffix or scale word ("12k", "£3.4 million"), 0 for none
	scaleWord   string  // how the scale was written ("k", " million")
	start, end  int     // the claim: hedge, number and unit
	numStart    int     // the number itself
	tok, tokEnd int     // token range of the number and its unit
	first       int     // token of the claim's start (its hedge or label)
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
				// "four items or more".
				if q.hedge == hNone && q.unit == uNone {
					e := q.tokEnd
					if e < len(toks) && toks[e].kind == tWord && !stopWords[toks[e].low] {
						e++
					}
					if h, n := hedgeAfterAt(toks, e); n > 0 {
						q.hedge, q.hedgeText = h, joinLow(toks, e, e+n)
					}
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
	markScales(toks, out)
	// "weeks 3 to 5", "aged 18 to 39", "Stores 12 and 14": the second number
	// of a name is a name too.
	for k := 1; k < len(out); k++ {
		a, b := out[k-1], out[k]
		if a.skip != "id" || b.skip != "" || b.tok != a.tokEnd+1 || b.unit != uNone {
			continue
		}
		switch low(toks, a.tokEnd) {
		case "to", "and", "or", "–", "-", "through":
			b.skip = "id"
		}
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

// markScales marks the ends of a rating scale as no claims: "(1 to 5)",
// "a scale of 1 to 10", "on a 0–10 scale".
func markScales(toks []token, qs []*quantity) {
	small := func(q *quantity) bool {
		return q.claim() && q.unit == uNone && q.val == math.Trunc(q.val) && q.val >= 0 && q.val <= 100
	}
	for k, q := range qs {
		if !small(q) {
			continue
		}
		var b *quantity
		switch {
		case q.hedge == hRange && q.lo <= 1 && q.hi > q.lo:
			b = q
		case k+1 < len(qs) && small(qs[k+1]) && qs[k+1].tok == q.tokEnd+1 && q.val <= 1 && qs[k+1].val > 1 &&
			(low(toks, q.tokEnd) == "to" || low(toks, q.tokEnd) == "–"):
			b = qs[k+1]
		default:
			continue
		}
		before, after := low(toks, q.first-1), low(toks, b.tokEnd)
		if q.first == 0 {
			before = low(toks, q.tok-1)
		}
		if (before == "(" && (after == ")" || after == "scale")) || after == "scale" || before == "of" && low(toks, q.tok-2) == "scale" {
			q.skip, b.skip = "scale", "scale"
		}
	}
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
		q.scaleWord = "k"
	case "m", "mn", "mm":
		if t.cur != "" {
			scale = 1e6
			q.scaleWord = t.suffix
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
			q.scaleWord = " thousand"
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
		q.scale = scale
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
		j := k + 1
		if isWordTok(toks, k, "and") && k+2 < len(toks) && toks[k+1].kind == tPunct && toks[k+2].cur != "" {
			j++ // "between €10 and €20"
		}
		if isWordTok(toks, k, "and") && j < len(toks) && toks[j].kind == tNum {
			hi := numberQuantity(toks, j, used, false)
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
	// "4.4 out of 5", "rated it 4 out of 5": a score on a scale, not a
	// share; the scale's top is no claim.
	if q.unit == uNone && q.hedge != hRange && isWordTok(toks, q.tokEnd, "out") && isWordTok(toks, q.tokEnd+1, "of") &&
		q.tokEnd+2 < len(toks) && toks[q.tokEnd+2].kind == tNum && (t.dec > 0 || ratedBefore(toks, i)) {
		q.tokEnd += 3
		q.end = toks[q.tokEnd-1].end
		classify(toks, i, q, first)
		q.noun = "out"
		return q
	}
	// "1 in 4", "3 out of 10".
	if q.unit == uNone && q.hedge != hRange {
		if b, n := ofEvery(toks, q.tokEnd); n > 0 && b > q.val && q.val > 0 && b <= 1000 {
			q.val = 100 * q.val / b
			q.lo, q.hi = q.val, q.val
			q.unit, q.share, q.den = uPercent, true, b
			q.half = 100 * 0.5 / b
			q.tokEnd += n
			q.end = toks[q.tokEnd-1].end
		}
	}
	// "3 to 1": a ratio, unless it runs from one value to another.
	if q.unit == uNone && q.hedge != hRange && isWordTok(toks, q.tokEnd, "to") && q.tokEnd+1 < len(toks) &&
		(toks[q.tokEnd+1].low == "1" || toks[q.tokEnd+1].low == "one") && q.val > 1 && low(toks, i-1) != "from" && low(toks, i-1) != "between" &&
		(q.tokEnd+2 >= len(toks) || toks[q.tokEnd+2].kind != tWord || !unitNouns[toks[q.tokEnd+2].low]) {
		q.unit = uTimes
		q.tokEnd += 2
		q.end = toks[q.tokEnd-1].end
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

// docNouns name parts of a document, numbered with decimals too ("Table
// 2.1", "section 3.4").
var docNouns = set("table tables figure figures fig fig. chart section sections chapter page pages p. pp. appendix version " +
	"release footnote note equation eq step question q rule item")

// ratedBefore reports whether a rating verb stands shortly before toks[i]
// ("rated the visit 4 out of 5", "scored it 3 out of 10").
func ratedBefore(toks []token, i int) bool {
	for k := i - 1; k >= 0 && k >= i-4; k-- {
		if gaveWords[toks[k].low] || toks[k].low == "average" || toks[k].low == "averaged" || toks[k].low == "mean" {
			return true
		}
	}
	return false
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
	if w == "" || w == "." || w == "," || w == ")" || w == ";" {
		return true
	}
	// "1.4 times North Sound's": times another's figure.
	if j < len(toks) && toks[j].kind == tWord && startsUpper(toks[j].text) {
		return true
	}
	for k := j; k < len(toks) && k < j+3; k++ {
		if toks[k].kind == tWord && (strings.HasSuffix(toks[k].low, "'s") || strings.HasSuffix(toks[k].low, "’s")) {
			return true
		}
		// "cold evenings'": a plural's possessive.
		if k > j && (toks[k].text == "'" || toks[k].text == "’") && attached(toks, k) {
			return true
		}
		if toks[k].kind != tWord {
			break
		}
	}
	return false
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
		// "outnumbered them three to one": a ratio.
		if next == "to" && (low(toks, i+2) == "one" || low(toks, i+2) == "1") && v > 1 && prev != "from" && prev != "between" {
			return mk(v, uTimes, i+3)
		}
		if (next == "-" && attached(toks, i+1) && low(toks, i+2) == "fold") || next == "fold" {
			end := i + 2
			if next == "-" {
				end = i + 3
			}
			return mk(v, uTimes, end)
		}
		// "one in four", "three out of ten", "one ticket in ten".
		if b, n := ofEvery(toks, i+1); n > 0 && b > v && v > 0 {
			q := mk(100*v/b, uPercent, i+1+n)
			q.share, q.den = true, b
			return q
		}
		// "one ticket in ten", "one evening drop-off in three": a noun
		// phrase of up to four words between.
		if i+1 < len(toks) && toks[i+1].kind == tWord && !stopWords[next] && !prepositions[next] {
			for k := i + 2; k < len(toks) && k <= i+5; k++ {
				if isWordTok(toks, k, "in") {
					if b, n := ofEvery(toks, k); n > 0 && b > v && v > 0 {
						q := mk(100*v/b, uPercent, k+n)
						q.share, q.den = true, b
						return q
					}
					break
				}
				compound := toks[k-1].text == "-" && attached(toks, k) // "drop-off"
				if !(toks[k].kind == tWord && (compound || !prepositions[toks[k].low] && !stopWords[toks[k].low])) && toks[k].text != "-" {
					break
				}
			}
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
		// "half a minute", "half an hour": a half of one unit.
		if (next == "a" || next == "an") && (unitNouns[low(toks, i+2)] || unitNouns[low(toks, i+2)+"s"] || low(toks, i+2) == "point") {
			u := uNone
			if low(toks, i+2) == "point" {
				u = uPoints
			}
			q := mk(0.5, u, i+3)
			q.half, q.word = 0.05, false // a measurement, read within a tenth
			q.noun = low(toks, i+2)
			return q
		}
		// "fell by half": a relative change of 50%.
		if prev == "by" && next != "as" && next != "-" && next != "an" && next != "a" && !unitNouns[next+"s"] {
			return mk(50, uPercent, i+1)
		}
		switch prev {
		case "first", "second", "last", "latter", "former", "other", "in", "by", "and":
			if prev != "by" || next != "as" {
				return nil
			}
		}
		if next == "-" || next == "an" || next == "hour" || next == "year" || next == "day" || next == "term" || next == "time" {
			return nil
		}
		// "half as long again", "half as much time again", "half again as
		// much": one and a half times.
		if next == "again" && low(toks, i+2) == "as" {
			q := mk(1.5, uTimes, i+2)
			return q
		}
		if next == "as" {
			for k := i + 3; k <= i+5 && k < len(toks); k++ {
				if toks[k].kind != tWord {
					break
				}
				if toks[k].low == "again" {
					return mk(1.5, uTimes, k+1)
				}
			}
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
			// "a third of a point": a fraction of one unit.
			if n4 := low(toks, i+4); after == "of" && (low(toks, i+3) == "a" || low(toks, i+3) == "an") && (n4 == "point" || unitNouns[n4] || unitNouns[n4+"s"]) {
				u := uNone
				if low(toks, i+4) == "point" {
					u = uPoints
				}
				q := mk(1/den, u, i+5)
				q.half, q.word = 0.1/den, false // a measurement, read within a tenth
				q.noun = n4
				return q
			}
			if after == "of" {
				q := mk(100/den, uPercent, i+2)
				q.share = true
				return q
			}
			// "fell by a third", "a quarter higher": a relative change.
			if prev == "by" || changeNouns[after] {
				return mk(100/den, uPercent, i+2)
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
		// "Table 2.1" is a name; "rated their visit 4.4" is a score.
		if idNouns[pw.low] && (t.dec == 0 || docNouns[pw.low]) {
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
	// "164 of the 480 deliveries", "13 of the 14 trained ones": the second
	// figure counts the cases the first is a part of.
	if bare && t.dec == 0 {
		k := p - 1
		if low(toks, k) == "the" || low(toks, k) == "all" {
			k--
		}
		if low(toks, k) == "of" && k > 0 && toks[k-1].kind == tNum && toks[k-1].dec == 0 && !toks[k-1].pct && toks[k-1].val < t.val {
			q.stat = "n"
			return
		}
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
	// "ordered again within 30 days", "left within 8 minutes of the
	// timetable": a window that defines what was counted, not a claim.
	if prev == "within" && q.unit == uNone && timeUnits[next] != "" {
		q.skip = "window"
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
	} else if h, n := hedgeAfterAt(toks, q.tokEnd+1); n > 0 && q.hedge == hNone && q.tokEnd < len(toks) && toks[q.tokEnd].kind == tWord &&
		!stopWords[next] {
		// "40 kg or more", "15 hours or more".
		q.hedge = h
		q.hedgeText = joinLow(toks, q.tokEnd+1, q.tokEnd+1+n)
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
	// The first token of the claim (its hedge, label or currency sign).
	p := q.tok
	for p > 0 && toks[p-1].start >= q.start {
		p--
	}
	q.first = p
	if q.change || q.skip != "" {
		return
	}
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
		found := false
		for m := k - 1; m >= 0 && m >= k-4 && (toks[m].kind == tWord || toks[m].text == "-"); m-- {
			if changeLead[toks[m].low] {
				k = m
				found = true
				break
			}
		}
		// "did better than the 18 to 39 group by 7 points": the comparison
		// stands before its object, numbers and all.
		for m := k - 1; !found && m >= 0 && !strings.Contains(",;:()", toks[m].text); m-- {
			if toks[m].kind == tWord && (comparatives[toks[m].low] || toks[m].low == "better" || toks[m].low == "worse" ||
				toks[m].low == "beat" || toks[m].low == "beats" || toks[m].low == "led" || toks[m].low == "leads" ||
				(strings.HasPrefix(toks[m].low, "out") && (strings.HasSuffix(toks[m].low, "ed") || strings.HasSuffix(toks[m].low, "old")) && len(toks[m].low) > 6)) {
				q.change = true
				return
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
