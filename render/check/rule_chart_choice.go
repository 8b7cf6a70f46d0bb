package check

import (
	"math"

	"candor/figures"
)

var chartChoiceRule = &Rule{
	ID: "chart-choice",
	Doc: `chart-choice flags a chart unfit for its data: a pie with more than five slices (a note: compare bars instead) or with ` +
		`values that are not shares of one whole (percentages that do not sum to 100 within 1 point, or means), a line across ` +
		`categories without an order (a line says the points are in sequence), a histogram of categories (bins are for numbers), ` +
		`and bars for a continuous variable (a frequency that cut a number column into bins drawn as separate bars, or a scatter's data as bars; whole values tabled one by one may be bars). ` +
		`Severity warning, note for the pie with many slices.`,
	On:    Figures,
	Check: checkChartChoice,
}

func checkChartChoice(p *Pass) []Finding {
	bi := p.bi
	spec := bi.figure
	if spec == nil {
		return nil
	}
	m := bi.meta
	switch spec.Kind {
	case figures.Pie:
		var out []Finding
		if n := len(spec.Categories); n > 5 {
			out = append(out, p.atBlock(Note, bi, "the pie has %d slices; angles of more than five are hard to compare; try chart: bar", n))
		}
		switch bi.analysis {
		case "summary", "compare", "trend", "correlation", "regression":
			if bi.measureStat() == "mean" || bi.analysis == "correlation" || bi.analysis == "regression" {
				out = append(out, p.atBlock(Warning, bi, "the pie shows %s values, which are not shares of one whole; try chart: bar or chart: dot", bi.analysis))
				return out
			}
		}
		if spec.Percent && len(spec.Series) > 0 {
			sum := 0.0
			for _, v := range spec.Series[0].Values {
				sum += v
			}
			if math.Abs(sum-100) > 1 {
				out = append(out, p.atBlock(Warning, bi, "the pie's shares sum to %.1f%%, not 100%%, so they are not parts of one whole; try chart: bar", sum))
			}
		}
		return out
	case figures.Line:
		if bi.analysis == "trend" || m.Ordered || len(m.Times) > 0 {
			return nil
		}
		if bi.analysis == "frequency" || bi.analysis == "summary" || bi.analysis == "compare" || bi.analysis == "crosstab" {
			return []Finding{p.atBlock(Warning, bi, "a line joins categories that have no order (%s); try chart: bar or chart: dot", bi.analysis)}
		}
	case figures.Histogram:
		if m.Outcome == "categorical" || m.Outcome == "binary" || bi.analysis == "crosstab" {
			return []Finding{p.atBlock(Warning, bi, "a histogram of categories: bins are for numbers; try chart: bar")}
		}
	case figures.Bar:
		if bi.analysis == "frequency" && m.Binned {
			return []Finding{p.atBlock(Warning, bi, "bars for a continuous variable: separate bars hide that the bins are adjacent ranges; try chart: histogram")}
		}
		if bi.analysis == "correlation" || bi.analysis == "regression" {
			return []Finding{p.atBlock(Warning, bi, "bars for a %s: the data are pairs of numbers; try chart: scatter", bi.analysis)}
		}
	}
	return nil
}
