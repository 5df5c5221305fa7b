/**
 * Causal paths and all simple paths from X to Y (interior avoiding X ∪ Y), visited with
 * polynomial delay by backtracking that enters a branch only when it can still reach Y
 * (Read & Tarjan 1975): the second half of the path listing, after the open non-causal paths.
 *
 *   - Directed paths: a variable that reaches Y along arrows (without passing X or Y) always
 *     completes, since a directed path from it runs through its descendants and a directed
 *     prefix holds only its ancestors. One O(n + m) pass, then O(p) per step.
 *   - All simple paths: reachability in the skeleton without the partial path, recomputed per
 *     extension, O(n + m); delay O(p · (n + m)).
 * Both searches are iterative and stop when the visitor says so or the step budget is spent.
 */
import type { CompiledDag } from '../graph/compiled';
import { ancestorsOf, maskOf, type Mask } from './reach';

/** Return false to stop. */
export type Visit = (nodes: readonly number[]) => boolean;

/** Variables with a directed path to Y whose interior avoids X ∪ Y. O(n + m). */
function reachesOutcome(g: CompiledDag, inX: Mask, Y: readonly number[]): Mask {
	const through = new Uint8Array(g.n);
	for (let v = 0; v < g.n; v++) through[v] = inX[v];
	for (const y of Y) through[y] = 1;
	// Stop at X and at Y: ancestors found through another outcome or an exposure do not count.
	return ancestorsOf(g, Y, through);
}

/** Skeleton reachability to Y without `removed`: which variables can still complete. O(n + m). */
function skeletonReach(g: CompiledDag, inX: Mask, inY: Mask, removed: Mask): Mask {
	const seen = new Uint8Array(g.n);
	const queue = new Int32Array(g.n);
	let tail = 0;
	for (let y = 0; y < g.n; y++)
		if (inY[y] && !removed[y]) {
			seen[y] = 1;
			queue[tail++] = y;
		}
	for (let head = 0; head < tail; head++) {
		const v = queue[head];
		const step = (w: number) => {
			if (seen[w] || removed[w] || inX[w] || inY[w]) return;
			seen[w] = 1;
			queue[tail++] = w;
		};
		for (let k = g.parentStart[v]; k < g.parentStart[v + 1]; k++) step(g.parentList[k]);
		for (let k = g.childStart[v]; k < g.childStart[v + 1]; k++) step(g.childList[k]);
	}
	return seen;
}

interface Frame {
	next: number[];
	pos: number;
}

/** Shared backtracking: `expand` lists the viable next variables of the path's last one. */
function backtrack(
	g: CompiledDag,
	X: readonly number[],
	inY: Mask,
	expand: (path: readonly number[], onPath: Mask) => number[],
	visit: Visit,
	budget: { left: number }
): boolean {
	const onPath = new Uint8Array(g.n);
	const path: number[] = [];
	for (const x of X) {
		onPath[x] = 1;
		path.push(x);
		const stack: Frame[] = [{ next: expand(path, onPath), pos: 0 }];
		while (stack.length > 0) {
			const top = stack[stack.length - 1];
			if (top.pos === top.next.length) {
				stack.pop();
				onPath[path.pop()!] = 0;
				continue;
			}
			const w = top.next[top.pos++];
			if (inY[w]) {
				if (!visit([...path, w])) return true;
				continue;
			}
			if (--budget.left < 0) return true;
			onPath[w] = 1;
			path.push(w);
			stack.push({ next: expand(path, onPath), pos: 0 });
		}
	}
	return false;
}

/** Visits every directed path from X to Y. Returns true when stopped early. */
export function visitCausalPaths(g: CompiledDag, X: readonly number[], Y: readonly number[], visit: Visit, budget: { left: number }): boolean {
	const inX = maskOf(g.n, X);
	const inY = maskOf(g.n, Y);
	const completes = reachesOutcome(g, inX, Y);
	const expand = (path: readonly number[]): number[] => {
		const v = path[path.length - 1];
		const out: number[] = [];
		for (let k = g.childStart[v]; k < g.childStart[v + 1]; k++) {
			const w = g.childList[k];
			if (!inX[w] && completes[w]) out.push(w);
		}
		return out;
	};
	return backtrack(g, X, inY, expand, visit, budget);
}

/** Visits every simple path from X to Y in the skeleton. Returns true when stopped early. */
export function visitSimplePaths(g: CompiledDag, X: readonly number[], Y: readonly number[], visit: Visit, budget: { left: number }): boolean {
	const inX = maskOf(g.n, X);
	const inY = maskOf(g.n, Y);
	const expand = (path: readonly number[], onPath: Mask): number[] => {
		const v = path[path.length - 1];
		const completes = skeletonReach(g, inX, inY, onPath);
		budget.left -= g.n;
		const out: number[] = [];
		const consider = (w: number) => {
			if (!onPath[w] && !inX[w] && completes[w]) out.push(w);
		};
		for (let k = g.parentStart[v]; k < g.parentStart[v + 1]; k++) consider(g.parentList[k]);
		for (let k = g.childStart[v]; k < g.childStart[v + 1]; k++) consider(g.childList[k]);
		return out;
	};
	return backtrack(g, X, inY, expand, visit, budget);
}
