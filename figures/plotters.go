package figures

import (
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// probe is a plotter that draws nothing: added last, it keeps the data
// canvas that plot.Plot hands its plotters, so that the geometry is
// computed on exactly the area the marks were drawn in.
type probe struct {
	c  draw.Canvas
	ok bool
}

func (pr *probe) Plot(c draw.Canvas, _ *plot.Plot) { pr.c, pr.ok = c, true }

// valueLabel is one direct label, anchored at a data point and moved by an
// offset in canvas units.
type valueLabel struct {
	x, y   float64
	dx, dy vg.Length
	text   string
	style  text.Style
	halo   bool // a white backing keeps the label legible over marks
}

// valueLabels draws direct labels. Unlike plotter.Labels each label has its
// own offset and style; its glyph boxes make plot.Plot leave room for labels
// that reach past the data area.
type valueLabels []valueLabel

func (ls valueLabels) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	for _, l := range ls {
		pt := vg.Point{X: trX(l.x) + l.dx, Y: trY(l.y) + l.dy}
		if l.halo {
			r := l.style.Rectangle(l.text).Add(pt)
			pad := vg.Points(2)
			fillRect(&c, withAlpha(white, 215), r.Min.X-pad, r.Min.Y, r.Max.X+pad, r.Max.Y)
		}
		c.FillText(l.style, pt, l.text)
	}
}

func (ls valueLabels) GlyphBoxes(p *plot.Plot) []plot.GlyphBox {
	bs := make([]plot.GlyphBox, 0, len(ls))
	for _, l := range ls {
		bs = append(bs, plot.GlyphBox{
			X:         p.X.Norm(l.x),
			Y:         p.Y.Norm(l.y),
			Rectangle: l.style.Rectangle(l.text).Add(vg.Point{X: l.dx, Y: l.dy}),
		})
	}
	return bs
}

// refLine draws a reference line across the data area at a value of the
// value axis (the zero line of bars that go below zero).
type refLine struct {
	value      float64
	horizontal bool // the value axis runs across
	style      draw.LineStyle
}

func (r refLine) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	if r.horizontal {
		x := trX(r.value)
		if c.ContainsX(x) {
			c.StrokeLine2(r.style, x, c.Min.Y, x, c.Max.Y)
		}
		return
	}
	y := trY(r.value)
	if c.ContainsY(y) {
		c.StrokeLine2(r.style, c.Min.X, y, c.Max.X, y)
	}
}

// haloGlyph is a filled circle with a thin white ring, so that points stay
// distinct where they sit on a line or a whisker.
type haloGlyph struct{}

func (haloGlyph) DrawGlyph(c *draw.Canvas, sty draw.GlyphStyle, pt vg.Point) {
	ring := draw.GlyphStyle{Color: white, Radius: sty.Radius + vg.Points(1.2), Shape: draw.CircleGlyph{}}
	c.SetColor(white)
	ring.Shape.DrawGlyph(c, ring, pt)
	c.SetColor(sty.Color)
	draw.CircleGlyph{}.DrawGlyph(c, sty, pt)
}

// clampLen limits a canvas coordinate to [lo, hi].
func clampLen(v, lo, hi vg.Length) vg.Length {
	return vg.Length(math.Max(float64(lo), math.Min(float64(hi), float64(v))))
}

// rectPath returns the closed outline of a rectangle.
func rectPts(x0, y0, x1, y1 vg.Length) []vg.Point {
	return []vg.Point{{X: x0, Y: y0}, {X: x0, Y: y1}, {X: x1, Y: y1}, {X: x1, Y: y0}}
}

// fillRect fills an axis-aligned rectangle.
func fillRect(c *draw.Canvas, clr color.Color, x0, y0, x1, y1 vg.Length) {
	if x1 == x0 || y1 == y0 {
		return
	}
	c.FillPolygon(clr, rectPts(x0, y0, x1, y1))
}

// toRect converts canvas corners into a Rect (min/max ordered).
func toRect(x0, y0, x1, y1 vg.Length) Rect {
	return Rect{
		MinX: math.Min(float64(x0), float64(x1)), MinY: math.Min(float64(y0), float64(y1)),
		MaxX: math.Max(float64(x0), float64(x1)), MaxY: math.Max(float64(y0), float64(y1)),
	}
}
