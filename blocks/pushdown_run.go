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

// The four analyses that run in the database. Each reads the results of
// the statements in pushdown_query.go into the aggregates its in-memory
// path counts (frequencyAgg, crosstabAgg, summaryAgg, compareNumericAgg,
// compareBinaryAgg) and hands them to the same publishing step
// (frequency.go, crosstab.go, summary.go, compare.go), which makes the
// facts, tables, notes, checker metadata and figure. What is here is what
// SQL needs: the statements to send, the order of their checks, and when
// to give way to the in-memory path.

func init() {
	pdRunners["frequency"] = pdFrequency
	pdRunners["crosstab"] = pdCrosstab
	pdRunners["summary"] = pdSummary
	pdRunners["compare"] = pdCompare
}

// noSnap leaves numbers as they are: the database writes its extremes
// in the data's own decimals.
var noSnap = &Column{Decimals: -1}

// ---- frequency ----

func pdFrequency(p *pd) error {
	a := p.a
	s := a.spec
	name := s.Target[0]
	sc := p.src.col(name)
	f := frequencyAgg{column: name, number: sc.typ == TypeNumber}
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
		if err := a.chartOK(frequencyCharts...); err != nil {
			return err
		}
		f.missing = int(rows - n)
		if !s.Bins.set() && n > 0 && nonWhole == 0 && distinct <= discreteMax {
			q := p.newQ()
			sqlText := fmt.Sprintf("SELECT %s, COUNT(*) FROM %s WHERE %s IS NOT NULL GROUP BY %s", x, q.base(), x, x)
			err := p.query(q, sqlText, func(v []sqlValue) error {
				f.levels = append(f.levels, valueLevel(atof(v[0]), int(atoi(v[1]))))
				return nil
			})
			if err != nil {
				return err
			}
			sort.Slice(f.levels, func(i, j int) bool { return f.levels[i].lo < f.levels[j].lo })
			f.ordered = true
		} else {
			if len(s.Order) > 0 {
				return a.errOrderBinned()
			}
			b, err := p.binSample(name, n, lo, hi)
			if err != nil {
				return err
			}
			f.levels, err = a.binLevels(b, noSnap, func(edges []float64) ([]int, error) { return p.binCounts(name, edges) })
			if err != nil {
				return err
			}
			f.binned, f.ordered = true, true
		}
	} else {
		lv, m, err := p.levelsOf(name)
		if err != nil {
			return err
		}
		if err := p.anyRows(m, lv); err != nil {
			return err
		}
		if err := a.chartOK(frequencyCharts...); err != nil {
			return err
		}
		if s.Bins.set() {
			return a.errBinsOnText(name, sc.typ)
		}
		g, nat, err := p.orderLevels(name, s.TargetPos[0], lv)
		if err != nil {
			return err
		}
		f.missing, f.ordered = int(m), nat
		f.levels = categoryLevels(g, nat, func(g Group) int { return int(lv[g.Rows[0]].rows) })
	}
	return publishFrequency(a, f)
}

// binSample describes number column name for the bins: key's rule, from
// its count and extremes, with the spread the rule needs from the
// database: the moments for Scott's rule, the quartiles for Freedman and
// Diaconis's.
func (p *pd) binSample(name string, n int64, lo, hi float64) (stats.BinSample, error) {
	nan := math.NaN()
	b := stats.BinSample{N: int(n), Min: lo, Max: hi, Range: hi - lo, SD: nan, IQR: nan}
	switch p.a.binRule() {
	case "scott":
		_, ms, err := p.moments(name, "")
		if err != nil {
			return b, err
		}
		b.SD = ms[""].PopulationSD()
	case "fd":
		pass, _, err := p.firstPass(name, "", nil)
		if err != nil {
			return b, err
		}
		os, err := p.orderStats(name, "", pass, nil)
		if err != nil {
			return b, err
		}
		all := pass[""]
		q, _ := pdQuartiles(all.n, all.min, all.max, os[""])
		b.IQR = q.Q3 - q.Q1
	}
	return b, nil
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
	if err := a.chartOK(crosstabCharts...); err != nil {
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
	var x crosstabAgg
	if x.rows, x.rowOrdered, err = p.orderLevels(rname, s.TargetPos[0], rl); err != nil {
		return err
	}
	err = a.withoutOrder(func() (err error) {
		x.cols, x.colOrdered, err = p.orderLevels(cname, s.TargetPos[1], cl)
		return err
	})
	if err != nil {
		return err
	}
	rowOf := map[string]int{}
	for i, g := range x.rows {
		rowOf[rl[g.Rows[0]].key.text] = i
	}
	colOf := map[string]int{}
	for j, g := range x.cols {
		colOf[cl[g.Rows[0]].key.text] = j
	}
	x.counts = make([][]float64, len(x.rows))
	for i := range x.counts {
		x.counts[i] = make([]float64, len(x.cols))
	}
	for _, pr := range pairs {
		if pr.a.null || pr.b.null {
			continue
		}
		x.counts[rowOf[pr.a.text]][colOf[pr.b.text]] += float64(pr.n)
	}
	return publishCrosstab(a, x)
}

// ---- samples of a number column ----

// pdSample is one sample of a number column from the database: its first
// pass, its value counts when they were few enough to fetch, and the
// sample that summary and compare publish.
type pdSample struct {
	pass  pdPass
	tally *stats.Tally
	s     sample
}

// samples summarises number column x over all rows and per group of by
// (keyed by keyOf, NULL included), in the database's order of keys.
func (p *pd) samples(x, by string) (*pdSample, map[string]*pdSample, []sqlValue, error) {
	pass, keys, err := p.firstPass(x, by, nil)
	if err != nil {
		return nil, nil, nil, err
	}
	all, groups, err := p.samplesFrom(x, by, pass, keys)
	return all, groups, keys, err
}

// samplesFrom is samples after its first pass. With few distinct values,
// one GROUP BY of the values gives every sum and order statistic exactly
// (stats.Tally); otherwise the database computes the centred sums
// (stats.MomentsFromSums) and the order statistics itself.
func (p *pd) samplesFrom(x, by string, pass map[string]pdPass, keys []sqlValue) (*pdSample, map[string]*pdSample, error) {
	all := &pdSample{pass: pass[""]}
	groups := map[string]*pdSample{}
	if by != "" {
		list := make([]pdPass, len(keys))
		for i, k := range keys {
			list[i] = pass[keyOf(k)]
			groups[keyOf(k)] = &pdSample{pass: list[i]}
		}
		all.pass = combinePasses(list)
	}
	counts, err := p.valueCounts(x, by)
	if err != nil {
		return nil, nil, err
	}
	if counts != nil {
		col := &Column{Decimals: counts.dec}
		all.fromTally(counts.all, col)
		for key, sm := range groups {
			sm.fromTally(counts.groups[key], col)
		}
		return all, groups, nil
	}
	ms, err := p.centredSums(x, by, pass, keys)
	if err != nil {
		return nil, nil, err
	}
	om := ms[""]
	if by != "" {
		om = stats.Moments{}
		for _, k := range keys {
			om = stats.CombineMoments(om, ms[keyOf(k)])
		}
	}
	os, err := p.orderStats(x, "", map[string]pdPass{"": all.pass}, nil)
	if err != nil {
		return nil, nil, err
	}
	all.fromSums(om, os[""])
	if by != "" {
		os, err := p.orderStats(x, by, pass, keys)
		if err != nil {
			return nil, nil, err
		}
		for key, sm := range groups {
			sm.fromSums(ms[key], os[key])
		}
	}
	return all, groups, nil
}

// fromTally makes the sample from its value counts; col snaps its order
// statistics.
func (sm *pdSample) fromTally(t stats.Tally, col *Column) {
	sm.tally = &t
	m := t.Moments()
	sm.s = sample{sum: snapSummary(stats.DescribeMoments(m, t.Quartiles()), col), mom: m, miss: int(sm.pass.rows - sm.pass.n)}
}

// fromSums makes the sample from its moments and its order statistics os.
func (sm *pdSample) fromSums(m stats.Moments, os map[int64]string) {
	q, dec := pdQuartiles(sm.pass.n, sm.pass.min, sm.pass.max, os)
	sm.s = sample{sum: snapSummary(stats.DescribeMoments(m, q), &Column{Decimals: dec}), mom: m, miss: int(sm.pass.rows - sm.pass.n)}
}

// whiskers gives samples (each with values) of number column x, in the
// groups keys of by, their box plot's whiskers: from their value counts
// when every one has them, else from the database. It returns how many
// outliers are counted but not listed.
func (p *pd) whiskers(x, by string, samples []*pdSample, keys []sqlValue) (int, error) {
	lo, hi := make([]float64, len(samples)), make([]float64, len(samples))
	fromCounts := true
	for i, sm := range samples {
		lo[i], hi[i] = sm.s.sum.Fences()
		fromCounts = fromCounts && sm.tally != nil
	}
	if fromCounts {
		hidden := 0
		for i, sm := range samples {
			w := sm.tally.Whiskers(lo[i], hi[i], pdMaxOutliers)
			hidden += w.Hidden
			sm.s.box = &w
		}
		return hidden, nil
	}
	bx, hidden, err := p.boxes(x, by, keys, lo, hi)
	for i, sm := range samples {
		sm.s.box = bx[boxKey(by, keys[i])]
	}
	return hidden, err
}

// boxKey is the key boxes files a group's box under.
func boxKey(by string, k sqlValue) string {
	if by == "" {
		return ""
	}
	return keyOf(k)
}

// byLevels are the groups of by (as run.groups orders them) with their
// keys, from a first pass, and the rows where by is missing.
func (p *pd) byLevels(by string, pass map[string]pdPass, keys []sqlValue) ([]Group, []sqlValue, int, error) {
	var lv []pdLevel
	miss := 0
	for _, k := range keys {
		rows := pass[keyOf(k)].rows
		if k.null {
			miss = int(rows)
			continue
		}
		lab, ok := p.label(by, k)
		if !ok {
			return nil, nil, 0, errFallBack
		}
		lv = append(lv, pdLevel{key: k, label: lab, rows: rows})
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

// ---- summary ----

func pdSummary(p *pd) error {
	a := p.a
	s := a.spec
	for _, name := range s.Target {
		if p.kind[name] != pdNum {
			return errFallBack // run.numeric words the error
		}
	}
	type colData struct {
		all    *pdSample
		groups map[string]*pdSample
		keys   []sqlValue
	}
	data := make([]colData, len(s.Target))
	for i, name := range s.Target {
		all, groups, keys, err := p.samples(name, s.By)
		if err != nil {
			return err
		}
		data[i] = colData{all, groups, keys}
	}
	first := data[0]
	if first.all.pass.rows == 0 {
		return p.noRows()
	}
	if err := a.chartOK(summaryCharts...); err != nil {
		return err
	}
	var x summaryAgg
	var gkeys []sqlValue
	if s.By != "" {
		var err error
		pass := map[string]pdPass{}
		for k, g := range first.groups {
			pass[k] = g.pass
		}
		if x.groups, gkeys, x.missBy, err = p.byLevels(s.By, pass, first.keys); err != nil {
			return err
		}
	}
	kind := a.summaryKind()
	for i, name := range s.Target {
		cd := data[i]
		// The samples in the order of the groups, and those a box plot
		// draws, with their keys.
		var groups, drawn []*pdSample
		var dkeys []sqlValue
		for _, k := range gkeys {
			sm := cd.groups[keyOf(k)]
			groups = append(groups, sm)
			if sm.s.sum.N > 0 {
				drawn, dkeys = append(drawn, sm), append(dkeys, k)
			}
		}
		if s.By == "" && cd.all.s.sum.N > 0 {
			drawn, dkeys = []*pdSample{cd.all}, []sqlValue{{}}
		}
		c := summaryCol{name: name}
		if kind == figures.Box && len(drawn) > 0 {
			var err error
			if c.hidden, err = p.whiskers(name, s.By, drawn, dkeys); err != nil {
				return err
			}
		}
		c.all = cd.all.s
		for _, sm := range groups {
			c.groups = append(c.groups, sm.s)
		}
		x.cols = append(x.cols, c)
	}
	if all := first.all; kind == figures.Histogram && all.pass.n > 0 {
		lo, hi := atof(sqlValue{text: all.pass.min}), atof(sqlValue{text: all.pass.max})
		edges := stats.BinEdgesFor(stats.BinSample{N: int(all.pass.n), Min: lo, Max: hi, Range: hi - lo}, "sturges", 0)
		x.hist = &histogram{edges: edges}
		if all.tally != nil {
			x.hist.counts = all.tally.CountBins(edges)
		} else {
			var err error
			if x.hist.counts, err = p.binCounts(s.Target[0], edges); err != nil {
				return err
			}
		}
	}
	return publishSummary(a, x)
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
	var pass map[string]pdPass
	var pkeys []sqlValue
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
		if pass, pkeys, err = p.firstPass(y, s.By, hit); err != nil {
			return err
		}
		for _, k := range pkeys {
			ps := pass[keyOf(k)]
			if k.null {
				missBy = ps.rows
				continue
			}
			lab, ok := p.label(s.By, k)
			if !ok {
				return errFallBack
			}
			gl = append(gl, pdLevel{key: k, label: lab, rows: ps.rows})
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
	if err := p.anyRows(missBy, gl); err != nil {
		return err
	}
	if s.By == y {
		return a.errSameBy()
	}
	// readOutcome's decision.
	var o *pdOutcome
	if number {
		var n, hits, other int64
		for _, ps := range pass {
			n, hits, other = n+ps.n, hits+ps.hits, other+ps.other
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
	// The groups' keys, in order.
	keys := make([]sqlValue, len(gs))
	for i, g := range gs {
		keys[i] = gl[g.Rows[0]].key
	}
	return a.compare(gs, int(missBy), o.binary, o.success, func(x *compareBinaryAgg) error {
		if number {
			for i, k := range keys {
				ps := pass[keyOf(k)]
				x.ns[i], x.xs[i] = int(ps.n), int(ps.hits)
			}
			return nil
		}
		idx := map[string]int{}
		for i, k := range keys {
			idx[keyOf(k)] = i
		}
		for _, pr := range pairs {
			i, ok := idx[keyOf(pr.a)]
			if !ok || pr.a.null || pr.b.null {
				continue
			}
			x.ns[i] += int(pr.n)
			if lab, _ := p.label(y, pr.b); o.hitText(lab) {
				x.xs[i] += int(pr.n)
			}
		}
		return nil
	}, func(x *compareNumericAgg) error {
		_, samples, err := p.samplesFrom(y, s.By, pass, pkeys)
		if err != nil {
			return err
		}
		groups := make([]*pdSample, len(gs))
		var drawn []*pdSample
		var dkeys []sqlValue
		for i, k := range keys {
			if groups[i] = samples[keyOf(k)]; groups[i] == nil {
				groups[i] = &pdSample{s: sample{sum: stats.DescribeMoments(stats.Moments{}, stats.Quartiles{})}}
			}
			if groups[i].s.sum.N > 0 {
				drawn, dkeys = append(drawn, groups[i]), append(dkeys, k)
			}
		}
		if a.kind(figures.Dot) == figures.Box && len(drawn) > 0 {
			if x.hidden, err = p.whiskers(y, s.By, drawn, dkeys); err != nil {
				return err
			}
		}
		for _, sm := range groups {
			x.samples = append(x.samples, sm.s)
		}
		return nil
	})
}

// textOutcome is readOutcome for a text column, from its levels.
func (p *pd) textOutcome(levels []string) (*pdOutcome, error) {
	s := p.spec
	if s.HasSucc {
		if !hasValue(levels, s.Success) {
			return nil, errFallBack
		}
		succ := s.Success
		return &pdOutcome{binary: true, success: succ, hitText: func(l string) bool { return sameValue(l, succ) }}, nil
	}
	if succ, ok := codedSuccess(levels); ok {
		return &pdOutcome{binary: true, success: succ, hitText: func(l string) bool { return strings.EqualFold(l, succ) }}, nil
	}
	return nil, errFallBack // not numbers and no success: run.readOutcome words it
}
