/**
 * Undo/redo history of diagram states.
 *
 * The history keeps whole diagram snapshots rather than inverse commands: every command
 * returns a new diagram that shares all untouched variables and arrows with the old one
 * (immutable updates), so a snapshot costs one array of references, and undo can never drift
 * from what the command did. Pure functions over plain data; no Svelte, no DOM.
 */
import type { Diagram } from '../graph/diagram';

export interface HistoryEntry {
	readonly diagram: Diagram;
	/** What the step that left this state did, e.g. "Draw arrow Age → Hypertension". */
	readonly label: string;
}

export interface History {
	/** Earlier states, oldest first; each entry's label names the step that followed it. */
	readonly past: readonly HistoryEntry[];
	readonly present: Diagram;
	/** Undone states, nearest first; each entry's label names the step that leads to it. */
	readonly future: readonly HistoryEntry[];
}

/** How many undo steps are kept; the oldest are dropped beyond it. */
export const HISTORY_LIMIT = 500;

export function createHistory(diagram: Diagram): History {
	return { past: [], present: diagram, future: [] };
}

/** Records a step from the present to `next`, clearing the redo list. O(1) amortised. */
export function record(h: History, next: Diagram, label: string, limit = HISTORY_LIMIT): History {
	if (next === h.present) return h;
	const past = [...h.past, { diagram: h.present, label }];
	return { past: past.length > limit ? past.slice(past.length - limit) : past, present: next, future: [] };
}

/**
 * Replaces the present without a new step, so that a burst of small edits of one kind (a
 * variable nudged with the keyboard ten times) is undone at once. Clears the redo list.
 */
export function amend(h: History, next: Diagram, label: string): History {
	if (next === h.present) return h;
	if (h.past.length === 0) return record(h, next, label);
	return { past: h.past, present: next, future: [] };
}

export function canUndo(h: History): boolean {
	return h.past.length > 0;
}

export function canRedo(h: History): boolean {
	return h.future.length > 0;
}

/** Label of the step that undo would revert, or null. */
export function undoLabel(h: History): string | null {
	return h.past.length > 0 ? h.past[h.past.length - 1].label : null;
}

/** Label of the step that redo would repeat, or null. */
export function redoLabel(h: History): string | null {
	return h.future.length > 0 ? h.future[0].label : null;
}

export function undo(h: History): History {
	if (h.past.length === 0) return h;
	const last = h.past[h.past.length - 1];
	return {
		past: h.past.slice(0, -1),
		present: last.diagram,
		future: [{ diagram: h.present, label: last.label }, ...h.future]
	};
}

export function redo(h: History): History {
	if (h.future.length === 0) return h;
	const next = h.future[0];
	return {
		past: [...h.past, { diagram: h.present, label: next.label }],
		present: next.diagram,
		future: h.future.slice(1)
	};
}
