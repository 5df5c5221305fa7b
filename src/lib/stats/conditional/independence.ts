/**
 * Checking one claim of the diagram against data: is x independent of y given Z? The test
 * is chosen by the kinds of the columns (complete cases):
 * - Z empty: the pairwise association test (associate.ts);
 * - all continuous: partial correlation with Fisher's z;
 * - all discrete: stratified G-test over the strata of Z, plus the Cochran–Mantel–Haenszel
 *   test when x and y are both binary;
 * - mixed: nested regressions — the continuous one of x, y as response (F test), else the
 *   binary one (logistic likelihood-ratio test). Two multi-level categorical variables
 *   given a continuous one have no test here (a multinomial model would be needed).
 * Cost: that of the chosen test.
 */
import { associate } from '../association/associate';
import { StatsError } from '../errors';
import { isDiscrete } from '../table/columns';
import type { CodedColumn, Column } from '../table/types';
import type { TestResult } from '../types';
import { nestedModelTest } from './nested-models';
import { partialCorrelationTest } from './partial-correlation';
import { cochranMantelHaenszel, stratifiedGTest, stratify } from './stratified';
import type { TableStatistics } from '../sufficient/table-statistics';

export interface IndependenceResult {
	x: string;
	y: string;
	given: string[];
	main: TestResult;
	others: TestResult[];
}

/** With the table's statistics (src/lib/stats/sufficient), rows, cross-products, ranks, tables and fits are shared between tests. */
export function testConditionalIndependence(x: Column, y: Column, given: readonly Column[], stats?: TableStatistics): IndependenceResult {
	const names = { x: x.name, y: y.name, given: given.map((g) => g.name) };
	const seen = new Set<string>();
	for (const c of [x, y, ...given]) {
		if (seen.has(c.name)) throw new StatsError(`Column '${c.name}' appears twice in the independence test.`, { column: c.name });
		seen.add(c.name);
	}
	if (given.length === 0) {
		const a = associate(x, y, stats);
		return { ...names, main: a.main, others: a.others };
	}
	const all = [x, y, ...given];
	if (all.every((c) => c.kind === 'continuous')) return { ...names, main: partialCorrelationTest(x, y, given, stats), others: [] };
	if (all.every(isDiscrete)) {
		const tables = stratify(x as CodedColumn, y as CodedColumn, given as CodedColumn[], stats);
		const g = stratifiedGTest(tables);
		if (tables.rows === 2 && tables.cols === 2) return { ...names, main: g, others: [cochranMantelHaenszel(tables)] };
		return { ...names, main: g, others: [] };
	}
	if (y.kind === 'continuous') return { ...names, main: nestedModelTest(y, x, given, stats), others: [] };
	if (x.kind === 'continuous') return { ...names, main: nestedModelTest(x, y, given, stats), others: [] };
	if (y.kind === 'binary') return { ...names, main: nestedModelTest(y, x, given, stats), others: [] };
	if (x.kind === 'binary') return { ...names, main: nestedModelTest(x, y, given, stats), others: [] };
	throw new StatsError(
		`No test for '${x.name}' and '${y.name}' (both with more than two levels) given a continuous variable; a multinomial model would be needed.`
	);
}
