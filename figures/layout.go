package figures

import (
	"math"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// legendEntry is one entry of a figure's legend: a name and the thumbnails
// (the plotters' own) that draw its key.
type legendEntry struct {
	name   string
	thumbs []plot.Thumbnailer
	width  vg.Length // width of the key; its height is the legend's line
}

// drawFrame paints the white canvas, the title (left-aligned, wrapped onto
// two lines at most) and the legend (one row of keys under the title,
// wrapped when it is wider than the canvas), and returns the area left for
// the plot.
func drawFrame(dc draw.Canvas, title string, legend []legendEntry) draw.Canvas {
	dc.SetColor(white)
	dc.Fill(dc.Rectangle.Path())

	top := dc.Max.Y - margin
	left := dc.Min.X + margin
	right := dc.Max.X - margin
	if title != "" {
		sty := textStyle(sansBold, titleSize, titleColor, draw.XLeft, draw.YTop)
		lines := wrapText(title, sty, right-left, 2)
		txt := strings.Join(lines, "\n")
		dc.FillText(sty, vg.Point{X: left, Y: top}, txt)
		top -= sty.Height(txt) + vg.Points(8)
	}
	if len(legend) > 0 {
		sty := textStyle(sansRegular, legendSize, inkColor, draw.XLeft, draw.YCenter)
		rowH := vg.Points(legendSize * 1.5)
		keyH := vg.Points(9)
		gap := vg.Points(14)
		x := left
		y := top - rowH/2 // centre line of the current row
		for _, e := range legend {
			w := e.width + vg.Points(5) + sty.Width(e.name)
			if x > left && x+w > right {
				x = left
				y -= rowH
			}
			key := draw.Canvas{Canvas: dc.Canvas, Rectangle: vg.Rectangle{
				Min: vg.Point{X: x, Y: y - keyH/2},
				Max: vg.Point{X: x + e.width, Y: y + keyH/2},
			}}
			for _, t := range e.thumbs {
				t.Thumbnail(&key)
			}
			dc.FillText(sty, vg.Point{X: x + e.width + vg.Points(5), Y: y}, e.name)
			x += w + gap
		}
		top = y - rowH/2 - vg.Points(4)
	}
	return draw.Crop(dc, margin, -margin, margin, top-dc.Max.Y)
}

// swatch is a legend key: a filled square in a series colour.
type swatch struct{ fill draw.LineStyle }

func (s swatch) Thumbnail(c *draw.Canvas) {
	c.FillPolygon(s.fill.Color, []vg.Point{
		{X: c.Min.X, Y: c.Min.Y}, {X: c.Min.X, Y: c.Max.Y},
		{X: c.Max.X, Y: c.Max.Y}, {X: c.Max.X, Y: c.Min.Y},
	})
}

// wrapText breaks s at spaces into lines no wider than maxW, at most
// maxLines of them; a last line that would not fit is cut with an ellipsis.
// A single word wider than maxW is cut too. The result is deterministic.
func wrapText(s string, sty text.Style, maxW vg.Length, maxLines int) []string {
	lines, _ := wrapFits(s, sty, maxW, maxLines)
	return lines
}

// wrapFits is wrapText that also says whether the text fitted without
// cutting anything.
func wrapFits(s string, sty text.Style, maxW vg.Length, maxLines int) ([]string, bool) {
	if maxLines < 1 {
		maxLines = 1
	}
	words := strings.Fields(s)
	if len(words) == 0 {
		return []string{s}, true
	}
	var lines []string
	cur := ""
	for _, w := range words {
		try := w
		if cur != "" {
			try = cur + " " + w
		}
		if cur == "" || sty.Width(try) <= maxW {
			cur = try
			continue
		}
		lines = append(lines, cur)
		cur = w
	}
	lines = append(lines, cur)
	if len(lines) > 1 && len(lines) <= 3 && len(lines) <= maxLines {
		lines = balance(words, len(lines), sty)
	}
	fits := true
	if len(lines) > maxLines {
		rest := strings.Join(lines[maxLines-1:], " ")
		lines = append(lines[:maxLines-1], rest)
		fits = false
	}
	for i, l := range lines {
		if sty.Width(l) > maxW {
			lines[i] = ellipsize(l, sty, maxW)
			fits = false
		}
	}
	return lines, fits
}

// balance splits words into n lines (2 or 3) whose widest line is as
// narrow as possible, so that a wrapped label has no orphan word. On ties
// the earliest split wins.
func balance(words []string, n int, sty text.Style) []string {
	join := func(ws []string) string { return strings.Join(ws, " ") }
	var best []string
	bestW := vg.Length(math.Inf(1))
	try := func(cuts ...int) {
		var lines []string
		prev := 0
		for _, c := range append(cuts, len(words)) {
			lines = append(lines, join(words[prev:c]))
			prev = c
		}
		var w vg.Length
		for _, l := range lines {
			w = vg.Length(math.Max(float64(w), float64(sty.Width(l))))
		}
		if w < bestW {
			best, bestW = lines, w
		}
	}
	for i := 1; i < len(words); i++ {
		if n == 2 {
			try(i)
			continue
		}
		for j := i + 1; j < len(words); j++ {
			try(i, j)
		}
	}
	if best == nil {
		return []string{join(words)}
	}
	return best
}

// ellipsize cuts s to fit maxW, ending it with "…".
func ellipsize(s string, sty text.Style, maxW vg.Length) string {
	r := []rune(s)
	for len(r) > 1 {
		r = r[:len(r)-1]
		t := strings.TrimRight(string(r), " ") + "…"
		if sty.Width(t) <= maxW {
			return t
		}
	}
	return "…"
}

// plotWidthEstimate is the width of the data area of a chart with a value
// axis on the left, before the plot is laid out: the canvas less margins
// and a typical value axis. Layout decisions (bar orientation, wrapping)
// use it so that they depend on the spec alone.
func plotWidthEstimate() vg.Length {
	return vg.Points(CanvasWidth - 2*margin - 62)
}

// plotHeightEstimate is the height of the data area below a one-line title
// and above a one-line category axis with its label.
func plotHeightEstimate(legend bool) vg.Length {
	h := CanvasHeight - 2*margin - 23 - 40
	if legend {
		h -= 18
	}
	return vg.Points(h)
}

// categoryLabels fits category names under vertical bars (or points) of a
// slot width: each name is wrapped onto two lines at most. It reports
// whether every name fitted whole.
func categoryLabels(names []string, slot vg.Length) ([]string, bool) {
	sty := textStyle(sansRegular, tickSize, axisText, draw.XCenter, draw.YTop)
	out := make([]string, len(names))
	all := true
	for i, n := range names {
		lines, fits := wrapFits(n, sty, slot*0.9, 2)
		out[i] = strings.Join(lines, "\n")
		all = all && fits
	}
	return out, all
}

// rowLabels fits category names beside horizontal bars or dot rows: wrapped
// within 30% of the canvas width, on as many lines (up to three) as a row
// has room for.
func rowLabels(names []string, rowH vg.Length) []string {
	sty := textStyle(sansRegular, tickSize, axisText, draw.XRight, draw.YCenter)
	lineH := sty.Height("Xg")
	maxLines := int(float64(rowH*0.9) / float64(lineH))
	if maxLines > 3 {
		maxLines = 3
	}
	out := make([]string, len(names))
	for i, n := range names {
		out[i] = strings.Join(wrapText(n, sty, vg.Points(CanvasWidth*0.3), maxLines), "\n")
	}
	return out
}

// slantLabels fits time-point names under a line chart or boxes: wrapped
// onto two lines when that fits the slot, otherwise written at a slant
// (30°) and cut to 110 points.
func slantLabels(p *plot.Plot, names []string, slot vg.Length) []string {
	out, fits := categoryLabels(names, slot)
	if fits {
		return out
	}
	sty := p.X.Tick.Label
	sty.Rotation = 0.5235987755982988 // 30°
	sty.XAlign = draw.XRight
	sty.YAlign = draw.YCenter
	p.X.Tick.Label = sty
	flat := textStyle(sansRegular, tickSize, axisText, draw.XLeft, draw.YTop)
	for i, n := range names {
		out[i] = wrapText(n, flat, vg.Points(110), 1)[0]
	}
	return out
}

// reversed returns names in reverse order (the top row of a horizontal
// chart is the first category, at the highest position).
func reversed[T any](xs []T) []T {
	out := make([]T, len(xs))
	for i, x := range xs {
		out[len(xs)-1-i] = x
	}
	return out
}
