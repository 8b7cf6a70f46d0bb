package check

import (
	"math"
	"strings"

	"candor/blocks"
)

var quantifierRule = &Rule{
	ID: "quantifier",
	Doc: `quantifier flags "most", "the majority", "nearly all", "all", "none", "few", "a minority" against the share they are ` +
		`about: a level of a frequency, a group's success rate in a compare block (when the sentence names the outcome), a cell of a ` +
		`crosstab, a time point of a trend, the R² of a fit ("explains nearly all of the variation"), or, for a summary, the quartiles ` +
		`("most waits were under 30 minutes" needs a median below 30, "half waited longer than 35" a median of at least 35, "a ` +
		`quarter waited over 48" an upper quartile of at least 48, "no one waited more than 90" a maximum of at most 90). Thresholds: "most" and "majority" need more than 50%; "the vast majority" 75% or more (a warning from 50%); "nearly ` +
		`all" and "almost all" 90% (a warning from 75%); "all" 100% and "none" 0% after rounding; "few" and "hardly any" 20% or less ` +
		`(a warning up to 35%); "a minority" less than 50%. These are the project's reading of plain English. A quantifier the ` +
		`sentence does not tie to a share is not read. Severity error when contradicted, warning when only stretched.`,
	Check: checkQuantifier,
}

type qband struct {
	ok     func(v float64) bool
	warn   func(v float64) bool // stretched but not contradicted
	phrase string
}

var quantBands = map[string]qband{
	"most":       {ok: func(v float64) bool { return v > 50 }, phrase: "more than half"},
	"vast":       {ok: func(v float64) bool { return v >= 75 }, warn: func(v float64) bool { return v > 50 }, phrase: "at least three in four"},
	"nearly all": {ok: func(v float64) bool { return v >= 90 }, warn: func(v float64) bool { return v >= 75 }, phrase: "nine in ten or more"},
	"all":        {ok: func(v float64) bool { return v >= 99.95 }, phrase: "every one"},
	"none":       {ok: func(v float64) bool { return v <= 0.05 }, phrase: "none at all"},
	"few":        {ok: func(v float64) bool { return v <= 20 }, warn: func(v float64) bool { return v <= 35 }, phrase: "one in five or fewer"},
	"minority":   {ok: func(v float64) bool { return v < 50 }, phrase: "fewer than half"},
}

var quantPhrases = []struct{ phrase, kind string }{
	{"the vast majority", "vast"}, {"a vast majority", "vast"}, {"the overwhelming majority", "vast"}, {"an overwhelming majority", "vast"},
	{"the great majority", "vast"}, {"nearly all", "nearly all"}, {"almost all", "nearly all"}, {"virtually all", "nearly all"},
	{"practically all", "nearly all"}, {"nearly every", "nearly all"}, {"almost every", "nearly all"}, {"almost everyone", "nearly all"},
	{"nearly everyone", "nearly all"}, {"all but a few", "nearly all"}, {"the majority", "most"}, {"a majority", "most"},
	{"majority of", "most"}, {"a minority", "minority"}, {"the minority", "minority"}, {"hardly any", "few"}, {"hardly anyone", "few"},
	{"very few", "few"}, {"only a few", "few"}, {"a handful", "few"}, {"almost no", "few"}, {"virtually no", "few"},
	{"scarcely any", "few"}, {"almost none", "few"}, {"no one", "none"}, {"nobody", "none"}, {"not one", "none"},
	{"not a single", "none"}, {"none", "none"}, {"everyone", "all"}, {"everybody", "all"}, {"all", "all"}, {"every", "all"},
	{"most", "most"}, {"few", "few"},
}

var notAfterMost = set("likely often common commonly popular frequent frequently recent recently important used visited " +
	"active affected improved liked read borrowed striking notable noticeable expensive successful effective useful " +
	"valuable significant")

// noNotQuantity after a sentence's first "No" make it something else than
// "none of them" ("No difference was found", "No significant change").
var noNotQuantity = set("difference differences effect effects impact change changes link association relationship evidence " +
	"significant clear real reliable meaningful one doubt longer more less further other single data test trend pattern")

var prepositions = set("at after in across for of from among with by on over to within throughout under between")

func checkQuantifier(p *Pass) []Finding {
	s := p.s
	kind, a, b := "", -1, -1
	for _, qp := range quantPhrases {
		i, j, ok := s.hasPhrase(qp.phrase)
		if !ok {
			continue
		}
		w := s.toks[i].low
		next := low(s.toks, j)
		prev := low(s.toks, i-1)
		switch qp.phrase {
		case "most":
			if prev == "the" || prev == "at" || prev == "for" || notAfterMost[next] || next == "" || next == "." {
				continue
			}
			if next != "of" && !strings.HasSuffix(next, "s") && !p.anyLabelAt(j) {
				continue
			}
		case "all", "every", "everyone", "everybody":
			if prepositions[prev] || prev == "not" || next == "but" || next == "in" || next == "the same" {
				continue
			}
			if j < len(s.toks) && s.toks[j].kind == tNum {
				continue
			}
			if _, isNum := numberWords[next]; isNum {
				continue
			}
			if w == "every" && (next == "week" || next == "month" || next == "day" || next == "year" || next == "quarter" ||
				next == "time" || next == "other") {
				continue
			}
		case "few":
			if prev == "the" || prev == "a" && low(s.toks, i-2) == "quite" || prev == "last" || prev == "next" || prev == "first" {
				continue
			}
		}
		kind, a, b = qp.kind, i, j
		break
	}
	// "No member borrowed more than 12 books": a sentence that opens with "No".
	if kind == "" && len(s.toks) > 2 && s.toks[0].low == "no" && s.toks[1].kind == tWord && !noNotQuantity[s.toks[1].low] {
		kind, a, b = "none", 0, 2
	}
	// "Half of patients waited longer than 35 minutes": a quartile claim.
	if kind == "" {
		for _, q := range s.qs {
			if q.claim() && q.share && q.word && (q.val == 50 || q.val == 25) && q.hedge == hNone {
				if fs := p.shareQuartile(q); fs != nil {
					return fs
				}
			}
		}
	}
	if kind == "" {
		return nil
	}
	said := quote(s.tokText(a, b))
	f, share, what := p.shareOf(a)
	if f == nil {
		return p.quartileQuantifier(kind, a, b, said)
	}
	// "Most monthly members did not renew": the share of the others. A
	// negation inside a group's name ("without a card") does not count.
	inLabel := map[int]bool{}
	for _, m := range s.mentionsOf(f.block) {
		for k := m.a; k < m.b; k++ {
			inLabel[k] = true
		}
	}
	for k := b; k < len(s.toks) && s.clause[k] == s.clause[a]; k++ {
		if inLabel[k] {
			continue
		}
		if negations[s.toks[k].low] || strings.HasSuffix(s.toks[k].low, "n't") {
			share = 100 - share
			what = "the share not in it (100% − " + what + ")"
			break
		}
	}
	band := quantBands[kind]
	if band.ok(share) {
		return nil
	}
	sev := Error
	if band.warn != nil && band.warn(share) {
		sev = Warning
	}
	return []Finding{p.atTok(sev, a, b, f.block, "says %s but %s is %s; try %s", said, what, show(share, blocks.Percent), quote(shareWords(share)))}
}

// shareWords says a share honestly in words.
func shareWords(v float64) string {
	r := plain(v, blocks.Percent)
	switch {
	case v <= 0.05:
		return "none"
	case v < 15:
		return r + ", few"
	case v < 45:
		return r + ", fewer than half"
	case v <= 55:
		return r + ", about half"
	case v < 75:
		return r + ", more than half"
	case v < 90:
		return r + ", about " + ninths(v)
	case v < 99.95:
		return r + ", nearly all"
	}
	return "all"
}

func ninths(v float64) string {
	n := math.Round(v / 10)
	return [...]string{"none", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine", "ten"}[int(n)] + " in ten"
}

// anyLabelAt reports whether a label of a block in scope starts at token i.
func (p *Pass) anyLabelAt(i int) bool {
	for _, sc := range p.scope {
		for _, m := range p.s.mentionsOf(sc.bi) {
			if m.a == i || m.a == i+1 {
				return true
			}
		}
		if i < len(p.s.toks) && sc.bi.vocab[p.s.toks[i].stem] {
			return true
		}
	}
	return false
}

// shareOf returns the share a quantifier at token a is about, with its
// value and a description.
func (p *Pass) shareOf(a int) (*factInfo, float64, string) {
	s := p.s
	for _, sc := range p.scope {
		if sc.score < 1 {
			continue
		}
		bi := sc.bi
		ms := s.mentionsOf(bi)
		pick := func(d string) *label {
			for _, m := range ms {
				if m.l.dim == d && (m.b <= a || m.a >= a) {
					return m.l
				}
			}
			return nil
		}
		// "Steps explain nearly all of the variation": R² as a share.
		if (bi.analysis == "regression" || bi.analysis == "correlation") && s.has("variation", "variance", "explain", "explains",
			"explained", "accounts", "account", "accounted") {
			if f := bi.fact("r2"); f != nil {
				return f, f.val() * 100, "the share of variation explained (R²)"
			}
		}
		switch bi.analysis {
		case "frequency":
			if l := pick("level"); l != nil {
				if f := bi.fact(l.slug + ".pct"); f != nil {
					return f, f.val(), "the share of " + l.text
				}
			}
		case "compare":
			if bi.measureStat() != "pct" {
				continue
			}
			g := pick("group")
			// The sentence must be about the outcome: it names its column, or
			// names a group and no word of the opposite outcome.
			if !p.namesOutcome(bi) && (g == nil || s.has(oppositeOutcome...)) {
				continue
			}
			if g != nil {
				if f := bi.fact(g.slug + ".pct"); f != nil {
					return f, f.val(), "the share for " + g.text
				}
			}
			if v, f := overallShare(bi); f != nil {
				return f, v, "the share over all groups"
			}
		case "crosstab":
			r, c := pick("row"), pick("col")
			if c == nil && len(bi.meta.Columns) > 1 && p.namesColumn(bi.meta.Columns[1]) {
				// "season ticket holders were satisfied": the column's yes.
				for _, l := range bi.dim("col") {
					switch strings.ToLower(l.text) {
					case "yes", "true", "1", "y":
						c = l
					}
				}
			}
			if r != nil && c != nil {
				if f := bi.fact(r.slug + "." + c.slug + ".row_pct"); f != nil {
					return f, f.val(), "the share of " + c.text + " among " + r.text
				}
			}
		case "trend":
			if bi.measureStat() != "pct" || !p.namesOutcome(bi) {
				continue
			}
			t := pick("time")
			g := pick("group")
			if t == nil {
				continue
			}
			name := t.slug + ".pct"
			if g != nil {
				name = g.slug + "." + name
			}
			if f := bi.fact(name); f != nil {
				return f, f.val(), "the share at " + t.text
			}
		}
	}
	return nil, 0, ""
}

// oppositeOutcome are words that name the other outcome than success.
var oppositeOutcome = []string{"left", "lapsed", "churned", "quit", "dropped", "cancelled", "canceled", "failed", "lost",
	"stopped", "declined", "refused", "missed", "abandoned", "unsubscribed", "late", "delayed", "overdue", "unresolved",
	"dissatisfied", "unsatisfied", "unhappy"}

// namesOutcome reports whether the sentence names the block's outcome
// column (so that "most renewed" is about the success share).
func (p *Pass) namesOutcome(bi *blockInfo) bool {
	cols := bi.meta.Columns
	if len(cols) == 0 {
		return wordLinks(p.s, bi) > 0
	}
	words := splitWords(cols[0])
	significant := 0
	for _, w := range words {
		if stopWords[w] {
			continue
		}
		significant++
		st := stem(w)
		for _, t := range p.s.toks {
			if t.kind == tWord && (t.stem == st || (len(st) >= 5 && strings.HasPrefix(t.stem, st[:5]))) {
				return true
			}
		}
	}
	if significant == 0 && len(words) > 0 {
		// "on_time": only the whole phrase names it.
		_, _, ok := p.s.hasPhrase(strings.Join(words, " "))
		return ok
	}
	return false
}

// overallShare is the success share over all groups of a binary compare:
// the groups' shares weighted by their n.
func overallShare(bi *blockInfo) (float64, *factInfo) {
	var sum, n float64
	var first *factInfo
	for _, g := range bi.dim("group") {
		f, c := bi.fact(g.slug+".pct"), bi.fact(g.slug+".n")
		if f == nil || c == nil {
			return 0, nil
		}
		if first == nil {
			first = f
		}
		sum += f.val() * c.val()
		n += c.val()
	}
	if n == 0 {
		return 0, nil
	}
	return sum / n, first
}

// quartileQuantifier reads "most waits were under 30 minutes" against a
// summary's quartiles: "most under X" needs the median below X, "nearly
// all under X" the upper quartile, "all under X" the maximum; the reverse
// for "over".
func (p *Pass) quartileQuantifier(kind string, a, b int, said string) []Finding {
	s := p.s
	var q *quantity
	for _, o := range s.qs {
		if o.claim() && o.tok > a && (o.hedge == hUnder || o.hedge == hAtMost || o.hedge == hOver || o.hedge == hAtLeast) && o.unit != uPercent {
			q = o
			break
		}
	}
	if q == nil {
		return nil
	}
	sc := p.best(1, func(bi *blockInfo) bool { return bi.analysis == "summary" && bi.fact("median") != nil })
	if sc == nil {
		return nil
	}
	bi := sc.bi
	under := q.hedge == hUnder || q.hedge == hAtMost
	stat := ""
	switch kind {
	case "most":
		stat = "median"
	case "nearly all", "vast":
		stat = "q3"
		if !under {
			stat = "q1"
		}
	case "all":
		stat = "max"
		if !under {
			stat = "min"
		}
	case "none":
		// "none over X" needs the maximum at or below X, "none under X" the
		// minimum at or above it.
		stat = "max"
		if under {
			stat = "min"
		}
		under = !under
	default:
		return nil
	}
	f := bi.fact(stat)
	if f == nil {
		return nil
	}
	x := q.val
	bad := (under && f.val() >= x) || (!under && f.val() <= x)
	if !bad {
		return nil
	}
	return []Finding{p.atTok(Error, a, b, bi, "says %s %s but %s is %s; try %s", said, q.text(s.ut.text), describe(f), showF(f),
		quote("half were "+map[bool]string{true: "under ", false: "over "}[under]+showF(bi.fact("median"))))}
}

// namesColumn reports whether the sentence names a column by a word of its
// name.
func (p *Pass) namesColumn(col string) bool {
	for _, w := range splitWords(col) {
		st := stem(w)
		for _, t := range p.s.toks {
			if t.kind == tWord && t.stem == st {
				return true
			}
		}
	}
	return false
}

// shareQuartile reads "half waited longer than 35 minutes" (the median
// above 35) and "a quarter waited over 48 minutes" (the upper quartile at
// or above 48) against a summary.
func (p *Pass) shareQuartile(sh *quantity) []Finding {
	s := p.s
	var q *quantity
	for _, o := range s.qs {
		if o != sh && o.claim() && o.tok > sh.tok && o.unit != uPercent &&
			(o.hedge == hUnder || o.hedge == hAtMost || o.hedge == hOver || o.hedge == hAtLeast) {
			q = o
			break
		}
	}
	if q == nil {
		return nil
	}
	sc := p.best(1, func(bi *blockInfo) bool { return bi.analysis == "summary" && bi.fact("median") != nil })
	if sc == nil {
		return nil
	}
	bi := sc.bi
	over := q.hedge == hOver || q.hedge == hAtLeast
	stat := "median"
	if sh.val == 25 {
		stat = "q1"
		if over {
			stat = "q3"
		}
	}
	f := bi.fact(stat)
	if f == nil {
		return nil
	}
	x := q.val
	// Half over x needs the median at or above x (within rounding); a
	// quarter over x needs the upper quartile there.
	bad := (over && f.val() < x-q.half) || (!over && f.val() > x+q.half)
	if !bad {
		return nil
	}
	return []Finding{p.at(Error, sh.start, q.end, bi, "says %s %s but %s is %s; try %s", quote(sh.text(s.ut.text)), q.text(s.ut.text),
		describe(f), showF(f), quote(sh.text(s.ut.text)+" "+map[bool]string{true: "over ", false: "under "}[over]+showF(f)))}
}
