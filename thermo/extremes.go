package thermo

import "math"

// Where a polynomial range's Cp°, H° and S° take their least and greatest
// values, found exactly rather than by sampling. On a range [Tmin, Tmax]
// with T > 0:
//
//   - Cp° is smooth, so its extremes are at the bounds or where dCp°/dT = 0;
//   - dH°/dT = Cp° and dS°/dT = Cp°/T, so H° and S° rise where Cp° > 0 and
//     fall where Cp° < 0: their extremes are at the bounds or where Cp°
//     changes sign.
//
// For a NASA 7-term range, Cp°/R is a quartic in T and dCp°/dT a cubic. For
// a Shomate range, with t = T/1000, t²·Cp° = D·t⁵ + C·t⁴ + B·t³ + A·t² + E
// and t³·dCp°/dt = 3D·t⁵ + 2C·t⁴ + B·t³ − 2E, quintics with the signs of
// Cp° and dCp°/dt for t > 0. Every such root inside the range is found by
// polyRoots, so the least and greatest values over the finite set
// Critical returns are those over the whole range.

// Extreme is a value and the temperature (K) where it is taken.
type Extreme struct{ T, V float64 }

// Extremes are the least and greatest Cp° (J/(mol·K)), H° (J/mol) and S°
// (J/(mol·K)) of a range. Of equal values the lowest temperature is given.
type Extremes struct {
	CpMin, CpMax, HMin, HMax, SMin, SMax Extreme
}

// Polynomial is a range model whose critical temperatures are known.
type Polynomial interface {
	Model
	// Critical returns, ascending and without repeats, the range's bounds
	// and every temperature inside where dCp°/dT or Cp° changes sign (or is
	// zero at a turning point): the only temperatures where Cp°, H° or S°
	// can take their least or greatest value on the range.
	Critical() Temperatures
}

// RangeExtremes evaluates m at its critical temperatures and returns the
// least and greatest values, which are those over the whole range.
func RangeExtremes(m Polynomial) Extremes {
	var e Extremes
	c := m.Critical()
	for i, T := range c.List() {
		cp, h, s := m.Cp(T), m.H(T), m.S(T)
		if i == 0 {
			e = Extremes{Extreme{T, cp}, Extreme{T, cp}, Extreme{T, h}, Extreme{T, h}, Extreme{T, s}, Extreme{T, s}}
			continue
		}
		lower(&e.CpMin, T, cp)
		higher(&e.CpMax, T, cp)
		lower(&e.HMin, T, h)
		higher(&e.HMax, T, h)
		lower(&e.SMin, T, s)
		higher(&e.SMax, T, s)
	}
	return e
}

func lower(x *Extreme, T, v float64) {
	if v < x.V {
		*x = Extreme{T, v}
	}
}

func higher(x *Extreme, T, v float64) {
	if v > x.V {
		*x = Extreme{T, v}
	}
}

// Temperatures is a short ascending list of temperatures (K) held by value:
// a range's bounds and the roots of two polynomials of degree five at most.
type Temperatures struct {
	t [12]float64
	n int
}

// List returns the temperatures.
func (c *Temperatures) List() []float64 { return c.t[:c.n] }

// Critical returns the range's bounds and the temperatures inside where
// dCp°/dT (a cubic) or Cp° (a quartic) changes sign, ascending.
func (r NASA7Range) Critical() Temperatures {
	a := &r.A
	cp := poly{a[0], a[1], a[2], a[3], a[4]}
	slope := cp.derivative()
	return critical(r.Tmin, r.Tmax, 1, &slope, &cp)
}

// Critical returns the range's bounds and the temperatures inside where
// dCp°/dT or Cp° changes sign, ascending (see the notes above
// RangeExtremes for the quintics in t = T/1000 whose roots they are).
func (r ShomateRange) Critical() Temperatures {
	c := &r.Coef
	A, B, C, D, E := c[0], c[1], c[2], c[3], c[4]
	slope := poly{-2 * E, 0, 0, B, 2 * C, 3 * D}
	value := poly{E, 0, A, B, C, D}
	return critical(r.Tmin, r.Tmax, 1000, &slope, &value)
}

// critical lists Tmin, the roots of the two polynomials in x = T/scale
// strictly inside the range, and Tmax, ascending without repeats.
func critical(Tmin, Tmax, scale float64, p, q *poly) Temperatures {
	var c Temperatures
	var buf [2 * (len(poly{}) - 1)]float64
	roots := q.appendRoots(p.appendRoots(buf[:0], Tmin/scale, Tmax/scale), Tmin/scale, Tmax/scale)
	out := append(c.t[:0], Tmin)
	for _, x := range roots {
		if T := x * scale; T > Tmin && T < Tmax {
			out = append(out, T)
		}
	}
	out = append(out, Tmax)
	sortFloats(out)
	w := 1
	for _, T := range out[1:] {
		if T != out[w-1] {
			out[w] = T
			w++
		}
	}
	c.n = w
	return c
}

// sortFloats sorts a short slice in place (insertion sort: at most a dozen).
func sortFloats(v []float64) {
	for i := 1; i < len(v); i++ {
		for j := i; j > 0 && v[j] < v[j-1]; j-- {
			v[j], v[j-1] = v[j-1], v[j]
		}
	}
}

// poly is a polynomial of degree at most five, coefficients in ascending
// powers.
type poly [6]float64

// degree is the highest power with a nonzero coefficient (−1 for zero).
func (p *poly) degree() int {
	d := len(p) - 1
	for d >= 0 && p[d] == 0 {
		d--
	}
	return d
}

func (p *poly) at(x float64) float64 {
	v := 0.0
	for i := p.degree(); i >= 0; i-- {
		v = v*x + p[i]
	}
	return v
}

func (p *poly) derivative() poly {
	var d poly
	for i := 1; i < len(p); i++ {
		d[i-1] = float64(i) * p[i]
	}
	return d
}

// appendRoots appends to dst, ascending, the roots of p strictly inside
// (a, b) where p changes sign or touches zero at a turning point. Working
// up from the linear derivative, the roots of each derivative split (a, b)
// into pieces on which the next one up is monotonic; a piece whose ends
// differ in sign holds exactly one root, which Brent's method refines to
// the precision of a double. A zero polynomial has none (every point is as
// extreme as any other, and the bounds are candidates anyway).
func (p *poly) appendRoots(dst []float64, a, b float64) []float64 {
	d := p.degree()
	if d <= 0 || !(a < b) {
		return dst
	}
	var chain [len(poly{})]poly // chain[k] is the k-th derivative of p
	chain[0] = *p
	for k := 1; k < d; k++ {
		chain[k] = chain[k-1].derivative()
	}
	var bufs [2][len(poly{})]float64
	lin := &chain[d-1] // linear
	roots := bufs[0][:0]
	if x := -lin[0] / lin[1]; a < x && x < b {
		roots = append(roots, x)
	}
	for k := d - 2; k >= 0; k-- {
		roots = chain[k].rootsBetween(bufs[k%2][:0], a, b, roots)
	}
	return append(dst, roots...)
}

// rootsBetween appends the roots of p inside (a, b), given the roots of
// its derivative there (turns, ascending): one on each monotonic piece whose
// ends differ in sign, and any turn where p is zero.
func (p *poly) rootsBetween(dst []float64, a, b float64, turns []float64) []float64 {
	lo, flo := a, p.at(a)
	for i := 0; i <= len(turns); i++ {
		hi := b
		if i < len(turns) {
			hi = turns[i]
		}
		fhi := p.at(hi)
		switch {
		case fhi == 0 && hi < b:
			dst = append(dst, hi)
		case flo != 0 && fhi != 0 && (flo < 0) != (fhi < 0):
			if x, err := Brent(p.at, lo, hi, 0); err == nil && !math.IsNaN(x) {
				dst = append(dst, x)
			}
		}
		lo, flo = hi, fhi
	}
	return dst
}
