package blocks

import (
	"bytes"
	"encoding/csv"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"testing"

	"candor/examples/scale/members"
)

// benchCSV writes the scale report's invented member data with the given
// number of rows into a temporary folder of the benchmark.
func benchCSV(b testing.TB, rows int) (dir, file string) {
	b.Helper()
	dir = b.TempDir()
	file = "members-" + strconv.Itoa(rows) + ".csv"
	f, err := os.Create(filepath.Join(dir, file))
	if err != nil {
		b.Fatal(err)
	}
	defer f.Close()
	if err := members.Generate(f, rows, members.Seed); err != nil {
		b.Fatal(err)
	}
	return dir, file
}

func benchSource(file string) *SourceSpec {
	s := &SourceSpec{Name: "members", File: file, Missing: DefaultMissing, Types: map[string]ColType{}}
	if err := s.fileKind(); err != nil {
		panic(err)
	}
	return s
}

func benchLoad(b *testing.B, rows int) {
	dir, file := benchCSV(b, rows)
	memoOff(b)
	st, _ := os.Stat(filepath.Join(dir, file))
	b.SetBytes(st.Size())
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		d, err := Load(benchSource(file), Env{Dir: dir})
		if err != nil {
			b.Fatal(err)
		}
		if d.Rows() != rows {
			b.Fatalf("%d rows", d.Rows())
		}
	}
}

// BenchmarkLoadCSV measures the whole CSV source: reading, hashing,
// typing every column exactly and building the gota frame.
func BenchmarkLoadCSV100k(b *testing.B) { benchLoad(b, 100_000) }
func BenchmarkLoadCSV1M(b *testing.B)   { benchLoad(b, 1_000_000) }

// BenchmarkBareCSV1M is the floor the loader is measured against: read the
// same file and pass it through encoding/csv, parsing one number column
// with strconv.ParseFloat and keeping nothing else.
func BenchmarkBareCSV1M(b *testing.B) {
	dir, file := benchCSV(b, 1_000_000)
	path := filepath.Join(dir, file)
	st, _ := os.Stat(path)
	b.SetBytes(st.Size())
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		data, err := os.ReadFile(path)
		if err != nil {
			b.Fatal(err)
		}
		r := csv.NewReader(bytes.NewReader(data))
		r.ReuseRecord = true
		if _, err := r.Read(); err != nil {
			b.Fatal(err)
		}
		var vals []float64
		for {
			rec, err := r.Read()
			if err == io.EOF {
				break
			}
			if err != nil {
				b.Fatal(err)
			}
			f, _ := strconv.ParseFloat(rec[6], 64)
			vals = append(vals, f)
		}
		if len(vals) != 1_000_000 {
			b.Fatal(len(vals))
		}
	}
}

// memoOff makes Load read the file on every call instead of finding the
// data set it loaded before.
func memoOff(b testing.TB) {
	memo.Lock()
	memo.off = true
	memo.Unlock()
	b.Cleanup(func() {
		memo.Lock()
		memo.off = false
		memo.Unlock()
	})
}

// benchSpecs are the analyses of the scale report (examples/scale/scale.md).
var benchSpecs = []struct{ id, body string }{
	{"frequency", "frequency: plan"},
	{"frequency-binned", "frequency: visits"},
	{"summary", "summary: age"},
	{"summary-by", "summary: spend\nby: plan"},
	{"crosstab", "crosstab: [plan, renewed]"},
	{"compare-means", "compare: spend\nby: renewed\nreference: \"no\""},
	{"compare-proportions", "compare: renewed\nby: channel\nwhere:\n  - channel in [app, web]\nsuccess: \"yes\"\nreference: app"},
	{"regression", "regression: spend\npredictors: [visits, age]"},
	{"trend", "trend: score\ntime: month\nby: plan"},
}

// BenchmarkRun measures each analysis of the scale report on the member
// data, filters included, from the loaded data set to its result (facts,
// tables and the figure's spec; drawing is figures' benchmark).
func BenchmarkRun(b *testing.B) {
	for _, rows := range []int{100_000, 1_000_000} {
		dir, file := benchCSV(b, rows)
		d, err := Load(benchSource(file), Env{Dir: dir})
		if err != nil {
			b.Fatal(err)
		}
		for _, bs := range benchSpecs {
			pf := func(line, col int) Pos { return Pos{File: "scale.md", Line: line, Col: col} }
			s, err := ParseSpec(bs.id, Pos{File: "scale.md", Line: 1, Col: 1}, []byte(bs.body), pf)
			if err != nil {
				b.Fatal(err)
			}
			b.Run(bs.id+"/"+strconv.Itoa(rows/1000)+"k", func(b *testing.B) {
				b.ReportAllocs()
				for i := 0; i < b.N; i++ {
					if _, err := Run(s, d, nil); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
}
