package check

import (
	"math"
	"strings"

	"candor/blocks"
)

var numberRule = &Rule{
	ID: "number",
	Doc: `number flags a stated figure that does not match the computed one after honest rounding, reading hedges literally. ` +
		`A figure agrees when the true value rounds to it at the precision written (38% covers 37.5 to 38.5; 1,200 covers 1,150 to 1,250). ` +
		`"about" adds 5% of the stated value; "nearly" and "almost" allow up to 5% below and nothing above; "over", "more than" ` +
		`and "above" need the true value strictly above, "at least" at or above, "under", "fewer than" and "less than" strictly below, ` +
		`"at most" and "up to" at or below; words ("a third", "one in four") are read as "about" within 10%. Hand-typed figures are ` +
		`checked as strictly as inline values. A figure is judged only against a fact it is tied to: one of the same kind (a share, ` +
		`a mean, a count, a p-value after "p ="), named by the group, level or time point beside it or by a statistic word ("median", ` +
		`"average", "longest"), in a block in the sentence's scope. A figure tied to no fact is not a finding. A change ("rose 5%", ` +
		`"a gap of 3 points", "$4 more") must match a difference or relative change the blocks compute (percent against the relative ` +
		`change, points or units against the difference; the other reading is the points rule's); an interval ("95% CI 0.9–1.5") ` +
		`must match the interval of the estimate stated before it. Forecasts about a trend are the extrapolation rule's. Severity error.`,
	Check: checkNumber,
}

func checkNumber(p *Pass) []Finding {
	var out []Finding
	s := p.s
	// A forecast about a trend states what no block computed; only a
	// regression's predictions can be checked.
	future := s.forecastAt()
	predicts := p.best(0, func(bi *blockInfo) bool { return bi.fact("predict.1.estimate") != nil }) != nil
	for _, q := range s.qs {
		if !q.claim() || q.ref != "" || q.unit == uTimes || q.multiple != "" {
			continue
		}
		if future >= 0 && future < q.tok && !predicts && q.stat == "" {
			continue
		}
		switch {
		case q.stat == "ci":
			if f, ok := p.checkInterval(q); ok {
				out = append(out, f)
			}
		case q.change || q.pp:
			if f, ok := p.checkChangeNumber(q); ok {
				out = append(out, f)
			}
		default:
			lq := q
			if q.unit == uPoints {
				// "gained 9.1 points on average": points of a score, a level.
				c := *q
				c.unit = uNone
				lq = &c
			}
			b := p.bindLevel(lq)
			if b.match != nil || b.target == nil {
				continue
			}
			t := b.target
			if !b.strong || t.score < 3 || (q.stat == "" && !near(q, t.v(), b.strong)) {
				continue
			}
			if q.word && q.unit == uNone && q.stat == "" && p.s.statWordOf(q) == "" {
				continue // "three stores": a count in words, tied to no statistic
			}
			out = append(out, p.atQ(Error, q, t.f.block, "says %s but %s is %s%s; try %s",
				quote(q.text(s.ut.text)), describe(t.f), showScaled(t), ciPart(t.f), levelSuggestion(q, t)))
		}
	}
	return out
}

func showScaled(c *cand) string {
	if c.scale == 100 {
		return show(c.v(), blocks.Percent)
	}
	return showF(c.f)
}

// ciPart is " (95% CI a–b)" for a fact with an interval.
func ciPart(f *factInfo) string {
	lo, hi := ciOf(f)
	if ci := showCI(lo, hi); ci != "" {
		return " (" + ci + ")"
	}
	return ""
}

// ciOf returns the interval facts published with a fact, if any.
func ciOf(f *factInfo) (*factInfo, *factInfo) {
	bi := f.block
	pre := strings.Join(f.quals, ".")
	if pre != "" {
		pre += "."
	}
	switch f.stat {
	case "mean", "ratio", "diff", "r", "pct":
		return bi.fact(pre + f.stat + "_low"), bi.fact(pre + f.stat + "_high")
	case "odds_ratio":
		return bi.fact(pre + "odds_low"), bi.fact(pre + "odds_high")
	case "estimate":
		return bi.fact(pre + "low"), bi.fact(pre + "high")
	}
	return nil, nil
}

// levelSuggestion is an honest way to say the figure: the hedge the writer
// used with the value rounded, or the inline value.
func levelSuggestion(q *quantity, c *cand) string {
	v := c.v()
	k := c.f.fact.Kind
	if c.scale == 100 {
		k = blocks.Percent
	}
	h := ""
	switch q.hedge {
	case hAbout, hNearly, hJustOver:
		h = "about "
	}
	num := plain(v, k)
	if h != "" && k == blocks.Number {
		num = blocks.Sig(v, 2)
	}
	if q.cur != "" {
		num = q.cur + blocks.Sig(v, 3)
	}
	if q.stat != "" && q.stat != "mean" {
		num = q.stat + " = " + showF(c.f)
		if c.f.fact.Kind == blocks.PValue && c.f.val() < 0.001 {
			num = q.stat + " < 0.001"
		}
		h = ""
	}
	return quote(h+num) + " or {{" + c.f.name + "}}"
}

// checkChangeNumber judges a stated change or difference ("rose 5%", "a gap
// of 3 points", "$4 more"): it must agree with a difference or relative
// change the blocks in scope compute. A figure that agrees with the other
// reading (points for percent or the reverse) is left to the points rule.
func (p *Pass) checkChangeNumber(q *quantity) (Finding, bool) {
	// "gained 9.1 points on average": the level of a column that is itself
	// a change (a gain, a growth).
	lq := *q
	if lq.unit == uPoints && !lq.pp {
		lq.unit = uNone
	}
	if p.bindLevel(&lq).match != nil {
		return Finding{}, false
	}
	cs := p.changeComparisons(1)
	aq := *q
	aq.val, aq.lo, aq.hi = math.Abs(q.val), math.Abs(q.lo), math.Abs(q.hi)
	if aq.lo > aq.hi {
		aq.lo, aq.hi = aq.hi, aq.lo
	}
	for _, c := range cs {
		// The relative change is a reading for a percentage, or for points of
		// a percentage (the points rule's confusion); not for a mean's units.
		relOK := q.unit == uPercent || c.base() == blocks.Percent
		if matches(&aq, math.Abs(c.abs())) || (relOK && matches(&aq, math.Abs(c.rel()))) {
			return Finding{}, false
		}
	}
	// Published differences the comparisons may not cover (did, per-group
	// changes, differences of other blocks in scope).
	for _, sc := range p.scope {
		if sc.score < 1 {
			continue
		}
		for _, f := range sc.bi.facts {
			if !f.ok() {
				continue
			}
			switch f.stat {
			case "diff", "change", "did", "estimate":
				if matches(&aq, math.Abs(f.val())) {
					return Finding{}, false
				}
			case "ratio":
				if q.unit == uPercent && matches(&aq, math.Abs(f.val()-1)*100) {
					return Finding{}, false
				}
			}
		}
	}
	if len(cs) == 0 {
		return Finding{}, false
	}
	c := cs[0]
	if !c.named && !c.published {
		return Finding{}, false
	}
	want := math.Abs(c.abs())
	if q.unit == uPercent {
		want = math.Abs(c.rel())
	}
	if !near(&aq, want, c.named) {
		return Finding{}, false
	}
	return p.atQ(Error, q, c.bi, "says %s but %s", quote(q.text(p.s.ut.text)), changeFacts(c)), true
}

// changeFacts says what a comparison shows: "Monthly against Annual differ
// by -23.0 points (95% CI ...), 38.2% against 61.2%, a relative change of
// -37.6%; try ...".
func changeFacts(c *comparison) string {
	k := c.base()
	var b strings.Builder
	if c.time {
		b.WriteString("the change " + c.names() + " is ")
	} else {
		b.WriteString("the difference " + c.names() + " is ")
	}
	dk := k
	if k == blocks.Percent {
		dk = blocks.Points
	}
	if c.diff.ok() {
		b.WriteString(withCI(c.diff, c.dlo, c.dhi))
	} else {
		b.WriteString(show(c.abs(), dk))
	}
	b.WriteString(" (" + showF(c.from) + " to " + showF(c.to))
	if r := c.rel(); !math.IsNaN(r) {
		b.WriteString(", a relative change of " + show(r, blocks.Percent))
	}
	b.WriteString(")")
	try := plain(math.Abs(c.abs()), dk)
	if k != blocks.Percent {
		try = blocks.Sig(math.Abs(c.abs()), 2)
	}
	b.WriteString("; try " + quote(try))
	if c.diff.ok() {
		b.WriteString(" or {{" + c.diff.name + "}}")
	}
	return b.String()
}

// checkInterval judges a stated interval ("95% CI 0.92–1.51") against the
// interval of the estimate stated right before it.
func (p *Pass) checkInterval(q *quantity) (Finding, bool) {
	s := p.s
	var est *quantity
	for _, o := range s.qs {
		if o == q || o.tokEnd > q.tok || q.tok-o.tokEnd > 10 || !o.claim() || o.stat == "ci" {
			continue
		}
		est = o
	}
	if est == nil {
		return Finding{}, false
	}
	// Every fact the estimate may be (the best-tied first), and the
	// differences a change word may mean.
	var fs []*factInfo
	if est.ref != "" {
		if f := p.refFact(est.ref); f != nil {
			fs = append(fs, f)
		}
	} else {
		b := p.bindLevel(levelOf(est))
		if b.match != nil {
			fs = append(fs, b.match.f)
		}
		for i := range b.all {
			fs = append(fs, b.all[i].f)
		}
		for _, sc := range p.scope {
			for _, f := range sc.bi.facts {
				if (f.stat == "diff" || f.stat == "estimate") && f.ok() && matches(&quantity{val: math.Abs(est.val), lo: math.Abs(est.lo),
					hi: math.Abs(est.hi), half: est.half, hedge: est.hedge, word: est.word}, math.Abs(f.val())) {
					fs = append(fs, f)
				}
			}
		}
	}
	var f *factInfo
	var lo, hi *factInfo
	for _, g := range fs {
		l, h := ciOf(g)
		if !l.ok() || !h.ok() {
			continue
		}
		if f == nil {
			f, lo, hi = g, l, h
		}
		// The interval as stated, or with its signs turned ("saved 48
		// seconds (95% CI 46 to 51)" for a difference of −48).
		if intervalMatches(q, l.val(), h.val()) || intervalMatches(q, -h.val(), -l.val()) {
			return Finding{}, false
		}
	}
	if f == nil {
		return Finding{}, false
	}
	return p.atQ(Error, q, f.block, "says the interval is %s but the 95%% CI of %s is %s–%s; try {{%s}}–{{%s}}",
		quote(q.text(s.ut.text)), describe(f), blocks.Format(lo.fact, -1), blocks.Format(hi.fact, -1), lo.name, hi.name), true
}

func intervalMatches(q *quantity, lo, hi float64) bool {
	ql := *q
	ql.val, ql.lo, ql.hi, ql.hedge = q.lo, q.lo, q.lo, hNone
	qh := *q
	qh.val, qh.lo, qh.hi, qh.hedge = q.hi, q.hi, q.hi, hNone
	return matches(&ql, lo) && matches(&qh, hi)
}
