package aqueous

// BDotSource names the Ḃ tabulation used by BDotAt.
const BDotSource = "Helgeson (1969) Ḃ for NaCl-dominated solutions"

// bdotTable is Helgeson's Ḃ (kg/mol) for NaCl-dominated solutions at
// saturation pressure: H. C. Helgeson, Am. J. Sci. 267 (1969) 729, the
// tabulated Ḃ(T), as commonly reproduced at these temperatures (from memory):
// 0 °C 0.0374, 25 °C 0.0410, 60 °C 0.0438, 100 °C 0.0460. Only 0–100 °C is
// kept, the range of the permittivity correlation.
var bdotTable = [...]struct{ t, b float64 }{
	{0, 0.0374},
	{25, 0.0410},
	{60, 0.0438},
	{100, 0.0460},
}

// BDotAt returns Helgeson's Ḃ in kg/mol at T (K), interpolated linearly in T
// between the tabulated temperatures (0, 25, 60, 100 °C); outside 0–100 °C a
// *RangeError.
func BDotAt(T float64) (float64, error) {
	lo, hi := bdotTable[0].t+zeroCelsius, bdotTable[len(bdotTable)-1].t+zeroCelsius
	if !inRange(T, lo, hi) {
		return 0, &RangeError{Quantity: "temperature", Value: T, Min: lo, Max: hi, Unit: "K", Of: BDotSource}
	}
	t := T - zeroCelsius
	for i := 1; i < len(bdotTable); i++ {
		a, b := bdotTable[i-1], bdotTable[i]
		if t <= b.t {
			return a.b + (b.b-a.b)*(t-a.t)/(b.t-a.t), nil
		}
	}
	return bdotTable[len(bdotTable)-1].b, nil
}
