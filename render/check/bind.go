package check

import (
	"math"
	"sort"
	"strings"

	"candor/blocks"
)

// Binding a stated number to a fact (FORMAT.md section 5: "matching by
// value, unit and the words around the number").
//
// A number is compared with the facts of the blocks in the sentence's scope
// whose kind fits its unit (a percentage with shares, a plain number or an
// amount of money with means, counts and coefficients, a number after "p ="
// with p-values). The words of the number's clause narrow the choice: a
// group, level or time point named next to it keeps only that label's
// facts, a statistic word ("median", "average", "longest") only that
// statistic. If any remaining fact agrees with the number, read with its
// hedge, the claim holds. If none does, the claim is reported against the
// best-tied fact only when the tie is strong (a label or statistic word and
// a link to the block) and the number is near enough to be meant for it:
// a number that matches no fact in scope and is tied to none is not a
// finding, because the checker cannot tell what it is about.

// statWords map the words of a clause to the statistic they name.
var statWords = map[string]string{
	"mean": "mean", "average": "mean", "averaged": "mean", "averages": "mean", "averaging": "mean", "avg": "mean", "avg.": "mean",
	"median": "median", "medians": "median", "typical": "median", "midpoint": "median",
	"sd": "sd", "deviation": "sd", "se": "se",
	"minimum": "min", "lowest": "min", "shortest": "min", "smallest": "min", "min": "min", "fewest": "min", "least": "min",
	"best": "extreme", "worst": "extreme", "busiest": "max", "quietest": "min", "record": "extreme",
	"heaviest": "max", "lightest": "min", "tallest": "max", "fastest": "extreme", "slowest": "extreme", "costliest": "max",
	"dearest": "max", "cheapest": "min", "greatest": "max", "quickest": "extreme", "speediest": "extreme",
	"maximum": "max", "highest": "max", "longest": "max", "largest": "max", "max": "max", "peak": "max", "most": "max", "biggest": "max",
	"quartile": "q", "quartiles": "q", "iqr": "iqr", "interquartile": "iqr",
	"missing": "missing", "skewness": "skewness", "skewed": "skewness",
	"respondents": "n", "cases": "n", "sample": "n", "altogether": "n", "total": "n", "responses": "n", "participants": "n",
	"count": "count", "counted": "count",
	"cumulative": "cum_pct", "cumulatively": "cum_pct",
	"correlation": "r", "correlated": "r", "correlates": "r", "coefficient": "estimate",
	"variance": "r2", "explained": "r2", "explains": "r2", "explain": "r2", "r²": "r2", "r2": "r2",
	"accounts": "r2", "account": "r2", "accounted": "r2",
	"odds":  "odds_ratio",
	"slope": "estimate", "additional": "estimate", "extra": "estimate", "each": "estimate",
	"intercept": "intercept",
	"predicted": "predict", "predicts": "predict", "predict": "predict", "forecast": "predict", "projected": "predict",
	"prediction": "predict", "expected": "predict", "expects": "predict", "expect": "predict", "would": "predict",
}

// statFits reports whether a statistic word fits a fact.
func statFits(word string, f *factInfo) bool {
	st := f.stat
	pred := len(f.quals) > 0 && f.quals[0] == "predict"
	switch word {
	case "q":
		return st == "q1" || st == "q3"
	case "n":
		return st == "n" || st == "count" || st == "total"
	case "count":
		return st == "count" || st == "n" || st == "total"
	case "r":
		return st == "r" || st == "rho"
	case "r2":
		return st == "r2" || st == "adj_r2"
	case "estimate":
		return st == "estimate" && !pred && !(len(f.quals) > 0 && f.quals[0] == "intercept")
	case "intercept":
		return st == "estimate" && len(f.quals) > 0 && f.quals[0] == "intercept"
	case "predict":
		return pred && (st == "estimate" || st == "low" || st == "high")
	case "mean":
		return st == "mean" || st == "mean_low" || st == "mean_high"
	case "extreme":
		return st == "min" || st == "max"
	}
	return st == word
}

// headline statistics are the ones a plain number is read against when no
// statistic word names another.
var headline = set("mean median pct row_pct col_pct total_pct n count total successes estimate change diff did ratio r rho r2 p odds_ratio")

// statWordOf returns the statistic word of the quantity's clause ("" when
// there is none) and whether it was a strong one (said right next to it).
func (s *sentence) statWordOf(q *quantity) string {
	c := s.clause[q.tok]
	best, bestD := "", 1<<30
	for i, t := range s.toks {
		if t.kind != tWord || s.clause[i] != c {
			continue
		}
		w, ok := statWords[t.low]
		if !ok {
			continue
		}
		if i >= q.tok && i < q.tokEnd {
			continue
		}
		// "at most", "the most" are hedges and superlatives of other things.
		if t.low == "most" || t.low == "least" {
			continue
		}
		if w == "r2" && (strings.HasPrefix(t.low, "explain") || strings.HasPrefix(t.low, "account")) && !s.has("variation", "variance", "variability", "r²", "r2") {
			continue // "shortages explained a third of late runs": not R²
		}
		if t.low == "each" || t.low == "would" || t.low == "total" || t.low == "sample" {
			// Weak words: only right before or after.
			if i < q.tok-3 || i > q.tokEnd+2 {
				continue
			}
		}
		d := q.tok - i
		if i > q.tok {
			d = i - q.tokEnd + 1
		}
		// A statistic word belongs to the number nearest it: in "the average
		// basket was £9.76 across all three shops" it is £9.76's. Words of
		// prediction and slope ("would", "each") belong to the number after
		// them: in "6 steps would take 9 hours" "would" is 9's.
		forward := w == "predict" || w == "estimate"
		if forward && i > q.tok {
			continue
		}
		taken := false
		for _, o := range s.qs {
			if o == q || !o.claim() || s.clause[o.tok] != c {
				continue
			}
			if forward && o.tok < i {
				continue
			}
			od := o.tok - i
			if i > o.tok {
				od = i - o.tokEnd + 1
			}
			if od >= 0 && od < d {
				taken = true
			}
		}
		if taken {
			continue
		}
		if d < bestD {
			best, bestD = w, d
		}
	}
	if p, _, ok := s.hasPhraseIn("standard deviation", c); ok && p >= 0 {
		best = "sd"
	}
	if best == "" {
		best = s.headStat(q)
	}
	// "The longest delivery, on the South van, took 58.3 minutes": the
	// subject's word, when no figure of its own clause takes it.
	if best == "" && c > 0 {
		for i := 0; i < q.tok && i < len(s.toks) && i <= 2; i++ {
			t := s.toks[i]
			w, ok := statWords[t.low]
			// Only the subject's own word ("The longest delivery, ..."), not
			// a description set off by commas ("Ashgrove, the largest
			// school, ...").
			if !ok || s.clause[i] != 0 || i > 2 || c == 0 || t.low == "most" || t.low == "least" {
				continue
			}
			switch w {
			case "min", "max", "extreme", "mean", "median", "q":
			default:
				continue
			}
			owned := false
			for _, o := range s.qs {
				if o != q && o.claim() && s.clause[o.tok] == s.clause[i] {
					owned = true
				}
			}
			if !owned {
				best = w
			}
		}
	}
	if _, _, ok := s.hasPhraseIn("on average", c); ok && best == "" {
		best = "mean"
	}
	return best
}

// hasPhraseIn is hasPhrase restricted to one clause.
func (s *sentence) hasPhraseIn(phrase string, c int) (int, int, bool) {
	a, b, ok := s.hasPhrase(phrase)
	if ok && s.clause[a] == c {
		return a, b, true
	}
	return -1, -1, false
}

// matches reports whether the true value v agrees with the stated quantity,
// read with its hedge (see the tolerances in lexicon.go).
func matches(q *quantity, v float64) bool {
	if matchesAt(q, v) {
		return true
	}
	// "£15.2k" against a column kept in thousands (sales_k): the figure
	// without its scale.
	if u := unscaled(q); u != nil {
		return matchesAt(u, v)
	}
	return false
}

// unscaled returns the quantity read without its scale suffix, or nil when
// it has none.
func unscaled(q *quantity) *quantity {
	if q.scale <= 1 {
		return nil
	}
	u := *q
	u.val, u.lo, u.hi, u.half, u.scale = q.val/q.scale, q.lo/q.scale, q.hi/q.scale, q.half/q.scale, 0
	return &u
}

func matchesAt(q *quantity, v float64) bool {
	if math.IsNaN(v) {
		return false
	}
	h := q.half
	if h <= 0 {
		h = 1e-9
	}
	eps := 1e-9 * math.Max(1, math.Abs(v))
	s := q.val
	if q.lo != q.hi {
		return v >= q.lo-h-eps && v <= q.hi+h+eps
	}
	tolAbout := h + aboutTolerance*math.Abs(s)
	if q.word {
		tolAbout = math.Max(h, wordTolerance*math.Abs(s))
	}
	if q.den > 0 {
		// "nine in ten" is 90% give or take half a tenth, and no more than
		// a tenth of the smaller side: 86.5% to 93.5%, not 82.8%.
		tolAbout = math.Min(50/q.den, wordTolerance*math.Min(math.Abs(s), math.Abs(100-s))+2.5)
		if q.hedge == hNone {
			return math.Abs(v-s) <= tolAbout+eps
		}
	}
	switch q.hedge {
	case hAbout:
		return math.Abs(v-s) <= tolAbout+eps
	case hNearly:
		low := s - (h + nearlyTolerance*math.Abs(s))
		if q.word {
			low = s - wordTolerance*math.Abs(s)*1.5
		}
		return v >= low-eps && v <= s+h+eps
	case hJustOver:
		top := s + h + nearlyTolerance*math.Abs(s)
		if q.word {
			top = s + wordTolerance*math.Abs(s)*1.5
		}
		return v > s-eps && v <= top+eps
	case hOver:
		return v > s+eps || (q.word && v >= s-eps)
	case hAtLeast:
		return v >= s-eps
	case hUnder:
		return v < s-eps || (q.word && v <= s+eps)
	case hAtMost:
		return v <= s+eps
	}
	if q.word {
		return math.Abs(v-s) <= tolAbout+eps
	}
	return math.Abs(v-s) <= h+eps
}

// near reports whether v is close enough to the stated value to be what the
// writer meant (a wrong figure for the right statistic, not a figure about
// something else).
func near(q *quantity, v float64, strong bool) bool {
	if u := unscaled(q); u != nil && nearAt(u, v, strong) {
		return true
	}
	return nearAt(q, v, strong)
}

func nearAt(q *quantity, v float64, strong bool) bool {
	s := q.val
	if q.lo != q.hi {
		s = (q.lo + q.hi) / 2
	}
	if math.IsNaN(v) {
		return false
	}
	a, b := math.Abs(s), math.Abs(v)
	if a == 0 || b == 0 {
		return math.Abs(a-b) <= 1
	}
	r := math.Max(a, b) / math.Min(a, b)
	if strong {
		if q.unit == uPoints && math.Abs(a-b) <= 10 {
			return true // "by 7 points" for a gap of 0.8: small numbers, far apart in ratio
		}
		return r <= 5
	}
	if q.unit == uPercent || q.unit == uPoints {
		return math.Abs(a-b) <= math.Max(6, 0.25*b)
	}
	return r <= 1.5
}

// cand is a fact a number may be about, with how strongly the sentence ties
// them.
type cand struct {
	f      *factInfo
	score  int
	scale  float64 // the fact's value times scale is compared (100 for R² as a percentage)
	named  int     // qualifiers of the fact that a label the sentence names fixes
	unexpl int     // qualifiers of the fact that nothing in the sentence fixes
	other  bool    // the share of the other outcome: 100% minus the fact
	weak   bool    // a reading that may vouch for a figure but is never its target
}

// aboutOther reports whether the figure's clause speaks of the other
// outcome than the block's success: negated after the figure ("did not
// pass", "were not resolved") or in words of the other kind ("failed").
func (p *Pass) aboutOther(bi *blockInfo, q *quantity) bool {
	s := p.s
	c := s.clause[q.tok]
	for k := q.tokEnd; k < len(s.toks) && s.clause[k] == c; k++ {
		if (negations[s.toks[k].low] && s.toks[k].low != "without") || strings.HasSuffix(s.toks[k].low, "n't") {
			return true
		}
	}
	return !p.namesOutcome(bi) && p.saysOpposite(bi)
}

// statFamily groups the statistics a number may be read as: shares,
// levels (means, medians, quartiles), counts and changes.
func statFamily(st string) string {
	switch st {
	case "pct", "row_pct", "col_pct", "total_pct", "cum_pct":
		return "share"
	case "n", "count", "total", "successes", "cum_count":
		return "count"
	case "change", "diff", "did":
		return "change"
	}
	return st
}

// isBound reports whether a fact is the end of an interval (a mean's 95% CI,
// a coefficient's, a prediction interval's): a number is read against one
// only when its clause speaks of an interval.
func isBound(f *factInfo) bool {
	st := f.stat
	return strings.HasSuffix(st, "_low") || strings.HasSuffix(st, "_high") || st == "low" || st == "high"
}

// intervalWords are the words that make a number the end of an interval.
var intervalWords = set("interval intervals ci cis bound bounds limit limits margin plausible range end ends upper lower")

// speaksOfInterval reports whether the clause of the quantity speaks of an
// interval ("the upper end of the interval", "95% CI").
func (s *sentence) speaksOfInterval(q *quantity) bool {
	if q.stat == "ci" {
		return true
	}
	c := s.clause[q.tok]
	for i, t := range s.toks {
		if t.kind == tWord && intervalWords[t.low] && (s.clause[i] == c || s.clause[i] == c-1) {
			return true
		}
	}
	return false
}

// impliedDim reports whether the sentence fixes a dimension of a fact
// without naming one of its labels: the column of a crosstab named by its
// own name ("refilled on time" for the column on_time).
func (p *Pass) impliedDim(bi *blockInfo, d string) bool {
	if bi.analysis == "crosstab" && d == "col" && len(bi.meta.Columns) > 1 {
		return p.namesColumn(bi.meta.Columns[1])
	}
	if bi.analysis == "crosstab" && d == "row" && len(bi.meta.Columns) > 0 {
		return p.namesColumn(bi.meta.Columns[0]) && len(bi.dim("row")) == 2
	}
	return false
}

func (c cand) v() float64 {
	v := c.f.val()
	if c.scale != 0 {
		v *= c.scale
	}
	if c.other {
		return 100 - v
	}
	return v
}

// levelBinding is the result of binding a stated level (not a change).
type levelBinding struct {
	match  *cand  // the best-tied fact the number agrees with
	all    []cand // every fact it agrees with
	target *cand  // the best-tied fact, when none agrees
	strong bool   // the tie names a label or a statistic
}

var tieDims = set("group level row col time")

// kindFits reports whether a fact's kind fits a quantity's unit.
func kindFits(q *quantity, f *factInfo, sw string) (bool, float64) {
	k := f.fact.Kind
	if q.stat != "" {
		switch q.stat {
		case "p":
			return f.stat == "p" || f.stat == "p_welch" || f.stat == "p_z", 1
		case "d":
			return f.stat == "d", 1
		case "n":
			return (f.stat == "n" || f.stat == "total" || f.stat == "count") && len(f.quals) <= 2, 1
		case "r":
			return f.stat == "r", 1
		case "mean":
			return f.stat == "mean", 1
		case "estimate":
			return f.stat == "estimate" && (len(f.quals) == 0 || f.quals[0] != "predict"), 1
		}
		if q.unit == uPercent && (q.stat == "r2" || q.stat == "adj_r2") {
			return f.stat == q.stat, 100
		}
		return f.stat == q.stat, 1
	}
	switch q.unit {
	case uPercent:
		if k == blocks.Percent {
			return true, 1
		}
		if (sw == "r2") && (f.stat == "r2" || f.stat == "adj_r2") {
			return true, 100
		}
		return false, 0
	case uPoints:
		return k == blocks.Points, 1
	case uTimes:
		return k == blocks.Ratio, 1
	case uCurrency:
		return k == blocks.Number && f.stat != "p" && f.stat != "r" && f.stat != "rho", 1
	}
	if q.word && q.unit == uNone && k != blocks.Count {
		// "all three shops": a count in words is never a mean or a minimum.
		return false, 0
	}
	if k == blocks.Count && measureNouns[q.noun] && sw != "n" && sw != "count" {
		// "30 minutes" is not a count of cases.
		return false, 0
	}
	switch k {
	case blocks.Number, blocks.Count:
		if f.stat == "df" || strings.HasPrefix(f.stat, "df_") || strings.HasPrefix(f.stat, "ss_") || strings.HasPrefix(f.stat, "ms_") {
			return false, 0
		}
		// r, rho, d and R² are plain numbers too, but a number is read
		// against them only when a word says so.
		switch f.stat {
		case "r", "rho":
			return sw == "r", 1
		case "r2", "adj_r2":
			return sw == "r2", 1
		case "d", "v", "chi2", "f", "sigma", "skewness":
			return sw == f.stat, 1
		}
		return true, 1
	case blocks.Ratio:
		return sw == "odds_ratio" || sw == "ratio", 1
	case blocks.PValue:
		return false, 0
	}
	return false, 0
}

// bindLevel ties a stated level (a share, a mean, a count, a statistic
// after its label) to the facts in scope.
func (p *Pass) bindLevel(q *quantity) levelBinding {
	s := p.s
	sw := s.statWordOf(q)
	var cands []cand
	// When the number is tied to a label of some block, blocks it is not
	// tied to cannot vouch for it.
	tied := map[*blockInfo]bool{}
	anyTied := false
	for _, sc := range p.scope {
		for d := range s.ties(sc.bi, q) {
			if tieDims[d] {
				tied[sc.bi] = true
				anyTied = true
			}
		}
	}
	bounds := s.speaksOfInterval(q)
	for _, sc := range p.scope {
		bi := sc.bi
		if (anyTied && !tied[bi]) || sc.why == "named" {
			continue
		}
		ties := s.ties(bi, q)
		// A sentence that names no group, level or time point speaks of all
		// cases: where the block publishes the statistic over all of them,
		// the per-group figures are not candidates ("the median member").
		overall := map[string]bool{}
		named := false
		for d := range ties {
			if tieDims[d] {
				named = true
			}
		}
		if !named {
			for _, f := range bi.facts {
				if len(f.quals) == 0 && f.ok() {
					overall[f.stat] = true
				}
			}
		}
		for _, f := range bi.facts {
			if !f.ok() || (len(f.quals) > 0 && f.quals[0] == "figure") || (isBound(f) && !bounds) {
				continue
			}
			if len(f.quals) > 0 && overall[f.stat] && f.quals[0] != "predict" && f.quals[0] != "intercept" && bi.dimOf(f.quals[0]) != "pred" {
				continue
			}
			fits, scale := kindFits(q, f, sw)
			if !fits {
				continue
			}
			score := 0
			excluded := false
			named, unexpl := 0, 0
			// Labels.
			have := map[string]string{}
			for _, qu := range f.quals {
				if d := bi.dimOf(qu); d != "" {
					have[d] = qu
				}
			}
			for d, l := range ties {
				if !tieDims[d] {
					if d == "pred" && have[d] == l.slug {
						score += 2
					}
					continue
				}
				if got, ok := have[d]; ok {
					if got == l.slug {
						score += 2
						named++
					} else {
						excluded = true
					}
				} else if f.stat != "n" || q.stat != "n" {
					excluded = true
				}
			}
			if excluded {
				continue
			}
			for d := range have {
				if tieDims[d] && ties[d] == nil && !p.impliedDim(bi, d) {
					unexpl++
				}
			}
			// Statistic words and labels.
			switch {
			case q.stat != "":
				score += 3
			case sw != "":
				if statFits(sw, f) {
					score += 2
					if sw == f.stat || (sw == "predict" && f.stat == "estimate") {
						score++
					}
				} else if sw != "n" && sw != "count" && sw != "predict" && sw != "estimate" {
					continue
				}
			default:
				if !headline[f.stat] {
					continue
				}
				if f.stat == bi.measureStat() || (f.stat == "mean" && q.unit == uCurrency) {
					score++
				}
			}
			if len(ties) == 0 && len(f.quals) == 0 {
				score++
			}
			l := sc.score
			if l > 2 {
				l = 2
			}
			cands = append(cands, cand{f: f, score: score + l, scale: scale, named: named, unexpl: unexpl})
			// "a third of Cal's pupils did not pass": the other outcome's share.
			// Said in words the checker does not know ("skipped the cake"), a
			// figure equal to it is no contradiction either.
			if q.unit == uPercent && f.fact.Kind == blocks.Percent && f.stat == "pct" && bi.meta.Outcome == "binary" {
				if other := p.aboutOther(bi, q); other || q.hedge == hNone || q.hedge == hAbout {
					cands = append(cands, cand{f: f, score: score + l, scale: scale, named: named, unexpl: unexpl, other: true, weak: !other})
				}
			}
		}
	}
	cands = append(cands, p.sumCands(q)...)
	// "Fewer than 5% gave under 7.5 hours": the levels that meet the
	// condition, summed.
	if q.unit == uPercent && q.stat == "" {
		if f, _, ok := p.conditionShare(); ok {
			cands = append(cands, cand{f: f, score: 6, named: 1})
		}
	}
	// A fact every qualifier of which the sentence fixes ("fog days 8%" for
	// the share of fog) is what the number is about; a fact with a
	// qualifier the sentence leaves open (fog and on time) cannot vouch for
	// it.
	full := map[string]bool{}
	for _, c := range cands {
		if c.named > 0 && c.unexpl == 0 {
			full[statFamily(c.f.stat)] = true
		}
	}
	if len(full) > 0 {
		keep := cands[:0]
		for _, c := range cands {
			if c.unexpl == 0 || !full[statFamily(c.f.stat)] {
				keep = append(keep, c)
			}
		}
		cands = keep
	}
	var out levelBinding
	for i := range cands {
		c := &cands[i]
		// Cohen's d's sign says which group was subtracted; a stated size
		// is its magnitude ("d = 0.23" for -0.234).
		if matches(q, c.v()) || (c.f.stat == "d" && q.val >= 0 && matches(q, math.Abs(c.v()))) {
			out.all = append(out.all, *c)
			if out.match == nil || c.score > out.match.score {
				out.match = c
			}
		}
	}
	if out.match != nil || len(cands) == 0 {
		return out
	}
	strongC := cands[:0]
	for _, c := range cands {
		if !c.weak {
			strongC = append(strongC, c)
		}
	}
	cands = strongC
	if len(cands) == 0 {
		return out
	}
	sort.SliceStable(cands, func(i, j int) bool {
		if cands[i].score != cands[j].score {
			return cands[i].score > cands[j].score
		}
		return math.Abs(cands[i].v()-q.val) < math.Abs(cands[j].v()-q.val)
	})
	t := cands[0]
	out.target = &t
	out.strong = sw != "" || q.stat != "" || len(s.ties(t.f.block, q)) > 0 || strings.HasPrefix(t.f.local, "(")
	return out
}

// comparison is two values of a block that a sentence may compare: a
// reference group and another, or an earlier and a later time point.
type comparison struct {
	bi               *blockInfo
	from, to         *factInfo // reference or earlier; other or later
	fromLab, toLab   *label
	diff, dlo, dhi   *factInfo // published difference (to − from) and its interval
	ratio, rlo, rhi  *factInfo // published ratio (to / from) and its interval
	odds             *factInfo
	p                *factInfo
	time             bool
	group            *label // the group of a per-group trend
	published, named bool   // named: the sentence names one of its labels
	both             bool   // the sentence names both of its labels
}

func (c *comparison) base() blocks.Kind { return c.from.fact.Kind }

// abs is the difference to − from.
func (c *comparison) abs() float64 {
	if c.diff.ok() {
		return c.diff.val()
	}
	return c.to.val() - c.from.val()
}

// rel is the relative change in percent: (to / from − 1) × 100.
func (c *comparison) rel() float64 {
	if c.ratio.ok() && c.from.fact.Kind == blocks.Percent {
		return (c.ratio.val() - 1) * 100
	}
	if c.from.val() == 0 {
		return math.NaN()
	}
	return (c.to.val()/c.from.val() - 1) * 100
}

// relInverse is the relative change the other way round: (from / to − 1)
// × 100.
func (c *comparison) relInverse() float64 {
	r := c.rel()
	if math.IsNaN(r) || r <= -100 {
		return math.NaN()
	}
	return (100/(1+r/100) - 100)
}

// mult is the ratio to / from.
func (c *comparison) mult() float64 {
	if c.ratio.ok() {
		return c.ratio.val()
	}
	if c.from.val() == 0 {
		return math.NaN()
	}
	return c.to.val() / c.from.val()
}

// names is "Annual against Monthly" or "from Q1 to Q4".
func (c *comparison) names() string {
	a, b := "", ""
	if c.fromLab != nil {
		a = c.fromLab.name()
	}
	if c.toLab != nil {
		b = c.toLab.name()
	}
	if c.time {
		s := "from " + a + " to " + b
		if c.group != nil {
			s = c.group.name() + " " + s
		}
		return s
	}
	return b + " against " + a
}

// comparisons lists what the block compares, as the sentence names it: the
// pairs between labels the sentence names, and the block's own comparisons
// (each group against the reference, first time point against the last).
func (p *Pass) comparisons(bi *blockInfo) []*comparison {
	s := p.s
	stat := bi.measureStat()
	ms := s.mentionsOf(bi)
	named := map[*label]bool{}
	var order []*label
	for _, m := range ms {
		if !named[m.l] {
			named[m.l] = true
			order = append(order, m.l)
		}
	}
	get := func(quals ...string) *factInfo {
		return bi.fact(strings.Join(append(quals, stat), "."))
	}
	var out []*comparison
	seen := map[[2]*label]bool{}
	addPair := func(c *comparison) {
		if c == nil || !c.from.ok() || !c.to.ok() {
			return
		}
		k := [2]*label{c.fromLab, c.toLab}
		if seen[k] {
			return
		}
		seen[k] = true
		c.named = named[c.fromLab] || named[c.toLab]
		c.both = named[c.fromLab] && named[c.toLab]
		out = append(out, c)
	}
	switch bi.analysis {
	case "compare":
		groups := bi.dim("group")
		if len(groups) < 2 {
			return nil
		}
		ref := groups[0]
		if r := bi.meta.Reference; r != "" {
			if l := bi.labelOf("group", blocks.Slug(r)); l != nil {
				ref = l
			}
		}
		for _, g := range groups {
			if g == ref {
				continue
			}
			c := &comparison{bi: bi, from: get(ref.slug), to: get(g.slug), fromLab: ref, toLab: g, published: true, p: bi.fact("p")}
			if len(groups) == 2 {
				c.diff, c.dlo, c.dhi = bi.fact("diff"), bi.fact("diff_low"), bi.fact("diff_high")
				c.ratio, c.rlo, c.rhi = bi.fact("ratio"), bi.fact("ratio_low"), bi.fact("ratio_high")
				c.odds = bi.fact("odds_ratio")
			} else {
				c.diff, c.dlo, c.dhi = bi.fact(g.slug+".diff"), bi.fact(g.slug+".diff_low"), bi.fact(g.slug+".diff_high")
				c.ratio, c.rlo, c.rhi = bi.fact(g.slug+".ratio"), bi.fact(g.slug+".ratio_low"), bi.fact(g.slug+".ratio_high")
				c.odds = bi.fact(g.slug + ".odds_ratio")
			}
			// Pre/post groups are time points.
			c.time = timeLike(ref.text) && timeLike(g.text)
			addPair(c)
		}
		p.namedPairs(bi, order, "group", get, addPair)
	case "trend":
		times := bi.dim("time")
		if len(times) < 2 {
			return nil
		}
		groups := bi.dim("group")
		var named2 []*label
		for _, l := range order {
			if l.dim == "time" {
				named2 = append(named2, l)
			}
		}
		from, to := times[0], times[len(times)-1]
		switch {
		case len(named2) >= 2:
			from, to = named2[0], named2[len(named2)-1]
			if indexOf(times, from) > indexOf(times, to) {
				from, to = to, from
			}
		case len(named2) == 1:
			w := p.wordBefore(named2[0])
			if w == "since" || w == "from" || w == "after" {
				from = named2[0]
			} else if named2[0] != times[0] {
				to = named2[0]
			}
		}
		full := from == times[0] && to == times[len(times)-1]
		// "Q3 sales rose 12%": from the first time point, or from the one
		// before; both readings are kept.
		var prev *label
		if len(named2) == 1 && to == named2[0] {
			if k := indexOf(times, to); k > 1 {
				prev = times[k-1]
			}
		}
		if len(groups) == 0 {
			c := &comparison{bi: bi, from: get(from.slug), to: get(to.slug), fromLab: from, toLab: to, time: true, published: full}
			if full {
				c.diff = bi.fact("change")
			}
			addPair(c)
			if prev != nil {
				addPair(&comparison{bi: bi, from: get(prev.slug), to: get(to.slug), fromLab: prev, toLab: to, time: true})
			}
			return out
		}
		var gs []*label
		for _, g := range groups {
			if named[g] {
				gs = append(gs, g)
			}
		}
		if len(gs) == 0 {
			gs = groups
		}
		for _, g := range gs {
			c := &comparison{bi: bi, from: get(g.slug, from.slug), to: get(g.slug, to.slug), fromLab: from, toLab: to, time: true, group: g, published: full}
			if full {
				c.diff = bi.fact(g.slug + ".change")
			}
			k := [2]*label{g, to}
			if seen[k] {
				continue
			}
			seen[k] = true
			if c.from.ok() && c.to.ok() {
				c.named = true
				out = append(out, c)
			}
		}
	case "summary":
		p.namedPairs(bi, order, "group", get, addPair)
		if len(out) == 0 && countDim(order, "group") == 1 {
			// One group named ("early swimmers visit twice as often"): against
			// each other group and against everyone.
			var g *label
			for _, l := range order {
				if l.dim == "group" {
					g = l
				}
			}
			for _, o := range bi.dim("group") {
				if o != g {
					addPair(&comparison{bi: bi, from: get(o.slug), to: get(g.slug), fromLab: o, toLab: g})
				}
			}
			if all := bi.fact(stat); all != nil {
				c := &comparison{bi: bi, from: all, to: get(g.slug), fromLab: &label{text: "all", slug: "all"}, toLab: g}
				if c.from.ok() && c.to.ok() {
					c.named = true
					out = append(out, c)
				}
			}
		}
	case "frequency":
		stat = "pct"
		p.namedPairs(bi, order, "level", get, addPair)
	case "crosstab":
		// Rows compared on the share of one column: the one the sentence
		// names, or the "yes" of a yes/no column.
		col := p.crosstabCol(bi)
		if col == nil {
			return nil
		}
		cget := func(quals ...string) *factInfo {
			return bi.fact(strings.Join(append(quals, col.slug, "row_pct"), "."))
		}
		p.namedPairs(bi, order, "row", cget, addPair)
	}
	return out
}

// crosstabCol returns the column of a crosstab that a sentence comparing
// its rows is about: a column label it names, else the "yes" of a column
// with two levels.
func (p *Pass) crosstabCol(bi *blockInfo) *label {
	for _, m := range p.s.mentionsOf(bi) {
		if m.l.dim == "col" {
			return m.l
		}
	}
	cols := bi.dim("col")
	if len(cols) != 2 {
		return nil
	}
	for _, l := range cols {
		switch strings.ToLower(l.text) {
		case "yes", "true", "1", "y":
			return l
		}
	}
	return nil
}

func countDim(ls []*label, d string) int {
	n := 0
	for _, l := range ls {
		if l.dim == d {
			n++
		}
	}
	return n
}

func indexOf(ls []*label, l *label) int {
	for i, x := range ls {
		if x == l {
			return i
		}
	}
	return -1
}

// namedPairs adds the comparison between the first two labels of a
// dimension that the sentence names, in the sentence's order (the first
// named is "to": "A was higher than B").
func (p *Pass) namedPairs(bi *blockInfo, order []*label, dim string, get func(...string) *factInfo, add func(*comparison)) {
	var ls []*label
	for _, l := range order {
		if l.dim == dim {
			ls = append(ls, l)
		}
	}
	if len(ls) < 2 {
		return
	}
	a, b := ls[0], ls[1]
	add(&comparison{bi: bi, from: get(b.slug), to: get(a.slug), fromLab: b, toLab: a, time: timeLike(a.text) && timeLike(b.text)})
}

// wordBefore returns the word right before the first mention of a label.
func (p *Pass) wordBefore(l *label) string {
	for bi := range p.s.mentions {
		for _, m := range p.s.mentions[bi] {
			if m.l == l && m.a > 0 {
				return p.s.toks[m.a-1].low
			}
		}
	}
	return ""
}

// timeLike reports whether a group name is a time point or a condition
// before and after ("pre", "post", "baseline", "wave 2").
func timeLike(s string) bool {
	w := strings.ToLower(s)
	for _, k := range []string{"pre", "post", "before", "after", "baseline", "follow", "wave", "week", "month", "year",
		"quarter", "term", "round", "visit", "time", "phase", "start", "end", "initial", "final", "q1", "q2", "q3", "q4"} {
		if strings.Contains(w, k) {
			return true
		}
	}
	_, isMonth := months[w]
	return isMonth || isNumeric(w)
}

// changeComparisons returns the comparisons a change or multiple in the
// sentence may be about, the best-tied first: those of the blocks in scope,
// the ones whose labels the sentence names before the others.
func (p *Pass) changeComparisons(min int) []*comparison {
	var out []*comparison
	for _, sc := range p.scope {
		if sc.score < min {
			continue
		}
		cs := p.comparisons(sc.bi)
		sort.SliceStable(cs, func(i, j int) bool { return cs[i].named && !cs[j].named })
		out = append(out, cs...)
	}
	sort.SliceStable(out, func(i, j int) bool { return out[i].named && !out[j].named })
	// A sentence that names both sides of a comparison ("phone bookers
	// turned up less often than online bookers") is about that one; the
	// block's other comparisons cannot vouch for its figure.
	var both []*comparison
	for _, c := range out {
		if c.both {
			both = append(both, c)
		}
	}
	if len(both) > 0 {
		return both
	}
	return out
}

// measureNouns after a number make it a measurement, not a count of cases.
var measureNouns = set("minutes minute mins min hours hour hrs hr days day weeks week months month years year seconds second " +
	"secs km kilometres kilometers miles mile metres meters kg kilos grams litres liters points point pts percent per times " +
	"euros euro pounds dollars pence cents stars degrees")

// matchIn returns the fact of the block that the quantity agrees with, the
// best-tied first, or nil.
func (b levelBinding) matchIn(bi *blockInfo) *factInfo {
	var best *cand
	for i := range b.all {
		c := &b.all[i]
		if c.f.block == bi && c.f.stat != "n" && c.f.stat != "count" && (best == nil || c.score > best.score) {
			best = c
		}
	}
	if best == nil {
		return nil
	}
	return best.f
}

// sumCands are the sums of the shares or counts of the labels a sentence
// names "together" ("crime and children's books together made up over a
// third of loans").
func (p *Pass) sumCands(q *quantity) []cand {
	s := p.s
	together := s.has("together", "combined", "jointly", "altogether")
	var out []cand
	for _, sc := range p.scope {
		bi := sc.bi
		for _, stat := range []string{"pct", "count"} {
			sum, n := 0.0, 0
			var kind blocks.Kind
			seen := map[*label]bool{}
			ms := s.mentionsOf(bi)
			for k, m := range ms {
				if seen[m.l] {
					continue
				}
				// Without "together", only labels joined by "and" or "or"
				// with nothing else between ("satisfied or very satisfied").
				if !together && !joined(s, ms, k) {
					continue
				}
				seen[m.l] = true
				if f := bi.fact(m.l.slug + "." + stat); f != nil {
					sum += f.val()
					kind = f.fact.Kind
					n++
				}
			}
			if n < 2 {
				continue
			}
			f := &factInfo{name: bi.id + ".(sum)", local: "(of the named levels together)", stat: stat, block: bi,
				fact: blocks.Fact{Name: bi.id + ".(sum)", Value: sum, Kind: kind}}
			if ok, _ := kindFits(q, f, ""); ok {
				out = append(out, cand{f: f, score: 6})
			}
		}
	}
	return out
}

// joined reports whether mention k is joined to the mention before or after
// it by "and", "or", "&" or a comma alone.
func joined(s *sentence, ms []mention, k int) bool {
	link := func(a, b int) bool {
		if b <= a {
			return false
		}
		for i := a; i < b; i++ {
			switch s.toks[i].low {
			case "and", "or", "&", ",", "’s", "'s", "a", "an", "the":
			default:
				return false
			}
		}
		return true
	}
	if k > 0 && ms[k-1].l.dim == ms[k].l.dim && link(ms[k-1].b, ms[k].a) {
		return true
	}
	if k+1 < len(ms) && ms[k+1].l.dim == ms[k].l.dim && link(ms[k].b, ms[k+1].a) {
		return true
	}
	return false
}
