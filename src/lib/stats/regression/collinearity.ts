/**
 * Detecting exact (or numerically exact) collinearity among design columns before a fit.
 *
 * Method: the correlation matrix of the non-intercept columns (centring accounts for the
 * intercept) is factored by a sequential Cholesky decomposition in column order. The
 * Schur complement of column j is 1 − R²_j, where R²_j is from regressing column j on the
 * columns kept before it; a column with 1 − R²_j < 1e-9 (a variance inflation above 1e9)
 * is left out, as R's lm leaves out a column whose QR pivot falls below its tolerance. The
 * columns it depends on are read from that regression's standardized coefficients.
 * O(n·p²) for the cross-products, O(p³) for the factorisation.
 */
import type { Design } from './design';
import { INTERCEPT } from './design';

export const COLLINEARITY_TOLERANCE = 1e-9;

export interface DroppedColumn {
	name: string;
	index: number;
	/** Columns it is (numerically) a linear combination of, besides the intercept. */
	relatedTo: string[];
	message: string;
}

export interface CollinearityCheck {
	/** Design column indices kept (intercept first). */
	keep: number[];
	dropped: DroppedColumn[];
}

export function checkCollinearity(design: Design): CollinearityCheck {
	return collinearityFromGram(centeredGram(design), design.names);
}

/**
 * Centred cross-products Σ (x_j − x̄_j)(x_m − x̄_m) of the non-intercept design columns
 * (lower triangle, row-major (p − 1) × (p − 1)). O(n·p²).
 */
export function centeredGram(design: Design): Float64Array {
	const { n, p, x } = design;
	const q = p - 1;
	const mean = new Float64Array(q);
	for (let k = 0; k < n; k++) for (let j = 0; j < q; j++) mean[j] += x[k * p + j + 1];
	for (let j = 0; j < q; j++) mean[j] /= n;
	const gram = new Float64Array(q * q);
	const d = new Float64Array(q);
	for (let k = 0; k < n; k++) {
		const base = k * p + 1;
		for (let j = 0; j < q; j++) d[j] = x[base + j] - mean[j];
		for (let j = 0; j < q; j++) {
			const dj = d[j];
			if (dj === 0) continue;
			for (let m = 0; m <= j; m++) gram[j * q + m] += dj * d[m];
		}
	}
	return gram;
}

/**
 * The check on centred cross-products (from centeredGram, or from sufficient statistics
 * computed once for many models); `names` are the design's coefficient names, intercept
 * first. O(p³).
 */
export function collinearityFromGram(gram: Float64Array, names: readonly string[]): CollinearityCheck {
	const q = names.length - 1;
	const keep: number[] = [0];
	const dropped: DroppedColumn[] = [];
	const kept: number[] = []; // indices into 0..q−1
	const lRows: Float64Array[] = []; // Cholesky rows of kept columns (length = kept.length)
	const corr = (a: number, b: number) => {
		const [hi, lo] = a >= b ? [a, b] : [b, a];
		return gram[hi * q + lo] / Math.sqrt(gram[a * q + a] * gram[b * q + b]);
	};
	for (let j = 0; j < q; j++) {
		const name = names[j + 1];
		if (!(gram[j * q + j] > 0)) {
			dropped.push({ name, index: j + 1, relatedTo: [], message: `'${name}' does not vary in the complete cases (it equals the intercept); it is left out.` });
			continue;
		}
		// Forward substitution: row of L for column j against the kept columns.
		const row = new Float64Array(kept.length);
		let schur = 1;
		for (let a = 0; a < kept.length; a++) {
			let s = corr(j, kept[a]);
			for (let b = 0; b < a; b++) s -= row[b] * lRows[a][b];
			row[a] = s / lRows[a][a];
			schur -= row[a] * row[a];
		}
		if (schur < COLLINEARITY_TOLERANCE) {
			// Standardized regression coefficients of column j on the kept columns: Lᵀβ = row.
			const beta = new Float64Array(kept.length);
			for (let a = kept.length - 1; a >= 0; a--) {
				let s = row[a];
				for (let b = a + 1; b < kept.length; b++) s -= lRows[b][a] * beta[b];
				beta[a] = s / lRows[a][a];
			}
			const relatedTo = kept.filter((_, a) => Math.abs(beta[a]) > 1e-4).map((m) => names[m + 1]);
			dropped.push({
				name,
				index: j + 1,
				relatedTo,
				message: `'${name}' is a linear combination of ${relatedTo.map((r) => `'${r}'`).join(', ') || 'other columns'} (and the ${INTERCEPT}); it is left out.`
			});
			continue;
		}
		const full = new Float64Array(kept.length + 1);
		full.set(row);
		full[kept.length] = Math.sqrt(schur);
		lRows.push(full);
		kept.push(j);
		keep.push(j + 1);
	}
	return { keep, dropped };
}

/** The design restricted to the kept columns. O(n·p). */
export function selectColumns(design: Design, keep: readonly number[]): Design {
	if (keep.length === design.p) return design;
	const { n, p } = design;
	const q = keep.length;
	const x = new Float64Array(n * q);
	for (let k = 0; k < n; k++) for (let j = 0; j < q; j++) x[k * q + j] = design.x[k * p + keep[j]];
	const position = new Map(keep.map((j, i) => [j, i]));
	return {
		...design,
		p: q,
		x,
		names: keep.map((j) => design.names[j]),
		terms: design.terms
			.map((t) => ({ ...t, indices: t.indices.filter((i) => position.has(i)).map((i) => position.get(i) as number) }))
			.filter((t) => t.indices.length > 0)
	};
}
