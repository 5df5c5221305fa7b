/**
 * Which reader a diagram file needs (native JSON or DOT), and the file name put in front of a
 * reader's message. Kept apart from the readers so that a caller can load only the reader it
 * needs (the command line loads the DOT parser only for DOT files). O(length of the leading
 * comments).
 */
import { InputError } from './errors';

export type DiagramFileKind = 'json' | 'dot';

const JSON_EXTENSIONS = ['.json', '.causeway'];
const DOT_EXTENSIONS = ['.dot', '.gv'];

/**
 * The kind of a diagram file: by extension (.json/.causeway → JSON, .dot/.gv → DOT), else by
 * its first meaningful character (`{` → JSON; `digraph`, `graph` or `strict` after any DOT
 * comments → DOT); null when neither tells.
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

/** The kind, or an InputError saying the file is neither kind. */
export function requireDiagramFileKind(name: string, text: string): DiagramFileKind {
	const kind = diagramFileKind(name, text);
	if (kind) return kind;
	if (text.trim() === '') {
		const what = name === 'stdin' ? 'Standard input is empty' : 'The file is empty';
		throw new InputError(`${name}: ${what}: expected a Causeway diagram (JSON) or a DOT digraph`, name);
	}
	throw new InputError(
		`${name}: not a diagram file this version can read: expected a Causeway diagram (.json, starting with "{") or a DOT digraph (.dot or .gv)`,
		name
	);
}

/** Runs a reader, putting the file name in front of its InputError (`study.json: …`). */
export function withFileName<T>(name: string, read: () => T): T {
	try {
		return read();
	} catch (e) {
		if (e instanceof InputError) throw new InputError(`${name}: ${e.message}`, e.where ? `${name}:${e.where}` : name);
		throw e;
	}
}
