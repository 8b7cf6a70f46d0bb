package check

import (
	"math"

	"candor/blocks"
	"candor/figures"
)

var lieFactorRule = &Rule{
	ID: "lie-factor",
	Doc: `lie-factor flags a figure whose drawn effect differs from the data's effect beyond 0.95–1.05: Tufte's (1983) lie ` +
		`factor, the size of the effect shown in the graphic divided by the size of the effect in the data, as the figure's ` +
		`geometry measured it from the marks drawn. It applies to marks with length or area (bars, stacks, histograms); points and ` +
		`lines have none. Severity error: the picture contradicts the numbers.`,
	On:    Figures,
	Check: checkLieFactor,
}

// Tufte (1983): a lie factor between these bounds is honest.
const (
	lieLow  = 0.95
	lieHigh = 1.05
)

func checkLieFactor(p *Pass) []Finding {
	bi := p.bi
	g := bi.geometry
	if bi.figure == nil || g == nil || !g.HasLie {
		return nil
	}
	lf := g.LieFactor
	if lf == 0 {
		lf = lieFromMarks(g.Marks)
	}
	if math.IsNaN(lf) || math.IsInf(lf, 0) || lf <= 0 || (lf >= lieLow && lf <= lieHigh) {
		return nil
	}
	how := "exaggerates"
	if lf < 1 {
		how = "shrinks"
	}
	return []Finding{p.atBlock(Error, bi, "the figure %s the effect: its lie factor is %s (Tufte 1983; honest is 0.95–1.05), so the drawn difference is %s times the data's; try a value axis from zero",
		how, sig3(lf), blocks.Sig(lf, 2))}
}

// lieFromMarks computes Tufte's lie factor from the marks when the geometry
// did not: the relative difference between the longest and shortest mark
// drawn over the relative difference between their values.
func lieFromMarks(ms []figures.Mark) float64 {
	var lo, hi *figures.Mark
	for i := range ms {
		m := &ms[i]
		if m.Length <= 0 || m.Value <= 0 {
			continue
		}
		if lo == nil || m.Value < lo.Value {
			lo = m
		}
		if hi == nil || m.Value > hi.Value {
			hi = m
		}
	}
	if lo == nil || hi == nil || hi.Value == lo.Value {
		return math.NaN()
	}
	shown := (hi.Length - lo.Length) / lo.Length
	data := (hi.Value - lo.Value) / lo.Value
	return shown / data
}
