/**
 * Section warehouse: a grouped table standing for 10⁶ rows against the 10⁶ rows themselves.
 * The demo simulator (scripts/simulate-demo.ts, seeded) writes 10⁶ rows; an embedded DuckDB
 * (@duckdb/node-api) loads them and runs the SQL Causeway writes for the demo diagram's
 * discrete columns and age (src/lib/datacheck/warehouse, grouped counts) — timed, as a
 * database would run it — and writes the same six columns as rows for the comparison. Each
 * input is then read and checked in a fresh process (bench/warehouse-child.ts): parse,
 * expansion of the grouped lines into rows, all arrow and claim checks and the estimates;
 * CPU times, peak RSS, and whether the planned estimates agree.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { demoCsv, simulateDemo } from '../scripts/simulate-demo';
import { groupedCountsSql, summaryPlan } from '../src/lib/datacheck/warehouse';
import { parseDiagramJson } from '../src/lib/graph/native-json';
import { fmtBytes, fmtInt, fmtMs, type Row, type Section } from './table';

const DIAGRAM = 'static/demo/cycling-hypertension.causeway.json';
const COLUMNS = ['age', 'cycling', 'family_history', 'hypertension', 'app_panel', 'antihypertensive'];

interface ChildResult {
	lines: number;
	rows: number;
	parseCpu: number;
	expandCpu: number;
	checksCpu: number;
	wallMs: number;
	arrowChecks: number;
	claimChecks: number;
	planned: [number, number, number] | null;
	maxRss: number;
}

function child(csv: string, count?: string): ChildResult {
	const out = execFileSync(process.execPath, ['--import', 'tsx', 'bench/warehouse-child.ts', DIAGRAM, csv, ...(count ? [count] : [])], { encoding: 'utf8', maxBuffer: 1 << 24 });
	return JSON.parse(out.trim().split('\n').pop() as string) as ChildResult;
}

export async function benchWarehouse(rows: number): Promise<Section> {
	let duckdb: typeof import('@duckdb/node-api');
	try {
		duckdb = await import('@duckdb/node-api');
	} catch {
		return { title: 'warehouse. Grouped counts vs rows', rows: [], skipped: '@duckdb/node-api is not installed (a dev dependency)' };
	}
	const dir = mkdtempSync(join(tmpdir(), 'causeway-bench-warehouse-'));
	try {
		const all = join(dir, 'demo.csv');
		writeFileSync(all, demoCsv(simulateDemo(rows, 20260101)));
		const db = await (await duckdb.DuckDBInstance.create(':memory:')).connect();
		await db.run(`CREATE TABLE visits AS SELECT * FROM read_csv('${all}', header = true)`);
		const diagram = parseDiagramJson(readFileSync(DIAGRAM, 'utf8'));
		const mapping = Object.fromEntries(diagram.variables.filter((v) => v.measured && !COLUMNS.includes(v.id)).map((v) => [v.id, null]));
		const plan = summaryPlan(diagram, { mapping });
		const sql = groupedCountsSql(plan, 'duckdb', 'visits').trim().replace(/;$/, '');
		const grouped = join(dir, 'grouped.csv');
		const rowsCsv = join(dir, 'rows.csv');
		const t0 = performance.now();
		await db.run(`COPY (${sql}) TO '${grouped}' (HEADER)`);
		const duckMs = performance.now() - t0;
		await db.run(`COPY (SELECT ${COLUMNS.join(', ')} FROM visits) TO '${rowsCsv}' (HEADER)`);
		db.closeSync();
		const fromRows = child(rowsCsv);
		const fromGroups = child(grouped, plan.countName);
		const agree = fromRows.planned && fromGroups.planned && fromRows.planned.every((x, i) => Math.abs(x - fromGroups.planned![i]) <= 1e-9 * Math.max(1, Math.abs(x)));
		const row = (input: string, file: string, r: ChildResult): Row => ({
			input,
			'file size': fmtBytes(statSync(file).size),
			lines: fmtInt(r.lines),
			'rows represented': fmtInt(r.rows),
			parse: fmtMs(r.parseCpu),
			'expand to rows': r.expandCpu > 0 && input !== 'rows' ? fmtMs(r.expandCpu) : '—',
			'checks + estimates': `${fmtMs(r.checksCpu)} (${r.arrowChecks} arrows, ${r.claimChecks} claims)`,
			'total CPU': fmtMs(r.parseCpu + r.expandCpu + r.checksCpu),
			'(wall)': fmtMs(r.wallMs),
			'peak RSS': fmtBytes(r.maxRss)
		});
		const total = (r: ChildResult) => r.parseCpu + r.expandCpu + r.checksCpu;
		return {
			title: `warehouse. Grouped counts standing for ${fmtInt(rows)} rows vs the rows (6 columns of the demo study)`,
			rows: [row('rows', rowsCsv, fromRows), row('grouped counts', grouped, fromGroups)],
			note:
				`DuckDB ran Causeway's grouped-counts SQL over the ${fmtInt(rows)} rows and wrote the CSV in ${fmtMs(duckMs)} (wall, embedded engine, table already loaded). ` +
				`Rows ÷ grouped counts: total CPU ×${(total(fromRows) / total(fromGroups)).toFixed(2)}, parse CPU ×${(fromRows.parseCpu / fromGroups.parseCpu).toFixed(1)}, peak RSS ×${(fromRows.maxRss / fromGroups.maxRss).toFixed(2)}; ` +
				`last adjusted estimate and CI ${agree ? 'equal to 1e-9' : 'DIFFER'} (${fromGroups.planned?.map((x) => x.toPrecision(6)).join(', ')}). ` +
				'The grouped lines are expanded into typed row columns (stats/table/grouped.ts), so the checks themselves cost what they cost on rows; ' +
				'the saving is in reading (and in what leaves the database: the file sizes). CPU times of fresh child processes; peak RSS is process.resourceUsage().maxRSS.'
		};
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
}
