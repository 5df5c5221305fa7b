/**
 * The verdict on a planned set and each of its problems, in sentences: one wording for the
 * app, the command line (ids as labels) and the report.
 */
import type { AdjustmentCheck, AdjustmentProblem, ForbiddenWhy } from '../causal';
import type { Diagram } from '../graph/diagram';
import { adjustingFor, arrowSet, countText, listNames, type LabelOf } from './names';
import { pathCountText, pathText } from './paths';

/** Why a variable must not be in the planned set, after its name. */
export const FORBIDDEN_WHY: Readonly<Record<ForbiddenWhy, string>> = {
	exposure: 'is an exposure; it cannot be adjusted for',
	outcome: 'is an outcome; it cannot be adjusted for',
	mediator: 'is a mediator (on a causal path from exposure to outcome): adjusting for it removes part of the effect being estimated',
	'descendant-of-mediator': 'is caused by a mediator: adjusting for it removes part of the effect or opens a non-causal path',
	'descendant-of-outcome': 'is caused by the outcome: adjusting for it can bias the estimate',
	'descendant-of-exposure': 'is caused by the exposure on the way to the outcome: adjusting for it can bias the estimate',
	unmeasured: 'is unmeasured, so it cannot be adjusted for'
};

export function problemText(p: AdjustmentProblem, d: Diagram, labelOf: LabelOf, arrows: ReadonlySet<string> = arrowSet(d)): string {
	if (p.kind === 'open-path') return `A non-causal path stays open: ${pathText(p.path, d, labelOf, arrows)}.`;
	return `${labelOf(p.variable)} ${FORBIDDEN_WHY[p.why]}.`;
}

/**
 * The verdict on the planned set, in one sentence. `counting`: the open non-causal paths are
 * still being counted, so a count that is only a lower bound says so.
 */
export function verdictSentence(check: AdjustmentCheck, labelOf: LabelOf, counting = false): string {
	const subject = capitalise(adjustingFor(check.adjusted, labelOf));
	if (check.valid) {
		return check.adjusted.length === 0
			? 'No adjustment is needed: with nothing adjusted for, every non-causal path is already blocked.'
			: `${subject} is sufficient: it blocks every non-causal path and adjusts for no mediator or descendant of the outcome.`;
	}
	// The count, not the listed problems: the listing shows at most a few dozen paths, and the
	// count is the one the Paths section shows (one engine function gives both).
	const open = check.openPaths;
	const bad = check.problems.filter((p) => p.kind !== 'open-path').length;
	const parts: string[] = [];
	if (open.count > 0) parts.push(`${open.count > 1 ? `${pathCountText(open, 'non-causal path')} stay` : open.bound === 'exact' ? 'a non-causal path stays' : 'at least one non-causal path stays'} open`);
	if (bad > 0) parts.push(`${bad === 1 ? 'one variable' : countText(bad, 'variable')} should not be adjusted for`);
	const still = counting && open.count > 0 && open.bound !== 'exact' ? ' (still counting the paths)' : '';
	return `${subject} is not sufficient: ${listNames(parts)}${still}.`;
}

/** "Adjusting for …" at the start of a sentence. */
export function capitalise(text: string): string {
	return text.length === 0 ? text : text[0].toUpperCase() + text.slice(1);
}

/**
 * A caution when an exposure or outcome is marked unmeasured: the graphical answer (which
 * sets block the non-causal paths) does not depend on it, but no estimate can be made from
 * data that lack the variable, so a "sufficient" verdict alone would mislead. Null otherwise.
 */
export function unmeasuredQuestionNote(d: Diagram, labelOf: LabelOf, exposures: readonly string[] = d.exposures, outcomes: readonly string[] = d.outcomes): string | null {
	const unmeasured = new Set(d.variables.filter((v) => !v.measured).map((v) => v.id));
	const named = [
		...[...new Set(exposures)].filter((id) => unmeasured.has(id)).map((id) => `${labelOf(id)} (the exposure)`),
		...[...new Set(outcomes)].filter((id) => unmeasured.has(id)).map((id) => `${labelOf(id)} (the outcome)`)
	];
	if (named.length === 0) return null;
	const one = named.length === 1;
	return `${listNames(named)} ${one ? 'is' : 'are'} marked unmeasured: the adjustment sets hold for the diagram, but the effect cannot be estimated from data without ${one ? 'it' : 'them'}.`;
}
