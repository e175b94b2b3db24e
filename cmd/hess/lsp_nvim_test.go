package main

import (
	"context"
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"
	"unicode/utf16"
)

// nvimScript attaches `hess lsp` to a buffer in Neovim 0.7 (which has
// vim.lsp.start_client but not vim.lsp.start), waits for diagnostics and
// writes them to diagnostics.json, then hovers at HESS_HOVER (line and
// UTF-16 character, 0-based) and writes the answer to hover.json.
const nvimScript = `
local out = vim.env.HESS_OUT
local function write(name, value)
  local f = assert(io.open(out .. '/' .. name, 'w'))
  f:write(vim.json.encode(value))
  f:close()
end
vim.cmd('edit ' .. vim.fn.fnameescape(vim.env.HESS_FILE))
local id = vim.lsp.start_client({name = 'hess', cmd = {vim.env.HESS_BINARY, 'lsp'}, root_dir = vim.fn.getcwd()})
vim.lsp.buf_attach_client(0, id)
vim.wait(20000, function() return #vim.diagnostic.get(0) > 0 end, 50)
write('diagnostics.json', vim.diagnostic.get(0))
local line, char = vim.env.HESS_HOVER:match('(%d+):(%d+)')
local params = {textDocument = {uri = vim.uri_from_bufnr(0)}, position = {line = tonumber(line), character = tonumber(char)}}
local answers = vim.lsp.buf_request_sync(0, 'textDocument/hover', params, 10000) or {}
local hover = ''
for _, a in pairs(answers) do
  if a.result and a.result.contents then hover = a.result.contents.value or '' end
end
write('hover.json', {value = hover})
vim.lsp.stop_client(id)
vim.wait(5000, function() return vim.lsp.get_client_by_id(id) == nil end, 50)
vim.cmd('qa!')
`

// TestNeovimClient runs a real editor against the server: Neovim headless
// opens a copy of the hydrogen plant example with an imbalance written
// after a non-ASCII arrow, receives the diagnostic, and hovers a species.
func TestNeovimClient(t *testing.T) {
	nvim := requireTool(t, "nvim", "apt-get install -y neovim")
	bin := hessBinary(t)
	dir := t.TempDir()
	file, bad, line := brokenReformer(t, dir)
	script := filepath.Join(dir, "test.lua")
	if err := os.WriteFile(script, []byte(nvimScript), 0o644); err != nil {
		t.Fatal(err)
	}
	hoverAt := strings.Index(bad, "CO(g)") + 1
	hoverChar := len(utf16.Encode([]rune(bad[:hoverAt])))

	ctx, cancel := context.WithTimeout(context.Background(), 60*time.Second)
	defer cancel()
	cmd := exec.CommandContext(ctx, nvim, "--headless", "--clean", "-u", "NONE", "-c", "luafile "+script)
	cmd.Dir = dir
	cmd.Env = append(os.Environ(),
		"HESS_BINARY="+bin, "HESS_FILE="+file, "HESS_OUT="+dir,
		"HESS_HOVER="+strconv.Itoa(line)+":"+strconv.Itoa(hoverChar),
		"XDG_CONFIG_HOME="+dir, "XDG_DATA_HOME="+dir, "XDG_STATE_HOME="+dir, "XDG_CACHE_HOME="+dir,
	)
	started := time.Now()
	out, err := cmd.CombinedOutput()
	t.Logf("Neovim session took %v", time.Since(started).Round(time.Millisecond))
	if err != nil {
		t.Fatalf("nvim: %v\n%s", err, out)
	}

	var diags []struct {
		Lnum     int    `json:"lnum"`
		Col      int    `json:"col"`
		EndLnum  int    `json:"end_lnum"`
		EndCol   int    `json:"end_col"`
		Severity int    `json:"severity"`
		Message  string `json:"message"`
		Source   string `json:"source"`
		Code     string `json:"code"`
	}
	readJSON(t, filepath.Join(dir, "diagnostics.json"), &diags, out)
	// The wrong coefficient also breaks the two coupled reactions built on
	// reform; the imbalance is on the edited line.
	var found []int
	for i, d := range diags {
		if d.Code == "element-imbalance" {
			found = append(found, i)
		}
	}
	if len(found) != 1 || len(diags) != 3 {
		t.Fatalf("Neovim has diagnostics %+v, want one element-imbalance and two combination-mismatch", diags)
	}
	d := diags[found[0]]
	// Neovim turns the server's UTF-16 columns into byte columns; ⇌ takes
	// three bytes, so a wrong conversion on either side shows at the end.
	startCol := strings.Index(bad, "CH4(g)")
	endCol := len(bad)
	if d.Lnum != line || d.Col != startCol || d.EndLnum != line || d.EndCol != endCol {
		t.Errorf("diagnostic at %d:%d-%d:%d, want %d:%d-%d:%d", d.Lnum, d.Col, d.EndLnum, d.EndCol, line, startCol, line, endCol)
	}
	if d.Severity != 1 || d.Source != "hess" || d.Message != "H: left 6, right 4" {
		t.Errorf("diagnostic %+v, want an error from hess saying H: left 6, right 4", d)
	}

	var hover struct {
		Value string `json:"value"`
	}
	readJSON(t, filepath.Join(dir, "hover.json"), &hover, out)
	for _, want := range append(coHoverWants(t, file), "`CO(g)`") {
		if !strings.Contains(hover.Value, want) {
			t.Errorf("hover lacks %q:\n%s", want, hover.Value)
		}
	}
}

// The hydrogen plant's reforming step, as the example writes it and as the
// editor tests break it: a non-ASCII arrow and a wrong H2 coefficient.
const (
	reformGood = "reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)"
	reformBad  = "reaction reform: CH4(g) + H2O(g) ⇌ CO(g) + 2 H2(g)"
)

// brokenReformer copies the hydrogen plant example into dir with the
// reforming step broken (reformBad), and returns the reformer file, the
// broken line and its 0-based line number.
func brokenReformer(t *testing.T, dir string) (file, bad string, line int) {
	t.Helper()
	example := filepath.Join("..", "..", "examples", "hydrogen-plant")
	gases, err := os.ReadFile(filepath.Join(example, "gases.hess"))
	if err != nil {
		t.Fatal(err)
	}
	reformer, err := os.ReadFile(filepath.Join(example, "reformer.hess"))
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(reformer), reformGood) {
		t.Fatalf("the example no longer has the line %q", reformGood)
	}
	broken := strings.Replace(string(reformer), reformGood, reformBad, 1)
	if err := os.WriteFile(filepath.Join(dir, "gases.hess"), gases, 0o644); err != nil {
		t.Fatal(err)
	}
	file = filepath.Join(dir, "reformer.hess")
	if err := os.WriteFile(file, []byte(broken), 0o644); err != nil {
		t.Fatal(err)
	}
	return file, reformBad, strings.Count(broken[:strings.Index(broken, reformBad)], "\n")
}

// coHoverWants is what a hover on CO(g) in the example must show, from
// outside the compiler: the label and source as the example file writes
// them, ΔfH°(CO, g) = −110.527 kJ/mol (NIST-JANAF 1998, which the example
// quotes), and M(CO) = 28.010 g/mol (CIAAW 2021 conventional weights,
// REFERENCE-DATA §4).
func coHoverWants(t *testing.T, file string) []string {
	t.Helper()
	gases, err := os.ReadFile(filepath.Join(filepath.Dir(file), "gases.hess"))
	if err != nil {
		t.Fatal(err)
	}
	label, source := exampleCO(t, string(gases))
	return []string{label, "formula CO", "molar mass 28.01 g/mol", "hf -110.527 kJ/mol", "source: " + source}
}

// requireTool finds an outside program for an editor test: the test skips
// without it, and fails when HESS_REQUIRE_EXTERNAL=1.
func requireTool(t *testing.T, name, install string) string {
	t.Helper()
	path, err := exec.LookPath(name)
	if err != nil {
		if os.Getenv("HESS_REQUIRE_EXTERNAL") == "1" {
			t.Fatalf("%s is not installed (%s), and HESS_REQUIRE_EXTERNAL=1 requires it", name, install)
		}
		t.Skipf("%s is not installed (%s): skipping the editor test", name, install)
	}
	return path
}

// exampleCO reads CO(g)'s label and source string from the example
// library's text, without the compiler.
func exampleCO(t *testing.T, text string) (label, source string) {
	t.Helper()
	m := regexp.MustCompile(`(?s)species CO\(g\) "([^"]*)" \{(.*?)\n\}`).FindStringSubmatch(text)
	if m == nil {
		t.Fatalf("the example has no labelled CO(g)")
	}
	src := regexp.MustCompile(`source "([^"]*)"`).FindStringSubmatch(m[2])
	if src == nil || !strings.Contains(m[2], "hf -110.527 kJ/mol") {
		t.Fatalf("the example's CO(g) has no source or not JANAF's hf:\n%s", m[2])
	}
	return m[1], src[1]
}

func readJSON(t *testing.T, path string, v any, nvimOutput []byte) {
	t.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (nvim output: %s)", err, nvimOutput)
	}
	if err := json.Unmarshal(data, v); err != nil {
		t.Fatalf("%s: %v: %s", path, err, data)
	}
}

// nvimRecipeScript opens the hydrogen plant's reformer, then its included
// gases file (as going to a definition there would), and writes how many
// servers run and the codes of the gases file's diagnostics.
const nvimRecipeScript = `
local function write(name, value)
  local f = assert(io.open(vim.env.HESS_OUT .. '/' .. name, 'w'))
  f:write(vim.json.encode(value))
  f:close()
end
vim.cmd('edit reformer.hess')
vim.wait(20000, function() return #vim.diagnostic.get(0) > 0 end, 50)
vim.cmd('edit gases.hess')
local buf = vim.api.nvim_get_current_buf()
vim.wait(5000, function() return #vim.lsp.buf_get_clients(buf) > 0 end, 50)
-- Give a second server, if one was started, the time to report.
vim.wait(3000, function() return #vim.lsp.get_active_clients() > 1 or #vim.diagnostic.get(buf) > 0 end, 50)
local codes = {}
for _, d in ipairs(vim.diagnostic.get(buf)) do table.insert(codes, d.code or '') end
write('recipe.json', {servers = #vim.lsp.get_active_clients(), attached = #vim.lsp.buf_get_clients(buf), codes = codes})
vim.cmd('qa!')
`

// TestNeovimReadmeRecipe runs the README's Neovim 0.7 set-up as the
// editor's init file: opening an included file after its root reuses the
// one server, which checks the library through the root (no false
// unused-species).
func TestNeovimReadmeRecipe(t *testing.T) {
	nvim := requireTool(t, "nvim", "apt-get install -y neovim")
	bin := hessBinary(t)
	block := readmeBlock(t, "**Neovim 0.7**", "lua")
	dir := t.TempDir()
	brokenReformer(t, dir)
	binDir := filepath.Join(dir, "bin")
	if err := os.Mkdir(binDir, 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink(bin, filepath.Join(binDir, "hess")); err != nil {
		t.Fatal(err)
	}
	for name, text := range map[string]string{"init.lua": block, "test.lua": nvimRecipeScript} {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(text), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	ctx, cancel := context.WithTimeout(context.Background(), 60*time.Second)
	defer cancel()
	cmd := exec.CommandContext(ctx, nvim, "--headless", "-u", "init.lua", "-c", "luafile test.lua")
	cmd.Dir = dir
	cmd.Env = append(os.Environ(),
		"PATH="+binDir+string(os.PathListSeparator)+os.Getenv("PATH"), "HESS_OUT="+dir,
		"XDG_CONFIG_HOME="+dir, "XDG_DATA_HOME="+dir, "XDG_STATE_HOME="+dir, "XDG_CACHE_HOME="+dir,
	)
	out, err := cmd.CombinedOutput()
	if err != nil {
		t.Fatalf("nvim: %v\n%s", err, out)
	}
	var got struct {
		Servers  int      `json:"servers"`
		Attached int      `json:"attached"`
		Codes    []string `json:"codes"`
	}
	readJSON(t, filepath.Join(dir, "recipe.json"), &got, out)
	if got.Servers != 1 || got.Attached != 1 {
		t.Errorf("%d servers running, %d attached to the included file; want one server for both", got.Servers, got.Attached)
	}
	for _, c := range got.Codes {
		if c == "unused-species" {
			t.Errorf("the included file was checked on its own: %v", got.Codes)
			break
		}
	}
}
