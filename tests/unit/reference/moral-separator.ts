/**
 * The claims' separator by the explicit construction (the engine's method before the fast
 * version in src/lib/causal/claims.ts): a d-separation test of An({a, b}) ∩ R (van der Zander,
 * Liśkiewicz & Textor 2019, Lemma 3.4), then the close separator (separators.ts) of the
 * contracted moral graph of An({a, b}) (moral-graph.ts). Used as the reference in
 * tests/unit/causal/claims.test.ts and as the baseline in bench/claims.ts.
 */
import type { CompiledDag } from '../../../src/lib/graph/compiled';
import { dSeparated } from '../../../src/lib/causal/dsep';
import { contractedMoralGraph } from '../../../src/lib/causal/moral-graph';
import { ancestorsOf, membersOf } from '../../../src/lib/causal/reach';
import { closeSeparator } from '../../../src/lib/causal/separators';

export function measuredSeparatorViaMoralGraph(g: CompiledDag, a: number, b: number): number[] | null {
	const allowed = new Uint8Array(g.n);
	for (let v = 0; v < g.n; v++) allowed[v] = g.measured[v] && v !== a && v !== b ? 1 : 0;
	const candidate = membersOf(ancestorsOf(g, [a, b])).filter((v) => allowed[v]);
	if (!dSeparated(g, [a], [b], candidate).separated) return null;
	const h = contractedMoralGraph(g, [a], [b], allowed);
	return closeSeparator(h, [h.source]);
}
