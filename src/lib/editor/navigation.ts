/**
 * Spatial keyboard navigation on the canvas: from the selected variable, the arrow keys move
 * the selection to the nearest variable lying in that direction.
 *
 * A candidate must lie within 60° either side of the direction; among those the one with the
 * smallest distance plus twice its sideways offset wins, so a variable straight ahead beats
 * a slightly nearer one off to the side (the usual scoring of spatial focus navigation).
 * O(n) per key press.
 */

export type Direction = 'left' | 'right' | 'up' | 'down';

export interface Placed {
	id: string;
	x?: number;
	y?: number;
}

const UNIT: Record<Direction, [number, number]> = {
	left: [-1, 0],
	right: [1, 0],
	up: [0, -1],
	down: [0, 1]
};

/** tan(60°): the widest sideways/ahead ratio a candidate may have. */
const CONE = Math.tan((60 * Math.PI) / 180);

export function nearestInDirection(items: readonly Placed[], fromId: string, dir: Direction): string | null {
	const from = items.find((v) => v.id === fromId);
	if (!from) return null;
	const [ux, uy] = UNIT[dir];
	const fx = from.x ?? 0;
	const fy = from.y ?? 0;
	let best: string | null = null;
	let bestScore = Infinity;
	for (const v of items) {
		if (v.id === fromId) continue;
		const dx = (v.x ?? 0) - fx;
		const dy = (v.y ?? 0) - fy;
		const ahead = dx * ux + dy * uy;
		const side = Math.abs(dx * uy - dy * ux);
		if (ahead <= 0 || side > ahead * CONE) continue;
		const score = Math.hypot(dx, dy) + 2 * side;
		if (score < bestScore) {
			bestScore = score;
			best = v.id;
		}
	}
	return best;
}

/** The variable nearest the top-left corner, where keyboard navigation starts. O(n). */
export function firstInReadingOrder(items: readonly Placed[]): string | null {
	let best: string | null = null;
	let bestKey = Infinity;
	for (const v of items) {
		const key = (v.y ?? 0) + (v.x ?? 0) / 4;
		if (key < bestKey) {
			bestKey = key;
			best = v.id;
		}
	}
	return best;
}
