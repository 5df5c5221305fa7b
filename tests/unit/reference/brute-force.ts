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
 *
 * Three files: graph basics, paths and d-separation (brute-force-paths.ts); sets as bitmasks
 * and paths as signatures (brute-force-masks.ts); the criteria and roles here. Tests import
 * all of it from this file.
 */
import type { CompiledDag } from '../../../src/lib/graph/compiled';
import type { Role } from '../../../src/lib/causal/types';
import { parentsOf, childrenOf, descendantsOf, ancestorsOf, withoutArrows, simplePaths, isColliderAt, isDirected, isOpenPath, dSeparatedOracle } from './brute-force-paths';
import { maskOf, membersOf, signaturesOf, anyOpen, forEachSubmask, minimalMasks } from './brute-force-masks';

export * from './brute-force-paths';
export { maskOf, membersOf, forEachSubmask } from './brute-force-masks';

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
