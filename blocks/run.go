package blocks

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"candor/blocks/stats"
	"candor/figures"
)

// Run computes one block on its source's table (before filters). A panic
// inside an analysis is a bug; it comes back as an error naming the block
// instead of ending the program.
func Run(s *Spec, t *Dataset, params map[string]string) (res *Result, err error) {
	defer func() {
		if p := recover(); p != nil {
			res, err = nil, fmt.Errorf("%s: internal error in block %s (%v); please report it with the report and data", s.Pos, s.ID, p)
		}
	}()
	f, ok := analyses[s.Analysis]
	if !ok {
		return nil, Errorf(s.Pos, "analysis %s is not available yet", s.Analysis)
	}
	// A SQL source runs what it can in the database (pushdown.go); any
	// other block reads the query's rows, once for all blocks.
	if t.sql != nil && len(t.Cols) == 0 {
		a, done, err := pushDown(s, t, params)
		if err != nil {
			return nil, err
		}
		if done {
			return finish(s, a), nil
		}
		if t, err = t.sql.rows(); err != nil {
			return nil, err
		}
	}
	for i, c := range s.Target {
		if t.Col(c) == nil {
			return nil, unknownColumn(s.TargetPos[i], c, t)
		}
	}
	for _, k := range []struct {
		name string
		pos  Pos
	}{{s.By, s.ByPos}, {s.Time, s.TimePos}} {
		if k.name != "" && t.Col(k.name) == nil {
			return nil, unknownColumn(k.pos, k.name, t)
		}
	}
	for i, c := range s.Predictors {
		if t.Col(c) == nil {
			return nil, unknownColumn(s.PredictorsPos[i], c, t)
		}
	}
	ft, err := Filter(t, s.Where, params, s.Columns())
	if err != nil {
		return nil, err
	}
	if ft.Rows() == 0 {
		if len(s.Where) > 0 {
			return nil, Errorf(s.Where[0].Pos, "block %s: no rows of %s meet the where: conditions; check their values", s.ID, t.File)
		}
		return nil, Errorf(s.Pos, "block %s: data %s (%s) has no rows", s.ID, t.Source, t.File)
	}
	a := &run{spec: s, t: ft, res: &Result{
		ID: s.ID, Analysis: s.Analysis, Pos: s.Pos, Source: t.Source, Facts: Facts{},
	}}
	for _, c := range s.Where {
		a.res.Filters = append(a.res.Filters, c.Text)
	}
	a.res.Meta.Columns = append([]string(nil), s.Target...)
	if err := f(a); err != nil {
		return nil, err
	}
	return finish(s, a), nil
}

// finish applies the keys every block shares (chart: none, title:,
// axis:, table: false) to a computed result.
func finish(s *Spec, a *run) *Result {
	if s.Chart == "none" {
		a.res.Figure = nil
	}
	if a.res.Figure != nil {
		fs := a.res.Figure
		fs.ID = "fig-" + Slug(s.ID)
		if s.Title != "" {
			fs.Title = s.Title
		}
		fs.AxisMin, fs.AxisMax = s.AxisMin, s.AxisMax
		closeWhiskers(fs)
	}
	if !s.Table {
		a.res.Tables = nil
	}
	return a.res
}

// closeWhiskers draws no whisker where an interval is undefined (a group
// of one): its ends become the value itself.
func closeWhiskers(fs *figures.Spec) {
	for k := range fs.Series {
		ser := &fs.Series[k]
		for i, v := range ser.Values {
			if i < len(ser.Low) && math.IsNaN(ser.Low[i]) != math.IsNaN(v) {
				ser.Low[i] = v
			}
			if i < len(ser.High) && math.IsNaN(ser.High[i]) != math.IsNaN(v) {
				ser.High[i] = v
			}
		}
	}
}

// analyses maps analysis keys to their implementations.
var analyses = map[string]func(*run) error{}

// run is the state of one block's computation.
type run struct {
	spec *Spec
	t    *Dataset
	res  *Result
}

// set publishes a fact ID.name.
func (a *run) set(name string, v float64, k Kind, reason string) {
	a.res.Facts.Set(a.spec.ID+"."+name, v, k, reason)
}

func (a *run) method(keys ...string) {
	for _, k := range keys {
		if !contains(a.res.Methods, k) {
			a.res.Methods = append(a.res.Methods, k)
		}
	}
}

func (a *run) note(format string, args ...any) {
	a.res.Notes = append(a.res.Notes, fmt.Sprintf(format, args...))
}

// numeric returns a number column, or an error saying why it cannot serve
// where numbers are needed.
func (a *run) numeric(name string, pos Pos, need string) (*Column, error) {
	c := a.t.Col(name)
	if c.Type == TypeNumber {
		return c, nil
	}
	ex := ""
	for i := 0; i < c.Len(); i++ {
		if !c.Missing(i) {
			ex = fmt.Sprintf(" (e.g. %q)", c.Text(i))
			break
		}
	}
	return nil, Errorf(pos, "%s: column %q holds %s values%s, not numbers, so it has no %s; use frequency for categories, or declare it as number under the source's columns:", a.spec.Analysis, name, c.Type, ex, need)
}

// present returns the non-missing values of a number column at rows idx
// (none when idx is empty) and how many were missing.
func present(c *Column, idx []int) (stats.Values, int) {
	v := stats.Values{Offset: c.Num.Offset, D: make([]float64, 0, len(idx))}
	miss := 0
	for _, i := range idx {
		if d := c.Num.D[i]; math.IsNaN(d) {
			miss++
		} else {
			v.D = append(v.D, d)
		}
	}
	return v, miss
}

// presentAll returns the non-missing values of a whole number column and
// how many were missing.
func presentAll(c *Column) (stats.Values, int) {
	v := stats.Values{Offset: c.Num.Offset, D: make([]float64, 0, len(c.Num.D))}
	miss := 0
	for _, d := range c.Num.D {
		if math.IsNaN(d) {
			miss++
		} else {
			v.D = append(v.D, d)
		}
	}
	return v, miss
}

// Group is one level of a grouping column with its rows.
type Group struct {
	Label string
	Slug  string
	Rows  []int
}

// groups splits the rows by a column's levels, in the block's order:
// the order: key first, then the natural order of the rest. Rows where the
// grouping column is missing belong to no group; their count is returned.
func (a *run) groups(name string, pos Pos) ([]Group, int, bool, error) {
	c := a.t.Col(name)
	levels, rows, miss := levelRows(c)
	byLevel := make(map[string][]int, len(levels))
	for k, l := range levels {
		byLevel[l] = rows[k]
	}
	ordered, natural := a.order(levels, c)
	ordered, err := a.applyOrder(ordered, pos)
	if err != nil {
		return nil, 0, false, err
	}
	out := make([]Group, 0, len(ordered))
	slugs := map[string]string{}
	for _, l := range ordered {
		sl := Slug(l)
		if prev, dup := slugs[sl]; dup {
			return nil, 0, false, Errorf(pos, "levels %q and %q of %s have the same fact name %q; rename one in the data", prev, l, name, sl)
		}
		slugs[sl] = l
		out = append(out, Group{Label: l, Slug: sl, Rows: byLevel[l]})
	}
	return out, miss, natural || len(a.spec.Order) > 0, nil
}

// levelRows splits the rows of a column by value: the distinct values as
// text in order of first appearance, the rows of each, and the count of
// missing rows. It codes each row first and sizes every list exactly, which
// keeps a million-row column to a few allocations.
func levelRows(c *Column) (levels []string, rows [][]int, miss int) {
	n := c.Len()
	codes := make([]int32, n)
	var counts []int
	add := func(i int) int32 {
		levels = append(levels, c.Text(i))
		counts = append(counts, 0)
		return int32(len(levels) - 1)
	}
	if c.Type == TypeNumber {
		index := map[float64]int32{}
		for i, d := range c.Num.D {
			if math.IsNaN(d) {
				codes[i] = -1
				miss++
				continue
			}
			k, ok := index[d]
			if !ok {
				k = add(i)
				index[d] = k
			}
			codes[i] = k
			counts[k]++
		}
	} else {
		index := map[string]int32{}
		for i, s := range c.Str {
			if s == "" {
				codes[i] = -1
				miss++
				continue
			}
			k, ok := index[s]
			if !ok {
				k = add(i)
				index[s] = k
			}
			codes[i] = k
			counts[k]++
		}
	}
	rows = make([][]int, len(levels))
	for k := range rows {
		rows[k] = make([]int, 0, counts[k])
	}
	for i, k := range codes {
		if k >= 0 {
			rows[k] = append(rows[k], i)
		}
	}
	return levels, rows, miss
}

// order puts levels in their natural order: numbers numerically, dates and
// periods in time order, other text as first seen.
func (a *run) order(levels []string, c *Column) ([]string, bool) {
	if c.Type == TypeNumber {
		out := append([]string(nil), levels...)
		sort.SliceStable(out, func(i, j int) bool {
			return parseF(out[i]) < parseF(out[j])
		})
		return out, true
	}
	return NaturalOrder(levels)
}

// applyOrder moves the levels the order: key names to the front, in its
// order; levels it does not name keep their place after them.
func (a *run) applyOrder(levels []string, pos Pos) ([]string, error) {
	if len(a.spec.Order) == 0 {
		return levels, nil
	}
	at := a.spec.KeyPos["order"]
	var out []string
	used := map[string]bool{}
	for _, o := range a.spec.Order {
		if !contains(levels, o) {
			return nil, Errorf(at, "order names %q, which is not a level here%s", o, suggestOrList(o, levels))
		}
		if used[o] {
			return nil, Errorf(at, "order names %q twice", o)
		}
		used[o] = true
		out = append(out, o)
	}
	for _, l := range levels {
		if !used[l] {
			out = append(out, l)
		}
	}
	return out, nil
}

func parseF(s string) float64 {
	var f float64
	fmt.Sscan(s, &f)
	return f
}

// figure starts the block's figure of the given default kind, or the kind
// the chart: key asks for.
func (a *run) figure(def figures.Kind) *figures.Spec {
	fs := &figures.Spec{Kind: a.kind(def), Percent: a.spec.Percent}
	a.res.Figure = fs
	return fs
}

// kind is the kind of figure the block draws: the chart: key's, else def.
// An analysis asks before it aggregates when a kind needs more numbers
// (a box plot's whiskers, a histogram's bins).
func (a *run) kind(def figures.Kind) figures.Kind {
	if a.spec.Chart != "" && a.spec.Chart != "none" {
		return figures.Kind(a.spec.Chart)
	}
	return def
}

// chartOK reports an error when chart: asks for a kind this analysis cannot
// draw at all (the checker judges kinds that can be drawn but mislead).
func (a *run) chartOK(kinds ...figures.Kind) error {
	if a.spec.Chart == "" || a.spec.Chart == "none" {
		return nil
	}
	for _, k := range kinds {
		if string(k) == a.spec.Chart {
			return nil
		}
	}
	names := make([]string, len(kinds))
	for i, k := range kinds {
		names[i] = string(k)
	}
	return Errorf(a.spec.KeyPos["chart"], "%s cannot be drawn as chart %s here; use one of %s, or none", a.spec.Analysis, a.spec.Chart, strings.Join(names, ", "))
}

func sortedKeys[V any](m map[string]V) []string {
	out := make([]string, 0, len(m))
	for k := range m {
		out = append(out, k)
	}
	sort.Strings(out)
	return out
}

func cellNum(text, fact string) Cell { return Cell{Text: text, Num: true, Fact: fact} }
func cellText(text string) Cell      { return Cell{Text: text} }
