/**
 * What an action is: the row of a table (canvas-actions.ts, app-actions.ts) that the key
 * handlers, the context menus, the keys dialog and docs/editor.md all read, so that a key
 * cannot do one thing and be described as another (tests/unit/ui/actions-table.test.ts).
 */
import { chordLabel, matches, parseChord, type Chord, type KeyPress } from './keys';

/**
 * Where the keys work: the focused canvas; the canvas while an arrow is being drawn with the
 * keyboard (these keys come first there); the whole window (`inTextFields` says whether a
 * text field with the focus still lets them through).
 */
export type Mode = 'canvas' | 'drawing' | 'window';

export interface Action<C, T> {
	id: string;
	/** What it does, as the keys dialog and docs/editor.md say it. */
	words: string;
	/** Its chords (keys.ts), in the order shown; empty for a menu-only action. */
	keys: readonly string[];
	/** How the keys are shown when not one by one ("Arrow keys", "[ and ]"). */
	shown?: string;
	mode: Mode;
	inTextFields?: boolean;
	/** False for a key that must keep its usual meaning for the page as well (Escape closes dialogs). */
	keepDefault?: boolean;
	enabled(ctx: C, target: T): boolean;
	/** What a key press says when the action cannot run (none: the key does nothing). */
	needs?: () => string;
	run(ctx: C, target: T, pressed: Chord | null): void;
}

/** The keys of an action as the keys dialog, the docs table and the menus show them. */
export function keysText(a: Action<never, never>): string {
	return a.shown ?? a.keys.map(chordLabel).join(' or ');
}

/** The first key of an action, for a hint in a sentence ("Press V to add a variable"). */
export function firstKey(a: Action<never, never>): string {
	return a.keys.length ? chordLabel(a.keys[0]) : '';
}

const parsed = new Map<string, Chord>();
const chordOf = (text: string) => {
	let c = parsed.get(text);
	if (!c) parsed.set(text, (c = parseChord(text)));
	return c;
};

/** The first action, in the order of `modes`, with a chord matching the key press. */
export function actionForKey<A extends Action<never, never>>(table: readonly A[], modes: readonly Mode[], e: KeyPress): { action: A; pressed: Chord } | null {
	for (const mode of modes) {
		for (const action of table) {
			if (action.mode !== mode) continue;
			for (const k of action.keys) {
				const c = chordOf(k);
				if (matches(c, e)) return { action, pressed: c };
			}
		}
	}
	return null;
}

/**
 * Runs the action a key press names, if any: when enabled; otherwise says what it needs.
 * Returns whether the key was taken (its default then prevented).
 */
export function runKey<C, T>(table: readonly Action<C, T>[], modes: readonly Mode[], e: KeyboardEvent, ctx: C, target: T, say: (text: string) => void): boolean {
	const hit = actionForKey(table as readonly Action<never, never>[], modes, e) as { action: Action<C, T>; pressed: Chord } | null;
	if (!hit) return false;
	const { action, pressed } = hit;
	if (action.enabled(ctx, target)) {
		if (!action.keepDefault) e.preventDefault();
		action.run(ctx, target, pressed);
		return true;
	}
	if (!action.needs) return false;
	e.preventDefault();
	say(action.needs());
	return true;
}
