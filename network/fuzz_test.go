package network

import "testing"

// FuzzCompile compiles arbitrary text as a root file that may include a
// second arbitrary file: it must never panic, and every diagnostic must
// carry a code and a severity.
func FuzzCompile(f *testing.F) {
	f.Add("species H2(g), O2(g), H2O(g)\nreaction burn: 2 H2(g) + O2(g) <-> 2 H2O(g)\n", "")
	f.Add("include \"lib.hess\"\nreaction r: A(g) -> B(g)\n", "species A(g), B(g)\nsettings { pressure 1 bar }")
	f.Add("species SO4--(aq) { gf -744.5 kJ/mol s 20 J/mol/K }\nreaction r: SO4^2-(aq) <-> SO4--(aq)", "include \"net.hess\"")
	f.Add("settings { temperatures 300 K to 400 K by 10 K lint unused-species off }\nspecies CuSO4*5H2O(s)", "")
	f.Add("reaction c: A(g) <-> C(g) = a + 2 b - 1/2 c { dg 1 kJ/mol logk 3 at 500 K rate A 1 1/s Ea 1 kJ/mol }", "")
	f.Add("mixture m { temperature 500 K pressure 1 bar H2(g) 0.5 Na+(aq) 0.1 mol/kg CaCO3(s) }", "")
	// Hostile includes: empty, devices, the environment, a library that is
	// not text.
	f.Add("include \"\"\nspecies H2(g)", "")
	f.Add("include \"/dev/zero\"\ninclude \"/dev/stdin\"\ninclude \"/proc/self/environ\"", "")
	f.Add("include \"lib.hess\"\ninclude \"../lib.hess\"", "KEY=value\x00SECRET=x")
	f.Add("include \"lib.hess\"", "\xff\xfe species")
	f.Fuzz(func(t *testing.T, root, lib string) {
		n := Load("net.hess", memSource{"net.hess": []byte(root), "lib.hess": []byte(lib)}, Options{})
		for _, d := range n.Diagnostics {
			if d.Code == "" || d.Severity == 0 {
				t.Fatalf("diagnostic without code or severity: %+v", d)
			}
			if byCode(d.Code) == nil {
				t.Fatalf("diagnostic with the unregistered code %q: %+v", d.Code, d)
			}
		}
	})
}
