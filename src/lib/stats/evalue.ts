/**
 * The E-value (VanderWeele & Ding, Ann Intern Med 2017): the minimum strength of
 * association, on the risk-ratio scale, that an unmeasured confounder would need with both
 * exposure and outcome to fully explain away an observed risk ratio RR:
 * E = RR + √(RR·(RR − 1)) for RR ≥ 1 (use 1/RR for RR < 1). For the confidence interval,
 * the same formula is applied to the limit closer to 1, and E = 1 when the interval
 * includes 1.
 *
 * Odds ratios: with a rare outcome (under about 15 % in every stratum) OR ≈ RR is used as
 * is; with a common outcome the square-root conversion RR ≈ √OR is applied first
 * (VanderWeele, Biometrics 2017; VanderWeele & Ding 2017, Table 2). O(1).
 */
import { StatsError } from './errors';

export interface EValueResult {
	/** E-value of the point estimate. */
	point: number;
	/** E-value of the confidence limit closer to the null (1 when the interval includes 1). */
	ciBound: number | null;
	/** The risk ratio the E-value was computed from (after any conversion). */
	riskRatio: number;
	notes: string[];
}

/** E-value of a risk ratio (any side of 1). */
export function eValueOfRiskRatio(rr: number): number {
	if (!(rr > 0) || !Number.isFinite(rr)) throw new StatsError(`An E-value needs a positive, finite risk ratio (got ${rr}).`);
	const r = rr < 1 ? 1 / rr : rr;
	return r + Math.sqrt(r * (r - 1));
}

export interface EValueOptions {
	measure: 'RR' | 'OR';
	/** For odds ratios: whether the outcome is rare (< 15 %). Default true. */
	rareOutcome?: boolean;
}

export function eValue(estimate: number, ci: readonly [number, number] | null, options: EValueOptions): EValueResult {
	const notes: string[] = [];
	const convert = (v: number) => (options.measure === 'OR' && options.rareOutcome === false ? Math.sqrt(v) : v);
	if (options.measure === 'OR')
		notes.push(
			options.rareOutcome === false
				? 'Common outcome (15 % or more): odds ratio converted to a risk ratio by its square root (VanderWeele 2017).'
				: 'Rare outcome assumed (under 15 %): the odds ratio is used as a risk ratio.'
		);
	const rr = convert(estimate);
	const point = eValueOfRiskRatio(rr);
	let ciBound: number | null = null;
	if (ci) {
		const [lo, hi] = [convert(ci[0]), convert(ci[1])];
		if (lo <= 1 && hi >= 1) ciBound = 1;
		else ciBound = eValueOfRiskRatio(rr > 1 ? lo : hi);
	}
	return { point, ciBound, riskRatio: rr, notes };
}
