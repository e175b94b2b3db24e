package thermo

import (
	"strconv"
	"strings"
)

// Dim is a physical dimension as integer exponents of kg, m, s, mol, K.
type Dim [5]int8

// Base-unit positions inside a Dim.
const (
	dimKg = iota
	dimM
	dimS
	dimMol
	dimK
)

// Dimensions the language uses for its properties.
var (
	DimNone          = Dim{}
	DimEnergy        = Dim{1, 2, -2, 0, 0}
	DimEnergyPerMole = Dim{1, 2, -2, -1, 0}
	DimEntropy       = Dim{1, 2, -2, -1, -1} // J/(mol·K): entropy and heat capacity
	DimTemperature   = Dim{0, 0, 0, 0, 1}
	DimPressure      = Dim{1, -1, -2, 0, 0}
	DimMolarMass     = Dim{1, 0, 0, -1, 0}
	DimMolality      = Dim{-1, 0, 0, 1, 0} // mol/kg
	DimConcentration = Dim{0, -3, 0, 1, 0} // mol/m³
	DimTime          = Dim{0, 0, 1, 0, 0}
	DimLength        = Dim{0, 1, 0, 0, 0}
)

// RatePrefactorDim is the dimension of an Arrhenius prefactor for a step of the given
// order: (m^3/mol)^(order-1) / s. Orders outside −40…42 are clamped to that interval,
// the widest whose exponents fit a Dim.
func RatePrefactorDim(order int) Dim {
	order = max(-40, min(order, 42))
	p := order - 1
	return Dim{0, int8(3 * p), -1, int8(-p), 0}
}

var baseSymbols = [5]string{"kg", "m", "s", "mol", "K"}

// String renders the dimension as a product of base units with superscript
// exponents, for example "kg·m²·s⁻²·mol⁻¹"; the dimensionless Dim is "1".
func (d Dim) String() string {
	var b strings.Builder
	for i, e := range d {
		if e == 0 {
			continue
		}
		if b.Len() > 0 {
			b.WriteString("·")
		}
		b.WriteString(baseSymbols[i])
		if e != 1 {
			b.WriteString(superscript(int(e)))
		}
	}
	if b.Len() == 0 {
		return "1"
	}
	return b.String()
}

var superDigits = []rune("⁰¹²³⁴⁵⁶⁷⁸⁹")

func superscript(n int) string {
	var b strings.Builder
	if n < 0 {
		b.WriteRune('⁻')
		n = -n
	}
	for _, c := range strconv.Itoa(n) {
		b.WriteRune(superDigits[c-'0'])
	}
	return b.String()
}

var dimNames = map[Dim]string{
	DimNone:             "dimensionless",
	DimEnergy:           "energy",
	DimEnergyPerMole:    "energy per mole",
	DimEntropy:          "entropy or heat capacity",
	DimTemperature:      "temperature",
	DimPressure:         "pressure",
	DimMolarMass:        "molar mass",
	DimMolality:         "molality",
	DimConcentration:    "concentration",
	DimTime:             "time",
	DimLength:           "length",
	RatePrefactorDim(0): "zero-order rate prefactor",
	RatePrefactorDim(1): "first-order rate prefactor",
	RatePrefactorDim(2): "second-order rate prefactor",
	RatePrefactorDim(3): "third-order rate prefactor",
}

// DimName names the dimension in words ("energy per mole", "pressure", …), or
// returns d.String() for a dimension without a name.
func DimName(d Dim) string {
	if n, ok := dimNames[d]; ok {
		return n
	}
	return d.String()
}

// mul returns the product dimension d·e, or false when an exponent leaves the
// range of a Dim.
func (d Dim) mul(e Dim, power int) (Dim, bool) {
	var out Dim
	for i := range d {
		v := int(d[i]) + power*int(e[i])
		if v < -128 || v > 127 {
			return Dim{}, false
		}
		out[i] = int8(v)
	}
	return out, true
}
