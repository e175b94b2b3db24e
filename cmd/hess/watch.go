package main

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"os/signal"
	"path/filepath"
	"sort"
	"strings"
	"syscall"
	"time"

	"github.com/fsnotify/fsnotify"

	"hess/lang"
	"hess/network"
)

// watchDebounce is how long a burst of file events must be quiet before
// the network is compiled again.
const watchDebounce = 100 * time.Millisecond

func runWatch(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("watch", "watch [--table OUT] [--format text|csv|json|markdown] [--color auto|always|never] [--include-path DIR]... FILE...",
		"Check the networks, print the report, then check again whenever a root file\n"+
			"or a file it includes changes (also when an editor saves by renaming a new\n"+
			"file over the old one), printing each new report with the time. With\n"+
			"--table, the K(T) table of the one root file is rewritten atomically after\n"+
			"every compile without errors; a broken or missing file is reported and the\n"+
			"previous table stays. Reports go to standard error. Ctrl-C stops watching\n"+
			"(exit status 0).", stderr)
	format := &choice{value: "text", allowed: []string{"text", "csv", "json", "markdown"}}
	color := &choice{value: "auto", allowed: []string{"auto", "always", "never"}}
	fs.Var(format, "format", "table format for --table: text, csv, json or markdown")
	fs.Var(color, "color", "colour the reports: auto, always or never")
	table := fs.String("table", "", "rewrite the table `FILE` after every good compile")
	includes := includePathFlag(fs)
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) == 0 {
		fmt.Fprintln(stderr, "hess watch: no files given")
		fs.Usage()
		return exitTrouble
	}
	if *table != "" && len(files) != 1 {
		fmt.Fprintln(stderr, "hess watch: --table takes exactly one root file")
		return exitTrouble
	}
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt, syscall.SIGTERM)
	defer stop()
	return watch(ctx, watchOptions{
		roots: files, table: *table, format: format.value, includes: *includes,
		color: useColor(color.value, stderr), debounce: watchDebounce,
	}, stderr)
}

// watchOptions configure a watch.
type watchOptions struct {
	roots    []string
	table    string   // the table file to keep up to date, or ""
	format   string   // table format
	includes []string // --include-path folders
	color    bool
	debounce time.Duration
	now      func() time.Time // the clock for timestamps; nil is time.Now
	// rebuilt, when set (by tests), receives the outcome of every compile.
	rebuilt func(watchResult)
}

// watchResult is the outcome of one compile of a watch.
type watchResult struct {
	output  string // what was printed for it
	errors  int    // error diagnostics, or -1 when a root could not be read
	table   bool   // the table file was written
	watched []string
}

// watcher is the state of one watch: the files the networks read (the
// include set, recomputed after each compile) and the folders watched for
// them.
type watcher struct {
	opts watchOptions
	out  io.Writer // reports and trouble alike: all of it is progress
	fsw  *fsnotify.Watcher

	files   map[string]bool        // clean absolute paths whose changes count
	modes   map[string]os.FileMode // their modes at the last compile
	dirs    map[string]bool        // folders watched
	pending map[string]bool        // missing folders on the way to a file: their creation counts
	reports int                    // reports printed so far
}

// watch compiles, reports to stderr and waits for changes until ctx ends;
// it returns the exit status.
func watch(ctx context.Context, opts watchOptions, stderr io.Writer) int {
	if opts.now == nil {
		opts.now = time.Now
	}
	fsw, err := fsnotify.NewWatcher()
	if err != nil {
		fmt.Fprintf(stderr, "hess watch: %v\n", err)
		return exitTrouble
	}
	defer fsw.Close()
	// The roots and include folders are made absolute once: a relative
	// path would go on naming the old folder after the working folder is
	// deleted and made again.
	opts.roots = absolutePaths(opts.roots)
	opts.includes = absolutePaths(opts.includes)
	if opts.table != "" {
		opts.table = network.PathID(opts.table)
	}
	w := &watcher{opts: opts, out: stderr, fsw: fsw, files: map[string]bool{},
		modes: map[string]os.FileMode{}, dirs: map[string]bool{}, pending: map[string]bool{}}
	w.rebuild("checking " + strings.Join(displayNames(opts.roots), ", "))

	timer := time.NewTimer(time.Hour)
	timer.Stop()
	changed := map[string]string{} // display name -> what happened
	for {
		select {
		case <-ctx.Done():
			return exitOK
		case ev, ok := <-fsw.Events:
			if !ok {
				fmt.Fprintln(stderr, "hess watch: the file watcher stopped")
				return exitTrouble
			}
			what, relevant := w.relevant(ev)
			if !relevant {
				continue
			}
			changed[displayName(ev.Name)] = what
			timer.Reset(opts.debounce)
		case err, ok := <-fsw.Errors:
			if !ok {
				fmt.Fprintln(stderr, "hess watch: the file watcher stopped")
				return exitTrouble
			}
			fmt.Fprintf(stderr, "%s hess watch: %v\n", w.stamp(), err)
		case <-timer.C:
			w.rebuild(describeChanges(changed))
			changed = map[string]string{}
		}
	}
}

// relevant reports whether an event touches a file of the networks (or a
// missing folder on the way to one, or a watched folder itself), and what
// happened to it.
func (w *watcher) relevant(ev fsnotify.Event) (string, bool) {
	p := filepath.Clean(ev.Name)
	if !w.files[p] && !w.pending[p] && !w.dirs[p] {
		return "", false
	}
	if !ev.Has(fsnotify.Create) && !ev.Has(fsnotify.Write) && !ev.Has(fsnotify.Remove) && !ev.Has(fsnotify.Rename) {
		// A change of permissions or times: it counts when a file's mode
		// changed (an include made unreadable is reported at once).
		if w.files[p] && ev.Has(fsnotify.Chmod) && fileMode(p) != w.modes[p] {
			return "permissions changed", true
		}
		return "", false
	}
	switch {
	case ev.Has(fsnotify.Remove), ev.Has(fsnotify.Rename):
		return "removed", true
	case ev.Has(fsnotify.Create):
		return "created", true
	}
	return "changed", true
}

func describeChanges(changed map[string]string) string {
	names := make([]string, 0, len(changed))
	for n := range changed {
		names = append(names, n)
	}
	sort.Strings(names)
	parts := make([]string, 0, len(names))
	for _, n := range names {
		parts = append(parts, n+" "+changed[n])
	}
	return strings.Join(parts, ", ")
}

func (w *watcher) stamp() string { return w.opts.now().Format("[15:04:05]") }

// rebuild compiles every root, prints the report (and rewrites the table
// after a good compile), then watches the files the networks now read.
func (w *watcher) rebuild(why string) {
	var buf bytes.Buffer
	if w.reports > 0 {
		buf.WriteByte('\n') // a blank line between reports
	}
	w.reports++
	fmt.Fprintf(&buf, "%s %s\n", w.stamp(), why)
	inputs := map[string]bool{}
	var nets []*network.Network
	missing := false
	for _, root := range w.opts.roots {
		inputs[root] = true
		if _, err := os.Stat(root); err != nil {
			fmt.Fprintf(&buf, "%s cannot read %s: %v; waiting for it\n", w.stamp(), displayName(root), unwrapPathError(err))
			missing = true
			continue
		}
		net := network.Load(root, network.Disk{}, network.Options{IncludePaths: w.opts.includes})
		if len(net.Files) == 0 {
			fmt.Fprintf(&buf, "%s %s; waiting for it\n", w.stamp(), unreadableRoot(displayName(root), net))
			missing = true
			continue
		}
		nets = append(nets, net)
		for _, f := range net.Files {
			inputs[f.ID] = true
		}
		for _, inc := range net.Includes() {
			inputs[network.PathID(inc)] = true
		}
	}
	res := watchResult{errors: -1}
	if len(nets) > 0 {
		rep := mergedReport(nets)
		if err := renderText(&buf, rep, w.opts.color); err != nil {
			fmt.Fprintf(&buf, "hess watch: %v\n", err)
		}
		if !missing {
			res.errors = rep.Diagnostics.Count(lang.Error)
		}
	}
	if w.opts.table != "" {
		switch {
		case res.errors == 0:
			if err := w.writeTable(nets[0]); err != nil {
				fmt.Fprintf(&buf, "%s %v; the previous table stays\n", w.stamp(), err)
			} else {
				fmt.Fprintf(&buf, "%s wrote %s\n", w.stamp(), displayName(w.opts.table))
				res.table = true
			}
		default:
			fmt.Fprintf(&buf, "%s %s not rewritten until the network compiles without errors\n", w.stamp(), displayName(w.opts.table))
		}
	}
	w.sync(inputs, &buf)
	res.output = buf.String()
	for d := range w.dirs {
		res.watched = append(res.watched, d)
	}
	sort.Strings(res.watched)
	w.out.Write(buf.Bytes()) // nowhere else to say that stderr fails
	if w.opts.rebuilt != nil {
		w.opts.rebuilt(res)
	}
}

// writeTable renders the network's K(T) tables at its settings'
// temperatures and replaces the table file atomically.
func (w *watcher) writeTable(net *network.Network) error {
	temps := net.Settings.Temperatures
	doc := &tableDoc{Network: displayName(net.Root), Pressure: net.Settings.Pressure, Temps: temps, reactions: net.Reactions, net: net}
	render, err := tableRenderer(w.opts.format)
	if err != nil {
		return fmt.Errorf("rendering the table: %w", err)
	}
	return writeOutputStream(w.opts.table, net, func(out io.Writer) error { return render(out, doc) })
}

// mergedReport is one report of several networks: every file once, every
// diagnostic once.
func mergedReport(nets []*network.Network) *report {
	rep := &report{}
	var parts []*report
	seenFile := map[string]bool{}
	seenDiag := map[string]bool{}
	for _, net := range nets {
		r := networkReport(net, net.Diagnostics)
		parts = append(parts, r)
		for _, f := range r.Files {
			if !seenFile[f] {
				seenFile[f] = true
				rep.Files = append(rep.Files, f)
			}
		}
		for _, d := range r.Diagnostics {
			key := fmt.Sprintf("%s|%d|%d|%s|%s", d.Subject.File, d.Subject.Start.Offset, d.Subject.End.Offset, d.Code, d.Message)
			if !seenDiag[key] {
				seenDiag[key] = true
				rep.Diagnostics = append(rep.Diagnostics, d)
			}
		}
	}
	rep.Diagnostics.Sort()
	rep.Source = func(file string) []byte {
		for _, r := range parts {
			if src := r.Source(file); src != nil {
				return src
			}
		}
		return nil
	}
	return rep
}

// sync watches the folders of the input files. A folder that does not
// exist is stood in for by its nearest existing parent, so that its
// creation is noticed.
func (w *watcher) sync(inputs map[string]bool, log io.Writer) {
	dirs := map[string]bool{}
	pending := map[string]bool{}
	for f := range inputs {
		d := filepath.Dir(f)
		for !isDir(d) && filepath.Dir(d) != d {
			pending[d] = true
			d = filepath.Dir(d)
		}
		dirs[d] = true
	}
	for d := range w.dirs {
		if !dirs[d] {
			if err := w.fsw.Remove(d); err != nil && !errors.Is(err, fsnotify.ErrNonExistentWatch) {
				fmt.Fprintf(log, "%s cannot stop watching %s: %v\n", w.stamp(), displayName(d), err)
			}
			delete(w.dirs, d)
		}
	}
	for d := range dirs {
		// Adding again is harmless, and renews the watch of a folder that
		// was deleted and made again since.
		if err := w.fsw.Add(d); err != nil {
			fmt.Fprintf(log, "%s cannot watch %s: %v\n", w.stamp(), displayName(d), err)
			continue
		}
		w.dirs[d] = true
	}
	modes := make(map[string]os.FileMode, len(inputs))
	for f := range inputs {
		modes[f] = fileMode(f)
	}
	w.files, w.modes, w.pending = inputs, modes, pending
}

// fileMode is a file's type and permissions, or 0 when it cannot be read.
func fileMode(p string) os.FileMode {
	info, err := os.Stat(p)
	if err != nil {
		return 0
	}
	return info.Mode()
}

func isDir(p string) bool {
	info, err := os.Stat(p)
	return err == nil && info.IsDir()
}

// absolutePaths gives each path's PathID.
func absolutePaths(paths []string) []string {
	out := make([]string, len(paths))
	for i, p := range paths {
		out[i] = network.PathID(p)
	}
	return out
}

func displayNames(paths []string) []string {
	out := make([]string, len(paths))
	for i, p := range paths {
		out[i] = displayName(p)
	}
	return out
}
