package members

import (
	"bytes"
	"strings"
	"testing"
)

// TestGenerate: the same seed gives the same bytes, with the columns and
// the shares of missing values the scale report relies on.
func TestGenerate(t *testing.T) {
	var a, b bytes.Buffer
	if err := Generate(&a, 5000, Seed); err != nil {
		t.Fatal(err)
	}
	Generate(&b, 5000, Seed)
	if !bytes.Equal(a.Bytes(), b.Bytes()) {
		t.Fatal("two runs with the same seed differ")
	}
	lines := strings.Split(strings.TrimSuffix(a.String(), "\n"), "\n")
	if len(lines) != 5001 || lines[0]+"\n" != Header {
		t.Fatalf("%d lines, header %q", len(lines), lines[0])
	}
	if lines[1] != "2025-09,East,app,monthly,31,22,24.83,yes,96.2" {
		t.Errorf("first row %q", lines[1])
	}
	var c bytes.Buffer
	Generate(&c, 5000, Seed+1)
	if bytes.Equal(a.Bytes(), c.Bytes()) {
		t.Error("another seed gives the same data")
	}
	noAge, noScore := 0, 0
	for _, l := range lines[1:] {
		f := strings.Split(l, ",")
		if len(f) != 9 {
			t.Fatalf("row %q", l)
		}
		if f[4] == "NA" {
			noAge++
		}
		if f[8] == "" {
			noScore++
		}
	}
	// 0.8% of ages and 1.5% of scores are missing.
	if noAge < 20 || noAge > 65 || noScore < 45 || noScore > 110 {
		t.Errorf("%d ages and %d scores missing of 5000", noAge, noScore)
	}
}
