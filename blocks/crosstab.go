package blocks

import (
	"fmt"

	"candor/blocks/stats"
	"candor/figures"
)

func init() { analyses["crosstab"] = runCrosstab }

// crosstabCharts are the kinds a crosstab can be drawn as.
var crosstabCharts = []figures.Kind{figures.Stacked, figures.Grouped, figures.Line}

// crosstabAgg is what a crosstab publishes (publishCrosstab), counted from
// the rows in memory (runCrosstab) or in the database (pdCrosstab): the
// levels of the row and the column variable in order, and the rows of
// every pair.
type crosstabAgg struct {
	rows, cols             []Group
	counts                 [][]float64 // counts[i][j]: rows of row level i and column level j
	rowOrdered, colOrdered bool
}

// runCrosstab counts the rows of every pair of levels of two columns, with
// row, column and total percentages, Pearson's chi-square test of
// independence and Cramér's V.
func runCrosstab(a *run) error {
	s := a.spec
	if err := a.chartOK(crosstabCharts...); err != nil {
		return err
	}
	if s.Target[0] == s.Target[1] {
		return Errorf(s.TargetPos[1], "crosstab needs two different columns")
	}
	var x crosstabAgg
	var err error
	// order: applies to the row variable.
	if x.rows, _, x.rowOrdered, err = a.groups(s.Target[0], s.TargetPos[0]); err != nil {
		return err
	}
	err = a.withoutOrder(func() (err error) {
		x.cols, _, x.colOrdered, err = a.groups(s.Target[1], s.TargetPos[1])
		return err
	})
	if err != nil {
		return err
	}
	// colOf[k] is the column level of row k, -1 where it has none.
	colOf := make([]int32, a.t.Rows())
	for k := range colOf {
		colOf[k] = -1
	}
	for j, c := range x.cols {
		for _, k := range c.Rows {
			colOf[k] = int32(j)
		}
	}
	x.counts = make([][]float64, len(x.rows))
	for i, r := range x.rows {
		x.counts[i] = make([]float64, len(x.cols))
		for _, k := range r.Rows {
			if j := colOf[k]; j >= 0 {
				x.counts[i][j]++
			}
		}
	}
	return publishCrosstab(a, x)
}

// withoutOrder runs f with the order: key set aside: it orders the
// crosstab's row variable only.
func (a *run) withoutOrder(f func() error) error {
	saved := a.spec.Order
	a.spec.Order = nil
	defer func() { a.spec.Order = saved }()
	return f()
}

// publishCrosstab publishes a crosstab's facts, tables, checker metadata
// and figure from its counts.
func publishCrosstab(a *run, x crosstabAgg) error {
	s := a.spec
	rows, cols, counts := x.rows, x.cols, x.counts
	rowTot := make([]float64, len(rows))
	colTot := make([]float64, len(cols))
	n := 0.0
	for i := range rows {
		for j := range cols {
			rowTot[i] += counts[i][j]
			colTot[j] += counts[i][j]
			n += counts[i][j]
		}
	}
	if n == 0 {
		return Errorf(s.TargetPos[0], "crosstab: no row has values for both %s and %s", s.Target[0], s.Target[1])
	}
	a.res.Meta.N = int(n)
	a.res.Meta.Ordered = x.rowOrdered && x.colOrdered
	for _, r := range rows {
		a.res.Meta.Levels = append(a.res.Meta.Levels, r.Label)
	}
	for _, c := range cols {
		a.res.Meta.ColLevels = append(a.res.Meta.ColLevels, c.Label)
	}
	a.method("chi-square", "cramer-v")
	cs := stats.ChiSquareIndependence(counts)
	a.set("n", n, Count, "")
	a.set("chi2", cs.Chi2, Number, reasonOf(cs.Reason, "Chi2"))
	a.set("df", float64(cs.DF), Count, "")
	a.set("p", cs.P, PValue, reasonOf(cs.Reason, "P"))
	a.set("v", cs.CramersV, Number, reasonOf(cs.Reason, "CramersV"))
	a.set("min_expected", cs.MinExpected, Number, reasonOf(cs.Reason, "MinExpected"))
	low := 0
	for i := range rows {
		for j := range cols {
			if rowTot[i] > 0 && colTot[j] > 0 && cs.Expected != nil && cs.Expected[i][j] < 5 {
				low++
			}
		}
	}
	a.set("low_expected", float64(low), Count, "")
	for i, r := range rows {
		a.set(r.Slug+".total", rowTot[i], Count, "")
		for j, c := range cols {
			p := r.Slug + "." + c.Slug + "."
			a.set(p+"count", counts[i][j], Count, "")
			why := ""
			if rowTot[i] == 0 {
				why = "no cases in this row"
			}
			a.set(p+"row_pct", 100*counts[i][j]/rowTot[i], Percent, why)
			why = ""
			if colTot[j] == 0 {
				why = "no cases in this column"
			}
			a.set(p+"col_pct", 100*counts[i][j]/colTot[j], Percent, why)
			a.set(p+"pct", 100*counts[i][j]/n, Percent, "")
		}
	}
	head := []string{s.Target[0] + " \\ " + s.Target[1]}
	for _, c := range cols {
		head = append(head, c.Label)
	}
	head = append(head, "Total")
	table := func(caption, suffix string, total func(i int) string) Table {
		t := Table{Caption: caption, Head: head}
		for i, r := range rows {
			row := []Cell{cellText(r.Label)}
			for _, c := range cols {
				row = append(row, a.numCell(r.Slug+"."+c.Slug+"."+suffix))
			}
			row = append(row, cellNum(total(i), ""))
			t.Rows = append(t.Rows, row)
		}
		return t
	}
	ct := table(fmt.Sprintf("Counts of %s by %s.", s.Target[0], s.Target[1]), "count", func(i int) string { return Thousands(fmt.Sprint(int(rowTot[i]))) })
	tot := []Cell{cellText("Total")}
	for j := range cols {
		tot = append(tot, cellNum(Thousands(fmt.Sprint(int(colTot[j]))), ""))
	}
	tot = append(tot, a.numCell("n"))
	ct.Rows = append(ct.Rows, tot)
	note := fmt.Sprintf("Pearson's chi-square test of independence: chi-square = %s, df = %d, %s; Cramér's V = %s.",
		Format(a.res.Facts[s.ID+".chi2"], -1), cs.DF, pText(a.res.Facts[s.ID+".p"]), Format(a.res.Facts[s.ID+".v"], -1))
	ct.Notes = append(ct.Notes, note)
	if low > 0 {
		ct.Notes = append(ct.Notes, fmt.Sprintf("%d of %d cells have an expected count below 5 (smallest %s), so the chi-square p-value is only approximate.",
			low, len(rows)*len(cols), Sig(cs.MinExpected, 3)))
	}
	rt := table("Row percentages: each row sums to 100%.", "row_pct", func(i int) string { return "100.0%" })
	colt := table("Column percentages: each column sums to 100%.", "col_pct", func(i int) string {
		return Format(Fact{Value: 100 * rowTot[i] / n, Kind: Percent}, -1)
	})
	a.res.Tables = append(a.res.Tables, ct, rt, colt)

	fs := a.figure(figures.Stacked)
	fs.Title = fmt.Sprintf("%s by %s", s.Target[1], s.Target[0])
	fs.XLabel, fs.YLabel = s.Target[0], "% of "+s.Target[0]
	fs.Percent = true
	for i, r := range rows {
		if rowTot[i] == 0 {
			continue
		}
		fs.Categories = append(fs.Categories, r.Label)
	}
	for j, c := range cols {
		ser := figures.Series{Name: c.Label}
		for i := range rows {
			if rowTot[i] == 0 {
				continue
			}
			if fs.Kind == figures.Stacked || s.Percent {
				ser.Values = append(ser.Values, 100*counts[i][j]/rowTot[i])
			} else {
				ser.Values = append(ser.Values, counts[i][j])
			}
		}
		fs.Series = append(fs.Series, ser)
	}
	if fs.Kind != figures.Stacked && !s.Percent {
		fs.Percent = false
		fs.YLabel = "Count"
	}
	return nil
}
