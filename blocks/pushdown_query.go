package blocks

import (
	"fmt"
	"math"
	"math/big"
	"sort"
	"strconv"
	"strings"
)

// The statements a push-down sends. Each reads the base relation (qb.base)
// and returns a few rows per group.

// gsel is the grouping expression of a statement: the group column's
// alias, or a constant for a statement over all rows.
func (p *pd) gsel(by string) string {
	if by == "" {
		return "''"
	}
	return p.k(by)
}

// firstPass returns, per group of by (every row when by is ""), the rows,
// the missing values and extremes of number column x, and its mean, the
// centre of the second pass. keys are the groups as the database wrote
// them, NULL (a missing group) included.
//
// It also counts the values equal to hit (1 when hit is nil) and the values
// other than 0 and 1, which is how compare tells a 1/0 outcome.
func (p *pd) firstPass(x, by string, hit *float64) (map[string]pdMoments, []sqlValue, error) {
	g := p.gsel(by)
	xv := p.k(x)
	q := p.newQ()
	group := ""
	if by != "" {
		group = " GROUP BY " + g
	}
	h := 1.0
	if hit != nil {
		h = *hit
	}
	sqlText := fmt.Sprintf("SELECT %s, COUNT(*), COUNT(%s), MIN(%s), MAX(%s), AVG(%s), SUM(CASE WHEN %s = %s THEN 1 ELSE 0 END), SUM(CASE WHEN %s IS NULL OR %s = 0 OR %s = 1 THEN 0 ELSE 1 END) FROM %s%s",
		g, xv, xv, xv, xv, xv, q.float(h), xv, xv, xv, q.base(), group)
	out := map[string]pdMoments{}
	var keys []sqlValue
	var centres []string
	err := p.query(q, sqlText, func(v []sqlValue) error {
		if len(keys) >= pdMaxLevels {
			return errFallBack
		}
		m := zeroMoments()
		m.rows = atoi(v[1])
		m.n = atoi(v[2])
		m.rowsMiss = m.rows - m.n
		m.min, m.max = v[3].text, v[4].text
		m.hits, m.other = atoi(v[6]), atoi(v[7])
		centre := "0"
		if !v[5].null {
			centre = v[5].text
		}
		k := v[0]
		keys = append(keys, k)
		centres = append(centres, centre)
		out[keyOf(k)] = m
		return nil
	})
	if err != nil {
		return nil, nil, err
	}
	p.centres[x] = centres
	return out, keys, nil
}

// centredSums is the second pass of moments: the sums of the deviations'
// first three powers from each group's first-pass mean.
func (p *pd) centredSums(x, by string, out map[string]pdMoments, keys []sqlValue) error {
	g := p.gsel(by)
	xv := p.k(x)
	centres := p.centres[x]
	// The centre as the database will subtract it: PostgreSQL subtracts a
	// NUMERIC exactly from an integer or NUMERIC column, and in float8 from
	// a float8 column; SQLite in binary floating point.
	float := !p.d.pg() || p.src.col(x).store == storeFloat
	cval := func(q *qb, i int) string {
		if float {
			f, _ := strconv.ParseFloat(centres[i], 64)
			return q.float(f)
		}
		return "CAST(" + q.arg(centres[i]) + " AS NUMERIC)"
	}
	for i, k := range keys {
		m := out[keyOf(k)]
		if float {
			f, _ := strconv.ParseFloat(centres[i], 64)
			m.c = bf().SetFloat64(f)
		} else {
			m.c = bfText(centres[i])
		}
		out[keyOf(k)] = m
	}
	if len(keys) == 0 {
		return nil
	}
	q := p.newQ()
	var cen string
	if by == "" {
		cen = cval(q, 0)
	} else {
		cen = q.caseOf(g, keys, func(i int) string { return cval(q, i) })
	}
	sqlText := fmt.Sprintf("SELECT g, SUM(d), SUM(d * d), SUM(d * d * d) FROM (SELECT %s AS g, %s - %s AS d FROM %s WHERE %s IS NOT NULL%s) AS candor_d GROUP BY g",
		g, xv, cen, q.base(), xv, p.fence())
	return p.query(q, sqlText, func(v []sqlValue) error {
		key := keyOf(v[0])
		m, ok := out[key]
		if !ok {
			return fmt.Errorf("the database returned a group it had not counted")
		}
		m.s1, m.s2, m.s3 = bfText(v[1].text), bfText(v[2].text), bfText(v[3].text)
		out[key] = m
		return nil
	})
}

// moments is firstPass and centredSums.
func (p *pd) moments(x, by string) (map[string]pdMoments, []sqlValue, error) {
	ms, keys, err := p.firstPass(x, by, nil)
	if err != nil {
		return nil, nil, err
	}
	return ms, keys, p.centredSums(x, by, ms, keys)
}

// pdMaxDistinct bounds the distinct values a sample's value counts may
// have; past it the sums and order statistics are computed in the
// database instead.
var pdMaxDistinct = 100000

// pdHist is a sample's distinct values (as the database wrote them) with
// their counts, in increasing order.
type pdHist struct {
	vals   []string
	f      []float64
	counts []int64
}

// valueCounts counts the rows of every distinct value of number column x
// per group of by (GROUP BY g, v): one statement that gives the moments,
// quartiles, whiskers, outliers and bins of every group exactly, when the
// values are few enough to travel (money, durations in minutes, counts).
// ok is false when there are more than pdMaxDistinct.
func (p *pd) valueCounts(x, by string) (map[string]*pdHist, bool, error) {
	g := p.gsel(by)
	xv := p.k(x)
	q := p.newQ()
	sqlText := fmt.Sprintf("SELECT g, v, COUNT(*) FROM (SELECT %s AS g, %s AS v FROM %s WHERE %s IS NOT NULL%s) AS candor_hv GROUP BY g, v",
		g, xv, q.base(), xv, p.fence())
	out := map[string]*pdHist{}
	n := 0
	tooMany := false
	err := p.conn.stream(sqlText, q.args, func(v []sqlValue) error {
		if n++; n > pdMaxDistinct {
			tooMany = true
			return errStop
		}
		k := keyOf(v[0])
		h := out[k]
		if h == nil {
			h = &pdHist{}
			out[k] = h
		}
		h.vals = append(h.vals, v[1].text)
		h.f = append(h.f, atof(v[1]))
		h.counts = append(h.counts, atoi(v[2]))
		return nil
	})
	if err != nil || tooMany {
		return nil, false, err
	}
	for _, h := range out {
		h.sort()
	}
	return out, true, nil
}

func (h *pdHist) sort() {
	idx := make([]int, len(h.f))
	for i := range idx {
		idx[i] = i
	}
	sort.Slice(idx, func(a, b int) bool { return h.f[idx[a]] < h.f[idx[b]] })
	v, f, c := make([]string, len(idx)), make([]float64, len(idx)), make([]int64, len(idx))
	for i, j := range idx {
		v[i], f[i], c[i] = h.vals[j], h.f[j], h.counts[j]
	}
	h.vals, h.f, h.counts = v, f, c
}

// merge adds value counts together.
func mergeHists(hs []*pdHist) *pdHist {
	byText := map[string]int{}
	out := &pdHist{}
	for _, h := range hs {
		if h == nil {
			continue
		}
		for i, t := range h.vals {
			j, ok := byText[t]
			if !ok {
				// The same number may be written alike in every group.
				j = len(out.vals)
				byText[t] = j
				out.vals = append(out.vals, t)
				out.f = append(out.f, h.f[i])
				out.counts = append(out.counts, 0)
			}
			out.counts[j] += h.counts[i]
		}
	}
	out.sort()
	return out
}

// moments fills a sample's sums exactly from its value counts, centred at
// its exact mean.
func (h *pdHist) moments(m pdMoments) pdMoments {
	m.n = 0
	sum := bf()
	xs := make([]*big.Float, len(h.vals))
	for i, t := range h.vals {
		xs[i] = bfText(t)
		sum.Add(sum, bf().Mul(xs[i], bfInt(h.counts[i])))
		m.n += h.counts[i]
	}
	m.c, m.s1, m.s2, m.s3 = bf(), bf(), bf(), bf()
	if m.n == 0 {
		return m
	}
	m.c.Quo(sum, bfInt(m.n))
	for i, x := range xs {
		d := bf().Sub(x, m.c)
		d2 := bf().Mul(d, d)
		c := bfInt(h.counts[i])
		m.s1.Add(m.s1, bf().Mul(d, c))
		m.s2.Add(m.s2, bf().Mul(d2, c))
		m.s3.Add(m.s3, bf().Mul(bf().Mul(d2, d), c))
	}
	m.min, m.max = h.vals[0], h.vals[len(h.vals)-1]
	return m
}

// orderStats are the values at the ranks the type 7 quartiles need.
func (h *pdHist) orderStats(n int64) map[int64]string {
	out := map[int64]string{}
	ranks := quartileRanks(n)
	var cum int64
	k := 0
	for i, c := range h.counts {
		for k < len(ranks) && ranks[k] < cum+c {
			out[ranks[k]] = h.vals[i]
			k++
		}
		cum += c
	}
	return out
}

// box is boxes' result from value counts: the extremes within the fences
// and every value beyond them, as often as it occurs.
func (h *pdHist) box(lo, hi float64) *pdBox {
	b := &pdBox{wlo: math.Inf(1), whi: math.Inf(-1)}
	for i, x := range h.f {
		if x < lo || x > hi {
			for c := int64(0); c < h.counts[i]; c++ {
				if len(b.outliers) >= pdMaxOutliers {
					b.hidden += int(h.counts[i] - c)
					break
				}
				b.outliers = append(b.outliers, x)
			}
			continue
		}
		b.wlo = math.Min(b.wlo, x)
		b.whi = math.Max(b.whi, x)
	}
	return b
}

// bins counts the values between edges as stats.CountBins does.
func (h *pdHist) bins(edges []float64) []int {
	if len(edges) < 2 {
		return nil
	}
	counts := make([]int, len(edges)-1)
	last := edges[len(edges)-1]
	for i, x := range h.f {
		if x < edges[0] || x > last {
			continue
		}
		if x == last {
			counts[len(counts)-1] += int(h.counts[i])
			continue
		}
		j := sort.SearchFloat64s(edges, x)
		if edges[j] == x {
			counts[j] += int(h.counts[i])
		} else {
			counts[j-1] += int(h.counts[i])
		}
	}
	return counts
}

// orderStats returns, per group of by (or over all rows when by is ""),
// the order statistics of number column x at the ranks the type 7
// quartiles need (0-based), as the database wrote them. ms are the
// samples' moments (for their counts), keys the groups. The ranks are
// bound, so the database sorts and streams without counting first.
func (p *pd) orderStats(x, by string, ms map[string]pdMoments, keys []sqlValue) (map[string]map[int64]string, error) {
	g := p.gsel(by)
	xv := p.k(x)
	q := p.newQ()
	part := ""
	if by != "" {
		part = "PARTITION BY " + g + " "
	}
	in := func(n int64) string {
		var ph []string
		for _, r := range quartileRanks(n) {
			ph = append(ph, q.arg(r))
		}
		return "r IN (" + strings.Join(ph, ", ") + ")"
	}
	var conds []string
	if by == "" {
		if n := ms[""].n; n > 0 {
			conds = append(conds, in(n))
		}
	} else {
		for _, k := range keys {
			if n := ms[keyOf(k)].n; !k.null && n > 0 {
				conds = append(conds, "(g = "+q.key(g, k)+" AND "+in(n)+")")
			}
		}
	}
	out := map[string]map[int64]string{}
	if len(conds) == 0 {
		return out, nil
	}
	sqlText := fmt.Sprintf("SELECT g, v, r FROM (SELECT %s AS g, %s AS v, ROW_NUMBER() OVER (%sORDER BY %s) - 1 AS r FROM %s WHERE %s IS NOT NULL) AS candor_o WHERE %s",
		g, xv, part, xv, q.base(), xv, strings.Join(conds, " OR "))
	err := p.query(q, sqlText, func(v []sqlValue) error {
		k := keyOf(v[0])
		if out[k] == nil {
			out[k] = map[int64]string{}
		}
		out[k][atoi(v[2])] = v[1].text
		return nil
	})
	return out, err
}

// binCounts counts the values of number column x in the bins between
// edges, as stats.CountBins does: [e_i, e_i+1), the last bin closed, and
// values outside the edges left out. The bin of a value is found by a
// balanced tree of comparisons with the bound edges.
func (p *pd) binCounts(x string, edges []float64) ([]int, error) {
	k := len(edges) - 1
	counts := make([]int, k)
	if k < 1 {
		return nil, nil
	}
	q := p.newQ()
	xv := "v"
	var tree func(l, r int) string
	tree = func(l, r int) string {
		if l == r {
			return strconv.Itoa(l)
		}
		m := (l + r + 1) / 2
		return fmt.Sprintf("CASE WHEN %s < %s THEN %s ELSE %s END", xv, q.float(edges[m]), tree(l, m-1), tree(m, r))
	}
	lo, hi := q.float(edges[0]), q.float(edges[k])
	t := tree(0, k-1)
	sqlText := fmt.Sprintf("SELECT b, COUNT(*) FROM (SELECT %s AS b FROM (SELECT %s AS v FROM %s%s) AS candor_v WHERE v IS NOT NULL AND v >= %s AND v <= %s%s) AS candor_h GROUP BY b",
		t, p.k(x), q.base(), p.fence(), lo, hi, p.fence())
	err := p.query(q, sqlText, func(v []sqlValue) error {
		b := atoi(v[0])
		if b >= 0 && int(b) < k {
			counts[b] = int(atoi(v[1]))
		}
		return nil
	})
	return counts, err
}

// pdBox is one box plot's whiskers and outliers from the database.
type pdBox struct {
	wlo, whi float64
	outliers []float64
	hidden   int // outliers past pdMaxOutliers, not fetched
}

// boxes returns, per group of by (or over all rows), the most extreme
// values of x within lo and hi (Tukey's fences) and the values beyond
// them, as boxStats finds them.
func (p *pd) boxes(x, by string, keys []sqlValue, lo, hi []float64) (map[string]*pdBox, error) {
	g := p.gsel(by)
	xv := p.k(x)
	inner := func(q *qb) string {
		var l, h string
		if by == "" {
			l, h = q.float(lo[0]), q.float(hi[0])
		} else {
			l = q.caseOf(g, keys, func(i int) string { return q.float(lo[i]) })
			h = q.caseOf(g, keys, func(i int) string { return q.float(hi[i]) })
		}
		return fmt.Sprintf("(SELECT %s AS g, %s AS v, %s AS lo, %s AS hi FROM %s WHERE %s IS NOT NULL%s) AS candor_w", g, xv, l, h, q.base(), xv, p.fence())
	}
	q := p.newQ()
	sqlText := "SELECT g, MIN(CASE WHEN v >= lo AND v <= hi THEN v END), MAX(CASE WHEN v >= lo AND v <= hi THEN v END), SUM(CASE WHEN v < lo OR v > hi THEN 1 ELSE 0 END) FROM " + inner(q) + " GROUP BY g"
	out := map[string]*pdBox{}
	total := int64(0)
	err := p.query(q, sqlText, func(v []sqlValue) error {
		b := &pdBox{wlo: math.Inf(1), whi: math.Inf(-1)}
		if !v[1].null {
			b.wlo, b.whi = atof(v[1]), atof(v[2])
		}
		out[keyOf(v[0])] = b
		total += atoi(v[3])
		return nil
	})
	if err != nil || total == 0 {
		return out, err
	}
	fetch := func(cond, order string, limit int64) error {
		q := p.newQ()
		sqlText := "SELECT g, v FROM " + inner(q) + " WHERE " + cond + " ORDER BY v " + order + " LIMIT " + strconv.FormatInt(limit, 10)
		return p.query(q, sqlText, func(v []sqlValue) error {
			if b := out[keyOf(v[0])]; b != nil {
				b.outliers = append(b.outliers, atof(v[1]))
			}
			return nil
		})
	}
	if total <= pdMaxOutliers {
		err = fetch("v < lo OR v > hi", "ASC", total)
	} else {
		// The most extreme outliers on each side; the rest are counted.
		if err = fetch("v < lo", "ASC", pdMaxOutliers/2); err == nil {
			err = fetch("v > hi", "DESC", pdMaxOutliers/2)
		}
		shown := 0
		for _, b := range out {
			shown += len(b.outliers)
		}
		for _, b := range out {
			b.hidden = int(total) - shown
			break
		}
	}
	for _, b := range out {
		sort.Float64s(b.outliers)
	}
	return out, err
}

// pairCounts counts the rows of every pair of levels of two columns
// (GROUP BY a, b).
type pdPair struct {
	a, b sqlValue
	n    int64
}

func (p *pd) pairCounts(a, b string) ([]pdPair, error) {
	q := p.newQ()
	ka, kb := p.k(a), p.k(b)
	sqlText := fmt.Sprintf("SELECT %s, %s, COUNT(*) FROM %s GROUP BY %s, %s", ka, kb, q.base(), ka, kb)
	var out []pdPair
	err := p.query(q, sqlText, func(v []sqlValue) error {
		if len(out) >= pdMaxLevels*4 {
			return errFallBack
		}
		out = append(out, pdPair{a: v[0], b: v[1], n: atoi(v[2])})
		return nil
	})
	return out, err
}
