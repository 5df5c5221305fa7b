/**
 * Naming in place: the text box over a variable being renamed, or at the spot of a variable
 * not created yet. Enter adds or renames (a refused name stays open to be shortened), Escape
 * cancels, leaving the box keeps what was typed.
 */
import { tick } from 'svelte';
import type { Editor } from '../../editor/editor.svelte';
import { slugify, uniqueId } from '../../editor/ids';
import type { Point } from './viewport';

export interface RenameState {
	/** null for a variable not created yet. */
	id: string | null;
	model: Point;
	value: string;
}

export class Rename {
	state = $state<RenameState | null>(null);
	input = $state<HTMLInputElement | null>(null);

	constructor(
		private readonly host: {
			readonly editor: Editor;
			/** Gives the keyboard back to the canvas. */
			focus(): void;
		}
	) {}

	async startNew(model: Point): Promise<void> {
		this.state = { id: null, model, value: '' };
		await tick();
		this.input?.focus();
	}

	async start(id: string, model: Point, label: string): Promise<void> {
		this.state = { id, model, value: label };
		await tick();
		this.input?.focus();
		this.input?.select();
	}

	/** Adds or renames; a refusal (a name past the limit) typed with Enter keeps the text open to shorten. */
	commit(byEnter = false): void {
		const r = this.state;
		if (!r) return;
		const editor = this.host.editor;
		this.state = null;
		const label = r.value.trim();
		const keepOpen = (res: { ok: boolean }) => {
			if (res.ok || !byEnter) return false;
			this.state = r;
			void tick().then(() => this.input?.focus());
			return true;
		};
		if (r.id === null) {
			if (label.length === 0) {
				editor.say('No variable added: it needs a name.', 'info');
			} else {
				const id = uniqueId(slugify(label), new Set(editor.diagram.variables.map((v) => v.id)));
				const res = editor.dispatch({ kind: 'add-variable', variable: { id, label, measured: true, x: Math.round(r.model.x), y: Math.round(r.model.y) } });
				if (keepOpen(res)) return;
				if (res.ok) editor.select({ variables: [id], arrows: [] });
			}
		} else {
			const v = editor.diagram.variables.find((x) => x.id === r.id);
			if (v && label !== v.label) {
				// The id stays (ids are stable), so the selection does too.
				const res = editor.dispatch({ kind: 'rename-variable', id: r.id, label });
				if (keepOpen(res)) return;
				if (res.ok) editor.select({ variables: [r.id], arrows: [] });
			}
		}
		this.host.focus();
	}

	onKey(e: KeyboardEvent): void {
		e.stopPropagation();
		if (e.key === 'Enter') {
			e.preventDefault();
			this.commit(true);
		} else if (e.key === 'Escape') {
			e.preventDefault();
			this.state = null;
			this.host.focus();
		}
	}
}
