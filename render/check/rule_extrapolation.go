package check

import (
	"math"
	"strings"
)

var extrapolationRule = &Rule{
	ID: "extrapolation",
	Doc: `extrapolation flags a prediction outside the observed range of the predictor. For a regression block it reads a ` +
		`predictor value the sentence states beside the predictor's name ("a member with 60 visits would spend") or that a predict: ` +
		`value shown inline was made at (the fact predict.K.PRED), against the range the fit saw (x_min and x_max, or PRED.min and ` +
		`PRED.max). A prediction typed by hand counts too: a figure of a sentence that speaks of a prediction ("would", "expects", ` +
		`"predicts", "if") equal to one of the block's predictions (judged at its predict.K.PRED), to the intercept said of none of ` +
		`the predictor ("with no advertising at all"), or to the fitted line at another figure of the sentence ("a 40-degree day ` +
		`would bring 780 riders"). For a trend block it reads a forecast ("will reach", "by next year", "is on course to") with a figure, since a ` +
		`trend computes no value past its last time point. Severity warning.`,
	Check: checkExtrapolation,
}

var futureWords = set("will would forecast forecasts forecasted projected projection projections predict predicts predicted " +
	"expect expects expected extrapolate extrapolated extrapolating anticipate anticipated")

var futurePhrases = []string{"on course to", "on track to", "set to", "going to", "by next year", "next year", "next quarter",
	"next month", "next term", "by the end of next", "in the coming", "in future", "in the future", "at this rate", "on pace to",
	"if the trend continues", "if the trend holds", "if this continues", "should reach", "is likely to reach"}

func checkExtrapolation(p *Pass) []Finding {
	s := p.s
	future := s.forecastAt()
	var out []Finding
	// Regressions.
	for _, sc := range p.scope {
		bi := sc.bi
		if bi.analysis != "regression" || sc.score < 1 {
			continue
		}
		// An inline prediction made at a predictor value the block publishes.
		for _, r := range s.refs {
			f := p.refFact(r)
			if f == nil || f.block != bi || len(f.quals) < 2 || f.quals[0] != "predict" {
				continue
			}
			pre := "predict." + f.quals[1] + "."
			for _, g := range bi.facts {
				if !strings.HasPrefix(g.local, pre) || g.stat == "estimate" || g.stat == "low" || g.stat == "high" || !g.ok() {
					continue
				}
				lo, hi := p.rangeOf(bi, g.stat)
				if lo == nil || hi == nil {
					continue
				}
				if x := g.val(); x < lo.val() || x > hi.val() {
					a, b := p.refSpan(r)
					out = append(out, p.at(Warning, a, b, bi, "predicts at %s = %s, outside the observed range %s–%s; the fit says nothing there; try %s",
						g.stat, sig3(x), sig3(lo.val()), sig3(hi.val()),
						quote("predictions within "+sig3(lo.val())+"–"+sig3(hi.val()))))
					return out
				}
			}
		}
		if f, ok := p.typedPrediction(bi, future); ok {
			return append(out, f)
		}
		if future < 0 && !s.has("at", "with", "for", "if") {
			continue
		}
		// A predictor value stated beside the predictor's name.
		for _, pr := range bi.dim("pred") {
			lo, hi := p.rangeOf(bi, pr.slug)
			if lo == nil || hi == nil {
				continue
			}
			for _, m := range s.mentionsOf(bi) {
				if m.l != pr {
					continue
				}
				q := p.valueBeside(m)
				if q == nil && m.a > 0 && (s.toks[m.a-1].low == "one" || s.toks[m.a-1].low == "single") {
					t := s.toks[m.a-1]
					q = &quantity{val: 1, lo: 1, hi: 1, start: t.start, end: s.toks[m.b-1].end, tok: m.a - 1, tokEnd: m.a}
				}
				if q == nil {
					continue
				}
				if future < 0 && !strings.Contains(s.text, "would") && !s.has("predicted", "predicts", "expected", "forecast") {
					continue
				}
				x := q.val
				if x >= lo.val() && x <= hi.val() {
					continue
				}
				out = append(out, p.atQ(Warning, q, bi, "predicts at %s %s, outside the observed range %s–%s of %s; the fit says nothing there; try %s",
					q.text(s.ut.text), pr.text, sig3(lo.val()), sig3(hi.val()), pr.text,
					quote("within the observed "+sig3(lo.val())+" to "+sig3(hi.val())+" "+pr.text)))
				return out
			}
		}
	}
	// Trends: a forecast with a figure.
	if future < 0 {
		return nil
	}
	sc := p.best(1, func(bi *blockInfo) bool { return bi.analysis == "trend" })
	if sc == nil {
		return nil
	}
	var q *quantity
	for _, o := range s.qs {
		// "will reach 250", "will double": a figure or a multiple.
		if o.claim() && o.tok > future && (!o.word || o.unit == uTimes) {
			q = o
			break
		}
	}
	if q == nil {
		return nil
	}
	ts := sc.bi.dim("time")
	last := ""
	if len(ts) > 0 {
		last = ts[len(ts)-1].text
	}
	return []Finding{p.atQ(Warning, q, sc.bi, "forecasts %s beyond the last time point (%s) of trend %s, which computes no value there; try %s",
		quote(q.text(s.ut.text)), last, sc.bi.id, quote("if the trend continued, which the data cannot show, …"))}
}

// rangeOf returns the observed range of a predictor: x_min and x_max for a
// simple regression, PRED.min and PRED.max otherwise.
func (p *Pass) rangeOf(bi *blockInfo, pred string) (*factInfo, *factInfo) {
	if lo, hi := bi.fact(pred+".min"), bi.fact(pred+".max"); lo != nil && hi != nil {
		return lo, hi
	}
	if lo, hi := bi.fact(pred+".x_min"), bi.fact(pred+".x_max"); lo != nil && hi != nil {
		return lo, hi
	}
	if len(bi.dim("pred")) <= 1 {
		if lo, hi := bi.fact("x_min"), bi.fact("x_max"); lo != nil && hi != nil {
			return lo, hi
		}
	}
	return nil, nil
}

// valueBeside returns the plain number right before or after a mention
// ("60 visits", "visits of 60", "60 more visits").
func (p *Pass) valueBeside(m mention) *quantity {
	s := p.s
	for _, q := range s.qs {
		if !q.claim() || q.unit == uPercent || q.unit == uTimes {
			continue
		}
		if q.tokEnd == m.a || q.tokEnd+1 == m.a || q.tokEnd+2 == m.a && q.unit != uCurrency {
			return q
		}
		if q.tok == m.b+1 && (low(s.toks, m.b) == "of" || low(s.toks, m.b) == "at" || low(s.toks, m.b) == "=") {
			return q
		}
	}
	return nil
}

// refSpan returns the unit-text span of the first inline value of the fact.
func (p *Pass) refSpan(ref string) (int, int) {
	s := p.s
	for _, t := range s.toks {
		if t.ref == ref {
			for _, sp := range s.ut.spans {
				if sp.ref == ref && sp.start <= t.start && t.start < sp.end {
					return sp.start, sp.end
				}
			}
		}
	}
	return s.start, s.end
}

// forecastAt returns the token of the first future word of the sentence
// ("will", "forecast", "on course to"), or -1.
func (s *sentence) forecastAt() int {
	for i, t := range s.toks {
		if futureWords[t.low] {
			return i
		}
	}
	for _, ph := range futurePhrases {
		if a, _, ok := s.hasPhrase(ph); ok {
			return a
		}
	}
	return -1
}

// typedPrediction reads a prediction typed by hand: a figure of a sentence
// that speaks of a prediction ("would", "predicts", "expect", "if") and
// equals one of the block's predictions (predict.K.estimate, made at the
// predictor values predict.K.PRED), its intercept said of no predictor at
// all ("with no advertising at all would still sell about 165"), or, for
// one predictor, the fitted line at another figure of the sentence ("a
// 40-degree day would bring 780 riders").
func (p *Pass) typedPrediction(bi *blockInfo, future int) (Finding, bool) {
	s := p.s
	if future < 0 && !s.has("if", "model", "fitted", "fit", "should", "yield", "yields") {
		return Finding{}, false
	}
	preds := bi.dim("pred")
	outside := func(pred string, x float64) (lo, hi *factInfo, bad bool) {
		lo, hi = p.rangeOf(bi, pred)
		if lo == nil || hi == nil {
			return nil, nil, false
		}
		return lo, hi, x < lo.val() || x > hi.val()
	}
	report := func(q *quantity, pred string, x float64, lo, hi *factInfo) Finding {
		name := pred
		if l := bi.labelOf("pred", pred); l != nil {
			name = l.text
		}
		return p.atQ(Warning, q, bi, "predicts %s at %s = %s, outside the observed range %s–%s; the fit says nothing there; try %s",
			quote(q.text(s.ut.text)), name, sig3(x), sig3(lo.val()), sig3(hi.val()),
			quote("within the observed "+sig3(lo.val())+" to "+sig3(hi.val())+" "+name))
	}
	for _, q := range s.qs {
		if !q.claim() || q.ref != "" || q.unit == uPercent || q.unit == uTimes || q.unit == uPoints || q.stat != "" || q.change {
			continue
		}
		// One of the block's own predictions.
		for k := 1; ; k++ {
			est := bi.fact("predict." + itoa(k) + ".estimate")
			if est == nil {
				break
			}
			if !matches(q, est.val()) && !matchesRel(q, est.val()) {
				continue
			}
			for _, pr := range preds {
				xf := bi.fact("predict." + itoa(k) + "." + pr.slug)
				if xf == nil {
					continue
				}
				if lo, hi, bad := outside(pr.slug, xf.val()); bad {
					return report(q, pr.slug, xf.val(), lo, hi), true
				}
			}
			return Finding{}, false
		}
		// The intercept, said of none of the predictor.
		if ic := bi.fact("intercept.estimate"); ic != nil && matches(q, ic.val()) && s.has("no", "zero", "without", "nothing", "never", "none") {
			for _, pr := range preds {
				if lo, hi, bad := outside(pr.slug, 0); bad {
					return report(q, pr.slug, 0, lo, hi), true
				}
			}
			continue
		}
		// The fitted line of one predictor at another figure of the sentence.
		ic := bi.fact("intercept.estimate")
		if len(preds) != 1 || ic == nil {
			continue
		}
		// "If a store could draw 900 visitors a day it would take about
		// £19k": the figure before the word of prediction is the
		// predictor's value, the one after it the outcome's, right or not.
		if w := s.predictionWordAt(); w > q.tok {
			continue // q stands before the word; only an outcome after it is read
		} else if w >= 0 {
			for _, x := range s.qs {
				if x == q || x.tok > w || !(x.claim() || x.skip == "compound") || x.unit == uPercent || x.unit == uTimes ||
					x.unit == uPoints || x.stat != "" || x.change {
					continue
				}
				lo, hi, bad := outside(preds[0].slug, x.val)
				if !bad || lo == nil {
					continue
				}
				// Within a factor of ten of the observed range: a value of
				// the predictor, not some other figure.
				span := math.Max(math.Abs(lo.val()), math.Abs(hi.val()))
				if math.Abs(x.val) <= 10*span && (x.val >= lo.val()-10*span) {
					return report(q, preds[0].slug, x.val, lo, hi), true
				}
			}
		}
		b := bi.fact(preds[0].slug + ".estimate")
		if b == nil {
			continue
		}
		for _, x := range s.qs {
			// "a 40-degree day": a compound names the predictor's value.
			if x == q || !(x.claim() || x.skip == "compound") || x.ref != "" || x.unit == uPercent || x.unit == uTimes || x.stat != "" {
				continue
			}
			y := ic.val() + b.val()*x.val
			if !matchesRel(q, y) || math.Abs(y) < 1e-9 {
				continue
			}
			if lo, hi, bad := outside(preds[0].slug, x.val); bad {
				return report(q, preds[0].slug, x.val, lo, hi), true
			}
			return Finding{}, false
		}
	}
	return Finding{}, false
}

// predictionWordAt returns the token of the sentence's word of prediction
// ("would", "predicts", "expect", "should"), or -1.
func (s *sentence) predictionWordAt() int {
	for i, t := range s.toks {
		switch t.low {
		case "would", "predicts", "predicted", "predict", "expect", "expects", "expected", "should", "projected", "forecast":
			return i
		}
	}
	return -1
}
