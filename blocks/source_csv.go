package blocks

import (
	"bytes"
	"crypto/sha256"
	"encoding/csv"
	"encoding/hex"
	"errors"
	"io"
	"math"
	"strings"
	"unicode/utf8"

	"candor/blocks/stats"
)

// readDelimited parses CSV or TSV bytes: the first row names the columns.
// It takes b over: b is never written again. Files the parallel reader
// cannot take (and every file with an error to report) go to the
// sequential reader, which gives the same columns.
func readDelimited(s *SourceSpec, path string, b []byte) (*Dataset, error) {
	if d := readParallel(s, b); d != nil {
		return d, nil
	}
	return readSequential(s, path, b)
}

// readSequential reads the file with encoding/csv, one record after the
// other; its errors name the file, line and column of the first problem.
func readSequential(s *SourceSpec, path string, b []byte) (*Dataset, error) {
	sum := sha256.Sum256(b)
	if !utf8.Valid(b) {
		return nil, Errorf(s.FilePos, "data %s: %s is not UTF-8 text; save it as UTF-8", s.Name, s.File)
	}
	b = bytes.TrimPrefix(b, []byte("\xef\xbb\xbf"))
	r := csv.NewReader(bytes.NewReader(b))
	r.Comma = s.Delimiter
	r.ReuseRecord = false
	r.FieldsPerRecord = -1
	header, err := r.Read()
	if err == io.EOF {
		return nil, Errorf(s.FilePos, "data %s: %s is empty; it needs a header row and at least one row of data", s.Name, s.File)
	}
	if err != nil {
		return nil, csvError(s, path, err)
	}
	names, err := headerNames(s, path, header)
	if err != nil {
		return nil, err
	}
	raw := make([][]string, len(names))
	var lines []int
	for {
		rec, err := r.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			return nil, csvError(s, path, err)
		}
		line, _ := r.FieldPos(0)
		if len(rec) != len(names) {
			return nil, Errorf(Pos{File: path, Line: line, Col: 1}, "data %s: this row has %d fields but the header has %d; check the quoting and delimiters", s.Name, len(rec), len(names))
		}
		for i, f := range rec {
			raw[i] = append(raw[i], f)
		}
		lines = append(lines, line)
	}
	rowPos := func(row, col int) Pos {
		return Pos{File: path, Line: lines[row], Col: 1}
	}
	cols := make([]*Column, len(names))
	for i, name := range names {
		c, err := buildColumn(s, name, raw[i], func(row int) Pos { return rowPos(row, i) })
		if err != nil {
			return nil, err
		}
		cols[i] = c
	}
	return NewDataset(s.Name, s.File, hex.EncodeToString(sum[:]), cols), nil
}

func csvError(s *SourceSpec, path string, err error) error {
	var pe *csv.ParseError
	if errors.As(err, &pe) {
		return Errorf(Pos{File: path, Line: pe.Line, Col: pe.Column}, "data %s: %v; check the quotes on this line", s.Name, pe.Err)
	}
	return Errorf(s.FilePos, "data %s: %v", s.Name, err)
}

// buildColumn types one column of text: the source's hint if it has one,
// else a number when every present value reads as one, a date when every one
// is an ISO date, a category otherwise. at gives the file position of a row.
func buildColumn(s *SourceSpec, name string, texts []string, at func(row int) Pos) (*Column, error) {
	for i, t := range texts {
		t = strings.TrimSpace(t)
		if s.isMissing(t) {
			t = ""
		}
		texts[i] = t
	}
	hint, hinted := s.Types[name]
	if !hinted {
		hint = inferType(texts)
	}
	c := &Column{Name: name, Type: hint}
	switch hint {
	case TypeNumber:
		num, dec, bad := parseNumbers(texts)
		c.Decimals = dec
		if bad >= 0 {
			return nil, Errorf(at(bad), "data %s: column %q is a number column but row %d holds %q; fix the value, add it to missing:, or declare the column as category", s.Name, name, bad+1, texts[bad])
		}
		c.Num = num
	case TypeDate:
		for i, t := range texts {
			if t != "" && !isPeriod(t) {
				return nil, Errorf(at(i), "data %s: column %q is a date column but row %d holds %q; write dates as YYYY-MM-DD (or periods like 2026-03, 2026-Q3)", s.Name, name, i+1, t)
			}
		}
		c.Str = texts
	case TypeBinary:
		levels := map[string]bool{}
		for i, t := range texts {
			if t == "" {
				continue
			}
			levels[t] = true
			if len(levels) > 2 {
				return nil, Errorf(at(i), "data %s: column %q is binary but row %d holds a third value %q", s.Name, name, i+1, t)
			}
		}
		c.Str = texts
	default:
		c.Str = texts
	}
	return c, nil
}

func inferType(texts []string) ColType {
	present := 0
	num, date := true, true
	for _, t := range texts {
		if t == "" {
			continue
		}
		present++
		if num {
			if _, err := stats.ParseDecimal(stripThousands(t)); err != nil {
				num = false
			}
		}
		if date && !isDate(t) {
			date = false
		}
		if !num && !date {
			break
		}
	}
	switch {
	case present == 0:
		return TypeNumber
	case num:
		return TypeNumber
	case date:
		return TypeDate
	}
	return TypeCategory
}

// stripThousands removes thousands separators from text like "1,234,567.5";
// other text comes back unchanged.
func stripThousands(t string) string {
	if !strings.Contains(t, ",") {
		return t
	}
	s := strings.TrimLeft(t, "+-")
	intPart := s
	if k := strings.IndexByte(s, '.'); k >= 0 {
		intPart = s[:k]
	}
	groups := strings.Split(intPart, ",")
	if len(groups[0]) == 0 || len(groups[0]) > 3 {
		return t
	}
	for _, g := range groups[1:] {
		if len(g) != 3 {
			return t
		}
	}
	return strings.ReplaceAll(t, ",", "")
}

// parseNumbers reads decimal text exactly and shifts it by an integer offset
// taken from the first value before it becomes a float64, so that values
// with many significant digits keep their differences exactly (McCullough
// 1998 on the NIST StRD hard sets). It returns the most decimals a value
// was written with (-1 when one used an exponent) and the first row that is
// not a number, or -1.
func parseNumbers(texts []string) (stats.Values, int, int) {
	v := stats.Values{D: make([]float64, len(texts))}
	first := true
	dec := 0
	for i, t := range texts {
		if t == "" {
			v.D[i] = math.NaN()
			continue
		}
		t = stripThousands(t)
		d, err := stats.ParseDecimal(t)
		if err != nil {
			return v, dec, i
		}
		if dec >= 0 {
			if strings.ContainsAny(t, "eE") {
				dec = -1
			} else if k := strings.IndexByte(t, '.'); k >= 0 && len(t)-k-1 > dec {
				dec = len(t) - k - 1
			}
		}
		if first {
			v.Offset = d.OffsetHint()
			first = false
		}
		v.D[i] = d.Minus(v.Offset)
	}
	return v, dec, -1
}
