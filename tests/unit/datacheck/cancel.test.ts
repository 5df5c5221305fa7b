// Cancelling the data checks at every stage: the pipeline stops with Cancelled when asked
// between checks (arrows, claims, estimates, confounder candidates) and inside long loops
// (cross-products, ranks, logistic iterations), leaving the shared statistics usable. The data
// worker's side of a cancel is tested in tests/unit/workers/data-cancel.test.ts.
import { describe, expect, it } from 'vitest';
import { runDataChecks, type DataCheckProgress } from '../../../src/lib/datacheck';
import { Cancelled, interruptWhen, TableStatistics, type Table } from '../../../src/lib/stats';
import { Moments } from '../../../src/lib/stats/sufficient/moments';
import { demoCsv, simulateDemo } from '../../../scripts/simulate-demo';
import { demoDir, readDiagram, readTable, tableOf } from './helpers';

const diagram = readDiagram(`${demoDir}cycling-hypertension.causeway.json`);
const demo = readTable(`${demoDir}cycling-hypertension.csv`);

function cancelledRun(table: Table, when: (p: DataCheckProgress | null, polls: number) => boolean, statistics = new TableStatistics()): { error: unknown; polls: number; stages: string[] } {
	let polls = 0;
	let last: DataCheckProgress | null = null;
	const stages: string[] = [];
	try {
		runDataChecks(diagram, table, {
			statistics,
			onProgress: (p) => {
				last = p;
				if (stages.at(-1) !== p.stage) stages.push(p.stage);
			},
			isCancelled: () => when(last, ++polls)
		});
		return { error: null, polls, stages };
	} catch (e) {
		return { error: e, polls, stages };
	}
}

describe('the pipeline stops when cancelled', () => {
	it('at each stage: arrows, claims, estimates (and the confounder check after them)', () => {
		for (const stage of ['arrows', 'claims', 'estimates'] as const) {
			const r = cancelledRun(demo, (p) => p?.stage === stage && p.fraction > 0);
			expect(r.error).toBeInstanceOf(Cancelled);
			expect(r.stages.at(-1)).toBe(stage);
		}
		// The confounder check runs after the estimate rows: cancel at the last polls of a full run.
		const full = cancelledRun(demo, () => false);
		expect(full.error).toBeNull();
		const late = cancelledRun(demo, (_p, polls) => polls === full.polls - 1);
		expect(late.error).toBeInstanceOf(Cancelled);
	});

	it('at any poll of a run, and the shared statistics still give the uncancelled report afterwards', () => {
		const full = cancelledRun(demo, () => false);
		const step = Math.max(1, Math.floor(full.polls / 25));
		for (let k = 1; k < full.polls; k += step) expect(cancelledRun(demo, (_p, polls) => polls >= k).error).toBeInstanceOf(Cancelled);
		// One set of statistics cancelled again and again, then used to the end.
		const statistics = new TableStatistics();
		for (let k = 1; k < full.polls; k += step) cancelledRun(demo, (_p, polls) => polls >= k, statistics);
		const after = runDataChecks(diagram, demo, { statistics });
		const fresh = runDataChecks(diagram, demo);
		expect(after).toEqual(fresh);
	});

	it('inside long loops: a cross-product pass and a logistic fit poll as they go', () => {
		const table = tableOf(demoCsv(simulateDemo(60_000, 3)));
		const rows = Int32Array.from({ length: table.rowCount }, (_, i) => i);
		let polls = 0;
		const moments = new Moments(rows, interruptWhen(() => ++polls > 5));
		const vectors = table.columns.filter((c) => c.kind === 'continuous').map((c) => ({ kind: 'values' as const, values: c.kind === 'continuous' ? c.values : new Float64Array(0) }));
		expect(() => moments.matrix(vectors)).toThrow(Cancelled);
		expect(polls).toBe(6); // stopped in the middle of the pass (blocks of 2,048 rows: 30 polls in all)
		polls = -1e9; // no more cancelling: the pass is redone whole
		const again = moments.matrix(vectors);
		expect(again.every(Number.isFinite)).toBe(true);
		// A logistic fit on the rows polls once per iteration.
		const stats = new TableStatistics();
		let fitPolls = 0;
		stats.interrupt = interruptWhen(() => ++fitPolls > 1_000_000);
		const col = (name: string) => table.columns.find((c) => c.name === name) as Table['columns'][number];
		const plan = stats.plan(col('hypertension'), ['age', 'income', 'diet', 'bmi'].map(col));
		const before = fitPolls;
		const fit = stats.logistic(plan, [0, 1, 2, 3, 4]);
		expect(fitPolls - before).toBeGreaterThanOrEqual(fit.iterations + 1);
	});
});
