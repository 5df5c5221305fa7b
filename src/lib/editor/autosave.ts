/**
 * Autosave: the diagram is written to the browser's localStorage (in the native file format,
 * so a saved state is exactly what "Save" would write) a short while after each edit, and
 * read back when the app opens. Storage is passed in, so this runs under test without a
 * browser. A stored text that no longer parses is ignored, never half-loaded.
 */
import type { Diagram } from '../graph/diagram';
import { parseDiagramJson, writeDiagramJson } from '../graph/native-json';

/** The part of the Web Storage interface used here. */
export interface StorageLike {
	getItem(key: string): string | null;
	setItem(key: string, value: string): void;
	removeItem(key: string): void;
}

export const AUTOSAVE_KEY = 'causeway.autosave.v1';
/** Set once the app has been opened, so the demo study is shown on the first visit only. */
export const VISITED_KEY = 'causeway.visited';

export type Restored = { kind: 'saved'; diagram: Diagram } | { kind: 'unreadable'; message: string } | { kind: 'none' };

export function saveDiagram(storage: StorageLike, d: Diagram): { ok: true } | { ok: false; message: string } {
	try {
		storage.setItem(AUTOSAVE_KEY, writeDiagramJson(d));
		return { ok: true };
	} catch (e) {
		// Quota exceeded or storage disabled: the edit stands, only the backup failed.
		return { ok: false, message: `Autosave failed: ${e instanceof Error ? e.message : String(e)}` };
	}
}

export function restoreDiagram(storage: StorageLike): Restored {
	let text: string | null;
	try {
		text = storage.getItem(AUTOSAVE_KEY);
	} catch {
		return { kind: 'none' };
	}
	if (text === null) return { kind: 'none' };
	try {
		return { kind: 'saved', diagram: parseDiagramJson(text) };
	} catch (e) {
		return { kind: 'unreadable', message: `The autosaved diagram could not be read (${e instanceof Error ? e.message : String(e)}); starting afresh.` };
	}
}

/** True on the first visit; marks the visit so later calls return false. */
export function firstVisit(storage: StorageLike): boolean {
	try {
		if (storage.getItem(VISITED_KEY) !== null) return false;
		storage.setItem(VISITED_KEY, '1');
		return true;
	} catch {
		return false;
	}
}

/**
 * Debounces saving: `schedule(d)` saves `d` after `delayMs` without a newer call, and
 * `flush()` saves any pending diagram at once (used when the page is hidden or closed).
 */
export function createAutosaver(storage: StorageLike, delayMs = 400, onError?: (message: string) => void) {
	let pending: Diagram | null = null;
	let timer: ReturnType<typeof setTimeout> | null = null;
	const flush = () => {
		if (timer !== null) clearTimeout(timer);
		timer = null;
		if (pending === null) return;
		const result = saveDiagram(storage, pending);
		pending = null;
		if (!result.ok) onError?.(result.message);
	};
	return {
		schedule(d: Diagram) {
			pending = d;
			if (timer !== null) clearTimeout(timer);
			timer = setTimeout(flush, delayMs);
		},
		flush
	};
}
