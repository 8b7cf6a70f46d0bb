package check

import "testing"

func TestNumber(t *testing.T) {
	r := in(ctxRenewals)
	w := in(ctxWaits)
	m := in(ctxModes)
	flag := append(append(append(
		cs(r,
			"Monthly members renewed at 41%.",
			"Annual members renewed at 48%, against 38% for monthly members.",
			"Over 46% of annual members renewed.",
			"Renewal among annual members was nearly 50%.",
			"Of the 110 monthly members, 45% renewed.",
			"The difference between the plans was p = 0.03.",
		),
		cs(w,
			"The median wait was 34 minutes.",
			"Patients waited 31.5 minutes on average.",
			"The longest wait was 125 minutes, over two hours.",
			"Waits averaged about 40 minutes.",
			"The shortest wait was 8 minutes.",
			"The mean wait was 34.2 minutes (95% CI 30.1–38.3).",
		)...),
		cs(m,
			"E-bikes took 58% of trips.",
			"Scooters accounted for fewer than 15% of trips.",
			"Classic bikes carried 71 riders.",
			"E-bikes carried 52.9% of riders.",
		)...),
		cs(in(ctxVisits), "Spend and visits went together (r = 0.31).")...)
	flag = append(flag, cs(in(ctxSpend), "Each additional visit added $3.40 to spend.")...)
	clean := append(append(append(
		cs(r,
			"Monthly members renewed at 38%.",
			"Annual members renewed at 45.1%, against 38.2% for monthly members.",
			"About 40% of monthly members renewed.",
			"Nearly 46% of annual members renewed.",
			"Over 45% of annual members renewed.",
			"In 2026 the scheme had 212 members in Store 12 and Store 14.",
			"The review covers the quarter to 30 September 2026.",
			"Monthly members renewed at {{renewals.monthly.pct}}.",
			"The difference between the plans was not significant (p = 0.31).",
		),
		cs(w,
			"The median wait was 28.5 minutes.",
			"Patients waited 34 minutes on average, and half waited under 29 minutes.",
			"The clinic opens at 8:30 and the survey ran for 12 weeks.",
			"The mean wait was 34.2 minutes (95% CI 32.2–36.2).",
			"The longest wait was 95 minutes.",
		)...),
		cs(m,
			"E-bikes took 52% of trips.",
			"Scooters accounted for under 17% of trips.",
			"Classic bikes carried 65 riders, about a third of trips.",
			"Route 7 and Route 12 opened in Q3.",
		)...),
		cs(in(ctxVisits), "Spend and visits went together weakly (r = 0.21, 95% CI 0.01–0.39).")...)
	clean = append(clean, cs(in(ctxSpend), "Each additional visit added $2.10 to spend.")...)
	// A figure is read against the statistic and group the sentence names,
	// in the unit it is written in.
	flag = append(flag, cs(in(ctxStalls),
		"Harbour averaged £9k a day.",
		"Harbour took £8.6k on an average day.",
		"Market's busiest day brought in £11.2k.",
		"Harbour's takings ranged from £3.1k to £14k a day.",
		"The Market stall took between £2k and £8k a day.",
	)...)
	flag = append(flag, cs(in(ctxCommute),
		"Over a third of staff travel under 15 minutes.",
		"One worker in ten takes 30 to 45 minutes.",
	)...)
	flag = append(flag, cs(in(ctxMeals),
		"Hot evenings left 10 kg on average, and mixed ones about 11 kg.",
		"Hot menus left 20% more than cold ones.",
	)...)
	flag = append(flag, cs(in(ctxMentor),
		"Mentored members stayed at 75%.",
		"Members without a mentor stayed at 60%.",
	)...)
	flag = append(flag, cs(in(ctxBands), "Older members were satisfied 75% of the time.")...)
	flag = append(flag, cs(in(ctxLagoon),
		"North's hires rose from 10 in January to 15 in April.",
		"North's hires grew by 4% over the spring.",
		"North's hires rose by half over the spring.",
		"South's hires grew by a third over the spring.",
	)...)
	flag = append(flag, cs(in(ctxBooked), "Phone bookers turned up 6 points less often (p = 0.3).")...)
	clean = append(clean, cs(in(ctxStalls),
		"Harbour averaged about £8.2k a day.",
		"Harbour's takings ranged from £3.1k to £12.4k a day.",
		"Market's best day brought in £9.9k.",
		"The typical Market day took £6.4k.",
		"Ratings (1 to 5) were collected at both stalls.",
		"Takings between £5k and £10k count as a normal day.",
	)...)
	clean = append(clean, cs(in(ctxCommute),
		"Two thirds of staff commute under 30 minutes.",
		"A tenth of staff travel 45 minutes or more.",
		"One worker in four takes 30 to 45 minutes.",
		"Over a third of staff have more than 2 children.",
	)...)
	clean = append(clean, cs(in(ctxMeals),
		"Hot menus left 25% more than cold ones.",
		"Hot menus left more than cold ones (p = 0.004).",
		"Mixed menus left about 1 kg more than cold ones (p = 0.09).",
		"Mixed menus differed little from cold ones (Cohen's d = 0.2).",
	)...)
	clean = append(clean, cs(in(ctxMentor), "Mentored members stayed at 70%, against 55% for the others.")...)
	clean = append(clean, cs(in(ctxBands),
		"Members aged 18 to 34 were satisfied 60% of the time.",
		"Older members were satisfied 82% of the time.",
	)...)
	clean = append(clean, cs(in(ctxLagoon), "North's hires rose from 10 in January to 14 in April.")...)
	clean = append(clean, cs(in(ctxBooked), "Phone bookers turned up 6 points less often (p = 0.03).")...)
	tableTest(t, "number", flag, clean)
}

// TestNumberTable reads a table's figures with their column's header: a
// mean under "Mean", a count of cases under "Evenings".
func TestNumberTable(t *testing.T) {
	head := "| Menu | Evenings | Mean leftovers (kg) |\n| --- | --- | --- |\n"
	cases := []struct {
		row  string
		flag bool
	}{
		{"| Cold | 50 | 8.0 |", false},
		{"| Hot | 60 | 10.0 |", false},
		{"| Mixed | 40 | 9.5 |", true},
		{"| Mixed | 44 | 9.0 |", true},
	}
	for _, c := range cases {
		in := tableInput(head+c.row+"\n", ctxMeals)
		var got []Finding
		for _, f := range Run(in) {
			if f.Rule == "number" {
				got = append(got, f)
			}
		}
		if c.flag != (len(got) > 0) {
			t.Errorf("%q: number findings %v, want flagged %v", c.row, got, c.flag)
		}
	}
}

func TestMatchesHedges(t *testing.T) {
	q := func(v, half float64, h hedge) *quantity {
		return &quantity{val: v, lo: v, hi: v, half: half, hedge: h}
	}
	cases := []struct {
		q    *quantity
		v    float64
		want bool
	}{
		{q(38, 0.5, hNone), 38.2, true},
		{q(38, 0.5, hNone), 38.6, false},
		{q(40, 0.5, hAbout), 38.2, true},
		{q(40, 0.5, hAbout), 37.4, false},
		{q(40, 0.5, hNearly), 38.2, true},
		{q(40, 0.5, hNearly), 40.4, true},
		{q(40, 0.5, hNearly), 41, false},
		{q(40, 0.5, hNearly), 35, false},
		{q(1.5, 0.05, hNearly), 1.18, false},
		{q(40, 0.5, hOver), 40.1, true},
		{q(40, 0.5, hOver), 40, false},
		{q(40, 0.5, hOver), 39.9, false},
		{q(40, 0.5, hAtLeast), 40, true},
		{q(40, 0.5, hUnder), 39.9, true},
		{q(40, 0.5, hUnder), 40, false},
		{q(40, 0.5, hAtMost), 40, true},
		{q(0.05, 0.005, hUnder), 0.31, false},
	}
	for _, c := range cases {
		if got := matches(c.q, c.v); got != c.want {
			t.Errorf("matches(%v %v, %v) = %v, want %v", c.q.hedge, c.q.val, c.v, got, c.want)
		}
	}
}
