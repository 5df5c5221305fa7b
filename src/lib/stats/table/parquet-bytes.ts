/**
 * Telling a Parquet file by its first bytes, and a Blob as the reader's byte source: kept apart
 * from read-parquet.ts so that the page and the command can check a file without loading the
 * Parquet reader and its decompressors: hyparquet-compressors compiles WebAssembly as soon as it
 * is loaded (and the page's script policy allows that only as 'wasm-unsafe-eval'), so the
 * reader is imported on demand, in the data worker or the `data` commands, for a Parquet file.
 */
import type { AsyncBuffer } from 'hyparquet';

/** A Parquet file's bytes, read by range: a File/Blob, or a file on disk (the CLI). */
export type ParquetBytes = AsyncBuffer;

/** Whether bytes start with Parquet's magic number "PAR1". */
export function isParquetMagic(head: Uint8Array): boolean {
	return head.length >= 4 && head[0] === 0x50 && head[1] === 0x41 && head[2] === 0x52 && head[3] === 0x31;
}

/** A Blob (a File in the browser) as hyparquet's byte source. */
export function blobBytes(blob: Blob): ParquetBytes {
	return { byteLength: blob.size, slice: (start, end) => blob.slice(start, end).arrayBuffer() };
}
