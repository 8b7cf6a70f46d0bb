package check

import (
	"strings"
)

var partialSeriesRule = &Rule{
	ID: "partial-series",
	Doc: `partial-series flags repeated measures shown or discussed at one time point while the data hold more: a trend figure ` +
		`that draws fewer time points than the trend has; a figure of a block filtered to one time point (where: wave = post) when ` +
		`the report shows the column has other time points (another block's time: or by: column, another filter on the same ` +
		`column, or a value like "post" or "after" that implies its "pre" or "before"); and a sentence that cites one time point ` +
		`of a trend, or a block filtered to one, in a paragraph that names no other time point and no change. Severity warning.`,
	On:    Prose | Figures,
	Check: checkPartialSeries,
}

// timeColumns are column names that hold time points.
var timeColumns = set("wave time period phase stage round visit term semester quarter month year week day date test " +
	"timepoint occasion session survey cycle when measurement")

// pairedValues imply a counterpart: a post-test has a pre-test.
var pairedValues = set("post pre after before baseline followup follow-up follow_up endline final initial end start posttest pretest")

// oneTimeFilter returns the column and value of an equality filter of the
// block on a time column, when the report shows that column has other
// values.
func (p *Pass) oneTimeFilter(bi *blockInfo) (string, string, bool) {
	if bi.res == nil {
		return "", "", false
	}
	for _, f := range bi.res.Filters {
		col, val, ok := equality(f)
		if !ok {
			continue
		}
		lc := strings.ToLower(col)
		timeCol := false
		for _, w := range splitWords(lc) {
			if timeColumns[w] {
				timeCol = true
			}
		}
		more := false
		for _, o := range p.blocks {
			if o == bi || o.res == nil {
				continue
			}
			if strings.EqualFold(o.meta.Time, col) && len(o.meta.Times) > 1 {
				more = true
			}
			if strings.EqualFold(o.meta.By, col) && len(o.meta.Groups) > 1 {
				more = true
			}
			for _, g := range o.res.Filters {
				if c2, v2, ok := equality(g); ok && strings.EqualFold(c2, col) && !strings.EqualFold(v2, val) {
					more = true
				}
			}
		}
		if !more && timeCol && pairedValues[strings.ToLower(strings.ReplaceAll(val, " ", ""))] {
			more = true
		}
		if more && (timeCol || p.isTimeColumn(col)) {
			return col, val, true
		}
	}
	return "", "", false
}

// isTimeColumn reports whether a trend of the report uses the column as
// its time.
func (p *Pass) isTimeColumn(col string) bool {
	for _, o := range p.blocks {
		if strings.EqualFold(o.meta.Time, col) {
			return true
		}
	}
	return false
}

// equality parses "column = value" (also "==").
func equality(f string) (string, string, bool) {
	for _, op := range []string{"==", "="} {
		k := strings.Index(f, op)
		if k <= 0 {
			continue
		}
		if c := f[k-1]; c == '!' || c == '<' || c == '>' {
			return "", "", false
		}
		col := strings.TrimSpace(f[:k])
		val := strings.Trim(strings.TrimSpace(f[k+len(op):]), "\"'")
		if col == "" || val == "" || strings.ContainsAny(col, " \t") {
			return "", "", false
		}
		return col, val, true
	}
	return "", "", false
}

func checkPartialSeries(p *Pass) []Finding {
	if p.s == nil {
		return p.partialFigure()
	}
	return p.partialProse()
}

func (p *Pass) partialFigure() []Finding {
	bi := p.bi
	spec := bi.figure
	if spec == nil {
		return nil
	}
	if bi.analysis == "trend" {
		times := len(bi.meta.Times)
		shown := len(spec.Categories)
		if times > 1 && shown > 0 && shown < times {
			return []Finding{p.atBlock(Warning, bi, "the figure shows %d of the trend's %d time points; try showing every time point", shown, times)}
		}
		return nil
	}
	if col, val, ok := p.oneTimeFilter(bi); ok {
		return []Finding{p.atBlock(Warning, bi, "the figure shows only %s = %s while the data hold other %s points; try a trend over %s, or show them side by side",
			col, val, col, col)}
	}
	return nil
}

func (p *Pass) partialProse() []Finding {
	for _, sc := range p.scope {
		bi := sc.bi
		if sc.score < 1 {
			continue
		}
		if bi.analysis == "trend" {
			times := bi.dim("time")
			if len(times) < 2 {
				continue
			}
			t, a, b := p.oneTimePoint(bi)
			if t == nil || p.unitNamesOtherTime(bi, t) {
				continue
			}
			return []Finding{p.at(Warning, a, b, bi, "cites %s only, while trend %s has %d time points (%s to %s); try giving the change: {{%s}}",
				t.text, bi.id, len(times), times[0].text, times[len(times)-1].text, changeRef(bi))}
		}
		col, val, ok := p.oneTimeFilter(bi)
		if !ok {
			continue
		}
		a, b, cited := p.citesBlock(bi)
		if !cited || p.unitNamesColumnValues(col, val) {
			continue
		}
		return []Finding{p.at(Warning, a, b, bi, "cites block %s, which keeps only %s = %s, while the data hold other %s points; try reporting them together",
			bi.id, col, val, col)}
	}
	return nil
}

func changeRef(bi *blockInfo) string {
	if bi.fact("change") != nil {
		return bi.id + ".change"
	}
	for _, f := range bi.facts {
		if f.stat == "change" {
			return f.name
		}
	}
	return bi.id + ".change"
}

// oneTimePoint returns the time point the sentence cites a value of, by an
// inline value or a figure bound to a TIME fact, with its span.
func (p *Pass) oneTimePoint(bi *blockInfo) (*label, int, int) {
	s := p.s
	var got *label
	a, b := -1, -1
	for _, q := range s.qs {
		if !q.claim() {
			continue
		}
		var f *factInfo
		if q.ref != "" {
			f = p.refFact(q.ref)
		} else {
			f = p.bindLevel(levelOf(q)).matchIn(bi)
		}
		if f == nil || f.block != bi || f.stat == "n" || f.stat == "count" {
			continue
		}
		if f.stat == "change" || f.stat == "did" {
			return nil, 0, 0
		}
		for _, qu := range f.quals {
			if l := bi.labelOf("time", qu); l != nil {
				if got != nil && got != l {
					return nil, 0, 0
				}
				got = l
				if a < 0 {
					a, b = q.start, q.end
				}
			}
		}
	}
	return got, a, b
}

// unitNamesOtherTime reports whether the paragraph names another time point
// of the trend, its change, or a change word.
func (p *Pass) unitNamesOtherTime(bi *blockInfo, t *label) bool {
	for _, s := range p.unit {
		for _, m := range s.mentionsOf(bi) {
			if m.l.dim == "time" && m.l != t {
				return true
			}
		}
		for _, r := range s.refs {
			if f := p.refFact(r); f != nil && f.block == bi {
				if f.stat == "change" || f.stat == "did" {
					return true
				}
				for _, qu := range f.quals {
					if l := bi.labelOf("time", qu); l != nil && l != t {
						return true
					}
				}
			}
		}
		for _, t := range s.toks {
			if changeVerbs[t.low] || t.low == "since" || t.low == "from" || t.low == "compared" || t.low == "trend" {
				return true
			}
		}
	}
	return false
}

// citesBlock reports whether the sentence cites a figure of the block.
func (p *Pass) citesBlock(bi *blockInfo) (int, int, bool) {
	s := p.s
	for _, q := range s.qs {
		if !q.claim() {
			continue
		}
		if q.ref != "" {
			if f := p.refFact(q.ref); f != nil && f.block == bi && f.stat != "n" {
				return q.start, q.end, true
			}
			continue
		}
		if p.bindLevel(levelOf(q)).matchIn(bi) != nil {
			return q.start, q.end, true
		}
	}
	return 0, 0, false
}

// unitNamesColumnValues reports whether the paragraph names another value of
// the column than val: the other side of a before-and-after pair ("pre-test"
// beside a post-test), or a change.
func (p *Pass) unitNamesColumnValues(col, val string) bool {
	lv := strings.ToLower(strings.ReplaceAll(val, " ", ""))
	side := pairSide[lv]
	for _, s := range p.unit {
		for _, t := range s.toks {
			if t.kind != tWord {
				continue
			}
			if o, ok := pairSide[t.low]; ok && side != 0 && o != side {
				return true
			}
			if changeVerbs[t.low] || t.low == "since" || t.low == "compared" {
				return true
			}
		}
	}
	return false
}

// pairSide puts the words of a before-and-after pair on their side: -1
// before, 1 after.
var pairSide = map[string]int{
	"pre": -1, "before": -1, "baseline": -1, "pretest": -1, "initial": -1, "start": -1, "first": -1,
	"post": 1, "after": 1, "posttest": 1, "end": 1, "final": 1, "endline": 1, "followup": 1, "follow-up": 1, "follow": 1, "last": 1,
}

// levelOf reads "67.4 points" as a level in a score's own points.
func levelOf(q *quantity) *quantity {
	if q.unit != uPoints || q.pp {
		return q
	}
	c := *q
	c.unit = uNone
	return &c
}
