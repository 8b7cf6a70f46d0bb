package blocks

import (
	"errors"
	"fmt"
	"sort"
	"strings"
)

// Pos is a position in a report file: 1-based line and column (columns count
// bytes, as compilers do).
type Pos struct {
	File string
	Line int
	Col  int
}

func (p Pos) String() string {
	if p.Line == 0 {
		return p.File
	}
	return fmt.Sprintf("%s:%d:%d", p.File, p.Line, p.Col)
}

// Error is bad input at a position. Its message says what is wrong and what
// to change. Every error that reaches the user because of the report or its
// data is an *Error.
type Error struct {
	Pos Pos
	Msg string
}

func (e *Error) Error() string { return e.Pos.String() + ": " + e.Msg }

// Errorf returns an *Error at pos.
func Errorf(pos Pos, format string, args ...any) *Error {
	return &Error{Pos: pos, Msg: fmt.Sprintf(format, args...)}
}

// IsInput reports whether err is bad input (an *Error), which the command
// line answers with exit status 2.
func IsInput(err error) bool {
	var e *Error
	return errors.As(err, &e)
}

// Suggest returns "; did you mean X?" (or "X or Y") naming the candidates
// closest to name by edit distance, or "" when none is close. The names are
// listed in a stable order.
func Suggest(name string, candidates []string) string {
	near := Nearest(name, candidates, 3)
	if len(near) == 0 {
		return ""
	}
	q := make([]string, len(near))
	for i, n := range near {
		q[i] = fmt.Sprintf("%q", n)
	}
	return "; did you mean " + strings.Join(q, " or ") + "?"
}

// Nearest returns up to max candidates closest to name (Levenshtein
// distance, case-insensitive), nearest first, ties in input order. A
// candidate is close when its distance is at most a third of the longer
// name's length (at least 2), or when one name contains the other.
func Nearest(name string, candidates []string, max int) []string {
	type cand struct {
		s string
		d int
		i int
	}
	var cs []cand
	ln := strings.ToLower(name)
	for i, c := range candidates {
		lc := strings.ToLower(c)
		d := levenshtein(ln, lc)
		limit := len(ln)
		if len(lc) > limit {
			limit = len(lc)
		}
		limit /= 3
		if limit < 2 {
			limit = 2
		}
		if d <= limit || (len(ln) >= 3 && (strings.Contains(lc, ln) || strings.Contains(ln, lc))) {
			cs = append(cs, cand{c, d, i})
		}
	}
	sort.SliceStable(cs, func(a, b int) bool {
		if cs[a].d != cs[b].d {
			return cs[a].d < cs[b].d
		}
		return cs[a].i < cs[b].i
	})
	var out []string
	seen := map[string]bool{}
	for _, c := range cs {
		if seen[c.s] {
			continue
		}
		seen[c.s] = true
		out = append(out, c.s)
		if len(out) == max {
			break
		}
	}
	return out
}

func levenshtein(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(rb)]
}
