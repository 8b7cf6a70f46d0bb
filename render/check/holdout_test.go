package check_test

import (
	"fmt"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"

	"gopkg.in/yaml.v3"

	"candor/render"
	"candor/render/check"
)

// The held-out corpus (testdata/corpus-holdout) was written apart from the
// checker, to estimate how it does on reports it was not tuned on. Its
// labels.yaml files follow testdata/corpus/README.md. TestHoldout is a
// measurement, not a gate: it prints recall, the false-positive rate, the
// figures per rule and every miss and false positive, and fails only when a
// report does not build or its labels cannot be placed.

const holdoutGlob = "../../testdata/corpus-holdout/*/report.md"

// holdoutLabel is one labelled sentence: the sentence on Line containing Text
// must be reported by one of Rules (Expect "flag") or get no finding at all
// (Expect "clean").
type holdoutLabel struct {
	Line   int      `yaml:"line"`
	Text   string   `yaml:"text"`
	Expect string   `yaml:"expect"`
	Rules  []string `yaml:"rules"`

	col, end int    // the columns the label covers on its line: [col, end)
	source   string // the covered part of the line, for the listing
}

// holdoutRules are the checker's rule ids (FORMAT.md section 5), in the
// order the per-rule table lists them.
var holdoutRules = []string{
	"number", "ratio", "points", "direction", "significance", "strength",
	"causal", "quantifier", "sample", "extrapolation", "zero-axis",
	"lie-factor", "partial-series", "chart-choice", "unshown-fit",
}

func TestHoldout(t *testing.T) {
	paths, err := filepath.Glob(holdoutGlob)
	if err != nil || len(paths) == 0 {
		t.Skipf("no held-out reports under %s", holdoutGlob)
	}
	sort.Strings(paths)

	type ruleCount struct{ labels, hits, fps int }
	perRule := map[string]*ruleCount{}
	for _, id := range holdoutRules {
		perRule[id] = &ruleCount{}
	}
	count := func(id string) *ruleCount {
		c, ok := perRule[id]
		if !ok {
			c = &ruleCount{}
			perRule[id] = c
		}
		return c
	}

	var flags, hits, cleans, fps, unlabelled int
	var misses, falses, strays []string
	for _, path := range paths {
		name := filepath.Base(filepath.Dir(path))
		labels, lines, err := readHoldoutLabels(path)
		if err != nil {
			t.Errorf("%s: labels: %v", name, err)
			continue
		}
		r, err := render.Build(path, render.Options{NoHTML: true})
		if err != nil {
			t.Errorf("%s: build: %v", name, err)
			continue
		}
		covered := make([]bool, len(r.Findings))
		for _, l := range labels {
			var on []check.Finding
			for i, f := range r.Findings {
				if f.Line == l.Line && f.Col >= l.col && f.Col < l.end {
					on = append(on, f)
					covered[i] = true
				}
			}
			where := fmt.Sprintf("%s/report.md:%d", name, l.Line)
			switch l.Expect {
			case "flag":
				flags++
				ok := false
				for _, f := range on {
					for _, id := range l.Rules {
						if f.Rule == id {
							ok = true
						}
					}
				}
				for _, id := range l.Rules {
					c := count(id)
					c.labels++
					if ok {
						c.hits++
					}
				}
				if ok {
					hits++
				} else {
					misses = append(misses, fmt.Sprintf("%s: MISS expected %v\n\t%s%s",
						where, l.Rules, l.source, holdoutSaid(on)))
				}
			case "clean":
				cleans++
				if len(on) > 0 {
					fps++
					seen := map[string]bool{}
					for _, f := range on {
						if !seen[f.Rule] {
							count(f.Rule).fps++
							seen[f.Rule] = true
						}
					}
					falses = append(falses, fmt.Sprintf("%s: FALSE POSITIVE (labelled clean)\n\t%s%s",
						where, l.source, holdoutSaid(on)))
				}
			default:
				t.Errorf("%s: expect must be flag or clean, is %q", where, l.Expect)
			}
		}
		for i, f := range r.Findings {
			if covered[i] {
				continue
			}
			unlabelled++
			text := ""
			if f.Line >= 1 && f.Line <= len(lines) {
				text = holdoutClip(strings.TrimSpace(lines[f.Line-1]))
			}
			strays = append(strays, fmt.Sprintf("%s/report.md:%d:%d: %s %s (unlabelled line)\n\t%s\n\t\t%s",
				name, f.Line, f.Col, f.Severity, f.Rule, text, f.Message))
		}
	}
	if flags == 0 || cleans == 0 {
		t.Fatalf("held-out corpus has %d must-flag and %d clean sentences", flags, cleans)
	}

	recall := float64(hits) / float64(flags)
	fpRate := float64(fps) / float64(cleans)
	var b strings.Builder
	fmt.Fprintf(&b, "held-out corpus: %d reports, %d labelled sentences (%d must-flag, %d clean)\n",
		len(paths), flags+cleans, flags, cleans)
	fmt.Fprintf(&b, "  recall %.3f (%d/%d), false-positive rate %.3f (%d/%d), %d findings on unlabelled spans\n",
		recall, hits, flags, fpRate, fps, cleans, unlabelled)
	fmt.Fprintf(&b, "  %-15s %8s %6s %7s %10s\n", "rule", "labelled", "hit", "recall", "clean-FPs")
	ids := append([]string(nil), holdoutRules...)
	for id := range perRule {
		if !holdoutKnown(id) {
			ids = append(ids, id)
		}
	}
	for _, id := range ids {
		c := perRule[id]
		rec := "-"
		if c.labels > 0 {
			rec = fmt.Sprintf("%.2f", float64(c.hits)/float64(c.labels))
		}
		fmt.Fprintf(&b, "  %-15s %8d %6d %7s %10d\n", id, c.labels, c.hits, rec, c.fps)
	}
	fmt.Fprintf(&b, "  (a must-flag label counts under every rule it accepts; clean-FPs counts clean sentences that drew that rule)")
	fmt.Println(b.String())
	t.Log("\n" + b.String())
	for _, m := range misses {
		t.Log(m)
	}
	for _, f := range falses {
		t.Log(f)
	}
	for _, s := range strays {
		t.Log(s)
	}
}

func holdoutKnown(id string) bool {
	for _, k := range holdoutRules {
		if k == id {
			return true
		}
	}
	return false
}

func holdoutSaid(fs []check.Finding) string {
	if len(fs) == 0 {
		return "\n\t\treported: nothing"
	}
	var b strings.Builder
	for _, f := range fs {
		fmt.Fprintf(&b, "\n\t\treported %s %s (col %d): %s", f.Severity, f.Rule, f.Col, f.Message)
	}
	return b.String()
}

func holdoutClip(s string) string {
	if r := []rune(s); len(r) > 180 {
		return string(r[:177]) + "..."
	}
	return s
}

// readHoldoutLabels reads the labels beside a report and places each on its
// line as testdata/corpus/README.md defines: a label covers its line from
// its snippet (from the line's start for the first label on a line) to the
// next label's snippet, or to the end of the line. Columns count bytes, as
// findings do.
func readHoldoutLabels(report string) ([]*holdoutLabel, []string, error) {
	b, err := os.ReadFile(filepath.Join(filepath.Dir(report), "labels.yaml"))
	if err != nil {
		return nil, nil, err
	}
	var labels []*holdoutLabel
	if err := yaml.Unmarshal(b, &labels); err != nil {
		return nil, nil, err
	}
	src, err := os.ReadFile(report)
	if err != nil {
		return nil, nil, err
	}
	lines := strings.Split(string(src), "\n")
	byLine := map[int][]*holdoutLabel{}
	for _, l := range labels {
		if l.Line < 1 || l.Line > len(lines) {
			return nil, nil, fmt.Errorf("label line %d outside the report", l.Line)
		}
		k := strings.Index(lines[l.Line-1], l.Text)
		if k < 0 {
			return nil, nil, fmt.Errorf("line %d does not contain %q", l.Line, l.Text)
		}
		l.col = k + 1
		byLine[l.Line] = append(byLine[l.Line], l)
	}
	for n, ls := range byLine {
		sort.Slice(ls, func(i, j int) bool { return ls[i].col < ls[j].col })
		line := lines[n-1]
		for i, l := range ls {
			l.end = len(line) + 2
			if i+1 < len(ls) {
				l.end = ls[i+1].col
			}
			if i == 0 {
				l.col = 1 // the sentence may start before its snippet
			}
			from, to := l.col-1, l.end-1
			if to > len(line) {
				to = len(line)
			}
			l.source = holdoutClip(strings.TrimSpace(line[from:to]))
		}
	}
	return labels, lines, nil
}
