package network

import "math/big"

// StoichMatrix is the stoichiometric matrix of a list of reactions, kept by
// column: each reaction is one sparse column of its net coefficients ν
// (products positive, a species written on both sides counted once). Rows
// are the species that occur in some column, in order of first occurrence.
type StoichMatrix struct {
	Species   []*Species
	Reactions []*Reaction
	Columns   [][]StoichEntry // Columns[j] is reaction j's non-zero entries, rows ascending

	row map[*Species]int
}

// StoichEntry is one non-zero coefficient of a column.
type StoichEntry struct {
	Row  int
	Coef *big.Rat
}

// NewStoichMatrix builds the matrix whose columns are the given reactions.
// Species that are undefined are left out of a column.
func NewStoichMatrix(rxs []*Reaction) *StoichMatrix {
	m := &StoichMatrix{Reactions: rxs, Columns: make([][]StoichEntry, len(rxs)), row: map[*Species]int{}}
	for j, rx := range rxs {
		terms := rx.NetTerms()
		col := make([]StoichEntry, 0, len(terms))
		for _, t := range terms {
			i, ok := m.row[t.Species]
			if !ok {
				i = len(m.Species)
				m.row[t.Species] = i
				m.Species = append(m.Species, t.Species)
			}
			col = append(col, StoichEntry{Row: i, Coef: t.Nu})
		}
		sortEntries(col)
		m.Columns[j] = col
	}
	return m
}

// Stoichiometry returns the stoichiometric matrix of every resolved reaction
// of the network, in source order.
func (n *Network) Stoichiometry() *StoichMatrix {
	rxs := make([]*Reaction, 0, len(n.Reactions))
	for _, rx := range n.Reactions {
		if rx.Resolved {
			rxs = append(rxs, rx)
		}
	}
	return NewStoichMatrix(rxs)
}

func sortEntries(col []StoichEntry) {
	// Columns are short: insertion sort.
	for i := 1; i < len(col); i++ {
		for k := i; k > 0 && col[k].Row < col[k-1].Row; k-- {
			col[k], col[k-1] = col[k-1], col[k]
		}
	}
}
