/**
 * Adjustment sets for the effect of X on Y.
 *
 * Total effect: the valid sets are Z ⊆ R = measured \ (X ∪ Y ∪ Dpcp(X, Y)) that d-separate
 * X and Y in the proper back-door graph (adjustment.ts), so the minimal ones are the minimal
 * separators of X and Y in G^pbd within R, listed with polynomial delay in the moral graph of
 * An(X ∪ Y) (van der Zander, Liśkiewicz & Textor 2019, §4 and Algorithm LISTMINSEP).
 * A set exists iff An(X ∪ Y) ∩ R is one (ibid., Lemma 3.4), an O(n + m) test.
 *
 * Direct effect: Pearl's single-door criterion (Causality, 2nd ed. 2009, Theorem 5.3.1):
 * Z identifies the direct effect of x on y iff Z contains no descendant of y and d-separates
 * x and y in G without the arrow x → y. Same listing machinery, R = measured \ ({x, y} ∪ De(y)).
 *
 * Minimum size: a minimum vertex cut (separators.ts). Optimal: O = pa(cn(X, Y)) \ forb(X, Y)
 * (Henckel, Perković & Maathuis, JRSS-B 84, 2022; Rotnitzky & Smucler, JMLR 21, 2020).
 */
import type { CompiledDag } from '../graph/compiled';
import type { Effect } from './types';
import { dSeparated } from './dsep';
import { isAdjustmentSet } from './adjustment';
import { contractedMoralGraph } from './moral-graph';
import { properBackDoorGraph, properCausalStructure } from './proper-causal';
import { ancestorsOf, descendantsOf, membersOf, withoutArrows, type Mask } from './reach';
import { listMinimalSeparators, minimumSeparator } from './separators';

export interface SetListing {
	identifiable: boolean;
	sets: number[][];
	truncated: boolean;
}

export class DirectEffectQuestionError extends Error {
	constructor() {
		super('the direct effect needs exactly one exposure and one outcome');
		this.name = 'DirectEffectQuestionError';
	}
}

interface SeparationProblem {
	graph: CompiledDag;
	allowed: Mask;
}

/** The graph and candidate variables whose X–Y separators are the valid sets. O(n + m). */
function separationProblem(g: CompiledDag, X: readonly number[], Y: readonly number[], effect: Effect): SeparationProblem {
	const allowed = new Uint8Array(g.n);
	if (effect === 'total') {
		const s = properCausalStructure(g, X, Y);
		for (let v = 0; v < g.n; v++) allowed[v] = g.measured[v] && !s.inX[v] && !s.inY[v] && !s.forbidden[v] ? 1 : 0;
		return { graph: properBackDoorGraph(g, s), allowed };
	}
	if (X.length !== 1 || Y.length !== 1) throw new DirectEffectQuestionError();
	const [x] = X;
	const [y] = Y;
	const belowY = descendantsOf(g, [y]);
	for (let v = 0; v < g.n; v++) allowed[v] = g.measured[v] && v !== x && !belowY[v] ? 1 : 0;
	return { graph: withoutArrows(g, (from, to) => from === x && to === y), allowed };
}

/** An(X ∪ Y) ∩ R if it separates (then some valid set exists), else null. O(n + m). */
function largestCandidate(p: SeparationProblem, X: readonly number[], Y: readonly number[]): number[] | null {
	const anc = ancestorsOf(p.graph, [...X, ...Y]);
	const candidate = membersOf(anc).filter((v) => p.allowed[v]);
	return dSeparated(p.graph, X, Y, candidate).separated ? candidate : null;
}

/** Lists the minimal sufficient adjustment sets, at most `max`. Polynomial delay. */
export function listMinimalAdjustmentSetsIdx(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	opts: { effect?: Effect; max?: number } = {}
): SetListing {
	const p = separationProblem(g, X, Y, opts.effect ?? 'total');
	if (largestCandidate(p, X, Y) === null) return { identifiable: false, sets: [], truncated: false };
	const listing = listMinimalSeparators(contractedMoralGraph(p.graph, X, Y, p.allowed), opts.max ?? Infinity);
	return { identifiable: true, ...listing };
}

/** A valid set of smallest size, or null when none exists. O(k (n + m)) for size k. */
export function minimumAdjustmentSetIdx(g: CompiledDag, X: readonly number[], Y: readonly number[], effect: Effect = 'total'): number[] | null {
	const p = separationProblem(g, X, Y, effect);
	if (largestCandidate(p, X, Y) === null) return null;
	return minimumSeparator(contractedMoralGraph(p.graph, X, Y, p.allowed));
}

/**
 * The efficiency-optimal adjustment set O(X, Y) = pa(cn(X, Y)) \ forb(X, Y), where
 * forb = Dpcp(X, Y) ∪ X, returned when it is made of measured variables and is valid
 * (Henckel et al. 2022, Theorem 3.10: when any valid set exists, O is valid for a single
 * exposure; for several exposures validity is checked rather than assumed). O(n + m).
 */
export function optimalAdjustmentSetIdx(g: CompiledDag, X: readonly number[], Y: readonly number[]): number[] | null {
	const s = properCausalStructure(g, X, Y);
	const members = new Set<number>();
	for (const w of membersOf(s.causalNodes)) {
		for (let k = g.parentStart[w]; k < g.parentStart[w + 1]; k++) {
			const p = g.parentList[k];
			if (!s.inX[p] && !s.forbidden[p]) members.add(p);
		}
	}
	const O = [...members].sort((a, b) => a - b);
	if (O.some((v) => !g.measured[v])) return null;
	return isAdjustmentSet(g, X, Y, O) ? O : null;
}

export type OptimalSetGap = { why: 'no-causal-path' } | { why: 'unmeasured'; unmeasured: number[] } | { why: 'not-identifiable' } | { why: 'not-valid' };

/**
 * Why the efficiency-optimal set is missing (or empty for a reason worth saying): the exposure
 * has no causal path to the outcome (cn(X, Y) is empty, so O is not defined by a causal path
 * and any sufficient set estimates the null effect), O contains unmeasured variables, no
 * sufficient set exists, or (several exposures) O is not valid. Null when O exists. O(n + m).
 */
export function optimalSetGapIdx(g: CompiledDag, X: readonly number[], Y: readonly number[], identifiable: boolean): OptimalSetGap | null {
	const s = properCausalStructure(g, X, Y);
	if (!membersOf(s.causalNodes).some((v) => s.inY[v])) return { why: 'no-causal-path' };
	if (!identifiable) return { why: 'not-identifiable' };
	const members = new Set<number>();
	for (const w of membersOf(s.causalNodes))
		for (let k = g.parentStart[w]; k < g.parentStart[w + 1]; k++) {
			const p = g.parentList[k];
			if (!s.inX[p] && !s.forbidden[p]) members.add(p);
		}
	const unmeasured = [...members].filter((v) => !g.measured[v]).sort((a, b) => a - b);
	if (unmeasured.length > 0) return { why: 'unmeasured', unmeasured };
	return optimalAdjustmentSetIdx(g, X, Y) === null ? { why: 'not-valid' } : null;
}
