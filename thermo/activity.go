package thermo

import "fmt"

// Activity is how a species enters an equilibrium expression.
type Activity int

// Activity conventions. The zero value means "not stated": the term counts as an
// ideal gas when its IsGas flag is set and as a pure phase otherwise.
const (
	ActivityUnstated   Activity = iota
	ActivityGas                 // ideal gas: p/p°
	ActivityPureSolid           // pure solid: 1, left out of K
	ActivityPureLiquid          // pure liquid (or other pure phase): 1, left out of K
	ActivitySolute              // dilute solute: m/(1 mol/kg)
	ActivitySolution            // member of a solution: mole fraction
)

func (a Activity) String() string {
	switch a {
	case ActivityUnstated:
		return "unstated"
	case ActivityGas:
		return "ideal gas"
	case ActivityPureSolid:
		return "pure solid"
	case ActivityPureLiquid:
		return "pure liquid"
	case ActivitySolute:
		return "solute"
	case ActivitySolution:
		return "solution"
	}
	return fmt.Sprintf("Activity(%d)", int(a))
}

// Pure reports whether the activity is 1 by convention, so the species is left
// out of the quotient.
func (a Activity) Pure() bool { return a == ActivityPureSolid || a == ActivityPureLiquid }

// Kind names the kind of equilibrium constant a reaction has.
type Kind string

// Kinds of equilibrium constant.
const (
	KindKp  Kind = "Kp"  // every quotient species is a gas
	KindKsp Kind = "Ksp" // a pure solid dissolving into solutes only
	KindKc  Kind = "Kc"  // every quotient species is a solute
	KindK   Kind = "K"   // anything else
)

// Kind classifies the reaction's equilibrium constant from its terms' activities:
// Kp when every species in the quotient is a gas, Ksp when only pure solids react
// and only solutes form, Kc when every quotient species is a solute, and K
// otherwise (including a reaction with no quotient species).
func (r Reaction) Kind() Kind {
	gases, solutes, others := 0, 0, 0
	solidsOnlyLeft, solutesOnlyRight := true, true
	anyLeft, anyRight := false, false
	for _, t := range r.Terms {
		if t.Nu == 0 {
			continue
		}
		a := t.activity()
		switch {
		case a == ActivityGas:
			gases++
		case a == ActivitySolute:
			solutes++
		case !a.Pure():
			others++
		}
		if t.Nu < 0 {
			anyLeft = true
			solidsOnlyLeft = solidsOnlyLeft && a == ActivityPureSolid
		} else {
			anyRight = true
			solutesOnlyRight = solutesOnlyRight && a == ActivitySolute
		}
	}
	switch {
	case anyLeft && anyRight && solidsOnlyLeft && solutesOnlyRight:
		return KindKsp
	case gases > 0 && solutes == 0 && others == 0:
		return KindKp
	case solutes > 0 && gases == 0 && others == 0:
		return KindKc
	}
	return KindK
}
