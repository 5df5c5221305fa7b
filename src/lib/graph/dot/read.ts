/**
 * Reading DOT into a Diagram: the text is parsed (lexer.ts, parser.ts) into Graphviz's nodes
 * and edges, each edge becomes the arrow Graphviz draws (direction.ts), and Causeway's own
 * meaning is read from node attributes of its own naming (Graphviz ignores unknown ones):
 *
 *   role="exposure" | "outcome" | "adjusted" (comma-separated when several)
 *   measured=false  (absent = measured)
 *   pos="x,y"       (Graphviz's y axis points up, the canvas's down: y is negated)
 *   label, note     (text; the graph's `label` is the diagram title)
 *   data_column, data_kind, data_reference, data_labels   (the link to a data table;
 *                   data_column="" = no data; data_labels is a JSON object value → name)
 * and the edge attribute `note` (why the arrow is assumed). Every other attribute is kept as
 * written in `extra` (HTML-like values as `{ html: "…" }`), so DOT → Diagram → DOT keeps what
 * Causeway does not use. Any problem is an InputError naming the line and column; nothing is
 * returned half-read. O(length of the text + nodes + edges).
 */
import { DATA_KINDS, isEmptyVariableData, isUnsafeKey, type Arrow, type DataKind, type Diagram, type Extra, type Variable, type VariableData } from '../diagram';
import { InputError, quote } from '../errors';
import { APP_READ_LIMITS, assertDiagramTextSize, assertDiagramWithinLimits, type ReadLimits } from '../size-limits';
import { orientEdge } from './direction';
import { positionsIn, type At } from './lexer';
import { parseDotGraph, type Attr, type Attrs, type DotNode } from './parser';
import { decodeText } from './text';

export const ROLE_WORDS = ['exposure', 'outcome', 'adjusted'] as const;
export type RoleWord = (typeof ROLE_WORDS)[number];
const DATA_ATTRIBUTES = ['data_column', 'data_kind', 'data_reference', 'data_labels'] as const;
export const OWN_NODE_ATTRIBUTES: ReadonlySet<string> = new Set(['label', 'role', 'measured', 'pos', 'note', ...DATA_ATTRIBUTES]);
/** `dir` is read as the arrow's direction (direction.ts), so it is not kept. */
export const OWN_EDGE_ATTRIBUTES: ReadonlySet<string> = new Set(['note', 'dir']);

/**
 * Reads a DOT digraph. Throws InputError naming the line and column of a syntax error, of an
 * undirected graph or edge, of an edge with no single direction, or of a Causeway attribute
 * with a bad value (role, measured, pos, data_*), and naming the limit when the file is larger
 * than `limits` allow.
 */
export function parseDot(text: string, limits: ReadLimits = APP_READ_LIMITS): Diagram {
	assertDiagramTextSize(text, limits);
	// A byte-order mark becomes a space, so that every offset (and so every position) stays.
	const source = text.charCodeAt(0) === 0xfeff ? ' ' + text.slice(1) : text;
	if (source.trim() === '') throw new InputError('The file is empty: expected a DOT digraph', '1:1');
	const at = positionsIn(source);
	const graph = parseDotGraph(source, at, limits);
	const edges = graph.edges.map((e) => orientEdge(e, at));
	const diagram = toDiagram(graph.name, graph.attrs, graph.nodes, edges, at);
	assertDiagramWithinLimits(diagram, limits);
	return diagram;
}

/** A node's data_* attributes as settings; undefined when it has none. */
function readVariableData(attrs: Attrs, text: (a: Attr) => string, bad: (a: Attr, what: string) => InputError): VariableData | undefined {
	const data: VariableData = {};
	const column = attrs.get('data_column');
	if (column) data.column = text(column) === '' ? null : text(column);
	const kind = attrs.get('data_kind');
	if (kind) {
		const k = text(kind).trim().toLowerCase();
		if (!(DATA_KINDS as readonly string[]).includes(k)) throw bad(kind, `data_kind ${quote(text(kind))} is not one of ${DATA_KINDS.join(', ')}`);
		data.kind = k as DataKind;
	}
	const reference = attrs.get('data_reference');
	if (reference) data.reference = text(reference);
	const labels = attrs.get('data_labels');
	if (labels) {
		let parsed: unknown;
		try {
			parsed = JSON.parse(text(labels), (key: string, value: unknown) => (isUnsafeKey(key) ? undefined : value));
		} catch {
			parsed = undefined;
		}
		if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed) || Object.values(parsed).some((x) => typeof x !== 'string')) {
			throw bad(labels, 'data_labels must be a JSON object of value → name, e.g. {"0": "manual"}');
		}
		const list = Object.entries(parsed as Record<string, string>).map(([value, label]) => ({ value, label }));
		if (list.length > 0) data.labels = list;
	}
	return isEmptyVariableData(data) ? undefined : data;
}

function readVariable(node: DotNode, graphName: string, roles: Record<RoleWord, string[]>, at: At): Variable {
	const { id, attrs } = node;
	const bad = (a: Attr, what: string): InputError => {
		const p = at(a.offset);
		return new InputError(`Node ${quote(id)}: ${what} (${p.phrase})`, p.where);
	};
	const text = (a: Attr) => decodeText(a.value, a.html, { node: id, graph: graphName });
	const label = attrs.get('label');
	const v: Variable = { id, label: label ? text(label) : id, measured: true };

	const role = attrs.get('role');
	if (role) {
		for (const word of role.value.split(/[\s,]+/).filter((w) => w !== '')) {
			const w = word.toLowerCase();
			if (!(ROLE_WORDS as readonly string[]).includes(w)) throw bad(role, `role ${quote(word)} is not one of exposure, outcome, adjusted`);
			const list = roles[w as RoleWord];
			if (list[list.length - 1] !== id) list.push(id);
		}
	}
	const measured = attrs.get('measured');
	if (measured) {
		const m = measured.value.trim().toLowerCase();
		if (m === 'false' || m === 'no' || /^[-+]?0+$/.test(m)) v.measured = false;
		else if (!(m === 'true' || m === 'yes' || /^[-+]?[0-9]+$/.test(m))) throw bad(measured, `measured must be true or false, found ${quote(measured.value)}`);
	}
	const pos = attrs.get('pos');
	if (pos) {
		const match = /^\s*([^,\s!]+)\s*,\s*([^,\s!]+)\s*(?:,\s*[^,\s!]+\s*)?!?\s*$/.exec(pos.value);
		const x = match ? Number(match[1]) : NaN;
		const y = match ? -Number(match[2]) : NaN;
		if (!Number.isFinite(x) || !Number.isFinite(y)) throw bad(pos, `pos must be two numbers "x,y", found ${quote(pos.value)}`);
		v.x = x === 0 ? 0 : x;
		v.y = y === 0 ? 0 : y;
	}
	const note = attrs.get('note');
	if (note) v.note = text(note);
	const data = readVariableData(attrs, text, bad);
	if (data) v.data = data;
	const extra = extraOf(attrs, OWN_NODE_ATTRIBUTES);
	if (extra) v.extra = extra;
	return v;
}

function toDiagram(graphName: string, graphAttrs: Attrs, nodes: DotNode[], edges: { from: string; to: string; attrs: Attrs }[], at: At): Diagram {
	const roles: Record<RoleWord, string[]> = { exposure: [], outcome: [], adjusted: [] };
	const variables = nodes.map((node) => readVariable(node, graphName, roles, at));
	const arrows = edges.map(({ from, to, attrs }): Arrow => {
		const a: Arrow = { from, to };
		const note = attrs.get('note');
		if (note) a.note = decodeText(note.value, note.html, { graph: graphName });
		const extra = extraOf(attrs, OWN_EDGE_ATTRIBUTES);
		if (extra) a.extra = extra;
		return a;
	});
	const title = graphAttrs.get('label');
	const d: Diagram = {
		title: title ? decodeText(title.value, title.html, { graph: graphName }) : '',
		variables,
		arrows,
		exposures: roles.exposure,
		outcomes: roles.outcome,
		adjusted: roles.adjusted
	};
	const extra = extraOf(graphAttrs, new Set(['label']));
	if (extra) d.extra = extra;
	return d;
}

function extraOf(attrs: Attrs, own: ReadonlySet<string>): Extra | undefined {
	let extra: Extra | undefined;
	for (const [key, a] of attrs) {
		if (own.has(key) || isUnsafeKey(key)) continue;
		extra ??= {};
		extra[key] = a.html ? { html: a.value } : a.value;
	}
	return extra;
}
