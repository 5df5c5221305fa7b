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
 * source s and Y to a sink t (moral-graph.ts). Each connected set of non-removable vertices
 * is then replaced by a clique on its removable neighbours (merged into s or t when it touches
 * them), which keeps s–t reachability for every Z ⊆ R: in the reduced graph every vertex but
 * s and t is removable, and the minimal separators are the same sets.
 *
 * Membership: v lies in some minimal s–t separator iff some induced s–t path passes through
 * v. (If S ∋ v is minimal, v has a neighbour a in the full component of s and b in that of t;
 * shortest paths inside each component give an induced path s…a v b…t. Conversely, for an
 * induced path with prefix P = s…a, the sink's component C of H − N[P] contains b…t, and N(C)
 * is a minimal separator through v — closeSeparator(P) of separators.ts.) Deciding whether
 * an induced path joins two vertices through a third is NP-complete in general graphs
 * (Bienstock, Discrete Mathematics 90, 1991, from memory), so membership is decided in three
 * steps, cheapest first:
 *  1. no: v lies on no simple s–t path at all (two vertex-disjoint paths from v to s and t,
 *     a unit-capacity flow; Menger's theorem), O(n + m);
 *  2. yes: a shortest path from s to a neighbour a of v that avoids v's other neighbours
 *     (chordless by choice of a's predecessor), with a neighbour of v left in the sink's
 *     component; and the same from t. O(deg(v) (n + m));
 *  3. either: a depth-first search over chordless paths from s that stop at the first
 *     neighbour of v, cut as soon as t can no longer reach a neighbour of v or the path's tip
 *     can no longer reach one (both only get worse as the path grows), nearest to v first.
 *     Exact when it ends; stopped after SEARCH_BUDGET paths per variable (exponential in the
 *     worst case, as the hardness above says it must be).
 * Variables the search could not settle are decided by listing all minimal separators
 * (separators.ts, polynomial delay) when that listing ends within LISTING_CAP sets; those
 * still open are reported as undecided rather than guessed.
 */
import type { CompiledDag } from '../graph/compiled';
import { contractedMoralGraph, type ContractedMoralGraph } from './moral-graph';
import { properBackDoorGraph, properCausalStructure } from './proper-causal';
import { descendantsOf } from './reach';
import { listMinimalSeparators } from './separators';

export interface ConfounderMembership {
	/** 1 when the variable is in some minimal sufficient set of pre-exposure variables. */
	member: Uint8Array;
	/** For each member, one minimal sufficient set containing it (sorted indices). */
	witness: (number[] | null)[];
	/** 1 when neither the search nor the capped listing could decide (large, dense diagrams). */
	undecided: Uint8Array;
	/** Variables the search left to the full listing (for tests and benchmarks). */
	settledByListing: number;
}

/** Chordless paths tried per variable in step 3. */
export const SEARCH_BUDGET = 400;
/** Step 3's leftovers are decided by the full listing only when it has at most this many sets. */
export const LISTING_CAP = 5_000;

/** The graph H and the removable (pre-exposure, non-X, non-Y) vertices. O(n + Σ indeg²). */
export function preExposureSeparationGraph(g: CompiledDag, X: readonly number[], Y: readonly number[]): ContractedMoralGraph {
	const s = properCausalStructure(g, X, Y);
	const belowX = descendantsOf(g, X);
	const allowed = new Uint8Array(g.n);
	for (let v = 0; v < g.n; v++) allowed[v] = !s.inX[v] && !s.inY[v] && !belowX[v] && !s.forbidden[v] ? 1 : 0;
	return contractedMoralGraph(properBackDoorGraph(g, s), X, Y, allowed);
}

/** H with every connected set of non-removable vertices replaced by a clique on its border. */
interface ReducedGraph {
	size: number;
	source: number;
	sink: number;
	adjacency: number[][];
}

/**
 * The reduction described above, or null when non-removable vertices join s and t (then no
 * separator exists). O(n + m + Σ |border|²).
 */
export function reduceToRemovable(h: ContractedMoralGraph): ReducedGraph | null {
	const { size, source, sink, adjacency, removable } = h;
	// Component of each non-removable vertex; source and sink seed their own.
	const comp = new Int32Array(size).fill(-1);
	const borders: number[][] = [];
	const label = (start: number, id: number) => {
		const stack = [start];
		comp[start] = id;
		const border = new Set<number>();
		while (stack.length > 0) {
			const u = stack.pop()!;
			for (const w of adjacency[u]) {
				if (removable[w]) border.add(w);
				else if (comp[w] === -1) {
					comp[w] = id;
					stack.push(w);
				}
			}
		}
		borders[id] = [...border];
	};
	label(source, 0);
	if (comp[sink] === 0) return null;
	label(sink, 1);
	let next = 2;
	for (let u = 0; u < size; u++) if (!removable[u] && comp[u] === -1 && adjacency[u].length > 0) label(u, next++);
	const neighbours: Set<number>[] = Array.from({ length: size }, () => new Set<number>());
	const link = (a: number, b: number) => {
		if (a === b) return;
		neighbours[a].add(b);
		neighbours[b].add(a);
	};
	for (let u = 0; u < size; u++) {
		if (!removable[u]) continue;
		for (const w of adjacency[u]) if (removable[w]) link(u, w);
	}
	for (const w of borders[0]) link(source, w);
	for (const w of borders[1]) link(sink, w);
	for (let id = 2; id < next; id++) {
		const b = borders[id];
		for (let i = 0; i < b.length; i++) for (let j = i + 1; j < b.length; j++) link(b[i], b[j]);
	}
	return { size, source, sink, adjacency: neighbours.map((s) => [...s]) };
}

/** Vertices reachable from `start` without entering `blocked`. O(n + m). */
function reach(r: ReducedGraph, start: number, blocked: Uint8Array): Uint8Array {
	const seen = new Uint8Array(r.size);
	if (blocked[start]) return seen;
	const stack = [start];
	seen[start] = 1;
	while (stack.length > 0) {
		const u = stack.pop()!;
		for (const w of r.adjacency[u]) {
			if (seen[w] || blocked[w]) continue;
			seen[w] = 1;
			stack.push(w);
		}
	}
	return seen;
}

/** The vertices outside C adjacent to it: a minimal separator when C is full. Sorted. */
function borderOf(r: ReducedGraph, C: Uint8Array): number[] {
	const out = new Uint8Array(r.size);
	const list: number[] = [];
	for (let u = 0; u < r.size; u++) {
		if (!C[u]) continue;
		for (const w of r.adjacency[u])
			if (!C[w] && !out[w]) {
				out[w] = 1;
				list.push(w);
			}
	}
	return list.sort((p, q) => p - q);
}

/**
 * Step 1: two vertex-disjoint paths from v, one to s and one to t (unit flow), O(n + m) per
 * query. The flow network is built once for all variables and each query undoes only what it
 * changed: building it per variable was 70% of `roles` on 2,000 variables (node --cpu-prof).
 */
function simplePathTester(r: ReducedGraph): (v: number) => boolean {
	const n = r.size;
	// u_in = 2u, u_out = 2u + 1; the super-sink is 2n.
	const superSink = 2 * n;
	const head = new Int32Array(superSink + 1).fill(-1);
	const to: number[] = [];
	const next: number[] = [];
	const arc = (a: number, b: number) => {
		to.push(b); next.push(head[a]); head[a] = to.length - 1;
		to.push(a); next.push(head[b]); head[b] = to.length - 1;
	};
	for (let u = 0; u < n; u++) {
		arc(2 * u, 2 * u + 1);
		for (const w of r.adjacency[u]) arc(2 * u + 1, 2 * w);
	}
	arc(2 * r.source + 1, superSink);
	arc(2 * r.sink + 1, superSink);
	const toNode = Int32Array.from(to);
	const nextArc = Int32Array.from(next);
	const cap = new Int8Array(toNode.length);
	for (let e = 0; e < cap.length; e += 2) cap[e] = 1;
	const via = new Int32Array(superSink + 1);
	const seenIn = new Int32Array(superSink + 1);
	let search = 0;
	const changed: number[] = [];
	const queue = new Int32Array(superSink + 1);
	return (v: number): boolean => {
		// v's own split arc is never used (v_in is never entered): both units leave from v_out.
		const start = 2 * v + 1;
		let ok = true;
		for (let flow = 0; flow < 2 && ok; flow++) {
			search++;
			let tail = 0;
			queue[tail++] = start;
			seenIn[start] = search;
			let reached = false;
			for (let i = 0; i < tail && !reached; i++) {
				const a = queue[i];
				for (let e = head[a]; e !== -1; e = nextArc[e]) {
					const b = toNode[e];
					if (seenIn[b] === search || cap[e] <= 0 || b === 2 * v) continue;
					seenIn[b] = search;
					via[b] = e;
					if (b === superSink) {
						reached = true;
						break;
					}
					queue[tail++] = b;
				}
			}
			if (!reached) ok = false;
			else
				for (let b = superSink; b !== start; b = toNode[via[b] ^ 1]) {
					cap[via[b]] -= 1;
					cap[via[b] ^ 1] += 1;
					changed.push(via[b]);
				}
		}
		for (const e of changed) {
			const forward = e & ~1; // arcs come in (forward, backward) pairs
			cap[forward] = 1;
			cap[forward + 1] = 0;
		}
		changed.length = 0;
		return ok;
	};
}

/**
 * With P a chordless path from `from` whose only vertex next to v is its last, the separator
 * N(C) for C the component of `to` in H − N[P], when C reaches a neighbour of v; else null.
 */
function separatorAfter(r: ReducedGraph, v: number, path: readonly number[], to: number): number[] | null {
	const blocked = new Uint8Array(r.size);
	for (const p of path) {
		blocked[p] = 1;
		for (const w of r.adjacency[p]) blocked[w] = 1;
	}
	if (blocked[to]) return null;
	const C = reach(r, to, blocked);
	if (!r.adjacency[v].some((b) => C[b])) return null;
	return borderOf(r, C);
}

/** Step 2 from one side: shortest chordless paths from `from` to each neighbour of v. */
function greedyFrom(r: ReducedGraph, v: number, from: number, to: number): number[] | null {
	const nearV = new Uint8Array(r.size);
	nearV[v] = 1;
	for (const w of r.adjacency[v]) nearV[w] = 1;
	if (nearV[from]) return separatorAfter(r, v, [from], to);
	// A path through a neighbour of `to` leaves `to` no component of its own.
	const nearTo = new Uint8Array(r.size);
	for (const w of r.adjacency[to]) nearTo[w] = 1;
	const dist = new Int32Array(r.size).fill(-1);
	const parent = new Int32Array(r.size).fill(-1);
	dist[from] = 0;
	const queue = [from];
	for (let i = 0; i < queue.length; i++) {
		const u = queue[i];
		for (const w of r.adjacency[u]) {
			if (dist[w] !== -1 || nearV[w] || nearTo[w] || w === to) continue;
			dist[w] = dist[u] + 1;
			parent[w] = u;
			queue.push(w);
		}
	}
	const ends: { a: number; p: number; d: number }[] = [];
	for (const a of r.adjacency[v]) {
		if (a === to || nearTo[a]) continue;
		let best = -1;
		for (const p of r.adjacency[a]) if (dist[p] !== -1 && (best === -1 || dist[p] < dist[best])) best = p;
		if (best !== -1) ends.push({ a, p: best, d: dist[best] });
	}
	ends.sort((x, y) => x.d - y.d);
	for (const { a, p } of ends) {
		const path = [a];
		for (let u = p; u !== -1; u = parent[u]) path.push(u);
		const found = separatorAfter(r, v, path, to);
		if (found) return found;
	}
	return null;
}

/** Breadth-first distances from v (unreached: size). O(n + m). */
function distancesFrom(r: ReducedGraph, v: number): Int32Array {
	const d = new Int32Array(r.size).fill(r.size);
	d[v] = 0;
	const queue = [v];
	for (let i = 0; i < queue.length; i++)
		for (const w of r.adjacency[queue[i]])
			if (d[w] === r.size) {
				d[w] = d[queue[i]] + 1;
				queue.push(w);
			}
	return d;
}

/** Step 3: exact search over chordless paths from s, or 'stopped' past the budget. */
function searchFor(r: ReducedGraph, v: number, budget: number): number[] | null | 'stopped' {
	const { source: s, sink: t, size } = r;
	const nearV = new Uint8Array(size);
	for (const w of r.adjacency[v]) nearV[w] = 1;
	const nearT = new Uint8Array(size);
	for (const w of r.adjacency[t]) nearT[w] = 1;
	const distV = distancesFrom(r, v);
	/** How many path vertices (tip included) have w in their closed neighbourhood. */
	const covered = new Int32Array(size);
	const cover = (u: number, by: number) => {
		covered[u] += by;
		for (const w of r.adjacency[u]) covered[w] += by;
	};
	const path: number[] = [];
	let left = budget;
	let stopped = false;

	// Can t still reach a neighbour of v outside N[path], avoiding v?
	const sinkStillReaches = (): boolean => {
		const blocked = new Uint8Array(size);
		for (let w = 0; w < size; w++) if (covered[w] > 0) blocked[w] = 1;
		blocked[v] = 1;
		if (blocked[t]) return false;
		const C = reach(r, t, blocked);
		return r.adjacency[v].some((b) => C[b]);
	};
	// Can the tip reach a neighbour of v through vertices outside N[path without the tip]?
	const tipStillReaches = (tip: number): boolean => {
		cover(tip, -1);
		const blocked = new Uint8Array(size);
		for (let w = 0; w < size; w++) if (covered[w] > 0) blocked[w] = 1;
		cover(tip, 1);
		blocked[v] = 1;
		blocked[t] = 1;
		const seen = reach(r, tip, blocked);
		return r.adjacency[v].some((a) => seen[a]);
	};

	const visit = (tip: number): number[] | null => {
		// A next vertex touches the tip and no earlier path vertex: covered once, by the tip.
		const candidates = r.adjacency[tip]
			.filter((u) => u !== t && u !== v && !nearT[u] && covered[u] === 1)
			.sort((p, q) => distV[p] - distV[q]);
		for (const u of candidates) {
			if (--left < 0) {
				stopped = true;
				return null;
			}
			path.push(u);
			cover(u, 1);
			let found: number[] | null = null;
			if (nearV[u]) found = separatorAfter(r, v, path, t);
			else if (sinkStillReaches() && tipStillReaches(u)) found = visit(u);
			cover(u, -1);
			path.pop();
			if (found || stopped) return found;
		}
		return null;
	};

	if (nearV[s]) return separatorAfter(r, v, [s], t);
	path.push(s);
	cover(s, 1);
	const found = visit(s);
	return found ?? (stopped ? 'stopped' : null);
}

/**
 * Membership of every variable (of `candidates` when given; others may be found members as parts
 * of a witness set), with a witness set for each member. O(k (n + m)) for steps 1 and 2 over k
 * candidates; step 3 and the listing are bounded by SEARCH_BUDGET and LISTING_CAP.
 */
export function confounderMembershipIdx(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	limits: { searchBudget?: number; listingCap?: number; candidates?: readonly number[] } = {}
): ConfounderMembership {
	const n = g.n;
	const member = new Uint8Array(n);
	const undecided = new Uint8Array(n);
	const witness: (number[] | null)[] = Array.from({ length: n }, () => null);
	const h = preExposureSeparationGraph(g, X, Y);
	const r = reduceToRemovable(h);
	if (r === null || r.adjacency[r.source].includes(r.sink)) return { member, witness, undecided, settledByListing: 0 };
	const record = (set: number[] | null) => {
		if (!set) return;
		for (const v of set)
			if (!member[v]) {
				member[v] = 1;
				witness[v] = set;
			}
	};
	// Outside the component of s and t no vertex lies on an s–t path; when t is not in it,
	// the empty set is the only minimal separator.
	const joined = reach(r, r.source, new Uint8Array(r.size));
	if (!joined[r.sink]) return { member, witness, undecided, settledByListing: 0 };
	const open: number[] = [];
	const onSomeSimplePath = simplePathTester(r);
	// Only the variables asked about are tested (all by default); members found on the way as
	// parts of another's witness set are kept too.
	for (const v of limits.candidates ?? Array.from({ length: n }, (_, i) => i)) {
		if (member[v] || !h.removable[v] || !joined[v]) continue;
		if (!onSomeSimplePath(v)) continue;
		const quick = greedyFrom(r, v, r.source, r.sink) ?? greedyFrom(r, v, r.sink, r.source);
		if (quick) {
			record(quick);
			continue;
		}
		const found = searchFor(r, v, limits.searchBudget ?? SEARCH_BUDGET);
		if (found === 'stopped') open.push(v);
		else record(found);
	}
	let settledByListing = 0;
	const stillOpen = open.filter((v) => !member[v]);
	if (stillOpen.length > 0) {
		const listing = listMinimalSeparators(h, limits.listingCap ?? LISTING_CAP);
		for (const set of listing.sets) record(set);
		if (listing.truncated) {
			for (const v of stillOpen) if (!member[v]) undecided[v] = 1;
		} else settledByListing = stillOpen.length;
	}
	return { member, witness, undecided, settledByListing };
}
