package main

import (
	"bufio"
	"io"
	"net/http"
	"net/http/httptest"
	"os"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/fsnotify/fsnotify"

	"candor/render"
)

// TestWatchRebuilds: the served page is the report with a reload script;
// saving the report rebuilds it and tells the page to reload.
func TestWatchRebuilds(t *testing.T) {
	p := setup(t, "First version: {{v.n}} visits.")
	w := &watcher{path: p, out: io.Discard, opts: render.Options{}}
	w.changed = sync.NewCond(&w.mu)
	w.rebuild()
	fw, err := fsnotify.NewWatcher()
	if err != nil {
		t.Fatal(err)
	}
	defer fw.Close()
	w.watchDirs(fw)
	go w.loop(fw)
	srv := httptest.NewServer(w.handler())
	defer srv.Close()

	get := func() string {
		resp, err := http.Get(srv.URL + "/")
		if err != nil {
			t.Fatal(err)
		}
		defer resp.Body.Close()
		b, _ := io.ReadAll(resp.Body)
		return string(b)
	}
	page := get()
	if !strings.Contains(page, "First version: 4 visits.") || !strings.Contains(page, "EventSource") {
		t.Fatal("the served page lacks the report or the reload script")
	}
	resp, err := http.Get(srv.URL + "/events")
	if err != nil {
		t.Fatal(err)
	}
	defer resp.Body.Close()
	got := make(chan string, 1)
	go func() {
		line, _ := bufio.NewReader(resp.Body).ReadString('\n')
		got <- line
	}()
	time.Sleep(100 * time.Millisecond)
	src, _ := os.ReadFile(p)
	if err := os.WriteFile(p, []byte(strings.Replace(string(src), "First", "Second", 1)), 0o644); err != nil {
		t.Fatal(err)
	}
	select {
	case line := <-got:
		if line != "data: reload\n" {
			t.Errorf("event %q", line)
		}
	case <-time.After(10 * time.Second):
		t.Fatal("no reload event after the report changed")
	}
	if !strings.Contains(get(), "Second version: 4 visits.") {
		t.Error("the page was not rebuilt")
	}
	// A broken save serves the error, not a stale page.
	if err := os.WriteFile(p, []byte(strings.Replace(string(src), "{{v.n}}", "{{v.nn}}", 1)), 0o644); err != nil {
		t.Fatal(err)
	}
	deadline := time.Now().Add(10 * time.Second)
	for time.Now().Before(deadline) {
		if strings.Contains(get(), "did not build") {
			return
		}
		time.Sleep(50 * time.Millisecond)
	}
	t.Error("a broken report did not show its error")
}
