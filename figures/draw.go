package figures

import (
	"bytes"
	"fmt"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgsvg"
)

// drawing is a chart composed but not yet drawn: a plot.Plot with its
// plotters, the legend, and how to read back what was drawn.
type drawing struct {
	plot   *plot.Plot
	legend []legendEntry
	// horizontal: the value axis runs across (horizontal bars, dot plots).
	horizontal bool
	// noAxis: the figure has no value axis (stemleaf).
	noAxis bool
	// layout, when set, sizes what depends on the data area (bar widths)
	// before the plot is drawn; it may add plotters (labels).
	layout func(dataC draw.Canvas)
	// marks reads back the marks drawn on the data canvas c.
	marks func(c draw.Canvas, p *plot.Plot) []Mark
	// lie: Tufte's lie factor applies (bars, bins, stack segments, slices).
	lie bool
	// axisMin, axisMax override the value range read from the plot (pie).
	axisMin, axisMax *float64
	title, desc      string // generated title and summary
}

// Draw draws the chart that s describes as one self-contained SVG element
// and records what it drew.
//
// The SVG is deterministic: the same spec gives the same bytes, with fixed
// number formatting, no random ids and no map order. Its root has
// role="img", a viewBox, width="100%" and aria-labelledby naming its
// <title> (Spec.Title, or one made from the labels) and <desc> (Spec.Desc,
// or a sentence with the key numbers). Every chart is drawn on the same
// canvas (CanvasWidth × CanvasHeight points) in the same type and colours
// (Palette).
//
// Honest defaults: the value axis of bars, grouped bars, histograms and
// stacks starts at zero; a percent axis runs 0–100; Spec.AxisMin and
// Spec.AxisMax, when set, are honoured exactly (and the start of a cut-off
// axis is labelled). Category bars have gaps, histogram bins touch, a line
// chart marks every time point. Category labels that do not fit under
// vertical bars even on two lines turn bars, grouped bars and stacks
// horizontal; under a line chart or boxes they slant instead.
//
// Geometry holds the canvas, the data area, the value axis as drawn and one
// Mark per drawn bar, bin, segment, slice, box or point. Its lie factor
// (Tufte 1983, The Visual Display of Quantitative Information, p. 57: the
// size of the effect shown in the graphic divided by the size of the effect
// in the data, an effect being (later − earlier)/earlier) is computed from
// the marks:
//
//   - bar, grouped, histogram: among the marks with a positive data value,
//     the smallest value a and the largest b, with their drawn lengths la
//     and lb (the visible extent of the bar along the value axis, from zero
//     or, on a cut-off axis, from the axis start); lie factor
//     ((lb − la)/la) / ((b − a)/a). On ties the shortest drawn mark of the
//     smallest value and the longest of the largest are taken, so a
//     distortion is never hidden.
//   - stacked: the same over the stack segments, each a share (percent of
//     its bar) with the segment's drawn length.
//   - pie: an area chart whose slices' areas are proportional to their
//     sweep angles; the same formula with the sweep angle (degrees) as the
//     drawn length. Draw keeps angles proportional, so it is 1.
//   - HasLie is false where it does not apply: dot, scatter, line, box and
//     stemleaf (marks without extent), and charts with fewer than two
//     distinct positive values. When the smaller mark is not drawn at all
//     (the axis starts at or above its value) the lie factor is +Inf.
//
// A bad spec (no categories, lengths that do not match, an unknown kind,
// values that are not finite) returns an error and never panics.
func Draw(s Spec) (fig Figure, err error) {
	defer func() {
		if r := recover(); r != nil {
			fig = Figure{}
			err = fmt.Errorf("figures: internal error drawing the %s chart: %v", s.Kind, r)
		}
	}()
	if err := validate(s); err != nil {
		return Figure{}, err
	}
	d, err := build(s)
	if err != nil {
		return Figure{}, err
	}

	w, h := vg.Points(CanvasWidth), vg.Points(CanvasHeight)
	canvas := vgsvg.New(w, h)
	dc := draw.New(canvas)
	area := drawFrame(dc, s.Title, d.legend)
	if d.layout != nil {
		d.layout(d.plot.DataCanvas(area))
	}
	pr := &probe{}
	d.plot.Add(pr)
	d.plot.Draw(area)
	if !pr.ok {
		return Figure{}, fmt.Errorf("figures: the %s chart drew no data area", s.Kind)
	}

	g := Geometry{
		Kind:       s.Kind,
		Width:      CanvasWidth,
		Height:     CanvasHeight,
		Plot:       toRect(pr.c.Min.X, pr.c.Min.Y, pr.c.Max.X, pr.c.Max.Y),
		HasAxis:    !d.noAxis,
		Horizontal: d.horizontal,
	}
	if !d.noAxis {
		a := d.plot.Y
		if d.horizontal {
			a = d.plot.X
		}
		g.AxisMin, g.AxisMax = a.Min, a.Max
		if d.axisMin != nil {
			g.AxisMin = *d.axisMin
		}
		if d.axisMax != nil {
			g.AxisMax = *d.axisMax
		}
	}
	if d.marks != nil {
		g.Marks = d.marks(pr.c, d.plot)
	}
	if d.lie {
		g.LieFactor, g.HasLie = LieFactor(g.Marks)
	}

	var raw bytes.Buffer
	if _, err := canvas.WriteTo(&raw); err != nil {
		return Figure{}, fmt.Errorf("figures: writing the SVG: %w", err)
	}
	title := s.Title
	if title == "" {
		title = d.title
	}
	desc := s.Desc
	if desc == "" {
		desc = d.desc
	}
	svg, err := finishSVG(raw.Bytes(), s.ID, title, desc)
	if err != nil {
		return Figure{}, err
	}
	return Figure{SVG: svg, Desc: desc, Geometry: g}, nil
}

// LieFactor computes Tufte's lie factor from drawn marks, as Draw's doc
// comment defines it: the effect shown, (lb − la)/la, over the effect in the
// data, (b − a)/a, for the smallest positive value a and the largest b. It
// reports false when fewer than two distinct positive values were drawn.
func LieFactor(marks []Mark) (float64, bool) {
	lo, hi := -1, -1
	for i, m := range marks {
		if !(m.Value > 0) || math.IsInf(m.Value, 0) {
			continue
		}
		if lo < 0 || m.Value < marks[lo].Value || (m.Value == marks[lo].Value && m.Length < marks[lo].Length) {
			lo = i
		}
		if hi < 0 || m.Value > marks[hi].Value || (m.Value == marks[hi].Value && m.Length > marks[hi].Length) {
			hi = i
		}
	}
	if lo < 0 || marks[lo].Value == marks[hi].Value {
		return 0, false
	}
	a, b := marks[lo], marks[hi]
	data := (b.Value - a.Value) / a.Value
	if a.Length <= 0 {
		return math.Inf(1), true
	}
	shown := (b.Length - a.Length) / a.Length
	return shown / data, true
}

// build composes the chart of s.
func build(s Spec) (*drawing, error) {
	switch s.Kind {
	case Bar, Grouped:
		return buildBars(s)
	case Histogram:
		return buildHistogram(s)
	case Stacked:
		return buildStacked(s)
	case Dot:
		return buildDot(s)
	case Pie:
		return buildPie(s)
	case Scatter:
		return buildScatter(s)
	case Line:
		return buildLine(s)
	case Box:
		return buildBox(s)
	case StemLeaf:
		return buildStemLeaf(s)
	}
	return nil, fmt.Errorf("figures: unknown chart kind %q; use one of %v", s.Kind, Kinds)
}

// valueRange is the value axis range: Spec.AxisMin and Spec.AxisMax where
// given, else 0–100 for percentages, else the chart's default.
func valueRange(s Spec, def axisRange) (axisRange, error) {
	r := def
	if s.Percent {
		r = axisRange{0, 100, 20}
	}
	if s.AxisMin != nil {
		r.lo, r.step = *s.AxisMin, 0
	}
	if s.AxisMax != nil {
		r.hi, r.step = *s.AxisMax, 0
	}
	if !(r.lo < r.hi) {
		return axisRange{}, fmt.Errorf("figures: the value axis would run from %g to %g; give an axis max above its min", r.lo, r.hi)
	}
	return r, nil
}
