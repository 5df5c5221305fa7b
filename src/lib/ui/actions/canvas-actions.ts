/**
 * The canvas's actions: one table that the canvas key handler, the three context menus
 * (variable, arrow, background), the keys dialog and the keys table of docs/editor.md all
 * read (tests/unit/ui/actions-table.test.ts keeps the docs equal to it).
 *
 * The keys follow the notation of the causal-inference literature rather than the initials
 * of role names: X the exposure, Y the outcome, Z the set conditioned on (the planned set),
 * H a hidden (unmeasured) variable, V a new variable (a graph is G = (V, E)), > an arrow
 * (the arrowhead of X → Y). docs/editor.md, "Why these keys", gives the reasons.
 */
import type { Editor } from '../../editor/editor.svelte';
import type { Direction } from '../../editor/navigation';
import { singleArrow, singleVariable, type ArrowRef } from '../../editor/selection';
import type { MenuItem } from './menu-item';
import type { Point } from '../canvas/viewport';
import { firstKey, keysText, type Action } from './action';
import { DIRECTIONS, deleteElements, moveSelected, reverseArrow, selectAll, selectNearest, stepArrow, toggleMeasured, toggleRole } from './canvas-edits';

/**
 * What an action acts on: the variable or arrow of its menu, or the one selected when its key
 * is pressed; a spot of the background (its menu); null when the selection is not one thing.
 */
export type Target = { variable: string } | { arrow: ArrowRef } | { at: Point } | null;

export type MenuKind = 'variable' | 'arrow' | 'background';

/**
 * A note or id dialog to open: StudyEdits.svelte's StudyEdit, written out here because the
 * command-line type check (tsconfig.cli.json, which checks the tests) cannot read a type from a component.
 */
export type StudyEdit = { kind: 'note'; variable: string } | { kind: 'note'; arrow: ArrowRef } | { kind: 'id'; variable: string };

/** What the canvas offers its actions. */
export interface CanvasContext {
	readonly editor: Editor;
	/** A path or set from the analysis column is lit on the canvas. */
	readonly highlighted: boolean;
	/** Remembers the variable whose arrows [ and ] step through. */
	readonly arrowAnchor: { id: string | null };
	startNewVariable(at?: Point): void;
	startRename(id: string): void;
	edit(edit: StudyEdit): void;
	beginArrow(from: string): void;
	chooseArrowTarget(dir: Direction): void;
	finishArrow(): void;
	cancelArrow(): void;
	openMenu(): void;
	layout(): void;
	fit(): void;
	zoomBy(factor: number): void;
	ensureVisible(id: string): void;
	announce(text: string): void;
	labelOf(id: string): string;
}

export interface CanvasAction extends Action<CanvasContext, Target> {
	/** Menu words; `words` is the longer description of the keys dialog. */
	label?: string | ((ctx: CanvasContext, target: Target) => string);
	/** For on/off items: whether it is on for the target. */
	checked?: (ctx: CanvasContext, target: Target) => boolean;
}

const variableOf = (t: Target) => (t && 'variable' in t ? t.variable : null);
const arrowOf = (t: Target) => (t && 'arrow' in t ? t.arrow : null);
const isVariable = (_: CanvasContext, t: Target) => variableOf(t) !== null;
const always = () => true;
const oneVariable = () => 'Select one variable first (arrow keys move the selection).';
const dirOf = (key: string | undefined): Direction => DIRECTIONS[key ?? ''] ?? 'right';

/** An on/off mark of the target variable, by its own key. */
function toggle(id: string, key: string, label: string, words: string, on: (ctx: CanvasContext, v: string) => boolean, flip: (ctx: CanvasContext, v: string) => void): CanvasAction {
	return {
		id,
		words,
		keys: [key],
		mode: 'canvas',
		label,
		enabled: isVariable,
		needs: oneVariable,
		checked: (ctx, t) => on(ctx, variableOf(t)!),
		run: (ctx, t) => flip(ctx, variableOf(t)!)
	};
}

const ARROWS = ['ArrowLeft', 'ArrowRight', 'ArrowUp', 'ArrowDown'];

export const CANVAS_ACTIONS: readonly CanvasAction[] = [
	{
		id: 'select-nearest',
		words: 'select the nearest variable in that direction',
		keys: ARROWS,
		shown: 'Arrow keys',
		mode: 'canvas',
		enabled: always,
		run(ctx, _t, pressed) {
			const next = selectNearest(ctx.editor, dirOf(pressed?.key));
			if (next) ctx.ensureVisible(next);
			else if (ctx.editor.diagram.variables.length === 0) ctx.announce(emptyHint());
		}
	},
	{
		id: 'move',
		words: 'move the selected variables (a burst of presses is one undo step)',
		keys: [...ARROWS.map((k) => `Shift+${k}`), ...ARROWS.map((k) => `Alt+Shift+${k}`)],
		shown: 'Shift + arrow keys (Alt for small steps)',
		mode: 'canvas',
		enabled: always,
		run(ctx, _t, pressed) {
			const first = moveSelected(ctx.editor, dirOf(pressed?.key), pressed?.alt ? 5 : 20);
			if (first) ctx.ensureVisible(first);
		}
	},
	{
		id: 'add-variable',
		words: 'add a variable: type its name, Enter (Escape cancels)',
		keys: ['V', 'Insert'],
		mode: 'canvas',
		label: 'Add a variable here',
		enabled: always,
		run: (ctx, t) => ctx.startNewVariable(t && 'at' in t ? t.at : undefined)
	},
	{
		id: 'rename',
		words: 'rename the selected variable in place',
		keys: ['F2', 'Enter'],
		mode: 'canvas',
		label: 'Rename',
		enabled: isVariable,
		run: (ctx, t) => ctx.startRename(variableOf(t)!)
	},
	{
		id: 'delete',
		words: 'delete the selected variables and arrows',
		keys: ['Delete', 'Backspace'],
		mode: 'canvas',
		label: (_, t) => (variableOf(t) ? 'Delete variable' : 'Delete arrow'),
		enabled: (ctx, t) => t !== null || ctx.editor.selection.variables.length + ctx.editor.selection.arrows.length > 0,
		needs: () => 'Nothing selected to delete.',
		run: (ctx, t) => deleteElements(ctx.editor, t && !('at' in t) ? t : null)
	},
	{
		id: 'draw-arrow',
		words: 'draw an arrow from the selected variable: arrow keys choose the target, Enter draws, Escape cancels',
		keys: ['>'],
		mode: 'canvas',
		label: 'Draw an arrow from here',
		enabled: isVariable,
		needs: oneVariable,
		run: (ctx, t) => ctx.beginArrow(variableOf(t)!)
	},
	{
		id: 'step-arrows',
		words: 'step through the arrows of the selected variable',
		keys: ['[', ']'],
		shown: '[ and ]',
		mode: 'canvas',
		enabled: (_, t) => variableOf(t) !== null || arrowOf(t) !== null,
		needs: () => `Select a variable first, then use ${keysText(actionById('step-arrows'))} to step through its arrows.`,
		run(ctx, _t, pressed) {
			const r = stepArrow(ctx.editor, ctx.arrowAnchor, pressed?.key === '[' ? -1 : 1);
			if (r) ctx.announce(`${ctx.labelOf(r.none)} has no arrows.`);
		}
	},
	{
		id: 'reverse',
		words: 'reverse the selected arrow',
		keys: ['R'],
		mode: 'canvas',
		label: 'Reverse arrow',
		enabled: (_, t) => arrowOf(t) !== null,
		needs: () => `Select one arrow first (${keysText(actionById('step-arrows'))} step through the arrows of the selected variable).`,
		run: (ctx, t) => reverseArrow(ctx.editor, arrowOf(t)!)
	},
	{
		id: 'note',
		words: 'write the note of the selected variable or arrow (why it is assumed); Ctrl+Enter saves',
		keys: ['T'],
		mode: 'canvas',
		label: (ctx, t) => (noteOf(ctx, t) ? 'Edit note…' : 'Add a note…'),
		enabled: (_, t) => variableOf(t) !== null || arrowOf(t) !== null,
		needs: () => `Select one variable or arrow first, then press ${keyOf('note')} to write its note.`,
		run(ctx, t) {
			const v = variableOf(t);
			const a = arrowOf(t);
			if (v) ctx.edit({ kind: 'note', variable: v });
			else if (a) ctx.edit({ kind: 'note', arrow: a });
		}
	},
	{
		id: 'change-id',
		words: 'change the id of the variable and every reference to it',
		keys: [],
		mode: 'canvas',
		label: 'Change id…',
		enabled: isVariable,
		run: (ctx, t) => ctx.edit({ kind: 'id', variable: variableOf(t)! })
	},
	toggle('exposure', 'X', 'Exposure', 'exposure on or off', (ctx, v) => ctx.editor.diagram.exposures.includes(v), (ctx, v) => toggleRole(ctx.editor, v, 'exposures')),
	toggle('outcome', 'Y', 'Outcome', 'outcome on or off', (ctx, v) => ctx.editor.diagram.outcomes.includes(v), (ctx, v) => toggleRole(ctx.editor, v, 'outcomes')),
	toggle('planned', 'Z', 'In the planned set', 'in or out of the planned set (the variables to adjust for)', (ctx, v) => ctx.editor.diagram.adjusted.includes(v), (ctx, v) => toggleRole(ctx.editor, v, 'adjusted')),
	toggle('unmeasured', 'H', 'Unmeasured', 'unmeasured (hidden) on or off', (ctx, v) => ctx.editor.diagram.variables.find((x) => x.id === v)?.measured === false, (ctx, v) => toggleMeasured(ctx.editor, v)),
	{ id: 'menu', words: 'the context menu of the selection', keys: ['Shift+F10', 'ContextMenu'], mode: 'canvas', enabled: always, run: (ctx) => ctx.openMenu() },
	{ id: 'select-all', words: 'select all variables', keys: ['Ctrl+A'], mode: 'canvas', enabled: always, run: (ctx) => selectAll(ctx.editor) },
	{
		id: 'layout',
		words: 'tidy layout',
		keys: ['L'],
		mode: 'canvas',
		label: 'Tidy layout',
		enabled: (ctx) => ctx.editor.diagram.variables.length > 0,
		run: (ctx) => ctx.layout()
	},
	{ id: 'fit', words: 'fit the diagram to the window', keys: ['F'], mode: 'canvas', label: 'Fit diagram to window', enabled: always, run: (ctx) => ctx.fit() },
	{ id: 'zoom-in', words: 'zoom in', keys: ['+', '='], shown: '+', mode: 'canvas', enabled: always, run: (ctx) => ctx.zoomBy(1.2) },
	{ id: 'zoom-out', words: 'zoom out', keys: ['-'], mode: 'canvas', enabled: always, run: (ctx) => ctx.zoomBy(1 / 1.2) },
	{
		id: 'clear',
		words: 'clear the selection and highlights',
		keys: ['Escape'],
		mode: 'canvas',
		enabled: (ctx) => ctx.highlighted || ctx.editor.selection.variables.length + ctx.editor.selection.arrows.length > 0,
		run: (ctx) => ctx.editor.select({ variables: [], arrows: [] })
	},
	// While an arrow is being drawn with the keyboard these keys come first.
	{ id: 'arrow-target', words: 'choose the target of the arrow', keys: ARROWS, shown: 'Arrow keys', mode: 'drawing', enabled: always, run: (ctx, _t, pressed) => ctx.chooseArrowTarget(dirOf(pressed?.key)) },
	{ id: 'arrow-draw', words: 'draw the arrow', keys: ['Enter'], mode: 'drawing', enabled: always, run: (ctx) => ctx.finishArrow() },
	{ id: 'arrow-cancel', words: 'cancel the arrow', keys: ['Escape'], mode: 'drawing', enabled: always, run: (ctx) => ctx.cancelArrow() }
];

function noteOf(ctx: CanvasContext, t: Target): string | undefined {
	const v = variableOf(t);
	const a = arrowOf(t);
	if (v) return ctx.editor.diagram.variables.find((x) => x.id === v)?.note;
	return a ? ctx.editor.diagram.arrows.find((x) => x.from === a.from && x.to === a.to)?.note : undefined;
}

export function actionById(id: string): CanvasAction {
	const a = CANVAS_ACTIONS.find((x) => x.id === id);
	if (!a) throw new Error(`no canvas action ${id}`);
	return a;
}

/** The first key of an action, for hints in sentences. */
export const keyOf = (id: string): string => firstKey(actionById(id));

export const addHint = (): string => `Press ${keyOf('add-variable')} to add a variable.`;
export const emptyHint = (): string => `The diagram is empty. ${addHint()}`;

/** The canvas's description for screen readers (aria-describedby): its main keys, from this table. */
export function canvasHelp(): string {
	const k = keyOf;
	return (
		`Arrow keys select the nearest variable in that direction; Shift with an arrow key moves it. ${k('add-variable')} adds a variable, ` +
		`${k('rename')} renames, ${k('delete')} deletes. ${k('draw-arrow')} draws an arrow from the selected variable; ` +
		`${keysText(actionById('step-arrows'))} step through its arrows; ${k('reverse')} reverses the selected arrow. ` +
		`${k('exposure')}, ${k('outcome')}, ${k('planned')} and ${k('unmeasured')} toggle exposure, outcome, planned set and unmeasured. ` +
		`${k('note')} writes the note of the selected variable or arrow. ${k('menu')} opens the menu. The text view lists the same diagram as text.`
	);
}

/** What a key press acts on: the one selected variable or arrow. */
export function selectionTarget(editor: Editor): Target {
	const v = singleVariable(editor.selection);
	if (v) return { variable: v };
	const a = singleArrow(editor.selection);
	return a ? { arrow: a } : null;
}

/** The actions each context menu offers, in its order. */
export const MENUS: Readonly<Record<MenuKind, readonly string[]>> = {
	variable: ['rename', 'exposure', 'outcome', 'planned', 'unmeasured', 'draw-arrow', 'note', 'change-id', 'delete'],
	arrow: ['reverse', 'note', 'delete'],
	background: ['add-variable', 'layout', 'fit']
};

/** The items of a context menu; each shows its action's first key. */
export function menuItems(ctx: CanvasContext, kind: MenuKind, target: Target): MenuItem[] {
	return MENUS[kind].map(actionById).map((a) => ({
		label: typeof a.label === 'function' ? a.label(ctx, target) : (a.label ?? a.words),
		shortcut: a.keys.length ? firstKey(a) : undefined,
		checked: a.checked?.(ctx, target),
		disabled: !a.enabled(ctx, target),
		run: () => a.run(ctx, target, null)
	}));
}
