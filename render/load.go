// Package render is candor's pipeline: it loads a report (front matter with
// yaml.v3, Markdown with goldmark), runs its blocks, draws their figures,
// calls the checker and writes the HTML. It knows how a report is put
// together, never how a statistic is computed.
package render

import (
	"bytes"
	"os"
	"path/filepath"
	"sort"
	"strings"

	"github.com/yuin/goldmark"
	"github.com/yuin/goldmark/ast"
	"github.com/yuin/goldmark/extension"
	"github.com/yuin/goldmark/parser"
	"github.com/yuin/goldmark/text"
	"gopkg.in/yaml.v3"

	"candor/blocks"
	"candor/render/check"
)

// Document is a loaded report: its front matter, blocks and Markdown tree.
type Document struct {
	File   string // as given on the command line
	Dir    string
	Source []byte
	Front  FrontMatter
	Blocks []*blocks.Spec // in document order
	AST    ast.Node
	lines  []int // byte offset of each line's start
}

// FrontMatter is the report's YAML header.
type FrontMatter struct {
	Title, Subtitle, Author, Date string
	Sources                       []*blocks.SourceSpec
	Params                        []Param
	Check                         check.Config
	CheckPos                      map[string]blocks.Pos
}

// Param is one report parameter with the value in force.
type Param struct {
	Name  string
	Value string
	Set   bool // overridden with --set
	Pos   blocks.Pos
}

var frontKeys = []string{"title", "subtitle", "author", "date", "data", "params", "check"}
var checkKeys = []string{"alpha", "design", "min-n", "fail-on", "off"}

// Markdown returns the goldmark instance candor uses: CommonMark with
// GitHub-style tables, strikethrough, autolinks and task lists, footnotes, and
// inline values.
func Markdown() goldmark.Markdown {
	return goldmark.New(
		goldmark.WithExtensions(extension.GFM, extension.Footnote, valueExtension{}),
		goldmark.WithParserOptions(parser.WithAutoHeadingID()),
	)
}

// Load reads and parses a report file. set holds --set overrides.
func Load(path string, set map[string]string) (*Document, error) {
	src, err := os.ReadFile(path)
	if err != nil {
		return nil, blocks.Errorf(blocks.Pos{File: path}, "cannot read the report: %v", unwrapPath(err))
	}
	return Parse(path, src, set)
}

func unwrapPath(err error) error {
	if pe, ok := err.(*os.PathError); ok {
		return pe.Err
	}
	return err
}

// Parse parses report source. path names it in messages and locates its data.
func Parse(path string, src []byte, set map[string]string) (*Document, error) {
	d := &Document{File: path, Dir: filepath.Dir(path), Source: src}
	d.lines = lineStarts(src)
	body := src
	fmEnd, err := d.frontMatter(set)
	if err != nil {
		return nil, err
	}
	if fmEnd > 0 {
		// Blank out the front matter (keeping newlines) so goldmark sees the
		// body at its own offsets.
		body = append([]byte(nil), src...)
		for i := 0; i < fmEnd; i++ {
			if body[i] != '\n' {
				body[i] = ' '
			}
		}
	}
	d.AST = Markdown().Parser().Parse(text.NewReader(body))
	if err := d.findBlocks(); err != nil {
		return nil, err
	}
	return d, nil
}

func lineStarts(src []byte) []int {
	starts := []int{0}
	for i, b := range src {
		if b == '\n' {
			starts = append(starts, i+1)
		}
	}
	return starts
}

// Pos converts a byte offset to a position.
func (d *Document) Pos(offset int) blocks.Pos {
	i := sort.Search(len(d.lines), func(i int) bool { return d.lines[i] > offset }) - 1
	if i < 0 {
		i = 0
	}
	return blocks.Pos{File: d.File, Line: i + 1, Col: offset - d.lines[i] + 1}
}

// frontMatter decodes the YAML between the first two "---" lines and
// returns the offset just past it (0 when there is none).
func (d *Document) frontMatter(set map[string]string) (int, error) {
	src := d.Source
	d.Front.Check = check.Config{Alpha: 0.05, MinN: 30, Design: "observational", FailOn: check.Error}
	d.Front.CheckPos = map[string]blocks.Pos{}
	if !bytes.HasPrefix(src, []byte("---\n")) && !bytes.HasPrefix(src, []byte("---\r\n")) {
		return 0, d.applySet(set, nil)
	}
	start := bytes.IndexByte(src, '\n') + 1
	end := -1
	for i := 1; i < len(d.lines); i++ {
		ls := d.lines[i]
		le := len(src)
		if i+1 < len(d.lines) {
			le = d.lines[i+1]
		}
		line := strings.TrimRight(string(src[ls:le]), "\r\n \t")
		if line == "---" || line == "..." {
			end = i
			break
		}
	}
	if end < 0 {
		return 0, blocks.Errorf(blocks.Pos{File: d.File, Line: 1, Col: 1}, "the front matter starts with --- but never ends; close it with a line holding only ---")
	}
	yamlText := src[start:d.lines[end]]
	var pf blocks.PosFunc = func(line, col int) blocks.Pos { return blocks.Pos{File: d.File, Line: line + 1, Col: col} }
	root, err := blocks.ParseYAML(yamlText, pf, "the front matter")
	if err != nil {
		return 0, err
	}
	after := len(src)
	if end+1 < len(d.lines) {
		after = d.lines[end+1]
	}
	if root == nil {
		return after, d.applySet(set, nil)
	}
	entries, err := blocks.Entries(root, pf, "the front matter", frontKeys)
	if err != nil {
		return 0, err
	}
	fm := &d.Front
	for _, e := range entries {
		switch e.Key {
		case "title", "subtitle", "author", "date":
			v, err := blocks.Scalar(e.Value, pf, e.Key)
			if err != nil {
				return 0, err
			}
			switch e.Key {
			case "title":
				fm.Title = v
			case "subtitle":
				fm.Subtitle = v
			case "author":
				fm.Author = v
			case "date":
				fm.Date = v
			}
		case "data":
			if fm.Sources, err = blocks.ParseSources(e.Value, pf); err != nil {
				return 0, err
			}
		case "params":
			pe, err := blocks.Entries(e.Value, pf, "params", nil)
			if err != nil {
				return 0, err
			}
			for _, p := range pe {
				v, err := blocks.Scalar(p.Value, pf, "params "+p.Key)
				if err != nil {
					return 0, err
				}
				fm.Params = append(fm.Params, Param{Name: p.Key, Value: v, Pos: pf.At(p.KeyN)})
			}
		case "check":
			if err := d.checkConfig(e.Value, pf); err != nil {
				return 0, err
			}
		}
	}
	return after, d.applySet(set, pf)
}

func (d *Document) checkConfig(n *yaml.Node, pf blocks.PosFunc) error {
	entries, err := blocks.Entries(n, pf, "check", checkKeys)
	if err != nil {
		return err
	}
	c := &d.Front.Check
	for _, e := range entries {
		d.Front.CheckPos[e.Key] = pf.At(e.KeyN)
		switch e.Key {
		case "alpha":
			v, err := blocks.Float(e.Value, pf, "alpha")
			if err != nil {
				return err
			}
			if v <= 0 || v >= 0.5 {
				return blocks.Errorf(pf.At(e.Value), "alpha must lie between 0 and 0.5 (0.05 is usual), not %g", v)
			}
			c.Alpha = v
		case "min-n":
			v, err := blocks.Float(e.Value, pf, "min-n")
			if err != nil || v < 1 || v != float64(int(v)) {
				return blocks.Errorf(pf.At(e.Value), "min-n must be a whole number of cases, at least 1")
			}
			c.MinN = int(v)
		case "design":
			v, err := blocks.Scalar(e.Value, pf, "design")
			if err != nil {
				return err
			}
			if v != "observational" && v != "randomized" {
				return blocks.Errorf(pf.At(e.Value), "design is observational or randomized, not %q%s", v, blocks.Suggest(v, []string{"observational", "randomized"}))
			}
			c.Design = v
		case "fail-on":
			v, err := blocks.Scalar(e.Value, pf, "fail-on")
			if err != nil {
				return err
			}
			switch v {
			case "never":
				c.FailOn = check.Never
			case "warning":
				c.FailOn = check.Warning
			case "error":
				c.FailOn = check.Error
			case "note":
				c.FailOn = check.Note
			default:
				return blocks.Errorf(pf.At(e.Value), "fail-on is never, note, warning or error, not %q", v)
			}
		case "off":
			var ids []string
			if e.Value.Kind == yaml.SequenceNode && len(e.Value.Content) == 0 {
				continue
			}
			ids, ps, err := blocks.ScalarList(e.Value, pf, "off")
			if err != nil {
				return err
			}
			var known []string
			for _, r := range check.Rules() {
				known = append(known, r.ID)
			}
			for i, id := range ids {
				if !contains(known, id) {
					return blocks.Errorf(ps[i], "off names %q, which is no rule%s", id, blocks.Suggest(id, known))
				}
			}
			c.Off = ids
		}
	}
	return nil
}

// applySet puts --set overrides into the parameters; each must name a
// declared parameter.
func (d *Document) applySet(set map[string]string, pf blocks.PosFunc) error {
	keys := make([]string, 0, len(set))
	for k := range set {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		found := false
		for i := range d.Front.Params {
			if d.Front.Params[i].Name == k {
				d.Front.Params[i].Value = set[k]
				d.Front.Params[i].Set = true
				found = true
			}
		}
		if !found {
			var names []string
			for _, p := range d.Front.Params {
				names = append(names, p.Name)
			}
			hint := blocks.Suggest(k, names)
			if hint == "" {
				hint = "; declare it under params: in the front matter first"
			}
			return blocks.Errorf(blocks.Pos{File: d.File, Line: 1, Col: 1}, "--set %s: the report has no parameter %q%s", k, k, hint)
		}
	}
	return nil
}

// ParamMap returns the parameters in force by name.
func (d *Document) ParamMap() map[string]string {
	m := map[string]string{}
	for _, p := range d.Front.Params {
		m[p.Name] = p.Value
	}
	return m
}

// findBlocks collects the analysis blocks: fenced code whose info string is
// "candor ID".
func (d *Document) findBlocks() error {
	ids := map[string]blocks.Pos{}
	return ast.Walk(d.AST, func(n ast.Node, entering bool) (ast.WalkStatus, error) {
		if !entering {
			return ast.WalkContinue, nil
		}
		fc, ok := n.(*ast.FencedCodeBlock)
		if !ok {
			return ast.WalkContinue, nil
		}
		id, isBlock, infoOff := blockID(fc, d.Source)
		if !isBlock {
			return ast.WalkSkipChildren, nil
		}
		fence := d.fencePos(infoOff)
		if id == "" {
			return ast.WalkStop, blocks.Errorf(fence, "an analysis block needs an id after candor, e.g. ```candor sales-by-store")
		}
		if prev, dup := ids[id]; dup {
			return ast.WalkStop, blocks.Errorf(fence, "block id %q is already used at line %d; give each block its own id", id, prev.Line)
		}
		ids[id] = fence
		lines := fc.Lines()
		var body bytes.Buffer
		segs := make([]text.Segment, lines.Len())
		for i := 0; i < lines.Len(); i++ {
			seg := lines.At(i)
			segs[i] = seg
			body.Write(seg.Value(d.Source))
		}
		pf := func(line, col int) blocks.Pos {
			if line < 1 || line > len(segs) {
				return fence
			}
			return d.Pos(segs[line-1].Start + col - 1)
		}
		spec, err := blocks.ParseSpec(id, fence, body.Bytes(), pf)
		if err != nil {
			return ast.WalkStop, err
		}
		d.Blocks = append(d.Blocks, spec)
		return ast.WalkSkipChildren, nil
	})
}

// blockID reads the info string: "candor ID" marks an analysis block.
func blockID(fc *ast.FencedCodeBlock, src []byte) (id string, ok bool, off int) {
	if fc.Info == nil {
		return "", false, 0
	}
	seg := fc.Info.Segment
	info := strings.Fields(string(seg.Value(src)))
	if len(info) == 0 || info[0] != "candor" {
		return "", false, 0
	}
	if len(info) > 1 {
		id = info[1]
	}
	return id, true, seg.Start
}

// fencePos is the position of the fence whose info string starts at off.
func (d *Document) fencePos(off int) blocks.Pos {
	p := d.Pos(off)
	line := d.Source[d.lines[p.Line-1]:off]
	col := bytes.IndexAny(line, "`~")
	if col < 0 {
		col = 0
	}
	p.Col = col + 1
	return p
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// sourceByName finds a source.
func (d *Document) sourceByName(name string) *blocks.SourceSpec {
	for _, s := range d.Front.Sources {
		if s.Name == name {
			return s
		}
	}
	return nil
}
