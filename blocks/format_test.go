package blocks

import (
	"math"
	"testing"
)

// TestFormat checks the display rules of FORMAT.md section 4 (the project's
// contract): percentages with one decimal and %, counts with thousands
// separators, p-values as "< 0.001" or three decimals, other values with
// three significant digits, |N forcing N decimals.
func TestFormat(t *testing.T) {
	cases := []struct {
		f    Fact
		dec  int
		want string
	}{
		{Fact{Value: 42.46, Kind: Percent}, -1, "42.5%"},
		{Fact{Value: 100, Kind: Percent}, -1, "100.0%"},
		{Fact{Value: 0.04, Kind: Percent}, -1, "0.0%"},
		{Fact{Value: 2904, Kind: Count}, -1, "2,904"},
		{Fact{Value: 1234567, Kind: Count}, -1, "1,234,567"},
		{Fact{Value: 12, Kind: Count}, -1, "12"},
		{Fact{Value: 0.0004, Kind: PValue}, -1, "< 0.001"},
		{Fact{Value: 0.0234, Kind: PValue}, -1, "0.023"},
		{Fact{Value: 0.05, Kind: PValue}, -1, "0.050"},
		{Fact{Value: 1.1834, Kind: Ratio}, -1, "1.18"},
		{Fact{Value: 13.545884, Kind: Number}, -1, "13.5"},
		{Fact{Value: 0.0727, Kind: Number}, -1, "0.0727"},
		{Fact{Value: 1234.5, Kind: Number}, -1, "1,230"},
		{Fact{Value: 9.996, Kind: Number}, -1, "10.0"},
		{Fact{Value: -0.0398, Kind: Number}, -1, "-0.0398"},
		{Fact{Value: -0.0001, Kind: Number}, 2, "0.00"},
		{Fact{Value: 0, Kind: Number}, -1, "0"},
		{Fact{Value: 15.1, Kind: Points}, -1, "15.1"},
		{Fact{Value: 13.545884, Kind: Number}, 2, "13.55"},
		{Fact{Value: 42.46, Kind: Percent}, 0, "42%"},
		{Fact{Value: 2904.4, Kind: Count}, 1, "2,904.4"},
		{Fact{Value: math.NaN(), Kind: Number, Undefined: "no values"}, -1, "undefined"},
	}
	for _, c := range cases {
		if got := Format(c.f, c.dec); got != c.want {
			t.Errorf("Format(%v %s, %d) = %q, want %q", c.f.Value, c.f.Kind, c.dec, got, c.want)
		}
	}
}

func TestFactsSetUndefined(t *testing.T) {
	fs := Facts{}
	fs.Set("a.ratio", math.Inf(1), Ratio, "no successes in the reference group")
	f := fs["a.ratio"]
	if f.Defined() || f.Undefined != "no successes in the reference group" || !math.IsNaN(f.Value) {
		t.Errorf("an infinite ratio became %+v", f)
	}
	fs.Set("a.mean", math.NaN(), Number, "")
	if fs["a.mean"].Defined() || fs["a.mean"].Undefined == "" {
		t.Errorf("NaN without a reason became %+v", fs["a.mean"])
	}
}

func TestSlug(t *testing.T) {
	for in, want := range map[string]string{
		"Station Road": "station_road", "2026-Q3": "2026_q3", "  Old--Town ": "old_town",
		"[10, 20)": "10_20", "Café Crème": "café_crème", "%": "blank", "yes": "yes",
	} {
		if got := Slug(in); got != want {
			t.Errorf("Slug(%q) = %q, want %q", in, got, want)
		}
	}
}

func TestSuggest(t *testing.T) {
	names := []string{"store", "visits", "spend", "member"}
	if got := Suggest("visit", names); got != `; did you mean "visits"?` {
		t.Errorf("Suggest(visit) = %q", got)
	}
	if got := Suggest("Store", names); got != `; did you mean "store"?` {
		t.Errorf("Suggest(Store) = %q", got)
	}
	if got := Suggest("zzzzzz", names); got != "" {
		t.Errorf("Suggest(zzzzzz) = %q, want nothing", got)
	}
}
