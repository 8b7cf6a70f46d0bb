package stats

// The moment and order-statistic forms of the descriptive statistics and
// tests (Moments, Quartiles, Tally, BinSample): the same NIST StRD sets and
// scipy values as the Values forms, reached through sums about a centre as
// a database computes them, through value counts, and through two halves
// combined.

import (
	"math"
	"math/big"
	"slices"
	"sort"
	"strconv"
	"strings"
	"testing"
)

// decimalsOf is the most digits after the point among texts.
func decimalsOf(texts ...string) int {
	d := 0
	for _, t := range texts {
		if k := strings.IndexByte(t, '.'); k >= 0 && len(t)-k-1 > d {
			d = len(t) - k - 1
		}
	}
	return d
}

func ratOf(t *testing.T, text string) *big.Rat {
	t.Helper()
	r, ok := new(big.Rat).SetString(text)
	if !ok {
		t.Fatalf("%q is not a number", text)
	}
	return r
}

func decimalOf(t *testing.T, text string) Decimal {
	t.Helper()
	d, err := ParseDecimal(text)
	if err != nil {
		t.Fatal(err)
	}
	return d
}

// viaSums gives the moments of texts as a database would send them: the
// exact sums of the first three powers of the deviations from a centre,
// the mean rounded to six more decimals than the data have (as an AVG of a
// NUMERIC column is).
func viaSums(t *testing.T, texts []string) Moments {
	t.Helper()
	dec := decimalsOf(texts...)
	sum := new(big.Rat)
	for _, x := range texts {
		sum.Add(sum, ratOf(t, x))
	}
	centre := new(big.Rat).Quo(sum, new(big.Rat).SetInt64(int64(len(texts)))).FloatString(dec + 6)
	c := ratOf(t, centre)
	s := [3]*big.Rat{new(big.Rat), new(big.Rat), new(big.Rat)}
	for _, x := range texts {
		d := new(big.Rat).Sub(ratOf(t, x), c)
		p := new(big.Rat).Set(d)
		for k := 0; k < 3; k++ {
			s[k].Add(s[k], p)
			p.Mul(p, d)
		}
	}
	prec := 3 * (dec + 6) // every sum is exact at this many decimals
	return MomentsFromSums(len(texts), decimalOf(t, centre),
		decimalOf(t, s[0].FloatString(prec)), decimalOf(t, s[1].FloatString(prec)), decimalOf(t, s[2].FloatString(prec)))
}

// viaTally gives texts as their distinct values with counts.
func viaTally(t *testing.T, texts []string) Tally {
	t.Helper()
	idx := map[string]int{}
	var distinct []string
	var counts []int
	for _, x := range texts {
		i, ok := idx[x]
		if !ok {
			i = len(distinct)
			idx[x] = i
			distinct = append(distinct, x)
			counts = append(counts, 0)
		}
		counts[i]++
	}
	v, err := ParseValuesExact(distinct)
	if err != nil {
		t.Fatal(err)
	}
	return NewTally(v, counts)
}

// NIST StRD univariate summary statistics: the certified mean and SD of all
// nine sets from database sums, from value counts and from two halves.
func TestNISTUnivariateMoments(t *testing.T) {
	for _, name := range []string{"PiDigits", "Lottery", "Lew", "Mavro", "Michelso", "NumAcc1", "NumAcc2", "NumAcc3", "NumAcc4"} {
		t.Run(name, func(t *testing.T) {
			f := readNIST(t, "univariate/"+name+".dat")
			mean := num(t, f.find(t, `Sample Mean\s+ybar:\s+(\S+)`)[0])
			sd := num(t, f.find(t, `Sample Standard Deviation \(denom. = n-1\)\s+s:\s+(\S+)`)[0])
			texts := f.column(t, 0)
			v := values(t, texts)
			whole := Describe(v)
			c := &lreCheck{t: t, set: name, want: 9, low: 15}

			s := DescribeMoments(viaSums(t, texts), QuartilesOf(v))
			c.check("mean from sums", s.Mean, mean) // NIST StRD certified ybar
			c.check("sd from sums", s.SD, sd)       // NIST StRD certified s

			tl := viaTally(t, texts)
			if tl.N() != len(texts) {
				t.Errorf("tally of %d values, want %d", tl.N(), len(texts))
			}
			s = DescribeMoments(tl.Moments(), tl.Quartiles())
			c.check("mean from counts", s.Mean, mean) // NIST StRD certified ybar
			c.check("sd from counts", s.SD, sd)       // NIST StRD certified s
			for _, q := range [][3]float64{{s.Min, whole.Min}, {s.Q1, whole.Q1}, {s.Median, whole.Median}, {s.Q3, whole.Q3}, {s.Max, whole.Max}} {
				approx(t, name+" order statistic from counts", q[0], q[1], 1e-15) // Describe's type 7 quartiles of the same values
			}

			h := len(texts) / 2
			m := CombineMoments(MomentsOf(values(t, texts[:h])), MomentsOf(values(t, texts[h:])))
			s = DescribeMoments(m, QuartilesOf(v))
			c.check("mean of two halves", s.Mean, mean) // NIST StRD certified ybar
			c.check("sd of two halves", s.SD, sd)       // NIST StRD certified s
			if !math.IsNaN(whole.Skewness) {
				approx(t, name+" skewness of two halves", s.Skewness, whole.Skewness, 1e-9) // Describe's G1 of the whole set
			}
			t.Logf("%s: min LRE %.1f", name, c.low)
		})
	}
}

// NIST StRD one-way analysis of variance, all eleven sets, with each
// group's moments from database sums and from value counts.
func TestNISTANOVAMoments(t *testing.T) {
	for _, name := range nistANOVASets {
		t.Run(name, func(t *testing.T) {
			set := readANOVA(t, name)
			var sums, counts []Moments
			for _, l := range set.order {
				texts := make([]string, len(set.rows[l]))
				for k, i := range set.rows[l] {
					texts[k] = set.resp[i]
				}
				sums = append(sums, viaSums(t, texts))
				counts = append(counts, viaTally(t, texts).Moments())
			}
			t.Logf("%s from sums: min LRE %.1f", name, set.check(t, name+" from sums", OneWayANOVAMoments(sums)))
			t.Logf("%s from counts: min LRE %.1f", name, set.check(t, name+" from counts", OneWayANOVAMoments(counts)))
		})
	}
}

func TestReferenceWelchMoments(t *testing.T) {
	ref := loadReference(t)
	texts := func(xs []float64) []string {
		out := make([]string, len(xs))
		for i, x := range xs {
			out[i] = strconv.FormatFloat(x, 'g', -1, 64)
		}
		return out
	}
	for _, c := range ref.Welch {
		a, b := texts(c.A), texts(c.B)
		w := WelchMoments(viaSums(t, a), viaSums(t, b), c.Level)
		approx(t, c.Name+" diff from sums", w.Diff, c.Diff, refTol)
		approx(t, c.Name+" t from sums", w.T, c.T, refTol)                      // scipy.stats.ttest_ind(b, a, equal_var=False)
		approx(t, c.Name+" p from sums", w.P, c.P, refTol)                      // scipy.stats.ttest_ind(b, a, equal_var=False)
		approx(t, c.Name+" df from sums", w.DF, c.DF, refTol)                   // statsmodels CompareMeans.ttest_ind(usevar="unequal")
		approxInterval(t, c.Name+" CI from sums", w.Low, w.High, c.Low, c.High) // statsmodels CompareMeans.tconfint_diff(usevar="unequal")
		d := CohenDMoments(viaTally(t, a).Moments(), viaTally(t, b).Moments())
		approx(t, c.Name+" cohen d from counts", d, c.CohenD, refTol) // Cohen (1988) pooled-SD formula, computed with numpy
	}
}

func TestQuartilesFrom(t *testing.T) {
	for _, c := range []struct {
		n     int
		ranks []int
	}{
		{0, nil}, {1, []int{0}}, {2, []int{0, 1}}, {3, []int{0, 1, 2}}, {5, []int{1, 2, 3, 4}},
		{10, []int{2, 3, 4, 5, 6, 7}}, {101, []int{25, 26, 50, 51, 75, 76}},
	} {
		if got := QuartileRanks(c.n); !slices.Equal(got, c.ranks) {
			t.Errorf("QuartileRanks(%d) = %v, want %v", c.n, got, c.ranks)
		}
	}
	// 1..10: h = 9p, so Q1 = x[2] + 0.25(x[3] - x[2]) = 3.25, the median
	// 5.5 and Q3 = 7.75 (Hyndman and Fan type 7, numpy's "linear").
	x := []float64{7, 3, 10, 1, 5, 9, 2, 8, 4, 6}
	v := Values{Offset: 5, D: make([]float64, len(x))}
	for i := range x {
		v.D[i] = x[i] - 5
	}
	q := QuartilesOf(v)
	if q.Offset != 5 || q.Min != -4 || q.Q1 != -1.75 || q.Median != 0.5 || q.Q3 != 2.75 || q.Max != 5 {
		t.Errorf("QuartilesOf(1..10) = %+v, want offset 5 and -4, -1.75, 0.5, 2.75, 5", q)
	}
	sorted := append([]float64(nil), x...)
	sort.Float64s(sorted)
	asked := map[int]bool{}
	got := QuartilesFrom(len(sorted), 5, func(r int) float64 { asked[r] = true; return sorted[r] - 5 })
	if got != q {
		t.Errorf("QuartilesFrom = %+v, want %+v", got, q)
	}
	supplied := map[int]bool{0: true, len(sorted) - 1: true}
	for _, r := range QuartileRanks(len(sorted)) {
		supplied[r] = true
	}
	for r := range asked {
		if !supplied[r] {
			t.Errorf("QuartilesFrom asked for rank %d, which is neither an extreme nor in QuartileRanks", r)
		}
	}
	if s := DescribeMoments(MomentsOf(v), q); s.Q1 != 3.25 || s.Median != 5.5 || s.Q3 != 7.75 || s.IQR != 4.5 || s.Mean != 5.5 {
		t.Errorf("DescribeMoments: %+v", s)
	}
}

// A tally's bins and box plot are the written-out sample's.
func TestTally(t *testing.T) {
	// 1, 1, 1, 2, 10: Q1 = 1, Q3 = 2, fences -0.5 and 3.5, so the whiskers
	// run from 1 to 2 and 10 is an outlier (Tukey 1977).
	tl := NewTally(Plain([]float64{10, 1, 2, 1, math.NaN()}), []int{1, 2, 1, 1, 4})
	if tl.N() != 5 {
		t.Fatalf("N = %d, want 5", tl.N())
	}
	s := DescribeMoments(tl.Moments(), tl.Quartiles())
	if s.Q1 != 1 || s.Median != 1 || s.Q3 != 2 || s.Mean != 3 || s.Min != 1 || s.Max != 10 {
		t.Errorf("summary %+v, want Q1 1, median 1, Q3 2, mean 3, min 1, max 10", s)
	}
	lo, hi := s.Fences()
	if lo != -0.5 || hi != 3.5 {
		t.Errorf("fences %g, %g; want -0.5, 3.5", lo, hi)
	}
	w := tl.Whiskers(lo, hi, -1)
	if w.Low != 1 || w.High != 2 || len(w.Outliers) != 1 || w.Outliers[0] != 10 || w.Hidden != 0 {
		t.Errorf("whiskers %+v, want 1 to 2 with the outlier 10", w)
	}
	if w := tl.Whiskers(lo, hi, 0); len(w.Outliers) != 0 || w.Hidden != 1 {
		t.Errorf("with no outliers listed: %+v, want one hidden", w)
	}
	if c := tl.CountBins([]float64{0, 5, 10}); !slices.Equal(c, []int{4, 1}) {
		t.Errorf("bins [0, 5), [5, 10]: %v, want [4 1]", c)
	}

	ref := loadReference(t)
	for _, c := range ref.Bins {
		v := textValues(t, c.X)
		texts := make([]string, len(c.X))
		for i, x := range c.X {
			texts[i] = strconv.FormatFloat(x, 'g', -1, 64)
		}
		tl := viaTally(t, texts)
		for _, rule := range []string{"sturges", "scott", "fd"} {
			edges := BinEdges(v, rule, 0)
			if got := BinEdgesFor(BinSampleOf(v, rule), rule, 0); !slices.Equal(got, edges) {
				t.Errorf("%s %s: BinEdgesFor %v, BinEdges %v", c.Name, rule, got, edges)
			}
			if got, want := tl.CountBins(edges), CountBins(v, edges); !slices.Equal(got, want) {
				t.Errorf("%s %s: tally counts %v, want %v", c.Name, rule, got, want)
			}
		}
		s := Describe(v)
		lo, hi := s.Fences()
		got, want := tl.Whiskers(lo, hi, -1), BoxWhiskers(v, lo, hi)
		if got.Low != want.Low || got.High != want.High || !slices.Equal(got.Outliers, want.Outliers) {
			t.Errorf("%s: tally whiskers %+v, want %+v", c.Name, got, want)
		}
	}
}

// BinEdgesFor on a sample known only by its size, extremes and range:
// Sturges' width 9.4/(log2 100 + 1) ≈ 1.23 rounds up to the step 2.
func TestBinEdgesFor(t *testing.T) {
	b := BinSample{N: 100, Min: 0.3, Max: 9.7, Range: 9.4, SD: math.NaN(), IQR: math.NaN()}
	if got := BinEdgesFor(b, "sturges", 0); !slices.Equal(got, []float64{0, 2, 4, 6, 8, 10}) {
		t.Errorf("sturges: %v, want 0, 2, …, 10", got)
	}
	// Scott's rule without its SD falls back to Sturges'.
	if got := BinEdgesFor(b, "scott", 0); !slices.Equal(got, []float64{0, 2, 4, 6, 8, 10}) {
		t.Errorf("scott without an SD: %v, want Sturges' edges", got)
	}
	// Freedman–Diaconis: 2·4/100^(1/3) ≈ 1.72, step 2 as well; with an IQR
	// of 1, 0.43, step 0.5.
	b.IQR = 1
	if got := BinEdgesFor(b, "fd", 0); len(got) != 21 || got[0] != 0 || got[1] != 0.5 || got[20] != 10 {
		t.Errorf("fd: %v, want 0, 0.5, …, 10", got)
	}
	got := BinEdgesFor(b, "", 4)
	if len(got) != 5 || got[0] != 0.3 || got[4] != 9.7 {
		t.Fatalf("4 equal bins: %v, want 5 edges from 0.3 to 9.7", got)
	}
	for i := 1; i < 5; i++ {
		if w := got[i] - got[i-1]; math.Abs(w-2.35) > 1e-12 {
			t.Errorf("4 equal bins: %v, want widths of 2.35", got)
		}
	}
	if got := BinEdgesFor(BinSample{}, "sturges", 0); got != nil {
		t.Errorf("no values: %v, want nil", got)
	}
}

func TestFloatDecimal(t *testing.T) {
	for _, c := range []struct {
		f    float64
		want string
	}{
		{0.1, "1000000000000000055511151231257827021181583404541015625e-55"},
		{-2.5, "-25e-1"},
		{3, "3"},
		{1 << 60, "1152921504606846976"},
		{0, "0"},
	} {
		d := FloatDecimal(c.f)
		if d.String() != c.want {
			t.Errorf("FloatDecimal(%g) = %s, want %s", c.f, d.String(), c.want)
		}
		if d.Float() != c.f {
			t.Errorf("FloatDecimal(%g).Float() = %g", c.f, d.Float())
		}
	}
	for _, f := range []float64{math.SmallestNonzeroFloat64, math.MaxFloat64, 16.342857142857143} {
		if got := FloatDecimal(f).Float(); got != f {
			t.Errorf("FloatDecimal(%g) reads back as %g", f, got)
		}
	}
}

// ParseValuesExact keeps each value to about 106 bits about a large offset,
// so that At is the float64 nearest to the text.
func TestParseValuesExact(t *testing.T) {
	texts := []string{"1000000000000.4", "1.4", "0.1", "-3.75", "12345678.123456789", "1e3", "1000000000001", "0.3000000000000000444"}
	v, err := ParseValuesExact(texts)
	if err != nil {
		t.Fatal(err)
	}
	if v.Offset != 1e12 {
		t.Fatalf("offset %g, want 1e12", v.Offset)
	}
	for i, text := range texts {
		want, _ := strconv.ParseFloat(text, 64)
		if got := v.At(i); got != want {
			t.Errorf("%s: At = %.17g, want %.17g", text, got, want)
		}
		exact := ratOf(t, text)
		exact.Sub(exact, new(big.Rat).SetFloat64(v.Offset))
		got := new(big.Rat).Add(new(big.Rat).SetFloat64(v.D[i]), new(big.Rat).SetFloat64(v.Lo[i]))
		diff, _ := new(big.Rat).Sub(got, exact).Float64()
		size, _ := exact.Float64()
		if math.Abs(diff) > 0x1p-100*math.Abs(size) {
			t.Errorf("%s: D + Lo is %g away from the exact difference %g", text, diff, size)
		}
	}
}
