/**
 * Plain-language wording of engine results for the analysis column and the canvas badges.
 * Pure functions of the results and a label look-up, so the sentences can be tested without
 * a browser. Variables are always named by their labels.
 */
import type { AdjustmentCheck, AdjustmentProblem, Claim, ForbiddenWhy, PathInfo, PathNodeReason, Role } from '../causal/types';
import type { Diagram } from '../graph/diagram';

export type LabelOf = (id: string) => string;

export function labelLookup(d: Diagram): LabelOf {
	const map = new Map(d.variables.map((v) => [v.id, v.label]));
	return (id) => map.get(id) ?? id;
}

/** "A", "A and B", "A, B and C". */
export function listNames(names: readonly string[]): string {
	if (names.length <= 1) return names.join('');
	return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** A set as the app shows it: "{Age, Diet quality}", or "{ } (no adjustment)" when empty. */
export function setText(ids: readonly string[], labelOf: LabelOf): string {
	return ids.length === 0 ? '{ } (no adjustment)' : `{${ids.map(labelOf).join(', ')}}`;
}

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

const FORBIDDEN: Record<ForbiddenWhy, string> = {
	exposure: 'is an exposure; it cannot be adjusted for',
	outcome: 'is an outcome; it cannot be adjusted for',
	mediator: 'is a mediator: adjusting for it removes part of the effect being estimated',
	'descendant-of-mediator': 'is caused by a mediator: adjusting for it removes part of the effect or opens a biasing path',
	'descendant-of-outcome': 'is caused by the outcome: adjusting for it can bias the estimate',
	'descendant-of-exposure': 'is caused by the exposure on the way to the outcome: adjusting for it can bias the estimate',
	unmeasured: 'is unmeasured, so it cannot be adjusted for'
};

/** The arrows of a diagram as a set of "from\0to" keys, for pathText. O(m). */
export function arrowSet(d: Diagram): ReadonlySet<string> {
	return new Set(d.arrows.map((a) => `${a.from}\u0000${a.to}`));
}

/** "A → B ← C": the path with each arrow's real direction. */
export function pathText(nodes: readonly string[], d: Diagram, labelOf: LabelOf, arrows: ReadonlySet<string> = arrowSet(d)): string {
	let text = labelOf(nodes[0] ?? '');
	for (let i = 1; i < nodes.length; i++) {
		const forward = arrows.has(`${nodes[i - 1]}\u0000${nodes[i]}`);
		text += `${forward ? ' → ' : ' ← '}${labelOf(nodes[i])}`;
	}
	return text;
}

export function problemText(p: AdjustmentProblem, d: Diagram, labelOf: LabelOf): string {
	if (p.kind === 'open-path') return `A biasing path stays open: ${pathText(p.path, d, labelOf)}.`;
	return `${labelOf(p.variable)} ${FORBIDDEN[p.why]}.`;
}

/** The verdict on the planned set, in one sentence. */
export function verdictSentence(check: AdjustmentCheck, labelOf: LabelOf): string {
	const planned = check.adjusted.map(labelOf);
	if (check.valid) {
		return planned.length === 0
			? 'No adjustment is needed: with nothing adjusted for, every biasing path is already blocked.'
			: `Adjusting for ${listNames(planned)} is sufficient: it blocks every biasing path and adjusts for no mediator or descendant of the outcome.`;
	}
	const open = check.problems.filter((p) => p.kind === 'open-path').length;
	const bad = check.problems.length - open;
	const parts: string[] = [];
	if (open > 0) parts.push(`${open === 1 ? 'a biasing path stays' : `${open} biasing paths stay`} open`);
	if (bad > 0) parts.push(`${bad === 1 ? 'one variable' : `${bad} variables`} should not be adjusted for`);
	const subject = planned.length === 0 ? 'Adjusting for nothing' : `Adjusting for ${listNames(planned)}`;
	return `${subject} is not sufficient: ${listNames(parts)}.`;
}

function reasonText(r: PathNodeReason, labelOf: LabelOf): string {
	switch (r.reason) {
		case 'adjusted-non-collider':
			return `${labelOf(r.node)} (adjusted for)`;
		case 'collider-not-adjusted':
			return `${labelOf(r.node)} (collider, not adjusted for)`;
		case 'collider-adjusted':
			return `${labelOf(r.node)} (collider, adjusted for)`;
		case 'collider-descendant-adjusted':
			return `${labelOf(r.node)} (collider, opened by adjusting for ${labelOf(r.via)})`;
	}
}

/** Whether a path is causal (directed from exposure to outcome) or not (a biasing path). */
export function pathKindLabel(p: PathInfo): 'causal' | 'biasing' {
	return p.causal ? 'causal' : 'biasing';
}

/** Open or blocked, and where: "open", "open through M (collider, adjusted for)", "blocked at A (adjusted for)". */
export function pathStatus(p: PathInfo, labelOf: LabelOf): string {
	if (p.open) {
		const opened = p.reasons.map((r) => reasonText(r, labelOf));
		return opened.length > 0 ? `open through ${listNames(opened)}` : 'open';
	}
	return `blocked at ${listNames(p.reasons.map((r) => reasonText(r, labelOf)))}`;
}

/** The visual kind of a path: causal (solid blue), open biasing (dashed vermillion) or blocked. */
export function pathKind(p: PathInfo): 'causal' | 'open' | 'blocked' {
	if (!p.open) return 'blocked';
	return p.causal ? 'causal' : 'open';
}

export function claimSentence(c: Claim, labelOf: LabelOf): string {
	const a = labelOf(c.a);
	const b = labelOf(c.b);
	if (c.given === null) return `${a} and ${b}: no independence that the measured variables could test.`;
	if (c.given.length === 0) return `${a} is independent of ${b}.`;
	return `${a} is independent of ${b} given ${listNames(c.given.map(labelOf))}.`;
}
