package render

import (
	"bytes"
	"fmt"
	"html/template"
	"sort"
	"strconv"
	"strings"

	"github.com/yuin/goldmark/ast"
	"github.com/yuin/goldmark/renderer"
	"github.com/yuin/goldmark/renderer/html"
	"github.com/yuin/goldmark/util"

	"candor/blocks"
	"candor/render/check"
	"candor/templates"
)

// Version is candor's version, shown in the report's colophon.
const Version = "0.1.0"

// Cautions are what the numbers and the checker cannot tell a reader; every
// report's footer lists them.
var Cautions = []string{
	"Whether the data are right. candor computes from the files and queries named above; it cannot see errors in how the data were collected, coded or joined.",
	"Whether the design supports the conclusions. A difference between groups that chose themselves, or a correlation, does not show what caused it; only a randomized design supports causal wording.",
	"Whether a difference matters in practice. A result can be statistically clear and too small to act on, or uncertain and still worth acting on; the intervals say how precise each estimate is.",
	"A clean check is no proof. The checker compares the prose with the computed numbers and flags claims that go beyond them; it cannot judge claims that mention no computed number, or the questions the report did not ask.",
}

var pageTmpl = template.Must(template.New("report.html").ParseFS(templates.FS, "report.html", "block.html"))

func css() template.CSS {
	b, err := templates.FS.ReadFile("report.css")
	if err != nil {
		panic(err) // embedded at build time
	}
	return template.CSS(b)
}

type headCell struct {
	Text string
	Num  bool
}

type tableView struct {
	Num     int
	Caption string
	Head    []headCell
	Rows    [][]blocks.Cell
	Notes   []string
}

type blockView struct {
	ID, Analysis string
	Figure       template.HTML
	FigureNum    int
	Title        string
	Caption      string
	Tables       []tableView
	Filters      []string
	Used         string
	Notes        []string
}

type sourceView struct {
	Name, File, Rows, SHA256, HashNote string
}

type methodView struct {
	Name, Text, Reference string
}

type pageView struct {
	Lang, Version, Title, Subtitle, Author, Date, File string
	CSS                                                template.CSS
	Params                                             []Param
	Body                                               template.HTML
	Methods                                            []methodView
	Acknowledged                                       []check.Finding
	Sources                                            []sourceView
	Cautions                                           []string
	Review                                             bool
	ReviewSummary                                      string
}

// writeHTML renders the report page.
func (r *Report) writeHTML(review bool) ([]byte, error) {
	d := r.Doc
	blockHTML, err := r.blockViews()
	if err != nil {
		return nil, err
	}
	var findings []check.Finding
	if review {
		findings = r.Findings
		r.insertNotes(findings)
	}
	md := Markdown()
	md.Renderer().AddOptions(renderer.WithNodeRenderers(util.Prioritized(&nodeRenderer{r: r, blocks: blockHTML, findings: findings}, 10)))
	var body bytes.Buffer
	if err := md.Renderer().Render(&body, d.Source, d.AST); err != nil {
		return nil, err
	}
	title := d.Front.Title
	if title == "" {
		title = strings.TrimSuffix(baseName(d.File), ".md")
	}
	pv := pageView{
		Lang: "en", Version: Version, Title: title, Subtitle: d.Front.Subtitle,
		Author: d.Front.Author, Date: d.Front.Date, File: baseName(d.File), CSS: css(),
		Params: d.Front.Params, Body: template.HTML(body.String()), Cautions: Cautions, Review: review,
	}
	used := map[string]bool{}
	for _, res := range r.Results {
		for _, m := range res.Methods {
			used[m] = true
		}
	}
	if len(r.Results) > 0 {
		used["exact-decimal"] = true
	}
	for _, m := range blocks.Methods {
		if used[m.Key] {
			pv.Methods = append(pv.Methods, methodView{m.Name, m.Text, m.Reference})
		}
	}
	for _, s := range d.Front.Sources {
		t := r.Tables[s.Name]
		if t == nil {
			continue
		}
		sv := sourceView{Name: s.Name, File: t.File, Rows: blocks.Thousands(strconv.Itoa(t.Rows())), SHA256: t.SHA256}
		switch t.HashOf {
		case "query":
			sv.HashNote = "of the query text, its parameters, the result's columns and row count"
		case "rows":
			sv.HashNote = "of the query's result rows"
		}
		pv.Sources = append(pv.Sources, sv)
	}
	for _, f := range r.Findings {
		if f.Allowed {
			pv.Acknowledged = append(pv.Acknowledged, f)
		}
	}
	if review {
		pv.ReviewSummary = reviewSummary(r.Findings)
	}
	var out bytes.Buffer
	if err := pageTmpl.ExecuteTemplate(&out, "report.html", pv); err != nil {
		return nil, err
	}
	return out.Bytes(), nil
}

func baseName(p string) string {
	if i := strings.LastIndexAny(p, `/\`); i >= 0 {
		return p[i+1:]
	}
	return p
}

func reviewSummary(fs []check.Finding) string {
	count := map[check.Severity]int{}
	for _, f := range fs {
		if !f.Allowed {
			count[f.Severity]++
		}
	}
	if len(fs) == 0 {
		return "The checker found nothing to flag. That is no proof the report is right: see the last section."
	}
	var parts []string
	for _, s := range []check.Severity{check.Error, check.Warning, check.Note} {
		if n := count[s]; n > 0 {
			w := s.String()
			if n > 1 {
				w += "s"
			}
			parts = append(parts, fmt.Sprintf("%d %s", n, w))
		}
	}
	msg := "This copy marks what the checker flagged: " + strings.Join(parts, ", ") + ". Build without --review for the copy to distribute."
	if len(parts) == 0 {
		msg = "Every finding was acknowledged; they are listed in the appendix. Build without --review for the copy to distribute."
	}
	return msg
}

// blockViews renders each block's section (figure, tables, filters, notes).
func (r *Report) blockViews() (map[string]template.HTML, error) {
	out := map[string]template.HTML{}
	figNum, tabNum := 0, 0
	for i, res := range r.Results {
		spec := r.Doc.Blocks[i]
		bv := blockView{ID: res.ID, Analysis: res.Analysis, Filters: res.Filters, Notes: res.Notes}
		if f := r.Figures[res.ID]; f != nil {
			figNum++
			bv.Figure = template.HTML(f.SVG)
			bv.FigureNum = figNum
			bv.Title = res.Figure.Title
			if bv.Title != "" && !strings.HasSuffix(bv.Title, ".") {
				bv.Title += "."
			}
			if spec.Caption != "" {
				bv.Caption = r.CaptionText(spec.Caption)
			}
			if fit := res.Figure.Fit; fit != nil && fit.Label != "" {
				bv.Caption = strings.TrimSpace(bv.Caption + " Fitted line: " + fit.Label + ".")
			}
		}
		for _, t := range res.Tables {
			tabNum++
			tv := tableView{Num: tabNum, Caption: t.Caption, Rows: t.Rows, Notes: t.Notes}
			if tv.Caption == "" {
				tv.Caption = defaultCaption(res, spec)
			}
			for j, h := range t.Head {
				num := j > 0 && len(t.Rows) > 0 && j < len(t.Rows[0]) && t.Rows[0][j].Num
				tv.Head = append(tv.Head, headCell{h, num})
			}
			bv.Tables = append(bv.Tables, tv)
		}
		if len(res.Filters) > 0 {
			bv.Used = fmt.Sprintf("%s of %s rows", blocks.Thousands(strconv.Itoa(res.Meta.N)), blocks.Thousands(strconv.Itoa(r.Tables[res.Source].Rows())))
			if res.Meta.N == 0 {
				bv.Used = ""
			}
		}
		var b bytes.Buffer
		if err := pageTmpl.ExecuteTemplate(&b, "block.html", bv); err != nil {
			return nil, err
		}
		out[res.ID] = template.HTML(b.String())
	}
	return out, nil
}

func defaultCaption(res *blocks.Result, s *blocks.Spec) string {
	what := strings.Join(s.Target, ", ")
	switch res.Analysis {
	case "summary":
		if s.By != "" {
			return "Summary of " + what + " by " + s.By + "."
		}
		return "Summary of " + what + "."
	case "frequency":
		return "Frequency of " + what + "."
	case "crosstab":
		return "Cross-tabulation of " + strings.Join(s.Target, " by ") + "."
	case "compare":
		return "Comparison of " + what + " by " + s.By + "."
	case "correlation":
		return "Correlation of " + strings.Join(s.Target, " and ") + "."
	case "regression":
		return "Regression of " + what + " on " + strings.Join(s.Predictors, ", ") + "."
	case "trend":
		return upperFirst(what) + " over " + s.Time + "."
	case "stemleaf":
		return "Stem-and-leaf display of " + what + "."
	}
	return upperFirst(what) + "."
}

// nodeRenderer renders candor's nodes: analysis blocks, inline values,
// acknowledgment comments and, in review copies, marked findings.
type nodeRenderer struct {
	r        *Report
	blocks   map[string]template.HTML
	findings []check.Finding
	base     html.Config
}

func (n *nodeRenderer) RegisterFuncs(reg renderer.NodeRendererFuncRegisterer) {
	reg.Register(ast.KindFencedCodeBlock, n.fenced)
	reg.Register(KindValue, n.value)
	reg.Register(ast.KindHTMLBlock, n.htmlBlock)
	reg.Register(ast.KindRawHTML, n.rawHTML)
	reg.Register(kindNote, n.note)
	if len(n.findings) > 0 {
		reg.Register(ast.KindText, n.text)
	}
}

func (n *nodeRenderer) fenced(w util.BufWriter, src []byte, node ast.Node, entering bool) (ast.WalkStatus, error) {
	if !entering {
		return ast.WalkContinue, nil
	}
	fc := node.(*ast.FencedCodeBlock)
	if id, ok, _ := blockID(fc, src); ok {
		w.WriteString(string(n.blocks[id]))
		return ast.WalkSkipChildren, nil
	}
	w.WriteString("<pre><code")
	if lang := fc.Language(src); lang != nil {
		w.WriteString(` class="language-`)
		w.Write(util.EscapeHTML(lang))
		w.WriteString(`"`)
	}
	w.WriteString(">")
	for i := 0; i < fc.Lines().Len(); i++ {
		seg := fc.Lines().At(i)
		w.Write(util.EscapeHTML(seg.Value(src)))
	}
	w.WriteString("</code></pre>\n")
	return ast.WalkSkipChildren, nil
}

func (n *nodeRenderer) value(w util.BufWriter, src []byte, node ast.Node, entering bool) (ast.WalkStatus, error) {
	if !entering {
		return ast.WalkContinue, nil
	}
	v := node.(*Value)
	text := util.EscapeHTML([]byte(n.r.valueText(v)))
	if f := n.overlapping(v.Start, v.End); f != nil {
		fmt.Fprintf(w, `<mark class="finding %s" title="%s">`, f.Severity, template.HTMLEscapeString(f.Rule))
		w.Write(text)
		w.WriteString("</mark>")
	} else {
		w.Write(text)
	}
	return ast.WalkContinue, nil
}

// htmlBlock drops acknowledgment comments and any other raw HTML: a report
// is built from Markdown and its blocks only, so that it stays self-contained.
func (n *nodeRenderer) htmlBlock(w util.BufWriter, src []byte, node ast.Node, entering bool) (ast.WalkStatus, error) {
	return ast.WalkSkipChildren, nil
}

func (n *nodeRenderer) rawHTML(w util.BufWriter, src []byte, node ast.Node, entering bool) (ast.WalkStatus, error) {
	return ast.WalkSkipChildren, nil
}

// overlapping returns the first finding whose span overlaps [start, end).
func (n *nodeRenderer) overlapping(start, end int) *check.Finding {
	for i := range n.findings {
		f := &n.findings[i]
		if f.Allowed || f.End <= f.Offset {
			continue
		}
		if f.Offset < end && start < f.End {
			return f
		}
	}
	return nil
}

// text renders a text node, marking the parts a finding covers.
func (n *nodeRenderer) text(w util.BufWriter, src []byte, node ast.Node, entering bool) (ast.WalkStatus, error) {
	if !entering {
		return ast.WalkContinue, nil
	}
	t := node.(*ast.Text)
	seg := t.Segment
	if t.IsRaw() {
		w.Write(seg.Value(src))
	} else {
		pos := seg.Start
		for pos < seg.Stop {
			f := n.overlapping(pos, seg.Stop)
			if f == nil {
				w.Write(util.EscapeHTML(src[pos:seg.Stop]))
				break
			}
			from := max(f.Offset, pos)
			to := min(f.End, seg.Stop)
			w.Write(util.EscapeHTML(src[pos:from]))
			fmt.Fprintf(w, `<mark class="finding %s" title="%s">`, f.Severity, template.HTMLEscapeString(f.Rule))
			w.Write(util.EscapeHTML(src[from:to]))
			w.WriteString("</mark>")
			pos = to
		}
	}
	if t.HardLineBreak() {
		w.WriteString("<br>\n")
	} else if t.SoftLineBreak() {
		w.WriteByte('\n')
	}
	return ast.WalkContinue, nil
}

// kindNote is a review note inserted before the block it concerns.
var kindNote = ast.NewNodeKind("CandorFindingNote")

type noteNode struct {
	ast.BaseBlock
	findings []check.Finding
}

func (n *noteNode) Kind() ast.NodeKind            { return kindNote }
func (n *noteNode) Dump(source []byte, level int) { ast.DumpHelper(n, source, level, nil, nil) }

func (n *nodeRenderer) note(w util.BufWriter, src []byte, node ast.Node, entering bool) (ast.WalkStatus, error) {
	if !entering {
		return ast.WalkContinue, nil
	}
	nn := node.(*noteNode)
	worst := check.Note
	for _, f := range nn.findings {
		if f.Severity > worst {
			worst = f.Severity
		}
	}
	fmt.Fprintf(w, "<aside class=\"finding-note %s\" role=\"note\">\n", worst)
	for _, f := range nn.findings {
		fmt.Fprintf(w, "<p><span class=\"sev\">%s</span><span class=\"rule\">%s</span> line %d: %s</p>\n",
			f.Severity, template.HTMLEscapeString(f.Rule), f.Line, template.HTMLEscapeString(f.Message))
	}
	w.WriteString("</aside>\n")
	return ast.WalkSkipChildren, nil
}

// insertNotes puts a note before each top-level node (paragraph, list,
// table, heading, block) holding findings: on a wide screen the note floats
// into the margin beside it, on a narrow one it stands above it.
func (r *Report) insertNotes(fs []check.Finding) {
	if len(fs) == 0 {
		return
	}
	doc := r.Doc.AST
	var tops []ast.Node
	for c := doc.FirstChild(); c != nil; c = c.NextSibling() {
		tops = append(tops, c)
	}
	notes := map[ast.Node][]check.Finding{}
	for _, f := range fs {
		if f.Allowed {
			continue
		}
		var at ast.Node
		for _, t := range tops {
			s, e := nodeRange(t, r.Doc.Source)
			if s <= f.Offset && f.Offset < e {
				at = t
				break
			}
			if s > f.Offset {
				break
			}
			at = t
		}
		if at != nil {
			notes[at] = append(notes[at], f)
		}
	}
	keys := make([]ast.Node, 0, len(notes))
	for _, t := range tops {
		if _, ok := notes[t]; ok {
			keys = append(keys, t)
		}
	}
	for _, t := range keys {
		list := notes[t]
		sort.SliceStable(list, func(i, j int) bool { return list[i].Offset < list[j].Offset })
		doc.InsertBefore(doc, t, &noteNode{findings: list})
	}
}

// nodeRange is the span of source a block node covers.
func nodeRange(n ast.Node, src []byte) (int, int) {
	start, end := -1, -1
	_ = ast.Walk(n, func(c ast.Node, entering bool) (ast.WalkStatus, error) {
		if !entering {
			return ast.WalkContinue, nil
		}
		if c.Type() == ast.TypeBlock {
			if fc, ok := c.(*ast.FencedCodeBlock); ok && fc.Info != nil {
				grow(&start, &end, fc.Info.Segment.Start, fc.Info.Segment.Stop)
			}
			lines := c.Lines()
			for i := 0; i < lines.Len(); i++ {
				seg := lines.At(i)
				grow(&start, &end, seg.Start, seg.Stop)
			}
		} else if t, ok := c.(*ast.Text); ok {
			grow(&start, &end, t.Segment.Start, t.Segment.Stop)
		} else if v, ok := c.(*Value); ok {
			grow(&start, &end, v.Start, v.End)
		}
		return ast.WalkContinue, nil
	})
	if start < 0 {
		return 0, 0
	}
	return start, end + 1
}

func grow(start, end *int, s, e int) {
	if *start < 0 || s < *start {
		*start = s
	}
	if e > *end {
		*end = e
	}
}

func upperFirst(s string) string {
	if s == "" {
		return s
	}
	r := []rune(s)
	return strings.ToUpper(string(r[0])) + string(r[1:])
}
