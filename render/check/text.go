package check

import (
	"sort"
	"strings"
	"unicode"
	"unicode/utf8"
)

// unitText is the text of one unit as the reader sees it (inline values
// formatted), with a map from its byte offsets back to the report's source.
type unitText struct {
	text  string
	spans []textSpan
}

type textSpan struct {
	start, end  int // in text
	off, srcLen int // in Source
	ref         string
}

// newUnitText joins the parts of a unit. Where two literal parts are apart
// in the source by white space that their texts lack (a soft line break the
// pipeline did not spell out), a space is put between them.
func newUnitText(u *Unit, src []byte) *unitText {
	t := &unitText{}
	var b strings.Builder
	prevEnd := -1
	for _, p := range u.Parts {
		off, n := p.Offset, p.SrcLen
		if off < 0 {
			off = 0
		}
		if n < 0 {
			n = 0
		}
		if b.Len() > 0 && prevEnd >= 0 && off > prevEnd && off <= len(src) && prevEnd <= len(src) {
			last, _ := utf8.DecodeLastRuneInString(b.String())
			first, _ := utf8.DecodeRuneInString(p.Text)
			if !unicode.IsSpace(last) && !unicode.IsSpace(first) && strings.ContainsAny(string(src[prevEnd:off]), " \t\r\n") {
				t.spans = append(t.spans, textSpan{start: b.Len(), end: b.Len() + 1, off: prevEnd, srcLen: off - prevEnd})
				b.WriteByte(' ')
			}
		}
		if p.Text == "" {
			prevEnd = off + n
			continue
		}
		t.spans = append(t.spans, textSpan{start: b.Len(), end: b.Len() + len(p.Text), off: off, srcLen: n, ref: p.Ref})
		b.WriteString(p.Text)
		prevEnd = off + n
	}
	t.text = b.String()
	return t
}

// span returns the index of the span holding text offset i (as a start when
// end is false, as an exclusive end when it is true), or -1.
func (t *unitText) span(i int, end bool) int {
	k := sort.Search(len(t.spans), func(k int) bool {
		if end {
			return t.spans[k].end >= i
		}
		return t.spans[k].end > i
	})
	if k == len(t.spans) {
		return -1
	}
	return k
}

// src maps a text offset to a source offset; end says whether i is an
// exclusive end.
func (t *unitText) src(i int, end bool) int {
	if len(t.spans) == 0 {
		return 0
	}
	k := t.span(i, end)
	if k < 0 {
		s := t.spans[len(t.spans)-1]
		return s.off + s.srcLen
	}
	s := t.spans[k]
	if s.ref != "" {
		if end {
			return s.off + s.srcLen
		}
		return s.off
	}
	d := i - s.start
	if d < 0 {
		d = 0
	}
	if d > s.srcLen {
		d = s.srcLen
	}
	return s.off + d
}

// refAt returns the inline value's fact name at text offset i, "" if i is in
// literal text.
func (t *unitText) refAt(i int) string {
	k := t.span(i, false)
	if k < 0 || t.spans[k].start > i {
		return ""
	}
	return t.spans[k].ref
}

// lineIndex maps source offsets to 1-based lines and byte columns.
type lineIndex struct {
	starts []int
	size   int
}

func newLineIndex(src []byte) *lineIndex {
	li := &lineIndex{starts: []int{0}, size: len(src)}
	for i, c := range src {
		if c == '\n' {
			li.starts = append(li.starts, i+1)
		}
	}
	return li
}

// pos returns the line and column of offset off.
func (li *lineIndex) pos(off int) (line, col int) {
	if off < 0 {
		off = 0
	}
	if li.size > 0 && off > li.size {
		off = li.size
	}
	k := sort.Search(len(li.starts), func(k int) bool { return li.starts[k] > off }) - 1
	if k < 0 {
		k = 0
	}
	return k + 1, off - li.starts[k] + 1
}

// offset returns the source offset of a 1-based line and column.
func (li *lineIndex) offset(line, col int) int {
	if line < 1 {
		return 0
	}
	if line > len(li.starts) {
		return li.size
	}
	o := li.starts[line-1] + col - 1
	if col < 1 {
		o = li.starts[line-1]
	}
	if li.size > 0 && o > li.size {
		o = li.size
	}
	return o
}

// lineEnd returns the offset of the end of the line holding off.
func (li *lineIndex) lineEnd(src []byte, off int) int {
	for i := off; i < len(src); i++ {
		if src[i] == '\n' {
			return i
		}
	}
	return len(src)
}

// splitSentences returns the spans of the sentences of s. A sentence ends at
// ".", "!" or "?" (with any closing quotes or brackets) before white space
// and a word that does not start in lower case, unless the dot ends a known
// abbreviation ("e.g.", "approx.", "vs."), a dotted word ("a.m.") or a
// number label ("No. 5"). Decimals never end a sentence: their dot has no
// space after it.
func splitSentences(s string) [][2]int {
	var out [][2]int
	start := 0
	add := func(a, b int) {
		for a < b {
			r, n := utf8.DecodeRuneInString(s[a:])
			if !unicode.IsSpace(r) {
				break
			}
			a += n
		}
		for b > a {
			r, n := utf8.DecodeLastRuneInString(s[a:b])
			if !unicode.IsSpace(r) {
				break
			}
			b -= n
		}
		if b > a {
			out = append(out, [2]int{a, b})
		}
	}
	for i := 0; i < len(s); {
		r, n := utf8.DecodeRuneInString(s[i:])
		if r != '.' && r != '!' && r != '?' && r != '…' {
			i += n
			continue
		}
		j := i + n
		for j < len(s) {
			r2, n2 := utf8.DecodeRuneInString(s[j:])
			if strings.ContainsRune(".!?…)]\"'”’»*_", r2) {
				j += n2
				continue
			}
			break
		}
		if j < len(s) {
			r2, _ := utf8.DecodeRuneInString(s[j:])
			if !unicode.IsSpace(r2) {
				i = j
				continue
			}
		}
		if r == '.' && !sentenceDot(s, i, j) {
			i = j
			continue
		}
		add(start, j)
		start = j
		i = j
	}
	add(start, len(s))
	return out
}

// sentenceDot reports whether the dot at s[i] (with trailing punctuation up
// to j) ends a sentence.
func sentenceDot(s string, i, j int) bool {
	// The word before the dot, with inner dots ("e.g").
	k := i
	for k > 0 {
		r, n := utf8.DecodeLastRuneInString(s[:k])
		if unicode.IsLetter(r) || r == '.' {
			k -= n
			continue
		}
		break
	}
	word := strings.ToLower(s[k:i])
	// The next word.
	m := j
	for m < len(s) {
		r, n := utf8.DecodeRuneInString(s[m:])
		if !unicode.IsSpace(r) {
			break
		}
		m += n
	}
	if m >= len(s) {
		return true
	}
	next, _ := utf8.DecodeRuneInString(s[m:])
	if unicode.IsLower(next) {
		return false
	}
	if word == "" {
		return true
	}
	switch word {
	case "no", "nos", "nr", "p", "pp", "fig", "figs", "vol", "eq":
		// "No. 5", "p. 12": a label before a number.
		return !unicode.IsDigit(next)
	case "etc":
		return true
	}
	if strings.Contains(word, ".") {
		// e.g, i.e, a.m, u.s: a dotted abbreviation. "a.m." can end a
		// sentence, but splitting there costs less than splitting "e.g."
		return false
	}
	return !abbreviations[word]
}
