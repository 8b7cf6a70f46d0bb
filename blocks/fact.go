package blocks

import (
	"math"
	"sort"
	"strings"
	"unicode"
)

// Kind says what a fact measures, which decides how it is shown
// (FORMAT.md section 4) and how the checker reads a claim about it.
type Kind uint8

const (
	// Number is any other value: shown with three significant digits.
	Number Kind = iota
	// Count is a whole number of cases: shown with thousands separators.
	Count
	// Percent is a share stored as percent (42.5, not 0.425): shown with one
	// decimal and "%".
	Percent
	// Points is a difference of two percentages, in percentage points.
	Points
	// PValue is a p-value: shown as "< 0.001" or with three decimals.
	PValue
	// Ratio is a multiple (risk ratio, odds ratio, ratio of means).
	Ratio
)

var kindNames = [...]string{"number", "count", "percent", "points", "p", "ratio"}

func (k Kind) String() string {
	if int(k) < len(kindNames) {
		return kindNames[k]
	}
	return "number"
}

// Fact is one published result of a block, named "ID.NAME" (FORMAT.md
// section 3). Value keeps full precision. A fact that cannot be computed
// (a zero cell, too few cases) has Undefined set to the reason and Value NaN;
// it is shown as "undefined" and never as Inf or NaN.
type Fact struct {
	Name      string
	Value     float64
	Kind      Kind
	Undefined string
}

// Defined reports whether the fact has a value.
func (f Fact) Defined() bool { return f.Undefined == "" }

// Facts maps full fact names ("ID.NAME") to facts.
type Facts map[string]Fact

// Set records a fact. A NaN or infinite value becomes undefined with the
// given reason (or "not computable from these data" when reason is empty).
func (fs Facts) Set(name string, v float64, k Kind, reason string) {
	f := Fact{Name: name, Value: v, Kind: k}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		f.Value = math.NaN()
		if reason == "" {
			reason = "not computable from these data"
		}
		f.Undefined = reason
	}
	fs[name] = f
}

// Names returns the fact names in sorted order.
func (fs Facts) Names() []string {
	out := make([]string, 0, len(fs))
	for n := range fs {
		out = append(out, n)
	}
	sort.Strings(out)
	return out
}

// Block returns the facts whose names start with "id.".
func (fs Facts) Block(id string) Facts {
	out := Facts{}
	p := id + "."
	for n, f := range fs {
		if strings.HasPrefix(n, p) {
			out[n] = f
		}
	}
	return out
}

// Merge copies every fact of other into fs.
func (fs Facts) Merge(other Facts) {
	for n, f := range other {
		fs[n] = f
	}
}

// Slug turns a level name into the form used in fact names: lowercase, every
// run of characters other than letters and digits becomes "_", with no "_"
// at either end (FORMAT.md section 3). An empty result becomes "blank".
func Slug(s string) string {
	var b strings.Builder
	under := false
	for _, r := range strings.ToLower(s) {
		if unicode.IsLetter(r) || unicode.IsDigit(r) {
			if under && b.Len() > 0 {
				b.WriteByte('_')
			}
			under = false
			b.WriteRune(r)
		} else {
			under = true
		}
	}
	if b.Len() == 0 {
		return "blank"
	}
	return b.String()
}
