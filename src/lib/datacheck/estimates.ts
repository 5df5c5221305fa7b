import { mappedColumn } from './mapping';
/**
 * Crude versus adjusted estimates of the exposure's effect: logistic regression odds ratios
 * for a binary outcome, linear regression differences otherwise (src/lib/stats/regression/
 * exposure-effect.ts), once without adjustment and once for each minimal sufficient set,
 * the efficiency-optimal set (Henckel, Perković & Maathuis 2022) and the planned set, all
 * computed on the diagram as the data see it (variables without a column are unmeasured).
 * Each adjusted row carries the crude estimate on its own complete cases and the change in
 * percent (a 10 % change is a common-practice marker); the planned row gets the E-value
 * (VanderWeele & Ding, Ann Intern Med 2017). Cost: two regression fits per set shown.
 */
import type { Diagram } from '../graph/diagram';
import { InputError } from '../graph/errors';
import { adjustmentSets, checkAdjustment, compareSets, sortIds } from '../causal';
import type { AdjustmentSets } from '../causal';
import { own, estimateExposureEffect, eValue, standardize, StatsError, TableStatistics, type Column, type ExposureEffect } from '../stats';
import { drain, type Steps } from './steps';
import { formatNumber } from '../wording/numbers';
import type { EstimateRole, EstimateRow, Estimates, EValueSummary, VariableMapping } from './types';

export interface EstimateOptions {
	/** The planned set; the diagram's `adjusted` list when omitted. */
	planned?: readonly string[];
	/** Show at most this many minimal sets (default 20). */
	maxSets?: number;
	/** The table's shared statistics (and the run's interrupt); made for this call when absent. */
	statistics?: TableStatistics;
	/** Called before each row with (done, total). */
	onProgress?: (done: number, total: number) => void;
}

export type EstimatesOutcome = { estimates: Estimates; message: null } | { estimates: null; message: string };

const ROLE_WORD: Record<EstimateRole, string> = { crude: 'Crude', minimal: 'Minimal set', optimal: 'Optimal set', planned: 'Planned set' };

export function braces(ids: readonly string[]): string {
	return `{${ids.join(', ')}}`;
}

export function rowLabel(roles: readonly EstimateRole[], set: readonly string[]): string {
	if (roles.includes('crude') && set.length === 0) return roles.length === 1 ? 'Crude (no adjustment)' : `Crude, also the ${roles.filter((r) => r !== 'crude').map((r) => ROLE_WORD[r].toLowerCase()).join(' and ')}`;
	return `${roles.map((r, i) => (i === 0 ? ROLE_WORD[r] : ROLE_WORD[r].toLowerCase())).join(', ')} ${braces(set)}`;
}

/**
 * E-value of a difference in a continuous outcome for a binary exposure: the standardized
 * difference d = estimate / SD(outcome) is turned into a risk ratio RR ≈ exp(0.91·d), the
 * approximation VanderWeele & Ding (2017) give for continuous outcomes (from memory). O(n).
 */
function eValueOfDifference(effect: ExposureEffect, outcome: Column, used: readonly Column[], stats: TableStatistics): EValueSummary | null {
	const rows = stats.rows(used);
	const y = stats.numeric(outcome);
	let mean = 0;
	for (const r of rows) mean += y[r];
	mean /= rows.length;
	let ss = 0;
	for (const r of rows) ss += (y[r] - mean) ** 2;
	const sd = Math.sqrt(ss / (rows.length - 1));
	if (!(sd > 0)) return null;
	const a = effect.adjusted[0];
	const rr = (x: number) => Math.exp((0.91 * x) / sd);
	const ci: [number, number] = [rr(a.ci[0]), rr(a.ci[1])];
	const e = eValue(rr(a.estimate), ci, { measure: 'RR' });
	return {
		point: e.point,
		ciBound: e.ciBound,
		notes: [
			`Difference standardized by the outcome's SD (${formatNumber(sd)}) and converted to a risk ratio by RR ≈ exp(0.91·d) (VanderWeele & Ding 2017); approximate.`
		]
	};
}

/** The exposure and outcome to estimate for, or why none can be. O(1). */
export function estimateQuestion(seen: Diagram, columns: Readonly<Record<string, string>>, missing: string): { exposure: string; outcome: string } | { message: string } {
	if (seen.exposures.length !== 1 || seen.outcomes.length !== 1) return { message: 'Estimates need exactly one exposure and one outcome in the Question.' };
	const [exposure] = seen.exposures;
	const [outcome] = seen.outcomes;
	for (const [id, role] of [
		[exposure, 'exposure'],
		[outcome, 'outcome']
	] as const)
		if (own(columns, id) === undefined) return { message: `No estimate: the ${role} "${id}" ${missing}.` };
	return { exposure, outcome };
}

/**
 * The sets to estimate for, each once with every role it has: crude (empty), each minimal
 * set, the optimal set, the planned set. O(k² · set size) for k sets.
 */
export function setsToEstimate(listing: AdjustmentSets, planned: readonly string[]): { roles: EstimateRole[]; set: string[] }[] {
	const wanted: { roles: EstimateRole[]; set: string[] }[] = [];
	const add = (role: EstimateRole, set: string[]) => {
		const existing = wanted.find((w) => compareSets(w.set, set) === 0);
		if (existing) existing.roles.push(role);
		else wanted.push({ roles: [role], set });
	};
	add('crude', []);
	for (const s of listing.sets) add('minimal', s);
	if (listing.optimal) add('optimal', listing.optimal);
	add('planned', sortIds(new Set(planned)));
	return wanted;
}

/**
 * A second guard against separation (Albert & Anderson 1984) besides the fit's own check of
 * fitted probabilities: under complete or quasi-complete separation the maximum-likelihood
 * estimate does not exist, and IRLS stops with a huge coefficient and an even larger
 * standard error (Heinze & Schemper, Stat Med 2002). A standard error above 10 on the
 * log-odds scale (an odds-ratio interval spanning more than e^39) or a non-finite one is taken
 * as that sign — a rule of thumb. O(p).
 */
export function separationWarning(effect: ExposureEffect): string | null {
	if (effect.model !== 'logistic') return null;
	const suspicious = effect.fits.adjusted.coefficients.filter((c) => !Number.isFinite(c.se) || !Number.isFinite(c.estimate) || c.se > 10).map((c) => `'${c.name}'`);
	if (suspicious.length === 0) return null;
	return `Likely separation (an outcome level predicted perfectly): the estimate for ${suspicious.join(', ')} has no finite maximum-likelihood value and its interval is meaningless; consider fewer or coarser covariates, or penalized (Firth) regression.`;
}

/**
 * Marginal risk difference, risk ratio and odds ratio by standardization (g-computation,
 * stats/standardization) for a binary exposure and outcome, with the split of the change in
 * the odds ratio into confounding (crude → marginal) and non-collapsibility (marginal →
 * conditional). Null for other kinds. One more logistic fit.
 */
function standardizedRow(outcome: Column, exposure: Column, used: readonly Column[], crudeSameRows: number | null, stats: TableStatistics): EstimateRow['standardized'] {
	if (outcome.kind !== 'binary' || exposure.kind !== 'binary') return null;
	try {
		const g = standardize(outcome, exposure, used, 0.95, stats);
		return {
			risk1: g.risk1.estimate,
			risk0: g.risk0.estimate,
			riskDifference: g.riskDifference,
			riskRatio: g.riskRatio,
			marginalOddsRatio: g.marginalOddsRatio,
			conditionalOddsRatio: g.conditionalOddsRatio.estimate,
			crudeOddsRatio: crudeSameRows,
			method: 'delta'
		};
	} catch (e) {
		if (!(e instanceof StatsError)) throw e;
		return null;
	}
}

export function estimateEffects(seen: Diagram, columnOf: (name: string) => Column, mapping: VariableMapping, options: EstimateOptions = {}): EstimatesOutcome {
	return drain(estimateSteps(seen, columnOf, mapping, options));
}

/** The estimates one row per step (steps.ts), with the table's shared statistics. */
export function* estimateSteps(seen: Diagram, columnOf: (name: string) => Column, mapping: VariableMapping, options: EstimateOptions = {}): Steps<EstimatesOutcome> {
	const stats = options.statistics ?? new TableStatistics();
	const question = estimateQuestion(seen, mapping.columns, 'has no column in the data');
	if ('message' in question) return { estimates: null, message: question.message };
	const { exposure: exposureId, outcome: outcomeId } = question;
	const col = (id: string) => columnOf(mappedColumn(mapping, id));
	const outcome = col(outcomeId);
	const exposure = col(exposureId);
	// A constant exposure or outcome leaves nothing to compare; said as such rather than as
	// the model's "left out (collinear)" on every row.
	for (const [role, id, column] of [['exposure', exposureId, exposure], ['outcome', outcomeId, outcome]] as const) {
		const only = singleValue(column);
		if (only !== null) return { estimates: null, message: `No estimate: the ${role} "${id}" has the single value ${only} in every row with data; an effect needs rows that differ in it.` };
	}
	const listing = adjustmentSets(seen, { max: options.maxSets ?? 20 });
	const notes: string[] = [];
	if (!listing.identifiable) notes.push('With the variables that have data, no adjustment set is sufficient: every adjusted estimate below stays biased under the diagram.');
	if (listing.truncated) notes.push(`Only the first ${listing.sets.length} minimal sets are shown.`);

	const wanted = setsToEstimate(listing, options.planned ?? seen.adjusted);

	const rows: EstimateRow[] = [];
	let plannedEffect: { effect: ExposureEffect; used: Column[] } | null = null;
	let model: 'logistic' | 'linear' = outcome.kind === 'binary' ? 'logistic' : 'linear';
	const warnings = new Set<string>();
	for (const [index, w] of wanted.entries()) {
		stats.interrupt.poll();
		options.onProgress?.(index, wanted.length);
		const label = rowLabel(w.roles, w.set);
		const blank = { roles: w.roles, label, adjustedFor: w.set, n: 0, term: exposure.name, estimate: NaN, ci: [NaN, NaN] as [number, number], pValue: NaN, crudeSameRows: null, crudeSameRowsCi: null, changePercent: null, changeMarked: false, standardized: null, warnings: [] };
		const noData = w.set.filter((id) => own(mapping.columns, id) === undefined);
		if (noData.length > 0) {
			rows.push({ ...blank, sufficient: false, message: `Not estimated: no column for ${noData.map((id) => `"${id}"`).join(', ')}.` });
			continue;
		}
		const sufficient = checkAdjustment(seen, { adjusted: w.set }).valid;
		try {
			const used = w.set.map(col);
			const r = estimateExposureEffect(outcome, exposure, used, stats);
			model = r.model;
			const a = r.adjusted[0];
			if (!a) throw new StatsError(`The exposure '${exposure.name}' was left out of the model (collinear with the adjustment set).`);
			if (r.adjusted.length > 1) notes.push(`The exposure has ${r.adjusted.length + 1} levels; the first contrast (${a.term}) is shown.`);
			const isCrude = w.set.length === 0;
			const separation = separationWarning(r);
			const rowWarnings = separation && !r.warnings.some((x) => /separation/i.test(x)) ? [...r.warnings, separation] : r.warnings;
			rows.push({
				...blank,
				sufficient,
				n: r.n,
				term: a.term,
				estimate: a.estimate,
				ci: a.ci,
				pValue: a.pValue,
				crudeSameRows: isCrude ? null : r.crude[0].estimate,
				crudeSameRowsCi: isCrude ? null : r.crude[0].ci,
				standardized: standardizedRow(outcome, exposure, used, isCrude ? null : r.crude[0].estimate, stats),
				changePercent: isCrude ? null : r.change[0].percent,
				changeMarked: isCrude ? false : r.change[0].atLeastTenPercent,
				warnings: rowWarnings
			});
			for (const x of rowWarnings) warnings.add(x);
			if (w.roles.includes('planned')) plannedEffect = { effect: r, used: [outcome, exposure, ...used] };
		} catch (e) {
			if (!(e instanceof StatsError || e instanceof InputError)) throw e;
			rows.push({ ...blank, sufficient, message: `Not estimated: ${e.message}` });
		}
		yield;
	}
	let eValueSummary: EValueSummary | null = null;
	if (plannedEffect) {
		const { effect, used } = plannedEffect;
		if (effect.model === 'logistic') {
			const e = effect.eValues[0];
			eValueSummary = e ? { point: e.point, ciBound: e.ciBound, notes: e.notes } : null;
		} else if (exposure.kind === 'binary') eValueSummary = eValueOfDifference(effect, outcome, used, stats);
		else notes.push('No E-value: for a continuous exposure it depends on the contrast chosen.');
	}
	if (model === 'linear' && outcome.kind !== 'continuous') notes.push(`The outcome '${outcome.name}' is ${outcome.kind}; its level scores are modelled by linear regression.`);
	return {
		estimates: {
			exposure: exposureId,
			outcome: outcomeId,
			model,
			measure: model === 'logistic' ? 'odds ratio' : 'difference',
			nullValue: model === 'logistic' ? 1 : 0,
			rows,
			eValue: eValueSummary,
			identifiable: listing.identifiable,
			notes: [...new Set(notes)],
			warnings: [...warnings]
		},
		message: null
	};
}

/** The one value of a column whose non-missing entries are all equal (null otherwise, or when all are missing). O(rows). */
function singleValue(column: Column): string | null {
	if (column.kind === 'continuous') {
		let first = NaN;
		for (const x of column.values) {
			if (Number.isNaN(x)) continue;
			if (Number.isNaN(first)) first = x;
			else if (x !== first) return null;
		}
		return Number.isNaN(first) ? null : String(first);
	}
	let first = -1;
	for (const c of column.codes) {
		if (c < 0) continue;
		if (first < 0) first = c;
		else if (c !== first) return null;
	}
	return first < 0 ? null : column.levels[first];
}
