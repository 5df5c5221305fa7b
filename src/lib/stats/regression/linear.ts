/**
 * Ordinary least squares by Householder QR of the design (Golub & Van Loan, Alg. 5.2.1),
 * the method of R's lm: it works on X itself, not XᵀX, so the condition number is not
 * squared. Standard errors from σ²(RᵀR)⁻¹; Wald 95 % intervals with the t distribution on
 * n − p df (as R's confint.lm). Collinear columns are left out first and named.
 * O(n·p²) time; O(n·p) extra memory (a column-major copy for the factorisation).
 */
import { tQuantile, tTwoSidedP } from '../distributions';
import { StatsError } from '../errors';
import type { Column } from '../table/types';
import { checkCollinearity, selectColumns, type DroppedColumn } from './collinearity';
import { buildDesign, type Design } from './design';
import { applyQTranspose, householderQR, inverseFromUpper, solveUpper, upperR } from './linalg';

export interface Coefficient {
	name: string;
	estimate: number;
	se: number;
	/** t (linear) or z (logistic) statistic. */
	statistic: number;
	pValue: number;
	/** Wald 95 % confidence interval. */
	ci: [number, number];
}

export interface LinearFit {
	model: 'linear';
	coefficients: Coefficient[];
	/** Covariance matrix of the estimates (row-major, in coefficient order). */
	covariance: Float64Array;
	n: number;
	/** Residual degrees of freedom n − p. */
	dfResidual: number;
	rss: number;
	sigma: number;
	rSquared: number;
	adjustedRSquared: number;
	/** Gaussian log-likelihood at the ML variance RSS/n. */
	logLik: number;
	dropped: DroppedColumn[];
	notes: string[];
	warnings: string[];
	reference: string;
}

export function fitLinear(design: Design): LinearFit {
	if (!design.y) throw new StatsError('A linear regression needs an outcome.');
	const check = checkCollinearity(design);
	const d = selectColumns(design, check.keep);
	const { n, p } = d;
	const y = design.y;
	if (n <= p) throw new StatsError(`Too few complete cases (${n}) for ${p} coefficients.`);
	const a = new Float64Array(n * p);
	for (let k = 0; k < n; k++) for (let j = 0; j < p; j++) a[j * n + k] = d.x[k * p + j];
	const qr = householderQR(a, n, p);
	const qty = y.slice();
	applyQTranspose(qr, qty);
	const r = upperR(qr);
	const beta = solveUpper(r, qty.subarray(0, p), p);
	let rss = 0;
	for (let i = p; i < n; i++) rss += qty[i] * qty[i];
	let mean = 0;
	for (let k = 0; k < n; k++) mean += y[k];
	mean /= n;
	let tss = 0;
	for (let k = 0; k < n; k++) tss += (y[k] - mean) ** 2;
	const df = n - p;
	const sigma2 = rss / df;
	const unscaled = inverseFromUpper(r, p);
	const covariance = unscaled.map((v) => v * sigma2);
	const q = tQuantile(0.975, df);
	const coefficients = d.names.map((name, j) => {
		const se = Math.sqrt(covariance[j * p + j]);
		const t = beta[j] / se;
		return { name, estimate: beta[j], se, statistic: t, pValue: tTwoSidedP(t, df), ci: [beta[j] - q * se, beta[j] + q * se] as [number, number] };
	});
	const rSquared = 1 - rss / tss;
	return {
		model: 'linear',
		coefficients,
		covariance,
		n,
		dfResidual: df,
		rss,
		sigma: Math.sqrt(sigma2),
		rSquared,
		adjustedRSquared: 1 - ((1 - rSquared) * (n - 1)) / df,
		logLik: -0.5 * n * (Math.log((2 * Math.PI * rss) / n) + 1),
		dropped: check.dropped,
		notes: [...design.notes, 'Wald 95 % intervals with the t distribution.'],
		warnings: check.dropped.map((c) => c.message),
		reference: 'Least squares by Householder QR (Golub & Van Loan, Matrix Computations, Alg. 5.2.1)'
	};
}

/** Linear regression of a numeric outcome on covariates (complete cases). */
export function linearRegression(outcome: Column, covariates: readonly Column[]): LinearFit {
	if (outcome.kind === 'categorical' && outcome.levels.length > 2)
		throw new StatsError(`Outcome '${outcome.name}' is categorical with ${outcome.levels.length} levels; a linear regression needs a numeric outcome.`, {
			column: outcome.name
		});
	return fitLinear(buildDesign(outcome, covariates));
}
