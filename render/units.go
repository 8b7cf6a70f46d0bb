package render

import (
	"regexp"
	"strings"

	"github.com/yuin/goldmark/ast"
	east "github.com/yuin/goldmark/extension/ast"

	"candor/blocks"
	"candor/render/check"
)

var allowPattern = regexp.MustCompile(`^\s*<!--\s*candor:\s*allow\s+([a-z-]+)\s*(.*?)\s*-->\s*$`)

// checkInput gathers the prose the checker reads: every paragraph, list item,
// table cell, heading and figure caption outside code, with the blocks and
// the sections they stand in.
func (r *Report) checkInput() check.Input {
	d := r.Doc
	in := check.Input{File: d.File, Source: d.Source, Config: d.Front.Check}
	w := &unitWalker{r: r}
	w.walkBlocks(d.AST)
	in.Units = w.units
	byID := map[string]*blocks.Result{}
	for _, res := range r.Results {
		byID[res.ID] = res
	}
	for _, res := range r.Results {
		b := check.Block{Result: res, Section: w.blockSection[res.ID], Allow: w.blockAllow[res.ID]}
		if f := r.Figures[res.ID]; f != nil {
			g := f.Geometry
			b.Figure = &g
		}
		in.Blocks = append(in.Blocks, b)
	}
	// Figure titles and captions are prose too.
	for _, s := range d.Blocks {
		if byID[s.ID] == nil || byID[s.ID].Figure == nil {
			continue
		}
		for _, c := range []struct {
			text string
			pos  blocks.Pos
		}{{s.Title, s.TitlePos}, {s.Caption, s.CaptionPos}} {
			if c.text == "" {
				continue
			}
			u := check.Unit{Kind: "caption", Section: w.blockSection[s.ID], Prev: s.ID, Block: s.ID}
			u.Parts = r.captionParts(c.text, d.offset(c.pos))
			in.Units = append(in.Units, u)
		}
	}
	return in
}

// offset converts a position back to a byte offset.
func (d *Document) offset(p blocks.Pos) int {
	if p.Line < 1 || p.Line > len(d.lines) {
		return 0
	}
	return d.lines[p.Line-1] + p.Col - 1
}

var captionValue = regexp.MustCompile(`\{\{\s*([A-Za-z0-9_-]+(?:\.[A-Za-z0-9_-]+)+)\s*(?:\|\s*(\d{1,2})\s*)?\}\}`)

// captionParts splits a caption into literal text and inline values. off is
// where the caption's text starts in the source (exact for plain and quoted
// one-line values).
func (r *Report) captionParts(text string, off int) []check.Part {
	var parts []check.Part
	src := r.Doc.Source
	if off < len(src) && (src[off] == '"' || src[off] == '\'') {
		off++
	}
	last := 0
	for _, m := range captionValue.FindAllStringSubmatchIndex(text, -1) {
		if m[0] > last {
			parts = append(parts, check.Part{Text: text[last:m[0]], Offset: off + last, SrcLen: m[0] - last})
		}
		v := &Value{Ref: text[m[2]:m[3]], Decimals: -1}
		if m[4] >= 0 {
			v.Decimals = atoi(text[m[4]:m[5]])
		}
		parts = append(parts, check.Part{Text: r.valueText(v), Offset: off + m[0], SrcLen: m[1] - m[0], Ref: v.Ref})
		last = m[1]
	}
	if last < len(text) {
		parts = append(parts, check.Part{Text: text[last:], Offset: off + last, SrcLen: len(text) - last})
	}
	return parts
}

// CaptionText is a caption with its inline values formatted.
func (r *Report) CaptionText(text string) string {
	return captionValue.ReplaceAllStringFunc(text, func(m string) string {
		sm := captionValue.FindStringSubmatch(m)
		v := &Value{Ref: sm[1], Decimals: -1}
		if sm[2] != "" {
			v.Decimals = atoi(sm[2])
		}
		return r.valueText(v)
	})
}

func atoi(s string) int {
	n := 0
	for _, c := range s {
		n = n*10 + int(c-'0')
	}
	return n
}

type unitWalker struct {
	r            *Report
	units        []check.Unit
	section      int
	blockSection map[string]int
	blockAllow   map[string][]check.Allow
}

// walkBlocks visits the block-level children of n in order.
func (w *unitWalker) walkBlocks(n ast.Node) {
	if w.blockSection == nil {
		w.blockSection = map[string]int{}
		w.blockAllow = map[string][]check.Allow{}
	}
	var allow []check.Allow
	prev := ""
	for c := n.FirstChild(); c != nil; c = c.NextSibling() {
		if hb, ok := c.(*ast.HTMLBlock); ok {
			if a, ok := w.allowOf(hb); ok {
				allow = append(allow, a)
				continue
			}
		}
		start := len(w.units)
		switch c := c.(type) {
		case *ast.FencedCodeBlock:
			if id, ok, _ := blockID(c, w.r.Doc.Source); ok {
				w.blockSection[id] = w.section
				if len(allow) > 0 {
					w.blockAllow[id] = allow
				}
				prev = id
				allow = nil
				continue
			}
		case *ast.Heading:
			w.section++
			w.inline(c, "heading", prev)
		case *ast.Paragraph, *ast.TextBlock:
			kind := "paragraph"
			if _, ok := n.(*ast.ListItem); ok {
				kind = "item"
			}
			w.inline(c, kind, prev)
		case *east.Table:
			for row := c.FirstChild(); row != nil; row = row.NextSibling() {
				for cell := row.FirstChild(); cell != nil; cell = cell.NextSibling() {
					w.inline(cell, "cell", prev)
				}
			}
		case *ast.CodeBlock, *ast.HTMLBlock, *ast.ThematicBreak:
		default:
			w.walkBlocks(c)
		}
		for i := start; i < len(w.units); i++ {
			w.units[i].Allow = append(w.units[i].Allow, allow...)
		}
		allow = nil
		prev = ""
	}
}

func (w *unitWalker) allowOf(hb *ast.HTMLBlock) (check.Allow, bool) {
	src := w.r.Doc.Source
	var b strings.Builder
	lines := hb.Lines()
	for i := 0; i < lines.Len(); i++ {
		seg := lines.At(i)
		b.Write(seg.Value(src))
	}
	if hb.HasClosure() {
		cl := hb.ClosureLine
		b.Write(cl.Value(src))
	}
	m := allowPattern.FindStringSubmatch(strings.TrimSpace(b.String()))
	if m == nil || lines.Len() == 0 {
		return check.Allow{}, false
	}
	return check.Allow{Rule: m[1], Reason: m[2], Offset: lines.At(0).Start}, true
}

// inline turns a block's inline content into one unit.
func (w *unitWalker) inline(n ast.Node, kind, prev string) {
	u := check.Unit{Kind: kind, Section: w.section, Prev: prev}
	w.parts(n, &u.Parts)
	if len(u.Parts) > 0 {
		w.units = append(w.units, u)
	}
}

func (w *unitWalker) parts(n ast.Node, out *[]check.Part) {
	src := w.r.Doc.Source
	for c := n.FirstChild(); c != nil; c = c.NextSibling() {
		switch c := c.(type) {
		case *ast.Text:
			seg := c.Segment
			*out = append(*out, check.Part{Text: string(seg.Value(src)), Offset: seg.Start, SrcLen: seg.Len()})
			if c.SoftLineBreak() || c.HardLineBreak() {
				*out = append(*out, check.Part{Text: " ", Offset: seg.Stop, SrcLen: 0})
			}
		case *ast.String:
			off := 0
			if k := len(*out); k > 0 {
				off = (*out)[k-1].Offset + (*out)[k-1].SrcLen
			}
			*out = append(*out, check.Part{Text: string(c.Value), Offset: off})
		case *Value:
			*out = append(*out, check.Part{Text: w.r.valueText(c), Offset: c.Start, SrcLen: c.End - c.Start, Ref: c.Ref})
		case *ast.CodeSpan:
			for t := c.FirstChild(); t != nil; t = t.NextSibling() {
				if tx, ok := t.(*ast.Text); ok {
					*out = append(*out, check.Part{Text: string(tx.Segment.Value(src)), Offset: tx.Segment.Start, SrcLen: tx.Segment.Len()})
				}
			}
		case *east.Strikethrough, *ast.AutoLink, *ast.RawHTML, *ast.Image, *east.FootnoteLink:
			// Struck-out text, addresses, raw HTML and images claim nothing.
		default:
			w.parts(c, out)
		}
	}
}
