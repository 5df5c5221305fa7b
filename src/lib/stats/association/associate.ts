/**
 * Checking one arrow against data: the association between two columns, with the test
 * chosen by the columns' kinds. Complete cases only.
 *
 * | kinds                         | main test                                  | also reported            |
 * |-------------------------------|--------------------------------------------|--------------------------|
 * | binary × binary               | chi-square; Fisher's exact when any        | G-test; odds ratio (Woolf)|
 * |                               | expected count < 5                         |                          |
 * | discrete × discrete (larger)  | chi-square (note when sparse)              | G-test                   |
 * | continuous × continuous       | Pearson r                                  | Spearman rho             |
 * | binary × continuous           | point-biserial r                           | Kruskal–Wallis           |
 * | categorical × continuous      | one-way ANOVA F                            | Kruskal–Wallis           |
 * | ordinal × ordinal/continuous/ | Spearman rho                               | —                        |
 * |   binary                      |                                            |                          |
 * | ordinal × categorical         | Kruskal–Wallis                             | chi-square               |
 *
 * Cost: O(n) for tables and Pearson, O(n log n) for rank tests (O(n) with the table's
 * statistics, which rank each column once).
 */
import { StatsError } from '../errors';
import { columnLength, completeRows, observedLevels } from '../table/columns';
import type { CodedColumn, Column } from '../table/types';
import type { TestResult } from '../types';
import { chiSquareTest, dropEmptyMargins, gTest, smallExpectedShare } from './chi-square';
import { crossTabulate, type ContingencyTable } from './contingency';
import { pairedValues, pearsonTest, pointBiserialTest, spearmanTest } from './correlation';
import { fisherExactTest } from './fisher';
import { groupedValues, kruskalWallis, oneWayAnova } from './group-tests';
import { oddsRatioWoolf } from './odds-ratio';
import type { TableStatistics } from '../sufficient/table-statistics';

export interface AssociationResult {
	/** Names of the two columns, in the order given. */
	columns: [string, string];
	/** The test to read first. */
	main: TestResult;
	/** Other tests of the same pair, for reference. */
	others: TestResult[];
}

/** With the table's statistics (src/lib/stats/sufficient), rows, ranks and tables are shared between checks. */
export function associate(a: Column, b: Column, stats?: TableStatistics): AssociationResult {
	const columns: [string, string] = [a.name, b.name];
	const rows = stats ? stats.rows([a, b]) : completeRows([a, b]);
	if (rows.length === 0) throw new StatsError(`'${a.name}' and '${b.name}' are never both observed in the same row.`);
	for (const c of [a, b]) requireVariation(c, rows, stats);
	const [main, ...others] = chooseTests(a, b, rows, stats);
	const total = columnLength(a);
	const used = rows.length;
	if (used < total) main.notes.push(`${total - used} of ${total} rows left out for a missing value (complete cases).`);
	return { columns, main, others };
}

/** A column that does not vary in the complete cases cannot be associated with anything: say which. */
function requireVariation(c: Column, rows: Int32Array, stats: TableStatistics | undefined): void {
	if (c.kind === 'continuous') {
		const first = c.values[rows[0]];
		for (let k = 1; k < rows.length; k++) if (c.values[rows[k]] !== first) return;
		throw new StatsError(`'${c.name}' has the single value ${first} in the complete cases; no association can be tested.`, { column: c.name });
	}
	const levels = (stats ? stats.observed(c, rows) : observedLevels(c, rows)).levels;
	if (levels.length < 2)
		throw new StatsError(`'${c.name}' has a single observed level ('${levels[0]}') in the complete cases; no association can be tested.`, {
			column: c.name
		});
}

function chooseTests(a: Column, b: Column, rows: Int32Array, stats: TableStatistics | undefined): TestResult[] {
	const tabulate = (x: CodedColumn, y: CodedColumn) => (stats ? stats.crossTab(x, y) : crossTabulate(x, y));
	const spearman = () => {
		const { x, y } = pairedValues(a, b, stats);
		return spearmanTest(x, y, stats ? [stats.midRanks(a, rows).ranks, stats.midRanks(b, rows).ranks] : undefined);
	};
	const groupTest = (group: CodedColumn, response: Column, which: 'anova' | 'kruskal'): TestResult => {
		const { values, groups, levels } = groupedValues(group, response, stats);
		return which === 'anova' ? oneWayAnova(values, groups, levels.length) : kruskalWallis(values, groups, levels.length, stats?.midRanks(response, rows));
	};
	if (a.kind !== 'continuous' && b.kind !== 'continuous') {
		if (a.kind === 'ordinal' && b.kind === 'ordinal') return [spearman()];
		if (a.kind === 'ordinal' && b.kind === 'categorical') return [groupTest(b, a, 'kruskal'), chiSquareTest(tabulate(a, b))];
		if (b.kind === 'ordinal' && a.kind === 'categorical') return [groupTest(a, b, 'kruskal'), chiSquareTest(tabulate(a, b))];
		if (a.kind === 'ordinal' || b.kind === 'ordinal') return [spearman()];
		return discreteTests(tabulate(a, b));
	}
	if (a.kind === 'continuous' && b.kind === 'continuous') {
		const { x, y } = pairedValues(a, b, stats);
		return [pearsonTest(x, y), spearman()];
	}
	const [group, numeric] = a.kind === 'continuous' ? [b as CodedColumn, a] : [a as CodedColumn, b];
	if (group.kind === 'ordinal') return [spearman()];
	if (group.kind === 'binary') {
		const { x, y } = pairedValues(group, numeric, stats);
		return [pointBiserialTest(x, y), groupTest(group, numeric, 'kruskal')];
	}
	return [groupTest(group, numeric, 'anova'), groupTest(group, numeric, 'kruskal')];
}

function discreteTests(crossTable: ContingencyTable): TestResult[] {
	const table = dropEmptyMargins(crossTable);
	const chi = chiSquareTest(table);
	const g = gTest(table);
	if (table.rows === 2 && table.cols === 2) {
		const or = oddsRatioWoolf(table);
		const { minimum } = smallExpectedShare(table);
		if (minimum < 5) {
			const fisher = fisherExactTest(table);
			fisher.notes.unshift(`Fisher's exact test chosen: the smallest expected count is ${minimum.toFixed(2)} (< 5).`);
			return [fisher, chi, g];
		}
		chi.effects.unshift(or);
		return [chi, g];
	}
	if (smallExpectedShare(table).minimum < 5)
		chi.notes.push("Some expected counts are below 5; Fisher's exact test is computed for 2 × 2 tables only, so the chi-square test is shown.");
	return [chi, g];
}
