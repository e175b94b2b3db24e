package thermo

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"
	"unicode"
	"unicode/utf8"
)

// Unit is a parsed unit: its text as written, its dimension, and the affine map to
// SI, SI = v·Scale + Offset. Only the temperature units °C and degC have an Offset.
type Unit struct {
	Text   string
	Dim    Dim
	Scale  float64
	Offset float64
}

// ToSI converts a value in this unit to SI: v·Scale + Offset.
func (u Unit) ToSI(v float64) float64 { return v*u.Scale + u.Offset }

// FromSI converts an SI value to this unit, the inverse of ToSI.
func (u Unit) FromSI(v float64) float64 { return (v - u.Offset) / u.Scale }

// String returns the unit as written.
func (u Unit) String() string { return u.Text }

// unitSymbol is one accepted symbol and its SI equivalent.
type unitSymbol struct {
	dim    Dim
	scale  float64
	offset float64
}

var (
	dimJoule  = Dim{1, 2, -2, 0, 0}
	dimLength = Dim{0, 1, 0, 0, 0}
	dimVolume = Dim{0, 3, 0, 0, 0}
	dimMass   = Dim{1, 0, 0, 0, 0}
	dimAmount = Dim{0, 0, 0, 1, 0}
)

var unitSymbols = map[string]unitSymbol{
	"J":        {dimJoule, 1, 0},
	"kJ":       {dimJoule, 1e3, 0},
	"cal":      {dimJoule, CalTh, 0},
	"kcal":     {dimJoule, 1e3 * CalTh, 0},
	"mol":      {dimAmount, 1, 0},
	"K":        {DimTemperature, 1, 0},
	"degC":     {DimTemperature, 1, ZeroCelsius},
	"°C":       {DimTemperature, 1, ZeroCelsius},
	"Pa":       {DimPressure, 1, 0},
	"kPa":      {DimPressure, 1e3, 0},
	"MPa":      {DimPressure, 1e6, 0},
	"bar":      {DimPressure, Bar, 0},
	"atm":      {DimPressure, Atm, 0},
	"Torr":     {DimPressure, Torr, 0},
	"g":        {dimMass, 1e-3, 0},
	"kg":       {dimMass, 1, 0},
	"s":        {DimTime, 1, 0},
	"cm":       {dimLength, 1e-2, 0},
	"m":        {dimLength, 1, 0},
	"nm":       {dimLength, 1e-9, 0},
	"pm":       {dimLength, 1e-12, 0},
	"Å":        {dimLength, 1e-10, 0}, // U+00C5
	"\u212b":   {dimLength, 1e-10, 0}, // the angstrom sign, U+212B
	"angstrom": {dimLength, 1e-10, 0},
	"L":        {dimVolume, 1e-3, 0},
}

// Limits that keep every parse bounded.
const (
	maxUnitLen    = 256
	maxUnitDepth  = 16
	maxUnitPower  = 99
	maxPowerDigit = 2
)

// ParseUnit reads a unit such as "kJ/mol", "J/(mol*K)", "cm3/mol/s" or "degC".
// Symbols combine with "*" or "·" and "/", parentheses group, and a power follows
// a symbol or group as "^N" ("mol^-1"), as trailing digits ("cm3") or as
// superscripts ("m²"). A "*" after a "/" at the same level is rejected as
// ambiguous. The offset units degC and °C are accepted only on their own.
func ParseUnit(s string) (Unit, error) {
	switch {
	case s == "":
		return Unit{}, errors.New("empty unit")
	case len(s) > maxUnitLen:
		return Unit{}, fmt.Errorf("unit of %d bytes is longer than %d", len(s), maxUnitLen)
	case !utf8.ValidString(s):
		return Unit{}, fmt.Errorf("unit %q is not valid UTF-8", s)
	case strings.IndexFunc(s, unicode.IsSpace) >= 0:
		return Unit{}, fmt.Errorf("unit %q contains white space", s)
	}
	if sym, ok := unitSymbols[s]; ok && sym.offset != 0 {
		return Unit{Text: s, Dim: sym.dim, Scale: sym.scale, Offset: sym.offset}, nil
	}
	p := unitParser{src: s}
	v, err := p.product()
	if err == nil && p.pos < len(s) {
		err = p.errorf("unexpected %q", p.rest())
	}
	if err != nil {
		var unknown *UnknownSymbolError
		if errors.As(err, &unknown) {
			unknown.Unit = s
			return Unit{}, unknown
		}
		return Unit{}, fmt.Errorf("unit %q: %w", s, err)
	}
	if math.IsInf(v.scale, 0) || v.scale == 0 || math.IsNaN(v.scale) {
		return Unit{}, fmt.Errorf("unit %q: scale factor out of range", s)
	}
	return Unit{Text: s, Dim: v.dim, Scale: v.scale}, nil
}

// UnknownSymbolError is a unit with a symbol that is not a unit: the whole
// unit as written, the symbol and its byte offset in the unit, so that a
// caller can propose a replacement.
type UnknownSymbolError struct {
	Unit   string
	Symbol string
	Offset int
}

func (e *UnknownSymbolError) Error() string {
	if e.Symbol == e.Unit {
		return fmt.Sprintf("unknown unit %q", e.Symbol)
	}
	return fmt.Sprintf("unknown unit symbol %q in %q", e.Symbol, e.Unit)
}

// UnitSymbols lists every unit symbol ParseUnit knows, sorted.
func UnitSymbols() []string {
	out := make([]string, 0, len(unitSymbols))
	for s := range unitSymbols {
		out = append(out, s)
	}
	sort.Strings(out)
	return out
}

// unitValue is a partial result of the parser.
type unitValue struct {
	dim   Dim
	scale float64
}

var unitOne = unitValue{scale: 1}

func (v unitValue) combine(w unitValue, power int) (unitValue, bool) {
	d, ok := v.dim.mul(w.dim, power)
	if !ok {
		return unitValue{}, false
	}
	return unitValue{dim: d, scale: v.scale * math.Pow(w.scale, float64(power))}, true
}

type unitParser struct {
	src   string
	pos   int
	depth int
}

func (p *unitParser) errorf(format string, args ...any) error {
	return fmt.Errorf("column %d: "+format, append([]any{p.column()}, args...)...)
}

func (p *unitParser) column() int { return utf8.RuneCountInString(p.src[:p.pos]) + 1 }

func (p *unitParser) rest() string {
	r, _ := utf8.DecodeRuneInString(p.src[p.pos:])
	return string(r)
}

func (p *unitParser) peek() rune {
	if p.pos >= len(p.src) {
		return utf8.RuneError
	}
	r, _ := utf8.DecodeRuneInString(p.src[p.pos:])
	return r
}

func (p *unitParser) next() rune {
	r, n := utf8.DecodeRuneInString(p.src[p.pos:])
	p.pos += n
	return r
}

// product = factor { ("*" | "·" | "/") factor } .
func (p *unitParser) product() (unitValue, error) {
	acc, err := p.factor()
	if err != nil {
		return unitValue{}, err
	}
	divided := false
	for p.pos < len(p.src) {
		op := p.peek()
		power := 1
		switch op {
		case '*', '·':
			if divided {
				return unitValue{}, p.errorf("%q after \"/\" is ambiguous; group the denominator in parentheses", string(op))
			}
		case '/':
			divided = true
			power = -1
		default:
			return acc, nil
		}
		p.next()
		f, err := p.factor()
		if err != nil {
			return unitValue{}, err
		}
		var ok bool
		if acc, ok = acc.combine(f, power); !ok {
			return unitValue{}, p.errorf("exponent out of range")
		}
	}
	return acc, nil
}

// factor = ( "(" product ")" | "1" | symbol [ digits ] ) [ power ] .
func (p *unitParser) factor() (unitValue, error) {
	start := p.pos
	var v unitValue
	trailing := false
	switch r := p.peek(); {
	case p.pos >= len(p.src):
		return unitValue{}, p.errorf("expected a unit symbol at the end")
	case r == '(':
		if p.depth >= maxUnitDepth {
			return unitValue{}, p.errorf("parentheses nested deeper than %d", maxUnitDepth)
		}
		p.next()
		p.depth++
		inner, err := p.product()
		p.depth--
		if err != nil {
			return unitValue{}, err
		}
		if p.peek() != ')' || p.pos >= len(p.src) {
			return unitValue{}, p.errorf("missing \")\"")
		}
		p.next()
		v = inner
	case r >= '0' && r <= '9':
		for p.pos < len(p.src) && isDigit(p.peek()) {
			p.next()
		}
		if num := p.src[start:p.pos]; num != "1" {
			return unitValue{}, fmt.Errorf("number %q in a unit: only the factor 1 is allowed, as in 1/s", num)
		}
		v = unitOne
	case isSymbolRune(r):
		for p.pos < len(p.src) && isSymbolRune(p.peek()) {
			p.next()
		}
		name := p.src[start:p.pos]
		sym, ok := unitSymbols[name]
		if !ok {
			return unitValue{}, &UnknownSymbolError{Symbol: name, Offset: start}
		}
		if sym.offset != 0 {
			return unitValue{}, fmt.Errorf("%q is valid only alone, not inside a compound unit", name)
		}
		v = unitValue{dim: sym.dim, scale: sym.scale}
		if p.pos < len(p.src) && isDigit(p.peek()) {
			n, err := p.digits(false)
			if err != nil {
				return unitValue{}, err
			}
			var ok bool
			if v, ok = unitOne.combine(v, n); !ok {
				return unitValue{}, p.errorf("exponent out of range")
			}
			trailing = true
		}
	default:
		return unitValue{}, p.errorf("expected a unit symbol, found %q", p.rest())
	}
	n, has, err := p.power()
	if err != nil {
		return unitValue{}, err
	}
	if !has {
		return v, nil
	}
	if trailing {
		return unitValue{}, p.errorf("a symbol with trailing digits cannot take a second power")
	}
	out, ok := unitOne.combine(v, n)
	if !ok {
		return unitValue{}, p.errorf("exponent out of range")
	}
	return out, nil
}

// power = "^" [ sign ] digits | superscripts .
func (p *unitParser) power() (n int, has bool, err error) {
	switch r := p.peek(); {
	case p.pos >= len(p.src):
		return 0, false, nil
	case r == '^':
		p.next()
		neg := false
		switch p.peek() {
		case '-', '−':
			neg = true
			p.next()
		case '+':
			p.next()
		}
		if p.pos >= len(p.src) || !isDigit(p.peek()) {
			return 0, false, p.errorf("expected an integer power after \"^\"")
		}
		n, err := p.digits(false)
		if neg {
			n = -n
		}
		return n, true, err
	case r == '⁻' || superDigit(r) >= 0:
		neg := false
		if r == '⁻' {
			neg = true
			p.next()
			if superDigit(p.peek()) < 0 || p.pos >= len(p.src) {
				return 0, false, p.errorf("expected a superscript digit after \"⁻\"")
			}
		}
		n, err := p.digits(true)
		if neg {
			n = -n
		}
		return n, true, err
	}
	return 0, false, nil
}

// digits reads a run of ASCII (or superscript) digits as a power.
func (p *unitParser) digits(super bool) (int, error) {
	n, count := 0, 0
	for p.pos < len(p.src) {
		d := -1
		if r := p.peek(); super {
			d = superDigit(r)
		} else if isDigit(r) {
			d = int(r - '0')
		}
		if d < 0 {
			break
		}
		p.next()
		count++
		if count > maxPowerDigit {
			return 0, p.errorf("power larger than %d", maxUnitPower)
		}
		n = 10*n + d
	}
	return n, nil
}

func isDigit(r rune) bool { return r >= '0' && r <= '9' }

func isSymbolRune(r rune) bool {
	return (r >= 'a' && r <= 'z') || (r >= 'A' && r <= 'Z') || r == '°' || r == 'Å' || r == '\u212b'
}

func superDigit(r rune) int {
	for i, s := range superDigits {
		if r == s {
			return i
		}
	}
	return -1
}
