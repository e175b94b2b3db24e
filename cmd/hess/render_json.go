package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"

	"hess/lang"
)

// jsonReport is the document `check --format json` prints.
type jsonReport struct {
	Files       []string         `json:"files"`
	Diagnostics []jsonDiagnostic `json:"diagnostics"`
	Summary     jsonSummary      `json:"summary"`
}

// jsonDiagnostic is one finding. Lines and columns are 1-based, columns
// count Unicode code points, and EndColumn is the column just after the
// subject's last character. A diagnostic without a position has 0 there.
type jsonDiagnostic struct {
	File      string        `json:"file"`
	Line      int           `json:"line"`
	Column    int           `json:"column"`
	EndLine   int           `json:"endLine"`
	EndColumn int           `json:"endColumn"`
	Severity  string        `json:"severity"`
	Code      string        `json:"code"`
	Message   string        `json:"message"`
	Detail    string        `json:"detail,omitempty"`
	Related   []jsonRelated `json:"related"`
}

// jsonRelated is a secondary location of a finding.
type jsonRelated struct {
	File    string `json:"file"`
	Line    int    `json:"line"`
	Column  int    `json:"column"`
	Message string `json:"message"`
}

// jsonSummary counts the findings by severity.
type jsonSummary struct {
	Errors   int `json:"errors"`
	Warnings int `json:"warnings"`
	Infos    int `json:"infos"`
}

// renderJSON writes the report as one indented JSON document: the files,
// every diagnostic (related locations always as an array), and the counts
// of errors, warnings and infos.
func renderJSON(w io.Writer, r *report) error {
	if r == nil {
		r = &report{}
	}
	doc := jsonReport{
		Files:       append([]string{}, r.Files...),
		Diagnostics: make([]jsonDiagnostic, 0, len(r.Diagnostics)),
		Summary: jsonSummary{
			Errors:   r.Diagnostics.Count(lang.Error),
			Warnings: r.Diagnostics.Count(lang.Warning),
			Infos:    r.Diagnostics.Count(lang.Info),
		},
	}
	for _, d := range r.Diagnostics {
		end := spanEnd(d.Subject)
		jd := jsonDiagnostic{
			File:      d.Subject.File,
			Line:      d.Subject.Start.Line,
			Column:    d.Subject.Start.Column,
			EndLine:   end.Line,
			EndColumn: end.Column,
			Severity:  d.Severity.String(),
			Code:      string(d.Code),
			Message:   d.Message,
			Detail:    d.Detail,
			Related:   make([]jsonRelated, 0, len(d.Related)),
		}
		for _, rel := range d.Related {
			jd.Related = append(jd.Related, jsonRelated{
				File:    rel.Span.File,
				Line:    rel.Span.Start.Line,
				Column:  rel.Span.Start.Column,
				Message: rel.Message,
			})
		}
		doc.Diagnostics = append(doc.Diagnostics, jd)
	}
	return writeIndentedJSON(w, doc, "JSON report")
}

// writeIndentedJSON encodes v with two-space indentation, leaving <, > and
// & unescaped so equations such as "A <-> B" stay readable.
func writeIndentedJSON(w io.Writer, v any, what string) error {
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetEscapeHTML(false)
	enc.SetIndent("", "  ")
	if err := enc.Encode(v); err != nil {
		return fmt.Errorf("encoding %s: %w", what, err)
	}
	if _, err := w.Write(buf.Bytes()); err != nil {
		return fmt.Errorf("writing %s: %w", what, err)
	}
	return nil
}

// spanEnd is the position just after s's last character, or s's start when
// the end is missing or lies before the start.
func spanEnd(s lang.Span) lang.Pos {
	e := s.End
	if !e.IsValid() || e.Line < s.Start.Line || (e.Line == s.Start.Line && e.Column < s.Start.Column) {
		return s.Start
	}
	return e
}
