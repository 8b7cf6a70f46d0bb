// Package members writes the invented benchmark data of the scale report:
// the monthly records of members of Tern Valley Cycles, a bike-share
// subscription that does not exist. Every value comes from a fixed seed, so
// the same number of rows gives the same bytes on every run and machine.
package members

import (
	"bufio"
	"io"
	"math"
	"strconv"
)

// Seed is the seed of the published benchmark files.
const Seed = 20260407

// Header is the first line of the CSV.
const Header = "month,region,channel,plan,age,visits,spend,renewed,score\n"

// rng is SplitMix64 (Steele, Lea and Flood 2014): a fixed, tiny generator
// whose output does not depend on the Go version.
type rng struct{ s uint64 }

func (r *rng) next() uint64 {
	r.s += 0x9e3779b97f4a7c15
	z := r.s
	z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9
	z = (z ^ (z >> 27)) * 0x94d049bb133111eb
	return z ^ (z >> 31)
}

// float is uniform on [0, 1) with 53 random bits.
func (r *rng) float() float64 { return float64(r.next()>>11) / (1 << 53) }

// normal is a standard normal deviate by the Box-Muller transform.
func (r *rng) normal() float64 {
	u := 1 - r.float() // (0, 1]
	v := r.float()
	return math.Sqrt(-2*math.Log(u)) * math.Cos(2*math.Pi*v)
}

// pick draws an index with the given weights (summing to 1).
func (r *rng) pick(w []float64) int {
	u := r.float()
	for i, x := range w {
		if u < x {
			return i
		}
		u -= x
	}
	return len(w) - 1
}

// poisson draws a Poisson count by inversion (fine for the small means here).
func (r *rng) poisson(mean float64) int {
	l := math.Exp(-mean)
	k, p := 0, r.float()
	term := l
	cum := term
	for p > cum && k < 200 {
		k++
		term *= mean / float64(k)
		cum += term
	}
	return k
}

var (
	regions       = []string{"North", "South", "East", "West", "Central"}
	regionWeights = []float64{0.18, 0.22, 0.17, 0.15, 0.28}
	regionRides   = []float64{1.00, 0.92, 1.05, 0.97, 1.18}

	channels       = []string{"app", "web", "partner"}
	channelWeights = []float64{0.56, 0.33, 0.11}

	plans       = []string{"monthly", "annual", "student"}
	planWeights = []float64{0.48, 0.37, 0.15}
	planFee     = []float64{12.90, 8.25, 6.50} // euro a month
	planPerRide = []float64{0.55, 0.30, 0.35}
	planRides   = []float64{7.5, 11.0, 9.0}
	planRenew   = []float64{-0.35, 0.95, 0.10} // log-odds shift
)

// Generate writes the header and rows records to w.
func Generate(out io.Writer, rows int, seed uint64) error {
	w := bufio.NewWriterSize(out, 1<<20)
	r := &rng{s: seed}
	w.WriteString(Header)
	var b []byte
	for i := 0; i < rows; i++ {
		month := 1 + r.pick([]float64{0.074, 0.072, 0.079, 0.082, 0.086, 0.089, 0.091, 0.090, 0.087, 0.085, 0.083, 0.082})
		reg := r.pick(regionWeights)
		ch := r.pick(channelWeights)
		pl := r.pick(planWeights)
		age := 38 + 11*r.normal()
		if pl == 2 {
			age = 21 + 2.5*r.normal()
		}
		age = math.Max(16, math.Min(84, math.Round(age)))
		season := 1 + 0.25*math.Sin(float64(month-4)/12*2*math.Pi)
		visits := r.poisson(planRides[pl] * regionRides[reg] * season * math.Exp(0.35*r.normal()-0.06))
		spend := planFee[pl] + planPerRide[pl]*float64(visits) + 0.04*(age-38) + 1.6*r.normal()
		if ch == 2 {
			spend -= 1.10 // partner discount
		}
		spend = math.Max(0, spend)
		score := 61 + 0.9*float64(visits) - 0.08*(age-38) + 0.55*float64(month) + 9*r.normal()
		if pl == 1 {
			score += 2.5
		}
		score = math.Max(0, math.Min(100, score))
		logit := 0.2 + planRenew[pl] + 0.035*(score-65) + 0.03*float64(visits) + 0.3*r.normal()
		if ch == 1 {
			logit -= 0.12
		}
		renewed := r.float() < 1/(1+math.Exp(-logit))

		b = b[:0]
		b = append(b, "2025-"...)
		if month < 10 {
			b = append(b, '0')
		}
		b = strconv.AppendInt(b, int64(month), 10)
		b = append(b, ',')
		b = append(b, regions[reg]...)
		b = append(b, ',')
		b = append(b, channels[ch]...)
		b = append(b, ',')
		b = append(b, plans[pl]...)
		b = append(b, ',')
		if r.float() < 0.008 {
			b = append(b, "NA"...) // age not given
		} else {
			b = strconv.AppendInt(b, int64(age), 10)
		}
		b = append(b, ',')
		b = strconv.AppendInt(b, int64(visits), 10)
		b = append(b, ',')
		b = strconv.AppendFloat(b, spend, 'f', 2, 64)
		b = append(b, ',')
		if renewed {
			b = append(b, "yes"...)
		} else {
			b = append(b, "no"...)
		}
		b = append(b, ',')
		if r.float() >= 0.015 { // an empty score: the survey was skipped
			b = strconv.AppendFloat(b, score, 'f', 1, 64)
		}
		b = append(b, '\n')
		w.Write(b)
	}
	return w.Flush()
}
