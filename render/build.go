package render

import (
	"runtime"
	"sort"
	"strings"
	"sync"

	"github.com/yuin/goldmark/ast"

	"candor/blocks"
	"candor/figures"
	"candor/render/check"
)

// Options tune a build.
type Options struct {
	Set      map[string]string // --set overrides of params
	DataRoot string            // --data-root: the folder tree data files must lie in
	Review   bool              // --review: mark findings in the HTML
	// Getenv reads environment variables for database sources (os.Getenv
	// when nil).
	Getenv func(string) string
	// NoHTML skips writing HTML (check and facts need none).
	NoHTML bool
}

// Report is a built report.
type Report struct {
	Doc      *Document
	Tables   map[string]*blocks.Dataset // loaded sources by name
	Results  []*blocks.Result           // in document order
	Figures  map[string]*figures.Figure
	Facts    blocks.Facts
	Findings []check.Finding
	HTML     []byte
}

// Build runs the whole pipeline on a report file.
func Build(path string, opts Options) (*Report, error) {
	doc, err := Load(path, opts.Set)
	if err != nil {
		return nil, err
	}
	return BuildDoc(doc, opts)
}

// BuildDoc runs the pipeline on a loaded document.
func BuildDoc(doc *Document, opts Options) (*Report, error) {
	r := &Report{Doc: doc, Figures: map[string]*figures.Figure{}, Facts: blocks.Facts{}}
	if err := r.load(opts); err != nil {
		return nil, err
	}
	if err := r.run(); err != nil {
		return nil, err
	}
	if err := r.draw(); err != nil {
		return nil, err
	}
	if err := r.resolveValues(); err != nil {
		return nil, err
	}
	r.Findings = check.Run(r.checkInput())
	if opts.NoHTML {
		return r, nil
	}
	html, err := r.writeHTML(opts.Review)
	if err != nil {
		return nil, err
	}
	r.HTML = html
	return r, nil
}

// load reads every declared source, in parallel.
func (r *Report) load(opts Options) error {
	d := r.Doc
	env := blocks.Env{Dir: d.Dir, Root: opts.DataRoot, Params: d.ParamMap(), Getenv: opts.Getenv}
	for _, s := range d.Blocks {
		if _, err := r.sourceOf(s); err != nil {
			return err
		}
	}
	r.Tables = map[string]*blocks.Dataset{}
	tables := make([]*blocks.Dataset, len(d.Front.Sources))
	errs := make([]error, len(d.Front.Sources))
	parallel(len(d.Front.Sources), func(i int) {
		tables[i], errs[i] = blocks.Load(d.Front.Sources[i], env)
	})
	for i, s := range d.Front.Sources {
		if errs[i] != nil {
			return errs[i]
		}
		r.Tables[s.Name] = tables[i]
	}
	return nil
}

// sourceOf names the source a block reads: its data: key, or the only one.
func (r *Report) sourceOf(s *blocks.Spec) (string, error) {
	srcs := r.Doc.Front.Sources
	var names []string
	for _, x := range srcs {
		names = append(names, x.Name)
	}
	if s.Data != "" {
		if r.Doc.sourceByName(s.Data) == nil {
			if len(names) == 0 {
				return "", blocks.Errorf(s.DataPos, "block %s reads data %q, but the front matter declares no data:", s.ID, s.Data)
			}
			return "", blocks.Errorf(s.DataPos, "block %s reads data %q, which the front matter does not declare%s", s.ID, s.Data, orList(s.Data, names))
		}
		return s.Data, nil
	}
	switch len(srcs) {
	case 0:
		return "", blocks.Errorf(s.Pos, "block %s has no data: declare a source in the front matter, e.g. data: {sales: data/sales.csv}", s.ID)
	case 1:
		return srcs[0].Name, nil
	}
	return "", blocks.Errorf(s.Pos, "block %s must say which source it reads: add data: with one of %s", s.ID, strings.Join(names, ", "))
}

func orList(name string, names []string) string {
	if s := blocks.Suggest(name, names); s != "" {
		return s
	}
	return "; the sources are " + strings.Join(names, ", ")
}

// run computes every block, in parallel; results keep document order. A
// block whose spec, data and parameters the cache has seen is not run
// again (cache.go). With a cache, a block's figure is drawn as soon as its
// result is ready (draw then finds it there), and the blocks that draw
// scatter plots start first, so that a slow figure overlaps the other
// blocks instead of following them.
func (r *Report) run() error {
	d := r.Doc
	params := d.ParamMap()
	c := activeCache()
	r.Results = make([]*blocks.Result, len(d.Blocks))
	errs := make([]error, len(d.Blocks))
	order := longestFirst(d.Blocks)
	parallel(len(d.Blocks), func(j int) {
		i := order[j]
		s := d.Blocks[i]
		key := ""
		if c != nil {
			key = r.blockKey(i)
			if res := c.result(key, s.Pos); res != nil {
				r.Results[i] = res
				return
			}
		}
		name, _ := r.sourceOf(s)
		r.Results[i], errs[i] = blocks.Run(s, r.Tables[name], params)
		if errs[i] != nil || c == nil || key == "" {
			return
		}
		c.putResult(key, r.Results[i])
		if fs := r.Results[i].Figure; fs == nil {
			c.putFigure(key, nil)
		} else if f, err := figures.Draw(*fs); err == nil {
			c.putFigure(key, &f)
		}
	})
	for i, err := range errs {
		if err != nil {
			return err
		}
		r.Facts.Merge(r.Results[i].Facts)
	}
	return nil
}

// draw draws every figure, in parallel, and publishes what was drawn as
// facts: ID.figure.axis_min, ID.figure.axis_max, ID.figure.lie_factor.
// A figure the cache holds is not drawn again.
func (r *Report) draw() error {
	c := activeCache()
	figs := make([]*figures.Figure, len(r.Results))
	errs := make([]error, len(r.Results))
	parallel(len(r.Results), func(i int) {
		res := r.Results[i]
		key := ""
		if c != nil {
			key = r.blockKey(i)
			if f, ok := c.figure(key); ok {
				figs[i] = f
				return
			}
		}
		if res.Figure == nil {
			c.putFigure(key, nil)
			return
		}
		f, err := figures.Draw(*res.Figure)
		if err != nil {
			errs[i] = blocks.Errorf(res.Pos, "block %s: cannot draw its figure: %v", res.ID, err)
			return
		}
		figs[i] = &f
		c.putFigure(key, &f)
	})
	c.prune()
	for i, res := range r.Results {
		if errs[i] != nil {
			return errs[i]
		}
		f := figs[i]
		if f == nil {
			continue
		}
		r.Figures[res.ID] = f
		g := f.Geometry
		if g.HasAxis {
			res.Facts.Set(res.ID+".figure.axis_min", g.AxisMin, blocks.Number, "")
			res.Facts.Set(res.ID+".figure.axis_max", g.AxisMax, blocks.Number, "")
		}
		if g.HasLie {
			res.Facts.Set(res.ID+".figure.lie_factor", g.LieFactor, blocks.Ratio, "")
		}
		r.Facts.Merge(res.Facts)
	}
	return nil
}

// resolveValues checks that every inline value names a fact or parameter.
func (r *Report) resolveValues() error {
	d := r.Doc
	params := d.ParamMap()
	return ast.Walk(d.AST, func(n ast.Node, entering bool) (ast.WalkStatus, error) {
		v, ok := n.(*Value)
		if !ok || !entering {
			return ast.WalkContinue, nil
		}
		if name, isParam := strings.CutPrefix(v.Ref, "params."); isParam {
			if _, ok := params[name]; !ok {
				return ast.WalkStop, blocks.Errorf(d.Pos(v.RefStart), "{{%s}}: the report has no parameter %q%s", v.Ref, name, suggestNames(name, sortedKeys(params)))
			}
			return ast.WalkContinue, nil
		}
		if _, ok := r.Facts[v.Ref]; ok {
			return ast.WalkContinue, nil
		}
		id, _, _ := strings.Cut(v.Ref, ".")
		var ids []string
		for _, res := range r.Results {
			ids = append(ids, res.ID)
		}
		if !contains(ids, id) {
			return ast.WalkStop, blocks.Errorf(d.Pos(v.RefStart), "{{%s}}: there is no block %q%s", v.Ref, id, suggestNames(id, ids))
		}
		names := r.Facts.Block(id).Names()
		near := blocks.Nearest(v.Ref, names, 3)
		hint := ""
		if len(near) > 0 {
			hint = "; nearest: " + strings.Join(near, ", ")
		} else {
			hint = "; `candor facts` lists every fact"
		}
		return ast.WalkStop, blocks.Errorf(d.Pos(v.RefStart), "{{%s}}: block %s has no fact %q%s", v.Ref, id, strings.TrimPrefix(v.Ref, id+"."), hint)
	})
}

func suggestNames(name string, names []string) string {
	if s := blocks.Suggest(name, names); s != "" {
		return s
	}
	if len(names) == 0 {
		return ""
	}
	return "; known: " + strings.Join(names, ", ")
}

func sortedKeys[V any](m map[string]V) []string {
	out := make([]string, 0, len(m))
	for k := range m {
		out = append(out, k)
	}
	sort.Strings(out)
	return out
}

// valueText is how an inline value reads in the report.
func (r *Report) valueText(v *Value) string {
	if name, isParam := strings.CutPrefix(v.Ref, "params."); isParam {
		return r.Doc.ParamMap()[name]
	}
	f, ok := r.Facts[v.Ref]
	if !ok {
		return "{{" + v.Ref + "}}"
	}
	return blocks.Format(f, v.Decimals)
}

// parallel runs f(0..n-1) on up to GOMAXPROCS goroutines.
func parallel(n int, f func(i int)) {
	workers := runtime.GOMAXPROCS(0)
	if workers > n {
		workers = n
	}
	if workers <= 1 {
		for i := 0; i < n; i++ {
			f(i)
		}
		return
	}
	var wg sync.WaitGroup
	next := make(chan int)
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				f(i)
			}
		}()
	}
	for i := 0; i < n; i++ {
		next <- i
	}
	close(next)
	wg.Wait()
}
