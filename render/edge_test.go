package render

import (
	"strings"
	"testing"
)

// TestEdgeCases runs blocks on degenerate data: what can be computed is,
// what cannot is "undefined" with a reason, and nothing shows Inf or NaN.
func TestEdgeCases(t *testing.T) {
	cases := []struct {
		name      string
		csv       string
		block     string
		defined   map[string]float64 // facts that must hold these values (counted by hand)
		undefined map[string]string  // facts that must be undefined, with words of the reason
	}{
		{
			name:      "one value",
			csv:       "x\n7\n",
			block:     "summary: x",
			defined:   map[string]float64{"n": 1, "mean": 7, "median": 7, "min": 7, "max": 7},
			undefined: map[string]string{"sd": "at least 2", "mean_low": "at least 2", "skewness": "at least 3"},
		},
		{
			name:      "all values equal",
			csv:       "x\n4\n4\n4\n4\n",
			block:     "summary: x",
			defined:   map[string]float64{"n": 4, "mean": 4, "sd": 0, "iqr": 0},
			undefined: map[string]string{"skewness": "equal"},
		},
		{
			name:      "all missing",
			csv:       "x,g\nNA,a\n,b\nn/a,a\n",
			block:     "summary: x",
			defined:   map[string]float64{"n": 0, "missing": 3},
			undefined: map[string]string{"mean": "no values", "median": "no values", "sd": "no values"},
		},
		{
			name:      "a group of one",
			csv:       "g,x\na,3\nb,5\nb,7\n",
			block:     "compare: x\nby: g",
			defined:   map[string]float64{"a.n": 1, "b.n": 2, "a.mean": 3, "b.mean": 6, "diff": 3},
			undefined: map[string]string{"a.sd": "at least 2", "p": ""},
		},
		{
			name:  "a group with no successes",
			csv:   "g,ok\nref,no\nref,no\nref,no\nnew,yes\nnew,no\n",
			block: "compare: ok\nby: g\nreference: ref",
			// 0 of 3 against 1 of 2: 50 points more.
			defined:   map[string]float64{"ref.pct": 0, "new.pct": 50, "diff": 50},
			undefined: map[string]string{"ratio": "no successes", "odds_ratio": ""},
		},
		{
			name:      "trend with an empty time point",
			csv:       "t,g,x\n1,a,2\n2,a,3\n1,b,5\n",
			block:     "trend: x\ntime: t\nby: g",
			defined:   map[string]float64{"a.change": 1, "b.1.mean": 5},
			undefined: map[string]string{"b.2.mean": "no cases", "b.change": "", "did": ""},
		},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			rep := buildBlock(t, c.csv, c.block)
			for name, want := range c.defined {
				f, ok := rep.Facts["b."+name]
				if !ok || !f.Defined() || f.Value != want {
					t.Errorf("b.%s = %+v, want %v", name, f, want)
				}
			}
			for name, why := range c.undefined {
				f, ok := rep.Facts["b."+name]
				if !ok || f.Defined() || !strings.Contains(f.Undefined, why) {
					t.Errorf("b.%s = %+v, want undefined because %q", name, f, why)
				}
			}
			html, err := rep.writeHTML(false)
			if err != nil {
				t.Fatal(err)
			}
			for _, bad := range []string{">NaN<", ">Inf<", ">+Inf<", ">-Inf<", " NaN ", "NaN%"} {
				if strings.Contains(string(html), bad) {
					t.Errorf("the HTML shows %q", bad)
				}
			}
		})
	}
}

// TestEdgeErrors: degenerate inputs that leave nothing to compute are bad
// input, with a message that says what to change.
func TestEdgeErrors(t *testing.T) {
	cases := []struct{ csv, block, want string }{
		{"g,x\na,1\na,2\n", "compare: x\nby: g", "at least two groups"},
		{"y,x\n1,5\n2,5\n3,5\n", "regression: y\npredictors: [x]", "does not vary"},
		{"y,a,b,c\n1,2,3,4\n2,3,1,5\n", "regression: y\npredictors: [a, b, c]", "cannot fit 4 coefficients"},
		{"y,a,b\n1,1,2\n2,2,4\n4,3,6\n3,4,8\n", "regression: y\npredictors: [a, b]", "perfectly collinear"},
		{"x\n1\n2\n", "trend: x\ntime: x", "three different columns"},
		{"g,x\na,1\nb,2\n", "compare: g\nby: x", "success:"},
	}
	for _, c := range cases {
		report := "---\ntitle: Edge\ndata:\n  d: data/d.csv\n---\n\n```candor b\n" + c.block + "\n```\n"
		path := writeReport(t, report, map[string]string{"data/d.csv": c.csv})
		_, err := Build(path, Options{NoHTML: true})
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", strings.ReplaceAll(c.block, "\n", " "), err, c.want)
		}
	}
}

// TestTrendOneTimePoint: a trend filtered to one time point still draws
// (the checker's partial-series rule judges it), with no change to show.
func TestTrendOneTimePoint(t *testing.T) {
	rep := buildBlock(t, "t,x\n1,2\n2,3\n1,4\n", "trend: x\ntime: t\nwhere:\n  - t = 1")
	if f := rep.Facts["b.1.mean"]; f.Value != 3 {
		t.Errorf("b.1.mean = %+v, want 3", f)
	}
	if f := rep.Facts["b.change"]; f.Defined() || !strings.Contains(f.Undefined, "two time points") {
		t.Errorf("b.change = %+v", f)
	}
	if rep.Figures["b"] == nil {
		t.Error("no figure")
	}
}
