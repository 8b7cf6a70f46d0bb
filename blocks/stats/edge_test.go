package stats

import (
	"errors"
	"math"
	"reflect"
	"testing"
)

// Degenerate inputs: nothing may panic; undefined results are NaN with a
// reason, defined ones keep their value. Expected values here are worked by
// hand from the definitions.

func isNaN(xs ...float64) bool {
	for _, x := range xs {
		if !math.IsNaN(x) {
			return false
		}
	}
	return true
}

func hasReason(t *testing.T, r Reasons, fields ...string) {
	t.Helper()
	for _, f := range fields {
		if r[f] == "" {
			t.Errorf("no reason for %s in %v", f, r)
		}
	}
}

func TestDescribeEdges(t *testing.T) {
	s := Describe(Values{})
	if s.N != 0 || !isNaN(s.Mean, s.SD, s.SE, s.Min, s.Max, s.Q1, s.Median, s.Q3, s.IQR, s.Skewness, s.MeanLow, s.MeanHigh) {
		t.Errorf("empty: %+v", s)
	}
	hasReason(t, s.Reason, "Mean", "SD", "Median")

	// all missing is the same as empty
	s = Describe(Values{Offset: 3, D: []float64{math.NaN(), math.NaN()}})
	if s.N != 0 || !isNaN(s.Mean) {
		t.Errorf("all missing: %+v", s)
	}

	s = Describe(values(t, []string{"42.5"}))
	if s.N != 1 || s.Mean != 42.5 || s.Min != 42.5 || s.Max != 42.5 || s.Median != 42.5 || s.Q1 != 42.5 || s.IQR != 0 {
		t.Errorf("one value: %+v", s)
	}
	if !isNaN(s.SD, s.SE, s.MeanLow, s.MeanHigh, s.Skewness) {
		t.Errorf("one value: spread should be undefined: %+v", s)
	}
	hasReason(t, s.Reason, "SD", "Skewness")

	s = Describe(values(t, []string{"1000000000000.3", "1000000000000.3", "1000000000000.3", "1000000000000.3"}))
	if s.N != 4 || s.Mean != 1000000000000.3 || s.SD != 0 || s.SE != 0 || s.IQR != 0 || s.MeanLow != s.Mean || s.MeanHigh != s.Mean {
		t.Errorf("all equal: %+v", s)
	}
	if !math.IsNaN(s.Skewness) || s.Reason["Skewness"] != "all values are equal" {
		t.Errorf("all equal: skewness %v, reason %q", s.Skewness, s.Reason["Skewness"])
	}

	// missing values are skipped: mean of 1, 2, 6 is 3, SD 2.6457513110645907 (√7)
	s = Describe(Values{D: []float64{1, math.NaN(), 2, 6, math.NaN()}})
	if s.N != 3 || s.Mean != 3 || math.Abs(s.SD-math.Sqrt(7)) > 1e-15 || s.Median != 2 {
		t.Errorf("with missing: %+v", s)
	}
}

func TestQuantileEdges(t *testing.T) {
	if !isNaN(Quantile(nil, 0.5), Quantile([]float64{1, 2}, -0.1), Quantile([]float64{1, 2}, 1.1), Quantile([]float64{1}, math.NaN())) {
		t.Error("undefined quantiles should be NaN")
	}
	x := []float64{1, 2, 4, 8}
	// type 7: h = 3p; p = 0.5 -> 2 + 0.5·(4-2) = 3; p = 1/3 -> h = 1 -> 2
	for _, c := range []struct{ p, want float64 }{{0, 1}, {1, 8}, {0.5, 3}, {1.0 / 3, 2}, {0.25, 1.75}, {0.9, 6.8}} {
		if got := Quantile(x, c.p); math.Abs(got-c.want) > 1e-15 {
			t.Errorf("Quantile(%v) = %v, want %v", c.p, got, c.want)
		}
	}
	if Quantile([]float64{7}, 0.3) != 7 {
		t.Error("single value")
	}
}

func TestBinEdges(t *testing.T) {
	x := values(t, []string{"1.2", "3.4", "2.2", "7.9", "5.5", "6.1", "4.4", "9.0", "2.8", "3.3"})
	// Sturges: 7.8/(log2 10 + 1) = 1.805 -> nice step 2
	if got, want := BinEdges(x, "sturges", 0), []float64{0, 2, 4, 6, 8, 10}; !reflect.DeepEqual(got, want) {
		t.Errorf("sturges edges %v, want %v", got, want)
	}
	// exact decimal edges: a step of 0.25 and of 0.1 give the float64
	// nearest each decimal multiple
	y := values(t, []string{"0.31", "0.52", "0.47", "0.94", "0.66", "0.38", "0.71", "0.45", "0.58", "0.62", "0.49", "0.55"})
	e := BinEdges(y, "sturges", 0) // 0.63/(log2 12 + 1) = 0.1374 -> 0.2
	if want := []float64{0.2, 0.4, 0.6, 0.8, 1}; !reflect.DeepEqual(e, want) {
		t.Errorf("decimal edges %v, want %v", e, want)
	}
	if st := chooseStep(0.0999999); st.edge(3) != 0.3 {
		t.Errorf("step 0.1: edge 3 = %.17g, want the float64 nearest 0.3", st.edge(3))
	}
	if st := chooseStep(0.21); st.edge(1) != 0.25 || st.edge(3) != 0.75 {
		t.Errorf("step for 0.21: %v", st.edge(1))
	}
	if st := chooseStep(3.2); st.edge(1) != 5 {
		t.Errorf("step for 3.2: %v", st.edge(1))
	}
	if st := chooseStep(60); st.edge(1) != 100 {
		t.Errorf("step for 60: %v", st.edge(1))
	}
	// deterministic
	if !reflect.DeepEqual(BinEdges(x, "fd", 0), BinEdges(x, "fd", 0)) {
		t.Error("fd edges differ between calls")
	}
	// fixed count: equal widths from min to max
	if got, want := BinEdges(x, "count", 3), []float64{1.2, 1.2 + 2.6, 1.2 + 2*2.6, 9}; len(got) != 4 || got[3] != 9 || math.Abs(got[1]-want[1]) > 1e-15 || math.Abs(got[2]-want[2]) > 1e-15 {
		t.Errorf("count edges %v, want %v", got, want)
	}
	// degenerate inputs
	if BinEdges(Values{}, "sturges", 0) != nil || BinEdges(x, "nope", 5) != nil || BinEdges(x, "count", 0) != nil {
		t.Error("no values, an unknown rule or count 0 should give nil")
	}
	if got := BinEdges(values(t, []string{"4", "4", "4"}), "scott", 0); !reflect.DeepEqual(got, []float64{3.5, 4.5}) {
		t.Errorf("equal values: %v", got)
	}
	if got := BinEdges(values(t, []string{"4", "4"}), "count", 2); !reflect.DeepEqual(got, []float64{3.5, 4, 4.5}) {
		t.Errorf("equal values, 2 bins: %v", got)
	}
	// zero IQR falls back to Sturges: quartiles equal, range 1
	z := values(t, []string{"5", "5", "5", "5", "5", "5", "5", "6"})
	if BinWidth(z, "fd") != 0 {
		t.Errorf("fd width %v, want 0", BinWidth(z, "fd"))
	}
	if got := BinEdges(z, "fd", 0); !reflect.DeepEqual(got, BinEdges(z, "sturges", 0)) {
		t.Errorf("fd with zero IQR: %v", got)
	}
}

func TestCountBins(t *testing.T) {
	edges := []float64{0, 2, 4, 6, 8, 10}
	v := Plain([]float64{0, 1.999, 2, 4, 10, 9.99, -0.1, 10.1, math.NaN()})
	// [0,2): 0, 1.999; [2,4): 2; [4,6): 4; [6,8): none; [8,10]: 9.99, 10
	if got, want := CountBins(v, edges), []int{2, 1, 1, 0, 2}; !reflect.DeepEqual(got, want) {
		t.Errorf("counts %v, want %v", got, want)
	}
	if CountBins(v, []float64{1}) != nil || CountBins(v, []float64{0, 2, 2, 3}) != nil || CountBins(v, []float64{3, 1}) != nil {
		t.Error("bad edges should give nil")
	}
	// offsets: values near 10^12 land in the bins of their exact decimals
	w := values(t, []string{"1000000000000.1", "1000000000000.2", "1000000000000.3"})
	if got := CountBins(w, []float64{1000000000000.1, 1000000000000.2, 1000000000000.3}); !reflect.DeepEqual(got, []int{1, 2}) {
		t.Errorf("shifted counts %v, want [1 2]", got)
	}
}

func TestChiSquareEdges(t *testing.T) {
	// an empty row is left out: the same test as without it
	a := ChiSquareIndependence([][]float64{{5, 3}, {0, 0}, {2, 7}})
	b := ChiSquareIndependence([][]float64{{5, 3}, {2, 7}})
	if a.DF != 1 || a.Chi2 != b.Chi2 || a.P != b.P || a.CramersV != b.CramersV || a.N != 17 {
		t.Errorf("empty row: %+v vs %+v", a, b)
	}
	if a.Expected[1][0] != 0 || a.Expected[1][1] != 0 {
		t.Errorf("expected counts of the empty row: %v", a.Expected[1])
	}
	// one row: no test
	c := ChiSquareIndependence([][]float64{{4, 6, 1}})
	if !isNaN(c.Chi2, c.P, c.CramersV) || c.DF != 0 || c.MinExpected != 1 {
		t.Errorf("one row: %+v", c)
	}
	hasReason(t, c.Reason, "Chi2", "P")
	// no counts at all, an empty table, a negative count
	for _, tab := range [][][]float64{{{0, 0}, {0, 0}}, nil, {{1, -1}, {2, 3}}, {{1, math.NaN()}, {2, 3}}} {
		r := ChiSquareIndependence(tab)
		if !isNaN(r.Chi2, r.P, r.CramersV) {
			t.Errorf("%v: %+v", tab, r)
		}
		hasReason(t, r.Reason, "Chi2")
	}
	// independence exactly: chi2 = 0, p = 1
	r := ChiSquareIndependence([][]float64{{10, 20}, {30, 60}})
	if r.Chi2 != 0 || r.P != 1 || r.CramersV != 0 {
		t.Errorf("independent table: %+v", r)
	}
}

func TestWelchEdges(t *testing.T) {
	a := values(t, []string{"3", "4", "5"})
	r := Welch(a, Values{}, 0.95)
	if !isNaN(r.MeanB, r.Diff, r.T, r.P, r.DF) || r.MeanA != 4 {
		t.Errorf("empty group: %+v", r)
	}
	hasReason(t, r.Reason, "MeanB", "T")
	r = Welch(a, values(t, []string{"7"}), 0.95)
	if r.Diff != 3 || !isNaN(r.SE, r.T, r.P, r.Low, r.SDB) {
		t.Errorf("group of one: %+v", r)
	}
	hasReason(t, r.Reason, "T", "SDB")
	r = Welch(values(t, []string{"2", "2"}), values(t, []string{"5", "5", "5"}), 0.95)
	if r.Diff != 3 || r.SE != 0 || !isNaN(r.T, r.P, r.DF) {
		t.Errorf("no spread: %+v", r)
	}
	hasReason(t, r.Reason, "T")
	r = Welch(a, values(t, []string{"6", "8", "7"}), 1.5)
	if r.Diff != 3 || math.IsNaN(r.T) || !isNaN(r.Low, r.High) {
		t.Errorf("bad level: %+v", r)
	}
	if !isNaN(CohenD(values(t, []string{"2", "2"}), values(t, []string{"5", "5"})), CohenD(a, Values{})) {
		t.Error("Cohen's d without pooled spread or with an empty group should be NaN")
	}
	// pooled SD of {3,4,5} and {6,7,8} is 1, difference 3
	if d := CohenD(a, values(t, []string{"6", "7", "8"})); d != 3 {
		t.Errorf("Cohen's d = %v, want 3", d)
	}
}

func TestANOVAEdges(t *testing.T) {
	one := OneWayANOVA([]Values{values(t, []string{"1", "2", "3"})})
	if one.Groups != 1 || one.DFBetween != 0 || one.SSBetween != 0 || one.SSWithin != 2 || !isNaN(one.F, one.P, one.MSBetween) {
		t.Errorf("one group: %+v", one)
	}
	hasReason(t, one.Reason, "F")
	// an empty group is left out
	a := OneWayANOVA([]Values{values(t, []string{"1", "2", "3"}), {}, values(t, []string{"4", "5", "6"})})
	b := OneWayANOVA([]Values{values(t, []string{"1", "2", "3"}), values(t, []string{"4", "5", "6"})})
	if a.Groups != 2 || a.F != b.F || a.P != b.P || a.DFBetween != 1 || !math.IsNaN(a.Means[1]) || a.Ns[1] != 0 {
		t.Errorf("empty group: %+v", a)
	}
	// SSB = 3·(2-3.5)² + 3·(5-3.5)² = 13.5, SSW = 4, F = 13.5/(4/4) = 13.5
	if a.SSBetween != 13.5 || a.SSWithin != 4 || a.F != 13.5 {
		t.Errorf("worked example: %+v", a)
	}
	// groups of one: no within-group variation to test against
	c := OneWayANOVA([]Values{values(t, []string{"1"}), values(t, []string{"4"})})
	if c.DFWithin != 0 || !isNaN(c.MSWithin, c.F, c.Sigma) || c.SSBetween != 4.5 {
		t.Errorf("groups of one: %+v", c)
	}
	if n := OneWayANOVA(nil); n.N != 0 || !isNaN(n.F, n.SSWithin) {
		t.Errorf("no groups: %+v", n)
	}
	// groups read with different offsets give the same table
	g1 := values(t, []string{"1000000.1", "1000000.3", "1000000.2"})
	g2 := values(t, []string{"999999.9", "1000000.0", "1000000.4"})
	g2b := values(t, []string{"1000000.1", "999999.9", "1000000.0", "1000000.4"}).Subset([]int{1, 2, 3})
	x, y := OneWayANOVA([]Values{g1, g2}), OneWayANOVA([]Values{g1, g2b})
	if g2.Offset == g2b.Offset || math.Abs(x.SSBetween-y.SSBetween) > 1e-15 || math.Abs(x.SSWithin-y.SSWithin) > 1e-15 {
		t.Errorf("offsets: %+v vs %+v", x, y)
	}
}

func TestProportionEdges(t *testing.T) {
	r := TwoProportions(0, 25, 4, 30, 0.95)
	if !isNaN(r.RiskRatio, r.RiskLow, r.OddsRatio, r.OddsLow) || r.Reason["RiskRatio"] != "no successes in the reference group" {
		t.Errorf("no reference successes: %+v", r)
	}
	if math.IsNaN(r.DiffLow) || math.IsNaN(r.Z) || r.P1 != 0 {
		t.Errorf("the difference and the z-test stay defined: %+v", r)
	}
	r = TwoProportions(5, 20, 0, 18, 0.95)
	if r.RiskRatio != 0 || r.OddsRatio != 0 || !isNaN(r.RiskLow, r.RiskHigh, r.OddsLow, r.OddsHigh) {
		t.Errorf("no comparison successes: %+v", r)
	}
	hasReason(t, r.Reason, "RiskLow", "OddsLow")
	r = TwoProportions(0, 10, 0, 12, 0.95)
	if !isNaN(r.Z, r.P, r.RiskRatio, r.OddsRatio) || r.Diff != 0 {
		t.Errorf("no successes at all: %+v", r)
	}
	hasReason(t, r.Reason, "Z", "RiskRatio")
	// every reference member a success: infinite reference odds, odds
	// ratio 0 without an interval
	r = TwoProportions(12, 12, 9, 10, 0.95)
	if r.OddsRatio != 0 || !isNaN(r.OddsLow, r.OddsHigh) || math.IsNaN(r.Z) {
		t.Errorf("all reference members successes: %+v", r)
	}
	hasReason(t, r.Reason, "OddsLow")
	if math.IsNaN(r.RiskRatio) || math.Abs(r.RiskRatio-0.9) > 1e-15 {
		t.Errorf("risk ratio %v, want 0.9", r.RiskRatio)
	}
	r = TwoProportions(3, 0, 2, 5, 0.95) // more successes than members
	if !isNaN(r.P1, r.P2, r.Diff, r.Z) {
		t.Errorf("bad counts: %+v", r)
	}
	hasReason(t, r.Reason, "P1", "P2")
	r = TwoProportions(0, 0, 2, 5, 0.95)
	if !math.IsNaN(r.P1) || r.P2 != 0.4 || r.Reason["P2"] != "" {
		t.Errorf("empty reference group: %+v", r)
	}
	hasReason(t, r.Reason, "P1", "Diff")
	if lo, hi := Wilson(0, 0, 0.95); !isNaN(lo, hi) {
		t.Error("Wilson with n = 0")
	}
	if lo, hi := Wilson(3, 10, 1); !isNaN(lo, hi) {
		t.Error("Wilson with level 1")
	}
}

func TestCorrelationEdges(t *testing.T) {
	c := Pearson(values(t, []string{"1", "2", "3"}), values(t, []string{"5", "5", "5"}), 0.95)
	if !isNaN(c.R, c.P) || c.Reason["R"] != "y is constant" {
		t.Errorf("constant y: %+v", c)
	}
	c = Pearson(values(t, []string{"1", "2"}), values(t, []string{"3", "1"}), 0.95)
	if c.R != -1 || !isNaN(c.P, c.Low) {
		t.Errorf("two pairs: %+v", c)
	}
	c = Pearson(values(t, []string{"1", "2", "4"}), values(t, []string{"2", "4", "8"}), 0.95)
	if c.R != 1 || c.P != 0 || !isNaN(c.Low, c.High) {
		t.Errorf("three pairs on a line: %+v", c)
	}
	c = Pearson(values(t, []string{"1", "2"}), values(t, []string{"1"}), 0.95)
	if !math.IsNaN(c.R) {
		t.Error("length mismatch")
	}
	// incomplete pairs are dropped
	x := Values{D: []float64{1, 2, math.NaN(), 4, 5, 6}}
	y := Values{D: []float64{2, 1, 7, math.NaN(), 4, 7}}
	full := Pearson(Plain([]float64{1, 2, 5, 6}), Plain([]float64{2, 1, 4, 7}), 0.95)
	if got := Pearson(x, y, 0.95); got.N != 4 || got.R != full.R || got.P != full.P {
		t.Errorf("pairwise complete: %+v vs %+v", got, full)
	}
	if !math.IsNaN(Spearman(values(t, []string{"1", "1"}), values(t, []string{"1", "2"}))) {
		t.Error("Spearman with a constant variable")
	}
	if got := Ranks(Values{D: []float64{10, 20, 10, math.NaN(), 5}}); !reflect.DeepEqual(got[:3], []float64{2.5, 4, 2.5}) || !math.IsNaN(got[3]) || got[4] != 1 {
		t.Errorf("ranks %v", got)
	}
}

func TestOLSErrors(t *testing.T) {
	y := values(t, []string{"3.1", "4.2", "5.0", "6.3", "6.9", "8.4"})
	x1 := values(t, []string{"1.10", "2.35", "2.90", "4.05", "5.20", "6.15"})
	x2 := values(t, []string{"0.45", "0.12", "0.88", "0.31", "0.67", "0.29"})
	// x3 = x1 + x2 exactly in decimal (a total of two parts)
	x3 := values(t, []string{"1.55", "2.47", "3.78", "4.36", "5.87", "6.44"})
	other := values(t, []string{"7", "3", "9", "1", "4", "4"})

	var ce *CollinearError
	_, err := OLS(y, []Values{other, x1, x2, x3}, true, 0.95)
	if !errors.As(err, &ce) || !reflect.DeepEqual(ce.Columns, []int{1, 2, 3}) {
		t.Errorf("x3 = x1 + x2: got %v, want CollinearError on columns [1 2 3]", err)
	}
	twice := values(t, []string{"2.20", "4.70", "5.80", "8.10", "10.40", "12.30"})
	_, err = OLS(y, []Values{x1, other, twice}, true, 0.95)
	if !errors.As(err, &ce) || !reflect.DeepEqual(ce.Columns, []int{0, 2}) {
		t.Errorf("duplicate column: got %v, want CollinearError on columns [0 2]", err)
	}
	_, err = OLS(y, []Values{x1, twice}, false, 0.95)
	if !errors.As(err, &ce) || !reflect.DeepEqual(ce.Columns, []int{0, 1}) {
		t.Errorf("duplicate column without intercept: got %v", err)
	}

	var ke *ConstantError
	_, err = OLS(y, []Values{x1, values(t, []string{"2.5", "2.5", "2.5", "2.5", "2.5", "2.5"})}, true, 0.95)
	if !errors.As(err, &ke) || ke.Column != 1 || ke.Value != 2.5 {
		t.Errorf("constant predictor: got %v", err)
	}
	_, err = OLS(y, []Values{Plain(make([]float64, 6))}, false, 0.95)
	if !errors.As(err, &ke) || ke.Column != 0 {
		t.Errorf("zero predictor without intercept: got %v", err)
	}

	var re *TooFewRowsError
	short := values(t, []string{"1", "2", "3"})
	_, err = OLS(short, []Values{short.Subset([]int{2, 0, 1}), values(t, []string{"5", "3", "8"}), values(t, []string{"1", "1", "0"})}, true, 0.95)
	if !errors.As(err, &re) || re.Rows != 3 || re.Coefficients != 4 {
		t.Errorf("more predictors than rows: got %v", err)
	}
	_, err = OLS(Values{}, nil, true, 0.95)
	if !errors.As(err, &re) {
		t.Errorf("no rows: got %v", err)
	}

	var de *DataError
	_, err = OLS(y, []Values{short}, true, 0.95)
	if !errors.As(err, &de) || de.Column != 0 {
		t.Errorf("length mismatch: got %v", err)
	}
	_, err = OLS(Values{D: []float64{1, 2, math.NaN(), 4}}, []Values{Plain([]float64{1, 2, 3, 5})}, true, 0.95)
	if !errors.As(err, &de) || de.Column != -1 || de.Row != 2 {
		t.Errorf("missing outcome: got %v", err)
	}
	_, err = OLS(y, nil, false, 0.95)
	if !errors.As(err, &de) {
		t.Errorf("no terms: got %v", err)
	}
	_, err = OLS(y, []Values{Plain([]float64{1e200, 2e200, 3e200, 1e200, 5e200, 4e200})}, true, 0.95)
	if !errors.As(err, &de) || de.Column != 0 {
		t.Errorf("overflowing predictor: got %v", err)
	}
	for _, e := range []error{&CollinearError{Columns: []int{1, 2}}, &ConstantError{Column: 1, Value: 2}, &TooFewRowsError{3, 4}, &DataError{Column: 2, Row: 5, Msg: "x"}} {
		if e.Error() == "" {
			t.Errorf("%T has no message", e)
		}
	}
}

func TestOLSSmallCases(t *testing.T) {
	// intercept only: the mean and its standard error
	y := values(t, []string{"2", "4", "9"})
	f, err := OLS(y, nil, true, 0.95)
	if err != nil {
		t.Fatal(err)
	}
	if f.Coef[0] != 5 || math.Abs(f.SE[0]-math.Sqrt(13.0/3)) > 1e-15 || f.R2 != 0 || !math.IsNaN(f.F) {
		t.Errorf("intercept only: coef %v se %v R2 %v F %v", f.Coef, f.SE, f.R2, f.F)
	}
	lo, hi := MeanCI(y, 0.95)
	if math.Abs(f.Low[0]-lo) > 1e-13 || math.Abs(f.High[0]-hi) > 1e-13 {
		t.Errorf("intercept CI [%v, %v], mean CI [%v, %v]", f.Low[0], f.High[0], lo, hi)
	}
	// as many coefficients as rows: exact fit, no inference
	f, err = OLS(values(t, []string{"1", "3"}), []Values{values(t, []string{"0", "1"})}, true, 0.95)
	if err != nil {
		t.Fatal(err)
	}
	if f.Coef[0] != 1 || f.Coef[1] != 2 || f.DFResid != 0 || !isNaN(f.SE[0], f.SE[1], f.Sigma, f.F) || f.R2 != 1 {
		t.Errorf("exact fit: %+v", f)
	}
	hasReason(t, f.Reason, "SE", "Sigma")
	if fv, lo, hi := f.Predict([]float64{2}, 0.95); fv != 5 || !isNaN(lo, hi) {
		t.Errorf("exact fit prediction %v [%v, %v]", fv, lo, hi)
	}
	// constant outcome: R² undefined, coefficients 0
	f, err = OLS(values(t, []string{"4", "4", "4", "4"}), []Values{values(t, []string{"1", "2", "3", "5"})}, true, 0.95)
	if err != nil {
		t.Fatal(err)
	}
	if f.Coef[0] != 4 || f.Coef[1] != 0 || !isNaN(f.R2, f.F) || f.Sigma != 0 {
		t.Errorf("constant outcome: %+v", f)
	}
	hasReason(t, f.Reason, "R2")
	if fv, _, _ := f.Predict([]float64{1, 2}, 0.95); !math.IsNaN(fv) {
		t.Error("Predict with the wrong number of values should be NaN")
	}
}

func TestValuesHelpers(t *testing.T) {
	v := values(t, []string{"10.5", "12.25", "9"})
	if v.Offset != 10 || v.At(1) != 12.25 || v.Len() != 3 {
		t.Errorf("values %+v", v)
	}
	s := v.Subset([]int{2, 0})
	if s.Offset != 10 || s.At(0) != 9 || s.At(1) != 10.5 || s.Len() != 2 {
		t.Errorf("subset %+v", s)
	}
	p := Pow(v, 2)
	for i, want := range []float64{110.25, 150.0625, 81} {
		if p.At(i) != want {
			t.Errorf("Pow(2) at %d = %v, want %v", i, p.At(i), want)
		}
	}
	if p.Offset != 110 || p.Lo == nil {
		t.Errorf("Pow offset %v", p.Offset)
	}
	if z := Pow(v, 0); z.At(0) != 1 || z.At(2) != 1 {
		t.Errorf("Pow(0) %+v", z)
	}
	// the low-order part keeps what a float64 power would lose:
	// 1.1^2 is 1.21 only to 53 bits; Pow keeps the exact square of the float
	x := Plain([]float64{1.1})
	sq := Pow(x, 2)
	hi, lo := twoProd(1.1, 1.1)
	if got := ddAddF(dd{sq.D[0], sq.Lo[0]}, sq.Offset); got != ddFrom(hi, lo) || lo == 0 {
		t.Errorf("Pow keeps %v + %v + %v, want %v + %v", sq.Offset, sq.D[0], sq.Lo[0], hi, lo)
	}
	pr := Product(v, Plain([]float64{2, 4, 0.5}))
	if pr.At(0) != 21 || pr.At(1) != 49 || pr.At(2) != 4.5 {
		t.Errorf("Product %v %v %v", pr.At(0), pr.At(1), pr.At(2))
	}
	if Product(v, Plain([]float64{1})).Len() != 0 {
		t.Error("Product of unequal lengths")
	}
	if m := Pow(Values{D: []float64{math.NaN(), 2}}, 3); !math.IsNaN(m.At(0)) || m.At(1) != 8 {
		t.Errorf("Pow of missing: %v %v", m.At(0), m.At(1))
	}
	if got := Sum(values(t, []string{"1000000000000.4", "1000000000000.3", "-0.5"})); got != 2000000000000.2 {
		t.Errorf("Sum = %.17g, want 2000000000000.2", got)
	}
	if Sum(Values{}) != 0 || Proportion(3, 4) != 0.75 || !isNaN(Proportion(1, 0), Proportion(5, 4), Proportion(-1, 4)) {
		t.Error("Sum of nothing or Proportion")
	}
	if got := Plain([]float64{1, 2}).Floats(); !reflect.DeepEqual(got, []float64{1, 2}) {
		t.Errorf("Floats %v", got)
	}
}
