package blocks

import (
	"context"
	"database/sql"
	"fmt"
	"math/rand"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/jackc/pgx/v5/pgconn"
	"github.com/xuri/excelize/v2"
)

// The test data: rides of an invented bike-share scheme on the river
// Wendle, made by a fixed seed. The same rows are written as CSV, as an
// Excel workbook, as a SQLite table and as a PostgreSQL table, so every
// source kind can be checked against the others.

type ride struct {
	id       int
	station  string // "" when missing, "NA" written for some
	member   string // yes/no, "" when missing
	minutes  string // one decimal, "" when missing
	fare     string // two decimals
	rating   string // 1..5, "" when missing
	started  string // ISO date
	quarter  string
	distance string // km, three decimals
}

var rideStations = []string{"Harbour", "Mill Lane", "Orchard", "Quay"}

func makeRides(n int, seed int64) []ride {
	r := rand.New(rand.NewSource(seed))
	out := make([]ride, n)
	day0 := time.Date(2026, 4, 1, 0, 0, 0, 0, time.UTC)
	for i := range out {
		st := rideStations[r.Intn(len(rideStations))]
		if r.Intn(40) == 0 {
			st = ""
		}
		mem := "no"
		if r.Float64() < 0.55 {
			mem = "yes"
		}
		if r.Intn(50) == 0 {
			mem = ""
		}
		base := 14.0
		if st == "Quay" {
			base = 19
		}
		if mem == "yes" {
			base -= 2.5
		}
		mins := base + r.NormFloat64()*5
		if mins < 1 {
			mins = 1 + r.Float64()
		}
		minutes := strconv.FormatFloat(mins, 'f', 1, 64)
		if r.Intn(30) == 0 {
			minutes = ""
		}
		fare := 1.0 + float64(int(mins*100*0.12))/100
		if mem == "yes" {
			fare = 0.5 + float64(int(mins*100*0.05))/100
		}
		rating := strconv.Itoa(1 + r.Intn(5))
		switch r.Intn(40) {
		case 0, 1, 2:
			rating = ""
		case 3:
			rating = "-9" // the survey's code for "no answer"
		}
		d := day0.AddDate(0, 0, r.Intn(183))
		q := "2026-Q2"
		if d.Month() >= 7 {
			q = "2026-Q3"
		}
		dist := mins*0.21 + r.Float64()*0.8
		out[i] = ride{id: i + 1, station: st, member: mem, minutes: minutes, fare: strconv.FormatFloat(fare, 'f', 2, 64),
			rating: rating, started: d.Format("2006-01-02"), quarter: q, distance: strconv.FormatFloat(dist, 'f', 3, 64)}
	}
	return out
}

var rideHeader = []string{"ride_id", "station", "member", "minutes", "fare", "rating", "started", "quarter", "distance"}

func (r ride) fields() []string {
	st := r.station
	if st == "" && r.id%2 == 0 {
		st = "NA"
	}
	return []string{strconv.Itoa(r.id), st, r.member, r.minutes, r.fare, r.rating, r.started, r.quarter, r.distance}
}

func writeRidesCSV(t testing.TB, path string, rides []ride) {
	t.Helper()
	var b strings.Builder
	b.WriteString(strings.Join(rideHeader, ",") + "\n")
	for _, r := range rides {
		b.WriteString(strings.Join(r.fields(), ",") + "\n")
	}
	if err := os.WriteFile(path, []byte(b.String()), 0o644); err != nil {
		t.Fatal(err)
	}
}

func writeRidesXLSX(t testing.TB, path, sheet string, rides []ride) {
	t.Helper()
	f := excelize.NewFile()
	defer f.Close()
	if err := f.SetSheetName("Sheet1", "Notes"); err != nil {
		t.Fatal(err)
	}
	f.SetCellValue("Notes", "A1", "Invented rides of the Wendle bike-share")
	if _, err := f.NewSheet(sheet); err != nil {
		t.Fatal(err)
	}
	dateStyle, err := f.NewStyle(&excelize.Style{NumFmt: 14})
	if err != nil {
		t.Fatal(err)
	}
	for j, h := range rideHeader {
		cell, _ := excelize.CoordinatesToCellName(j+1, 1)
		f.SetCellValue(sheet, cell, h)
	}
	for i, r := range rides {
		row := i + 2
		set := func(col int, v any) {
			cell, _ := excelize.CoordinatesToCellName(col, row)
			if err := f.SetCellValue(sheet, cell, v); err != nil {
				t.Fatal(err)
			}
		}
		num := func(col int, s string) {
			if s == "" {
				return
			}
			v, err := strconv.ParseFloat(s, 64)
			if err != nil {
				t.Fatal(err)
			}
			set(col, v)
		}
		fs := r.fields()
		set(1, r.id)
		if fs[1] != "" {
			set(2, fs[1])
		}
		if r.member != "" {
			set(3, r.member)
		}
		num(4, r.minutes)
		num(5, r.fare)
		num(6, r.rating)
		d, _ := time.Parse("2006-01-02", r.started)
		set(7, d)
		cell, _ := excelize.CoordinatesToCellName(7, row)
		f.SetCellStyle(sheet, cell, cell, dateStyle)
		set(8, r.quarter)
		num(9, r.distance)
	}
	if err := f.SaveAs(path); err != nil {
		t.Fatal(err)
	}
}

// sqlNull is a value for INSERT: nil for missing.
func sqlNull(s string) any {
	if s == "" {
		return nil
	}
	return s
}

func sqlNum(s string) any {
	if s == "" {
		return nil
	}
	f, _ := strconv.ParseFloat(s, 64)
	return f
}

func writeRidesSQLite(t testing.TB, path string, rides []ride) {
	t.Helper()
	db, err := sql.Open("sqlite", path)
	if err != nil {
		t.Fatal(err)
	}
	defer db.Close()
	stmts := []string{
		`CREATE TABLE rides (ride_id INTEGER PRIMARY KEY, station TEXT, member TEXT, minutes REAL, fare REAL, rating INTEGER, started DATE, quarter TEXT, distance REAL)`,
	}
	for _, s := range stmts {
		if _, err := db.Exec(s); err != nil {
			t.Fatal(err)
		}
	}
	tx, err := db.Begin()
	if err != nil {
		t.Fatal(err)
	}
	ins, err := tx.Prepare("INSERT INTO rides VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)")
	if err != nil {
		t.Fatal(err)
	}
	for _, r := range rides {
		fs := r.fields()
		var rating any
		if r.rating != "" {
			rating, _ = strconv.Atoi(r.rating)
		}
		if _, err := ins.Exec(r.id, sqlNull(fs[1]), sqlNull(r.member), sqlNum(r.minutes), sqlNum(r.fare), rating, r.started, r.quarter, sqlNum(r.distance)); err != nil {
			t.Fatal(err)
		}
	}
	if err := tx.Commit(); err != nil {
		t.Fatal(err)
	}
}

// testPG returns the connection string of the test server, or skips
// (fails in CI, where .ci/postgres.sh starts one).
func testPG(t testing.TB) string {
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

// pgExec runs statements on the test server as its owner.
func pgExec(t testing.TB, dsn string, stmts ...string) {
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

// pgSchema makes a schema of its own for a test and drops it at the end.
func pgSchema(t testing.TB, dsn string) string {
	t.Helper()
	name := fmt.Sprintf("candor_t%d_%d", os.Getpid(), time.Now().UnixNano()%1e9)
	pgExec(t, dsn, "CREATE SCHEMA "+name)
	t.Cleanup(func() { pgExec(t, dsn, "DROP SCHEMA "+name+" CASCADE") })
	return name
}

func writeRidesPG(t testing.TB, dsn, schema string, rides []ride) {
	t.Helper()
	ctx := context.Background()
	c, err := pgconn.Connect(ctx, dsn)
	if err != nil {
		t.Fatal(err)
	}
	defer c.Close(ctx)
	create := fmt.Sprintf(`CREATE TABLE %s.rides (ride_id integer PRIMARY KEY, station text, member text, minutes double precision, fare numeric(8,2), rating integer, started date, quarter text, distance numeric(9,3))`, schema)
	if _, err := c.Exec(ctx, create).ReadAll(); err != nil {
		t.Fatal(err)
	}
	ins := fmt.Sprintf("INSERT INTO %s.rides VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)", schema)
	if _, err := c.Exec(ctx, "BEGIN").ReadAll(); err != nil {
		t.Fatal(err)
	}
	for _, r := range rides {
		fs := r.fields()
		vals := [][]byte{[]byte(fs[0]), nilIfEmpty(fs[1]), nilIfEmpty(r.member), nilIfEmpty(r.minutes), nilIfEmpty(r.fare), nilIfEmpty(r.rating), []byte(r.started), []byte(r.quarter), nilIfEmpty(r.distance)}
		if err := c.ExecParams(ctx, ins, vals, nil, nil, nil).Read().Err; err != nil {
			t.Fatal(err)
		}
	}
	if _, err := c.Exec(ctx, "COMMIT").ReadAll(); err != nil {
		t.Fatal(err)
	}
}

func nilIfEmpty(s string) []byte {
	if s == "" {
		return nil
	}
	return []byte(s)
}

// writeAll writes the rides in every file format into dir.
func writeAll(t testing.TB, dir string, rides []ride) {
	t.Helper()
	writeRidesCSV(t, filepath.Join(dir, "rides.csv"), rides)
	writeRidesXLSX(t, filepath.Join(dir, "rides.xlsx"), "Rides", rides)
	writeRidesSQLite(t, filepath.Join(dir, "rides.db"), rides)
}
