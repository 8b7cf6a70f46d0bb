package figures

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// stemText draws a stem-and-leaf display: its lines in monospace type,
// left-aligned in a block centred in the data area, the key under them.
type stemText struct {
	lines  []string
	legend string
}

// nbsp keeps runs of spaces: SVG collapses ordinary white space.
func nbsp(s string) string { return strings.ReplaceAll(s, " ", "\u00a0") }

func (st *stemText) Plot(c draw.Canvas, _ *plot.Plot) {
	legendSty := textStyle(sansItalic, legendSize, axisText, draw.XLeft, draw.YTop)
	w, h := c.Max.X-c.Min.X, c.Max.Y-c.Min.Y
	avail := h
	if st.legend != "" {
		avail -= legendSty.Height(st.legend) + vg.Points(10)
	}
	// The largest size up to monoSize at which every line fits.
	size := monoSize
	probe := textStyle(monoRegular, 1, titleColor, draw.XLeft, draw.YTop)
	var wide vg.Length
	for _, l := range st.lines {
		wide = vg.Length(math.Max(float64(wide), float64(probe.Width(nbsp(l)))))
	}
	if wide > 0 {
		size = math.Min(size, float64(w*0.95/wide))
	}
	size = math.Min(size, float64(avail)/(1.25*float64(len(st.lines))))
	size = math.Max(size, 4)
	sty := textStyle(monoRegular, size, titleColor, draw.XLeft, draw.YTop)
	lineH := vg.Points(size * 1.25)
	blockW := wide * vg.Length(size)
	x := c.Center().X - blockW/2
	if x < c.Min.X {
		x = c.Min.X
	}
	blockH := lineH * vg.Length(len(st.lines))
	if st.legend != "" {
		blockH += vg.Points(8) + legendSty.Height(st.legend)
	}
	y := vg.Length(math.Min(float64(c.Max.Y), float64(c.Center().Y+blockH/2)))
	for _, l := range st.lines {
		if strings.TrimSpace(l) != "" {
			c.FillText(sty, vg.Point{X: x, Y: y}, nbsp(l))
		}
		y -= lineH
	}
	if st.legend != "" {
		c.FillText(legendSty, vg.Point{X: x, Y: y - vg.Points(8)}, st.legend)
	}
}

// buildStemLeaf composes the stem-and-leaf text figure.
func buildStemLeaf(s Spec) (*drawing, error) {
	p := newPlot()
	p.HideAxes()
	p.Add(&stemText{lines: s.Lines, legend: s.Legend})
	d := &drawing{plot: p, noAxis: true}
	of := orDefault(s.XLabel, "values")
	d.title = capitalize("stem-and-leaf display of " + of)
	key := ""
	if s.Legend != "" {
		key = "; key: " + s.Legend
	}
	d.desc = fmt.Sprintf("Stem-and-leaf display of %s in %d lines%s.", of, len(s.Lines), key)
	return d, nil
}
