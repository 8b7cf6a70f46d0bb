package check

import "testing"

func TestQuantifier(t *testing.T) {
	m := in(ctxModes)
	r := in(ctxRenewals)
	tk := in(ctxTickets)
	w := in(ctxWaits)
	flag := append(append(append(
		cs(m,
			"Most riders chose a classic bike.",
			"The majority of trips were made by scooter.",
			"Nearly all riders chose an e-bike.",
			"All riders used an e-bike.",
			"Few riders chose an e-bike.",
			"The vast majority of riders chose an e-bike.",
		),
		cs(r,
			"Most annual members renewed.",
			"The majority of monthly members renewed.",
			"Nearly all members renewed.",
		)...),
		cs(tk,
			"Nearly all season ticket holders were satisfied.",
			"Few single ticket holders were satisfied.",
		)...),
		cs(w,
			"Most patients waited under 25 minutes.",
			"Nearly all patients waited under 30 minutes.",
		)...)
	clean := append(append(append(
		cs(m,
			"Most riders chose an e-bike.",
			"A minority of riders chose a scooter.",
			"Few riders chose a scooter.",
			"The most popular choice was the e-bike.",
			"At most 52% chose an e-bike.",
			"All three modes were offered at every station.",
		),
		cs(r,
			"Most monthly members did not renew.",
			"A minority of annual members renewed.",
			"Most members joined in spring.",
		)...),
		cs(tk,
			"Most season ticket holders were satisfied.",
			"Most single ticket holders were satisfied.",
		)...),
		cs(w,
			"Most patients waited under 30 minutes.",
			"Nearly all patients waited under 45 minutes at most.",
		)...)
	flag = append(flag, cs(in(ctxCommute),
		"Most staff travel 30 minutes or more.",
		"Most staff commute under a quarter of an hour.",
		"Nearly all staff travel under 30 minutes.",
	)...)
	flag = append(flag, cs(in(ctxMentor),
		"Most members had a mentor.",
		"The majority of new members were mentored.",
		"Most members without a mentor left within the year.",
	)...)
	flag = append(flag, cs(in(ctxStalls),
		"Both stalls averaged over £7k a day.",
	)...)
	flag = append(flag, cs(in(ctxMeals),
		"Most evenings had a hot menu.",
	)...)
	clean = append(clean, cs(in(ctxCommute),
		"Most staff travel between 15 and 45 minutes.",
		"Most staff commute under 30 minutes.",
		"Nearly all staff travel under 45 minutes.",
	)...)
	clean = append(clean, cs(in(ctxMentor),
		"Most members had no mentor.",
		"Most mentored members stayed.",
	)...)
	clean = append(clean, cs(in(ctxStalls),
		"No stall averaged less than £6k a day.",
		"Both stalls averaged over £6k a day.",
	)...)
	clean = append(clean, cs(in(ctxModes),
		"Most riders chose an e-bike or a scooter.",
	)...)
	flag = append(flag, cs(in(ctxLagoon),
		"Every month South hired out over 8.5 kayaks a day.",
		"Most months saw North hire out over 13 kayaks a day.",
	)...)
	clean = append(clean, cs(in(ctxLagoon),
		"In most months North hired out over 10.5 kayaks a day.",
		"Every month North hired out at least 10 kayaks a day.",
	)...)
	tableTest(t, "quantifier", flag, clean)
}
