package check

import (
	"candor/figures"
)

var unshownFitRule = &Rule{
	ID: "unshown-fit",
	Doc: `unshown-fit flags a correlation or regression block whose data are not shown as a scatter plot (chart: none, or another ` +
		`kind), unless another block of the same section draws a scatter of the same columns (a regression's outcome and predictors count as its columns). An r or a slope alone hides curves, ` +
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
		if o == bi || o.figure == nil || o.figure.Kind != figures.Scatter || o.b.Section != bi.b.Section {
			continue
		}
		if sameColumns(fitColumns(o), fitColumns(bi)) {
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

// fitColumns are the variables of a fit: the columns and the predictors (a
// regression's Columns hold only its outcome).
func fitColumns(bi *blockInfo) []string {
	seen := map[string]bool{}
	var out []string
	for _, c := range append(append([]string{}, bi.meta.Columns...), bi.meta.Predictors...) {
		if !seen[c] {
			seen[c] = true
			out = append(out, c)
		}
	}
	return out
}
