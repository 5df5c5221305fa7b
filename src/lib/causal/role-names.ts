/**
 * The plain-English name of each role (types.ts), shared by the command line and the exported
 * report so that both call a variable the same thing.
 */
import type { Role } from './types';

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
