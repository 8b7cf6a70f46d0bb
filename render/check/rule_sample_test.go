package check

import "testing"

func TestSample(t *testing.T) {
	rt := in(ctxRatings) // weekend n = 9
	pl := in(ctxPilot)   // n = 18
	flag := append(
		cs(rt,
			"Weekend customers rated the café 4.6 on average.",
			"Weekend ratings were higher than weekday ratings.",
			"At the weekend the mean rating rose to 4.6.",
			"Weekend visitors gave a median rating of 5.",
			"Ratings were clearly better at the weekend.",
			"The weekend mean rating was {{ratings.weekend.mean}}.",
			"Weekend customers were the happiest, at 4.6.",
		),
		cs(pl,
			"Hours of tutoring and gains were correlated (r = 0.48).",
			"More hours went with larger gains, r = 0.48.",
			"The pilot shows a clear link between hours and gains.",
			"Schools with more hours of tutoring saw higher gains.",
			"The correlation of hours and gain was {{pilot.r}}.",
		)...)
	clean := append(
		cs(rt,
			"Weekend customers (n = 9) rated the café 4.6 on average.",
			"The 9 weekend customers rated the café 4.6 on average.",
			"Weekday customers rated the café 4.1 on average.",
			"Only {{ratings.weekend.n}} weekend customers answered; they rated it 4.6.",
			"Weekday ratings averaged 4.1 across 120 customers.",
			"The survey asked customers to rate the café from 1 to 5.",
			"Nine weekend customers rated the café 4.6 on average.",
		),
		cs(pl,
			"In the 18 pilot schools, hours and gains were correlated (r = 0.48).",
			"Hours and gains were correlated (r = 0.48, n = 18).",
			"The pilot ran in {{pilot.n}} schools; hours and gains went together (r = 0.48).",
			"The pilot will be repeated next year.",
			"Tutors logged their hours each week.",
		)...)
	flag = append(flag, cs(in(ctxLagoon),
		"South's hires rose from 9 in January to 10 in April.",
		"South's hires grew over the spring.",
		"North's hires grew faster than South's.",
	)...)
	clean = append(clean, cs(in(ctxLagoon),
		"North's hires rose from 10 in January to 14 in April.",
		"South's hires, from 12 counting days a month, rose from 9 to 10.",
		"North's hires grew over the spring.",
	)...)
	flag = append(flag, cs(in(ctxBands),
		"Members aged 55 and over were satisfied 82% of the time.",
	)...)
	flag = append(flag, cs(in(ctxLagoon),
		"In April the South lagoon hired out 10 kayaks a day.",
	)...)
	clean = append(clean, cs(in(ctxBands),
		"Members aged 35 to 54 were satisfied 70% of the time.",
	)...)
	clean = append(clean, cs(in(ctxLagoon),
		"In April the North lagoon hired out 14 kayaks a day.",
	)...)
	tableTest(t, "sample", flag, clean)
}
