/** Comparing two data-check reports number by number (grouped or summarized vs the rows). */
import { expect } from 'vitest';

/** Every number of `a` equals `b`'s within `tol` (relative above 1, absolute below); everything else is equal. */
export function expectSameNumbers(a: unknown, b: unknown, tol = 1e-9, path = 'report'): void {
	if (typeof a === 'number' && typeof b === 'number') {
		if (Number.isNaN(a) || Number.isNaN(b) || !Number.isFinite(a) || !Number.isFinite(b)) {
			expect(a, path).toBe(b);
			return;
		}
		const scale = Math.max(1, Math.abs(a), Math.abs(b));
		if (Math.abs(a - b) > tol * scale) expect(a, path).toBe(b);
		return;
	}
	if (Array.isArray(a) && Array.isArray(b)) {
		expect(a.length, `${path}.length`).toBe(b.length);
		a.forEach((x, i) => expectSameNumbers(x, b[i], tol, `${path}[${i}]`));
		return;
	}
	if (a && b && typeof a === 'object' && typeof b === 'object') {
		const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
		for (const k of keys) expectSameNumbers((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], tol, `${path}.${k}`);
		return;
	}
	expect(a, path).toEqual(b);
}
