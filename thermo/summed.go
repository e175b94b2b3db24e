package thermo

import "math"

// SummedDeltaG returns a function that gives ΔrG°(T) as DeltaG does, to
// rounding, and is faster where it is called at many temperatures. G° of a
// NASA 7-term or Shomate range is linear in the range's coefficients, so
// the ranges that answer at T are weighted by their stoichiometric numbers
// and summed: one evaluation serves every species of each kind. Species
// with other models are evaluated one by one. The function keeps the last
// sums, so it must not be called from several goroutines at once.
func (r Reaction) SummedDeltaG() func(T float64) float64 {
	s := &summed{}
	for _, t := range r.Terms {
		if t.Nu == 0 {
			continue
		}
		if t.Model == nil {
			return func(float64) float64 { return math.NaN() }
		}
		pw, _ := t.Model.(*Piecewise)
		s.terms = append(s.terms, summedTerm{nu: t.Nu, model: t.Model, pw: pw})
	}
	s.choice = make([]int, len(s.terms))
	for i, t := range s.terms {
		if t.pw == nil {
			s.choice[i] = -1
		}
	}
	return s.deltaG
}

type summedTerm struct {
	nu    float64
	model Model
	pw    *Piecewise // model, when it is one
}

// summed keeps the weighted coefficient sums for the ranges chosen at the
// last temperature, worked out again when the choice changes.
type summed struct {
	terms  []summedTerm
	choice []int // per term, the index of the range that answered; -1 for a single range
	valid  bool
	nasa   NASA7Range
	shom   ShomateRange
	others []summedTerm // terms whose answering model is neither kind
	anyN   bool
	anyS   bool
}

func (s *summed) deltaG(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	same := s.valid
	for i, t := range s.terms {
		if t.pw == nil || t.pw.answers(s.choice[i], T) {
			continue
		}
		if k := t.pw.pieceIndex(T); k != s.choice[i] {
			s.choice[i], same = k, false
		}
	}
	if !same {
		s.sum()
	}
	g := 0.0
	if s.anyN {
		g += s.nasa.G(T)
	}
	if s.anyS {
		g += s.shom.G(T)
	}
	for _, o := range s.others {
		g += o.nu * o.model.G(T)
	}
	return g
}

// sum works out the coefficient sums for the current choice of ranges.
func (s *summed) sum() {
	s.nasa, s.shom, s.others, s.anyN, s.anyS = NASA7Range{}, ShomateRange{}, s.others[:0], false, false
	for i, t := range s.terms {
		m := t.model
		if t.pw != nil {
			m = t.pw.pieces[s.choice[i]]
		}
		switch m := m.(type) {
		case NASA7Range:
			for j, a := range m.A {
				s.nasa.A[j] += t.nu * a
			}
			s.anyN = true
		case ShomateRange:
			for j, c := range m.Coef {
				s.shom.Coef[j] += t.nu * c
			}
			s.anyS = true
		default:
			s.others = append(s.others, summedTerm{nu: t.nu, model: m})
		}
	}
	s.valid = true
}
