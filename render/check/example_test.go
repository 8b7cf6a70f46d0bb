package check_test

import (
	"os"

	"candor/blocks"
	"candor/render/check"
)

// A report claims a multiple that the risk ratio does not support.
func ExampleRun() {
	src := "Annual members were nearly 1.5 times as likely to renew as monthly members.\n"
	fs := blocks.Facts{}
	fs.Set("renewals.monthly.pct", 38.2, blocks.Percent, "")
	fs.Set("renewals.annual.pct", 45.1, blocks.Percent, "")
	fs.Set("renewals.ratio", 1.18, blocks.Ratio, "")
	fs.Set("renewals.ratio_low", 0.92, blocks.Ratio, "")
	fs.Set("renewals.ratio_high", 1.51, blocks.Ratio, "")
	in := check.Input{
		File:   "report.md",
		Source: []byte(src),
		Blocks: []check.Block{{Result: &blocks.Result{ID: "renewals", Analysis: "compare", Facts: fs,
			Meta: blocks.Meta{Outcome: "binary", Groups: []string{"Monthly", "Annual"}, Reference: "Monthly"}}}},
		Units: []check.Unit{{Kind: "paragraph", Prev: "renewals", Parts: []check.Part{{Text: src[:len(src)-1], Offset: 0, SrcLen: len(src) - 1}}}},
	}
	check.WriteText(os.Stdout, check.Run(in))
	// Output:
	// report.md:1:21: error ratio: says "nearly 1.5 times" but the risk ratio is 1.18 (95% CI 0.92–1.51); try "about 1.2 times, and the interval includes no difference" [renewals]
}
