// Package templates holds the text/template files of the calc sheets, one set per output
// format, embedded in the binary.
//
// Layout:
//
//	md/common.md.tmpl     shared Markdown blocks (title block, cautions, code basis)
//	md/index.md.tmpl      the index sheet in Markdown
//	md/sheet.md.tmpl      one design's sheet in Markdown
//	md/doc.md.tmpl        the calc document: every design in one Markdown file
//	tex/common.tex.tmpl   shared LaTeX preamble and blocks
//	tex/index.tex.tmpl    the index sheet as a standalone LaTeX document
//	tex/sheet.tex.tmpl    one design's sheet as a standalone LaTeX document
//	tex/doc.tex.tmpl      the calc document: every design in one LaTeX document
//	html/page.html.tmpl   the self-contained HTML page that wraps sheets rendered from Markdown
//
// The Markdown and HTML templates use the usual {{ }} delimiters; the LaTeX templates use
// << >> so that TeX braces never clash with template actions. Every string the reports
// package hands to a template is already escaped for the template's format.
package templates

import "embed"

// FS holds every template file under md/, tex/ and html/.
//
//go:embed md/*.tmpl tex/*.tmpl html/*.tmpl
var FS embed.FS

// TeXDelims are the left and right action delimiters of the LaTeX templates.
var TeXDelims = [2]string{"<<", ">>"}
