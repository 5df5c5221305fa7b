/**
 * Words about data kept where they live: grouped tables (one line per combination of values,
 * with its count of rows), the summary SQL Causeway writes for a database, and the summaries
 * read back. Imported directly (not through the wording index, which other parts own).
 */
import { groupThousands } from './numbers';

/** A column that looks like counts of rows, offered and never applied unasked. */
export function countColumnHint(column: string, surface: 'cli' | 'app'): string {
	const how = surface === 'cli' ? `add --count ${column}` : `load it under "Summary from a database" with the count column '${column}'`;
	return `Column '${column}' looks like counts of rows (a grouped table); it is read as an ordinary column. To read each line as that many rows, ${how}.`;
}

/** Said wherever a summary replaces the rows. */
export const SUMMARY_NOT_ROWS =
	'A summary holds counts per combination of values (or sums and cross-products), never one row per person: the rows stay in the database.';

/** What the report says the data were, when they were not rows: grouped counts, or a summary. */
export function dataSourceText(source: { grouped: { lines: number; countColumn: string } } | 'summary'): string {
	if (source === 'summary') return 'Source: a summary (a correlation or covariance matrix, or sums and cross-products); no row-level data were read.';
	const { lines, countColumn } = source.grouped;
	return `Source: grouped counts, ${groupThousands(lines)} lines each read as as many rows as its count (column '${countColumn}'); no row-level data were read.`;
}

export const DIALECT_NAMES = { duckdb: 'DuckDB', postgres: 'PostgreSQL', spark: 'Spark SQL' } as const;
