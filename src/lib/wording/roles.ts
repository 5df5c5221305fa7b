/**
 * The plain-English name of each role (causal/types.ts), shared by the command line, the app's
 * badges and legend, and the exported report, so that all call a variable the same thing.
 */
import type { Role } from '../causal';

export const ROLE_NAME: Readonly<Record<Role, string>> = {
	exposure: 'exposure',
	outcome: 'outcome',
	confounder: 'confounder',
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
	mediator: 'mediator',
	collider: 'collider',
	'descendant-of-outcome': 'descendant of outcome',
	'instrument-like': 'instrument-like',
	precision: 'precision'
};

export const BADGE_ORDER: readonly Role[] = ['exposure', 'outcome', 'confounder', 'mediator', 'collider', 'descendant-of-outcome', 'instrument-like', 'precision'];

export function badges(roles: readonly Role[]): string[] {
	return BADGE_ORDER.filter((r) => roles.includes(r)).map((r) => BADGE[r]!);
}

/** What each badge means, for the legend. */
export const BADGE_MEANING: readonly [string, string][] = [
	['confounder', 'causes both the exposure and the outcome'],
	['mediator', 'lies on a causal path from exposure to outcome'],
	['collider', 'two arrows on an exposure–outcome path meet in it'],
	['descendant of outcome', 'is caused by the outcome'],
	['instrument-like', 'affects the outcome only through the exposure'],
	['precision', 'affects the outcome only, not the exposure']
];
