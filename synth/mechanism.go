package synth

import (
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strings"
)

// Mechanism shape: temperatures of the ranges and the share of isomers.
const (
	mechLow       = 200.0
	mechHigh      = 5000.0
	isomerPercent = 20 // of the species, each an isomer of a composition listed before it
)

// mechMids are the join temperatures a species' two ranges meet at.
var mechMids = [...]float64{1000, 1000, 1000, 1200, 1500}

// mechIsomerPrefix names isomers: the prefix and the formula, "aC3H7".
const mechIsomerPrefix = "abcdefghjkmpqrsuvwxyz"

// generateMechanism writes the Mechanism shape; cfg is already validated.
func generateMechanism(cfg Config) *Network {
	rng := rand.New(rand.NewPCG(cfg.Seed, 0x6d6563686e69736d))
	sp := makeMechanismSpecies(cfg.Species, rng)
	byComp := make(map[comp][]int, len(sp))
	for i, s := range sp {
		byComp[s.c] = append(byComp[s.c], i)
	}
	var b strings.Builder
	b.Grow(cfg.Species*330 + cfg.Reactions*64)
	b.WriteString("# Generated demo mechanism (invented data, not for design)\n")
	b.WriteString("settings {\n  pressure 1 bar\n  temperatures 300 K to 2500 K by 200 K\n}\n\n")
	b.WriteString("# species\n\n")
	for i := range sp {
		writeMechanismSpecies(&b, &sp[i])
	}
	b.WriteString("\n# reactions\n\n")
	every := 0
	if cfg.OwnData > 0 {
		every = cfg.Reactions / cfg.OwnData
	}
	own := 0
	// Every cover-th reaction starts from the next species that takes part
	// in no reaction yet, so that every species does where the reactions
	// are enough; no equation is written twice either way.
	cover := max(1, cfg.Reactions/len(sp))
	seen := make(map[string]bool, 2*cfg.Reactions)
	used := make([]bool, len(sp))
	next := 0
	for i := 0; i < cfg.Reactions; i++ {
		var bring []int
		if i%cover == 0 {
			// Where there are fewer reactions than species, each must bring
			// in two new ones.
			want := 1
			if cfg.Reactions < len(sp) {
				want = 2
			}
			for k := next; k < len(sp) && len(bring) < want; k++ {
				if !used[k] && sp[k].c.total() >= 2 {
					bring = append(bring, k)
				}
			}
			for next < len(sp) && (used[next] || sp[next].c.total() < 2) {
				next++
			}
		}
		left, right := makeMechanismReaction(sp, byComp, bring, seen, rng)
		for _, t := range left {
			used[t.sp] = true
		}
		for _, t := range right {
			used[t.sp] = true
		}
		fmt.Fprintf(&b, "reaction R%d: %s <-> %s", i+1, side(sp, left), side(sp, right))
		if every > 0 && i%every == 0 && own < cfg.OwnData {
			own++
			writeOwnData(&b, sp, left, right, rng)
		}
		b.WriteString("\n")
	}
	const root = "mechanism.hess"
	return &Network{Root: root, Names: []string{root}, Files: map[string][]byte{root: []byte(b.String())}}
}

// makeMechanismSpecies lists compositions by atom count, as the Spread
// shape does, and makes one species in five an isomer of a composition of
// three or more atoms listed before it.
func makeMechanismSpecies(n int, rng *rand.Rand) []species {
	isomers := n * isomerPercent / 100
	if n < 50 {
		isomers = 0 // too few compositions of three or more atoms to copy
	}
	cs := listComps(n - isomers)
	sp := make([]species, 0, n)
	var big []int // compositions an isomer may copy
	count := map[comp]int{}
	for _, c := range cs {
		if c.total() >= 3 {
			big = append(big, len(sp))
		}
		count[c]++
		sp = append(sp, newMechanismSpecies(c, rng))
	}
	for len(sp) < n && len(big) > 0 {
		c := sp[big[rng.IntN(len(big))]].c
		k := count[c]
		if k > len(mechIsomerPrefix) {
			continue
		}
		count[c]++
		s := newMechanismSpecies(c, rng)
		s.name = mechIsomerPrefix[k-1:k] + s.name
		s.isomer = true
		sp = append(sp, s)
	}
	return sp
}

// listComps lists the first n compositions by atom count.
func listComps(n int) []comp {
	var cs []comp
	for t := 1; len(cs) < n; t++ {
		for c := 0; c <= t && len(cs) < n; c++ {
			for h := 0; c+h <= t && len(cs) < n; h++ {
				for nn := 0; c+h+nn <= t && len(cs) < n; nn++ {
					cs = append(cs, comp{c, h, nn, t - c - h - nn})
				}
			}
		}
	}
	return cs
}

// newMechanismSpecies invents data with all five heat-capacity terms. With
// x = T/Tmid the low range is Cp/R = c0 + d(2x − x²) + e·x³(1 − x), rising
// to c0 + d at the join; with u = T/Tmid − 1 the high range is
// Cp/R = c0 + d + g·u − h·u² + k·u³(1 − u/(2U)), U its last u, which keeps
// rising. Both are positive on their ranges; H° and S° meet at the join.
func newMechanismSpecies(c comp, rng *rand.Rand) species {
	s := species{c: c, name: c.name(), mid: mechMids[rng.IntN(len(mechMids))]}
	atoms := float64(c.total())
	s.refState = c.total() == 2 && (c[1] == 2 || c[2] == 2 || c[3] == 2)
	hf := 0.0
	if !s.refState {
		hf = (rng.Float64()*500 - 300) * kJ
	}
	s298 := 110 + 35*atoms + 20*rng.Float64()
	m := s.mid
	c0 := 2.5 + 0.4*(atoms-1)*(0.8+0.4*rng.Float64())
	d := 0.5 * (atoms - 1) * (0.6 + 0.8*rng.Float64())
	e := d * (0.6*rng.Float64() - 0.3)
	low := polyOf([]float64{c0, 2 * d, -d, e, -e}, 1/m, 0)
	U := mechHigh/m - 1
	g := 0.1 * (atoms - 1) * (0.5 + rng.Float64())
	h := g / (2.4 * U)
	k := 0.02 * g / (U * U)
	hi := polyOf([]float64{c0 + d, g, -h, k, -k / (2 * U)}, 1/m, -1)
	copy(s.low[:5], low[:])
	copy(s.hi[:5], hi[:])
	s.low[5] = hf/gasR - hOverR(&s.low, tRef)
	s.low[6] = s298/gasR - sOverR(&s.low, tRef)
	s.hi[5] = hOverR(&s.low, m) + s.low[5] - hOverR(&s.hi, m)
	s.hi[6] = sOverR(&s.low, m) + s.low[6] - sOverR(&s.hi, m)
	s.g298 = hf - tRef*s298
	return s
}

// polyOf returns the coefficients in T of p(αT + β), p given by its
// coefficients in ascending powers (at most five); any −0 is made +0.
func polyOf(p []float64, alpha, beta float64) [5]float64 {
	var out [5]float64
	// (αT + β)^i = Σ_j C(i,j) α^j β^(i−j) T^j
	for i, c := range p {
		binom := 1.0
		for j := 0; j <= i; j++ {
			out[j] += c * binom * math.Pow(alpha, float64(j)) * math.Pow(beta, float64(i-j))
			binom = binom * float64(i-j) / float64(j+1)
		}
	}
	for i := range out {
		out[i] += 0
	}
	return out
}

// hOverR is H/R of a NASA 7-term range without its a6.
func hOverR(a *[7]float64, T float64) float64 {
	return T * (a[0] + T*(a[1]/2+T*(a[2]/3+T*(a[3]/4+T*a[4]/5))))
}

// sOverR is S/R of a NASA 7-term range without its a7.
func sOverR(a *[7]float64, T float64) float64 {
	return a[0]*math.Log(T) + T*(a[1]+T*(a[2]/2+T*(a[3]/3+T*a[4]/4)))
}

// writeMechanismSpecies writes the species with its two ranges, the
// coefficients five to a line and then two, as mechanism files set them.
func writeMechanismSpecies(b *strings.Builder, s *species) {
	fmt.Fprintf(b, "species %s(g) {\n", s.name)
	if s.isomer {
		fmt.Fprintf(b, "  formula %s\n", s.c.name())
	}
	for _, r := range []struct {
		lo, hi float64
		a      *[7]float64
	}{{mechLow, s.mid, &s.low}, {s.mid, mechHigh, &s.hi}} {
		a := r.a
		fmt.Fprintf(b, "  nasa7 %g K to %g K {\n    %.9E %.9E %.9E %.9E %.9E\n    %.9E %.9E\n  }\n",
			r.lo, r.hi, a[0]+0, a[1]+0, a[2]+0, a[3]+0, a[4]+0, a[5]+0, a[6]+0)
	}
	b.WriteString("}\n")
}

// makeMechanismReaction draws a step as mechanisms hold them: mostly
// bimolecular exchanges (A + B <-> C + D), then decompositions and
// recombinations, and isomerisations where the composition has isomers.
// Given species to bring in, it first tries them on the left (two as a
// bimolecular step, one as a decomposition), then the first alone. An
// equation in seen, either way round, is drawn again; the new one is added.
func makeMechanismReaction(sp []species, byComp map[comp][]int, bring []int, seen map[string]bool, rng *rand.Rand) (left, right []term) {
	for try := 0; ; try++ {
		if len(bring) == 2 && try < 30 {
			a, b := sp[bring[0]].c, sp[bring[1]].c
			for e := range a {
				a[e] += b[e]
			}
			left = []term{{1, bring[0]}, {1, bring[1]}}
			right, ok := split(a, 2, byComp, rng)
			if ok && !shares(left, right) && fresh(sp, left, right, seen) {
				return left, right
			}
			continue
		}
		if len(bring) > 0 && try < 60 {
			left = []term{{1, bring[0]}}
			right, ok := split(sp[bring[0]].c, 2, byComp, rng)
			if ok && !shares(left, right) && fresh(sp, left, right, seen) {
				return left, right
			}
			continue
		}
		s := sp[rng.IntN(len(sp))].c
		var r, p int
		switch x := rng.IntN(20); {
		case x < 13:
			r, p = 2, 2
		case x < 16:
			r, p = 1, 2
		case x < 19:
			r, p = 2, 1
		default:
			r, p = 1, 1
		}
		if s.total() < max(r, p) {
			continue
		}
		left, ok := split(s, r, byComp, rng)
		if !ok {
			continue
		}
		right, ok := split(s, p, byComp, rng)
		if !ok || shares(left, right) || !fresh(sp, left, right, seen) {
			continue
		}
		return left, right
	}
}

// fresh reports whether the equation, either way round, is not in seen,
// and adds it.
func fresh(sp []species, left, right []term, seen map[string]bool) bool {
	key := func(ts []term) string {
		parts := make([]string, len(ts))
		for i, t := range ts {
			parts[i] = fmt.Sprintf("%d %s", t.n, sp[t.sp].name)
		}
		slices.Sort(parts)
		return strings.Join(parts, "+")
	}
	l, r := key(left), key(right)
	if seen[l+"="+r] || seen[r+"="+l] {
		return false
	}
	seen[l+"="+r] = true
	return true
}

// split draws k nonzero parts summing to s, each part one of the species
// of its composition (drawn at random where there are several), equal
// parts merged.
func split(s comp, k int, byComp map[comp][]int, rng *rand.Rand) ([]term, bool) {
	var ts []term
	rest := s
	for i := 0; i < k; i++ {
		part := rest
		if i < k-1 {
			for e := range part {
				part[e] = rng.IntN(rest[e] + 1)
			}
			left := rest
			for e := range left {
				left[e] -= part[e]
			}
			if part.total() == 0 || left.total() == 0 {
				return nil, false
			}
		}
		for e := range rest {
			rest[e] -= part[e]
		}
		js := byComp[part]
		if len(js) == 0 {
			return nil, false
		}
		j := js[0]
		if len(js) > 1 {
			j = js[rng.IntN(len(js))]
		}
		merged := false
		for at := range ts {
			if ts[at].sp == j {
				ts[at].n++
				merged = true
			}
		}
		if !merged {
			ts = append(ts, term{1, j})
		}
	}
	return ts, true
}
