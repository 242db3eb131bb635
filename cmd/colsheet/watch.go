package main

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"html"
	"io"
	"io/fs"
	"net"
	"net/http"
	"os"
	"path"
	"path/filepath"
	"runtime/debug"
	"strconv"
	"strings"
	"sync"
	"time"

	"colsheet/calc/model"

	"gopkg.in/yaml.v3"
)

// pollEvery is how often watch looks at the input's files for a change.
const pollEvery = 300 * time.Millisecond

// watchFlags returns the flags of watch, setting o and addr.
func watchFlags(o *options, addr *string) *flagSet {
	f := newFlagSet("watch")
	outputFlags(f, o, "write the package into the folder `DIR` after each good run, replacing the last (required)", false)
	f.Var(onlyFlag{&o.only}, "only", "write only these `IDS`: columns (B2,C3) or lifts (B2/L1), comma-separated")
	f.StringVar(addr, "addr", "127.0.0.1:8080", "serve the package's HTML at `HOST:PORT`, a loopback address only (port 0: any free port)")
	return f
}

const watchLong = `Watch designs INPUT.yaml as design does, writes the package into DIR and serves DIR's HTML
at http://HOST:PORT/ on the loopback interface only. It looks at the input (and its actions
table) every 0.3 s and designs again when either changes: each good run replaces the package
(as --replace does) and the open pages reload themselves. When the input has faults, they are
printed on the terminal and shown in the pages, and the last good package stays in DIR. Ctrl-C
stops it (a second Ctrl-C during a run stops it at once; the last good package stays whole).
`

const watchExit = `Exit status: 0 stopped by Ctrl-C, 2 usage, or the address cannot be served.`

// runWatch designs the input on every change and serves the package's HTML until stopped.
func runWatch(args []string, stdout, stderr io.Writer) int {
	o := newOptions("design")
	addr := ""
	rest, code, done := parseCommand("watch", watchFlags(&o, &addr), args, stdout, stderr)
	if done {
		return code
	}
	if err := o.inputAndOut(rest); err != nil {
		return failUsage(stderr, "watch", err)
	}
	host, err := loopback(addr)
	if err != nil {
		return failUsage(stderr, "watch", err)
	}
	w := newWatcher(o)
	ctx, cancel := context.WithCancel(context.Background())
	defer cancel()
	setStopper(func() {
		if w.busy() {
			fmt.Fprintln(stderr, "colsheet watch: stopping once the run under way is written (Ctrl-C again to stop at once)")
		}
		cancel()
	})
	defer setStopper(nil)
	return w.serve(ctx, host, stdout, stderr, nil)
}

// loopback returns the address addr (HOST:PORT) to listen on, refusing any but a loopback one.
func loopback(addr string) (string, error) {
	host, port, err := net.SplitHostPort(addr)
	if err != nil {
		return "", usagef("--addr: %q is not HOST:PORT, e.g. 127.0.0.1:8080", addr)
	}
	if _, err := strconv.ParseUint(port, 10, 16); err != nil {
		return "", usagef("--addr: %q is not a port number", port)
	}
	if host == "localhost" {
		host = "127.0.0.1"
	}
	if ip := net.ParseIP(host); ip == nil || !ip.IsLoopback() {
		return "", usagef("--addr: %q is not a loopback address: watch serves on this machine only (127.0.0.1:PORT or [::1]:PORT)", addr)
	}
	return net.JoinHostPort(host, port), nil
}

// watcher is the state of a watch: its options and the outcome of its runs.
type watcher struct {
	o     options
	mu    sync.Mutex
	st    watchStatus
	table string // the actions table the input names, "" when none (or not known yet)
}

// watchStatus is what /status answers: the runs done, whether one is under way, the exit status
// of the last and what it printed.
type watchStatus struct {
	Run     int    `json:"run"`
	Running bool   `json:"running"`
	Code    int    `json:"code"`
	Log     string `json:"log"`
}

// newWatcher returns the watcher of the run o.
func newWatcher(o options) *watcher { return &watcher{o: o} }

// busy reports whether a run is under way.
func (w *watcher) busy() bool {
	w.mu.Lock()
	defer w.mu.Unlock()
	return w.st.Running
}

// status returns the outcome of the runs so far.
func (w *watcher) status() watchStatus {
	w.mu.Lock()
	defer w.mu.Unlock()
	return w.st
}

// serve listens at addr, runs the design once and again on every change of the input's files,
// and serves the package until ctx ends; ready, when set, is given the address served.
func (w *watcher) serve(ctx context.Context, addr string, stdout, stderr io.Writer, ready func(addr string)) int {
	ln, err := net.Listen("tcp", addr)
	if err != nil {
		fmt.Fprintf(stderr, "colsheet watch: cannot serve at %s: %v\n", addr, plainErr(err))
		return 2
	}
	srv := &http.Server{Handler: w.handler(), ReadHeaderTimeout: 10 * time.Second}
	go srv.Serve(ln)
	defer srv.Close()
	fmt.Fprintf(stdout, "colsheet watch: %s into %s, served at http://%s/ (Ctrl-C to stop)\n", w.o.input, w.o.out, ln.Addr())
	if ready != nil {
		ready(ln.Addr().String())
	}
	seen := stamps{}
	seen.take(w.files())
	w.build(stdout, stderr)
	seen.take(w.files()) // an actions table named for the first time
	tick := time.NewTicker(pollEvery)
	defer tick.Stop()
	for {
		select {
		case <-ctx.Done():
			fmt.Fprintln(stdout, "colsheet watch: stopped")
			return 0
		case <-tick.C:
		}
		if changed := seen.changed(w.files()); changed != "" {
			fmt.Fprintf(stdout, "colsheet watch: %s changed; designing again\n", changed)
			w.build(stdout, stderr)
			seen.take(w.files())
		}
	}
}

// files returns the files the run reads: the input and its actions table.
func (w *watcher) files() []string {
	w.mu.Lock()
	defer w.mu.Unlock()
	if w.table == "" {
		return []string{w.o.input}
	}
	return []string{w.o.input, w.table}
}

// stamp is the size and time of change of a file, or that it is missing.
type stamp struct {
	size, mod int64
	missing   bool
}

// stamps are the stamps of files, by name.
type stamps map[string]stamp

// stampOf returns the stamp of the file name now.
func stampOf(name string) stamp {
	st, err := os.Stat(name)
	if err != nil {
		return stamp{missing: true}
	}
	return stamp{size: st.Size(), mod: st.ModTime().UnixNano()}
}

// take records the stamps of those files that s does not hold yet.
func (s stamps) take(files []string) {
	for _, f := range files {
		if _, ok := s[f]; !ok {
			s[f] = stampOf(f)
		}
	}
}

// changed returns the first of files whose stamp differs from the one recorded, which it then
// records, with every other file's; "" when none changed.
func (s stamps) changed(files []string) string {
	first := ""
	for _, f := range files {
		now := stampOf(f)
		if old, ok := s[f]; !ok || old != now {
			if first == "" {
				first = f
			}
			s[f] = now
		}
	}
	return first
}

// build runs the design once, as design --replace does, and records its outcome and what it
// printed (on stdout and stderr as well).
func (w *watcher) build(stdout, stderr io.Writer) {
	w.mu.Lock()
	w.st.Running = true
	w.mu.Unlock()
	var log bytes.Buffer
	code := w.once(io.MultiWriter(stdout, &log), io.MultiWriter(stderr, &log))
	w.mu.Lock()
	w.st = watchStatus{Run: w.st.Run + 1, Code: code, Log: log.String()}
	w.mu.Unlock()
}

// once reads, designs and writes the input, and returns the exit status design would; a panic
// is an internal error (4), after which watch goes on.
func (w *watcher) once(stdout, stderr io.Writer) (code int) {
	defer func() {
		if p := recover(); p != nil {
			temps.removeAll(false)
			fmt.Fprintf(stderr, "colsheet: internal error, please report: %v\n(temporary files removed; the last package is left as it was)\n%s", p, debug.Stack())
			code = 4
		}
	}()
	in, data, err := loadInput(w.o.input, stderr)
	w.learnTable(in, data)
	if err != nil {
		fmt.Fprintln(stderr, err)
		return 2
	}
	j, err := produce(w.o, in, data, stderr)
	if err != nil {
		return failRun(stderr, "watch", err)
	}
	return deliver(w.o, j, nil, stdout, stderr)
}

// learnTable records the actions table that the input names: from the input read, or where it
// has faults, from the actions key of its text.
func (w *watcher) learnTable(in *model.Input, data []byte) {
	name := ""
	switch {
	case in != nil && in.Actions != nil:
		name = in.Actions.Name
	case in == nil && data != nil:
		var top struct {
			Actions string `yaml:"actions"`
		}
		if yaml.Unmarshal(data, &top) != nil {
			return // keep the table known before
		}
		name = top.Actions
	}
	table := ""
	if name != "" {
		table = filepath.Join(filepath.Dir(w.o.input), filepath.FromSlash(name))
	}
	w.mu.Lock()
	w.table = table
	w.mu.Unlock()
}

// handler serves /status and the files of the output folder, each HTML page with the script
// that reloads it after each run.
func (w *watcher) handler() http.Handler {
	mux := http.NewServeMux()
	mux.HandleFunc("/status", w.serveStatus)
	mux.HandleFunc("/", w.serveFile)
	return localOnly(mux)
}

// localOnly refuses a request whose Host is not a loopback address or localhost, so that no
// other site's page can read the package through a name that points here.
func localOnly(h http.Handler) http.Handler {
	return http.HandlerFunc(func(rw http.ResponseWriter, r *http.Request) {
		host := r.Host
		if name, _, err := net.SplitHostPort(host); err == nil {
			host = name
		}
		host = strings.Trim(host, "[]")
		if ip := net.ParseIP(host); host != "localhost" && (ip == nil || !ip.IsLoopback()) {
			http.Error(rw, "colsheet watch serves this machine only", http.StatusForbidden)
			return
		}
		h.ServeHTTP(rw, r)
	})
}

// serveStatus answers the state of the runs as JSON.
func (w *watcher) serveStatus(rw http.ResponseWriter, r *http.Request) {
	rw.Header().Set("Content-Type", "application/json")
	rw.Header().Set("Cache-Control", "no-store")
	json.NewEncoder(rw).Encode(w.status())
}

// serveFile serves a file of the output folder: an HTML page with the reload script added, the
// others as they are; "/" leads to html/index.html, or to a page of the runs' state while there
// is none. Hidden entries (the marker, folders being written) are not served.
func (w *watcher) serveFile(rw http.ResponseWriter, r *http.Request) {
	if r.Method != http.MethodGet && r.Method != http.MethodHead {
		http.Error(rw, "GET only", http.StatusMethodNotAllowed)
		return
	}
	p := path.Clean("/" + r.URL.Path)
	if p == "/" {
		if _, err := os.Stat(filepath.Join(w.o.out, "html", "index.html")); err == nil {
			http.Redirect(rw, r, "/html/index.html", http.StatusFound)
			return
		}
		w.serveHTML(rw, r, []byte(w.statusPage()))
		return
	}
	rel := strings.TrimPrefix(p, "/")
	for _, part := range strings.Split(rel, "/") {
		if strings.HasPrefix(part, ".") {
			http.NotFound(rw, r)
			return
		}
	}
	// The folder is opened for each request: each run puts a new one in its place.
	root, err := os.OpenRoot(w.o.out)
	if err != nil {
		http.NotFound(rw, r)
		return
	}
	defer root.Close()
	f, err := root.Open(filepath.FromSlash(rel))
	if err != nil {
		http.NotFound(rw, r)
		return
	}
	defer f.Close()
	st, err := f.Stat()
	if err != nil || !st.Mode().IsRegular() {
		if err == nil && st.IsDir() {
			if _, err := fs.Stat(root.FS(), path.Join(rel, "index.html")); err == nil {
				http.Redirect(rw, r, "/"+rel+"/index.html", http.StatusFound)
				return
			}
		}
		http.NotFound(rw, r)
		return
	}
	if strings.HasSuffix(rel, ".html") {
		data, err := io.ReadAll(f)
		if err != nil {
			http.Error(rw, "cannot read "+rel, http.StatusInternalServerError)
			return
		}
		w.serveHTML(rw, r, data)
		return
	}
	rw.Header().Set("Cache-Control", "no-store")
	http.ServeContent(rw, r, st.Name(), st.ModTime(), f)
}

// serveHTML serves the page data with the reload script added before its </body>.
func (w *watcher) serveHTML(rw http.ResponseWriter, r *http.Request, data []byte) {
	rw.Header().Set("Content-Type", "text/html; charset=utf-8")
	rw.Header().Set("Cache-Control", "no-store")
	http.ServeContent(rw, r, "", time.Time{}, bytes.NewReader(injectReload(data, w.status().Run)))
}

// injectReload returns the page data with the reload script, for a page served after run run,
// before its last </body> (at its end where there is none).
func injectReload(data []byte, run int) []byte {
	script := strings.Replace(reloadScript, "RUN", strconv.Itoa(run), 1)
	at := bytes.LastIndex(bytes.ToLower(data), []byte("</body>"))
	if at < 0 {
		at = len(data)
	}
	out := make([]byte, 0, len(data)+len(script))
	out = append(append(append(out, data[:at]...), script...), data[at:]...)
	return out
}

// reloadScript is added to every page served: it asks /status twice a second, reloads the page
// when a run has ended since it was served, and shows the faults of a run that wrote nothing.
const reloadScript = `<script>/* added by colsheet watch while serving; not in the file */
(function () {
  var served = RUN;
  function show(s) {
    var box = document.getElementById("colsheet-watch");
    if (s.code < 2) { if (box) { box.remove(); } return; }
    if (!box) {
      box = document.createElement("pre");
      box.id = "colsheet-watch";
      box.style.cssText = "position:fixed;left:0;right:0;bottom:0;max-height:50%;overflow:auto;margin:0;padding:1em;background:#fff0f0;color:#900;border-top:3px solid #c00;font:13px monospace;white-space:pre-wrap;z-index:9999";
      document.body.appendChild(box);
    }
    box.textContent = "colsheet watch, run " + s.run + ": nothing written; the pages show the last good run.\n\n" + s.log;
  }
  function poll() {
    fetch("/status", {cache: "no-store"}).then(function (r) { return r.json(); }).then(function (s) {
      if (s.run !== served) { location.reload(); return; }
      show(s);
      setTimeout(poll, 500);
    }).catch(function () { setTimeout(poll, 2000); });
  }
  poll();
})();
</script>
`

// statusPage returns the page served at / while the output folder holds no HTML index.
func (w *watcher) statusPage() string {
	s := w.status()
	say := "The first run is under way; this page shows the package when it is written."
	if s.Run > 0 {
		say = "No package has been written yet: the last run's faults are shown below. Edit the input and save; this page reloads."
	}
	return "<!DOCTYPE html>\n<html><head><meta charset=\"utf-8\"><title>colsheet watch</title></head>\n<body>\n<h1>colsheet watch</h1>\n<p>" +
		html.EscapeString(w.o.input) + " into " + html.EscapeString(w.o.out) + "</p>\n<p>" + say + "</p>\n</body></html>\n"
}
