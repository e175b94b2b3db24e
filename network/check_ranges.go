package network

import (
	"fmt"
	"math"
	"strconv"
	"strings"

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
	for _, sp := range p.Net.Species {
		if len(sp.Ranges) < 2 {
			continue
		}
		ranges := sortedRanges(sp.Ranges)
		pieces := make([]thermo.Model, 0, len(ranges))
		for _, r := range ranges {
			m := r.model()
			if m == nil {
				pieces = nil
				break
			}
			pieces = append(pieces, m)
		}
		if pieces == nil {
			continue
		}
		pw, err := thermo.NewPiecewise(pieces...)
		if err != nil {
			continue
		}
		for _, j := range pw.Joins() {
			if j.Kind != kind {
				continue
			}
			lower, upper := ranges[j.Lower], ranges[j.Upper]
			related := []lang.Related{{Span: lower.Header, Message: fmt.Sprintf("%s range %s to %s", lower.Kind, kelvin(lower.Tmin), kelvin(lower.Tmax))}}
			switch kind {
			case thermo.JoinGap:
				p.Report(lang.Diagnostic{Subject: upper.Header, Context: upper.Span, Related: related, Message: fmt.Sprintf(
					"the ranges of %s leave a gap of %s, from %s to %s, with no data",
					sp.Key, kelvin(j.Gap), kelvin(j.LowerTmax), kelvin(j.UpperTmin))})
			case thermo.JoinOverlap:
				p.Report(lang.Diagnostic{Subject: upper.Header, Context: upper.Span, Related: related, Message: fmt.Sprintf(
					"the ranges of %s overlap by %s, from %s to %s",
					sp.Key, kelvin(-j.Gap), kelvin(j.UpperTmin), kelvin(j.LowerTmax))})
			case thermo.JoinMeet:
				if !jumps(j, pieces, p.Net.Settings.Tolerance) {
					continue
				}
				p.Report(lang.Diagnostic{Subject: upper.Header, Context: upper.Span, Related: related, Message: fmt.Sprintf(
					"%s jumps at %s: Cp° by %s J/mol/K, H° by %s kJ/mol, S° by %s J/mol/K",
					sp.Key, kelvin(j.T), signed(j.DCp), signed(j.DH/1000), signed(j.DS))})
			}
		}
	}
}

// jumps reports whether a join's steps exceed what range-discontinuity
// allows: tol (J/mol) for H° and T·S°, cpJumpFraction of Cp° for Cp°.
func jumps(j thermo.Join, pieces []thermo.Model, tol float64) bool {
	cp := math.Max(math.Abs(pieces[j.Lower].Cp(j.T)), math.Abs(pieces[j.Upper].Cp(j.T)))
	return math.Abs(j.DH) > tol || j.T*math.Abs(j.DS) > tol || math.Abs(j.DCp) > cpJumpFraction*cp
}

// kelvin writes a temperature for a message: "298.15 K", "1200 K".
func kelvin(T float64) string { return short(T) + " K" }

// short writes a number with at most four decimals and no trailing zeros.
func short(v float64) string {
	if a := math.Abs(v); a >= 1e15 || (a < 1e-4 && a > 0) {
		return strconv.FormatFloat(v, 'g', 6, 64)
	}
	return strconv.FormatFloat(math.Round(v*1e4)/1e4, 'f', -1, 64)
}

// signed writes a difference with four significant digits and its sign.
func signed(v float64) string {
	var s string
	switch a := math.Abs(v); {
	case a >= 1e4:
		s = strconv.FormatFloat(v, 'f', 0, 64)
	case a < 1e-3 && a > 0:
		s = strconv.FormatFloat(v, 'e', 2, 64)
	default:
		s = strconv.FormatFloat(v, 'g', 4, 64)
	}
	if v >= 0 {
		s = "+" + s
	}
	return s
}

// kelvinList writes temperatures as "600 K, 700 K and 800 K", the first
// few of a long list followed by how many there are.
func kelvinList(ts []float64) string {
	const shown = 4
	parts := make([]string, 0, shown)
	for i, T := range ts {
		if i == shown && len(ts) > shown+1 {
			return strings.Join(parts, ", ") + fmt.Sprintf(" and %d more", len(ts)-shown)
		}
		parts = append(parts, kelvin(T))
	}
	if len(parts) == 1 {
		return parts[0]
	}
	return strings.Join(parts[:len(parts)-1], ", ") + " and " + parts[len(parts)-1]
}
