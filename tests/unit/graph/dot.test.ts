import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { emptyDiagram, type Diagram } from '../../../src/lib/graph/diagram';
import { parseDot, writeDot } from '../../../src/lib/graph/dot';
import { InputError } from '../../../src/lib/graph/errors';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { dotError } from './dot-test-helpers';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

const errorOf = dotError;

describe('DOT round trips', () => {
	it('demo diagram → DOT → diagram is the identity', () => {
		expect(parseDot(writeDot(demo))).toEqual(demo);
	});

	it('writes roles, measured, positions (y up) and notes as Causeway attributes', () => {
		const dot = writeDot(demo);
		expect(dot).toContain('  cycling [label="Commutes by bicycle", role="exposure", pos="360,-360", note="Exposure: cycles to work at least 3 days a week"];');
		expect(dot).toContain('  health_consciousness [label="Health consciousness", measured=false, pos="300,-60", note="Personality trait; not measured in the study"];');
		expect(dot).toContain('  age [label="Age", role="adjusted", pos="80,-300", note="Years at enrolment"];');
		expect(dot).toContain('  label="Cycling to work and hypertension (demo study)";');
		expect(dot).toContain('  hypertension -> app_panel [note="Assumed: people who know they are hypertensive join fitness-app panels more often (selection into the panel)."];');
		expect(dot).toContain('  income -> hypertension;');
	});

	it('keeps labels with unicode, quotes, backslashes, ampersands and line breaks', () => {
		const d: Diagram = {
			...emptyDiagram('Vélo & "tension" \\ «artérielle»'),
			variables: [
				{ id: 'bp', label: 'Blood "pressure"\n(mmHg) ✓ 血压 \\N \\n &amp; <img onerror=alert(1)>', measured: true, note: 'line 1\nline 2\r\n\ttab \u2028 \u0001' },
				{ id: 'two words', label: 'two words', measured: true },
				{ id: 'a\\b', label: 'a\\b', measured: true },
				{ id: 'node', label: 'node', measured: true },
				{ id: 'naïve "id"\nline', label: 'x', measured: true },
				{ id: '12', label: '12', measured: true }
			],
			arrows: [{ from: 'bp', to: 'two words' }]
		};
		expect(parseDot(writeDot(d))).toEqual(d);
	});

	it('keeps unknown attributes of the graph, nodes and edges (DOT → diagram → DOT)', () => {
		const text = 'digraph { rankdir=LR; a [shape=box, fillcolor="#E69F00", tooltip="x \\"y\\" \\\\ z"]; a -> b [penwidth=2, xlabel=<<i>strong</i>>]; }';
		const d = parseDot(text);
		expect(d.extra).toEqual({ rankdir: 'LR' });
		expect(d.variables[0].extra).toEqual({ shape: 'box', fillcolor: '#E69F00', tooltip: 'x "y" \\\\ z' });
		expect(d.arrows[0].extra).toEqual({ penwidth: '2', xlabel: { html: '<i>strong</i>' } });
		const again = writeDot(d);
		expect(again).toContain('rankdir=LR;');
		expect(again).toContain('a [fillcolor="#E69F00", shape=box, tooltip="x \\"y\\" \\\\ z"];');
		expect(again).toContain('a -> b [penwidth="2", xlabel=<<i>strong</i>>];');
		expect(parseDot(again)).toEqual(d);
	});

	it('writes kept values that did not come from DOT as text', () => {
		const d: Diagram = { ...emptyDiagram(), variables: [{ id: 'a', label: 'a', measured: true, extra: { n: 3, ok: true, list: [1, 'x'], path: 'C:\\data\\' } }] };
		const back = parseDot(writeDot(d)).variables[0].extra;
		// The trailing backslash cannot end a quoted DOT string: it is doubled (the one lossy case).
		expect(back).toEqual({ list: '[1,"x"]', n: '3', ok: 'true', path: 'C:\\data\\\\' });
	});
});

describe('reading DOT', () => {
	it('expands chains and groups and flattens subgraphs', () => {
		const d = parseDot('digraph { a -> b -> c; {d e} -> f; subgraph cluster_0 { g -> a } }');
		expect(d.variables.map((v) => v.id)).toEqual(['a', 'b', 'c', 'd', 'e', 'f', 'g']);
		expect(d.arrows.map((a) => `${a.from}>${a.to}`)).toEqual(['a>b', 'b>c', 'd>f', 'e>f', 'g>a']);
	});

	it('reads roles, measured, pos and note', () => {
		const d = parseDot(`strict digraph {
			label="Study";
			x [role="exposure"]; y [role="outcome"]; c [role="adjusted", measured=true, pos="10,-20!", note="age\\nin years"];
			u [measured=false]; v [role=" Exposure , adjusted "];
			u -> x; u -> y; x -> y; c -> x; c -> y;
		}`);
		expect(d.title).toBe('Study');
		expect(d.exposures).toEqual(['x', 'v']);
		expect(d.outcomes).toEqual(['y']);
		expect(d.adjusted).toEqual(['c', 'v']);
		expect(d.variables.find((v) => v.id === 'u')?.measured).toBe(false);
		expect(d.variables.find((v) => v.id === 'c')).toEqual({ id: 'c', label: 'c', measured: true, x: 10, y: 20, note: 'age\nin years' });
	});

	it('takes HTML labels as plain text', () => {
		const d = parseDot('digraph { a [label=<<b>Body-mass</b><br/>index &amp; <i>more</i>>]; }');
		expect(d.variables[0].label).toBe('Body-mass\nindex & more');
	});

	it('decodes labels the way Graphviz draws them (entities, \\n \\l \\r, \\N, \\G)', () => {
		const d = parseDot('digraph G { label="Graph \\G"; a [label="\\N: x\\ly\\rz\\l"]; b [label="&lt;&#955;&#x3bb;&gt; &eacute; a\\\\b"]; }');
		expect(d.title).toBe('Graph G');
		expect(d.variables[0].label).toBe('a: x\ny\nz');
		// Graphviz decodes the HTML 4 entity names in every label (dot -Tsvg draws é), but not &apos; outside HTML-like labels.
		expect(d.variables[1].label).toBe('<λλ> é a\\b');
	});

	it('accepts line breaks inside quoted strings and line continuations, as Graphviz does', () => {
		const d = parseDot('digraph {\n  a [label="first\nsecond", note="joined \\\nhere"];\n  b [pos="1,2"]\n}');
		expect(d.variables[0].label).toBe('first\nsecond');
		expect(d.variables[0].note).toBe('joined here');
	});

	it('applies node and edge defaults to objects created after them, in scope', () => {
		const d = parseDot('digraph { a; node [measured=false]; b; subgraph { node [role=adjusted]; c; a } d; edge [color=red]; a -> b; }');
		expect(d.variables.map((v) => [v.id, v.measured])).toEqual([
			['a', true],
			['b', false],
			['c', false],
			['d', false]
		]);
		expect(d.adjusted).toEqual(['c']);
		expect(d.arrows[0].extra).toEqual({ color: 'red' });
	});

	it('merges repeated edges of a strict graph and keeps those of a non-strict one', () => {
		expect(parseDot('strict digraph { a -> b [color=red]; a -> b [style=bold] }').arrows).toEqual([{ from: 'a', to: 'b', extra: { color: 'red', style: 'bold' } }]);
		expect(parseDot('digraph { a -> b; a -> b }').arrows).toHaveLength(2);
	});

	it('keeps edge ports as tailport/headport', () => {
		expect(parseDot('digraph { a:p:n -> b:s }').arrows[0].extra).toEqual({ tailport: 'p:n', headport: 's' });
	});

	it('drops __proto__ and constructor attributes', () => {
		const d = parseDot('digraph { "__proto__" [__proto__="x", constructor="y", ok=1]; }');
		expect(d.variables[0].id).toBe('__proto__');
		expect(d.variables[0].extra).toEqual({ ok: '1' });
		expect(({} as Record<string, unknown>).x).toBeUndefined();
	});

	it('reads a file with a byte-order mark and comments', () => {
		expect(parseDot('\uFEFF// c\n/* b */\n# m\ndigraph { a }').variables).toHaveLength(1);
	});
});

describe('DOT errors name the line and column', () => {
	it.each([
		['graph {\n  a -- b\n}', 'This DOT file describes an undirected graph at line 1, column 1; Causeway reads directed graphs only: write digraph { … } with -> arrows', '1:1'],
		['digraph {\n  a -- b\n}', 'Undirected edge "--" at line 2, column 5: Causeway reads directed graphs only; write -> for an arrow', '2:5'],
		['digraph {\n  a -> \n}', 'Invalid DOT at line 3, column 1: expected a node name or a subgraph { … } after "->", found "}"', '3:1'],
		['digraph {\n  a [role=confounder]\n}', 'Node "a": role "confounder" is not one of exposure, outcome, adjusted (line 2, column 11)', '2:11'],
		['digraph {\n  a [measured=maybe]\n}', 'Node "a": measured must be true or false, found "maybe" (line 2, column 15)', '2:15'],
		['digraph {\n  a [pos="left"]\n}', 'Node "a": pos must be two numbers "x,y", found "left" (line 2, column 10)', '2:10'],
		// The line break inside the label counts: "b" is on line 3.
		['digraph { a [label="x\ny"]; }\n b', 'Invalid DOT at line 3, column 2: expected the end of the file after the graph\'s closing }, found "b"', '3:2'],
		['<html>', 'Invalid DOT at line 1, column 1: expected digraph { … } (a DOT file starts with digraph, or strict digraph), found an HTML-like string', '1:1'],
		// Forms Graphviz refuses too (dot: "syntax error in line 1 near …"), each with its place.
		['strict Graph { a -- b }', 'This DOT file describes an undirected graph at line 1, column 1; Causeway reads directed graphs only: write digraph { … } with -> arrows', '1:1'],
		['digraph {\n  {a -- b} -> c\n}', 'Undirected edge "--" at line 2, column 6: Causeway reads directed graphs only; write -> for an arrow', '2:6'],
		['digraph { a } digraph { b }', 'Invalid DOT at line 1, column 15: a second graph starts here; Causeway reads one diagram per file', '1:15'],
		['digraph { a [shape] }', 'Invalid DOT at line 1, column 19: expected = after the attribute name "shape" (name=value), found "]"', '1:19'],
		['digraph { a: -> b }', 'Invalid DOT at line 1, column 14: expected a port name after "a:", found "->"', '1:14'],
		['digraph { a:p: -> b }', 'Invalid DOT at line 1, column 16: expected a compass point (n, ne, e, se, s, sw, w, nw, c or _) after the port, found "->"', '1:16'],
		['digraph { a, -> b }', 'Invalid DOT at line 1, column 14: expected a node name after ",", found "->"', '1:14'],
		['digraph {\n  a\f-> b\n}', 'Invalid DOT at line 2, column 4: unexpected character the control character U+000C', '2:4'],
		['digraph { a -> b @ }', 'Invalid DOT at line 1, column 18: unexpected character "@"', '1:18'],
		['strict { a }', 'Invalid DOT at line 1, column 8: expected digraph after strict, found "{"', '1:8'],
		['digraph a b { }', 'Invalid DOT at line 1, column 11: expected { after digraph, found "b"', '1:11'],
		['digraph { a = }', 'Invalid DOT at line 1, column 15: expected a value after "a" =, found "}"', '1:15'],
		['digraph { ] }', 'Invalid DOT at line 1, column 11: expected a statement (a node, an edge a -> b, an attribute or a subgraph) or }, found "]"', '1:11'],
		['digraph { a [label=<x] }', 'Invalid DOT at line 1, column 20: this HTML-like string (<…>) is never closed', '1:20']
	])('%j', (text, message, where) => {
		const e = errorOf(text);
		expect(e.message).toBe(message);
		expect(e.where).toBe(where);
	});

	it('says the file is empty', () => {
		expect(errorOf(' \n ').message).toBe('The file is empty: expected a DOT digraph');
	});
});

describe('writing DOT refuses what DOT cannot hold', () => {
	const base: Diagram = { ...emptyDiagram(), variables: [{ id: 'a', label: 'a', measured: true }] };
	it.each([
		[{ ...base, arrows: [{ from: 'a', to: 'b' }] }, 'Cannot write DOT: Arrow 1 (a → b) points to "b", which is not a variable'],
		[{ ...base, exposures: ['q'] }, 'Cannot write DOT: Exposure "q" is not a variable'],
		[{ ...base, variables: [...base.variables, ...base.variables] }, 'Cannot write DOT: Variable 2 has the id "a", already used by variable 1'],
		[{ ...base, variables: [{ id: 'ends\\', label: 'x', measured: true }] }, 'Cannot write DOT: variable id "ends\\\\" has a backslash before a quote, a line break or the end, which DOT cannot hold'],
		[{ ...base, variables: [{ id: 'a', label: 'a', measured: true, x: Infinity, y: 0 }] }, 'Cannot write DOT: variable "a" has a position that is not a finite number']
	] as [Diagram, string][])('%#', (d, message) => {
		expect(() => writeDot(d)).toThrow(InputError);
		expect(() => writeDot(d)).toThrow(message);
	});
});
