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

type level struct {
	label string
	count int
	lo    float64 // bins only
	hi    float64
}

func runFrequency(a *run) error {
	s := a.spec
	c := a.t.Col(s.Target[0])
	if err := a.chartOK(figures.Bar, figures.Pie, figures.Histogram, figures.Dot, figures.Line); err != nil {
		return err
	}
	var levels []level
	binned := false
	miss := 0
	ordered := false
	if c.Type == TypeNumber {
		v, m := presentAll(c)
		miss = m
		if !s.Bins.set() && isDiscrete(v) {
			levels = discreteLevels(v)
			ordered = true
		} else {
			if len(s.Order) > 0 {
				return Errorf(s.KeyPos["order"], "order does not apply to a binned number column; bins keep the order of their values")
			}
			var err error
			levels, err = a.binLevels(v)
			if err != nil {
				return err
			}
			binned, ordered = true, true
		}
	} else {
		if s.Bins.set() {
			return Errorf(s.BinsPos, "bins applies to number columns, and %s holds %s values", c.Name, c.Type)
		}
		g, m, nat, err := a.groups(c.Name, s.TargetPos[0])
		if err != nil {
			return err
		}
		miss = m
		ordered = nat
		for _, x := range g {
			levels = append(levels, level{label: x.Label, count: len(x.Rows)})
		}
		if !nat {
			// Unordered categories: largest first, ties in order of appearance.
			sort.SliceStable(levels, func(i, j int) bool { return levels[i].count > levels[j].count })
		}
	}
	n := 0
	for _, l := range levels {
		n += l.count
	}
	if n == 0 {
		return Errorf(s.TargetPos[0], "frequency: column %q has no values here (all %d are missing)", c.Name, miss)
	}
	a.res.Meta.N = n
	a.res.Meta.Ordered = ordered
	a.res.Meta.Binned = binned
	a.res.Meta.Outcome = "categorical"
	if c.Type == TypeNumber {
		a.res.Meta.Outcome = "numeric"
	}
	a.set("n", float64(n), Count, "")
	a.set("missing", float64(miss), Count, "")
	a.set("levels", float64(len(levels)), Count, "")
	tab := Table{Head: []string{c.Name, "Count", "Relative", "Percent", "Cumulative count", "Cumulative %"}}
	cum := 0
	slugs := map[string]bool{}
	for _, l := range levels {
		cum += l.count
		sl := Slug(l.label)
		if slugs[sl] {
			return Errorf(s.TargetPos[0], "two levels of %s share the fact name %q; rename one", c.Name, sl)
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
	if !ordered {
		tab.Notes = append(tab.Notes, "Categories have no order of their own; they are listed from the most to the least frequent, so cumulative figures depend on that order.")
	}
	if binned {
		tab.Notes = append(tab.Notes, "Each bin includes its lower edge and excludes its upper edge, except the last, which includes both.")
	}
	if miss > 0 {
		tab.Notes = append(tab.Notes, fmt.Sprintf("%s missing values are not counted; percentages are of the %s values present.", Thousands(strconv.Itoa(miss)), Thousands(strconv.Itoa(n))))
	}
	a.res.Tables = append(a.res.Tables, tab)

	def := figures.Bar
	if binned {
		def = figures.Histogram
	}
	fs := a.figure(def)
	fs.Title = "Frequency of " + c.Name
	fs.XLabel = c.Name
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
	if fs.Kind == figures.Histogram && binned {
		for _, l := range levels {
			fs.Bins = append(fs.Bins, figures.Bin{Lo: l.lo, Hi: l.hi, Value: value(l)})
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
		out[i] = level{label: strconv.FormatFloat(x, 'f', -1, 64), count: counts[x], lo: x, hi: x}
	}
	return out
}

func (a *run) binLevels(v stats.Values) ([]level, error) {
	b := a.spec.Bins
	var edges []float64
	switch {
	case len(b.Edges) > 0:
		edges = b.Edges
		lo, hi := math.Inf(1), math.Inf(-1)
		for i := 0; i < v.Len(); i++ {
			lo, hi = math.Min(lo, v.At(i)), math.Max(hi, v.At(i))
		}
		if v.Len() > 0 && (lo < edges[0] || hi > edges[len(edges)-1]) {
			return nil, Errorf(a.spec.BinsPos, "bins: the edges run from %g to %g but %s runs from %g to %g; widen the edges so every value falls in a bin", edges[0], edges[len(edges)-1], a.spec.Target[0], lo, hi)
		}
		a.method("bins-edges")
	case b.Count > 0:
		edges = stats.BinEdges(v, "", b.Count)
		a.method("bins-count")
	default:
		rule := b.Rule
		if rule == "" {
			rule = "sturges"
		}
		edges = stats.BinEdges(v, rule, 0)
		a.method(rule)
	}
	counts := stats.CountBins(v, edges)
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
