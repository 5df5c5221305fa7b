/**
 * The open non-causal paths between X and Y given Z (simple paths, interior avoiding X ∪ Y,
 * not directed from X to Y, every interior variable open by the d-separation rule, Pearl 1988):
 * listed and counted by one function, which both the adjustment verdict and the path listing
 * call, so the two never disagree.
 *
 * Method: depth-first backtracking that enters a branch only when the completion test of
 * open-completion.ts says an open (non-causal) completion exists — Read & Tarjan 1975 /
 * Johnson 1975 pruning over the Bayes-Ball state graph. Delay per path O(p · (n + m)) for
 * paths of at most p variables; the count is exact up to `countCap` (the number of paths can
 * grow exponentially, and counting simple paths is #P-complete, Valiant 1979, so the count
 * stops there and says "more than"). A step budget guards the one case where the pruning is a
 * necessary condition only (see open-completion.ts); when it is spent the count is "at least".
 * The search is iterative (an explicit stack): paths can be as long as the diagram.
 */
import type { CompiledDag } from '../graph/compiled';
import { Completions, DOWN, goesToChildren, goesToParents, UP, type OpenPathContext } from './open-completion';
import { ancestorsOf, maskOf, type Mask } from './reach';

/** How far a count can be trusted. */
export type CountBound = 'exact' | 'more-than' | 'at-least';

export interface OpenPathCount {
	count: number;
	/** exact; more-than: over `count` exist (the cap); at-least: the step budget ran out. */
	bound: CountBound;
}

/** Paths are counted exactly up to this number. */
export const OPEN_PATH_COUNT_CAP = 10_000;
/** Default step budget (states scanned by the completion tests): about 5 s of one core (bench/paths.ts). */
export const OPEN_PATH_BUDGET = 400_000_000;

export interface OpenNonCausalListing extends OpenPathCount {
	/** The first `keep` paths found, in search order. */
	paths: number[][];
	/** Partial paths the search extended. */
	branches: number;
	/** Of those, the ones whose search found no path (see open-completion.ts for when). */
	deadBranches: number;
}

export function openPathContext(g: CompiledDag, X: readonly number[], Y: readonly number[], Z: readonly number[]): OpenPathContext {
	// Every variable of an open path lies in An(X ∪ Y ∪ Z) (Lauritzen et al. 1990; Koller &
	// Friedman 2009, §3.3): leaving it out changes no answer and shrinks every test.
	const relevant = ancestorsOf(g, [...X, ...Y, ...Z]);
	const excluded = maskOf(g.n, X);
	for (let v = 0; v < g.n; v++) if (!relevant[v]) excluded[v] = 1;
	return { g, inY: maskOf(g.n, Y), inZ: maskOf(g.n, Z), anZ: ancestorsOf(g, Z), excluded };
}

interface Frame {
	/** Next states to try (2·v + direction), found viable when the frame was made. */
	next: number[];
	pos: number;
	turned: boolean;
	/** Some path was found below this frame. */
	found: boolean;
}

/**
 * Lists (the first `keep`) and counts (up to `countCap`) the open non-causal paths from X to Y
 * given Z. Z must not meet X or Y. Delay O(p · (n + m)) per path.
 */
export function openNonCausalPathsIdx(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	Z: readonly number[],
	opts: { keep?: number; countCap?: number; budget?: number } = {}
): OpenNonCausalListing {
	const keep = opts.keep ?? 50;
	const countCap = opts.countCap ?? OPEN_PATH_COUNT_CAP;
	const budget = opts.budget ?? OPEN_PATH_BUDGET;
	const c = openPathContext(g, X, Y, Z);
	const tables = new Completions(c);
	const onPath = new Uint8Array(g.n);
	const path: number[] = [];
	const paths: number[][] = [];
	let count = 0;
	let work = 0;
	let branches = 0;
	let deadBranches = 0;

	/**
	 * Viable next states from state s (its variable last on `path`, marked on `onPath`). On a
	 * path that has turned, a state with one possible next step needs no test: the test that
	 * admitted s found an open walk from it, whose first step can only be that one.
	 */
	const expand = (s: number, turned: boolean): number[] => {
		const v = s >> 1;
		const out: number[] = [];
		if (goesToParents(c, v, s & 1))
			for (let k = g.parentStart[v]; k < g.parentStart[v + 1]; k++) {
				const w = g.parentList[k];
				if (!onPath[w] && !c.excluded[w]) out.push(2 * w + UP);
			}
		if (goesToChildren(c, v))
			for (let k = g.childStart[v]; k < g.childStart[v + 1]; k++) {
				const w = g.childList[k];
				if (!onPath[w] && !c.excluded[w]) out.push(2 * w + DOWN);
			}
		if (turned && out.length === 1) return out;
		work += tables.compute(onPath);
		let kept = 0;
		for (const t of out) {
			const w = t >> 1;
			const nowTurned = turned || (t & 1) === UP;
			if (c.inY[w] ? nowTurned : nowTurned ? tables.reach[t] : tables.reachTurning[t] || tables.turnHere[w]) out[kept++] = t;
		}
		out.length = kept;
		return out;
	};

	let bound: CountBound = 'exact';
	search: for (const x of X) {
		onPath[x] = 1;
		path.push(x);
		const stack: Frame[] = [{ next: expand(2 * x + UP, false), pos: 0, turned: false, found: false }];
		while (stack.length > 0) {
			const top = stack[stack.length - 1];
			if (top.pos === top.next.length) {
				stack.pop();
				onPath[path.pop()!] = 0;
				if (stack.length > 0) {
					if (top.found) stack[stack.length - 1].found = true;
					else deadBranches++;
				}
				continue;
			}
			const t = top.next[top.pos++];
			const w = t >> 1;
			if (c.inY[w]) {
				top.found = true;
				if (++count > countCap) {
					count = countCap;
					bound = 'more-than';
					break search;
				}
				if (paths.length < keep) paths.push([...path, w]);
				continue;
			}
			if (work > budget) {
				bound = 'at-least';
				break search;
			}
			const turned = top.turned || (t & 1) === UP;
			branches++;
			onPath[w] = 1;
			path.push(w);
			stack.push({ next: expand(t, turned), pos: 0, turned, found: false });
		}
	}
	return { paths, count, bound, branches, deadBranches };
}
