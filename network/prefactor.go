package network

import (
	"hess/lang"
	"hess/thermo"
)

// maxOrder is the highest reaction order whose rate prefactor unit is read.
const maxOrder = 4

// prefactor converts an Arrhenius prefactor. Its unit must be that of some
// reaction order (1/s, cm3/mol/s, cm6/mol2/s, …); whether the order fits
// the reaction is the rate-units check's concern.
func (c *compiler) prefactor(q *lang.Quantity) (*Value, bool) {
	if q == nil || q.Value == nil {
		return nil, false
	}
	v, ok := c.number(q.Value)
	if !ok {
		return nil, false
	}
	if q.Unit == nil {
		c.report(missingUnitCheck, q.Value.Span(), "A needs a rate unit, such as 1/s or cm3/mol/s")
		return nil, false
	}
	u, err := c.parseUnit(q.Unit.Text)
	if err != nil {
		c.report(unitMismatchCheck, q.Unit.Span(), "A takes a rate unit (such as 1/s or cm3/mol/s): %s", unitErrorMessage(err, prefactorDims()...))
		return nil, false
	}
	for order := 0; order <= maxOrder; order++ {
		if u.Dim == thermo.RatePrefactorDim(order) {
			out := &Value{V: u.ToSI(v), Span: q.Span()}
			if q.Sigma != nil {
				if s, ok := c.number(q.Sigma); ok {
					out.Sigma = s * u.Scale
				}
			}
			if out.V <= 0 {
				c.report(implausibleValueCheck, q.Span(), "a rate prefactor must be positive, found %s", q.Value.Text)
				return nil, false
			}
			return out, true
		}
	}
	c.report(unitMismatchCheck, q.Unit.Span(), "A takes a rate unit (volume/mol)^(order-1)/s, such as 1/s or cm3/mol/s, found %s (%s)", q.Unit.Text, thermo.DimName(u.Dim))
	return nil, false
}

// prefactorDims lists the dimensions of the rate prefactors of every order.
func prefactorDims() []thermo.Dim {
	out := make([]thermo.Dim, 0, maxOrder+1)
	for o := 0; o <= maxOrder; o++ {
		out = append(out, thermo.RatePrefactorDim(o))
	}
	return out
}
