/**
 * Child process of section 4c (bench/data-scale.ts), so that its peak memory is the read's own:
 *   node --import tsx bench/data-read-child.ts <data.csv>
 * Streams the CSV from disk through parseTableStream (1 MiB chunks, the file size given, as the
 * command line reads) and prints one JSON line: CPU and wall time of the read, the resident set
 * before it and its peak (process.resourceUsage().maxRSS), and the bytes of the typed columns.
 */
import { createReadStream, statSync } from 'node:fs';
import { parseTableStream } from '../src/lib/stats';

async function main(): Promise<void> {
	const [path] = process.argv.slice(2);
	const bytes = statSync(path).size;
	const rssBefore = process.memoryUsage().rss;
	const c0 = process.cpuUsage();
	const t0 = performance.now();
	const parsed = await parseTableStream(createReadStream(path, { highWaterMark: 1 << 20 }), { totalBytes: bytes });
	const wall = performance.now() - t0;
	const c = process.cpuUsage(c0);
	if (!parsed.ok) throw new Error(`could not read ${path}: ${parsed.error.message}`);
	let columnBytes = 0;
	for (const col of parsed.table.columns) columnBytes += col.kind === 'continuous' ? col.values.byteLength : col.codes.byteLength;
	console.log(JSON.stringify({ bytes, rows: parsed.table.rowCount, cpu: (c.user + c.system) / 1000, wall, rssBefore, maxRss: process.resourceUsage().maxRSS * 1024, columnBytes }));
}

main().catch((e: unknown) => {
	console.error(e instanceof Error ? e.message : String(e));
	process.exit(1);
});
