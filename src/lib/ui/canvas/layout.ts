/**
 * Tidy layout of a diagram with dagre (layered drawing of directed graphs after Sugiyama,
 * Tagawa & Toda 1981, as implemented in dagre and wrapped by cytoscape-dagre), run on a
 * headless Cytoscape instance, so it needs no DOM and runs in a worker (layout.worker.ts):
 * at 300 variables and 600 arrows it takes about a second of CPU, which must not freeze
 * the canvas. The node sizes are measured on the main thread (layoutInput) and sent along.
 */
import cytoscape from 'cytoscape';
import dagre from 'cytoscape-dagre';
import type { Diagram } from '../../graph/diagram';
import type { Role } from '../../causal/types';
import { arrowKey, nodeKey, nodeLook, questionOf, type Measure } from './elements';

export interface LayoutInput {
	nodes: { id: string; w: number; h: number }[];
	arrows: { from: string; to: string }[];
}

export type Positions = { id: string; x: number; y: number }[];

let registered = false;
function ensureDagre(): void {
	if (!registered) {
		cytoscape.use(dagre);
		registered = true;
	}
}

/** True when some variable has no position (as in DOT files and hand-written JSON). */
export function needsLayout(d: Diagram): boolean {
	return d.variables.some((v) => typeof v.x !== 'number' || typeof v.y !== 'number');
}

/** What the layout needs: each variable's drawn size, and the arrows. O(n + m). */
export function layoutInput(d: Diagram, measure: Measure, rolesById: ReadonlyMap<string, readonly Role[]> = new Map()): LayoutInput {
	const q = questionOf(d);
	return {
		nodes: d.variables.map((v) => {
			const look = nodeLook(v, rolesById.get(v.id) ?? [], q, measure);
			return { id: v.id, w: look.w, h: look.h };
		}),
		arrows: d.arrows.map((a) => ({ from: a.from, to: a.to }))
	};
}

/** Positions for every variable, arranged top to bottom in the direction of the arrows. */
export function dagrePositions(input: LayoutInput): Positions {
	ensureDagre();
	const cy = cytoscape({
		headless: true,
		styleEnabled: true,
		style: [{ selector: 'node', style: { width: 'data(w)', height: 'data(h)', shape: 'round-rectangle' } }],
		elements: [
			...input.nodes.map((n) => ({ group: 'nodes' as const, data: { id: nodeKey(n.id), w: n.w, h: n.h } })),
			...input.arrows.map((a) => ({ group: 'edges' as const, data: { id: arrowKey(a.from, a.to), source: nodeKey(a.from), target: nodeKey(a.to) } }))
		]
	});
	try {
		cy.layout({ name: 'dagre', rankDir: 'TB', nodeSep: 36, rankSep: 80, edgeSep: 12, fit: false, animate: false } as cytoscape.LayoutOptions).run();
		return input.nodes.map((n) => {
			const p = cy.getElementById(nodeKey(n.id)).position();
			return { id: n.id, x: Math.round(p.x), y: Math.round(p.y) };
		});
	} finally {
		cy.destroy();
	}
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
