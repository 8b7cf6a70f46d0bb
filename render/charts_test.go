package render

import (
	"strings"
	"testing"

	"candor/figures"
)

const trialCSV = "site,arm,week,score,passed,hours\n" +
	"A,control,1,10,no,2\nA,control,2,12,no,3\nA,tutored,1,11,yes,4\nA,tutored,2,15,yes,5\n" +
	"B,control,1,9,no,1\nB,control,2,10,yes,2\nB,tutored,1,12,no,4\nB,tutored,2,16,yes,6\n" +
	"C,control,1,11,yes,3\nC,control,2,11,no,2\nC,tutored,1,13,yes,5\nC,tutored,2,17,yes,7\n"

// TestDefaultCharts checks the default chart of every analysis (FORMAT.md
// section 2) and that every chart: override is drawn as asked or refused
// with a message.
func TestDefaultCharts(t *testing.T) {
	cases := []struct {
		body  string
		def   figures.Kind
		other []figures.Kind // overrides that must be drawn
		bad   []string       // overrides that must be refused
	}{
		{"frequency: site", figures.Bar, []figures.Kind{figures.Pie, figures.Dot, figures.Line, figures.Histogram}, []string{"scatter", "box"}},
		{"frequency: score\nbins: 3", figures.Histogram, []figures.Kind{figures.Bar}, []string{"scatter"}},
		{"summary: score", figures.Histogram, []figures.Kind{figures.Box}, []string{"pie"}},
		{"summary: score\nby: arm", figures.Box, []figures.Kind{figures.Dot, figures.Bar}, []string{"line"}},
		{"crosstab: [site, passed]", figures.Stacked, []figures.Kind{figures.Grouped, figures.Line}, []string{"pie", "bar"}},
		{"compare: score\nby: arm", figures.Dot, []figures.Kind{figures.Bar, figures.Box, figures.Line}, []string{"pie"}},
		{"compare: passed\nby: arm", figures.Grouped, []figures.Kind{figures.Bar, figures.Dot, figures.Stacked, figures.Pie, figures.Line}, []string{"scatter"}},
		{"correlation: [hours, score]", figures.Scatter, nil, []string{"bar"}},
		{"regression: score\npredictors: [hours]", figures.Scatter, nil, []string{"line"}},
		{"trend: score\ntime: week\nby: arm", figures.Line, []figures.Kind{figures.Grouped, figures.Dot}, []string{"pie"}},
		{"stemleaf: score", figures.StemLeaf, nil, []string{"bar"}},
	}
	fm := "---\ntitle: Charts\ndata:\n  trial: data/trial.csv\n---\n\n"
	for _, c := range cases {
		name := strings.ReplaceAll(c.body, "\n", " ")
		t.Run(name, func(t *testing.T) {
			build := func(chart string) (*Report, error) {
				body := c.body
				if chart != "" {
					body += "\nchart: " + chart
				}
				path := writeReport(t, fm+"```candor b\n"+body+"\n```\n", map[string]string{"data/trial.csv": trialCSV})
				return Build(path, Options{})
			}
			rep, err := build("")
			if err != nil {
				t.Fatal(err)
			}
			f := rep.Figures["b"]
			if f == nil || f.Geometry.Kind != c.def {
				t.Fatalf("default figure %+v, want %s", f, c.def)
			}
			if !strings.Contains(string(rep.HTML), "<svg") {
				t.Error("no SVG in the HTML")
			}
			for _, k := range c.other {
				rep, err := build(string(k))
				if err != nil {
					t.Errorf("chart: %s: %v", k, err)
					continue
				}
				if f := rep.Figures["b"]; f == nil || f.Geometry.Kind != k {
					t.Errorf("chart: %s drew %+v", k, f)
				}
			}
			for _, k := range c.bad {
				if _, err := build(k); err == nil || !strings.Contains(err.Error(), "chart") {
					t.Errorf("chart: %s was not refused (%v)", k, err)
				}
			}
			rep, err = build("none")
			if err != nil || rep.Figures["b"] != nil || strings.Contains(string(rep.HTML), "<svg") {
				t.Errorf("chart: none still drew a figure (%v)", err)
			}
		})
	}
}

// TestFigureFacts: a bar chart on a cut-off axis publishes what was drawn,
// so the checker and candor facts see it.
func TestFigureFacts(t *testing.T) {
	fm := "---\ntitle: Axis\ndata:\n  trial: data/trial.csv\n---\n\n"
	path := writeReport(t, fm+"```candor b\nfrequency: site\nchart: bar\naxis: {min: 2}\n```\n", map[string]string{"data/trial.csv": trialCSV})
	rep, err := Build(path, Options{})
	if err != nil {
		t.Fatal(err)
	}
	// Every site has 4 rows: equal bars, so the data show no effect and the
	// lie factor is undefined, but the axis range is recorded as drawn.
	if f := rep.Facts["b.figure.axis_min"]; f.Value != 2 {
		t.Errorf("axis_min = %+v", f)
	}
	if _, ok := rep.Facts["b.figure.axis_max"]; !ok {
		t.Error("no axis_max fact")
	}
}
