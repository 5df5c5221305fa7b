/**
 * Making the Cytoscape view: its options, the overlay that draws selection and highlights,
 * the arrow-drawing gesture, resizing with the page, and the read-only geometry view that
 * browser tests and assistive tooling read (`window.__causewayCanvas`).
 */
import type { Core } from 'cytoscape';
import type cytoscapeType from 'cytoscape';
import { canvasStyle } from './style';
import { arrowKey, nodeKey } from './elements';
import { attachEdgeHandles, type EdgeHandles } from './edgehandles';
import { CanvasOverlay } from './overlay';
import { MAX_ZOOM, MIN_ZOOM, Viewport } from './viewport';

export interface CanvasParts {
	cy: Core;
	overlay: CanvasOverlay;
	eh: EdgeHandles;
	view: Viewport;
	destroy(): void;
}

/** The read-only geometry view's methods (tests/e2e/helpers.ts declares their types). */
const GEOMETRY_METHODS = ['nodeBox', 'arrowMidpoint', 'nodeClasses', 'arrowClasses', 'counts', 'zoom'] as const;
type GeometryView = Record<(typeof GEOMETRY_METHODS)[number], (...args: string[]) => unknown>;
type GeometryHost = { __causewayCanvas: GeometryView };

/**
 * The geometry view while the canvas shows its first view: the geometry from the picture
 * (`firstView`, static-scene.ts) while it is drawn, else — and for the classes, which the
 * overlay knows — a promise of the real view's answer, asking for Cytoscape (`whenReady`).
 */
export function deferGeometryView(whenReady: (run: () => void) => void, firstView: () => Partial<GeometryView> | null): void {
	const host = window as unknown as GeometryHost;
	const later = (name: (typeof GEOMETRY_METHODS)[number], args: string[]) => new Promise((resolve) => whenReady(() => resolve(host.__causewayCanvas[name](...args))));
	const deferred = Object.fromEntries(
		GEOMETRY_METHODS.map((name) => [
			name,
			(...args: string[]) => {
				const now = firstView()?.[name];
				return now ? now(...args) : later(name, args);
			}
		])
	) as GeometryView;
	host.__causewayCanvas = deferred;
}

export function createCanvas(cytoscape: typeof cytoscapeType, container: HTMLElement, overlayCanvas: HTMLCanvasElement, onResize: () => void): CanvasParts {
	const cy = cytoscape({
		container,
		style: canvasStyle,
		minZoom: MIN_ZOOM,
		maxZoom: MAX_ZOOM,
		boxSelectionEnabled: true,
		// Selection lives in the editor and is drawn by the overlay (overlay.ts):
		// Cytoscape's own selection would restyle elements and redraw the whole scene.
		autounselectify: true
	});
	const overlay = new CanvasOverlay(cy, overlayCanvas);
	const eh = attachEdgeHandles(cy, {
		canConnect: (s, t) => !s.same(t) && !t.hasClass('eh-ghost'),
		edgeParams: () => ({}),
		hoverDelay: 0,
		snap: true,
		snapThreshold: 30,
		snapFrequency: 30,
		noEdgeEventsInDraw: true,
		disableBrowserGestures: true
	});
	const view = new Viewport(cy, container);
	const observer = new ResizeObserver(() => {
		cy.resize();
		overlay.resize(container.clientWidth, container.clientHeight);
		onResize();
	});
	observer.observe(container);
	(window as unknown as GeometryHost).__causewayCanvas = {
		nodeBox: (id: string) => view.clientBox(id),
		arrowMidpoint: (from: string, to: string) => view.arrowMidpoint(from, to),
		nodeClasses: (id: string) => [...cy.getElementById(nodeKey(id)).classes(), ...overlay.marksOf(id)],
		arrowClasses: (from: string, to: string) => [...cy.getElementById(arrowKey(from, to)).classes(), ...overlay.arrowMarksOf(from, to)],
		counts: () => ({ variables: cy.nodes('[vid]').length, arrows: cy.edges('[from]').length }),
		zoom: () => cy.zoom()
	};
	return {
		cy,
		overlay,
		eh,
		view,
		destroy() {
			observer.disconnect();
			overlay.destroy();
			eh.destroy();
			cy.destroy();
		}
	};
}
