// Cancelling the data checks at every stage: the pipeline stops with Cancelled when asked
// between checks (arrows, claims, estimates, confounder candidates) and inside long loops
// (cross-products, ranks, logistic iterations), leaving the shared statistics usable; the data
// worker's runner answers a cancel at each part and lets a newer request replace a running one;
// the page's side sends the cancel and reports it. No wall-clock timing: the worker's clock and
// its pauses are driven by the test.
import { describe, expect, it } from 'vitest';
import { runDataChecks, type DataCheckProgress, type DataCheckReport } from '../../../src/lib/datacheck';
import { Cancelled, interruptWhen, TableStatistics, type Table } from '../../../src/lib/stats';
import { Moments } from '../../../src/lib/stats/sufficient/moments';
import { WorkerChecks } from '../../../src/lib/workers/data-checks';
import { DataRunner } from '../../../src/lib/workers/data-client';
import type { DataReply, DataRequest } from '../../../src/lib/workers/data-protocol';
import { demoCsv, simulateDemo } from '../../../scripts/simulate-demo';
import { demoDir, readDiagram, readTable, tableOf } from './helpers';

const diagram = readDiagram(`${demoDir}cycling-hypertension.causeway.json`);
const demo = readTable(`${demoDir}cycling-hypertension.csv`);

function cancelledRun(table: Table, when: (p: DataCheckProgress | null, polls: number) => boolean, statistics = new TableStatistics()): { error: unknown; polls: number; stages: string[] } {
	let polls = 0;
	let last: DataCheckProgress | null = null;
	const stages: string[] = [];
	try {
		runDataChecks(diagram, table, {
			statistics,
			onProgress: (p) => {
				last = p;
				if (stages.at(-1) !== p.stage) stages.push(p.stage);
			},
			isCancelled: () => when(last, ++polls)
		});
		return { error: null, polls, stages };
	} catch (e) {
		return { error: e, polls, stages };
	}
}

describe('the pipeline stops when cancelled', () => {
	it('at each stage: arrows, claims, estimates (and the confounder check after them)', () => {
		for (const stage of ['arrows', 'claims', 'estimates'] as const) {
			const r = cancelledRun(demo, (p) => p?.stage === stage && p.fraction > 0);
			expect(r.error).toBeInstanceOf(Cancelled);
			expect(r.stages.at(-1)).toBe(stage);
		}
		// The confounder check runs after the estimate rows: cancel at the last polls of a full run.
		const full = cancelledRun(demo, () => false);
		expect(full.error).toBeNull();
		const late = cancelledRun(demo, (_p, polls) => polls === full.polls - 1);
		expect(late.error).toBeInstanceOf(Cancelled);
	});

	it('at any poll of a run, and the shared statistics still give the uncancelled report afterwards', () => {
		const full = cancelledRun(demo, () => false);
		const step = Math.max(1, Math.floor(full.polls / 25));
		for (let k = 1; k < full.polls; k += step) expect(cancelledRun(demo, (_p, polls) => polls >= k).error).toBeInstanceOf(Cancelled);
		// One set of statistics cancelled again and again, then used to the end.
		const statistics = new TableStatistics();
		for (let k = 1; k < full.polls; k += step) cancelledRun(demo, (_p, polls) => polls >= k, statistics);
		const after = runDataChecks(diagram, demo, { statistics });
		const fresh = runDataChecks(diagram, demo);
		expect(after).toEqual(fresh);
	});

	it('inside long loops: a cross-product pass and a logistic fit poll as they go', () => {
		const table = tableOf(demoCsv(simulateDemo(60_000, 3)));
		const rows = Int32Array.from({ length: table.rowCount }, (_, i) => i);
		let polls = 0;
		const moments = new Moments(rows, interruptWhen(() => ++polls > 5));
		const vectors = table.columns.filter((c) => c.kind === 'continuous').map((c) => ({ kind: 'values' as const, values: c.kind === 'continuous' ? c.values : new Float64Array(0) }));
		expect(() => moments.matrix(vectors)).toThrow(Cancelled);
		expect(polls).toBe(6); // stopped in the middle of the pass (blocks of 2,048 rows: 30 polls in all)
		polls = -1e9; // no more cancelling: the pass is redone whole
		const again = moments.matrix(vectors);
		expect(again.every(Number.isFinite)).toBe(true);
		// A logistic fit on the rows polls once per iteration.
		const stats = new TableStatistics();
		let fitPolls = 0;
		stats.interrupt = interruptWhen(() => ++fitPolls > 1_000_000);
		const col = (name: string) => table.columns.find((c) => c.name === name) as Table['columns'][number];
		const plan = stats.plan(col('hypertension'), ['age', 'income', 'diet', 'bmi'].map(col));
		const before = fitPolls;
		const fit = stats.logistic(plan, [0, 1, 2, 3, 4]);
		expect(fitPolls - before).toBeGreaterThanOrEqual(fit.iterations + 1);
	});
});

/** A worker's checks driven by hand: a clock that moves 100 ms per reading, pauses released by the test. */
function workerChecks() {
	const replies: DataReply[] = [];
	const pauses: (() => void)[] = [];
	let clock = 0;
	const checks = new WorkerChecks(
		(r) => replies.push(r),
		() => new Promise<void>((resolve) => pauses.push(resolve)),
		() => (clock += 100),
		30
	);
	checks.setTable(demo);
	/** Releases pauses until `until` holds or the run ends (no pause left). */
	const release = async (until: () => boolean) => {
		for (let guard = 0; guard < 10_000 && !until(); guard++) {
			const next = pauses.shift();
			if (!next) {
				await new Promise((r) => setTimeout(r, 0)); // let a chain of awaits reach its next pause
				if (pauses.length === 0) return;
				continue;
			}
			next();
			await new Promise((r) => setTimeout(r, 0));
		}
	};
	return { checks, replies, release, kinds: (id: number) => replies.filter((r) => r.id === id).map((r) => r.kind) };
}

describe("the worker's checks answer a cancel", () => {
	const request = (id: number): Extract<DataRequest, { kind: 'check' }> => ({ id, kind: 'check', diagram });

	for (const [part, partials] of [
		['arrows', 0],
		['estimates', 1],
		['claims', 2]
	] as const)
		it(`while checking the ${part}`, async () => {
			const { checks, replies, release, kinds } = workerChecks();
			checks.check(request(1));
			await release(() => replies.filter((r) => r.kind === 'partial').length >= partials && replies.some((r) => r.kind === 'check-progress' && r.progress.stage === (part === 'claims' ? 'claims' : part)));
			checks.cancel(1);
			await release(() => replies.some((r) => r.kind === 'check-cancelled'));
			expect(kinds(1)).toContain('check-cancelled');
			expect(kinds(1)).not.toContain('report');
			expect(kinds(1).filter((k) => k === 'partial').length).toBe(partials);
		});

	it('a newer request replaces the running one, which stops; the newer one reports', async () => {
		const { checks, replies, release, kinds } = workerChecks();
		checks.check(request(1));
		await release(() => replies.length > 0);
		checks.check(request(2));
		await release(() => replies.some((r) => r.id === 2 && r.kind === 'report'));
		expect(kinds(1)).toContain('check-cancelled');
		expect(kinds(2).at(-1)).toBe('report');
		const report = replies.find((r) => r.id === 2 && r.kind === 'report') as Extract<DataReply, { kind: 'report' }>;
		expect(report.report.claims.tested).toBeGreaterThan(40);
	});

	it('uncancelled, the worker reports what runDataChecks gives', async () => {
		const { checks, replies, release } = workerChecks();
		checks.check(request(1));
		await release(() => replies.some((r) => r.kind === 'report'));
		expect(replies.filter((r) => r.kind !== 'check-progress').map((r) => r.kind)).toEqual(['partial', 'partial', 'report']);
		const report = (replies.find((r) => r.kind === 'report') as Extract<DataReply, { kind: 'report' }>).report;
		const direct: DataCheckReport = runDataChecks(diagram, demo, { settingProblems: 'note', pictures: true });
		expect(report).toEqual(direct);
	});
});

describe("the page's side sends the cancel", () => {
	it('cancelCheck posts a cancel for the running check and reports the answer; nothing to cancel otherwise', () => {
		const sent: DataRequest[] = [];
		let onmessage: ((e: MessageEvent<DataReply>) => void) | null = null;
		const worker = {
			postMessage: (m: DataRequest) => sent.push(m),
			terminate: () => {},
			set onmessage(f: (e: MessageEvent<DataReply>) => void) {
				onmessage = f;
			},
			onerror: null
		};
		const log: string[] = [];
		const runner = new DataRunner(
			{
				loadProgress: () => {},
				loaded: () => log.push('loaded'),
				loadFailed: () => {},
				checkProgress: () => {},
				partial: () => {},
				report: () => log.push('report'),
				checkFailed: () => {},
				checkCancelled: () => log.push('cancelled')
			},
			() => worker as unknown as Worker
		);
		const reply = (r: DataReply) => (onmessage as unknown as (e: MessageEvent<DataReply>) => void)({ data: r } as MessageEvent<DataReply>);
		runner.load({ kind: 'url', url: '/x.csv', name: 'x.csv' });
		reply({ id: 1, kind: 'loaded', info: { name: 'x.csv', rowCount: 1, columns: [], skipped: [], format: { delimiter: ',', decimalComma: false, header: true }, notes: [] }, ms: 1 });
		expect(runner.cancelCheck()).toBe(false);
		runner.check({ diagram });
		expect(runner.cancelCheck()).toBe(true);
		expect(sent.at(-1)).toEqual({ id: 1, kind: 'cancel' });
		reply({ id: 1, kind: 'check-cancelled' });
		expect(log).toEqual(['loaded', 'cancelled']);
		expect(runner.cancelCheck()).toBe(false);
	});
});
