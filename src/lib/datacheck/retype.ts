/**
 * A user's column kind over the detected one, applied to the table in memory (no second
 * read of the file): numbers ↔ levels, binary / categorical / ordinal. Each change is
 * checked and refused with a one-line message naming the column. O(rows) per column.
 */
import { own, codedColumn, DEFAULT_LEVEL_CAP, StatsError, type Column, type ColumnKind, type Table } from '../stats';
import type { TypeOverrides } from './types';

export function retypeColumn(column: Column, kind: ColumnKind, levelCap = DEFAULT_LEVEL_CAP): Column {
	if (column.kind === kind) return column;
	const name = column.name;
	if (kind === 'continuous') {
		if (column.kind === 'continuous') return column;
		const numbers = column.levels.map(Number);
		const bad = column.levels.find((l, i) => l.trim() === '' || !Number.isFinite(numbers[i]));
		if (bad !== undefined) throw new StatsError(`Column '${name}' cannot be numeric: its value '${bad}' is not a number.`, { column: name });
		const values = new Float64Array(column.codes.length);
		for (let i = 0; i < values.length; i++) values[i] = column.codes[i] < 0 ? NaN : numbers[column.codes[i]];
		return { name, kind: 'continuous', values, missing: column.missing };
	}
	if (column.kind !== 'continuous') {
		if (kind === 'binary' && column.levels.length !== 2)
			throw new StatsError(`Column '${name}' cannot be binary: it has ${column.levels.length} distinct values.`, { column: name });
		return { ...column, kind };
	}
	const distinct = new Set<number>();
	for (const v of column.values) {
		if (Number.isNaN(v)) continue;
		distinct.add(v);
		if (distinct.size > Math.max(levelCap, 2))
			throw new StatsError(`Column '${name}' has more than ${Math.max(levelCap, 2)} distinct values, too many to use as ${kind} levels.`, { column: name });
	}
	if (kind === 'binary' && distinct.size !== 2)
		throw new StatsError(`Column '${name}' cannot be binary: it has ${distinct.size} distinct value${distinct.size === 1 ? '' : 's'}.`, { column: name });
	const labels = Array.from(column.values, (v) => (Number.isNaN(v) ? null : String(v)));
	return codedColumn(name, labels, { kind });
}

/** The table with the given column kinds. Unknown column names are refused. O(rows × changed columns). */
export function retypeTable(table: Table, overrides: TypeOverrides, levelCap = DEFAULT_LEVEL_CAP): Table {
	const names = new Set(table.columns.map((c) => c.name));
	for (const name of Object.keys(overrides))
		if (!names.has(name)) throw new StatsError(`A type is given for column '${name}', which is not in the data.`, { column: name });
	if (Object.keys(overrides).length === 0) return table;
	return { ...table, columns: table.columns.map((c) => {
		const kind = own(overrides, c.name);
		return kind ? retypeColumn(c, kind, levelCap) : c;
	}) };
}

/** A variable's level settings, applied to its column: reference level first, values named. */
export interface LevelSettings {
	/** The reference value as written in the data. */
	reference?: string;
	labels?: readonly { value: string; label: string }[];
}

/**
 * The column with `reference` as its first level (codes renumbered; binary and categorical
 * columns only — an ordinal column keeps its order) and its levels renamed by `labels`
 * (values without a label keep their text). Refused with a StatsError naming the column when
 * the reference is not one of its values or two levels would end up with one name. O(rows).
 */
export function applyLevels(column: Column, settings: LevelSettings): Column {
	if (column.kind === 'continuous') return column;
	const name = column.name;
	let levels = [...column.levels];
	let codes = column.codes;
	if (settings.reference !== undefined && column.kind !== 'ordinal') {
		const at = levels.indexOf(settings.reference);
		if (at < 0)
			throw new StatsError(`The reference level '${settings.reference}' is not a value of column '${name}' (its values: ${levels.slice(0, 12).map((l) => `'${l}'`).join(', ')}${levels.length > 12 ? ', …' : ''}).`, { column: name });
		if (at > 0) {
			// New code of old level k: the reference becomes 0, the levels before it move up one.
			const remap = levels.map((_, k) => (k === at ? 0 : k < at ? k + 1 : k));
			codes = Int32Array.from(column.codes, (c) => (c < 0 ? c : remap[c]));
			levels = [levels[at], ...levels.slice(0, at), ...levels.slice(at + 1)];
		}
	}
	if (settings.labels && settings.labels.length > 0) {
		const named = new Map(settings.labels.map((l) => [l.value, l.label]));
		levels = levels.map((l) => named.get(l) ?? l);
		const seen = new Set<string>();
		for (const l of levels) {
			if (seen.has(l)) throw new StatsError(`Column '${name}': two of its levels would both be named '${l}' by the value labels.`, { column: name });
			seen.add(l);
		}
	}
	return levels === column.levels && codes === column.codes ? column : { ...column, levels, codes };
}

/** What the app knows of a column before choosing a kind (a ColumnInfo's fields). */
export interface ColumnShape {
	name: string;
	kind: ColumnKind;
	/** Distinct values when at most the level cap, else null. */
	values: readonly string[] | null;
}

/**
 * Why a column cannot be given `kind`, with the same rules and words as retypeColumn, or null
 * when it can: the app asks this before storing a choice, so a refused kind never reaches the
 * diagram. O(levels).
 */
export function kindProblem(column: ColumnShape, kind: ColumnKind): string | null {
	if (column.kind === kind) return null;
	const name = column.name;
	if (kind === 'continuous') {
		if (column.kind === 'continuous') return null;
		const bad = (column.values ?? []).find((l) => l.trim() === '' || !Number.isFinite(Number(l)));
		return bad === undefined ? null : `Column '${name}' cannot be numeric: its value '${bad}' is not a number.`;
	}
	if (column.values === null) return `Column '${name}' has more than ${DEFAULT_LEVEL_CAP} distinct values, too many to use as ${kind} levels.`;
	if (kind === 'binary' && column.values.length !== 2)
		return `Column '${name}' cannot be binary: it has ${column.values.length} distinct value${column.values.length === 1 ? '' : 's'}.`;
	return null;
}
