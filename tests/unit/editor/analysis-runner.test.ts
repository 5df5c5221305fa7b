// The page's side of the analysis workers (src/lib/workers/analysis-client.ts), with fake
// workers that compute a part only when the test says so: a planned-set edit asks for the
// verdict alone; a structural edit for all three parts, the sets and claims started once the
// verdict is back; replies from a stale run are dropped; cancel and retry; small diagrams
// stay on the main thread; nothing computed is ever sent back to a worker.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { AnalysisRunner } from '../../../src/lib/workers/analysis-client';
import { analyseSets, analyseVerdict, analyseVerdictFirst, DEFAULT_LIMITS, listClaims, runAnalysis, type AppAnalysis } from '../../../src/lib/workers/analysis-steps';
import type { PartRequest, WorkerReply } from '../../../src/lib/workers/protocol';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

class FakeWorker {
	onmessage: ((e: MessageEvent<WorkerReply>) => void) | null = null;
	onerror: ((e: ErrorEvent) => void) | null = null;
	sent: PartRequest[] = [];
	terminated = false;
	postMessage(m: PartRequest) {
		this.sent.push(m);
	}
	terminate() {
		this.terminated = true;
	}
	/** The verdict worker's first answer: the verdict before its paths are counted. */
	answerFirst() {
		const r = this.sent[this.sent.length - 1];
		this.onmessage?.({ data: { id: r.id, kind: 'first', ms: 1, part: 'verdict', value: analyseVerdictFirst(r.diagram) } } as MessageEvent<WorkerReply>);
	}
	/** Computes the last request as the real worker would and replies. */
	answer() {
		const r = this.sent[this.sent.length - 1];
		const reply: WorkerReply =
			r.part === 'verdict'
				? { id: r.id, kind: 'done', ms: 1, part: 'verdict', value: analyseVerdict(r.diagram, r.limits) }
				: r.part === 'sets'
					? { id: r.id, kind: 'done', ms: 1, part: 'sets', value: analyseSets(r.diagram, r.limits) }
					: { id: r.id, kind: 'done', ms: 1, part: 'claims', value: listClaims(r.diagram, r.limits.maxClaims) };
		this.onmessage?.({ data: reply } as MessageEvent<WorkerReply>);
	}
}

function setup(mainThreadVariables = 0) {
	const workers: FakeWorker[] = [];
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
			createWorker: () => {
				const w = new FakeWorker();
				workers.push(w);
				return w as unknown as Worker;
			}
		}
	);
	/** The live worker computing `part`, if any. */
	const worker = (part: PartRequest['part']) => workers.filter((w) => !w.terminated && w.sent.some((r) => r.part === part)).pop();
	const requests = (part: PartRequest['part']) => workers.flatMap((w) => w.sent).filter((r) => r.part === part).length;
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
		worker('verdict')!.answer();
		expect([requests('sets'), requests('claims')]).toEqual([1, 1]);
		expect(log.at(-2)).toBe('result worker busy sets-pending claims-pending');
		expect(results.at(-1)!.check).toEqual(runAnalysis(demo).check);
		worker('sets')!.answer();
		expect(log.at(-2)).toBe('result worker busy claims-pending');
		worker('claims')!.answer();
		expect(log.at(-1)).toBe('result worker');
		expect(results.at(-1)).toEqual(runAnalysis(demo, DEFAULT_LIMITS));
	});

	it('a planned-set edit asks for the verdict only, and keeps the sets and claims', () => {
		const { runner, results, worker, requests } = setup();
		runner.request(demo);
		for (const p of ['verdict', 'sets', 'claims'] as const) worker(p)!.answer();
		const edited = withPlanned(demo, ['age', 'income', 'diet', 'bmi']);
		expect(runner.request(edited)).toBe(true);
		expect([requests('verdict'), requests('sets'), requests('claims')]).toEqual([2, 1, 1]);
		worker('verdict')!.answer();
		expect(results.at(-1)).toEqual(runAnalysis(edited, DEFAULT_LIMITS));
		// Moving or renaming changes nothing the analysis depends on.
		expect(runner.request({ ...edited, variables: edited.variables.map((v) => ({ ...v, x: (v.x ?? 0) + 1 })) })).toBe(false);
	});

	it('a planned-set edit during the claims listing leaves the listing running', () => {
		const { runner, results, worker, workers } = setup();
		runner.request(demo);
		worker('verdict')!.answer();
		worker('sets')!.answer();
		const claims = worker('claims')!;
		const edited = withPlanned(demo, ['age', 'income', 'diet']);
		runner.request(edited);
		expect(claims.terminated).toBe(false);
		worker('verdict')!.answer();
		expect(results.at(-1)!.complete).toBe(false);
		claims.answer();
		expect(results.at(-1)).toEqual(runAnalysis(edited, DEFAULT_LIMITS));
		expect(workers.flatMap((w) => w.sent).every((r) => !('knownClaims' in r))).toBe(true);
	});

	it('a structural edit while the sets are computed replaces that worker; its late reply is dropped', () => {
		const { runner, results, worker, workers } = setup();
		runner.request(demo);
		worker('verdict')!.answer();
		const staleSets = worker('sets')!;
		const edited: Diagram = { ...demo, variables: demo.variables.map((v) => (v.id === 'diet' ? { ...v, measured: false } : v)) };
		runner.request(edited);
		expect(staleSets.terminated).toBe(true);
		const before = results.length;
		staleSets.answer(); // the terminated worker's reply arrives anyway
		expect(results.length).toBe(before);
		for (const p of ['verdict', 'sets', 'claims'] as const) worker(p)!.answer();
		expect(results.at(-1)).toEqual(runAnalysis(edited, DEFAULT_LIMITS));
		expect(workers.filter((w) => !w.terminated).length).toBe(3);
	});

	it('cancel stops the running parts and keeps what is done; retry computes only what is missing', () => {
		const { runner, log, worker, requests, results } = setup();
		runner.request(demo);
		worker('verdict')!.answer();
		runner.cancel();
		expect(log.at(-1)).toBe('cancelled');
		expect(runner.busy).toBe(false);
		runner.retry();
		expect([requests('verdict'), requests('sets'), requests('claims')]).toEqual([1, 2, 2]);
		worker('sets')!.answer();
		worker('claims')!.answer();
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
		worker('verdict')!.answer();
		expect(worker('sets')!.sent.at(-1)!.diagram).toBe(edited);
		worker('sets')!.answer();
		worker('claims')!.answer();
		expect(results.at(-1)).toEqual(runAnalysis(edited, DEFAULT_LIMITS));
	});

	it('the verdict is shown before its paths are counted; the count and listing complete it', () => {
		const { runner, results, worker, requests } = setup();
		// Nothing planned: the diagram's back-door paths are open, the verdict is "not sufficient".
		const none = withPlanned(demo, []);
		runner.request(none);
		worker('verdict')!.answerFirst();
		const first = results.at(-1)!;
		expect(first.pathsPending).toBe(true);
		expect(first.paths).toBeNull();
		expect(first.check!.valid).toBe(runAnalysis(none).check!.valid);
		expect(runner.busy).toBe(true);
		// The sets and claims start with the first answer.
		expect([requests('sets'), requests('claims')]).toEqual([1, 1]);
		worker('verdict')!.answer();
		expect(results.at(-1)!.pathsPending).toBe(false);
		expect(results.at(-1)!.check).toEqual(runAnalysis(none).check);
		worker('sets')!.answer();
		worker('claims')!.answer();
		expect(results.at(-1)).toEqual(runAnalysis(none, DEFAULT_LIMITS));
	});

	it('small diagrams run on the main thread, without a worker', () => {
		const { runner, workers, results, log } = setup(20);
		runner.request(demo);
		expect(workers).toHaveLength(0);
		expect(log).toEqual(['result main']);
		expect(results[0]).toEqual(runAnalysis(demo, DEFAULT_LIMITS));
	});
});
