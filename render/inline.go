package render

import (
	"regexp"
	"strconv"

	"github.com/yuin/goldmark"
	"github.com/yuin/goldmark/ast"
	"github.com/yuin/goldmark/parser"
	"github.com/yuin/goldmark/text"
	"github.com/yuin/goldmark/util"
)

// KindValue is the goldmark node kind of an inline value {{ID.NAME}}.
var KindValue = ast.NewNodeKind("CandorValue")

// Value is an inline value in prose: {{ID.NAME}} or {{ID.NAME|N}}, or a
// parameter {{params.NAME}}.
type Value struct {
	ast.BaseInline
	Ref      string // ID.NAME, or params.NAME
	Decimals int    // N of |N, or -1
	Start    int    // byte offset of "{{" in the source
	End      int    // byte offset after "}}"
	RefStart int    // byte offset of the name
}

// Kind implements ast.Node.
func (v *Value) Kind() ast.NodeKind { return KindValue }

// Dump implements ast.Node.
func (v *Value) Dump(source []byte, level int) {
	ast.DumpHelper(v, source, level, map[string]string{"Ref": v.Ref}, nil)
}

var valuePattern = regexp.MustCompile(`^\{\{\s*([A-Za-z0-9_-]+(?:\.[A-Za-z0-9_-]+)+)\s*(?:\|\s*(\d{1,2})\s*)?\}\}`)

type valueParser struct{}

func (valueParser) Trigger() []byte { return []byte{'{'} }

func (valueParser) Parse(parent ast.Node, block text.Reader, pc parser.Context) ast.Node {
	line, seg := block.PeekLine()
	m := valuePattern.FindSubmatchIndex(line)
	if m == nil {
		return nil
	}
	v := &Value{Ref: string(line[m[2]:m[3]]), Decimals: -1, Start: seg.Start, End: seg.Start + m[1], RefStart: seg.Start + m[2]}
	if m[4] >= 0 {
		v.Decimals, _ = strconv.Atoi(string(line[m[4]:m[5]]))
	}
	block.Advance(m[1])
	return v
}

// valueExtension adds inline values to a goldmark parser.
type valueExtension struct{}

func (valueExtension) Extend(m goldmark.Markdown) {
	m.Parser().AddOptions(parser.WithInlineParsers(util.Prioritized(valueParser{}, 50)))
}
