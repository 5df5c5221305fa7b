/**
 * Comparing a numeric variable across the levels of a grouping variable.
 * - One-way ANOVA F test (Fisher 1925): F = [SSB/(k − 1)] / [SSW/(N − k)], effect size
 *   eta squared = SSB/SST. O(N).
 * - Kruskal–Wallis H test (Kruskal & Wallis 1952) on mid-ranks, divided by the tie
 *   correction 1 − Σ(t³ − t)/(N³ − N), referred to chi-square on k − 1 df; effect size
 *   epsilon squared = H(N + 1)/(N² − 1) (Tomczak & Tomczak 2014). O(N log N).
 */
import { chiSquareSf, fSf } from '../distributions';
import { StatsError } from '../errors';
import { completeRows, numericValues, observedLevels } from '../table/columns';
import type { CodedColumn, Column } from '../table/types';
import type { TestResult } from '../types';
import { midRanks, type Ranking } from './ranks';
import type { TableStatistics } from '../sufficient/table-statistics';

/** Complete cases as values and group codes 0…k−1 (observed levels only). */
export function groupedValues(group: CodedColumn, response: Column, stats?: TableStatistics): { values: Float64Array; groups: Int32Array; levels: string[] } {
	const rows = stats ? stats.rows([group, response]) : completeRows([group, response]);
	const { codes, levels } = stats ? stats.observed(group, rows) : observedLevels(group, rows);
	const v = stats ? stats.numeric(response) : numericValues(response);
	if (stats && rows.length === v.length) return { values: v, groups: codes, levels }; // every row: no copy
	const values = new Float64Array(rows.length);
	for (let k = 0; k < rows.length; k++) values[k] = v[rows[k]];
	return { values, groups: codes, levels };
}

function groupSums(values: Float64Array, groups: Int32Array, k: number): { sums: Float64Array; sizes: Float64Array } {
	const sums = new Float64Array(k);
	const sizes = new Float64Array(k);
	for (let i = 0; i < values.length; i++) {
		sums[groups[i]] += values[i];
		sizes[groups[i]]++;
	}
	return { sums, sizes };
}

function requireGroups(k: number, n: number, what: string): void {
	if (k < 2) throw new StatsError(`${what} needs at least two groups with observations (found ${k}).`);
	if (n <= k) throw new StatsError(`${what} needs more observations than groups (found ${n} for ${k} groups).`);
}

export function oneWayAnova(values: Float64Array, groups: Int32Array, k: number): TestResult {
	const n = values.length;
	requireGroups(k, n, 'One-way ANOVA');
	const { sums, sizes } = groupSums(values, groups, k);
	let grand = 0;
	for (let i = 0; i < n; i++) grand += values[i];
	grand /= n;
	let ssb = 0;
	for (let g = 0; g < k; g++) if (sizes[g] > 0) ssb += sizes[g] * (sums[g] / sizes[g] - grand) ** 2;
	let ssw = 0;
	for (let i = 0; i < n; i++) ssw += (values[i] - sums[groups[i]] / sizes[groups[i]]) ** 2;
	const df1 = k - 1;
	const df2 = n - k;
	const f = ssb / df1 / (ssw / df2);
	return {
		test: 'One-way ANOVA F test',
		statisticName: 'F',
		statistic: f,
		df: [df1, df2],
		pValue: fSf(f, df1, df2),
		n,
		effects: [{ name: 'eta squared', value: ssb / (ssb + ssw) }],
		notes: ['Assumes equal variances across groups.'],
		reference: 'Fisher (1925), analysis of variance'
	};
}

/** `ranking`: the values' mid-ranks when already known (the table's shared statistics). */
export function kruskalWallis(values: Float64Array, groups: Int32Array, k: number, ranking?: Ranking): TestResult {
	const n = values.length;
	requireGroups(k, n, 'The Kruskal–Wallis test');
	const { ranks, tieSum } = ranking ?? midRanks(values);
	const { sums, sizes } = groupSums(ranks, groups, k);
	let s = 0;
	for (let g = 0; g < k; g++) if (sizes[g] > 0) s += (sums[g] * sums[g]) / sizes[g];
	const correction = 1 - tieSum / (n * n * n - n);
	if (!(correction > 0)) throw new StatsError('The Kruskal–Wallis test is undefined: all values are tied.');
	const h = ((12 / (n * (n + 1))) * s - 3 * (n + 1)) / correction;
	return {
		test: 'Kruskal–Wallis rank-sum test',
		statisticName: 'H',
		statistic: h,
		df: [k - 1],
		pValue: chiSquareSf(h, k - 1),
		n,
		effects: [{ name: 'epsilon squared', value: (h * (n + 1)) / (n * n - 1) }],
		notes: tieSum > 0 ? ['Corrected for ties.'] : [],
		reference: 'Kruskal & Wallis (1952); effect size, Tomczak & Tomczak (2014)'
	};
}
