package network

import (
	"strings"

	"hess/aqueous"
	"hess/lang"
)

// activityModel reads the activity setting: one of the models package
// aqueous provides, by name.
func (c *compiler) activityModel(id *lang.Ident) {
	name := id.Name
	if _, ok := aqueous.ByName(name); !ok {
		msg := "unknown activity model %q: use " + strings.Join(aqueous.Names(), ", ")
		if near := nearestName(name, aqueous.Names()); near != "" {
			c.report(unknownActivityModelCheck, id.Span(), msg+" (did you mean %s?)", name, near)
			return
		}
		c.report(unknownActivityModelCheck, id.Span(), msg, name)
		return
	}
	c.net.Settings.Activity = name
	c.net.Settings.ActivitySpan = id.Span()
}

// nearestName returns the candidate within two edits of name (ignoring case,
// "-" and "_"), or "".
func nearestName(name string, candidates []string) string {
	fold := func(s string) string {
		return strings.NewReplacer("-", "", "_", "", " ", "").Replace(strings.ToLower(s))
	}
	if len(name) > 64 {
		return ""
	}
	best, bestD := "", 3
	for _, c := range candidates {
		if d := editDistance(fold(name), fold(c)); d < bestD {
			best, bestD = c, d
		}
	}
	return best
}

// editDistance is the Levenshtein distance between a and b (bytes; both
// short).
func editDistance(a, b string) int {
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
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
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(b)]
}

var unknownActivityModelCheck = &Check{
	Name:     "unknown-activity-model",
	Severity: lang.Error,
	Doc: `the activity setting names no known activity model
The activity setting chooses how the activity coefficients of aqueous
solutes are computed: ideal (γ = 1, the default), davies, debye-huckel (the
extended form, with each ion's size parameter) or b-dot (Helgeson's form).
A name that is none of these is reported, with the nearest one where a
letter or two differ; the network is then evaluated as ideal.`,
}
