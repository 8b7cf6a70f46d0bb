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
		`against r or the coefficient. A comparative without "than" reads the group after a preposition against the other of two ` +
		`("lower with reminders"); a change word with "compared with", "relative to" or "than" compares two groups ("rose in the ` +
		`pilot zones compared with the meter zones"), in a trend of two groups by their changes (the difference in differences: ` +
		`"improved by 0.12 points more"). "In every month", "week after week" need every step to go that way; "peaked in July" and ` +
		`"bottomed out in December" need the named time point to hold the highest or lowest value. "Improved" and "worsened" are ` +
		`read as a rise or a fall from the measure's name (ratings, punctuality: up is better; delays, waste: down is better). A ` +
		`negated word ("did not rise") is not read; a comparison of a binary outcome in the words of its opposite ("late more ` +
		`often", "unhealthy" for a healthy share) is turned round. Severity error; a correlation's sign whose 95% interval reaches ` +
		`the claimed side is a warning.`,
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
		// "falls just short of significance": an idiom, not a fall; "a
		// drop-off", "a check-up": a compound noun.
		if next == "short" || (next == "just" || next == "well" || next == "far") && low(s.toks, i+2) == "short" {
			continue
		}
		if next == "-" && i+2 < len(s.toks) && attached(s.toks, i+1) && attached(s.toks, i+2) {
			continue
		}
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
		// "turned up 6% less often", "signed up": a phrasal verb.
		if (t.low == "up" || t.low == "down") && phrasalUp[prev] {
			continue
		}
		kind := "compare"
		if changeVerbs[t.low] {
			kind = "change"
		}
		if t.low == "more" || t.low == "less" {
			// "more" alone is too common ("more members", "more detail");
			// read it only in a comparison with "than" or "likely/often".
			if !(s.has("than") || likelyWords[next]) {
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
	if f, ok := p.extremumClaim(); ok {
		return []Finding{f}
	}
	if f, ok := p.superlativeClaim(); ok {
		return []Finding{f}
	}
	if corr := p.correlationDirection(ws); corr != nil {
		return []Finding{*corr}
	}
	// "improved", "worsened": a direction only once the measure says
	// whether more is better.
	ws = append(ws, p.improvementWords()...)
	if len(ws) == 0 {
		return nil
	}
	conn, every := p.contrastAt(), p.saysEvery()
	for _, w := range ws {
		if w.kind != "change" {
			continue
		}
		if f, ok := p.contrastDirection(w, conn); ok {
			return []Finding{f}
		}
		if f, ok := p.everyStep(w, every); ok {
			return []Finding{f}
		}
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
		"plunged": "rose", "slipped": "rose", "dipped": "rose", "exceeded": "trailed", "rarer": "more common",
		"commoner": "rarer", "scarcer": "more common", "ahead": "behind", "behind": "ahead", "heavier": "lighter",
		"lighter": "heavier", "busier": "quieter", "quieter": "busier", "warmer": "colder", "colder": "warmer",
		"cheaper": "dearer", "dearer": "cheaper"}
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
	// "Fordham was 1 point ahead of Elm Parade", "fell behind the others".
	if w0 := s.toks[w.i].low; (w0 == "ahead" || w0 == "behind") && low(s.toks, w.i+1) == "of" {
		than = w.i + 1
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
			// "On-time refills were lower with reminders": the group after a
			// preposition, against the other.
			next := low(s.toks, w.i+1)
			gs := bi.dim("group")
			if len(gs) != 2 {
				continue
			}
			var named *mention
			distinct := 0
			for k := range ms {
				if ms[k].l.dim != "group" {
					continue
				}
				if named == nil || named.l != ms[k].l {
					distinct++
				}
				if named == nil {
					named = &ms[k]
				}
			}
			if named == nil || distinct != 1 {
				continue
			}
			pre := named.a - 1
			for pre > w.i && determiners[s.toks[pre].low] {
				pre-- // "with a mentor"
			}
			after := named.a > w.i && pre > w.i && prepositions[s.toks[pre].low] && named.a-w.i <= 5
			if !likelyWords[next] || named.a > w.i {
				if !after || p.namesTime() || w.kind != "compare" {
					continue
				}
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
		if bi.measureStat() == "pct" && (bi.analysis == "compare" || bi.analysis == "trend") && !p.namesOutcome(bi) && p.saysOpposite(bi) {
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
			quote(s.toks[w.i].text), what, a.l.name(), showF(va), showF(vb), b.l.name(), quote(verb(w.sign, s.toks[w.i].low))), true
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

// extremeWords say a series reached its highest (+1) or lowest (-1) point
// at a time ("peaked in July", "bottomed out in December").
var extremeWords = map[string]int{"peaked": 1, "peaks": 1, "peaking": 1, "bottomed": -1, "bottoms": -1, "troughed": -1}

// extremumClaim judges "peaked in July" against the trend: the time point
// named must hold the series' highest value (lowest for "bottomed out").
func (p *Pass) extremumClaim() (Finding, bool) {
	s := p.s
	for i, t := range s.toks {
		sign, ok := extremeWords[t.low]
		if !ok || s.negated(i) {
			continue
		}
		for _, sc := range p.scope {
			bi := sc.bi
			if bi.analysis != "trend" || sc.score < 1 {
				continue
			}
			var at *label
			var group *label
			for _, m := range s.mentionsOf(bi) {
				if m.l.dim == "time" && m.a > i && m.a <= i+8 && s.clause[m.a] == s.clause[i] && at == nil {
					at = m.l
				}
				if m.l.dim == "group" && m.a < i {
					group = m.l
				}
			}
			if at == nil {
				continue
			}
			groups := bi.dim("group")
			if len(groups) > 0 && group == nil {
				if len(groups) != 1 {
					continue
				}
				group = groups[0]
			}
			stat := bi.measureStat()
			get := func(tl *label) *factInfo {
				name := tl.slug + "." + stat
				if group != nil {
					name = group.slug + "." + name
				}
				return bi.fact(name)
			}
			claimed := get(at)
			if claimed == nil {
				continue
			}
			var best *factInfo
			var bestT *label
			for _, tl := range bi.dim("time") {
				f := get(tl)
				if f == nil {
					continue
				}
				if best == nil || float64(sign)*(f.val()-best.val()) > 0 {
					best, bestT = f, tl
				}
			}
			if best == nil || bestT == at || blocks.Format(best.fact, -1) == blocks.Format(claimed.fact, -1) {
				return Finding{}, false
			}
			word := "highest"
			if sign < 0 {
				word = "lowest"
			}
			who := ""
			if group != nil {
				who = " for " + group.name()
			}
			return p.atTok(Error, i, i+1, bi, "says %s in %s but the %s %s%s is %s in %s (%s in %s); try %s",
				quote(t.text), at.text, word, statNames[stat], who, showF(best), bestT.text, showF(claimed), at.text,
				quote(map[int]string{1: "peaked in ", -1: "bottomed out in "}[sign]+bestT.text)), true
		}
	}
	return Finding{}, false
}

// namesTime reports whether the sentence names a time point of a block in
// scope (then a comparative may compare times, not groups).
func (p *Pass) namesTime() bool {
	for _, sc := range p.scope {
		for _, m := range p.s.mentionsOf(sc.bi) {
			if m.l.dim == "time" {
				return true
			}
		}
	}
	return false
}

// improveWords say a measure got better (+1) or worse (-1).
var improveWords = map[string]int{"improved": 1, "improve": 1, "improves": 1, "improving": 1, "improvement": 1,
	"worsened": -1, "worsen": -1, "worsens": -1, "worsening": -1, "deteriorated": -1, "deteriorating": -1}

// Words of a column's name that say whether a higher value is better (+1)
// or worse (-1), for reading "improved".
var (
	goodHigh = set("rating ratings score scores satisfaction satisfied sales takings revenue income profit retained retention " +
		"renewed renewal resolved resolution ontime punctual punctuality attended attendance passed pass success uptake " +
		"completed completion recycled reuse visits visitors riders")
	badHigh = set("delay delays late lateness wait waits waiting waste overstay overstayed complaint complaints error errors " +
		"defect defects missed miss churn churned absence absences noshow injuries injury cost costs")
)

// valence says whether a higher value of the block's measure is better
// (+1), worse (-1) or neither that the checker can tell (0).
func valence(bi *blockInfo) int {
	if len(bi.meta.Columns) == 0 {
		return 0
	}
	col := strings.ToLower(bi.meta.Columns[0])
	joinedCol := strings.NewReplacer("_", "", "-", "", " ", "").Replace(col)
	if goodHigh[joinedCol] {
		return 1
	}
	if badHigh[joinedCol] {
		return -1
	}
	v := 0
	for _, w := range splitWords(col) {
		switch {
		case goodHigh[w]:
			v = 1
		case badHigh[w]:
			return -1
		}
	}
	return v
}

// improvementWords are "improved" and the like read as a rise or a fall of
// the best-tied block's measure.
func (p *Pass) improvementWords() []dirWord {
	s := p.s
	var out []dirWord
	for i, t := range s.toks {
		d, ok := improveWords[t.low]
		if !ok || s.negated(i) {
			continue
		}
		sc := p.best(1, func(bi *blockInfo) bool { return valence(bi) != 0 })
		if sc == nil {
			continue
		}
		out = append(out, dirWord{i: i, sign: d * valence(sc.bi), kind: "change"})
	}
	return out
}

// contrastWords link two groups whose change is compared ("compared with
// the meter zones", "relative to North Sound").
var contrastPhrases = []string{"compared with", "compared to", "relative to", "in comparison with", "as against", "than", "versus", "vs"}

// contrastDirection judges a change word that compares two groups: in a
// trend of two groups, "A rose more than B" and "compared with B, A
// improved by 0.12 points more" against the difference in differences; in a
// comparison, "overstays rose in the pilot zones compared with the meter
// zones" against the two groups' values.
func (p *Pass) contrastDirection(w dirWord, conn int) (Finding, bool) {
	s := p.s
	if conn < 0 {
		return Finding{}, false
	}
	for _, sc := range p.scope {
		bi := sc.bi
		if sc.score < 1 {
			continue
		}
		groups := bi.dim("group")
		if len(groups) < 2 {
			continue
		}
		var base, other *label
		for _, m := range s.mentionsOf(bi) {
			if m.l.dim != "group" {
				continue
			}
			if base == nil && m.a >= conn && m.a <= conn+3 {
				base = m.l
			}
		}
		for _, m := range s.mentionsOf(bi) {
			if m.l.dim == "group" && m.l != base && other == nil {
				other = m.l
			}
		}
		// "compared with non-users", "than the others": the other group of
		// two.
		if base == nil && other != nil && len(groups) == 2 {
			for k := conn; k < len(s.toks) && k <= conn+2; k++ {
				switch s.toks[k].low {
				case "non", "others", "rest", "everyone", "everybody":
					base = groups[0]
					if base == other {
						base = groups[1]
					}
				}
			}
		}
		if base == nil || other == nil {
			continue
		}
		switch bi.analysis {
		case "trend":
			if p.namesTime() && !s.has("more", "less", "faster", "slower") {
				continue
			}
			claimed := w.sign
			switch {
			case s.has("less", "slower") && !s.has("more", "faster"):
				claimed = -w.sign
			case s.has("more", "faster"):
			default:
				continue // "A rose, compared with B's fall": two changes, each its own
			}
			ca, cb := bi.fact(other.slug+".change"), bi.fact(base.slug+".change")
			if ca == nil || cb == nil {
				continue
			}
			d := ca.val() - cb.val()
			got := 0
			if d > 0 {
				got = 1
			} else if d < 0 {
				got = -1
			}
			if got == 0 || got == claimed {
				return Finding{}, false
			}
			dk := ca.fact.Kind
			return p.atTok(Error, w.i, w.i+1, bi, "says %s by more for %s than for %s, but %s changed by %s and %s by %s, a difference in differences of %s; try %s",
				quote(s.toks[w.i].text), other.name(), base.name(), other.name(), signed(ca.val(), dk), base.name(), signed(cb.val(), dk),
				signed(d, dk), quote(s.toks[w.i].text+" "+map[bool]string{true: "more", false: "less"}[got*w.sign > 0]+" for "+other.name())), true
		case "compare", "summary":
			va, vb, what := p.valuesOf(bi, other, base)
			if va == nil || vb == nil {
				continue
			}
			d := va.val() - vb.val()
			if d == 0 || blocks.Format(va.fact, -1) == blocks.Format(vb.fact, -1) {
				return Finding{}, false
			}
			got := 1
			if d < 0 {
				got = -1
			}
			if got == w.sign {
				return Finding{}, false
			}
			return p.atTok(Error, w.i, w.i+1, bi, "says %s for %s compared with %s but the %s for %s is %s against %s for %s; try %s",
				quote(s.toks[w.i].text), other.name(), base.name(), what, other.name(), showF(va), showF(vb), base.name(),
				quote(verb(w.sign, s.toks[w.i].low))), true
		}
	}
	return Finding{}, false
}

// contrastAt returns the token after the sentence's first phrase that sets
// two groups against each other ("compared with", "than"), or -1; one
// inside a compound ("mixed-versus-cold") does not count.
func (p *Pass) contrastAt() int {
	s := p.s
	for _, ph := range contrastPhrases {
		if a, b, ok := s.hasPhrase(ph); ok && !(a > 0 && s.toks[a-1].text == "-" && !s.toks[a].space) {
			return b
		}
	}
	return -1
}

// saysEvery reports whether the sentence claims a change at every step
// ("in every month", "week after week").
func (p *Pass) saysEvery() bool {
	s := p.s
	every := false
	for i := range s.toks {
		if (s.toks[i].low == "every" || s.toks[i].low == "each") && i+1 < len(s.toks) {
			n := low(s.toks, i+1)
			if n == "single" {
				n = low(s.toks, i+2)
			}
			switch n {
			case "month", "week", "day", "year", "quarter", "term", "period", "wave", "round", "season":
				every = true
			}
		}
	}
	for _, ph := range []string{"month after month", "week after week", "year after year", "quarter after quarter", "without a break", "consecutive"} {
		if _, _, ok := s.hasPhrase(ph); ok {
			every = true
		}
	}
	return every
}

// everyStep judges "rose in every month", "fell week after week": each
// step of the trend must go the way the word says.
func (p *Pass) everyStep(w dirWord, every bool) (Finding, bool) {
	s := p.s
	if !every {
		return Finding{}, false
	}
	for _, sc := range p.scope {
		bi := sc.bi
		if bi.analysis != "trend" || sc.score < 1 {
			continue
		}
		times := bi.dim("time")
		if len(times) < 3 {
			continue
		}
		// The group of the word's own clause ("North's hires rose every
		// month, and South's rose month after month"), else the one named.
		var group *label
		for _, m := range s.mentionsOf(bi) {
			if m.l.dim != "group" {
				continue
			}
			if group == nil || (m.a < w.i && s.clause[m.a] == s.clause[w.i]) {
				group = m.l
			}
		}
		if len(bi.dim("group")) > 0 && group == nil {
			continue
		}
		stat := bi.measureStat()
		get := func(t *label) *factInfo {
			name := t.slug + "." + stat
			if group != nil {
				name = group.slug + "." + name
			}
			return bi.fact(name)
		}
		for k := 1; k < len(times); k++ {
			a, b := get(times[k-1]), get(times[k])
			if a == nil || b == nil {
				break
			}
			d := b.val() - a.val()
			got := 0
			if blocks.Format(a.fact, -1) != blocks.Format(b.fact, -1) {
				if d > 0 {
					got = 1
				} else if d < 0 {
					got = -1
				}
			}
			if got != w.sign {
				return p.atTok(Error, w.i, w.i+1, bi, "says %s at every step but from %s to %s it went from %s to %s; try %s",
					quote(s.toks[w.i].text), times[k-1].text, times[k].text, showF(a), showF(b), quote(s.toks[w.i].text+" overall")), true
			}
		}
		return Finding{}, false
	}
	return Finding{}, false
}

// likelyWords after "more" or "less" make a comparison of how often ("less
// often", "more common").
var likelyWords = set("likely often common commonly frequent frequently usual")

// phrasalUp are the verbs of "turned up", "signed up", "set up": no rise.
var phrasalUp = set("turned turn turns turning showed show shows showing signed sign signs set sets follow " +
	"followed broken break broke backed back")

// superlatives say a group holds the highest (+1) or lowest (-1) value of
// the block's measure: "Hill Street had the largest baskets", "the lowest
// on-time rate was Fordham's".
var superlatives = map[string]int{"highest": 1, "largest": 1, "biggest": 1, "greatest": 1, "most": 1, "longest": 1,
	"lowest": -1, "smallest": -1, "least": -1, "fewest": -1, "shortest": -1}

// superlativeClaim judges "GROUP had the highest X" against the groups (or
// a frequency's levels) of the best-tied block: the named one must hold the
// highest value (lowest for "lowest"), after honest rounding.
func (p *Pass) superlativeClaim() (Finding, bool) {
	s := p.s
	for i, t := range s.toks {
		sign, ok := superlatives[t.low]
		if !ok || i == 0 || s.toks[i-1].low != "the" || s.negated(i) {
			continue
		}
		// "the second highest", "at the most": not a claim of the top.
		if i >= 2 && (ordinalWords[s.toks[i-2].low] || s.toks[i-2].low == "at") {
			continue
		}
		if t.low == "most" || t.low == "least" {
			// "the most common", "the most", but not "the most likely to".
			if n := low(s.toks, i+1); n == "likely" || n == "often" {
				continue
			}
		}
		for _, sc := range p.scope {
			bi := sc.bi
			if sc.score < 1 {
				continue
			}
			dim := "group"
			switch bi.analysis {
			case "frequency":
				dim = "level"
			case "summary", "compare":
			default:
				continue
			}
			ls := bi.dim(dim)
			if len(ls) < 3 {
				continue // two groups: a comparison, the comparative's
			}
			var named *label
			for _, m := range s.mentionsOf(bi) {
				if m.l.dim != dim || m.partial {
					continue
				}
				// The group is the subject ("Hill Street had the largest"), or
				// comes after the superlative's noun ("the highest rate was
				// at Fordham"); not an apposition set off by commas.
				before := m.b <= i && s.clause[m.a] == s.clause[i] && i-m.b <= 4
				after := m.a > i+1 && m.a-i <= 6 && s.clause[m.a] == s.clause[i] && linkBefore(s, i+1, m.a)
				if !before && !after {
					continue
				}
				if named != nil && named != m.l {
					named = nil
					break
				}
				named = m.l
			}
			if named == nil {
				continue
			}
			stat := bi.measureStat()
			if bi.analysis == "frequency" {
				stat = "pct"
			}
			if s.has("median", "typical") && bi.fact(named.slug+".median") != nil {
				stat = "median"
			}
			claimed := bi.fact(named.slug + "." + stat)
			if claimed == nil {
				continue
			}
			var top *factInfo
			var topL *label
			for _, l := range ls {
				if nullLevels[strings.ToLower(l.text)] {
					continue // "the most common complaint" is not "None"
				}
				f := bi.fact(l.slug + "." + stat)
				if f == nil {
					return Finding{}, false
				}
				if top == nil || float64(sign)*(f.val()-top.val()) > 0 {
					top, topL = f, l
				}
			}
			if topL == named || blocks.Format(top.fact, -1) == blocks.Format(claimed.fact, -1) {
				return Finding{}, false
			}
			word := "highest"
			if sign < 0 {
				word = "lowest"
			}
			return p.atTok(Error, i, i+1, bi, "says %s has %s but the %s %s is %s's, %s (%s has %s); try %s",
				named.name(), quote("the "+t.text), word, statNames[stat], topL.name(), showF(top), named.name(), showF(claimed),
				quote(topL.name()+" had the "+t.text)), true
		}
	}
	return Finding{}, false
}

// ordinalWords before a superlative rank it below the top.
var ordinalWords = set("second third fourth fifth next")

// nullLevels are levels that are no kind of the thing counted.
var nullLevels = set("none no nothing other others unknown n/a na missing")

// linkBefore reports whether a verb or preposition stands between a
// superlative's noun and the group after it ("the highest rate was at
// Fordham"), so that the group is not the noun itself ("the largest group").
func linkBefore(s *sentence, a, b int) bool {
	for k := a; k < b; k++ {
		if copulas[s.toks[k].low] || prepositions[s.toks[k].low] {
			return true
		}
	}
	return false
}
