package blocks

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"candor/blocks/stats"
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

// pdPass is what a first pass reads of one group's sample of a number
// column: its rows and values, its extremes and mean as the database wrote
// them, and its values equal to a success and other than 0 and 1.
type pdPass struct {
	rows, n     int64
	min, max    string
	centre      string // the mean, the second pass's centre ("0" without values)
	hits, other int64
}

// combinePasses is the first pass of samples taken together.
func combinePasses(list []pdPass) pdPass {
	out := pdPass{centre: "0"}
	for _, ps := range list {
		out.rows += ps.rows
		out.hits += ps.hits
		out.other += ps.other
		if ps.n == 0 {
			continue
		}
		if out.n == 0 || atof(sqlValue{text: ps.min}) < atof(sqlValue{text: out.min}) {
			out.min = ps.min
		}
		if out.n == 0 || atof(sqlValue{text: ps.max}) > atof(sqlValue{text: out.max}) {
			out.max = ps.max
		}
		out.n += ps.n
	}
	return out
}

// firstPass returns, per group of by (every row when by is ""), the rows,
// the values and extremes of number column x, and its mean, the centre of
// the second pass. keys are the groups as the database wrote them, NULL (a
// missing group) included.
//
// It also counts the values equal to hit (1 when hit is nil) and the values
// other than 0 and 1, which is how compare tells a 1/0 outcome.
func (p *pd) firstPass(x, by string, hit *float64) (map[string]pdPass, []sqlValue, error) {
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
	out := map[string]pdPass{}
	var keys []sqlValue
	err := p.query(q, sqlText, func(v []sqlValue) error {
		if len(keys) >= pdMaxLevels {
			return errFallBack
		}
		ps := pdPass{rows: atoi(v[1]), n: atoi(v[2]), min: v[3].text, max: v[4].text, centre: "0", hits: atoi(v[6]), other: atoi(v[7])}
		if !v[5].null {
			ps.centre = v[5].text
		}
		keys = append(keys, v[0])
		out[keyOf(v[0])] = ps
		return nil
	})
	if err != nil {
		return nil, nil, err
	}
	return out, keys, nil
}

// centredSums is the second pass of moments: the sums of the deviations'
// first three powers from each group's first-pass mean, read into each
// group's moments (stats.MomentsFromSums).
func (p *pd) centredSums(x, by string, pass map[string]pdPass, keys []sqlValue) (map[string]stats.Moments, error) {
	g := p.gsel(by)
	xv := p.k(x)
	// The centre as the database will subtract it: PostgreSQL subtracts a
	// NUMERIC exactly from an integer or NUMERIC column, and in float8 from
	// a float8 column; SQLite in binary floating point.
	float := !p.d.pg() || p.src.col(x).store == storeFloat
	centre := func(key string) (bound func(q *qb) string, exact stats.Decimal) {
		c := pass[key].centre
		if float {
			f, _ := strconv.ParseFloat(c, 64)
			return func(q *qb) string { return q.float(f) }, stats.FloatDecimal(f)
		}
		return func(q *qb) string { return "CAST(" + q.arg(c) + " AS NUMERIC)" }, pdDecimal(sqlValue{text: c})
	}
	out := map[string]stats.Moments{}
	if len(keys) == 0 {
		return out, nil
	}
	q := p.newQ()
	var cen string
	if by == "" {
		bound, _ := centre("")
		cen = bound(q)
	} else {
		cen = q.caseOf(g, keys, func(i int) string { bound, _ := centre(keyOf(keys[i])); return bound(q) })
	}
	sqlText := fmt.Sprintf("SELECT g, SUM(d), SUM(d * d), SUM(d * d * d) FROM (SELECT %s AS g, %s - %s AS d FROM %s WHERE %s IS NOT NULL%s) AS candor_d GROUP BY g",
		g, xv, cen, q.base(), xv, p.fence())
	err := p.query(q, sqlText, func(v []sqlValue) error {
		key := keyOf(v[0])
		ps, ok := pass[key]
		if !ok {
			return fmt.Errorf("the database returned a group it had not counted")
		}
		_, c := centre(key)
		out[key] = stats.MomentsFromSums(int(ps.n), c, pdDecimal(v[1]), pdDecimal(v[2]), pdDecimal(v[3]))
		return nil
	})
	return out, err
}

// pdDecimal reads a number the database wrote; NULL (the sum of no rows)
// is 0.
func pdDecimal(v sqlValue) stats.Decimal {
	d, err := stats.ParseDecimal(v.text)
	if v.null || err != nil {
		return stats.Decimal{}
	}
	return d
}

// moments is firstPass and centredSums.
func (p *pd) moments(x, by string) (map[string]pdPass, map[string]stats.Moments, error) {
	pass, keys, err := p.firstPass(x, by, nil)
	if err != nil {
		return nil, nil, err
	}
	ms, err := p.centredSums(x, by, pass, keys)
	return pass, ms, err
}

// pdMaxDistinct bounds the distinct values a sample's value counts may
// have; past it the sums and order statistics are computed in the
// database instead.
var pdMaxDistinct = 100000

// pdCounts are a number column's value counts: a tally per group and over
// all rows, and the decimals its values are written with (for
// Column.Snap).
type pdCounts struct {
	groups map[string]stats.Tally
	all    stats.Tally
	dec    int
}

// valueCounts counts the rows of every distinct value of number column x
// per group of by (GROUP BY g, v): one statement that gives the moments,
// quartiles, whiskers, outliers and bins of every group exactly, when the
// values are few enough to travel (money, durations in minutes, counts).
// It returns nil when there are more than pdMaxDistinct.
func (p *pd) valueCounts(x, by string) (*pdCounts, error) {
	g := p.gsel(by)
	xv := p.k(x)
	q := p.newQ()
	sqlText := fmt.Sprintf("SELECT g, v, COUNT(*) FROM (SELECT %s AS g, %s AS v FROM %s WHERE %s IS NOT NULL%s) AS candor_hv GROUP BY g, v",
		g, xv, q.base(), xv, p.fence())
	// Every value text once (one offset for all groups), and per group the
	// indices of its values with their counts.
	type tally struct{ idx, counts []int }
	index := map[string]int{}
	var texts []string
	var all []int
	byGroup := map[string]*tally{}
	n := 0
	tooMany := false
	err := p.conn.stream(sqlText, q.args, func(v []sqlValue) error {
		if n++; n > pdMaxDistinct {
			tooMany = true
			return errStop
		}
		i, ok := index[v[1].text]
		if !ok {
			i = len(texts)
			index[v[1].text] = i
			texts = append(texts, v[1].text)
			all = append(all, 0)
		}
		c := int(atoi(v[2]))
		all[i] += c
		k := keyOf(v[0])
		t := byGroup[k]
		if t == nil {
			t = &tally{}
			byGroup[k] = t
		}
		t.idx = append(t.idx, i)
		t.counts = append(t.counts, c)
		return nil
	})
	if err != nil || tooMany {
		return nil, err
	}
	// The values exactly (stats.ParseValuesExact), so that bins and fences
	// compare the float64 nearest to each, as the database does; their
	// decimals as the in-memory path counts them.
	_, dec, bad := parseNumbers(texts)
	vals, err := stats.ParseValuesExact(texts)
	if bad >= 0 || err != nil {
		return nil, errFallBack
	}
	out := &pdCounts{groups: map[string]stats.Tally{}, all: stats.NewTally(vals, all), dec: dec}
	for k, t := range byGroup {
		out.groups[k] = stats.NewTally(vals.Subset(t.idx), t.counts)
	}
	return out, nil
}

// orderStats returns, per group of by (or over all rows when by is ""),
// the order statistics of number column x at the ranks the type 7
// quartiles need (stats.QuartileRanks, 0-based), as the database wrote
// them. pass are the samples' first passes (for their counts), keys the
// groups. The ranks are bound, so the database sorts and streams without
// counting first.
func (p *pd) orderStats(x, by string, pass map[string]pdPass, keys []sqlValue) (map[string]map[int64]string, error) {
	g := p.gsel(by)
	xv := p.k(x)
	q := p.newQ()
	part := ""
	if by != "" {
		part = "PARTITION BY " + g + " "
	}
	in := func(n int64) string {
		var ph []string
		for _, r := range stats.QuartileRanks(int(n)) {
			ph = append(ph, q.arg(int64(r)))
		}
		return "r IN (" + strings.Join(ph, ", ") + ")"
	}
	var conds []string
	if by == "" {
		if n := pass[""].n; n > 0 {
			conds = append(conds, in(n))
		}
	} else {
		for _, k := range keys {
			if n := pass[keyOf(k)].n; !k.null && n > 0 {
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

// pdQuartiles are the extremes and type 7 quartiles of a sample of n values
// from the texts of its extremes and of its order statistics os (by rank),
// read exactly with one offset, and the decimals they are written with
// (for Column.Snap).
func pdQuartiles(n int64, minText, maxText string, os map[int64]string) (stats.Quartiles, int) {
	texts := []string{minText, maxText}
	idx := map[int]int{}
	for _, r := range stats.QuartileRanks(int(n)) {
		if t, ok := os[int64(r)]; ok {
			idx[r] = len(texts)
			texts = append(texts, t)
		}
	}
	v, dec, _ := parseNumbers(texts)
	return stats.QuartilesFrom(int(n), v.Offset, func(r int) float64 {
		if i, ok := idx[r]; ok {
			return v.D[i]
		}
		if r == 0 {
			return v.D[0]
		}
		return v.D[1] // the maximum, rank n - 1
	}), dec
}

// binCounts counts the values of number column x in the bins between
// edges, as stats.CountBins does: [e_i, e_i+1), the last bin closed, and
// values outside the edges left out. The bin of a value is found by a
// balanced tree of comparisons with the bound edges.
func (p *pd) binCounts(x string, edges []float64) ([]int, error) {
	k := len(edges) - 1
	if k < 1 {
		return nil, nil
	}
	counts := make([]int, k)
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

// boxes returns, per group of by (or over all rows), the most extreme
// values of x within lo and hi (Tukey's fences) and the values beyond
// them, as stats.BoxWhiskers finds them; past pdMaxOutliers, the most
// extreme outliers on each side, and how many were not fetched.
func (p *pd) boxes(x, by string, keys []sqlValue, lo, hi []float64) (map[string]*stats.Whiskers, int, error) {
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
	out := map[string]*stats.Whiskers{}
	total := int64(0)
	err := p.query(q, sqlText, func(v []sqlValue) error {
		w := &stats.Whiskers{Low: math.Inf(1), High: math.Inf(-1)}
		if !v[1].null {
			w.Low, w.High = atof(v[1]), atof(v[2])
		}
		out[keyOf(v[0])] = w
		total += atoi(v[3])
		return nil
	})
	if err != nil || total == 0 {
		return out, 0, err
	}
	fetch := func(cond, order string, limit int64) error {
		q := p.newQ()
		sqlText := "SELECT g, v FROM " + inner(q) + " WHERE " + cond + " ORDER BY v " + order + " LIMIT " + strconv.FormatInt(limit, 10)
		return p.query(q, sqlText, func(v []sqlValue) error {
			if w := out[keyOf(v[0])]; w != nil {
				w.Outliers = append(w.Outliers, atof(v[1]))
			}
			return nil
		})
	}
	hidden := 0
	if total <= pdMaxOutliers {
		err = fetch("v < lo OR v > hi", "ASC", total)
	} else {
		// The most extreme outliers on each side; the rest are counted.
		if err = fetch("v < lo", "ASC", pdMaxOutliers/2); err == nil {
			err = fetch("v > hi", "DESC", pdMaxOutliers/2)
		}
		shown := 0
		for _, w := range out {
			shown += len(w.Outliers)
		}
		hidden = int(total) - shown
	}
	for _, w := range out {
		sort.Float64s(w.Outliers)
	}
	return out, hidden, err
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
