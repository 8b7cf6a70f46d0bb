package blocks

import (
	"database/sql"
	"fmt"
	"os"
	"path/filepath"
	"runtime"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"
)

// The push-down against reading the rows, on a large invented table:
//
//	CANDOR_BENCH_ROWS=2000000 go test ./blocks -run '^$' -bench PushDown -benchtime 1x
//
// (add CANDOR_TEST_PG for the PostgreSQL side). Each benchmark reports the
// heap the block needed beside its time.

func benchRows() int {
	n, _ := strconv.Atoi(os.Getenv("CANDOR_BENCH_ROWS"))
	if n <= 0 {
		n = 200000
	}
	return n
}

// benchSQLite makes a table of n rides with SQLite's own generator.
func benchSQLite(b *testing.B, dir string, n int) string {
	b.Helper()
	path := filepath.Join(dir, "big.db")
	db, err := sql.Open("sqlite", path)
	if err != nil {
		b.Fatal(err)
	}
	defer db.Close()
	for _, q := range []string{
		"CREATE TABLE rides (ride_id INTEGER, station TEXT, member TEXT, minutes REAL, fare REAL)",
		fmt.Sprintf(`WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < %d)
INSERT INTO rides SELECT i, CASE i %% 4 WHEN 0 THEN 'Harbour' WHEN 1 THEN 'Mill Lane' WHEN 2 THEN 'Orchard' ELSE 'Quay' END,
CASE WHEN (i * 7) %% 10 < 6 THEN 'yes' ELSE 'no' END, ((i * 7919) %% 3000) / 100.0 + 1, ((i * 104729) %% 900) / 100.0 FROM n`, n),
	} {
		if _, err := db.Exec(q); err != nil {
			b.Fatal(err)
		}
	}
	return path
}

var benchBlocks = []struct{ id, body string }{
	{"by-station", "summary: minutes\nby: station"},
	{"members", "compare: member\nby: station\nsuccess: \"yes\""},
	{"means", "compare: fare\nby: member"},
	{"freq", "frequency: station"},
}

func benchRun(b *testing.B, d *Dataset, body string, inMemory bool) {
	b.Helper()
	s := parseBlock(b, "x", body)
	var before, after runtime.MemStats
	runtime.GC()
	runtime.ReadMemStats(&before)
	start := time.Now()
	for i := 0; i < b.N; i++ {
		t := d
		if inMemory {
			// A fresh read each time: what a block without push-down costs.
			d.sql.once = sync.Once{}
			rows, err := d.sql.rows()
			if err != nil {
				b.Fatal(err)
			}
			t = rows
		}
		if _, err := Run(s, t, nil); err != nil {
			b.Fatal(err)
		}
	}
	runtime.ReadMemStats(&after)
	b.ReportMetric(float64(after.TotalAlloc-before.TotalAlloc)/float64(b.N)/1e6, "MB-alloc/op")
	b.ReportMetric(time.Since(start).Seconds()/float64(b.N), "s/block")
}

func trace(b *testing.B) {
	if os.Getenv("CANDOR_BENCH_TRACE") == "" {
		return
	}
	sqlTrace = func(q string, d time.Duration) {
		if len(q) > 160 {
			q = q[:160] + "…"
		}
		b.Logf("%8.3fs %s", d.Seconds(), strings.ReplaceAll(q, "\n", " "))
	}
	b.Cleanup(func() { sqlTrace = nil })
}

func BenchmarkPushDownSQLite(b *testing.B) {
	trace(b)
	dir := b.TempDir()
	n := benchRows()
	benchSQLite(b, dir, n)
	d, err := Load(sqlSpec("sqlite", "big.db", "SELECT * FROM rides"), Env{Dir: dir})
	if err != nil {
		b.Fatal(err)
	}
	for _, bb := range benchBlocks {
		b.Run(bb.id+"/database", func(b *testing.B) { benchRun(b, d, bb.body, false) })
		b.Run(bb.id+"/rows", func(b *testing.B) { benchRun(b, d, bb.body, true) })
	}
}

func BenchmarkPushDownPostgres(b *testing.B) {
	trace(b)
	dsn := testPG(b)
	schema := pgSchema(b, dsn)
	n := benchRows()
	pgExec(b, dsn, fmt.Sprintf(`CREATE TABLE %s.rides AS SELECT i AS ride_id,
(ARRAY['Harbour','Mill Lane','Orchard','Quay'])[i %% 4 + 1] AS station,
CASE WHEN (i * 7) %% 10 < 6 THEN 'yes' ELSE 'no' END AS member,
((i::bigint * 7919) %% 3000) / 100.0 + 1 AS minutes, (((i::bigint * 104729) %% 900) / 100.0)::float8 AS fare
FROM generate_series(1, %d) AS i`, schema, n), "ANALYZE "+schema+".rides")
	env := Env{Getenv: func(string) string { return dsn }}
	d, err := Load(sqlSpec("postgres", "BENCH_URL", "SELECT * FROM "+schema+".rides"), env)
	if err != nil {
		b.Fatal(err)
	}
	for _, bb := range benchBlocks {
		b.Run(bb.id+"/database", func(b *testing.B) { benchRun(b, d, bb.body, false) })
		b.Run(bb.id+"/rows", func(b *testing.B) { benchRun(b, d, bb.body, true) })
	}
}
