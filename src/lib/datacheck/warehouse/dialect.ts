/**
 * What differs between the SQL dialects Causeway writes for (checked by
 * tests/unit/warehouse/sql.test.ts; DuckDB's is also run there on an embedded engine):
 * - quoted identifiers: "name" in DuckDB and PostgreSQL (ANSI; a " inside doubled),
 *   `name` in Spark SQL (a ` inside doubled) — quoting keeps case, spaces and keywords;
 * - the floating-point type for sums and cross-products: DOUBLE (DuckDB, Spark SQL),
 *   DOUBLE PRECISION (PostgreSQL) — cast before multiplying, so integer columns neither
 *   overflow nor round (PostgreSQL's SUM of an integer product would be exact but NUMERIC);
 * - PostgreSQL truncates identifiers, aliases included, past 63 bytes (NAMEDATALEN − 1):
 *   a long alias would come back cut, so it is refused here with the column named.
 * COUNT(*), GROUP BY, ORDER BY by position and a WHERE of IS NOT NULL are the same in all three.
 */
import { InputError } from '../../graph/errors';

export type Dialect = 'duckdb' | 'postgres' | 'spark';

export const DIALECTS: readonly Dialect[] = ['duckdb', 'postgres', 'spark'];

const POSTGRES_MAX_IDENTIFIER_BYTES = 63;

/** A name as a quoted identifier of the dialect. O(length). */
export function quoteIdentifier(dialect: Dialect, name: string): string {
	if (dialect === 'postgres' && new TextEncoder().encode(name).length > POSTGRES_MAX_IDENTIFIER_BYTES)
		throw new InputError(`PostgreSQL cuts names past ${POSTGRES_MAX_IDENTIFIER_BYTES} bytes: "${name}" is too long to read back; rename the column or alias it in a view`);
	return dialect === 'spark' ? `\`${name.replaceAll('`', '``')}\`` : `"${name.replaceAll('"', '""')}"`;
}

/**
 * A table name as written by the user: parts split at dots (schema.table, catalog.db.table)
 * and each quoted, unless the user quoted it already (then it is used as written).
 */
export function quoteTable(dialect: Dialect, table: string): string {
	const t = table.trim();
	if (t === '') throw new InputError('The table name is empty');
	if (/["`]/.test(t)) return t;
	return t
		.split('.')
		.map((part) => quoteIdentifier(dialect, part))
		.join('.');
}

/** A column as a double-precision number. */
export function asDouble(dialect: Dialect, quoted: string): string {
	return `CAST(${quoted} AS ${dialect === 'postgres' ? 'DOUBLE PRECISION' : 'DOUBLE'})`;
}

/** `duckdb`, `postgres:visits`, `spark:db.visits` → the dialect and table ("data" when none is given). */
export function parseSqlTarget(text: string): { dialect: Dialect; table: string } {
	const colon = text.indexOf(':');
	const name = (colon < 0 ? text : text.slice(0, colon)).trim().toLowerCase();
	const aliases: Record<string, Dialect> = { duckdb: 'duckdb', postgres: 'postgres', postgresql: 'postgres', spark: 'spark', sparksql: 'spark' };
	const dialect = aliases[name];
	if (!dialect) throw new InputError(`Unknown SQL dialect "${name}": use duckdb, postgres or spark (as DIALECT or DIALECT:TABLE)`);
	const table = colon < 0 ? 'data' : text.slice(colon + 1).trim();
	if (table === '') throw new InputError(`"${text}": name the table after the colon, e.g. ${name}:visits`);
	return { dialect, table };
}
