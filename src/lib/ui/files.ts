/** Browser file plumbing: saving text as a download and reading a chosen or dropped file. */
import { InputError } from '../graph/errors';
import { downloadBlob } from './export/download';
import { decodeTextFile } from '../graph/text-decoding';
import { describeBytes, MAX_DIAGRAM_CHARS } from '../limits';

/** Offers `text` as a file download (a blob: URL, so nothing leaves the machine). */
export function downloadText(name: string, text: string, type: string): void {
	downloadBlob(name, new Blob([text], { type }));
}

/** A file name from the diagram title: "Cycling and BP" → "cycling-and-bp". */
export function fileStem(title: string): string {
	const stem = title
		.normalize('NFKC')
		.toLowerCase()
		.split(/[^\p{L}\p{N}]+/u)
		.filter(Boolean)
		.join('-')
		.slice(0, 60);
	return stem || 'diagram';
}

/** Files larger than this are refused before reading (src/lib/limits.ts). */
export const MAX_FILE_BYTES = MAX_DIAGRAM_CHARS;

/**
 * The text of a chosen or dropped diagram file. Binary files and bytes that are not UTF-8
 * (or UTF-16 after a byte-order mark) are refused with an InputError naming the file and the
 * first bad byte, rather than read with replacement characters.
 */
export async function readFileText(file: File): Promise<string> {
	if (file.size > MAX_FILE_BYTES) throw new InputError(`${file.name}: The file is too large: ${describeBytes(file.size)}, but a diagram file may have at most ${describeBytes(MAX_FILE_BYTES)}`);
	try {
		return decodeTextFile(new Uint8Array(await file.arrayBuffer()));
	} catch (e) {
		if (e instanceof InputError) throw new InputError(`${file.name}: ${e.message}`, e.where);
		throw e;
	}
}
