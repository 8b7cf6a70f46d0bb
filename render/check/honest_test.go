package check

import "testing"

// TestHonestSentences: sentences a careful writer would use, in every
// context; no rule may flag them.
func TestHonestSentences(t *testing.T) {
	cases := append(append(append(append(append(
		cs(in(ctxRenewals),
			"Annual members renewed at {{renewals.annual.pct}} and monthly members at {{renewals.monthly.pct}}.",
			"The difference, {{renewals.diff}} points, could be chance (p = {{renewals.p}}).",
			"We cannot tell from these data whether the plan affects renewal.",
			"Members on both plans were sent the same reminder in week 2.",
			"The review was presented on 3 November 2026.",
			"Renewal rates for the two plans were 45% and 38%.",
			"About 45% of annual members renewed.",
			"Roughly two in five monthly members renewed.",
			"Fewer than half of the members on either plan renewed.",
			"Annual members renewed somewhat more often than monthly members, but the interval is wide.",
			"The risk ratio of {{renewals.ratio}} (95% CI {{renewals.ratio_low}} to {{renewals.ratio_high}}) includes 1.",
		),
		cs(in(ctxWaits),
			"Patients were seen in order of arrival except for urgent cases.",
			"The median wait, 28.5 minutes, was shorter than the mean, a sign of a few very long waits.",
			"One patient in four waited longer than 41 minutes.",
			"The 95% confidence interval for the mean runs from 32.2 to 36.2 minutes.",
			"Half of the patients waited 28.5 minutes or less.",
		)...),
		cs(in(ctxSatisfaction),
			"Satisfaction rose in each month of the quarter.",
			"By March 45% of members were satisfied, up from 40% in January.",
			"The rise of 5 points over three months is too short a run to forecast from.",
		)...),
		cs(in(ctxVisits),
			"Customers who visited more often tended to spend a little more (r = 0.21).",
			"The relationship is weak and explains little of the variation in spend.",
			"Visits and spend were weakly correlated, 95% CI 0.01 to 0.39.",
		)...),
		cs(in(ctxLoans),
			"Loans per member fell from 5.3 in Q1 to 4.1 in Q4.",
			"The fall was steepest between Q2 and Q3.",
			"Members borrowed about 4 books each in the last quarter, down from over 5 in the first.",
		)...),
		cs(in(ctxModes),
			"Just over half of riders chose an e-bike.",
			"Scooters were the least common choice, at about one in six riders.",
			"E-bikes, classic bikes and scooters were available at all 14 stations.",
		)...)
	for _, c := range cases {
		in := input(c.text, c.blocks...)
		if fs := Run(in); len(fs) > 0 {
			t.Errorf("flagged but honest: %q: %s %s", c.text, fs[0].Rule, fs[0].Message)
		}
	}
}
