/**
 * The canvas's context menus: which one opens (a variable's, an arrow's or the background's),
 * its title, and where it opens when asked for by keyboard (Shift+F10, the Menu key). The
 * items are the actions table's (actions/canvas-actions.ts).
 */
import { freeSpot } from '../../editor/placement';
import { singleArrow, singleVariable } from '../../editor/selection';
import { menuItems, type CanvasContext, type MenuKind } from '../actions/canvas-actions';
import type { MenuItem } from '../actions/menu-item';
import type { Pointed } from './pointer-events';
import type { Point, Viewport } from './viewport';

export interface OpenMenu {
	x: number;
	y: number;
	title: string;
	items: MenuItem[];
}

/** The menu of a variable, an arrow or (null) the background at a spot of the diagram. */
export function menuFor(ctx: CanvasContext, view: Viewport | null, target: Pointed | null, at: Point, model?: Point): OpenMenu | null {
	const d = ctx.editor.diagram;
	let kind: MenuKind = 'background';
	let title = 'Diagram';
	if (target && 'variable' in target) {
		if (!d.variables.some((x) => x.id === target.variable)) return null;
		kind = 'variable';
		title = ctx.labelOf(target.variable);
	} else if (target) {
		kind = 'arrow';
		title = `${ctx.labelOf(target.arrow.from)} → ${ctx.labelOf(target.arrow.to)}`;
	}
	const spot = () => model ?? freeSpot(view?.centre() ?? { x: 0, y: 0 }, d.variables);
	return { ...at, title, items: menuItems(ctx, kind, target ?? { at: spot() }) };
}

/** The menu of the selection, opened below the selected variable, at the selected arrow, else mid-canvas. */
export function keyboardMenu(ctx: CanvasContext, view: Viewport | null, container: HTMLElement): OpenMenu | null {
	const r = container.getBoundingClientRect();
	const corner = { x: r.left + 40, y: r.top + 40 };
	const v = singleVariable(ctx.editor.selection);
	const a = singleArrow(ctx.editor.selection);
	if (v) {
		const box = view?.clientBox(v);
		return menuFor(ctx, view, { variable: v }, box ? { x: box.x + box.width / 2, y: box.y + box.height } : corner);
	}
	if (a) return menuFor(ctx, view, { arrow: a }, view?.arrowMidpoint(a.from, a.to) ?? corner);
	return menuFor(ctx, view, null, { x: r.left + r.width / 2, y: r.top + r.height / 2 }, view?.centre());
}
