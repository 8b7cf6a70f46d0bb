package blocks

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func loadCSV(t *testing.T, s *SourceSpec, body string) (*Dataset, error) {
	t.Helper()
	dir := t.TempDir()
	if err := os.WriteFile(filepath.Join(dir, s.File), []byte(body), 0o644); err != nil {
		t.Fatal(err)
	}
	if s.Missing == nil {
		s.Missing = DefaultMissing
	}
	if s.Types == nil {
		s.Types = map[string]ColType{}
	}
	if err := s.fileKind(); err != nil {
		t.Fatal(err)
	}
	return Load(s, Env{Dir: dir})
}

func TestLoadInfersTypes(t *testing.T) {
	d, err := loadCSV(t, &SourceSpec{Name: "shop", File: "shop.csv"},
		"store,visits,spend,opened,member,note\nNorth,12,\"1,204.50\",2026-01-05,yes,ok\nSouth,NA,30,2026-02-01,no,\nEast,8,n/a,2025-12-30,yes,late\n")
	if err != nil {
		t.Fatal(err)
	}
	want := map[string]ColType{"store": TypeCategory, "visits": TypeNumber, "spend": TypeNumber, "opened": TypeDate, "member": TypeCategory, "note": TypeCategory}
	for name, ty := range want {
		if got := d.Col(name).Type; got != ty {
			t.Errorf("%s: type %s, want %s", name, got, ty)
		}
	}
	if d.Rows() != 3 {
		t.Fatalf("rows = %d", d.Rows())
	}
	v := d.Col("visits")
	if !v.Missing(1) || v.Missing(0) || v.Num.At(0) != 12 || v.Num.At(2) != 8 {
		t.Errorf("visits read as %v", v.Num)
	}
	s := d.Col("spend")
	if s.Num.At(0) != 1204.5 || s.Num.At(1) != 30 || !s.Missing(2) {
		t.Errorf("spend read as %v (thousands separators and n/a)", s.Num)
	}
	if d.Col("note").Missing(0) || !d.Col("note").Missing(1) {
		t.Error("an empty cell must be missing")
	}
	if len(d.SHA256) != 64 {
		t.Errorf("SHA-256 %q", d.SHA256)
	}
	if r, c := d.Frame().Dims(); r != 3 || c != 6 {
		t.Errorf("gota frame is %dx%d", r, c)
	}
}

func TestLoadHintsAndMissing(t *testing.T) {
	s := &SourceSpec{Name: "shop", File: "shop.tsv", Missing: []string{"-", ""},
		Types: map[string]ColType{"store": TypeCategory, "code": TypeText}}
	d, err := loadCSV(t, s, "store\tcode\tvisits\n12\t007\t3\n14\t-\t-\n")
	if err != nil {
		t.Fatal(err)
	}
	if d.Col("store").Type != TypeCategory || d.Col("store").Str[0] != "12" {
		t.Errorf("store hinted category: %+v", d.Col("store"))
	}
	if d.Col("code").Str[0] != "007" || !d.Col("code").Missing(1) {
		t.Errorf("code: %+v", d.Col("code").Str)
	}
	if !d.Col("visits").Missing(1) || d.Col("visits").Type != TypeNumber {
		t.Errorf("visits with '-' missing: %+v", d.Col("visits"))
	}
}

// TestLoadExactDecimals: money read from text sums exactly to the cent,
// and values with more digits than float64 keeps once the mean is removed
// keep their differences (the shifted form of stats.Values).
func TestLoadExactDecimals(t *testing.T) {
	var b strings.Builder
	b.WriteString("amount,big\n")
	for i := 0; i < 1000; i++ {
		b.WriteString("0.10,10000000000000.") // 0.10 a thousand times is exactly 100.00
		b.WriteString([]string{"1", "2", "3"}[i%3])
		b.WriteString("\n")
	}
	d, err := loadCSV(t, &SourceSpec{Name: "m", File: "m.csv"}, b.String())
	if err != nil {
		t.Fatal(err)
	}
	a := d.Col("amount").Num
	sum := 0.0
	for _, x := range a.D {
		sum += x
	}
	total := a.Offset*float64(a.Len()) + sum
	if math.Abs(total-100) > 1e-9 {
		t.Errorf("a thousand 0.10 sum to %.12f", total)
	}
	big := d.Col("big").Num
	if big.Offset != 10000000000000 {
		t.Errorf("offset %v", big.Offset)
	}
	// 10000000000000.2 - 10000000000000.1 is 0.1 exactly in decimal.
	if got := big.D[1] - big.D[0]; math.Abs(got-0.1) > 1e-15 {
		t.Errorf("difference of two 14-digit values = %.17g, want 0.1", got)
	}
	if d.Col("amount").Decimals != 2 || d.Col("big").Decimals != 1 {
		t.Errorf("decimals %d %d", d.Col("amount").Decimals, d.Col("big").Decimals)
	}
}

func TestLoadErrors(t *testing.T) {
	cases := []struct {
		body, want string
		types      map[string]ColType
		line       int
	}{
		{"", "is empty", nil, 0},
		{"a,,c\n1,2,3\n", "has no name", nil, 1},
		{"a,a\n1,2\n", "both named", nil, 1},
		{"a,b\n1,2\n3\n", "has 1 fields but the header has 2", nil, 3},
		{"a,b\n1,\"2\n", "quote", nil, 2},
		{"a,b\n1,2\nx,3\n", `row 2 holds "x"`, map[string]ColType{"a": TypeNumber}, 3},
		{"a,b\n1,2\n", `columns names "c"`, map[string]ColType{"c": TypeNumber}, 0},
		{"a,b\n1,2026-13\n", `row 1 holds "2026-13"`, map[string]ColType{"b": TypeDate}, 2},
		{"a\nx\ny\nz\n", "third value", map[string]ColType{"a": TypeBinary}, 4},
	}
	for _, c := range cases {
		_, err := loadCSV(t, &SourceSpec{Name: "s", File: "s.csv", Types: c.types}, c.body)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%q: error %v, want %q", c.body, err, c.want)
			continue
		}
		if e, ok := err.(*Error); !ok {
			t.Errorf("%q: %T is not a positioned error", c.body, err)
		} else if c.line > 0 && e.Pos.Line != c.line {
			t.Errorf("%q: line %d, want %d (%v)", c.body, e.Pos.Line, c.line, err)
		}
	}
}

func TestLoadRejectsEscapes(t *testing.T) {
	dir := t.TempDir()
	outside := t.TempDir()
	if err := os.WriteFile(filepath.Join(outside, "x.csv"), []byte("a\n1\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink(filepath.Join(outside, "x.csv"), filepath.Join(dir, "link.csv")); err != nil {
		t.Skip("no symbolic links here")
	}
	for _, f := range []string{"link.csv", filepath.Join("..", filepath.Base(outside), "x.csv")} {
		s := &SourceSpec{Name: "s", File: f, Missing: DefaultMissing, Types: map[string]ColType{}}
		if err := s.fileKind(); err != nil {
			t.Fatal(err)
		}
		_, err := Load(s, Env{Dir: dir})
		if err == nil || !strings.Contains(err.Error(), "outside the report's folder") {
			t.Errorf("%s: %v", f, err)
		}
		// --data-root widens the tree.
		if _, err := Load(s, Env{Dir: dir, Root: filepath.Dir(dir)}); err != nil && filepath.Dir(dir) == filepath.Dir(outside) {
			t.Errorf("%s with a wider root: %v", f, err)
		}
	}
}
