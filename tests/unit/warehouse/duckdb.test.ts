/**
 * The summary SQL run on a real embedded engine (DuckDB, @duckdb/node-api): the demo study's
 * rows loaded into a table, the generated query run and its result written as CSV by DuckDB's
 * own COPY, read back — and every check and estimate equals the one from the rows, to 1e-9.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DuckDBInstance, type DuckDBConnection } from '@duckdb/node-api';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runDataChecks, runSummaryChecks } from '../../../src/lib/datacheck';
import { groupedCountsSql, momentsSql, readMoments, summaryPlan } from '../../../src/lib/datacheck/warehouse';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { expandGroupedTable } from '../../../src/lib/stats';
import { demoDir, readDiagram, readTable, tableOf } from '../datacheck/helpers';
import { expectSameNumbers } from './report-compare';

const DEMO_CSV = `${demoDir}cycling-hypertension.csv`;
const rows = readTable(DEMO_CSV);
const demo = readDiagram(`${demoDir}cycling-hypertension.causeway.json`);
const kinds = rows.columns.map((c) => ({ name: c.name, kind: c.kind }));

let dir: string;
let db: DuckDBConnection;

beforeAll(async () => {
	dir = mkdtempSync(join(tmpdir(), 'causeway-duckdb-'));
	db = await (await DuckDBInstance.create(':memory:')).connect();
	await db.run(`CREATE TABLE visits AS SELECT * FROM read_csv('${DEMO_CSV}', header = true)`);
});

afterAll(() => {
	db?.closeSync();
	rmSync(dir, { recursive: true, force: true });
});

/** Runs a generated query and returns its result as the CSV DuckDB writes. */
async function resultCsv(sql: string, file: string): Promise<string> {
	const path = join(dir, file);
	await db.run(`COPY (${sql.trim().replace(/;$/, '')}) TO '${path}' (HEADER, DELIMITER ',')`);
	return readFileSync(path, 'utf8');
}

describe('grouped counts from DuckDB', () => {
	it('the whole demo diagram: every check and estimate equals the rows', async () => {
		const plan = summaryPlan(demo, { table: kinds });
		expect(plan.columns.length).toBe(rows.columns.length);
		const csv = await resultCsv(groupedCountsSql(plan, 'duckdb', 'visits'), 'grouped.csv');
		const grouped = expandGroupedTable(tableOf(csv), plan.countName);
		expect(grouped.rowCount).toBe(5000);
		const options = { pictures: false };
		const { grouped: source, ...fromGroups } = runDataChecks(demo, grouped, options);
		expect(source?.countColumn).toBe('n');
		expectSameNumbers(fromGroups, runDataChecks(demo, rows, options));
	});

	it('discrete columns and whole-number age: a few hundred lines for 5,000 rows, same checks', async () => {
		const mapping = { income: null, diet: null, distance: null, bikeability: null, fitness: null, bmi: null };
		const plan = summaryPlan(demo, { table: kinds, mapping });
		expect(plan.columns.map((c) => c.name)).toEqual(['age', 'cycling', 'family_history', 'hypertension', 'app_panel', 'antihypertensive']);
		const csv = await resultCsv(groupedCountsSql(plan, 'duckdb', 'visits'), 'small.csv');
		const lines = csv.trim().split('\n').length - 1;
		expect(lines).toBeLessThan(1000);
		const grouped = expandGroupedTable(tableOf(csv), 'n');
		const options = { pictures: false, mapping };
		const { grouped: _source, ...a } = runDataChecks(demo, grouped, options);
		expect(a.estimates?.rows.some((r) => r.standardized !== null)).toBe(true);
		const b = runDataChecks(demo, rows, options);
		// The rows' file has the other columns too; the summary carries only the linked ones.
		expect(b.mapping.unusedColumns).toEqual(['income', 'diet', 'distance', 'bikeability', 'fitness', 'bmi']);
		expectSameNumbers({ ...a, mapping: { ...a.mapping, unusedColumns: [] } }, { ...b, mapping: { ...b.mapping, unusedColumns: [] } });
	});
});

describe('moments from DuckDB (continuous columns)', () => {
	// A diagram over the demo's continuous columns: age and income → diet → bmi, age → bmi.
	const diagram: Diagram = {
		...demo,
		variables: ['age', 'income', 'diet', 'bmi'].map((id, i) => ({ id, label: id, measured: true, x: i * 100, y: 0, note: '' })),
		arrows: [
			{ from: 'age', to: 'diet' },
			{ from: 'income', to: 'diet' },
			{ from: 'diet', to: 'bmi' },
			{ from: 'age', to: 'bmi' }
		],
		exposures: ['diet'],
		outcomes: ['bmi'],
		adjusted: ['age', 'income']
	};

	it('Pearson arrow checks, partial-correlation claims and linear estimates equal the rows', async () => {
		const plan = summaryPlan(diagram, { table: kinds });
		const sql = momentsSql(plan, 'duckdb', 'visits');
		expect(sql).not.toBeNull();
		const summary = readMoments(await resultCsv(sql!, 'moments.csv'));
		expect(summary.n).toBe(5000);
		const fromSummary = runSummaryChecks(diagram, summary);
		const fromRows = runDataChecks(diagram, rows, { pictures: false });
		// r itself; its test differs by design: the summary path uses Fisher's z, the rows the t test.
		const arrows = (r: typeof fromRows) => r.arrows.checks.map((c) => [c.from, c.to, c.measure?.value, c.main?.n]);
		expectSameNumbers(arrows(fromSummary), arrows(fromRows));
		const claims = (r: typeof fromRows) => r.claims.checks.map((c) => [c.a, c.b, c.given, c.p, c.pHolm, c.pBH, c.status]);
		expect(fromRows.claims.checks.length).toBeGreaterThan(0);
		expectSameNumbers(claims(fromSummary), claims(fromRows));
		const estimates = (r: typeof fromRows) => r.estimates!.rows.map((e) => [e.adjustedFor, e.n, e.estimate, e.ci, e.pValue]);
		expectSameNumbers(estimates(fromSummary), estimates(fromRows));
	});

	it('no moments query when a column is discrete', () => {
		expect(momentsSql(summaryPlan(demo, { table: kinds }), 'duckdb', 'visits')).toBeNull();
	});
});
