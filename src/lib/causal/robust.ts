/**
 * Robustness of a planned adjustment set Z to single changes of the assumptions: which one
 * added arrow (keeping the diagram acyclic), deleted or reversed arrow, or measured variable
 * turned unmeasured makes Z invalid by the adjustment criterion (Shpitser, VanderWeele &
 * Robins 2010; adjustment.ts). Each answer carries a witness — the shortest open non-causal
 * path in the changed diagram, or a directed path that puts a planned variable on or below
 * a causal path — and the answers are ranked by the witness's length (a rule of thumb, not a
 * theorem: the bias a path carries is a product of its arrows' effects, so short paths tend
 * to matter more), then by the kind of change and the ids.
 *
 * Deleting an arrow never invalidates a valid set: proper causal paths, Dpcp and An(Z) can
 * only shrink, and every proper non-causal path of the smaller graph is one of the larger
 * graph with the same colliders. So deletions are counted, not tested one by one.
 *
 * Adding u → v (the O(n²) part) is decided in O(1) per arrow after O(n + m) preparation, with
 * Z valid in G, Dpcp = De(cn), H = G^pbd:
 * 1. u reachable from X by a proper directed path and v reaching Y avoiding X: u → v creates
 *    proper causal paths; the new cn nodes are the X ⇝ u prefix and the v ⇝ Y suffix. Z fails
 *    condition (a) iff v ∈ An(Z) or some prefix node is in An(Z) (a topological-order DP).
 *    Otherwise An(Z) is unchanged and the changed proper back-door graph connects X and Y iff
 *    H' + (u → v) does, H' = H without x → w for w ∉ An(Z): such a walk enters w from a parent
 *    and can only run down a directed path, a causal path of the changed graph, so dropping
 *    those arrows removes exactly the causal walks (and never a shortest non-causal one).
 * 2. otherwise cn is unchanged, the changed proper back-door graph is H + (u → v), and Dpcp
 *    grows only by De(v) when u ∈ Dpcp: Z fails condition (a) iff u ∈ Dpcp and v ∈ An(Z);
 * 3. else d-separation in H + (u → v) is decided from shortest-walk tables of H
 *    (connection-distances.ts), built once for all v ∉ An(Z) and once per u when v ∈ An(Z)
 *    (the arrow then adds An(u) to An(Z)).
 * Total O(n² + n (n + m)) for the additions against O(n² (n + m)) for re-testing each one
 * (bench/review.ts measures both); reversals are re-tested, O(m (n + m)); the descendant
 * matrix used for acyclicity costs O(n (n + m)) time and n² bytes. Open-path witnesses of
 * additions are built for the first `maxWitnesses` ranked answers only (O(n + m) each);
 * witnesses of condition-(a) failures are read off BFS trees (directed-trees.ts): a directed
 * path from an exposure through a causal node to a planned variable, short but for arrows of
 * kind 1 not always the shortest.
 */
import type { CompiledDag } from '../graph/compiled';
import { dSeparated } from './dsep';
import { properBackDoorGraph, properCausalStructure, type ProperCausalStructure } from './proper-causal';
import { ancestorsOf, descendantsOf, hasArrow, maskOf, withoutArrows } from './reach';
import { causalTree, directedTree, pathFrom, pathTo } from './directed-trees';
import { isAdjustmentSet } from './adjustment';
import { backwardDistances, forwardDistances, lengthWithArrow, type StateRules } from './connection-distances';
import { canAddArrow, canReverseArrow, DescendantMatrix, withArrow, withArrowReversed, withUnmeasured } from './graph-edit';
import { minimumAdjustmentSetIdx } from './sets';

export type AssumptionChangeIdx =
	| { kind: 'add-arrow' | 'reverse-arrow' | 'delete-arrow'; from: number; to: number }
	| { kind: 'unmeasure'; variable: number };

export interface WeaknessIdx {
	change: AssumptionChangeIdx;
	/** open-path: a non-causal path opens; forbidden: a planned variable ends on or below a causal path; unmeasured: a planned variable cannot be adjusted. */
	failure: 'open-path' | 'forbidden' | 'unmeasured';
	/** Arrows on the witness path (0 for unmeasured). */
	length: number;
	/** The witness path; null when not built (beyond maxWitnesses). For unmeasured: [variable]. */
	witness: number[] | null;
	/** unmeasured only: a smallest valid set once the variable is unmeasured, or null if none. */
	fallback?: number[] | null;
}

export interface RobustnessIdx {
	/** False when Z is not valid to begin with (nothing to stress-test). */
	applicable: boolean;
	weaknesses: WeaknessIdx[];
	tried: { additions: number; deletions: number; reversals: number; unmeasured: number };
}

export interface RobustnessOptions {
	maxWitnesses?: number;
	/** Called now and then with the fraction done (for a progress bar). */
	onProgress?: (fraction: number) => void;
}

const KIND_ORDER = { 'add-arrow': 0, 'reverse-arrow': 1, 'delete-arrow': 2, unmeasure: 3 } as const;

/** Shortest directed path from X through a causal node to a member of Z (Z ∩ Dpcp ≠ ∅). O(n + m). */
function causalWitness(g: CompiledDag, s: ProperCausalStructure, X: readonly number[], Z: readonly number[]): number[] {
	const tree = causalTree(g, s, X);
	let best = -1;
	for (const z of Z) if (tree.dist[z] >= 0 && (best === -1 || tree.dist[z] < tree.dist[best])) best = z;
	return tree.path(best);
}

/** Re-tests Z in a changed graph: null when still valid, else the failure and its witness. O(n + m). */
function retest(g: CompiledDag, X: readonly number[], Y: readonly number[], Z: readonly number[]): Omit<WeaknessIdx, 'change'> | null {
	const s = properCausalStructure(g, X, Y);
	if (Z.some((z) => s.forbidden[z])) {
		const witness = causalWitness(g, s, X, Z);
		return { failure: 'forbidden', length: witness.length - 1, witness };
	}
	const r = dSeparated(properBackDoorGraph(g, s), X, Y, Z);
	if (r.separated || !r.path) return null;
	return { failure: 'open-path', length: r.path.length - 1, witness: r.path };
}

interface AdditionScan {
	/** Return false to stop the scan. */
	found(u: number, v: number, result: Omit<WeaknessIdx, 'change'>): boolean;
	progress?: (fraction: number) => void;
}

/** Variables in an order where every arrow points forward (Kahn 1962). O(n + m). */
function topologicalOrder(g: CompiledDag): number[] {
	const indeg = new Int32Array(g.n);
	for (let v = 0; v < g.n; v++) indeg[v] = g.parentStart[v + 1] - g.parentStart[v];
	const order: number[] = [];
	for (let v = 0; v < g.n; v++) if (indeg[v] === 0) order.push(v);
	for (let i = 0; i < order.length; i++) {
		const v = order[i];
		for (let k = g.childStart[v]; k < g.childStart[v + 1]; k++) if (--indeg[g.childList[k]] === 0) order.push(g.childList[k]);
	}
	return order;
}

/**
 * Visits every acyclic single-arrow addition that invalidates Z (Z valid in g), by the
 * incremental decision of the module note. Returns the number of additions considered.
 */
function scanAdditions(g: CompiledDag, X: readonly number[], Y: readonly number[], Z: readonly number[], de: DescendantMatrix, scan: AdditionScan): number {
	const n = g.n;
	const s = properCausalStructure(g, X, Y);
	const pbd = properBackDoorGraph(g, s);
	const inZ = maskOf(n, Z);
	const anZ = ancestorsOf(g, Z);
	const fromX = descendantsOf(g, X, s.inX);
	const toY = ancestorsOf(g, Y, s.inX);
	const base: StateRules = { inZ, anZ };
	const forward = forwardDistances(pbd, X, s.inY, base);
	const backward = backwardDistances(pbd, Y, base);
	// Arrows creating causal paths (kind 1): G^pbd without x → w for w ∉ An(Z), whose walks are dead ends.
	const trimmed = withoutArrows(pbd, (a, b) => s.inX[a] === 1 && anZ[b] === 0);
	const forwardTrimmed = forwardDistances(trimmed, X, s.inY, base);
	const backwardTrimmed = backwardDistances(trimmed, Y, base);
	// Witness trees for failures of condition (a).
	const fromXTree = directedTree(g, X, 'down', s.inX);
	const toZTree = directedTree(g, Z, 'up');
	const throughCn = causalTree(g, s, X);
	// best[u]: shortest x ⇝ w ⇝ z with w ∉ X, w ∈ fromX ∩ An(Z), w ⇝ u avoiding X (w joins cn when u → v adds a causal path).
	const best = new Int32Array(n).fill(-1);
	const bestVia = new Int32Array(n).fill(-1);
	for (const u of topologicalOrder(g)) {
		if (s.inX[u]) continue;
		if (fromX[u] && anZ[u]) {
			best[u] = fromXTree.dist[u] + toZTree.dist[u];
			bestVia[u] = u;
		}
		for (let k = g.parentStart[u]; k < g.parentStart[u + 1]; k++) {
			const p = g.parentList[k];
			if (s.inX[p] || best[p] < 0 || (best[u] >= 0 && best[u] <= best[p])) continue;
			best[u] = best[p];
			bestVia[u] = bestVia[p];
		}
	}
	// head ends at u; then u → v and the shortest v ⇝ z.
	const viaArrow = (head: number[], v: number): number[] => [...head, ...pathFrom(toZTree, v)];

	let considered = 0;
	for (let u = 0; u < n; u++) {
		scan.progress?.(u / n);
		// Tables for arrows into An(Z), which make An(u) part of An(Z); built on first need.
		let grown: { rules: StateRules; forward: ReturnType<typeof forwardDistances>; backward: Int32Array } | null = null;
		for (let v = 0; v < n; v++) {
			if (u === v || hasArrow(g, u, v) || hasArrow(g, v, u) || !canAddArrow(de, u, v)) continue;
			considered++;
			let result: Omit<WeaknessIdx, 'change'> | null = null;
			if (fromX[u] && toY[v] && !s.inX[v]) {
				// Kind 1: new causal paths through u → v.
				if (anZ[v] || best[u] >= 0) {
					const direct = anZ[v] ? fromXTree.dist[u] + 1 + toZTree.dist[v] : Infinity;
					const witness =
						best[u] >= 0 && best[u] < direct
							? [...pathTo(fromXTree, bestVia[u]), ...pathFrom(toZTree, bestVia[u]).slice(1)]
							: viaArrow(pathTo(fromXTree, u), v);
					result = { failure: 'forbidden', length: witness.length - 1, witness };
				} else {
					const length = s.inX[u] ? forwardTrimmed.toY : lengthWithArrow(forwardTrimmed, backwardTrimmed, base, u, v);
					if (Number.isFinite(length)) result = { failure: 'open-path', length, witness: null };
				}
			} else if (s.forbidden[u] && anZ[v]) {
				// Kind 2 failing (a): a planned variable now descends from a causal node through u → v.
				const witness = viaArrow(throughCn.path(u), v);
				result = { failure: 'forbidden', length: witness.length - 1, witness };
			} else {
				let length: number;
				if (anZ[v] && !anZ[u]) {
					if (!grown) {
						const rules: StateRules = { inZ, anZ: ancestorsOf(g, [...Z, u]) };
						grown = { rules, forward: forwardDistances(pbd, X, s.inY, rules), backward: backwardDistances(pbd, Y, rules) };
					}
					length = lengthWithArrow(grown.forward, grown.backward, grown.rules, u, v);
				} else {
					length = lengthWithArrow(forward, backward, base, u, v);
				}
				if (Number.isFinite(length)) result = { failure: 'open-path', length, witness: null };
			}
			if (result && !scan.found(u, v, result)) return considered;
		}
	}
	return considered;
}

function compareWeakness(ids: readonly string[]) {
	const key = (c: AssumptionChangeIdx) => (c.kind === 'unmeasure' ? [ids[c.variable], ''] : [ids[c.from], ids[c.to]]);
	return (a: WeaknessIdx, b: WeaknessIdx): number => {
		const ua = a.failure === 'unmeasured' ? 1 : 0;
		const ub = b.failure === 'unmeasured' ? 1 : 0;
		if (ua !== ub) return ua - ub;
		if (a.length !== b.length) return a.length - b.length;
		if (a.change.kind !== b.change.kind) return KIND_ORDER[a.change.kind] - KIND_ORDER[b.change.kind];
		const [a1, a2] = key(a.change);
		const [b1, b2] = key(b.change);
		return a1 < b1 ? -1 : a1 > b1 ? 1 : a2 < b2 ? -1 : a2 > b2 ? 1 : 0;
	};
}

/** Every single change that invalidates the planned set Z, ranked (see the module note). */
export function plannedSetRobustnessIdx(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	Z: readonly number[],
	opts: RobustnessOptions = {}
): RobustnessIdx {
	const m = g.childList.length;
	const tried = { additions: 0, deletions: m, reversals: 0, unmeasured: 0 };
	if (!isAdjustmentSet(g, X, Y, Z)) return { applicable: false, weaknesses: [], tried };
	const de = new DescendantMatrix(g);
	const weaknesses: WeaknessIdx[] = [];
	const progress = opts.onProgress;
	tried.additions = scanAdditions(g, X, Y, Z, de, {
		found(u, v, result) {
			weaknesses.push({ change: { kind: 'add-arrow', from: u, to: v }, ...result });
			return true;
		},
		progress: progress && ((f) => progress(0.85 * f))
	});
	for (let u = 0; u < g.n; u++) {
		for (let k = g.childStart[u]; k < g.childStart[u + 1]; k++) {
			const v = g.childList[k];
			if (!canReverseArrow(g, de, u, v)) continue;
			tried.reversals++;
			const result = retest(withArrowReversed(g, u, v), X, Y, Z);
			if (result) weaknesses.push({ change: { kind: 'reverse-arrow', from: u, to: v }, ...result });
		}
	}
	progress?.(0.95);
	for (const z of Z) {
		tried.unmeasured++;
		weaknesses.push({
			change: { kind: 'unmeasure', variable: z },
			failure: 'unmeasured',
			length: 0,
			witness: [z],
			fallback: minimumAdjustmentSetIdx(withUnmeasured(g, z), X, Y)
		});
	}
	weaknesses.sort(compareWeakness(g.ids));
	const maxWitnesses = opts.maxWitnesses ?? 200;
	let built = 0;
	for (const w of weaknesses) {
		if (built >= maxWitnesses) break;
		if (w.witness !== null || w.change.kind !== 'add-arrow') continue;
		w.witness = retest(withArrow(g, w.change.from, w.change.to), X, Y, Z)?.witness ?? null;
		built++;
	}
	progress?.(1);
	return { applicable: true, weaknesses, tried };
}

/** True when Z is valid and stays valid under every acyclic single-arrow addition. */
export function robustToAdditionsIdx(g: CompiledDag, X: readonly number[], Y: readonly number[], Z: readonly number[], de = new DescendantMatrix(g)): boolean {
	if (!isAdjustmentSet(g, X, Y, Z)) return false;
	let robust = true;
	scanAdditions(g, X, Y, Z, de, {
		found() {
			robust = false;
			return false;
		}
	});
	return robust;
}

export interface RobustSetsIdx {
	/** Valid sets that stay valid under every acyclic single-arrow addition. */
	sets: number[][];
	/** True when every subset of the candidate variables was tried; else a named family was. */
	exhaustive: boolean;
	tried: number;
}

/**
 * Sets robust to every single added arrow. With at most `exhaustiveUpTo` usable variables R
 * (measured, outside X ∪ Y ∪ Dpcp) every subset of R is tried and the inclusion-minimal
 * robust ones are returned; otherwise the family tried is the minimal sufficient sets (up to
 * `maxMinimal`), the efficiency-optimal set and An(X ∪ Y) ∩ R — robustness is not monotone in
 * the set, so this family may miss robust sets, and the answer says which search ran.
 * O(2^|R| · cost of robustToAdditionsIdx) or O(F · cost) for a family of F sets.
 */
export function setsRobustToAdditionsIdx(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	family: () => number[][],
	opts: { exhaustiveUpTo?: number } = {}
): RobustSetsIdx {
	const s = properCausalStructure(g, X, Y);
	const R: number[] = [];
	for (let v = 0; v < g.n; v++) if (g.measured[v] && !s.inX[v] && !s.inY[v] && !s.forbidden[v]) R.push(v);
	const de = new DescendantMatrix(g);
	if (R.length <= (opts.exhaustiveUpTo ?? 8)) {
		const robustMasks: number[] = [];
		const masks = Array.from({ length: 1 << R.length }, (_, i) => i).sort((a, b) => popcount(a) - popcount(b) || a - b);
		for (const mask of masks) {
			if (robustMasks.some((r) => (r & mask) === r)) continue; // a robust subset exists: not minimal
			const Z = R.filter((_, i) => mask & (1 << i));
			if (robustToAdditionsIdx(g, X, Y, Z, de)) robustMasks.push(mask);
		}
		return { sets: robustMasks.map((mask) => R.filter((_, i) => mask & (1 << i))), exhaustive: true, tried: masks.length };
	}
	const seen = new Set<string>();
	const sets: number[][] = [];
	let tried = 0;
	for (const Z of family()) {
		const sorted = [...Z].sort((a, b) => a - b);
		const key = sorted.join(',');
		if (seen.has(key)) continue;
		seen.add(key);
		tried++;
		if (robustToAdditionsIdx(g, X, Y, sorted, de)) sets.push(sorted);
	}
	return { sets, exhaustive: false, tried };
}

function popcount(x: number): number {
	let c = 0;
	for (let v = x; v !== 0; v &= v - 1) c++;
	return c;
}
