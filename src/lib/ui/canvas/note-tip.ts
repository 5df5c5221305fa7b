/**
 * Where the note of a variable or an arrow is shown (NoteTip.svelte): below the variable's
 * box, or beside the arrow's middle, in canvas pixels.
 */
import type { Diagram } from '../../graph/diagram';
import type { Pointed } from './pointer-events';
import type { Viewport } from './viewport';
import { labelIn } from './announce';

export interface NoteTipPlace {
	text: string;
	left: number;
	top: number;
	of: string;
}

export function placeNote(d: Diagram, target: Pointed, view: Viewport, container: HTMLElement): NoteTipPlace | null {
	// The note first: the page's box is read (a forced layout, ~100 ms on a 1,000-variable
	// page just edited) only when there is a note to place.
	if ('variable' in target) {
		const note = d.variables.find((v) => v.id === target.variable)?.note;
		const box = note ? view.clientBox(target.variable) : null;
		if (!note || !box) return null;
		const r = container.getBoundingClientRect();
		return { text: note, left: box.x - r.left, top: box.y - r.top + box.height + 6, of: labelIn(d, target.variable) };
	}
	const { from, to } = target.arrow;
	const note = d.arrows.find((x) => x.from === from && x.to === to)?.note;
	const mid = note ? view.arrowMidpoint(from, to) : null;
	if (!note || !mid) return null;
	const r = container.getBoundingClientRect();
	return { text: note, left: mid.x - r.left + 8, top: mid.y - r.top + 8, of: `${labelIn(d, from)} → ${labelIn(d, to)}` };
}
