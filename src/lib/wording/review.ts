/**
 * Plain-language sentences for the reviewer tools, shared by the CLI and the app so both say
 * the same thing. Pure functions of the results, a label look-up and an arrow test.
 */
import type { AdjustmentReview, AssumptionChange, PlanWeakness, ReviewReason } from '../causal';

export type Label = (id: string) => string;
/** True when the arrow a → b is in the diagram the path belongs to. */
export type ArrowTest = (a: string, b: string) => boolean;

export function arrowTest(arrows: readonly { from: string; to: string }[]): ArrowTest {
	const keys = new Set(arrows.map((a) => `${a.from}\u0000${a.to}`));
	return (a, b) => keys.has(`${a}\u0000${b}`);
}

/** The arrow test of the diagram after one change (for witness paths that use the new arrow). */
export function arrowTestAfter(arrows: readonly { from: string; to: string }[], change: AssumptionChange): ArrowTest {
	const base = arrowTest(arrows);
	if (change.kind === 'add-arrow') return (a, b) => (a === change.from && b === change.to) || base(a, b);
	if (change.kind === 'reverse-arrow') return (a, b) => (a === change.to && b === change.from) || (base(a, b) && !(a === change.from && b === change.to));
	return base;
}

/** "A → B ← C". */
export function pathWords(nodes: readonly string[], arrow: ArrowTest, label: Label): string {
	let text = label(nodes[0] ?? '');
	for (let i = 1; i < nodes.length; i++) text += `${arrow(nodes[i - 1], nodes[i]) ? ' → ' : ' ← '}${label(nodes[i])}`;
	return text;
}

/** "A", "A and B", "A, B and C". */
export function listWords(names: readonly string[]): string {
	if (names.length <= 1) return names.join('');
	return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

export function setWords(ids: readonly string[], label: Label): string {
	return ids.length === 0 ? '{ } (no adjustment)' : `{${ids.map(label).join(', ')}}`;
}

export function reviewVerdict(r: AdjustmentReview, label: Label): string {
	const set = setWords(r.adjusted, label);
	const effect = `the total effect of ${listWords(r.exposures.map(label))} on ${listWords(r.outcomes.map(label))}`;
	if (r.valid) return `Adjusting for ${set} is sufficient to estimate ${effect}, if the diagram is right.`;
	const kinds = new Set(r.reasons.map((x) => x.kind));
	const what: string[] = [];
	if (kinds.has('open-path')) what.push('leaves a biasing path open');
	if (kinds.has('overadjustment')) what.push('adjusts away part of the effect (overadjustment)');
	if (kinds.has('collider-bias')) what.push('opens a path by adjusting a collider (collider bias)');
	if (kinds.has('descendant-of-outcome')) what.push('adjusts a consequence of the outcome');
	if (kinds.has('unmeasured') || kinds.has('exposure-or-outcome')) what.push('names a variable that cannot be adjusted');
	return `Adjusting for ${set} is NOT sufficient to estimate ${effect}: it ${listWords(what)}.`;
}

export function reasonWords(x: ReviewReason, arrow: ArrowTest, label: Label): string {
	switch (x.kind) {
		case 'open-path':
			return `${x.backDoor ? 'Open back-door path' : 'Open non-causal path'}: ${pathWords(x.path, arrow, label)}.`;
		case 'overadjustment':
			return x.why === 'mediator'
				? `Overadjustment: ${label(x.variable)} is a mediator (on a causal path from exposure to outcome); adjusting for it removes part of the effect.`
				: `Overadjustment: ${label(x.variable)} is caused by a mediator; adjusting for it removes part of the effect or biases it.`;
		case 'collider-bias':
			return x.collider === x.variable
				? `Collider bias: ${label(x.variable)} is a collider on ${pathWords(x.path, arrow, label)}; adjusting for it opens that path.`
				: `Collider bias: ${label(x.variable)} is caused by the collider ${label(x.collider)} on ${pathWords(x.path, arrow, label)}; adjusting for it opens that path.`;
		case 'descendant-of-outcome':
			return `${label(x.variable)} is caused by the outcome; adjusting for it biases the estimate.`;
		case 'exposure-or-outcome':
			return `${label(x.variable)} is the ${x.which}; it cannot be adjusted for.`;
		case 'unmeasured':
			return `${label(x.variable)} is unmeasured, so it cannot be adjusted for.`;
	}
}

/** What the plan relies on: "no arrow from A to B". */
export function assumptionWords(c: AssumptionChange, label: Label): string {
	switch (c.kind) {
		case 'add-arrow':
			return `no arrow from ${label(c.from)} to ${label(c.to)}`;
		case 'reverse-arrow':
			return `the arrow ${label(c.from)} → ${label(c.to)} pointing that way, not ${label(c.to)} → ${label(c.from)}`;
		case 'delete-arrow':
			return `the arrow ${label(c.from)} → ${label(c.to)}`;
		case 'unmeasure':
			return `${label(c.variable)} being measured`;
	}
}

/** The two halves of a weakness: what the plan assumes, and what happens otherwise. */
export function weaknessParts(w: PlanWeakness, arrows: readonly { from: string; to: string }[], label: Label): { assumes: string; otherwise: string } {
	const assumes = `${w.change.kind === 'add-arrow' ? 'there being ' : ''}${assumptionWords(w.change, label)}`;
	if (w.failure === 'unmeasured') {
		const otherwise = w.fallback === undefined ? '' : w.fallback === null ? 'without it no set of measured variables is sufficient' : `without it, ${setWords(w.fallback, label)} would do`;
		return { assumes, otherwise };
	}
	if (!w.witness) return { assumes, otherwise: `a ${w.length}-arrow biasing path would open` };
	const path = pathWords(w.witness, arrowTestAfter(arrows, w.change), label);
	if (w.failure === 'forbidden') return { assumes, otherwise: `${label(w.witness[w.witness.length - 1])} would lie on or below a causal path (${path})` };
	return { assumes, otherwise: `${path} would be open` };
}

/** "The plan depends on there being no arrow from A to B: otherwise X ← A → B → Y would be open." */
export function weaknessWords(w: PlanWeakness, arrows: readonly { from: string; to: string }[], label: Label): string {
	const { assumes, otherwise } = weaknessParts(w, arrows, label);
	if (w.failure === 'unmeasured') return `The plan depends on ${assumes}.${otherwise ? ` ${otherwise[0].toUpperCase()}${otherwise.slice(1)}.` : ''}`;
	return `The plan depends on ${assumes}: otherwise ${otherwise}.`;
}
