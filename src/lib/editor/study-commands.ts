/**
 * The edits that make a diagram a study document: changing a variable's id (every reference
 * follows: arrows, exposures, outcomes, planned set; its notes and data settings travel on
 * the variable), notes on arrows, and each variable's data settings (column, kind, reference
 * level, value labels), with the limits the file readers enforce checked at the moment of the
 * edit. Pure functions used by commands.ts; each returns a new diagram or a one-line refusal.
 * O(n + m) per command.
 */
import { canonicalLabels, isEmptyVariableData, isUnsafeKey, type Diagram, type Variable, type VariableData } from '../graph/diagram';
import { textTooLong, variableDataProblem } from '../graph/size-limits';
import { STUDY_TEXT } from '../wording/study';

export type StudyResult = { ok: true; diagram: Diagram; summary: string } | { ok: false; message: string };

const refuse = (message: string): StudyResult => ({ ok: false, message });

/** An id DOT and every reader can hold: no control character, no backslash DOT cannot write. */
const UNWRITABLE_ID = /[\u0000-\u001f\u007f\u2028\u2029]|\\(?=["]|$)/;

/**
 * Renames an id everywhere it occurs: the variable, arrows and the question lists. The
 * variable's note and data settings are on the variable, so they follow. O(n + m).
 */
export function applyChangeId(d: Diagram, id: string, rawNewId: string): StudyResult {
	const v = d.variables.find((x) => x.id === id);
	if (!v) return refuse(`No variable with the id "${id}".`);
	const newId = rawNewId.trim();
	if (newId.length === 0) return refuse(STUDY_TEXT.idEmpty);
	if (newId === id) return refuse(STUDY_TEXT.idUnchanged);
	const long = textTooLong('The id', newId, 'id');
	if (long) return refuse(STUDY_TEXT.tooLongKept(long, 'id'));
	if (UNWRITABLE_ID.test(newId)) return refuse(STUDY_TEXT.idUnwritable);
	if (d.variables.some((x) => x.id === newId)) return refuse(STUDY_TEXT.idTaken(newId));
	const swap = (x: string) => (x === id ? newId : x);
	return {
		ok: true,
		diagram: {
			...d,
			variables: d.variables.map((x) => (x.id === id ? { ...x, id: newId } : x)),
			arrows: d.arrows.map((a) => (a.from === id || a.to === id ? { ...a, from: swap(a.from), to: swap(a.to) } : a)),
			exposures: d.exposures.map(swap),
			outcomes: d.outcomes.map(swap),
			adjusted: d.adjusted.map(swap)
		},
		summary: STUDY_TEXT.idChanged(v.label, id, newId)
	};
}

const labelOf = (d: Diagram, id: string) => d.variables.find((v) => v.id === id)?.label ?? id;

/** Sets (or, with an empty text, removes) the note on an arrow. */
export function applyArrowNote(d: Diagram, from: string, to: string, note: string): StudyResult {
	const index = d.arrows.findIndex((a) => a.from === from && a.to === to);
	const name = `${labelOf(d, from)} → ${labelOf(d, to)}`;
	if (index < 0) return refuse(STUDY_TEXT.noArrow(name));
	const text = note.trim() === '' ? '' : note;
	if ((d.arrows[index].note ?? '') === text) return refuse(STUDY_TEXT.noteUnchanged);
	const long = textTooLong('The note', text, 'note');
	if (long) return refuse(STUDY_TEXT.tooLongKept(long, 'note'));
	const arrows = d.arrows.map((a, i) => {
		if (i !== index) return a;
		const { note: _old, ...rest } = a;
		return text === '' ? rest : { ...rest, note: text };
	});
	return { ok: true, diagram: { ...d, arrows }, summary: STUDY_TEXT.noteOnArrow(name, text === '') };
}

/** Sets (or removes) the note on a variable, within the note limit. */
export function applyVariableNote(d: Diagram, id: string, note: string): StudyResult {
	const v = d.variables.find((x) => x.id === id);
	if (!v) return refuse(`No variable with the id "${id}".`);
	const text = note.trim() === '' ? '' : note;
	if ((v.note ?? '') === text) return refuse(STUDY_TEXT.noteUnchanged);
	const long = textTooLong('The note', text, 'note');
	if (long) return refuse(STUDY_TEXT.tooLongKept(long, 'note'));
	const { note: _old, ...rest } = v;
	const next: Variable = text === '' ? rest : { ...rest, note: text };
	return { ok: true, diagram: { ...d, variables: d.variables.map((x) => (x.id === id ? next : x)) }, summary: STUDY_TEXT.noteOnVariable(v.label, text === '') };
}

/** Settings in their stored form: blank labels dropped, labels in file order, nothing empty kept. */
export function normaliseVariableData(data: VariableData | undefined): VariableData | undefined {
	if (!data) return undefined;
	const out: VariableData = {};
	if (data.column !== undefined) out.column = data.column;
	if (data.kind !== undefined) out.kind = data.kind;
	if (data.reference !== undefined) out.reference = data.reference;
	const labels = canonicalLabels((data.labels ?? []).filter((l) => l.label.trim() !== ''));
	if (labels.length > 0) out.labels = labels;
	if (data.extra && Object.keys(data.extra).length > 0) out.extra = data.extra;
	return isEmptyVariableData(out) ? undefined : out;
}

function sameData(a: VariableData | undefined, b: VariableData | undefined): boolean {
	return JSON.stringify(a ?? null) === JSON.stringify(b ?? null);
}

/** What changed, for the undo list: "Age: column "age_y"", "Occupation: reference level "0"". */
function describeChange(before: VariableData | undefined, after: VariableData | undefined): string {
	const b = before ?? {};
	const a = after ?? {};
	const changes: string[] = [];
	if (b.column !== a.column) changes.push(STUDY_TEXT.columnSet(a.column));
	if (b.kind !== a.kind) changes.push(STUDY_TEXT.kindSet(a.kind));
	if (b.reference !== a.reference) changes.push(STUDY_TEXT.referenceSet(a.reference));
	if (JSON.stringify(b.labels ?? []) !== JSON.stringify(a.labels ?? [])) changes.push(STUDY_TEXT.labelsSet);
	return changes.length > 0 ? changes.join(', ') : STUDY_TEXT.otherSettings;
}

/**
 * Replaces a variable's data settings with `data` (undefined: none), after checking what the
 * readers check (lengths, number of labels) and what the data side needs: a column name that
 * is not blank, one name per value, no reference for an ordinal column (its order decides).
 */
export function applyVariableData(d: Diagram, id: string, data: VariableData | undefined): StudyResult {
	const v = d.variables.find((x) => x.id === id);
	if (!v) return refuse(`No variable with the id "${id}".`);
	if (typeof data?.column === 'string' && data.column.trim() === '') return refuse(STUDY_TEXT.columnBlank);
	for (const l of data?.labels ?? []) if (isUnsafeKey(l.value)) return refuse(STUDY_TEXT.valueUnsafe(l.value));
	const next = normaliseVariableData(data);
	if (sameData(v.data, next)) return refuse(STUDY_TEXT.dataUnchanged);
	const problem = variableDataProblem(v.label, next);
	if (problem) return refuse(`${problem}; the settings are unchanged.`);
	if (next?.kind === 'ordinal' && next.reference !== undefined) return refuse(STUDY_TEXT.ordinalReference(v.label));
	const names = new Set<string>();
	for (const l of next?.labels ?? []) {
		if (names.has(l.label)) return refuse(STUDY_TEXT.labelTwice(l.label, v.label));
		names.add(l.label);
	}
	const { data: _old, ...rest } = v;
	const variable: Variable = next ? { ...rest, data: next } : rest;
	return {
		ok: true,
		diagram: { ...d, variables: d.variables.map((x) => (x.id === id ? variable : x)) },
		summary: STUDY_TEXT.dataChanged(v.label, describeChange(v.data, next))
	};
}
