/**
 * Runs reviewer-tool jobs for the app on a job runner (job-runner.ts): small diagrams on the
 * main thread, larger ones in a Web Worker with progress; a newer request supersedes an older
 * one (a busy worker is terminated, since a running computation cannot be interrupted), and
 * cancel() stops it.
 */
import { JobRunner } from './job-runner';
import { reviewSteps, type ReviewJob, type ReviewResult, type StressResult } from './review-steps';

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
	#jobs: JobRunner<ReviewJob, number, ReviewResult | StressResult>;

	constructor(events: ReviewRunnerEvents<R>, opts: ReviewRunnerOptions = {}) {
		this.#events = events;
		this.#mainLimit = opts.mainThreadVariables ?? 30;
		this.#jobs = new JobRunner({
			steps: () => reviewSteps,
			createWorker: opts.createWorker ?? defaultWorker,
			crashed: (message) => `The reviewer tools stopped: ${message}`
		});
	}

	usesWorker(job: ReviewJob): boolean {
		return job.diagram.variables.length > this.#mainLimit;
	}

	run(job: ReviewJob): void {
		this.#jobs.run(
			job,
			{
				progress: (fraction) => this.#events.progress(fraction),
				// The job's kind decides the result's type: a review job gives a ReviewResult.
				done: (result, info) => this.#events.done(result as R, info),
				failed: (message) => this.#events.failed(message)
			},
			{ where: this.usesWorker(job) ? 'worker' : 'main' }
		);
	}

	cancel(): void {
		this.#jobs.terminate();
	}

	get busy(): boolean {
		return this.#jobs.busy;
	}

	dispose(): void {
		this.#jobs.terminate();
	}
}
