package check

import "testing"

func TestDirection(t *testing.T) {
	l := in(ctxLoans)
	sat := in(ctxSatisfaction)
	r := in(ctxRenewals)
	sc := in(ctxScores)
	flag := append(append(append(append(
		cs(l,
			"Loans per member rose over the year.",
			"Mean loans grew from Q1 to Q4.",
			"Loans climbed steadily through the year.",
			"Loans increased between Q2 and Q3.",
			"Loans were higher in Q4 than in Q1.",
		),
		cs(sat,
			"Satisfaction fell over the quarter.",
			"Satisfaction dropped from 40% to 45%.",
			"Satisfaction was lower in March than in January.",
		)...),
		cs(r,
			"Monthly members renewed more often than annual members.",
			"Annual members were less likely to renew than monthly members.",
		)...),
		cs(sc,
			"Pupils who were not tutored scored higher than tutored pupils.",
		)...),
		cs(in(ctxDistance),
			"Attendance rose with distance.",
			"The correlation between distance and attendance was positive.",
		)...)
	clean := append(append(append(append(
		cs(l,
			"Loans per member fell over the year.",
			"Mean loans declined from Q1 to Q4.",
			"Loans did not rise in any quarter.",
			"Loans were lower in Q4 than in Q1.",
			"Up to 5 loans were allowed at a time.",
		),
		cs(sat,
			"Satisfaction rose over the quarter.",
			"Satisfaction climbed from 40% to 45%.",
			"More than 40% were satisfied in every month.",
		)...),
		cs(r,
			"Annual members renewed more often than monthly members.",
			"Monthly members were less likely to renew than annual members.",
		)...),
		cs(sc,
			"Tutored pupils scored higher than pupils who were not tutored.",
		)...),
		cs(in(ctxDistance),
			"Attendance fell as distance rose.",
			"The correlation between distance and attendance was negative.",
			"Pupils who lived further away attended less.",
		)...)
	tableTest(t, "direction", flag, clean)
}
