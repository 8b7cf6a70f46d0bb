package check

import (
	"regexp"
	"strconv"
	"strings"
	"testing"

	"candor/blocks"
	"candor/figures"
)

func init() { panicky = true }

// facts builds a block's facts from "NAME=VALUE" with a kind suffix: "%"
// percent, "pt" points, "x" ratio, "#" count, "p" p-value, none a number.
// The facts are invented inputs for the rules, not reference values.
func facts(id string, specs ...string) blocks.Facts {
	fs := blocks.Facts{}
	for _, sp := range specs {
		k := strings.IndexByte(sp, '=')
		name, val := sp[:k], sp[k+1:]
		kind := blocks.Number
		switch {
		case strings.HasSuffix(val, "%"):
			kind, val = blocks.Percent, strings.TrimSuffix(val, "%")
		case strings.HasSuffix(val, "pt"):
			kind, val = blocks.Points, strings.TrimSuffix(val, "pt")
		case strings.HasSuffix(val, "x"):
			kind, val = blocks.Ratio, strings.TrimSuffix(val, "x")
		case strings.HasSuffix(val, "#"):
			kind, val = blocks.Count, strings.TrimSuffix(val, "#")
		case strings.HasSuffix(val, "p"):
			kind, val = blocks.PValue, strings.TrimSuffix(val, "p")
		}
		v, err := strconv.ParseFloat(val, 64)
		if err != nil {
			panic(sp)
		}
		fs.Set(id+"."+name, v, kind, "")
	}
	return fs
}

func block(id, analysis string, line int, meta blocks.Meta, fs blocks.Facts, fig *figures.Spec) Block {
	return Block{Result: &blocks.Result{ID: id, Analysis: analysis, Pos: blocks.Pos{File: "report.md", Line: line, Col: 1},
		Facts: fs, Meta: meta, Figure: fig}, Section: 1}
}

// The invented contexts of the rule tests.
var (
	// A bike-share scheme's renewals by plan (binary compare).
	ctxRenewals = block("renewals", "compare", 1, blocks.Meta{Outcome: "binary", Columns: []string{"renewed"}, By: "plan",
		Groups: []string{"Monthly", "Annual"}, Reference: "Monthly", N: 212},
		facts("renewals", "n=212#", "monthly.n=110#", "annual.n=102#", "monthly.pct=38.2%", "annual.pct=45.1%",
			"diff=6.9pt", "diff_low=-6.4pt", "diff_high=20.2pt", "ratio=1.18x", "ratio_low=0.92x", "ratio_high=1.51x",
			"odds_ratio=1.33x", "p=0.31p"), &figures.Spec{Kind: figures.Grouped})
	// The same, with a clear difference.
	ctxUptake = block("uptake", "compare", 1, blocks.Meta{Outcome: "binary", Columns: []string{"joined"}, By: "offer",
		Groups: []string{"Letter", "Text message"}, Reference: "Letter", N: 400},
		facts("uptake", "n=400#", "letter.n=200#", "text_message.n=200#", "letter.pct=20.0%", "text_message.pct=41.0%",
			"diff=21.0pt", "diff_low=12.3pt", "diff_high=29.7pt", "ratio=2.05x", "ratio_low=1.52x", "ratio_high=2.77x",
			"odds_ratio=2.78x", "p=0.0001p"), nil)
	// A library's satisfaction share by month (trend of a share).
	ctxSatisfaction = block("satisfaction", "trend", 1, blocks.Meta{Outcome: "binary", Columns: []string{"satisfied"}, Time: "month",
		Times: []string{"January", "February", "March"}, N: 600},
		facts("satisfaction", "n=600#", "january.pct=40.0%", "february.pct=42.5%", "march.pct=45.0%", "change=5.0pt"),
		&figures.Spec{Kind: figures.Line, Categories: []string{"January", "February", "March"}})
	// Mean loans per member by quarter (trend of a mean), falling.
	ctxLoans = block("loans", "trend", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"loans"}, Time: "quarter",
		Times: []string{"Q1", "Q2", "Q3", "Q4"}, N: 800},
		facts("loans", "n=800#", "q1.mean=5.3", "q2.mean=4.9", "q3.mean=4.4", "q4.mean=4.1", "change=-1.2"),
		&figures.Spec{Kind: figures.Line, Categories: []string{"Q1", "Q2", "Q3", "Q4"}})
	// Visits and spend of café customers (correlation), weak.
	ctxVisits = block("visits_spend", "correlation", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"visits", "spend"}, N: 96},
		facts("visits_spend", "n=96#", "r=0.21", "r_low=0.01", "r_high=0.39", "p=0.04p", "rho=0.24"), &figures.Spec{Kind: figures.Scatter})
	// A strong negative correlation: distance and attendance.
	ctxDistance = block("distance", "correlation", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"distance_km", "attendance"}, N: 120},
		facts("distance", "n=120#", "r=-0.62", "r_low=-0.72", "r_high=-0.50", "p=0.0001p", "rho=-0.58"), &figures.Spec{Kind: figures.Scatter})
	// A clinic's waiting times (summary).
	ctxWaits = block("waits", "summary", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"wait_minutes"}, N: 140},
		facts("waits", "n=140#", "missing=3#", "mean=34.2", "mean_low=32.2", "mean_high=36.2", "sd=12.1", "se=1.02",
			"min=3", "q1=20", "median=28.5", "q3=41", "max=95"), &figures.Spec{Kind: figures.Box})
	// How riders travelled (frequency of a category).
	ctxModes = block("modes", "frequency", 1, blocks.Meta{Outcome: "categorical", Columns: []string{"mode"},
		Levels: []string{"E-bike", "Classic bike", "Scooter"}, N: 210},
		facts("modes", "n=210#", "e_bike.count=110#", "e_bike.pct=52.4%", "classic_bike.count=65#", "classic_bike.pct=31.0%",
			"scooter.count=35#", "scooter.pct=16.6%"), &figures.Spec{Kind: figures.Bar, Categories: []string{"E-bike", "Classic bike", "Scooter"}})
	// Spend explained by visits (simple regression).
	ctxSpend = block("spend", "regression", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"spend"}, Predictors: []string{"visits"}, N: 96},
		facts("spend", "n=96#", "r2=0.18", "adj_r2=0.17", "f=20.6", "p=0.0001p", "sigma=8.2", "intercept.estimate=12.5",
			"visits.estimate=2.1", "visits.se=0.46", "visits.p=0.0001p", "visits.low=1.2", "visits.high=3.0",
			"x_min=2", "x_max=38", "predict.1.estimate=75.5", "predict.1.low=59.0", "predict.1.high=92.0", "predict.1.visits=30",
			"predict.2.estimate=138.5", "predict.2.low=120.0", "predict.2.high=157.0", "predict.2.visits=60"), &figures.Spec{Kind: figures.Scatter})
	// Reading scores of tutored and other pupils (numeric compare).
	ctxScores = block("scores", "compare", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"score"}, By: "group",
		Groups: []string{"Not tutored", "Tutored"}, Reference: "Not tutored", N: 78},
		facts("scores", "n=78#", "not_tutored.n=38#", "tutored.n=40#", "not_tutored.mean=65.1", "tutored.mean=71.3",
			"not_tutored.sd=9.8", "tutored.sd=10.2", "diff=6.2", "diff_low=1.7", "diff_high=10.7", "ratio=1.095x", "d=0.62", "p=0.008p"),
		&figures.Spec{Kind: figures.Dot})
	// A café's ratings, weekday against weekend, with a small weekend group.
	ctxRatings = block("ratings", "summary", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"rating"}, By: "day",
		Groups: []string{"Weekday", "Weekend"}, N: 129},
		facts("ratings", "n=129#", "weekday.n=120#", "weekend.n=9#", "weekday.mean=4.1", "weekend.mean=4.6", "weekday.median=4", "weekend.median=5"),
		&figures.Spec{Kind: figures.Box})
	// A small pilot: 18 schools.
	ctxPilot = block("pilot", "correlation", 1, blocks.Meta{Outcome: "numeric", Columns: []string{"hours", "gain"}, N: 18},
		facts("pilot", "n=18#", "r=0.48", "r_low=0.01", "r_high=0.77", "p=0.04p"), &figures.Spec{Kind: figures.Scatter})
	// Ticket type against satisfaction (crosstab).
	ctxTickets = block("tickets", "crosstab", 1, blocks.Meta{Outcome: "categorical", Columns: []string{"ticket", "satisfied"},
		Levels: []string{"Single", "Season"}, ColLevels: []string{"Yes", "No"}, N: 300},
		facts("tickets", "n=300#", "chi2=9.4", "df=1#", "p=0.002p", "v=0.18", "single.yes.count=90#", "single.yes.row_pct=60.0%",
			"single.no.row_pct=40.0%", "season.yes.row_pct=76.7%", "season.no.row_pct=23.3%"), &figures.Spec{Kind: figures.Stacked})
)

var refPattern = regexp.MustCompile(`\{\{([A-Za-z0-9_.-]+)\}\}`)

// input builds a report of one paragraph after the blocks, each in section
// 1; "{{ID.NAME}}" in the text becomes an inline value formatted from the
// facts.
func input(text string, bs ...Block) Input {
	all := blocks.Facts{}
	for _, b := range bs {
		all.Merge(b.Result.Facts)
	}
	src := text
	var parts []Part
	last := 0
	for _, m := range refPattern.FindAllStringSubmatchIndex(src, -1) {
		if m[0] > last {
			parts = append(parts, Part{Text: src[last:m[0]], Offset: last, SrcLen: m[0] - last})
		}
		ref := src[m[2]:m[3]]
		f, ok := all[ref]
		txt := "undefined"
		if ok {
			txt = blocks.Format(f, -1)
		}
		parts = append(parts, Part{Text: txt, Offset: m[0], SrcLen: m[1] - m[0], Ref: ref})
		last = m[1]
	}
	if last < len(src) {
		parts = append(parts, Part{Text: src[last:], Offset: last, SrcLen: len(src) - last})
	}
	prev := ""
	if len(bs) > 0 {
		prev = bs[len(bs)-1].Result.ID
	}
	return Input{File: "report.md", Source: []byte(src), Blocks: bs,
		Units: []Unit{{Kind: "paragraph", Section: 1, Prev: prev, Parts: parts}}}
}

// ruleCase is one sentence of a rule's table test.
type ruleCase struct {
	text   string
	blocks []Block
	design string
}

// runRule runs every rule on the case and returns the findings of one.
func runRule(c ruleCase, rule string) []Finding {
	in := input(c.text, c.blocks...)
	in.Config.Design = c.design
	var out []Finding
	for _, f := range Run(in) {
		if f.Rule == rule {
			out = append(out, f)
		}
	}
	return out
}

// tableTest checks that every flag case has a finding of the rule and every
// clean case none.
func tableTest(t *testing.T, rule string, flag, clean []ruleCase) {
	t.Helper()
	if len(flag) < 12 || len(clean) < 12 {
		t.Errorf("%s: the table needs at least 12 cases each way, has %d and %d", rule, len(flag), len(clean))
	}
	for _, c := range flag {
		fs := runRule(c, rule)
		if len(fs) == 0 {
			t.Errorf("%s: not flagged: %q%s", rule, c.text, others(c))
			continue
		}
		for _, f := range fs {
			if f.Offset < 0 || f.End > len(c.text) || f.End < f.Offset {
				t.Errorf("%s: span %d–%d outside %q", rule, f.Offset, f.End, c.text)
			}
		}
		if testing.Verbose() {
			t.Logf("%s: %q\n\t→ %s", rule, c.text, fs[0].Message)
		}
	}
	for _, c := range clean {
		if fs := runRule(c, rule); len(fs) > 0 {
			t.Errorf("%s: flagged but clean: %q: %s", rule, c.text, fs[0].Message)
		}
	}
}

// others lists what the other rules said, to help read a failure.
func others(c ruleCase) string {
	in := input(c.text, c.blocks...)
	in.Config.Design = c.design
	var b strings.Builder
	for _, f := range Run(in) {
		b.WriteString("\n\t" + f.Rule + ": " + f.Message)
	}
	return b.String()
}

func cs(bs []Block, texts ...string) []ruleCase {
	var out []ruleCase
	for _, t := range texts {
		out = append(out, ruleCase{text: t, blocks: bs})
	}
	return out
}

func in(bs ...Block) []Block { return bs }
