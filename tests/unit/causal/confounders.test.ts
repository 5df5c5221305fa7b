/**
 * Confounders as VanderWeele & Shpitser (Ann Stat 2013) define them — pre-exposure members of
 * some minimal sufficient adjustment set — held to the by-definition oracle that tries every
 * subset of the pre-exposure variables of small random DAGs (brute-force.ts,
 * minimalPreExposureSetsOracle), on the fixed seed of tests/unit/fast-check-seed.ts. The roles
 * property test (properties.test.ts) checks the whole role list; here: membership, that each
 * witness is itself a minimal sufficient set containing the variable, that a starved search
 * (no budget, no listing) answers "undecided" rather than wrongly, and that the polynomial
 * steps and the bounded search settle every variable on larger diagrams without the listing.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import '../fast-check-seed';
import { confounderMembershipIdx } from '../../../src/lib/causal/confounders';
import { makeDag, randomDag } from '../reference/random-dag';
import { minimalPreExposureSetsOracle } from '../reference/brute-force';
import { createRandom } from '../../../src/lib/stats';

const key = (s: readonly number[]) => [...s].sort((a, b) => a - b).join(',');

describe('confounder membership against the by-definition oracle', () => {
	it('members, and one minimal sufficient set per member, on 600 random DAGs of 2–12 variables', () => {
		fc.assert(
			fc.property(randomDag(), (dag) => {
				const { g, exposures: X, outcomes: Y } = dag;
				const sets = minimalPreExposureSetsOracle(g, X, Y);
				const expected = new Set(sets.flat());
				const minimal = new Set(sets.map(key));
				const m = confounderMembershipIdx(g, X, Y);
				for (let v = 0; v < g.n; v++) {
					expect(m.member[v] === 1, `${g.ids[v]} in some minimal set`).toBe(expected.has(v));
					if (m.member[v]) {
						expect(m.witness[v]).toContain(v);
						expect(minimal.has(key(m.witness[v]!)), `witness of ${g.ids[v]} is minimal sufficient`).toBe(true);
					}
				}
			}),
			{ numRuns: 600 }
		);
	});

	it('with no search budget and no listing, every answer is right or marked undecided (300 random DAGs)', () => {
		fc.assert(
			fc.property(randomDag(), (dag) => {
				const { g, exposures: X, outcomes: Y } = dag;
				const expected = new Set(minimalPreExposureSetsOracle(g, X, Y).flat());
				const m = confounderMembershipIdx(g, X, Y, { searchBudget: 0, listingCap: 0 });
				for (let v = 0; v < g.n; v++) {
					if (m.undecided[v]) expect(m.member[v]).toBe(0);
					else expect(m.member[v] === 1, `${g.ids[v]} in some minimal set`).toBe(expected.has(v));
				}
			}),
			{ numRuns: 300 }
		);
	});

	it('banded diagrams like the app’s 300- and 1,000-variable test (arrows reach 25 ahead): every variable decided', () => {
		const rng = createRandom(20261204);
		for (const n of [300, 1000]) {
			const edges = new Map<string, [number, number]>();
			while (edges.size < 2 * n) {
				const a = Math.floor(rng.uniform() * n);
				const b = a + 1 + Math.floor(rng.uniform() * 25);
				if (b < n) edges.set(`${a}>${b}`, [a, b]);
			}
			const dag = makeDag(n, [...edges.values()], Array(n).fill(true), [100], [160]);
			const m = confounderMembershipIdx(dag.g, dag.exposures, dag.outcomes);
			expect(m.undecided.reduce((a, b) => a + b, 0), `n = ${n}`).toBe(0);
			expect(m.member.reduce((a, b) => a + b, 0), `n = ${n}: some confounders`).toBeGreaterThan(0);
		}
	});

	it('on seeded random DAGs of 50–2,000 variables (mean degree 4) the search settles every variable without the full listing', () => {
		const rng = createRandom(20260101);
		for (const n of [50, 200, 500, 2000]) {
			for (let rep = 0; rep < (n > 500 ? 1 : 4); rep++) {
				const order = Array.from({ length: n }, (_, i) => i);
				for (let i = n - 1; i > 0; i--) {
					const j = Math.floor(rng.uniform() * (i + 1));
					[order[i], order[j]] = [order[j], order[i]];
				}
				const edges: [number, number][] = [];
				for (let k = 0; k < 2 * n; k++) {
					const a = Math.floor(rng.uniform() * n);
					const b = Math.floor(rng.uniform() * n);
					if (a === b) continue;
					edges.push(order[a] < order[b] ? [a, b] : [b, a]);
				}
				const unique = [...new Map(edges.map((e) => [e.join('>'), e])).values()];
				const dag = makeDag(n, unique, Array(n).fill(true), [0], [1]);
				const m = confounderMembershipIdx(dag.g, dag.exposures, dag.outcomes);
				expect(m.settledByListing, `n = ${n}`).toBe(0);
				expect(m.undecided.reduce((a, b) => a + b, 0), `n = ${n}`).toBe(0);
			}
		}
	});
});
