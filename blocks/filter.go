package blocks

import (
	"strconv"
	"strings"

	"github.com/go-gota/gota/series"
)

var comparators = map[string]series.Comparator{
	"=": series.Eq, "!=": series.Neq, "<": series.Less, "<=": series.LessEq,
	">": series.Greater, ">=": series.GreaterEq, "in": series.In,
}

// Filter applies the where: conditions (all must hold) with gota's
// comparisons on the table's frame. A missing value satisfies no condition,
// as in SQL. Numbers compare numerically; text, dates and periods compare as
// text, which for ISO dates is time order. A value written as :name is the
// report parameter of that name. The result keeps only the columns named
// in cols (a block's own): a filtered copy of the others would cost memory
// for nothing.
func Filter(t *Dataset, conds []Cond, params map[string]string, cols []string) (*Dataset, error) {
	if len(conds) == 0 {
		return t, nil
	}
	keep := make([]bool, t.Rows())
	for i := range keep {
		keep[i] = true
	}
	for _, c := range conds {
		col := t.Col(c.Column)
		if col == nil {
			return nil, unknownColumn(c.Pos, c.Column, t)
		}
		vals := make([]string, len(c.Values))
		for i, v := range c.Values {
			if strings.HasPrefix(v, ":") {
				p, ok := params[v[1:]]
				if !ok {
					return nil, Errorf(c.Pos, "where: %s names no parameter%s", v, Suggest(v[1:], sortedKeys(params)))
				}
				v = p
			}
			if col.Type == TypeNumber {
				if _, err := strconv.ParseFloat(stripThousands(v), 64); err != nil {
					return nil, Errorf(c.Pos, "where: %s is a number column, so %q must be a number", c.Column, v)
				}
				v = stripThousands(v)
			}
			vals[i] = v
		}
		var comparando any = vals
		if c.Op != "in" {
			comparando = vals[0]
		}
		if col.Type == TypeNumber {
			fs := make([]float64, len(vals))
			for i, v := range vals {
				fs[i], _ = strconv.ParseFloat(v, 64)
			}
			comparando = fs
			if c.Op != "in" {
				comparando = fs[0]
			}
		}
		ser, _ := t.Series(c.Column)
		res := ser.Compare(comparators[c.Op], comparando)
		if res.Err != nil {
			return nil, Errorf(c.Pos, "where: %v", res.Err)
		}
		bs, err := res.Bool()
		if err != nil {
			return nil, Errorf(c.Pos, "where: %v", err)
		}
		for i, b := range bs {
			keep[i] = keep[i] && b
		}
	}
	n := 0
	for _, k := range keep {
		if k {
			n++
		}
	}
	idx := make([]int, 0, n)
	for i, k := range keep {
		if k {
			idx = append(idx, i)
		}
	}
	return t.Only(cols).Subset(idx), nil
}

func unknownColumn(pos Pos, name string, t *Dataset) error {
	return Errorf(pos, "data %s (%s) has no column %q%s", t.Source, t.File, name, suggestOrList(name, t.Names()))
}
