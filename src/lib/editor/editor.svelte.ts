/**
 * The editor's reactive state for the app: the undo history of the diagram, the selection
 * and the last message to the user. A thin runes wrapper around the pure command and
 * history modules, so every rule about edits lives (and is tested) outside Svelte.
 */
import type { Diagram } from '../graph/diagram';
import { applyCommand, type Command, type CommandResult } from './commands';
import { amend, canRedo, canUndo, createHistory, record, redo, redoLabel, undo, undoLabel, type History } from './history';
import { EMPTY_SELECTION, pruneSelection, type Selection } from './selection';

export type MessageTone = 'info' | 'refused' | 'error';

export interface EditorMessage {
	text: string;
	tone: MessageTone;
	/** Ids of a refused cycle, so the canvas can light it up. */
	cycle?: string[];
	/** Increases with every message, so repeating the same text is still noticed. */
	serial: number;
}

export class Editor {
	history = $state.raw<History>(createHistory({ title: 'Untitled diagram', variables: [], arrows: [], exposures: [], outcomes: [], adjusted: [] }));
	selection = $state.raw<Selection>(EMPTY_SELECTION);
	message = $state.raw<EditorMessage | null>(null);
	#serial = 0;
	#mergeKey: string | undefined;
	#mergeAt = 0;

	readonly diagram: Diagram = $derived(this.history.present);
	readonly canUndo: boolean = $derived(canUndo(this.history));
	readonly canRedo: boolean = $derived(canRedo(this.history));
	readonly undoLabel: string | null = $derived(undoLabel(this.history));
	readonly redoLabel: string | null = $derived(redoLabel(this.history));

	constructor(initial?: Diagram) {
		if (initial) this.history = createHistory(initial);
	}

	/**
	 * Applies a command as one undoable step; on refusal the diagram stays as it was.
	 * Commands given the same `mergeKey` within a second of each other form a single step.
	 */
	dispatch(cmd: Command, mergeKey?: string): CommandResult {
		const result = applyCommand(this.history.present, cmd);
		if (result.ok) {
			const now = Date.now();
			const merge = mergeKey !== undefined && mergeKey === this.#mergeKey && now - this.#mergeAt < 1000 && this.history.past.length > 0;
			this.history = merge ? amend(this.history, result.diagram, result.summary) : record(this.history, result.diagram, result.summary);
			this.#mergeKey = mergeKey;
			this.#mergeAt = now;
			this.#afterChange();
			this.say(result.summary, 'info');
		} else {
			this.say(result.message, 'refused', result.cycle);
		}
		return result;
	}

	/** Starts a fresh history (opening the app); not undoable. */
	reset(d: Diagram): void {
		this.history = createHistory(d);
		this.selection = EMPTY_SELECTION;
	}

	undo(): void {
		this.#mergeKey = undefined;
		if (!canUndo(this.history)) {
			this.say('Nothing to undo.', 'info');
			return;
		}
		const label = undoLabel(this.history);
		this.history = undo(this.history);
		this.#afterChange();
		this.say(`Undone: ${label}`, 'info');
	}

	redo(): void {
		if (!canRedo(this.history)) {
			this.say('Nothing to redo.', 'info');
			return;
		}
		const label = redoLabel(this.history);
		this.history = redo(this.history);
		this.#afterChange();
		this.say(`Redone: ${label}`, 'info');
	}

	select(s: Selection): void {
		this.selection = s;
	}

	say(text: string, tone: MessageTone, cycle?: string[]): void {
		this.message = { text, tone, cycle, serial: ++this.#serial };
	}

	#afterChange(): void {
		this.selection = pruneSelection(this.selection, this.history.present);
	}
}
