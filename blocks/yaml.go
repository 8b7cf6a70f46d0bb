package blocks

import (
	"bytes"
	"regexp"
	"strconv"
	"strings"

	"gopkg.in/yaml.v3"
)

// PosFunc maps a line and column of a YAML text (as yaml.v3 counts them,
// 1-based) to a position in the report file.
type PosFunc func(line, col int) Pos

// At returns the report position of a YAML node.
func (pf PosFunc) At(n *yaml.Node) Pos {
	if n == nil {
		return pf(1, 1)
	}
	return pf(n.Line, n.Column)
}

var yamlLine = regexp.MustCompile(`^yaml: line (\d+): (.*)$`)

// parserErrors are the messages of yaml.v3's parser (as opposed to its
// scanner); see ParseYAML.
var parserErrors = map[string]bool{
	"did not find expected ',' or ']'": true, "did not find expected ',' or '}'": true,
	"did not find expected '-' indicator": true, "did not find expected <document start>": true,
	"did not find expected key": true, "did not find expected node content": true,
	"found undefined tag handle": true, "found incompatible YAML document": true,
}

// ParseYAML decodes text into a node tree. A syntax error comes back as an
// *Error at the line yaml.v3 names, mapped through pf.
func ParseYAML(text []byte, pf PosFunc, what string) (*yaml.Node, error) {
	var doc yaml.Node
	dec := yaml.NewDecoder(bytes.NewReader(text))
	if err := dec.Decode(&doc); err != nil {
		if err.Error() == "EOF" {
			return nil, nil
		}
		msg := err.Error()
		line := 1
		if m := yamlLine.FindStringSubmatch(msg); m != nil {
			line, _ = strconv.Atoi(m[1])
			msg = m[2]
			if parserErrors[msg] {
				// yaml.v3 counts lines from 0 in parser (not scanner) errors,
				// where the line is the start of the construct that failed.
				line++
			}
		} else {
			msg = strings.TrimPrefix(msg, "yaml: ")
		}
		col := 1
		lines := strings.Split(string(text), "\n")
		if line >= 1 && line <= len(lines) {
			col = len(lines[line-1]) - len(strings.TrimLeft(lines[line-1], " \t")) + 1
		}
		return nil, Errorf(pf(line, col), "malformed YAML in %s: %s; check the indentation and quoting on this line", what, msg)
	}
	if doc.Kind == yaml.DocumentNode && len(doc.Content) == 1 {
		return doc.Content[0], nil
	}
	return &doc, nil
}

// MapEntry is one key of a YAML mapping with its value.
type MapEntry struct {
	Key   string
	KeyN  *yaml.Node
	Value *yaml.Node
}

// Entries returns the keys of a mapping node in order, rejecting duplicates
// and keys not in allowed (with a "did you mean" suggestion). what names the
// mapping in messages ("the front matter", "block sales").
func Entries(n *yaml.Node, pf PosFunc, what string, allowed []string) ([]MapEntry, error) {
	if n.Kind != yaml.MappingNode {
		return nil, Errorf(pf.At(n), "%s must be a mapping of keys to values (key: value), not %s", what, describeNode(n))
	}
	seen := map[string]bool{}
	var out []MapEntry
	for i := 0; i+1 < len(n.Content); i += 2 {
		k, v := n.Content[i], n.Content[i+1]
		if k.Kind != yaml.ScalarNode {
			return nil, Errorf(pf.At(k), "%s: a key must be a plain word", what)
		}
		if seen[k.Value] {
			return nil, Errorf(pf.At(k), "%s: key %q appears twice; keep one", what, k.Value)
		}
		seen[k.Value] = true
		if allowed != nil && !contains(allowed, k.Value) {
			return nil, Errorf(pf.At(k), "%s: unknown key %q%s", what, k.Value, suggestOrList(k.Value, allowed))
		}
		out = append(out, MapEntry{Key: k.Value, KeyN: k, Value: v})
	}
	return out, nil
}

func suggestOrList(name string, allowed []string) string {
	if s := Suggest(name, allowed); s != "" {
		return s
	}
	return "; the keys are " + strings.Join(allowed, ", ")
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

func describeNode(n *yaml.Node) string {
	switch n.Kind {
	case yaml.ScalarNode:
		return "the value " + strconv.Quote(n.Value)
	case yaml.SequenceNode:
		return "a list"
	case yaml.MappingNode:
		return "a mapping"
	case yaml.AliasNode:
		return "an alias"
	}
	return "nothing"
}

// Scalar returns the text of a scalar node, or an error naming what was
// expected.
func Scalar(n *yaml.Node, pf PosFunc, key string) (string, error) {
	if n.Kind != yaml.ScalarNode {
		return "", Errorf(pf.At(n), "%s takes a single value, not %s", key, describeNode(n))
	}
	if n.Tag == "!!null" {
		return "", Errorf(pf.At(n), "%s needs a value", key)
	}
	return n.Value, nil
}

// ScalarList returns a scalar or a list of scalars as a list.
func ScalarList(n *yaml.Node, pf PosFunc, key string) ([]string, []Pos, error) {
	switch n.Kind {
	case yaml.ScalarNode:
		if n.Tag == "!!null" || n.Value == "" {
			return nil, nil, Errorf(pf.At(n), "%s needs a value", key)
		}
		return []string{n.Value}, []Pos{pf.At(n)}, nil
	case yaml.SequenceNode:
		var out []string
		var ps []Pos
		for _, c := range n.Content {
			if c.Kind != yaml.ScalarNode {
				return nil, nil, Errorf(pf.At(c), "%s: each entry must be a single value, not %s", key, describeNode(c))
			}
			out = append(out, c.Value)
			ps = append(ps, pf.At(c))
		}
		if len(out) == 0 {
			return nil, nil, Errorf(pf.At(n), "%s: the list is empty", key)
		}
		return out, ps, nil
	}
	return nil, nil, Errorf(pf.At(n), "%s takes a value or a list of values, not %s", key, describeNode(n))
}

// Bool reads true/false.
func Bool(n *yaml.Node, pf PosFunc, key string) (bool, error) {
	s, err := Scalar(n, pf, key)
	if err != nil {
		return false, err
	}
	switch strings.ToLower(s) {
	case "true", "yes", "on":
		return true, nil
	case "false", "no", "off":
		return false, nil
	}
	return false, Errorf(pf.At(n), "%s takes true or false, not %q", key, s)
}

// Float reads a number.
func Float(n *yaml.Node, pf PosFunc, key string) (float64, error) {
	s, err := Scalar(n, pf, key)
	if err != nil {
		return 0, err
	}
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil {
		return 0, Errorf(pf.At(n), "%s takes a number, not %q", key, s)
	}
	return v, nil
}
