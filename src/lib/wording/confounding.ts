/**
 * Words of the confounder check and of the efficiency-optimal set's absence, shared by the
 * app, the command line and the report: the check of each candidate (associations, the change
 * in the estimate, the stratified odds ratio and its homogeneity test), the notice for columns
 * that look like category codes, and the split of a change in an odds ratio into confounding
 * and non-collapsibility (Greenland, Robins & Pearl, Statistical Science 14, 1999).
 */
import type { AdjustmentSets, Role } from '../causal';
import type { CandidateCheck, EstimateRow } from '../datacheck';
import { KIND_IN_MODEL, codeList } from './measures';
import { formatCi, formatCount, formatNumber, formatPercent, pText } from './numbers';

/**
 * "Efficiency-optimal set: {age, income}." or the real reason there is none, e.g. that the
 * exposure has no causal path to the outcome in the diagram. `set` writes a set of ids.
 */
export function optimalSetSentence(sets: Pick<AdjustmentSets, 'optimal' | 'optimalGap'>, set: (ids: readonly string[]) => string, cite = ''): string {
	const gap = sets.optimalGap;
	if (gap?.why === 'no-causal-path')
		return 'Efficiency-optimal set: not defined, because the diagram has no causal path from the exposure to the outcome (its effect is null under the diagram; any sufficient set estimates that null).';
	if (sets.optimal) return `Efficiency-optimal set${cite}: ${set(sets.optimal)}.`;
	if (gap?.why === 'unmeasured') return `Efficiency-optimal set: none with the data at hand, as it would include the unmeasured ${set(gap.unmeasured)}.`;
	if (gap?.why === 'not-identifiable') return 'Efficiency-optimal set: none, as no sufficient adjustment set exists.';
	return 'Efficiency-optimal set: none valid for these exposures.';
}

/** What the confounder check shows and what it cannot decide (above its table). */
export const CONFOUNDER_CHECK_INTRO =
	"For each candidate: its association with the exposure and with the outcome, in the measure one reads (odds ratio per level, Cohen's d, or a correlation), with p and n; the exposure's estimate crude and adjusted for the candidate alone, on the same rows; and, for a binary exposure and outcome, the Mantel–Haenszel odds ratio over the candidate's levels (fifths of a numeric one) with the Breslow–Day test (Tarone's correction) of whether the odds ratio differs across them. The data describe these associations; whether a variable is a confounder is decided by the diagram (a pre-exposure member of some minimal sufficient set; VanderWeele & Shpitser 2013).";

/** Why a variable of the diagram is not a candidate confounder, or null when it is one. */
export function notCandidateReason(roles: readonly Role[]): string | null {
	if (roles.includes('mediator')) return 'not a candidate: a mediator (adjusting for it removes part of the effect)';
	if (roles.includes('descendant-of-outcome')) return 'not a candidate: caused by the outcome';
	if (roles.includes('descendant-of-exposure')) return 'not a candidate: caused by the exposure';
	return null;
}

/**
 * The notice for a numeric column whose values look like category codes, naming the column;
 * `how` says where its kind is changed (the app's Columns table, or --type on the command line).
 */
export function categoryCodeNotice(column: string, values: readonly number[], how: 'app' | 'cli' | 'report'): string {
	const change = how === 'app' ? 'set its kind to categories under Columns' : how === 'cli' ? `run again with --type ${column}=categorical` : 'declare it categorical and repeat the analysis';
	return `Column '${column}' holds only the whole numbers ${codeList(values)}: it looks like category codes. It is analysed as numbers, so a model that adjusts for it fits ${KIND_IN_MODEL.continuous} across the codes (equal steps between them), which leaves residual confounding if the codes label categories. If they do, ${change}.`;
}

/** The exposure's estimate crude → adjusted on the same rows, with the change: "0.474 → 0.526 (+10.9 %), n = 5,000". */
export function changeText(change: Exclude<CandidateCheck['change'], null | { message: string }>): string {
	return `${formatNumber(change.crude.estimate)} → ${formatNumber(change.adjusted.estimate)} (${formatPercent(change.percent)}), n = ${formatCount(change.n)}`;
}

type Stratified = Exclude<CandidateCheck['stratified'], null | { message: string }>;

/** "Mantel–Haenszel OR 0.523 (95 % CI 0.453 to 0.605, Robins–Breslow–Greenland) over fifths of Age". */
export function stratifiedText(s: Stratified, candidate: string): string {
	const over = s.by === 'fifths' ? `fifths of ${candidate}` : `the ${formatCount(s.strata.length)} levels of ${candidate}`;
	return `Mantel–Haenszel OR ${formatNumber(s.oddsRatio)} (95 % CI ${formatCi(s.ci)}, Robins–Breslow–Greenland) over ${over}, n = ${formatCount(s.n)}`;
}

/** Within fifths of a numeric candidate some confounding remains; said wherever fifths are used. */
export function fifthsCaution(candidate: string): string {
	return `Within fifths of ${candidate} some confounding by it remains (five strata remove about 90 % of it; Cochran, Biometrics 1968).`;
}

/** True when the Breslow–Day–Tarone test finds the odds ratio differing across strata at level α. */
export function effectModification(s: Stratified, alpha: number): boolean {
	return s.homogeneity !== null && s.homogeneity.pValue < alpha;
}

/** The homogeneity test in words, flagging effect modification on the odds-ratio scale. */
export function homogeneityText(s: Stratified, alpha: number): string {
	const h = s.homogeneity;
	if (!h) return `Breslow–Day test not possible: ${s.homogeneityMessage ?? 'too few strata with all four margins'}`;
	const test = `Breslow–Day–Tarone X² = ${formatNumber(h.statistic)}, ${h.df} df, ${pText(h.pValue)}`;
	return h.pValue < alpha
		? `${test}: the odds ratio differs across the strata (effect modification on the odds-ratio scale); one pooled odds ratio summarises them poorly`
		: `${test}: no evidence that the odds ratio differs across the strata (the test has little power, so this is not proof that it does not)`;
}

/** A risk as a percentage: "12.3 %". */
export function riskPercent(r: number): string {
	return `${formatNumber(r * 100)} %`;
}

/** A risk difference in percentage points: "−8.7 percentage points (95 % CI −11 to −6.4)". */
export function riskDifferenceText(rd: { estimate: number; ci: readonly [number, number] }): string {
	return `${formatNumber(rd.estimate * 100)} percentage points (95 % CI ${formatNumber(rd.ci[0] * 100)} to ${formatNumber(rd.ci[1] * 100)})`;
}

/**
 * "E-value of the planned estimate: 1.88; for the CI limit nearer to no effect: 1.34"
 * (VanderWeele & Ding 2017): one sentence for the app, the command line and the report.
 */
export function eValueText(e: { point: number; ciBound: number | null }): string {
	return `E-value of the planned estimate: ${formatNumber(e.point)}${e.ciBound === null ? '' : `; for the CI limit nearer to no effect: ${formatNumber(e.ciBound)}`}`;
}

type Standardized = NonNullable<EstimateRow['standardized']>;

/** How the standardized estimates are made, said once under them. */
export const STANDARDIZED_METHOD =
	"Standardized (marginal) estimates by g-computation: the row's logistic model predicts each person's risk with the exposure set to each level, averaged over the sample's own covariates (Robins 1986). 95 % CIs by the delta method (the model's covariance; the sample's covariates held fixed). They rest on the model being right.";

/** "risk 12.3 % if everyone were Cycling = 1, 21 % if no one were; risk difference …; risk ratio …; marginal odds ratio …". */
export function standardizedText(s: Standardized, exposure: string, level: { exposed: string; unexposed: string } = { exposed: '1', unexposed: '0' }): string {
	return `risk ${riskPercent(s.risk1)} with ${exposure} = ${level.exposed} for everyone, ${riskPercent(s.risk0)} with ${exposure} = ${level.unexposed}; risk difference ${riskDifferenceText(s.riskDifference)}; risk ratio ${formatNumber(s.riskRatio.estimate)} (95 % CI ${formatCi(s.riskRatio.ci)}); marginal odds ratio ${formatNumber(s.marginalOddsRatio.estimate)} (95 % CI ${formatCi(s.marginalOddsRatio.ci)})`;
}

/** Relative step between two odds ratios, "+26.6 %". */
const step = (from: number, to: number) => formatPercent((to / from - 1) * 100);

/**
 * Which part of the change in the odds ratio is confounding and which is non-collapsibility
 * (Greenland, Robins & Pearl 1999): crude → standardized marginal is confounding by the set,
 * on the population-averaged scale; marginal → conditional is non-collapsibility — the odds
 * ratio conditional on covariates differs from the marginal one even with no confounding at
 * all — and is not bias. The risk difference and the risk ratio are collapsible. Null when
 * the row has no crude odds ratio on its rows.
 */
export function collapsibilitySentence(s: Pick<Standardized, 'marginalOddsRatio' | 'conditionalOddsRatio' | 'crudeOddsRatio'>): string | null {
	if (s.crudeOddsRatio === null) return null;
	const crude = s.crudeOddsRatio;
	const marginal = s.marginalOddsRatio.estimate;
	const conditional = s.conditionalOddsRatio;
	return `Odds ratio: crude ${formatNumber(crude)} → standardized marginal ${formatNumber(marginal)} → conditional (the model's) ${formatNumber(conditional)}. The step from crude to marginal (${step(crude, marginal)}) is confounding removed by the set; the step from marginal to conditional (${step(marginal, conditional)}) is non-collapsibility: an odds ratio conditional on covariates that affect the outcome differs from the marginal one even with no confounding, so this part is not bias (Greenland, Robins & Pearl 1999). The risk difference and risk ratio are collapsible: they change by confounding only.`;
}
