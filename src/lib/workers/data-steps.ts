/**
 * The data worker's steps (job-runner.ts): `load` reads a CSV/TSV file as a stream
 * (src/lib/stats/table) with progress, or a Parquet file whole (stats/table/read-parquet.ts),
 * expands a grouped table by its count column when asked (stats/table/grouped.ts), and keeps the parsed table (typed arrays; never sent back
 * to the page) and its shared statistics; `check` runs the data checks (src/lib/datacheck) on it
 * part by part — arrows, then estimates, then claims (the slowest) — sending the report so far
 * after each part. The checks give way to the event loop between checks (runDataChecksAsync), so
 * a Cancel, or a newer check (an edit), is taken in between; inside a check, long loops poll the
 * same flag. A cancelled run throws `Cancelled` and the job server answers `cancelled`; the
 * statistics of the table (src/lib/stats/sufficient) are kept for the next run.
 *
 * One session per worker (data.worker.ts); without a Worker the page runs a session itself.
 */
import { expandGroupedTable, parseTableStream, StatsError, suggestCountColumn, TableStatistics, type ParseResult, type Table, type TableSource } from '../stats';
import { blobBytes, isParquetMagic } from '../stats/table/parquet-bytes';
import { countColumnHint } from '../wording/warehouse';
import { describeTable, runDataChecksAsync, type DataCheckReport } from '../datacheck';
import type { JobContext, JobSteps } from './job-protocol';
import type { DataJob, DataPart, DataProgress, DataResult } from './data-protocol';

type CheckJob = Extract<DataJob, { kind: 'check' }>;
type LoadJob = Extract<DataJob, { kind: 'load' }>;

/**
 * Gives way to the event loop (a message to itself, not a timer: timers in a loop are clamped
 * to 4 ms), so that a cancel message is taken between checks.
 */
export function pause(): Promise<void> {
	return new Promise((resolve) => {
		const channel = new MessageChannel();
		channel.port1.onmessage = () => {
			channel.port1.close();
			resolve();
		};
		channel.port2.postMessage(null);
	});
}

export interface DataSessionOptions {
	pause?: () => Promise<void>;
	now?: () => number;
	/** The checks run this long between two pauses. */
	sliceMs?: number;
}

export class DataSession {
	#table: Table | null = null;
	#statistics = new TableStatistics();
	readonly #pause: () => Promise<void>;
	readonly #now: () => number;
	readonly #sliceMs: number;

	constructor(opts: DataSessionOptions = {}) {
		this.#pause = opts.pause ?? pause;
		this.#now = opts.now ?? (() => performance.now());
		this.#sliceMs = opts.sliceMs ?? 30;
	}

	get table(): Table | null {
		return this.#table;
	}

	setTable(table: Table): void {
		this.#table = table;
		this.#statistics = new TableStatistics();
	}

	readonly steps: JobSteps<DataJob, DataProgress, DataResult> = (job, context) => (job.kind === 'load' ? this.#load(job, context) : this.#check(job, context));

	async #load(job: LoadJob, context: JobContext<DataProgress>): Promise<DataResult> {
		let source: TableSource;
		let name: string;
		let totalBytes: number | undefined;
		if (job.source.kind === 'file') {
			source = job.source.file;
			name = job.source.file.name;
		} else {
			name = job.source.name;
			const response = await fetch(job.source.url);
			if (!response.ok || !response.body) return { kind: 'load-failed', error: { message: `Could not fetch ${name} (HTTP ${response.status}).` } };
			totalBytes = Number(response.headers.get('content-length')) || undefined;
			source = response.body;
		}
		const parquet = job.source.kind === 'file' && (await isParquetFile(job.source.file));
		const result: ParseResult = parquet
			? await (await import('../stats/table/read-parquet')).parseParquet(blobBytes(source as File))
			: await parseTableStream(source, {
					totalBytes,
					// The last report (the whole file read) always arrives.
					onProgress: (progress) => (progress.fraction === 1 ? context.partial : context.progress)({ kind: 'load-progress', progress })
				});
		if (!result.ok) return { kind: 'load-failed', error: result.error };
		const count = job.source.kind === 'file' ? job.source.count : undefined;
		let table = result.table;
		if (count !== undefined) {
			try {
				table = expandGroupedTable(table, count);
			} catch (e) {
				if (!(e instanceof StatsError)) throw e;
				return { kind: 'load-failed', error: { message: e.message, row: e.row, column: e.column } };
			}
		} else {
			const hint = suggestCountColumn(table);
			if (hint !== null) table = { ...table, notes: [...table.notes, countColumnHint(hint, 'app')] };
		}
		this.setTable(table);
		return { kind: 'loaded', info: describeTable(table, name) };
	}

	async #check(job: CheckJob, context: JobContext<DataProgress>): Promise<DataResult> {
		const table = this.#table;
		if (!table) throw new Error('No data are loaded.');
		const order: DataPart[] = ['arrows', 'estimates', 'claims'];
		let report = null as DataCheckReport | null;
		for (const [k, part] of order.entries()) {
			// The diagram's data settings drive the checks; one the table cannot honour is left out with a note.
			const r = await runDataChecksAsync(job.diagram, table, {
				settingProblems: 'note',
				planned: job.planned,
				pictures: true,
				parts: { arrows: part === 'arrows', estimates: part === 'estimates', claims: part === 'claims' },
				statistics: this.#statistics,
				isCancelled: context.isCancelled,
				pause: this.#pause,
				sliceMs: this.#sliceMs,
				now: this.#now,
				onProgress: (progress) => context.progress({ kind: 'check-progress', progress })
			});
			if (report === null) report = r;
			else if (part === 'estimates') report = { ...report, estimates: r.estimates, estimatesMessage: r.estimatesMessage, confounders: r.confounders };
			else report = { ...report, claims: r.claims };
			const pending = order.slice(k + 1);
			if (pending.length > 0) context.partial({ kind: 'partial', report, pending });
		}
		return { kind: 'report', report: report as DataCheckReport };
	}
}

/** Parquet by its magic number ("PAR1"), whatever the file is called. */
async function isParquetFile(file: File): Promise<boolean> {
	return file.size >= 12 && isParquetMagic(new Uint8Array(await file.slice(0, 4).arrayBuffer()));
}
