package render

import (
	"strings"
	"testing"

	"candor/render/check"
)

// TestCheckInput checks what the checker is given: every piece of prose
// outside code, with exact source offsets, its section, the block that
// directly precedes it, inline values and acknowledgments.
func TestCheckInput(t *testing.T) {
	report := front + "Intro with *emphasis* and `code`.\n\n" +
		"## Visits\n\n" +
		"```candor v\nsummary: visits\ncaption: Mean {{v.mean}} visits.\n```\n\n" +
		"<!-- candor: allow number the mean is rounded on purpose -->\n" +
		"The mean was {{v.mean|1}} visits\nacross {{v.n}} stores.\n\n" +
		"- one item says 40%\n- ~~struck 99%~~ kept\n\n" +
		"| store | visits |\n| --- | --- |\n| North | 12 |\n\n" +
		"```\nplain code 50%\n```\n\n" +
		"## Second\n\nLast words.\n"
	path := writeReport(t, report, map[string]string{"data/shop.csv": shopCSV})
	rep, err := Build(path, Options{NoHTML: true})
	if err != nil {
		t.Fatal(err)
	}
	in := rep.checkInput()
	src := string(in.Source)
	type want struct {
		kind    string
		section int
		prev    string
		text    string
		allow   string
	}
	wants := []want{
		{"paragraph", 0, "", "Intro with emphasis and code.", ""},
		{"heading", 1, "", "Visits", ""},
		{"paragraph", 1, "v", "The mean was 11.0 visits across 4 stores.", "number"},
		{"item", 1, "", "one item says 40%", ""},
		{"item", 1, "", " kept", ""},
		{"cell", 1, "", "store", ""},
		{"cell", 1, "", "visits", ""},
		{"cell", 1, "", "North", ""},
		{"cell", 1, "", "12", ""},
		{"heading", 2, "", "Second", ""},
		{"paragraph", 2, "", "Last words.", ""},
		{"caption", 1, "v", "Mean 11.0 visits.", ""},
	}
	if len(in.Units) != len(wants) {
		for _, u := range in.Units {
			t.Logf("%s %d %q", u.Kind, u.Section, unitText(u))
		}
		t.Fatalf("%d units, want %d", len(in.Units), len(wants))
	}
	for i, w := range wants {
		u := in.Units[i]
		if u.Kind != w.kind || u.Section != w.section || u.Prev != w.prev || unitText(u) != w.text {
			t.Errorf("unit %d = %s/%d/%q %q, want %s/%d/%q %q", i, u.Kind, u.Section, u.Prev, unitText(u), w.kind, w.section, w.prev, w.text)
		}
		if w.allow != "" && (len(u.Allow) != 1 || u.Allow[0].Rule != w.allow || u.Allow[0].Reason != "the mean is rounded on purpose") {
			t.Errorf("unit %d allow = %+v", i, u.Allow)
		}
		if w.allow == "" && len(u.Allow) > 0 {
			t.Errorf("unit %d has an allow it should not: %+v", i, u.Allow)
		}
		for _, p := range u.Parts {
			got := src[p.Offset : p.Offset+p.SrcLen]
			switch {
			case p.Ref != "":
				if !strings.HasPrefix(got, "{{"+p.Ref) || !strings.HasSuffix(got, "}}") {
					t.Errorf("inline value %s covers %q", p.Ref, got)
				}
			case p.SrcLen > 0 && got != p.Text:
				t.Errorf("part %q sits over %q in the source", p.Text, got)
			}
		}
	}
	if len(in.Blocks) != 1 || in.Blocks[0].Section != 1 || in.Blocks[0].Figure == nil {
		t.Errorf("blocks: %+v", in.Blocks)
	}
}

func unitText(u check.Unit) string {
	var b strings.Builder
	for _, p := range u.Parts {
		b.WriteString(p.Text)
	}
	return b.String()
}
