/**
 * Tidy layout of a diagram with dagre (layered drawing of directed graphs after Sugiyama,
 * Tagawa & Toda 1981, as implemented in dagre and wrapped by cytoscape-dagre), run on a
 * headless Cytoscape instance so it needs no canvas. Node sizes are those the canvas will
 * draw. O((n + m) log(n + m)) in practice for the sizes the app handles.
 */
import cytoscape from 'cytoscape';
import dagre from 'cytoscape-dagre';
import type { Diagram } from '../../graph/diagram';
import type { Role } from '../../causal/types';
import { arrowDefinition, nodeDefinition, nodeKey, nodeLook, questionOf, type Measure } from './elements';

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

/** Positions for every variable, arranged top to bottom in the direction of the arrows. */
export function tidyPositions(
	d: Diagram,
	measure: Measure,
	rolesById: ReadonlyMap<string, readonly Role[]> = new Map()
): { id: string; x: number; y: number }[] {
	ensureDagre();
	const q = questionOf(d);
	const cy = cytoscape({
		headless: true,
		styleEnabled: true,
		style: [{ selector: 'node', style: { width: 'data(w)', height: 'data(h)', shape: 'round-rectangle' } }],
		elements: [
			...d.variables.map((v) => nodeDefinition(v, nodeLook(v, rolesById.get(v.id) ?? [], q, measure))),
			...d.arrows.map((a) => arrowDefinition(a.from, a.to))
		]
	});
	try {
		cy.layout({ name: 'dagre', rankDir: 'TB', nodeSep: 36, rankSep: 80, edgeSep: 12, fit: false, animate: false } as cytoscape.LayoutOptions).run();
		return d.variables.map((v) => {
			const p = cy.getElementById(nodeKey(v.id)).position();
			return { id: v.id, x: Math.round(p.x), y: Math.round(p.y) };
		});
	} finally {
		cy.destroy();
	}
}

/** The diagram with every variable placed by tidyPositions. */
export function withTidyLayout(d: Diagram, measure: Measure): Diagram {
	const at = new Map(tidyPositions(d, measure).map((p) => [p.id, p]));
	return { ...d, variables: d.variables.map((v) => ({ ...v, x: at.get(v.id)?.x ?? 0, y: at.get(v.id)?.y ?? 0 })) };
}
