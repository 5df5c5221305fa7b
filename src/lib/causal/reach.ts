/**
 * Directed reachability over a CompiledDag: ancestors and descendants of a set, optionally
 * without entering some variables. Plain breadth-first search, O(n + m) time, O(n) space.
 */
import type { CompiledDag } from '../graph/compiled';

/** A membership mask over the variables (1 = member). */
export type Mask = Uint8Array;

export function maskOf(n: number, members: Iterable<number>): Mask {
	const mask = new Uint8Array(n);
	for (const v of members) mask[v] = 1;
	return mask;
}

export function membersOf(mask: Mask): number[] {
	const out: number[] = [];
	for (let v = 0; v < mask.length; v++) if (mask[v]) out.push(v);
	return out;
}

function reach(
	g: CompiledDag,
	start: readonly number[],
	starts: Int32Array,
	list: Int32Array,
	avoid: Mask | undefined
): Mask {
	const seen = new Uint8Array(g.n);
	const queue = new Int32Array(g.n);
	let head = 0;
	let tail = 0;
	for (const s of start) {
		if (!seen[s]) {
			seen[s] = 1;
			queue[tail++] = s;
		}
	}
	while (head < tail) {
		const v = queue[head++];
		for (let k = starts[v]; k < starts[v + 1]; k++) {
			const w = list[k];
			if (seen[w] || (avoid && avoid[w])) continue;
			seen[w] = 1;
			queue[tail++] = w;
		}
	}
	return seen;
}

/**
 * The start variables and every variable with a directed path to one of them. Variables in
 * `avoid` are never entered (start variables are always included). O(n + m).
 */
export function ancestorsOf(g: CompiledDag, start: readonly number[], avoid?: Mask): Mask {
	return reach(g, start, g.parentStart, g.parentList, avoid);
}

/**
 * The start variables and every variable reachable from them by a directed path. Variables in
 * `avoid` are never entered (start variables are always included). O(n + m).
 */
export function descendantsOf(g: CompiledDag, start: readonly number[], avoid?: Mask): Mask {
	return reach(g, start, g.childStart, g.childList, avoid);
}

/** True when the compiled arrows contain u → v. O(outdeg(u)). */
export function hasArrow(g: CompiledDag, u: number, v: number): boolean {
	for (let k = g.childStart[u]; k < g.childStart[u + 1]; k++) if (g.childList[k] === v) return true;
	return false;
}

/** True when u and v are joined by an arrow either way. */
export function adjacent(g: CompiledDag, u: number, v: number): boolean {
	return hasArrow(g, u, v) || hasArrow(g, v, u);
}

/**
 * A copy of the graph without the arrows for which `drop(from, to)` is true. O(n + m).
 * Used for the proper back-door graph and for graphs with an arrow cut.
 */
export function withoutArrows(g: CompiledDag, drop: (from: number, to: number) => boolean): CompiledDag {
	const n = g.n;
	const childStart = new Int32Array(n + 1);
	const parentStart = new Int32Array(n + 1);
	const kept: number[] = [];
	for (let u = 0; u < n; u++) {
		for (let k = g.childStart[u]; k < g.childStart[u + 1]; k++) {
			const v = g.childList[k];
			if (drop(u, v)) continue;
			kept.push(u, v);
			childStart[u + 1]++;
			parentStart[v + 1]++;
		}
	}
	for (let v = 0; v < n; v++) {
		childStart[v + 1] += childStart[v];
		parentStart[v + 1] += parentStart[v];
	}
	const m = kept.length / 2;
	const childList = new Int32Array(m);
	const parentList = new Int32Array(m);
	const cFill = childStart.slice(0, n);
	const pFill = parentStart.slice(0, n);
	for (let e = 0; e < m; e++) {
		const u = kept[2 * e];
		const v = kept[2 * e + 1];
		childList[cFill[u]++] = v;
		parentList[pFill[v]++] = u;
	}
	return { n, ids: g.ids, indexOf: g.indexOf, measured: g.measured, childStart, childList, parentStart, parentList };
}
