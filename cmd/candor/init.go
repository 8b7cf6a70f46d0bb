package main

import (
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
)

// starterReport is what candor init writes: a short report on invented data
// that builds with no findings, to be edited into a real one.
const starterReport = "---\n" +
	"title: Repair café, first month\n" +
	"author: Your name\n" +
	"date: 2026-12-01\n" +
	"data:\n" +
	"  visits: data/visits.csv\n" +
	"check:\n" +
	"  alpha: 0.05\n" +
	"  min-n: 30\n" +
	"  fail-on: error\n" +
	"---\n\n" +
	"This starter report runs on invented data. Replace the data file and the\n" +
	"prose with your own; keep the blocks that fit.\n\n" +
	"## Who came in\n\n" +
	"```candor items\n" +
	"frequency: item\n" +
	"title: Items brought in for repair\n" +
	"```\n\n" +
	"Over the month {{items.n}} items came in for repair. Bicycles were the\n" +
	"largest group at {{items.bicycle.pct}} of all items.\n\n" +
	"## How long a repair took\n\n" +
	"```candor minutes\n" +
	"summary: minutes\n" +
	"```\n\n" +
	"A repair took {{minutes.median}} minutes at the median; half of them took\n" +
	"between {{minutes.q1}} and {{minutes.q3}} minutes.\n"

// starterData writes the starter's invented visits: a fixed sequence, so
// every init gives the same file.
func starterData() string {
	items := []string{"bicycle", "lamp", "toaster", "bicycle", "radio", "clothing", "bicycle", "lamp", "clothing", "kettle"}
	var b strings.Builder
	b.WriteString("day,item,minutes,fixed\n")
	seed := uint32(20261201)
	for i := 0; i < 60; i++ {
		seed = seed*1664525 + 1013904223
		item := items[int(seed>>8)%len(items)]
		seed = seed*1664525 + 1013904223
		minutes := 10 + int(seed>>8)%50
		if item == "bicycle" {
			minutes += 15
		}
		seed = seed*1664525 + 1013904223
		fixed := "yes"
		if int(seed>>8)%4 == 0 {
			fixed = "no"
		}
		fmt.Fprintf(&b, "2026-11-%02d,%s,%d,%s\n", 1+i%28, item, minutes, fixed)
	}
	return b.String()
}

func cmdInit(args []string, stdout, stderr io.Writer) int {
	f, err := parseFlags(args, nil, nil)
	if err != nil {
		return usageError(stderr, "init", err)
	}
	if len(f.args) != 1 {
		return usageError(stderr, "init", fmt.Errorf("name the folder to create, e.g. candor init my-report"))
	}
	dir := f.args[0]
	report := filepath.Join(dir, "report.md")
	if _, err := os.Stat(report); err == nil {
		return usageError(stderr, "init", fmt.Errorf("%s already exists; choose an empty folder", report))
	}
	if err := os.MkdirAll(filepath.Join(dir, "data"), 0o755); err != nil {
		return fail(stderr, err)
	}
	if err := os.WriteFile(filepath.Join(dir, "data", "visits.csv"), []byte(starterData()), 0o644); err != nil {
		return fail(stderr, err)
	}
	if err := os.WriteFile(report, []byte(starterReport), 0o644); err != nil {
		return fail(stderr, err)
	}
	fmt.Fprintf(stdout, "wrote %s and %s\nbuild it with: candor build %s\n", report, filepath.Join(dir, "data", "visits.csv"), report)
	return 0
}
