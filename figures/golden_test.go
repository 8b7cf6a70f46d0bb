package figures

import (
	"bytes"
	"flag"
	"os"
	"path/filepath"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden SVG files in testdata/figures")

func ptr(v float64) *float64 { return &v }

// goldenSpecs are the golden figures, one or more per chart kind, with
// invented data (a bakery chain, a bike share, a delivery service).
func goldenSpecs() []struct {
	name string
	spec Spec
} {
	return []struct {
		name string
		spec Spec
	}{
		{"bar", Spec{
			ID: "loaves", Kind: Bar, Title: "Loaves sold by store, third quarter",
			XLabel: "Store", YLabel: "Loaves sold",
			Categories: []string{"North", "Harbour", "Old Town", "Station"},
			Series:     []Series{{Name: "Loaves", Values: []float64{412, 388, 301, 275}}},
		}},
		{"bar_horizontal", Spec{
			ID: "lines", Kind: Bar, Title: "Revenue by product line (thousands)",
			XLabel: "Product line", YLabel: "Revenue (thousands)",
			Categories: []string{"Sourdough and rye loaves", "Croissants and laminated pastries",
				"Sandwiches to take away", "Celebration cakes ordered ahead", "Coffee, tea and other drinks",
				"Seasonal specials", "Wholesale to cafés"},
			Series: []Series{{Name: "Revenue", Values: []float64{48.2, 36.9, 29.4, 12.7, 41.5, 8.3, 22.6}}},
		}},
		{"bar_cut_axis", Spec{
			ID: "cut", Kind: Bar, Title: "Weekend orders, two stores (axis from 30)",
			XLabel: "Store", YLabel: "Orders", AxisMin: ptr(30),
			Categories: []string{"Harbour", "North"},
			Series:     []Series{{Name: "Orders", Values: []float64{40, 60}}},
		}},
		{"histogram", Spec{
			ID: "trips", Kind: Histogram, Title: "Bike share trip durations, May",
			XLabel: "Trip duration (minutes)", YLabel: "Trips",
			Bins: []Bin{{0, 5, 182}, {5, 10, 436}, {10, 15, 511}, {15, 20, 347}, {20, 25, 198},
				{25, 30, 121}, {30, 35, 64}, {35, 40, 29}, {40, 45, 12}},
		}},
		{"dot", Spec{
			ID: "basket", Kind: Dot, Title: "Mean basket value by channel, with 95% intervals",
			XLabel: "Channel", YLabel: "Mean basket (€)",
			Categories: []string{"In store", "Click and collect", "Delivery app"},
			Series: []Series{{Name: "Mean", Values: []float64{8.42, 11.96, 14.30},
				Low: []float64{7.95, 11.02, 13.11}, High: []float64{8.89, 12.90, 15.49}}},
		}},
		{"pie", Spec{
			ID: "pay", Kind: Pie, Title: "How customers paid, September",
			XLabel:     "Payment method",
			Categories: []string{"Card", "Phone wallet", "Cash", "Gift voucher"},
			Series:     []Series{{Name: "Payments", Values: []float64{1840, 1215, 602, 93}}},
		}},
		{"stacked", Spec{
			ID: "renew", Kind: Stacked, Title: "Loyalty renewals by plan",
			XLabel: "Plan", YLabel: "Share of members (%)",
			Categories: []string{"Monthly", "Quarterly", "Annual"},
			Series: []Series{
				{Name: "Renewed", Values: []float64{182, 240, 310}},
				{Name: "Paused", Values: []float64{41, 22, 12}},
				{Name: "Left", Values: []float64{97, 58, 28}},
			},
		}},
		{"grouped", Spec{
			ID: "visits", Kind: Grouped, Title: "Visits by store, 2025 and 2026",
			XLabel: "Store", YLabel: "Visits per week",
			Categories: []string{"North", "Harbour", "Old Town", "Station"},
			Series: []Series{
				{Name: "2025", Values: []float64{1204, 980, 860, 1410}},
				{Name: "2026", Values: []float64{1288, 1012, 790, 1502}},
			},
		}},
		{"grouped_intervals", Spec{
			ID: "fig-renewed", Kind: Grouped, Title: "Share renewed by plan, with 95% intervals", Percent: true,
			XLabel: "Plan", YLabel: "% renewed",
			Categories: []string{"Monthly", "Quarterly", "Annual"},
			Series: []Series{{Name: "% renewed", Values: []float64{56.9, 75.0, 88.6},
				Low: []float64{51.4, 70.3, 85.0}, High: []float64{62.2, 79.2, 91.4}}},
		}},
		{"scatter", Spec{
			ID: "temp", Kind: Scatter, Title: "Daily trips against the noon temperature",
			XLabel: "Noon temperature (°C)", YLabel: "Trips per day",
			Points: []Point{{4, 610}, {6, 702}, {7, 655}, {9, 790}, {10, 842}, {11, 801}, {12, 930},
				{13, 905}, {14, 1012}, {15, 980}, {16, 1104}, {17, 1040}, {18, 1160}, {19, 1232},
				{20, 1190}, {21, 1301}, {22, 1275}, {24, 1390}, {25, 1350}, {27, 1462}},
			Fit: &Fit{Intercept: 432.1, Slope: 38.6, Label: "y = 432 + 38.6x, R² = 0.97"},
		}},
		{"line", Spec{
			ID: "app", Kind: Line, Title: "Share of rides booked in the app", Percent: true,
			XLabel: "Month", YLabel: "Rides booked in the app (%)",
			Categories: []string{"Jan", "Feb", "Mar", "Apr", "May", "Jun"},
			Series: []Series{
				{Name: "Members", Values: []float64{41.5, 44.0, 47.2, 51.8, 55.1, 58.4}},
				{Name: "Casual riders", Values: []float64{18.2, 19.0, 22.5, 21.7, 25.9, 28.3}},
			},
		}},
		{"line_single", Spec{
			ID: "queue", Kind: Line, Title: "Average queue at the North store",
			XLabel: "Week", YLabel: "Minutes",
			Categories: []string{"Week 1", "Week 2", "Week 3", "Week 4", "Week 5", "Week 6", "Week 7", "Week 8"},
			Series:     []Series{{Name: "Queue", Values: []float64{6.2, 5.8, 7.4, 6.9, 5.1, 4.6, 4.9, 4.2}}},
		}},
		{"box", Spec{
			ID: "delivery", Kind: Box, Title: "Delivery times by depot",
			XLabel: "Depot", YLabel: "Minutes to the door",
			Boxes: []BoxStats{
				{Label: "Riverside", Q1: 22, Median: 27, Q3: 33, WhiskerLow: 12, WhiskerHigh: 48, Outliers: []float64{56, 61}, N: 148},
				{Label: "Hilltop", Q1: 28, Median: 34, Q3: 41, WhiskerLow: 17, WhiskerHigh: 58, N: 96},
				{Label: "Market Square", Q1: 18, Median: 21, Q3: 26, WhiskerLow: 11, WhiskerHigh: 37, Outliers: []float64{5, 44, 52}, N: 203},
			},
		}},
		{"stemleaf", Spec{
			ID: "waits", Kind: StemLeaf, Title: "Minutes waited for a table",
			XLabel: "waiting times",
			Lines: []string{
				"0 | 4 6 8 9",
				"1 | 0 1 2 2 5 7 8",
				"2 | 0 0 3 4 6 6 9",
				"3 | 1 5 8",
				"4 | 2",
			},
			Legend: "2 | 3 means 23 minutes",
		}},
	}
}

// TestGolden compares every golden figure byte for byte with
// testdata/figures/NAME.svg; -update rewrites them.
func TestGolden(t *testing.T) {
	dir := filepath.Join("..", "testdata", "figures")
	for _, g := range goldenSpecs() {
		t.Run(g.name, func(t *testing.T) {
			fig, err := Draw(g.spec)
			if err != nil {
				t.Fatalf("Draw: %v", err)
			}
			path := filepath.Join(dir, g.name+".svg")
			if *update {
				if err := os.MkdirAll(dir, 0o755); err != nil {
					t.Fatal(err)
				}
				if err := os.WriteFile(path, fig.SVG, 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(path)
			if err != nil {
				t.Fatalf("%v (run go test ./figures -update to write the golden files)", err)
			}
			if !bytes.Equal(fig.SVG, want) {
				t.Errorf("%s differs from the golden file (%d bytes, want %d); if the change is intended, run go test ./figures -update and look at the figure", path, len(fig.SVG), len(want))
			}
		})
	}
}
