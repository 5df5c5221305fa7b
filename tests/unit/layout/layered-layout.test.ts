/**
 * The layered layout used past dagre's reach (src/lib/layout/layered, chosen by tidy.ts):
 * finite, non-overlapping positions for long chains and random DAGs, every arrow from a lower
 * layer to a higher one and drawn down the page (the defining property of a layered drawing,
 * Sugiyama, Tagawa & Toda 1981), and whole SVG exports of the largest diagrams allowed.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DAGRE_MAX_VARIABLES, layeredDrawing, layoutMethod, tidyPositions, type LayoutInput } from '../../../src/lib/layout';
import { MAX_ARROWS, MAX_VARIABLES } from '../../../src/lib/limits';
import { runCli } from '../cli/harness';
import { adjacentRowCrossings, allFinite, chainInput, inputOf, overlappingPairs, randomDagInput } from './layout-helpers';

/** Every arrow goes to a higher layer and lower on the page. */
function expectDownward(input: LayoutInput, layer: Int32Array, positions: { x: number; y: number }[]): void {
	const index = new Map(input.nodes.map((n, i) => [n.id, i]));
	let bad = 0;
	for (const a of input.arrows) {
		const [u, v] = [index.get(a.from)!, index.get(a.to)!];
		if (!(layer[u] < layer[v]) || !(positions[u].y < positions[v].y)) bad++;
	}
	expect(bad).toBe(0);
}

describe('layered layout on long chains', () => {
	for (const n of [1_000, 2_000, 10_000]) {
		it(`lays out a ${n.toLocaleString('en')}-variable chain: finite, one layer per variable, no overlaps`, () => {
			const input = chainInput(n);
			const { positions, layer } = layeredDrawing(input);
			expect(positions).toHaveLength(n);
			expect(allFinite(positions)).toBe(true);
			expect(overlappingPairs(input, positions)).toEqual([]);
			expectDownward(input, layer, positions);
			expect(Math.max(...layer)).toBe(n - 1);
			// A chain hangs straight: every variable in one column.
			expect(new Set(positions.map((p) => p.x)).size).toBe(1);
		});
	}

	it('is what the tidy layout picks past dagre’s limit, and dagre below it', () => {
		expect(layoutMethod(chainInput(1_000))).toBe('layered');
		expect(layoutMethod(chainInput(DAGRE_MAX_VARIABLES))).toBe('dagre');
		expect(layoutMethod(randomDagInput(200, 1_000, 3))).toBe('layered');
		const input = chainInput(1_000);
		const positions = tidyPositions(input);
		expect(allFinite(positions)).toBe(true);
		expect(overlappingPairs(input, positions)).toEqual([]);
	});
});

describe('layered layout on random DAGs', () => {
	it('keeps arrows downward and boxes apart (property, fixed seed)', () => {
		const dag = fc.integer({ min: 1, max: 60 }).chain((n) =>
			fc.tuple(fc.constant(n), fc.array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1)), { maxLength: 4 * n }))
		);
		fc.assert(
			fc.property(dag, ([n, raw]) => {
				const pairs = raw.filter(([a, b]) => a !== b).map(([a, b]) => [Math.min(a, b), Math.max(a, b)] as [number, number]);
				const input = inputOf(n, pairs);
				const { positions, layer } = layeredDrawing(input);
				expect(allFinite(positions)).toBe(true);
				expect(overlappingPairs(input, positions)).toEqual([]);
				expectDownward(input, layer, positions);
			})
		);
	});

	it(`handles the largest diagram a file may hold (${MAX_VARIABLES} variables, ${MAX_ARROWS} arrows)`, () => {
		const input = randomDagInput(MAX_VARIABLES, MAX_ARROWS, 11);
		const { positions, layer } = layeredDrawing(input);
		expect(allFinite(positions)).toBe(true);
		expect(overlappingPairs(input, positions)).toEqual([]);
		expectDownward(input, layer, positions);
	});

	it('wraps a wide layer onto several rows: 2,000 unconnected variables are not one 290,000-pixel row', () => {
		const input = inputOf(2_000, []);
		const { positions } = layeredDrawing(input);
		const width = Math.max(...positions.map((p) => p.x)) - Math.min(...positions.map((p) => p.x));
		const height = Math.max(...positions.map((p) => p.y)) - Math.min(...positions.map((p) => p.y));
		expect(width).toBeLessThan(20_000);
		expect(height).toBeGreaterThan(0);
		expect(overlappingPairs(input, positions)).toEqual([]);
	});

	it('still draws a diagram that holds a cycle (the editor names it; the drawing must not fail)', () => {
		const input = inputOf(4, [
			[0, 1],
			[1, 2],
			[2, 0],
			[2, 3]
		]);
		const { positions } = layeredDrawing(input);
		expect(allFinite(positions)).toBe(true);
		expect(overlappingPairs(input, positions)).toEqual([]);
	});

	it('ignores self-loops, repeated arrows and arrows to unlisted variables, and keeps odd ids apart', () => {
		const input: LayoutInput = {
			nodes: [
				{ id: '__proto__', w: 80, h: 38 },
				{ id: 'constructor', w: 80, h: 38 }
			],
			arrows: [
				{ from: '__proto__', to: 'constructor' },
				{ from: '__proto__', to: 'constructor' },
				{ from: 'constructor', to: 'constructor' },
				{ from: 'ghost', to: '__proto__' }
			]
		};
		const { positions, layer } = layeredDrawing(input);
		expect(positions.map((p) => p.id)).toEqual(['__proto__', 'constructor']);
		expect([...layer]).toEqual([0, 1]);
		expect(layeredDrawing({ nodes: [], arrows: [] }).positions).toEqual([]);
	});

	// A tree has a drawing without crossings, and the barycentre heuristic keeps to it: each
	// child follows its parent's position (Sugiyama, Tagawa & Toda 1981).
	it('draws trees without crossings', () => {
		for (const seed of [1, 2, 3, 4, 5]) {
			const n = 120;
			const pairs: [number, number][] = [];
			for (let v = 1; v < n; v++) pairs.push([(v * 7919 * seed) % v, v]);
			const input = inputOf(n, pairs);
			expect(adjacentRowCrossings(input, layeredDrawing(input).positions)).toBe(0);
		}
	});
});

describe('causeway export of large diagrams without positions', () => {
	const diagram = (n: number, arrows: { from: string; to: string }[]) =>
		JSON.stringify({
			format: 'causeway.diagram',
			version: 2,
			title: 'large',
			variables: Array.from({ length: n }, (_, i) => ({ id: `v${i}`, label: `Variable ${i}`, measured: true })),
			arrows,
			exposures: [],
			outcomes: [],
			adjusted: []
		});

	it('writes the SVG of a 2,000-variable chain with every variable in it', async () => {
		const n = 2_000;
		const { code, out, err } = await runCli(['export', 'chain.json', '--to', 'svg'], { 'chain.json': diagram(n, chainInput(n).arrows) });
		expect(err).toBe('');
		expect(code).toBe(0);
		const ids = new Set([...out.matchAll(/<g class="variable" data-id="([^"]+)"/g)].map((m) => m[1]));
		expect(ids.size).toBe(n);
		for (let i = 0; i < n; i++) expect(ids.has(`v${i}`)).toBe(true);
		expect(out.match(/<line [^>]*data-from=/g)).toHaveLength(n - 1);
	});

	it('writes the SVG of a 2,000-variable, 10,000-arrow diagram', async () => {
		const input = randomDagInput(MAX_VARIABLES, MAX_ARROWS, 5);
		const { code, out } = await runCli(['export', 'big.json', '--to', 'svg'], { 'big.json': diagram(MAX_VARIABLES, input.arrows) });
		expect(code).toBe(0);
		expect(out.match(/<g class="variable"/g)).toHaveLength(MAX_VARIABLES);
		expect(out.match(/<line [^>]*data-from=/g)).toHaveLength(MAX_ARROWS);
	});
});
