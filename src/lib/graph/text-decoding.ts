/**
 * Bytes of a diagram file → text, refusing what is not text instead of guessing: a file
 * with NUL bytes is binary (or UTF-16 without a byte-order mark), and bytes that are not
 * UTF-8 are named by line and column, because decoding them leniently would silently put
 * U+FFFD replacement characters into labels that the next save would write back for good.
 * A byte-order mark chooses UTF-8, UTF-16LE or UTF-16BE, as Windows editors write them.
 *
 * TextDecoder (WHATWG Encoding) does the decoding in the browser, workers and Node alike; its
 * `fatal` mode says that the bytes are not UTF-8 but not where, so the first bad byte is found
 * by the scan in firstInvalidUtf8 (RFC 3629, §4 syntax), O(bytes).
 */
import { describePosition, InputError, lineColumn } from './errors';

/** Offset of the first byte that does not belong to well-formed UTF-8 (RFC 3629), or -1. */
export function firstInvalidUtf8(bytes: Uint8Array): number {
	let i = 0;
	const n = bytes.length;
	while (i < n) {
		const b = bytes[i];
		if (b < 0x80) {
			i++;
			continue;
		}
		let need: number;
		let min: number; // smallest second byte
		let max: number; // largest second byte
		if (b >= 0xc2 && b <= 0xdf) [need, min, max] = [1, 0x80, 0xbf];
		else if (b === 0xe0) [need, min, max] = [2, 0xa0, 0xbf]; // no overlong forms
		else if (b === 0xed) [need, min, max] = [2, 0x80, 0x9f]; // no surrogates
		else if (b >= 0xe1 && b <= 0xef) [need, min, max] = [2, 0x80, 0xbf];
		else if (b === 0xf0) [need, min, max] = [3, 0x90, 0xbf];
		else if (b === 0xf4) [need, min, max] = [3, 0x80, 0x8f]; // nothing above U+10FFFF
		else if (b >= 0xf1 && b <= 0xf3) [need, min, max] = [3, 0x80, 0xbf];
		else return i;
		if (i + need >= n) return i; // cut short by the end of the file
		const second = bytes[i + 1];
		if (second < min || second > max) return i;
		for (let k = 2; k <= need; k++) if ((bytes[i + k] & 0xc0) !== 0x80) return i;
		i += need + 1;
	}
	return -1;
}

/**
 * Decodes the bytes of a text file for the diagram readers. Throws InputError for a binary
 * file or for bytes that are not UTF-8 (or UTF-16 after its byte-order mark), naming where.
 */
export function decodeTextFile(bytes: Uint8Array): string {
	if (bytes[0] === 0xff && bytes[1] === 0xfe) return decodeStrict(bytes, 'utf-16le');
	if (bytes[0] === 0xfe && bytes[1] === 0xff) return decodeStrict(bytes, 'utf-16be');
	const nul = bytes.subarray(0, 64 * 1024).indexOf(0);
	if (nul >= 0) {
		throw new InputError(`This is a binary file, not text (a NUL byte at byte ${nul + 1}); expected a Causeway diagram (JSON) or a DOT file saved as UTF-8`);
	}
	// The engine's own strict decoder is fast (about 10× the scan below on a 12 MiB file,
	// measured in bench/cli.ts); the scan runs only to say where a refused file goes wrong.
	try {
		return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
	} catch {
		// fall through to find the first bad byte
	}
	const bad = firstInvalidUtf8(bytes);
	if (bad >= 0) {
		const before = new TextDecoder('utf-8').decode(bytes.subarray(0, bad));
		const pos = lineColumn(before, before.length);
		const hex = bytes[bad].toString(16).toUpperCase().padStart(2, '0');
		throw new InputError(
			`The file is not UTF-8 text: the byte 0x${hex} at ${describePosition(pos)} is not valid UTF-8 (the file may be in Latin-1 or Windows-1252); save it as UTF-8`,
			`${pos.line}:${pos.column}`
		);
	}
	return new TextDecoder('utf-8').decode(bytes);
}

function decodeStrict(bytes: Uint8Array, label: 'utf-16le' | 'utf-16be'): string {
	if (bytes.length % 2 !== 0) throw new InputError(`The file starts with a ${label.toUpperCase()} byte-order mark but has an odd number of bytes, so it is not ${label.toUpperCase()} text`);
	try {
		return new TextDecoder(label, { fatal: true }).decode(bytes);
	} catch {
		throw new InputError(`The file starts with a ${label.toUpperCase()} byte-order mark but holds bytes that are not ${label.toUpperCase()} text (an unpaired surrogate)`);
	}
}
