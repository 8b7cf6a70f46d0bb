package figures

import (
	"bytes"
	"math"
	"testing"
)

// TestScatterThinsDensePoints: a scatter of many points draws each
// half-point cell once, so its SVG stays small, and stays deterministic.
func TestScatterThinsDensePoints(t *testing.T) {
	var pts []Point
	for i := 0; i < 200000; i++ {
		x := float64(i%1000) / 10
		pts = append(pts, Point{X: x, Y: 3*x + 10*math.Sin(float64(i))})
	}
	s := Spec{Kind: Scatter, ID: "dense", Title: "Dense", XLabel: "x", YLabel: "y", Points: pts, Fit: &Fit{Intercept: 0, Slope: 3}}
	a, err := Draw(s)
	if err != nil {
		t.Fatal(err)
	}
	if n := len(a.Geometry.Marks); n >= len(pts) || n == 0 {
		t.Errorf("%d marks drawn for %d points", n, len(pts))
	}
	// The data area is about 500 × 250 points: at most 1000 × 500 cells.
	if n := len(a.Geometry.Marks); n > 500000 {
		t.Errorf("%d marks: more than there are half-point cells", n)
	}
	if len(a.SVG) > 8<<20 {
		t.Errorf("the SVG is %d bytes", len(a.SVG))
	}
	b, _ := Draw(s)
	if !bytes.Equal(a.SVG, b.SVG) {
		t.Error("two drawings differ")
	}
	// A small scatter draws every point.
	small := Spec{Kind: Scatter, ID: "small", Points: pts[:300]}
	f, err := Draw(small)
	if err != nil {
		t.Fatal(err)
	}
	if len(f.Geometry.Marks) != 300 {
		t.Errorf("a scatter of 300 points drew %d", len(f.Geometry.Marks))
	}
}
