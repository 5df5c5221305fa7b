/**
 * midRanks (radix-sorted, ranks.ts) against the definition, computed by brute force: the
 * mid-rank of v is 1 + #{values < v} + (#{values = v} − 1) / 2, and the tie sum is
 * Σ (t³ − t) over groups of t equal values. Random inputs with many ties, negative values,
 * ±0, tiny and huge magnitudes.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { midRanks } from '../../../src/lib/stats/association/ranks';

function bruteForce(values: readonly number[]): { ranks: number[]; tieSum: number } {
	const ranks = values.map((v) => 1 + values.filter((w) => w < v).length + (values.filter((w) => w === v).length - 1) / 2);
	const groups = new Map<number, number>();
	for (const v of values) groups.set(v === 0 ? 0 : v, (groups.get(v === 0 ? 0 : v) ?? 0) + 1);
	let tieSum = 0;
	for (const t of groups.values()) tieSum += t * t * t - t;
	return { ranks, tieSum };
}

const value = fc.oneof(
	fc.integer({ min: -3, max: 3 }),
	fc.constantFrom(0, -0, 5e-324, -5e-324, 1e308, -1e308),
	fc.double({ noNaN: true, noDefaultInfinity: true })
);

describe('midRanks', () => {
	it('equals the definition on 500 random arrays (0–80 values, many ties)', () => {
		fc.assert(
			fc.property(fc.array(value, { maxLength: 80 }), (values) => {
				const r = midRanks(Float64Array.from(values));
				const expected = bruteForce(values);
				expect([...r.ranks]).toEqual(expected.ranks);
				expect(r.tieSum).toBe(expected.tieSum);
			}),
			{ numRuns: 500, seed: 31 }
		);
	});
});
