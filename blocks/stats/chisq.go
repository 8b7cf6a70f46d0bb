package stats

import "math"

// ChiSquare is Pearson's chi-square test of independence for a table of
// counts.
type ChiSquare struct {
	Chi2        float64     // Σ (O - E)²/E
	DF          int         // (r' - 1)(c' - 1) over the non-empty rows and columns
	P           float64     // upper tail of chi-square with DF degrees of freedom
	Expected    [][]float64 // row total × column total / N, same shape as the input
	MinExpected float64     // smallest expected count over the non-empty rows and columns
	CramersV    float64     // √(Chi2 / (N·(min(r', c') - 1)))
	N           float64     // total count
	Reason      Reasons
}

// ChiSquareIndependence is Pearson's (1900) chi-square test of independence
// without continuity correction (scipy.stats.chi2_contingency with
// correction=False), with Cramér's (1946) V as the effect size. Rows or
// columns whose total is zero carry no information and are left out of
// the statistic, its degrees of freedom and V (their expected counts are
// 0); fewer than two non-empty rows or columns leave the test undefined.
// Ragged rows are read as if padded with zeros. Negative or non-finite
// counts make every result NaN.
func ChiSquareIndependence(counts [][]float64) ChiSquare {
	nan := math.NaN()
	res := ChiSquare{Chi2: nan, P: nan, MinExpected: nan, CramersV: nan}
	r := len(counts)
	c := 0
	for _, row := range counts {
		c = max(c, len(row))
	}
	rowT := make([]float64, r)
	colT := make([]float64, c)
	var tot ddSum
	for i, row := range counts {
		for j, x := range row {
			if !(x >= 0) || math.IsInf(x, 0) {
				res.Reason.set("a count is negative or not a number", "Chi2", "P", "MinExpected", "CramersV")
				return res
			}
			rowT[i] += x
			colT[j] += x
			tot.add(x)
		}
	}
	n := tot.s.float()
	res.N = n
	res.Expected = make([][]float64, r)
	for i := range res.Expected {
		res.Expected[i] = make([]float64, c)
		for j := range res.Expected[i] {
			if n > 0 {
				res.Expected[i][j] = rowT[i] * colT[j] / n
			}
		}
	}
	rows, cols := 0, 0
	for _, t := range rowT {
		if t > 0 {
			rows++
		}
	}
	for _, t := range colT {
		if t > 0 {
			cols++
		}
	}
	if rows < 2 || cols < 2 {
		why := "the table needs at least two non-empty rows and two non-empty columns"
		if n == 0 {
			why = "the table has no counts"
		}
		res.Reason.set(why, "Chi2", "P", "MinExpected", "CramersV")
		if n > 0 {
			res.MinExpected = minPositiveExpected(res.Expected, rowT, colT)
			delete(res.Reason, "MinExpected")
		}
		return res
	}
	var chi ddSum
	for i := range rowT {
		if rowT[i] == 0 {
			continue
		}
		for j := range colT {
			if colT[j] == 0 {
				continue
			}
			o := 0.0
			if j < len(counts[i]) {
				o = counts[i][j]
			}
			e := res.Expected[i][j]
			d := o - e
			chi.add(d * d / e)
		}
	}
	res.Chi2 = chi.s.float()
	res.DF = (rows - 1) * (cols - 1)
	res.P = chi2Survival(res.Chi2, float64(res.DF))
	res.MinExpected = minPositiveExpected(res.Expected, rowT, colT)
	res.CramersV = math.Sqrt(res.Chi2 / (n * float64(min(rows, cols)-1)))
	return res
}

func minPositiveExpected(e [][]float64, rowT, colT []float64) float64 {
	m := math.Inf(1)
	for i := range e {
		for j := range e[i] {
			if rowT[i] > 0 && colT[j] > 0 {
				m = math.Min(m, e[i][j])
			}
		}
	}
	return m
}
