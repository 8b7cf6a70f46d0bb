package check

import "testing"

// TestVariedPhrasing: claims written in other words than the rule tables
// use; each must be flagged by some rule.
func TestVariedPhrasing(t *testing.T) {
	cases := append(append(append(append(
		cs(in(ctxRenewals),
			"Renewal is 7 percent higher for annual members.",
			"Annual members are significantly more loyal.",
			"Annual members renewed at a rate almost double that of monthly members.",
			"The plan difference is highly significant.",
			"A majority of annual members renewed.",
			"Renewal jumped to 52% among annual members.",
			"Roughly half of monthly members renewed.",
			"Annual membership leads to better renewal.",
			"Annual members renew about 50% more often than monthly members.",
		),
		cs(in(ctxWaits),
			"The average patient waited 40 minutes.",
			"Half of patients waited longer than 35 minutes.",
		)...),
		cs(in(ctxSatisfaction),
			"Satisfaction slipped over the quarter.",
			"Satisfaction went down between January and March.",
			"Satisfaction improved by 12 points over the quarter.",
		)...),
		cs(in(ctxLoans),
			"Borrowing picked up in the second half of the year.",
			"Loans per member edged up from Q3 to Q4.",
		)...),
		cs(in(ctxDistance),
			"Pupils living further away attended more.",
			"The link between distance and attendance is weak.",
			"Distance has no bearing on attendance.",
		)...)
	for _, c := range cases {
		if fs := Run(input(c.text, c.blocks...)); len(fs) == 0 {
			t.Errorf("not flagged: %q", c.text)
		}
	}
}
