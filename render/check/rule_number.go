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
		`must match the interval of the estimate stated before it. The tie follows the sentence: a fact whose groups, levels and ` +
		`time points the sentence names beats one with a qualifier it leaves open (a frequency's level before a crosstab cell); a ` +
		`statistic word picks that statistic alone (a mean's interval bounds are read only where the clause speaks of an interval); ` +
		`a table cell takes its statistic from its column's header; "best", "busiest" and the like name the extremes; "older" and ` +
		`"younger" the last and first age band; the words of a yes/no column its two groups ("trained", "untrained"). A figure with ` +
		`a scale ("£15.2k") is also read without it, for columns kept in thousands. A share of a frequency's cases that meet a ` +
		`condition ("under 7.5 hours", "more than a month ahead", "30 to 60 days") is the sum of the levels or bins that meet it; ` +
		`the share of the other outcome ("did not pass") is 100% less the success share. A range of single values ("ranged from 25 ` +
		`to 128 minutes", "gave between 4 and 20 hours") must match the minimum and maximum. A percentage never matches a change in ` +
		`a mean's own units ("grew by 204%" for 204 more riders); a relative change is read as "about" and either way round. A ` +
		`threshold of a quantifier ("no school averaged less than 10 kg") is the quantifier rule's. Forecasts about a trend are the ` +
		`extrapolation rule's. Severity error.`,
	Check: checkNumber,
}

func checkNumber(p *Pass) []Finding {
	var out []Finding
	s := p.s
	// A forecast about a trend states what no block computed; only a
	// regression's predictions can be checked.
	future := s.forecastAt()
	predicts := p.best(0, func(bi *blockInfo) bool { return bi.fact("predict.1.estimate") != nil }) != nil
	done := map[*quantity]bool{}
	for _, e := range p.extents() {
		f, judged, bad := p.checkExtent(e)
		if judged {
			done[e.lo], done[e.hi] = true, true
		}
		if bad {
			out = append(out, f)
		}
	}
	for _, q := range s.qs {
		if !q.claim() || q.ref != "" || q.unit == uTimes || q.multiple != "" || done[q] || p.quantifierThreshold(q) {
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
			if b.match != nil || b.target == nil || (b.target.f.block.analysis == "regression" && p.onFittedLine(q)) {
				continue
			}
			t := b.target
			if !b.strong || t.score < 3 || (q.stat == "" && !near(q, t.v(), b.strong)) {
				continue
			}
			if q.word && q.unit == uNone && q.stat == "" && p.s.statWordOf(q) == "" {
				continue // "three stores": a count in words, tied to no statistic
			}
			what, ci := describe(t.f), ciPart(t.f)
			if t.other {
				what, ci = what+" that is not "+outcomeName(t.f.block), ""
			}
			out = append(out, p.atQ(Error, q, t.f.block, "says %s but %s is %s%s; try %s",
				quote(q.text(s.ut.text)), what, showScaled(t), ci, levelSuggestion(q, t)))
		}
	}
	return out
}

func showScaled(c *cand) string {
	if c.scale == 100 || c.other {
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
		num = q.cur + trimZeros(blocks.Sig(v, 3))
		if u := unscaled(q); u != nil && nearAt(u, v, true) && !nearAt(q, v, true) {
			num += q.scaleWord // "£8.2k" for a column kept in thousands
		}
	}
	if q.stat != "" && q.stat != "mean" {
		num = q.stat + " = " + showF(c.f)
		if c.f.fact.Kind == blocks.PValue && c.f.val() < 0.001 {
			num = q.stat + " < 0.001"
		}
		h = ""
	}
	if strings.Contains(c.f.name, "(") || c.other {
		return quote(h + num) // a derived figure has no inline value
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
	lb := p.bindLevel(&lq)
	if lb.match != nil {
		return Finding{}, false
	}
	cs := p.changeComparisons(1)
	aq := *q
	aq.val, aq.lo, aq.hi = math.Abs(q.val), math.Abs(q.lo), math.Abs(q.hi)
	if aq.lo > aq.hi {
		aq.lo, aq.hi = aq.hi, aq.lo
	}
	// A percentage is a relative change, or (for a change between two
	// percentages) the points rule's confusion; it is never the change in
	// a mean's own units ("grew by 204%" for 204 more riders).
	var unitMix *comparison
	for _, c := range cs {
		// The relative change is a reading for a percentage, or for points of
		// a percentage (the points rule's confusion); not for a mean's units.
		relOK := q.unit == uPercent || c.base() == blocks.Percent
		absOK := q.unit != uPercent || c.base() == blocks.Percent
		rel := c.rel()
		if !c.time && p.orientation(q, c) == -1 {
			rel = c.relInverse() // "morning drop-offs were a quarter more likely than evening ones"
		}
		if relOK && matchesRel(&aq, math.Abs(rel)) {
			return Finding{}, false
		}
		if matches(&aq, math.Abs(c.abs())) {
			if absOK {
				return Finding{}, false
			}
			if unitMix == nil {
				unitMix = c
			}
		}
	}
	// Published differences the comparisons may not cover (did, per-group
	// changes, differences of other blocks in scope).
	// When the sentence names both sides of a comparison, another group's
	// published difference cannot vouch for its figure.
	bothNamed := len(cs) > 0 && cs[0].both
	for _, sc := range p.scope {
		if sc.score < 1 {
			continue
		}
		for _, f := range sc.bi.facts {
			if !f.ok() {
				continue
			}
			if bothNamed && len(f.quals) > 0 && !p.namesQuals(f) {
				continue
			}
			switch f.stat {
			case "diff", "change", "did", "estimate":
				if matches(&aq, math.Abs(f.val())) && (q.unit != uPercent || f.fact.Kind == blocks.Points || f.fact.Kind == blocks.Percent) {
					return Finding{}, false
				}
			case "ratio":
				if q.unit == uPercent && matchesRel(&aq, math.Abs(f.val()-1)*100) {
					return Finding{}, false
				}
			}
		}
	}
	if unitMix != nil {
		c := unitMix
		return p.atQ(Error, q, c.bi, "says %s, a percentage, but %s is a change of %s in its own units, not a percentage; the relative change is %s; try %s",
			quote(q.text(p.s.ut.text)), changeWhat(c), signed(c.abs(), c.base()), show(c.rel(), blocks.Percent),
			quote(plain(math.Abs(c.rel()), blocks.Percent))), true
	}
	if len(cs) == 0 {
		// "each millimetre of rain went with 53 fewer riders": a slope said
		// as a change per unit of its predictor.
		if t := lb.target; t != nil && lb.strong && t.f.stat == "estimate" && !hasQual(t.f, "intercept") && !hasQual(t.f, "predict") &&
			t.score >= 3 && near(&aq, math.Abs(t.v()), true) {
			return p.atQ(Error, q, t.f.block, "says %s but %s is %s%s; try %s",
				quote(q.text(p.s.ut.text)), describe(t.f), showF(t.f), ciPart(t.f), quote(plain(math.Abs(t.v()), t.f.fact.Kind))), true
		}
		return Finding{}, false
	}
	c := cs[0]
	if !c.named && !c.published {
		return Finding{}, false
	}
	want := math.Abs(c.abs())
	if q.unit == uPercent {
		want = math.Abs(c.rel())
		if !c.time && p.orientation(q, c) == -1 {
			want = math.Abs(c.relInverse())
		}
	}
	relNear := false
	if q.unit == uPercent && c.named {
		// "50% more" for 10% more: far apart as numbers, but near as
		// multiples (1.5 against 1.1) of a comparison the sentence names.
		if r := (1 + aq.val/100) / (1 + want/100); r > 0.5 && r < 2 {
			relNear = true
		}
	}
	if !near(&aq, want, c.named) && !relNear {
		return Finding{}, false
	}
	return p.atQ(Error, q, c.bi, "says %s but %s", quote(q.text(p.s.ut.text)), changeFacts(c, q.unit == uPercent)), true
}

// changeFacts says what a comparison shows: "Monthly against Annual differ
// by -23.0 points (95% CI ...), 38.2% against 61.2%, a relative change of
// -37.6%; try ...".
func changeFacts(c *comparison, relative bool) string {
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
	if r := c.rel(); relative && !math.IsNaN(r) {
		b.WriteString("; try " + quote(plain(math.Abs(r), blocks.Percent)))
		return b.String()
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

// matchesRel is matches for a relative change: the writer derived the
// percentage from two figures and rounds it as a round figure ("40% more"
// for 40.9%), so a bare figure is read as "about".
func matchesRel(q *quantity, v float64) bool {
	if q.hedge == hNone && q.lo == q.hi && !q.word {
		a := *q
		a.hedge = hAbout
		return matches(&a, v)
	}
	if q.word && q.den == 0 && (q.hedge == hNone || q.hedge == hAbout) {
		// "about a fifth more" for 22%: a fraction in words is a rough
		// figure, within 15% of itself.
		a := *q
		a.half = math.Max(q.half, 0.15*math.Abs(q.val))
		return matches(&a, v)
	}
	return matches(q, v)
}

func intervalMatches(q *quantity, lo, hi float64) bool {
	ql := *q
	ql.val, ql.lo, ql.hi, ql.hedge = q.lo, q.lo, q.lo, hNone
	qh := *q
	qh.val, qh.lo, qh.hi, qh.hedge = q.hi, q.hi, q.hi, hNone
	return matches(&ql, lo) && matches(&qh, hi)
}

// extent is a range of single values a sentence states: "ranged from 25 to
// 128 minutes", "gave between 4 and 20 hours". lo and hi are the same
// quantity for "between 4 and 20".
type extent struct {
	lo, hi *quantity
	a, b   float64
}

// rangeVerbs before "from A to B" make it the extent of the values.
var rangeVerbs = set("ranged range ranges ranging varied vary varies varying spanned span spans spread ran run runs stretched")

// extents finds the ranges of single values the sentence states. A range
// with a share or a quantifier ("most gave between 10 and 15 hours", "40%
// to 45%") is about how many, not about the extremes.
func (p *Pass) extents() []extent {
	s := p.s
	for _, q := range s.qs {
		if q.claim() && (q.unit == uPercent || q.share) {
			return nil
		}
	}
	for _, qp := range quantPhrases {
		if _, _, ok := s.hasPhrase(qp.phrase); ok {
			return nil
		}
	}
	if s.has("half", "quarter", "third", "middle", "typical", "typically", "mean", "average", "averaged", "median", "interval", "ci") {
		return nil
	}
	// "scores between 60 and 80 count as a pass": a definition.
	if s.has("count", "counts", "counted", "define", "defined", "defines", "classed", "classified", "considered", "treated",
		"labelled", "labeled", "called", "band", "bands", "category", "categories", "scale") {
		return nil
	}
	var out []extent
	for i, q := range s.qs {
		if !q.claim() || q.stat != "" || q.unit == uTimes || q.unit == uPoints {
			continue
		}
		if q.hedge == hRange && (isWordTok(s.toks, q.tok-1, "between") || (q.cur != "" && isWordTok(s.toks, q.tok-2, "between"))) {
			out = append(out, extent{lo: q, hi: q, a: q.lo, b: q.hi})
			continue
		}
		if q.role != "from" || i+1 >= len(s.qs) {
			continue
		}
		o := s.qs[i+1]
		if o.role != "to" || !o.claim() || o.stat != "" {
			continue
		}
		verb := false
		for k := q.tok - 2; k >= 0 && k >= q.tok-4; k-- {
			if rangeVerbs[s.toks[k].low] {
				verb = true
			}
		}
		// "orders were worth from £9.84 to £80.44": from and to with no
		// change word are the extremes too.
		if !verb && len(p.directionWords()) == 0 && s.forecastAt() < 0 {
			verb = true
		}
		if verb {
			out = append(out, extent{lo: q, hi: o, a: q.val, b: o.val})
		}
	}
	return out
}

// checkExtent judges a stated range of values against the smallest and
// largest value a block in scope found (min and max, per group when the
// sentence names one; x_min and x_max of a fit's columns). judged is false
// when no block in scope has extremes to read it against.
func (p *Pass) checkExtent(e extent) (f Finding, judged, bad bool) {
	s := p.s
	lq, hq := *e.lo, *e.hi
	lq.val, lq.lo, lq.hi = e.a, e.a, e.a
	hq.val, hq.lo, hq.hi = e.b, e.b, e.b
	if e.lo == e.hi {
		lq.hedge, hq.hedge = hNone, hNone
	}
	type pair struct{ min, max *factInfo }
	var pairs []pair
	for _, sc := range p.scope {
		bi := sc.bi
		if sc.score < 1 || sc.why == "named" {
			continue
		}
		switch bi.analysis {
		case "summary", "stemleaf":
			pre := ""
			for d, l := range s.ties(bi, e.lo) {
				if d == "group" {
					pre = l.slug + "."
				}
			}
			if lo, hi := bi.fact(pre+"min"), bi.fact(pre+"max"); lo != nil && hi != nil {
				pairs = append(pairs, pair{lo, hi})
			}
		case "correlation", "regression":
			if lo, hi := bi.fact("x_min"), bi.fact("x_max"); lo != nil && hi != nil {
				pairs = append(pairs, pair{lo, hi})
			}
			if lo, hi := bi.fact("y_min"), bi.fact("y_max"); lo != nil && hi != nil {
				pairs = append(pairs, pair{lo, hi})
			}
		}
	}
	if len(pairs) == 0 {
		return Finding{}, false, false
	}
	for _, pr := range pairs {
		if matches(&lq, pr.min.val()) && matches(&hq, pr.max.val()) {
			return Finding{}, true, false
		}
	}
	for _, pr := range pairs {
		if !near(&lq, pr.min.val(), false) || !near(&hq, pr.max.val(), false) {
			continue
		}
		a, b := e.lo.start, e.hi.end
		for k := e.lo.tok - 1; e.lo == e.hi && k >= 0 && k >= e.lo.tok-2; k-- {
			if s.toks[k].low == "between" {
				a = s.toks[k].start
			}
		}
		return p.at(Error, a, b, pr.min.block, "says the values run %s but %s is %s and %s is %s; try %s",
			quote(s.ut.text[a:b]), describe(pr.min), showF(pr.min), describe(pr.max), showF(pr.max),
			quote(sayLike(e.lo, pr.min)+" to "+sayLike(e.hi, pr.max))), true, true
	}
	// Far from every block's extremes: not a range of values after all.
	return Finding{}, false, false
}

// onFittedLine reports whether the figure is a simple regression's fitted
// value at another figure of the sentence ("with 1,100 mm of rain the model
// predicts about 36.8 kg"): a prediction the block did not list but its line
// gives (whether it is an extrapolation is that rule's).
func (p *Pass) onFittedLine(q *quantity) bool {
	for _, sc := range p.scope {
		bi := sc.bi
		preds := bi.dim("pred")
		ic := bi.fact("intercept.estimate")
		if bi.analysis != "regression" || len(preds) != 1 || ic == nil {
			continue
		}
		b := bi.fact(preds[0].slug + ".estimate")
		if b == nil {
			continue
		}
		for _, x := range p.s.qs {
			if x == q || !(x.claim() || x.skip == "compound") || x.unit == uPercent || x.stat != "" {
				continue
			}
			if y := ic.val() + b.val()*x.val; y != 0 && matchesRel(q, y) {
				return true
			}
		}
	}
	return false
}

// sayLike writes a fact's value the way the sentence wrote its figure: with
// its currency sign, and its scale when the column is kept in that scale
// ("£9.9k").
func sayLike(q *quantity, f *factInfo) string {
	v := f.val()
	if q.cur == "" {
		return plain(v, f.fact.Kind)
	}
	num := q.cur + trimZeros(blocks.Sig(v, 3))
	if u := unscaled(q); u != nil && nearAt(u, v, true) && !nearAt(q, v, true) {
		num += q.scaleWord
	}
	return num
}

// namesQuals reports whether the sentence names every group, level or
// time point a fact is qualified by.
func (p *Pass) namesQuals(f *factInfo) bool {
	named := map[string]bool{}
	for _, m := range p.s.mentionsOf(f.block) {
		named[m.l.slug] = true
	}
	for _, q := range f.quals {
		if f.block.dimOf(q) != "" && !named[q] {
			return false
		}
	}
	return true
}

// quantifierThreshold reports whether a figure is the threshold of a
// quantifier ("no school averaged less than 10 kg", "most waits were under
// 30 minutes"): the quantifier rule judges it; it states no level.
func (p *Pass) quantifierThreshold(q *quantity) bool {
	s := p.s
	if q.unit == uPercent || q.stat != "" {
		return false
	}
	switch q.hedge {
	case hUnder, hOver, hAtLeast, hAtMost:
	default:
		return false
	}
	if len(s.toks) > 1 && s.toks[0].low == "no" && s.toks[1].kind == tWord && !noNotQuantity[s.toks[1].low] {
		return true
	}
	for _, o := range s.qs {
		if o != q && o.share && o.word && o.tok < q.tok {
			return true // "half of the group swam 15 lengths or more"
		}
	}
	for _, qp := range quantPhrases {
		a, _, ok := s.hasPhrase(qp.phrase)
		if !ok || a >= q.tok {
			continue
		}
		if qp.phrase == "most" && (low(s.toks, a-1) == "the" || low(s.toks, a-1) == "at") {
			continue // "the most", "at most": no quantifier
		}
		return true
	}
	return false
}
