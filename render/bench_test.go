package render

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"candor/examples/scale/members"
	"candor/render/check"
)

// benchReport writes an example report of examples/scale (scale.md, ten
// blocks, or twenty.md) over rows of its invented data into a fresh
// folder.
func benchReport(b *testing.B, name string, rows int) string {
	b.Helper()
	dir := b.TempDir()
	md, err := os.ReadFile(filepath.Join("..", "examples", "scale", name))
	if err != nil {
		b.Fatal(err)
	}
	os.MkdirAll(filepath.Join(dir, "data"), 0o755)
	f, err := os.Create(filepath.Join(dir, "data", "members.csv"))
	if err != nil {
		b.Fatal(err)
	}
	if err := members.Generate(f, rows, members.Seed); err != nil {
		b.Fatal(err)
	}
	f.Close()
	path := filepath.Join(dir, name)
	if err := os.WriteFile(path, md, 0o644); err != nil {
		b.Fatal(err)
	}
	return path
}

func benchCache(b *testing.B, c *Cache) {
	activeCache()
	old := DefaultCache
	DefaultCache = c
	b.Cleanup(func() { DefaultCache = old })
}

// BenchmarkBuild is a cold build of the scale report (load, run, draw,
// check, HTML) without the cache.
func BenchmarkBuild(b *testing.B) {
	for _, rows := range []int{10_000, 100_000} {
		path := benchReport(b, "scale.md", rows)
		b.Run("scale/"+strconv.Itoa(rows/1000)+"k", func(b *testing.B) {
			benchCache(b, nil)
			for i := 0; i < b.N; i++ {
				if _, err := Build(path, Options{}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkRebuildProseEdit is what `candor watch` does after an edit to
// the prose of a twenty-block report: every block comes from the cache,
// and the report is loaded, checked and written again.
func BenchmarkRebuildProseEdit(b *testing.B) {
	for _, rows := range []int{10_000, 100_000} {
		path := benchReport(b, "twenty.md", rows)
		md, _ := os.ReadFile(path)
		b.Run("twenty/"+strconv.Itoa(rows/1000)+"k", func(b *testing.B) {
			benchCache(b, NewCache(""))
			if _, err := Build(path, Options{}); err != nil {
				b.Fatal(err)
			}
			b.ResetTimer()
			for i := 0; i < b.N; i++ {
				b.StopTimer()
				edit := strings.Replace(string(md), "## Who renews", "An edit to the prose, number "+strconv.Itoa(i)+".\n\n## Who renews", 1)
				if err := os.WriteFile(path, []byte(edit), 0o644); err != nil {
					b.Fatal(err)
				}
				b.StartTimer()
				r, err := Build(path, Options{})
				if err != nil {
					b.Fatal(err)
				}
				if len(r.Results) != 20 {
					b.Fatalf("%d blocks", len(r.Results))
				}
			}
			st := DefaultCache.Stats()
			if st.Misses != 20 {
				b.Fatalf("blocks computed again after a prose edit: %+v", st)
			}
		})
	}
}

// BenchmarkChecker measures the checker alone on the twenty-block report:
// every sentence read and judged against the facts and figures.
func BenchmarkChecker(b *testing.B) {
	path := benchReport(b, "twenty.md", 10_000)
	benchCache(b, nil)
	r, err := Build(path, Options{NoHTML: true})
	if err != nil {
		b.Fatal(err)
	}
	in := r.checkInput()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		check.Run(in)
	}
}

// BenchmarkRebuildFromDisk is a second `candor build` of the twenty-block
// report after an edit to its prose: a fresh process whose cache finds
// every block on disk.
func BenchmarkRebuildFromDisk(b *testing.B) {
	path := benchReport(b, "twenty.md", 10_000)
	dir := b.TempDir()
	benchCache(b, NewCache(dir))
	if _, err := Build(path, Options{}); err != nil {
		b.Fatal(err)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		DefaultCache = NewCache(dir)
		if _, err := Build(path, Options{}); err != nil {
			b.Fatal(err)
		}
		if st := DefaultCache.Stats(); st.DiskHits != 20 {
			b.Fatalf("%+v", st)
		}
	}
}
