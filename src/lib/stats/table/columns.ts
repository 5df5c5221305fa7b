/**
 * Building and reading columns outside the CSV reader: from plain arrays (tests, CLI,
 * summaries) and as numeric views for the tests and regressions. All functions are O(n).
 */
import { StatsError } from '../errors';
import type { CodedColumn, Column, ContinuousColumn } from './types';

/** A continuous column from numbers; NaN, null and undefined are missing. */
export function continuousColumn(name: string, values: ArrayLike<number | null | undefined>): ContinuousColumn {
	const out = new Float64Array(values.length);
	let missing = 0;
	for (let i = 0; i < values.length; i++) {
		const v = values[i];
		if (v === null || v === undefined || Number.isNaN(v)) {
			out[i] = NaN;
			missing++;
		} else out[i] = v;
	}
	return { name, kind: 'continuous', values: out, missing };
}

/**
 * A coded column from labels (numbers are turned into their text). `levels` fixes the
 * level order (first = reference); by default levels are sorted (numerically when all are
 * numbers). The kind defaults to binary for two levels, categorical otherwise.
 */
export function codedColumn(
	name: string,
	values: ArrayLike<string | number | null | undefined>,
	options: { kind?: 'binary' | 'categorical' | 'ordinal'; levels?: readonly string[] } = {}
): CodedColumn {
	const labels: (string | null)[] = [];
	for (let i = 0; i < values.length; i++) {
		const v = values[i];
		labels.push(v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v)) ? null : String(v));
	}
	const levels = options.levels ? [...options.levels] : sortLevels([...new Set(labels.filter((l): l is string => l !== null))]);
	const index = new Map(levels.map((l, i) => [l, i]));
	const codes = new Int32Array(labels.length);
	let missing = 0;
	for (let i = 0; i < labels.length; i++) {
		const l = labels[i];
		if (l === null) {
			codes[i] = -1;
			missing++;
			continue;
		}
		const code = index.get(l);
		if (code === undefined) throw new StatsError(`Column '${name}': value '${l}' is not one of the given levels.`, { column: name });
		codes[i] = code;
	}
	const kind = options.kind ?? (levels.length === 2 ? 'binary' : 'categorical');
	if (kind === 'binary' && levels.length !== 2)
		throw new StatsError(`Column '${name}' is declared binary but has ${levels.length} levels.`, { column: name });
	return { name, kind, codes, levels, missing };
}

/** Sort level labels: numerically when every label is a number, otherwise by code point. */
export function sortLevels(levels: string[]): string[] {
	const allNumeric = levels.every((l) => l.trim() !== '' && Number.isFinite(Number(l)));
	return allNumeric
		? levels.sort((a, b) => Number(a) - Number(b))
		: levels.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
}

export function columnLength(column: Column): number {
	return column.kind === 'continuous' ? column.values.length : column.codes.length;
}

export function isMissingAt(column: Column, row: number): boolean {
	return column.kind === 'continuous' ? Number.isNaN(column.values[row]) : column.codes[row] < 0;
}

/** True for the kinds analysed through levels (tables, strata, dummy coding). */
export function isDiscrete(column: Column): column is CodedColumn {
	return column.kind !== 'continuous';
}

/**
 * Numbers for a column: continuous values as they are, binary codes as 0/1, ordinal codes
 * as scores 0…L−1. An unordered categorical column with more than two levels has no
 * numeric meaning and is refused. Missing is NaN.
 */
export function numericValues(column: Column): Float64Array {
	if (column.kind === 'continuous') return column.values;
	if (column.kind === 'categorical' && column.levels.length > 2)
		throw new StatsError(`Column '${column.name}' is categorical with ${column.levels.length} levels and has no numeric scale.`, {
			column: column.name
		});
	const out = new Float64Array(column.codes.length);
	for (let i = 0; i < out.length; i++) out[i] = column.codes[i] < 0 ? NaN : column.codes[i];
	return out;
}

/** Row indices where none of the columns is missing (complete cases), O(n·k). */
export function completeRows(columns: readonly Column[]): Int32Array {
	if (columns.length === 0) return new Int32Array(0);
	const n = columnLength(columns[0]);
	for (const c of columns)
		if (columnLength(c) !== n) throw new StatsError(`Column '${c.name}' has ${columnLength(c)} rows; expected ${n}.`, { column: c.name });
	// One tight loop per column marking its missing rows, then one collecting the rest.
	const missing = new Uint8Array(n);
	for (const c of columns) {
		if (c.kind === 'continuous') {
			const v = c.values;
			for (let i = 0; i < n; i++) if (v[i] !== v[i]) missing[i] = 1;
		} else {
			const codes = c.codes;
			for (let i = 0; i < n; i++) if (codes[i] < 0) missing[i] = 1;
		}
	}
	const keep = new Int32Array(n);
	let count = 0;
	for (let i = 0; i < n; i++) if (missing[i] === 0) keep[count++] = i;
	return count === n ? keep : keep.slice(0, count);
}

/** Only the observed levels: codes re-numbered 0…L'−1 over the given rows, in level order. */
export function observedLevels(column: CodedColumn, rows: Int32Array): { codes: Int32Array; levels: string[] } {
	const seen = new Uint8Array(column.levels.length);
	for (let k = 0; k < rows.length; k++) seen[column.codes[rows[k]]] = 1;
	const remap = new Int32Array(column.levels.length).fill(-1);
	const levels: string[] = [];
	for (let l = 0; l < seen.length; l++)
		if (seen[l]) {
			remap[l] = levels.length;
			levels.push(column.levels[l]);
		}
	const codes = new Int32Array(rows.length);
	for (let k = 0; k < rows.length; k++) codes[k] = remap[column.codes[rows[k]]];
	return { codes, levels };
}
