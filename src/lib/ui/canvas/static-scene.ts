/**
 * The first view of the canvas, before Cytoscape is loaded: the diagram as plain SVG shapes
 * with the canvas's own geometry (each variable's box and text from `nodeLook`, the same fit as
 * `Viewport.fit`), so that the picture does not move when Cytoscape takes over.
 *
 * Why not the exporter's SVG (src/lib/export/svg.ts): its figure uses fixed Arial metrics, a
 * legend and its own badge line, so its boxes differ from the canvas's and the swap would jump.
 * Why a first view at all: on a cold load Cytoscape's evaluation, construction, fit and first
 * draw, and the compositor commits of its canvases, were most of the main thread's work before
 * the page could answer (Chromium profile, bench/RESULTS.md section 6). O(n + m).
 */
import type { Diagram } from '../../graph/diagram';
import type { Role } from '../../causal';
import { nodeLook, questionOf, type Measure } from './elements';
import { LABEL_FONT_PX, LINE_HEIGHT } from './style';
import { FIT_PADDING, MAX_FIT_ZOOM, MIN_ZOOM } from './viewport';

/** Above this many variables the canvas loads Cytoscape at once: a large SVG costs as much to lay out and paint. */
export const STATIC_VIEW_MAX_VARIABLES = 300;

/** Node borders of style.ts. */
const BORDER = 1.5;
const UNMEASURED_BORDER = 2;
/** The note mark's distance from the arrow's start (`source-text-offset` in style.ts). */
const NOTE_OFFSET = 22;
/** Cytoscape's triangle at `arrow-scale: 1.3` on a 2 px edge: max((2·13.37)^0.9, 29)·1.3·0.3 px long and wide. */
const ARROW_SIZE = 29 * 1.3 * 0.3;

export interface StaticNode {
	id: string;
	x: number;
	y: number;
	w: number;
	h: number;
	/** Text lines, centred; the second (if any) is the badge line. */
	lines: string[];
	exposure: boolean;
	outcome: boolean;
	unmeasured: boolean;
	planned: boolean;
}

export interface StaticArrow {
	key: string;
	/** The line, from the source's border to the base of the arrowhead. */
	x1: number;
	y1: number;
	x2: number;
	y2: number;
	/** The arrowhead's three corners, "x,y x,y x,y". */
	head: string;
	/** The middle of the drawn arrow, from border to tip (Cytoscape's midpoint of a straight edge). */
	mid: { x: number; y: number };
	/** Where the note mark (NOTE_MARK) goes, for an arrow with a note. */
	note: { x: number; y: number } | null;
}

export interface StaticScene {
	nodes: StaticNode[];
	arrows: StaticArrow[];
	zoom: number;
	pan: { x: number; y: number };
	/** Model units per text line, for placing the lines. */
	lineStep: number;
}

/** Where the segment from a box's centre towards (tx, ty) leaves the box (half sizes hw, hh). */
function border(cx: number, cy: number, hw: number, hh: number, tx: number, ty: number): { x: number; y: number } {
	const dx = tx - cx;
	const dy = ty - cy;
	if (dx === 0 && dy === 0) return { x: cx, y: cy };
	const t = Math.min(dx === 0 ? Infinity : hw / Math.abs(dx), dy === 0 ? Infinity : hh / Math.abs(dy));
	return { x: cx + dx * t, y: cy + dy * t };
}

/** The fit of `Viewport.fit` over the nodes' outer boxes, in a `width` × `height` view. */
function fitOf(nodes: readonly StaticNode[], width: number, height: number): { zoom: number; pan: { x: number; y: number } } {
	if (nodes.length === 0) return { zoom: 1, pan: { x: width / 2, y: height / 2 } };
	let x1 = Infinity;
	let y1 = Infinity;
	let x2 = -Infinity;
	let y2 = -Infinity;
	for (const n of nodes) {
		const b = (n.unmeasured ? UNMEASURED_BORDER : BORDER) / 2;
		x1 = Math.min(x1, n.x - n.w / 2 - b);
		x2 = Math.max(x2, n.x + n.w / 2 + b);
		y1 = Math.min(y1, n.y - n.h / 2 - b);
		y2 = Math.max(y2, n.y + n.h / 2 + b);
	}
	const fitted = Math.min((width - 2 * FIT_PADDING) / (x2 - x1), (height - 2 * FIT_PADDING) / (y2 - y1));
	const zoom = Math.max(MIN_ZOOM, Math.min(MAX_FIT_ZOOM, fitted));
	const centred = { x: (width - zoom * (x1 + x2)) / 2, y: (height - zoom * (y1 + y2)) / 2 };
	// Too large even at the smallest zoom: show the top-left corner, as the viewport does.
	if ((x2 - x1) * zoom > width || (y2 - y1) * zoom > height) return { zoom, pan: { x: FIT_PADDING - zoom * x1, y: FIT_PADDING - zoom * y1 } };
	return { zoom, pan: centred };
}

const arrowSceneKey = (from: string, to: string) => `${from}\u0000${to}`;

export interface Box {
	x: number;
	y: number;
	width: number;
	height: number;
}

/**
 * What the first view shows, in page pixels, for the read-only geometry view that browser tests
 * read (create.ts): the same answers as Cytoscape's for the same diagram and view size.
 */
export function sceneGeometry(scene: StaticScene, container: HTMLElement) {
	const page = (x: number, y: number) => {
		const r = container.getBoundingClientRect();
		return { x: r.left + x * scene.zoom + scene.pan.x, y: r.top + y * scene.zoom + scene.pan.y };
	};
	return {
		nodeBox(id: string): Box | null {
			const n = scene.nodes.find((m) => m.id === id);
			if (!n) return null;
			const b = (n.unmeasured ? UNMEASURED_BORDER : BORDER) / 2;
			return { ...page(n.x - n.w / 2 - b, n.y - n.h / 2 - b), width: (n.w + 2 * b) * scene.zoom, height: (n.h + 2 * b) * scene.zoom };
		},
		arrowMidpoint(from: string, to: string): { x: number; y: number } | null {
			const a = scene.arrows.find((m) => m.key === arrowSceneKey(from, to));
			return a ? page(a.mid.x, a.mid.y) : null;
		},
		counts: () => ({ variables: scene.nodes.length, arrows: scene.arrows.length }),
		zoom: () => scene.zoom
	};
}

export function staticScene(d: Diagram, roles: ReadonlyMap<string, readonly Role[]>, measure: Measure, width: number, height: number): StaticScene {
	const q = questionOf(d);
	const byId = new Map<string, StaticNode>();
	const nodes = d.variables.map((v) => {
		const look = nodeLook(v, roles.get(v.id) ?? [], q, measure);
		const node: StaticNode = {
			id: v.id,
			x: v.x ?? 0,
			y: v.y ?? 0,
			w: look.w,
			h: look.h,
			lines: look.text.split('\n'),
			exposure: q.exposures.has(v.id),
			outcome: q.outcomes.has(v.id),
			unmeasured: !v.measured,
			planned: q.adjusted.has(v.id)
		};
		byId.set(v.id, node);
		return node;
	});
	const arrows: StaticArrow[] = [];
	for (const a of d.arrows) {
		const s = byId.get(a.from);
		const t = byId.get(a.to);
		if (!s || !t) continue;
		const from = border(s.x, s.y, s.w / 2 + BORDER / 2, s.h / 2 + BORDER / 2, t.x, t.y);
		const tip = border(t.x, t.y, t.w / 2 + BORDER / 2, t.h / 2 + BORDER / 2, s.x, s.y);
		const len = Math.hypot(tip.x - from.x, tip.y - from.y) || 1;
		const ux = (tip.x - from.x) / len;
		const uy = (tip.y - from.y) / len;
		const base = { x: tip.x - ux * ARROW_SIZE, y: tip.y - uy * ARROW_SIZE };
		const half = ARROW_SIZE / 2;
		const head = [tip, { x: base.x - uy * half, y: base.y + ux * half }, { x: base.x + uy * half, y: base.y - ux * half }].map((p) => `${p.x},${p.y}`).join(' ');
		const note = a.note?.trim() ? { x: from.x + ux * NOTE_OFFSET, y: from.y + uy * NOTE_OFFSET } : null;
		const mid = { x: (from.x + tip.x) / 2, y: (from.y + tip.y) / 2 };
		arrows.push({ key: arrowSceneKey(a.from, a.to), x1: from.x, y1: from.y, x2: base.x, y2: base.y, head, mid, note });
	}
	return { nodes, arrows, ...fitOf(nodes, width, height), lineStep: LABEL_FONT_PX * LINE_HEIGHT };
}
