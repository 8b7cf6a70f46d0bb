package check

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"

	"candor/blocks"
	"candor/figures"
)

func TestSplitSentences(t *testing.T) {
	cases := []struct {
		text string
		want []string
	}{
		{"Renewals rose. Costs fell.", []string{"Renewals rose.", "Costs fell."}},
		{"Some stores, e.g. Store 12, grew. Others did not.", []string{"Some stores, e.g. Store 12, grew.", "Others did not."}},
		{"The mean was approx. 4.2 visits. That is high.", []string{"The mean was approx. 4.2 visits.", "That is high."}},
		{"Annual vs. Monthly: 45.1% against 38.2%. Next.", []string{"Annual vs. Monthly: 45.1% against 38.2%.", "Next."}},
		{"It rose 4.5 points. 41% renewed.", []string{"It rose 4.5 points.", "41% renewed."}},
		{"See No. 5 for details. Done!", []string{"See No. 5 for details.", "Done!"}},
		{"Was it chance? Perhaps.", []string{"Was it chance?", "Perhaps."}},
		{"He said \"it rose.\" Then it fell.", []string{"He said \"it rose.\"", "Then it fell."}},
		{"Open at 9 a.m. every day.", []string{"Open at 9 a.m. every day."}},
		{"Bikes, scooters, etc. Then cars.", []string{"Bikes, scooters, etc.", "Then cars."}},
		{"", nil},
		{"No end", []string{"No end"}},
	}
	for _, c := range cases {
		var got []string
		for _, sp := range splitSentences(c.text) {
			got = append(got, c.text[sp[0]:sp[1]])
		}
		if strings.Join(got, "|") != strings.Join(c.want, "|") {
			t.Errorf("split %q = %q, want %q", c.text, got, c.want)
		}
	}
}

func quantities(text string) []*quantity {
	toks := tokenize(text, 0, len(text), nil)
	return extract(toks, true)
}

func TestExtractNumbers(t *testing.T) {
	cases := []struct {
		text  string
		val   float64
		unit  unitKind
		hedge hedge
		skip  string
		stat  string
	}{
		{"renewed at 42%", 42, uPercent, hNone, "", ""},
		{"42 percent renewed", 42, uPercent, hNone, "", ""},
		{"42 per cent renewed", 42, uPercent, hNone, "", ""},
		{"a share of 0.42", 0.42, uNone, hNone, "", ""},
		{"1,234 loans", 1234, uNone, hNone, "", ""},
		{"revenue of $1.2M", 1.2e6, uCurrency, hNone, "", ""},
		{"revenue of £3.4 million", 3.4e6, uCurrency, hNone, "", ""},
		{"1.5x the rate", 1.5, uTimes, hNone, "", ""},
		{"1.5 times as likely", 1.5, uTimes, hNone, "", ""},
		{"one in four members", 25, uPercent, hNone, "", ""},
		{"3 out of 10 riders", 30, uPercent, hNone, "", ""},
		{"a third of members", 100.0 / 3, uPercent, hNone, "", ""},
		{"two thirds of members", 200.0 / 3, uPercent, hNone, "", ""},
		{"half of members", 50, uPercent, hNone, "", ""},
		{"twice as likely", 2, uTimes, hNone, "", ""},
		{"renewals doubled", 2, uTimes, hNone, "", ""},
		{"renewals tripled", 3, uTimes, hNone, "", ""},
		{"a three-fold rise", 3, uTimes, hNone, "", ""},
		{"a 3-fold rise", 3, uTimes, hNone, "", ""},
		{"twelve pupils", 12, uNone, hNone, "", ""},
		{"twenty-five pupils", 25, uNone, hNone, "", ""},
		{"about 40%", 40, uPercent, hAbout, "", ""},
		{"around 40%", 40, uPercent, hAbout, "", ""},
		{"roughly 40%", 40, uPercent, hAbout, "", ""},
		{"nearly 40%", 40, uPercent, hNearly, "", ""},
		{"almost 40%", 40, uPercent, hNearly, "", ""},
		{"over 40%", 40, uPercent, hOver, "", ""},
		{"more than 40%", 40, uPercent, hOver, "", ""},
		{"at least 40%", 40, uPercent, hAtLeast, "", ""},
		{"under 40%", 40, uPercent, hUnder, "", ""},
		{"fewer than 40 riders", 40, uNone, hUnder, "", ""},
		{"up to 40%", 40, uPercent, hAtMost, "", ""},
		{"40% or more", 40, uPercent, hAtLeast, "", ""},
		{"5 percentage points", 5, uPoints, hNone, "", ""},
		{"a 5-point rise", 5, uPoints, hNone, "", ""},
		{"p = 0.03", 0.03, uNone, hNone, "", "p"},
		{"p < 0.05", 0.05, uNone, hUnder, "", "p"},
		{"(r = −0.31)", -0.31, uNone, hNone, "", "r"},
		{"(n = 48)", 48, uNone, hNone, "", "n"},
		{"R² = 0.41", 0.41, uNone, hNone, "", "r2"},
		{"in 2026", 2026, uNone, hNone, "year", ""},
		{"on 6 October", 6, uNone, hNone, "date", ""},
		{"on 2026-10-06", 2026, uNone, hNone, "date", ""},
		{"in Q3", 0, 0, 0, "none", ""},
		{"Store 12 grew", 12, uNone, hNone, "id", ""},
		{"week 3 of the pilot", 3, uNone, hNone, "id", ""},
		{"at 9:30", 9, uNone, hNone, "time", ""},
		{"at 10am", 10, uNone, hNone, "time", ""},
		{"the 3rd store", 3, uNone, hNone, "ordinal", ""},
		{"the 95% CI", 95, uPercent, hNone, "level", ""},
		{"a 12-week pilot", 12, uNone, hNone, "compound", ""},
		{"version 2.1.3", 2.1, uNone, hNone, "version", ""},
		{"COVID-19 closures", 19, uNone, hNone, "compound", ""},
		{"t(46) = 2.1", 46, uNone, hNone, "df", ""},
		{"#14 on the list", 14, uNone, hNone, "id", ""},
		{"3 times a week", 3, uNone, hNone, "", ""},
		{"twice a week", 0, 0, 0, "none", ""},
		{"rated the visit 4.4 out of 5", 4.4, uNone, hNone, "", ""},
		{"gave it 4 out of 5", 4, uNone, hNone, "", ""},
		{"one ticket in ten", 10, uPercent, hNone, "", ""},
		{"outnumbered them three to one", 3, uTimes, hNone, "", ""},
		{"sold 3 to 1", 3, uTimes, hNone, "", ""},
		{"stayed half as long again", 1.5, uTimes, hNone, "", ""},
		{"half again as long", 1.5, uTimes, hNone, "", ""},
		{"about half a minute", 0.5, uNone, hAbout, "", ""},
		{"a third of a point", 1.0 / 3, uPoints, hNone, "", ""},
		{"fell by a third", 100.0 / 3, uPercent, hNone, "", ""},
		{"took £15.2k a day", 15200, uCurrency, hNone, "", ""},
		{"40 kg or more", 40, uNone, hAtLeast, "", ""},
		{"came back within 30 days", 30, uNone, hNone, "window", ""},
		{"a rating (1 to 5)", 1, uNone, hNone, "scale", ""},
		{"on a scale of 0 to 10", 0, uNone, hNone, "scale", ""},
		{"Table 2.1 lists them", 2.1, uNone, hNone, "id", ""},
	}
	for _, c := range cases {
		qs := quantities(c.text)
		if c.skip == "none" {
			for _, q := range qs {
				if q.claim() {
					t.Errorf("%q: found a claim %v, want none", c.text, q.val)
				}
			}
			continue
		}
		if len(qs) == 0 {
			t.Errorf("%q: no quantity", c.text)
			continue
		}
		q := qs[0]
		if math.Abs(q.val-c.val) > 1e-9 || q.unit != c.unit || q.hedge != c.hedge || q.skip != c.skip || q.stat != c.stat {
			t.Errorf("%q: got val %v unit %v hedge %v skip %q stat %q; want %v %v %v %q %q",
				c.text, q.val, q.unit, q.hedge, q.skip, q.stat, c.val, c.unit, c.hedge, c.skip, c.stat)
		}
	}
}

// TestExtractNames checks that the second number of a name is a name too.
func TestExtractNames(t *testing.T) {
	for text, want := range map[string]string{
		"weeks 3 to 5 of the pilot": "id",
		"Stores 12 and 14 grew":     "id",
		"aged 18 to 39":             "id",
		"rose from 3 to 5":          "",
	} {
		qs := quantities(text)
		if len(qs) < 2 {
			t.Errorf("%q: %d quantities, want 2", text, len(qs))
			continue
		}
		if qs[1].skip != want {
			t.Errorf("%q: second number skip %q, want %q", text, qs[1].skip, want)
		}
	}
}

func TestExtractChange(t *testing.T) {
	for text, want := range map[string]bool{
		"renewals rose 5%":                               true,
		"renewals rose by 5 points":                      true,
		"up 5 points on last year":                       true,
		"a 5% increase":                                  true,
		"5 points higher":                                true,
		"a gap of 5 points":                              true,
		"raised uptake by 21%":                           true,
		"did better than the youngest group by 7 points": true,
		"fell by a third":                                true,
		"a quarter higher":                               true,
		"renewals rose to 45%":                           false,
		"renewals rose from 40% to 45%":                  false,
		"45% of members renewed":                         false,
		"renewal was 45%":                                false,
	} {
		var got bool
		for _, q := range quantities(text) {
			if q.claim() {
				got = q.change
				break
			}
		}
		if got != want {
			t.Errorf("%q: change = %v, want %v", text, got, want)
		}
	}
}

func TestPositions(t *testing.T) {
	src := "# Renewals\n\nAnnual members renewed at 48%,\nagainst {{renewals.monthly.pct}} for monthly.\n"
	off := strings.Index(src, "Annual")
	ref := strings.Index(src, "{{")
	end := strings.Index(src, "}}") + 2
	b := ctxRenewals
	in := Input{File: "report.md", Source: []byte(src), Blocks: []Block{b},
		Units: []Unit{{Kind: "paragraph", Section: 1, Prev: "renewals", Parts: []Part{
			{Text: "Annual members renewed at 48%,", Offset: off, SrcLen: 30},
			{Text: " ", Offset: off + 30, SrcLen: 0},
			{Text: "against ", Offset: off + 31, SrcLen: 8},
			{Text: "38.2%", Offset: ref, SrcLen: end - ref, Ref: "renewals.monthly.pct"},
			{Text: " for monthly.", Offset: end, SrcLen: 13},
		}}}}
	fs := Run(in)
	var got *Finding
	for i := range fs {
		if fs[i].Rule == "number" {
			got = &fs[i]
		}
	}
	if got == nil {
		t.Fatalf("no number finding: %v", fs)
	}
	if got.Line != 3 || got.Col != 27 || got.EndLine != 3 || got.EndCol != 30 {
		t.Errorf("finding at %d:%d–%d:%d, want 3:27–3:30", got.Line, got.Col, got.EndLine, got.EndCol)
	}
	if src[got.Offset:got.End] != "48%" {
		t.Errorf("span %q, want 48%%", src[got.Offset:got.End])
	}
}

func TestRunSortAllowOffFails(t *testing.T) {
	text := "Monthly members renewed at 41%, and annual members were twice as likely to renew."
	in := input(text, ctxRenewals)
	fs := Run(in)
	if len(fs) < 2 {
		t.Fatalf("want two findings, got %v", fs)
	}
	for i := 1; i < len(fs); i++ {
		a, b := fs[i-1], fs[i]
		if a.Line > b.Line || (a.Line == b.Line && a.Col > b.Col) {
			t.Errorf("findings out of order: %v before %v", a, b)
		}
	}
	if !Fails(fs, Error) || !Fails(fs, Warning) || Fails(fs, Never) {
		t.Errorf("Fails: wrong answers for %v", fs)
	}
	in.Units[0].Allow = []Allow{{Rule: "number", Reason: "target, not a result"}, {Rule: "ratio", Reason: "checked by hand"}}
	fs = Run(in)
	for _, f := range fs {
		if (f.Rule == "number" || f.Rule == "ratio") && (!f.Allowed || f.Reason == "") {
			t.Errorf("%s not allowed: %+v", f.Rule, f)
		}
	}
	if Fails(fs, Error) {
		var left []string
		for _, f := range fs {
			if !f.Allowed {
				left = append(left, f.Rule)
			}
		}
		t.Errorf("allowed findings still fail: %v", left)
	}
	in.Units[0].Allow = nil
	in.Config.Off = []string{"number", "ratio"}
	for _, f := range Run(in) {
		if f.Rule == "number" || f.Rule == "ratio" {
			t.Errorf("rule %s is off but reported", f.Rule)
		}
	}
}

func TestBlockAllow(t *testing.T) {
	b := figBlock("b", "frequency", blocks.Meta{Outcome: "categorical"}, fig(figures.Bar, cats3, 60, 70, 95), geom(figures.Bar, 50, 100, 2.5, true))
	b.Allow = []Allow{{Rule: "zero-axis", Reason: "the differences are the point"}}
	fs := Run(Input{File: "r.md", Blocks: []Block{b}})
	seen := map[string]bool{}
	for _, f := range fs {
		seen[f.Rule] = true
		if f.Rule == "zero-axis" && !f.Allowed {
			t.Errorf("zero-axis not allowed")
		}
		if f.Rule == "lie-factor" && f.Allowed {
			t.Errorf("lie-factor allowed by another rule's acknowledgment")
		}
	}
	if !seen["zero-axis"] || !seen["lie-factor"] {
		t.Errorf("want zero-axis and lie-factor, got %v", fs)
	}
}

func TestWriteText(t *testing.T) {
	fs := []Finding{{File: "report.md", Line: 42, Col: 17, Severity: Error, Rule: "ratio", Block: "renewals",
		Message: `says "nearly 1.5 times" but the risk ratio is 1.18 (95% CI 0.92–1.51)`}}
	var b bytes.Buffer
	if err := WriteText(&b, fs); err != nil {
		t.Fatal(err)
	}
	want := "report.md:42:17: error ratio: says \"nearly 1.5 times\" but the risk ratio is 1.18 (95% CI 0.92–1.51) [renewals]\n"
	if b.String() != want {
		t.Errorf("WriteText:\n%s\nwant\n%s", b.String(), want)
	}
	b.Reset()
	fs[0].Allowed, fs[0].Reason = true, "reviewed with finance"
	WriteText(&b, fs)
	if !strings.HasSuffix(b.String(), "[renewals] (allowed: reviewed with finance)\n") {
		t.Errorf("allowed finding: %q", b.String())
	}
}

func TestRatioMessageExample(t *testing.T) {
	fs := runRule(ruleCase{text: "Annual members were nearly 1.5 times as likely to renew.", blocks: in(ctxRenewals)}, "ratio")
	if len(fs) != 1 {
		t.Fatalf("want one ratio finding, got %v", fs)
	}
	want := `says "nearly 1.5 times" but the risk ratio is 1.18 (95% CI 0.92–1.51); try "about 1.2 times, and the interval includes no difference"`
	if fs[0].Message != want {
		t.Errorf("message\n%s\nwant\n%s", fs[0].Message, want)
	}
}

func TestWriteJSON(t *testing.T) {
	var b bytes.Buffer
	if err := WriteJSON(&b, nil); err != nil || strings.TrimSpace(b.String()) != "[]" {
		t.Errorf("empty: %q %v", b.String(), err)
	}
	b.Reset()
	fs := []Finding{{File: "r.md", Line: 1, Col: 2, EndLine: 1, EndCol: 5, Severity: Warning, Rule: "causal", Block: "x", Message: "m <b>"}}
	WriteJSON(&b, fs)
	var got []map[string]any
	if err := json.Unmarshal(b.Bytes(), &got); err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"file", "line", "col", "end_line", "end_col", "severity", "rule", "block", "message"} {
		if _, ok := got[0][k]; !ok {
			t.Errorf("JSON lacks %q: %s", k, b.String())
		}
	}
	if got[0]["severity"] != "warning" || got[0]["message"] != "m <b>" {
		t.Errorf("JSON values: %v", got[0])
	}
}

func TestWriteSARIF(t *testing.T) {
	fs := Run(input("Annual members were twice as likely to renew.", ctxRenewals))
	var a, b bytes.Buffer
	if err := WriteSARIF(&a, fs); err != nil {
		t.Fatal(err)
	}
	WriteSARIF(&b, fs)
	if a.String() != b.String() {
		t.Errorf("SARIF output is not deterministic")
	}
	var log struct {
		Version string `json:"version"`
		Runs    []struct {
			Tool struct {
				Driver struct {
					Name  string `json:"name"`
					Rules []struct {
						ID string `json:"id"`
					} `json:"rules"`
				} `json:"driver"`
			} `json:"tool"`
			Results []struct {
				RuleID    string `json:"ruleId"`
				Level     string `json:"level"`
				Locations []struct {
					PhysicalLocation struct {
						Region struct {
							StartLine   int `json:"startLine"`
							StartColumn int `json:"startColumn"`
						} `json:"region"`
					} `json:"physicalLocation"`
				} `json:"locations"`
			} `json:"results"`
		} `json:"runs"`
	}
	if err := json.Unmarshal(a.Bytes(), &log); err != nil {
		t.Fatal(err)
	}
	if log.Version != "2.1.0" || len(log.Runs) != 1 || log.Runs[0].Tool.Driver.Name != "candor" {
		t.Fatalf("SARIF header: %s", a.String())
	}
	if n := len(log.Runs[0].Tool.Driver.Rules); n != len(Rules()) || n != 15 {
		t.Errorf("SARIF has %d rules, want 15", n)
	}
	if len(log.Runs[0].Results) == 0 || log.Runs[0].Results[0].RuleID != "ratio" || log.Runs[0].Results[0].Level != "error" ||
		log.Runs[0].Results[0].Locations[0].PhysicalLocation.Region.StartLine != 1 {
		t.Errorf("SARIF results: %s", a.String())
	}
}

func TestRulesRegistry(t *testing.T) {
	want := []string{"number", "ratio", "points", "direction", "significance", "strength", "causal", "quantifier", "sample",
		"extrapolation", "zero-axis", "lie-factor", "partial-series", "chart-choice", "unshown-fit"}
	rs := Rules()
	if len(rs) != len(want) {
		t.Fatalf("%d rules, want %d", len(rs), len(want))
	}
	for i, r := range rs {
		if r.ID != want[i] {
			t.Errorf("rule %d is %s, want %s", i, r.ID, want[i])
		}
		if !strings.HasPrefix(r.Doc, r.ID+" flags") || r.Check == nil {
			t.Errorf("rule %s: Doc must start with %q and Check be set", r.ID, r.ID+" flags")
		}
		if Lookup(r.ID) != r {
			t.Errorf("Lookup(%s) failed", r.ID)
		}
	}
}

func TestConfigDefaults(t *testing.T) {
	c := Config{}.WithDefaults()
	if c.Alpha != 0.05 || c.MinN != 30 || c.Design != "observational" {
		t.Errorf("defaults: %+v", c)
	}
	// A stricter alpha turns p = 0.04 into no support.
	in := input("Spend was significantly related to visits.", ctxVisits)
	if len(filter(Run(in), "significance")) != 0 {
		t.Errorf("p = 0.04 at alpha 0.05 flagged")
	}
	in.Config.Alpha = 0.01
	if len(filter(Run(in), "significance")) != 1 {
		t.Errorf("p = 0.04 at alpha 0.01 not flagged")
	}
	// A smaller min-n accepts the weekend group.
	in = input("Weekend customers rated the café 4.6 on average.", ctxRatings)
	in.Config.MinN = 5
	if len(filter(Run(in), "sample")) != 0 {
		t.Errorf("min-n 5 still flags n = 9")
	}
}

func filter(fs []Finding, rule string) []Finding {
	var out []Finding
	for _, f := range fs {
		if f.Rule == rule {
			out = append(out, f)
		}
	}
	return out
}

func TestNoSourceNoPanic(t *testing.T) {
	// Odd inputs: parts beyond the source, negative offsets, blocks without
	// results, empty units.
	in := Input{File: "r.md", Source: []byte("short"),
		Blocks: []Block{{}, ctxRenewals},
		Units: []Unit{{}, {Kind: "paragraph", Parts: []Part{{Text: "Renewal rose 41% twice.", Offset: 900, SrcLen: 23},
			{Text: "{{x}}", Offset: -4, SrcLen: -1, Ref: "renewals.nope"}}}}}
	for _, f := range Run(in) {
		if f.Offset < 0 || f.End < f.Offset {
			t.Errorf("bad span %+v", f)
		}
	}
}
