package lang

import (
	"bytes"
	"strings"
	"unicode/utf8"
)

// Format prints a parsed file in the canonical layout: one statement or
// property per line, two-space indentation, single spaces between tokens,
// canonical arrows, charges and `±`, at most one blank line where the
// source had any, and every comment kept (a comment inside a statement's
// line moves to its own line before it; one after it on the same line
// stays at its end). Numbers, units and strings are printed as written.
// Format is idempotent. The file should have parsed without syntax errors;
// a broken statement is printed as its tokens separated by spaces.
func Format(f *File) []byte {
	if f == nil {
		return nil
	}
	p := &printer{comments: f.Comments}
	for _, st := range f.Statements {
		p.statement(st)
	}
	p.flushComments(int(^uint(0) >> 1))
	p.endLine()
	return p.aligned()
}

// FormatSource parses and formats src; on syntax errors it returns nil and
// the diagnostics.
func FormatSource(name string, src []byte) ([]byte, Diagnostics) {
	f, diags := Parse(name, src)
	if diags.HasErrors() {
		return nil, diags
	}
	return Format(f), diags
}

type printer struct {
	out        bytes.Buffer
	comments   []Comment
	next       int // index of the next comment to print
	indent     int
	lastLine   int  // source line where the last printed item ended
	blockStart bool // nothing printed yet in the current block
	pending    bool // the last output line is not yet ended: a comment may trail it
	lines      int  // output lines ended so far
	lineStart  int  // offset in out where the current line starts
	trailers   []trailer
}

// trailer is a comment printed at the end of an output line.
type trailer struct {
	line  int // output line number, from 0
	at    int // offset in out where the line's code ends
	width int // the code's width in code points
}

func (p *printer) newline() {
	p.out.WriteByte('\n')
	p.lines++
	p.lineStart = p.out.Len()
}

// aligned returns the output with the trailing comments of each run of
// consecutive lines starting in one column, two spaces after the longest
// line of the run.
func (p *printer) aligned() []byte {
	if len(p.trailers) == 0 {
		return p.out.Bytes()
	}
	src := p.out.Bytes()
	var b bytes.Buffer
	b.Grow(len(src) + len(src)/8)
	last := 0
	for i := 0; i < len(p.trailers); {
		j := i + 1
		width := p.trailers[i].width
		for j < len(p.trailers) && p.trailers[j].line == p.trailers[j-1].line+1 {
			width = max(width, p.trailers[j].width)
			j++
		}
		for _, t := range p.trailers[i:j] {
			b.Write(src[last:t.at])
			for k := t.width; k < width; k++ {
				b.WriteByte(' ')
			}
			last = t.at
		}
		i = j
	}
	b.Write(src[last:])
	return b.Bytes()
}

// item prints one output line for the source range [from, to].
func (p *printer) item(text string, from, to Span) {
	p.flushComments(to.End.Offset)
	p.emit(text, from.Start.Line)
	p.pending = true
	p.lastLine = to.End.Line
}

// endLine ends the last output line.
func (p *printer) endLine() {
	if p.pending {
		p.newline()
		p.pending = false
	}
}

// emit starts a new output line with text, after a blank line when the
// source had one before srcLine.
func (p *printer) emit(text string, srcLine int) {
	p.endLine()
	if p.lastLine > 0 && !p.blockStart && srcLine > p.lastLine+1 {
		p.newline()
	}
	p.blockStart = false
	for i := 0; i < p.indent; i++ {
		p.out.WriteString("  ")
	}
	p.out.WriteString(text)
}

// flushComments prints every pending comment that starts before offset:
// at the end of the last output line when it followed that item on its
// source line, and on a line of its own otherwise.
func (p *printer) flushComments(offset int) {
	for p.next < len(p.comments) && p.comments[p.next].Span.Start.Offset < offset {
		c := p.comments[p.next]
		p.next++
		if p.pending && c.Span.Start.Line == p.lastLine {
			p.trailers = append(p.trailers, trailer{line: p.lines, at: p.out.Len(),
				width: utf8.RuneCount(p.out.Bytes()[p.lineStart:])})
			p.out.WriteString("  ")
			p.out.WriteString(c.Text)
			p.endLine()
			continue
		}
		p.emit(c.Text, c.Span.Start.Line)
		p.pending = true
		p.endLine()
		p.lastLine = c.Span.End.Line
	}
}

// hasComments reports whether a comment starts inside the byte range
// [from, to).
func (p *printer) hasComments(from, to int) bool {
	for i := p.next; i < len(p.comments); i++ {
		o := p.comments[i].Span.Start.Offset
		if o >= to {
			break
		}
		if o >= from {
			return true
		}
	}
	return false
}

func (p *printer) open(text string, n *Node, brace Token) {
	p.item(text+" {", n.Span(), n.Source().Span(brace))
	p.indent++
	p.blockStart = true
}

func (p *printer) close(n *Node) {
	last := n.TokenSpan(len(n.Tokens()) - 1)
	p.flushComments(last.Start.Offset)
	p.indent--
	p.blockStart = true // no blank line before the closing brace
	p.item("}", last, last)
}

// braceToken returns the first `{` among the node's tokens.
func braceToken(n *Node) Token {
	for _, t := range n.Tokens() {
		if t.Type == Punct && t.Value == "{" {
			return t
		}
	}
	toks := n.Tokens()
	return toks[len(toks)-1]
}

// block prints a header, its body lines and the closing brace; an empty
// body with no comment inside prints as `header {}` on one line.
func (p *printer) block(header string, n *Node, empty bool, body func()) {
	if empty && !p.hasComments(braceToken(n).End(), n.Span().End.Offset) {
		p.item(header+" {}", n.Span(), n.Span())
		return
	}
	p.open(header, n, braceToken(n))
	if !empty {
		body()
	}
	p.close(n)
}

// tokensText prints a statement that did not parse as its tokens.
func tokensText(n *Node) string {
	texts := make([]string, len(n.Tokens()))
	for i, t := range n.Tokens() {
		texts[i] = t.Value
	}
	return strings.Join(texts, " ")
}

func (p *printer) statement(st *Statement) {
	switch {
	case st.Broken || len(st.Tokens()) == 0:
		if len(st.Tokens()) > 0 {
			p.item(tokensText(&st.Node), st.Span(), st.Span())
		}
	case st.Include != nil:
		p.item("include "+st.Include.Path.Raw, st.Include.Span(), st.Include.Span())
	case st.Settings != nil:
		s := st.Settings
		p.block("settings", &s.Node, len(s.Items) == 0, func() {
			for _, it := range s.Items {
				p.item(settingText(it), it.Span(), it.Span())
			}
		})
	case st.Element != nil:
		e := st.Element
		p.block("element "+e.Symbol.Name, &e.Node, e.Mass == nil, func() {
			p.item("mass "+quantityText(e.Mass), e.Mass.Span(), e.Mass.Span())
		})
	case st.Phase != nil:
		ph := st.Phase
		p.block("phase "+ph.Name.Name, &ph.Node, ph.Convention == nil, func() {
			p.item("convention "+ph.Convention.Name, ph.Convention.Span(), ph.Convention.Span())
		})
	case st.Species != nil:
		p.species(st.Species)
	case st.Reaction != nil:
		p.reaction(st.Reaction)
	case st.Mixture != nil:
		m := st.Mixture
		p.block("mixture "+m.Name.Name, &m.Node, len(m.Items) == 0, func() {
			for _, it := range m.Items {
				p.item(mixItemText(it), it.Span(), it.Span())
			}
		})
	}
}

func (p *printer) species(s *Species) {
	refs := make([]string, len(s.Refs))
	for i, r := range s.Refs {
		refs[i] = RefText(r.Text)
	}
	header := "species " + strings.Join(refs, ", ")
	if s.Label != nil {
		header += " " + s.Label.Raw
	}
	if !s.HasBody {
		p.item(header, s.Span(), s.Span())
		return
	}
	p.block(header, &s.Node, len(s.Props) == 0, func() {
		for _, pr := range s.Props {
			switch {
			case pr.Formula != nil:
				p.item("formula "+pr.Formula.Formula.Text, pr.Span(), pr.Span())
			case pr.Value != nil:
				p.item(pr.Value.Key+" "+quantityText(pr.Value.Value), pr.Span(), pr.Span())
			case pr.Poly != nil:
				p.polynomial(pr.Poly)
			case pr.Text != nil:
				p.item(pr.Text.Key+" "+pr.Text.Text.Raw, pr.Span(), pr.Span())
			}
		}
	})
}

// coeffsPerLine is how many polynomial coefficients the formatter puts on
// one line.
const coeffsPerLine = 4

// polynomial prints the coefficients coeffsPerLine to a line; a comment
// after a coefficient ends its line early, so the comment stays beside the
// coefficients it followed.
func (p *printer) polynomial(poly *Polynomial) {
	header := poly.Kind + " " + quantityText(poly.From) + " to " + quantityText(poly.To)
	p.block(header, &poly.Node, len(poly.Coeffs) == 0, func() {
		var group []*Num
		for i, c := range poly.Coeffs {
			group = append(group, c)
			last := i == len(poly.Coeffs)-1
			if !last && len(group) < coeffsPerLine && !p.hasComments(c.Span().End.Offset, poly.Coeffs[i+1].Span().Start.Offset) {
				continue
			}
			texts := make([]string, len(group))
			for j, g := range group {
				texts[j] = g.Text
			}
			p.item(strings.Join(texts, " "), group[0].Span(), group[len(group)-1].Span())
			group = group[:0]
		}
	})
}

func (p *printer) reaction(r *Reaction) {
	var b strings.Builder
	b.WriteString("reaction ")
	b.WriteString(r.Name.Name)
	b.WriteString(": ")
	b.WriteString(SideText(r.Left))
	b.WriteString(" ")
	b.WriteString(ArrowText(r.Arrow))
	b.WriteString(" ")
	b.WriteString(SideText(r.Right))
	if r.Combo != nil {
		b.WriteString(" = ")
		b.WriteString(comboText(r.Combo))
	}
	if !r.HasBody {
		p.item(b.String(), r.Span(), r.Span())
		return
	}
	p.block(b.String(), &r.Node, len(r.Props) == 0, func() {
		for _, pr := range r.Props {
			p.item(reactionPropText(pr), pr.Span(), pr.Span())
		}
	})
}

// RefText prints a species reference with its charge in canonical form.
func RefText(text string) string {
	parts, err := SplitRef(text)
	if err != nil {
		return text
	}
	return parts.Canonical()
}

// ArrowText is the canonical spelling of an arrow: <-> or ->.
func ArrowText(a *Arrow) string {
	if a.TwoWay() {
		return "<->"
	}
	return "->"
}

// SideText prints one side of a reaction equation.
func SideText(terms []*Term) string {
	parts := make([]string, len(terms))
	for i, t := range terms {
		s := RefText(t.Species.Text)
		if t.Coef != nil {
			s = t.Coef.Text + " " + s
		}
		parts[i] = s
	}
	return strings.Join(parts, " + ")
}

func comboText(c *Combination) string {
	var b strings.Builder
	for i, t := range c.Terms {
		switch {
		case i > 0 && t.Sign == "-":
			b.WriteString(" - ")
		case i > 0:
			b.WriteString(" + ")
		case t.Sign == "-":
			b.WriteString("- ")
		}
		if t.Coef != nil {
			b.WriteString(t.Coef.Text)
			b.WriteString(" ")
		}
		b.WriteString(t.Name.Name)
	}
	return b.String()
}

func quantityText(q *Quantity) string {
	s := q.Value.Text
	if q.Sigma != nil {
		s += " ± " + q.Sigma.Text
	}
	if q.Unit != nil {
		s += " " + q.Unit.Text
	}
	return s
}

func settingText(s *Setting) string {
	switch {
	case s.Pressure != nil:
		return "pressure " + quantityText(s.Pressure)
	case s.StandardPressure != nil:
		return "standard-pressure " + quantityText(s.StandardPressure)
	case s.Temperatures != nil:
		parts := make([]string, len(s.Temperatures))
		for i, t := range s.Temperatures {
			parts[i] = quantityText(t.From)
			if t.To != nil {
				parts[i] += " to " + quantityText(t.To) + " by " + quantityText(t.By)
			}
		}
		return "temperatures " + strings.Join(parts, ", ")
	case s.Tolerance != nil:
		return "tolerance " + quantityText(s.Tolerance)
	case s.Lint != nil:
		return "lint " + s.Lint.Check.Name + " " + s.Lint.Level.Name
	case s.Activity != nil:
		return "activity " + s.Activity.Name
	}
	return ""
}

func reactionPropText(pr *ReactionProperty) string {
	switch {
	case pr.Value != nil:
		return pr.Value.Key + " " + quantityText(pr.Value.Value)
	case pr.LogK != nil:
		s := "logk " + pr.LogK.Value.Text
		if pr.LogK.Sigma != nil {
			s += " ± " + pr.LogK.Sigma.Text
		}
		if pr.LogK.At != nil {
			s += " at " + quantityText(pr.LogK.At)
		}
		return s
	case pr.Rate != nil:
		r := pr.Rate
		s := r.Kind + " A " + quantityText(r.A)
		if r.N != nil {
			s += " n " + r.N.Text
		}
		return s + " Ea " + quantityText(r.Ea)
	case pr.Text != nil:
		return pr.Text.Key + " " + pr.Text.Text.Raw
	}
	return ""
}

func mixItemText(it *MixItem) string {
	switch {
	case it.Temperature != nil:
		return "temperature " + quantityText(it.Temperature)
	case it.Pressure != nil:
		return "pressure " + quantityText(it.Pressure)
	case it.Member != nil:
		s := RefText(it.Member.Species.Text)
		if it.Member.Amount != nil {
			s += " " + quantityText(it.Member.Amount)
		}
		if it.Member.Fixed {
			s += " fixed"
		}
		return s
	}
	return ""
}
