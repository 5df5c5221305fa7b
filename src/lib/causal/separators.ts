/**
 * Minimal and minimum vertex separators between the source and sink of a contracted moral
 * graph (moral-graph.ts), restricted to removable vertices. With the moral graph of
 * An(X ∪ Y) these are exactly the minimal / minimum d-separators Z ⊆ R of X and Y
 * (van der Zander, Liśkiewicz & Textor 2019, Lemmas 3.4 and 3.5: every minimal separator lies
 * in An(X ∪ Y), and there d-separation equals separation in the moral graph).
 *
 * Listing: the "close separator" scheme of Kloks & Kratsch (SIAM J. Comput. 27, 1998) and
 * Takata (Discrete Applied Math. 158, 2010). closeSeparator(A) is the minimal separator whose
 * sink side is largest among those with A on the source side. Every minimal separator T is
 * reached from closeSeparator({source}) by repeatedly taking a separator S and a vertex
 * x ∈ S and forming closeSeparator(C_source(S) ∪ {x}): for S ≠ T with C_s(S) ⊊ C_s(T), some
 * x ∈ S lies in C_s(T), and the separator so formed has C_s(S) ⊊ C_s(S') ⊆ C_s(T).
 * Each separator costs O(|S| (n + m)) to expand, so the delay between outputs is polynomial,
 * O(n (n + m)); already-seen separators are skipped through a hash set.
 */
import type { ContractedMoralGraph } from './moral-graph';

/** Vertices reachable from `start` without entering `blocked`. O(n + m). */
export function componentOf(h: ContractedMoralGraph, start: number, blocked: Uint8Array): Uint8Array {
	const seen = new Uint8Array(h.size);
	const stack = [start];
	seen[start] = 1;
	while (stack.length > 0) {
		const u = stack.pop()!;
		for (const w of h.adjacency[u]) {
			if (seen[w] || blocked[w]) continue;
			seen[w] = 1;
			stack.push(w);
		}
	}
	return seen;
}

/**
 * The minimal separator closest to the sink side among those keeping `seed` on the source
 * side, or null when none exists (a non-removable path joins seed and sink). O(n + m).
 */
export function closeSeparator(h: ContractedMoralGraph, seed: Iterable<number>): number[] | null {
	const side = new Uint8Array(h.size);
	const boundary = new Uint8Array(h.size);
	const boundaryList: number[] = [];
	const stack: number[] = [];
	for (const v of seed) {
		if (!side[v]) {
			side[v] = 1;
			stack.push(v);
		}
	}
	// Grow the source side through every vertex that cannot be removed.
	while (stack.length > 0) {
		const u = stack.pop()!;
		for (const w of h.adjacency[u]) {
			if (side[w]) continue;
			if (w === h.sink) return null;
			if (h.removable[w]) {
				if (!boundary[w]) {
					boundary[w] = 1;
					boundaryList.push(w);
				}
			} else {
				side[w] = 1;
				stack.push(w);
			}
		}
	}
	// Absorbed vertices may have been recorded as boundary before; drop them.
	const sinkSide = componentOf(h, h.sink, boundary);
	const separator: number[] = [];
	for (const w of boundaryList) {
		if (side[w]) continue;
		if (h.adjacency[w].some((u) => sinkSide[u])) separator.push(w);
	}
	return separator.sort((p, q) => p - q);
}

export interface SeparatorListing {
	sets: number[][];
	truncated: boolean;
}

/** Lists minimal source–sink separators, at most `max` of them. Delay O(n (n + m)). */
export function listMinimalSeparators(h: ContractedMoralGraph, max: number = Infinity): SeparatorListing {
	const first = closeSeparator(h, [h.source]);
	if (first === null) return { sets: [], truncated: false };
	const seen = new Set<string>([first.join(',')]);
	const pending: number[][] = [first];
	const sets: number[][] = [];
	while (pending.length > 0) {
		if (sets.length >= max) return { sets, truncated: true };
		const s = pending.pop()!;
		sets.push(s);
		const blocked = new Uint8Array(h.size);
		for (const v of s) blocked[v] = 1;
		const sourceSide = componentOf(h, h.source, blocked);
		const sideList: number[] = [];
		for (let v = 0; v < h.size; v++) if (sourceSide[v]) sideList.push(v);
		for (const x of s) {
			sideList.push(x);
			const next = closeSeparator(h, sideList);
			sideList.pop();
			if (next === null) continue;
			const key = next.join(',');
			if (seen.has(key)) continue;
			seen.add(key);
			pending.push(next);
		}
	}
	return { sets, truncated: false };
}

/**
 * A minimum-size source–sink separator of removable vertices: a minimum vertex cut found by
 * maximum flow (Edmonds–Karp) on the vertex-split graph, each removable vertex carrying
 * capacity 1. Returns null when no separator exists. O(k (n + m)) for a cut of size k.
 * Of all minimum cuts it returns the one nearest the source.
 */
export function minimumSeparator(h: ContractedMoralGraph): number[] | null {
	const INF = 1 << 29;
	const nodes = 2 * h.size; // v_in = 2v, v_out = 2v + 1
	const head = new Int32Array(nodes).fill(-1);
	const to: number[] = [];
	const cap: number[] = [];
	const next: number[] = [];
	const addArc = (u: number, v: number, c: number) => {
		to.push(v); cap.push(c); next.push(head[u]); head[u] = to.length - 1;
		to.push(u); cap.push(0); next.push(head[v]); head[v] = to.length - 1;
	};
	for (let v = 0; v < h.size; v++) addArc(2 * v, 2 * v + 1, h.removable[v] ? 1 : INF);
	for (let u = 0; u < h.size; u++) for (const w of h.adjacency[u]) addArc(2 * u + 1, 2 * w, INF);
	const s = 2 * h.source + 1;
	const t = 2 * h.sink;
	const viaArc = new Int32Array(nodes);
	const reached = new Uint8Array(nodes);
	const bfs = (): boolean => {
		reached.fill(0);
		const queue = [s];
		reached[s] = 1;
		for (let i = 0; i < queue.length; i++) {
			const u = queue[i];
			for (let e = head[u]; e !== -1; e = next[e]) {
				const v = to[e];
				if (reached[v] || cap[e] <= 0) continue;
				reached[v] = 1;
				viaArc[v] = e;
				if (v === t) return true;
				queue.push(v);
			}
		}
		return false;
	};
	let flow = 0;
	while (bfs()) {
		let bottleneck = INF;
		for (let v = t; v !== s; v = to[viaArc[v] ^ 1]) bottleneck = Math.min(bottleneck, cap[viaArc[v]]);
		if (bottleneck >= INF) return null;
		for (let v = t; v !== s; v = to[viaArc[v] ^ 1]) {
			cap[viaArc[v]] -= bottleneck;
			cap[viaArc[v] ^ 1] += bottleneck;
		}
		flow += bottleneck;
		if (flow >= INF) return null;
	}
	// reached[] now holds the residual source side after the final, failed search.
	const cut: number[] = [];
	for (let v = 0; v < h.size; v++) if (reached[2 * v] && !reached[2 * v + 1]) cut.push(v);
	return cut;
}
