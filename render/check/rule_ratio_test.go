package check

import "testing"

func TestRatio(t *testing.T) {
	r := in(ctxRenewals)
	u := in(ctxUptake)
	sc := in(ctxScores)
	sat := in(ctxSatisfaction)
	flag := append(append(append(
		cs(r,
			"Annual members were nearly 1.5 times as likely to renew as monthly members.",
			"Annual members were twice as likely to renew.",
			"Annual members renewed at 1.4x the monthly rate.",
			"Monthly members were half as likely to renew as annual members.",
			"The annual plan's renewal rate was three times the monthly rate.",
			"Renewal was 1.6 times higher on the annual plan.",
		),
		cs(u,
			"A text message made members three times as likely to join as a letter.",
			"Text messages were 1.5 times as effective as letters.",
			"Uptake was four-fold higher after a text message than after a letter.",
		)...),
		cs(sc,
			"Tutored pupils scored twice as high as the others.",
			"Tutored pupils scored 1.5 times as high as pupils who were not tutored.",
		)...),
		cs(sat,
			"Satisfaction doubled between January and March.",
			"Satisfaction tripled over the quarter.",
		)...)
	clean := append(append(append(
		cs(r,
			"Annual members were about 1.2 times as likely to renew as monthly members.",
			"Annual members were {{renewals.ratio}} times as likely to renew.",
			"The risk ratio was 1.18 (95% CI 0.92–1.51).",
			"Members renewed twice a year at most.",
			"Monthly members were about 0.85 times as likely to renew as annual members.",
		),
		cs(u,
			"A text message made members twice as likely to join as a letter.",
			"Text messages were about 2 times as effective as letters.",
			"Members sent a text message were 2.05 times as likely to join.",
			"The odds of joining were nearly three times as high after a text message (odds ratio 2.78).",
		)...),
		cs(sc,
			"Tutored pupils scored about 1.1 times as high as the others.",
			"Tutors met pupils three times a week.",
		)...),
		cs(sat,
			"Satisfaction rose by about an eighth, from 40% to 45%.",
			"The survey was sent three times in the quarter.",
		)...)
	flag = append(flag, cs(in(ctxMeals),
		"Hot menus left half as much again as cold ones.",
		"Hot menus left three to one against cold menus.",
		"Leftovers on hot evenings were 1.6 times cold evenings'.",
	)...)
	flag = append(flag, cs(in(ctxBooked),
		"Online bookers turned up twice as often as phone bookers.",
	)...)
	flag = append(flag, cs(in(ctxLagoon))...)
	clean = append(clean, cs(in(ctxMeals),
		"Hot menus left about 1.25 times cold menus' leftovers.",
		"Hot evenings left a quarter more than cold evenings.",
		"Hot menus left 1.25 times as much as cold ones.",
	)...)
	clean = append(clean, cs(in(ctxLagoon),
		"North's hires rose by 40% over the spring, nearly half as much again.",
		"South's hires rose by about a tenth.",
	)...)
	clean = append(clean, cs(in(ctxLoans),
		"At this rate loans will double by next spring.",
	)...)
	tableTest(t, "ratio", flag, clean)
}
