package stats

import (
	"math"
	"testing"
)

// Anscombe's quartet: F. J. Anscombe (1973), "Graphs in statistical
// analysis", The American Statistician 27(1):17–21. The data and the
// summary values below are those of the paper, written here from memory of
// its widely reprinted table; the summary values also check the
// transcription. The paper gives, for each of the four sets: n = 11, mean
// of x 9.0, mean of y 7.5, regression line y = 3 + 0.5x, sum of squares
// of x - x̄ 110.0, regression sum of squares 27.50, residual sum of squares
// 13.75 (9 df), standard error of the slope 0.118, multiple R² 0.667. The
// variance of x follows as 110/10 = 11, that of y as (27.50 + 13.75)/10 =
// 4.125, and r as √0.667 ≈ 0.816. The sets were built to agree to two or
// three figures, not exactly, so each check allows the rounding of the
// published figure (the variance of y is 4.127, 4.128, 4.123 and 4.123).
var anscombe = []struct{ x, y []string }{
	{
		[]string{"10", "8", "13", "9", "11", "14", "6", "4", "12", "7", "5"},
		[]string{"8.04", "6.95", "7.58", "8.81", "8.33", "9.96", "7.24", "4.26", "10.84", "4.82", "5.68"},
	},
	{
		[]string{"10", "8", "13", "9", "11", "14", "6", "4", "12", "7", "5"},
		[]string{"9.14", "8.14", "8.74", "8.77", "9.26", "8.10", "6.13", "3.10", "9.13", "7.26", "4.74"},
	},
	{
		[]string{"10", "8", "13", "9", "11", "14", "6", "4", "12", "7", "5"},
		[]string{"7.46", "6.77", "12.74", "7.11", "7.81", "8.84", "6.08", "5.39", "8.15", "6.42", "5.73"},
	},
	{
		[]string{"8", "8", "8", "8", "8", "8", "8", "19", "8", "8", "8"},
		[]string{"6.58", "5.76", "7.71", "8.84", "8.47", "7.04", "5.25", "12.50", "5.56", "7.91", "6.89"},
	},
}

func TestAnscombe(t *testing.T) {
	within := func(set int, what string, got, want, tol float64) {
		t.Helper()
		if !(math.Abs(got-want) <= tol) {
			t.Errorf("set %d %s: got %.6g, Anscombe (1973) gives %g (±%g)", set+1, what, got, want, tol)
		}
	}
	for i, s := range anscombe {
		x, y := values(t, s.x), values(t, s.y)
		within(i, "mean x", Mean(x), 9, 1e-12)          // Anscombe (1973): 9.0
		within(i, "variance x", Variance(x), 11, 1e-12) // Anscombe (1973): 110.0/10
		within(i, "mean y", Mean(y), 7.50, 0.005)       // Anscombe (1973): 7.5, two decimals
		within(i, "variance y", Variance(y), 4.125, 0.003)
		c := Pearson(x, y, 0.95)
		within(i, "r", c.R, 0.816, 0.001) // Anscombe (1973): √0.667
		fit, err := OLS(y, []Values{x}, true, 0.95)
		if err != nil {
			t.Fatalf("set %d: %v", i+1, err)
		}
		within(i, "intercept", fit.Coef[0], 3.00, 0.005)         // Anscombe (1973): y = 3 + 0.5x
		within(i, "slope", fit.Coef[1], 0.500, 0.0005)           // Anscombe (1973)
		within(i, "slope SE", fit.SE[1], 0.118, 0.0005)          // Anscombe (1973): 0.118
		within(i, "R2", fit.R2, 0.667, 0.001)                    // Anscombe (1973): 0.667
		within(i, "residual SS", fit.SSR, 13.75, 0.05)           // Anscombe (1973): 13.75
		within(i, "regression SS", fit.SST-fit.SSR, 27.50, 0.05) // Anscombe (1973): 27.50
		if fit.DFResid != 9 {
			t.Errorf("set %d: residual df %d, Anscombe (1973) gives 9", i+1, fit.DFResid)
		}
	}
}
