/**
 * A deliberately naive oracle for the causal engine, written straight from the definitions
 * in the engine's contract (d-separation, Pearl 1988; adjustment criterion, Shpitser,
 * VanderWeele & Robins 2010; single-door criterion, Pearl 2009 §5.3.1; optimal set O,
 * Henckel, Perković & Maathuis 2022; roles as the contract defines them) and sharing no code
 * with src/lib/causal (only the CompiledDag type and its CSR arrays are read).
 *
 * Method: enumerate every simple path of the skeleton and judge each one node by node.
 * Exponential in the size of the graph by design: meant for graphs of at most ~12 variables.
 * Set-valued questions ("is there a valid set", "is this set minimal") are answered by trying
 * every subset, encoded as a bitmask over the variables (so at most 30 variables there).
 */
import type { CompiledDag } from '../../../src/lib/graph/compiled';
import type { Role } from '../../../src/lib/causal/types';

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
	const seen = new Set<number>([v]);
	const stack = [v];
	while (stack.length > 0) {
		const u = stack.pop() as number;
		for (const c of childrenOf(g, u))
			if (!seen.has(c)) {
				seen.add(c);
				stack.push(c);
			}
	}
	cache[v] = seen;
	return seen;
}

/** Ancestors of v, including v itself. */
export function ancestorsOf(g: CompiledDag, v: number): Set<number> {
	const seen = new Set<number>([v]);
	const stack = [v];
	while (stack.length > 0) {
		const u = stack.pop() as number;
		for (const p of parentsOf(g, u))
			if (!seen.has(p)) {
				seen.add(p);
				stack.push(p);
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

// ---------------------------------------------------------------------------------------
// Paths as bitmask signatures, to judge many conditioning sets against one path list.

/** What decides whether a path is open: its non-colliders and, per collider, De(collider). */
interface PathSignature {
	nonColliders: number;
	colliderDescendants: number[];
}

export function maskOf(vs: Iterable<number>): number {
	let m = 0;
	for (const v of vs) m |= 1 << v;
	return m;
}

export function membersOf(mask: number): number[] {
	const out: number[] = [];
	for (let v = 0; mask >>> v !== 0; v++) if (mask & (1 << v)) out.push(v);
	return out;
}

function signatureOf(g: CompiledDag, path: readonly number[], descendantMask: readonly number[]): PathSignature {
	let nonColliders = 0;
	const colliderDescendants: number[] = [];
	for (let i = 1; i + 1 < path.length; i++) {
		if (isColliderAt(g, path, i)) colliderDescendants.push(descendantMask[path[i]]);
		else nonColliders |= 1 << path[i];
	}
	return { nonColliders, colliderDescendants };
}

/** Distinct signatures of the given paths (many paths share one). */
function signaturesOf(g: CompiledDag, paths: readonly number[][]): PathSignature[] {
	if (g.n > 30) throw new Error('bitmask oracle: at most 30 variables');
	const descendantMask = Array.from({ length: g.n }, (_, v) => maskOf(descendantsOf(g, v)));
	const byKey = new Map<string, PathSignature>();
	for (const p of paths) {
		const s = signatureOf(g, p, descendantMask);
		const key = `${s.nonColliders}|${[...s.colliderDescendants].sort((a, b) => a - b).join(',')}`;
		if (!byKey.has(key)) byKey.set(key, s);
	}
	return [...byKey.values()];
}

function signatureOpen(s: PathSignature, z: number): boolean {
	if ((s.nonColliders & z) !== 0) return false;
	for (const d of s.colliderDescendants) if ((d & z) === 0) return false;
	return true;
}

function anyOpen(signatures: readonly PathSignature[], z: number): boolean {
	for (const s of signatures) if (signatureOpen(s, z)) return true;
	return false;
}

/** Calls f on every subset (as a mask) of `mask`, the empty set included. */
export function forEachSubmask(mask: number, f: (sub: number) => void): void {
	let sub = mask;
	for (;;) {
		f(sub);
		if (sub === 0) return;
		sub = (sub - 1) & mask;
	}
}

/** Every set in `valid` (masks) that has no proper subset in `valid`. */
function minimalMasks(candidates: number, isValid: (z: number) => boolean): number[] {
	const valid = new Set<number>();
	forEachSubmask(candidates, (z) => {
		if (isValid(z)) valid.add(z);
	});
	const minimal: number[] = [];
	for (const z of valid) {
		let hasValidProperSubset = false;
		forEachSubmask(z, (sub) => {
			if (sub !== z && valid.has(sub)) hasValidProperSubset = true;
		});
		if (!hasValidProperSubset) minimal.push(z);
	}
	return minimal;
}

// ---------------------------------------------------------------------------------------
// Adjustment criterion (Shpitser, VanderWeele & Robins 2010), path by path.

export interface AdjustmentOracle {
	/** Nodes w ∉ X on some proper causal path (the Y end included): cn(X, Y). */
	causalNodes: Set<number>;
	/** Descendants (inclusive) of the causal nodes: members of Z here violate condition (a). */
	forbidden: Set<number>;
	/** Every proper non-causal path from X to Y. */
	properNonCausal: number[][];
	/** Z ∩ (X ∪ Y) = ∅, Z measured, (a) and (b). */
	isValid(z: readonly number[]): boolean;
	/** Open proper non-causal paths given Z. */
	openPaths(z: readonly number[]): number[][];
	/** All minimal valid sets (by checking every subset of the measured non-X, non-Y nodes). */
	minimalSets(): number[][];
}

/**
 * Every proper path from X to Y: starts at some x, no other node in X, ends at some y (its
 * interior may pass other outcomes). Enumerated per (x, y).
 */
function properPaths(g: CompiledDag, xs: readonly number[], ys: readonly number[]): number[][] {
	const out: number[][] = [];
	const xset = new Set(xs);
	for (const x of xs) for (const y of ys) out.push(...simplePaths(g, x, y, xset));
	return out;
}

export function adjustmentOracle(g: CompiledDag, xs: readonly number[], ys: readonly number[]): AdjustmentOracle {
	const xset = new Set(xs);
	const yset = new Set(ys);
	const paths = properPaths(g, xs, ys);
	const causalNodes = new Set<number>();
	const properNonCausal: number[][] = [];
	for (const p of paths) {
		if (isDirected(g, p)) for (const w of p.slice(1)) causalNodes.add(w);
		else properNonCausal.push(p);
	}
	const forbidden = new Set<number>();
	for (const w of causalNodes) for (const d of descendantsOf(g, w)) forbidden.add(d);
	const usable = (v: number) => !xset.has(v) && !yset.has(v) && g.measured[v] === 1;
	const signatures = g.n <= 30 ? signaturesOf(g, properNonCausal) : [];

	const isValid = (z: readonly number[]) =>
		z.every((v) => usable(v) && !forbidden.has(v)) && !properNonCausal.some((p) => isOpenPath(g, p, new Set(z)));
	const openPaths = (z: readonly number[]) => properNonCausal.filter((p) => isOpenPath(g, p, new Set(z)));
	const minimalSets = () => {
		const candidates = maskOf(Array.from({ length: g.n }, (_, v) => v).filter((v) => usable(v) && !forbidden.has(v)));
		return minimalMasks(candidates, (z) => !anyOpen(signatures, z)).map(membersOf);
	};
	return { causalNodes, forbidden, properNonCausal, isValid, openPaths, minimalSets };
}

/**
 * Henckel, Perković & Maathuis (2022): O = pa(cn(X,Y)) \ forb(X,Y), forb = De(cn) ∪ X.
 * Computed from the oracle's cn, without any validity judgement.
 */
export function optimalSetOracle(g: CompiledDag, xs: readonly number[], ys: readonly number[]): number[] {
	const { causalNodes, forbidden } = adjustmentOracle(g, xs, ys);
	const out = new Set<number>();
	for (const w of causalNodes) for (const p of parentsOf(g, w)) out.add(p);
	for (const f of forbidden) out.delete(f);
	for (const x of xs) out.delete(x);
	return [...out].sort((a, b) => a - b);
}

// ---------------------------------------------------------------------------------------
// Single-door criterion for the direct effect x → y (Pearl 2009, §5.3.1).

export interface DirectOracle {
	isValid(z: readonly number[]): boolean;
	minimalSets(): number[][];
}

export function directEffectOracle(g: CompiledDag, x: number, y: number): DirectOracle {
	const cut = withoutArrows(g, (a, b) => a === x && b === y);
	const descendantsOfY = descendantsOf(g, y);
	const usable = (v: number) => v !== x && v !== y && g.measured[v] === 1 && !descendantsOfY.has(v);
	const paths = simplePaths(cut, x, y);
	const signatures = g.n <= 30 ? signaturesOf(cut, paths) : [];
	const isValid = (z: readonly number[]) => z.every(usable) && !paths.some((p) => isOpenPath(cut, p, new Set(z)));
	const minimalSets = () => {
		const candidates = maskOf(Array.from({ length: g.n }, (_, v) => v).filter(usable));
		return minimalMasks(candidates, (z) => !anyOpen(signatures, z)).map(membersOf);
	};
	return { isValid, minimalSets };
}

// ---------------------------------------------------------------------------------------
// Implied independencies ("claims").

export interface PairSeparation {
	separates(z: readonly number[]): boolean;
	/** Z separates and no proper subset of Z does. */
	isMinimalSeparator(z: readonly number[]): boolean;
	/** Some subset of the measured variables other than a, b separates. */
	someMeasuredSetSeparates(): boolean;
}

export function pairSeparation(g: CompiledDag, a: number, b: number): PairSeparation {
	const signatures = signaturesOf(g, simplePaths(g, a, b));
	const separatesMask = (z: number) => !anyOpen(signatures, z);
	return {
		separates: (z) => separatesMask(maskOf(z)),
		isMinimalSeparator: (z) => {
			const zm = maskOf(z);
			if (!separatesMask(zm)) return false;
			let properSubsetSeparates = false;
			forEachSubmask(zm, (sub) => {
				if (sub !== zm && !properSubsetSeparates && separatesMask(sub)) properSubsetSeparates = true;
			});
			return !properSubsetSeparates;
		},
		someMeasuredSetSeparates: () => {
			const candidates = maskOf(Array.from({ length: g.n }, (_, v) => v).filter((v) => v !== a && v !== b && g.measured[v] === 1));
			let found = false;
			forEachSubmask(candidates, (z) => {
				if (!found && separatesMask(z)) found = true;
			});
			return found;
		}
	};
}

// ---------------------------------------------------------------------------------------
// Path listing.

export interface OraclePath {
	nodes: number[];
	causal: boolean;
	open: boolean;
}

/** Every simple path from some x to some y whose interior avoids X ∪ Y. */
export function listPathsOracle(
	g: CompiledDag,
	xs: readonly number[],
	ys: readonly number[],
	z: readonly number[]
): OraclePath[] {
	const avoid = new Set([...xs, ...ys]);
	const zset = new Set(z);
	const out: OraclePath[] = [];
	for (const x of xs)
		for (const y of ys)
			for (const p of simplePaths(g, x, y, avoid))
				out.push({ nodes: p, causal: isDirected(g, p), open: isOpenPath(g, p, zset) });
	return out;
}

// ---------------------------------------------------------------------------------------
// Roles, one definition at a time.

/** Every directed path from `a` to `b` whose nodes other than a and b avoid `avoid`. */
function directedPaths(g: CompiledDag, a: number, b: number, avoid: ReadonlySet<number>): number[][] {
	// Following children only; in a DAG every directed walk is a simple path.
	const out: number[][] = [];
	const path = [a];
	const walk = (u: number) => {
		for (const c of childrenOf(g, u)) {
			if (c === b) out.push([...path, b]);
			else if (!avoid.has(c)) {
				path.push(c);
				walk(c);
				path.pop();
			}
		}
	};
	if (a !== b) walk(a);
	return out;
}

/** Some directed path (length ≥ 1) from v to a node of `targets` whose every node avoids `avoid`. */
function reachesAvoiding(g: CompiledDag, v: number, targets: readonly number[], avoid: ReadonlySet<number>): boolean {
	if (avoid.has(v)) return false;
	return targets.some((t) => !avoid.has(t) && t !== v && directedPaths(g, v, t, avoid).length > 0);
}

export const ROLE_ORDER: readonly Role[] = [
	'exposure',
	'outcome',
	'mediator',
	'confounder',
	'common-cause',
	'collider',
	'descendant-of-outcome',
	'descendant-of-exposure',
	'instrument-like',
	'precision',
	'unrelated'
];

export function rolesOracle(g: CompiledDag, xs: readonly number[], ys: readonly number[]): Role[][] {
	const xset = new Set(xs);
	const yset = new Set(ys);
	const xy = new Set([...xs, ...ys]);

	// Mediators and colliders from the X–Y paths with interior avoiding X ∪ Y.
	const mediators = new Set<number>();
	const colliders = new Set<number>();
	for (const x of xs)
		for (const y of ys)
			for (const p of simplePaths(g, x, y, xy)) {
				if (isDirected(g, p)) p.slice(1, -1).forEach((v) => mediators.add(v));
				for (let i = 1; i + 1 < p.length; i++) if (isColliderAt(g, p, i)) colliders.add(p[i]);
			}

	const properDescendantsOf = (vs: readonly number[]) => {
		const out = new Set<number>();
		for (const v of vs) for (const d of descendantsOf(g, v)) if (d !== v) out.add(d);
		return out;
	};
	const deXproper = properDescendantsOf(xs);
	const deYproper = properDescendantsOf(ys);
	const deXinclusive = new Set([...deXproper, ...xs]);
	const noArrowsOutOfX = withoutArrows(g, (a) => xset.has(a));
	const confounders = new Set(minimalPreExposureSetsOracle(g, xs, ys).flat());

	return Array.from({ length: g.n }, (_, v): Role[] => {
		if (xset.has(v)) return ['exposure'];
		if (yset.has(v)) return ['outcome'];
		const roles: Role[] = [];
		if (mediators.has(v)) roles.push('mediator');
		if (confounders.has(v)) roles.push('confounder');
		if (reachesAvoiding(g, v, xs, yset) && reachesAvoiding(g, v, ys, xset)) roles.push('common-cause');
		if (colliders.has(v)) roles.push('collider');
		if (deYproper.has(v)) roles.push('descendant-of-outcome');
		if (deXproper.has(v) && !mediators.has(v)) roles.push('descendant-of-exposure');
		const ancestorOfSomeX = xs.some((x) => x !== v && ancestorsOf(g, x).has(v));
		if (
			!deXinclusive.has(v) &&
			ancestorOfSomeX &&
			// every directed path from v to Y passes through X: none avoids X
			!ys.some((y) => directedPaths(g, v, y, xset).length > 0) &&
			dSeparatedOracle(noArrowsOutOfX, [v], ys, [])
		)
			roles.push('instrument-like');
		if (
			reachesAvoiding(g, v, ys, xset) &&
			!ancestorOfSomeX &&
			!deXinclusive.has(v) &&
			dSeparatedOracle(g, [v], xs, [])
		)
			roles.push('precision');
		if (roles.length === 0) roles.push('unrelated');
		return roles;
	});
}

/**
 * VanderWeele & Shpitser (Annals of Statistics 41, 2013), by definition: every minimal
 * sufficient set of pre-exposure variables, found by trying every subset of
 * R = V \ (X ∪ Y ∪ De(X)) — measured or not, as roles describe the structure — against the
 * adjustment criterion judged path by path (for pre-exposure sets and one exposure this is
 * Pearl's back-door criterion; Shpitser, VanderWeele & Robins 2010). Exponential by design.
 */
export function minimalPreExposureSetsOracle(g: CompiledDag, xs: readonly number[], ys: readonly number[]): number[][] {
	const { properNonCausal } = adjustmentOracle(g, xs, ys);
	const xset = new Set(xs);
	const yset = new Set(ys);
	const belowX = new Set<number>();
	for (const x of xs) for (const d of descendantsOf(g, x)) belowX.add(d);
	const candidates = maskOf(Array.from({ length: g.n }, (_, v) => v).filter((v) => !xset.has(v) && !yset.has(v) && !belowX.has(v)));
	const signatures = signaturesOf(g, properNonCausal);
	return minimalMasks(candidates, (z) => !anyOpen(signatures, z)).map(membersOf);
}
