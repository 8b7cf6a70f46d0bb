package check

import (
	"testing"

	"candor/blocks"
	"candor/figures"
)

func TestChartChoice(t *testing.T) {
	cat := blocks.Meta{Outcome: "categorical"}
	num := blocks.Meta{Outcome: "numeric"}
	six := []string{"a", "b", "c", "d", "e", "f"}
	flag := []figCase{
		{"pie with six slices", in(figBlock("p", "frequency", cat, fig(figures.Pie, six, 10, 10, 10, 20, 20, 30), nil))},
		{"pie with eight slices", in(figBlock("p", "frequency", cat, fig(figures.Pie, append(six, "g", "h"), 1, 1, 1, 1, 1, 1, 1, 1), nil))},
		{"pie of percentages summing to 130", in(figBlock("p", "frequency", cat, &figures.Spec{Kind: figures.Pie, Percent: true, Categories: cats3, Series: []figures.Series{{Values: []float64{50, 40, 40}}}}, nil))},
		{"pie of percentages summing to 80", in(figBlock("p", "frequency", cat, &figures.Spec{Kind: figures.Pie, Percent: true, Categories: cats3, Series: []figures.Series{{Values: []float64{30, 30, 20}}}}, nil))},
		{"pie of means", in(figBlock("p", "summary", num, fig(figures.Pie, cats3, 4.1, 4.6, 3.9), nil))},
		{"pie of group means", in(figBlock("p", "compare", num, fig(figures.Pie, cats3, 65, 71, 70), nil))},
		{"line across unordered categories", in(figBlock("l", "frequency", cat, fig(figures.Line, cats3, 1, 2, 3), nil))},
		{"line across groups", in(figBlock("l", "compare", num, fig(figures.Line, cats3, 1, 2, 3), nil))},
		{"line across summary groups", in(figBlock("l", "summary", num, fig(figures.Line, cats3, 1, 2, 3), nil))},
		{"histogram of categories", in(figBlock("h", "frequency", cat, &figures.Spec{Kind: figures.Histogram}, nil))},
		{"histogram of a crosstab", in(figBlock("h", "crosstab", cat, &figures.Spec{Kind: figures.Histogram}, nil))},
		{"bars for a binned frequency", in(figBlock("b", "frequency", blocks.Meta{Outcome: "numeric", Binned: true}, fig(figures.Bar, cats3, 1, 2, 3), nil))},
		{"bars for a correlation", in(figBlock("b", "correlation", num, fig(figures.Bar, cats3, 1, 2, 3), nil))},
	}
	clean := []figCase{
		{"pie with three slices", in(figBlock("p", "frequency", cat, fig(figures.Pie, cats3, 20, 30, 50), nil))},
		{"pie with five slices", in(figBlock("p", "frequency", cat, fig(figures.Pie, six[:5], 20, 20, 20, 20, 20), nil))},
		{"pie of percentages summing to 100", in(figBlock("p", "frequency", cat, &figures.Spec{Kind: figures.Pie, Percent: true, Categories: cats3, Series: []figures.Series{{Values: []float64{50, 30, 20}}}}, nil))},
		{"pie of percentages summing to 100.4", in(figBlock("p", "frequency", cat, &figures.Spec{Kind: figures.Pie, Percent: true, Categories: cats3, Series: []figures.Series{{Values: []float64{50.2, 30.1, 20.1}}}}, nil))},
		{"line over time", in(figBlock("l", "trend", blocks.Meta{Times: cats3}, fig(figures.Line, cats3, 1, 2, 3), nil))},
		{"line over ordered levels", in(figBlock("l", "frequency", blocks.Meta{Outcome: "categorical", Ordered: true}, fig(figures.Line, cats3, 1, 2, 3), nil))},
		{"histogram of numbers", in(figBlock("h", "frequency", num, &figures.Spec{Kind: figures.Histogram}, nil))},
		{"bars of categories", in(figBlock("b", "frequency", cat, fig(figures.Bar, cats3, 1, 2, 3), nil))},
		{"grouped bars of a compare", in(figBlock("g", "compare", blocks.Meta{Outcome: "binary"}, fig(figures.Grouped, cats3, 1, 2, 3), nil))},
		{"scatter of a correlation", in(figBlock("c", "correlation", num, &figures.Spec{Kind: figures.Scatter}, nil))},
		{"box of a summary", in(figBlock("x", "summary", num, &figures.Spec{Kind: figures.Box}, nil))},
		{"no figure", in(figBlock("n", "frequency", cat, nil, nil))},
		{"stacked crosstab", in(figBlock("s", "crosstab", cat, fig(figures.Stacked, cats3, 1, 2, 3), nil))},
		{"bars for whole values 1 to 5", in(figBlock("b", "frequency", num, fig(figures.Bar, cats3, 1, 2, 3), nil))},
	}
	figureTable(t, "chart-choice", flag, clean)
}
