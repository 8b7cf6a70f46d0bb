package blocks

import (
	"fmt"
	"math"
	"sort"

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

func runSummary(a *run) error {
	s := a.spec
	if err := a.chartOK(figures.Box, figures.Histogram, figures.Dot, figures.Bar); err != nil {
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
	multi := len(cols) > 1
	a.method("mean-sd", "t-interval", "quartiles-type7", "skewness-g1")

	type row struct {
		label   string
		prefix  string // fact prefix before NAME
		sum     stats.Summary
		miss    int
		vals    stats.Values
		overall bool // the column's row over all groups, when by: is set
	}
	var rows []row
	var groups []Group
	if s.By != "" {
		var err error
		var missBy int
		groups, missBy, _, err = a.groups(s.By, s.ByPos)
		if err != nil {
			return err
		}
		a.res.Meta.By = s.By
		for _, g := range groups {
			a.res.Meta.Groups = append(a.res.Meta.Groups, g.Label)
		}
		if missBy > 0 {
			a.note("%d rows with no value for %s belong to no group; they count in the overall figures only.", missBy, s.By)
		}
	}
	for _, c := range cols {
		v, miss := presentAll(c)
		p, label := "", c.Name
		if multi {
			p = Slug(c.Name) + "."
		}
		if s.By != "" {
			label = "All"
			if multi {
				label = c.Name + ", all"
			}
		}
		rows = append(rows, row{label: label, prefix: p, sum: snapSummary(stats.Describe(v), c), miss: miss, vals: v, overall: s.By != ""})
		for _, g := range groups {
			gv, gm := present(c, g.Rows)
			label := g.Label
			if multi {
				label = c.Name + ", " + g.Label
			}
			rows = append(rows, row{label: label, prefix: g.Slug + "." + p, sum: snapSummary(stats.Describe(gv), c), miss: gm, vals: gv})
		}
	}
	a.res.Meta.N = rows[0].sum.N
	head := []string{"", "n", "Missing", "Mean", "95% CI", "SD", "SE", "Min", "Q1", "Median", "Q3", "Max", "IQR", "Skewness"}
	if s.By != "" && !multi {
		head[0] = s.By
	}
	tab := Table{Head: head}
	for _, r := range rows {
		for _, f := range summaryFacts {
			v, reason := summaryValue(r.sum, f.name)
			if f.name == "missing" {
				v, reason = float64(r.miss), ""
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
				lo, hi := a.res.Facts[name], a.res.Facts[a.spec.ID+"."+r.prefix+"mean_high"]
				text := "undefined"
				if lo.Defined() && hi.Defined() {
					text = Format(lo, -1) + " to " + Format(hi, -1)
				}
				cells = append(cells, cellNum(text, name))
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
	kind := figures.Histogram
	if s.By != "" || multi {
		kind = figures.Box
	}
	fs := a.figure(kind)
	fs.Percent = false
	what := cols[0].Name
	if multi {
		what = "Values"
	}
	if fs.Kind == figures.Histogram {
		v := rows[0].vals
		if v.Len() == 0 {
			a.res.Figure = nil
			return nil
		}
		edges := stats.BinEdges(v, "sturges", 0)
		counts := stats.CountBins(v, edges)
		for i, n := range counts {
			fs.Bins = append(fs.Bins, figures.Bin{Lo: edges[i], Hi: edges[i+1], Value: float64(n)})
		}
		fs.Title = "Distribution of " + what
		fs.XLabel, fs.YLabel = what, "Count"
		a.method("sturges")
		return nil
	}
	// Box, dot or bar: one entry per group (or per column without by:).
	ser := figures.Series{Name: "Mean"}
	for _, r := range rows {
		if r.overall || r.sum.N == 0 {
			continue
		}
		fs.Categories = append(fs.Categories, r.label)
		fs.Boxes = append(fs.Boxes, boxStats(r.label, r.vals, r.sum))
		ser.Values = append(ser.Values, r.sum.Mean)
		ser.Low = append(ser.Low, r.sum.MeanLow)
		ser.High = append(ser.High, r.sum.MeanHigh)
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

// boxStats computes Tukey's box: whiskers to the most extreme values within
// 1.5 IQR of the quartiles, points beyond them as outliers (Tukey 1977).
func boxStats(label string, v stats.Values, s stats.Summary) figures.BoxStats {
	b := figures.BoxStats{Label: label, Q1: s.Q1, Median: s.Median, Q3: s.Q3, N: s.N}
	if s.N == 0 {
		return b
	}
	lo, hi := s.Q1-1.5*s.IQR, s.Q3+1.5*s.IQR
	b.WhiskerLow, b.WhiskerHigh = math.Inf(1), math.Inf(-1)
	for i := 0; i < v.Len(); i++ {
		x := v.At(i)
		if x < lo || x > hi {
			b.Outliers = append(b.Outliers, x)
			continue
		}
		b.WhiskerLow = math.Min(b.WhiskerLow, x)
		b.WhiskerHigh = math.Max(b.WhiskerHigh, x)
	}
	sort.Float64s(b.Outliers)
	return b
}
