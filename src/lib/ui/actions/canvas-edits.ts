/**
 * The edits and selection moves that canvas actions run: each one editor command or one
 * change of the selection, so that it can be refused or undone like any other edit.
 */
import type { Editor } from '../../editor/editor.svelte';
import { firstInReadingOrder, nearestInDirection, type Direction } from '../../editor/navigation';
import { singleArrow, singleVariable, type ArrowRef } from '../../editor/selection';

export type RoleList = 'exposures' | 'outcomes' | 'adjusted';

export function toggleRole(editor: Editor, id: string, list: RoleList): void {
	editor.dispatch({ kind: 'set-role', list, id, member: !editor.diagram[list].includes(id) });
}

export function toggleMeasured(editor: Editor, id: string): void {
	const v = editor.diagram.variables.find((x) => x.id === id);
	if (v) editor.dispatch({ kind: 'set-measured', id, measured: !v.measured });
}

/** Deletes the one variable or arrow named, else the whole selection. */
export function deleteElements(editor: Editor, one: { variable: string } | { arrow: ArrowRef } | null): void {
	if (one && 'variable' in one) editor.dispatch({ kind: 'remove-elements', ids: [one.variable], arrows: [] });
	else if (one) editor.dispatch({ kind: 'remove-elements', ids: [], arrows: [one.arrow] });
	else editor.dispatch({ kind: 'remove-elements', ids: editor.selection.variables, arrows: editor.selection.arrows });
}

export function reverseArrow(editor: Editor, a: ArrowRef): void {
	const r = editor.dispatch({ kind: 'reverse-arrow', from: a.from, to: a.to });
	if (r.ok) editor.select({ variables: [], arrows: [{ from: a.to, to: a.from }] });
}

export function selectAll(editor: Editor): void {
	editor.select({ variables: editor.diagram.variables.map((v) => v.id), arrows: [] });
}

export const DIRECTIONS: Readonly<Record<string, Direction>> = { ArrowLeft: 'left', ArrowRight: 'right', ArrowUp: 'up', ArrowDown: 'down' };

/** Selects the nearest variable in a direction from the selection (navigation.ts); the first one when nothing is selected. */
export function selectNearest(editor: Editor, dir: Direction): string | null {
	const s = editor.selection;
	const from = singleVariable(s) ?? singleArrow(s)?.to ?? s.variables[0];
	const next = from ? nearestInDirection(editor.diagram.variables, from, dir) : firstInReadingOrder(editor.diagram.variables);
	if (next) editor.select({ variables: [next], arrows: [] });
	return next;
}

/** Moves the selected variables; presses in a burst make one undo step (the editor merges them). */
export function moveSelected(editor: Editor, dir: Direction, step: number): string | null {
	const ids = editor.selection.variables;
	if (ids.length === 0) return null;
	const [dx, dy] = { left: [-step, 0], right: [step, 0], up: [0, -step], down: [0, step] }[dir];
	const moves = ids
		.map((id) => editor.diagram.variables.find((v) => v.id === id))
		.filter((v) => v !== undefined)
		.map((v) => ({ id: v.id, x: (v.x ?? 0) + dx, y: (v.y ?? 0) + dy }));
	editor.dispatch({ kind: 'move-variables', moves }, `nudge:${ids.join('\u0000')}`);
	return ids[0];
}

/**
 * Steps through the arrows touching the selected variable, or the variable the stepping
 * started from while one of its arrows is selected (`anchor` remembers it between presses).
 */
export function stepArrow(editor: Editor, anchor: { id: string | null }, step: 1 | -1): { none: string } | null {
	const s = editor.selection;
	const v = singleVariable(s);
	const a = singleArrow(s);
	const from = v ?? (a && anchor.id && (a.from === anchor.id || a.to === anchor.id) ? anchor.id : a?.from) ?? null;
	if (!from) return null;
	const list = editor.diagram.arrows.filter((x) => x.from === from || x.to === from);
	if (list.length === 0) return { none: from };
	anchor.id = from;
	const at = a ? list.findIndex((x) => x.from === a.from && x.to === a.to) : -1;
	editor.select({ variables: [], arrows: [list[(at + step + list.length) % list.length] ?? list[0]] });
	return null;
}
