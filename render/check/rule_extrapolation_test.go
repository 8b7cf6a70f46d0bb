package check

import "testing"

func TestExtrapolation(t *testing.T) {
	sp := in(ctxSpend) // visits 2 to 38
	l := in(ctxLoans)
	flag := append(
		cs(sp,
			"A customer with 60 visits would spend about $138.",
			"At 50 visits, the model predicts a spend of $117.",
			"We expect spend of $180 for customers making 80 visits a year.",
			"A member making 45 visits would spend $107.",
			"The fit predicts {{spend.predict.2.estimate}} for a heavy user.",
			"Customers with one visit would spend $15.",
			"With 100 visits, spend would reach $222.",
		),
		cs(l,
			"Loans will fall to 3.5 per member next year.",
			"At this rate loans are on course to reach 3 per member.",
			"We forecast about 3.8 loans per member in the next quarter.",
			"Loans per member are expected to drop below 4 by next year.",
			"Mean loans will be under {{loans.q4.mean}} by next spring.",
		)...)
	clean := append(
		cs(sp,
			"A customer with 30 visits would spend about $75.",
			"At 20 visits, the model predicts a spend of $55.",
			"The fit predicts {{spend.predict.1.estimate}} for a customer with 30 visits.",
			"Customers made between 2 and 38 visits.",
			"Each extra visit went with $2.10 more spend.",
			"We will publish the data next year.",
			"Spend rose with visits (R² = 0.18).",
		),
		cs(l,
			"Loans fell from 5.3 to 4.1 per member.",
			"We will review the loan rules in spring.",
			"Loans per member fell in every quarter.",
			"If the fall continues, the library will need fewer copies.",
			"Members borrowed 4.1 books each in Q4.",
		)...)
	flag = append(flag, cs(in(ctxLeaflets),
		"A 2,000-leaflet drop would bring in about 140 bookings.",
		"With no leaflets at all the model still expects about 40 bookings.",
		"Delivering 1,500 leaflets should yield about 115 bookings.",
		"The model predicts 140 bookings.",
	)...)
	clean = append(clean, cs(in(ctxLeaflets),
		"A 500-leaflet drop would bring in about 65 bookings.",
		"Delivering 800 leaflets should yield about 80 bookings.",
		"The model predicts 65 bookings for a typical drop.",
		"With no extra leaflets bookings would stay where they are.",
	)...)
	flag = append(flag, cs(in(ctxLeaflets),
		"If we delivered 5,000 leaflets we would get 400 bookings.",
	)...)
	flag = append(flag, cs(in(ctxLoans),
		"At this rate loans will double by next spring.",
	)...)
	clean = append(clean, cs(in(ctxLeaflets),
		"If we delivered 700 leaflets we would get about 75 bookings.",
	)...)
	tableTest(t, "extrapolation", flag, clean)
}
