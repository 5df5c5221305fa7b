/**
 * The worker's end of a job runner (job-runner.ts): takes `run` and `cancel` messages, runs one
 * job at a time through the step function it was given, and answers with progress, the result,
 * the failure or the cancellation, each tagged with the job's id. Only the latest request runs:
 * a newer one marks the running job cancelled (an asynchronous step sees it at its next poll of
 * `isCancelled` and throws) and waits for it to stop. A synchronous step cannot be interrupted
 * from inside the worker; the page terminates such a worker instead.
 *
 * The same class serves jobs on the main thread when there is no worker (`localCarrier` in
 * job-runner.ts), so both paths run the same step functions with the same messages.
 */
import type { JobReply, JobRequest, JobContext, JobSteps } from './job-protocol';

type Running = { id: number; cancelled: boolean };

export interface JobServerOptions {
	/** Progress (not partial results) goes out at most this often. */
	progressEveryMs?: number;
	now?: () => number;
}

export class JobServer<J, P, R> {
	#running: Running | null = null;
	#queued: Extract<JobRequest<J>, { kind: 'run' }> | null = null;
	readonly #everyMs: number;
	readonly #now: () => number;

	constructor(
		private readonly post: (reply: JobReply<P, R>) => void,
		private readonly steps: JobSteps<J, P, R>,
		opts: JobServerOptions = {}
	) {
		this.#everyMs = opts.progressEveryMs ?? 100;
		this.#now = opts.now ?? (() => performance.now());
	}

	receive(request: JobRequest<J>): void {
		if (request.kind === 'cancel') {
			if (this.#running?.id === request.id) this.#running.cancelled = true;
			if (this.#queued?.id === request.id) {
				this.#queued = null;
				this.post({ id: request.id, kind: 'cancelled' });
			}
			return;
		}
		if (this.#running) this.#running.cancelled = true;
		const idle = this.#queued === null && this.#running === null;
		this.#queued = request;
		if (idle) this.#drain();
	}

	/** Runs the queued jobs; synchronous steps answer before this returns. */
	#drain(): void {
		while (this.#queued) {
			const request = this.#queued;
			this.#queued = null;
			const run: Running = { id: request.id, cancelled: false };
			this.#running = run;
			const started = this.#now();
			let lastProgress = -Infinity;
			const context: JobContext<P> = {
				progress: (p) => {
					const now = this.#now();
					if (now - lastProgress < this.#everyMs) return;
					lastProgress = now;
					this.post({ id: run.id, kind: 'progress', progress: p });
				},
				partial: (p) => this.post({ id: run.id, kind: 'progress', progress: p }),
				isCancelled: () => run.cancelled,
				elapsedMs: () => this.#now() - started
			};
			let outcome: R | Promise<R>;
			try {
				outcome = this.steps(request.job, context);
			} catch (e) {
				this.#running = null;
				this.#settleFailure(run, e);
				continue;
			}
			if (outcome instanceof Promise) {
				outcome.then(
					(result) => this.post({ id: run.id, kind: 'done', result, ms: context.elapsedMs() }),
					(e: unknown) => this.#settleFailure(run, e)
				).finally(() => {
					this.#running = null;
					this.#drain();
				});
				return;
			}
			this.#running = null;
			this.post({ id: run.id, kind: 'done', result: outcome, ms: context.elapsedMs() });
		}
	}

	/** A step that threw: a cancelled job answers `cancelled` (its step stopped when asked), any other `failed`. */
	#settleFailure(run: Running, e: unknown): void {
		if (run.cancelled) this.post({ id: run.id, kind: 'cancelled' });
		else this.post({ id: run.id, kind: 'failed', message: e instanceof Error ? e.message : String(e) });
	}
}

/** Serves jobs in a worker: call once at the top of a `*.worker.ts` module. */
export function serveJobs<J, P, R>(steps: JobSteps<J, P, R>, opts: JobServerOptions = {}): void {
	const scope = self as unknown as Worker;
	const server = new JobServer<J, P, R>((reply) => scope.postMessage(reply), steps, opts);
	scope.onmessage = (event: MessageEvent<JobRequest<J>>) => server.receive(event.data);
}
