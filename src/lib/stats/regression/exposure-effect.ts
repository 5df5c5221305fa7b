/**
 * Crude versus adjusted estimate of an exposure's effect, on the same complete cases (so
 * that the change reflects adjustment, not a different sample): logistic regression (odds
 * ratios) for a binary outcome, linear regression (differences) otherwise; with the change
 * in estimate, events per variable and, for odds ratios, the E-value of the adjusted
 * estimate (outcome taken as rare when under 15 % of the cases). Cost: two fits (see linear.ts, logistic.ts).
 */
import { eValue, type EValueResult } from '../evalue';
import { StatsError } from '../errors';
import type { Column } from '../table/types';
import { changeInEstimate, type ChangeInEstimate } from './checks';
import { selectColumns } from './collinearity';
import { buildDesign, type DesignPlan, type DesignTerm } from './design';
import { linearFitFromMoments } from '../sufficient/least-squares';
import type { TableStatistics } from '../sufficient/table-statistics';
import { fitLinear, type LinearFit } from './linear';
import { fitLogistic, type LogisticFit } from './logistic';

export interface EffectEstimate {
	/** Coefficient name (the exposure, or exposure[level] for a categorical exposure). */
	term: string;
	/** Odds ratio (logistic) or difference (linear). */
	estimate: number;
	ci: [number, number];
	pValue: number;
}

export interface ExposureEffect {
	outcome: string;
	exposure: string;
	adjustedFor: string[];
	model: 'logistic' | 'linear';
	measure: 'odds ratio' | 'difference';
	/** Complete cases over outcome, exposure and all adjustment variables. */
	n: number;
	crude: EffectEstimate[];
	adjusted: EffectEstimate[];
	/** Per term, crude → adjusted. */
	change: ChangeInEstimate[];
	/** Per term, for odds ratios only. */
	eValues: EValueResult[];
	warnings: string[];
	notes: string[];
	fits: { crude: LogisticFit | LinearFit; adjusted: LogisticFit | LinearFit };
}

/**
 * With the table's statistics (src/lib/stats/sufficient): linear fits from the shared
 * cross-products, logistic fits shared between estimates (the crude fit of every row, the
 * adjusted fit reused by the standardized estimates), on covariate patterns when few, the
 * adjusted fit started from the crude one.
 */
export function estimateExposureEffect(outcome: Column, exposure: Column, adjustFor: readonly Column[], stats?: TableStatistics): ExposureEffect {
	if (outcome.kind === 'categorical' && outcome.levels.length > 2)
		throw new StatsError(`Outcome '${outcome.name}' has ${outcome.levels.length} unordered levels; choose a binary or numeric outcome.`, { column: outcome.name });
	const logistic = outcome.kind === 'binary';
	let full: { n: number; names: string[]; terms: DesignTerm[]; y: Float64Array | null };
	let adjustedFit: LogisticFit | LinearFit;
	let crudeFit: LogisticFit | LinearFit;
	let term: DesignTerm;
	if (stats) {
		const plan = stats.plan(outcome, [exposure, ...adjustFor]);
		term = exposureTerm(plan.terms, exposure);
		const all = [...Array(plan.p).keys()];
		const crudeColumns = [0, ...term.indices];
		if (logistic) {
			const fits = adjustedLogistic(stats, plan, exposure);
			crudeFit = fits.crude;
			adjustedFit = fits.adjusted;
		} else {
			adjustedFit = linearFromStatistics(stats, plan, all);
			crudeFit = linearFromStatistics(stats, plan, crudeColumns);
		}
		full = { n: plan.n, names: plan.names, terms: plan.terms, y: null };
	} else {
		const design = buildDesign(outcome, [exposure, ...adjustFor]);
		term = exposureTerm(design.terms, exposure);
		const crudeDesign = selectColumns(design, [0, ...term.indices]);
		adjustedFit = logistic ? fitLogistic(design) : fitLinear(design);
		crudeFit = logistic ? fitLogistic(crudeDesign) : fitLinear(crudeDesign);
		full = design;
	}
	const terms = term.indices.map((j) => full.names[j]);
	const pick = (fit: LogisticFit | LinearFit): EffectEstimate[] =>
		terms.flatMap((name) => {
			const c = fit.coefficients.find((co) => co.name === name);
			if (!c) return [];
			return logistic
				? [{ term: name, estimate: Math.exp(c.estimate), ci: [Math.exp(c.ci[0]), Math.exp(c.ci[1])] as [number, number], pValue: c.pValue }]
				: [{ term: name, estimate: c.estimate, ci: c.ci, pValue: c.pValue }];
		});
	const crude = pick(crudeFit);
	const adjusted = pick(adjustedFit);
	const change = adjusted.map((a) => {
		const c = crude.find((x) => x.term === a.term) as EffectEstimate;
		return changeInEstimate(c.estimate, a.estimate, logistic ? 'ratio' : 'difference');
	});
	let prevalence = 0;
	if (full.y) for (const v of full.y) prevalence += v / full.n;
	else if (adjustedFit.model === 'logistic') prevalence = adjustedFit.events / full.n;
	const rareOutcome = prevalence < 0.15;
	const eValues = logistic ? adjusted.map((a) => eValue(a.estimate, a.ci, { measure: 'OR', rareOutcome })) : [];
	return {
		outcome: outcome.name,
		exposure: exposure.name,
		adjustedFor: adjustFor.map((c) => c.name),
		model: logistic ? 'logistic' : 'linear',
		measure: logistic ? 'odds ratio' : 'difference',
		n: full.n,
		crude,
		adjusted,
		change,
		eValues,
		warnings: [...new Set([...crudeFit.warnings, ...adjustedFit.warnings])],
		notes: [...new Set([...adjustedFit.notes, 'Crude and adjusted estimates use the same complete cases.'])],
		fits: { crude: crudeFit, adjusted: adjustedFit }
	};
}

function exposureTerm(terms: readonly DesignTerm[], exposure: Column): DesignTerm {
	const term = terms.find((t) => t.column === exposure.name);
	if (!term) throw new StatsError(`Exposure '${exposure.name}' has a single observed level in the complete cases.`, { column: exposure.name });
	return term;
}

/**
 * The crude and adjusted logistic fits of a plan whose first covariate is the exposure, from
 * the table's statistics: one crude fit per exposure, outcome and rows, one adjusted fit
 * shared with the standardized estimates (g-computation.ts).
 */
export function adjustedLogistic(stats: TableStatistics, plan: DesignPlan, exposure: Column): { crude: LogisticFit; adjusted: LogisticFit } {
	const term = exposureTerm(plan.terms, exposure);
	return { crude: stats.logistic(plan, [0, ...term.indices]), adjusted: stats.logistic(plan, [...Array(plan.p).keys()]) };
}

/** A linear fit of the plan's outcome on its `columns`, from the shared cross-products. */
function linearFromStatistics(stats: TableStatistics, plan: DesignPlan, columns: readonly number[]): LinearFit {
	const m = stats.leastSquares(plan, columns);
	return linearFitFromMoments(m.ls, { names: m.check.keep.map((j) => plan.names[j]), means: m.means, meanY: m.meanY, tss: m.tss, n: plan.n, dropped: m.check.dropped, notes: plan.notes });
}
