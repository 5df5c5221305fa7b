/**
 * Layer assignment, the first step of a layered drawing (Sugiyama, Tagawa & Toda 1981):
 * every arrow must point from a lower layer to a higher one (down the page).
 *
 * 1. A topological order by Kahn's algorithm (Kahn 1962). A diagram being edited may still
 *    hold a cycle (the editor names it, the drawing must not fail), so when no node is free
 *    the first unplaced node in input order is taken anyway and its remaining in-arrows are
 *    drawn reversed: a simple feedback-arc choice, O(n) in all thanks to a moving pointer.
 * 2. Longest-path layering: a node's layer is one more than the highest layer of its
 *    predecessors. It uses the fewest layers any layering can (the longest path's length)
 *    and takes O(n + m) (Healy & Nikolov, "Hierarchical drawing algorithms", Handbook of
 *    Graph Drawing and Visualization, 2013, §13.3.1).
 * 3. Sources are then moved down to just above their nearest successor, so a variable with
 *    one late child does not sit at the top with a long arrow (the usual refinement of
 *    longest-path layering; the layer count is unchanged). O(n + m).
 *
 * Iterative throughout: a 10,000-variable chain is a 10,000-deep walk, far past any stack.
 */
import { graphOf, type IndexGraph } from './index-graph';

export interface Layering {
	/** The arrows, each oriented along the topological order (reversed ones flipped). */
	dag: IndexGraph;
	/** Topological order of `dag`. */
	order: Int32Array;
	/** layer[v] ≥ 0; every arrow u → v of `dag` has layer[u] < layer[v]. */
	layer: Int32Array;
	layerCount: number;
}

/** Kahn's order, breaking cycles at the first unplaced node. O(n + m). */
export function topologicalOrder(g: IndexGraph): Int32Array {
	const { n, succStart, succ, predStart } = g;
	const indeg = new Int32Array(n);
	for (let v = 0; v < n; v++) indeg[v] = predStart[v + 1] - predStart[v];
	const placed = new Uint8Array(n);
	const order = new Int32Array(n);
	// Each node enters the queue at most twice (once forced, once when freed), so 2n slots suffice.
	const queue = new Int32Array(2 * n);
	let head = 0;
	let tail = 0;
	for (let v = 0; v < n; v++) if (indeg[v] === 0) queue[tail++] = v;
	let count = 0;
	let pointer = 0;
	while (count < n) {
		if (head === tail) {
			while (placed[pointer]) pointer++;
			queue[tail++] = pointer;
		}
		const v = queue[head++];
		if (placed[v]) continue;
		placed[v] = 1;
		order[count++] = v;
		for (let i = succStart[v]; i < succStart[v + 1]; i++) {
			const w = succ[i];
			if (--indeg[w] === 0 && !placed[w]) queue[tail++] = w;
		}
	}
	return order;
}

/** Layers for every node, with the arrows oriented so that each goes down. O(n + m). */
export function assignLayers(g: IndexGraph): Layering {
	const { n, succStart, succ } = g;
	const order = topologicalOrder(g);
	const rank = new Int32Array(n);
	for (let i = 0; i < n; i++) rank[order[i]] = i;
	const from: number[] = [];
	const to: number[] = [];
	for (let u = 0; u < n; u++)
		for (let i = succStart[u]; i < succStart[u + 1]; i++) {
			const v = succ[i];
			if (rank[u] < rank[v]) {
				from.push(u);
				to.push(v);
			} else {
				from.push(v);
				to.push(u);
			}
		}
	const dag = graphOf(n, from, to);
	const layer = new Int32Array(n);
	for (let i = 0; i < n; i++) {
		const v = order[i];
		for (let j = dag.predStart[v]; j < dag.predStart[v + 1]; j++) layer[v] = Math.max(layer[v], layer[dag.pred[j]] + 1);
	}
	for (let i = n - 1; i >= 0; i--) {
		const v = order[i];
		if (dag.predStart[v + 1] > dag.predStart[v] || dag.succStart[v + 1] === dag.succStart[v]) continue;
		let nearest = Infinity;
		for (let j = dag.succStart[v]; j < dag.succStart[v + 1]; j++) nearest = Math.min(nearest, layer[dag.succ[j]]);
		layer[v] = nearest - 1;
	}
	let layerCount = 0;
	for (let v = 0; v < n; v++) layerCount = Math.max(layerCount, layer[v] + 1);
	return { dag, order, layer, layerCount };
}
