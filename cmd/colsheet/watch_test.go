package main

import (
	"bytes"
	"context"
	"encoding/json"
	"io"
	"net/http"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"
)

// lockedBuffer is a buffer written by the watch's goroutines and read by the test.
type lockedBuffer struct {
	mu sync.Mutex
	b  bytes.Buffer
}

func (l *lockedBuffer) Write(p []byte) (int, error) {
	l.mu.Lock()
	defer l.mu.Unlock()
	return l.b.Write(p)
}

func (l *lockedBuffer) String() string {
	l.mu.Lock()
	defer l.mu.Unlock()
	return l.b.String()
}

// Watch serves the package over HTTP on the loopback interface: the first run writes it, the
// index page carries the reload script (added while serving, not in the file), an edit of the
// input is designed again and counted, a bad input keeps the last good package and reports its
// faults, and a stop ends it cleanly (common practice, no source).
func TestWatch(t *testing.T) {
	if testing.Short() {
		t.Skip("designs the demo three times")
	}
	dir := t.TempDir()
	src, err := os.ReadFile(demoInput)
	if err != nil {
		t.Fatal(err)
	}
	in := filepath.Join(dir, "in.yaml")
	os.WriteFile(in, src, 0o644)
	out := filepath.Join(dir, "out")
	o := newOptions("design")
	o.input, o.out, o.replace, o.quiet = in, out, true, true
	w := newWatcher(o)
	ctx, cancel := context.WithCancel(context.Background())
	defer cancel()
	var logs lockedBuffer
	addrs, done := make(chan string, 1), make(chan int, 1)
	go func() { done <- w.serve(ctx, "127.0.0.1:0", &logs, &logs, func(a string) { addrs <- a }) }()
	var base string
	select {
	case a := <-addrs:
		base = "http://" + a
	case code := <-done:
		t.Fatalf("watch ended at once: exit %d\n%s", code, logs.String())
	case <-time.After(10 * time.Second):
		t.Fatal("watch does not serve")
	}
	client := &http.Client{Timeout: 10 * time.Second}
	get := func(path string) (int, string, string) {
		t.Helper()
		resp, err := client.Get(base + path)
		if err != nil {
			t.Fatalf("GET %s: %v", path, err)
		}
		defer resp.Body.Close()
		b, _ := io.ReadAll(resp.Body)
		return resp.StatusCode, resp.Request.URL.Path, string(b)
	}
	waitRun := func(n int) watchStatus {
		t.Helper()
		deadline := time.Now().Add(60 * time.Second)
		for time.Now().Before(deadline) {
			_, _, body := get("/status")
			var s watchStatus
			if err := json.Unmarshal([]byte(body), &s); err != nil {
				t.Fatalf("/status: %v: %s", err, body)
			}
			if s.Run >= n && !s.Running {
				return s
			}
			time.Sleep(100 * time.Millisecond)
		}
		t.Fatalf("run %d not done in 60 s\n%s", n, logs.String())
		return watchStatus{}
	}

	if s := waitRun(1); s.Run != 1 || s.Code != 0 {
		t.Fatalf("first run: %+v", s)
	}
	code, path, page := get("/")
	if code != 200 || path != "/html/index.html" || !strings.Contains(page, "var served = 1;") || !strings.Contains(page, `fetch("/status"`) {
		t.Fatalf("index: %d at %s, without the reload script of run 1", code, path)
	}
	onDisk, _ := os.ReadFile(filepath.Join(out, "html", "index.html"))
	if bytes.Contains(onDisk, []byte("/status")) || !strings.HasSuffix(strings.TrimSpace(string(onDisk)), "</html>") {
		t.Error("the script is in the file on disk")
	}
	if code, _, _ := get("/.colsheet-output"); code != 404 {
		t.Errorf("the marker is served: %d", code)
	}
	if code, _, body := get("/results.json"); code != 200 || !strings.HasPrefix(body, `{"tool":`) {
		t.Errorf("results.json: %d", code)
	}
	req, _ := http.NewRequest("GET", base+"/html/index.html", nil)
	req.Host = "colsheet.example.com"
	if resp, err := client.Do(req); err != nil {
		t.Error(err)
	} else if resp.Body.Close(); resp.StatusCode != http.StatusForbidden {
		t.Errorf("a request for another host name: %d", resp.StatusCode)
	}

	// An edit: designed again, the counter moves on, the pages say so.
	edited := strings.Replace(string(src), "NEd: 3380 kN", "NEd: 3480 kN", 1) + "# edited\n"
	os.WriteFile(in, []byte(edited), 0o644)
	if s := waitRun(2); s.Run != 2 || s.Code != 0 {
		t.Fatalf("after the edit: %+v", s)
	}
	if _, _, page := get("/html/index.html"); !strings.Contains(page, "var served = 2;") {
		t.Error("the page of run 2 does not know its run")
	}
	if r := resultsOf(t, out)["C4/GF"]; r[0] != 3480 {
		t.Errorf("after the edit, NEd of C4/GF is %g kN", r[0])
	}

	// A bad input: its faults in the status (so in the pages) and the log; the package stays.
	os.WriteFile(in, []byte(strings.Replace(edited, "b: 400 mm", "b: 3.6 kN", 1)), 0o644)
	s := waitRun(3)
	if s.Code != 2 || !strings.Contains(s.Log, in+":") || !strings.Contains(s.Log, "expected a length") {
		t.Errorf("bad input: %+v", s)
	}
	if r := resultsOf(t, out)["C4/GF"]; r[0] != 3480 {
		t.Errorf("the last good package is gone: NEd %g", r[0])
	}
	if code, _, page := get("/html/index.html"); code != 200 || !strings.Contains(page, "var served = 3;") {
		t.Errorf("the last good index after a bad run: %d", code)
	}

	cancel()
	select {
	case code := <-done:
		if code != 0 {
			t.Errorf("stopped: exit %d", code)
		}
	case <-time.After(30 * time.Second):
		t.Fatal("watch does not stop")
	}
	if _, err := client.Get(base + "/status"); err == nil {
		t.Error("still served after the stop")
	}
	if !strings.Contains(logs.String(), "in.yaml changed; designing again") || !strings.Contains(logs.String(), "colsheet watch: stopped") {
		t.Errorf("log:\n%s", logs.String())
	}
}

// Watch serves on a loopback address only.
func TestLoopback(t *testing.T) {
	for _, c := range []struct{ addr, want string }{
		{"127.0.0.1:8080", "127.0.0.1:8080"}, {"localhost:0", "127.0.0.1:0"}, {"[::1]:80", "[::1]:80"}, {"127.0.0.2:80", "127.0.0.2:80"},
		{"0.0.0.0:80", ""}, {":80", ""}, {"example.com:80", ""}, {"10.0.0.1:80", ""}, {"127.0.0.1", ""}, {"127.0.0.1:http", ""},
	} {
		got, err := loopback(c.addr)
		if got != c.want || (err == nil) != (c.want != "") {
			t.Errorf("%s: %q, %v; want %q", c.addr, got, err, c.want)
		}
	}
}

// The reload script goes before the page's last </body>, or at its end where it has none.
func TestInjectReload(t *testing.T) {
	page := injectReload([]byte("<html><body><p>x</p></BODY></html>"), 7)
	if !bytes.HasPrefix(page, []byte("<html><body><p>x</p><script>")) || !bytes.HasSuffix(page, []byte("</script>\n</BODY></html>")) ||
		!bytes.Contains(page, []byte("var served = 7;")) {
		t.Errorf("%s", page)
	}
	if page := injectReload([]byte("plain"), 1); !bytes.HasPrefix(page, []byte("plain<script>")) {
		t.Errorf("%s", page)
	}
}

// A signal calls the stopper once; without one it is left to end the process.
func TestStopper(t *testing.T) {
	calls := 0
	setStopper(func() { calls++ })
	if !stopWatch() || stopWatch() || calls != 1 {
		t.Errorf("stopper called %d times", calls)
	}
	setStopper(nil)
	if stopWatch() {
		t.Error("a stopper without one set")
	}
}
