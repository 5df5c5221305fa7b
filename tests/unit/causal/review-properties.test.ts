/**
 * The reviewer tools (review.ts, robust.ts, efficiency.ts, instruments.ts) against the
 * brute-force oracle (tests/unit/reference/brute-force.ts), which judges every set by
 * enumerating every simple path, straight from the adjustment criterion (Shpitser,
 * VanderWeele & Robins, UAI 2010) and d-separation (Pearl 1988). Every robustness answer is
 * re-derived by editing the graph (adding, reversing or deleting one arrow, or unmeasuring one
 * variable) and re-running the oracle's validity test on the edited graph.
 *
 * Random DAGs of 2–9 variables (random-dag.ts); zero disagreements allowed. Fixed seed
 * (override with CAUSEWAY_FC_SEED).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compileDag, type CompiledDag } from '../../../src/lib/graph/compiled';
import { reviewAdjustmentIdx } from '../../../src/lib/causal/review';
import { plannedSetRobustnessIdx, robustToAdditionsIdx, setsRobustToAdditionsIdx } from '../../../src/lib/causal/robust';
import { efficiencyAdviceIdx } from '../../../src/lib/causal/efficiency';
import { conditionalInstrumentsIdx } from '../../../src/lib/causal/instruments';
import {
	adjustmentOracle,
	ancestorsOf,
	descendantsOf,
	dSeparatedOracle,
	forEachSubmask,
	hasArrow,
	isColliderAt,
	isDirected,
	isOpenPath,
	maskOf,
	membersOf,
	withoutArrows
} from '../reference/brute-force';
import { describeDag, randomDag, subsetOf, type RandomDag } from '../reference/random-dag';

const SEED = Number(process.env.CAUSEWAY_FC_SEED ?? 20261203);
const RUNS = { seed: SEED, numRuns: 300 };

interface PlanQuery {
	dag: RandomDag;
	Z: number[];
}

/** A DAG and a planned set: often a minimal valid set (from the oracle) plus random extras, else random. */
function planQuery(maxNodes: number): fc.Arbitrary<PlanQuery> {
	return randomDag({ maxNodes, maxExposures: 2, maxOutcomes: 2 }).chain((dag) =>
		fc.record({ pick: fc.nat(), extras: subsetOf(dag.n, 25), mode: fc.integer({ min: 0, max: 3 }) }).map(({ pick, extras, mode }) => {
			const xy = new Set([...dag.exposures, ...dag.outcomes]);
			const minimal = adjustmentOracle(dag.g, dag.exposures, dag.outcomes).minimalSets();
			let Z: number[];
			if (mode === 0 || minimal.length === 0) Z = extras.filter((v) => !xy.has(v));
			else if (mode === 1) Z = minimal[pick % minimal.length];
			else Z = [...new Set([...minimal[pick % minimal.length], ...extras.filter((v) => !xy.has(v))])];
			Z.sort((a, b) => a - b);
			const q = { dag, Z };
			return Object.assign(q, { [fc.toStringMethod]: () => `${describeDag(dag)} Z [${Z.map((v) => dag.ids[v]).join(', ')}]` });
		})
	);
}

/** The DAG with its arrow list edited, compiled afresh (no engine code involved). */
function edited(dag: RandomDag, edges: readonly (readonly [number, number])[], measured = dag.measured): CompiledDag {
	return compileDag(
		dag.ids,
		edges.map(([a, b]) => ({ from: dag.ids[a], to: dag.ids[b] })),
		measured
	);
}

const isAcyclic = (g: CompiledDag): boolean => {
	for (let v = 0; v < g.n; v++) for (const c of Array.from(g.childList.subarray(g.childStart[v], g.childStart[v + 1]))) if (descendantsOf(g, c).has(v)) return false;
	return true;
};

const valid = (g: CompiledDag, dag: RandomDag, Z: readonly number[]) => adjustmentOracle(g, dag.exposures, dag.outcomes).isValid(Z);

/** Shortest open proper non-causal path given Z (arrows), Infinity when none. */
function shortestOpen(g: CompiledDag, dag: RandomDag, Z: readonly number[]): number {
	const open = adjustmentOracle(g, dag.exposures, dag.outcomes).openPaths(Z);
	return open.reduce((best, p) => Math.min(best, p.length - 1), Infinity);
}

describe('review of a stated set against the oracle', () => {
	it('verdict, reasons, droppable members, minimal subset, smallest extension and nearest minimal set', () => {
		fc.assert(
			fc.property(planQuery(9), ({ dag, Z }) => {
				const { g, exposures: X, outcomes: Y } = dag;
				const oracle = adjustmentOracle(g, X, Y);
				const r = reviewAdjustmentIdx(g, X, Y, Z, { maxPaths: 10_000, maxSets: 1_000_000 });
				expect(r.valid).toBe(oracle.isValid(Z));
				const zset = new Set(Z);
				for (const reason of r.reasons) {
					if (reason.kind === 'open-path') {
						expect(isOpenPath(g, reason.path, zset)).toBe(true);
						expect(isDirected(g, reason.path)).toBe(false);
						expect(reason.backDoor).toBe(hasArrow(g, reason.path[1], reason.path[0]));
					} else if (reason.kind === 'collider-bias') {
						const i = reason.path.indexOf(reason.collider);
						expect(i > 0 && isColliderAt(g, reason.path, i)).toBe(true);
						expect(descendantsOf(g, reason.collider).has(reason.variable)).toBe(true);
						expect(isOpenPath(g, reason.path, zset)).toBe(true);
					} else if (reason.kind === 'overadjustment') {
						expect(oracle.forbidden.has(reason.variable)).toBe(true);
					}
				}
				// Every open proper non-causal path with interior outside X ∪ Y is listed (no cap here).
				const xy = new Set([...X, ...Y]);
				const listed = new Set(r.reasons.flatMap((x) => (x.kind === 'open-path' ? [x.path.join(',')] : [])));
				for (const p of oracle.openPaths(Z)) if (p.slice(1, -1).every((v) => !xy.has(v))) expect(listed.has(p.join(','))).toBe(true);

				const minimal = oracle.minimalSets();
				expect(r.identifiable).toBe(minimal.length > 0);
				if (r.valid) {
					for (const z of Z) expect(r.droppable.includes(z)).toBe(oracle.isValid(Z.filter((w) => w !== z)));
					const sub = r.minimalSubset!;
					expect(sub.every((v) => zset.has(v)) && oracle.isValid(sub)).toBe(true);
					forEachSubmask(maskOf(sub), (m) => {
						if (m !== maskOf(sub)) expect(oracle.isValid(membersOf(m))).toBe(false);
					});
					expect(r.extension).toEqual([]);
				} else {
					// Smallest extension: brute force over every W outside Z.
					let best = Infinity;
					const outside = Array.from({ length: g.n }, (_, v) => v).filter((v) => !zset.has(v) && !xy.has(v) && g.measured[v]);
					forEachSubmask(maskOf(outside), (m) => {
						const W = membersOf(m);
						if (W.length < best && oracle.isValid([...Z, ...W])) best = W.length;
					});
					if (best === Infinity) expect(r.extension).toBeNull();
					else {
						expect(r.extension).not.toBeNull();
						expect(r.extension!.length).toBe(best);
						expect(oracle.isValid([...Z, ...r.extension!])).toBe(true);
					}
				}
				// Nearest minimal set: smallest symmetric difference over every minimal set.
				if (minimal.length === 0) expect(r.nearest).toBeNull();
				else {
					const distance = (M: number[]) => M.filter((v) => !zset.has(v)).length + Z.filter((v) => !M.includes(v)).length;
					const bestDistance = Math.min(...minimal.map(distance));
					expect(r.nearest!.add.length + r.nearest!.drop.length).toBe(bestDistance);
					expect(minimal.some((M) => M.length === r.nearest!.set.length && M.every((v) => r.nearest!.set.includes(v)))).toBe(true);
				}
			}),
			RUNS
		);
	});
});

describe('robustness of a planned set, every answer re-derived by editing the graph', () => {
	it('additions, reversals, deletions and unmeasured variables: exactly the changes that break the set, with shortest witnesses', () => {
		fc.assert(
			fc.property(planQuery(8), ({ dag, Z }) => {
				const { g, exposures: X, outcomes: Y } = dag;
				const r = plannedSetRobustnessIdx(g, X, Y, Z, { maxWitnesses: 1_000_000 });
				expect(r.applicable).toBe(valid(g, dag, Z));
				if (!r.applicable) return;
				const found = new Map(r.weaknesses.map((w) => [w.change.kind === 'unmeasure' ? `u:${w.change.variable}` : `${w.change.kind}:${w.change.from}>${w.change.to}`, w]));
				const expectBroken = (key: string, changed: CompiledDag) => {
					const broken = !valid(changed, dag, Z);
					const w = found.get(key);
					expect(w !== undefined, key).toBe(broken);
					if (!w) return;
					const oracle = adjustmentOracle(changed, X, Y);
					const forbidden = Z.some((z) => oracle.forbidden.has(z));
					expect(w.failure).toBe(forbidden ? 'forbidden' : 'open-path');
					if (!forbidden) expect(w.length, key).toBe(shortestOpen(changed, dag, Z));
					expect(w.witness).not.toBeNull();
					const path = w.witness!;
					expect(path.length - 1).toBe(w.length);
					// A directed path from an exposure, through a causal node of the changed diagram, to a planned variable.
					if (forbidden) expect(X.includes(path[0]) && oracle.causalNodes.has(path[1]) && isDirected(changed, path) && Z.includes(path[path.length - 1])).toBe(true);
					else expect(isOpenPath(changed, path, new Set(Z))).toBe(true);
				};
				let additions = 0;
				for (let u = 0; u < g.n; u++)
					for (let v = 0; v < g.n; v++) {
						if (u === v || hasArrow(g, u, v) || hasArrow(g, v, u)) continue;
						const changed = edited(dag, [...dag.edges, [u, v]]);
						if (!isAcyclic(changed)) continue;
						additions++;
						expectBroken(`add-arrow:${u}>${v}`, changed);
					}
				expect(r.tried.additions).toBe(additions);
				let reversals = 0;
				for (const [u, v] of dag.edges) {
					const changed = edited(dag, [...dag.edges.filter(([a, b]) => a !== u || b !== v), [v, u]]);
					if (!isAcyclic(changed)) continue;
					reversals++;
					expectBroken(`reverse-arrow:${u}>${v}`, changed);
					// Deleting an arrow never breaks a valid set (robust.ts): re-derived here.
					expect(valid(edited(dag, dag.edges.filter(([a, b]) => a !== u || b !== v)), dag, Z)).toBe(true);
				}
				expect(r.tried.reversals).toBe(reversals);
				for (const z of Z) {
					const w = found.get(`u:${z}`);
					expect(w?.failure).toBe('unmeasured');
					const measured = dag.measured.map((m, i) => m && i !== z);
					const fewer = edited(dag, dag.edges, measured);
					const minimal = adjustmentOracle(fewer, X, Y).minimalSets();
					if (minimal.length === 0) expect(w!.fallback).toBeNull();
					else {
						expect(valid(fewer, dag, w!.fallback!)).toBe(true);
						expect(w!.fallback!.length).toBe(Math.min(...minimal.map((m) => m.length)));
					}
				}
				// Ranked: structural weaknesses by witness length, measurement ones last.
				const keys = r.weaknesses.map((w) => (w.failure === 'unmeasured' ? 1e9 : w.length));
				expect(keys).toEqual([...keys].sort((a, b) => a - b));
			}),
			RUNS
		);
	});

	it('sets robust to every single added arrow: each is re-derived, and the exhaustive search finds exactly the minimal robust sets', () => {
		fc.assert(
			fc.property(randomDag({ maxNodes: 7 }), (dag) => {
				const { g, exposures: X, outcomes: Y } = dag;
				const robustByOracle = (Z: number[]) => {
					if (!valid(g, dag, Z)) return false;
					for (let u = 0; u < g.n; u++)
						for (let v = 0; v < g.n; v++) {
							if (u === v || hasArrow(g, u, v) || hasArrow(g, v, u)) continue;
							const changed = edited(dag, [...dag.edges, [u, v]]);
							if (isAcyclic(changed) && !valid(changed, dag, Z)) return false;
						}
					return true;
				};
				const r = setsRobustToAdditionsIdx(g, X, Y, () => [], { exhaustiveUpTo: 8 });
				for (const Z of r.sets) expect(robustByOracle(Z)).toBe(true);
				if (!r.exhaustive) return;
				const oracle = adjustmentOracle(g, X, Y);
				const R = Array.from({ length: g.n }, (_, v) => v).filter((v) => g.measured[v] && !X.includes(v) && !Y.includes(v) && !oracle.forbidden.has(v));
				const robust: number[] = [];
				forEachSubmask(maskOf(R), (m) => {
					if (robustByOracle(membersOf(m))) robust.push(m);
				});
				const minimalRobust = robust.filter((m) => !robust.some((o) => o !== m && (o & m) === o));
				expect(r.sets.map((s) => maskOf(s)).sort((a, b) => a - b)).toEqual(minimalRobust.sort((a, b) => a - b));
				for (const Z of r.sets) expect(robustToAdditionsIdx(g, X, Y, Z)).toBe(true);
			}),
			{ seed: SEED, numRuns: 120 }
		);
	});
});

describe('efficiency advice against the comparison criterion, checked by the oracle', () => {
	it('variables to add (X ⫫ p | Z) and to drop (Y ⫫ z | X ∪ Z \\ {z}) keep the set valid', () => {
		fc.assert(
			fc.property(planQuery(9), ({ dag, Z }) => {
				const { g, exposures: X, outcomes: Y } = dag;
				const oracle = adjustmentOracle(g, X, Y);
				const r = efficiencyAdviceIdx(g, X, Y, Z);
				expect(r.applicable).toBe(oracle.isValid(Z));
				if (!r.applicable) return;
				const zset = new Set(Z);
				for (let p = 0; p < g.n; p++) {
					if (zset.has(p) || X.includes(p) || Y.includes(p) || !g.measured[p] || oracle.forbidden.has(p)) continue;
					const expected = dSeparatedOracle(g, X, [p], Z) && oracle.isValid([...Z, p]);
					const got = r.add.find((a) => a.variable === p);
					expect(got !== undefined).toBe(expected);
					if (got) expect(got.helps).toBe(!dSeparatedOracle(g, Y, [p], [...X, ...Z]));
				}
				for (const z of Z) {
					const rest = Z.filter((w) => w !== z);
					const expected = dSeparatedOracle(g, Y, [z], [...X, ...rest]) && oracle.isValid(rest);
					const got = r.drop.find((a) => a.variable === z);
					expect(got !== undefined).toBe(expected);
					if (got) expect(got.helps).toBe(!dSeparatedOracle(g, X, [z], rest));
				}
			}),
			RUNS
		);
	});
});

describe('conditional instruments against a brute-force search over conditioning sets', () => {
	it('z is listed iff some W inside An(y ∪ z) of G_c meets the three conditions; the W given meets them', () => {
		fc.assert(
			fc.property(randomDag({ maxNodes: 8, maxExposures: 1, maxOutcomes: 1, maxUnmeasuredPct: 40 }), (dag) => {
				const { g } = dag;
				const [x] = dag.exposures;
				const [y] = dag.outcomes;
				const oracle = adjustmentOracle(g, [x], [y]);
				// G_c: G without the first arrow of every proper causal path.
				const gc = withoutArrows(g, (a, b) => a === x && oracle.causalNodes.has(b));
				const listed = new Map(conditionalInstrumentsIdx(g, x, y).map((i) => [i.variable, i.given]));
				const meets = (z: number, W: number[]) => !dSeparatedOracle(g, [z], [x], W) && dSeparatedOracle(gc, [z], [y], W);
				const belowX = descendantsOf(g, x);
				for (let z = 0; z < g.n; z++) {
					if (z === x || z === y || !g.measured[z] || oracle.forbidden.has(z) || belowX.has(z)) {
						expect(listed.has(z)).toBe(false);
						continue;
					}
					const ancestral = new Set([...ancestorsOf(gc, y), ...ancestorsOf(gc, z)]);
					const candidates = Array.from({ length: g.n }, (_, v) => v).filter(
						(v) => v !== x && v !== y && v !== z && g.measured[v] && !oracle.forbidden.has(v) && ancestral.has(v)
					);
					let exists = false;
					forEachSubmask(maskOf(candidates), (m) => {
						if (!exists && meets(z, membersOf(m))) exists = true;
					});
					expect(listed.has(z), `z = ${dag.ids[z]}`).toBe(exists);
					if (listed.has(z)) expect(meets(z, listed.get(z)!)).toBe(true);
				}
			}),
			RUNS
		);
	});
});
