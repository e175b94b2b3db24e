package network

import (
	"math"
	"slices"

	"hess/thermo"
)

// Model returns the species' thermodynamic model, or nil when it has no usable data.
//
// Polynomial ranges (shomate, nasa7) make the model when the species has
// any; hf and s given beside them are only compared with it at 298.15 K.
// Otherwise hf and s make a constant-heat-capacity model (cp, or 0), valid
// from thermo.ConstTmin to thermo.ConstTmax, and gf alone makes a model that
// holds at 298.15 K only. hf without s, or s without hf, is no model.
func (s *Species) Model() thermo.Model {
	if s.built {
		return s.model
	}
	return s.buildModel()
}

// buildModels builds every species' model once the network is compiled, so
// that Model is a plain read afterwards (safe for concurrent readers). Each
// species' model depends only on the species and the settings, so the
// species are built in parallel. With reuse, a species that took its data
// from the last compile's takes that one's model too, when it was built
// for the same pressures and the same activity convention.
func buildModels(n *Network, reuse *modelReuse) {
	parallel(len(n.Species), 256, func() func(i int) {
		return func(i int) {
			sp := n.Species[i]
			sp.p0, _ = n.DataPressure(sp.Span.File)
			if old := reuse.of(n, sp); old != nil {
				sp.model, sp.cover, sp.derivedS = old.model, old.cover, old.derivedS
				sp.built = true
				return
			}
			sp.model = n.pressureShiftedModel(sp, sp.buildModel())
			sp.cover = coverage(sp.model)
			sp.built = true
		}
	})
}

// modelReuse is what buildModels may take from the last compile: which
// species' data each species took (reuse.go), and the standard pressure
// their models were built for.
type modelReuse struct {
	from     *speciesOrigins
	pressure float64
}

// of is the species of the last compile whose model sp may take: the one
// whose data it took, its model built for the same standard pressure,
// the same pressure of the data and the same activity convention, which
// with the data are all a model is built from (buildModel,
// pressureShiftedModel).
func (r *modelReuse) of(n *Network, sp *Species) *Species {
	if r == nil || r.pressure != n.StandardPressure() {
		return nil
	}
	old := r.from.of(sp)
	if old == nil || !old.built || old.p0 != sp.p0 || old.Activity() != sp.Activity() {
		return nil
	}
	return old
}

func (s *Species) buildModel() thermo.Model {
	s.derivedS = nil
	if len(s.Ranges) > 0 {
		pieces := make([]thermo.Model, 0, len(s.Ranges))
		for _, r := range sortedRanges(s.Ranges) {
			m := r.model()
			if m == nil {
				return nil
			}
			pieces = append(pieces, m)
		}
		pw, err := thermo.NewPiecewise(pieces...)
		if err != nil {
			return nil
		}
		return pw
	}
	switch {
	case s.Hf != nil && s.S != nil:
		cp := 0.0
		if s.Cp != nil {
			cp = s.Cp.V
		}
		m, err := thermo.NewConstantCp(s.Hf.V, s.S.V, cp)
		if err != nil {
			return nil
		}
		return m
	case s.Hf != nil && s.Gf != nil && s.S == nil:
		if d := s.deriveS(); d != nil {
			cp := 0.0
			if s.Cp != nil {
				cp = s.Cp.V
			}
			if m, err := thermo.NewConstantCp(s.Hf.V, d.V, cp); err == nil {
				s.derivedS = d
				return m
			}
		}
		m, err := thermo.NewGibbsOnly(s.Gf.V)
		if err != nil {
			return nil
		}
		return m
	case s.Gf != nil:
		m, err := thermo.NewGibbsOnly(s.Gf.V)
		if err != nil {
			return nil
		}
		return m
	}
	return nil
}

// sortedRanges returns the ranges in the order thermo.Piecewise keeps them:
// by lower bound, ties in source order.
func sortedRanges(rs []*PolyRange) []*PolyRange {
	byTmin := func(a, b *PolyRange) int {
		switch {
		case a.Tmin < b.Tmin:
			return -1
		case a.Tmin > b.Tmin:
			return 1
		}
		return 0
	}
	if slices.IsSortedFunc(rs, byTmin) {
		// Ranges are nearly always written in order; callers only read.
		return rs
	}
	out := slices.Clone(rs)
	slices.SortStableFunc(out, byTmin)
	return out
}

// model is the range as a thermo model, or nil when its numbers are
// unusable: the one the compiler built, else built now.
func (r *PolyRange) model() thermo.Model {
	if r.m != nil {
		return r.m
	}
	return r.buildModel()
}

// buildModel is model built from the range's numbers.
func (r *PolyRange) buildModel() thermo.Model {
	if !(r.Tmin > 0) || !(r.Tmax > r.Tmin) || math.IsInf(r.Tmax, 0) {
		return nil
	}
	for _, c := range r.Coeffs {
		if math.IsNaN(c) || math.IsInf(c, 0) {
			return nil
		}
	}
	switch {
	case r.Kind == "shomate" && len(r.Coeffs) == 8:
		m := thermo.ShomateRange{Tmin: r.Tmin, Tmax: r.Tmax}
		copy(m.Coef[:], r.Coeffs)
		return m
	case r.Kind == "nasa7" && len(r.Coeffs) == 7:
		m := thermo.NASA7Range{Tmin: r.Tmin, Tmax: r.Tmax}
		copy(m.A[:], r.Coeffs)
		return m
	}
	return nil
}

// Sigma returns the standard uncertainties written with the species' hf, s
// and gf (zero where none was given); an S° derived from hf and gf carries
// theirs.
func (s *Species) Sigma() thermo.SpeciesSigma {
	var sg thermo.SpeciesSigma
	if s.Hf != nil {
		sg.H = s.Hf.Sigma
	}
	switch {
	case s.S != nil:
		sg.S = s.S.Sigma
	case s.derivedS != nil:
		sg.S = s.derivedS.Sigma
	}
	if s.Gf != nil {
		sg.G = s.Gf.Sigma
	}
	return sg
}

// sigmaStated reports whether any of the species' hf, s, gf states an
// uncertainty.
func (s *Species) sigmaStated() bool {
	for _, v := range []*Value{s.Hf, s.S, s.Gf, s.Cp} {
		if v != nil && v.Stated {
			return true
		}
	}
	return false
}

// DerivedS is S° at 298.15 K worked out from hf and gf for a species that
// gives both but no s: S° = (ΔfH° − ΔfG°)/T + Σ S° of its elements in their
// reference states at the standard pressure its data refer to. Nil where the
// species gives s, lacks hf or gf, or has an element of no tabulated
// reference entropy.
func (s *Species) DerivedS() *Value {
	s.Model()
	return s.derivedS
}

// Activity returns how the species enters an equilibrium expression, from
// its phase's convention: an ideal gas, a pure solid (s, cr and declared
// pure phases), a pure liquid (l), a solute, or a member of a solution. A
// species without a known phase is ActivityUnstated.
func (s *Species) Activity() thermo.Activity {
	if s.Phase == nil {
		return thermo.ActivityUnstated
	}
	switch s.Phase.Convention {
	case IdealGas:
		return thermo.ActivityGas
	case Pure:
		if s.Phase.Tag == "l" {
			return thermo.ActivityPureLiquid
		}
		return thermo.ActivityPureSolid
	case Solute:
		return thermo.ActivitySolute
	case SolutionMember:
		return thermo.ActivitySolution
	}
	return thermo.ActivityUnstated
}

// hasThermoData reports whether the species carries any thermodynamic datum.
func (s *Species) hasThermoData() bool {
	return s.Hf != nil || s.Gf != nil || s.S != nil || s.Cp != nil || len(s.Ranges) > 0
}

// isGibbsOnly reports whether a model holds at the single temperature
// 298.15 K (a species known by gf alone).
func isGibbsOnly(m thermo.Model) bool {
	lo, hi := m.Range()
	return lo == hi
}

// coverage is coverage(s.Model()), worked out once when the models are
// built. Callers must not change it.
func (s *Species) coverage() [][2]float64 {
	if s.built {
		return s.cover
	}
	return coverage(s.Model())
}

// coverage lists the spans of temperature where a model's data hold.
func coverage(m thermo.Model) [][2]float64 {
	if m == nil {
		return nil
	}
	if pw, ok := m.(*thermo.Piecewise); ok {
		bounds := pw.Bounds()
		out := make([][2]float64, len(bounds))
		for i, b := range bounds {
			out[i] = [2]float64{b[0] - thermo.JoinTolerance, b[1] + thermo.JoinTolerance}
		}
		return out
	}
	lo, hi := m.Range()
	if lo == hi {
		return [][2]float64{{thermo.T298 - thermo.T298Tolerance, thermo.T298 + thermo.T298Tolerance}}
	}
	return [][2]float64{{lo, hi}}
}

func coveredBy(spans [][2]float64, T float64) bool {
	for _, s := range spans {
		if T >= s[0] && T <= s[1] {
			return true
		}
	}
	return false
}

// deriveS works out S° at 298.15 K from hf and gf: ΔfS° = (ΔfH° − ΔfG°)/T
// at T = 298.15 K, plus the elements' reference entropies at the standard
// pressure the species' data refer to. Nil when an element has no
// tabulated entropy.
func (s *Species) deriveS() *Value {
	p0 := s.p0
	if !(p0 > 0) {
		p0 = thermo.Bar
	}
	off, sigmaOff, ok := formationEntropyOffsetAt(s, p0)
	if !ok {
		return nil
	}
	v := (s.Hf.V-s.Gf.V)/thermo.T298 + off
	sigma := math.Hypot(math.Hypot(s.Hf.Sigma, s.Gf.Sigma)/thermo.T298, sigmaOff)
	return &Value{V: v, Sigma: sigma, Span: s.Gf.Span, Stated: s.Hf.Stated || s.Gf.Stated}
}
