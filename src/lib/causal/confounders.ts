/**
 * Which variables are confounders in the sense of VanderWeele & Shpitser (Annals of
 * Statistics 41:196–220, 2013): a pre-exposure variable (no descendant of an exposure) that
 * belongs to some minimal sufficient adjustment set. Every variable counts as adjustable here,
 * measured or not, because a role describes the causal structure, not the data at hand.
 *
 * Reduction (van der Zander, Liśkiewicz & Textor, Artificial Intelligence 270, 2019, §3–4):
 * the sufficient sets of pre-exposure variables are the X–Y separators Z ⊆ R in the proper
 * back-door graph, R = V \ (X ∪ Y ∪ De(X)); every minimal one lies in An(X ∪ Y), where
 * d-separation is vertex separation in the moral graph H of An(X ∪ Y) with X contracted to a
 * source and Y to a sink (moral-graph.ts). A separator S ⊆ R of H is minimal iff the source's
 * and the sink's components of H − S are both full (every s ∈ S has a neighbour in each).
 *
 * Membership (our construction on that characterization): v is in some minimal separator iff
 * there is a connected vertex set A ∋ source, closed under non-removable neighbours, with
 * v ∈ N(A) and v adjacent to the sink's component C of H − N[A]; then N(C) is a minimal
 * separator containing v — it is closeSeparator(A) of separators.ts, the one nearest the
 * sink with A on the source side. (If S ∋ v is minimal, its source component is such an A.)
 * So every member of closeSeparator({source}) and closeSeparator({sink}) is settled at once,
 * in O(n + m); the others by a depth-first search that grows A one neighbour at a time while
 * A stays outside N[v] and v stays in the sink's component (C only shrinks as A grows, so a
 * branch is cut as soon as either fails). That search is exponential in the worst case —
 * deciding whether a vertex lies on an induced source–sink path is NP-complete in general
 * graphs (Bienstock 1991, from memory), and this is that question — so after BUDGET grown
 * sets it gives way to the polynomial-delay listing of all minimal separators
 * (separators.ts), which is exact. On random diagrams of up to 2,000 variables the close
 * separators and the search settle every variable (tests/unit/causal/confounders.test.ts).
 */
import type { CompiledDag } from '../graph/compiled';
import { contractedMoralGraph, type ContractedMoralGraph } from './moral-graph';
import { properBackDoorGraph, properCausalStructure } from './proper-causal';
import { descendantsOf, maskOf } from './reach';
import { closeSeparator, componentOf, listMinimalSeparators } from './separators';

export interface ConfounderMembership {
	/** 1 when the variable is in some minimal sufficient set of pre-exposure variables. */
	member: Uint8Array;
	/** For each member, one minimal sufficient set containing it (sorted indices). */
	witness: (number[] | null)[];
	/** Variables the search could not settle and the full listing decided (for tests). */
	settledByListing: number;
}

const BUDGET = 20_000;

/** The graph H and the removable (pre-exposure, non-X, non-Y) vertices. O(n + Σ indeg²). */
export function preExposureSeparationGraph(g: CompiledDag, X: readonly number[], Y: readonly number[]): ContractedMoralGraph {
	const s = properCausalStructure(g, X, Y);
	const belowX = descendantsOf(g, X);
	const allowed = new Uint8Array(g.n);
	for (let v = 0; v < g.n; v++) allowed[v] = !s.inX[v] && !s.inY[v] && !belowX[v] && !s.forbidden[v] ? 1 : 0;
	return contractedMoralGraph(properBackDoorGraph(g, s), X, Y, allowed);
}

/** A grown by u and every non-removable vertex reachable from u through non-removables. */
function grow(h: ContractedMoralGraph, inA: Uint8Array, u: number): number[] {
	const added = [u];
	inA[u] = 1;
	for (let i = 0; i < added.length; i++)
		for (const w of h.adjacency[added[i]])
			if (!inA[w] && !h.removable[w]) {
				inA[w] = 1;
				added.push(w);
			}
	return added;
}

/**
 * One minimal separator containing v by the search described above, or null when there is
 * none, or 'exhausted' past the budget. A is grown along a path from the source: each step
 * adds a removable neighbour u of the last step's vertices that touches no earlier path vertex
 * (a shortest path inside any valid A, closed under non-removable neighbours, is again a valid
 * A; shortest paths have no chords), nearest to v first.
 */
function searchFor(h: ContractedMoralGraph, v: number, distanceToV: Int32Array, budget: { left: number }): number[] | null | 'exhausted' {
	const inA = new Uint8Array(h.size);
	const onPath = new Uint8Array(h.size);
	const start = grow(h, inA, h.source);
	if (start.some((w) => w === h.sink || w === v)) return null;
	let exhausted = false;
	const visit = (tip: readonly number[]): number[] | null => {
		if (--budget.left < 0) {
			exhausted = true;
			return null;
		}
		const boundary = new Uint8Array(h.size);
		for (let a = 0; a < h.size; a++) {
			if (!inA[a]) continue;
			for (const w of h.adjacency[a]) if (!inA[w]) boundary[w] = 1;
		}
		if (boundary[h.sink]) return null;
		const blocked = new Uint8Array(h.size);
		for (let a = 0; a < h.size; a++) blocked[a] = inA[a] | boundary[a];
		const sinkSide = componentOf(h, h.sink, blocked);
		if (boundary[v]) {
			if (!h.adjacency[v].some((w) => sinkSide[w])) return null;
			const members: number[] = [];
			for (let a = 0; a < h.size; a++) if (inA[a]) members.push(a);
			return closeSeparator(h, members);
		}
		// v must stay reachable from the sink outside N[A] (the sink's side only shrinks).
		if (!sinkSide[v]) return null;
		const next = new Set<number>();
		for (const t of tip) for (const u of h.adjacency[t]) if (u !== v && h.removable[u] && !inA[u]) next.add(u);
		const order = [...next].filter((u) => !h.adjacency[u].some((w) => onPath[w] && !tip.includes(w))).sort((p, q) => distanceToV[p] - distanceToV[q]);
		for (const u of order) {
			const added = grow(h, inA, u);
			onPath[u] = 1;
			const found = added.some((w) => w === v || w === h.sink) ? null : visit(added);
			onPath[u] = 0;
			for (const w of added) inA[w] = 0;
			if (found) return found;
			if (exhausted) return null;
		}
		return null;
	};
	const found = visit(start);
	return found ?? (exhausted ? 'exhausted' : null);
}

/** Breadth-first distances from v in H (unreached: n + 2). O(n + m). */
function distancesFrom(h: ContractedMoralGraph, v: number): Int32Array {
	const d = new Int32Array(h.size).fill(h.size);
	d[v] = 0;
	const queue = [v];
	for (let i = 0; i < queue.length; i++)
		for (const w of h.adjacency[queue[i]])
			if (d[w] === h.size) {
				d[w] = d[queue[i]] + 1;
				queue.push(w);
			}
	return d;
}

export function confounderMembershipIdx(g: CompiledDag, X: readonly number[], Y: readonly number[]): ConfounderMembership {
	const n = g.n;
	const member = new Uint8Array(n);
	const witness: (number[] | null)[] = Array.from({ length: n }, () => null);
	const h = preExposureSeparationGraph(g, X, Y);
	const record = (set: number[] | null) => {
		if (!set) return;
		for (const v of set)
			if (!member[v]) {
				member[v] = 1;
				witness[v] = set;
			}
	};
	const first = closeSeparator(h, [h.source]);
	if (first === null) return { member, witness, settledByListing: 0 };
	record(first);
	record(closeSeparator({ ...h, source: h.sink, sink: h.source }, [h.sink]));
	const open: number[] = [];
	const inXY = maskOf(n, [...X, ...Y]);
	for (let v = 0; v < n; v++) {
		if (member[v] || inXY[v] || !h.removable[v]) continue;
		const found = searchFor(h, v, distancesFrom(h, v), { left: BUDGET });
		if (found === 'exhausted') open.push(v);
		else record(found);
	}
	let settledByListing = 0;
	if (open.some((v) => !member[v])) {
		for (const set of listMinimalSeparators(h).sets) record(set);
		settledByListing = open.length;
	}
	return { member, witness, settledByListing };
}
