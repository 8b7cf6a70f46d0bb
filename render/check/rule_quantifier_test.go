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
	tableTest(t, "quantifier", flag, clean)
}
