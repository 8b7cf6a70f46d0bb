// Package templates holds the report's HTML templates and stylesheet,
// embedded into the binary. They hold layout only; package render fills them.
package templates

import "embed"

// FS holds report.html, block.html and report.css.
//
//go:embed *.html *.css
var FS embed.FS
