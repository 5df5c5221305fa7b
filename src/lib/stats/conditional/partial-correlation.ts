/**
 * Partial correlation of two continuous variables given a set Z, tested with Fisher's z:
 * z = atanh(r)·√(n − |Z| − 3), two-sided normal p-value (Fisher 1924; the test used by
 * the PC algorithm, Kalisch & Bühlmann, JMLR 2007). The partial correlation is computed
 * from the inverse of the correlation matrix of {x, y, Z} on complete cases, which equals
 * the correlation of the residuals of x and y regressed on Z. O(n·m² + m³), m = |Z| + 2;
 * O(m³) from the table's shared cross-products (src/lib/stats/sufficient).
 */
import { normalTwoSidedP } from '../distributions';
import { StatsError } from '../errors';
import { completeRows, numericValues } from '../table/columns';
import type { Column } from '../table/types';
import type { TestResult } from '../types';
import { fisherZInterval } from '../association/correlation';
import { cholesky, choleskyInverse } from '../regression/linalg';
import type { TableStatistics } from '../sufficient/table-statistics';

export function partialCorrelationResult(r: number, n: number, k: number): TestResult {
	if (n - k - 3 < 1) throw new StatsError(`A partial correlation given ${k} variables needs at least ${k + 4} complete cases (found ${n}).`);
	const z = Math.atanh(r) * Math.sqrt(n - k - 3);
	return {
		test: "Partial correlation, Fisher's z test",
		statisticName: 'z',
		statistic: z,
		df: [],
		pValue: normalTwoSidedP(z),
		n,
		effects: [{ name: 'partial r', value: r, ci: fisherZInterval(r, n, k), note: "95 % interval from Fisher's z." }],
		notes: k > 0 ? [`Given ${k} variable${k === 1 ? '' : 's'}; z = atanh(r)·√(n − ${k} − 3).`] : [],
		reference: 'Fisher (1924) z test for partial correlation; Kalisch & Bühlmann (2007)'
	};
}

/** Correlation matrix (row-major m × m) of the given numeric arrays. O(n·m²). */
export function correlationMatrix(columns: readonly Float64Array[]): Float64Array {
	const m = columns.length;
	const n = columns[0].length;
	const centred = columns.map((c) => {
		let mean = 0;
		for (let i = 0; i < n; i++) mean += c[i];
		mean /= n;
		return c.map((v) => v - mean);
	});
	const out = new Float64Array(m * m);
	for (let a = 0; a < m; a++)
		for (let b = 0; b <= a; b++) {
			let s = 0;
			const ca = centred[a];
			const cb = centred[b];
			for (let i = 0; i < n; i++) s += ca[i] * cb[i];
			out[a * m + b] = s;
			out[b * m + a] = s;
		}
	return correlationFromCrossProducts(out, m);
}

/** Centred cross-products (m × m) scaled in place to correlations. O(m²). */
export function correlationFromCrossProducts(out: Float64Array, m: number): Float64Array {
	const d = Array.from({ length: m }, (_, a) => Math.sqrt(out[a * m + a]));
	for (let a = 0; a < m; a++) {
		if (!(d[a] > 0)) throw new StatsError(`A variable of the partial correlation does not vary in the complete cases.`);
		for (let b = 0; b < m; b++) out[a * m + b] /= d[a] * d[b];
	}
	return out;
}

export function partialCorrelationTest(x: Column, y: Column, given: readonly Column[], stats?: TableStatistics): TestResult {
	const all = [x, y, ...given];
	if (stats) {
		const rows = stats.rows(all);
		const vectors = all.map((c) => ({ kind: 'values' as const, values: stats.numeric(c) }));
		const corr = correlationFromCrossProducts(stats.momentsOf(rows).matrix(vectors), all.length);
		return partialCorrelationResult(partialFromCorrelation(corr, all.length), rows.length, given.length);
	}
	const rows = completeRows(all);
	const arrays = all.map((c) => {
		const v = numericValues(c);
		const out = new Float64Array(rows.length);
		for (let k = 0; k < rows.length; k++) out[k] = v[rows[k]];
		return out;
	});
	const corr = correlationMatrix(arrays);
	return partialCorrelationResult(partialFromCorrelation(corr, all.length), rows.length, given.length);
}

/** −P₀₁/√(P₀₀·P₁₁) for the first two of m variables, P the inverse correlation matrix. */
export function partialFromCorrelation(corr: Float64Array, m: number): number {
	const l = cholesky(corr, m, 1e-12);
	if (!l) throw new StatsError('The conditioning variables are collinear; the partial correlation is undefined.');
	const p = choleskyInverse(l, m);
	return -p[1] / Math.sqrt(p[0] * p[m + 1]);
}
