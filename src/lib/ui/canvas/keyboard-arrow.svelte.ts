/**
 * Drawing an arrow with the keyboard: from the selected variable, the arrow keys choose the
 * target (the nearest variable that way, navigation.ts), Enter draws, Escape cancels; a click
 * on a variable also ends it there.
 */
import type { Editor } from '../../editor/editor.svelte';
import { nearestInDirection, type Direction } from '../../editor/navigation';

export interface KeyboardArrowHost {
	editor: Editor;
	/** Marks the chosen target on the canvas (null: none). */
	mark(target: string | null): void;
	announce(text: string): void;
	ensureVisible(id: string): void;
	labelOf(id: string): string;
	focus(): void;
}

export class KeyboardArrow {
	from = $state<string | null>(null);
	target = $state<string | null>(null);

	constructor(private readonly host: KeyboardArrowHost) {}

	begin(from: string): void {
		const { host } = this;
		const vars = host.editor.diagram.variables;
		this.from = from;
		this.target = nearestInDirection(vars, from, 'right') ?? nearestInDirection(vars, from, 'down') ?? vars.find((v) => v.id !== from)?.id ?? null;
		host.mark(this.target);
		host.announce(
			`Drawing an arrow from ${host.labelOf(from)}. Choose the target with the arrow keys and press Enter, or click it; Escape cancels.${this.target ? ` Target: ${host.labelOf(this.target)}.` : ''}`
		);
		host.focus();
	}

	choose(dir: Direction): void {
		if (!this.from) return;
		const next = nearestInDirection(this.host.editor.diagram.variables, this.target ?? this.from, dir);
		if (!next || next === this.from) return;
		this.target = next;
		this.host.mark(next);
		this.host.ensureVisible(next);
		this.host.announce(`Target: ${this.host.labelOf(next)}.`);
	}

	/** Draws the arrow to `to` (by default the chosen target); the editor may refuse it. */
	finish(to: string | null = this.target): void {
		const from = this.from;
		this.cancel();
		if (!from || !to) return;
		const r = this.host.editor.dispatch({ kind: 'add-arrow', from, to });
		if (r.ok) this.host.editor.select({ variables: [], arrows: [{ from, to }] });
	}

	cancel(message?: string): void {
		if (!this.from) return;
		this.from = null;
		this.target = null;
		this.host.mark(null);
		if (message) this.host.editor.say(message, 'info');
	}
}
