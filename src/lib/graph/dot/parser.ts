/**
 * The DOT parser: tokens → the nodes, edges and attributes Graphviz builds from them, by the
 * grammar of Graphviz's own parser (lib/cgraph/grammar.y, Graphviz 2.43) and its meaning:
 *
 * - `a -> b -> c` is one edge per consecutive pair; an endpoint may be a comma list `a, b`
 *   or a subgraph `{a b}` / `subgraph s {…}`, which stands for every node in it (nested
 *   subgraphs and earlier openings of the same named subgraph included): `{a b} -> {c d}` is
 *   four edges;
 * - ports and compass points (`a:p`, `a:p:ne`, `a:ne`) are kept as the edge's `tailport` /
 *   `headport`, as Graphviz keeps them; on a node statement they are dropped;
 * - a node is created where it is first named, with the `node [...]` defaults then in force in
 *   its (sub)graph; an edge gets the `edge [...]` defaults in force where its statement ends; a
 *   subgraph sees its parent's defaults, and a reopened named subgraph keeps its own;
 * - a strict graph merges repeated edges (tail, head), as does an explicit `key` attribute;
 *   later attributes win (see addEdge for a key in a strict graph);
 * - `ID = ID` and `graph [...]` at the top level are graph attributes.
 *
 * The parser is a loop over an explicit stack of open (sub)graphs, never recursive: a chain
 * of any length or subgraphs nested to the limit cost no call stack. O(tokens + edges made +
 * nodes × nesting depth). Every count is checked against the reader's limits before the
 * object is made, and a group of groups (`{…} -> {…}`) is counted before it is expanded.
 */
import { InputError } from '../errors';
import type { ReadLimits } from '../size-limits';
import { describeCount, MAX_DOT_NESTING } from '../../limits';
import { describeToken, Lexer, syntaxError, type At, type IdToken, type Token } from './lexer';

export interface Attr {
	value: string;
	html: boolean;
	/** Offset of the value in the text, for messages. */
	offset: number;
}
export type Attrs = Map<string, Attr>;
export interface DotNode {
	id: string;
	attrs: Attrs;
}
export interface DotEdge {
	from: string;
	to: string;
	attrs: Attrs;
	/** Offset of the edge's `->`, for messages. */
	offset: number;
}
export interface DotGraph {
	name: string;
	attrs: Attrs;
	nodes: DotNode[];
	edges: DotEdge[];
}

/** A subgraph object: reopening `subgraph s {…}` in the same parent adds to the same one. */
interface Subgraph {
	members: Set<string>;
	children: Map<string, Subgraph>;
	/** Defaults set inside this subgraph (its parent's apply where it sets none). */
	nodeDefaults: Attrs;
	edgeDefaults: Attrs;
}
interface NodeRef {
	id: string;
	port?: Attr;
}
/** One endpoint of an edge statement: a comma list of nodes, or a subgraph. */
type Endpoint = { refs: NodeRef[] } | { sub: Subgraph };

interface Frame {
	sub: Subgraph;
	parent: Frame | null;
	/** Defaults in force here: the parent's, overridden by this subgraph's. */
	nodeDefaults: Attrs;
	edgeDefaults: Attrs;
	/** Offset of the `{` that opened it. */
	open: number;
	depth: number;
	/** The statement being read: its endpoints, the `->` between them, and what comes next. */
	endpoints: Endpoint[];
	arrows: number[];
	expect: 'statement' | 'after-endpoint' | 'endpoint';
}

const newSubgraph = (): Subgraph => ({ members: new Set(), children: new Map(), nodeDefaults: new Map(), edgeDefaults: new Map() });

export const tooManyVariables = (l: ReadLimits) =>
	new InputError(`The DOT file names more than ${describeCount(l.variables)} nodes; ${l.reader} handles at most ${describeCount(l.variables)} variables${l.hint}`, 'variables');
export const tooManyArrows = (l: ReadLimits) =>
	new InputError(`The DOT file makes more than ${describeCount(l.arrows)} edges; ${l.reader} handles at most ${describeCount(l.arrows)} arrows${l.hint}`, 'arrows');

/** Reads the one digraph in `text`. Throws InputError naming the line and column. */
export function parseDotGraph(text: string, at: At, limits: ReadLimits): DotGraph {
	const lx = new Lexer(text, at);
	const expected = (t: Token, what: string) => syntaxError(at, t.offset, `expected ${what}, found ${describeToken(t)}`);
	const isId = (t: Token): t is IdToken => t.kind === 'id' && t.keyword !== 'subgraph';
	const attrOf = (t: IdToken): Attr => ({ value: t.value, html: t.written === 'html', offset: t.offset });

	// Header: [strict] digraph [name] {
	let t = lx.next();
	const headerStart = t.offset;
	if (t.kind === 'id' && t.keyword === 'strict') t = lx.next();
	const strict = t.offset !== headerStart;
	if (t.kind === 'id' && t.keyword === 'graph') {
		const p = at(headerStart);
		throw new InputError(`This DOT file describes an undirected graph at ${p.phrase}; Causeway reads directed graphs only: write digraph { … } with -> arrows`, p.where);
	}
	if (!(t.kind === 'id' && t.keyword === 'digraph')) throw expected(t, strict ? 'digraph after strict' : 'digraph { … } (a DOT file starts with digraph, or strict digraph)');
	t = lx.next();
	let name = '';
	if (isId(t)) {
		name = t.value;
		t = lx.next();
	}
	if (t.kind !== '{') throw expected(t, '{ after digraph');

	const graphAttrs: Attrs = new Map();
	const nodes = new Map<string, DotNode>();
	const edges: DotEdge[] = [];
	const merged = new Map<string, { edge: DotEdge; key: string | undefined }>(); // strict graphs and keyed edges: (tail, head[, key]) → edge
	let expanded = 0; // edges the statements ask for, before merging

	const root: Frame = { sub: newSubgraph(), parent: null, nodeDefaults: new Map(), edgeDefaults: new Map(), open: t.offset, depth: 1, endpoints: [], arrows: [], expect: 'statement' };
	let frame: Frame = root;

	const mention = (id: string): void => {
		if (!nodes.has(id)) {
			if (nodes.size >= limits.variables) throw tooManyVariables(limits);
			nodes.set(id, { id, attrs: new Map(frame.nodeDefaults) });
		}
		// A node named in a subgraph belongs to it and to every subgraph around it; one already
		// there is already in those around it.
		for (let f: Frame = frame; f.parent && !f.sub.members.has(id); f = f.parent) f.sub.members.add(id);
	};

	/** `a`, `a:port`, `a:port:compass`, and `, b…` after it: the nodes of one endpoint. */
	const readNodeList = (first: IdToken): NodeRef[] => {
		const refs: NodeRef[] = [];
		for (let id: IdToken = first; ; ) {
			mention(id.value);
			const ref: NodeRef = { id: id.value };
			if (lx.peek().kind === ':') {
				lx.next();
				const port = lx.next();
				if (!isId(port)) throw expected(port, `a port name after "${id.value}:"`);
				ref.port = attrOf(port);
				if (lx.peek().kind === ':') {
					lx.next();
					const compass = lx.next();
					if (!isId(compass)) throw expected(compass, 'a compass point (n, ne, e, se, s, sw, w, nw, c or _) after the port');
					ref.port = { ...ref.port, value: `${port.value}:${compass.value}` };
				}
			}
			refs.push(ref);
			if (lx.peek().kind !== ',') return refs;
			lx.next();
			const next = lx.next();
			if (!isId(next)) throw expected(next, 'a node name after ","');
			id = next;
		}
	};

	/** `[k=v, k=v; k=v] [ … ]…`: attribute lists, in order. */
	const readAttrLists = (): [string, Attr][] => {
		const list: [string, Attr][] = [];
		while (lx.peek().kind === '[') {
			lx.next();
			for (;;) {
				const key = lx.next();
				if (key.kind === ']') break;
				if (!isId(key)) throw expected(key, 'an attribute name or ]');
				const eq = lx.next();
				if (eq.kind !== '=') throw expected(eq, `= after the attribute name ${describeToken(key)} (name=value)`);
				const value = lx.next();
				if (!isId(value)) throw expected(value, `a value for the attribute ${describeToken(key)}`);
				list.push([key.value, attrOf(value)]);
				if (lx.peek().kind === ',' || lx.peek().kind === ';') lx.next();
			}
		}
		return list;
	};

	const openSubgraph = (open: Token, name: string | null): void => {
		if (frame.depth >= MAX_DOT_NESTING) {
			const p = at(open.offset);
			throw new InputError(`The DOT file is nested too deeply to read: more than ${MAX_DOT_NESTING} levels of { } (${p.phrase})`, p.where);
		}
		let sub = name === null ? undefined : frame.sub.children.get(name);
		if (!sub) {
			sub = newSubgraph();
			if (name !== null) frame.sub.children.set(name, sub);
		}
		const nodeDefaults = new Map(frame.nodeDefaults);
		for (const [k, v] of sub.nodeDefaults) nodeDefaults.set(k, v);
		const edgeDefaults = new Map(frame.edgeDefaults);
		for (const [k, v] of sub.edgeDefaults) edgeDefaults.set(k, v);
		frame = { sub, parent: frame, nodeDefaults, edgeDefaults, open: open.offset, depth: frame.depth + 1, endpoints: [], arrows: [], expect: 'statement' };
	};

	/** `subgraph [name] {` or `{`, the first token already read; false when `t` opens none. */
	const maybeSubgraph = (t: Token): boolean => {
		if (t.kind === '{') {
			openSubgraph(t, null);
			return true;
		}
		if (t.kind !== 'id' || t.keyword !== 'subgraph') return false;
		let next = lx.next();
		let subName: string | null = null;
		if (isId(next)) {
			subName = next.value;
			next = lx.next();
		}
		if (next.kind !== '{') throw expected(next, `{ after subgraph${subName === null ? '' : ` ${subName}`}`);
		openSubgraph(next, subName);
		return true;
	};

	/**
	 * Graphviz's agedge: a strict graph holds one edge per (tail, head) — a repeat without a key
	 * adds its attributes to it, a repeat with a key other than that edge's is dropped, attributes
	 * and all; elsewhere an edge with a key is the same edge as an earlier one with that key.
	 */
	const addEdge = (edge: DotEdge, key: string | undefined): void => {
		const index = strict ? JSON.stringify([edge.from, edge.to]) : key !== undefined ? JSON.stringify([edge.from, edge.to, key]) : null;
		const existing = index === null ? undefined : merged.get(index);
		if (existing) {
			if (strict && key !== undefined && existing.key !== key) return;
			for (const [k, v] of edge.attrs) existing.edge.attrs.set(k, v);
			return;
		}
		if (edges.length >= limits.arrows) throw tooManyArrows(limits);
		if (index !== null) merged.set(index, { edge, key });
		edges.push(edge);
	};

	const membersOf = (e: Endpoint): NodeRef[] => ('refs' in e ? e.refs : [...e.sub.members].map((id) => ({ id })));

	/** The statement in `frame` is complete: apply its attributes, make its edges. */
	const endStatement = (attrs: [string, Attr][]): void => {
		const { endpoints, arrows } = frame;
		if (endpoints.length === 1) {
			const only = endpoints[0];
			if ('refs' in only) for (const ref of only.refs) for (const [k, v] of attrs) nodes.get(ref.id)?.attrs.set(k, v);
		} else {
			const groups = endpoints.map(membersOf);
			for (let g = 0; g + 1 < groups.length; g++) expanded += groups[g].length * groups[g + 1].length;
			// Strict graphs merge repeats, hence the allowance beyond the arrow limit.
			if (expanded > 4 * limits.arrows) throw tooManyArrows(limits);
			let key: string | undefined;
			for (const [k, v] of attrs) if (k === 'key') key = v.value;
			for (let g = 0; g + 1 < groups.length; g++) {
				for (const tail of groups[g]) {
					for (const head of groups[g + 1]) {
						const edgeAttrs: Attrs = new Map(frame.edgeDefaults);
						for (const [k, v] of attrs) edgeAttrs.set(k, v);
						if (tail.port) edgeAttrs.set('tailport', tail.port);
						if (head.port) edgeAttrs.set('headport', head.port);
						addEdge({ from: tail.id, to: head.id, attrs: edgeAttrs, offset: arrows[g] }, key);
					}
				}
			}
		}
		frame.endpoints = [];
		frame.arrows = [];
		frame.expect = 'statement';
	};

	for (;;) {
		if (frame.expect === 'after-endpoint') {
			const next = lx.peek();
			if (next.kind === '->') {
				lx.next();
				frame.arrows.push(next.offset);
				frame.expect = 'endpoint';
			} else if (next.kind === '--') {
				const p = at(next.offset);
				throw new InputError(`Undirected edge "--" at ${p.phrase}: Causeway reads directed graphs only; write -> for an arrow`, p.where);
			} else endStatement(readAttrLists());
			continue;
		}
		const tok = lx.next();
		if (frame.expect === 'endpoint') {
			if (maybeSubgraph(tok)) continue;
			if (!isId(tok)) throw expected(tok, 'a node name or a subgraph { … } after "->"');
			frame.endpoints.push({ refs: readNodeList(tok) });
			frame.expect = 'after-endpoint';
			continue;
		}
		// A statement, or the end of this (sub)graph.
		if (tok.kind === ';') continue;
		if (tok.kind === '}') {
			const closed = frame;
			if (!closed.parent) break;
			frame = closed.parent;
			frame.endpoints.push({ sub: closed.sub });
			frame.expect = 'after-endpoint';
			continue;
		}
		if (tok.kind === 'end') throw syntaxError(at, frame.open, 'this { is never closed');
		if (maybeSubgraph(tok)) continue;
		if (tok.kind === 'id' && (tok.keyword === 'node' || tok.keyword === 'edge' || tok.keyword === 'graph') && lx.peek().kind === '[') {
			const attrs = readAttrLists();
			const { keyword } = tok;
			const target = keyword === 'node' ? [frame.nodeDefaults, frame.sub.nodeDefaults] : keyword === 'edge' ? [frame.edgeDefaults, frame.sub.edgeDefaults] : frame === root ? [graphAttrs] : [];
			for (const [k, v] of attrs) for (const map of target) map.set(k, v);
			continue;
		}
		if (!isId(tok)) throw expected(tok, 'a statement (a node, an edge a -> b, an attribute or a subgraph) or }');
		if (lx.peek().kind === '=') {
			lx.next();
			const value = lx.next();
			if (!isId(value)) throw expected(value, `a value after ${describeToken(tok)} =`);
			if (frame === root) graphAttrs.set(tok.value, attrOf(value));
			continue;
		}
		frame.endpoints.push({ refs: readNodeList(tok) });
		frame.expect = 'after-endpoint';
	}

	const after = lx.next();
	if (after.kind === '}') throw syntaxError(at, after.offset, 'this } closes nothing');
	if (after.kind === 'id' && (after.keyword === 'digraph' || after.keyword === 'graph' || after.keyword === 'strict')) {
		throw syntaxError(at, after.offset, 'a second graph starts here; Causeway reads one diagram per file');
	}
	if (after.kind !== 'end') throw expected(after, "the end of the file after the graph's closing }");
	return { name, attrs: graphAttrs, nodes: [...nodes.values()], edges };
}
