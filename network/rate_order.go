package network

import (
	"math/big"
	"strconv"
	"strings"
	"sync"
	"sync/atomic"

	"hess/thermo"
)

// stepOrder is the order of an elementary step's rate in one direction:
// the sum of the coefficients of the species on that side, pure solids
// and liquids left out (their activity is 1, so they do not enter a rate
// law). The result may be shared (see sharedRat): never change it in place.
func stepOrder(terms []Term) *big.Rat {
	// Whole coefficients add up in an integer: the usual step allocates
	// only its result.
	var small int64
	exact := true
	for _, t := range terms {
		if t.Species == nil || t.Coef == nil || t.Species.QuotientActivity().Pure() {
			continue
		}
		n, isInt := smallInt(t.Coef)
		if !isInt {
			exact = false
			break
		}
		small += n
	}
	if exact {
		return sharedRat(small)
	}
	o := new(big.Rat)
	for _, t := range terms {
		if t.Species == nil || t.Coef == nil || t.Species.QuotientActivity().Pure() {
			continue
		}
		o.Add(o, t.Coef)
	}
	return o
}

// concDeltaN is Δn over the species that enter a rate law: the net change
// in moles of every species but pure solids and liquids.
func concDeltaN(rx *Reaction) *big.Rat {
	return new(big.Rat).Sub(stepOrder(rx.Right), stepOrder(rx.Left))
}

// prefactorOrder returns the reaction order a prefactor unit belongs to.
// A network writes the same few rate units thousands of times, so the
// answers for short units are kept (prefactorOrders).
func prefactorOrder(unit string) (int, bool) {
	if v, ok := prefactorOrders.Load(unit); ok {
		o := v.(int)
		return o, o >= 0
	}
	o, ok := parsePrefactorOrder(unit)
	if len(unit) <= maxKeptUnit && prefactorKept.Add(1) <= maxKeptUnits {
		v := o
		if !ok {
			v = -1
		}
		prefactorOrders.Store(strings.Clone(unit), v)
	}
	return o, ok
}

// prefactorOrders maps a prefactor unit as written to its order (-1: none);
// it keeps at most maxKeptUnits units of at most maxKeptUnit bytes, so a
// file of made-up units cannot grow it without bound.
var (
	prefactorOrders sync.Map
	prefactorKept   atomic.Int64
)

const (
	maxKeptUnits = 256
	maxKeptUnit  = 32
)

// parsePrefactorOrder is prefactorOrder without the cache.
func parsePrefactorOrder(unit string) (int, bool) {
	u, err := thermo.ParseUnit(unit)
	if err != nil {
		return 0, false
	}
	for o := 0; o <= maxOrder; o++ {
		if u.Dim == thermo.RatePrefactorDim(o) {
			return o, true
		}
	}
	return 0, false
}

// volumeSymbol guesses the volume unit a rate unit is written in (cm3, L
// or m3), so that suggested units match it; cm3 when it names none.
func volumeSymbol(unit string) string {
	switch {
	case strings.Contains(unit, "cm"):
		return "cm"
	case strings.Contains(unit, "L"):
		return "L"
	case strings.Contains(unit, "m"):
		// "m" with a power, as in m3/mol/s; "mol" alone also holds an m.
		if strings.Contains(strings.ReplaceAll(unit, "mol", ""), "m") {
			return "m"
		}
	}
	return "cm"
}

// volumePower writes a volume symbol to a power of cubic units: ("cm", 2) is
// cm6, ("L", 2) is L2.
func volumePower(vol string, p int) string {
	if vol == "L" {
		if p == 1 {
			return "L"
		}
		return "L" + strconv.Itoa(p)
	}
	return vol + strconv.Itoa(3*p)
}

func molPower(p int) string {
	if p == 1 {
		return "mol"
	}
	return "mol" + strconv.Itoa(p)
}

// prefactorUnit writes the prefactor unit of a step of the given order in
// a volume unit: 1/s, cm3/mol/s, cm6/mol2/s, mol/cm3/s for order 0.
func prefactorUnit(order int, vol string) string {
	switch {
	case order == 1:
		return "1/s"
	case order == 0:
		return "mol/" + volumePower(vol, 1) + "/s"
	case order < 0:
		return ""
	}
	p := order - 1
	return volumePower(vol, p) + "/" + molPower(p) + "/s"
}

// orderName writes an order as an adjective: "second-order".
func orderName(o int) string {
	names := []string{"zero-order", "first-order", "second-order", "third-order", "fourth-order"}
	if o >= 0 && o < len(names) {
		return names[o]
	}
	return "order-" + strconv.Itoa(o)
}

// concentrationUnit writes (mol/volume)^dn in a volume unit: "" for 0,
// "mol/cm3", "cm3/mol", "mol2/cm6".
func concentrationUnit(dn *big.Rat, vol string) string {
	if dn.Sign() == 0 {
		return ""
	}
	if !dn.IsInt() || !dn.Num().IsInt64() {
		return "(mol/" + volumePower(vol, 1) + ")^" + ratText(dn)
	}
	p := int(dn.Num().Int64())
	if p > 0 {
		return molPower(p) + "/" + volumePower(vol, p)
	}
	return volumePower(vol, -p) + "/" + molPower(-p)
}

// volumeScale is the size of one volume unit in m³.
func volumeScale(vol string) float64 {
	switch vol {
	case "L":
		return 1e-3
	case "m":
		return 1
	}
	return 1e-6
}
