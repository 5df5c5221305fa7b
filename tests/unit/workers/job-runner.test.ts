// The worker job runner (src/lib/workers/job-runner.ts) with fake workers, and its worker end
// (job-server.ts): a reply to an older job is dropped, cancel stops a job (by terminating the
// worker, or by asking an asynchronous step), without a Worker the same step runs on the main
// thread, failures and crashes are passed on with their message, progress is relayed and
// thinned out by the server while partial results always arrive.
import { describe, expect, it } from 'vitest';
import { JobRunner, type JobEvents, type JobSteps } from '../../../src/lib/workers/job-runner';
import { JobServer } from '../../../src/lib/workers/job-server';
import type { JobReply } from '../../../src/lib/workers/job-protocol';
import { fakeWorkers } from './fake-worker';

/** Squares a number, reporting progress 0.5 on the way; fails on negative numbers. */
const square: JobSteps<number, number, number> = (n, context) => {
	if (n < 0) throw new Error(`cannot square ${n} here`);
	context.progress(0.5);
	return n * n;
};

function recorder(): { log: string[]; events: JobEvents<number, number> } {
	const log: string[] = [];
	return {
		log,
		events: {
			progress: (p) => log.push(`progress ${p}`),
			done: (r, info) => log.push(`done ${r} ${info.where}`),
			failed: (m) => log.push(`failed ${m}`),
			cancelled: () => log.push('cancelled')
		}
	};
}

describe('JobRunner', () => {
	it('drops the replies of a job that a newer one replaced', () => {
		const { workers, create } = fakeWorkers<number, number, number>();
		const runner = new JobRunner({ steps: () => square, createWorker: create });
		const { log, events } = recorder();
		const first = runner.run(3, events);
		const second = runner.run(4, events);
		// The busy worker was terminated; the new job went to a fresh one.
		expect(workers).toHaveLength(2);
		expect(workers[0].terminated).toBe(true);
		workers[0].reply({ id: first, kind: 'done', result: 9, ms: 1 });
		workers[1].reply({ id: first, kind: 'done', result: 9, ms: 1 });
		expect(log).toEqual([]);
		workers[1].reply({ id: second, kind: 'done', result: 16, ms: 1 });
		expect(log).toEqual(['done 16 worker']);
		// After its answer a job's late messages are dropped too.
		workers[1].reply({ id: second, kind: 'progress', progress: 0.9 });
		expect(log).toEqual(['done 16 worker']);
		expect(runner.busy).toBe(false);
	});

	it("with supersede 'queue', a newer job goes to the same worker and the older one's replies are dropped", () => {
		const { workers, create } = fakeWorkers<number, number, number>();
		const runner = new JobRunner({ steps: () => square, createWorker: create, supersede: 'queue' });
		const { log, events } = recorder();
		const first = runner.run(3, events);
		const second = runner.run(4, events);
		expect(workers).toHaveLength(1);
		expect(workers[0].terminated).toBe(false);
		workers[0].reply({ id: first, kind: 'cancelled' });
		workers[0].reply({ id: second, kind: 'done', result: 16, ms: 1 });
		expect(log).toEqual(['done 16 worker']);
	});

	it('cancel terminates a worker whose steps cannot be interrupted, and says so at once', () => {
		const { workers, create } = fakeWorkers<number, number, number>();
		const runner = new JobRunner({ steps: () => square, createWorker: create });
		const { log, events } = recorder();
		expect(runner.cancel()).toBe(false);
		const id = runner.run(3, events);
		expect(runner.cancel()).toBe(true);
		expect(workers[0].terminated).toBe(true);
		expect(log).toEqual(['cancelled']);
		workers[0].reply({ id, kind: 'done', result: 9, ms: 1 });
		expect(log).toEqual(['cancelled']);
		expect(runner.busy).toBe(false);
		// The next job starts a fresh worker.
		runner.run(5, events);
		expect(workers).toHaveLength(2);
	});

	it("cancel asks the worker when its steps poll (supersede 'queue'), and reports the worker's answer", () => {
		const { workers, create } = fakeWorkers<number, number, number>();
		const runner = new JobRunner({ steps: () => square, createWorker: create, supersede: 'queue' });
		const { log, events } = recorder();
		const id = runner.run(3, events);
		expect(runner.cancel()).toBe(true);
		expect(workers[0].sent.at(-1)).toEqual({ id, kind: 'cancel' });
		expect(workers[0].terminated).toBe(false);
		expect(log).toEqual([]);
		workers[0].reply({ id, kind: 'cancelled' });
		expect(log).toEqual(['cancelled']);
	});

	it('terminate ends the worker and the job without a word', () => {
		const { workers, create } = fakeWorkers<number, number, number>();
		const runner = new JobRunner({ steps: () => square, createWorker: create });
		const { log, events } = recorder();
		const id = runner.run(3, events);
		runner.terminate();
		workers[0].reply({ id, kind: 'done', result: 9, ms: 1 });
		expect(workers[0].terminated).toBe(true);
		expect(log).toEqual([]);
	});

	it('runs the same steps on the main thread when there is no Worker, or when asked', () => {
		const noWorker = () => {
			throw new ReferenceError('Worker is not defined');
		};
		let made = 0;
		const runner = new JobRunner({ steps: () => (made++, square), createWorker: noWorker });
		const { log, events } = recorder();
		runner.run(3, events);
		// A synchronous step has answered when run() returns.
		expect(log).toEqual(['progress 0.5', 'done 9 main']);
		runner.run(-2, events);
		expect(log.at(-1)).toBe('failed cannot square -2 here');
		expect(made).toBe(1); // one main-thread session, kept like a worker
		const { workers, create } = fakeWorkers<number, number, number>();
		const both = new JobRunner({ steps: () => square, createWorker: create });
		both.run(6, events, { where: 'main' });
		expect(workers).toHaveLength(0);
		expect(log.at(-1)).toBe('done 36 main');
		expect(new JobRunner({ steps: () => square }).run(7, events)).toBe(1);
		expect(log.at(-1)).toBe('done 49 main');
	});

	it("passes on a step's failure and a worker's crash with their messages", () => {
		const { workers, create } = fakeWorkers<number, number, number>();
		const runner = new JobRunner({ steps: () => square, createWorker: create, crashed: (m) => `The squaring stopped: ${m}` });
		const { log, events } = recorder();
		const id = runner.run(-1, events);
		workers[0].reply({ id, kind: 'failed', message: 'cannot square -1 here' });
		expect(log).toEqual(['failed cannot square -1 here']);
		runner.run(2, events);
		workers[0].crash('out of memory');
		expect(log.at(-1)).toBe('failed The squaring stopped: out of memory');
		expect(workers[0].terminated).toBe(true);
		runner.run(2, events);
		workers[1].crash('');
		expect(log.at(-1)).toBe('failed The squaring stopped: the worker failed');
	});

	it("relays the running job's progress, only its own", () => {
		const { workers, create } = fakeWorkers<number, number, number>();
		const runner = new JobRunner({ steps: () => square, createWorker: create, supersede: 'queue' });
		const { log, events } = recorder();
		const first = runner.run(3, events);
		workers[0].reply({ id: first, kind: 'progress', progress: 0.25 });
		const second = runner.run(4, events);
		workers[0].reply({ id: first, kind: 'progress', progress: 0.5 });
		workers[0].reply({ id: second, kind: 'progress', progress: 0.75 });
		expect(log).toEqual(['progress 0.25', 'progress 0.75']);
		expect(runner.busy).toBe(true);
	});
});

describe('JobServer (the worker end)', () => {
	it('thins out progress to one per interval; partial results always go out', () => {
		let clock = 0;
		const replies: JobReply<number, string>[] = [];
		const steps: JobSteps<null, number, string> = (_job, context) => {
			for (let k = 1; k <= 10; k++) {
				clock += 30;
				context.progress(k);
			}
			context.partial(-1);
			return 'ok';
		};
		const server = new JobServer(
			(r: JobReply<number, string>) => replies.push(r),
			steps,
			{ progressEveryMs: 100, now: () => clock }
		);
		server.receive({ id: 7, kind: 'run', job: null });
		const progress = replies.flatMap((r) => (r.kind === 'progress' ? [r.progress] : []));
		// At 30, 60, …, 300 ms: the first report, then one each time 100 ms have passed.
		expect(progress).toEqual([1, 5, 9, -1]);
		expect(replies.at(-1)).toEqual({ id: 7, kind: 'done', result: 'ok', ms: 300 });
	});

	it('a job cancelled while waiting behind a running one answers cancelled and never runs', async () => {
		const ran: number[] = [];
		let release: () => void = () => {};
		const steps: JobSteps<number, never, number> = async (n, context) => {
			ran.push(n);
			await new Promise<void>((r) => (release = r));
			if (context.isCancelled()) throw new Error('stopped');
			return n;
		};
		const replies: JobReply<never, number>[] = [];
		const server = new JobServer((r: JobReply<never, number>) => replies.push(r), steps);
		server.receive({ id: 1, kind: 'run', job: 1 });
		server.receive({ id: 2, kind: 'run', job: 2 });
		server.receive({ id: 2, kind: 'cancel' });
		release();
		await new Promise((r) => setTimeout(r, 0));
		expect(ran).toEqual([1]);
		expect(replies.map((r) => `${r.id} ${r.kind}`)).toEqual(['2 cancelled', '1 cancelled']);
	});
});
