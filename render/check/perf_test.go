package check

import (
	"strings"
	"testing"
	"time"
)

// TestLongParagraph guards against slow paths: a long paragraph of claims
// must be checked quickly.
func TestLongParagraph(t *testing.T) {
	for _, unit := range []string{
		"Annual members renewed at 41% in Q3, against 38% for monthly members, 1.5 times as likely. ",
		"1 2 3 4 5 6 7 8 9 10 ",
		"rose fell more than less higher than lower ",
		"the the the the ",
		"1-2-3-4-5-6-7-8 ",
		"((((((((( ",
	} {
		text := strings.Repeat(unit, 400)
		start := time.Now()
		Run(input(text, ctxRenewals, ctxSatisfaction, ctxSpend, ctxModes, ctxWaits))
		if d := time.Since(start); d > 3*time.Second {
			t.Errorf("%q ×400 took %v", unit, d)
		}
	}
}
