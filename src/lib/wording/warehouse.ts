/**
 * Words about data kept where they live: grouped tables (one line per combination of values,
 * with its count of rows), the summary SQL Causeway writes for a database, and the summaries
 * read back. Imported directly (not through the wording index, which other parts own).
 */

/** A column that looks like counts of rows, offered and never applied unasked. */
export function countColumnHint(column: string, surface: 'cli' | 'app'): string {
	const how = surface === 'cli' ? `add --count ${column}` : `load it under "Summary from a database" with the count column '${column}'`;
	return `Column '${column}' looks like counts of rows (a grouped table); it is read as an ordinary column. To read each line as that many rows, ${how}.`;
}

/** Said wherever a summary replaces the rows. */
export const SUMMARY_NOT_ROWS =
	'A summary holds counts per combination of values (or sums and cross-products), never one row per person: the rows stay in the database.';

/** The data source as the report names it. */
export function dataSourceText(kind: 'rows' | 'grouped' | 'moments', name: string): string {
	if (kind === 'grouped') return `${name}: grouped counts from a database (one line per combination of values, with its number of rows); no row-level data were read.`;
	if (kind === 'moments') return `${name}: sums and cross-products from a database; no row-level data were read.`;
	return `${name}: row-level data.`;
}

export const DIALECT_NAMES = { duckdb: 'DuckDB', postgres: 'PostgreSQL', spark: 'Spark SQL' } as const;
