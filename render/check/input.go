// Package check reads the prose of a report and judges its claims against the
// facts the blocks computed and the geometry of the figures they drew
// (FORMAT.md section 5). Each rule is a value with an ID, a Doc and a Check
// function, in its own file, registered in one list.
package check

import (
	"candor/blocks"
	"candor/figures"
)

// Input is everything the checker reads. The pipeline (package render)
// builds it; the checker parses no YAML and reads no data.
type Input struct {
	File   string
	Source []byte // the report's bytes, for positions
	Units  []Unit
	Blocks []Block
	Config Config
}

// Unit is one piece of prose outside code: a paragraph, list item, table
// cell, heading or figure caption.
type Unit struct {
	Kind    string // "paragraph", "item", "cell", "heading", "caption"
	Section int    // index of the section (0 before the first heading; each heading starts a new one)
	Prev    string // id of the block directly preceding this unit, "" if none
	Parts   []Part
	Allow   []Allow // acknowledgments on the line before the paragraph
	// Block is set for a caption: the block whose figure it captions.
	Block string
}

// Part is a run of the unit's text as the reader sees it.
type Part struct {
	Text string
	// Offset is the byte offset in Source where this part's source begins,
	// and SrcLen how many source bytes it covers. For a literal part SrcLen
	// equals len(Text) unless Markdown escapes were removed; for an inline
	// value Text is the formatted value and the source is "{{ID.NAME}}".
	Offset, SrcLen int
	// Ref is the fact name ("ID.NAME") of an inline value, "" otherwise.
	Ref string
}

// Allow is an acknowledgment: <!-- candor: allow RULE reason -->.
type Allow struct {
	Rule   string
	Reason string
	Offset int // where the comment stands in Source
}

// Block is one analysis block as the checker sees it.
type Block struct {
	Result  *blocks.Result
	Section int               // the section the block stands in
	Figure  *figures.Geometry // nil when the block drew no figure
	// Allow holds the acknowledgments on the line before the block's
	// opening fence; they apply to the findings about its figure (as do
	// those before its caption).
	Allow []Allow
}

// Config is the report's check: settings (FORMAT.md section 1 and 5).
type Config struct {
	Alpha  float64  // default 0.05
	MinN   int      // default 30
	Design string   // "observational" (default) or "randomized"
	Off    []string // rule ids switched off
	FailOn Severity // default Error; Never means nothing fails the build
}

// Severity of a finding.
type Severity int

const (
	Note Severity = iota
	Warning
	Error
	Never // only as Config.FailOn: no finding fails
)

func (s Severity) String() string {
	switch s {
	case Note:
		return "note"
	case Warning:
		return "warning"
	case Error:
		return "error"
	}
	return "never"
}

// Finding is one thing the checker reports.
type Finding struct {
	File            string
	Line, Col       int // 1-based; Col counts bytes
	EndLine, EndCol int // exclusive end
	Offset, End     int // byte offsets in Source, for marking the HTML
	Severity        Severity
	Rule            string
	Block           string // the block whose facts the claim was judged against
	Message         string
	Allowed         bool   // acknowledged with <!-- candor: allow ... -->
	Reason          string // the acknowledgment's reason
}
