package stats

// Checks against scipy, statsmodels and numpy. The values come from
// testdata/reference/stats.json, written by
// testdata/reference/make_reference.py (which names the library function
// behind each value) on invented inputs. Unless a comment says otherwise the
// methods are exact formulas, compared at 1e-9 relative.

import (
	"encoding/json"
	"math"
	"os"
	"strconv"
	"testing"
)

const refTol = 1e-9

type reference struct {
	Versions map[string]string `json:"versions"`
	Describe []struct {
		Name                          string
		X                             []float64
		N                             int
		Mean, SD, SE, Min, Max        float64
		Q1, Median, Q3, IQR, Skewness float64
		MeanLow                       float64 `json:"mean_low"`
		MeanHigh                      float64 `json:"mean_high"`
	}
	Quantile []struct {
		Name    string
		X, P, Q []float64
	}
	Welch []struct {
		Name                             string
		A, B                             []float64
		Level, Diff, T, P, DF, Low, High float64
		CohenD                           float64 `json:"cohen_d"`
	}
	ANOVA []struct {
		Name      string
		Groups    [][]float64
		F, P      float64
		SSB       float64 `json:"ss_between"`
		SSW       float64 `json:"ss_within"`
		DFB       int     `json:"df_between"`
		DFW       int     `json:"df_within"`
		MSB       float64 `json:"ms_between"`
		MSW       float64 `json:"ms_within"`
		R2, Sigma float64
	}
	Chi2 []struct {
		Name        string
		Counts      [][]float64
		Chi2, P     float64
		DF          int
		Expected    [][]float64
		MinExpected float64 `json:"min_expected"`
		V, N        float64
	}
	Proportions []struct {
		X1, N1, X2, N2   int
		Level            float64
		Wilson1, Wilson2 []float64
		Diff             float64
		DiffLow          float64 `json:"diff_low"`
		DiffHigh         float64 `json:"diff_high"`
		RiskRatio        float64 `json:"risk_ratio"`
		RiskLow          float64 `json:"risk_low"`
		RiskHigh         float64 `json:"risk_high"`
		OddsRatio        float64 `json:"odds_ratio"`
		OddsLow          float64 `json:"odds_low"`
		OddsHigh         float64 `json:"odds_high"`
		Z, P             float64
	}
	NewcombeZero []struct {
		X1, N1, X2, N2 int
		Level, Diff    float64
		CI             []float64
	} `json:"newcombe_zero"`
	Wilson []struct {
		X, N  int
		Level float64
		CI    []float64
	}
	Correlation []struct {
		Name                   string
		X, Y                   []float64
		Level, R, P, Low, High float64
		Rho                    float64
	}
	OLS []struct {
		Name            string
		Y               []float64
		Xs              [][]float64
		Intercept       bool
		Level           float64
		Coef, SE, T, P  []float64
		Low, High       []float64
		R2              float64
		AdjR2           float64 `json:"adj_r2"`
		F               float64
		FP              float64 `json:"f_p"`
		Sigma           float64
		DFResid         int `json:"df_resid"`
		Cooks, Leverage []float64
		Predict         []struct {
			X        []float64
			Fit      float64
			ObsLow   float64 `json:"obs_low"`
			ObsHigh  float64 `json:"obs_high"`
			MeanLow  float64 `json:"mean_low"`
			MeanHigh float64 `json:"mean_high"`
		}
	}
	Dist struct {
		TTwoSided    [][]float64 `json:"t_two_sided"`
		TSF          [][]float64 `json:"t_sf"`
		TPPF         [][]float64 `json:"t_ppf"`
		FSF          [][]float64 `json:"f_sf"`
		Chi2SF       [][]float64 `json:"chi2_sf"`
		NormTwoSided [][]float64 `json:"norm_two_sided"`
		NormPPF      [][]float64 `json:"norm_ppf"`
	}
	Bins []struct {
		Name     string
		X        []float64
		RuleBins map[string]int `json:"rule_bins"`
		Equal    []struct {
			Count  int
			Edges  []float64
			Counts []int
		}
	}
}

func loadReference(t *testing.T) *reference {
	t.Helper()
	raw, err := os.ReadFile("../../testdata/reference/stats.json")
	if err != nil {
		t.Fatalf("reading the reference values (run testdata/reference/make_reference.py): %v", err)
	}
	var r reference
	if err := json.Unmarshal(raw, &r); err != nil {
		t.Fatal(err)
	}
	if len(r.Describe) == 0 || len(r.OLS) == 0 || len(r.Dist.TTwoSided) == 0 {
		t.Fatal("reference file is missing sections")
	}
	return &r
}

// textValues turns the JSON numbers into decimal text and reads them the way
// the loader reads a column.
func textValues(t *testing.T, xs []float64) Values {
	t.Helper()
	texts := make([]string, len(xs))
	for i, x := range xs {
		texts[i] = strconv.FormatFloat(x, 'g', -1, 64)
	}
	return values(t, texts)
}

// approx reports a relative difference above tol; a reference of exactly 0
// is compared absolutely at 1e-12.
func approx(t *testing.T, what string, got, want, tol float64) {
	t.Helper()
	if want == 0 {
		if math.Abs(got) > 1e-12 {
			t.Errorf("%s: got %.17g, want 0", what, got)
		}
		return
	}
	if d := math.Abs(got-want) / math.Abs(want); !(d <= tol) {
		t.Errorf("%s: got %.17g, want %.17g (relative difference %.2g > %.0g)", what, got, want, d, tol)
	}
}

// tIntervalTol is for interval ends that scipy or statsmodels build from
// scipy.stats.t.ppf, which (scipy 1.10) is accurate to only about 5e-9
// relative (see t_crit in make_reference.py): 1e-8 of the larger of the
// interval's width and the end's magnitude.
const tIntervalTol = 1e-8

func approxInterval(t *testing.T, what string, lo, hi, wantLo, wantHi float64) {
	t.Helper()
	w := math.Abs(wantHi - wantLo)
	for _, e := range [][2]float64{{lo, wantLo}, {hi, wantHi}} {
		if d := math.Abs(e[0] - e[1]); !(d <= tIntervalTol*math.Max(w, math.Abs(e[1]))) {
			t.Errorf("%s: got [%.17g, %.17g], want [%.17g, %.17g]", what, lo, hi, wantLo, wantHi)
			return
		}
	}
}

func approxAll(t *testing.T, what string, got, want []float64, tol float64) {
	t.Helper()
	if len(got) != len(want) {
		t.Errorf("%s: got %d values, want %d", what, len(got), len(want))
		return
	}
	for i := range got {
		approx(t, what+"["+strconv.Itoa(i)+"]", got[i], want[i], tol)
	}
}

func TestReferenceDescribe(t *testing.T) {
	ref := loadReference(t)
	for _, c := range ref.Describe {
		s := Describe(textValues(t, c.X))
		if s.N != c.N {
			t.Errorf("%s n: got %d, want %d", c.Name, s.N, c.N)
		}
		approx(t, c.Name+" mean", s.Mean, c.Mean, refTol)                                  // numpy mean
		approx(t, c.Name+" sd", s.SD, c.SD, refTol)                                        // numpy std(ddof=1)
		approx(t, c.Name+" se", s.SE, c.SE, refTol)                                        // scipy.stats.sem
		approx(t, c.Name+" min", s.Min, c.Min, refTol)                                     // numpy min
		approx(t, c.Name+" max", s.Max, c.Max, refTol)                                     // numpy max
		approx(t, c.Name+" q1", s.Q1, c.Q1, refTol)                                        // numpy percentile, linear (type 7)
		approx(t, c.Name+" median", s.Median, c.Median, refTol)                            // numpy median
		approx(t, c.Name+" q3", s.Q3, c.Q3, refTol)                                        // numpy percentile, linear (type 7)
		approx(t, c.Name+" iqr", s.IQR, c.IQR, refTol)                                     // scipy.stats.iqr
		approx(t, c.Name+" skewness", s.Skewness, c.Skewness, refTol)                      // scipy.stats.skew(bias=False)
		approxInterval(t, c.Name+" mean CI", s.MeanLow, s.MeanHigh, c.MeanLow, c.MeanHigh) // scipy.stats.t.interval
		lo, hi := MeanCI(textValues(t, c.X), 0.95)
		approxInterval(t, c.Name+" MeanCI", lo, hi, c.MeanLow, c.MeanHigh) // scipy.stats.t.interval
	}
}

func TestReferenceQuantile(t *testing.T) {
	ref := loadReference(t)
	for _, c := range ref.Quantile {
		for i, p := range c.P {
			// numpy.quantile(method="linear"), Hyndman and Fan type 7
			approx(t, c.Name+" q("+strconv.FormatFloat(p, 'g', -1, 64)+")", Quantile(c.X, p), c.Q[i], refTol)
		}
	}
}

func TestReferenceWelch(t *testing.T) {
	ref := loadReference(t)
	for _, c := range ref.Welch {
		w := Welch(textValues(t, c.A), textValues(t, c.B), c.Level)
		approx(t, c.Name+" diff", w.Diff, c.Diff, refTol)
		approx(t, c.Name+" t", w.T, c.T, refTol)                                                       // scipy.stats.ttest_ind(b, a, equal_var=False)
		approx(t, c.Name+" p", w.P, c.P, refTol)                                                       // scipy.stats.ttest_ind(b, a, equal_var=False)
		approx(t, c.Name+" df", w.DF, c.DF, refTol)                                                    // statsmodels CompareMeans.ttest_ind(usevar="unequal")
		approxInterval(t, c.Name+" CI", w.Low, w.High, c.Low, c.High)                                  // statsmodels CompareMeans.tconfint_diff(usevar="unequal")
		approx(t, c.Name+" cohen d", CohenD(textValues(t, c.A), textValues(t, c.B)), c.CohenD, refTol) // Cohen (1988) pooled-SD formula, computed with numpy
	}
}

func TestReferenceANOVA(t *testing.T) {
	ref := loadReference(t)
	for _, c := range ref.ANOVA {
		var gs []Values
		for _, g := range c.Groups {
			gs = append(gs, textValues(t, g))
		}
		a := OneWayANOVA(gs)
		approx(t, c.Name+" F", a.F, c.F, refTol) // scipy.stats.f_oneway
		approx(t, c.Name+" p", a.P, c.P, refTol) // scipy.stats.f_oneway
		// statsmodels anova_lm(ols("y ~ C(g)")) for the table
		approx(t, c.Name+" SS between", a.SSBetween, c.SSB, refTol)
		approx(t, c.Name+" SS within", a.SSWithin, c.SSW, refTol)
		approx(t, c.Name+" MS between", a.MSBetween, c.MSB, refTol)
		approx(t, c.Name+" MS within", a.MSWithin, c.MSW, refTol)
		approx(t, c.Name+" R2", a.R2, c.R2, refTol)
		approx(t, c.Name+" sigma", a.Sigma, c.Sigma, refTol)
		if a.DFBetween != c.DFB || a.DFWithin != c.DFW {
			t.Errorf("%s df: got %d, %d; want %d, %d", c.Name, a.DFBetween, a.DFWithin, c.DFB, c.DFW)
		}
	}
}

func TestReferenceChiSquare(t *testing.T) {
	ref := loadReference(t)
	for _, c := range ref.Chi2 {
		r := ChiSquareIndependence(c.Counts)
		approx(t, c.Name+" chi2", r.Chi2, c.Chi2, refTol) // scipy.stats.chi2_contingency(correction=False)
		approx(t, c.Name+" p", r.P, c.P, refTol)          // scipy.stats.chi2_contingency(correction=False)
		if r.DF != c.DF {
			t.Errorf("%s df: got %d, want %d", c.Name, r.DF, c.DF)
		}
		for i := range c.Expected {
			approxAll(t, c.Name+" expected row "+strconv.Itoa(i), r.Expected[i], c.Expected[i], refTol) // scipy expected freq
		}
		approx(t, c.Name+" min expected", r.MinExpected, c.MinExpected, refTol)
		approx(t, c.Name+" V", r.CramersV, c.V, refTol) // scipy.stats.contingency.association(method="cramer")
		approx(t, c.Name+" N", r.N, c.N, refTol)
	}
}

func TestReferenceProportions(t *testing.T) {
	ref := loadReference(t)
	for _, c := range ref.Proportions {
		name := strconv.Itoa(c.X1) + "/" + strconv.Itoa(c.N1) + " vs " + strconv.Itoa(c.X2) + "/" + strconv.Itoa(c.N2)
		r := TwoProportions(c.X1, c.N1, c.X2, c.N2, c.Level)
		if len(r.Reason) != 0 {
			t.Errorf("%s: unexpected reasons %v", name, r.Reason)
		}
		l1, u1 := Wilson(c.X1, c.N1, c.Level)
		l2, u2 := Wilson(c.X2, c.N2, c.Level)
		approxAll(t, name+" wilson 1", []float64{l1, u1}, c.Wilson1, refTol) // statsmodels proportion_confint(method="wilson")
		approxAll(t, name+" wilson 2", []float64{l2, u2}, c.Wilson2, refTol)
		approx(t, name+" diff", r.Diff, c.Diff, refTol)
		approx(t, name+" diff low", r.DiffLow, c.DiffLow, refTol)    // statsmodels confint_proportions_2indep(method="newcomb")
		approx(t, name+" diff high", r.DiffHigh, c.DiffHigh, refTol) // idem
		approx(t, name+" risk ratio", r.RiskRatio, c.RiskRatio, refTol)
		approx(t, name+" risk low", r.RiskLow, c.RiskLow, refTol)    // statsmodels confint_proportions_2indep(method="log", compare="ratio"), Katz
		approx(t, name+" risk high", r.RiskHigh, c.RiskHigh, refTol) // idem
		approx(t, name+" odds ratio", r.OddsRatio, c.OddsRatio, refTol)
		approx(t, name+" odds low", r.OddsLow, c.OddsLow, refTol)    // statsmodels confint_proportions_2indep(method="logit", compare="odds-ratio"), Woolf
		approx(t, name+" odds high", r.OddsHigh, c.OddsHigh, refTol) // idem
		approx(t, name+" z", r.Z, c.Z, refTol)                       // statsmodels proportions_ztest (pooled)
		approx(t, name+" p", r.P, c.P, refTol)                       // statsmodels proportions_ztest (pooled)
	}
	for _, c := range ref.NewcombeZero {
		r := TwoProportions(c.X1, c.N1, c.X2, c.N2, c.Level)
		name := strconv.Itoa(c.X1) + "/" + strconv.Itoa(c.N1) + " vs " + strconv.Itoa(c.X2) + "/" + strconv.Itoa(c.N2)
		approx(t, name+" diff", r.Diff, c.Diff, refTol)
		approxAll(t, name+" Newcombe", []float64{r.DiffLow, r.DiffHigh}, c.CI, refTol) // statsmodels confint_proportions_2indep(method="newcomb")
	}
	for _, c := range ref.Wilson {
		lo, hi := Wilson(c.X, c.N, c.Level)
		approxAll(t, "wilson "+strconv.Itoa(c.X)+"/"+strconv.Itoa(c.N), []float64{lo, hi}, c.CI, refTol) // statsmodels proportion_confint(method="wilson")
	}
}

func TestReferenceCorrelation(t *testing.T) {
	ref := loadReference(t)
	for _, c := range ref.Correlation {
		x, y := textValues(t, c.X), textValues(t, c.Y)
		r := Pearson(x, y, c.Level)
		approx(t, c.Name+" r", r.R, c.R, refTol)                // scipy.stats.pearsonr
		approx(t, c.Name+" p", r.P, c.P, refTol)                // scipy.stats.pearsonr
		approx(t, c.Name+" low", r.Low, c.Low, refTol)          // scipy pearsonr(...).confidence_interval (Fisher z)
		approx(t, c.Name+" high", r.High, c.High, refTol)       // idem
		approx(t, c.Name+" rho", Spearman(x, y), c.Rho, refTol) // scipy.stats.spearmanr
	}
}

func TestReferenceOLS(t *testing.T) {
	ref := loadReference(t)
	for _, c := range ref.OLS {
		var xs []Values
		for _, x := range c.Xs {
			xs = append(xs, textValues(t, x))
		}
		fit, err := OLS(textValues(t, c.Y), xs, c.Intercept, c.Level)
		if err != nil {
			t.Errorf("%s: %v", c.Name, err)
			continue
		}
		// statsmodels OLS results, this block
		approxAll(t, c.Name+" coef", fit.Coef, c.Coef, refTol)
		approxAll(t, c.Name+" se", fit.SE, c.SE, refTol)
		approxAll(t, c.Name+" t", fit.T, c.T, refTol)
		approxAll(t, c.Name+" p", fit.P, c.P, refTol)
		for i := range c.Low {
			approxInterval(t, c.Name+" CI "+strconv.Itoa(i), fit.Low[i], fit.High[i], c.Low[i], c.High[i]) // statsmodels conf_int (t.ppf)
		}
		approx(t, c.Name+" r2", fit.R2, c.R2, refTol)
		approx(t, c.Name+" adj r2", fit.AdjR2, c.AdjR2, refTol)
		approx(t, c.Name+" F", fit.F, c.F, refTol)
		approx(t, c.Name+" F p", fit.FP, c.FP, refTol)
		approx(t, c.Name+" sigma", fit.Sigma, c.Sigma, refTol)
		if fit.DFResid != c.DFResid {
			t.Errorf("%s df resid: got %d, want %d", c.Name, fit.DFResid, c.DFResid)
		}
		approxAll(t, c.Name+" cooks", fit.Cooks, c.Cooks, refTol)          // statsmodels OLSInfluence.cooks_distance
		approxAll(t, c.Name+" leverage", fit.Leverage, c.Leverage, refTol) // statsmodels OLSInfluence.hat_matrix_diag
		for i, p := range c.Predict {
			fv, lo, hi := fit.Predict(p.X, 0.95)
			w := c.Name + " predict " + strconv.Itoa(i+1)
			approx(t, w+" fit", fv, p.Fit, refTol)                   // statsmodels get_prediction().summary_frame mean
			approxInterval(t, w+" obs", lo, hi, p.ObsLow, p.ObsHigh) // summary_frame obs_ci_lower/upper (t.ppf)
			_, lo, hi = fit.PredictMean(p.X, 0.95)
			approxInterval(t, w+" mean", lo, hi, p.MeanLow, p.MeanHigh) // summary_frame mean_ci_lower/upper (t.ppf)
		}
	}
}

func TestReferenceDistributions(t *testing.T) {
	ref := loadReference(t)
	d := ref.Dist
	for _, r := range d.TTwoSided {
		approx(t, "t two-sided", tTwoSided(r[0], r[1]), r[2], refTol) // 2·scipy.stats.t.sf
	}
	for _, r := range d.TSF {
		approx(t, "t sf", tSurvival(r[0], r[1]), r[2], refTol) // scipy.stats.t.sf
	}
	for _, r := range d.TPPF {
		approx(t, "t ppf", tCrit(2*r[0]-1, r[1]), r[2], refTol) // root of scipy.stats.t.sf (t_crit in the script)
	}
	for _, r := range d.FSF {
		approx(t, "F sf", fSurvival(r[0], r[1], r[2]), r[3], refTol) // scipy.stats.f.sf
	}
	for _, r := range d.Chi2SF {
		approx(t, "chi2 sf", chi2Survival(r[0], r[1]), r[2], refTol) // scipy.stats.chi2.sf
	}
	for _, r := range d.NormTwoSided {
		approx(t, "normal two-sided", normTwoSided(r[0]), r[1], refTol) // 2·scipy.stats.norm.sf
	}
	for _, r := range d.NormPPF {
		approx(t, "normal ppf", zCrit(2*r[0]-1), r[1], refTol) // scipy.stats.norm.ppf
	}
}

func TestReferenceBins(t *testing.T) {
	ref := loadReference(t)
	for _, c := range ref.Bins {
		v := textValues(t, c.X)
		s := Describe(v)
		for rule, want := range c.RuleBins {
			// numpy.histogram_bin_edges(bins=rule): ceil(range/width) bins
			got := int(math.Ceil((s.Max - s.Min) / BinWidth(v, rule)))
			if rule == "fd" && BinWidth(v, rule) == 0 {
				t.Errorf("%s fd: zero width", c.Name)
				continue
			}
			if got != want {
				t.Errorf("%s %s: rule width gives %d bins, numpy %d", c.Name, rule, got, want)
			}
			// nice edges cover the data with at most one bin more than the raw rule
			e := BinEdges(v, rule, 0)
			if len(e) < 2 || e[0] > s.Min || e[len(e)-1] < s.Max || len(e)-1 > want+1 {
				t.Errorf("%s %s: nice edges %v do not cover [%v, %v] in at most %d bins", c.Name, rule, e, s.Min, s.Max, want+1)
			}
		}
		for _, eq := range c.Equal {
			e := BinEdges(v, "count", eq.Count)
			approxAll(t, c.Name+" equal edges", e, eq.Edges, 1e-12) // numpy.histogram_bin_edges(bins=k)
			got := CountBins(v, eq.Edges)
			if len(got) != len(eq.Counts) {
				t.Errorf("%s counts: got %v, want %v", c.Name, got, eq.Counts)
				continue
			}
			for i := range got {
				if got[i] != eq.Counts[i] { // numpy.histogram counts
					t.Errorf("%s counts: got %v, want %v", c.Name, got, eq.Counts)
					break
				}
			}
		}
	}
}
