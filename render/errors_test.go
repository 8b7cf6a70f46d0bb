package render

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"candor/blocks"
)

const shopCSV = "store,visits,spend,member\nNorth,12,30.5,yes\nSouth,8,22.0,no\nEast,15,41.25,yes\nNorth,9,18.0,no\n"

// writeReport writes a report and its data into a fresh folder and returns
// the report's path.
func writeReport(t *testing.T, report string, files map[string]string) string {
	t.Helper()
	dir := t.TempDir()
	for name, body := range files {
		p := filepath.Join(dir, name)
		if err := os.MkdirAll(filepath.Dir(p), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(p, []byte(body), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	p := filepath.Join(dir, "report.md")
	if err := os.WriteFile(p, []byte(report), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

const front = "---\ntitle: Test\ndata:\n  shop: data/shop.csv\n---\n\n"

// TestBadInput checks that each kind of bad input gets an *Error at the
// right line and column, with a message that says what to change.
func TestBadInput(t *testing.T) {
	cases := []struct {
		name     string
		report   string
		files    map[string]string
		set      map[string]string
		file     string // "" for the report itself
		line     int
		col      int
		contains []string
	}{
		{
			name:   "missing data file",
			report: "---\ntitle: Test\ndata:\n  shop: data/shops.csv\n---\n\n```candor a\nsummary: visits\n```\n",
			files:  map[string]string{"data/shop.csv": shopCSV},
			line:   4, col: 9,
			contains: []string{"data/shops.csv not found", `did you mean "shop.csv"?`},
		},
		{
			name:   "unknown column",
			report: front + "```candor a\nsummary: visit\n```\n",
			line:   8, col: 10,
			contains: []string{`no column "visit"`, `did you mean "visits"?`},
		},
		{
			name:   "unknown column in by",
			report: front + "```candor a\nsummary: visits\nby: stor\n```\n",
			line:   9, col: 5,
			contains: []string{`no column "stor"`, `"store"`},
		},
		{
			name:   "malformed YAML in front matter",
			report: "---\ntitle: Test\ndata:\n  shop: data/shop.csv\n   bad: [\n---\n",
			line:   5, col: 4,
			contains: []string{"malformed YAML in the front matter"},
		},
		{
			name:   "unknown front matter key",
			report: "---\ntitel: Test\ndata:\n  shop: data/shop.csv\n---\n",
			line:   2, col: 1,
			contains: []string{`unknown key "titel"`, `did you mean "title"?`},
		},
		{
			name:   "bad check value",
			report: "---\ntitle: Test\ndata:\n  shop: data/shop.csv\ncheck:\n  alpha: 5\n---\n",
			line:   6, col: 10,
			contains: []string{"alpha must lie between 0 and 0.5"},
		},
		{
			name:   "malformed YAML in a block",
			report: front + "```candor a\nsummary: visits\nby: [store\n```\n",
			line:   9, col: 1,
			contains: []string{"malformed YAML in block a"},
		},
		{
			name:   "duplicate block id",
			report: front + "```candor a\nsummary: visits\n```\n\n```candor a\nsummary: spend\n```\n",
			line:   11, col: 1,
			contains: []string{`block id "a" is already used at line 7`},
		},
		{
			name:   "unknown analysis key",
			report: front + "```candor a\nsumary: visits\n```\n",
			line:   8, col: 1,
			contains: []string{`unknown key "sumary"`, `did you mean "summary"?`},
		},
		{
			name:   "key of another analysis",
			report: front + "```candor a\nsummary: visits\nbins: 5\n```\n",
			line:   9, col: 1,
			contains: []string{`"bins" does not apply to summary`, "frequency"},
		},
		{
			name:   "two analysis keys",
			report: front + "```candor a\nsummary: visits\nfrequency: store\n```\n",
			line:   9, col: 1,
			contains: []string{"two analysis keys", "split it into two blocks"},
		},
		{
			name:   "no analysis key",
			report: front + "```candor a\ndata: shop\n```\n",
			line:   7, col: 1,
			contains: []string{"no analysis key"},
		},
		{
			name:   "empty data set",
			report: front + "```candor a\nsummary: visits\n```\n",
			files:  map[string]string{"data/shop.csv": "store,visits\n"},
			line:   7, col: 1,
			contains: []string{"has no rows"},
		},
		{
			name:   "no rows left after filters",
			report: front + "```candor a\nsummary: visits\nwhere:\n  - store = West\n```\n",
			line:   10, col: 5,
			contains: []string{"no rows", "where:"},
		},
		{
			name:   "mean of a non-numeric column",
			report: front + "```candor a\nsummary: store\n```\n",
			line:   8, col: 10,
			contains: []string{`column "store" holds category values`, "not numbers", "mean"},
		},
		{
			name:   "unknown inline value",
			report: front + "```candor a\nsummary: visits\n```\n\nThe mean was {{a.maen}} visits.\n",
			line:   11, col: 16,
			contains: []string{`no fact "maen"`, "a.mean"},
		},
		{
			name:   "inline value of an unknown block",
			report: front + "```candor a\nsummary: visits\n```\n\nThe mean was {{b.mean}}.\n",
			line:   11, col: 16,
			contains: []string{`no block "b"`},
		},
		{
			name:   "unknown source",
			report: front + "```candor a\ndata: shops\nsummary: visits\n```\n",
			line:   8, col: 7,
			contains: []string{`data "shops"`, `did you mean "shop"?`},
		},
		{
			name:   "unknown parameter in --set",
			report: "---\ntitle: Test\ndata:\n  shop: data/shop.csv\nparams:\n  quarter: Q1\n---\n",
			set:    map[string]string{"quartr": "Q2"},
			line:   1, col: 1,
			contains: []string{`no parameter "quartr"`, `did you mean "quarter"?`},
		},
		{
			name:   "number column with text",
			report: "---\ntitle: Test\ndata:\n  shop:\n    file: data/shop.csv\n    columns:\n      visits: number\n---\n\n```candor a\nsummary: visits\n```\n",
			files:  map[string]string{"data/shop.csv": "store,visits\nNorth,12\nSouth,twelve\n"},
			file:   "data/shop.csv",
			line:   3, col: 1,
			contains: []string{`row 2 holds "twelve"`},
		},
		{
			name:   "bad chart kind",
			report: front + "```candor a\nsummary: visits\nchart: pies\n```\n",
			line:   9, col: 8,
			contains: []string{`chart "pies"`, `did you mean "pie"?`},
		},
		{
			name:   "block without id",
			report: front + "```candor\nsummary: visits\n```\n",
			line:   7, col: 1,
			contains: []string{"needs an id"},
		},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			files := c.files
			if files == nil {
				files = map[string]string{"data/shop.csv": shopCSV}
			}
			path := writeReport(t, c.report, files)
			_, err := Build(path, Options{Set: c.set})
			if err == nil {
				t.Fatal("no error")
			}
			e, ok := err.(*blocks.Error)
			if !ok {
				t.Fatalf("error %T %q is not an input error", err, err)
			}
			want := path
			if c.file != "" {
				want = filepath.Join(filepath.Dir(path), c.file)
			}
			if e.Pos.File != want || e.Pos.Line != c.line || e.Pos.Col != c.col {
				t.Errorf("position %s:%d:%d, want %s:%d:%d (%s)", e.Pos.File, e.Pos.Line, e.Pos.Col, want, c.line, c.col, e.Msg)
			}
			for _, s := range c.contains {
				if !strings.Contains(e.Msg, s) {
					t.Errorf("message %q lacks %q", e.Msg, s)
				}
			}
		})
	}
}

// TestFailedBuildKeepsOutput: a bad report leaves the last good HTML as it
// was.
func TestFailedBuildKeepsOutput(t *testing.T) {
	path := writeReport(t, front+"```candor a\nsummary: visits\n```\n", map[string]string{"data/shop.csv": shopCSV})
	out := filepath.Join(filepath.Dir(path), "report.html")
	rep, err := Build(path, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := WriteFile(out, rep.HTML); err != nil {
		t.Fatal(err)
	}
	good, _ := os.ReadFile(out)
	if err := os.WriteFile(path, []byte(front+"```candor a\nsummary: visitz\n```\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	if _, err := Build(path, Options{}); err == nil {
		t.Fatal("the broken report built")
	}
	now, _ := os.ReadFile(out)
	if string(now) != string(good) {
		t.Error("the output changed after a failed build")
	}
	entries, _ := os.ReadDir(filepath.Dir(path))
	for _, e := range entries {
		if strings.Contains(e.Name(), ".tmp-") {
			t.Errorf("temporary file %s left behind", e.Name())
		}
	}
}
