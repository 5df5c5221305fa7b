/**
 * Shortest d-connecting walks, forwards from X and backwards to Y, over the states of the
 * Bayes-Ball search (dsep.ts; Shachter 1998; Koller & Friedman 2009, Alg. 3.1): a state is a
 * variable with the direction it was entered from (UP = from a child or a start, DOWN = from
 * a parent). Knowing both distance tables lets robust.ts decide, in O(1), whether one added
 * arrow u → v d-connects X and Y and how short the shortest open path then is.
 *
 * Why lengths of walks are lengths of paths: a shortest connecting walk has no repeated state,
 * and erasing its loops gives an open path (dsep.ts) no longer than it; since every open
 * path is itself such a walk, the shortest walk and the shortest open path have equal
 * length. Both tables cost O(n + m).
 */
import type { CompiledDag } from '../graph/compiled';
import type { Mask } from './reach';

export const UP = 0;
export const DOWN = 1;

export interface StateRules {
	inZ: Mask;
	/** An(Z): colliders here are open. */
	anZ: Mask;
}

/** May a walk entering v in direction `dir` go on to v's parents? */
export function goesToParents(r: StateRules, v: number, dir: number): boolean {
	return dir === UP ? r.inZ[v] === 0 : r.anZ[v] === 1;
}

/** May a walk at v go on to v's children (either direction)? */
export function goesToChildren(r: StateRules, v: number): boolean {
	return r.inZ[v] === 0;
}

export interface ForwardDistances {
	/** dist[2v + dir]: arrows on the shortest walk from X to that state, -1 if unreached. */
	dist: Int32Array;
	/** Length of the shortest walk reaching Y (Infinity when X and Y are d-separated). */
	toY: number;
}

/** BFS from the states (x, UP); Y states end a walk. O(n + m). */
export function forwardDistances(g: CompiledDag, X: readonly number[], inY: Mask, r: StateRules): ForwardDistances {
	const dist = new Int32Array(2 * g.n).fill(-1);
	const queue = new Int32Array(2 * g.n);
	let head = 0;
	let tail = 0;
	let toY = Infinity;
	for (const x of X) {
		if (dist[2 * x + UP] === -1) {
			dist[2 * x + UP] = 0;
			queue[tail++] = 2 * x + UP;
		}
	}
	const visit = (state: number, d: number) => {
		if (dist[state] !== -1) return;
		dist[state] = d;
		if (inY[state >> 1]) toY = Math.min(toY, d);
		else queue[tail++] = state;
	};
	while (head < tail) {
		const state = queue[head++];
		const v = state >> 1;
		const d = dist[state] + 1;
		if (goesToParents(r, v, state & 1)) for (let k = g.parentStart[v]; k < g.parentStart[v + 1]; k++) visit(2 * g.parentList[k] + UP, d);
		if (goesToChildren(r, v)) for (let k = g.childStart[v]; k < g.childStart[v + 1]; k++) visit(2 * g.childList[k] + DOWN, d);
	}
	return { dist, toY };
}

/**
 * dist[2v + dir]: arrows on the shortest walk from that state to a Y state (0 at Y), -1 when
 * no Y state is reachable. Reverse BFS over the same transitions. O(n + m).
 */
export function backwardDistances(g: CompiledDag, Y: readonly number[], r: StateRules): Int32Array {
	const dist = new Int32Array(2 * g.n).fill(-1);
	const queue = new Int32Array(2 * g.n);
	let head = 0;
	let tail = 0;
	const visit = (state: number, d: number) => {
		if (dist[state] !== -1) return;
		dist[state] = d;
		queue[tail++] = state;
	};
	for (const y of Y) {
		visit(2 * y + UP, 0);
		visit(2 * y + DOWN, 0);
	}
	while (head < tail) {
		const state = queue[head++];
		const w = state >> 1;
		const d = dist[state] + 1;
		if ((state & 1) === UP) {
			// (w, UP) is entered from a child c that may pass to its parents.
			for (let k = g.childStart[w]; k < g.childStart[w + 1]; k++) {
				const c = g.childList[k];
				if (goesToParents(r, c, UP)) visit(2 * c + UP, d);
				if (goesToParents(r, c, DOWN)) visit(2 * c + DOWN, d);
			}
		} else {
			// (w, DOWN) is entered from a parent p that may pass to its children.
			for (let k = g.parentStart[w]; k < g.parentStart[w + 1]; k++) {
				const p = g.parentList[k];
				if (goesToChildren(r, p)) {
					visit(2 * p + UP, d);
					visit(2 * p + DOWN, d);
				}
			}
		}
	}
	return dist;
}

/**
 * Length of the shortest open X–Y path once the arrow u → v is added, given the distance
 * tables of the graph without it (built with the rules that hold after the addition), or
 * Infinity. The arrow adds two transitions, (u, ·) → (v, DOWN) and (v, ·) → (u, UP); a
 * shortest walk uses each at most once, and never both: u → v ← u needs v ∈ An(Z), hence
 * u ∈ An(Z), and then (u, DOWN) already goes wherever (u, UP) goes; v ← u → v returns to
 * (v, DOWN), which goes nowhere (v, UP) or the earlier (v, DOWN) could not. O(1).
 */
export function lengthWithArrow(
	forward: ForwardDistances,
	backward: Int32Array,
	r: StateRules,
	u: number,
	v: number
): number {
	const F = forward.dist;
	let best = forward.toY;
	const min2 = (a: number, b: number) => (a < 0 ? b : b < 0 ? a : Math.min(a, b));
	const fromU = goesToChildren(r, u) ? min2(F[2 * u + UP], F[2 * u + DOWN]) : -1;
	const fromV = min2(goesToParents(r, v, UP) ? F[2 * v + UP] : -1, goesToParents(r, v, DOWN) ? F[2 * v + DOWN] : -1);
	const vDown = backward[2 * v + DOWN];
	const uUp = backward[2 * u + UP];
	if (fromU >= 0 && vDown >= 0) best = Math.min(best, fromU + 1 + vDown);
	if (fromV >= 0 && uUp >= 0) best = Math.min(best, fromV + 1 + uUp);
	return best;
}
