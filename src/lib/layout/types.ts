/** What a layout takes and gives, shared by dagre's layout and ours (no canvas, no DOM). */

export interface LayoutInput {
	nodes: { id: string; w: number; h: number }[];
	arrows: { from: string; to: string }[];
}

/** Centre of each node's box, in canvas pixels, y pointing down. */
export type Positions = { id: string; x: number; y: number }[];

/** The spacing of every drawing, in canvas pixels: between boxes in a row, between layers. */
export const SPACING = { nodesep: 36, ranksep: 80, edgesep: 12 } as const;
