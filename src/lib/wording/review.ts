/**
 * Plain-language sentences for the reviewer tools, shared by the CLI and the app so both say
 * the same thing. Pure functions of the results, a label look-up and an arrow test.
 */
import type { AdjustmentReview, AssumptionChange, PlanWeakness, ReviewReason } from '../causal';
import { capitalise, FORBIDDEN_WHY } from './adjustment';
import { adjustingFor, arrowTest, countText, listNames, pathWords, setText, type ArrowTest, type LabelOf } from './names';

export type Label = LabelOf;

/** The arrow test of the diagram after one change (for witness paths that use the new arrow). */
export function arrowTestAfter(arrows: readonly { from: string; to: string }[], change: AssumptionChange): ArrowTest {
	const base = arrowTest(arrows);
	if (change.kind === 'add-arrow') return (a, b) => (a === change.from && b === change.to) || base(a, b);
	if (change.kind === 'reverse-arrow') return (a, b) => (a === change.to && b === change.from) || (base(a, b) && !(a === change.from && b === change.to));
	return base;
}

/** Older names of listNames and setText, kept for the reviewer components. */
export const listWords = listNames;
export const setWords = setText;

export function reviewVerdict(r: AdjustmentReview, label: Label): string {
	const subject = capitalise(adjustingFor(r.adjusted, label));
	const effect = `the total effect of ${listWords(r.exposures.map(label))} on ${listWords(r.outcomes.map(label))}`;
	if (r.valid) return `${subject} is sufficient to estimate ${effect}, if the diagram is right.`;
	const kinds = new Set(r.reasons.map((x) => x.kind));
	const what: string[] = [];
	const open = r.reasons.filter((x) => x.kind === 'open-path').length;
	if (open > 0) what.push(`leaves ${openPathsWords(open, r.openPathsTruncated)} open`);
	if (kinds.has('overadjustment')) what.push('adjusts away part of the effect (overadjustment)');
	if (kinds.has('collider-bias')) what.push('opens a path by adjusting a collider (collider bias)');
	if (kinds.has('descendant-of-outcome')) what.push('adjusts a consequence of the outcome');
	if (kinds.has('unmeasured') || kinds.has('exposure-or-outcome')) what.push('names a variable that cannot be adjusted');
	return `${subject} is not sufficient to estimate ${effect}: it ${listWords(what)}.`;
}

/** "a non-causal path", "3 non-causal paths", "at least 50 non-causal paths" (the listing stopped). */
function openPathsWords(listed: number, truncated: boolean): string {
	if (listed === 1 && !truncated) return 'a non-causal path';
	return `${truncated ? 'at least ' : ''}${countText(listed, 'non-causal path')}`;
}

export function reasonWords(x: ReviewReason, arrow: ArrowTest, label: Label): string {
	switch (x.kind) {
		case 'open-path':
			return `${x.backDoor ? 'Open back-door path' : 'Open non-causal path'}: ${pathWords(x.path, arrow, label)}.`;
		case 'overadjustment':
			return x.why === 'mediator'
				? `Overadjustment: ${label(x.variable)} ${FORBIDDEN_WHY.mediator}.`
				: `Overadjustment: ${label(x.variable)} ${FORBIDDEN_WHY['descendant-of-mediator']}.`;
		case 'collider-bias':
			return x.collider === x.variable
				? `Collider bias: ${label(x.variable)} is a collider on ${pathWords(x.path, arrow, label)}; adjusting for it opens that path.`
				: `Collider bias: ${label(x.variable)} is caused by the collider ${label(x.collider)} on ${pathWords(x.path, arrow, label)}; adjusting for it opens that path.`;
		case 'descendant-of-outcome':
			return `${label(x.variable)} ${FORBIDDEN_WHY['descendant-of-outcome']}.`;
		case 'exposure-or-outcome':
			return `${label(x.variable)} is the ${x.which}; it cannot be adjusted for.`;
		case 'unmeasured':
			return `${label(x.variable)} ${FORBIDDEN_WHY.unmeasured}.`;
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
	if (!w.witness) return { assumes, otherwise: `a non-causal path of ${countText(w.length, 'arrow')} would open` };
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
