package check

import (
	"math"
	"strconv"
	"strings"

	"candor/blocks"
)

// show formats a value of a kind as the report shows it (FORMAT.md section
// 4), with "points" after a difference in points.
func show(v float64, k blocks.Kind) string {
	s := blocks.Format(blocks.Fact{Value: v, Kind: k}, -1)
	if k == blocks.Number || k == blocks.Ratio {
		s = trimZeros(s)
	}
	if k == blocks.Points {
		s += " points"
	}
	return s
}

// showF formats a fact.
func showF(f *factInfo) string {
	if f == nil {
		return "undefined"
	}
	return show(f.val(), f.fact.Kind)
}

// showCI formats an interval: "95% CI 0.92–1.51".
func showCI(lo, hi *factInfo) string {
	if !lo.ok() || !hi.ok() {
		return ""
	}
	k := lo.fact.Kind
	a := show(lo.val(), k)
	b := show(hi.val(), k)
	if k == blocks.Points {
		a, b = strings.TrimSuffix(a, " points"), strings.TrimSuffix(b, " points")
	}
	if k == blocks.Percent {
		a = strings.TrimSuffix(a, "%")
	}
	s := "95% CI " + a + "–" + b
	if k == blocks.Points {
		s += " points"
	}
	return s
}

// withCI is "1.18 (95% CI 0.92–1.51)", or the value alone.
func withCI(f, lo, hi *factInfo) string {
	s := showF(f)
	if ci := showCI(lo, hi); ci != "" {
		s += " (" + ci + ")"
	}
	return s
}

// plain rounds a value the way a writer may say it: whole percentages (one
// decimal below 10), two significant digits for ratios and other numbers,
// counts as they are.
func plain(v float64, k blocks.Kind) string {
	switch k {
	case blocks.Count:
		return blocks.Format(blocks.Fact{Value: v, Kind: k}, -1)
	case blocks.Percent:
		if math.Abs(v) < 10 {
			return strconv.FormatFloat(round(v, 1), 'f', -1, 64) + "%"
		}
		return strconv.FormatFloat(math.Round(v), 'f', 0, 64) + "%"
	case blocks.Points:
		if math.Abs(v) < 10 {
			return strconv.FormatFloat(round(v, 1), 'f', -1, 64) + " points"
		}
		return strconv.FormatFloat(math.Round(v), 'f', 0, 64) + " points"
	case blocks.PValue:
		return blocks.Format(blocks.Fact{Value: v, Kind: k}, -1)
	case blocks.Ratio:
		return blocks.Sig(v, 2)
	}
	return trimZeros(blocks.Sig(v, 3))
}

func round(v float64, d int) float64 {
	m := math.Pow(10, float64(d))
	return math.Round(v*m) / m
}

// sig2 is a value with two significant digits ("1.2").
func sig2(v float64) string { return blocks.Sig(v, 2) }

// labelText returns the names of the labels a fact is about ("Annual,
// Q3"), or "".
func labelText(f *factInfo) string {
	var parts []string
	for _, q := range f.quals {
		if l := f.block.labelOf("", q); l != nil {
			parts = append(parts, l.name())
		} else if !reservedQual[q] {
			parts = append(parts, q)
		}
	}
	return strings.Join(parts, ", ")
}

// statNames are how messages name the statistics.
var statNames = map[string]string{
	"pct": "share", "cum_pct": "cumulative share", "row_pct": "row share", "col_pct": "column share", "total_pct": "share of all",
	"mean": "mean", "median": "median", "sd": "SD", "se": "SE", "min": "minimum", "max": "maximum", "q1": "lower quartile",
	"q3": "upper quartile", "iqr": "IQR", "n": "n", "count": "count", "missing": "number missing",
	"diff": "difference", "ratio": "ratio", "odds_ratio": "odds ratio", "p": "p", "r": "r", "rho": "rho", "r2": "R²",
	"adj_r2": "adjusted R²", "d": "Cohen's d", "v": "Cramér's V", "chi2": "chi-square", "f": "F", "change": "change",
	"p_z": "p", "p_welch": "p", "did": "difference in differences", "estimate": "coefficient", "low": "interval low", "high": "interval high",
	"mean_low": "CI low of the mean", "mean_high": "CI high of the mean", "sigma": "residual SD", "skewness": "skewness",
}

// describe names a fact for a message: "the share for Annual",
// "the risk ratio".
func describe(f *factInfo) string {
	if strings.HasPrefix(f.local, "(") {
		// A share the checker summed from the levels: "(under 7.5 hours)".
		what := "the share "
		if f.stat == "count" {
			what = "the count "
		}
		return what + strings.TrimSuffix(strings.TrimPrefix(f.local, "("), ")")
	}
	name := statNames[f.stat]
	// "the smallest minutes", "the largest distance km": a fit's ranges by
	// their column.
	if cols := f.block.meta.Columns; len(f.quals) == 0 && (strings.HasPrefix(f.stat, "x_") || strings.HasPrefix(f.stat, "y_")) {
		col := ""
		switch {
		case f.stat[0] == 'x' && len(f.block.meta.Predictors) == 1:
			col = f.block.meta.Predictors[0]
		case f.stat[0] == 'x' && len(cols) > 0:
			col = cols[0]
		case f.stat[0] == 'y' && len(cols) > 1:
			col = cols[1]
		}
		if col != "" {
			return map[bool]string{true: "the smallest ", false: "the largest "}[strings.HasSuffix(f.stat, "_min")] + strings.ReplaceAll(col, "_", " ")
		}
	}
	if name == "" {
		name = strings.ReplaceAll(f.stat, "_", " ")
	}
	if f.stat == "ratio" {
		name = ratioName(f.block)
	}
	if f.stat == "estimate" && len(f.quals) > 0 && f.quals[0] == "predict" {
		name = "prediction"
	}
	if f.stat == "p" || f.stat == "p_z" || f.stat == "p_welch" || f.stat == "r" || f.stat == "n" || f.stat == "rho" || f.stat == "d" {
		if lt := labelText(f); lt != "" {
			return name + " for " + lt
		}
		return name
	}
	s := "the " + name
	if lt := labelText(f); lt != "" {
		s += " for " + lt
	}
	return s
}

// ratioName is what the block's ratio fact is: a risk ratio for a binary
// outcome, a ratio of means otherwise.
func ratioName(bi *blockInfo) string {
	if bi.meta.Outcome == "binary" || bi.measureStat() == "pct" {
		return "risk ratio"
	}
	return "ratio of means"
}

// quote is a claim as the sentence says it, in double quotes.
func quote(s string) string { return "\"" + s + "\"" }

// trimZeros drops trailing zeros after a decimal point: "0.920" is "0.92",
// "95.0" is "95".
func trimZeros(s string) string {
	if !strings.Contains(s, ".") || strings.ContainsAny(s, "e%") {
		return s
	}
	s = strings.TrimRight(s, "0")
	return strings.TrimSuffix(s, ".")
}

// sig3 is a value with three significant digits, trailing zeros dropped.
func sig3(v float64) string { return trimZeros(blocks.Sig(v, 3)) }
