package network

import (
	"fmt"
	"math"
	"strings"

	"hess/chem"
	"hess/lang"
	"hess/thermo"
)

var extrapolationCheck = &Check{
	Name:     "extrapolation",
	Severity: lang.Warning,
	Doc: `a requested temperature lies outside a species' data range
Each shomate or nasa7 range holds between its two bounds, and a reaction's
own data between theirs (a fit of several logk from the lowest to the
highest logk temperature, two of dh, ds and dg or dh with one logk within
100 K of the temperature they refer to); hf and s (with
or without a constant cp), which state no range, are taken to hold within
100 K of 298.15 K, where leaving out how Cp° varies costs about the default
tolerance (ΔrCp° of 35 J/mol/K gives 0.5 to 0.7 kJ/mol in ΔrG° at the
edges). A requested temperature (settings
temperatures, or hess table --temperatures) outside every range of a
species used in a reaction is computed by extending the nearest range,
and such values can be far off, above all for Cp°. The message names the
temperatures and the span the data cover; the table marks those rows as
extrapolated. A mixture's temperature counts for each species it lists
that a reaction evaluated in the mixture uses; hess approach marks those
values as extrapolated.`,
	Run: func(p *Pass) {
		temps := p.Net.Temperatures
		p.eachSpecies("extrapolation/species", func(sp *Species) {
			m := sp.Model()
			if !sp.Used || m == nil || isGibbsOnly(m) {
				return
			}
			var out []float64
			for _, T := range temps {
				if T > 0 && !sp.DataAt(T) {
					out = append(out, T)
				}
			}
			if len(out) == 0 {
				return
			}
			verb := "is"
			if len(out) > 1 {
				verb = "are"
			}
			p.Reportf(sp.Span, "%s %s outside the data of %s (%s); values there are extrapolated",
				kelvinList(out), verb, sp.Key, coverageText(sp, m))
		})
		for _, rx := range p.Net.Reactions {
			extrapolatedOwnData(p, rx, temps)
		}
		for _, mx := range p.Net.Mixtures {
			extrapolatedInMixture(p, mx)
		}
	},
}

// extrapolatedOwnData reports the requested temperatures at which a
// reaction's rows come from its own data beyond their range (a fit beyond
// its logk temperatures, a constant ΔrH° and ΔrS° more than
// thermo.DefaultSpan from the temperature its data refer to).
func extrapolatedOwnData(p *Pass, rx *Reaction, temps []float64) {
	if !rx.Resolved {
		return
	}
	o := newOwnK(rx, 0)
	lo, hi := o.span()
	if !(lo < hi) {
		return
	}
	var out []float64
	for _, T := range temps {
		if T > 0 && (T < lo-thermo.T298Tolerance || T > hi+thermo.T298Tolerance) {
			if pt := p.Net.ReactionK(rx).at(T); pt.ok() && pt.extrapolated && (pt.basis == BasisReactionData || pt.basis == BasisFit) {
				out = append(out, T)
			}
		}
	}
	if len(out) == 0 {
		return
	}
	what := "its dh, ds, dg or logk hold"
	if o.fit != nil {
		what = "the fit of its logk holds"
	}
	verb := "is"
	if len(out) > 1 {
		verb = "are"
	}
	p.Reportf(rx.NameSpan(), "%s %s outside the own data of %s (%s from %s to %s); values there are extrapolated",
		kelvinList(out), verb, rx.Name, what, kelvin(lo), kelvin(hi))
}

// extrapolatedInMixture reports the members of a mixture whose data do not
// reach its temperature, where some reaction evaluated in the mixture (one
// whose species it all lists) uses them.
func extrapolatedInMixture(p *Pass, mx *Mixture) {
	if !mx.Usable() {
		return
	}
	T := mx.Temperature.V
	used := map[*Species]bool{}
	for _, rx := range p.Net.Reactions {
		if !rx.Resolved || !listsAll(mx, rx) {
			continue
		}
		for _, side := range [2][]Term{rx.Left, rx.Right} {
			for _, t := range side {
				used[t.Species] = true
			}
		}
	}
	for _, mm := range mx.Members {
		sp := mm.Species
		if sp == nil || !used[sp] {
			continue
		}
		if m := sp.Model(); m != nil && !isGibbsOnly(m) && !sp.DataAt(T) {
			p.Reportf(mm.Span, "%s, the temperature of mixture %s, is outside the data of %s (%s); its approach values are extrapolated",
				kelvin(T), mx.Name, sp.Key, coverageText(sp, m))
		}
	}
}

// listsAll reports whether the mixture lists every species of the
// reaction's net equation, so that the reaction is evaluated in it.
func listsAll(mx *Mixture, rx *Reaction) bool {
	for _, side := range [2][]Term{rx.Left, rx.Right} {
		for _, t := range side {
			if mx.Member(t.Species) == nil {
				// A species written on both sides cancels out.
				for _, nt := range rx.NetTerms() {
					if mx.Member(nt.Species) == nil {
						return false
					}
				}
				return true
			}
		}
	}
	return true
}

// coverageText says which temperatures a species' data cover.
func coverageText(sp *Species, m thermo.Model) string {
	if len(sp.Ranges) == 0 {
		lo, hi := m.Range()
		return fmt.Sprintf("hf and s hold from %s to %s", kelvin(lo), kelvin(hi))
	}
	// Merge ranges that meet or overlap into spans.
	type span struct{ lo, hi float64 }
	var spans []span
	for _, r := range sortedRanges(sp.Ranges) {
		if n := len(spans); n > 0 && r.Tmin <= spans[n-1].hi+thermo.JoinTolerance {
			spans[n-1].hi = math.Max(spans[n-1].hi, r.Tmax)
			continue
		}
		spans = append(spans, span{r.Tmin, r.Tmax})
	}
	parts := make([]string, len(spans))
	for i, s := range spans {
		parts[i] = kelvin(s.lo) + " to " + kelvin(s.hi)
	}
	return "they cover " + strings.Join(parts, " and ")
}

var missingThermoCheck = &Check{
	Name:     "missing-thermo",
	Severity: lang.Warning,
	Doc: `a reaction's K cannot be computed at a requested temperature
K(T) needs ΔrG°(T): every species of the reaction with data that reach T
(hf and s, or polynomial ranges), or at 298.15 K the gf of every species,
or the reaction's own data (logk at T, two of dh, ds and dg), or for a
coupled reaction its parts. The message names the temperatures and the
species whose data fall short; its table rows are empty. A reaction none
of whose species carries any data is not reported when its own data are
at most a dh (an enthalpy for Hess's law) or a rate (a kinetics-only
step). Data that were written but did not compile (a bad unit, a broken
statement) are reported there, once: the species is left out of this
message, and a reaction whose own data did not compile is not reported.`,
	Run: func(p *Pass) {
		temps := p.Net.Temperatures
		known := newGivesG(p.Net)
		known.fill(temps)
		for _, rx := range p.Net.Reactions {
			if !rx.Resolved || speciesGiveDeltaG(rx, temps, known) || !thermoIntent(rx) || dataBroken(rx) {
				continue
			}
			c := p.Net.ReactionK(rx)
			var bad []float64
			var lacking []*Species
			brokenLack := false // a species lacks data because they did not compile
			seen := map[*Species]bool{}
			for _, T := range temps {
				if !(T > 0) || c.okAt(T) {
					continue
				}
				bad = append(bad, T)
				for _, sp := range c.lacking(T) {
					if sp.BrokenData {
						brokenLack = true
						continue
					}
					if !seen[sp] {
						seen[sp] = true
						lacking = append(lacking, sp)
					}
				}
			}
			if len(bad) == 0 || (brokenLack && len(lacking) == 0) {
				continue
			}
			msg := fmt.Sprintf("K of %s cannot be computed at %s", rx.Name, kelvinList(bad))
			var reasons []string
			var related []lang.Related
			for _, sp := range lacking {
				reasons = append(reasons, sp.Key+" "+lackReason(sp))
				related = append(related, lang.Related{Span: sp.Span, Message: sp.Key + " declared here"})
			}
			if len(reasons) > 0 {
				msg += ": " + strings.Join(reasons, "; ")
			}
			p.Report(lang.Diagnostic{Subject: rx.NameSpan(), Context: rx.Span(), Message: msg, Related: related})
		}
	},
}

// dataBroken reports whether some of the reaction's own data, or of a part
// of its combination, were written but did not compile. That error is
// reported where it was written, so a missing K is its consequence and not
// reported again. (A species whose data did not compile is left out of the
// species the message names; see missingThermoCheck.)
func dataBroken(rx *Reaction) bool {
	return dataBrokenWithin(rx, map[*Reaction]bool{})
}

func dataBrokenWithin(rx *Reaction, seen map[*Reaction]bool) bool {
	if seen[rx] {
		return false
	}
	seen[rx] = true
	if rx.BrokenData {
		return true
	}
	for _, ct := range rx.Combo {
		if ct.Reaction != nil && dataBrokenWithin(ct.Reaction, seen) {
			return true
		}
	}
	return false
}

// thermoIntent reports whether a reaction is meant to have a K: a species
// of it carries data, or it or a part of it carries data beyond a dh.
func thermoIntent(rx *Reaction) bool {
	return thermoIntentWithin(rx, map[*Reaction]bool{})
}

func thermoIntentWithin(rx *Reaction, seen map[*Reaction]bool) bool {
	if seen[rx] {
		return false
	}
	seen[rx] = true
	// A dh alone is an enthalpy for Hess's law, not a request for K.
	if rx.Dg != nil || rx.Ds != nil || len(rx.LogK) > 0 {
		return true
	}
	for _, t := range rx.NetTerms() {
		if t.Species.hasThermoData() {
			return true
		}
	}
	for _, ct := range rx.Combo {
		if ct.Reaction != nil && thermoIntentWithin(ct.Reaction, seen) {
			return true
		}
	}
	return false
}

// lackReason says why a species' data do not give a reaction's ΔrG°.
func lackReason(sp *Species) string {
	m := sp.Model()
	switch {
	case m != nil && isGibbsOnly(m) && sp.Hf != nil && sp.S == nil:
		return "has hf and gf but no s, and S° cannot be worked out from them: " + noEntropyReason(sp)
	case m != nil && isGibbsOnly(m):
		return "has only gf, which holds at 298.15 K alone"
	case m != nil:
		return "has no gf to combine with the gf-only species"
	case !sp.hasThermoData():
		return "has no thermodynamic data"
	case len(sp.Ranges) > 0:
		return "has polynomial ranges that cannot be used"
	case sp.Hf != nil:
		return "has hf but no s"
	case sp.S != nil:
		return "has s but no hf"
	}
	return "has only cp"
}

var polynomialMismatchCheck = &Check{
	Name:     "polynomial-mismatch",
	Severity: lang.Warning,
	Doc: `a species' polynomial disagrees with its own hf, s or cp at 298.15 K
Where a species has shomate or nasa7 ranges covering 298.15 K and also hf,
s or cp, the polynomial is what hess computes with, and the single values
must say the same: H° within the network's tolerance of hf, T·S° within it
of T·s, and Cp° within 1 % of cp (common practice). A disagreement usually
means the two come from different sources, a different standard pressure,
or a mistyped coefficient (the F or H parameter of a Shomate fit, a6 or a7
of a NASA fit). gf is not compared, since that needs the elements' entropies.`,
	Run: func(p *Pass) {
		tol := p.Net.Settings.Tolerance
		p.eachSpecies(p.check.Name, func(sp *Species) {
			if len(sp.Ranges) == 0 {
				return
			}
			m := sp.Model()
			if m == nil || !sp.DataAt(thermo.T298) {
				return
			}
			// The range that answers at 298.15 K, named beside each
			// disagreement; worked out only for a species that has one.
			related := func() []lang.Related {
				for _, r := range sp.Ranges {
					if thermo.T298 >= r.Tmin-thermo.JoinTolerance && thermo.T298 <= r.Tmax+thermo.JoinTolerance {
						return []lang.Related{{Span: r.Header(), Message: fmt.Sprintf("%s range %s to %s", r.Kind, kelvin(r.Tmin), kelvin(r.Tmax))}}
					}
				}
				return nil
			}
			T := thermo.T298
			if v := sp.Hf; v != nil {
				if d := m.H(T) - v.V; math.Abs(d) > tol {
					p.Report(lang.Diagnostic{Subject: v.Span, Related: related(), Message: fmt.Sprintf(
						"the polynomial of %s gives H° = %.3f kJ/mol at 298.15 K, hf says %.3f kJ/mol (%s kJ/mol apart, tolerance %s kJ/mol)",
						sp.Key, m.H(T)/1000, v.V/1000, short(math.Abs(d)/1000), short(tol/1000))})
				}
			}
			if v := sp.S; v != nil {
				if d := m.S(T) - v.V; T*math.Abs(d) > tol {
					p.Report(lang.Diagnostic{Subject: v.Span, Related: related(), Message: fmt.Sprintf(
						"the polynomial of %s gives S° = %.3f J/mol/K at 298.15 K, s says %.3f J/mol/K (T·ΔS° = %s kJ/mol, tolerance %s kJ/mol)",
						sp.Key, m.S(T), v.V, short(T*math.Abs(d)/1000), short(tol/1000))})
				}
			}
			if v := sp.Cp; v != nil {
				cp := m.Cp(T)
				if d := cp - v.V; math.Abs(d) > cpJumpFraction*math.Abs(cp) {
					p.Report(lang.Diagnostic{Subject: v.Span, Related: related(), Message: fmt.Sprintf(
						"the polynomial of %s gives Cp° = %.3f J/mol/K at 298.15 K, cp says %.3f J/mol/K (%.1f %% apart, more than 1 %%)",
						sp.Key, cp, v.V, 100*math.Abs(d)/math.Abs(cp))})
				}
			}
		})
	},
}

// noEntropyReason says why the elements' entropies cannot give a species'
// S° from its hf and gf.
func noEntropyReason(sp *Species) string {
	if sp.Charge != 0 && (sp.Phase == nil || sp.Phase.Convention != Solute) {
		return "a charged species outside an aqueous phase has no formation reaction from the elements"
	}
	for _, ec := range sp.Formula.Elements {
		if _, ok := chem.LookupReferenceState(ec.Symbol); !ok {
			return "element " + ec.Symbol + " has no tabulated reference entropy (add s)"
		}
	}
	return "its formula gives no formation reaction"
}
