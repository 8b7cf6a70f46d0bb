package blocks

import (
	"crypto/sha256"
	"encoding/hex"
	"fmt"
	"regexp"
	"sort"
	"strings"

	"gopkg.in/yaml.v3"
)

// Analyses are the analysis keys of FORMAT.md section 2, in its order.
var Analyses = []string{"summary", "frequency", "crosstab", "compare", "correlation", "regression", "trend", "stemleaf"}

// commonKeys may appear in every block.
var commonKeys = []string{"data", "where", "chart", "title", "caption", "order", "percent", "axis", "table"}

// analysisKeys are the further keys each analysis takes.
var analysisKeys = map[string][]string{
	"summary":     {"by"},
	"frequency":   {"bins"},
	"crosstab":    nil,
	"compare":     {"by", "success", "reference"},
	"correlation": nil,
	"regression":  {"predictors", "predict", "intercept"},
	"trend":       {"time", "by", "success", "reference"},
	"stemleaf":    nil,
}

// Charts are the values `chart:` takes.
var Charts = []string{"bar", "histogram", "dot", "pie", "stacked", "grouped", "scatter", "line", "box", "none"}

var idPattern = regexp.MustCompile(`^[A-Za-z0-9_-]+$`)

// ValidID reports whether id may name a block.
func ValidID(id string) bool { return idPattern.MatchString(id) }

// Spec is one analysis block as written, with the position of every value
// for messages.
type Spec struct {
	ID       string
	Pos      Pos // the opening fence
	Analysis string
	// Target is the analysed column or columns (the analysis key's value).
	Target    []string
	TargetPos []Pos

	Data       string
	DataPos    Pos
	Where      []Cond
	Chart      string
	Title      string
	TitlePos   Pos
	Caption    string
	CaptionPos Pos
	Order      []string
	Percent    bool
	AxisMin    *float64
	AxisMax    *float64
	Table      bool // false hides the result table

	By        string
	ByPos     Pos
	Success   string
	HasSucc   bool
	Reference string
	RefPos    Pos
	Bins      Bins
	BinsPos   Pos

	Predictors    []string
	PredictorsPos []Pos
	Predict       []map[string]float64
	PredictPos    []Pos
	Intercept     bool

	Time    string
	TimePos Pos

	// KeyPos holds the position of each key present, for messages about it.
	KeyPos map[string]Pos
	// Hash is the SHA-256 of the block's id and body: with the data's hash it
	// keys the result cache.
	Hash string
}

// Bins is the frequency binning of a numeric column: a count, a rule
// ("sturges", "scott", "fd") or explicit edges.
type Bins struct {
	Count int
	Rule  string
	Edges []float64
}

func (b Bins) set() bool { return b.Count > 0 || b.Rule != "" || len(b.Edges) > 0 }

// Cond is one where: condition, `column op value`.
type Cond struct {
	Column string
	Op     string // = != < <= > >= in
	Values []string
	Text   string // as written
	Pos    Pos
}

// ParseSpec decodes a block body. pf maps positions in body to the report.
func ParseSpec(id string, fence Pos, body []byte, pf PosFunc) (*Spec, error) {
	if !ValidID(id) {
		return nil, Errorf(fence, "block id %q may hold only letters, digits, - and _", id)
	}
	h := sha256.New()
	fmt.Fprintf(h, "%s\x00%s", id, body)
	s := &Spec{ID: id, Pos: fence, Table: true, Intercept: true, KeyPos: map[string]Pos{}, Hash: hex.EncodeToString(h.Sum(nil))}
	root, err := ParseYAML(body, pf, "block "+id)
	if err != nil {
		return nil, err
	}
	if root == nil {
		return nil, Errorf(fence, "block %s is empty; give it one analysis key, e.g. \"summary: COLUMN\" (one of %s)", id, strings.Join(Analyses, ", "))
	}
	all := append([]string{}, Analyses...)
	all = append(all, commonKeys...)
	seenKey := map[string]bool{}
	for _, ks := range analysisKeys {
		for _, k := range ks {
			if !seenKey[k] {
				seenKey[k] = true
				all = append(all, k)
			}
		}
	}
	what := "block " + id
	entries, err := Entries(root, pf, what, all)
	if err != nil {
		return nil, err
	}
	// Exactly one analysis key.
	for _, e := range entries {
		s.KeyPos[e.Key] = pf.At(e.KeyN)
		if contains(Analyses, e.Key) {
			if s.Analysis != "" {
				return nil, Errorf(pf.At(e.KeyN), "block %s has two analysis keys, %q and %q; a block runs one analysis, so split it into two blocks", id, s.Analysis, e.Key)
			}
			s.Analysis = e.Key
			if s.Target, s.TargetPos, err = ScalarList(e.Value, pf, e.Key); err != nil {
				return nil, err
			}
		}
	}
	if s.Analysis == "" {
		return nil, Errorf(fence, "block %s has no analysis key; add one of %s", id, strings.Join(Analyses, ", "))
	}
	allowed := append(append([]string{}, commonKeys...), analysisKeys[s.Analysis]...)
	for _, e := range entries {
		if contains(Analyses, e.Key) {
			continue
		}
		if !contains(allowed, e.Key) {
			var takers []string
			for _, a := range Analyses {
				if contains(analysisKeys[a], e.Key) {
					takers = append(takers, a)
				}
			}
			return nil, Errorf(pf.At(e.KeyN), "%s: key %q does not apply to %s; it belongs to %s", what, e.Key, s.Analysis, strings.Join(takers, ", "))
		}
		if err := s.setKey(e, pf); err != nil {
			return nil, err
		}
	}
	return s, s.validate(pf)
}

func (s *Spec) setKey(e MapEntry, pf PosFunc) error {
	v := e.Value
	var err error
	switch e.Key {
	case "data":
		s.Data, err = Scalar(v, pf, "data")
		s.DataPos = pf.At(v)
	case "where":
		s.Where, err = parseWhere(v, pf)
	case "chart":
		s.Chart, err = Scalar(v, pf, "chart")
		if err == nil && !contains(Charts, s.Chart) {
			err = Errorf(pf.At(v), "chart %q is not a chart kind%s", s.Chart, suggestOrList(s.Chart, Charts))
		}
	case "title":
		s.Title, err = Scalar(v, pf, "title")
		s.TitlePos = pf.At(v)
	case "caption":
		s.Caption, err = Scalar(v, pf, "caption")
		s.CaptionPos = pf.At(v)
	case "order":
		s.Order, _, err = ScalarList(v, pf, "order")
	case "percent":
		s.Percent, err = Bool(v, pf, "percent")
	case "table":
		s.Table, err = Bool(v, pf, "table")
	case "intercept":
		s.Intercept, err = Bool(v, pf, "intercept")
	case "axis":
		err = s.parseAxis(v, pf)
	case "by":
		s.By, err = Scalar(v, pf, "by")
		s.ByPos = pf.At(v)
	case "success":
		s.Success, err = Scalar(v, pf, "success")
		s.HasSucc = true
	case "reference":
		s.Reference, err = Scalar(v, pf, "reference")
		s.RefPos = pf.At(v)
	case "time":
		s.Time, err = Scalar(v, pf, "time")
		s.TimePos = pf.At(v)
	case "bins":
		s.BinsPos = pf.At(v)
		err = s.parseBins(v, pf)
	case "predictors":
		s.Predictors, s.PredictorsPos, err = ScalarList(v, pf, "predictors")
	case "predict":
		err = s.parsePredict(v, pf)
	}
	return err
}

func (s *Spec) parseAxis(v *yaml.Node, pf PosFunc) error {
	entries, err := Entries(v, pf, "axis", []string{"min", "max"})
	if err != nil {
		return err
	}
	for _, e := range entries {
		f, err := Float(e.Value, pf, "axis "+e.Key)
		if err != nil {
			return err
		}
		if e.Key == "min" {
			s.AxisMin = &f
		} else {
			s.AxisMax = &f
		}
	}
	if s.AxisMin != nil && s.AxisMax != nil && *s.AxisMin >= *s.AxisMax {
		return Errorf(pf.At(v), "axis: min (%g) must be below max (%g)", *s.AxisMin, *s.AxisMax)
	}
	return nil
}

func (s *Spec) parseBins(v *yaml.Node, pf PosFunc) error {
	if v.Kind == yaml.SequenceNode {
		for _, c := range v.Content {
			f, err := Float(c, pf, "bins")
			if err != nil {
				return err
			}
			if n := len(s.Bins.Edges); n > 0 && f <= s.Bins.Edges[n-1] {
				return Errorf(pf.At(c), "bins: edges must increase, but %g follows %g", f, s.Bins.Edges[n-1])
			}
			s.Bins.Edges = append(s.Bins.Edges, f)
		}
		if len(s.Bins.Edges) < 2 {
			return Errorf(pf.At(v), "bins: a list of edges needs at least two, e.g. [0, 10, 20]")
		}
		return nil
	}
	t, err := Scalar(v, pf, "bins")
	if err != nil {
		return err
	}
	switch strings.ToLower(t) {
	case "sturges", "scott", "fd":
		s.Bins.Rule = strings.ToLower(t)
		return nil
	}
	var n int
	if _, err := fmt.Sscanf(t, "%d", &n); err != nil || fmt.Sprint(n) != t || n < 1 || n > 200 {
		return Errorf(pf.At(v), "bins takes a count from 1 to 200, sturges, scott, fd, or a list of edges, not %q", t)
	}
	s.Bins.Count = n
	return nil
}

func (s *Spec) parsePredict(v *yaml.Node, pf PosFunc) error {
	if v.Kind != yaml.SequenceNode {
		return Errorf(pf.At(v), "predict takes a list of predictor values, e.g. [{visits: 30}]")
	}
	for _, c := range v.Content {
		entries, err := Entries(c, pf, "predict", nil)
		if err != nil {
			return err
		}
		m := map[string]float64{}
		for _, e := range entries {
			f, err := Float(e.Value, pf, "predict "+e.Key)
			if err != nil {
				return err
			}
			m[e.Key] = f
		}
		s.Predict = append(s.Predict, m)
		s.PredictPos = append(s.PredictPos, pf.At(c))
	}
	return nil
}

var condPattern = regexp.MustCompile(`^\s*([^\s<>=!]+)\s*(<=|>=|!=|=|<|>|\bin\b)\s*(.*?)\s*$`)

// Ops are the where: operators.
var Ops = []string{"=", "!=", "<", "<=", ">", ">=", "in"}

func parseWhere(v *yaml.Node, pf PosFunc) ([]Cond, error) {
	var nodes []*yaml.Node
	switch v.Kind {
	case yaml.ScalarNode:
		nodes = []*yaml.Node{v}
	case yaml.SequenceNode:
		nodes = v.Content
	default:
		return nil, Errorf(pf.At(v), "where takes a list of conditions like \"region = North\"")
	}
	var out []Cond
	for _, n := range nodes {
		if n.Kind != yaml.ScalarNode {
			return nil, Errorf(pf.At(n), "where: write each condition as one line, \"column op value\", e.g. \"visits >= 3\" (quote it if it holds a colon)")
		}
		m := condPattern.FindStringSubmatch(n.Value)
		if m == nil || m[3] == "" {
			return nil, Errorf(pf.At(n), "where: cannot read %q; write \"column op value\" with op one of %s", n.Value, strings.Join(Ops, " "))
		}
		c := Cond{Column: m[1], Op: m[2], Text: strings.TrimSpace(n.Value), Pos: pf.At(n)}
		val := m[3]
		if c.Op == "in" {
			val = strings.TrimSpace(val)
			if !strings.HasPrefix(val, "[") || !strings.HasSuffix(val, "]") {
				return nil, Errorf(pf.At(n), "where: in takes a list in brackets, e.g. \"region in [North, South]\"")
			}
			for _, p := range strings.Split(val[1:len(val)-1], ",") {
				if p = unquote(strings.TrimSpace(p)); p != "" {
					c.Values = append(c.Values, p)
				}
			}
			if len(c.Values) == 0 {
				return nil, Errorf(pf.At(n), "where: the list after in is empty")
			}
		} else {
			c.Values = []string{unquote(val)}
		}
		out = append(out, c)
	}
	return out, nil
}

func unquote(s string) string {
	if len(s) >= 2 && (s[0] == '"' && s[len(s)-1] == '"' || s[0] == '\'' && s[len(s)-1] == '\'') {
		return s[1 : len(s)-1]
	}
	return s
}

// validate checks what each analysis needs.
func (s *Spec) validate(pf PosFunc) error {
	at := s.KeyPos[s.Analysis]
	need := func(key, what string) error {
		return Errorf(at, "%s needs %s; add \"%s:\"", s.Analysis, what, key)
	}
	switch s.Analysis {
	case "crosstab", "correlation":
		if len(s.Target) != 2 {
			return Errorf(s.TargetPos[0], "%s takes two columns, e.g. [%s, other]", s.Analysis, s.Target[0])
		}
	case "frequency", "compare", "regression", "trend", "stemleaf":
		if len(s.Target) != 1 {
			return Errorf(s.TargetPos[1], "%s takes one column; for more, write one block each", s.Analysis)
		}
	}
	switch s.Analysis {
	case "compare":
		if s.By == "" {
			return need("by", "a grouping column")
		}
	case "regression":
		if len(s.Predictors) == 0 {
			return need("predictors", "a list of predictor columns")
		}
	case "trend":
		if s.Time == "" {
			return need("time", "a time column")
		}
	}
	if s.Bins.set() && s.Analysis != "frequency" {
		return Errorf(s.BinsPos, "bins applies to frequency only")
	}
	return nil
}

// Columns returns every column the block reads, sorted, for messages and
// for SQL push-down.
func (s *Spec) Columns() []string {
	set := map[string]bool{}
	for _, c := range s.Target {
		set[c] = true
	}
	for _, c := range s.Predictors {
		set[c] = true
	}
	for _, c := range []string{s.By, s.Time} {
		if c != "" {
			set[c] = true
		}
	}
	for _, c := range s.Where {
		set[c.Column] = true
	}
	var out []string
	for c := range set {
		out = append(out, c)
	}
	sort.Strings(out)
	return out
}
