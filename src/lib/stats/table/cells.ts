/**
 * Reading single cells: missing-value tokens and strict number syntax. O(length of cell).
 */

/** Tokens read as missing by default (compared after trimming; NA/NaN/NULL in any case). */
export const DEFAULT_MISSING_TOKENS: readonly string[] = ['', 'NA', '.', 'NaN', 'NULL'];

export type MissingTest = (trimmed: string) => boolean;

/** A test for missing cells: the default tokens (case-insensitive) plus the user's own. */
export function missingTest(extra: readonly string[] = []): MissingTest {
	const upper = new Set(DEFAULT_MISSING_TOKENS.map((t) => t.toUpperCase()));
	const exact = new Set(extra.map((t) => t.trim()));
	return (s) => s === '' || exact.has(s) || (s.length <= 4 && upper.has(s.toUpperCase()));
}

// Plain decimal notation with optional exponent. Rejects what Number() would also accept
// but a data file should not contain: hex, binary, "Infinity", digit separators.
const DECIMAL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?(?:\d+(?:,\d*)?|,\d+)(?:[eE][+-]?\d+)?$/;

/**
 * A trimmed cell as a number, or NaN when it is not a plain decimal number. With
 * `decimalComma`, "3,5" reads as 3.5 (a point is accepted too).
 */
export function parseNumber(s: string, decimalComma: boolean): number {
	if (DECIMAL.test(s)) return Number(s);
	if (decimalComma && DECIMAL_COMMA.test(s)) return Number(s.replace(',', '.'));
	return NaN;
}

/** Trim only when needed (most cells have no surrounding spaces). */
export function trimCell(s: string): string {
	const n = s.length;
	if (n === 0) return s;
	const a = s.charCodeAt(0);
	const b = s.charCodeAt(n - 1);
	return a <= 32 || b <= 32 ? s.trim() : s;
}
