// Package figures draws the charts of a report with gonum/plot as
// deterministic SVG, and records what it drew (Geometry) so that the checker
// can audit a figure as strictly as a sentence. It decides how to draw, never
// whether a claim is honest.
package figures

// Kind is a chart kind of FORMAT.md section 2.
type Kind string

const (
	Bar       Kind = "bar"
	Histogram Kind = "histogram"
	Dot       Kind = "dot"     // point estimates with CI whiskers
	Pie       Kind = "pie"     // shares of one whole
	Stacked   Kind = "stacked" // 100% stacked bars
	Grouped   Kind = "grouped" // side-by-side bars per category
	Scatter   Kind = "scatter" // points with the fitted line
	Line      Kind = "line"    // a trend over time points, every point marked
	Box       Kind = "box"     // Tukey box plots
	StemLeaf  Kind = "stemleaf"
)

// Kinds lists every chart kind, in the order FORMAT.md gives them.
var Kinds = []Kind{Bar, Histogram, Dot, Pie, Stacked, Grouped, Scatter, Line, Box, StemLeaf}

// Spec is everything needed to draw one figure. The analysis that fills it
// decides the data; Draw decides the look.
type Spec struct {
	Kind Kind
	// ID prefixes every id inside the SVG (fig-ID-title, fig-ID-desc) so that
	// two figures in one HTML file never clash: give the block id. Characters
	// other than letters, digits, '-' and '_' become '-'; an ID that already
	// starts with "fig-" is not prefixed again. When empty, Draw derives a
	// stable id from the drawing itself.
	ID    string
	Title string // shown above the plot and as the SVG <title>
	// Desc is the one-sentence text summary with the key numbers, the SVG
	// <desc>; Draw writes one from the data when it is empty.
	Desc string

	XLabel string // the category or x axis
	YLabel string // the value or y axis

	// Percent marks values as percentages (0–100): the value axis then runs
	// from 0 to 100 unless AxisMin/AxisMax say otherwise.
	Percent bool
	// AxisMin and AxisMax are the author's value-axis range (the `axis:` key),
	// nil for the honest default (zero-based for bars, stacks and areas).
	AxisMin, AxisMax *float64

	// Categories are the category labels in display order: bars, dot rows,
	// pie slices, stacked bars, groups of side-by-side bars, time points of a
	// line chart.
	Categories []string
	// Series holds one entry per legend entry (one for a plain bar or pie
	// chart); Values[i] belongs to Categories[i].
	Series []Series

	// Bins of a histogram. When Categories has one label per bin, the bins
	// stand for those categories and are labelled with them.
	Bins   []Bin
	Points []Point    // scatter
	Fit    *Fit       // scatter: the fitted line, drawn over the x range of the points
	Boxes  []BoxStats // box plot, one per category

	// Lines is the stem-and-leaf display, one text line each, and Legend its
	// key ("3 | 2 means 32 visits").
	Lines  []string
	Legend string
}

// Series is one set of values over the categories.
type Series struct {
	Name   string
	Values []float64
	// Low and High, when set (same length as Values), are interval ends drawn
	// as whiskers (a 95% CI, say) on dots, bars, grouped bars and line points;
	// each must contain its value. A line chart may leave a time point out
	// with a NaN value.
	Low, High []float64
}

// Bin is one histogram bin [Lo, Hi) with its count (or percent when
// Spec.Percent).
type Bin struct {
	Lo, Hi float64
	Value  float64
}

// Point is one observation of a scatter plot.
type Point struct{ X, Y float64 }

// Fit is a fitted straight line y = Intercept + Slope·x; Label is shown with it
// (its equation and R², say).
type Fit struct {
	Intercept, Slope float64
	Label            string
}

// BoxStats is the five-number summary of one group, Tukey style: whiskers reach
// the most extreme values within 1.5 IQR of the quartiles; points beyond are
// Outliers.
type BoxStats struct {
	Label                   string
	Q1, Median, Q3          float64
	WhiskerLow, WhiskerHigh float64
	Outliers                []float64
	N                       int
}

// Rect is an axis-aligned rectangle in canvas units (points, 1/72 inch), with
// the origin at the bottom left as gonum/plot's vg has it.
type Rect struct{ MinX, MinY, MaxX, MaxY float64 }

// Mark is one drawn mark and the data value behind it.
type Mark struct {
	Series   string
	Category string
	Value    float64 // the data value
	// Length is the drawn extent along the value axis from the baseline, in
	// canvas units: the visible height (or width) of a bar, bin or stack
	// segment, measured from zero or, on a cut-off axis, from the axis start,
	// and clipped to the data area; for a pie slice its sweep angle in
	// degrees. Zero for marks without extent (points, box medians).
	Length float64
	X, Y   float64 // canvas position of the mark's value end
	// Rect is the drawn rectangle of a bar, bin or stack segment (its
	// visible, clipped extent); zero for points and slices.
	Rect Rect
}

// Geometry records what Draw drew: the plot area, the value axis as drawn and
// every mark, for the audit (lie factor, cut-off axis).
type Geometry struct {
	Kind          Kind
	Width, Height float64 // canvas size
	Plot          Rect    // the data area
	// AxisMin and AxisMax are the value axis range as drawn. HasAxis is false
	// for a figure without a value axis (stemleaf); a pie has none either but
	// reports 0 and the sum of its values, the whole its slices divide.
	AxisMin, AxisMax float64
	HasAxis          bool
	// Horizontal is true when the value axis runs across (horizontal bars,
	// dot plots), false when it runs up.
	Horizontal bool
	Marks      []Mark
	// LieFactor is Tufte's (1983) lie factor of the marks drawn: the size of
	// the effect shown divided by the size of the effect in the data, as
	// Draw's doc comment defines it (+Inf when the smaller mark is not drawn
	// at all). HasLie is false where it does not apply (dot, scatter, line,
	// box, stemleaf; fewer than two distinct positive values).
	LieFactor float64
	HasLie    bool
}

// Figure is a drawn figure.
type Figure struct {
	SVG      []byte // a complete <svg> element with role="img", <title> and <desc>
	Desc     string // the text summary used as <desc>
	Geometry Geometry
}
