/**
 * Property tests: the engine (src/lib/causal, index-based functions) against the brute-force
 * oracle (tests/unit/reference/brute-force.ts), which enumerates every simple path and every
 * subset straight from the published definitions: d-separation (Pearl 1988), the adjustment
 * criterion (Shpitser, VanderWeele & Robins, UAI 2010), the single-door criterion (Pearl,
 * Causality 2009, §5.3.1), the optimal set O (Henckel, Perković & Maathuis, JRSS-B 2022), and
 * the roles and claims as the engine's contract defines them.
 *
 * Random DAGs of 2–12 variables (random-dag.ts). Zero disagreements allowed. The seed is
 * fixed (override with CAUSEWAY_FC_SEED); on failure fast-check prints the seed, the replay
 * path and the shrunk counterexample (arrows by id, unmeasured variables, the question).
 */
import { afterAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dSeparated } from '../../../src/lib/causal/dsep';
import { checkAdjustmentIdx } from '../../../src/lib/causal/adjustment';
import {
	listMinimalAdjustmentSetsIdx,
	minimumAdjustmentSetIdx,
	optimalAdjustmentSetIdx
} from '../../../src/lib/causal/sets';
import { impliedClaimsIdx } from '../../../src/lib/causal/claims';
import { listPathsIdx } from '../../../src/lib/causal/paths';
import { variableRolesIdx } from '../../../src/lib/causal/roles';
import type { ForbiddenWhy } from '../../../src/lib/causal/types';
import {
	adjacent,
	adjustmentOracle,
	descendantsOf,
	directEffectOracle,
	findOpenPath,
	isDirected,
	isOpenPath,
	isSimplePathInSkeleton,
	listPathsOracle,
	optimalSetOracle,
	pairSeparation,
	rolesOracle
} from '../reference/brute-force';
import { randomAdjustmentQuery, randomDag, randomDsepQuery, type RandomDag } from '../reference/random-dag';

const SEED = Number(process.env.CAUSEWAY_FC_SEED ?? 20261202);
/** `max` large enough that no listing is cut short on graphs of ≤ 12 variables. */
const NO_CAP = 1_000_000;

/** Sizes covered, per property, printed once at the end. */
const covered = new Map<string, number[]>();
function note(property: string, dag: RandomDag): void {
	const list = covered.get(property) ?? [];
	list.push(dag.n);
	covered.set(property, list);
}
afterAll(() => {
	const lines = [...covered].map(([property, ns]) => {
		const counts = new Map<number, number>();
		for (const n of ns) counts.set(n, (counts.get(n) ?? 0) + 1);
		const hist = [...counts].sort((a, b) => a[0] - b[0]).map(([n, c]) => `${n}:${c}`).join(' ');
		return `  ${property}: ${ns.length} DAGs, n = ${Math.min(...ns)}..${Math.max(...ns)} (n:count ${hist})`;
	});
	console.log(`engine vs brute-force oracle (seed ${SEED}):\n${lines.join('\n')}`);
});

const run = <T>(arb: fc.Arbitrary<T>, numRuns: number, check: (value: T) => void) =>
	fc.assert(
		fc.property(arb, (v) => {
			check(v);
		}),
		{ seed: SEED, numRuns }
	);

const key = (set: readonly number[]) => [...set].sort((a, b) => a - b).join(',');
const family = (sets: readonly (readonly number[])[]) => sets.map(key).sort();

describe('d-separation (Pearl 1988) against path enumeration', () => {
	it('agrees on 2,000 random DAGs with random disjoint X, Y, Z; the witness is an open simple path', () => {
		run(randomDsepQuery(), 2000, ({ dag, from, to, given }) => {
			note('d-separation', dag);
			const engine = dSeparated(dag.g, from, to, given);
			const oracleOpen = findOpenPath(dag.g, from, to, given);
			expect(engine.separated).toBe(oracleOpen === null);
			if (engine.separated) {
				expect(engine.path).toBeNull();
			} else {
				const path = engine.path as number[];
				expect(path).not.toBeNull();
				expect(from).toContain(path[0]);
				expect(to).toContain(path[path.length - 1]);
				expect(isSimplePathInSkeleton(dag.g, path)).toBe(true);
				expect(isOpenPath(dag.g, path, new Set(given))).toBe(true);
			}
		});
	});

	it('refuses overlapping sets (200 random DAGs)', () => {
		run(randomDsepQuery(), 200, ({ dag, from, to, given }) => {
			expect(() => dSeparated(dag.g, from, to, [...given, from[0]])).toThrow();
			expect(() => dSeparated(dag.g, from, [...to, from[0]], given)).toThrow();
			expect(() => dSeparated(dag.g, from, to, [...given, to[0]])).toThrow();
		});
	});
});

/** Each `why` must be true of the variable (the contract names the kinds, not a precedence). */
function whyHolds(dag: RandomDag, o: ReturnType<typeof adjustmentOracle>, v: number, why: ForbiddenWhy): boolean {
	const { g, exposures: X, outcomes: Y } = dag;
	const inDe = (sources: Iterable<number>, proper: boolean) =>
		[...sources].some((s) => (!proper || s !== v) && descendantsOf(g, s).has(v));
	const mediators = [...o.causalNodes].filter((w) => !Y.includes(w));
	switch (why) {
		case 'exposure':
			return X.includes(v);
		case 'outcome':
			return Y.includes(v);
		case 'unmeasured':
			return g.measured[v] === 0;
		case 'mediator':
			return mediators.includes(v);
		case 'descendant-of-mediator':
			return inDe(mediators, true);
		case 'descendant-of-outcome':
			return inDe(Y, true);
		case 'descendant-of-exposure':
			return inDe(X, true);
	}
}

describe('adjustment criterion (Shpitser, VanderWeele & Robins 2010) against path-by-path checks', () => {
	it('agrees on validity, forbidden members and open paths for 1,000 random DAGs and sets', () => {
		run(randomAdjustmentQuery(), 1000, ({ dag, adjusted: Z }) => {
			note('adjustment validity', dag);
			const { g, exposures: X, outcomes: Y } = dag;
			const o = adjustmentOracle(g, X, Y);
			const engine = checkAdjustmentIdx(g, X, Y, Z);
			expect(engine.valid).toBe(o.isValid(Z));

			const offending = Z.filter((v) => X.includes(v) || Y.includes(v) || g.measured[v] === 0 || o.forbidden.has(v));
			expect(key([...new Set(engine.forbidden.map((f) => f.variable))])).toBe(key(offending));
			for (const f of engine.forbidden) expect(whyHolds(dag, o, f.variable, f.why), `${g.ids[f.variable]}: ${f.why}`).toBe(true);

			// Paths are judged given the usable part of Z (members in X or Y make the set invalid anyway).
			const zUsable = Z.filter((v) => !X.includes(v) && !Y.includes(v));
			const zSet = new Set(zUsable);
			const properNonCausal = new Set(o.properNonCausal.map((p) => p.join()));
			for (const p of engine.openPaths) {
				expect(properNonCausal.has(p.join()), `listed path ${p.join('-')} is a proper non-causal path`).toBe(true);
				expect(isOpenPath(g, p, zSet)).toBe(true);
			}
			// When Z has no forbidden member, open paths are reported exactly when some exist.
			if (engine.forbidden.length === 0) expect(engine.openPaths.length > 0).toBe(o.openPaths(zUsable).length > 0);
		});
	});
});

describe('adjustment sets against every subset', () => {
	it('total effect: the same minimal sets, minimum size and optimal set on 1,000 random DAGs', () => {
		run(randomDag(), 1000, (dag) => {
			note('minimal sets (total)', dag);
			const { g, exposures: X, outcomes: Y } = dag;
			const o = adjustmentOracle(g, X, Y);
			const expected = o.minimalSets();
			const engine = listMinimalAdjustmentSetsIdx(g, X, Y, { effect: 'total', max: NO_CAP });
			expect(engine.identifiable).toBe(expected.length > 0);
			expect(engine.truncated).toBe(false);
			for (const s of engine.sets) expect([...s]).toEqual([...s].sort((a, b) => a - b));
			expect(family(engine.sets)).toEqual(family(expected));

			const minimum = minimumAdjustmentSetIdx(g, X, Y, 'total');
			if (expected.length === 0) expect(minimum).toBeNull();
			else {
				expect(minimum).not.toBeNull();
				expect(o.isValid(minimum as number[])).toBe(true);
				expect((minimum as number[]).length).toBe(Math.min(...expected.map((s) => s.length)));
			}

			// O = pa(cn) \ forb (Henckel et al. 2022), returned exactly when measured and valid.
			const O = optimalSetOracle(g, X, Y);
			const oUsable = O.every((v) => g.measured[v] === 1) && o.isValid(O);
			const optimal = optimalAdjustmentSetIdx(g, X, Y);
			expect(optimal === null ? null : key(optimal)).toBe(oUsable ? key(O) : null);
		});
	});

	it('total effect: a listing capped at one set says it was cut short (300 random DAGs)', () => {
		run(randomDag(), 300, (dag) => {
			const { g, exposures: X, outcomes: Y } = dag;
			const all = family(adjustmentOracle(g, X, Y).minimalSets());
			const capped = listMinimalAdjustmentSetsIdx(g, X, Y, { max: 1 });
			expect(capped.sets.length).toBe(Math.min(1, all.length));
			expect(capped.truncated).toBe(all.length > 1);
			for (const s of capped.sets) expect(all).toContain(key(s));
		});
	});

	it('direct effect (single-door criterion): the same minimal sets and minimum size on 500 random DAGs', () => {
		run(randomDag({ maxExposures: 1, maxOutcomes: 1 }), 500, (dag) => {
			note('minimal sets (direct)', dag);
			const { g } = dag;
			const [x] = dag.exposures;
			const [y] = dag.outcomes;
			const o = directEffectOracle(g, x, y);
			const expected = o.minimalSets();
			const engine = listMinimalAdjustmentSetsIdx(g, [x], [y], { effect: 'direct', max: NO_CAP });
			expect(engine.identifiable).toBe(expected.length > 0);
			expect(engine.truncated).toBe(false);
			expect(family(engine.sets)).toEqual(family(expected));
			const minimum = minimumAdjustmentSetIdx(g, [x], [y], 'direct');
			if (expected.length === 0) expect(minimum).toBeNull();
			else {
				expect(o.isValid(minimum as number[])).toBe(true);
				expect((minimum as number[]).length).toBe(Math.min(...expected.map((s) => s.length)));
			}
		});
	});
});

describe('claims, paths and roles', () => {
	it('claims: one per non-adjacent measured pair; `given` a minimal measured separator, null only when none exists (300 DAGs)', () => {
		run(randomDag(), 300, (dag) => {
			note('claims', dag);
			const { g } = dag;
			const expectedPairs: string[] = [];
			for (let a = 0; a < g.n; a++)
				for (let b = a + 1; b < g.n; b++)
					if (g.measured[a] && g.measured[b] && !adjacent(g, a, b)) expectedPairs.push(`${a}|${b}`);
			const { claims, truncated } = impliedClaimsIdx(g);
			expect(truncated).toBe(false);
			expect(claims.map((c) => `${c.a}|${c.b}`).sort()).toEqual(expectedPairs.sort());
			for (const c of claims) {
				const s = pairSeparation(g, c.a, c.b);
				if (c.given === null) {
					expect(s.someMeasuredSetSeparates(), `${g.ids[c.a]}, ${g.ids[c.b]}: null but a measured set separates`).toBe(false);
				} else {
					for (const v of c.given) {
						expect(g.measured[v]).toBe(1);
						expect(v !== c.a && v !== c.b).toBe(true);
					}
					expect(s.isMinimalSeparator(c.given), `${g.ids[c.a]}, ${g.ids[c.b]} given ${c.given.map((v) => g.ids[v])}`).toBe(true);
				}
			}
		});
	});

	it('paths: the same set of X–Y paths with the same causal and open flags (500 DAGs)', () => {
		run(randomAdjustmentQuery(), 500, ({ dag, adjusted }) => {
			note('paths', dag);
			const { g, exposures: X, outcomes: Y } = dag;
			const Z = adjusted.filter((v) => !X.includes(v) && !Y.includes(v));
			const show = (p: { nodes: readonly number[]; causal: boolean; open: boolean }) =>
				`${p.nodes.join('-')}${p.causal ? ' causal' : ''}${p.open ? ' open' : ' blocked'}`;
			const engine = listPathsIdx(g, X, Y, Z, NO_CAP);
			expect(engine.truncated).toBe(false);
			expect(engine.paths.map(show).sort()).toEqual(listPathsOracle(g, X, Y, Z).map(show).sort());
			for (const p of engine.paths) expect(p.causal).toBe(isDirected(g, p.nodes));
		});
	});

	it('roles: the same roles in the contract order for every variable (500 DAGs)', () => {
		run(randomDag(), 500, (dag) => {
			note('roles', dag);
			const { g, exposures: X, outcomes: Y } = dag;
			const engine = variableRolesIdx(g, X, Y);
			const expected = rolesOracle(g, X, Y);
			for (let v = 0; v < g.n; v++) expect(engine[v], `roles of ${g.ids[v]}`).toEqual(expected[v]);
		});
	});
});
