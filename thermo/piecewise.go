package thermo

import (
	"errors"
	"fmt"
	"math"
	"slices"
)

// Piecewise is a species model made of temperature ranges, each its own Model
// (Shomate or NASA ranges). Inside a range that range answers; at a temperature
// shared by two ranges the lower one answers; outside every range the nearest
// range extrapolates. Whether ranges join cleanly is reported by Joins.
type Piecewise struct {
	pieces []Model
	bounds [][2]float64 // each piece's Tmin and Tmax
	// hiBefore[k] is the highest Tmax of the pieces before k (−Inf for
	// the first): piece k answers at T in its bounds above hiBefore[k].
	hiBefore []float64
}

// NewPiecewise orders the ranges by their lower bound and checks that each has
// 0 < Tmin < Tmax. Gaps and overlaps are not errors here; Joins reports them.
func NewPiecewise(pieces ...Model) (*Piecewise, error) {
	if len(pieces) == 0 {
		return nil, errors.New("a piecewise model needs at least one range")
	}
	for i, m := range pieces {
		if m == nil {
			return nil, fmt.Errorf("range %d has no model", i+1)
		}
		if err := checkRange(m.Range()); err != nil {
			return nil, fmt.Errorf("range %d: %w", i+1, err)
		}
	}
	ps := slices.Clone(pieces)
	slices.SortStableFunc(ps, func(a, b Model) int {
		la, _ := a.Range()
		lb, _ := b.Range()
		switch {
		case la < lb:
			return -1
		case la > lb:
			return 1
		}
		return 0
	})
	bounds := make([][2]float64, len(ps))
	hiBefore := make([]float64, len(ps))
	hi := math.Inf(-1)
	for i, m := range ps {
		bounds[i][0], bounds[i][1] = m.Range()
		hiBefore[i] = hi
		hi = math.Max(hi, bounds[i][1])
	}
	return &Piecewise{pieces: ps, bounds: bounds, hiBefore: hiBefore}, nil
}

func checkRange(lo, hi float64) error {
	switch {
	case !finite(lo) || !finite(hi):
		return fmt.Errorf("bounds %v K to %v K are not finite", lo, hi)
	case lo <= 0:
		return fmt.Errorf("Tmin %v K is not above 0 K", lo)
	case lo >= hi:
		return fmt.Errorf("Tmin %v K is not below Tmax %v K", lo, hi)
	}
	return nil
}

// Pieces returns the ranges in order of their lower bound.
func (p *Piecewise) Pieces() []Model { return slices.Clone(p.pieces) }

// Bounds returns each range's Tmin and Tmax, in order of the lower bound.
// The slice is the model's own: callers must not change it.
func (p *Piecewise) Bounds() [][2]float64 { return p.bounds }

// piece chooses the range that answers at T.
func (p *Piecewise) piece(T float64) Model { return p.pieces[p.pieceIndex(T)] }

// answers reports whether piece k answers at T because T lies within it:
// the pieces are in order of their lower bound, so none before k holds T.
func (p *Piecewise) answers(k int, T float64) bool {
	b := p.bounds[k]
	return T >= b[0] && T <= b[1] && T > p.hiBefore[k]
}

// pieceIndex is the index of the range that answers at T.
func (p *Piecewise) pieceIndex(T float64) int {
	best, dist := 0, math.Inf(1)
	for i, b := range p.bounds {
		lo, hi := b[0], b[1]
		if T >= lo && T <= hi {
			return i
		}
		d := math.Min(math.Abs(T-lo), math.Abs(T-hi))
		if d < dist {
			best, dist = i, d
		}
	}
	return best
}

// Cp returns the heat capacity of the range that answers at T.
func (p *Piecewise) Cp(T float64) float64 { return p.piece(T).Cp(T) }

// H returns the enthalpy of the range that answers at T.
func (p *Piecewise) H(T float64) float64 { return p.piece(T).H(T) }

// S returns the entropy of the range that answers at T.
func (p *Piecewise) S(T float64) float64 { return p.piece(T).S(T) }

// G returns the Gibbs energy of the range that answers at T.
func (p *Piecewise) G(T float64) float64 { return p.piece(T).G(T) }

// Range spans from the lowest Tmin to the highest Tmax of the ranges.
func (p *Piecewise) Range() (Tmin, Tmax float64) {
	Tmin, Tmax = p.bounds[0][0], p.bounds[0][1]
	for _, b := range p.bounds[1:] {
		Tmax = math.Max(Tmax, b[1])
	}
	return Tmin, Tmax
}

// JoinKind says how two neighbouring ranges meet.
type JoinKind int

// How two neighbouring ranges meet.
const (
	JoinMeet    JoinKind = iota + 1 // the upper range starts where the lower ends
	JoinGap                         // no range covers the temperatures between them
	JoinOverlap                     // both ranges cover some temperatures
)

func (k JoinKind) String() string {
	switch k {
	case JoinMeet:
		return "meet"
	case JoinGap:
		return "gap"
	case JoinOverlap:
		return "overlap"
	}
	return fmt.Sprintf("JoinKind(%d)", int(k))
}

// JoinTolerance is how far apart, in K, two range bounds may be and still meet.
const JoinTolerance = 1e-6

// Join describes the boundary between two ranges that follow each other in
// order of Tmin.
type Join struct {
	Kind         JoinKind
	Lower, Upper int     // indices into Pieces
	LowerTmax    float64 // K
	UpperTmin    float64 // K
	Gap          float64 // UpperTmin − LowerTmax in K: > 0 a gap, < 0 an overlap
	// T is where the jumps were evaluated: the shared bound, or the middle of the
	// gap or overlap.
	T float64
	// DCp, DH and DS are the upper range's value minus the lower range's at T,
	// in J/(mol·K), J/mol and J/(mol·K).
	DCp, DH, DS float64
}

// Joins reports, for each pair of neighbouring ranges, whether they meet, leave a
// gap or overlap, and how far Cp, H and S jump from one to the other.
func (p *Piecewise) Joins() []Join {
	var out []Join
	for i := 1; i < len(p.pieces); i++ {
		lo, up := p.pieces[i-1], p.pieces[i]
		_, hiLo := lo.Range()
		loUp, _ := up.Range()
		j := Join{Lower: i - 1, Upper: i, LowerTmax: hiLo, UpperTmin: loUp, Gap: loUp - hiLo}
		switch {
		case math.Abs(j.Gap) <= JoinTolerance:
			j.Kind, j.T = JoinMeet, hiLo
		case j.Gap > 0:
			j.Kind, j.T = JoinGap, (hiLo+loUp)/2
		default:
			j.Kind, j.T = JoinOverlap, (hiLo+loUp)/2
		}
		j.DCp = up.Cp(j.T) - lo.Cp(j.T)
		j.DH = up.H(j.T) - lo.H(j.T)
		j.DS = up.S(j.T) - lo.S(j.T)
		out = append(out, j)
	}
	return out
}
