package network

import "hess/lang"

// Checks whose findings arise while loading, parsing and resolving names.
// They have no Run of their own.

var syntaxCheck = &Check{
	Name:     "syntax",
	Severity: lang.Error,
	Doc: `the file does not follow the language
A statement could not be read: the message names what was expected and what
was found there. Reading resumes at the next statement keyword (include,
settings, element, phase, species, reaction, mixture), so later statements
are still checked. Structural rules that the grammar alone cannot express
are reported here too: a property given twice, the wrong number of
polynomial coefficients, a malformed name, a number out of range.`,
}

var includeMissingCheck = &Check{
	Name:     "include-missing",
	Severity: lang.Error,
	Doc: `an included file cannot be read
An include names a file that does not exist or cannot be read. Paths are
relative to the folder of the including file. The message names the chain
of includes that led to it.`,
}

var includeRefusedCheck = &Check{
	Name:     "include-refused",
	Severity: lang.Error,
	Doc: `an include is refused
An include is read only when it names a regular file, inside the root
file's folder tree or a folder named with --include-path (symbolic links
followed), of at most 64 MiB, and within the limits of one network: 10 000
files, 256 MiB in all, includes nested at most 4 096 deep. An empty path, a
named pipe, a device, a folder, a file outside those folders or past a
limit is refused with the reason, and never opened for reading.`,
}

var includeCycleCheck = &Check{
	Name:     "include-cycle",
	Severity: lang.Error,
	Doc: `includes form a cycle
A file includes itself, directly or through other files. The message gives
the chain, ending at the file that closes the loop. Each file is read once,
so including the same library from several files is fine; only a loop is
an error.`,
}

var misplacedSettingsCheck = &Check{
	Name:     "misplaced-settings",
	Severity: lang.Error,
	Doc: `settings outside the root file, or twice
A network has at most one settings block, in its root file: settings decide
how the whole network is evaluated, so a library file included by several
networks must not carry its own. A second block, or one in an included file,
is ignored and reported.`,
}

var unknownElementCheck = &Check{
	Name:     "unknown-element",
	Severity: lang.Error,
	Doc: `a formula uses an unknown element symbol
Element symbols come from the built-in periodic table (IUPAC standard atomic
weights) or from element statements of the network, such as
element D { mass 2.0141 g/mol }. Symbols are case-sensitive: Co is cobalt,
CO is carbon and oxygen.`,
}

var badFormulaCheck = &Check{
	Name:     "bad-formula",
	Severity: lang.Error,
	Doc: `a formula or species reference does not parse
A formula is element symbols with counts, groups in ( ) or [ ] with a
multiplier, and adducts joined by * or · with a leading multiplier
(CuSO4*5H2O). A charge follows the formula (+, -, ^2+, ^3-), and a state
tag ends the reference ((g), (aq)). A species whose name is not a formula
declares its formula explicitly: species iC3H7(g) { formula C3H7 }.`,
}

var unknownPhaseCheck = &Check{
	Name:     "unknown-phase",
	Severity: lang.Error,
	Doc: `a state tag is neither built in nor declared
The state tag decides how a species enters an equilibrium constant. The
built-in tags are g (ideal gas), l, s and cr (pure condensed phases) and aq
(dilute solute); others are declared with phase NAME { convention
ideal-gas | pure | solute | solution }.`,
}

var duplicateSpeciesCheck = &Check{
	Name:     "duplicate-species",
	Severity: lang.Error,
	Doc: `a species is declared twice
Two species are the same when their name, charge and state tag are all
equal, however the charge is spelled (SO4-- and SO4^2- are one species).
H2O(l) and H2O(g) are different species, each with its own data.`,
}

var duplicateReactionNameCheck = &Check{
	Name:     "duplicate-reaction-name",
	Severity: lang.Error,
	Doc: `a reaction name is used twice
Reaction names are unique in the network, so that combinations, tables and
diagnostics can refer to one reaction unambiguously.`,
}

var undefinedSpeciesCheck = &Check{
	Name:     "undefined-species",
	Severity: lang.Error,
	Doc: `a reaction or mixture names an undeclared species
Every species of a reaction must be declared by a species statement in the
network or a file it includes. The state tag is part of the name: a reaction
that uses H2O(g) needs H2O(g) declared, not H2O(l). Where a species of the
same formula is declared with another tag, the message lists it.`,
}

var undefinedReactionCheck = &Check{
	Name:     "undefined-reaction",
	Severity: lang.Error,
	Doc: `a combination names an undefined reaction
A coupled reaction's combination (= reform + 2 shift) may only name
reactions defined in the network, and not itself.`,
}

var missingUnitCheck = &Check{
	Name:     "missing-unit",
	Severity: lang.Error,
	Doc: `a quantity has no unit
Every quantity carries its unit: hf -74.87 kJ/mol, s 186.25 J/mol/K,
pressure 1 bar. A bare number is never guessed at, since kJ and kcal, or K
and degC, differ by far more than any tolerance.`,
}

var unitMismatchCheck = &Check{
	Name:     "unit-mismatch",
	Severity: lang.Error,
	Doc: `a quantity's unit is unknown or of the wrong dimension
The unit must be one the language knows (J/mol, kJ/mol, cal/mol, kcal/mol;
J/mol/K, cal/mol/K; K, degC; Pa, kPa, MPa, bar, atm, Torr; g/mol, kg/mol;
rate units such as 1/s and cm3/mol/s) and of the dimension the property
needs: hf, gf, dg, dh and tolerance take energy per mole, s, cp and ds take
entropy, temperatures take K or degC.`,
}
