package archive

import (
	"bytes"
	"strings"
	"unicode"

	"colsheet/calc/trace"
	"colsheet/reports"
)

// checkSheet compares every step printed on the Markdown sheet p (data) with its step in
// results.json: the anchor of a step (a line starting with <a id="s-…">) is followed by its
// title line and then its formula and result, whose first bold number must be the step's value
// as the sheets print it (reports.MarkdownNumber), and whose verdict, for a check, the step's.
func (r *Report) checkSheet(p string, data []byte, steps map[string]trace.Step) {
	const open, shut = `<a id="`, `"></a>`
	lines := strings.Split(string(bytes.ReplaceAll(data, []byte("\r\n"), []byte("\n"))), "\n")
	for i := 0; i < len(lines); i++ {
		// A brief sheet starts a step's line with its anchor; a full one puts the anchor in a heading.
		line, full := lines[i], false
		if h := strings.TrimLeft(line, "#"); h != line && strings.HasPrefix(h, " "+open+"s-") {
			line, full = h[1:], true
		}
		if !strings.HasPrefix(line, open+"s-") {
			continue
		}
		end := strings.Index(line, shut)
		if end < 0 {
			continue
		}
		anchor := line[len(open):end]
		s, ok := steps[anchor]
		if !ok {
			r.problem(nil, p, "the sheet prints the step %s, which results.json does not hold", anchor)
			continue
		}
		r.Printed++
		// The formula and result: the lines after the anchor's line, up to the next blank line
		// (brief) or the next heading (full), and never past the next anchor.
		var body strings.Builder
		for j := i + 1; j < len(lines); j++ {
			l := lines[j]
			if strings.HasPrefix(l, "#") || strings.HasPrefix(l, open) || !full && l == "" {
				break
			}
			body.WriteString(l)
			body.WriteByte('\n')
		}
		want, isNum := reports.MarkdownNumber(s)
		bold := boldSpans(body.String())
		if len(bold) == 0 {
			if isNum {
				r.problem(nil, p, "step %s: the sheet prints no result, results.json records %.12g", s.ID, s.Value)
			}
			continue
		}
		if isNum {
			got := bold[0]
			if k := strings.LastIndex(got, "= "); k >= 0 {
				got = got[k+2:]
			}
			if k := strings.IndexFunc(got, unicode.IsSpace); k >= 0 {
				got = got[:k]
			}
			if got != want {
				r.problem(nil, p, "step %s: the sheet prints %s, its step records %s (%.12g)", s.ID, got, want, s.Value)
				continue
			}
		}
		if s.Kind == trace.KindCheck {
			verdict := ""
			for _, b := range bold {
				if b == "PASS" || b == "FAIL" {
					verdict = strings.ToLower(b)
				}
			}
			if verdict != "" && verdict != s.Verdict {
				r.problem(nil, p, "step %s: the sheet prints the verdict %s, its step records %s", s.ID, verdict, s.Verdict)
			}
		}
	}
}

// boldSpans returns the texts between pairs of "**" in s, in order.
func boldSpans(s string) []string {
	var out []string
	for {
		i := strings.Index(s, "**")
		if i < 0 {
			return out
		}
		j := strings.Index(s[i+2:], "**")
		if j < 0 {
			return out
		}
		b := strings.NewReplacer("<mark>", "", "</mark>", "").Replace(s[i+2 : i+2+j])
		out = append(out, b)
		s = s[i+2+j+2:]
	}
}
