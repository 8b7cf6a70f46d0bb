package blocks

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"candor/figures"
)

func init() { analyses["stemleaf"] = runStemLeaf }

// runStemLeaf draws Tukey's (1977) stem-and-leaf display of a number
// column: each value is cut into a stem (its leading digits) and a leaf
// (the next digit, later digits truncated), at a leaf unit chosen so that
// the display has about 10·log10(n) lines (Dixon and Kronmal 1965), with a
// stem split into two or five lines where that fits better.
func runStemLeaf(a *run) error {
	s := a.spec
	if s.Chart != "" && s.Chart != "none" && s.Chart != "stemleaf" {
		return Errorf(s.KeyPos["chart"], "stemleaf is its own display; chart: takes none here")
	}
	c, err := a.numeric(s.Target[0], s.TargetPos[0], "stem-and-leaf display")
	if err != nil {
		return err
	}
	v, miss := presentAll(c)
	if v.Len() == 0 {
		return Errorf(s.TargetPos[0], "stemleaf: column %q has no values here", c.Name)
	}
	xs := make([]float64, v.Len())
	for i := range xs {
		xs[i] = c.Snap(v.At(i), 0)
	}
	sort.Float64s(xs)
	a.method("stemleaf")
	d := stemLeaf(xs, c.Name)
	a.res.Meta.N = len(xs)
	a.res.Meta.Outcome = "numeric"
	a.set("n", float64(len(xs)), Count, "")
	a.set("missing", float64(miss), Count, "")
	a.set("min", xs[0], Number, "")
	a.set("max", xs[len(xs)-1], Number, "")
	a.set("unit", d.unit, Number, "")
	a.set("lines", float64(len(d.lines)), Count, "")
	fs := &figures.Spec{Kind: figures.StemLeaf, Title: "Stem-and-leaf display of " + c.Name, Lines: d.lines, Legend: d.legend}
	fs.Desc = fmt.Sprintf("Stem-and-leaf display of %d values of %s from %s to %s; %s.", len(xs), c.Name, trimNum(xs[0]), trimNum(xs[len(xs)-1]), d.legend)
	a.res.Figure = fs
	return nil
}

type display struct {
	lines  []string
	legend string
	unit   float64
}

// stemLeaf builds the display of sorted values.
func stemLeaf(xs []float64, name string) display {
	n := len(xs)
	target := math.Max(5, math.Min(25, 10*math.Log10(float64(n))))
	lo, hi := xs[0], xs[n-1]
	rng := hi - lo
	if rng == 0 {
		rng = math.Max(math.Abs(hi), 1)
	}
	best := struct {
		k, m  int
		score float64
	}{0, 1, math.Inf(1)}
	top := int(math.Floor(math.Log10(rng)))
	for k := top - 3; k <= top+1; k++ {
		u := math.Pow(10, float64(k))
		for _, m := range []int{1, 2, 5} {
			lines := float64(lineIndex(hi, u, m)-lineIndex(lo, u, m)) + 1
			score := math.Abs(lines - target)
			if lines < 3 {
				score += 100
			}
			if score < best.score-1e-9 {
				best.k, best.m, best.score = k, m, score
			}
		}
	}
	u := math.Pow(10, float64(best.k))
	m := best.m
	first, last := lineIndex(lo, u, m), lineIndex(hi, u, m)
	leaves := make([][]byte, last-first+1)
	for _, x := range xs {
		_, leaf, _ := cut(x, u)
		li := lineIndex(x, u, m) - first
		leaves[li] = append(leaves[li], byte('0'+leaf))
	}
	labels := make([]string, len(leaves))
	width := 0
	for i := range leaves {
		labels[i] = lineLabel(first+i, m)
		width = max(width, len(labels[i]))
	}
	d := display{unit: u}
	for i, l := range leaves {
		d.lines = append(d.lines, fmt.Sprintf("%*s | %s", width, labels[i], l))
	}
	// A worked example from the data: the first value.
	stem, leaf, neg := cut(xs[0], u)
	sign := ""
	if neg {
		sign = "-"
	}
	shown := float64(stem*10+leaf) * u
	if neg {
		shown = -shown
	}
	d.legend = fmt.Sprintf("%s%d | %d means %s %s (leaf unit %s)", sign, stem, leaf, strconv.FormatFloat(shown, 'f', max(0, -best.k), 64), name, strconv.FormatFloat(u, 'f', max(0, -best.k), 64))
	if m > 1 {
		d.legend += fmt.Sprintf("; each stem takes %d lines", m)
	}
	return d
}

// cut splits |x| at leaf unit u into stem and leaf digits (truncating later
// digits, as Tukey does).
func cut(x, u float64) (stem, leaf int, neg bool) {
	neg = x < 0
	a := int(math.Floor(math.Abs(x)/u + 1e-9))
	return a / 10, a % 10, neg
}

// lineIndex numbers display lines in value order: with m lines per stem,
// the line of x. Negative values use their own lines below zero, "-0"
// included.
func lineIndex(x, u float64, m int) int {
	stem, leaf, neg := cut(x, u)
	part := leaf / (10 / m)
	if neg {
		return -(stem*m + part) - 1
	}
	return stem*m + part
}

// lineLabel is a line's stem as printed, with Tukey's markers for split
// stems: * for 0–4 and . for 5–9 (two lines); * t f s . (five lines).
func lineLabel(idx, m int) string {
	neg := idx < 0
	if neg {
		idx = -idx - 1
	}
	stem, part := idx/m, idx%m
	label := strconv.Itoa(stem)
	if neg {
		label = "-" + label
	}
	switch m {
	case 2:
		label += []string{"*", "."}[part]
	case 5:
		label += []string{"*", "t", "f", "s", "."}[part]
	}
	return strings.TrimSpace(label)
}
