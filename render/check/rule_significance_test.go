package check

import "testing"

func TestSignificance(t *testing.T) {
	r := in(ctxRenewals) // p = 0.31
	u := in(ctxUptake)   // p < 0.001
	v := in(ctxVisits)   // p = 0.04
	flag := append(append(append(
		cs(r,
			"Annual members renewed significantly more often than monthly members.",
			"The annual plan clearly improves renewal.",
			"The gap between the plans is statistically significant.",
			"This confirms that annual members renew more.",
			"The data prove that the annual plan works.",
			"The plan made no difference to renewal.",
			"There was no difference in renewal between the plans.",
		),
		cs(u,
			"The offer made no difference to uptake (p < 0.001).",
			"The difference in uptake was not significant.",
			"There is no evidence that the letter and the text message differ in uptake.",
			"This proves that text messages work better for uptake.",
		)...),
		cs(v,
			"The correlation between visits and spend was not statistically significant.",
		)...),
		cs(in(ctxLoans),
			"Loans fell significantly over the year.",
		)...)
	clean := append(append(append(
		cs(r,
			"The difference in renewal between the plans was not significant (p = 0.31).",
			"There was no significant difference in renewal between the plans.",
			"The data cannot tell the two plans' renewal apart.",
			"Annual members renewed somewhat more often, but the gap could be chance.",
			"We found no clear evidence that the plan matters for renewal.",
			"The gap is within the margin of error for renewal.",
		),
		cs(u,
			"Text messages raised uptake significantly (p < 0.001).",
			"The difference in uptake is statistically significant.",
			"The result confirms the earlier uptake study.",
			"Uptake was clearly higher after a text message.",
		)...),
		cs(v,
			"The correlation between visits and spend was significant but weak (p = 0.04).",
		)...),
		cs(in(ctxLoans),
			"Loans fell by 1.2 per member over the year.",
		)...)
	flag = append(flag, cs(in(ctxMeals),
		"Mixed menus left significantly more than cold menus.",
		"The mixed-menu gap over cold menus is clearly real.",
	)...)
	flag = append(flag, cs(in(ctxBooked),
		"Counter bookers turned up significantly more often than online bookers.",
		"The channels differ very significantly (p = 0.01).",
	)...)
	clean = append(clean, cs(in(ctxMeals),
		"Hot menus left significantly more than cold menus (p = 0.004).",
		"The menus differ significantly overall (p = 0.012).",
		"Mixed menus left more than cold menus, but the gap could be chance (p = 0.09).",
	)...)
	clean = append(clean, cs(in(ctxBooked),
		"Phone bookers turned up significantly less often than online bookers.",
		"Turn-up differed significantly between the channels (p = 0.01).",
	)...)
	tableTest(t, "significance", flag, clean)
}
