/**
 * The stratified estimate of a binary exposure's effect on a binary outcome over the levels
 * of a categorical confounder: the Mantel–Haenszel common odds ratio (Mantel & Haenszel,
 * JNCI 1959) with the Robins–Breslow–Greenland variance of its logarithm (Robins, Breslow &
 * Greenland, Biometrics 42, 1986), and the Cochran–Mantel–Haenszel test of no association
 * in any stratum (with and without the continuity correction 0.5, as R's mantelhaen.test).
 *
 * Each stratum is a 2 × 2 table [a, b, c, d] = [n00, n01, n10, n11]: rows are the exposure's
 * reference and other level, columns the outcome's; OR_k = a·d / (b·c). Strata with fewer
 * than 2 people carry no information and are left out (R refuses them). O(K).
 */
import { chiSquareSf, normalQuantile } from '../distributions';
import { StatsError } from '../errors';

/** One stratum's 2 × 2 table, row-major: exposure 0 × outcome 0, 0 × 1, 1 × 0, 1 × 1. */
export type TwoByTwo = readonly [number, number, number, number];

export interface MantelHaenszel {
	oddsRatio: number;
	/** Robins–Breslow–Greenland interval at `level`. */
	ci: [number, number];
	level: number;
	/** Standard error of log OR_MH (Robins–Breslow–Greenland). */
	logSe: number;
	/** Cochran–Mantel–Haenszel X² (1 df) without continuity correction, and its p-value. */
	statistic: number;
	pValue: number;
	/** The same with the continuity correction 0.5. */
	statisticCorrected: number;
	pValueCorrected: number;
	/** Strata used and left out (fewer than 2 people). */
	strataUsed: number;
	strataLeftOut: number;
	n: number;
}

export function mantelHaenszel(strata: readonly TwoByTwo[], level = 0.95): MantelHaenszel {
	let delta = 0;
	let variance = 0;
	let sx = 0; // Σ a·d/n  (R_k)
	let sy = 0; // Σ b·c/n  (S_k)
	let pr = 0; // Σ P_k R_k, P = (a + d)/n
	let mixed = 0; // Σ (P_k S_k + Q_k R_k), Q = (b + c)/n
	let qs = 0; // Σ Q_k S_k
	let used = 0;
	let n = 0;
	for (const [a, b, c, d] of strata) {
		const nk = a + b + c + d;
		if (nk < 2) continue;
		used++;
		n += nk;
		const r1 = a + b;
		const r2 = c + d;
		const c1 = a + c;
		const c2 = b + d;
		delta += a - (r1 * c1) / nk;
		variance += (r1 * r2 * c1 * c2) / (nk * nk * (nk - 1));
		const R = (a * d) / nk;
		const S = (b * c) / nk;
		const P = (a + d) / nk;
		const Q = (b + c) / nk;
		sx += R;
		sy += S;
		pr += P * R;
		mixed += P * S + Q * R;
		qs += Q * S;
	}
	if (used === 0) throw new StatsError('The Mantel–Haenszel odds ratio needs a stratum with at least 2 people.');
	if (!(sx > 0) || !(sy > 0))
		throw new StatsError('The Mantel–Haenszel odds ratio is 0 or infinite here: every stratum has an empty cell on the same diagonal.');
	const oddsRatio = sx / sy;
	const logSe = Math.sqrt(pr / (2 * sx * sx) + mixed / (2 * sx * sy) + qs / (2 * sy * sy));
	const z = normalQuantile(1 - (1 - level) / 2);
	const statistic = variance > 0 ? (delta * delta) / variance : NaN;
	const corrected = variance > 0 ? Math.max(0, Math.abs(delta) - 0.5) ** 2 / variance : NaN;
	return {
		oddsRatio,
		ci: [oddsRatio * Math.exp(-z * logSe), oddsRatio * Math.exp(z * logSe)],
		level,
		logSe,
		statistic,
		pValue: chiSquareSf(statistic, 1),
		statisticCorrected: corrected,
		pValueCorrected: chiSquareSf(corrected, 1),
		strataUsed: used,
		strataLeftOut: strata.length - used,
		n
	};
}
