/**
 * The page's side of the data worker. Each file is read in a fresh worker; the worker
 * holding the current table is kept until the new file has been read, so a bad file or a
 * cancel leaves the earlier data (and the results shown from them) in place. Checks go to
 * the current worker; only the reply to the latest request is passed on.
 */
import type { Diagram } from '../graph/diagram';
import type { ParseProgress, TableError } from '../stats';
import type { DataCheckProgress, DataCheckReport, TableInfo } from '../datacheck';
import type { DataPart, DataReply, DataRequest, DataSource } from './data-protocol';

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

export class DataRunner {
	#events: DataRunnerEvents;
	#createWorker: () => Worker;
	#current: Worker | null = null;
	#loading: Worker | null = null;
	#loadId = 0;
	#checkId = 0;
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
		const worker = this.#createWorker();
		const id = ++this.#loadId;
		this.#loading = worker;
		worker.onmessage = (e: MessageEvent<DataReply>) => {
			const reply = e.data;
			if (reply.id !== id || this.#loading !== worker) return;
			if (reply.kind === 'load-progress') this.#events.loadProgress(reply.progress);
			else if (reply.kind === 'loaded') {
				this.#loading = null;
				this.#current?.terminate();
				this.#current = worker;
				worker.onmessage = (m: MessageEvent<DataReply>) => this.#onCheckReply(m.data);
				this.#events.loaded(reply.info, reply.ms);
			} else if (reply.kind === 'load-failed') {
				this.#loading = null;
				worker.terminate();
				this.#events.loadFailed(reply.error);
			}
		};
		worker.onerror = (e: ErrorEvent) => {
			if (this.#loading !== worker) return;
			this.#loading = null;
			worker.terminate();
			this.#events.loadFailed({ message: `The file could not be read: ${e.message || 'the data worker failed'}` });
		};
		const request: DataRequest = { id, kind: 'load', source };
		worker.postMessage(request);
	}

	/** Stops reading a file; the data loaded before stay. Returns false when nothing was loading. */
	cancelLoad(): boolean {
		if (!this.#loading) return false;
		this.#loading.terminate();
		this.#loading = null;
		this.#loadId++;
		return true;
	}

	check(request: CheckRequest): void {
		if (!this.#current) return;
		const message: DataRequest = { id: ++this.#checkId, kind: 'check', ...request };
		this.#checking = true;
		this.#current.postMessage(message);
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
		const message: DataRequest = { id: this.#checkId, kind: 'cancel' };
		this.#current.postMessage(message);
		return true;
	}

	/** Forget the data (the worker and its table go). */
	clear(): void {
		this.cancelLoad();
		this.#current?.terminate();
		this.#current = null;
		this.#checkId++;
		this.#checking = false;
	}

	dispose(): void {
		this.clear();
	}

	#onCheckReply(reply: DataReply): void {
		if (reply.id !== this.#checkId) return; // superseded
		if (reply.kind === 'report' || reply.kind === 'check-failed' || reply.kind === 'check-cancelled') this.#checking = false;
		if (reply.kind === 'check-progress') this.#events.checkProgress(reply.progress);
		else if (reply.kind === 'partial') this.#events.partial(reply.report, reply.pending);
		else if (reply.kind === 'report') this.#events.report(reply.report, reply.ms);
		else if (reply.kind === 'check-failed') this.#events.checkFailed(reply.message);
		else if (reply.kind === 'check-cancelled') this.#events.checkCancelled?.();
	}
}
