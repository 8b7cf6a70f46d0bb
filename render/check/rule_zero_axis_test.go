package check

import (
	"fmt"
	"testing"

	"candor/blocks"
	"candor/figures"
)

func TestZeroAxis(t *testing.T) {
	cat := blocks.Meta{Outcome: "categorical"}
	var flag, clean []figCase
	for i, lo := range []float64{10, 20, 35, 50, 0.5, 1, 90, 60} {
		flag = append(flag, figCase{fmt.Sprintf("bar axis from %v", lo),
			in(figBlock("b", "frequency", cat, fig(figures.Bar, cats3, 60, 70, 95), geom(figures.Bar, lo, 100, 1, true)))})
		_ = i
	}
	flag = append(flag,
		figCase{"grouped from 30", in(figBlock("g", "compare", blocks.Meta{Outcome: "binary"}, fig(figures.Grouped, cats3, 40, 45, 50), geom(figures.Grouped, 30, 60, 2, true)))},
		figCase{"stacked from 20", in(figBlock("s", "crosstab", cat, fig(figures.Stacked, cats3, 40, 45, 50), geom(figures.Stacked, 20, 100, 1.3, true)))},
		figCase{"histogram from 5", in(figBlock("h", "frequency", blocks.Meta{Outcome: "numeric"}, &figures.Spec{Kind: figures.Histogram, Bins: []figures.Bin{{Lo: 0, Hi: 10, Value: 20}, {Lo: 10, Hi: 20, Value: 30}}}, geom(figures.Histogram, 5, 40, 1.2, true)))},
		figCase{"bar with axis: but not drawn", in(figBlock("b", "frequency", cat, &figures.Spec{Kind: figures.Bar, Categories: cats3, Series: []figures.Series{{Values: []float64{5, 6, 7}}}, AxisMin: ptr(4)}, nil))},
		figCase{"negative bars ending at -2", in(figBlock("n", "frequency", cat, fig(figures.Bar, cats3, -5, -6, -7), geom(figures.Bar, -10, -2, 1, true)))},
	)
	clean = append(clean,
		figCase{"bar from zero", in(figBlock("b", "frequency", cat, fig(figures.Bar, cats3, 60, 70, 95), geom(figures.Bar, 0, 100, 1, true)))},
		figCase{"grouped from zero", in(figBlock("g", "compare", blocks.Meta{Outcome: "binary"}, fig(figures.Grouped, cats3, 40, 45, 50), geom(figures.Grouped, 0, 60, 1, true)))},
		figCase{"stacked 0–100", in(figBlock("s", "crosstab", cat, fig(figures.Stacked, cats3, 40, 45, 50), geom(figures.Stacked, 0, 100, 1, true)))},
		figCase{"line from 30", in(figBlock("l", "trend", blocks.Meta{Times: cats3}, fig(figures.Line, cats3, 40, 45, 50), geom(figures.Line, 30, 60, 0, false)))},
		figCase{"dot plot from 60", in(figBlock("d", "compare", blocks.Meta{Outcome: "numeric"}, fig(figures.Dot, cats3, 65, 71, 70), geom(figures.Dot, 60, 80, 0, false)))},
		figCase{"scatter", in(figBlock("c", "correlation", blocks.Meta{}, &figures.Spec{Kind: figures.Scatter}, geom(figures.Scatter, 10, 80, 0, false)))},
		figCase{"box plot from 3", in(figBlock("x", "summary", blocks.Meta{}, &figures.Spec{Kind: figures.Box}, geom(figures.Box, 3, 95, 0, false)))},
		figCase{"no figure", in(figBlock("n", "summary", blocks.Meta{}, nil, nil))},
		figCase{"histogram from zero", in(figBlock("h", "frequency", blocks.Meta{Outcome: "numeric"}, &figures.Spec{Kind: figures.Histogram}, geom(figures.Histogram, 0, 40, 1, true)))},
		figCase{"negative bars to zero", in(figBlock("n", "frequency", cat, fig(figures.Bar, cats3, -5, -6, -7), geom(figures.Bar, -10, 0, 1, true)))},
		figCase{"mixed bars across zero", in(figBlock("m", "frequency", cat, fig(figures.Bar, cats3, -5, 6, 7), geom(figures.Bar, -10, 10, 1, true)))},
		figCase{"pie", in(figBlock("p", "frequency", cat, fig(figures.Pie, cats3, 20, 30, 50), geom(figures.Pie, 0, 0, 1, false)))},
	)
	figureTable(t, "zero-axis", flag, clean)
}

func ptr(v float64) *float64 { return &v }
