// writeDot's output fed to Graphviz itself: `dot -Tsvg` must accept it without a warning and
// draw every label exactly as its text — also hostile labels with markup, quotes, backslashes,
// escape-like sequences and line breaks. Skipped (with a message) where Graphviz is not installed.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { emptyDiagram, type Diagram } from '../../../src/lib/graph/diagram';
import { writeDot } from '../../../src/lib/graph/dot';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { hasGraphviz, xmlText } from './dot-test-helpers';

const graphviz = hasGraphviz();
if (!graphviz) console.warn('Graphviz `dot` not found: skipping the DOT rendering checks (apt-get install graphviz)');

function renderSvg(dot: string): string {
	const run = spawnSync('dot', ['-Tsvg'], { input: dot, encoding: 'utf8' });
	expect(run.stderr, 'Graphviz warnings or errors').toBe('');
	expect(run.status).toBe(0);
	return run.stdout;
}

/** Node name → the lines of text Graphviz drew in that node, from the SVG. */
function drawnLabels(svg: string): Map<string, string[]> {
	const out = new Map<string, string[]>();
	for (const m of svg.matchAll(/<g id="node\d+" class="node">\s*<title>([^]*?)<\/title>([^]*?)<\/g>/g)) {
		out.set(
			xmlText(m[1]),
			[...m[2].matchAll(/<text[^>]*>([^]*?)<\/text>/g)].map((t) => xmlText(t[1]))
		);
	}
	return out;
}

const hostile: Diagram = {
	...emptyDiagram('Title with "quotes" & <b>markup</b> \\ and \\N'),
	variables: [
		{ id: 'x', label: '<img src=x onerror=alert(1)>', measured: true },
		{ id: 'quotes', label: 'He said "hi" \'there\'', measured: true },
		{ id: 'slashes', label: 'C:\\temp\\new \\N \\G \\l \\\\', measured: true },
		{ id: 'lines', label: 'first line\nsecond "line"\nthird', measured: true },
		{ id: 'entities', label: '&amp; &lt;b&gt; &#65; & alone', measured: true },
		{ id: 'two words', label: 'two words', measured: true },
		{ id: 'node', label: 'node', measured: false },
		{ id: 'a"b', label: 'Blutdruck Ü 血压 → ✓', measured: true, note: 'note with "quotes"\nand a line break' }
	],
	arrows: [
		{ from: 'x', to: 'quotes' },
		{ from: 'two words', to: 'node' },
		{ from: 'a"b', to: 'lines' }
	]
};

describe.skipIf(!graphviz)('Graphviz draws writeDot output as is', () => {
	it('renders the demo diagram with every label', () => {
		const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));
		const drawn = drawnLabels(renderSvg(writeDot(demo)));
		expect(drawn.size).toBe(demo.variables.length);
		for (const v of demo.variables) expect(drawn.get(v.id)?.join('\n'), v.id).toBe(v.label);
	});

	it('renders hostile labels as plain text, never as markup', () => {
		const svg = renderSvg(writeDot(hostile));
		const drawn = drawnLabels(svg);
		for (const v of hostile.variables) expect(drawn.get(v.id)?.join('\n'), v.id).toBe(v.label);
		expect(svg).not.toMatch(/<img/i);
		expect(svg).not.toMatch(/<b>/);
		// The graph title is drawn as a <text> outside the nodes.
		const texts = [...svg.matchAll(/<text[^>]*>([^]*?)<\/text>/g)].map((t) => xmlText(t[1]));
		expect(texts).toContain(hostile.title);
	});
});
