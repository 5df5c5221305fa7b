/**
 * Is the odds ratio the same in every stratum? The Breslow–Day test of homogeneity (Breslow &
 * Day, Statistical Methods in Cancer Research I, IARC 1980, §4.4) with Tarone's correction
 * (Tarone, Biometrika 72, 1985), which makes it a proper chi-square statistic when the common
 * odds ratio is the Mantel–Haenszel estimate. A small p-value says the exposure–outcome odds
 * ratio differs across the confounder's levels (effect modification on the odds-ratio scale),
 * so one pooled odds ratio summarises the strata poorly. The test has little power with few
 * people per stratum: a large p-value is not evidence of homogeneity.
 *
 * For each stratum with four non-zero margins, the expected count A_k of cell (0, 0) under
 * the common odds ratio ψ solves A(n − r₁ − c₁ + A) = ψ (r₁ − A)(c₁ − A) within the margins'
 * bounds (a quadratic), with variance 1 / (1/A + 1/B + 1/C + 1/D). Then
 *   X²_BD = Σ (a_k − A_k)² / Var_k,  X²_Tarone = X²_BD − (Σ a_k − Σ A_k)² / Σ Var_k,
 * on K − 1 degrees of freedom for K strata used. Strata with a zero margin say nothing about
 * the odds ratio and are left out. O(K).
 */
import { chiSquareSf } from '../distributions';
import { StatsError } from '../errors';
import type { TwoByTwo } from './mantel-haenszel';

export interface BreslowDay {
	/** Breslow–Day statistic, without and with Tarone's correction. */
	statistic: number;
	statisticTarone: number;
	df: number;
	pValue: number;
	pValueTarone: number;
	strataUsed: number;
	/** Strata left out for a zero margin. */
	strataLeftOut: number;
}

/** The root of the quadratic for A inside [max(0, r₁ + c₁ − n), min(r₁, c₁)]. O(1). */
export function expectedUnderCommonOddsRatio(r1: number, c1: number, n: number, psi: number): number {
	const lo = Math.max(0, r1 + c1 - n);
	const hi = Math.min(r1, c1);
	if (Math.abs(psi - 1) < 1e-12) return (r1 * c1) / n;
	// (1 − ψ)A² + (n − r₁ − c₁ + ψ(r₁ + c₁))A − ψ r₁ c₁ = 0
	const qa = 1 - psi;
	const qb = n - r1 - c1 + psi * (r1 + c1);
	const qc = -psi * r1 * c1;
	const disc = Math.sqrt(Math.max(0, qb * qb - 4 * qa * qc));
	// Numerically stable pair of roots.
	const q = -0.5 * (qb + Math.sign(qb || 1) * disc);
	const roots = [q / qa, qc / q];
	const inside = roots.filter((x) => x >= lo - 1e-9 && x <= hi + 1e-9);
	if (inside.length === 0) throw new StatsError('Breslow–Day: no expected count fits the stratum margins.');
	return Math.min(hi, Math.max(lo, inside[0]));
}

export function breslowDay(strata: readonly TwoByTwo[], commonOddsRatio: number): BreslowDay {
	if (!(commonOddsRatio > 0) || !Number.isFinite(commonOddsRatio))
		throw new StatsError('The Breslow–Day test needs a finite, positive common odds ratio.');
	let bd = 0;
	let sumA = 0;
	let sumE = 0;
	let sumVar = 0;
	let used = 0;
	for (const [a, b, c, d] of strata) {
		const r1 = a + b;
		const r2 = c + d;
		const c1 = a + c;
		const c2 = b + d;
		if (r1 === 0 || r2 === 0 || c1 === 0 || c2 === 0) continue;
		const n = r1 + r2;
		const A = expectedUnderCommonOddsRatio(r1, c1, n, commonOddsRatio);
		const v = 1 / (1 / A + 1 / (r1 - A) + 1 / (c1 - A) + 1 / (n - r1 - c1 + A));
		if (!(v > 0) || !Number.isFinite(v)) continue;
		used++;
		bd += ((a - A) * (a - A)) / v;
		sumA += a;
		sumE += A;
		sumVar += v;
	}
	if (used < 2) throw new StatsError(`The Breslow–Day test needs at least 2 strata with all four margins non-zero (found ${used}).`);
	const tarone = bd - ((sumA - sumE) * (sumA - sumE)) / sumVar;
	const df = used - 1;
	return {
		statistic: bd,
		statisticTarone: tarone,
		df,
		pValue: chiSquareSf(bd, df),
		pValueTarone: chiSquareSf(tarone, df),
		strataUsed: used,
		strataLeftOut: strata.length - used
	};
}
