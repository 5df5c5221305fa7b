// The page's side of the analysis workers (src/lib/workers/analysis-client.ts), with fake
// workers that compute a part only when the test says so: a planned-set edit asks for the
// verdict alone; a structural edit for all three parts, the sets and claims started once the
// verdict is back; replies from a stale run are dropped; cancel and retry; small diagrams
// stay on the main thread; nothing computed is ever sent back to a worker.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { AnalysisRunner } from '../../../src/lib/workers/analysis-client';
import { analyseSets, analyseVerdict, analyseVerdictFirst, DEFAULT_LIMITS, listClaims, runAnalysis, type AppAnalysis } from '../../../src/lib/workers/analysis-steps';
import type { PartJob, PartProgress, PartResult } from '../../../src/lib/workers/protocol';
import { FakeWorker, fakeWorkers } from './fake-worker';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

type PartWorker = FakeWorker<PartJob, PartProgress, PartResult>;

/** The verdict worker's first answer: the verdict before its paths are counted. */
function answerFirst(w: PartWorker): void {
	const { id, job } = w.lastRun;
	w.reply({ id, kind: 'progress', progress: { kind: 'first', ms: 1, value: analyseVerdictFirst(job.diagram) } });
}

/** Computes the last request as the real worker would and replies. */
function answer(w: PartWorker): void {
	const { id, job } = w.lastRun;
	const result: PartResult =
		job.part === 'verdict'
			? { part: 'verdict', value: analyseVerdict(job.diagram, job.limits) }
			: job.part === 'sets'
				? { part: 'sets', value: analyseSets(job.diagram, job.limits) }
				: { part: 'claims', value: listClaims(job.diagram, job.limits.maxClaims) };
	w.reply({ id, kind: 'done', ms: 1, result });
}

function setup(mainThreadVariables = 0) {
	const { workers, create } = fakeWorkers<PartJob, PartProgress, PartResult>();
	const results: AppAnalysis[] = [];
	const log: string[] = [];
	const runner = new AnalysisRunner(
		{
			result: (a, info) => {
				results.push(a);
				log.push(`result ${info.where}${info.busy ? ' busy' : ''}${a.setsPending ? ' sets-pending' : ''}${a.complete ? '' : ' claims-pending'}`);
			},
			progress: (p) => log.push(`progress ${p.stage}`),
			failed: (m) => log.push(`failed ${m}`),
			cancelled: () => log.push('cancelled')
		},
		{
			mainThreadVariables,
			createWorker: create
		}
	);
	/** The live worker computing `part`, if any. */
	const worker = (part: PartJob['part']) => workers.filter((w) => !w.terminated && w.runs.some((r) => r.job.part === part)).pop();
	const requests = (part: PartJob['part']) => workers.flatMap((w) => w.runs).filter((r) => r.job.part === part).length;
	return { runner, workers, results, log, worker, requests };
}

const withPlanned = (d: Diagram, ids: string[]): Diagram => ({ ...d, adjusted: ids });

describe('AnalysisRunner', () => {
	it('shows the verdict first, then the sets, then the claims; the result equals the whole analysis', () => {
		const { runner, results, log, worker, requests } = setup();
		runner.request(demo);
		// The sets and claims wait for the verdict, so that it has the cores to itself.
		expect([requests('verdict'), requests('sets'), requests('claims')]).toEqual([1, 0, 0]);
		expect(runner.busy).toBe(true);
		answer(worker('verdict')!);
		expect([requests('sets'), requests('claims')]).toEqual([1, 1]);
		expect(log.at(-2)).toBe('result worker busy sets-pending claims-pending');
		expect(results.at(-1)!.check).toEqual(runAnalysis(demo).check);
		answer(worker('sets')!);
		expect(log.at(-2)).toBe('result worker busy claims-pending');
		answer(worker('claims')!);
		expect(log.at(-1)).toBe('result worker');
		expect(results.at(-1)).toEqual(runAnalysis(demo, DEFAULT_LIMITS));
	});

	it('a planned-set edit asks for the verdict only, and keeps the sets and claims', () => {
		const { runner, results, worker, requests } = setup();
		runner.request(demo);
		for (const p of ['verdict', 'sets', 'claims'] as const) answer(worker(p)!);
		const edited = withPlanned(demo, ['age', 'income', 'diet', 'bmi']);
		expect(runner.request(edited)).toBe(true);
		expect([requests('verdict'), requests('sets'), requests('claims')]).toEqual([2, 1, 1]);
		answer(worker('verdict')!);
		expect(results.at(-1)).toEqual(runAnalysis(edited, DEFAULT_LIMITS));
		// Moving or renaming changes nothing the analysis depends on.
		expect(runner.request({ ...edited, variables: edited.variables.map((v) => ({ ...v, x: (v.x ?? 0) + 1 })) })).toBe(false);
	});

	it('a planned-set edit during the claims listing leaves the listing running', () => {
		const { runner, results, worker, workers } = setup();
		runner.request(demo);
		answer(worker('verdict')!);
		answer(worker('sets')!);
		const claims = worker('claims')!;
		const edited = withPlanned(demo, ['age', 'income', 'diet']);
		runner.request(edited);
		expect(claims.terminated).toBe(false);
		answer(worker('verdict')!);
		expect(results.at(-1)!.complete).toBe(false);
		answer(claims);
		expect(results.at(-1)).toEqual(runAnalysis(edited, DEFAULT_LIMITS));
		expect(workers.flatMap((w) => w.runs).every((r) => !('knownClaims' in r.job))).toBe(true);
	});

	it('a structural edit while the sets are computed replaces that worker; its late reply is dropped', () => {
		const { runner, results, worker, workers } = setup();
		runner.request(demo);
		answer(worker('verdict')!);
		const staleSets = worker('sets')!;
		const edited: Diagram = { ...demo, variables: demo.variables.map((v) => (v.id === 'diet' ? { ...v, measured: false } : v)) };
		runner.request(edited);
		expect(staleSets.terminated).toBe(true);
		const before = results.length;
		answer(staleSets); // the terminated worker's reply arrives anyway
		expect(results.length).toBe(before);
		for (const p of ['verdict', 'sets', 'claims'] as const) answer(worker(p)!);
		expect(results.at(-1)).toEqual(runAnalysis(edited, DEFAULT_LIMITS));
		expect(workers.filter((w) => !w.terminated).length).toBe(3);
	});

	it('cancel stops the running parts and keeps what is done; retry computes only what is missing', () => {
		const { runner, log, worker, requests, results } = setup();
		runner.request(demo);
		answer(worker('verdict')!);
		runner.cancel();
		expect(log.at(-1)).toBe('cancelled');
		expect(runner.busy).toBe(false);
		runner.retry();
		expect([requests('verdict'), requests('sets'), requests('claims')]).toEqual([1, 2, 2]);
		answer(worker('sets')!);
		answer(worker('claims')!);
		expect(results.at(-1)).toEqual(runAnalysis(demo, DEFAULT_LIMITS));
	});

	it('an edit before the verdict is back drops the waiting parts of the earlier diagram', () => {
		const { runner, results, worker, requests } = setup();
		runner.request(demo);
		const first = worker('verdict')!;
		const edited: Diagram = { ...demo, variables: demo.variables.map((v) => (v.id === 'diet' ? { ...v, measured: false } : v)) };
		runner.request(edited);
		expect(first.terminated).toBe(true);
		expect([requests('sets'), requests('claims')]).toEqual([0, 0]);
		answer(worker('verdict')!);
		expect(worker('sets')!.lastRun.job.diagram).toBe(edited);
		answer(worker('sets')!);
		answer(worker('claims')!);
		expect(results.at(-1)).toEqual(runAnalysis(edited, DEFAULT_LIMITS));
	});

	it('the verdict is shown before its paths are counted; the count and listing complete it', () => {
		const { runner, results, worker, requests } = setup();
		// Nothing planned: the diagram's back-door paths are open, the verdict is "not sufficient".
		const none = withPlanned(demo, []);
		runner.request(none);
		answerFirst(worker('verdict')!);
		const first = results.at(-1)!;
		expect(first.pathsPending).toBe(true);
		expect(first.paths).toBeNull();
		expect(first.check!.valid).toBe(runAnalysis(none).check!.valid);
		expect(runner.busy).toBe(true);
		// The sets and claims start with the first answer.
		expect([requests('sets'), requests('claims')]).toEqual([1, 1]);
		answer(worker('verdict')!);
		expect(results.at(-1)!.pathsPending).toBe(false);
		expect(results.at(-1)!.check).toEqual(runAnalysis(none).check);
		answer(worker('sets')!);
		answer(worker('claims')!);
		expect(results.at(-1)).toEqual(runAnalysis(none, DEFAULT_LIMITS));
	});

	it('small diagrams run on the main thread, without a worker', () => {
		const { runner, workers, results, log } = setup(20);
		runner.request(demo);
		expect(workers).toHaveLength(0);
		expect(log).toEqual(['result main']);
		expect(results[0]).toEqual(runAnalysis(demo, DEFAULT_LIMITS));
	});

	it('without a Worker, a large diagram runs the same parts on the main thread', () => {
		const results: AppAnalysis[] = [];
		const where: string[] = [];
		const runner = new AnalysisRunner(
			{ result: (a, info) => (results.push(a), where.push(info.where)), progress: () => {}, failed: (m) => expect.fail(m), cancelled: () => {} },
			{
				mainThreadVariables: 0,
				createWorker: () => {
					throw new ReferenceError('Worker is not defined');
				}
			}
		);
		runner.request(demo);
		expect(runner.busy).toBe(false);
		expect(new Set(where)).toEqual(new Set(['main']));
		expect(results.at(-1)).toEqual(runAnalysis(demo, DEFAULT_LIMITS));
	});
});
