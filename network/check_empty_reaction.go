package network

import "hess/lang"

var emptyReactionCheck = &Check{
	Name:     "empty-reaction",
	Severity: lang.Warning,
	Doc: `a reaction's sides cancel
Every species of the reaction appears on both sides with the same net
coefficient, as in A(g) <-> A(g), so the reaction changes nothing: its
ΔrH°, ΔrS° and ΔrG° are 0 and K is 1 at every temperature, whatever data
it carries. Usually a species was written on the wrong side or a state tag
was left out. A reaction's own data (dg, logk, …) are not used for it.`,
	Run: func(p *Pass) {
		for _, rx := range p.Net.Reactions {
			if !rx.Resolved || len(rx.Left)+len(rx.Right) == 0 || len(rx.NetTerms()) > 0 {
				continue
			}
			msg := "the sides of %s cancel: it changes nothing, so ΔrG° = 0 and K = 1 at every temperature"
			if rx.Dg != nil || rx.Dh != nil || rx.Ds != nil || len(rx.LogK) > 0 {
				msg += "; its own data are not used"
			}
			p.Reportf(rx.Equation, msg, rx.Name)
		}
	},
}
