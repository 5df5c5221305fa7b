/**
 * Child process of the warehouse section (bench/warehouse.ts), so that its peak memory is its own:
 *   node --import tsx bench/warehouse-child.ts <diagram.json> <data.csv> [count column]
 * Streams the CSV (as the app's worker reads a File), expands it when a count column is given
 * (a grouped table, stats/table/grouped.ts), runs every check and the estimates on the
 * variables the file has (the others unmeasured), and prints one JSON line: CPU and wall
 * times of each part, the planned estimate (to compare the two inputs) and the peak RSS.
 */
import { createReadStream, readFileSync, statSync } from 'node:fs';
import { parseDiagramJson } from '../src/lib/graph/native-json';
import { expandGroupedTable, parseTableStream } from '../src/lib/stats';
import { runDataChecks } from '../src/lib/datacheck';
import { cpuLap } from './cpu-lap';

async function main(): Promise<void> {
	const [diagramPath, csvPath, count] = process.argv.slice(2);
	const diagram = parseDiagramJson(readFileSync(diagramPath, 'utf8'));
	const cpuSince = cpuLap();
	const t0 = performance.now();
	const parsed = await parseTableStream(createReadStream(csvPath, { highWaterMark: 1 << 20 }), { totalBytes: statSync(csvPath).size });
	if (!parsed.ok) throw new Error(`could not read ${csvPath}: ${JSON.stringify(parsed.error)}`);
	const parseCpu = cpuSince();
	const lines = parsed.table.rowCount;
	const table = count ? expandGroupedTable(parsed.table, count) : parsed.table;
	const expandCpu = cpuSince();
	const report = runDataChecks(diagram, table, { pictures: false, settingProblems: 'note' });
	const checksCpu = cpuSince();
	const wallMs = performance.now() - t0;
	// The last row that was estimated (the adjusted ones come after the crude row).
	const planned = report.estimates?.rows.filter((r) => !r.message && Number.isFinite(r.estimate)).at(-1);
	console.log(
		JSON.stringify({
			lines,
			rows: table.rowCount,
			parseCpu,
			expandCpu,
			checksCpu,
			wallMs,
			arrowChecks: report.arrows.checks.length,
			claimChecks: report.claims.tested,
			planned: planned ? [planned.estimate, planned.ci[0], planned.ci[1]] : null,
			maxRss: process.resourceUsage().maxRSS * 1024
		})
	);
}

main().catch((e: unknown) => {
	console.error(e instanceof Error ? e.message : String(e));
	process.exit(1);
});
