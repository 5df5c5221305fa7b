/**
 * The app's runner for the reviewer tools (src/lib/workers/review-client.ts): small diagrams
 * on the main thread, large ones posted to a worker (a fake one here) whose progress and
 * result are relayed, stale replies ignored and a busy worker terminated when superseded.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { planRobustness, reviewAdjustment } from '../../../src/lib/causal';
import { ReviewRunner } from '../../../src/lib/workers/review-client';
import { runStress, type ReviewResult, type StressResult } from '../../../src/lib/workers/review-steps';
import { fakeWorkers } from './fake-worker';
import type { ReviewJob } from '../../../src/lib/workers/review-steps';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

describe('ReviewRunner', () => {
	it('runs small diagrams on the main thread with the façade’s answers', () => {
		const got: ReviewResult[] = [];
		const runner = new ReviewRunner<ReviewResult>({ done: (r) => got.push(r), progress: () => {}, failed: (m) => expect.fail(m) });
		runner.run({ kind: 'review', diagram: demo, stated: ['bmi'] });
		expect(got).toHaveLength(1);
		expect(got[0].review).toEqual(reviewAdjustment(demo, { adjusted: ['bmi'], maxSets: 300 }));
		expect(got[0].instruments?.map((i) => i.variable)).toEqual(['bikeability', 'distance']);
	});

	it('the stress test reports progress up to 1 and equals the façade', () => {
		const fractions: number[] = [];
		const r = runStress(demo, demo.adjusted, (f) => fractions.push(f));
		expect(fractions.at(-1)).toBe(1);
		expect(fractions.every((f, i) => i === 0 || f >= fractions[i - 1])).toBe(true);
		expect(r.robustness).toEqual(planRobustness(demo, { adjusted: demo.adjusted, maxWitnesses: 300 }));
	});

	it('large diagrams go to the worker; progress and the latest result are relayed, stale ones dropped', () => {
		const { workers, create } = fakeWorkers<ReviewJob, number, ReviewResult | StressResult>();
		const done: StressResult[] = [];
		const progress: number[] = [];
		const runner = new ReviewRunner<StressResult>(
			{ done: (r) => done.push(r), progress: (f) => progress.push(f), failed: (m) => expect.fail(m) },
			{ mainThreadVariables: 5, createWorker: create }
		);
		const d: Diagram = demo;
		runner.run({ kind: 'stress', diagram: d, stated: d.adjusted });
		expect(runner.busy).toBe(true);
		const first = workers[0];
		const firstId = first.runs[0].id;
		// A newer request terminates the busy worker and starts a fresh one.
		runner.run({ kind: 'stress', diagram: d, stated: [] });
		expect(first.terminated).toBe(true);
		const second = workers[1];
		const secondId = second.runs[0].id;
		second.reply({ id: firstId, kind: 'progress', progress: 0.9 });
		second.reply({ id: secondId, kind: 'progress', progress: 0.5 });
		const result = runStress(d, []);
		second.reply({ id: secondId, kind: 'done', result, ms: 1 });
		expect(progress).toEqual([0.5]);
		expect(done).toEqual([result]);
		expect(runner.busy).toBe(false);
	});
});
