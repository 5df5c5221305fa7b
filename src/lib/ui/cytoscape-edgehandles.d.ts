// cytoscape-edgehandles 4 ships no type declarations; this covers the part the canvas uses.
declare module 'cytoscape-edgehandles' {
	import type { Ext } from 'cytoscape';
	const edgehandles: Ext;
	export default edgehandles;
}
