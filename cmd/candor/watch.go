package main

import (
	"bytes"
	"fmt"
	"html"
	"io"
	"net"
	"net/http"
	"os"
	"os/signal"
	"path/filepath"
	"sync"
	"time"

	"github.com/fsnotify/fsnotify"

	"candor/render"
	"candor/render/check"
)

// reloadScript is added to the served page only (never to a built file): it
// reloads the page when the server says the report was rebuilt.
const reloadScript = `<script>new EventSource("/events").onmessage=function(){location.reload()};</script>`

// watcher rebuilds a report when it or its data change and serves the
// latest result.
type watcher struct {
	path string
	opts render.Options
	out  io.Writer

	mu      sync.Mutex
	page    []byte
	version int
	files   []string
	changed *sync.Cond
}

func cmdWatch(args []string, stdout, stderr io.Writer) int {
	f, err := parseFlags(args, []string{"addr", "data-root"}, []string{"review"})
	if err != nil {
		return usageError(stderr, "watch", err)
	}
	path, err := f.report()
	if err != nil {
		return usageError(stderr, "watch", err)
	}
	addr := f.values["addr"]
	if addr == "" {
		addr = "127.0.0.1:8080"
	}
	w := &watcher{path: path, out: stderr, opts: render.Options{Set: f.sets, DataRoot: f.values["data-root"], Review: f.bools["review"]}}
	w.changed = sync.NewCond(&w.mu)
	w.rebuild()
	fw, err := fsnotify.NewWatcher()
	if err != nil {
		return fail(stderr, err)
	}
	defer fw.Close()
	w.watchDirs(fw)
	ln, err := net.Listen("tcp", addr)
	if err != nil {
		return fail(stderr, fmt.Errorf("cannot listen on %s: %v", addr, err))
	}
	fmt.Fprintf(stdout, "serving %s at http://%s/ (Ctrl-C stops)\n", path, ln.Addr())
	go w.loop(fw)
	srv := &http.Server{Handler: w.handler(), ReadHeaderTimeout: 5 * time.Second}
	go srv.Serve(ln)
	sig := make(chan os.Signal, 1)
	signal.Notify(sig, os.Interrupt)
	<-sig
	srv.Close()
	return 0
}

// rebuild builds the report and keeps the page to serve: the report, or
// the error that stopped it.
func (w *watcher) rebuild() {
	rep, err := render.Build(w.path, w.opts)
	var page []byte
	files := []string{w.path}
	if err != nil {
		fmt.Fprintln(w.out, err)
		page = []byte("<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><title>candor: build failed</title></head><body style=\"font-family:sans-serif;max-width:50rem;margin:2rem auto\"><h1>The report did not build</h1><pre style=\"white-space:pre-wrap\">" +
			html.EscapeString(err.Error()) + "</pre><p>Fix the report and save it; this page reloads.</p></body></html>")
	} else {
		_ = check.WriteText(w.out, rep.Findings)
		page = rep.HTML
		for _, t := range rep.Tables {
			if t.File != "" {
				files = append(files, filepath.Join(rep.Doc.Dir, t.File))
			}
		}
	}
	page = bytes.Replace(page, []byte("</body>"), []byte(reloadScript+"</body>"), 1)
	w.mu.Lock()
	w.page = page
	w.version++
	w.files = files
	w.mu.Unlock()
	w.changed.Broadcast()
}

func (w *watcher) watchDirs(fw *fsnotify.Watcher) {
	w.mu.Lock()
	files := append([]string(nil), w.files...)
	w.mu.Unlock()
	for _, f := range files {
		fw.Add(filepath.Dir(f))
	}
}

// loop rebuilds after a change to a watched file, waiting for writes to
// settle.
func (w *watcher) loop(fw *fsnotify.Watcher) {
	var timer *time.Timer
	for {
		select {
		case ev, ok := <-fw.Events:
			if !ok {
				return
			}
			if !w.watched(ev.Name) {
				continue
			}
			if timer != nil {
				timer.Stop()
			}
			timer = time.AfterFunc(120*time.Millisecond, func() {
				w.rebuild()
				w.watchDirs(fw)
			})
		case _, ok := <-fw.Errors:
			if !ok {
				return
			}
		}
	}
}

func (w *watcher) watched(name string) bool {
	w.mu.Lock()
	defer w.mu.Unlock()
	abs, _ := filepath.Abs(name)
	for _, f := range w.files {
		if fa, _ := filepath.Abs(f); fa == abs {
			return true
		}
	}
	return false
}

func (w *watcher) handler() http.Handler {
	mux := http.NewServeMux()
	mux.HandleFunc("/", func(rw http.ResponseWriter, r *http.Request) {
		w.mu.Lock()
		page := w.page
		w.mu.Unlock()
		rw.Header().Set("Content-Type", "text/html; charset=utf-8")
		rw.Header().Set("Cache-Control", "no-store")
		rw.Write(page)
	})
	mux.HandleFunc("/events", func(rw http.ResponseWriter, r *http.Request) {
		fl, ok := rw.(http.Flusher)
		if !ok {
			http.Error(rw, "streaming unsupported", http.StatusInternalServerError)
			return
		}
		rw.Header().Set("Content-Type", "text/event-stream")
		rw.Header().Set("Cache-Control", "no-store")
		fl.Flush()
		w.mu.Lock()
		seen := w.version
		w.mu.Unlock()
		done := r.Context().Done()
		next := make(chan struct{})
		go func() {
			w.mu.Lock()
			for w.version == seen {
				w.changed.Wait()
			}
			w.mu.Unlock()
			close(next)
		}()
		select {
		case <-next:
			fmt.Fprint(rw, "data: reload\n\n")
			fl.Flush()
		case <-done:
			// The goroutine waiting on changed ends at the next rebuild.
		}
	})
	return mux
}
