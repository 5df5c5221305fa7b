/**
 * Enforces the stated limits of src/lib/limits.ts on diagrams: the length of a file's text
 * before it is parsed, then the number of variables and arrows and the length of ids, labels,
 * notes, data settings and the title of what was read. Each refusal is an InputError naming
 * the limit and, for a text field, the variable or arrow. The editor asks the same questions
 * one field at a time (`textTooLong`, `countProblem`) at the moment of each edit, so that
 * nothing the app lets a user write is refused when the file is read back.
 * O(size of the text) and O(n + m).
 */
import type { Diagram, VariableData } from './diagram';
import { InputError, quote } from './errors';
import {
	CLI_MAX_ARROWS,
	CLI_MAX_DIAGRAM_BYTES,
	CLI_MAX_VARIABLES,
	describeBytes,
	describeCount,
	MAX_ARROWS,
	MAX_DIAGRAM_CHARS,
	MAX_LABEL_CHARS,
	MAX_NOTE_CHARS,
	MAX_VALUE_LABELS,
	MAX_VARIABLES
} from '../limits';

/**
 * How large a diagram a reader accepts, and who says so in the refusal: the app (the default
 * everywhere) or the command line, whose limits are larger because it draws nothing.
 */
export interface ReadLimits {
	variables: number;
	arrows: number;
	/** Longest text, in characters. */
	chars: number;
	/** Who refuses, as the messages say it: "Causeway handles at most …". */
	reader: string;
	/** Said after a count refusal, e.g. where a larger limit applies; may be empty. */
	hint: string;
}

export const APP_READ_LIMITS: ReadLimits = { variables: MAX_VARIABLES, arrows: MAX_ARROWS, chars: MAX_DIAGRAM_CHARS, reader: 'Causeway', hint: '' };
export const CLI_READ_LIMITS: ReadLimits = {
	variables: CLI_MAX_VARIABLES,
	arrows: CLI_MAX_ARROWS,
	chars: CLI_MAX_DIAGRAM_BYTES,
	reader: 'the causeway command',
	hint: ' (its limit for pipelines; see docs/cli.md)'
};

/** The fields with a length limit, and their limit. */
export const TEXT_LIMITS = {
	id: MAX_LABEL_CHARS,
	label: MAX_LABEL_CHARS,
	title: MAX_LABEL_CHARS,
	note: MAX_NOTE_CHARS,
	column: MAX_LABEL_CHARS,
	reference: MAX_LABEL_CHARS,
	value: MAX_LABEL_CHARS,
	'value label': MAX_LABEL_CHARS
} as const;
export type LimitedText = keyof typeof TEXT_LIMITS;

/** "The name is too long: 1,001 characters, at most 1,000 are allowed", or null when it fits. */
export function textTooLong(what: string, text: string, field: LimitedText): string | null {
	const max = TEXT_LIMITS[field];
	return text.length > max ? `${what} is too long: ${describeCount(text.length)} characters, at most ${describeCount(max)} are allowed` : null;
}

/** Refusal for one more variable or arrow past the limit, or null. */
export function countProblem(d: Diagram, adding: { variables?: number; arrows?: number }): string | null {
	const v = d.variables.length + (adding.variables ?? 0);
	const a = d.arrows.length + (adding.arrows ?? 0);
	if ((adding.variables ?? 0) > 0 && v > MAX_VARIABLES) return `A diagram holds at most ${describeCount(MAX_VARIABLES)} variables; this one has ${describeCount(d.variables.length)}`;
	if ((adding.arrows ?? 0) > 0 && a > MAX_ARROWS) return `A diagram holds at most ${describeCount(MAX_ARROWS)} arrows; this one has ${describeCount(d.arrows.length)}`;
	return null;
}

/** The first over-long field of a variable's data settings, as a message, or null. */
export function variableDataProblem(name: string, data: VariableData | undefined): string | null {
	if (!data) return null;
	if (typeof data.column === 'string') {
		const p = textTooLong(`The column name of ${name}`, data.column, 'column');
		if (p) return p;
	}
	if (data.reference !== undefined) {
		const p = textTooLong(`The reference level of ${name}`, data.reference, 'reference');
		if (p) return p;
	}
	const labels = data.labels ?? [];
	if (labels.length > MAX_VALUE_LABELS) return `${name} has ${describeCount(labels.length)} value labels; at most ${describeCount(MAX_VALUE_LABELS)} are allowed`;
	for (const l of labels) {
		const p = textTooLong(`A value of ${name}`, l.value, 'value') ?? textTooLong(`The label of value ${quote(l.value.slice(0, 40))} of ${name}`, l.label, 'value label');
		if (p) return p;
	}
	return null;
}

/** Refuses a diagram text longer than the limit (MAX_DIAGRAM_CHARS in the app) before any parsing work is done. */
export function assertDiagramTextSize(text: string, limits: ReadLimits = APP_READ_LIMITS): void {
	if (text.length > limits.chars) throw diagramTooLarge(describeBytes(text.length), limits);
}

/** "The file is too large: 70 MiB of text, but …", for a text or a byte count. */
export function diagramTooLarge(size: string, limits: ReadLimits = APP_READ_LIMITS): InputError {
	return limits === APP_READ_LIMITS
		? new InputError(`The file is too large: ${size} of text, but a diagram file may have at most ${describeBytes(limits.chars)}`)
		: new InputError(`The file is too large: ${size}, but ${limits.reader} reads at most ${describeBytes(limits.chars)} of diagram${limits.hint}`);
}

function tooLong(what: string, length: number, max: number, where: string): InputError {
	return new InputError(`${what} is too long: ${describeCount(length)} characters, at most ${describeCount(max)} are allowed`, where);
}

/** Refuses a diagram with more variables or arrows than the limits, or an over-long text field. */
export function assertDiagramWithinLimits(d: Diagram, limits: ReadLimits = APP_READ_LIMITS): void {
	if (d.variables.length > limits.variables) {
		throw new InputError(`The diagram has ${describeCount(d.variables.length)} variables; ${limits.reader} handles at most ${describeCount(limits.variables)}${limits.hint}`, 'variables');
	}
	if (d.arrows.length > limits.arrows) {
		throw new InputError(`The diagram has ${describeCount(d.arrows.length)} arrows; ${limits.reader} handles at most ${describeCount(limits.arrows)}${limits.hint}`, 'arrows');
	}
	if (d.title.length > MAX_LABEL_CHARS) throw tooLong('The title', d.title.length, MAX_LABEL_CHARS, 'title');
	d.variables.forEach((v, i) => {
		// The name is built only when needed: 100,000 variables are checked in milliseconds.
		const name = () => `Variable ${i + 1} (${quote(v.id)})`;
		if (v.id.length > MAX_LABEL_CHARS) throw tooLong(`The id of variable ${i + 1} (${quote(v.id)})`, v.id.length, MAX_LABEL_CHARS, `variables[${i}].id`);
		if (v.label.length > MAX_LABEL_CHARS) throw tooLong(`The label of ${name()}`, v.label.length, MAX_LABEL_CHARS, `variables[${i}].label`);
		if (v.note !== undefined && v.note.length > MAX_NOTE_CHARS) throw tooLong(`The note of ${name()}`, v.note.length, MAX_NOTE_CHARS, `variables[${i}].note`);
		const data = v.data && variableDataProblem(name(), v.data);
		if (data) throw new InputError(data, `variables[${i}].data`);
	});
	d.arrows.forEach((a, i) => {
		if (a.note !== undefined && a.note.length > MAX_NOTE_CHARS) throw tooLong(`The note of arrow ${i + 1} (${quote(a.from)} → ${quote(a.to)})`, a.note.length, MAX_NOTE_CHARS, `arrows[${i}].note`);
	});
}
