package suggest

import "testing"

func TestDistance(t *testing.T) {
	for _, tc := range []struct {
		a, b string
		want int
	}{
		{"", "", 0},
		{"table", "table", 0},
		{"tabel", "table", 1}, // a swap of neighbours
		{"speces", "species", 1},
		{"reacton", "reaction", 1},
		{"kitten", "sitting", 3},
		{"ΔfH", "ΔH", 1},
		{"", "abc", 3},
	} {
		if got := Distance(tc.a, tc.b); got != tc.want {
			t.Errorf("Distance(%q, %q) = %d, want %d", tc.a, tc.b, got, tc.want)
		}
		if got := Distance(tc.b, tc.a); got != tc.want {
			t.Errorf("Distance(%q, %q) = %d, want %d", tc.b, tc.a, got, tc.want)
		}
	}
}

func TestClosest(t *testing.T) {
	commands := []string{"check", "table", "approach", "plot", "fmt", "watch", "lsp", "explain", "version", "help"}
	keywords := []string{"include", "settings", "element", "phase", "species", "reaction", "mixture"}
	species := []string{"CaO(cr)", "CO2(g)", "CaCO3(cr)", "CaCO3", "CaO"}
	for _, tc := range []struct {
		name       string
		candidates []string
		want       string
	}{
		{"tabel", commands, "table"},
		{"chek", commands, "check"},
		{"verison", commands, "version"},
		{"speces", keywords, "species"},
		{"reacton", keywords, "reaction"},
		{"Species", keywords, "species"},
		{"CaC03", species, "CaCO3"},
		{"caco3", species, "CaCO3"},
		{"xyz", commands, ""},
		{"frobnicate", commands, ""},
		{"table", commands, ""}, // the name itself is no suggestion
		{"", commands, ""},
	} {
		got, ok := Closest(tc.name, tc.candidates)
		if got != tc.want || ok != (tc.want != "") {
			t.Errorf("Closest(%q) = %q, %v; want %q", tc.name, got, ok, tc.want)
		}
	}
}

func TestPhrase(t *testing.T) {
	if got := Phrase("tabel", []string{"table"}); got != `did you mean "table"?` {
		t.Errorf("Phrase = %q", got)
	}
	if got := Phrase("zzz", []string{"table"}); got != "" {
		t.Errorf("Phrase = %q, want nothing", got)
	}
}

func TestClosestBounded(t *testing.T) {
	long := string(make([]rune, 10000))
	if _, ok := Closest(long, []string{long[:10]}); ok {
		t.Errorf("a name longer than the bound got a suggestion")
	}
}

func FuzzClosest(f *testing.F) {
	f.Add("tabel", "table")
	f.Fuzz(func(t *testing.T, a, b string) {
		d := Distance(a, b)
		if d != Distance(b, a) || d < 0 {
			t.Fatalf("Distance(%q, %q) = %d, not symmetric or negative", a, b, d)
		}
		Closest(a, []string{b})
	})
}
