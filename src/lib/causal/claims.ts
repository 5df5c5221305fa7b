/**
 * The conditional independencies a diagram implies ("claims"): for each pair of measured,
 * non-adjacent variables, one minimal set of measured variables that d-separates them, or
 * null when no set of measured variables does (then the diagram implies no testable
 * independence for the pair). A separator exists iff An({a, b}) ∩ R separates (van der Zander,
 * Liśkiewicz & Textor 2019, Lemma 3.4); a minimal one is the close separator in the moral
 * graph of An({a, b}) (separators.ts). O(n + Σ indeg²) per pair, O(n² (n + Σ indeg²)) in all.
 */
import type { CompiledDag } from '../graph/compiled';
import { dSeparated } from './dsep';
import { contractedMoralGraph } from './moral-graph';
import { adjacent, ancestorsOf, membersOf } from './reach';
import { closeSeparator } from './separators';

export interface ClaimIdx {
	a: number;
	b: number;
	given: number[] | null;
}

/** One minimal measured separator of a and b, or null. */
export function minimalMeasuredSeparator(g: CompiledDag, a: number, b: number): number[] | null {
	const allowed = new Uint8Array(g.n);
	for (let v = 0; v < g.n; v++) allowed[v] = g.measured[v] && v !== a && v !== b ? 1 : 0;
	const candidate = membersOf(ancestorsOf(g, [a, b])).filter((v) => allowed[v]);
	if (!dSeparated(g, [a], [b], candidate).separated) return null;
	const h = contractedMoralGraph(g, [a], [b], allowed);
	return closeSeparator(h, [h.source]);
}

/** Claims for every non-adjacent pair of measured variables, at most `max`. */
export function impliedClaimsIdx(g: CompiledDag, max = Infinity): { claims: ClaimIdx[]; truncated: boolean } {
	const claims: ClaimIdx[] = [];
	for (let a = 0; a < g.n; a++) {
		if (!g.measured[a]) continue;
		for (let b = a + 1; b < g.n; b++) {
			if (!g.measured[b] || adjacent(g, a, b)) continue;
			if (claims.length >= max) return { claims, truncated: true };
			claims.push({ a, b, given: minimalMeasuredSeparator(g, a, b) });
		}
	}
	return { claims, truncated: false };
}
