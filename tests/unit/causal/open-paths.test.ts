/**
 * The open non-causal paths (open-paths.ts) and the capped path listing (paths.ts) against the
 * brute-force oracle (tests/unit/reference/brute-force.ts: every simple path of the skeleton,
 * judged node by node by the d-separation rule, Pearl 1988). Counts must be equal exactly.
 *
 * Pruning (Read & Tarjan 1975 style): every branch the search enters leads to at least one
 * open non-causal path (no dead branch), so the branches entered are at most the interior
 * variables summed over the paths found — checked on every random diagram where the planned
 * set holds no descendant of an exposure (then every such path is a back-door path and the
 * completion test is exact; open-completion.ts says why the other case is a necessary
 * condition only, and the second test counts how often a dead branch occurs there).
 */
import { afterAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { openNonCausalPathsIdx } from '../../../src/lib/causal/open-paths';
import { listPathsIdx } from '../../../src/lib/causal/paths';
import { checkAdjustmentIdx } from '../../../src/lib/causal/adjustment';
import { descendantsOf } from '../../../src/lib/causal/reach';
import { isDirected, isOpenPath, listPathsOracle } from '../reference/brute-force';
import { randomAdjustmentQuery } from '../reference/random-dag';

const SEED = Number(process.env.CAUSEWAY_FC_SEED ?? 20261202);
const run = <T>(arb: fc.Arbitrary<T>, numRuns: number, check: (value: T) => void) =>
	fc.assert(
		fc.property(arb, (v) => {
			check(v);
		}),
		{ seed: SEED, numRuns }
	);
const show = (p: readonly number[]) => p.join('-');
let forwardCases = 0;
let forwardDead = 0;
afterAll(() => console.log(`open paths: Z holds a descendant of X in ${forwardCases} questions; a dead branch in ${forwardDead} of them`));

describe('open non-causal paths against every simple path (brute force)', () => {
	it('the same paths, counted exactly, on 1,000 random DAGs and planned sets', () => {
		run(randomAdjustmentQuery(), 1000, ({ dag, adjusted }) => {
			const { g, exposures: X, outcomes: Y } = dag;
			const Z = adjusted.filter((v) => !X.includes(v) && !Y.includes(v));
			const expected = listPathsOracle(g, X, Y, Z).filter((p) => p.open && !p.causal);
			const engine = openNonCausalPathsIdx(g, X, Y, Z, { keep: 1_000_000 });
			expect(engine.bound).toBe('exact');
			expect(engine.count).toBe(expected.length);
			expect(engine.paths.map(show).sort()).toEqual(expected.map((p) => show(p.nodes)).sort());
			const zSet = new Set(Z);
			for (const p of engine.paths) {
				expect(isOpenPath(g, p, zSet)).toBe(true);
				expect(isDirected(g, p)).toBe(false);
			}
			// No dead branch when every open non-causal path is a back-door path.
			const below = descendantsOf(g, X);
			if (Z.every((z) => !below[z])) {
				const interior = engine.paths.reduce((sum, p) => sum + p.length - 2, 0);
				expect(engine.deadBranches).toBe(0);
				expect(engine.branches).toBeLessThanOrEqual(interior);
			} else {
				forwardCases++;
				if (engine.deadBranches > 0) forwardDead++;
			}
			// The adjustment verdict counts with the same function.
			const check = checkAdjustmentIdx(g, X, Y, adjusted);
			expect(check.openPathCount).toEqual({ count: expected.length, bound: 'exact' });
		});
	});

	it('stops counting at the cap and says "more than"', () => {
		run(randomAdjustmentQuery({ minNodes: 6 }), 300, ({ dag, adjusted }) => {
			const { g, exposures: X, outcomes: Y } = dag;
			const Z = adjusted.filter((v) => !X.includes(v) && !Y.includes(v));
			const total = listPathsOracle(g, X, Y, Z).filter((p) => p.open && !p.causal).length;
			const engine = openNonCausalPathsIdx(g, X, Y, Z, { keep: 2, countCap: 3 });
			expect(engine.count).toBe(Math.min(total, 3));
			expect(engine.bound).toBe(total > 3 ? 'more-than' : 'exact');
			expect(engine.paths.length).toBe(Math.min(total, 2));
		});
	});
});

describe('the capped path listing', () => {
	it('returns min(max, number of paths) paths, open non-causal ones first (500 random DAGs)', () => {
		run(
			randomAdjustmentQuery().chain((q) => fc.record({ q: fc.constant(q), max: fc.integer({ min: 1, max: 12 }) })),
			500,
			({ q: { dag, adjusted }, max }) => {
				const { g, exposures: X, outcomes: Y } = dag;
				const Z = adjusted.filter((v) => !X.includes(v) && !Y.includes(v));
				const all = listPathsOracle(g, X, Y, Z);
				const openNonCausal = all.filter((p) => p.open && !p.causal).length;
				const engine = listPathsIdx(g, X, Y, adjusted, max);
				expect(engine.paths.length).toBe(Math.min(max, all.length));
				expect(engine.truncated).toBe(all.length > max);
				expect(engine.openNonCausal).toEqual({ count: openNonCausal, bound: 'exact' });
				const listedOpen = engine.paths.filter((p) => p.open && !p.causal).length;
				expect(listedOpen).toBe(Math.min(max, openNonCausal));
				const known = new Set(all.map((p) => show(p.nodes)));
				for (const p of engine.paths) expect(known.has(show(p.nodes))).toBe(true);
			}
		);
	});
});
