/**
 * The proper causal structure between exposures X and outcomes Y, as defined by
 * van der Zander, Liśkiewicz & Textor (Artificial Intelligence 270, 2019; arXiv:1803.00116) and
 * Shpitser, VanderWeele & Robins (UAI 2010):
 *
 * - a proper causal path is a directed path from X to Y whose only X-variable is its first;
 * - cn(X, Y): the variables other than X on proper causal paths (Y included when reached);
 * - Dpcp(X, Y) = De(cn(X, Y)): no adjustment set may contain them;
 * - the proper back-door graph G^pbd: G without the first arrow of every proper causal path,
 *   i.e. without x → w for x ∈ X, w ∈ cn(X, Y).
 * Each is O(n + m).
 */
import type { CompiledDag } from '../graph/compiled';
import { ancestorsOf, descendantsOf, maskOf, membersOf, withoutArrows, type Mask } from './reach';

export interface ProperCausalStructure {
	inX: Mask;
	inY: Mask;
	/** cn(X, Y). */
	causalNodes: Mask;
	/** Dpcp(X, Y) = De(cn(X, Y)). */
	forbidden: Mask;
}

export function properCausalStructure(g: CompiledDag, X: readonly number[], Y: readonly number[]): ProperCausalStructure {
	const inX = maskOf(g.n, X);
	const inY = maskOf(g.n, Y);
	// Descendants of X in G with the arrows into X removed = reachable without re-entering X.
	const fromX = descendantsOf(g, X, inX);
	// Ancestors of Y by directed paths that avoid X.
	const toY = ancestorsOf(g, Y, inX);
	const causalNodes = new Uint8Array(g.n);
	for (let v = 0; v < g.n; v++) if (!inX[v] && fromX[v] && toY[v]) causalNodes[v] = 1;
	const forbidden = descendantsOf(g, membersOf(causalNodes));
	return { inX, inY, causalNodes, forbidden };
}

/** G^pbd(X, Y): G without x → w for x ∈ X and w ∈ cn(X, Y). O(n + m). */
export function properBackDoorGraph(g: CompiledDag, s: ProperCausalStructure): CompiledDag {
	return withoutArrows(g, (from, to) => s.inX[from] === 1 && s.causalNodes[to] === 1);
}
