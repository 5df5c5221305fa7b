/**
 * Cytoscape and its edge-drawing extension, loaded when the canvas mounts rather than with
 * the page: together they are about 145 KiB of gzip, most of what the page would otherwise
 * load up front, and the toolbar and the analysis column need none of it (bench section 6).
 */
import type cytoscapeType from 'cytoscape';

let loading: Promise<typeof cytoscapeType> | null = null;

export function loadCytoscape(): Promise<typeof cytoscapeType> {
	loading ??= Promise.all([import('cytoscape'), import('cytoscape-edgehandles')]).then(([{ default: cytoscape }, { default: edgehandles }]) => {
		cytoscape.use(edgehandles);
		return cytoscape;
	});
	return loading;
}
