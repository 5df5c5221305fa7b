/**
 * The data worker: reads a CSV/TSV file as a stream (PapaParse, src/lib/stats/table) with
 * progress, keeps the parsed table (typed arrays; never sent back to the page), and runs
 * the data checks (src/lib/datacheck) on it for each diagram the page sends. The page
 * loads each new file in a fresh worker and keeps the old one until the new file is read,
 * so a bad file or a cancel leaves the earlier data and results in place.
 */
import { parseTableStream, type Table, type TableSource } from '../stats';
import { describeTable, runDataChecks } from '../datacheck';
import type { DataCheckReport } from '../datacheck';
import type { DataPart, DataReply, DataRequest } from './data-protocol';

const post = (reply: DataReply) => (self as unknown as Worker).postMessage(reply);

let table: Table | null = null;
let queued: Extract<DataRequest, { kind: 'check' }> | null = null;

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
	const result = await parseTableStream(source, {
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
	table = result.table;
	post({ id, kind: 'loaded', info: describeTable(result.table, name), ms: performance.now() - started });
}

/**
 * Runs the checks part by part — arrows, then estimates, then claims (the slowest on large
 * tables) — posting the report so far after each part, so the page can show the quick
 * results while the claims are still being tested.
 */
function check(request: Extract<DataRequest, { kind: 'check' }>): void {
	const { id } = request;
	if (!table) {
		post({ id, kind: 'check-failed', message: 'No data are loaded.' });
		return;
	}
	const started = performance.now();
	let lastPost = 0;
	const order: DataPart[] = ['arrows', 'estimates', 'claims'];
	let report = null as DataCheckReport | null;
	try {
		for (const [k, part] of order.entries()) {
			// The diagram's data settings drive the checks; one the table cannot honour is left out with a note.
			const r = runDataChecks(request.diagram, table, {
				settingProblems: 'note',
				planned: request.planned,
				pictures: true,
				parts: { arrows: part === 'arrows', estimates: part === 'estimates', claims: part === 'claims' },
				onProgress: (progress) => {
					const now = performance.now();
					if (now - lastPost > 80) {
						lastPost = now;
						post({ id, kind: 'check-progress', progress });
					}
				}
			});
			if (report === null) report = r;
			else if (part === 'estimates') report = { ...report, estimates: r.estimates, estimatesMessage: r.estimatesMessage, confounders: r.confounders };
			else report = { ...report, claims: r.claims };
			const pending = order.slice(k + 1);
			if (pending.length > 0) post({ id, kind: 'partial', report, pending });
		}
		post({ id, kind: 'report', report: report as DataCheckReport, ms: performance.now() - started });
	} catch (e) {
		post({ id, kind: 'check-failed', message: e instanceof Error ? e.message : String(e) });
	}
}

self.onmessage = (event: MessageEvent<DataRequest>) => {
	const request = event.data;
	if (request.kind === 'load') {
		void load(request.id, request).catch((e: unknown) =>
			post({ id: request.id, kind: 'load-failed', error: { message: `Could not read the file: ${e instanceof Error ? e.message : String(e)}` } })
		);
		return;
	}
	// Checks: only the latest request waiting is run (edits come in bursts).
	const idle = queued === null;
	queued = request;
	if (idle)
		setTimeout(() => {
			const next = queued;
			queued = null;
			if (next) check(next);
		}, 0);
};
