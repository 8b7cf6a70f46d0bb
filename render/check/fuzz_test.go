package check

import (
	"testing"
)

// FuzzExtract feeds arbitrary text to the extractor and the whole checker:
// nothing may panic, and every offset must lie inside the text.
func FuzzExtract(f *testing.F) {
	for _, s := range []string{
		"Annual members were nearly 1.5 times as likely to renew (95% CI 0.92–1.51).",
		"Renewals rose 5% from 40% to 45% in Q3 2026; e.g. Store 12 grew, approx. 1,234 loans.",
		"One in four riders, a third of members, twice as many, doubled, three-fold, $1.2M, 1.5x.",
		"p < 0.05, r = −0.31, n = 48, R² = 0.41, t(46) = 2.1, F(2, 45) = 3.1, χ²(2, N = 212) = 4.1.",
		"Most members renewed; nearly all did; none left; few stayed; at most 40% or more.",
		"{{renewals.ratio}} times, {{satisfaction.change}}% and {{spend.predict.2.estimate}}.",
		"1. 2) (3) [4] #5 No. 6 9:30 10am 2026-10-06 6/10/2026 v2.1.3 COVID-19 a 12-week pilot",
		"-", ".", "..5", "5..", "1,2,3", ",000", "$", "%", "−", "1e9", "٣٤", "½", "twenty-", "between 4 and",
	} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, text string) {
		toks := tokenize(text, 0, len(text), nil)
		for _, tk := range toks {
			if tk.start < 0 || tk.end < tk.start || tk.end > len(text) {
				t.Fatalf("token %q at %d–%d outside %d bytes", tk.text, tk.start, tk.end, len(text))
			}
		}
		for _, sp := range splitSentences(text) {
			if sp[0] < 0 || sp[1] < sp[0] || sp[1] > len(text) {
				t.Fatalf("sentence %v outside %d bytes", sp, len(text))
			}
		}
		for _, q := range extract(toks, true) {
			if q.start < 0 || q.end < q.start || q.end > len(text) || q.numStart < q.start || q.numStart > q.end {
				t.Fatalf("quantity %v at %d–%d (number at %d) outside %d bytes", q.val, q.start, q.end, q.numStart, len(text))
			}
			if q.tok < 0 || q.tokEnd < q.tok || q.tokEnd > len(toks) {
				t.Fatalf("quantity tokens %d–%d outside %d", q.tok, q.tokEnd, len(toks))
			}
		}
		in := input(text, ctxRenewals, ctxSatisfaction, ctxSpend, ctxModes, ctxWaits)
		for _, fd := range Run(in) {
			if fd.Offset < 0 || fd.End < fd.Offset || fd.End > len(in.Source) {
				t.Fatalf("finding %s at %d–%d outside %d bytes", fd.Rule, fd.Offset, fd.End, len(in.Source))
			}
			if fd.Line < 1 || fd.Col < 1 || fd.EndLine < fd.Line {
				t.Fatalf("finding %s at %d:%d–%d:%d", fd.Rule, fd.Line, fd.Col, fd.EndLine, fd.EndCol)
			}
		}
	})
}
