package thermo

import (
	"fmt"
	"math"
	"strconv"
)

// Quantity is a measured value with its standard uncertainty (Sigma, zero when
// none was given), both in Unit.
type Quantity struct {
	Value, Sigma float64
	Unit         Unit
}

// SI returns the value and its standard uncertainty in SI units. An offset unit
// (°C) shifts the value but scales the uncertainty only.
func (q Quantity) SI() (v, sigma float64) {
	return q.Unit.ToSI(q.Value), q.Sigma * math.Abs(q.Unit.Scale)
}

// In expresses the quantity in another unit of the same dimension.
func (q Quantity) In(u Unit) (Quantity, error) {
	if q.Unit.Dim != u.Dim {
		return Quantity{}, fmt.Errorf("cannot convert %s (%s) to %s (%s)",
			q.Unit.Text, DimName(q.Unit.Dim), u.Text, DimName(u.Dim))
	}
	v, s := q.SI()
	return Quantity{Value: u.FromSI(v), Sigma: s / math.Abs(u.Scale), Unit: u}, nil
}

// String formats the quantity as "value unit" or "value ± sigma unit".
func (q Quantity) String() string {
	v := strconv.FormatFloat(q.Value, 'g', -1, 64)
	if q.Sigma != 0 {
		v += " ± " + strconv.FormatFloat(q.Sigma, 'g', -1, 64)
	}
	if q.Unit.Text != "" {
		v += " " + q.Unit.Text
	}
	return v
}
