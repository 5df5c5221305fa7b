/**
 * A user's column kind over the detected one, applied to the table in memory (no second
 * read of the file): numbers ↔ levels, binary / categorical / ordinal. Each change is
 * checked and refused with a one-line message naming the column. O(rows) per column.
 */
import { codedColumn, DEFAULT_LEVEL_CAP, StatsError, type Column, type ColumnKind, type Table } from '../stats';
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
	return { ...table, columns: table.columns.map((c) => (overrides[c.name] ? retypeColumn(c, overrides[c.name], levelCap) : c)) };
}
