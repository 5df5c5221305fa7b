/** Words of the Data section (shared by its components and tested without a browser). */
import type { ArrowSupport, ClaimStatus, EstimateRow } from '../datacheck';

export const SUPPORT_TEXT: Record<ArrowSupport, string> = {
	supported: 'supported',
	weak: 'weak',
	absent: 'not found',
	untested: 'not tested'
};

export const SUPPORT_EXPLAIN: Record<ArrowSupport, string> = {
	supported: 'the data show an association of at least small size (p below the level)',
	weak: 'detectable, but below Cohen\'s (1988) "small" size in the measure shown (|r| or V under 0.1, |d| under 0.2; a rule of thumb); odds ratios are never called weak',
	absent: 'no association detected at this level — not proof that the arrow is absent',
	untested: 'the test could not run'
};

export const CLAIM_TEXT: Record<ClaimStatus, string> = {
	contradicted: 'contradicted',
	consistent: 'consistent',
	untested: 'not tested'
};

/** Short row names for the forest plot: "Crude", "Minimal 2", "Optimal", "Planned", joined by "·". */
export function shortRowLabels(rows: readonly EstimateRow[]): string[] {
	let minimal = 0;
	const minimalCount = rows.filter((r) => r.roles.includes('minimal')).length;
	return rows.map((r) =>
		r.roles
			.map((role) => {
				if (role === 'minimal') {
					minimal++;
					return minimalCount > 1 ? `Minimal ${minimal}` : 'Minimal';
				}
				return role[0].toUpperCase() + role.slice(1);
			})
			.join(' · ')
	);
}
