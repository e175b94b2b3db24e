package network

import (
	"math"

	"hess/thermo"
)

// StandardGibbs returns the species' standard Gibbs energy at T in J/mol on
// the scale G° = H° − T·S°, H° referred to the elements at 298.15 K (ΔfH°)
// and S° absolute: the scale on which Σ ν G° of any balanced reaction is
// its ΔrG°, so that an equilibrium solver can take μ° of every species from
// it. It comes from the species' model where that covers T; at 298.15 K
// also from ΔfG° (gf, or an element in its reference state) as
// ΔfG° − T·Σ S° of the elements that form it (the H+(aq) convention for
// ions, as formation-inconsistent reads it). ok is false where the data do
// not give G° at T.
func (sp *Species) StandardGibbs(T float64) (g float64, ok bool) {
	if m := sp.Model(); m != nil {
		if _, only := m.(thermo.GibbsOnly); !only && sp.DataAt(T) {
			if g := m.G(T); !math.IsNaN(g) && !math.IsInf(g, 0) {
				return g, true
			}
		}
	}
	if !thermo.AtT298(T) {
		return 0, false
	}
	gf, _, have, _ := formationGibbs(sp)
	if !have {
		return 0, false
	}
	off, _, known := formationEntropyOffset(sp)
	if !known {
		return 0, false
	}
	return gf - T*off, true
}

// FormationGibbs returns the species' ΔfG° at 298.15 K in J/mol: 0 for an
// element in its reference state, gf where given, else from hf and S° with
// the elements' reference entropies. It is the other scale on which Σ ν of
// a balanced reaction is ΔrG° (at 298.15 K only), and serves species of
// elements whose reference entropy is not tabulated, which StandardGibbs
// cannot place from gf.
func (sp *Species) FormationGibbs() (float64, bool) {
	g, _, ok, _ := formationGibbs(sp)
	return g, ok
}
