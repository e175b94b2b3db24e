package main

import (
	"fmt"
	"strconv"

	"hess/network"
)

// reverseRate fits the reverse rate of rx where it is a two-way step that
// has a forward rate and no reverse rate, and K(T) is known at enough of
// the temperatures; otherwise it is nil.
func reverseRate(net *network.Network, rx *network.Reaction, temps []float64) *network.ReverseRate {
	if !rx.TwoWay || rx.Rate == nil || rx.Reverse != nil {
		return nil
	}
	rr, err := net.FitReverseRate(rx, temps)
	if err != nil {
		return nil
	}
	return rr
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
