/**
 * Marginal (population-averaged) effects of a binary exposure on a binary outcome by
 * standardization, also called g-computation (Robins 1986; Hernán & Robins, Causal Inference:
 * What If, 2020, §13): fit the logistic model of the outcome on the exposure and the
 * adjustment set, predict every person's risk with the exposure set to 1 and to 0, and average
 * over the sample — the standardized risks r₁ and r₀ over the sample's own covariate
 * distribution. From them the risk difference r₁ − r₀, the risk ratio r₁ / r₀ and the marginal
 * odds ratio.
 *
 * Why both scales: the conditional odds ratio of the model differs from the marginal one even
 * without confounding (non-collapsibility; Greenland, Robins & Pearl, Statistical Science 14,
 * 1999), whereas the risk difference and risk ratio are collapsible. Comparing the crude odds
 * ratio with the standardized marginal odds ratio isolates confounding; the remaining step to
 * the conditional odds ratio is non-collapsibility, not bias.
 *
 * Intervals: the delta method with the model's covariance (the inverse Fisher information at
 * the estimates), treating the sample's covariate distribution as fixed; the gradient of each
 * averaged risk is analytic, ∂r_e/∂β = mean(p_e(1 − p_e)·x_e), and intervals of ratios are
 * formed on the log scale. Cost: one IRLS fit and O(n·p) for the predictions and gradients.
 */
import { normalQuantile } from '../distributions';
import { StatsError } from '../errors';
import { checkCollinearity, selectColumns } from '../regression/collinearity';
import { buildDesign, type DesignTerm } from '../regression/design';
import { adjustedLogistic } from '../regression/exposure-effect';
import { fitLogistic, type LogisticFit } from '../regression/logistic';
import { BLOCK, fillBlock } from '../regression/irls-row-pass';
import type { TableStatistics, Units } from '../sufficient/table-statistics';
import type { Column } from '../table/types';

export interface MarginalEstimate {
	estimate: number;
	ci: [number, number];
}

export interface Standardization {
	outcome: string;
	exposure: string;
	adjustedFor: string[];
	/** Complete cases used. */
	n: number;
	/** Standardized risks with the exposure set to its second level, and to its first. */
	risk1: MarginalEstimate;
	risk0: MarginalEstimate;
	riskDifference: MarginalEstimate;
	riskRatio: MarginalEstimate;
	marginalOddsRatio: MarginalEstimate;
	/** The model's (conditional) odds ratio for the exposure. */
	conditionalOddsRatio: MarginalEstimate;
	level: number;
	warnings: string[];
}

const expit = (x: number) => 1 / (1 + Math.exp(-x));

export function standardize(outcome: Column, exposure: Column, adjustFor: readonly Column[], level = 0.95, stats?: TableStatistics): Standardization {
	if (outcome.kind !== 'binary') throw new StatsError(`Standardized risks need a binary outcome; '${outcome.name}' is ${outcome.kind}.`, { column: outcome.name });
	if (exposure.kind !== 'binary') throw new StatsError(`Standardized risks here need a binary exposure; '${exposure.name}' is ${exposure.kind}.`, { column: exposure.name });
	let fit: LogisticFit;
	let units: Units;
	let e: number;
	let n: number;
	let names: string[];
	if (stats) {
		const plan = stats.plan(outcome, [exposure, ...adjustFor]);
		const keep = stats.collinearity(plan, [...Array(plan.p).keys()]).keep;
		names = keep.map((j) => plan.names[j]);
		e = exposureIndex(plan.terms, names, plan.names, exposure);
		fit = adjustedLogistic(stats, plan, exposure).adjusted;
		units = stats.units(plan, keep);
		n = plan.n;
	} else {
		const full = buildDesign(outcome, [exposure, ...adjustFor]);
		const design = selectColumns(full, checkCollinearity(full).keep);
		e = exposureIndex(design.terms, design.names, design.names, exposure);
		fit = fitLogistic(design);
		names = design.names;
		units = { x: design.x, stride: design.p, cols: Int32Array.from(design.names.keys()), units: design.n, weights: null };
		n = design.n;
	}
	const p = names.length;
	const beta = fit.coefficients.map((c) => c.estimate);
	const g1 = new Float64Array(p);
	const g0 = new Float64Array(p);
	let r1 = 0;
	let r0 = 0;
	const { x, stride, cols, weights, source } = units;
	const addUnit = (xr: Float64Array, m: number): void => {
		let eta = 0;
		for (let j = 0; j < p; j++) if (j !== e) eta += xr[j] * beta[j];
		const p1 = expit(eta + beta[e]);
		const p0 = expit(eta);
		r1 += m * p1;
		r0 += m * p0;
		const w1 = m * p1 * (1 - p1);
		const w0 = m * p0 * (1 - p0);
		for (let j = 0; j < p; j++) {
			const xj = j === e ? 1 : xr[j];
			g1[j] += w1 * xj;
			if (j !== e) g0[j] += w0 * xr[j];
		}
	};
	const xr = new Float64Array(p);
	if (source) {
		// Rows from the plan's vectors, a block at a time (no n × p matrix).
		const block = new Float64Array(p * BLOCK);
		for (let start = 0; start < units.units; start += BLOCK) {
			const len = Math.min(BLOCK, units.units - start);
			fillBlock(source, cols, start, len, block);
			for (let i = 0; i < len; i++) {
				for (let j = 0; j < p; j++) xr[j] = block[j * BLOCK + i];
				addUnit(xr, 1);
			}
		}
	} else
		for (let k = 0; k < units.units; k++) {
			const base = k * stride;
			for (let j = 0; j < p; j++) xr[j] = x[base + cols[j]];
			addUnit(xr, weights === null ? 1 : weights[k]);
		}
	r1 /= n;
	r0 /= n;
	for (let j = 0; j < p; j++) {
		g1[j] /= n;
		g0[j] /= n;
	}
	const V = fit.covariance;
	const variance = (a: number, b: number, ga: Float64Array, gb: Float64Array) => {
		// Var(a·r₁-gradient + b·r₀-gradient) = gᵀ V g with g = a·g₁ + b·g₀.
		let s = 0;
		for (let i = 0; i < p; i++) {
			const gi = a * ga[i] + b * gb[i];
			for (let j = 0; j < p; j++) s += gi * V[i * p + j] * (a * ga[j] + b * gb[j]);
		}
		return s;
	};
	const z = normalQuantile(1 - (1 - level) / 2);
	const onScale = (value: number, se: number, log: boolean): MarginalEstimate =>
		log ? { estimate: Math.exp(value), ci: [Math.exp(value - z * se), Math.exp(value + z * se)] } : { estimate: value, ci: [value - z * se, value + z * se] };
	const zero = new Float64Array(p);
	const rd = r1 - r0;
	const coef = fit.coefficients[e];
	return {
		outcome: outcome.name,
		exposure: exposure.name,
		adjustedFor: adjustFor.map((c) => c.name),
		n,
		risk1: onScale(r1, Math.sqrt(variance(1, 0, g1, zero)), false),
		risk0: onScale(r0, Math.sqrt(variance(0, 1, zero, g0)), false),
		riskDifference: onScale(rd, Math.sqrt(variance(1, -1, g1, g0)), false),
		riskRatio: onScale(Math.log(r1 / r0), Math.sqrt(variance(1 / r1, -1 / r0, g1, g0)), true),
		marginalOddsRatio: onScale(
			Math.log(r1 / (1 - r1)) - Math.log(r0 / (1 - r0)),
			Math.sqrt(variance(1 / (r1 * (1 - r1)), -1 / (r0 * (1 - r0)), g1, g0)),
			true
		),
		conditionalOddsRatio: { estimate: coef.oddsRatio, ci: coef.oddsRatioCi },
		level,
		warnings: fit.warnings
	};
}

/** The exposure's column among the fitted coefficients (`names`), refused when it was left out. */
function exposureIndex(terms: readonly DesignTerm[], names: readonly string[], designNames: readonly string[], exposure: Column): number {
	const j = terms.find((t) => t.column === exposure.name)?.indices[0];
	const e = j === undefined ? -1 : names.indexOf(designNames[j]);
	if (e < 0) throw new StatsError(`The exposure '${exposure.name}' was left out of the model (a single level, or collinear with the adjustment set).`);
	return e;
}
