package figures

import (
	"math"
	"strconv"
	"testing"
)

// benchFigures are the charts of the scale report (examples/scale), with
// data of the sizes its blocks give: categories, bins, boxes with their
// outliers, and scatters of 10k, 100k and a million points.
func benchFigures() map[string]Spec {
	plans := []string{"monthly", "annual", "student"}
	months := make([]string, 12)
	for i := range months {
		months[i] = "2025-" + strconv.Itoa(101 + i)[1:]
	}
	var bins []Bin
	for i := 0; i < 21; i++ {
		bins = append(bins, Bin{Lo: float64(5 * i), Hi: float64(5*i + 5), Value: 1e5 * math.Exp(-float64(i)/4)})
	}
	var boxes []BoxStats
	for i, p := range plans {
		b := BoxStats{Label: p, Q1: 10 + float64(i), Median: 12 + float64(i), Q3: 15 + float64(i), WhiskerLow: 3, WhiskerHigh: 22 + float64(i), N: 300000}
		for k := 0; k < 3000; k++ {
			b.Outliers = append(b.Outliers, 23+float64(i)+float64(k)/300)
		}
		boxes = append(boxes, b)
	}
	var lines []Series
	for i, p := range plans {
		s := Series{Name: p}
		for k := range months {
			s.Values = append(s.Values, 60+float64(i)+0.5*float64(k))
		}
		lines = append(lines, s)
	}
	scatter := func(n int) Spec {
		pts := make([]Point, n)
		x := uint64(7)
		for i := range pts {
			x = x*6364136223846793005 + 1442695040888963407
			u := float64(x>>11) / (1 << 53)
			pts[i] = Point{X: 8 + 20*u, Y: 8 + 20*u + 4*math.Sin(float64(i))}
		}
		return Spec{Kind: Scatter, XLabel: "Fitted spend", YLabel: "spend", Points: pts, Fit: &Fit{Slope: 1, Label: "observed = fitted"}}
	}
	return map[string]Spec{
		"bar":         {Kind: Bar, XLabel: "plan", YLabel: "Count", Categories: plans, Series: []Series{{Name: "Count", Values: []float64{476350, 372900, 150750}}}},
		"histogram":   {Kind: Histogram, XLabel: "visits", YLabel: "Count", Bins: bins},
		"box":         {Kind: Box, XLabel: "plan", YLabel: "spend", Categories: plans, Boxes: boxes},
		"stacked":     {Kind: Stacked, Percent: true, Categories: plans, Series: []Series{{Name: "yes", Values: []float64{58, 81, 66}}, {Name: "no", Values: []float64{42, 19, 34}}}},
		"grouped":     {Kind: Grouped, Percent: true, Categories: []string{"app", "web"}, Series: []Series{{Name: "% yes", Values: []float64{69.4, 67.2}}}},
		"dot":         {Kind: Dot, Categories: []string{"no", "yes"}, Series: []Series{{Name: "Mean", Values: []float64{15.1, 14.0}, Low: []float64{15.0, 13.9}, High: []float64{15.2, 14.1}}}},
		"line":        {Kind: Line, Categories: months, Series: lines},
		"scatter10k":  scatter(10_000),
		"scatter100k": scatter(100_000),
		"scatter1M":   scatter(1_000_000),
	}
}

// BenchmarkDraw measures drawing each chart of the scale report to SVG
// with its geometry.
func BenchmarkDraw(b *testing.B) {
	specs := benchFigures()
	for _, name := range []string{"bar", "histogram", "box", "stacked", "grouped", "dot", "line", "scatter10k", "scatter100k", "scatter1M"} {
		s := specs[name]
		b.Run(name, func(b *testing.B) {
			b.ReportAllocs()
			var size int
			for i := 0; i < b.N; i++ {
				f, err := Draw(s)
				if err != nil {
					b.Fatal(err)
				}
				size = len(f.SVG)
			}
			b.ReportMetric(float64(size), "svg-bytes")
		})
	}
}
