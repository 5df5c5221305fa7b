/**
 * What the reviewer proposes after its verdict — members that could be dropped, the smallest
 * addition, the nearest minimal sufficient set, efficiency advice, instruments — in the
 * sentences `causeway review` prints and the app's Review section shows. Pure functions of the
 * review's results and a label look-up; O(size of the sets named).
 */
import type { AdjustmentReview, Instrument } from '../causal';
import { countText, listNames, plural, setText, type LabelOf } from './names';

type Nearest = NonNullable<AdjustmentReview['nearest']>;

export const REVIEW_FIX_TEXT = {
	noDroppable: 'No member can be dropped without losing sufficiency.',
	noExtension: 'No addition of measured variables makes it sufficient.',
	noSufficientSet: 'No set of measured variables is sufficient under this diagram: the effect cannot be estimated by adjustment alone.',
	moreOpenPaths: 'More open paths exist than are listed.',
	noInstrument: 'No measured variable is an instrument under this diagram.',
	plannedIsOptimal: 'This is the efficiency-optimal set O: the sufficient set with the smallest asymptotic variance.'
} as const;

/** "Each of Age and Diet could be dropped alone without harm." / "Age could be dropped without harm." */
export function droppableText(ids: readonly string[], label: LabelOf): string {
	if (ids.length === 0) return REVIEW_FIX_TEXT.noDroppable;
	const names = listNames(ids.map(label));
	return ids.length === 1 ? `${names} could be dropped without harm.` : `Each of ${names} could be dropped alone without harm.`;
}

/** "A minimal sufficient set inside it: {Age, Diet}." */
export function minimalSubsetText(set: readonly string[], label: LabelOf): string {
	return `A minimal sufficient set inside it: ${setText(set, label)}.`;
}

/** "Smallest addition that makes it sufficient: {Income}." */
export function extensionText(set: readonly string[], label: LabelOf): string {
	return `Smallest addition that makes it sufficient: ${setText(set, label)}.`;
}

/** "No addition can make it sufficient while it contains BMI." */
export function extensionBlockedText(ids: readonly string[], label: LabelOf): string {
	return `No addition can make it sufficient while it contains ${listNames(ids.map(label))}.`;
}

/** How the nearest minimal set differs from the stated one: "add Income; drop BMI", or "the stated set itself". */
export function nearestChangeText(n: Pick<Nearest, 'add' | 'drop'>, label: LabelOf): string {
	const parts = [n.add.length ? `add ${listNames(n.add.map(label))}` : '', n.drop.length ? `drop ${listNames(n.drop.map(label))}` : ''].filter(Boolean);
	return parts.length ? parts.join('; ') : 'the stated set itself';
}

/** "(among the first 200 minimal sets)" when the search for the nearest set stopped; else "". */
export function nearestScopeText(n: Pick<Nearest, 'truncated' | 'scanned'>): string {
	return n.truncated ? `(among the first ${countText(n.scanned, 'minimal set')})` : '';
}

/** "Nearest minimal sufficient set: {Age, Diet} (drop BMI)." in one line. */
export function nearestText(n: Nearest, label: LabelOf): string {
	const scope = nearestScopeText(n);
	return `Nearest minimal sufficient set: ${setText(n.set, label)} (${nearestChangeText(n, label)})${scope ? ` ${scope}` : ''}.`;
}

/** Efficiency advice for one variable (Henckel, Perković & Maathuis 2022). */
export function precisionAdviceText(variable: string, label: LabelOf): string {
	return `Precision variable: adding ${label(variable)} keeps the set sufficient and should narrow the confidence interval (it explains outcome variation, not exposure).`;
}

export function instrumentLikeAdviceText(variable: string, label: LabelOf): string {
	return `Instrument-like: given the rest of the set, ${label(variable)} only explains the exposure. Dropping it keeps the set sufficient and should narrow the interval; adjusting for it can amplify bias from any unmeasured confounding (Pearl 2010; Myers et al. 2011).`;
}

/**
 * "Efficiency-optimal set (Henckel et al. 2022): {Age, Income}.", or that the planned set is
 * it, or that it includes an unmeasured variable; worded as optimalSetSentence words it.
 */
export function optimalAdviceText(optimal: readonly string[] | null, plannedIsOptimal: boolean, label: LabelOf): string {
	if (optimal === null) return 'Efficiency-optimal set: not available here (it would include an unmeasured variable).';
	if (plannedIsOptimal) return REVIEW_FIX_TEXT.plannedIsOptimal;
	return `Efficiency-optimal set (Henckel et al. 2022): ${setText(optimal, label)}.`;
}

/**
 * Why the second diagram of a comparison could not judge the planned set: "exposure or outcome
 * not in the second diagram: Age", "planned variables not in the second diagram: A and B".
 */
export function notJudgedText(n: { why: 'question-missing' | 'planned-missing'; ids: readonly string[] }, label: LabelOf): string {
	const what = n.why === 'question-missing' ? 'exposure or outcome' : plural(n.ids.length, 'planned variable');
	return `${what} not in the second diagram: ${listNames(n.ids.map(label))}`;
}

/** "Distance, given Age" or "Distance (no conditioning needed)": one instrument. */
export function instrumentText(i: Instrument, label: LabelOf): string {
	return `${label(i.variable)}${i.given.length ? `, given ${listNames(i.given.map(label))}` : ' (no conditioning needed)'}`;
}
