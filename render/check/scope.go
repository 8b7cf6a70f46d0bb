package check

import (
	"math"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"unicode"

	"candor/blocks"
	"candor/figures"
)

// blockInfo is a block as the rules read it: its facts split into
// qualifiers and statistic, its labels (groups, levels, time points,
// predictors) and the words that tie a sentence to it.
type blockInfo struct {
	b        *Block
	id       string
	res      *blocks.Result
	meta     blocks.Meta
	analysis string
	off      int // source offset of the opening fence
	facts    []*factInfo
	byLocal  map[string]*factInfo
	labels   []*label
	bySlug   map[string][]*label
	vocab    map[string]bool // stems of the block's id and column names
	figure   *figures.Spec
	geometry *figures.Geometry
}

// factInfo is one fact with its name split: "renewals.annual.pct" has the
// qualifier "annual" and the statistic "pct".
type factInfo struct {
	name  string // "ID.NAME"
	local string // "NAME"
	fact  blocks.Fact
	stat  string
	quals []string
	block *blockInfo
}

func (f *factInfo) val() float64 { return f.fact.Value }
func (f *factInfo) ok() bool     { return f != nil && f.fact.Defined() && !math.IsNaN(f.fact.Value) }

// label is a group, level, time point or predictor name.
type label struct {
	dim   string // "group", "level", "col", "time", "pred"
	text  string
	slug  string
	words []string   // stems of its significant words
	alts  [][]string // other ways to write it ("2026-01" is also "January")
	uniq  []string   // the words no other label of its dimension has
	disp  string     // how messages name it, when not by its text ("pruned" for yes)
	num   bool       // a number ("2024", "3")
	short bool       // one letter ("A")
}

func newBlockInfo(b *Block, li *lineIndex) *blockInfo {
	bi := &blockInfo{b: b, byLocal: map[string]*factInfo{}, bySlug: map[string][]*label{}, vocab: map[string]bool{}, geometry: b.Figure}
	res := b.Result
	if res == nil {
		return bi
	}
	bi.res = res
	bi.id = res.ID
	bi.meta = res.Meta
	bi.analysis = res.Analysis
	bi.figure = res.Figure
	bi.off = li.offset(res.Pos.Line, res.Pos.Col)
	prefix := res.ID + "."
	for _, name := range res.Facts.Names() {
		f := res.Facts[name]
		local := strings.TrimPrefix(name, prefix)
		parts := strings.Split(local, ".")
		fi := &factInfo{name: name, local: local, fact: f, stat: parts[len(parts)-1], quals: parts[:len(parts)-1], block: bi}
		bi.facts = append(bi.facts, fi)
		bi.byLocal[local] = fi
	}
	m := res.Meta
	add := func(dim string, names []string) {
		for _, n := range names {
			bi.addLabel(dim, n)
		}
	}
	add("group", m.Groups)
	add("time", m.Times)
	add("pred", m.Predictors)
	if bi.analysis == "crosstab" {
		add("row", m.Levels)
		add("col", m.ColLevels)
	} else {
		add("level", m.Levels)
		add("col", m.ColLevels)
	}
	// Qualifiers the Meta did not name (hand-built inputs, new analyses):
	// labels from the slug, by position.
	for _, f := range bi.facts {
		for k, q := range f.quals {
			if reservedQual[q] || isNumeric(q) {
				continue
			}
			if _, ok := bi.bySlug[q]; ok {
				continue
			}
			dim := "group"
			if k > 0 {
				dim = "time"
			}
			if bi.analysis == "frequency" {
				dim = "level"
			}
			if bi.analysis == "regression" && k == 0 {
				dim = "pred"
			}
			bi.addLabel(dim, strings.ReplaceAll(q, "_", " "))
		}
	}
	bi.finishLabels()
	// Age bands: "older" is the last band, "younger" the first.
	for _, d := range []string{"group", "level", "row", "col"} {
		col := m.By
		switch {
		case bi.analysis == "crosstab" && d == "row" && len(m.Columns) > 0:
			col = m.Columns[0]
		case bi.analysis == "crosstab" && d == "col" && len(m.Columns) > 1:
			col = m.Columns[1]
		case bi.analysis == "frequency" && len(m.Columns) > 0:
			col = m.Columns[0]
		}
		bi.ageAlts(d, col)
	}
	// Groups "yes" and "no" of a column are named by the column's words:
	// "trained volunteers" and "untrained ones", "promotion days" and
	// "days without a promotion".
	switch bi.analysis {
	case "crosstab":
		if len(m.Columns) > 0 {
			bi.yesNoAlts("row", m.Columns[0])
		}
		if len(m.Columns) > 1 {
			bi.yesNoAlts("col", m.Columns[1])
		}
	default:
		bi.yesNoAlts("group", m.By)
	}
	for _, w := range append([]string{res.ID, m.By, m.Time}, append(m.Columns, m.Predictors...)...) {
		for _, x := range splitWords(w) {
			if !stopWords[x] && len(x) > 1 {
				bi.vocab[stem(x)] = true
			}
		}
	}
	return bi
}

var isoMonth = regexp.MustCompile(`^(\d{4})-(\d{2})$`)

var monthNames = map[string]string{"01": "jan", "02": "feb", "03": "mar", "04": "apr", "05": "may", "06": "jun",
	"07": "jul", "08": "aug", "09": "sep", "10": "oct", "11": "nov", "12": "dec"}

// reservedQual are fact-name parts that are not labels.
var reservedQual = set("figure predict intercept overall total")

func isNumeric(s string) bool {
	if s == "" {
		return false
	}
	for _, r := range s {
		if !unicode.IsDigit(r) {
			return false
		}
	}
	return true
}

func splitWords(s string) []string {
	return strings.FieldsFunc(strings.ToLower(s), func(r rune) bool {
		return !(unicode.IsLetter(r) || unicode.IsDigit(r))
	})
}

func (bi *blockInfo) addLabel(dim, text string) {
	slug := blocks.Slug(text)
	for _, l := range bi.bySlug[slug] {
		if l.dim == dim {
			return
		}
	}
	l := &label{dim: dim, text: text, slug: slug}
	ws := splitWords(text)
	for _, w := range ws {
		// Negations stay: "Not tutored" is not "Tutored".
		if !stopWords[w] || w == "not" || w == "no" || w == "non" {
			l.words = append(l.words, stem(w))
		}
	}
	if len(l.words) == 0 {
		// A label made only of common words ("Other", "More"): matched
		// only as a whole.
		for _, w := range ws {
			l.words = append(l.words, stem(w))
		}
	}
	// "2026-01" is January (2026); "2026-Q3" is Q3.
	if m := isoMonth.FindStringSubmatch(strings.TrimSpace(text)); m != nil {
		if name := monthNames[m[2]]; name != "" {
			l.alts = append(l.alts, []string{name, m[1]}, []string{name})
		}
	}
	// "18-39" is also "18 to 39" and "18 and 39".
	if len(l.words) == 2 && isNumeric(l.words[0]) && isNumeric(l.words[1]) {
		l.alts = append(l.alts, []string{l.words[0], "to", l.words[1]}, []string{l.words[0], "and", l.words[1]})
	}
	// "No card" is also "without a card"; "Non-member" "without membership"
	// is too far.
	if len(l.words) > 1 && (l.words[0] == "no" || l.words[0] == "not" || l.words[0] == "non") {
		l.alts = append(l.alts, append([]string{"without"}, l.words[1:]...))
	}
	l.num = isNumeric(strings.ReplaceAll(text, ",", ""))
	l.short = len([]rune(strings.TrimSpace(text))) == 1 && !l.num
	bi.labels = append(bi.labels, l)
	bi.bySlug[slug] = append(bi.bySlug[slug], l)
}

func (bi *blockInfo) finishLabels() {
	// Labels that meet once their common words are dropped ("New lid" and
	// "Old lid", "Very satisfied" and "Satisfied") keep every word.
	for _, l := range bi.labels {
		for _, o := range bi.labels {
			if o != l && o.dim == l.dim && strings.Join(o.words, " ") == strings.Join(l.words, " ") {
				for _, x := range []*label{l, o} {
					var all []string
					for _, w := range splitWords(x.text) {
						all = append(all, stem(w))
					}
					x.words = all
				}
			}
		}
	}
	for _, l := range bi.labels {
		for _, w := range l.words {
			shared := false
			for _, o := range bi.labels {
				if o == l || o.dim != l.dim {
					continue
				}
				for _, x := range o.words {
					if x == w {
						shared = true
					}
				}
			}
			if !shared && len(w) > 1 && !stopWords[w] && !isNumeric(w) {
				l.uniq = append(l.uniq, w)
			}
		}
	}
}

// ageAlts lets "older" and "oldest" name the last of a column's age bands
// ("16-40", "65+") and "younger" and "youngest" the first.
func (bi *blockInfo) ageAlts(dim, col string) {
	age := false
	for _, w := range splitWords(col) {
		if w == "age" || w == "ages" || w == "aged" {
			age = true
		}
	}
	ls := bi.dim(dim)
	if !age || len(ls) < 2 {
		return
	}
	lower := func(l *label) float64 {
		v, _ := strconv.ParseFloat(l.words[0], 64)
		return v
	}
	for _, l := range ls {
		if len(l.words) == 0 || !isNumeric(l.words[0]) {
			return
		}
	}
	// Bands in the order of their lower bounds, whatever order the data gave.
	first, last := ls[0], ls[0]
	for _, l := range ls {
		if lower(l) < lower(first) {
			first = l
		}
		if lower(l) > lower(last) {
			last = l
		}
	}
	for _, w := range []string{"younger", "youngest"} {
		first.alts = append(first.alts, []string{stem(w)})
	}
	for _, w := range []string{"older", "oldest", "elderly"} {
		last.alts = append(last.alts, []string{stem(w)})
	}
}

// yesNoAlts lets the words of a yes/no column name its two labels: the
// column's words (a loose stem, "promotion" for "promo") name "yes"; "non",
// "no", "not", "without" or "un" before them name "no".
func (bi *blockInfo) yesNoAlts(dim, col string) {
	if col == "" {
		return
	}
	var yes, no, other *label
	count := 0
	for _, l := range bi.labels {
		if l.dim != dim {
			continue
		}
		count++
		switch strings.ToLower(strings.TrimSpace(l.text)) {
		case "yes", "true", "y", "1":
			yes = l
		case "no", "false", "n", "0", "none", "without", "never":
			no = l
		default:
			other = l
		}
	}
	// "none" against "text": the one other level is the column's "yes".
	if yes == nil && other != nil && count == 2 {
		yes = other
	}
	if yes == nil || no == nil || count != 2 {
		return
	}
	var ws []string
	for _, w := range splitWords(col) {
		if !stopWords[w] && len(w) > 1 {
			ws = append(ws, "~"+stem(w))
		}
	}
	if len(ws) == 0 {
		return
	}
	if strings.EqualFold(yes.text, "yes") || strings.EqualFold(yes.text, "true") {
		name := strings.ReplaceAll(strings.ToLower(col), "_", " ")
		yes.disp, no.disp = name, "not "+name
	}
	yes.alts = append(yes.alts, ws)
	no.alts = append(no.alts, append([]string{"non"}, ws...), append([]string{"no"}, ws...), append([]string{"not"}, ws...),
		append([]string{"without"}, ws...), append([]string{"~un" + strings.TrimPrefix(ws[0], "~")}, ws[1:]...))
	if len(ws) > 1 {
		// "guide users" for audio_guide: the last word alone.
		last := ws[len(ws)-1]
		if len(last) > 4 {
			yes.alts = append(yes.alts, []string{last})
			no.alts = append(no.alts, []string{"non", last}, []string{"no", last}, []string{"without", last})
		}
	}
}

// name is how messages name the label.
func (l *label) name() string {
	if l == nil {
		return "?"
	}
	if l.disp != "" {
		return l.disp
	}
	return l.text
}

// fact returns the fact NAME of the block (without "ID."), or nil.
func (bi *blockInfo) fact(local string) *factInfo {
	f := bi.byLocal[local]
	if f == nil || !f.ok() {
		return nil
	}
	return f
}

// n is the number of cases the block analysed.
func (bi *blockInfo) n() int {
	if f := bi.fact("n"); f != nil {
		return int(math.Round(f.val()))
	}
	return bi.meta.N
}

// dimOf returns the dimension of a qualifier slug.
func (bi *blockInfo) dimOf(q string) string {
	if ls := bi.bySlug[q]; len(ls) > 0 {
		return ls[0].dim
	}
	return ""
}

// labelOf returns the label with the slug in the dimension, or nil.
func (bi *blockInfo) labelOf(dim, slug string) *label {
	for _, l := range bi.bySlug[slug] {
		if l.dim == dim || dim == "" {
			return l
		}
	}
	return nil
}

// labels of a dimension, in order.
func (bi *blockInfo) dim(d string) []*label {
	var out []*label
	for _, l := range bi.labels {
		if l.dim == d {
			out = append(out, l)
		}
	}
	return out
}

// measureStat is the statistic the block reports per group or time point:
// "pct" for shares, "mean" for numbers.
func (bi *blockInfo) measureStat() string {
	if bi.analysis == "crosstab" {
		return "row_pct" // "68% of older trees were healthy": within the row
	}
	if bi.meta.Outcome == "binary" {
		return "pct"
	}
	for _, f := range bi.facts {
		if f.stat == "pct" && len(f.quals) > 0 {
			return "pct"
		}
	}
	return "mean"
}

// mention is a label found in a sentence, at tokens [a, b).
type mention struct {
	l       *label
	a, b    int
	partial bool
}

// findMentions finds the block's labels in the sentence.
func findMentions(s *sentence, bi *blockInfo) []mention {
	var out []mention
	for _, l := range bi.labels {
		found := false
		for i := 0; i < len(s.toks); i++ {
			for _, ws := range append([][]string{l.words}, l.alts...) {
				if n := matchLabel(s, bi, l, i, ws); n > 0 {
					a := i
					if l.num && i > 0 && s.toks[i-1].kind == tWord && len(l.text) != 4 {
						a = i - 1 // "week 8": the mention starts at its name
					}
					out = append(out, mention{l: l, a: a, b: i + n})
					found = true
					i += n - 1
					break
				}
			}
		}
		if found || len(l.words) < 2 {
			continue
		}
		for _, w := range l.uniq {
			for i := range s.toks {
				if i > 0 && asWords[s.toks[i-1].low] {
					continue // "as long as": a comparison, not the "Long form"
				}
				if n := matchLabel(s, bi, l, i, []string{w}); n > 0 {
					out = append(out, mention{l: l, a: i, b: i + n, partial: true})
				}
			}
		}
	}
	// A mention inside a longer one of another label is not one ("Tutored"
	// inside "not tutored").
	var keep []mention
	for i, m := range out {
		inside := false
		for j, o := range out {
			if i != j && o.l != m.l && o.a <= m.a && m.b <= o.b && o.b-o.a > m.b-m.a {
				inside = true
			}
		}
		if !inside {
			keep = append(keep, m)
		}
	}
	sort.SliceStable(keep, func(i, j int) bool { return keep[i].a < keep[j].a })
	return keep
}

// matchLabel reports how many tokens from toks[i] spell the words (hyphens
// and apostrophes between them skipped), 0 when they do not.
func matchLabel(s *sentence, bi *blockInfo, l *label, i int, words []string) int {
	toks := s.toks
	t := toks[i]
	if l.short {
		if t.kind == tWord && t.text == strings.TrimSpace(l.text) && i > 0 && toks[i-1].kind == tWord {
			return 1
		}
		return 0
	}
	if l.num {
		if t.kind != tNum {
			return 0
		}
		if strings.ReplaceAll(t.text, ",", "") != strings.ReplaceAll(strings.TrimSpace(l.text), ",", "") {
			return 0
		}
		if len(l.text) == 4 && t.val >= 1800 && t.val <= 2199 {
			return 1
		}
		if i > 0 && (bi.vocab[toks[i-1].stem] || idNouns[toks[i-1].low] || gaveWords[toks[i-1].low]) {
			return 1
		}
		// "gave a 4", "a rating of 5".
		if i > 1 && (toks[i-1].low == "a" || toks[i-1].low == "an" || toks[i-1].low == "of") &&
			(gaveWords[toks[i-2].low] || bi.vocab[toks[i-2].stem]) {
			return 1
		}
		return 0
	}
	k := i
	for n, w := range words {
		for n > 0 && k < len(toks) && (toks[k].text == "-" || toks[k].text == "–" || toks[k].text == "—" || toks[k].text == "'" || toks[k].text == "’" || toks[k].text == "/" ||
			toks[k].low == "a" || toks[k].low == "an" || toks[k].low == "the") {
			k++
		}
		if k >= len(toks) {
			return 0
		}
		tk := toks[k]
		got := tk.stem
		if tk.kind == tNum {
			got = strings.ReplaceAll(tk.low, ",", "")
		}
		if tk.kind == tPunct || !sameWord(got, w) {
			return 0
		}
		k++
	}
	return k - i
}

// linkScore says how strongly a sentence is tied to a block: an inline value
// of the block counts 3, being its caption 2, following it directly 1, and
// each distinct column word or label the sentence names 1 (at most 4).
func linkScore(s *sentence, bi *blockInfo) int {
	score := 0
	for _, r := range s.refs {
		if strings.HasPrefix(r, bi.id+".") {
			score += 3
			break
		}
	}
	if s.unit.Block == bi.id && bi.id != "" {
		score += 2
	}
	if s.unit.Prev == bi.id && bi.id != "" {
		score++
	}
	return score + wordLinks(s, bi)
}

// wordLinks counts the distinct column words and labels of the block that
// the sentence names, at most 4.
func wordLinks(s *sentence, bi *blockInfo) int {
	seen := map[string]bool{}
	for _, t := range s.toks {
		if t.kind == tWord && !stopWords[t.low] && bi.vocab[t.stem] {
			seen[t.stem] = true
		}
		if t.kind == tWord && t.low == strings.ToLower(bi.id) {
			seen["#id"] = true
		}
	}
	for _, m := range s.mentionsOf(bi) {
		seen["@"+m.l.slug] = true
	}
	if len(seen) > 4 {
		return 4
	}
	return len(seen)
}

// scoped is a block in the scope of a sentence, with its link score.
type scoped struct {
	bi    *blockInfo
	score int
	why   string // "ref", "caption", "prev", "section", "id"
}

// scope returns the blocks a sentence is checked against (FORMAT.md section
// 5): the blocks of its section, any block whose id or fact it names, the
// block directly before its paragraph and, for a caption, its block; the
// most strongly linked first.
func (p *Pass) scopeOf(s *sentence) []*scoped {
	var out []*scoped
	seen := map[*blockInfo]bool{}
	add := func(bi *blockInfo, why string) {
		if bi == nil || seen[bi] || bi.res == nil {
			return
		}
		seen[bi] = true
		out = append(out, &scoped{bi: bi, score: linkScore(s, bi), why: why})
	}
	for _, r := range s.refs {
		if k := strings.IndexByte(r, '.'); k > 0 {
			add(p.byID[r[:k]], "ref")
		}
	}
	if s.unit.Block != "" {
		add(p.byID[s.unit.Block], "caption")
	}
	if s.unit.Prev != "" {
		add(p.byID[s.unit.Prev], "prev")
	}
	for _, bi := range p.blocks {
		if bi.b.Section == s.unit.Section {
			add(bi, "section")
		}
	}
	// A block named by its id: an id that cannot be a plain word
	// ("spend-bands", "q3_sales"), or one named as a block ("the renewals
	// table", "see renewals").
	for i, t := range s.toks {
		if t.kind != tWord {
			continue
		}
		for _, bi := range p.blocks {
			if bi.id == "" {
				continue
			}
			n := matchID(s.toks, i, bi.id)
			if n == 0 {
				continue
			}
			marked := strings.ContainsAny(bi.id, "-_0123456789")
			before, after := low(s.toks, i-1), low(s.toks, i+n)
			if before == "block" || before == "see" || after == "block" || after == "table" || after == "figure" || after == "chart" {
				marked = true
			}
			if marked {
				add(bi, "id")
			}
		}
	}
	// A sentence of a section without blocks (a summary of key points, an
	// introduction) that names a block's columns or groups is read against
	// that block.
	// Its figures are left alone (an introduction describes the data), its
	// words are read: "the audio guide clearly improves the visit".
	if len(out) == 0 && s.unit.Section > 0 {
		for _, bi := range p.blocks {
			if bi.res != nil && (wordLinks(s, bi) >= 2 || namesLabel(s, bi)) {
				add(bi, "named")
			}
		}
		for _, sc := range out {
			sc.score = 1
		}
	}
	unitOff := s.srcStart()
	sort.SliceStable(out, func(i, j int) bool {
		if out[i].score != out[j].score {
			return out[i].score > out[j].score
		}
		// Nearer blocks first; a block before the sentence before one after.
		di, dj := unitOff-out[i].bi.off, unitOff-out[j].bi.off
		if (di >= 0) != (dj >= 0) {
			return di >= 0
		}
		return abs(di) < abs(dj)
	})
	return out
}

func abs(x int) int {
	if x < 0 {
		return -x
	}
	return x
}

// best returns the most strongly linked block in scope that satisfies ok,
// or nil. min is the least link score accepted.
func (p *Pass) best(min int, ok func(*blockInfo) bool) *scoped {
	for _, sc := range p.scope {
		if sc.score >= min && (ok == nil || ok(sc.bi)) {
			return sc
		}
	}
	return nil
}

// ties returns, per dimension, the label that a quantity belongs to: the
// nearest mention in the quantity's clause, or, when the clause names none,
// the mention in the same place of a "respectively" list.
func (s *sentence) ties(bi *blockInfo, q *quantity) map[string]*label {
	out := map[string]*label{}
	ms := s.mentionsOf(bi)
	if len(ms) == 0 {
		return out
	}
	c := s.clause[q.tok]
	dims := map[string]bool{}
	for _, m := range ms {
		dims[m.l.dim] = true
	}
	for d := range dims {
		bestD := 1 << 30
		var bestL *label
		for _, m := range ms {
			if m.l.dim != d || s.clause[m.a] != c {
				continue
			}
			dist := 0
			switch {
			case m.b <= q.tok:
				dist = q.tok - m.b + 1
			case m.a >= q.tokEnd:
				dist = m.a - q.tokEnd + 1
				// "170 in June", "44% for monthly members": a label after a
				// preposition belongs to the number before it.
				if m.a == q.tokEnd+1 && prepositions[s.toks[q.tokEnd].low] {
					dist = 0
				}
				// "6.1 minutes in June", "317 riders a day in March": its unit
				// words between.
				if m.a > q.tokEnd+1 && m.a <= q.tokEnd+5 && prepositions[s.toks[m.a-1].low] {
					words := true
					for k := q.tokEnd; k < m.a-1; k++ {
						if s.toks[k].kind != tWord || s.clause[k] != c || prepositions[s.toks[k].low] {
							words = false
						}
					}
					if words {
						dist = 0
					}
				}
			}
			if m.partial {
				dist++
			}
			if dist < bestD {
				bestD, bestL = dist, m.l
			}
		}
		if bestL != nil {
			out[d] = bestL
			continue
		}
		// "Annual and monthly members renewed at 61% and 38%": in order.
		var labs []*label
		seen := map[*label]bool{}
		for _, m := range ms {
			if m.l.dim == d && !seen[m.l] {
				seen[m.l] = true
				labs = append(labs, m.l)
			}
		}
		var qs []*quantity
		for _, o := range s.qs {
			if !o.claim() || o.unit != q.unit || o.stat != q.stat {
				continue
			}
			has := false
			for _, m := range ms {
				if m.l.dim == d && s.clause[m.a] == s.clause[o.tok] {
					has = true
				}
			}
			if !has {
				qs = append(qs, o)
			}
		}
		if len(labs) == len(qs) && len(labs) > 1 {
			for k, o := range qs {
				if o == q {
					out[d] = labs[k]
				}
			}
		}
		// "Of the 110 monthly members, 45% renewed": the one label of the
		// dimension the sentence names, unless a contrast stands between
		// ("while the others rose from 62.2").
		if out[d] == nil && len(labs) == 1 && !s.contrastBetween(ms, d, q) {
			out[d] = labs[0]
		}
	}
	return out
}

// matchID reports how many tokens from toks[i] spell a block id ("spend",
// "-", "bands"), 0 if they do not.
func matchID(toks []token, i int, id string) int {
	var b strings.Builder
	for k := i; k < len(toks) && k < i+8; k++ {
		if k > i && toks[k].space {
			return 0
		}
		b.WriteString(toks[k].low)
		got := b.String()
		if got == strings.ToLower(id) {
			return k - i + 1
		}
		if !strings.HasPrefix(strings.ToLower(id), got) {
			return 0
		}
	}
	return 0
}

var asWords = set("as so too how very")

// sameWord reports whether a token's stem spells a label's word. A word
// marked "~" (from a column name) is loose: the same first five letters
// will do ("promotion" for "promo", "reminded" for "reminder").
func sameWord(got, w string) bool {
	if !strings.HasPrefix(w, "~") {
		return got == w
	}
	w = w[1:]
	if len(w) >= 4 && strings.HasPrefix(got, w) {
		return true // "temp" for "temperature"
	}
	if len(w) < 5 || len(got) < 5 {
		return got == w
	}
	return got[:5] == w[:5]
}

// gaveWords before a number make it an answer of a rating or score scale.
var gaveWords = set("gave give gives giving rated rate rates rating scored score scores grade graded marked chose picked selected answered")

// contrastWords between a label and a number say the number is about
// someone else.
var contrastWords = set("while whereas but against versus vs vs. compared than others other rest remaining respectively although though yet whilst")

// contrastBetween reports whether a contrast word stands between the
// quantity and the nearest mention of the dimension.
func (s *sentence) contrastBetween(ms []mention, d string, q *quantity) bool {
	for _, m := range ms {
		if m.l.dim != d {
			continue
		}
		a, b := m.b, q.first
		if m.a >= q.tokEnd {
			a, b = q.tokEnd, m.a
		}
		for k := a; k < b && k < len(s.toks); k++ {
			if contrastWords[s.toks[k].low] {
				return true
			}
		}
	}
	return false
}

// markNames marks the numbers of the sentence that spell a label of a block
// in scope ("patients aged 18 to 39" for the age band 18-39, "ratings of 5")
// as names: they say which group, not how much.
func (p *Pass) markNames() {
	s := p.s
	for _, sc := range p.scope {
		for _, m := range s.mentionsOf(sc.bi) {
			if m.partial {
				continue
			}
			for _, q := range s.qs {
				if q.skip == "" && q.ref == "" && q.tok >= m.a && q.tok < m.b && m.b-m.a > 1 {
					q.skip = "label"
				}
			}
		}
	}
}

// namesLabel reports whether the sentence names a group or level of the
// block in full (not by a shared word only).
func namesLabel(s *sentence, bi *blockInfo) bool {
	for _, m := range s.mentionsOf(bi) {
		if !m.partial && m.l.dim != "time" && !m.l.num {
			return true
		}
	}
	return false
}
