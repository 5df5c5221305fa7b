/**
 * The iteratively reweighted least-squares loop of logistic regression (Nelder & Wedderburn
 * 1972; McCullagh & Nelder, Generalized Linear Models, 2nd ed., §2.5) with R's glm.fit
 * starting values μ₀ = (y + ½)/2 and its stopping rule |D − D_old| / (|D| + 0.1) < tol, on
 * either of two forms of the same data:
 * - one unit per row: y in [0, 1];
 * - one unit per covariate pattern, with its number of rows (trials) and of 1s (events) — the
 *   sufficient statistics of the binomial likelihood when the rows are 0/1. Every sum of the
 *   per-row loop (XᵀWX, XᵀWz, the deviance, the count at the bounds) is then a weighted sum
 *   over patterns, starting values included, so both forms take the same steps and give the
 *   same fit up to the order of summation; with few patterns (a discrete covariate, a
 *   whole-number age) the loop costs O(patterns·p²) instead of O(n·p²).
 * Each iteration solves XᵀWX·β = XᵀWz by Cholesky (why not QR: logistic.ts). A start β may
 * be given (warm start, e.g. a nested model's estimates with 0 for the added terms): the fit
 * then reaches the same maximum in fewer passes over the rows (see the polish step below). The rows' design columns are read
 * through `cols` so that nested models share one matrix. Interruptible between iterations.
 */
import { StatsError } from '../errors';
import type { Interrupt } from '../sufficient/interrupt';
import { cholesky, choleskySolve } from './linalg';
import { rowPass, rowPassScratch, type DesignSource, type RowPassScratch } from './irls-row-pass';

export { ylogy } from './irls-row-pass';

export interface IrlsData {
	/** Row-major units × stride. */
	x: Float64Array;
	stride: number;
	/** The design columns used, as indices into a row of `x`. */
	cols: Int32Array;
	units: number;
	/** Outcome per row in [0, 1] (trials null), or events per pattern. */
	y: Float64Array;
	trials: Float64Array | null;
	/** Per-row form only: read the design columns from these vectors instead of `x` (`cols` index them). */
	source?: DesignSource;
}

export interface IrlsOptions {
	maxIterations?: number;
	tolerance?: number;
	start?: Float64Array | null;
	interrupt?: Interrupt;
}

export interface IrlsResult {
	beta: Float64Array;
	/** XᵀWX at the final estimates, full symmetric p × p. */
	xtwx: Float64Array;
	deviance: number;
	iterations: number;
	converged: boolean;
	/** Rows with a fitted probability within 10·ε of 0 or 1. */
	atBounds: number;
	/** β after each update. */
	history: Float64Array[];
}

const BOUND = 10 * Number.EPSILON;
const MU0_ETA = Math.log(0.75 / 0.25);

function clampMu(eta: number): number {
	const mu = 1 / (1 + Math.exp(-eta));
	return mu < Number.EPSILON ? Number.EPSILON : mu > 1 - Number.EPSILON ? 1 - Number.EPSILON : mu;
}

/** Adds w·x xᵀ (lower triangle) and wz·x for one unit. */
function accumulate(xr: Float64Array, p: number, w: number, wz: number, xtwx: Float64Array, xtwz: Float64Array): void {
	for (let j = 0; j < p; j++) {
		const xj = xr[j];
		const wxj = w * xj;
		xtwz[j] += xj * wz;
		const row = j * p;
		for (let m = 0; m <= j; m++) xtwx[row + m] += wxj * xr[m];
	}
}

/** One pass: XᵀWX (lower triangle), XᵀWz, deviance and the count at the bounds at β (null: starting values). */
function pass(data: IrlsData, beta: Float64Array | null, xtwx: Float64Array, xtwz: Float64Array, xr: Float64Array, rows: RowPassScratch, binary: boolean): { deviance: number; atBounds: number } {
	const { x, stride, cols, units, y, trials } = data;
	const p = cols.length;
	if (trials === null) return rowPass(data, beta, xtwx, xtwz, rows, binary);
	const t = { deviance: 0, atBounds: 0 };
	for (let k = 0; k < units; k++) {
		const base = k * stride;
		for (let j = 0; j < p; j++) xr[j] = x[base + cols[j]];
		const m = trials[k];
		const e = y[k];
		if (beta === null) {
			// m − e rows start at μ = ¼ and e rows at μ = ¾: the same w, opposite η.
			t.deviance += 2 * m * Math.log(1 / 0.75);
			accumulate(xr, p, m * 0.1875, (2 * e - m) * (0.1875 * MU0_ETA + 0.25), xtwx, xtwz);
		} else {
			let eta = 0;
			for (let j = 0; j < p; j++) eta += xr[j] * beta[j];
			const mu = clampMu(eta);
			if (mu < BOUND || mu > 1 - BOUND) t.atBounds += m;
			t.deviance += 2 * (e * Math.log(1 / mu) + (m - e) * Math.log(1 / (1 - mu)));
			const w = m * mu * (1 - mu);
			accumulate(xr, p, w, w * eta + (e - m * mu), xtwx, xtwz);
		}
	}
	return t;
}

function symmetrize(a: Float64Array, p: number): void {
	for (let j = 0; j < p; j++) for (let m = 0; m < j; m++) a[m * p + j] = a[j * p + m];
}

export function irls(data: IrlsData, options: IrlsOptions = {}): IrlsResult {
	const maxIterations = options.maxIterations ?? 25;
	const tolerance = options.tolerance ?? 1e-8;
	const p = data.cols.length;
	let beta: Float64Array | null = options.start ? options.start.slice() : null;
	const warm = beta !== null;
	const history: Float64Array[] = [];
	const xtwx = new Float64Array(p * p);
	const xtwz = new Float64Array(p);
	const xr = new Float64Array(p);
	const rows = rowPassScratch(p);
	let binary = data.trials === null;
	if (binary) for (let k = 0; k < data.units && binary; k++) binary = data.y[k] === 0 || data.y[k] === 1;
	let devOld = Infinity;
	let deviance = NaN;
	let converged = false;
	let iterations = 0;
	let atBounds = 0;
	for (let iter = 0; iter <= maxIterations; iter++) {
		options.interrupt?.poll();
		xtwx.fill(0);
		xtwz.fill(0);
		({ deviance, atBounds } = pass(data, beta, xtwx, xtwz, xr, rows, binary));
		if (beta !== null && Math.abs(deviance - devOld) / (Math.abs(deviance) + 0.1) < tolerance) {
			converged = true;
			if (warm) {
				// Started near the maximum, the fit stops after fewer steps than from R's start,
				// so its last step is larger; the Newton step this pass has already prepared
				// makes up for it (a cold fit's estimates are matched to their own convergence
				// error, ~1e-12 on the demo data; tested), at no extra pass over the rows.
				const polish = new Float64Array(xtwx);
				symmetrize(polish, p);
				const l = cholesky(polish, p);
				if (l) beta = choleskySolve(l, xtwz, p);
			}
			break;
		}
		if (iter === maxIterations) break;
		devOld = deviance;
		symmetrize(xtwx, p);
		const l = cholesky(xtwx, p);
		if (!l) throw new StatsError('The logistic model could not be fitted: the weighted design is singular (collinear covariates or separation).');
		beta = choleskySolve(l, xtwz, p);
		history.push(beta);
		iterations = iter + 1;
	}
	if (beta === null) throw new StatsError('The logistic model could not be fitted.');
	symmetrize(xtwx, p);
	return { beta, xtwx, deviance, iterations, converged, atBounds, history };
}
