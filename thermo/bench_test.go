package thermo

import "testing"

var benchTemps = []float64{500, 600, 700, 800, 900, 1000, 1100, 1200, 1300, 1400}

var benchSink float64

// BenchmarkShomateLog10K evaluates log10 K of the water-gas shift from WebBook
// Shomate models at ten temperatures.
func BenchmarkShomateLog10K(b *testing.B) {
	r := wgs(b)
	for b.Loop() {
		for _, T := range benchTemps {
			benchSink += r.Log10K(T)
		}
	}
}

// BenchmarkNASA7Log10K evaluates log10 K of 2 H2 + O2 ⇌ 2 H2O from NASA 7-term
// models at ten temperatures.
func BenchmarkNASA7Log10K(b *testing.B) {
	r := Reaction{Terms: []Term{
		gas(-2, nasa7Model(b, "H2")), gas(-1, nasa7Model(b, "O2")), gas(2, nasa7Model(b, "H2O")),
	}}
	for b.Loop() {
		for _, T := range benchTemps {
			benchSink += r.Log10K(T)
		}
	}
}

// BenchmarkCrossovers scans the water-gas shift for sign changes of ΔrG° over
// 500–1500 K.
func BenchmarkCrossovers(b *testing.B) {
	r := wgs(b)
	for b.Loop() {
		benchSink += float64(len(Crossovers(r.DeltaG, 500, 1500)))
	}
}

// BenchmarkParseUnit parses a compound rate-prefactor unit.
func BenchmarkParseUnit(b *testing.B) {
	for b.Loop() {
		u, err := ParseUnit("cm^6/(mol^2*s)")
		if err != nil {
			b.Fatal(err)
		}
		benchSink += u.Scale
	}
}
