/**
 * Enforces the stated limits of src/lib/limits.ts on diagram files: the length of the text
 * before it is parsed, then the number of variables and arrows and the length of ids, labels,
 * notes and the title of what was read. Each refusal is an InputError naming the limit and,
 * for a text field, the variable. O(size of the text) and O(n + m).
 */
import type { Diagram } from './diagram';
import { InputError, quote } from './errors';
import { describeBytes, describeCount, MAX_ARROWS, MAX_DIAGRAM_CHARS, MAX_LABEL_CHARS, MAX_NOTE_CHARS, MAX_VARIABLES } from '../limits';

/** Refuses a diagram text longer than MAX_DIAGRAM_CHARS before any parsing work is done. */
export function assertDiagramTextSize(text: string): void {
	if (text.length > MAX_DIAGRAM_CHARS) {
		throw new InputError(`The file is too large: ${describeBytes(text.length)} of text, but a diagram file may have at most ${describeBytes(MAX_DIAGRAM_CHARS)}`);
	}
}

function tooLong(what: string, length: number, max: number, where: string): InputError {
	return new InputError(`${what} is too long: ${describeCount(length)} characters, at most ${describeCount(max)} are allowed`, where);
}

/** Refuses a diagram with more variables or arrows than the limits, or an over-long text field. */
export function assertDiagramWithinLimits(d: Diagram): void {
	if (d.variables.length > MAX_VARIABLES) {
		throw new InputError(`The diagram has ${describeCount(d.variables.length)} variables; Causeway handles at most ${describeCount(MAX_VARIABLES)}`, 'variables');
	}
	if (d.arrows.length > MAX_ARROWS) {
		throw new InputError(`The diagram has ${describeCount(d.arrows.length)} arrows; Causeway handles at most ${describeCount(MAX_ARROWS)}`, 'arrows');
	}
	if (d.title.length > MAX_LABEL_CHARS) throw tooLong('The title', d.title.length, MAX_LABEL_CHARS, 'title');
	d.variables.forEach((v, i) => {
		const name = `Variable ${i + 1} (${quote(v.id)})`;
		if (v.id.length > MAX_LABEL_CHARS) throw tooLong(`The id of variable ${i + 1} (${quote(v.id)})`, v.id.length, MAX_LABEL_CHARS, `variables[${i}].id`);
		if (v.label.length > MAX_LABEL_CHARS) throw tooLong(`The label of ${name}`, v.label.length, MAX_LABEL_CHARS, `variables[${i}].label`);
		if (v.note !== undefined && v.note.length > MAX_NOTE_CHARS) throw tooLong(`The note of ${name}`, v.note.length, MAX_NOTE_CHARS, `variables[${i}].note`);
	});
}
