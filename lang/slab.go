package lang

// nodeSlab hands out the small nodes a reaction statement is made of (its
// terms, their species references and coefficients, the lists of terms)
// from arrays allocated a chunk at a time, for the statements of one
// group: a few allocations per group instead of several per term. The
// syntax tree keeps a chunk while it keeps any node in it, as it keeps
// its group's token array. A nil slab allocates each node on its own.
type nodeSlab struct {
	terms []Term
	refs  []SpeciesRef
	nums  []Num
	ptrs  []*Term
}

// slabChunk is how many nodes of a kind one allocation holds.
const slabChunk = 64

// slabNext returns a pointer to the next free element of *s, starting a new
// chunk when the current one is full.
func slabNext[T any](s *[]T) *T {
	if len(*s) == cap(*s) {
		*s = make([]T, 0, slabChunk)
	}
	*s = (*s)[:len(*s)+1]
	return &(*s)[len(*s)-1]
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

// termList returns a copy of ts that the tree can keep, its length its
// capacity so that an append cannot write into a neighbour.
func (s *nodeSlab) termList(ts []*Term) []*Term {
	if len(ts) == 0 {
		return nil
	}
	if s == nil || len(ts) > slabChunk/4 {
		return append([]*Term(nil), ts...)
	}
	if cap(s.ptrs)-len(s.ptrs) < len(ts) {
		s.ptrs = make([]*Term, 0, slabChunk)
	}
	n := len(s.ptrs)
	s.ptrs = append(s.ptrs, ts...)
	return s.ptrs[n : n+len(ts) : n+len(ts)]
}

// slabOf is the slab of the statement lex reads, if it has one.
func slabOf(lex tokenStream) *nodeSlab {
	if c, ok := lex.(*tokenCursor); ok {
		return c.slab
	}
	return nil
}
