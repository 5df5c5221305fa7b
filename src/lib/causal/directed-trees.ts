/**
 * Shortest directed paths as breadth-first trees, used to build witness paths quickly:
 * from X downwards, from Z upwards, and from X through a proper causal path node (a path that
 * shows a variable lies below cn(X, Y), i.e. in Dpcp). Each tree costs O(n + m); reading a
 * path off a tree costs its length.
 */
import type { CompiledDag } from '../graph/compiled';
import type { ProperCausalStructure } from './proper-causal';
import type { Mask } from './reach';

export interface DirectedTree {
	/** Arrows from the nearest source, -1 when unreachable. */
	dist: Int32Array;
	/** The previous variable on a shortest path from the sources (-1 for sources). */
	via: Int32Array;
}

/**
 * BFS from `sources` along arrows (`down`: to children; `up`: to parents), never entering a
 * variable of `avoid` after the start. O(n + m).
 */
export function directedTree(g: CompiledDag, sources: readonly number[], direction: 'down' | 'up', avoid?: Mask): DirectedTree {
	const [start, list] = direction === 'down' ? [g.childStart, g.childList] : [g.parentStart, g.parentList];
	const dist = new Int32Array(g.n).fill(-1);
	const via = new Int32Array(g.n).fill(-1);
	const queue = new Int32Array(g.n);
	let tail = 0;
	for (const s of sources) {
		if (dist[s] === -1) {
			dist[s] = 0;
			queue[tail++] = s;
		}
	}
	for (let head = 0; head < tail; head++) {
		const v = queue[head];
		for (let k = start[v]; k < start[v + 1]; k++) {
			const w = list[k];
			if (dist[w] !== -1 || (avoid && avoid[w])) continue;
			dist[w] = dist[v] + 1;
			via[w] = v;
			queue[tail++] = w;
		}
	}
	return { dist, via };
}

/** The tree path from a source to v (source first). */
export function pathTo(tree: DirectedTree, v: number): number[] {
	const path: number[] = [];
	for (let w = v; w !== -1; w = tree.via[w]) path.push(w);
	return path.reverse();
}

/** The tree path from v to a source (v first), for trees grown upwards. */
export function pathFrom(tree: DirectedTree, v: number): number[] {
	return pathTo(tree, v).reverse();
}

/**
 * Shortest directed paths from X that pass a variable of cn(X, Y) (X not re-entered):
 * dist[v] = arrows on the shortest x → … → w → … → v with w ∈ cn, -1 when none. A BFS over
 * (variable, passed cn yet) states, O(n + m).
 */
export function causalTree(g: CompiledDag, s: ProperCausalStructure, X: readonly number[]): { dist: Int32Array; path(v: number): number[] } {
	const n = g.n;
	const dist = new Int32Array(2 * n).fill(-1);
	const via = new Int32Array(2 * n).fill(-1);
	const queue = new Int32Array(2 * n);
	let tail = 0;
	for (const x of X) {
		if (dist[2 * x] === -1) {
			dist[2 * x] = 0;
			queue[tail++] = 2 * x;
		}
	}
	for (let head = 0; head < tail; head++) {
		const state = queue[head];
		const v = state >> 1;
		const passed = state & 1;
		for (let k = g.childStart[v]; k < g.childStart[v + 1]; k++) {
			const w = g.childList[k];
			if (s.inX[w]) continue;
			const next = 2 * w + (passed | s.causalNodes[w]);
			if (dist[next] !== -1) continue;
			dist[next] = dist[state] + 1;
			via[next] = state;
			queue[tail++] = next;
		}
	}
	const layer = new Int32Array(n);
	for (let v = 0; v < n; v++) layer[v] = dist[2 * v + 1];
	return {
		dist: layer,
		path(v: number): number[] {
			const out: number[] = [];
			for (let st = 2 * v + 1; st !== -1; st = via[st]) out.push(st >> 1);
			return out.reverse();
		}
	};
}
