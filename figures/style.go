package figures

import (
	"image/color"
	"math"
	"strconv"
	"strings"

	xfont "golang.org/x/image/font"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// The canvas every figure is drawn on, in points (1/72 inch): 7.5 × 4.5
// inches, 5:3. One size for every chart kind, so that a report's figures
// look like a set; the SVG scales to the width of its container.
const (
	CanvasWidth  = 540.0
	CanvasHeight = 324.0
)

// margin is the white border around everything drawn.
const margin = 12.0

// Palette is the Okabe–Ito colour-blind-safe palette (Okabe and Ito 2008,
// "Color Universal Design"), in the order series receive its colours: blue,
// orange, bluish green, vermillion, sky blue, reddish purple, yellow, black.
// Yellow comes late because it has the least contrast on white. A chart of a
// single series (a plain bar chart, a histogram) uses the first colour.
var Palette = []color.Color{
	rgb(0x00, 0x72, 0xB2), // blue
	rgb(0xE6, 0x9F, 0x00), // orange
	rgb(0x00, 0x9E, 0x73), // bluish green
	rgb(0xD5, 0x5E, 0x00), // vermillion
	rgb(0x56, 0xB4, 0xE9), // sky blue
	rgb(0xCC, 0x79, 0xA7), // reddish purple
	rgb(0xF0, 0xE4, 0x42), // yellow
	rgb(0x00, 0x00, 0x00), // black
}

// seriesColor returns the palette colour of series i, cycling.
func seriesColor(i int) color.Color { return Palette[i%len(Palette)] }

// Neutral colours of the frame.
var (
	white      = rgb(0xFF, 0xFF, 0xFF)
	titleColor = rgb(0x22, 0x22, 0x22)
	inkColor   = rgb(0x33, 0x33, 0x33) // value labels, legend text
	axisText   = rgb(0x55, 0x55, 0x55) // tick labels, axis labels
	axisLine   = rgb(0x77, 0x77, 0x77) // the category axis and baselines
	gridColor  = rgb(0xE2, 0xE2, 0xE2) // the light grid
	noInk      = color.NRGBA{}         // invisible strokes that only reserve space
)

func rgb(r, g, b uint8) color.NRGBA { return color.NRGBA{R: r, G: g, B: b, A: 0xFF} }

// withAlpha returns c with the opacity a (0–255).
func withAlpha(c color.Color, a uint8) color.NRGBA {
	r, g, b, _ := c.RGBA()
	return color.NRGBA{R: uint8(r >> 8), G: uint8(g >> 8), B: uint8(b >> 8), A: a}
}

// tint mixes c with white: f = 0 gives c, f = 1 white.
func tint(c color.Color, f float64) color.NRGBA {
	r, g, b, _ := c.RGBA()
	mix := func(v uint32) uint8 {
		x := float64(v>>8)*(1-f) + 255*f
		return uint8(math.Round(x))
	}
	return color.NRGBA{R: mix(r), G: mix(g), B: mix(b), A: 0xFF}
}

// labelOn returns the text colour (white or near-black) with the higher
// contrast ratio on the fill c (WCAG 2 relative luminance).
func labelOn(c color.Color) color.Color {
	r, g, b, _ := c.RGBA()
	lin := func(v uint32) float64 {
		s := float64(v>>8) / 255
		if s <= 0.04045 {
			return s / 12.92
		}
		return math.Pow((s+0.055)/1.055, 2.4)
	}
	l := 0.2126*lin(r) + 0.7152*lin(g) + 0.0722*lin(b)
	onWhite := 1.05 / (l + 0.05)
	onDark := (l + 0.05) / (0.0137 + 0.05) // #222222
	if onWhite >= onDark {
		return white
	}
	return titleColor
}

// Type: Liberation Sans for metrics (metric-compatible with Arial and
// Helvetica), written in the SVG as a font-family list ending in sans-serif.
const (
	titleSize  = 13.0
	labelSize  = 10.0 // axis labels
	tickSize   = 9.5  // tick labels, legend
	valueSize  = 9.0  // direct value labels
	legendSize = 9.5
	monoSize   = 12.0
)

var (
	sansRegular = font.Font{Typeface: "Liberation", Variant: "Sans"}
	sansBold    = font.Font{Typeface: "Liberation", Variant: "Sans", Weight: xfont.WeightBold}
	sansItalic  = font.Font{Typeface: "Liberation", Variant: "Sans", Style: xfont.StyleItalic}
	monoRegular = font.Font{Typeface: "Liberation", Variant: "Mono"}
)

// textStyle returns a plain-text style.
func textStyle(f font.Font, size float64, c color.Color, xa text.XAlignment, ya text.YAlignment) text.Style {
	return text.Style{
		Color:   c,
		Font:    font.From(f, vg.Points(size)),
		XAlign:  xa,
		YAlign:  ya,
		Handler: plot.DefaultTextHandler,
	}
}

// newPlot returns a plot.Plot in the house style: white background, sans
// type, no axis lines but the category baseline, invisible tick marks that
// only keep labels off the axis. Callers switch on what their chart needs.
func newPlot() *plot.Plot {
	p := plot.New()
	p.BackgroundColor = white
	for _, a := range []*plot.Axis{&p.X, &p.Y} {
		a.Label.TextStyle = textStyle(sansRegular, labelSize, axisText, draw.XCenter, draw.YBottom)
		a.Label.Padding = vg.Points(5)
		a.LineStyle = draw.LineStyle{Color: axisLine, Width: 0}
		a.Padding = 0
		a.Tick.LineStyle = draw.LineStyle{Color: noInk, Width: vg.Points(0.5)}
		a.Tick.Length = vg.Points(4)
	}
	p.X.Tick.Label = textStyle(sansRegular, tickSize, axisText, draw.XCenter, draw.YTop)
	p.Y.Tick.Label = textStyle(sansRegular, tickSize, axisText, draw.XRight, draw.YCenter)
	return p
}

// baseline is the style of the category axis line.
var baseline = draw.LineStyle{Color: axisLine, Width: vg.Points(0.8)}

// gridStyle is the light grid.
var gridStyle = draw.LineStyle{Color: gridColor, Width: vg.Points(0.6)}

// formatValue formats a data value for a direct label or a description, the
// way FORMAT.md section 4 shows numbers: percentages with one decimal and %,
// whole numbers with thousands separators, other values with three
// significant digits (never in exponent notation). Negative numbers take a
// true minus sign.
func formatValue(v float64, percent bool) string {
	if percent {
		return withMinus(groupThousands(strconv.FormatFloat(v, 'f', 1, 64))) + "%"
	}
	if v == math.Trunc(v) && math.Abs(v) < 1e15 {
		return withMinus(groupThousands(strconv.FormatFloat(v, 'f', 0, 64)))
	}
	a := math.Abs(v)
	dec := 2 - int(math.Floor(math.Log10(a)))
	if dec < 0 {
		dec = 0
	}
	if dec > 8 {
		dec = 8
	}
	return withMinus(groupThousands(strconv.FormatFloat(v, 'f', dec, 64)))
}

// formatFixed formats v with dec decimals and thousands separators.
func formatFixed(v float64, dec int, percent bool) string {
	s := withMinus(groupThousands(strconv.FormatFloat(v, 'f', dec, 64)))
	if percent {
		s += "%"
	}
	return s
}

// withMinus replaces a leading hyphen with U+2212 MINUS SIGN, and drops the
// sign of a negative zero.
func withMinus(s string) string {
	if !strings.HasPrefix(s, "-") {
		return s
	}
	if strings.Trim(s[1:], "0.,") == "" {
		return s[1:]
	}
	return "\u2212" + s[1:]
}

// groupThousands puts commas between groups of three digits of the integer
// part of a formatted number.
func groupThousands(s string) string {
	sign := ""
	if strings.HasPrefix(s, "-") {
		sign, s = "-", s[1:]
	}
	intPart, frac := s, ""
	if i := strings.IndexByte(s, '.'); i >= 0 {
		intPart, frac = s[:i], s[i:]
	}
	if len(intPart) <= 3 {
		return sign + s
	}
	var b strings.Builder
	pre := len(intPart) % 3
	if pre > 0 {
		b.WriteString(intPart[:pre])
	}
	for i := pre; i < len(intPart); i += 3 {
		if b.Len() > 0 {
			b.WriteByte(',')
		}
		b.WriteString(intPart[i : i+3])
	}
	return sign + b.String() + frac
}

// labelFormat returns the formatter for the direct labels of one chart, so
// that its numbers line up: percentages with one decimal; otherwise every
// label with the same decimals, as many as the data are given with (at most
// four) but no more than three significant digits of the smallest non-zero
// value need.
func labelFormat(vals []float64, percent bool) func(float64) string {
	if percent {
		return func(v float64) string { return formatValue(v, true) }
	}
	dec := 0
	small := math.Inf(1)
	for _, v := range vals {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			continue
		}
		dec = max(dec, decimalsFor(v))
		if v != 0 {
			small = math.Min(small, math.Abs(v))
		}
	}
	if dec > 0 && !math.IsInf(small, 1) {
		dec = min(dec, max(0, 2-int(math.Floor(math.Log10(small)))))
	}
	return func(v float64) string { return formatFixed(v, dec, false) }
}
