package check

import (
	"candor/figures"
)

var unshownFitRule = &Rule{
	ID: "unshown-fit",
	Doc: `unshown-fit flags a correlation or regression block whose data are not shown as a scatter plot (chart: none, or another ` +
		`kind), unless another block of the report draws a scatter of the same two columns. An r or a slope alone hides curves, ` +
		`clusters and single points that make the fit (Anscombe's quartet is the classic warning). Severity warning.`,
	On:    Figures,
	Check: checkUnshownFit,
}

func checkUnshownFit(p *Pass) []Finding {
	bi := p.bi
	if bi.analysis != "correlation" && bi.analysis != "regression" {
		return nil
	}
	if bi.figure != nil && bi.figure.Kind == figures.Scatter {
		return nil
	}
	for _, o := range p.blocks {
		if o == bi || o.figure == nil || o.figure.Kind != figures.Scatter {
			continue
		}
		if sameColumns(o.meta.Columns, bi.meta.Columns) {
			return nil
		}
	}
	shown := "draws no figure"
	if bi.figure != nil {
		shown = "draws a " + string(bi.figure.Kind) + " chart"
	}
	return []Finding{p.atBlock(Warning, bi, "the %s %s, so readers cannot see the data behind the fit; try chart: scatter", bi.analysis, shown)}
}

func sameColumns(a, b []string) bool {
	if len(a) == 0 || len(a) != len(b) {
		return false
	}
	seen := map[string]int{}
	for _, x := range a {
		seen[x]++
	}
	for _, x := range b {
		seen[x]--
	}
	for _, n := range seen {
		if n != 0 {
			return false
		}
	}
	return true
}
