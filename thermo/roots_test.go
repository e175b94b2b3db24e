package thermo

import (
	"errors"
	"math"
	"testing"
)

func TestBrent(t *testing.T) {
	tests := []struct {
		name string
		f    func(float64) float64
		a, b float64
		want float64
	}{
		{"x² − 2", func(x float64) float64 { return x*x - 2 }, 0, 2, math.Sqrt2},
		{"cos", math.Cos, 1, 2, math.Pi / 2},
		{"steep exp", func(x float64) float64 { return math.Exp(x) - 1e6 }, 0, 50, math.Log(1e6)},
		{"zero at a", func(x float64) float64 { return x - 3 }, 3, 5, 3},
		{"zero at b", func(x float64) float64 { return x - 5 }, 3, 5, 5},
		{"reversed bracket", func(x float64) float64 { return x - 4 }, 5, 3, 4},
	}
	for _, tc := range tests {
		got, err := Brent(tc.f, tc.a, tc.b, 1e-12)
		if err != nil || math.Abs(got-tc.want) > 1e-10 {
			t.Errorf("%s: Brent = %.15g, %v; want %.15g", tc.name, got, err, tc.want)
		}
	}
	if _, err := Brent(func(x float64) float64 { return x*x + 1 }, -1, 1, 1e-9); !errors.Is(err, ErrNotBracketed) {
		t.Errorf("unbracketed: error %v, want ErrNotBracketed", err)
	}
	if _, err := Brent(func(float64) float64 { return math.NaN() }, -1, 1, 1e-9); err == nil {
		t.Error("NaN function: no error")
	}
}

func TestCrossovers(t *testing.T) {
	type want struct {
		T     float64
		above bool
	}
	tests := []struct {
		name   string
		f      func(float64) float64
		lo, hi float64
		want   []want
	}{
		{"linear, zero on the grid", func(T float64) float64 { return 500 - T }, 300, 700, []want{{500, true}}},
		{"linear, off the grid", func(T float64) float64 { return T - 512.3456 }, 300, 700, []want{{512.3456, false}}},
		{"sine", func(T float64) float64 { return math.Sin(T / 50) }, 10, 1000, []want{
			{50 * math.Pi, true}, {100 * math.Pi, false}, {150 * math.Pi, true},
			{200 * math.Pi, false}, {250 * math.Pi, true}, {300 * math.Pi, false},
		}},
		{"touching zero", func(T float64) float64 { return (T - 500) * (T - 500) }, 300, 700, nil},
		{"zero run between signs", func(T float64) float64 {
			switch {
			case T < 400:
				return T - 400
			case T > 600:
				return T - 600
			}
			return 0
		}, 300, 700, []want{{500, false}}},
		{"zero run, same sign", func(T float64) float64 { return math.Max(0, math.Abs(T-500)-50) }, 300, 700, nil},
		{"zero at the ends only", func(T float64) float64 { return (T - 300) * (700 - T) }, 300, 700, nil},
		{"NaN below 400 K", func(T float64) float64 {
			if T < 400 {
				return math.NaN()
			}
			return T - 450
		}, 300, 700, []want{{450, false}}},
		{"NaN across the change", func(T float64) float64 {
			if math.Abs(T-500) < 0.6 {
				return math.NaN()
			}
			return T - 500
		}, 300, 700, nil},
		{"short range", func(T float64) float64 { return T - 300.25 }, 300, 301, []want{{300.25, false}}},
		{"roots 3 K apart", func(T float64) float64 { return 1e6 * (T - 500.5) * (T - 503.5) }, 300, 700, []want{{500.5, true}, {503.5, false}}},
		{"roots 1 K apart", func(T float64) float64 { return (T-600)*(T-600) - 0.25 }, 300, 700, []want{{599.5, true}, {600.5, false}}},
		{"cubic far from its roots", func(T float64) float64 { return (T - 310.2) * (T - 690.7) * (T + 1000) }, 300, 700, []want{{310.2, true}, {690.7, false}}},
		{"empty range", func(T float64) float64 { return T - 500 }, 700, 300, nil},
		// Wide ranges, where the long stretches are passed over.
		{"wide, roots 40 K apart", func(T float64) float64 { return (T - 2000) * (T - 2040) }, 200, 6000, []want{{2000, true}, {2040, false}}},
		{"wide, roots 3 K apart", func(T float64) float64 { return 1e6 * (T - 3000.5) * (T - 3003.5) }, 200, 6000, []want{{3000.5, true}, {3003.5, false}}},
		{"wide, gentle", func(T float64) float64 { return 9e4 - 80*T + 2e-3*T*T }, 200, 6000, []want{{1158.556, true}}},
	}
	for _, tc := range tests {
		got := Crossovers(tc.f, tc.lo, tc.hi)
		if len(got) != len(tc.want) {
			t.Errorf("%s: %d crossovers %+v, want %d", tc.name, len(got), got, len(tc.want))
			continue
		}
		for i, w := range tc.want {
			if math.Abs(got[i].T-w.T) > 0.01 || got[i].FavoredAbove != w.above {
				t.Errorf("%s: crossover %d = %+v, want %.4f K favoredAbove %v", tc.name, i, got[i], w.T, w.above)
			}
		}
	}
}
