package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

const shopCSV = "store,visits\nNorth,12\nSouth,8\nEast,15\nNorth,9\n"

func setup(t *testing.T, prose string) string {
	t.Helper()
	dir := t.TempDir()
	if err := os.MkdirAll(filepath.Join(dir, "data"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "data", "shop.csv"), []byte(shopCSV), 0o644); err != nil {
		t.Fatal(err)
	}
	report := "---\ntitle: Shop\ndata:\n  shop: data/shop.csv\n---\n\n## Visits\n\n```candor v\nsummary: visits\n```\n\n" + prose + "\n"
	p := filepath.Join(dir, "report.md")
	if err := os.WriteFile(p, []byte(report), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

func runCmd(args ...string) (int, string, string) {
	var out, errb bytes.Buffer
	code := run(args, &out, &errb)
	return code, out.String(), errb.String()
}

func TestBuildWritesHTML(t *testing.T) {
	p := setup(t, "The stores had {{v.mean}} visits on average.")
	out := filepath.Join(filepath.Dir(p), "out.html")
	code, stdout, stderr := runCmd("build", p, "-o", out)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if !strings.Contains(stdout, "wrote "+out) {
		t.Errorf("stdout %q", stdout)
	}
	b, err := os.ReadFile(out)
	if err != nil || !bytes.Contains(b, []byte("11.0 visits on average")) {
		t.Errorf("HTML lacks the inline value (%v)", err)
	}
	// The default output sits beside the report.
	if code, _, stderr := runCmd("build", p); code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if _, err := os.Stat(strings.TrimSuffix(p, ".md") + ".html"); err != nil {
		t.Error(err)
	}
}

func TestExitCodes(t *testing.T) {
	p := setup(t, "The stores had {{v.mean}} visits on average.")
	bad := setup(t, "The stores had {{v.maen}} visits.")
	wrong := setup(t, "The stores had a mean of 50 visits.")
	cases := []struct {
		args []string
		code int
		err  string
	}{
		{[]string{"check", p}, 0, ""},
		{[]string{"check", bad}, 2, "report.md:13:18"},
		{[]string{"build", bad, "-o", filepath.Join(filepath.Dir(bad), "x.html")}, 2, `no fact "maen"`},
		{[]string{"check", wrong}, 1, ""},
		{[]string{"check", filepath.Join(t.TempDir(), "none.md")}, 2, "cannot read the report"},
		{[]string{"nonsense"}, 2, "unknown command"},
		{[]string{}, 2, "Usage"},
		{[]string{"build"}, 2, "name the report file"},
		{[]string{"build", p, "--colour"}, 2, "unknown option --colour"},
		{[]string{"check", p, "--format", "xml"}, 2, "--format is text, json or sarif"},
		{[]string{"build", p, "--set", "novalue"}, 2, "--set takes name=value"},
		{[]string{"build", p, "--set", "quarter=Q3"}, 2, `no parameter "quarter"`},
	}
	for _, c := range cases {
		code, _, stderr := runCmd(c.args...)
		if code != c.code || !strings.Contains(stderr, c.err) {
			t.Errorf("candor %s: exit %d (want %d), stderr %q (want %q)", strings.Join(c.args, " "), code, c.code, stderr, c.err)
		}
	}
}

func TestCheckFormats(t *testing.T) {
	wrong := setup(t, "The stores had a mean of 50 visits.")
	code, out, _ := runCmd("check", wrong, "--format", "json")
	if code != 1 {
		t.Fatalf("exit %d", code)
	}
	var fs []map[string]any
	if err := json.Unmarshal([]byte(out), &fs); err != nil {
		t.Fatalf("JSON: %v\n%s", err, out)
	}
	if len(fs) == 0 {
		t.Fatal("no findings")
	}
	for _, k := range []string{"file", "line", "col", "end_line", "end_col", "severity", "rule", "block", "message"} {
		if _, ok := fs[0][k]; !ok {
			t.Errorf("JSON finding lacks %q", k)
		}
	}
	code, out, _ = runCmd("check", wrong, "--format", "sarif")
	var sarif map[string]any
	if err := json.Unmarshal([]byte(out), &sarif); err != nil || sarif["version"] != "2.1.0" || code != 1 {
		t.Errorf("SARIF: exit %d, %v, version %v", code, err, sarif["version"])
	}
	code, out, _ = runCmd("check", wrong)
	if code != 1 || !strings.Contains(out, "report.md:13:") || !strings.Contains(out, "number") {
		t.Errorf("text findings: exit %d %q", code, out)
	}
	// --strict does not lower a report's bar below what it already is.
	if code, _, _ := runCmd("check", wrong, "--strict"); code != 1 {
		t.Errorf("--strict exit %d", code)
	}
}

func TestFacts(t *testing.T) {
	p := setup(t, "")
	code, out, stderr := runCmd("facts", p)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	// The mean of 12, 8, 15 and 9 is 11 (by hand).
	if m["v.mean"] != 11.0 || m["v.n"] != 4.0 {
		t.Errorf("v.mean = %v, v.n = %v", m["v.mean"], m["v.n"])
	}
	// Keys come sorted, one per line.
	lines := strings.Split(strings.TrimSpace(out), "\n")
	prev := ""
	for _, l := range lines[1 : len(lines)-1] {
		k := strings.SplitN(strings.TrimSpace(l), ":", 2)[0]
		if k < prev {
			t.Errorf("key %s after %s", k, prev)
		}
		prev = k
	}
}

func TestInit(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "starter")
	if code, _, stderr := runCmd("init", dir); code != 0 {
		t.Fatalf("init: %s", stderr)
	}
	code, _, stderr := runCmd("build", filepath.Join(dir, "report.md"))
	if code != 0 || strings.TrimSpace(stderr) != "" {
		t.Errorf("the starter report: exit %d, findings %q", code, stderr)
	}
	if code, _, _ := runCmd("init", dir); code != 2 {
		t.Error("init over an existing report must refuse")
	}
}

// TestFiguresDir: --figures writes each figure as a standalone SVG file.
func TestFiguresDir(t *testing.T) {
	p := setup(t, "")
	dir := filepath.Join(t.TempDir(), "figs")
	if code, _, stderr := runCmd("build", p, "--figures", dir); code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	b, err := os.ReadFile(filepath.Join(dir, "report-v.svg"))
	if err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{`<?xml version="1.0"`, `<svg`, `xmlns="http://www.w3.org/2000/svg"`, `<title`, `<desc`} {
		if !bytes.Contains(b, []byte(want)) {
			t.Errorf("the figure file lacks %s", want)
		}
	}
}
