package figures

import (
	"math"

	"gonum.org/v1/plot"
)

// targetTicks is the number of intervals between labelled ticks a value
// axis aims at.
const targetTicks = 5

// tickStep is the step between labelled ticks for the range [lo, hi]: a
// "nice number" (Heckbert 1990, "Nice numbers for graph labels", Graphics
// Gems), 1, 2, 2.5 or 5 times a power of ten, whichever divides the range
// into a number of intervals closest to targetTicks (the smaller step on a
// tie).
func tickStep(lo, hi float64) float64 {
	r := hi - lo
	if !(r > 0) || math.IsInf(r, 0) || math.IsNaN(r) {
		return 1
	}
	base := math.Pow(10, math.Floor(math.Log10(r/targetTicks))-1)
	best, bestDiff := 0.0, math.Inf(1)
	for e := 0; e < 3; e++ {
		for _, m := range []float64{1, 2, 2.5, 5} {
			step := m * base * math.Pow(10, float64(e))
			diff := math.Abs(r/step - targetTicks)
			if diff < bestDiff-1e-9 {
				best, bestDiff = step, diff
			}
		}
	}
	return best
}

// niceRange widens [lo, hi] outwards to whole tick steps (Heckbert's loose
// labelling), so that the axis starts and ends on a labelled tick. A range
// of zero width is widened around its value.
func niceRange(lo, hi float64) axisRange {
	if hi < lo {
		lo, hi = hi, lo
	}
	if hi == lo {
		d := math.Abs(lo) * 0.1
		if d == 0 {
			d = 1
		}
		lo, hi = lo-d, hi+d
	}
	step := tickStep(lo, hi)
	return axisRange{math.Floor(lo/step+1e-9) * step, math.Ceil(hi/step-1e-9) * step, step}
}

// axisRange is a value axis range with the step of its labelled ticks; a
// zero step lets the ticks choose theirs (an author's range).
type axisRange struct{ lo, hi, step float64 }

// headroom widens the default range of bars so that a bar's label does not
// sit on the top gridline.
const headroom = 1.05

// zeroRange is the honest default of a bar or area axis: it includes zero
// and widens the far end to a whole tick step.
func zeroRange(lo, hi float64) axisRange {
	lo, hi = math.Min(lo, 0), math.Max(hi, 0)
	if lo == 0 && hi == 0 {
		return axisRange{0, 1, 0.2}
	}
	// Leave a little room beyond the longest bar for its label.
	return niceRange(lo*headroom, hi*headroom)
}

// valueTicks labels a value axis at nice steps; percent adds "%" to every
// label. When the axis starts off the step grid (an author's cut-off
// axis, say from 26.67), its start is labelled too, so that a reader sees
// where the bars begin; a regular tick too close to it is dropped.
type valueTicks struct {
	percent bool
	step    float64 // the step of the range's default, or 0 to choose
}

var _ plot.Ticker = valueTicks{}

// Ticks implements plot.Ticker.
func (t valueTicks) Ticks(lo, hi float64) []plot.Tick {
	if !(hi > lo) || math.IsInf(lo, 0) || math.IsInf(hi, 0) {
		return nil
	}
	step := t.step
	if step <= 0 {
		step = tickStep(lo, hi)
	}
	dec := decimalsFor(step)
	first := math.Ceil(lo/step - 1e-9)
	last := math.Floor(hi/step + 1e-9)
	var ticks []plot.Tick
	startOff := math.Abs(first*step-lo) > step*1e-6
	if startOff {
		ticks = append(ticks, plot.Tick{Value: lo, Label: formatFixed(lo, decimalsFor(lo), t.percent)})
	}
	for k := first; k <= last && len(ticks) < 100; k++ {
		v := k * step
		if math.Abs(v) < step*1e-9 {
			v = 0
		}
		if startOff && v-lo < 0.5*step {
			continue
		}
		ticks = append(ticks, plot.Tick{Value: v, Label: formatFixed(v, dec, t.percent)})
	}
	return ticks
}

// decimalsFor is the number of decimals (0–4) needed to write v exactly
// enough: the fewest for which v rounds to itself within a millionth.
func decimalsFor(v float64) int {
	v = math.Abs(v)
	for d := 0; d < 4; d++ {
		s := v * math.Pow(10, float64(d))
		if math.Abs(s-math.Round(s)) < 1e-6*math.Max(1, s) {
			return d
		}
	}
	return 4
}

// categoryTicks labels positions 0, 1, … with names (a nominal axis).
func categoryTicks(names []string) plot.ConstantTicks {
	ts := make(plot.ConstantTicks, len(names))
	for i, n := range names {
		ts[i] = plot.Tick{Value: float64(i), Label: n}
	}
	return ts
}
