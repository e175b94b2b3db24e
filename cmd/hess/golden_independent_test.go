package main

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"testing"
)

// independentScript recomputes, with nothing of hess, the numbers the
// table and approach goldens freeze: it reads the example networks with
// regular expressions, evaluates each species' model (hf and s with a
// constant cp; Shomate and NASA 7-term ranges, the published forms), sums
// ΔrG° = Σν(H° − T·S°) over each reaction's net equation and writes
// log10 K; for each mixture it writes Q from the activity conventions (gas
// fractions normalised and times the pressure over p° = 1 bar, solutes by
// molality, pure phases 1). Standard library only.
const independentScript = `
import json, math, re, sys, os

R = 8.31446261815324
T0 = 298.15

def read(path, seen):
    path = os.path.normpath(path)
    if path in seen:
        return ""
    seen.add(path)
    text = open(path, encoding="utf-8").read()
    text = re.sub(r"#[^\n]*", "", text)
    out = text
    for inc in re.findall(r'include\s+"([^"]+)"', text):
        out += "\n" + read(os.path.join(os.path.dirname(path), inc), seen)
    return out

def quantity(body, key):
    m = re.search(r"(?<![\w-])" + key + r"\s+(-?[\d.eE+-]+)(?:\s*±\s*[\d.]+)?\s+(\S+)", body)
    if not m:
        return None
    v, unit = float(m.group(1)), m.group(2)
    if unit.startswith("kJ"):
        v *= 1000
    return v

class Model:
    def __init__(self, body):
        self.ranges = []
        for kind, lo, hi, coeffs in re.findall(r"(shomate|nasa7)\s+([\d.]+)\s+K\s+to\s+([\d.]+)\s+K\s*\{([^}]*)\}", body):
            self.ranges.append((kind, float(lo), float(hi), [float(c) for c in coeffs.split()]))
        self.ranges.sort(key=lambda r: r[1])
        self.hf, self.s, self.cp = quantity(body, "hf"), quantity(body, "s"), quantity(body, "cp") or 0.0

    def piece(self, T):
        for r in self.ranges:
            if r[1] <= T <= r[2]:
                return r
        return self.ranges[0] if T < self.ranges[0][1] else self.ranges[-1]

    def hs(self, T):
        if not self.ranges:
            return self.hf + self.cp * (T - T0), self.s + self.cp * math.log(T / T0)
        kind, lo, hi, c = self.piece(T)
        if kind == "shomate":
            A, B, C, D, E, F, G, H = c
            t = T / 1000
            h = A*t + B*t*t/2 + C*t**3/3 + D*t**4/4 - E/t + F
            s = A*math.log(t) + B*t + C*t*t/2 + D*t**3/3 - E/(2*t*t) + G
            return 1000 * h, s
        a = c
        h = R * T * (a[0] + a[1]*T/2 + a[2]*T**2/3 + a[3]*T**3/4 + a[4]*T**4/5 + a[5]/T)
        s = R * (a[0]*math.log(T) + a[1]*T + a[2]*T**2/2 + a[3]*T**3/3 + a[4]*T**4/4 + a[6])
        return h, s

def coef(tok):
    if "/" in tok:
        p, q = tok.split("/")
        return float(p) / float(q)
    return float(tok)

def side(text):
    terms = []
    for term in re.split(r"\s\+\s", text.strip()):
        parts = term.split()
        if len(parts) == 2:
            terms.append((coef(parts[0]), parts[1]))
        else:
            terms.append((1.0, parts[0]))
    return terms

def canon(name):
    m = re.match(r"^(.*?)(\^(\d+)([+-])|([+-]+))?(\(\w+\))?$", name)
    base, n, sign, run, tag = m.group(1), m.group(3), m.group(4), m.group(5), m.group(6) or ""
    if run:
        n, sign = str(len(run)), run[0]
    return base + ((sign if n == "1" else "^" + n + sign) if sign else "") + tag

def network(path):
    text = read(path, set())
    species = {}
    for name, body in re.findall(r"species\s+(\S+)(?:\s+\"[^\"]*\")?\s*\{(.*?)\n\}", text, re.S):
        species[canon(name)] = Model(body)
    reactions = []
    for name, left, right in re.findall(r"reaction\s+([\w-]+):\s+(.+?)\s+<?->\s+(.+?)(?:\s+=.*)?(?:\s*\{|\n)", text):
        net = {}
        for nu, sp in side(left):
            net[canon(sp)] = net.get(canon(sp), 0) - nu
        for nu, sp in side(right):
            net[canon(sp)] = net.get(canon(sp), 0) + nu
        reactions.append((name, {k: v for k, v in net.items() if v != 0}))
    model = (re.search(r"\bactivity\s+([\w-]+)", text) or [None, "ideal"])[1]
    setschenow = {}
    for name, body in re.findall(r"species\s+(\S+)(?:\s+\"[^\"]*\")?\s*\{(.*?)\n\}", text, re.S):
        ks = re.search(r"setschenow\s+([\d.eE+-]+)", body)
        if ks:
            setschenow[canon(name)] = float(ks.group(1))
    mixtures = {}
    for name, body in re.findall(r"mixture\s+([\w-]+)\s*\{(.*?)\n\}", text, re.S):
        T = re.search(r"temperature\s+([\d.]+)\s+(\S+)", body)
        T = float(T.group(1)) + (273.15 if T.group(2) == "degC" else 0)
        P = re.search(r"pressure\s+([\d.]+)\s+(\S+)", body)
        P = float(P.group(1)) * (1.01325 if P.group(2) == "atm" else 1.0)
        items = {}
        for sp, amount, unit in re.findall(r"(\S+\(\w+\))(?:[ \t]+([\d.eE+-]+)(?:[ \t]+(bar|mol/kg))?)?", body):
            items[canon(sp)] = (float(amount) if amount else None, unit)
        gas = sum(a for sp, (a, u) in items.items() if sp.endswith("(g)") and a is not None and u == "")
        act = {}
        for sp, (a, u) in items.items():
            if sp.endswith("(g)"):
                act[sp] = a if u == "bar" else a / gas * P
            elif a is None:
                act[sp] = 1.0
            else:
                act[sp] = a
        if model == "davies":
            davies(T, items, act, setschenow)
        mixtures[name] = (T, act)
    return species, reactions, mixtures

def charge(name):
    m = re.search(r"(\^(\d+)([+-])|([+-]+))\(aq\)$", name)
    if not m:
        return 0
    if m.group(4):
        return len(m.group(4)) * (1 if m.group(4)[0] == "+" else -1)
    return int(m.group(2)) * (1 if m.group(3) == "+" else -1)

def davies(T, items, act, setschenow):
    # Davies (1962): log10 g = -A z^2 (sqrt(I)/(1+sqrt(I)) - 0.3 I) with A
    # from CODATA constants, water's permittivity (Malmberg & Maryott 1956)
    # and density (Kell 1975); neutral solutes log10 g = ks I (Setschenow);
    # water from the Gibbs-Duhem relation, integrated here numerically.
    t = T - 273.15
    eps = 87.740 - 0.40008 * t + 9.398e-4 * t**2 - 1.410e-6 * t**3
    rho = (999.83952 + 16.945176 * t - 7.9870401e-3 * t**2 - 46.170461e-6 * t**3
           + 105.56302e-9 * t**4 - 280.54253e-12 * t**5) / (1 + 16.879850e-3 * t)
    e, eps0, kB, NA = 1.602176634e-19, 8.8541878128e-12, 1.380649e-23, 6.02214076e23
    A = math.sqrt(2 * math.pi * NA * rho) / math.log(10) * (e * e / (4 * math.pi * eps0 * eps * kB * T)) ** 1.5
    sol = {sp: a for sp, (a, u) in items.items() if sp.endswith("(aq)") and u == "mol/kg"}
    I = 0.5 * sum(m * charge(sp) ** 2 for sp, m in sol.items())
    def lg(sp, x):
        z = charge(sp)
        if z == 0:
            return setschenow.get(sp, 0.0) * x
        r = math.sqrt(x)
        return -A * z * z * (r / (1 + r) - 0.3 * x)
    total = 0.0
    for sp, m in sol.items():
        act[sp] = m * 10 ** lg(sp, I)
        n = 2000
        h = I / n
        integral = sum((1 if k in (0, n) else 4 if k % 2 else 2) * lg(sp, k * h) for k in range(n + 1)) * h / 3
        total += m * (lg(sp, I) - integral / I) if I > 0 else 0.0
    if "H2O(l)" in items and sol:
        act["H2O(l)"] = math.exp(-0.018015 * (sum(sol.values()) + math.log(10) * total))

def log10k(species, net, T):
    dg = 0.0
    for sp, nu in net.items():
        h, s = species[sp].hs(T)
        dg += nu * (h - T * s)
    return -dg / (R * T * math.log(10))

req = json.load(sys.stdin)
out = {}
for path, temps in req["tables"].items():
    species, reactions, _ = network(path)
    res = {}
    for name, net in reactions:
        if all(sp in species and (species[sp].ranges or species[sp].s is not None) for sp in net):
            res[name] = [log10k(species, net, T) for T in temps]
    out[path] = {"tables": res}
for path in req["approaches"]:
    species, reactions, mixtures = network(path)
    res = {}
    for mname, (T, act) in mixtures.items():
        for name, net in reactions:
            if not all(sp in act for sp in net):
                continue
            lnq = sum(nu * math.log(act[sp]) for sp, nu in net.items())
            k = log10k(species, net, T) if all(sp in species for sp in net) else None
            res[mname + "/" + name] = {"Q": math.exp(lnq), "log10K": k}
    out.setdefault(path, {})["approach"] = res
json.dump(out, sys.stdout)
`

// TestGoldensIndependently checks the numbers of the table and approach
// goldens of the examples against independentScript's recomputation:
// log10 K of every row whose species all carry data, and Q and K of every
// reaction in every mixture, to 1e-6.
func TestGoldensIndependently(t *testing.T) {
	inRoot(t)
	if _, err := os.Stat("/usr/bin/python3"); err != nil {
		requireOutside(t, "the independent recomputation needs Debian's /usr/bin/python3: %v", err)
	}
	type goldenTable struct {
		Reactions []struct {
			Name string `json:"name"`
			Rows []struct {
				T      float64  `json:"T_K"`
				Log10K *float64 `json:"log10K"`
				Source *string  `json:"source"`
			} `json:"rows"`
		} `json:"reactions"`
	}
	type goldenApproach struct {
		Mixtures []struct {
			Name      string `json:"name"`
			Reactions []struct {
				Name string   `json:"name"`
				Q    *float64 `json:"Q"`
				K    *float64 `json:"K"`
			} `json:"reactions"`
		} `json:"mixtures"`
	}
	tables := map[string]string{
		"examples/hydrogen-plant/reformer.hess": "cmd/hess/testdata/table/reformer.json.golden",
		"examples/flue-gas-scrubber.hess":       "cmd/hess/testdata/table/scrubber.json.golden",
	}
	approaches := map[string]string{
		"examples/hydrogen-plant/reformer.hess": "cmd/hess/testdata/approach/reformer.json.golden",
		"examples/flue-gas-scrubber.hess":       "cmd/hess/testdata/approach/scrubber.json.golden",
	}
	req := struct {
		Tables     map[string][]float64 `json:"tables"`
		Approaches []string             `json:"approaches"`
	}{Tables: map[string][]float64{}}
	goldT := map[string]goldenTable{}
	for ex, g := range tables {
		var gt goldenTable
		readGolden(t, g, &gt)
		goldT[ex] = gt
		for _, r := range gt.Reactions[0].Rows {
			req.Tables[ex] = append(req.Tables[ex], r.T)
		}
	}
	goldA := map[string]goldenApproach{}
	for ex, g := range approaches {
		var ga goldenApproach
		readGolden(t, g, &ga)
		goldA[ex] = ga
		req.Approaches = append(req.Approaches, ex)
	}
	in, _ := json.Marshal(req)
	cmd := exec.Command("/usr/bin/python3", "-c", independentScript)
	cmd.Stdin = bytes.NewReader(in)
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	outBytes, err := cmd.Output()
	if err != nil {
		t.Fatalf("independent recomputation: %v\n%s", err, stderr.String())
	}
	var got map[string]struct {
		Tables   map[string][]float64 `json:"tables"`
		Approach map[string]struct {
			Q      float64  `json:"Q"`
			Log10K *float64 `json:"log10K"`
		} `json:"approach"`
	}
	if err := json.Unmarshal(outBytes, &got); err != nil {
		t.Fatal(err)
	}
	checked := 0
	for ex, gt := range goldT {
		for _, rx := range gt.Reactions {
			want, ok := got[ex].Tables[rx.Name]
			if !ok {
				t.Errorf("%s %s: not recomputed", ex, rx.Name)
				continue
			}
			for i, row := range rx.Rows {
				if row.Log10K == nil {
					t.Errorf("%s %s at %g K: golden has no log10 K", ex, rx.Name, row.T)
					continue
				}
				if d := *row.Log10K - want[i]; d > 1e-6 || d < -1e-6 {
					t.Errorf("%s %s at %g K: golden log10 K %.9f, recomputed %.9f", ex, rx.Name, row.T, *row.Log10K, want[i])
				}
				checked++
			}
		}
	}
	for ex, ga := range goldA {
		for _, m := range ga.Mixtures {
			for _, r := range m.Reactions {
				want, ok := got[ex].Approach[m.Name+"/"+r.Name]
				if !ok {
					if r.Q != nil {
						t.Errorf("%s %s %s: golden has Q %g, recomputation has none", ex, m.Name, r.Name, *r.Q)
					}
					continue
				}
				if r.Q == nil || relDiff(*r.Q, want.Q) > 1e-6 {
					t.Errorf("%s %s %s: golden Q %s, recomputed %g", ex, m.Name, r.Name, floatText(r.Q), want.Q)
				}
				if want.Log10K != nil && (r.K == nil || relDiff(*r.K, pow10(*want.Log10K)) > 1e-6) {
					t.Errorf("%s %s %s: golden K %s, recomputed %g", ex, m.Name, r.Name, floatText(r.K), pow10(*want.Log10K))
				}
				checked++
			}
		}
	}
	t.Logf("%d numbers checked", checked)
	if checked < 50 {
		t.Errorf("only %d numbers checked", checked)
	}
}

func readGolden(t *testing.T, path string, v any) {
	t.Helper()
	b, err := os.ReadFile(filepath.FromSlash(path))
	if err != nil {
		t.Fatal(err)
	}
	if err := json.Unmarshal(b, v); err != nil {
		t.Fatalf("%s: %v", path, err)
	}
}

func relDiff(a, b float64) float64 {
	d := a - b
	if d < 0 {
		d = -d
	}
	m := b
	if m < 0 {
		m = -m
	}
	if m == 0 {
		return d
	}
	return d / m
}

func pow10(x float64) float64 { return math.Pow(10, x) }

// requireOutside skips, or fails under HESS_REQUIRE_EXTERNAL=1.
func requireOutside(t *testing.T, format string, args ...any) {
	t.Helper()
	if os.Getenv("HESS_REQUIRE_EXTERNAL") == "1" {
		t.Fatalf(format, args...)
	}
	t.Skipf(format, args...)
}

// floatText writes a golden value for a message, "none" when it is absent.
func floatText(v *float64) string {
	if v == nil {
		return "none"
	}
	return strconv.FormatFloat(*v, 'g', 10, 64)
}
