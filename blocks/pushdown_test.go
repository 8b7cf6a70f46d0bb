package blocks

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"sort"
	"strconv"
	"strings"
	"testing"
)

// roundTripBlocks are the analyses run on the same rides from every source
// kind: every analysis, the push-down cases (frequency of categories, of
// whole numbers and binned numbers with each rule; crosstab; summary alone,
// of two columns and by group with box plots; compare of means for two and
// four groups, and of proportions for two and four groups), where:
// conditions of each operator with a parameter, and blocks that read the
// rows (correlation, regression, trend, stemleaf, and a date column).
var roundTripBlocks = []struct{ id, body string }{
	{"stations", "frequency: station"},
	{"members", "frequency: member\norder: [yes, no]"},
	{"ratings", "frequency: rating"},
	{"minutes-sturges", "frequency: minutes"},
	{"minutes-count", "frequency: minutes\nbins: 7"},
	{"minutes-scott", "frequency: minutes\nbins: scott"},
	{"minutes-fd", "frequency: fare\nbins: fd"},
	{"minutes-edges", "frequency: minutes\nbins: [0, 10, 20, 30, 40, 50]\nwhere: minutes >= 2.5"},
	{"quarters", "frequency: quarter\nwhere: station != Quay"},
	{"days", "frequency: started\nwhere: started >= 2026-09-01"},
	{"cross", "crosstab: [station, member]"},
	{"cross-rating", "crosstab: [rating, member]\nwhere: \"quarter = :quarter\""},
	{"sum-minutes", "summary: minutes"},
	{"sum-two", "summary: [minutes, fare]"},
	{"sum-by", "summary: fare\nby: station"},
	{"sum-by-two", "summary: [minutes, distance]\nby: member\norder: [yes, no]"},
	{"sum-dot", "summary: minutes\nby: station\nchart: dot\nwhere: station in [Harbour, Orchard, Quay]"},
	{"cmp-two", "compare: minutes\nby: member\nreference: \"no\""},
	{"cmp-four", "compare: fare\nby: station"},
	{"cmp-box", "compare: distance\nby: quarter\nchart: box"},
	{"cmp-binary", "compare: member\nby: quarter\nsuccess: \"yes\""},
	{"cmp-binary-four", "compare: member\nby: station\nsuccess: \"yes\"\nwhere: minutes < 30"},
	{"cmp-rating", "compare: rating\nby: member\nsuccess: 5"},
	{"pie", "frequency: member\nchart: pie"},
	{"cross-grouped", "crosstab: [quarter, member]\nchart: grouped\npercent: true"},
	{"cmp-bar", "compare: minutes\nby: station\nchart: bar"},
	{"cmp-stacked", "compare: member\nby: quarter\nsuccess: \"yes\"\nchart: stacked"},
	{"sum-box", "summary: minutes\nchart: box\ntable: false"},
	{"corr", "correlation: [minutes, distance]"},
	{"reg", "regression: fare\npredictors: [minutes]"},
	{"trend", "trend: minutes\ntime: quarter\nby: member"},
	{"stem", "stemleaf: rating"},
}

// pushable are the blocks that must run in the database for each kind.
var pushable = map[string]bool{
	"stations": true, "members": true, "ratings": true, "minutes-sturges": true, "minutes-count": true,
	"minutes-scott": true, "minutes-fd": true, "minutes-edges": true, "quarters": true, "cross": true,
	"cross-rating": true, "sum-minutes": true, "sum-two": true, "sum-by": true, "sum-by-two": true,
	"sum-dot": true, "cmp-two": true, "cmp-four": true, "cmp-box": true, "cmp-binary": true,
	"cmp-binary-four": true, "cmp-rating": true, "pie": true, "cross-grouped": true, "cmp-bar": true,
	"cmp-stacked": true, "sum-box": true,
}

// badBlocks fail, and must fail alike whether they run in the database
// or in memory.
var badBlocks = []struct{ id, body string }{
	{"bins-on-text", "frequency: station\nbins: 5"},
	{"edges-short", "frequency: minutes\nbins: [20, 30]"},
	{"order-binned", "frequency: minutes\norder: [1, 2]"},
	{"bad-reference", "compare: minutes\nby: member\nreference: maybe"},
	{"text-summary", "summary: station"},
	{"text-outcome", "compare: station\nby: member"},
	{"no-success", "compare: member\nby: station\nsuccess: perhaps"},
	{"one-group", "compare: minutes\nby: quarter\nwhere: \"quarter = :quarter\""},
	{"no-rows", "summary: minutes\nwhere: station = Nowhere"},
	{"bad-param", "frequency: station\nwhere: quarter = :season"},
	{"bad-number", "frequency: station\nwhere: minutes > lots"},
	{"unknown-where", "frequency: station\nwhere: stations = Quay"},
	{"unknown-by", "summary: minutes\nby: stationz"},
	{"chart", "crosstab: [station, member]\nchart: pie"},
	{"order-level", "frequency: station\norder: [Harbor]"},
	{"same-by", "compare: minutes\nby: minutes"},
}

// TestErrorsAlike: a bad block gets the same message at the same place
// from a CSV file and from both databases.
func TestErrorsAlike(t *testing.T) {
	dir := t.TempDir()
	rides := makeRides(300, 3)
	writeAll(t, dir, rides)
	env := Env{Dir: dir, Params: rideParams}
	csv, err := Load(&SourceSpec{Name: "rides", File: "rides.csv", Kind: "csv", Delimiter: ',', Missing: DefaultMissing, Types: map[string]ColType{}}, env)
	if err != nil {
		t.Fatal(err)
	}
	sources := map[string]*Dataset{}
	if d, err := Load(sqlSpec("sqlite", "rides.db", "SELECT * FROM rides"), env); err == nil {
		sources["sqlite"] = d
	} else {
		t.Fatal(err)
	}
	if dsn := os.Getenv("CANDOR_TEST_PG"); dsn != "" || os.Getenv("CI") == "true" {
		dsn = testPG(t)
		schema := pgSchema(t, dsn)
		writeRidesPG(t, dsn, schema, rides)
		env := env
		env.Getenv = func(string) string { return dsn }
		d, err := Load(sqlSpec("postgres", "RIDES_URL", "SELECT * FROM "+schema+".rides"), env)
		if err != nil {
			t.Fatal(err)
		}
		sources["postgres"] = d
	}
	for _, b := range badBlocks {
		_, want := Run(parseBlock(t, b.id, b.body), csv, rideParams)
		if want == nil {
			t.Fatalf("%s: no error from the CSV file", b.id)
		}
		if b.id == "edges-short" {
			// The extremes as the data write them, not as the offset and
			// difference the in-memory path holds them in (1.4000000000000004).
			lo, hi := minutesRange(rides)
			if w := "but minutes runs from " + lo + " to " + hi + ";"; !strings.Contains(want.Error(), w) {
				t.Errorf("%s: %q lacks %q", b.id, want.Error(), w)
			}
		}
		for kind, d := range sources {
			_, got := Run(parseBlock(t, b.id, b.body), d, rideParams)
			w := strings.ReplaceAll(want.Error(), "rides.csv", d.File)
			if got == nil || got.Error() != w {
				t.Errorf("%s on %s:\n got %v\nwant %s", b.id, kind, got, w)
			}
		}
	}
}

// minutesRange is the least and the greatest minutes of rides as %g
// writes them.
func minutesRange(rides []ride) (lo, hi string) {
	min, max := math.Inf(1), math.Inf(-1)
	for _, r := range rides {
		if x, err := strconv.ParseFloat(r.minutes, 64); err == nil {
			min, max = math.Min(min, x), math.Max(max, x)
		}
	}
	return strconv.FormatFloat(min, 'g', -1, 64), strconv.FormatFloat(max, 'g', -1, 64)
}

func parseBlock(t testing.TB, id, body string) *Spec {
	t.Helper()
	pf := PosFunc(func(line, col int) Pos { return Pos{File: "report.md", Line: line + 10, Col: col} })
	s, err := ParseSpec(id, Pos{File: "report.md", Line: 10, Col: 1}, []byte(body), pf)
	if err != nil {
		t.Fatalf("block %s: %v", id, err)
	}
	return s
}

func closeEnough(a, b float64) bool {
	if a == b || math.IsNaN(a) && math.IsNaN(b) {
		return true
	}
	return math.Abs(a-b) <= 1e-9*math.Max(math.Abs(a), math.Abs(b))+1e-12
}

// sameFacts reports every fact that differs between two results: a name
// that only one has, another kind, another reason for being undefined, or
// values further apart than 1e-9 relative.
func sameFacts(t *testing.T, what string, want, got Facts) {
	t.Helper()
	for _, n := range want.Names() {
		w := want[n]
		g, ok := got[n]
		if !ok {
			t.Errorf("%s: fact %s missing (want %v)", what, n, w.Value)
			continue
		}
		if w.Kind != g.Kind || w.Undefined != g.Undefined || !closeEnough(w.Value, g.Value) {
			t.Errorf("%s: fact %s = %v (%s, %q), want %v (%s, %q)", what, n, g.Value, g.Kind, g.Undefined, w.Value, w.Kind, w.Undefined)
		}
	}
	for _, n := range got.Names() {
		if _, ok := want[n]; !ok {
			t.Errorf("%s: extra fact %s = %v", what, n, got[n].Value)
		}
	}
}

// approxEqual compares two values deeply, floats to 1e-9 relative.
func approxEqual(a, b reflect.Value) bool {
	if a.Kind() != b.Kind() {
		return false
	}
	switch a.Kind() {
	case reflect.Float64, reflect.Float32:
		return closeEnough(a.Float(), b.Float())
	case reflect.Ptr, reflect.Interface:
		if a.IsNil() || b.IsNil() {
			return a.IsNil() == b.IsNil()
		}
		return approxEqual(a.Elem(), b.Elem())
	case reflect.Slice:
		if a.Len() != b.Len() {
			return false
		}
		for i := 0; i < a.Len(); i++ {
			if !approxEqual(a.Index(i), b.Index(i)) {
				return false
			}
		}
		return true
	case reflect.Struct:
		for i := 0; i < a.NumField(); i++ {
			if !approxEqual(a.Field(i), b.Field(i)) {
				return false
			}
		}
		return true
	case reflect.Map:
		if a.Len() != b.Len() {
			return false
		}
		for _, k := range a.MapKeys() {
			if !approxEqual(a.MapIndex(k), b.MapIndex(k)) {
				return false
			}
		}
		return true
	}
	return reflect.DeepEqual(a.Interface(), b.Interface())
}

// sameResult compares two results whole: facts (1e-9 relative), and the
// tables, figure, notes, methods and checker metadata.
func sameResult(t *testing.T, what string, want, got *Result) {
	t.Helper()
	sameFacts(t, what, want.Facts, got.Facts)
	if !reflect.DeepEqual(want.Tables, got.Tables) {
		t.Errorf("%s: tables differ:\n got %v\nwant %v", what, got.Tables, want.Tables)
	}
	if !approxEqual(reflect.ValueOf(want.Figure), reflect.ValueOf(got.Figure)) {
		t.Errorf("%s: figures differ:\n got %+v\nwant %+v", what, got.Figure, want.Figure)
	}
	if !reflect.DeepEqual(want.Notes, got.Notes) || !reflect.DeepEqual(want.Methods, got.Methods) || !reflect.DeepEqual(want.Filters, got.Filters) {
		t.Errorf("%s: notes, methods or filters differ:\n got %q %q %q\nwant %q %q %q", what, got.Notes, got.Methods, got.Filters, want.Notes, want.Methods, want.Filters)
	}
	if !reflect.DeepEqual(want.Meta, got.Meta) {
		t.Errorf("%s: meta differs:\n got %+v\nwant %+v", what, got.Meta, want.Meta)
	}
}

func runAll(t *testing.T, d *Dataset, params map[string]string) map[string]*Result {
	t.Helper()
	out := map[string]*Result{}
	for _, b := range roundTripBlocks {
		s := parseBlock(t, b.id, b.body)
		res, err := Run(s, d, params)
		if err != nil {
			t.Fatalf("%s on %s: %v", b.id, d.File, err)
		}
		out[b.id] = res
	}
	return out
}

var rideParams = map[string]string{"quarter": "2026-Q3"}

// pushed runs every block on a SQL data set and reports which ran in the
// database (by the push-down counter).
func pushed(t *testing.T, d *Dataset) (map[string]*Result, map[string]bool) {
	t.Helper()
	out := map[string]*Result{}
	done := map[string]bool{}
	for _, b := range roundTripBlocks {
		s := parseBlock(t, b.id, b.body)
		pdCounter.Lock()
		before := pdCounter.n
		pdCounter.Unlock()
		res, err := Run(s, d, rideParams)
		if err != nil {
			t.Fatalf("%s on %s: %v", b.id, d.File, err)
		}
		pdCounter.Lock()
		done[b.id] = pdCounter.n > before
		pdCounter.Unlock()
		out[b.id] = res
	}
	return out, done
}

func sqlSpec(kind, target, query string) *SourceSpec {
	s := &SourceSpec{Name: "rides", Kind: kind, Query: query, Missing: DefaultMissing, Types: map[string]ColType{}, TypesPos: map[string]Pos{},
		QueryPos: Pos{File: "report.md", Line: 5, Col: 12}, FilePos: Pos{File: "report.md", Line: 4, Col: 13}}
	if kind == "sqlite" {
		s.File = target
	} else {
		s.EnvVar = target
	}
	return s
}

// TestRoundTrip: the same rides as CSV, .xlsx, SQLite and PostgreSQL give
// the same Result for every block (facts to 1e-9 relative, tables, figures
// and notes exactly); on the SQL sources both the push-down and the
// in-memory path over the query's rows give it.
func TestRoundTrip(t *testing.T) { roundTrip(t) }

// TestRoundTripManyValues: the same, with the database computing the sums
// and order statistics itself, as it does for samples with more distinct
// values than pdMaxDistinct.
func TestRoundTripManyValues(t *testing.T) {
	old := pdMaxDistinct
	pdMaxDistinct = 3
	defer func() { pdMaxDistinct = old }()
	roundTrip(t)
}

func roundTrip(t *testing.T) {
	dir := t.TempDir()
	rides := makeRides(700, 7)
	writeAll(t, dir, rides)
	env := Env{Dir: dir, Params: rideParams}
	csv, err := Load(&SourceSpec{Name: "rides", File: "rides.csv", Kind: "csv", Delimiter: ',', Missing: DefaultMissing, Types: map[string]ColType{}}, env)
	if err != nil {
		t.Fatal(err)
	}
	want := runAll(t, csv, rideParams)

	xlsx, err := Load(&SourceSpec{Name: "rides", File: "rides.xlsx", Kind: "xlsx", Sheet: "Rides", Missing: DefaultMissing, Types: map[string]ColType{}}, env)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range xlsx.Cols {
		if cc := csv.Col(c.Name); cc.Type != c.Type {
			t.Errorf("xlsx column %s is %s, the CSV's is %s", c.Name, c.Type, cc.Type)
		}
	}
	got := runAll(t, xlsx, rideParams)
	for _, b := range roundTripBlocks {
		sameResult(t, "xlsx "+b.id, want[b.id], got[b.id])
	}

	check := func(t *testing.T, d *Dataset) {
		if d.Rows() != len(rides) {
			t.Errorf("rows = %d, want %d", d.Rows(), len(rides))
		}
		rows, err := d.sql.rows()
		if err != nil {
			t.Fatal(err)
		}
		mem := runAll(t, rows, rideParams)
		got, done := pushed(t, d)
		for _, b := range roundTripBlocks {
			sameResult(t, "in memory "+b.id, want[b.id], mem[b.id])
			sameResult(t, "push-down "+b.id, want[b.id], got[b.id])
		}
		var missed []string
		for id := range pushable {
			if !done[id] {
				missed = append(missed, id)
			}
		}
		sort.Strings(missed)
		if len(missed) > 0 {
			t.Errorf("these blocks read the rows instead of running in the database: %s", strings.Join(missed, ", "))
		}
	}
	t.Run("sqlite", func(t *testing.T) {
		d, err := Load(sqlSpec("sqlite", "rides.db", "SELECT * FROM rides ORDER BY ride_id"), env)
		if err != nil {
			t.Fatal(err)
		}
		check(t, d)
	})
	t.Run("postgres", func(t *testing.T) {
		dsn := testPG(t)
		schema := pgSchema(t, dsn)
		writeRidesPG(t, dsn, schema, rides)
		env := env
		env.Getenv = func(k string) string {
			if k == "RIDES_URL" {
				return dsn
			}
			return ""
		}
		d, err := Load(sqlSpec("postgres", "RIDES_URL", fmt.Sprintf("SELECT * FROM %s.rides ORDER BY ride_id", schema)), env)
		if err != nil {
			t.Fatal(err)
		}
		check(t, d)
	})
}

// hintBlocks run on sources with hints and missing tokens: rating as a
// category with "-9" missing, and ride_id as text.
var hintBlocks = []struct{ id, body string }{
	{"ratings", "frequency: rating"},
	{"cross", "crosstab: [rating, member]"},
	{"by-rating", "summary: minutes\nby: rating"},
	{"cmp", "compare: fare\nby: rating\nwhere: rating != 1"},
	{"ids", "frequency: ride_id\nwhere: minutes > 28"},
}

// TestRoundTripHints: columns: hints and missing: tokens mean the same for
// every source kind, in the database and in memory.
func TestRoundTripHints(t *testing.T) {
	dir := t.TempDir()
	rides := makeRides(500, 11)
	writeAll(t, dir, rides)
	env := Env{Dir: dir, Params: rideParams}
	hint := func(s *SourceSpec) *SourceSpec {
		s.Types = map[string]ColType{"rating": TypeCategory, "ride_id": TypeText}
		s.TypesPos = map[string]Pos{"rating": {}, "ride_id": {}}
		s.Missing = []string{"NA", "-9", ""}
		return s
	}
	runHints := func(d *Dataset) map[string]*Result {
		out := map[string]*Result{}
		for _, b := range hintBlocks {
			res, err := Run(parseBlock(t, b.id, b.body), d, rideParams)
			if err != nil {
				t.Fatalf("%s on %s: %v", b.id, d.File, err)
			}
			out[b.id] = res
		}
		return out
	}
	csv, err := Load(hint(&SourceSpec{Name: "rides", File: "rides.csv", Kind: "csv", Delimiter: ','}), env)
	if err != nil {
		t.Fatal(err)
	}
	if c := csv.Col("rating"); c.Type != TypeCategory || strings.Contains(strings.Join(c.Levels(), ","), "-9") {
		t.Fatalf("the CSV's rating: %s %v", c.Type, c.Levels())
	}
	want := runHints(csv)
	compare := func(t *testing.T, d *Dataset) {
		for name, res := range runHints(d) {
			sameResult(t, name, want[name], res)
		}
		if d.sql != nil {
			rows, err := d.sql.rows()
			if err != nil {
				t.Fatal(err)
			}
			for name, res := range runHints(rows) {
				sameResult(t, "in memory "+name, want[name], res)
			}
		}
	}
	t.Run("xlsx", func(t *testing.T) {
		d, err := Load(hint(&SourceSpec{Name: "rides", File: "rides.xlsx", Kind: "xlsx", Sheet: "Rides"}), env)
		if err != nil {
			t.Fatal(err)
		}
		compare(t, d)
	})
	t.Run("sqlite", func(t *testing.T) {
		d, err := Load(hint(sqlSpec("sqlite", "rides.db", "SELECT * FROM rides")), env)
		if err != nil {
			t.Fatal(err)
		}
		compare(t, d)
	})
	t.Run("postgres", func(t *testing.T) {
		dsn := testPG(t)
		schema := pgSchema(t, dsn)
		writeRidesPG(t, dsn, schema, rides)
		env := env
		env.Getenv = func(string) string { return dsn }
		d, err := Load(hint(sqlSpec("postgres", "RIDES_URL", "SELECT * FROM "+schema+".rides")), env)
		if err != nil {
			t.Fatal(err)
		}
		pdCounter.Lock()
		before := pdCounter.n
		pdCounter.Unlock()
		compare(t, d)
		pdCounter.Lock()
		ran := pdCounter.n - before
		pdCounter.Unlock()
		if ran < len(hintBlocks) {
			t.Errorf("only %d of %d blocks ran in PostgreSQL", ran, len(hintBlocks))
		}
	})
}

var _ = filepath.Join
