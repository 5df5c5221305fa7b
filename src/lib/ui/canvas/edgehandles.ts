/**
 * Typed access to cytoscape-edgehandles 4 (the gesture that draws an arrow from one node to
 * another, with snapping and a preview). The package has no type declarations.
 */
import type { Core, NodeSingular, Position } from 'cytoscape';

export interface EdgeHandles {
	start(node: NodeSingular): void;
	update(pos: Position): void;
	snap(): boolean;
	stop(): void;
	destroy(): void;
	active: boolean;
}

export interface EdgeHandlesOptions {
	canConnect(source: NodeSingular, target: NodeSingular): boolean;
	edgeParams(source: NodeSingular, target: NodeSingular): object;
	hoverDelay: number;
	snap: boolean;
	snapThreshold: number;
	snapFrequency: number;
	noEdgeEventsInDraw: boolean;
	disableBrowserGestures: boolean;
}

/** The extension is registered with Cytoscape by load-cytoscape.ts. */
export function attachEdgeHandles(cy: Core, options: EdgeHandlesOptions): EdgeHandles {
	return (cy as unknown as { edgehandles(o: EdgeHandlesOptions): EdgeHandles }).edgehandles(options);
}
