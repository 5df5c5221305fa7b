/**
 * Tables of a diagram for spreadsheets and documents: variables and arrows as CSV, the
 * adjustment sets as CSV and as a Markdown table. CSV is RFC 4180 (comma, CRLF, quotes
 * doubled) written by papaparse; a cell that a spreadsheet would run as a formula (starting
 * with =, +, -, @, tab or CR) gets a leading apostrophe (papaparse `escapeFormulae`), since a
 * shared diagram's labels are not trusted. Pure; O(size of the output).
 */
import Papa from 'papaparse';
import type { Diagram } from '../graph/diagram';
import type { AdjustmentCheck, AdjustmentSets, VariableRoles } from '../causal';
import { EMPTY_SET, labelLookup } from '../wording';
import { escapeMarkdownInline } from './escape';

function csv(header: string[], rows: (string | number)[][]): string {
	return Papa.unparse({ fields: header, data: rows }, { newline: '\r\n', escapeFormulae: true }) + '\r\n';
}

/**
 * Role words of a variable, in a fixed order: the engine's roles for the question, then
 * "adjusted" when it is in the planned set.
 */
export function roleWords(id: string, d: Diagram, roles: readonly VariableRoles[]): string[] {
	const own = roles.find((r) => r.id === id)?.roles ?? [];
	const words: string[] = [...own];
	if (d.exposures.includes(id) && !words.includes('exposure')) words.unshift('exposure');
	if (d.outcomes.includes(id) && !words.includes('outcome')) words.unshift('outcome');
	if (d.adjusted.includes(id)) words.push('adjusted');
	return words;
}

/** id,label,measured,roles — roles separated by ";" (e.g. "confounder;adjusted"). */
export function variablesCsv(d: Diagram, roles: readonly VariableRoles[]): string {
	return csv(
		['id', 'label', 'measured', 'roles'],
		d.variables.map((v) => [v.id, v.label, v.measured ? 'true' : 'false', roleWords(v.id, d, roles).join(';')])
	);
}

/** from,to,from_label,to_label — one row per arrow, in the diagram's order. */
export function arrowsCsv(d: Diagram): string {
	const label = labelLookup(d);
	return csv(
		['from', 'to', 'from_label', 'to_label'],
		d.arrows.map((a) => [a.from, a.to, label(a.from), label(a.to)])
	);
}

export interface SetsTableInput {
	sets: AdjustmentSets;
	/** The verdict on the diagram's planned set, when there is a question. */
	check?: AdjustmentCheck | null;
}

interface SetRow {
	kind: 'minimal' | 'smallest' | 'optimal' | 'planned';
	number: number | '';
	ids: string[];
	sufficient: boolean;
}

function setRows({ sets, check }: SetsTableInput): SetRow[] {
	const rows: SetRow[] = sets.sets.map((ids, i) => ({ kind: 'minimal', number: i + 1, ids, sufficient: true }));
	if (sets.minimum) rows.push({ kind: 'smallest', number: '', ids: sets.minimum, sufficient: true });
	if (sets.optimal) rows.push({ kind: 'optimal', number: '', ids: sets.optimal, sufficient: true });
	if (check) rows.push({ kind: 'planned', number: '', ids: check.adjusted, sufficient: check.valid });
	return rows;
}

/**
 * kind,number,size,ids,labels,sufficient — every minimal sufficient set (numbered, ordered by
 * size then ids), then the smallest and the efficiency-optimal set when they exist, then the
 * planned set with its verdict. Ids and labels within a set are separated by ";".
 */
export function setsCsv(d: Diagram, input: SetsTableInput): string {
	const label = labelLookup(d);
	return csv(
		['kind', 'number', 'size', 'ids', 'labels', 'sufficient'],
		setRows(input).map((r) => [r.kind, r.number, r.ids.length, r.ids.join(';'), r.ids.map(label).join(';'), r.sufficient ? 'true' : 'false'])
	);
}

const KIND_TEXT: Record<SetRow['kind'], string> = {
	minimal: 'Minimal sufficient set',
	smallest: 'Smallest set',
	optimal: 'Efficiency-optimal set',
	planned: 'Planned set'
};

/** The sets as a Markdown (GitHub/CommonMark pipe) table, with a line on the question above it. */
export function setsMarkdown(d: Diagram, input: SetsTableInput): string {
	const label = labelLookup(d);
	const names = (ids: readonly string[]) => (ids.length === 0 ? '(none: no adjustment needed)' : ids.map((id) => escapeMarkdownInline(label(id))).join(', '));
	const { sets } = input;
	const lines = [
		`Adjustment sets for the ${sets.effect} effect of ${names(sets.exposures)} on ${names(sets.outcomes)}.`,
		''
	];
	if (!sets.identifiable) {
		lines.push('No set of measured variables is sufficient: the effect cannot be identified by adjustment under this diagram.');
	}
	lines.push('| Set | Variables | Size | Sufficient |', '| --- | --- | ---: | --- |');
	for (const r of setRows(input)) {
		const name = r.kind === 'minimal' ? `${KIND_TEXT[r.kind]} ${r.number}` : KIND_TEXT[r.kind];
		// An empty sufficient set means no adjustment is needed; an empty planned set that is not
		// sufficient is only the empty set (saying "no adjustment needed" beside "no" contradicted itself).
		const members = r.ids.length === 0 && !r.sufficient ? `${EMPTY_SET} (nothing adjusted for)` : names(r.ids);
		lines.push(`| ${name} | ${members} | ${r.ids.length} | ${r.sufficient ? 'yes' : 'no'} |`);
	}
	if (sets.truncated) lines.push('', `The listing stopped after ${sets.sets.length} sets; more exist.`);
	return lines.join('\n') + '\n';
}
