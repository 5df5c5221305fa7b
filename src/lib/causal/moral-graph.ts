/**
 * The moral graph of the ancestral set of X ∪ Y, with X contracted into one source vertex and
 * Y into one sink vertex — the undirected graph in which d-separation by a set Z ⊆ An(X ∪ Y)
 * becomes plain vertex separation (Lauritzen, Dawid, Larsen & Leimer, Networks 1990; used
 * for listing separators by van der Zander, Liśkiewicz & Textor 2019, §4).
 *
 * Vertices 0..n-1 are the diagram's variables (those outside An(X ∪ Y) stay isolated), n is
 * the source (all of X) and n + 1 the sink (all of Y). Building it is O(n + Σ indeg²).
 */
import type { CompiledDag } from '../graph/compiled';
import { ancestorsOf, type Mask } from './reach';

export interface ContractedMoralGraph {
	/** Number of vertices: the diagram's n plus source and sink. */
	size: number;
	source: number;
	sink: number;
	adjacency: number[][];
	/** 1 for vertices that a separator may contain. */
	removable: Uint8Array;
}

/**
 * Builds the contracted moral graph of G[An(X ∪ Y)]. `allowed` marks the variables a separator
 * may use; the others (and X, Y) are never removable. `alsoAncestorsOf` widens the ancestral
 * set to An(X ∪ Y ∪ I), as needed for separators that must contain I (van der Zander et al.
 * 2019, Lemma 3.4 with I ≠ ∅).
 */
export function contractedMoralGraph(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	allowed: Mask,
	alsoAncestorsOf: readonly number[] = []
): ContractedMoralGraph {
	const n = g.n;
	const source = n;
	const sink = n + 1;
	const size = n + 2;
	const anc = ancestorsOf(g, [...X, ...Y, ...alsoAncestorsOf]);
	const image = new Int32Array(n);
	for (let v = 0; v < n; v++) image[v] = v;
	for (const x of X) image[x] = source;
	for (const y of Y) image[y] = sink;
	const neighbourSets: Set<number>[] = Array.from({ length: size }, () => new Set<number>());
	const link = (u: number, w: number) => {
		if (u === w) return;
		neighbourSets[u].add(w);
		neighbourSets[w].add(u);
	};
	for (let v = 0; v < n; v++) {
		if (!anc[v]) continue;
		const start = g.parentStart[v];
		const end = g.parentStart[v + 1];
		for (let k = start; k < end; k++) {
			const p = g.parentList[k];
			link(image[v], image[p]);
			for (let l = k + 1; l < end; l++) link(image[p], image[g.parentList[l]]);
		}
	}
	const removable = new Uint8Array(size);
	for (let v = 0; v < n; v++) if (anc[v] && allowed[v] && image[v] === v) removable[v] = 1;
	return { size, source, sink, adjacency: neighbourSets.map((s) => [...s]), removable };
}
