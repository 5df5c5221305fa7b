/**
 * Runs jobs on a Web Worker for the page: one job at a time, each with an id so that replies to
 * an older job are dropped; progress passed on; cancel and terminate; and, where a Worker cannot
 * be had (the constructor is missing or throws) or the caller asks for it (a small diagram),
 * the same step function run on the main thread through the same messages (job-server.ts).
 *
 * A worker is started on the first job and kept for the next ones (a worker may hold state, such
 * as the data worker's table). A newer job replaces a running one in one of two ways:
 * `supersede: 'terminate'` ends the worker (a synchronous computation cannot be interrupted
 * otherwise; the next job starts a fresh one) and `'queue'` sends the new job to the same worker,
 * whose running asynchronous step sees `isCancelled()` and stops.
 *
 * The analysis (three runners, one per part), the reviewer tools, the layout and the data
 * worker (one runner reading a file, one holding the table) are clients of this runner.
 */
import { JobServer } from './job-server';
import type { JobReply, JobRequest, JobSteps } from './job-protocol';

export type { JobContext, JobReply, JobRequest, JobSteps } from './job-protocol';

export type Where = 'main' | 'worker';

export interface JobEvents<P, R> {
	progress?(p: P): void;
	done(result: R, info: { where: Where; ms: number }): void;
	failed(message: string): void;
	/** The job stopped when cancelled; what it reported before stays. */
	cancelled?(): void;
}

export interface JobRunnerOptions<J, P, R> {
	/**
	 * Makes the step function for a fresh carrier (each worker, and the main thread's stand-in);
	 * state the worker keeps between jobs lives in its closure.
	 */
	steps: () => JobSteps<J, P, R>;
	/** Starts the worker. Missing or throwing (no Worker here): jobs run on the main thread. */
	createWorker?: () => Worker;
	supersede?: 'terminate' | 'queue';
	/** The failure message for a worker that crashed, given the browser's. */
	crashed?: (message: string) => string;
	/** Progress on the main thread is sent at most this often (a worker sets its own). */
	progressEveryMs?: number;
}

/** What the runner needs of a worker; the main thread's stand-in has the same shape. */
type Carrier = {
	postMessage(message: unknown): void;
	terminate(): void;
	onmessage: ((e: MessageEvent) => void) | null;
	onerror: ((e: ErrorEvent) => void) | null;
};

/** Serves jobs on the main thread with the worker's own server; synchronous steps answer at once. */
function localCarrier<J, P, R>(steps: JobSteps<J, P, R>, progressEveryMs: number | undefined): Carrier {
	let open = true;
	let lastId = 0;
	const carrier: Carrier = {
		onmessage: null,
		onerror: null,
		postMessage(message: unknown) {
			const request = message as JobRequest<J>;
			lastId = request.id;
			server.receive(request);
		},
		terminate() {
			// An asynchronous step still running is asked to stop; nothing it says is passed on.
			if (open) server.receive({ id: lastId, kind: 'cancel' });
			open = false;
		}
	};
	const server = new JobServer<J, P, R>(
		(reply) => {
			if (open) carrier.onmessage?.({ data: reply } as MessageEvent<JobReply<P, R>>);
		},
		steps,
		{ progressEveryMs }
	);
	return carrier;
}

export class JobRunner<J, P, R> {
	readonly #opts: JobRunnerOptions<J, P, R>;
	#worker: Carrier | null = null;
	#local: Carrier | null = null;
	#job: { id: number; events: JobEvents<P, R>; carrier: Carrier; where: Where } | null = null;
	#lastId = 0;
	#workerUnavailable = false;

	constructor(opts: JobRunnerOptions<J, P, R>) {
		this.#opts = opts;
	}

	/** True while a job has not answered with its result, failure or cancellation. */
	get busy(): boolean {
		return this.#job !== null;
	}

	/** Where the running job runs (null when idle). */
	get where(): Where | null {
		return this.#job?.where ?? null;
	}

	/**
	 * Starts `job`, replacing any running one (whose replies are dropped from now on). With
	 * `where: 'main'`, or without a worker, it runs on the main thread (a synchronous step has
	 * answered when this returns). Returns the job's id.
	 */
	run(job: J, events: JobEvents<P, R>, opts: { where?: Where } = {}): number {
		const running = this.#job;
		let carrier = opts.where === 'main' ? this.#ensureLocal() : this.#ensureWorker();
		if (running && (running.carrier !== carrier || this.#opts.supersede !== 'queue')) {
			this.#drop(running.carrier);
			if (carrier === running.carrier) carrier = opts.where === 'main' ? this.#ensureLocal() : this.#ensureWorker();
		}
		const id = ++this.#lastId;
		this.#job = { id, events, carrier, where: carrier === this.#local ? 'main' : 'worker' };
		const request: JobRequest<J> = { id, kind: 'run', job };
		carrier.postMessage(request);
		return id;
	}

	/**
	 * Stops the running job. With `supersede: 'queue'` the worker is asked and answers
	 * `cancelled` when its step has stopped (the worker and its state stay); otherwise the worker
	 * is terminated and `cancelled` reported at once. Returns false when nothing was running.
	 */
	cancel(): boolean {
		const job = this.#job;
		if (!job) return false;
		if (this.#opts.supersede === 'queue') {
			const request: JobRequest<J> = { id: job.id, kind: 'cancel' };
			job.carrier.postMessage(request);
		} else {
			this.#drop(job.carrier);
			job.events.cancelled?.();
		}
		return true;
	}

	/** Ends the worker and the running job (nothing more is reported for it). */
	terminate(): void {
		if (this.#worker) this.#drop(this.#worker);
		if (this.#local) this.#drop(this.#local);
		this.#job = null;
	}

	#drop(carrier: Carrier): void {
		carrier.terminate();
		if (carrier === this.#worker) this.#worker = null;
		if (carrier === this.#local) this.#local = null;
		if (this.#job?.carrier === carrier) this.#job = null;
	}

	#ensureWorker(): Carrier {
		if (this.#worker) return this.#worker;
		const create = this.#opts.createWorker;
		if (!create || this.#workerUnavailable) return this.#ensureLocal();
		let worker: Carrier;
		try {
			worker = create() as unknown as Carrier;
		} catch {
			// No Worker in this environment (or it refused to start): the main thread does the work.
			this.#workerUnavailable = true;
			return this.#ensureLocal();
		}
		this.#listen(worker);
		this.#worker = worker;
		return worker;
	}

	#ensureLocal(): Carrier {
		if (this.#local) return this.#local;
		const local = localCarrier(this.#opts.steps(), this.#opts.progressEveryMs);
		this.#listen(local);
		this.#local = local;
		return local;
	}

	#listen(carrier: Carrier): void {
		carrier.onmessage = (e: MessageEvent<JobReply<P, R>>) => this.#onReply(carrier, e.data);
		carrier.onerror = (e: ErrorEvent) => {
			const job = this.#job;
			this.#drop(carrier);
			const message = e.message || 'the worker failed';
			if (job?.carrier === carrier) job.events.failed(this.#opts.crashed ? this.#opts.crashed(message) : message);
		};
	}

	#onReply(carrier: Carrier, reply: JobReply<P, R>): void {
		const job = this.#job;
		if (!job || job.carrier !== carrier || reply.id !== job.id) return; // a stale job's message
		switch (reply.kind) {
			case 'progress':
				job.events.progress?.(reply.progress);
				break;
			case 'done':
				this.#job = null;
				job.events.done(reply.result, { where: job.where, ms: reply.ms });
				break;
			case 'failed':
				this.#job = null;
				job.events.failed(reply.message);
				break;
			case 'cancelled':
				this.#job = null;
				job.events.cancelled?.();
				break;
		}
	}
}

/**
 * Steps whose module is imported on the first job that needs them: the main-thread fallback's
 * code (the whole data side, dagre) then stays out of the page's first download (bench
 * section 6). A failed import is tried again on the next job.
 */
export function stepsOnDemand<J, P, R>(load: () => Promise<JobSteps<J, P, R>>): JobSteps<J, P, R> {
	let loading: Promise<JobSteps<J, P, R>> | null = null;
	return async (job, context) => {
		loading ??= load().catch((e: unknown) => {
			loading = null;
			throw e;
		});
		return (await loading)(job, context);
	};
}
