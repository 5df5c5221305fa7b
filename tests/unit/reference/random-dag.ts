/**
 * fast-check arbitraries for random causal diagrams and queries on them, used to hold the
 * engine to the brute-force oracle (brute-force.ts).
 *
 * Acyclic by construction: every variable gets a rank from a random permutation and an arrow
 * may only go from a lower rank to a higher one, so the variable indices (0..n-1, the order
 * compileDag sees) are not a topological order. Density varies per diagram; the cap on the
 * edge probability falls with n so that the oracle's enumeration of every simple path stays
 * affordable (a complete graph on 12 nodes has about 10^7 simple paths between two nodes).
 *
 * Every generated value prints compactly (fc.toStringMethod), so a failing run shows the
 * arrows by id, the unmeasured variables, the exposures and outcomes.
 */
import fc from 'fast-check';
import { compileDag, type CompiledDag } from '../../../src/lib/graph/compiled';

export interface RandomDag {
	readonly n: number;
	readonly ids: readonly string[];
	/** Arrows as index pairs [from, to]. */
	readonly edges: readonly (readonly [number, number])[];
	readonly measured: readonly boolean[];
	/** 1–2 exposures and 1–2 outcomes, disjoint, always measured. */
	readonly exposures: readonly number[];
	readonly outcomes: readonly number[];
	readonly g: CompiledDag;
}

export interface RandomDagOptions {
	minNodes?: number;
	maxNodes?: number;
	/** At most this many exposures / outcomes (1 or 2). */
	maxExposures?: number;
	maxOutcomes?: number;
	/** Upper bound of the per-diagram share of unmeasured variables, in percent. */
	maxUnmeasuredPct?: number;
	/** Expected number of arrows per node at the densest (caps the edge probability). */
	maxMeanDegree?: number;
}

export function describeDag(d: Pick<RandomDag, 'ids' | 'edges' | 'measured' | 'exposures' | 'outcomes'>): string {
	const id = (i: number) => d.ids[i];
	const arrows = d.edges.map(([a, b]) => `${id(a)}->${id(b)}`).join(', ');
	const unmeasured = d.ids.filter((_, i) => !d.measured[i]);
	return (
		`{ n: ${d.ids.length}, arrows: [${arrows}], unmeasured: [${unmeasured.join(', ')}], ` +
		`exposures: [${d.exposures.map(id).join(', ')}], outcomes: [${d.outcomes.map(id).join(', ')}] }`
	);
}

/** Builds the RandomDag record (and its CompiledDag) from plain parts. */
export function makeDag(
	n: number,
	edges: readonly (readonly [number, number])[],
	measured: readonly boolean[],
	exposures: readonly number[],
	outcomes: readonly number[]
): RandomDag {
	const ids = Array.from({ length: n }, (_, i) => `v${i}`);
	const g = compileDag(
		ids,
		edges.map(([a, b]) => ({ from: ids[a], to: ids[b] })),
		measured
	);
	const dag: RandomDag = { n, ids, edges, measured, exposures, outcomes, g };
	return Object.assign(dag, { [fc.toStringMethod]: () => describeDag(dag) });
}

/** Random DAG with exposures and outcomes. */
export function randomDag(opts: RandomDagOptions = {}): fc.Arbitrary<RandomDag> {
	const minNodes = Math.max(2, opts.minNodes ?? 2);
	const maxNodes = opts.maxNodes ?? 12;
	const maxX = opts.maxExposures ?? 2;
	const maxY = opts.maxOutcomes ?? 2;
	const maxUnmeasured = opts.maxUnmeasuredPct ?? 30;
	const meanDegree = opts.maxMeanDegree ?? 5;
	return fc.noBias(fc.integer({ min: minNodes, max: maxNodes })).chain((n) => {
		const pairs = (n * (n - 1)) / 2;
		// Edge probability cap in percent: mean degree 2·p·(n-1)/2 = p·(n-1) ≤ meanDegree.
		const maxPct = Math.max(10, Math.min(90, Math.round((100 * meanDegree) / (n - 1))));
		const nodes = Array.from({ length: n }, (_, i) => i);
		return fc
			.record({
				rank: fc.shuffledSubarray(nodes, { minLength: n, maxLength: n }),
				densityPct: fc.noBias(fc.integer({ min: 10, max: maxPct })),
				// An edge is present when its roll reaches 100 - density: shrinking rolls to 0
				// (and density to its minimum) removes arrows, so counterexamples shrink to small graphs.
				rolls: fc.array(fc.noBias(fc.integer({ min: 0, max: 99 })), { minLength: pairs, maxLength: pairs }),
				unmeasuredPct: fc.integer({ min: 0, max: maxUnmeasured }),
				unmeasuredRolls: fc.array(fc.noBias(fc.integer({ min: 0, max: 99 })), { minLength: n, maxLength: n }),
				roleOrder: fc.shuffledSubarray(nodes, { minLength: n, maxLength: n }),
				nx: fc.integer({ min: 1, max: maxX }),
				ny: fc.integer({ min: 1, max: maxY }),
				// 0 = leave the ranks as drawn; otherwise (4 in 5) exposures come before outcomes in
				// the causal order, as in a study question, so that causal paths are common.
				exposuresFirst: fc.integer({ min: 0, max: 4 })
			})
			.map((r) => {
				let nx = r.nx;
				let ny = r.ny;
				while (nx + ny > n) {
					if (ny > 1) ny--;
					else nx--;
				}
				const exposures = r.roleOrder.slice(0, nx).sort((a, b) => a - b);
				const outcomes = r.roleOrder.slice(nx, nx + ny).sort((a, b) => a - b);
				// byRank[k] = the variable whose rank is k.
				const byRank = r.rank.slice();
				if (r.exposuresFirst !== 0) {
					const chosen = [...exposures, ...outcomes];
					const slots = chosen.map((v) => byRank.indexOf(v)).sort((a, b) => a - b);
					chosen.forEach((v, i) => (byRank[slots[i]] = v));
				}
				const edges: [number, number][] = [];
				let k = 0;
				for (let i = 0; i < n; i++)
					for (let j = i + 1; j < n; j++, k++)
						if (r.rolls[k] >= 100 - r.densityPct) edges.push([byRank[i], byRank[j]]);
				const measured = nodes.map(
					(v) => exposures.includes(v) || outcomes.includes(v) || r.unmeasuredRolls[v] >= r.unmeasuredPct
				);
				return makeDag(n, edges, measured, exposures, outcomes);
			});
	});
}

/**
 * A random subset of 0..n-1 given by per-node rolls: node v is in the set when its roll is
 * below pct. Shrinks towards the empty set.
 */
export function subsetOf(n: number, maxPct = 50): fc.Arbitrary<number[]> {
	return fc
		.record({
			pct: fc.integer({ min: 0, max: maxPct }),
			rolls: fc.array(fc.integer({ min: 0, max: 99 }), { minLength: n, maxLength: n })
		})
		.map(({ pct, rolls }) => rolls.flatMap((roll, v) => (roll < pct ? [v] : [])));
}

export interface DsepQuery {
	dag: RandomDag;
	from: number[];
	to: number[];
	given: number[];
}

/**
 * A random DAG with random pairwise disjoint, non-empty `from`, `to` and a possibly empty
 * `given`: each node gets one label (none / from / to / given).
 */
export function randomDsepQuery(opts: RandomDagOptions = {}): fc.Arbitrary<DsepQuery> {
	return randomDag(opts).chain((dag) =>
		fc
			.record({
				labels: fc.array(fc.integer({ min: 0, max: 5 }), { minLength: dag.n, maxLength: dag.n }),
				firstFrom: fc.integer({ min: 0, max: dag.n - 1 }),
				firstToOffset: fc.integer({ min: 1, max: dag.n - 1 })
			})
			.map(({ labels, firstFrom, firstToOffset }) => {
				// Labels: 0,1 = none; 2 = from; 3 = to; 4,5 = given. One node of each of from
				// and to is forced so that both are non-empty.
				const lab = labels.slice();
				lab[firstFrom] = 2;
				lab[(firstFrom + firstToOffset) % dag.n] = 3;
				const pick = (want: number[]) => lab.flatMap((l, v) => (want.includes(l) ? [v] : []));
				const q: DsepQuery = { dag, from: pick([2]), to: pick([3]), given: pick([4, 5]) };
				const name = (vs: number[]) => `[${vs.map((v) => dag.ids[v]).join(', ')}]`;
				return Object.assign(q, {
					[fc.toStringMethod]: () =>
						`${describeDag(dag)} from ${name(q.from)} to ${name(q.to)} given ${name(q.given)}`
				});
			})
	);
}

export interface AdjustmentQuery {
	dag: RandomDag;
	adjusted: number[];
}

/**
 * A random DAG with a random candidate adjustment set. Most sets avoid the exposures and
 * outcomes; about one in ten may include some (which must then be reported as invalid).
 * Unmeasured variables may be drawn (also invalid).
 */
export function randomAdjustmentQuery(opts: RandomDagOptions = {}): fc.Arbitrary<AdjustmentQuery> {
	return randomDag(opts).chain((dag) =>
		fc.record({ base: subsetOf(dag.n, 60), allowXY: fc.integer({ min: 0, max: 9 }) }).map(({ base, allowXY }) => {
			const xy = new Set([...dag.exposures, ...dag.outcomes]);
			const adjusted = allowXY === 0 ? base : base.filter((v) => !xy.has(v));
			const q: AdjustmentQuery = { dag, adjusted };
			return Object.assign(q, {
				[fc.toStringMethod]: () => `${describeDag(dag)} adjusted [${adjusted.map((v) => dag.ids[v]).join(', ')}]`
			});
		})
	);
}
