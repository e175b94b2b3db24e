package network

import (
	"errors"
	"strings"

	"hess/suggest"
	"hess/thermo"
)

// unitErrorMessage words a unit that does not parse, with the nearest
// unit that does when one is close: a misspelt symbol replaced (kj/mol →
// kJ/mol), or a temperature written without its degree (C → degC). want
// lists the dimensions the property accepts (none: any); a replacement of
// one of them is preferred.
func unitErrorMessage(err error, want ...thermo.Dim) string {
	msg := err.Error()
	var unknown *thermo.UnknownSymbolError
	if !errors.As(err, &unknown) {
		return msg
	}
	if fix := unitReplacement(unknown, want); fix != "" {
		msg += "; " + suggest.DidYouMean(fix)
	}
	return msg
}

// unitReplacement is the unit with its unknown symbol replaced by the
// nearest known one, or "" when no replacement gives a unit (of a wanted
// dimension, when want is not empty).
func unitReplacement(e *thermo.UnknownSymbolError, want []thermo.Dim) string {
	if e.Offset < 0 || e.Offset+len(e.Symbol) > len(e.Unit) {
		return ""
	}
	symbols := thermo.UnitSymbols()
	var cands []string
	// A temperature written without its degree sign or prefix.
	for _, deg := range []string{"deg", "°"} {
		if s := deg + e.Symbol; contains(symbols, s) {
			cands = append(cands, s)
		}
	}
	if c, ok := suggest.Closest(e.Symbol, symbols); ok {
		cands = append(cands, c)
	}
	// Two symbols run together (molK): divided or multiplied.
	for i := 1; i < len(e.Symbol); i++ {
		a, b := e.Symbol[:i], e.Symbol[i:]
		if contains(symbols, a) && contains(symbols, b) {
			cands = append(cands, a+"/"+b, a+"*"+b)
		}
	}
	var fallback string
	for _, c := range cands {
		fixed := e.Unit[:e.Offset] + c + e.Unit[e.Offset+len(e.Symbol):]
		u, err := thermo.ParseUnit(fixed)
		if err != nil {
			continue
		}
		if len(want) == 0 || hasDim(want, u.Dim) {
			return fixed
		}
		if fallback == "" {
			fallback = fixed
		}
	}
	if len(want) > 0 {
		return "" // a unit of another dimension would only mislead
	}
	return fallback
}

// perMoleFix proposes, for a unit of the wrong dimension, the same unit
// per mole when that is what the property takes: kJ → kJ/mol, J/K →
// J/mol/K. It returns "" when no such unit fits.
func perMoleFix(text string, want thermo.Dim) string {
	first := text
	rest := ""
	if i := strings.IndexAny(text, "/*·"); i > 0 {
		first, rest = text[:i], text[i:]
	}
	for _, fix := range []string{first + "/mol" + rest, text + "/mol"} {
		if u, err := thermo.ParseUnit(fix); err == nil && u.Dim == want {
			return fix
		}
	}
	return ""
}

func hasDim(ds []thermo.Dim, d thermo.Dim) bool {
	for _, x := range ds {
		if x == d {
			return true
		}
	}
	return false
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}
