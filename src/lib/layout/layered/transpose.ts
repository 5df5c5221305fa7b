/**
 * Transposition after the barycentre sweeps, as dot does (Gansner, Koutsofios, North & Vo,
 * IEEE TSE 1993, §3): neighbours in a row are swapped when that crosses fewer arrows, pass
 * after pass until no swap helps. Arrows are counted as crossing when their far ends lie in
 * the other order; a far end in another layer counts by its fraction along its own layer,
 * as in the sweeps (no dummy nodes).
 *
 * A pair costs deg(v) · deg(w); pairs past PAIR_BUDGET are left as the sweeps put them, so a
 * pass stays O(PAIR_BUDGET · n) even around a variable with hundreds of arrows.
 */
import type { IndexGraph } from './index-graph';

const PAIR_BUDGET = 4_096;
/** Most passes; random DAGs of a few dozen variables settle in two or three. */
const MAX_PASSES = 8;

/** Pairs a ∈ N(v), b ∈ N(w) with a after b, v placed left of w. O(deg v · deg w). */
function crossings(v: number, w: number, start: Int32Array, list: Int32Array, at: (u: number) => number): number {
	let count = 0;
	for (let i = start[v]; i < start[v + 1]; i++) {
		const a = at(list[i]);
		for (let j = start[w]; j < start[w + 1]; j++) if (a > at(list[j])) count++;
	}
	return count;
}

const degree = (g: IndexGraph, v: number) => g.predStart[v + 1] - g.predStart[v] + g.succStart[v + 1] - g.succStart[v];

/** Improves `layers` in place; `slot` holds each node's index in its row and is kept up to date. */
export function transpose(g: IndexGraph, layers: number[][], layer: Int32Array, slot: Float64Array): void {
	const at = (u: number) => (slot[u] + 0.5) / layers[layer[u]].length;
	const both = (v: number, w: number) => crossings(v, w, g.predStart, g.pred, at) + crossings(v, w, g.succStart, g.succ, at);
	for (let pass = 0; pass < MAX_PASSES; pass++) {
		let improved = false;
		for (const row of layers)
			for (let i = 0; i + 1 < row.length; i++) {
				const [v, w] = [row[i], row[i + 1]];
				if (degree(g, v) * degree(g, w) > PAIR_BUDGET) continue;
				if (both(w, v) < both(v, w)) {
					row[i] = w;
					row[i + 1] = v;
					slot[w] = i;
					slot[v] = i + 1;
					improved = true;
				}
			}
		if (!improved) return;
	}
}
