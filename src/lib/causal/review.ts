/**
 * Review of a stated adjustment set (the set a paper adjusted for): the verdict by the
 * adjustment criterion with every reason, the members that could go, the smallest valid
 * extension and the nearest minimal sufficient set.
 *
 * Methods and definitions:
 * - validity: adjustment criterion (Shpitser, VanderWeele & Robins, UAI 2010) in its
 *   constructive form (van der Zander, Liśkiewicz & Textor, AI 270, 2019; adjustment.ts);
 * - reasons, named as in the epidemiology literature: an open non-causal path (a back-door
 *   path when its first arrow points into the exposure; Pearl 1995), overadjustment — an
 *   adjusted mediator or descendant of one (Schisterman, Cole & Platt, Epidemiology 2009),
 *   collider bias — an adjusted collider, or descendant of a collider, on a path the
 *   adjustment opens (Greenland, Pearl & Robins, Epidemiology 1999; Hernán et al. 2004), and
 *   an adjusted descendant of the outcome;
 * - droppable: members z with Z \ {z} still valid; plus one minimal valid subset of Z, found
 *   in O(n + m) by the FINDMINSEP construction (van der Zander et al. 2019, Alg. 2) in the
 *   moral graph of An(X ∪ Y) of the proper back-door graph, where Z ∩ An(X ∪ Y) still
 *   separates whenever Z does (a path whose colliders lie in An(X ∪ Y) lies in An(X ∪ Y));
 * - smallest valid extension: the fewest variables W with Z ∪ W valid, a minimum vertex cut
 *   in the moral graph of An(X ∪ Y ∪ Z) with Z deleted (ibid., Lemma 3.4 with I = Z: if any
 *   extension exists, one inside An(X ∪ Y ∪ Z) does, and there d-separation is separation
 *   in the moral graph; Lauritzen et al. 1990). O(k (n + m)) for k added variables;
 * - nearest minimal sufficient set: the minimal set M minimising |Z Δ M| = |Z \ M| + |M \ Z|,
 *   the Hamming distance between membership vectors, i.e. the fewest variables to add or
 *   drop (ties: fewer variables, then by id). Found by scanning the listing of minimal sets
 *   (polynomial delay, separators.ts), capped; the answer says when the cap was reached.
 */
import type { CompiledDag } from '../graph/compiled';
import type { ContractedMoralGraph } from './moral-graph';
import { checkAdjustmentIdx, isAdjustmentSet } from './adjustment';
import { contractedMoralGraph } from './moral-graph';
import { properBackDoorGraph, properCausalStructure } from './proper-causal';
import { ancestorsOf, hasArrow, maskOf, type Mask } from './reach';
import { componentOf, minimumSeparator } from './separators';
import { listMinimalAdjustmentSetsIdx } from './sets';

export type ReviewReasonIdx =
	| { kind: 'open-path'; path: number[]; backDoor: boolean }
	| { kind: 'overadjustment'; variable: number; why: 'mediator' | 'descendant-of-mediator' }
	| { kind: 'collider-bias'; variable: number; collider: number; path: number[] }
	| { kind: 'descendant-of-outcome'; variable: number }
	| { kind: 'exposure-or-outcome'; variable: number; which: 'exposure' | 'outcome' }
	| { kind: 'unmeasured'; variable: number };

export interface NearestSetIdx {
	set: number[];
	add: number[];
	drop: number[];
	/** Minimal sets scanned; `truncated` when more exist than the cap allowed. */
	scanned: number;
	truncated: boolean;
}

export interface ReviewIdx {
	valid: boolean;
	identifiable: boolean;
	reasons: ReviewReasonIdx[];
	openPathsTruncated: boolean;
	/** Valid Z only: members whose removal alone keeps Z valid. */
	droppable: number[];
	/** Valid Z only: a minimal valid set inside Z. */
	minimalSubset: number[] | null;
	/** Variables to add for the smallest valid superset of Z; [] when Z is valid; null when none exists. */
	extension: number[] | null;
	/** Members that rule out any valid superset (forbidden, unmeasured, exposure or outcome). */
	extensionBlockedBy: number[];
	nearest: NearestSetIdx | null;
}

export interface ReviewOptions {
	maxPaths?: number;
	/** How many minimal sets to scan for the nearest one. */
	maxSets?: number;
}

/** True when path[i] is a collider (→ path[i] ←). */
function colliderAt(g: CompiledDag, path: readonly number[], i: number): boolean {
	return hasArrow(g, path[i - 1], path[i]) && hasArrow(g, path[i + 1], path[i]);
}

/** Members of Z that descend from v (v included), by BFS over children. O(n + m). */
function adjustedBelow(g: CompiledDag, v: number, Z: Mask): number[] {
	const seen = new Uint8Array(g.n);
	const queue = [v];
	seen[v] = 1;
	const out: number[] = [];
	for (let i = 0; i < queue.length; i++) {
		const u = queue[i];
		if (Z[u]) out.push(u);
		for (let k = g.childStart[u]; k < g.childStart[u + 1]; k++) {
			const w = g.childList[k];
			if (!seen[w]) {
				seen[w] = 1;
				queue.push(w);
			}
		}
	}
	return out;
}

/**
 * A minimal source–sink separator inside the separator `members` of h (FINDMINSEP, van der
 * Zander et al. 2019): keep the members next to the source's component, then of those the
 * ones next to the sink's component. O(n + m).
 */
export function minimalSubSeparator(h: ContractedMoralGraph, members: readonly number[]): number[] {
	const blocked = new Uint8Array(h.size);
	for (const v of members) blocked[v] = 1;
	const fromSource = componentOf(h, h.source, blocked);
	const first = members.filter((v) => h.adjacency[v].some((w) => fromSource[w]));
	blocked.fill(0);
	for (const v of first) blocked[v] = 1;
	const fromSink = componentOf(h, h.sink, blocked);
	return first.filter((v) => h.adjacency[v].some((w) => fromSink[w])).sort((a, b) => a - b);
}

/** Removes the vertices of `gone` from h (no edges, not removable). O(n + m). */
function deleteVertices(h: ContractedMoralGraph, gone: Mask): ContractedMoralGraph {
	const adjacency = h.adjacency.map((list, v) => (v < gone.length && gone[v] ? [] : list.filter((w) => !(w < gone.length && gone[w]))));
	const removable = h.removable.slice();
	for (let v = 0; v < gone.length; v++) if (gone[v]) removable[v] = 0;
	return { ...h, adjacency, removable };
}

/**
 * The fewest variables W ⊆ R \ Z with Z ∪ W a valid adjustment set, or null when none
 * exists (Z must itself be free of forbidden, unmeasured, exposure and outcome variables).
 * O(k (n + m)) for |W| = k.
 */
export function smallestExtensionIdx(g: CompiledDag, X: readonly number[], Y: readonly number[], Z: readonly number[]): number[] | null {
	const s = properCausalStructure(g, X, Y);
	if (Z.some((z) => s.inX[z] || s.inY[z] || s.forbidden[z] || !g.measured[z])) return null;
	const inZ = maskOf(g.n, Z);
	const allowed = new Uint8Array(g.n);
	for (let v = 0; v < g.n; v++) allowed[v] = g.measured[v] && !s.inX[v] && !s.inY[v] && !s.forbidden[v] && !inZ[v] ? 1 : 0;
	const h = deleteVertices(contractedMoralGraph(properBackDoorGraph(g, s), X, Y, allowed, Z), inZ);
	const cut = minimumSeparator(h);
	return cut && cut.sort((a, b) => a - b);
}

/** Hamming distance between two sorted index sets. */
function symmetricDifference(a: readonly number[], b: readonly number[]): { add: number[]; drop: number[] } {
	const inA = new Set(a);
	const inB = new Set(b);
	return { add: b.filter((v) => !inA.has(v)), drop: a.filter((v) => !inB.has(v)) };
}

/**
 * The minimal sufficient set nearest to Z (see the module note), or null when none exists.
 * `tieBreak` orders equally near sets (the façade passes an order by ids). O(L · delay + L·|Z|)
 * for L listed sets.
 */
export function nearestMinimalSetIdx(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	Z: readonly number[],
	maxSets: number,
	tieBreak: (a: readonly number[], b: readonly number[]) => number
): NearestSetIdx | null {
	const listing = listMinimalAdjustmentSetsIdx(g, X, Y, { max: maxSets });
	if (!listing.identifiable) return null;
	let best: NearestSetIdx | null = null;
	let bestDistance = Infinity;
	for (const set of listing.sets) {
		const diff = symmetricDifference(Z, set);
		const distance = diff.add.length + diff.drop.length;
		if (distance < bestDistance || (distance === bestDistance && best && tieBreak(set, best.set) < 0)) {
			bestDistance = distance;
			best = { set, add: diff.add, drop: diff.drop, scanned: listing.sets.length, truncated: listing.truncated };
		}
	}
	return best;
}

/** The review of a stated set Z for the total effect of X on Y. */
export function reviewAdjustmentIdx(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	Z: readonly number[],
	opts: ReviewOptions & { tieBreak?: (a: readonly number[], b: readonly number[]) => number } = {}
): ReviewIdx {
	const check = checkAdjustmentIdx(g, X, Y, Z, opts.maxPaths ?? 50);
	const inZ = maskOf(g.n, Z);
	const reasons: ReviewReasonIdx[] = [];
	const blockers: number[] = [];
	for (const f of check.forbidden) {
		blockers.push(f.variable);
		if (f.why === 'exposure' || f.why === 'outcome') reasons.push({ kind: 'exposure-or-outcome', variable: f.variable, which: f.why });
		else if (f.why === 'unmeasured') reasons.push({ kind: 'unmeasured', variable: f.variable });
		else if (f.why === 'descendant-of-outcome') reasons.push({ kind: 'descendant-of-outcome', variable: f.variable });
		// Dpcp = De(cn): every forbidden variable below no reached outcome lies below a mediator.
		else reasons.push({ kind: 'overadjustment', variable: f.variable, why: f.why === 'mediator' ? 'mediator' : 'descendant-of-mediator' });
	}
	// Per adjusted variable, the best illustration: it is the collider itself, then shortest path.
	const colliderBias = new Map<number, { collider: number; path: number[]; rank: number }>();
	for (const path of check.openPaths) {
		reasons.push({ kind: 'open-path', path, backDoor: path.length > 1 && hasArrow(g, path[1], path[0]) });
		for (let i = 1; i + 1 < path.length; i++) {
			if (!colliderAt(g, path, i)) continue;
			for (const z of adjustedBelow(g, path[i], inZ)) {
				const rank = (z === path[i] ? 0 : g.n) + path.length;
				const known = colliderBias.get(z);
				if (!known || rank < known.rank) colliderBias.set(z, { collider: path[i], path, rank });
			}
		}
	}
	for (const z of Z) {
		const c = colliderBias.get(z);
		if (c) reasons.push({ kind: 'collider-bias', variable: z, collider: c.collider, path: c.path });
	}

	const tieBreak = opts.tieBreak ?? ((a, b) => a.length - b.length);
	const nearest = nearestMinimalSetIdx(g, X, Y, Z, opts.maxSets ?? 2000, tieBreak);
	let droppable: number[] = [];
	let minimalSubset: number[] | null = null;
	if (check.valid) {
		droppable = Z.filter((z) => isAdjustmentSet(g, X, Y, Z.filter((w) => w !== z))).sort((a, b) => a - b);
		const s = properCausalStructure(g, X, Y);
		const allowed = maskOf(g.n, Z);
		const h = contractedMoralGraph(properBackDoorGraph(g, s), X, Y, allowed);
		const anc = ancestorsOf(g, [...X, ...Y]);
		minimalSubset = minimalSubSeparator(h, Z.filter((z) => anc[z]));
	}
	return {
		valid: check.valid,
		identifiable: nearest !== null,
		reasons,
		openPathsTruncated: check.openPathsTruncated,
		droppable,
		minimalSubset,
		extension: check.valid ? [] : smallestExtensionIdx(g, X, Y, Z),
		extensionBlockedBy: blockers.sort((a, b) => a - b),
		nearest
	};
}
