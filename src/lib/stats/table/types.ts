/**
 * In-memory form of a data table: one typed array per column, no per-row objects, so a
 * million rows by a dozen columns takes about 100 MB at most (8 bytes a number, 4 bytes a
 * category code).
 */

/**
 * How a column is analysed.
 * - binary: exactly two distinct values (codes 0 and 1; level 0 is the reference).
 * - categorical: unordered levels (codes 0…L−1; level 0 is the reference).
 * - ordinal: ordered levels, declared by the user (codes follow the order).
 * - continuous: numbers.
 */
export type ColumnKind = 'binary' | 'categorical' | 'ordinal' | 'continuous';

/** A numeric column; missing values are NaN. */
export interface ContinuousColumn {
	readonly name: string;
	readonly kind: 'continuous';
	readonly values: Float64Array;
	/** Number of missing values. */
	readonly missing: number;
}

/** A coded column; missing values have code −1. */
export interface CodedColumn {
	readonly name: string;
	readonly kind: 'binary' | 'categorical' | 'ordinal';
	readonly codes: Int32Array;
	/** Level labels, indexed by code. The first level is the reference. */
	readonly levels: readonly string[];
	readonly missing: number;
}

export type Column = ContinuousColumn | CodedColumn;

/** A column that was read but cannot be analysed, and why (one line). */
export interface SkippedColumn {
	readonly name: string;
	/** 1-based position in the file. */
	readonly position: number;
	readonly message: string;
}

export interface TableFormat {
	delimiter: ',' | ';' | '\t';
	decimalComma: boolean;
	header: boolean;
}

export interface Table {
	readonly columns: readonly Column[];
	readonly rowCount: number;
	readonly skipped: readonly SkippedColumn[];
	readonly format: TableFormat;
	/** Plain-language notes on what was detected or assumed (delimiter, header, typing). */
	readonly notes: readonly string[];
	/** Set when the table was read from a grouped one (stats/table/grouped.ts): its lines and count column. */
	readonly grouped?: { readonly lines: number; readonly countColumn: string };
}

/** One-line description of a bad input, with where it is. */
export interface TableError {
	readonly message: string;
	/** 1-based row of the file; the header, when present, is row 1. */
	readonly row?: number;
	readonly column?: string;
}

export type ParseResult = { ok: true; table: Table } | { ok: false; error: TableError };
