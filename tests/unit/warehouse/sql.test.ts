/**
 * The summary SQL's text in each dialect: identifier quoting (ANSI "…" for DuckDB and
 * PostgreSQL, `…` for Spark SQL, the quote character doubled inside), the double type of the
 * casts, PostgreSQL's 63-byte identifier limit, table names with schemas, and the plan
 * (which columns, which kinds, the count column's name). DuckDB's text is also run, in
 * duckdb.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { groupedCountsSql, momentsSql, parseSqlTarget, quoteIdentifier, quoteTable, readMoments, summaryPlan, isMomentsText } from '../../../src/lib/datacheck/warehouse';
import type { Diagram } from '../../../src/lib/graph/diagram';

const variable = (id: string, data?: Diagram['variables'][number]['data'], measured = true) => ({ id, label: id, measured, x: 0, y: 0, note: '', ...(data ? { data } : {}) });
const diagram: Diagram = {
	title: 't',
	variables: [variable('age', { kind: 'continuous' }), variable('smoker', { column: 'Smoker "now"' }), variable('trait', undefined, false), variable('bp', { column: 'sys bp', kind: 'continuous' })],
	arrows: [],
	exposures: ['smoker'],
	outcomes: ['bp'],
	adjusted: []
};

describe('identifiers and tables', () => {
	it('quotes by dialect, doubling the quote character', () => {
		expect(quoteIdentifier('duckdb', 'Smoker "now"')).toBe('"Smoker ""now"""');
		expect(quoteIdentifier('postgres', 'select')).toBe('"select"');
		expect(quoteIdentifier('spark', 'a`b c')).toBe('`a``b c`');
	});

	it('quotes each part of a dotted table name, keeps a name the user quoted', () => {
		expect(quoteTable('postgres', 'clinic.visits')).toBe('"clinic"."visits"');
		expect(quoteTable('spark', 'cat.db.visits')).toBe('`cat`.`db`.`visits`');
		expect(quoteTable('duckdb', '"My Schema".visits')).toBe('"My Schema".visits');
	});

	it('refuses a PostgreSQL name longer than 63 bytes, naming it', () => {
		const long = 'x'.repeat(64);
		expect(() => quoteIdentifier('postgres', long)).toThrow(/PostgreSQL cuts names past 63 bytes: "x{64}"/);
		expect(quoteIdentifier('duckdb', long)).toBe(`"${long}"`);
	});

	it('reads DIALECT[:TABLE]', () => {
		expect(parseSqlTarget('duckdb')).toEqual({ dialect: 'duckdb', table: 'data' });
		expect(parseSqlTarget('PostgreSQL:clinic.visits')).toEqual({ dialect: 'postgres', table: 'clinic.visits' });
		expect(() => parseSqlTarget('oracle:t')).toThrow('Unknown SQL dialect "oracle": use duckdb, postgres or spark (as DIALECT or DIALECT:TABLE)');
		expect(() => parseSqlTarget('spark:')).toThrow(/name the table after the colon/);
	});
});

describe('the plan', () => {
	it('takes the linked columns of measured variables, kinds from the settings; unknown kinds are grouped', () => {
		expect(summaryPlan(diagram)).toEqual({
			columns: [
				{ name: 'age', continuous: true },
				{ name: 'Smoker "now"', continuous: false },
				{ name: 'sys bp', continuous: true }
			],
			countName: 'n'
		});
	});

	it('follows the overrides and a table; a column named n moves the count to n_rows', () => {
		const plan = summaryPlan(diagram, { mapping: { age: 'n', smoker: null } });
		expect(plan.columns.map((c) => c.name)).toEqual(['n', 'sys bp']);
		expect(plan.countName).toBe('n_rows');
		const withTable = summaryPlan(diagram, { table: [{ name: 'age', kind: 'binary' }, { name: 'sys bp', kind: 'continuous' }, { name: 'Smoker "now"', kind: 'binary' }] });
		expect(withTable.columns).toEqual([
			{ name: 'age', continuous: true }, // the diagram's setting over the detected kind, as the checks do
			{ name: 'Smoker "now"', continuous: false },
			{ name: 'sys bp', continuous: true }
		]);
	});
});

describe('grouped counts', () => {
	const plan = summaryPlan(diagram);
	it('DuckDB / PostgreSQL: ANSI quotes', () => {
		const sql = groupedCountsSql(plan, 'postgres', 'clinic.visits');
		expect(sql).toContain('SELECT\n  "age",\n  "Smoker ""now""",\n  "sys bp",\n  COUNT(*) AS "n"\nFROM "clinic"."visits"\nGROUP BY 1, 2, 3\nORDER BY 1, 2, 3;');
		expect(sql).toMatch(/^-- Causeway: grouped counts for the data checks \(PostgreSQL\)\./);
		expect(groupedCountsSql(plan, 'duckdb', 'clinic.visits').split('\n').slice(1)).toEqual(sql.split('\n').slice(1));
	});
	it('Spark SQL: backquotes', () => {
		expect(groupedCountsSql(plan, 'spark', 'visits')).toContain('SELECT\n  `age`,\n  `Smoker "now"`,\n  `sys bp`,\n  COUNT(*) AS `n`\nFROM `visits`');
	});
});

describe('moments', () => {
	const plan = summaryPlan(diagram, { mapping: { smoker: null } });
	it('casts to DOUBLE (DuckDB, Spark SQL) or DOUBLE PRECISION (PostgreSQL) before multiplying', () => {
		const pg = momentsSql(plan, 'postgres', 'v')!;
		expect(pg).toContain('SUM(CAST("age" AS DOUBLE PRECISION) * CAST("sys bp" AS DOUBLE PRECISION)) AS "sum(age*sys bp)"');
		expect(pg).toContain('WHERE "age" IS NOT NULL\n  AND "sys bp" IS NOT NULL;');
		const spark = momentsSql(plan, 'spark', 'v')!;
		expect(spark).toContain('SUM(CAST(`age` AS DOUBLE)) AS `sum(age)`');
		expect(spark).toContain('COUNT(*) AS `n`');
	});
	it('none when a column is discrete', () => {
		expect(momentsSql(summaryPlan(diagram), 'duckdb', 'v')).toBeNull();
	});
	it('reads back covariances as R cov() gives them (hand-computed: x = 1,2,3; y = 2,4,7)', () => {
		const text = 'n,sum(x),sum(y),sum(x*x),sum(x*y),sum(y*y)\n3,6,13,14,31,69\n';
		expect(isMomentsText(text)).toBe(true);
		const s = readMoments(text);
		expect(s.names).toEqual(['x', 'y']);
		expect(s.means).toEqual([2, 13 / 3]);
		// cov(x, y) = (31 − 6·13/3)/2 = 2.5; var(y) = (69 − 169/3)/2 = 6.333…
		expect(s.matrix[0][1]).toBeCloseTo(2.5, 12);
		expect(s.matrix[1][1]).toBeCloseTo(19 / 3, 12);
	});
	it('refuses a bad moments file naming the cell', () => {
		expect(() => readMoments('n,sum(x),sum(y),sum(x*x),sum(x*y),sum(y*y)\n3,6,13,14,abc,69\n')).toThrow("Row 2, column 'sum(x*y)': 'abc' is not a number.");
		expect(() => readMoments('n,sum(x),sum(y),sum(x*x),sum(y*x),sum(y*y)\n3,6,13,14,31,69\n')).toThrow("Row 1, column 5: expected 'sum(x*y)', found 'sum(y*x)'.");
		expect(() => readMoments('n,sum(x),sum(y)\n3,6,13\n')).toThrow(/expected the header n, sum\(a\)/);
	});
});
