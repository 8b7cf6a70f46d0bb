package figures

import (
	"fmt"
	"strings"
	"unicode"
	"unicode/utf8"
)

// listLimit is the number of items a generated description lists before it
// says how many more there are.
const listLimit = 10

// capitalize upper-cases the first letter of s.
func capitalize(s string) string {
	r, n := utf8.DecodeRuneInString(s)
	if n == 0 {
		return s
	}
	return string(unicode.ToUpper(r)) + s[n:]
}

// joinLimited joins at most listLimit parts and says how many were left out.
func joinLimited(parts []string, sep string, limit int) string {
	if len(parts) <= limit {
		return strings.Join(parts, sep)
	}
	return strings.Join(parts[:limit], sep) + fmt.Sprintf("%sand %d more", sep, len(parts)-limit)
}

// listValues lists "North 412, South 388, East 301".
func listValues(cats []string, vals []float64, format func(float64) string) string {
	parts := make([]string, len(cats))
	for i, c := range cats {
		parts[i] = c + " " + format(vals[i])
	}
	return joinLimited(parts, ", ", listLimit)
}

// listGroups lists every category with its series values:
// "North: 2025 412, 2026 430; South: …".
func listGroups(s Spec, sep string, format func(float64) string) string {
	parts := make([]string, len(s.Categories))
	for i, c := range s.Categories {
		var vs []string
		for _, ser := range s.Series {
			vs = append(vs, orDefault(ser.Name, "value")+" "+format(ser.Values[i]))
		}
		parts[i] = c + ": " + strings.Join(vs, ", ")
	}
	return joinLimited(parts, sep, 8)
}

// seriesWord names the series of s for a description: "2025 and 2026".
func seriesWord(s Spec) string {
	var names []string
	for _, ser := range s.Series {
		if ser.Name != "" {
			names = append(names, ser.Name)
		}
	}
	switch len(names) {
	case 0:
		return "series"
	case 1:
		return names[0]
	}
	return strings.Join(names[:len(names)-1], ", ") + " and " + names[len(names)-1]
}
