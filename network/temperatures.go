package network

import (
	"errors"
	"fmt"
	"strings"

	"hess/lang"
)

// ParseTemperatures reads a temperature list written as in the settings
// key `temperatures`: "298.15 K, 700 K to 1200 K by 100 K". It returns the
// temperatures in K, or an error that says what is wrong.
func ParseTemperatures(text string) ([]float64, error) {
	if strings.TrimSpace(text) == "" {
		return nil, errors.New("no temperatures given")
	}
	if strings.ContainsAny(text, "{}#\n\r") {
		return nil, fmt.Errorf("temperatures %q: only temperatures, commas, `to` and `by` may appear", text)
	}
	const prefix = "settings { temperatures "
	src := prefix + text + " }"
	ast, diags := lang.Parse("--temperatures", []byte(src))
	if err := firstError(diags, len(prefix)); err != nil {
		return nil, fmt.Errorf("temperatures %q: %w", text, err)
	}
	var items []*lang.TempSet
	for _, st := range ast.Statements {
		if st.Settings == nil {
			continue
		}
		for _, it := range st.Settings.Items {
			items = append(items, it.Temperatures...)
		}
	}
	if len(items) == 0 {
		return nil, fmt.Errorf("temperatures %q: no temperature found", text)
	}
	c := &compiler{net: &Network{}}
	ts, ok := c.temperatures(items)
	if err := firstError(c.net.Diagnostics, len(prefix)); err != nil {
		return nil, fmt.Errorf("temperatures %q: %w", text, err)
	}
	if !ok {
		return nil, fmt.Errorf("temperatures %q: not a temperature list", text)
	}
	return ts, nil
}

// firstError turns the first diagnostic into an error whose column counts
// from the start of the user's text.
func firstError(ds lang.Diagnostics, offset int) error {
	for _, d := range ds {
		col := d.Subject.Start.Column - offset
		if col < 1 {
			col = 1
		}
		return fmt.Errorf("column %d: %s", col, d.Message)
	}
	return nil
}
