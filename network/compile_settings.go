package network

import (
	"errors"
	"math"
	"strconv"
	"strings"

	"hess/chem"
	"hess/lang"
	"hess/suggest"
)

func (c *compiler) element(e *lang.Element) {
	if e.Symbol == nil {
		return
	}
	sym := e.Symbol.Name
	if !chem.IsElementSymbol(sym) {
		c.report(syntaxCheck, e.Symbol.Span(), "element symbol %q must be an upper-case letter followed by up to two lower-case letters", sym)
		return
	}
	if _, ok := c.net.Elements.Lookup(sym); ok {
		c.report(syntaxCheck, e.Symbol.Span(), "element %s is already defined", sym)
		return
	}
	if e.Mass == nil {
		c.report(syntaxCheck, e.Symbol.Span(), "element %s needs a mass, such as `mass 2.014 g/mol`", sym)
		return
	}
	v, ok := c.quantity(e.Mass, molarMassKind, "mass", false)
	if !ok {
		return
	}
	if v.V <= 0 {
		c.report(implausibleValueCheck, e.Mass.Span(), "element %s has mass %s; a molar mass must be positive", sym, e.Mass.Value.Text)
		return
	}
	c.net.Elements = c.net.Elements.With(sym, v.V*1000) // g/mol
}

var conventionNames = map[string]Convention{
	"ideal-gas": IdealGas, "pure": Pure, "solute": Solute, "solution": SolutionMember,
}

func (c *compiler) phase(p *lang.Phase) {
	if !c.name(p.Name, "phase") {
		return
	}
	tag := p.Name.Name
	if strings.ToLower(tag) != tag {
		c.report(syntaxCheck, p.Name.Span(), "phase name %q must be lower case, as state tags are", tag)
		return
	}
	if old, ok := c.net.Phases[tag]; ok {
		if old.Builtin {
			c.report(syntaxCheck, p.Name.Span(), "phase %s is built in and cannot be redeclared", tag)
		} else {
			d := c.report(syntaxCheck, p.Name.Span(), "phase %s is declared twice", tag)
			d.Related = []lang.Related{{Span: old.Span, Message: "first declared here"}}
		}
		return
	}
	if p.Convention == nil {
		c.report(syntaxCheck, p.Name.Span(), "phase %s needs a convention: ideal-gas, pure, solute or solution", tag)
		return
	}
	conv, ok := conventionNames[p.Convention.Name]
	if !ok {
		c.report(syntaxCheck, p.Convention.Span(), "unknown convention %q: use ideal-gas, pure, solute or solution", p.Convention.Name)
		return
	}
	c.net.Phases[tag] = &Phase{Tag: tag, Convention: conv, Span: p.Name.Span()}
}

// maxTemperatures bounds the size of a temperature list.
const maxTemperatures = 10000

// maxTemperature is the highest temperature a list may name: far above any
// gas-phase chemistry, low enough that every formula of T stays finite.
const maxTemperature = 1e6

// minTemperature is the lowest temperature a list may name (1 mK): below
// it the numbers printed would read 0 K.
const minTemperature = 1e-3

// temperatureInRange reports whether T, written as q, is one hess can
// compute at, and reports it when it is not.
func (c *compiler) temperatureInRange(T float64, q *lang.Quantity) bool {
	switch {
	case T > maxTemperature:
		c.report(syntaxCheck, q.Span(), "temperature %s is above %s, the highest temperature hess computes at", quantityText(q), kelvin(maxTemperature))
		return false
	case T < minTemperature:
		c.report(syntaxCheck, q.Span(), "temperature %s is below %s, the lowest temperature hess computes at", quantityText(q), kelvin(minTemperature))
		return false
	}
	return true
}

// stepCount returns how many temperatures from, from+step, … reach to
// (to ≥ from, step > 0), counted rather than stepped so that a step below
// the spacing of floating-point numbers near from cannot loop. It fails when
// the step does not move from (too small to tell two temperatures apart).
func stepCount(from, to, step float64) (float64, error) {
	if from+step == from || to-step == to {
		return 0, errors.New("too small to tell temperatures apart at this range")
	}
	span := (to - from) / step
	if math.IsInf(span, 0) || math.IsNaN(span) || span > 1e15 {
		return math.Inf(1), nil
	}
	return math.Floor(span+1e-9) + 1, nil
}

// countText writes a count for a message: digits up to 10^15, else "more
// than 10^15".
func countText(n float64) string {
	if n > 1e15 {
		return "more than 10^15"
	}
	return strconv.FormatFloat(n, 'f', 0, 64)
}

func (c *compiler) settings(s *lang.Settings) {
	set := &c.net.Settings
	set.Span = s.Span()
	seen := map[string]lang.Span{}
	once := func(key string, span lang.Span) bool {
		if first, dup := seen[key]; dup {
			d := c.report(syntaxCheck, span, "%s is set twice", key)
			d.Related = []lang.Related{{Span: first, Message: "first set here"}}
			return false
		}
		seen[key] = span
		return true
	}
	for _, it := range s.Items {
		key := keywordSpan(&it.Node)
		switch {
		case it.Pressure != nil:
			if !once("pressure", key) {
				continue
			}
			if v, ok := c.quantity(it.Pressure, pressureKind, "pressure", false); ok {
				if v.V <= 0 {
					c.report(implausibleValueCheck, it.Pressure.Span(), "standard pressure must be positive, found %s", quantityText(it.Pressure))
					continue
				}
				set.Pressure = v.V
				set.PressureSet = true
			}
		case it.StandardPressure != nil:
			c.dataPressure(it, key)
		case it.Temperatures != nil:
			if !once("temperatures", key) {
				continue
			}
			if ts, ok := c.temperatures(it.Temperatures); ok {
				set.Temperatures = ts
			}
		case it.Tolerance != nil:
			if !once("tolerance", key) {
				continue
			}
			if v, ok := c.quantity(it.Tolerance, energyKind, "tolerance", true); ok {
				if v.V < 0 {
					c.report(implausibleValueCheck, it.Tolerance.Span(), "tolerance cannot be negative, found %s", quantityText(it.Tolerance))
					continue
				}
				set.Tolerance = v.V
			}
		case it.Lint != nil:
			c.lint(it.Lint)
		case it.Activity != nil:
			if !once("activity", key) {
				continue
			}
			c.activityModel(it.Activity)
		}
	}
}

func (c *compiler) temperatures(items []*lang.TempSet) ([]float64, bool) {
	var out []float64
	ok := true
	for _, it := range items {
		from, ok1 := c.quantity(it.From, temperatureKind, "temperature", false)
		if it.To == nil {
			if ok1 {
				if from.V <= 0 {
					c.report(implausibleValueCheck, it.From.Span(), "temperature %s is not above absolute zero", quantityText(it.From))
					ok = false
					continue
				}
				if !c.temperatureInRange(from.V, it.From) {
					ok = false
					continue
				}
				out = append(out, from.V)
			}
			ok = ok && ok1
			continue
		}
		to, ok2 := c.quantity(it.To, temperatureKind, "temperature", false)
		step, ok3 := c.quantity(it.By, temperatureKind, "temperature step", true)
		if !ok1 || !ok2 || !ok3 {
			ok = false
			continue
		}
		switch {
		case from.V <= 0 || to.V <= 0:
			c.report(implausibleValueCheck, it.Span(), "temperature range %s to %s reaches absolute zero or below", quantityText(it.From), quantityText(it.To))
			ok = false
			continue
		case !c.temperatureInRange(from.V, it.From) || !c.temperatureInRange(to.V, it.To):
			ok = false
			continue
		case step.V <= 0:
			c.report(syntaxCheck, it.By.Span(), "a temperature step must be positive, found %s", quantityText(it.By))
			ok = false
			continue
		case to.V < from.V:
			c.report(syntaxCheck, it.Span(), "temperature range runs backwards: %s to %s", quantityText(it.From), quantityText(it.To))
			ok = false
			continue
		}
		n, err := stepCount(from.V, to.V, step.V)
		if err != nil {
			c.report(syntaxCheck, it.By.Span(), "temperature step %s: %v", quantityText(it.By), err)
			ok = false
			continue
		}
		if total := float64(len(out)) + n; total > maxTemperatures {
			c.report(syntaxCheck, it.Span(), "the temperature list would hold %s temperatures, more than %d", countText(total), maxTemperatures)
			ok = false
			continue
		}
		for i := 0; i < int(n); i++ {
			out = append(out, from.V+float64(i)*step.V)
		}
	}
	return out, ok && len(out) > 0
}

func (c *compiler) lint(l *lang.Lint) {
	if l.Check == nil || l.Level == nil {
		return
	}
	if LookupCheck(l.Check.Name) == nil {
		var names []string
		for _, ch := range checks {
			names = append(names, ch.Name)
		}
		hint := suggest.Phrase(l.Check.Name, names)
		if hint != "" {
			hint = "; " + hint
		}
		c.report(syntaxCheck, l.Check.Span(), "lint names no known check %q%s (`hess explain` lists them)", l.Check.Name, hint)
		return
	}
	sev, ok := lang.ParseSeverity(l.Level.Name)
	if !ok || sev == lang.Info {
		c.report(syntaxCheck, l.Level.Span(), "lint level must be off, warning or error, found %q", l.Level.Name)
		return
	}
	if c.net.Settings.Lint == nil {
		c.net.Settings.Lint = map[string]lang.Severity{}
	}
	c.net.Settings.Lint[l.Check.Name] = sev
}

// dataPressure records the standard pressure a file states for its own
// data (standard-pressure), once per file.
func (c *compiler) dataPressure(it *lang.Setting, key lang.Span) {
	set := &c.net.Settings
	file := key.File
	if old, dup := set.DataPressures[file]; dup {
		d := c.report(syntaxCheck, key, "standard-pressure is set twice in %s", file)
		d.Related = []lang.Related{{Span: old.Span, Message: "first set here"}}
		return
	}
	v, ok := c.quantity(it.StandardPressure, pressureKind, "standard-pressure", false)
	if !ok {
		return
	}
	if v.V <= 0 {
		c.report(implausibleValueCheck, it.StandardPressure.Span(), "standard pressure must be positive, found %s", quantityText(it.StandardPressure))
		return
	}
	if set.DataPressures == nil {
		set.DataPressures = map[string]DataPressure{}
	}
	set.DataPressures[file] = DataPressure{P: v.V, Span: it.StandardPressure.Span()}
}

// onlyDataPressure reports whether a settings block holds nothing but
// standard-pressure, which an included file may state.
func onlyDataPressure(s *lang.Settings) bool {
	for _, it := range s.Items {
		if it.StandardPressure == nil {
			return false
		}
	}
	return len(s.Items) > 0
}

// libraryDataPressure reads an included file's settings block that states
// only its standard-pressure.
func (c *compiler) libraryDataPressure(s *lang.Settings) {
	for _, it := range s.Items {
		c.dataPressure(it, keywordSpan(&it.Node))
	}
}
