package lsp

import (
	"fmt"
	"math"
	"strings"

	"hess/equilibrium"
	"hess/network"
)

// mixtureHover describes a mixture: its temperature and pressure, then per
// reaction the numbers `hess approach` prints (Q, K, ΔrG, direction, the
// temperature at which K would equal Q) and the summary line.
func mixtureHover(w *hoverText, net *network.Network, sym network.Symbol) {
	m := net.LookupMixture(sym.Name)
	if m == nil {
		w.text("mixture ")
		w.name(sym.Name)
		w.line()
		return
	}
	a := equilibrium.Approach(net, m)
	w.text("mixture ")
	w.name(m.Name)
	if a == nil {
		w.text(": its composition has errors, so it gives no numbers")
		w.line()
		return
	}
	w.text(" at %s K", number(a.T, 6))
	if !math.IsNaN(a.P) {
		w.text(", %s bar", number(a.P/1e5, 6))
	}
	w.line()
	if sol := a.Solution; sol != nil {
		w.text("%s activity model, I = %s mol/kg", sol.Model, number(sol.I, 4))
		if sol.Beyond {
			w.text(" (beyond the model's range)")
		}
		var gs []string
		for _, so := range sol.Solutes {
			gs = append(gs, fmt.Sprintf("γ(%s) = %s", so.Species.Key, number(so.Gamma, 4)))
		}
		if len(gs) > 0 {
			w.text(": %s", strings.Join(gs, ", "))
		}
		w.line()
	}
	fwd, rev, eq, unknown := a.Counts()
	for _, r := range a.Reactions {
		w.name(r.Reaction.Name)
		if r.Direction == equilibrium.DirectionUnknown {
			w.text(": Q = %s; K cannot be computed at this temperature", number(math.Exp(r.LnQ), 4))
			w.line()
			continue
		}
		w.text(": Q = %s, K = %s, ΔrG = %s kJ/mol, %s", number(math.Exp(r.LnQ), 4), number(math.Exp(r.LnK), 4),
			number(r.DG/1000, 4), r.Direction)
		if !math.IsNaN(r.EquilibriumT) {
			w.text("; K = Q at %s K (approach %s K)", number(r.EquilibriumT, 6), number(r.ApproachK(a.T), 4))
		}
		w.line()
	}
	for _, ab := range a.Absent {
		w.name(ab.Reaction.Name)
		w.text(": not in this mixture")
		w.line()
	}
	verb := "reactions run"
	if fwd == 1 {
		verb = "reaction runs"
	}
	s := fmt.Sprintf("%d %s forward, %d reverse, %d at equilibrium", fwd, verb, rev, eq)
	if unknown > 0 {
		s += fmt.Sprintf(", %d without K", unknown)
	}
	w.text("%s", s)
	w.line()
}
