package blocks

import (
	"fmt"
	"math"

	"candor/blocks/stats"
	"candor/figures"
)

func init() { analyses["correlation"] = runCorrelation }

// runCorrelation: Pearson's r with its Fisher-z interval and t-test p,
// Spearman's rho, over the rows where both columns are present.
func runCorrelation(a *run) error {
	s := a.spec
	if err := a.chartOK(figures.Scatter); err != nil {
		return err
	}
	x, err := a.numeric(s.Target[0], s.TargetPos[0], "correlation")
	if err != nil {
		return err
	}
	y, err := a.numeric(s.Target[1], s.TargetPos[1], "correlation")
	if err != nil {
		return err
	}
	xs, ys := pairedValues(x, y)
	a.method("pearson", "fisher-z", "spearman")
	c := stats.Pearson(xs, ys, level95)
	rho := stats.Spearman(xs, ys)
	a.res.Meta.N = c.N
	a.res.Meta.Outcome = "numeric"
	a.set("n", float64(c.N), Count, "")
	a.set("r", c.R, Number, reasonOf(c.Reason, "R"))
	a.set("r_low", c.Low, Number, reasonOf(c.Reason, "Low"))
	a.set("r_high", c.High, Number, reasonOf(c.Reason, "High"))
	a.set("p", c.P, PValue, reasonOf(c.Reason, "P"))
	a.set("r2", c.R*c.R, Number, reasonOf(c.Reason, "R"))
	rhoWhy := ""
	if math.IsNaN(rho) {
		rhoWhy = "needs at least two pairs with spread in both columns"
	}
	a.set("rho", rho, Number, rhoWhy)
	a.rangeFacts("x_", x, xs)
	a.rangeFacts("y_", y, ys)
	tab := Table{Head: []string{"", "n", "Pearson r", "95% CI", "p", "Spearman rho"}}
	tab.Rows = [][]Cell{{cellText(s.Target[0] + " and " + s.Target[1]), a.numCell("n"), a.numCell("r"), a.rangeCell("r_low", "r_high"), a.numCell("p"), a.numCell("rho")}}
	tab.Notes = []string{"Pearson's r with a Fisher z interval and a t-test (n − 2 df); Spearman's rho on ranks, ties sharing their average rank. A correlation measures association, not cause."}
	a.res.Tables = append(a.res.Tables, tab)
	fs := a.figure(figures.Scatter)
	fs.Title = fmt.Sprintf("%s against %s", s.Target[1], s.Target[0])
	fs.XLabel, fs.YLabel = s.Target[0], s.Target[1]
	fs.Percent = false
	for i := 0; i < xs.Len(); i++ {
		fs.Points = append(fs.Points, figures.Point{X: xs.At(i), Y: ys.At(i)})
	}
	if fit, err := stats.OLS(ys, []stats.Values{xs}, true, level95); err == nil {
		fs.Fit = &figures.Fit{Intercept: fit.Coef[0], Slope: fit.Coef[1], Label: fitLabel(fit.Coef[0], fit.Coef[1], fit.R2)}
	}
	return nil
}

// pairedValues keeps the rows where both columns are present.
func pairedValues(x, y *Column) (stats.Values, stats.Values) {
	var idx []int
	for i := 0; i < x.Len(); i++ {
		if !x.Missing(i) && !y.Missing(i) {
			idx = append(idx, i)
		}
	}
	return x.Num.Subset(idx), y.Num.Subset(idx)
}

// rangeFacts publishes the observed range of a column as PREFIXmin and
// PREFIXmax.
func (a *run) rangeFacts(prefix string, c *Column, v stats.Values) {
	lo, hi := math.Inf(1), math.Inf(-1)
	for i := 0; i < v.Len(); i++ {
		lo, hi = math.Min(lo, v.At(i)), math.Max(hi, v.At(i))
	}
	why := ""
	if v.Len() == 0 {
		why = "no values"
	}
	a.set(prefix+"min", c.Snap(lo, 0), Number, why)
	a.set(prefix+"max", c.Snap(hi, 0), Number, why)
}

// fitLabel writes a fitted line's equation and R².
func fitLabel(b0, b1, r2 float64) string {
	sign := "+"
	if b1 < 0 {
		sign = "−"
	}
	return fmt.Sprintf("y = %s %s %s·x, R² = %s", Sig(b0, 3), sign, Sig(math.Abs(b1), 3), Sig(r2, 2))
}
