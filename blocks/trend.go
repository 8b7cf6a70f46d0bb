package blocks

import (
	"fmt"
	"math"

	"candor/blocks/stats"
	"candor/figures"
)

func init() { analyses["trend"] = runTrend }

// runTrend: the mean (numeric measure) or the share of successes (binary
// measure) at every time point, per group with by:; the change from the
// first to the last time point, and for two groups the difference in
// differences. Every time point is kept, even where a group has no cases.
func runTrend(a *run) error {
	s := a.spec
	if err := a.chartOK(figures.Line, figures.Bar, figures.Grouped, figures.Dot); err != nil {
		return err
	}
	if s.Time == s.Target[0] || s.By == s.Target[0] || (s.By != "" && s.By == s.Time) {
		return Errorf(s.TimePos, "trend: the measure, time and by: must be three different columns")
	}
	o, err := a.readOutcome(s.Target[0], s.TargetPos[0])
	if err != nil {
		return err
	}
	times, missT, _, err := a.groups(s.Time, s.TimePos)
	if err != nil {
		return err
	}
	if len(times) == 0 {
		return Errorf(s.TimePos, "trend: no row has a value for %s", s.Time)
	}
	if len(times) == 1 {
		// Drawn as asked, but the checker will say that one time point of a
		// trend hides the others (partial-series).
		a.note("Only one time point (%s = %s) is left in these rows, so the trend shows no change.", s.Time, times[0].Label)
	}
	if missT > 0 {
		a.note("%d rows with no value for %s are left out.", missT, s.Time)
	}
	// timeOf[i] is the time point of row i, -1 where it has none.
	timeOf := make([]int32, a.t.Rows())
	for i := range timeOf {
		timeOf[i] = -1
	}
	for k, t := range times {
		a.res.Meta.Times = append(a.res.Meta.Times, t.Label)
		for _, i := range t.Rows {
			timeOf[i] = int32(k)
		}
	}
	a.res.Meta.Time = s.Time
	a.res.Meta.Ordered = true
	// Groups (one unnamed group without by:).
	var gs []Group
	ref := 0
	if s.By != "" {
		saved := a.spec.Order
		a.spec.Order = nil // order: orders the time points
		gs, _, _, err = a.groups(s.By, s.ByPos)
		a.spec.Order = saved
		if err != nil {
			return err
		}
		if ref, err = a.reference(gs); err != nil {
			return err
		}
		a.res.Meta.By = s.By
		a.res.Meta.Reference = gs[ref].Label
		for _, g := range gs {
			a.res.Meta.Groups = append(a.res.Meta.Groups, g.Label)
		}
	} else {
		all := make([]int, a.t.Rows())
		for i := range all {
			all[i] = i
		}
		gs = []Group{{Label: "", Rows: all}}
	}
	measure, kind, unit := "mean", Number, ""
	if o.binary {
		measure, kind, unit = "pct", Percent, " points"
		a.res.Meta.Outcome = "binary"
		a.res.Meta.Success = o.success
		a.method("wilson")
	} else {
		a.res.Meta.Outcome = "numeric"
		a.method("mean-sd", "t-interval")
	}
	if len(gs) == 2 {
		a.method("did")
	}
	total := 0
	head := []string{s.Time}
	for _, g := range gs {
		name := s.Target[0]
		if g.Label != "" {
			name = g.Label
		}
		if o.binary {
			head = append(head, name+" % "+o.success, "n")
		} else {
			head = append(head, name+" mean", "n")
		}
	}
	tab := Table{Head: head}
	series := make([]figures.Series, len(gs))
	changes := make([]float64, len(gs))
	for gi, g := range gs {
		byTime := make([][]int, len(times))
		for k, t := range times {
			byTime[k] = make([]int, 0, min(len(t.Rows), len(g.Rows)))
		}
		for _, i := range g.Rows {
			if k := timeOf[i]; k >= 0 {
				byTime[k] = append(byTime[k], i)
			}
		}
		prefix := ""
		if g.Label != "" {
			prefix = g.Slug + "."
			series[gi].Name = g.Label
		} else {
			series[gi].Name = s.Target[0]
		}
		vals := make([]float64, len(times))
		for k, t := range times {
			p := prefix + t.Slug + "."
			var v, lo, hi float64
			var n int
			why := ""
			if o.binary {
				x, cases := o.counts(byTime[k])
				n = cases
				v = 100 * float64(x) / float64(cases)
				l, h := stats.Wilson(x, cases, level95)
				lo, hi = 100*l, 100*h
			} else {
				sm := stats.Describe(o.values(byTime[k]))
				n, v, lo, hi = sm.N, sm.Mean, sm.MeanLow, sm.MeanHigh
			}
			if n == 0 {
				why = "no cases at this time point"
			}
			total += n
			vals[k] = v
			a.set(p+measure, v, kind, why)
			a.set(p+"n", float64(n), Count, "")
			a.set(p+measure+"_low", lo, kind, why)
			a.set(p+measure+"_high", hi, kind, why)
			series[gi].Values = append(series[gi].Values, v)
			series[gi].Low = append(series[gi].Low, lo)
			series[gi].High = append(series[gi].High, hi)
		}
		ckind := Number
		if o.binary {
			ckind = Points
		}
		changes[gi] = vals[len(vals)-1] - vals[0]
		ratio := vals[len(vals)-1] / vals[0]
		if len(times) < 2 {
			changes[gi], ratio = math.NaN(), math.NaN()
		}
		why := ""
		switch {
		case len(times) < 2:
			why = "a change needs two time points"
		case isNaN(changes[gi]):
			why = "the first or last time point has no cases"
		}
		a.set(prefix+"change", changes[gi], ckind, why)
		a.set(prefix+"ratio", ratio, Ratio, why)
	}
	a.set("n", float64(total), Count, "")
	a.res.Meta.N = total
	for _, t := range times {
		row := []Cell{cellText(t.Label)}
		for _, g := range gs {
			prefix := ""
			if g.Label != "" {
				prefix = g.Slug + "."
			}
			row = append(row, a.numCell(prefix+t.Slug+"."+measure), a.numCell(prefix+t.Slug+".n"))
		}
		tab.Rows = append(tab.Rows, row)
	}
	chRow := []Cell{cellText(fmt.Sprintf("Change, %s to %s", times[0].Label, times[len(times)-1].Label))}
	for _, g := range gs {
		prefix := ""
		if g.Label != "" {
			prefix = g.Slug + "."
		}
		chRow = append(chRow, a.numCell(prefix+"change"), cellText(""))
	}
	tab.Rows = append(tab.Rows, chRow)
	if o.binary {
		tab.Notes = append(tab.Notes, "Changes are in percentage points.")
	}
	if len(gs) == 2 {
		other := 1 - ref
		did := changes[other] - changes[ref]
		why := ""
		if isNaN(did) {
			why = "a group has no cases at the first or last time point"
		}
		ckind := Number
		if o.binary {
			ckind = Points
		}
		a.set("did", did, ckind, why)
		tab.Notes = append(tab.Notes, fmt.Sprintf("Difference in differences: the change in %s minus the change in %s = %s%s. It estimates an effect only if both groups would otherwise have changed alike.",
			gs[other].Label, gs[ref].Label, a.fmt("did"), unit))
	}
	a.res.Tables = append(a.res.Tables, tab)

	fs := a.figure(figures.Line)
	fs.Percent = o.binary
	what := s.Target[0]
	if o.binary {
		what = fmt.Sprintf("Share %s = %s", s.Target[0], o.success)
		fs.YLabel = "% " + o.success
	} else {
		what = "Mean " + s.Target[0]
		fs.YLabel = s.Target[0]
	}
	fs.Title = what + " by " + s.Time
	if s.By != "" {
		fs.Title += " and " + s.By
	}
	fs.XLabel = s.Time
	for _, t := range times {
		fs.Categories = append(fs.Categories, t.Label)
	}
	if fs.Kind != figures.Dot {
		for i := range series {
			series[i].Low, series[i].High = nil, nil
		}
	}
	fs.Series = series
	return nil
}
