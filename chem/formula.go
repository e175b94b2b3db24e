package chem

import (
	"fmt"
	"math"
	"math/big"
	"math/bits"
	"slices"
	"strings"
	"unicode/utf8"
)

// An ElementCount is how many atoms of one element a formula holds. Count is
// exact and positive; it need not be a whole number (Fe0.95O).
type ElementCount struct {
	Symbol string
	Count  *big.Rat
}

// A Formula is the elemental composition of a species: one entry per
// element, in Hill order (C first, then H, then the rest alphabetically;
// all alphabetically when there is no carbon). The zero Formula has no
// elements (the electron).
type Formula struct {
	Elements []ElementCount
}

// A FormulaError is why a formula does not parse. Code is the diagnostic
// code, "unknown-element" or "bad-formula"; [Offset, End) is the byte range
// of the offending text within the formula string; Message is a lower-case
// sentence without a trailing period.
type FormulaError struct {
	Code    string
	Offset  int
	End     int
	Message string
}

// Error returns the code, the byte offset and the message.
func (e *FormulaError) Error() string {
	return fmt.Sprintf("%s at byte %d: %s", e.Code, e.Offset, e.Message)
}

// maxGroupDepth is how deeply ( ) and [ ] groups may nest.
const maxGroupDepth = 64

// adductDot is the middle dot that, like "*", starts an adduct part.
const adductDot = "·"

// ParseFormula reads the formula part of a species reference (without charge
// or state tag), such as "CO2", "K4[Fe(CN)6]", "CuSO4*5H2O" or "Fe0.95O",
// resolving element symbols in t (the built-in table when t is nil).
//
// An element symbol is an upper-case letter and the lower-case letters after
// it, and must name an element of t. A count is an integer or a decimal and
// must not be zero. Groups in ( ) or [ ] nest up to 64 deep and may take a
// count. At the top level, "*" or "·" starts an adduct part whose optional
// leading count multiplies the whole part. Counts are exact.
//
// The error is nil on success; it is a *FormulaError, so callers should
// test it before storing it in an error variable.
func ParseFormula(s string, t *ElementTable) (Formula, *FormulaError) {
	if t == nil {
		t = builtinElementTable
	}
	p := formulaParser{s: s, t: t}
	return p.parse()
}

// groupFrame is one open group while parsing; frame 0 is the current
// top-level part. The frame's counts are entries[start:].
type groupFrame struct {
	open  byte // '(' or '[', 0 for the top level
	at    int  // byte offset of the opening bracket
	start int
}

// countEntry is one element's count while parsing.
type countEntry struct {
	symbol string
	n      amount
}

type formulaParser struct {
	s   string
	t   *ElementTable
	pos int
}

func (p *formulaParser) parse() (Formula, *FormulaError) {
	s := p.s
	if s == "" {
		return Formula{}, badFormula(0, 0, "empty formula")
	}
	// entries[:stack[0].start] holds the finished top-level parts, merged;
	// each open frame's counts follow in order.
	var entryBuf [16]countEntry
	var stackBuf [8]groupFrame
	entries := entryBuf[:0]
	stack := append(stackBuf[:0], groupFrame{})
	partMult, hasPartMult := amount{}, false // multiplier of the current part
	sepAt, sepEnd := -1, -1                  // the last adduct separator
	for p.pos < len(s) {
		c := s[p.pos]
		switch {
		case asciiUpper(c):
			var err *FormulaError
			if entries, err = p.element(entries, stack[len(stack)-1].start); err != nil {
				return Formula{}, err
			}

		case c == '(' || c == '[':
			if len(stack)-1 >= maxGroupDepth {
				return Formula{}, badFormula(p.pos, p.pos+1,
					fmt.Sprintf("groups nested deeper than %d", maxGroupDepth))
			}
			stack = append(stack, groupFrame{open: c, at: p.pos, start: len(entries)})
			p.pos++

		case c == ')' || c == ']':
			at := p.pos
			if len(stack) == 1 {
				return Formula{}, badFormula(at, at+1, fmt.Sprintf("unexpected %q", string(c)))
			}
			top := stack[len(stack)-1]
			if closer(top.open) != c {
				return Formula{}, badFormula(at, at+1, fmt.Sprintf("%q does not close %q%s",
					string(c), string(top.open), p.after(top.at)))
			}
			if len(entries) == top.start {
				return Formula{}, badFormula(top.at, at+1, "empty group")
			}
			p.pos++
			m, has, err := p.count()
			if err != nil {
				return Formula{}, err
			}
			stack = stack[:len(stack)-1]
			entries = mergeCounts(entries, stack[len(stack)-1].start, top.start, m, has)

		case c == '*' || strings.HasPrefix(s[p.pos:], adductDot):
			at, end := p.pos, p.pos+1
			if c != '*' {
				end = p.pos + len(adductDot)
			}
			sep := s[at:end]
			if len(stack) > 1 {
				return Formula{}, badFormula(at, end, fmt.Sprintf("adduct %q inside a group", sep))
			}
			if len(entries) == stack[0].start {
				if sepAt < 0 {
					return Formula{}, badFormula(at, end, fmt.Sprintf("empty part before %q", sep))
				}
				return Formula{}, badFormula(sepAt, sepEnd, fmt.Sprintf("empty adduct after %q", s[sepAt:sepEnd]))
			}
			entries = mergeCounts(entries, 0, stack[0].start, partMult, hasPartMult)
			stack[0].start = len(entries)
			sepAt, sepEnd = at, end
			p.pos = end
			m, has, err := p.count()
			if err != nil {
				return Formula{}, err
			}
			partMult, hasPartMult = m, has

		default:
			return Formula{}, p.unexpected()
		}
	}
	if len(stack) > 1 {
		top := stack[len(stack)-1]
		return Formula{}, badFormula(top.at, len(s),
			fmt.Sprintf("unclosed %q%s", string(top.open), p.after(top.at)))
	}
	if len(entries) == stack[0].start {
		// Only an adduct separator can leave the part empty here.
		return Formula{}, badFormula(sepAt, sepEnd, fmt.Sprintf("empty adduct after %q", s[sepAt:sepEnd]))
	}
	entries = mergeCounts(entries, 0, stack[0].start, partMult, hasPartMult)
	return newFormula(entries), nil
}

// element reads the element symbol at p.pos and its count, and adds them
// to the counts entries[start:].
func (p *formulaParser) element(entries []countEntry, start int) ([]countEntry, *FormulaError) {
	s := p.s
	at := p.pos
	p.pos++
	for p.pos < len(s) && asciiLower(s[p.pos]) {
		p.pos++
	}
	symbol := s[at:p.pos]
	e, ok := p.t.Lookup(symbol)
	if !ok {
		return entries, &FormulaError{Code: "unknown-element", Offset: at, End: p.pos,
			Message: fmt.Sprintf("unknown element %q", clip(symbol))}
	}
	n, has, err := p.count()
	if err != nil {
		return entries, err
	}
	if !has {
		n = amount{n: 1}
	}
	return addCount(entries, start, e.Symbol, n), nil
}

// addCount adds n atoms of symbol to the counts entries[start:].
func addCount(entries []countEntry, start int, symbol string, n amount) []countEntry {
	for i := start; i < len(entries); i++ {
		if entries[i].symbol == symbol {
			entries[i].n = entries[i].n.add(n)
			return entries
		}
	}
	return append(entries, countEntry{symbol, n})
}

// mergeCounts multiplies the counts entries[split:] by m (when has is set)
// and adds them to the counts entries[start:split], which then end the
// returned slice.
func mergeCounts(entries []countEntry, start, split int, m amount, has bool) []countEntry {
	w := split
	for i := split; i < len(entries); i++ {
		e := entries[i]
		if has {
			e.n = e.n.mul(m)
		}
		found := false
		for j := start; j < split; j++ {
			if entries[j].symbol == e.symbol {
				entries[j].n = entries[j].n.add(e.n)
				found = true
				break
			}
		}
		if !found {
			entries[w] = e
			w++
		}
	}
	return entries[:w]
}

// newFormula converts the parsed counts to a Formula in Hill order.
func newFormula(entries []countEntry) Formula {
	out := make([]ElementCount, len(entries))
	rats := make([]big.Rat, len(entries))
	for i, e := range entries {
		out[i] = ElementCount{Symbol: e.symbol, Count: e.n.ratInto(&rats[i])}
	}
	sortHill(out)
	return Formula{Elements: out}
}

// count reads an optional count at p.pos; has is false when there is none.
func (p *formulaParser) count() (n amount, has bool, err *FormulaError) {
	s := p.s
	start := p.pos
	i := start
	for i < len(s) && asciiDigit(s[i]) {
		i++
	}
	intEnd := i
	if i == start {
		if i+1 < len(s) && s[i] == '.' && asciiDigit(s[i+1]) {
			end := i + 1
			for end < len(s) && asciiDigit(s[end]) {
				end++
			}
			return amount{}, false, badFormula(start, end,
				fmt.Sprintf("count %q needs a digit before the point", clip(s[start:end])))
		}
		return amount{}, false, nil
	}
	fracStart, fracEnd := i, i
	if i < len(s) && s[i] == '.' {
		i++
		fracStart = i
		for i < len(s) && asciiDigit(s[i]) {
			i++
		}
		if i == fracStart {
			return amount{}, false, badFormula(start, i,
				fmt.Sprintf("count %q needs a digit after the point", clip(s[start:i])))
		}
		fracEnd = i
		for fracEnd > fracStart && s[fracEnd-1] == '0' {
			fracEnd--
		}
	}
	text := s[start:i]
	p.pos = i
	places := fracEnd - fracStart
	if places <= maxPlaces && (intEnd-start)+places <= maxPlaces {
		var v int64
		for j := start; j < intEnd; j++ {
			v = v*10 + int64(s[j]-'0')
		}
		for j := fracStart; j < fracEnd; j++ {
			v = v*10 + int64(s[j]-'0')
		}
		n = amount{n: v, places: places}
	} else {
		r, ok := new(big.Rat).SetString(text)
		if !ok {
			return amount{}, false, badFormula(start, i, fmt.Sprintf("count %q is not a number", clip(text)))
		}
		n = amount{r: r}
	}
	if n.isZero() {
		return amount{}, false, badFormula(start, i, fmt.Sprintf("count %s is not allowed", clip(text)))
	}
	return n, true, nil
}

// unexpected describes the text at p.pos where an element symbol, a group or
// an adduct separator was expected.
func (p *formulaParser) unexpected() *FormulaError {
	s := p.s
	start := p.pos
	c := s[start]
	switch {
	case asciiDigit(c):
		end := start
		for end < len(s) && (asciiDigit(s[end]) || s[end] == '.') {
			end++
		}
		return badFormula(start, end, fmt.Sprintf("expected an element symbol, found %q", clip(s[start:end])))
	case asciiLower(c):
		end := start
		for end < len(s) && asciiLower(s[end]) {
			end++
		}
		return badFormula(start, end,
			fmt.Sprintf("element symbol %q must start with an upper-case letter", clip(s[start:end])))
	}
	r, size := utf8.DecodeRuneInString(s[start:])
	text := s[start : start+size]
	if r == utf8.RuneError && size <= 1 {
		return badFormula(start, start+1, fmt.Sprintf("expected an element symbol, found byte %#02x", c))
	}
	return badFormula(start, start+size, fmt.Sprintf("expected an element symbol, found %q", text))
}

// maxQuoted is how many bytes of offending text a message quotes.
const maxQuoted = 24

// clip shortens text quoted in a message to about maxQuoted bytes, ending
// with "…" when it cut something.
func clip(text string) string {
	if len(text) <= maxQuoted {
		return text
	}
	cut := maxQuoted
	for cut > 0 && !utf8.RuneStart(text[cut]) {
		cut--
	}
	return text[:cut] + "…"
}

// column is the 1-based column, in runes, of byte offset at.
// after names what precedes byte at, for messages: ` after "Ca"`, or
// nothing at the start of the formula.
func (p *formulaParser) after(at int) string {
	if at == 0 {
		return " at the start"
	}
	return fmt.Sprintf(" after %q", p.s[:at])
}

func closer(open byte) byte {
	if open == '[' {
		return ']'
	}
	return ')'
}

func badFormula(offset, end int, message string) *FormulaError {
	return &FormulaError{Code: "bad-formula", Offset: offset, End: end, Message: message}
}

func asciiDigit(c byte) bool { return '0' <= c && c <= '9' }

// sortHill puts counts in Hill order.
func sortHill(c []ElementCount) {
	hasCarbon := false
	for _, e := range c {
		if e.Symbol == "C" {
			hasCarbon = true
			break
		}
	}
	rank := func(symbol string) int {
		switch {
		case hasCarbon && symbol == "C":
			return 0
		case hasCarbon && symbol == "H":
			return 1
		}
		return 2
	}
	slices.SortFunc(c, func(a, b ElementCount) int {
		if ra, rb := rank(a.Symbol), rank(b.Symbol); ra != rb {
			return ra - rb
		}
		return strings.Compare(a.Symbol, b.Symbol)
	})
}

// maxPlaces is the most decimal places, and digits, an amount holds
// without big arithmetic.
const maxPlaces = 18

var pow10 = [maxPlaces + 1]int64{1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9,
	1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18}

// An amount is an exact non-negative count while parsing: n/10^places, or
// r when that does not fit (r non-nil). Every count in a formula is a
// decimal, so sums and products stay decimals. An amount's r belongs to it
// alone: operations return new values and never change their operands.
type amount struct {
	n      int64
	places int
	r      *big.Rat
}

func (a amount) isZero() bool {
	if a.r != nil {
		return a.r.Sign() == 0
	}
	return a.n == 0
}

// asRat returns a as a big.Rat that the caller must not change.
func (a amount) asRat() *big.Rat {
	if a.r != nil {
		return a.r
	}
	return new(big.Rat).SetFrac64(a.n, pow10[a.places])
}

// ratInto stores a in dst, or returns a's own big.Rat.
func (a amount) ratInto(dst *big.Rat) *big.Rat {
	if a.r != nil {
		return a.r
	}
	if a.places == 0 {
		return dst.SetInt64(a.n)
	}
	return dst.SetFrac64(a.n, pow10[a.places])
}

// normal drops trailing decimal zeros.
func (a amount) normal() amount {
	for a.places > 0 && a.n%10 == 0 {
		a.n /= 10
		a.places--
	}
	return a
}

func (a amount) mul(b amount) amount {
	if a.r == nil && b.r == nil && a.places+b.places <= maxPlaces {
		hi, lo := bits.Mul64(uint64(a.n), uint64(b.n))
		if hi == 0 && lo <= math.MaxInt64 {
			return amount{n: int64(lo), places: a.places + b.places}.normal()
		}
	}
	return amount{r: new(big.Rat).Mul(a.asRat(), b.asRat())}
}

func (a amount) add(b amount) amount {
	if a.r == nil && b.r == nil {
		if a.places < b.places {
			a, b = b, a
		}
		hi, lo := bits.Mul64(uint64(b.n), uint64(pow10[a.places-b.places]))
		if hi == 0 && lo <= math.MaxInt64 {
			sum, carry := bits.Add64(uint64(a.n), lo, 0)
			if carry == 0 && sum <= math.MaxInt64 {
				return amount{n: int64(sum), places: a.places}.normal()
			}
		}
	}
	return amount{r: new(big.Rat).Add(a.asRat(), b.asRat())}
}

// Count returns how many atoms of symbol the formula holds: zero when it has
// none. The result is a new value the caller may change.
func (f Formula) Count(symbol string) *big.Rat {
	for _, e := range f.Elements {
		if e.Symbol == symbol && e.Count != nil {
			return new(big.Rat).Set(e.Count)
		}
	}
	return new(big.Rat)
}

// MolarMass returns the formula's molar mass in g/mol from the atomic
// weights in t (the built-in table when t is nil). It reports false when an
// element is not in t, has no atomic weight, or the mass overflows.
func (f Formula) MolarMass(t *ElementTable) (float64, bool) {
	if t == nil {
		t = builtinElementTable
	}
	mass := 0.0
	for _, e := range f.Elements {
		el, ok := t.Lookup(e.Symbol)
		if !ok || !el.HasWeight {
			return 0, false
		}
		if e.Count == nil {
			continue
		}
		n, _ := e.Count.Float64()
		mass += n * el.Weight
	}
	if math.IsInf(mass, 0) || math.IsNaN(mass) {
		return 0, false
	}
	return mass, true
}

// String returns the formula in Hill notation as ParseFormula reads it,
// such as "CH4" or "CuH10O9S": counts of 1 are left out and other counts are
// written as integers or exact decimals. A count that no decimal writes
// exactly (possible only in a Formula not made by ParseFormula) is written
// as a fraction p/q, which ParseFormula does not accept.
func (f Formula) String() string {
	var b strings.Builder
	for _, e := range f.Elements {
		if e.Count == nil || e.Count.Sign() == 0 {
			continue
		}
		b.WriteString(e.Symbol)
		if e.Count.Cmp(ratOne) != 0 {
			b.WriteString(decimalString(e.Count))
		}
	}
	return b.String()
}

var ratOne = big.NewRat(1, 1)

// decimalString writes r as an integer or as the shortest exact decimal, and
// as p/q when its denominator has a prime factor other than 2 and 5.
func decimalString(r *big.Rat) string {
	if r.IsInt() {
		return r.Num().String()
	}
	d := new(big.Int).Set(r.Denom())
	twos := d.TrailingZeroBits()
	d.Rsh(d, twos)
	fives := uint(0)
	five := big.NewInt(5)
	q, m := new(big.Int), new(big.Int)
	for !(d.IsInt64() && d.Int64() == 1) {
		q.QuoRem(d, five, m)
		if m.Sign() != 0 {
			return r.RatString()
		}
		d.Set(q)
		fives++
	}
	places := twos
	if fives > places {
		places = fives
	}
	return r.FloatString(int(places))
}
