/**
 * Opening a diagram file whose kind is not known in advance (drag-and-drop, file picker, CLI
 * argument): the extension decides, else the content does.
 */
import type { Diagram } from './diagram';
import { parseDot } from './dot';
import { InputError } from './errors';
import { parseDiagramJson } from './native-json';
import { decodeTextFile } from './text-decoding';

export type DiagramFileKind = 'json' | 'dot';

const JSON_EXTENSIONS = ['.json', '.causeway'];
const DOT_EXTENSIONS = ['.dot', '.gv'];

/**
 * The kind of a diagram file: by extension (.json/.causeway → JSON, .dot/.gv → DOT), else by
 * its first meaningful character (`{` → JSON; `digraph`, `graph` or `strict` after any DOT
 * comments → DOT); null when neither tells. O(length of the leading comments).
 */
export function diagramFileKind(name: string, text: string): DiagramFileKind | null {
	const lower = name.toLowerCase();
	if (JSON_EXTENSIONS.some((e) => lower.endsWith(e))) return 'json';
	if (DOT_EXTENSIONS.some((e) => lower.endsWith(e))) return 'dot';
	const body = text.replace(/^\uFEFF/, '');
	if (/^\s*\{/.test(body)) return 'json';
	let rest = body;
	for (;;) {
		const before = rest;
		rest = rest.replace(/^\s+/, '').replace(/^(\/\/|#)[^\n]*/, '').replace(/^\/\*[^]*?\*\//, '');
		if (rest === before) break;
	}
	if (/^(strict\s+)?(di)?graph\b/i.test(rest)) return 'dot';
	return null;
}

/**
 * Reads a diagram from a file's name and text, as native JSON or DOT (see diagramFileKind).
 * Throws InputError whose message starts with the file name, e.g.
 * `study.json: Invalid JSON at line 3, column 7: expected a value (found "}")`.
 */
export function readDiagramText(name: string, text: string): Diagram {
	const kind = diagramFileKind(name, text);
	if (!kind) {
		throw new InputError(
			`${name}: not a diagram file this version can read: expected a Causeway diagram (.json, starting with "{") or a DOT digraph (.dot or .gv)`,
			name
		);
	}
	try {
		return kind === 'json' ? parseDiagramJson(text) : parseDot(text);
	} catch (e) {
		if (e instanceof InputError) throw new InputError(`${name}: ${e.message}`, e.where ? `${name}:${e.where}` : name);
		throw e;
	}
}

/**
 * Reads a diagram from a file's name and bytes: decodes them (UTF-8, or UTF-16 after a
 * byte-order mark; binary and non-UTF-8 files are refused, naming the first bad byte), then
 * reads the text as readDiagramText does. Messages start with the file name.
 */
export function readDiagramBytes(name: string, bytes: Uint8Array): Diagram {
	let text: string;
	try {
		text = decodeTextFile(bytes);
	} catch (e) {
		if (e instanceof InputError) throw new InputError(`${name}: ${e.message}`, e.where ? `${name}:${e.where}` : name);
		throw e;
	}
	return readDiagramText(name, text);
}
