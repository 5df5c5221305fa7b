/**
 * Section 4c: the data checks at a million rows, as people run them, side by side with R in the
 * same run. The demo study's 12 columns (scripts/simulate-demo.ts, seeded) are written to a
 * temporary CSV (≈39 MiB at 10⁶ rows), then:
 * - reading: parseTableStream from disk in a fresh process (bench/data-read-child.ts), CPU time
 *   as MiB/s (best of the runs; target ≥ 100 MiB/s) and peak memory over the typed columns
 *   (peak resident set minus the set before reading, over the columns' bytes; target ≤ 2);
 * - `causeway test` and `causeway estimate` as whole processes (node bin/causeway.js; target for
 *   test ≤ 5 s);
 * - R's whole process for the estimate: read.csv, then the crude and planned-set glm fits
 *   (bench/data-glm.R; target: `causeway estimate` at least 3× faster), with the planned odds
 *   ratio of both programs.
 * Wall time and CPU time (user + system, /usr/bin/time) of each process, median of the runs,
 * ours and R's alternating; os.loadavg() before and after, since the machine is shared.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { demoCsv, simulateDemo } from '../scripts/simulate-demo';
import { fmtBytes, fmtInt, fmtMs, type Row, type Section } from './table';
import { rscript } from './tools';

const DIAGRAM = 'static/demo/cycling-hypertension.causeway.json';
const TIME = '/usr/bin/time';

interface Process {
	wall: number;
	cpu: number;
	maxRss: number;
	stdout: string;
	status: number | null;
}

/** One whole process: wall time here, CPU time and peak memory from /usr/bin/time when there. */
function run(cmd: string, args: string[], dir: string): Process {
	const timing = join(dir, 'time.txt');
	const timed = existsSync(TIME);
	const t0 = performance.now();
	const r = timed
		? spawnSync(TIME, ['-f', '%U %S %M', '-o', timing, cmd, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 })
		: spawnSync(cmd, args, { encoding: 'utf8', maxBuffer: 1 << 28 });
	const wall = performance.now() - t0;
	if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed: ${(r.stderr ?? '').split('\n')[0]}`);
	let cpu = Number.NaN;
	let maxRss = Number.NaN;
	if (timed) {
		const [user, sys, kb] = readFileSync(timing, 'utf8').trim().split(/\s+/).slice(-3).map(Number);
		cpu = (user + sys) * 1000;
		maxRss = kb * 1024;
	}
	return { wall, cpu, maxRss, stdout: r.stdout, status: r.status };
}

function median(xs: number[]): number {
	const s = [...xs].sort((a, b) => a - b);
	return s[Math.floor(s.length / 2)];
}

const load = (l: number[]) => l.map((x) => x.toFixed(2)).join(', ');
const fmtCpu = (ms: number) => (Number.isNaN(ms) ? 'n/a' : fmtMs(ms));

/** The planned set's odds ratio in `causeway estimate --json`. */
function plannedOddsRatio(json: string): number {
	const report = JSON.parse(json) as { estimates: { rows: { roles: string[]; estimate: number }[] } | null };
	return report.estimates?.rows.find((r) => r.roles.includes('planned'))?.estimate ?? Number.NaN;
}

export function benchDataScale(rows: number, repeats: number): Section {
	const loadBefore = loadavg();
	execFileSync(process.execPath, ['scripts/build-cli.mjs'], { stdio: 'ignore' });
	const dir = mkdtempSync(join(tmpdir(), 'causeway-bench-scale-'));
	try {
		const csv = join(dir, 'demo.csv');
		writeFileSync(csv, demoCsv(simulateDemo(rows, 20260101)));
		const bytes = statSync(csv).size;
		const mib = bytes / 2 ** 20;

		const reads = Array.from({ length: repeats }, () => {
			const out = execFileSync(process.execPath, ['--import', 'tsx', 'bench/data-read-child.ts', csv], { encoding: 'utf8', maxBuffer: 1 << 24 });
			return JSON.parse(out.trim().split('\n').pop() as string) as { cpu: number; wall: number; rssBefore: number; maxRss: number; columnBytes: number };
		});
		const bestCpu = Math.min(...reads.map((r) => r.cpu));
		const ratio = median(reads.map((r) => (r.maxRss - r.rssBefore) / r.columnBytes));

		const R = rscript();
		const test: Process[] = [];
		const estimate: Process[] = [];
		const r: Process[] = [];
		for (let i = 0; i < repeats; i++) {
			test.push(run(process.execPath, ['bin/causeway.js', 'test', DIAGRAM, csv], dir));
			estimate.push(run(process.execPath, ['bin/causeway.js', 'estimate', DIAGRAM, csv, '--json'], dir));
			if (R) r.push(run(R.path, ['bench/data-glm.R', csv], dir));
		}
		const ours = plannedOddsRatio(estimate[0].stdout);
		const theirs = r.length ? (JSON.parse(r[0].stdout.trim().split('\n').pop() as string) as { plannedOR: number }).plannedOR : Number.NaN;
		const wall = (ps: Process[]) => median(ps.map((p) => p.wall));
		const cpu = (ps: Process[]) => median(ps.map((p) => p.cpu));
		const rss = (ps: Process[]) => median(ps.map((p) => p.maxRss));
		const rows_: Row[] = [
			{
				figure: `reading ${fmtInt(rows)} rows (${mib.toFixed(1)} MiB) into typed columns`,
				Causeway: `${(mib / (bestCpu / 1000)).toFixed(0)} MiB/s of CPU (best; median ${(mib / (median(reads.map((x) => x.cpu)) / 1000)).toFixed(0)}), wall ${fmtMs(median(reads.map((x) => x.wall)))}`,
				R: '',
				ratio: '',
				target: '≥ 100 MiB/s'
			},
			{
				figure: 'memory while reading ÷ typed columns',
				Causeway: `${ratio.toFixed(2)} (peak +${fmtBytes(median(reads.map((x) => x.maxRss - x.rssBefore)))} for ${fmtBytes(reads[0].columnBytes)} of columns)`,
				R: '',
				ratio: '',
				target: '≤ 2'
			},
			{
				figure: '`causeway test`, whole process',
				Causeway: `${fmtMs(wall(test))} wall, ${fmtCpu(cpu(test))} CPU, peak ${fmtBytes(rss(test))}`,
				R: '',
				ratio: '',
				target: '≤ 5 s'
			},
			{
				figure: "`causeway estimate` vs R's read.csv + 2 glm, whole processes",
				Causeway: `${fmtMs(wall(estimate))} wall, ${fmtCpu(cpu(estimate))} CPU, peak ${fmtBytes(rss(estimate))}`,
				R: R ? `${fmtMs(wall(r))} wall, ${fmtCpu(cpu(r))} CPU, peak ${fmtBytes(rss(r))}` : 'n/a',
				ratio: R ? `${(wall(r) / wall(estimate)).toFixed(1)}× wall, ${(cpu(r) / cpu(estimate)).toFixed(1)}× CPU` : 'n/a',
				target: '≥ 3×'
			},
			{
				figure: 'planned odds ratio (cycling → hypertension, given age, income, diet)',
				Causeway: ours.toPrecision(8),
				R: R ? theirs.toPrecision(8) : 'n/a',
				ratio: R ? `difference ${Math.abs(ours - theirs).toExponential(1)}` : '',
				target: 'equal'
			}
		];
		return {
			title: `4c. Data at ${fmtInt(rows)} rows: reading, the whole commands, and R`,
			rows: rows_,
			skipped: R ? undefined : "R not found (apt-get install r-base-core): R's column is empty",
			note:
				`The demo study's 12 columns, ${fmtInt(rows)} rows (${fmtBytes(bytes)}), simulated with a fixed seed. Reading: parseTableStream from disk in a fresh process, best and median of ${repeats}; memory is that process's peak resident set minus its set before reading, over the typed columns' bytes. ` +
				`Commands: whole processes (node bin/causeway.js; Rscript bench/data-glm.R), median of ${repeats}, ours and R's alternating; \`causeway estimate\` also computes the standardized estimates and the confounder check of every candidate, R only the two fits. ` +
				`Load average (1, 5, 15 min) before: ${load(loadBefore)}; after: ${load(loadavg())} — on a loaded 2-core machine wall time includes waiting for a core, so CPU time is the steadier figure.`
		};
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
}
