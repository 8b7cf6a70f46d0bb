package check

import (
	"math"
	"strings"

	"candor/blocks"
)

var sampleRule = &Rule{
	ID: "sample",
	Doc: `sample flags a claim that rests on fewer cases than the report's min-n (check: min-n, default 30) and does not state its ` +
		`n. A claim is a figure, an inline value or a word of direction, comparison, significance, strength or quantity in a sentence ` +
		`tied to the block; it rests on a group when it names the group (its GROUP.n) and on the block otherwise (its n). The n is ` +
		`stated when the sentence or the one before it says "n = 9", shows an inline value of that n, gives the count itself ("9 members"), ` +
		`or gives a count of the group's cases that the block publishes ("only 3 members were unsatisfied"). A claim that compares a trend's time points ` +
		`rests on the cases of each (TIME.n, or GROUP.TIME.n for the groups it names), however large the block. A trend with one ` +
		`value per time point (weekly totals) is not a sample. The n of a block is stated when its groups' n are ("all 4 untrained ` +
		`volunteers, and 13 of the 14 trained ones"). ` +
		`Severity warning.`,
	Check: checkSample,
}

func checkSample(p *Pass) []Finding {
	s := p.s
	minN := p.cfg.MinN
	if !p.makesClaim() {
		return nil
	}
	for _, sc := range p.scope {
		if sc.score < 1 {
			continue
		}
		bi := sc.bi
		if bi.analysis == "stemleaf" {
			continue
		}
		// Groups the sentence names.
		for _, m := range s.mentionsOf(bi) {
			if m.l.dim != "group" && m.l.dim != "level" && m.l.dim != "row" {
				continue
			}
			nf := bi.fact(m.l.slug + ".n")
			if m.l.dim != "group" {
				nf = bi.fact(m.l.slug + ".count")
			}
			if m.l.dim == "row" && bi.analysis == "crosstab" {
				// "Of the weekend riders, 60% were satisfied": the row's cases.
				nf = bi.fact(m.l.slug + ".total")
			}
			if nf == nil || nf.val() >= float64(minN) {
				continue
			}
			if m.l.dim != "group" && !(m.l.dim == "row" && bi.analysis == "crosstab" && p.rowShareClaim(bi, m.l)) {
				// A level's count is the claim itself ("9 chose the café"),
				// not a sample; read only groups and a crosstab's row shares.
				continue
			}
			n := int(math.Round(nf.val()))
			if p.statesN(n, nf) {
				continue
			}
			return []Finding{p.atTok(Warning, m.a, m.b, bi, "rests on %d cases of %s (fewer than min-n %d) and does not say so; try adding %s",
				n, m.l.name(), minN, quote("(n = "+itoa(n)+")"))}
		}
		if f, ok := p.timePointSample(bi); ok {
			return []Finding{f}
		}
		n := bi.n()
		if n <= 0 || n >= minN || !p.claimOn(bi) || onePerPoint(bi) {
			continue
		}
		if p.statesN(n, bi.fact("n")) {
			continue
		}
		a, b := p.claimSpan(bi)
		return []Finding{p.at(Warning, a, b, bi, "rests on the %d cases of block %s (fewer than min-n %d) and does not say so; try adding %s",
			n, bi.id, minN, quote("(n = "+itoa(n)+")"))}
	}
	return nil
}

func itoa(n int) string {
	if n < 0 {
		return "-" + itoa(-n)
	}
	if n < 10 {
		return string(rune('0' + n))
	}
	return itoa(n/10) + string(rune('0'+n%10))
}

// makesClaim reports whether the sentence claims anything: a figure, an
// inline value or a claim word.
func (p *Pass) makesClaim() bool {
	s := p.s
	for _, q := range s.qs {
		if q.claim() {
			return true
		}
	}
	if len(s.refs) > 0 {
		return true
	}
	if len(p.directionWords()) > 0 {
		return true
	}
	for _, qp := range quantPhrases {
		if _, _, ok := s.hasPhrase(qp.phrase); ok && qp.phrase != "all" && qp.phrase != "every" {
			return true
		}
	}
	for _, list := range [][]string{positivePhrases, certaintyPhrases, absencePhrases} {
		if ph, _, _ := s.findPhrase(list); ph != "" {
			return true
		}
	}
	return false
}

// claimOn reports whether the sentence's claim is about the block: an inline
// value of it, a figure bound to its facts, or a claim word with a strong
// link.
func (p *Pass) claimOn(bi *blockInfo) bool {
	s := p.s
	for _, r := range s.refs {
		if strings.HasPrefix(r, bi.id+".") {
			return true
		}
	}
	for _, q := range s.qs {
		if !q.claim() || q.ref != "" {
			continue
		}
		b := p.bindLevel(q)
		if b.match != nil && b.match.f.block == bi && b.match.f.stat != "n" {
			return true
		}
	}
	return linkScore(s, bi) >= 2 && (len(p.directionWords()) > 0 || p.hasClaimWord())
}

func (p *Pass) hasClaimWord() bool {
	for _, list := range [][]string{positivePhrases, certaintyPhrases, absencePhrases} {
		if ph, _, _ := p.s.findPhrase(list); ph != "" {
			return true
		}
	}
	for _, t := range p.s.toks {
		if _, ok := strengthWords[t.low]; ok {
			return true
		}
	}
	return false
}

// claimSpan is where to report a claim about the block: its first figure or
// inline value, or the whole sentence.
func (p *Pass) claimSpan(bi *blockInfo) (int, int) {
	s := p.s
	for _, q := range s.qs {
		if q.claim() {
			return q.start, q.end
		}
	}
	return s.start, s.end
}

// statesN reports whether the sentence, or the one before it in its
// paragraph, states the n: "n = 9", an inline value of the n fact, or the
// count itself.
func (p *Pass) statesN(n int, nf *factInfo) bool {
	var near []*sentence
	for i, s := range p.unit {
		if s == p.s {
			near = append(near, s)
			if i > 0 {
				near = append(near, p.unit[i-1])
			}
		}
	}
	// The block's n stated group by group ("all 4 untrained volunteers
	// stayed, and 13 of the 14 trained ones").
	if nf != nil && len(nf.quals) == 0 {
		if gs := nf.block.dim("group"); len(gs) > 1 {
			all := true
			for _, g := range gs {
				gn := nf.block.fact(g.slug + ".n")
				if gn == nil {
					all = false
					break
				}
				found := false
				for _, s := range near {
					for _, q := range s.qs {
						if q.ref == gn.name || (q.ref == "" && q.unit == uNone && q.val == gn.val()) {
							found = true
						}
					}
				}
				if !found {
					all = false
					break
				}
			}
			if all {
				return true
			}
		}
	}
	for _, s := range near {
		for _, q := range s.qs {
			// A count of the block's own ("only 3 members", "11 raised
			// beds") shows the reader how few cases there are.
			if q.claim() && q.ref == "" && q.unit == uNone && nf != nil {
				for _, c := range p.bindIn(s, q).all {
					if c.f.block == nf.block && c.f.fact.Kind == blocks.Count && (len(nf.quals) == 0 || hasQual(c.f, nf.quals[0])) {
						return true
					}
				}
			}
			if q.ref != "" && nf != nil && q.ref == nf.name {
				return true
			}
			if q.stat == "n" || (q.unit == uNone && q.skip == "" && q.val == float64(n)) {
				return true
			}
			if q.skip != "" && q.val == float64(n) && q.skip != "year" {
				return true
			}
		}
		for _, r := range s.refs {
			if nf != nil && r == nf.name {
				return true
			}
			if strings.HasSuffix(r, ".n") && nf != nil && strings.HasPrefix(r, nf.block.id+".") {
				return true
			}
		}
	}
	return false
}

// onePerPoint reports whether a trend holds one value per time point (weekly
// totals, say): its n counts time points, not a sample of cases.
func onePerPoint(bi *blockInfo) bool {
	if bi.analysis != "trend" {
		return false
	}
	seen := false
	for _, f := range bi.facts {
		if f.stat != "n" || len(f.quals) == 0 {
			continue
		}
		seen = true
		if f.ok() && f.val() > 1 {
			return false
		}
	}
	return seen
}

// bindIn binds a quantity of another sentence of the paragraph, in that
// sentence.
func (p *Pass) bindIn(s *sentence, q *quantity) levelBinding {
	if s == p.s {
		return p.bindLevel(q)
	}
	cur, scope := p.s, p.scope
	p.s = s
	p.scope = p.scopeOf(s)
	b := p.bindLevel(q)
	p.s, p.scope = cur, scope
	return b
}

func hasQual(f *factInfo, q string) bool {
	for _, x := range f.quals {
		if x == q {
			return true
		}
	}
	return false
}

// timePointSample judges a claim about a trend's time points ("ratings rose
// from 4.04 to 4.13 over the four months"): it rests on the cases of each
// time point it compares (TIME.n, or GROUP.TIME.n for a named group), which
// may be few in a large block.
func (p *Pass) timePointSample(bi *blockInfo) (Finding, bool) {
	s := p.s
	minN := p.cfg.MinN
	if bi.analysis != "trend" || onePerPoint(bi) {
		return Finding{}, false
	}
	times := bi.dim("time")
	if len(times) < 2 {
		return Finding{}, false
	}
	var named []*label
	var groups []*label
	seen := map[*label]bool{}
	for _, m := range s.mentionsOf(bi) {
		switch m.l.dim {
		case "time":
			named = append(named, m.l)
		case "group":
			if !seen[m.l] {
				seen[m.l] = true
				groups = append(groups, m.l)
			}
		}
	}
	change := false
	for _, w := range p.directionWords() {
		if w.kind == "change" {
			change = true
		}
	}
	if !change {
		// "In June, 9 of the Vale's sessions drew over 10 helpers": a figure
		// of one time point rests on that point's cases.
		named = nil
		for _, q := range s.qs {
			if !q.claim() || q.ref != "" {
				continue
			}
			f := p.bindLevel(q).matchIn(bi)
			if f == nil {
				continue
			}
			for _, qu := range f.quals {
				if l := bi.labelOf("time", qu); l != nil {
					named = append(named, l)
				}
			}
		}
		for _, r := range s.refs {
			if f := p.refFact(r); f != nil && f.block == bi {
				for _, qu := range f.quals {
					if l := bi.labelOf("time", qu); l != nil {
						named = append(named, l)
					}
				}
			}
		}
		if len(named) == 0 {
			return Finding{}, false
		}
	}
	if len(named) == 0 {
		named = []*label{times[0], times[len(times)-1]}
	}
	if len(bi.dim("group")) > 0 && len(groups) == 0 {
		return Finding{}, false
	}
	if len(groups) == 0 {
		groups = []*label{nil}
	}
	var small []string
	var ns []int
	var group *label
	for _, g := range groups {
		for _, t := range named {
			name := t.slug + ".n"
			if g != nil {
				name = g.slug + "." + name
			}
			f := bi.fact(name)
			if f == nil {
				return Finding{}, false
			}
			n := int(math.Round(f.val()))
			if n >= minN || p.statesN(n, f) {
				continue
			}
			small = append(small, t.text)
			ns = append(ns, n)
		}
		if len(small) > 0 {
			group = g
			break
		}
	}
	if len(small) == 0 {
		return Finding{}, false
	}
	var parts []string
	for k := range small {
		parts = append(parts, itoa(ns[k])+" in "+small[k])
	}
	who := ""
	if group != nil {
		who = " of " + group.name()
	}
	a, b := p.claimSpan(bi)
	what := "compares time points" + who + " that rest"
	if !change {
		what = "cites a time point" + who + " that rests"
	}
	return p.at(Warning, a, b, bi, "%s on few cases (%s; fewer than min-n %d) and does not say so; try adding %s",
		what, strings.Join(parts, ", "), minN, quote("(n = "+itoa(ns[0])+")")), true
}

// rowShareClaim reports whether the sentence states a share within a
// crosstab row (its figure binds to ROW.COL.row_pct, or it uses a
// quantifier about the row).
func (p *Pass) rowShareClaim(bi *blockInfo, row *label) bool {
	for _, q := range p.s.qs {
		if !q.claim() || q.unit != uPercent {
			continue
		}
		if f := p.bindLevel(q).matchIn(bi); f != nil && f.stat == "row_pct" && hasQual(f, row.slug) {
			return true
		}
	}
	for _, r := range p.s.refs {
		if f := p.refFact(r); f != nil && f.block == bi && f.stat == "row_pct" && hasQual(f, row.slug) {
			return true
		}
	}
	return false
}
