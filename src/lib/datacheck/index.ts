/**
 * Public API of the data checks (pure TypeScript, no DOM: browser, worker, CLI, benchmarks).
 * Entry point: runDataChecks(diagram, table, options) for a parsed table (parseTable /
 * parseTableStream from src/lib/stats), runSummaryChecks(diagram, summary) for a
 * correlation or covariance matrix (parseSummaryMatrix).
 */
export { runDataChecks, runDataChecksAsync, dataCheckSteps, prepareTable } from './run';
export type { DataCheckOptions, DataCheckProgress } from './run';
export { runSummaryChecks, parseSummaryMatrix } from './summary';
export type { SummaryCheckOptions } from './summary';
export { mapVariables, dataDiagram } from './mapping';
export { retypeColumn, retypeTable, applyLevels, kindProblem } from './retype';
export type { LevelSettings, ColumnShape } from './retype';
export { applyDataSettings, settingsMapping, SETTINGS_WHERE } from './settings';
export { checkArrows, associationStrength, supportOf, SMALL_STRENGTH, DEFAULT_ALPHA } from './arrow-checks';
export { checkClaims, suggestedArrows } from './claim-checks';
export { estimateEffects, rowLabel, braces } from './estimates';
export { pictureData } from './pictures';
export type { PictureData, BarsPicture, ScatterPicture, BoxPicture, BoxStats } from './pictures';
export type * from './types';
export { describeTable, columnInfo } from './table-info';
export type { ColumnInfo, TableInfo } from './table-info';
export { rematchDifferences } from './rematch';
export type { Rematch } from './rematch';
export { dataView } from './data-view';
export type { DataView } from './data-view';
