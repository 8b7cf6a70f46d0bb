package stats

// Accuracy against the NIST Statistical Reference Datasets (StRD),
// https://www.itl.nist.gov/div898/strd/, kept byte for byte under
// testdata/nist-strd. Accuracy is measured as the log relative error of
// McCullough (1998, "Assessing the reliability of statistical software,
// Part I", The American Statistician 52(4)):
// LRE = -log10(|est - cert|/|cert|), or -log10(|est|) when cert is 0,
// capped at the 15 digits NIST certifies.

import (
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

const nistDir = "../../testdata/nist-strd"

// nistFile is one StRD file split into lines, with CRLF and trailing
// blanks removed, and its data block located from its own header line
// ("Data : lines 61 to 260" or "Data (lines 61 to 142)").
type nistFile struct {
	name   string
	lines  []string // 1-based line i is lines[i-1]
	header []string // every line before the data
	data   [][]string
}

var dataLinesRE = regexp.MustCompile(`^\s*Data\s*:?\s*\(?lines\s+(\d+)\s+to\s+(\d+)`)

func readNIST(t *testing.T, rel string) nistFile {
	t.Helper()
	raw, err := os.ReadFile(filepath.Join(nistDir, rel))
	if err != nil {
		t.Fatalf("reading NIST file: %v", err)
	}
	f := nistFile{name: rel}
	for _, l := range strings.Split(string(raw), "\n") {
		f.lines = append(f.lines, strings.TrimRight(l, "\r \t"))
	}
	from, to := 0, 0
	for _, l := range f.lines[:60] {
		if m := dataLinesRE.FindStringSubmatch(l); m != nil {
			from, _ = strconv.Atoi(m[1])
			to, _ = strconv.Atoi(m[2])
			break
		}
	}
	if from == 0 || to < from || to > len(f.lines) {
		t.Fatalf("%s: no usable data line range in the header", rel)
	}
	f.header = f.lines[:from-1]
	for _, l := range f.lines[from-1 : to] {
		f.data = append(f.data, strings.Fields(l))
	}
	if len(f.data) != to-from+1 {
		t.Fatalf("%s: read %d data lines, want %d", rel, len(f.data), to-from+1)
	}
	return f
}

// column returns the texts of data column j.
func (f nistFile) column(t *testing.T, j int) []string {
	t.Helper()
	out := make([]string, len(f.data))
	for i, row := range f.data {
		if j >= len(row) {
			t.Fatalf("%s: data row %d has %d fields", f.name, i+1, len(row))
		}
		out[i] = row[j]
	}
	return out
}

// find returns the submatches of the first header line matching re.
func (f nistFile) find(t *testing.T, re string) []string {
	t.Helper()
	r := regexp.MustCompile(re)
	for _, l := range f.header {
		if m := r.FindStringSubmatch(l); m != nil {
			return m[1:]
		}
	}
	t.Fatalf("%s: no header line matches %q", f.name, re)
	return nil
}

func num(t *testing.T, s string) float64 {
	t.Helper()
	x, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("certified value %q: %v", s, err)
	}
	return x
}

func values(t *testing.T, texts []string) Values {
	t.Helper()
	v, err := ParseValues(texts)
	if err != nil {
		t.Fatal(err)
	}
	return v
}

// lre is McCullough's (1998) log relative error, capped at 15 digits.
func lre(est, cert float64) float64 {
	const cap = 15
	if est == cert {
		return cap
	}
	if math.IsNaN(est) || math.IsInf(est, 0) {
		return 0
	}
	var v float64
	if cert == 0 {
		v = -math.Log10(math.Abs(est))
	} else {
		v = -math.Log10(math.Abs(est-cert) / math.Abs(cert))
	}
	return math.Max(0, math.Min(cap, v))
}

type lreCheck struct {
	t    *testing.T
	set  string
	min  float64
	low  float64 // smallest LRE seen
	want float64
}

func (c *lreCheck) check(what string, est, cert float64) {
	c.t.Helper()
	l := lre(est, cert)
	if l < c.low {
		c.low = l
	}
	if l < c.want {
		c.t.Errorf("%s %s: got %.17g, certified %.17g, LRE %.1f < %.0f", c.set, what, est, cert, l, c.want)
	}
}

// NIST StRD univariate summary statistics: certified sample mean and
// standard deviation (denominator n - 1) of all nine sets.
func TestNISTUnivariate(t *testing.T) {
	for _, name := range []string{"PiDigits", "Lottery", "Lew", "Mavro", "Michelso", "NumAcc1", "NumAcc2", "NumAcc3", "NumAcc4"} {
		t.Run(name, func(t *testing.T) {
			f := readNIST(t, "univariate/"+name+".dat")
			mean := num(t, f.find(t, `Sample Mean\s+ybar:\s+(\S+)`)[0])
			sd := num(t, f.find(t, `Sample Standard Deviation \(denom. = n-1\)\s+s:\s+(\S+)`)[0])
			v := values(t, f.column(t, 0))
			s := Describe(v)
			c := &lreCheck{t: t, set: name, want: 9, low: 15}
			c.check("mean", s.Mean, mean) // NIST StRD certified ybar
			c.check("sd", s.SD, sd)       // NIST StRD certified s
			c.check("Mean()", Mean(v), mean)
			c.check("SD()", SD(v), sd)
			t.Logf("%s: min LRE %.1f", name, c.low)
		})
	}
}

// NIST StRD linear least squares regression, all eleven sets: every
// certified coefficient and its standard deviation, the residual standard
// deviation and R², plus the certified F statistic. The model comes from
// the file: an intercept when B0 is certified, and for a single x column
// with several slope parameters the polynomial x, x², ..., built with Pow.
func TestNISTRegression(t *testing.T) {
	paramRE := regexp.MustCompile(`^\s*B(\d+)\s+(\S+)\s+(\S+)\s*$`)
	for _, name := range []string{"Norris", "Pontius", "NoInt1", "NoInt2", "Filip", "Longley", "Wampler1", "Wampler2", "Wampler3", "Wampler4", "Wampler5"} {
		t.Run(name, func(t *testing.T) {
			f := readNIST(t, "regression/"+name+".dat")
			var idx []int
			var est, sd []float64
			for _, l := range f.header {
				if m := paramRE.FindStringSubmatch(l); m != nil {
					i, _ := strconv.Atoi(m[1])
					idx = append(idx, i)
					est = append(est, num(t, m[2]))
					sd = append(sd, num(t, m[3]))
				}
			}
			if len(idx) == 0 {
				t.Fatal("no certified parameters")
			}
			intercept := idx[0] == 0
			slopes := len(idx)
			if intercept {
				slopes--
			}
			rsd := num(t, f.find(t, `^\s*Standard Deviation\s+([-+0-9.Ee]+)\s*$`)[0])
			r2 := num(t, f.find(t, `^\s*R-Squared\s+(\S+)`)[0])
			fs := f.find(t, `^Regression\s+\d+\s+\S+\s+\S+\s+(\S+)`)[0]

			y := values(t, f.column(t, 0))
			var xs []Values
			ncol := len(f.data[0]) - 1
			switch {
			case ncol == slopes:
				for j := 1; j <= ncol; j++ {
					xs = append(xs, values(t, f.column(t, j)))
				}
			case ncol == 1:
				x := values(t, f.column(t, 1))
				for k := 1; k <= slopes; k++ {
					xs = append(xs, Pow(x, k))
				}
			default:
				t.Fatalf("%d data columns for %d slopes", ncol, slopes)
			}
			fit, err := OLS(y, xs, intercept, 0.95)
			if err != nil {
				t.Fatal(err)
			}
			c := &lreCheck{t: t, set: name, want: 7, low: 15}
			for i := range idx {
				what := "B" + strconv.Itoa(idx[i])
				c.check(what, fit.Coef[i], est[i])    // NIST StRD certified estimate
				c.check(what+" sd", fit.SE[i], sd[i]) // NIST StRD certified standard deviation of the estimate
			}
			c.check("residual sd", fit.Sigma, rsd) // NIST StRD certified residual standard deviation
			c.check("R-squared", fit.R2, r2)       // NIST StRD certified R-squared
			if fs == "Infinity" {
				// NIST StRD: an exact fit has an infinite F statistic
				if !(fit.F > 1e20) {
					t.Errorf("%s F: got %g, certified Infinity", name, fit.F)
				}
			} else {
				c.check("F", fit.F, num(t, fs)) // NIST StRD certified F statistic
			}
			t.Logf("%s: min LRE %.1f", name, c.low)
		})
	}
}

// NIST StRD one-way analysis of variance, all eleven sets: certified
// degrees of freedom, sums of squares, mean squares, F, R² and residual
// standard deviation. The response column is read as one Values (one
// offset), as the loader reads a column, and split into groups by the
// treatment label in order of appearance. AtmWtAg's header says its
// certified values end on line 47, but the residual SD is on line 48;
// the whole header is searched, so that quirk does not matter.
func TestNISTANOVA(t *testing.T) {
	for _, name := range nistANOVASets {
		t.Run(name, func(t *testing.T) {
			set := readANOVA(t, name)
			resp := values(t, set.resp)
			var groups []Values
			for _, l := range set.order {
				groups = append(groups, resp.Subset(set.rows[l]))
			}
			low := set.check(t, name, OneWayANOVA(groups))
			t.Logf("%s: min LRE %.1f", name, low)
		})
	}
}

var nistANOVASets = []string{"SiRstv", "SmLs01", "SmLs02", "SmLs03", "AtmWtAg", "SmLs04", "SmLs05", "SmLs06", "SmLs07", "SmLs08", "SmLs09"}

// anovaSet is one StRD one-way ANOVA set: the response texts, the rows of
// each treatment label in order of appearance, and the certified values.
type anovaSet struct {
	resp  []string
	order []string
	rows  map[string][]int
	b, w  []string // certified df, SS, MS (and F) between and within
	r2    float64
	rsd   float64
}

func readANOVA(t *testing.T, name string) anovaSet {
	t.Helper()
	f := readNIST(t, "anova/"+name+".dat")
	set := anovaSet{
		b:    f.find(t, `^Between \S+\s+(\d+)\s+(\S+)\s+(\S+)\s+(\S+)`),
		w:    f.find(t, `^Within \S+\s+(\d+)\s+(\S+)\s+(\S+)`),
		r2:   num(t, f.find(t, `Certified R-Squared\s+(\S+)`)[0]),
		rsd:  num(t, f.find(t, `^\s*Standard Deviation\s+(\S+)`)[0]),
		resp: f.column(t, 1),
		rows: map[string][]int{},
	}
	for i, l := range f.column(t, 0) {
		if _, ok := set.rows[l]; !ok {
			set.order = append(set.order, l)
		}
		set.rows[l] = append(set.rows[l], i)
	}
	return set
}

// check compares an analysis of the set with its certified values and
// returns the smallest LRE.
func (set anovaSet) check(t *testing.T, name string, a ANOVA) float64 {
	t.Helper()
	dfb, _ := strconv.Atoi(set.b[0])
	dfw, _ := strconv.Atoi(set.w[0])
	if a.DFBetween != dfb || a.DFWithin != dfw {
		t.Errorf("%s df: got %d, %d; certified %d, %d", name, a.DFBetween, a.DFWithin, dfb, dfw) // NIST StRD certified degrees of freedom
	}
	c := &lreCheck{t: t, set: name, want: 6, low: 15}
	c.check("SS between", a.SSBetween, num(t, set.b[1])) // NIST StRD certified values, this and below
	c.check("MS between", a.MSBetween, num(t, set.b[2]))
	c.check("F", a.F, num(t, set.b[3]))
	c.check("SS within", a.SSWithin, num(t, set.w[1]))
	c.check("MS within", a.MSWithin, num(t, set.w[2]))
	c.check("R-squared", a.R2, set.r2)
	c.check("residual sd", a.Sigma, set.rsd)
	return c.low
}
