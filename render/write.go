package render

import (
	"fmt"
	"os"
	"path/filepath"
	"sort"
	"strings"
)

// WriteFile writes data to path atomically: to a temporary file in the same
// folder, then renamed over path, so a reader never sees half a file and a
// failed build leaves the previous output untouched.
func WriteFile(path string, data []byte) error {
	dir := filepath.Dir(path)
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".tmp-*")
	if err != nil {
		return err
	}
	name := tmp.Name()
	_, werr := tmp.Write(data)
	if werr == nil {
		werr = tmp.Sync()
	}
	cerr := tmp.Close()
	if werr == nil {
		werr = cerr
	}
	if werr == nil {
		werr = os.Chmod(name, 0o644)
	}
	if werr == nil {
		werr = os.Rename(name, path)
	}
	if werr != nil {
		os.Remove(name)
		return werr
	}
	return nil
}

// WriteFigures writes each figure as its own SVG file into dir, named
// after the report and the block (report-ID.svg), for slides. It returns the
// files written.
func (r *Report) WriteFigures(dir string) ([]string, error) {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return nil, err
	}
	stem := strings.TrimSuffix(baseName(r.Doc.File), filepath.Ext(r.Doc.File))
	ids := make([]string, 0, len(r.Figures))
	for id := range r.Figures {
		ids = append(ids, id)
	}
	sort.Strings(ids)
	var out []string
	for _, id := range ids {
		f := r.Figures[id]
		p := filepath.Join(dir, fmt.Sprintf("%s-%s.svg", stem, id))
		data := append([]byte(`<?xml version="1.0" encoding="UTF-8"?>`+"\n"), f.SVG...)
		if err := WriteFile(p, data); err != nil {
			return out, err
		}
		out = append(out, p)
	}
	return out, nil
}
