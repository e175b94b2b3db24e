package aqueous

// Properties of liquid water at 1 atm from published correlations. Each
// function returns a *RangeError outside its correlation's range instead of
// extrapolating.

const zeroCelsius = 273.15 // K

// Ranges of the correlations, in K.
const (
	// PermittivityTMin and PermittivityTMax bound Malmberg & Maryott's fit (0–100 °C).
	PermittivityTMin = zeroCelsius
	PermittivityTMax = zeroCelsius + 100
	// DensityTMin and DensityTMax bound Kell's fit (0–150 °C at 1 atm).
	DensityTMin = zeroCelsius
	DensityTMax = zeroCelsius + 150
)

// Correlation names, used in range errors and documentation.
const (
	PermittivityCorrelation = "Malmberg & Maryott (1956) permittivity of water"
	DensityCorrelation      = "Kell (1975) density of water"
)

// Permittivity returns the relative permittivity (dielectric constant) of
// liquid water at T (K) and 1 atm from Malmberg & Maryott, J. Res. Natl. Bur.
// Stand. 56 (1956) 1, their fitted equation (maximum deviation 0.01 from
// their measurements):
//
//	ε = 87.740 − 0.40008 t + 9.398e−4 t² − 1.410e−6 t³,  t in °C, 0–100 °C.
//
// It gives 78.30 at 25 °C, about 0.1 below the modern IAPWS value (78.41,
// from memory).
func Permittivity(T float64) (float64, error) {
	if !inRange(T, PermittivityTMin, PermittivityTMax) {
		return 0, &RangeError{Quantity: "temperature", Value: T, Min: PermittivityTMin,
			Max: PermittivityTMax, Unit: "K", Of: PermittivityCorrelation}
	}
	t := T - zeroCelsius
	return 87.740 + t*(-0.40008+t*(9.398e-4+t*-1.410e-6)), nil
}

// Density returns the density of air-free liquid water at T (K) and 1 atm in
// kg/m³ from Kell, J. Chem. Eng. Data 20 (1975) 97, his rational fit at 1 atm
// (t in °C on IPTS-68, 0–150 °C; coefficients from memory):
//
//	ρ = (999.83952 + 16.945176 t − 7.9870401e−3 t² − 46.170461e−6 t³
//	     + 105.56302e−9 t⁴ − 280.54253e−12 t⁵) / (1 + 16.879850e−3 t).
//
// The difference between IPTS-68 and ITS-90 (below 0.01 K here) is ignored.
func Density(T float64) (float64, error) {
	if !inRange(T, DensityTMin, DensityTMax) {
		return 0, &RangeError{Quantity: "temperature", Value: T, Min: DensityTMin,
			Max: DensityTMax, Unit: "K", Of: DensityCorrelation}
	}
	t := T - zeroCelsius
	num := 999.83952 + t*(16.945176+t*(-7.9870401e-3+t*(-46.170461e-6+t*(105.56302e-9+t*-280.54253e-12))))
	return num / (1 + 16.879850e-3*t), nil
}
