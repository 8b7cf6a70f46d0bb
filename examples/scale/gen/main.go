// Command gen writes the invented benchmark data of the scale report (see
// package members): the same -rows gives the same bytes on every run.
//
//	go run ./examples/scale/gen -rows 1000000 -o examples/scale/data/1m/data/members.csv
//
// The files are large and are never committed (examples/scale/data/ is
// ignored); the harness (examples/scale/harness) writes them when missing.
package main

import (
	"flag"
	"fmt"
	"os"
	"path/filepath"

	"candor/examples/scale/members"
)

func main() {
	rows := flag.Int("rows", 100000, "rows to write")
	out := flag.String("o", "", "output CSV file (created with its folder)")
	flag.Parse()
	if *out == "" || *rows < 1 {
		fmt.Fprintln(os.Stderr, "usage: gen -rows N -o FILE.csv")
		os.Exit(2)
	}
	if err := write(*out, *rows); err != nil {
		fmt.Fprintln(os.Stderr, "gen:", err)
		os.Exit(1)
	}
}

func write(path string, rows int) error {
	if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
		return err
	}
	tmp := path + ".tmp"
	f, err := os.Create(tmp)
	if err != nil {
		return err
	}
	if err := members.Generate(f, rows, members.Seed); err != nil {
		f.Close()
		return err
	}
	if err := f.Close(); err != nil {
		return err
	}
	return os.Rename(tmp, path)
}
