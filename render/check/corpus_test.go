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

// corpusLabel is one labelled claim of a corpus report (labels.yaml beside
// report.md): the sentence on Line that contains Text either must be
// flagged by one of Rules or must get no finding at all.
type corpusLabel struct {
	Line   int      `yaml:"line"`
	Text   string   `yaml:"text"`
	Expect string   `yaml:"expect"` // "flag" or "clean"
	Rules  []string `yaml:"rules"`

	col, end int // the label's columns on its line: [col, end)
}

// Thresholds of the labelled corpus: the share of must-flag sentences the
// checker flags with an acceptable rule, and the share of clean sentences
// that get any finding.
const (
	minRecall  = 0.90
	maxFPRate  = 0.05
	corpusGlob = "../../testdata/corpus/*/report.md"
)

// TestCorpus builds every corpus report through the real pipeline and
// measures recall and false-positive rate over its labelled sentences.
func TestCorpus(t *testing.T) {
	paths, err := filepath.Glob(corpusGlob)
	if err != nil || len(paths) == 0 {
		t.Fatalf("no corpus reports under %s", corpusGlob)
	}
	sort.Strings(paths)
	var flags, hits, cleans, fps int
	var misses, falses []string
	for _, path := range paths {
		labels, err := readLabels(path)
		if err != nil {
			t.Errorf("%s: %v", path, err)
			continue
		}
		r, err := render.Build(path, render.Options{NoHTML: true})
		if err != nil {
			t.Errorf("%s: build: %v", path, err)
			continue
		}
		name := filepath.Base(filepath.Dir(path))
		for _, l := range labels {
			var on []check.Finding
			for _, f := range r.Findings {
				if f.Line == l.Line && f.Col >= l.col && f.Col < l.end {
					on = append(on, f)
				}
			}
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
				if ok {
					hits++
				} else {
					misses = append(misses, fmt.Sprintf("%s:%d: missed %v: %q%s", name, l.Line, l.Rules, l.Text, said(on)))
				}
			case "clean":
				cleans++
				if len(on) > 0 {
					fps++
					falses = append(falses, fmt.Sprintf("%s:%d: false positive: %q%s", name, l.Line, l.Text, said(on)))
				}
			default:
				t.Errorf("%s:%d: expect must be flag or clean, is %q", name, l.Line, l.Expect)
			}
		}
	}
	if flags == 0 || cleans == 0 {
		t.Fatalf("corpus has %d must-flag and %d clean sentences", flags, cleans)
	}
	recall := float64(hits) / float64(flags)
	fpRate := float64(fps) / float64(cleans)
	summary := fmt.Sprintf("corpus: %d reports, %d labelled claims (%d must-flag, %d clean): recall %.3f (%d/%d), false-positive rate %.3f (%d/%d)",
		len(paths), flags+cleans, flags, cleans, recall, hits, flags, fpRate, fps, cleans)
	fmt.Println(summary)
	t.Log(summary)
	for _, m := range append(misses, falses...) {
		t.Log(m)
	}
	if recall < minRecall {
		t.Errorf("recall %.3f is below %.2f", recall, minRecall)
	}
	if fpRate > maxFPRate {
		t.Errorf("false-positive rate %.3f is above %.2f", fpRate, maxFPRate)
	}
}

func said(fs []check.Finding) string {
	var b strings.Builder
	for _, f := range fs {
		fmt.Fprintf(&b, "\n\t\t%s %s: %s", f.Severity, f.Rule, f.Message)
	}
	return b.String()
}

// readLabels reads the labels beside a report and places each on its line:
// a label covers its line from its snippet to the next label's snippet.
func readLabels(report string) ([]*corpusLabel, error) {
	b, err := os.ReadFile(filepath.Join(filepath.Dir(report), "labels.yaml"))
	if err != nil {
		return nil, err
	}
	var labels []*corpusLabel
	if err := yaml.Unmarshal(b, &labels); err != nil {
		return nil, err
	}
	src, err := os.ReadFile(report)
	if err != nil {
		return nil, err
	}
	lines := strings.Split(string(src), "\n")
	byLine := map[int][]*corpusLabel{}
	for _, l := range labels {
		if l.Line < 1 || l.Line > len(lines) {
			return nil, fmt.Errorf("label line %d outside the report", l.Line)
		}
		k := strings.Index(lines[l.Line-1], l.Text)
		if k < 0 {
			return nil, fmt.Errorf("line %d does not contain %q", l.Line, l.Text)
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
				l.col = 1 // the sentence may start before its snippet
			}
		}
	}
	return labels, nil
}
