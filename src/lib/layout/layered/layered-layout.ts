/**
 * Our own layered drawing (Sugiyama, Tagawa & Toda 1981), for diagrams past dagre's reach
 * (see ../tidy.ts for where and why): longest-path layers from a topological order, a few
 * barycentre sweeps and a transposition pass against crossings, rows wrapped when a layer is too wide, and x chosen
 * near the neighbours. Arrows are drawn straight by the canvas and the figure writers, so
 * only node positions are computed. Iterative, typed arrays: O(n + m) apart from the sorts
 * of the sweeps, O(sweeps · (m + n log n)), and the transposition passes, O(passes · n) with
 * a fixed budget per pair of neighbours.
 */
import type { LayoutInput, Positions } from '../types';
import { indexGraph } from './index-graph';
import { assignLayers } from './layering';
import { orderLayers, SWEEP_PAIRS } from './ordering';
import { coordinates, wrapRows, wrapWidth } from './coordinates';

export interface LayeredDrawing {
	positions: Positions;
	/** Each node's layer (index as in the input), for checks and tests. */
	layer: Int32Array;
}

/** `sweepPairs` is for tests and benchmarks (the effect of crossing reduction). */
export function layeredDrawing(input: LayoutInput, sweepPairs = SWEEP_PAIRS): LayeredDrawing {
	const g = indexGraph(input);
	const layering = assignLayers(g);
	const layers = orderLayers(layering, sweepPairs);
	const boxes = input.nodes;
	const { rows, firstOfLayer } = wrapRows(layers, boxes, wrapWidth(boxes));
	const { x, y } = coordinates(layering.dag, rows, firstOfLayer, boxes);
	// Like dagre's output: the drawing's left and top edges at 0, whole pixels.
	let left = Infinity;
	for (let v = 0; v < g.n; v++) left = Math.min(left, x[v] - boxes[v].w / 2);
	const positions = input.nodes.map((node, v) => ({ id: node.id, x: Math.round(x[v] - left), y: Math.round(y[v]) }));
	return { positions, layer: layering.layer };
}

export const layeredPositions = (input: LayoutInput): Positions => layeredDrawing(input).positions;
