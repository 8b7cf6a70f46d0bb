package check

import (
	"candor/blocks"
	"candor/figures"
)

var zeroAxisRule = &Rule{
	ID: "zero-axis",
	Doc: `zero-axis flags a bar, grouped, stacked or histogram chart whose value axis does not start at zero (or, for bars that ` +
		`all go below zero, end at zero): bar length is the value, so a cut-off axis makes small differences look large. It reads ` +
		`the axis as drawn (the figure's geometry), or the block's axis: setting when the figure was not drawn. Severity warning; ` +
		`the lie-factor rule says how much the cut distorts.`,
	On:    Figures,
	Check: checkZeroAxis,
}

// barKinds are the charts whose marks are lengths from the baseline.
var barKinds = map[figures.Kind]bool{figures.Bar: true, figures.Grouped: true, figures.Stacked: true, figures.Histogram: true}

func checkZeroAxis(p *Pass) []Finding {
	bi := p.bi
	spec := bi.figure
	if spec == nil || !barKinds[spec.Kind] {
		return nil
	}
	var lo, hi float64
	switch {
	case bi.geometry != nil && (bi.geometry.AxisMin != 0 || bi.geometry.AxisMax != 0):
		lo, hi = bi.geometry.AxisMin, bi.geometry.AxisMax
	case spec.AxisMin != nil:
		lo = *spec.AxisMin
		hi = lo + 1
		if spec.AxisMax != nil {
			hi = *spec.AxisMax
		}
	default:
		return nil
	}
	allNeg := true
	any := false
	for _, s := range spec.Series {
		for _, v := range s.Values {
			any = true
			if v > 0 {
				allNeg = false
			}
		}
	}
	for _, b := range spec.Bins {
		any = true
		if b.Value > 0 {
			allNeg = false
		}
	}
	if !any {
		allNeg = false
	}
	k := blocks.Number
	if spec.Percent {
		k = blocks.Percent
	}
	switch {
	case allNeg && hi < 0:
		return []Finding{p.atBlock(Warning, bi, "the %s chart's value axis ends at %s, not zero, so bar lengths misstate the values; try removing axis: or setting max: 0",
			spec.Kind, show(hi, k))}
	case !allNeg && lo > 0:
		return []Finding{p.atBlock(Warning, bi, "the %s chart's value axis starts at %s, not zero, so bar lengths misstate the values; try removing axis: or setting min: 0",
			spec.Kind, show(lo, k))}
	}
	return nil
}
