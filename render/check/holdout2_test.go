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

// The second held-out corpus (testdata/corpus-holdout2) measures the
// checker on reports written without looking at it. Its figures are
// printed, not enforced: the test fails only when a report does not build
// or a label cannot be placed on its line. Run it with
//
//	go test ./render/check -run TestHoldout2 -v
const holdout2Glob = "../../testdata/corpus-holdout2/*/report.md"

// holdout2Label is one labelled claim: the sentence on Line that contains
// Text must be flagged by one of Rules (expect: flag) or must get no
// finding at all (expect: clean).
type holdout2Label struct {
	Line   int      `yaml:"line"`
	Text   string   `yaml:"text"`
	Expect string   `yaml:"expect"`
	Rules  []string `yaml:"rules"`

	col, end int // columns on the line covered by the label: [col, end)
}

// holdout2Tally counts one rule's labels and outcomes.
type holdout2Tally struct {
	flags, hits, hitsSelf int // must-flag labels listing the rule; hit by an acceptable rule; hit by this rule
	fps                   int // clean labels that got a finding of this rule
}

func TestHoldout2(t *testing.T) {
	glob := holdout2Glob
	if dir := os.Getenv("CANDOR_HOLDOUT_DIR"); dir != "" {
		// Reports kept out of the repository, to measure text nobody
		// tuned on: the same labels format and matching.
		glob = filepath.Join(dir, "*", "report.md")
	}
	paths, err := filepath.Glob(glob)
	if err != nil || len(paths) == 0 {
		t.Fatalf("no reports under %s", glob)
	}
	sort.Strings(paths)
	var flags, hits, cleans, fps int
	var misses, falses, unlabelled []string
	tally := map[string]*holdout2Tally{}
	rule := func(id string) *holdout2Tally {
		if tally[id] == nil {
			tally[id] = &holdout2Tally{}
		}
		return tally[id]
	}
	for _, path := range paths {
		name := filepath.Base(filepath.Dir(path))
		labels, lines, err := holdout2ReadLabels(path)
		if err != nil {
			t.Errorf("%s: %v", path, err)
			continue
		}
		r, err := render.Build(path, render.Options{NoHTML: true})
		if err != nil {
			t.Errorf("%s: build: %v", path, err)
			continue
		}
		used := make([]bool, len(r.Findings))
		for _, l := range labels {
			var on []check.Finding
			for i, f := range r.Findings {
				if f.Line == l.Line && f.Col >= l.col && f.Col < l.end {
					on = append(on, f)
					used[i] = true
				}
			}
			switch l.Expect {
			case "flag":
				flags++
				ok := false
				for _, id := range l.Rules {
					rule(id).flags++
				}
				for _, f := range on {
					for _, id := range l.Rules {
						if f.Rule == id {
							ok = true
						}
					}
				}
				if ok {
					hits++
					for _, id := range l.Rules {
						rule(id).hits++
						for _, f := range on {
							if f.Rule == id {
								rule(id).hitsSelf++
								break
							}
						}
					}
				} else {
					misses = append(misses, fmt.Sprintf("%s/report.md:%d: missed %v: %q\n\t\tsentence: %s%s",
						name, l.Line, l.Rules, l.Text, holdout2Sentence(lines, l), holdout2Said(on)))
				}
			case "clean":
				cleans++
				if len(on) > 0 {
					fps++
					seen := map[string]bool{}
					for _, f := range on {
						if !seen[f.Rule] {
							seen[f.Rule] = true
							rule(f.Rule).fps++
						}
					}
					falses = append(falses, fmt.Sprintf("%s/report.md:%d: false positive: %q\n\t\tsentence: %s%s",
						name, l.Line, l.Text, holdout2Sentence(lines, l), holdout2Said(on)))
				}
			default:
				t.Errorf("%s:%d: expect must be flag or clean, is %q", name, l.Line, l.Expect)
			}
		}
		for i, f := range r.Findings {
			if !used[i] {
				unlabelled = append(unlabelled, fmt.Sprintf("%s/report.md:%d:%d: %s %s: %s", name, f.Line, f.Col, f.Severity, f.Rule, f.Message))
			}
		}
	}
	if flags == 0 || cleans == 0 {
		t.Fatalf("holdout2 has %d must-flag and %d clean sentences", flags, cleans)
	}
	var b strings.Builder
	fmt.Fprintf(&b, "holdout2: %d reports, %d labelled claims (%d must-flag, %d clean): recall %.3f (%d/%d), false-positive rate %.3f (%d/%d)\n",
		len(paths), flags+cleans, flags, cleans, float64(hits)/float64(flags), hits, flags, float64(fps)/float64(cleans), fps, cleans)
	ids := make([]string, 0, len(tally))
	for id := range tally {
		ids = append(ids, id)
	}
	sort.Strings(ids)
	fmt.Fprintf(&b, "per rule (recall over must-flag labels that list the rule; FP = clean labels with a finding of the rule):\n")
	fmt.Fprintf(&b, "  %-15s %8s %10s %12s %6s %8s\n", "rule", "labels", "recall", "by-itself", "FPs", "FP rate")
	for _, id := range ids {
		x := tally[id]
		rec, self := "-", "-"
		if x.flags > 0 {
			rec = fmt.Sprintf("%.3f", float64(x.hits)/float64(x.flags))
			self = fmt.Sprintf("%.3f", float64(x.hitsSelf)/float64(x.flags))
		}
		fmt.Fprintf(&b, "  %-15s %8d %10s %12s %6d %8.3f\n", id, x.flags, rec, self, x.fps, float64(x.fps)/float64(cleans))
	}
	fmt.Fprintf(&b, "misses (%d):\n", len(misses))
	for _, m := range misses {
		fmt.Fprintf(&b, "  %s\n", m)
	}
	fmt.Fprintf(&b, "false positives (%d):\n", len(falses))
	for _, m := range falses {
		fmt.Fprintf(&b, "  %s\n", m)
	}
	fmt.Fprintf(&b, "findings on no label (not counted) (%d):\n", len(unlabelled))
	for _, m := range unlabelled {
		fmt.Fprintf(&b, "  %s\n", m)
	}
	fmt.Print(b.String())
	t.Log(strings.SplitN(b.String(), "\n", 2)[0])
}

// holdout2Said lists what was reported on a label.
func holdout2Said(fs []check.Finding) string {
	if len(fs) == 0 {
		return "\n\t\treported: nothing"
	}
	var b strings.Builder
	for _, f := range fs {
		fmt.Fprintf(&b, "\n\t\treported: %s %s: %s", f.Severity, f.Rule, f.Message)
	}
	return b.String()
}

// holdout2Sentence is the text a label covers on its line.
func holdout2Sentence(lines []string, l *holdout2Label) string {
	s := lines[l.Line-1]
	from, to := l.col-1, l.end-1
	if to > len(s) {
		to = len(s)
	}
	if from < 0 || from > to {
		return strings.TrimSpace(s)
	}
	return strings.TrimSpace(s[from:to])
}

// holdout2ReadLabels reads labels.yaml beside a report and places each
// label on its line with the span rules of the labelled corpus: a label
// covers its line from its snippet to the next label's snippet, and the
// first label of a line from the line's start.
func holdout2ReadLabels(report string) ([]*holdout2Label, []string, error) {
	b, err := os.ReadFile(filepath.Join(filepath.Dir(report), "labels.yaml"))
	if err != nil {
		return nil, nil, err
	}
	var labels []*holdout2Label
	if err := yaml.Unmarshal(b, &labels); err != nil {
		return nil, nil, err
	}
	src, err := os.ReadFile(report)
	if err != nil {
		return nil, nil, err
	}
	lines := strings.Split(string(src), "\n")
	byLine := map[int][]*holdout2Label{}
	for _, l := range labels {
		if l.Line < 1 || l.Line > len(lines) {
			return nil, nil, fmt.Errorf("label line %d outside the report", l.Line)
		}
		k := strings.Index(lines[l.Line-1], l.Text)
		if k < 0 {
			return nil, nil, fmt.Errorf("line %d does not contain %q", l.Line, l.Text)
		}
		if l.Expect == "flag" && len(l.Rules) == 0 {
			return nil, nil, fmt.Errorf("line %d: a must-flag label lists no rule", l.Line)
		}
		l.col = k + 1
		byLine[l.Line] = append(byLine[l.Line], l)
	}
	for n, ls := range byLine {
		sort.Slice(ls, func(i, j int) bool { return ls[i].col < ls[j].col })
		for i, l := range ls {
			l.end = len(lines[n-1]) + 2
			if i+1 < len(ls) {
				l.end = ls[i+1].col
			}
			if i == 0 {
				l.col = 1
			}
		}
	}
	return labels, lines, nil
}
