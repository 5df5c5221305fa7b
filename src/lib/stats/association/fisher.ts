/**
 * Fisher's exact test for a 2 × 2 table (Fisher 1935), two-sided. Conditioning on both
 * margins, the top-left count is hypergeometric; the p-value sums the probabilities of all
 * tables no more probable than the observed one, with a relative tolerance of 1e-7 for
 * ties (the convention of R's fisher.test). O(min(row total, column total)).
 *
 * Tables larger than 2 × 2 are not handled here: the dispatcher falls back to the
 * chi-square test and says so.
 */
import { logGamma } from '../distributions';
import { StatsError } from '../errors';
import type { TestResult } from '../types';
import type { ContingencyTable } from './contingency';
import { oddsRatioWoolf } from './odds-ratio';

function logChoose(n: number, k: number): number {
	return logGamma(n + 1) - logGamma(k + 1) - logGamma(n - k + 1);
}

/** Two-sided p-value of Fisher's exact test for [[a, b], [c, d]]. */
export function fisherExactP(a: number, b: number, c: number, d: number): number {
	const m = a + c; // first column total
	const n = b + d; // second column total
	const k = a + b; // first row total
	const lo = Math.max(0, k - n);
	const hi = Math.min(k, m);
	const logd = new Float64Array(hi - lo + 1);
	let max = -Infinity;
	for (let x = lo; x <= hi; x++) {
		logd[x - lo] = logChoose(m, x) + logChoose(n, k - x);
		max = Math.max(max, logd[x - lo]);
	}
	let total = 0;
	for (let i = 0; i < logd.length; i++) total += Math.exp(logd[i] - max);
	const observed = Math.exp(logd[a - lo] - max) * (1 + 1e-7);
	let tail = 0;
	for (let i = 0; i < logd.length; i++) {
		const p = Math.exp(logd[i] - max);
		if (p <= observed) tail += p;
	}
	return Math.min(1, tail / total);
}

export function fisherExactTest(table: ContingencyTable): TestResult {
	if (table.rows !== 2 || table.cols !== 2)
		throw new StatsError(`Fisher's exact test is computed for 2 × 2 tables only (found ${table.rows} × ${table.cols}).`);
	const [a, b, c, d] = table.counts;
	return {
		test: "Fisher's exact test",
		statisticName: '',
		statistic: NaN,
		df: [],
		pValue: fisherExactP(a, b, c, d),
		n: table.n,
		effects: [oddsRatioWoolf(table)],
		notes: ['Two-sided; the odds ratio shown is the sample odds ratio, not the conditional maximum-likelihood estimate.'],
		reference: 'Fisher (1935); Agresti, An Introduction to Categorical Data Analysis, 2nd ed., §2.6'
	};
}
