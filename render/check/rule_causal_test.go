package check

import "testing"

func TestCausal(t *testing.T) {
	r := in(ctxRenewals)
	v := in(ctxVisits)
	sc := in(ctxScores)
	flag := append(append(append(
		cs(r,
			"The annual plan causes members to renew.",
			"Renewal is driven by the annual plan.",
			"The annual plan led to higher renewal.",
			"Renewal rose because of the annual plan.",
			"The effect of the plan on renewal was 6.9 points.",
			"The annual plan boosted renewal.",
		),
		cs(v,
			"More visits lead to higher spend.",
			"Spend grows due to frequent visits.",
			"Visits drive spend.",
		)...),
		cs(sc,
			"Tutoring improved reading scores.",
			"The tutoring programme raised scores by 6 points.",
		)...),
		[]ruleCase{
			{text: "Visits drive spend.", blocks: v, design: "randomized"},
			{text: "Higher spend is the result of more visits, which results in loyalty.", blocks: v, design: "randomized"},
		}...)
	clean := append(append(append(
		cs(r,
			"Annual members were more likely to renew than monthly members.",
			"Renewal was associated with the annual plan.",
			"The gap may be due to who chooses the annual plan.",
			"We cannot say whether the plan causes renewal.",
			"Renewal rose over the year.",
			"The annual plan went with higher renewal.",
		),
		cs(v,
			"More visits went together with higher spend.",
			"Spend increased in every month.",
			"Spend was higher among frequent visitors.",
		)...),
		cs(sc,
			"Tutored pupils scored higher than the others.",
		)...),
		[]ruleCase{
			{text: "Tutoring raised scores by 6 points.", blocks: sc, design: "randomized"},
			{text: "The effect of tutoring on scores was 6.2 points.", blocks: sc, design: "randomized"},
			{text: "Tutoring led to higher scores.", blocks: sc, design: "randomized"},
		}...)
	tableTest(t, "causal", flag, clean)
}
