/**
 * Least squares from centred cross-products and means (moments.ts) instead of the rows:
 * with C the centred cross-products of the kept design columns X and the outcome y,
 * Cholesky C_xx = LLᵀ, w = L⁻¹c_xy, the slopes β = L⁻ᵀw, RSS = c_yy − ‖w‖², the intercept
 * ȳ − x̄ᵀβ, and Cov = σ²·[1/n + x̄ᵀAx̄, −(Ax̄)ᵀ; −Ax̄, A] with A = C_xx⁻¹ (e.g. Draper & Smith,
 * Applied Regression Analysis, 3rd ed., ch. 5) — what lm's QR gives, up to rounding.
 * w_j² is the drop in RSS from adding column j after those before it (the sequential sums of
 * squares of anova), so nested models in that order need no second fit and no subtraction
 * of two large RSS. Centring keeps C well conditioned for data far from 0. O(k³).
 */
import { tQuantile, tTwoSidedP } from '../distributions';
import { StatsError } from '../errors';
import type { DroppedColumn } from '../regression/collinearity';
import type { Coefficient, LinearFit } from '../regression/linear';
import { cholesky, choleskyInverse } from '../regression/linalg';

export interface LeastSquares {
	/** Slopes of the k columns, in order. */
	beta: Float64Array;
	rss: number;
	/** w_j: RSS falls by w_j² when column j is added after columns 0…j−1. */
	w: Float64Array;
	/** C_xx⁻¹ (k × k). */
	inverse: Float64Array;
}

/** `c`: (k + 1) × (k + 1) centred cross-products, the outcome last. */
export function leastSquares(c: Float64Array, k: number): LeastSquares {
	const size = k + 1;
	const cxx = new Float64Array(k * k);
	for (let a = 0; a < k; a++) for (let b = 0; b < k; b++) cxx[a * k + b] = c[a * size + b];
	const l = k > 0 ? cholesky(cxx, k, 0) : new Float64Array(0);
	if (!l) throw new StatsError('The regression could not be fitted: the design is singular.');
	const w = new Float64Array(k);
	for (let a = 0; a < k; a++) {
		let s = c[a * size + k];
		for (let b = 0; b < a; b++) s -= l[a * k + b] * w[b];
		w[a] = s / l[a * k + a];
	}
	const beta = new Float64Array(k);
	for (let a = k - 1; a >= 0; a--) {
		let s = w[a];
		for (let b = a + 1; b < k; b++) s -= l[b * k + a] * beta[b];
		beta[a] = s / l[a * k + a];
	}
	let explained = 0;
	for (let a = 0; a < k; a++) explained += w[a] * w[a];
	return { beta, rss: c[k * size + k] - explained, w, inverse: k > 0 ? choleskyInverse(l, k) : new Float64Array(0) };
}

/** A LinearFit (as fitLinear reports it) from least squares on moments. O(k²). */
export function linearFitFromMoments(
	ls: LeastSquares,
	about: { names: readonly string[]; means: Float64Array; meanY: number; tss: number; n: number; dropped: DroppedColumn[]; notes: readonly string[] }
): LinearFit {
	const { beta, rss, inverse } = ls;
	const { names, means, meanY, tss, n } = about;
	const k = beta.length;
	const p = k + 1;
	if (n <= p) throw new StatsError(`Too few complete cases (${n}) for ${p} coefficients.`);
	const df = n - p;
	const sigma2 = rss / df;
	const covariance = new Float64Array(p * p);
	const ax = new Float64Array(k);
	for (let a = 0; a < k; a++) for (let b = 0; b < k; b++) ax[a] += inverse[a * k + b] * means[b];
	let xax = 0;
	for (let a = 0; a < k; a++) xax += means[a] * ax[a];
	covariance[0] = sigma2 * (1 / n + xax);
	for (let a = 0; a < k; a++) {
		covariance[a + 1] = covariance[(a + 1) * p] = -sigma2 * ax[a];
		for (let b = 0; b < k; b++) covariance[(a + 1) * p + b + 1] = sigma2 * inverse[a * k + b];
	}
	let intercept = meanY;
	for (let a = 0; a < k; a++) intercept -= beta[a] * means[a];
	const estimates = [intercept, ...beta];
	const q = tQuantile(0.975, df);
	const coefficients: Coefficient[] = names.map((name, j) => {
		const se = Math.sqrt(covariance[j * p + j]);
		const t = estimates[j] / se;
		return { name, estimate: estimates[j], se, statistic: t, pValue: tTwoSidedP(t, df), ci: [estimates[j] - q * se, estimates[j] + q * se] };
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
		dropped: about.dropped,
		notes: [...about.notes, 'Wald 95 % intervals with the t distribution.'],
		warnings: about.dropped.map((c) => c.message),
		reference: 'Least squares from centred cross-products computed once per table (Draper & Smith, ch. 5)'
	};
}
