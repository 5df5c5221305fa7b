/**
 * Text out of the bytes the scanner kept as spans: ids (all of them, for the compiled graph)
 * and labels (when the variable list is made from the scan, lists.ts).
 *
 * An ASCII span is turned into a string from its char codes (one reused array through
 * String.fromCharCode), any other by the UTF-8 decoder, an escaped one by JSON.parse of the
 * quoted span (the same decoding the full reader's JSON.parse does). Measured on 100,000 ids in
 * a fresh process: 22 ms of CPU this way, 52 ms with TextDecoder per id, and decoding the whole
 * file once as Latin-1 to slice it took 110–230 ms (Node's TextDecoder goes through ICU for it).
 */
/** ignoreBOM: a text may start with U+FEFF, which the default decoder would drop. */
const utf8 = new TextDecoder('utf-8', { ignoreBOM: true });
/** One reusable array of char codes per length (setting an array's length each time was a slow builtin call). */
const codesOfLength: number[][] = [];

/** The text of bytes[start .. end), a string's content: `wide` when it holds a byte ≥ 0x80, `escaped` when a backslash. */
export function spanText(bytes: Uint8Array, start: number, end: number, wide: boolean, escaped: boolean): string {
	if (escaped) return JSON.parse(utf8.decode(bytes.subarray(start - 1, end + 1))) as string;
	const length = end - start;
	if (wide || length > 64) return utf8.decode(bytes.subarray(start, end));
	const codes = (codesOfLength[length] ??= new Array<number>(length).fill(0));
	for (let k = 0; k < length; k++) codes[k] = bytes[start + k];
	return String.fromCharCode.apply(null, codes);
}

/** Every id as text, in variable order (ids hold no escapes on the fast path). */
export function idTexts(bytes: Uint8Array, n: number, ids: Int32Array, idWide: Uint8Array): string[] {
	const out = new Array<string>(n);
	for (let i = 0; i < n; i++) out[i] = spanText(bytes, ids[2 * i], ids[2 * i + 1], idWide[i] === 1, false);
	return out;
}
