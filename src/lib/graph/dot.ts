/**
 * DOT (the Graphviz language, https://graphviz.org/doc/info/lang.html) ⇄ Diagram: the open
 * text interchange format.
 *
 * Reading uses the DOT grammar of the `ts-graphviz` package (its AST parser) and then applies
 * Graphviz's own meaning to the tree: edge chains `a -> b -> c` and groups `{a b} -> c`
 * expand to one arrow per pair; subgraphs are flattened; `node [...]`/`edge [...]` defaults
 * apply to the nodes and edges created after them in the same (sub)graph and its subgraphs;
 * a node is created where it is first named. Causeway's own meaning travels in node attributes
 * of its own naming (Graphviz ignores unknown attributes):
 *
 *   role="exposure" | "outcome" | "adjusted" (comma-separated when several)
 *   measured=false  (absent = measured)
 *   pos="x,y"       (Graphviz's y axis points up, the canvas's down: y is negated)
 *   label, note     (text; the graph's `label` is the diagram title)
 *   data_column, data_kind, data_reference, data_labels   (the link to a data table;
 *                   data_column="" = no data; data_labels is a JSON object value → name)
 * and the edge attribute `note` (why the arrow is assumed).
 *
 * Every other attribute is kept as written in `extra` (HTML-like values as `{ html: "…" }`) and
 * written back, so DOT → Diagram → DOT keeps what Causeway does not use.
 *
 * Writing is hand-made rather than through ts-graphviz's printer, because the escaping must
 * follow what Graphviz's `dot` program does with label text (entities decoded first, then
 * backslash escapes), which that printer does not do: labels are written so that `dot` draws
 * exactly the label's text, whatever characters it holds.
 *
 * Cost: O(size of the text) for reading (plus the parser's own cost) and for writing.
 */
import { parse, type AttributeASTNode, type GraphASTNode, type ClusterStatementASTNode, type EdgeTargetASTNode, type LiteralASTNode, type NodeRefASTNode } from 'ts-graphviz/ast';
import { DATA_KINDS, isEmptyVariableData, isUnsafeKey, type Arrow, type DataKind, type Diagram, type Extra, type Variable, type VariableData } from './diagram';
import { describePosition, InputError, lineColumn, quote } from './errors';
import { validateDiagram } from './validate';
import { APP_READ_LIMITS, assertDiagramTextSize, assertDiagramWithinLimits, type ReadLimits } from './size-limits';
import { describeCount, MAX_DOT_NESTING } from '../limits';

// ---------------------------------------------------------------------------------------------
// Text codecs

/** Graphviz decodes these entities in every label; a small, fixed table (others stay as text). */
const NAMED_ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'", nbsp: '\u00a0' };

function decodeEntities(s: string): string {
	return s.replace(/&(#[0-9]{1,7}|#[xX][0-9a-fA-F]{1,6}|amp|lt|gt|quot|apos|nbsp);/g, (whole, body: string) => {
		if (body[0] !== '#') return NAMED_ENTITIES[body];
		const code = body[1] === 'x' || body[1] === 'X' ? parseInt(body.slice(2), 16) : parseInt(body.slice(1), 10);
		return code <= 0x10ffff && (code < 0xd800 || code > 0xdfff) ? String.fromCodePoint(code) : whole;
	});
}

/** Text of an HTML-like value: `<br/>` becomes a line break, other tags are dropped. */
function htmlToText(html: string): string {
	return decodeEntities(html.replace(/<br\b[^>]*>/gi, '\n').replace(/<[^>]*>/g, '')).trim();
}

/**
 * The text Graphviz draws for a label value: entities first, then the escString escapes
 * (`\n`, `\l`, `\r` line breaks — a final `\l` or `\r` only ends the last line —, `\N` node name,
 * `\G` graph name, `\\` backslash, `\x` → x), in the order Graphviz applies them.
 */
function decodeText(raw: string, html: boolean, names: { node?: string; graph?: string }): string {
	if (html) return htmlToText(raw);
	const s = decodeEntities(raw);
	let out = '';
	for (let i = 0; i < s.length; i++) {
		const c = s[i];
		if (c !== '\\' || i + 1 >= s.length) {
			out += c;
			continue;
		}
		const e = s[++i];
		if (e === 'n') out += '\n';
		else if (e === 'l' || e === 'r') out += i + 1 >= s.length ? '' : '\n';
		else if (e === 'N') out += names.node ?? '';
		else if (e === 'G') out += names.graph ?? '';
		else out += e;
	}
	return out;
}

/** Inverse of decodeText, as the inside of a double-quoted DOT string. */
function encodeText(text: string): string {
	let out = '';
	for (const c of text) {
		const code = c.codePointAt(0) ?? 0;
		if (c === '\\') out += '\\\\';
		else if (c === '"') out += '\\"';
		else if (c === '\n') out += '\\n';
		else if (c === '&') out += '&amp;';
		else if ((code < 0x20 && c !== '\t') || code === 0x7f || code === 0x2028 || code === 0x2029) out += `&#${code};`;
		else out += c;
	}
	return out;
}

/**
 * A backslash that no quoted DOT string can hold as itself: before a quote (it would escape
 * it), before a line break (a line continuation) or at the very end.
 */
const UNWRITABLE_BACKSLASH = /\\(?=["\r\n]|$)/;

/** Raw value (ids, kept attributes) as the inside of a double-quoted DOT string. */
function encodeRaw(value: string): string {
	return value.replace(/"/g, '\\"');
}

/** Removes `\` + line break (DOT's line continuation inside quoted strings), pairing escapes. */
function removeLineContinuations(s: string): string {
	if (!s.includes('\\')) return s;
	return s.replace(/\\(\r\n|\n|\r|[^])/g, (whole, next: string) => (next === '\n' || next === '\r' || next === '\r\n' ? '' : whole));
}

const KEYWORDS = new Set(['node', 'edge', 'graph', 'digraph', 'subgraph', 'strict']);
const BARE_ID = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** True when `s` can be written without quotes: a DOT identifier that is not a keyword. */
function isBare(s: string): boolean {
	return BARE_ID.test(s) && !KEYWORDS.has(s.toLowerCase());
}

// ---------------------------------------------------------------------------------------------
// Reading

const PARSE_LIMITS = { maxInputSize: 64 * 1024 * 1024, maxASTNodes: 20_000_000 };

/**
 * The ts-graphviz grammar refuses a raw line break inside a quoted string, which Graphviz
 * accepts (and hand-written files use). Such line breaks are swapped for private-use
 * characters absent from the text before parsing and swapped back in every value; the swap
 * keeps every offset, so positions in messages stay exact. O(length).
 */
function protectLineBreaksInStrings(text: string): { text: string; restore: (s: string) => string } {
	const breaks = ['\n', '\r', '\u2028', '\u2029'];
	const stand: string[] = [];
	for (let code = 0xe000; stand.length < breaks.length && code <= 0xf8ff; code++) {
		const c = String.fromCharCode(code);
		if (!text.includes(c)) stand.push(c);
	}
	if (stand.length < breaks.length) return { text, restore: (s) => s };
	let out = '';
	let changed = false;
	let i = 0;
	const n = text.length;
	while (i < n) {
		const c = text[i];
		if (c === '"') {
			out += c;
			i++;
			while (i < n && text[i] !== '"') {
				if (text[i] === '\\' && i + 1 < n) {
					out += text[i] + text[i + 1];
					i += 2;
					continue;
				}
				const k = breaks.indexOf(text[i]);
				if (k >= 0) {
					out += stand[k];
					changed = true;
				} else out += text[i];
				i++;
			}
			if (i < n) out += text[i++];
		} else if (c === '<') {
			let depth = 0;
			const from = i;
			while (i < n) {
				if (text[i] === '<') depth++;
				else if (text[i] === '>' && --depth === 0) {
					i++;
					break;
				}
				i++;
			}
			out += text.slice(from, i);
		} else if (c === '#' || (c === '/' && text[i + 1] === '/')) {
			const end = text.indexOf('\n', i);
			const stop = end < 0 ? n : end;
			out += text.slice(i, stop);
			i = stop;
		} else if (c === '/' && text[i + 1] === '*') {
			const end = text.indexOf('*/', i + 2);
			const stop = end < 0 ? n : end + 2;
			out += text.slice(i, stop);
			i = stop;
		} else {
			out += c;
			i++;
		}
	}
	if (!changed) return { text, restore: (s) => s };
	const back = new Map(stand.map((c, k) => [c, breaks[k]]));
	const pattern = new RegExp(`[${stand.join('')}]`, 'g');
	return { text: out, restore: (s) => s.replace(pattern, (c) => back.get(c) ?? c) };
}

/**
 * Checks that braces, quoted strings, HTML-like strings and comments are closed, and that
 * braces nest at most MAX_DOT_NESTING deep, before the grammar runs: the ts-graphviz parser
 * backtracks exponentially on unclosed nested subgraphs (an 860-byte file found by the fuzz
 * tests took minutes) and recurses once per level. One pass, O(length); the message names the
 * unclosed piece's line and column.
 */
function checkNesting(text: string, at: (offset: number) => { phrase: string; where: string }): void {
	const fail = (offset: number, what: string) => {
		const p = at(offset);
		return new InputError(`Invalid DOT at ${p.phrase}: ${what}`, p.where);
	};
	const open: number[] = [];
	const n = text.length;
	let i = 0;
	while (i < n) {
		const c = text[i];
		if (c === '"') {
			const from = i++;
			while (i < n && text[i] !== '"') i += text[i] === '\\' ? 2 : 1;
			if (i >= n) throw fail(from, 'this quoted string is never closed');
			i++;
		} else if (c === '<') {
			const from = i;
			let depth = 0;
			for (; i < n; i++) {
				if (text[i] === '<') depth++;
				else if (text[i] === '>' && --depth === 0) break;
			}
			if (i >= n) throw fail(from, 'this HTML-like string (<…>) is never closed');
			i++;
		} else if (c === '/' && text[i + 1] === '*') {
			const end = text.indexOf('*/', i + 2);
			if (end < 0) throw fail(i, 'this comment is never closed');
			i = end + 2;
		} else if ((c === '/' && text[i + 1] === '/') || c === '#') {
			const end = text.indexOf('\n', i);
			i = end < 0 ? n : end;
		} else {
			if (c === '{') {
				open.push(i);
				if (open.length > MAX_DOT_NESTING) throw new InputError(`The DOT file is nested too deeply to read: more than ${MAX_DOT_NESTING} levels of { } (${at(i).phrase})`, at(i).where);
			} else if (c === '}') {
				if (open.pop() === undefined) throw fail(i, 'this } closes nothing');
			}
			i++;
		}
	}
	if (open.length > 0) throw fail(open[open.length - 1], 'this { is never closed');
}

interface Attr {
	value: string;
	html: boolean;
	offset: number;
}
type Attrs = Map<string, Attr>;
interface NodeInfo {
	id: string;
	attrs: Attrs;
}
interface EdgeInfo {
	from: string;
	to: string;
	attrs: Attrs;
}
interface Scope {
	nodeDefaults: Attrs;
	edgeDefaults: Attrs;
}

/**
 * Reads a DOT digraph. Throws InputError naming the line and column of a syntax error, of an
 * undirected graph or edge, or of a Causeway attribute with a bad value (role, measured, pos).
 */
export function parseDot(text: string, limits: ReadLimits = APP_READ_LIMITS): Diagram {
	assertDiagramTextSize(text, limits);
	const source = text.charCodeAt(0) === 0xfeff ? ' ' + text.slice(1) : text;
	if (source.trim() === '') throw new InputError('The file is empty: expected a DOT digraph', '1:1');
	const { text: guarded, restore } = protectLineBreaksInStrings(source);
	const at = (offset: number) => {
		const pos = lineColumn(source, offset);
		return { phrase: describePosition(pos), where: `${pos.line}:${pos.column}` };
	};

	checkNesting(source, at);
	let dot;
	try {
		dot = parse(guarded, PARSE_LIMITS);
	} catch (e) {
		throw dotSyntaxError(e, at);
	}
	const graph = dot.children.find((c): c is GraphASTNode => c.type === 'Graph');
	if (!graph) throw new InputError('The file holds no graph: expected digraph { … }', '1:1');
	const graphStart = graph.location?.start.offset ?? 0;
	if (!graph.directed) {
		const p = at(graphStart);
		throw new InputError(
			`This DOT file describes an undirected graph at ${p.phrase}; Causeway reads directed graphs only: write digraph { … } with -> arrows`,
			p.where
		);
	}

	const literal = (l: LiteralASTNode): string => (l.quoted === true ? restore(removeLineContinuations(l.value)) : l.value);
	const attrOf = (a: AttributeASTNode): [string, Attr] => [
		literal(a.key),
		{ value: literal(a.value), html: a.value.quoted === 'html', offset: a.value.location?.start.offset ?? graphStart }
	];
	const graphAttrs: Attrs = new Map();
	const nodes = new Map<string, NodeInfo>();
	const edges: EdgeInfo[] = [];
	const strictIndex = graph.strict ? new Map<string, EdgeInfo>() : null;
	let expanded = 0; // arrows the edge statements ask for, before a strict graph merges repeats

	const ensureNode = (id: string, scope: Scope): NodeInfo => {
		let node = nodes.get(id);
		if (!node) {
			if (nodes.size >= limits.variables) throw tooManyVariables(limits);
			node = { id, attrs: new Map(scope.nodeDefaults) };
			nodes.set(id, node);
		}
		return node;
	};
	const refsOf = (target: EdgeTargetASTNode): NodeRefASTNode[] => (target.type === 'NodeRef' ? [target] : target.children);

	// Statements are walked with an explicit stack of (statements, scope, position) frames, so
	// deeply nested subgraphs cannot overflow the call stack.
	const rootScope: Scope = { nodeDefaults: new Map(), edgeDefaults: new Map() };
	const frames: { statements: ClusterStatementASTNode[]; scope: Scope; next: number; root: boolean }[] = [
		{ statements: graph.children, scope: rootScope, next: 0, root: true }
	];
	while (frames.length > 0) {
		const frame = frames[frames.length - 1];
		if (frame.next >= frame.statements.length) {
			frames.pop();
			continue;
		}
		const stmt = frame.statements[frame.next++];
		const { scope } = frame;
		switch (stmt.type) {
			case 'Attribute':
				if (frame.root) graphAttrs.set(...attrOf(stmt));
				break;
			case 'AttributeList': {
				const target = stmt.kind === 'Node' ? scope.nodeDefaults : stmt.kind === 'Edge' ? scope.edgeDefaults : frame.root ? graphAttrs : null;
				if (target) for (const a of stmt.children) if (a.type === 'Attribute') target.set(...attrOf(a));
				break;
			}
			case 'Node': {
				const node = ensureNode(literal(stmt.id), scope);
				for (const a of stmt.children) if (a.type === 'Attribute') node.attrs.set(...attrOf(a));
				break;
			}
			case 'Edge': {
				const groups = stmt.targets.map(refsOf);
				// Groups multiply ({a b} -> {c d} is four arrows): count before expanding, so a
				// small hostile file cannot ask for billions of arrows (strict graphs merge repeats,
				// hence the allowance beyond the arrow limit).
				for (let g = 0; g + 1 < groups.length; g++) expanded += groups[g].length * groups[g + 1].length;
				if (expanded > 4 * limits.arrows) throw tooManyArrows(limits);
				for (const group of groups) for (const ref of group) ensureNode(literal(ref.id), scope);
				const explicit: [string, Attr][] = [];
				for (const a of stmt.children) if (a.type === 'Attribute') explicit.push(attrOf(a));
				for (let g = 0; g + 1 < groups.length; g++) {
					for (const tail of groups[g]) {
						for (const head of groups[g + 1]) {
							const attrs: Attrs = new Map(scope.edgeDefaults);
							for (const [k, v] of explicit) attrs.set(k, v);
							const port = (ref: NodeRefASTNode, key: string) => {
								if (!ref.port) return;
								const value = ref.compass ? `${literal(ref.port)}:${literal(ref.compass)}` : literal(ref.port);
								attrs.set(key, { value, html: false, offset: ref.port.location?.start.offset ?? graphStart });
							};
							port(tail, 'tailport');
							port(head, 'headport');
							addEdge({ from: literal(tail.id), to: literal(head.id), attrs });
						}
					}
				}
				break;
			}
			case 'Subgraph':
				frames.push({
					statements: stmt.children,
					scope: { nodeDefaults: new Map(scope.nodeDefaults), edgeDefaults: new Map(scope.edgeDefaults) },
					next: 0,
					root: false
				});
				break;
			default:
				break; // comments
		}
	}

	function addEdge(edge: EdgeInfo): void {
		if (!strictIndex) {
			if (edges.length >= limits.arrows) throw tooManyArrows(limits);
			edges.push(edge);
			return;
		}
		// A strict graph holds at most one edge per (tail, head); later attributes win.
		const key = JSON.stringify([edge.from, edge.to]);
		const existing = strictIndex.get(key);
		if (existing) for (const [k, v] of edge.attrs) existing.attrs.set(k, v);
		else {
			if (edges.length >= limits.arrows) throw tooManyArrows(limits);
			strictIndex.set(key, edge);
			edges.push(edge);
		}
	}

	const graphName = graph.id ? literal(graph.id) : '';
	const diagram = toDiagram(graphName, graphAttrs, [...nodes.values()], edges, at);
	assertDiagramWithinLimits(diagram, limits);
	return diagram;
}

type At = (offset: number) => { phrase: string; where: string };

const tooManyVariables = (l: ReadLimits) =>
	new InputError(`The DOT file names more than ${describeCount(l.variables)} nodes; ${l.reader} handles at most ${describeCount(l.variables)} variables${l.hint}`, 'variables');
const tooManyArrows = (l: ReadLimits) =>
	new InputError(`The DOT file makes more than ${describeCount(l.arrows)} edges; ${l.reader} handles at most ${describeCount(l.arrows)} arrows${l.hint}`, 'arrows');

function dotSyntaxError(e: unknown, at: At): InputError {
	const cause = e instanceof Error ? e.cause : undefined;
	const offset =
		typeof cause === 'object' && cause !== null && 'location' in cause && typeof cause.location === 'object' && cause.location !== null && 'start' in cause.location
			? (cause.location.start as { offset?: unknown }).offset
			: undefined;
	const message = e instanceof Error ? e.message : String(e);
	// The grammar is recursive: subgraphs or groups nested thousands deep overflow its stack.
	if (e instanceof RangeError || cause instanceof RangeError) return new InputError('The DOT file is nested too deeply to read (subgraphs or { } groups inside one another)');
	if (/exceeds maximum|exceeded/i.test(message)) return new InputError('The DOT file is too large to read');
	if (typeof offset !== 'number') return new InputError(`Invalid DOT: ${message}`);
	const p = at(offset);
	if (message.includes('"->" operator')) {
		return new InputError(`Undirected edge "--" at ${p.phrase}: Causeway reads directed graphs only; write -> for an arrow`, p.where);
	}
	const detail = message.replace(/^Expected /, 'expected ').replace(/\.$/, '');
	return new InputError(`Invalid DOT at ${p.phrase}: ${detail}`, p.where);
}

const ROLE_WORDS = ['exposure', 'outcome', 'adjusted'] as const;
type RoleWord = (typeof ROLE_WORDS)[number];
const DATA_ATTRIBUTES = ['data_column', 'data_kind', 'data_reference', 'data_labels'] as const;
const OWN_NODE_ATTRIBUTES: ReadonlySet<string> = new Set(['label', 'role', 'measured', 'pos', 'note', ...DATA_ATTRIBUTES]);
const OWN_EDGE_ATTRIBUTES: ReadonlySet<string> = new Set(['note']);

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

/** The data_* attributes of a variable's settings (unknown keys inside `data` are not written). */
function writeVariableData(data: VariableData | undefined): [string, string][] {
	if (!data) return [];
	const pairs: [string, string][] = [];
	if (data.column !== undefined) pairs.push(['data_column', `"${encodeText(data.column ?? '')}"`]);
	if (data.kind !== undefined) pairs.push(['data_kind', data.kind]);
	if (data.reference !== undefined) pairs.push(['data_reference', `"${encodeText(data.reference)}"`]);
	if (data.labels && data.labels.length > 0) {
		const json = JSON.stringify(Object.fromEntries(data.labels.filter((l) => !isUnsafeKey(l.value)).map((l) => [l.value, l.label])));
		pairs.push(['data_labels', `"${encodeText(json)}"`]);
	}
	return pairs;
}

function extraValue(a: Attr): unknown {
	return a.html ? { html: a.value } : a.value;
}

function toDiagram(graphName: string, graphAttrs: Attrs, nodes: NodeInfo[], edges: EdgeInfo[], at: At): Diagram {
	const roles: Record<RoleWord, string[]> = { exposure: [], outcome: [], adjusted: [] };
	const variables = nodes.map(({ id, attrs }): Variable => {
		const bad = (a: Attr, what: string): InputError => {
			const p = at(a.offset);
			return new InputError(`Node ${quote(id)}: ${what} (${p.phrase})`, p.where);
		};
		const label = attrs.get('label');
		const v: Variable = { id, label: label ? decodeText(label.value, label.html, { node: id, graph: graphName }) : id, measured: true };

		const role = attrs.get('role');
		if (role) {
			const words = role.value.split(/[\s,]+/).filter((w) => w !== '');
			for (const word of words) {
				const w = word.toLowerCase();
				if (!(ROLE_WORDS as readonly string[]).includes(w)) {
					throw bad(role, `role ${quote(word)} is not one of exposure, outcome, adjusted`);
				}
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
		if (note) v.note = decodeText(note.value, note.html, { node: id, graph: graphName });
		const data = readVariableData(attrs, (a) => decodeText(a.value, a.html, { node: id, graph: graphName }), bad);
		if (data) v.data = data;

		const extra = extraOf(attrs, OWN_NODE_ATTRIBUTES);
		if (extra) v.extra = extra;
		return v;
	});
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
		extra[key] = extraValue(a);
	}
	return extra;
}

// ---------------------------------------------------------------------------------------------
// Writing

/** True when `html` can be written back between < and > (its angle brackets balance). */
function isBalancedHtml(html: string): boolean {
	let depth = 0;
	for (const c of html) {
		if (c === '<') depth++;
		else if (c === '>' && --depth < 0) return false;
	}
	return depth === 0;
}

/** A kept (`extra`) value as DOT. Values that did not come from DOT are written as text. */
function writeExtraValue(value: unknown): string {
	if (typeof value === 'object' && value !== null && !Array.isArray(value)) {
		const keys = Object.keys(value);
		const html: unknown = keys.length === 1 && keys[0] === 'html' ? (value as { html: unknown }).html : undefined;
		if (typeof html === 'string' && isBalancedHtml(html)) return `<${html}>`;
	}
	const text = typeof value === 'string' ? value : typeof value === 'number' || typeof value === 'boolean' || typeof value === 'bigint' ? String(value) : JSON.stringify(value);
	// The one lossy case: a backslash no quoted string can hold (see UNWRITABLE_BACKSLASH) is doubled.
	const safe = UNWRITABLE_BACKSLASH.test(text) ? text.replace(/\\(?=["\r\n]|$)/g, '\\\\') : text;
	return isBare(safe) ? safe : `"${encodeRaw(safe)}"`;
}

function writeName(name: string, what: string): string {
	if (UNWRITABLE_BACKSLASH.test(name)) {
		throw new InputError(`Cannot write DOT: ${what} ${quote(name)} has a backslash before a quote, a line break or the end, which DOT cannot hold`, name);
	}
	return isBare(name) ? name : `"${encodeRaw(name)}"`;
}

function writeAttributes(pairs: [string, string][], extra: Extra | undefined, own: ReadonlySet<string>): string {
	const all = [...pairs];
	if (extra) {
		for (const key of Object.keys(extra).sort()) {
			if (own.has(key) || isUnsafeKey(key) || extra[key] === undefined) continue;
			all.push([writeName(key, 'attribute name'), writeExtraValue(extra[key])]);
		}
	}
	return all.length === 0 ? '' : ` [${all.map(([k, v]) => `${k}=${v}`).join(', ')}]`;
}

/** Text that Graphviz would not draw as itself when it is the node name standing in for a label. */
const NEEDS_EXPLICIT_LABEL = /[\\&\r\n\u2028\u2029]/;

/**
 * Writes the diagram as a DOT digraph that Graphviz draws as is and parseDot reads back to the
 * same diagram (roles are listed in variable order; a kept value that did not come from DOT is
 * written as text). Throws InputError for what DOT cannot express faithfully: duplicate ids,
 * arrows or roles naming unknown variables, non-finite positions, ids with an unwritable
 * backslash.
 */
export function writeDot(d: Diagram): string {
	const blocking = validateDiagram(d).find((i) => i.code === 'duplicate-id' || i.code === 'unknown-arrow-end' || i.code === 'unknown-role-id');
	if (blocking) throw new InputError(`Cannot write DOT: ${blocking.message}`, blocking.ids.join(', ') || undefined);

	const exposures = new Set(d.exposures);
	const outcomes = new Set(d.outcomes);
	const adjusted = new Set(d.adjusted);
	const lines: string[] = [
		'// Causeway diagram. Node attributes role, measured, pos (y up), note and data_* (the link to a data table) and edge attribute note are read by Causeway.',
		'digraph {'
	];
	if (d.title !== '') lines.push(`  label="${encodeText(d.title)}";`);
	if (d.extra) {
		for (const key of Object.keys(d.extra).sort()) {
			if (key === 'label' || isUnsafeKey(key) || d.extra[key] === undefined) continue;
			lines.push(`  ${writeName(key, 'attribute name')}=${writeExtraValue(d.extra[key])};`);
		}
	}
	for (const v of d.variables) {
		const pairs: [string, string][] = [];
		if (v.label !== v.id || NEEDS_EXPLICIT_LABEL.test(v.id)) pairs.push(['label', `"${encodeText(v.label)}"`]);
		const roles = ROLE_WORDS.filter((r) => (r === 'exposure' ? exposures : r === 'outcome' ? outcomes : adjusted).has(v.id));
		if (roles.length > 0) pairs.push(['role', `"${roles.join(',')}"`]);
		if (!v.measured) pairs.push(['measured', 'false']);
		if (v.x !== undefined && v.y !== undefined) {
			if (!Number.isFinite(v.x) || !Number.isFinite(v.y)) {
				throw new InputError(`Cannot write DOT: variable ${quote(v.id)} has a position that is not a finite number`, v.id);
			}
			pairs.push(['pos', `"${String(v.x)},${String(-v.y)}"`]);
		}
		if (v.note !== undefined) pairs.push(['note', `"${encodeText(v.note)}"`]);
		if (!isEmptyVariableData(v.data)) pairs.push(...writeVariableData(v.data));
		lines.push(`  ${writeName(v.id, 'variable id')}${writeAttributes(pairs, v.extra, OWN_NODE_ATTRIBUTES)};`);
	}
	for (const a of d.arrows) {
		const pairs: [string, string][] = a.note !== undefined ? [['note', `"${encodeText(a.note)}"`]] : [];
		lines.push(`  ${writeName(a.from, 'variable id')} -> ${writeName(a.to, 'variable id')}${writeAttributes(pairs, a.extra, OWN_EDGE_ATTRIBUTES)};`);
	}
	lines.push('}', '');
	return lines.join('\n');
}
