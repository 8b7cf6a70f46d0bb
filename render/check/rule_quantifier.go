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
		`("most waits were under 30 minutes" needs a median below 30, per group when the sentence names one; "half waited longer than 35" a median of at least 35, "a ` +
		`quarter waited over 48" an upper quartile of at least 48, "no one waited more than 90" a maximum of at most 90). Thresholds: "most" and "majority" need more than 50%; "the vast majority" 75% or more (a warning from 50%); "nearly ` +
		`all" and "almost all" 90% (a warning from 75%); "all" 100% and "none" 0% after rounding; "few" and "hardly any" 20% or less ` +
		`(a warning up to 35%); "a minority" less than 50%. Shares are derived where the block does not publish them: the levels or ` +
		`bins of a frequency that meet a stated condition ("most tickets were booked more than a month ahead", "between 10 and 15 ` +
		`hours"), levels joined by "or" ("a family or a school"), the other outcome of a yes/no block ("most untrained volunteers ` +
		`left"), a group's share of all cases when the group is named apart from the quantifier ("most days had a hot menu"), and ` +
		`the share of a block's groups whose mean meets a threshold ("no school averaged less than 10 kg", "all four zones ` +
		`averaged over 90 minutes"). These are the project's reading of plain English. A quantifier the ` +
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
	{"majority of", "most"}, {"the bulk of", "most"}, {"the lion's share of", "most"}, {"the greater part of", "most"},
	{"the better part of", "most"}, {"a minority", "minority"}, {"the minority", "minority"}, {"hardly any", "few"}, {"hardly anyone", "few"},
	{"very few", "few"}, {"only a few", "few"}, {"a handful", "few"}, {"almost no", "few"}, {"virtually no", "few"},
	{"scarcely any", "few"}, {"almost none", "few"}, {"no one", "none"}, {"nobody", "none"}, {"not one", "none"},
	{"not a single", "none"}, {"none", "none"}, {"everyone", "all"}, {"everybody", "all"}, {"all", "all"}, {"every", "all"},
	{"both", "all"},
	{"most", "most"}, {"few", "few"},
}

// pluralNouns are plurals without an s ("most staff", "most people").
var pluralNouns = set("staff people children men women police personnel crew cattle data media folk youth public sheep fish")

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
			if next != "of" && !strings.HasSuffix(next, "s") && !pluralNouns[next] && !p.anyLabelAt(j) &&
				!(j+1 < len(s.toks) && s.toks[j].kind == tWord && s.toks[j+1].kind == tWord && strings.HasSuffix(s.toks[j+1].low, "s") && !notAfterMost[next]) {
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
				next == "time" || next == "other") && !(next != "time" && next != "other" && s.hasThreshold(j)) {
				continue // "every month" as an adverb; "every month was above 60%" is a claim
			}
		case "few":
			if prev == "the" || prev == "a" && low(s.toks, i-2) == "quite" || prev == "last" || prev == "next" || prev == "first" ||
				prev == "too" || prev == "so" {
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
	if fs, ok := p.groupQuantifier(kind, a, b, said); ok {
		return fs
	}
	if fs, ok := p.timeQuantifier(kind, a, b, said); ok {
		return fs
	}
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
	// "Most tickets were booked more than a month ahead": the levels of a
	// frequency that meet the condition.
	if f, _, ok := p.conditionShare(); ok {
		return f, f.val(), describe(f)
	}
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
		// "Most days had a hot menu", "the guide was used by the majority of
		// visitors": a group named outside the quantifier's noun phrase is
		// what most cases belong to; its share of all cases.
		if (bi.analysis == "compare" || bi.analysis == "summary") && len(bi.dim("group")) >= 2 {
			if g := p.predicateGroup(bi, a); g != nil && !p.namesOutcome(bi) && !p.hasFigure() {
				gn, n := bi.fact(g.slug+".n"), bi.fact("n")
				if gn != nil && n != nil && n.val() > 0 {
					return gn, 100 * gn.val() / n.val(), "the share of all cases in " + g.name() + " (" + showF(gn) + " of " + showF(n) + ")"
				}
			}
		}
		switch bi.analysis {
		case "frequency":
			// "a family or a school": the levels joined, summed.
			var sum float64
			var first *factInfo
			var names []string
			seen := map[*label]bool{}
			for k, m := range ms {
				if m.l.dim != "level" || seen[m.l] || !joined(s, ms, k) {
					continue
				}
				if f := bi.fact(m.l.slug + ".pct"); f != nil {
					seen[m.l] = true
					sum += f.val()
					names = append(names, m.l.name())
					if first == nil {
						first = f
					}
				}
			}
			if len(names) > 1 {
				return first, sum, "the share of " + strings.Join(names, " and ") + " together"
			}
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
			// names a group and no word of the opposite outcome; with such a
			// word ("most untrained volunteers left") it is about the rest.
			if !p.namesOutcome(bi) && g != nil && p.saysOpposite(bi) && !outcomeIsOpposite(bi) {
				if f := bi.fact(g.slug + ".pct"); f != nil {
					return f, 100 - f.val(), "the share for " + g.name() + " that is not " + outcomeName(bi) + " (100% − " + showF(f) + ")"
				}
			}
			if !p.namesOutcome(bi) && (g == nil || p.saysOpposite(bi)) {
				continue
			}
			if g != nil {
				if f := bi.fact(g.slug + ".pct"); f != nil {
					return f, f.val(), "the share for " + g.name()
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
	f := bi.fact(p.groupPrefix(bi) + stat)
	if f == nil {
		return nil
	}
	x := q.val
	bad := (under && f.val() >= x) || (!under && f.val() <= x)
	if !bad {
		return nil
	}
	return []Finding{p.atTok(Error, a, b, bi, "says %s %s but %s is %s; try %s", said, q.text(s.ut.text), describe(f), showF(f),
		quote("half were "+map[bool]string{true: "under ", false: "over "}[under]+showF(bi.fact(p.groupPrefix(bi)+"median"))))}
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
	f := bi.fact(p.groupPrefix(bi) + stat)
	if f == nil {
		return nil
	}
	x := q.val
	// Half over x needs the median at or above x, read literally as the
	// hedge says; a quarter over x needs the upper quartile there.
	eps := 1e-9 * math.Max(1, math.Abs(x))
	bad := (over && f.val() < x-eps) || (!over && f.val() > x+eps)
	if !bad {
		return nil
	}
	return []Finding{p.at(Error, sh.start, q.end, bi, "says %s %s but %s is %s; try %s", quote(sh.text(s.ut.text)), q.text(s.ut.text),
		describe(f), showF(f), quote(sh.text(s.ut.text)+" "+map[bool]string{true: "over ", false: "under "}[over]+showF(f)))}
}

// groupQuantifier reads a quantifier over the groups of a block ("no school
// averaged less than 10 kg", "all four zones averaged over 90 minutes",
// "most stores took over £9k a day") against each group's mean (median, when
// the sentence says so; share, for a yes/no outcome). ok is false when the
// quantifier is not about the block's groups.
func (p *Pass) groupQuantifier(kind string, a, b int, said string) ([]Finding, bool) {
	s := p.s
	band, known := quantBands[kind]
	if !known {
		return nil, false
	}
	for _, sc := range p.scope {
		bi := sc.bi
		if sc.score < 1 || (bi.analysis != "summary" && bi.analysis != "compare") || bi.meta.By == "" {
			continue
		}
		groups := bi.dim("group")
		if len(groups) < 2 || !p.namesGroupsNoun(bi, a, b, len(groups)) {
			continue
		}
		stat := bi.measureStat()
		if stat == "mean" && s.has("median", "medians", "typical") {
			stat = "median"
		}
		// The threshold: the first figure after the quantifier read with a
		// hedge or as a range.
		var q *quantity
		for _, o := range s.qs {
			if !o.claim() || o.tok < b {
				continue
			}
			if o.hedge == hUnder || o.hedge == hAtMost || o.hedge == hOver || o.hedge == hAtLeast || o.hedge == hRange {
				q = o
				break
			}
		}
		if q == nil || (stat == "pct") != (q.unit == uPercent) {
			continue
		}
		// "over £7k" against takings kept in thousands.
		if f := bi.fact(groups[0].slug + "." + stat); f != nil {
			if u := unscaled(q); u != nil && math.Abs(math.Log(math.Abs(u.val)/math.Abs(f.val()))) < math.Abs(math.Log(math.Abs(q.val)/math.Abs(f.val()))) {
				q = u
			}
		}
		meets := func(v float64) bool {
			switch q.hedge {
			case hUnder:
				return v < q.val
			case hAtMost:
				return v <= q.val+q.half
			case hOver:
				return v > q.val
			case hAtLeast:
				return v >= q.val-q.half
			}
			return v >= q.lo-q.half && v <= q.hi+q.half // a range
		}
		// The share of groups that meet the threshold, and a group that
		// shows the claim wrong: one that meets it for "none", one that
		// does not for the others.
		in := 0
		var show *factInfo
		var showL *label
		for _, g := range groups {
			f := bi.fact(g.slug + "." + stat)
			if f == nil {
				return nil, false
			}
			ok := meets(f.val())
			if ok {
				in++
			}
			if show == nil && ok == (kind == "none") {
				show, showL = f, g
			}
		}
		share := 100 * float64(in) / float64(len(groups))
		if band.ok(share) || show == nil {
			return nil, true
		}
		sev := Error
		if band.warn != nil && band.warn(share) {
			sev = Warning
		}
		return []Finding{p.atTok(sev, a, b, bi, "says %s %s but %d of %d %s meet it (the %s for %s is %s); try %s",
			said, q.text(s.ut.text), in, len(groups), plural(bi.meta.By), statNames[stat], showL.name(), showF(show),
			quote(itoa(in)+" of "+itoa(len(groups))+" "+plural(bi.meta.By)))}, true
	}
	return nil, false
}

// namesGroupsNoun reports whether the words right after a quantifier name
// the block's groups: the grouping column's word ("no school", "all
// branches"), or their number ("all four zones", "both routes").
func (p *Pass) namesGroupsNoun(bi *blockInfo, a, b, n int) bool {
	s := p.s
	by := map[string]bool{}
	for _, w := range splitWords(bi.meta.By) {
		if !stopWords[w] && len(w) > 1 {
			by[stem(w)] = true
		}
	}
	if s.toks[a].low == "both" && n == 2 {
		return true
	}
	for k := a + 1; k < len(s.toks) && k <= b+3; k++ {
		t := s.toks[k]
		if k < b && (t.kind == tWord && (quantWords[t.low] || stopWords[t.low])) {
			continue
		}
		if t.kind == tNum && t.val == float64(n) {
			continue
		}
		if v, ok := numberWords[t.low]; ok && v == float64(n) {
			continue
		}
		if t.low == "of" || t.low == "the" || t.low == "our" || t.low == "its" || t.low == "their" || t.text == "-" {
			continue
		}
		if t.kind != tWord {
			return false
		}
		for w := range by {
			if sameWord(t.stem, "~"+w) {
				return true
			}
		}
		return false
	}
	return false
}

// quantWords are the words of the quantifier phrases.
var quantWords = set("all every everyone everybody no none nobody not one single most majority minority vast great overwhelming " +
	"nearly almost virtually practically hardly scarcely very only few handful but a the")

func plural(w string) string {
	w = strings.ReplaceAll(strings.ToLower(w), "_", " ")
	switch {
	case strings.HasSuffix(w, "s"):
		return w
	case strings.HasSuffix(w, "ch") || strings.HasSuffix(w, "sh") || strings.HasSuffix(w, "x"):
		return w + "es"
	}
	return w + "s"
}

// predicateGroup returns the group of a block that a sentence names apart
// from the quantifier at token a, with words between ("most days had a hot
// menu", "the guide was used by the majority"), or nil when the group is
// part of the quantifier's noun phrase ("most hot-menu days").
func (p *Pass) predicateGroup(bi *blockInfo, a int) *label {
	s := p.s
	// The end of the quantifier's noun phrase: the quantifier, "of the",
	// and one noun.
	end := a + 1
	for end < len(s.toks) && (quantWords[s.toks[end].low] || s.toks[end].low == "of" || s.toks[end].low == "the") {
		end++
	}
	var g *label
	for _, m := range s.mentionsOf(bi) {
		if m.l.dim != "group" {
			continue
		}
		var between []token
		switch {
		case m.a > end:
			between = s.toks[end+1 : m.a]
		case m.b <= a:
			between = s.toks[m.b:a]
		default:
			return nil // inside the noun phrase
		}
		verb := false
		for _, t := range between {
			if t.kind == tWord && !stopWords[t.low] || t.low == "was" || t.low == "were" || t.low == "had" || t.low == "has" {
				verb = true
			}
		}
		if !verb {
			return nil
		}
		if g != nil && g != m.l {
			return nil
		}
		g = m.l
	}
	return g
}

// hasFigure reports whether the sentence states a figure (a threshold or a
// value, which makes a quantifier about the outcome).
func (p *Pass) hasFigure() bool {
	for _, q := range p.s.qs {
		if q.claim() && q.ref == "" {
			return true
		}
	}
	return len(p.s.refs) > 0
}

// outcomeIsOpposite reports whether the outcome a binary block counts is
// itself a word of the opposite kind ("churned", "late"), so that those
// words name it rather than its complement.
func outcomeIsOpposite(bi *blockInfo) bool {
	for _, c := range bi.meta.Columns {
		for _, w := range splitWords(c) {
			for _, o := range oppositeOutcome {
				if w == o || stem(w) == stem(o) {
					return true
				}
			}
		}
	}
	return false
}

// saysOpposite reports whether the sentence names the other outcome than
// the block's success: a word of the kind ("left", "late"), or the
// outcome's own word negated in one ("unhealthy" for healthy, "unresolved").
func (p *Pass) saysOpposite(bi *blockInfo) bool {
	s := p.s
	if s.has(oppositeOutcome...) {
		return true
	}
	for _, c := range bi.meta.Columns {
		for _, w := range splitWords(c) {
			if len(w) < 4 || stopWords[w] {
				continue
			}
			st := stem(w)
			for _, t := range s.toks {
				if t.kind != tWord {
					continue
				}
				for _, pre := range []string{"un", "non", "in", "dis"} {
					if strings.HasPrefix(t.low, pre) && sameWord(strings.TrimPrefix(t.stem, pre), "~"+st) {
						return true
					}
				}
			}
		}
	}
	return false
}

// outcomeName is how messages name a block's outcome: its column.
func outcomeName(bi *blockInfo) string {
	if len(bi.meta.Columns) == 0 {
		return "the outcome"
	}
	return strings.ReplaceAll(bi.meta.Columns[0], "_", " ")
}

// groupPrefix is "GROUP." for the one group of a block the sentence names
// ("half of South van deliveries"), "" when it names none or several.
func (p *Pass) groupPrefix(bi *blockInfo) string {
	var g *label
	for _, m := range p.s.mentionsOf(bi) {
		if m.l.dim != "group" {
			continue
		}
		if g != nil && g != m.l {
			return ""
		}
		g = m.l
	}
	if g == nil || bi.fact(g.slug+".median") == nil {
		return ""
	}
	return g.slug + "."
}

// timeQuantifier reads a quantifier over a trend's time points ("in most
// months punctuality was above 60%", "every week drew over 40 riders")
// against the share of time points whose value meets the threshold, for the
// group the sentence names. ok is false when the quantifier is not about
// the time points.
func (p *Pass) timeQuantifier(kind string, a, b int, said string) ([]Finding, bool) {
	s := p.s
	band, known := quantBands[kind]
	if !known {
		return nil, false
	}
	for _, sc := range p.scope {
		bi := sc.bi
		if sc.score < 1 || bi.analysis != "trend" || bi.meta.Time == "" {
			continue
		}
		times := bi.dim("time")
		if len(times) < 3 || !p.namesTimeNoun(bi, a, b) {
			continue
		}
		var group *label
		for _, m := range s.mentionsOf(bi) {
			if m.l.dim == "group" {
				if group != nil && group != m.l {
					return nil, false
				}
				group = m.l
			}
		}
		if len(bi.dim("group")) > 0 && group == nil {
			continue
		}
		stat := bi.measureStat()
		// The threshold: after the quantifier, or before it ("queued over 5
		// minutes in most weeks").
		var q *quantity
		for _, o := range s.qs {
			if o.claim() && (o.hedge == hUnder || o.hedge == hAtMost || o.hedge == hOver || o.hedge == hAtLeast || o.hedge == hRange) {
				if q == nil || (q.tok < b && o.tok >= b) {
					q = o
				}
			}
		}
		if q == nil || (stat == "pct") != (q.unit == uPercent) {
			continue
		}
		in := 0
		var show *factInfo
		var showL *label
		for _, t := range times {
			name := t.slug + "." + stat
			if group != nil {
				name = group.slug + "." + name
			}
			f := bi.fact(name)
			if f == nil {
				return nil, false
			}
			v := f.val()
			ok := false
			switch q.hedge {
			case hUnder:
				ok = v < q.val
			case hAtMost:
				ok = v <= q.val+q.half
			case hOver:
				ok = v > q.val
			case hAtLeast:
				ok = v >= q.val-q.half
			default:
				ok = v >= q.lo-q.half && v <= q.hi+q.half
			}
			if ok {
				in++
			}
			if show == nil && ok == (kind == "none") {
				show, showL = f, t
			}
		}
		share := 100 * float64(in) / float64(len(times))
		if band.ok(share) || show == nil {
			return nil, true
		}
		sev := Error
		if band.warn != nil && band.warn(share) {
			sev = Warning
		}
		return []Finding{p.atTok(sev, a, b, bi, "says %s %s but %d of %d time points meet it (%s was %s); try %s",
			said, q.text(s.ut.text), in, len(times), showL.name(), showF(show), quote(itoa(in)+" of "+itoa(len(times))))}, true
	}
	return nil, false
}

// namesTimeNoun reports whether the words after a quantifier name a trend's
// time points: its time column's word ("most months" for month, "every
// week") or a time unit of the same kind.
func (p *Pass) namesTimeNoun(bi *blockInfo, a, b int) bool {
	s := p.s
	want := map[string]bool{}
	for _, w := range splitWords(bi.meta.Time) {
		if u := timeUnits[w]; u != "" {
			want[u] = true
		}
		want[stem(w)] = true
	}
	for k := a + 1; k < len(s.toks) && k <= b+3; k++ {
		t := s.toks[k]
		if t.kind != tWord {
			return false
		}
		if quantWords[t.low] || t.low == "of" || t.low == "the" || t.low == "single" {
			continue
		}
		if _, ok := numberWords[t.low]; ok {
			continue
		}
		return want[t.stem] || want[timeUnits[t.low]]
	}
	return false
}

// hasThreshold reports whether a figure read with an inequality or as a
// range stands after token j ("above 60%", "between 40 and 50").
func (s *sentence) hasThreshold(j int) bool {
	for _, q := range s.qs {
		if q.claim() && q.tok >= j && !q.change {
			switch q.hedge {
			case hUnder, hAtMost, hOver, hAtLeast, hRange:
				return true
			}
		}
	}
	return false
}
