package lang

import (
	"github.com/alecthomas/participle/v2"
)

// The properties of species and reaction blocks, read by hand as the
// leaves are (leaves.go), each by its production below.

var (
	speciesPropertyRule = rule("SpeciesProperty", "a species property (formula, hf, gf, s, cp, size, setschenow, shomate, nasa7, source, note)",
		alt{ref("FormulaProp"), ref("SpeciesValue"), ref("Polynomial"), ref("TextProp")})
	formulaRule      = rule("FormulaProp", "a formula", seq{lit("formula"), ref("SpeciesRef")})
	speciesValueRule = rule("SpeciesValue", "", seq{oneOf("hf", "gf", "s", "cp", "size", "setschenow"), ref("Quantity")})
	polynomialRule   = rule("Polynomial", "",
		seq{oneOf("shomate", "nasa7"), ref("Quantity"), lit("to"), ref("Quantity"), openBrace, many{ref("Num")}, closeBrace})
	textRule = rule("TextProp", "", seq{oneOf("source", "note"), ref("Str")})

	// The reaction property list names no "note", though TextProp takes
	// one; the message is kept as it has always read.
	reactionPropertyRule = rule("ReactionProperty", "a reaction property (dg, dh, ds, logk, rate, reverse, source)",
		alt{ref("ReactionValue"), ref("LogK"), ref("Rate"), ref("TextProp")})
	reactionValueRule = rule("ReactionValue", "", seq{oneOf("dg", "dh", "ds"), ref("Quantity")})
	logKRule          = rule("LogK", "", seq{lit("logk"), ref("Num"), opt{sigmaPart}, opt{logKAtPart}})
	rateRule          = rule("Rate", "",
		seq{oneOf("rate", "reverse"), lit("A"), ref("Quantity"), opt{rateNPart}, lit("Ea"), ref("Quantity")})

	logKAtPart = seq{lit("at"), ref("Quantity")} // the temperature of a log K
	rateNPart  = seq{lit("n"), ref("Num")}       // the temperature exponent of a rate
)

// expectLit consumes the literal part x or fails expecting it.
func expectLit(lex tokenStream, x expr) error {
	if !isLit(lex.Peek(), x) {
		return expecting(lex, x)
	}
	lex.Next()
	return nil
}

// requireQuantity parses the quantity that part x of a production
// requires, or fails expecting x.
func requireQuantity(lex tokenStream, x expr) (*Quantity, error) {
	q := slabOf(lex).quantity()
	if err := q.read(lex); err != nil {
		if err == participle.NextMatch {
			return nil, expecting(lex, x)
		}
		return nil, err
	}
	return q, nil
}

// optionalNum reads the optional part x, a literal and a Num, when its
// literal comes next; a missing Num is an error.
func optionalNum(lex tokenStream, x seq) (*Num, error) {
	if !isLit(lex.Peek(), x[0]) {
		return nil, nil
	}
	lex.Next()
	n := &Num{}
	if n.read(lex) != nil {
		return nil, expecting(lex, x[1])
	}
	return n, nil
}

func (p *Polynomial) read(lex tokenStream) error {
	if !polynomialRule.begins(lex.Peek()) {
		return participle.NextMatch
	}
	start := lex.RawCursor()
	first := *lex.Next()
	out := Polynomial{Kind: first.Value}
	var err error
	if out.From, err = requireQuantity(lex, polynomialRule.at(1)); err != nil {
		return err
	}
	if err := expectLit(lex, polynomialRule.at(2)); err != nil {
		return err
	}
	if out.To, err = requireQuantity(lex, polynomialRule.at(3)); err != nil {
		return err
	}
	if err := expectLit(lex, polynomialRule.at(4)); err != nil {
		return err
	}
	// The coefficients are read straight into the group's arrays of
	// numbers and of lists of them.
	slab := slabOf(lex)
	var buf [9]*Num // the most a polynomial takes
	nums := buf[:0]
	for numRule.begins(lex.Peek()) {
		n := slab.num()
		_ = n.read(lex)
		nums = append(nums, n)
	}
	out.Coeffs = slab.numList(nums)
	if err := expectLit(lex, polynomialRule.at(6)); err != nil {
		return err
	}
	out.Node = lex.node(start, lex.RawCursor())
	*p = out
	return nil
}

// readText reads the string of a TextProp whose keyword was first.
func readText(lex tokenStream, first Token, start int) (*TextProp, error) {
	lex.Next()
	s := &Str{}
	if s.read(lex) != nil {
		return nil, expecting(lex, textRule.at(1))
	}
	return &TextProp{Node: lex.node(start, lex.RawCursor()), Key: first.Value, Text: s}, nil
}

func (sp *SpeciesProperty) read(lex tokenStream) error {
	start := lex.RawCursor()
	first := *lex.Peek()
	var out SpeciesProperty
	var err error
	switch {
	case formulaRule.begins(&first):
		lex.Next()
		ref := &SpeciesRef{}
		if ref.read(lex) != nil {
			return expecting(lex, formulaRule.at(1))
		}
		out.Formula = &FormulaProp{Node: lex.node(start, lex.RawCursor()), Formula: ref}
	case speciesValueRule.begins(&first):
		lex.Next()
		v := slabOr(slabOf(lex), slabSValues)
		v.Key = first.Value
		if v.Value, err = requireQuantity(lex, speciesValueRule.at(1)); err != nil {
			return err
		}
		v.Node = lex.node(start, lex.RawCursor())
		out.Value = v
	case polynomialRule.begins(&first):
		out.Poly = slabOr(slabOf(lex), slabPolys)
		if err := out.Poly.read(lex); err != nil {
			return err
		}
	case textRule.begins(&first):
		if out.Text, err = readText(lex, first, start); err != nil {
			return err
		}
	default:
		return participle.NextMatch
	}
	out.Node = lex.node(start, lex.RawCursor())
	*sp = out
	return nil
}

func (lk *LogK) read(lex tokenStream, node func() Node) error {
	lex.Next()
	lk.Value = &Num{}
	if lk.Value.read(lex) != nil {
		return expecting(lex, logKRule.at(1))
	}
	if isPlusMinus(lex.Peek()) {
		lex.Next()
		lk.Sigma = &Num{}
		if lk.Sigma.read(lex) != nil {
			return expecting(lex, sigmaPart[1])
		}
	}
	if isLit(lex.Peek(), logKAtPart[0]) {
		lex.Next()
		var err error
		if lk.At, err = requireQuantity(lex, logKAtPart[1]); err != nil {
			return err
		}
	}
	lk.Node = node()
	return nil
}

func (r *Rate) read(lex tokenStream, node func() Node) error {
	r.Kind = lex.Next().Value
	var err error
	if err := expectLit(lex, rateRule.at(1)); err != nil {
		return err
	}
	if r.A, err = requireQuantity(lex, rateRule.at(2)); err != nil {
		return err
	}
	if r.N, err = optionalNum(lex, rateNPart); err != nil {
		return err
	}
	if err := expectLit(lex, rateRule.at(4)); err != nil {
		return err
	}
	if r.Ea, err = requireQuantity(lex, rateRule.at(5)); err != nil {
		return err
	}
	r.Node = node()
	return nil
}

func (rp *ReactionProperty) read(lex tokenStream) error {
	start := lex.RawCursor()
	first := *lex.Peek()
	node := func() Node { return lex.node(start, lex.RawCursor()) }
	var out ReactionProperty
	var err error
	switch {
	case reactionValueRule.begins(&first):
		lex.Next()
		v := &ReactionValue{Key: first.Value}
		if v.Value, err = requireQuantity(lex, reactionValueRule.at(1)); err != nil {
			return err
		}
		v.Node = node()
		out.Value = v
	case logKRule.begins(&first):
		out.LogK = &LogK{}
		if err := out.LogK.read(lex, node); err != nil {
			return err
		}
	case rateRule.begins(&first):
		out.Rate = &Rate{}
		if err := out.Rate.read(lex, node); err != nil {
			return err
		}
	case textRule.begins(&first):
		if out.Text, err = readText(lex, first, start); err != nil {
			return err
		}
	default:
		return participle.NextMatch
	}
	out.Node = node()
	*rp = out
	return nil
}
