/**
 * What the app's column-mapping table shows about a parsed table: per column its kind,
 * missing count, levels or range, and whether it is constant (no test can use it). O(rows ×
 * columns), computed where the table lives (the data worker) so only this summary crosses
 * to the page.
 */
import { DEFAULT_LEVEL_CAP, type Column, type ColumnKind, type Table, type TableFormat } from '../stats';

export interface ColumnInfo {
	name: string;
	/** 1-based position in the file. */
	position: number;
	kind: ColumnKind;
	missing: number;
	/** Level labels of a coded column (first = reference); empty for numbers. */
	levels: string[];
	/** Smallest and largest value of a numeric column (null when all missing). */
	range: [number, number] | null;
	/** A single value among the non-missing cells: no test can use it. */
	constant: boolean;
	/**
	 * The distinct values as written (levels of a coded column; numbers of a numeric one, in
	 * ascending order) when there are at most DEFAULT_LEVEL_CAP, else null: what the app offers
	 * as reference levels and value labels, and checks a chosen kind against.
	 */
	values: string[] | null;
}

export interface TableInfo {
	name: string;
	rowCount: number;
	columns: ColumnInfo[];
	/** Columns read but left out (too many levels, all missing), with why. */
	skipped: { name: string; position: number; message: string }[];
	format: TableFormat;
	notes: string[];
}

export function columnInfo(c: Column, position: number): ColumnInfo {
	if (c.kind === 'continuous') {
		let lo = Infinity;
		let hi = -Infinity;
		for (const v of c.values) {
			if (v < lo) lo = v;
			if (v > hi) hi = v;
		}
		const range: [number, number] | null = lo <= hi ? [lo, hi] : null;
		return { name: c.name, position, kind: c.kind, missing: c.missing, levels: [], range, constant: range !== null && lo === hi, values: distinctNumbers(c.values) };
	}
	const seen = new Set<number>();
	for (const code of c.codes) if (code >= 0) seen.add(code);
	return { name: c.name, position, kind: c.kind, missing: c.missing, levels: [...c.levels], range: null, constant: seen.size < 2, values: c.levels.length <= DEFAULT_LEVEL_CAP ? [...c.levels] : null };
}

/** Distinct numbers as text (ascending), or null past the level cap. O(rows), stops early. */
function distinctNumbers(values: Float64Array): string[] | null {
	const seen = new Set<number>();
	for (const v of values) {
		if (Number.isNaN(v)) continue;
		seen.add(v);
		if (seen.size > DEFAULT_LEVEL_CAP) return null;
	}
	return [...seen].sort((a, b) => a - b).map(String);
}

export function describeTable(t: Table, name: string): TableInfo {
	// Analysed columns keep file order; skipped ones hold their own positions.
	const skippedAt = new Set(t.skipped.map((s) => s.position));
	let position = 0;
	const columns = t.columns.map((c) => {
		position++;
		while (skippedAt.has(position)) position++;
		return columnInfo(c, position);
	});
	return { name, rowCount: t.rowCount, columns, skipped: t.skipped.map((s) => ({ ...s })), format: { ...t.format }, notes: [...t.notes] };
}
