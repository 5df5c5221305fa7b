/**
 * The layout's view of a diagram: nodes as indices 0..n-1 and arrows in compressed sparse
 * row (CSR) form, both directions, in typed arrays. Ids are looked up once in a Map, so an id
 * such as "__proto__" is an ordinary key. Self-loops, repeated arrows and arrows to unlisted
 * nodes are left out (they do not change a layered drawing). O(n + m).
 */
import type { LayoutInput } from '../types';

export interface IndexGraph {
	n: number;
	/** succ[succStart[v] .. succStart[v + 1]) are v's successors. */
	succStart: Int32Array;
	succ: Int32Array;
	/** pred[predStart[v] .. predStart[v + 1]) are v's predecessors. */
	predStart: Int32Array;
	pred: Int32Array;
}

/** CSR arrays of the arrow list `from[i] → to[i]` over n nodes, by counting sort. O(n + m). */
export function csr(n: number, from: ArrayLike<number>, to: ArrayLike<number>): { start: Int32Array; list: Int32Array } {
	const start = new Int32Array(n + 1);
	for (let i = 0; i < from.length; i++) start[from[i] + 1]++;
	for (let v = 0; v < n; v++) start[v + 1] += start[v];
	const fill = start.slice(0, n);
	const list = new Int32Array(from.length);
	for (let i = 0; i < from.length; i++) list[fill[from[i]]++] = to[i];
	return { start, list };
}

export function graphOf(n: number, from: ArrayLike<number>, to: ArrayLike<number>): IndexGraph {
	const out = csr(n, from, to);
	const back = csr(n, to, from);
	return { n, succStart: out.start, succ: out.list, predStart: back.start, pred: back.list };
}

/** The input's arrows as index pairs (first listed node wins for a repeated id). O(n + m). */
export function indexGraph(input: LayoutInput): IndexGraph {
	const n = input.nodes.length;
	const indexOf = new Map<string, number>();
	input.nodes.forEach((node, i) => {
		if (!indexOf.has(node.id)) indexOf.set(node.id, i);
	});
	const seen = new Set<number>();
	const from: number[] = [];
	const to: number[] = [];
	for (const a of input.arrows) {
		const u = indexOf.get(a.from);
		const v = indexOf.get(a.to);
		if (u === undefined || v === undefined || u === v) continue;
		const key = u * n + v;
		if (seen.has(key)) continue;
		seen.add(key);
		from.push(u);
		to.push(v);
	}
	return graphOf(n, from, to);
}
