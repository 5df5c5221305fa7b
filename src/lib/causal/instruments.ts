/**
 * Conditional instruments for the total effect of one exposure x on one outcome y.
 *
 * Definition (Brito & Pearl, UAI 2002; Pearl, Causality 2009, §7.4.5), in the total-effect
 * form used by van der Zander, Textor & Liśkiewicz (IJCAI 2015, "Efficiently finding
 * conditional instruments for causal inference"; stated from memory): a variable z is an
 * instrument for x → y conditionally on a set W when
 *   (i)   W has no descendant of a proper causal path node — W ∩ Dpcp(x, y) = ∅ (Dpcp ⊇ De(y)),
 *   (ii)  z and x are d-connected given W in G, and
 *   (iii) z and y are d-separated given W in G_c, G without the first arrow of every proper
 *         causal path (the proper back-door graph; for a single arrow x → y this is G
 *         without x → y, Brito & Pearl's G_c).
 * van der Zander et al. call z an ancestral instrument when such a W exists inside
 * An(y ∪ z) of G_c, and show (ibid.) that then the nearest separator of y and z — the
 * minimal separator closest to y in the moral graph of An(y ∪ z) — is such a W, which makes the
 * search polynomial: one separator and one d-separation test per candidate,
 * O(n (n + m)) in all. A separator near y leaves z's side unconditioned, keeping z–x paths open.
 * Candidates z are measured, neither x nor y, outside Dpcp(x, y) and not descendants of x.
 * Conditional instruments whose only conditioning sets reach beyond An(y ∪ z) (possible: a
 * set can open z–x paths at a collider) are not listed; the nearest separator is exact for
 * ancestral instruments.
 */
import type { CompiledDag } from '../graph/compiled';
import { dSeparated } from './dsep';
import { contractedMoralGraph } from './moral-graph';
import { properBackDoorGraph, properCausalStructure } from './proper-causal';
import { descendantsOf } from './reach';
import { closeSeparator } from './separators';

export interface InstrumentIdx {
	variable: number;
	/** The nearest separator W (sorted); empty for an unconditional instrument. */
	given: number[];
}

export function conditionalInstrumentsIdx(g: CompiledDag, x: number, y: number): InstrumentIdx[] {
	const s = properCausalStructure(g, [x], [y]);
	const gc = properBackDoorGraph(g, s);
	const belowX = descendantsOf(g, [x]);
	const out: InstrumentIdx[] = [];
	for (let z = 0; z < g.n; z++) {
		if (z === x || z === y || !g.measured[z] || s.forbidden[z] || belowX[z]) continue;
		const allowed = new Uint8Array(g.n);
		for (let v = 0; v < g.n; v++) allowed[v] = g.measured[v] && v !== x && v !== y && v !== z && !s.forbidden[v] ? 1 : 0;
		const h = contractedMoralGraph(gc, [y], [z], allowed);
		const W = closeSeparator(h, [h.source]);
		if (W === null) continue;
		if (dSeparated(g, [z], [x], W).separated) continue;
		out.push({ variable: z, given: W });
	}
	return out;
}
