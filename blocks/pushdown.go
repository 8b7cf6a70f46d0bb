package blocks

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"sync"
)

// Aggregation push-down. When a block reads a SQL source and its analysis
// is frequency, crosstab, summary or compare, the grouping and the sums run
// in the database and only their results travel: counts per level or pair
// of levels (GROUP BY, COUNT), and for a number column its count, extremes
// and first-pass mean per group. A number sample with at most pdMaxDistinct
// distinct values (money, minutes, counts) then sends its value counts
// (GROUP BY group, value), from which every sum, quartile, whisker, outlier
// and bin follows exactly. A sample with more sends, instead, the sums of
// the first three powers of the deviations from the first-pass mean (so
// that variances and skewness cancel nothing that matters), the order
// statistics the type 7 quartiles need (ROW_NUMBER over the sorted values,
// on both databases: PostgreSQL's percentile_cont works in float8 and would
// lose a NUMERIC column's exact decimals), bin counts, and a box plot's
// whiskers and outliers. where: conditions become a WHERE clause with bound
// values. The results become the same aggregates the in-memory path counts
// (pushdown_run.go), and the same publishing step makes the block's facts,
// tables and figure from them, so both paths equal each other to 1e-9
// relative (pushdown_test.go checks every fact of both).
//
// A block falls back to reading the rows (sqlSource.rows) when a column it
// uses cannot be read the same way in SQL (a SQLite date or untyped text
// column, text that a hint calls a number), when a grouping column holds
// numbers that are not whole, when it has more than pdMaxLevels levels, and
// for every unusual case whose message the in-memory path words best.

// pdMaxLevels bounds the groups (or levels, or pairs of levels) one
// push-down handles; past it the block reads the rows.
const pdMaxLevels = 2000

// pdMaxOutliers bounds the outliers a box plot fetches per block.
const pdMaxOutliers = 10000

// pdKind is how a column is read in SQL.
type pdKind uint8

const (
	pdNone pdKind = iota // not in SQL: the block reads the rows
	pdNum                // a number
	pdText               // text: trimmed, missing tokens as NULL
)

// pd is one block's push-down.
type pd struct {
	src   *sqlSource
	d     dialect
	spec  *Spec
	t     *Dataset
	a     *run
	conn  sqlConn
	used  []string       // the columns the block reads, in alias order
	alias map[string]int // column → index of its alias k0, k1, …
	kind  map[string]pdKind
	conds []pdCond
}

// pdCond is one where: condition with its values resolved.
type pdCond struct {
	col  string
	op   string
	vals []string
}

// errFallBack makes a push-down give way to the in-memory path.
var errFallBack = errors.New("read the rows")

// pdCounter counts the blocks that ran in the database (for tests).
var pdCounter struct {
	sync.Mutex
	n int
}

// pushDown runs block s in the database when it can. done is false when
// the block must read the rows instead.
func pushDown(s *Spec, t *Dataset, params map[string]string) (a *run, done bool, err error) {
	runner := pdRunners[s.Analysis]
	if runner == nil {
		return nil, false, nil
	}
	src := t.sql
	// The checks Run makes before filtering, on the query's columns.
	has := func(name string) bool { _, ok := t.byName[name]; return ok }
	for i, c := range s.Target {
		if !has(c) {
			return nil, false, unknownColumn(s.TargetPos[i], c, t)
		}
	}
	for _, k := range []struct {
		name string
		pos  Pos
	}{{s.By, s.ByPos}, {s.Time, s.TimePos}} {
		if k.name != "" && !has(k.name) {
			return nil, false, unknownColumn(k.pos, k.name, t)
		}
	}
	for _, c := range s.Where {
		if !has(c.Column) {
			return nil, false, unknownColumn(c.Pos, c.Column, t)
		}
	}
	p := &pd{src: src, d: src.d, spec: s, t: t, alias: map[string]int{}, kind: map[string]pdKind{}}
	for _, name := range s.Columns() {
		k := src.readable(src.col(name))
		if k == pdNone {
			return nil, false, nil
		}
		p.alias[name] = len(p.used)
		p.used = append(p.used, name)
		p.kind[name] = k
	}
	// where: values, resolved and checked as Filter does.
	for _, c := range s.Where {
		sc := src.col(c.Column)
		pc := pdCond{col: c.Column, op: c.Op}
		for _, v := range c.Values {
			if strings.HasPrefix(v, ":") {
				pv, ok := params[v[1:]]
				if !ok {
					return nil, false, Errorf(c.Pos, "where: %s names no parameter%s", v, Suggest(v[1:], sortedKeys(params)))
				}
				v = pv
			}
			if sc.typ == TypeNumber {
				if _, err := strconv.ParseFloat(stripThousands(v), 64); err != nil {
					return nil, false, Errorf(c.Pos, "where: %s is a number column, so %q must be a number", c.Column, v)
				}
				v = stripThousands(v)
			}
			pc.vals = append(pc.vals, v)
		}
		p.conds = append(p.conds, pc)
	}
	a = &run{spec: s, t: t, res: &Result{
		ID: s.ID, Analysis: s.Analysis, Pos: s.Pos, Source: t.Source, Facts: Facts{},
	}}
	for _, c := range s.Where {
		a.res.Filters = append(a.res.Filters, c.Text)
	}
	a.res.Meta.Columns = append([]string(nil), s.Target...)
	p.a = a
	err = src.withConn(func(c sqlConn) error {
		p.conn = c
		if err := p.checkNumbers(); err != nil {
			return err
		}
		return runner(p)
	})
	if errors.Is(err, errFallBack) {
		return nil, false, nil
	}
	if err != nil {
		var be *Error
		if errors.As(err, &be) {
			return nil, false, err
		}
		return nil, false, src.plainQueryError(err)
	}
	pdCounter.Lock()
	pdCounter.n++
	pdCounter.Unlock()
	return a, true, nil
}

// pdRunners are the analyses that can run in the database.
var pdRunners = map[string]func(*pd) error{}

// col returns a result column by name.
func (src *sqlSource) col(name string) *sqlCol {
	for i := range src.cols {
		if src.cols[i].name == name {
			return &src.cols[i]
		}
	}
	return nil
}

// readable says how a column can be read in SQL so that its values equal
// the in-memory path's text: numbers from numeric storage; categories,
// text and binary columns from text (PostgreSQL's CAST to text is its
// output function, so any of its types serves); dates from a PostgreSQL
// date.
func (src *sqlSource) readable(c *sqlCol) pdKind {
	if c == nil || !c.typed {
		return pdNone
	}
	pg := src.d.pg()
	switch c.typ {
	case TypeNumber:
		switch c.store {
		case storeInt, storeFloat, storeDecimal:
			if pg {
				return pdNum
			}
		case storeNumeric:
			if !pg {
				return pdNum
			}
		}
	case TypeCategory, TypeText, TypeBinary:
		if pg || c.store == storeText {
			return pdText
		}
	case TypeDate:
		if pg && c.store == storeDate {
			return pdText
		}
	}
	return pdNone
}

// checkNumbers makes sure a SQLite number column holds only numbers (or
// missing tokens): SQLite would read other text as 0. Each column is
// checked once per source.
func (p *pd) checkNumbers() error {
	if p.d.pg() {
		return nil
	}
	for _, name := range p.used {
		if p.kind[name] != pdNum {
			continue
		}
		p.src.checkMu.Lock()
		ok, seen := p.src.checked[name]
		p.src.checkMu.Unlock()
		if !seen {
			q := p.newQ()
			c := "candor_q." + quoteIdent(name)
			sqlText := fmt.Sprintf("SELECT COUNT(*) FROM (\n%s\n) AS candor_q WHERE typeof(%s) IN ('text','blob') AND NOT (%s IN (%s))",
				p.src.query, c, q.trim(c), q.tokens())
			var n int64
			if err := p.conn.query(sqlText, q.args, func(v []sqlValue) error { n = atoi(v[0]); return nil }); err != nil {
				return err
			}
			ok = n == 0
			p.src.checkMu.Lock()
			if p.src.checked == nil {
				p.src.checked = map[string]bool{}
			}
			p.src.checked[name] = ok
			p.src.checkMu.Unlock()
		}
		if !ok {
			return errFallBack
		}
	}
	return nil
}

// qb builds one statement: the source's query with its bound parameters,
// and the arguments the push-down adds.
type qb struct {
	p    *pd
	args []any
}

func (p *pd) newQ() *qb { return &qb{p: p, args: append([]any(nil), p.src.args...)} }

// arg binds a value and returns its placeholder.
func (q *qb) arg(v any) string {
	q.args = append(q.args, v)
	return q.p.d.ph(len(q.args))
}

// num binds a number (as decimal text) for comparison with a number
// column: PostgreSQL reads it as NUMERIC, exactly.
func (q *qb) num(text string) string {
	if q.p.d.pg() {
		return "CAST(" + q.arg(text) + " AS NUMERIC)"
	}
	f, _ := strconv.ParseFloat(text, 64)
	return q.arg(f)
}

// float binds a float64 compared as a float64.
func (q *qb) float(f float64) string {
	if q.p.d.pg() {
		return "CAST(" + q.arg(strconv.FormatFloat(f, 'g', -1, 64)) + " AS DOUBLE PRECISION)"
	}
	return q.arg(f)
}

// tokens binds the source's missing tokens.
func (q *qb) tokens() string {
	var ph []string
	for _, t := range q.p.src.spec.Missing {
		ph = append(ph, q.arg(t))
	}
	if len(ph) == 0 {
		ph = append(ph, q.arg(""))
	}
	return strings.Join(ph, ", ")
}

// trim strips white space as strings.TrimSpace does for ASCII.
func (q *qb) trim(x string) string {
	if q.p.d.pg() {
		return "BTRIM(CAST(" + x + " AS TEXT), ' ' || chr(9) || chr(10) || chr(11) || chr(12) || chr(13))"
	}
	return "TRIM(" + x + ", ' ' || char(9, 10, 11, 12, 13))"
}

// expr is a column's value as the in-memory path reads it: text trimmed
// and NULL for a missing token; numbers as numbers, NULL for a token the
// in-memory path would read as missing.
func (q *qb) expr(name string) string {
	c := "candor_q." + quoteIdent(name)
	p := q.p
	if p.kind[name] == pdText {
		t := q.trim(c)
		e := fmt.Sprintf("CASE WHEN %s IN (%s) THEN NULL ELSE %s END", t, q.tokens(), t)
		if p.d.pg() {
			e = "(" + e + ") COLLATE \"C\""
		}
		return e
	}
	// Numbers: a missing token written as a number makes that value missing.
	var toks []string
	for _, t := range p.src.spec.Missing {
		f, err := strconv.ParseFloat(t, 64)
		if err != nil || math.IsInf(f, 0) || math.IsNaN(f) {
			continue
		}
		if p.d.pg() {
			toks = append(toks, q.arg(t))
		} else if floatText(f) == t {
			toks = append(toks, q.arg(f))
		}
	}
	v := c
	if !p.d.pg() {
		v = fmt.Sprintf("(CASE WHEN typeof(%s) IN ('integer','real') THEN %s END)", c, c)
	}
	if len(toks) == 0 {
		return v
	}
	if p.d.pg() {
		return fmt.Sprintf("(CASE WHEN CAST(%s AS TEXT) IN (%s) THEN NULL ELSE %s END)", c, strings.Join(toks, ", "), c)
	}
	return fmt.Sprintf("(CASE WHEN %s IN (%s) THEN NULL ELSE %s END)", v, strings.Join(toks, ", "), v)
}

// k is the alias of a column in the base relation.
func (p *pd) k(name string) string { return "candor_k" + strconv.Itoa(p.alias[name]) }

// base is the FROM clause every statement reads: the source's rows with
// the block's columns read as in memory and the where: conditions applied.
// It has no window function, so the database can stream it.
func (q *qb) base() string {
	p := q.p
	var sel []string
	for _, name := range p.used {
		sel = append(sel, q.expr(name)+" AS "+p.k(name))
	}
	inner := "SELECT " + strings.Join(sel, ", ") + " FROM (\n" + p.src.query + "\n) AS candor_q"
	var where []string
	for _, c := range p.conds {
		x := p.k(c.col)
		num := p.kind[c.col] == pdNum
		val := func(v string) string {
			if num {
				return q.num(v)
			}
			return q.arg(v)
		}
		if c.op == "in" {
			var vs []string
			for _, v := range c.vals {
				vs = append(vs, val(v))
			}
			where = append(where, x+" IN ("+strings.Join(vs, ", ")+")")
			continue
		}
		op := c.op
		if op == "!=" {
			op = "<>"
		}
		where = append(where, x+" "+op+" "+val(c.vals[0]))
	}
	out := "(" + inner + p.fence() + ") AS candor_i"
	if len(where) > 0 {
		out = "(SELECT * FROM " + out + " WHERE " + strings.Join(where, " AND ") + ") AS candor_b"
	}
	return out
}

// fence keeps a subquery from being merged into the statement around it,
// so that its expressions are computed once per row and not once per use
// (SQLite: a LIMIT; PostgreSQL: an OFFSET). The database then streams the
// subquery's rows into the statement.
func (p *pd) fence() string {
	if p.d.pg() {
		return " OFFSET 0"
	}
	return " LIMIT -1"
}

// query runs a statement built by q.
func (p *pd) query(q *qb, sqlText string, row func([]sqlValue) error) error {
	return p.conn.query(sqlText, q.args, row)
}

func atoi(v sqlValue) int64 {
	if v.null {
		return 0
	}
	n, err := strconv.ParseInt(v.text, 10, 64)
	if err != nil {
		f, _ := strconv.ParseFloat(v.text, 64)
		return int64(f)
	}
	return n
}

func atof(v sqlValue) float64 {
	if v.null {
		return math.NaN()
	}
	f, err := strconv.ParseFloat(v.text, 64)
	if err != nil {
		return math.NaN()
	}
	return f
}

// nullKey names the group of rows whose key is missing.
const nullKey = "\x00missing"

func keyOf(v sqlValue) string {
	if v.null {
		return nullKey
	}
	return v.text
}

// pdLevel is one level of a column (or group): its key as the database
// wrote it, its label as the in-memory path writes it, its rows and the
// row number where it first appears.
type pdLevel struct {
	key   sqlValue
	label string
	rows  int64
	first int64
}

// label writes a level as Column.Text does: a number in its shortest form
// ('g'), text as it is. ok is false for a number that is not whole, whose
// in-memory text depends on the column's offset.
func (p *pd) label(name string, v sqlValue) (string, bool) {
	if p.kind[name] != pdNum {
		return v.text, true
	}
	f, err := strconv.ParseFloat(v.text, 64)
	if err != nil || f != math.Trunc(f) || math.Abs(f) >= 1<<53 {
		return "", false
	}
	return strconv.FormatFloat(f, 'g', -1, 64), true
}

// orderLevels puts levels (in order of first appearance) in the order the
// in-memory path's groups would have: a data set of one row per level goes
// through run.groups, so order: and the natural orders apply alike.
func (p *pd) orderLevels(name string, pos Pos, levels []pdLevel) ([]Group, bool, error) {
	if p.src.col(name).typ == TypeBinary && len(levels) > 2 {
		return nil, false, errFallBack
	}
	if err := p.firstSeen(name, levels); err != nil {
		return nil, false, err
	}
	sortFirst(levels)
	c := &Column{Name: name, Type: p.src.col(name).typ}
	if p.kind[name] == pdNum {
		c.Type = TypeNumber
		texts := make([]string, len(levels))
		for i, l := range levels {
			texts[i] = l.label
		}
		c.Num, _, _ = parseNumbers(texts)
	} else {
		c.Str = make([]string, len(levels))
		for i, l := range levels {
			c.Str[i] = l.label
		}
	}
	ds := NewDataset(p.t.Source, p.t.File, "", []*Column{c})
	tmp := &run{spec: p.spec, t: ds, res: p.a.res}
	gs, _, ordered, err := tmp.groups(name, pos)
	return gs, ordered, err
}

// firstSeen finds the row where each level first appears, which orders
// levels that have no order of their own: it streams the column from the
// start and stops once every level has been seen (usually after a few
// rows). Levels whose order is natural (numbers, dates, periods) need no
// look.
func (p *pd) firstSeen(name string, levels []pdLevel) error {
	natural := p.kind[name] == pdNum
	if !natural {
		labels := make([]string, len(levels))
		for i, l := range levels {
			labels[i] = l.label
		}
		_, natural = NaturalOrder(labels)
	}
	if natural || len(levels) < 2 {
		for i := range levels {
			levels[i].first = int64(i)
		}
		return nil
	}
	idx := map[string]int{}
	for i, l := range levels {
		idx[l.key.text] = i
		levels[i].first = -1
	}
	left := len(levels)
	q := p.newQ()
	x := p.k(name)
	var row int64
	err := p.conn.stream(fmt.Sprintf("SELECT %s FROM %s", x, q.base()), q.args, func(v []sqlValue) error {
		row++
		if v[0].null {
			return nil
		}
		if i, ok := idx[v[0].text]; ok && levels[i].first < 0 {
			levels[i].first = row
			if left--; left == 0 {
				return errStop
			}
		}
		return nil
	})
	return err
}

func sortFirst(levels []pdLevel) {
	// insertion order by first row; few levels
	for i := 1; i < len(levels); i++ {
		for j := i; j > 0 && levels[j].first < levels[j-1].first; j-- {
			levels[j], levels[j-1] = levels[j-1], levels[j]
		}
	}
}

// noRows is Run's error for an empty filtered table.
func (p *pd) noRows() error {
	s := p.spec
	if len(s.Where) > 0 {
		return Errorf(s.Where[0].Pos, "block %s: no rows of %s meet the where: conditions; check their values", s.ID, p.t.File)
	}
	return Errorf(s.Pos, "block %s: data %s (%s) has no rows", s.ID, p.t.Source, p.t.File)
}

// anyRows is Run's error for an empty filtered table when levels and the
// miss rows without a level have no rows between them.
func (p *pd) anyRows(miss int64, levels []pdLevel) error {
	for _, l := range levels {
		miss += l.rows
	}
	if miss == 0 {
		return p.noRows()
	}
	return nil
}

// levelsOf counts the rows of every level of one column: the levels in
// order of first appearance, and the rows where it is missing.
func (p *pd) levelsOf(name string) ([]pdLevel, int64, error) {
	q := p.newQ()
	x := p.k(name)
	sqlText := fmt.Sprintf("SELECT %s, COUNT(*) FROM %s GROUP BY %s", x, q.base(), x)
	var levels []pdLevel
	var miss int64
	err := p.query(q, sqlText, func(v []sqlValue) error {
		if v[0].null {
			miss = atoi(v[1])
			return nil
		}
		lab, ok := p.label(name, v[0])
		if !ok || len(levels) >= pdMaxLevels {
			return errFallBack
		}
		levels = append(levels, pdLevel{key: v[0], label: lab, rows: atoi(v[1])})
		return nil
	})
	if err == nil && p.src.col(name).typ == TypeBinary && len(levels) > 2 {
		return nil, 0, errFallBack // a binary column with a third value: the in-memory path says where
	}
	return levels, miss, err
}

// caseOf is "CASE WHEN g IS NULL THEN … WHEN g = key THEN … END": a value
// per group, bound.
func (q *qb) caseOf(g string, keys []sqlValue, val func(i int) string) string {
	var b strings.Builder
	b.WriteString("CASE")
	for i, k := range keys {
		if k.null {
			fmt.Fprintf(&b, " WHEN %s IS NULL THEN %s", g, val(i))
		} else {
			fmt.Fprintf(&b, " WHEN %s = %s THEN %s", g, q.key(g, k), val(i))
		}
	}
	b.WriteString(" END")
	return b.String()
}

// key binds a group key as the database wrote it: PostgreSQL reads the
// text as the column's type; SQLite gets the number or the text.
func (q *qb) key(g string, k sqlValue) string {
	if q.p.d.pg() {
		return q.arg(k.text)
	}
	switch k.kind {
	case kindInt:
		n, _ := strconv.ParseInt(k.text, 10, 64)
		return q.arg(n)
	case kindFloat:
		f, _ := strconv.ParseFloat(k.text, 64)
		return q.arg(f)
	}
	return q.arg(k.text)
}
