/**
 * Grouped (frequency-weighted) tables: each line stands for as many rows as its count column
 * says — what `GROUP BY … COUNT(*)` in a database, R's `as.data.frame(table(…))` or a
 * published contingency table give. The table is expanded into the typed columns the reader
 * makes for rows, so every check (two-way tables, exact tests, rank tests, stratified tests,
 * regressions, g-computation) is the row-level one by construction; the logistic fits then
 * group the rows back into covariate patterns with their counts (sufficient/patterns.ts), so
 * a fit costs O(patterns·p²) per iteration, not O(rows·p²).
 *
 * Why expand rather than carry a weight per line through every statistic: a weighted variant
 * of each of the twenty-odd tests (Fisher's exact, Kruskal–Wallis and Spearman ranks,
 * Breslow–Day, …) would be new code to get right for each, while the expansion is exact for
 * all of them at O(represented rows × columns) time and memory — the same as reading the rows
 * (bench/warehouse.ts measures both). The represented rows are capped at MAX_GROUPED_ROWS,
 * the size the row reader's own limit allows (src/lib/limits.ts: about ten million rows of a
 * dozen columns).
 */
import { StatsError } from '../errors';
import type { CodedColumn, Column, Table } from './types';
import { describeCount } from '../../limits';

/** Most rows a grouped table may stand for (the sum of its counts). */
export const MAX_GROUPED_ROWS = 10_000_000;

/** Column names read as a hint that a column counts rows (compared without case). Never applied unasked. */
export const COUNT_COLUMN_NAMES: readonly string[] = ['n', 'count', 'freq'];

/** The 1-based file row of data line `i` (the header is row 1), as the reader numbers rows. */
function fileRow(table: Table, i: number): number {
	return i + (table.format.header ? 2 : 1);
}

/** The count on each line as numbers (NaN: empty), from the column however it was typed. */
function countValues(column: Column): Float64Array {
	if (column.kind === 'continuous') return column.values;
	const numbers = column.levels.map(Number);
	const text = column.levels.find((l, i) => !Number.isFinite(numbers[i]));
	if (text !== undefined) throw new StatsError(`Column '${column.name}' holds text ('${text}'), not counts of rows.`, { column: column.name });
	return Float64Array.from(column.codes, (c) => (c < 0 ? NaN : numbers[c]));
}

/**
 * The count on each line, checked: a whole number ≥ 0 on every line, in all at most
 * MAX_GROUPED_ROWS. Throws a StatsError naming the row and column of the first bad count.
 * O(lines).
 */
export function readCounts(table: Table, countColumn: string): { counts: Float64Array; total: number } {
	const column = table.columns.find((c) => c.name === countColumn);
	if (!column) {
		const skipped = table.skipped.find((s) => s.name === countColumn);
		if (skipped) throw new StatsError(`The count column '${countColumn}' could not be read: ${skipped.message}`, { column: countColumn });
		throw new StatsError(`There is no column '${countColumn}' to read counts of rows from.`, { column: countColumn });
	}
	const counts = countValues(column);
	let total = 0;
	for (let i = 0; i < counts.length; i++) {
		const c = counts[i];
		const where = { row: fileRow(table, i), column: countColumn };
		const at = `Row ${where.row}, column '${countColumn}'`;
		if (Number.isNaN(c)) throw new StatsError(`${at}: the count is empty; every line of a grouped table needs its number of rows.`, where);
		if (c < 0) throw new StatsError(`${at}: the count ${c} is negative; a count of rows is a whole number, 0 or more.`, where);
		if (!Number.isInteger(c)) throw new StatsError(`${at}: the count ${c} is not a whole number; a count of rows is a whole number, 0 or more.`, where);
		total += c;
		if (total > MAX_GROUPED_ROWS)
			throw new StatsError(`The counts in column '${countColumn}' add up to more than ${describeCount(MAX_GROUPED_ROWS)} rows (reached at row ${where.row}), the most Causeway reads.`, where);
	}
	return { counts, total };
}

/** A coded column's levels that some represented row has, codes renumbered in the same order. */
function dropEmptyLevels(column: CodedColumn, used: Uint8Array): CodedColumn {
	if (used.every((u) => u === 1)) return column;
	const remap = new Int32Array(used.length).fill(-1);
	const levels: string[] = [];
	column.levels.forEach((level, code) => {
		if (used[code]) {
			remap[code] = levels.length;
			levels.push(level);
		}
	});
	const codes = column.codes.map((c) => (c < 0 ? c : remap[c]));
	return { ...column, codes, levels };
}

/** Each line's value written `counts[line]` times into `out`, in line order. O(total). */
function repeatLines<T extends Float64Array | Int32Array>(values: T, counts: Float64Array, out: T): T {
	let at = 0;
	for (let i = 0; i < counts.length; i++) {
		const c = counts[i];
		if (c === 0) continue;
		out.fill(values[i], at, at + c);
		at += c;
	}
	return out;
}

/** One column repeated line by line as the counts say; missing values counted per line. O(total). */
function expandColumn(column: Column, counts: Float64Array, total: number): Column {
	let missing = 0;
	if (column.kind === 'continuous') {
		column.values.forEach((v, i) => {
			if (v !== v) missing += counts[i];
		});
		return { ...column, values: repeatLines(column.values, counts, new Float64Array(total)), missing };
	}
	const used = new Uint8Array(column.levels.length);
	column.codes.forEach((code, i) => {
		if (counts[i] === 0) return;
		if (code < 0) missing += counts[i];
		else used[code] = 1;
	});
	return dropEmptyLevels({ ...column, codes: repeatLines(column.codes, counts, new Int32Array(total)), missing }, used);
}

/**
 * The rows a grouped table stands for: each line repeated `countColumn` times (lines with
 * count 0 dropped, with any level only they had), the count column removed. Column kinds
 * are those read from the grouped lines, which have the same distinct values as the rows
 * unless a value occurs only on lines with count 0. The last note says how many lines stood
 * for how many rows. O(represented rows × columns).
 */
export function expandGroupedTable(table: Table, countColumn: string): Table {
	const { counts, total } = readCounts(table, countColumn);
	const columns = table.columns.filter((c) => c.name !== countColumn).map((c) => expandColumn(c, counts, total));
	const note = `Grouped table: ${describeCount(table.rowCount)} lines stand for ${describeCount(total)} rows (counts in column '${countColumn}').`;
	return { ...table, columns, rowCount: total, notes: [...table.notes.filter((n) => !n.startsWith(`'${countColumn}':`)), note], grouped: { lines: table.rowCount, countColumn } };
}

/**
 * A column that may count rows, to suggest (never to apply): one named n, count or freq
 * (any case) whose values are all whole numbers ≥ 1 — a column of row counts named so, and
 * not, say, a 0/1 indicator or a measurement. Null when there is none or more than one. O(lines).
 */
export function suggestCountColumn(table: Table): string | null {
	const named = table.columns.filter((c) => COUNT_COLUMN_NAMES.includes(c.name.trim().toLowerCase()));
	if (named.length !== 1) return null;
	const column = named[0];
	try {
		const counts = countValues(column);
		if (counts.length === 0) return null;
		for (const c of counts) if (!(Number.isInteger(c) && c >= 1)) return null;
	} catch {
		return null;
	}
	return column.name;
}
