/**
 * The window's actions (files, undo, the keys dialog): the second table the keys dialog and
 * docs/editor.md read, beside canvas-actions.ts. App.svelte's window key handler runs it.
 */
import { runKey, type Action } from './action';

export interface AppContext {
	open(): void;
	saveJson(): void;
	saveDot(): void;
	undo(): void;
	redo(): void;
	showKeys(): void;
	/** A path or set from the analysis column is lit. */
	readonly highlighted: boolean;
	clearHighlight(): void;
}

export type AppAction = Action<AppContext, null>;

const always = () => true;

export const APP_ACTIONS: readonly AppAction[] = [
	{ id: 'undo', words: 'undo', keys: ['Ctrl+Z'], mode: 'window', enabled: always, run: (ctx) => ctx.undo() },
	{ id: 'redo', words: 'redo', keys: ['Ctrl+Shift+Z', 'Ctrl+Y'], mode: 'window', enabled: always, run: (ctx) => ctx.redo() },
	{ id: 'open', words: 'open a diagram file (Causeway JSON or DOT)', keys: ['Ctrl+O'], mode: 'window', inTextFields: true, enabled: always, run: (ctx) => ctx.open() },
	{ id: 'save', words: 'save as Causeway JSON', keys: ['Ctrl+S'], mode: 'window', inTextFields: true, enabled: always, run: (ctx) => ctx.saveJson() },
	{ id: 'save-dot', words: 'save as DOT, for Graphviz', keys: ['Ctrl+Shift+S'], mode: 'window', inTextFields: true, enabled: always, run: (ctx) => ctx.saveDot() },
	{ id: 'keys', words: 'this list of keys', keys: ['?'], mode: 'window', enabled: always, run: (ctx) => ctx.showKeys() },
	{
		id: 'clear-highlight',
		words: 'clear the highlighted path or set',
		keys: ['Escape'],
		mode: 'window',
		// Escape also closes an open dialog or menu.
		keepDefault: true,
		enabled: (ctx) => ctx.highlighted,
		run: (ctx) => ctx.clearHighlight()
	}
];

const IN_TEXT_FIELDS = APP_ACTIONS.filter((a) => a.inTextFields);

/** The window's key handler: a text field with the focus keeps every key but those for files. */
export function runWindowKey(e: KeyboardEvent, inTextField: boolean, ctx: AppContext): void {
	runKey(inTextField ? IN_TEXT_FIELDS : APP_ACTIONS, ['window'], e, ctx, null, () => undefined);
}

/** Where a table's keys work, as the keys dialog and docs/editor.md say it. */
export function whereText(a: Action<never, never>): string {
	if (a.mode === 'canvas') return 'canvas';
	if (a.mode === 'drawing') return 'drawing an arrow';
	return a.inTextFields ? 'anywhere' : 'outside text fields';
}
