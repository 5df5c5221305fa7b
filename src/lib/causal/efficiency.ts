/**
 * Efficiency advice for a valid planned set Z: which variables would sharpen the estimate if
 * added (precision variables) and which only add variance if kept (instrument-like
 * variables), and the efficiency-optimal set.
 *
 * Method: the graphical comparison of two valid adjustment sets of Henckel, Perković &
 * Maathuis (JRSS-B 84, 2022, §3; arXiv:1907.02435, stated from memory): Z1 gives an
 * asymptotic variance no larger than Z2 when
 *   (i) Y ⫫ Z2 \ Z1 | X ∪ Z1  and  (ii) X ⫫ Z1 \ Z2 | Z2,
 * for causal linear models fitted by least squares; Rotnitzky & Smucler (JMLR 21, 2020)
 * carry the same ordering to non-parametric estimators. With Z1 = Z ∪ {p}, condition (ii)
 * reads X ⫫ p | Z: adding p never hurts; it helps when p is d-connected to Y given X ∪ Z. With
 * Z1 = Z \ {z}, condition (i) reads Y ⫫ z | X ∪ (Z \ {z}): dropping z never hurts; it helps when
 * z is still d-connected to X — z then only explains exposure variation, like an instrument,
 * which inflates the variance and, with unmeasured confounding, amplifies the bias
 * ("Z-bias": Pearl, UAI 2010; Myers et al., AJE 174, 2011).
 * The optimal set O = pa(cn(X, Y)) \ forb(X, Y) is the valid set of smallest asymptotic
 * variance among all valid sets (Henckel et al. 2022; Rotnitzky & Smucler 2020; sets.ts).
 * O(n (n + m)): one validity test and one or two d-separation tests per variable.
 */
import type { CompiledDag } from '../graph/compiled';
import { isAdjustmentSet } from './adjustment';
import { dSeparated } from './dsep';
import { properCausalStructure } from './proper-causal';
import { optimalAdjustmentSetIdx } from './sets';

export interface EfficiencyAdviceIdx {
	/** Z is valid (the advice below assumes it). */
	applicable: boolean;
	/** Measured p ∉ Z with Z ∪ {p} valid and X ⫫ p | Z; `helps` when p is d-connected to Y given X ∪ Z. */
	add: { variable: number; helps: boolean }[];
	/** z ∈ Z with Z \ {z} valid and Y ⫫ z | X ∪ (Z \ {z}); `helps` when z is d-connected to X given Z \ {z}. */
	drop: { variable: number; helps: boolean }[];
	/** The efficiency-optimal set O, or null when it is not made of measured variables. */
	optimal: number[] | null;
}

export function efficiencyAdviceIdx(g: CompiledDag, X: readonly number[], Y: readonly number[], Z: readonly number[]): EfficiencyAdviceIdx {
	const optimal = optimalAdjustmentSetIdx(g, X, Y);
	if (!isAdjustmentSet(g, X, Y, Z)) return { applicable: false, add: [], drop: [], optimal };
	const s = properCausalStructure(g, X, Y);
	const inZ = new Uint8Array(g.n);
	for (const z of Z) inZ[z] = 1;
	const add: EfficiencyAdviceIdx['add'] = [];
	for (let p = 0; p < g.n; p++) {
		if (inZ[p] || !g.measured[p] || s.inX[p] || s.inY[p] || s.forbidden[p]) continue;
		const bigger = [...Z, p];
		if (!dSeparated(g, X, [p], Z).separated || !isAdjustmentSet(g, X, Y, bigger)) continue;
		add.push({ variable: p, helps: !dSeparated(g, Y, [p], [...X, ...Z]).separated });
	}
	const drop: EfficiencyAdviceIdx['drop'] = [];
	for (const z of Z) {
		const rest = Z.filter((w) => w !== z);
		if (!dSeparated(g, Y, [z], [...X, ...rest]).separated || !isAdjustmentSet(g, X, Y, rest)) continue;
		drop.push({ variable: z, helps: !dSeparated(g, X, [z], rest).separated });
	}
	drop.sort((a, b) => a.variable - b.variable);
	return { applicable: true, add, drop, optimal };
}
