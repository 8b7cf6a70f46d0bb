package blocks

import (
	"fmt"
	"math"
	"math/rand"
	"strings"
	"testing"
)

// sameColumns reports how two data sets differ, "" when they are the same
// bit for bit (NaN payloads included).
func sameColumns(a, b *Dataset) string {
	if a.SHA256 != b.SHA256 {
		return "hash differs"
	}
	if len(a.Cols) != len(b.Cols) {
		return fmt.Sprintf("%d columns against %d", len(a.Cols), len(b.Cols))
	}
	for i := range a.Cols {
		x, y := a.Cols[i], b.Cols[i]
		if x.Name != y.Name || x.Type != y.Type || x.Decimals != y.Decimals {
			return fmt.Sprintf("column %d: %s %s %d against %s %s %d", i, x.Name, x.Type, x.Decimals, y.Name, y.Type, y.Decimals)
		}
		if math.Float64bits(x.Num.Offset) != math.Float64bits(y.Num.Offset) {
			return fmt.Sprintf("column %s: offset %v against %v", x.Name, x.Num.Offset, y.Num.Offset)
		}
		if len(x.Num.D) != len(y.Num.D) || len(x.Str) != len(y.Str) {
			return fmt.Sprintf("column %s: lengths %d/%d against %d/%d", x.Name, len(x.Num.D), len(x.Str), len(y.Num.D), len(y.Str))
		}
		for k := range x.Num.D {
			if math.Float64bits(x.Num.D[k]) != math.Float64bits(y.Num.D[k]) {
				return fmt.Sprintf("column %s row %d: %v against %v", x.Name, k, x.Num.D[k], y.Num.D[k])
			}
		}
		for k := range x.Str {
			if x.Str[k] != y.Str[k] {
				return fmt.Sprintf("column %s row %d: %q against %q", x.Name, k, x.Str[k], y.Str[k])
			}
		}
	}
	return ""
}

func withChunk(t *testing.T, size int) {
	t.Helper()
	old := fastChunk
	fastChunk = size
	memo.Lock()
	memo.off = true
	memo.Unlock()
	t.Cleanup(func() {
		fastChunk = old
		memo.Lock()
		memo.off = false
		memo.Unlock()
	})
}

// randomCell writes one cell of a column of the given flavour.
func randomCell(r *rand.Rand, flavour int, row, flip int) string {
	switch flavour {
	case 0: // whole numbers, some missing
		if r.Intn(10) == 0 {
			return []string{"", "NA", "n/a", " ", "-"}[r.Intn(5)]
		}
		return fmt.Sprint(r.Intn(2000) - 1000)
	case 1: // decimals, signs, spaces, thousands separators in quotes
		switch r.Intn(12) {
		case 0:
			return `"1,234.50"`
		case 1:
			return " 12.5 "
		case 2:
			return "-0"
		case 3:
			return "-0.0"
		case 4:
			return "+3.25"
		case 5:
			return ".5"
		case 6:
			return "5."
		case 7:
			return "\u00a042.125\u00a0" // no-break spaces trim as spaces
		}
		return fmt.Sprintf("%.*f", r.Intn(4), r.NormFloat64()*1000)
	case 2: // exponents and long mantissas
		switch r.Intn(4) {
		case 0:
			return fmt.Sprintf("%e", r.NormFloat64())
		case 1:
			return "12345678901234567890.123"
		}
		return fmt.Sprintf("1000000000000.%d", r.Intn(10))
	case 3: // categories with quoting, escapes, embedded line ends
		switch r.Intn(8) {
		case 0:
			return `"say ""hi"""`
		case 1:
			return "\"two\nlines\""
		case 2:
			return "\"two\r\nlines\""
		case 3:
			return `"a,b"`
		case 4:
			return ""
		}
		return []string{"North", "South", "East", "West", "Zürich"}[r.Intn(5)]
	case 4: // dates and periods
		if r.Intn(15) == 0 {
			return "NA"
		}
		return fmt.Sprintf("2026-%02d-%02d", 1+r.Intn(12), 1+r.Intn(28))
	case 5: // a number column that stops being one at row flip
		if row == flip {
			return "n.a."
		}
		return fmt.Sprint(r.Intn(100))
	case 6: // binary
		return []string{"yes", "no", ""}[r.Intn(3)]
	}
	return "x"
}

// TestParallelReaderMatchesSequential: on random files with every feature
// the reader handles, the parallel reader cut into many chunks gives the
// same columns as the sequential reader, bit for bit.
func TestParallelReaderMatchesSequential(t *testing.T) {
	withChunk(t, 97)
	r := rand.New(rand.NewSource(11))
	fast := 0
	const files = 300
	for f := 0; f < files; f++ {
		ncol := 1 + r.Intn(7)
		flavours := make([]int, ncol)
		var head []string
		for i := range flavours {
			flavours[i] = r.Intn(7)
			head = append(head, fmt.Sprintf("c%d", i))
		}
		rows := 1 + r.Intn(120)
		flip := r.Intn(rows + 20)
		nl := "\n"
		if r.Intn(3) == 0 {
			nl = "\r\n"
		}
		var b strings.Builder
		if r.Intn(5) == 0 {
			b.WriteString("\xef\xbb\xbf")
		}
		delim := []string{",", ",", "\t", ";"}[r.Intn(4)]
		b.WriteString(strings.Join(head, delim) + nl)
		for row := 0; row < rows; row++ {
			var cells []string
			for i := range flavours {
				cells = append(cells, randomCell(r, flavours[i], row, flip))
			}
			b.WriteString(strings.Join(cells, delim))
			if row < rows-1 || r.Intn(3) > 0 {
				b.WriteString(nl)
			}
			if r.Intn(25) == 0 {
				b.WriteString(nl) // an empty line
			}
		}
		s := &SourceSpec{Name: "s", File: "s.csv", Delimiter: rune(delim[0]), Missing: DefaultMissing, Types: map[string]ColType{}}
		if r.Intn(5) == 0 {
			s.Missing = []string{"-", "n.a.", ""} // a source's own missing: tokens
		}
		if r.Intn(4) == 0 {
			s.Types[head[r.Intn(ncol)]] = ColType(r.Intn(5))
		}
		body := b.String()
		want, werr := readSequential(s, "s.csv", []byte(body))
		got := readParallel(s, []byte(body))
		if got == nil {
			continue
		}
		fast++
		if werr != nil {
			t.Fatalf("file %d: the parallel reader read what the sequential one rejects (%v):\n%s", f, werr, body)
		}
		if d := sameColumns(got, want); d != "" {
			t.Fatalf("file %d: %s\n%s", f, d, body)
		}
	}
	// Rejected files (a bad value in a hinted column, a third binary
	// value) go to the sequential reader; most files must not.
	if fast < files/2 {
		t.Errorf("only %d of %d files took the parallel reader", fast, files)
	}
}

// TestParallelReaderFallsBack: every malformed file goes to the sequential
// reader, which reports it with its position.
func TestParallelReaderFallsBack(t *testing.T) {
	withChunk(t, 8)
	cases := []struct {
		body  string
		types map[string]ColType
	}{
		{"a,b\n1,2\n3\n", nil},     // too few fields
		{"a,b\n1,2\n3,4,5\n", nil}, // too many
		{"a,b\n1,\"2\n", nil},      // unterminated quote
		{"a,b\n1,x\"y\n", nil},     // bare quote
		{"a,b\n1,\"x\"y\n", nil},   // text after a closing quote
		{"a,b\n1,2\nx,3\n", map[string]ColType{"a": TypeNumber}},
		{"a,b\n1,2026-13\n", map[string]ColType{"b": TypeDate}},
		{"a\nx\ny\nz\n", map[string]ColType{"a": TypeBinary}},
		{"a\n" + strings.Repeat("x\ny\n", 20) + "z\n", map[string]ColType{"a": TypeBinary}}, // the third value in a later chunk
		{"a,b\n", nil},         // no rows
		{"a,a\n1,2\n", nil},    // duplicate names
		{"a,b\n\xff,2\n", nil}, // not UTF-8
	}
	for _, c := range cases {
		s := &SourceSpec{Name: "s", File: "s.csv", Delimiter: ',', Missing: DefaultMissing, Types: c.types}
		if s.Types == nil {
			s.Types = map[string]ColType{}
		}
		if d := readParallel(s, []byte(c.body)); d != nil {
			t.Errorf("%q: the parallel reader accepted it", c.body)
		}
	}
}

// TestParallelReaderNumbers: typing details the random files may miss.
func TestParallelReaderNumbers(t *testing.T) {
	withChunk(t, 16)
	body := "id,amount,when\n" +
		"1,\"1,204.50\",2026-01-05\n" +
		"2,NA,2026-02-01\n" +
		"3,7.125,2026-03-01\n" +
		"4,-2,2026-04-01\n" +
		"5,1e3,2026-05-01\n" +
		"6,0.5,2026-06-01\n"
	s := &SourceSpec{Name: "s", File: "s.csv", Delimiter: ',', Missing: DefaultMissing, Types: map[string]ColType{}}
	d := readParallel(s, []byte(body))
	if d == nil {
		t.Fatal("the parallel reader gave up")
	}
	a := d.Col("amount")
	if a.Type != TypeNumber || a.Num.Offset != 1204 || a.Decimals != -1 || !a.Missing(1) {
		t.Fatalf("amount: %+v", a)
	}
	if a.Num.At(0) != 1204.5 || a.Num.At(2) != 7.125 || a.Num.At(4) != 1000 {
		t.Errorf("amount values %v", a.Num)
	}
	if w := d.Col("when"); w.Type != TypeDate || w.Str[5] != "2026-06-01" {
		t.Errorf("when: %+v", w)
	}
	if len(d.Cols[0].Num.D) != 6 || cap(d.Cols[0].Num.D) != 6 {
		t.Errorf("id has %d rows (cap %d)", len(d.Cols[0].Num.D), cap(d.Cols[0].Num.D))
	}
}
