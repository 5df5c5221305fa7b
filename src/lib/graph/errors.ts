/**
 * The one error type the diagram layer throws for bad input, and the small helpers that keep
 * its messages to one readable line.
 *
 * An InputError is meant to be shown to the user as is: its message names the problem and
 * where it is (`line 3, column 7` for syntax errors, a path such as `variables[3].id` for
 * structure errors, a variable id or arrow number for diagram errors). The CLI prints it on one
 * line of stderr with exit code 2; the app shows it beside the file it came from.
 */

export class InputError extends Error {
	/**
	 * @param message one line: what is wrong and where.
	 * @param where the place on its own (`3:7`, `variables[3].id`, a file name…), for callers
	 *   that want to point at it, e.g. select the variable or the line.
	 */
	constructor(
		message: string,
		readonly where?: string
	) {
		super(oneLine(message));
		this.name = 'InputError';
	}
}

/** Collapses line breaks and runs of blank space so a message stays on one line. */
export function oneLine(text: string): string {
	return text.replace(/\s*[\r\n\u2028\u2029]+\s*/g, ' ').trim();
}

/** 1-based line and column (in UTF-16 code units) of `offset` in `text`; O(offset). */
export function lineColumn(text: string, offset: number): { line: number; column: number } {
	let line = 1;
	let lineStart = 0;
	const end = Math.max(0, Math.min(offset, text.length));
	for (let i = 0; i < end; i++) {
		const c = text.charCodeAt(i);
		if (c === 10 /* \n */) {
			line++;
			lineStart = i + 1;
		} else if (c === 13 /* \r */) {
			if (text.charCodeAt(i + 1) !== 10) {
				line++;
				lineStart = i + 1;
			}
		}
	}
	return { line, column: end - lineStart + 1 };
}

/** `line 3, column 7` — the phrase used in messages. */
export function describePosition(pos: { line: number; column: number }): string {
	return `line ${pos.line}, column ${pos.column}`;
}

/**
 * An id or a piece of user text as it should appear inside a message: in double quotes,
 * with control characters and quotes escaped (JSON string syntax), shortened past 60 characters
 * so one hostile value cannot flood the line.
 */
export function quote(text: string): string {
	const short = text.length > 60 ? `${text.slice(0, 57)}…` : text;
	return JSON.stringify(short).replace(/[\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16)}`);
}

/**
 * An id shown bare when it is plain (letters, digits and a few marks, as most ids are),
 * quoted otherwise — used in arrow and path listings like `diet → bmi`.
 */
export function showId(id: string): string {
	return /^[\p{L}\p{N}_.:\-]{1,60}$/u.test(id) ? id : quote(id);
}

/** A short description of a JSON value for "found …" phrases. */
export function describeFound(value: unknown): string {
	if (value === null) return 'null';
	if (Array.isArray(value)) return 'a list';
	switch (typeof value) {
		case 'string':
			return value === '' ? 'an empty string' : `the text ${quote(value)}`;
		case 'number':
			return Number.isFinite(value) ? `the number ${value}` : `the number ${String(value)} (too large for a coordinate)`;
		case 'boolean':
			return String(value);
		case 'object':
			return 'an object';
		default:
			return typeof value;
	}
}
