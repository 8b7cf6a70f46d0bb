package blocks

import (
	"fmt"
	"math"
	"strconv"

	"candor/blocks/stats"
	"candor/figures"
)

func init() { analyses["summary"] = runSummary }

// summaryFacts are the per-column facts of a summary, in table order, with
// their kinds.
var summaryFacts = []struct {
	name, head string
	kind       Kind
}{
	{"n", "n", Count}, {"missing", "Missing", Count}, {"mean", "Mean", Number},
	{"mean_low", "95% CI low", Number}, {"mean_high", "95% CI high", Number},
	{"sd", "SD", Number}, {"se", "SE", Number}, {"min", "Min", Number},
	{"q1", "Q1", Number}, {"median", "Median", Number}, {"q3", "Q3", Number},
	{"max", "Max", Number}, {"iqr", "IQR", Number}, {"skewness", "Skewness", Number},
}

// snapSummary rounds the order statistics of a summary to the data's own
// decimals (quartiles interpolate, so they may carry two more).
func snapSummary(s stats.Summary, c *Column) stats.Summary {
	s.Min, s.Max = c.Snap(s.Min, 0), c.Snap(s.Max, 0)
	s.Q1, s.Median, s.Q3 = c.Snap(s.Q1, 2), c.Snap(s.Median, 2), c.Snap(s.Q3, 2)
	s.IQR = c.Snap(s.IQR, 2)
	return s
}

func summaryValue(s stats.Summary, name string) (float64, string) {
	switch name {
	case "n":
		return float64(s.N), ""
	case "mean":
		return s.Mean, reasonN(s.N, 1)
	case "mean_low":
		return s.MeanLow, reasonN(s.N, 2)
	case "mean_high":
		return s.MeanHigh, reasonN(s.N, 2)
	case "sd":
		return s.SD, reasonN(s.N, 2)
	case "se":
		return s.SE, reasonN(s.N, 2)
	case "min":
		return s.Min, reasonN(s.N, 1)
	case "q1":
		return s.Q1, reasonN(s.N, 1)
	case "median":
		return s.Median, reasonN(s.N, 1)
	case "q3":
		return s.Q3, reasonN(s.N, 1)
	case "max":
		return s.Max, reasonN(s.N, 1)
	case "iqr":
		return s.IQR, reasonN(s.N, 1)
	case "skewness":
		r := reasonN(s.N, 3)
		if r == "" && s.SD == 0 {
			r = "all values are equal"
		}
		return s.Skewness, r
	}
	return math.NaN(), "unknown"
}

func reasonN(n, need int) string {
	switch {
	case n >= need:
		return ""
	case n == 0:
		return "no values"
	}
	return fmt.Sprintf("needs at least %d values, has %d", need, n)
}

// summaryCharts are the kinds a summary can be drawn as.
var summaryCharts = []figures.Kind{figures.Box, figures.Histogram, figures.Dot, figures.Bar}

// sample is one sample of a number column as summary and compare publish
// it: its summary with the order statistics snapped to the column's
// decimals, its moments, its missing values, and its box plot's whiskers
// when one is drawn.
type sample struct {
	sum  stats.Summary
	mom  stats.Moments
	miss int
	box  *stats.Whiskers
}

// sampleOf is the sample of the (present) values v of column c.
func sampleOf(v stats.Values, miss int, c *Column) sample {
	m := stats.MomentsOf(v)
	return sample{sum: snapSummary(stats.DescribeMoments(m, stats.QuartilesOf(v)), c), mom: m, miss: miss}
}

// whiskers adds the box plot's whiskers of the sample's values v.
func (sm *sample) whiskers(v stats.Values) {
	lo, hi := sm.sum.Fences()
	w := stats.BoxWhiskers(v, lo, hi)
	sm.box = &w
}

// summaryAgg is what a summary publishes (publishSummary), computed from
// the rows in memory (runSummary) or in the database (pdSummary).
type summaryAgg struct {
	groups []Group // by:'s groups in order; none without by:
	missBy int     // rows with no value for by:
	cols   []summaryCol
	hist   *histogram // of the first column, when a histogram is drawn and it has values
}

// summaryCol is one column of a summary: its sample over all rows and, with
// by:, in each group (in the order of groups). The box plot draws each
// group's sample (or the overall one without by:) that has values, with
// its whiskers; hidden outliers are counted, not drawn.
type summaryCol struct {
	name   string
	all    sample
	groups []sample
	hidden int
}

// histogram is a histogram's bins: edges and the values between them.
type histogram struct {
	edges  []float64
	counts []int
}

// summaryKind is the figure a summary draws: a box per group (or per
// column), a histogram of a single column otherwise.
func (a *run) summaryKind() figures.Kind {
	if a.spec.By != "" || len(a.spec.Target) > 1 {
		return a.kind(figures.Box)
	}
	return a.kind(figures.Histogram)
}

func runSummary(a *run) error {
	s := a.spec
	if err := a.chartOK(summaryCharts...); err != nil {
		return err
	}
	cols := make([]*Column, len(s.Target))
	for i, name := range s.Target {
		c, err := a.numeric(name, s.TargetPos[i], "mean")
		if err != nil {
			return err
		}
		cols[i] = c
	}
	var x summaryAgg
	if s.By != "" {
		var err error
		if x.groups, x.missBy, _, err = a.groups(s.By, s.ByPos); err != nil {
			return err
		}
	}
	kind := a.summaryKind()
	for _, c := range cols {
		v, miss := presentAll(c)
		sc := summaryCol{name: c.Name, all: sampleOf(v, miss, c)}
		if kind == figures.Box && s.By == "" && sc.all.sum.N > 0 {
			sc.all.whiskers(v)
		}
		for _, g := range x.groups {
			gv, gm := present(c, g.Rows)
			gs := sampleOf(gv, gm, c)
			if kind == figures.Box && gs.sum.N > 0 {
				gs.whiskers(gv)
			}
			sc.groups = append(sc.groups, gs)
		}
		x.cols = append(x.cols, sc)
		if kind == figures.Histogram && len(x.cols) == 1 && v.Len() > 0 {
			edges := stats.BinEdges(v, "sturges", 0)
			x.hist = &histogram{edges: edges, counts: stats.CountBins(v, edges)}
		}
	}
	return publishSummary(a, x)
}

// publishSummary publishes a summary's facts, table, checker metadata and
// figure from its samples.
func publishSummary(a *run, x summaryAgg) error {
	s := a.spec
	multi := len(x.cols) > 1
	a.method("mean-sd", "t-interval", "quartiles-type7", "skewness-g1")
	if s.By != "" {
		a.res.Meta.By = s.By
		for _, g := range x.groups {
			a.res.Meta.Groups = append(a.res.Meta.Groups, g.Label)
		}
		if x.missBy > 0 {
			a.note("%d rows with no value for %s belong to no group; they count in the overall figures only.", x.missBy, s.By)
		}
	}
	type row struct {
		label   string
		prefix  string // fact prefix before NAME
		sm      sample
		overall bool // the column's row over all groups, when by: is set
	}
	var rows []row
	for _, c := range x.cols {
		p, label := "", c.name
		if multi {
			p = Slug(c.name) + "."
		}
		if s.By != "" {
			label = "All"
			if multi {
				label = c.name + ", all"
			}
		}
		rows = append(rows, row{label: label, prefix: p, sm: c.all, overall: s.By != ""})
		for i, g := range x.groups {
			label := g.Label
			if multi {
				label = c.name + ", " + g.Label
			}
			rows = append(rows, row{label: label, prefix: g.Slug + "." + p, sm: c.groups[i]})
		}
	}
	a.res.Meta.N = rows[0].sm.sum.N
	head := []string{"", "n", "Missing", "Mean", "95% CI", "SD", "SE", "Min", "Q1", "Median", "Q3", "Max", "IQR", "Skewness"}
	if s.By != "" && !multi {
		head[0] = s.By
	}
	tab := Table{Head: head}
	for _, r := range rows {
		for _, f := range summaryFacts {
			v, reason := summaryValue(r.sm.sum, f.name)
			if f.name == "missing" {
				v, reason = float64(r.sm.miss), ""
			}
			a.set(r.prefix+f.name, v, f.kind, reason)
		}
		cells := []Cell{cellText(r.label)}
		for _, f := range summaryFacts {
			name := a.spec.ID + "." + r.prefix + f.name
			switch f.name {
			case "mean_high":
				continue
			case "mean_low":
				cells = append(cells, a.rangeCell(r.prefix+"mean_low", r.prefix+"mean_high"))
				continue
			}
			cells = append(cells, cellNum(Format(a.res.Facts[name], -1), name))
		}
		tab.Rows = append(tab.Rows, cells)
	}
	tab.Notes = append(tab.Notes, "Quartiles by Hyndman and Fan's type 7 (as a spreadsheet's QUARTILE.INC); 95% CI of the mean from Student's t.")
	if len(tab.Rows) <= 6 {
		tab = tab.Transpose()
	}
	a.res.Tables = append(a.res.Tables, tab)

	// The figure: a box per group (or per column), a histogram otherwise.
	fs := a.figure(a.summaryKind())
	fs.Percent = false
	what := x.cols[0].name
	if multi {
		what = "Values"
	}
	if fs.Kind == figures.Histogram {
		if x.hist == nil {
			a.res.Figure = nil
			return nil
		}
		for i, n := range x.hist.counts {
			fs.Bins = append(fs.Bins, figures.Bin{Lo: x.hist.edges[i], Hi: x.hist.edges[i+1], Value: float64(n)})
		}
		fs.Title = "Distribution of " + what
		fs.XLabel, fs.YLabel = what, "Count"
		a.method("sturges")
		return nil
	}
	if fs.Kind == figures.Box {
		for _, c := range x.cols {
			a.noteHidden(c.hidden)
		}
	}
	// Box, dot or bar: one entry per group (or per column without by:).
	ser := figures.Series{Name: "Mean"}
	for _, r := range rows {
		if r.overall || r.sm.sum.N == 0 {
			continue
		}
		fs.Categories = append(fs.Categories, r.label)
		fs.Boxes = append(fs.Boxes, boxStats(r.label, r.sm.box, r.sm.sum))
		ser.Values = append(ser.Values, r.sm.sum.Mean)
		ser.Low = append(ser.Low, r.sm.sum.MeanLow)
		ser.High = append(ser.High, r.sm.sum.MeanHigh)
	}
	if fs.Kind == figures.Box {
		a.method("tukey-box")
	} else {
		fs.Boxes = nil
		fs.Series = []figures.Series{ser}
		if fs.Kind == figures.Bar {
			fs.Series[0].Low, fs.Series[0].High = nil, nil
		}
	}
	fs.Title, fs.YLabel = what, what
	if s.By != "" {
		fs.Title = fmt.Sprintf("%s by %s", what, s.By)
		fs.XLabel = s.By
	}
	if len(fs.Categories) == 0 {
		a.res.Figure = nil
	}
	return nil
}

// boxStats is Tukey's box of a sample: its quartiles, and the whiskers to
// the most extreme values within 1.5 IQR of the quartiles with the points
// beyond them as outliers (Tukey 1977) when w has them.
func boxStats(label string, w *stats.Whiskers, s stats.Summary) figures.BoxStats {
	b := figures.BoxStats{Label: label, Q1: s.Q1, Median: s.Median, Q3: s.Q3, N: s.N}
	if s.N == 0 || w == nil {
		return b
	}
	b.WhiskerLow, b.WhiskerHigh = w.Low, w.High
	b.Outliers = append([]float64(nil), w.Outliers...)
	return b
}

// noteHidden says when a box plot shows only the most extreme outliers.
func (a *run) noteHidden(hidden int) {
	if hidden > 0 {
		a.note("The box plot shows the %s most extreme outliers on each side; %s more lie between them and the whiskers.",
			Thousands(strconv.Itoa(pdMaxOutliers/2)), Thousands(strconv.Itoa(hidden)))
	}
}
