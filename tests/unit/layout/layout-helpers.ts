/** Shared by the layout tests: diagrams to lay out and checks of a drawing's geometry. */
import type { LayoutInput, Positions } from '../../../src/lib/layout';

/** A chain v0 → v1 → … → v(n-1), boxes of varied widths as labels would give. */
export function chainInput(n: number): LayoutInput {
	return {
		nodes: Array.from({ length: n }, (_, i) => ({ id: `v${i}`, w: 64 + (i % 7) * 13, h: 38 })),
		arrows: Array.from({ length: n - 1 }, (_, i) => ({ from: `v${i}`, to: `v${i + 1}` }))
	};
}

/** The input for arrows between indices (an arrow goes from the lower index to the higher when `acyclic`). */
export function inputOf(n: number, pairs: readonly [number, number][]): LayoutInput {
	return {
		nodes: Array.from({ length: n }, (_, i) => ({ id: `v${i}`, w: 64 + (i % 5) * 20, h: i % 3 === 0 ? 56 : 38 })),
		arrows: pairs.map(([a, b]) => ({ from: `v${a}`, to: `v${b}` }))
	};
}

/** Seeded random DAG: n nodes, m arrows between random pairs, each from the lower index. */
export function randomDagInput(n: number, m: number, seed: number): LayoutInput {
	let s = seed >>> 0 || 1;
	const rand = () => {
		s ^= s << 13;
		s ^= s >>> 17;
		s ^= s << 5;
		return (s >>> 0) / 2 ** 32;
	};
	const pairs: [number, number][] = [];
	const seen = new Set<number>();
	while (pairs.length < m) {
		const a = Math.floor(rand() * n);
		const b = Math.floor(rand() * n);
		if (a === b || seen.has(Math.min(a, b) * n + Math.max(a, b))) continue;
		seen.add(Math.min(a, b) * n + Math.max(a, b));
		pairs.push([Math.min(a, b), Math.max(a, b)]);
	}
	return inputOf(n, pairs);
}

/**
 * Pairs of boxes that overlap. Boxes are sorted by top edge and each is compared with the
 * ones starting above its bottom edge, so a layered drawing costs O(n · row width).
 */
export function overlappingPairs(input: LayoutInput, positions: Positions): [string, string][] {
	const boxes = input.nodes.map((n, i) => ({ id: n.id, left: positions[i].x - n.w / 2, right: positions[i].x + n.w / 2, top: positions[i].y - n.h / 2, bottom: positions[i].y + n.h / 2 }));
	boxes.sort((a, b) => a.top - b.top);
	const found: [string, string][] = [];
	for (let i = 0; i < boxes.length; i++)
		for (let j = i + 1; j < boxes.length && boxes[j].top < boxes[i].bottom; j++) {
			const [a, b] = [boxes[i], boxes[j]];
			if (a.left < b.right && b.left < a.right) found.push([a.id, b.id]);
		}
	return found;
}

export const allFinite = (positions: Positions): boolean => positions.every((p) => Number.isFinite(p.x) && Number.isFinite(p.y));

/** Crossings between arrows joining the same two adjacent rows (by x at each end). O(m²) per row pair; for small drawings. */
export function adjacentRowCrossings(input: LayoutInput, positions: Positions): number {
	const at = new Map(positions.map((p) => [p.id, p]));
	const segs = input.arrows.map((a) => [at.get(a.from)!, at.get(a.to)!] as const);
	let crossings = 0;
	for (let i = 0; i < segs.length; i++)
		for (let j = i + 1; j < segs.length; j++) {
			const [[a1, a2], [b1, b2]] = [segs[i], segs[j]];
			if (a1.y !== b1.y || a2.y !== b2.y) continue;
			if ((a1.x - b1.x) * (a2.x - b2.x) < 0) crossings++;
		}
	return crossings;
}
