/**
 * The geometry of an exported figure, shared by the SVG and TikZ writers: each variable's box
 * (from its position, label and role badges), each arrow's end points on the box borders, and
 * the bounds. Positions are the canvas's (centre of the box, y pointing down). Pure; O(n + m).
 */
import type { Diagram } from '../graph/diagram';
import type { Role, VariableRoles } from '../causal';
import { badges } from '../wording';
import { arialWidth, type TextWidth } from './text-width';

export const LABEL_PX = 14;
export const BADGE_PX = 11;
export const LINE_GAP = 1.25;
const PAD_X = 12;
const PAD_Y = 8;
const MIN_WIDTH = 64;
/** Space between a planned variable's box and the outer box drawn around it. */
export const PLANNED_OFFSET = 4;
/** Gap between an arrow's tip and the border it points at. */
const TIP_GAP = 2;

export interface FigureNode {
	id: string;
	/** The label's lines (a label may hold line breaks). */
	lines: string[];
	/** Role badges in a fixed order ("confounder", "mediator"…), empty when none apply. */
	badges: string[];
	x: number;
	y: number;
	w: number;
	h: number;
	exposure: boolean;
	outcome: boolean;
	planned: boolean;
	unmeasured: boolean;
}

export interface FigureArrow {
	from: string;
	to: string;
	x1: number;
	y1: number;
	x2: number;
	y2: number;
}

export interface Figure {
	nodes: FigureNode[];
	arrows: FigureArrow[];
	/** Bounds of every box (outer boxes included). */
	minX: number;
	minY: number;
	maxX: number;
	maxY: number;
	/** Badges that appear in the figure, in badge order, for the legend. */
	badgesUsed: string[];
}

export interface FigureOptions {
	/** Text widths; defaults to Arial metrics so every export of a diagram is the same. */
	width?: TextWidth;
}

/** The badge line under a label: "confounder · precision". */
export const badgeLine = (tags: readonly string[]): string => tags.join(' · ');

/**
 * Boxes and arrows for a diagram. `roles` are the engine's roles for the question (empty when
 * there is no question yet): exposure and outcome come from the diagram itself. Variables
 * without a position are put in a row under the others, so a figure can always be drawn.
 */
export function figureOf(d: Diagram, roles: readonly VariableRoles[], opts: FigureOptions = {}): Figure {
	const width = opts.width ?? arialWidth;
	const roleOf = new Map(roles.map((r) => [r.id, r.roles]));
	const exposures = new Set(d.exposures);
	const outcomes = new Set(d.outcomes);
	const planned = new Set(d.adjusted);
	const placedYs = d.variables.filter((v) => Number.isFinite(v.y)).map((v) => v.y as number);
	const rolesSeen = new Set<Role>();
	let spareX = 0;
	const spareY = (placedYs.length ? Math.max(...placedYs) : 0) + (placedYs.length ? 120 : 0);
	const nodes: FigureNode[] = d.variables.map((v) => {
		const all = new Set<Role>(roleOf.get(v.id) ?? []);
		if (exposures.has(v.id)) all.add('exposure');
		if (outcomes.has(v.id)) all.add('outcome');
		for (const r of all) rolesSeen.add(r);
		const tags = badges([...all]);
		const lines = v.label.split(/\r\n|\r|\n/);
		const bold = exposures.has(v.id) || outcomes.has(v.id);
		const textW = Math.max(...lines.map((l) => width(l, LABEL_PX, { bold })), tags.length ? width(badgeLine(tags), BADGE_PX, { italic: true }) : 0);
		const w = Math.ceil(Math.max(MIN_WIDTH, textW + 2 * PAD_X));
		const h = Math.ceil(lines.length * LABEL_PX * LINE_GAP + (tags.length ? BADGE_PX * LINE_GAP : 0) + 2 * PAD_Y);
		let x = v.x;
		let y = v.y;
		if (!Number.isFinite(x) || !Number.isFinite(y)) {
			x = spareX + w / 2;
			y = spareY;
			spareX += w + 30;
		}
		return {
			id: v.id,
			lines,
			badges: tags,
			x: x as number,
			y: y as number,
			w,
			h,
			exposure: exposures.has(v.id),
			outcome: outcomes.has(v.id),
			planned: planned.has(v.id),
			unmeasured: !v.measured
		};
	});
	const byId = new Map(nodes.map((n) => [n.id, n]));
	const arrows: FigureArrow[] = [];
	for (const a of d.arrows) {
		const s = byId.get(a.from);
		const t = byId.get(a.to);
		if (!s || !t || s === t) continue;
		const [x1, y1] = borderPoint(s, t.x - s.x, t.y - s.y, 0);
		const [x2, y2] = borderPoint(t, s.x - t.x, s.y - t.y, TIP_GAP);
		arrows.push({ from: a.from, to: a.to, x1, y1, x2, y2 });
	}
	let minX = Infinity;
	let minY = Infinity;
	let maxX = -Infinity;
	let maxY = -Infinity;
	for (const n of nodes) {
		const out = n.planned ? PLANNED_OFFSET + 2 : 1;
		minX = Math.min(minX, n.x - n.w / 2 - out);
		maxX = Math.max(maxX, n.x + n.w / 2 + out);
		minY = Math.min(minY, n.y - n.h / 2 - out);
		maxY = Math.max(maxY, n.y + n.h / 2 + out);
	}
	if (nodes.length === 0) [minX, minY, maxX, maxY] = [0, 0, 0, 0];
	return { nodes, arrows, minX, minY, maxX, maxY, badgesUsed: badges([...rolesSeen]) };
}

/**
 * Where the ray from a box's centre in direction (dx, dy) leaves the box (the outer box for a
 * planned variable), moved `gap` further out. Boxes are drawn as rectangles, so this is exact.
 */
function borderPoint(n: FigureNode, dx: number, dy: number, gap: number): [number, number] {
	const len = Math.hypot(dx, dy);
	if (len === 0) return [n.x, n.y];
	const out = n.planned ? PLANNED_OFFSET + 1 : 0;
	const hw = n.w / 2 + out;
	const hh = n.h / 2 + out;
	const t = Math.min(dx === 0 ? Infinity : hw / Math.abs(dx), dy === 0 ? Infinity : hh / Math.abs(dy));
	const ux = dx / len;
	const uy = dy / len;
	return [n.x + dx * t + ux * gap, n.y + dy * t + uy * gap];
}
