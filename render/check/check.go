package check

import (
	"fmt"
	"sort"
	"strings"
)

// Rule is one check of FORMAT.md section 5, modelled on an analyzer of
// golang.org/x/tools/go/analysis: a value with an ID (part of the report
// format's contract), a one-paragraph Doc that the documentation and SARIF
// output are built from, and a Check function.
//
// Check is called once per sentence of the prose (Pass.Sentence returns
// it) when On includes Prose, and once per block (Pass.BlockID returns it)
// when On includes Figures.
type Rule struct {
	ID    string
	Doc   string
	On    Target
	Check func(p *Pass) []Finding
}

// Target says what a rule reads.
type Target uint8

const (
	Prose   Target = 1 << iota // sentences
	Figures                    // blocks and their figures
)

func (r *Rule) on(t Target) bool {
	on := r.On
	if on == 0 {
		on = Prose
	}
	return on&t != 0
}

// registry is every rule, in the order of FORMAT.md section 5.
var registry = []*Rule{
	numberRule,
	ratioRule,
	pointsRule,
	directionRule,
	significanceRule,
	strengthRule,
	causalRule,
	quantifierRule,
	sampleRule,
	extrapolationRule,
	zeroAxisRule,
	lieFactorRule,
	partialSeriesRule,
	chartChoiceRule,
	unshownFitRule,
}

// Rules returns the registered rules in their fixed order. The slice is a
// copy; the rules are shared and must not be changed.
func Rules() []*Rule {
	return append([]*Rule(nil), registry...)
}

// Lookup returns the rule with the id, or nil.
func Lookup(id string) *Rule {
	for _, r := range registry {
		if r.ID == id {
			return r
		}
	}
	return nil
}

// Defaults of the check: settings (FORMAT.md section 1).
const (
	DefaultAlpha  = 0.05
	DefaultMinN   = 30
	DefaultDesign = "observational"
)

// WithDefaults returns the configuration with every unset value at its
// default.
func (c Config) WithDefaults() Config {
	if !(c.Alpha > 0 && c.Alpha < 1) {
		c.Alpha = DefaultAlpha
	}
	if c.MinN <= 0 {
		c.MinN = DefaultMinN
	}
	c.Design = strings.ToLower(strings.TrimSpace(c.Design))
	if c.Design == "" {
		c.Design = DefaultDesign
	}
	return c
}

// Pass is what a rule's Check reads: the sentence or block being checked,
// the blocks in scope and the report's settings.
type Pass struct {
	in        *Input
	cfg       Config
	li        *lineIndex
	blocks    []*blockInfo
	byID      map[string]*blockInfo
	byIDLower map[string]*blockInfo

	// The sentence pass.
	s     *sentence
	scope []*scoped
	unit  []*sentence // every sentence of the unit

	// The figure pass.
	bi *blockInfo
}

// Config returns the report's check settings, defaults filled in.
func (p *Pass) Config() Config { return p.cfg }

// Sentence returns the text of the sentence being checked ("" in the figure
// pass).
func (p *Pass) Sentence() string {
	if p.s == nil {
		return ""
	}
	return p.s.text
}

// BlockID returns the id of the block being checked in the figure pass.
func (p *Pass) BlockID() string {
	if p.bi == nil {
		return ""
	}
	return p.bi.id
}

// Run checks every sentence of the report's prose against the facts of the
// blocks in its scope and every block's figure against its data, and returns
// the findings sorted by position, then rule. Rules switched off in
// in.Config.Off do not run. Acknowledged findings (Unit.Allow, Block.Allow)
// stay in the list, marked Allowed with the reason.
func Run(in Input) []Finding {
	p := newPass(&in)
	off := map[string]bool{}
	for _, id := range in.Config.Off {
		off[strings.TrimSpace(id)] = true
	}
	var out []Finding
	units := mergeRows(in.Units, in.Source)
	var lines []string // the source's lines, for table headers
	for ui := range units {
		u := &units[ui]
		ut := newUnitText(u, in.Source)
		ss := sentences(u, ut)
		if u.Kind == "cell" {
			if lines == nil {
				lines = strings.Split(string(in.Source), "\n")
			}
			heads := tableHeads(u, lines, p.li)
			for _, s := range ss {
				s.heads = heads
			}
		}
		p.unit = ss
		for _, s := range ss {
			p.s = s
			p.scope = p.scopeOf(s)
			p.markNames()
			for _, r := range registry {
				if !r.on(Prose) || off[r.ID] {
					continue
				}
				for _, f := range p.safeCheck(r) {
					allow(&f, u.Allow)
					out = append(out, f)
				}
			}
		}
	}
	p.s, p.scope, p.unit = nil, nil, nil
	for _, bi := range p.blocks {
		if bi.res == nil {
			continue
		}
		p.bi = bi
		var allows []Allow
		allows = append(allows, bi.b.Allow...)
		for _, u := range in.Units {
			if u.Kind == "caption" && u.Block == bi.id {
				allows = append(allows, u.Allow...)
			}
		}
		for _, r := range registry {
			if !r.on(Figures) || off[r.ID] {
				continue
			}
			for _, f := range p.safeCheck(r) {
				allow(&f, allows)
				out = append(out, f)
			}
		}
	}
	return sortFindings(dedupe(out))
}

func newPass(in *Input) *Pass {
	p := &Pass{in: in, cfg: in.Config.WithDefaults(), li: newLineIndex(in.Source),
		byID: map[string]*blockInfo{}, byIDLower: map[string]*blockInfo{}}
	for i := range in.Blocks {
		bi := newBlockInfo(&in.Blocks[i], p.li)
		p.blocks = append(p.blocks, bi)
		if bi.id != "" {
			p.byID[bi.id] = bi
			p.byIDLower[strings.ToLower(bi.id)] = bi
		}
	}
	return p
}

// panicky makes a rule's panic reach the caller; tests set it. In a build a
// rule that fails on odd input loses its findings for that sentence instead
// of taking the build down.
var panicky = false

func (p *Pass) safeCheck(r *Rule) (fs []Finding) {
	if !panicky {
		defer func() {
			if recover() != nil {
				fs = nil
			}
		}()
	}
	fs = r.Check(p)
	for i := range fs {
		fs[i].Rule = r.ID
		fs[i].File = p.in.File
	}
	return fs
}

func allow(f *Finding, allows []Allow) {
	for _, a := range allows {
		if a.Rule == f.Rule {
			f.Allowed = true
			f.Reason = a.Reason
			return
		}
	}
}

func dedupe(fs []Finding) []Finding {
	type key struct {
		rule     string
		off, end int
	}
	seen := map[key]bool{}
	var out []Finding
	for _, f := range fs {
		k := key{f.Rule, f.Offset, f.End}
		if seen[k] {
			continue
		}
		seen[k] = true
		out = append(out, f)
	}
	return out
}

func sortFindings(fs []Finding) []Finding {
	order := map[string]int{}
	for i, r := range registry {
		order[r.ID] = i
	}
	sort.SliceStable(fs, func(i, j int) bool {
		a, b := fs[i], fs[j]
		if a.Line != b.Line {
			return a.Line < b.Line
		}
		if a.Col != b.Col {
			return a.Col < b.Col
		}
		if a.Rule != b.Rule {
			return order[a.Rule] < order[b.Rule]
		}
		return a.Message < b.Message
	})
	return fs
}

// Fails reports whether a finding that is not acknowledged reaches failOn.
// Never fails nothing.
func Fails(findings []Finding, failOn Severity) bool {
	if failOn == Never {
		return false
	}
	for _, f := range findings {
		if !f.Allowed && f.Severity >= failOn && f.Severity != Never {
			return true
		}
	}
	return false
}

// at returns a finding for the unit-text span [a, b) of the sentence being
// checked, judged against the block.
func (p *Pass) at(sev Severity, a, b int, bi *blockInfo, format string, args ...any) Finding {
	s := p.s
	if a < s.start {
		a = s.start
	}
	if b > s.end || b <= a {
		b = s.end
	}
	off := s.ut.src(a, false)
	end := s.ut.src(b, true)
	if end < off {
		end = off
	}
	f := Finding{Offset: off, End: end, Severity: sev, Message: fmt.Sprintf(format, args...)}
	if bi != nil {
		f.Block = bi.id
	}
	f.Line, f.Col = p.li.pos(off)
	f.EndLine, f.EndCol = p.li.pos(end)
	return f
}

// atQ is at for a quantity.
func (p *Pass) atQ(sev Severity, q *quantity, bi *blockInfo, format string, args ...any) Finding {
	return p.at(sev, q.start, q.end, bi, format, args...)
}

// atTok is at for tokens [a, b) of the sentence.
func (p *Pass) atTok(sev Severity, a, b int, bi *blockInfo, format string, args ...any) Finding {
	toks := p.s.toks
	if a < 0 || a >= len(toks) {
		return p.at(sev, p.s.start, p.s.end, bi, format, args...)
	}
	if b <= a || b > len(toks) {
		b = a + 1
	}
	return p.at(sev, toks[a].start, toks[b-1].end, bi, format, args...)
}

// atBlock returns a finding at the block's opening fence.
func (p *Pass) atBlock(sev Severity, bi *blockInfo, format string, args ...any) Finding {
	off := bi.off
	end := p.li.lineEnd(p.in.Source, off)
	if end < off {
		end = off
	}
	f := Finding{Offset: off, End: end, Severity: sev, Block: bi.id, Message: fmt.Sprintf(format, args...)}
	if len(p.in.Source) == 0 && bi.res != nil {
		f.Line, f.Col = bi.res.Pos.Line, bi.res.Pos.Col
		f.EndLine, f.EndCol = f.Line, f.Col
		return f
	}
	f.Line, f.Col = p.li.pos(off)
	f.EndLine, f.EndCol = p.li.pos(end)
	return f
}

// mergeRows joins the cells of one table row into one unit, so that a
// figure in a cell is read with the row's label ("| Evening | 45% |"). Cells
// are of one row when their text starts on the same source line.
func mergeRows(units []Unit, src []byte) []Unit {
	if len(src) == 0 {
		return units
	}
	li := newLineIndex(src)
	lineOf := func(u Unit) int {
		for _, pt := range u.Parts {
			if pt.Text != "" {
				l, _ := li.pos(pt.Offset)
				return l
			}
		}
		return -1
	}
	var out []Unit
	for i := 0; i < len(units); i++ {
		u := units[i]
		if u.Kind != "cell" {
			out = append(out, u)
			continue
		}
		line := lineOf(u)
		row := u
		row.Parts = append([]Part(nil), u.Parts...)
		for i+1 < len(units) && units[i+1].Kind == "cell" && line >= 0 && lineOf(units[i+1]) == line {
			i++
			next := units[i]
			end := 0
			if k := len(row.Parts); k > 0 {
				end = row.Parts[k-1].Offset + row.Parts[k-1].SrcLen
			}
			row.Parts = append(row.Parts, Part{Text: " | ", Offset: end, SrcLen: 0})
			row.Parts = append(row.Parts, next.Parts...)
			row.Allow = append(row.Allow, next.Allow...)
		}
		out = append(out, row)
	}
	return out
}

// tableHeads returns the header cells of the table a row of cells stands in
// ("| Menu | Days | Mean waste (kg) |"), read from the source: the line
// above the table's delimiter row. A header row itself gets none.
func tableHeads(u *Unit, lines []string, li *lineIndex) []string {
	off := -1
	for _, pt := range u.Parts {
		if pt.Text != "" {
			off = pt.Offset
			break
		}
	}
	if off < 0 || off > li.size {
		return nil
	}
	line, _ := li.pos(off)
	if line-1 >= len(lines) {
		return nil
	}
	isRow := func(l string) bool { return strings.HasPrefix(strings.TrimSpace(l), "|") }
	isDelim := func(l string) bool {
		t := strings.TrimSpace(l)
		return strings.HasPrefix(t, "|") && strings.Trim(t, "|-: \t") == "" && strings.Contains(t, "-")
	}
	for k := line - 2; k >= 1; k-- { // lines[k] is line k+1
		if !isRow(lines[k]) {
			return nil
		}
		if isDelim(lines[k]) {
			cells := strings.Split(strings.Trim(strings.TrimSpace(lines[k-1]), "|"), "|")
			for i := range cells {
				cells[i] = strings.TrimSpace(cells[i])
			}
			return cells
		}
	}
	return nil
}
