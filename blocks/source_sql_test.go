package blocks

import (
	"database/sql"
	"path/filepath"
	"strings"
	"testing"
)

func TestBindParams(t *testing.T) {
	params := map[string]string{"quarter": "2026-Q3", "store": "North", "min_total": "10"}
	at := func(off int) Pos { return Pos{File: "r.md", Line: 7, Col: 12 + off} }
	cases := []struct {
		dialect, in, out string
		names            []string
	}{
		{"sqlite", "SELECT * FROM t WHERE q = :quarter AND s = :store OR q2 = :quarter",
			"SELECT * FROM t WHERE q = ?1 AND s = ?2 OR q2 = ?1", []string{"quarter", "store"}},
		{"postgres", "SELECT total::numeric, ':quarter' AS lit, \"a:store\" FROM t WHERE q = :quarter -- :store\n AND x > :min_total /* :store */",
			"SELECT total::numeric, ':quarter' AS lit, \"a:store\" FROM t WHERE q = $1 -- :store\n AND x > $2 /* :store */", []string{"quarter", "min_total"}},
		{"postgres", "SELECT $$ :store $$, $tag$ :store $tag$, E'it\\'s :store', :store::text",
			"SELECT $$ :store $$, $tag$ :store $tag$, E'it\\'s :store', $1::text", []string{"store"}},
		{"postgres", "SELECT arr[1:2], 'it''s :store' FROM t WHERE s = :store", "SELECT arr[1:2], 'it''s :store' FROM t WHERE s = $1", []string{"store"}},
		{"sqlite", "SELECT [a:store], `b:store` FROM t /* /* :store */ WHERE s=:store", "SELECT [a:store], `b:store` FROM t /* /* :store */ WHERE s=?1", []string{"store"}},
	}
	for _, c := range cases {
		got, names, err := bindParams(c.in, dialect{c.dialect}, params, at, "data x")
		if err != nil {
			t.Fatalf("%s: %v", c.in, err)
		}
		if got != c.out || strings.Join(names, ",") != strings.Join(c.names, ",") {
			t.Errorf("%s %q\n got %q %v\nwant %q %v", c.dialect, c.in, got, names, c.out, c.names)
		}
	}
	_, _, err := bindParams("SELECT * FROM t WHERE q = :quater", dialect{"sqlite"}, params, at, "data x")
	e, ok := err.(*Error)
	if !ok || e.Pos.Col != 12+26 || !strings.Contains(e.Msg, `did you mean "quarter"?`) {
		t.Errorf("unknown parameter: %v", err)
	}
}

func makeShopDB(t *testing.T, path string) {
	t.Helper()
	db, err := sql.Open("sqlite", path)
	if err != nil {
		t.Fatal(err)
	}
	defer db.Close()
	for _, q := range []string{
		"CREATE TABLE orders (store TEXT, total NUMERIC, quarter TEXT, items INTEGER, note)",
		"INSERT INTO orders VALUES ('North', 30.5, '2026-Q3', 2, 1), ('South', 22.25, '2026-Q3', 1, 'late'), ('North', 10, '2026-Q2', 3, 2.5), (' East ', 'n/a', '2026-Q3', NULL, NULL)",
	} {
		if _, err := db.Exec(q); err != nil {
			t.Fatal(err)
		}
	}
}

func TestSQLiteTypes(t *testing.T) {
	dir := t.TempDir()
	makeShopDB(t, filepath.Join(dir, "shop.db"))
	s := sqlSpec("sqlite", "shop.db", "SELECT store, total, quarter, items, note, items * 2 AS twice FROM orders WHERE quarter = :quarter;")
	d, err := Load(s, Env{Dir: dir, Params: map[string]string{"quarter": "2026-Q3"}})
	if err != nil {
		t.Fatal(err)
	}
	if d.Rows() != 3 || d.HashOf != "query" || len(d.Cols) != 0 {
		t.Fatalf("lazy data set: rows %d, hash of %q, %d columns read", d.Rows(), d.HashOf, len(d.Cols))
	}
	if got := strings.Join(d.Names(), ","); got != "store,total,quarter,items,note,twice" {
		t.Errorf("names %s", got)
	}
	before := d.SHA256
	full, err := d.sql.rows()
	if err != nil {
		t.Fatal(err)
	}
	if d.SHA256 != before || d.HashOf != "query" || full.HashOf != "rows" || full.SHA256 == before || len(full.SHA256) != 64 {
		t.Error("the listed data set keeps the query's hash; the rows read have their own")
	}
	// The query's hash changes with the bound parameter.
	d2, err := Load(s, Env{Dir: dir, Params: map[string]string{"quarter": "2026-Q2"}})
	if err != nil {
		t.Fatal(err)
	}
	if d2.SHA256 == d.SHA256 || d2.Rows() != 1 {
		t.Errorf("another quarter: hash %s, rows %d", d2.SHA256, d2.Rows())
	}
	want := map[string]ColType{"store": TypeCategory, "total": TypeNumber, "quarter": TypeCategory, "items": TypeNumber, "note": TypeCategory, "twice": TypeNumber}
	for n, ty := range want {
		if full.Col(n).Type != ty {
			t.Errorf("%s is %s, want %s", n, full.Col(n).Type, ty)
		}
	}
	if got := full.Col("store").Str; strings.Join(got, "|") != "North|South|East" {
		t.Errorf("store %q (trimmed)", got)
	}
	total := full.Col("total")
	if total.Num.At(0) != 30.5 || total.Num.At(1) != 22.25 || !total.Missing(2) {
		t.Errorf("total %v ('n/a' is missing)", total.Num.Floats())
	}
	if tw := full.Col("twice"); tw.Num.At(0) != 4 || !tw.Missing(2) {
		t.Errorf("twice %v", tw.Num.Floats())
	}
}

// TestReadOnly: the connections candor opens refuse to write, whatever
// statement reaches them.
func TestReadOnly(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "shop.db")
	makeShopDB(t, path)
	c, err := openSQLite(path)
	if err != nil {
		t.Fatal(err)
	}
	defer c.close()
	for _, q := range []string{"DELETE FROM orders", "DROP TABLE orders", "CREATE TABLE x (a)", "INSERT INTO orders VALUES ('West', 1, 'q', 1, 1)"} {
		err := c.query(q, nil, func([]sqlValue) error { return nil })
		if err == nil || !strings.Contains(err.Error(), "readonly") {
			t.Errorf("%s: %v, want a read-only error", q, err)
		}
	}
	var n string
	c.query("SELECT COUNT(*) FROM orders", nil, func(v []sqlValue) error { n = v[0].text; return nil })
	if n != "4" {
		t.Errorf("orders has %s rows after the attempts, want 4", n)
	}
	if _, err := openSQLite(filepath.Join(dir, "absent.db")); err == nil {
		t.Error("opening a missing database must fail, not create it")
	}
}

func TestFirstWord(t *testing.T) {
	for q, w := range map[string]string{
		"select 1": "SELECT", "  -- note\n WITH a AS (SELECT 1) SELECT * FROM a": "WITH",
		"/* x */ (SELECT 1)": "SELECT", "DELETE FROM t": "DELETE", "pragma table_info(t)": "PRAGMA",
	} {
		if got := firstWord(q); got != w {
			t.Errorf("firstWord(%q) = %q, want %q", q, got, w)
		}
	}
}
