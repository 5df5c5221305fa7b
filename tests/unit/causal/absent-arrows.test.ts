/**
 * The absent arrows the adjustment depends on, held to the brute-force adjustment oracle
 * (tests/unit/reference/brute-force.ts: the adjustment criterion checked path by path): for
 * random small DAGs, an absent arrow is reported exactly when adding it makes the planned set
 * or a listed minimal set invalid by the oracle. Plus M-bias (Greenland 2003, from memory).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { criticalAbsentArrows } from '../../../src/lib/causal';
import { adjustmentSets, checkAdjustment } from '../../../src/lib/causal/analysis';
import { compileDag } from '../../../src/lib/graph/compiled';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { adjustmentOracle, descendantsOf } from '../reference/brute-force';
import { randomAdjustmentQuery } from '../reference/random-dag';
import { diagramOf as publishedDiagram, M_BIAS, renamed } from '../reference/published-diagrams';

function diagramOf(ids: readonly string[], edges: readonly (readonly [number, number])[], measured: readonly boolean[], X: readonly number[], Y: readonly number[], Z: readonly number[]): Diagram {
	return {
		title: '',
		variables: ids.map((id, i) => ({ id, label: id, measured: measured[i] })),
		arrows: edges.map(([a, b]) => ({ from: ids[a], to: ids[b] })),
		exposures: X.map((i) => ids[i]),
		outcomes: Y.map((i) => ids[i]),
		adjusted: Z.map((i) => ids[i])
	};
}

describe('absent arrows that the adjustment depends on', () => {
	it('M-bias (Greenland 2003): the empty set rests on the absence of arrows from the collider into exposure or outcome', () => {
		// X ← U1 → M ← U2 → Y, X → Y; U1, U2 unmeasured; planned set empty.
		const d = publishedDiagram(renamed(M_BIAS, { A: 'U1', B: 'U2' }), { unmeasured: ['U1', 'U2'] });
		const r = criticalAbsentArrows(d, adjustmentSets(d), checkAdjustment(d).valid);
		const pairs = r.items.map((i) => `${i.from}->${i.to}`);
		// M → Y opens X ← U1 → M → Y; M → X opens X ← M ← U2 → Y; U1 → Y and U2 → X are unmeasured confounding.
		for (const p of ['M->Y', 'M->X', 'U1->Y', 'U2->X']) expect(pairs).toContain(p);
		expect(r.items.every((i) => i.breaksPlanned)).toBe(true);
		expect(r.truncated).toBe(false);
	});

	it('agrees with the brute-force oracle on random DAGs', () => {
		fc.assert(
			fc.property(randomAdjustmentQuery({ maxNodes: 7, maxExposures: 1, maxOutcomes: 1 }), ({ dag, adjusted }) => {
				const d = diagramOf(dag.ids, dag.edges, dag.measured, dag.exposures, dag.outcomes, adjusted);
				const sets = adjustmentSets(d);
				const valid = checkAdjustment(d).valid;
				const got = criticalAbsentArrows(d, sets, valid);
				const expected: string[] = [];
				const idx = (ids: readonly string[]) => ids.map((id) => dag.ids.indexOf(id));
				for (let v = 0; v < dag.n; v++) {
					const below = descendantsOf(dag.g, v);
					for (let u = 0; u < dag.n; u++) {
						if (u === v || below.has(u) || dag.edges.some(([a, b]) => (a === u && b === v) || (a === v && b === u))) continue;
						const g2 = compileDag(dag.ids, [...d.arrows, { from: dag.ids[u], to: dag.ids[v] }], dag.measured);
						const oracle = adjustmentOracle(g2, dag.exposures, dag.outcomes);
						const breaksPlanned = valid && !oracle.isValid(adjusted);
						const breaksSet = sets.sets.some((s) => !oracle.isValid(idx(s)));
						if (breaksPlanned || breaksSet) expected.push(`${dag.ids[u]}->${dag.ids[v]}`);
					}
				}
				expect(got.items.map((i) => `${i.from}->${i.to}`).sort()).toEqual(expected.sort());
			}),
			{ numRuns: 150 }
		);
	});

	it('stops at its budget and says so', () => {
		const ids = Array.from({ length: 12 }, (_, i) => `v${i}`);
		const d: Diagram = {
			title: '',
			variables: ids.map((id) => ({ id, label: id, measured: true })),
			arrows: ids.slice(2).flatMap((id) => [{ from: id, to: 'v0' }, { from: id, to: 'v1' }]).concat([{ from: 'v0', to: 'v1' }]),
			exposures: ['v0'],
			outcomes: ['v1'],
			adjusted: ids.slice(2)
		};
		const r = criticalAbsentArrows(d, adjustmentSets(d), true, { budget: 10 });
		expect(r.truncated).toBe(true);
		expect(r.checked).toBeLessThan(r.candidates);
	});
});
