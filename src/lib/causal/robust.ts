/**
 * Robustness of a planned adjustment set Z to single changes of the assumptions: which one
 * added arrow (keeping the diagram acyclic), deleted or reversed arrow, or measured variable
 * turned unmeasured makes Z invalid by the adjustment criterion (Shpitser, VanderWeele &
 * Robins 2010; adjustment.ts). Each answer carries a witness — the shortest open non-causal
 * path in the changed diagram, or the causal path that puts a planned variable on or below
 * a causal path — and the answers are ranked by the witness's length (a rule of thumb, not a
 * theorem: the bias a path carries is a product of its arrows' effects, so short paths tend
 * to matter more), then by the kind of change and the ids.
 *
 * Deleting an arrow never invalidates a valid set: proper causal paths, Dpcp and An(Z) can
 * only shrink, and every proper non-causal path of the smaller graph is one of the larger
 * graph with the same colliders. So deletions are counted, not tested one by one.
 *
 * Adding u → v (the O(n²) part) is decided incrementally. With Z valid in G:
 * 1. if u is reachable from X by a proper directed path and v reaches Y avoiding X, the arrow
 *    creates proper causal paths, cn and the proper back-door graph change: the diagram is
 *    rebuilt and re-tested, O(n + m);
 * 2. otherwise cn is unchanged, the changed proper back-door graph is G^pbd + (u → v), and
 *    Dpcp grows only by De(v) when u ∈ Dpcp: Z fails condition (a) iff u ∈ Dpcp and v ∈ An(Z);
 * 3. else d-separation in G^pbd + (u → v) is decided in O(1) from shortest-walk tables of
 *    G^pbd (connection-distances.ts), built once for all v ∉ An(Z) and once per u when v ∈ An(Z)
 *    (the arrow then adds An(u) to An(Z)).
 * Total O(n² + (n + c)(n + m)) for c arrows of kind 1, against O(n² (n + m)) for re-testing
 * every addition; reversals are re-tested, O(m (n + m)). Witness paths of additions decided
 * in O(1) are built for the first `maxWitnesses` ranked answers only (O(n + m) each).
 */
import type { CompiledDag } from '../graph/compiled';
import { dSeparated } from './dsep';
import { properBackDoorGraph, properCausalStructure, type ProperCausalStructure } from './proper-causal';
import { ancestorsOf, descendantsOf, hasArrow, maskOf } from './reach';
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

/** A causal node w ∈ cn above z and the path x → … → w → … → z, shortest on each leg. O(n + m). */
function causalWitness(g: CompiledDag, s: ProperCausalStructure, z: number): number[] {
	const up = (start: number, stop: (v: number) => boolean, within: (v: number) => boolean): number[] => {
		const via = new Int32Array(g.n).fill(-1);
		via[start] = start;
		const queue = [start];
		for (let i = 0; i < queue.length; i++) {
			const w = queue[i];
			if (stop(w)) {
				const path = [w];
				for (let v = w; v !== start; v = via[v]) path.push(via[v]);
				return path; // from the stop variable down to start
			}
			for (let k = g.parentStart[w]; k < g.parentStart[w + 1]; k++) {
				const p = g.parentList[k];
				if (via[p] === -1 && within(p)) {
					via[p] = w;
					queue.push(p);
				}
			}
		}
		return [start];
	};
	const below = up(z, (v) => s.causalNodes[v] === 1, () => true); // w … z
	const w = below[0];
	const above = up(w, (v) => s.inX[v] === 1, (v) => s.inX[v] === 1 || s.causalNodes[v] === 1); // x … w
	return [...above, ...below.slice(1)];
}

/** Re-tests Z in a changed graph: null when still valid, else the failure and its witness. O(n + m). */
function retest(g: CompiledDag, X: readonly number[], Y: readonly number[], Z: readonly number[]): Omit<WeaknessIdx, 'change'> | null {
	const s = properCausalStructure(g, X, Y);
	const bad = Z.find((z) => s.forbidden[z]);
	if (bad !== undefined) {
		const witness = causalWitness(g, s, bad);
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
	let considered = 0;
	for (let u = 0; u < n; u++) {
		scan.progress?.(u / n);
		// Tables for arrows into An(Z), which make An(u) part of An(Z); built on first need.
		let grown: { rules: StateRules; forward: ReturnType<typeof forwardDistances>; backward: Int32Array } | null = null;
		for (let v = 0; v < n; v++) {
			if (u === v || hasArrow(g, u, v) || hasArrow(g, v, u) || !canAddArrow(de, u, v)) continue;
			considered++;
			let result: Omit<WeaknessIdx, 'change'> | null;
			if (fromX[u] && toY[v] && !s.inX[v]) {
				result = retest(withArrow(g, u, v), X, Y, Z);
			} else if (s.forbidden[u] && anZ[v]) {
				result = retest(withArrow(g, u, v), X, Y, Z);
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
				result = Number.isFinite(length) ? { failure: 'open-path', length, witness: null } : null;
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
