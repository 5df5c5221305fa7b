/**
 * Parquet files read directly (hyparquet, with hyparquet-compressors for Snappy, Gzip, Zstd,
 * Brotli and LZ4): what a warehouse exports (DuckDB's COPY … TO 'x.parquet', Spark's
 * write.parquet) without a detour through CSV. Each column's values go through the CSV
 * reader's own ColumnBuilder as cells, so kinds, levels, missing values, the level cap and
 * every message are those of the same data as CSV. Columns are decoded one at a time, so
 * memory is the typed columns plus one decoded column. O(cells).
 *
 * A library rather than our own decoder: Parquet's encodings (dictionary, RLE/bit-packing,
 * delta, byte-stream split) and codecs are a large format; hyparquet is small, pure
 * JavaScript, works in a Web Worker and in Node, and is maintained.
 */
import { parquetMetadataAsync, parquetRead, type AsyncBuffer, type ColumnData, type FileMetaData } from 'hyparquet';
import { compressors } from 'hyparquet-compressors';
import { StatsError } from '../errors';
import { missingTest } from './cells';
import { ColumnBuilder } from './column-builder';
import { DEFAULT_LEVEL_CAP } from './read-table';
import type { Column, ParseResult, SkippedColumn, Table } from './types';
import { describeCount, MAX_TABLE_COLUMNS } from '../../limits';
import type { ParquetBytes } from './parquet-bytes';

export { blobBytes, isParquetMagic, type ParquetBytes } from './parquet-bytes';

/** Most rows read from a Parquet file: as many as a grouped table may stand for (grouped.ts). */
export const MAX_PARQUET_ROWS = 10_000_000;

/** A value as the CSV cell that would hold it (hyparquet has already applied the logical types). */
function cellText(value: unknown): string | null {
	if (value === null || value === undefined) return '';
	if (typeof value === 'number') return Number.isNaN(value) ? '' : String(value);
	if (typeof value === 'string') return value;
	if (typeof value === 'bigint') return value.toString();
	if (typeof value === 'boolean') return value ? 'true' : 'false';
	if (value instanceof Date) return value.toISOString();
	return null;
}

/** The file's flat top-level columns; nested ones (lists, structs, maps) are left out with a message. */
function flatColumns(metadata: FileMetaData): { names: string[]; nested: string[] } {
	const names: string[] = [];
	const nested: string[] = [];
	const schema = metadata.schema;
	let i = 1;
	const skip = (at: number): number => {
		let next = at + 1;
		for (let c = 0; c < (schema[at].num_children ?? 0); c++) next = skip(next);
		return next;
	};
	while (i < schema.length) {
		const el = schema[i];
		if ((el.num_children ?? 0) > 0 || el.repetition_type === 'REPEATED') nested.push(el.name);
		else names.push(el.name);
		i = skip(i);
	}
	return { names, nested };
}

/** Reads a Parquet file into typed columns. Never throws: errors come back as `{ ok: false }`. */
export async function parseParquet(file: ParquetBytes): Promise<ParseResult> {
	try {
		return { ok: true, table: await readParquet(file) };
	} catch (e) {
		if (e instanceof StatsError) return { ok: false, error: { message: e.message, row: e.row, column: e.column } };
		const message = e instanceof Error ? e.message.split('\n')[0] : String(e);
		return { ok: false, error: { message: `Could not read the Parquet file: ${message}` } };
	}
}

async function readParquet(file: ParquetBytes): Promise<Table> {
	const metadata = await parquetMetadataAsync(file);
	const rows = Number(metadata.num_rows);
	const { names, nested } = flatColumns(metadata);
	if (names.length === 0) throw new StatsError('The Parquet file has no columns of plain values.');
	if (names.length > MAX_TABLE_COLUMNS) throw new StatsError(`The Parquet file has ${names.length} columns; Causeway reads at most ${MAX_TABLE_COLUMNS}.`);
	if (rows === 0) throw new StatsError('The Parquet file has no rows.');
	if (rows > MAX_PARQUET_ROWS) throw new StatsError(`The Parquet file has ${describeCount(rows)} rows; Causeway reads at most ${describeCount(MAX_PARQUET_ROWS)} (summarize it first: see --sql).`);
	const isMissing = missingTest();
	const columns: Column[] = [];
	const skipped: SkippedColumn[] = nested.map((name) => ({ name, position: 0, message: `Column '${name}' holds nested values (a list, map or struct) and is left out.` }));
	const notes = [`Parquet file: ${describeCount(rows)} rows, ${names.length} columns.`];
	for (const [j, name] of names.entries()) {
		const chunks: ColumnData[] = [];
		await parquetRead({ file, metadata, columns: [name], compressors, onChunk: (chunk) => chunks.push(chunk) });
		chunks.sort((a, b) => a.rowStart - b.rowStart);
		const builder = new ColumnBuilder({ name, position: j + 1, declared: undefined, levelOrder: undefined, levelCap: DEFAULT_LEVEL_CAP, decimalComma: false, isMissing }, rows);
		let next = 0;
		for (const chunk of chunks) {
			const data = chunk.columnData;
			for (let k = Math.max(0, next - chunk.rowStart); k < data.length && chunk.rowStart + k < rows; k++) {
				const text = cellText(data[k]);
				const row = chunk.rowStart + k + 2; // as the CSV reader numbers rows: the header is row 1
				if (text === null) throw new StatsError(`Row ${row}, column '${name}': a value of a type Causeway does not read (binary or nested).`, { row, column: name });
				builder.push(text, row);
			}
			next = Math.max(next, chunk.rowStart + data.length);
		}
		if (next < rows) throw new StatsError(`Column '${name}' has ${next} values for ${rows} rows.`, { column: name });
		const built = builder.finish();
		if ('skipped' in built) {
			skipped.push({ name, position: j + 1, message: built.skipped });
			notes.push(built.skipped);
		} else {
			columns.push(built.column);
			notes.push(...built.notes);
		}
	}
	for (const s of skipped.filter((s) => s.position === 0)) notes.push(s.message);
	return { columns, rowCount: rows, skipped, format: { delimiter: ',', decimalComma: false, header: true }, notes };
}
