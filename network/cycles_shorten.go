package network

import (
	"math/big"
)

// Limits of the shortening passes, which keep them near linear in the
// number of cycles.
const (
	maxShortenPasses   = 8
	maxShortenPartners = 64
)

// shorten replaces basis cycles by combinations with other basis cycles
// where that gives fewer reactions (or, as many, smaller weights). Each
// replacement keeps the set a basis.
func shorten(cycles []ivec) []ivec {
	for pass := 0; pass < maxShortenPasses; pass++ {
		index := map[int][]int{}
		for c, v := range cycles {
			for _, t := range v {
				index[t.i] = append(index[t.i], c)
			}
		}
		improved := false
		for c := range cycles {
			best := cycles[c]
			bestLen, bestL1 := len(best), l1(best)
			var bestA, bestB *big.Int
			bestD := -1
			tried := 0
			for _, t := range cycles[c] {
				for _, d := range index[t.i] {
					if d == c || tried >= maxShortenPartners {
						continue
					}
					// a·x − b·y keeps every entry of y outside x: a partner
					// twice as long cannot shorten the cycle.
					if len(cycles[d]) >= 2*len(best) {
						continue
					}
					b, a := cycles[d].at(t.i), best.at(t.i)
					if b == nil || a == nil {
						continue
					}
					tried++
					var g big.Int
					g.GCD(nil, nil, new(big.Int).Abs(a), new(big.Int).Abs(b))
					ca, cb := new(big.Int).Quo(b, &g), new(big.Int).Quo(a, &g)
					n, sum := combinedShape(ca, best, cb, cycles[d])
					if n > 0 && (n < bestLen || (n == bestLen && sum.Cmp(bestL1) < 0)) {
						bestLen, bestL1, bestA, bestB, bestD = n, sum, ca, cb, d
					}
				}
				if bestD >= 0 {
					// Apply the best combination found through this reaction,
					// then look for more from the shorter cycle.
					best = primitive(combine(bestA, best, bestB, cycles[bestD]))
					bestLen, bestL1, bestD = len(best), l1(best), -1
				}
			}
			if len(best) != len(cycles[c]) || l1(best).Cmp(l1(cycles[c])) != 0 {
				cycles[c] = best
				improved = true
			}
		}
		if !improved {
			break
		}
	}
	return cycles
}

// combinedShape returns the number of entries and the sum of absolute
// values of primitive(a·x − b·y) without building it.
func combinedShape(a *big.Int, x ivec, b *big.Int, y ivec) (int, *big.Int) {
	if small, ok := combinedShapeSmall(a, x, b, y); ok {
		return small.n, big.NewInt(small.l1)
	}
	v := primitive(combine(a, x, b, y))
	return len(v), l1(v)
}

type shape struct {
	n  int
	l1 int64
}

// combinedShapeSmall is combinedShape in int64 arithmetic, for entries and
// factors below 2²⁰ in magnitude (ok is false otherwise), so that no sum of
// products overflows.
func combinedShapeSmall(a *big.Int, x ivec, b *big.Int, y ivec) (shape, bool) {
	const lim = 1 << 20
	fits := func(z *big.Int) (int64, bool) {
		if !z.IsInt64() {
			return 0, false
		}
		v := z.Int64()
		return v, v > -lim && v < lim
	}
	av, ok1 := fits(a)
	bv, ok2 := fits(b)
	if !ok1 || !ok2 {
		return shape{}, false
	}
	var g, sum int64
	n := 0
	add := func(v int64) {
		if v == 0 {
			return
		}
		if v < 0 {
			v = -v
		}
		n++
		sum += v
		g = gcd64(g, v)
	}
	i, k := 0, 0
	for i < len(x) || k < len(y) {
		switch {
		case k == len(y) || (i < len(x) && x[i].i < y[k].i):
			xv, ok := fits(x[i].v)
			if !ok {
				return shape{}, false
			}
			add(av * xv)
			i++
		case i == len(x) || y[k].i < x[i].i:
			yv, ok := fits(y[k].v)
			if !ok {
				return shape{}, false
			}
			add(-bv * yv)
			k++
		default:
			xv, ok1 := fits(x[i].v)
			yv, ok2 := fits(y[k].v)
			if !ok1 || !ok2 {
				return shape{}, false
			}
			add(av*xv - bv*yv)
			i++
			k++
		}
	}
	if g == 0 {
		return shape{}, true
	}
	return shape{n, sum / g}, true
}

func gcd64(a, b int64) int64 {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}

// shorter reports whether a has fewer reactions than b, or as many with a
// smaller sum of absolute weights.
func shorter(a, b ivec) bool {
	if len(a) == 0 {
		return false
	}
	if len(a) != len(b) {
		return len(a) < len(b)
	}
	return l1(a).Cmp(l1(b)) < 0
}

func l1(v ivec) *big.Int {
	s := new(big.Int)
	for _, t := range v {
		if t.v.Sign() < 0 {
			s.Sub(s, t.v)
		} else {
			s.Add(s, t.v)
		}
	}
	return s
}
