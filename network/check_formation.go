package network

import (
	"fmt"
	"math"

	"hess/chem"
	"hess/lang"
	"hess/thermo"
)

var formationInconsistentCheck = &Check{
	Name:     "formation-inconsistent",
	Severity: lang.Warning,
	Doc: `a species' gf disagrees with its hf and s
At 298.15 K a species' ΔfG° must equal ΔfH° − T·ΔfS°, where ΔfS° is its S°
less the entropies of the elements that form it, each in its reference
state (½ H2(g), C graphite, ½ O2(g), …). The elements' entropies are the
CODATA key values (Cox, Wagman and Medvedev, 1989); aqueous ions follow the
convention that H+(aq) has ΔfH°, ΔfG° and S° zero, so an ion of charge z
forms with z H+(aq) and releases z/2 H2(g). ΔfH° and S° come from hf and s,
or from the species' polynomial at 298.15 K. The check is skipped for a
species with an element of no tabulated reference entropy (those covered:
` + chem.ReferenceElements() + `), for charged species outside an aqueous phase, and for e-.
It reports when the two values differ by more than the tolerance setting
and by more than twice their combined uncertainty.`,
	Run: func(p *Pass) {
		tol := p.Net.Settings.Tolerance
		for _, sp := range p.Net.Species {
			if sp.Gf == nil {
				continue
			}
			h, sh, s, ss, ok := formationAt298(sp)
			if !ok {
				continue
			}
			off, so, known := formationEntropyOffsetAt(sp, sp.p0)
			if !known {
				continue
			}
			T := thermo.T298
			dfs := s - off
			calc := h - T*dfs
			diff := sp.Gf.V - calc
			sigma := math.Sqrt(sp.Gf.Sigma*sp.Gf.Sigma + sh*sh + T*T*(ss*ss+so*so))
			if math.Abs(diff) <= tol || math.Abs(diff) <= 2*sigma {
				continue
			}
			d := lang.Diagnostic{Subject: sp.Gf.Span, Context: sp.Span,
				Message: fmt.Sprintf("gf of %s is %s kJ/mol, but hf − T·ΔfS° gives %s kJ/mol (ΔfS° = %.3f J/mol/K from its S° and the elements' reference entropies): they differ by %s ± %s kJ/mol (tolerance %s kJ/mol)",
					sp.Key, kjText(sp.Gf.V), kjText(calc), dfs, kjText(diff), kjText(sigma), kjText(tol))}
			if sp.Hf != nil {
				d.Related = append(d.Related, lang.Related{Span: sp.Hf.Span, Message: "hf of " + sp.Key})
			}
			if sp.S != nil {
				d.Related = append(d.Related, lang.Related{Span: sp.S.Span, Message: "s of " + sp.Key})
			}
			p.Report(d)
		}
	},
}
