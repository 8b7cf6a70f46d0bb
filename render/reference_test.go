package render

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"
)

// The reference values in testdata/reference/stats.json come from scipy,
// statsmodels and numpy (Debian's packages), written by
// testdata/reference/make_reference.py from invented inputs. blocks/stats
// checks its routines against them directly; the tests here run the same
// inputs through whole report blocks (CSV → loader → block → facts), so
// the numbers a reader sees are checked, not only the routines.

type refFile struct {
	Describe []struct {
		Name                                                  string
		X                                                     []float64
		N                                                     int
		Mean, SD, SE, Min, Q1, Median, Q3, Max, IQR, Skewness float64
		MeanLow                                               float64 `json:"mean_low"`
		MeanHigh                                              float64 `json:"mean_high"`
	}
	Welch []struct {
		Name                      string
		A, B                      []float64
		Diff, Low, High, P, T, DF float64
		Level                     float64
		CohenD                    float64 `json:"cohen_d"`
	}
	Anova []struct {
		Name            string
		Groups          [][]float64
		F, P, R2, Sigma float64
		SSBetween       float64 `json:"ss_between"`
		SSWithin        float64 `json:"ss_within"`
		MSBetween       float64 `json:"ms_between"`
		MSWithin        float64 `json:"ms_within"`
		DFBetween       float64 `json:"df_between"`
		DFWithin        float64 `json:"df_within"`
	}
	Chi2 []struct {
		Name           string
		Counts         [][]float64
		Chi2, DF, P, V float64
	}
	Proportions []struct {
		X1, N1, X2, N2 int
		Diff           float64
		DiffLow        float64 `json:"diff_low"`
		DiffHigh       float64 `json:"diff_high"`
		RiskRatio      float64 `json:"risk_ratio"`
		RiskLow        float64 `json:"risk_low"`
		RiskHigh       float64 `json:"risk_high"`
		OddsRatio      float64 `json:"odds_ratio"`
		OddsLow        float64 `json:"odds_low"`
		OddsHigh       float64 `json:"odds_high"`
		P, Z, Level    float64
	}
	Correlation []struct {
		Name                 string
		X, Y                 []float64
		R, Low, High, P, Rho float64
		Level                float64
	}
	OLS []struct {
		Name                   string
		Y                      []float64
		XS                     [][]float64
		Intercept              bool
		Coef, SE, P, Low, High []float64
		R2, F, Sigma           float64
		Level                  float64
		AdjR2                  float64 `json:"adj_r2"`
		FP                     float64 `json:"f_p"`
		Predict                []struct {
			X       []float64
			Fit     float64
			ObsLow  float64 `json:"obs_low"`
			ObsHigh float64 `json:"obs_high"`
		}
	}
}

func loadRef(t *testing.T) *refFile {
	t.Helper()
	b, err := os.ReadFile("../testdata/reference/stats.json")
	if err != nil {
		t.Fatal(err)
	}
	var r refFile
	if err := json.Unmarshal(b, &r); err != nil {
		t.Fatal(err)
	}
	return &r
}

func num(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// near compares at 1e-9 relative (absolute near zero); intervals built on
// Student's t quantiles get 1e-8, the accuracy the reference script reaches
// for them (see make_reference.py).
func near(t *testing.T, what string, got, want, tol float64) {
	t.Helper()
	if math.IsNaN(want) {
		if !math.IsNaN(got) {
			t.Errorf("%s = %v, want undefined", what, got)
		}
		return
	}
	if d := math.Abs(got - want); d > tol*math.Max(1, math.Abs(want)) {
		t.Errorf("%s = %.15g, want %.15g (scipy/statsmodels)", what, got, want)
	}
}

func buildBlock(t *testing.T, csv, block string) *Report {
	t.Helper()
	report := "---\ntitle: Reference\ndata:\n  d: data/d.csv\n---\n\n```candor b\n" + block + "\n```\n"
	path := writeReport(t, report, map[string]string{"data/d.csv": csv})
	rep, err := Build(path, Options{NoHTML: true})
	if err != nil {
		t.Fatal(err)
	}
	return rep
}

func (r *Report) fact(t *testing.T, name string) float64 {
	t.Helper()
	f, ok := r.Facts["b."+name]
	if !ok {
		t.Fatalf("no fact b.%s", name)
	}
	return f.Value
}

func TestReferenceSummary(t *testing.T) {
	for _, c := range loadRef(t).Describe {
		t.Run(c.Name, func(t *testing.T) {
			var b strings.Builder
			b.WriteString("x\n")
			for _, x := range c.X {
				b.WriteString(num(x) + "\n")
			}
			rep := buildBlock(t, b.String(), "summary: x")
			for name, want := range map[string]float64{"mean": c.Mean, "sd": c.SD, "se": c.SE, "min": c.Min, "q1": c.Q1,
				"median": c.Median, "q3": c.Q3, "max": c.Max, "iqr": c.IQR, "skewness": c.Skewness} {
				near(t, name, rep.fact(t, name), want, 1e-9)
			}
			near(t, "mean_low", rep.fact(t, "mean_low"), c.MeanLow, 1e-8)
			near(t, "mean_high", rep.fact(t, "mean_high"), c.MeanHigh, 1e-8)
			if rep.fact(t, "n") != float64(c.N) {
				t.Errorf("n = %v", rep.fact(t, "n"))
			}
		})
	}
}

// groupsCSV writes one row per value with its group's name.
func groupsCSV(groups [][]float64, names []string) string {
	var b strings.Builder
	b.WriteString("g,x\n")
	for i, g := range groups {
		for _, x := range g {
			fmt.Fprintf(&b, "%s,%s\n", names[i], num(x))
		}
	}
	return b.String()
}

func TestReferenceCompareMeans(t *testing.T) {
	ref := loadRef(t)
	for _, c := range ref.Welch {
		t.Run(c.Name, func(t *testing.T) {
			rep := buildBlock(t, groupsCSV([][]float64{c.A, c.B}, []string{"a", "b"}), "compare: x\nby: g\nreference: a")
			near(t, "diff", rep.fact(t, "diff"), c.Diff, 1e-9)
			near(t, "p", rep.fact(t, "p"), c.P, 1e-9)
			near(t, "t", rep.fact(t, "t"), c.T, 1e-9)
			near(t, "df", rep.fact(t, "df"), c.DF, 1e-9)
			near(t, "d", rep.fact(t, "d"), c.CohenD, 1e-9)
			if c.Level == 0.95 {
				near(t, "diff_low", rep.fact(t, "diff_low"), c.Low, 1e-8)
				near(t, "diff_high", rep.fact(t, "diff_high"), c.High, 1e-8)
			}
		})
	}
	for _, c := range ref.Anova {
		t.Run(c.Name, func(t *testing.T) {
			names := []string{"g1", "g2", "g3", "g4", "g5", "g6"}[:len(c.Groups)]
			rep := buildBlock(t, groupsCSV(c.Groups, names), "compare: x\nby: g")
			for name, want := range map[string]float64{"f": c.F, "p": c.P, "r2": c.R2, "sigma": c.Sigma, "ss_between": c.SSBetween,
				"ss_within": c.SSWithin, "ms_between": c.MSBetween, "ms_within": c.MSWithin, "df_between": c.DFBetween, "df_within": c.DFWithin} {
				near(t, name, rep.fact(t, name), want, 1e-9)
			}
		})
	}
}

func TestReferenceCompareProportions(t *testing.T) {
	for i, c := range loadRef(t).Proportions {
		t.Run(fmt.Sprint(i), func(t *testing.T) {
			var b strings.Builder
			b.WriteString("g,ok\n")
			for k := 0; k < c.N1; k++ {
				fmt.Fprintf(&b, "ref,%s\n", map[bool]string{true: "yes", false: "no"}[k < c.X1])
			}
			for k := 0; k < c.N2; k++ {
				fmt.Fprintf(&b, "new,%s\n", map[bool]string{true: "yes", false: "no"}[k < c.X2])
			}
			rep := buildBlock(t, b.String(), "compare: ok\nby: g\nreference: ref")
			// Differences are published in percentage points.
			near(t, "diff", rep.fact(t, "diff"), 100*c.Diff, 1e-9)
			for name, want := range map[string]float64{"ratio": c.RiskRatio, "odds_ratio": c.OddsRatio, "p": c.P, "z": c.Z} {
				near(t, name, rep.fact(t, name), want, 1e-9)
			}
			if c.Level == 0.95 {
				near(t, "diff_low", rep.fact(t, "diff_low"), 100*c.DiffLow, 1e-9)
				near(t, "diff_high", rep.fact(t, "diff_high"), 100*c.DiffHigh, 1e-9)
				for name, want := range map[string]float64{"ratio_low": c.RiskLow, "ratio_high": c.RiskHigh, "odds_low": c.OddsLow, "odds_high": c.OddsHigh} {
					near(t, name, rep.fact(t, name), want, 1e-9)
				}
			}
		})
	}
}

func TestReferenceCrosstab(t *testing.T) {
	for _, c := range loadRef(t).Chi2 {
		t.Run(c.Name, func(t *testing.T) {
			var b strings.Builder
			b.WriteString("r,c\n")
			for i, row := range c.Counts {
				for j, n := range row {
					for k := 0; k < int(n); k++ {
						fmt.Fprintf(&b, "r%d,c%d\n", i, j)
					}
				}
			}
			rep := buildBlock(t, b.String(), "crosstab: [r, c]")
			near(t, "chi2", rep.fact(t, "chi2"), c.Chi2, 1e-9)
			near(t, "p", rep.fact(t, "p"), c.P, 1e-9)
			near(t, "v", rep.fact(t, "v"), c.V, 1e-9)
			near(t, "df", rep.fact(t, "df"), c.DF, 0)
		})
	}
}

func TestReferenceCorrelation(t *testing.T) {
	for _, c := range loadRef(t).Correlation {
		t.Run(c.Name, func(t *testing.T) {
			var b strings.Builder
			b.WriteString("x,y\n")
			for i := range c.X {
				fmt.Fprintf(&b, "%s,%s\n", num(c.X[i]), num(c.Y[i]))
			}
			rep := buildBlock(t, b.String(), "correlation: [x, y]")
			for name, want := range map[string]float64{"r": c.R, "p": c.P, "rho": c.Rho} {
				near(t, name, rep.fact(t, name), want, 1e-9)
			}
			// Blocks report 95% intervals; cases at other levels check the
			// routine only (blocks/stats).
			if c.Level == 0.95 {
				near(t, "r_low", rep.fact(t, "r_low"), c.Low, 1e-9)
				near(t, "r_high", rep.fact(t, "r_high"), c.High, 1e-9)
			}
		})
	}
}

func TestReferenceRegression(t *testing.T) {
	for _, c := range loadRef(t).OLS {
		t.Run(c.Name, func(t *testing.T) {
			var b strings.Builder
			b.WriteString("y")
			var preds []string
			for j := range c.XS {
				preds = append(preds, fmt.Sprintf("x%d", j+1))
				b.WriteString(",x" + fmt.Sprint(j+1))
			}
			b.WriteString("\n")
			for i, y := range c.Y {
				b.WriteString(num(y))
				for j := range c.XS {
					b.WriteString("," + num(c.XS[j][i]))
				}
				b.WriteString("\n")
			}
			block := "regression: y\npredictors: [" + strings.Join(preds, ", ") + "]"
			if !c.Intercept {
				block += "\nintercept: false"
			}
			if len(c.Predict) > 0 {
				block += "\npredict:"
				for _, p := range c.Predict {
					var kv []string
					for j, x := range p.X {
						kv = append(kv, fmt.Sprintf("x%d: %s", j+1, num(x)))
					}
					block += "\n  - {" + strings.Join(kv, ", ") + "}"
				}
			}
			rep := buildBlock(t, b.String(), block)
			names := preds
			if c.Intercept {
				names = append([]string{"intercept"}, preds...)
			}
			for k, nm := range names {
				near(t, nm+".estimate", rep.fact(t, nm+".estimate"), c.Coef[k], 1e-9)
				near(t, nm+".se", rep.fact(t, nm+".se"), c.SE[k], 1e-9)
				near(t, nm+".p", rep.fact(t, nm+".p"), c.P[k], 1e-9)
				if c.Level == 0.95 {
					near(t, nm+".low", rep.fact(t, nm+".low"), c.Low[k], 1e-8)
					near(t, nm+".high", rep.fact(t, nm+".high"), c.High[k], 1e-8)
				}
			}
			for name, want := range map[string]float64{"r2": c.R2, "adj_r2": c.AdjR2, "f": c.F, "p": c.FP, "sigma": c.Sigma} {
				near(t, name, rep.fact(t, name), want, 1e-9)
			}
			for k, p := range c.Predict {
				pre := fmt.Sprintf("predict.%d.", k+1)
				near(t, pre+"estimate", rep.fact(t, pre+"estimate"), p.Fit, 1e-9)
				if c.Level == 0.95 {
					near(t, pre+"low", rep.fact(t, pre+"low"), p.ObsLow, 1e-8)
					near(t, pre+"high", rep.fact(t, pre+"high"), p.ObsHigh, 1e-8)
				}
			}
		})
	}
}

// TestReferencePairs: with three groups, the two that are not the
// reference are compared with each other too (A.B.diff is B minus A); the
// values are scipy's Welch test on those two samples.
func TestReferencePairs(t *testing.T) {
	for _, c := range loadRef(t).Welch {
		t.Run(c.Name, func(t *testing.T) {
			third := []float64{1, 2, 3, 4}
			rep := buildBlock(t, groupsCSV([][]float64{third, c.A, c.B}, []string{"r", "a", "b"}), "compare: x\nby: g\nreference: r")
			near(t, "a.b.diff", rep.fact(t, "a.b.diff"), c.Diff, 1e-9)
			near(t, "a.b.p_welch", rep.fact(t, "a.b.p_welch"), c.P, 1e-9)
			if c.Level == 0.95 {
				near(t, "a.b.diff_low", rep.fact(t, "a.b.diff_low"), c.Low, 1e-8)
			}
		})
	}
	for i, c := range loadRef(t).Proportions {
		t.Run(fmt.Sprint("proportions ", i), func(t *testing.T) {
			var b strings.Builder
			b.WriteString("g,ok\nr,yes\nr,no\n")
			for k := 0; k < c.N1; k++ {
				fmt.Fprintf(&b, "a,%s\n", map[bool]string{true: "yes", false: "no"}[k < c.X1])
			}
			for k := 0; k < c.N2; k++ {
				fmt.Fprintf(&b, "b,%s\n", map[bool]string{true: "yes", false: "no"}[k < c.X2])
			}
			rep := buildBlock(t, b.String(), "compare: ok\nby: g\nreference: r")
			near(t, "a.b.diff", rep.fact(t, "a.b.diff"), 100*c.Diff, 1e-9)
			near(t, "a.b.ratio", rep.fact(t, "a.b.ratio"), c.RiskRatio, 1e-9)
			near(t, "a.b.p_z", rep.fact(t, "a.b.p_z"), c.P, 1e-9)
		})
	}
}
