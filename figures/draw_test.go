package figures

import (
	"bytes"
	"encoding/xml"
	"fmt"
	"math"
	"regexp"
	"strings"
	"sync"
	"testing"
)

// TestDeterministic: the same spec gives the same bytes, drawn twice in a
// row or at once from many goroutines (blocks run in parallel).
func TestDeterministic(t *testing.T) {
	for _, g := range goldenSpecs() {
		first := mustDraw(t, g.spec)
		second := mustDraw(t, g.spec)
		if !bytes.Equal(first.SVG, second.SVG) {
			t.Errorf("%s: two draws differ", g.name)
		}
		var wg sync.WaitGroup
		out := make([][]byte, 4)
		for i := range out {
			wg.Add(1)
			go func() {
				defer wg.Done()
				if fig, err := Draw(g.spec); err == nil {
					out[i] = fig.SVG
				}
			}()
		}
		wg.Wait()
		for i, b := range out {
			if !bytes.Equal(b, first.SVG) {
				t.Errorf("%s: concurrent draw %d differs", g.name, i)
			}
		}
	}
}

var idAttr = regexp.MustCompile(`\bid="([^"]*)"`)

// TestSVGElement: every figure is one well-formed <svg> element that scales
// (viewBox, width 100%), is labelled for assistive technology (role="img",
// aria-labelledby naming its <title> and <desc>), references nothing
// outside itself and names a generic font family last.
func TestSVGElement(t *testing.T) {
	for _, g := range goldenSpecs() {
		t.Run(g.name, func(t *testing.T) {
			fig := mustDraw(t, g.spec)
			svg := string(fig.SVG)
			if err := xml.Unmarshal(fig.SVG, new(struct{})); err != nil {
				t.Fatalf("not well-formed XML: %v", err)
			}
			if !strings.HasPrefix(svg, "<svg ") || !strings.HasSuffix(svg, "</svg>\n") || strings.Count(svg, "<svg") != 1 {
				t.Fatalf("not a single <svg> element: %.80q", svg)
			}
			root := svg[:strings.IndexByte(svg, '>')]
			prefix := "fig-" + strings.TrimPrefix(g.spec.ID, "fig-")
			for _, want := range []string{
				`role="img"`, `width="100%"`, fmt.Sprintf(`viewBox="0 0 %g %g"`, CanvasWidth, CanvasHeight),
				`aria-labelledby="` + prefix + `-title ` + prefix + `-desc"`,
			} {
				if !strings.Contains(root, want) {
					t.Errorf("root %q lacks %s", root, want)
				}
			}
			for _, want := range []string{`<title id="` + prefix + `-title">`, `<desc id="` + prefix + `-desc">`} {
				if !strings.Contains(svg, want) {
					t.Errorf("no %s", want)
				}
			}
			if g.spec.Title != "" && !strings.Contains(svg, ">"+g.spec.Title+"</title>") {
				t.Errorf("the <title> is not the spec's title %q", g.spec.Title)
			}
			if fig.Desc == "" || !strings.HasSuffix(fig.Desc, ".") {
				t.Errorf("summary %q is not a sentence", fig.Desc)
			}
			for _, bad := range []string{"<image", "href", "url(", "@font-face", "<?xml", "<!--", "gradient", "filter"} {
				if strings.Contains(svg, bad) {
					t.Errorf("contains %q", bad)
				}
			}
			if strings.Count(svg, "http://") != 1 { // the namespace only
				t.Errorf("refers to something outside itself")
			}
			fams := regexp.MustCompile(`font-family:([^;"]*)`).FindAllStringSubmatch(svg, -1)
			for _, f := range fams {
				if !strings.HasSuffix(f[1], "sans-serif") && !strings.HasSuffix(f[1], "monospace") {
					t.Errorf("font-family %q does not end in a generic family", f[1])
				}
			}
			seen := map[string]bool{}
			for _, m := range idAttr.FindAllStringSubmatch(svg, -1) {
				if seen[m[1]] || !strings.HasPrefix(m[1], prefix+"-") {
					t.Errorf("id %q repeated or without the figure's prefix", m[1])
				}
				seen[m[1]] = true
			}
		})
	}
}

// TestIDs: two figures never share an id, with or without Spec.ID.
func TestIDs(t *testing.T) {
	a := Spec{Kind: Bar, Categories: []string{"A"}, Series: []Series{{Values: []float64{1}}}}
	b := a
	b.Series = []Series{{Values: []float64{2}}}
	ids := func(s Spec) []string {
		var out []string
		for _, m := range idAttr.FindAllStringSubmatch(string(mustDraw(t, s).SVG), -1) {
			out = append(out, m[1])
		}
		return out
	}
	ia, ib := ids(a), ids(b)
	if len(ia) != 2 || ia[0] == ib[0] {
		t.Errorf("ids without Spec.ID: %v and %v", ia, ib)
	}
	a.ID, b.ID = "first block", "second"
	ia, ib = ids(a), ids(b)
	if ia[0] != "fig-first-block-title" || ib[1] != "fig-second-desc" {
		t.Errorf("ids with Spec.ID: %v and %v", ia, ib)
	}
}

// TestDescriptions: generated summaries carry the key numbers; the
// author's Desc and Title win.
func TestDescriptions(t *testing.T) {
	bar := Spec{Kind: Bar, XLabel: "store", YLabel: "visits",
		Categories: []string{"North", "South", "East"},
		Series:     []Series{{Values: []float64{412, 388, 301}}}}
	fig := mustDraw(t, bar)
	if want := "Bar chart of visits by store: North 412, South 388, East 301."; fig.Desc != want {
		t.Errorf("desc %q, want %q", fig.Desc, want)
	}
	if !strings.Contains(string(fig.SVG), "<title id=\"fig-") || !strings.Contains(string(fig.SVG), ">Visits by store</title>") {
		t.Errorf("generated title missing")
	}
	bar.Desc, bar.Title = "Author's own summary & more.", "Own <title>"
	fig = mustDraw(t, bar)
	if fig.Desc != bar.Desc || !strings.Contains(string(fig.SVG), "Author&#39;s own summary &amp; more.") ||
		!strings.Contains(string(fig.SVG), "Own &lt;title&gt;") {
		t.Errorf("author's desc or title not used and escaped")
	}
	for _, g := range goldenSpecs() {
		d := mustDraw(t, g.spec).Desc
		if !regexp.MustCompile(`\d`).MatchString(d) {
			t.Errorf("%s: summary without numbers: %q", g.name, d)
		}
	}
}

// TestFormatValue: numbers as FORMAT.md section 4 writes them.
func TestFormatValue(t *testing.T) {
	cases := []struct {
		v       float64
		percent bool
		want    string
	}{
		{1204, false, "1,204"}, {-1204, false, "−1,204"}, {42.5, true, "42.5%"}, {4.2371, false, "4.24"},
		{0.04213, false, "0.0421"}, {11.96, false, "12.0"}, {1234567.8, false, "1,234,568"}, {-0.0001, true, "0.0%"},
	}
	for _, c := range cases {
		if got := formatValue(c.v, c.percent); got != c.want {
			t.Errorf("formatValue(%v, %v) = %q, want %q", c.v, c.percent, got, c.want)
		}
	}
	f := labelFormat([]float64{48.2, 36.9, 8.3}, false)
	if f(8.3) != "8.3" || f(48.2) != "48.2" {
		t.Errorf("labels of 48.2 and 8.3: %q, %q", f(48.2), f(8.3))
	}
}

// TestTicks: nice steps (Heckbert 1990) and the labelled start of a cut-off
// axis.
func TestTicks(t *testing.T) {
	for _, c := range []struct{ lo, hi, step float64 }{{0, 100, 20}, {0, 500, 100}, {0, 60, 10}, {0, 2000, 500}, {0, 1, 0.2}, {0, 7.5, 2}, {0, 9, 2}, {400, 1600, 250}} {
		if got := tickStep(c.lo, c.hi); !near(got, c.step, 1e-12) {
			t.Errorf("tickStep(%v, %v) = %v, want %v", c.lo, c.hi, got, c.step)
		}
	}
	ticks := valueTicks{percent: true}.Ticks(26.67, 100)
	if ticks[0].Value != 26.67 || ticks[0].Label != "26.67%" || ticks[1].Value != 40 {
		t.Errorf("ticks from 26.67: %+v", ticks)
	}
	r := niceRange(586, 1474)
	if got := (valueTicks{step: r.step}).Ticks(r.lo, r.hi); got[0].Value != r.lo || got[len(got)-1].Value != r.hi {
		t.Errorf("a default range %+v does not start and end on a tick: %+v", r, got)
	}
}

// TestBadSpecs: specs that cannot be drawn return an error that says what
// is wrong, never a panic.
func TestBadSpecs(t *testing.T) {
	one := []Series{{Name: "s", Values: []float64{1}}}
	cases := []struct {
		name string
		spec Spec
		want string
	}{
		{"no kind", Spec{}, "unknown chart kind"},
		{"unknown kind", Spec{Kind: "radar", Categories: []string{"a"}, Series: one}, "unknown chart kind"},
		{"no categories", Spec{Kind: Bar, Series: one}, "needs categories"},
		{"no series", Spec{Kind: Grouped, Categories: []string{"a"}}, "needs a series"},
		{"mismatched lengths", Spec{Kind: Bar, Categories: []string{"a", "b"}, Series: one}, "1 values for 2 categories"},
		{"two series in a bar chart", Spec{Kind: Bar, Categories: []string{"a"}, Series: append(one, one...)}, "one series"},
		{"NaN value", Spec{Kind: Grouped, Categories: []string{"a"}, Series: []Series{{Values: []float64{math.NaN()}}}}, "not a finite number"},
		{"infinite value", Spec{Kind: Dot, Categories: []string{"a"}, Series: []Series{{Values: []float64{math.Inf(1)}}}}, "not a finite number"},
		{"all missing in a line", Spec{Kind: Line, Categories: []string{"a"}, Series: []Series{{Values: []float64{math.NaN()}}}}, "no values"},
		{"interval lengths", Spec{Kind: Dot, Categories: []string{"a", "b"}, Series: []Series{{Values: []float64{1, 2}, Low: []float64{0}, High: []float64{3}}}}, "interval lows and highs"},
		{"interval beside its value", Spec{Kind: Dot, Categories: []string{"a"}, Series: []Series{{Values: []float64{5}, Low: []float64{6}, High: []float64{7}}}}, "contain the value"},
		{"negative share", Spec{Kind: Pie, Categories: []string{"a", "b"}, Series: []Series{{Values: []float64{-1, 2}}}}, "negative"},
		{"empty pie", Spec{Kind: Pie, Categories: []string{"a"}, Series: []Series{{Values: []float64{0}}}}, "more than zero"},
		{"pie with an axis", Spec{Kind: Pie, AxisMin: ptr(0), Categories: []string{"a"}, Series: one}, "no value axis"},
		{"axis min above max", Spec{Kind: Bar, AxisMin: ptr(5), AxisMax: ptr(1), Categories: []string{"a"}, Series: one}, "not below"},
		{"axis min above the data", Spec{Kind: Bar, AxisMin: ptr(50), Categories: []string{"a"}, Series: one}, "axis max above its min"},
		{"NaN axis", Spec{Kind: Bar, AxisMax: ptr(math.NaN()), Categories: []string{"a"}, Series: one}, "finite"},
		{"no bins", Spec{Kind: Histogram}, "needs bins"},
		{"reversed bin", Spec{Kind: Histogram, Bins: []Bin{{5, 1, 3}}}, "low edge"},
		{"overlapping bins", Spec{Kind: Histogram, Bins: []Bin{{0, 5, 3}, {4, 8, 1}}}, "overlap"},
		{"negative count", Spec{Kind: Histogram, Bins: []Bin{{0, 5, -3}}}, "negative count"},
		{"no points", Spec{Kind: Scatter}, "needs points"},
		{"NaN point", Spec{Kind: Scatter, Points: []Point{{math.NaN(), 1}}}, "finite"},
		{"bad fit", Spec{Kind: Scatter, Points: []Point{{1, 1}}, Fit: &Fit{Slope: math.Inf(1)}}, "fitted line"},
		{"no boxes", Spec{Kind: Box}, "at least one box"},
		{"box out of order", Spec{Kind: Box, Boxes: []BoxStats{{Q1: 5, Median: 3, Q3: 8, WhiskerLow: 1, WhiskerHigh: 9}}}, "Q1 ≤ median"},
		{"box labels", Spec{Kind: Box, Categories: []string{"a", "b"}, Boxes: []BoxStats{{Q1: 1, Median: 2, Q3: 3, WhiskerLow: 0, WhiskerHigh: 4}}}, "one per box"},
		{"no lines", Spec{Kind: StemLeaf}, "needs lines"},
		{"negative stack", Spec{Kind: Stacked, Categories: []string{"a"}, Series: []Series{{Values: []float64{-2}}}}, "negative"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			fig, err := Draw(c.spec)
			if err == nil {
				t.Fatalf("no error; drew %d bytes", len(fig.SVG))
			}
			if !strings.Contains(err.Error(), c.want) || strings.Contains(err.Error(), "internal error") {
				t.Errorf("error %q, want one saying %q", err, c.want)
			}
			if fig.SVG != nil {
				t.Errorf("an error came with an SVG")
			}
		})
	}
}

// TestOddButValid: specs at the edges still draw.
func TestOddButValid(t *testing.T) {
	long := strings.Repeat("Extraordinarily long category name ", 6)
	specs := []Spec{
		{Kind: Bar, Categories: []string{"only"}, Series: []Series{{Values: []float64{0}}}},
		{Kind: Bar, Categories: []string{"a", "b", "c"}, Series: []Series{{Values: []float64{-4, 2, 7}}}},
		{Kind: Bar, Categories: []string{"a", "b"}, AxisMax: ptr(5), Series: []Series{{Values: []float64{3, 9}}}},
		{Kind: Bar, Categories: []string{long, "b"}, Series: []Series{{Values: []float64{3, 9}}}},
		{Kind: Grouped, Categories: []string{"a", "b"}, Series: []Series{{Values: []float64{1, 2}}}},
		{Kind: Stacked, Categories: []string{"a", "b"}, Series: []Series{{Values: []float64{0, 2}}, {Values: []float64{0, 1}}}},
		{Kind: Line, Categories: []string{"t1", "t2", "t3"}, Series: []Series{{Values: []float64{1, math.NaN(), 3}}}},
		{Kind: Line, Categories: []string{"t1"}, Series: []Series{{Values: []float64{5}}}},
		{Kind: Scatter, Points: []Point{{2, 2}}, Fit: &Fit{Intercept: 1, Slope: 0.5}},
		{Kind: Scatter, Points: []Point{{1, 1}, {2, 2}}, Fit: &Fit{Intercept: 0, Slope: 1, Label: strings.Repeat("very long fit label ", 8)}},
		{Kind: Pie, Categories: []string{"all"}, Series: []Series{{Values: []float64{7}}}},
		{Kind: Pie, Categories: strings.Fields("a b c d e f g h i j k l"), Series: []Series{{Values: []float64{1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 30}}}},
		{Kind: Box, Boxes: []BoxStats{{Q1: 2, Median: 2, Q3: 2, WhiskerLow: 2, WhiskerHigh: 2}}},
		{Kind: Histogram, Bins: []Bin{{0, 1, 0}}},
		{Kind: Histogram, Bins: []Bin{{0, 1, 3}, {2, 3, 1}}},
		{Kind: StemLeaf, Lines: []string{strings.Repeat("9 ", 200)}},
		{Kind: Dot, Categories: []string{"a"}, Series: []Series{{Values: []float64{3}}}},
	}
	for i, s := range specs {
		if _, err := Draw(s); err != nil {
			t.Errorf("spec %d (%s): %v", i, s.Kind, err)
		}
	}
}

// FuzzDraw builds specs from fuzzed bytes: Draw must return a figure or an
// error, and never fail inside (a recovered panic is an internal error).
func FuzzDraw(f *testing.F) {
	f.Add([]byte{0, 3, 1, 10, 20, 30})
	f.Add([]byte{1, 4, 2, 255, 0, 7, 9, 128})
	f.Add([]byte{8, 2, 1, 5, 5})
	f.Fuzz(func(t *testing.T, data []byte) {
		s := specFromBytes(data)
		fig, err := Draw(s)
		if err != nil {
			if strings.Contains(err.Error(), "internal error") {
				t.Fatalf("Draw(%+v): %v", s, err)
			}
			return
		}
		if !bytes.HasPrefix(fig.SVG, []byte("<svg ")) {
			t.Fatalf("no SVG element")
		}
	})
}

// TestFuzzCorpus runs the fuzz body over many derived inputs on every
// test run.
func TestFuzzCorpus(t *testing.T) {
	for seed := 0; seed < 400; seed++ {
		data := make([]byte, 3+seed%29)
		x := uint32(seed*2654435761 + 1)
		for i := range data {
			x ^= x << 13
			x ^= x >> 17
			x ^= x << 5
			data[i] = byte(x)
		}
		s := specFromBytes(data)
		if _, err := Draw(s); err != nil && strings.Contains(err.Error(), "internal error") {
			t.Fatalf("seed %d, Draw(%+v): %v", seed, s, err)
		}
	}
}

// specFromBytes turns bytes into a spec of any kind, often a bad one.
func specFromBytes(data []byte) Spec {
	next := func() byte {
		if len(data) == 0 {
			return 0
		}
		b := data[0]
		data = data[1:]
		return b
	}
	val := func() float64 {
		b := next()
		switch b {
		case 250:
			return math.NaN()
		case 251:
			return math.Inf(1)
		case 252:
			return -1e300
		}
		return float64(int(b)-60) / 4
	}
	s := Spec{Kind: Kind("unknown")}
	if k := int(next()); k < len(Kinds)+1 && k < len(Kinds) {
		s.Kind = Kinds[k]
	}
	n := int(next() % 9)
	k := int(next() % 4)
	for i := 0; i < n; i++ {
		s.Categories = append(s.Categories, strings.Repeat("c", int(next()%40)))
	}
	for j := 0; j < k; j++ {
		ser := Series{Name: fmt.Sprint("s", j)}
		m := n
		if next()%7 == 0 {
			m = int(next() % 5)
		}
		for i := 0; i < m; i++ {
			ser.Values = append(ser.Values, val())
		}
		if next()%3 == 0 {
			for _, v := range ser.Values {
				ser.Low = append(ser.Low, v-math.Abs(val()))
				ser.High = append(ser.High, v+math.Abs(val()))
			}
		}
		s.Series = append(s.Series, ser)
	}
	switch next() % 4 {
	case 1:
		s.AxisMin = ptr(val())
	case 2:
		s.AxisMax = ptr(val())
	case 3:
		s.AxisMin, s.AxisMax = ptr(val()), ptr(val())
	}
	s.Percent = next()%5 == 0
	lo := val()
	for i := 0; i < n; i++ {
		w := math.Abs(val())
		s.Bins = append(s.Bins, Bin{Lo: lo, Hi: lo + w, Value: val()})
		lo += w
	}
	for i := 0; i < n*2; i++ {
		s.Points = append(s.Points, Point{val(), val()})
	}
	if next()%2 == 0 {
		s.Fit = &Fit{Intercept: val(), Slope: val(), Label: "fit"}
	}
	for i := 0; i < n; i++ {
		a, b, c, d, e := val(), val(), val(), val(), val()
		vs := []float64{a, b, c, d, e}
		for x := range vs { // sort, mostly into a valid summary
			for y := x + 1; y < len(vs); y++ {
				if vs[y] < vs[x] {
					vs[x], vs[y] = vs[y], vs[x]
				}
			}
		}
		s.Boxes = append(s.Boxes, BoxStats{WhiskerLow: vs[0], Q1: vs[1], Median: vs[2], Q3: vs[3], WhiskerHigh: vs[4], Outliers: []float64{val()}, N: int(next())})
	}
	for i := 0; i < n; i++ {
		s.Lines = append(s.Lines, strings.Repeat("1 ", int(next()%30)))
	}
	return s
}
