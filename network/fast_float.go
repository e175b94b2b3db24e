package network

// pow10 are the powers of ten that a float64 holds exactly.
var pow10 = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10,
	1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22}

// fastFloat reads the common number of a network file — an optional sign,
// digits with at most one point, an optional exponent — when its
// significant digits form an integer below 2^53 and its scale is a power of
// ten from 10^-22 to 10^22. Both are then exact in a float64, and one
// multiplication or division rounds correctly (Clinger 1990, "How to read
// floating point numbers accurately"), so the result is the one
// strconv.ParseFloat gives. ok is false for anything else (more digits,
// a larger exponent, a fraction p/q, malformed text), which the caller
// reads the slow way.
func fastFloat(s string) (v float64, ok bool) {
	i, neg := 0, false
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		neg = s[i] == '-'
		i++
	}
	var mant uint64
	exp, digits := 0, 0
	sawDigit, sawPoint := false, false
	for ; i < len(s); i++ {
		c := s[i]
		if c == '.' {
			if sawPoint {
				return 0, false
			}
			sawPoint = true
			continue
		}
		if c < '0' || c > '9' {
			break
		}
		sawDigit = true
		if sawPoint {
			exp--
		}
		if mant == 0 && c == '0' {
			continue // a leading zero is not a significant digit
		}
		if digits == 19 {
			return 0, false
		}
		mant = 10*mant + uint64(c-'0')
		digits++
	}
	if !sawDigit {
		return 0, false
	}
	if i < len(s) {
		if s[i] != 'e' && s[i] != 'E' {
			return 0, false
		}
		i++
		eneg := false
		if i < len(s) && (s[i] == '+' || s[i] == '-') {
			eneg = s[i] == '-'
			i++
		}
		if i == len(s) || len(s)-i > 4 {
			return 0, false
		}
		e := 0
		for ; i < len(s); i++ {
			c := s[i]
			if c < '0' || c > '9' {
				return 0, false
			}
			e = 10*e + int(c-'0')
		}
		if eneg {
			e = -e
		}
		exp += e
	}
	if mant >= 1<<53 {
		return 0, false
	}
	v = float64(mant)
	switch {
	case mant == 0:
	case exp == 0:
	case exp > 0 && exp < len(pow10):
		v *= pow10[exp]
	case exp < 0 && -exp < len(pow10):
		v /= pow10[-exp]
	default:
		return 0, false
	}
	if neg {
		v = -v
	}
	return v, true
}
