/**
 * Sample odds ratio of a 2 × 2 table with Woolf's (1955) logit confidence interval:
 * log OR ± z·√(1/a + 1/b + 1/c + 1/d). When a cell is zero, 0.5 is added to every cell
 * (Haldane 1956; Anscombe 1956) and the result says so; otherwise no correction. O(1).
 *
 * Orientation: with rows = levels of the first variable and columns = levels of the
 * second, OR = (n₂₂·n₁₁) / (n₂₁·n₁₂): the odds of the second column level in the second
 * row level versus the first (the first level of each is the reference).
 */
import { normalQuantile } from '../distributions';
import { StatsError } from '../errors';
import type { EffectSize } from '../types';
import type { ContingencyTable } from './contingency';

export function oddsRatioWoolf(table: ContingencyTable, level = 0.95): EffectSize {
	if (table.rows !== 2 || table.cols !== 2) throw new StatsError(`An odds ratio needs a 2 × 2 table (found ${table.rows} × ${table.cols}).`);
	let [a, b, c, d] = table.counts;
	const corrected = a === 0 || b === 0 || c === 0 || d === 0;
	if (corrected) [a, b, c, d] = [a + 0.5, b + 0.5, c + 0.5, d + 0.5];
	const logOr = Math.log((a * d) / (b * c));
	const se = Math.sqrt(1 / a + 1 / b + 1 / c + 1 / d);
	const z = normalQuantile(1 - (1 - level) / 2);
	return {
		name: 'odds ratio',
		value: Math.exp(logOr),
		ci: [Math.exp(logOr - z * se), Math.exp(logOr + z * se)],
		note: corrected
			? `A cell is zero: 0.5 added to every cell (Haldane–Anscombe correction); Woolf ${Math.round(level * 100)} % interval.`
			: `Woolf ${Math.round(level * 100)} % interval; '${table.rowLevels[1]}' vs '${table.rowLevels[0]}' for '${table.colLevels[1]}'.`
	};
}
