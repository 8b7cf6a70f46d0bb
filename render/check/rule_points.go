package check

import (
	"math"

	"candor/blocks"
)

var pointsRule = &Rule{
	ID: "points",
	Doc: `points flags percent and percentage points confused: a change between two percentages stated in percent ("rose 5%") ` +
		`that matches the difference in points (40% to 45% is 5 points) and not the relative change (12.5%), or a change stated in ` +
		`points that matches the relative change and not the difference. It also flags a difference in points shown as an inline ` +
		`value and followed by "%" ("rose {{trend.change}}%"). Only comparisons of percentages are read: for means, "points" are the ` +
		`measure's own units. Severity error.`,
	Check: checkPoints,
}

func checkPoints(p *Pass) []Finding {
	var out []Finding
	s := p.s
	for _, q := range s.qs {
		if !q.claim() {
			continue
		}
		if q.ref != "" {
			// "{{t.change}}%": a difference in points written as percent.
			if f := p.refFact(q.ref); f != nil && f.fact.Kind == blocks.Points && q.unit == uPercent {
				out = append(out, p.atQ(Error, q, f.block, "says %s but %s is a difference in percentage points; try %s",
					quote(q.text(s.ut.text)), describe(f), quote(blocks.Format(f.fact, -1)+" percentage points")))
			}
			continue
		}
		if !(q.change || q.pp) || (q.unit != uPercent && q.unit != uPoints) {
			continue
		}
		var cs []*comparison
		for _, c := range p.changeComparisons(1) {
			if c.base() == blocks.Percent {
				cs = append(cs, c)
			}
		}
		if len(cs) == 0 {
			continue
		}
		aq := *q
		aq.val, aq.lo, aq.hi = math.Abs(q.val), math.Abs(q.lo), math.Abs(q.hi)
		if aq.lo > aq.hi {
			aq.lo, aq.hi = aq.hi, aq.lo
		}
		right := func(c *comparison) float64 {
			if q.unit == uPercent {
				return math.Abs(c.rel())
			}
			return math.Abs(c.abs())
		}
		wrong := func(c *comparison) float64 {
			if q.unit == uPercent {
				return math.Abs(c.abs())
			}
			return math.Abs(c.rel())
		}
		ok := false
		for _, c := range cs {
			if matches(&aq, right(c)) {
				ok = true
			}
		}
		if ok {
			continue
		}
		for _, c := range cs {
			if !matches(&aq, wrong(c)) {
				continue
			}
			d := math.Abs(c.abs())
			r := math.Abs(c.rel())
			if q.unit == uPercent {
				out = append(out, p.atQ(Error, q, c.bi, "says %s but %s is %s, a difference in percentage points; the relative change is %s; try %s",
					quote(q.text(s.ut.text)), changeWhat(c), show(d, blocks.Points), show(r, blocks.Percent),
					quote(plain(d, blocks.Points)+" (from "+showF(c.from)+" to "+showF(c.to)+")")))
			} else {
				out = append(out, p.atQ(Error, q, c.bi, "says %s but that is the relative change (%s); %s is %s; try %s",
					quote(q.text(s.ut.text)), show(r, blocks.Percent), changeWhat(c), show(d, blocks.Points),
					quote(plain(d, blocks.Points))))
			}
			break
		}
	}
	return out
}

// changeWhat names what a comparison measures: "the change from Q1 to Q4
// (40.0% to 45.0%)".
func changeWhat(c *comparison) string {
	w := "the difference " + c.names()
	if c.time {
		w = "the change " + c.names()
	}
	return w + " (" + showF(c.from) + " to " + showF(c.to) + ")"
}

// refFact returns the fact of an inline value, or nil.
func (p *Pass) refFact(ref string) *factInfo {
	for _, bi := range p.blocks {
		if bi.id != "" && len(ref) > len(bi.id) && ref[:len(bi.id)+1] == bi.id+"." {
			if f := bi.byLocal[ref[len(bi.id)+1:]]; f != nil {
				return f
			}
		}
	}
	return nil
}
