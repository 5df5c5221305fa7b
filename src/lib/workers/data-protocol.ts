/** The data worker's jobs (job-runner.ts): what the page asks, the progress and the results. Plain data (structured clone). */
import type { Diagram } from '../graph/diagram';
import type { ParseProgress, TableError } from '../stats';
import type { DataCheckProgress, DataCheckReport, TableInfo } from '../datacheck';

export type { ColumnInfo, TableInfo } from '../datacheck';

/** The parts of a report, in the order the worker computes them (quick ones first). */
export type DataPart = 'arrows' | 'estimates' | 'claims';

/** `count`: the file is a grouped table whose lines stand for that column's number of rows (stats/table/grouped.ts). */
export type DataSource = { kind: 'file'; file: File; count?: string } | { kind: 'url'; url: string; name: string };

export type DataJob = { kind: 'load'; source: DataSource } | { kind: 'check'; diagram: Diagram; planned?: string[] };

export type DataProgress =
	| { kind: 'load-progress'; progress: ParseProgress }
	| { kind: 'check-progress'; progress: DataCheckProgress }
	/** The report so far, while `pending` parts are still being computed. */
	| { kind: 'partial'; report: DataCheckReport; pending: DataPart[] };

export type DataResult = { kind: 'loaded'; info: TableInfo } | { kind: 'load-failed'; error: TableError } | { kind: 'report'; report: DataCheckReport };
