/** The verdict on a planned set and each of its problems, in sentences. */
import type { AdjustmentCheck, AdjustmentProblem, ForbiddenWhy } from '../causal';
import type { Diagram } from '../graph/diagram';
import { listNames, type LabelOf } from './names';
import { pathText } from './paths';

const FORBIDDEN: Record<ForbiddenWhy, string> = {
	exposure: 'is an exposure; it cannot be adjusted for',
	outcome: 'is an outcome; it cannot be adjusted for',
	mediator: 'is a mediator: adjusting for it removes part of the effect being estimated',
	'descendant-of-mediator': 'is caused by a mediator: adjusting for it removes part of the effect or opens a biasing path',
	'descendant-of-outcome': 'is caused by the outcome: adjusting for it can bias the estimate',
	'descendant-of-exposure': 'is caused by the exposure on the way to the outcome: adjusting for it can bias the estimate',
	unmeasured: 'is unmeasured, so it cannot be adjusted for'
};

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

