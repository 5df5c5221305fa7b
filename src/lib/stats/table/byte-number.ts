/**
 * Plain decimal numbers read straight from UTF-8 bytes, without making a string: an optional
 * sign, digits, and an optional decimal point (or comma) with digits — "47", "-3.25", ".5",
 * "12,5" with a decimal comma. When the digits form an integer m < 2⁵³ (every partial sum is
 * then exact too) and there are k ≤ 22 decimals (10^k is then exact), m / 10^k is one
 * correctly rounded IEEE division: exactly the double Number() gives for the same text (Clinger's fast path,
 * "How to read floating point numbers accurately", PLDI 1990). Anything else (exponents,
 * more digits, spaces, text) returns NaN and the caller falls back to the string path
 * (cells.ts parseNumber), so the two paths always agree. O(length).
 */

// From decimal literals (correctly rounded, hence exact here), not Math.pow.
const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

/** The number in bytes[start, end), or NaN when it is not a plain decimal this path reads. */
export function plainDecimal(bytes: Uint8Array, start: number, end: number, decimalComma: boolean): number {
	let i = start;
	let c = bytes[i];
	if (c === 0x2c) return NaN; // parseNumber refuses a leading comma (",5"), though not "-,5"
	const negative = c === 0x2d;
	if (negative || c === 0x2b) i++;
	let mantissa = 0;
	let d = 0;
	const integerStart = i;
	while (i < end && (d = bytes[i] - 0x30) >= 0 && d <= 9) {
		mantissa = mantissa * 10 + d;
		i++;
	}
	let digits = i - integerStart;
	let fraction = 0;
	if (i < end) {
		c = bytes[i];
		if (c !== 0x2e && !(c === 0x2c && decimalComma)) return NaN;
		const fractionStart = ++i;
		while (i < end && (d = bytes[i] - 0x30) >= 0 && d <= 9) {
			mantissa = mantissa * 10 + d;
			i++;
		}
		if (i !== end) return NaN;
		fraction = i - fractionStart;
		digits += fraction;
	}
	// Every partial sum was exact when the last one is at most 2⁵³ − 1.
	if (digits === 0 || mantissa > Number.MAX_SAFE_INTEGER || fraction > 22) return NaN;
	const x = fraction > 0 ? mantissa / POWERS_OF_TEN[fraction] : mantissa;
	return negative ? -x : x;
}
