/**
 * The brute-force oracle's graph basics, paths and d-separation (Pearl 1988), read from the
 * CSR arrays of a CompiledDag and sharing no code with src/lib/causal. Part of the oracle in
 * brute-force.ts (see its header for the method); exponential by design.
 */
import type { CompiledDag } from '../../../src/lib/graph/compiled';

// ---------------------------------------------------------------------------------------
// Graph basics, read from the CSR arrays.

/** Plain adjacency lists and an arrow matrix, read once per graph from the CSR arrays. */
interface Lists {
	parents: number[][];
	children: number[][];
	neighbours: number[][];
	arrow: Uint8Array;
	descendants: Set<number>[];
}
const listsCache = new WeakMap<CompiledDag, Lists>();

function lists(g: CompiledDag): Lists {
	let l = listsCache.get(g);
	if (!l) {
		const parents: number[][] = [];
		const children: number[][] = [];
		const arrow = new Uint8Array(g.n * g.n);
		for (let v = 0; v < g.n; v++) {
			parents.push(Array.from(g.parentList.subarray(g.parentStart[v], g.parentStart[v + 1])));
			children.push(Array.from(g.childList.subarray(g.childStart[v], g.childStart[v + 1])));
			for (const c of children[v]) arrow[v * g.n + c] = 1;
		}
		const neighbours = parents.map((ps, v) => [...new Set([...ps, ...children[v]])]);
		l = { parents, children, neighbours, arrow, descendants: [] };
		listsCache.set(g, l);
	}
	return l;
}

export function parentsOf(g: CompiledDag, v: number): number[] {
	return lists(g).parents[v];
}

export function childrenOf(g: CompiledDag, v: number): number[] {
	return lists(g).children[v];
}

/** True when the arrow a → b is in g. */
export function hasArrow(g: CompiledDag, a: number, b: number): boolean {
	return lists(g).arrow[a * g.n + b] === 1;
}

export function adjacent(g: CompiledDag, a: number, b: number): boolean {
	return hasArrow(g, a, b) || hasArrow(g, b, a);
}

function neighboursOf(g: CompiledDag, v: number): number[] {
	return lists(g).neighbours[v];
}

/** Descendants of v, including v itself (the usual convention, De(v) ∋ v). Cached per graph. */
export function descendantsOf(g: CompiledDag, v: number): Set<number> {
	const cache = lists(g).descendants;
	const hit = cache[v];
	if (hit) return hit;
	const seen = reach(v, (u) => childrenOf(g, u));
	cache[v] = seen;
	return seen;
}

/** Ancestors of v, including v itself. */
export function ancestorsOf(g: CompiledDag, v: number): Set<number> {
	return reach(v, (u) => parentsOf(g, u));
}

/** v and everything reachable from it by `next`, by a depth-first search. */
function reach(v: number, next: (u: number) => Iterable<number>): Set<number> {
	const seen = new Set<number>([v]);
	const stack = [v];
	while (stack.length > 0) {
		const u = stack.pop() as number;
		for (const w of next(u))
			if (!seen.has(w)) {
				seen.add(w);
				stack.push(w);
			}
	}
	return seen;
}

/** The graph with the listed arrows removed (same ids, same measured flags). */
export function withoutArrows(g: CompiledDag, drop: (from: number, to: number) => boolean): CompiledDag {
	const parents: number[][] = [];
	const children: number[][] = [];
	for (let v = 0; v < g.n; v++) {
		parents.push(parentsOf(g, v).filter((p) => !drop(p, v)));
		children.push(childrenOf(g, v).filter((c) => !drop(v, c)));
	}
	const csr = (lists: number[][]) => {
		const start = new Int32Array(g.n + 1);
		lists.forEach((l, v) => (start[v + 1] = start[v] + l.length));
		return { start, list: Int32Array.from(lists.flat()) };
	};
	const p = csr(parents);
	const c = csr(children);
	return { ...g, parentStart: p.start, parentList: p.list, childStart: c.start, childList: c.list };
}

// ---------------------------------------------------------------------------------------
// Paths.

/**
 * Every simple path of the skeleton from `a` to `b` whose interior avoids `avoid`
 * (plain depth-first enumeration).
 */
export function simplePaths(g: CompiledDag, a: number, b: number, avoid: ReadonlySet<number> = new Set()): number[][] {
	const out: number[][] = [];
	const path = [a];
	const onPath = new Set([a]);
	const walk = (u: number) => {
		for (const w of neighboursOf(g, u)) {
			if (onPath.has(w)) continue;
			if (w === b) {
				out.push([...path, b]);
				continue;
			}
			if (avoid.has(w)) continue;
			path.push(w);
			onPath.add(w);
			walk(w);
			path.pop();
			onPath.delete(w);
		}
	};
	if (a !== b) walk(a);
	return out;
}

/** True when path[i] is a collider on the path (path[i-1] → path[i] ← path[i+1]). */
export function isColliderAt(g: CompiledDag, path: readonly number[], i: number): boolean {
	return hasArrow(g, path[i - 1], path[i]) && hasArrow(g, path[i + 1], path[i]);
}

/** A directed path from its first node to its last (every arrow points forward). */
export function isDirected(g: CompiledDag, path: readonly number[]): boolean {
	for (let i = 0; i + 1 < path.length; i++) if (!hasArrow(g, path[i], path[i + 1])) return false;
	return true;
}

/** Consecutive nodes adjacent, no repeated node. */
export function isSimplePathInSkeleton(g: CompiledDag, path: readonly number[]): boolean {
	if (path.length < 2 || new Set(path).size !== path.length) return false;
	for (let i = 0; i + 1 < path.length; i++) if (!adjacent(g, path[i], path[i + 1])) return false;
	return true;
}

/**
 * Interior node i is open given Z (Pearl 1988): a non-collider not in Z, or a collider that
 * is in Z or has a descendant in Z.
 */
function interiorOpen(g: CompiledDag, path: readonly number[], i: number, z: ReadonlySet<number>): boolean {
	if (isColliderAt(g, path, i)) {
		for (const d of descendantsOf(g, path[i])) if (z.has(d)) return true;
		return false;
	}
	return !z.has(path[i]);
}

/** A path is open (d-connecting) given Z when every interior node is open. */
export function isOpenPath(g: CompiledDag, path: readonly number[], z: ReadonlySet<number>): boolean {
	for (let i = 1; i + 1 < path.length; i++) if (!interiorOpen(g, path, i, z)) return false;
	return true;
}

// ---------------------------------------------------------------------------------------
// d-separation.

/**
 * X and Y are d-separated by Z when no path between a node of X and a node of Y is open.
 * Depth-first over simple paths; a prefix whose last interior node is already blocked is
 * not extended (the status of an interior node depends only on its two path neighbours, so
 * no extension could reopen it). Returns one open path, or null.
 */
export function findOpenPath(
	g: CompiledDag,
	from: readonly number[],
	to: readonly number[],
	given: readonly number[]
): number[] | null {
	const z = new Set(given);
	const targets = new Set(to);
	for (const a of from) {
		const path = [a];
		const onPath = new Set([a]);
		const walk = (): number[] | null => {
			const u = path[path.length - 1];
			for (const w of neighboursOf(g, u)) {
				if (onPath.has(w)) continue;
				path.push(w);
				// u is now interior (when it is not the start): is it open?
				if (path.length >= 3 && !interiorOpen(g, path, path.length - 2, z)) {
					path.pop();
					continue;
				}
				if (targets.has(w)) return [...path];
				onPath.add(w);
				const found = walk();
				if (found) return found;
				onPath.delete(w);
				path.pop();
			}
			return null;
		};
		const found = walk();
		if (found) return found;
	}
	return null;
}

export function dSeparatedOracle(
	g: CompiledDag,
	from: readonly number[],
	to: readonly number[],
	given: readonly number[]
): boolean {
	return findOpenPath(g, from, to, given) === null;
}
