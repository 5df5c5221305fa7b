/**
 * How the data checks' numbers are written, the same in the app and the CLI: p-values with
 * two significant digits (below 0.001 as "< 0.001"), estimates with three. O(1).
 */
import type { TestResult } from '../stats';

export function formatP(p: number): string {
	if (!Number.isFinite(p)) return '—';
	if (p < 0.001) return '< 0.001';
	return p >= 0.1 ? p.toFixed(2) : p.toPrecision(2);
}

/** "p = 0.034" or "p < 0.001". */
export function pText(p: number): string {
	const f = formatP(p);
	return f.startsWith('<') ? `p ${f}` : `p = ${f}`;
}

export function formatNumber(x: number, digits = 3): string {
	if (!Number.isFinite(x)) return '—';
	if (x === 0) return '0';
	const a = Math.abs(x);
	if (a >= 1e5 || a < 1e-3) return x.toExponential(digits - 1);
	return Number(x.toPrecision(digits)).toString();
}

export function formatCi(ci: readonly [number, number]): string {
	return `${formatNumber(ci[0])} to ${formatNumber(ci[1])}`;
}

export function formatPercent(x: number): string {
	return `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(1)} %`;
}

/** "Pearson r = 0.45, p < 0.001, n = 32" for a test's main effect. */
export function testSummary(t: TestResult): string {
	const e = t.effects[0];
	const effect = e ? `${e.name} = ${formatNumber(e.value)}${e.ci ? ` (95 % CI ${formatCi(e.ci)})` : ''}, ` : '';
	return `${effect}${pText(t.pValue)}, n = ${t.n}`;
}
