package check

import "testing"

func TestStrength(t *testing.T) {
	v := in(ctxVisits)   // r = 0.21
	d := in(ctxDistance) // r = -0.62
	sp := in(ctxSpend)   // R² = 0.18
	sc := in(ctxScores)  // d = 0.62
	flag := append(append(append(
		cs(v,
			"Visits and spend are strongly correlated.",
			"There is a strong relationship between visits and spend.",
			"Spend is closely linked to visits.",
			"Visits and spend show a moderate correlation.",
			"The correlation between visits and spend is very strong.",
		),
		cs(d,
			"Distance is only weakly related to attendance.",
			"There is no correlation between distance and attendance.",
			"Distance and attendance are unrelated.",
			"Distance and attendance show a slight negative association.",
		)...),
		cs(sp,
			"Visits are strongly related to spend.",
			"Spend and visits are perfectly correlated.",
		)...),
		cs(sc,
			"Tutoring had a small effect on scores.",
			"The difference in scores was negligible.",
		)...)
	clean := append(append(append(
		cs(v,
			"Visits and spend are weakly correlated.",
			"There is a weak positive relationship between visits and spend.",
			"Spend is loosely linked to visits.",
			"Visits and spend show a small correlation (r = 0.21).",
		),
		cs(d,
			"Distance is strongly related to attendance.",
			"There is a strong negative correlation between distance and attendance.",
			"Distance and attendance are closely linked.",
			"The strong winds closed the school on one day.",
		)...),
		cs(sp,
			"Visits are moderately related to spend.",
			"Spend and visits are weakly to moderately correlated.",
		)...),
		cs(sc,
			"Tutoring had a medium effect on scores.",
			"The difference in scores was moderate.",
		)...)
	flag = append(flag, cs(in(ctxDistance),
		"The link between how far pupils live from school and how often they attend is weak.",
	)...)
	flag = append(flag, cs(in(ctxVisits),
		"Visits are a strong predictor of spend.",
		"Visits strongly determine spend.",
	)...)
	flag = append(flag, cs(in(ctxBands),
		"Age strongly shapes satisfaction (Cramér's V 0.17).",
	)...)
	clean = append(clean, cs(in(ctxDistance),
		"The link between how far pupils live from school and how often they attend is strong.",
		"Distance is a strong predictor of attendance.",
	)...)
	clean = append(clean, cs(in(ctxVisits),
		"Visits are only a weak predictor of spend.",
	)...)
	clean = append(clean, cs(in(ctxBands),
		"Age and satisfaction are weakly associated (Cramér's V 0.17).",
	)...)
	tableTest(t, "strength", flag, clean)
}
