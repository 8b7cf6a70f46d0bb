package stats

import (
	"errors"
	"math"
	"math/big"
	"math/rand"
	"strconv"
	"strings"
	"testing"
)

// strconv.ParseFloat is the reference for Float: the contract is bitwise
// identity (sign of zero included).
func sameBits(a, b float64) bool { return math.Float64bits(a) == math.Float64bits(b) }

func TestParseDecimalAccepts(t *testing.T) {
	cases := []struct{ in, canon string }{
		{"-12.5", "-125e-1"},
		{"1e3", "1e3"},
		{"1.2E-5", "12e-6"},
		{"+3", "3"},
		{".5", "5e-1"},
		{"5.", "5"},
		{"0", "0"},
		{"-0", "-0"},
		{"0.000", "0"},
		{"007", "7"},
		{"1.500", "15e-1"},
		{"1500", "15e2"},
		{"10000000.2", "100000002e-1"},
		{"1000000000000.4", "10000000000004e-1"},
		{"-0.860120914", "-860120914e-9"},
		{"1234567890123456789", "1234567890123456789"},
		{"12345678901234567890", "1234567890123456789e1"},
		{"123456789012345678901", "123456789012345678901"}, // 21 digits: math/big
		{"1e-400", "1e-400"},
		{"1e400", "1e400"},
		{"9.99999999999999999999999e307", "999999999999999999999999e284"},
	}
	for _, c := range cases {
		d, err := ParseDecimal(c.in)
		if err != nil {
			t.Errorf("ParseDecimal(%q): %v", c.in, err)
			continue
		}
		if got := d.String(); got != c.canon {
			t.Errorf("ParseDecimal(%q).String() = %q, want %q", c.in, got, c.canon)
		}
		want, _ := strconv.ParseFloat(c.in, 64)
		if got := d.Float(); !sameBits(got, want) {
			t.Errorf("ParseDecimal(%q).Float() = %v, strconv.ParseFloat gives %v", c.in, got, want)
		}
	}
}

func TestParseDecimalRejects(t *testing.T) {
	for _, in := range []string{"", "+", "-", ".", "e5", "1e", "1e+", "1.2.3", "1,000", " 1", "1 ",
		"inf", "NaN", "Infinity", "0x10", "1_000", "--1", "+-1", "1e5.5", "1e5e5", "١", "1.2e3x", "$5", "5%"} {
		if d, err := ParseDecimal(in); err == nil {
			t.Errorf("ParseDecimal(%q) = %v, want an error", in, d)
		} else {
			var de *DecimalError
			if !errors.As(err, &de) || de.Text != in {
				t.Errorf("ParseDecimal(%q): error %v is not a *DecimalError for the text", in, err)
			}
		}
	}
}

// exact is the decimal text as a big.Rat (the forms generated below are all
// accepted by big.Rat.SetString).
func exact(t *testing.T, s string) *big.Rat {
	r, ok := new(big.Rat).SetString(s)
	if !ok {
		t.Fatalf("big.Rat cannot read %q", s)
	}
	return r
}

func randomDecimal(r *rand.Rand) string {
	var b strings.Builder
	if r.Intn(2) == 0 {
		b.WriteByte('-')
	}
	nd := 1 + r.Intn(25)
	digits := make([]byte, nd)
	for i := range digits {
		digits[i] = byte('0' + r.Intn(10))
	}
	point := r.Intn(nd + 1)
	b.Write(digits[:point])
	if point == 0 {
		b.WriteByte('0')
	}
	if point < nd {
		b.WriteByte('.')
		b.Write(digits[point:])
	}
	switch r.Intn(4) {
	case 0:
		b.WriteString("e" + strconv.Itoa(r.Intn(60)-30))
	case 1:
		b.WriteString("e" + strconv.Itoa(r.Intn(700)-350))
	}
	return b.String()
}

// Float and Minus against exact arithmetic on many random decimals: Float
// must equal strconv.ParseFloat bit for bit, Minus must equal the exact
// difference rounded once (big.Rat.Float64 gives the nearest float64).
func TestDecimalRandom(t *testing.T) {
	r := rand.New(rand.NewSource(1))
	for i := 0; i < 20000; i++ {
		s := randomDecimal(r)
		d, err := ParseDecimal(s)
		if err != nil {
			t.Fatalf("ParseDecimal(%q): %v", s, err)
		}
		want, _ := strconv.ParseFloat(s, 64)
		if got := d.Float(); !sameBits(got, want) {
			t.Fatalf("ParseDecimal(%q).Float() = %v, strconv.ParseFloat gives %v", s, got, want)
		}
		x := exact(t, s)
		for _, off := range []float64{d.OffsetHint(), 1, -7, 123456789, math.Trunc(want)} {
			if math.IsInf(off, 0) || math.IsNaN(off) || math.Abs(off) >= 1<<62 {
				continue
			}
			ex := new(big.Rat).Sub(x, new(big.Rat).SetFloat64(off))
			w, _ := ex.Float64()
			if got := d.Minus(off); !sameBits(got, w) && !(got == 0 && w == 0) {
				t.Fatalf("ParseDecimal(%q).Minus(%v) = %v, exact difference rounds to %v", s, off, got, w)
			}
		}
	}
}

func TestMinusExact(t *testing.T) {
	cases := []struct {
		in   string
		off  float64
		want float64
	}{
		{"10000000.2", 10000000, 0.2},      // NIST NumAcc4 value less its integer part
		{"1000000000000.4", 1e12, 0.4},     // NIST SmLs07 value less its integer part
		{"-6.860120914", -6, -0.860120914}, // NIST Filip x
		{"107.8681568", 107, 0.8681568},    // NIST AtmWtAg
		{"1e3", 999, 1},
		{"-5", 3, -8},
		{"0", 12, -12},
	}
	for _, c := range cases {
		d, err := ParseDecimal(c.in)
		if err != nil {
			t.Fatal(err)
		}
		if got := d.Minus(c.off); got != c.want {
			t.Errorf("%q minus %v = %.17g, want %.17g", c.in, c.off, got, c.want)
		}
	}
	// a mantissa beyond 19 digits takes the math/big path
	d, _ := ParseDecimal("100000000000000000000.25")
	if got := d.Minus(0); got != 1e20 {
		t.Errorf("big minus 0 = %v", got)
	}
	d, _ = ParseDecimal("4503599627370496.00000000000000000001") // 2^52 + 1e-20
	if got := d.Minus(4503599627370496); got != 1e-20 {
		t.Errorf("big minus 2^52 = %v, want 1e-20", got)
	}
}

func TestOffsetHint(t *testing.T) {
	cases := []struct {
		in   string
		want float64
	}{
		{"-12.5", -12}, {"12.5", 12}, {"0.7", 0}, {"-0.7", 0}, {"1e3", 1000}, {"1.5e2", 150},
		{"10000000.2", 10000000}, {"9007199254740991.5", 9007199254740991},
		{"9007199254740992", 0}, {"9007199254740993", 0}, {"1e16", 0}, {"-1e300", 0}, {"1e-300", 0},
		{"123.000000000000000000001", 123}, {"12345678901234567890123.5", 0}, {"0", 0}, {"-0", 0},
	}
	for _, c := range cases {
		d, err := ParseDecimal(c.in)
		if err != nil {
			t.Fatal(err)
		}
		got := d.OffsetHint()
		if got != c.want || (got == 0 && math.Signbit(got)) {
			t.Errorf("OffsetHint(%q) = %v, want %v (never -0)", c.in, got, c.want)
		}
	}
}

func TestParseValues(t *testing.T) {
	v, err := ParseValues([]string{"1000000000000.4", "1000000000000.3", "999999999999.5"})
	if err != nil {
		t.Fatal(err)
	}
	if v.Offset != 1e12 || v.D[0] != 0.4 || v.D[1] != 0.3 || v.D[2] != -0.5 {
		t.Errorf("got offset %v, D %v", v.Offset, v.D)
	}
	if v.At(2) != 999999999999.5 {
		t.Errorf("At(2) = %v", v.At(2))
	}
	_, err = ParseValues([]string{"1", "2", "x3"})
	if err == nil || !strings.Contains(err.Error(), "value 3") || !strings.Contains(err.Error(), `"x3"`) {
		t.Errorf("error %v should name value 3 and its text", err)
	}
	v, err = ParseValues(nil)
	if err != nil || v.Len() != 0 {
		t.Errorf("empty: %v %v", v, err)
	}
}

// The integer fast path must not allocate: it runs on every cell of a
// large CSV.
func TestParseDecimalNoAlloc(t *testing.T) {
	cells := []string{"1234.56", "-0.5", "42", "1000000000000.4", "3.14159265358979", "1.2E-5", "-123456789012345678"}
	allocs := testing.AllocsPerRun(100, func() {
		for _, c := range cells {
			d, err := ParseDecimal(c)
			if err != nil {
				panic(err)
			}
			_ = d.Minus(d.OffsetHint())
			_ = d.Float()
		}
	})
	if allocs != 0 {
		t.Errorf("ParseDecimal + Minus + Float allocate %v times per run, want 0", allocs)
	}
}

func FuzzParseDecimal(f *testing.F) {
	for _, s := range []string{"-12.5", "1e3", ".5", "5.", "+3", "1.2E-5", "123456789012345678901.5", "1e-400", "x"} {
		f.Add(s, 3.0)
	}
	f.Fuzz(func(t *testing.T, s string, off float64) {
		d, err := ParseDecimal(s)
		if err != nil {
			return
		}
		want, perr := strconv.ParseFloat(s, 64)
		var ne *strconv.NumError
		if perr != nil && !(errors.As(perr, &ne) && ne.Err == strconv.ErrRange) {
			t.Fatalf("ParseDecimal accepts %q but strconv.ParseFloat says %v", s, perr)
		}
		if got := d.Float(); !sameBits(got, want) {
			t.Fatalf("Float(%q) = %v, ParseFloat %v", s, got, want)
		}
		off = math.Trunc(off)
		if math.IsNaN(off) || math.IsInf(off, 0) || math.Abs(off) > 1e15 || int(d.exp)+d.digits10() > 330 || int(d.exp)+d.digits10() < -330 {
			return
		}
		ex := new(big.Rat).Sub(d.rat(), new(big.Rat).SetFloat64(off))
		w, _ := ex.Float64()
		if got := d.Minus(off); got != w {
			t.Fatalf("%q minus %v = %v, exact %v", s, off, got, w)
		}
	})
}

func BenchmarkParseDecimalMinus(b *testing.B) {
	cells := []string{"1234.56", "-0.5", "42", "1000000000000.4", "3.14159265358979", "19.99", "-7", "0.001"}
	b.ReportAllocs()
	b.ResetTimer()
	var sink float64
	for i := 0; i < b.N; i++ {
		c := cells[i%len(cells)]
		d, err := ParseDecimal(c)
		if err != nil {
			b.Fatal(err)
		}
		sink += d.Minus(1000)
	}
	_ = sink
}

func BenchmarkParseFloat(b *testing.B) {
	cells := []string{"1234.56", "-0.5", "42", "1000000000000.4", "3.14159265358979", "19.99", "-7", "0.001"}
	b.ReportAllocs()
	var sink float64
	for i := 0; i < b.N; i++ {
		f, _ := strconv.ParseFloat(cells[i%len(cells)], 64)
		sink += f - 1000
	}
	_ = sink
}
