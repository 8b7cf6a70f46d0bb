package check

import (
	"testing"

	"candor/blocks"
	"candor/figures"
)

func TestUnshownFit(t *testing.T) {
	pair := blocks.Meta{Columns: []string{"visits", "spend"}}
	var flag, clean []figCase
	for _, k := range []figures.Kind{figures.Bar, figures.Line, figures.Dot, figures.Box, figures.Histogram, figures.Pie} {
		flag = append(flag,
			figCase{"correlation as " + string(k), in(figBlock("c", "correlation", pair, fig(k, cats3, 1, 2, 3), nil))},
			figCase{"regression as " + string(k), in(figBlock("r", "regression", pair, fig(k, cats3, 1, 2, 3), nil))})
	}
	flag = append(flag,
		figCase{"correlation with chart: none", in(figBlock("c", "correlation", pair, nil, nil))},
		figCase{"regression with chart: none", in(figBlock("r", "regression", pair, nil, nil))},
		figCase{"scatter of other columns", in(figBlock("c", "correlation", pair, nil, nil),
			figBlock("d", "correlation", blocks.Meta{Columns: []string{"age", "spend"}}, &figures.Spec{Kind: figures.Scatter}, nil))},
	)
	// A regression's columns are its outcome and its predictors; a scatter
	// of the same columns in another section does not show this block's.
	rain := blocks.Meta{Columns: []string{"riders"}, Predictors: []string{"rain_mm"}}
	warm := blocks.Meta{Columns: []string{"riders"}, Predictors: []string{"temp_c"}}
	elsewhere := figBlock("d", "correlation", blocks.Meta{Columns: []string{"rain_mm", "riders"}}, &figures.Spec{Kind: figures.Scatter}, nil)
	elsewhere.Section = 2
	flag = append(flag,
		figCase{"regression with chart: none beside another predictor's scatter", in(figBlock("r", "regression", rain, nil, nil),
			figBlock("t", "regression", warm, &figures.Spec{Kind: figures.Scatter}, nil))},
		figCase{"the same columns drawn in another section", in(figBlock("r", "regression", rain, nil, nil), elsewhere)},
	)
	clean = append(clean,
		figCase{"regression shown by a correlation of its columns", in(figBlock("r", "regression", rain, nil, nil),
			figBlock("d", "correlation", blocks.Meta{Columns: []string{"rain_mm", "riders"}}, &figures.Spec{Kind: figures.Scatter}, nil))},
	)
	clean = append(clean,
		figCase{"correlation as scatter", in(figBlock("c", "correlation", pair, &figures.Spec{Kind: figures.Scatter}, nil))},
		figCase{"regression as scatter", in(figBlock("r", "regression", pair, &figures.Spec{Kind: figures.Scatter}, nil))},
		figCase{"correlation shown by another block", in(figBlock("c", "correlation", pair, nil, nil),
			figBlock("d", "regression", blocks.Meta{Columns: []string{"spend", "visits"}}, &figures.Spec{Kind: figures.Scatter}, nil))},
	)
	for _, a := range []string{"summary", "frequency", "crosstab", "compare", "trend", "stemleaf"} {
		clean = append(clean,
			figCase{a + " without a figure", in(figBlock("x", a, pair, nil, nil))},
			figCase{a + " as bars", in(figBlock("x", a, pair, fig(figures.Bar, cats3, 1, 2, 3), nil))})
	}
	figureTable(t, "unshown-fit", flag, clean)
}
