/**
 * The verdict on the planned set for the diagram as the data see it: when measured variables
 * have no column, the data checks treat them as unmeasured, and the planned set and the
 * sufficient sets may change. The Adjustment section shows this verdict beside the diagram's,
 * with the reason, so that the Data section's estimates ("not sufficient…") never contradict
 * the Adjustment section without saying why. Pure; O(n + m) for the verdict plus the capped
 * listing of sets (van der Zander et al. 2019, via the engine's façade).
 */
// Not the stats façade: the app loads this module up front, and the façade pulls @stdlib's
// modules in with it (+49 KB gzip up front, measured with vite build, December 2026).
import { own } from '../stats/own';
import type { Diagram } from '../graph/diagram';
import { InputError } from '../graph/errors';
import { adjustmentSets, checkAdjustment, type AdjustmentCheck, type AdjustmentSets } from '../causal';
import { dataDiagram } from './mapping';
import type { VariableMapping } from './types';

export interface DataView {
	/** Measured variables of the diagram without a column (ids, in diagram order). */
	noColumn: string[];
	/** The verdict on the planned set with those variables unmeasured. */
	check: AdjustmentCheck;
	/** Minimal sufficient sets among the variables with data (at most `maxSets`). */
	sets: AdjustmentSets;
}

/**
 * Null when every measured variable has a column (the two verdicts are the same) or when the
 * diagram has no question the engine can answer.
 */
export function dataView(d: Diagram, mapping: Pick<VariableMapping, 'columns'>, maxSets = 3): DataView | null {
	const noColumn = d.variables.filter((v) => v.measured && own(mapping.columns, v.id) === undefined).map((v) => v.id);
	if (noColumn.length === 0 || d.exposures.length === 0 || d.outcomes.length === 0) return null;
	const seen = dataDiagram(d, mapping);
	try {
		return { noColumn, check: checkAdjustment(seen), sets: adjustmentSets(seen, { max: maxSets }) };
	} catch (e) {
		if (e instanceof InputError) return null; // the diagram itself cannot be analysed: the section says why
		throw e;
	}
}
