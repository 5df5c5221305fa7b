/**
 * What is selected on the canvas: variables and/or arrows, by id. Plain data so that the
 * canvas, the side lists and keyboard commands agree on one selection.
 */
export interface ArrowRef {
	from: string;
	to: string;
}

export interface Selection {
	variables: readonly string[];
	arrows: readonly ArrowRef[];
}

export const EMPTY_SELECTION: Selection = { variables: [], arrows: [] };

export function sameArrow(a: ArrowRef, b: ArrowRef): boolean {
	return a.from === b.from && a.to === b.to;
}

export function isEmpty(s: Selection): boolean {
	return s.variables.length === 0 && s.arrows.length === 0;
}

/** The one selected variable when exactly one variable and no arrow is selected. */
export function singleVariable(s: Selection): string | null {
	return s.variables.length === 1 && s.arrows.length === 0 ? s.variables[0] : null;
}

/** The one selected arrow when exactly one arrow and no variable is selected. */
export function singleArrow(s: Selection): ArrowRef | null {
	return s.arrows.length === 1 && s.variables.length === 0 ? s.arrows[0] : null;
}

/** Drops ids that no longer exist (after undo, delete or opening a file). O(n + m + |s|). */
export function pruneSelection(s: Selection, d: { variables: readonly { id: string }[]; arrows: readonly ArrowRef[] }): Selection {
	const ids = new Set(d.variables.map((v) => v.id));
	const variables = s.variables.filter((id) => ids.has(id));
	const arrows = s.arrows.filter((a) => d.arrows.some((b) => sameArrow(a, b)));
	if (variables.length === s.variables.length && arrows.length === s.arrows.length) return s;
	return { variables, arrows };
}
