// `causeway data … --count n`: a grouped table read as its rows, bad counts as one line (exit 2);
// `--sql`: the summary SQL, run on DuckDB and read back by the command.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DuckDBInstance } from '@duckdb/node-api';
import { describe, expect, it } from 'vitest';
import { runCli as run } from '../cli/harness';
import { expectSameNumbers } from './report-compare';

const DEMO = 'static/demo/cycling-hypertension.causeway.json';
const DEMO_CSV = 'static/demo/cycling-hypertension.csv';

const UCB = 'tests/fixtures/grouped/ucb.causeway.json';
const UCB_CSV = 'tests/fixtures/grouped/ucb-grouped.csv';

describe('causeway data --count', () => {
	it('reads each line as n rows and says so', async () => {
		const r = await run(['data', 'estimates', UCB, UCB_CSV, '--count', 'n']);
		expect(r.code).toBe(0);
		expect(r.out).toMatch(/Data: tests\/fixtures\/grouped\/ucb-grouped\.csv, 4,526 rows/);
		expect(r.out).toMatch(/Grouped table: 24 lines stand for 4,526 rows \(counts in column 'n'\)\./);
	});

	it('without --count, hints at the column and reads it as a column', async () => {
		const r = await run(['data', 'tests', UCB, UCB_CSV]);
		expect(r.code).toBe(0);
		expect(r.out).toMatch(/24 rows/);
		expect(r.out).toMatch(/Column 'n' looks like counts of rows \(a grouped table\); it is read as an ordinary column\. To read each line as that many rows, add --count n\./);
	});

	it('a bad count: exit 2, one line naming file, row and column', async () => {
		const r = await run(['data', 'tests', UCB, UCB_CSV, '--count', 'Dept']);
		expect(r.code).toBe(2);
		expect(r.err.trim()).toBe(`causeway: ${UCB_CSV}: Column 'Dept' holds text ('A'), not counts of rows.`);
	});
});

describe('causeway data --sql', () => {
	const discreteOnly = ['--map', 'income=,diet=,distance=,bikeability=,fitness=,bmi='];

	it('prints the grouped counts for the mapping, with the kinds of a sample file', async () => {
		const r = await run(['data', 'tests', DEMO, DEMO_CSV, '--sql', 'spark:db.visits', ...discreteOnly]);
		expect(r.code).toBe(0);
		expect(r.out).toContain('SELECT\n  `age`,\n  `cycling`,\n  `family_history`,\n  `hypertension`,\n  `app_panel`,\n  `antihypertensive`,\n  COUNT(*) AS `n`\nFROM `db`.`visits`\nGROUP BY 1, 2, 3, 4, 5, 6');
		expect(r.out).not.toContain('moments');
	});

	it('bad dialect or too many files: exit 2 with one line', async () => {
		const bad = await run(['data', 'estimates', DEMO, '--sql', 'oracle']);
		expect(bad.code).toBe(2);
		expect(bad.err.trim()).toBe('causeway: Unknown SQL dialect "oracle": use duckdb, postgres or spark (as DIALECT or DIALECT:TABLE)');
	});

	it('round trip on DuckDB: grouped counts with --count, moments with --summary, as from the rows', async () => {
		const dir = mkdtempSync(join(tmpdir(), 'causeway-cli-sql-'));
		try {
			const db = await (await DuckDBInstance.create(':memory:')).connect();
			await db.run(`CREATE TABLE visits AS SELECT * FROM read_csv('${DEMO_CSV}', header = true)`);
			const sql = await run(['data', 'estimates', DEMO, DEMO_CSV, '--sql', 'duckdb:visits', '--json']);
			const { groupedCounts, moments } = JSON.parse(sql.out);
			expect(moments).toBeNull();
			const grouped = join(dir, 'grouped.csv');
			await db.run(`COPY (${groupedCounts.trim().replace(/;$/, '')}) TO '${grouped}' (HEADER)`);
			const fromRows = JSON.parse((await run(['data', 'estimates', DEMO, DEMO_CSV, '--json'])).out);
			const fromGroups = JSON.parse((await run(['data', 'estimates', DEMO, grouped, '--count', 'n', '--json'])).out);
			expectSameNumbers(fromGroups.estimates, fromRows.estimates);
			expectSameNumbers(fromGroups.confounders, fromRows.confounders);

			const continuous = ['--map', 'cycling=,family_history=,hypertension=,app_panel=,antihypertensive=', '--exposure', 'diet', '--outcome', 'bmi'];
			const m = JSON.parse((await run(['data', 'estimates', DEMO, DEMO_CSV, '--sql', 'duckdb:visits', '--json', ...continuous])).out);
			const momentsFile = join(dir, 'moments.csv');
			await db.run(`COPY (${m.moments.trim().replace(/;$/, '')}) TO '${momentsFile}' (HEADER)`);
			const viaSummary = JSON.parse((await run(['data', 'estimates', DEMO, momentsFile, '--summary', '--json', ...continuous])).out);
			const viaRows = JSON.parse((await run(['data', 'estimates', DEMO, DEMO_CSV, '--json', ...continuous])).out);
			expect(viaSummary.estimates.rows.length).toBeGreaterThan(0);
			const numbers = (r: { estimates: { rows: { adjustedFor: string[]; estimate: number; ci: number[] }[] } }) => r.estimates.rows.map((e) => [e.adjustedFor, e.estimate, e.ci]);
			expectSameNumbers(numbers(viaSummary), numbers(viaRows));
			db.closeSync();
		} finally {
			rmSync(dir, { recursive: true, force: true });
		}
	});
});
