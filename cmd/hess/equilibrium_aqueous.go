package main

import (
	"errors"
	"fmt"

	"hess/aqueous"
	"hess/equilibrium"
	"hess/lang"
	"hess/network"
)

// aqueousRun is one aqueous feed brought to equilibrium: a solution with
// the network's activity model, its pH, ionic strength and minerals.
type aqueousRun struct {
	Mixture *network.Mixture
	*equilibrium.AqueousResult
}

// equilibrateAqueous solves one aqueous feed at T (0: the mixture's) and
// P (0: the mixture's). A feed that cannot be set up gives an error
// diagnostic on the mixture; a result beyond its activity model's range of
// validity comes with the activity-range warning, naming I and the model.
func equilibrateAqueous(net *network.Network, m *network.Mixture, req equilibriumRequest, T float64) (*aqueousRun, lang.Diagnostics) {
	errAt := func(code lang.Code, format string, args ...any) lang.Diagnostics {
		return lang.Diagnostics{{Code: code, Severity: lang.Error, Subject: m.NameSpan, Message: fmt.Sprintf(format, args...)}}
	}
	if req.adiabatic {
		return nil, errAt("mixture-amount", "mixture %s is an aqueous feed, solved at a given temperature: --adiabatic does not apply to it", m.Name)
	}
	sys, err := equilibrium.AqueousFromMixture(net, m)
	if err != nil {
		if errors.Is(err, equilibrium.ErrNoSolvent) {
			return nil, errAt("missing-solvent", "%v", err)
		}
		return nil, errAt("mixture-amount", "%v", err)
	}
	if T > 0 {
		sys.T = T
	}
	if req.pressure > 0 {
		sys.P = req.pressure
	}
	r, err := equilibrium.SolveAqueous(net, sys)
	if err != nil {
		return nil, errAt("mixture-amount", "mixture %s: %v", m.Name, err)
	}
	run := &aqueousRun{Mixture: m, AqueousResult: r}
	var warn lang.Diagnostics
	if r.Beyond {
		if rerr := aqueous.CheckIonicStrength(net.ActivityModel(), r.I); rerr != nil {
			warn = append(warn, lang.Diagnostic{Code: "activity-range", Severity: lang.Warning, Subject: m.NameSpan,
				Message: fmt.Sprintf("mixture %s at equilibrium at %s: %v; its activities may be far off", m.Name, kelvinText(r.T), rerr)})
		}
	}
	return run, warn
}
