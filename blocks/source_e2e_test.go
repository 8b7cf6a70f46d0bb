package blocks_test

import (
	"context"
	"database/sql"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/jackc/pgx/v5/pgconn"
	"github.com/xuri/excelize/v2"
	_ "modernc.org/sqlite"

	"candor/blocks"
	"candor/render"
)

// These tests build whole reports (render.Build) on each source kind: the
// errors a report author meets, with the report position and a message
// that says what to change, parameters from params: and --set, and the
// read-only guarantee.

// shopRows are the orders of an invented corner shop.
var shopRows = [][]any{
	{"North", 30.5, "2026-Q3", 2}, {"South", 22.25, "2026-Q3", 1}, {"North", 10.0, "2026-Q2", 3},
	{"East", 18.75, "2026-Q3", 2}, {"South", 12.0, "2026-Q2", 1}, {"North", 41.0, "2026-Q3", 4},
}

func writeFile(t *testing.T, path, body string) {
	t.Helper()
	if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(path, []byte(body), 0o644); err != nil {
		t.Fatal(err)
	}
}

func shopDB(t *testing.T, path string) {
	t.Helper()
	if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
		t.Fatal(err)
	}
	db, err := sql.Open("sqlite", path)
	if err != nil {
		t.Fatal(err)
	}
	defer db.Close()
	if _, err := db.Exec("CREATE TABLE orders (store TEXT, total REAL, quarter TEXT, items INTEGER)"); err != nil {
		t.Fatal(err)
	}
	for _, r := range shopRows {
		if _, err := db.Exec("INSERT INTO orders VALUES (?, ?, ?, ?)", r...); err != nil {
			t.Fatal(err)
		}
	}
}

func shopCSV() string {
	var b strings.Builder
	b.WriteString("store,total,quarter,items\n")
	for _, r := range shopRows {
		fmt.Fprintf(&b, "%s,%v,%s,%d\n", r...)
	}
	return b.String()
}

func shopXLSX(t *testing.T, path string, edit func(f *excelize.File)) {
	t.Helper()
	f := excelize.NewFile()
	defer f.Close()
	f.SetSheetName("Sheet1", "Q3")
	for j, h := range []string{"store", "total", "quarter", "items"} {
		cell, _ := excelize.CoordinatesToCellName(j+1, 1)
		f.SetCellValue("Q3", cell, h)
	}
	for i, r := range shopRows {
		for j, v := range r {
			cell, _ := excelize.CoordinatesToCellName(j+1, i+2)
			f.SetCellValue("Q3", cell, v)
		}
	}
	f.NewSheet("Q4")
	if edit != nil {
		edit(f)
	}
	if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := f.SaveAs(path); err != nil {
		t.Fatal(err)
	}
}

// front is a report's front matter with one source, given as YAML lines
// (indented under data:), and the quarter parameter.
func front(source string) string {
	return "---\ntitle: Corner shop\ndata:\n" + source + "params:\n  quarter: 2026-Q3\n---\n\n"
}

const sqliteSource = "  orders:\n    sqlite: data/shop.db\n    query: SELECT store, total, quarter, items FROM orders WHERE quarter = :quarter\n"

func build(t *testing.T, dir, report string, opts render.Options) (*render.Report, error) {
	t.Helper()
	path := filepath.Join(dir, "report.md")
	writeFile(t, path, report)
	return render.Build(path, opts)
}

// wantError checks a build error: an input error (exit status 2) at the
// line and column, with every phrase in its message.
func wantError(t *testing.T, err error, file string, line, col int, phrases ...string) {
	t.Helper()
	if err == nil {
		t.Fatal("the report built; want an error")
	}
	e, ok := err.(*blocks.Error)
	if !ok {
		t.Fatalf("error %T %q is not a *blocks.Error (exit status 2)", err, err)
	}
	t.Logf("%s:%d:%d: %s", filepath.Base(e.Pos.File), e.Pos.Line, e.Pos.Col, e.Msg)
	if e.Pos.File != file || e.Pos.Line != line || e.Pos.Col != col {
		t.Errorf("position %s:%d:%d, want %s:%d:%d (%s)", e.Pos.File, e.Pos.Line, e.Pos.Col, file, line, col, e.Msg)
	}
	for _, p := range phrases {
		if !strings.Contains(e.Msg, p) {
			t.Errorf("message %q lacks %q", e.Msg, p)
		}
	}
}

func TestSQLiteReportErrors(t *testing.T) {
	cases := []struct {
		name      string
		source    string
		block     string
		set       map[string]string
		line, col int
		phrases   []string
	}{
		{"unknown table", "  orders:\n    sqlite: data/shop.db\n    query: SELECT store FROM order WHERE quarter = :quarter\n", "summary: total",
			nil, 6, 12, []string{"the query failed", "syntax error"}},
		{"table near a name", "  orders:\n    sqlite: data/shop.db\n    query: SELECT store FROM orderz WHERE quarter = :quarter\n", "summary: total",
			nil, 6, 12, []string{"no such table: orderz", `did you mean "orders"?`}},
		{"column near a name", "  orders:\n    sqlite: data/shop.db\n    query: SELECT stor FROM orders\n", "frequency: stor",
			nil, 6, 12, []string{"no such column: stor", `did you mean "store"?`}},
		{"unknown parameter", "  orders:\n    sqlite: data/shop.db\n    query: SELECT store FROM orders WHERE quarter = :quater\n", "frequency: store",
			nil, 6, 53, []string{":quater", `did you mean "quarter"?`}},
		{"missing file", "  orders:\n    sqlite: data/shops.db\n    query: SELECT store FROM orders\n", "frequency: store",
			nil, 5, 13, []string{"data/shops.db not found", `did you mean "shop.db"?`}},
		{"block column", sqliteSource, "summary: totl",
			nil, 12, 10, []string{`has no column "totl"`, `did you mean "total"?`}},
		{"hint names no column", "  orders:\n    sqlite: data/shop.db\n    query: SELECT store FROM orders\n    columns:\n      stores: category\n", "frequency: store",
			nil, 8, 7, []string{`columns names "stores"`}},
		{"type mismatch", "  orders:\n    sqlite: data/shop.db\n    query: SELECT store, total FROM orders\n    columns:\n      store: number\n", "summary: store",
			nil, 6, 12, []string{`column "store" is a number column but row 1 holds "North"`}},
		{"not a query", "  orders:\n    sqlite: data/shop.db\n    query: DELETE FROM orders RETURNING store\n", "frequency: store",
			nil, 6, 12, []string{"must read data", "starts with DELETE"}},
		{"two columns one name", "  orders:\n    sqlite: data/shop.db\n    query: SELECT store, total AS store FROM orders\n", "frequency: store",
			nil, 6, 12, []string{`two columns named "store"`}},
		{"no rows after --set", sqliteSource, "summary: total",
			map[string]string{"quarter": "2027-Q1"}, 11, 1, []string{"has no rows"}},
		{"sheet on sqlite", "  orders:\n    sqlite: data/shop.db\n    sheet: Q3\n    query: SELECT store FROM orders\n", "frequency: store",
			nil, 6, 12, []string{"sheet applies to .xlsx files only"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			dir := t.TempDir()
			shopDB(t, filepath.Join(dir, "data", "shop.db"))
			_, err := build(t, dir, front(c.source)+"```candor a\n"+c.block+"\n```\n", render.Options{Set: c.set})
			wantError(t, err, filepath.Join(dir, "report.md"), c.line, c.col, c.phrases...)
		})
	}
}

// TestSQLiteInjection: a --set value that tries to end the string and drop
// the table is bound as a value: the build fails harmlessly (no rows have
// that quarter), the table keeps its rows, and no statement but the query
// ran.
func TestSQLiteInjection(t *testing.T) {
	dir := t.TempDir()
	db := filepath.Join(dir, "data", "shop.db")
	shopDB(t, db)
	report := front(sqliteSource) + "```candor a\nsummary: total\n```\n"
	evil := "x'; DROP TABLE orders; --"
	_, err := build(t, dir, report, render.Options{Set: map[string]string{"quarter": evil}})
	wantError(t, err, filepath.Join(dir, "report.md"), 11, 1, "has no rows")
	conn, err2 := sql.Open("sqlite", db)
	if err2 != nil {
		t.Fatal(err2)
	}
	defer conn.Close()
	var n int
	if err := conn.QueryRow("SELECT COUNT(*) FROM orders").Scan(&n); err != nil || n != len(shopRows) {
		t.Fatalf("after the attempt the table has %d rows (%v); want %d", n, err, len(shopRows))
	}
	// The value reaches the query as a value: a row with that text is found.
	if _, err := conn.Exec("INSERT INTO orders VALUES ('West', 5, ?, 1)", evil); err != nil {
		t.Fatal(err)
	}
	rep, err := build(t, dir, report+"\nIn {{params.quarter}} there were {{a.n}} orders.\n", render.Options{Set: map[string]string{"quarter": evil}})
	if err != nil {
		t.Fatal(err)
	}
	if f := rep.Facts["a.n"]; f.Value != 1 {
		t.Errorf("a.n = %v, want 1 (the one row whose quarter is the value)", f.Value)
	}
}

// TestParamsEndToEnd: params: defaults and --set reach a query, a where:
// value and the prose; the header shows the values used.
func TestParamsEndToEnd(t *testing.T) {
	for _, kind := range []string{"csv", "xlsx", "sqlite"} {
		t.Run(kind, func(t *testing.T) {
			dir := t.TempDir()
			var source string
			switch kind {
			case "csv":
				writeFile(t, filepath.Join(dir, "data", "shop.csv"), shopCSV())
				source = "  orders: data/shop.csv\n"
			case "xlsx":
				shopXLSX(t, filepath.Join(dir, "data", "shop.xlsx"), nil)
				source = "  orders:\n    file: data/shop.xlsx\n    sheet: Q3\n"
			case "sqlite":
				shopDB(t, filepath.Join(dir, "data", "shop.db"))
				source = "  orders:\n    sqlite: data/shop.db\n    query: SELECT * FROM orders\n"
			}
			report := front(source) + "```candor sales\nsummary: total\nwhere: \"quarter = :quarter\"\n```\n\nOrders in {{params.quarter}}: {{sales.n}}.\n"
			rep, err := build(t, dir, report, render.Options{})
			if err != nil {
				t.Fatal(err)
			}
			if n := rep.Facts["sales.n"].Value; n != 4 {
				t.Errorf("default quarter: n = %v, want 4", n)
			}
			if !strings.Contains(string(rep.HTML), "Orders in 2026-Q3: 4.") {
				t.Error("the prose does not show the parameter and the count")
			}
			rep, err = build(t, dir, report, render.Options{Set: map[string]string{"quarter": "2026-Q2"}})
			if err != nil {
				t.Fatal(err)
			}
			if n, m := rep.Facts["sales.n"].Value, rep.Facts["sales.mean"].Value; n != 2 || m != 11 {
				t.Errorf("--set quarter=2026-Q2: n = %v, mean = %v; want 2 and 11", n, m)
			}
			html := string(rep.HTML)
			if !strings.Contains(html, "Orders in 2026-Q2: 2.") {
				t.Error("the prose does not show the value set")
			}
			head := html
			if k := strings.Index(html, "Orders in"); k > 0 {
				head = html[:k]
			}
			if !strings.Contains(head, "2026-Q2") {
				t.Error("the header does not show the parameter's value")
			}
			_, err = build(t, dir, report, render.Options{Set: map[string]string{"quartr": "2026-Q2"}})
			wantError(t, err, filepath.Join(dir, "report.md"), 1, 1, `did you mean "quarter"?`)
		})
	}
}

func TestFileSafety(t *testing.T) {
	root := t.TempDir()
	dir := filepath.Join(root, "reports", "q3")
	outside := filepath.Join(root, "shared")
	shopDB(t, filepath.Join(outside, "shop.db"))
	shopXLSX(t, filepath.Join(outside, "shop.xlsx"), nil)
	if err := os.MkdirAll(filepath.Join(dir, "data"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink(filepath.Join(outside, "shop.db"), filepath.Join(dir, "data", "link.db")); err != nil {
		t.Fatal(err)
	}
	report := filepath.Join(dir, "report.md")
	for _, src := range []string{
		"  orders:\n    sqlite: ../../shared/shop.db\n    query: SELECT * FROM orders\n",
		"  orders:\n    sqlite: data/link.db\n    query: SELECT * FROM orders\n",
		"  orders:\n    file: ../../shared/shop.xlsx\n",
	} {
		body := front(src) + "```candor a\nfrequency: store\n```\n"
		_, err := build(t, dir, body, render.Options{})
		col := 13
		if strings.Contains(src, "file:") {
			col = 11
		}
		wantError(t, err, report, 5, col, "outside the report's folder", "--data-root")
		if _, err := build(t, dir, body, render.Options{DataRoot: root}); err != nil {
			t.Errorf("with --data-root %s: %v", root, err)
		}
	}
}

func TestXLSXReportErrors(t *testing.T) {
	cases := []struct {
		name      string
		source    string
		edit      func(f *excelize.File)
		line, col int
		phrases   []string
	}{
		{"unknown sheet", "  orders:\n    file: data/shop.xlsx\n    sheet: Q5\n", nil,
			6, 12, []string{`has no sheet "Q5"`, `"Q3" or "Q4"`}},
		{"empty header", "  orders:\n    file: data/shop.xlsx\n    sheet: Q3\n", func(f *excelize.File) { f.SetCellValue("Q3", "C1", "") },
			5, 11, []string{"header cell data/shop.xlsx:Q3!C1 is empty"}},
		{"merged header", "  orders:\n    file: data/shop.xlsx\n    sheet: Q3\n", func(f *excelize.File) { f.MergeCell("Q3", "B1", "C1") },
			5, 11, []string{"data/shop.xlsx:Q3!B1 is merged (B1:C1)"}},
		{"text in a number column", "  orders:\n    file: data/shop.xlsx\n    sheet: Q3\n    columns:\n      total: number\n", func(f *excelize.File) { f.SetCellValue("Q3", "B4", "ten") },
			5, 11, []string{`row 3 holds "ten"`, "cell data/shop.xlsx:Q3!B4"}},
		{"value without a header", "  orders:\n    file: data/shop.xlsx\n", func(f *excelize.File) { f.SetCellValue("Q3", "F3", 7) },
			5, 11, []string{"data/shop.xlsx:Q3!F3", "no name in the header row"}},
		{"empty sheet", "  orders:\n    file: data/shop.xlsx\n    sheet: Q4\n", nil,
			5, 11, []string{`sheet "Q4" of data/shop.xlsx is empty`}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			dir := t.TempDir()
			shopXLSX(t, filepath.Join(dir, "data", "shop.xlsx"), c.edit)
			_, err := build(t, dir, front(c.source)+"```candor a\nfrequency: store\n```\n", render.Options{})
			wantError(t, err, filepath.Join(dir, "report.md"), c.line, c.col, c.phrases...)
		})
	}
	t.Run("not a workbook", func(t *testing.T) {
		dir := t.TempDir()
		writeFile(t, filepath.Join(dir, "data", "shop.xlsx"), "store,total\nNorth,3\n")
		_, err := build(t, dir, front("  orders: data/shop.xlsx\n")+"```candor a\nfrequency: store\n```\n", render.Options{})
		wantError(t, err, filepath.Join(dir, "report.md"), 4, 11, "is not an Excel workbook")
	})
}

// TestXLSXTypes: a sheet's cells keep their types: numbers, dates shown as
// dates, booleans and text; the first sheet is the default.
func TestXLSXTypes(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "data", "visits.xlsx")
	f := excelize.NewFile()
	f.SetSheetName("Sheet1", "Visits")
	date, _ := f.NewStyle(&excelize.Style{NumFmt: 14})
	custom := "dd mmm yyyy"
	date2, _ := f.NewStyle(&excelize.Style{CustomNumFmt: &custom})
	rows := [][]any{
		{"member", "visits", "joined", "renewed", "code", "spend"},
		{"Ana", 3, time.Date(2026, 1, 5, 0, 0, 0, 0, time.UTC), true, "007", 12.5},
		{"Ben", 5, time.Date(2026, 2, 9, 0, 0, 0, 0, time.UTC), false, "012", "NA"},
		{"Cai", 4, time.Date(2025, 12, 30, 0, 0, 0, 0, time.UTC), true, "100", 0.1},
	}
	for i, r := range rows {
		for j, v := range r {
			cell, _ := excelize.CoordinatesToCellName(j+1, i+1)
			f.SetCellValue("Visits", cell, v)
			if j == 2 && i > 0 {
				st := date
				if i == 2 {
					st = date2
				}
				f.SetCellStyle("Visits", cell, cell, st)
			}
		}
	}
	os.MkdirAll(filepath.Dir(path), 0o755)
	if err := f.SaveAs(path); err != nil {
		t.Fatal(err)
	}
	rep, err := build(t, dir, "---\ndata:\n  visits: data/visits.xlsx\n---\n\n```candor j\nfrequency: joined\n```\n\n```candor s\nsummary: spend\n```\n\n```candor c\nfrequency: code\n```\n\n```candor r\nfrequency: renewed\n```\n", render.Options{})
	if err != nil {
		t.Fatal(err)
	}
	for name, want := range map[string]float64{
		"j.2026_01_05.count": 1, "j.2025_12_30.count": 1, "j.2026_02_09.count": 1,
		"s.n": 2, "s.missing": 1, "s.mean": 6.3, "c.007.count": 1, "r.true.count": 2,
	} {
		f, ok := rep.Facts[name]
		if !ok || f.Value != want {
			t.Errorf("%s = %v (%v), want %v", name, f.Value, ok, want)
		}
	}
	if rep.Results[0].Meta.Levels[0] != "2025-12-30" {
		t.Errorf("dates are not in time order: %v", rep.Results[0].Meta.Levels)
	}
}

// TestTimeout: a query that runs past the statement timeout is cancelled
// and reported at the query.
func TestTimeout(t *testing.T) {
	old := blocks.StatementTimeout
	blocks.StatementTimeout = 300 * time.Millisecond
	defer func() { blocks.StatementTimeout = old }()
	dir := t.TempDir()
	shopDB(t, filepath.Join(dir, "data", "shop.db"))
	slow := "  orders:\n    sqlite: data/shop.db\n    query: WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n) SELECT i AS store FROM n\n"
	start := time.Now()
	_, err := build(t, dir, front(slow)+"```candor a\nfrequency: store\n```\n", render.Options{})
	wantError(t, err, filepath.Join(dir, "report.md"), 6, 12, "statement timeout", "was cancelled")
	if d := time.Since(start); d > 10*time.Second {
		t.Errorf("the timeout took %s", d)
	}
}

// ---- PostgreSQL ----

func testPG(t *testing.T) string {
	t.Helper()
	dsn := os.Getenv("CANDOR_TEST_PG")
	if dsn == "" {
		if os.Getenv("CI") == "true" {
			t.Fatal("CANDOR_TEST_PG is not set; .ci/run starts a PostgreSQL server with .ci/postgres.sh and sets it")
		}
		t.Skip("CANDOR_TEST_PG is not set (source .ci/postgres.sh to start a server); skipping the PostgreSQL tests")
	}
	return dsn
}

func pgExec(t *testing.T, dsn string, stmts ...string) {
	t.Helper()
	ctx, cancel := context.WithTimeout(context.Background(), 60*time.Second)
	defer cancel()
	c, err := pgconn.Connect(ctx, dsn)
	if err != nil {
		t.Fatalf("cannot connect to the test server: %v", err)
	}
	defer c.Close(ctx)
	for _, s := range stmts {
		if _, err := c.Exec(ctx, s).ReadAll(); err != nil {
			t.Fatalf("%s: %v", s, err)
		}
	}
}

// pgShop makes a schema with the shop's orders and returns its name.
func pgShop(t *testing.T, dsn string) string {
	t.Helper()
	schema := fmt.Sprintf("candor_e%d_%d", os.Getpid(), time.Now().UnixNano()%1e9)
	stmts := []string{"CREATE SCHEMA " + schema, "CREATE TABLE " + schema + ".orders (store text, total numeric(8,2), quarter text, items integer)",
		"CREATE SEQUENCE " + schema + ".tickets"}
	for _, r := range shopRows {
		stmts = append(stmts, fmt.Sprintf("INSERT INTO %s.orders VALUES ('%s', %v, '%s', %d)", append([]any{schema}, r...)...))
	}
	pgExec(t, dsn, stmts...)
	t.Cleanup(func() { pgExec(t, dsn, "DROP SCHEMA "+schema+" CASCADE") })
	return schema
}

func TestPostgresReport(t *testing.T) {
	dsn := testPG(t)
	schema := pgShop(t, dsn)
	getenv := func(k string) string {
		if k == "SHOP_URL" {
			return dsn
		}
		return ""
	}
	src := func(query string) string {
		return "  orders:\n    postgres: SHOP_URL\n    query: " + strings.ReplaceAll(query, "S.", schema+".") + "\n"
	}
	report := filepath.Join("report.md")
	t.Run("end to end", func(t *testing.T) {
		dir := t.TempDir()
		body := front(src("SELECT store, total, quarter FROM S.orders WHERE quarter = :quarter ORDER BY total::float8")) +
			"```candor sales\nsummary: total\nby: store\n```\n\nIn {{params.quarter}} the shop took {{sales.n}} orders; the mean was {{sales.mean|2}}.\n"
		rep, err := build(t, dir, body, render.Options{Getenv: getenv, Set: map[string]string{"quarter": "2026-Q2"}})
		if err != nil {
			t.Fatal(err)
		}
		if n, m := rep.Facts["sales.n"].Value, rep.Facts["sales.mean"].Value; n != 2 || m != 11 {
			t.Errorf("n = %v, mean = %v; want 2 and 11", n, m)
		}
		if !strings.Contains(string(rep.HTML), "In 2026-Q2 the shop took 2 orders; the mean was 11.00.") {
			t.Error("the prose lacks the values")
		}
		if strings.Contains(string(rep.HTML), dsn) {
			t.Error("the connection string appears in the report")
		}
	})
	cases := []struct {
		name      string
		query     string
		env       func(string) string
		set       map[string]string
		line, col int
		phrases   []string
	}{
		{"variable unset", "SELECT store FROM S.orders", func(string) string { return "" }, nil, 5, 15,
			[]string{"environment variable SHOP_URL is not set"}},
		{"unknown table", "SELECT store FROM S.orderz WHERE quarter = :quarter", getenv, nil, 6, 30,
			[]string{"does not exist", `did you mean "orders"?`}},
		{"unknown column", "SELECT stor FROM S.orders", getenv, nil, 6, 19,
			[]string{`column "stor" does not exist`, `did you mean "store"?`}},
		{"write refused", "SELECT nextval('S.tickets') AS store", getenv, nil, 6, 12,
			[]string{"cannot execute nextval() in a read-only transaction"}},
		{"cast survives, value bound", "SELECT store, total::float8 AS total FROM S.orders WHERE quarter = :quarter::text", getenv,
			map[string]string{"quarter": "x'; DROP TABLE orders; --"}, 11, 1, []string{"has no rows"}},
		{"server down", "SELECT store FROM S.orders", func(string) string { return "postgres://candor@127.0.0.1:1/none?sslmode=disable&connect_timeout=5" }, nil, 5, 15,
			[]string{"cannot connect to the PostgreSQL server named by $SHOP_URL"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			dir := t.TempDir()
			_, err := build(t, dir, front(src(c.query))+"```candor a\nfrequency: store\n```\n", render.Options{Getenv: c.env, Set: c.set})
			wantError(t, err, filepath.Join(dir, report), c.line, c.col, c.phrases...)
		})
	}
	// The injection attempt left the table as it was.
	ctx := context.Background()
	conn, err := pgconn.Connect(ctx, dsn)
	if err != nil {
		t.Fatal(err)
	}
	defer conn.Close(ctx)
	res, err := conn.Exec(ctx, "SELECT COUNT(*) FROM "+schema+".orders").ReadAll()
	if err != nil || string(res[0].Rows[0][0]) != fmt.Sprint(len(shopRows)) {
		t.Fatalf("the orders table changed: %v %v", res, err)
	}
}

func TestPostgresTimeout(t *testing.T) {
	dsn := testPG(t)
	old := blocks.StatementTimeout
	blocks.StatementTimeout = 300 * time.Millisecond
	defer func() { blocks.StatementTimeout = old }()
	dir := t.TempDir()
	body := front("  orders:\n    postgres: SHOP_URL\n    query: SELECT 'x' AS store FROM pg_sleep(5)\n") + "```candor a\nfrequency: store\n```\n"
	start := time.Now()
	_, err := build(t, dir, body, render.Options{Getenv: func(string) string { return dsn }})
	wantError(t, err, filepath.Join(dir, "report.md"), 6, 12, "statement timeout")
	if d := time.Since(start); d > 4*time.Second {
		t.Errorf("the timeout took %s", d)
	}
}
