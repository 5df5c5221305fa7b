/**
 * What changed when a kept data table met another diagram (New, Open, a share link): which
 * columns the new diagram's variables are linked to, which measured variables found none, and
 * which columns used before are no longer used. Pure, O(variables + columns).
 */
// Not the stats façade: the app loads this module up front, and the façade pulls @stdlib's
// modules in with it (+49 KB gzip up front, measured with vite build, December 2026).
import { own } from '../stats/own';
import type { Diagram } from '../graph/diagram';
import type { DataCheckReport } from './types';

export interface Rematch {
	source: string;
	/** Variable label ← column, for the new diagram. */
	linked: { label: string; column: string; before: string | null }[];
	/** Measured variables of the new diagram with no column (treated as unmeasured by the checks). */
	unlinked: string[];
	/** Columns the previous diagram used that the new one does not. */
	dropped: { column: string; before: string }[];
}

export function rematchDifferences(before: Diagram, beforeReport: DataCheckReport, after: Diagram, afterReport: DataCheckReport, source: string): Rematch {
	const label = (d: Diagram, id: string) => d.variables.find((v) => v.id === id)?.label ?? id;
	const usedBefore = new Map(Object.entries(beforeReport.mapping.columns).map(([id, column]) => [column, label(before, id)]));
	const usedAfter = new Set(Object.values(afterReport.mapping.columns));
	return {
		source,
		linked: after.variables.flatMap((v) => {
			const column = own(afterReport.mapping.columns, v.id);
			return column === undefined ? [] : [{ label: v.label, column, before: usedBefore.get(column) ?? null }];
		}),
		unlinked: afterReport.mapping.unmapped.map((id) => label(after, id)),
		dropped: [...usedBefore].filter(([column]) => !usedAfter.has(column)).map(([column, was]) => ({ column, before: was }))
	};
}
