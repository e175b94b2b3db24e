package network

import (
	"context"
	"fmt"

	"hess/lang"
)

// Pass is what a check's Run sees: the compiled network and a way to report.
type Pass struct {
	Net   *Network
	check *Check
	// out, when set, collects the findings instead of Net.Diagnostics, so
	// that checks can run side by side.
	out *lang.Diagnostics
	// species, when set, holds the last run's species-local findings
	// (eachSpecies).
	species *speciesChecks
}

// Report records a finding of the running check. Its code is the check's
// name; its severity is set from the check and the network's lint settings.
func (p *Pass) Report(d lang.Diagnostic) {
	d.Code = p.check.Code()
	if p.out != nil {
		*p.out = append(*p.out, d)
		return
	}
	p.Net.Diagnostics = append(p.Net.Diagnostics, d)
}

// Reportf records a finding at span with a formatted message.
func (p *Pass) Reportf(span lang.Span, format string, args ...any) {
	p.Report(lang.Diagnostic{Subject: span, Message: fmt.Sprintf(format, args...)})
}

// checks is the ordered registry. Adding a check is one file and one line here.
var checks = []*Check{
	syntaxCheck,
	includeMissingCheck,
	includeRefusedCheck,
	includeCycleCheck,
	misplacedSettingsCheck,
	unknownElementCheck,
	badFormulaCheck,
	unknownPhaseCheck,
	duplicateSpeciesCheck,
	duplicateReactionNameCheck,
	undefinedSpeciesCheck,
	undefinedReactionCheck,
	missingUnitCheck,
	unitMismatchCheck,
	elementImbalanceCheck,
	chargeImbalanceCheck,
	combinationMismatchCheck,
	cycleInconsistentCheck,
	determinedSpeciesCheck,
	dataConflictCheck,
	formationInconsistentCheck,
	rangeGapCheck,
	rangeOverlapCheck,
	rangeDiscontinuityCheck,
	polynomialMismatchCheck,
	extrapolationCheck,
	missingThermoCheck,
	implausibleValueCheck,
	duplicateReactionCheck,
	unusedSpeciesCheck,
	rateUnitsCheck,
	reverseOnOneWayCheck,
	detailedBalanceCheck,
	mixtureAmountCheck,
	mixtureIncompleteCheck,
	mixtureFractionsCheck,
	notInMixtureCheck,
	emptyReactionCheck,
	partialCpCheck,
	untaggedSpeciesCheck,
	mixtureRescaledCheck,
	unstatedPressureCheck,
	unknownActivityModelCheck,
	activityRangeCheck,
	missingSolventCheck,
	fixedNotGasCheck,
	missingIonSizeCheck,
}

var checkByName = func() map[string]*Check {
	m := make(map[string]*Check, len(checks))
	for _, c := range checks {
		m[c.Name] = c
	}
	return m
}()

// byCode finds the check of a diagnostic code, or nil.
func byCode(code lang.Code) *Check { return checkByName[string(code)] }

// Checks returns every registered check, in registry order.
func Checks() []*Check { return append([]*Check(nil), checks...) }

// LookupCheck finds a check by name (its diagnostic code), or returns nil.
func LookupCheck(name string) *Check { return checkByName[name] }

// runChecks runs every enabled check on the compiled network. Checks only
// read the network, so they run side by side on the available processors,
// each into its own buffer; the findings are appended in registry order, so
// the result does not depend on scheduling. Once ctx is done no further
// check starts, and runChecks returns ctx's error. With a memo, the
// species-local parts of checks take what they found last time for the
// species that did not change (check_reuse.go).
func runChecks(ctx context.Context, n *Network, memo *compileMemo) error {
	sc := startSpeciesChecks(n, memo)
	found, err := runSome(ctx, n, false, sc)
	if err != nil {
		return err
	}
	n.Diagnostics = append(n.Diagnostics, found...)
	sc.finish(n, memo)
	return nil
}

// runSome runs the enabled checks whose ApproachOnly is approachOnly and
// returns their findings, or ctx's error once it is done.
func runSome(ctx context.Context, n *Network, approachOnly bool, sc *speciesChecks) (lang.Diagnostics, error) {
	var run []*Check
	for _, c := range checks {
		if c.Run == nil || c.ApproachOnly != approachOnly {
			continue
		}
		if sev, ok := n.Settings.Lint[c.Name]; ok && sev == lang.Off {
			continue
		}
		run = append(run, c)
	}
	found := make([]lang.Diagnostics, len(run))
	parallel(len(run), 1, func() func(i int) {
		return func(i int) {
			if ctx.Err() == nil {
				run[i].Run(&Pass{Net: n, check: run[i], out: &found[i], species: sc})
			}
		}
	})
	if err := ctx.Err(); err != nil {
		return nil, err
	}
	var out lang.Diagnostics
	for _, ds := range found {
		out = append(out, ds...)
	}
	return out, nil
}

// ApproachNotes runs the checks that matter only to hess approach (see
// Check.ApproachOnly) on the compiled network and returns their findings,
// with severities from the lint settings, sorted. A network with errors
// gives none.
func (n *Network) ApproachNotes() lang.Diagnostics {
	if n.Diagnostics.HasErrors() {
		return nil
	}
	found, _ := runSome(context.Background(), n, true, nil)
	notes := &Network{Settings: n.Settings, Diagnostics: found}
	finalize(notes)
	return notes.Diagnostics
}

// finalize sets every diagnostic's severity from its check and the lint
// settings, drops those turned off, and sorts the rest.
func finalize(n *Network) {
	out := n.Diagnostics[:0]
	for _, d := range n.Diagnostics {
		c := byCode(d.Code)
		if d.Severity == lang.SeverityInvalid {
			if c != nil {
				d.Severity = c.Severity
			} else {
				d.Severity = lang.Error
			}
		}
		if sev, ok := n.Settings.Lint[string(d.Code)]; ok && d.Severity != lang.Info {
			d.Severity = sev
		}
		if d.Severity == lang.Off {
			continue
		}
		out = append(out, d)
	}
	n.Diagnostics = out
	n.Diagnostics.Sort()
}
