package network

import (
	"hess/aqueous"
	"hess/lang"
	"hess/thermo"
)

var activityRangeCheck = &Check{
	Name:     "activity-range",
	Severity: lang.Warning,
	Doc: `a solution lies beyond its activity model's range of validity
Each activity model holds up to an ionic strength: Davies' equation to about
0.5 mol/kg, the extended Debye–Hückel equation to about 0.1, Helgeson's
b-dot to about 1 for solutions dominated by NaCl (common practice), and
ideal activities (γ = 1) to about 0.001 (our choice). A mixture whose ionic
strength, I = ½ Σ m z², exceeds that of the network's activity setting gets
activities that may be far off; the message names I and the model. The
models' A and B come from water's permittivity and density, published for
0–100 °C: a mixture outside that range is reported too, and its activity
coefficients are taken as 1. The ideal model is judged only where the
network chooses it explicitly (activity ideal).`,
	Run: func(p *Pass) {
		explicit := p.Net.Settings.Activity != ""
		for _, m := range p.Net.Mixtures {
			if span, msg, ok := activityRangeProblem(m, explicit); ok {
				p.Reportf(span, "%s", msg)
			}
		}
	},
}

var missingSolventCheck = &Check{
	Name:     "missing-solvent",
	Severity: lang.Error,
	Doc: `a solution lists solutes but no water
An activity model other than ideal describes solutes in water: water's own
activity follows from the solutes through the model, and a gas held at a
fixed partial pressure dissolves into it. A mixture that lists aq solutes
under such a model, or beside a fixed gas, must list its solvent H2O(l) (a
pure liquid, listed without a number).`,
	Run: func(p *Pass) {
		_, ideal := p.Net.ActivityModel().(aqueous.Ideal)
		for _, m := range p.Net.Mixtures {
			if !m.Solutes() || m.hasWater() {
				continue
			}
			switch {
			case !ideal:
				p.Reportf(m.NameSpan, "mixture %s lists solutes but no water: the %s activity model describes an aqueous solution; list H2O(l) as its solvent",
					m.Name, p.Net.ActivityModel().Name())
			case m.hasFixed():
				p.Reportf(m.NameSpan, "mixture %s lists solutes and a fixed gas but no water: list H2O(l) as the solvent the gas dissolves in", m.Name)
			}
		}
	},
}

var fixedNotGasCheck = &Check{
	Name:     "fixed-not-gas",
	Severity: lang.Error,
	Doc: `a mixture member marked fixed is not a gas at a partial pressure
The keyword fixed after a mixture member holds that species at its partial
pressure, as if the mixture were open to a large reservoir of it (air's CO2
over a pond: CO2(g) 0.0004 bar fixed); an equilibrium then keeps its
activity and exchanges with the reservoir whatever it takes. Only a gas given
as a partial pressure can be held so: a solute, a pure phase, a solution
member or a gas given as a mole fraction cannot.`,
	Run: func(p *Pass) {
		for _, m := range p.Net.Mixtures {
			for _, mm := range m.Members {
				if !mm.Fixed {
					continue
				}
				switch {
				case mm.Species.Activity() != thermo.ActivityGas:
					p.Reportf(mm.Span, "%s is marked fixed but is not a gas: only a gas can be held at a fixed partial pressure", mm.Species.Key)
				case mm.Kind == AmountFraction:
					p.Reportf(mm.Span, "%s is marked fixed but given as a mole fraction: give its partial pressure, such as 0.0004 bar", mm.Species.Key)
				}
			}
		}
	},
}

// hasWater reports whether the mixture lists liquid water.
func (m *Mixture) hasWater() bool {
	for _, mm := range m.Members {
		if mm.Species.IsWater() {
			return true
		}
	}
	return false
}

// hasFixed reports whether the mixture holds some member fixed.
func (m *Mixture) hasFixed() bool {
	for _, mm := range m.Members {
		if mm.Fixed {
			return true
		}
	}
	return false
}

var missingIonSizeCheck = &Check{
	Name:     "missing-ion-size",
	Severity: lang.Warning,
	Doc: `an ion in a solution has no size parameter under a model that reads one
The debye-huckel and b-dot activity models read each ion's size parameter å
(size 4.5 Å in its species block; Kielland's 1937 table is the usual
source). An ion that a mixture lists without one falls back to the
Debye–Hückel limiting law, which underestimates γ beyond about 0.005 mol/kg.
Reported once per ion, at its declaration.`,
	Run: func(p *Pass) {
		if !aqueous.UsesIonSize(p.Net.ActivityModel()) {
			return
		}
		seen := map[*Species]bool{}
		for _, m := range p.Net.Mixtures {
			for _, mm := range m.Members {
				sp := mm.Species
				if mm.Kind != AmountMolality || sp.Charge == 0 || sp.Size != nil || seen[sp] {
					continue
				}
				seen[sp] = true
				p.Reportf(sp.Span, "%s has no size parameter for the %s activity model (mixture %s lists it): give one, such as size 4.5 Å; without it the limiting law applies",
					sp.Key, p.Net.ActivityModel().Name(), m.Name)
			}
		}
	},
}
