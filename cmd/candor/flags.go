package main

import (
	"fmt"
	"sort"
	"strings"
)

// flags are a subcommand's options. Options may come before or after the
// report file; each takes its value as the next word or after "=".
type flags struct {
	args   []string          // positional arguments
	values map[string]string // single-valued options
	sets   map[string]string // --set name=value
	bools  map[string]bool
}

// parseFlags reads args. valued names the options that take a value, bools
// those that do not. Single and double dashes are both accepted.
func parseFlags(args []string, valued, bools []string) (*flags, error) {
	f := &flags{values: map[string]string{}, sets: map[string]string{}, bools: map[string]bool{}}
	isIn := func(list []string, s string) bool {
		for _, x := range list {
			if x == s {
				return true
			}
		}
		return false
	}
	for i := 0; i < len(args); i++ {
		a := args[i]
		if a == "--" {
			f.args = append(f.args, args[i+1:]...)
			break
		}
		if !strings.HasPrefix(a, "-") || a == "-" {
			f.args = append(f.args, a)
			continue
		}
		name := strings.TrimLeft(a, "-")
		val, hasVal := "", false
		if k := strings.IndexByte(name, '='); k >= 0 {
			name, val, hasVal = name[:k], name[k+1:], true
		}
		switch {
		case name == "set" || isIn(valued, name):
			if !hasVal {
				if i+1 >= len(args) {
					return nil, fmt.Errorf("option -%s needs a value", name)
				}
				i++
				val = args[i]
			}
			if name == "set" {
				k, v, ok := strings.Cut(val, "=")
				if !ok || k == "" {
					return nil, fmt.Errorf("--set takes name=value, not %q", val)
				}
				f.sets[k] = v
			} else {
				f.values[name] = val
			}
		case isIn(bools, name):
			if hasVal {
				return nil, fmt.Errorf("option --%s takes no value", name)
			}
			f.bools[name] = true
		default:
			known := append(append([]string{"set"}, valued...), bools...)
			sort.Strings(known)
			return nil, fmt.Errorf("unknown option %s; this command takes --%s", a, strings.Join(known, ", --"))
		}
	}
	return f, nil
}

// report returns the single report argument.
func (f *flags) report() (string, error) {
	switch len(f.args) {
	case 1:
		return f.args[0], nil
	case 0:
		return "", fmt.Errorf("name the report file, e.g. candor build report.md")
	}
	return "", fmt.Errorf("one report at a time, not %d: %s", len(f.args), strings.Join(f.args, " "))
}
