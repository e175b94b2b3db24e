package lsp

import (
	"context"
	"fmt"
	"math"
	"math/big"
	"os"
	"strconv"
	"strings"

	"github.com/sourcegraph/jsonrpc2"

	"hess/equilibrium"
	"hess/network"
)

// referenceT is the temperature hovers report data at, K.
const referenceT = 298.15

// hover answers textDocument/hover. Over a species: its formula, molar
// mass, phase, data at 298.15 K and source. Over a reaction name: its
// equation, balance, ΔrG° and K at 298.15 K and the kind of K. Over an
// include: the file it reads. Elsewhere: null.
func (s *server) hover(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	t, sym, ok, err := s.symbolAt(req)
	if !ok || err != nil {
		return nil, err
	}
	s.mu.Lock()
	md := s.mdOK
	s.mu.Unlock()
	w := &hoverText{md: md}
	switch sym.Kind {
	case network.SymbolSpecies:
		speciesHover(w, t.net, sym)
	case network.SymbolReaction:
		reactionHover(w, t.net, sym)
	case network.SymbolInclude:
		includeHover(w, sym)
	case network.SymbolMixture:
		mixtureHover(w, t.net, sym, t.snap.feedsOf(t.net))
	default:
		return nil, nil
	}
	enc := s.encoding()
	r := Range{Start: t.lines.position(sym.Span.Start.Offset, enc), End: t.lines.position(sym.Span.End.Offset, enc)}
	kind := "plaintext"
	if md {
		kind = "markdown"
	}
	return Hover{Contents: MarkupContent{Kind: kind, Value: w.String()}, Range: &r}, nil
}

// hoverText builds hover text as markdown or plain text: one paragraph per
// line, names in code spans.
type hoverText struct {
	md    bool
	paras []string
	cur   strings.Builder
}

// name writes a name from the source (a species, a reaction).
func (h *hoverText) name(s string) {
	if h.md {
		h.cur.WriteString("`" + strings.ReplaceAll(s, "`", "'") + "`")
		return
	}
	h.cur.WriteString(s)
}

// text writes free text, escaped for markdown.
func (h *hoverText) text(format string, args ...any) {
	s := fmt.Sprintf(format, args...)
	if h.md {
		s = markdownEscaper.Replace(s)
	}
	h.cur.WriteString(s)
}

// line ends the current paragraph.
func (h *hoverText) line() {
	h.paras = append(h.paras, h.cur.String())
	h.cur.Reset()
}

func (h *hoverText) String() string {
	if h.cur.Len() > 0 {
		h.line()
	}
	if h.md {
		return strings.Join(h.paras, "\n\n")
	}
	return strings.Join(h.paras, "\n")
}

var markdownEscaper = strings.NewReplacer(
	`\`, `\\`, "`", "\\`", "*", `\*`, "_", `\_`, "[", `\[`, "]", `\]`,
	"<", `\<`, ">", `\>`, "#", `\#`, "|", `\|`,
)

func speciesHover(w *hoverText, net *network.Network, sym network.Symbol) {
	sp := sym.Species
	if sp == nil {
		w.text("species ")
		w.name(sym.Name)
		w.text(" is not declared")
		w.line()
		return
	}
	w.text("species ")
	w.name(sp.Key)
	if sp.Label != "" {
		w.text(" (%s)", sp.Label)
	}
	w.line()

	var facts []string
	if sp.HasFormula {
		if f := sp.Formula.String(); f != "" {
			facts = append(facts, "formula "+f)
		}
		if m, ok := sp.Formula.MolarMass(net.Elements); ok && m > 0 {
			facts = append(facts, "molar mass "+number(m, 6)+" g/mol")
		}
	}
	if sp.Phase != nil {
		facts = append(facts, fmt.Sprintf("phase %s (%s)", sp.Phase.Tag, sp.Phase.Convention))
	}
	if len(facts) > 0 {
		w.text("%s", strings.Join(facts, " · "))
		w.line()
	}

	var data []string
	add := func(key string, v *network.Value, scale float64, unit string) {
		if v == nil {
			return
		}
		s := key + " " + number(v.V/scale, 7)
		if v.Sigma > 0 {
			s += " ± " + number(v.Sigma/scale, 3)
		}
		data = append(data, s+" "+unit)
	}
	add("hf", sp.Hf, 1000, "kJ/mol")
	add("gf", sp.Gf, 1000, "kJ/mol")
	add("s", sp.S, 1, "J/mol/K")
	add("cp", sp.Cp, 1, "J/mol/K")
	if len(data) > 0 {
		w.text("at 298.15 K: %s", strings.Join(data, ", "))
		w.line()
	}
	data = data[:0]
	add("size", sp.Size, network.Angstrom, "Å")
	add("setschenow", sp.Setschenow, 1, "kg/mol")
	if len(data) > 0 {
		w.text("activity model parameters: %s", strings.Join(data, ", "))
		w.line()
	}
	if len(sp.Ranges) > 0 {
		var rs []string
		for _, r := range sp.Ranges {
			rs = append(rs, fmt.Sprintf("%s %s to %s K", r.Kind, number(r.Tmin, 6), number(r.Tmax, 6)))
		}
		w.text("ranges: %s", strings.Join(rs, ", "))
		w.line()
		if m := sp.Model(); m != nil && sp.Hf == nil {
			if lo, hi := m.Range(); lo <= referenceT && referenceT <= hi {
				w.text("at 298.15 K from the ranges: H° %s kJ/mol, S° %s J/mol/K, Cp° %s J/mol/K",
					number(m.H(referenceT)/1000, 6), number(m.S(referenceT), 6), number(m.Cp(referenceT), 6))
				w.line()
			}
		}
	}
	if len(data) == 0 && len(sp.Ranges) == 0 {
		w.text("no thermodynamic data")
		w.line()
	}
	if sp.Source != "" {
		w.text("source: %s", sp.Source)
		w.line()
	}
	if sp.Note != "" {
		w.text("note: %s", sp.Note)
		w.line()
	}
}

func reactionHover(w *hoverText, net *network.Network, sym network.Symbol) {
	rx := sym.Reaction
	if rx == nil {
		w.text("no reaction is named ")
		w.name(sym.Name)
		w.line()
		return
	}
	w.text("reaction ")
	w.name(rx.Name)
	if eq := equationText(net, rx); eq != "" {
		w.text(": ")
		w.name(eq)
	}
	w.line()
	if len(rx.Combo) > 0 {
		var parts []string
		for i, ct := range rx.Combo {
			weight := ratString(ct.Weight)
			term := ct.Name
			switch {
			case weight == "1":
			case weight == "-1":
				term = "- " + term
			case strings.HasPrefix(weight, "-"):
				term = "- " + weight[1:] + " " + term
			default:
				term = weight + " " + term
			}
			if i > 0 && !strings.HasPrefix(term, "- ") {
				term = "+ " + term
			}
			parts = append(parts, term)
		}
		w.text("combination: %s", strings.Join(parts, " "))
		w.line()
	}

	elements, left, right, ok := rx.Balance()
	switch {
	case !ok:
		w.text("balance unknown: a species is undeclared or has no formula")
	default:
		var off, all []string
		for _, e := range elements {
			if e.Left.Cmp(e.Right) != 0 {
				off = append(off, fmt.Sprintf("%s left %s, right %s", e.Symbol, ratString(e.Left), ratString(e.Right)))
			}
			all = append(all, e.Symbol+" "+ratString(e.Left))
		}
		if left.Cmp(right) != 0 {
			off = append(off, fmt.Sprintf("charge left %s, right %s", chargeString(left), chargeString(right)))
		}
		if len(off) > 0 {
			w.text("not balanced: %s", strings.Join(off, "; "))
		} else {
			w.text("balanced: %s on each side, charge %s", strings.Join(all, ", "), chargeString(left))
		}
	}
	w.line()

	table := equilibrium.ReactionTable(net, rx, []float64{referenceT})
	if len(table.Rows) == 1 && table.Rows[0].Valid {
		row := table.Rows[0]
		w.text("ΔrG°(298.15 K) = %s kJ/mol, K = %s (%s)", number(row.DG/1000, 4), number(row.K, 3), table.Kind)
		if row.Basis != network.BasisNone {
			w.text(", from %s data", row.Basis)
		}
	} else {
		w.text("ΔrG° and K at 298.15 K cannot be computed")
		if len(table.Rows) == 1 && len(table.Rows[0].Missing) > 0 {
			var names []string
			for _, sp := range table.Rows[0].Missing {
				names = append(names, sp.Key)
			}
			w.text(": no data for %s", strings.Join(names, ", "))
		}
		w.text(" (kind %s)", table.Kind)
	}
	w.line()
	kind := "two-way (equilibrium)"
	if !rx.TwoWay {
		kind = "one-way"
	}
	w.text("%s", kind)
	if rx.Source != "" {
		w.text(" · source: %s", rx.Source)
	}
	w.line()
}

func includeHover(w *hoverText, sym network.Symbol) {
	w.text("include ")
	w.name(sym.Target)
	if _, err := os.Stat(sym.Target); err != nil {
		w.text(" (cannot be read from disk)")
	}
	w.line()
}

// number prints v with at most digits significant digits (in exponent
// form when it is very large or small).
func number(v float64, digits int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "n/a"
	}
	return strconv.FormatFloat(v, 'g', digits, 64)
}

func ratString(r *big.Rat) string {
	if r == nil {
		return "?"
	}
	if r.IsInt() {
		return r.Num().String()
	}
	return r.RatString()
}

func chargeString(r *big.Rat) string {
	s := ratString(r)
	if r != nil && r.Sign() > 0 {
		s = "+" + s
	}
	return s
}
