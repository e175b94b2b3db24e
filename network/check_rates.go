package network

import (
	"fmt"
	"math"
	"math/big"

	"hess/lang"
	"hess/thermo"
)

var rateUnitsCheck = &Check{
	Name:     "rate-units",
	Severity: lang.Error,
	Doc: `a rate prefactor's unit does not fit the step's order
A modified Arrhenius rate k = A·T^n·exp(−Ea/RT) of an elementary step has
the units of concentration^(1−order) per second, where the order of the
forward rate is the sum of the coefficients on the left and that of the
reverse rate the sum on the right; pure solids and liquids do not count.
So a unimolecular step takes 1/s, a bimolecular one cm3/mol/s (or L/mol/s,
m3/mol/s) and a termolecular one cm6/mol2/s. A unit of another order means
the prefactor is off by powers of the concentration unit. A side whose
coefficients do not add up to a whole number has no such unit.`,
	Run: func(p *Pass) {
		for _, rx := range p.Net.Reactions {
			if !rx.Resolved {
				continue
			}
			if rx.Rate != nil {
				checkRateUnit(p, rx, rx.Rate, rx.Left, "left")
			}
			if rx.Reverse != nil && rx.TwoWay {
				checkRateUnit(p, rx, rx.Reverse, rx.Right, "right")
			}
		}
	},
}

// unitFitsOrder reports whether a rate's prefactor unit is one of the
// order of the side it starts from (what rate-units requires).
func unitFitsOrder(r *Rate, side []Term) bool {
	order := stepOrder(side)
	given, ok := prefactorOrder(r.AUnit)
	return ok && order.IsInt() && order.Num().IsInt64() && order.Num().Int64() == int64(given)
}

func checkRateUnit(p *Pass, rx *Reaction, r *Rate, side []Term, which string) {
	order := stepOrder(side)
	given, ok := prefactorOrder(r.AUnit)
	if !ok || unitFitsOrder(r, side) {
		return // the compiler has reported an unknown unit
	}
	vol := volumeSymbol(r.AUnit)
	if !order.IsInt() {
		p.Reportf(r.A.Span, "the %s side of %s adds up to order %s, not a whole number, so no prefactor unit fits it (%s is for a %s step)",
			which, rx.Name, ratText(order), r.AUnit, orderName(given))
		return
	}
	want := int(order.Num().Int64())
	p.Reportf(r.A.Span, "A in %s is for a %s step, but the %s side of %s makes it %s: A takes %s",
		r.AUnit, orderName(given), which, rx.Name, orderName(want), prefactorUnit(want, vol))
}

var reverseOnOneWayCheck = &Check{
	Name:     "reverse-on-one-way",
	Severity: lang.Error,
	Doc: `a one-way step has a reverse rate
A reaction written with -> is a one-way step of a kinetic scheme: it runs
forward only, so a reverse rate on it contradicts the arrow. Write <-> to
make it a two-way step (its reverse rate is then checked against K(T)), or
drop the reverse rate.`,
	Run: func(p *Pass) {
		for _, rx := range p.Net.Reactions {
			if rx.Reverse != nil && !rx.TwoWay && rx.Equation.IsValid() {
				p.Report(lang.Diagnostic{Subject: rx.Reverse.Span, Context: rx.Span,
					Message: fmt.Sprintf("%s is one-way (->) but has a reverse rate; write <-> or drop the reverse rate", rx.Name)})
			}
		}
	},
}

var detailedBalanceCheck = &Check{
	Name:     "detailed-balance",
	Severity: lang.Error,
	Doc: `forward and reverse rates disagree with K(T)
For an elementary two-way step with both a forward and a reverse rate,
detailed balance requires kf/kr = Kc(T), the equilibrium constant in the
rates' concentration units: Kc = K·Π(activity per concentration)^−ν, with
R·T/p° for each gas and 1/(1 mol/L) for each solute. K(T) comes from the
species' data (or the reaction's own data, or its parts). At every
requested temperature where K is known, the mismatch R·T·ln(kf/(kr·Kc)) is
an energy; it is reported when it exceeds both the tolerance setting and
twice its uncertainty. Where the species have no data, the rates are
checked against each other around cycles instead (cycle-inconsistent,
the Wegscheider condition). A pair with a prefactor unit of the wrong
order (rate-units) is compared with neither.`,
	Run: func(p *Pass) {
		for _, rx := range p.Net.Reactions {
			if rx.Resolved && hasRatePair(rx) {
				checkDetailedBalance(p, rx)
			}
		}
	},
}

// balanceMiss is a rate pair's mismatch with K at one temperature.
type balanceMiss struct {
	T             float64
	lnRatio, lnKc float64 // ln(kf/kr) and ln Kc, SI
	energy, sigma float64 // R·T·ln(kf/(kr·Kc)) and its uncertainty, J/mol
	ratio         float64 // |energy| over the threshold
	fails         bool
}

func checkDetailedBalance(p *Pass, rx *Reaction) {
	n := p.Net
	rows := n.reactionRows(rx, n.Settings.Temperatures)
	tol := n.Settings.Tolerance
	var worst *balanceMiss
	failing := 0
	for _, row := range rows {
		if !row.Valid || !(row.T > 0) {
			continue
		}
		T := row.T
		rt := thermo.R * T
		lf, sf := lnRate(rx.Rate, T)
		lr, sr := lnRate(rx.Reverse, T)
		lnK := row.Log10K * math.Ln10
		sK := 0.0
		if !math.IsNaN(row.SigmaLog10K) {
			sK = row.SigmaLog10K * math.Ln10
		}
		lnKc := lnK - lnActivityFromConcentration(n, rx, T)
		m := balanceMiss{T: T, lnRatio: lf - lr, lnKc: lnKc}
		m.energy = rt * (m.lnRatio - lnKc)
		m.sigma = rt * math.Sqrt(sf*sf+sr*sr+sK*sK)
		if math.IsNaN(m.energy) || math.IsInf(m.energy, 0) {
			continue
		}
		m.fails = math.Abs(m.energy) > tol && math.Abs(m.energy) > 2*m.sigma
		m.ratio = math.Abs(m.energy) / math.Max(math.Max(tol, 2*m.sigma), 1e-9)
		if !m.fails {
			continue
		}
		failing++
		if worst == nil || m.ratio > worst.ratio {
			w := m
			worst = &w
		}
	}
	if worst == nil {
		return
	}
	vol := volumeSymbol(rx.Rate.AUnit)
	dn := concDeltaN(rx)
	dnf, _ := dn.Float64()
	// SI (mol/m³)^Δn to the rates' unit (mol/vol)^Δn.
	toUser := math.Exp(dnf * math.Log(volumeScale(vol)))
	unit := concentrationUnit(dn, vol)
	if unit != "" {
		unit = " " + unit
	}
	msg := fmt.Sprintf("kf/kr of %s is %s times Kc at %s: kf/kr = %s%s, but K(T) gives Kc = %s%s (R·T·ln(kf/(kr·Kc)) = %s ± %s kJ/mol, tolerance %s kJ/mol)",
		rx.Name, sig3(math.Exp(worst.lnRatio-worst.lnKc)), kelvin(worst.T),
		sig3(math.Exp(worst.lnRatio)*toUser), unit, sig3(math.Exp(worst.lnKc)*toUser), unit,
		kjText(worst.energy), kjText(worst.sigma), kjText(tol))
	if failing > 1 {
		msg += fmt.Sprintf("; off at %d more temperature%s", failing-1, plural(failing-1))
	}
	p.Report(lang.Diagnostic{Subject: rx.Reverse.Span, Context: rx.Span, Message: msg,
		Related: []lang.Related{{Span: rx.Rate.Span, Message: "forward rate of " + rx.Name}}})
}

// reverseOrder is the order of a step's reverse rate, when it is a whole
// number the prefactor units can express.
func reverseOrder(rx *Reaction) (int, bool) {
	o := stepOrder(rx.Right)
	if !o.IsInt() || o.Sign() < 0 || o.Cmp(big.NewRat(maxOrder, 1)) > 0 {
		return 0, false
	}
	return int(o.Num().Int64()), true
}
