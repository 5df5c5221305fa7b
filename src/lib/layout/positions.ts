/**
 * Whether a diagram needs a layout, and a layout's positions put into it: kept apart from the
 * layout itself so that the page can ask without loading dagre (bench section 6: importing
 * them from dagre-layout.ts put dagre and graphlib, 17.6 KiB gzip, into the first download).
 */
import type { Diagram } from '../graph/diagram';
import type { Positions } from './types';

/** True when some variable has no position (as in DOT files and hand-written JSON). O(n). */
export function needsLayout(d: Diagram): boolean {
	return d.variables.some((v) => typeof v.x !== 'number' || typeof v.y !== 'number');
}

/** The diagram with the given positions (variables not listed keep theirs). O(n). */
export function withPositions(d: Diagram, positions: Positions): Diagram {
	const at = new Map(positions.map((p) => [p.id, p]));
	return {
		...d,
		variables: d.variables.map((v) => {
			const p = at.get(v.id);
			return p ? { ...v, x: p.x, y: p.y } : v;
		})
	};
}
