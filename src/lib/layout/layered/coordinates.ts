/**
 * Coordinates, the last step of a layered drawing: layers become rows, top to bottom, and
 * each node gets an x that keeps its row's order and spacing while sitting near its
 * neighbours (a simple form of the priority method, Sugiyama, Tagawa & Toda 1981).
 *
 * A layer wider than the wrap width is wrapped onto several rows, one under the other, so a
 * diagram of many unconnected variables (one layer of 2,000) stays readable; rows of one
 * layer hold no arrows between them, so every arrow still points down the page.
 *
 * Within a row, nodes sit as near their wished x as order and spacing allow (least squares,
 * O(row) by pool-adjacent-violators). Down and up passes wish for the mean x of predecessors,
 * then of successors. O(passes · (n + m)).
 */
import { SPACING } from '../types';
import type { IndexGraph } from './index-graph';

export interface Box {
	w: number;
	h: number;
}

/** Gap between the rows of one wrapped layer: closer than between layers, so a layer reads as one. */
const WRAP_GAP = SPACING.ranksep / 2;
/** Passes of x alignment (down, up, down…): the last is downward, so chains hang straight. */
const ALIGN_PASSES = 3;

/**
 * Wrap width: about 1.5 times the side of a square holding every box with its spacing, so a
 * wrapped drawing is wider than tall, and never under 1,600 px (a screen's width).
 */
export function wrapWidth(boxes: readonly Box[]): number {
	let area = 0;
	for (const b of boxes) area += (b.w + SPACING.nodesep) * (b.h + SPACING.ranksep);
	return Math.max(1600, 1.5 * Math.sqrt(area));
}

/** Splits each layer's order into rows no wider than `width` (at least one node per row). O(n). */
export function wrapRows(layers: readonly number[][], boxes: readonly Box[], width: number): { rows: number[][]; firstOfLayer: boolean[] } {
	const rows: number[][] = [];
	const firstOfLayer: boolean[] = [];
	for (const layer of layers) {
		let row: number[] = [];
		let used = 0;
		let first = true;
		for (const v of layer) {
			const w = boxes[v].w + SPACING.nodesep;
			if (row.length > 0 && used + w > width) {
				rows.push(row);
				firstOfLayer.push(first);
				first = false;
				row = [];
				used = 0;
			}
			row.push(v);
			used += w;
		}
		if (row.length > 0) {
			rows.push(row);
			firstOfLayer.push(first);
		}
	}
	return { rows, firstOfLayer };
}

/**
 * Places `row` as near its wishes as the order and spacing allow: the x minimising
 * Σ (x_i − wish_i)² subject to x_(i+1) − x_i ≥ the two half-widths plus the gap. Subtracting
 * each node's least offset from the row's start makes this isotonic regression, solved
 * exactly by pool-adjacent-violators (Ayer et al. 1955; Barlow et al. 1972) in O(row).
 */
function placeRow(row: readonly number[], wish: Float64Array, boxes: readonly Box[], x: Float64Array): void {
	const k = row.length;
	const offset = new Float64Array(k);
	for (let i = 1; i < k; i++) offset[i] = offset[i - 1] + (boxes[row[i - 1]].w + boxes[row[i]].w) / 2 + SPACING.nodesep;
	// Blocks of pooled nodes: their sum of targets, size and first index.
	const sum = new Float64Array(k);
	const size = new Int32Array(k);
	const first = new Int32Array(k);
	let blocks = 0;
	for (let i = 0; i < k; i++) {
		sum[blocks] = wish[row[i]] - offset[i];
		size[blocks] = 1;
		first[blocks] = i;
		blocks++;
		while (blocks > 1 && sum[blocks - 2] / size[blocks - 2] > sum[blocks - 1] / size[blocks - 1]) {
			sum[blocks - 2] += sum[blocks - 1];
			size[blocks - 2] += size[blocks - 1];
			blocks--;
		}
	}
	for (let b = 0; b < blocks; b++) {
		const level = sum[b] / size[b];
		for (let i = first[b]; i < first[b] + size[b]; i++) x[row[i]] = level + offset[i];
	}
}

/** Centre coordinates of every node. O(ALIGN_PASSES · (n + m)). */
export function coordinates(g: IndexGraph, rows: readonly number[][], firstOfLayer: readonly boolean[], boxes: readonly Box[]): { x: Float64Array; y: Float64Array } {
	const x = new Float64Array(g.n);
	const y = new Float64Array(g.n);
	let top = 0;
	rows.forEach((row, r) => {
		if (r > 0) top += firstOfLayer[r] ? SPACING.ranksep : WRAP_GAP;
		let height = 0;
		for (const v of row) height = Math.max(height, boxes[v].h);
		for (const v of row) y[v] = top + height / 2;
		top += height;
	});
	const wish = new Float64Array(g.n);
	for (const row of rows) placeRow(row, wish, boxes, x);
	const wishFrom = (start: Int32Array, list: Int32Array) => (v: number) => {
		const count = start[v + 1] - start[v];
		if (count === 0) return x[v];
		let sum = 0;
		for (let i = start[v]; i < start[v + 1]; i++) sum += x[list[i]];
		return sum / count;
	};
	const fromAbove = wishFrom(g.predStart, g.pred);
	const fromBelow = wishFrom(g.succStart, g.succ);
	for (let pass = 0; pass < ALIGN_PASSES; pass++) {
		const down = pass % 2 === 0;
		const wishOf = down ? fromAbove : fromBelow;
		for (let k = 0; k < rows.length; k++) {
			const row = rows[down ? k : rows.length - 1 - k];
			for (const v of row) wish[v] = wishOf(v);
			placeRow(row, wish, boxes, x);
		}
	}
	return { x, y };
}
