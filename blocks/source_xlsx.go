package blocks

import (
	"crypto/sha256"
	"encoding/hex"
	"fmt"
	"os"
	"strconv"
	"strings"
	"time"

	"github.com/xuri/excelize/v2"
)

// loadXLSX reads one sheet of an Excel workbook (FORMAT.md section 1): the
// sheet the source names, or the first one; its first non-empty row names
// the columns. Each cell is read with its own type: numbers as the decimal
// text stored in the file (so they take the same exact-decimal path as
// CSV), cells formatted as dates as ISO YYYY-MM-DD text, booleans as
// true/false, text as it is. A column is typed by its hint, else by its
// cells: all numbers make a number column, all dates a date column, all
// booleans a binary column, anything else a category column.
func loadXLSX(s *SourceSpec, env Env) (*Dataset, error) {
	path, err := resolveFile(s, env)
	if err != nil {
		return nil, err
	}
	b, err := os.ReadFile(path)
	if err != nil {
		return nil, Errorf(s.FilePos, "data %s: cannot read %s: %v", s.Name, s.File, unwrapPathErr(err))
	}
	sum := sha256.Sum256(b)
	f, err := excelize.OpenReader(strings.NewReader(string(b)))
	if err != nil {
		return nil, Errorf(s.FilePos, "data %s: %s is not an Excel workbook that can be read (%v); save it as .xlsx", s.Name, s.File, err)
	}
	defer f.Close()
	sheets := f.GetSheetList()
	if len(sheets) == 0 {
		return nil, Errorf(s.FilePos, "data %s: %s has no sheets", s.Name, s.File)
	}
	sheet := sheets[0]
	if s.Sheet != "" {
		if !contains(sheets, s.Sheet) {
			pos := s.SheetPos
			if pos.Line == 0 {
				pos = s.FilePos
			}
			return nil, Errorf(pos, "data %s: %s has no sheet %q%s", s.Name, s.File, s.Sheet, suggestOrList(s.Sheet, sheets))
		}
		sheet = s.Sheet
	}
	x := &xlsxReader{s: s, f: f, sheet: sheet, styles: map[int]bool{}}
	if props, err := f.GetWorkbookProps(); err == nil && props.Date1904 != nil {
		x.date1904 = *props.Date1904
	}
	rows, err := f.GetRows(sheet, excelize.Options{RawCellValue: true})
	if err != nil {
		return nil, Errorf(s.FilePos, "data %s: cannot read sheet %q of %s: %v", s.Name, sheet, s.File, err)
	}
	return x.read(rows, hex.EncodeToString(sum[:]))
}

func unwrapPathErr(err error) error {
	if pe, ok := err.(*os.PathError); ok {
		return pe.Err
	}
	return err
}

type xlsxReader struct {
	s        *SourceSpec
	f        *excelize.File
	sheet    string
	date1904 bool
	styles   map[int]bool // style index → has a date number format
}

// xlKind is what a cell holds once read.
type xlKind uint8

const (
	xlEmpty xlKind = iota
	xlNumber
	xlDate
	xlBool
	xlText
)

// where names a cell for messages: data/sales.xlsx:Q3!C1.
func (x *xlsxReader) where(col, row int) string {
	name, _ := excelize.CoordinatesToCellName(col, row)
	return fmt.Sprintf("%s:%s!%s", x.s.File, x.sheet, name)
}

func (x *xlsxReader) read(rows [][]string, sum string) (*Dataset, error) {
	s := x.s
	head := -1
	for i, r := range rows {
		for _, c := range r {
			if strings.TrimSpace(c) != "" {
				head = i
				break
			}
		}
		if head >= 0 {
			break
		}
	}
	if head < 0 {
		return nil, Errorf(s.FilePos, "data %s: sheet %q of %s is empty; it needs a header row and at least one row of data", s.Name, x.sheet, s.File)
	}
	headRow := head + 1 // 1-based sheet row
	merged, err := x.f.GetMergeCells(x.sheet, true)
	if err == nil {
		for _, m := range merged {
			c1, r1, e1 := excelize.CellNameToCoordinates(m.GetStartAxis())
			_, r2, e2 := excelize.CellNameToCoordinates(m.GetEndAxis())
			if e1 == nil && e2 == nil && r1 <= headRow && headRow <= r2 {
				return nil, Errorf(s.FilePos, "data %s: header cell %s is merged (%s:%s); unmerge it and give each column its own name", s.Name, x.where(c1, headRow), m.GetStartAxis(), m.GetEndAxis())
			}
		}
	}
	header := rows[head]
	width := len(header)
	for width > 0 && strings.TrimSpace(header[width-1]) == "" {
		width--
	}
	// Data past the last named column needs a header too.
	for i := head + 1; i < len(rows); i++ {
		for j := width; j < len(rows[i]); j++ {
			if strings.TrimSpace(rows[i][j]) != "" {
				return nil, Errorf(s.FilePos, "data %s: cell %s holds %q but its column has no name in the header row; name it in %s", s.Name, x.where(j+1, i+1), rows[i][j], x.where(j+1, headRow))
			}
		}
	}
	names := make([]string, width)
	seen := map[string]int{}
	for j := 0; j < width; j++ {
		h := strings.TrimSpace(header[j])
		if h == "" {
			return nil, Errorf(s.FilePos, "data %s: header cell %s is empty; name the column", s.Name, x.where(j+1, headRow))
		}
		if k, dup := seen[h]; dup {
			return nil, Errorf(s.FilePos, "data %s: header cells %s and %s are both named %q; rename one", s.Name, x.where(k+1, headRow), x.where(j+1, headRow), h)
		}
		seen[h] = j
		names[j] = h
	}
	if err := s.checkHints(names); err != nil {
		return nil, err
	}
	var sheetRows []int // 1-based sheet row of each data row
	texts := make([][]string, width)
	kinds := make([][]xlKind, width)
	for i := head + 1; i < len(rows); i++ {
		r := rows[i]
		empty := true
		for _, c := range r {
			if strings.TrimSpace(c) != "" {
				empty = false
				break
			}
		}
		if empty {
			continue // a blank row, as a blank line in a CSV file
		}
		sheetRows = append(sheetRows, i+1)
		for j := 0; j < width; j++ {
			raw := ""
			if j < len(r) {
				raw = r[j]
			}
			t, k, err := x.cell(j+1, i+1, raw)
			if err != nil {
				return nil, err
			}
			texts[j] = append(texts[j], t)
			kinds[j] = append(kinds[j], k)
		}
	}
	cols := make([]*Column, width)
	for j, name := range names {
		spec := s
		if _, hinted := s.Types[name]; !hinted {
			if ty, ok := x.columnType(texts[j], kinds[j]); ok {
				spec = s.withType(name, ty)
			}
		}
		bad := -1
		c, err := buildColumn(spec, name, texts[j], func(row int) Pos { bad = row; return s.FilePos })
		if err != nil {
			if e, ok := err.(*Error); ok && bad >= 0 {
				e.Msg += fmt.Sprintf(" (cell %s)", x.where(j+1, sheetRows[bad]))
			}
			return nil, err
		}
		cols[j] = c
	}
	return NewDataset(s.Name, s.File, sum, cols), nil
}

// columnType types a column by its cells' own types; ok is false when the
// cells hold text, and the text decides as in a CSV file.
func (x *xlsxReader) columnType(texts []string, kinds []xlKind) (ColType, bool) {
	var n [xlText + 1]int
	present := 0
	for i, k := range kinds {
		t := strings.TrimSpace(texts[i])
		if k == xlEmpty || x.s.isMissing(t) {
			continue
		}
		present++
		n[k]++
	}
	switch {
	case present == 0:
		return TypeNumber, true
	case n[xlNumber] == present:
		return TypeNumber, true
	case n[xlDate] == present:
		return TypeDate, true
	case n[xlBool] == present:
		return TypeBinary, true
	case n[xlText] == present:
		// Text cells: a column of ISO dates typed as text is a date column,
		// as in a CSV file; any other text is a category (numbers typed as
		// text stay text).
		for i, k := range kinds {
			if t := strings.TrimSpace(texts[i]); k == xlText && !x.s.isMissing(t) && !isDate(t) {
				return TypeCategory, true
			}
		}
		return TypeDate, true
	}
	return TypeCategory, true
}

// cell reads one cell's raw value with its type.
func (x *xlsxReader) cell(col, row int, raw string) (string, xlKind, error) {
	if strings.TrimSpace(raw) == "" {
		return "", xlEmpty, nil
	}
	name, _ := excelize.CoordinatesToCellName(col, row)
	ct, err := x.f.GetCellType(x.sheet, name)
	if err != nil {
		return raw, xlText, nil
	}
	switch ct {
	case excelize.CellTypeBool:
		if raw == "1" || strings.EqualFold(raw, "true") {
			return "true", xlBool, nil
		}
		return "false", xlBool, nil
	case excelize.CellTypeDate:
		// An ISO 8601 date cell (t="d").
		if t, err := time.Parse(time.RFC3339Nano, raw); err == nil {
			return isoTime(t), xlDate, nil
		}
		if len(raw) >= 10 && isDate(raw[:10]) {
			return raw[:10], xlDate, nil
		}
		return raw, xlText, nil
	case excelize.CellTypeUnset, excelize.CellTypeNumber:
		if _, err := strconv.ParseFloat(raw, 64); err != nil {
			return raw, xlText, nil
		}
		if x.dateStyled(name) {
			serial, _ := strconv.ParseFloat(raw, 64)
			t, err := excelize.ExcelDateToTime(serial, x.date1904)
			if err != nil {
				return raw, xlNumber, nil
			}
			return isoTime(t), xlDate, nil
		}
		return raw, xlNumber, nil
	case excelize.CellTypeError:
		return raw, xlText, nil
	}
	return raw, xlText, nil // shared, inline and formula strings
}

// isoTime writes a date as YYYY-MM-DD, and a date with a time of day as
// YYYY-MM-DD HH:MM:SS.
func isoTime(t time.Time) string {
	if t.Hour() == 0 && t.Minute() == 0 && t.Second() == 0 && t.Nanosecond() == 0 {
		return t.Format("2006-01-02")
	}
	return t.Format("2006-01-02 15:04:05")
}

// dateStyled reports whether a cell's number format shows a date.
func (x *xlsxReader) dateStyled(cell string) bool {
	idx, err := x.f.GetCellStyle(x.sheet, cell)
	if err != nil || idx == 0 {
		return false
	}
	if d, ok := x.styles[idx]; ok {
		return d
	}
	d := false
	if st, err := x.f.GetStyle(idx); err == nil && st != nil {
		if st.CustomNumFmt != nil {
			d = isDateFormat(*st.CustomNumFmt)
		} else {
			d = isDateNumFmt(st.NumFmt)
		}
	}
	x.styles[idx] = d
	return d
}

// isDateNumFmt reports whether a built-in number format id shows a date
// (ECMA-376 part 1, 18.8.30: 14–17 and 22, and the East Asian date formats
// 27–36 and 50–58).
func isDateNumFmt(id int) bool {
	return id >= 14 && id <= 17 || id == 22 || id >= 27 && id <= 36 || id >= 50 && id <= 58
}

// isDateFormat reports whether a custom number format code shows a date: it
// has a year or day token outside quoted text and brackets.
func isDateFormat(code string) bool {
	quoted, bracket := false, false
	for i := 0; i < len(code); i++ {
		c := code[i]
		switch {
		case c == '"':
			quoted = !quoted
		case quoted:
		case c == '\\':
			i++
		case c == '[':
			bracket = true
		case c == ']':
			bracket = false
		case bracket:
		case c == 'y' || c == 'Y' || c == 'd' || c == 'D':
			return true
		}
	}
	return false
}

// withType returns a copy of the source spec that types one more column.
func (s *SourceSpec) withType(name string, t ColType) *SourceSpec {
	c := *s
	c.Types = make(map[string]ColType, len(s.Types)+1)
	for k, v := range s.Types {
		c.Types[k] = v
	}
	c.Types[name] = t
	return &c
}
