/**
 * Reading the committed reference fixtures (tests/fixtures/stats/*.json, written by
 * make-fixtures.R beside them) and comparing numbers with a stated tolerance.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';

const dir = fileURLToPath(new URL('../../fixtures/stats/', import.meta.url));

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixture JSON is untyped test data
export type Json = any;

/** A fixture file; R's NA (written as the string "NA") becomes NaN. */
export function fixture(name: string): Json {
	return JSON.parse(readFileSync(dir + name, 'utf8'), (_k, v) => (v === 'NA' ? NaN : v));
}

/** |actual − expected| ≤ rel·|expected| + abs. */
export function expectClose(actual: number, expected: number, rel: number, abs = 0): void {
	const tol = rel * Math.abs(expected) + abs;
	if (!(Math.abs(actual - expected) <= tol))
		expect.fail(`expected ${actual} to be within ${tol.toExponential(2)} of ${expected} (rel ${rel}, abs ${abs})`);
}

export function expectAllClose(actual: ArrayLike<number>, expected: ArrayLike<number>, rel: number, abs = 0): void {
	expect(actual.length).toBe(expected.length);
	for (let i = 0; i < expected.length; i++) expectClose(actual[i], expected[i], rel, abs);
}
