/**
 * How numbers are written for people, the same in the app, the command line and the report:
 * p-values with two significant digits (below 0.001 as "< 0.001"), estimates with three
 * significant digits, never in e-notation, with thousands separators from 1,000 and a true
 * minus sign (−) — all without toLocaleString (groupThousands) — "≈ 0" below 1e-9 and "> 1,000,000,000,000" from 1e12; a missing or undefined
 * value is an em dash (—). Data files and JSON keep
 * full precision: these formats are for reading only. O(1).
 */
import type { TestResult } from '../stats';

/** What is shown for a value that does not exist or cannot be computed. */
export const MISSING = '—';
/** The minus sign of typeset numbers (U+2212), so that "−0.5" reads as a number, not a dash. */
export const MINUS = '\u2212';

export function formatP(p: number | null | undefined): string {
	if (p === null || p === undefined || !Number.isFinite(p)) return MISSING;
	if (p < 0.001) return '< 0.001';
	return p >= 0.1 ? p.toFixed(2) : p.toPrecision(2);
}

/** "p = 0.034" or "p < 0.001". */
export function pText(p: number): string {
	const f = formatP(p);
	return f.startsWith('<') ? `p ${f}` : `p = ${f}`;
}

/** Below this magnitude a value is shown as "≈ 0": its digits carry no meaning for a reader. */
const NEGLIGIBLE = 1e-9;
/**
 * From this magnitude on a value is shown as "> 1,000,000,000,000": estimates that large come
 * from separation or a degenerate fit, and a 24-digit number would hide that.
 */
const HUGE = 1e12;

/**
 * A number with `digits` significant digits: "0.0123", "1.5", "12,300", "−4.56". Never
 * e-notation; integers of any size keep their digits up to the significant ones.
 */
export function formatNumber(x: number | null | undefined, digits = 3): string {
	if (x === null || x === undefined || !Number.isFinite(x)) return MISSING;
	if (x === 0) return '0';
	const a = Math.abs(x);
	if (a < NEGLIGIBLE) return '≈ 0';
	const sign = x < 0 ? MINUS : '';
	if (a >= HUGE) return x > 0 ? `> ${groupThousands(HUGE)}` : `< ${MINUS}${groupThousands(HUGE)}`;
	const magnitude = Math.floor(Math.log10(a));
	if (magnitude >= digits - 1) {
		// Whole number: round to the significant digits, then group the thousands.
		const unit = 10 ** (magnitude - digits + 1);
		return sign + groupThousands(Math.round(a / unit) * unit);
	}
	const decimals = Math.min(digits - 1 - magnitude, 20);
	// toFixed never uses e-notation below 1e21; trailing zeros go ("1.50" → "1.5").
	const text = a.toFixed(decimals).replace(/\.?0+$/, '');
	return sign + groupDigits(text);
}

/**
 * The digits of a non-negative decimal numeral ("1234567.5") with the thousands of its whole
 * part grouped by commas ("1,234,567.5"). Written by hand rather than with toLocaleString:
 * the first toLocaleString call starts ICU, about a tenth of a second of the command's
 * start-up (node --cpu-prof; src/lib/limits.ts) and a cost on the page's first analysis
 * too. O(digits).
 */
function groupDigits(numeral: string): string {
	const point = numeral.indexOf('.');
	const whole = point < 0 ? numeral : numeral.slice(0, point);
	return whole.replace(/\B(?=(\d{3})+$)/g, ',') + (point < 0 ? '' : numeral.slice(point));
}

/**
 * A whole number or a count with its thousands grouped, "1,234,567", and a true minus sign;
 * never e-notation (beyond 2^53 the digits come from BigInt, which String() would write as
 * "1e+21"). Fractions keep up to three decimals, as counts never need more. O(digits).
 */
export function groupThousands(n: number): string {
	if (!Number.isFinite(n)) return MISSING;
	const a = Math.abs(n);
	const numeral = Number.isInteger(a) ? (a < Number.MAX_SAFE_INTEGER ? String(a) : BigInt(a).toString()) : a.toFixed(3).replace(/\.?0+$/, '');
	return (n < 0 && numeral !== '0' ? MINUS : '') + groupDigits(numeral);
}

/**
 * A short label for a plot's axis tick: three significant digits like every estimate, never
 * e-notation ("100,000", "0.00012"), the true minus sign. O(1).
 */
export function axisTickText(x: number): string {
	return formatNumber(x, 3);
}

/** A count: "1,234". */
export function formatCount(n: number): string {
	return groupThousands(n);
}

export function formatCi(ci: readonly [number, number]): string {
	return `${formatNumber(ci[0])} to ${formatNumber(ci[1])}`;
}

/** A relative change: "+5.0 %", "−6.1 %". */
export function formatPercent(x: number | null | undefined): string {
	if (x === null || x === undefined || !Number.isFinite(x)) return MISSING;
	return `${x >= 0 ? '+' : MINUS}${Math.abs(x).toFixed(1)} %`;
}

/** "Pearson r = 0.45, p < 0.001, n = 32" for a test's main effect. */
export function testSummary(t: TestResult): string {
	const e = t.effects[0];
	const effect = e ? `${e.name} = ${formatNumber(e.value)}${e.ci ? ` (95 % CI ${formatCi(e.ci)})` : ''}, ` : '';
	return `${effect}${pText(t.pValue)}, n = ${formatCount(t.n)}`;
}
