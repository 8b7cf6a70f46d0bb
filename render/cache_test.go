package render

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"candor/blocks"
	"candor/examples/scale/members"
	"candor/figures"
)

// useCache makes every build of the test use c (nil: no cache).
func useCache(t *testing.T, c *Cache) {
	t.Helper()
	activeCache()
	old := DefaultCache
	DefaultCache = c
	t.Cleanup(func() { DefaultCache = old })
}

// scaleReport writes the scale benchmark report over a small sample of
// its invented data into a fresh folder; it has every analysis, a filter
// and every default chart kind but one.
func scaleReport(t *testing.T, rows int) string {
	t.Helper()
	dir := t.TempDir()
	md, err := os.ReadFile("../examples/scale/scale.md")
	if err != nil {
		t.Fatal(err)
	}
	if err := os.MkdirAll(filepath.Join(dir, "data"), 0o755); err != nil {
		t.Fatal(err)
	}
	f, err := os.Create(filepath.Join(dir, "data", "members.csv"))
	if err != nil {
		t.Fatal(err)
	}
	if err := members.Generate(f, rows, members.Seed); err != nil {
		t.Fatal(err)
	}
	f.Close()
	path := filepath.Join(dir, "scale.md")
	if err := os.WriteFile(path, md, 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// sameBuild reports how two builds differ, "" when they do not.
func sameBuild(a, b *Report) string {
	if !bytes.Equal(a.HTML, b.HTML) {
		return "HTML differs"
	}
	if len(a.Facts) != len(b.Facts) {
		return "number of facts differs"
	}
	for k, f := range a.Facts {
		g, ok := b.Facts[k]
		if !ok || math.Float64bits(f.Value) != math.Float64bits(g.Value) || f.Kind != g.Kind || f.Undefined != g.Undefined {
			return "fact " + k + " differs"
		}
	}
	if !reflect.DeepEqual(a.Findings, b.Findings) {
		return "findings differ"
	}
	for id, f := range a.Figures {
		g := b.Figures[id]
		if g == nil || !bytes.Equal(f.SVG, g.SVG) || len(f.Geometry.Marks) != len(g.Geometry.Marks) {
			return "figure " + id + " differs"
		}
	}
	return ""
}

func build(t *testing.T, path string) *Report {
	t.Helper()
	r, err := Build(path, Options{})
	if err != nil {
		t.Fatal(err)
	}
	return r
}

// TestCacheByteIdentical: a report built without the cache, from a cold
// cache, from the memory layer and from the disk layer alone is the same,
// byte for byte.
func TestCacheByteIdentical(t *testing.T) {
	paths, _ := filepath.Glob("../examples/*/report.md")
	paths = append(paths, scaleReport(t, 3000))
	for _, p := range paths {
		t.Run(filepath.Base(filepath.Dir(p)), func(t *testing.T) {
			useCache(t, nil)
			plain := build(t, p)
			dir := t.TempDir()
			c := NewCache(dir)
			useCache(t, c)
			cold := build(t, p)
			warm := build(t, p)
			useCache(t, NewCache(dir))
			disk := build(t, p)
			st := DefaultCache.Stats()
			for name, r := range map[string]*Report{"cold": cold, "memory": warm, "disk": disk} {
				if d := sameBuild(plain, r); d != "" {
					t.Errorf("%s cache: %s", name, d)
				}
			}
			// Blocks over data whose content is not hashed (a SQL source
			// whose rows stay in the database) are never cached.
			n := 0
			for i := range plain.Results {
				if plain.blockKey(i) != "" {
					n++
				}
			}
			files := true
			for _, d := range plain.Tables {
				files = files && d.HashOf == ""
			}
			if files && n != len(plain.Results) {
				t.Fatalf("%d of %d blocks over files can be cached", n, len(plain.Results))
			}
			if got := c.Stats(); got.Misses != n || got.MemoryHits != n || got.DiskWrites != n {
				t.Errorf("first cache: %+v for %d blocks", got, n)
			}
			if st.DiskHits != n || st.Misses != 0 {
				t.Errorf("disk cache: %+v for %d blocks", st, n)
			}
		})
	}
}

// TestCacheProseEdit: after an edit to the prose alone (which moves every
// block), every block comes from the cache, and the report is the one an
// uncached build of the edited file gives.
func TestCacheProseEdit(t *testing.T) {
	path := scaleReport(t, 1500)
	c := NewCache(t.TempDir())
	useCache(t, c)
	first := build(t, path)
	md, _ := os.ReadFile(path)
	edited := strings.Replace(string(md), "## Who the members are", "A new paragraph of prose.\n\nAnd another one,\nover two lines.\n\n## Who the members are", 1)
	if err := os.WriteFile(path, []byte(edited), 0o644); err != nil {
		t.Fatal(err)
	}
	before := c.Stats()
	again := build(t, path)
	after := c.Stats()
	n := len(first.Results)
	if hits := after.MemoryHits - before.MemoryHits; hits != n || after.Misses != before.Misses {
		t.Errorf("prose edit: %d memory hits and %d misses for %d blocks", hits, after.Misses-before.Misses, n)
	}
	if again.Results[0].Pos.Line != first.Results[0].Pos.Line+5 {
		t.Errorf("a cached result keeps its old position: line %d, was %d", again.Results[0].Pos.Line, first.Results[0].Pos.Line)
	}
	useCache(t, nil)
	if d := sameBuild(build(t, path), again); d != "" {
		t.Errorf("cached rebuild after a prose edit: %s", d)
	}
}

// TestCacheMisses: a change to a block, its data, a column hint or a
// parameter is computed afresh.
func TestCacheMisses(t *testing.T) {
	path := scaleReport(t, 1000)
	c := NewCache("")
	useCache(t, c)
	n := len(build(t, path).Results)
	md, _ := os.ReadFile(path)
	edits := []struct {
		name   string
		edit   func(md string) string
		data   bool
		misses int
	}{
		{"block body", func(md string) string {
			return strings.Replace(md, "title: Member-months by plan", "title: Member-months by their plan", 1)
		}, false, 1},
		{"column hint", func(md string) string {
			return strings.Replace(md, "  members: data/members.csv", "  members:\n    file: data/members.csv\n    columns:\n      age: number", 1)
		}, false, n},
		{"parameter", func(md string) string {
			return strings.Replace(md, "check:", "params:\n  year: \"2025\"\ncheck:", 1)
		}, false, n},
		{"data", func(md string) string { return md }, true, n},
	}
	for _, e := range edits {
		if err := os.WriteFile(path, []byte(e.edit(string(md))), 0o644); err != nil {
			t.Fatal(err)
		}
		if e.data {
			csv := filepath.Join(filepath.Dir(path), "data", "members.csv")
			b, _ := os.ReadFile(csv)
			os.WriteFile(csv, append(b, []byte("2025-12,North,app,annual,40,3,9.10,yes,70.0\n")...), 0o644)
		}
		before := c.Stats().Misses
		build(t, path)
		if got := c.Stats().Misses - before; got != e.misses {
			t.Errorf("%s: %d blocks computed again, want %d", e.name, got, e.misses)
		}
	}
}

// TestCacheCodec: the disk encoding keeps NaN payloads, the sign of zero,
// nil apart from empty and pointers to zero values.
func TestCacheCodec(t *testing.T) {
	zero := 0.0
	in := diskEntry{
		Result: blocks.Result{ID: "a", Pos: blocks.Pos{File: "r.md", Line: 3, Col: 1},
			Facts:   blocks.Facts{"a.x": {Name: "a.x", Value: math.NaN(), Undefined: "no cases"}, "a.z": {Name: "a.z", Value: math.Copysign(0, -1)}},
			Tables:  []blocks.Table{{Head: []string{}, Rows: [][]blocks.Cell{{{Text: "1", Num: true}}}}},
			Figure:  &figures.Spec{Kind: figures.Bar, AxisMin: &zero, Series: []figures.Series{{Values: []float64{1, math.Inf(1)}, Low: nil, High: []float64{}}}},
			Filters: []string{}},
		Drawn:  true,
		Figure: &figures.Figure{SVG: []byte("<svg/>"), Geometry: figures.Geometry{LieFactor: math.Inf(1), Marks: []figures.Mark{{Value: -1}}}},
	}
	b, err := encodeValue(nil, reflect.ValueOf(in))
	if err != nil {
		t.Fatal(err)
	}
	var out diskEntry
	if err := decodeValue(b, reflect.ValueOf(&out).Elem()); err != nil {
		t.Fatal(err)
	}
	if v := out.Result.Facts["a.x"].Value; !math.IsNaN(v) || out.Result.Facts["a.x"].Undefined != "no cases" {
		t.Errorf("NaN fact came back as %v", out.Result.Facts["a.x"])
	}
	if v := out.Result.Facts["a.z"].Value; v != 0 || !math.Signbit(v) {
		t.Errorf("-0 came back as %v", v)
	}
	fs := out.Result.Figure
	if fs.AxisMin == nil || *fs.AxisMin != 0 {
		t.Errorf("a pointer to 0 came back as %v", fs.AxisMin)
	}
	if s := fs.Series[0]; s.Low != nil || s.High == nil || len(s.High) != 0 || !math.IsInf(s.Values[1], 1) {
		t.Errorf("series came back as %+v", s)
	}
	if out.Result.Filters == nil || out.Result.Tables[0].Head == nil || out.Result.Notes != nil {
		t.Error("nil and empty slices were confused")
	}
	if string(out.Figure.SVG) != "<svg/>" || !math.IsInf(out.Figure.Geometry.LieFactor, 1) || out.Figure.Geometry.Marks[0].Value != -1 {
		t.Errorf("figure came back as %+v", out.Figure)
	}
	// A damaged entry is refused, never half read.
	if err := decodeValue(b[:len(b)-3], reflect.ValueOf(&out).Elem()); err == nil {
		t.Error("a truncated entry decoded")
	}
}

// TestCacheConcurrentBuilds: builds running at once share the cache and
// the loaded data set (its lazily built gota series included) and still
// give the same report.
func TestCacheConcurrentBuilds(t *testing.T) {
	path := scaleReport(t, 800)
	useCache(t, nil)
	want := build(t, path)
	useCache(t, NewCache(""))
	done := make(chan *Report, 4)
	for i := 0; i < 4; i++ {
		go func() {
			r, err := Build(path, Options{})
			if err != nil {
				t.Error(err)
			}
			done <- r
		}()
	}
	for i := 0; i < 4; i++ {
		if r := <-done; r != nil {
			if d := sameBuild(want, r); d != "" {
				t.Errorf("concurrent build %d: %s", i, d)
			}
		}
	}
}
