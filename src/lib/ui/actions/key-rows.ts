/**
 * The list of keys as the keys dialog shows it and docs/editor.md writes it: one row per
 * action that has keys, canvas actions first, then those of arrow drawing, then the window's.
 */
import { keysText, type Action } from './action';
import { APP_ACTIONS, whereText } from './app-actions';
import { CANVAS_ACTIONS } from './canvas-actions';

export interface KeyRow {
	id: string;
	keys: string;
	words: string;
	where: string;
}

export function keyRows(): KeyRow[] {
	const all: readonly Action<never, never>[] = [...CANVAS_ACTIONS.filter((a) => a.mode === 'canvas'), ...CANVAS_ACTIONS.filter((a) => a.mode === 'drawing'), ...APP_ACTIONS];
	return all.filter((a) => a.keys.length > 0).map((a) => ({ id: a.id, keys: keysText(a), words: a.words, where: whereText(a) }));
}
