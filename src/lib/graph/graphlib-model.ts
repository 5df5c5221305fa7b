/**
 * The editable graph model for the editor: a Diagram held in a @dagrejs/graphlib Graph, whose
 * node and edge operations (add, remove, predecessors, successors…) are O(1) or O(degree),
 * and back.
 *
 *  - node label: the Variable (its `id` is always re-derived from the node key);
 *  - edge label: the Arrow's `note` and `extra` (from/to are the edge's ends);
 *  - graph label: title, roles and top-level `extra` (DiagramGraphLabel).
 *
 * graphlib keeps nodes in plain objects, so a node named `__proto__`, `constructor` or
 * `toString` would collide with Object.prototype, and all-digit names would be reordered
 * (JavaScript lists integer-like keys first); graphlib also joins edge ends with the characters
 * U+0000 and U+0001. Node keys are therefore the ids themselves except in those cases (and for
 * ids starting with `~`), which are escaped: use nodeKey() and idOfNodeKey() to go between ids
 * and keys.
 */
import { Graph } from '@dagrejs/graphlib';
import type { Arrow, Diagram, Extra, Variable } from './diagram';
import { InputError } from './errors';
import { validateDiagram } from './validate';

export interface DiagramGraphLabel {
	title: string;
	exposures: string[];
	outcomes: string[];
	adjusted: string[];
	extra?: Extra;
}

export interface DiagramEdgeLabel {
	note?: string;
	extra?: Extra;
}

export type DiagramGraph = Graph<DiagramGraphLabel, Variable, DiagramEdgeLabel>;

/**
 * The graphlib node key of a variable id: the id itself in all ordinary cases; otherwise `~`
 * followed by the id in JSON string syntax. O(length of the id).
 */
export function nodeKey(id: string): string {
	return id in Object.prototype || /^[0-9]+$/.test(id) || id.startsWith('~') || /[\u0000\u0001]/.test(id) ? `~${JSON.stringify(id)}` : id;
}

/** Inverse of nodeKey. */
export function idOfNodeKey(key: string): string {
	if (!key.startsWith('~')) return key;
	try {
		const id: unknown = JSON.parse(key.slice(1));
		return typeof id === 'string' ? id : key;
	} catch {
		return key; // a key not made by nodeKey
	}
}

function copyVariable(v: Variable): Variable {
	const c: Variable = { ...v };
	if (v.extra) c.extra = { ...v.extra };
	if (v.data) c.data = { ...v.data, ...(v.data.labels ? { labels: v.data.labels.map((l) => ({ ...l })) } : {}), ...(v.data.extra ? { extra: { ...v.data.extra } } : {}) };
	return c;
}

function edgeLabel(a: Arrow): DiagramEdgeLabel {
	const label: DiagramEdgeLabel = {};
	if (a.note !== undefined) label.note = a.note;
	if (a.extra) label.extra = { ...a.extra };
	return label;
}

/**
 * Builds the graph model of a diagram (copies, so editing the graph leaves `d` unchanged).
 * O(n + m). Throws InputError when the diagram cannot be held by a simple directed graph:
 * duplicate ids, arrows naming unknown variables, or a repeated arrow. Cycles and self-loops
 * are kept (validateDiagram reports them).
 */
export function toGraphlib(d: Diagram): DiagramGraph {
	const blocking = validateDiagram(d).find((i) => i.code === 'duplicate-id' || i.code === 'unknown-arrow-end' || i.code === 'duplicate-arrow');
	if (blocking) throw new InputError(blocking.message, blocking.ids.join(', ') || undefined);
	const g: DiagramGraph = new Graph({ directed: true, multigraph: false, compound: false });
	const label: DiagramGraphLabel = { title: d.title, exposures: [...d.exposures], outcomes: [...d.outcomes], adjusted: [...d.adjusted] };
	if (d.extra) label.extra = { ...d.extra };
	g.setGraph(label);
	for (const v of d.variables) g.setNode(nodeKey(v.id), copyVariable(v));
	for (const a of d.arrows) g.setEdge(nodeKey(a.from), nodeKey(a.to), edgeLabel(a));
	return g;
}

/**
 * Reads a diagram back from the graph model. O(n + m).
 *
 * Variables and arrows that `base` (typically the diagram the graph was built from) also has
 * keep base's order; new ones follow in the graph's order. Title, roles and top-level extra
 * come from the graph label when set, else from `base`; role entries naming variables no longer
 * in the graph are dropped, so deleting a node also removes it from the question and the
 * planned set. A node without a label becomes a measured variable labelled with its id.
 */
export function fromGraphlib(g: DiagramGraph, base?: Diagram): Diagram {
	const keys = g.nodes();
	const present = new Set(keys);
	const order: string[] = [];
	const placed = new Set<string>();
	for (const v of base?.variables ?? []) {
		const k = nodeKey(v.id);
		if (present.has(k) && !placed.has(k)) {
			order.push(k);
			placed.add(k);
		}
	}
	for (const k of keys) if (!placed.has(k)) order.push(k);

	const variables = order.map((k): Variable => {
		const id = idOfNodeKey(k);
		const stored: Variable | undefined = g.node(k);
		if (!stored) return { id, label: id, measured: true };
		const v = copyVariable(stored);
		v.id = id;
		return v;
	});

	const edgeOrder: { v: string; w: string }[] = [];
	const placedEdges = new Set<string>();
	const edgeId = (v: string, w: string) => JSON.stringify([v, w]);
	for (const a of base?.arrows ?? []) {
		const v = nodeKey(a.from);
		const w = nodeKey(a.to);
		const id = edgeId(v, w);
		if (g.hasEdge(v, w) && !placedEdges.has(id)) {
			edgeOrder.push({ v, w });
			placedEdges.add(id);
		}
	}
	for (const e of g.edges()) if (!placedEdges.has(edgeId(e.v, e.w))) edgeOrder.push(e);
	const arrows = edgeOrder.map(({ v, w }): Arrow => {
		const a: Arrow = { from: idOfNodeKey(v), to: idOfNodeKey(w) };
		const stored: DiagramEdgeLabel | undefined = g.edge(v, w);
		if (stored?.note !== undefined) a.note = stored.note;
		if (stored?.extra) a.extra = { ...stored.extra };
		return a;
	});

	const label: DiagramGraphLabel | undefined = g.graph();
	const source = label ?? base;
	const keep = (ids: readonly string[] | undefined) => (ids ?? []).filter((id) => present.has(nodeKey(id)));
	const d: Diagram = {
		title: source?.title ?? '',
		variables,
		arrows,
		exposures: keep(source?.exposures),
		outcomes: keep(source?.outcomes),
		adjusted: keep(source?.adjusted)
	};
	if (source?.extra) d.extra = { ...source.extra };
	return d;
}
