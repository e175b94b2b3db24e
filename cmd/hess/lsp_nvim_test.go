package main

import (
	"context"
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"
	"unicode/utf16"

	"hess/network"
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
	nvim, err := exec.LookPath("nvim")
	if err != nil {
		if os.Getenv("HESS_REQUIRE_EXTERNAL") == "1" {
			t.Fatalf("nvim is not installed (apt-get install -y neovim), and HESS_REQUIRE_EXTERNAL=1 requires it")
		}
		t.Skip("nvim is not installed (apt-get install -y neovim): skipping the editor test")
	}
	bin := hessBinary(t)
	dir := t.TempDir()
	example := filepath.Join("..", "..", "examples", "hydrogen-plant")
	gases, err := os.ReadFile(filepath.Join(example, "gases.hess"))
	if err != nil {
		t.Fatal(err)
	}
	reformer, err := os.ReadFile(filepath.Join(example, "reformer.hess"))
	if err != nil {
		t.Fatal(err)
	}
	const good = "reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)"
	const bad = "reaction reform: CH4(g) + H2O(g) ⇌ CO(g) + 2 H2(g)"
	if !strings.Contains(string(reformer), good) {
		t.Fatalf("the example no longer has the line %q", good)
	}
	broken := strings.Replace(string(reformer), good, bad, 1)
	if err := os.WriteFile(filepath.Join(dir, "gases.hess"), gases, 0o644); err != nil {
		t.Fatal(err)
	}
	file := filepath.Join(dir, "reformer.hess")
	if err := os.WriteFile(file, []byte(broken), 0o644); err != nil {
		t.Fatal(err)
	}
	script := filepath.Join(dir, "test.lua")
	if err := os.WriteFile(script, []byte(nvimScript), 0o644); err != nil {
		t.Fatal(err)
	}
	line := strings.Count(broken[:strings.Index(broken, bad)], "\n")
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
	// The example's data may be revised: take the expected label, enthalpy
	// and source from the compiler.
	co := network.Load(file, network.Disk{}, network.Options{}).LookupSpecies("CO(g)")
	if co == nil || co.Hf == nil {
		t.Fatalf("the example has no CO(g) with hf")
	}
	for _, want := range []string{"`CO(g)`", co.Label, "formula CO", "molar mass 28.01 g/mol",
		"hf " + strconv.FormatFloat(co.Hf.V/1000, 'g', 7, 64) + " kJ/mol", "source: " + co.Source} {
		if !strings.Contains(hover.Value, want) {
			t.Errorf("hover lacks %q:\n%s", want, hover.Value)
		}
	}
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
