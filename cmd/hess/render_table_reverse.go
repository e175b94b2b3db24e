package main

import (
	"fmt"
	"strconv"

	"hess/network"
)

// reverseRates fits the reverse rate of every two-way step among rxs that
// has a forward rate and no reverse rate, where K(T) is known at enough of
// the temperatures; steps that cannot be fitted are left out.
func reverseRates(net *network.Network, rxs []*network.Reaction, temps []float64) map[*network.Reaction]*network.ReverseRate {
	out := map[*network.Reaction]*network.ReverseRate{}
	for _, rx := range rxs {
		if !rx.TwoWay || rx.Rate == nil || rx.Reverse != nil {
			continue
		}
		if rr, err := net.FitReverseRate(rx, temps); err == nil {
			out[rx] = rr
		}
	}
	return out
}

// jsonReverseRate is the fitted reverse rate k = A·T^n·exp(−Ea/RT) of a
// table's reaction, A in A_unit.
type jsonReverseRate struct {
	A           jsonNumber `json:"A"`
	AUnit       string     `json:"A_unit"`
	N           jsonNumber `json:"n"`
	Ea          jsonNumber `json:"Ea_kJ_mol"`
	MaxRelError jsonNumber `json:"maxRelError"`
}

func jsonReverse(rr *network.ReverseRate) *jsonReverseRate {
	if rr == nil {
		return nil
	}
	return &jsonReverseRate{A: jsonNumber(rr.A), AUnit: rr.AUnit, N: jsonNumber(rr.Fit.N),
		Ea: jsonNumber(rr.Fit.Ea / 1000), MaxRelError: jsonNumber(rr.Fit.MaxRelErr)}
}

// reverseRateLine describes a fitted reverse rate under a reaction's
// heading in the text table, with the JSON fields' names.
func reverseRateLine(rr *network.ReverseRate) string {
	return fmt.Sprintf("reverse rate fitted to kf/Kc from %s to %s: A = %s %s, n = %s, Ea = %s kJ/mol, maxRelError = %s",
		kelvinText(rr.Tmin), kelvinText(rr.Tmax), strconv.FormatFloat(rr.A, 'e', 4, 64), rr.AUnit,
		fixed(rr.Fit.N, 4), fixed(rr.Fit.Ea/1000, 3),
		strconv.FormatFloat(rr.Fit.MaxRelErr, 'e', 2, 64))
}
