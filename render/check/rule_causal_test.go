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
	flag = append(flag, cs(in(ctxMentor),
		"Mentoring keeps members singing.",
		"A mentor gets new members through the first year.",
		"Mentors keep new members loyal.",
		"Members stay longer because they have someone to ask.",
		"The mentoring effect is large (15 points).",
	)...)
	flag = append(flag, cs(in(ctxVisits),
		"Visits determine how much customers spend.",
		"Frequent visits cut waste at the till.",
	)...)
	flag = append(flag, cs(in(ctxBooked),
		"Booking at the counter doubled turn-up rates for first-time visitors.",
	)...)
	clean = append(clean, cs(in(ctxMentor),
		"Mentored members stayed more often, perhaps because keener singers ask for a mentor.",
		"The choir kept records for all 200 members.",
		"Because the survey ran in May, late joiners are missing.",
		"The effect size is moderate (15 points, p = 0.03).",
		"Members kept their places in the choir more often with a mentor.",
	)...)
	clean = append(clean, cs(in(ctxLagoon),
		"North cut its waiting list by a third over the spring.",
		"The staff turned up on time every day.",
	)...)
	tableTest(t, "causal", flag, clean)
}

// TestCausalSummary reads a sentence of a section without blocks (a list
// of key points before the analyses) against the blocks whose columns and
// groups it names: its words are judged, its figures are not.
func TestCausalSummary(t *testing.T) {
	run := func(text string, section int) []Finding {
		in := input(text, ctxMentor)
		in.Blocks[0].Section = 2
		in.Units[0].Section, in.Units[0].Prev = section, ""
		var out []Finding
		for _, f := range Run(in) {
			out = append(out, f)
		}
		return out
	}
	for _, c := range []struct {
		text    string
		section int
		rule    string // "" for no finding at all
	}{
		{"Mentoring clearly keeps new members in the choir.", 1, "causal"},
		{"A mentor makes members stay.", 1, "causal"},
		{"Mentored members stayed more often than the others.", 1, ""},
		{"Mentored members stayed at 95%.", 1, ""},
		{"Mentoring keeps new members in the choir.", 0, ""},
	} {
		fs := run(c.text, c.section)
		got := ""
		for _, f := range fs {
			if got == "" || f.Rule == c.rule {
				got = f.Rule
			}
		}
		if got != c.rule {
			t.Errorf("%q (section %d): got finding %q, want %q (%v)", c.text, c.section, got, c.rule, fs)
		}
	}
}
