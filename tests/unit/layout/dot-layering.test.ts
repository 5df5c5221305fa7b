/**
 * Our layered layout against Graphviz `dot` (Debian's graphviz package, /usr/bin/dot), run on
 * the same small DAGs at test time. dot ranks by network simplex (Gansner, Koutsofios, North
 * & Vo, IEEE TSE 1993), which minimises the total span of the arrows; ours is longest-path
 * layering, which minimises the number of layers. So on every DAG: our layer count ≤ dot's,
 * our total span ≥ dot's, and on trees (each arrow spanning one layer is optimal for both) the
 * two agree exactly. Crossings between adjacent rows are compared where both drew the same
 * layers (dot counts its own crossing reduction, the median heuristic with transpositions).
 */
import { describe, expect, it } from 'vitest';
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { layeredDrawing, type LayoutInput } from '../../../src/lib/layout';
import { adjacentRowCrossings, inputOf, randomDagInput } from './layout-helpers';

const DOT = '/usr/bin/dot';

/** dot's rank of each node (0 at the top) and its x, from `dot -Tplain`. */
function dotLayout(input: LayoutInput): { rank: number[]; x: number[] } {
	const lines = [...input.nodes.map((n) => `${n.id};`), ...input.arrows.map((a) => `${a.from} -> ${a.to};`)];
	const run = spawnSync(DOT, ['-Tplain'], { input: `digraph { ${lines.join(' ')} }`, encoding: 'utf8' });
	if (run.status !== 0) throw new Error(`dot failed: ${run.stderr}`);
	const at = new Map<string, [number, number]>();
	for (const line of run.stdout.split('\n')) {
		const f = line.split(' ');
		if (f[0] === 'node') at.set(f[1], [Number(f[2]), Number(f[3])]);
	}
	const ys = [...new Set([...at.values()].map(([, y]) => y))].sort((a, b) => b - a);
	return { rank: input.nodes.map((n) => ys.indexOf(at.get(n.id)![1])), x: input.nodes.map((n) => at.get(n.id)![0]) };
}

const span = (input: LayoutInput, layer: ArrayLike<number>) => {
	const index = new Map(input.nodes.map((n, i) => [n.id, i]));
	return input.arrows.reduce((sum, a) => sum + layer[index.get(a.to)!] - layer[index.get(a.from)!], 0);
};

describe.skipIf(!existsSync(DOT))('layering compared with Graphviz dot', () => {
	it('uses no more layers than dot and arrows no shorter in total, on 25 random DAGs', () => {
		for (let seed = 1; seed <= 25; seed++) {
			const n = 6 + (seed % 20);
			const input = randomDagInput(n, Math.round(1.5 * n), seed);
			const ours = layeredDrawing(input).layer;
			const dot = dotLayout(input).rank;
			expect(Math.max(...ours)).toBeLessThanOrEqual(Math.max(...dot));
			expect(span(input, ours)).toBeGreaterThanOrEqual(span(input, dot));
		}
	});

	it('gives the same layers as dot on trees', () => {
		for (let seed = 1; seed <= 10; seed++) {
			const n = 10 + seed * 3;
			const pairs: [number, number][] = [];
			for (let v = 1; v < n; v++) pairs.push([(v * 7919 * seed) % v, v]);
			const input = inputOf(n, pairs);
			expect([...layeredDrawing(input).layer]).toEqual(dotLayout(input).rank);
		}
	});

	it('crosses arrows between adjacent rows not far more often than dot, where the layers agree', () => {
		let ours = 0;
		let dots = 0;
		let unswept = 0;
		let compared = 0;
		for (let seed = 1; seed <= 60; seed++) {
			const n = 8 + (seed % 12);
			const input = randomDagInput(n, Math.round(1.3 * n), 100 + seed);
			const drawing = layeredDrawing(input);
			const dot = dotLayout(input);
			if (dot.rank.some((r, i) => r !== drawing.layer[i])) continue;
			compared++;
			ours += adjacentRowCrossings(input, drawing.positions);
			unswept += adjacentRowCrossings(input, layeredDrawing(input, 0).positions);
			dots += adjacentRowCrossings(input, input.nodes.map((node, i) => ({ id: node.id, x: dot.x[i], y: dot.rank[i] })));
		}
		console.log(`crossings between adjacent rows over ${compared} DAGs laid out alike: ours ${ours}, before our sweeps ${unswept}, dot ${dots}`);
		expect(compared).toBeGreaterThan(10);
		expect(ours).toBeLessThanOrEqual(unswept);
		// Measured: ours 32, before the sweeps and transposition 73, dot 16 over 20 such DAGs.
		// dot's virtual nodes for long arrows and its repeated sweeps buy the difference; a sanity bound only.
		expect(ours).toBeLessThanOrEqual(3 * dots);
	});
});
