package network

import (
	"strings"

	"hess/aqueous"
	"hess/lang"
	"hess/suggest"
)

// activityModel reads the activity setting: one of the models package
// aqueous provides, by name.
func (c *compiler) activityModel(id *lang.Ident) {
	name := id.Name
	if _, ok := aqueous.ByName(name); !ok {
		msg := "unknown activity model %q: use " + strings.Join(aqueous.Names(), ", ")
		if near, ok := suggest.Closest(strings.NewReplacer("_", "-", " ", "-").Replace(name), aqueous.Names()); ok {
			c.report(unknownActivityModelCheck, id.Span(), msg+" (did you mean %s?)", name, near)
			return
		}
		c.report(unknownActivityModelCheck, id.Span(), msg, name)
		return
	}
	c.net.Settings.Activity = name
	c.net.Settings.ActivitySpan = id.Span()
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
