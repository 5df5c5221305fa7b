/** Plain-text rendering helpers for the command's human-readable output. */
import type { AdjustmentProblem, ForbiddenWhy, PathNodeReason } from '../causal';
import { ROLE_NAME } from './roles';

export const braces = (ids: readonly string[]): string => (ids.length === 0 ? '{} (no adjustment needed)' : `{${ids.join(', ')}}`);

export function pathText(nodes: readonly string[], arrows?: (a: string, b: string) => boolean): string {
	if (!arrows) return nodes.join(' – ');
	let out = nodes[0] ?? '';
	for (let i = 1; i < nodes.length; i++) out += arrows(nodes[i - 1], nodes[i]) ? ` → ${nodes[i]}` : ` ← ${nodes[i]}`;
	return out;
}

const WHY: Record<ForbiddenWhy, string> = {
	exposure: 'is an exposure',
	outcome: 'is an outcome',
	mediator: 'is a mediator (on a causal path from exposure to outcome): adjusting it removes part of the effect',
	'descendant-of-mediator': 'is a descendant of a mediator: adjusting it removes or biases part of the effect',
	'descendant-of-outcome': 'is a descendant of the outcome: adjusting it biases the estimate',
	'descendant-of-exposure': 'is a descendant of the exposure through a causal path',
	unmeasured: 'is not measured, so it cannot be adjusted for'
};

export function problemText(p: AdjustmentProblem, arrows: (a: string, b: string) => boolean): string {
	if (p.kind === 'forbidden') return `${p.variable} ${WHY[p.why]}`;
	return `open non-causal path: ${pathText(p.path, arrows)}`;
}

export const ROLE_TEXT = ROLE_NAME;

export function reasonText(r: PathNodeReason): string {
	switch (r.reason) {
		case 'adjusted-non-collider':
			return `blocked at ${r.node} (adjusted, not a collider)`;
		case 'collider-not-adjusted':
			return `blocked at ${r.node} (collider, neither it nor a descendant adjusted)`;
		case 'collider-adjusted':
			return `opened at ${r.node} (collider, adjusted)`;
		case 'collider-descendant-adjusted':
			return `opened at ${r.node} (collider whose descendant ${r.via} is adjusted)`;
	}
}
