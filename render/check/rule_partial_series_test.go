package check

import (
	"fmt"
	"testing"

	"candor/blocks"
	"candor/figures"
)

func TestPartialSeriesFigures(t *testing.T) {
	times := []string{"Q1", "Q2", "Q3", "Q4"}
	tr := blocks.Meta{Time: "quarter", Times: times}
	filtered := func(id, analysis string, filter string, others ...Block) []Block {
		b := figBlock(id, analysis, blocks.Meta{Outcome: "numeric"}, fig(figures.Bar, cats3, 1, 2, 3), nil)
		b.Result.Filters = []string{filter}
		return append([]Block{b}, others...)
	}
	trend := figBlock("t", "trend", tr, fig(figures.Line, times, 1, 2, 3, 4), nil)
	trend.Result.Pos.Line = 9
	var flag, clean []figCase
	for n := 1; n < 4; n++ {
		flag = append(flag, figCase{fmt.Sprintf("trend shows %d of 4", n), in(figBlock("t", "trend", tr, fig(figures.Line, times[:n], 1), nil))})
	}
	flag = append(flag,
		figCase{"trend as bars of the last quarter", in(figBlock("t", "trend", tr, fig(figures.Bar, times[3:], 4), nil))},
		figCase{"post-test only", filtered("s", "summary", "wave = post")},
		figCase{"after only", filtered("s", "summary", "phase = after")},
		figCase{"follow-up only", filtered("s", "summary", "wave = follow-up")},
		figCase{"baseline only", filtered("s", "compare", "round = baseline")},
		figCase{"one quarter of a trend's column", filtered("s", "frequency", "quarter = Q4", trend)},
		figCase{"one quarter when another block shows Q1", filtered("s", "frequency", "quarter = Q4", func() Block {
			b := figBlock("u", "summary", blocks.Meta{}, nil, nil)
			b.Result.Filters = []string{"quarter = Q1"}
			b.Result.Pos.Line = 9
			return b
		}())},
		figCase{"one wave of a by: column", filtered("s", "summary", "wave = 2", func() Block {
			b := figBlock("u", "compare", blocks.Meta{By: "wave", Groups: []string{"1", "2"}}, nil, nil)
			b.Result.Pos.Line = 9
			return b
		}())},
		figCase{"one month of a trend", filtered("s", "summary", "month = March", func() Block {
			b := figBlock("u", "trend", blocks.Meta{Time: "month", Times: []string{"January", "February", "March"}}, nil, nil)
			b.Result.Pos.Line = 9
			return b
		}())},
		figCase{"one term, pre named", filtered("s", "summary", "test = pre")},
	)
	clean = append(clean,
		figCase{"trend shows every point", in(figBlock("t", "trend", tr, fig(figures.Line, times, 1, 2, 3, 4), nil))},
		figCase{"trend without a figure", in(figBlock("t", "trend", tr, nil, nil))},
		figCase{"summary filtered by store", filtered("s", "summary", "store = North")},
		figCase{"summary filtered by plan", filtered("s", "summary", "plan = annual")},
		figCase{"filter that is not equality", filtered("s", "summary", "wave >= 2")},
		figCase{"time filter with no evidence of other points", filtered("s", "summary", "quarter = Q4")},
		figCase{"frequency without filters", in(figBlock("f", "frequency", blocks.Meta{}, fig(figures.Bar, cats3, 1, 2, 3), nil))},
		figCase{"compare by wave shows both", in(figBlock("c", "compare", blocks.Meta{By: "wave", Groups: []string{"pre", "post"}}, fig(figures.Dot, []string{"pre", "post"}, 1, 2), nil))},
		figCase{"filtered post-test without a figure", func() []Block {
			b := figBlock("s", "summary", blocks.Meta{}, nil, nil)
			b.Result.Filters = []string{"wave = post"}
			return in(b)
		}()},
		figCase{"filter on inequality of wave", filtered("s", "summary", "wave != pre")},
		figCase{"filter on region equal to post", filtered("s", "summary", "region = post")},
		figCase{"a trend of two points shown", in(figBlock("t", "trend", blocks.Meta{Time: "wave", Times: []string{"pre", "post"}}, fig(figures.Line, []string{"pre", "post"}, 1, 2), nil))},
	)
	figureTable(t, "partial-series", flag, clean)
}

func TestPartialSeriesProse(t *testing.T) {
	sat := in(ctxSatisfaction)
	post := block("post", "summary", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"score"}, N: 60},
		facts("post", "n=60#", "mean=74.2", "median=75", "sd=8.1"), nil)
	post.Result.Filters = []string{"wave = post"} // drawn nowhere: only the prose is judged
	ps := in(post)
	flag := append(
		cs(sat,
			"In March, 45% of members were satisfied.",
			"Satisfaction stood at 45.0% in March.",
			"By March {{satisfaction.march.pct}} of members were satisfied.",
			"March satisfaction was 45%, the report's headline.",
			"Members were satisfied at a rate of 45% in March.",
			"The March survey found 45% satisfied.",
		),
		cs(ps,
			"After tutoring, pupils scored 74.2 on average.",
			"The mean post-test score was 74.2.",
			"Post-test scores averaged {{post.mean}}.",
			"The median pupil scored 75 after tutoring.",
			"Pupils scored 74 on average at the end of the year.",
			"Scores averaged 74.2, a good result.",
		)...)
	clean := append(
		cs(sat,
			"Satisfaction rose from 40% in January to 45% in March.",
			"In March, 45% were satisfied, up from 40% in January.",
			"Satisfaction rose 5 points over the quarter.",
			"Satisfaction changed by {{satisfaction.change}} points.",
			"Members were surveyed every month.",
			"In January 40% were satisfied and in March 45%.",
		),
		cs(ps,
			"Pupils scored 74.2 on average after tutoring, against 68.0 at the pre-test.",
			"The post-test was taken in June.",
			"Scores rose to 74.2 on average.",
			"Compared with the pre-test, scores averaged 74.2.",
			"Pupils sat the test in the hall.",
			"Tutors met pupils weekly.",
		)...)
	tableTest(t, "partial-series", flag, clean)
}
