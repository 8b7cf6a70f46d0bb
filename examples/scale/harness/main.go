// Command harness times candor against its peer, a pandas and matplotlib
// script doing the same work (examples/scale/peer.py), on the invented
// member data of examples/scale, and prints the result as a Markdown table.
//
//	go run ./examples/scale/harness            # from the repository root
//	go run ./examples/scale/harness -n 7 -sizes 100k,1m
//
// It writes the data it needs under examples/scale/data/ (ignored by git),
// builds candor, and then, for each size, runs `candor build` of
// scale.md and the peer alternately, n times each, reporting the median
// wall time and the peak resident memory (getrusage of each child). It
// also measures the CSV loader against a bare encoding/csv pass over the
// same file, a twenty-block report rebuilt after an edit to its prose (in
// the process, as `candor watch` does, and as a second `candor build`
// with the disk cache), and a cold build of every example report. It
// checks that candor's facts and the peer's statistics agree.
//
// The peer runs with Debian's /usr/bin/python3 and its python3-pandas,
// python3-scipy and python3-matplotlib packages.
package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"sort"
	"strconv"
	"strings"
	"syscall"
	"time"

	"candor/blocks"
	"candor/examples/scale/members"
	"candor/render"
)

type size struct {
	name string
	rows int
}

var sizes = map[string]size{"10k": {"10k", 10_000}, "100k": {"100k", 100_000}, "1m": {"1m", 1_000_000}}

func main() {
	if len(os.Args) > 2 && os.Args[1] == "-child" {
		child(os.Args[2], os.Args[3])
		return
	}
	n := flag.Int("n", 5, "runs of each program per size (alternating)")
	list := flag.String("sizes", "100k,1m", "data sizes for the full build: 10k, 100k, 1m")
	python := flag.String("python", "/usr/bin/python3", "the Python with pandas, scipy and matplotlib")
	flag.Parse()
	root, err := repoRoot()
	if err != nil {
		fail(err)
	}
	scale := filepath.Join(root, "examples", "scale")
	tmp, err := os.MkdirTemp("", "candor-harness-")
	if err != nil {
		fail(err)
	}
	defer os.RemoveAll(tmp)
	candor := filepath.Join(tmp, "candor")
	step("building candor")
	if out, err := run(root, nil, "go", "build", "-o", candor, "./cmd/candor"); err != nil {
		fail(fmt.Errorf("go build: %v\n%s", err, out))
	}
	fmt.Fprintf(os.Stderr, "machine: %s/%s, %d cores, %s\n", runtime.GOOS, runtime.GOARCH, runtime.NumCPU(), runtime.Version())

	var t table
	var names []string
	for _, s := range strings.Split(*list, ",") {
		sz, ok := sizes[strings.TrimSpace(s)]
		if !ok {
			fail(fmt.Errorf("unknown size %q", s))
		}
		names = append(names, sz.name)
	}
	var agree []string
	for _, name := range names {
		sz := sizes[name]
		dir, csvPath := dataset(scale, sz, "scale.md")
		fi, _ := os.Stat(csvPath)
		label := fmt.Sprintf("%s rows, %s CSV", thousands(sz.rows), mb(fi.Size()))
		out := filepath.Join(tmp, "out-"+sz.name)
		var cw, cm, pw, pm []float64
		for i := 0; i < *n; i++ {
			step(fmt.Sprintf("%s: run %d of %d", sz.name, i+1, *n))
			w, m := timed(dir, []string{"CANDOR_CACHE=off"}, candor, "build", "scale.md", "-o", filepath.Join(tmp, "scale.html"), "--quiet")
			cw, cm = append(cw, w), append(cm, m)
			w, m = timed(root, nil, *python, filepath.Join(scale, "peer.py"), csvPath, out)
			pw, pm = append(pw, w), append(pm, m)
		}
		t.add("Full build of scale.md ("+label+"), median wall", secs(median(cw)), secs(median(pw)), median(cw)/median(pw), "≤ 0.33")
		t.add("Full build of scale.md ("+label+"), peak RSS", mb(int64(median(cm))), mb(int64(median(pm))), median(cm)/median(pm), "≤ 1")
		agree = append(agree, compare(dir, candor, filepath.Join(out, "stats.json"), sz.name))
	}

	// The loader against a bare encoding/csv pass, each in its own process.
	big := names[len(names)-1]
	_, csvPath := dataset(scale, sizes[big], "scale.md")
	var lw, bw, lc, bc []float64
	for i := 0; i < *n; i++ {
		step(fmt.Sprintf("load: run %d of %d", i+1, *n))
		w, c := childTime("load", csvPath)
		lw, lc = append(lw, w), append(lc, c)
		w, c = childTime("bare", csvPath)
		bw, bc = append(bw, w), append(bc, c)
	}
	t.add("CSV load ("+thousands(sizes[big].rows)+" rows, every column typed, hashed) against a bare encoding/csv pass (one column parsed), wall", secs(median(lw)), secs(median(bw)), median(lw)/median(bw), "≤ 2")
	t.add("the same, CPU time (user + system) of the process", secs(median(lc)), secs(median(bc)), median(lc)/median(bc), "")

	// A twenty-block report rebuilt after an edit to its prose.
	for _, name := range []string{"10k", "100k"} {
		dir, _ := dataset(scale, sizes[name], "twenty.md")
		path := filepath.Join(dir, "twenty.md")
		step("rebuild: " + name)
		in := rebuildInProcess(path, *n)
		disk := rebuildWithDisk(candor, dir, filepath.Join(tmp, "cache-"+name), *n)
		t.add(fmt.Sprintf("twenty.md (20 blocks, %s rows) after a prose edit: in process, as candor watch", thousands(sizes[name].rows)), ms(in), "", math.NaN(), "< 50 ms")
		t.add(fmt.Sprintf("twenty.md (20 blocks, %s rows) after a prose edit: candor build with the disk cache", thousands(sizes[name].rows)), ms(disk), "", math.NaN(), "")
	}

	// Every example report, cold.
	examples, _ := filepath.Glob(filepath.Join(root, "examples", "*", "report.md"))
	for _, p := range examples {
		step("example " + p)
		var ws []float64
		for i := 0; i < *n; i++ {
			w, _ := timed(filepath.Dir(p), []string{"CANDOR_CACHE=off"}, candor, "build", "report.md", "-o", filepath.Join(tmp, "example.html"), "--quiet")
			ws = append(ws, w)
		}
		t.add("Cold candor build of examples/"+filepath.Base(filepath.Dir(p))+"/report.md", ms(median(ws)), "", math.NaN(), "≪ 1 s")
	}
	fmt.Fprintln(os.Stderr)
	t.print(os.Stdout, *n)
	fmt.Printf("\nOne-minute load average of the machine while measuring: %.2f to %.2f (other work slows both programs; their runs alternate).\n", loadMin, loadMax)
	for _, a := range agree {
		fmt.Println(a)
	}
}

// dataset writes the data of a size (when missing) and a copy of the
// report beside it, and returns the folder and the CSV's path.
func dataset(scale string, sz size, report string) (string, string) {
	dir := filepath.Join(scale, "data", sz.name)
	csvPath := filepath.Join(dir, "data", "members.csv")
	if _, err := os.Stat(csvPath); err != nil {
		step("writing " + csvPath)
		if err := os.MkdirAll(filepath.Dir(csvPath), 0o755); err != nil {
			fail(err)
		}
		f, err := os.Create(csvPath + ".tmp")
		if err != nil {
			fail(err)
		}
		if err := members.Generate(f, sz.rows, members.Seed); err != nil {
			fail(err)
		}
		f.Close()
		if err := os.Rename(csvPath+".tmp", csvPath); err != nil {
			fail(err)
		}
	}
	md, err := os.ReadFile(filepath.Join(scale, report))
	if err != nil {
		fail(err)
	}
	if err := os.WriteFile(filepath.Join(dir, report), md, 0o644); err != nil {
		fail(err)
	}
	return dir, csvPath
}

// timed runs a program and returns its wall time in seconds and its peak
// resident memory in bytes.
func timed(dir string, env []string, name string, args ...string) (float64, float64) {
	cmd := exec.Command(name, args...)
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), env...)
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	start := time.Now()
	err := cmd.Run()
	wall := time.Since(start).Seconds()
	if err != nil {
		fail(fmt.Errorf("%s %s: %v\n%s", name, strings.Join(args, " "), err, stderr.String()))
	}
	ru := cmd.ProcessState.SysUsage().(*syscall.Rusage)
	return wall, float64(ru.Maxrss) * 1024 // kilobytes on Linux
}

// childTime runs one load in a fresh process and returns the wall time of
// the load and the CPU time of the process, in seconds.
func childTime(what, path string) (float64, float64) {
	exe, err := os.Executable()
	if err != nil {
		fail(err)
	}
	cmd := exec.Command(exe, "-child", what, path)
	out, err := cmd.Output()
	if err != nil {
		fail(fmt.Errorf("child %s: %v", what, err))
	}
	f, err := strconv.ParseFloat(strings.TrimSpace(string(out)), 64)
	if err != nil {
		fail(fmt.Errorf("child %s said %q", what, out))
	}
	return f, cmd.ProcessState.UserTime().Seconds() + cmd.ProcessState.SystemTime().Seconds()
}

// child times one load in a fresh process: candor's CSV source ("load")
// or the floor it is measured against ("bare": read the file and pass it
// through encoding/csv, parsing one number column with ParseFloat).
func child(what, path string) {
	start := time.Now()
	switch what {
	case "load":
		s := &blocks.SourceSpec{Name: "members", File: filepath.Base(path), Kind: "csv", Delimiter: ',', Missing: blocks.DefaultMissing, Types: map[string]blocks.ColType{}}
		d, err := blocks.Load(s, blocks.Env{Dir: filepath.Dir(path)})
		if err != nil {
			fail(err)
		}
		if d.Rows() == 0 {
			fail(fmt.Errorf("no rows"))
		}
	case "bare":
		b, err := os.ReadFile(path)
		if err != nil {
			fail(err)
		}
		r := csv.NewReader(bytes.NewReader(b))
		r.ReuseRecord = true
		head, err := r.Read()
		if err != nil {
			fail(err)
		}
		col := 0
		for i, h := range head {
			if h == "spend" {
				col = i
			}
		}
		var vals []float64
		for {
			rec, err := r.Read()
			if err == io.EOF {
				break
			}
			if err != nil {
				fail(err)
			}
			f, _ := strconv.ParseFloat(rec[col], 64)
			vals = append(vals, f)
		}
		if len(vals) == 0 {
			fail(fmt.Errorf("no rows"))
		}
	}
	fmt.Println(time.Since(start).Seconds())
}

// rebuildInProcess builds a report, then times builds after edits to its
// prose with the process's cache (candor watch), and returns the median.
func rebuildInProcess(path string, n int) float64 {
	render.DefaultCache = render.NewCache("")
	md, err := os.ReadFile(path)
	if err != nil {
		fail(err)
	}
	defer os.WriteFile(path, md, 0o644)
	if _, err := render.Build(path, render.Options{}); err != nil {
		fail(err)
	}
	var ws []float64
	for i := 0; i < n; i++ {
		os.WriteFile(path, proseEdit(md, i), 0o644)
		start := time.Now()
		if _, err := render.Build(path, render.Options{}); err != nil {
			fail(err)
		}
		ws = append(ws, time.Since(start).Seconds())
	}
	if st := render.DefaultCache.Stats(); st.Misses != 20 {
		fail(fmt.Errorf("a prose edit ran blocks again: %+v", st))
	}
	return median(ws)
}

// rebuildWithDisk runs candor build once to fill a fresh disk cache, then
// times candor build after edits to the prose.
func rebuildWithDisk(candor, dir, cache string, n int) float64 {
	path := filepath.Join(dir, "twenty.md")
	md, err := os.ReadFile(path)
	if err != nil {
		fail(err)
	}
	defer os.WriteFile(path, md, 0o644)
	env := []string{"CANDOR_CACHE=" + cache}
	out := filepath.Join(filepath.Dir(cache), "twenty.html")
	timed(dir, env, candor, "build", "twenty.md", "-o", out, "--quiet")
	var ws []float64
	for i := 0; i < n; i++ {
		os.WriteFile(path, proseEdit(md, i), 0o644)
		w, _ := timed(dir, env, candor, "build", "twenty.md", "-o", out, "--quiet")
		ws = append(ws, w)
	}
	return median(ws)
}

func proseEdit(md []byte, i int) []byte {
	return bytes.Replace(md, []byte("## Who renews"), []byte(fmt.Sprintf("A sentence added in edit %d.\n\n## Who renews", i+1)), 1)
}

// compare checks the peer's statistics against candor's facts.
func compare(dir, candor, statsPath, label string) string {
	cmd := exec.Command(candor, "facts", "scale.md")
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), "CANDOR_CACHE=off")
	out, err := cmd.Output()
	if err != nil {
		fail(fmt.Errorf("candor facts: %v", err))
	}
	var facts map[string]any
	if err := json.Unmarshal(out, &facts); err != nil {
		fail(err)
	}
	b, err := os.ReadFile(statsPath)
	if err != nil {
		fail(err)
	}
	b = bytes.ReplaceAll(b, []byte("NaN"), []byte("null"))
	var peer map[string]any
	if err := json.Unmarshal(b, &peer); err != nil {
		fail(err)
	}
	get := func(path ...any) float64 {
		var v any = peer
		for _, p := range path {
			switch k := p.(type) {
			case string:
				m, _ := v.(map[string]any)
				v = m[k]
			case int:
				l, _ := v.([]any)
				if k >= len(l) {
					return math.NaN()
				}
				v = l[k]
			}
		}
		f, ok := v.(float64)
		if !ok {
			return math.NaN()
		}
		return f
	}
	level := func(block, name string) float64 {
		l, _ := peer[block].(map[string]any)["levels"].([]any)
		for _, x := range l {
			m := x.(map[string]any)
			if m["level"] == name {
				f, _ := m["pct"].(float64)
				return f
			}
		}
		return math.NaN()
	}
	pairs := map[string]float64{
		"plans.monthly.pct": level("plans", "monthly"), "regions.central.pct": level("regions", "Central"),
		"rides.0_5.pct": level("rides", "[0, 5)"),
	}
	for _, k := range []string{"n", "mean", "sd", "se", "mean_low", "mean_high", "min", "q1", "median", "q3", "max", "iqr", "skewness", "missing"} {
		pairs["ages."+k] = get("ages", k)
		for _, g := range []string{"monthly", "annual", "student"} {
			pairs["spend."+g+"."+k] = get("spend", "groups", g, k)
		}
	}
	for _, k := range []string{"n", "chi2", "df", "p", "v", "min_expected"} {
		pairs["renewal."+k] = get("renewal", k)
	}
	for _, g := range []string{"monthly", "annual", "student"} {
		for _, c := range []string{"yes", "no"} {
			pairs["renewal."+g+"."+c+".count"] = get("renewal", "counts", c, g)
			pairs["renewal."+g+"."+c+".row_pct"] = get("renewal", "row_pct", c, g)
			pairs["renewal."+g+"."+c+".col_pct"] = get("renewal", "col_pct", c, g)
		}
	}
	for _, k := range []string{"diff", "diff_low", "diff_high", "t", "df", "p", "d", "ratio"} {
		pairs["spend-renewed."+k] = get("spend-renewed", k)
	}
	for _, g := range []string{"yes", "no"} {
		for _, k := range []string{"n", "mean", "sd", "mean_low", "mean_high", "median"} {
			pairs["spend-renewed."+g+"."+k] = get("spend-renewed", g, k)
		}
	}
	for _, k := range []string{"diff", "diff_low", "diff_high", "ratio", "ratio_low", "ratio_high", "odds_ratio", "odds_low", "odds_high", "z", "p"} {
		pairs["renewal-channel."+k] = get("renewal-channel", k)
	}
	for _, g := range []string{"app", "web"} {
		for _, k := range []string{"n", "successes", "pct", "pct_low", "pct_high"} {
			pairs["renewal-channel."+g+"."+k] = get("renewal-channel", g, k)
		}
	}
	for _, k := range []string{"n", "r2", "adj_r2", "f", "sigma", "df_resid", "influential", "max_cooks"} {
		pairs["spend-model."+k] = get("spend-model", k)
	}
	pairs["spend-model.p"] = get("spend-model", "f_p")
	for i, term := range []string{"intercept", "visits", "age"} {
		for _, k := range []string{"estimate", "se", "t", "p", "low", "high"} {
			src := k
			if k == "estimate" {
				src = "coef"
			}
			pairs["spend-model."+term+"."+k] = get("spend-model", src, i)
		}
	}
	for _, g := range []string{"monthly", "annual", "student"} {
		pairs["satisfaction."+g+".change"] = get("satisfaction", g, "change")
		pairs["satisfaction."+g+".ratio"] = get("satisfaction", g, "ratio")
		for m := 1; m <= 12; m++ {
			month := fmt.Sprintf("2025-%02d", m)
			slug := strings.ReplaceAll(month, "-", "_")
			for _, k := range []string{"mean", "n", "mean_low", "mean_high"} {
				pairs["satisfaction."+g+"."+slug+"."+k] = get("satisfaction", g, "months", month, k)
			}
		}
	}
	keys := make([]string, 0, len(pairs))
	for k := range pairs {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	worst, worstKey, bad := 0.0, "", []string{}
	for _, k := range keys {
		want := pairs[k]
		got, ok := facts[k].(float64)
		if !ok || math.IsNaN(want) {
			bad = append(bad, k)
			continue
		}
		d := math.Abs(got-want) / math.Max(1e-300, math.Max(math.Abs(got), math.Abs(want)))
		if got == want {
			d = 0
		}
		if math.Abs(got) < 1e-300 && math.Abs(want) < 1e-300 {
			d = 0
		}
		if d > worst {
			worst, worstKey = d, k
		}
		if d > 1e-6 {
			bad = append(bad, fmt.Sprintf("%s (candor %v, peer %v)", k, got, want))
		}
	}
	msg := fmt.Sprintf("%s: candor's facts and the peer's statistics agree on %d of %d values; largest relative difference %.1e (%s).",
		label, len(keys)-len(bad), len(keys), worst, worstKey)
	if len(bad) > 0 {
		msg += " Differ or missing: " + strings.Join(bad, "; ")
	}
	return msg
}

type row struct {
	what, candor, peer string
	ratio              float64
	target             string
}

type table struct{ rows []row }

func (t *table) add(what, c, p string, ratio float64, target string) {
	t.rows = append(t.rows, row{what, c, p, ratio, target})
}

func (t *table) print(w io.Writer, n int) {
	fmt.Fprintf(w, "| measured on %s/%s, %d cores (median of %d) | candor | peer: pandas + matplotlib | ratio | target |\n", runtime.GOOS, runtime.GOARCH, runtime.NumCPU(), n)
	fmt.Fprintln(w, "| --- | ---: | ---: | ---: | --- |")
	for _, r := range t.rows {
		ratio := ""
		if !math.IsNaN(r.ratio) {
			ratio = fmt.Sprintf("%.2f", r.ratio)
		}
		fmt.Fprintf(w, "| %s | %s | %s | %s | %s |\n", r.what, r.candor, r.peer, ratio, r.target)
	}
}

func median(xs []float64) float64 {
	s := append([]float64(nil), xs...)
	sort.Float64s(s)
	if len(s) == 0 {
		return math.NaN()
	}
	if len(s)%2 == 1 {
		return s[len(s)/2]
	}
	return (s[len(s)/2-1] + s[len(s)/2]) / 2
}

// secs shows a wall time: seconds, or milliseconds below one second.
func secs(s float64) string {
	if s < 1 {
		return ms(s)
	}
	return fmt.Sprintf("%.2f s", s)
}

func ms(s float64) string { return fmt.Sprintf("%.0f ms", 1000*s) }

func mb(b int64) string {
	if b < 10e6 {
		return fmt.Sprintf("%.1f MB", float64(b)/1e6)
	}
	return fmt.Sprintf("%.0f MB", float64(b)/1e6)
}

func thousands(n int) string {
	s := strconv.Itoa(n)
	for i := len(s) - 3; i > 0; i -= 3 {
		s = s[:i] + "," + s[i:]
	}
	return s
}

func run(dir string, env []string, name string, args ...string) ([]byte, error) {
	cmd := exec.Command(name, args...)
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), env...)
	return cmd.CombinedOutput()
}

func repoRoot() (string, error) {
	d, err := os.Getwd()
	if err != nil {
		return "", err
	}
	for {
		if b, err := os.ReadFile(filepath.Join(d, "go.mod")); err == nil && bytes.HasPrefix(b, []byte("module candor")) {
			return d, nil
		}
		parent := filepath.Dir(d)
		if parent == d {
			return "", fmt.Errorf("run the harness inside the candor repository")
		}
		d = parent
	}
}

var loadMin, loadMax = math.Inf(1), math.Inf(-1)

// step shows progress and samples the machine's one-minute load average.
func step(s string) {
	fmt.Fprintf(os.Stderr, "\r\033[K%s", s)
	if b, err := os.ReadFile("/proc/loadavg"); err == nil {
		if f, err := strconv.ParseFloat(strings.Fields(string(b))[0], 64); err == nil {
			loadMin, loadMax = math.Min(loadMin, f), math.Max(loadMax, f)
		}
	}
}

func fail(err error) {
	fmt.Fprintln(os.Stderr, "\nharness:", err)
	os.Exit(1)
}
