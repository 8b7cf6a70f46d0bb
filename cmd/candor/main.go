// Command candor turns a Markdown report with analysis blocks into a
// self-contained HTML report, and checks that its prose claims no more than
// its numbers show. See FORMAT.md for the report format.
package main

import (
	"fmt"
	"io"
	"os"
	"runtime/debug"
)

const usage = `candor turns a Markdown report with analysis blocks into one self-contained
HTML file, and checks its prose against the numbers it computed.

Usage:
  candor build REPORT.md [-o OUT.html] [--set name=value]... [--strict] [--review]
                         [--figures DIR] [--data-root DIR]
  candor check REPORT.md [--format text|json|sarif] [--set name=value]... [--strict]
  candor facts REPORT.md [--set name=value]...
  candor watch REPORT.md [--addr 127.0.0.1:8080] [--set name=value]...
  candor init DIR

Exit status: 0 when no finding reaches the report's fail-on level, 1 when one
does, 2 for bad input (the message gives FILE:LINE:COL and what to change).
`

func main() {
	if os.Getenv("GOGC") == "" {
		// A report holds its data in memory while its blocks run; collecting
		// at half the default growth keeps the peak near 1.5 times the live
		// data instead of twice, for a few percent more time.
		debug.SetGCPercent(50)
	}
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// run is the whole command, testable: it returns the exit status.
func run(args []string, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		fmt.Fprint(stderr, usage)
		return 2
	}
	cmd, rest := args[0], args[1:]
	switch cmd {
	case "build":
		return cmdBuild(rest, stdout, stderr)
	case "check":
		return cmdCheck(rest, stdout, stderr)
	case "facts":
		return cmdFacts(rest, stdout, stderr)
	case "watch":
		return cmdWatch(rest, stdout, stderr)
	case "init":
		return cmdInit(rest, stdout, stderr)
	case "help", "-h", "--help":
		fmt.Fprint(stdout, usage)
		return 0
	case "version", "--version":
		fmt.Fprintln(stdout, "candor", version())
		return 0
	}
	fmt.Fprintf(stderr, "candor: unknown command %q\n\n%s", cmd, usage)
	return 2
}
