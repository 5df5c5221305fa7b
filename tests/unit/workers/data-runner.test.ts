// The page's side of the data worker (src/lib/workers/data-client.ts), with fake workers:
// a new file is read in a fresh worker and the worker holding the current table is kept
// until the new file is read, so a bad file or a cancel never loses the earlier data; only
// the reply to the latest check is passed on.
import { describe, expect, it } from 'vitest';
import { DataRunner, type DataRunnerEvents } from '../../../src/lib/workers/data-client';
import type { DataJob, DataProgress, DataResult } from '../../../src/lib/workers/data-protocol';
import { fakeWorkers } from './fake-worker';
import type { DataCheckReport, TableInfo } from '../../../src/lib/datacheck';

const info = (name: string): TableInfo => ({ name, rowCount: 1, columns: [], skipped: [], format: { delimiter: ',', decimalComma: false, header: true }, notes: [] });

function setup() {
	const { workers, create } = fakeWorkers<DataJob, DataProgress, DataResult>();
	const log: string[] = [];
	const events: DataRunnerEvents = {
		loadProgress: () => log.push('progress'),
		loaded: (i) => log.push(`loaded ${i.name}`),
		loadFailed: (e) => log.push(`failed ${e.message}`),
		checkProgress: () => log.push('check-progress'),
		partial: (_r, pending) => log.push(`partial ${pending.join(',')}`),
		report: (r) => log.push(`report ${r.rowCount}`),
		checkFailed: (m) => log.push(`check-failed ${m}`)
	};
	const runner = new DataRunner(events, create);
	return { runner, workers, log };
}

const file = { kind: 'url' as const, url: '/x.csv', name: 'x.csv' };
const report = (rowCount: number) => ({ rowCount }) as DataCheckReport;

describe('DataRunner', () => {
	it('keeps the current worker when the next file fails, and checks go to the current one', () => {
		const { runner, workers, log } = setup();
		runner.load(file);
		workers[0].reply({ id: workers[0].lastRun.id, kind: 'done', result: { kind: 'loaded', info: info('good.csv') }, ms: 1 });
		runner.load({ ...file, name: 'bad.csv' });
		workers[1].reply({ id: workers[1].lastRun.id, kind: 'done', result: { kind: 'load-failed', error: { message: 'Row 3 has 3 fields', row: 3 } }, ms: 1 });
		expect(workers[0].terminated).toBe(false);
		expect(workers[1].terminated).toBe(true);
		expect(runner.hasData).toBe(true);
		runner.check({ diagram: { title: '', variables: [], arrows: [], exposures: [], outcomes: [], adjusted: [] } });
		expect(workers[0].lastRun.job.kind).toBe('check');
		expect(log).toEqual(['loaded good.csv', 'failed Row 3 has 3 fields']);
	});

	it('replaces the old worker only once the new file is read', () => {
		const { runner, workers } = setup();
		runner.load(file);
		workers[0].reply({ id: workers[0].lastRun.id, kind: 'done', result: { kind: 'loaded', info: info('a.csv') }, ms: 1 });
		runner.load(file);
		expect(workers[0].terminated).toBe(false);
		workers[1].reply({ id: workers[1].lastRun.id, kind: 'done', result: { kind: 'loaded', info: info('b.csv') }, ms: 1 });
		expect(workers[0].terminated).toBe(true);
	});

	it('cancel stops the read and keeps the earlier data', () => {
		const { runner, workers, log } = setup();
		runner.load(file);
		workers[0].reply({ id: workers[0].lastRun.id, kind: 'done', result: { kind: 'loaded', info: info('a.csv') }, ms: 1 });
		runner.load(file);
		expect(runner.cancelLoad()).toBe(true);
		expect(workers[1].terminated).toBe(true);
		workers[1].reply({ id: workers[1].lastRun.id, kind: 'done', result: { kind: 'loaded', info: info('late.csv') }, ms: 1 });
		expect(log).toEqual(['loaded a.csv']);
		expect(runner.hasData).toBe(true);
		expect(runner.cancelLoad()).toBe(false);
	});

	it('passes on only the replies to the latest check', () => {
		const { runner, workers, log } = setup();
		runner.load(file);
		workers[0].reply({ id: workers[0].lastRun.id, kind: 'done', result: { kind: 'loaded', info: info('a.csv') }, ms: 1 });
		const d = { title: '', variables: [], arrows: [], exposures: [], outcomes: [], adjusted: [] };
		runner.check({ diagram: d });
		runner.check({ diagram: d });
		const [first, second] = workers[0].runs.filter((m) => m.job.kind === 'check').map((m) => m.id);
		workers[0].reply({ id: first, kind: 'done', result: { kind: 'report', report: report(1) }, ms: 1 });
		workers[0].reply({ id: second, kind: 'progress', progress: { kind: 'partial', report: report(2), pending: ['claims'] } });
		workers[0].reply({ id: second, kind: 'done', result: { kind: 'report', report: report(2) }, ms: 1 });
		expect(log).toEqual(['loaded a.csv', 'partial claims', 'report 2']);
	});
});
