package blocks

import (
	"fmt"
	"strings"

	"candor/blocks/stats"
	"candor/figures"
)

func init() { analyses["compare"] = runCompare }

const level95 = 0.95

// compareNumericCharts and compareBinaryCharts are the kinds a comparison
// of means and of proportions can be drawn as.
var (
	compareNumericCharts = []figures.Kind{figures.Dot, figures.Bar, figures.Box, figures.Line}
	compareBinaryCharts  = []figures.Kind{figures.Grouped, figures.Bar, figures.Dot, figures.Stacked, figures.Pie, figures.Line}
)

// compareNumericAgg is what a comparison of means publishes
// (publishCompareNumeric): the groups in order, the reference, and each
// group's sample of the outcome.
type compareNumericAgg struct {
	groups  []Group
	ref     int
	samples []sample
	hidden  int // outliers the box plot does not show
}

// compareBinaryAgg is what a comparison of proportions publishes
// (publishCompareBinary): the groups in order, the reference, the value
// counted as a success, and each group's successes and cases.
type compareBinaryAgg struct {
	groups  []Group
	ref     int
	success string
	xs, ns  []int
}

func runCompare(a *run) error {
	s := a.spec
	if s.By == s.Target[0] {
		return a.errSameBy()
	}
	o, err := a.readOutcome(s.Target[0], s.TargetPos[0])
	if err != nil {
		return err
	}
	gs, missBy, _, err := a.groups(s.By, s.ByPos)
	if err != nil {
		return err
	}
	return a.compare(gs, missBy, o.binary, o.success, func(x *compareBinaryAgg) error {
		for i, g := range gs {
			x.xs[i], x.ns[i] = o.counts(g.Rows)
		}
		return nil
	}, func(x *compareNumericAgg) error {
		box := a.kind(figures.Dot) == figures.Box
		for _, g := range gs {
			v := o.values(g.Rows)
			sm := sampleOf(v, 0, o.col)
			if box && sm.sum.N > 0 {
				sm.whiskers(v)
			}
			x.samples = append(x.samples, sm)
		}
		return nil
	})
}

func (a *run) errSameBy() error {
	return Errorf(a.spec.ByPos, "compare: by names the outcome itself; group by another column")
}

// compare is the common course of a comparison once its groups (in order;
// missBy rows have none) and the kind of its outcome are known: it checks
// that there are two groups or more, picks the reference, fills the
// checker metadata and checks the chart, then has counts fill each
// group's successes and cases (a binary outcome) or samples each group's
// sample (a numeric one), and publishes them.
func (a *run) compare(gs []Group, missBy int, binary bool, success string, counts func(*compareBinaryAgg) error, samples func(*compareNumericAgg) error) error {
	s := a.spec
	if len(gs) < 2 {
		label := "none"
		if len(gs) == 1 {
			label = fmt.Sprintf("only %q", gs[0].Label)
		}
		return Errorf(s.ByPos, "compare needs at least two groups of %s, and these rows have %s; check the where: conditions or the grouping column", s.By, label)
	}
	ref, err := a.reference(gs)
	if err != nil {
		return err
	}
	a.res.Meta.By = s.By
	a.res.Meta.Reference = gs[ref].Label
	for _, g := range gs {
		a.res.Meta.Groups = append(a.res.Meta.Groups, g.Label)
	}
	if missBy > 0 {
		a.note("%s rows with no value for %s are left out.", Thousands(fmt.Sprint(missBy)), s.By)
	}
	if binary {
		if err := a.chartOK(compareBinaryCharts...); err != nil {
			return err
		}
		x := compareBinaryAgg{groups: gs, ref: ref, success: success, xs: make([]int, len(gs)), ns: make([]int, len(gs))}
		if err := counts(&x); err != nil {
			return err
		}
		return publishCompareBinary(a, x)
	}
	if err := a.chartOK(compareNumericCharts...); err != nil {
		return err
	}
	x := compareNumericAgg{groups: gs, ref: ref}
	if err := samples(&x); err != nil {
		return err
	}
	return publishCompareNumeric(a, x)
}

// publishCompareNumeric publishes a comparison of means: group means, the
// difference from the reference with Welch's interval and test, Cohen's d,
// and a one-way ANOVA for 3+ groups.
func publishCompareNumeric(a *run, x compareNumericAgg) error {
	s := a.spec
	gs, ref := x.groups, x.ref
	a.res.Meta.Outcome = "numeric"
	a.method("mean-sd", "t-interval", "welch", "cohen-d")
	sums := make([]stats.Summary, len(gs))
	moms := make([]stats.Moments, len(gs))
	n := 0
	for i, sm := range x.samples {
		sums[i], moms[i] = sm.sum, sm.mom
		n += sm.sum.N
	}
	a.res.Meta.N = n
	a.set("n", float64(n), Count, "")
	multi := len(gs) > 2
	head := []string{s.By, "n", "Mean", "SD", "95% CI of mean", "Difference from " + gs[ref].Label, "95% CI of difference", "p (Welch)", "Cohen's d"}
	tab := Table{Head: head}
	for i, g := range gs {
		p := g.Slug + "."
		sm := sums[i]
		a.set(p+"n", float64(sm.N), Count, "")
		a.set(p+"mean", sm.Mean, Number, reasonN(sm.N, 1))
		a.set(p+"sd", sm.SD, Number, reasonN(sm.N, 2))
		a.set(p+"mean_low", sm.MeanLow, Number, reasonN(sm.N, 2))
		a.set(p+"mean_high", sm.MeanHigh, Number, reasonN(sm.N, 2))
		a.set(p+"median", sm.Median, Number, reasonN(sm.N, 1))
		row := []Cell{cellText(g.Label), a.numCell(p + "n"), a.numCell(p + "mean"), a.numCell(p + "sd"), a.rangeCell(p+"mean_low", p+"mean_high")}
		if i == ref {
			row = append(row, cellNum("reference", ""), cellText(""), cellText(""), cellText(""))
			tab.Rows = append(tab.Rows, row)
			continue
		}
		w := stats.WelchMoments(moms[ref], moms[i], level95)
		d := stats.CohenDMoments(moms[ref], moms[i])
		ratio := w.MeanB / w.MeanA
		ratioWhy := reasonOf(w.Reason, "MeanB")
		if ratioWhy == "" && w.MeanA == 0 {
			ratioWhy = "the reference group's mean is zero"
		}
		dWhy := ""
		if sums[ref].N < 2 || sm.N < 2 {
			dWhy = "each group needs at least two values"
		}
		q := ""
		if multi {
			q = p
		}
		a.set(q+"diff", w.Diff, Number, reasonOf(w.Reason, "Diff"))
		a.set(q+"diff_low", w.Low, Number, reasonOf(w.Reason, "Low"))
		a.set(q+"diff_high", w.High, Number, reasonOf(w.Reason, "High"))
		a.set(q+"ratio", ratio, Ratio, ratioWhy)
		a.set(q+"d", d, Number, dWhy)
		a.set(q+"t", w.T, Number, reasonOf(w.Reason, "T"))
		a.set(q+"df", w.DF, Number, reasonOf(w.Reason, "DF"))
		// With three or more groups, p is the ANOVA's (FORMAT.md); each
		// group's own Welch test is GROUP.p_welch.
		pname := "p"
		if multi {
			pname = p + "p_welch"
		}
		a.set(pname, w.P, PValue, reasonOf(w.Reason, "P"))
		row = append(row, a.numCell(q+"diff"), a.rangeCell(q+"diff_low", q+"diff_high"), a.numCell(pname), a.numCell(q+"d"))
		tab.Rows = append(tab.Rows, row)
	}
	tab.Notes = append(tab.Notes, fmt.Sprintf("Differences are each group's mean minus the mean of %s, with Welch's t interval and test (unequal variances); Cohen's d uses the pooled SD.", gs[ref].Label))
	a.res.Tables = append(a.res.Tables, fitTable(tab))
	// Pairs of other groups, for claims that compare them with each other:
	// A.B.diff is B's mean minus A's (A first in the groups' order).
	otherPairs(gs, ref, func(i, j int) {
		w := stats.WelchMoments(moms[i], moms[j], level95)
		p := gs[i].Slug + "." + gs[j].Slug + "."
		a.set(p+"diff", w.Diff, Number, reasonOf(w.Reason, "Diff"))
		a.set(p+"diff_low", w.Low, Number, reasonOf(w.Reason, "Low"))
		a.set(p+"diff_high", w.High, Number, reasonOf(w.Reason, "High"))
		a.set(p+"p_welch", w.P, PValue, reasonOf(w.Reason, "P"))
	})
	if multi {
		an := stats.OneWayANOVAMoments(moms)
		a.method("anova")
		r := an.Reason
		a.set("f", an.F, Number, reasonOf(r, "F"))
		a.set("p", an.P, PValue, reasonOf(r, "P"))
		a.set("df_between", float64(an.DFBetween), Count, "")
		a.set("df_within", float64(an.DFWithin), Count, "")
		a.set("ss_between", an.SSBetween, Number, reasonOf(r, "SSBetween"))
		a.set("ss_within", an.SSWithin, Number, reasonOf(r, "SSWithin"))
		a.set("ms_between", an.MSBetween, Number, reasonOf(r, "MSBetween"))
		a.set("ms_within", an.MSWithin, Number, reasonOf(r, "MSWithin"))
		a.set("r2", an.R2, Number, reasonOf(r, "R2"))
		a.set("sigma", an.Sigma, Number, reasonOf(r, "Sigma"))
		at := Table{Caption: "One-way analysis of variance of " + s.Target[0] + " by " + s.By + ".",
			Head: []string{"Source", "Sum of squares", "df", "Mean square", "F", "p"}}
		at.Rows = [][]Cell{
			{cellText("Between groups"), a.numCell("ss_between"), a.numCell("df_between"), a.numCell("ms_between"), a.numCell("f"), a.numCell("p")},
			{cellText("Within groups"), a.numCell("ss_within"), a.numCell("df_within"), a.numCell("ms_within"), cellText(""), cellText("")},
		}
		at.Notes = []string{"R² = " + Format(a.res.Facts[s.ID+".r2"], -1) + "; residual SD = " + Format(a.res.Facts[s.ID+".sigma"], -1) + "."}
		a.res.Tables = append(a.res.Tables, at)
	}

	fs := a.figure(figures.Dot)
	fs.Title = fmt.Sprintf("Mean %s by %s", s.Target[0], s.By)
	fs.XLabel, fs.YLabel = s.By, s.Target[0]
	if fs.Kind == figures.Box {
		a.noteHidden(x.hidden)
	}
	ser := figures.Series{Name: "Mean"}
	for i, g := range gs {
		if sums[i].N == 0 {
			continue
		}
		fs.Categories = append(fs.Categories, g.Label)
		ser.Values = append(ser.Values, sums[i].Mean)
		ser.Low = append(ser.Low, sums[i].MeanLow)
		ser.High = append(ser.High, sums[i].MeanHigh)
		fs.Boxes = append(fs.Boxes, boxStats(g.Label, x.samples[i].box, sums[i]))
	}
	if fs.Kind == figures.Box {
		fs.Title = fmt.Sprintf("%s by %s", s.Target[0], s.By)
		a.method("tukey-box")
	} else {
		fs.Boxes = nil
		if fs.Kind == figures.Dot {
			fs.Title += ", with 95% confidence intervals"
		} else {
			ser.Low, ser.High = nil, nil
		}
		fs.Series = []figures.Series{ser}
	}
	return nil
}

// publishCompareBinary publishes a comparison of proportions: shares of
// successes per group, the difference in percentage points with
// Newcombe's interval, the risk ratio (Katz) and odds ratio (Woolf), the
// two-proportion z-test, and a chi-square test for 3+ groups.
func publishCompareBinary(a *run, x compareBinaryAgg) error {
	s := a.spec
	gs, ref, xs, ns := x.groups, x.ref, x.xs, x.ns
	a.res.Meta.Success = x.success
	a.res.Meta.Outcome = "binary"
	a.method("wilson", "newcombe", "katz", "woolf", "z-test")
	total := 0
	for i := range gs {
		total += ns[i]
	}
	a.res.Meta.N = total
	a.set("n", float64(total), Count, "")
	multi := len(gs) > 2
	succ := x.success
	tab := Table{Head: []string{s.By, "n", succ, "% " + succ, "95% CI", "Difference (points)", "95% CI of difference", "Risk ratio (95% CI)", "Odds ratio (95% CI)", "p"}}
	for i, g := range gs {
		p := g.Slug + "."
		a.set(p+"n", float64(ns[i]), Count, "")
		a.set(p+"successes", float64(xs[i]), Count, "")
		share, why := float64(xs[i])/float64(ns[i]), ""
		if ns[i] == 0 {
			why = "no cases in this group"
		}
		a.set(p+"pct", pct(share), Percent, why)
		lo, hi := stats.Wilson(xs[i], ns[i], level95)
		a.set(p+"pct_low", pct(lo), Percent, why)
		a.set(p+"pct_high", pct(hi), Percent, why)
		row := []Cell{cellText(g.Label), a.numCell(p + "n"), a.numCell(p + "successes"), a.numCell(p + "pct"), a.rangeCell(p+"pct_low", p+"pct_high")}
		if i == ref {
			row = append(row, cellNum("reference", ""), cellText(""), cellText(""), cellText(""), cellText(""))
			tab.Rows = append(tab.Rows, row)
			continue
		}
		pr := stats.TwoProportions(xs[ref], ns[ref], xs[i], ns[i], level95)
		r := pr.Reason
		q := ""
		if multi {
			q = p
		}
		a.set(q+"diff", pct(pr.Diff), Points, reasonOf(r, "Diff"))
		a.set(q+"diff_low", pct(pr.DiffLow), Points, reasonOf(r, "DiffLow"))
		a.set(q+"diff_high", pct(pr.DiffHigh), Points, reasonOf(r, "DiffHigh"))
		a.set(q+"ratio", pr.RiskRatio, Ratio, reasonOf(r, "RiskRatio"))
		a.set(q+"ratio_low", pr.RiskLow, Ratio, reasonOf(r, "RiskLow"))
		a.set(q+"ratio_high", pr.RiskHigh, Ratio, reasonOf(r, "RiskHigh"))
		a.set(q+"odds_ratio", pr.OddsRatio, Ratio, reasonOf(r, "OddsRatio"))
		a.set(q+"odds_low", pr.OddsLow, Ratio, reasonOf(r, "OddsLow"))
		a.set(q+"odds_high", pr.OddsHigh, Ratio, reasonOf(r, "OddsHigh"))
		a.set(q+"z", pr.Z, Number, reasonOf(r, "Z"))
		pname := q + "p"
		if multi {
			pname = p + "p_z"
		}
		a.set(pname, pr.P, PValue, reasonOf(r, "P"))
		row = append(row, a.numCell(q+"diff"), a.rangeCell(q+"diff_low", q+"diff_high"),
			a.estCell(q+"ratio", q+"ratio_low", q+"ratio_high"), a.estCell(q+"odds_ratio", q+"odds_low", q+"odds_high"), a.numCell(pname))
		tab.Rows = append(tab.Rows, row)
	}
	tab.Notes = append(tab.Notes, fmt.Sprintf("Shares of %s = %s with Wilson intervals. Differences are in percentage points against %s (Newcombe's hybrid score interval); risk ratios with the Katz log interval, odds ratios with Woolf's interval; p from the two-proportion z-test.", s.Target[0], succ, gs[ref].Label))
	if multi {
		a.method("chi-square")
		counts := make([][]float64, len(gs))
		for i := range gs {
			counts[i] = []float64{float64(xs[i]), float64(ns[i] - xs[i])}
		}
		cs := stats.ChiSquareIndependence(counts)
		a.set("chi2", cs.Chi2, Number, reasonOf(cs.Reason, "Chi2"))
		a.set("df", float64(cs.DF), Count, "")
		a.set("p", cs.P, PValue, reasonOf(cs.Reason, "P"))
		a.set("v", cs.CramersV, Number, reasonOf(cs.Reason, "CramersV"))
		tab.Notes = append(tab.Notes, fmt.Sprintf("Across all %d groups: chi-square = %s, df = %d, %s.", len(gs),
			Format(a.res.Facts[s.ID+".chi2"], -1), cs.DF, pText(a.res.Facts[s.ID+".p"])))
		if cs.MinExpected < 5 {
			a.note("Some expected counts are below 5, so the chi-square p-value is only approximate.")
		}
	}
	otherPairs(gs, ref, func(i, j int) {
		pr := stats.TwoProportions(xs[i], ns[i], xs[j], ns[j], level95)
		r := pr.Reason
		p := gs[i].Slug + "." + gs[j].Slug + "."
		a.set(p+"diff", pct(pr.Diff), Points, reasonOf(r, "Diff"))
		a.set(p+"diff_low", pct(pr.DiffLow), Points, reasonOf(r, "DiffLow"))
		a.set(p+"diff_high", pct(pr.DiffHigh), Points, reasonOf(r, "DiffHigh"))
		a.set(p+"ratio", pr.RiskRatio, Ratio, reasonOf(r, "RiskRatio"))
		a.set(p+"p_z", pr.P, PValue, reasonOf(r, "P"))
	})
	a.res.Tables = append(a.res.Tables, fitTable(tab))
	fs := a.figure(figures.Grouped)
	fs.Percent = true
	fs.Title = fmt.Sprintf("Share %s = %s by %s", s.Target[0], succ, s.By)
	fs.XLabel, fs.YLabel = s.By, "% "+succ
	ser := figures.Series{Name: "% " + succ}
	for i, g := range gs {
		if ns[i] == 0 {
			continue
		}
		fs.Categories = append(fs.Categories, g.Label)
		share := float64(xs[i]) / float64(ns[i])
		lo, hi := stats.Wilson(xs[i], ns[i], level95)
		ser.Values = append(ser.Values, pct(share))
		ser.Low = append(ser.Low, pct(lo))
		ser.High = append(ser.High, pct(hi))
	}
	if fs.Kind == figures.Stacked {
		other := figures.Series{Name: "other"}
		for _, v := range ser.Values {
			other.Values = append(other.Values, 100-v)
		}
		ser.Low, ser.High = nil, nil
		fs.Series = []figures.Series{ser, other}
		return nil
	}
	if fs.Kind != figures.Dot {
		ser.Low, ser.High = nil, nil
	}
	fs.Series = []figures.Series{ser}
	return nil
}

// otherPairs calls f for every pair i < j of groups, neither of them the
// reference (whose comparisons are published per group).
func otherPairs(gs []Group, ref int, f func(i, j int)) {
	for i := range gs {
		for j := i + 1; j < len(gs); j++ {
			if i != ref && j != ref {
				f(i, j)
			}
		}
	}
}

// numCell shows fact ID.name.
func (a *run) numCell(name string) Cell {
	full := a.spec.ID + "." + name
	return cellNum(Format(a.res.Facts[full], -1), full)
}

// rangeCell shows an interval "low to high".
func (a *run) rangeCell(low, high string) Cell {
	lo, hi := a.res.Facts[a.spec.ID+"."+low], a.res.Facts[a.spec.ID+"."+high]
	if !lo.Defined() || !hi.Defined() {
		return cellNum("undefined", a.spec.ID+"."+low)
	}
	return cellNum(Format(lo, -1)+" to "+Format(hi, -1), a.spec.ID+"."+low)
}

// estCell shows an estimate with its interval: "1.18 (0.92 to 1.51)".
func (a *run) estCell(est, low, high string) Cell {
	e := a.res.Facts[a.spec.ID+"."+est]
	if !e.Defined() {
		return cellNum("undefined: "+strings.TrimSuffix(e.Undefined, "."), a.spec.ID+"."+est)
	}
	r := a.rangeCell(low, high)
	return cellNum(Format(e, -1)+" ("+r.Text+")", a.spec.ID+"."+est)
}

// fitTable turns a table of a few groups with many columns so that the
// groups become columns: it then fits a printed page.
func fitTable(t Table) Table {
	if len(t.Rows) <= 5 && len(t.Head) > 6 {
		return t.Transpose()
	}
	return t
}

// pText writes a p-value for a sentence: "p = 0.023" or "p < 0.001".
func pText(f Fact) string {
	s := Format(f, -1)
	if strings.HasPrefix(s, "<") {
		return "p " + s
	}
	return "p = " + s
}
