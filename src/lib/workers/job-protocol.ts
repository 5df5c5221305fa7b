/**
 * The messages every worker job runner exchanges (job-runner.ts on the page, job-server.ts in
 * the worker), and the shape of a step function. Plain data: structured clone.
 */

export type JobRequest<J> = { id: number; kind: 'run'; job: J } | { id: number; kind: 'cancel' };

export type JobReply<P, R> =
	| { id: number; kind: 'progress'; progress: P }
	| { id: number; kind: 'done'; result: R; ms: number }
	| { id: number; kind: 'failed'; message: string }
	/** The job stopped when asked to (a cancel, or a newer job); what it reported before stays. */
	| { id: number; kind: 'cancelled' };

/** What a step function gets besides its job. */
export interface JobContext<P> {
	/** A progress report; sent at most every `progressEveryMs`, the rest dropped. */
	progress(p: P): void;
	/** A report that must arrive (a partial result): never dropped. */
	partial(p: P): void;
	/** True once the job has been cancelled or superseded; long asynchronous steps poll it. */
	isCancelled(): boolean;
	elapsedMs(): number;
}

/**
 * One family of jobs: computes a job's result, in a worker or, when there is none, on the main
 * thread. A step that stops because `isCancelled()` became true throws (any error).
 */
export type JobSteps<J, P, R> = (job: J, context: JobContext<P>) => R | Promise<R>;
