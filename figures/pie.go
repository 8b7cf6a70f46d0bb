package figures

import (
	"fmt"
	"image/color"
	"math"
	"sort"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// pieSlices draws a pie: slices clockwise from twelve o'clock in category
// order, each labelled outside with its name and share. Labels on one side
// are pushed apart so that they never overlap, with a thin leader to their
// slice.
type pieSlices struct {
	names   []string
	values  []float64
	percent bool
	total   float64
}

// slice is the drawn geometry of one slice.
type slice struct {
	start, sweep float64 // radians; sweep is negative (clockwise)
}

func (ps *pieSlices) slices() []slice {
	out := make([]slice, len(ps.values))
	cum := 0.0
	for i, v := range ps.values {
		out[i] = slice{start: math.Pi/2 - 2*math.Pi*cum/ps.total, sweep: -2 * math.Pi * v / ps.total}
		cum += v
	}
	return out
}

func (ps *pieSlices) label(i int) string {
	share := formatValue(ps.values[i]/ps.total*100, true)
	if ps.percent {
		return ps.names[i] + " " + share
	}
	return ps.names[i] + " " + formatValue(ps.values[i], false) + " (" + share + ")"
}

func (ps *pieSlices) labelStyle() draw.TextStyle {
	return textStyle(sansRegular, tickSize, inkColor, draw.XLeft, draw.YCenter)
}

// radius is the pie's radius in the data area c: as large as the area
// allows with the widest label beside it.
func (ps *pieSlices) radius(c draw.Canvas) vg.Length {
	sty := ps.labelStyle()
	var lw vg.Length
	for i := range ps.values {
		lw = vg.Length(math.Max(float64(lw), float64(sty.Width(ps.label(i)))))
	}
	w, h := c.Max.X-c.Min.X, c.Max.Y-c.Min.Y
	lineH := sty.Height("Xg")
	r := vg.Length(math.Min(float64(w/2-lw-vg.Points(20)), float64(h/2-lineH-vg.Points(6))))
	return vg.Length(math.Max(float64(r), 40))
}

func (ps *pieSlices) Plot(c draw.Canvas, _ *plot.Plot) {
	ctr := c.Center()
	r := ps.radius(c)
	sl := ps.slices()
	sep := draw.LineStyle{Color: white, Width: vg.Points(1.5)}
	for i, s := range sl {
		if ps.values[i] <= 0 {
			continue
		}
		var path vg.Path
		path.Move(ctr)
		path.Line(vg.Point{X: ctr.X + r*vg.Length(math.Cos(s.start)), Y: ctr.Y + r*vg.Length(math.Sin(s.start))})
		path.Arc(ctr, r, s.start, s.sweep)
		path.Close()
		c.SetColor(pieColor(i))
		c.Fill(path)
		if len(sl) > 1 {
			c.SetLineStyle(sep)
			c.Stroke(path)
		}
	}

	// Labels: anchored beside the middle of their slice, then pushed apart
	// on each side of the pie, top to bottom.
	sty := ps.labelStyle()
	lineH := sty.Height("Xg") * 1.15
	type lab struct {
		i      int
		mid    float64
		x, y   vg.Length
		right  bool
		anchor vg.Point
	}
	var sides [2][]lab
	for i, s := range sl {
		if ps.values[i] <= 0 {
			continue
		}
		mid := s.start + s.sweep/2
		cos, sin := vg.Length(math.Cos(mid)), vg.Length(math.Sin(mid))
		l := lab{i: i, mid: mid, right: cos >= 0,
			anchor: vg.Point{X: ctr.X + (r+2)*cos, Y: ctr.Y + (r+2)*sin},
			x:      ctr.X + (r+12)*cos, y: ctr.Y + (r+12)*sin}
		side := 0
		if !l.right {
			side = 1
		}
		sides[side] = append(sides[side], l)
	}
	lead := draw.LineStyle{Color: axisLine, Width: vg.Points(0.6)}
	for _, ls := range sides {
		sort.SliceStable(ls, func(a, b int) bool { return ls[a].y > ls[b].y })
		for j := 1; j < len(ls); j++ {
			if ls[j-1].y-ls[j].y < lineH {
				ls[j].y = ls[j-1].y - lineH
			}
		}
		if n := len(ls); n > 0 && ls[n-1].y < c.Min.Y+lineH/2 {
			shift := c.Min.Y + lineH/2 - ls[n-1].y
			for j := range ls {
				ls[j].y += shift
			}
			for j := len(ls) - 2; j >= 0; j-- {
				if ls[j].y-ls[j+1].y < lineH {
					ls[j].y = ls[j+1].y + lineH
				}
			}
		}
		for _, l := range ls {
			st := sty
			tx := l.x + vg.Points(3)
			if !l.right {
				st.XAlign = draw.XRight
				tx = l.x - vg.Points(3)
			}
			c.StrokeLines(lead, []vg.Point{l.anchor, {X: l.x, Y: l.y}})
			c.FillText(st, vg.Point{X: tx, Y: l.y}, ps.label(l.i))
		}
	}
}

// pieColor is the colour of slice i: the palette, then its tints.
func pieColor(i int) color.Color {
	c := seriesColor(i)
	if i >= len(Palette) {
		return tint(c, 0.45)
	}
	return c
}

// buildPie composes a pie of the single series' values.
func buildPie(s Spec) (*drawing, error) {
	vals := s.Series[0].Values
	total := 0.0
	for _, v := range vals {
		total += v
	}
	ps := &pieSlices{names: s.Categories, values: vals, percent: s.Percent, total: total}
	p := newPlot()
	p.HideAxes()
	p.Add(ps)
	zero := 0.0
	d := &drawing{plot: p, lie: true, axisMin: &zero, axisMax: &total}
	d.marks = func(c draw.Canvas, _ *plot.Plot) []Mark {
		ctr := c.Center()
		r := ps.radius(c)
		marks := make([]Mark, len(vals))
		for i, sl := range ps.slices() {
			mid := sl.start + sl.sweep/2
			marks[i] = Mark{Series: s.Series[0].Name, Category: s.Categories[i], Value: vals[i],
				Length: math.Abs(sl.sweep) * 180 / math.Pi,
				X:      float64(ctr.X + r*vg.Length(math.Cos(mid))), Y: float64(ctr.Y + r*vg.Length(math.Sin(mid)))}
		}
		return marks
	}
	of := orDefault(s.Series[0].Name, orDefault(s.YLabel, "shares"))
	by := orDefault(s.XLabel, "category")
	d.title = capitalize(of + " by " + by)
	parts := make([]string, len(vals))
	for i := range vals {
		parts[i] = ps.label(i)
	}
	d.desc = fmt.Sprintf("Pie chart of %s by %s: %s.", of, by, joinLimited(parts, ", ", listLimit))
	return d, nil
}
