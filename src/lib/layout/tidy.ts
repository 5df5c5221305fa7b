/**
 * The one entry point of the tidy layout, for the app's layout client and worker and for
 * `causeway export`: dagre for small diagrams, our own layered layout past them.
 *
 * Why not dagre everywhere (measured on the 2-core development machine, Node 20, CPU time;
 * bench/layout.ts prints the current figures):
 * - dagre recurses as deep as the graph is long (longest-path ranking, initial ordering and
 *   network simplex walk the graph depth-first), never deeper than the number of variables
 *   (at most n ranks, a spanning tree of n nodes), so a chain is the worst case. A chain
 *   overflowed at 2,000 variables under Node's default stack, between 700 and 1,000 under a
 *   400 kB stack and between 300 and 400 under a 200 kB stack; Chromium's Web Worker stack
 *   holds about 6,400 plain frames (Node's 400 kB about 5,600), and a 1,000-variable chain
 *   failed in the app. At 300 variables dagre ran under a 200 kB stack: twice the margin.
 * - its time grows quickly with arrows that span layers (each becomes a chain of dummy
 *   nodes): 300 variables took 0.3 s as a chain, 1.2 s with 600 arrows, 4.9 s with 1,500;
 *   a 2,000-variable, 10,000-arrow diagram took 150 s, two thirds of it (node --cpu-prof) in
 *   network-simplex ranking, which recomputes every cut value after each pivot.
 * The layered layout took a few milliseconds at 300 variables with 1,500 arrows, 25–100 ms at
 * 2,000 with 10,000 and 0.15–0.2 s for a 10,000-variable chain (load average 5–10). dagre is
 * kept below the limits because its drawing is tidier (ranks by network simplex, long arrows
 * kept clear of boxes by dummy nodes).
 */
import { dagrePositions } from './dagre-layout';
import { layeredPositions } from './layered/layered-layout';
import type { LayoutInput, Positions } from './types';

/** Largest diagram dagre lays out: past it the stack or the time runs out (see above). */
export const DAGRE_MAX_VARIABLES = 300;
export const DAGRE_MAX_ARROWS = 900;

/** Which layout a diagram of this size gets. O(1). */
export function layoutMethod(input: LayoutInput): 'dagre' | 'layered' {
	return input.nodes.length <= DAGRE_MAX_VARIABLES && input.arrows.length <= DAGRE_MAX_ARROWS ? 'dagre' : 'layered';
}

/** Centre positions for every node, arrows pointing down the page, boxes not overlapping. */
export function tidyPositions(input: LayoutInput): Positions {
	return layoutMethod(input) === 'dagre' ? dagrePositions(input) : layeredPositions(input);
}
