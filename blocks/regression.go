package blocks

import (
	"errors"
	"fmt"
	"sort"
	"strconv"
	"strings"

	"candor/blocks/stats"
	"candor/figures"
)

func init() { analyses["regression"] = runRegression }

// term is one column of the design matrix: a number predictor, or one
// level of a category predictor coded 1/0 against its first level.
type term struct {
	name   string // fact name: the predictor's slug, or PRED_LEVEL
	label  string // as shown
	pred   int    // index into spec.Predictors
	col    *Column
	level  string // category level, "" for a number predictor
	values stats.Values
}

func runRegression(a *run) error {
	s := a.spec
	if err := a.chartOK(figures.Scatter); err != nil {
		return err
	}
	y, err := a.numeric(s.Target[0], s.TargetPos[0], "regression")
	if err != nil {
		return err
	}
	for i, p := range s.Predictors {
		if p == s.Target[0] {
			return Errorf(s.PredictorsPos[i], "regression: %s is the outcome; it cannot also be a predictor", p)
		}
	}
	// Complete cases: the outcome and every predictor present.
	idx := make([]int, 0, y.Len())
	for i := 0; i < y.Len(); i++ {
		ok := !y.Missing(i)
		for _, p := range s.Predictors {
			ok = ok && !a.t.Col(p).Missing(i)
		}
		if ok {
			idx = append(idx, i)
		}
	}
	var terms []term
	for pi, p := range s.Predictors {
		c := a.t.Col(p)
		if c.Type == TypeNumber {
			terms = append(terms, term{name: Slug(p), label: p, pred: pi, col: c, values: c.Num.Subset(idx)})
			continue
		}
		var levels []string
		seen := map[string]bool{}
		for _, i := range idx {
			if l := c.Text(i); !seen[l] {
				seen[l] = true
				levels = append(levels, l)
			}
		}
		levels, _ = NaturalOrder(levels)
		if len(levels) < 2 {
			return Errorf(s.PredictorsPos[pi], "regression: predictor %s has a single value here (%q), so it explains nothing; drop it", p, first(levels))
		}
		for _, l := range levels[1:] {
			d := make([]float64, len(idx))
			for k, i := range idx {
				if c.Text(i) == l {
					d[k] = 1
				}
			}
			terms = append(terms, term{name: Slug(p + "_" + l), label: p + " = " + l, pred: pi, col: c, level: l, values: stats.Plain(d)})
		}
		a.note("%s is a category: each level is compared with %s, its first level.", p, levels[0])
	}
	xs := make([]stats.Values, len(terms))
	for i, t := range terms {
		xs[i] = t.values
	}
	yv := y.Num.Subset(idx)
	a.method("ols-qr", "cooks")
	fit, err := stats.OLS(yv, xs, s.Intercept, level95)
	if err != nil {
		return a.regressionError(err, terms, len(idx))
	}
	n := fit.N
	a.res.Meta.N = n
	a.res.Meta.Outcome = "numeric"
	a.res.Meta.Predictors = append([]string(nil), s.Predictors...)
	r := fit.Reason
	a.set("n", float64(n), Count, "")
	a.set("r2", fit.R2, Number, reasonOf(r, "R2"))
	a.set("adj_r2", fit.AdjR2, Number, reasonOf(r, "AdjR2"))
	a.set("f", fit.F, Number, reasonOf(r, "F"))
	a.set("p", fit.FP, PValue, reasonOf(r, "FP"))
	a.set("sigma", fit.Sigma, Number, reasonOf(r, "Sigma"))
	a.set("df_resid", float64(fit.DFResid), Count, "")
	coefTab := Table{Head: []string{"Term", "Estimate", "SE", "t", "p", "95% CI"}}
	names := []string{}
	if s.Intercept {
		names = append(names, "intercept")
	}
	for _, t := range terms {
		names = append(names, t.name)
	}
	for k, nm := range names {
		a.set(nm+".estimate", fit.Coef[k], Number, "")
		a.set(nm+".se", fit.SE[k], Number, reasonOf(r, "SE"))
		a.set(nm+".t", fit.T[k], Number, reasonOf(r, "T"))
		a.set(nm+".p", fit.P[k], PValue, reasonOf(r, "P"))
		a.set(nm+".low", fit.Low[k], Number, reasonOf(r, "Low"))
		a.set(nm+".high", fit.High[k], Number, reasonOf(r, "High"))
		label := "Intercept"
		if nm != "intercept" {
			label = terms[k-len(names)+len(terms)].label
		}
		coefTab.Rows = append(coefTab.Rows, []Cell{cellText(label), a.numCell(nm + ".estimate"), a.numCell(nm + ".se"), a.numCell(nm + ".t"), a.numCell(nm + ".p"), a.rangeCell(nm+".low", nm+".high")})
	}
	coefTab.Notes = []string{fmt.Sprintf("Ordinary least squares of %s on %s, n = %s. R² = %s, adjusted R² = %s, F = %s (%s), residual SE = %s.",
		s.Target[0], strings.Join(s.Predictors, ", "), Thousands(strconv.Itoa(n)), a.fmt("r2"), a.fmt("adj_r2"), a.fmt("f"), pText(a.res.Facts[s.ID+".p"]), a.fmt("sigma"))}
	if !s.Intercept {
		coefTab.Notes = append(coefTab.Notes, "Fitted through the origin (intercept: false), so R² is measured from zero, not from the mean.")
	}
	a.res.Tables = append(a.res.Tables, coefTab)

	// Observed ranges, for the extrapolation check.
	numeric := 0
	for _, t := range terms {
		if t.level == "" {
			numeric++
			a.rangeFacts(t.name+".", t.col, t.values)
		}
	}
	if len(terms) == 1 && terms[0].level == "" {
		a.rangeFacts("x_", terms[0].col, terms[0].values)
	}

	// Influential points: Cook's distance above 4/n.
	cut := 4 / float64(n)
	type infl struct {
		row int
		d   float64
	}
	var flagged []infl
	maxD := 0.0
	for k, d := range fit.Cooks {
		if d > maxD {
			maxD = d
		}
		if d > cut {
			flagged = append(flagged, infl{k, d})
		}
	}
	a.set("influential", float64(len(flagged)), Count, "")
	a.set("max_cooks", maxD, Number, "")
	if len(flagged) > 0 {
		sort.SliceStable(flagged, func(i, j int) bool { return flagged[i].d > flagged[j].d })
		it := Table{Caption: fmt.Sprintf("Influential rows: Cook's distance above 4/n = %s (the largest %d).", Sig(cut, 3), min(len(flagged), 5)),
			Head: []string{"Row", s.Target[0], "Fitted", "Residual", "Leverage", "Cook's distance"}}
		for _, f := range flagged[:min(len(flagged), 5)] {
			it.Rows = append(it.Rows, []Cell{cellText(strconv.Itoa(idx[f.row] + 1)), cellNum(Sig(yv.At(f.row), 4), ""), cellNum(Sig(fit.Fitted[f.row], 4), ""),
				cellNum(Sig(fit.Residuals[f.row], 3), ""), cellNum(Sig(fit.Leverage[f.row], 3), ""), cellNum(Sig(f.d, 3), "")})
		}
		it.Notes = []string{fmt.Sprintf("%d of %s rows exceed the cut-off; rows are numbered as in the data after filters. Check them before trusting the fit.", len(flagged), Thousands(strconv.Itoa(n)))}
		a.res.Tables = append(a.res.Tables, it)
	}

	// Predictions with 95% prediction intervals.
	if len(s.Predict) > 0 {
		a.method("prediction-interval")
		pt := Table{Caption: "Predicted " + s.Target[0] + " with 95% prediction intervals for a new case.", Head: append(append([]string{""}, s.Predictors...), "Predicted", "95% prediction interval")}
		for k, want := range s.Predict {
			x := make([]float64, len(terms))
			for _, key := range sortedKeys(want) {
				if !contains(s.Predictors, key) {
					return Errorf(s.PredictPos[k], "predict names %q, which is not a predictor%s", key, suggestOrList(key, s.Predictors))
				}
			}
			row := []Cell{cellText(strconv.Itoa(k + 1))}
			for ti, t := range terms {
				if t.level != "" {
					return Errorf(s.PredictPos[k], "predict: %s is a category predictor; predictions take number predictors only", t.col.Name)
				}
				v, ok := want[t.col.Name]
				if !ok {
					return Errorf(s.PredictPos[k], "predict: give a value for every predictor; %s is missing", t.col.Name)
				}
				x[ti] = v
			}
			est, lo, hi := fit.Predict(x, level95)
			p := fmt.Sprintf("predict.%d.", k+1)
			for ti, t := range terms {
				a.set(p+t.name, x[ti], Number, "")
				row = append(row, cellNum(Sig(x[ti], 4), ""))
			}
			a.set(p+"estimate", est, Number, "")
			a.set(p+"low", lo, Number, "no residual degrees of freedom")
			a.set(p+"high", hi, Number, "no residual degrees of freedom")
			row = append(row, a.numCell(p+"estimate"), a.rangeCell(p+"low", p+"high"))
			pt.Rows = append(pt.Rows, row)
		}
		a.res.Tables = append(a.res.Tables, pt)
	}

	fs := a.figure(figures.Scatter)
	fs.Percent = false
	if len(terms) == 1 && terms[0].level == "" {
		fs.Title = fmt.Sprintf("%s against %s, with the fitted line", s.Target[0], s.Predictors[0])
		fs.XLabel, fs.YLabel = s.Predictors[0], s.Target[0]
		fs.Points = make([]figures.Point, 0, yv.Len())
		for i := 0; i < yv.Len(); i++ {
			fs.Points = append(fs.Points, figures.Point{X: terms[0].values.At(i), Y: yv.At(i)})
		}
		b0 := 0.0
		b1 := fit.Coef[0]
		if s.Intercept {
			b0, b1 = fit.Coef[0], fit.Coef[1]
		}
		fs.Fit = &figures.Fit{Intercept: b0, Slope: b1, Label: fitLabel(b0, b1, fit.R2)}
		return nil
	}
	fs.Title = fmt.Sprintf("Observed against fitted %s", s.Target[0])
	fs.XLabel, fs.YLabel = "Fitted "+s.Target[0], s.Target[0]
	fs.Points = make([]figures.Point, 0, yv.Len())
	for i := 0; i < yv.Len(); i++ {
		fs.Points = append(fs.Points, figures.Point{X: fit.Fitted[i], Y: yv.At(i)})
	}
	fs.Fit = &figures.Fit{Intercept: 0, Slope: 1, Label: "observed = fitted, R² = " + Sig(fit.R2, 2)}
	return nil
}

func (a *run) fmt(name string) string { return Format(a.res.Facts[a.spec.ID+"."+name], -1) }

// regressionError explains a fit that cannot be made, naming the columns.
func (a *run) regressionError(err error, terms []term, rows int) error {
	s := a.spec
	at := s.KeyPos["predictors"]
	var ce *stats.CollinearError
	if errors.As(err, &ce) {
		var cols []string
		for _, c := range ce.Columns {
			if c >= 0 && c < len(terms) {
				cols = append(cols, terms[c].label)
			}
		}
		what := strings.Join(cols, ", ")
		if s.Intercept && len(cols) == 1 {
			what += " and the intercept"
		}
		return Errorf(at, "regression: the predictors are perfectly collinear (%s: one is an exact linear combination of the others), so their effects cannot be told apart; drop one of them", what)
	}
	var ke *stats.ConstantError
	if errors.As(err, &ke) {
		return Errorf(at, "regression: a predictor does not vary in these rows (%v); drop it", err)
	}
	var te *stats.TooFewRowsError
	if errors.As(err, &te) {
		return Errorf(at, "regression: %d complete rows cannot fit %d coefficients; use fewer predictors or more data", rows, te.Coefficients)
	}
	return Errorf(at, "regression: %v", err)
}
