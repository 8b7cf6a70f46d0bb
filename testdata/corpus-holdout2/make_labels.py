#!/usr/bin/env python3
"""Write report.md and labels.yaml of each folder named on the command line from its report.src.md.

In report.src.md every labelled sentence is followed by a marker: ⟦c⟧ for a clean sentence,
⟦f RULE,RULE⟧ for one that must be flagged by one of the rules. A marker on a block's opening
fence labels its figure. The markers are removed from report.md."""
import re, sys, os
MARK = re.compile(r' ?⟦(c|f)(?: ([a-z\-,]+))?⟧')
def snippet(seg):
    s = seg.strip()
    s = re.sub(r'^(#+ |[-*] |\d+\. |\|\s*)', '', s).strip()
    if len(s) > 90:
        s = s[:90].rstrip()
    return s
def q(s):
    return '"' + s.replace('\\', '\\\\').replace('"', '\\"') + '"'
def main(d):
    src = open(os.path.join(d, 'report.src.md'), encoding='utf-8').read().split('\n')
    out, labels = [], []
    for i, line in enumerate(src, 1):
        pos = 0
        clean = ''
        for m in MARK.finditer(line):
            seg = line[pos:m.start()]
            clean += seg
            pos = m.end()
            if line.lstrip().startswith('```candor'):
                text = line[:m.start()].strip()
            else:
                text = snippet(seg)
            labels.append((i, text, m.group(1), m.group(2)))
        clean += line[pos:]
        out.append(clean)
    for (i, text, kind, rules) in labels:
        assert text and text in out[i-1], (i, text)
    open(os.path.join(d, 'report.md'), 'w', encoding='utf-8').write('\n'.join(out))
    with open(os.path.join(d, 'labels.yaml'), 'w', encoding='utf-8') as f:
        f.write('# Labels for report.md: every claim sentence, keyed by line and a snippet of the sentence.\n')
        f.write('# expect: flag lists the rule ids that may report it; expect: clean must get no finding.\n')
        f.write('# Figure findings stand at the block\'s opening fence.\n')
        for (i, text, kind, rules) in labels:
            f.write(f'- line: {i}\n  text: {q(text)}\n')
            if kind == 'f':
                f.write('  expect: flag\n  rules: [' + ', '.join(rules.split(',')) + ']\n')
            else:
                f.write('  expect: clean\n')
    nf = sum(1 for l in labels if l[2] == 'f')
    print(f'{d}: {len(labels)} labels, {nf} flag, {len(labels)-nf} clean')
for d in sys.argv[1:]:
    main(d)
