/**
 * The SQL that summarizes a table where it lives, for the checks of the current diagram:
 *
 * - groupedCountsSql: `SELECT cols, COUNT(*) AS n FROM t GROUP BY cols` — one line per
 *   combination of values with its number of rows. Read back as a grouped table
 *   (stats/table/grouped.ts) it *is* the rows, so every check and estimate equals the
 *   row-level one (missing values form their own groups and stay missing). Its size is the
 *   number of distinct combinations: small for discrete columns and whole-number ages,
 *   up to the rows for a continuous column with many distinct values.
 * - momentsSql (every column continuous): n, the sum of each column and of each product of
 *   two, over the rows complete in all of them — the second moments from which the summary
 *   path computes Pearson correlations, partial correlations and linear regressions
 *   (moments.ts reads them back). One line, whatever the rows.
 *
 * Both are standard SQL run unchanged by DuckDB, PostgreSQL and Spark SQL apart from the
 * differences in dialect.ts. O(columns²) text.
 */
import type { Dialect } from './dialect';
import { asDouble, quoteIdentifier, quoteTable } from './dialect';
import type { SummaryPlan } from './plan';

/** Alias of a column's sum and of a product's sum in the moments query (read back by moments.ts). */
export const sumAlias = (a: string) => `sum(${a})`;
export const productAlias = (a: string, b: string) => `sum(${a}*${b})`;

function header(dialect: Dialect, what: string, readBack: string): string {
	const names = { duckdb: 'DuckDB', postgres: 'PostgreSQL', spark: 'Spark SQL' } as const;
	return [`-- Causeway: ${what} (${names[dialect]}).`, '-- Only counts and sums leave the database, never a row.', `-- Save the result as CSV with a header row, then ${readBack}.`].join('\n');
}

export function groupedCountsSql(plan: SummaryPlan, dialect: Dialect, table: string): string {
	const cols = plan.columns.map((c) => quoteIdentifier(dialect, c.name));
	const from = quoteTable(dialect, table);
	const count = quoteIdentifier(dialect, plan.countName);
	const readBack = `read it as a grouped table (count column ${plan.countName})`;
	if (cols.length === 0) return `${header(dialect, 'number of rows', readBack)}\nSELECT COUNT(*) AS ${count}\nFROM ${from};\n`;
	const positions = cols.map((_, i) => i + 1).join(', ');
	return `${header(dialect, 'grouped counts for the data checks', readBack)}
SELECT
  ${cols.join(',\n  ')},
  COUNT(*) AS ${count}
FROM ${from}
GROUP BY ${positions}
ORDER BY ${positions};
`;
}

/** Null when some column is not continuous (then only the grouped counts carry every check). */
export function momentsSql(plan: SummaryPlan, dialect: Dialect, table: string): string | null {
	const cols = plan.columns;
	if (cols.length < 2 || cols.some((c) => !c.continuous)) return null;
	const q = (name: string) => quoteIdentifier(dialect, name);
	const x = (name: string) => asDouble(dialect, q(name));
	const select = [`COUNT(*) AS ${q('n')}`];
	for (const c of cols) select.push(`SUM(${x(c.name)}) AS ${q(sumAlias(c.name))}`);
	cols.forEach((a, i) => {
		for (const b of cols.slice(i)) select.push(`SUM(${x(a.name)} * ${x(b.name)}) AS ${q(productAlias(a.name, b.name))}`);
	});
	return `${header(dialect, 'sums and cross-products of continuous columns', 'read it as a summary')}
SELECT
  ${select.join(',\n  ')}
FROM ${quoteTable(dialect, table)}
WHERE ${cols.map((c) => `${q(c.name)} IS NOT NULL`).join('\n  AND ')};
`;
}
