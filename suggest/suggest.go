// Package suggest finds, among the names a lookup knew, the one a
// misspelt name most likely meant: the near-miss behind "did you mean".
// It owns the edit distance used for that everywhere (commands, flags'
// values, statement keywords, species, reactions, units); it never decides
// what the candidates are or how a message is worded.
package suggest

import (
	"strings"
	"unicode"
)

// maxLen bounds the names compared: a longer name gets no suggestion, so
// the work per comparison stays bounded whatever the input.
const maxLen = 64

// Distance is the optimal-string-alignment distance between a and b,
// counted in Unicode code points: insertions, deletions, substitutions and
// swaps of two neighbours each cost one. Its work grows with the product of
// the lengths; Closest bounds them.
func Distance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	var r rows
	r.grow(len(rb) + 1)
	return r.distance(ra, rb)
}

// rows are the three rows of the distance table (the one two back, for
// swaps; the previous; this one), kept between calls to save allocations.
type rows struct {
	prev2, prev, cur []int
}

func (r *rows) grow(n int) {
	if cap(r.cur) < n {
		r.prev2, r.prev, r.cur = make([]int, n), make([]int, n), make([]int, n)
	}
}

func (r *rows) distance(a, b []rune) int {
	r.grow(len(b) + 1)
	prev2, prev, cur := r.prev2[:len(b)+1], r.prev[:len(b)+1], r.cur[:len(b)+1]
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			d := min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && a[i-1] == b[j-2] && a[i-2] == b[j-1] {
				d = min(d, prev2[j-2]+1)
			}
			cur[j] = d
		}
		prev2, prev, cur = prev, cur, prev2
	}
	return prev[len(b)]
}

// Closest returns the candidate nearest to name, and false when none is
// near enough to be a likely slip. Letter case and the look-alikes 0/O and
// 1/l count as half a mistake each; the allowance grows with the name's
// length (one mistake up to four characters, two up to eight, then a
// third of the length). Ties go to the earlier candidate, so callers list
// the likelier names first. The name itself is never suggested.
func Closest(name string, candidates []string) (string, bool) {
	rn := []rune(name)
	if len(rn) == 0 || len(rn) > maxLen {
		return "", false
	}
	folded := Fold(rn)
	var r rows
	r.grow(maxLen + 1)
	var rc, fc [maxLen]rune
	best, bestScore := "", -1
	for _, c := range candidates {
		if c == name {
			continue
		}
		n := 0
		for _, x := range c {
			if n == maxLen {
				n = maxLen + 1
				break
			}
			rc[n] = x
			n++
		}
		if n > maxLen || abs(n-len(rn)) > allowance(len(rn)) {
			continue
		}
		foldInto(fc[:n], rc[:n])
		// Twice the folded distance, plus one for each slip that folding
		// hid: a case or look-alike slip costs 1, any other 2.
		folds := r.distance(folded, fc[:n])
		if folds > allowance(len(rn)) {
			continue
		}
		exact := r.distance(rn, rc[:n])
		score := 2*folds + (exact - folds)
		if score > 2*allowance(len(rn)) {
			continue
		}
		if bestScore < 0 || score < bestScore {
			best, bestScore = c, score
		}
	}
	return best, bestScore >= 0
}

// allowance is how many mistakes a name of n characters may carry.
func allowance(n int) int {
	switch {
	case n <= 4:
		return 1
	case n <= 8:
		return 2
	}
	return n / 3
}

// Fold maps a name to lower case with the digit look-alikes of letters
// (0 for O, 1 for l) replaced by the letters: the form in which Closest
// counts such slips as half a mistake.
func Fold(rs []rune) []rune {
	out := make([]rune, len(rs))
	foldInto(out, rs)
	return out
}

// foldInto writes the folded form of rs into out (of the same length).
func foldInto(out, rs []rune) {
	for i, r := range rs {
		switch r {
		case '0':
			r = 'o'
		case '1':
			r = 'l'
		}
		out[i] = unicode.ToLower(r)
	}
}

func abs(n int) int {
	if n < 0 {
		return -n
	}
	return n
}

// Phrase is the "did you mean" clause for name among candidates (such as
// `did you mean "table"?`), or "" when none is close.
func Phrase(name string, candidates []string) string {
	if c, ok := Closest(name, candidates); ok {
		return DidYouMean(c)
	}
	return ""
}

// DidYouMean words a suggestion: `did you mean "x"?`.
func DidYouMean(s string) string {
	var b strings.Builder
	b.WriteString("did you mean ")
	b.WriteString(quote(s))
	b.WriteString("?")
	return b.String()
}

// quote puts s in double quotes without Go escapes, which would show
// non-ASCII names such as °C as escape sequences.
func quote(s string) string { return "\"" + s + "\"" }
