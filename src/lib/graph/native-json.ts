/**
 * The native file format (`causeway.diagram`, version 2; version 1 is read too): JSON text ⇄
 * Diagram. Version 2 only adds keys (a variable's `data` settings, an arrow's `note`), so a
 * version 1 file is read by the same rules; files are always written as version 2.
 *
 * Reading is three steps, each with its own kind of message:
 *  1. syntax — JSON.parse; on failure jsonc-parser (the scanner VS Code uses) re-reads the text
 *     only to find the line and column, because JSON.parse's messages give no position in
 *     every JavaScript engine;
 *  2. structure — diagram.schema.json (JSON Schema 2020-12) is checked by a validator that ajv
 *     generated ahead of time (scripts/build-schema-validator.mjs: the app's Content-Security-
 *     Policy forbids ajv's run-time `new Function`), and the first failure becomes a message
 *     naming the path (`variables[3].id`) and its line;
 *  3. model — defaults are filled in (label = id, measured = true, empty role lists) and
 *     keys this version does not know go to `extra`, so that writing the diagram again keeps
 *     them.
 * Diagram-level rules (unique ids, arrows between known variables, no cycles) are not checked
 * here but by validate.ts, so that an editor can open a file with such problems and show them.
 *
 * Cost: O(size of the text) for reading and writing.
 */
import type { ErrorObject } from 'ajv';
import { findNodeAtLocation, parse as parseLenient, parseTree, printParseErrorCode, type JSONPath, type ParseError } from 'jsonc-parser';
import schema from './diagram.schema.json';
import { validate as validateSchema } from './diagram-schema-validate.js';
import { DIAGRAM_FORMAT, DIAGRAM_VERSION, isEmptyVariableData, isUnsafeKey, READABLE_VERSIONS, type Arrow, type DataKind, type Diagram, type Extra, type Variable, type VariableData } from './diagram';
import { describeFound, describePosition, InputError, lineColumn, quote } from './errors';
import { APP_READ_LIMITS, assertDiagramTextSize, assertDiagramWithinLimits, type ReadLimits } from './size-limits';

/** The shape diagram.schema.json accepts; keys beyond these are allowed and kept. */
interface FileVariable {
	id: string;
	label?: string;
	measured?: boolean;
	x?: number;
	y?: number;
	note?: string;
	data?: FileVariableData;
	[key: string]: unknown;
}
interface FileVariableData {
	column?: string | null;
	kind?: DataKind;
	reference?: string;
	labels?: Record<string, string>;
	[key: string]: unknown;
}
interface FileArrow {
	from: string;
	to: string;
	note?: string;
	[key: string]: unknown;
}
interface DiagramFile {
	format: typeof DIAGRAM_FORMAT;
	version: 1 | 2;
	title?: string;
	variables: FileVariable[];
	arrows: FileArrow[];
	exposures?: string[];
	outcomes?: string[];
	adjusted?: string[];
	[key: string]: unknown;
}

/** Keys with a meaning in version 2, in the order they are written. */
const TOP_KEYS = ['format', 'version', 'title', 'variables', 'arrows', 'exposures', 'outcomes', 'adjusted'] as const;
const VARIABLE_KEYS = ['id', 'label', 'measured', 'x', 'y', 'note', 'data'] as const;
const DATA_KEYS = ['column', 'kind', 'reference', 'labels'] as const;
const ARROW_KEYS = ['from', 'to', 'note'] as const;
const TOP_KEY_SET: ReadonlySet<string> = new Set(TOP_KEYS);
const VARIABLE_KEY_SET: ReadonlySet<string> = new Set(VARIABLE_KEYS);
const DATA_KEY_SET: ReadonlySet<string> = new Set(DATA_KEYS);
const ARROW_KEY_SET: ReadonlySet<string> = new Set(ARROW_KEYS);

/** The JSON Schema of the native format (also served as /causeway.diagram.schema.json). */
export const diagramSchema: unknown = schema;

/** The generated validator as a type guard; it leaves its failures on `.errors`. */
function matchesSchema(data: unknown): data is DiagramFile {
	return validateSchema(data);
}

/**
 * Reads a native diagram file. Throws InputError naming the line and column of a syntax error
 * or the path of a structure error; never returns a half-read diagram. `limits` are the app's
 * unless the caller (the command line) gives its own.
 */
export function parseDiagramJson(text: string, limits: ReadLimits = APP_READ_LIMITS): Diagram {
	assertDiagramTextSize(text, limits);
	const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
	const data = parseJsonSyntax(body);
	checkFormatAndVersion(data, body);
	if (!matchesSchema(data)) {
		const first = validateSchema.errors?.[0];
		throw first ? structureError(first, data, body) : new InputError('The diagram file does not match the Causeway diagram format');
	}
	const diagram = toDiagram(data);
	assertDiagramWithinLimits(diagram, limits);
	return diagram;
}

/**
 * Writes a diagram as pretty-printed JSON with a stable key order: `format` and `version`
 * first, then the version-1 keys in schema order, then unknown keys (from `extra`) sorted.
 * Known keys win over an `extra` entry of the same name. Throws InputError for a coordinate
 * that JSON cannot hold (NaN, ±Infinity), rather than write a file that cannot be read back.
 */
export function writeDiagramJson(d: Diagram): string {
	const out: Record<string, unknown> = {
		format: DIAGRAM_FORMAT,
		version: DIAGRAM_VERSION,
		title: d.title,
		variables: d.variables.map(writeVariable),
		arrows: d.arrows.map(writeArrow),
		exposures: [...d.exposures],
		outcomes: [...d.outcomes],
		adjusted: [...d.adjusted]
	};
	appendExtra(out, d.extra, TOP_KEY_SET);
	return `${JSON.stringify(out, null, 2)}\n`;
}

function writeVariable(v: Variable, index: number): Record<string, unknown> {
	const out: Record<string, unknown> = { id: v.id, label: v.label, measured: v.measured };
	for (const axis of ['x', 'y'] as const) {
		const value = v[axis];
		if (value === undefined) continue;
		if (!Number.isFinite(value)) {
			throw new InputError(`Variable ${quote(v.id)} has ${axis} = ${String(value)}; a position must be a finite number`, `variables[${index}].${axis}`);
		}
		out[axis] = value;
	}
	if (v.note !== undefined) out.note = v.note;
	if (!isEmptyVariableData(v.data)) out.data = writeVariableData(v.data as VariableData);
	appendExtra(out, v.extra, VARIABLE_KEY_SET);
	return out;
}

/**
 * Value labels are a list in the model (order kept, no prototype keys) and an object in the
 * file (value → name), the form people write by hand. Object.fromEntries defines own
 * properties, so no value can reach a prototype; `__proto__`-like values are left out because
 * the reader drops such keys.
 */
function writeVariableData(data: VariableData): Record<string, unknown> {
	const out: Record<string, unknown> = {};
	if (data.column !== undefined) out.column = data.column;
	if (data.kind !== undefined) out.kind = data.kind;
	if (data.reference !== undefined) out.reference = data.reference;
	if (data.labels && data.labels.length > 0) out.labels = Object.fromEntries(data.labels.filter((l) => !isUnsafeKey(l.value)).map((l) => [l.value, l.label]));
	appendExtra(out, data.extra, DATA_KEY_SET);
	return out;
}

function writeArrow(a: Arrow): Record<string, unknown> {
	const out: Record<string, unknown> = { from: a.from, to: a.to };
	if (a.note !== undefined) out.note = a.note;
	appendExtra(out, a.extra, ARROW_KEY_SET);
	return out;
}

function appendExtra(out: Record<string, unknown>, extra: Extra | undefined, known: ReadonlySet<string>): void {
	if (!extra) return;
	for (const key of Object.keys(extra).sort()) {
		if (known.has(key) || isUnsafeKey(key) || extra[key] === undefined) continue;
		out[key] = extra[key];
	}
}

// ---------------------------------------------------------------------------------------------
// Step 1: syntax

/**
 * Could the text hold a `__proto__`, `constructor` or `prototype` key? A key is written either
 * plainly or with a \u escape, so text with neither cannot. A reviver makes JSON.parse about
 * 1.5× slower (0.25 s more on a 12 MiB diagram, bench/cli.ts), so it runs only when needed.
 */
const MAYBE_UNSAFE_KEY = /__proto__|constructor|prototype|\\u/;

/** JSON.parse, dropping `__proto__`/`constructor`/`prototype` keys at every depth. */
function parseJsonSyntax(body: string): unknown {
	if (body.trim() === '') throw new InputError('The file is empty: expected a Causeway diagram (JSON)', '1:1');
	try {
		if (!MAYBE_UNSAFE_KEY.test(body)) return JSON.parse(body);
		return JSON.parse(body, (key: string, value: unknown) => (isUnsafeKey(key) ? undefined : value));
	} catch (e) {
		if (e instanceof RangeError) throw new InputError('The JSON is nested too deeply to read');
		throw syntaxError(body);
	}
}

const SYNTAX_PROBLEMS: Record<string, string> = {
	InvalidSymbol: 'unexpected character',
	InvalidNumberFormat: 'malformed number',
	PropertyNameExpected: 'expected a key in double quotes',
	ValueExpected: 'expected a value',
	ColonExpected: 'expected a colon (:)',
	CommaExpected: 'expected a comma (,)',
	CloseBraceExpected: 'expected a closing brace (})',
	CloseBracketExpected: 'expected a closing bracket (])',
	EndOfFileExpected: 'unexpected text after the end of the JSON value',
	InvalidCommentToken: 'comments are not allowed in JSON',
	UnexpectedEndOfComment: 'comments are not allowed in JSON',
	UnexpectedEndOfString: 'a string is not closed',
	UnexpectedEndOfNumber: 'malformed number',
	InvalidUnicode: 'malformed \\u escape',
	InvalidEscapeCharacter: 'invalid escape sequence in a string',
	InvalidCharacter: 'a control character inside a string; write it as an escape such as \\t or \\u0001'
};

function syntaxError(body: string): InputError {
	const errors: ParseError[] = [];
	parseLenient(body, errors, { disallowComments: true, allowTrailingComma: false, allowEmptyContent: false });
	const first = errors[0];
	if (!first) return new InputError('The file is not valid JSON');
	const code = printParseErrorCode(first.error);
	const stringEnd = first.offset + first.length;
	if (code === 'UnexpectedEndOfString' && /[\r\n]/.test(body.charAt(stringEnd))) {
		// The scanner stops a string at a raw line break; point at the line break itself.
		const pos = lineColumn(body, stringEnd);
		return new InputError(`Invalid JSON at ${describePosition(pos)}: a line break inside a string; write it as \\n`, `${pos.line}:${pos.column}`);
	}
	const pos = lineColumn(body, first.offset);
	const problem = SYNTAX_PROBLEMS[code] ?? 'syntax error';
	const found = first.offset >= body.length ? 'the end of the file' : quote(body.slice(first.offset, first.offset + Math.min(Math.max(first.length, 1), 20)));
	return new InputError(`Invalid JSON at ${describePosition(pos)}: ${problem} (found ${found})`, `${pos.line}:${pos.column}`);
}

// ---------------------------------------------------------------------------------------------
// Step 2: structure

function isRecord(value: unknown): value is Record<string, unknown> {
	return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function checkFormatAndVersion(data: unknown, body: string): void {
	if (!isRecord(data)) {
		throw new InputError(`A Causeway diagram file must hold a JSON object, but this one holds ${describeFound(data)}`);
	}
	const at = (key: string) => atLine(body, [key]);
	if (!('format' in data)) {
		throw new InputError(`Not a Causeway diagram: the "format" key is missing (expected "format": "${DIAGRAM_FORMAT}")`, 'format');
	}
	if (data.format !== DIAGRAM_FORMAT) {
		throw new InputError(`Not a Causeway diagram: "format" is ${describeFound(data.format)}, expected "${DIAGRAM_FORMAT}"${at('format')}`, 'format');
	}
	const readable = `versions ${READABLE_VERSIONS.join(' and ')}`;
	if (!('version' in data)) {
		throw new InputError(`The "version" key is missing (this version of Causeway reads ${readable})`, 'version');
	}
	if (typeof data.version !== 'number' || !READABLE_VERSIONS.includes(data.version)) {
		const found = typeof data.version === 'number' ? `version ${data.version}` : describeFound(data.version);
		const newer = typeof data.version === 'number' && data.version > DIAGRAM_VERSION ? ' (the file was made by a newer version of Causeway)' : '';
		throw new InputError(`Unsupported diagram version: found ${found}, but this version of Causeway reads ${readable}${newer}${at('version')}`, 'version');
	}
}

/**
 * `/variables/3/id` → `variables[3].id` (JSON Pointer segments unescaped, RFC 6901); a digit
 * key of an object (a value label "1") stays a quoted key: `labels["1"]`.
 */
function pointerToPath(pointer: string, data: unknown): { path: string; segments: JSONPath } {
	const segments: JSONPath = [];
	let path = '';
	if (pointer === '') return { path, segments };
	let here: unknown = data;
	for (const raw of pointer.slice(1).split('/')) {
		const key = raw.replace(/~1/g, '/').replace(/~0/g, '~');
		const inList = Array.isArray(here);
		here = valueAt(here, [inList ? Number(key) : key]);
		if (inList && /^(0|[1-9][0-9]*)$/.test(key)) {
			segments.push(Number(key));
			path += `[${key}]`;
		} else {
			segments.push(key);
			path += /^[A-Za-z_$][\w$]*$/.test(key) ? `${path ? '.' : ''}${key}` : `[${quote(key)}]`;
		}
	}
	return { path, segments };
}

function valueAt(data: unknown, segments: JSONPath): unknown {
	let here: unknown = data;
	for (const s of segments) {
		if (Array.isArray(here) && typeof s === 'number') here = here[s];
		else if (isRecord(here) && typeof s === 'string') here = here[s];
		else return undefined;
	}
	return here;
}

/** ` (line 12, column 7)` for the value at `segments`, or '' when it cannot be found. */
function atLine(body: string, segments: JSONPath): string {
	const tree = parseTree(body);
	const node = tree && findNodeAtLocation(tree, segments);
	return node ? ` (${describePosition(lineColumn(body, node.offset))})` : '';
}

const TYPE_WORDS: Record<string, string> = {
	string: 'text (a string)',
	number: 'a number',
	boolean: 'true or false',
	null: 'null',
	array: 'a list',
	object: 'an object'
};

function structureError(error: ErrorObject, data: unknown, body: string): InputError {
	const { path, segments } = pointerToPath(error.instancePath, data);
	const value = valueAt(data, segments);
	const subject = path === '' ? 'The diagram' : path;
	const line = atLine(body, segments);
	const params: Record<string, unknown> = error.params;
	let problem: string;
	switch (error.keyword) {
		case 'required':
			problem = `is missing the key ${quote(String(params.missingProperty))}`;
			break;
		case 'type': {
			const types = Array.isArray(params.type) ? params.type.map(String) : [String(params.type)];
			problem =
				typeof value === 'number' && !Number.isFinite(value)
					? `must be a finite number, found ${describeFound(value)}`
					: `must be ${types.map((t) => TYPE_WORDS[t] ?? t).join(' or ')}, found ${describeFound(value)}`;
			break;
		}
		case 'enum':
			problem = `must be one of ${(Array.isArray(params.allowedValues) ? params.allowedValues : []).map((x) => JSON.stringify(x)).join(', ')}, found ${describeFound(value)}`;
			break;
		case 'minLength':
			problem = 'must not be empty';
			break;
		case 'const':
			problem = `must be ${JSON.stringify(params.allowedValue)}, found ${describeFound(value)}`;
			break;
		default:
			problem = error.message ?? 'is not valid';
	}
	return new InputError(`${subject} ${problem}${line}`, path || undefined);
}

// ---------------------------------------------------------------------------------------------
// Step 3: model

/**
 * Deepest nesting kept in a value the format does not know. JSON.parse reads any depth, but
 * writing such a value back (JSON.stringify) and copying it recurse, so a hostile file could
 * overflow the stack later; the known keys have a fixed shallow shape checked by the schema.
 */
const MAX_KEPT_DEPTH = 1_000;

/** Refuses a kept value nested deeper than MAX_KEPT_DEPTH; iterative, O(size of the value). */
function assertShallow(value: unknown): void {
	const stack: [unknown, number][] = [[value, 1]];
	while (stack.length > 0) {
		const [v, depth] = stack.pop() as [unknown, number];
		if (typeof v !== 'object' || v === null) continue;
		if (depth > MAX_KEPT_DEPTH) throw new InputError('The JSON is nested too deeply to read');
		for (const child of Array.isArray(v) ? v : Object.values(v)) stack.push([child, depth + 1]);
	}
}

/** Copies the keys that `known` does not list into a fresh object; undefined when none. */
function extraOf(source: Record<string, unknown>, known: ReadonlySet<string>): Extra | undefined {
	let extra: Extra | undefined;
	for (const key of Object.keys(source)) {
		if (known.has(key) || isUnsafeKey(key)) continue;
		assertShallow(source[key]);
		extra ??= {};
		extra[key] = source[key];
	}
	return extra;
}

/** True when every own key of `o` is in `keys` (a for-in loop: no key array per object). */
function onlyKeys(o: object, keys: ReadonlySet<string>): boolean {
	for (const k in o) if (!keys.has(k)) return false;
	return true;
}

/** Keys a variable object may have to be taken as it is (its data settings need converting). */
const PLAIN_VARIABLE_KEYS: ReadonlySet<string> = new Set(['id', 'label', 'measured', 'x', 'y', 'note']);

/**
 * A schema-valid object that already has the model's shape (a variable with its label and
 * measured flag, an arrow with no unknown keys: what Causeway writes) is taken as it is rather
 * than copied. JSON.parse made it for this call alone, so nothing else holds it; not copying
 * 300,000 objects halves the garbage collector's work on a 100,000-variable file (bench/cli.ts).
 */
function toDiagram(file: DiagramFile): Diagram {
	const variables = file.variables.map((fv): Variable => {
		if (fv.label !== undefined && fv.measured !== undefined && onlyKeys(fv, PLAIN_VARIABLE_KEYS)) return fv as Variable;
		const v: Variable = { id: fv.id, label: fv.label ?? fv.id, measured: fv.measured ?? true };
		if (fv.x !== undefined) v.x = fv.x;
		if (fv.y !== undefined) v.y = fv.y;
		if (fv.note !== undefined) v.note = fv.note;
		if (fv.data !== undefined) {
			const data = toVariableData(fv.data);
			if (!isEmptyVariableData(data)) v.data = data;
		}
		const extra = extraOf(fv, VARIABLE_KEY_SET);
		if (extra) v.extra = extra;
		return v;
	});
	const arrows = file.arrows.map((fa): Arrow => {
		if (onlyKeys(fa, ARROW_KEY_SET)) return fa as Arrow;
		const a: Arrow = { from: fa.from, to: fa.to };
		if (fa.note !== undefined) a.note = fa.note;
		const extra = extraOf(fa, ARROW_KEY_SET);
		if (extra) a.extra = extra;
		return a;
	});
	const d: Diagram = {
		title: file.title ?? '',
		variables,
		arrows,
		exposures: [...(file.exposures ?? [])],
		outcomes: [...(file.outcomes ?? [])],
		adjusted: [...(file.adjusted ?? [])]
	};
	const extra = extraOf(file, TOP_KEY_SET);
	if (extra) d.extra = extra;
	return d;
}

function toVariableData(fd: FileVariableData): VariableData {
	const data: VariableData = {};
	if (fd.column !== undefined) data.column = fd.column;
	if (fd.kind !== undefined) data.kind = fd.kind;
	if (fd.reference !== undefined) data.reference = fd.reference;
	if (fd.labels !== undefined) {
		const labels = Object.keys(fd.labels).map((value) => ({ value, label: (fd.labels as Record<string, string>)[value] }));
		if (labels.length > 0) data.labels = labels;
	}
	const extra = extraOf(fd, DATA_KEY_SET);
	if (extra) data.extra = extra;
	return data;
}
