/**
 * Words of the confounder check and of the efficiency-optimal set's absence, shared by the
 * app, the command line and the report.
 */
import type { AdjustmentSets } from '../causal';

/**
 * "Efficiency-optimal set: {age, income}." or the real reason there is none, e.g. that the
 * exposure has no causal path to the outcome in the diagram. `set` writes a set of ids.
 */
export function optimalSetSentence(sets: Pick<AdjustmentSets, 'optimal' | 'optimalGap'>, set: (ids: readonly string[]) => string, cite = ''): string {
	const gap = sets.optimalGap;
	if (gap?.why === 'no-causal-path')
		return 'Efficiency-optimal set: not defined, because the diagram has no causal path from the exposure to the outcome (its effect is null under the diagram; any sufficient set estimates that null).';
	if (sets.optimal) return `Efficiency-optimal set${cite}: ${set(sets.optimal)}.`;
	if (gap?.why === 'unmeasured') return `Efficiency-optimal set: none with the data at hand, as it would include the unmeasured ${set(gap.unmeasured)}.`;
	if (gap?.why === 'not-identifiable') return 'Efficiency-optimal set: none, as no sufficient adjustment set exists.';
	return 'Efficiency-optimal set: none valid for these exposures.';
}
