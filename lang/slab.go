package lang

// nodeSlab hands out the nodes statements are made of (statements, species
// and reactions, their properties, terms, species references, numbers,
// quantities and units, and the lists of them) from arrays allocated a
// chunk at a time, for the statements one parse worker reads: a few
// allocations per group of statements instead of several per term. The
// syntax tree keeps a chunk while it keeps any node in it. A nil slab
// allocates each node on its own.
type nodeSlab struct {
	terms  []Term
	refs   []SpeciesRef
	nums   []Num
	quants []Quantity
	units  []Unit
	idents []Ident
	arrows []Arrow
	ptrs   []*Term
	coeffs []*Num

	stmts     []Statement
	species   []Species
	reactions []Reaction
	sprops    []SpeciesProperty
	rprops    []ReactionProperty
	polys     []Polynomial
	svalues   []SpeciesValue
	refPtrs   []*SpeciesRef
	spPtrs    []*SpeciesProperty
	rpPtrs    []*ReactionProperty
}

// slabOr is the next node of *s from slab, or a new one without a slab.
func slabOr[T any](slab *nodeSlab, s func(*nodeSlab) *[]T) *T {
	if slab == nil {
		return new(T)
	}
	return slabNext(s(slab))
}

// slabListOr is slabList of *s from slab, or a copy without a slab.
func slabListOr[T any](slab *nodeSlab, s func(*nodeSlab) *[]T, ps []T) []T {
	if slab == nil {
		return slabList(new([]T), ps)
	}
	return slabList(s(slab), ps)
}

// The slab's arrays of each kind, for slabOr and slabListOr.
func slabStmts(s *nodeSlab) *[]Statement          { return &s.stmts }
func slabSpecies(s *nodeSlab) *[]Species          { return &s.species }
func slabReactions(s *nodeSlab) *[]Reaction       { return &s.reactions }
func slabSProps(s *nodeSlab) *[]SpeciesProperty   { return &s.sprops }
func slabRProps(s *nodeSlab) *[]ReactionProperty  { return &s.rprops }
func slabPolys(s *nodeSlab) *[]Polynomial         { return &s.polys }
func slabSValues(s *nodeSlab) *[]SpeciesValue     { return &s.svalues }
func slabRefPtrs(s *nodeSlab) *[]*SpeciesRef      { return &s.refPtrs }
func slabSPPtrs(s *nodeSlab) *[]*SpeciesProperty  { return &s.spPtrs }
func slabRPPtrs(s *nodeSlab) *[]*ReactionProperty { return &s.rpPtrs }

// slabChunk is how many nodes of a kind one allocation holds at most. The
// first chunk of a kind holds 8, and each next one twice as many, so that
// a kind a group holds few of wastes little.
const slabChunk = 64

// slabNext returns a pointer to the next free element of *s, starting a new
// chunk when the current one is full.
func slabNext[T any](s *[]T) *T {
	if len(*s) == cap(*s) {
		*s = make([]T, 0, min(max(2*cap(*s), 8), slabChunk))
	}
	*s = (*s)[:len(*s)+1]
	return &(*s)[len(*s)-1]
}

// slabList returns a copy of ps that the tree can keep, from *s, its
// length its capacity so that an append cannot write into a neighbour.
func slabList[T any](s *[]T, ps []T) []T {
	if len(ps) == 0 {
		return nil
	}
	if len(ps) > slabChunk/4 {
		return append([]T(nil), ps...)
	}
	if cap(*s)-len(*s) < len(ps) {
		*s = make([]T, 0, slabChunk)
	}
	n := len(*s)
	*s = append(*s, ps...)
	return (*s)[n : n+len(ps) : n+len(ps)]
}

func (s *nodeSlab) term() *Term {
	if s == nil {
		return &Term{}
	}
	return slabNext(&s.terms)
}

func (s *nodeSlab) ref() *SpeciesRef {
	if s == nil {
		return &SpeciesRef{}
	}
	return slabNext(&s.refs)
}

func (s *nodeSlab) num() *Num {
	if s == nil {
		return &Num{}
	}
	return slabNext(&s.nums)
}

func (s *nodeSlab) quantity() *Quantity {
	if s == nil {
		return &Quantity{}
	}
	return slabNext(&s.quants)
}

func (s *nodeSlab) unit() *Unit {
	if s == nil {
		return &Unit{}
	}
	return slabNext(&s.units)
}

func (s *nodeSlab) ident() *Ident {
	if s == nil {
		return &Ident{}
	}
	return slabNext(&s.idents)
}

func (s *nodeSlab) arrow() *Arrow {
	if s == nil {
		return &Arrow{}
	}
	return slabNext(&s.arrows)
}

// termList returns a copy of ts that the tree can keep.
func (s *nodeSlab) termList(ts []*Term) []*Term {
	if s == nil {
		return slabList(new([]*Term), ts)
	}
	return slabList(&s.ptrs, ts)
}

// numList returns a copy of ns that the tree can keep.
func (s *nodeSlab) numList(ns []*Num) []*Num {
	if s == nil {
		return slabList(new([]*Num), ns)
	}
	return slabList(&s.coeffs, ns)
}

// slabOf is the slab of the statement lex reads, if it has one.
func slabOf(lex tokenStream) *nodeSlab {
	if c, ok := lex.(*tokenCursor); ok {
		return c.slab
	}
	return nil
}
