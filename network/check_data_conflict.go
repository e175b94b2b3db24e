package network

import (
	"fmt"
	"math"

	"hess/lang"
	"hess/thermo"
)

var dataConflictCheck = &Check{
	Name:     "data-conflict",
	Severity: lang.Warning,
	Doc: `a reaction's own data disagree with its species' data
Where a reaction carries measured data of its own (dg, dh, ds or logk) and
its species' data also give its ΔrG°, the two must agree: dg with ΔrG° at
298.15 K, dh with ΔrH° at 298.15 K, ds with ΔrS° at 298.15 K (compared as
T·ΔS), and each logk with log10 K at its temperature (compared as
R·T·ln 10 times the difference). A datum is reported when it differs from
the species' value by more than the tolerance setting and by more than
twice their combined uncertainty. One of the two is wrong, or they refer
to different standard states.`,
	Run: func(p *Pass) {
		for _, rx := range p.Net.Reactions {
			if rx.Resolved && (rx.Dg != nil || rx.Dh != nil || rx.Ds != nil || len(rx.LogK) > 0) {
				checkDataConflict(p, rx)
			}
		}
	},
}

func checkDataConflict(p *Pass, rx *Reaction) {
	n := p.Net
	tol := n.Settings.Tolerance
	temps := []float64{thermo.T298}
	for _, lk := range rx.LogK {
		if !thermo.AtT298(lk.T) {
			temps = append(temps, lk.T)
		}
	}
	k := n.ReactionK(rx)
	rows := make([]TableRow, 0, len(temps))
	for _, T := range temps {
		rows = append(rows, k.SpeciesRow(T))
	}
	fromSpecies := func(row TableRow) bool {
		return row.Valid && (row.Basis == BasisSpecies || row.Basis == BasisFormation)
	}
	row298 := rows[0]
	var sH, sS float64 // species uncertainties of ΔrH° and ΔrS°
	for _, t := range rx.NetTerms() {
		nu := ratFloat(t.Nu)
		sg := t.Species.Sigma()
		sH += nu * nu * sg.H * sg.H
		sS += nu * nu * sg.S * sg.S
	}
	sH, sS = math.Sqrt(sH), math.Sqrt(sS)
	// Own data converted to the network's standard pressure
	// (Network.ownDataShift): ΔrG° by Δn·R·T·ln r, ΔrS° by −Δn·R·ln r.
	shift := n.ownDataShift(rx)
	dgOwn := func(v float64) float64 { return v + thermo.R*thermo.T298*shift }
	dsOwn := func(v float64) float64 { return v - thermo.R*shift }
	logkOwn := func(v float64) float64 { return v - shift/math.Ln10 }
	// report reports a datum that disagrees; its message is written only
	// then (most data agree).
	report := func(v *Value, diff, sigma float64, msg func() string) {
		if math.IsNaN(diff) || math.Abs(diff) <= tol || math.Abs(diff) <= 2*sigma {
			return
		}
		p.Report(lang.Diagnostic{Subject: v.Span, Context: rx.Span(),
			Message: fmt.Sprintf("%s: they differ by %s ± %s kJ/mol (tolerance %s kJ/mol)", msg(), kjText(diff), kjText(sigma), kjText(tol))})
	}
	if fromSpecies(row298) {
		T := thermo.T298
		sG := 0.0
		if !math.IsNaN(row298.SigmaLog10K) {
			sG = row298.SigmaLog10K * thermo.R * T * math.Ln10
		}
		if rx.Dg != nil {
			report(rx.Dg, dgOwn(rx.Dg.V)-row298.DG, math.Hypot(rx.Dg.Sigma, sG), func() string {
				return fmt.Sprintf("dg of %s is %s kJ/mol, but its species give ΔrG° = %s kJ/mol at 298.15 K", rx.Name, kjText(dgOwn(rx.Dg.V)), kjText(row298.DG))
			})
		}
		if rx.Dh != nil && !math.IsNaN(row298.DH) {
			report(rx.Dh, rx.Dh.V-row298.DH, math.Hypot(rx.Dh.Sigma, sH), func() string {
				return fmt.Sprintf("dh of %s is %s kJ/mol, but its species give ΔrH° = %s kJ/mol at 298.15 K", rx.Name, kjText(rx.Dh.V), kjText(row298.DH))
			})
		}
		if rx.Ds != nil && !math.IsNaN(row298.DS) {
			report(rx.Ds, T*(dsOwn(rx.Ds.V)-row298.DS), T*math.Hypot(rx.Ds.Sigma, sS), func() string {
				return fmt.Sprintf("ds of %s is %.2f J/mol/K, but its species give ΔrS° = %.2f J/mol/K at 298.15 K (compared as T·ΔrS°)", rx.Name, dsOwn(rx.Ds.V), row298.DS)
			})
		}
	}
	for _, lk := range rx.LogK {
		var row TableRow
		found := false
		for _, r := range rows {
			if math.Abs(r.T-lk.T) <= thermo.T298Tolerance {
				row, found = r, true
				break
			}
		}
		if !found || !fromSpecies(row) {
			continue
		}
		f := thermo.R * lk.T * math.Ln10
		sK := 0.0
		if !math.IsNaN(row.SigmaLog10K) {
			sK = row.SigmaLog10K
		}
		report(&lk.Value, f*(row.Log10K-logkOwn(lk.Value.V)), f*math.Hypot(lk.Value.Sigma, sK), func() string {
			return fmt.Sprintf("logk of %s is %s at %s, but its species give log10 K = %s (compared as R·T·ln 10 times the difference)",
				rx.Name, short(logkOwn(lk.Value.V)), kelvin(lk.T), fmt.Sprintf("%.3f", row.Log10K))
		})
	}
}
