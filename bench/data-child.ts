/**
 * Child process of section 4 (bench/data.ts), so that its peak memory is its own:
 *   node --import tsx bench/data-child.ts <diagram.json> <data.csv>
 * Streams the CSV through parseTableStream (as the app's data worker reads a File), runs every
 * arrow check, then every claim check, then the crude vs adjusted estimates, through the data
 * pipeline (src/lib/datacheck runDataChecks), and prints one JSON line: the wall and CPU times, the counts,
 * the resident set before reading and its peak (process.resourceUsage().maxRSS).
 */
import { createReadStream, readFileSync, statSync } from 'node:fs';
import { parseDiagramJson } from '../src/lib/graph/native-json';
import { parseTableStream } from '../src/lib/stats';
import { runDataChecks } from '../src/lib/datacheck';
import { cpuLap } from './cpu-lap';

async function main(): Promise<void> {
	const [diagramPath, csvPath] = process.argv.slice(2);
	const diagram = parseDiagramJson(readFileSync(diagramPath, 'utf8'));
	const rssBefore = process.memoryUsage().rss;
	const cpuSince = cpuLap();
	const t0 = performance.now();
	const parsed = await parseTableStream(createReadStream(csvPath, { highWaterMark: 1 << 20 }), { totalBytes: statSync(csvPath).size });
	const parseMs = performance.now() - t0;
	const parseCpu = cpuSince();
	if (!parsed.ok) throw new Error(`could not read ${csvPath}: ${JSON.stringify(parsed.error)}`);
	const table = parsed.table;
	const t1 = performance.now();
	const arrows = runDataChecks(diagram, table, { parts: { arrows: true, claims: false, estimates: false } }).arrows;
	const arrowsMs = performance.now() - t1;
	const arrowsCpu = cpuSince();
	const t2 = performance.now();
	const claims = runDataChecks(diagram, table, { parts: { arrows: false, claims: true, estimates: false } }).claims;
	const claimsMs = performance.now() - t2;
	const claimsCpu = cpuSince();
	const t3 = performance.now();
	const estimates = runDataChecks(diagram, table, { parts: { arrows: false, claims: false, estimates: true } }).estimates;
	const estimatesMs = performance.now() - t3;
	const estimatesCpu = cpuSince();
	console.log(
		JSON.stringify({
			rows: table.rowCount,
			columns: table.columns.length,
			parseMs,
			arrowsMs,
			claimsMs,
			estimatesMs,
			parseCpu,
			arrowsCpu,
			claimsCpu,
			estimatesCpu,
			arrowChecks: arrows.checks.length,
			claimChecks: claims.tested,
			estimateRows: estimates?.rows.length ?? 0,
			rssBefore,
			maxRss: process.resourceUsage().maxRSS * 1024
		})
	);
}

main().catch((e: unknown) => {
	console.error(e instanceof Error ? e.message : String(e));
	process.exit(1);
});
