/**
 * Tests of independence in an r × c table: Pearson's chi-square test (Pearson 1900) and
 * the likelihood-ratio G-test (Wilks 1938; Agresti, An Introduction to Categorical Data
 * Analysis, 2nd ed., §2.4), with Cramér's V (Cramér 1946) as effect size. No continuity
 * correction. Levels with a zero margin are left out (they carry no information and would
 * divide by zero). O(r·c) once the table is built.
 */
import { chiSquareSf } from '../distributions';
import { StatsError } from '../errors';
import type { EffectSize, TestResult } from '../types';
import {
	colSums,
	expectedCounts,
	likelihoodRatioStatistic,
	pearsonStatistic,
	rowSums,
	type ContingencyTable
} from './contingency';

/** Drop rows and columns whose margin is zero. */
export function dropEmptyMargins(t: ContingencyTable): ContingencyTable {
	const rs = rowSums(t);
	const cs = colSums(t);
	const keepR = [...rs.keys()].filter((i) => rs[i] > 0);
	const keepC = [...cs.keys()].filter((j) => cs[j] > 0);
	if (keepR.length === t.rows && keepC.length === t.cols) return t;
	const counts = new Float64Array(keepR.length * keepC.length);
	keepR.forEach((i, a) => keepC.forEach((j, b) => (counts[a * keepC.length + b] = t.counts[i * t.cols + j])));
	return {
		counts,
		rows: keepR.length,
		cols: keepC.length,
		rowLevels: keepR.map((i) => t.rowLevels[i]),
		colLevels: keepC.map((j) => t.colLevels[j]),
		n: t.n
	};
}

function requireTwoByTwoOrLarger(t: ContingencyTable): void {
	if (t.rows < 2 || t.cols < 2)
		throw new StatsError(`A test of association needs at least two observed levels in each variable (found ${t.rows} × ${t.cols}).`);
}

/** Cramér's V = √(X² / (n·(min(r, c) − 1))). */
export function cramersV(x2: number, n: number, rows: number, cols: number): EffectSize {
	return { name: "Cramér's V", value: Math.sqrt(x2 / (n * (Math.min(rows, cols) - 1))) };
}

/** Share of cells with an expected count below 5. */
export function smallExpectedShare(t: ContingencyTable): { share: number; minimum: number } {
	const e = expectedCounts(t);
	let small = 0;
	let minimum = Infinity;
	for (const v of e) {
		if (v < 5) small++;
		minimum = Math.min(minimum, v);
	}
	return { share: small / e.length, minimum };
}

function sparsityNote(t: ContingencyTable): string[] {
	const { share } = smallExpectedShare(t);
	return share > 0.2
		? [
				`${Math.round(share * 100)} % of cells have an expected count below 5; the chi-square approximation may be poor (Cochran's guideline of at most 20 %, common practice).`
			]
		: [];
}

/** Pearson's chi-square test of independence, df = (r − 1)(c − 1). */
export function chiSquareTest(table: ContingencyTable): TestResult {
	const t = dropEmptyMargins(table);
	requireTwoByTwoOrLarger(t);
	const x2 = pearsonStatistic(t);
	const df = (t.rows - 1) * (t.cols - 1);
	return {
		test: 'Pearson chi-square test',
		statisticName: 'X²',
		statistic: x2,
		df: [df],
		pValue: chiSquareSf(x2, df),
		n: t.n,
		effects: [cramersV(x2, t.n, t.rows, t.cols)],
		notes: [...marginNote(table, t), ...sparsityNote(t), 'No continuity correction.'],
		reference: 'Pearson (1900); Agresti, An Introduction to Categorical Data Analysis, 2nd ed., §2.4'
	};
}

/** The likelihood-ratio (G) test of independence, df = (r − 1)(c − 1). */
export function gTest(table: ContingencyTable): TestResult {
	const t = dropEmptyMargins(table);
	requireTwoByTwoOrLarger(t);
	const g2 = likelihoodRatioStatistic(t);
	const df = (t.rows - 1) * (t.cols - 1);
	return {
		test: 'Likelihood-ratio G-test',
		statisticName: 'G²',
		statistic: g2,
		df: [df],
		pValue: chiSquareSf(g2, df),
		n: t.n,
		effects: [cramersV(pearsonStatistic(t), t.n, t.rows, t.cols)],
		notes: [...marginNote(table, t), ...sparsityNote(t)],
		reference: 'Wilks (1938); Agresti, An Introduction to Categorical Data Analysis, 2nd ed., §2.4'
	};
}

function marginNote(before: ContingencyTable, after: ContingencyTable): string[] {
	return before.rows !== after.rows || before.cols !== after.cols ? ['Levels with no observations were left out.'] : [];
}
