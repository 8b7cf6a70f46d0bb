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
		`or gives a count of the group's cases that the block publishes ("only 3 members were unsatisfied"). A trend with one value ` +
		`per time point (weekly totals) is not a sample. ` +
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
			if nf == nil || nf.val() >= float64(minN) {
				continue
			}
			if m.l.dim != "group" {
				// A level's count is the claim itself ("9 chose the café"),
				// not a sample; read only groups.
				continue
			}
			n := int(math.Round(nf.val()))
			if p.statesN(n, nf) {
				continue
			}
			return []Finding{p.atTok(Warning, m.a, m.b, bi, "rests on %d cases of %s (fewer than min-n %d) and does not say so; try adding %s",
				n, m.l.text, minN, quote("(n = "+itoa(n)+")"))}
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
