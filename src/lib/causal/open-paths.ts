/**
 * Enumeration of simple paths between X and Y whose interior avoids X ∪ Y, with their
 * status under a conditioning set: depth-first search over simple paths in the skeleton,
 * pruned at the first node that blocks. The number of paths can grow exponentially with the
 * diagram, so every listing is capped (`max` paths and a step budget) and says when it was.
 */
import type { CompiledDag } from '../graph/compiled';
import { ancestorsOf, maskOf, membersOf, type Mask } from './reach';

export interface PathVisitor {
	/** Return false to stop the search. */
	(nodes: readonly number[], causal: boolean): boolean;
}

export interface WalkOptions {
	/** Only follow paths that stay open given Z (prune at blocking nodes). */
	onlyOpen: boolean;
	Z: Mask;
	/** Upper bound on search steps; the walk stops (truncated) past it. */
	budget: number;
}

/**
 * Visits simple paths from X to Y (interior avoiding X ∪ Y). Returns true when the walk was
 * cut short by the visitor or the budget. O(number of partial paths explored), capped.
 */
export function walkPaths(g: CompiledDag, X: readonly number[], Y: readonly number[], visit: PathVisitor, opts: WalkOptions): boolean {
	const n = g.n;
	const inX = maskOf(n, X);
	const inY = maskOf(n, Y);
	const zMembers = membersOf(opts.Z);
	const anZ = ancestorsOf(g, zMembers);
	// Every node on a path that is open given Z lies in An(X ∪ Y ∪ Z): from any non-collider,
	// following the path's arrows forwards ends at an end point or at a collider, which is in
	// An(Z) (Lauritzen et al. 1990; Koller & Friedman 2009, §3.3). Open-only walks therefore
	// never step outside that set: same paths, fewer dead ends spent from the step budget.
	const relevant = opts.onlyOpen ? ancestorsOf(g, [...X, ...Y, ...zMembers]) : null;
	const onPath = new Uint8Array(n);
	const path: number[] = [];
	// arrivedForward[i]: the edge into path[i] points towards path[i].
	const arrivedForward: boolean[] = [];
	let steps = 0;
	let stopped = false;

	const extend = (v: number, allForward: boolean): void => {
		if (stopped) return;
		if (++steps > opts.budget) {
			stopped = true;
			return;
		}
		const into = arrivedForward[arrivedForward.length - 1];
		const tryNext = (w: number, forward: boolean) => {
			if (stopped || onPath[w] || inX[w]) return;
			if (relevant && !relevant[w]) return;
			if (opts.onlyOpen && path.length > 1) {
				// v is interior: check its status given Z.
				const collider = into && !forward;
				const open = collider ? anZ[v] === 1 : opts.Z[v] !== 1;
				if (!open) return;
			}
			path.push(w);
			arrivedForward.push(forward);
			onPath[w] = 1;
			const causal = allForward && forward;
			if (inY[w]) {
				if (!visit(path, causal)) stopped = true;
			} else {
				extend(w, causal);
			}
			onPath[w] = 0;
			arrivedForward.pop();
			path.pop();
		};
		for (let k = g.childStart[v]; k < g.childStart[v + 1]; k++) tryNext(g.childList[k], true);
		for (let k = g.parentStart[v]; k < g.parentStart[v + 1]; k++) tryNext(g.parentList[k], false);
	};

	for (const x of X) {
		if (stopped) break;
		path.push(x);
		arrivedForward.push(true);
		onPath[x] = 1;
		extend(x, true);
		onPath[x] = 0;
		arrivedForward.pop();
		path.pop();
	}
	return stopped;
}

/** Open non-causal paths from X to Y given Z, at most `max`. */
export function listOpenNonCausalPaths(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	Z: Mask,
	max: number,
	budget = 200_000
): { paths: number[][]; truncated: boolean } {
	const paths: number[][] = [];
	let more = false;
	const cut = walkPaths(
		g,
		X,
		Y,
		(nodes, causal) => {
			if (causal) return true;
			if (paths.length >= max) {
				more = true;
				return false;
			}
			paths.push([...nodes]);
			return true;
		},
		{ onlyOpen: true, Z, budget }
	);
	return { paths, truncated: more || (cut && !more) };
}
