/**
 * The two-way table of two discrete columns as people read it — counts with row proportions
 * per category, X² with its df and p, the odds ratio of each level against the reference — as
 * cells of text that the app, the command line and the report lay out each in their own way.
 * O(rows × columns).
 */
import type { TwoWayTable } from '../datacheck';
import type { LabelOf } from './names';
import { formatCi, formatCount, formatNumber, formatP, pText } from './numbers';

/** "1,493 (55 %)": a count and its share of the row. */
export function countWithShare(count: number, share: number): string {
	return `${formatCount(count)} (${Number.isFinite(share) ? `${formatNumber(share * 100, share >= 0.1 ? 2 : 1)} %` : '—'})`;
}

export interface TwoWayCells {
	/** First cell names the two columns, "dept \\ admitted"; then the column levels and "total". */
	head: string[];
	/** One row per level of the row column: the level, then "count (row %)" per column, then the row total. */
	rows: string[][];
	caption: string;
}

/** The table as text cells; `name` turns column names into labels. */
export function twoWayCells(t: TwoWayTable, name: LabelOf = (c) => c): TwoWayCells {
	const rows = t.counts.map((counts, i) => [t.rowLevels[i], ...counts.map((c, j) => countWithShare(c, t.rowProportions[i][j])), formatCount(counts.reduce((s, x) => s + x, 0))]);
	return {
		head: [`${name(t.rowVariable)} \\ ${name(t.colVariable)}`, ...t.colLevels, 'total'],
		rows,
		caption: `Counts of ${name(t.rowVariable)} by ${name(t.colVariable)}, with the share of each row (row %), n = ${formatCount(t.n)}.`
	};
}

/** "X² = 92.2, 1 df, p < 0.001" (Pearson, no continuity correction), or why there is none. */
export function chiSquareText(t: TwoWayTable): string {
	if (!t.chiSquare) return `No X² test: ${t.message ?? 'the table has a single row or column'}`;
	return `Pearson X² = ${formatNumber(t.chiSquare.statistic)}, ${t.chiSquare.df} df, ${pText(t.chiSquare.pValue)}`;
}

/** Rows of the per-level odds ratios: level vs reference, OR, 95 % CI, p (logistic regression, Wald). */
export function levelOddsRatioCells(t: TwoWayTable, name: LabelOf = (c) => c): { caption: string; head: string[]; rows: string[][] } | null {
	const o = t.levelOddsRatios;
	if (!o || o.levels.length === 0) return null;
	return {
		caption: `Odds of ${name(o.outcome)} = ${o.outcomeLevel} at each level of ${name(o.variable)} against the reference ${o.reference.level} (logistic regression, Wald 95 % CI).`,
		head: [`${name(o.variable)}`, 'odds ratio', '95 % CI', 'p'],
		rows: o.levels.map((l) => [`${l.level} vs ${o.reference.level}`, formatNumber(l.oddsRatio), formatCi(l.ci), formatP(l.pValue)])
	};
}

/** 2 × 2 tables: "risk difference +0.12 (P(admitted = 1) at female = 1 minus at 0)". */
export function tableRiskDifferenceText(t: TwoWayTable, name: LabelOf = (c) => c): string | null {
	if (t.riskDifference === null) return null;
	const sign = t.riskDifference > 0 ? '+' : '';
	return `Risk difference ${sign}${formatNumber(t.riskDifference)}: the share with ${name(t.colVariable)} = ${t.colLevels[1]} at ${name(t.rowVariable)} = ${t.rowLevels[1]} minus at ${t.rowLevels[0]}.`;
}
