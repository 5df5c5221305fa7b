/**
 * The plain-English name of each role (causal/types.ts), shared by the command line, the app's
 * badges and legend, and the exported report, so that all call a variable the same thing.
 */
import type { Role } from '../causal';

export const ROLE_NAME: Readonly<Record<Role, string>> = {
	exposure: 'exposure',
	outcome: 'outcome',
	confounder: 'confounder',
	'common-cause': 'common cause',
	mediator: 'mediator',
	collider: 'collider',
	'descendant-of-exposure': 'descendant of exposure',
	'descendant-of-outcome': 'descendant of outcome',
	'instrument-like': 'instrument-like',
	precision: 'precision variable',
	unrelated: 'unrelated'
};

/** Badge text shown on the canvas, in a fixed order; roles without a badge are left out. */
const BADGE: Partial<Record<Role, string>> = {
	exposure: 'exposure',
	outcome: 'outcome',
	confounder: 'confounder',
	'common-cause': 'common cause',
	mediator: 'mediator',
	collider: 'collider',
	'descendant-of-outcome': 'descendant of outcome',
	'instrument-like': 'instrument-like',
	precision: 'precision'
};

export const BADGE_ORDER: readonly Role[] = ['exposure', 'outcome', 'confounder', 'common-cause', 'mediator', 'collider', 'descendant-of-outcome', 'instrument-like', 'precision'];

/** Badges of a variable; "common cause" only when it is not also a confounder (less clutter). */
export function badges(roles: readonly Role[]): string[] {
	return BADGE_ORDER.filter((r) => roles.includes(r) && !(r === 'common-cause' && roles.includes('confounder'))).map((r) => BADGE[r]!);
}

/** What each badge means, for the legend. */
export const BADGE_MEANING: readonly [string, string][] = [
	['confounder', 'a pre-exposure variable in some minimal sufficient adjustment set (VanderWeele & Shpitser 2013)'],
	['common cause', 'causes both the exposure and the outcome, not through each other'],
	['mediator', 'lies on a causal path from exposure to outcome'],
	['collider', 'two arrows on an exposure–outcome path meet in it'],
	['descendant of outcome', 'is caused by the outcome'],
	['instrument-like', 'affects the outcome only through the exposure'],
	['precision', 'affects the outcome only, not the exposure']
];

/**
 * For a confounder that carries another role (e.g. also a collider) and needs company in its
 * minimal set: ": adjust together with income"; otherwise "". So "confounder · collider:
 * adjust together with income".
 */
export function adjustTogetherText(r: { roles: readonly Role[]; adjustWith?: readonly string[] }, labelOf: (id: string) => string = (id) => id): string {
	const others = r.roles.filter((x) => x !== 'confounder' && x !== 'common-cause');
	if (!r.roles.includes('confounder') || !r.adjustWith || r.adjustWith.length === 0 || others.length === 0) return '';
	return `: adjust together with ${r.adjustWith.map(labelOf).join(' and ')}`;
}

/** Said of a variable whose confounder status the engine could not decide. */
export const CONFOUNDER_UNDECIDED = 'confounder: not decided (the search for a minimal sufficient set containing it stopped at its limit on this large diagram)';

/** A variable's roles joined with "·", with adjustTogetherText after them. */
export function rolesText(r: { roles: readonly Role[]; adjustWith?: readonly string[]; confounderUndecided?: true }, labelOf: (id: string) => string = (id) => id): string {
	const text = r.roles.map((x) => ROLE_NAME[x]).join(' · ') + adjustTogetherText(r, labelOf);
	return r.confounderUndecided ? `${text} · ${CONFOUNDER_UNDECIDED}` : text;
}
