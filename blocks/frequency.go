package blocks

import (
	"fmt"
	"math"
	"sort"
	"strconv"

	"candor/blocks/stats"
	"candor/figures"
)

func init() { analyses["frequency"] = runFrequency }

// discreteMax is the most distinct whole-number values a numeric column may
// have to be tabled value by value instead of binned (when bins: is absent).
const discreteMax = 12

// frequencyCharts are the kinds a frequency table can be drawn as.
var frequencyCharts = []figures.Kind{figures.Bar, figures.Pie, figures.Histogram, figures.Dot, figures.Line}

type level struct {
	label string
	count int
	lo    float64 // bins only
	hi    float64
}

// frequencyAgg is what a frequency table publishes (publishFrequency),
// counted from the rows in memory (runFrequency) or in the database
// (pdFrequency): the column's levels in table order with their counts.
type frequencyAgg struct {
	column  string
	number  bool // a number column, tabled value by value or binned
	levels  []level
	missing int
	binned  bool
	ordered bool // the levels have an order of their own
}

func runFrequency(a *run) error {
	s := a.spec
	c := a.t.Col(s.Target[0])
	if err := a.chartOK(frequencyCharts...); err != nil {
		return err
	}
	f := frequencyAgg{column: c.Name, number: c.Type == TypeNumber}
	if f.number {
		v, m := presentAll(c)
		f.missing = m
		if !s.Bins.set() && isDiscrete(v) {
			f.levels = discreteLevels(v)
			f.ordered = true
		} else {
			if len(s.Order) > 0 {
				return a.errOrderBinned()
			}
			var err error
			f.levels, err = a.binLevels(stats.BinSampleOf(v, a.binRule()), c, func(edges []float64) ([]int, error) {
				return stats.CountBins(v, edges), nil
			})
			if err != nil {
				return err
			}
			f.binned, f.ordered = true, true
		}
	} else {
		if s.Bins.set() {
			return a.errBinsOnText(c.Name, c.Type)
		}
		g, m, nat, err := a.groups(c.Name, s.TargetPos[0])
		if err != nil {
			return err
		}
		f.missing, f.ordered = m, nat
		f.levels = categoryLevels(g, nat, func(g Group) int { return len(g.Rows) })
	}
	return publishFrequency(a, f)
}

func (a *run) errOrderBinned() error {
	return Errorf(a.spec.KeyPos["order"], "order does not apply to a binned number column; bins keep the order of their values")
}

func (a *run) errBinsOnText(name string, t ColType) error {
	return Errorf(a.spec.BinsPos, "bins applies to number columns, and %s holds %s values", name, t)
}

// categoryLevels are the levels of a category column, one per group with
// count(group) rows: in the groups' order when it is natural (or given by
// order:), else from the largest to the smallest, ties in the groups'
// order (of first appearance).
func categoryLevels(gs []Group, natural bool, count func(Group) int) []level {
	levels := make([]level, 0, len(gs))
	for _, g := range gs {
		levels = append(levels, level{label: g.Label, count: count(g)})
	}
	if !natural {
		sort.SliceStable(levels, func(i, j int) bool { return levels[i].count > levels[j].count })
	}
	return levels
}

// publishFrequency publishes a frequency table's facts, table, checker
// metadata and figure from its levels.
func publishFrequency(a *run, f frequencyAgg) error {
	s := a.spec
	name, levels, miss := f.column, f.levels, f.missing
	n := 0
	for _, l := range levels {
		n += l.count
	}
	if n == 0 {
		return Errorf(s.TargetPos[0], "frequency: column %q has no values here (all %d are missing)", name, miss)
	}
	a.res.Meta.N = n
	a.res.Meta.Ordered = f.ordered
	a.res.Meta.Binned = f.binned
	a.res.Meta.Outcome = "categorical"
	if f.number {
		a.res.Meta.Outcome = "numeric"
	}
	a.set("n", float64(n), Count, "")
	a.set("missing", float64(miss), Count, "")
	a.set("levels", float64(len(levels)), Count, "")
	tab := Table{Head: []string{name, "Count", "Relative", "Percent", "Cumulative count", "Cumulative %"}}
	cum := 0
	slugs := map[string]bool{}
	for _, l := range levels {
		cum += l.count
		sl := Slug(l.label)
		if slugs[sl] {
			return Errorf(s.TargetPos[0], "two levels of %s share the fact name %q; rename one", name, sl)
		}
		slugs[sl] = true
		a.res.Meta.Levels = append(a.res.Meta.Levels, l.label)
		pct := 100 * float64(l.count) / float64(n)
		cpct := 100 * float64(cum) / float64(n)
		a.set(sl+".count", float64(l.count), Count, "")
		a.set(sl+".pct", pct, Percent, "")
		a.set(sl+".cum_count", float64(cum), Count, "")
		a.set(sl+".cum_pct", cpct, Percent, "")
		p := s.ID + "." + sl + "."
		tab.Rows = append(tab.Rows, []Cell{
			cellText(l.label),
			cellNum(Format(a.res.Facts[p+"count"], -1), p+"count"),
			cellNum(strconv.FormatFloat(float64(l.count)/float64(n), 'f', 3, 64), ""),
			cellNum(Format(a.res.Facts[p+"pct"], -1), p+"pct"),
			cellNum(Format(a.res.Facts[p+"cum_count"], -1), p+"cum_count"),
			cellNum(Format(a.res.Facts[p+"cum_pct"], -1), p+"cum_pct"),
		})
	}
	tab.Rows = append(tab.Rows, []Cell{cellText("Total"), cellNum(Format(a.res.Facts[s.ID+".n"], -1), s.ID+".n"),
		cellNum("1.000", ""), cellNum("100.0%", ""), cellText(""), cellText("")})
	if !f.ordered {
		tab.Notes = append(tab.Notes, "Categories have no order of their own; they are listed from the most to the least frequent, so cumulative figures depend on that order.")
	}
	if f.binned {
		tab.Notes = append(tab.Notes, "Each bin includes its lower edge and excludes its upper edge, except the last, which includes both.")
	}
	if miss > 0 {
		tab.Notes = append(tab.Notes, fmt.Sprintf("%s missing values are not counted; percentages are of the %s values present.", Thousands(strconv.Itoa(miss)), Thousands(strconv.Itoa(n))))
	}
	a.res.Tables = append(a.res.Tables, tab)

	def := figures.Bar
	if f.binned {
		def = figures.Histogram
	}
	fs := a.figure(def)
	fs.Title = "Frequency of " + name
	fs.XLabel = name
	fs.YLabel = "Count"
	if s.Percent {
		fs.YLabel = "Percent"
	}
	value := func(l level) float64 {
		if s.Percent {
			return 100 * float64(l.count) / float64(n)
		}
		return float64(l.count)
	}
	if fs.Kind == figures.Histogram {
		for i, l := range levels {
			if f.binned {
				fs.Bins = append(fs.Bins, figures.Bin{Lo: l.lo, Hi: l.hi, Value: value(l)})
				continue
			}
			// A histogram of categories (the checker's chart-choice rule
			// says why not): touching bars, one per category.
			fs.Bins = append(fs.Bins, figures.Bin{Lo: float64(i), Hi: float64(i + 1), Value: value(l)})
			fs.Categories = append(fs.Categories, l.label)
		}
		return nil
	}
	ser := figures.Series{Name: fs.YLabel}
	for _, l := range levels {
		fs.Categories = append(fs.Categories, l.label)
		ser.Values = append(ser.Values, value(l))
	}
	if fs.Kind == figures.Pie {
		fs.Percent = true
		ser.Values = ser.Values[:0]
		for _, l := range levels {
			ser.Values = append(ser.Values, 100*float64(l.count)/float64(n))
		}
	}
	fs.Series = []figures.Series{ser}
	return nil
}

// isDiscrete reports whether a number column holds few distinct whole
// numbers (a rating, a count of children), which are tabled one by one.
func isDiscrete(v stats.Values) bool {
	seen := map[float64]bool{}
	for i := 0; i < v.Len(); i++ {
		x := v.At(i)
		if x != math.Trunc(x) {
			return false
		}
		seen[x] = true
		if len(seen) > discreteMax {
			return false
		}
	}
	return len(seen) > 0
}

func discreteLevels(v stats.Values) []level {
	counts := map[float64]int{}
	for i := 0; i < v.Len(); i++ {
		counts[v.At(i)]++
	}
	var xs []float64
	for x := range counts {
		xs = append(xs, x)
	}
	sort.Float64s(xs)
	out := make([]level, len(xs))
	for i, x := range xs {
		out[i] = valueLevel(x, counts[x])
	}
	return out
}

// valueLevel is the level of one whole number of a discrete column.
func valueLevel(x float64, count int) level {
	return level{label: strconv.FormatFloat(x, 'f', -1, 64), count: count, lo: x, hi: x}
}

// binRule is the rule that sets the bins' width when the bins: key gives
// neither edges nor a count: its rule, Sturges' by default; "" otherwise.
func (a *run) binRule() string {
	b := a.spec.Bins
	if len(b.Edges) > 0 || b.Count > 0 {
		return ""
	}
	if b.Rule == "" {
		return "sturges"
	}
	return b.Rule
}

// binLevels are the bins of a number column as the bins: key asks: its
// edges, a count of equal bins, or a rule (binRule), for the sample b (with
// the spread its rule needs); col snaps the extremes an error shows, and
// count counts the values in the bins between edges.
func (a *run) binLevels(b stats.BinSample, col *Column, count func(edges []float64) ([]int, error)) ([]level, error) {
	bins := a.spec.Bins
	var edges []float64
	switch {
	case len(bins.Edges) > 0:
		edges = bins.Edges
		if b.N > 0 && (b.Min < edges[0] || b.Max > edges[len(edges)-1]) {
			return nil, Errorf(a.spec.BinsPos, "bins: the edges run from %g to %g but %s runs from %g to %g; widen the edges so every value falls in a bin",
				edges[0], edges[len(edges)-1], a.spec.Target[0], col.Snap(b.Min, 0), col.Snap(b.Max, 0))
		}
		a.method("bins-edges")
	case bins.Count > 0:
		edges = stats.BinEdgesFor(b, "", bins.Count)
		a.method("bins-count")
	default:
		rule := a.binRule()
		edges = stats.BinEdgesFor(b, rule, 0)
		a.method(rule)
	}
	counts, err := count(edges)
	if err != nil {
		return nil, err
	}
	out := make([]level, len(counts))
	for i, n := range counts {
		closing := ")"
		if i == len(counts)-1 {
			closing = "]"
		}
		out[i] = level{label: "[" + trimNum(edges[i]) + ", " + trimNum(edges[i+1]) + closing, count: n, lo: edges[i], hi: edges[i+1]}
	}
	return out, nil
}

// trimNum shows a bin edge with at most six significant digits.
func trimNum(x float64) string {
	return strconv.FormatFloat(x, 'g', 6, 64)
}
