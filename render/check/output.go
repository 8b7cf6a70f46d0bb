package check

import (
	"bufio"
	"encoding/json"
	"fmt"
	"io"
	"strings"
)

// WriteText writes the findings in compiler style, one a line (FORMAT.md
// section 6):
//
//	report.md:42:17: error ratio: says "nearly 1.5 times" but ... [renewals]
//
// An acknowledged finding ends with "(allowed: REASON)".
func WriteText(w io.Writer, findings []Finding) error {
	bw := bufio.NewWriter(w)
	for _, f := range findings {
		fmt.Fprintf(bw, "%s:%d:%d: %s %s: %s", f.File, f.Line, f.Col, f.Severity, f.Rule, oneLine(f.Message))
		if f.Block != "" {
			fmt.Fprintf(bw, " [%s]", f.Block)
		}
		if f.Allowed {
			r := oneLine(f.Reason)
			if r == "" {
				r = "acknowledged"
			}
			fmt.Fprintf(bw, " (allowed: %s)", r)
		}
		bw.WriteByte('\n')
	}
	return bw.Flush()
}

func oneLine(s string) string { return strings.Join(strings.Fields(s), " ") }

// jsonFinding is a finding as WriteJSON writes it.
type jsonFinding struct {
	File     string `json:"file"`
	Line     int    `json:"line"`
	Col      int    `json:"col"`
	EndLine  int    `json:"end_line"`
	EndCol   int    `json:"end_col"`
	Severity string `json:"severity"`
	Rule     string `json:"rule"`
	Block    string `json:"block"`
	Message  string `json:"message"`
	Allowed  bool   `json:"allowed,omitempty"`
	Reason   string `json:"reason,omitempty"`
}

// WriteJSON writes the findings as one JSON array of objects with the keys
// file, line, col, end_line, end_col, severity, rule, block and message
// (FORMAT.md section 6); an acknowledged finding also has "allowed": true
// and its "reason". No findings is "[]".
func WriteJSON(w io.Writer, findings []Finding) error {
	out := make([]jsonFinding, 0, len(findings))
	for _, f := range findings {
		out = append(out, jsonFinding{File: f.File, Line: f.Line, Col: f.Col, EndLine: f.EndLine, EndCol: f.EndCol,
			Severity: f.Severity.String(), Rule: f.Rule, Block: f.Block, Message: f.Message, Allowed: f.Allowed, Reason: f.Reason})
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(out)
}

// SARIF 2.1.0 (OASIS), the subset the findings need.
type sarifLog struct {
	Schema  string     `json:"$schema"`
	Version string     `json:"version"`
	Runs    []sarifRun `json:"runs"`
}

type sarifRun struct {
	Tool    sarifTool     `json:"tool"`
	Results []sarifResult `json:"results"`
}

type sarifTool struct {
	Driver sarifDriver `json:"driver"`
}

type sarifDriver struct {
	Name           string      `json:"name"`
	InformationURI string      `json:"informationUri,omitempty"`
	Rules          []sarifRule `json:"rules"`
}

type sarifRule struct {
	ID                   string       `json:"id"`
	ShortDescription     sarifMessage `json:"shortDescription"`
	FullDescription      sarifMessage `json:"fullDescription"`
	DefaultConfiguration sarifConfig  `json:"defaultConfiguration"`
}

type sarifConfig struct {
	Level string `json:"level"`
}

type sarifMessage struct {
	Text string `json:"text"`
}

type sarifResult struct {
	RuleID       string             `json:"ruleId"`
	RuleIndex    int                `json:"ruleIndex"`
	Level        string             `json:"level"`
	Message      sarifMessage       `json:"message"`
	Locations    []sarifLocation    `json:"locations"`
	Suppressions []sarifSuppression `json:"suppressions,omitempty"`
}

type sarifLocation struct {
	PhysicalLocation sarifPhysical `json:"physicalLocation"`
}

type sarifPhysical struct {
	ArtifactLocation sarifArtifact `json:"artifactLocation"`
	Region           sarifRegion   `json:"region"`
}

type sarifArtifact struct {
	URI string `json:"uri"`
}

type sarifRegion struct {
	StartLine   int `json:"startLine"`
	StartColumn int `json:"startColumn"`
	EndLine     int `json:"endLine,omitempty"`
	EndColumn   int `json:"endColumn,omitempty"`
}

type sarifSuppression struct {
	Kind          string `json:"kind"`
	Justification string `json:"justification,omitempty"`
}

// defaultLevel is the severity a rule reports most often, for SARIF's
// defaultConfiguration.
var defaultLevel = map[string]Severity{
	"number": Error, "ratio": Error, "points": Error, "direction": Error, "significance": Error, "strength": Warning,
	"causal": Warning, "quantifier": Error, "sample": Warning, "extrapolation": Warning, "zero-axis": Warning,
	"lie-factor": Error, "partial-series": Warning, "chart-choice": Warning, "unshown-fit": Warning,
}

// WriteSARIF writes the findings as a SARIF 2.1.0 log with one run: the
// tool's driver is candor with a rules array built from the registered
// rules (id, first sentence of the Doc, the whole Doc), and each finding is
// a result with its ruleId, level, message and the physical location of
// its region. Acknowledged findings carry an in-source suppression with the
// reason. The output is deterministic: rules in registration order,
// results in the order given. Columns are the findings' byte columns,
// equal to SARIF's default UTF-16 columns on ASCII lines.
func WriteSARIF(w io.Writer, findings []Finding) error {
	index := map[string]int{}
	var rules []sarifRule
	for i, r := range registry {
		index[r.ID] = i
		lvl := defaultLevel[r.ID]
		rules = append(rules, sarifRule{ID: r.ID, ShortDescription: sarifMessage{firstSentence(r.Doc)},
			FullDescription: sarifMessage{r.Doc}, DefaultConfiguration: sarifConfig{lvl.String()}})
	}
	results := make([]sarifResult, 0, len(findings))
	for _, f := range findings {
		idx, ok := index[f.Rule]
		if !ok {
			idx = -1
		}
		msg := f.Message
		if f.Block != "" {
			msg += " [" + f.Block + "]"
		}
		res := sarifResult{RuleID: f.Rule, RuleIndex: idx, Level: f.Severity.String(), Message: sarifMessage{msg},
			Locations: []sarifLocation{{PhysicalLocation: sarifPhysical{
				ArtifactLocation: sarifArtifact{URI: strings.ReplaceAll(f.File, "\\", "/")},
				Region:           sarifRegion{StartLine: max(f.Line, 1), StartColumn: max(f.Col, 1), EndLine: f.EndLine, EndColumn: f.EndCol},
			}}}}
		if f.Allowed {
			res.Suppressions = []sarifSuppression{{Kind: "inSource", Justification: f.Reason}}
		}
		results = append(results, res)
	}
	log := sarifLog{
		Schema:  "https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json",
		Version: "2.1.0",
		Runs:    []sarifRun{{Tool: sarifTool{Driver: sarifDriver{Name: "candor", Rules: rules}}, Results: results}},
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(log)
}

// firstSentence returns a Doc's first sentence.
func firstSentence(doc string) string {
	for i := 0; i+1 < len(doc); i++ {
		if doc[i] == '.' && doc[i+1] == ' ' && !strings.HasSuffix(doc[:i], "e.g") && !strings.HasSuffix(doc[:i], "i.e") {
			return doc[:i+1]
		}
	}
	return doc
}
