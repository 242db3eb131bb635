// Package reports turns a design.Result and its trace into documents: results.json, a CSV
// summary, and calc sheets in Markdown, LaTeX and HTML.
//
// The renderers never compute an engineering value. They only format what the engine
// recorded: scaling to display units (N to kN, N·mm to kNm), rounding and escaping.
package reports
