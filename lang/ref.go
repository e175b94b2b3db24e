package lang

import (
	"errors"
	"strconv"
	"strings"
)

// RefParts is a species reference split into its lexical parts:
// `SO4^2-(aq)` is Base "SO4", Charge -2, State "aq".
type RefParts struct {
	// Base is the formula or declared name, without charge and state tag.
	Base string
	// Charge is the net charge; HasCharge reports whether one was written.
	Charge    int
	HasCharge bool
	// State is the state tag without parentheses, or "" when there is none.
	State string
	// Electron reports whether the reference is the electron `e-`.
	Electron bool
}

// cutStateTag splits a trailing lower-case state tag such as `(g)` or
// `(melt)` off w.
func cutStateTag(w string) (base, tag string, ok bool) {
	if !strings.HasSuffix(w, ")") {
		return w, "", false
	}
	open := strings.LastIndexByte(w, '(')
	if open <= 0 || w[open-1] == '/' || w[open-1] == '*' {
		// `J/(mol)` is a unit, not a species in state mol.
		return w, "", false
	}
	tag = w[open+1 : len(w)-1]
	if !isTagName(tag) {
		return w, "", false
	}
	return w[:open], tag, true
}

func isTagName(s string) bool {
	if s == "" || s[0] < 'a' || s[0] > 'z' {
		return false
	}
	for i := 1; i < len(s); i++ {
		c := s[i]
		if !(('a' <= c && c <= 'z') || isDigit(c) || c == '_' || c == '-') {
			return false
		}
	}
	return true
}

// SplitRef splits a species reference into base, charge and state tag. It
// reads charges written `+`, `-`, `^N+`, `^N-`, and runs of equal signs
// (`++` is +2). The error, if any, says what is wrong with the charge.
func SplitRef(text string) (RefParts, error) {
	var p RefParts
	base, tag, _ := cutStateTag(text)
	p.State = tag
	if base == "e-" {
		p.Base, p.Charge, p.HasCharge, p.Electron = "e", -1, true, true
		return p, nil
	}
	// ^N+ or ^N-
	if i := strings.LastIndexByte(base, '^'); i >= 0 {
		sign := base[len(base)-1]
		if (sign != '+' && sign != '-') || i+1 > len(base)-1 {
			return p, errors.New("a charge is written ^N+ or ^N-")
		}
		digits := base[i+1 : len(base)-1]
		n := 1
		if digits != "" {
			v, err := strconv.Atoi(digits)
			if err != nil || v <= 0 || v > 99 {
				return p, errors.New("a charge is written ^N+ or ^N- with N from 1 to 99")
			}
			n = v
		}
		if sign == '-' {
			n = -n
		}
		p.Base, p.Charge, p.HasCharge = base[:i], n, true
		if p.Base == "" {
			return p, errors.New("a charge needs a formula before it")
		}
		return p, nil
	}
	end := len(base)
	for end > 0 && (base[end-1] == '+' || base[end-1] == '-') {
		end--
	}
	signs := base[end:]
	if signs != "" {
		if strings.Trim(signs, "+") != "" && strings.Trim(signs, "-") != "" {
			return p, errors.New("a charge mixes + and -")
		}
		n := len(signs)
		if signs[0] == '-' {
			n = -n
		}
		p.Charge, p.HasCharge = n, true
	}
	p.Base = base[:end]
	if p.Base == "" {
		return p, errors.New("a charge needs a formula before it")
	}
	return p, nil
}

// ChargeText is the canonical way to write a charge: "" for 0, "+" or "-"
// for ±1, "^N+" or "^N-" otherwise.
func ChargeText(charge int) string {
	switch {
	case charge == 0:
		return ""
	case charge == 1:
		return "+"
	case charge == -1:
		return "-"
	case charge > 1:
		return "^" + strconv.Itoa(charge) + "+"
	default:
		return "^" + strconv.Itoa(-charge) + "-"
	}
}

// Canonical prints the reference in canonical form: base, canonical charge,
// state tag.
func (p RefParts) Canonical() string {
	if p.Electron {
		s := "e-"
		if p.State != "" {
			s += "(" + p.State + ")"
		}
		return s
	}
	s := p.Base + ChargeText(p.Charge)
	if p.State != "" {
		s += "(" + p.State + ")"
	}
	return s
}

// Unquote returns the text of a string literal (quotes included in s). It
// accepts the escapes \" and \\ only.
func Unquote(s string) (string, error) {
	errOpen := errors.New("string is not closed on its line")
	if len(s) < 2 || s[0] != '"' {
		return "", errOpen
	}
	body := s[1 : len(s)-1]
	if s[len(s)-1] == '"' && !strings.ContainsAny(body, `"\`) {
		return body, nil
	}
	var b strings.Builder
	for i := 1; i < len(s); i++ {
		switch c := s[i]; c {
		case '"':
			if i != len(s)-1 {
				return "", errors.New("string has text after its closing quote")
			}
			return b.String(), nil
		case '\\':
			if i+1 < len(s) && (s[i+1] == '"' || s[i+1] == '\\') {
				b.WriteByte(s[i+1])
				i++
				continue
			}
			if i+1 == len(s) {
				return "", errOpen
			}
			return "", errors.New(`unknown escape in string: only \" and \\ are allowed`)
		default:
			b.WriteByte(c)
		}
	}
	return "", errOpen
}
