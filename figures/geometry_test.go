package figures

import (
	"math"
	"strings"
	"testing"
)

func mustDraw(t *testing.T, s Spec) Figure {
	t.Helper()
	fig, err := Draw(s)
	if err != nil {
		t.Fatalf("Draw(%s): %v", s.Kind, err)
	}
	return fig
}

func near(a, b, tol float64) bool { return math.Abs(a-b) <= tol }

// twoBars is the textbook case: two stores with 40 and 60 orders.
func twoBars(axisMin *float64, long bool) Spec {
	cats := []string{"Harbour", "North"}
	if long {
		// Labels too long for vertical bars: the chart turns horizontal.
		cats = []string{"Harbour Lane flagship bakery, café and cake counter by the old ferry terminal, open late on Fridays and Saturdays",
			"North Quay bakery with its kiosk, its terrace and the cake counter in the arcade, open early every day but Sunday"}
	}
	return Spec{
		ID: "orders", Kind: Bar, XLabel: "Store", YLabel: "Orders", AxisMin: axisMin,
		Categories: cats,
		Series:     []Series{{Name: "Orders", Values: []float64{40, 60}}},
	}
}

// TestLieFactorTufte checks the lie factor against its published
// definition (Tufte 1983, The Visual Display of Quantitative Information,
// p. 57: size of effect shown in graphic / size of effect in data, an
// effect being (later − earlier)/earlier). Bars of 40 and 60 show an effect
// of 0.5 in the data.
func TestLieFactorTufte(t *testing.T) {
	cases := []struct {
		name     string
		axisMin  *float64
		ratio    float64 // drawn length of the 40 bar over that of the 60 bar
		wantLie  float64
		whatSaid string
	}{
		// Tufte 1983: a zero-based axis draws the data's effect, lie factor 1.
		{"zero axis", nil, 40.0 / 60.0, 1.0, "Tufte 1983: honest bars"},
		// Axis from 30: lengths 10 and 30, effect shown (30−10)/10 = 2,
		// lie factor 2/0.5 = 4.
		{"axis from 30", ptr(30), 10.0 / 30.0, 4.0, "Tufte 1983: cut-off axis"},
		// Fact of the trade: a ratio of 1.5 drawn 2.5 times taller has a lie
		// factor of 3 (1.5/0.5); an axis from 80/3 ≈ 26.67 draws 13.33 and
		// 33.33.
		{"axis from 80/3", ptr(80.0 / 3), 1 / 2.5, 3.0, "common practice: 1.5 drawn as 2.5"},
		{"axis from 26.67", ptr(26.67), (40 - 26.67) / (60 - 26.67), 3.0, "common practice: 1.5 drawn as 2.5"},
	}
	for _, c := range cases {
		for _, long := range []bool{false, true} {
			name := c.name
			if long {
				name += ", horizontal"
			}
			t.Run(name, func(t *testing.T) {
				fig := mustDraw(t, twoBars(c.axisMin, long))
				g := fig.Geometry
				if g.Horizontal != long {
					t.Errorf("Horizontal = %v, want %v", g.Horizontal, long)
				}
				if len(g.Marks) != 2 {
					t.Fatalf("%d marks, want 2", len(g.Marks))
				}
				a, b := g.Marks[0], g.Marks[1]
				if a.Value != 40 || b.Value != 60 {
					t.Fatalf("mark values %v, %v; want 40, 60", a.Value, b.Value)
				}
				if got := a.Length / b.Length; !near(got, c.ratio, 0.001) {
					t.Errorf("drawn lengths %.2f and %.2f, ratio %.4f; want %.4f (%s)", a.Length, b.Length, got, c.ratio, c.whatSaid)
				}
				if !g.HasLie || !near(g.LieFactor, c.wantLie, 0.01) {
					t.Errorf("lie factor %.4f (HasLie %v), want %.2f ± 0.01 (%s)", g.LieFactor, g.HasLie, c.wantLie, c.whatSaid)
				}
				wantMin := 0.0
				if c.axisMin != nil {
					wantMin = *c.axisMin
				}
				if g.AxisMin != wantMin {
					t.Errorf("axis drawn from %v, want %v", g.AxisMin, wantMin)
				}
			})
		}
	}
}

// TestLieFactorDefinition checks LieFactor on hand-made marks, including
// its edge cases.
func TestLieFactorDefinition(t *testing.T) {
	cases := []struct {
		name  string
		marks []Mark
		want  float64
		ok    bool
	}{
		{"proportional", []Mark{{Value: 10, Length: 20}, {Value: 30, Length: 60}}, 1, true},
		{"doubled effect", []Mark{{Value: 10, Length: 10}, {Value: 20, Length: 30}}, 2, true},
		{"smaller bar not drawn", []Mark{{Value: 10, Length: 0}, {Value: 20, Length: 30}}, math.Inf(1), true},
		{"one value", []Mark{{Value: 10, Length: 20}}, 0, false},
		{"equal values", []Mark{{Value: 10, Length: 20}, {Value: 10, Length: 20}}, 0, false},
		{"negatives ignored", []Mark{{Value: -5, Length: 10}, {Value: 10, Length: 20}, {Value: 20, Length: 40}}, 1, true},
		// Ties: the shortest of the smallest value, the longest of the largest.
		{"ties", []Mark{{Value: 10, Length: 20}, {Value: 10, Length: 10}, {Value: 20, Length: 40}}, 3, true},
	}
	for _, c := range cases {
		got, ok := LieFactor(c.marks)
		if ok != c.ok || (ok && !(got == c.want || near(got, c.want, 1e-9))) {
			t.Errorf("%s: LieFactor = %v, %v; want %v, %v", c.name, got, ok, c.want, c.ok)
		}
	}
}

// TestLieFactorStackedAndPie: a 100% stack and a pie drawn by Draw are
// honest; a stack on a cut-off axis is not.
func TestLieFactorStackedAndPie(t *testing.T) {
	stack := Spec{Kind: Stacked, Categories: []string{"Monthly", "Annual"},
		Series: []Series{{Name: "Renewed", Values: []float64{60, 90}}, {Name: "Left", Values: []float64{40, 10}}}}
	g := mustDraw(t, stack).Geometry
	if !g.HasLie || !near(g.LieFactor, 1, 0.01) {
		t.Errorf("stacked: lie factor %v (HasLie %v), want 1", g.LieFactor, g.HasLie)
	}
	if len(g.Marks) != 4 || !near(g.Marks[0].Value, 60, 1e-9) || !near(g.Marks[3].Value, 10, 1e-9) {
		t.Errorf("stacked marks %+v; want the shares 60, 40, 90, 10", g.Marks)
	}
	stack.AxisMin = ptr(20)
	g = mustDraw(t, stack).Geometry
	// Segments of 10% (the Annual "Left" one, from 90 to 100) and 90% (the
	// Annual "Renewed" one, from 0 to 90, drawn from 20): lengths 10 and 70
	// on an 80-point scale, effect shown 6, in the data 8: lie factor 0.75.
	if !g.HasLie || !near(g.LieFactor, 0.75, 0.01) {
		t.Errorf("stacked from 20: lie factor %v, want 0.75", g.LieFactor)
	}

	pie := Spec{Kind: Pie, Categories: []string{"Card", "Cash", "App"},
		Series: []Series{{Name: "Payments", Values: []float64{50, 30, 20}}}}
	g = mustDraw(t, pie).Geometry
	if !g.HasLie || !near(g.LieFactor, 1, 1e-9) {
		t.Errorf("pie: lie factor %v (HasLie %v), want 1", g.LieFactor, g.HasLie)
	}
	if g.AxisMin != 0 || g.AxisMax != 100 {
		t.Errorf("pie axis %v–%v, want 0 and the total 100", g.AxisMin, g.AxisMax)
	}
	if !near(g.Marks[0].Length, 180, 1e-9) {
		t.Errorf("pie: half the whole swept %v degrees, want 180", g.Marks[0].Length)
	}
}

// TestLieFactorNotApplicable: marks without extent have no lie factor.
func TestLieFactorNotApplicable(t *testing.T) {
	for _, g := range goldenSpecs() {
		fig := mustDraw(t, g.spec)
		want := false
		switch g.spec.Kind {
		case Bar, Grouped, Histogram, Stacked, Pie:
			want = true
		}
		if fig.Geometry.HasLie != want {
			t.Errorf("%s: HasLie = %v, want %v", g.name, fig.Geometry.HasLie, want)
		}
		if want && !near(fig.Geometry.LieFactor, 1, 0.01) && g.spec.AxisMin == nil {
			t.Errorf("%s: an honest default chart has lie factor %v", g.name, fig.Geometry.LieFactor)
		}
	}
}

// TestHistogramBinsTouch: adjacent bins share their edge in canvas units
// (fact of the trade: a histogram's bins touch).
func TestHistogramBinsTouch(t *testing.T) {
	s := Spec{Kind: Histogram, Bins: []Bin{{0, 10, 4}, {10, 20, 9}, {20, 30, 0}, {30, 40, 3}}}
	g := mustDraw(t, s).Geometry
	if len(g.Marks) != 4 {
		t.Fatalf("%d marks, want 4", len(g.Marks))
	}
	for i := 1; i < len(g.Marks); i++ {
		if d := g.Marks[i].Rect.MinX - g.Marks[i-1].Rect.MaxX; math.Abs(d) > 1e-9 {
			t.Errorf("bins %d and %d are %.4f points apart, want touching", i, i+1, d)
		}
	}
	if g.Marks[2].Length != 0 {
		t.Errorf("an empty bin is drawn %.2f points tall", g.Marks[2].Length)
	}
}

// TestCategoryBarsHaveGaps: bars for categories stand apart (fact of the
// trade), vertical or horizontal, plain, grouped or stacked.
func TestCategoryBarsHaveGaps(t *testing.T) {
	specs := []Spec{
		{Kind: Bar, Categories: []string{"A", "B", "C"}, Series: []Series{{Values: []float64{3, 5, 4}}}},
		twoBars(nil, true),
		{Kind: Stacked, Categories: []string{"A", "B"}, Series: []Series{{Name: "x", Values: []float64{1, 2}}, {Name: "y", Values: []float64{3, 1}}}},
	}
	for _, s := range specs {
		g := mustDraw(t, s).Geometry
		var prev *Mark
		for i := range g.Marks {
			m := &g.Marks[i]
			if prev != nil && m.Category != prev.Category {
				gap := m.Rect.MinX - prev.Rect.MaxX
				if g.Horizontal {
					gap = prev.Rect.MinY - m.Rect.MaxY // the first category is on top
				}
				if gap < 10 {
					t.Errorf("%s: bars %q and %q are %.2f points apart, want a clear gap", s.Kind, prev.Category, m.Category, gap)
				}
			}
			prev = m
		}
	}
	grouped := Spec{Kind: Grouped, Categories: []string{"North", "South"},
		Series: []Series{{Name: "2025", Values: []float64{3, 5}}, {Name: "2026", Values: []float64{4, 6}}}}
	g := mustDraw(t, grouped).Geometry
	// Marks run series by series: 2025 North, 2025 South, 2026 North, 2026 South.
	within := g.Marks[2].Rect.MinX - g.Marks[0].Rect.MaxX
	between := g.Marks[1].Rect.MinX - g.Marks[2].Rect.MaxX
	if !(within > 0 && within < 3) || between < 10 {
		t.Errorf("grouped: %.2f points between the bars of a group, %.2f between groups", within, between)
	}
}

// TestHonestAxisDefaults: zero-based value axes for bars, grouped bars,
// stacks and histograms even when the data sit far from zero; 0–100 for
// percentages; the author's range exactly when given.
func TestHonestAxisDefaults(t *testing.T) {
	high := []float64{412, 418, 405}
	cats := []string{"North", "South", "East"}
	for _, s := range []Spec{
		{Kind: Bar, Categories: cats, Series: []Series{{Values: high}}},
		{Kind: Grouped, Categories: cats, Series: []Series{{Name: "a", Values: high}, {Name: "b", Values: high}}},
		{Kind: Stacked, Categories: cats, Series: []Series{{Name: "a", Values: high}, {Name: "b", Values: []float64{300, 200, 100}}}},
		{Kind: Histogram, Bins: []Bin{{0, 1, 412}, {1, 2, 418}}},
	} {
		g := mustDraw(t, s).Geometry
		if g.AxisMin != 0 {
			t.Errorf("%s: value axis starts at %v, want 0", s.Kind, g.AxisMin)
		}
		if !near(g.LieFactor, 1, 0.01) {
			t.Errorf("%s: lie factor %v on the default axis", s.Kind, g.LieFactor)
		}
	}
	if g := mustDraw(t, Spec{Kind: Stacked, Categories: cats, Series: []Series{{Name: "a", Values: high}}}).Geometry; g.AxisMax != 100 {
		t.Errorf("stacked: share axis ends at %v, want 100", g.AxisMax)
	}

	pct := []float64{38.2, 41.5, 40.1}
	for _, k := range []Kind{Bar, Dot, Line, Grouped} {
		s := Spec{Kind: k, Percent: true, Categories: cats, Series: []Series{{Name: "a", Values: pct}}}
		g := mustDraw(t, s).Geometry
		if g.AxisMin != 0 || g.AxisMax != 100 {
			t.Errorf("%s with percentages: axis %v–%v, want 0–100", k, g.AxisMin, g.AxisMax)
		}
		s.AxisMin, s.AxisMax = ptr(35), ptr(45)
		g = mustDraw(t, s).Geometry
		if g.AxisMin != 35 || g.AxisMax != 45 {
			t.Errorf("%s with axis 35–45: drawn %v–%v", k, g.AxisMin, g.AxisMax)
		}
	}
	box := Spec{Kind: Box, AxisMin: ptr(-2.5), AxisMax: ptr(70.25),
		Boxes: []BoxStats{{Label: "A", Q1: 10, Median: 20, Q3: 30, WhiskerLow: 5, WhiskerHigh: 40}}}
	if g := mustDraw(t, box).Geometry; g.AxisMin != -2.5 || g.AxisMax != 70.25 {
		t.Errorf("box with axis −2.5–70.25: drawn %v–%v", g.AxisMin, g.AxisMax)
	}
	sc := Spec{Kind: Scatter, AxisMax: ptr(12), Points: []Point{{1, 2}, {3, 5}}}
	if g := mustDraw(t, sc).Geometry; g.AxisMax != 12 || g.Horizontal {
		t.Errorf("scatter with axis max 12: drawn %v–%v", g.AxisMin, g.AxisMax)
	}
	if g := mustDraw(t, Spec{Kind: StemLeaf, Lines: []string{"1 | 2"}}).Geometry; g.HasAxis {
		t.Errorf("stemleaf reports a value axis")
	}
}

// TestCutAxisStartLabelled: a cut-off axis shows where it starts.
func TestCutAxisStartLabelled(t *testing.T) {
	fig := mustDraw(t, twoBars(ptr(26.67), false))
	if !strings.Contains(string(fig.SVG), ">26.67</text>") {
		t.Errorf("the axis start 26.67 is not labelled")
	}
}

// TestMarksInsidePlot: every mark lies in the data area, and the data area
// in the canvas.
func TestMarksInsidePlot(t *testing.T) {
	for _, g := range goldenSpecs() {
		geo := mustDraw(t, g.spec).Geometry
		p := geo.Plot
		if p.MinX < 0 || p.MinY < 0 || p.MaxX > geo.Width || p.MaxY > geo.Height || p.MinX >= p.MaxX || p.MinY >= p.MaxY {
			t.Errorf("%s: data area %+v outside the canvas %vx%v", g.name, p, geo.Width, geo.Height)
		}
		for _, m := range geo.Marks {
			if m.X < p.MinX-0.01 || m.X > p.MaxX+0.01 || m.Y < p.MinY-0.01 || m.Y > p.MaxY+0.01 {
				t.Errorf("%s: mark %+v outside the data area %+v", g.name, m, p)
			}
		}
	}
}
