package check

import (
	"math"
	"strings"

	"candor/blocks"
)

var strengthRule = &Rule{
	ID: "strength",
	Doc: `strength flags words for the strength of a correlation ("strong", "close", "moderate", "weak", "slight", "no ` +
		`correlation") against |r|, using Cohen's (1988) benchmarks: about 0.1 small, 0.3 medium, 0.5 large. "strong" needs |r| of ` +
		`at least 0.45; "moderate" 0.25 to 0.55; "weak" below 0.35; "no correlation" below 0.15. A word one band away is a warning, ` +
		`two bands away an error. The word may qualify the relation ("strongly correlated", "a strong predictor", "strongly determines") ` +
		`or be said of it ("the correlation between A and B is strong"). For a simple regression |r| is the square root of R²; for a crosstab the measure is Cramér's V ` +
		`on the same benchmarks. Words for the size of a difference ("a large effect", "a small difference") are read against ` +
		`Cohen's d where the block computes it (0.2 small, 0.5 medium, 0.8 large).`,
	Check: checkStrength,
}

// strengthWords map a word to the band it claims: 3 strong, 2 moderate, 1
// weak, 0 none, 4 perfect.
var strengthWords = map[string]int{
	"strong": 3, "strongly": 3, "close": 3, "closely": 3, "tight": 3, "tightly": 3, "substantial": 3, "powerful": 3,
	"high": 3, "highly": 3, "very": -1, "large": 3, "big": 3, "huge": 3, "marked": 3, "considerable": 3,
	"moderate": 2, "moderately": 2, "medium": 2, "reasonable": 2, "fair": 2,
	"weak": 1, "weakly": 1, "slight": 1, "slightly": 1, "modest": 1, "small": 1, "loose": 1, "loosely": 1, "faint": 1,
	"tiny": 1, "little": 1, "low": 1,
	"perfect": 4, "perfectly": 4,
	"negligible": 0, "uncorrelated": 0, "unrelated": 0,
}

var relationWords = set("correlation correlations correlated correlate correlates association associated relationship " +
	"relationships related relation link linked tracks tracked relate predictor predictors predicts predict predicted " +
	"determines determine determined depends dependent shapes influences influence influenced affects affect affected " +
	"drives drive driven")

// copulas before a strength word make it the predicate of the sentence's
// subject ("the correlation between X and Y is strong").
var copulas = set("is was are were remains remained seems seemed looks looked appears appeared proved")

var effectWords = set("effect effects difference differences gap gaps")

// benchmarks are Cohen's (1988) small, medium and large values.
type benchmarks struct {
	small, medium, large float64
	slack                float64
	name                 string
}

var (
	cohenR = benchmarks{0.1, 0.3, 0.5, 0.05, "Cohen's (1988) benchmarks for r: 0.1 small, 0.3 medium, 0.5 large"}
	cohenD = benchmarks{0.2, 0.5, 0.8, 0.1, "Cohen's (1988) benchmarks for d: 0.2 small, 0.5 medium, 0.8 large"}
	cohenW = benchmarks{0.1, 0.3, 0.5, 0.05, "Cohen's (1988) benchmarks for w, used for Cramér's V: 0.1 small, 0.3 medium, 0.5 large"}
)

// band returns the band of an absolute value: 0 none, 1 small, 2 medium, 3
// large.
func (b benchmarks) band(x float64) int {
	switch {
	case x >= b.large:
		return 3
	case x >= b.medium:
		return 2
	case x >= b.small:
		return 1
	}
	return 0
}

// judge returns 0 when the word fits, 1 when it is one band off, 2 when two
// or more.
func (b benchmarks) judge(claim int, x float64) int {
	x = math.Abs(x)
	ok := false
	switch claim {
	case 4:
		ok = x >= 0.99
		if !ok && x >= b.large {
			return 1
		}
		if !ok {
			return 2
		}
	case 3:
		ok = x >= b.large-b.slack
	case 2:
		ok = x >= b.medium-b.slack && x < b.large+b.slack
	case 1:
		ok = x < b.medium+b.slack
	case 0:
		ok = x < b.small+b.slack
	}
	if ok {
		return 0
	}
	d := claim - b.band(x)
	if d < 0 {
		d = -d
	}
	if claim == 1 && b.band(x) == 0 {
		return 0
	}
	if d >= 2 {
		return 2
	}
	return 1
}

var bandWords = map[int]string{0: "a negligible", 1: "a weak", 2: "a moderate", 3: "a strong"}

func checkStrength(p *Pass) []Finding {
	s := p.s
	// The strength word and what it qualifies.
	claim, at := -1, -1
	claim2 := -1
	relation, effect := false, false
	for i, t := range s.toks {
		if t.kind != tWord {
			continue
		}
		w, ok := strengthWords[t.low]
		if !ok || w < 0 {
			continue
		}
		// The word must qualify a relation or effect word within three words
		// after it ("a strong positive correlation", "strongly related").
		for k := i + 1; k < len(s.toks) && k <= i+4; k++ {
			if relationWords[s.toks[k].low] {
				relation = true
			}
			if effectWords[s.toks[k].low] {
				effect = true
			}
			if relation || effect {
				break
			}
		}
		if !relation && !effect && (t.low == "unrelated" || t.low == "uncorrelated") {
			relation = true
		}
		// "correlated strongly", "correlation was weak"; "the correlation
		// between the number of medicines and lateness is strong": the
		// subject of a predicate, however long.
		if !relation && !effect {
			from := i - 7
			if k := i - 1; k >= 0 && (copulas[s.toks[k].low] || (k > 0 && copulas[s.toks[k-1].low] && (s.toks[k].low == "very" || s.toks[k].low == "quite" || s.toks[k].low == "fairly" || s.toks[k].low == "only"))) {
				from = 0
				for m := i - 1; m >= 0; m-- {
					if strings.Contains(";:", s.toks[m].text) {
						from = m + 1
						break
					}
				}
			}
			for k := i - 1; k >= 0 && k >= from; k-- {
				if relationWords[s.toks[k].low] {
					relation = true
				}
				if effectWords[s.toks[k].low] {
					effect = true
				}
			}
		}
		if relation || effect {
			claim, at = w, i
			if s.negated(i) && w != 0 {
				return nil
			}
			// "weakly to moderately": either word.
			if n := low(s.toks, i+1); n == "to" || n == "-" || n == "or" || n == "–" {
				if w2, ok := strengthWords[low(s.toks, i+2)]; ok && w2 >= 0 {
					claim2 = w2
				}
			}
			break
		}
	}
	if claim < 0 {
		if a, b, ok := s.hasNoRelation(); ok {
			claim, at, relation = 0, a, true
			_ = b
		} else {
			return nil
		}
	}
	if relation {
		sc := p.best(1, func(bi *blockInfo) bool {
			return bi.analysis == "correlation" || (bi.analysis == "regression" && bi.fact("r2") != nil) ||
				(bi.analysis == "crosstab" && bi.fact("v") != nil) || bi.fact("r") != nil
		})
		if sc == nil {
			return nil
		}
		bi := sc.bi
		var x float64
		var what string
		bm := cohenR
		switch {
		case bi.fact("r") != nil:
			r := bi.fact("r")
			x = r.val()
			what = "r = " + withCI(r, bi.fact("r_low"), bi.fact("r_high"))
		case bi.analysis == "crosstab":
			x = bi.fact("v").val()
			what = "Cramér's V = " + showF(bi.fact("v"))
			bm = cohenW
		default:
			x = math.Sqrt(math.Max(0, bi.fact("r2").val()))
			what = "R² = " + showF(bi.fact("r2")) + ", so |r| = " + blocks.Sig(x, 2)
		}
		if claim == 0 {
			// "no correlation" with a significant r is also the
			// significance rule's; here only the size counts.
		}
		j := bm.judge(claim, x)
		if j == 0 || (claim2 >= 0 && bm.judge(claim2, x) == 0) {
			return nil
		}
		sev := Warning
		if j == 2 {
			sev = Error
		}
		dir := ""
		if x > 0 && bm.name == cohenR.name {
			dir = " positive"
		} else if x < 0 {
			dir = " negative"
		}
		try := bandWords[bm.band(math.Abs(x))] + dir + " correlation"
		if bm.name == cohenW.name {
			try = bandWords[bm.band(math.Abs(x))] + " association"
		}
		return []Finding{p.atTok(sev, at, at+1, bi, "says %s but %s, %s relationship by %s; try %s",
			quote(s.toks[at].text), what, strings.TrimPrefix(bandWords[bm.band(math.Abs(x))], "a "), bm.name, quote(try))}
	}
	// Effect sizes: Cohen's d.
	sc := p.best(1, func(bi *blockInfo) bool { return bi.fact("d") != nil })
	if sc == nil || claim == 4 {
		return nil
	}
	d := sc.bi.fact("d")
	j := cohenD.judge(claim, d.val())
	if j == 0 || (claim2 >= 0 && cohenD.judge(claim2, d.val()) == 0) {
		return nil
	}
	sev := Warning
	if j == 2 {
		sev = Error
	}
	size := map[int]string{0: "a negligible", 1: "a small", 2: "a medium", 3: "a large"}[cohenD.band(math.Abs(d.val()))]
	return []Finding{p.atTok(sev, at, at+1, sc.bi, "says %s but Cohen's d is %s, %s effect by %s; try %s",
		quote(s.toks[at].text), showF(d), strings.TrimPrefix(size, "a "), cohenD.name, quote(size+" difference"))}
}

// hasNoRelation finds "no correlation", "no relationship", "not related".
func (s *sentence) hasNoRelation() (int, int, bool) {
	for _, ph := range []string{"no correlation", "no relationship", "not correlated", "not related", "no association",
		"no link", "no real relationship", "no meaningful relationship", "no meaningful correlation"} {
		if a, b, ok := s.hasPhrase(ph); ok {
			return a, b, true
		}
	}
	return 0, 0, false
}
