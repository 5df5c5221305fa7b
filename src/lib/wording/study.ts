/**
 * Words about the study as one document: ids, notes, each variable's data settings, the data
 * kept or dropped when another diagram is opened, the stored copy kept aside, and the verdict
 * for the diagram as the data see it. Shared by the editor's commands, the app and the CLI.
 */
import type { DataKind, VariableData } from '../graph/diagram';
import type { Rematch } from '../datacheck/rematch';

const q = (s: string) => `"${s}"`;

/** "Occupation: column occ_code, categorical, reference 0, 3 value labels" (report, text view). */
export function dataSettingsText(data: VariableData | undefined): string {
	if (!data) return 'matched by name';
	const parts: string[] = [];
	if (data.column === null) parts.push('no data (treated as unmeasured by the checks)');
	else if (data.column !== undefined) parts.push(`column ${q(data.column)}`);
	else parts.push('column matched by name');
	if (data.kind) parts.push(data.kind);
	if (data.reference !== undefined) parts.push(`reference ${q(data.reference)}`);
	if (data.labels?.length) parts.push(data.labels.map((l) => `${l.value} = ${q(l.label)}`).join(', '));
	return parts.join('; ');
}

export const STUDY_TEXT = {
	tooLongKept: (problem: string, what: string) => `${problem}; the old ${what} is kept.`,
	idUnchanged: 'The id is unchanged.',
	idEmpty: 'An id cannot be empty.',
	idTaken: (id: string) => `There is already a variable with the id ${q(id)}.`,
	idUnwritable: 'An id cannot hold a line break, a control character or a backslash at its end or before a quote.',
	idChanged: (label: string, from: string, to: string) => `Change the id of ${label} from ${q(from)} to ${q(to)}`,
	noteUnchanged: 'The note is unchanged.',
	noteOnVariable: (label: string, empty: boolean) => (empty ? `Remove the note on ${label}` : `Edit the note on ${label}`),
	noteOnArrow: (name: string, empty: boolean) => (empty ? `Remove the note on arrow ${name}` : `Edit the note on arrow ${name}`),
	noArrow: (name: string) => `There is no arrow ${name}.`,
	dataUnchanged: 'The data settings are unchanged.',
	columnBlank: 'A column name cannot be blank; choose "match by name" or "no data" instead.',
	labelTwice: (label: string, name: string) => `Two values of ${name} would both be named ${q(label)}; give each value its own name.`,
	valueUnsafe: (value: string) => `The value ${q(value)} cannot be labelled.`,
	ordinalReference: (name: string) => `${name} is ordinal: its levels keep their order and the lowest is the reference, so no other reference can be set.`,
	dataChanged: (label: string, change: string) => `${label}: ${change}`,
	columnSet: (column: string | null | undefined) => (column === undefined ? 'match the column by name' : column === null ? 'no data (unmeasured for the checks)' : `column ${q(column)}`),
	kindSet: (kind: DataKind | undefined) => (kind ? `analysed as ${kind}` : 'kind as detected'),
	referenceSet: (reference: string | undefined) => (reference === undefined ? 'first level as reference' : `reference level ${q(reference)}`),
	labelsSet: 'value labels',
	otherSettings: 'data settings'
} as const;

/** The differences after a kept table met another diagram, as sentences for the Data section. */
export function rematchSentences(r: Rematch): string[] {
	const out: string[] = [];
	const linked = r.linked.map((l) => `${l.label} ← ${q(l.column)}${l.before !== null && l.before !== l.label ? ` (was ${l.before})` : ''}`);
	out.push(linked.length ? `${r.source} was matched again to this diagram: ${linked.join(', ')}.` : `${r.source} was matched again to this diagram, but no variable found a column.`);
	if (r.unlinked.length) out.push(`No column for ${r.unlinked.join(', ')}: treated as unmeasured by the data checks.`);
	if (r.dropped.length) out.push(`No longer used: ${r.dropped.map((x) => `${q(x.column)} (was ${x.before})`).join(', ')}.`);
	return out;
}

/** The Adjustment section's second verdict, for the diagram as the data see it. */
export const DATA_VIEW_TEXT = {
	heading: 'For the diagram as the data see it',
	diagramHeading: 'For the diagram',
	why: (source: string, names: string) => `${source} has no column for ${names}, so the data checks and estimates treat ${names.includes(',') || names.includes(' and ') ? 'them' : 'it'} as unmeasured.`,
	sameVerdict: 'The verdict is the same.',
	differs: 'The verdict differs: the estimates in the Data section follow this one.',
	setsWithData: (sets: string) => `Sufficient with the variables that have data: ${sets}.`,
	/** Where a set's sufficiency is judged: the diagram, or the diagram as the data see it (variables without a column unmeasured). */
	judgedUnder: (someWithoutColumn: boolean) => (someWithoutColumn ? 'for the diagram as the data see it (variables without a column count as unmeasured)' : 'under the diagram'),
	noSetWithData: 'No set of variables with data is sufficient: every adjusted estimate stays biased under the diagram.'
} as const;
