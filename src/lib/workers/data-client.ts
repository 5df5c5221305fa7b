/**
 * The page's side of the data worker, on two job runners (job-runner.ts). Each file is read in
 * a fresh worker; the runner holding the current table is kept until the new file has been
 * read, so a bad file or a cancel leaves the earlier data (and the results shown from them) in
 * place. Checks go to the current worker, a newer one queued behind the running one, which
 * stops at its next check; only the replies to the latest request are passed on. Without a
 * Worker the same data session runs on the main thread.
 */
import type { Diagram } from '../graph/diagram';
import type { ParseProgress, TableError } from '../stats';
import type { DataCheckProgress, DataCheckReport, TableInfo } from '../datacheck';
import { JobRunner, stepsOnDemand } from './job-runner';
import type { DataJob, DataPart, DataProgress, DataResult, DataSource } from './data-protocol';

export interface DataRunnerEvents {
	loadProgress(p: ParseProgress): void;
	loaded(info: TableInfo, ms: number): void;
	loadFailed(error: TableError): void;
	checkProgress(p: DataCheckProgress): void;
	/** The report so far, while `pending` parts are still being computed. */
	partial(r: DataCheckReport, pending: DataPart[]): void;
	report(r: DataCheckReport, ms: number): void;
	checkFailed(message: string): void;
	/** The check asked to stop has stopped (the parts already shown stay). */
	checkCancelled?(): void;
}

/** The diagram carries its data settings (column links, kinds, levels): nothing else is sent. */
export interface CheckRequest {
	diagram: Diagram;
	planned?: string[];
}

function defaultWorker(): Worker {
	return new Worker(new URL('./data.worker.ts', import.meta.url), { type: 'module' });
}

type DataJobs = JobRunner<DataJob, DataProgress, DataResult>;

export class DataRunner {
	#events: DataRunnerEvents;
	#createWorker: () => Worker;
	/** The runner whose worker holds the current table. */
	#current: DataJobs | null = null;
	#loading: DataJobs | null = null;
	/** Whether the latest check has not answered with its report (or failure, or cancel) yet. */
	#checking = false;

	constructor(events: DataRunnerEvents, createWorker: () => Worker = defaultWorker) {
		this.#events = events;
		this.#createWorker = createWorker;
	}

	get loading(): boolean {
		return this.#loading !== null;
	}

	get hasData(): boolean {
		return this.#current !== null;
	}

	load(source: DataSource): void {
		this.#loading?.terminate();
		// Progress at most every 80 ms when the session runs on the main thread (the worker sets its own).
		const runner: DataJobs = new JobRunner({ steps: () => stepsOnDemand(async () => new (await import('./data-steps')).DataSession().steps), createWorker: this.#createWorker, supersede: 'queue', progressEveryMs: 80 });
		this.#loading = runner;
		const failed = (error: TableError) => {
			this.#loading = null;
			runner.terminate();
			this.#events.loadFailed(error);
		};
		runner.run(
			{ kind: 'load', source },
			{
				progress: (p) => {
					if (p.kind === 'load-progress') this.#events.loadProgress(p.progress);
				},
				done: (result, { ms }) => {
					if (result.kind === 'load-failed') return failed(result.error);
					if (result.kind !== 'loaded') return;
					this.#loading = null;
					this.#current?.terminate();
					this.#current = runner;
					this.#events.loaded(result.info, ms);
				},
				failed: (message) => failed({ message: `The file could not be read: ${message}` })
			}
		);
	}

	/** Stops reading a file; the data loaded before stay. Returns false when nothing was loading. */
	cancelLoad(): boolean {
		if (!this.#loading) return false;
		this.#loading.terminate();
		this.#loading = null;
		return true;
	}

	check(request: CheckRequest): void {
		if (!this.#current) return;
		this.#checking = true;
		const settled = () => (this.#checking = false);
		this.#current.run(
			{ kind: 'check', ...request },
			{
				progress: (p) => {
					if (p.kind === 'check-progress') this.#events.checkProgress(p.progress);
					else if (p.kind === 'partial') this.#events.partial(p.report, p.pending);
				},
				done: (result, { ms }) => {
					settled();
					if (result.kind === 'report') this.#events.report(result.report, ms);
				},
				failed: (message) => {
					settled();
					this.#events.checkFailed(message);
				},
				cancelled: () => {
					settled();
					this.#events.checkCancelled?.();
				}
			}
		);
	}

	get checking(): boolean {
		return this.#checking;
	}

	/**
	 * Stops the running checks at the next check (or inside a long one); the parts already
	 * reported stay. Returns false when no check is running.
	 */
	cancelCheck(): boolean {
		if (!this.#current || !this.#checking) return false;
		return this.#current.cancel();
	}

	/** Forget the data (the worker and its table go). */
	clear(): void {
		this.cancelLoad();
		this.#current?.terminate();
		this.#current = null;
		this.#checking = false;
	}

	dispose(): void {
		this.clear();
	}
}
