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
func mixtureHover(w *hoverText, net *network.Network, sym network.Symbol, feeds *feedResults) {
	m := net.LookupMixture(sym.Name)
	if m == nil {
		w.text("mixture ")
		w.name(sym.Name)
		w.line()
		return
	}
	if m.GivesAmounts() {
		// A feed in mol is for equilibrium, not for quotients.
		w.text("mixture ")
		w.name(m.Name)
		w.text(": a feed of %d species", len(m.Members))
		w.line()
		feedHover(w, m, feeds)
		return
	}
	defer feedHover(w, m, feeds)
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

// hoverSpecies is how many species a feed's hover lists.
const hoverSpecies = 8

// feedHover adds a feed's equilibrium composition at its own temperature
// and pressure (reactions basis), as the worker solved it.
func feedHover(w *hoverText, m *network.Mixture, feeds *feedResults) {
	if !m.IsFeed() {
		return
	}
	if m.HasFixed() {
		w.text("equilibrium: a solution open to a fixed gas; hess equilibrium gives its pH and speciation")
		w.line()
		return
	}
	r, ok := feeds.get(m.Name)
	switch {
	case !ok && feeds.large():
		w.text("equilibrium: the network is too large to solve for a hover; run hess equilibrium")
		w.line()
		return
	case !ok:
		w.text("equilibrium: being computed (hover again)")
		w.line()
		return
	case r.err != nil:
		w.text("equilibrium: the solver failed: %v", r.err)
		w.line()
		return
	case r.comp == nil:
		w.text("equilibrium: none")
		if len(r.diags) > 0 {
			w.text(": %s", r.diags[0].Message)
		}
		w.line()
		return
	}
	c := r.comp
	w.text("equilibrium at %s K, %s bar (reactions basis)", number(c.T, 6), number(c.P/1e5, 6))
	if !c.Converged {
		w.text(": NOT CONVERGED, the numbers are no equilibrium")
	}
	w.line()
	for i, s := range c.Sorted() {
		if i == hoverSpecies {
			w.text("and %d more", len(c.Species)-hoverSpecies)
			w.line()
			break
		}
		w.name(s.Species.Key)
		w.text(": %s mol, mole fraction %s", number(s.Amount, 5), number(s.MoleFraction, 4))
		w.line()
	}
	if !math.IsNaN(c.Heat) {
		w.text("heat from the feed at its temperature: %s kJ (%s kJ per mol of feed)", number(c.Heat/1000, 5), number(c.HeatPerMolFeed()/1000, 5))
		w.line()
	}
}
