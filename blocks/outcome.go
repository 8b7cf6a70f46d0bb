package blocks

import (
	"math"
	"strconv"
	"strings"

	"candor/blocks/stats"
)

// outcome is an analysed column read as numbers or as successes.
type outcome struct {
	col    *Column
	binary bool
	// success is the value counted as a success (binary outcomes).
	success string
	// hit reports whether row i is a success; valid only where !missing(i).
	hit func(i int) bool
}

// binaryPairs are the two-valued codings recognised without a success: key,
// with the value counted as success first.
var binaryPairs = [][2]string{{"1", "0"}, {"yes", "no"}, {"true", "false"}, {"y", "n"}}

// readOutcome decides whether an outcome is numeric or binary: binary when
// success: names a value, or when the column holds only 1/0, yes/no or
// true/false; numeric when it holds numbers; otherwise an error asks for
// success:.
func (a *run) readOutcome(name string, pos Pos) (*outcome, error) {
	c := a.t.Col(name)
	s := a.spec
	if s.HasSucc {
		hit := successTest(c, s.Success, false)
		found := false
		for i := 0; i < c.Len() && !found; i++ {
			found = !c.Missing(i) && hit(i)
		}
		if !found {
			levels, _ := c.LevelsUpTo(50)
			return nil, Errorf(s.KeyPos["success"], "success: %q is not a value of %s%s", s.Success, name, suggestOrList(s.Success, levels))
		}
		return &outcome{col: c, binary: true, success: s.Success, hit: hit}, nil
	}
	levels, _ := c.LevelsUpTo(2)
	if succ, ok := codedSuccess(levels); ok {
		return &outcome{col: c, binary: true, success: succ, hit: successTest(c, succ, true)}, nil
	}
	if c.Type == TypeNumber {
		return &outcome{col: c}, nil
	}
	ex := levels
	if len(ex) > 4 {
		ex = ex[:4]
	}
	return nil, Errorf(pos, "%s: %s holds %s values (%s), not numbers; say which value counts as a success with success:, e.g. success: %q", s.Analysis, name, c.Type, strings.Join(ex, ", "), first(levels))
}

// successTest returns whether row i holds the success value: compared as
// numbers in a number column (so 1 matches 1.0), else as text, without case
// when fold is set.
func successTest(c *Column, want string, fold bool) func(i int) bool {
	if c.Type == TypeNumber {
		v, err := strconv.ParseFloat(want, 64)
		if err != nil {
			return func(int) bool { return false }
		}
		return func(i int) bool { return c.Snap(c.Num.At(i), 0) == v }
	}
	if fold {
		return func(i int) bool { return strings.EqualFold(c.Str[i], want) }
	}
	if _, err := strconv.ParseFloat(want, 64); err != nil {
		return func(i int) bool { return c.Str[i] == want }
	}
	return func(i int) bool { return sameValue(c.Str[i], want) }
}

// hasValue reports whether one of levels is the written value want
// (sameValue).
func hasValue(levels []string, want string) bool {
	for _, l := range levels {
		if sameValue(l, want) {
			return true
		}
	}
	return false
}

// codedSuccess is the success of the two-valued coding (binaryPairs) that
// all of levels (at most two, at least one) belong to, compared without
// case; ok is false when they belong to none.
func codedSuccess(levels []string) (succ string, ok bool) {
	if len(levels) == 0 || len(levels) > 2 {
		return "", false
	}
	for _, p := range binaryPairs {
		ok := true
		for _, l := range levels {
			if !strings.EqualFold(l, p[0]) && !strings.EqualFold(l, p[1]) {
				ok = false
			}
		}
		if ok {
			return p[0], true
		}
	}
	return "", false
}

func first(xs []string) string {
	if len(xs) == 0 {
		return ""
	}
	return xs[0]
}

// sameValue compares a cell with a written value: numerically when both
// are numbers (so 1 matches 1.0), else as text.
func sameValue(cell, want string) bool {
	if cell == want {
		return true
	}
	a, err1 := strconv.ParseFloat(cell, 64)
	b, err2 := strconv.ParseFloat(want, 64)
	return err1 == nil && err2 == nil && a == b
}

// counts returns the successes and cases (non-missing) among rows.
func (o *outcome) counts(rows []int) (x, n int) {
	for _, i := range rows {
		if o.col.Missing(i) {
			continue
		}
		n++
		if o.hit(i) {
			x++
		}
	}
	return
}

// values returns the present numbers among rows.
func (o *outcome) values(rows []int) stats.Values {
	v, _ := present(o.col, rows)
	return v
}

// reference picks the reference group: the reference: key, else the first
// group in order.
func (a *run) reference(gs []Group) (int, error) {
	if a.spec.Reference == "" {
		return 0, nil
	}
	var labels []string
	for i, g := range gs {
		if g.Label == a.spec.Reference || sameValue(g.Label, a.spec.Reference) {
			return i, nil
		}
		labels = append(labels, g.Label)
	}
	return 0, Errorf(a.spec.RefPos, "reference %q is not a group of %s%s", a.spec.Reference, a.spec.By, suggestOrList(a.spec.Reference, labels))
}

// pct turns a fraction into percent, keeping NaN.
func pct(x float64) float64 { return 100 * x }

func reasonOf(r stats.Reasons, field string) string {
	if r == nil {
		return ""
	}
	return r[field]
}

func isNaN(x float64) bool { return math.IsNaN(x) }
