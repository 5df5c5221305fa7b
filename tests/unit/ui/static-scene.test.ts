/**
 * The canvas's first view (src/lib/ui/canvas/static-scene.ts): the boxes are the canvas's own
 * (nodeLook), the fit is the viewport's (margin 48, zoom at most 1.25, a too-large diagram shows
 * its top-left corner), and each arrow runs from the source's border to its head, whose tip
 * touches the target's border.
 */
import { describe, expect, it } from 'vitest';
import { emptyDiagram, type Diagram } from '../../../src/lib/graph/diagram';
import { staticScene } from '../../../src/lib/ui/canvas/static-scene';
import { nodeLook, questionOf, type Measure } from '../../../src/lib/ui/canvas/elements';

const measure: Measure = (text, px) => text.length * px * 0.5;
const v = (id: string, x: number, y: number, measured = true) => ({ id, label: id.toUpperCase(), measured, x, y });
const diagram = (): Diagram => ({
	...emptyDiagram(),
	variables: [v('a', 0, 0), v('b', 300, 0), v('u', 150, -150, false)],
	arrows: [
		{ from: 'a', to: 'b', note: 'assumed' },
		{ from: 'u', to: 'a' }
	],
	exposures: ['a'],
	outcomes: ['b'],
	adjusted: []
});

describe('the first view of the canvas', () => {
	it('draws each variable with the canvas box, its roles and its text lines', () => {
		const d = diagram();
		const s = staticScene(d, new Map([['u', ['confounder']]]), measure, 1000, 600);
		const u = s.nodes.find((n) => n.id === 'u')!;
		const look = nodeLook(d.variables[2], ['confounder'], questionOf(d), measure);
		expect([u.w, u.h]).toEqual([look.w, look.h]);
		expect(u.lines).toEqual(look.text.split('\n'));
		expect(u.unmeasured).toBe(true);
		expect(s.nodes.find((n) => n.id === 'a')!.exposure).toBe(true);
		expect(s.nodes.find((n) => n.id === 'b')!.outcome).toBe(true);
	});

	it('fits a small diagram centred at zoom 1.25 at most, and an empty one at 1 around the middle', () => {
		const s = staticScene(diagram(), new Map(), measure, 1000, 600);
		expect(s.zoom).toBe(1.25);
		const xs = s.nodes.flatMap((n) => [n.x - n.w / 2, n.x + n.w / 2]).map((x) => x * s.zoom + s.pan.x);
		expect(Math.min(...xs) + Math.max(...xs)).toBeCloseTo(1000, 0);
		expect(staticScene(emptyDiagram(), new Map(), measure, 800, 400)).toMatchObject({ zoom: 1, pan: { x: 400, y: 200 } });
	});

	it('shrinks a wide diagram to the view with a 48 px margin, and shows the corner of one too large to fit', () => {
		const wide: Diagram = { ...diagram(), variables: [v('a', 0, 0), v('b', 3000, 0), v('u', 1500, -150, false)] };
		const s = staticScene(wide, new Map(), measure, 1000, 600);
		const left = Math.min(...s.nodes.map((n) => n.x - n.w / 2 - 1)) * s.zoom + s.pan.x;
		expect(left).toBeCloseTo(48, 0);
		const huge: Diagram = { ...diagram(), variables: [v('a', 0, 0), v('b', 100_000, 0), v('u', 150, -150, false)] };
		const h = staticScene(huge, new Map(), measure, 1000, 600);
		expect(h.zoom).toBe(0.15);
		expect(Math.min(...h.nodes.map((n) => n.x - n.w / 2 - 1)) * h.zoom + h.pan.x).toBeCloseTo(48, 0);
	});

	it('runs an arrow from the border of its source to a head touching the border of its target', () => {
		const s = staticScene(diagram(), new Map(), measure, 1000, 600);
		const ab = s.arrows.find((x) => x.key === 'a\u0000b')!;
		const a = s.nodes.find((n) => n.id === 'a')!;
		const b = s.nodes.find((n) => n.id === 'b')!;
		expect(ab.x1).toBeCloseTo(a.x + a.w / 2 + 0.75);
		const tip = ab.head.split(' ')[0].split(',').map(Number);
		expect(tip[0]).toBeCloseTo(b.x - b.w / 2 - 0.75);
		expect(ab.x2).toBeLessThan(tip[0]);
		expect(ab.note).not.toBeNull();
		expect(s.arrows.find((x) => x.key === 'u\u0000a')!.note).toBeNull();
	});
});
