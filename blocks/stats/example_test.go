package stats_test

import (
	"fmt"

	"candor/blocks/stats"
)

func ExampleParseValues() {
	v, err := stats.ParseValues([]string{"1000000000000.4", "1000000000000.3", "1000000000000.5"})
	if err != nil {
		panic(err)
	}
	s := stats.Describe(v)
	fmt.Println(v.Offset, v.D[0])
	fmt.Printf("mean %.1f, sd %.15f\n", s.Mean, s.SD)
	// Output:
	// 1e+12 0.4
	// mean 1000000000000.4, sd 0.100000000000000
}

func ExampleTwoProportions() {
	// 18 of 60 renewed on the monthly plan (the reference), 27 of 55 on the
	// yearly one; the same case is checked against statsmodels in
	// TestReferenceProportions.
	r := stats.TwoProportions(18, 60, 27, 55, 0.95)
	fmt.Printf("diff %.1f points (%.1f to %.1f)\n", 100*r.Diff, 100*r.DiffLow, 100*r.DiffHigh)
	fmt.Printf("risk ratio %.2f (%.2f to %.2f)\n", r.RiskRatio, r.RiskLow, r.RiskHigh)

	r = stats.TwoProportions(0, 25, 4, 30, 0.95)
	fmt.Println(r.RiskRatio, r.Reason["RiskRatio"])
	// Output:
	// diff 19.1 points (1.3 to 35.4)
	// risk ratio 1.64 (1.02 to 2.62)
	// NaN no successes in the reference group
}

func ExampleOLS() {
	y, _ := stats.ParseValues([]string{"21.5", "30.2", "18.9", "44.0", "33.1", "49.8"})
	x, _ := stats.ParseValues([]string{"3", "5", "2", "8", "6", "9"})
	fit, err := stats.OLS(y, []stats.Values{x}, true, 0.95)
	if err != nil {
		panic(err)
	}
	fv, lo, hi := fit.Predict([]float64{7}, 0.95)
	fmt.Printf("y = %.3f + %.3f x, R² %.4f\n", fit.Coef[0], fit.Coef[1], fit.R2)
	fmt.Printf("at x = 7: %.2f (95%% prediction interval %.2f to %.2f)\n", fv, lo, hi)
	// Output:
	// y = 8.592 + 4.423 x, R² 0.9884
	// at x = 7: 39.55 (95% prediction interval 35.04 to 44.06)
}
