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
	flag = append(flag, cs(in(ctxMentor),
		"Staying was rarer with a mentor.",
		"Members stayed less often with a mentor.",
	)...)
	flag = append(flag, cs(in(ctxLagoon),
		"South's hires grew more than North's over the spring.",
		"North's hires rose every month, and South's rose month after month.",
		"North's hires peaked in March.",
		"Compared with North, South gained more hires a day.",
	)...)
	flag = append(flag, cs(in(ctxMeals),
		"Leftovers rose on mixed evenings compared with hot evenings.",
	)...)
	clean = append(clean, cs(in(ctxMentor),
		"Staying was more common with a mentor.",
		"Members stayed more often with a mentor.",
	)...)
	clean = append(clean, cs(in(ctxLagoon),
		"North's hires grew more than South's over the spring.",
		"North's hires rose in every month.",
		"North's hires peaked in April.",
		"South's hires bottomed out in February.",
		"The gap between the lagoons falls just short of significance.",
	)...)
	clean = append(clean, cs(in(ctxMeals),
		"Leftovers rose on hot evenings compared with cold evenings.",
	)...)
	flag = append(flag, cs(in(ctxMeals),
		"Mixed menus left the most food.",
	)...)
	flag = append(flag, cs(in(ctxBooked),
		"Phone bookers had the highest turn-up rate.",
		"Phone bookers finished ahead of online bookers.",
	)...)
	clean = append(clean, cs(in(ctxMeals),
		"Hot menus left the most food.",
		"Cold menus left the least.",
	)...)
	clean = append(clean, cs(in(ctxBooked),
		"Counter bookers had the highest turn-up rate.",
		"The lowest turn-up rate was among phone bookers.",
		"Phone bookers were 6 points behind online bookers.",
	)...)
	tableTest(t, "direction", flag, clean)
}
