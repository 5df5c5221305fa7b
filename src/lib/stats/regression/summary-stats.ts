/**
 * Regression and partial correlation from summary statistics (a correlation or covariance
 * matrix with the sample size, optionally means and standard deviations), for when only a
 * published table is available.
 *
 * Least squares depends on the data only through means and the covariance matrix S:
 * β = S_xx⁻¹·s_xy, RSS = (n − 1)(s_yy − s_xyᵀβ), σ² = RSS/(n − k − 1),
 * Var(β) = σ²·S_xx⁻¹/(n − 1), intercept ȳ − βᵀx̄ with variance σ²/n + x̄ᵀVar(β)x̄
 * (e.g. Draper & Smith, Applied Regression Analysis, 3rd ed., ch. 5). With a correlation
 * matrix and no standard deviations the coefficients are standardized (all SDs 1) and no
 * intercept is given. Partial correlation from the inverse of the correlation matrix of
 * {x, y, Z}: r = −P_xy/√(P_xx·P_yy) (e.g. Whittaker, Graphical Models, 1990, §5.7), tested
 * with Fisher's z on n − |Z| − 3. O(k³).
 */
import { tQuantile, tTwoSidedP } from '../distributions';
import { StatsError } from '../errors';
import { partialCorrelationResult, partialFromCorrelation } from '../conditional/partial-correlation';
import type { TestResult } from '../types';
import type { Coefficient } from './linear';
import { cholesky, choleskyInverse } from './linalg';
import { INTERCEPT } from './design';

export interface SummaryStatistics {
	/** Variable names, in the order of the matrix rows. */
	names: readonly string[];
	matrix: readonly (readonly number[])[];
	type: 'correlation' | 'covariance';
	/** Sample size. */
	n: number;
	means?: readonly number[];
	/** Standard deviations (needed for unstandardized coefficients from a correlation matrix). */
	sds?: readonly number[];
}

export interface SummaryRegression {
	coefficients: Coefficient[];
	/** 'standardized' when only correlations were given. */
	scale: 'original' | 'standardized';
	n: number;
	dfResidual: number;
	rSquared: number;
	sigma: number;
	notes: string[];
}

function indexOf(s: SummaryStatistics, name: string): number {
	const i = s.names.indexOf(name);
	if (i < 0) throw new StatsError(`Variable '${name}' is not in the summary matrix.`);
	return i;
}

function validate(s: SummaryStatistics): void {
	const k = s.names.length;
	if (s.matrix.length !== k || s.matrix.some((r) => r.length !== k))
		throw new StatsError(`The summary matrix must be ${k} × ${k} (one row and column per variable).`);
	for (let i = 0; i < k; i++)
		for (let j = 0; j < i; j++)
			if (Math.abs(s.matrix[i][j] - s.matrix[j][i]) > 1e-8 * Math.max(1, Math.abs(s.matrix[i][j])))
				throw new StatsError(`The summary matrix is not symmetric ('${s.names[i]}', '${s.names[j]}').`);
	if (s.type === 'correlation') for (let i = 0; i < k; i++) if (Math.abs(s.matrix[i][i] - 1) > 1e-8) throw new StatsError(`The correlation matrix has ${s.matrix[i][i]} on its diagonal for '${s.names[i]}'.`);
	if (!(s.n > 0)) throw new StatsError('The sample size must be positive.');
}

/** Covariance matrix on the scale available, and whether it is standardized. */
function covarianceOf(s: SummaryStatistics): { cov: number[][]; standardized: boolean } {
	if (s.type === 'covariance') return { cov: s.matrix.map((r) => [...r]), standardized: false };
	if (!s.sds) return { cov: s.matrix.map((r) => [...r]), standardized: true };
	const sd = s.sds;
	return { cov: s.matrix.map((r, i) => r.map((v, j) => v * sd[i] * sd[j])), standardized: false };
}

export function linearRegressionFromSummary(s: SummaryStatistics, outcome: string, predictors: readonly string[]): SummaryRegression {
	validate(s);
	const { cov, standardized } = covarianceOf(s);
	const yi = indexOf(s, outcome);
	const xi = predictors.map((p) => indexOf(s, p));
	const k = xi.length;
	const n = s.n;
	const df = n - k - 1;
	if (df < 1) throw new StatsError(`Too small a sample (${n}) for ${k} predictors.`);
	const sxx = new Float64Array(k * k);
	xi.forEach((a, i) => xi.forEach((b, j) => (sxx[i * k + j] = cov[a][b])));
	const l = cholesky(sxx, k, 1e-12);
	if (!l) throw new StatsError('The predictors are collinear in the summary matrix.');
	const inv = choleskyInverse(l, k);
	const sxy = xi.map((a) => cov[a][yi]);
	const beta = new Float64Array(k);
	for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) beta[i] += inv[i * k + j] * sxy[j];
	let explained = 0;
	for (let i = 0; i < k; i++) explained += sxy[i] * beta[i];
	const syy = cov[yi][yi];
	const rss = (n - 1) * (syy - explained);
	const sigma2 = rss / df;
	const q = tQuantile(0.975, df);
	const coef = (name: string, estimate: number, variance: number): Coefficient => {
		const se = Math.sqrt(variance);
		const t = estimate / se;
		return { name, estimate, se, statistic: t, pValue: tTwoSidedP(t, df), ci: [estimate - q * se, estimate + q * se] };
	};
	const varBeta = (i: number, j: number) => (sigma2 * inv[i * k + j]) / (n - 1);
	const coefficients = predictors.map((name, i) => coef(name, beta[i], varBeta(i, i)));
	const notes: string[] = [];
	if (!standardized && s.means) {
		const means = s.means;
		let b0 = means[yi];
		for (let i = 0; i < k; i++) b0 -= beta[i] * means[xi[i]];
		let v0 = sigma2 / n;
		for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) v0 += means[xi[i]] * varBeta(i, j) * means[xi[j]];
		coefficients.unshift(coef(INTERCEPT, b0, v0));
	} else notes.push(standardized ? 'Standardized coefficients (no standard deviations given); no intercept.' : 'No means given; no intercept.');
	return { coefficients, scale: standardized ? 'standardized' : 'original', n, dfResidual: df, rSquared: explained / syy, sigma: Math.sqrt(sigma2), notes };
}

/** Partial correlation of x and y given `given`, from the summary matrix, with Fisher's z test. */
export function partialCorrelationFromSummary(s: SummaryStatistics, x: string, y: string, given: readonly string[]): TestResult {
	validate(s);
	const idx = [x, y, ...given].map((v) => indexOf(s, v));
	const m = idx.length;
	const corr = new Float64Array(m * m);
	idx.forEach((a, i) =>
		idx.forEach((b, j) => (corr[i * m + j] = s.matrix[a][b] / Math.sqrt(s.matrix[a][a] * s.matrix[b][b])))
	);
	return partialCorrelationResult(partialFromCorrelation(corr, m), s.n, given.length);
}
