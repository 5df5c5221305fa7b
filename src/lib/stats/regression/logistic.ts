/**
 * Logistic regression by iteratively reweighted least squares (Nelder & Wedderburn 1972;
 * McCullagh & Nelder, Generalized Linear Models, 2nd ed., §2.5), with the starting values
 * and the convergence rule of R's glm.fit: μ₀ = (y + ½)/2, stop when
 * |D − D_old| / (|D| + 0.1) < 1e-8, at most 25 iterations.
 *
 * Each iteration solves the weighted normal equations XᵀWX·β = XᵀWz by Cholesky. Reason:
 * XᵀWX is accumulated in one streaming pass over the row-major design (O(n·p²/2) per
 * iteration, no n × p working copy, no per-row allocation), which is what makes a
 * million rows with ten covariates take seconds; QR of √W·X each iteration would cost
 * four times the arithmetic and an extra n × p array. Conditioning is protected by
 * leaving out collinear columns first (collinearity.ts). Standard errors come from
 * (XᵀWX)⁻¹ at the final estimates; Wald 95 % intervals use the normal distribution (as
 * R's confint.default).
 *
 * Separation (Albert & Anderson 1984): flagged when fitted probabilities are numerically
 * 0 or 1 (within 10·machine epsilon, R's rule) or the fit does not converge; a coefficient
 * is named as diverging when it still moved by more than one log-odds unit over the last
 * three iterations. Events per variable below 10 gives a warning (a rule of thumb, Peduzzi
 * et al., J Clin Epidemiol 1996).
 */
import { normalQuantile, normalTwoSidedP } from '../distributions';
import { StatsError } from '../errors';
import type { Column } from '../table/types';
import { eventsPerVariable } from './checks';
import type { Interrupt } from '../sufficient/interrupt';
import { checkCollinearity, type CollinearityCheck, type DroppedColumn } from './collinearity';
import { buildDesign, type Design } from './design';
import { irls, ylogy, type IrlsResult } from './irls';
import type { DesignSource } from './irls-row-pass';
import type { Coefficient } from './linear';
import { cholesky, choleskyInverse } from './linalg';

export interface LogisticCoefficient extends Coefficient {
	oddsRatio: number;
	oddsRatioCi: [number, number];
}

export interface LogisticFit {
	model: 'logistic';
	coefficients: LogisticCoefficient[];
	covariance: Float64Array;
	n: number;
	/** Cases with outcome 1 (sum of y for fractional outcomes). */
	events: number;
	deviance: number;
	nullDeviance: number;
	logLik: number;
	aic: number;
	iterations: number;
	converged: boolean;
	separation: { detected: boolean; fittedAtBounds: number; diverging: string[] };
	dropped: DroppedColumn[];
	notes: string[];
	warnings: string[];
	reference: string;
}

export interface LogisticOptions {
	maxIterations?: number;
	tolerance?: number;
	/** Starting estimates for the kept columns (warm start); R's starting values when absent. */
	start?: Float64Array | null;
	/** The collinearity check of the design, when already known (sufficient statistics). */
	collinearity?: CollinearityCheck;
	interrupt?: Interrupt;
	/** Read the design's columns from these vectors and rows (design.x unused; irls-row-pass.ts). */
	source?: DesignSource;
}

/** Fit on a prepared design; y may be 0/1 or fractions in [0, 1]. */
export function fitLogistic(design: Design, options: LogisticOptions = {}): LogisticFit {
	const y = design.y;
	if (!y) throw new StatsError('A logistic regression needs an outcome.');
	let binary = true;
	for (let k = 0; k < y.length; k++) {
		if (!(y[k] >= 0 && y[k] <= 1)) throw new StatsError(`The outcome of a logistic regression must lie in [0, 1] (found ${y[k]}).`);
		if (y[k] !== 0 && y[k] !== 1) binary = false;
	}
	const check = options.collinearity ?? checkCollinearity(design);
	const { n } = design;
	const p = check.keep.length;
	if (n <= p) throw new StatsError(`Too few complete cases (${n}) for ${p} coefficients.`);
	const result = irls({ x: design.x, stride: design.p, cols: Int32Array.from(check.keep), units: n, y, trials: null, source: options.source }, options);
	let events = 0;
	for (let k = 0; k < n; k++) events += y[k];
	const ybar = events / n;
	let nullDeviance = 0;
	if (binary) nullDeviance = binaryNullDeviance(events, n);
	else for (let k = 0; k < n; k++) nullDeviance += 2 * (ylogy(y[k], ybar) + ylogy(1 - y[k], 1 - ybar));
	return logisticFit(result, {
		names: check.keep.map((j) => design.names[j]),
		n,
		events,
		nullDeviance,
		dropped: check.dropped,
		notes: design.notes,
		maxIterations: options.maxIterations ?? 25
	});
}

/** The deviance of the intercept-only model for 0/1 outcomes: 2·(E·log(n/E) + (n − E)·log(n/(n − E))). O(1). */
export function binaryNullDeviance(events: number, n: number): number {
	const ybar = events / n;
	return 2 * ((events > 0 ? events * Math.log(1 / ybar) : 0) + (n - events > 0 ? (n - events) * Math.log(1 / (1 - ybar)) : 0));
}

/** The reported fit from an IRLS result. O(p³). */
export function logisticFit(
	result: IrlsResult,
	about: { names: string[]; n: number; events: number; nullDeviance: number; dropped: DroppedColumn[]; notes: readonly string[]; maxIterations: number }
): LogisticFit {
	const { beta, xtwx, deviance, converged, iterations, atBounds, history } = result;
	const { names, n, events, nullDeviance, dropped, maxIterations } = about;
	const p = names.length;
	const l = cholesky(xtwx, p, 0);
	const covariance = l ? choleskyInverse(l, p) : new Float64Array(p * p).fill(NaN);

	const z = normalQuantile(0.975);
	const coefficients: LogisticCoefficient[] = names.map((name, j) => {
		const b = beta[j];
		const se = Math.sqrt(covariance[j * p + j]);
		const lo = b - z * se;
		const hi = b + z * se;
		return {
			name,
			estimate: b,
			se,
			statistic: b / se,
			pValue: normalTwoSidedP(b / se),
			ci: [lo, hi],
			oddsRatio: Math.exp(b),
			oddsRatioCi: [Math.exp(lo), Math.exp(hi)]
		};
	});

	const diverging = history.length >= 4 ? names.filter((_, j) => Math.abs(history[history.length - 1][j] - history[history.length - 4][j]) > 1) : [];
	const detected = atBounds > 0 || !converged;
	const warnings = dropped.map((c) => c.message);
	if (!converged) warnings.push(`The fit did not converge in ${maxIterations} iterations.`);
	if (detected)
		warnings.push(
			`Possible separation: ${atBounds} fitted probabilities are numerically 0 or 1${
				diverging.length ? `; diverging coefficients: ${diverging.map((s) => `'${s}'`).join(', ')}` : ''
			}. Estimates and intervals for these terms are not reliable.`
		);
	const epv = eventsPerVariable(events, n - events, p - 1);
	if (epv.belowRuleOfThumb) warnings.push(epv.message);
	const logLik = -deviance / 2; // exact for 0/1 outcomes (saturated log-likelihood is 0)
	return {
		model: 'logistic',
		coefficients,
		covariance,
		n,
		events,
		deviance,
		nullDeviance,
		logLik,
		aic: deviance + 2 * p,
		iterations,
		converged,
		separation: { detected, fittedAtBounds: atBounds, diverging },
		dropped,
		notes: [...about.notes, 'Wald 95 % intervals with the normal distribution.'],
		warnings,
		reference: 'IRLS (Nelder & Wedderburn 1972; McCullagh & Nelder 1989 §2.5)'
	};
}

/** Logistic regression of a binary outcome on covariates (complete cases). */
export function logisticRegression(outcome: Column, covariates: readonly Column[], options: LogisticOptions = {}): LogisticFit {
	if (outcome.kind !== 'binary')
		throw new StatsError(`Outcome '${outcome.name}' is ${outcome.kind}; a logistic regression needs a binary outcome.`, { column: outcome.name });
	const fit = fitLogistic(buildDesign(outcome, covariates), options);
	fit.notes.unshift(`Modelled: the odds of '${outcome.name}' = '${outcome.levels[1]}' (versus '${outcome.levels[0]}').`);
	return fit;
}
