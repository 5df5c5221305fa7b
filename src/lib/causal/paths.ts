/**
 * Every path between exposure and outcome with its status under the planned set: causal or
 * not, open or blocked, and which variables block it or hold it open (the d-separation rule,
 * Pearl 1988, applied node by node). Exponentially many paths can exist, so the listing is
 * capped and says when it was; the open non-causal ones are also counted exactly up to
 * 10,000. Listing: polynomial delay, O(p · (n + m)) per path of at most p variables
 * (open-paths.ts, simple-paths.ts); classifying a path O(p) after an O(n + m) pass for An(Z).
 */
import type { CompiledDag } from '../graph/compiled';
import { openNonCausalPathsIdx, OPEN_PATH_BUDGET, type OpenNonCausalListing, type OpenPathCount } from './open-paths';
import { visitCausalPaths, visitSimplePaths } from './simple-paths';
import { ancestorsOf, hasArrow, maskOf, type Mask } from './reach';

export type NodeStatus =
	| { node: number; reason: 'adjusted-non-collider' }
	| { node: number; reason: 'collider-not-adjusted' }
	| { node: number; reason: 'collider-adjusted' }
	| { node: number; reason: 'collider-descendant-adjusted'; via: number };

export interface ClassifiedPath {
	nodes: number[];
	causal: boolean;
	open: boolean;
	/** Blocked: the blocking variables. Open: the colliders that adjustment opened. */
	reasons: NodeStatus[];
}

/** A variable in Z that descends from v (BFS over children), or -1. O(n + m). */
function adjustedDescendant(g: CompiledDag, v: number, Z: Mask): number {
	const seen = new Uint8Array(g.n);
	const queue = [v];
	seen[v] = 1;
	for (let i = 0; i < queue.length; i++) {
		const u = queue[i];
		for (let k = g.childStart[u]; k < g.childStart[u + 1]; k++) {
			const w = g.childList[k];
			if (seen[w]) continue;
			if (Z[w]) return w;
			seen[w] = 1;
			queue.push(w);
		}
	}
	return -1;
}

/** Classifies one path node by node. `via` caches adjustedDescendant across the paths of one listing. */
export function classifyPath(g: CompiledDag, nodes: readonly number[], Z: Mask, anZ: Mask, via = new Map<number, number>()): ClassifiedPath {
	const blocking: NodeStatus[] = [];
	const opened: NodeStatus[] = [];
	let causal = true;
	for (let i = 0; i + 1 < nodes.length; i++) if (!hasArrow(g, nodes[i], nodes[i + 1])) causal = false;
	for (let i = 1; i + 1 < nodes.length; i++) {
		const v = nodes[i];
		const collider = hasArrow(g, nodes[i - 1], v) && hasArrow(g, nodes[i + 1], v);
		if (!collider) {
			if (Z[v]) blocking.push({ node: v, reason: 'adjusted-non-collider' });
		} else if (Z[v]) {
			opened.push({ node: v, reason: 'collider-adjusted' });
		} else if (anZ[v]) {
			let below = via.get(v);
			if (below === undefined) via.set(v, (below = adjustedDescendant(g, v, Z)));
			opened.push({ node: v, reason: 'collider-descendant-adjusted', via: below });
		} else {
			blocking.push({ node: v, reason: 'collider-not-adjusted' });
		}
	}
	const open = blocking.length === 0;
	return { nodes: [...nodes], causal, open, reasons: open ? opened : blocking };
}

/**
 * Lists paths from X to Y (interior avoiding X ∪ Y), at most `max`, classified under Z, in
 * three rounds: the open non-causal paths first (open-paths.ts, counted exactly up to
 * OPEN_PATH_COUNT_CAP — the same function and count as the adjustment verdict), then the
 * causal paths, then the blocked non-causal ones, each round with polynomial delay
 * (simple-paths.ts) until `max` paths or the step budget. Z's members in X or Y are ignored,
 * as the adjustment check does. Sorted: causal first, then open before blocked, then shorter.
 * `given`: openNonCausalPathsIdx's answer for this question with keep ≥ max, when the caller
 * has it already (the adjustment check's).
 */
export function listPathsIdx(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	Z: readonly number[],
	max = 1000,
	budget = OPEN_PATH_BUDGET,
	given?: OpenNonCausalListing
): { paths: ClassifiedPath[]; truncated: boolean; openNonCausal: OpenPathCount } {
	const ends = maskOf(g.n, [...X, ...Y]);
	const usable = Z.filter((z) => !ends[z]);
	const zMask = maskOf(g.n, usable);
	const anZ = ancestorsOf(g, usable);
	const open = given ?? openNonCausalPathsIdx(g, X, Y, usable, { keep: max, budget });
	const via = new Map<number, number>();
	const paths = open.paths.slice(0, max).map((p) => classifyPath(g, p, zMask, anZ, via));
	const listed = new Set(open.paths.slice(0, max).map((p) => p.join()));
	// full: a path was left out for want of room; stopped: the step budget ran out.
	let full = open.count > paths.length;
	let stopped = open.bound !== 'exact';
	const left = { left: budget };
	const take = (nodes: readonly number[], wanted: (p: ClassifiedPath) => boolean): boolean => {
		if (listed.has(nodes.join())) return true;
		const p = classifyPath(g, nodes, zMask, anZ, via);
		if (!wanted(p)) return true;
		if (paths.length >= max) {
			full = true;
			return false;
		}
		paths.push(p);
		return true;
	};
	if (!full && visitCausalPaths(g, X, Y, (nodes) => take(nodes, () => true), left) && !full) stopped = true;
	if (!full && left.left > 0 && visitSimplePaths(g, X, Y, (nodes) => take(nodes, (p) => !p.causal && !p.open), left) && !full) stopped = true;
	const truncated = full || stopped;
	paths.sort((p, q) => Number(q.causal) - Number(p.causal) || Number(q.open) - Number(p.open) || p.nodes.length - q.nodes.length);
	return { paths, truncated, openNonCausal: { count: open.count, bound: open.bound } };
}
