// parseDot against Graphviz's own reading of the same files: for each fixture
// tests/fixtures/graph/dot/NAME.dot, NAME.graphviz.json is what `dot -Tjson` (Graphviz 2.43,
// Debian) printed — written by make-graphviz-json.sh beside them. Node names and their order,
// the edges (chains, groups, subgraph endpoints, strict merging, ports and compass points) and
// every attribute value after Graphviz applied defaults and scoping must agree. Layout
// attributes that `dot` adds are ignored. Each edge must be the arrow Graphviz draws: its
// drawing operations (_hdraw_, _tdraw_) say which end got the arrowhead; drawn at the tail
// only, our arrow runs head → tail with the head/tail attributes swapped (docs/graph-io.md).
// `dir` is spent on that and `key` names the edge (Graphviz reports neither as an attribute).
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseDot } from '../../../src/lib/graph/dot';

const DIR = 'tests/fixtures/graph/dot';
const LAYOUT = new Set(['_gvid', 'name', 'pos', 'width', 'height', 'lp', 'xlp', 'head_lp', 'tail_lp', 'lheight', 'lwidth', 'bb', 'label', 'xdotversion', 'rects']);
const CAUSEWAY_OWN = new Set(['role', 'measured', 'note']);

interface GvObject {
	name: string;
	nodes?: number[];
	[key: string]: unknown;
}
interface GvEdge {
	tail: number;
	head: number;
	_hdraw_?: unknown[];
	_tdraw_?: unknown[];
	[key: string]: unknown;
}
interface GvGraph {
	name: string;
	label?: string;
	_subgraph_cnt?: number;
	objects?: GvObject[];
	edges?: GvEdge[];
	[key: string]: unknown;
}

/** Attributes Graphviz reports for an object, minus layout, as strings ("" = unset). */
function gvAttributes(o: Record<string, unknown>, skip: ReadonlySet<string>): Record<string, string> {
	const out: Record<string, string> = {};
	for (const [k, v] of Object.entries(o)) if (!LAYOUT.has(k) && !skip.has(k) && typeof v === 'string' && v !== '') out[k] = v;
	return out;
}

/** head… ↔ tail…, arrowhead ↔ arrowtail, lhead ↔ ltail: the attributes of one end of an edge. */
const otherEnd = (key: string) => key.replace(/head|tail/, (w) => (w === 'head' ? 'tail' : 'head'));

/** A Graphviz edge as the arrow it draws: [from, to, attributes]. */
function drawnArrow(e: GvEdge, names: string[]): [string, string, Record<string, string>] {
	const attrs = gvAttributes(e, new Set(['tail', 'head', 'dir', 'key']));
	const head = (e._hdraw_?.length ?? 0) > 0;
	const tail = (e._tdraw_?.length ?? 0) > 0;
	expect(head !== tail, `${names[e.tail]} -> ${names[e.head]} is drawn with one arrowhead`).toBe(true);
	if (head) return [names[e.tail], names[e.head], attrs];
	return [names[e.head], names[e.tail], Object.fromEntries(Object.entries(attrs).map(([k, v]) => [otherEnd(k), v]))];
}

/** Our extra as Graphviz prints values: HTML-like values without their outer brackets. */
function ours(extra: Record<string, unknown> | undefined): Record<string, string> {
	const out: Record<string, string> = {};
	for (const [k, v] of Object.entries(extra ?? {})) out[k] = typeof v === 'string' ? v : (v as { html: string }).html;
	return out;
}

const fixtures = readdirSync(DIR).filter((f) => f.endsWith('.dot'));

describe('parseDot reads DOT as Graphviz does', () => {
	it('has fixtures', () => expect(fixtures.length).toBeGreaterThanOrEqual(8));

	it.each(fixtures)('%s', (file) => {
		const d = parseDot(readFileSync(`${DIR}/${file}`, 'utf8'));
		const gv: GvGraph = JSON.parse(readFileSync(`${DIR}/${file.replace(/\.dot$/, '.graphviz.json')}`, 'utf8'));
		const objects = gv.objects ?? [];
		const nodes = objects.slice(gv._subgraph_cnt ?? 0);

		// Nodes, in creation order.
		expect(d.variables.map((v) => v.id)).toEqual(nodes.map((n) => n.name));
		for (const [i, node] of nodes.entries()) {
			const v = d.variables[i];
			expect(ours(v.extra), node.name).toEqual(gvAttributes(node, CAUSEWAY_OWN));
			if (node.measured !== undefined) expect(v.measured).toBe(node.measured !== 'false');
			if (node.label === '\\N') expect(v.label).toBe(v.id);
			else if (typeof node.label === 'string' && !/[\\&<]/.test(node.label)) expect(v.label).toBe(node.label);
		}

		// Edges, as a multiset with their attributes.
		const key = (from: string, to: string, attrs: Record<string, string>) => JSON.stringify([from, to, Object.entries(attrs).sort()]);
		const names = objects.map((o) => o.name);
		const gvEdges = (gv.edges ?? []).map((e) => key(...drawnArrow(e, names))).sort();
		const ourEdges = d.arrows.map((a) => key(a.from, a.to, ours(Object.fromEntries(Object.entries(a.extra ?? {}).filter(([k]) => k !== 'key'))))).sort();
		expect(ourEdges).toEqual(gvEdges);

		// Graph attributes at the top level (subgraph attributes are not the diagram's).
		const top = gvAttributes(gv, new Set(['directed', 'strict', 'objects', 'edges', '_subgraph_cnt']));
		expect(ours(d.extra)).toEqual(top);
		if (gv.label !== undefined && !/[\\&]/.test(gv.label)) expect(d.title).toBe(gv.label);
	});
});
