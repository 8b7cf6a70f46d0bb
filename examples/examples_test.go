// Package examples holds candor's demo reports. Its tests build every one
// of them and open the result in headless Chromium.
package examples_test

import (
	"bytes"
	"context"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/cdproto/runtime"
	"github.com/chromedp/chromedp"

	"candor/render"
)

// reports lists every example report.
func reports(t *testing.T) []string {
	t.Helper()
	paths, err := filepath.Glob("*/report.md")
	if err != nil || len(paths) == 0 {
		t.Fatalf("no example reports found (%v)", err)
	}
	return paths
}

// TestExamplesBuildClean: every example builds with no findings, and two
// builds give byte-identical HTML.
func TestExamplesBuildClean(t *testing.T) {
	for _, p := range reports(t) {
		t.Run(filepath.Dir(p), func(t *testing.T) {
			a, err := render.Build(p, render.Options{})
			if err != nil {
				t.Fatal(err)
			}
			for _, f := range a.Findings {
				if !f.Allowed {
					t.Errorf("%s:%d:%d: %s %s: %s", f.File, f.Line, f.Col, f.Severity, f.Rule, f.Message)
				}
			}
			b, err := render.Build(p, render.Options{})
			if err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(a.HTML, b.HTML) {
				t.Error("two builds of the same report differ")
			}
			if len(a.Figures) == 0 {
				t.Error("the example draws no figure")
			}
			if bytes.Contains(a.HTML, []byte("http://")) || bytes.Contains(a.HTML, []byte("https://")) {
				for _, line := range bytes.Split(a.HTML, []byte("\n")) {
					if bytes.Contains(line, []byte("src=\"http")) || bytes.Contains(line, []byte("href=\"http")) || bytes.Contains(line, []byte("url(http")) {
						t.Errorf("the report refers to the network: %s", line)
					}
				}
			}
		})
	}
}

// chromium finds Debian's Chromium. Without it the browser test cannot
// run: it skips on a developer's machine and fails in CI (CI=true), where
// .ci/run installs it.
func chromium(t *testing.T) string {
	for _, name := range []string{"chromium", "chromium-browser", "google-chrome"} {
		if p, err := exec.LookPath(name); err == nil {
			return p
		}
	}
	if os.Getenv("CI") == "true" {
		t.Fatal("chromium is not installed; .ci/run installs Debian's chromium package")
	}
	t.Skip("chromium is not installed (apt-get install chromium); skipping the browser test")
	return ""
}

// figureBox is what the page reports about one figure.
type figureBox struct {
	ID     string  `json:"id"`
	Width  float64 `json:"width"`
	Height float64 `json:"height"`
	Marks  int     `json:"marks"`
}

// TestExamplesInBrowser opens every example in headless Chromium: the page
// must load with no console errors or failed requests, every figure must
// have a non-empty bounding box with drawn marks, and a full-page
// screenshot of each example is written for review (to $CANDOR_SHOTS, or a
// temporary folder whose path the test logs).
func TestExamplesInBrowser(t *testing.T) {
	bin := chromium(t)
	shots := os.Getenv("CANDOR_SHOTS")
	if shots == "" {
		shots = t.TempDir()
	}
	if err := os.MkdirAll(shots, 0o755); err != nil {
		t.Fatal(err)
	}
	opts := append(chromedp.DefaultExecAllocatorOptions[:],
		chromedp.ExecPath(bin),
		chromedp.NoSandbox,
		chromedp.DisableGPU,
		chromedp.Flag("disable-quic", true),
		chromedp.Flag("disable-background-networking", true),
		chromedp.Flag("disable-component-update", true),
		chromedp.Flag("disable-sync", true),
		chromedp.UserDataDir(t.TempDir()),
		chromedp.WindowSize(1100, 1400),
	)
	actx, cancel := chromedp.NewExecAllocator(context.Background(), opts...)
	defer cancel()
	for _, p := range reports(t) {
		name := filepath.Dir(p)
		t.Run(name, func(t *testing.T) {
			rep, err := render.Build(p, render.Options{})
			if err != nil {
				t.Fatal(err)
			}
			html := filepath.Join(t.TempDir(), "report.html")
			if err := os.WriteFile(html, rep.HTML, 0o644); err != nil {
				t.Fatal(err)
			}
			ctx, cancel := chromedp.NewContext(actx)
			defer cancel()
			ctx, cancelT := context.WithTimeout(ctx, 90*time.Second)
			defer cancelT()
			var mu sync.Mutex
			var problems []string
			chromedp.Listen(ctx, func(ev any) {
				mu.Lock()
				defer mu.Unlock()
				switch e := ev.(type) {
				case *runtime.EventConsoleAPICalled:
					if e.Type == runtime.ConsoleAPICalledTypeError || e.Type == runtime.ConsoleAPICalledTypeWarning {
						var args []string
						for _, a := range e.Args {
							args = append(args, string(a.Value))
						}
						problems = append(problems, fmt.Sprintf("console %s: %s", e.Type, strings.Join(args, " ")))
					}
				case *network.EventRequestWillBeSent:
					if u := e.Request.URL; !strings.HasPrefix(u, "file://") && !strings.HasPrefix(u, "data:") {
						problems = append(problems, "network request: "+u)
					}
				case *runtime.EventExceptionThrown:
					problems = append(problems, "exception: "+e.ExceptionDetails.Text)
				}
			})
			if err := chromedp.Do(ctx, chromedp.Navigate("file://"+html), chromedp.WaitReady("body")); err != nil {
				t.Fatal(err)
			}
			boxes, err := chromedp.Run(ctx, chromedp.Evaluate[[]figureBox](`Array.from(document.querySelectorAll("figure svg")).map(s => {
				const r = s.getBoundingClientRect();
				return {id: s.id || s.getAttribute("aria-labelledby") || "", width: r.width, height: r.height,
					marks: s.querySelectorAll("path, rect, circle, line, polyline, polygon, text").length};
			})`))
			if err != nil {
				t.Fatal(err)
			}
			png, err := chromedp.Run(ctx, chromedp.FullScreenshot(80))
			if err != nil {
				t.Fatal(err)
			}
			mu.Lock()
			for _, pr := range problems {
				t.Error(pr)
			}
			mu.Unlock()
			if len(boxes) != len(rep.Figures) {
				t.Errorf("the page shows %d figures, the report drew %d", len(boxes), len(rep.Figures))
			}
			for i, b := range boxes {
				if b.Width < 100 || b.Height < 50 || b.Marks < 3 {
					t.Errorf("figure %d (%s) is %gx%g with %d marks: not visible", i+1, b.ID, b.Width, b.Height, b.Marks)
				}
			}
			out := filepath.Join(shots, name+".jpg")
			if err := os.WriteFile(out, png, 0o644); err != nil {
				t.Fatal(err)
			}
			t.Logf("screenshot: %s", out)
		})
	}
}
