/**
 * The data worker's checks (data.worker.ts wires this to the worker's messages; tests drive it
 * directly): runs the checks on the loaded table part by part — arrows, then estimates, then
 * claims (the slowest) — posting the report so far after each part. The checks give way to the
 * worker's event loop between checks (runDataChecksAsync), so a Cancel, or a newer check
 * request (an edit), is taken in between checks; inside a check, long loops poll the same flag.
 * A cancelled run answers `check-cancelled`; the statistics of the table (src/lib/stats/
 * sufficient) are kept for the next run.
 */
import { Cancelled, TableStatistics, type Table } from '../stats';
import { runDataChecksAsync, type DataCheckReport } from '../datacheck';
import type { DataPart, DataReply, DataRequest } from './data-protocol';

type CheckRequest = Extract<DataRequest, { kind: 'check' }>;

export class WorkerChecks {
	#table: Table | null = null;
	#statistics = new TableStatistics();
	#running: { id: number; cancelled: boolean } | null = null;
	#queued: CheckRequest | null = null;

	constructor(
		private readonly post: (reply: DataReply) => void,
		private readonly pause: () => Promise<void>,
		private readonly now: () => number = () => performance.now(),
		private readonly sliceMs = 30
	) {}

	get table(): Table | null {
		return this.#table;
	}

	setTable(table: Table): void {
		this.#table = table;
		this.#statistics = new TableStatistics();
	}

	/** Only the latest request is run; a run in progress is stopped at its next check. */
	check(request: CheckRequest): void {
		if (this.#running) this.#running.cancelled = true;
		const idle = this.#queued === null && this.#running === null;
		this.#queued = request;
		if (idle) void this.#next();
	}

	/** Stops the run (or the waiting request) with this id. */
	cancel(id: number): void {
		if (this.#running?.id === id) this.#running.cancelled = true;
		if (this.#queued?.id === id) {
			this.#queued = null;
			this.post({ id, kind: 'check-cancelled' });
		}
	}

	async #next(): Promise<void> {
		while (this.#queued) {
			const request = this.#queued;
			this.#queued = null;
			const run = { id: request.id, cancelled: false };
			this.#running = run;
			try {
				await this.#run(request, () => run.cancelled);
			} finally {
				this.#running = null;
			}
		}
	}

	async #run(request: CheckRequest, isCancelled: () => boolean): Promise<void> {
		const { id } = request;
		const table = this.#table;
		if (!table) {
			this.post({ id, kind: 'check-failed', message: 'No data are loaded.' });
			return;
		}
		const started = this.now();
		let lastPost = -Infinity;
		const order: DataPart[] = ['arrows', 'estimates', 'claims'];
		let report = null as DataCheckReport | null;
		try {
			for (const [k, part] of order.entries()) {
				// The diagram's data settings drive the checks; one the table cannot honour is left out with a note.
				const r = await runDataChecksAsync(request.diagram, table, {
					settingProblems: 'note',
					planned: request.planned,
					pictures: true,
					parts: { arrows: part === 'arrows', estimates: part === 'estimates', claims: part === 'claims' },
					statistics: this.#statistics,
					isCancelled,
					pause: this.pause,
					sliceMs: this.sliceMs,
					now: this.now,
					onProgress: (progress) => {
						const now = this.now();
						if (now - lastPost > 80) {
							lastPost = now;
							this.post({ id, kind: 'check-progress', progress });
						}
					}
				});
				if (report === null) report = r;
				else if (part === 'estimates') report = { ...report, estimates: r.estimates, estimatesMessage: r.estimatesMessage, confounders: r.confounders };
				else report = { ...report, claims: r.claims };
				const pending = order.slice(k + 1);
				if (pending.length > 0) this.post({ id, kind: 'partial', report, pending });
			}
			this.post({ id, kind: 'report', report: report as DataCheckReport, ms: this.now() - started });
		} catch (e) {
			if (e instanceof Cancelled) this.post({ id, kind: 'check-cancelled' });
			else this.post({ id, kind: 'check-failed', message: e instanceof Error ? e.message : String(e) });
		}
	}
}
