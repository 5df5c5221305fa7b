/**
 * Data that never leave their warehouse: the SQL that summarizes a table where it lives for
 * the current diagram's checks (grouped counts, or sums and cross-products), in the dialects
 * of DuckDB, PostgreSQL and Spark SQL, and the reading back of the moments. Grouped counts
 * are read back as a grouped table (stats/table/grouped.ts). Pure TypeScript.
 */
export { DIALECTS, parseSqlTarget, quoteIdentifier, quoteTable, type Dialect } from './dialect';
export { summaryPlan, type PlanInput, type SummaryColumn, type SummaryPlan } from './plan';
export { groupedCountsSql, momentsSql } from './queries';
export { isMomentsText, readMoments } from './moments';
