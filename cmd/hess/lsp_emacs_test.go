package main

import (
	"context"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"
	"unicode/utf8"
)

// emacsScript runs Emacs (28, with Debian's elpa-eglot, or a later Emacs
// with eglot built in) in batch mode as a client of `hess lsp`: it opens
// HESS_FILE in a major mode of its own, connects eglot, waits for
// flymake's diagnostics and writes them to diagnostics.json (0-based lines,
// columns in characters), then hovers at HESS_HOVER_LINE and
// HESS_HOVER_COL (characters) and writes the answer to hover.json.
const emacsScript = `
(dolist (d (file-expand-wildcards "/usr/share/emacs/site-lisp/elpa/*"))
  (add-to-list 'load-path d))
(unless (require 'eglot nil t)
  (package-initialize)
  (require 'eglot))
(require 'json)
(setq debug-on-error t)
(define-derived-mode hess-mode prog-mode "hess")
(add-to-list 'auto-mode-alist '("\\.hess\\'" . hess-mode))
(add-hook 'project-find-functions (lambda (dir) (cons 'transient (expand-file-name dir))))
(defun hess-write (name value)
  (with-temp-file (expand-file-name name (getenv "HESS_OUT"))
    (insert (json-encode value))))
(find-file (getenv "HESS_FILE"))
(eglot '(hess-mode) (project-current) 'eglot-lsp-server
       (list (getenv "HESS_BINARY") "lsp") "hess")
(let ((deadline (+ (float-time) 30)))
  (while (and (null (flymake-diagnostics)) (< (float-time) deadline))
    (accept-process-output nil 0.1)))
(hess-write "diagnostics.json"
  (vconcat
   (mapcar (lambda (d)
             (let ((beg (flymake-diagnostic-beg d)) (end (flymake-diagnostic-end d)))
               (list (cons "line" (1- (line-number-at-pos beg)))
                     (cons "col" (save-excursion (goto-char beg) (current-column)))
                     (cons "endLine" (1- (line-number-at-pos end)))
                     (cons "endCol" (save-excursion (goto-char end) (current-column)))
                     (cons "type" (symbol-name (flymake-diagnostic-type d)))
                     (cons "text" (flymake-diagnostic-text d)))))
           (flymake-diagnostics))))
(goto-char (point-min))
(forward-line (string-to-number (getenv "HESS_HOVER_LINE")))
(forward-char (string-to-number (getenv "HESS_HOVER_COL")))
(let* ((server (eglot--current-server-or-lose))
       (answer (jsonrpc-request server :textDocument/hover
                                (eglot--TextDocumentPositionParams)))
       (contents (plist-get answer :contents)))
  (hess-write "hover.json"
              (list (cons "value" (or (plist-get contents :value) "")))))
(eglot-shutdown (eglot--current-server-or-lose))
(kill-emacs 0)
`

// TestEmacsClient runs a second real editor against the server: Emacs in
// batch mode with eglot opens a copy of the hydrogen plant example with an
// imbalance written after a non-ASCII arrow, receives the diagnostic
// through flymake, and hovers a species.
func TestEmacsClient(t *testing.T) {
	emacs := requireTool(t, "emacs", "apt-get install -y emacs-nox elpa-eglot")
	bin := hessBinary(t)
	dir := t.TempDir()
	file, bad, line := brokenReformer(t, dir)
	script := filepath.Join(dir, "test.el")
	if err := os.WriteFile(script, []byte(emacsScript), 0o644); err != nil {
		t.Fatal(err)
	}
	// Emacs counts columns in characters: ⇌ is one.
	hoverCol := utf8.RuneCountInString(bad[:strings.Index(bad, "CO(g)")+1])

	ctx, cancel := context.WithTimeout(context.Background(), 90*time.Second)
	defer cancel()
	cmd := exec.CommandContext(ctx, emacs, "--batch", "-Q", "-l", script)
	cmd.Dir = dir
	cmd.Env = append(os.Environ(),
		"HOME="+dir, "HESS_BINARY="+bin, "HESS_FILE="+file, "HESS_OUT="+dir,
		"HESS_HOVER_LINE="+strconv.Itoa(line), "HESS_HOVER_COL="+strconv.Itoa(hoverCol),
	)
	started := time.Now()
	out, err := cmd.CombinedOutput()
	t.Logf("Emacs session took %v", time.Since(started).Round(time.Millisecond))
	if err != nil {
		if strings.Contains(string(out), "Cannot open load file") && strings.Contains(string(out), "eglot") {
			if os.Getenv("HESS_REQUIRE_EXTERNAL") == "1" {
				t.Fatalf("eglot is not installed (apt-get install -y elpa-eglot):\n%s", out)
			}
			t.Skipf("eglot is not installed (apt-get install -y elpa-eglot): skipping the editor test")
		}
		t.Fatalf("emacs: %v\n%s", err, out)
	}

	var diags []struct {
		Line    int    `json:"line"`
		Col     int    `json:"col"`
		EndLine int    `json:"endLine"`
		EndCol  int    `json:"endCol"`
		Type    string `json:"type"`
		Text    string `json:"text"`
	}
	readJSON(t, filepath.Join(dir, "diagnostics.json"), &diags, out)
	var found []int
	for i, d := range diags {
		if strings.Contains(d.Text, "element-imbalance") {
			found = append(found, i)
		}
	}
	if len(found) != 1 || len(diags) != 3 {
		t.Fatalf("Emacs has diagnostics %+v, want one element-imbalance and two combination-mismatch", diags)
	}
	d := diags[found[0]]
	startCol := utf8.RuneCountInString(bad[:strings.Index(bad, "CH4(g)")])
	endCol := utf8.RuneCountInString(bad)
	if d.Line != line || d.Col != startCol || d.EndLine != line || d.EndCol != endCol {
		t.Errorf("diagnostic at %d:%d-%d:%d, want %d:%d-%d:%d", d.Line, d.Col, d.EndLine, d.EndCol, line, startCol, line, endCol)
	}
	if d.Type != "eglot-error" || !strings.Contains(d.Text, "H: left 6, right 4") {
		t.Errorf("diagnostic %+v, want an error saying H: left 6, right 4", d)
	}

	var hover struct {
		Value string `json:"value"`
	}
	readJSON(t, filepath.Join(dir, "hover.json"), &hover, out)
	for _, want := range append(coHoverWants(t, file), "CO(g)") {
		if !strings.Contains(hover.Value, want) {
			t.Errorf("hover lacks %q:\n%s", want, hover.Value)
		}
	}
}
