package check

import (
	"strings"

	"candor/blocks"
	"candor/figures"
)

// More invented contexts of the rule tests, for the readings that bind a
// figure by its group, statistic and unit.
var (
	// Leftovers per evening (kg) at a soup kitchen by menu: three groups,
	// each tested against the reference (GROUP.p_welch).
	ctxMeals = block("meals", "compare", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"leftover_kg"}, By: "menu",
		Groups: []string{"Cold", "Hot", "Mixed"}, Reference: "Cold", N: 150},
		facts("meals", "n=150#", "cold.n=50#", "hot.n=60#", "mixed.n=40#", "cold.mean=8.0", "hot.mean=10.0", "mixed.mean=9.0",
			"cold.sd=2.1", "hot.sd=2.4", "mixed.sd=2.2", "hot.diff=2.0", "hot.diff_low=1.1", "hot.diff_high=2.9", "mixed.diff=1.0",
			"mixed.diff_low=-0.1", "mixed.diff_high=2.1", "hot.ratio=1.25x", "mixed.ratio=1.125x", "hot.p_welch=0.004p",
			"mixed.p_welch=0.09p", "hot.d=0.45", "mixed.d=-0.2", "p=0.012p", "f=4.5"), &figures.Spec{Kind: figures.Dot})
	// Ticket holders who turned up, by how they booked: three groups of a
	// yes/no outcome (GROUP.p_z).
	ctxBooked = block("booked", "compare", 1, blocks.Meta{Outcome: "binary", Columns: []string{"attended"}, By: "channel",
		Groups: []string{"Online", "Phone", "Counter"}, Reference: "Online", N: 600},
		facts("booked", "n=600#", "online.n=300#", "phone.n=200#", "counter.n=100#", "online.pct=90.0%", "phone.pct=84.0%",
			"counter.pct=95.0%", "phone.diff=-6.0pt", "counter.diff=5.0pt", "phone.ratio=0.933x", "counter.ratio=1.056x",
			"phone.p_z=0.03p", "counter.p_z=0.2p", "p=0.01p", "chi2=9.2", "v=0.12"), &figures.Spec{Kind: figures.Grouped})
	// New choir members still singing after a year, by whether they had a
	// mentor: a yes/no grouping named by its column's words.
	ctxMentor = block("mentor", "compare", 1, blocks.Meta{Outcome: "binary", Columns: []string{"stayed"}, By: "mentored",
		Groups: []string{"no", "yes"}, Reference: "no", N: 200},
		facts("mentor", "n=200#", "no.n=120#", "yes.n=80#", "no.pct=55.0%", "yes.pct=70.0%", "no.successes=66#", "yes.successes=56#",
			"diff=15.0pt", "diff_low=1.5pt", "diff_high=28.0pt", "ratio=1.27x", "ratio_low=1.03x", "ratio_high=1.57x", "p=0.03p"),
		&figures.Spec{Kind: figures.Grouped})
	// Commuting time of staff, binned.
	ctxCommute = block("commute", "frequency", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"commute_minutes"},
		Levels: []string{"[0, 15)", "[15, 30)", "[30, 45)", "[45, 60]"}, Ordered: true, Binned: true, N: 400},
		facts("commute", "n=400#", "0_15.pct=20.0%", "15_30.pct=45.0%", "30_45.pct=25.0%", "45_60.pct=10.0%",
			"0_15.count=80#", "15_30.count=180#", "30_45.count=100#", "45_60.count=40#"), &figures.Spec{Kind: figures.Histogram})
	// Mean kayak hires per day at two lagoons by month; the south lagoon
	// was counted on only 12 days a month.
	ctxLagoon = block("lagoon", "trend", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"hires"}, Time: "month", By: "lagoon",
		Groups: []string{"North", "South"}, Reference: "North", Times: []string{"Jan", "Feb", "Mar", "Apr"}, N: 248},
		facts("lagoon", "n=248#", "north.jan.mean=10.0", "north.feb.mean=11.0", "north.mar.mean=12.0", "north.apr.mean=14.0",
			"south.jan.mean=9.0", "south.feb.mean=8.0", "south.mar.mean=9.5", "south.apr.mean=10.0",
			"north.jan.n=50#", "north.feb.n=50#", "north.mar.n=50#", "north.apr.n=50#",
			"south.jan.n=12#", "south.feb.n=12#", "south.mar.n=12#", "south.apr.n=12#",
			"north.change=4.0", "south.change=1.0", "did=-3.0"), &figures.Spec{Kind: figures.Line})
	// Satisfaction by age band at a leisure centre (crosstab with a yes/no
	// column).
	ctxBands = block("bands", "crosstab", 1, blocks.Meta{Outcome: "categorical", Columns: []string{"age_band", "satisfied"},
		Levels: []string{"18-34", "55+", "35-54"}, ColLevels: []string{"yes", "no"}, N: 500},
		facts("bands", "n=500#", "chi2=14.1", "df=2#", "p=0.001p", "v=0.17",
			"18_34.yes.row_pct=60.0%", "18_34.no.row_pct=40.0%", "35_54.yes.row_pct=70.0%", "35_54.no.row_pct=30.0%",
			"55.yes.row_pct=82.0%", "55.no.row_pct=18.0%", "18_34.yes.pct=18.0%", "35_54.yes.pct=28.0%", "55.yes.pct=16.4%",
			"18_34.total=150#", "35_54.total=200#", "55.total=24#"), &figures.Spec{Kind: figures.Stacked})
	// Bookings against leaflets delivered (simple regression, leaflets 100
	// to 900), with one prediction inside the range and one outside.
	ctxLeaflets = block("leaflets", "regression", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"bookings"},
		Predictors: []string{"leaflets"}, N: 60},
		facts("leaflets", "n=60#", "r2=0.36", "adj_r2=0.35", "p=0.0001p", "sigma=9.0", "intercept.estimate=40.0",
			"leaflets.estimate=0.05", "leaflets.low=0.03", "leaflets.high=0.07", "leaflets.p=0.0001p", "leaflets.min=100",
			"leaflets.max=900", "x_min=100", "x_max=900", "predict.1.estimate=65.0", "predict.1.low=47.0", "predict.1.high=83.0",
			"predict.1.leaflets=500", "predict.2.estimate=140.0", "predict.2.low=118.0", "predict.2.high=162.0",
			"predict.2.leaflets=2000"), &figures.Spec{Kind: figures.Scatter})
	// Daily takings (in £ thousand) of two market stalls.
	ctxStalls = block("stalls", "summary", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"takings_k"}, By: "stall",
		Groups: []string{"Harbour", "Market"}, N: 180},
		facts("stalls", "n=180#", "harbour.n=90#", "market.n=90#", "harbour.mean=8.2", "market.mean=6.5",
			"harbour.mean_low=7.8", "harbour.mean_high=8.6", "market.mean_low=6.1", "market.mean_high=6.9",
			"harbour.median=8.0", "market.median=6.4", "harbour.min=3.1", "harbour.max=12.4", "market.min=2.0", "market.max=9.9",
			"harbour.q1=6.9", "harbour.q3=9.6", "market.q1=5.2", "market.q3=7.7", "mean=7.35", "median=7.2", "min=2.0", "max=12.4"),
		&figures.Spec{Kind: figures.Box})
)

// tableInput builds a report of one Markdown table after the blocks: each
// row's cells are units of kind "cell", as the pipeline gives them.
func tableInput(table string, bs ...Block) Input {
	in := Input{File: "report.md", Source: []byte(table), Blocks: bs}
	prev := ""
	if len(bs) > 0 {
		prev = bs[len(bs)-1].Result.ID
	}
	off := 0
	for _, line := range strings.SplitAfter(table, "\n") {
		trimmed := strings.TrimSpace(line)
		if strings.HasPrefix(trimmed, "|") && strings.Trim(trimmed, "|-: ") != "" {
			k := off
			for _, cell := range strings.Split(strings.TrimRight(line, "\n"), "|") {
				text := strings.TrimSpace(cell)
				if text != "" {
					at := k + strings.Index(cell, text)
					in.Units = append(in.Units, Unit{Kind: "cell", Section: 1, Prev: prev,
						Parts: []Part{{Text: text, Offset: at, SrcLen: len(text)}}})
				}
				k += len(cell) + 1
			}
		}
		off += len(line)
	}
	return in
}
