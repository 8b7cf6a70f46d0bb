package check

import "strings"

var causalRule = &Rule{
	ID: "causal",
	Doc: `causal flags causal wording ("causes", "drives", "leads to", "results in", "because of", "due to", "thanks to", "the ` +
		`effect of", "the impact of", "determines", "shapes", a transitive "raised", "reduced", "cut", "boosted", "improved", ` +
		`"doubled" with an object, "keeps", "gets" or "brings" with an object and where it puts them ("keeps volunteers in the ` +
		`network", "gets people on their bikes", "keeps trees healthy"), "the X effect" for a variable X, and "because" giving the ` +
		`reason for a comparison) in a sentence tied to ` +
		`a block ("is the reason", "is why" too), when the report's design is observational (check: design, the default). With design: randomized, causal wording ` +
		`about a compare block is allowed; about a correlation, regression, trend or crosstab it is still flagged, since the ` +
		`randomization was of the compared groups. Hedged speculation ("may be due to", "could reflect", "whether") and negations ` +
		`are not flagged, nor words of a group's name ("raised beds"), effect sizes ("the effect was small, d = 0.1") or a recorded ` +
		`reason that is a level of a frequency ("late due to traffic"); an effect named by its cause ("the promotion effect") is causal ` +
		`with an effect size too. A sentence of a section without blocks (a list of key points) is read against the blocks whose ` +
		`columns or groups it names. Severity warning: the data do not support the claim, they do not contradict it.`,
	Check: checkCausal,
}

// causalPhrases say that one thing made another happen.
var causalPhrases = []string{"is the reason", "was the reason", "the reason why", "is why", "was why", "the cause of",
	"as a result of", "because of", "due to", "owing to", "thanks to", "attributable to", "attributed to",
	"responsible for", "leads to", "led to", "lead to", "leading to", "results in", "resulted in", "result in", "resulting in",
	"contributes to", "contributed to", "contributing to", "the effect of", "the effects of", "effect of", "effect on", "effects on",
	"an effect on", "the impact of", "impact of", "impact on", "impacts", "impacted", "causes", "caused", "causing", "cause",
	"drives", "drive", "drove", "driven by", "driving", "driver of", "drivers of", "produces", "produced", "triggers", "triggered",
	"affects", "affected", "influences", "influenced", "helped", "helps", "prevents", "prevented", "encourages", "encouraged",
	"explains why", "determines", "determine", "determined by", "shapes", "shaped by", "dictates", "dictated by"}

// causalVerbs are causal only with an object ("tutoring raised scores",
// not "scores raised by 4 points" or "loans increased in March").
var causalVerbs = set("raises raised boosts boosted lifts lifted cuts cut reduces reduced lowers lowered improves improved " +
	"increases increased decreases decreased doubles doubled halves halved shortens shortened lengthens lengthened " +
	"grows accelerates accelerated slows slowed worsens worsened")

// moveVerbs are causal with an object and a particle: "gets people on their
// bikes", "keeps volunteers in the network", "brings customers back".
var moveVerbs = set("gets get got getting keeps keep kept keeping brings bring brought bringing sends send pushes push pushed " +
	"pulls pull pulled stops stopped turns turned")

// moveParticles end the object of a moveVerb.
var moveParticles = set("on onto in into back out off away to from down up through over past home going coming moving returning " +
	"active engaged involved")

// complements after "keeps X" say what state it keeps them in ("keeps
// trees healthy", "kept volunteers loyal").
var complements = set("healthy happy busy active safe loyal engaged involved satisfied fit dry warm cool low high open " +
	"longer shorter lower higher fewer more alive well productive interested motivated")

// notObject are the words after a verb that show it has no object.
var notObject = set("by from to in on at over during for after before since between across among and or but than again " +
	"further more less most least steadily sharply slightly markedly a bit somewhat overall only just still also this that " +
	"with as if when while each every per year month week quarter")

var notAfterMake = set("no any the a an their its his her our more most fewer less up sure sense use it clear do good way room time progress plans plan changes change decisions decision " +
	"contact calls call visits visit trips trip purchases purchase payments payment orders order loans loan claims claim")

// adjComparatives after "got" or "kept" describe a change ("got faster"),
// not an object.
var adjComparatives = set("better worse faster quicker slower busier quieter later earlier cheaper dearer easier harder " +
	"stronger weaker safer riskier bigger smaller larger longer shorter higher lower worse fewer more less")

// analystWords before "determine" make it the analyst's verb.
var analystWords = set("to we i you can cannot could not will would should")

var determiners = set("a an the this that these those its their our any no some each every main")

var speculation = set("may might could possibly perhaps probably likely maybe partly whether unclear unknown cannot can't " +
	"speculate speculative suggest suggests hypothesis")

func checkCausal(p *Pass) []Finding {
	s := p.s
	if strings.HasSuffix(strings.TrimSpace(s.text), "?") {
		return nil
	}
	a, b := -1, -1
	for _, ph := range causalPhrases {
		if i, j, ok := s.hasPhrase(ph); ok {
			if ph == "cause" && (low(s.toks, j) == "for" || low(s.toks, j) == "of" || i == 0 || determiners[low(s.toks, i-1)]) {
				continue
			}
			if ph == "drive" && (i == 0 || determiners[low(s.toks, i-1)]) {
				continue
			}
			if ph == "determine" && (i == 0 || analystWords[low(s.toks, i-1)]) {
				continue // "to determine", "we cannot determine": the analyst's work
			}
			if ph == "effect of" || ph == "effect on" || ph == "effects on" {
				if i > 0 && (s.toks[i-1].low == "side" || s.toks[i-1].low == "in") {
					continue
				}
			}
			a, b = i, j
			break
		}
	}
	if a < 0 {
		for i, t := range s.toks {
			if t.kind != tWord || !causalVerbs[t.low] || i == 0 {
				continue
			}
			if i+1 >= len(s.toks) {
				continue
			}
			if determiners[low(s.toks, i-1)] {
				continue // "a cut in fees": a noun
			}
			n := s.toks[i+1]
			// "doubled on-time refills": a compound modifier starts the object.
			compound := n.kind == tWord && i+3 < len(s.toks) && s.toks[i+2].text == "-" && attached(s.toks, i+2) && attached(s.toks, i+3)
			if n.kind != tWord || (notObject[n.low] && !compound) || strings.HasSuffix(n.low, "ly") {
				continue
			}
			if n.low == "its" {
				continue // "Kelp Bay cut its delay": its own figure changed, nothing caused it
			}
			// "increased the share": an object; "increased significantly": no.
			a, b = i, i+1
			break
		}
	}
	if a < 0 {
		// "gets people on their bikes", "keeps volunteers in the network".
		for i, t := range s.toks {
			if t.kind != tWord || !moveVerbs[t.low] || i == 0 || determiners[low(s.toks, i-1)] {
				continue
			}
			// "kept their places": the subject's own, nothing caused.
			if pos := low(s.toks, i+1); pos == "their" || pos == "its" || pos == "his" || pos == "her" || pos == "our" {
				continue
			}
			obj := i + 1
			for obj < len(s.toks) && determiners[s.toks[obj].low] {
				obj++
			}
			n := low(s.toks, obj)
			if n == "" || notObject[n] || notAfterMake[n] || (obj < len(s.toks) && s.toks[obj].kind != tWord) ||
				comparatives[n] || adjComparatives[n] || n == "records" || n == "track" || n == "count" || moveParticles[n] {
				continue
			}
			for k := obj + 1; k < len(s.toks) && k <= obj+3; k++ {
				if s.toks[k].kind != tWord {
					break
				}
				w := s.toks[k].low
				// "gets people cycling", "keeps trees healthy": a particle, a
				// verb in -ing, or a state.
				if moveParticles[w] || (strings.HasSuffix(w, "ing") && len(w) > 4) || complements[w] {
					a, b = i, k+1
					break
				}
			}
			if a >= 0 {
				break
			}
		}
	}
	if a < 0 {
		// "because they enjoy the work": a reason given for a finding.
		if i, _, ok := s.hasPhrase("because"); ok && i > 0 && !s.anySpeculation() && p.claimBefore(i) && s.toks[i-1].kind == tWord {
			a, b = i, i+1
		}
	}
	nounAdjunct := false
	if a < 0 {
		// "the temperature effect", "the promotion effect": a cause named
		// before "effect".
		for i, t := range s.toks {
			if (t.low != "effect" && t.low != "effects" && t.low != "impact") || i == 0 || low(s.toks, i+1) == "size" || low(s.toks, i+1) == "sizes" {
				continue
			}
			prev := s.toks[i-1]
			if prev.kind != tWord || stopWords[prev.low] || !p.namesBlockWord(i-1) {
				continue
			}
			a, b = i-1, i+1
			nounAdjunct = true
			break
		}
	}
	if a < 0 {
		// "loyalty cards make customers come back", "made members renew".
		for i, t := range s.toks {
			switch t.low {
			case "make", "makes", "made", "making":
			default:
				continue
			}
			n := low(s.toks, i+1)
			if i == 0 || n == "" || notAfterMake[n] || notObject[n] || (i+1 < len(s.toks) && s.toks[i+1].kind != tWord) {
				continue
			}
			if q := s.quantityAt(i + 1); q != nil || (i+2 < len(s.toks) && s.quantityAt(i+2) != nil) {
				continue // "made about 2 more trips": an amount, not a cause
			}
			if _, k := hedgeBefore(s.toks, i+2); k < i+2 {
				continue
			}
			a, b = i, i+2
			break
		}
	}
	if a < 0 {
		return nil
	}
	// A word of a group's or level's name ("raised beds") is no verb.
	for _, sc := range p.scope {
		for _, m := range s.mentionsOf(sc.bi) {
			if a >= m.a && a < m.b && !nounAdjunct {
				return nil
			}
		}
	}
	// "late due to a wrong address": the recorded reason, a level of a
	// frequency, describes the category; it infers nothing.
	for _, sc := range p.scope {
		if sc.bi.analysis != "frequency" {
			continue
		}
		for _, m := range s.mentionsOf(sc.bi) {
			if m.a >= b && m.a <= b+3 {
				return nil
			}
		}
	}
	// Effect sizes are statistics, not causes ("the effect on weight was
	// small, d = 0.11").
	if !nounAdjunct && strings.HasPrefix(s.toks[a].low, "effect") && (s.has("size", "cohen's", "d") || hasStat(s, "d")) {
		return nil
	}
	for k := a - 1; k >= 0 && k >= a-4; k-- {
		if speculation[s.toks[k].low] {
			return nil
		}
	}
	for k := a - 1; k >= 0 && k >= a-4 && s.clause[k] == s.clause[a]; k-- {
		if negations[s.toks[k].low] {
			return nil // "not a measured effect of", "no effect on"
		}
	}
	if s.negated(a) || s.has("whether", "not necessarily", "cannot", "can't") {
		return nil
	}
	if _, _, ok := s.hasPhrase("rather than"); ok {
		return nil
	}
	sc := p.best(1, nil)
	if sc == nil {
		return nil
	}
	bi := sc.bi
	if p.cfg.Design == "randomized" && bi.analysis == "compare" {
		return nil
	}
	what := "an observational design"
	if p.cfg.Design == "randomized" {
		what = "a " + bi.analysis + " block (the randomization covers compare blocks only)"
	}
	try := "was associated with"
	switch bi.analysis {
	case "correlation", "regression":
		try = "went together with"
	case "trend":
		try = "coincided with"
	}
	return []Finding{p.atTok(Warning, a, b, bi, "says %s, a causal claim, but block %s rests on %s, which shows association, not cause; try %s",
		quote(s.tokText(a, b)), bi.id, what, quote(try))}
}

func hasStat(s *sentence, stat string) bool {
	for _, q := range s.qs {
		if q.stat == stat {
			return true
		}
	}
	for _, r := range s.refs {
		if strings.HasSuffix(r, "."+stat) {
			return true
		}
	}
	return false
}

// anySpeculation reports whether the sentence hedges anywhere ("the gap may
// partly reflect who opted in").
func (s *sentence) anySpeculation() bool {
	for _, t := range s.toks {
		if speculation[t.low] {
			return true
		}
	}
	return false
}

// claimBefore reports whether the sentence claims a finding before token i:
// a direction or comparison word, or a figure.
func (p *Pass) claimBefore(i int) bool {
	s := p.s
	c := s.clause[i]
	for _, w := range p.directionWords() {
		if w.i < i && s.clause[w.i] == c {
			return true
		}
	}
	for k := 0; k < i; k++ {
		if (comparatives[s.toks[k].low] || s.toks[k].low == "better" || s.toks[k].low == "worse") && s.clause[k] == c {
			return true
		}
	}
	for _, q := range s.qs {
		if q.claim() && q.tok < i && s.clause[q.tok] == c {
			return true
		}
	}
	return false
}

// namesBlockWord reports whether token i is a word of a block in scope: a
// column or id word, or part of a label.
func (p *Pass) namesBlockWord(i int) bool {
	s := p.s
	t := s.toks[i]
	for _, sc := range p.scope {
		if sc.bi.vocab[t.stem] {
			return true
		}
		for _, m := range s.mentionsOf(sc.bi) {
			if i >= m.a && i < m.b {
				return true
			}
		}
		for _, c := range append(append([]string{}, sc.bi.meta.Columns...), sc.bi.meta.Predictors...) {
			for _, w := range splitWords(c) {
				if sameWord(t.stem, "~"+stem(w)) {
					return true
				}
			}
		}
	}
	return false
}
