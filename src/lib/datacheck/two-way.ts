/**
 * What a practitioner reads for two discrete variables: the table of counts with row
 * proportions per category, Pearson's X² with its degrees of freedom and p-value, and when
 * one of them is binary the odds ratio of each level of the other against its reference level
 * (logistic regression, Wald interval; stats/association/level-odds-ratios.ts), plus the risk
 * difference for a 2 × 2 table. Rows are the first variable (the arrow's tail). Complete cases.
 * O(n + r·c) and one logistic fit.
 */
import { chiSquareTest, crossTabulate, levelOddsRatios, StatsError, type CodedColumn, type LevelOddsRatios, type TableStatistics } from '../stats';

export interface TwoWayTable {
	rowVariable: string;
	colVariable: string;
	rowLevels: string[];
	colLevels: string[];
	/** counts[i][j]: row level i, column level j. */
	counts: number[][];
	/** Each row's counts divided by the row total. */
	rowProportions: number[][];
	n: number;
	chiSquare: { statistic: number; df: number; pValue: number } | null;
	/** Odds ratios per level, when a variable is binary (`outcome` is that binary variable). */
	levelOddsRatios: LevelOddsRatios | null;
	/** 2 × 2 only: P(second column level | second row level) − P(… | first row level). */
	riskDifference: number | null;
	message: string | null;
}

export function twoWayTable(a: CodedColumn, b: CodedColumn, stats?: TableStatistics): TwoWayTable {
	const t = stats ? stats.crossTab(a, b) : crossTabulate(a, b);
	const counts = Array.from({ length: t.rows }, (_, i) => Array.from(t.counts.subarray(i * t.cols, (i + 1) * t.cols)));
	const rowProportions = counts.map((row) => {
		const total = row.reduce((s, x) => s + x, 0);
		return row.map((x) => (total > 0 ? x / total : NaN));
	});
	let chiSquare: TwoWayTable['chiSquare'] = null;
	let message: string | null = null;
	try {
		const c = chiSquareTest(t);
		chiSquare = { statistic: c.statistic, df: c.df[0], pValue: c.pValue };
	} catch (e) {
		if (!(e instanceof StatsError)) throw e;
		message = e.message;
	}
	let ors: LevelOddsRatios | null = null;
	try {
		if (t.cols === 2 && b.kind === 'binary') ors = levelOddsRatios(b, a, stats);
		else if (t.rows === 2 && a.kind === 'binary') ors = levelOddsRatios(a, b, stats);
	} catch (e) {
		if (!(e instanceof StatsError)) throw e;
	}
	const riskDifference = t.rows === 2 && t.cols === 2 ? rowProportions[1][1] - rowProportions[0][1] : null;
	return { rowVariable: a.name, colVariable: b.name, rowLevels: t.rowLevels, colLevels: t.colLevels, counts, rowProportions, n: t.n, chiSquare, levelOddsRatios: ors, riskDifference, message };
}
