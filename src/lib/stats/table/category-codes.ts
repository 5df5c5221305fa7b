/**
 * Does a numeric column look like category codes (0/1/2/3, 1–5…)? A column read as numbers
 * is modelled as a straight-line term; when its values are a handful of whole numbers they are
 * often labels of categories, and "adjusting" for them linearly leaves residual confounding.
 * Rule (a rule of thumb, common practice): every observed value is a whole number and there are
 * 3 to 10 distinct values. Two values are already read as binary. O(n).
 */
import type { Column } from './types';

export const MAX_CODE_VALUES = 10;

/** The distinct values (ascending) when the column looks like category codes, else null. */
export function categoryCodeValues(c: Column): number[] | null {
	if (c.kind !== 'continuous') return null;
	const seen = new Set<number>();
	for (const v of c.values) {
		if (Number.isNaN(v)) continue;
		if (!Number.isInteger(v)) return null;
		seen.add(v);
		if (seen.size > MAX_CODE_VALUES) return null;
	}
	return seen.size >= 3 ? [...seen].sort((a, b) => a - b) : null;
}
