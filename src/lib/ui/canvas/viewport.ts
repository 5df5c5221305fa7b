/**
 * The canvas's viewport: fitting, zooming, keeping a variable in view, and converting between
 * the diagram's coordinates, the canvas's and the page's.
 */
import type { Core, EdgeSingular } from 'cytoscape';
import { arrowKey, nodeKey } from './elements';

/** The zoom range of the canvas (create.ts), and the fit's margin and largest zoom (also the first view's, static-scene.ts). */
export const MIN_ZOOM = 0.15;
export const MAX_ZOOM = 3;
export const FIT_PADDING = 48;
export const MAX_FIT_ZOOM = 1.25;

export interface Point {
	x: number;
	y: number;
}

export class Viewport {
	constructor(
		private readonly cy: Core,
		private readonly container: HTMLElement
	) {}

	/** Fits the diagram with a margin, never enlarged past 125 %; an empty one at 100 %. */
	fit(): void {
		const { cy, container } = this;
		if (cy.nodes().empty()) {
			cy.zoom(1);
			cy.pan({ x: container.clientWidth / 2, y: container.clientHeight / 2 });
			return;
		}
		cy.fit(undefined, FIT_PADDING);
		if (cy.zoom() > MAX_FIT_ZOOM) {
			cy.zoom(MAX_FIT_ZOOM);
			cy.center();
			return;
		}
		// Too large to fit even at the smallest zoom (a 1,000-variable diagram): the clamped fit
		// left the drawing off-centre with its top-left corner mid-screen; show that corner.
		const bb = cy.elements().renderedBoundingBox({});
		if (bb.w > container.clientWidth || bb.h > container.clientHeight) cy.panBy({ x: FIT_PADDING - bb.x1, y: FIT_PADDING - bb.y1 });
	}

	/** Zooms about the middle of the canvas. */
	zoomBy(factor: number): void {
		this.cy.zoom({ level: this.cy.zoom() * factor, renderedPosition: { x: this.container.clientWidth / 2, y: this.container.clientHeight / 2 } });
	}

	/** Brings a variable into view when it is outside. */
	ensureVisible(id: string): void {
		const { cy, container } = this;
		const n = cy.getElementById(nodeKey(id));
		if (n.empty()) return;
		const bb = n.renderedBoundingBox({});
		if (bb.x1 < 0 || bb.y1 < 0 || bb.x2 > container.clientWidth || bb.y2 > container.clientHeight) {
			// Animated on small diagrams; on large ones every frame of the animation is a full redraw.
			if (cy.nodes().length <= 100) cy.animate({ center: { eles: n } }, { duration: 150 });
			else cy.center(n);
		}
	}

	/** Diagram coordinates → canvas pixels. */
	toRendered(model: Point): Point {
		const z = this.cy.zoom();
		const p = this.cy.pan();
		return { x: model.x * z + p.x, y: model.y * z + p.y };
	}

	/** Page pixels → diagram coordinates. */
	toModel(clientX: number, clientY: number): Point {
		const r = this.container.getBoundingClientRect();
		const z = this.cy.zoom();
		const p = this.cy.pan();
		return { x: (clientX - r.left - p.x) / z, y: (clientY - r.top - p.y) / z };
	}

	/** The middle of the canvas, in diagram coordinates. */
	centre(): Point {
		const r = this.container.getBoundingClientRect();
		return this.toModel(r.left + this.container.clientWidth / 2, r.top + this.container.clientHeight / 2);
	}

	/** A variable's box in page pixels. */
	clientBox(id: string): { x: number; y: number; width: number; height: number } | null {
		const n = this.cy.getElementById(nodeKey(id));
		if (n.empty()) return null;
		const bb = n.renderedBoundingBox({ includeLabels: false, includeOverlays: false });
		const r = this.container.getBoundingClientRect();
		return { x: r.left + bb.x1, y: r.top + bb.y1, width: bb.w, height: bb.h };
	}

	/** The middle of an arrow in page pixels. */
	arrowMidpoint(from: string, to: string): Point | null {
		const e = this.cy.getElementById(arrowKey(from, to));
		if (e.empty()) return null;
		const p = (e as EdgeSingular).renderedMidpoint();
		const r = this.container.getBoundingClientRect();
		return { x: r.left + p.x, y: r.top + p.y };
	}
}
