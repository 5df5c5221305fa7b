/**
 * The separator machinery on its own, against brute force over every subset: on random
 * undirected graphs with some vertices not removable, listMinimalSeparators must return
 * exactly the minimal source–sink separators, closeSeparator one of them, and
 * minimumSeparator one of the smallest.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { ContractedMoralGraph } from '../../../src/lib/causal/moral-graph';
import { closeSeparator, listMinimalSeparators, minimumSeparator } from '../../../src/lib/causal/separators';

function separates(h: ContractedMoralGraph, cut: Set<number>): boolean {
	const seen = new Set([h.source]);
	const stack = [h.source];
	while (stack.length) {
		const u = stack.pop()!;
		for (const w of h.adjacency[u]) {
			if (seen.has(w) || cut.has(w)) continue;
			if (w === h.sink) return false;
			seen.add(w);
			stack.push(w);
		}
	}
	return true;
}

function bruteMinimal(h: ContractedMoralGraph): string[] {
	const cands = [...Array(h.size).keys()].filter((v) => h.removable[v]);
	const valid: number[][] = [];
	for (let mask = 0; mask < 1 << cands.length; mask++) {
		const s = cands.filter((_, i) => mask & (1 << i));
		if (separates(h, new Set(s))) valid.push(s);
	}
	const key = (s: number[]) => s.join(',');
	const validKeys = new Set(valid.map(key));
	return valid
		.filter((s) => s.every((_, i) => !validKeys.has(key(s.filter((__, j) => j !== i)))))
		.map(key)
		.sort();
}

const graphArb = fc
	.record({ size: fc.integer({ min: 2, max: 11 }), seed: fc.integer(), density: fc.double({ min: 0.1, max: 0.7, noNaN: true }) })
	.map(({ size, seed, density }): ContractedMoralGraph => {
		let state = seed >>> 0 || 1;
		const rand = () => {
			state ^= state << 13;
			state ^= state >>> 17;
			state ^= state << 5;
			return (state >>> 0) / 2 ** 32;
		};
		const total = size + 2;
		const adj: Set<number>[] = Array.from({ length: total }, () => new Set());
		for (let u = 0; u < total; u++)
			for (let w = u + 1; w < total; w++) {
				if ((u === size && w === size + 1) || rand() >= density) continue;
				adj[u].add(w);
				adj[w].add(u);
			}
		const removable = new Uint8Array(total);
		for (let v = 0; v < size; v++) removable[v] = rand() < 0.8 ? 1 : 0;
		return { size: total, source: size, sink: size + 1, adjacency: adj.map((s) => [...s]), removable };
	});

describe('minimal vertex separators (Kloks & Kratsch 1998 / Takata 2010 close-separator listing)', () => {
	it('lists exactly the minimal separators found by brute force', () => {
		fc.assert(
			fc.property(graphArb, (h) => {
				const expected = bruteMinimal(h);
				const got = listMinimalSeparators(h).sets.map((s) => [...s].sort((a, b) => a - b).join(',')).sort();
				expect(got).toEqual(expected);
				const close = closeSeparator(h, [h.source]);
				if (expected.length === 0) expect(close).toBeNull();
				else expect(expected).toContain(close!.join(','));
				const min = minimumSeparator(h);
				if (expected.length === 0) expect(min).toBeNull();
				else {
					expect(separates(h, new Set(min!))).toBe(true);
					expect(min!.length).toBe(Math.min(...expected.map((k) => (k === '' ? 0 : k.split(',').length))));
				}
			}),
			{ numRuns: 1500, seed: 20261202 }
		);
	});

	it('stops at the cap and says so', () => {
		// source joined to sink by 4 disjoint two-vertex paths: 2^4 = 16 minimal separators.
		const adjacency: number[][] = Array.from({ length: 10 }, () => []);
		const link = (a: number, b: number) => {
			adjacency[a].push(b);
			adjacency[b].push(a);
		};
		for (let k = 0; k < 4; k++) {
			link(8, 2 * k);
			link(2 * k, 2 * k + 1);
			link(2 * k + 1, 9);
		}
		const h: ContractedMoralGraph = { size: 10, source: 8, sink: 9, adjacency, removable: new Uint8Array([1, 1, 1, 1, 1, 1, 1, 1, 0, 0]) };
		expect(listMinimalSeparators(h).sets).toHaveLength(16);
		const capped = listMinimalSeparators(h, 5);
		expect(capped.sets).toHaveLength(5);
		expect(capped.truncated).toBe(true);
		expect(listMinimalSeparators(h, 16).truncated).toBe(false);
	});
});
