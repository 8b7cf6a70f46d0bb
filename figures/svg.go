package figures

import (
	"bytes"
	"fmt"
	"hash/fnv"
	"html"
	"strings"
)

// Font families written into the SVG: the metrics Draw lays text out with
// (Liberation), then metric-compatible and generic fall-backs. No font data
// is embedded or fetched.
var fontFamilies = []struct{ old, new string }{
	{"font-family:Liberation Sans;", "font-family:'Liberation Sans',Arial,Helvetica,sans-serif;"},
	{"font-family:Liberation Mono;", "font-family:'Liberation Mono','Courier New',monospace;"},
}

// finishSVG turns the document vgsvg writes into an element to inline in
// HTML: no XML prologue, a root with role="img", a viewBox, width="100%",
// aria-labelledby naming a <title> and a <desc> with ids unique to the
// figure, and font-family lists that end in a generic family.
func finishSVG(raw []byte, id, title, desc string) ([]byte, error) {
	start := bytes.Index(raw, []byte("<svg"))
	if start < 0 {
		return nil, fmt.Errorf("figures: the SVG writer gave no <svg> element")
	}
	end := bytes.IndexByte(raw[start:], '>')
	close := bytes.LastIndex(raw, []byte("</svg>"))
	if end < 0 || close < start+end {
		return nil, fmt.Errorf("figures: the SVG writer gave a malformed <svg> element")
	}
	body := raw[start+end+1 : close]
	body = bytes.TrimLeft(body, "\n")
	for _, f := range fontFamilies {
		body = bytes.ReplaceAll(body, []byte(f.old), []byte(f.new))
	}

	prefix := sanitizeID(id)
	if !strings.HasPrefix(prefix, "fig-") {
		prefix = "fig-" + prefix
	}
	if id == "" {
		h := fnv.New32a()
		h.Write(body)
		h.Write([]byte(title))
		h.Write([]byte(desc))
		prefix = fmt.Sprintf("fig-%08x", h.Sum32())
	}
	var b bytes.Buffer
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" class="candor-figure" width="100%%" viewBox="0 0 %g %g" role="img" aria-labelledby="%s-title %s-desc">`+"\n",
		CanvasWidth, CanvasHeight, prefix, prefix)
	fmt.Fprintf(&b, "<title id=\"%s-title\">%s</title>\n", prefix, html.EscapeString(oneLine(title)))
	fmt.Fprintf(&b, "<desc id=\"%s-desc\">%s</desc>\n", prefix, html.EscapeString(oneLine(desc)))
	b.Write(body)
	b.WriteString("</svg>\n")
	return b.Bytes(), nil
}

// sanitizeID keeps letters, digits, '-' and '_' and turns anything else
// into '-'.
func sanitizeID(id string) string {
	var b strings.Builder
	for _, r := range id {
		switch {
		case r >= 'a' && r <= 'z', r >= 'A' && r <= 'Z', r >= '0' && r <= '9', r == '-', r == '_':
			b.WriteRune(r)
		default:
			b.WriteByte('-')
		}
	}
	return b.String()
}

// oneLine collapses white space, so that a title or summary is one line.
func oneLine(s string) string { return strings.Join(strings.Fields(s), " ") }
