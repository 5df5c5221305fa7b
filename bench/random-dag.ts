/** Seeded random DAGs for the benchmarks: n variables, about `degree` arrows per variable. */
import { compileDag, type CompiledDag } from '../src/lib/graph/compiled';

export function xorshift(seed: number): () => number {
	let s = seed >>> 0 || 1;
	return () => {
		s ^= s << 13;
		s ^= s >>> 17;
		s ^= s << 5;
		return (s >>> 0) / 2 ** 32;
	};
}

export interface BenchDag {
	g: CompiledDag;
	arrows: [number, number][];
}

/** Arrows go from lower to higher position in a random order, so the graph is acyclic. */
export function randomDag(n: number, degree: number, seed: number): BenchDag {
	const rand = xorshift(seed);
	const order = Array.from({ length: n }, (_, i) => i);
	for (let i = n - 1; i > 0; i--) {
		const j = Math.floor(rand() * (i + 1));
		[order[i], order[j]] = [order[j], order[i]];
	}
	const m = Math.round((n * degree) / 2);
	const seen = new Set<number>();
	const arrows: [number, number][] = [];
	// Local arrows (position distance ≤ 50) keep paths long and graphs realistic.
	while (arrows.length < m) {
		const a = Math.floor(rand() * n);
		const b = Math.min(n - 1, a + 1 + Math.floor(rand() * 50));
		if (a === b) continue;
		const key = a * n + b;
		if (seen.has(key)) continue;
		seen.add(key);
		arrows.push([order[a], order[b]]);
	}
	const ids = Array.from({ length: n }, (_, i) => `v${i}`);
	return { g: compileDag(ids, arrows.map(([f, t]) => ({ from: ids[f], to: ids[t] }))), arrows };
}

export function randomQuery(n: number, rand: () => number, zSize: number): { X: number[]; Y: number[]; Z: number[] } {
	const pick = new Set<number>();
	const take = () => {
		for (;;) {
			const v = Math.floor(rand() * n);
			if (!pick.has(v)) {
				pick.add(v);
				return v;
			}
		}
	};
	const X = [take()];
	const Y = [take()];
	const Z = Array.from({ length: Math.min(zSize, n - 2) }, take);
	return { X, Y, Z };
}
