package check

import (
	"math"

	"candor/blocks"
)

var ratioRule = &Rule{
	ID: "ratio",
	Doc: `ratio flags a stated multiple ("1.5 times", "1.5x", "twice", "doubled", "tripled", "half as likely", "three-fold") that does ` +
		`not match the computed ratio: the risk ratio or ratio of means of a compare block, the ratio of two values the sentence ` +
		`names (two groups, two levels, two time points), or the last time point over the first for a change over time ("doubled"). ` +
		`Digits are read with their hedge as the number rule reads them; a multiple said in words is read as "about", within 10%. ` +
		`When the sentence does not say which way round, either the ratio or its inverse may match. "Odds" compares with the odds ratio. ` +
		`"N to one" ("three to one", "3 to 1") and "half as much again" (1.5) are multiples too; a multiple of the other outcome ` +
		`("late half as often" of an on-time share) compares the shares without it. When the sentence names both sides, only their ` +
		`ratio counts. ` +
		`The message gives the ratio with its 95% interval and says when the interval includes 1 (no difference). Severity error.`,
	Check: checkRatio,
}

func checkRatio(p *Pass) []Finding {
	var out []Finding
	s := p.s
	odds := s.has("odds")
	future := s.forecastAt()
	for _, q := range s.qs {
		if !q.claim() || q.unit != uTimes || q.ref != "" {
			continue
		}
		if future >= 0 && future < q.tok {
			continue // "will double by next year": a forecast, the extrapolation rule's
		}
		cs := p.changeComparisons(1)
		if q.change {
			// "doubled": a change over time first.
			var tc []*comparison
			for _, c := range cs {
				if c.time {
					tc = append(tc, c)
				}
			}
			if len(tc) > 0 {
				cs = append(tc, cs...)
			}
		}
		ok := false
		for _, c := range cs {
			for _, v := range p.ratioReadings(q, c, odds) {
				if matches(q, v) {
					ok = true
				}
			}
		}
		if !ok {
			for _, sc := range p.scope {
				if sc.score < 1 {
					continue
				}
				for _, f := range sc.bi.facts {
					if f.ok() && (f.stat == "ratio" || (f.stat == "odds_ratio" && odds)) &&
						(matches(q, f.val()) || (f.val() != 0 && matches(q, 1/f.val()))) {
						ok = true
					}
				}
			}
		}
		if ok || len(cs) == 0 {
			continue
		}
		c := cs[0]
		rs := p.ratioReadings(q, c, odds)
		if len(rs) == 0 {
			continue
		}
		v := rs[0]
		inverse := p.orientation(q, c) == -1
		if len(rs) > 1 && math.Abs(math.Log(rs[1]/q.val)) < math.Abs(math.Log(rs[0]/q.val)) {
			v, inverse = rs[1], true
		}
		if !near(q, v, true) {
			continue
		}
		if p.complement(c, odds) {
			// The other outcome's shares: no published ratio or interval.
			a, b := c.to, c.from
			if inverse {
				a, b = b, a
			}
			out = append(out, p.atQ(Error, q, c.bi, "says %s but the shares without %s are %s against %s, a ratio of %s; try %s",
				quote(q.text(s.ut.text)), outcomeName(c.bi), show(100-a.val(), blocks.Percent), show(100-b.val(), blocks.Percent),
				sig3(v), quote("about "+sig2(v)+" times")))
			continue
		}
		out = append(out, p.atQ(Error, q, c.bi, "says %s but %s", quote(q.text(s.ut.text)), ratioFacts(c, v, inverse, odds)))
	}
	return out
}

// ratioReadings are the multiples a comparison supports for the quantity:
// the ratio, and its inverse when the sentence does not fix the order.
func (p *Pass) ratioReadings(q *quantity, c *comparison, odds bool) []float64 {
	m := c.mult()
	if odds && c.odds.ok() {
		m = c.odds.val()
	}
	if p.complement(c, odds) {
		m = (100 - c.to.val()) / (100 - c.from.val())
	}
	if math.IsNaN(m) || m == 0 {
		return nil
	}
	switch p.orientation(q, c) {
	case 1:
		return []float64{m}
	case -1:
		return []float64{1 / m}
	}
	return []float64{m, 1 / m}
}

// orientation says which way round the sentence states a comparison: 1 when
// the "to" label (the other group, the later time) is the subject before
// the multiple, -1 when the reference is, 0 when it cannot tell. A change
// over time ("doubled") reads from earlier to later.
func (p *Pass) orientation(q *quantity, c *comparison) int {
	if q.change && c.time {
		return 1
	}
	s := p.s
	first := func(l *label) int {
		for _, m := range s.mentionsOf(c.bi) {
			if m.l == l && !m.partial {
				return m.a
			}
		}
		for _, m := range s.mentionsOf(c.bi) {
			if m.l == l {
				return m.a
			}
		}
		return -1
	}
	a, b := first(c.toLab), first(c.fromLab)
	switch {
	case a >= 0 && b >= 0:
		if a < b {
			return 1
		}
		return -1
	case a >= 0 && a < q.tok:
		return 1
	case b >= 0 && b < q.tok:
		return -1
	}
	return 0
}

// ratioFacts says what the data show for a multiple, with the interval and
// an honest way to say it.
func ratioFacts(c *comparison, v float64, inverse, odds bool) string {
	name := "the ratio of " + labName(c.toLab) + " to " + labName(c.fromLab)
	lo, hi := c.rlo, c.rhi
	if c.ratio.ok() {
		name = "the " + ratioName(c.bi)
		if odds && c.odds.ok() {
			name = "the odds ratio"
			lo, hi = nil, nil
		}
	}
	if inverse {
		name = "the ratio of " + labName(c.fromLab) + " to " + labName(c.toLab)
	}
	s := name + " is " + sig3(v)
	ci := ""
	includesOne := false
	if lo.ok() && hi.ok() {
		l, h := lo.val(), hi.val()
		if inverse && l != 0 && h != 0 {
			l, h = 1/h, 1/l
		}
		ci = "95% CI " + sig3(l) + "–" + sig3(h)
		includesOne = l <= 1 && h >= 1
		s += " (" + ci + ")"
	}
	if !c.ratio.ok() {
		s += " (" + showF(c.to) + " against " + showF(c.from) + ")"
	}
	try := "about " + sig2(v) + " times"
	switch {
	case includesOne:
		try += ", and the interval includes no difference"
	case ci != "":
		try += " (" + ci + ")"
	}
	return s + "; try " + quote(try)
}

func labName(l *label) string {
	if l == nil {
		return "?"
	}
	return l.name()
}

// complement reports whether a multiple compares the other outcome than a
// yes/no block's success ("late a third as often" of an on-time share).
func (p *Pass) complement(c *comparison, odds bool) bool {
	return !odds && c.base() == blocks.Percent && c.bi.meta.Outcome == "binary" && !p.namesOutcome(c.bi) && p.saysOpposite(c.bi) &&
		c.from.ok() && c.to.ok() && c.from.val() < 100 && c.to.val() < 100
}
