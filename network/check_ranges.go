package network

import (
	"fmt"
	"math"

	"hess/lang"
	"hess/thermo"
)

var rangeGapCheck = &Check{
	Name:     "range-gap",
	Severity: lang.Error,
	Doc: `a species' polynomial ranges leave temperatures uncovered
The shomate and nasa7 ranges of one species, ordered by their lower bound,
must each start where the previous one ends. Between two ranges that do not
meet there are no data: a value there is an extrapolation of one range or
the other, and the two disagree. The message gives the gap's bounds; close
it with the missing range or move one bound.`,
	Run: func(p *Pass) { eachJoin(p, thermo.JoinGap) },
}

var rangeOverlapCheck = &Check{
	Name:     "range-overlap",
	Severity: lang.Error,
	Doc: `a species' polynomial ranges cover some temperatures twice
Two shomate or nasa7 ranges of one species that both cover some
temperatures give two answers there (hess uses the lower range). Usually a
bound was mistyped or a range was pasted twice. The message gives the
temperatures covered twice; make each range end where the next begins.`,
	Run: func(p *Pass) { eachJoin(p, thermo.JoinOverlap) },
}

var rangeDiscontinuityCheck = &Check{
	Name:     "range-discontinuity",
	Severity: lang.Warning,
	Doc: `a jump in Cp°, H° or S° where two ranges of a species meet
Where one polynomial range of a species ends and the next begins, both
should give the same Cp°, H° and S°. A jump makes K(T) step at that
temperature and usually means the two ranges come from different fits or
one coefficient is mistyped. Reported when H° jumps by more than the
network's tolerance, S° by more than the tolerance divided by the
temperature (so that T·S° stays within it), or Cp° by more than 1 % (common
practice; published fits join to about 0.3 %). The message gives every jump,
upper range minus lower.`,
	Run: func(p *Pass) { eachJoin(p, thermo.JoinMeet) },
}

// cpJumpFraction is the relative Cp° jump at a join that range-discontinuity
// reports (common practice).
const cpJumpFraction = 0.01

// eachJoin reports the joins of the given kind between the ranges of every
// species.
func eachJoin(p *Pass, kind thermo.JoinKind) {
	p.eachSpecies(p.check.Name, func(sp *Species) {
		if len(sp.Ranges) < 2 {
			return
		}
		// The species' model is its ranges in sortedRanges order, built
		// once for the network; it is nil when some range is unusable.
		pw, ok := sp.Model().(*thermo.Piecewise)
		if !ok {
			return
		}
		ranges := sortedRanges(sp.Ranges)
		for _, j := range pw.Joins() {
			if j.Kind != kind {
				continue
			}
			lower, upper := ranges[j.Lower], ranges[j.Upper]
			// The lower range, named beside a report (worked out only for
			// a join reported: checks see every join of every species).
			related := func() []lang.Related {
				return []lang.Related{{Span: lower.Header(), Message: fmt.Sprintf("%s range %s to %s", lower.Kind, kelvin(lower.Tmin), kelvin(lower.Tmax))}}
			}
			switch kind {
			case thermo.JoinGap:
				p.Report(lang.Diagnostic{Subject: upper.Header(), Context: upper.Span(), Related: related(), Message: fmt.Sprintf(
					"the ranges of %s leave a gap of %s, from %s to %s, with no data",
					sp.Key, kelvin(j.Gap), kelvin(j.LowerTmax), kelvin(j.UpperTmin))})
			case thermo.JoinOverlap:
				p.Report(lang.Diagnostic{Subject: upper.Header(), Context: upper.Span(), Related: related(), Message: fmt.Sprintf(
					"the ranges of %s overlap by %s, from %s to %s",
					sp.Key, kelvin(-j.Gap), kelvin(j.UpperTmin), kelvin(j.LowerTmax))})
			case thermo.JoinMeet:
				if !jumps(j, lower.model(), upper.model(), p.Net.Settings.Tolerance) {
					continue
				}
				p.Report(lang.Diagnostic{Subject: upper.Header(), Context: upper.Span(), Related: related(), Message: fmt.Sprintf(
					"%s jumps at %s: Cp° by %s J/mol/K, H° by %s kJ/mol, S° by %s J/mol/K",
					sp.Key, kelvin(j.T), signed(j.DCp), signed(j.DH/1000), signed(j.DS))})
			}
		}
	})
}

// jumps reports whether a join's steps exceed what range-discontinuity
// allows: tol (J/mol) for H° and T·S°, cpJumpFraction of Cp° for Cp°.
func jumps(j thermo.Join, lower, upper thermo.Model, tol float64) bool {
	cp := math.Max(math.Abs(lower.Cp(j.T)), math.Abs(upper.Cp(j.T)))
	return math.Abs(j.DH) > tol || j.T*math.Abs(j.DS) > tol || math.Abs(j.DCp) > cpJumpFraction*cp
}
