package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"strings"

	"candor/blocks"
	"candor/render"
	"candor/render/check"
)

func version() string { return render.Version }

// fail reports an error: bad input (status 2) with its position, or
// anything else (also status 2: nothing was built).
func fail(stderr io.Writer, err error) int {
	msg := err.Error()
	if !blocks.IsInput(err) {
		msg = "candor: " + msg
	}
	fmt.Fprintln(stderr, msg)
	return 2
}

func usageError(stderr io.Writer, cmd string, err error) int {
	fmt.Fprintf(stderr, "candor %s: %v\n", cmd, err)
	return 2
}

// exitFor is the status for a set of findings: 1 when one reaches fail-on.
func exitFor(doc *render.Document, fs []check.Finding, strict bool) int {
	failOn := doc.Front.Check.FailOn
	if strict && (failOn == check.Never || failOn > check.Warning) {
		failOn = check.Warning
	}
	if check.Fails(fs, failOn) {
		return 1
	}
	return 0
}

func cmdBuild(args []string, stdout, stderr io.Writer) int {
	f, err := parseFlags(args, []string{"o", "output", "figures", "data-root"}, []string{"strict", "review", "quiet"})
	if err != nil {
		return usageError(stderr, "build", err)
	}
	path, err := f.report()
	if err != nil {
		return usageError(stderr, "build", err)
	}
	out := f.values["o"]
	if out == "" {
		out = f.values["output"]
	}
	if out == "" {
		out = strings.TrimSuffix(path, filepath.Ext(path)) + ".html"
	}
	if filepath.Clean(out) == filepath.Clean(path) {
		return usageError(stderr, "build", fmt.Errorf("the output %s would overwrite the report; name another with -o", out))
	}
	rep, err := render.Build(path, render.Options{Set: f.sets, DataRoot: f.values["data-root"], Review: f.bools["review"]})
	if err != nil {
		return fail(stderr, err)
	}
	if err := render.WriteFile(out, rep.HTML); err != nil {
		return fail(stderr, fmt.Errorf("cannot write %s: %v", out, err))
	}
	if dir := f.values["figures"]; dir != "" {
		if _, err := rep.WriteFigures(dir); err != nil {
			return fail(stderr, fmt.Errorf("cannot write figures to %s: %v", dir, err))
		}
	}
	_ = check.WriteText(stderr, rep.Findings)
	if !f.bools["quiet"] {
		fmt.Fprintf(stdout, "wrote %s (%d blocks, %d figures, %s)\n", out, len(rep.Results), len(rep.Figures), findingCount(rep.Findings))
	}
	return exitFor(rep.Doc, rep.Findings, f.bools["strict"])
}

func findingCount(fs []check.Finding) string {
	n := 0
	for _, f := range fs {
		if !f.Allowed {
			n++
		}
	}
	switch n {
	case 0:
		return "no findings"
	case 1:
		return "1 finding"
	}
	return fmt.Sprintf("%d findings", n)
}

func cmdCheck(args []string, stdout, stderr io.Writer) int {
	f, err := parseFlags(args, []string{"format", "data-root"}, []string{"strict"})
	if err != nil {
		return usageError(stderr, "check", err)
	}
	path, err := f.report()
	if err != nil {
		return usageError(stderr, "check", err)
	}
	format := f.values["format"]
	if format == "" {
		format = "text"
	}
	if format != "text" && format != "json" && format != "sarif" {
		return usageError(stderr, "check", fmt.Errorf("--format is text, json or sarif, not %q", format))
	}
	rep, err := render.Build(path, render.Options{Set: f.sets, DataRoot: f.values["data-root"], NoHTML: true})
	if err != nil {
		return fail(stderr, err)
	}
	switch format {
	case "json":
		err = check.WriteJSON(stdout, rep.Findings)
	case "sarif":
		err = check.WriteSARIF(stdout, rep.Findings)
	default:
		err = check.WriteText(stdout, rep.Findings)
	}
	if err != nil {
		return fail(stderr, err)
	}
	return exitFor(rep.Doc, rep.Findings, f.bools["strict"])
}

func cmdFacts(args []string, stdout, stderr io.Writer) int {
	f, err := parseFlags(args, []string{"data-root"}, nil)
	if err != nil {
		return usageError(stderr, "facts", err)
	}
	path, err := f.report()
	if err != nil {
		return usageError(stderr, "facts", err)
	}
	rep, err := render.Build(path, render.Options{Set: f.sets, DataRoot: f.values["data-root"], NoHTML: true})
	if err != nil {
		return fail(stderr, err)
	}
	b, err := FactsJSON(rep.Facts)
	if err != nil {
		return fail(stderr, err)
	}
	stdout.Write(b)
	return 0
}

// FactsJSON writes facts as one flat JSON object, keys sorted, numbers at
// full precision (the shortest text that reads back as the same float64);
// an undefined fact is null.
func FactsJSON(fs blocks.Facts) ([]byte, error) {
	var b bytes.Buffer
	b.WriteString("{\n")
	names := fs.Names()
	for i, n := range names {
		k, _ := json.Marshal(n)
		b.WriteString("  ")
		b.Write(k)
		b.WriteString(": ")
		f := fs[n]
		if !f.Defined() || math.IsNaN(f.Value) || math.IsInf(f.Value, 0) {
			b.WriteString("null")
		} else {
			v, err := json.Marshal(f.Value)
			if err != nil {
				return nil, err
			}
			b.Write(v)
		}
		if i < len(names)-1 {
			b.WriteByte(',')
		}
		b.WriteByte('\n')
	}
	b.WriteString("}\n")
	return b.Bytes(), nil
}
