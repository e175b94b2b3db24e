package network

import (
	"fmt"
	"strings"

	"hess/lang"
	"hess/thermo"
)

func init() {
	mixtureAmountCheck.Run = runMixtureAmount
	mixtureIncompleteCheck.Run = runMixtureIncomplete
	mixtureFractionsCheck.Run = runMixtureFractions
}

var mixtureAmountCheck = &Check{
	Name:     "mixture-amount",
	Severity: lang.Error,
	Doc: `a mixture member's amount does not fit its phase
Each member of a mixture gives its amount in the form its phase's activity
convention needs: a gas a bare mole fraction (normalised over the mixture's
gases) or a partial pressure such as 0.5 bar; a solute a molality such as
0.01 mol/kg; a member of a solution phase a bare mole fraction from 0 to 1;
a pure phase no number at all, which marks it present with activity 1.
A feed gives amounts instead, in any phase: mol, kmol, g or kg (a mass
through the formula's molar mass); they must not be negative nor all zero.
Other amounts must be above zero (a species that is absent is left out,
since a zero activity makes Q zero or infinite), a species is listed once, and a
species needs its state tag: after a number the next word is read as its
unit, so CO2 0.1 instead of CO2(g) 0.1 is reported here.`,
}

// runMixtureAmount is the Run of mixtureAmountCheck (set in init: it refers to the check).
func runMixtureAmount(p *Pass) {
	for _, m := range p.Net.Mixtures {
		for _, pr := range mixtureProblems(m) {
			if pr.check == p.check {
				p.Reportf(pr.span, "%s", pr.msg)
			}
		}
	}
	brokenMixtureUnits(p)
}

var mixtureIncompleteCheck = &Check{
	Name:     "mixture-incomplete",
	Severity: lang.Error,
	Doc: `a mixture lacks its temperature, its pressure or its members
A mixture is evaluated at its own temperature, so it must give one. Gas mole
fractions need the total pressure (pressure 25 bar) to become partial
pressures; gases given as partial pressures do not. A feed (amounts in mol)
needs its pressure too. A mixture must list at least one species.`,
}

// runMixtureIncomplete is the Run of mixtureIncompleteCheck (set in init: it refers to the check).
func runMixtureIncomplete(p *Pass) {
	for _, m := range p.Net.Mixtures {
		for _, pr := range mixtureIncomplete(m) {
			p.Reportf(pr.span, "%s", pr.msg)
		}
	}
}

var mixtureFractionsCheck = &Check{
	Name:     "mixture-fractions",
	Severity: lang.Error,
	Doc: `a mixture's fractions or partial pressures do not add up
Gas mole fractions are normalised to sum to 1, so they must not all be
zero. A mixture gives its gases either all as mole fractions or all as
partial pressures, never both (the fractions would have no defined share of
the pressure). A feed gives every member as an amount (1 mol): amounts
beside fractions, pressures or molalities have no common basis. Partial pressures may not sum to more than the mixture's
total pressure, and the mole fractions of one solution phase may not sum to
more than 1.`,
}

// runMixtureFractions is the Run of mixtureFractionsCheck (set in init: it refers to the check).
func runMixtureFractions(p *Pass) {
	for _, m := range p.Net.Mixtures {
		for _, pr := range mixtureProblems(m) {
			if pr.check == p.check {
				p.Reportf(pr.span, "%s", pr.msg)
			}
		}
	}
}

var notInMixtureCheck = &Check{
	Name:         "not-in-mixture",
	Severity:     lang.Info,
	ApproachOnly: true,
	Doc: `a reaction has no quotient in a mixture
A reaction's quotient Q in a mixture needs an activity for every species of
its equation: the mixture must list each gas, solute and solution member,
and list each pure phase to mark it present. A reaction that uses a species
the mixture does not list is left out of that mixture's approach to
equilibrium; the message names the species it lacks. Only hess approach
reports it: a reaction need not appear in every mixture.`,
	Run: func(p *Pass) {
		for _, m := range p.Net.Mixtures {
			if !m.Usable() || m.GivesAmounts() {
				continue // a feed is for hess equilibrium, not for quotients
			}
			var parts []string
			for _, rx := range p.Net.Reactions {
				if !rx.Resolved {
					continue
				}
				if _, lacking := m.LnQuotient(rx, p.Net.StandardPressure()); len(lacking) > 0 {
					parts = append(parts, fmt.Sprintf("%s (lacks %s)", rx.Name, speciesList(lacking)))
				}
			}
			if len(parts) == 0 {
				continue
			}
			const shown = 6
			if len(parts) > shown {
				parts = append(parts[:shown], fmt.Sprintf("and %d more", len(parts)-shown))
			}
			p.Reportf(m.NameSpan, "mixture %s gives no quotient for %s", m.Name, strings.Join(parts, ", "))
		}
	},
}

func speciesList(sps []*Species) string {
	names := make([]string, len(sps))
	for i, sp := range sps {
		names[i] = sp.Key
	}
	return strings.Join(names, ", ")
}

// brokenMixtureUnits explains a mixture that did not parse because a
// species without its state tag followed a number: the lexer took the
// species for the number's unit, and the number after it then stood where
// no item may start.
func brokenMixtureUnits(p *Pass) {
	for _, f := range p.Net.Files {
		if f.AST == nil {
			continue
		}
		for _, st := range f.AST.Statements {
			if !st.Broken || len(st.Tokens()) == 0 || st.Tokens()[0].Value != "mixture" {
				continue
			}
			toks := st.Tokens()
			for i := 1; i+1 < len(toks); i++ {
				if toks[i-1].Type != lang.Number || toks[i].Type != lang.Word {
					continue
				}
				word := toks[i].Value
				if _, err := thermo.ParseUnit(word); err == nil {
					continue
				}
				if parts, err := lang.SplitRef(word); err != nil || parts.State != "" {
					continue
				}
				p.Reportf(st.TokenSpan(i), "%s", untaggedMessage(p.Net, word, toks[i-1].Value))
			}
		}
	}
}
