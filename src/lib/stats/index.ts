/**
 * Public API of the statistics library (the data side of Causeway). Pure TypeScript: no
 * DOM, no Svelte; usable from the browser, a Web Worker and the CLI. Functions that cannot
 * analyse their input throw StatsError with a one-line message; the table readers return
 * `{ ok: false, error }` instead.
 */
export { StatsError } from './errors';
export { own } from './own';
export type { EffectSize, TestResult } from './types';

// Distributions
export {
	normalCdf,
	normalSf,
	normalQuantile,
	normalTwoSidedP,
	tCdf,
	tSf,
	tQuantile,
	tTwoSidedP,
	chiSquareCdf,
	chiSquareSf,
	chiSquareQuantile,
	fCdf,
	fSf,
	fQuantile,
	hypergeometricPmf,
	hypergeometricCdf,
	logGamma
} from './distributions';

// Tables
export type { Column, ColumnKind, CodedColumn, ContinuousColumn, ParseResult, SkippedColumn, Table, TableError, TableFormat } from './table/types';
export { parseTable, parseTableStream, DEFAULT_LEVEL_CAP } from './table/read-table';
export type { ParseOptions, ParseProgress, StreamParseOptions, TableSource } from './table/read-table';
export { DEFAULT_MISSING_TOKENS } from './table/cells';
export { matchColumns, normalizeName } from './table/match-columns';
export type { ColumnMatching } from './table/match-columns';
export { codedColumn, continuousColumn, completeRows, numericValues } from './table/columns';
export { expandGroupedTable, readCounts, suggestCountColumn, COUNT_COLUMN_NAMES, MAX_GROUPED_ROWS } from './table/grouped';

// Association (arrow checks)
export { associate } from './association/associate';
export type { AssociationResult } from './association/associate';
export { crossTabulate, tableFromCounts } from './association/contingency';
export type { ContingencyTable } from './association/contingency';
export { chiSquareTest, gTest, cramersV } from './association/chi-square';
export { fisherExactTest, fisherExactP } from './association/fisher';
export { oddsRatioWoolf } from './association/odds-ratio';
export { pearsonTest, spearmanTest, pointBiserialTest, pearsonR, pairedValues } from './association/correlation';
export { oneWayAnova, kruskalWallis, groupedValues } from './association/group-tests';

// Conditional independence (claim checks)
export { testConditionalIndependence } from './conditional/independence';
export type { IndependenceResult } from './conditional/independence';
export { partialCorrelationTest } from './conditional/partial-correlation';
export { stratify, stratifiedFromCounts, stratifiedGTest, cochranMantelHaenszel } from './conditional/stratified';
export type { StratifiedTables } from './conditional/stratified';
export { nestedModelTest } from './conditional/nested-models';
export { holmAdjust, benjaminiHochbergAdjust } from './conditional/multiplicity';

// Regression
export { buildDesign, designFromArrays, INTERCEPT } from './regression/design';
export type { Design, DesignTerm } from './regression/design';
export { checkCollinearity } from './regression/collinearity';
export type { CollinearityCheck, DroppedColumn } from './regression/collinearity';
export { fitLinear, linearRegression } from './regression/linear';
export type { Coefficient, LinearFit } from './regression/linear';
export { fitLogistic, logisticRegression } from './regression/logistic';
export type { LogisticCoefficient, LogisticFit, LogisticOptions } from './regression/logistic';
export { eventsPerVariable, changeInEstimate } from './regression/checks';
export type { EventsPerVariable, ChangeInEstimate } from './regression/checks';
export { estimateExposureEffect } from './regression/exposure-effect';
export type { EffectEstimate, ExposureEffect } from './regression/exposure-effect';
export { linearRegressionFromSummary, partialCorrelationFromSummary } from './regression/summary-stats';
export type { SummaryStatistics, SummaryRegression } from './regression/summary-stats';

// E-value
export { eValue, eValueOfRiskRatio } from './evalue';
export type { EValueOptions, EValueResult } from './evalue';

// Seeded random numbers
export { createRandom, createRandomFromState } from './random';
export type { Random } from './random';

// The confounder check: per-level odds ratios, stratified odds ratios, standardization
export { levelOddsRatios } from './association/level-odds-ratios';
export type { LevelOddsRatio, LevelOddsRatios } from './association/level-odds-ratios';
export { mantelHaenszel } from './stratified/mantel-haenszel';
export type { MantelHaenszel, TwoByTwo } from './stratified/mantel-haenszel';
export { breslowDay } from './stratified/breslow-day';
export type { BreslowDay } from './stratified/breslow-day';
export { strata2x2 } from './stratified/strata';
export type { Strata2x2 } from './stratified/strata';
export { standardize } from './standardization/g-computation';
export type { MarginalEstimate, Standardization } from './standardization/g-computation';
export { categoryCodeValues, MAX_CODE_VALUES } from './table/category-codes';

// Statistics computed once per table and shared by every check; cooperative cancellation
export { TableStatistics } from './sufficient/table-statistics';
export { Cancelled, interruptWhen, NEVER } from './sufficient/interrupt';
export type { Interrupt } from './sufficient/interrupt';
