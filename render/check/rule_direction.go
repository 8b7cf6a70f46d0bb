package check

import (
	"math"
	"strings"

	"candor/blocks"
)

var directionRule = &Rule{
	ID: "direction",
	Doc: `direction flags a rise described where the data fell, or the reverse. It reads change words ("rose", "grew", "fell", ` +
		`"declined", "doubled", "up 5 points") against the change a trend block computes (first to last time point, or between the ` +
		`time points the sentence names, per group when it names one) and against the sentence's own "from X to Y"; comparatives ` +
		`("higher", "lower", "more", "fewer", "outperformed") with "than" against the two groups, levels or time points named on ` +
		`either side; and the sign of a correlation or slope ("positively related", "as X rose, Y fell", "the more X, the more Y") ` +
		`against r or the coefficient. A negated word ("did not rise") is not read; a comparison of a binary outcome in the words of ` +
		`its opposite ("late more often" for an on-time share) is turned round. Severity error; a correlation's sign whose 95% ` +
		`interval reaches the claimed side is a warning.`,
	Check: checkDirection,
}

// dirWord is a direction word found in a sentence.
type dirWord struct {
	i    int // token
	sign int
	kind string // "change" or "compare"
}

func (p *Pass) directionWords() []dirWord {
	s := p.s
	// Words of a hedge ("more than 40%", "up to 45%") are not directions.
	inClaim := make([]bool, len(s.toks))
	for _, q := range s.qs {
		for k := range s.toks {
			if k < q.tok && s.toks[k].start >= q.start {
				inClaim[k] = true
			}
		}
	}
	var out []dirWord
	for i, t := range s.toks {
		if t.kind != tWord || inClaim[i] {
			continue
		}
		d, ok := directionWords[t.low]
		if !ok {
			continue
		}
		if s.negated(i) {
			continue
		}
		next := low(s.toks, i+1)
		prev := low(s.toks, i-1)
		switch t.low {
		case "up", "down":
			if !(i+1 < len(s.toks) && s.toks[i+1].kind == tNum || next == "by" || next == "from" || next == "on" || next == "to" ||
				prev == "went" || prev == "gone" || prev == "go" || prev == "goes" || prev == "came" || prev == "were" || prev == "was" ||
				prev == "is" || prev == "are" || prev == "been" || prev == "moved" || prev == "edged" || prev == "ticked" ||
				prev == "picked" || prev == "inched" || prev == "crept" || prev == "shot" || prev == "headed" || prev == "trended" ||
				prev == "creeping" || prev == "picking" || prev == "going" || prev == "coming") {
				continue
			}
			if prev == "set" || prev == "sign" || prev == "signed" || prev == "pick" || prev == "follow" || prev == "broken" || prev == "break" {
				continue
			}
		case "more", "less", "fewer":
			if next == "than" && i+2 < len(s.toks) && s.toks[i+2].kind == tNum {
				continue
			}
		}
		kind := "compare"
		if changeVerbs[t.low] {
			kind = "change"
		}
		if t.low == "more" || t.low == "less" {
			// "more" alone is too common ("more members", "more detail");
			// read it only in a comparison with "than" or "likely/often".
			if !(s.has("than") || next == "likely" || next == "often") {
				continue
			}
		}
		out = append(out, dirWord{i: i, sign: d, kind: kind})
	}
	return out
}

func checkDirection(p *Pass) []Finding {
	s := p.s
	ws := p.directionWords()
	if corr := p.correlationDirection(ws); corr != nil {
		return []Finding{*corr}
	}
	if len(ws) == 0 {
		return nil
	}
	var out []Finding
	mixed := false
	for _, w := range ws {
		if w.sign != ws[0].sign {
			mixed = true
		}
	}
	// The sentence's own "from X to Y".
	var from, to *quantity
	for _, q := range s.qs {
		if !q.claim() {
			continue
		}
		if q.role == "from" && from == nil {
			from = q
		}
		if q.role == "to" && from != nil && to == nil && q.unit == from.unit {
			to = q
		}
	}
	for _, w := range ws {
		if w.kind == "change" {
			if from != nil && to != nil && w.i < from.tok && from.val != to.val && p.fromFollows(w.i) {
				got := 1
				if to.val < from.val {
					got = -1
				}
				if got != w.sign {
					out = append(out, p.atTok(Error, w.i, w.i+1, nil, "says %s but the sentence's own figures go from %s to %s, a %s; try %s",
						quote(s.toks[w.i].text), from.text(s.ut.text), to.text(s.ut.text), riseFall(got), quote(verb(got, s.toks[w.i].low))))
					continue
				}
			}
			if f, ok := p.changeDirection(w, ws, mixed); ok {
				out = append(out, f)
			}
			continue
		}
		if f, ok := p.compareDirection(w); ok {
			out = append(out, f)
		}
	}
	return out
}

func riseFall(sign int) string {
	if sign > 0 {
		return "rise"
	}
	return "fall"
}

// verb suggests the opposite word of the same form.
func verb(sign int, w string) string {
	pairs := map[string]string{"rose": "fell", "fell": "rose", "rise": "fall", "fall": "rise", "rises": "falls", "falls": "rises",
		"increased": "decreased", "decreased": "increased", "increase": "decrease", "decrease": "increase", "grew": "shrank",
		"shrank": "grew", "declined": "rose", "dropped": "rose", "climbed": "fell", "higher": "lower", "lower": "higher",
		"more": "fewer", "fewer": "more", "less": "more", "up": "down", "down": "up", "gained": "lost", "jumped": "dropped",
		"greater": "smaller", "smaller": "greater", "larger": "smaller", "bigger": "smaller", "longer": "shorter", "shorter": "longer",
		"doubled": "fell", "halved": "rose", "improved": "worsened", "outperformed": "trailed", "trailed": "outperformed",
		"growth": "decline", "decline": "growth", "rising": "falling", "falling": "rising", "increasing": "decreasing",
		"decreasing": "increasing", "growing": "shrinking", "declining": "rising", "surged": "fell", "soared": "fell",
		"plunged": "rose", "slipped": "rose", "dipped": "rose", "exceeded": "trailed"}
	if o, ok := pairs[w]; ok {
		return o
	}
	if sign > 0 {
		return "rose"
	}
	return "fell"
}

// clauseLinked reports whether the clause of token i (or the sentence, when
// its direction words all agree) is tied to the block.
func (p *Pass) clauseLinked(i int, bi *blockInfo, mixed bool) bool {
	s := p.s
	if !mixed {
		for _, sc := range p.scope {
			if sc.bi == bi {
				return sc.score >= 1
			}
		}
		return false
	}
	c := s.clause[i]
	for k, t := range s.toks {
		if s.clause[k] != c && s.clause[k] != c-1 {
			continue
		}
		if t.kind == tWord && bi.vocab[t.stem] && !stopWords[t.low] {
			return true
		}
		if t.ref != "" && strings.HasPrefix(t.ref, bi.id+".") {
			return true
		}
	}
	for _, m := range s.mentionsOf(bi) {
		if s.clause[m.a] == c || s.clause[m.a] == c-1 {
			return true
		}
	}
	return false
}

// changeDirection judges a change word against the change over time of the
// best-tied block.
func (p *Pass) changeDirection(w dirWord, ws []dirWord, mixed bool) (Finding, bool) {
	s := p.s
	for _, sc := range p.scope {
		if sc.score < 1 {
			continue
		}
		bi := sc.bi
		var cs []*comparison
		if bi.analysis == "trend" {
			cs = p.trendSegment(bi, w, ws)
		} else {
			for _, c := range p.comparisons(bi) {
				if c.time {
					cs = append(cs, c)
				}
			}
		}
		if len(cs) == 0 || !p.clauseLinked(w.i, bi, mixed) {
			continue
		}
		// Per-group trends: every group the sentence covers must agree.
		sign := 0
		agree := true
		for _, c := range cs {
			d := c.abs()
			g := 0
			if d > 0 {
				g = 1
			} else if d < 0 {
				g = -1
			}
			if sign == 0 {
				sign = g
			} else if g != sign {
				agree = false
			}
		}
		if !agree || sign == 0 || sign == w.sign {
			return Finding{}, false
		}
		c := cs[0]
		if math.Abs(c.abs()) < 1e-12 {
			return Finding{}, false
		}
		dk := c.base()
		if dk == blocks.Percent {
			dk = blocks.Points
		}
		what := "the change " + c.names()
		return p.atTok(Error, w.i, w.i+1, bi, "says %s but %s is %s (%s to %s), a %s; try %s",
			quote(s.toks[w.i].text), what, signed(c.abs(), dk), showF(c.from), showF(c.to), riseFall(sign),
			quote(verb(sign, s.toks[w.i].low))), true
	}
	return Finding{}, false
}

func signed(v float64, k blocks.Kind) string {
	s := show(v, k)
	if v > 0 {
		s = "+" + s
	}
	return s
}

// compareDirection judges a comparative ("higher than") against the two
// labels named on either side of it.
func (p *Pass) compareDirection(w dirWord) (Finding, bool) {
	s := p.s
	than := -1
	for k := w.i + 1; k < len(s.toks); k++ {
		if s.toks[k].low == "than" {
			than = k
			break
		}
	}
	verbForm := strings.HasSuffix(s.toks[w.i].low, "ed") // outperformed, trailed, exceeded
	for _, sc := range p.scope {
		if sc.score < 1 {
			continue
		}
		bi := sc.bi
		ms := s.mentionsOf(bi)
		var a, b *mention
		pivot := than
		if pivot < 0 && verbForm {
			pivot = w.i
		}
		if pivot < 0 {
			// "Annual members were more likely to renew": one named group of
			// two, against the other.
			next := low(s.toks, w.i+1)
			if next != "likely" && next != "often" {
				continue
			}
			gs := bi.dim("group")
			if len(gs) != 2 {
				continue
			}
			var named *mention
			for k := range ms {
				if ms[k].l.dim == "group" && ms[k].a < w.i {
					if named != nil && named.l != ms[k].l {
						named = nil
						break
					}
					named = &ms[k]
				}
			}
			if named == nil {
				continue
			}
			other := gs[0]
			if other == named.l {
				other = gs[1]
			}
			a, b = named, &mention{l: other}
		} else {
			for k := range ms {
				m := &ms[k]
				if m.a < pivot && m.a != w.i {
					a = m
				}
			}
			if a != nil {
				for k := range ms {
					m := &ms[k]
					if m.a > pivot && m.l.dim == a.l.dim && m.l != a.l {
						b = m
						break
					}
				}
			}
		}
		if a == nil || b == nil {
			continue
		}
		va, vb, what := p.valuesOf(bi, a.l, b.l)
		if va == nil || vb == nil {
			continue
		}
		// "South runs were late more often": the other outcome than the
		// block's success, so the comparison turns round.
		sign := w.sign
		if bi.measureStat() == "pct" && (bi.analysis == "compare" || bi.analysis == "trend") && !p.namesOutcome(bi) && s.has(oppositeOutcome...) {
			sign = -sign
		}
		d := va.val() - vb.val()
		if d == 0 || blocks.Format(va.fact, -1) == blocks.Format(vb.fact, -1) {
			return Finding{}, false
		}
		got := 1
		if d < 0 {
			got = -1
		}
		if got == sign {
			return Finding{}, false
		}
		return p.atTok(Error, w.i, w.i+1, bi, "says %s but the %s for %s is %s against %s for %s; try %s",
			quote(s.toks[w.i].text), what, a.l.text, showF(va), showF(vb), b.l.text, quote(verb(w.sign, s.toks[w.i].low))), true
	}
	return Finding{}, false
}

// valuesOf returns the block's headline values for two labels of one
// dimension, and the statistic's name.
func (p *Pass) valuesOf(bi *blockInfo, a, b *label) (*factInfo, *factInfo, string) {
	stat := bi.measureStat()
	if bi.analysis == "frequency" {
		stat = "pct"
	}
	if p.s.has("median") {
		if bi.fact(a.slug+".median") != nil {
			stat = "median"
		}
	}
	get := func(l *label) *factInfo {
		if bi.analysis == "trend" && len(bi.dim("group")) > 0 && l.dim == "group" {
			// The time point the sentence names, or the last.
			ts := bi.dim("time")
			t := ts[len(ts)-1]
			for _, m := range p.s.mentionsOf(bi) {
				if m.l.dim == "time" {
					t = m.l
				}
			}
			return bi.fact(l.slug + "." + t.slug + "." + stat)
		}
		return bi.fact(l.slug + "." + stat)
	}
	return get(a), get(b), statNames[stat]
}

// correlationDirection judges the sign a sentence gives a correlation or a
// slope.
func (p *Pass) correlationDirection(ws []dirWord) *Finding {
	s := p.s
	sc := p.best(1, func(bi *blockInfo) bool { return bi.analysis == "correlation" || bi.analysis == "regression" })
	if sc == nil {
		return nil
	}
	bi := sc.bi
	r, what := bi.fact("r"), "r"
	if bi.analysis == "regression" {
		if len(bi.meta.Predictors) > 0 {
			r, what = bi.fact(blocks.Slug(bi.meta.Predictors[0])+".estimate"), "the coefficient of "+bi.meta.Predictors[0]
		}
		for _, m := range s.mentionsOf(bi) {
			if m.l.dim == "pred" {
				if f := bi.fact(m.l.slug + ".estimate"); f != nil {
					r, what = f, "the coefficient of "+m.l.text
				}
			}
		}
	}
	if r == nil {
		return nil
	}
	claimed := 0
	at := -1
	for i, t := range s.toks {
		switch t.low {
		case "positive", "positively":
			claimed, at = 1, i
		case "negative", "negatively", "inverse", "inversely":
			claimed, at = -1, i
		}
	}
	if claimed != 0 && !s.has("correlation", "correlated", "correlates", "association", "associated", "relationship",
		"related", "relation", "link", "linked", "slope", "coefficient", "correlate") {
		claimed = 0
	}
	if claimed == 0 {
		// "as visits rose, spend fell", "the more visits, the less spend",
		// "tickets with more steps took less time": two direction words,
		// one for each variable (the second may go unnamed).
		cols := p.variablesNamed(bi)
		cw := p.correlationWords()
		switch {
		case cols >= 1 && len(cw) >= 2:
			claimed = cw[0].sign * cw[1].sign
			at = cw[1].i
		case cols >= 2 && len(cw) == 1 && s.has("with"):
			claimed, at = cw[0].sign, cw[0].i
		default:
			return nil
		}
	}
	if at < 0 || s.negated(at) {
		return nil
	}
	v := r.val()
	got := 1
	if v < 0 {
		got = -1
	}
	if got == claimed || v == 0 {
		return nil
	}
	sign := "negative"
	if got > 0 {
		sign = "positive"
	}
	// The interval decides the severity: when it reaches the claimed side the
	// data do not support the sign; when it does not, they contradict it.
	lo, hi := ciOf(r)
	sev := Error
	if lo.ok() && hi.ok() && lo.val() < 0 && hi.val() > 0 {
		sev = Warning
	} else if !lo.ok() && bi.analysis == "correlation" && math.Abs(v) < 0.1 {
		sev = Warning
	}
	f := p.atTok(sev, at, at+1, bi, "says the relationship is %s but %s is %s, a %s one; try %s",
		map[int]string{1: "positive", -1: "negative"}[claimed], what, withCI(r, lo, hi), sign,
		quote("a "+sign+" relationship"))
	return &f
}

// variablesNamed counts how many of a correlation's or regression's
// variables the sentence names (by any word of their column names).
func (p *Pass) variablesNamed(bi *blockInfo) int {
	cols := append([]string(nil), bi.meta.Columns...)
	for _, pr := range bi.meta.Predictors {
		found := false
		for _, c := range cols {
			if c == pr {
				found = true
			}
		}
		if !found {
			cols = append(cols, pr)
		}
	}
	n := 0
	for _, c := range cols {
		named := false
		for _, w := range splitWords(c) {
			if stopWords[w] || len(w) < 2 {
				continue
			}
			st := stem(w)
			for _, t := range p.s.toks {
				// "attended" names "attendance": the same first five letters.
				if t.kind == tWord && (t.stem == st || (len(st) >= 5 && len(t.stem) >= 5 && t.stem[:5] == st[:5])) {
					named = true
				}
			}
		}
		if named {
			n++
		}
	}
	return n
}

// fromFollows reports whether the change word at token i governs a "from X
// to Y" after it ("fell from 40% to 38%", "rose by 2 points from"), not a
// range ("could fall anywhere from €8 to €21").
func (p *Pass) fromFollows(i int) bool {
	s := p.s
	if i > 0 && speculation[s.toks[i-1].low] {
		return false
	}
	for k := i + 1; k < len(s.toks) && k <= i+5; k++ {
		switch s.toks[k].low {
		case "from":
			return true
		case "anywhere", "between", "within", "into", "outside", "somewhere":
			return false
		}
	}
	return false
}

// trendSegment returns the change a change word describes in a trend: between
// the time points named after it (up to the next change word), or from the
// last one named before it to the one after ("rose to 42 in April, then eased
// to 36 in June": April to June), or first to last when none is named; per
// group when the trend has groups.
func (p *Pass) trendSegment(bi *blockInfo, w dirWord, ws []dirWord) []*comparison {
	s := p.s
	times := bi.dim("time")
	if len(times) < 2 {
		return nil
	}
	next := len(s.toks)
	for _, o := range ws {
		if o.kind == "change" && o.i > w.i && o.i < next {
			next = o.i
		}
	}
	var before, after []mention
	for _, m := range s.mentionsOf(bi) {
		if m.l.dim != "time" {
			continue
		}
		switch {
		case m.a > w.i && m.a < next:
			after = append(after, m)
		case m.a < w.i:
			before = append(before, m)
		}
	}
	from, to := times[0], times[len(times)-1]
	prevPoint := false // one time point named: from the first, or from the one before
	starts := func(m mention) bool {
		b := low(s.toks, m.a-1)
		return b == "since" || b == "after" || (b == "from" && len(after) < 2)
	}
	switch {
	case len(after) >= 2:
		from, to = after[0].l, after[len(after)-1].l
	case len(after) == 1 && starts(after[0]):
		from = after[0].l
	case len(after) == 1 && len(before) > 0:
		from, to = before[len(before)-1].l, after[0].l
	case len(after) == 1:
		to = after[0].l
		prevPoint = true
	case len(before) >= 2:
		from, to = before[0].l, before[len(before)-1].l
	case len(before) == 1 && starts(before[0]):
		from = before[0].l
	case len(before) == 1:
		to = before[0].l
		prevPoint = true
	}
	if indexOf(times, from) > indexOf(times, to) {
		from, to = to, from
	}
	if from == to {
		return nil
	}
	full := from == times[0] && to == times[len(times)-1]
	stat := bi.measureStat()
	groups := bi.dim("group")
	if len(groups) == 0 {
		c := &comparison{bi: bi, from: bi.fact(from.slug + "." + stat), to: bi.fact(to.slug + "." + stat), fromLab: from, toLab: to, time: true}
		if full {
			c.diff = bi.fact("change")
		}
		if !c.from.ok() || !c.to.ok() {
			return nil
		}
		out := []*comparison{c}
		// Both readings must contradict the word for a finding.
		if k := indexOf(times, to); prevPoint && k > 1 {
			b := times[k-1]
			if c2 := (&comparison{bi: bi, from: bi.fact(b.slug + "." + stat), to: c.to, fromLab: b, toLab: to, time: true}); c2.from.ok() {
				out = append(out, c2)
			}
		}
		return out
	}
	var named []*label
	for _, m := range s.mentionsOf(bi) {
		if m.l.dim == "group" {
			named = append(named, m.l)
		}
	}
	if len(named) == 0 {
		named = groups
	}
	var out []*comparison
	seen := map[*label]bool{}
	for _, g := range named {
		if seen[g] {
			continue
		}
		seen[g] = true
		c := &comparison{bi: bi, from: bi.fact(g.slug + "." + from.slug + "." + stat), to: bi.fact(g.slug + "." + to.slug + "." + stat),
			fromLab: from, toLab: to, time: true, group: g}
		if full {
			c.diff = bi.fact(g.slug + ".change")
		}
		if c.from.ok() && c.to.ok() {
			out = append(out, c)
		}
	}
	return out
}

// correlationWords are the direction words of a sentence about two
// variables, comparatives included ("more steps", "less time").
func (p *Pass) correlationWords() []dirWord {
	s := p.s
	inClaim := make([]bool, len(s.toks))
	for _, q := range s.qs {
		for k := range s.toks {
			if k < q.tok && s.toks[k].start >= q.start {
				inClaim[k] = true
			}
		}
	}
	var out []dirWord
	for i, t := range s.toks {
		d, ok := directionWords[t.low]
		if t.low == "further" || t.low == "farther" {
			d, ok = 1, true // "pupils living further away"
		}
		if !ok || t.kind != tWord || inClaim[i] || s.negated(i) {
			continue
		}
		if (t.low == "up" || t.low == "down") && i+1 < len(s.toks) && s.toks[i+1].kind != tNum {
			continue
		}
		out = append(out, dirWord{i: i, sign: d})
	}
	return out
}
