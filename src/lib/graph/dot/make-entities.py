#!/usr/bin/env python3
"""Writes entities.ts beside this file: the named character entities Graphviz decodes in
label text, found by asking Graphviz itself. Every HTML 4 entity name (Python's
html.entities.name2codepoint, 252 names) and `apos` is put in a label and drawn with
`dot -Tsvg`; the names whose text came out decoded, with the character drawn, make the
table (Graphviz 2.43 from Debian decodes 251 of them: not `thetasym`, and not `apos` outside
HTML-like labels). Run from anywhere: python3 src/lib/graph/dot/make-entities.py
"""
import html
import html.entities
import os
import re
import subprocess

names = sorted(set(html.entities.name2codepoint) | {'apos'})
dot = 'digraph {\n' + '\n'.join(f'n{i} [label="&{n};"]' for i, n in enumerate(names)) + '\n}\n'
svg = subprocess.run(['dot', '-Tsvg'], input=dot.encode(), capture_output=True, check=True).stdout.decode()
drawn = {}
for m in re.finditer(r'<title>n(\d+)</title>\s*<[^>]*>\s*<text[^>]*>(.*?)</text>', svg, re.S):
    name = names[int(m.group(1))]
    text = html.unescape(m.group(2))
    if text != f'&{name};':
        drawn[name] = text
assert len(drawn) > 200, 'Graphviz decoded fewer entities than expected'
for name, text in drawn.items():
    assert len(text) == 1 and ord(text) == html.entities.name2codepoint[name], name

pairs = [f'{n}:{ord(drawn[n])}' for n in sorted(drawn)]
lines, line = [], ''
for p in pairs:
    if len(line) + len(p) > 110:
        lines.append(line)
        line = ''
    line += p + ','
lines.append(line.rstrip(','))
body = ' +\n'.join(f"\t'{l}'" for l in lines)
out = f"""// Written by make-entities.py (beside this file) from what Graphviz's `dot -Tsvg` draws: the named
// character entities Graphviz decodes in label text (the HTML 4 names but `thetasym`; `apos` only
// in HTML-like labels, where XML decodes it). Do not edit by hand.

const TABLE =
{body};

/** Entity name → character, as Graphviz decodes it in every label. */
export const GRAPHVIZ_ENTITIES: ReadonlyMap<string, string> = new Map(
	TABLE.split(',').map((pair) => {{
		const [name, code] = pair.split(':');
		return [name, String.fromCodePoint(Number(code))];
	}})
);
"""
with open(os.path.join(os.path.dirname(os.path.abspath(__file__)), 'entities.ts'), 'w') as f:
    f.write(out)
print(f'{len(drawn)} entities')
