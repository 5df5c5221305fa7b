/** Words of the Data section (shared by its components and tested without a browser). */
import type { ArrowSupport, ClaimStatus, EstimateRow } from '../datacheck';
import { countText, plural } from './names';
import { groupThousands } from './numbers';

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

/** The Data section's header summary: "3/12 arrows supported · 1 contradicted" ("claims…" while they run). */
export function dataSummaryText(supported: number, arrows: number, contradicted: number | 'pending' | 'not run'): string {
	const claims = contradicted === 'pending' ? 'claims…' : contradicted === 'not run' ? 'claims not run' : `${groupThousands(contradicted)} contradicted`;
	return `${groupThousands(supported)}/${groupThousands(arrows)} ${plural(arrows, 'arrow')} supported · ${claims}`;
}

/** Said to screen readers when the data checks are done: "Data checks done: 1 of 1 arrow supported, 0 of 3 claims contradicted." */
export function dataChecksDoneText(supported: number, arrows: number, contradicted: number, tested: number, estimates: boolean): string {
	return `Data checks done: ${groupThousands(supported)} of ${countText(arrows, 'arrow')} supported, ${groupThousands(contradicted)} of ${countText(tested, 'claim')} contradicted${estimates ? ', estimates ready' : ''}.`;
}

/** "Opened study.dot: 1 variable, 0 arrows." — the message when a diagram is opened (file or share link). */
export function openedDiagramText(source: string, variables: number, arrows: number): string {
	return `Opened ${source}: ${countText(variables, 'variable')}, ${countText(arrows, 'arrow')}.`;
}
