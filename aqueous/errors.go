package aqueous

import "fmt"

// RangeError reports a value outside the range a correlation or an activity
// model was published for. Quantity names what was out of range ("temperature",
// "ionic strength"), Of names the correlation or model.
type RangeError struct {
	Quantity string  // "temperature" or "ionic strength"
	Value    float64 // the value asked for
	Min, Max float64 // the published range, inclusive
	Unit     string  // unit of Value, Min and Max
	Of       string  // the correlation or model whose range it is
}

func (e *RangeError) Error() string {
	if e.Min == 0 {
		return fmt.Sprintf("%s %.4g %s is beyond the range of %s (up to %.4g %s)",
			e.Quantity, e.Value, e.Unit, e.Of, e.Max, e.Unit)
	}
	return fmt.Sprintf("%s %.6g %s is outside the range of %s (%.6g–%.6g %s)",
		e.Quantity, e.Value, e.Unit, e.Of, e.Min, e.Max, e.Unit)
}

// inRange reports whether lo ≤ x ≤ hi; NaN is never in range.
func inRange(x, lo, hi float64) bool { return x >= lo && x <= hi }
