/**
 * Tidy layout by dagre: the layered drawing of directed graphs (Sugiyama, Tagawa & Toda
 * 1981; ranks by network simplex, Gansner et al. 1993) run on an @dagrejs/graphlib graph.
 * No canvas library and no DOM. Used for the sizes where it is safe and quick (tidy.ts).
 */
import dagre from '@dagrejs/dagre';
import type { Diagram } from '../graph/diagram';
import { SPACING, type LayoutInput, type Positions } from './types';

/**
 * Centre positions for every node, arranged top to bottom in the direction of the arrows.
 * Nodes are keyed by their index ("n0", "n1", …), never by the user's id, so that ids such as
 * "__proto__" cannot reach graphlib's internal tables. Arrows to unlisted nodes are ignored.
 * Cost: dagre's, about O((n + m) log(n + m)) per crossing-reduction sweep in practice, and it
 * recurses as deep as the graph is long (tidy.ts keeps it to sizes where that is safe).
 */
export function dagrePositions(input: LayoutInput): Positions {
	const g = new dagre.graphlib.Graph<object, { width: number; height: number; x?: number; y?: number }, object>();
	g.setGraph({ rankdir: 'TB', ...SPACING });
	g.setDefaultEdgeLabel(() => ({}));
	const keyOf = new Map<string, string>();
	input.nodes.forEach((n, i) => {
		const key = `n${i}`;
		keyOf.set(n.id, key);
		g.setNode(key, { width: n.w, height: n.h });
	});
	for (const a of input.arrows) {
		const from = keyOf.get(a.from);
		const to = keyOf.get(a.to);
		if (from !== undefined && to !== undefined && from !== to) g.setEdge(from, to);
	}
	dagre.layout(g);
	return input.nodes.map((n, i) => {
		const p = g.node(`n${i}`);
		return { id: n.id, x: Math.round(p.x ?? 0), y: Math.round(p.y ?? 0) };
	});
}
