package blocks

import "candor/figures"

// Result is what one analysis block computed: its facts, its tables, the
// figure to draw and what a reader needs to know about how it was made.
type Result struct {
	ID       string
	Analysis string // the analysis key: summary, frequency, ...
	Pos      Pos    // the block's opening fence
	Source   string // the data source name
	Facts    Facts  // full names, "ID.NAME"
	Tables   []Table
	Figure   *figures.Spec // nil when the block draws nothing (chart: none)
	Filters  []string      // the where: conditions applied, as written
	Notes    []string      // notes a reader needs under the table
	Methods  []string      // keys of the methods used (see Methods)
	Meta     Meta
}

// Meta describes the analysis for the checker: what was compared with what.
type Meta struct {
	// Outcome is "numeric", "binary" or "categorical" for the analysed column.
	Outcome string
	// Success is the value counted as a success of a binary outcome.
	Success string
	// Columns are the columns analysed, in the order the block names them.
	Columns []string
	// By is the grouping column, Groups its levels in display order (slugged
	// forms are the fact names), Reference the reference group.
	By        string
	Groups    []string
	Reference string
	// Time is the time column of a trend and Times its points in order.
	Time  string
	Times []string
	// Predictors of a regression.
	Predictors []string
	// Levels are the categories of a frequency or the rows/columns of a
	// crosstab.
	Levels, ColLevels []string
	// Ordered is true when the levels have an order (a number, a date or an
	// `order:` key).
	Ordered bool
	// Binned is true when a frequency cut a continuous number column into
	// bins; a number column with few whole values is tabled value by value
	// and is not binned.
	Binned bool
	// N is the number of cases analysed (after filters and missing values).
	N int
}

// Table is a result table, independent of HTML.
type Table struct {
	Caption string
	Head    []string
	Rows    [][]Cell
	Notes   []string
}

// Cell is one table cell. Num cells are right-aligned; Fact names the fact
// the cell shows, if any.
type Cell struct {
	Text string
	Num  bool
	Fact string
}

// Transpose turns the table's columns into rows: the header's first cell
// stays in the corner, the first column becomes the header. A table with
// few rows and many statistics reads better this way.
func (t Table) Transpose() Table {
	out := Table{Caption: t.Caption, Notes: t.Notes}
	corner := ""
	if len(t.Head) > 0 {
		corner = t.Head[0]
	}
	out.Head = []string{corner}
	for _, r := range t.Rows {
		out.Head = append(out.Head, r[0].Text)
	}
	for j := 1; j < len(t.Head); j++ {
		row := []Cell{cellText(t.Head[j])}
		for _, r := range t.Rows {
			row = append(row, r[j])
		}
		out.Rows = append(out.Rows, row)
	}
	return out
}
