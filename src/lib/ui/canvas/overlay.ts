/**
 * Selection and highlights, drawn on a canvas of our own laid over Cytoscape's.
 *
 * Why: any change of an element's style (a `:selected` rule, a class) makes Cytoscape's
 * renderer invalidate its layered texture cache and redraw every element one by one for the
 * next frames — 60–190 ms a frame at 1,000 variables in software rendering (profiled in
 * headless Chromium; docs/editor.md). Selection and highlights change far more often than
 * the diagram, so they never touch Cytoscape: this layer draws them from the elements'
 * rendered geometry, after each Cytoscape frame and whenever they change, in time
 * proportional to what is selected or lit, not to the size of the diagram.
 *
 * What it draws (the visual language of DESIGN.md; colour is never the only cue):
 *  - the planned set: the square box around each adjusted variable (a planned-set edit, the
 *    most frequent edit, then never restyles the scene);
 *  - selection: a ring around each selected variable, a wide translucent band along each
 *    selected arrow;
 *  - a highlight: everything else veiled (as if faded), the lit variables cut out of the
 *    veil, and the lit path's arrows drawn over it: causal solid blue, open non-causal dashed
 *    orange, blocked thin dotted grey, each with its arrowhead; lit variables get a ring;
 *  - a refused cycle (dashed orange, for a few seconds) and the keyboard's arrow target (ring).
 * `marksOf` / `arrowMarksOf` name what is drawn on an element, for tests and assistive tools.
 */
import type { Core, EdgeSingular, NodeSingular } from 'cytoscape';
import type { Selection } from '../../editor/selection';
import type { Highlight } from '../highlight';
import { arrowKey, nodeKey } from './elements';
import { palette } from '../../palette';

export interface OverlayState {
	/** The planned (adjusted) set: drawn inside a square box. */
	planned: readonly string[];
	selection: Selection;
	highlight: Highlight | null;
	/** Ids of a refused cycle, first and last the same. */
	cycle: readonly string[] | null;
	/** The keyboard's candidate target while drawing an arrow. */
	target: string | null;
}

const VEIL = 'rgba(251, 251, 248, 0.72)';
/** Space between a variable's border and its planned-set box, in diagram units. */
const PLANNED_GAP = 5;

type Point = { x: number; y: number };

export class CanvasOverlay {
	#cy: Core;
	#canvas: HTMLCanvasElement;
	#state: OverlayState = { planned: [], selection: { variables: [], arrows: [] }, highlight: null, cycle: null, target: null };
	#frame = 0;
	#width = 0;
	#height = 0;
	#ratio = 1;

	constructor(cy: Core, canvas: HTMLCanvasElement) {
		this.#cy = cy;
		this.#canvas = canvas;
		// After each of Cytoscape's frames (pan, zoom, drag, edits), in the same frame.
		cy.on('render', this.#onRender);
	}

	#onRender = () => this.draw();

	set(change: Partial<OverlayState>): void {
		this.#state = { ...this.#state, ...change };
		if (this.#frame) return;
		this.#frame = requestAnimationFrame(() => {
			this.#frame = 0;
			this.draw();
		});
	}

	resize(width: number, height: number): void {
		this.#ratio = window.devicePixelRatio || 1;
		this.#width = width;
		this.#height = height;
		this.#canvas.width = Math.max(1, Math.round(width * this.#ratio));
		this.#canvas.height = Math.max(1, Math.round(height * this.#ratio));
		this.#canvas.style.width = `${width}px`;
		this.#canvas.style.height = `${height}px`;
		this.draw();
	}

	destroy(): void {
		this.#cy.off('render', this.#onRender);
		if (this.#frame) cancelAnimationFrame(this.#frame);
	}

	/** Names of what is drawn on a variable: planned, selected, hl-node, hl-on-path, faded, kbd-target. */
	marksOf(id: string): string[] {
		const s = this.#state;
		const marks: string[] = [];
		if (s.planned.includes(id)) marks.push('planned');
		if (s.selection.variables.includes(id)) marks.push('selected');
		const h = s.highlight;
		if (h) {
			const lit = h.kind === 'variables' ? h.ids.includes(id) : h.nodes.includes(id);
			marks.push(lit ? (h.kind === 'variables' ? 'hl-node' : 'hl-on-path') : 'faded');
		}
		if (s.target === id) marks.push('kbd-target');
		return marks;
	}

	/** Names of what is drawn on an arrow: selected, hl-causal / hl-open / hl-blocked, faded, hl-cycle. */
	arrowMarksOf(from: string, to: string): string[] {
		const s = this.#state;
		const marks: string[] = [];
		if (s.selection.arrows.some((a) => a.from === from && a.to === to)) marks.push('selected');
		const h = s.highlight;
		if (h) marks.push(h.kind === 'path' && onPath(h.nodes, from, to) ? `hl-${h.style}` : 'faded');
		if (s.cycle && onPath(s.cycle, from, to, true)) marks.push('hl-cycle');
		return marks;
	}

	/** Draws the current state now. O(selected + lit elements). */
	draw(): void {
		const ctx = this.#canvas.getContext('2d');
		if (!ctx) return;
		ctx.setTransform(this.#ratio, 0, 0, this.#ratio, 0, 0);
		ctx.clearRect(0, 0, this.#width, this.#height);
		const { planned, selection, highlight, cycle, target } = this.#state;
		const zoom = this.#cy.zoom();
		if (highlight) this.#drawHighlight(ctx, highlight, zoom);
		const lit = highlight ? new Set(highlight.kind === 'variables' ? highlight.ids : highlight.nodes) : null;
		for (const id of planned) this.#plannedBox(ctx, id, zoom, lit === null || lit.has(id) ? 1 : 0.28);
		if (cycle) for (let i = 1; i < cycle.length; i++) this.#strokeArrow(ctx, cycle[i - 1], cycle[i], palette.openPath, 5 * zoom, [10 * zoom, 5 * zoom]);
		for (const a of selection.arrows) {
			const e = this.#edge(a.from, a.to);
			if (e) band(ctx, e.renderedSourceEndpoint(), e.renderedTargetEndpoint(), palette.selection, Math.max(8, 14 * zoom));
		}
		for (const id of selection.variables) this.#ring(ctx, id, palette.selection, zoom, 0.85);
		if (target) this.#ring(ctx, target, palette.causalPath, zoom, 0.85);
	}

	#drawHighlight(ctx: CanvasRenderingContext2D, h: Highlight, zoom: number): void {
		ctx.fillStyle = VEIL;
		ctx.fillRect(0, 0, this.#width, this.#height);
		const lit = h.kind === 'variables' ? h.ids : h.nodes;
		// Cut the lit variables out of the veil, so they show at full strength.
		ctx.save();
		ctx.globalCompositeOperation = 'destination-out';
		ctx.fillStyle = palette.monoInk; // any opaque colour: only the alpha cuts
		for (const id of lit) {
			const box = this.#box(id, 6 * zoom);
			if (box) {
				roundRect(ctx, box, 8 * zoom);
				ctx.fill();
			}
		}
		ctx.restore();
		if (h.kind === 'variables') {
			for (const id of lit) this.#ring(ctx, id, palette.openPath, zoom, 0.6);
			return;
		}
		const look = {
			causal: { colour: palette.causalPath, width: 5, dash: [] as number[] },
			open: { colour: palette.openPath, width: 5, dash: [10, 5] },
			blocked: { colour: palette.blockedPath, width: 2.5, dash: [2, 4] }
		}[h.style];
		for (let i = 1; i < h.nodes.length; i++) {
			const [p, q] = [h.nodes[i - 1], h.nodes[i]];
			const forward = this.#edge(p, q);
			this.#strokeArrow(ctx, forward ? p : q, forward ? q : p, look.colour, look.width * zoom, look.dash.map((d) => d * zoom));
		}
	}

	#edge(from: string, to: string): EdgeSingular | null {
		const e = this.#cy.getElementById(arrowKey(from, to));
		return e.empty() ? null : (e as EdgeSingular);
	}

	#node(id: string): NodeSingular | null {
		const n = this.#cy.getElementById(nodeKey(id));
		return n.empty() ? null : (n as NodeSingular);
	}

	/** The square box around an adjusted variable, as the literature draws a conditioned one. */
	#plannedBox(ctx: CanvasRenderingContext2D, id: string, zoom: number, alpha: number): void {
		const n = this.#node(id);
		if (!n) return;
		const p = n.renderedPosition();
		const gap = PLANNED_GAP * zoom;
		const w = n.renderedOuterWidth() + 2 * gap;
		const h = n.renderedOuterHeight() + 2 * gap;
		ctx.save();
		ctx.globalAlpha = alpha;
		ctx.strokeStyle = palette.text;
		ctx.lineWidth = Math.max(1.5, 2.5 * zoom);
		ctx.strokeRect(p.x - w / 2, p.y - h / 2, w, h);
		ctx.restore();
	}

	/** The variable's rendered box (with its border, and the planned set's square), padded. */
	#box(id: string, pad: number): { x: number; y: number; w: number; h: number } | null {
		const n = this.#node(id);
		if (!n) return null;
		const p = n.renderedPosition();
		const outline = this.#state.planned.includes(id) ? (PLANNED_GAP + 1.5) * this.#cy.zoom() : 0;
		const w = n.renderedOuterWidth() + 2 * (pad + outline);
		const h = n.renderedOuterHeight() + 2 * (pad + outline);
		return { x: p.x - w / 2, y: p.y - h / 2, w, h };
	}

	#ring(ctx: CanvasRenderingContext2D, id: string, colour: string, zoom: number, alpha: number): void {
		const box = this.#box(id, 5 * zoom);
		if (!box) return;
		ctx.save();
		ctx.globalAlpha = alpha;
		ctx.strokeStyle = colour;
		ctx.lineWidth = Math.max(3, 5 * zoom);
		roundRect(ctx, box, 8 * zoom);
		ctx.stroke();
		ctx.restore();
	}

	/** The arrow from → to as a stroked line with its arrowhead at the target's border. */
	#strokeArrow(ctx: CanvasRenderingContext2D, from: string, to: string, colour: string, width: number, dash: number[]): void {
		const e = this.#edge(from, to);
		if (!e) return;
		const a = e.renderedSourceEndpoint();
		const b = e.renderedTargetEndpoint();
		const length = Math.hypot(b.x - a.x, b.y - a.y);
		if (length < 1) return;
		const ux = (b.x - a.x) / length;
		const uy = (b.y - a.y) / length;
		const head = Math.min(length / 2, Math.max(9, 2.6 * width));
		const base = { x: b.x - ux * head, y: b.y - uy * head };
		ctx.save();
		ctx.strokeStyle = colour;
		ctx.fillStyle = colour;
		ctx.lineWidth = Math.max(1.5, width);
		ctx.setLineDash(dash);
		ctx.beginPath();
		ctx.moveTo(a.x, a.y);
		ctx.lineTo(base.x, base.y);
		ctx.stroke();
		ctx.setLineDash([]);
		const half = head * 0.55;
		ctx.beginPath();
		ctx.moveTo(b.x, b.y);
		ctx.lineTo(base.x - uy * half, base.y + ux * half);
		ctx.lineTo(base.x + uy * half, base.y - ux * half);
		ctx.closePath();
		ctx.fill();
		ctx.restore();
	}
}

/** True when from–to are consecutive on the path (either way, unless `directed`). */
function onPath(nodes: readonly string[], from: string, to: string, directed = false): boolean {
	for (let i = 1; i < nodes.length; i++) {
		if (nodes[i - 1] === from && nodes[i] === to) return true;
		if (!directed && nodes[i - 1] === to && nodes[i] === from) return true;
	}
	return false;
}

function band(ctx: CanvasRenderingContext2D, a: Point, b: Point, colour: string, width: number): void {
	ctx.save();
	ctx.globalAlpha = 0.55;
	ctx.strokeStyle = colour;
	ctx.lineWidth = width;
	ctx.lineCap = 'round';
	ctx.beginPath();
	ctx.moveTo(a.x, a.y);
	ctx.lineTo(b.x, b.y);
	ctx.stroke();
	ctx.restore();
}

function roundRect(ctx: CanvasRenderingContext2D, r: { x: number; y: number; w: number; h: number }, radius: number): void {
	ctx.beginPath();
	ctx.roundRect(r.x, r.y, r.w, r.h, Math.min(radius, r.w / 2, r.h / 2));
}
