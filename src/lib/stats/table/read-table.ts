/**
 * Delimited-text reader: `parseTable` for a whole string, `parseTableStream` for chunks
 * (a File's stream in a Web Worker, or any async source). The bytes are split into fields by
 * a byte-level scanner (csv-scanner.ts; why it is hand-written is measured there) and each
 * field goes straight into its column's typed array (column-builder.ts): plain numbers are
 * read from the bytes, other cells are decoded to text one by one. The format (delimiter,
 * line break, decimal comma, header) is detected on the first 64 K characters, as before.
 *
 * The streaming reader keeps only the unscanned tail of the last chunk and one typed array
 * per column, so memory is O(rows × columns × 8 bytes) plus one chunk. Time O(bytes). Rows in
 * messages are rows of the file, 1-based, with the header as row 1 (as a spreadsheet numbers
 * them); blank lines are skipped but counted. When a file has several problems the first one
 * in the file is named.
 */
import { own } from '../own';
import Papa from 'papaparse';
import { StatsError } from '../errors';
import { missingTest, trimCell, type MissingTest } from './cells';
import { ColumnBuilder } from './column-builder';
import { CsvScanner, ScanError, type ScannedRecord } from './csv-scanner';
import { detectDecimalComma, detectDelimiter, detectHeader, detectNewline, looksBinary, type Delimiter, type Newline } from './detect';
import { fieldText, isAscii, notUtf8 } from './field-text';
import type { Column, ColumnKind, ParseResult, SkippedColumn, Table } from './types';
import { describeBytes, MAX_TABLE_BYTES, MAX_TABLE_COLUMNS } from '../../limits';

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
	/** Bytes read so far (characters, for text chunks). */
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
/** Bytes gathered before the format is detected: enough for SAMPLE_CHARS characters of up to 4 bytes. */
const SAMPLE_BYTES = 4 * SAMPLE_CHARS;
/** Bytes of a new chunk joined to the last chunk's cut record (to finish it without copying the chunk). */
const BRIDGE = 16 * 1024;
const SAMPLE_ROWS = 50;

/** Read a whole delimited text. O(characters). Never throws: errors come back as `{ ok: false }`. */
export function parseTable(text: string, options: ParseOptions = {}): ParseResult {
	try {
		const reader = new TableReader(options, text.length);
		reader.push(new TextEncoder().encode(text));
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
 * column arrays, never the whole text. UTF-16 files (with a byte-order mark, as Windows
 * tools write them) and text chunks are turned into UTF-8 on the way. Never throws: errors
 * come back as `{ ok: false }`.
 */
export async function parseTableStream(source: TableSource, options: StreamParseOptions = {}): Promise<ParseResult> {
	try {
		const total = typeof Blob !== 'undefined' && source instanceof Blob ? source.size : (options.totalBytes ?? null);
		const reader = new TableReader(options, total);
		const utf8 = new Utf8Chunks();
		let bytes = 0;
		for await (const chunk of chunksOf(source)) {
			bytes += typeof chunk === 'string' ? chunk.length : chunk.byteLength;
			reader.push(utf8.next(chunk));
			options.onProgress?.({ characters: bytes, rows: reader.rowCount, fraction: total ? Math.min(1, bytes / total) : null });
		}
		reader.push(utf8.end());
		const table = reader.finish();
		options.onProgress?.({ characters: bytes, rows: table.rowCount, fraction: 1 });
		return { ok: true, table };
	} catch (e) {
		return failure(e);
	}
}

/**
 * Chunks as UTF-8 bytes: UTF-8 bytes pass through; UTF-16 (named by a byte-order mark in the
 * first chunk) is decoded and re-encoded; text chunks are encoded, a surrogate pair cut
 * between two chunks kept whole.
 */
class Utf8Chunks {
	private decoder: TextDecoder | null = null;
	private first = true;
	private highSurrogate = '';
	private readonly encoder = new TextEncoder();

	next(chunk: string | Uint8Array): Uint8Array {
		if (typeof chunk !== 'string') {
			if (this.first) {
				this.first = false;
				const utf16 = chunk[0] === 0xff && chunk[1] === 0xfe ? 'utf-16le' : chunk[0] === 0xfe && chunk[1] === 0xff ? 'utf-16be' : null;
				if (utf16) this.decoder = new TextDecoder(utf16);
			}
			return this.decoder ? this.text(this.decoder.decode(chunk, { stream: true })) : chunk;
		}
		this.first = false;
		return this.text(chunk);
	}

	end(): Uint8Array {
		return this.text(this.decoder?.decode() ?? '', true);
	}

	private text(s: string, last = false): Uint8Array {
		let t = this.highSurrogate + s;
		this.highSurrogate = '';
		const c = t.charCodeAt(t.length - 1);
		if (!last && c >= 0xd800 && c <= 0xdbff) {
			this.highSurrogate = t.slice(-1);
			t = t.slice(0, -1);
		}
		return this.encoder.encode(t);
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

function concat(a: Uint8Array, b: Uint8Array): Uint8Array {
	if (a.length === 0) return b;
	if (b.length === 0) return a;
	const out = new Uint8Array(a.length + b.length);
	out.set(a);
	out.set(b, a.length);
	return out;
}

/**
 * The incremental reader: gathers the first 256 KiB to detect the format, then scans each
 * chunk, keeping the incomplete last record for the next one.
 */
class TableReader {
	private readonly isMissing: MissingTest;
	private readonly levelCap: number;
	/** Bytes not scanned yet: the sample before the format is known, then an incomplete record. */
	private pending: Uint8Array = new Uint8Array(0);
	private scanner: CsvScanner | null = null;
	private delimiter: Delimiter = ',';
	private newline: Newline = '\n';
	private decimalComma = false;
	private header = true;
	private names: string[] = [];
	private builders: ColumnBuilder[] = [];
	private fileRow = 0;
	private dataRows = 0;
	private sawAnyBytes = false;
	private sampleChars = 0;
	private sampleRecords = 0;
	private pushedBytes = 0;
	private readonly onRecord = (r: ScannedRecord) => this.record(r);

	/** Expected input size in bytes, when known. */
	private readonly expectedBytes: number | null;

	constructor(
		private readonly options: ParseOptions,
		expectedBytes: number | null = null
	) {
		this.isMissing = missingTest(options.missingTokens);
		this.levelCap = options.levelCap ?? DEFAULT_LEVEL_CAP;
		this.expectedBytes = expectedBytes;
		if (expectedBytes !== null && expectedBytes > MAX_TABLE_BYTES) throw tooLarge(expectedBytes);
	}

	get rowCount(): number {
		return this.dataRows;
	}

	push(bytes: Uint8Array): void {
		if (bytes.length === 0) return;
		this.sawAnyBytes = true;
		this.pushedBytes += bytes.length;
		if (this.pushedBytes > MAX_TABLE_BYTES) throw tooLarge(this.pushedBytes);
		if (!this.scanner) {
			this.pending = concat(this.pending, bytes);
			if (this.pending.length >= SAMPLE_BYTES) {
				this.start();
				this.scanPending(false);
			}
			return;
		}
		const tail = this.pending;
		if (tail.length > 0 && bytes.length > 4 * BRIDGE) {
			// Finish the record cut at the last chunk's end on a short bridge, then scan this
			// chunk where it lies (no copy of the chunk).
			const rest = this.scanBuffer(concat(tail, bytes.subarray(0, BRIDGE)), 0, false);
			if (rest >= tail.length) {
				const from = rest - tail.length;
				this.pending = this.keep(bytes, this.scanBuffer(bytes, from, false));
				return;
			}
			// The record goes on past the bridge: no record was completed; scan it all.
		}
		this.pending = concat(tail, bytes);
		this.scanPending(false);
	}

	finish(): Table {
		if (!this.scanner) this.start();
		this.scanPending(true);
		if (!this.sawAnyBytes || this.names.length === 0) throw new StatsError('The file is empty.');
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

	/** Detect the format on the gathered sample and read the header. */
	private start(): void {
		let bytes = this.pending;
		if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) bytes = bytes.subarray(3); // byte-order mark
		this.pending = bytes;
		const text = new TextDecoder('utf-8', { ignoreBOM: true }).decode(bytes.subarray(0, SAMPLE_BYTES), { stream: true });
		if (looksBinary(text) && !looksMisdecoded(text))
			throw new StatsError('The file looks like binary data (for example a spreadsheet workbook), not delimited text; save it as CSV first.');
		if (text.trim() === '') throw new StatsError('The file is empty.');
		const sample = text.slice(0, SAMPLE_CHARS);
		this.newline = detectNewline(sample);
		this.delimiter = this.options.delimiter ?? detectDelimiter(sample);
		this.scanner = new CsvScanner(this.delimiter.charCodeAt(0), this.newline);
		const sampleRows = (Papa.parse<string[]>(sample, { delimiter: this.delimiter, newline: this.newline, preview: SAMPLE_ROWS + 1, skipEmptyLines: true }).data ?? []).filter((r) => r.length > 0);
		this.decimalComma = this.options.decimalComma ?? detectDecimalComma(sampleRows.slice(1), this.delimiter);
		this.header = this.options.header ?? detectHeader(sampleRows, this.decimalComma, this.isMissing);
		this.sampleChars = sample.length;
		this.sampleRecords = sample.split(this.newline).length - 1;
	}

	/**
	 * Initial column capacity: the expected row count (input size / mean sampled record
	 * length, plus 5 %) when the input size is known, so the arrays rarely grow; else 1024.
	 */
	private initialCapacity(): number {
		if (this.expectedBytes === null || this.sampleRecords === 0) return 1024;
		const perRecord = this.sampleChars / this.sampleRecords;
		return Math.min(2 ** 28, Math.max(16, Math.ceil((1.05 * this.expectedBytes) / perRecord)));
	}

	private scanPending(final: boolean): void {
		this.pending = this.keep(this.pending, this.scanBuffer(this.pending, 0, final));
	}

	/** The unscanned rest of `buffer`, copied so that the chunk it lies in is not held. */
	private keep(buffer: Uint8Array, rest: number): Uint8Array {
		return rest >= buffer.length ? new Uint8Array(0) : buffer.slice(rest);
	}

	/** Scans complete records of buffer[from…]; returns where the incomplete rest starts. */
	private scanBuffer(buffer: Uint8Array, from: number, final: boolean): number {
		try {
			return (this.scanner as CsvScanner).scan(buffer, from, final, this.onRecord);
		} catch (e) {
			if (!(e instanceof ScanError)) throw e;
			const row = e.record;
			throw new StatsError(`Row ${row}: ${e.kind === 'unclosed' ? 'a quoted field is never closed' : 'Trailing quote on quoted field is malformed'}.`, { row });
		}
	}

	private record(r: ScannedRecord): void {
		const row = ++this.fileRow;
		const { bytes, starts, ends, flags, count } = r;
		if (count === 1 && (starts[0] === ends[0] || fieldText(bytes, starts[0], ends[0], flags[0], row).trim() === '')) return; // blank line
		if (this.names.length === 0) {
			this.setColumns(count, (j) => fieldText(bytes, starts[j], ends[j], flags[j], row));
			if (this.header) return;
		}
		if (count !== this.names.length) {
			for (let j = 0; j < Math.min(count, starts.length); j++) if (!isAscii(bytes, starts[j], ends[j])) fieldText(bytes, starts[j], ends[j], flags[j], row);
			throw new StatsError(
				`Row ${row} has ${count} field${count === 1 ? '' : 's'} but the ${this.header ? 'header has' : 'first row has'} ${this.names.length}.`,
				{ row }
			);
		}
		this.dataRows++;
		const builders = this.builders;
		for (let j = 0; j < count; j++) builders[j].pushBytes(bytes, starts[j], ends[j], flags[j], row);
	}

	private setColumns(count: number, field: (j: number) => string): void {
		if (count > MAX_TABLE_COLUMNS)
			throw new StatsError(`Row ${this.fileRow} has ${count} columns; Causeway reads data files of at most ${MAX_TABLE_COLUMNS} columns.`, { row: this.fileRow });
		const first = Array.from({ length: count }, (_, j) => field(j));
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
		const extraMissing = (this.options.missingTokens ?? []).length > 0;
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
						isMissing: this.isMissing,
						extraMissing
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

function tooLarge(size: number): StatsError {
	return new StatsError(`The data file is too large (${describeBytes(size)} or more); Causeway reads data files of at most ${describeBytes(MAX_TABLE_BYTES)}.`);
}

function describe(d: Delimiter): string {
	return d === '\t' ? 'tab' : d === ';' ? 'semicolon' : 'comma';
}
