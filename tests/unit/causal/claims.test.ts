/**
 * The claims' fast separator (claims.ts: implicit moral graph, epoch-stamped marks, early
 * stop) against the construction it replaced: the close separator (separators.ts) of the
 * contracted moral graph of An({a, b}) (moral-graph.ts), after a d-separation test of
 * An({a, b}) ∩ R (van der Zander, Liśkiewicz & Textor 2019, Lemma 3.4). Both define the same
 * unique set, so the answers must be equal, pair by pair — on small random DAGs, and on larger
 * ones where the early stop and the reused marks matter. Minimality against brute force is
 * checked in properties.test.ts.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { CompiledDag } from '../../../src/lib/graph/compiled';
import { minimalMeasuredSeparator } from '../../../src/lib/causal/claims';
import { measuredSeparatorViaMoralGraph } from '../reference/moral-separator';
import { randomDag } from '../reference/random-dag';

function everyPairAgrees(g: CompiledDag): void {
	for (let a = 0; a < g.n; a++)
		for (let b = 0; b < g.n; b++) {
			if (a === b || !g.measured[a] || !g.measured[b]) continue;
			expect(minimalMeasuredSeparator(g, a, b), `pair ${g.ids[a]}, ${g.ids[b]}`).toEqual(measuredSeparatorViaMoralGraph(g, a, b));
		}
}

describe('minimalMeasuredSeparator', () => {
	it('equals the close separator of the contracted moral graph for every ordered pair (300 DAGs of 2–12 variables)', () => {
		fc.assert(
			fc.property(randomDag({ maxUnmeasuredPct: 50 }), (dag) => everyPairAgrees(dag.g)),
			{ numRuns: 300, seed: 20261202 }
		);
	});

	it('equals it on 20 larger DAGs (30–100 variables, up to 40 % unmeasured; ancestor rows used from 64)', () => {
		fc.assert(
			fc.property(randomDag({ minNodes: 30, maxNodes: 100, maxUnmeasuredPct: 40, maxMeanDegree: 4 }), (dag) => everyPairAgrees(dag.g)),
			{ numRuns: 20, seed: 7 }
		);
	});
});
