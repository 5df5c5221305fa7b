/**
 * DOT text codecs: the text Graphviz draws for a label value (entities, escape sequences,
 * HTML-like labels) and the inverse, used by the writer. O(length) each.
 */
import { GRAPHVIZ_ENTITIES } from './entities';

/** XML decodes these two inside HTML-like labels, where Graphviz's own table lacks them. */
const HTML_ONLY_ENTITIES: ReadonlyMap<string, string> = new Map([
	['apos', "'"],
	['thetasym', '\u03d1']
]);

/** Named (Graphviz's table) and numeric character entities; unknown names stay as text. */
function decodeEntities(s: string, html: boolean): string {
	if (!s.includes('&')) return s;
	return s.replace(/&(#[0-9]{1,7}|#[xX][0-9a-fA-F]{1,6}|[A-Za-z][A-Za-z0-9]{1,9});/g, (whole, body: string) => {
		if (body[0] !== '#') return GRAPHVIZ_ENTITIES.get(body) ?? (html ? HTML_ONLY_ENTITIES.get(body) : undefined) ?? whole;
		const code = body[1] === 'x' || body[1] === 'X' ? parseInt(body.slice(2), 16) : parseInt(body.slice(1), 10);
		return code <= 0x10ffff && (code < 0xd800 || code > 0xdfff) ? String.fromCodePoint(code) : whole;
	});
}

/** Tags that end a line of an HTML-like label: a line break, a table row or rule, a table. */
const LINE_TAGS: ReadonlySet<string> = new Set(['br', 'tr', 'hr', 'table']);
/** Tags that end a cell: cells of one row are read side by side, a space apart. */
const CELL_TAGS: ReadonlySet<string> = new Set(['td', 'vr']);

/**
 * The text of an HTML-like label as lines: `<br/>`, table rows (`<tr>`, `<hr/>`, a `<table>`)
 * end a line, cells of a row (`<td>`, `<vr/>`) are joined by one space, other tags (`<b>`,
 * `<font>`…) are dropped with their text kept; entities are decoded; runs of spaces and line
 * breaks in the text are one space (Graphviz draws a line break in HTML text as a space); empty
 * lines and cells are left out. So `<table><tr><td>Age</td></tr><tr><td>years</td></tr></table>`
 * reads as "Age\nyears", the two lines Graphviz draws.
 */
export function htmlToText(html: string): string {
	const lines: string[] = [];
	let cells: string[] = [];
	let cell = '';
	const endCell = () => {
		const text = decodeEntities(cell, true)
			.replace(/[ \t\r\n]+/g, ' ')
			.trim();
		if (text !== '') cells.push(text);
		cell = '';
	};
	const endLine = () => {
		endCell();
		if (cells.length > 0) lines.push(cells.join(' '));
		cells = [];
	};
	for (const piece of html.match(/<[^>]*>|[^<]+/g) ?? []) {
		if (piece[0] !== '<') {
			cell += piece;
			continue;
		}
		const name = /^<\/?\s*([A-Za-z]+)/.exec(piece)?.[1].toLowerCase() ?? '';
		if (LINE_TAGS.has(name)) endLine();
		else if (CELL_TAGS.has(name)) endCell();
	}
	endLine();
	return lines.join('\n');
}

/**
 * The text Graphviz draws for a label value: entities first, then the escString escapes
 * (`\n`, `\l`, `\r` line breaks — a final `\l` or `\r` only ends the last line —, `\N` node name,
 * `\G` graph name, `\\` backslash, `\x` → x), in the order Graphviz applies them.
 */
export function decodeText(raw: string, html: boolean, names: { node?: string; graph?: string }): string {
	if (html) return htmlToText(raw);
	const s = decodeEntities(raw, false);
	if (!s.includes('\\')) return s;
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
export function encodeText(text: string): string {
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
export const UNWRITABLE_BACKSLASH = /\\(?=["\r\n]|$)/;

/** Raw value (ids, kept attributes) as the inside of a double-quoted DOT string. */
export function encodeRaw(value: string): string {
	return value.replace(/"/g, '\\"');
}

const KEYWORDS = new Set(['node', 'edge', 'graph', 'digraph', 'subgraph', 'strict']);
const BARE_ID = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** True when `s` can be written without quotes: a DOT identifier that is not a keyword. */
export function isBare(s: string): boolean {
	return BARE_ID.test(s) && !KEYWORDS.has(s.toLowerCase());
}
