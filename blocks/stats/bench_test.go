package stats

import (
	"math/rand"
	"testing"
)

func benchColumns(n, p int) (Values, []Values) {
	r := rand.New(rand.NewSource(7))
	xs := make([]Values, p)
	for j := range xs {
		d := make([]float64, n)
		for i := range d {
			d[i] = r.NormFloat64()
		}
		xs[j] = Values{Offset: 1000, D: d}
	}
	y := make([]float64, n)
	for i := range y {
		y[i] = xs[0].D[i] + 0.5*r.NormFloat64()
	}
	return Plain(y), xs
}

func BenchmarkOLS100k(b *testing.B) {
	y, xs := benchColumns(100000, 3)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := OLS(y, xs, true, 0.95); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkDescribe100k(b *testing.B) {
	y, _ := benchColumns(100000, 1)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		Describe(y)
	}
}
