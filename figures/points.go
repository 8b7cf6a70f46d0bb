package figures

import (
	"fmt"
	"image/color"
	"math"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// xErrs feeds plotter.XErrorBars: estimates with interval ends.
type xErrs struct {
	xy     plotter.XYs
	lo, hi []float64 // interval ends, data units
}

func (e xErrs) Len() int                        { return len(e.xy) }
func (e xErrs) XY(i int) (float64, float64)     { return e.xy[i].X, e.xy[i].Y }
func (e xErrs) XError(i int) (float64, float64) { return e.xy[i].X - e.lo[i], e.hi[i] - e.xy[i].X }

// yErrs feeds plotter.YErrorBars.
type yErrs struct {
	xy     plotter.XYs
	lo, hi []float64
}

func (e yErrs) Len() int                        { return len(e.xy) }
func (e yErrs) XY(i int) (float64, float64)     { return e.xy[i].X, e.xy[i].Y }
func (e yErrs) YError(i int) (float64, float64) { return e.xy[i].Y - e.lo[i], e.hi[i] - e.xy[i].Y }

// pointStyle is the look of an estimate or a time point.
func pointStyle(i int) draw.GlyphStyle {
	return draw.GlyphStyle{Color: seriesColor(i), Radius: vg.Points(3.6), Shape: haloGlyph{}}
}

// extend widens [lo, hi] to include the finite values of vs.
func extend(lo, hi float64, vs ...float64) (float64, float64) {
	for _, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			continue
		}
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	return lo, hi
}

// buildDot composes a dot plot: one row per category (the first on top),
// the estimate as a dot and its interval as a whisker, composed from
// plotter.XErrorBars and plotter.Scatter, with the estimate written at the
// whisker's end. The value axis runs across and need not start at zero
// (dots encode position, not length).
func buildDot(s Spec) (*drawing, error) {
	n, k := len(s.Categories), len(s.Series)
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, ser := range s.Series {
		lo, hi = extend(lo, hi, ser.Values...)
		lo, hi = extend(lo, hi, ser.Low...)
		lo, hi = extend(lo, hi, ser.High...)
	}
	vr, err := valueRange(s, niceRange(lo, hi))
	if err != nil {
		return nil, err
	}
	vmin, vmax := vr.lo, vr.hi
	p := newPlot()
	labels := rowLabels(s.Categories, plotHeightEstimate(k > 1)/vg.Length(n))
	p.Y.Tick.Marker = categoryTicks(reversed(labels))
	p.Y.Label.Text = s.XLabel
	p.X.Tick.Marker = valueTicks{percent: s.Percent, step: vr.step}
	p.X.Label.Text = s.YLabel
	p.X.LineStyle = baseline
	grid := plotter.NewGrid()
	grid.Vertical = gridStyle
	grid.Horizontal = draw.LineStyle{Color: gridColor, Width: vg.Points(0.6), Dashes: []vg.Length{vg.Points(1), vg.Points(2)}}
	p.Add(grid)

	var all []float64
	for _, ser := range s.Series {
		all = append(all, ser.Values...)
		all = append(all, ser.Low...)
		all = append(all, ser.High...)
	}
	format := labelFormat(all, s.Percent)
	type placed struct{ x, y float64 }
	at := make([][]placed, k)
	var legend []legendEntry
	var ls valueLabels
	for j, ser := range s.Series {
		off := (float64(k-1)/2 - float64(j)) * 0.22
		xy := make(plotter.XYs, n)
		for i, v := range ser.Values {
			xy[i] = plotter.XY{X: v, Y: float64(n-1-i) + off}
			at[j] = append(at[j], placed{v, xy[i].Y})
		}
		end := ser.Values
		if len(ser.Low) == n {
			eb, err := plotter.NewXErrorBars(xErrs{xy: xy, lo: ser.Low, hi: ser.High})
			if err != nil {
				return nil, fmt.Errorf("figures: series %q: %w", ser.Name, err)
			}
			eb.LineStyle = draw.LineStyle{Color: seriesColor(j), Width: vg.Points(1.5)}
			eb.CapWidth = vg.Points(7)
			p.Add(eb)
			end = ser.High
		}
		sc, err := plotter.NewScatter(xy)
		if err != nil {
			return nil, fmt.Errorf("figures: series %q: %w", ser.Name, err)
		}
		sc.GlyphStyle = pointStyle(j)
		p.Add(sc)
		for i, v := range ser.Values {
			x := math.Min(end[i], vmax)
			ls = append(ls, valueLabel{x: x, y: xy[i].Y, dx: vg.Points(6), text: format(v),
				style: textStyle(sansRegular, valueSize, inkColor, draw.XLeft, draw.YCenter)})
		}
		if k > 1 {
			legend = append(legend, legendEntry{name: ser.Name, thumbs: []plot.Thumbnailer{sc}, width: vg.Points(10)})
		}
	}
	p.Add(ls)
	p.Y.Min, p.Y.Max = -0.5, float64(n)-0.5
	p.X.Min, p.X.Max = vmin, vmax

	d := &drawing{plot: p, legend: legend, horizontal: true}
	d.marks = func(c draw.Canvas, p *plot.Plot) []Mark {
		trX, trY := p.Transforms(&c)
		var marks []Mark
		for j, ser := range s.Series {
			for i, pt := range at[j] {
				marks = append(marks, Mark{Series: ser.Name, Category: s.Categories[i], Value: ser.Values[i],
					X: float64(trX(pt.x)), Y: float64(trY(pt.y))})
			}
		}
		return marks
	}
	what := orDefault(s.YLabel, "values")
	by := orDefault(s.XLabel, "category")
	d.title = capitalize(what + " by " + by)
	var parts []string
	for _, ser := range s.Series {
		for i, c := range s.Categories {
			name := c
			if k > 1 {
				name = c + " " + ser.Name
			}
			part := name + " " + format(ser.Values[i])
			if len(ser.Low) == n {
				part += " (" + format(ser.Low[i]) + " to " + format(ser.High[i]) + ")"
			}
			parts = append(parts, part)
		}
	}
	with := ""
	if len(s.Series[0].Low) == n {
		with = " with intervals"
	}
	d.desc = fmt.Sprintf("Dot plot of %s by %s%s: %s.", what, by, with, joinLimited(parts, ", ", listLimit))
	return d, nil
}

// buildScatter composes a scatter plot (plotter.Scatter) with the fitted
// line (plotter.Function) drawn over the x range of the points and a short
// label at its right end.
func buildScatter(s Spec) (*drawing, error) {
	xy := make(plotter.XYs, len(s.Points))
	xmin, xmax := math.Inf(1), math.Inf(-1)
	ylo, yhi := math.Inf(1), math.Inf(-1)
	for i, pt := range s.Points {
		xy[i] = plotter.XY{X: pt.X, Y: pt.Y}
		xmin, xmax = math.Min(xmin, pt.X), math.Max(xmax, pt.X)
		ylo, yhi = math.Min(ylo, pt.Y), math.Max(yhi, pt.Y)
	}
	fitAt := func(x float64) float64 { return s.Fit.Intercept + s.Fit.Slope*x }
	drawFit := s.Fit != nil && xmax > xmin
	if drawFit {
		ylo, yhi = extend(ylo, yhi, fitAt(xmin), fitAt(xmax))
	}
	xr := niceRange(xmin, xmax)
	vr, err := valueRange(s, niceRange(ylo, yhi))
	if err != nil {
		return nil, err
	}
	vmin, vmax := vr.lo, vr.hi

	p := newPlot()
	p.X.Tick.Marker = valueTicks{step: xr.step}
	p.X.Label.Text = s.XLabel
	p.X.LineStyle = baseline
	p.Y.Tick.Marker = valueTicks{percent: s.Percent, step: vr.step}
	p.Y.Label.Text = s.YLabel
	grid := plotter.NewGrid()
	grid.Vertical, grid.Horizontal = gridStyle, gridStyle
	p.Add(grid)

	if len(xy) > thinFrom {
		// Merge points that would share a cell half a point wide if the
		// data area took the whole canvas (the drawn area is smaller, so a
		// cell is about 0.6 drawn points): cheap, and it keeps the layout,
		// which measures every glyph, from walking all of them.
		xy = thinData(xy, xr.lo, xr.hi, vmin, vmax)
	}
	sc, err := plotter.NewScatter(xy)
	if err != nil {
		return nil, fmt.Errorf("figures: points: %w", err)
	}
	sc.GlyphStyle = draw.GlyphStyle{Color: withAlpha(seriesColor(0), 170), Radius: vg.Points(3.3), Shape: draw.CircleGlyph{}}
	p.Add(sc)
	fitInk := rgb(0xA8, 0x4A, 0x00) // vermillion, darkened for text
	if drawFit {
		f := plotter.NewFunction(fitAt)
		f.XMin, f.XMax = xmin, xmax
		f.Samples = 2
		f.LineStyle = draw.LineStyle{Color: seriesColor(3), Width: vg.Points(2)}
		p.Add(f)
	}
	p.X.Min, p.X.Max = xr.lo, xr.hi
	p.Y.Min, p.Y.Max = vmin, vmax

	d := &drawing{plot: p}
	drawn := s.Points
	d.layout = func(dataC draw.Canvas) {
		if len(s.Points) > thinFrom {
			drawn = thinPoints(pointsOf(sc.XYs), dataC, p)
			sc.XYs = make(plotter.XYs, len(drawn))
			for i, pt := range drawn {
				sc.XYs[i] = plotter.XY{X: pt.X, Y: pt.Y}
			}
		}
		if drawFit {
			if l, ok := fitLabel(s, dataC, p, xmin, xmax, fitInk); ok {
				p.Add(valueLabels{l})
			}
		}
	}
	d.marks = func(c draw.Canvas, p *plot.Plot) []Mark {
		trX, trY := p.Transforms(&c)
		marks := make([]Mark, len(drawn))
		for i, pt := range drawn {
			marks[i] = Mark{Value: pt.Y, X: float64(trX(pt.X)), Y: float64(trY(pt.Y))}
		}
		return marks
	}
	yv, xv := orDefault(s.YLabel, "y"), orDefault(s.XLabel, "x")
	d.title = capitalize(yv + " against " + xv)
	fit := ""
	if s.Fit != nil {
		fit = ", with the fitted line " + orDefault(s.Fit.Label,
			"y = "+formatValue(s.Fit.Intercept, false)+" + "+formatValue(s.Fit.Slope, false)+"·x")
	}
	d.desc = fmt.Sprintf("Scatter plot of %s against %s for %d points, %s from %s to %s and %s from %s to %s%s.",
		yv, xv, len(s.Points), xv, formatValue(xmin, false), formatValue(xmax, false),
		yv, formatValue(ylo0(s), s.Percent), formatValue(yhi0(s), s.Percent), fit)
	return d, nil
}

func pointsOf(xy plotter.XYs) []Point {
	out := make([]Point, len(xy))
	for i, p := range xy {
		out[i] = Point{X: p.X, Y: p.Y}
	}
	return out
}

// thinFrom is the number of points above which a scatter plot draws each
// half-point cell of the canvas once: points that close are drawn over each
// other anyway, and a million circles would make an SVG of a hundred
// megabytes that shows nothing more.
const thinFrom = 5000

// thinData keeps the first point (in the given order) of every cell of a
// grid over the axes' ranges twice as fine as the canvas in points: with
// glyphs 6.6 points wide, points that close cannot be told apart.
func thinData(xy plotter.XYs, xlo, xhi, ylo, yhi float64) plotter.XYs {
	nx, ny := 2*CanvasWidth, 2*CanvasHeight
	sx, sy := nx/(xhi-xlo), ny/(yhi-ylo)
	if !(sx > 0) || !(sy > 0) || math.IsInf(sx, 0) || math.IsInf(sy, 0) {
		return xy
	}
	type cell struct{ x, y int32 }
	seen := make(map[cell]bool, 1<<15)
	out := make(plotter.XYs, 0, 1<<15)
	for _, p := range xy {
		k := cell{int32(math.Floor((p.X - xlo) * sx)), int32(math.Floor((p.Y - ylo) * sy))}
		if seen[k] {
			continue
		}
		seen[k] = true
		out = append(out, p)
	}
	return out
}

// thinPoints keeps the first point (in the given order) of every cell half
// a point wide on the data canvas, which makes the drawing deterministic.
func thinPoints(pts []Point, c draw.Canvas, p *plot.Plot) []Point {
	trX, trY := p.Transforms(&c)
	type cell struct{ x, y int32 }
	seen := make(map[cell]bool, 1<<14)
	out := make([]Point, 0, 1<<14)
	for _, pt := range pts {
		k := cell{int32(math.Floor(float64(trX(pt.X)) * 2)), int32(math.Floor(float64(trY(pt.Y)) * 2))}
		if seen[k] {
			continue
		}
		seen[k] = true
		out = append(out, pt)
	}
	return out
}

// fitLabel places the short label of the fitted line beside one of its
// ends, on the side of the line away from it (above the right end or below
// the left end of a rising line; below the right end or above the left end
// of a falling one): of the two, the place that covers fewer points and
// stays in the data area. Fit.Label is used when it is short, else "fitted
// line".
func fitLabel(s Spec, c draw.Canvas, p *plot.Plot, xmin, xmax float64, ink color.Color) (valueLabel, bool) {
	trX, trY := p.Transforms(&c)
	fitAt := func(x float64) float64 { return s.Fit.Intercept + s.Fit.Slope*x }
	txt := "fitted line"
	probe := textStyle(sansRegular, valueSize, ink, draw.XLeft, draw.YBottom)
	if s.Fit.Label != "" && probe.Width(s.Fit.Label) <= vg.Points(210) {
		txt = s.Fit.Label
	}
	gap := vg.Points(6)
	rising := s.Fit.Slope >= 0
	type cand struct {
		x     float64
		xa    draw.XAlignment
		above bool
	}
	cands := []cand{{xmax, draw.XRight, rising}, {xmin, draw.XLeft, !rising}}
	best, bestCost := valueLabel{}, math.Inf(1)
	for _, cd := range cands {
		y := fitAt(cd.x)
		if y < p.Y.Min || y > p.Y.Max {
			continue
		}
		l := valueLabel{x: cd.x, y: y, text: txt, halo: true,
			style: textStyle(sansRegular, valueSize, ink, cd.xa, draw.YBottom)}
		l.dy = gap
		if !cd.above {
			l.style.YAlign = draw.YTop
			l.dy = -gap
		}
		pt := vg.Point{X: trX(l.x) + l.dx, Y: trY(l.y) + l.dy}
		r := l.style.Rectangle(l.text).Add(pt)
		cost := 0.0
		if r.Min.X < c.Min.X || r.Max.X > c.Max.X || r.Min.Y < c.Min.Y || r.Max.Y > c.Max.Y {
			cost += 1000
		}
		for _, q := range s.Points {
			x, y := trX(q.X), trY(q.Y)
			if x >= r.Min.X-4 && x <= r.Max.X+4 && y >= r.Min.Y-4 && y <= r.Max.Y+4 {
				cost++
			}
		}
		if cost < bestCost {
			best, bestCost = l, cost
		}
	}
	return best, !math.IsInf(bestCost, 1)
}

func ylo0(s Spec) float64 {
	lo := math.Inf(1)
	for _, p := range s.Points {
		lo = math.Min(lo, p.Y)
	}
	return lo
}

func yhi0(s Spec) float64 {
	hi := math.Inf(-1)
	for _, p := range s.Points {
		hi = math.Max(hi, p.Y)
	}
	return hi
}

// lineLabel places the value label of time point i off the line: above a
// peak or a flat stretch, below a trough, and where the line passes through
// the point, on the open side of the bend (above-left on a rise, above-right
// on a fall).
func lineLabel(vals []float64, i int, format func(float64) string) valueLabel {
	v := vals[i]
	known := func(j int) bool { return j >= 0 && j < len(vals) && !math.IsNaN(vals[j]) }
	up := func(j int) int { // +1 neighbour above, -1 below, 0 level or missing
		if !known(j) || vals[j] == v {
			return 0
		}
		if vals[j] > v {
			return 1
		}
		return -1
	}
	prev, next := up(i-1), up(i+1)
	gap := vg.Points(7)
	l := valueLabel{x: float64(i), y: v, text: format(v), dy: gap,
		style: textStyle(sansRegular, valueSize, inkColor, draw.XCenter, draw.YBottom)}
	switch {
	case prev >= 0 && next >= 0 && prev+next > 0: // a trough
		l.dy = -gap
		l.style.YAlign = draw.YTop
	case prev < 0 && next > 0: // rising through the point
		l.dx, l.dy = -vg.Points(4), vg.Points(4)
		l.style.XAlign = draw.XRight
	case prev > 0 && next < 0: // falling through the point
		l.dx, l.dy = vg.Points(4), vg.Points(4)
		l.style.XAlign = draw.XLeft
	}
	return l
}

// buildLine composes a line chart: one plotter.Line per series through its
// time points, every point marked (plotter.Scatter), intervals as
// plotter.YErrorBars when given. A missing value (NaN) breaks the line.
func buildLine(s Spec) (*drawing, error) {
	n, k := len(s.Categories), len(s.Series)
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, ser := range s.Series {
		lo, hi = extend(lo, hi, ser.Values...)
		lo, hi = extend(lo, hi, ser.Low...)
		lo, hi = extend(lo, hi, ser.High...)
	}
	vr, err := valueRange(s, niceRange(lo, hi))
	if err != nil {
		return nil, err
	}
	vmin, vmax := vr.lo, vr.hi
	p := newPlot()
	slot := plotWidthEstimate() / vg.Length(n)
	labels := slantLabels(p, s.Categories, slot)
	p.X.Tick.Marker = categoryTicks(labels)
	p.X.LineStyle = baseline
	p.X.Label.Text = s.XLabel
	p.Y.Tick.Marker = valueTicks{percent: s.Percent, step: vr.step}
	p.Y.Label.Text = s.YLabel
	grid := plotter.NewGrid()
	grid.Vertical.Color = nil
	grid.Horizontal = gridStyle
	p.Add(grid)

	var legend []legendEntry
	for j, ser := range s.Series {
		style := draw.LineStyle{Color: seriesColor(j), Width: vg.Points(2.2)}
		var run plotter.XYs
		var all plotter.XYs
		var lows, highs []float64
		flush := func() {
			if len(run) > 1 {
				l, _ := plotter.NewLine(run)
				l.LineStyle = style
				p.Add(l)
			}
			run = nil
		}
		for i, v := range ser.Values {
			if math.IsNaN(v) {
				flush()
				continue
			}
			pt := plotter.XY{X: float64(i), Y: v}
			run = append(run, pt)
			all = append(all, pt)
			if len(ser.Low) == n {
				lows, highs = append(lows, ser.Low[i]), append(highs, ser.High[i])
			}
		}
		flush()
		if len(all) == 0 {
			continue
		}
		if len(lows) == len(all) {
			eb, err := plotter.NewYErrorBars(yErrs{xy: all, lo: lows, hi: highs})
			if err != nil {
				return nil, fmt.Errorf("figures: series %q: %w", ser.Name, err)
			}
			eb.LineStyle = draw.LineStyle{Color: seriesColor(j), Width: vg.Points(1.2)}
			eb.CapWidth = vg.Points(6)
			p.Add(eb)
		}
		sc, err := plotter.NewScatter(all)
		if err != nil {
			return nil, fmt.Errorf("figures: series %q: %w", ser.Name, err)
		}
		sc.GlyphStyle = pointStyle(j)
		p.Add(sc)
		if k > 1 {
			thumb, _ := plotter.NewLine(plotter.XYs{{}, {}})
			thumb.LineStyle = style
			legend = append(legend, legendEntry{name: ser.Name, thumbs: []plot.Thumbnailer{thumb, sc}, width: vg.Points(18)})
		}
	}
	// Direct value labels for a single series, when they fit the slots:
	// above each point, below it at a local minimum.
	var all []float64
	for _, ser := range s.Series {
		all = append(all, ser.Values...)
	}
	format := labelFormat(all, s.Percent)
	if k == 1 {
		vals := s.Series[0].Values
		var ls valueLabels
		fits := true
		for i, v := range vals {
			if math.IsNaN(v) {
				continue
			}
			l := lineLabel(vals, i, format)
			if len(s.Series[0].High) == n {
				l = valueLabel{x: float64(i), y: s.Series[0].High[i], text: format(v), dy: vg.Points(6),
					style: textStyle(sansRegular, valueSize, inkColor, draw.XCenter, draw.YBottom)}
			}
			if l.style.Width(l.text) > slot*0.9 {
				fits = false
			}
			ls = append(ls, l)
		}
		if fits && len(ls) > 0 {
			p.Add(ls)
		}
	}
	p.X.Min, p.X.Max = -0.5, float64(n)-0.5
	p.Y.Min, p.Y.Max = vmin, vmax

	d := &drawing{plot: p, legend: legend}
	d.marks = func(c draw.Canvas, p *plot.Plot) []Mark {
		trX, trY := p.Transforms(&c)
		var marks []Mark
		for _, ser := range s.Series {
			for i, v := range ser.Values {
				if math.IsNaN(v) {
					continue
				}
				marks = append(marks, Mark{Series: ser.Name, Category: s.Categories[i], Value: v,
					X: float64(trX(float64(i))), Y: float64(trY(v))})
			}
		}
		return marks
	}
	what := orDefault(s.YLabel, "values")
	over := orDefault(s.XLabel, "time")
	d.title = capitalize(what + " over " + over)
	var parts []string
	if k == 1 {
		for i, c := range s.Categories {
			if v := s.Series[0].Values[i]; !math.IsNaN(v) {
				parts = append(parts, c+" "+format(v))
			}
		}
		d.desc = fmt.Sprintf("Line chart of %s over %s: %s.", what, over, joinLimited(parts, ", ", listLimit))
		return d, nil
	}
	for _, ser := range s.Series {
		first, last := -1, -1
		for i, v := range ser.Values {
			if !math.IsNaN(v) {
				if first < 0 {
					first = i
				}
				last = i
			}
		}
		if first < 0 {
			continue
		}
		parts = append(parts, fmt.Sprintf("%s from %s in %s to %s in %s", orDefault(ser.Name, "series"),
			format(ser.Values[first]), s.Categories[first],
			format(ser.Values[last]), s.Categories[last]))
	}
	d.desc = fmt.Sprintf("Line chart of %s over %s: %s.", what, over, strings.Join(parts, "; "))
	return d, nil
}
