/**
 * Autosave: the diagram is written to the browser's localStorage (in the native file format,
 * so a saved state is exactly what "Save" would write) a short while after each edit, and
 * read back when the app opens. Storage is passed in, so this runs under test without a
 * browser. A stored text that no longer parses is never half-loaded and never overwritten: it
 * is moved aside to its own key (with the reason and the time), where the app offers it for
 * download until the user discards it. An empty diagram never replaces a stored one unless
 * the user made it so (New, deleting everything).
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

export type Restored = { kind: 'saved'; diagram: Diagram } | { kind: 'unreadable'; message: string; keptAside: boolean } | { kind: 'none' };

/** Stored texts that could not be read, kept for the user: newest last. */
export const ASIDE_KEY = 'causeway.autosave.unreadable.v1';
/** How many unreadable copies are kept aside; older ones are dropped past it. */
export const MAX_ASIDE = 5;

export interface AsideCopy {
	text: string;
	/** Why it could not be read (the reader's message). */
	reason: string;
	/** When it was moved aside (ISO 8601). */
	at: string;
}

/** The copies kept aside (empty when none or unreadable). */
export function asideCopies(storage: StorageLike): AsideCopy[] {
	try {
		const raw = storage.getItem(ASIDE_KEY);
		const list: unknown = raw === null ? [] : JSON.parse(raw);
		return Array.isArray(list) ? list.filter((c): c is AsideCopy => typeof c?.text === 'string' && typeof c?.reason === 'string' && typeof c?.at === 'string') : [];
	} catch {
		return [];
	}
}

/** Forgets the copies kept aside (after the user downloaded or discarded them). */
export function discardAsideCopies(storage: StorageLike): void {
	try {
		storage.removeItem(ASIDE_KEY);
	} catch {
		// storage disabled: nothing was kept
	}
}

/** True for a diagram with nothing drawn in it. */
export function isBlankDiagram(d: Diagram): boolean {
	return d.variables.length === 0 && d.arrows.length === 0;
}

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
		const reason = e instanceof Error ? e.message : String(e);
		const keptAside = keepAside(storage, text, reason);
		return {
			kind: 'unreadable',
			message: keptAside
				? `The diagram saved in this browser could not be read (${reason}). It was kept aside: download it from the notice to repair it.`
				: `The diagram saved in this browser could not be read (${reason}), and this browser's storage could not keep it aside; it is left where it was.`,
			keptAside
		};
	}
}

/** Moves an unreadable stored text to ASIDE_KEY; false (and the text left in place) when that fails. */
function keepAside(storage: StorageLike, text: string, reason: string): boolean {
	try {
		const copies = [...asideCopies(storage), { text, reason, at: new Date().toISOString() }].slice(-MAX_ASIDE);
		storage.setItem(ASIDE_KEY, JSON.stringify(copies));
		storage.removeItem(AUTOSAVE_KEY);
		return true;
	} catch {
		return false;
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

/** Who wrote the autosaved diagram last, and when: `tab id:serial:ms since the epoch`, stored beside the diagram. */
export const AUTOSAVE_STAMP_KEY = 'causeway.autosave.stamp.v1';

/** Another tab (or window) saved to the same slot since this tab last read or wrote it. */
export interface AutosaveConflict {
	/** The other tab's diagram as it is stored now; null when it cannot be read. */
	theirs: Diagram | null;
}

export interface AutosaverOptions {
	/** This tab's id (e.g. crypto.randomUUID()); unique per open tab. */
	tabId?: string;
	/** Called once per change by another tab; saving pauses until keepMine or takeTheirs. */
	onConflict?: (conflict: AutosaveConflict) => void;
	/** Hands every stored text to a second, crash-safe copy (editor/durable-copy.ts). */
	mirror?: (copy: { text: string; stamp: string; savedAt: number }) => void;
	/** The clock (tests). */
	now?: () => number;
}

/**
 * Saves the diagram after edits: the first edit after a quiet spell at once (so that a tab
 * that crashes a moment later has it), later edits of a burst together after `delayMs`, and
 * anything pending on `flush()` (page hidden or closed).
 *
 * Two tabs share one storage slot. Each save is stamped with this tab's id; before writing,
 * the saver checks that the stamp is still the one it last read or wrote. If another tab has
 * written since, it does not overwrite: it reports a conflict (also at once, through
 * `onStorage`, the handler for the window's `storage` event) and waits for the user to choose
 * `keepMine(d)` (this tab's diagram replaces the stored one) or `takeTheirs()` (this tab
 * takes the stored one). Saving a diagram identical to the stored text writes nothing, so
 * two tabs that agree do not wake each other up.
 */
export function createAutosaver(storage: StorageLike, delayMs = 400, onError?: (message: string) => void, options: AutosaverOptions = {}) {
	const tabId = options.tabId ?? Math.random().toString(36).slice(2);
	let serial = 0;
	let known = readStamp(storage);
	let conflictStamp: string | null = null;
	let pending: Diagram | null = null;
	let pendingDeliberate = false;
	let timer: ReturnType<typeof setTimeout> | null = null;

	const changedElsewhere = (): boolean => {
		const now = readStamp(storage);
		return now !== known && !(now ?? '').startsWith(`${tabId}:`);
	};
	const report = () => {
		const stamp = readStamp(storage);
		if (stamp === conflictStamp) return;
		conflictStamp = stamp;
		const restored = restoreDiagram(storage);
		options.onConflict?.({ theirs: restored.kind === 'saved' ? restored.diagram : null });
	};
	const write = (d: Diagram, deliberate: boolean) => {
		let text: string;
		try {
			text = writeDiagramJson(d);
			const stored = storage.getItem(AUTOSAVE_KEY);
			if (text === stored) {
				known = readStamp(storage);
				return;
			}
			// Never replace a stored diagram by an empty one the user did not make so.
			if (!deliberate && isBlankDiagram(d) && stored !== null) return;
			const savedAt = (options.now ?? Date.now)();
			const stamp = `${tabId}:${++serial}:${savedAt}`;
			storage.setItem(AUTOSAVE_KEY, text);
			storage.setItem(AUTOSAVE_STAMP_KEY, stamp);
			known = stamp;
			options.mirror?.({ text, stamp, savedAt });
		} catch (e) {
			// Quota exceeded or storage disabled: the edit stands, only the backup failed.
			onError?.(`Autosave failed: ${e instanceof Error ? e.message : String(e)}`);
		}
	};
	const save = () => {
		if (pending === null) return;
		if (conflictStamp !== null || changedElsewhere()) {
			report();
			return; // kept pending until the user chooses
		}
		const d = pending;
		pending = null;
		write(d, pendingDeliberate);
	};
	const flush = () => {
		if (timer !== null) clearTimeout(timer);
		timer = null;
		save();
	};
	return {
		/** `deliberate`: the diagram comes from the user's own edits (the app passes "something to undo"). */
		schedule(d: Diagram, deliberate = true) {
			pending = d;
			pendingDeliberate = deliberate;
			if (timer === null) {
				save(); // leading edge: the first edit of a burst is stored at once
				timer = setTimeout(flush, delayMs);
			}
		},
		flush,
		/** Handler for the window's `storage` event (its `key`; null when storage was cleared). */
		onStorage(key: string | null) {
			if (key !== null && key !== AUTOSAVE_KEY && key !== AUTOSAVE_STAMP_KEY) return;
			if (changedElsewhere()) report();
		},
		/** True while another tab's save waits for the user's choice. */
		get inConflict(): boolean {
			return conflictStamp !== null;
		},
		/** True while an edit is not yet stored (during a burst, or held by a conflict). */
		get unsaved(): boolean {
			return pending !== null;
		},
		/** The user keeps this tab's diagram: it replaces the other tab's in storage. */
		keepMine(d: Diagram) {
			known = readStamp(storage);
			conflictStamp = null;
			pending = null;
			write(d, true);
		},
		/** The user takes the other tab's diagram: returned, and this tab follows it from now on. */
		takeTheirs(): Diagram | null {
			known = readStamp(storage);
			conflictStamp = null;
			pending = null;
			const restored = restoreDiagram(storage);
			return restored.kind === 'saved' ? restored.diagram : null;
		}
	};
}

export type Autosaver = ReturnType<typeof createAutosaver>;

/** The stamp stored beside the autosaved diagram (null when none or storage is disabled). */
export function readStamp(storage: StorageLike): string | null {
	try {
		return storage.getItem(AUTOSAVE_STAMP_KEY);
	} catch {
		return null;
	}
}
