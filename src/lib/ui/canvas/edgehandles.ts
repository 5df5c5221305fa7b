/**
 * Typed access to cytoscape-edgehandles 4 (the gesture that draws an arrow from one node to
 * another, with snapping and a preview). The package has no type declarations.
 */
import cytoscape, { type Core, type NodeSingular, type Position } from 'cytoscape';
import edgehandles from 'cytoscape-edgehandles';

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

let registered = false;

export function attachEdgeHandles(cy: Core, options: EdgeHandlesOptions): EdgeHandles {
	if (!registered) {
		cytoscape.use(edgehandles);
		registered = true;
	}
	return (cy as unknown as { edgehandles(o: EdgeHandlesOptions): EdgeHandles }).edgehandles(options);
}
