/**
 * The data worker: reads a CSV/TSV file as a stream (src/lib/stats/table) with progress,
 * keeps the parsed table (typed arrays; never sent back to the page) and its shared
 * statistics, and runs the data checks (src/lib/datacheck, through data-checks.ts) on it for
 * each diagram the page sends, stopping when asked (a cancel, or a newer diagram). The page
 * loads each new file in a fresh worker and keeps the old one until the new file is read,
 * so a bad file or a cancel leaves the earlier data and results in place.
 */
import { expandGroupedTable, parseTableStream, StatsError, suggestCountColumn, type ParseResult, type TableSource } from '../stats';
import { blobBytes, isParquetMagic, parseParquet } from '../stats/table/read-parquet';
import { countColumnHint } from '../wording/warehouse';
import { describeTable } from '../datacheck';
import type { DataReply, DataRequest } from './data-protocol';
import { WorkerChecks } from './data-checks';

const post = (reply: DataReply) => (self as unknown as Worker).postMessage(reply);


async function load(id: number, request: Extract<DataRequest, { kind: 'load' }>): Promise<void> {
	const started = performance.now();
	let source: TableSource;
	let name: string;
	let totalBytes: number | undefined;
	if (request.source.kind === 'file') {
		source = request.source.file;
		name = request.source.file.name;
	} else {
		name = request.source.name;
		const response = await fetch(request.source.url);
		if (!response.ok || !response.body) {
			post({ id, kind: 'load-failed', error: { message: `Could not fetch ${name} (HTTP ${response.status}).` } });
			return;
		}
		totalBytes = Number(response.headers.get('content-length')) || undefined;
		source = response.body;
	}
	let lastPost = 0;
	const parquet = request.source.kind === 'file' && (await isParquetFile(request.source.file));
	const result: ParseResult = parquet ? await parseParquet(blobBytes(source as File)) : await parseTableStream(source, {
		totalBytes,
		onProgress: (progress) => {
			const now = performance.now();
			if (now - lastPost > 80 || progress.fraction === 1) {
				lastPost = now;
				post({ id, kind: 'load-progress', progress });
			}
		}
	});
	if (!result.ok) {
		post({ id, kind: 'load-failed', error: result.error });
		return;
	}
	const count = request.source.kind === 'file' ? request.source.count : undefined;
	let table = result.table;
	if (count !== undefined) {
		try {
			table = expandGroupedTable(table, count);
		} catch (e) {
			if (!(e instanceof StatsError)) throw e;
			post({ id, kind: 'load-failed', error: { message: e.message, row: e.row, column: e.column } });
			return;
		}
	} else {
		const hint = suggestCountColumn(table);
		if (hint !== null) table = { ...table, notes: [...table.notes, countColumnHint(hint, 'app')] };
	}
	checks.setTable(table);
	post({ id, kind: 'loaded', info: describeTable(table, name), ms: performance.now() - started });
}

/** Parquet by its magic number ("PAR1"), whatever the file is called. */
async function isParquetFile(file: File): Promise<boolean> {
	return file.size >= 12 && isParquetMagic(new Uint8Array(await file.slice(0, 4).arrayBuffer()));
}

/**
 * Gives way to the worker's event loop (a message to itself, not a timer: timers in a loop are
 * clamped to 4 ms), so that a cancel message is taken between checks.
 */
function pause(): Promise<void> {
	return new Promise((resolve) => {
		const channel = new MessageChannel();
		channel.port1.onmessage = () => {
			channel.port1.close();
			resolve();
		};
		channel.port2.postMessage(null);
	});
}

const checks = new WorkerChecks(post, pause);

self.onmessage = (event: MessageEvent<DataRequest>) => {
	const request = event.data;
	if (request.kind === 'load') {
		void load(request.id, request).catch((e: unknown) =>
			post({ id: request.id, kind: 'load-failed', error: { message: `Could not read the file: ${e instanceof Error ? e.message : String(e)}` } })
		);
		return;
	}
	if (request.kind === 'cancel') checks.cancel(request.id);
	else checks.check(request);
};
