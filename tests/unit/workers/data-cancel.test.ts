// The data worker's side of a cancel: its session (src/lib/workers/data-steps.ts) served by the
// job server answers a cancel at each part and lets a newer request replace a running one; the
// page's side sends the cancel and reports it. No wall-clock timing: the worker's clock and its
// pauses are driven by the test.
import { describe, expect, it } from 'vitest';
import { runDataChecks, type DataCheckReport } from '../../../src/lib/datacheck';
import { DataSession } from '../../../src/lib/workers/data-steps';
import { DataRunner } from '../../../src/lib/workers/data-client';
import { JobServer } from '../../../src/lib/workers/job-server';
import type { JobReply } from '../../../src/lib/workers/job-protocol';
import type { DataJob, DataProgress, DataResult } from '../../../src/lib/workers/data-protocol';
import { demoDir, readDiagram, readTable } from '../datacheck/helpers';
import { fakeWorkers } from './fake-worker';

const diagram = readDiagram(`${demoDir}cycling-hypertension.causeway.json`);
const demo = readTable(`${demoDir}cycling-hypertension.csv`);

type Reply = JobReply<DataProgress, DataResult>;

/** What a reply is, in the old words: progress, partial, report, cancelled… */
function kindOf(r: Reply): string {
	if (r.kind === 'progress') return r.progress.kind;
	if (r.kind === 'done') return r.result.kind;
	return r.kind;
}

/** A worker's session driven by hand: a clock that moves 100 ms per reading, pauses released by the test. */
function workerSession() {
	const replies: Reply[] = [];
	const pauses: (() => void)[] = [];
	let clock = 0;
	const now = () => (clock += 100);
	const session = new DataSession({ pause: () => new Promise<void>((resolve) => pauses.push(resolve)), now, sliceMs: 30 });
	session.setTable(demo);
	const server = new JobServer<DataJob, DataProgress, DataResult>((r) => replies.push(r), session.steps, { progressEveryMs: 80, now });
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
	const check = (id: number) => server.receive({ id, kind: 'run', job: { kind: 'check', diagram } });
	const cancel = (id: number) => server.receive({ id, kind: 'cancel' });
	return { check, cancel, replies, release, kinds: (id: number) => replies.filter((r) => r.id === id).map(kindOf) };
}

describe("the worker's checks answer a cancel", () => {
	for (const [part, partials] of [
		['arrows', 0],
		['estimates', 1],
		['claims', 2]
	] as const)
		it(`while checking the ${part}`, async () => {
			const { check, cancel, replies, release, kinds } = workerSession();
			check(1);
			await release(
				() =>
					replies.filter((r) => kindOf(r) === 'partial').length >= partials &&
					replies.some((r) => r.kind === 'progress' && r.progress.kind === 'check-progress' && r.progress.progress.stage === part)
			);
			cancel(1);
			await release(() => replies.some((r) => r.kind === 'cancelled'));
			expect(kinds(1)).toContain('cancelled');
			expect(kinds(1)).not.toContain('report');
			expect(kinds(1).filter((k) => k === 'partial').length).toBe(partials);
		});

	it('a newer request replaces the running one, which stops; the newer one reports', async () => {
		const { check, replies, release, kinds } = workerSession();
		check(1);
		await release(() => replies.length > 0);
		check(2);
		await release(() => replies.some((r) => r.id === 2 && r.kind === 'done'));
		expect(kinds(1)).toContain('cancelled');
		expect(kinds(2).at(-1)).toBe('report');
		const done = replies.find((r) => r.id === 2 && r.kind === 'done') as Extract<Reply, { kind: 'done' }>;
		expect(done.result.kind === 'report' && done.result.report.claims.tested).toBeGreaterThan(40);
	});

	it('uncancelled, the worker reports what runDataChecks gives', async () => {
		const { check, replies, release } = workerSession();
		check(1);
		await release(() => replies.some((r) => r.kind === 'done'));
		expect(replies.map(kindOf).filter((k) => k !== 'check-progress')).toEqual(['partial', 'partial', 'report']);
		const done = replies.find((r) => r.kind === 'done') as Extract<Reply, { kind: 'done' }>;
		const direct: DataCheckReport = runDataChecks(diagram, demo, { settingProblems: 'note', pictures: true });
		expect(done.result).toEqual({ kind: 'report', report: direct });
	});

	it('a check before any data is loaded fails with a message', async () => {
		const replies: Reply[] = [];
		const server = new JobServer<DataJob, DataProgress, DataResult>((r) => replies.push(r), new DataSession().steps);
		server.receive({ id: 1, kind: 'run', job: { kind: 'check', diagram } });
		await new Promise((r) => setTimeout(r, 0));
		expect(replies).toEqual([{ id: 1, kind: 'failed', message: 'No data are loaded.' }]);
	});
});

describe("the page's side sends the cancel", () => {
	it('cancelCheck posts a cancel for the running check and reports the answer; nothing to cancel otherwise', () => {
		const { workers, create } = fakeWorkers<DataJob, DataProgress, DataResult>();
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
			create
		);
		runner.load({ kind: 'url', url: '/x.csv', name: 'x.csv' });
		const worker = workers[0];
		worker.reply({ id: worker.lastRun.id, kind: 'done', result: { kind: 'loaded', info: { name: 'x.csv', rowCount: 1, columns: [], skipped: [], format: { delimiter: ',', decimalComma: false, header: true }, notes: [] } }, ms: 1 });
		expect(runner.cancelCheck()).toBe(false);
		runner.check({ diagram });
		expect(runner.cancelCheck()).toBe(true);
		const id = worker.lastRun.id;
		expect(worker.sent.at(-1)).toEqual({ id, kind: 'cancel' });
		worker.reply({ id, kind: 'cancelled' });
		expect(log).toEqual(['loaded', 'cancelled']);
		expect(runner.cancelCheck()).toBe(false);
	});
});
