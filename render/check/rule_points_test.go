package check

import "testing"

func TestPoints(t *testing.T) {
	sat := in(ctxSatisfaction)
	r := in(ctxRenewals)
	u := in(ctxUptake)
	flag := append(append(
		cs(sat,
			"Satisfaction rose 5% between January and March.",
			"Satisfaction rose by 5 percent over the quarter.",
			"Satisfaction was up 5% on January.",
			"Satisfaction climbed 2.5% from January to February.",
			"Satisfaction rose {{satisfaction.change}}% over the quarter.",
			"Satisfaction rose by 12.5 points over the quarter.",
			"Satisfaction grew 12.5 percentage points between January and March.",
		),
		cs(r,
			"Annual members renewed 6.9% more often than monthly members.",
			"The annual plan's renewal rate was 7% higher.",
			"Renewal was 18 points higher on the annual plan.",
		)...),
		cs(u,
			"A text message raised uptake by 21% compared with a letter.",
			"Uptake was 105 points higher after a text message than after a letter.",
		)...)
	clean := append(append(
		cs(sat,
			"Satisfaction rose 5 points between January and March.",
			"Satisfaction rose by 5 percentage points, from 40% to 45%.",
			"Satisfaction rose 12.5% in relative terms over the quarter.",
			"Satisfaction rose {{satisfaction.change}} points over the quarter.",
			"Satisfaction climbed 2.5 points from January to February.",
			"Satisfaction was 45% in March.",
		),
		cs(r,
			"Annual members renewed 6.9 points more often than monthly members.",
			"The annual plan's renewal rate was 18% higher in relative terms.",
			"Renewal was about 7 points higher on the annual plan.",
		)...),
		cs(u,
			"A text message raised uptake by 21 points compared with a letter.",
			"Uptake was 105% higher after a text message than after a letter.",
			"Uptake was 41% after a text message and 20% after a letter.",
		)...)
	flag = append(flag, cs(in(ctxMentor),
		"Mentored members were 15% more likely to stay.",
	)...)
	flag = append(flag, cs(in(ctxBooked),
		"Phone bookers turned up 6% less often than online bookers.",
	)...)
	clean = append(clean, cs(in(ctxMentor),
		"Mentored members were 15 points more likely to stay.",
		"Mentored members were about 27% more likely to stay.",
	)...)
	clean = append(clean, cs(in(ctxBooked),
		"Phone bookers turned up 6 points less often than online bookers.",
	)...)
	tableTest(t, "points", flag, clean)
}
