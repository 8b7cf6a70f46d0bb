package check

import (
	"math"
	"regexp"
	"strconv"
	"strings"

	"candor/blocks"
)

// Shares a frequency does not publish but its levels add up to: "gave under
// 7.5 hours", "booked more than a month ahead", "between 10 and 15 hours a
// month". A sentence that states such a condition on the counted column is
// read against the sum of the levels (or bins) that meet it.

// condition is a condition on a number column stated in a sentence: a
// threshold ("under 7.5 hours", "within two weeks", "15 or more") or a range
// ("between 10 and 15", "30 to 60 days").
type condition struct {
	op     string  // "lt", "le", "gt", "ge" or "range"
	x      float64 // the threshold
	lo, hi float64 // the range
	unit   string  // the time unit it was said in ("week", "month"), "" for the column's own
	noun   string  // the word after the figure ("hours", "items")
	approx bool    // "a month": any edge from 28 to 31 days will do
	a, b   int     // its tokens
	text   string
}

// timeUnits are the units a threshold may be said in, by the word.
var timeUnits = map[string]string{
	"minute": "minute", "minutes": "minute", "min": "minute", "mins": "minute",
	"hour": "hour", "hours": "hour", "hr": "hour", "hrs": "hour", "h": "hour",
	"day": "day", "days": "day", "week": "week", "weeks": "week", "fortnight": "fortnight", "fortnights": "fortnight",
	"month": "month", "months": "month", "year": "year", "years": "year",
}

// inMinutes is each time unit in minutes; a month is 30 days.
var inMinutes = map[string]float64{"minute": 1, "hour": 60, "day": 1440, "week": 7 * 1440, "fortnight": 14 * 1440,
	"month": 30 * 1440, "year": 365 * 1440}

// conditions finds the conditions the sentence states on a number.
func (s *sentence) conditions() []condition {
	var out []condition
	toks := s.toks
	used := map[*quantity]bool{}
	unitAt := func(k int) string {
		if k < len(toks) && toks[k].kind == tWord {
			return timeUnits[toks[k].low]
		}
		return ""
	}
	for i, q := range s.qs {
		if used[q] || !(q.claim() || q.skip == "window") || q.unit == uPercent || q.unit == uPoints || q.unit == uTimes || q.stat != "" || q.change || q.role == "from" {
			continue
		}
		c := condition{a: q.first, b: q.tokEnd, unit: unitAt(q.tokEnd), noun: q.noun}
		if c.unit == "" && q.noun != "" {
			c.unit = timeUnits[q.noun]
		}
		switch {
		case q.hedge == hRange:
			c.op, c.lo, c.hi = "range", q.lo, q.hi
		case i+1 < len(s.qs) && s.qs[i+1].tok == q.tokEnd+1 && low(toks, q.tokEnd) == "to" && s.qs[i+1].claim() &&
			s.qs[i+1].unit == q.unit && s.qs[i+1].hedge == hNone:
			// "30 to 60 days ahead".
			o := s.qs[i+1]
			c.op, c.lo, c.hi, c.b = "range", q.val, o.val, o.tokEnd
			c.unit, c.noun = unitAt(o.tokEnd), o.noun
			used[o] = true
		case q.hedge == hUnder:
			c.op, c.x = "lt", q.val
		case q.hedge == hAtMost:
			c.op, c.x = "le", q.val
		case q.hedge == hOver:
			c.op, c.x = "gt", q.val
		case q.hedge == hAtLeast:
			c.op, c.x = "ge", q.val
		case low(toks, q.tok-1) == "within":
			c.op, c.x = "le", q.val
		default:
			continue
		}
		c.text = c.describe(s)
		out = append(out, c)
	}
	// "more than a month ahead", "within a week", "a year or more".
	for k := 1; k < len(toks); k++ {
		u := unitAt(k)
		if u == "" || (toks[k-1].low != "a" && toks[k-1].low != "an" && toks[k-1].low != "one") {
			continue
		}
		if s.quantityAt(k-1) != nil && s.quantityAt(k-1).claim() {
			continue
		}
		c := condition{x: 1, unit: u, approx: u == "month", a: k - 1, b: k + 1, noun: toks[k].low}
		h, start := hedgeBefore(toks, k-1)
		switch {
		case start < k-1 && (h == hOver || h == hJustOver):
			c.op = "gt"
		case start < k-1 && h == hAtLeast:
			c.op = "ge"
		case start < k-1 && (h == hUnder || h == hNearly):
			c.op = "lt"
		case start < k-1 && h == hAtMost:
			c.op = "le"
		case low(toks, k-2) == "within":
			c.op, start = "le", k-2
		default:
			if hh, n := hedgeAfterAt(toks, k+1); n > 0 && (hh == hAtLeast || hh == hAtMost) {
				c.op = map[hedge]string{hAtLeast: "ge", hAtMost: "le"}[hh]
				c.b = k + 1 + n
			} else {
				continue
			}
		}
		c.a = start
		c.text = s.tokText(c.a, c.b)
		out = append(out, c)
	}
	return out
}

// describe says the condition for a message: "under 7.5 hours",
// "between 10 and 15 hours", "15 or more".
func (c condition) describe(s *sentence) string {
	num := func(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }
	unit := ""
	if c.b < len(s.toks) && s.toks[c.b].kind == tWord && !stopWords[s.toks[c.b].low] && s.toks[c.b].low != "or" {
		unit = " " + s.toks[c.b].text // "under 7.5 hours", "4 items or more"
	}
	if c.approx {
		return s.tokText(c.a, c.b)
	}
	switch c.op {
	case "range":
		return "between " + num(c.lo) + " and " + num(c.hi) + unit
	case "lt":
		return "under " + num(c.x) + unit
	case "le":
		return "at most " + num(c.x) + unit
	case "gt":
		return "over " + num(c.x) + unit
	}
	return num(c.x) + unit + " or more"
}

// colUnit is the time unit a column counts in, from its name ("days_ahead",
// "hours_month", "minutes"): the first time word of the name.
func colUnit(col string) string {
	for _, w := range splitWords(col) {
		if u := timeUnits[w]; u != "" {
			return u
		}
	}
	return ""
}

// binEdges reads a bin label "[10, 12.5)".
var binLabel = regexp.MustCompile(`^\[\s*(-?[0-9.eE+]+)\s*,\s*(-?[0-9.eE+]+)\s*[)\]]$`)

// levelRange returns the values a level of a number column covers: a bin's
// edges, or a value's own.
func levelRange(l *label) (lo, hi float64, bin, ok bool) {
	if m := binLabel.FindStringSubmatch(strings.TrimSpace(l.text)); m != nil {
		a, err1 := strconv.ParseFloat(m[1], 64)
		b, err2 := strconv.ParseFloat(m[2], 64)
		return a, b, true, err1 == nil && err2 == nil
	}
	v, err := strconv.ParseFloat(strings.ReplaceAll(strings.TrimSpace(l.text), ",", ""), 64)
	return v, v, false, err == nil
}

// derivedShare returns the share of a frequency's cases that meet the
// condition, summed over its levels, and whether the levels can tell (a
// threshold between two bin edges cannot be read).
func derivedShare(bi *blockInfo, c condition) (float64, bool) {
	if bi.analysis != "frequency" || len(bi.meta.Columns) == 0 {
		return 0, false
	}
	factor := 1.0
	cu := colUnit(bi.meta.Columns[0])
	if c.unit != "" && cu != "" && c.unit != cu {
		a, b := inMinutes[c.unit], inMinutes[cu]
		if a == 0 || b == 0 {
			return 0, false
		}
		factor = a / b
	} else if c.unit != "" && cu == "" {
		return 0, false
	}
	// The condition must be on the counted column: said in its unit of
	// time, or with a word of its name ("under 7.5 hours" of hours_month,
	// "four items or more" of items).
	if c.unit == "" || cu == "" {
		named := false
		for _, w := range splitWords(bi.meta.Columns[0]) {
			if len(w) > 1 && c.noun != "" && sameWord(stem(c.noun), "~"+stem(w)) {
				named = true
			}
		}
		if !named {
			return 0, false
		}
	}
	levels := bi.dim("level")
	if len(levels) < 2 {
		return 0, false
	}
	type lv struct {
		lo, hi, pct float64
		bin         bool
	}
	var ls []lv
	var edges []float64
	for _, l := range levels {
		lo, hi, bin, ok := levelRange(l)
		f := bi.fact(l.slug + ".pct")
		if !ok || f == nil {
			return 0, false
		}
		ls = append(ls, lv{lo, hi, f.val(), bin})
		edges = append(edges, lo, hi)
	}
	// An edge that the threshold names: exact, or any from 28 to 31 days for
	// "a month".
	edge := func(x float64) (float64, bool) {
		x *= factor
		if !ls[0].bin {
			return x, true
		}
		for _, e := range edges {
			if math.Abs(e-x) <= 1e-9*math.Max(1, math.Abs(x)) {
				return e, true
			}
		}
		if c.approx && c.unit == "month" && cu != "" && cu != "month" && cu != "year" {
			d := 1440 / inMinutes[cu] // one day in the column's unit
			for _, e := range edges {
				if e >= 28*d*c.x && e <= 31*d*c.x {
					return e, true
				}
			}
		}
		return 0, false
	}
	sum := 0.0
	in := func(v lv, pred func(a, b float64) bool) {
		if pred(v.lo, v.hi) {
			sum += v.pct
		}
	}
	switch c.op {
	case "range":
		lo, ok1 := edge(c.lo)
		hi, ok2 := edge(c.hi)
		if !ok1 || !ok2 || hi <= lo {
			return 0, false
		}
		for _, v := range ls {
			in(v, func(a, b float64) bool { return a >= lo && b <= hi })
		}
	case "lt", "le":
		x, ok := edge(c.x)
		if !ok {
			return 0, false
		}
		for _, v := range ls {
			if v.bin {
				in(v, func(a, b float64) bool { return b <= x })
			} else if c.op == "lt" {
				in(v, func(a, b float64) bool { return a < x })
			} else {
				in(v, func(a, b float64) bool { return a <= x })
			}
		}
	case "gt", "ge":
		x, ok := edge(c.x)
		if !ok {
			return 0, false
		}
		for _, v := range ls {
			if v.bin {
				in(v, func(a, b float64) bool { return a >= x })
			} else if c.op == "gt" {
				in(v, func(a, b float64) bool { return a > x })
			} else {
				in(v, func(a, b float64) bool { return a >= x })
			}
		}
	default:
		return 0, false
	}
	return sum, true
}

// conditionShare returns the share of the best-tied frequency in scope
// that meets a condition the sentence states, as a fact for messages.
func (p *Pass) conditionShare() (*factInfo, condition, bool) {
	conds := p.s.conditions()
	if len(conds) == 0 {
		return nil, condition{}, false
	}
	for _, sc := range p.scope {
		if sc.score < 1 || sc.bi.analysis != "frequency" {
			continue
		}
		for _, c := range conds {
			if v, ok := derivedShare(sc.bi, c); ok {
				f := &factInfo{name: sc.bi.id + ".(" + c.text + ")", local: "(" + c.text + ")", stat: "pct", block: sc.bi,
					fact: blocks.Fact{Name: sc.bi.id + ".(" + c.text + ")", Value: v, Kind: blocks.Percent}}
				return f, c, true
			}
		}
	}
	return nil, condition{}, false
}
