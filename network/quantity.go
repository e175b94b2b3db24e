package network

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"strconv"
	"strings"

	"hess/lang"
	"hess/suggest"
	"hess/thermo"
)

// quantityKind is what a property expects: a dimension, its name in
// messages and an example unit.
type quantityKind struct {
	name    string
	dim     thermo.Dim
	example string
}

var (
	energyKind      = quantityKind{"energy per mole", thermo.DimEnergyPerMole, "kJ/mol"}
	entropyKind     = quantityKind{"entropy or heat capacity", thermo.DimEntropy, "J/mol/K"}
	temperatureKind = quantityKind{"temperature", thermo.DimTemperature, "K"}
	pressureKind    = quantityKind{"pressure", thermo.DimPressure, "bar"}
	molarMassKind   = quantityKind{"molar mass", thermo.DimMolarMass, "g/mol"}
	lengthKind      = quantityKind{"length", thermo.DimLength, "Å"}
	setschenowKind  = quantityKind{"kg/mol (a reciprocal molality)", thermo.DimMolarMass, "kg/mol"}
)

// minNormal is the smallest normal float64: smaller numbers lose precision
// and read as 0 once printed.
const minNormal = 0x1p-1022

// errHexNumber is a hexadecimal number, which the lexer has reported.
var errHexNumber = errors.New("hexadecimal numbers are not part of the language")

// parseNumber reads a number token: a decimal, scientific, or p/q fraction.
func parseNumber(text string) (float64, error) {
	if v, ok := fastFloat(text); ok {
		return v, nil
	}
	if p, q, ok := strings.Cut(text, "/"); ok {
		num, err1 := strconv.ParseFloat(p, 64)
		den, err2 := strconv.ParseFloat(q, 64)
		if err1 != nil || err2 != nil || den == 0 {
			return 0, fmt.Errorf("%s is not a number", text)
		}
		return num / den, nil
	}
	if strings.ContainsAny(text, "xX") {
		return 0, errHexNumber
	}
	if strings.ContainsAny(text, "_") {
		return 0, fmt.Errorf("%s is not a number", text)
	}
	v, err := strconv.ParseFloat(text, 64)
	if err != nil && !errors.Is(err, strconv.ErrRange) {
		return 0, fmt.Errorf("%s is not a number", text)
	}
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, fmt.Errorf("number %s is out of range", text)
	}
	if v != 0 && math.Abs(v) < minNormal {
		return 0, fmt.Errorf("number %s is too small to compute with (the smallest is about 2.2e-308); write 0 if zero is meant", text)
	}
	return v, nil
}

// parseRat reads a coefficient exactly: an integer, a decimal or p/q.
func parseRat(text string) (*big.Rat, error) {
	if len(text) > 64 {
		return nil, fmt.Errorf("coefficient %s is too long", text)
	}
	if strings.ContainsAny(text, "eE") {
		return nil, fmt.Errorf("coefficient %s: write it as an integer, a decimal or a fraction p/q", text)
	}
	r, ok := new(big.Rat).SetString(text)
	if !ok {
		return nil, fmt.Errorf("%s is not a coefficient", text)
	}
	return r, nil
}

// number converts a bare number node, reporting a syntax error when it is
// out of range.
func (c *compiler) number(num *lang.Num) (float64, bool) {
	if num == nil {
		return 0, false
	}
	v, err := parseNumber(num.Text)
	if errors.Is(err, errHexNumber) {
		return 0, false
	}
	if err != nil {
		c.report(syntaxCheck, num.Span(), "%v", err)
		return 0, false
	}
	return v, true
}

// quantity converts q to SI for a property that expects kind. what names
// the property in messages. A temperature difference (a step) passes
// difference=true so that °C converts by scale only.
func (c *compiler) quantity(q *lang.Quantity, kind quantityKind, what string, difference bool) (*Value, bool) {
	v, sigma, ok := c.quantitySI(q, kind, what, difference)
	if !ok {
		return nil, false
	}
	return &Value{V: v, Sigma: sigma, Span: q.Span(), Stated: q.Sigma != nil}, true
}

// quantitySI is quantity's value and uncertainty in SI, for a caller that
// keeps only the numbers (a range's bounds).
func (c *compiler) quantitySI(q *lang.Quantity, kind quantityKind, what string, difference bool) (v, sigma float64, ok bool) {
	if q == nil || q.Value == nil {
		return 0, 0, false
	}
	x, ok := c.number(q.Value)
	if !ok {
		return 0, 0, false
	}
	if q.Sigma != nil {
		s, ok := c.number(q.Sigma)
		if !ok {
			return 0, 0, false
		}
		if s < 0 {
			c.report(syntaxCheck, q.Sigma.Span(), "an uncertainty cannot be negative, found %s", q.Sigma.Text)
			return 0, 0, false
		}
		sigma = s
	}
	if q.Unit == nil {
		c.report(missingUnitCheck, q.Value.Span(), "%s needs a unit of %s, such as %s", what, kind.name, kind.example)
		return 0, 0, false
	}
	u, err := c.parseUnit(q.Unit.Text)
	if err != nil {
		c.report(unitMismatchCheck, q.Unit.Span(), "%s takes %s (such as %s): %s",
			what, kind.name, kind.example, unitErrorMessage(err, kind.dim))
		return 0, 0, false
	}
	if u.Dim != kind.dim {
		msg := fmt.Sprintf("%s takes %s (such as %s), found %s (%s)",
			what, kind.name, kind.example, q.Unit.Text, thermo.DimName(u.Dim))
		if fix := perMoleFix(q.Unit.Text, kind.dim); fix != "" {
			msg += "; " + suggest.DidYouMean(fix)
		}
		c.report(unitMismatchCheck, q.Unit.Span(), "%s", msg)
		return 0, 0, false
	}
	sigma *= u.Scale
	if difference {
		v = x * u.Scale
	} else {
		v = u.ToSI(x)
	}
	if math.IsInf(v, 0) || math.IsInf(sigma, 0) || math.IsNaN(v) {
		c.report(syntaxCheck, q.Span(), "%s %s %s is out of range once converted to SI units", what, q.Value.Text, q.Unit.Text)
		return 0, 0, false
	}
	return v, sigma, true
}

// quantityText prints a quantity as written, for messages.
func quantityText(q *lang.Quantity) string {
	if q == nil || q.Value == nil {
		return ""
	}
	s := q.Value.Text
	if q.Unit != nil {
		s += " " + q.Unit.Text
	}
	return s
}
