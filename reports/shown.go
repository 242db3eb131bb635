package reports

import "colsheet/calc/trace"

// StepAnchor returns the anchor name that every format gives the step with the full ID id.
func StepAnchor(id string) string { return anchorName("s-", id) }

// MarkdownNumber returns the result of step s as the Markdown sheets print it (its value in the
// display unit, four significant figures, "−" for a minus, "×10<sup>…</sup>" for a power of
// ten), and false where the sheets show the result in words (Step.Show) instead of a number.
func MarkdownNumber(s trace.Step) (string, bool) {
	if s.Show != nil && s.Show.Result != "" {
		return "", false
	}
	n, _ := quantityOf(s.Value, s.Unit, s.Symbol)
	return md{}.num(n), true
}
