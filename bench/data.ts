/**
 * Section 4a: the data checks on the demo study's 12 columns at 10⁴, 10⁵ and 10⁶ rows. The
 * rows come from the demo simulator (scripts/simulate-demo.ts, seeded), are written to a
 * temporary CSV, and each size runs in its own child process (bench/data-child.ts) so the
 * peak resident set reported is that run's alone.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { demoCsv, simulateDemo } from '../scripts/simulate-demo';
import { fmtBytes, fmtInt, fmtMs, type Section } from './table';

const DIAGRAM = 'static/demo/cycling-hypertension.causeway.json';

interface ChildResult {
	rows: number;
	columns: number;
	parseMs: number;
	arrowsMs: number;
	claimsMs: number;
	estimatesMs: number;
	parseCpu: number;
	arrowsCpu: number;
	claimsCpu: number;
	estimatesCpu: number;
	arrowChecks: number;
	claimChecks: number;
	estimateRows: number;
	rssBefore: number;
	maxRss: number;
}

export function benchData(sizes: number[]): Section {
	const dir = mkdtempSync(join(tmpdir(), 'causeway-bench-data-'));
	try {
		const rows = sizes.map((n) => {
			const csv = join(dir, `demo-${n}.csv`);
			writeFileSync(csv, demoCsv(simulateDemo(n, 20260101)));
			const bytes = statSync(csv).size;
			const out = execFileSync(process.execPath, ['--import', 'tsx', 'bench/data-child.ts', DIAGRAM, csv], {
				encoding: 'utf8',
				maxBuffer: 1 << 24
			});
			const r = JSON.parse(out.trim().split('\n').pop() as string) as ChildResult;
			rmSync(csv);
			const total = r.parseCpu + r.arrowsCpu + r.claimsCpu;
			return {
				rows: fmtInt(r.rows),
				columns: String(r.columns),
				'CSV size': fmtBytes(bytes),
				parse: fmtMs(r.parseCpu),
				'parse MB/s': ((bytes / 2 ** 20) / (r.parseCpu / 1000)).toFixed(1),
				[`arrow checks`]: `${fmtMs(r.arrowsCpu)} (${r.arrowChecks})`,
				[`claim checks`]: `${fmtMs(r.claimsCpu)} (${r.claimChecks})`,
				'parse + arrows + claims': fmtMs(total),
				'(wall)': fmtMs(r.parseMs + r.arrowsMs + r.claimsMs),
				'estimates (crude vs adjusted)': `${fmtMs(r.estimatesCpu)} (${r.estimateRows} rows)`,
				'RSS before reading': fmtBytes(r.rssBefore),
				'peak RSS': fmtBytes(r.maxRss)
			};
		});
		return {
			title: '4. Data: reading and checking the demo study (12 columns)',
			rows,
			note:
				'CPU times of the child process (wall time of the three parts beside them; the machine is shared). ' +
				'Each size runs in a fresh Node process: the CSV is streamed from disk through parseTableStream (1 MiB chunks, as the app reads a File), ' +
				'then runDataChecks (src/lib/datacheck) runs all arrow checks, all claim checks (conditional-independence tests given each minimal separator), ' +
				'and the estimates (one logistic fit per adjustment set shown, crude and adjusted) — each part timed on its own. ' +
				'Peak RSS is process.resourceUsage().maxRSS of that process (Node and tsx alone take the "before" figure); ' +
				'the table itself is typed column arrays (8 bytes per numeric cell, 1–4 per coded cell), never the whole text.'
		};
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
}
