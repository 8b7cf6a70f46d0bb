package blocks

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strings"
	"time"

	"gopkg.in/yaml.v3"
)

// SourceSpec is one entry of the front matter's `data:` (FORMAT.md section 1).
type SourceSpec struct {
	Name string
	Pos  Pos
	// Kind is "csv", "tsv", "xlsx", "sqlite" or "postgres".
	Kind      string
	File      string // csv, tsv, xlsx: the path as written; sqlite: the database file
	FilePos   Pos
	Sheet     string
	SheetPos  Pos
	Delimiter rune
	Query     string
	QueryPos  Pos
	// QueryPlain is true when the query is a plain YAML scalar, so that a
	// byte offset in it maps to a column of the report.
	QueryPlain bool
	EnvVar     string // postgres: the environment variable holding the DSN
	Types      map[string]ColType
	TypesPos   map[string]Pos
	Missing    []string
}

// DefaultMissing are the tokens read as missing when a source names none.
var DefaultMissing = []string{"", "NA", "n/a"}

var sourceKeys = []string{"file", "sheet", "delimiter", "columns", "missing", "sqlite", "postgres", "query"}

// ParseSources reads the front matter's data: mapping.
func ParseSources(n *yaml.Node, pf PosFunc) ([]*SourceSpec, error) {
	entries, err := Entries(n, pf, "data", nil)
	if err != nil {
		return nil, err
	}
	var out []*SourceSpec
	for _, e := range entries {
		s, err := parseSource(e, pf)
		if err != nil {
			return nil, err
		}
		out = append(out, s)
	}
	return out, nil
}

func parseSource(e MapEntry, pf PosFunc) (*SourceSpec, error) {
	s := &SourceSpec{Name: e.Key, Pos: pf.At(e.KeyN), Missing: DefaultMissing, Types: map[string]ColType{}, TypesPos: map[string]Pos{}}
	if !ValidID(e.Key) {
		return nil, Errorf(s.Pos, "data source name %q may hold only letters, digits, - and _", e.Key)
	}
	v := e.Value
	if v.Kind == yaml.ScalarNode {
		f, err := Scalar(v, pf, "data "+e.Key)
		if err != nil {
			return nil, err
		}
		s.File, s.FilePos = f, pf.At(v)
		return s, s.fileKind()
	}
	entries, err := Entries(v, pf, "data "+e.Key, sourceKeys)
	if err != nil {
		return nil, err
	}
	for _, f := range entries {
		var err error
		switch f.Key {
		case "file":
			s.File, err = Scalar(f.Value, pf, "file")
			s.FilePos = pf.At(f.Value)
		case "sheet":
			s.Sheet, err = Scalar(f.Value, pf, "sheet")
			s.SheetPos = pf.At(f.Value)
		case "delimiter":
			var d string
			d, err = Scalar(f.Value, pf, "delimiter")
			if err == nil {
				switch d {
				case "\\t", "tab", "\t":
					s.Delimiter = '\t'
				default:
					r := []rune(d)
					if len(r) != 1 || r[0] == '"' || r[0] == '\n' || r[0] == '\r' {
						err = Errorf(pf.At(f.Value), "delimiter must be one character, e.g. \";\" or \"tab\"")
					} else {
						s.Delimiter = r[0]
					}
				}
			}
		case "columns":
			err = s.parseTypes(f.Value, pf)
		case "missing":
			s.Missing, _, err = ScalarList(f.Value, pf, "missing")
			s.Missing = append(s.Missing, "")
		case "sqlite":
			s.Kind = "sqlite"
			s.File, err = Scalar(f.Value, pf, "sqlite")
			s.FilePos = pf.At(f.Value)
		case "postgres":
			s.Kind = "postgres"
			s.EnvVar, err = Scalar(f.Value, pf, "postgres")
			s.FilePos = pf.At(f.Value)
			if err == nil && (strings.Contains(s.EnvVar, "://") || strings.Contains(s.EnvVar, "=")) {
				err = Errorf(pf.At(f.Value), "postgres takes the name of an environment variable that holds the connection string, never the connection string itself")
			}
		case "query":
			s.Query, err = Scalar(f.Value, pf, "query")
			s.QueryPos = pf.At(f.Value)
			s.QueryPlain = f.Value.Style == 0
		}
		if err != nil {
			return nil, err
		}
	}
	switch s.Kind {
	case "sqlite", "postgres":
		if s.Query == "" {
			return nil, Errorf(s.Pos, "data %s: a %s source needs a query, e.g. query: SELECT store, total FROM orders", s.Name, s.Kind)
		}
		if s.Sheet != "" {
			return nil, Errorf(s.SheetPos, "data %s: sheet applies to .xlsx files only", s.Name)
		}
		if s.Kind == "sqlite" && s.File == "" {
			return nil, Errorf(s.FilePos, "data %s: sqlite takes the path of the database file, relative to the report", s.Name)
		}
		if s.Kind == "postgres" && s.EnvVar == "" {
			return nil, Errorf(s.FilePos, "data %s: postgres takes the name of an environment variable holding the connection string, e.g. postgres: LEDGER_URL", s.Name)
		}
		return s, nil
	}
	if s.Query != "" {
		return nil, Errorf(s.QueryPos, "data %s: query applies to sqlite and postgres sources only", s.Name)
	}
	if s.File == "" {
		return nil, Errorf(s.Pos, "data %s needs a file (or sqlite:/postgres: with a query)", s.Name)
	}
	if err := s.fileKind(); err != nil {
		return nil, err
	}
	if s.Sheet != "" && s.Kind != "xlsx" {
		return nil, Errorf(s.SheetPos, "data %s: sheet applies to .xlsx files only, and %s is a %s file", s.Name, s.File, s.Kind)
	}
	return s, nil
}

func (s *SourceSpec) fileKind() error {
	switch strings.ToLower(filepath.Ext(s.File)) {
	case ".csv":
		s.Kind = "csv"
	case ".tsv", ".tab":
		s.Kind = "tsv"
	case ".xlsx":
		s.Kind = "xlsx"
	case ".txt":
		s.Kind = "csv"
	default:
		return Errorf(s.FilePos, "data %s: cannot tell the format of %q; use a .csv, .tsv or .xlsx file", s.Name, s.File)
	}
	if s.Kind == "tsv" && s.Delimiter == 0 {
		s.Delimiter = '\t'
	}
	if s.Delimiter == 0 {
		s.Delimiter = ','
	}
	return nil
}

func (s *SourceSpec) parseTypes(v *yaml.Node, pf PosFunc) error {
	entries, err := Entries(v, pf, "columns", nil)
	if err != nil {
		return err
	}
	for _, e := range entries {
		t, err := Scalar(e.Value, pf, "columns "+e.Key)
		if err != nil {
			return err
		}
		ct, ok := parseColType(t)
		if !ok {
			return Errorf(pf.At(e.Value), "column type %q is not one of %s%s", t, strings.Join(ColTypes, ", "), Suggest(t, ColTypes))
		}
		s.Types[e.Key] = ct
		s.TypesPos[e.Key] = pf.At(e.KeyN)
	}
	return nil
}

// isMissing reports whether text is one of the source's missing tokens.
func (s *SourceSpec) isMissing(text string) bool {
	for _, m := range s.Missing {
		if text == m {
			return true
		}
	}
	return false
}

var periodPattern = regexp.MustCompile(`^\d{4}(-(\d{2}(-\d{2})?|Q[1-4]|H[12]|W\d{2}))?$`)
var datePattern = regexp.MustCompile(`^\d{4}-\d{2}-\d{2}$`)

// isPeriod reports whether s is an ISO date, a month (2026-03), a quarter
// (2026-Q3), a half, an ISO week (2026-W07) or a year: text whose lexical
// order is its time order.
func isPeriod(s string) bool {
	if !periodPattern.MatchString(s) {
		return false
	}
	switch len(s) {
	case 10:
		_, err := time.Parse("2006-01-02", s)
		return err == nil
	case 7:
		if s[5] >= '0' && s[5] <= '9' {
			_, err := time.Parse("2006-01", s)
			return err == nil
		}
	case 8: // 2026-W07
		w := (int(s[6])-'0')*10 + int(s[7]) - '0'
		return w >= 1 && w <= 53
	}
	return true
}

// isDate reports whether s is a valid ISO date.
func isDate(s string) bool { return datePattern.MatchString(s) && isPeriod(s) }

// checkHints reports a type hint naming no column, suggesting the nearest.
func (s *SourceSpec) checkHints(names []string) error {
	keys := make([]string, 0, len(s.Types))
	for k := range s.Types {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	what := s.File + " does not have"
	if s.Kind == "sqlite" || s.Kind == "postgres" {
		what = "the query does not return"
	}
	for _, k := range keys {
		if !contains(names, k) {
			return Errorf(s.TypesPos[k], "data %s: columns names %q, which %s%s", s.Name, k, what, suggestOrList(k, names))
		}
	}
	return nil
}

// Env is what loading needs to know about the report's surroundings.
type Env struct {
	// Dir is the report's folder; file sources are relative to it.
	Dir string
	// Root is the folder tree file sources must resolve inside (default Dir).
	Root string
	// Params are the report's parameters after --set, bound into queries.
	Params map[string]string
	// Getenv reads environment variables (os.Getenv when nil).
	Getenv func(string) string
}

// Load reads a source into a table.
func Load(s *SourceSpec, env Env) (*Dataset, error) {
	switch s.Kind {
	case "csv", "tsv":
		path, err := resolveFile(s, env)
		if err != nil {
			return nil, err
		}
		b, err := os.ReadFile(path)
		if err != nil {
			return nil, Errorf(s.FilePos, "data %s: cannot read %s: %v", s.Name, s.File, errors.Unwrap(err))
		}
		return readDelimited(s, path, b)
	case "xlsx":
		return loadXLSX(s, env)
	case "sqlite", "postgres":
		return loadSQL(s, env)
	}
	return nil, Errorf(s.Pos, "data %s: %s sources are not supported; use a .csv, .tsv or .xlsx file, or sqlite: or postgres: with a query", s.Name, s.Kind)
}

// resolveFile returns the source file's path, which must lie inside the
// report's folder tree (or --data-root), symbolic links resolved.
func resolveFile(s *SourceSpec, env Env) (string, error) {
	path := s.File
	if !filepath.IsAbs(path) {
		path = filepath.Join(env.Dir, path)
	}
	if _, err := os.Stat(path); err != nil {
		msg := fmt.Sprintf("data %s: file %s not found", s.Name, s.File)
		if os.IsPermission(err) {
			msg = fmt.Sprintf("data %s: file %s cannot be read (permission denied)", s.Name, s.File)
		} else if near := nearbyFiles(path); near != "" {
			msg += near
		} else {
			msg += fmt.Sprintf("; the path is relative to the report's folder (%s)", displayDir(env.Dir))
		}
		return "", Errorf(s.FilePos, "%s", msg)
	}
	root := env.Root
	if root == "" {
		root = env.Dir
	}
	realRoot, err1 := filepath.EvalSymlinks(root)
	realPath, err2 := filepath.EvalSymlinks(path)
	if err1 != nil || err2 != nil {
		return "", Errorf(s.FilePos, "data %s: cannot resolve %s", s.Name, s.File)
	}
	realRoot, _ = filepath.Abs(realRoot)
	realPath, _ = filepath.Abs(realPath)
	if rel, err := filepath.Rel(realRoot, realPath); err != nil || rel == ".." || strings.HasPrefix(rel, ".."+string(filepath.Separator)) {
		return "", Errorf(s.FilePos, "data %s: %s lies outside the report's folder (%s); move it inside, or allow a wider folder with --data-root DIR", s.Name, s.File, displayDir(root))
	}
	return path, nil
}

func displayDir(d string) string {
	if d == "" {
		return "."
	}
	return d
}

// nearbyFiles suggests files beside a missing path with a similar name.
func nearbyFiles(path string) string {
	entries, err := os.ReadDir(filepath.Dir(path))
	if err != nil {
		return ""
	}
	var names []string
	for _, e := range entries {
		names = append(names, e.Name())
	}
	return Suggest(filepath.Base(path), names)
}
