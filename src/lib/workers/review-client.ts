/**
 * Runs reviewer-tool jobs for the app: small diagrams on the main thread, larger ones in a
 * Web Worker with progress; a newer request supersedes an older one (a busy worker is
 * terminated, since a running computation cannot be interrupted), and cancel() stops it.
 */
import { runJob, type ReviewJob, type ReviewResult, type StressResult } from './review-steps';
import type { ReviewReply, ReviewRequest } from './review-protocol';

export interface ReviewRunnerEvents<R> {
	done(result: R, info: { where: 'main' | 'worker'; ms: number }): void;
	progress(fraction: number): void;
	failed(message: string): void;
}

export interface ReviewRunnerOptions {
	/** Diagrams up to this many variables run on the main thread. */
	mainThreadVariables?: number;
	createWorker?: () => Worker;
}

function defaultWorker(): Worker {
	return new Worker(new URL('./review.worker.ts', import.meta.url), { type: 'module' });
}

export class ReviewRunner<R extends ReviewResult | StressResult> {
	#events: ReviewRunnerEvents<R>;
	#mainLimit: number;
	#createWorker: () => Worker;
	#worker: Worker | null = null;
	#busy = false;
	#latest = 0;

	constructor(events: ReviewRunnerEvents<R>, opts: ReviewRunnerOptions = {}) {
		this.#events = events;
		this.#mainLimit = opts.mainThreadVariables ?? 30;
		this.#createWorker = opts.createWorker ?? defaultWorker;
	}

	usesWorker(job: ReviewJob): boolean {
		return job.diagram.variables.length > this.#mainLimit;
	}

	run(job: ReviewJob): void {
		const id = ++this.#latest;
		if (this.#busy) this.#stop();
		if (!this.usesWorker(job)) {
			const started = performance.now();
			try {
				const result = runJob(job) as R;
				this.#events.done(result, { where: 'main', ms: performance.now() - started });
			} catch (e) {
				this.#events.failed(e instanceof Error ? e.message : String(e));
			}
			return;
		}
		const worker = this.#ensureWorker();
		this.#busy = true;
		const request: ReviewRequest = { ...job, id };
		worker.postMessage(request);
	}

	cancel(): void {
		this.#latest++;
		this.#stop();
	}

	get busy(): boolean {
		return this.#busy;
	}

	dispose(): void {
		this.#stop();
	}

	#ensureWorker(): Worker {
		if (this.#worker) return this.#worker;
		const worker = this.#createWorker();
		worker.onmessage = (e: MessageEvent<ReviewReply>) => this.#onReply(e.data);
		worker.onerror = (e: ErrorEvent) => {
			this.#stop();
			this.#events.failed(`The reviewer tools stopped: ${e.message || 'the worker failed'}`);
		};
		this.#worker = worker;
		return worker;
	}

	#stop(): void {
		this.#worker?.terminate();
		this.#worker = null;
		this.#busy = false;
	}

	#onReply(reply: ReviewReply): void {
		if (reply.id !== this.#latest) return;
		if (reply.kind === 'progress') this.#events.progress(reply.fraction);
		else if (reply.kind === 'done') {
			this.#busy = false;
			this.#events.done(reply.result as R, { where: 'worker', ms: reply.ms });
		} else {
			this.#busy = false;
			this.#events.failed(reply.message);
		}
	}
}
