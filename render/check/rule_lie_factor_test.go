package check

import (
	"fmt"
	"testing"

	"candor/blocks"
	"candor/figures"
)

func TestLieFactor(t *testing.T) {
	cat := blocks.Meta{Outcome: "categorical"}
	var flag, clean []figCase
	for _, lf := range []float64{1.06, 1.2, 1.5, 2, 2.7, 3.4, 6, 14.8, 0.94, 0.8, 0.5, 0.2} {
		flag = append(flag, figCase{fmt.Sprintf("lie factor %v", lf),
			in(figBlock("b", "frequency", cat, fig(figures.Bar, cats3, 60, 70, 95), geom(figures.Bar, 50, 100, lf, true)))})
	}
	for _, lf := range []float64{1, 0.95, 1.05, 0.99, 1.01, 1.03} {
		clean = append(clean, figCase{fmt.Sprintf("lie factor %v", lf),
			in(figBlock("b", "frequency", cat, fig(figures.Bar, cats3, 60, 70, 95), geom(figures.Bar, 0, 100, lf, true)))})
	}
	flag = append(flag, figCase{"marks drawn from 50", in(func() Block {
		b := figBlock("b", "frequency", cat, fig(figures.Bar, cats3, 60, 90), geom(figures.Bar, 50, 100, 0, true))
		b.Figure.Marks = []figures.Mark{{Value: 60, Length: 20}, {Value: 90, Length: 80}}
		return b
	}())})
	clean = append(clean,
		figCase{"line without lie", in(figBlock("l", "trend", blocks.Meta{}, fig(figures.Line, cats3, 1, 2, 3), geom(figures.Line, 0, 5, 3, false)))},
		figCase{"scatter", in(figBlock("c", "correlation", blocks.Meta{}, &figures.Spec{Kind: figures.Scatter}, geom(figures.Scatter, 0, 5, 0, false)))},
		figCase{"no geometry", in(figBlock("n", "frequency", cat, fig(figures.Bar, cats3, 1, 2, 3), nil))},
		figCase{"no figure", in(figBlock("n", "frequency", cat, nil, geom(figures.Bar, 0, 5, 3, true)))},
		figCase{"honest marks", in(func() Block {
			b := figBlock("b", "frequency", cat, fig(figures.Bar, cats3, 60, 90), geom(figures.Bar, 0, 100, 0, true))
			b.Figure.Marks = []figures.Mark{{Value: 60, Length: 60}, {Value: 90, Length: 90}}
			return b
		}())},
		figCase{"dot plot", in(figBlock("d", "compare", blocks.Meta{}, fig(figures.Dot, cats3, 1, 2, 3), geom(figures.Dot, 0, 5, 4, false)))},
	)
	figureTable(t, "lie-factor", flag, clean)
}
