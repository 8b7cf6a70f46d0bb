package check

import "strings"

// sentence is one sentence of a unit with what the extractor read in it.
type sentence struct {
	unit       *Unit
	ut         *unitText
	start, end int // in the unit text
	text       string
	toks       []token
	qs         []*quantity
	refs       []string // the facts of its inline values
	clause     []int    // clause number of each token
	first      bool     // the unit's first sentence
	heads      []string // a table row's header cells, by cell
	mentions   map[*blockInfo][]mention
}

// sentences splits a unit into sentences and extracts their claims.
func sentences(u *Unit, ut *unitText) []*sentence {
	var out []*sentence
	for k, sp := range splitSentences(ut.text) {
		s := &sentence{unit: u, ut: ut, start: sp[0], end: sp[1], text: ut.text[sp[0]:sp[1]], first: k == 0,
			mentions: map[*blockInfo][]mention{}}
		s.toks = tokenize(ut.text, sp[0], sp[1], ut.refAt)
		s.qs = extract(s.toks, s.first)
		seen := map[string]bool{}
		for _, t := range s.toks {
			if t.ref != "" && !seen[t.ref] {
				seen[t.ref] = true
				s.refs = append(s.refs, t.ref)
			}
		}
		s.clause = clauses(s.toks)
		out = append(out, s)
	}
	return out
}

// clauses numbers the clauses of a sentence: a comma, semicolon, colon,
// bracket or dash, or a word like "and", "but", "while", "than", starts a
// new one.
func clauses(toks []token) []int {
	out := make([]int, len(toks))
	c := 0
	for i, t := range toks {
		switch {
		case t.kind == tPunct && strings.Contains(",;:()[]—", t.text):
			c++
		case t.kind == tPunct && t.text == "|":
			c++
		case t.kind == tPunct && t.text == "–" && t.space:
			c++
		case t.kind == tWord && clauseWords[t.low]:
			c++
		}
		out[i] = c
	}
	return out
}

func (s *sentence) mentionsOf(bi *blockInfo) []mention {
	if m, ok := s.mentions[bi]; ok {
		return m
	}
	m := findMentions(s, bi)
	s.mentions[bi] = m
	return m
}

// srcStart is the source offset where the sentence starts.
func (s *sentence) srcStart() int { return s.ut.src(s.start, false) }

// has reports whether the sentence has one of the words (lower case).
func (s *sentence) has(words ...string) bool {
	for _, t := range s.toks {
		if t.kind != tWord {
			continue
		}
		for _, w := range words {
			if t.low == w {
				return true
			}
		}
	}
	return false
}

// hasPhrase reports whether the sentence has the phrase (words separated by
// single spaces) and returns the token range.
func (s *sentence) hasPhrase(phrase string) (int, int, bool) {
	ws := strings.Fields(phrase)
	for i := range s.toks {
		k := i
		ok := true
		for _, w := range ws {
			for k < len(s.toks) && (s.toks[k].text == "-" && w != "-") {
				k++
			}
			if k >= len(s.toks) || (s.toks[k].low != w && !(strings.HasSuffix(w, "*") && strings.HasPrefix(s.toks[k].low, strings.TrimSuffix(w, "*")))) {
				ok = false
				break
			}
			k++
		}
		if ok {
			return i, k, true
		}
	}
	return 0, 0, false
}

// negated reports whether toks[i] is negated: a negation right before it,
// or before an auxiliary or adverb that stands before it ("did not rise",
// "not significantly higher", "has not risen", "no longer rising").
func (s *sentence) negated(i int) bool {
	k := i - 1
	for steps := 0; k >= 0 && steps < 2; steps++ {
		w := s.toks[k].low
		if w == "been" || w == "be" || w == "much" || w == "any" || w == "yet" || w == "really" || w == "even" ||
			w == "significantly" || w == "statistically" || w == "always" || w == "longer" || w == "clearly" ||
			w == "have" || w == "has" || w == "did" || w == "do" || w == "does" || w == "was" || w == "were" || w == "is" || w == "are" ||
			(strings.HasSuffix(w, "ly") && len(w) > 4) {
			k--
			continue
		}
		break
	}
	if k < 0 {
		return false
	}
	t := s.toks[k]
	if (t.low == "failed" || t.low == "fail" || t.low == "fails") && low(s.toks, k+1) != "to" {
		return false // "failed more often": the outcome, not "failed to rise"
	}
	return negations[t.low] || strings.HasSuffix(t.low, "n't") || strings.HasSuffix(t.low, "n’t")
}

// tokText returns the text of tokens [a, b).
func (s *sentence) tokText(a, b int) string {
	if a < 0 || b > len(s.toks) || a >= b {
		return ""
	}
	return strings.Join(strings.Fields(s.ut.text[s.toks[a].start:s.toks[b-1].end]), " ")
}

// quantityAt returns the quantity whose tokens include toks[i], or nil.
func (s *sentence) quantityAt(i int) *quantity {
	for _, q := range s.qs {
		if i >= q.tok && i < q.tokEnd {
			return q
		}
	}
	return nil
}

// cellOf returns the index of the table cell token i stands in (the row's
// cells are joined by "|").
func (s *sentence) cellOf(i int) int {
	n := 0
	for k := 0; k < i && k < len(s.toks); k++ {
		if s.toks[k].text == "|" {
			n++
		}
	}
	return n
}

// headStat returns the statistic the header of the quantity's table column
// names ("Mean waste (kg)" a mean, "Median" a median; "Days", "Sessions", "n"
// over whole numbers a count of cases), or "".
func (s *sentence) headStat(q *quantity) string {
	if len(s.heads) == 0 {
		return ""
	}
	c := s.cellOf(q.tok)
	if c >= len(s.heads) || c == 0 {
		return ""
	}
	ws := splitWords(s.heads[c])
	for _, w := range ws {
		if st, ok := statWords[w]; ok && st != "predict" && st != "estimate" {
			return st
		}
	}
	for _, w := range ws {
		switch w {
		case "n", "count", "number", "cases", "total":
			return "n"
		}
	}
	// A plain plural noun over a whole number ("Days", "Sessions"): how many
	// cases the row's group holds.
	if len(ws) == 1 && strings.HasSuffix(ws[0], "s") && !strings.HasSuffix(ws[0], "ss") && q.unit == uNone && q.cur == "" &&
		q.val == float64(int64(q.val)) && !measureNouns[ws[0]] {
		return "n"
	}
	return ""
}
