package chem

import (
	"math"
	"sort"
)

// An Element is one entry of an element table: a built-in chemical element or
// an element a network file adds (an isotope such as D, or a pseudo-element).
// Weight is the atomic weight in g/mol and is meaningful only when HasWeight
// is set. Z is the atomic number; it is 0 for user elements, whose Name is
// empty.
type Element struct {
	Symbol    string
	Name      string
	Z         int
	Weight    float64
	HasWeight bool
}

// An ElementTable maps element symbols to elements. A table never changes
// once built, so one table may be shared by any number of goroutines.
type ElementTable struct {
	bySymbol map[string]Element
}

// builtinElementTable is the periodic table every network starts from.
var builtinElementTable = newElementTable(periodicTable)

// BuiltinElements returns the shared table of the 118 chemical elements with
// their IUPAC/CIAAW 2021 standard atomic weights.
func BuiltinElements() *ElementTable { return builtinElementTable }

func newElementTable(elements []Element) *ElementTable {
	t := &ElementTable{bySymbol: make(map[string]Element, len(elements))}
	for _, e := range elements {
		t.bySymbol[e.Symbol] = e
	}
	return t
}

// Lookup returns the element with the given symbol (case-sensitive).
func (t *ElementTable) Lookup(symbol string) (Element, bool) {
	if t == nil {
		t = builtinElementTable
	}
	e, ok := t.bySymbol[symbol]
	return e, ok
}

// With returns a copy of t that also holds a user element with the given
// symbol and atomic weight (g/mol); an element of t with the same symbol is
// replaced in the copy. t itself is not changed. The user element has a
// weight when weight is finite and positive. Callers check the symbol with
// IsElementSymbol first: the formula parser finds only symbols of that form.
func (t *ElementTable) With(symbol string, weight float64) *ElementTable {
	if t == nil {
		t = builtinElementTable
	}
	c := &ElementTable{bySymbol: make(map[string]Element, len(t.bySymbol)+1)}
	for s, e := range t.bySymbol {
		c.bySymbol[s] = e
	}
	ok := weight > 0 && !math.IsInf(weight, 1)
	if !ok {
		weight = 0
	}
	c.bySymbol[symbol] = Element{Symbol: symbol, Weight: weight, HasWeight: ok}
	return c
}

// Elements returns the table's elements: the chemical elements by atomic
// number, then user elements by symbol.
func (t *ElementTable) Elements() []Element {
	if t == nil {
		t = builtinElementTable
	}
	out := make([]Element, 0, len(t.bySymbol))
	for _, e := range t.bySymbol {
		out = append(out, e)
	}
	sort.Slice(out, func(i, j int) bool {
		a, b := out[i], out[j]
		if (a.Z == 0) != (b.Z == 0) {
			return a.Z != 0
		}
		if a.Z != b.Z {
			return a.Z < b.Z
		}
		return a.Symbol < b.Symbol
	})
	return out
}

// MaxUserSymbolLen is the longest symbol, in letters, a user element may have.
const MaxUserSymbolLen = 3

// IsElementSymbol reports whether s has the form of an element symbol: an
// upper-case ASCII letter followed by at most two lower-case ASCII letters.
func IsElementSymbol(s string) bool {
	if len(s) == 0 || len(s) > MaxUserSymbolLen || !asciiUpper(s[0]) {
		return false
	}
	for i := 1; i < len(s); i++ {
		if !asciiLower(s[i]) {
			return false
		}
	}
	return true
}

func asciiUpper(c byte) bool { return 'A' <= c && c <= 'Z' }
func asciiLower(c byte) bool { return 'a' <= c && c <= 'z' }

// withWeight builds an element with a standard atomic weight; noWeight one
// without.
func withWeight(z int, symbol, name string, weight float64) Element {
	return Element{Symbol: symbol, Name: name, Z: z, Weight: weight, HasWeight: true}
}

func noWeight(z int, symbol, name string) Element {
	return Element{Symbol: symbol, Name: name, Z: z}
}

// periodicTable lists the chemical elements with the IUPAC/CIAAW 2021
// standard atomic weights ("Standard atomic weights of the elements 2021",
// Pure Appl. Chem. 2022; ciaaw.org). For elements whose standard atomic
// weight is an interval the value is the conventional value IUPAC gives for
// it; otherwise it is the standard value without its uncertainty. Elements
// without a standard atomic weight (no stable isotope with a characteristic
// terrestrial composition: Tc, Pm, Po to Ac, and Np onwards) have none.
//
// The weights of H, C, N, O, S, Cl, Ca, Ag, Na and Fe were read from the
// CIAAW 2021 table as quoted in the project's reference data (§4); every
// other weight, and which elements lack one, is (from memory) of the same
// table, and is cross-checked against an independent library in
// formula_periodictable_test.go.
var periodicTable = []Element{
	withWeight(1, "H", "hydrogen", 1.008), // interval [1.00784, 1.00811]
	withWeight(2, "He", "helium", 4.002602),
	withWeight(3, "Li", "lithium", 6.94), // interval [6.938, 6.997]
	withWeight(4, "Be", "beryllium", 9.0121831),
	withWeight(5, "B", "boron", 10.81),     // interval [10.806, 10.821]
	withWeight(6, "C", "carbon", 12.011),   // interval [12.0096, 12.0116]
	withWeight(7, "N", "nitrogen", 14.007), // interval [14.00643, 14.00728]
	withWeight(8, "O", "oxygen", 15.999),   // interval [15.99903, 15.99977]
	withWeight(9, "F", "fluorine", 18.998403162),
	withWeight(10, "Ne", "neon", 20.1797),
	withWeight(11, "Na", "sodium", 22.98976928),
	withWeight(12, "Mg", "magnesium", 24.305), // interval [24.304, 24.307]
	withWeight(13, "Al", "aluminium", 26.9815384),
	withWeight(14, "Si", "silicon", 28.085), // interval [28.084, 28.086]
	withWeight(15, "P", "phosphorus", 30.973761998),
	withWeight(16, "S", "sulfur", 32.06),    // interval [32.059, 32.076]
	withWeight(17, "Cl", "chlorine", 35.45), // interval [35.446, 35.457]
	withWeight(18, "Ar", "argon", 39.95),    // interval [39.792, 39.963]
	withWeight(19, "K", "potassium", 39.0983),
	withWeight(20, "Ca", "calcium", 40.078),
	withWeight(21, "Sc", "scandium", 44.955907),
	withWeight(22, "Ti", "titanium", 47.867),
	withWeight(23, "V", "vanadium", 50.9415),
	withWeight(24, "Cr", "chromium", 51.9961),
	withWeight(25, "Mn", "manganese", 54.938043),
	withWeight(26, "Fe", "iron", 55.845),
	withWeight(27, "Co", "cobalt", 58.933194),
	withWeight(28, "Ni", "nickel", 58.6934),
	withWeight(29, "Cu", "copper", 63.546),
	withWeight(30, "Zn", "zinc", 65.38),
	withWeight(31, "Ga", "gallium", 69.723),
	withWeight(32, "Ge", "germanium", 72.630),
	withWeight(33, "As", "arsenic", 74.921595),
	withWeight(34, "Se", "selenium", 78.971),
	withWeight(35, "Br", "bromine", 79.904), // interval [79.901, 79.907]
	withWeight(36, "Kr", "krypton", 83.798),
	withWeight(37, "Rb", "rubidium", 85.4678),
	withWeight(38, "Sr", "strontium", 87.62),
	withWeight(39, "Y", "yttrium", 88.905838),
	withWeight(40, "Zr", "zirconium", 91.222),
	withWeight(41, "Nb", "niobium", 92.90637),
	withWeight(42, "Mo", "molybdenum", 95.95),
	noWeight(43, "Tc", "technetium"),
	withWeight(44, "Ru", "ruthenium", 101.07),
	withWeight(45, "Rh", "rhodium", 102.90549),
	withWeight(46, "Pd", "palladium", 106.42),
	withWeight(47, "Ag", "silver", 107.8682),
	withWeight(48, "Cd", "cadmium", 112.414),
	withWeight(49, "In", "indium", 114.818),
	withWeight(50, "Sn", "tin", 118.710),
	withWeight(51, "Sb", "antimony", 121.760),
	withWeight(52, "Te", "tellurium", 127.60),
	withWeight(53, "I", "iodine", 126.90447),
	withWeight(54, "Xe", "xenon", 131.293),
	withWeight(55, "Cs", "caesium", 132.90545196),
	withWeight(56, "Ba", "barium", 137.327),
	withWeight(57, "La", "lanthanum", 138.90547),
	withWeight(58, "Ce", "cerium", 140.116),
	withWeight(59, "Pr", "praseodymium", 140.90766),
	withWeight(60, "Nd", "neodymium", 144.242),
	noWeight(61, "Pm", "promethium"),
	withWeight(62, "Sm", "samarium", 150.36),
	withWeight(63, "Eu", "europium", 151.964),
	withWeight(64, "Gd", "gadolinium", 157.249),
	withWeight(65, "Tb", "terbium", 158.925354),
	withWeight(66, "Dy", "dysprosium", 162.500),
	withWeight(67, "Ho", "holmium", 164.930329),
	withWeight(68, "Er", "erbium", 167.259),
	withWeight(69, "Tm", "thulium", 168.934219),
	withWeight(70, "Yb", "ytterbium", 173.045),
	withWeight(71, "Lu", "lutetium", 174.96669),
	withWeight(72, "Hf", "hafnium", 178.486),
	withWeight(73, "Ta", "tantalum", 180.94788),
	withWeight(74, "W", "tungsten", 183.84),
	withWeight(75, "Re", "rhenium", 186.207),
	withWeight(76, "Os", "osmium", 190.23),
	withWeight(77, "Ir", "iridium", 192.217),
	withWeight(78, "Pt", "platinum", 195.084),
	withWeight(79, "Au", "gold", 196.966570),
	withWeight(80, "Hg", "mercury", 200.592),
	withWeight(81, "Tl", "thallium", 204.38), // interval [204.382, 204.385]
	withWeight(82, "Pb", "lead", 207.2),      // interval [206.14, 207.94]
	withWeight(83, "Bi", "bismuth", 208.98040),
	noWeight(84, "Po", "polonium"),
	noWeight(85, "At", "astatine"),
	noWeight(86, "Rn", "radon"),
	noWeight(87, "Fr", "francium"),
	noWeight(88, "Ra", "radium"),
	noWeight(89, "Ac", "actinium"),
	withWeight(90, "Th", "thorium", 232.0377),
	withWeight(91, "Pa", "protactinium", 231.03588),
	withWeight(92, "U", "uranium", 238.02891),
	noWeight(93, "Np", "neptunium"),
	noWeight(94, "Pu", "plutonium"),
	noWeight(95, "Am", "americium"),
	noWeight(96, "Cm", "curium"),
	noWeight(97, "Bk", "berkelium"),
	noWeight(98, "Cf", "californium"),
	noWeight(99, "Es", "einsteinium"),
	noWeight(100, "Fm", "fermium"),
	noWeight(101, "Md", "mendelevium"),
	noWeight(102, "No", "nobelium"),
	noWeight(103, "Lr", "lawrencium"),
	noWeight(104, "Rf", "rutherfordium"),
	noWeight(105, "Db", "dubnium"),
	noWeight(106, "Sg", "seaborgium"),
	noWeight(107, "Bh", "bohrium"),
	noWeight(108, "Hs", "hassium"),
	noWeight(109, "Mt", "meitnerium"),
	noWeight(110, "Ds", "darmstadtium"),
	noWeight(111, "Rg", "roentgenium"),
	noWeight(112, "Cn", "copernicium"),
	noWeight(113, "Nh", "nihonium"),
	noWeight(114, "Fl", "flerovium"),
	noWeight(115, "Mc", "moscovium"),
	noWeight(116, "Lv", "livermorium"),
	noWeight(117, "Ts", "tennessine"),
	noWeight(118, "Og", "oganesson"),
}
