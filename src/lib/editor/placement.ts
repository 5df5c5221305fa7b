/**
 * Where to put a variable added without a pointer position (keyboard, side list): the first
 * free spot on a square spiral around a preferred point, so new variables never land on top
 * of existing ones. A spot is free when no variable centre lies within the clearance box.
 * O(n · k) for k probed spots (k ≤ a few hundred).
 */

export interface Point {
	x: number;
	y: number;
}

export const CLEARANCE_X = 150;
export const CLEARANCE_Y = 70;

export function isFree(p: Point, taken: readonly { x?: number; y?: number }[]): boolean {
	return taken.every((v) => Math.abs((v.x ?? 0) - p.x) >= CLEARANCE_X || Math.abs((v.y ?? 0) - p.y) >= CLEARANCE_Y);
}

export function freeSpot(near: Point, taken: readonly { x?: number; y?: number }[]): Point {
	const round = (p: Point): Point => ({ x: Math.round(p.x), y: Math.round(p.y) });
	if (isFree(near, taken)) return round(near);
	// Walk rings of growing radius on a grid of the clearance size.
	for (let ring = 1; ring <= 12; ring++) {
		for (let i = -ring; i <= ring; i++) {
			for (const [gx, gy] of [
				[i, -ring],
				[ring, i],
				[-i, ring],
				[-ring, -i]
			]) {
				const p = { x: near.x + gx * CLEARANCE_X, y: near.y + gy * CLEARANCE_Y };
				if (isFree(p, taken)) return round(p);
			}
		}
	}
	return round({ x: near.x, y: near.y + 13 * CLEARANCE_Y });
}
