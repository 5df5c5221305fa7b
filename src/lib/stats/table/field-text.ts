/**
 * A field's bytes as text (for headers, text cells and anything the byte-level number path
 * does not read), with `""` unescaped in quoted fields. Bytes that are not UTF-8 (a file
 * saved as Latin-1 or Windows-1252) become U+FFFD when decoded, which is refused with the
 * row, as the reader did when it decoded the whole file first. O(length).
 */
import { StatsError } from '../errors';
import { ESCAPED } from './csv-scanner';

// ignoreBOM: a U+FEFF inside the file is kept as text, as when the whole file was decoded at once.
const decoder = new TextDecoder('utf-8', { ignoreBOM: true });

export function notUtf8(row: number): StatsError {
	return new StatsError(
		`Row ${row} holds bytes that are not UTF-8 text (the file may be in Latin-1 or Windows-1252); save it as CSV UTF-8 and open it again.`,
		{ row }
	);
}

/** Whether bytes[start, end) are all ASCII. */
export function isAscii(bytes: Uint8Array, start: number, end: number): boolean {
	for (let i = start; i < end; i++) if (bytes[i] >= 0x80) return false;
	return true;
}

export function fieldText(bytes: Uint8Array, start: number, end: number, flags: number, row: number): string {
	let s: string;
	if (end - start <= 64 && isAscii(bytes, start, end)) s = String.fromCharCode.apply(null, bytes.subarray(start, end) as unknown as number[]);
	else {
		s = decoder.decode(bytes.subarray(start, end));
		if (s.includes('\uFFFD')) throw notUtf8(row);
	}
	return flags & ESCAPED ? s.replaceAll('""', '"') : s;
}
