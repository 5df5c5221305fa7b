// The DOT forms Graphviz reads (https://graphviz.org/doc/info/lang.html; each expectation was
// checked with `dot -Tcanon` / `dot -Tjson` of Graphviz 2.43, and the fixtures of
// dot-graphviz-reference.test.ts hold the same forms with Graphviz's output beside them), and a
// property: a random diagram written with these forms reads back to the same diagram.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { parseDot, writeDot } from '../../../src/lib/graph/dot';
import { InputError } from '../../../src/lib/graph/errors';
import { CLI_READ_LIMITS } from '../../../src/lib/graph/size-limits';
import { MAX_VARIABLES } from '../../../src/lib/limits';
import { dotError } from './dot-test-helpers';

const arrows = (text: string) => parseDot(text).arrows.map((a) => `${a.from}>${a.to}`);
const ids = (text: string) => parseDot(text).variables.map((v) => v.id);

const errorOf = dotError;

describe('ports and compass points (Graphviz keeps them as tailport / headport)', () => {
	it.each([
		['a:p:ne -> b', { tailport: 'p:ne' }],
		['a:ne -> b:sw', { tailport: 'ne', headport: 'sw' }],
		['a -> b:c', { headport: 'c' }],
		['a:e -> b:w', { tailport: 'e', headport: 'w' }],
		['"q x":"p 1":"se" -> b:<h>', { tailport: 'p 1:se', headport: { html: 'h' } }]
	])('%s is one arrow, no phantom variables', (edge, extra) => {
		const d = parseDot(`digraph { ${edge} }`);
		expect(d.variables).toHaveLength(2);
		expect(d.arrows).toEqual([{ from: d.variables[0].id, to: d.variables[1].id, extra }]);
	});

	it('drops a port on a node statement (Graphviz ignores it)', () => {
		expect(parseDot('digraph { a:p:n [shape=box] }').variables).toEqual([{ id: 'a', label: 'a', measured: true, extra: { shape: 'box' } }]);
	});

	it('writes the ports back as attributes, which read the same', () => {
		const d = parseDot('digraph { a:p:ne -> b:sw }');
		expect(writeDot(d)).toContain('a -> b [headport=sw, tailport="p:ne"];');
		expect(parseDot(writeDot(d))).toEqual(d);
	});
});

describe('subgraphs as edge endpoints (an edge to every node in the subgraph)', () => {
	it.each([
		['{a b} -> c', ['a>c', 'b>c']],
		['subgraph s {a; b} -> c', ['a>c', 'b>c']],
		['a -> {b c}', ['a>b', 'a>c']],
		['a -> {b c} -> d', ['a>b', 'a>c', 'b>d', 'c>d']],
		['{a b} -> {c d}', ['a>c', 'a>d', 'b>c', 'b>d']],
		['{a {b c}} -> d', ['a>d', 'b>d', 'c>d']],
		['{a -> b} -> c', ['a>b', 'a>c', 'b>c']],
		['subgraph s {a}; subgraph s {b} -> c', ['a>c', 'b>c']],
		['subgraph -> c', null],
		['{} -> c', []],
		['a, b -> c, d', ['a>c', 'a>d', 'b>c', 'b>d']],
		['a -> b, b -> c', ['a>b', 'a>b', 'b>c', 'b>c']] // Graphviz: a -> (b, b) -> c
	])('%s', (edges, expected) => {
		if (expected === null) expect(errorOf(`digraph { ${edges} }`).message).toBe('Invalid DOT at line 1, column 20: expected { after subgraph, found "->"');
		else expect(arrows(`digraph { ${edges} }`)).toEqual(expected);
	});

	it('gives the outer edges the outer defaults and attributes, the inner ones their own', () => {
		const d = parseDot('digraph { {node [k=1]; edge [e=2]; a; b -> z} -> c [w=3] }');
		expect(d.variables.map((v) => [v.id, v.extra])).toEqual([
			['a', { k: '1' }],
			['b', { k: '1' }],
			['z', { k: '1' }],
			['c', undefined]
		]);
		expect(d.arrows).toEqual([
			{ from: 'b', to: 'z', extra: { e: '2' } },
			{ from: 'a', to: 'c', extra: { w: '3' } },
			{ from: 'b', to: 'c', extra: { w: '3' } },
			{ from: 'z', to: 'c', extra: { w: '3' } }
		]);
	});

	it('a reopened subgraph keeps its defaults and sees its parent’s later ones', () => {
		expect(parseDot('digraph { subgraph s { node [k=1] }; subgraph s { a } }').variables[0].extra).toEqual({ k: '1' });
		expect(parseDot('digraph { subgraph s { x }; node [k=2]; subgraph s { a } }').variables[1].extra).toEqual({ k: '2' });
	});

	it('counts a chain of groups before making it', () => {
		const group = (g: number, n: number) => `{${Array.from({ length: n }, (_, i) => `g${g}_${i}`).join(' ')}}`;
		expect(errorOf(`digraph { ${group(0, 60)} -> ${group(1, 60)} -> ${group(2, 60)} -> ${group(3, 60)} }`).message).toBe(
			'The DOT file makes more than 10,000 edges; Causeway handles at most 10,000 arrows'
		);
	});
});

describe('quoted strings joined with +', () => {
	it('joins labels and names, with blanks and comments around the +', () => {
		const d = parseDot('digraph { a [label="Age" + " (years)"]; "x" + \n /* c */ "y" -> z }');
		expect(d.variables.map((v) => [v.id, v.label])).toEqual([
			['a', 'Age (years)'],
			['xy', 'xy'],
			['z', 'z']
		]);
	});
	it.each([
		['digraph { a [label="Age" + years] }', 'Invalid DOT at line 1, column 26: a + must be followed by a quoted string ("a" + "b")'],
		['digraph { a [label=Age + "x"] }', 'Invalid DOT at line 1, column 24: a + must stand between two quoted strings ("a" + "b")'],
		['digraph { a [label=<b> + "x"] }', 'Invalid DOT at line 1, column 24: a + must stand between two quoted strings ("a" + "b")']
	])('refuses %j', (text, message) => expect(errorOf(text).message).toBe(message));
});

describe('dir: Causeway reads the arrow Graphviz draws', () => {
	it('reads dir=forward (and values Graphviz does not know) as written', () => {
		expect(parseDot('digraph { a -> b [dir=forward]; c -> d [dir=BACK] }').arrows).toEqual([
			{ from: 'a', to: 'b' },
			{ from: 'c', to: 'd' }
		]);
	});

	it('reads dir=back as the arrow drawn, head to tail, with the end attributes swapped', () => {
		const d = parseDot('digraph { y -> x [dir=back, arrowtail=dot, headlabel="h", tailport=n, color=red] }');
		expect(d.arrows).toEqual([{ from: 'x', to: 'y', extra: { arrowhead: 'dot', taillabel: 'h', headport: 'n', color: 'red' } }]);
		// Written back as x -> y it is drawn the same way, and reads the same.
		expect(parseDot(writeDot(d))).toEqual(d);
	});

	it('applies an edge [dir=…] default in scope, like any edge default', () => {
		expect(arrows('digraph { edge [dir=back]; a -> b -> c; subgraph { edge [dir=forward]; d -> e } }')).toEqual(['b>a', 'c>b', 'd>e']);
	});

	it('reads a two-headed edge with one head hidden as the arrow that shows', () => {
		expect(arrows('digraph { a -> b [dir=both, arrowtail=none]; c -> d [dir=both, arrowhead=none] }')).toEqual(['a>b', 'd>c']);
	});

	it.each([
		[
			'digraph {\n  a -> b [dir=both];\n}',
			'The edge a -> b at line 2, column 5 has arrowheads at both ends (dir=both at line 2, column 15); Causeway reads one-way arrows. If a and b share a cause that was not measured, draw it as a variable: U [measured=false]; U -> a; U -> b',
			'2:5'
		],
		['digraph {\n  edge [dir=both];\n  a -> b;\n}', 'The edge a -> b at line 3, column 5 has arrowheads at both ends (dir=both at line 2, column 13)', '3:5'],
		[
			'digraph {\n  a -> "b c" [dir=none];\n}',
			'The edge a -> "b c" at line 2, column 5 is drawn without an arrowhead (dir=none at line 2, column 19), so it has no direction: write the arrow one way, a -> "b c" or "b c" -> a, with its arrowhead, or leave it out',
			'2:5'
		],
		['digraph { a -> b [arrowhead=none] }', 'is drawn without an arrowhead (arrowhead=none at line 1, column 29)', '1:13'],
		['digraph { a -> b [dir=back, arrowtail=none] }', 'is drawn without an arrowhead (dir=back with arrowtail=none at line 1, column 39)', '1:13'],
		['digraph { a -> b [dir=both, arrowhead=none, arrowtail=none] }', 'is drawn without an arrowhead (arrowhead=none and arrowtail=none at line 1, column 39)', '1:13']
	])('refuses %j, naming the edge and where dir was set', (text, message, where) => {
		const e = errorOf(text);
		expect(e.message).toContain(message);
		expect(e.where).toBe(where);
	});

	it('does not keep dir, and does not write one from a diagram', () => {
		const d: Diagram = { title: '', variables: ['a', 'b'].map((id) => ({ id, label: id, measured: true })), arrows: [{ from: 'a', to: 'b', extra: { dir: 'both' } }], exposures: [], outcomes: [], adjusted: [] };
		expect(writeDot(d)).toContain('  a -> b;');
	});
});

describe('HTML-like labels read as the lines Graphviz draws', () => {
	it.each([
		['<<table><tr><td>Age</td></tr><tr><td>years</td></tr></table>>', 'Age\nyears'],
		['<<table><tr><td>Age</td><td>(years)</td></tr><tr><td>at <b>entry</b></td></tr></table>>', 'Age (years)\nat entry'],
		['<<TABLE BORDER="0"><TR><TD>x<BR/>y</TD></TR><HR/><TR><TD>z</TD><VR/><TD>w</TD></TR></TABLE>>', 'x\ny\nz w'],
		['<Blood &amp; <i>pressure</i><br align="left"/>(mmHg) &lt;&eacute;&gt;>', 'Blood & pressure\n(mmHg) <é>'],
		['<Age   in\n  years>', 'Age in years'],
		['<<table><tr><td> </td></tr><tr><td>q&apos;s</td></tr></table>>', "q's"]
	])('%s', (label, text) => {
		expect(parseDot(`digraph { a [label=${label}] }`).variables[0].label).toBe(text);
	});
});

describe('the rest of the language, as Graphviz reads it', () => {
	it('keywords in any case, strict merging', () => {
		const d = parseDot('STRICT DiGraph { NODE [shape=box]; A -> B; A -> B; SubGraph { C } }');
		expect(d.arrows).toEqual([{ from: 'A', to: 'B' }]);
		expect(d.variables.map((v) => [v.id, v.extra])).toEqual([
			['A', { shape: 'box' }],
			['B', { shape: 'box' }],
			['C', { shape: 'box' }]
		]);
	});

	it('numerals, unicode names, and numbers that run into names (split as Graphviz splits them)', () => {
		expect(ids('digraph { 1 -> 2.5 -> -3 -> .4; Âge -> 血压; 1abc; 1.2.3 }')).toEqual(['1', '2.5', '-3', '.4', 'Âge', '血压', 'abc', '1.2', '.3']);
	});

	it('escaped quotes, line continuations (also before \\r\\n), raw line breaks, \\\\ kept', () => {
		expect(ids('digraph { "say \\"hi\\"" -> "long \\\nname" -> "cr \\\r\nlf" -> "x\\\\" }')).toEqual(['say "hi"', 'long name', 'cr lf', 'x\\\\']);
		expect(parseDot('digraph { a [label="first\nsecond"] }').variables[0].label).toBe('first\nsecond');
	});

	it('comments of every kind, anywhere between tokens; semicolons and commas as separators', () => {
		expect(arrows('# pre\ndigraph { a # x\n -> /* y */ b // z\n; c -> d;; }')).toEqual(['a>b', 'c>d']);
		expect(parseDot('digraph { a [x=1; y=2 z=3, w=4] }').variables[0].extra).toEqual({ x: '1', y: '2', z: '3', w: '4' });
	});

	it('attributes on nodes, edges and the graph, by statement and by default', () => {
		const d = parseDot('digraph G { label="T"; graph [rankdir=LR]; node [shape=box]; edge [color=red]; a [shape=oval]; a -> b [style=dashed] }');
		expect(d.title).toBe('T');
		expect(d.extra).toEqual({ rankdir: 'LR' });
		expect(d.variables.map((v) => v.extra)).toEqual([{ shape: 'oval' }, { shape: 'box' }]);
		expect(d.arrows[0].extra).toEqual({ color: 'red', style: 'dashed' });
	});

	it('an explicit key merges repeated edges, as in Graphviz', () => {
		expect(parseDot('digraph { a -> b [key=x, color=red]; a -> b [key=x, style=bold]; a -> b }').arrows).toEqual([
			{ from: 'a', to: 'b', extra: { key: 'x', color: 'red', style: 'bold' } },
			{ from: 'a', to: 'b' }
		]);
	});
});

describe('long chains (no recursion on the input)', () => {
	const chain = (n: number) => `digraph {\n  ${Array.from({ length: n }, (_, i) => `v${i}`).join(' -> ')};\n}\n`;

	it('reads a chain of 1,500 arrows (11 KB)', () => {
		const d = parseDot(chain(1501));
		expect(d.arrows).toHaveLength(1500);
		expect(d.arrows[1499]).toEqual({ from: 'v1499', to: 'v1500' });
	});

	it('names the variable limit for a chain past it, in the app and in the command', () => {
		expect(errorOf(chain(MAX_VARIABLES + 1)).message).toBe('The DOT file names more than 2,000 nodes; Causeway handles at most 2,000 variables');
		expect(parseDot(chain(MAX_VARIABLES + 1), CLI_READ_LIMITS).arrows).toHaveLength(MAX_VARIABLES);
	});

	it('reads a 100,000-variable chain with the command’s limits', () => {
		expect(parseDot(chain(100_000), CLI_READ_LIMITS).arrows).toHaveLength(99_999);
	});

	it('names the nesting limit for subgraphs nested past it', () => {
		const deep = `digraph { ${'{ '.repeat(101)}a${' }'.repeat(101)} }`;
		expect(errorOf(deep).message).toBe('The DOT file is nested too deeply to read: more than 100 levels of { } (line 1, column 209)');
		expect(ids(`digraph { ${'{ '.repeat(99)}a -> b${' }'.repeat(99)} }`)).toEqual(['a', 'b']);
	});
});

// ——— Property: a diagram written with the forms above reads back to the same diagram ———

const WORDS = ['Age', 'BMI', 'years', 'x', 'Blood', 'pressure', 'é', '血压', '&', '<', '>', '"q"'];
const htmlEscape = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
const dotString = (s: string) => `"${s.replace(/"/g, '\\"')}"`;

interface Styled {
	diagram: Diagram;
	dot: string;
}

/** A small diagram (ids, labels of words in lines, roles, arrows) and a DOT text using the forms. */
const styled: fc.Arbitrary<Styled> = fc
	.uniqueArray(fc.stringMatching(/^[a-z][a-z0-9 ]{0,6}$/), { minLength: 1, maxLength: 7 })
	.chain((idList) =>
		fc.record({
			ids: fc.constant(idList),
			labels: fc.tuple(...idList.map(() => fc.option(fc.array(fc.array(fc.constantFrom(...WORDS), { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 3 }), { nil: undefined }))),
			labelStyle: fc.tuple(...idList.map(() => fc.constantFrom('quoted', 'joined', 'html-lines', 'html-table'))),
			idStyle: fc.tuple(...idList.map(() => fc.constantFrom('quoted', 'joined'))),
			arrows: fc.uniqueArray(fc.tuple(fc.nat(idList.length - 1), fc.nat(idList.length - 1)), { maxLength: 12, selector: ([a, b]) => `${a},${b}` }),
			arrowStyle: fc.array(fc.constantFrom('plain', 'ports', 'back', 'back-default', 'grouped', 'both-hidden'), { minLength: 12, maxLength: 12 }),
			roles: fc.tuple(...idList.map(() => fc.constantFrom('', 'exposure', 'outcome', 'adjusted')))
		})
	)
	.map(({ ids, labels, labelStyle, idStyle, arrows, arrowStyle, roles }): Styled => {
		const name = (i: number) => {
			const id = ids[i];
			return idStyle[i] === 'joined' && id.length > 1 ? `${dotString(id.slice(0, 1))} + ${dotString(id.slice(1))}` : dotString(id);
		};
		const lines = ['digraph {'];
		const variables = ids.map((id, i) => {
			const words = labels[i];
			const label = words ? words.map((line) => line.join(' ')).join('\n') : id;
			let written = '';
			if (words) {
				const style = labelStyle[i];
				if (style === 'html-lines') written = `<${words.map((line) => line.map(htmlEscape).join(' ')).join('<br/>')}>`;
				else if (style === 'html-table') written = `<<table>${words.map((line) => `<tr>${line.map((w) => `<td><b>${htmlEscape(w)}</b></td>`).join('')}</tr>`).join('')}</table>>`;
				else {
					const encode = (t: string) => dotString(t.replace(/\\/g, '\\\\').replace(/\n/g, '\\n').replace(/&/g, '&amp;'));
					written = style === 'joined' && label.length > 1 ? `${encode(label.slice(0, 1))} + ${encode(label.slice(1))}` : encode(label);
				}
			}
			const attrs = [written && `label=${written}`, roles[i] && `role=${roles[i]}`].filter(Boolean);
			lines.push(`  ${name(i)}${attrs.length ? ` [${attrs.join(', ')}]` : ''};`);
			return { id, label, measured: true };
		});
		const used = arrows.map(([a, b], k) => ({ from: a, to: b, style: arrowStyle[k] }));
		for (const { from, to, style } of used) {
			if (style === 'ports') lines.push(`  ${name(from)}:p:ne -> ${name(to)}:sw;`);
			else if (style === 'back') lines.push(`  ${name(to)} -> ${name(from)} [dir=back];`);
			else if (style === 'back-default') lines.push(`  subgraph { edge [dir=back]; ${name(to)} -> ${name(from)} }`);
			else if (style === 'grouped') lines.push(`  ${name(from)} -> { ${name(to)} };`);
			else if (style === 'both-hidden') lines.push(`  ${name(from)} -> ${name(to)} [dir=both, arrowtail=none];`);
			else lines.push(`  ${name(from)} -> ${name(to)};`);
		}
		lines.push('}');
		const byRole = (r: string) => ids.filter((_, i) => roles[i] === r);
		return {
			diagram: {
				title: '',
				variables,
				arrows: used.map(({ from, to }) => ({ from: ids[from], to: ids[to] })),
				exposures: byRole('exposure'),
				outcomes: byRole('outcome'),
				adjusted: byRole('adjusted')
			},
			dot: lines.join('\n')
		};
	});

/** The diagram without what the forms add as drawing detail (ports, arrow shapes). */
function withoutDrawingDetail(d: Diagram): Diagram {
	return {
		...d,
		arrows: d.arrows.map(({ from, to, extra }) => {
			const rest = Object.fromEntries(Object.entries(extra ?? {}).filter(([k]) => !['tailport', 'headport', 'arrowtail', 'arrowhead'].includes(k)));
			return Object.keys(rest).length > 0 ? { from, to, extra: rest } : { from, to };
		})
	};
}

describe('property: diagrams written with ports, subgraph endpoints, + joins, dir and HTML labels read back the same', () => {
	it('parse(styled DOT) = diagram, and DOT → diagram → DOT → diagram is stable', () => {
		fc.assert(
			fc.property(styled, ({ diagram, dot }) => {
				const read = parseDot(dot);
				expect(withoutDrawingDetail(read)).toEqual(diagram);
				expect(parseDot(writeDot(read))).toEqual(read);
			}),
			{ numRuns: 300 }
		);
	});
});

describe('property: any sequence of DOT tokens is read or refused with an InputError', () => {
	const token = fc.constantFrom('digraph', 'strict', 'graph', 'subgraph', 'node', 'edge', '{', '}', '[', ']', '=', ';', ',', ':', '->', '--', '+', 'a', 'b', '"q"', '"x\\"', '<b>', '<', '>', '1', '-', '.5', '//c\n', '/*', '*/', '#', 'dir=back', 'dir=both', '\n', ' ');
	it('never throws anything else, and a refusal names a line and column or a limit', () => {
		fc.assert(
			fc.property(fc.array(token, { maxLength: 40 }), (tokens) => {
				const text = tokens.join(' ');
				try {
					parseDot(`digraph { ${text} }`);
					parseDot(text);
				} catch (e) {
					expect(e).toBeInstanceOf(InputError);
					expect((e as InputError).message).toMatch(/line \d+, column \d+|The file is empty|more than/);
				}
			}),
			{ numRuns: 2000 }
		);
	});
});
