/**
 * REFERENCE ONLY (tests): the delimited-text reader as it was before the byte-level scanner
 * (src/lib/stats/table/read-table.ts at commit 6f980f7), kept unchanged so that
 * tests/unit/stats/byte-reader.test.ts can check that the new reader gives the same table on
 * generated files. It parses with PapaParse's core parser on decoded text.
 *
 * The streaming reader keeps only the unparsed tail of the last chunk and one typed array
 * per column (see column-builder.ts), so memory is O(rows × columns × 8 bytes) plus one
 * chunk. Time O(characters). Rows in messages are rows of the file, 1-based, with the
 * header as row 1 (as a spreadsheet numbers them); blank lines are skipped but counted.
 */
import { own } from '../../../../src/lib/stats/own';
import Papa from 'papaparse';
import { StatsError } from '../../../../src/lib/stats/errors';
import { missingTest, trimCell, type MissingTest } from '../../../../src/lib/stats/table/cells';
import { ColumnBuilder } from '../../../../src/lib/stats/table/column-builder';
import { detectDecimalComma, detectDelimiter, detectHeader, detectNewline, looksBinary, type Delimiter, type Newline } from '../../../../src/lib/stats/table/detect';
import type { Column, ColumnKind, ParseResult, SkippedColumn, Table } from '../../../../src/lib/stats/table/types';
import { describeBytes, MAX_TABLE_BYTES, MAX_TABLE_COLUMNS } from '../../../../src/lib/limits';

export interface ParseOptions {
	/** Whether the first row holds column names; detected when omitted. */
	header?: boolean;
	/** Field delimiter; detected (comma, semicolon or tab) when omitted. */
	delimiter?: ',' | ';' | '\t';
	/** Whether numbers use a decimal comma ("3,5"); detected when omitted. */
	decimalComma?: boolean;
	/** Extra cell values read as missing, besides "", NA, ".", NaN and NULL. */
	missingTokens?: readonly string[];
	/** Most levels a text column may have to be read as categorical (default 20). */
	levelCap?: number;
	/** Declared kinds by column name; these override detection. */
	types?: Readonly<Record<string, ColumnKind>>;
	/** Level order of declared ordinal columns, lowest first. */
	levelOrder?: Readonly<Record<string, readonly string[]>>;
}

export interface ParseProgress {
	/** Characters read so far. */
	characters: number;
	/** Data rows read so far. */
	rows: number;
	/** Share of the input read (0…1), when its size is known. */
	fraction: number | null;
}

export interface StreamParseOptions extends ParseOptions {
	/** Called after each chunk. */
	onProgress?: (progress: ParseProgress) => void;
	/** Size of the input in bytes, for `fraction` when the source is not a Blob. */
	totalBytes?: number;
}

export const DEFAULT_LEVEL_CAP = 20;
const SAMPLE_CHARS = 64 * 1024;
const SAMPLE_ROWS = 50;

/** Read a whole delimited text. O(characters). Never throws: errors come back as `{ ok: false }`. */
export function parseTable(text: string, options: ParseOptions = {}): ParseResult {
	try {
		const reader = new TableReader(options, text.length);
		reader.push(text);
		return { ok: true, table: reader.finish() };
	} catch (e) {
		return failure(e);
	}
}

/** A source of text or bytes: a Blob/File, a byte stream, or any (async) iterable of chunks. */
export type TableSource = Blob | ReadableStream<Uint8Array> | AsyncIterable<string | Uint8Array> | Iterable<string | Uint8Array>;

/**
 * Read a delimited text chunk by chunk (usable in a Web Worker: pass `file` or
 * `file.stream()`), reporting progress after each chunk. Holds one chunk and the typed
 * column arrays, never the whole text. Never throws: errors come back as `{ ok: false }`.
 */
export async function parseTableStream(source: TableSource, options: StreamParseOptions = {}): Promise<ParseResult> {
	try {
		const total = typeof Blob !== 'undefined' && source instanceof Blob ? source.size : (options.totalBytes ?? null);
		const reader = new TableReader(options, total);
		let decoder: TextDecoder | null = null;
		let bytes = 0;
		let characters = 0;
		for await (const chunk of chunksOf(source)) {
			let text: string;
			if (typeof chunk === 'string') {
				text = chunk;
				bytes += chunk.length;
			} else {
				decoder ??= new TextDecoder(encodingFromBom(chunk));
				text = decoder.decode(chunk, { stream: true });
				bytes += chunk.byteLength;
			}
			characters += text.length;
			reader.push(text);
			options.onProgress?.({ characters, rows: reader.rowCount, fraction: total ? Math.min(1, bytes / total) : null });
		}
		const tail = decoder?.decode() ?? '';
		if (tail) reader.push(tail);
		const table = reader.finish();
		options.onProgress?.({ characters, rows: table.rowCount, fraction: 1 });
		return { ok: true, table };
	} catch (e) {
		return failure(e);
	}
}

async function* chunksOf(source: TableSource): AsyncGenerator<string | Uint8Array> {
	if (typeof Blob !== 'undefined' && source instanceof Blob) {
		yield* chunksOf(source.stream());
		return;
	}
	if (typeof ReadableStream !== 'undefined' && source instanceof ReadableStream) {
		const reader = source.getReader();
		try {
			for (;;) {
				const { done, value } = await reader.read();
				if (done) return;
				yield value;
			}
		} finally {
			reader.releaseLock();
		}
	}
	yield* source as AsyncIterable<string | Uint8Array> | Iterable<string | Uint8Array>;
}

function failure(e: unknown): ParseResult {
	if (e instanceof StatsError) return { ok: false, error: { message: e.message, row: e.row, column: e.column } };
	const message = e instanceof Error ? e.message.split('\n')[0] : String(e);
	return { ok: false, error: { message: `Could not read the table: ${message}` } };
}

interface PapaChunk {
	data: string[][];
	errors: { type: string; code: string; message: string; row?: number }[];
	meta: { cursor: number };
}

/**
 * The incremental reader: buffers the first 64 kB to detect the format, then parses each
 * chunk with PapaParse's core parser, keeping the incomplete last record for the next
 * chunk (as PapaParse's own chunk streamer does).
 */
class TableReader {
	private readonly isMissing: MissingTest;
	private readonly levelCap: number;
	private pending = '';
	private started = false;
	private parser: Papa.Parser | null = null;
	private baseIndex = 0;
	private delimiter: Delimiter = ',';
	private newline: Newline = '\n';
	private decimalComma = false;
	private header = true;
	private names: string[] = [];
	private builders: ColumnBuilder[] = [];
	private fileRow = 0;
	private dataRows = 0;
	private sawAnyText = false;
	private sampleChars = 0;
	private sampleRecords = 0;
	private pushedChars = 0;
	/** Set once a chunk holds U+FFFD, the decoder's mark for bytes that were not UTF-8. */
	private notUtf8 = false;

	/** Expected input size in characters (bytes, for UTF-8 mostly ASCII), when known. */
	private readonly expectedChars: number | null;

	constructor(
		private readonly options: ParseOptions,
		expectedChars: number | null = null
	) {
		this.isMissing = missingTest(options.missingTokens);
		this.levelCap = options.levelCap ?? DEFAULT_LEVEL_CAP;
		this.expectedChars = expectedChars;
		if (expectedChars !== null && expectedChars > MAX_TABLE_BYTES) throw tooLarge(expectedChars);
	}

	get rowCount(): number {
		return this.dataRows;
	}

	push(text: string): void {
		if (text.length === 0) return;
		this.sawAnyText = true;
		this.pushedChars += text.length;
		if (this.pushedChars > MAX_TABLE_BYTES) throw tooLarge(this.pushedChars);
		if (!this.started) {
			this.pending += text;
			if (this.pending.length >= SAMPLE_CHARS) this.start(false);
			return;
		}
		this.parse(text, false);
	}

	finish(): Table {
		if (!this.started) this.start(true);
		else this.parse('', true);
		if (!this.sawAnyText || this.names.length === 0) throw new StatsError('The file is empty.');
		if (this.dataRows === 0)
			throw new StatsError(this.header ? 'The file has a header row but no data rows.' : 'The file has no data rows.');
		const columns: Column[] = [];
		const skipped: SkippedColumn[] = [];
		const notes = this.formatNotes();
		this.builders.forEach((b, j) => {
			const built = b.finish();
			if ('skipped' in built) skipped.push({ name: this.names[j], position: j + 1, message: built.skipped });
			else {
				columns.push(built.column);
				notes.push(...built.notes);
			}
		});
		for (const s of skipped) notes.push(s.message);
		return {
			columns,
			rowCount: this.dataRows,
			skipped,
			format: { delimiter: this.delimiter, decimalComma: this.decimalComma, header: this.header },
			notes
		};
	}

	/** Detect the format on the buffered sample, read the header, and parse the buffer. */
	private start(final: boolean): void {
		this.started = true;
		let text = this.pending;
		this.pending = '';
		if (text.charCodeAt(0) === 0xfeff) text = text.slice(1); // byte-order mark
		if (looksBinary(text) && !looksMisdecoded(text))
			throw new StatsError('The file looks like binary data (for example a spreadsheet workbook), not delimited text; save it as CSV first.');
		if (text.trim() === '') throw new StatsError('The file is empty.');
		const sample = text.slice(0, SAMPLE_CHARS);
		this.newline = detectNewline(sample);
		this.delimiter = this.options.delimiter ?? detectDelimiter(sample);
		this.parser = new Papa.Parser({ delimiter: this.delimiter, newline: this.newline, quoteChar: '"' });
		const sampleRows = (Papa.parse<string[]>(sample, { delimiter: this.delimiter, newline: this.newline, preview: SAMPLE_ROWS + 1, skipEmptyLines: true }).data ?? []).filter((r) => r.length > 0);
		this.decimalComma = this.options.decimalComma ?? detectDecimalComma(sampleRows.slice(1), this.delimiter);
		this.header = this.options.header ?? detectHeader(sampleRows, this.decimalComma, this.isMissing);
		this.sampleChars = sample.length;
		this.sampleRecords = sample.split(this.newline).length - 1;
		this.parse(text, final);
	}

	/**
	 * Initial column capacity: the expected row count (input size / mean sampled record
	 * length, plus 5 %) when the input size is known, so the arrays rarely grow; else 1024.
	 */
	private initialCapacity(): number {
		if (this.expectedChars === null || this.sampleRecords === 0) return 1024;
		const perRecord = this.sampleChars / this.sampleRecords;
		return Math.min(2 ** 28, Math.max(16, Math.ceil((1.05 * this.expectedChars) / perRecord)));
	}

	private parse(text: string, final: boolean): void {
		const parser = this.parser as Papa.Parser;
		const aggregate = this.pending + text;
		if (!this.notUtf8 && aggregate.includes('\uFFFD')) this.notUtf8 = true;
		this.pending = '';
		const result = parser.parse(aggregate, this.baseIndex, !final) as PapaChunk;
		if (result.errors.length > 0) {
			const err = result.errors[0];
			const row = this.fileRow + (err.row ?? 0) + 1;
			throw new StatsError(`Row ${row}: ${err.code === 'MissingQuotes' ? 'a quoted field is never closed' : err.message}.`, { row });
		}
		if (!final) {
			const cursor = result.meta.cursor;
			this.pending = aggregate.substring(cursor - this.baseIndex);
			this.baseIndex = cursor;
		}
		for (const record of result.data) this.record(record);
	}

	private record(fields: string[]): void {
		this.fileRow++;
		if (fields.length === 1 && fields[0].trim() === '') return; // blank line
		if (this.notUtf8 && fields.some((f) => f.includes('\uFFFD')))
			throw new StatsError(
				`Row ${this.fileRow} holds bytes that are not UTF-8 text (the file may be in Latin-1 or Windows-1252); save it as CSV UTF-8 and open it again.`,
				{ row: this.fileRow }
			);
		if (this.names.length === 0) {
			this.setColumns(fields);
			if (this.header) return;
		}
		if (fields.length !== this.names.length)
			throw new StatsError(
				`Row ${this.fileRow} has ${fields.length} field${fields.length === 1 ? '' : 's'} but the ${this.header ? 'header has' : 'first row has'} ${this.names.length}.`,
				{ row: this.fileRow }
			);
		this.dataRows++;
		for (let j = 0; j < fields.length; j++) this.builders[j].push(fields[j], this.fileRow);
	}

	private setColumns(first: string[]): void {
		if (first.length > MAX_TABLE_COLUMNS)
			throw new StatsError(`Row ${this.fileRow} has ${first.length} columns; Causeway reads data files of at most ${MAX_TABLE_COLUMNS} columns.`, { row: this.fileRow });
		if (first.length < 2)
			throw new StatsError(
				`Only one column was found (delimiter ${describe(this.delimiter)}); the file must be comma-, semicolon- or tab-separated with at least two columns.`
			);
		const names = this.header ? first.map((f, j) => trimCell(f) || `column${j + 1}`) : first.map((_, j) => `V${j + 1}`);
		const seen = new Map<string, number>();
		names.forEach((name, j) => {
			const earlier = seen.get(name);
			if (earlier !== undefined)
				throw new StatsError(`Duplicate column name '${name}' (columns ${earlier + 1} and ${j + 1}).`, { row: 1, column: name });
			seen.set(name, j);
		});
		for (const name of Object.keys(this.options.types ?? {}))
			if (!seen.has(name)) throw new StatsError(`A type is declared for column '${name}', which is not in the file.`, { column: name });
		this.names = names;
		this.builders = names.map(
			(name, j) =>
				new ColumnBuilder(
					{
						name,
						position: j + 1,
						declared: own(this.options.types, name),
						levelOrder: own(this.options.levelOrder, name),
						levelCap: this.levelCap,
						decimalComma: this.decimalComma,
						isMissing: this.isMissing
					},
					this.initialCapacity()
				)
		);
	}

	private formatNotes(): string[] {
		const notes = [`Delimiter: ${describe(this.delimiter)}${this.options.delimiter ? ' (given)' : ' (detected)'}.`];
		if (this.decimalComma) notes.push(`Numbers use a decimal comma${this.options.decimalComma ? ' (given)' : ' (detected)'}.`);
		notes.push(this.header ? 'First row read as column names.' : 'No header row; columns named V1, V2, …');
		return notes;
	}
}

/** Text (not binary) whose only damage is U+FFFD from decoding non-UTF-8 bytes: no NUL, no ZIP signature. */
function looksMisdecoded(text: string): boolean {
	const head = text.slice(0, 4096);
	return head.includes('\uFFFD') && !head.includes('\u0000') && !head.startsWith('PK\u0003\u0004');
}

/** The encoding a byte-order mark names (UTF-16 files from Windows tools); UTF-8 otherwise. */
function encodingFromBom(bytes: Uint8Array): 'utf-8' | 'utf-16le' | 'utf-16be' {
	if (bytes[0] === 0xff && bytes[1] === 0xfe) return 'utf-16le';
	if (bytes[0] === 0xfe && bytes[1] === 0xff) return 'utf-16be';
	return 'utf-8';
}

function tooLarge(size: number): StatsError {
	return new StatsError(`The data file is too large (${describeBytes(size)} or more); Causeway reads data files of at most ${describeBytes(MAX_TABLE_BYTES)}.`);
}

function describe(d: Delimiter): string {
	return d === '\t' ? 'tab' : d === ';' ? 'semicolon' : 'comma';
}
