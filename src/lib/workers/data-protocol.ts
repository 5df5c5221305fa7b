/** Messages between the app and the data worker. Plain data (structured clone). */
import type { Diagram } from '../graph/diagram';
import type { ParseProgress, TableError } from '../stats';
import type { DataCheckProgress, DataCheckReport, TableInfo } from '../datacheck';

export type { ColumnInfo, TableInfo } from '../datacheck';

/** The parts of a report, in the order the worker computes them (quick ones first). */
export type DataPart = 'arrows' | 'estimates' | 'claims';

/** `count`: the file is a grouped table whose lines stand for that column's number of rows (stats/table/grouped.ts). */
export type DataSource = { kind: 'file'; file: File; count?: string } | { kind: 'url'; url: string; name: string };

export type DataRequest =
	| { id: number; kind: 'load'; source: DataSource }
	| { id: number; kind: 'check'; diagram: Diagram; planned?: string[] }
	/** Stop the check with this id (between two checks, or inside a long one). */
	| { id: number; kind: 'cancel' };

export type DataReply =
	| { id: number; kind: 'load-progress'; progress: ParseProgress }
	| { id: number; kind: 'loaded'; info: TableInfo; ms: number }
	| { id: number; kind: 'load-failed'; error: TableError }
	| { id: number; kind: 'check-progress'; progress: DataCheckProgress }
	| { id: number; kind: 'partial'; report: DataCheckReport; pending: DataPart[] }
	| { id: number; kind: 'report'; report: DataCheckReport; ms: number }
	| { id: number; kind: 'check-failed'; message: string }
	| { id: number; kind: 'check-cancelled' };
