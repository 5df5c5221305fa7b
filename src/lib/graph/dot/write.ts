/**
 * Writing a Diagram as DOT. Hand-made rather than through a DOT printer, because the escaping
 * must follow what Graphviz's `dot` program does with label text (entities decoded first, then
 * backslash escapes): labels are written so that `dot` draws exactly the label's text, whatever
 * characters it holds, and parseDot reads the output back to the same diagram. O(size).
 */
import { isEmptyVariableData, isUnsafeKey, type Diagram, type Extra, type VariableData } from '../diagram';
import { InputError, quote } from '../errors';
import { validateDiagram } from '../validate';
import { OWN_EDGE_ATTRIBUTES, OWN_NODE_ATTRIBUTES, ROLE_WORDS } from './read';
import { encodeRaw, encodeText, isBare, UNWRITABLE_BACKSLASH } from './text';

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
