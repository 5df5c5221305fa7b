/**
 * One IRLS pass over the rows of a row-major design (the per-row form of irls.ts): XᵀWX
 * (lower triangle), XᵀWz, the deviance and the count of fitted probabilities at the bounds,
 * at β (null: R's starting values μ₀ = (y + ½)/2).
 *
 * The rows are taken in blocks of BLOCK: the block's design columns are copied out
 * column-major, η, w and w·z are computed per row, and each entry of XᵀWX is then one dot
 * product over the block kept in a local variable — the blocked form of a symmetric rank-k
 * update (as BLAS's dsyrk). Reason (measured with node --cpu-prof on the demo study at 10⁶
 * rows, p = 6–8): adding w·x xᵀ row by row read and wrote every entry of XᵀWX once per row,
 * and the row's η, μ and totals went through an object; the blocked pass does the same
 * arithmetic with one read-modify-write per entry per block. Per row the η, μ, w, w·z and
 * deviance terms are the same operations in the same order as before; only the order in
 * which XᵀWX and XᵀWz add up the rows changes (rounding, ~1e-16 relative). O(n·p²/2).
 * Then (same profile: this pass was 38 % of `causeway test`'s CPU): a complete column is copied
 * as a slice instead of gathered through the row indices, and the 0/1 deviance takes one
 * logarithm per ~10 rows; 10⁶ rows × 7 columns, best of 12: 101 → 73 ms per pass.
 */
import type { DesignVector } from './design';
import type { IrlsData } from './irls';

/**
 * The design columns as the table's vectors over some of its rows (a DesignPlan's), read a
 * block at a time instead of from an n × p matrix: a fit on a million rows then makes no
 * matrix (materialize was 10 % of `causeway test`, node --cpu-prof), at the cost of reading
 * the vectors through the row indices on every pass.
 */
export interface DesignSource {
	vectors: readonly DesignVector[];
	/** Ascending and distinct: the complete cases (design.ts) or a strided subsample of them. */
	rows: Int32Array;
}

/** Rows per block: 7 columns × 256 rows × 8 bytes × 2 arrays stays in the L1 cache. */
export const BLOCK = 256;
const BOUND = 10 * Number.EPSILON;

/** Buffers of one fit, reused by every pass. */
export interface RowPassScratch {
	xb: Float64Array;
	wx: Float64Array;
	w: Float64Array;
	wz: Float64Array;
}

export function rowPassScratch(p: number): RowPassScratch {
	return { xb: new Float64Array(p * BLOCK), wx: new Float64Array(p * BLOCK), w: new Float64Array(BLOCK), wz: new Float64Array(BLOCK) };
}

/** y·log(y/μ) with 0·log 0 = 0. */
export function ylogy(y: number, mu: number): number {
	return y > 0 ? y * Math.log(y / mu) : 0;
}

export function rowPass(
	data: IrlsData,
	beta: Float64Array | null,
	xtwx: Float64Array,
	xtwz: Float64Array,
	scratch: RowPassScratch,
	binary: boolean
): { deviance: number; atBounds: number } {
	const { x, stride, cols, units, y } = data;
	const p = cols.length;
	const { xb, wx, w, wz } = scratch;
	let deviance = 0;
	let atBounds = 0;
	// A 0/1 outcome's deviance is −2 Σ log q (q = μ or 1 − μ): the q are multiplied and their
	// product's logarithm taken only when it nears underflow, one Math.log per ~10 rows instead
	// of one per row (q ≥ ε ≈ 2.2e-16 after the clamp, so a product above 1e-200 times q
	// stays above 2e-216). Same sum up to rounding (~1e-16 relative).
	let product = 1;
	let logSum = 0;
	for (let start = 0; start < units; start += BLOCK) {
		const len = Math.min(BLOCK, units - start);
		if (data.source) fillBlock(data.source, cols, start, len, xb);
		else
			for (let j = 0; j < p; j++) {
				const c = cols[j];
				const off = j * BLOCK;
				let at = start * stride + c;
				for (let i = 0; i < len; i++, at += stride) xb[off + i] = x[at];
			}
		for (let i = 0; i < len; i++) {
			const yk = y[start + i];
			let eta: number;
			let mu: number;
			if (beta === null) {
				mu = (yk + 0.5) / 2;
				eta = Math.log(mu / (1 - mu));
			} else {
				eta = 0;
				for (let j = 0; j < p; j++) eta += xb[j * BLOCK + i] * beta[j];
				mu = 1 / (1 + Math.exp(-eta));
				if (mu < Number.EPSILON) mu = Number.EPSILON;
				else if (mu > 1 - Number.EPSILON) mu = 1 - Number.EPSILON;
			}
			if (mu < BOUND || mu > 1 - BOUND) atBounds++;
			if (binary) {
				product *= yk === 1 ? mu : 1 - mu;
				if (product < 1e-200) {
					logSum += Math.log(product);
					product = 1;
				}
			} else deviance += 2 * (ylogy(yk, mu) + ylogy(1 - yk, 1 - mu));
			const wk = mu * (1 - mu);
			w[i] = wk;
			wz[i] = wk * eta + (yk - mu);
		}
		for (let j = 0; j < p; j++) {
			const off = j * BLOCK;
			let z = 0;
			for (let i = 0; i < len; i++) {
				const v = xb[off + i];
				z += v * wz[i];
				wx[off + i] = w[i] * v;
			}
			xtwz[j] += z;
			lowerRow(xtwx, j * p, j, off, wx, xb, len);
		}
	}
	if (binary) deviance = -2 * (logSum + Math.log(product));
	return { deviance, atBounds };
}

/** The block's columns `cols` of the design, rows start…start + len − 1, column-major into xb (column j at j·BLOCK). */
export function fillBlock(source: DesignSource, cols: Int32Array, start: number, len: number, xb: Float64Array): void {
	const { vectors, rows } = source;
	for (let j = 0; j < cols.length; j++) {
		const v = vectors[cols[j]];
		const off = j * BLOCK;
		if (v.kind === 'one') xb.fill(1, off, off + len);
		else if (v.kind === 'values') {
			const values = v.values;
			// Every row complete (the rows are ascending and distinct, so all of them when the
			// last is the last): the block is a slice of the column, copied at memory speed.
			if (rows.length === values.length && rows[rows.length - 1] === values.length - 1) xb.set(values.subarray(start, start + len), off);
			else for (let i = 0; i < len; i++) xb[off + i] = values[rows[start + i]];
		} else {
			const { codes, level } = v;
			for (let i = 0; i < len; i++) xb[off + i] = codes[rows[start + i]] === level ? 1 : 0;
		}
	}
}

/**
 * Entries m ≤ j of row j of XᵀWX from the block: (w·x_j)·x_m, four m at a time so that each
 * w·x_j read feeds four independent sums (a quarter fewer cycles than one sum at a time at p = 7).
 */
function lowerRow(xtwx: Float64Array, row: number, j: number, off: number, wx: Float64Array, xb: Float64Array, len: number): void {
	let m = 0;
	for (; m + 3 <= j; m += 4) {
		const o0 = m * BLOCK;
		const o1 = o0 + BLOCK;
		const o2 = o1 + BLOCK;
		const o3 = o2 + BLOCK;
		let s0 = 0;
		let s1 = 0;
		let s2 = 0;
		let s3 = 0;
		for (let i = 0; i < len; i++) {
			const v = wx[off + i];
			s0 += v * xb[o0 + i];
			s1 += v * xb[o1 + i];
			s2 += v * xb[o2 + i];
			s3 += v * xb[o3 + i];
		}
		xtwx[row + m] += s0;
		xtwx[row + m + 1] += s1;
		xtwx[row + m + 2] += s2;
		xtwx[row + m + 3] += s3;
	}
	for (; m <= j; m++) {
		const o = m * BLOCK;
		let s = 0;
		for (let i = 0; i < len; i++) s += wx[off + i] * xb[o + i];
		xtwx[row + m] += s;
	}
}
