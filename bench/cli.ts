/**
 * Section "cli": the `causeway` command as pipelines run it, each figure a whole process
 * (node bin/causeway.js …) on seeded diagram files (bench/cli-diagram.ts):
 * - start-up on the small demo diagram against a bare `node -e 0`;
 * - diagram separation (d-separation) on 100,000 variables and 200,000 arrows (≈12 MiB) against networkx's whole process
 *   (bench/nx_dsep_file.py with Debian's /usr/bin/python3: read the file, build the graph,
 *   nx.d_separated), runs alternating, with both answers, the ratios and the load; the same
 *   diagram through the full reader (as a version 1 file, which the fast reader leaves to it)
 *   and with the text output;
 * - plan sets on 2,000 variables with the default cap; all diagram claims of 2,000 variables
 *   (1.6 million lines through a pipe); plan roles on 2,000 and 10,000 variables, and on 100,000 the refusal and
 *   --only for ten variables.
 * Wall time and CPU time (user + system of the child, from /usr/bin/time), median of the runs;
 * the machine is shared, so os.loadavg() is printed before and after.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomDiagramJson } from './cli-diagram';
import { fmtBytes, fmtInt, fmtMs, type Row, type Section } from './table';
import { networkx } from './tools';
import { eagerOutputs, readBundleMeta } from '../tests/unit/cli/bundle-meta';

interface Run {
	wall: number;
	cpu: number;
	stdout: string;
	stderr: string;
	status: number | null;
	lines?: number;
}

const TIME = '/usr/bin/time';
const DEMO = 'static/demo/cycling-hypertension.causeway.json';

/** One process, timed by /usr/bin/time when there (CPU), else wall time only. */
function runOnce(cmd: string, args: string[], dir: string): Run {
	const timing = join(dir, 'time.txt');
	const timed = existsSync(TIME);
	const t0 = performance.now();
	const r = timed
		? spawnSync(TIME, ['-f', '%U %S', '-o', timing, cmd, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 })
		: spawnSync(cmd, args, { encoding: 'utf8', maxBuffer: 1 << 28 });
	const wall = performance.now() - t0;
	let cpu = Number.NaN;
	if (timed) {
		const [user, sys] = readFileSync(timing, 'utf8').trim().split(/\s+/).slice(-2).map(Number);
		cpu = (user + sys) * 1000;
	}
	return { wall, cpu, stdout: r.stdout, stderr: r.stderr, status: r.status };
}

/** A long output read through a pipe, counting lines and bytes as a pipeline's next step would. */
function runPiped(cmd: string, args: string[], dir: string): Promise<Run & { bytes: number }> {
	const timing = join(dir, 'time.txt');
	const timed = existsSync(TIME);
	return new Promise((resolve) => {
		const t0 = performance.now();
		const child = timed ? spawn(TIME, ['-f', '%U %S', '-o', timing, cmd, ...args]) : spawn(cmd, args);
		let lines = 0;
		let bytes = 0;
		let stderr = '';
		child.stdout.on('data', (c: Buffer) => {
			bytes += c.length;
			for (let i = c.indexOf(10); i !== -1; i = c.indexOf(10, i + 1)) lines++;
		});
		child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
		child.on('close', (status) => {
			const wall = performance.now() - t0;
			let cpu = Number.NaN;
			if (timed) {
				const [user, sys] = readFileSync(timing, 'utf8').trim().split(/\s+/).slice(-2).map(Number);
				cpu = (user + sys) * 1000;
			}
			resolve({ wall, cpu, stdout: '', stderr, status, lines, bytes });
		});
	});
}

function median(xs: number[]): number {
	const s = [...xs].sort((a, b) => a - b);
	return s[Math.floor(s.length / 2)];
}

function timed(cmd: string, args: string[], dir: string, repeat: number): Run & { runs: Run[] } {
	const runs = Array.from({ length: repeat }, () => runOnce(cmd, args, dir));
	return { ...runs[0], wall: median(runs.map((r) => r.wall)), cpu: median(runs.map((r) => r.cpu)), runs };
}

/** The run with the median CPU time (wall time as its own median), with its output. */
function medianRun(runs: Run[]): Run {
	const byCpu = [...runs].sort((a, b) => a.cpu - b.cpu);
	return { ...byCpu[Math.floor(byCpu.length / 2)], wall: median(runs.map((r) => r.wall)), cpu: median(runs.map((r) => r.cpu)) };
}

const fmtLoad = (l: number[]) => l.map((x) => x.toFixed(1)).join(', ');
const cli = (args: string[]) => ['bin/causeway.js', ...args];
const fmtCpu = (ms: number) => (Number.isNaN(ms) ? 'n/a' : fmtMs(ms));

export async function benchCli(quick: boolean): Promise<Section> {
	const loadBefore = loadavg();
	const dir = mkdtempSync(join(tmpdir(), 'causeway-bench-cli-'));
	const rows: Row[] = [];
	const notes: string[] = [];
	const node = process.execPath;
	try {
		const bigN = quick ? 10_000 : 100_000;
		const midN = 2_000;
		const big = join(dir, `random-${bigN}.json`);
		const mid = join(dir, `random-${midN}.json`);
		const ten = join(dir, 'random-10000.json');
		writeFileSync(big, randomDiagramJson(bigN));
		writeFileSync(mid, randomDiagramJson(midN));
		if (!quick) writeFileSync(ten, randomDiagramJson(10_000));

		// Start-up: the two commands alternate, so a change in the machine's load hits both.
		const repeat = quick ? 7 : 21;
		const bare: number[] = [];
		const ours: number[] = [];
		for (let i = 0; i < repeat; i++) {
			bare.push(runOnce(node, ['-e', '0'], dir).wall);
			ours.push(runOnce(node, cli(['diagram', 'separation', DEMO, '--from', 'age', '--to', 'bmi']), dir).wall);
		}
		const ratio = median(ours) / median(bare);
		rows.push({
			what: 'start-up: diagram separation on the 12-variable demo vs `node -e 0`',
			size: '12 variables',
			wall: `${fmtMs(median(ours))} vs ${fmtMs(median(bare))}`,
			CPU: '',
			result: `ratio ${ratio.toFixed(2)} (fastest runs ${(Math.min(...ours) / Math.min(...bare)).toFixed(2)}); target ≤ 1.5`
		});
		const meta = readBundleMeta();
		const eagerBytes = eagerOutputs(meta).reduce((sum, f) => sum + meta.outputs[f].bytes, 0);
		const allBytes = Object.entries(meta.outputs).filter(([f]) => f.endsWith('.mjs')).reduce((s, [, o]) => s + o.bytes, 0);
		notes.push(`Start-up loads ${fmtBytes(eagerBytes)} of the ${fmtBytes(allBytes)} bundle (esbuild metafile, dist-cli/meta.json); the rest is loaded by the command that needs it.`);

		// dsep on the big diagram, ours and networkx's whole process, on the same file and query.
		// The runs alternate (ours, networkx, ours, …) so that a change in the machine's load hits
		// both; medians; the load is printed beside the ratio.
		const q = ['--from', 'v1', '--to', 'v2', '--given', 'v3,v4'];
		const size = `${fmtInt(bigN)} variables, ${fmtInt(2 * bigN)} arrows, ${fmtBytes(statSync(big).size)}`;
		const nx = networkx();
		const pairs = quick ? 1 : 5;
		const ourRuns: Run[] = [];
		const nxRuns: Run[] = [];
		const loadAtDsep = loadavg();
		for (let i = 0; i < pairs; i++) {
			ourRuns.push(runOnce(node, cli(['diagram', 'separation', big, ...q, '--json']), dir));
			if (nx) nxRuns.push(runOnce(nx.python, ['bench/nx_dsep_file.py', big, 'v1', 'v2', 'v3,v4'], dir));
		}
		const loadAfterDsep = loadavg();
		const dsep = medianRun(ourRuns);
		const ourAnswer = dsep.status === 0 ? (JSON.parse(dsep.stdout) as { separated: boolean }).separated : null;
		let nxCell = 'networkx not installed';
		if (nx) {
			const ref = medianRun(nxRuns);
			const nxAnswer = ref.status === 0 ? (JSON.parse(ref.stdout) as { separated: boolean }).separated : null;
			nxCell =
				`networkx ${nx.version}: ${fmtMs(ref.wall)} wall, ${fmtCpu(ref.cpu)} CPU; ours ×${(ref.wall / dsep.wall).toFixed(1)} faster in wall time, ` +
				`×${(ref.cpu / dsep.cpu).toFixed(1)} in CPU time (target ≥ 10×); same answer: ${nxAnswer === ourAnswer ? 'yes' : 'NO'}; ` +
				`${pairs} alternating runs each, medians; load ${fmtLoad(loadAtDsep)} → ${fmtLoad(loadAfterDsep)}`;
		}
		rows.push({ what: 'diagram separation (whole process) vs networkx d_separated (whole process)', size, wall: fmtMs(dsep.wall), CPU: fmtCpu(dsep.cpu), result: `separated: ${ourAnswer}; ${nxCell}` });
		// The same diagram as a version 1 file: the fast reader leaves it to the full reader
		// (JSON.parse, schema, checks, compiling; src/lib/graph/fast-native), for comparison.
		const v1 = join(dir, `random-${bigN}-v1.json`);
		writeFileSync(v1, readFileSync(big, 'utf8').replace('"version":2', '"version":1'));
		const full = timed(node, cli(['diagram', 'separation', v1, ...q, '--json']), dir, quick ? 1 : 3);
		rows.push({ what: 'diagram separation through the full reader (same diagram as version 1)', size, wall: fmtMs(full.wall), CPU: fmtCpu(full.cpu), result: `separated: ${full.status === 0 ? (JSON.parse(full.stdout) as { separated: boolean }).separated : `exit ${full.status}`}; the fast path is ×${(full.cpu / dsep.cpu).toFixed(1)} less CPU` });
		const text = timed(node, cli(['diagram', 'separation', big, ...q]), dir, quick ? 1 : 3);
		rows.push({ what: 'diagram separation, printed path (text output)', size, wall: fmtMs(text.wall), CPU: fmtCpu(text.cpu), result: text.status === 0 ? text.stdout.trim().slice(0, 60) + '…' : `exit ${text.status}` });

		const check = timed(node, cli(['review', 'verdict', big, '--json']), dir, 1);
		rows.push({ what: 'review verdict (on the planned set)', size, wall: fmtMs(check.wall), CPU: fmtCpu(check.cpu), result: `exit ${check.status}` });
		const bigSets = timed(node, cli(['plan', 'sets', big, '--max', '10', '--json']), dir, 1);
		rows.push({ what: 'plan sets --max 10', size, wall: fmtMs(bigSets.wall), CPU: fmtCpu(bigSets.cpu), result: `${(JSON.parse(bigSets.stdout) as { sets: unknown[] }).sets.length} sets` });
		const bigClaims = timed(node, cli(['diagram', 'claims', big, '--max', '100']), dir, 1);
		rows.push({ what: 'diagram claims --max 100', size, wall: fmtMs(bigClaims.wall), CPU: fmtCpu(bigClaims.cpu), result: `${bigClaims.stdout.trim().split('\n').length} claims` });
		const refused = timed(node, cli(['plan', 'roles', big]), dir, 1);
		rows.push({ what: 'plan roles (all variables)', size, wall: fmtMs(refused.wall), CPU: fmtCpu(refused.cpu), result: refused.status === 0 ? 'answered' : `exit ${refused.status}: ${refused.stderr.trim().slice(0, 90)}…` });
		const only = Array.from({ length: 10 }, (_, i) => `v${i * 997}`).join(',');
		const rolesOnly = timed(node, cli(['plan', 'roles', big, '--only', only]), dir, 1);
		rows.push({ what: 'plan roles --only (10 variables)', size, wall: fmtMs(rolesOnly.wall), CPU: fmtCpu(rolesOnly.cpu), result: `exit ${rolesOnly.status}` });

		// 2,000 variables: sets with the default cap, all claims through a pipe, all roles.
		const midSize = `${fmtInt(midN)} variables, ${fmtInt(2 * midN)} arrows`;
		const sets = timed(node, cli(['plan', 'sets', mid, '--json']), dir, quick ? 1 : 3);
		const s = JSON.parse(sets.stdout) as { sets: unknown[]; max: number; truncated: boolean };
		rows.push({ what: 'plan sets (default cap)', size: midSize, wall: fmtMs(sets.wall), CPU: fmtCpu(sets.cpu), result: `${s.sets.length} sets, cap ${s.max}, truncated ${s.truncated}; target < 20 s` });
		const claims = await runPiped(node, cli(['diagram', 'claims', mid, ...(quick ? ['--max', '100000'] : [])]), dir);
		rows.push({ what: `diagram claims${quick ? ' --max 100000' : ' (all)'} through a pipe`, size: midSize, wall: fmtMs(claims.wall), CPU: fmtCpu(claims.cpu), result: `${fmtInt(claims.lines ?? 0)} lines, ${fmtBytes(claims.bytes)}` });
		const roles = timed(node, cli(['plan', 'roles', mid]), dir, 1);
		rows.push({ what: 'plan roles (all variables)', size: midSize, wall: fmtMs(roles.wall), CPU: fmtCpu(roles.cpu), result: `exit ${roles.status}` });
		if (!quick) {
			const roles10 = timed(node, cli(['plan', 'roles', ten]), dir, 1);
			rows.push({ what: 'plan roles (all variables)', size: '10,000 variables, 20,000 arrows', wall: fmtMs(roles10.wall), CPU: fmtCpu(roles10.cpu), result: `exit ${roles10.status}` });
		}
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
	const load = fmtLoad;
	notes.push(
		`Each figure is one whole process: node bin/causeway.js (the esbuild bundle in dist-cli) or /usr/bin/python3 bench/nx_dsep_file.py; wall time, and CPU time (user + system) from /usr/bin/time; medians where more than one run. ` +
			`Load average (1, 5, 15 min) before: ${load(loadBefore)}; after: ${load(loadavg())} — on a loaded 2-core machine wall time includes waiting for a core, so the CPU ratio is the steadier one.`
	);
	return { title: 'cli. The command line in pipelines (whole processes)', rows, note: notes.join(' ') };
}
