package thermo

// Exact constants of the SI (2019 redefinition, CODATA 2018 values).
const (
	// NA is the Avogadro constant in 1/mol.
	NA = 6.02214076e23
	// KB is the Boltzmann constant in J/K.
	KB = 1.380649e-23
	// ElementaryCharge is the elementary charge in C.
	ElementaryCharge = 1.602176634e-19
	// R is the molar gas constant NA·KB in J/(mol·K).
	R = 8.31446261815324
	// F is the Faraday constant NA·e in C/mol.
	F = NA * ElementaryCharge
)

// Conventional reference values, exact by definition.
const (
	// Atm is one standard atmosphere in Pa.
	Atm = 101325.0
	// Bar is one bar in Pa, the default standard-state pressure.
	Bar = 1e5
	// Torr is 1/760 of a standard atmosphere in Pa.
	Torr = Atm / 760
	// CalTh is the thermochemical calorie in J.
	CalTh = 4.184
	// T298 is the standard reference temperature 298.15 K.
	T298 = 298.15
	// ZeroCelsius is 0 °C in K.
	ZeroCelsius = 273.15
	// CStd is the standard concentration 1 mol/L in mol/m³.
	CStd = 1000.0
	// MStd is the standard molality 1 mol/kg.
	MStd = 1.0
)
