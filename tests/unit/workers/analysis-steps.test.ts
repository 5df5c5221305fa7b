/**
 * The app runs the analysis in three parts (verdict, sets, claims), each cached by what it
 * depends on; put together, they must be exactly what the engine façade's `analyse` returns
 * for the same diagram and limits, and each key must change when (and only when) its part can.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { analyse } from '../../../src/lib/causal';
import { analyseSets, analyseVerdict, analyseVerdictFirst, analysisKeys, combine, DEFAULT_LIMITS, listClaims, runAnalysis, type AppAnalysis } from '../../../src/lib/workers/analysis-steps';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { twoLadderArrows } from '../reference/two-ladders';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

function engineView(a: AppAnalysis) {
	const { claimsTruncated: _t, complete: _c, setsPending: _p, pathsPending: _pp, ...rest } = a;
	return rest;
}

const randomDag: fc.Arbitrary<Diagram> = fc
	.record({
		n: fc.integer({ min: 2, max: 9 }),
		edges: fc.array(fc.tuple(fc.nat(8), fc.nat(8)), { maxLength: 18 }),
		unmeasured: fc.array(fc.nat(8), { maxLength: 2 }),
		x: fc.nat(8),
		y: fc.nat(8),
		z: fc.array(fc.nat(8), { maxLength: 3 })
	})
	.map(({ n, edges, unmeasured, x, y, z }) => {
		const id = (i: number) => `v${i % n}`;
		const seen = new Set<string>();
		const arrows = edges
			.map(([a, b]) => [a % n, b % n].sort((p, q) => p - q))
			.filter(([a, b]) => a !== b && !seen.has(`${a},${b}`) && seen.add(`${a},${b}`))
			.map(([a, b]) => ({ from: id(a), to: id(b) }));
		const X = id(x);
		const Y = id(y) === X ? id(x + 1) : id(y);
		return {
			title: 'random',
			variables: Array.from({ length: n }, (_, i) => ({ id: id(i), label: `V${i}`, measured: !unmeasured.includes(i) })),
			arrows,
			exposures: [X],
			outcomes: X === Y ? [] : [Y],
			adjusted: [...new Set(z.map(id))].filter((v) => v !== X && v !== Y)
		};
	});

describe('stepwise analysis equals the engine façade', () => {
	it('on the demo study', () => {
		const steps = runAnalysis(demo, DEFAULT_LIMITS);
		expect(steps.complete).toBe(true);
		expect(engineView(steps)).toEqual(analyse(demo, DEFAULT_LIMITS));
	});

	it('on random small DAGs with a question and a planned set', () => {
		fc.assert(
			fc.property(randomDag, (d) => {
				expect(engineView(runAnalysis(d, DEFAULT_LIMITS))).toEqual(analyse(d, DEFAULT_LIMITS));
			}),
			{ numRuns: 200 }
		);
	});

	it('the verdict before the paths are counted is the same verdict; its count is exact or a lower bound', () => {
		fc.assert(
			fc.property(randomDag, (d) => {
				const first = analyseVerdictFirst(d);
				const full = analyseVerdict(d, DEFAULT_LIMITS);
				expect(first.ready).toBe(full.ready);
				expect(first.paths).toBeNull();
				if (!first.check || !full.check) return expect(first.check).toEqual(full.check);
				expect(first.check.valid).toBe(full.check.valid);
				const open = first.check.openPaths;
				if (open.bound === 'exact') expect(first.check).toEqual(full.check);
				else expect(open.count).toBeLessThanOrEqual(full.check.openPaths.count);
			}),
			{ numRuns: 300 }
		);
		// Past the first 50: 80 open back-door paths (x ← c_i → y), counted as "more than 50"
		// first, then exactly.
		const arrows = twoLadderArrows(50, 80, 47);
		const ids = [...new Set(arrows.flat())];
		const many: Diagram = { title: 'many', variables: ids.map((id) => ({ id, label: id, measured: true })), arrows: arrows.map(([from, to]) => ({ from, to })), exposures: ['x'], outcomes: ['y'], adjusted: [] };
		const first = analyseVerdictFirst(many).check!;
		const full = analyseVerdict(many, DEFAULT_LIMITS).check!;
		expect([first.valid, first.openPaths]).toEqual([false, { count: 50, bound: 'more-than' }]);
		expect([full.valid, full.openPaths]).toEqual([false, { count: 80, bound: 'exact' }]);
	});

	it('parts computed for another diagram are left out, as pending', () => {
		const edited: Diagram = { ...demo, arrows: demo.arrows.slice(1) };
		const a = combine(analyseVerdict(edited), null, null);
		expect(a.setsPending).toBe(true);
		expect(a.sets).toBeNull();
		expect(a.complete).toBe(false);
		expect(a.check).toEqual(runAnalysis(edited).check);
		const b = combine(analyseVerdict(edited), analyseSets(edited), listClaims(edited, DEFAULT_LIMITS.maxClaims));
		expect(b).toEqual(runAnalysis(edited));
	});

	it('keys: the planned set changes the verdict only; the question also the sets; measured and arrows everything', () => {
		const k = analysisKeys(demo);
		const planned = analysisKeys({ ...demo, adjusted: [...demo.adjusted, 'bmi'] });
		expect([planned.verdict !== k.verdict, planned.sets !== k.sets, planned.claims !== k.claims]).toEqual([true, false, false]);
		const question = analysisKeys({ ...demo, outcomes: ['fitness'] });
		expect([question.verdict !== k.verdict, question.sets !== k.sets, question.claims !== k.claims]).toEqual([true, true, false]);
		const measured = analysisKeys({ ...demo, variables: demo.variables.map((v, i) => (i === 0 ? { ...v, measured: !v.measured } : v)) });
		expect([measured.verdict !== k.verdict, measured.sets !== k.sets, measured.claims !== k.claims]).toEqual([true, true, true]);
		const moved = analysisKeys({ ...demo, title: 'x', variables: demo.variables.map((v) => ({ ...v, x: (v.x ?? 0) + 5, label: `${v.label}!` })) });
		expect(moved).toEqual(k);
	});

	it('cuts the claims at the limit and says so', () => {
		const a = runAnalysis(demo, { ...DEFAULT_LIMITS, maxClaims: 5 });
		expect(a.claims).toHaveLength(5);
		expect(a.claimsTruncated).toBe(true);
	});
});
