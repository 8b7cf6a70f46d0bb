package stats

import (
	"fmt"
	"math"
	"strings"
)

// Fit is an ordinary least squares fit. Coefficient slices have the
// intercept first when the model has one, then one entry per predictor in
// the order given.
type Fit struct {
	N         int  // observations
	Intercept bool // the model has an intercept
	DFModel   int  // number of predictors
	DFResid   int  // N minus the number of coefficients

	Coef, SE, T, P []float64
	Low, High      []float64 // confidence interval at the fit's level
	Level          float64

	R2    float64 // 1 - SSR/SST; uncentred (SST = Σy²) without intercept
	AdjR2 float64 // 1 - (1-R²)(N - i)/DFResid, i = 1 with intercept, else 0
	F     float64 // (SSModel/DFModel)/(SSR/DFResid)
	FP    float64 // upper tail p-value of F
	Sigma float64 // residual standard deviation √(SSR/DFResid)
	SSR   float64 // residual sum of squares
	SST   float64 // total sum of squares (centred with intercept)

	Fitted, Residuals []float64
	Leverage          []float64 // diagonal of the hat matrix
	Cooks             []float64 // Cook's (1977) distance
	Reason            Reasons

	// kept for Predict
	p     int
	perm  []int     // pivot position -> predictor index
	scale []float64 // exact power-of-two column scales, by predictor
	means []dd      // predictor means (intercept models), by predictor
	coef  []dd      // predictor coefficients, by predictor
	b0    dd
	rinv  [][]dd // inverse of R, by pivot position: rinv[row][col]
}

// CollinearError reports perfectly collinear predictors: Columns are the
// 0-based indices (into the xs given to OLS) of the predictors taking part
// in an exact linear relation (with the intercept, when there is one).
type CollinearError struct{ Columns []int }

func (e *CollinearError) Error() string {
	s := make([]string, len(e.Columns))
	for i, c := range e.Columns {
		s[i] = fmt.Sprint(c)
	}
	return fmt.Sprintf("predictors %s (0-based) are perfectly collinear: one is a linear combination of the others; drop one of them", strings.Join(s, ", "))
}

// ConstantError reports a predictor that takes one value in every row
// (with an intercept it adds nothing), or that is zero in every row.
type ConstantError struct {
	Column int // 0-based index into xs
	Value  float64
}

func (e *ConstantError) Error() string {
	return fmt.Sprintf("predictor %d (0-based) is constant (%g in every row), so its coefficient cannot be estimated; drop it", e.Column, e.Value)
}

// TooFewRowsError reports fewer observations than coefficients.
type TooFewRowsError struct{ Rows, Coefficients int }

func (e *TooFewRowsError) Error() string {
	return fmt.Sprintf("%d observations cannot determine %d coefficients; use fewer predictors or more rows", e.Rows, e.Coefficients)
}

// DataError reports unusable input: unequal lengths, missing or infinite
// values. Column is the 0-based predictor index, or -1 for the outcome;
// Row is 0-based, or -1 when the whole column is at fault.
type DataError struct {
	Column, Row int
	Msg         string
}

func (e *DataError) Error() string {
	what := "the outcome"
	if e.Column >= 0 {
		what = fmt.Sprintf("predictor %d (0-based)", e.Column)
	}
	if e.Row >= 0 {
		return fmt.Sprintf("%s, row %d (0-based): %s", what, e.Row, e.Msg)
	}
	return what + ": " + e.Msg
}

func checkColumn(v Values, col, n int) error {
	if v.Len() != n {
		return &DataError{Column: col, Row: -1, Msg: fmt.Sprintf("has %d values where the outcome has %d", v.Len(), n)}
	}
	if math.IsNaN(v.Offset) || math.IsInf(v.Offset, 0) {
		return &DataError{Column: col, Row: -1, Msg: "the offset is not finite"}
	}
	if v.Lo != nil && len(v.Lo) != len(v.D) {
		return &DataError{Column: col, Row: -1, Msg: "Lo and D differ in length"}
	}
	for i, x := range v.D {
		if math.IsNaN(x) {
			return &DataError{Column: col, Row: i, Msg: "the value is missing; drop incomplete rows first"}
		}
		if math.IsInf(x, 0) || (v.Lo != nil && (math.IsNaN(v.Lo[i]) || math.IsInf(v.Lo[i], 0))) {
			return &DataError{Column: col, Row: i, Msg: "the value is not finite"}
		}
	}
	return nil
}

const eps = 0x1p-53

// centred returns the column less its mean (intercept models) or the raw
// column, in double-double, with the mean (raw units) and the norm of the
// shifted data that bounds its rounding noise.
func centred(v Values, intercept bool) (c []dd, mean dd, dataNorm float64) {
	n := v.Len()
	c = make([]dd, n)
	var dn float64
	if intercept {
		var s ddSum
		for i := 0; i < n; i++ {
			s.addDD(v.dd(i))
		}
		m := ddDivF(s.s, float64(n))
		for i := 0; i < n; i++ {
			d := v.dd(i)
			dn += d.hi * d.hi
			c[i] = ddSub(d, m)
		}
		return c, ddAddF(m, v.Offset), math.Sqrt(dn)
	}
	for i := 0; i < n; i++ {
		c[i] = v.full(i)
		dn += c[i].hi * c[i].hi
	}
	return c, dd{}, math.Sqrt(dn)
}

func ddNorm2(c []dd, from int) dd {
	var s ddSum
	for i := from; i < len(c); i++ {
		s.addDD(ddSqr(c[i]))
	}
	return s.s
}

func ddAbs(a dd) dd {
	if a.hi < 0 {
		return a.neg()
	}
	return a
}

// OLS fits y = b0 + Σ b_j x_j (or y = Σ b_j x_j when intercept is false)
// by least squares, with the usual normal-theory inference at level (e.g.
// 0.95).
//
// The solution is a Householder QR factorisation with column pivoting
// (Businger and Golub 1965) of the centred (intercept models) and
// power-of-two scaled predictors, carried out entirely in double-double
// arithmetic, as are the residuals, the sums of squares, the inverse of R
// used for the standard errors, and the leverages; the normal equations
// are never formed. Centring uses the shifted values (Values.D, Lo), so
// offsets cost no digits. Results are rounded to float64 once at the end.
//
// R² is 1 - SSR/SST with SST centred, or uncentred (Σy²) without an
// intercept, as NIST StRD certifies for its NoInt sets; F tests all
// predictors. Leverage is the hat matrix diagonal and Cook's (1977)
// distance is e_i² h_i / (k σ² (1-h_i)²) with k coefficients.
//
// Errors: *DataError for unequal lengths, missing or infinite values;
// *TooFewRowsError when N is below the number of coefficients;
// *ConstantError for a constant predictor in an intercept model (or an
// all-zero one without); *CollinearError when the pivoted R shows an exact
// linear relation, judged against the rounding noise of the data (a
// diagonal below 32·√k·2^-53 times the data's noise amplification).
// With N equal to the number of coefficients the fit is exact and the
// inference fields are NaN, with the reason.
func OLS(y Values, xs []Values, intercept bool, level float64) (*Fit, error) {
	n := y.Len()
	p := len(xs)
	k := p
	if intercept {
		k++
	}
	if k == 0 {
		return nil, &DataError{Column: -1, Row: -1, Msg: "a model without intercept needs at least one predictor"}
	}
	if err := checkColumn(y, -1, n); err != nil {
		return nil, err
	}
	for j, x := range xs {
		if err := checkColumn(x, j, n); err != nil {
			return nil, err
		}
	}
	if n < k {
		return nil, &TooFewRowsError{Rows: n, Coefficients: k}
	}

	f := &Fit{N: n, Intercept: intercept, DFModel: p, DFResid: n - k, Level: level, p: p}
	yc, ymean, _ := centred(y, intercept)
	if yn := ddNorm2(yc, 0).hi; math.IsInf(yn, 0) || math.IsNaN(yn) {
		return nil, &DataError{Column: -1, Row: -1, Msg: "the values are too large in magnitude for a least-squares fit"}
	}

	// predictor columns: centred, scaled by a power of two to unit norm
	a := make([][]dd, p)
	f.scale = make([]float64, p)
	f.means = make([]dd, p)
	noise := 1.0
	for j, x := range xs {
		c, m, dn := centred(x, intercept)
		nrm := math.Sqrt(ddNorm2(c, 0).float())
		if nrm == 0 || nrm <= 64*eps*dn {
			return nil, &ConstantError{Column: j, Value: x.At(0)}
		}
		_, e := math.Frexp(nrm)
		sc := math.Ldexp(1, -e)
		if math.IsInf(nrm, 0) || math.IsNaN(nrm) || math.IsInf(sc, 0) {
			return nil, &DataError{Column: j, Row: -1, Msg: "the values are too large or too small in magnitude for a least-squares fit"}
		}
		for i := range c {
			c[i] = dd{c[i].hi * sc, c[i].lo * sc}
		}
		a[j], f.scale[j], f.means[j] = c, sc, m
		noise = math.Max(noise, dn/nrm)
	}
	tol := 32 * math.Sqrt(float64(k)) * eps * noise

	// Householder QR with column pivoting; qy accumulates Qᵀy.
	qy := make([]dd, n)
	copy(qy, yc)
	perm := make([]int, p)
	for j := range perm {
		perm[j] = j
	}
	diag := make([]dd, p)
	for t := 0; t < p; t++ {
		best, bestN := t, -1.0
		for j := t; j < p; j++ {
			var s float64
			for _, v := range a[j][t:] {
				s += v.hi * v.hi
			}
			if s > bestN {
				best, bestN = j, s
			}
		}
		a[t], a[best] = a[best], a[t]
		perm[t], perm[best] = perm[best], perm[t]
		col := a[t]
		nrm := ddSqrt(ddNorm2(col, t))
		if nrm.hi == 0 {
			diag[t] = dd{}
			continue
		}
		x0 := col[t]
		alpha := nrm
		if x0.hi >= 0 {
			alpha = nrm.neg()
		}
		col[t] = ddSub(x0, alpha) // v0 = x0 + sign(x0)·‖x‖, no cancellation
		beta := ddMul(nrm, ddAdd(nrm, ddAbs(x0)))
		for j := t + 1; j < p; j++ {
			applyReflector(col, a[j], t, beta)
		}
		applyReflector(col, qy, t, beta)
		col[t] = alpha
		diag[t] = alpha
	}
	// R[row][col] for row <= col is a[col][row].
	rank := p
	if p > 0 {
		r00 := math.Abs(diag[0].hi)
		for t := 0; t < p; t++ {
			if !(math.Abs(diag[t].hi) > tol*r00) {
				rank = t
				break
			}
		}
	}
	if rank < p {
		return nil, collinear(a, perm, rank)
	}

	// back substitution R b̃ = (Qᵀy)[:p]
	bt := make([]dd, p)
	for t := p - 1; t >= 0; t-- {
		s := qy[t]
		for m := t + 1; m < p; m++ {
			s = ddSub(s, ddMul(a[m][t], bt[m]))
		}
		bt[t] = ddDiv(s, a[t][t])
	}
	f.perm = perm
	f.coef = make([]dd, p)
	for t, j := range perm {
		f.coef[j] = ddMulF(bt[t], f.scale[j])
	}
	if intercept {
		b0 := ymean
		for j := range xs {
			b0 = ddSub(b0, ddMul(f.coef[j], f.means[j]))
		}
		f.b0 = b0
	}

	// inverse of R (upper triangular), column by column
	rinv := make([][]dd, p)
	for t := range rinv {
		rinv[t] = make([]dd, p)
	}
	for m := 0; m < p; m++ {
		rinv[m][m] = ddDiv(dd{1, 0}, a[m][m])
		for t := m - 1; t >= 0; t-- {
			var s dd
			for q := t + 1; q <= m; q++ {
				s = ddAdd(s, ddMul(a[q][t], rinv[q][m]))
			}
			rinv[t][m] = ddDiv(s.neg(), a[t][t])
		}
	}
	f.rinv = rinv

	// residuals, sums of squares and leverages, recomputing the scaled
	// columns from the data (the QR overwrote them)
	cols := make([][]dd, p)
	for j, x := range xs {
		c, _, _ := centred(x, intercept)
		for i := range c {
			c[i] = dd{c[i].hi * f.scale[j], c[i].lo * f.scale[j]}
		}
		cols[j] = c
	}
	var ssr, sst ddSum
	f.Fitted = make([]float64, n)
	f.Residuals = make([]float64, n)
	f.Leverage = make([]float64, n)
	res := make([]dd, n)
	for i := 0; i < n; i++ {
		r := yc[i]
		for t, j := range perm {
			r = ddSub(r, ddMul(bt[t], cols[j][i]))
		}
		res[i] = r
		ssr.addDD(ddSqr(r))
		sst.addDD(ddSqr(yc[i]))
		f.Residuals[i] = r.float()
		f.Fitted[i] = ddSub(y.full(i), r).float()
		// h_i = (1/n) + ‖R⁻ᵀ c̃_i‖²
		var h dd
		for m := 0; m < p; m++ {
			var s dd
			for t := 0; t <= m; t++ {
				s = ddAdd(s, ddMul(rinv[t][m], cols[perm[t]][i]))
			}
			h = ddAdd(h, ddSqr(s))
		}
		if intercept {
			h = ddAdd(h, ddDivF(dd{1, 0}, float64(n)))
		}
		f.Leverage[i] = h.float()
	}
	f.SSR = ssr.s.float()
	f.SST = sst.s.float()

	// coefficients and inference
	f.Coef = make([]float64, k)
	f.SE = make([]float64, k)
	f.T = make([]float64, k)
	f.P = make([]float64, k)
	f.Low = make([]float64, k)
	f.High = make([]float64, k)
	off := 0
	if intercept {
		off = 1
		f.Coef[0] = f.b0.float()
	}
	for j := range xs {
		f.Coef[off+j] = f.coef[j].float()
	}
	nan := math.NaN()
	inference := []string{"SE", "T", "P", "Low", "High", "Sigma", "AdjR2", "F", "FP", "Cooks"}
	if f.DFResid == 0 {
		f.Sigma, f.AdjR2, f.F, f.FP = nan, nan, nan, nan
		for i := range f.SE {
			f.SE[i], f.T[i], f.P[i], f.Low[i], f.High[i] = nan, nan, nan, nan, nan
		}
		f.Reason.set("as many coefficients as observations: the fit is exact and leaves no residual degrees of freedom", inference...)
	} else {
		s2 := ddDivF(ssr.s, float64(f.DFResid))
		sigma := ddSqrt(s2)
		f.Sigma = sigma.float()
		crit := tCrit(level, float64(f.DFResid))
		if math.IsNaN(crit) {
			f.Reason.set("the confidence level must lie between 0 and 1", "Low", "High")
		}
		setInf := func(i int, b, se dd) {
			f.SE[i] = se.float()
			f.T[i] = ddDiv(b, se).float()
			if se.hi == 0 {
				f.T[i] = math.Copysign(math.Inf(1), b.hi)
				if b.hi == 0 {
					f.T[i] = nan
				}
			}
			f.P[i] = tTwoSided(f.T[i], float64(f.DFResid))
			h := crit * f.SE[i]
			f.Low[i] = ddAddF(b, -h).float()
			f.High[i] = ddAddF(b, h).float()
		}
		if intercept {
			// Var(b0) = σ²(1/n + m̃ᵀ R⁻¹R⁻ᵀ m̃), m̃ the scaled means by position
			var q dd
			for m := 0; m < p; m++ {
				var s dd
				for t := 0; t <= m; t++ {
					j := perm[t]
					s = ddAdd(s, ddMul(rinv[t][m], ddMulF(f.means[j], f.scale[j])))
				}
				q = ddAdd(q, ddSqr(s))
			}
			v := ddAdd(q, ddDivF(dd{1, 0}, float64(n)))
			setInf(0, f.b0, ddMul(sigma, ddSqrt(v)))
		}
		for t, j := range perm {
			var s dd
			for m := t; m < p; m++ {
				s = ddAdd(s, ddSqr(rinv[t][m]))
			}
			setInf(off+j, f.coef[j], ddMulF(ddMul(sigma, ddSqrt(s)), f.scale[j]))
		}
		f.Cooks = make([]float64, n)
		for i := 0; i < n; i++ {
			h := f.Leverage[i]
			if h >= 1 || s2.hi == 0 {
				f.Cooks[i] = nan
				f.Reason.set("a point with leverage 1, or a perfect fit, has no Cook's distance", "Cooks")
				continue
			}
			f.Cooks[i] = ddSqr(res[i]).float() * h / (float64(k) * s2.float() * (1 - h) * (1 - h))
		}
	}

	if f.SST == 0 {
		f.R2, f.AdjR2, f.F, f.FP = nan, nan, nan, nan
		f.Reason.set("the outcome is constant", "R2", "AdjR2", "F", "FP")
	} else {
		r2 := ddSub(dd{1, 0}, ddDiv(ssr.s, sst.s))
		f.R2 = r2.float()
		if f.DFResid > 0 {
			i := 0
			if intercept {
				i = 1
			}
			f.AdjR2 = ddSub(dd{1, 0}, ddMulF(ddDivF(ddSub(dd{1, 0}, r2), float64(f.DFResid)), float64(n-i))).float()
			if p == 0 {
				f.F, f.FP = nan, nan
				f.Reason.set("a model without predictors has no F test", "F", "FP")
			} else {
				msm := ddDivF(ddSub(sst.s, ssr.s), float64(p))
				mse := ddDivF(ssr.s, float64(f.DFResid))
				if mse.hi == 0 {
					f.F = math.Inf(1)
				} else {
					f.F = ddDiv(msm, mse).float()
				}
				f.FP = fSurvival(f.F, float64(p), float64(f.DFResid))
			}
		}
	}
	return f, nil
}

// applyReflector applies I - v vᵀ/β to w over rows from..n-1.
func applyReflector(v, w []dd, from int, beta dd) {
	var s dd
	for i := from; i < len(v); i++ {
		s = ddAdd(s, ddMul(v[i], w[i]))
	}
	if s.hi == 0 {
		return
	}
	g := ddDiv(s, beta)
	for i := from; i < len(v); i++ {
		w[i] = ddSub(w[i], ddMul(g, v[i]))
	}
}

// collinear names the predictors in the exact relations that the pivoted
// QR found: each dependent column with the independent columns it is a
// combination of (coefficients z solving R11 z = R12).
func collinear(a [][]dd, perm []int, rank int) error {
	in := map[int]bool{}
	for t := rank; t < len(perm); t++ {
		in[perm[t]] = true
		z := make([]float64, rank)
		for i := rank - 1; i >= 0; i-- {
			s := a[t][i]
			for m := i + 1; m < rank; m++ {
				s = ddSub(s, ddMulF(a[m][i], z[m]))
			}
			z[i] = ddDiv(s, a[i][i]).float()
		}
		big := 0.0
		for _, x := range z {
			big = math.Max(big, math.Abs(x))
		}
		for i, x := range z {
			if math.Abs(x) > 1e-9*math.Max(big, 1e-300) {
				in[perm[i]] = true
			}
		}
	}
	cols := make([]int, 0, len(in))
	for j := range perm {
		if in[j] {
			cols = append(cols, j)
		}
	}
	return &CollinearError{Columns: cols}
}

// Predict is the fitted value at raw predictor values x (one per predictor,
// in the order given to OLS) and the prediction interval for a new
// observation at level: fit ± t(DFResid)·σ√(1 + h₀), h₀ = x₀ᵀ(XᵀX)⁻¹x₀
// (the textbook interval, e.g. statsmodels' obs_ci). NaN when x has the
// wrong length or the fit leaves no residual degrees of freedom.
func (f *Fit) Predict(x []float64, level float64) (fit, low, high float64) {
	return f.predict(x, level, true)
}

// PredictMean is like Predict but gives the confidence interval of the
// mean response, fit ± t(DFResid)·σ√h₀.
func (f *Fit) PredictMean(x []float64, level float64) (fit, low, high float64) {
	return f.predict(x, level, false)
}

func (f *Fit) predict(x []float64, level float64, obs bool) (fit, low, high float64) {
	nan := math.NaN()
	if len(x) != f.p {
		return nan, nan, nan
	}
	v := f.b0
	for j, xj := range x {
		v = ddAdd(v, ddMulF(f.coef[j], xj))
	}
	fit = v.float()
	if f.DFResid == 0 {
		return fit, nan, nan
	}
	var h dd
	for m := 0; m < f.p; m++ {
		var s dd
		for t := 0; t <= m; t++ {
			j := f.perm[t]
			d := dd{x[j], 0}
			if f.Intercept {
				d = ddSub(d, f.means[j])
			}
			s = ddAdd(s, ddMul(f.rinv[t][m], ddMulF(d, f.scale[j])))
		}
		h = ddAdd(h, ddSqr(s))
	}
	if f.Intercept {
		h = ddAdd(h, ddDivF(dd{1, 0}, float64(f.N)))
	}
	if obs {
		h = ddAdd(h, dd{1, 0})
	}
	se := f.Sigma * math.Sqrt(h.float())
	half := tCrit(level, float64(f.DFResid)) * se
	return fit, ddAddF(v, -half).float(), ddAddF(v, half).float()
}
