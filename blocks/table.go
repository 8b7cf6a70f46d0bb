package blocks

import (
	"math"
	"sort"
	"strconv"
	"sync"

	"github.com/go-gota/gota/series"

	"candor/blocks/stats"
)

// ColType is a column's level of measurement (FORMAT.md section 1 `columns:`).
type ColType uint8

const (
	TypeNumber ColType = iota
	TypeCategory
	TypeDate
	TypeText
	TypeBinary
)

var colTypeNames = [...]string{"number", "category", "date", "text", "binary"}

func (t ColType) String() string { return colTypeNames[t] }

// ColTypes lists the type hint names.
var ColTypes = []string{"number", "category", "date", "text", "binary"}

func parseColType(s string) (ColType, bool) {
	for i, n := range colTypeNames {
		if n == s {
			return ColType(i), true
		}
	}
	return 0, false
}

// Column is one typed column. A number column keeps its values in the exact
// decimal shifted form (stats.Values: Offset + D[i]) that the statistics need
// on hard data; a missing number is NaN in D. Other columns keep their text,
// "" for missing.
type Column struct {
	Name string
	Type ColType
	Num  stats.Values
	Str  []string
	// Decimals is the most digits after the decimal point that a number of
	// this column was written with, or -1 when unknown (exponent notation,
	// a database float).
	Decimals int
}

// Snap rounds x, a value computed from this column by order statistics
// (a minimum, a quartile), to the decimals the data were written with plus
// extra, which undoes the last-bit error of adding the shift back. Columns
// of unknown precision come back unchanged.
func (c *Column) Snap(x float64, extra int) float64 {
	if c.Decimals < 0 || math.IsNaN(x) || math.IsInf(x, 0) || math.Abs(x) >= 1e15 {
		return x
	}
	d := c.Decimals + extra
	if d > 15 {
		return x
	}
	y, err := strconv.ParseFloat(strconv.FormatFloat(x, 'f', d, 64), 64)
	if err != nil {
		return x
	}
	return y
}

// Missing reports whether row i is missing.
func (c *Column) Missing(i int) bool {
	if c.Type == TypeNumber {
		return math.IsNaN(c.Num.D[i])
	}
	return c.Str[i] == ""
}

// Len is the number of rows.
func (c *Column) Len() int {
	if c.Type == TypeNumber {
		return len(c.Num.D)
	}
	return len(c.Str)
}

// Text returns row i as text: a number in its shortest exact form.
func (c *Column) Text(i int) string {
	if c.Type == TypeNumber {
		if math.IsNaN(c.Num.D[i]) {
			return ""
		}
		return strconv.FormatFloat(c.Num.At(i), 'g', -1, 64)
	}
	return c.Str[i]
}

// Dataset is one loaded data source: a gota data frame with the typed columns
// beside it, and where it came from.
type Dataset struct {
	Source string // the source name in the front matter
	File   string // the file as the report names it (or the SQL source's description)
	SHA256 string // of the file's bytes, or of the query result
	Cols   []*Column
	byName map[string]int
	// frame is the gota frame, built when first asked for (Frame, Series;
	// frame.go).
	frame     *lazyFrame
	frameInit sync.Once

	// HashOf says what SHA256 is of: "" for a file's bytes; "query" for a
	// SQL source as the report lists it: its query text, bound parameters,
	// result columns and row count, not its values (source_sql.go); "rows"
	// for a SQL source's rows once a block read them.
	HashOf string
	// sql is the handle of a SQL source, read lazily (source_sql.go,
	// pushdown.go); nil for every other data set. Cols stay empty until a
	// block needs rows: Run then uses the data set sql.rows() returns.
	sql *sqlSource
}

// NewDataset builds a data set from typed columns of equal length; its gota
// frame is built when first asked for (Frame, Series).
func NewDataset(source, file, sum string, cols []*Column) *Dataset {
	t := &Dataset{Source: source, File: file, SHA256: sum, Cols: cols, byName: map[string]int{}}
	for i, c := range cols {
		t.byName[c.Name] = i
	}
	return t
}

func toSeries(c *Column) series.Series {
	if c.Type == TypeNumber {
		vals := make([]float64, len(c.Num.D))
		for i := range vals {
			vals[i] = c.Num.At(i)
		}
		return series.New(vals, series.Float, c.Name)
	}
	vals := make([]string, len(c.Str))
	for i, s := range c.Str {
		if s == "" {
			s = "NaN" // gota's mark for a missing element
		}
		vals[i] = s
	}
	return series.New(vals, series.String, c.Name)
}

// Rows is the number of rows.
func (t *Dataset) Rows() int {
	if t.sql != nil && len(t.Cols) == 0 {
		return t.sql.count
	}
	if len(t.Cols) == 0 {
		return 0
	}
	return t.Cols[0].Len()
}

// Col returns the named column or nil.
func (t *Dataset) Col(name string) *Column {
	if i, ok := t.byName[name]; ok && i < len(t.Cols) {
		return t.Cols[i]
	}
	return nil
}

// Names returns the column names in file order.
func (t *Dataset) Names() []string {
	if t.sql != nil && len(t.Cols) == 0 {
		return t.sql.names()
	}
	out := make([]string, len(t.Cols))
	for i, c := range t.Cols {
		out[i] = c.Name
	}
	return out
}

// Subset returns the rows idx (in that order) as a new table.
func (t *Dataset) Subset(idx []int) *Dataset {
	cols := make([]*Column, len(t.Cols))
	for i, c := range t.Cols {
		nc := &Column{Name: c.Name, Type: c.Type, Decimals: c.Decimals}
		if c.Type == TypeNumber {
			nc.Num = c.Num.Subset(idx)
		} else {
			nc.Str = make([]string, len(idx))
			for k, j := range idx {
				nc.Str[k] = c.Str[j]
			}
		}
		cols[i] = nc
	}
	return &Dataset{Source: t.Source, File: t.File, SHA256: t.SHA256, HashOf: t.HashOf, Cols: cols, byName: t.byName}
}

// Only returns the data set with just the named columns (those it has), in
// its own column order, sharing their values.
func (t *Dataset) Only(names []string) *Dataset {
	if t.sql != nil && len(t.Cols) == 0 {
		return t
	}
	want := map[string]bool{}
	for _, n := range names {
		want[n] = true
	}
	nt := &Dataset{Source: t.Source, File: t.File, SHA256: t.SHA256, HashOf: t.HashOf, byName: map[string]int{}}
	for _, c := range t.Cols {
		if want[c.Name] {
			nt.byName[c.Name] = len(nt.Cols)
			nt.Cols = append(nt.Cols, c)
		}
	}
	if len(nt.Cols) == len(t.Cols) {
		return t
	}
	return nt
}

// Levels returns the distinct non-missing values of a column as text, in
// order of first appearance.
func (c *Column) Levels() []string {
	out, _ := c.LevelsUpTo(-1)
	return out
}

// LevelsUpTo is Levels that stops after max+1 distinct values (max < 0: no
// limit); complete is false when it stopped early.
func (c *Column) LevelsUpTo(max int) (levels []string, complete bool) {
	if c.Type == TypeNumber {
		seen := map[float64]bool{}
		for i, d := range c.Num.D {
			if math.IsNaN(d) || seen[d] {
				continue
			}
			if max >= 0 && len(levels) > max {
				return levels, false
			}
			seen[d] = true
			levels = append(levels, c.Text(i))
		}
		return levels, true
	}
	seen := map[string]bool{}
	for _, s := range c.Str {
		if s == "" || seen[s] {
			continue
		}
		if max >= 0 && len(levels) > max {
			return levels, false
		}
		seen[s] = true
		levels = append(levels, s)
	}
	return levels, true
}

// NaturalOrder sorts levels: numerically when every level is a number,
// lexically when every level is an ISO date or a period like 2026-Q3,
// otherwise it keeps them in order of first appearance. It reports whether
// the levels have an order of their own.
func NaturalOrder(levels []string) ([]string, bool) {
	out := append([]string(nil), levels...)
	if len(out) == 0 {
		return out, false
	}
	allNum := true
	for _, l := range out {
		if _, err := strconv.ParseFloat(l, 64); err != nil {
			allNum = false
			break
		}
	}
	if allNum {
		sort.SliceStable(out, func(i, j int) bool {
			a, _ := strconv.ParseFloat(out[i], 64)
			b, _ := strconv.ParseFloat(out[j], 64)
			return a < b
		})
		return out, true
	}
	allPeriod := true
	for _, l := range out {
		if !isPeriod(l) {
			allPeriod = false
			break
		}
	}
	if allPeriod {
		sort.Strings(out)
		return out, true
	}
	return out, false
}
