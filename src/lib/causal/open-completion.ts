/**
 * Which partial paths can still be completed to an open path to the outcome: the pruning test
 * behind the polynomial-delay listing of open paths (open-paths.ts).
 *
 * Method: backtracking with a reachability test before every extension, as Read & Tarjan
 * (Networks 1975) and Johnson (SIAM J. Comput. 1975) list simple paths and cycles: a branch is
 * entered only when it leads to at least one output, so the delay between outputs is the depth
 * times the cost of one test. Here the test is d-connection rather than plain reachability: a
 * breadth-first search run backwards from Y over the Bayes-Ball state graph (Shachter 1998;
 * Koller & Friedman 2009, Alg. 3.1), states (variable, direction of arrival), with the
 * partial path's variables removed. Collider openness keeps using An(Z) of the whole diagram
 * (d-connection asks for a descendant in Z, anywhere).
 *
 * Why a walk is enough: an open walk from the path's last variable to Y in the diagram without
 * the path's other variables becomes an open simple path by loop erasure (the argument is in
 * dsep.ts: a variable that repeats either lies in An(Z) or keeps a non-collider join), and the
 * erasure never touches the partial path. So `reach` is exact: it is true iff some simple
 * completion is open. O(n + m) per call.
 *
 * `reachTurning` and `turnHere` answer the question for a path that is still directed and must
 * become non-causal: it has to turn at a collider in De(X) ∩ An(Z), then reach Y. Loop erasure
 * can remove that turn (the walk may come back into its own directed part), so this is a
 * necessary condition only — exact once the path has turned, i.e. for every back-door path
 * from its first arrow on; for a path that leaves the exposure along arrows a dead branch can
 * remain inside De(X) ∩ An(Z) (deciding that part exactly is a disjoint-paths question), and
 * the caller's step budget bounds it. Measured: a dead branch in 6 of 345 random questions of
 * at most 12 variables whose Z holds a descendant of X (tests/unit/causal/open-paths.test.ts),
 * none in the benchmark's (bench/paths.ts).
 */
import type { CompiledDag } from '../graph/compiled';
import { DOWN, UP, type StateRules } from './connection-distances';
import type { Mask } from './reach';

// States are 2·v + direction, the Bayes-Ball rules those of connection-distances.ts: UP =
// arrived from a child (or the start), DOWN = arrived from a parent.
export { DOWN, UP, goesToChildren, goesToParents } from './connection-distances';

/** The fixed part of a question: Y, Z, An(Z) and the variables no open path can use. */
export interface OpenPathContext extends StateRules {
	g: CompiledDag;
	inY: Mask;
	/** X, and variables outside An(X ∪ Y ∪ Z) (no open path passes there). */
	excluded: Mask;
}

/**
 * The two tables, recomputed for each partial path in one reused workspace (the search needs
 * only the latest). Written as flat loops over typed arrays, without closures or allocation
 * per call: a profile of counting 10,000 paths on a 1,000-variable diagram spent 65 % of its
 * time here, and allocation and closure calls were a fifth of that.
 */
export class Completions {
	/** reach[s]: from state s an open walk reaches Y avoiding the removed variables. */
	readonly reach: Uint8Array;
	/**
	 * reachTurning[2·v + DOWN]: from v, entered along an arrow, a walk goes on along arrows to a
	 * collider in An(Z), turns there to a parent other than the one it came from, and reaches Y.
	 */
	readonly reachTurning: Uint8Array;
	/** turnHere[v]: v is in An(Z) and one of its parents (not removed) reaches Y: v may turn. */
	readonly turnHere: Uint8Array;
	private readonly queue: Int32Array;
	private tail = 0;
	private readonly turnQueue: Int32Array;
	private turnTail = 0;
	private readonly turned: Int32Array;
	private turnedCount = 0;
	/** Y's variables and the candidate colliders (An(Z), not excluded, not in Y). */
	private readonly outcomes: Int32Array;
	private readonly colliders: Int32Array;

	constructor(private readonly c: OpenPathContext) {
		const n = c.g.n;
		this.reach = new Uint8Array(2 * n);
		this.reachTurning = new Uint8Array(2 * n);
		this.turnHere = new Uint8Array(n);
		this.queue = new Int32Array(2 * n);
		this.turnQueue = new Int32Array(n);
		this.turned = new Int32Array(n);
		const ys: number[] = [];
		const cs: number[] = [];
		for (let v = 0; v < n; v++) {
			if (c.excluded[v]) continue;
			if (c.inY[v]) ys.push(v);
			else if (c.anZ[v]) cs.push(v);
		}
		this.outcomes = Int32Array.from(ys);
		this.colliders = Int32Array.from(cs);
	}

	/**
	 * Both tables for the diagram without `removed` (and without c.excluded). Y's own states
	 * count as reached; walks never pass through Y. Returns the states scanned. O(n + m).
	 */
	compute(removed: Mask): number {
		const { g, inY, inZ, anZ, excluded } = this.c;
		const { reach, reachTurning, turnHere, queue, turnQueue } = this;
		for (let i = 0; i < this.tail; i++) reach[queue[i]] = 0;
		for (let i = 0; i < this.turnTail; i++) reachTurning[2 * turnQueue[i] + DOWN] = 0;
		for (let i = 0; i < this.turnedCount; i++) turnHere[this.turned[i]] = 0;
		let tail = 0;
		for (const y of this.outcomes) {
			if (removed[y]) continue;
			reach[2 * y + UP] = reach[2 * y + DOWN] = 1;
			queue[tail++] = 2 * y + UP;
			queue[tail++] = 2 * y + DOWN;
		}
		// Predecessors of state (w', d'): d' = UP means w' was entered from a child w (w moved to
		// its parents: allowed from UP when w ∉ Z, from DOWN when w ∈ An(Z)); d' = DOWN means
		// entered from a parent w (w moved to its children: allowed when w ∉ Z).
		for (let head = 0; head < tail; head++) {
			const state = queue[head];
			const w2 = state >> 1;
			if ((state & 1) === UP) {
				for (let k = g.childStart[w2]; k < g.childStart[w2 + 1]; k++) {
					const w = g.childList[k];
					if (removed[w] || excluded[w] || inY[w]) continue;
					if (!inZ[w] && !reach[2 * w + UP]) {
						reach[2 * w + UP] = 1;
						queue[tail++] = 2 * w + UP;
					}
					if (anZ[w] && !reach[2 * w + DOWN]) {
						reach[2 * w + DOWN] = 1;
						queue[tail++] = 2 * w + DOWN;
					}
				}
			} else {
				for (let k = g.parentStart[w2]; k < g.parentStart[w2 + 1]; k++) {
					const w = g.parentList[k];
					if (removed[w] || excluded[w] || inY[w] || inZ[w]) continue;
					if (!reach[2 * w + UP]) {
						reach[2 * w + UP] = 1;
						queue[tail++] = 2 * w + UP;
					}
					if (!reach[2 * w + DOWN]) {
						reach[2 * w + DOWN] = 1;
						queue[tail++] = 2 * w + DOWN;
					}
				}
			}
		}
		this.tail = tail;
		// Turning, for a walk still going along arrows (states DOWN): it turns at a collider c in
		// An(Z), entered from a parent u, by leaving to another parent p that reaches Y. "Another"
		// matters: going back up the arrow just come down (u → c ← u) is a walk but never a path,
		// and it is the common false turn (any variable with a child in Z offers it).
		let turnTail = 0;
		let turnedCount = 0;
		for (const cv of this.colliders) {
			if (removed[cv]) continue;
			let upward = 0;
			let onlyParent = -1;
			for (let k = g.parentStart[cv]; k < g.parentStart[cv + 1]; k++) {
				const p = g.parentList[k];
				if (!removed[p] && !excluded[p] && reach[2 * p + UP]) {
					upward++;
					onlyParent = p;
				}
			}
			if (upward === 0) continue;
			turnHere[cv] = 1;
			this.turned[turnedCount++] = cv;
			for (let k = g.parentStart[cv]; k < g.parentStart[cv + 1]; k++) {
				const u = g.parentList[k];
				if (removed[u] || excluded[u] || inY[u] || inZ[u] || (upward === 1 && u === onlyParent) || reachTurning[2 * u + DOWN]) continue;
				reachTurning[2 * u + DOWN] = 1;
				turnQueue[turnTail++] = u;
			}
		}
		for (let head = 0; head < turnTail; head++) {
			const u = turnQueue[head];
			for (let k = g.parentStart[u]; k < g.parentStart[u + 1]; k++) {
				const q = g.parentList[k];
				if (removed[q] || excluded[q] || inY[q] || inZ[q] || reachTurning[2 * q + DOWN]) continue;
				reachTurning[2 * q + DOWN] = 1;
				turnQueue[turnTail++] = q;
			}
		}
		this.turnTail = turnTail;
		this.turnedCount = turnedCount;
		return tail + turnTail + this.colliders.length;
	}
}
