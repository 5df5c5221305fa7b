/**
 * Single-arrow edits of a compiled diagram and the descendant relation used to keep them
 * acyclic. Each edit copies the CSR arrays once, O(n + m).
 */
import type { CompiledDag } from '../graph/compiled';
import { descendantsOf, withoutArrows } from './reach';

/** The graph with the arrow u → v added (the caller keeps the graph acyclic). O(n + m). */
export function withArrow(g: CompiledDag, u: number, v: number): CompiledDag {
	const n = g.n;
	const m = g.childList.length;
	const childStart = new Int32Array(n + 1);
	const parentStart = new Int32Array(n + 1);
	for (let w = 0; w < n; w++) {
		childStart[w + 1] = childStart[w] + (g.childStart[w + 1] - g.childStart[w]) + (w === u ? 1 : 0);
		parentStart[w + 1] = parentStart[w] + (g.parentStart[w + 1] - g.parentStart[w]) + (w === v ? 1 : 0);
	}
	const childList = new Int32Array(m + 1);
	const parentList = new Int32Array(m + 1);
	for (let w = 0; w < n; w++) {
		let c = childStart[w];
		for (let k = g.childStart[w]; k < g.childStart[w + 1]; k++) childList[c++] = g.childList[k];
		if (w === u) childList[c] = v;
		let p = parentStart[w];
		for (let k = g.parentStart[w]; k < g.parentStart[w + 1]; k++) parentList[p++] = g.parentList[k];
		if (w === v) parentList[p] = u;
	}
	return { n, ids: g.ids, indexOf: g.indexOf, measured: g.measured, childStart, childList, parentStart, parentList };
}

/** The graph with the arrow u → v turned into v → u. O(n + m). */
export function withArrowReversed(g: CompiledDag, u: number, v: number): CompiledDag {
	return withArrow(
		withoutArrows(g, (a, b) => a === u && b === v),
		v,
		u
	);
}

/** The graph with variable v marked unmeasured. O(n). */
export function withUnmeasured(g: CompiledDag, v: number): CompiledDag {
	const measured = g.measured.slice();
	measured[v] = 0;
	return { ...g, measured };
}

/**
 * The descendant relation as an n × n byte matrix: row v holds De(v) (v included).
 * One BFS per variable, O(n (n + m)) time, n² bytes.
 */
export class DescendantMatrix {
	readonly #n: number;
	readonly #rows: Uint8Array;

	constructor(g: CompiledDag) {
		this.#n = g.n;
		this.#rows = new Uint8Array(g.n * g.n);
		for (let v = 0; v < g.n; v++) this.#rows.set(descendantsOf(g, [v]), v * g.n);
	}

	/** True when d is a descendant of v (or v itself). O(1). */
	has(v: number, d: number): boolean {
		return this.#rows[v * this.#n + d] === 1;
	}
}

/** Adding u → v keeps the graph acyclic iff u is not a descendant of v. */
export function canAddArrow(de: DescendantMatrix, u: number, v: number): boolean {
	return u !== v && !de.has(v, u);
}

/** Reversing the present arrow u → v keeps it acyclic iff no other directed path u ⇝ v exists. */
export function canReverseArrow(g: CompiledDag, de: DescendantMatrix, u: number, v: number): boolean {
	for (let k = g.childStart[u]; k < g.childStart[u + 1]; k++) {
		const c = g.childList[k];
		if (c !== v && de.has(c, v)) return false;
	}
	return true;
}
