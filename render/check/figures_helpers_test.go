package check

import (
	"testing"

	"candor/blocks"
	"candor/figures"
)

// figCase is one block's figure for the figure rules' table tests.
type figCase struct {
	name   string
	blocks []Block
}

func fig(kind figures.Kind, cats []string, vals ...float64) *figures.Spec {
	return &figures.Spec{Kind: kind, Categories: cats, Series: []figures.Series{{Name: "", Values: vals}}}
}

func geom(kind figures.Kind, lo, hi, lie float64, hasLie bool) *figures.Geometry {
	return &figures.Geometry{Kind: kind, AxisMin: lo, AxisMax: hi, LieFactor: lie, HasLie: hasLie}
}

func figBlock(id, analysis string, meta blocks.Meta, spec *figures.Spec, g *figures.Geometry) Block {
	b := block(id, analysis, 3, meta, facts(id, "n=100#"), spec)
	b.Figure = g
	return b
}

func figureTable(t *testing.T, rule string, flag, clean []figCase) {
	t.Helper()
	if len(flag) < 12 || len(clean) < 12 {
		t.Errorf("%s: the table needs at least 12 cases each way, has %d and %d", rule, len(flag), len(clean))
	}
	count := func(c figCase) []Finding {
		var out []Finding
		for _, f := range Run(Input{File: "report.md", Blocks: c.blocks}) {
			if f.Rule == rule {
				out = append(out, f)
			}
		}
		return out
	}
	for _, c := range flag {
		fs := count(c)
		if len(fs) == 0 {
			t.Errorf("%s: not flagged: %s", rule, c.name)
		} else if fs[0].Line != 3 {
			t.Errorf("%s: %s: finding at line %d, want the block's line 3", rule, c.name, fs[0].Line)
		} else if testing.Verbose() {
			t.Logf("%s: %s → %s", rule, c.name, fs[0].Message)
		}
	}
	for _, c := range clean {
		if fs := count(c); len(fs) > 0 {
			t.Errorf("%s: flagged but clean: %s: %s", rule, c.name, fs[0].Message)
		}
	}
}

var cats3 = []string{"North", "South", "East"}
