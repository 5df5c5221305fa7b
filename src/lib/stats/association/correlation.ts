/**
 * Correlation tests on complete cases.
 * - Pearson's r with the t test on n − 2 df (exact under bivariate normality) and a
 *   confidence interval from Fisher's z transformation, tanh(atanh r ± z/√(n − 3))
 *   (Fisher 1915, 1921) — as R's cor.test.
 * - Spearman's rho: Pearson's r of mid-ranks (Spearman 1904), p from the t approximation
 *   on n − 2 df (as R's cor.test with exact = FALSE; valid with ties).
 * - Point-biserial r: Pearson's r with a 0/1 variable (equivalent to the pooled two-sample
 *   t test).
 * Pearson: O(n), two passes (means, then centred sums, for accuracy). Spearman: O(n log n).
 */
import { normalQuantile, tTwoSidedP } from '../distributions';
import { StatsError } from '../errors';
import { completeRows, numericValues } from '../table/columns';
import type { Column } from '../table/types';
import type { TestResult } from '../types';
import { midRanks } from './ranks';
import type { TableStatistics } from '../sufficient/table-statistics';

/**
 * Complete-case pairs of two columns as numbers (binary as 0/1, ordinal as scores). With the
 * table's statistics, numbers and rows are shared, and every row complete means no copy.
 */
export function pairedValues(a: Column, b: Column, stats?: TableStatistics): { x: Float64Array; y: Float64Array } {
	const rows = stats ? stats.rows([a, b]) : completeRows([a, b]);
	const va = stats ? stats.numeric(a) : numericValues(a);
	const vb = stats ? stats.numeric(b) : numericValues(b);
	if (stats && rows.length === va.length) return { x: va, y: vb };
	const x = new Float64Array(rows.length);
	const y = new Float64Array(rows.length);
	for (let k = 0; k < rows.length; k++) {
		x[k] = va[rows[k]];
		y[k] = vb[rows[k]];
	}
	return { x, y };
}

/** Pearson's product-moment correlation of two equal-length arrays. O(n). */
export function pearsonR(x: Float64Array, y: Float64Array): number {
	const n = x.length;
	let mx = 0;
	let my = 0;
	for (let i = 0; i < n; i++) {
		mx += x[i];
		my += y[i];
	}
	mx /= n;
	my /= n;
	let sxy = 0;
	let sxx = 0;
	let syy = 0;
	for (let i = 0; i < n; i++) {
		const dx = x[i] - mx;
		const dy = y[i] - my;
		sxy += dx * dy;
		sxx += dx * dx;
		syy += dy * dy;
	}
	return sxy / Math.sqrt(sxx * syy);
}

function requireVariation(r: number, n: number, minimum: number, what: string): void {
	if (n < minimum) throw new StatsError(`${what} needs at least ${minimum} complete cases (found ${n}).`);
	if (Number.isNaN(r)) throw new StatsError(`${what} is undefined: one of the variables does not vary in the complete cases.`);
}

/** t statistic for a correlation: r·√((n − 2)/(1 − r²)). */
function tForR(r: number, n: number): number {
	return r * Math.sqrt((n - 2) / Math.max(0, 1 - r * r));
}

/** Fisher-z confidence interval for a correlation with `k` variables partialled out. */
export function fisherZInterval(r: number, n: number, k = 0, level = 0.95): [number, number] {
	const se = 1 / Math.sqrt(n - k - 3);
	const z = Math.atanh(r);
	const q = normalQuantile(1 - (1 - level) / 2);
	return [Math.tanh(z - q * se), Math.tanh(z + q * se)];
}

export function pearsonTest(x: Float64Array, y: Float64Array): TestResult {
	const n = x.length;
	const r = pearsonR(x, y);
	requireVariation(r, n, 4, "Pearson's correlation");
	const t = tForR(r, n);
	return {
		test: "Pearson's correlation test",
		statisticName: 't',
		statistic: t,
		df: [n - 2],
		pValue: tTwoSidedP(t, n - 2),
		n,
		effects: [{ name: 'Pearson r', value: r, ci: fisherZInterval(r, n), note: "95 % interval from Fisher's z." }],
		notes: [],
		reference: 'Pearson (1896); Fisher (1921) z transformation for the interval'
	};
}

/** `ranks`: the mid-ranks of x and y when already known (the table's shared statistics). */
export function spearmanTest(x: Float64Array, y: Float64Array, ranks?: readonly [Float64Array, Float64Array]): TestResult {
	const n = x.length;
	const rho = ranks ? pearsonR(ranks[0], ranks[1]) : pearsonR(midRanks(x).ranks, midRanks(y).ranks);
	requireVariation(rho, n, 4, "Spearman's correlation");
	const t = tForR(rho, n);
	return {
		test: "Spearman's rank correlation test",
		statisticName: 't',
		statistic: t,
		df: [n - 2],
		pValue: tTwoSidedP(t, n - 2),
		n,
		effects: [{ name: 'Spearman rho', value: rho }],
		notes: ['p-value from the t approximation on n − 2 degrees of freedom (ties given mid-ranks).'],
		reference: 'Spearman (1904)'
	};
}

/** Point-biserial correlation between a binary column and a continuous one. */
export function pointBiserialTest(binary: Float64Array, continuous: Float64Array): TestResult {
	const result = pearsonTest(binary, continuous);
	return {
		...result,
		test: 'Point-biserial correlation test',
		effects: [{ ...result.effects[0], name: 'point-biserial r' }],
		notes: ['Equivalent to the two-sample t test with pooled variance.'],
		reference: 'Pearson correlation with a 0/1 variable (Tate 1954)'
	};
}
