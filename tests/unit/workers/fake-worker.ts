/**
 * A stand-in for a Web Worker in the job runner's tests: records what the page posts and
 * answers only when the test says so (`reply`, `crash`).
 */
import type { JobReply, JobRequest } from '../../../src/lib/workers/job-protocol';

export class FakeWorker<J, P = never, R = unknown> {
	onmessage: ((e: MessageEvent<JobReply<P, R>>) => void) | null = null;
	onerror: ((e: ErrorEvent) => void) | null = null;
	sent: JobRequest<J>[] = [];
	terminated = false;

	postMessage(m: JobRequest<J>): void {
		this.sent.push(m);
	}

	terminate(): void {
		this.terminated = true;
	}

	reply(r: JobReply<P, R>): void {
		this.onmessage?.({ data: r } as MessageEvent<JobReply<P, R>>);
	}

	crash(message: string): void {
		this.onerror?.({ message } as ErrorEvent);
	}

	/** The jobs posted to this worker, with their ids. */
	get runs(): { id: number; job: J }[] {
		return this.sent.flatMap((m) => (m.kind === 'run' ? [{ id: m.id, job: m.job }] : []));
	}

	get lastRun(): { id: number; job: J } {
		const run = this.runs.at(-1);
		if (!run) throw new Error('nothing was posted to this worker');
		return run;
	}
}

/** A `createWorker` that keeps every fake worker it made. */
export function fakeWorkers<J, P = never, R = unknown>(): { workers: FakeWorker<J, P, R>[]; create: () => Worker } {
	const workers: FakeWorker<J, P, R>[] = [];
	return {
		workers,
		create: () => {
			const w = new FakeWorker<J, P, R>();
			workers.push(w);
			return w as unknown as Worker;
		}
	};
}
