package blocks

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"candor/blocks/stats"
	"candor/figures"
)

// The four analyses that run in the database. Each gets its numbers from
// the statements in pushdown_query.go and then publishes its facts, tables
// and figure by the same rules, in the same order, as its in-memory
// counterpart (frequency.go, crosstab.go, summary.go, compare.go);
// pushdown_test.go compares the two Results whole. A change to one of
// those files needs the same change here.

func init() {
	pdRunners["frequency"] = pdFrequency
	pdRunners["crosstab"] = pdCrosstab
	pdRunners["summary"] = pdSummary
	pdRunners["compare"] = pdCompare
}

// ---- frequency ----

func pdFrequency(p *pd) error {
	a := p.a
	s := a.spec
	name := s.Target[0]
	sc := p.src.col(name)
	var levels []level
	binned, ordered := false, false
	miss := 0
	if p.kind[name] == pdNum {
		q := p.newQ()
		x := p.k(name)
		sqlText := fmt.Sprintf("SELECT COUNT(*), COUNT(%s), MIN(%s), MAX(%s), SUM(CASE WHEN %s <> ROUND(%s) THEN 1 ELSE 0 END), COUNT(DISTINCT %s) FROM %s",
			x, x, x, x, x, x, q.base())
		var rows, n, nonWhole, distinct int64
		var lo, hi float64
		err := p.query(q, sqlText, func(v []sqlValue) error {
			rows, n, lo, hi, nonWhole, distinct = atoi(v[0]), atoi(v[1]), atof(v[2]), atof(v[3]), atoi(v[4]), atoi(v[5])
			return nil
		})
		if err != nil {
			return err
		}
		if rows == 0 {
			return p.noRows()
		}
		if err := a.chartOK(figures.Bar, figures.Pie, figures.Histogram, figures.Dot, figures.Line); err != nil {
			return err
		}
		miss = int(rows - n)
		if !s.Bins.set() && n > 0 && nonWhole == 0 && distinct <= discreteMax {
			q := p.newQ()
			sqlText := fmt.Sprintf("SELECT %s, COUNT(*) FROM %s WHERE %s IS NOT NULL GROUP BY %s", x, q.base(), x, x)
			err := p.query(q, sqlText, func(v []sqlValue) error {
				f := atof(v[0])
				levels = append(levels, level{label: strconv.FormatFloat(f, 'f', -1, 64), count: int(atoi(v[1])), lo: f, hi: f})
				return nil
			})
			if err != nil {
				return err
			}
			sort.Slice(levels, func(i, j int) bool { return levels[i].lo < levels[j].lo })
			ordered = true
		} else {
			if len(s.Order) > 0 {
				return Errorf(s.KeyPos["order"], "order does not apply to a binned number column; bins keep the order of their values")
			}
			var err error
			levels, err = p.binLevels(name, n, lo, hi)
			if err != nil {
				return err
			}
			binned, ordered = true, true
		}
	} else {
		lv, m, err := p.levelsOf(name)
		if err != nil {
			return err
		}
		total := m
		for _, l := range lv {
			total += l.rows
		}
		if total == 0 {
			return p.noRows()
		}
		if err := a.chartOK(figures.Bar, figures.Pie, figures.Histogram, figures.Dot, figures.Line); err != nil {
			return err
		}
		if s.Bins.set() {
			return Errorf(s.BinsPos, "bins applies to number columns, and %s holds %s values", name, sc.typ)
		}
		g, nat, err := p.orderLevels(name, s.TargetPos[0], lv)
		if err != nil {
			return err
		}
		miss = int(m)
		ordered = nat
		for _, x := range g {
			levels = append(levels, level{label: x.Label, count: int(lv[x.Rows[0]].rows)})
		}
		if !nat {
			sort.SliceStable(levels, func(i, j int) bool { return levels[i].count > levels[j].count })
		}
	}
	return frequencyResult(a, name, sc.typ == TypeNumber, levels, miss, binned, ordered)
}

// binLevels is run.binLevels with the extremes and counts from the
// database.
func (p *pd) binLevels(name string, n int64, lo, hi float64) ([]level, error) {
	a := p.a
	b := a.spec.Bins
	var edges []float64
	spread := func(rule string) (sd, iqr float64, err error) {
		sd, iqr = math.NaN(), math.NaN()
		switch rule {
		case "scott":
			ms, _, err := p.moments(name, "")
			if err != nil {
				return sd, iqr, err
			}
			m := ms[""]
			if m.n > 0 {
				_, m2, _ := m.central()
				sd = math.Sqrt(f64(bf().Quo(m2, bfInt(m.n))))
			}
		case "fd":
			ms, _, err := p.moments(name, "")
			if err != nil {
				return sd, iqr, err
			}
			os, err := p.orderStats(name, "", ms, nil)
			if err != nil {
				return sd, iqr, err
			}
			m := ms[""]
			iqr = quartiles(m.n, m.min, m.max, os[""]).iqr
		}
		return sd, iqr, nil
	}
	switch {
	case len(b.Edges) > 0:
		edges = b.Edges
		if n > 0 && (lo < edges[0] || hi > edges[len(edges)-1]) {
			return nil, Errorf(a.spec.BinsPos, "bins: the edges run from %g to %g but %s runs from %g to %g; widen the edges so every value falls in a bin", edges[0], edges[len(edges)-1], a.spec.Target[0], lo, hi)
		}
		a.method("bins-edges")
	case b.Count > 0:
		edges = pdBinEdges(n, lo, hi, math.NaN(), math.NaN(), "", b.Count)
		a.method("bins-count")
	default:
		rule := b.Rule
		if rule == "" {
			rule = "sturges"
		}
		sd, iqr, err := spread(rule)
		if err != nil {
			return nil, err
		}
		edges = pdBinEdges(n, lo, hi, sd, iqr, rule, 0)
		a.method(rule)
	}
	counts, err := p.binCounts(name, edges)
	if err != nil {
		return nil, err
	}
	out := make([]level, len(counts))
	for i, n := range counts {
		closing := ")"
		if i == len(counts)-1 {
			closing = "]"
		}
		out[i] = level{label: "[" + trimNum(edges[i]) + ", " + trimNum(edges[i+1]) + closing, count: n, lo: edges[i], hi: edges[i+1]}
	}
	return out, nil
}

// frequencyResult publishes a frequency table's facts, table and figure
// from its levels, as runFrequency does after counting.
func frequencyResult(a *run, name string, number bool, levels []level, miss int, binned, ordered bool) error {
	s := a.spec
	n := 0
	for _, l := range levels {
		n += l.count
	}
	if n == 0 {
		return Errorf(s.TargetPos[0], "frequency: column %q has no values here (all %d are missing)", name, miss)
	}
	a.res.Meta.N = n
	a.res.Meta.Ordered = ordered
	a.res.Meta.Binned = binned
	a.res.Meta.Outcome = "categorical"
	if number {
		a.res.Meta.Outcome = "numeric"
	}
	a.set("n", float64(n), Count, "")
	a.set("missing", float64(miss), Count, "")
	a.set("levels", float64(len(levels)), Count, "")
	tab := Table{Head: []string{name, "Count", "Relative", "Percent", "Cumulative count", "Cumulative %"}}
	cum := 0
	slugs := map[string]bool{}
	for _, l := range levels {
		cum += l.count
		sl := Slug(l.label)
		if slugs[sl] {
			return Errorf(s.TargetPos[0], "two levels of %s share the fact name %q; rename one", name, sl)
		}
		slugs[sl] = true
		a.res.Meta.Levels = append(a.res.Meta.Levels, l.label)
		pct := 100 * float64(l.count) / float64(n)
		cpct := 100 * float64(cum) / float64(n)
		a.set(sl+".count", float64(l.count), Count, "")
		a.set(sl+".pct", pct, Percent, "")
		a.set(sl+".cum_count", float64(cum), Count, "")
		a.set(sl+".cum_pct", cpct, Percent, "")
		p := s.ID + "." + sl + "."
		tab.Rows = append(tab.Rows, []Cell{
			cellText(l.label),
			cellNum(Format(a.res.Facts[p+"count"], -1), p+"count"),
			cellNum(strconv.FormatFloat(float64(l.count)/float64(n), 'f', 3, 64), ""),
			cellNum(Format(a.res.Facts[p+"pct"], -1), p+"pct"),
			cellNum(Format(a.res.Facts[p+"cum_count"], -1), p+"cum_count"),
			cellNum(Format(a.res.Facts[p+"cum_pct"], -1), p+"cum_pct"),
		})
	}
	tab.Rows = append(tab.Rows, []Cell{cellText("Total"), cellNum(Format(a.res.Facts[s.ID+".n"], -1), s.ID+".n"),
		cellNum("1.000", ""), cellNum("100.0%", ""), cellText(""), cellText("")})
	if !ordered {
		tab.Notes = append(tab.Notes, "Categories have no order of their own; they are listed from the most to the least frequent, so cumulative figures depend on that order.")
	}
	if binned {
		tab.Notes = append(tab.Notes, "Each bin includes its lower edge and excludes its upper edge, except the last, which includes both.")
	}
	if miss > 0 {
		tab.Notes = append(tab.Notes, fmt.Sprintf("%s missing values are not counted; percentages are of the %s values present.", Thousands(strconv.Itoa(miss)), Thousands(strconv.Itoa(n))))
	}
	a.res.Tables = append(a.res.Tables, tab)

	def := figures.Bar
	if binned {
		def = figures.Histogram
	}
	fs := a.figure(def)
	fs.Title = "Frequency of " + name
	fs.XLabel = name
	fs.YLabel = "Count"
	if s.Percent {
		fs.YLabel = "Percent"
	}
	value := func(l level) float64 {
		if s.Percent {
			return 100 * float64(l.count) / float64(n)
		}
		return float64(l.count)
	}
	if fs.Kind == figures.Histogram && binned {
		for _, l := range levels {
			fs.Bins = append(fs.Bins, figures.Bin{Lo: l.lo, Hi: l.hi, Value: value(l)})
		}
		return nil
	}
	ser := figures.Series{Name: fs.YLabel}
	for _, l := range levels {
		fs.Categories = append(fs.Categories, l.label)
		ser.Values = append(ser.Values, value(l))
	}
	if fs.Kind == figures.Pie {
		fs.Percent = true
		ser.Values = ser.Values[:0]
		for _, l := range levels {
			ser.Values = append(ser.Values, 100*float64(l.count)/float64(n))
		}
	}
	fs.Series = []figures.Series{ser}
	return nil
}

// ---- crosstab ----

func pdCrosstab(p *pd) error {
	a := p.a
	s := a.spec
	rname, cname := s.Target[0], s.Target[1]
	if rname == cname {
		// run.groups would read the same column twice; the in-memory
		// path words this best.
		return errFallBack
	}
	pairs, err := p.pairCounts(rname, cname)
	if err != nil {
		return err
	}
	var total int64
	for _, pr := range pairs {
		total += pr.n
	}
	if total == 0 {
		return p.noRows()
	}
	if err := a.chartOK(figures.Stacked, figures.Grouped); err != nil {
		return err
	}
	levelsOf := func(name string, key func(pdPair) sqlValue) ([]pdLevel, error) {
		byKey := map[string]*pdLevel{}
		var out []*pdLevel
		for _, pr := range pairs {
			k := key(pr)
			if k.null {
				continue
			}
			l := byKey[k.text]
			if l == nil {
				lab, ok := p.label(name, k)
				if !ok {
					return nil, errFallBack
				}
				l = &pdLevel{key: k, label: lab}
				byKey[k.text] = l
				out = append(out, l)
			}
			l.rows += pr.n
		}
		res := make([]pdLevel, len(out))
		for i, l := range out {
			res[i] = *l
		}
		return res, nil
	}
	rl, err := levelsOf(rname, func(pr pdPair) sqlValue { return pr.a })
	if err != nil {
		return err
	}
	cl, err := levelsOf(cname, func(pr pdPair) sqlValue { return pr.b })
	if err != nil {
		return err
	}
	rows, rowOrdered, err := p.orderLevels(rname, s.TargetPos[0], rl)
	if err != nil {
		return err
	}
	saved := a.spec.Order
	a.spec.Order = nil
	cols, colOrdered, err := p.orderLevels(cname, s.TargetPos[1], cl)
	a.spec.Order = saved
	if err != nil {
		return err
	}
	rowOf := map[string]int{}
	for i, g := range rows {
		rowOf[rl[g.Rows[0]].key.text] = i
	}
	colOf := map[string]int{}
	for j, g := range cols {
		colOf[cl[g.Rows[0]].key.text] = j
	}
	counts := make([][]float64, len(rows))
	for i := range counts {
		counts[i] = make([]float64, len(cols))
	}
	for _, pr := range pairs {
		if pr.a.null || pr.b.null {
			continue
		}
		counts[rowOf[pr.a.text]][colOf[pr.b.text]] += float64(pr.n)
	}
	return crosstabResult(a, rows, cols, counts, rowOrdered, colOrdered)
}

// crosstabResult publishes a crosstab from its counts, as runCrosstab does
// after counting.
func crosstabResult(a *run, rows, cols []Group, counts [][]float64, rowOrdered, colOrdered bool) error {
	s := a.spec
	rowTot := make([]float64, len(rows))
	colTot := make([]float64, len(cols))
	n := 0.0
	for i := range rows {
		for j := range cols {
			rowTot[i] += counts[i][j]
			colTot[j] += counts[i][j]
			n += counts[i][j]
		}
	}
	if n == 0 {
		return Errorf(s.TargetPos[0], "crosstab: no row has values for both %s and %s", s.Target[0], s.Target[1])
	}
	a.res.Meta.N = int(n)
	a.res.Meta.Ordered = rowOrdered && colOrdered
	for _, r := range rows {
		a.res.Meta.Levels = append(a.res.Meta.Levels, r.Label)
	}
	for _, c := range cols {
		a.res.Meta.ColLevels = append(a.res.Meta.ColLevels, c.Label)
	}
	a.method("chi-square", "cramer-v")
	cs := stats.ChiSquareIndependence(counts)
	a.set("n", n, Count, "")
	a.set("chi2", cs.Chi2, Number, reasonOf(cs.Reason, "Chi2"))
	a.set("df", float64(cs.DF), Count, "")
	a.set("p", cs.P, PValue, reasonOf(cs.Reason, "P"))
	a.set("v", cs.CramersV, Number, reasonOf(cs.Reason, "CramersV"))
	a.set("min_expected", cs.MinExpected, Number, reasonOf(cs.Reason, "MinExpected"))
	low := 0
	for i := range rows {
		for j := range cols {
			if rowTot[i] > 0 && colTot[j] > 0 && cs.Expected != nil && cs.Expected[i][j] < 5 {
				low++
			}
		}
	}
	a.set("low_expected", float64(low), Count, "")
	for i, r := range rows {
		a.set(r.Slug+".total", rowTot[i], Count, "")
		for j, c := range cols {
			p := r.Slug + "." + c.Slug + "."
			a.set(p+"count", counts[i][j], Count, "")
			why := ""
			if rowTot[i] == 0 {
				why = "no cases in this row"
			}
			a.set(p+"row_pct", 100*counts[i][j]/rowTot[i], Percent, why)
			why = ""
			if colTot[j] == 0 {
				why = "no cases in this column"
			}
			a.set(p+"col_pct", 100*counts[i][j]/colTot[j], Percent, why)
			a.set(p+"pct", 100*counts[i][j]/n, Percent, "")
		}
	}
	head := []string{s.Target[0] + " \\ " + s.Target[1]}
	for _, c := range cols {
		head = append(head, c.Label)
	}
	head = append(head, "Total")
	table := func(caption, suffix string, total func(i int) string) Table {
		t := Table{Caption: caption, Head: head}
		for i, r := range rows {
			row := []Cell{cellText(r.Label)}
			for _, c := range cols {
				row = append(row, a.numCell(r.Slug+"."+c.Slug+"."+suffix))
			}
			row = append(row, cellNum(total(i), ""))
			t.Rows = append(t.Rows, row)
		}
		return t
	}
	ct := table(fmt.Sprintf("Counts of %s by %s.", s.Target[0], s.Target[1]), "count", func(i int) string { return Thousands(fmt.Sprint(int(rowTot[i]))) })
	tot := []Cell{cellText("Total")}
	for j := range cols {
		tot = append(tot, cellNum(Thousands(fmt.Sprint(int(colTot[j]))), ""))
	}
	tot = append(tot, a.numCell("n"))
	ct.Rows = append(ct.Rows, tot)
	note := fmt.Sprintf("Pearson's chi-square test of independence: chi-square = %s, df = %d, %s; Cramér's V = %s.",
		Format(a.res.Facts[s.ID+".chi2"], -1), cs.DF, pText(a.res.Facts[s.ID+".p"]), Format(a.res.Facts[s.ID+".v"], -1))
	ct.Notes = append(ct.Notes, note)
	if low > 0 {
		ct.Notes = append(ct.Notes, fmt.Sprintf("%d of %d cells have an expected count below 5 (smallest %s), so the chi-square p-value is only approximate.",
			low, len(rows)*len(cols), Sig(cs.MinExpected, 3)))
	}
	rt := table("Row percentages: each row sums to 100%.", "row_pct", func(i int) string { return "100.0%" })
	colt := table("Column percentages: each column sums to 100%.", "col_pct", func(i int) string {
		return Format(Fact{Value: 100 * rowTot[i] / n, Kind: Percent}, -1)
	})
	a.res.Tables = append(a.res.Tables, ct, rt, colt)

	fs := a.figure(figures.Stacked)
	fs.Title = fmt.Sprintf("%s by %s", s.Target[1], s.Target[0])
	fs.XLabel, fs.YLabel = s.Target[0], "% of "+s.Target[0]
	fs.Percent = true
	for i, r := range rows {
		if rowTot[i] == 0 {
			continue
		}
		fs.Categories = append(fs.Categories, r.Label)
	}
	for j, c := range cols {
		ser := figures.Series{Name: c.Label}
		for i := range rows {
			if rowTot[i] == 0 {
				continue
			}
			if fs.Kind == figures.Stacked || s.Percent {
				ser.Values = append(ser.Values, 100*counts[i][j]/rowTot[i])
			} else {
				ser.Values = append(ser.Values, counts[i][j])
			}
		}
		fs.Series = append(fs.Series, ser)
	}
	if fs.Kind != figures.Stacked && !s.Percent {
		fs.Percent = false
		fs.YLabel = "Count"
	}
	return nil
}

// ---- samples of a number column ----

// pdSample is one sample of a number column: its summary (snapped as in
// memory), its moments, the key of its group, and its value counts when
// they were few enough to fetch.
type pdSample struct {
	key  string
	sum  stats.Summary
	mom  pdMoments
	hist *pdHist
}

// samples summarises number column x per group of by (and over all rows):
// the overall sample and one per group key, NULL included. With few
// distinct values, one GROUP BY of the values gives every sum and order
// statistic exactly; otherwise the database computes the centred sums and
// the order statistics itself.
func (p *pd) samples(x, by string) (all pdSample, groups map[string]pdSample, keys []sqlValue, err error) {
	ms, keys, err := p.firstPass(x, by, nil)
	if err != nil {
		return all, nil, nil, err
	}
	return p.samplesFrom(x, by, ms, keys)
}

// samplesFrom is samples after its first pass.
func (p *pd) samplesFrom(x, by string, ms map[string]pdMoments, keys []sqlValue) (all pdSample, groups map[string]pdSample, _ []sqlValue, err error) {
	summarise := func(m pdMoments, os map[int64]string) stats.Summary {
		q := quartiles(m.n, m.min, m.max, os)
		return snapSummary(pdDescribe(m, q), &Column{Decimals: q.dec})
	}
	groups = map[string]pdSample{}
	hs, few, err := p.valueCounts(x, by)
	if err != nil {
		return all, nil, nil, err
	}
	if few {
		var list []pdMoments
		var hl []*pdHist
		for _, k := range keys {
			key := keyOf(k)
			m := ms[key]
			if h := hs[key]; h != nil {
				m = h.moments(m)
				hl = append(hl, h)
			}
			ms[key] = m
			list = append(list, m)
		}
		om := combine(list)
		var ah *pdHist
		if by == "" {
			ah = hs[""]
		} else {
			ah = mergeHists(hl)
		}
		if ah != nil && len(ah.vals) > 0 {
			om = ah.moments(om)
			all = pdSample{sum: summarise(om, ah.orderStats(om.n)), mom: om, hist: ah}
		} else {
			all = pdSample{sum: summarise(om, nil), mom: om}
		}
		if by != "" {
			for _, k := range keys {
				key := keyOf(k)
				m := ms[key]
				var os map[int64]string
				h := hs[key]
				if h != nil {
					os = h.orderStats(m.n)
				}
				groups[key] = pdSample{key: key, sum: summarise(m, os), mom: m, hist: h}
			}
		}
		return all, groups, keys, nil
	}
	if err := p.centredSums(x, by, ms, keys); err != nil {
		return all, nil, nil, err
	}
	list := make([]pdMoments, 0, len(keys))
	for _, k := range keys {
		list = append(list, ms[keyOf(k)])
	}
	om := combine(list)
	if by == "" {
		om = ms[""]
	}
	osAll, err := p.orderStats(x, "", map[string]pdMoments{"": om}, nil)
	if err != nil {
		return all, nil, nil, err
	}
	all = pdSample{key: "", sum: summarise(om, osAll[""]), mom: om}
	if by != "" {
		osBy, err := p.orderStats(x, by, ms, keys)
		if err != nil {
			return all, nil, nil, err
		}
		for _, k := range keys {
			key := keyOf(k)
			groups[key] = pdSample{key: key, sum: summarise(ms[key], osBy[key]), mom: ms[key]}
		}
	}
	return all, groups, keys, nil
}

// boxesOf gives the boxes of samples: from their value counts when they
// have them, else from the database.
func (p *pd) boxesOf(x, by string, samples []pdSample, keys []sqlValue) (map[string]*pdBox, error) {
	var sums []stats.Summary
	for _, sm := range samples {
		sums = append(sums, sm.sum)
	}
	lo, hi := fences(sums)
	fromCounts := true
	for _, sm := range samples {
		if sm.hist == nil {
			fromCounts = false
		}
	}
	if !fromCounts {
		return p.boxes(x, by, keys, lo, hi)
	}
	out := map[string]*pdBox{}
	hidden := 0
	for i, sm := range samples {
		b := sm.hist.box(lo[i], hi[i])
		hidden += b.hidden
		b.hidden = 0
		out[boxKey(by, keys[i])] = b
	}
	for _, b := range out {
		b.hidden = hidden
		break
	}
	return out, nil
}

// byLevels are the groups of by (as run.groups orders them) with their
// keys, from a moments result, and the rows where by is missing.
func (p *pd) byLevels(by string, ms map[string]pdMoments, keys []sqlValue) ([]Group, []sqlValue, int, error) {
	var lv []pdLevel
	miss := 0
	for _, k := range keys {
		m := ms[keyOf(k)]
		if k.null {
			miss = int(m.rows)
			continue
		}
		lab, ok := p.label(by, k)
		if !ok {
			return nil, nil, 0, errFallBack
		}
		lv = append(lv, pdLevel{key: k, label: lab, rows: m.rows})
	}
	gs, _, err := p.orderLevels(by, p.spec.ByPos, lv)
	if err != nil {
		return nil, nil, 0, err
	}
	gkeys := make([]sqlValue, len(gs))
	for i, g := range gs {
		gkeys[i] = lv[g.Rows[0]].key
	}
	return gs, gkeys, miss, nil
}

// pdBoxStats is boxStats with the whiskers and outliers from the database.
func pdBoxStats(label string, b *pdBox, s stats.Summary) figures.BoxStats {
	out := figures.BoxStats{Label: label, Q1: s.Q1, Median: s.Median, Q3: s.Q3, N: s.N}
	if s.N == 0 || b == nil {
		return out
	}
	out.WhiskerLow, out.WhiskerHigh = b.wlo, b.whi
	out.Outliers = append([]float64(nil), b.outliers...)
	return out
}

// fences are Tukey's fences of each summary: Q1 - 1.5 IQR and Q3 + 1.5 IQR.
func fences(sums []stats.Summary) (lo, hi []float64) {
	for _, s := range sums {
		lo = append(lo, s.Q1-1.5*s.IQR)
		hi = append(hi, s.Q3+1.5*s.IQR)
	}
	return
}

// ---- summary ----

func pdSummary(p *pd) error {
	a := p.a
	s := a.spec
	for _, name := range s.Target {
		if p.kind[name] != pdNum {
			return errFallBack // run.numeric words the error
		}
	}
	type row struct {
		label   string
		prefix  string
		sum     stats.Summary
		miss    int
		overall bool
		col     string
		key     sqlValue // the group, for its box
		n       int64
		lo, hi  float64 // the extremes, for a histogram
	}
	type colData struct {
		all    pdSample
		groups map[string]pdSample
		keys   []sqlValue
	}
	data := map[string]colData{}
	for _, name := range s.Target {
		all, groups, keys, err := p.samples(name, s.By)
		if err != nil {
			return err
		}
		data[name] = colData{all, groups, keys}
	}
	first := data[s.Target[0]]
	if first.all.mom.rows == 0 {
		return p.noRows()
	}
	if err := a.chartOK(figures.Box, figures.Histogram, figures.Dot, figures.Bar); err != nil {
		return err
	}
	multi := len(s.Target) > 1
	a.method("mean-sd", "t-interval", "quartiles-type7", "skewness-g1")
	var groups []Group
	var gkeys []sqlValue
	if s.By != "" {
		ms := map[string]pdMoments{}
		for k, g := range first.groups {
			ms[k] = g.mom
		}
		var missBy int
		var err error
		groups, gkeys, missBy, err = p.byLevels(s.By, ms, first.keys)
		if err != nil {
			return err
		}
		a.res.Meta.By = s.By
		for _, g := range groups {
			a.res.Meta.Groups = append(a.res.Meta.Groups, g.Label)
		}
		if missBy > 0 {
			a.note("%d rows with no value for %s belong to no group; they count in the overall figures only.", missBy, s.By)
		}
	}
	var rows []row
	for _, name := range s.Target {
		cd := data[name]
		pre, label := "", name
		if multi {
			pre = Slug(name) + "."
		}
		if s.By != "" {
			label = "All"
			if multi {
				label = name + ", all"
			}
		}
		om := cd.all.mom
		rows = append(rows, row{label: label, prefix: pre, sum: cd.all.sum, miss: int(om.rowsMiss), overall: s.By != "", col: name,
			n: om.n, lo: atof(sqlValue{text: om.min, null: om.n == 0}), hi: atof(sqlValue{text: om.max, null: om.n == 0})})
		for i, g := range groups {
			gs := cd.groups[keyOf(gkeys[i])]
			label := g.Label
			if multi {
				label = name + ", " + g.Label
			}
			rows = append(rows, row{label: label, prefix: g.Slug + "." + pre, sum: gs.sum, miss: int(gs.mom.rowsMiss), col: name, key: gkeys[i]})
		}
	}
	a.res.Meta.N = rows[0].sum.N
	head := []string{"", "n", "Missing", "Mean", "95% CI", "SD", "SE", "Min", "Q1", "Median", "Q3", "Max", "IQR", "Skewness"}
	if s.By != "" && !multi {
		head[0] = s.By
	}
	tab := Table{Head: head}
	for _, r := range rows {
		for _, f := range summaryFacts {
			v, reason := summaryValue(r.sum, f.name)
			if f.name == "missing" {
				v, reason = float64(r.miss), ""
			}
			a.set(r.prefix+f.name, v, f.kind, reason)
		}
		cells := []Cell{cellText(r.label)}
		for _, f := range summaryFacts {
			name := a.spec.ID + "." + r.prefix + f.name
			switch f.name {
			case "mean_high":
				continue
			case "mean_low":
				lo, hi := a.res.Facts[name], a.res.Facts[a.spec.ID+"."+r.prefix+"mean_high"]
				text := "undefined"
				if lo.Defined() && hi.Defined() {
					text = Format(lo, -1) + " to " + Format(hi, -1)
				}
				cells = append(cells, cellNum(text, name))
				continue
			}
			cells = append(cells, cellNum(Format(a.res.Facts[name], -1), name))
		}
		tab.Rows = append(tab.Rows, cells)
	}
	tab.Notes = append(tab.Notes, "Quartiles by Hyndman and Fan's type 7 (as a spreadsheet's QUARTILE.INC); 95% CI of the mean from Student's t.")
	if len(tab.Rows) <= 6 {
		tab = tab.Transpose()
	}
	a.res.Tables = append(a.res.Tables, tab)

	kind := figures.Histogram
	if s.By != "" || multi {
		kind = figures.Box
	}
	fs := a.figure(kind)
	fs.Percent = false
	what := s.Target[0]
	if multi {
		what = "Values"
	}
	if fs.Kind == figures.Histogram {
		r := rows[0]
		if r.n == 0 {
			a.res.Figure = nil
			return nil
		}
		edges := pdBinEdges(r.n, r.lo, r.hi, math.NaN(), math.NaN(), "sturges", 0)
		var counts []int
		if h := data[r.col].all.hist; h != nil {
			counts = h.bins(edges)
		} else {
			var err error
			if counts, err = p.binCounts(r.col, edges); err != nil {
				return err
			}
		}
		for i, n := range counts {
			fs.Bins = append(fs.Bins, figures.Bin{Lo: edges[i], Hi: edges[i+1], Value: float64(n)})
		}
		fs.Title = "Distribution of " + what
		fs.XLabel, fs.YLabel = what, "Count"
		a.method("sturges")
		return nil
	}
	// Boxes come from the database only when a box plot is drawn.
	boxes := map[string]map[string]*pdBox{}
	if fs.Kind == figures.Box {
		for _, name := range s.Target {
			var samples []pdSample
			var keys []sqlValue
			for _, r := range rows {
				if r.col == name && !r.overall && r.sum.N > 0 {
					sm := data[name].all
					if s.By != "" {
						sm = data[name].groups[keyOf(r.key)]
					}
					samples = append(samples, sm)
					keys = append(keys, r.key)
				}
			}
			if len(samples) == 0 {
				continue
			}
			bx, err := p.boxesOf(name, s.By, samples, keys)
			if err != nil {
				return err
			}
			boxes[name] = bx
			p.noteHidden(bx)
		}
	}
	ser := figures.Series{Name: "Mean"}
	for _, r := range rows {
		if r.overall || r.sum.N == 0 {
			continue
		}
		fs.Categories = append(fs.Categories, r.label)
		if fs.Kind == figures.Box {
			fs.Boxes = append(fs.Boxes, pdBoxStats(r.label, boxes[r.col][boxKey(s.By, r.key)], r.sum))
		}
		ser.Values = append(ser.Values, r.sum.Mean)
		ser.Low = append(ser.Low, r.sum.MeanLow)
		ser.High = append(ser.High, r.sum.MeanHigh)
	}
	if fs.Kind == figures.Box {
		a.method("tukey-box")
	} else {
		fs.Boxes = nil
		fs.Series = []figures.Series{ser}
		if fs.Kind == figures.Bar {
			fs.Series[0].Low, fs.Series[0].High = nil, nil
		}
	}
	fs.Title, fs.YLabel = what, what
	if s.By != "" {
		fs.Title = fmt.Sprintf("%s by %s", what, s.By)
		fs.XLabel = s.By
	}
	if len(fs.Categories) == 0 {
		a.res.Figure = nil
	}
	return nil
}

// boxKey is the key boxes files a group's box under.
func boxKey(by string, k sqlValue) string {
	if by == "" {
		return ""
	}
	return keyOf(k)
}

// noteHidden says when a box plot shows only the most extreme outliers.
func (p *pd) noteHidden(bx map[string]*pdBox) {
	for _, b := range bx {
		if b.hidden > 0 {
			p.a.note("The box plot shows the %s most extreme outliers on each side; %s more lie between them and the whiskers.",
				Thousands(strconv.Itoa(pdMaxOutliers/2)), Thousands(strconv.Itoa(b.hidden)))
			return
		}
	}
}

// ---- compare ----

// pdOutcome is readOutcome's decision from the database.
type pdOutcome struct {
	binary  bool
	success string
	hitText func(label string) bool // text outcomes
}

func pdCompare(p *pd) error {
	a := p.a
	s := a.spec
	y := s.Target[0]
	// One statement gives the groups and, per group, what the outcome
	// needs: for a number, its count, sums and the values equal to the
	// success (1 by default); for text, the rows of every pair of levels.
	var gl []pdLevel
	var missBy int64
	var ms map[string]pdMoments
	var mkeys []sqlValue
	var pairs []pdPair
	var ylevels []string
	number := p.kind[y] == pdNum
	var hit *float64
	if number && s.HasSucc {
		sv, err := strconv.ParseFloat(s.Success, 64)
		if err != nil {
			return errFallBack // no value matches; run.readOutcome says so
		}
		hit = &sv
	}
	if number {
		var err error
		if ms, mkeys, err = p.firstPass(y, s.By, hit); err != nil {
			return err
		}
		for _, k := range mkeys {
			m := ms[keyOf(k)]
			if k.null {
				missBy = m.rows
				continue
			}
			lab, ok := p.label(s.By, k)
			if !ok {
				return errFallBack
			}
			gl = append(gl, pdLevel{key: k, label: lab, rows: m.rows})
		}
	} else {
		var err error
		if pairs, err = p.pairCounts(s.By, y); err != nil {
			return err
		}
		byKey := map[string]int{}
		seenY := map[string]bool{}
		for _, pr := range pairs {
			if !pr.b.null && !seenY[pr.b.text] {
				seenY[pr.b.text] = true
				lab, _ := p.label(y, pr.b)
				ylevels = append(ylevels, lab)
			}
			if pr.a.null {
				missBy += pr.n
				continue
			}
			i, ok := byKey[pr.a.text]
			if !ok {
				lab, ok := p.label(s.By, pr.a)
				if !ok {
					return errFallBack
				}
				i = len(gl)
				byKey[pr.a.text] = i
				gl = append(gl, pdLevel{key: pr.a, label: lab})
			}
			gl[i].rows += pr.n
		}
		if p.src.col(y).typ == TypeBinary && len(ylevels) > 2 {
			return errFallBack
		}
	}
	total := missBy
	for _, l := range gl {
		total += l.rows
	}
	if total == 0 {
		return p.noRows()
	}
	if s.By == y {
		return Errorf(s.ByPos, "compare: by names the outcome itself; group by another column")
	}
	// readOutcome's decision.
	var o *pdOutcome
	if number {
		var n, hits, other int64
		for _, m := range ms {
			n, hits, other = n+m.n, hits+m.hits, other+m.other
		}
		switch {
		case s.HasSucc:
			if hits == 0 {
				return errFallBack
			}
			o = &pdOutcome{binary: true, success: s.Success}
		case n > 0 && other == 0:
			o = &pdOutcome{binary: true, success: "1"}
		default:
			o = &pdOutcome{}
		}
	} else {
		var err error
		if o, err = p.textOutcome(ylevels); err != nil {
			return err
		}
	}
	gs, _, err := p.orderLevels(s.By, s.ByPos, gl)
	if err != nil {
		return err
	}
	keys := make([]sqlValue, len(gs))
	for i, g := range gs {
		keys[i] = gl[g.Rows[0]].key
	}
	if len(gs) < 2 {
		label := "none"
		if len(gs) == 1 {
			label = fmt.Sprintf("only %q", gs[0].Label)
		}
		return Errorf(s.ByPos, "compare needs at least two groups of %s, and these rows have %s; check the where: conditions or the grouping column", s.By, label)
	}
	ref, err := a.reference(gs)
	if err != nil {
		return err
	}
	a.res.Meta.By = s.By
	a.res.Meta.Reference = gs[ref].Label
	for _, g := range gs {
		a.res.Meta.Groups = append(a.res.Meta.Groups, g.Label)
	}
	if missBy > 0 {
		a.note("%s rows with no value for %s are left out.", Thousands(fmt.Sprint(missBy)), s.By)
	}
	if o.binary {
		xs := make([]int, len(gs))
		ns := make([]int, len(gs))
		idx := map[string]int{}
		for i, k := range keys {
			idx[keyOf(k)] = i
		}
		if number {
			for i, k := range keys {
				m := ms[keyOf(k)]
				ns[i], xs[i] = int(m.n), int(m.hits)
			}
		} else {
			for _, pr := range pairs {
				i, ok := idx[keyOf(pr.a)]
				if !ok || pr.a.null || pr.b.null {
					continue
				}
				ns[i] += int(pr.n)
				if lab, _ := p.label(y, pr.b); o.hitText(lab) {
					xs[i] += int(pr.n)
				}
			}
		}
		return p.compareBinary(o, gs, ref, xs, ns)
	}
	return p.compareNumeric(gs, keys, ref, ms, mkeys)
}

// textOutcome is readOutcome for a text column, from its levels.
func (p *pd) textOutcome(levels []string) (*pdOutcome, error) {
	s := p.spec
	if s.HasSucc {
		found := false
		for _, l := range levels {
			if sameValue(l, s.Success) {
				found = true
			}
		}
		if !found {
			return nil, errFallBack
		}
		succ := s.Success
		return &pdOutcome{binary: true, success: succ, hitText: func(l string) bool { return sameValue(l, succ) }}, nil
	}
	if len(levels) <= 2 {
		for _, pr := range binaryPairs {
			ok := true
			for _, l := range levels {
				if !strings.EqualFold(l, pr[0]) && !strings.EqualFold(l, pr[1]) {
					ok = false
				}
			}
			if ok && len(levels) > 0 {
				succ := pr[0]
				return &pdOutcome{binary: true, success: succ, hitText: func(l string) bool { return strings.EqualFold(l, succ) }}, nil
			}
		}
	}
	return nil, errFallBack // not numbers and no success: run.readOutcome words it
}

func (p *pd) compareBinary(o *pdOutcome, gs []Group, ref int, xs, ns []int) error {
	a := p.a
	s := a.spec
	if err := a.chartOK(figures.Grouped, figures.Bar, figures.Dot, figures.Stacked); err != nil {
		return err
	}
	a.res.Meta.Outcome = "binary"
	a.method("wilson", "newcombe", "katz", "woolf", "z-test")
	total := 0
	for i := range gs {
		total += ns[i]
	}
	a.res.Meta.N = total
	a.set("n", float64(total), Count, "")
	multi := len(gs) > 2
	succ := o.success
	tab := Table{Head: []string{s.By, "n", succ, "% " + succ, "95% CI", "Difference (points)", "95% CI of difference", "Risk ratio (95% CI)", "Odds ratio (95% CI)", "p"}}
	for i, g := range gs {
		pre := g.Slug + "."
		a.set(pre+"n", float64(ns[i]), Count, "")
		a.set(pre+"successes", float64(xs[i]), Count, "")
		share, why := float64(xs[i])/float64(ns[i]), ""
		if ns[i] == 0 {
			why = "no cases in this group"
		}
		a.set(pre+"pct", pct(share), Percent, why)
		lo, hi := stats.Wilson(xs[i], ns[i], level95)
		a.set(pre+"pct_low", pct(lo), Percent, why)
		a.set(pre+"pct_high", pct(hi), Percent, why)
		row := []Cell{cellText(g.Label), a.numCell(pre + "n"), a.numCell(pre + "successes"), a.numCell(pre + "pct"), a.rangeCell(pre+"pct_low", pre+"pct_high")}
		if i == ref {
			row = append(row, cellNum("reference", ""), cellText(""), cellText(""), cellText(""), cellText(""))
			tab.Rows = append(tab.Rows, row)
			continue
		}
		pr := stats.TwoProportions(xs[ref], ns[ref], xs[i], ns[i], level95)
		r := pr.Reason
		q := ""
		if multi {
			q = pre
		}
		a.set(q+"diff", pct(pr.Diff), Points, reasonOf(r, "Diff"))
		a.set(q+"diff_low", pct(pr.DiffLow), Points, reasonOf(r, "DiffLow"))
		a.set(q+"diff_high", pct(pr.DiffHigh), Points, reasonOf(r, "DiffHigh"))
		a.set(q+"ratio", pr.RiskRatio, Ratio, reasonOf(r, "RiskRatio"))
		a.set(q+"ratio_low", pr.RiskLow, Ratio, reasonOf(r, "RiskLow"))
		a.set(q+"ratio_high", pr.RiskHigh, Ratio, reasonOf(r, "RiskHigh"))
		a.set(q+"odds_ratio", pr.OddsRatio, Ratio, reasonOf(r, "OddsRatio"))
		a.set(q+"odds_low", pr.OddsLow, Ratio, reasonOf(r, "OddsLow"))
		a.set(q+"odds_high", pr.OddsHigh, Ratio, reasonOf(r, "OddsHigh"))
		a.set(q+"z", pr.Z, Number, reasonOf(r, "Z"))
		pname := q + "p"
		if multi {
			pname = pre + "p_z"
		}
		a.set(pname, pr.P, PValue, reasonOf(r, "P"))
		row = append(row, a.numCell(q+"diff"), a.rangeCell(q+"diff_low", q+"diff_high"),
			a.estCell(q+"ratio", q+"ratio_low", q+"ratio_high"), a.estCell(q+"odds_ratio", q+"odds_low", q+"odds_high"), a.numCell(pname))
		tab.Rows = append(tab.Rows, row)
	}
	tab.Notes = append(tab.Notes, fmt.Sprintf("Shares of %s = %s with Wilson intervals. Differences are in percentage points against %s (Newcombe's hybrid score interval); risk ratios with the Katz log interval, odds ratios with Woolf's interval; p from the two-proportion z-test.", s.Target[0], succ, gs[ref].Label))
	if multi {
		a.method("chi-square")
		counts := make([][]float64, len(gs))
		for i := range gs {
			counts[i] = []float64{float64(xs[i]), float64(ns[i] - xs[i])}
		}
		cs := stats.ChiSquareIndependence(counts)
		a.set("chi2", cs.Chi2, Number, reasonOf(cs.Reason, "Chi2"))
		a.set("df", float64(cs.DF), Count, "")
		a.set("p", cs.P, PValue, reasonOf(cs.Reason, "P"))
		a.set("v", cs.CramersV, Number, reasonOf(cs.Reason, "CramersV"))
		tab.Notes = append(tab.Notes, fmt.Sprintf("Across all %d groups: chi-square = %s, df = %d, %s.", len(gs),
			Format(a.res.Facts[s.ID+".chi2"], -1), cs.DF, pText(a.res.Facts[s.ID+".p"])))
		if cs.MinExpected < 5 {
			a.note("Some expected counts are below 5, so the chi-square p-value is only approximate.")
		}
	}
	a.res.Tables = append(a.res.Tables, fitTable(tab))
	fs := a.figure(figures.Grouped)
	fs.Percent = true
	fs.Title = fmt.Sprintf("Share %s = %s by %s", s.Target[0], succ, s.By)
	fs.XLabel, fs.YLabel = s.By, "% "+succ
	ser := figures.Series{Name: "% " + succ}
	for i, g := range gs {
		if ns[i] == 0 {
			continue
		}
		fs.Categories = append(fs.Categories, g.Label)
		share := float64(xs[i]) / float64(ns[i])
		lo, hi := stats.Wilson(xs[i], ns[i], level95)
		ser.Values = append(ser.Values, pct(share))
		ser.Low = append(ser.Low, pct(lo))
		ser.High = append(ser.High, pct(hi))
	}
	if fs.Kind == figures.Stacked {
		other := figures.Series{Name: "other"}
		for _, v := range ser.Values {
			other.Values = append(other.Values, 100-v)
		}
		ser.Low, ser.High = nil, nil
		fs.Series = []figures.Series{ser, other}
		return nil
	}
	if fs.Kind != figures.Dot {
		ser.Low, ser.High = nil, nil
	}
	fs.Series = []figures.Series{ser}
	return nil
}

func (p *pd) compareNumeric(gs []Group, keys []sqlValue, ref int, ms map[string]pdMoments, mkeys []sqlValue) error {
	a := p.a
	s := a.spec
	if err := a.chartOK(figures.Dot, figures.Bar, figures.Box); err != nil {
		return err
	}
	y := s.Target[0]
	a.res.Meta.Outcome = "numeric"
	a.method("mean-sd", "t-interval", "welch", "cohen-d")
	_, samples, _, err := p.samplesFrom(y, s.By, ms, mkeys)
	if err != nil {
		return err
	}
	sums := make([]stats.Summary, len(gs))
	grp := make([]pdGroup, len(gs))
	n := 0
	for i := range gs {
		sm := samples[keyOf(keys[i])]
		if sm.mom.c == nil {
			sm.mom = zeroMoments()
			sm.sum = pdDescribe(sm.mom, quartiles(0, "", "", nil))
		}
		sums[i] = sm.sum
		grp[i] = groupOf(sm.mom)
		n += sums[i].N
	}
	a.res.Meta.N = n
	a.set("n", float64(n), Count, "")
	multi := len(gs) > 2
	head := []string{s.By, "n", "Mean", "SD", "95% CI of mean", "Difference from " + gs[ref].Label, "95% CI of difference", "p (Welch)", "Cohen's d"}
	tab := Table{Head: head}
	for i, g := range gs {
		pre := g.Slug + "."
		sm := sums[i]
		a.set(pre+"n", float64(sm.N), Count, "")
		a.set(pre+"mean", sm.Mean, Number, reasonN(sm.N, 1))
		a.set(pre+"sd", sm.SD, Number, reasonN(sm.N, 2))
		a.set(pre+"mean_low", sm.MeanLow, Number, reasonN(sm.N, 2))
		a.set(pre+"mean_high", sm.MeanHigh, Number, reasonN(sm.N, 2))
		a.set(pre+"median", sm.Median, Number, reasonN(sm.N, 1))
		row := []Cell{cellText(g.Label), a.numCell(pre + "n"), a.numCell(pre + "mean"), a.numCell(pre + "sd"), a.rangeCell(pre+"mean_low", pre+"mean_high")}
		if i == ref {
			row = append(row, cellNum("reference", ""), cellText(""), cellText(""), cellText(""))
			tab.Rows = append(tab.Rows, row)
			continue
		}
		w := pdWelch(grp[ref], grp[i], level95)
		d := pdCohenD(grp[ref], grp[i])
		ratio := w.MeanB / w.MeanA
		ratioWhy := reasonOf(w.Reason, "MeanB")
		if ratioWhy == "" && w.MeanA == 0 {
			ratioWhy = "the reference group's mean is zero"
		}
		dWhy := ""
		if sums[ref].N < 2 || sm.N < 2 {
			dWhy = "each group needs at least two values"
		}
		q := ""
		if multi {
			q = pre
		}
		a.set(q+"diff", w.Diff, Number, reasonOf(w.Reason, "Diff"))
		a.set(q+"diff_low", w.Low, Number, reasonOf(w.Reason, "Low"))
		a.set(q+"diff_high", w.High, Number, reasonOf(w.Reason, "High"))
		a.set(q+"ratio", ratio, Ratio, ratioWhy)
		a.set(q+"d", d, Number, dWhy)
		a.set(q+"t", w.T, Number, reasonOf(w.Reason, "T"))
		a.set(q+"df", w.DF, Number, reasonOf(w.Reason, "DF"))
		pname := "p"
		if multi {
			pname = pre + "p_welch"
		}
		a.set(pname, w.P, PValue, reasonOf(w.Reason, "P"))
		row = append(row, a.numCell(q+"diff"), a.rangeCell(q+"diff_low", q+"diff_high"), a.numCell(pname), a.numCell(q+"d"))
		tab.Rows = append(tab.Rows, row)
	}
	tab.Notes = append(tab.Notes, fmt.Sprintf("Differences are each group's mean minus the mean of %s, with Welch's t interval and test (unequal variances); Cohen's d uses the pooled SD.", gs[ref].Label))
	a.res.Tables = append(a.res.Tables, fitTable(tab))
	if multi {
		an := pdANOVA(grp)
		a.method("anova")
		r := an.Reason
		a.set("f", an.F, Number, reasonOf(r, "F"))
		a.set("p", an.P, PValue, reasonOf(r, "P"))
		a.set("df_between", float64(an.DFBetween), Count, "")
		a.set("df_within", float64(an.DFWithin), Count, "")
		a.set("ss_between", an.SSBetween, Number, reasonOf(r, "SSBetween"))
		a.set("ss_within", an.SSWithin, Number, reasonOf(r, "SSWithin"))
		a.set("ms_between", an.MSBetween, Number, reasonOf(r, "MSBetween"))
		a.set("ms_within", an.MSWithin, Number, reasonOf(r, "MSWithin"))
		a.set("r2", an.R2, Number, reasonOf(r, "R2"))
		a.set("sigma", an.Sigma, Number, reasonOf(r, "Sigma"))
		at := Table{Caption: "One-way analysis of variance of " + s.Target[0] + " by " + s.By + ".",
			Head: []string{"Source", "Sum of squares", "df", "Mean square", "F", "p"}}
		at.Rows = [][]Cell{
			{cellText("Between groups"), a.numCell("ss_between"), a.numCell("df_between"), a.numCell("ms_between"), a.numCell("f"), a.numCell("p")},
			{cellText("Within groups"), a.numCell("ss_within"), a.numCell("df_within"), a.numCell("ms_within"), cellText(""), cellText("")},
		}
		at.Notes = []string{"R² = " + Format(a.res.Facts[s.ID+".r2"], -1) + "; residual SD = " + Format(a.res.Facts[s.ID+".sigma"], -1) + "."}
		a.res.Tables = append(a.res.Tables, at)
	}

	fs := a.figure(figures.Dot)
	fs.Title = fmt.Sprintf("Mean %s by %s", s.Target[0], s.By)
	fs.XLabel, fs.YLabel = s.By, s.Target[0]
	var boxes map[string]*pdBox
	if fs.Kind == figures.Box {
		var bs []pdSample
		var bk []sqlValue
		for i := range gs {
			if sums[i].N > 0 {
				bs = append(bs, samples[keyOf(keys[i])])
				bk = append(bk, keys[i])
			}
		}
		if boxes, err = p.boxesOf(y, s.By, bs, bk); err != nil {
			return err
		}
		p.noteHidden(boxes)
	}
	ser := figures.Series{Name: "Mean"}
	for i, g := range gs {
		if sums[i].N == 0 {
			continue
		}
		fs.Categories = append(fs.Categories, g.Label)
		ser.Values = append(ser.Values, sums[i].Mean)
		ser.Low = append(ser.Low, sums[i].MeanLow)
		ser.High = append(ser.High, sums[i].MeanHigh)
		if fs.Kind == figures.Box {
			fs.Boxes = append(fs.Boxes, pdBoxStats(g.Label, boxes[keyOf(keys[i])], sums[i]))
		}
	}
	if fs.Kind == figures.Box {
		fs.Title = fmt.Sprintf("%s by %s", s.Target[0], s.By)
		a.method("tukey-box")
	} else {
		fs.Boxes = nil
		if fs.Kind == figures.Dot {
			fs.Title += ", with 95% confidence intervals"
		} else {
			ser.Low, ser.High = nil, nil
		}
		fs.Series = []figures.Series{ser}
	}
	return nil
}
