/**
 * What the tidy layout (src/lib/layout) needs from the canvas: each variable's drawn size,
 * measured on the main thread with the canvas's own fonts, and the arrows. O(n + m).
 */
import type { Diagram } from '../../graph/diagram';
import type { Role } from '../../causal';
import type { LayoutInput } from '../../layout';
import { nodeLook, questionOf, type Measure } from './elements';

export function layoutInput(d: Diagram, measure: Measure, rolesById: ReadonlyMap<string, readonly Role[]> = new Map()): LayoutInput {
	const q = questionOf(d);
	return {
		nodes: d.variables.map((v) => {
			const look = nodeLook(v, rolesById.get(v.id) ?? [], q, measure);
			return { id: v.id, w: look.w, h: look.h };
		}),
		arrows: d.arrows.map((a) => ({ from: a.from, to: a.to }))
	};
}
