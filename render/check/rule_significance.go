package check

import (
	"fmt"
	"strings"

	"candor/blocks"
)

var significanceRule = &Rule{
	ID: "significance",
	Doc: `significance flags words of statistical certainty without support at the report's alpha (check: alpha, default 0.05), ` +
		`or with it where the words deny it. "significant", "significantly", "clearly", "confirms", "demonstrates", "a real ` +
		`difference" with p at or above alpha are errors; so are "not significant", "no evidence", "no clear difference" with p below ` +
		`alpha, and "no effect", "no difference", "did not differ" with p below alpha. "no effect" and the like with p at or above ` +
		`alpha are warnings: a test that finds nothing does not show there is nothing, and the interval says how large the effect may ` +
		`be. "proves", "proven", "beyond doubt", "conclusively", "definitely" are warnings even with p below alpha: one test proves ` +
		`nothing. An intensified comparison ("far less likely", "dramatically higher") with p at or above alpha is a warning. "significant" about a block that computes no test (a summary, a frequency, a trend) is a warning, as is "clearly" and the like ` +
		`when such a sentence compares or describes a change. The p-value is the ` +
		`block's p (for a regression, the named predictor's); in a comparison of three or more groups, a sentence about one group ` +
		`against the reference reads that pair's test (GROUP.p_welch for means, GROUP.p_z for shares), and one about two other ` +
		`groups, which have no test of their own, is not judged. "Highly" or "very significant" with p at or above 0.01 is a ` +
		`warning. Severity as stated.`,
	Check: checkSignificance,
}

// Phrases of the significance rule, longest first within each list.
var (
	denialPhrases = []string{"includes no difference", "include no difference", "including no difference", "includes zero",
		"includes 0", "includes 1", "includes one", "spans zero", "spans no difference", "crosses zero", "crosses 1",
		"not statistically significant", "no statistically significant", "not significantly", "not significant",
		"non-significant", "nonsignificant", "insignificant", "no significant", "no evidence", "no clear", "not clear", "not clearly",
		"unclear", "inconclusive", "could be chance", "may be chance", "might be chance", "could reflect chance", "by chance",
		"within the margin", "too small to", "cannot rule out", "can't rule out", "could not rule out", "not enough evidence",
		"no reliable", "not reliably", "consistent with no", "no convincing", "not convincing", "cannot tell", "can't tell",
		"could not tell", "not distinguishable", "indistinguishable from"}
	absencePhrases = []string{"made no difference", "makes no difference", "make no difference", "no effect", "no difference",
		"no impact", "no link", "no association", "no relationship", "no influence", "no gap", "did not differ", "didn't differ",
		"does not differ", "do not differ", "did not affect", "does not affect", "didn't affect", "unaffected", "does not matter",
		"did not matter", "doesn't matter", "had no bearing", "has no bearing", "no bearing", "no change"}
	certaintyPhrases = []string{"beyond doubt", "beyond any doubt", "without doubt", "no doubt", "proves", "proved", "proven",
		"prove", "proof", "conclusively", "conclusive", "definitely", "definitive", "undeniably", "undeniable", "unquestionably",
		"certainly", "guarantees", "guaranteed"}
	positivePhrases = []string{"statistically significant", "significantly", "significant", "reached significance",
		"clearly", "clear difference", "clear effect", "clear evidence", "clear link", "clear rise", "clear increase",
		"clear improvement", "clear gap", "clear sign", "confirms", "confirmed", "confirm", "demonstrates", "demonstrated",
		"demonstrate", "real difference", "real effect", "genuine difference", "genuine effect", "strong evidence", "firm evidence",
		"robust evidence", "establishes", "reliably"}
)

// intensifiers before a comparative claim a large difference ("far less
// likely").
var intensifiers = set("far much dramatically substantially markedly considerably vastly sharply hugely massively greatly " +
	"strikingly notably significantly")

// highlyWords before "significant" claim a p-value well below alpha.
var highlyWords = set("highly very extremely hugely strongly overwhelmingly")

// findPhrase returns the first phrase of the list the sentence has, with
// its token range.
func (s *sentence) findPhrase(list []string) (string, int, int) {
	for _, ph := range list {
		if a, b, ok := s.hasPhrase(ph); ok {
			return ph, a, b
		}
	}
	return "", -1, -1
}

// testOf returns the p-value fact a sentence's claim rests on in a block:
// the named predictor's for a regression, the block's p otherwise.
func (p *Pass) testOf(bi *blockInfo) *factInfo {
	if bi.analysis == "regression" {
		for _, m := range p.s.mentionsOf(bi) {
			if m.l.dim == "pred" {
				if f := bi.fact(m.l.slug + ".p"); f != nil {
					return f
				}
			}
		}
		if len(bi.meta.Predictors) == 1 {
			if f := bi.fact(blocks.Slug(bi.meta.Predictors[0]) + ".p"); f != nil {
				return f
			}
		}
	}
	if f, ok := p.pairwiseP(bi); ok {
		return f
	}
	if f := bi.fact("p"); f != nil {
		return f
	}
	return nil
}

// pairwiseP returns the p-value of the pair of groups a sentence compares
// in a comparison of three or more groups ("mixed menus wasted more than
// cold menus"): the named group's test against the reference (GROUP.p_welch
// for means, GROUP.p_z for shares). ok is false when the sentence does not
// compare one pair; a nil fact with ok true means the pair has no test of
// its own (two groups that are neither the reference), so nothing is
// judged.
func (p *Pass) pairwiseP(bi *blockInfo) (*factInfo, bool) {
	if bi.analysis != "compare" || len(bi.dim("group")) < 3 {
		return nil, false
	}
	ref := bi.meta.Reference
	var others []*label
	refNamed := false
	seen := map[*label]bool{}
	for _, m := range p.s.mentionsOf(bi) {
		if m.l.dim != "group" || seen[m.l] {
			continue
		}
		seen[m.l] = true
		if blocks.Slug(ref) == m.l.slug {
			refNamed = true
			continue
		}
		others = append(others, m.l)
	}
	compares := p.s.has("than", "against", "versus", "vs", "compared", "better", "worse") || len(p.directionWords()) > 0
	switch {
	case len(others) == 1 && (refNamed || compares):
		for _, st := range []string{"p_welch", "p_z", "p"} {
			if f := bi.fact(others[0].slug + "." + st); f != nil {
				return f, true
			}
		}
		return nil, true
	case len(others) >= 2:
		return nil, true
	}
	return nil, false
}

func checkSignificance(p *Pass) []Finding {
	s := p.s
	alpha := p.cfg.Alpha
	kind := ""
	ph, a, b := s.findPhrase(denialPhrases)
	if ph != "" {
		kind = "denial"
	} else if ph, a, b = s.findPhrase(absencePhrases); ph != "" {
		kind = "absence"
	} else if ph, a, b = s.findPhrase(certaintyPhrases); ph != "" {
		kind = "certainty"
	} else if ph, a, b = s.findPhrase(positivePhrases); ph != "" {
		kind = "positive"
		if s.negated(a) {
			kind = "denial"
		}
	}
	if kind == "" {
		// "far less likely", "dramatically higher": a large difference
		// claimed; without support at alpha it is not shown.
		for i := 0; i+1 < len(s.toks); i++ {
			if intensifiers[s.toks[i].low] && comparatives[s.toks[i+1].low] && !s.negated(i) {
				kind, a, b, ph = "intense", i, i+2, s.toks[i].low
				break
			}
		}
	}
	if kind == "" {
		return nil
	}
	if kind == "positive" && (ph == "significant" || ph == "significantly") && s.negated(a) {
		kind = "denial"
	}
	if kind == "certainty" && s.negated(a) {
		// "does not prove": an honest caution.
		return nil
	}
	said := quote(s.tokText(a, b))
	sc := p.best(1, func(bi *blockInfo) bool { return p.testOf(bi) != nil })
	if sc == nil && kind == "intense" {
		return nil
	}
	if sc == nil {
		if kind != "positive" && kind != "certainty" {
			return nil
		}
		// "significant" always claims a test; "clearly" and the like do when
		// the sentence compares or describes a change.
		if !strings.HasPrefix(ph, "signific") && !strings.HasPrefix(ph, "statistically") && kind != "certainty" &&
			len(p.directionWords()) == 0 {
			return nil
		}
		nt := p.best(1, func(bi *blockInfo) bool {
			switch bi.analysis {
			case "summary", "frequency", "trend", "stemleaf":
				return true
			}
			return false
		})
		if nt == nil {
			return nil
		}
		return []Finding{p.atTok(Warning, a, b, nt.bi, "says %s but block %s computes no test, so nothing here supports it; "+
			"try describing the size of the change without %s, or add a compare block", said, nt.bi.id, said)}
	}
	bi := sc.bi
	pf := p.testOf(bi)
	pv := pf.val()
	pShow := "p = " + blocks.Format(pf.fact, -1)
	if pv < 0.001 {
		pShow = "p < 0.001"
	}
	effect := effectOf(bi, p)
	switch kind {
	case "positive":
		if pv >= alpha {
			return []Finding{p.atTok(Error, a, b, bi, "says %s but %s, not below alpha %s%s; try %s",
				said, pShow, trimFloat(alpha), effect, quote("a difference the data cannot tell from chance ("+pShow+")"))}
		}
		// "highly significant" claims far more than alpha: p below 0.01.
		if a > 0 && strings.HasPrefix(ph, "signific") && highlyWords[s.toks[a-1].low] && pv >= 0.01 {
			return []Finding{p.atTok(Warning, a-1, b, bi, "says %s but %s, below alpha %s yet not below 0.01%s; try %s",
				quote(s.tokText(a-1, b)), pShow, trimFloat(alpha), effect, quote("significant ("+pShow+")"))}
		}
	case "certainty":
		if pv >= alpha {
			return []Finding{p.atTok(Error, a, b, bi, "says %s but %s, not below alpha %s%s; try %s",
				said, pShow, trimFloat(alpha), effect, quote("the data do not show a difference ("+pShow+")"))}
		}
		return []Finding{p.atTok(Warning, a, b, bi, "says %s but one result (%s) proves nothing%s; try %s",
			said, pShow, effect, quote("suggests"))}
	case "intense":
		if pv >= alpha {
			return []Finding{p.atTok(Warning, a, b, bi, "says %s but %s, not below alpha %s%s; try %s",
				said, pShow, trimFloat(alpha), effect, quote("a difference the data cannot tell from chance ("+pShow+")"))}
		}
	case "denial":
		if pv < alpha {
			return []Finding{p.atTok(Error, a, b, bi, "says %s but %s, below alpha %s%s; try %s",
				said, pShow, trimFloat(alpha), effect, quote("a statistically significant difference ("+pShow+")"))}
		}
	case "absence":
		if pv < alpha {
			return []Finding{p.atTok(Error, a, b, bi, "says %s but %s, below alpha %s%s; try %s",
				said, pShow, trimFloat(alpha), effect, quote("a difference ("+pShow+")"))}
		}
		return []Finding{p.atTok(Warning, a, b, bi, "says %s but a test that finds nothing (%s) does not show there is nothing%s; try %s",
			said, pShow, effect, quote("no clear difference ("+pShow+")"))}
	}
	return nil
}

// effectOf describes the block's effect with its interval: "; the
// difference is 4.1 points (95% CI -2.0–10.2)".
func effectOf(bi *blockInfo, p *Pass) string {
	for _, st := range []string{"diff", "r", "ratio"} {
		if f := bi.fact(st); f != nil {
			lo, hi := ciOf(f)
			if ci := showCI(lo, hi); ci != "" {
				return "; " + describe(f) + " is " + showF(f) + " (" + ci + ")"
			}
		}
	}
	if bi.analysis == "regression" {
		for _, m := range p.s.mentionsOf(bi) {
			if m.l.dim == "pred" {
				if f := bi.fact(m.l.slug + ".estimate"); f != nil {
					lo, hi := ciOf(f)
					if ci := showCI(lo, hi); ci != "" {
						return "; the coefficient of " + m.l.text + " is " + showF(f) + " (" + ci + ")"
					}
				}
			}
		}
	}
	return ""
}

func trimFloat(v float64) string {
	return strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.4f", v), "0"), ".")
}
