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

// Bar widths as fractions of a category's slot, and their caps in points.
const (
	barFill     = 0.62 // a single bar per category: 38% of the slot is gap
	groupFill   = 0.80 // a group of side-by-side bars
	maxBarWidth = 72.0
	maxGroup    = 150.0
	groupGap    = 1.5 // white space between the bars of one group
)

// categoryAxes sets up a chart with categories along one axis and values
// along the other: nominal category ticks (wrapped, or rows when
// horizontal), the category baseline, value ticks and the light grid. It
// returns the category positions (the first category leftmost or on top).
func categoryAxes(p *plot.Plot, s Spec, horizontal bool, vr axisRange, legend bool) []float64 {
	n := len(s.Categories)
	pos := make([]float64, n)
	grid := plotter.NewGrid()
	if !horizontal {
		labels, _ := categoryLabels(s.Categories, plotWidthEstimate()/vg.Length(n))
		for i := range pos {
			pos[i] = float64(i)
		}
		p.X.Tick.Marker = categoryTicks(labels)
		p.X.LineStyle = baseline
		p.X.Label.Text = s.XLabel
		p.Y.Tick.Marker = valueTicks{percent: s.Percent, step: vr.step}
		p.Y.Label.Text = s.YLabel
		grid.Vertical.Color = nil
		grid.Horizontal = gridStyle
	} else {
		labels := rowLabels(s.Categories, plotHeightEstimate(legend)/vg.Length(n))
		for i := range pos {
			pos[i] = float64(n - 1 - i)
		}
		p.Y.Tick.Marker = categoryTicks(reversed(labels))
		p.Y.LineStyle = baseline
		p.Y.Label.Text = s.XLabel
		p.X.Tick.Marker = valueTicks{percent: s.Percent, step: vr.step}
		p.X.Label.Text = s.YLabel
		grid.Horizontal.Color = nil
		grid.Vertical = gridStyle
	}
	p.Add(grid)
	return pos
}

// setRanges fixes the axes after the plotters were added (plot.Add widens
// them to the data).
func setRanges(p *plot.Plot, horizontal bool, n int, vmin, vmax float64) {
	cat, val := &p.X, &p.Y
	if horizontal {
		cat, val = &p.Y, &p.X
	}
	cat.Min, cat.Max = -0.5, float64(n)-0.5
	val.Min, val.Max = vmin, vmax
}

// wantHorizontal decides the orientation of category bars: horizontal when
// some category label does not fit under its bar even on two lines.
func wantHorizontal(s Spec) bool {
	_, fits := categoryLabels(s.Categories, plotWidthEstimate()/vg.Length(len(s.Categories)))
	return !fits
}

// buildBars composes a bar chart (one series) or grouped bars (side by side,
// one bar per series in each category) from plotter.BarChart.
func buildBars(s Spec) (*drawing, error) {
	n, k := len(s.Categories), len(s.Series)
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, ser := range s.Series {
		for _, v := range ser.Values {
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
	}
	vr, err := valueRange(s, zeroRange(lo, hi))
	if err != nil {
		return nil, err
	}
	vmin, vmax := vr.lo, vr.hi
	horizontal := wantHorizontal(s)
	p := newPlot()
	pos := categoryAxes(p, s, horizontal, vr, k > 1)
	var all []float64
	for _, ser := range s.Series {
		all = append(all, ser.Values...)
	}
	format := labelFormat(all, s.Percent)

	bars := make([]*plotter.BarChart, k)
	var legend []legendEntry
	for j, ser := range s.Series {
		vals := plotter.Values(ser.Values)
		if horizontal {
			vals = reversed(ser.Values)
		}
		bc, err := plotter.NewBarChart(vals, 1)
		if err != nil {
			return nil, fmt.Errorf("figures: series %q: %w", ser.Name, err)
		}
		bc.Color = seriesColor(j)
		bc.LineStyle.Width = 0
		bc.Horizontal = horizontal
		bars[j] = bc
		p.Add(bc)
		if k > 1 {
			legend = append(legend, legendEntry{name: ser.Name, thumbs: []plot.Thumbnailer{swatch{draw.LineStyle{Color: bc.Color}}}, width: vg.Points(9)})
		}
	}
	if vmin < 0 && vmax > 0 {
		p.Add(refLine{value: 0, horizontal: horizontal, style: baseline})
	}
	setRanges(p, horizontal, n, vmin, vmax)

	d := &drawing{plot: p, legend: legend, horizontal: horizontal, lie: true}
	d.layout = func(dataC draw.Canvas) {
		slot := (dataC.Max.X - dataC.Min.X) / vg.Length(n)
		if horizontal {
			slot = (dataC.Max.Y - dataC.Min.Y) / vg.Length(n)
		}
		group := slot * barFill
		if k > 1 {
			group = vg.Length(math.Min(float64(slot*groupFill), maxGroup))
		} else {
			group = vg.Length(math.Min(float64(group), maxBarWidth))
		}
		bw := group / vg.Length(k)
		for j, bc := range bars {
			off := (vg.Length(j) - vg.Length(k-1)/2) * bw
			if horizontal {
				off = -off
			}
			bc.Offset = off
			bc.Width = bw
			if k > 1 {
				bc.Width = bw - groupGap
			}
		}
		// Intervals as whiskers on the bars, where given.
		for j, ser := range s.Series {
			if len(ser.Low) != n {
				continue
			}
			off := float64(bars[j].Offset / slot)
			xy := make(plotter.XYs, n)
			for i, v := range ser.Values {
				xy[i] = plotter.XY{X: pos[i] + off, Y: v}
				if horizontal {
					xy[i] = plotter.XY{X: v, Y: pos[i] + off}
				}
			}
			style := draw.LineStyle{Color: titleColor, Width: vg.Points(1.1)}
			capW := vg.Length(math.Min(float64(bw*0.4), 8))
			if horizontal {
				eb, err := plotter.NewXErrorBars(xErrs{xy: xy, lo: ser.Low, hi: ser.High})
				if err == nil {
					eb.LineStyle, eb.CapWidth = style, capW
					p.Add(eb)
				}
			} else {
				eb, err := plotter.NewYErrorBars(yErrs{xy: xy, lo: ser.Low, hi: ser.High})
				if err == nil {
					eb.LineStyle, eb.CapWidth = style, capW
					p.Add(eb)
				}
			}
		}
		// Direct labels, when every one of them fits its bar.
		var ls valueLabels
		fits := true
		for j, ser := range s.Series {
			for i, v := range ser.Values {
				reach := v
				if len(ser.Low) == n {
					reach = ser.High[i]
					if v < 0 {
						reach = ser.Low[i]
					}
				}
				l := barLabel(pos[i], bars[j].Offset, v, reach, vmin, vmax, horizontal, bars[j].Color, format)
				w, h := l.style.Width(l.text), l.style.Height(l.text)
				room := bw
				if k == 1 {
					room = slot * 0.96
				}
				if (!horizontal && w > room) || (horizontal && h > room+1) {
					fits = false
				}
				ls = append(ls, l)
			}
		}
		if fits {
			p.Add(ls)
		}
	}
	d.marks = func(c draw.Canvas, p *plot.Plot) []Mark {
		var marks []Mark
		for j, ser := range s.Series {
			for i, v := range ser.Values {
				marks = append(marks, barMark(c, p, horizontal, pos[i], bars[j], 0, v, ser.Name, s.Categories[i]))
			}
		}
		return marks
	}
	what := orDefault(s.YLabel, "values")
	by := orDefault(s.XLabel, "category")
	if s.Kind == Bar {
		d.title = capitalize(what + " by " + by)
		d.desc = fmt.Sprintf("Bar chart of %s by %s: %s.", what, by, listValues(s.Categories, s.Series[0].Values, format))
	} else {
		d.title = capitalize(what + " by " + by + " and " + seriesWord(s))
		d.desc = fmt.Sprintf("Grouped bar chart of %s by %s and %s: %s.", what, by, seriesWord(s), listGroups(s, "; ", format))
	}
	return d, nil
}

// barMark is the mark of one bar of the value v standing on base (zero, or
// the top of the segment below), as it was drawn: the bar is clipped to the
// data area.
func barMark(c draw.Canvas, p *plot.Plot, horizontal bool, pos float64, bc *plotter.BarChart, base, v float64, series, cat string) Mark {
	trX, trY := p.Transforms(&c)
	trCat, trVal := trX, trY
	cmin, cmax := c.Min.Y, c.Max.Y
	if horizontal {
		trCat, trVal = trY, trX
		cmin, cmax = c.Min.X, c.Max.X
	}
	center := trCat(pos) + bc.Offset
	v0 := clampLen(trVal(base), cmin, cmax)
	v1 := clampLen(trVal(base+v), cmin, cmax)
	m := Mark{Series: series, Category: cat, Value: v, Length: math.Abs(float64(v1 - v0))}
	if horizontal {
		m.X, m.Y = float64(v1), float64(center)
		m.Rect = toRect(v0, center-bc.Width/2, v1, center+bc.Width/2)
	} else {
		m.X, m.Y = float64(center), float64(v1)
		m.Rect = toRect(center-bc.Width/2, v0, center+bc.Width/2, v1)
	}
	return m
}

// barLabel places the direct label of a bar of the value v: beyond the
// bar's end; inside its end, in a contrasting colour, when the axis cuts the
// bar off; at the axis end, pointing inwards, when the bar is not drawn at
// all.
//
// reach is where the label goes when the bar is drawn whole: its end, or
// the far end of its whisker.
func barLabel(pos float64, off vg.Length, v, reach, vmin, vmax float64, horizontal bool, fill color.Color, format func(float64) string) valueLabel {
	l := valueLabel{text: format(v)}
	lo := math.Max(math.Min(0, v), vmin)
	hi := math.Min(math.Max(0, v), vmax)
	visible := hi > lo
	at, out, clr := v, 1.0, color.Color(inkColor) // out: +1 beyond the end, -1 inside it
	switch {
	case !visible && v < vmin:
		at, out = vmin, 1
	case !visible:
		at, out = vmax, -1
	case v > vmax:
		at, out, clr = vmax, -1, labelOn(fill)
	case v < vmin:
		at, out, clr = vmin, 1, labelOn(fill)
	case v < 0:
		at, out = math.Max(reach, vmin), -1
	default:
		at = math.Min(reach, vmax)
	}
	const gap = 3
	if horizontal {
		l.x, l.y, l.dy = at, pos, off
		l.dx = vg.Points(gap * out)
		xa := draw.XLeft
		if out < 0 {
			xa = draw.XRight
		}
		l.style = textStyle(sansRegular, valueSize, clr, xa, draw.YCenter)
		return l
	}
	l.x, l.y, l.dx = pos, at, off
	l.dy = vg.Points(gap * out)
	ya := draw.YBottom
	if out < 0 {
		ya = draw.YTop
	}
	l.style = textStyle(sansRegular, valueSize, clr, draw.XCenter, ya)
	return l
}

// buildHistogram composes a histogram from plotter.Histogram: bins touch,
// the count axis starts at zero.
func buildHistogram(s Spec) (*drawing, error) {
	hb := make([]plotter.HistogramBin, len(s.Bins))
	top := 0.0
	for i, b := range s.Bins {
		hb[i] = plotter.HistogramBin{Min: b.Lo, Max: b.Hi, Weight: b.Value}
		top = math.Max(top, b.Value)
	}
	vr, err := valueRange(s, zeroRange(0, top))
	if err != nil {
		return nil, err
	}
	vmin, vmax := vr.lo, vr.hi
	xlo, xhi := s.Bins[0].Lo, s.Bins[len(s.Bins)-1].Hi

	p := newPlot()
	grid := plotter.NewGrid()
	grid.Vertical.Color = nil
	grid.Horizontal = gridStyle
	p.Add(grid)
	h := &plotter.Histogram{
		Bins:      hb,
		FillColor: seriesColor(0),
		LineStyle: draw.LineStyle{Color: rgb(0x00, 0x4E, 0x7A), Width: vg.Points(0.6)},
	}
	p.Add(h)

	// Bin edges as x ticks when every label fits its bin, else nice ticks.
	dataW := plotWidthEstimate()
	tickSty := p.X.Tick.Label
	edges := make([]float64, 0, len(s.Bins)+1)
	for i, b := range s.Bins {
		if i == 0 || b.Lo != s.Bins[i-1].Hi {
			edges = append(edges, b.Lo)
		}
		edges = append(edges, b.Hi)
	}
	edgeFit := len(edges) <= 16
	for i := 1; i < len(edges) && edgeFit; i++ {
		gapW := dataW * vg.Length((edges[i]-edges[i-1])/(xhi-xlo))
		w := (tickSty.Width(formatValue(edges[i], false)) + tickSty.Width(formatValue(edges[i-1], false))) / 2
		if w > gapW*0.9 {
			edgeFit = false
		}
	}
	if len(s.Categories) == len(s.Bins) {
		// Bins that stand for categories (a histogram drawn of categorical
		// data, which the checker flags): each bin is labelled at its middle.
		ts := make(plot.ConstantTicks, len(s.Bins))
		for i, b := range s.Bins {
			ts[i] = plot.Tick{Value: (b.Lo + b.Hi) / 2, Label: s.Categories[i]}
		}
		p.X.Tick.Marker = ts
	} else if edgeFit {
		ts := make(plot.ConstantTicks, len(edges))
		for i, e := range edges {
			ts[i] = plot.Tick{Value: e, Label: formatValue(e, false)}
		}
		p.X.Tick.Marker = ts
	} else {
		p.X.Tick.Marker = valueTicks{}
	}
	p.X.LineStyle = baseline
	p.X.Label.Text = s.XLabel
	p.Y.Tick.Marker = valueTicks{percent: s.Percent, step: vr.step}
	ylabel := s.YLabel
	if ylabel == "" {
		ylabel = "Count"
		if s.Percent {
			ylabel = "Percent"
		}
	}
	p.Y.Label.Text = ylabel

	// Count labels above the bins, when every one fits its bin.
	var ls valueLabels
	fits := true
	counts := make([]float64, len(s.Bins))
	for i, b := range s.Bins {
		counts[i] = b.Value
	}
	format := labelFormat(counts, s.Percent)
	for _, b := range s.Bins {
		l := barLabel((b.Lo+b.Hi)/2, 0, b.Value, b.Value, vmin, vmax, false, seriesColor(0), format)
		if l.style.Width(l.text) > dataW*vg.Length((b.Hi-b.Lo)/(xhi-xlo))*0.95 {
			fits = false
		}
		ls = append(ls, l)
	}
	if fits {
		p.Add(ls)
	}
	p.X.Min, p.X.Max = xlo, xhi
	p.Y.Min, p.Y.Max = vmin, vmax

	d := &drawing{plot: p, lie: true}
	d.marks = func(c draw.Canvas, p *plot.Plot) []Mark {
		trX, trY := p.Transforms(&c)
		marks := make([]Mark, len(s.Bins))
		for i, b := range s.Bins {
			// plotter.Histogram draws a bin from the bottom of the data
			// area to its count, clipped to the area.
			y0 := c.Min.Y
			y1 := clampLen(trY(b.Value), c.Min.Y, c.Max.Y)
			if b.Value == 0 {
				y1 = y0
			}
			x0, x1 := trX(b.Lo), trX(b.Hi)
			marks[i] = Mark{
				Category: binLabel(b), Value: b.Value, Length: float64(y1 - y0),
				X: float64(x0+x1) / 2, Y: float64(y1), Rect: toRect(x0, y0, x1, y1),
			}
		}
		return marks
	}
	of := orDefault(s.XLabel, "values")
	d.title = capitalize("distribution of " + of)
	total := 0.0
	big := 0
	for i, b := range s.Bins {
		total += b.Value
		if b.Value > s.Bins[big].Value {
			big = i
		}
	}
	count := formatValue(total, false) + " values"
	if s.Percent {
		count = "100% of values"
	}
	d.desc = fmt.Sprintf("Histogram of %s: %s in %d bins from %s to %s; the largest bin, %s, holds %s.",
		of, count, len(s.Bins), formatValue(xlo, false), formatValue(xhi, false),
		binLabel(s.Bins[big]), formatValue(s.Bins[big].Value, s.Percent))
	return d, nil
}

// binLabel names a bin by its edges, "20–30".
func binLabel(b Bin) string {
	return formatValue(b.Lo, false) + "–" + formatValue(b.Hi, false)
}

// shareBars draws 100% stacked bars: each category's values as shares of
// their sum, stacked in series order from the baseline (bottom, or left
// when horizontal), with direct percent labels inside the segments that
// have room. plotter.BarChart can stack but not normalise.
type shareBars struct {
	shares     [][]float64 // [category][series], percent of the category's sum
	pos        []float64   // category positions
	colors     []color.Color
	horizontal bool
	width      vg.Length // bar thickness, set by layout
	labels     bool
}

// segment is the drawn extent of one stack segment.
type segment struct {
	x0, y0, x1, y1 vg.Length
	length         vg.Length
}

func (sb *shareBars) segments(c draw.Canvas, p *plot.Plot) [][]segment {
	trX, trY := p.Transforms(&c)
	out := make([][]segment, len(sb.shares))
	for i, row := range sb.shares {
		cum := 0.0
		out[i] = make([]segment, len(row))
		for j, sh := range row {
			lo, hi := cum, cum+sh
			cum = hi
			if sb.horizontal {
				yc := trY(sb.pos[i])
				x0 := clampLen(trX(lo), c.Min.X, c.Max.X)
				x1 := clampLen(trX(hi), c.Min.X, c.Max.X)
				out[i][j] = segment{x0, yc - sb.width/2, x1, yc + sb.width/2, x1 - x0}
			} else {
				xc := trX(sb.pos[i])
				y0 := clampLen(trY(lo), c.Min.Y, c.Max.Y)
				y1 := clampLen(trY(hi), c.Min.Y, c.Max.Y)
				out[i][j] = segment{xc - sb.width/2, y0, xc + sb.width/2, y1, y1 - y0}
			}
		}
	}
	return out
}

func (sb *shareBars) Plot(c draw.Canvas, p *plot.Plot) {
	segs := sb.segments(c, p)
	sep := draw.LineStyle{Color: white, Width: vg.Points(1)}
	for i, row := range segs {
		for j, sg := range row {
			if sg.length <= 0 {
				continue
			}
			fillRect(&c, sb.colors[j], sg.x0, sg.y0, sg.x1, sg.y1)
			if j > 0 && sb.shares[i][j] > 0 {
				if sb.horizontal {
					c.StrokeLine2(sep, sg.x0, sg.y0, sg.x0, sg.y1)
				} else {
					c.StrokeLine2(sep, sg.x0, sg.y0, sg.x1, sg.y0)
				}
			}
		}
	}
	if !sb.labels {
		return
	}
	for i, row := range segs {
		for j, sg := range row {
			txt := formatValue(sb.shares[i][j], true)
			sty := textStyle(sansRegular, valueSize, labelOn(sb.colors[j]), draw.XCenter, draw.YCenter)
			w, h := sty.Width(txt), sty.Height(txt)
			if sg.length <= 0 || (sb.horizontal && (sg.length < w+6 || sb.width < h+2)) ||
				(!sb.horizontal && (sg.length < h+4 || sb.width < w+4)) {
				continue
			}
			c.FillText(sty, vg.Point{X: (sg.x0 + sg.x1) / 2, Y: (sg.y0 + sg.y1) / 2}, txt)
		}
	}
}

// DataRange implements plot.DataRanger.
func (sb *shareBars) DataRange() (xmin, xmax, ymin, ymax float64) {
	n := float64(len(sb.shares))
	if sb.horizontal {
		return 0, 100, -0.5, n - 0.5
	}
	return -0.5, n - 0.5, 0, 100
}

// buildStacked composes 100% stacked bars: one bar per category, one
// segment per series.
func buildStacked(s Spec) (*drawing, error) {
	n, k := len(s.Categories), len(s.Series)
	sp := s
	sp.Percent = false // the share axis is 0–100 by itself
	vr, err := valueRange(sp, axisRange{0, 100, 20})
	if err != nil {
		return nil, err
	}
	vmin, vmax := vr.lo, vr.hi
	sp.Percent = true
	horizontal := wantHorizontal(s)
	p := newPlot()
	pos := categoryAxes(p, sp, horizontal, vr, k > 1)
	if s.YLabel == "" {
		if horizontal {
			p.X.Label.Text = "Share (%)"
		} else {
			p.Y.Label.Text = "Share (%)"
		}
	}
	shares := make([][]float64, n)
	for i := range shares {
		sum := 0.0
		for _, ser := range s.Series {
			sum += ser.Values[i]
		}
		shares[i] = make([]float64, k)
		for j, ser := range s.Series {
			if sum > 0 {
				shares[i][j] = ser.Values[i] / sum * 100
			}
		}
	}
	sb := &shareBars{shares: shares, pos: pos, horizontal: horizontal, labels: true}
	var legend []legendEntry
	for j, ser := range s.Series {
		sb.colors = append(sb.colors, seriesColor(j))
		legend = append(legend, legendEntry{name: ser.Name, thumbs: []plot.Thumbnailer{swatch{draw.LineStyle{Color: seriesColor(j)}}}, width: vg.Points(9)})
	}
	if k < 2 {
		legend = nil
	}
	p.Add(sb)
	setRanges(p, horizontal, n, vmin, vmax)

	d := &drawing{plot: p, legend: legend, horizontal: horizontal, lie: true}
	d.layout = func(dataC draw.Canvas) {
		slot := (dataC.Max.X - dataC.Min.X) / vg.Length(n)
		if horizontal {
			slot = (dataC.Max.Y - dataC.Min.Y) / vg.Length(n)
		}
		sb.width = vg.Length(math.Min(float64(slot*barFill), maxBarWidth))
	}
	d.marks = func(c draw.Canvas, p *plot.Plot) []Mark {
		segs := sb.segments(c, p)
		var marks []Mark
		for i, row := range segs {
			for j, sg := range row {
				m := Mark{Series: s.Series[j].Name, Category: s.Categories[i], Value: shares[i][j],
					Length: math.Abs(float64(sg.length)), Rect: toRect(sg.x0, sg.y0, sg.x1, sg.y1)}
				if horizontal {
					m.X, m.Y = float64(sg.x1), float64(sg.y0+sg.y1)/2
				} else {
					m.X, m.Y = float64(sg.x0+sg.x1)/2, float64(sg.y1)
				}
				marks = append(marks, m)
			}
		}
		return marks
	}
	by := orDefault(s.XLabel, "category")
	d.title = capitalize(seriesWord(s) + " by " + by)
	var parts []string
	for i, c := range s.Categories {
		var seg []string
		for j, ser := range s.Series {
			seg = append(seg, ser.Name+" "+formatValue(shares[i][j], true))
		}
		parts = append(parts, c+": "+strings.Join(seg, ", "))
	}
	d.desc = fmt.Sprintf("100%% stacked bar chart of %s by %s: %s.", seriesWord(s), by, joinLimited(parts, "; ", 8))
	return d, nil
}

// orDefault returns s, or def when s is empty.
func orDefault(s, def string) string {
	if strings.TrimSpace(s) == "" {
		return def
	}
	return s
}
