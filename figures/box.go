package figures

import (
	"fmt"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// tukeyBoxes draws Tukey box plots from five-number summaries the caller
// computed (plotter.BoxPlot computes its own from raw values): a box from
// the first to the third quartile, a line at the median, whiskers to the
// most extreme values within 1.5 IQR, and every point beyond as a ring.
type tukeyBoxes struct {
	boxes []BoxStats
	width vg.Length // box width, set by layout
}

func (tb *tukeyBoxes) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	ink := seriesColor(0)
	fill := tint(ink, 0.78)
	edge := draw.LineStyle{Color: ink, Width: vg.Points(1.2)}
	med := draw.LineStyle{Color: rgb(0x00, 0x3F, 0x63), Width: vg.Points(2.4)}
	whisk := draw.LineStyle{Color: axisText, Width: vg.Points(1.1)}
	ring := draw.LineStyle{Color: ink, Width: vg.Points(1)}
	for i, b := range tb.boxes {
		x := trX(float64(i))
		hw := tb.width / 2
		cap := tb.width * 0.2
		q1, q3, m := trY(b.Q1), trY(b.Q3), trY(b.Median)
		lo, hi := trY(b.WhiskerLow), trY(b.WhiskerHigh)
		c.StrokeLines(whisk, c.ClipLinesY(
			[]vg.Point{{X: x, Y: q3}, {X: x, Y: hi}},
			[]vg.Point{{X: x - cap, Y: hi}, {X: x + cap, Y: hi}},
			[]vg.Point{{X: x, Y: q1}, {X: x, Y: lo}},
			[]vg.Point{{X: x - cap, Y: lo}, {X: x + cap, Y: lo}},
		)...)
		box := rectPts(x-hw, q1, x+hw, q3)
		c.FillPolygon(fill, c.ClipPolygonY(box))
		c.StrokeLines(edge, c.ClipLinesY(append(box, box[0]))...)
		c.StrokeLines(med, c.ClipLinesY([]vg.Point{{X: x - hw, Y: m}, {X: x + hw, Y: m}})...)
		for _, o := range b.Outliers {
			y := trY(o)
			if !c.ContainsY(y) {
				continue
			}
			var path vg.Path
			r := vg.Points(2.8)
			path.Move(vg.Point{X: x + r, Y: y})
			path.Arc(vg.Point{X: x, Y: y}, r, 0, 2*math.Pi)
			path.Close()
			c.SetLineStyle(ring)
			c.Stroke(path)
		}
	}
}

// DataRange implements plot.DataRanger.
func (tb *tukeyBoxes) DataRange() (xmin, xmax, ymin, ymax float64) {
	ymin, ymax = math.Inf(1), math.Inf(-1)
	for _, b := range tb.boxes {
		ymin, ymax = extend(ymin, ymax, b.WhiskerLow, b.WhiskerHigh, b.Q1, b.Q3)
		ymin, ymax = extend(ymin, ymax, b.Outliers...)
	}
	return -0.5, float64(len(tb.boxes)) - 0.5, ymin, ymax
}

// boxLabel is the label of box i: its Label, else the category name.
func boxLabel(s Spec, i int) string {
	if s.Boxes[i].Label != "" {
		return s.Boxes[i].Label
	}
	if i < len(s.Categories) {
		return s.Categories[i]
	}
	return fmt.Sprintf("group %d", i+1)
}

// buildBox composes Tukey box plots, one per group, with each group's n
// under its name.
func buildBox(s Spec) (*drawing, error) {
	n := len(s.Boxes)
	tb := &tukeyBoxes{boxes: s.Boxes}
	_, _, lo, hi := tb.DataRange()
	vr, err := valueRange(s, niceRange(lo, hi))
	if err != nil {
		return nil, err
	}
	vmin, vmax := vr.lo, vr.hi
	p := newPlot()
	names := make([]string, n)
	for i := range s.Boxes {
		names[i] = boxLabel(s, i)
	}
	slot := plotWidthEstimate() / vg.Length(n)
	labels := slantLabels(p, names, slot)
	slanted := p.X.Tick.Label.Rotation != 0
	for i, b := range s.Boxes {
		if b.N > 0 {
			sep := "\n"
			if slanted {
				sep = ", "
			}
			labels[i] += sep + "n = " + formatValue(float64(b.N), false)
		}
	}
	p.X.Tick.Marker = categoryTicks(labels)
	p.X.LineStyle = baseline
	p.X.Label.Text = s.XLabel
	p.Y.Tick.Marker = valueTicks{percent: s.Percent, step: vr.step}
	p.Y.Label.Text = s.YLabel
	grid := plotter.NewGrid()
	grid.Vertical.Color = nil
	grid.Horizontal = gridStyle
	p.Add(grid)
	p.Add(tb)
	p.X.Min, p.X.Max = -0.5, float64(n)-0.5
	p.Y.Min, p.Y.Max = vmin, vmax

	d := &drawing{plot: p}
	d.layout = func(dataC draw.Canvas) {
		slot := (dataC.Max.X - dataC.Min.X) / vg.Length(n)
		tb.width = vg.Length(math.Min(float64(slot*0.5), 56))
	}
	d.marks = func(c draw.Canvas, p *plot.Plot) []Mark {
		trX, trY := p.Transforms(&c)
		var marks []Mark
		for i, b := range s.Boxes {
			x := float64(trX(float64(i)))
			marks = append(marks, Mark{Series: "median", Category: names[i], Value: b.Median, X: x, Y: float64(trY(b.Median))})
			for _, o := range b.Outliers {
				marks = append(marks, Mark{Series: "outlier", Category: names[i], Value: o, X: x, Y: float64(trY(o))})
			}
		}
		return marks
	}
	what := orDefault(s.YLabel, "values")
	by := orDefault(s.XLabel, "group")
	d.title = capitalize(what + " by " + by)
	var parts []string
	for i, b := range s.Boxes {
		part := fmt.Sprintf("%s median %s (quartiles %s to %s, whiskers %s to %s", names[i],
			formatValue(b.Median, s.Percent), formatValue(b.Q1, s.Percent), formatValue(b.Q3, s.Percent),
			formatValue(b.WhiskerLow, s.Percent), formatValue(b.WhiskerHigh, s.Percent))
		switch len(b.Outliers) {
		case 0:
		case 1:
			part += ", 1 outlier"
		default:
			part += fmt.Sprintf(", %d outliers", len(b.Outliers))
		}
		if b.N > 0 {
			part += ", n = " + formatValue(float64(b.N), false)
		}
		parts = append(parts, part+")")
	}
	d.desc = fmt.Sprintf("Box plots of %s by %s: %s.", what, by, joinLimited(parts, "; ", 8))
	return d, nil
}
