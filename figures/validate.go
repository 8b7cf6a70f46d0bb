package figures

import (
	"fmt"
	"math"
)

// finite reports whether v is a real number.
func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// validate checks that s can be drawn, with errors that say what to change.
func validate(s Spec) error {
	known := false
	for _, k := range Kinds {
		known = known || s.Kind == k
	}
	if !known {
		return fmt.Errorf("figures: unknown chart kind %q; use one of %v", s.Kind, Kinds)
	}
	for _, a := range []*float64{s.AxisMin, s.AxisMax} {
		if a != nil && !finite(*a) {
			return fmt.Errorf("figures: the axis bounds must be finite numbers, not %v", *a)
		}
	}
	if s.AxisMin != nil && s.AxisMax != nil && !(*s.AxisMin < *s.AxisMax) {
		return fmt.Errorf("figures: axis min %g is not below axis max %g", *s.AxisMin, *s.AxisMax)
	}
	if (s.Kind == Pie || s.Kind == StemLeaf) && (s.AxisMin != nil || s.AxisMax != nil) {
		return fmt.Errorf("figures: a %s chart has no value axis; remove the axis min and max", s.Kind)
	}
	switch s.Kind {
	case Bar, Grouped, Stacked, Dot, Pie, Line:
		return validateSeries(s)
	case Histogram:
		if len(s.Bins) == 0 {
			return fmt.Errorf("figures: a histogram needs bins")
		}
		for i, b := range s.Bins {
			if !finite(b.Lo) || !finite(b.Hi) || !finite(b.Value) {
				return fmt.Errorf("figures: histogram bin %d has a value that is not a finite number", i+1)
			}
			if !(b.Lo < b.Hi) {
				return fmt.Errorf("figures: histogram bin %d runs from %g to %g; its low edge must be below its high edge", i+1, b.Lo, b.Hi)
			}
			if b.Value < 0 {
				return fmt.Errorf("figures: histogram bin %d has a negative count %g", i+1, b.Value)
			}
			if i > 0 && b.Lo < s.Bins[i-1].Hi {
				return fmt.Errorf("figures: histogram bin %d starts at %g, inside bin %d; give bins in order without overlap", i+1, b.Lo, i)
			}
		}
	case Scatter:
		if len(s.Points) == 0 {
			return fmt.Errorf("figures: a scatter plot needs points")
		}
		for i, p := range s.Points {
			if !finite(p.X) || !finite(p.Y) {
				return fmt.Errorf("figures: scatter point %d is not a pair of finite numbers", i+1)
			}
		}
		if s.Fit != nil && (!finite(s.Fit.Intercept) || !finite(s.Fit.Slope)) {
			return fmt.Errorf("figures: the fitted line needs a finite intercept and slope")
		}
	case Box:
		if len(s.Boxes) == 0 {
			return fmt.Errorf("figures: a box plot needs at least one box")
		}
		if len(s.Categories) > 0 && len(s.Categories) != len(s.Boxes) {
			return fmt.Errorf("figures: %d categories for %d boxes; give one per box or none", len(s.Categories), len(s.Boxes))
		}
		for i, b := range s.Boxes {
			for _, v := range append([]float64{b.Q1, b.Median, b.Q3, b.WhiskerLow, b.WhiskerHigh}, b.Outliers...) {
				if !finite(v) {
					return fmt.Errorf("figures: box %d has a value that is not a finite number", i+1)
				}
			}
			if !(b.WhiskerLow <= b.Q1 && b.Q1 <= b.Median && b.Median <= b.Q3 && b.Q3 <= b.WhiskerHigh) {
				return fmt.Errorf("figures: box %d must have whisker low ≤ Q1 ≤ median ≤ Q3 ≤ whisker high", i+1)
			}
			if b.N < 0 {
				return fmt.Errorf("figures: box %d has a negative n", i+1)
			}
		}
	case StemLeaf:
		if len(s.Lines) == 0 {
			return fmt.Errorf("figures: a stem-and-leaf display needs lines")
		}
	}
	return nil
}

// validateSeries checks category charts: categories, series of matching
// lengths, finite values (a line chart may leave a time point out with NaN),
// intervals around their estimates.
func validateSeries(s Spec) error {
	n := len(s.Categories)
	if n == 0 {
		return fmt.Errorf("figures: a %s chart needs categories", s.Kind)
	}
	if len(s.Series) == 0 {
		return fmt.Errorf("figures: a %s chart needs a series of values", s.Kind)
	}
	if (s.Kind == Bar || s.Kind == Pie) && len(s.Series) != 1 {
		return fmt.Errorf("figures: a %s chart shows one series, not %d; use a grouped or stacked chart for more", s.Kind, len(s.Series))
	}
	seen := false
	for _, ser := range s.Series {
		if len(ser.Values) != n {
			return fmt.Errorf("figures: series %q has %d values for %d categories", ser.Name, len(ser.Values), n)
		}
		if len(ser.Low) != len(ser.High) || (len(ser.Low) != 0 && len(ser.Low) != n) {
			return fmt.Errorf("figures: series %q needs as many interval lows and highs as values (%d), or none", ser.Name, n)
		}
		for i, v := range ser.Values {
			if math.IsNaN(v) && s.Kind == Line {
				continue
			}
			if !finite(v) {
				return fmt.Errorf("figures: series %q, category %q: %v is not a finite number", ser.Name, s.Categories[i], v)
			}
			seen = true
			if (s.Kind == Pie || s.Kind == Stacked) && v < 0 {
				return fmt.Errorf("figures: series %q, category %q: a %s chart cannot show the negative value %g", ser.Name, s.Categories[i], s.Kind, v)
			}
			if len(ser.Low) == n {
				lo, hi := ser.Low[i], ser.High[i]
				if !finite(lo) || !finite(hi) || lo > v || hi < v {
					return fmt.Errorf("figures: series %q, category %q: the interval %v to %v must be finite and contain the value %g", ser.Name, s.Categories[i], lo, hi, v)
				}
			}
		}
	}
	if !seen {
		return fmt.Errorf("figures: the %s chart has no values to draw", s.Kind)
	}
	if s.Kind == Pie {
		sum := 0.0
		for _, v := range s.Series[0].Values {
			sum += v
		}
		if !(sum > 0) {
			return fmt.Errorf("figures: a pie needs values that add up to more than zero")
		}
	}
	return nil
}
